"""The main window end to end: open a workbook, select all, run, and compare what the
Findings tree shows with analyse_series on the same data (the engine is the reference)."""

from __future__ import annotations

import math
from pathlib import Path

import pytest

pytest.importorskip("pytestqt")

from tauscope.data import DataError, read_workbook
from tauscope.engine import SeriesResult, Settings, analyse_series
from tauscope.engine import formatting as fmt
from tauscope.resources_path import demo_workbook


def expected_result(series, settings: Settings) -> SeriesResult | str:  # type: ignore[no-untyped-def]
    """What the engine says about one series (or the data layer's error sentence)."""
    try:
        values = series.testable_values()
    except DataError as exc:
        return str(exc)
    return analyse_series(values, settings, series.name)


def row_texts(model, parent):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt

    from tauscope.ui.qtcompat import item_value

    rows = []
    for r in range(model.rowCount(parent)):
        rows.append([str(item_value(model.index(r, c, parent), Qt.ItemDataRole.DisplayRole, ""))
                     for c in range(model.columnCount(parent))])
    return rows


def check_findings_match_engine(window, settings: Settings) -> int:  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt

    from tauscope.engine.reading.words import cross_check_word
    from tauscope.ui import findings_model as fm
    from tauscope.ui.texts import decision_text, statistic_text

    model = window.findings_panel.model
    assert model.headerData(fm.VERDICT, Qt.Orientation.Horizontal) == "Verdict · null tested"
    model.populate_all()  # children are built when first shown
    checked = 0
    for series in window.series_panel.model.all_series():
        row = model.row_for_key(series.key)
        assert row is not None, f"no findings row for {series.name}"
        top = row_texts(model, model.index(row, 0).parent())[row]
        assert top[fm.NAME] == series.name
        expected = expected_result(series, settings)
        children = row_texts(model, model.index(row, 0))
        if isinstance(expected, str):
            assert top[fm.VERDICT] == "Not tested"
            assert top[fm.DECISION] == "error"
            assert children[0][fm.NAME] == expected
            checked += 1
            continue
        assert top[fm.VERDICT] == expected.verdict.label
        # the one vocabulary (tauscope.engine.reading.words), not the contract's own value
        assert top[fm.CHECK] == cross_check_word(expected.verdict.agreement)
        if expected.error is not None:
            assert children[0][fm.NAME] == expected.error
            checked += 1
            continue
        assert len(children) >= len(expected.steps)
        for shown, step in zip(children, expected.steps, strict=False):
            assert shown[fm.STATISTIC] == statistic_text(step.statistic_name, step.statistic)
            assert shown[fm.CRITICAL] == fmt.stat(step.critical_value)
            assert shown[fm.PVALUE] == fm.p_text(step.p_value)
            if step.p_value is not None:
                assert shown[fm.PVALUE] == fmt.p_value(step.p_value)
            assert shown[fm.DECISION] == decision_text(step.decision)
            assert shown[fm.VERDICT] == step.hypothesis
        # After the steps: the KPSS checks, then the other unit-root tests (the size-controlled
        # strategy's DF-GLS components by default).
        kpss_rows = [c for c in children[len(expected.steps):] if c[fm.STATISTIC].startswith("KPSS")]
        kpss_tests = [t for t in expected.tests if t.test == "kpss"]
        assert len(kpss_rows) == len(kpss_tests)
        for shown, test in zip(kpss_rows, kpss_tests, strict=True):
            assert shown[fm.STATISTIC] == f"KPSS = {fmt.stat(test.statistic, 3)}"
        checked += 1
    return checked


@pytest.fixture
def workbook_path(small_workbook: Path) -> Path:
    """The demo workbook when it is installed, else a small simulated one."""
    demo = demo_workbook()
    return demo if demo is not None else small_workbook


def test_select_all_and_run_shows_the_engine_results(main_window, open_in_window, run_in_window,
                                                     workbook_path):  # type: ignore[no-untyped-def]
    open_in_window(main_window, workbook_path)
    main_window.select_all_series()
    selected = main_window.series_panel.selected_series()
    total = len(read_workbook(workbook_path).series())
    assert len(selected) == total
    run_in_window(main_window)
    assert main_window.last_run == (False, total)
    assert main_window.findings_panel.model.rowCount() == total
    assert check_findings_match_engine(main_window, main_window.settings) == total


