"""The Lag orders chart: the ADF statistic τ for every lag order from 0 to the maximum
(Said & Dickey, 1984), with the critical value and the chosen lag order marked."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt

from tauscope.ui.charts.base import Chart, profile_test
from tauscope.ui.texts import DIFFERENCE_NAMES, SPEC_NAMES


class LagsChart(Chart):
    title = "Lag orders chart"
    tab = "Lags"
    tip = ("The ADF statistic τ for every lag order from 0 to the maximum, with the critical "
           "value; the chosen lag order is marked.")
    guide = "chart-lags"

    def draw(self) -> None:
        result = self.result
        if result is None:
            self.say("Analyse this series (F5) to see how τ changes with the lag order.")
            return
        if result.error is not None or not result.lag_profile:
            self.say(result.error or "No lag profile was computed for this series.")
            return
        colors = self.colors
        self.clear()
        lags = np.array([p.lag for p in result.lag_profile], dtype=float)
        taus = np.array([p.statistic for p in result.lag_profile], dtype=float)
        crit = np.array([p.critical_value for p in result.lag_profile], dtype=float)
        spec = SPEC_NAMES.get(result.lag_profile_spec or "", "")
        where = DIFFERENCE_NAMES.get(result.lag_profile_difference or 0, "")
        plot = self.new_plot(0, False, f"τ by lag order · {where}, {spec}")
        plot.plot(lags, taus, pen=pg.mkPen(colors.line, width=1.5), symbol="o", symbolSize=6,
                  symbolBrush=colors.line, name="τ")
        alpha = float(result.settings.get("alpha", 0.05))
        plot.plot(lags, crit, pen=pg.mkPen(colors.text, width=1.2, style=Qt.PenStyle.DashLine),
                  name=f"{alpha:.0%} critical value")
        # Head-room above both lines for the chosen lag order's label.
        low, high = float(min(taus.min(), crit.min())), float(max(taus.max(), crit.max()))
        span = max(high - low, 0.5)
        plot.setYRange(low - 0.08 * span, high + 0.2 * span, padding=0)
        test = profile_test(result)
        if test is not None:
            chosen = pg.InfiniteLine(pos=test.lags, angle=90,
                                     pen=pg.mkPen(colors.accent, width=1.5, style=Qt.PenStyle.DotLine),
                                     label=f"chosen: {test.lags}",
                                     labelOpts={"position": 0.95, "color": colors.text,
                                                "fill": colors.legend_fill()})
            plot.addItem(chosen)
        plot.setLabel("bottom", "lag order", color=colors.text.name())
        plot.setLabel("left", "τ", color=colors.text.name())
        self.add_key(plot)
        self.style_plot(plot)
        self.show_plots()
