"""The Chart panel (pyqtgraph): the data, and after analysis the fitted path, the
statistic across lag orders, τ on an expanding window and the null distribution of
the statistic.  Each view can be saved as PNG or SVG from its context menu."""

from __future__ import annotations

import contextlib
from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QObject, QPoint, QRunnable, Qt, QThreadPool, Signal
from PySide6.QtGui import QColor, QPalette
from PySide6.QtWidgets import QMenu, QTabWidget, QVBoxLayout, QWidget

from tauscope.engine import SeriesResult
from tauscope.engine import formatting as fmt
from tauscope.ui.charts.base import ChartPage, x_positions
from tauscope.ui.texts import DIFFERENCE_NAMES, SPEC_NAMES

if TYPE_CHECKING:
    from tauscope.data import SeriesData


class _NullSignals(QObject):
    done = Signal(object, object)  # cache key, array or error text


class _NullTask(QRunnable):
    def __init__(self, key: tuple[str, int, int], signals: _NullSignals) -> None:
        super().__init__()
        self.key = key
        self.signals = signals

    def run(self) -> None:
        from tauscope.engine.simulate import null_distribution

        spec, nobs, lags = self.key
        try:
            outcome: object = np.asarray(null_distribution(spec, nobs, lags=lags), dtype=float)
        except Exception as exc:
            outcome = f"The null distribution could not be simulated ({exc})."
        # RuntimeError: the window closed while the simulation ran; nobody waits for it.
        with contextlib.suppress(RuntimeError):
            self.signals.done.emit(self.key, outcome)


