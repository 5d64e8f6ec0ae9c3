"""Interrupted writes: their temporary files are removed by the next write into the folder."""

from __future__ import annotations

import os
import subprocess
import sys
import time
from pathlib import Path

from tauscope.report.atomic import STALE_AFTER, remove_stale_temporaries, write_bytes_atomic


def _dead_pid() -> int:
    child = subprocess.Popen([sys.executable, "-c", "pass"])
    child.wait()
    return child.pid


def test_a_write_removes_temporaries_of_writes_that_were_cut_off(tmp_path: Path) -> None:
    dead = tmp_path / f".findings.xlsx.tauscope-{_dead_pid()}-abc123.part"
    dead.write_bytes(b"half a workbook")
    old = tmp_path / f".study.tauscope.tauscope-{os.getpid()}-zz9.part"
    old.write_bytes(b"{")
    a_day_ago = time.time() - STALE_AFTER - 60
    os.utime(old, (a_day_ago, a_day_ago))
    theirs = tmp_path / ".findings.xlsx.part"  # not named like ours: never touched
    theirs.write_bytes(b"x")
    write_bytes_atomic(tmp_path / "out.json", b"{}")
    assert not dead.exists() and not old.exists()
    assert theirs.exists() and (tmp_path / "out.json").read_bytes() == b"{}"
    assert sorted(p.name for p in tmp_path.iterdir()) == [".findings.xlsx.part", "out.json"]


def test_a_write_still_running_keeps_its_temporary(tmp_path: Path) -> None:
    running = tmp_path / f".report.csv.tauscope-{os.getpid()}-live1.part"
    running.write_bytes(b"a,b")
    assert remove_stale_temporaries(tmp_path) == []
    assert running.exists()


def test_export_never_writes_over_an_input_of_the_run(tmp_path: Path) -> None:
    import pytest

    from tauscope.engine import Settings
    from tauscope.report import ExportError, RunRecord, SourceFile, export

    workbook = tmp_path / "input.json"
    workbook.write_text('{"tauscope": "x"}', encoding="utf-8")
    run = RunRecord(Settings(), (SourceFile(str(workbook), "0" * 64),), ())
    with pytest.raises(ExportError, match="never writes over"):
        export(workbook, run)
    assert workbook.read_text(encoding="utf-8") == '{"tauscope": "x"}'
