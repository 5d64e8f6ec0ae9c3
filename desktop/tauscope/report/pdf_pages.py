"""Cutting a laid-out report into pages where nothing is split.

Qt's own paging (``QTextDocument.print_``) moves a table row to the next page
line by line, so one step of a decision path can start at the foot of a page
and end at the head of the next.  Here the report is laid out once as one
long page (:mod:`tauscope.report.pdf_flow`), and the cuts are chosen by hand:

* a *unit* is a stretch of the page that must stay whole: a table row (all its
  cells), a line of text, a line holding a chart; a heading is one unit with
  what follows it;
* each page ends at the lowest unit boundary that fits (``cut_pages``); only a
  unit taller than a whole page is ever cut;
* a page that starts inside a table repeats that table's header rows first.

The geometry comes from the layout (every line, table row and chart it placed);
the arithmetic on intervals is plain Python, so it is tested without Qt.
"""

from __future__ import annotations

import bisect
from dataclasses import dataclass


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
