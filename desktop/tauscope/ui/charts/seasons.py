"""The Seasons chart: one line per quarter or month across the years, each year's average
removed (:func:`tauscope.engine.seasonal.chart.seasonal_lines`).  Lines that run roughly
parallel show fixed seasonal means; lines that wander and cross show a seasonal pattern
that changes from year to year, the picture behind a seasonal unit root (Hylleberg, Engle,
Granger & Yoo 1990).  The title says what the tests found."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtGui import QColor

from tauscope.engine.seasonal.chart import seasonal_lines
from tauscope.ui.charts.base import Chart

SEASON_NAMES = {
    4: ("Q1", "Q2", "Q3", "Q4"),
    12: ("Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"),
}


def _first_season(index: object, period: int) -> tuple[int, int | None]:
    """(season of the first value, its year) from a date index, or (0, None)."""
    try:
        first = index[0]  # type: ignore[index]
        month, year = int(first.month), int(first.year)
    except (AttributeError, IndexError, TypeError, ValueError):
        return 0, None
    return ((month - 1) // 3 if period == 4 else month - 1), year


def _found(result: object) -> str:
    seasonal = getattr(result, "seasonal", None)
    roots = seasonal.roots if seasonal is not None else None
    means = seasonal.means if seasonal is not None else None
    parts = []
    if roots is not None:
        parts.append("seasonal unit roots: " + (", ".join(roots.seasonal_roots) or "none"))
    if means is not None:
        parts.append("fixed seasonal means " + ("found" if means.found else "not found"))
    return "; ".join(parts)


class SeasonsChart(Chart):
    title = "Seasons chart"
    tab = "Seasons"
    tip = ("One line per quarter or month across the years, each year's average removed: "
           "parallel lines are fixed seasonal means, lines that wander and cross a seasonal "
           "unit root.")
    guide = "seasons"

    def draw(self) -> None:
        result = self.result
        if result is None:
            self.say("Analyse this series (F5) to see its seasons, for quarterly and monthly series.")
            return
        if result.error is not None:
            self.say(result.error)
            return
        seasonal = result.seasonal
        values = result.values
        if seasonal is None or values is None:
            self.say("The Seasons chart is drawn for quarterly and monthly series when the "
                     "seasonal part is not switched off in Settings.")
            return
        period = seasonal.period
        start, year = _first_season(values.index, period)
        grid = seasonal_lines(np.asarray(values, dtype=float), period, start)
        years = np.arange(grid.shape[0], dtype=float) + (year if year is not None else 1)
        colors = self.colors
        self.clear()
        plot = self.new_plot(0, False, "Each season minus its year's average")
        plot.setToolTip(_found(result))
        for s, name in enumerate(SEASON_NAMES[period]):
            shade = QColor(colors.line)
            shade.setHsv((colors.line.hsvHue() + 360 * s // period) % 360,
                         max(colors.line.hsvSaturation(), 120), max(colors.line.value(), 120))
            plot.plot(years, grid[:, s], pen=pg.mkPen(shade, width=1.4), name=name, connect="finite")
        plot.setLabel("bottom", "year" if year is not None else "year of the sample",
                      color=colors.text.name())
        plot.setLabel("left", "difference from the year's average", color=colors.text.name())
        self.add_key(plot)
        self.style_plot(plot)
        self.show_plots()
