"""A light page layout for the PDF report, drawn on any :class:`Canvas`.

The report is laid out once as one long column ``WIDTH`` units wide: paragraphs wrapped into
lines, tables row by row, charts.  Each line, table row and chart becomes

* a :class:`~tauscope.report.pdf_pages.Unit`, the stretch that must stay on one page (a
  heading is one unit with what follows it, a table's header row is marked to be repeated),
  from which :func:`~tauscope.report.pdf_pages.cut_pages` chooses the page breaks; and
* a :class:`Piece`, which draws that stretch at its place in the column.

Text is measured by its :class:`Face` (one advance a character, added up) and wrapped at
spaces, or anywhere in a word longer than the room.  The layout knows nothing of how it is
drawn: the report's own PDF writer (:mod:`tauscope.report.pdf_direct`) and Qt's
(``tauscope.ui.pdf_report``) each give a face and a canvas.
"""

from __future__ import annotations

import bisect
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import Protocol

from tauscope.report.chart_plan import ChartPlan
from tauscope.report.pdf_pages import Page, Unit
from tauscope.report.text_safety import pdf_text

WIDTH = 1000.0
PIXELS_PER_POINT = 96 / 72  # sizes are given in points, laid out in pixels at 96 dpi


def pixels(points: float) -> int:
    """A type size in points as the layout's whole pixels (96 to the inch)."""
    return round(points * PIXELS_PER_POINT)


class Face(Protocol):
    """A font at one size, in layout units."""

    key: str
    """Tells faces apart in the wrapping cache."""
    ascent: float
    height: float  # ascent and descent

    def advance(self, text: str) -> float:
        """How far ``text`` (one line) reaches."""
        ...


class Canvas(Protocol):
    """What the layout draws on, in layout units (y down)."""

    def text(self, x: float, baseline: float, text: str, style: Style) -> None: ...
    def texts(self, placed: Sequence[tuple[float, float, str]], style: Style) -> None:
        """Each ``(x, baseline, text)`` of ``placed``, in ``style``."""
        ...
    def fill_rect(self, x: float, y: float, width: float, height: float, color: str) -> None: ...
    def line(self, x1: float, y1: float, x2: float, y2: float, color: str) -> None: ...
    def chart(self, plan: ChartPlan, top: float, scale: float) -> None: ...
    def save(self) -> None: ...
    def restore(self) -> None: ...
    def translate(self, dx: float, dy: float) -> None: ...
    def clip(self, x: float, y: float, width: float, height: float) -> None: ...


@dataclass(frozen=True)
class Style:
    """How a run of text looks: face, colour, line height (a multiple of the face's)."""

    face: Face
    color: str = "#1d2428"
    line_height: float = 1.3


@dataclass(frozen=True)
class Line:
    text: str
    width: float


_WRAPPED: dict[tuple[str, str, float], tuple[Line, ...]] = {}
"""Lines already wrapped, by text, face and room (a report repeats most of its cell texts)."""


def wrap(text: str, style: Style, room: float) -> tuple[Line, ...]:
    """``text`` in lines at most ``room`` wide ("\\n" starts a new line; a no-break space never
    breaks)."""
    key = (text, style.face.key, room)
    lines = _WRAPPED.get(key)
    if lines is None:
        if len(_WRAPPED) > 200_000:
            _WRAPPED.clear()
        lines = _WRAPPED[key] = tuple(_wrap(text, style.face, room))
    return lines


def _wrap(text: str, face: Face, room: float) -> list[Line]:
    """Greedy: as many words a line as fit, a word wider than ``room`` cut where it must be."""
    lines: list[Line] = []
    space = face.advance(" ")
    for part in text.split("\n"):
        width = face.advance(part)
        if width <= room:
            lines.append(Line(part, width))
            continue
        current, current_width = "", 0.0
        for word in part.split(" "):
            word_width = face.advance(word)
            if current and current_width + space + word_width <= room:
                current, current_width = f"{current} {word}", current_width + space + word_width
                continue
            if current:
                lines.append(Line(current, current_width))
            current, current_width = word, word_width
            while current_width > room and len(current) > 1:
                cut = _longest_prefix(current, face, room)
                lines.append(Line(current[:cut], face.advance(current[:cut])))
                current = current[cut:]
                current_width = face.advance(current)
        lines.append(Line(current, current_width))
    return lines


def _longest_prefix(word: str, face: Face, room: float) -> int:
    """The most characters of ``word`` that fit in ``room`` (at least one)."""
    low, high = 1, len(word)
    while low < high:
        middle = (low + high + 1) // 2
        if face.advance(word[:middle]) <= room:
            low = middle
        else:
            high = middle - 1
    return low


@dataclass(frozen=True)
class Piece:
    """Draws the stretch [``top``, ``bottom``) of the column."""

    top: float
    bottom: float
    draw: Callable[[Canvas], None]


@dataclass(frozen=True)
class Column:
    """A table column: its header, its share of the width (0 to 1), whether it is numeric."""

    header: str
    share: float
    numeric: bool = False


Cell = tuple[str, int]
"""A cell's text and how many columns it spans."""

PAD_X, PAD_Y = 6.0, 3.0


