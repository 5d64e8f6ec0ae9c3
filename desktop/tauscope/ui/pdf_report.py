"""The ``.pdf`` writer: the report's own PDF writer, or Qt's when the bundled font lacks a
character of the report.

The report is laid out once (:func:`tauscope.report.pdf_layout.layout_report`) and cut into
pages where nothing is split (:func:`tauscope.report.pdf_pages.cut_pages`).  It is written by
:func:`tauscope.report.pdf_direct.run_to_pdf_direct` (no Qt, the bundled DejaVu Sans) unless
that raises :class:`~tauscope.report.pdf_direct.MissingGlyphs` (a series named in a script
the font does not cover, say); then the same layout is drawn with QPainter on Qt's PDF writer
(QPdfWriter), whose fonts fall back to any the system has for the character.

Lives in ``ui/`` because the second route needs Qt ("Qt only in ui/").  Importing this module
registers the ``.pdf`` writer with :func:`tauscope.report.register_writer`, so
``tauscope.report.export`` (window and ``tauscope batch``) writes PDF too.  PySide6 is
imported only when Qt's route is taken; without a running Qt application (the command line),
an offscreen one is started then (:mod:`tauscope.ui.headless`).
"""

from __future__ import annotations

from collections.abc import Sequence
from pathlib import Path
from typing import TYPE_CHECKING

from tauscope.report import register_writer
from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.pdf_direct import MARGIN_MM, MissingGlyphs, run_to_pdf_direct
from tauscope.report.pdf_flow import WIDTH, draw_page, pixels
from tauscope.report.pdf_layout import layout_report
from tauscope.report.pdf_pages import cut_pages
from tauscope.report.run import Charts, RunRecord

if TYPE_CHECKING:
    from PySide6.QtGui import QFont, QFontMetricsF, QGlyphRun, QPainter

    from tauscope.report.chart_plan import ChartPlan
    from tauscope.report.pdf_flow import Style

RESOLUTION_DPI = 300
FAMILIES = ["Segoe UI", "Helvetica Neue", "Arial", "DejaVu Sans", "sans-serif"]


class QtFace:
    """A QFont at ``size`` pixels, measured with its metrics."""

    def __init__(self, size: int, bold: bool, italic: bool) -> None:
        from PySide6.QtGui import QFont, QFontMetricsF

        self.font: QFont = QFont()
        self.font.setFamilies(FAMILIES)
        self.font.setPixelSize(size)
        self.font.setBold(bold)
        self.font.setItalic(italic)
        self.metrics: QFontMetricsF = QFontMetricsF(self.font)
        self.key = "qt:" + self.font.key()
        self.ascent = self.metrics.ascent()
        self.height = self.metrics.height()
        self.shaped: dict[str, tuple[float, tuple[QGlyphRun, ...]]] = {}
        """Lines already shaped in this face, by text; kept with the face, which one report
        makes and drops, never across reports: a glyph run holds the font of the thread that
        shaped it, and the window writes each export in a thread of its own."""
        self.seen: set[str] = set()
        """Lines drawn once in this face and not shaped (yet)."""

    def advance(self, text: str) -> float:
        return self.metrics.horizontalAdvance(text)


