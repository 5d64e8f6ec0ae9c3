"""The Chart panel (pyqtgraph): the data, and after analysis the fitted path, the
statistic across lag orders, τ on an expanding window, the null distribution of
the statistic and the seasons of a quarterly or monthly series, one tab per chart.  Each
view can be saved as PNG or SVG from its context menu."""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING, Any

import pyqtgraph as pg
from PySide6.QtCore import QPoint
from PySide6.QtWidgets import QMenu, QTabWidget, QVBoxLayout, QWidget

from tauscope.ui.charts.base import Chart, ChartColors, ChartPage
from tauscope.ui.charts.data import DataChart
from tauscope.ui.charts.fitted import FittedChart
from tauscope.ui.charts.lags import LagsChart
from tauscope.ui.charts.null import NullChart
from tauscope.ui.charts.recursive import RecursiveChart
from tauscope.ui.charts.seasons import SeasonsChart

if TYPE_CHECKING:
    from tauscope.data import SeriesData
    from tauscope.engine import SeriesResult


class ChartPanel(QWidget):
    """Tabs: Data, Fitted path, Lags, Over time, Null distribution, Seasons.  Only
    the chart in front is drawn; the others when their tab is chosen."""

    DATA, FITTED, LAGS, RECURSIVE, NULL, SEASONS = range(6)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        pg.setConfigOptions(antialias=True)
        self.tabs = QTabWidget(self)
        self.tabs.setAccessibleName("Chart views")
        self.data_page = DataChart(self)
        self.fitted_page = FittedChart(self)
        self.lags_page = LagsChart(self)
        self.recursive_page = RecursiveChart(self)
        self.null_page = NullChart(self)
        self.seasons_page = SeasonsChart(self)
        for i, chart in enumerate(self.pages()):
            self.tabs.addTab(chart, chart.tab)
            self.tabs.setTabToolTip(i, chart.tip + "\nPress F1 for the guide's section on this chart.")
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.addWidget(self.tabs)
        # (title, start, filters) -> chosen path or ""; the window replaces it (and tests do)
        self.save_path_asker: Callable[[str, str, str], str] = self._ask_save_path
        self.saved_message = ""
        for page in self.pages():
            page.layout_widget.customContextMenuRequested.connect(
                lambda pos, p=page: self._context_menu(p, pos))
        self._series: SeriesData | None = None
        self._result: SeriesResult | None = None
        self._stale_colors = False
        self.tabs.currentChanged.connect(self._draw_current)
        self._apply_colors()
        self.show_nothing()

    def _show_seasons_tab(self, result: SeriesResult | None) -> None:
        """The Seasons tab only for a result with a seasonal part (quarterly or monthly), so
        the other tabs keep the width the window's layout gives them."""
        self.tabs.setTabVisible(self.SEASONS, result is not None and result.seasonal is not None)

    def pages(self) -> tuple[Chart, ...]:
        return (self.data_page, self.fitted_page, self.lags_page, self.recursive_page,
                self.null_page, self.seasons_page)

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
        return self.pages()[max(self.tabs.currentIndex(), 0)].guide

    # colours ------------------------------------------------------------
    def _apply_colors(self) -> None:
        colors = ChartColors.from_palette(self.palette())
        for page in self.pages():
            page.set_colors(colors)

    def changeEvent(self, event: Any) -> None:
        super().changeEvent(event)
        if not hasattr(self, "_stale_colors"):
            return  # still being built
        if event.type() in (event.Type.PaletteChange, event.Type.ApplicationPaletteChange):
            self._apply_colors()
            self._stale_colors = True  # redraw in the new colours
            self.display(self._series, self._result)

    # content ------------------------------------------------------------
    def show_nothing(self) -> None:
        self._series, self._result = None, None
        self._show_seasons_tab(None)
        for page in self.pages():
            page.show_idle()

    def display(self, series: SeriesData | None, result: SeriesResult | None) -> None:
        """Show one series (and its result, once analysed).  Only the view in front is
        drawn now; the others when their tab is chosen."""
        if series is self._series and result is self._result and not self._stale_colors:
            return
        same_data = series is not None and series is self._series and not self._stale_colors \
            and not self.data_page.stale
        self._stale_colors = False
        self._series, self._result = series, result
        self._show_seasons_tab(result)
        if series is None and result is None:
            self.show_nothing()
            return
        for page in self.pages():
            if page is not self.data_page or not same_data:
                page.series, page.result, page.stale = series, result, True
        self._draw_current()

    def _draw_current(self, *_args: Any) -> None:
        index = self.tabs.currentIndex()
        page = self.pages()[index] if 0 <= index < len(self.pages()) else None
        if page is not None and page.stale:
            page.draw_for(page.series, page.result)
