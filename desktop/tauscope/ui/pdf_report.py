"""PDF of the HTML report through Qt's own PDF writer (QTextDocument + QPdfWriter), cut
into pages where no table row, line or chart is split (:mod:`tauscope.ui.pdf_pages`).

Lives in ``ui/`` because it needs Qt ("Qt only in ui/").  Importing this module
registers the ``.pdf`` writer with :func:`tauscope.report.register_writer`, so
``tauscope.report.export`` (window and ``tauscope batch``) writes PDF too.
PySide6 is imported inside the functions: importing the module does not load Qt.
Without a running Qt application (the command line), an offscreen one is
started for the fonts and images.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from tauscope.report import register_writer
from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.html_export import CHART_WIDTH, run_to_html
from tauscope.report.run import Charts, RunRecord
from tauscope.ui.pdf_pages import Page, cut_pages, document_units

PAGE_MARGIN_MM = 18.0
RESOLUTION_DPI = 300
LAYOUT_WIDTH = 1000.0
_APP: list[Any] = []  # keeps an application started here alive


def _ensure_application() -> None:
    from PySide6.QtCore import QCoreApplication
    from PySide6.QtWidgets import QApplication

    # A widgets application (not just a GUI one), so that a window opened later in the
    # same process can still use it.
    if QCoreApplication.instance() is None:
        _APP.append(QApplication(["tauscope", "-platform", "offscreen"]))


def run_to_pdf(run: RunRecord, charts: Charts | None = None) -> bytes:
    """The HTML report laid out on A4 pages, as PDF bytes."""
    _ensure_application()
    from PySide6.QtCore import QBuffer, QByteArray, QIODevice, QMarginsF, QUrl
    from PySide6.QtGui import (
        QImage,
        QPageLayout,
        QPageSize,
        QPainter,
        QPdfWriter,
        QTextDocument,
    )

    images: list[tuple[str, bytes]] = []

    def resource_name(index: int, png: bytes) -> str:
        name = f"tauscope-chart-{index}.png"
        images.append((name, png))
        return name

    markup = run_to_html(run, charts, image_source=resource_name)
    # The report's line height (1.4) would stretch a line holding a chart in QTextDocument
    # (it scales the whole line, image included), leaving a gap below every chart.
    markup = markup.replace("<p><img ", '<p style="line-height: 100%;"><img ')
    document = QTextDocument()
    for name, png in images:
        image = QImage()
        image.loadFromData(png, "PNG")
        # Lay a chart out at the report's chart width whatever its pixel size (QTextDocument
        # would otherwise reserve its full pixel height and leave a gap below it).
        if image.width() > CHART_WIDTH:
            image.setDevicePixelRatio(image.width() / CHART_WIDTH)
        document.addResource(QTextDocument.ResourceType.ImageResource, QUrl(name), image)
    document.setHtml(markup)

    document.setTextWidth(LAYOUT_WIDTH)  # one long page; cut_pages chooses the page breaks

    data = QByteArray()
    buffer = QBuffer(data)
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    writer = QPdfWriter(buffer)
    writer.setResolution(RESOLUTION_DPI)
    writer.setTitle("Tauscope findings")
    writer.setCreator(f"Tauscope {run.version}")
    writer.setPageLayout(QPageLayout(
        QPageSize(QPageSize.PageSizeId.A4), QPageLayout.Orientation.Portrait,
        QMarginsF(PAGE_MARGIN_MM, PAGE_MARGIN_MM, PAGE_MARGIN_MM, PAGE_MARGIN_MM),
        QPageLayout.Unit.Millimeter,
    ))
    # The text is laid out LAYOUT_WIDTH units wide and scaled to the paper, so the 10.5 pt
    # body text comes out at about 10.5 × (paper width / LAYOUT_WIDTH).
    paint = writer.pageLayout().paintRectPixels(RESOLUTION_DPI)
    scale = paint.width() / LAYOUT_WIDTH
    pages = cut_pages(document_units(document), document.size().height(),
                      paint.height() / scale)
    painter = QPainter(writer)
    try:
        for number, page in enumerate(pages):
            if number:
                writer.newPage()
            _draw_page(painter, document, page, scale)
    finally:
        painter.end()
    buffer.close()
    return bytes(data.data())


CLIP_INSET = 1.0
"""Layout units kept off each edge of a page's slice: a block only touching the slice (the
first row of the next page) is then not drawn at all, not even as clipped, invisible text."""


def _inside(top: float, bottom: float) -> Any:
    from PySide6.QtCore import QRectF

    return QRectF(0, top + CLIP_INSET, LAYOUT_WIDTH, max(bottom - top - 2 * CLIP_INSET, 0.0))


def _draw_page(painter: Any, document: Any, page: Page, scale: float) -> None:
    """The header rows to repeat (if any), then the page's slice of the document."""
    painter.save()
    painter.scale(scale, scale)
    if page.header_height > 0:
        painter.save()
        painter.translate(0, -page.header_top)
        document.drawContents(painter, _inside(page.header_top, page.header_bottom))
        painter.restore()
    painter.translate(0, page.header_height - page.top)
    document.drawContents(painter, _inside(page.top, page.bottom))
    painter.restore()


def write_pdf(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_pdf(run, charts))


register_writer(".pdf", write_pdf)
