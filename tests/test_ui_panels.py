"""The panels one by one: series tree, filter, transformed copies, settings dialog,
remembered state, guide, drag-and-drop and the colour-independent markers."""

from __future__ import annotations

import numpy as np
import pandas as pd
import pytest

pytest.importorskip("pytestqt")

from tauscope.data import read_workbook
from tauscope.engine import Settings


def child_texts(model, parent, column=0):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt

    from tauscope.ui.qtcompat import item_value

    return [str(item_value(model.index(r, column, parent), Qt.ItemDataRole.DisplayRole, ""))
            for r in range(model.rowCount(parent))]


def test_series_tree_lists_workbook_sheets_and_series_with_their_facts(
        main_window, open_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui import series_model as sm

    open_in_window(main_window, small_workbook)
    model = main_window.series_panel.model
    assert child_texts(model, model.index(-1, -1)) == ["small.xlsx"]
    workbook_index = model.index(0, 0)
    assert child_texts(model, workbook_index) == ["Monthly"]
    sheet_index = model.index(0, 0, workbook_index)
    book = read_workbook(small_workbook)
    assert child_texts(model, sheet_index) == [s.name for s in book.series()]
    for column, expected in ((sm.OBS, [str(s.nobs) for s in book.series()]),
                             (sm.FREQUENCY, [s.frequency for s in book.series()]),
                             (sm.SPAN, [f"{s.span[0]}–{s.span[1]}" for s in book.series()])):
        assert child_texts(model, sheet_index, column) == expected
    gaps = child_texts(model, sheet_index, sm.GAPS)
    assert gaps[-1] == "3 missing" and gaps[0] == "none"


def test_sparkline_points_are_scaled_and_keep_gaps() -> None:
    from tauscope.ui.sparkline import sparkline_points

    values = pd.Series([1.0, 3.0, np.nan, 5.0])
    points = sparkline_points(values)
    assert points[0] == 0.0 and points[-1] == 1.0 and points[1] == 0.5
    assert np.isnan(points[2])
    long = sparkline_points(pd.Series(np.arange(5000, dtype=float)), max_points=100)
    assert long.size == 100 and long[0] == 0.0 and long[-1] == 1.0
    assert np.all(sparkline_points(pd.Series([2.0, 2.0])) == 0.5)


def test_filter_box_hides_series_that_do_not_match(main_window, open_in_window, small_workbook):  # type: ignore[no-untyped-def]
    open_in_window(main_window, small_workbook)
    panel = main_window.series_panel
    panel.filter_box.setText("walk")
    sheet = panel.proxy.index(0, 0, panel.proxy.index(0, 0))
    assert child_texts(panel.proxy, sheet) == ["walk 1", "walk 3"]
    panel.filter_box.clear()
    assert len(child_texts(panel.proxy, panel.proxy.index(0, 0, panel.proxy.index(0, 0)))) == 6


def test_selecting_a_sheet_selects_its_series(main_window, open_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import QItemSelectionModel

    open_in_window(main_window, small_workbook)
    panel = main_window.series_panel
    sheet = panel.proxy.index(0, 0, panel.proxy.index(0, 0))
    panel.view.selectionModel().select(
        sheet, QItemSelectionModel.SelectionFlag.ClearAndSelect
        | QItemSelectionModel.SelectionFlag.Rows)
    assert [s.name for s in panel.selected_series()] == [
        s.name for s in read_workbook(small_workbook).series()]


def test_selected_series_in_tree_order_each_once_copies_with_their_sheet(
        main_window, open_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import QItemSelectionModel

    open_in_window(main_window, small_workbook)
    panel = main_window.series_panel
    names = [s.name for s in read_workbook(small_workbook).series()]
    main_window.add_transform(panel.model.all_series()[2].key, "diff")
    panel.view.expandAll()
    copy = panel.model.all_series()[3]
    assert copy.parent and copy.name not in names
    rows = QItemSelectionModel.SelectionFlag.Select | QItemSelectionModel.SelectionFlag.Rows
    sheet = panel.proxy.index(0, 0, panel.proxy.index(0, 0))
    pick = panel.view.selectionModel()

    def select(*indexes):  # type: ignore[no-untyped-def]
        pick.clearSelection()
        for index in indexes:
            pick.select(index, rows)
        return [s.name for s in panel.selected_series()]

    # rows picked out of order come back in the tree's order
    assert select(panel.proxy.index(4, 0, sheet), panel.proxy.index(1, 0, sheet)) == [
        names[1], names[4]]
    # a series' own row stands for itself, not for its transformed copy
    assert select(panel.proxy.index(2, 0, sheet)) == [names[2]]
    copy_index = panel.proxy.index(0, 0, panel.proxy.index(2, 0, sheet))
    assert select(copy_index) == [copy.name]
    # the sheet stands for every series below it, copies included, each once
    everything = [*names[:3], copy.name, *names[3:]]
    assert select(sheet, panel.proxy.index(0, 0, sheet), copy_index) == everything
    assert select(panel.proxy.index(0, 0)) == everything
    # nothing selected: all series; with the filter on, a selected sheet still stands for all
    assert select() == everything
    panel.filter_box.setText("walk")
    sheet = panel.proxy.index(0, 0, panel.proxy.index(0, 0))
    assert select(sheet) == everything
    assert select(panel.proxy.index(1, 0, sheet)) == [child_texts(panel.proxy, sheet)[1]]


def test_a_transformed_copy_appears_under_its_parent(main_window, open_in_window,
                                                     run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    open_in_window(main_window, small_workbook)
    model = main_window.series_panel.model
    parent = model.all_series()[0]
    main_window.add_transform(parent.key, "diff")
    item = model.item_for_key(parent.key)
    assert item.rowCount() == 1
    derived = model.all_series()[1]
    assert derived.parent == parent.name and derived.transform == "diff"
    assert item.child(0, 0).text() == derived.name
    assert main_window.current_key() == derived.key
    run_in_window(main_window, [derived])
    assert main_window.findings_panel.model.result_for_key(derived.key).name == derived.name


def test_a_transform_that_does_not_apply_says_why(main_window, open_in_window, small_workbook,
                                                  tmp_path):  # type: ignore[no-untyped-def]
    from conftest import write_workbook

    path = write_workbook(tmp_path / "neg.xlsx", {"negative": -np.arange(1.0, 50.0)})
    open_in_window(main_window, path)
    series = main_window.series_panel.model.all_series()[0]
    main_window.add_transform(series.key, "log")
    assert main_window.message_box is not None and main_window.message_box.isVisible()
    assert "negative" in main_window.message_box.text()
    assert main_window.series_panel.model.item_for_key(series.key).rowCount() == 0
    main_window.message_box.close()


def test_settings_dialog_round_trip_defaults_and_memory(main_window):  # type: ignore[no-untyped-def]
    from tauscope.ui import store
    from tauscope.ui.settings_dialog import SettingsDialog

    chosen = Settings(lag_rule="fixed", lags=3, alpha=0.01, max_difference=1, confirm=())
    dialog = SettingsDialog(chosen)
    assert dialog.settings() == chosen
    assert not dialog.max_lags.isEnabled() and dialog.fixed_lags.isEnabled()
    dialog.load(Settings())
    assert dialog.settings() == Settings()
    other = Settings(lag_rule="bic", max_lags=6, alpha=0.10)
    dialog.load(other)
    assert dialog.settings() == other
    switched = Settings(break_check="off", seasonal="never")
    dialog.load(switched)
    assert dialog.break_check.currentData() == "off"
    assert dialog.settings() == switched
    main_window.apply_settings(other)
    assert store.load_settings() == other
    assert "10%" in main_window.settings_label.text()
    dialog.deleteLater()


def test_window_layout_and_recent_files_are_remembered(qtbot, qt_settings_dir,
                                                       small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui import store
    from tauscope.ui.main_window import MainWindow

    first = MainWindow()
    qtbot.addWidget(first)
    first.resize(720, 520)  # inside the offscreen platform's 800×600 screen
    first.show()
    first.outer_splitter.setSizes([250, 750])
    first.open_files([small_workbook])
    qtbot.waitUntil(lambda: first.loader.pending == 0, timeout=30_000)
    sizes = first.outer_splitter.sizes()
    first.close()
    assert store.recent_files() == [str(small_workbook.resolve())]
    assert (qt_settings_dir / "Tauscope" / "Tauscope.ini").is_file()
    second = MainWindow()
    qtbot.addWidget(second)
    second.show()
    assert (second.size().width(), second.size().height()) == (720, 520)
    assert second.outer_splitter.sizes() == sizes


def test_guide_opens_at_the_section_a_cell_points_to(main_window, open_in_window, run_in_window,
                                                     small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui.guide_text import ANCHORS, guide_html

    text = guide_html()
    for reference in ("Dickey, D.A. &amp; Fuller, W.A. (1979)", "(1981)", "Said &amp; Dickey (1984)"
                      .replace(" (1984)", ""), "MacKinnon, J.G. (1996)", "MacKinnon, J.G. (2010)",
                      "Ng, S. &amp; Perron, P. (1995)", "Ng, S. &amp; Perron, P. (2001)",
                      "Dolado", "Kwiatkowski", "Schwert", "Perron, P. (1989)", "West, K.D. (1988)"):
        assert reference in text
    open_in_window(main_window, small_workbook)
    run_in_window(main_window, main_window.series_panel.model.all_series()[:1])
    panel = main_window.findings_panel
    from tauscope.ui.qtcompat import item_value
    from tauscope.ui.roles import GUIDE_ROLE

    panel.view.expandAll()
    step = panel.proxy.index(0, 2, panel.proxy.index(0, 0))
    anchor = item_value(step, GUIDE_ROLE)
    assert anchor in ANCHORS
    panel.view.setCurrentIndex(step)
    panel.view.setFocus()
    main_window.open_guide_for_focus()
    assert main_window.guide is not None and main_window.guide.isVisible()
    main_window.guide.close()


def test_drop_accepts_workbook_files_only(main_window, small_workbook, tmp_path):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import QMimeData, QUrl

    other = tmp_path / "notes.docx"
    other.write_text("x")
    mime = QMimeData()
    mime.setUrls([QUrl.fromLocalFile(str(small_workbook)), QUrl.fromLocalFile(str(other))])
    assert main_window._dropped_paths(mime) == [str(small_workbook)]


def test_markers_differ_by_shape_and_word_not_only_colour(main_window, open_in_window,
                                                          run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt
    from PySide6.QtGui import QImage

    from tauscope.ui.findings_model import VERDICT
    from tauscope.ui.markers import MARKERS, marker_icon
    from tauscope.ui.qtcompat import item_value

    images = {kind: marker_icon(kind, main_window.palette().text().color()).pixmap(16, 16)
              .toImage().convertToFormat(QImage.Format.Format_Alpha8)
              for kind in MARKERS}
    raw = {kind: bytes(img.constBits()) for kind, img in images.items()}
    assert len(set(raw.values())) == len(MARKERS)  # the shapes differ, whatever the colour
    open_in_window(main_window, small_workbook)
    main_window.select_all_series()
    run_in_window(main_window)
    model = main_window.findings_panel.model
    for r in range(model.rowCount()):
        words = item_value(model.index(r, VERDICT), Qt.ItemDataRole.AccessibleTextRole, "")
        assert any(words.startswith(w) for w, _ in MARKERS.values())


def test_controls_have_accessible_names(main_window):  # type: ignore[no-untyped-def]
    for widget in (main_window.series_panel.view, main_window.series_panel.filter_box,
                   main_window.findings_panel.view, main_window.reading_panel.browser,
                   main_window.chart_panel.tabs, main_window.progress):
        assert widget.accessibleName()
    shortcuts = {a.text(): a.shortcut().toString() for a in
                 (main_window.run_action, main_window.stop_action, main_window.quit_action,
                  main_window.open_action, main_window.copy_action)}
    assert shortcuts["&Run the analysis"] == "F5" and shortcuts["&Stop"] == "Esc"
    assert shortcuts["&Open workbooks…"] and shortcuts["&Copy"] and shortcuts["&Quit"]


def test_dark_and_light_appearance_switch_the_palette(main_window, qapp):  # type: ignore[no-untyped-def]
    main_window.set_appearance("dark")
    assert qapp.palette().base().color().lightness() < 100
    main_window.set_appearance("light")
    assert qapp.palette().base().color().lightness() > 200


def test_gaps_can_be_cut_or_filled_and_the_series_becomes_testable(
        main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui import series_model as sm

    open_in_window(main_window, small_workbook)
    model = main_window.series_panel.model
    gappy = next(s for s in model.all_series() if s.gaps)
    main_window.mend_gaps(gappy.key, "cut")
    cut = model.series_for_key(gappy.key)
    assert not cut.gaps and cut.nobs == max(60, 150 - 63)  # the longer side of the 3-value gap
    item = model.item_for_key(gappy.key)
    row = item.parent().child(item.row(), sm.OBS)
    assert row.text() == str(cut.nobs)
    run_in_window(main_window, [cut])
    result = main_window.findings_panel.model.result_for_key(gappy.key)
    assert result.error is None and result.nobs > 0


def _clipped(view, index):  # type: ignore[no-untyped-def]
    """The text of a cell when it does not fit in the cell as shown (else "")."""
    from PySide6.QtCore import Qt

    text = str(index.data(Qt.ItemDataRole.DisplayRole) or "")
    if not text:
        return ""
    rect = view.visualRect(index)
    icon = 22 if index.data(Qt.ItemDataRole.DecorationRole) is not None else 0
    needed = view.fontMetrics().horizontalAdvance(text) + icon + 6
    inside = rect.right() <= view.viewport().width() and rect.left() >= 0
    return "" if needed <= rect.width() and inside else text


@pytest.mark.parametrize(("size", "checks"), [((1280, 800), ("kpss",)), ((1920, 1080), ("kpss",)),
                                              ((1280, 800), ("kpss", "pp", "dfgls", "za"))])
def test_every_label_fits_at_the_usual_window_sizes(main_window, open_in_window, run_in_window,
                                                    size, checks, qtbot):  # type: ignore[no-untyped-def]
    """Names, spans and verdicts in the Series panel, and verdicts, null hypotheses and numbers
    in the Findings (every cross-check turned on, too), are whole at 1280×800 and 1920×1080
    (the default layout)."""
    from tauscope.engine import Settings
    from tauscope.resources_path import demo_workbook

    demo = demo_workbook()
    if demo is None:
        pytest.skip("the demo workbook is not installed")
    window = main_window
    window.resize(*size)
    window._default_sizes()
    window.apply_settings(Settings(confirm=checks))
    open_in_window(window, demo)
    run_in_window(window, window.series_panel.model.all_series())
    findings = window.findings_panel
    findings.view.expand(findings.proxy.index(0, 0))
    qtbot.waitUntil(lambda: findings.proxy.rowCount(findings.proxy.index(0, 0)) > 3)
    series_view = window.series_panel.view
    qtbot.waitUntil(lambda: not (window.series_panel.columns.pending()
                                 or findings.columns.pending()))  # the columns fitted to the end
    qtbot.waitUntil(lambda: series_view.horizontalScrollBar().maximum() == 0)
    qtbot.waitUntil(lambda: findings.view.horizontalScrollBar().maximum() == 0)
    clipped = []
    for view, columns in ((series_view, range(5)), (findings.view, range(9))):
        model = view.model()
        stack = [model.index(r, 0) for r in range(model.rowCount())]
        while stack:
            index = stack.pop()
            if not view.isExpanded(index.parent()) and index.parent().isValid():
                continue
            for column in columns:
                cell = index.siblingAtColumn(column)
                if view.isColumnHidden(column) or view.isFirstColumnSpanned(index.row(), index.parent()):
                    continue
                if (text := _clipped(view, cell)):
                    clipped.append(text)
            stack.extend(model.index(r, 0, index) for r in range(model.rowCount(index)))
    assert clipped == []
    # The chart's tabs, all six as a quarterly or monthly series shows them, fit without
    # scroll buttons.
    tabs = window.chart_panel.tabs
    tabs.setTabVisible(window.chart_panel.SEASONS, True)
    assert tabs.tabBar().sizeHint().width() <= tabs.width()


def test_column_widths_set_by_hand_are_remembered(qtbot, qt_settings_dir, small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui.main_window import MainWindow

    first = MainWindow()
    qtbot.addWidget(first)
    first.resize(780, 560)
    first.show()
    first.open_files([small_workbook])
    qtbot.waitUntil(lambda: first.loader.pending == 0, timeout=30_000)
    first.series_panel.view.header().resizeSection(0, 151)  # as a drag of the column edge does
    first.findings_panel.view.header().resizeSection(2, 133)
    assert first.series_panel.columns.by_hand and first.findings_panel.columns.by_hand
    widths = ([first.series_panel.view.columnWidth(c) for c in range(6)],
              [first.findings_panel.view.columnWidth(c) for c in range(9)])
    first.close()
    second = MainWindow()
    qtbot.addWidget(second)
    second.show()
    second.open_files([small_workbook])
    qtbot.waitUntil(lambda: second.loader.pending == 0, timeout=30_000)
    assert second.series_panel.view.columnWidth(0) == 151
    assert second.findings_panel.view.columnWidth(2) == 133
    assert ([second.series_panel.view.columnWidth(c) for c in range(6)],
            [second.findings_panel.view.columnWidth(c) for c in range(9)]) == widths
    second.reset_layout_action.trigger()  # the default layout: fitted widths again
    assert not second.series_panel.columns.by_hand
    assert second.series_panel.view.columnWidth(0) != 151
