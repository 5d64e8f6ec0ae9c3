"""A batch's JSON entries encoded ahead, chunk by chunk, by copies of the process: the very
bytes of encoding them at writing time, and nothing lost when a copy fails or is late."""

from __future__ import annotations

import dataclasses
import json
import os
import time
from pathlib import Path

import pytest

from tauscope.commands import batch_pieces
from tauscope.commands.batch_pieces import EncodedPieces
from tauscope.report import RunRecord, export
from tauscope.report.json_export import COMPACT, EncodedSeries, encode_series, run_to_json
from test_report_support import make_run

pytestmark = pytest.mark.skipif(not hasattr(os, "fork"), reason="the copies are forked (Linux)")


def _plain_bytes(run: RunRecord) -> bytes:
    """The file as one ``json.dumps`` of the whole record gives it (the reference)."""
    return (json.dumps(run_to_json(run), ensure_ascii=False, separators=COMPACT) + "\n").encode()


def _renamed(run: RunRecord) -> RunRecord:
    """The run with names that need escaping and characters beyond ASCII."""
    names = ['Φ "quoted" \\ back', "Δ log output\n", "国内総生産"]
    findings = tuple(dataclasses.replace(f, result=dataclasses.replace(f.result, name=names[i % 3]))
                     for i, f in enumerate(run.findings))
    return dataclasses.replace(run, findings=findings)


def test_the_file_is_the_same_bytes_with_or_without_entries_encoded_ahead(tmp_path: Path) -> None:
    run = _renamed(make_run())
    assert len(run.findings) >= 3
    export(tmp_path / "whole.json", run)
    assert (tmp_path / "whole.json").read_bytes() == _plain_bytes(run)
    found = run.findings
    encoded = EncodedSeries(found, (encode_series(found[:1]), b"", encode_series(found[1:])))
    export(tmp_path / "ahead.json", run, encoded=encoded)
    assert (tmp_path / "ahead.json").read_bytes() == _plain_bytes(run)


def test_entries_that_are_not_the_runs_are_not_used(tmp_path: Path) -> None:
    run = make_run()
    other = _renamed(run)
    export(tmp_path / "f.json", run, encoded=EncodedSeries(other.findings,
                                                           (encode_series(other.findings),)))
    assert (tmp_path / "f.json").read_bytes() == _plain_bytes(run)
    fewer = EncodedSeries(run.findings[:-1], (encode_series(run.findings[:-1]),))
    assert not fewer.fits(run.findings)
    export(tmp_path / "g.json", run, encoded=fewer)
    assert (tmp_path / "g.json").read_bytes() == _plain_bytes(run)


def test_no_findings_give_an_empty_list(tmp_path: Path) -> None:
    run = dataclasses.replace(make_run(), findings=())
    export(tmp_path / "f.json", run, encoded=EncodedSeries((), ()))
    assert (tmp_path / "f.json").read_bytes() == _plain_bytes(run)
    assert json.loads((tmp_path / "f.json").read_text(encoding="utf-8"))["series"] == []


def test_copies_encode_each_chunk_and_the_parts_join_to_the_whole(tmp_path: Path) -> None:
    run = _renamed(make_run())
    found = run.findings
    pieces = EncodedPieces()
    try:
        pieces.add(found[:2])
        pieces.add([])  # nothing to encode: no copy
        pieces.add(found[2:])
        encoded = pieces.result(found)
        assert encoded is not None
        assert b",".join(p for p in encoded.parts if p) == encode_series(found)
        assert pieces.result(found[:2]) is None  # not the findings it holds
        export(tmp_path / "f.json", run, encoded=encoded)
        assert (tmp_path / "f.json").read_bytes() == _plain_bytes(run)
    finally:
        pieces.close()


def test_a_copy_that_fails_gives_no_entries(monkeypatch: pytest.MonkeyPatch) -> None:
    found = make_run().findings

    def broken(findings: object) -> bytes:
        raise RuntimeError("cannot encode")

    monkeypatch.setattr(batch_pieces, "encode_series", broken)  # the copy is made with it
    pieces = EncodedPieces()
    try:
        pieces.add(found)
        assert pieces.result(found) is None
    finally:
        pieces.close()


def test_a_late_copy_is_ended_and_gives_no_entries(monkeypatch: pytest.MonkeyPatch) -> None:
    found = make_run().findings

    def slow(findings: object) -> bytes:
        time.sleep(60)
        return b""

    monkeypatch.setattr(batch_pieces, "encode_series", slow)
    pieces = EncodedPieces()
    pieces.add(found)
    (piece,) = pieces._pieces
    assert pieces.result(found, wait_s=0.2) is None
    pieces.close()
    with pytest.raises(ChildProcessError):  # ended and reaped
        os.waitpid(piece.pid, os.WNOHANG)
