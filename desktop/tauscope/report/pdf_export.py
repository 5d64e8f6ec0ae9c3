"""PDF of the HTML report through Qt's own PDF writer (QTextDocument + QPdfWriter).

The only Qt use in ``report/``: PySide6 is imported inside the functions so
the other writers, the command line and the tests of the rest never load Qt.
Without a running Qt application (the command line), an offscreen one is
started for the fonts and images.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.html_export import run_to_html
from tauscope.report.run import Charts, RunRecord

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
    from PySide6.QtCore import QBuffer, QByteArray, QIODevice, QMarginsF, QSizeF, QUrl
    from PySide6.QtGui import (
        QImage,
        QPageLayout,
        QPageSize,
        QPdfWriter,
        QTextDocument,
    )

    images: list[tuple[str, bytes]] = []

    def resource_name(index: int, png: bytes) -> str:
        name = f"tauscope-chart-{index}.png"
        images.append((name, png))
        return name

    markup = run_to_html(run, charts, image_source=resource_name)
    document = QTextDocument()
    for name, png in images:
        image = QImage()
        image.loadFromData(png, "PNG")
        document.addResource(QTextDocument.ResourceType.ImageResource, QUrl(name), image)
    document.setHtml(markup)

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
    # Lay the text out on a page LAYOUT_WIDTH units wide; print() scales it to the paper,
    # so the 10.5 pt body text comes out at about 10.5 × (paper width / LAYOUT_WIDTH).
    page = writer.pageLayout().paintRect(QPageLayout.Unit.Point)
    height = LAYOUT_WIDTH * page.height() / page.width()
    document.setPageSize(QSizeF(LAYOUT_WIDTH, height))
    document.print_(writer)
    buffer.close()
    return bytes(data.data())


def write_pdf(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_pdf(run, charts))
