"""Each series' chart for the reports, drawn headless by the window's own chart views.

One path for the window (File → Export findings) and ``tauscope batch --out``:
:func:`draw_charts` draws, for every finding a report will hold, the Fitted path view of the
Chart panel (``tauscope.ui.charts.fitted``; the Data view, ``charts.data``, when the verdict
implies no deterministic path or the series could not be tested) on a page never shown on
screen, at a fixed size (:data:`CHART_SIZE` layout units, the HTML report's chart width,
drawn at :data:`CHART_SCALE` pixels per unit, so :data:`CHART_PIXELS` pixels) and in the
light colours of paper (``ChartColors.paper``) whatever the window's palette, and returns
the PNG bytes per series that ``tauscope.report.export`` puts into .xlsx, .html and .pdf.

Without a running Qt application (the command line) an offscreen one is started
(:mod:`tauscope.ui.headless`), so no display is needed.  A chart that fails to draw is left
out with one sentence in :attr:`DrawnCharts.problems`; it never stops the other charts or the
reports.
"""

from __future__ import annotations

import struct
import sys
import time
import zlib
from collections.abc import Callable
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from tauscope.report.html_export import CHART_WIDTH
from tauscope.report.run import RunRecord

if TYPE_CHECKING:
    from PySide6.QtGui import QImage

    from tauscope.data import SeriesData
    from tauscope.engine import SeriesResult
    from tauscope.ui.charts.base import Chart

CHART_SIZE = (CHART_WIDTH, 300)  # laid out at the report's width, so its text is legible
CHART_SCALE = 2  # pixels per layout unit: sharp on paper and on high-density screens
CHART_PIXELS = (CHART_SIZE[0] * CHART_SCALE, CHART_SIZE[1] * CHART_SCALE)
PNG_LEVEL = 1  # zlib level: the fastest; level 6 makes files a fifth smaller at 2.5 times the time

SeriesLookup = Callable[[str], "SeriesData | None"]


@dataclass(frozen=True)
class DrawnCharts:
    """The charts of one report: PNG bytes per series (keyed by ``Finding.key``, else by
    name: a ``tauscope.report.Charts`` mapping), the sentences on charts that could not be
    drawn, and the seconds the drawing took."""

    images: dict[str, bytes]
    problems: tuple[str, ...]
    seconds: float


def png_bytes(image: QImage, level: int = PNG_LEVEL) -> bytes:
    """``image`` as a PNG file: 8-bit RGB, no filter, one zlib stream at ``level`` (W3C, PNG
    Specification, 2nd ed.: §5.2 signature, §11.2.2 IHDR, §11.2.4 IDAT, §11.2.5 IEND, each
    chunk closed by the CRC-32 of its type and data; §9.2 filter type 0 on every line).

    Four to five times faster than Qt's own PNG writer here (about 8 against 40 ms for a
    1240 × 600 chart) for files about a sixth larger; every pixel is kept."""
    from PySide6.QtGui import QImage

    rgb = image.convertToFormat(QImage.Format.Format_RGB888)
    width, height = rgb.width(), rgb.height()
    rows = np.frombuffer(rgb.constBits(), np.uint8, count=rgb.sizeInBytes())
    lines = np.zeros((height, 1 + 3 * width), np.uint8)  # a filter byte (0) before each line
    lines[:, 1:] = rows.reshape(height, rgb.bytesPerLine())[:, :3 * width]

    def chunk(kind: bytes, data: bytes) -> bytes:
        return (struct.pack(">I", len(data)) + kind + data
                + struct.pack(">I", zlib.crc32(kind + data)))

    header = struct.pack(">IIBBBBB", width, height, 8, 2, 0, 0, 0)  # 8 bits, RGB, no interlace
    return (b"\x89PNG\r\n\x1a\n" + chunk(b"IHDR", header)
            + chunk(b"IDAT", zlib.compress(lines.tobytes(), level)) + chunk(b"IEND", b""))


