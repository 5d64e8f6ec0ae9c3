"""The Data chart: the series and, below it, its first difference on a linked x axis."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt

from tauscope.ui.charts.base import Chart, x_positions


class DataChart(Chart):
    title = "Data chart"
    tab = "Data"
    tip = "The series and its first difference."
    guide = "chart-data"
    idle_text = "Pick a series on the left to see it here."

    def draw(self) -> None:
        series, result = self.series, self.result
        values = series.values if series is not None else (result.values if result else None)
        name = series.name if series is not None else (result.name if result else "")
        if values is None or len(values) < 2:
            self.say("There are too few values to draw.")
            return
        colors = self.colors
        self.clear()
        x, dates = x_positions(values.index)
        y = np.asarray(values, dtype=float)
        top = self.new_plot(0, dates, f"{name}")
        top.plot(x, y, pen=pg.mkPen(colors.line, width=1.5), connect="finite")
        bottom = self.new_plot(1, dates, "First difference")
        bottom.plot(x[1:], np.diff(y), pen=pg.mkPen(colors.accent, width=1.2), connect="finite")
        bottom.addLine(y=0, pen=pg.mkPen(colors.text, width=0.8, style=Qt.PenStyle.DotLine))
        bottom.setXLink(top)
        for plot in (top, bottom):
            self.style_plot(plot)
        self.show_plots()
