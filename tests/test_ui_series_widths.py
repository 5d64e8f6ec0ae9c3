"""The Series panel's column widths: each column as wide as its widest text (every row's,
folded away or not) and its title, each row measured once until its texts or the font
change."""

from __future__ import annotations

import pytest

pytest.importorskip("pytestqt")


def _own_measure(view):  # type: ignore[no-untyped-def]
    """The view's own measure of each column over every row (all unfolded)."""
    view.expandAll()
    return [view.sizeHintForColumn(c) for c in range(view.model().columnCount())]


def test_each_column_is_as_wide_as_its_widest_text_once_a_run_settles(
        main_window, open_in_window, run_in_window, small_workbook, qtbot):  # type: ignore[no-untyped-def]
    from tauscope.ui.columns import header_width
    from tauscope.ui.series_widths import TEXT_COLUMNS

    open_in_window(main_window, small_workbook)
    panel = main_window.series_panel
    main_window.add_transform(panel.model.all_series()[0].key, "diff")  # a row one level deeper
    run_in_window(main_window, panel.model.all_series())
    qtbot.waitUntil(lambda: not panel.columns.pending())
    view = panel.view
    own = _own_measure(view)
    natural = panel.widths.natural()
    for column in TEXT_COLUMNS:
        title = header_width(view, column)
        # its widest text (a pixel or two of rounding over the view's measure) or its title
        assert own[column] <= natural[column] <= max(own[column] + 2, title), column
        if not view.isColumnHidden(column):
            assert view.columnWidth(column) >= natural[column]
    assert sum(natural) <= view.viewport().width()  # room to spare here: the names take it
    assert view.columnWidth(0) > natural[0]


def test_rows_are_measured_once_until_their_texts_or_the_font_change(
        main_window, open_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.ui.series_model import NAME, SPAN

    open_in_window(main_window, small_workbook)
    panel = main_window.series_panel
    widths, model, view = panel.widths, panel.model, panel.view
    count = len(model.all_series())
    natural = widths.natural()
    measured = widths.measured
    assert widths.natural() == natural and widths.measured == measured  # nothing new
    # a transformed copy: its row only; its name, one level deeper, is as wide as it needs
    first = model.all_series()[0]
    main_window.add_transform(first.key, "diff")
    copy = model.all_series()[1]
    assert copy.parent == first.name
    deeper = widths.natural()
    assert widths.measured == measured + 1
    assert deeper[NAME] >= view.fontMetrics().horizontalAdvance(copy.name) + 4 * view.indentation()
    assert deeper[NAME] > natural[NAME]
    # folded away, its rows still count
    view.collapseAll()
    assert widths.natural() == deeper and widths.measured == measured + 1
    # taken out, it no longer counts
    model.remove_transformed(copy.key)
    assert widths.natural() == natural and widths.measured == measured + 1
    # a series whose gaps are cut: its row again ("3 missing" becomes "cut")
    gappy = next(s for s in model.all_series() if s.gaps)
    main_window.mend_gaps(gappy.key, "cut")
    widths.natural()
    assert widths.measured == measured + 2
    # a larger font: every row again, the texts' columns wider
    font = view.font()
    font.setPointSizeF(font.pointSizeF() * 2)
    view.setFont(font)
    larger = widths.natural()
    assert widths.measured == measured + 2 + count
    assert larger[NAME] > natural[NAME] and larger[SPAN] > natural[SPAN]
