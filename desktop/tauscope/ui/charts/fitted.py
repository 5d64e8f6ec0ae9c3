"""The Fitted path chart: the tested series with the deterministic path its verdict implies
(mean, trend or drift)."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt

from tauscope.ui.charts.base import Chart, x_positions


class FittedChart(Chart):
    title = "Fitted path chart"
    tab = "Fitted path"
    tip = ("The tested series with the deterministic path the verdict implies "
           "(mean, trend or drift).")
    guide = "chart-fitted"

    def draw(self) -> None:
        result = self.result
        if result is None:
            self.say("Analyse this series (F5) to see the deterministic path the verdict implies.")
            return
        if result.error is not None:
            self.say(str(result.error))
            return
        if result.values is None or result.fitted is None:
            self.say("There is no deterministic path to draw for this verdict.")
            return
        colors = self.colors
        self.clear()
        x, dates = x_positions(result.values.index)
        plot = self.new_plot(0, dates, f"{result.name}: {result.verdict.label}")
        plot.plot(x, np.asarray(result.values, dtype=float), pen=pg.mkPen(colors.line, width=1.5),
                  name="series")
        plot.plot(x, np.asarray(result.fitted, dtype=float),
                  pen=pg.mkPen(colors.accent, width=2, style=Qt.PenStyle.DashLine),
                  name="deterministic path")
        self.add_key(plot)
        self.style_plot(plot)
        self.show_plots()