def test_untestable_series_show_their_error_and_the_rest_finish(
        main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    open_in_window(main_window, small_workbook)
    main_window.select_all_series()
    run_in_window(main_window)
    results = main_window.findings_panel.model.results()
    by_name = {r.name: r for r in results.values()}
    assert len(by_name) == 6
    assert by_name["flat"].error is not None and "constant" in by_name["flat"].error
    assert by_name["with a gap"].error is not None and "missing" in by_name["with a gap"].error
    tested = [r for r in by_name.values() if r.error is None]
    assert len(tested) == 4
    assert all(r.verdict.order is not None or r.verdict.label == "Unresolved" for r in tested)
    assert "could not be tested" in main_window.status_label.text()


def test_steps_carry_the_regression_behind_them(main_window, open_in_window, run_in_window,
                                                small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui import findings_model as fm

    open_in_window(main_window, small_workbook)
    first = main_window.series_panel.model.all_series()[0]
    run_in_window(main_window, [first])
    model = main_window.findings_panel.model
    result = model.result_for_key(first.key)
    assert result is not None and result.error is None
    # The first step with a regression behind it: the classic path's first τ (the
    # size-controlled strategy's own steps come first and are not ADF regressions).
    position, step = next((i, s) for i, s in enumerate(result.steps) if s.strategy == "classic")
    assert step.test is not None and step.test.regression is not None
    # children are built when the row is first expanded; until then one placeholder
    assert row_texts(model, model.index(0, 0)) == [["…"]]
    panel = main_window.findings_panel
    panel.view.expand(panel.proxy.mapFromSource(model.index(0, 0)))
    assert model.rowCount(model.index(0, 0)) >= len(result.steps)
    model.populate_all()
    regression = step.test.regression
    step_index = model.index(position, 0, model.index(0, 0))
    rows = row_texts(model, step_index)
    assert rows[0][fm.NOBS] == str(regression.nobs)
    assert str(regression.lags) in rows[0][fm.LAGS]
    assert len(rows) == 1 + len(regression.coefficients)
    for shown, coef in zip(rows[1:], regression.coefficients, strict=True):
        assert shown[fm.NAME] == coef.name
        assert shown[fm.STATISTIC] == f"t = {fmt.stat(coef.t_value)}"
        assert fmt.stat(coef.std_error, 4) in shown[fm.VERDICT]


def test_selecting_a_series_fills_chart_and_reading(main_window, open_in_window, run_in_window,
                                                    small_workbook, qtbot):  # type: ignore[no-untyped-def]
    open_in_window(main_window, small_workbook)
    series = main_window.series_panel.model.all_series()[1]
    run_in_window(main_window, [series])
    assert main_window.select_series(series.key)
    qtbot.waitUntil(lambda: main_window.current_key() == series.key)
    result = main_window.findings_panel.model.result_for_key(series.key)
    text = main_window.reading_panel.text()
    # verdict first, cautions after
    assert text.index(result.verdict.label) < text.index(result.notes[0].split(":")[0])
    if len(result.notes) > 1:
        assert text.index(result.notes[0][:40]) < text.index(result.notes[1][:40])
    chart = main_window.chart_panel
    for number, page in enumerate((chart.data_page, chart.fitted_page, chart.lags_page)):
        chart.tabs.setCurrentIndex(number)  # views are drawn when shown
        assert page.currentWidget() is page.layout_widget
    chart.tabs.setCurrentIndex(chart.RECURSIVE)
    assert chart.recursive_page.currentWidget() is chart.recursive_page.layout_widget
    chart.tabs.setCurrentIndex(chart.NULL)
    qtbot.waitUntil(lambda: chart.null_page.currentWidget() is chart.null_page.layout_widget,
                    timeout=20_000)


def test_copy_puts_a_tab_separated_and_an_html_table_on_the_clipboard(
        main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtGui import QGuiApplication

    open_in_window(main_window, small_workbook)
    main_window.select_all_series()
    run_in_window(main_window)
    view = main_window.findings_panel.view
    view.selectAll()
    main_window.findings_panel.view.setFocus()
    main_window.copy()
    mime = QGuiApplication.clipboard().mimeData()
    assert mime.hasText() and mime.hasHtml()
    # one layout for the clipboard and the reports: tauscope.report.clipboard
    from tauscope.report.clipboard import findings_html, findings_tsv

    run = main_window.findings_record()
    assert mime.text() == findings_tsv(run)
    assert mime.html() == findings_html(run)
    lines = mime.text().strip().split("\n")
    assert lines[0].split("\t")[0] == "Series"
    names = {r.name for r in main_window.findings_panel.model.results().values()}
    first_cells = {line.split("\t")[0] for line in lines[1:]}
    assert names <= first_cells
    assert "<table" in mime.html() and "<th>Verdict</th>" in mime.html()
    labels = {r.verdict.label for r in main_window.findings_panel.model.results().values()}
    for label in labels:
        assert label in mime.text()
    from tauscope.ui.appearance import release_offscreen_clipboard

    release_offscreen_clipboard()  # rich clipboard data crashes Qt's offscreen shutdown
    cleared = QGuiApplication.clipboard().mimeData()
    assert cleared is None or not cleared.hasHtml()


def test_sorting_orders_series_rows_and_keeps_each_decision_path(
        main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt

    from tauscope.ui import findings_model as fm
    from tauscope.ui.texts import statistic_text

    open_in_window(main_window, small_workbook)
    run_in_window(main_window, main_window.series_panel.model.all_series())
    panel = main_window.findings_panel
    panel.model.populate_all()
    panel.view.sortByColumn(fm.NAME, Qt.SortOrder.DescendingOrder)
    names = [row[fm.NAME] for row in row_texts(panel.proxy, panel.proxy.index(0, 0).parent())]
    assert names == sorted(names, key=str.lower, reverse=True)
    by_name = {r.name: r for r in panel.model.results().values()}
    for r, name in enumerate(names):
        result = by_name[name]
        shown = row_texts(panel.proxy, panel.proxy.index(r, 0))[: len(result.steps)]
        assert [row[fm.STATISTIC] for row in shown] == [
            statistic_text(step.statistic_name, step.statistic) for step in result.steps]
    panel.view.sortByColumn(fm.NOBS, Qt.SortOrder.AscendingOrder)
    counts = [float(row[fm.NOBS]) for row in row_texts(panel.proxy, panel.proxy.index(0, 0).parent())]
    assert counts == sorted(counts)
    assert not any(math.isnan(c) for c in counts)


def test_a_second_run_replaces_rows_instead_of_adding(main_window, open_in_window, run_in_window,
                                                      small_workbook):  # type: ignore[no-untyped-def]
    open_in_window(main_window, small_workbook)
    series = main_window.series_panel.model.all_series()[:2]
    run_in_window(main_window, series)
    main_window.apply_settings(Settings(alpha=0.10))
    run_in_window(main_window, series)
    model = main_window.findings_panel.model
    assert model.rowCount() == 2
    assert all(r.settings["alpha"] == 0.10 for r in model.results().values())


def test_select_all_is_the_platform_key_on_the_series_and_find_keeps_its_own(
        main_window, open_in_window, workbook_path, qtbot):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt
    from PySide6.QtGui import QKeySequence

    window = main_window
    assert QKeySequence(QKeySequence.StandardKey.SelectAll) in window.select_all_action.shortcuts()
    assert QKeySequence(QKeySequence.StandardKey.Find) in window.find_action.shortcuts()
    open_in_window(window, workbook_path)
    view = window.series_panel.view
    view.clearSelection()
    window.activateWindow()
    view.setFocus()
    qtbot.waitUntil(view.hasFocus)
    qtbot.keyClick(view, Qt.Key.Key_A, Qt.KeyboardModifier.ControlModifier)
    total = len(read_workbook(workbook_path).series())
    qtbot.waitUntil(lambda: len(window.series_panel.selected_series()) == total
                    and bool(view.selectionModel().selectedRows()))
    # in the filter box the same key selects its text, not the series
    view.clearSelection()
    box = window.series_panel.filter_box
    box.setText("output")
    box.setFocus()
    qtbot.waitUntil(box.hasFocus)
    box.deselect()
    qtbot.keyClick(box, Qt.Key.Key_A, Qt.KeyboardModifier.ControlModifier)
    assert box.selectedText() == "output"
    assert not view.selectionModel().selectedRows()


def test_undo_restores_a_removed_transformed_series_with_its_finding(
        main_window, open_in_window, run_in_window, workbook_path, qtbot):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt
    from PySide6.QtGui import QKeySequence

    window = main_window
    open_in_window(window, workbook_path)
    model = window.series_panel.model
    first = model.all_series()[0]
    window.add_transform(first.key, "logdiff")
    copy = next(s for s in model.all_series() if s.parent)
    run_in_window(window, [copy])
    shown = window.findings_panel.model.result_for_key(copy.key)
    assert shown is not None
    window.remove_transform(copy.key)
    assert model.series_for_key(copy.key) is None
    assert window.findings_panel.model.result_for_key(copy.key) is None
    assert window.undo_action.isEnabled() and "Remove" in window.undo_action.text()
    assert QKeySequence(QKeySequence.StandardKey.Undo) in window.undo_action.shortcuts()
    window.activateWindow()
    window.series_panel.view.setFocus()
    qtbot.waitUntil(window.series_panel.view.hasFocus)
    qtbot.keyClick(window.series_panel.view, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    qtbot.waitUntil(lambda: model.series_for_key(copy.key) is copy)
    assert window.findings_panel.model.result_for_key(copy.key) is shown
    assert [s.key for s in model.all_series()].index(copy.key) == 1  # under its parent
    assert window.current_key() == copy.key
    window.redo_action.trigger()
    assert model.series_for_key(copy.key) is None
