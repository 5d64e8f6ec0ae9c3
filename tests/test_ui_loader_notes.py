"""The background loader reports the reader's notes and damaged workbooks back to the window."""

from __future__ import annotations

from pathlib import Path

from pytestqt.qtbot import QtBot

from hostile_files import XLS_SEED
from tauscope.ui.loader import WorkbookLoader


def test_the_loader_reports_the_reader_notes_on_one_line(qtbot: QtBot, tmp_path: Path) -> None:
    path = tmp_path / "titled.csv"
    lines = ["Invented office", "", "Year,GDP"] + [f"{1960 + i},{i * 1.5 + (i % 3)}"
                                                   for i in range(30)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    loader = WorkbookLoader()
    noted: list[tuple[str, str]] = []
    loader.noted.connect(lambda p, line: noted.append((p, line)))
    with qtbot.waitSignal(loader.loaded, timeout=30_000):
        loader.load(str(path))
    assert len(noted) == 1 and noted[0][0] == str(path)
    assert "1 title or note row above the header was skipped" in noted[0][1]
    assert "\n" not in noted[0][1]


def test_a_damaged_xls_reports_back_instead_of_leaving_the_window_waiting(
    qtbot: QtBot, tmp_path: Path
) -> None:
    path = tmp_path / "cut.xls"
    path.write_bytes(XLS_SEED.read_bytes()[:3000])
    loader = WorkbookLoader()
    with qtbot.waitSignal(loader.failed, timeout=30_000) as blocker:
        loader.load(str(path))
    assert blocker.args is not None and blocker.args[1].startswith("cut.xls: ")
    assert blocker.args[2] == ""  # a sentence for the user, no traceback
    assert loader.pending == 0
