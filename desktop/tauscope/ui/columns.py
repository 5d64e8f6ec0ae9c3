"""Column widths of a tree view that fit their text at any window size, and that are the
user's once they drag a column edge (then remembered between sessions).

Until the user sets widths by hand, every column is as wide as its widest text (its
"natural" width, given by the panel), the spare width goes to the columns named to stretch,
and when the columns do not fit, the ones named optional are hidden, in order.
"""

from __future__ import annotations

from collections.abc import Callable, Collection, Sequence

from PySide6.QtCore import QByteArray, QElapsedTimer, QEvent, QObject, Qt, QTimer
from PySide6.QtWidgets import QTreeView

PADDING = 16  # the cell's margins around its text


class ColumnFitter(QObject):
    """Keeps ``view``'s columns fitted (see the module's docstring).

    A fit measures many texts (tens of milliseconds with hundreds of findings), so while
    changes keep coming (results arriving during a run) the view is fitted at most once
    every :attr:`SPACING_MS`; a change after a quiet spell is fitted at once.
    """

    SPACING_MS = 250

    def __init__(self, view: QTreeView, natural: Callable[[], Sequence[int]],
                 stretch: Sequence[int], optional: Sequence[int] = ()) -> None:
        super().__init__(view)
        self.view = view
        self.natural = natural
        self.stretch = tuple(stretch)
        self.optional = tuple(optional)
        self.by_hand = False
        self._fitting = False
        self._timer = QTimer(self)
        self._timer.setSingleShot(True)
        self._timer.setInterval(0)
        self._timer.timeout.connect(self.fit)
        self._since_fit = QElapsedTimer()
        view.header().sectionResized.connect(self._resized)
        view.viewport().installEventFilter(self)

    def fit_soon(self) -> None:
        """Fit once the events in hand are handled (many changes, one fit), or once
        :attr:`SPACING_MS` have passed since the last fit."""
        if self.by_hand or self._timer.isActive():
            return
        since = self._since_fit.elapsed() if self._since_fit.isValid() else self.SPACING_MS
        self._timer.start(max(0, self.SPACING_MS - since))

    def pending(self) -> bool:
        """A fit is due once the events in hand are handled."""
        return self._timer.isActive()

    def fit(self) -> None:
        if self.by_hand:
            return
        self._timer.stop()
        self._since_fit.start()
        widths = list(self.natural())
        available = self.view.viewport().width()
        hidden: set[int] = set()
        for column in self.optional:
            if sum(w for c, w in enumerate(widths) if c not in hidden) <= available:
                break
            hidden.add(column)
        spare = available - sum(w for c, w in enumerate(widths) if c not in hidden)
        if spare > 0 and self.stretch:
            for column in self.stretch:
                widths[column] += spare // len(self.stretch)
        self._fitting = True
        try:
            for column, width in enumerate(widths):
                self.view.setColumnHidden(column, column in hidden)
                if column not in hidden:
                    self.view.setColumnWidth(column, width)
        finally:
            self._fitting = False

    def reset(self) -> None:
        """Back to fitted widths (the user's widths forgotten)."""
        self.by_hand = False
        self.fit()

    def _resized(self, _column: int, _old: int, _new: int) -> None:
        if not self._fitting and self.view.isVisible():
            self.by_hand = True  # a column edge dragged: the widths are the user's now

    def eventFilter(self, watched: QObject, event: QEvent) -> bool:
        if event.type() == QEvent.Type.Resize:
            self.fit_soon()
        return super().eventFilter(watched, event)

    # remembered between sessions ----------------------------------------
    def state(self) -> QByteArray | None:
        """The header's state when the widths are the user's, else None."""
        return self.view.header().saveState() if self.by_hand else None

    def restore(self, state: object) -> bool:
        if isinstance(state, QByteArray) and not state.isEmpty() \
                and self.view.header().restoreState(state):
            self.by_hand = True
            return True
        return False


def text_width(view: QTreeView, texts: Collection[str], indent: int = 0,
               advances: dict[str, int] | None = None) -> int:
    """The width a column needs for the widest of ``texts`` at ``indent`` levels deep.
    ``advances`` (text → width in the view's font), when given, keeps each text's width so
    a text that repeats is measured once; the caller empties it when the font changes."""
    metrics = view.fontMetrics()
    if advances is None:
        widest = max((metrics.horizontalAdvance(t) for t in texts), default=0)
    else:
        for text in texts:
            if text not in advances:
                advances[text] = metrics.horizontalAdvance(text)
        widest = max((advances[t] for t in texts), default=0)
    return widest + PADDING + indent * view.indentation()


def header_width(view: QTreeView, column: int) -> int:
    """The width the column's title needs (with room for the sort arrow), hidden or not
    (a hidden column's own size hint is not its title's)."""
    header = view.header()
    if not header.isSectionHidden(column):
        return header.sectionSizeHint(column)
    title = str(view.model().headerData(column, Qt.Orientation.Horizontal) or "")
    return header.fontMetrics().horizontalAdvance(title) + PADDING
