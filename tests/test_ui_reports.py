"""The window's way out: File → Export findings through the report writers (the same ones
``tauscope batch --out`` uses), charts saved as PNG and SVG, and the out-of-date mark
when the settings change after a run."""

from __future__ import annotations

import json
import xml.etree.ElementTree as ElementTree
import zipfile

import pytest

pytest.importorskip("pytestqt")

from tauscope.engine import Settings
from tauscope.report.study import json_clean


@pytest.fixture
def analysed(main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    open_in_window(main_window, small_workbook)
    series = main_window.series_panel.model.all_series()[:3]
    run_in_window(main_window, series)
    return main_window


def test_export_writes_every_format_through_the_report_writers(analysed, tmp_path):  # type: ignore[no-untyped-def]
    window = analysed
    results = window.findings_panel.model.results()
    answers = iter([str(tmp_path / "findings.json"), str(tmp_path / "findings")])
    window.ask_save_path = lambda *_args: next(answers)
    assert window.export_findings()  # through the save dialog (answer injected)
    data = json.loads((tmp_path / "findings.json").read_text(encoding="utf-8"))
    assert [s["name"] for s in data["series"]] == [r.name for r in results.values()]
    assert data["series"] == [json_clean(r.to_dict()) for r in results.values()]
    assert data["source"]["sha256"] == window.series_panel.model.workbooks()[0].sha256
    assert window.export_findings()  # no suffix given: Excel, the first format offered
    assert (tmp_path / "findings.xlsx").is_file()
    for suffix in (".csv", ".tex", ".html"):
        assert window.export_findings(tmp_path / f"findings{suffix}")
        assert (tmp_path / f"findings{suffix}").stat().st_size > 0
    page = (tmp_path / "findings.html").read_text(encoding="utf-8")
    assert page.count("data:image/svg+xml;base64,") == len(results)  # one chart per series
    with zipfile.ZipFile(tmp_path / "findings.xlsx") as book:
        drawing = ElementTree.fromstring(book.read("xl/drawings/drawing1.xml"))
    charts = drawing.findall("{http://schemas.openxmlformats.org/drawingml/2006/"
                             "spreadsheetDrawing}oneCellAnchor")
    assert len(charts) == len(results)  # one chart (a group of shapes) per series


def test_export_to_pdf_from_the_window(analysed, tmp_path):  # type: ignore[no-untyped-def]
    assert analysed.export_findings(tmp_path / "findings.pdf")
    data = (tmp_path / "findings.pdf").read_bytes()
    assert data.startswith(b"%PDF-") and data.rstrip().endswith(b"%%EOF")


def test_export_problems_are_one_clear_message(analysed, tmp_path):  # type: ignore[no-untyped-def]
    target = tmp_path / "no such folder" / "findings.csv"
    assert not analysed.export_findings(target)
    assert "does not exist" in analysed.message_box.text()
    assert str(target) in analysed.message_box.text()
    analysed.message_box.close()


def test_nothing_to_export_before_a_run(main_window, tmp_path):  # type: ignore[no-untyped-def]
    assert not main_window.export_findings(tmp_path / "findings.csv")
    assert "no findings" in main_window.message_box.text()
    assert not (tmp_path / "findings.csv").exists()
    main_window.message_box.close()


def test_a_chart_is_saved_as_png_and_svg_from_its_menu(analysed, tmp_path, qtbot):  # type: ignore[no-untyped-def]
    from PySide6.QtGui import QImage

    window = analysed
    key = window.series_panel.model.all_series()[0].key
    assert window.select_series(key)
    chart = window.chart_panel
    chart.tabs.setCurrentIndex(chart.FITTED)
    page = chart.fitted_page
    assert page.has_plot()
    menu = chart.chart_menu(page)
    actions = {a.text(): a for a in menu.actions()}
    answers = iter([str(tmp_path / "chart.png"), str(tmp_path / "chart")])
    window.ask_save_path = lambda *_args: next(answers)
    actions["Save this chart as a picture (PNG)…"].trigger()
    actions["Save this chart as a drawing (SVG)…"].trigger()
    image = QImage(str(tmp_path / "chart.png"))
    assert not image.isNull() and image.width() > 100
    svg = (tmp_path / "chart.svg").read_text(encoding="utf-8")
    root = ElementTree.fromstring(svg)
    assert root.tag.endswith("svg")
    assert len(list(root.iter())) > 10  # a real drawing, not an empty page
    menu.deleteLater()


def test_changing_the_settings_marks_findings_out_of_date(analysed):  # type: ignore[no-untyped-def]
    from tauscope.ui import findings_model as fm
    from tauscope.ui.texts import OUT_OF_DATE

    window = analysed
    model = window.findings_panel.model
    before = window.settings

    def verdicts() -> list[str]:
        return [str(model.index(r, fm.VERDICT).data()) for r in range(model.rowCount())]

    assert not any(OUT_OF_DATE in v for v in verdicts())
    window.apply_settings(Settings(alpha=0.01 if before.alpha != 0.01 else 0.10))
    assert all(v.endswith(OUT_OF_DATE) for v in verdicts())
    assert window.isWindowModified()
    window.apply_settings(before)
    assert not any(OUT_OF_DATE in v for v in verdicts())


def test_findings_made_with_other_settings_are_not_exported_as_current(analysed, tmp_path):  # type: ignore[no-untyped-def]
    window = analysed
    results = window.findings_panel.model.results()
    before = window.settings
    window.apply_settings(Settings(alpha=0.01 if before.alpha != 0.01 else 0.10))
    assert window.export_findings(tmp_path / "findings.json")
    data = json.loads((tmp_path / "findings.json").read_text(encoding="utf-8"))
    assert data["settings"] == window.settings.to_dict()  # the record states the window's settings
    assert data["series"] == []  # every finding was made at the old level: none passed off
    assert [item["name"] for item in data["left_out"]] == [r.name for r in results.values()]
    assert all(item["changed"] == ["alpha"] for item in data["left_out"])
    window.apply_settings(before)
    assert window.export_findings(tmp_path / "again.json")
    data = json.loads((tmp_path / "again.json").read_text(encoding="utf-8"))
    assert len(data["series"]) == len(results) and data["left_out"] == []


def test_export_is_written_while_the_window_keeps_answering(analysed, tmp_path, monkeypatch):  # type: ignore[no-untyped-def]
    """The writing runs off the window's thread: a writer that waits for the window's event
    loop to run a timer finishes (it would wait in vain, and fail, if it ran in that loop);
    a second export asked for meanwhile is refused, and the file is written once."""
    import threading

    from PySide6.QtCore import QTimer

    from tauscope.report import WRITERS

    ticked = threading.Event()
    again: list[bool] = []
    json_writer = WRITERS[".json"]

    def waiting(path, run, charts=None):  # type: ignore[no-untyped-def]
        QTimer.singleShot(0, analysed, lambda: (again.append(analysed.export_findings(
            tmp_path / "other.json")), ticked.set()))
        assert ticked.wait(30), "the window's event loop did not run during the export"
        json_writer(path, run, charts)

    monkeypatch.setitem(WRITERS, ".json", waiting)
    assert analysed.export_findings(tmp_path / "findings.json")
    assert ticked.is_set() and again == [False]
    assert (tmp_path / "findings.json").is_file() and not (tmp_path / "other.json").exists()


def test_a_report_the_bundled_font_cannot_write_goes_through_qt(tmp_path):  # type: ignore[no-untyped-def]
    """A series named in a script DejaVu Sans lacks: the report's own writer refuses it, and
    the ".pdf" writer draws the same layout through Qt instead (whose fonts fall back)."""
    import dataclasses

    from tauscope.report import export
    from tauscope.ui import pdf_report  # noqa: F401  (registers ".pdf")
    from test_report_support import make_run

    run = make_run()
    first = run.findings[0]
    renamed = dataclasses.replace(first, result=dataclasses.replace(first.result, name="国内総生産"))
    export(tmp_path / "qt.pdf", dataclasses.replace(run, findings=(renamed, *run.findings[1:])))
    export(tmp_path / "own.pdf", run)
    qt, own = (tmp_path / "qt.pdf").read_bytes(), (tmp_path / "own.pdf").read_bytes()
    assert qt.startswith(b"%PDF-") and own.startswith(b"%PDF-")
    assert b"/Producer (Tauscope" in own and b"/Producer (Tauscope" not in qt
    assert b"/Producer" in qt