class Flow:
    """The column being laid out: units, pieces and the height so far."""

    def __init__(self) -> None:
        self.y = 0.0
        self.units: list[Unit] = []
        self.pieces: list[Piece] = []
        self._tables = 0
        self._keep: int | None = None  # a heading's unit, to be joined to the next unit

    def _add(self, unit: Unit, draw: Callable[[Canvas], None]) -> None:
        if self._keep is not None and not unit.header:
            kept = self.units[self._keep]
            self.units[self._keep] = Unit(kept.top, unit.bottom)
            self._keep = None
        self.units.append(unit)
        self.pieces.append(Piece(unit.top, unit.bottom, draw))

    def paragraph(self, text: str, style: Style, before: float = 0.0, after: float = 6.0,
                  indent: float = 0.0, heading: bool = False, rule: str | None = None) -> None:
        """Wrapped text (control characters made harmless); ``heading``: kept on a page with
        what follows; ``rule``: the colour of a line drawn under it."""
        text = pdf_text(text)
        self.y += before
        face = style.face
        step = face.height * style.line_height
        lead = (step - face.height) / 2
        lines = wrap(text, style, WIDTH - indent)
        for k, line in enumerate(lines):
            top = self.y
            baseline = top + lead + face.ascent
            last = rule is not None and k == len(lines) - 1

            def draw(canvas: Canvas, text: str = line.text, y: float = baseline,
                     under: float = top + step, last: bool = last) -> None:
                canvas.text(indent, y, text, style)
                if last and rule is not None:
                    canvas.line(0, under, WIDTH, under, rule)

            self._add(Unit(top, top + step), draw)
            self.y += step
        if heading and lines:
            self._keep = len(self.units) - 1
        self.y += after

    def drawing(self, plan: ChartPlan, width: float, after: float = 6.0) -> None:
        """A report chart drawn as vectors (lines and text, no picture), ``width`` wide."""
        scale = width / plan.width
        top = self.y

        def draw(canvas: Canvas) -> None:
            canvas.chart(plan, top, scale)

        self._add(Unit(top, top + plan.height * scale), draw)
        self.y += plan.height * scale + after

    def table(self, columns: Sequence[Column], rows: Sequence[Sequence[Cell]], head: Style,
              body: Style, fill: str, line: str, after: float = 8.0) -> None:
        """A table across the column: a header row (repeated on each page the table runs
        onto), then one unit per row, none ever split."""
        key = self._tables
        self._tables += 1
        edges = [0.0]
        for column in columns:
            edges.append(edges[-1] + column.share * WIDTH)
        header = [(c.header, 1) for c in columns]
        self._row(key, 0, True, header, columns, edges, head, fill, None)
        for index, cells in enumerate(rows, start=1):
            self._row(key, index, False, cells, columns, edges, body, None, line)
        self.y += after

    def _row(self, key: int, index: int, header: bool, cells: Sequence[Cell],
             columns: Sequence[Column], edges: list[float], style: Style, fill: str | None,
             line: str | None) -> None:
        placed: list[tuple[float, float, bool, tuple[Line, ...]]] = []
        column = 0
        for text, span in cells:
            left, right = edges[column], edges[min(column + span, len(columns))]
            numeric = columns[column].numeric and span == 1 and not header
            placed.append((left, right, numeric, wrap(text, style, right - left - 2 * PAD_X)))
            column += span
        face = style.face
        step = face.height * style.line_height
        lead = (step - face.height) / 2
        top = self.y
        height = max((len(p[3]) for p in placed), default=1) * step + 2 * PAD_Y
        first = top + PAD_Y + lead + face.ascent
        texts = tuple((right - PAD_X - text_line.width if numeric else left + PAD_X,
                       first + k * step, text_line.text)
                      for left, right, numeric, lines in placed
                      for k, text_line in enumerate(lines))

        def draw(canvas: Canvas) -> None:
            if fill is not None:
                canvas.fill_rect(0, top, edges[-1], height, fill)
            canvas.texts(texts, style)
            if line is not None:
                canvas.line(0, top + height, edges[-1], top + height, line)

        self._add(Unit(top, top + height, key, index, header), draw)
        self.y += height


def draw_slice(canvas: Canvas, pieces: Sequence[Piece], tops: Sequence[float], top: float,
               bottom: float) -> None:
    """Every piece that reaches into [``top``, ``bottom``), clipped to it (a piece is only ever
    cut when it is taller than a page)."""
    canvas.save()
    canvas.clip(0, top, WIDTH, bottom - top)
    start = bisect.bisect_left(tops, top)
    while start > 0 and pieces[start - 1].bottom > top:
        start -= 1
    for piece in pieces[start:bisect.bisect_left(tops, bottom)]:
        if piece.bottom > top:
            piece.draw(canvas)
    canvas.restore()


def draw_page(canvas: Canvas, flow: Flow, tops: Sequence[float], page: Page) -> None:
    """One page: the repeated table header (if any), then its slice of the column."""
    if page.header_height > 0:
        canvas.save()
        canvas.translate(0, -page.header_top)
        draw_slice(canvas, flow.pieces, tops, page.header_top, page.header_bottom)
        canvas.restore()
    canvas.save()
    canvas.translate(0, page.header_height - page.top)
    draw_slice(canvas, flow.pieces, tops, page.top, page.bottom)
    canvas.restore()
