"""The Null distribution chart: how τ is distributed under a unit root at this sample size
(simulated, Dickey & Fuller, 1979), against the standard normal, with the observed τ and the
critical value.  The simulation runs in the thread pool and is kept per (spec, obs., lags)."""

from __future__ import annotations

import contextlib
from typing import Any

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QObject, QRunnable, Qt, QThreadPool, Signal
from PySide6.QtWidgets import QWidget

from tauscope.engine import formatting as fmt
from tauscope.ui.charts.base import Chart, profile_test
from tauscope.ui.texts import SPEC_NAMES

NullKey = tuple[str, int, int]  # spec, observations, lags


class _NullSignals(QObject):
    done = Signal(object, object)  # cache key, array or error text


class _NullTask(QRunnable):
    def __init__(self, key: NullKey, signals: _NullSignals) -> None:
        super().__init__()
        self.key = key
        self.signals = signals

    def run(self) -> None:
        from tauscope.engine import null_distribution

        spec, nobs, lags = self.key
        try:
            outcome: object = np.asarray(null_distribution(spec, nobs, lags=lags), dtype=float)
        except Exception as exc:
            outcome = f"The null distribution could not be simulated ({exc})."
        # RuntimeError: the window closed while the simulation ran; nobody waits for it.
        with contextlib.suppress(RuntimeError):
            self.signals.done.emit(self.key, outcome)


class NullChart(Chart):
    title = "Null distribution chart"
    tab = "Null distribution"
    tip = ("How τ is distributed when there really is a unit root, at this sample size, "
           "against the standard normal, with the observed τ and the critical value.")
    guide = "chart-null"

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self._cache: dict[NullKey, Any] = {}
        self._pending: set[NullKey] = set()
        self._signals = _NullSignals(self)
        self._signals.done.connect(self._ready)

    def draw(self) -> None:
        result = self.result
        if result is None:
            self.say("Analyse this series (F5) to compare its τ with the distribution under a "
                     "unit root.")
            return
        test = profile_test(result) if result.error is None else None
        if test is None:
            self.say(result.error or "No ADF test to show for this series.")
            return
        key = (str(test.spec), int(test.nobs), int(test.lags))
        cached = self._cache.get(key)
        if cached is None:
            self.say(f"Simulating the distribution of τ under a unit root for {test.nobs} "
                     "observations…")
            if key not in self._pending:
                self._pending.add(key)
                QThreadPool.globalInstance().start(_NullTask(key, self._signals))
            return
        if isinstance(cached, str):
            self.say(cached)
            return
        self._plot(cached, test)

    def _ready(self, key: Any, value: Any) -> None:
        self._pending.discard(key)
        self._cache[key] = value
        if self.result is not None and not self.stale:
            self.draw()

    def _plot(self, draws: np.ndarray, test: Any) -> None:
        from tauscope.engine.distributions.simulate import density_picture

        colors = self.colors
        self.clear()
        picture = density_picture(draws)
        spec = SPEC_NAMES.get(test.spec, test.spec)
        plot = self.new_plot(0, False, f"τ under a unit root · {spec}, {test.nobs} obs.")
        line = colors.line
        plot.plot(picture.edges, picture.heights, stepMode="center", fillLevel=0,
                  brush=pg.mkBrush(line.red(), line.green(), line.blue(), 70),
                  pen=pg.mkPen(line, width=1.2), name=f"simulated τ ({picture.draws} draws)")
        plot.plot(picture.grid, picture.normal,
                  pen=pg.mkPen(colors.text, width=1.2, style=Qt.PenStyle.DashLine),
                  name="standard normal")
        observed = pg.InfiniteLine(pos=test.statistic, angle=90,
                                   pen=pg.mkPen(colors.accent, width=2),
                                   label=f"observed τ = {fmt.stat(test.statistic)}",
                                   labelOpts={"position": 0.55, "color": colors.text,
                                              "fill": colors.legend_fill()})
        critical = pg.InfiniteLine(
            pos=test.critical_value, angle=90,
            pen=pg.mkPen(colors.text, width=1.5, style=Qt.PenStyle.DotLine),
            label=f"critical value {fmt.stat(test.critical_value)}",
            labelOpts={"position": 0.35, "color": colors.text, "fill": colors.legend_fill()})
        plot.addItem(observed)
        plot.addItem(critical)
        plot.setLabel("bottom", "τ", color=colors.text.name())
        plot.setLabel("left", "density", color=colors.text.name())
        self.add_key(plot)
        self.style_plot(plot)
        self.show_plots()
