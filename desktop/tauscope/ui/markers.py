"""Verdict markers that do not rely on colour: each verdict has its own shape and word."""

from __future__ import annotations

from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QIcon, QPainter, QPen, QPixmap, QPolygonF

from tauscope.engine import SeriesResult

# kind -> (word shown beside the shape, meaning for tooltips and screen readers)
MARKERS = {
    "i0": ("stationary", "circle: stationary, no unit root (I(0))"),
    "i1": ("one unit root", "triangle: one unit root (I(1))"),
    "i2": ("two unit roots", "square: two unit roots (I(2))"),
    "unresolved": ("unresolved", "diamond: the order of integration is unresolved"),
    "error": ("not tested", "cross: the series could not be tested"),
}


def marker_kind(result: SeriesResult) -> str:
    if result.error is not None:
        return "error"
    order = result.verdict.order
    if order is None:
        return "unresolved"
    return {0: "i0", 1: "i1", 2: "i2"}.get(order, "unresolved")


def marker_icon(kind: str, color: QColor, size: int = 16) -> QIcon:
    """A small outlined/filled shape: circle, triangle, square, diamond or cross."""
    pixmap = QPixmap(size * 2, size * 2)  # drawn at double size, crisp on high-DPI screens
    pixmap.setDevicePixelRatio(2.0)
    pixmap.fill(Qt.GlobalColor.transparent)
    painter = QPainter(pixmap)
    painter.setRenderHint(QPainter.RenderHint.Antialiasing, True)
    pen = QPen(color)
    pen.setWidthF(1.6)
    painter.setPen(pen)
    box = QRectF(3, 3, size - 6, size - 6)
    if kind == "i0":
        painter.setBrush(color)
        painter.drawEllipse(box)
    elif kind == "i1":
        painter.setBrush(Qt.BrushStyle.NoBrush)
        painter.drawPolygon(QPolygonF([QPointF(box.center().x(), box.top()), box.bottomRight(),
                                       box.bottomLeft()]))
    elif kind == "i2":
        painter.setBrush(Qt.BrushStyle.NoBrush)
        painter.drawRect(box)
        painter.drawRect(box.adjusted(3, 3, -3, -3))
    elif kind == "unresolved":
        painter.setBrush(Qt.BrushStyle.NoBrush)
        c = box.center()
        painter.drawPolygon(QPolygonF([QPointF(c.x(), box.top()), QPointF(box.right(), c.y()),
                                       QPointF(c.x(), box.bottom()), QPointF(box.left(), c.y())]))
    else:
        pen.setWidthF(2.2)
        painter.setPen(pen)
        painter.drawLine(box.topLeft(), box.bottomRight())
        painter.drawLine(box.topRight(), box.bottomLeft())
    painter.end()
    return QIcon(pixmap)
