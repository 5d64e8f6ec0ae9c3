"""The export controller on its own (no main window): the findings on screen as a run
record, written through the report writers, problems as one message, and Copy."""

from __future__ import annotations

import json

import pytest

pytest.importorskip("pytestqt")

from tauscope.data import read_workbook
from tauscope.engine import Settings, analyse_series
from tauscope.report.study import json_clean
from ui_parts import build_parts


@pytest.fixture
def exporting(qtbot, qt_settings_dir, small_workbook):  # type: ignore[no-untyped-def]
    """The controller over two findings the engine computed (no run needed)."""
    from tauscope.ui.controllers.export import ExportController

    settings = Settings(alpha=0.10)
    parts = build_parts(qtbot, settings)
    workbook = read_workbook(small_workbook)
    parts.series_panel.model.add_workbook(workbook)
    for series in workbook.series()[:2]:
        result = analyse_series(series.testable_values(), settings, series.name)
        parts.findings_panel.model.set_result(series.key, result)
    export = ExportController(parts.series_panel, parts.findings_panel, parts.session,
                              parts.prompts, parts.status, parts.host)
    return parts, export, workbook


def test_the_record_holds_the_findings_and_settings_on_screen(exporting):  # type: ignore[no-untyped-def]
    parts, export, workbook = exporting
    run = export.findings_record()
    results = parts.findings_panel.model.results()
    assert [f.result for f in run.findings] == list(results.values())
    assert run.settings == Settings(alpha=0.10)
    key = workbook.series()[1].key
    assert [f.result for f in export.findings_record([key]).findings] == [results[key]]


def test_export_writes_json_and_asks_where_with_the_study_name(exporting, tmp_path):  # type: ignore[no-untyped-def]
    parts, export, workbook = exporting
    asked: list[str] = []

    def where(title: str, start: str, _filters: str) -> str:
        asked.append(start)
        return str(tmp_path / "out.json")

    parts.prompts.ask_save_path = where
    parts.session.set_study_path(tmp_path / "mine.tauscope")
    assert export.export_findings()
    assert asked == [str(tmp_path / "mine.xlsx")]
    data = json.loads((tmp_path / "out.json").read_text(encoding="utf-8"))
    results = parts.findings_panel.model.results()
    assert data["series"] == [json_clean(r.to_dict()) for r in results.values()]
    assert data["source"]["sha256"] == workbook.sha256
    assert parts.status.text() == "Exported 2 findings to out.json."
    parts.prompts.ask_save_path = lambda *_args: ""
    assert not export.export_findings()  # the dialog cancelled: nothing happens


def test_problems_are_one_message(exporting, tmp_path):  # type: ignore[no-untyped-def]
    parts, export, _workbook = exporting
    target = tmp_path / "no such folder" / "f.csv"
    assert not export.export_findings(target)
    assert "does not exist" in parts.prompts.message_box.text()
    assert not target.exists()
    parts.findings_panel.model.clear_results()
    assert not export.export_findings(tmp_path / "f.csv")
    assert "no findings" in parts.prompts.message_box.text()
    assert not (tmp_path / "f.csv").exists()


def test_copy_puts_the_selected_findings_on_the_clipboard(exporting):  # type: ignore[no-untyped-def]
    from PySide6.QtGui import QGuiApplication

    from tauscope.report.clipboard import findings_tsv
    from tauscope.ui.appearance import release_offscreen_clipboard

    parts, export, _workbook = exporting
    export.copy()
    assert parts.status.text() == "Select rows in Findings to copy them."
    parts.findings_panel.record_for = export.findings_record
    parts.findings_panel.view.selectAll()
    export.copy()
    assert parts.status.text() == "Copied 2 findings as a table."
    assert QGuiApplication.clipboard().mimeData().text() == findings_tsv(export.findings_record())
    release_offscreen_clipboard()  # rich clipboard data crashes Qt's offscreen shutdown


def test_findings_made_with_earlier_settings_are_left_out_of_export_and_copy(
        exporting, tmp_path):  # type: ignore[no-untyped-def]
    """After a settings change the findings on screen are stale: neither a file nor the
    clipboard passes them off as current, and the status line says what was left out."""
    from PySide6.QtGui import QGuiApplication

    from tauscope.ui.appearance import release_offscreen_clipboard

    parts, export, _workbook = exporting
    parts.session.set_settings(Settings(alpha=0.05))
    assert export.export_findings(tmp_path / "stale.json")
    data = json.loads((tmp_path / "stale.json").read_text(encoding="utf-8"))
    assert data["series"] == [] and len(data["left_out"]) == 2
    assert parts.status.text() == ("Exported 0 findings to stale.json. 2 findings made with "
                                   "earlier settings were left out: run again (F5) to include "
                                   "them.")
    parts.findings_panel.record_for = export.findings_record
    parts.findings_panel.view.selectAll()
    export.copy()
    assert parts.status.text().startswith("Copied 0 findings as a table. 2 findings made")
    names = [r.name for r in parts.findings_panel.model.results().values()]
    copied = QGuiApplication.clipboard().mimeData().text()
    assert not any(name in copied for name in names)
    release_offscreen_clipboard()
