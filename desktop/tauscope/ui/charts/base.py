"""What every chart shares: x positions for a date axis, a page that holds the plots of
one view (or a sentence when there is nothing to draw) and saves them as PNG or SVG, the
colours of the palette, and the base of each chart (``Chart``)."""

from __future__ import annotations

import html
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np
import pandas as pd
import pyqtgraph as pg
from PySide6.QtCore import Qt
from PySide6.QtGui import QColor, QPalette
from PySide6.QtWidgets import QLabel, QStackedWidget, QWidget

if TYPE_CHECKING:
    from tauscope.data import SeriesData
    from tauscope.engine import SeriesResult

_EPOCH = pd.Timestamp("1970-01-01")


def x_positions(index: pd.Index) -> tuple[np.ndarray, bool]:
    """Seconds since 1970 for dated series (for the date axis), else observation numbers."""
    if isinstance(index, pd.PeriodIndex):
        stamps = index.to_timestamp(how="start")
        return np.asarray((stamps - _EPOCH) / pd.Timedelta(seconds=1), dtype=float), True
    if isinstance(index, pd.DatetimeIndex):
        naive = index.tz_localize(None) if index.tz is not None else index
        return np.asarray((naive - _EPOCH) / pd.Timedelta(seconds=1), dtype=float), True
    try:
        return np.asarray(index, dtype=float), False
    except (TypeError, ValueError):
        return np.arange(1, len(index) + 1, dtype=float), False


class ChartPage(QStackedWidget):
    """A plot area that can show a sentence instead when there is nothing to draw."""

    def __init__(self, name: str, parent: QWidget | None = None, dates: bool = False) -> None:
        super().__init__(parent)
        self.message = QLabel(self)
        self.message.setWordWrap(True)
        self.message.setAlignment(Qt.AlignmentFlag.AlignCenter)
        self.message.setMargin(16)
        self.layout_widget = pg.GraphicsLayoutWidget(self)
        self.layout_widget.setAccessibleName(name)
        # Our own menu (save as PNG/SVG) instead of pyqtgraph's: see charts.panel.
        self.layout_widget.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.addWidget(self.message)
        self.addWidget(self.layout_widget)
        self.setAccessibleName(name)
        self.dates = dates
        self._plots: dict[tuple[int, bool], pg.PlotItem] = {}
        self._shown: list[pg.PlotItem] = []
        self._keys: dict[int, pg.LabelItem] = {}
        self._shown_keys: list[pg.LabelItem] = []

    def say(self, text: str) -> None:
        self.message.setText(text)
        self.setCurrentWidget(self.message)

    def new_plot(self, row: int = 0, dates: bool = False, title: str = "") -> pg.PlotItem:
        """An empty plot in this row, reused between drawings (making a PlotItem is slow);
        ``title`` is plain text."""
        key = (row, dates)
        plot = self._plots.get(key)
        if plot is None:
            axis = {"bottom": pg.DateAxisItem(orientation="bottom", utcOffset=0)} if dates else None
            plot = self.layout_widget.addPlot(row=row, col=0, axisItems=axis)
            plot.showGrid(x=True, y=True, alpha=0.15)
            plot.setClipToView(True)
            plot.setDownsampling(auto=True, mode="peak")
            plot.setMenuEnabled(False)
            self._plots[key] = plot
        else:
            self.layout_widget.addItem(plot, row=row, col=0)
            plot.clear()
            plot.setXLink(None)
            plot.enableAutoRange()
            for side in ("left", "bottom"):
                fresh_text_space(plot.getAxis(side))
        # pyqtgraph reads a title as rich text: a series named "Output <real>" keeps its name
        plot.setTitle(html.escape(title, quote=False) if title else None)
        self._shown.append(plot)
        return plot

    def key_below(self, plot: pg.PlotItem, row: int, color: QColor) -> pg.LabelItem:
        """The key to a plot's named curves, on a line of its own below the plot (row
        ``row`` of the page), so that it never covers a line, a point or a label."""
        entries = []
        for item in plot.listDataItems():
            name = item.name()
            if name:
                entries.append(f"{_sample(item)}&nbsp;{html.escape(str(name))}")
        key = self._keys.get(row)
        if key is None:
            key = pg.LabelItem(justify="center")
            self._keys[row] = key
        self.layout_widget.addItem(key, row=row, col=0)
        key.setText("&nbsp;&nbsp;&nbsp;&nbsp;".join(entries), color=color.name(), size="9pt")
        key.setAttr("justify", "center")
        self._shown_keys.append(key)
        return key

    def show_plots(self) -> None:
        self.setCurrentWidget(self.layout_widget)

    def has_plot(self) -> bool:
        return self.currentWidget() is self.layout_widget

    def save_png(self, path: Path | str) -> None:
        """The view as drawn on screen, as a PNG picture."""
        if not self.layout_widget.grab().save(str(path), "PNG"):
            raise OSError(f"{Path(path).name} could not be written")

    def save_svg(self, path: Path | str) -> None:
        """The view as an SVG drawing: the scene painted through Qt's SVG generator (lines and
        text stay vectors).  pyqtgraph's own SVG exporter fails on the paths this Qt writes."""
        from PySide6.QtCore import QRectF, QSize
        from PySide6.QtGui import QPainter
        from PySide6.QtSvg import QSvgGenerator

        view = self.layout_widget
        size = view.viewport().size()
        generator = QSvgGenerator()
        generator.setFileName(str(path))
        generator.setSize(QSize(size.width(), size.height()))
        generator.setViewBox(QRectF(0, 0, size.width(), size.height()))
        generator.setTitle(self.accessibleName())
        generator.setDescription("Drawn by Tauscope")
        painter = QPainter()
        if not painter.begin(generator):
            raise OSError(f"{Path(path).name} could not be written")
        try:
            view.render(painter)
        finally:
            painter.end()
        if not Path(path).is_file() or Path(path).stat().st_size == 0:
            raise OSError(f"{Path(path).name} could not be written")

    def clear(self) -> None:
        """Take the plots off the page (they are kept for the next drawing)."""
        for plot in self._shown:
            self.layout_widget.removeItem(plot)
        for key in self._shown_keys:
            self.layout_widget.removeItem(key)
        self._shown = []
        self._shown_keys = []


