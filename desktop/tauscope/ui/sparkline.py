"""The small line drawing of each series, painted by a delegate (no widget per row)."""

from __future__ import annotations

from collections.abc import Callable

import numpy as np
import pandas as pd
from PySide6.QtCore import QModelIndex, QObject, QPersistentModelIndex, QPointF, QRectF, QSize
from PySide6.QtGui import QPainter, QPalette, QPen, QPolygonF
from PySide6.QtWidgets import QStyle, QStyledItemDelegate, QStyleOptionViewItem, QWidget

from tauscope.ui.qtcompat import item_value
from tauscope.ui.roles import KEY_ROLE

MAX_POINTS = 90


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
    """Paints the points ``lookup(key)`` gives for the row's series as a polyline."""

    def __init__(self, lookup: Callable[[str], np.ndarray | None], parent: QObject | None = None
                 ) -> None:
        super().__init__(parent)
        self._lookup = lookup
        self._cache: dict[str, tuple[np.ndarray, list[QPolygonF]]] = {}

    def paint(
        self,
        painter: QPainter,
        option: QStyleOptionViewItem,
        index: QModelIndex | QPersistentModelIndex,
    ) -> None:
        points = self._lookup(str(item_value(index, KEY_ROLE, "")))
        if not isinstance(points, np.ndarray):
            super().paint(painter, option, index)  # not a series row: plain text
            return
        style_option = QStyleOptionViewItem(option)
        self.initStyleOption(style_option, index)
        style_option.text = ""
        widget = option.widget
        style = widget.style() if isinstance(widget, QWidget) else None
        if style is not None:
            style.drawControl(QStyle.ControlElement.CE_ItemViewItem, style_option, painter, widget)
        if points.size < 2:
            return
        rect = QRectF(option.rect).adjusted(4, 4, -4, -4)
        if rect.width() < 8 or rect.height() < 4:
            return
        selected = bool(option.state & QStyle.StateFlag.State_Selected)
        role = QPalette.ColorRole.HighlightedText if selected else QPalette.ColorRole.Text
        pen = QPen(option.palette.color(role))
        pen.setWidthF(1.2)
        pen.setCosmetic(True)  # width in pixels, unaffected by the scaling below
        painter.save()
        painter.setRenderHint(QPainter.RenderHint.Antialiasing, True)
        painter.setPen(pen)
        painter.translate(rect.left(), rect.bottom())
        painter.scale(rect.width(), -rect.height())
        for segment in self._segments(str(item_value(index, KEY_ROLE, "")), points):
            painter.drawPolyline(segment)
        painter.restore()

    def _segments(self, key: str, points: np.ndarray) -> list[QPolygonF]:
        """The drawing in unit coordinates (x and y in 0..1), built once per series."""
        cached = self._cache.get(key)
        if cached is not None and cached[0] is points:
            return cached[1]
        segments: list[QPolygonF] = []
        xs = np.linspace(0.0, 1.0, points.size)
        current: list[QPointF] = []
        for x, y in zip(xs.tolist(), points.tolist(), strict=True):
            if y != y:  # NaN: a gap breaks the line
                if len(current) > 1:
                    segments.append(QPolygonF(current))
                current = []
                continue
            current.append(QPointF(x, y))
        if len(current) > 1:
            segments.append(QPolygonF(current))
        self._cache[key] = (points, segments)
        return segments

    def sizeHint(
        self, option: QStyleOptionViewItem, index: QModelIndex | QPersistentModelIndex
    ) -> QSize:
        hint = super().sizeHint(option, index)
        return QSize(max(hint.width(), 90), max(hint.height(), 22))
