"""A batch's JSON entries encoded ahead, chunk by chunk, by copies of the process: the very
bytes of encoding them at writing time, and nothing lost when a copy fails or is late."""

from __future__ import annotations

import dataclasses
import json
import os
import sys
import time
from pathlib import Path

import pytest

from tauscope.commands import batch_pieces
from tauscope.commands.batch_pieces import EncodedPieces
from tauscope.report import RunRecord, export
from tauscope.report.json_export import COMPACT, EncodedSeries, encode_series, run_to_json
from test_report_support import make_run

pytestmark = pytest.mark.skipif(not sys.platform.startswith("linux"),
                                reason="the copies are forked (Linux only)")


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


def _in_copies_only(replacement: object, monkeypatch: pytest.MonkeyPatch) -> None:
    """``batch_pieces.encode_series`` replaced in the copies made from now on; this process
    keeps the real one."""
    here, real = os.getpid(), encode_series

    def encode(findings: object) -> bytes:
        if os.getpid() == here:
            return real(findings)  # type: ignore[arg-type]
        return replacement(findings)  # type: ignore[operator, no-any-return]

    monkeypatch.setattr(batch_pieces, "encode_series", encode)


def test_a_chunk_whose_copy_fails_is_encoded_here(monkeypatch: pytest.MonkeyPatch) -> None:
    found = _renamed(make_run()).findings

    def broken(findings: object) -> bytes:
        raise RuntimeError("cannot encode")

    pieces = EncodedPieces()
    try:
        pieces.add(found[:1])  # a copy that works
        _in_copies_only(broken, monkeypatch)
        pieces.add(found[1:])  # one that fails
        encoded = pieces.result(found)
        assert encoded is not None and b",".join(encoded.parts) == encode_series(found)
    finally:
        pieces.close()


def test_a_chunk_no_copy_can_be_made_for_is_encoded_here(monkeypatch: pytest.MonkeyPatch) -> None:
    found = make_run().findings

    def no_fork() -> int:
        raise OSError("no more processes")

    monkeypatch.setattr(batch_pieces.os, "fork", no_fork)
    pieces = EncodedPieces()
    pieces.add(found)
    encoded = pieces.result(found)
    assert encoded is not None and encoded.parts == (encode_series(found),)
    pieces.close()


def test_a_late_copy_is_ended_and_its_chunk_encoded_here(monkeypatch: pytest.MonkeyPatch) -> None:
    found = make_run().findings

    def slow(findings: object) -> bytes:
        time.sleep(60)
        return b""

    _in_copies_only(slow, monkeypatch)
    pieces = EncodedPieces()
    pieces.add(found)
    (piece,) = pieces._pieces
    assert piece.pid is not None
    pid = piece.pid
    started = time.monotonic()
    encoded = pieces.result(found, wait_s=0.2)
    assert time.monotonic() - started < 30
    assert encoded is not None and encoded.parts == (encode_series(found),)
    with pytest.raises(ChildProcessError):  # ended and reaped
        os.waitpid(pid, os.WNOHANG)
    pieces.close()


def _ended(pid: int) -> bool:
    """True once process ``pid`` has ended (a zombie, not yet reaped)."""
    with open(f"/proc/{pid}/stat", encoding="ascii") as stat:
        return stat.read().rsplit(")", 1)[1].split()[0] == "Z"


def test_ended_copies_are_collected_as_more_chunks_come() -> None:
    """A long run holds a file and a process only for the copies still encoding: each new
    chunk first collects the copies that have ended (their part read, their file closed)."""
    found = make_run().findings
    pieces = EncodedPieces()
    try:
        pieces.add(found[:1])
        (first,) = pieces._pieces
        assert first.pid is not None and first.file is not None
        deadline = time.monotonic() + 30
        while not _ended(first.pid) and time.monotonic() < deadline:
            time.sleep(0.01)
        pieces.add(found[1:])
        assert first.pid is None and first.file is None and first.part == encode_series(found[:1])
        encoded = pieces.result(found)
        assert encoded is not None and b",".join(encoded.parts) == encode_series(found)
    finally:
        pieces.close()