@dataclass(frozen=True)
class ChartColors:
    """The colours of every chart, taken from the palette (light or dark)."""

    background: QColor
    text: QColor
    line: QColor
    accent: QColor

    @classmethod
    def from_palette(cls, palette: QPalette) -> ChartColors:
        background = palette.color(QPalette.ColorRole.Base)
        dark = background.lightness() < 128
        return cls(background=background, text=palette.color(QPalette.ColorRole.Text),
                   line=QColor("#7fb2ff") if dark else QColor("#1f4e99"),
                   accent=QColor("#ffb347") if dark else QColor("#b35900"))

    @classmethod
    def paper(cls) -> ChartColors:
        """The light colours of the reports' charts, whatever the window's palette: a report
        is read on white paper or a white page."""
        return cls(background=QColor("#ffffff"), text=QColor("#1a1a1a"),
                   line=QColor("#1f4e99"), accent=QColor("#b35900"))

    def legend_fill(self) -> QColor:
        fill = QColor(self.background)
        fill.setAlpha(215)
        return fill


class Chart(ChartPage):
    """One view of the Chart panel.  A subclass names its tab and draws one series (and its
    result, once analysed) in :meth:`draw`; the panel decides when."""

    title = ""  # accessible name of the page
    tab = ""  # text of its tab
    tip = ""  # tooltip of its tab
    guide = ""  # anchor of its section in the guide
    idle_text = "Analyse a series (F5) to see this view."

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(self.title, parent)
        self.colors = ChartColors.from_palette(self.palette())
        self.series: SeriesData | None = None
        self.result: SeriesResult | None = None
        self.stale = False  # to be drawn again when next shown

    def set_colors(self, colors: ChartColors) -> None:
        self.colors = colors
        self.layout_widget.setBackground(colors.background)

    def show_idle(self) -> None:
        """Nothing chosen: the page's sentence instead of a chart."""
        self.series, self.result, self.stale = None, None, False
        self.say(self.idle_text)

    def draw_for(self, series: SeriesData | None, result: SeriesResult | None) -> None:
        self.series, self.result, self.stale = series, result, False
        self.draw()

    def draw(self) -> None:
        """Draw ``self.series`` and ``self.result`` (either may be None)."""
        raise NotImplementedError

    def add_key(self, plot: pg.PlotItem, row: int = 1) -> None:
        """The key to the plot's named curves, below it (call after the curves are drawn)."""
        self.key_below(plot, row, self.colors.text)

    def style_plot(self, plot: pg.PlotItem) -> None:
        """Axes and title in the text colour, plain numbers on the axes."""
        fg = self.colors.text
        for name in ("left", "bottom"):
            axis = plot.getAxis(name)
            plain_numbers(axis)
            axis.setPen(fg)
            axis.setTextPen(fg)
        title = plot.titleLabel.text
        if title:  # the colour applies when the text is set again
            plot.titleLabel.setText(title, color=fg.name())


