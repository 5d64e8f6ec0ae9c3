"""The small line drawing of each series, painted by a delegate (no widget per row)."""

from __future__ import annotations

import numpy as np
import pandas as pd
from PySide6.QtCore import QModelIndex, QPersistentModelIndex, QPointF, QRectF, QSize
from PySide6.QtGui import QPainter, QPalette, QPen, QPolygonF
from PySide6.QtWidgets import QStyle, QStyledItemDelegate, QStyleOptionViewItem, QWidget

from tauscope.ui.roles import SPARK_ROLE

MAX_POINTS = 160


def sparkline_points(values: pd.Series, max_points: int = MAX_POINTS) -> np.ndarray:
    """Values thinned to at most ``max_points`` and scaled to 0..1 (NaN kept as breaks).

    Only for drawing: every k-th value, so the picture keeps the shape.
    """
    data = np.asarray(values, dtype=float)
    if data.size == 0:
        return data
    if data.size > max_points:
        positions = np.linspace(0, data.size - 1, max_points).round().astype(int)
        data = data[positions]
    finite = data[np.isfinite(data)]
    if finite.size == 0:
        return np.full(data.shape, np.nan)
    low, high = float(finite.min()), float(finite.max())
    span = high - low
    if span == 0:
        return np.where(np.isfinite(data), 0.5, np.nan)
    return (data - low) / span


class SparklineDelegate(QStyledItemDelegate):
    """Paints the array found under SPARK_ROLE as a polyline inside the cell."""

    def paint(
        self,
        painter: QPainter,
        option: QStyleOptionViewItem,
        index: QModelIndex | QPersistentModelIndex,
    ) -> None:
        style_option = QStyleOptionViewItem(option)
        self.initStyleOption(style_option, index)
        style_option.text = ""
        widget = option.widget  # type: ignore[attr-defined]
        style = widget.style() if isinstance(widget, QWidget) else None
        if style is not None:
            style.drawControl(QStyle.ControlElement.CE_ItemViewItem, style_option, painter, widget)
        points = index.data(SPARK_ROLE)
        if not isinstance(points, np.ndarray) or points.size < 2:
            return
        rect = QRectF(option.rect).adjusted(4, 4, -4, -4)  # type: ignore[attr-defined]
        if rect.width() < 8 or rect.height() < 4:
            return
        selected = bool(option.state & QStyle.StateFlag.State_Selected)  # type: ignore[attr-defined]
        role = QPalette.ColorRole.HighlightedText if selected else QPalette.ColorRole.Text
        pen = QPen(option.palette.color(role))  # type: ignore[attr-defined]
        pen.setWidthF(1.2)
        painter.save()
        painter.setRenderHint(QPainter.RenderHint.Antialiasing, True)
        painter.setPen(pen)
        step = rect.width() / (points.size - 1)
        segment = QPolygonF()
        for i, value in enumerate(points):
            if not np.isfinite(value):
                if segment.size() > 1:
                    painter.drawPolyline(segment)
                segment = QPolygonF()
                continue
            segment.append(QPointF(rect.left() + i * step, rect.bottom() - float(value) * rect.height()))
        if segment.size() > 1:
            painter.drawPolyline(segment)
        painter.restore()

    def sizeHint(
        self, option: QStyleOptionViewItem, index: QModelIndex | QPersistentModelIndex
    ) -> QSize:
        hint = super().sizeHint(option, index)
        return QSize(max(hint.width(), 90), max(hint.height(), 22))
