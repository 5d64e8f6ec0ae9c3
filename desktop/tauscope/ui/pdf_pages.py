"""Cutting a laid-out report into pages where nothing is split.

Qt's own paging (``QTextDocument.print_``) moves a table row to the next page
line by line, so one step of a decision path can start at the foot of a page
and end at the head of the next.  Here the document is laid out once as one
long page, and the cuts are chosen by hand:

* a *unit* is a stretch of the page that must stay whole: a table row (all its
  cells), a line of text, a line holding a chart; a heading is one unit with
  what follows it;
* each page ends at the lowest unit boundary that fits (``cut_pages``); only a
  unit taller than a whole page is ever cut;
* a page that starts inside a table repeats that table's header rows first.

The geometry comes from the document's layout (``blockBoundingRect`` of every
block, ``QTextLine`` positions within a block); the arithmetic on intervals is
plain Python, so it is tested without Qt.
"""

from __future__ import annotations

import bisect
from dataclasses import dataclass
from typing import Any


@dataclass(frozen=True)
class Unit:
    """A stretch [``top``, ``bottom``) that stays on one page; ``table`` and ``row`` name the
    table row it is (None for text); ``header`` marks a table's header row."""

    top: float
    bottom: float
    table: int | None = None
    row: int | None = None
    header: bool = False


@dataclass(frozen=True)
class Page:
    """One page: the document slice [``top``, ``bottom``), drawn below a repeat of the header
    slice [``header_top``, ``header_bottom``) when the page starts inside a table."""

    top: float
    bottom: float
    header_top: float = 0.0
    header_bottom: float = 0.0

    @property
    def header_height(self) -> float:
        return self.header_bottom - self.header_top


def _headers(units: list[Unit]) -> dict[int, tuple[float, float]]:
    spans: dict[int, tuple[float, float]] = {}
    for unit in units:
        if unit.header and unit.table is not None:
            top, bottom = spans.get(unit.table, (unit.top, unit.bottom))
            spans[unit.table] = (min(top, unit.top), max(bottom, unit.bottom))
    return spans


def _free_tops(ordered: list[Unit]) -> list[float]:
    """Where a page may start: the tops of units that no other unit straddles (sorted)."""
    free: list[float] = []
    reach = float("-inf")  # the lowest bottom among the units that start above y
    index = 0
    tops = sorted({u.top for u in ordered})
    for y in tops:
        while index < len(ordered) and ordered[index].top < y:
            reach = max(reach, ordered[index].bottom)
            index += 1
        if y > 0 and reach <= y:
            free.append(y)
    return free


def cut_pages(units: list[Unit], height: float, page_height: float) -> list[Page]:
    """Pages of at most ``page_height`` covering [0, ``height``), cut only between units.

    A page that starts at a body row of a table with header rows repeats them, and has that
    much less room.  A unit taller than the room on a page is cut where the page ends.
    """
    if page_height <= 0:
        raise ValueError("page_height must be positive")
    ordered = sorted(units, key=lambda u: (u.top, u.bottom))
    headers = _headers(ordered)
    allowed = _free_tops(ordered)
    row_at = {u.top: u for u in ordered if u.table is not None and not u.header}
    pages: list[Page] = []
    top = 0.0
    header = (0.0, 0.0)
    while top < height:
        room = page_height - (header[1] - header[0])
        limit = top + room
        if limit >= height:
            pages.append(Page(top, height, *header))
            break
        last = bisect.bisect_right(allowed, limit) - 1
        cut = allowed[last] if last >= 0 and allowed[last] > top else limit
        pages.append(Page(top, cut, *header))
        top = cut
        row = row_at.get(cut)
        header = headers.get(row.table, (0.0, 0.0)) if row is not None and row.table is not None \
            else (0.0, 0.0)
        if header[1] - header[0] >= page_height / 2:
            header = (0.0, 0.0)  # a header too tall to repeat is not repeated
    return pages


def document_units(document: Any) -> list[Unit]:
    """The units of a laid-out ``QTextDocument`` (layout coordinates, top to bottom)."""
    from PySide6.QtGui import QTextCursor

    layout = document.documentLayout()
    rows: dict[tuple[int, int], list[float]] = {}
    header_rows: dict[int, int] = {}
    pads: dict[int, float] = {}
    units: list[Unit] = []
    heading_pending: list[int] = []
    block = document.begin()
    while block.isValid():
        rect = layout.blockBoundingRect(block)
        table = QTextCursor(block).currentTable()
        if table is not None:
            for index in heading_pending:  # a heading stays with the table's first row
                units[index] = Unit(units[index].top, rect.bottom())
            heading_pending = []
            key = table.firstPosition()
            row = table.cellAt(block.position()).row()
            if key not in pads:
                form = table.format()
                pads[key] = form.cellPadding() + form.border() + form.cellSpacing()
                header_rows[key] = form.headerRowCount()
            span = rows.setdefault((key, row), [rect.top(), rect.bottom()])
            span[0], span[1] = min(span[0], rect.top()), max(span[1], rect.bottom())
        else:
            text_layout = block.layout()
            first = len(units)
            for i in range(text_layout.lineCount()):
                line = text_layout.lineAt(i)
                units.append(Unit(rect.top() + line.y(), rect.top() + line.y() + line.height()))
            for index in heading_pending:  # a heading stays with the line after it
                if len(units) > first:
                    units[index] = Unit(units[index].top, units[first].bottom)
            heading_pending = []
            if block.blockFormat().headingLevel() > 0 and len(units) > first:
                heading_pending = [len(units) - 1]
        block = block.next()
    for (key, row), (top, bottom) in rows.items():
        pad = pads[key]
        units.append(Unit(top - pad, bottom + pad, key, row, row < header_rows[key]))
    return units
