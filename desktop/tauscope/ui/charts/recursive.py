"""The Expanding window chart: τ recomputed on the first observations, then more and more
(from the engine's evidence), with the critical value at each size."""

from __future__ import annotations

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import Qt

from tauscope.engine import formatting as fmt
from tauscope.ui.charts.base import Chart, x_positions
from tauscope.ui.texts import SPEC_SHORT


class RecursiveChart(Chart):
    title = "Expanding window chart"
    tab = "Over time"
    tip = ("τ recomputed on an expanding window (the first observations, then more and "
           "more), with the critical value at each size: is the verdict stable over time?")
    guide = "chart-recursive"

    def draw(self) -> None:
        """τ on an expanding window (from the engine's evidence) with its critical value."""
        result = self.result
        if result is None:
            self.say("Analyse this series (F5) to see τ on an expanding window.")
            return
        recursive = result.evidence.recursive if result.evidence is not None else None
        if result.error is not None or recursive is None or len(recursive.ends) == 0:
            self.say(result.error or "No expanding-window statistic was computed for this series.")
            return
        colors = self.colors
        self.clear()
        ends = np.asarray(recursive.ends, dtype=int)
        values = result.values
        dates = False
        if values is not None and len(values) > int(ends.max()):
            x, dates = x_positions(values.index[ends])
        else:
            x = ends.astype(float) + 1
        spec = SPEC_SHORT.get(recursive.spec, recursive.spec)
        level = fmt.percent(recursive.alpha)
        # Under a size-controlled strategy this is the classic sequence's ADF, a cross-check: the
        # title says so, so the chart is not read as the test that decided the verdict.
        whose = "ADF τ" if result.verdict.strategy == "classic" else "Classic ADF τ"
        plot = self.new_plot(0, dates, f"{whose} over time · {spec}, {recursive.lags} lags")
        plot.plot(x, np.asarray(recursive.statistics, dtype=float),
                  pen=pg.mkPen(colors.line, width=1.5), name="τ up to this date", connect="finite")
        plot.plot(x, np.asarray(recursive.critical_values, dtype=float),
                  pen=pg.mkPen(colors.text, width=1.2, style=Qt.PenStyle.DashLine),
                  name=f"{level} critical value")
        plot.setLabel("bottom", "last observation used" if not dates else "",
                      color=colors.text.name())
        plot.setLabel("left", "τ", color=colors.text.name())
        self.add_key(plot)
        self.style_plot(plot)
        self.show_plots()
