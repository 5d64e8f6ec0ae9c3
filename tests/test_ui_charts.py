"""The charts on their own (no main window): each chart draws what the engine returned for
a series (the engine is the reference), only the chart in front is drawn, and a chart that
has nothing to draw says so in a sentence."""

from __future__ import annotations

import numpy as np
import pytest

pytest.importorskip("pytestqt")

from tauscope.data import read_workbook
from tauscope.engine import Settings, analyse_series


@pytest.fixture
def analysed(small_workbook):  # type: ignore[no-untyped-def]
    """The first series of the small workbook and the engine's result for it."""
    series = read_workbook(small_workbook).series()[0]
    return series, analyse_series(series.testable_values(), Settings(), series.name)


@pytest.fixture
def panel(qtbot):  # type: ignore[no-untyped-def]
    from tauscope.ui.charts.panel import ChartPanel

    chart = ChartPanel()
    qtbot.addWidget(chart)
    chart.resize(700, 400)
    chart.show()
    return chart


def curve(page, name):  # type: ignore[no-untyped-def]
    items = [c for plot in page._shown for c in plot.listDataItems()]
    return next(c for c in items if c.name() == name)


def test_each_chart_draws_the_engines_numbers(panel, analysed, qtbot):  # type: ignore[no-untyped-def]
    series, result = analysed
    panel.display(series, result)
    data = panel.data_page
    assert data.has_plot()
    top, bottom = (p.listDataItems()[0].getOriginalDataset()[1] for p in data._shown)
    assert np.allclose(top, np.asarray(series.values, dtype=float), equal_nan=True)
    assert np.allclose(bottom, np.diff(np.asarray(series.values, dtype=float)), equal_nan=True)
    # the others are drawn when their tab is chosen
    assert not panel.fitted_page.has_plot() and panel.fitted_page.stale
    panel.tabs.setCurrentIndex(panel.FITTED)
    fitted = curve(panel.fitted_page, "deterministic path").getOriginalDataset()[1]
    assert np.allclose(fitted, np.asarray(result.fitted, dtype=float))
    panel.tabs.setCurrentIndex(panel.LAGS)
    taus = curve(panel.lags_page, "τ").getOriginalDataset()[1]
    assert np.allclose(taus, [p.statistic for p in result.lag_profile])
    panel.tabs.setCurrentIndex(panel.NULL)
    qtbot.waitUntil(panel.null_page.has_plot, timeout=30_000)
    assert panel.current_guide_anchor() == "chart-null"


def test_nothing_chosen_and_not_analysed_are_sentences(panel, analysed):  # type: ignore[no-untyped-def]
    series, _result = analysed
    assert not panel.data_page.has_plot()
    assert panel.data_page.message.text() == "Pick a series on the left to see it here."
    panel.display(series, None)
    assert panel.data_page.has_plot()
    for number, page in enumerate(panel.pages()[1:], start=1):
        panel.tabs.setCurrentIndex(number)
        assert not page.has_plot()
        assert "Analyse this series (F5)" in page.message.text()
    panel.show_nothing()
    panel.tabs.setCurrentIndex(panel.DATA)
    assert not panel.data_page.has_plot()


def test_a_failed_result_shows_its_sentence_on_every_analysis_chart(panel):  # type: ignore[no-untyped-def]
    result = analyse_series(np.full(60, 3.0), Settings(), "flat")
    assert result.error is not None
    panel.display(None, result)
    for number in (panel.FITTED, panel.LAGS, panel.RECURSIVE, panel.NULL):
        panel.tabs.setCurrentIndex(number)
        page = panel.pages()[number]
        assert not page.has_plot() and page.message.text() == result.error


def test_a_chart_on_its_own_draws_in_given_colours(qtbot, analysed):  # type: ignore[no-untyped-def]
    from PySide6.QtGui import QColor

    from tauscope.ui.charts.base import ChartColors
    from tauscope.ui.charts.fitted import FittedChart

    series, result = analysed
    chart = FittedChart()
    qtbot.addWidget(chart)
    colors = ChartColors(QColor("white"), QColor("black"), QColor("#123456"), QColor("#654321"))
    chart.set_colors(colors)
    chart.draw_for(series, result)
    assert chart.has_plot() and not chart.stale
    assert curve(chart, "series").opts["pen"].color() == QColor("#123456")
    assert curve(chart, "deterministic path").opts["pen"].color() == QColor("#654321")


def test_keys_sit_below_the_plots_and_cover_nothing(panel, analysed, qtbot):  # type: ignore[no-untyped-def]
    """No key floats over a plot (where it covered the τ line and the chosen lag's label): each
    chart with named curves has its key on a line of its own under the plot, naming them."""
    series, result = analysed
    panel.display(series, result)
    for number in (panel.FITTED, panel.LAGS, panel.RECURSIVE, panel.NULL):
        panel.tabs.setCurrentIndex(number)
        page = panel.pages()[number]
        qtbot.waitUntil(page.has_plot, timeout=30_000)
        plot = page._shown[0]
        assert plot.legend is None
        names = [c.name() for c in plot.listDataItems() if c.name()]
        assert names
        (key,) = page._shown_keys
        assert all(name in key.text for name in names)
        plot_box = plot.sceneBoundingRect()
        key_box = key.sceneBoundingRect()
        assert key_box.top() >= plot_box.bottom() - 1  # below the plot, not over it


def test_the_null_distribution_axis_is_a_true_density_however_often_drawn(panel, analysed, qtbot):  # type: ignore[no-untyped-def]
    """The histogram integrates to one (numpy's density), so the axis must read 0 to about 0.6;
    pyqtgraph's automatic scaling once turned it into 0 to 600 on a redraw."""
    series, result = analysed
    panel.display(series, result)
    panel.tabs.setCurrentIndex(panel.NULL)
    page = panel.null_page
    qtbot.waitUntil(page.has_plot, timeout=30_000)
    for _ in range(2):  # drawn again: the second drawing once took the scale of the first
        page.layout_widget.grab()  # painted, so the axis knows the range it shows
        page.draw_for(series, result)
        axis = page._shown[0].getAxis("left")
        _low, high = page._shown[0].viewRange()[1]
        assert 0.2 < high < 1.5
        assert axis.autoSIPrefixScale == 1.0
        assert axis.tickStrings([0.2, 0.4], axis.autoSIPrefixScale * axis.scale, 0.2) == ["0.2", "0.4"]