class ChartPanel(QWidget):
    """Tabs: Data, Fitted path, Lag orders, Expanding window, Null distribution."""

    DATA, FITTED, LAGS, RECURSIVE, NULL = range(5)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        pg.setConfigOptions(antialias=True)
        self.tabs = QTabWidget(self)
        self.tabs.setAccessibleName("Chart views")
        self.data_page = ChartPage("Data chart", self)
        self.fitted_page = ChartPage("Fitted path chart", self)
        self.lags_page = ChartPage("Lag orders chart", self)
        self.recursive_page = ChartPage("Expanding window chart", self)
        self.null_page = ChartPage("Null distribution chart", self)
        self.tabs.addTab(self.data_page, "Data")
        self.tabs.addTab(self.fitted_page, "Fitted path")
        self.tabs.addTab(self.lags_page, "Lag orders")
        self.tabs.addTab(self.recursive_page, "Expanding window")
        self.tabs.addTab(self.null_page, "Null distribution")
        tips = ("The series and its first difference.",
                "The tested series with the deterministic path the verdict implies "
                "(mean, trend or drift).",
                "The ADF statistic τ for every lag order from 0 to the maximum, with the critical "
                "value; the chosen lag order is marked.",
                "τ recomputed on an expanding window (the first observations, then more and "
                "more), with the critical value at each size: is the verdict stable over time?",
                "How τ is distributed when there really is a unit root, at this sample size, "
                "against the standard normal, with the observed τ and the critical value.")
        for i, tip in enumerate(tips):
            self.tabs.setTabToolTip(i, tip + "\nPress F1 for the guide's section on this chart.")
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.addWidget(self.tabs)
        # (title, start, filters) -> chosen path or ""; the window replaces it (and tests do)
        self.save_path_asker: Callable[[str, str, str], str] = self._ask_save_path
        self.saved_message = ""
        for page in self.pages():
            page.layout_widget.customContextMenuRequested.connect(
                lambda pos, p=page: self._context_menu(p, pos))
        self._null_cache: dict[tuple[str, int, int], Any] = {}
        self._null_pending: set[tuple[str, int, int]] = set()
        self._null_signals = _NullSignals(self)
        self._null_signals.done.connect(self._null_ready)
        self._series: SeriesData | None = None
        self._result: SeriesResult | None = None
        self._dirty: set[int] = set()
        self._stale_colors = False
        self.tabs.currentChanged.connect(self._draw_current)
        self._apply_colors()
        self.show_nothing()

    GUIDE_ANCHORS = ("chart-data", "chart-fitted", "chart-lags", "chart-recursive", "chart-null")

    def pages(self) -> tuple[ChartPage, ...]:
        return (self.data_page, self.fitted_page, self.lags_page, self.recursive_page,
                self.null_page)

    # saving -------------------------------------------------------------
    def _ask_save_path(self, title: str, start: str, filters: str) -> str:
        from PySide6.QtWidgets import QFileDialog

        path, _chosen = QFileDialog.getSaveFileName(self, title, start, filters)
        return path

    def chart_menu(self, page: ChartPage) -> QMenu:
        menu = QMenu(self)
        png = menu.addAction("Save this chart as a picture (PNG)…")
        png.triggered.connect(lambda _c=False: self.save_chart(page, "png"))
        svg = menu.addAction("Save this chart as a drawing (SVG)…")
        svg.triggered.connect(lambda _c=False: self.save_chart(page, "svg"))
        for action in (png, svg):
            action.setEnabled(page.has_plot())
        return menu

    def _context_menu(self, page: ChartPage, pos: QPoint) -> None:
        self.chart_menu(page).popup(page.layout_widget.mapToGlobal(pos))

    def save_chart(self, page: ChartPage, kind: str, path: Path | str | None = None) -> bool:
        """Save the page's chart as PNG or SVG (asking where when no path is given)."""
        if not page.has_plot():
            return False
        if path is None:
            name = (self._series.name if self._series is not None
                    else self._result.name if self._result is not None else "chart")
            start = "".join(c if c.isalnum() or c in " -_" else "_" for c in name).strip() or "chart"
            filters = ("PNG pictures (*.png)" if kind == "png" else "SVG drawings (*.svg)")
            answer = self.save_path_asker("Save the chart", f"{start}.{kind}", filters)
            if not answer:
                return False
            path = answer
        target = Path(path)
        if target.suffix.lower() != f".{kind}":
            target = target.with_name(target.name + f".{kind}")
        try:
            page.save_png(target) if kind == "png" else page.save_svg(target)
        except OSError as exc:
            self.saved_message = f"The chart was not saved: {exc}."
            return False
        self.saved_message = f"Saved the chart as {target.name}."
        return True

    def current_guide_anchor(self) -> str:
        return self.GUIDE_ANCHORS[max(self.tabs.currentIndex(), 0)]

    # colours ------------------------------------------------------------
    def _apply_colors(self) -> None:
        palette = self.palette()
        self._bg = palette.color(QPalette.ColorRole.Base)
        self._fg = palette.color(QPalette.ColorRole.Text)
        dark = self._bg.lightness() < 128
        self._line = QColor("#7fb2ff") if dark else QColor("#1f4e99")
        self._accent = QColor("#ffb347") if dark else QColor("#b35900")
        for page in self.pages():
            page.layout_widget.setBackground(self._bg)

    def changeEvent(self, event: Any) -> None:
        super().changeEvent(event)
        if not hasattr(self, "_dirty"):
            return  # still being built
        if event.type() in (event.Type.PaletteChange, event.Type.ApplicationPaletteChange):
            self._apply_colors()
            self._stale_colors = True  # redraw in the new colours
            self.display(self._series, self._result)

    def _legend_fill(self) -> QColor:
        fill = QColor(self._bg)
        fill.setAlpha(215)
        return fill

    def _style(self, plot: pg.PlotItem) -> None:
        for name in ("left", "bottom"):
            axis = plot.getAxis(name)
            axis.enableAutoSIPrefix(False)  # plain numbers, no "(x0.001)" scaling
            axis.setPen(self._fg)
            axis.setTextPen(self._fg)
        title = plot.titleLabel.text
        if title:  # the colour applies when the text is set again
            plot.titleLabel.setText(title, color=self._fg.name())

    # content ------------------------------------------------------------
    def show_nothing(self) -> None:
        self._series, self._result = None, None
        self._dirty = set()
        self.data_page.say("Pick a series on the left to see it here.")
        for page in (self.fitted_page, self.lags_page, self.recursive_page, self.null_page):
            page.say("Analyse a series (F5) to see this view.")

    def display(self, series: SeriesData | None, result: SeriesResult | None) -> None:
        """Show one series (and its result, once analysed).  Only the view in front is
        drawn now; the others when their tab is chosen."""
        if series is self._series and result is self._result and not self._stale_colors:
            return
        same_data = series is not None and series is self._series and not self._stale_colors \
            and 0 not in self._dirty
        self._stale_colors = False
        self._series, self._result = series, result
        if series is None and result is None:
            self.show_nothing()
            return
        self._dirty = {1, 2, 3, 4} if same_data else {0, 1, 2, 3, 4}
        self._draw_current()

    def _draw_current(self, *_args: Any) -> None:
        index = self.tabs.currentIndex()
        if index not in self._dirty:
            return
        self._dirty.discard(index)
        series, result = self._series, self._result
        if index == 0:
            self._draw_data(series, result)
        elif index == 1:
            self._draw_fitted(result)
        elif index == 2:
            self._draw_lags(result)
        elif index == self.RECURSIVE:
            self._draw_recursive(result)
        else:
            self._draw_null(result)

    def _draw_data(self, series: SeriesData | None, result: SeriesResult | None) -> None:
        page = self.data_page
        values = series.values if series is not None else (result.values if result else None)
        name = series.name if series is not None else (result.name if result else "")
        if values is None or len(values) < 2:
            page.say("There are too few values to draw.")
            return
        page.clear()
        x, dates = x_positions(values.index)
        y = np.asarray(values, dtype=float)
        top = page.new_plot(0, dates, f"{name}")
        top.plot(x, y, pen=pg.mkPen(self._line, width=1.5), connect="finite")
        bottom = page.new_plot(1, dates, "First difference")
        bottom.plot(x[1:], np.diff(y), pen=pg.mkPen(self._accent, width=1.2), connect="finite")
        bottom.addLine(y=0, pen=pg.mkPen(self._fg, width=0.8, style=Qt.PenStyle.DotLine))
        bottom.setXLink(top)
        for plot in (top, bottom):
            self._style(plot)
        page.show_plots()

    def _draw_fitted(self, result: SeriesResult | None) -> None:
        page = self.fitted_page
        if result is None:
            page.say("Analyse this series (F5) to see the deterministic path the verdict implies.")
            return
        if result.error is not None:
            page.say(str(result.error))
            return
        if result.values is None or result.fitted is None:
            page.say("There is no deterministic path to draw for this verdict.")
            return
        page.clear()
        x, dates = x_positions(result.values.index)
        plot = page.new_plot(0, dates, f"{result.name}: {result.verdict.label}")
        page.legend(plot, self._fg, self._bg, "bottom-right")
        plot.plot(x, np.asarray(result.values, dtype=float), pen=pg.mkPen(self._line, width=1.5),
                  name="series")
        plot.plot(x, np.asarray(result.fitted, dtype=float),
                  pen=pg.mkPen(self._accent, width=2, style=Qt.PenStyle.DashLine),
                  name="deterministic path")
        self._style(plot)
        page.show_plots()

    def _profile_test(self, result: SeriesResult) -> Any:
        if result.lag_profile_spec is None:
            return None
        return result.find("adf", result.lag_profile_spec, result.lag_profile_difference or 0)

    def _draw_lags(self, result: SeriesResult | None) -> None:
        page = self.lags_page
        if result is None:
            page.say("Analyse this series (F5) to see how τ changes with the lag order.")
            return
        if result.error is not None or not result.lag_profile:
            page.say(result.error or "No lag profile was computed for this series.")
            return
        page.clear()
        lags = np.array([p.lag for p in result.lag_profile], dtype=float)
        taus = np.array([p.statistic for p in result.lag_profile], dtype=float)
        crit = np.array([p.critical_value for p in result.lag_profile], dtype=float)
        spec = SPEC_NAMES.get(result.lag_profile_spec or "", "")
        where = DIFFERENCE_NAMES.get(result.lag_profile_difference or 0, "")
        plot = page.new_plot(0, False, f"τ by lag order · {where}, {spec}")
        page.legend(plot, self._fg, self._bg, "top-right")
        plot.plot(lags, taus, pen=pg.mkPen(self._line, width=1.5), symbol="o", symbolSize=6,
                  symbolBrush=self._line, name="τ")
        alpha = float(result.settings.get("alpha", 0.05))
        plot.plot(lags, crit, pen=pg.mkPen(self._fg, width=1.2, style=Qt.PenStyle.DashLine),
                  name=f"{alpha:.0%} critical value")
        # Head-room above both lines, so the legend in the top corner covers no point.
        low, high = float(min(taus.min(), crit.min())), float(max(taus.max(), crit.max()))
        span = max(high - low, 0.5)
        plot.setYRange(low - 0.08 * span, high + 0.45 * span, padding=0)
        test = self._profile_test(result)
        if test is not None:
            chosen = pg.InfiniteLine(pos=test.lags, angle=90,
                                     pen=pg.mkPen(self._accent, width=1.5, style=Qt.PenStyle.DotLine),
                                     label=f"chosen: {test.lags}",
                                     labelOpts={"position": 0.9, "color": self._fg,
                                                "fill": self._legend_fill()})
            plot.addItem(chosen)
        plot.setLabel("bottom", "lag order", color=self._fg.name())
        plot.setLabel("left", "τ", color=self._fg.name())
        self._style(plot)
        page.show_plots()

    def _draw_recursive(self, result: SeriesResult | None) -> None:
        """τ on an expanding window (from the engine's evidence) with its critical value."""
        page = self.recursive_page
        if result is None:
            page.say("Analyse this series (F5) to see τ on an expanding window.")
            return
        recursive = result.evidence.recursive if result.evidence is not None else None
        if result.error is not None or recursive is None or len(recursive.ends) == 0:
            page.say(result.error or "No expanding-window statistic was computed for this series.")
            return
        page.clear()
        ends = np.asarray(recursive.ends, dtype=int)
        values = result.values
        dates = False
        if values is not None and len(values) > int(ends.max()):
            x, dates = x_positions(values.index[ends])
        else:
            x = ends.astype(float) + 1
        spec = SPEC_NAMES.get(recursive.spec, recursive.spec)
        level = fmt.percent(recursive.alpha)
        plot = page.new_plot(0, dates, f"τ on an expanding window · {spec}, {recursive.lags} lags")
        page.legend(plot, self._fg, self._bg, "top-right")
        plot.plot(x, np.asarray(recursive.statistics, dtype=float),
                  pen=pg.mkPen(self._line, width=1.5), name="τ up to this date", connect="finite")
        plot.plot(x, np.asarray(recursive.critical_values, dtype=float),
                  pen=pg.mkPen(self._fg, width=1.2, style=Qt.PenStyle.DashLine),
                  name=f"{level} critical value")
        plot.setLabel("bottom", "last observation used" if not dates else "", color=self._fg.name())
        plot.setLabel("left", "τ", color=self._fg.name())
        self._style(plot)
        page.show_plots()

    def _draw_null(self, result: SeriesResult | None) -> None:
        page = self.null_page
        if result is None:
            page.say("Analyse this series (F5) to compare its τ with the distribution under a "
                     "unit root.")
            return
        test = self._profile_test(result) if result.error is None else None
        if test is None:
            page.say(result.error or "No ADF test to show for this series.")
            return
        key = (str(test.spec), int(test.nobs), int(test.lags))
        cached = self._null_cache.get(key)
        if cached is None:
            page.say(f"Simulating the distribution of τ under a unit root for {test.nobs} "
                     "observations…")
            if key not in self._null_pending:
                self._null_pending.add(key)
                QThreadPool.globalInstance().start(_NullTask(key, self._null_signals))
            return
        if isinstance(cached, str):
            page.say(cached)
            return
        self._plot_null(page, cached, test)

    def _null_ready(self, key: Any, value: Any) -> None:
        self._null_pending.discard(key)
        self._null_cache[key] = value
        if self._result is not None and self.NULL not in self._dirty:
            self._draw_null(self._result)

    def _plot_null(self, page: ChartPage, draws: np.ndarray, test: Any) -> None:
        from tauscope.engine.simulate import density_picture

        page.clear()
        picture = density_picture(draws)
        spec = SPEC_NAMES.get(test.spec, test.spec)
        plot = page.new_plot(0, False, f"τ under a unit root · {spec}, {test.nobs} obs.")
        page.legend(plot, self._fg, self._bg, "top-right")
        plot.plot(picture.edges, picture.heights, stepMode="center", fillLevel=0,
                  brush=pg.mkBrush(self._line.red(), self._line.green(), self._line.blue(), 70),
                  pen=pg.mkPen(self._line, width=1.2), name=f"simulated τ ({picture.draws} draws)")
        plot.plot(picture.grid, picture.normal,
                  pen=pg.mkPen(self._fg, width=1.2, style=Qt.PenStyle.DashLine), name="standard normal")
        observed = pg.InfiniteLine(pos=test.statistic, angle=90, pen=pg.mkPen(self._accent, width=2),
                                   label=f"observed τ = {fmt.stat(test.statistic)}",
                                   labelOpts={"position": 0.55, "color": self._fg,
                                              "fill": self._legend_fill()})
        critical = pg.InfiniteLine(
            pos=test.critical_value, angle=90,
            pen=pg.mkPen(self._fg, width=1.5, style=Qt.PenStyle.DotLine),
            label=f"critical value {fmt.stat(test.critical_value)}",
            labelOpts={"position": 0.35, "color": self._fg, "fill": self._legend_fill()})
        plot.addItem(observed)
        plot.addItem(critical)
        plot.setLabel("bottom", "τ", color=self._fg.name())
        plot.setLabel("left", "density", color=self._fg.name())
        self._style(plot)
        page.show_plots()