class ChartRenderer:
    """The Data and Fitted path views on pages never shown on screen, each at
    :data:`CHART_SIZE`, in paper colours."""

    def __init__(self) -> None:
        import pyqtgraph as pg
        from PySide6.QtCore import Qt

        from tauscope.ui.charts.base import ChartColors
        from tauscope.ui.charts.data import DataChart
        from tauscope.ui.charts.fitted import FittedChart
        from tauscope.ui.headless import ensure_application

        ensure_application()
        pg.setConfigOptions(antialias=True)  # as the Chart panel draws
        self.data_page = DataChart()
        self.fitted_page = FittedChart()
        for page in (self.data_page, self.fitted_page):
            page.setAttribute(Qt.WidgetAttribute.WA_DontShowOnScreen, True)
            page.set_colors(ChartColors.paper())
            page.resize(*CHART_SIZE)
            # Never painted as a widget (the pictures are drawn by render()): painting a page
            # nobody sees took a fifth of the time.
            page.layout_widget.viewport().setUpdatesEnabled(False)
        _show_quietly((self.data_page, self.fitted_page))

    def page_for(self, series: SeriesData | None, result: SeriesResult) -> Chart | None:
        """The view a report shows for this result, or None when there is nothing to draw."""
        if result.error is None and result.fitted is not None:
            return self.fitted_page
        if series is None and result.values is None:
            return None
        return self.data_page

    def render(self, series: SeriesData | None, result: SeriesResult) -> bytes | None:
        """The view as PNG bytes of :data:`CHART_PIXELS`, or None when there is nothing to draw."""
        from PySide6.QtWidgets import QApplication

        page = self.page_for(series, result)
        if page is None:
            return None
        page.draw_for(series, result)
        if not page.has_plot():
            return None
        view = page.layout_widget
        if (view.width(), view.height()) != CHART_SIZE:
            view.resize(*CHART_SIZE)
        QApplication.processEvents()  # lays the plots out at the page's size
        _settle_axes(page)
        return self.picture(page)

    @staticmethod
    def picture(page: Chart) -> bytes:
        """The page as drawn now, at :data:`CHART_SCALE` times its size, as PNG bytes."""
        from PySide6.QtCore import QRect, QRectF
        from PySide6.QtGui import QImage, QPainter

        image = QImage(*CHART_PIXELS, QImage.Format.Format_RGB32)
        image.fill(page.colors.background)
        painter = QPainter(image)
        try:  # the scene drawn again at CHART_SCALE times its size: lines and text stay sharp
            painter.setRenderHint(QPainter.RenderHint.Antialiasing)
            painter.setRenderHint(QPainter.RenderHint.TextAntialiasing)
            page.layout_widget.render(painter, QRectF(0, 0, *CHART_PIXELS),
                                      QRect(0, 0, *CHART_SIZE))
        finally:
            painter.end()
        return png_bytes(image)

    def close(self) -> None:
        for page in (self.data_page, self.fitted_page):
            page.close()
            page.deleteLater()


def _settle_axes(page: Chart, rounds: int = 6) -> None:
    """Let every axis measure its tick labels and take the room they need before the picture
    is taken.  An axis measures its labels only while it is drawn and then asks for more
    room; a page never drawn on screen would be pictured with labels wider than the room an
    axis starts with ("1000") left out.  The plots take their data's range (pyqtgraph does
    that only when the scene is about to be drawn), each axis works out its labels on a
    scratch painter
    (pyqtgraph's ``generateDrawSpecs``, what its own drawing does first), the layouts follow
    (one level per pass of the event queue), and again until neither the room asked for nor
    the axes' place changes."""
    from PySide6.QtGui import QImage, QPainter
    from PySide6.QtWidgets import QApplication

    axes = [plot.getAxis(side) for plot in page._shown for side in ("left", "bottom")]

    def state() -> list[tuple[float, ...]]:
        return [(axis.textWidth, axis.textHeight, *axis.geometry().getRect()) for axis in axes]

    scratch = QImage(8, 8, QImage.Format.Format_RGB32)
    scene = page.layout_widget.scene()
    for _ in range(rounds):
        before = state()
        scene.prepareForPaint()  # what a drawing does first: the plots take their data's range
        painter = QPainter(scratch)
        try:
            for axis in axes:
                axis.generateDrawSpecs(painter)
        finally:
            painter.end()
        QApplication.sendPostedEvents()
        QApplication.processEvents()
        if state() == before:
            return


def _show_quietly(pages: tuple[Chart, ...]) -> None:
    """Show the pages (off screen: they are laid out only once shown) without the offscreen
    platform's warning that it cannot pass size hints on, which would be a stray line on the
    command line's standard error; any other message from Qt still goes there."""
    from PySide6.QtCore import QtMsgType, qInstallMessageHandler

    def handler(_kind: QtMsgType, _context: object, message: str) -> None:
        if "propagateSizeHints" not in message:
            print(message, file=sys.stderr)

    previous = qInstallMessageHandler(handler)
    try:
        for page in pages:
            page.show()
    finally:
        qInstallMessageHandler(previous)


def draw_charts(run: RunRecord, series_for_key: SeriesLookup | None = None) -> DrawnCharts:
    """The chart of every finding the report of ``run`` holds (``run.current()``), as PNG
    bytes keyed by ``Finding.key`` (by name when it has none).

    ``series_for_key``: the series a finding was made from (for the Data view of a series
    that could not be tested); without it, the values the result carries.  A chart that
    fails to draw is left out with one sentence naming the series; the others are drawn.
    """
    start = time.perf_counter()
    images: dict[str, bytes] = {}
    problems: list[str] = []
    findings = run.current().findings
    if not findings:
        return DrawnCharts(images, (), 0.0)
    try:
        renderer = ChartRenderer()
    except Exception as exc:  # no chart at all, but the reports are still written
        reason = f"{type(exc).__name__}: {exc}".replace("\n", " ")
        return DrawnCharts(images, (f"the charts could not be drawn ({reason})",),
                           time.perf_counter() - start)
    try:
        for finding in findings:
            series = (series_for_key(finding.key) if series_for_key is not None
                      and finding.key is not None else None)
            try:
                png = renderer.render(series, finding.result)
            except Exception as exc:  # one bad series never stops the others
                reason = f"{type(exc).__name__}: {exc}".replace("\n", " ")
                problems.append(f"{finding.name}: its chart could not be drawn ({reason})")
                continue
            if png:
                images[finding.key if finding.key is not None else finding.name] = png
    finally:
        renderer.close()
    return DrawnCharts(images, tuple(problems), time.perf_counter() - start)


def problems_text(drawn: DrawnCharts) -> str:
    """The problems as one line ("" when there are none): each chart left out, and that the
    reports were written without it."""
    if not drawn.problems:
        return ""
    return "; ".join(drawn.problems) + " (left out of the reports)"