class QtCanvas:
    """The layout drawn with ``painter``; a line of text met again in the report is drawn
    from the glyph runs kept from its first shaping (shaping costs about half of what
    drawing a line of text on the PDF writer does)."""

    def __init__(self, painter: QPainter) -> None:
        self.painter = painter

    def text(self, x: float, baseline: float, text: str, style: Style) -> None:
        from PySide6.QtCore import QPointF
        from PySide6.QtGui import QColor, QTextLayout

        face = style.face
        assert isinstance(face, QtFace)
        painter = self.painter
        painter.setFont(face.font)
        painter.setPen(QColor(style.color))
        shaped = face.shaped.get(text)
        if shaped is None:
            if text not in face.seen:  # drawn once so far: shaping to keep would cost more
                face.seen.add(text)
                painter.drawText(QPointF(x, baseline), text)
                return
            layout = QTextLayout(text, face.font)
            layout.beginLayout()
            line = layout.createLine()
            layout.endLayout()
            shaped = face.shaped[text] = (line.ascent() if line.isValid() else 0.0,
                                          tuple(layout.glyphRuns()))
        ascent, runs = shaped
        origin = QPointF(x, baseline - ascent)
        for run in runs:
            painter.drawGlyphRun(origin, run)

    def texts(self, placed: Sequence[tuple[float, float, str]], style: Style) -> None:
        for x, baseline, text in placed:
            self.text(x, baseline, text, style)

    def fill_rect(self, x: float, y: float, width: float, height: float, color: str) -> None:
        from PySide6.QtCore import QRectF
        from PySide6.QtGui import QColor

        self.painter.fillRect(QRectF(x, y, width, height), QColor(color))

    def line(self, x1: float, y1: float, x2: float, y2: float, color: str) -> None:
        from PySide6.QtCore import QPointF
        from PySide6.QtGui import QColor

        self.painter.setPen(QColor(color))
        self.painter.drawLine(QPointF(x1, y1), QPointF(x2, y2))

    def chart(self, plan: ChartPlan, top: float, scale: float) -> None:
        from tauscope.ui.chart_paint import paint_plan

        self.painter.save()
        self.painter.translate(0, top)
        self.painter.scale(scale, scale)
        paint_plan(self.painter, plan)
        self.painter.restore()

    def save(self) -> None:
        self.painter.save()

    def restore(self) -> None:
        self.painter.restore()

    def translate(self, dx: float, dy: float) -> None:
        self.painter.translate(dx, dy)

    def clip(self, x: float, y: float, width: float, height: float) -> None:
        from PySide6.QtCore import QRectF

        self.painter.setClipRect(QRectF(x, y, width, height))


def run_to_pdf_qt(run: RunRecord, charts: Charts | None = None) -> bytes:
    """The report on A4 pages drawn through Qt, as PDF bytes."""
    from tauscope.ui.headless import ensure_application

    ensure_application()
    from PySide6.QtCore import QBuffer, QByteArray, QIODevice, QMarginsF
    from PySide6.QtGui import QPageLayout, QPageSize, QPainter, QPdfWriter

    faces: dict[tuple[int, bool, bool], QtFace] = {}

    def font(points: float, bold: bool = False, italic: bool = False) -> QtFace:
        key = (pixels(points), bold, italic)
        if key not in faces:
            faces[key] = QtFace(*key)
        return faces[key]

    flow = layout_report(run, charts, font)
    data = QByteArray()
    buffer = QBuffer(data)
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    writer = QPdfWriter(buffer)
    writer.setResolution(RESOLUTION_DPI)
    writer.setTitle("Tauscope findings")
    writer.setCreator(f"Tauscope {run.version}")
    writer.setPageLayout(QPageLayout(
        QPageSize(QPageSize.PageSizeId.A4), QPageLayout.Orientation.Portrait,
        QMarginsF(MARGIN_MM, MARGIN_MM, MARGIN_MM, MARGIN_MM),
        QPageLayout.Unit.Millimeter,
    ))
    # The column is laid out WIDTH units wide and scaled to the paper, so the 10.5 pt body
    # text comes out at about 10.5 × (paper width / WIDTH) × 96 / 72.
    paint = writer.pageLayout().paintRectPixels(RESOLUTION_DPI)
    scale = paint.width() / WIDTH
    pages = cut_pages(flow.units, flow.y, paint.height() / scale)
    tops = [piece.top for piece in flow.pieces]
    painter = QPainter(writer)
    canvas = QtCanvas(painter)
    try:
        for number, page in enumerate(pages):
            if number:
                writer.newPage()
            painter.save()
            painter.scale(scale, scale)
            draw_page(canvas, flow, tops, page)
            painter.restore()
    finally:
        painter.end()
    buffer.close()
    return bytes(data.data())


def run_to_pdf(run: RunRecord, charts: Charts | None = None) -> bytes:
    """The report as PDF bytes: the report's own writer, or Qt's when that cannot write a
    character of it."""
    try:
        return run_to_pdf_direct(run, charts)
    except MissingGlyphs:
        return run_to_pdf_qt(run, charts)


def write_pdf(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_pdf(run, charts))


register_writer(".pdf", write_pdf)
