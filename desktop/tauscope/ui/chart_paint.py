"""A report chart (:class:`~tauscope.report.chart_plan.ChartPlan`) drawn with QPainter, as
vectors onto the PDF writer (the .xlsx draws it as DrawingML shapes itself,
``report.xlsx_chart``; the .html as SVG).  QPainter on a PDF writer needs no window and may
run outside the GUI thread.
"""

from __future__ import annotations

import struct

import numpy as np
from PySide6.QtCore import QByteArray, QDataStream, QPointF, Qt
from PySide6.QtGui import QColor, QFont, QFontMetricsF, QPainter, QPen, QPolygonF

from tauscope.report.chart_plan import ChartPlan

FAMILIES = ["DejaVu Sans", "Segoe UI", "Arial", "Helvetica", "sans-serif"]
DASHES = {"dash": [6.0, 3.0], "dot": [1.5, 2.5]}
_FONTS: dict[float, tuple[QFont, QFontMetricsF]] = {}


def _font(size: float) -> tuple[QFont, QFontMetricsF]:
    found = _FONTS.get(size)
    if found is None:
        made = QFont()
        made.setFamilies(FAMILIES)
        made.setPixelSize(round(size))
        found = _FONTS[size] = (made, QFontMetricsF(made))
    return found


def _pen(color: str, width: float, dash: str) -> QPen:
    pen = QPen(QColor(color), width)
    pen.setCapStyle(Qt.PenCapStyle.FlatCap)
    pen.setJoinStyle(Qt.PenJoinStyle.RoundJoin)
    if dash:  # the pattern in layout units (Qt counts a custom dash in pen widths)
        pen.setDashPattern([d / width for d in DASHES[dash]])
    return pen


def polygon(points: np.ndarray) -> QPolygonF:
    """The k × 2 ``points`` as a QPolygonF, read from the bytes Qt's own serialisation of a
    polygon has (a big-endian 32-bit count, then x and y of each point as big-endian
    doubles: ``QDataStream`` in its default byte order): about ten times faster than making a
    QPointF a point."""
    data = struct.pack(">I", len(points)) + np.ascontiguousarray(points, ">f8").tobytes()
    made = QPolygonF()
    QDataStream(QByteArray(data)) >> made
    return made


def paint_plan(painter: QPainter, plan: ChartPlan, left: float = 0.0, top: float = 0.0) -> None:
    """Draw ``plan`` with its top-left corner at (``left``, ``top``) in the painter's units,
    every line as one path (vectors, nothing filled)."""
    painter.save()
    try:
        painter.translate(left, top)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        painter.setRenderHint(QPainter.RenderHint.TextAntialiasing)
        painter.fillRect(0, 0, round(plan.width), round(plan.height), QColor(plan.background))
        for stroke in plan.strokes:
            painter.setPen(_pen(stroke.color, stroke.width, stroke.dash))
            painter.drawPolyline(polygon(stroke.points))
        for label in plan.labels:
            font, metrics = _font(label.size)
            painter.setFont(font)
            painter.setPen(QColor(label.color))
            x = label.x
            if label.anchor != "start":
                advance = metrics.horizontalAdvance(label.text)
                x -= advance if label.anchor == "end" else advance / 2
            painter.drawText(QPointF(x, label.y), label.text)
    finally:
        painter.restore()
