"""Each series' chart as PNG bytes for the reports, drawn offscreen by the chart views the
window shows (``tauscope.ui.charts``)."""

from __future__ import annotations

from collections.abc import Callable, Mapping
from typing import TYPE_CHECKING, Any

from PySide6.QtCore import QBuffer, QByteArray, QIODevice, QRect, QRectF, Qt
from PySide6.QtGui import QPainter, QPalette, QPixmap
from PySide6.QtWidgets import QApplication

from tauscope.engine import SeriesResult
from tauscope.report.html_export import CHART_WIDTH

if TYPE_CHECKING:
    from tauscope.data import SeriesData
    from tauscope.ui.charts.panel import ChartPanel

CHART_SIZE = (CHART_WIDTH, 300)  # laid out at the report's width, so its text is legible
CHART_SCALE = 2  # pixels per layout unit: sharp on paper and on high-density screens


def png_bytes(pixmap: object) -> bytes:
    data = QByteArray()
    buffer = QBuffer(data)
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    pixmap.save(buffer, "PNG")  # type: ignore[attr-defined]
    buffer.close()
    return bytes(data.data())


class ChartRenderer:
    """Draws series charts offscreen (a chart panel never shown on screen) for reports."""

    def __init__(self) -> None:
        from tauscope.ui.charts.panel import ChartPanel

        self.panel: ChartPanel = ChartPanel()
        self.panel.setAttribute(Qt.WidgetAttribute.WA_DontShowOnScreen, True)
        self.panel.resize(*CHART_SIZE)
        self.panel.show()

    def render(self, series: SeriesData | None, result: SeriesResult) -> bytes | None:
        """The fitted-path view (the data view when there is no fitted path) as PNG bytes."""
        panel = self.panel
        tab = 1 if result.error is None and result.fitted is not None else 0
        if tab == 0 and series is None and result.values is None:
            return None
        panel.tabs.setCurrentIndex(tab)
        panel.display(series, result)
        page = panel.fitted_page if tab == 1 else panel.data_page
        if not page.has_plot():
            return None
        QApplication.processEvents()
        view: Any = page.layout_widget
        size = view.size()
        pixmap = QPixmap(size.width() * CHART_SCALE, size.height() * CHART_SCALE)
        pixmap.fill(panel.palette().color(QPalette.ColorRole.Base))
        painter = QPainter(pixmap)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        painter.setRenderHint(QPainter.RenderHint.TextAntialiasing)
        # Legends ignore the view's scaling (they keep their size on screen while zooming),
        # so they are scaled by hand for the drawing at twice the size.
        legends = [p.legend for p in page._shown if p.legend is not None]
        for legend in legends:
            legend.setScale(CHART_SCALE)
        QApplication.processEvents()
        try:  # the scene drawn again at twice the size: lines and text stay sharp
            view.render(painter, QRectF(0, 0, pixmap.width(), pixmap.height()),
                        QRect(0, 0, size.width(), size.height()))
        finally:
            for legend in legends:
                legend.setScale(1.0)
            painter.end()
        return png_bytes(pixmap)

    def close(self) -> None:
        self.panel.close()
        self.panel.deleteLater()


def render_charts(results: Mapping[str, SeriesResult],
                  series_for_key: Callable[[str], SeriesData | None]) -> dict[str, bytes]:
    """PNG bytes per series key for every finding that has something to draw."""
    renderer = ChartRenderer()
    charts: dict[str, bytes] = {}
    try:
        for key, result in results.items():
            png = renderer.render(series_for_key(key), result)
            if png:
                charts[key] = png
    finally:
        renderer.close()
    return charts
