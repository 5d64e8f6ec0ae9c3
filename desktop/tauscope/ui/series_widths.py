"""How wide each column of the Series panel needs to be for the texts it shows, measured on
the model's series (every row, shown or folded away) with each row's widths kept between
fits: only a series added or changed since the last fit, or every one after the font
changed, is measured.

Asking the view instead (``QTreeView.sizeHintForColumn``) measures every shown row again
at each fit: 25–35 ms of the window's thread with a thousand series, in the same turn of
the event loop as whatever came next (the start of a run, say; see
benchmarks/ui_latency.py).  Here a fit of a thousand series measured before is one pass
over a dictionary.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from PySide6.QtGui import QFontMetrics
from PySide6.QtWidgets import QStyle, QTreeView

from tauscope.ui.columns import header_width
from tauscope.ui.series_model import COLUMNS, FREQUENCY, GAPS, NAME, OBS, SPAN

if TYPE_CHECKING:
    from tauscope.ui.series_model import SeriesTreeModel

SHAPE_WIDTH = 56  # the small drawing of each series (and "5 series" on a sheet's row)
TEXT_COLUMNS = (NAME, OBS, GAPS, SPAN, FREQUENCY)  # the columns of row_texts, in its order


class SeriesWidths:
    """The natural widths of the Series panel's columns (see the module's docstring)."""

    def __init__(self, view: QTreeView, model: SeriesTreeModel) -> None:
        self.view = view
        self.model = model
        self._font = ""
        # series key -> (its texts measured, its level, its widths in TEXT_COLUMNS' order)
        self._rows: dict[str, tuple[tuple[str, ...], int, tuple[int, ...]]] = {}
        self._advances: dict[str, int] = {}  # text -> its width in the view's font
        self._margin = 0
        self.measured = 0  # rows measured so far (a row measured again counts again)
        self._metrics = QFontMetrics(view.font())
        self._indentation = view.indentation()

    def _width(self, text: str, indent: int = 0) -> int:
        """A cell's width for ``text`` at ``indent`` levels: the text, the margins the style
        draws around it (as the view's own measure has them, with a pixel either side for
        the rounding of the text's width) and the indentation."""
        advance = self._advances.get(text)
        if advance is None:
            advance = self._advances[text] = self._metrics.horizontalAdvance(text)
        return advance + self._margin + indent * self._indentation

    def measure(self, key: str, depth: int, texts: tuple[str, ...]) -> tuple[int, ...]:
        """The widths one series' row (``texts``: its :func:`row_texts`) needs, column by
        column (TEXT_COLUMNS' order): its text with the cell's margins, and for the name the
        indentation of its level (the tree's decoration counts as one more)."""
        known = self._rows.get(key)
        if known is not None and known[0] is texts and known[1] == depth:
            return known[2]
        widths = (self._width(texts[0], depth + 1), *(self._width(t) for t in texts[1:]))
        self.measured += 1
        self._rows[key] = (texts, depth, widths)
        return widths

    def natural(self) -> list[int]:
        """Each column's width for its widest text and for its title; the drawings' column
        has a set width."""
        font = self.view.font().key()
        margin = 2 * (self.view.style().pixelMetric(
            QStyle.PixelMetric.PM_FocusFrameHMargin, None, self.view) + 2)
        if font != self._font or margin != self._margin:
            self._font, self._margin, self._rows, self._advances = font, margin, {}, {}
        self._metrics, self._indentation = self.view.fontMetrics(), self.view.indentation()
        rows = [self.measure(*shown) for shown in self.model.series_texts()]
        if len(self._rows) > len(rows):  # series taken out of the tree since the last fit
            kept = {key for key, _depth, _texts in self.model.series_texts()}
            self._rows = {k: v for k, v in self._rows.items() if k in kept}
        widest = [max(column, default=0) for column in zip(*rows, strict=True)] if rows \
            else [0] * len(TEXT_COLUMNS)
        for name, depth in self.model.container_names():
            widest[0] = max(widest[0], self._width(name, depth + 1))
        natural = dict(zip(TEXT_COLUMNS, widest, strict=True))
        return [max(natural.get(column, SHAPE_WIDTH), header_width(self.view, column))
                for column in range(len(COLUMNS))]
