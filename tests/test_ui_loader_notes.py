"""The background loader reports damaged workbooks back to the window, and the window shows
the reader's notes."""

from __future__ import annotations

from pathlib import Path

from pytestqt.qtbot import QtBot

from hostile_files import XLS_SEED
from tauscope.ui.loader import WorkbookLoader


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


def test_the_window_shows_the_reader_notes_when_a_workbook_is_read(
    qtbot: QtBot, qt_settings_dir: Path, tmp_path: Path
) -> None:
    from ui_parts import build_parts, files_controller, open_and_wait

    path = tmp_path / "titled.csv"
    lines = ["Invented office", "", "Year,GDP"] + [f"{1960 + i},{i * 1.5 + (i % 3)}"
                                                   for i in range(30)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    parts = build_parts(qtbot)
    open_and_wait(qtbot, files_controller(parts), path)
    shown = parts.status.text()
    assert shown.startswith("Opened titled.csv: 1 series — ")
    assert "1 title or note row above the header was skipped" in shown
    assert "1 title or note row above the header was skipped" in parts.status.toolTip()