def fresh_text_space(axis: pg.AxisItem) -> None:
    """The room for tick labels a new axis starts with (30 × 18 pixels, pyqtgraph's own start).

    An axis keeps the room of the widest labels it has drawn unless the new ones are more than
    10 pixels narrower, so a reused plot would draw a series differently after another one;
    starting afresh makes each drawing depend on its own series only (the reports' charts are
    the same whatever was drawn before)."""
    axis.textWidth, axis.textHeight = 30, 18
    if axis.orientation in ("left", "right"):
        axis._updateWidth()
    else:
        axis._updateHeight()


def plain_numbers(axis: pg.AxisItem) -> None:
    """Numbers on an axis as they are, never scaled by a power of ten ("(x0.001)").

    Turning pyqtgraph's automatic prefix off still takes the scale of the range shown at that
    moment (a density from 0 to 0.6 read 0 to 600), so the ranges where it may scale are
    emptied first."""
    if hasattr(axis, "setSIPrefixEnableRanges"):
        axis.setSIPrefixEnableRanges(())
    axis.enableAutoSIPrefix(False)
    axis.autoSIPrefixScale = 1.0
    axis.labelUnitPrefix = ""
    axis.picture = None
    axis.update()


def _sample(item: Any) -> str:
    """A short drawing of a curve in text: a filled square for a filled area, else a line
    (solid, dashed or dotted) in the curve's colour."""
    opts = item.opts
    pen = pg.mkPen(opts.get("pen"))
    if opts.get("fillLevel") is not None and opts.get("fillBrush") is not None:
        color = pg.mkBrush(opts["fillBrush"]).color()
        color.setAlpha(255)
        return f"<span style='color:{color.name()}'>&#9632;</span>"
    glyph = {Qt.PenStyle.DashLine: "&#9476;&#9476;", Qt.PenStyle.DotLine: "&#9480;&#9480;"}.get(
        pen.style(), "&#9473;&#9473;")
    symbol = "&#9679;" if opts.get("symbol") else ""
    return f"<span style='color:{pen.color().name()}'>{glyph[:7]}{symbol}{glyph[7:]}</span>"


def profile_test(result: SeriesResult) -> Any:
    """The ADF test whose lag profile the result keeps (the one the lag and null charts show)."""
    if result.lag_profile_spec is None:
        return None
    return result.find("adf", result.lag_profile_spec, result.lag_profile_difference or 0)
