"""A light page layout for the PDF report, drawn with QPainter straight onto the PDF writer.

The report is laid out once as one long column ``WIDTH`` units wide: paragraphs wrapped into
lines, tables row by row, charts.  Each line, table row and chart becomes

* a :class:`~tauscope.report.pdf_pages.Unit`, the stretch that must stay on one page (a heading is
  one unit with what follows it, a table's header row is marked to be repeated), from which
  :func:`~tauscope.report.pdf_pages.cut_pages` chooses the page breaks; and
* a :class:`Piece`, which draws that stretch at its place in the column.

Text is measured with the font's metrics and wrapped with ``QTextLayout`` only where a line is
too long for its room (at word boundaries, or anywhere in a word longer than the room), which
keeps the cost to a few QPainter calls per line: far less than laying out and drawing the
same report as a rich-text document.  A line met again in the report is drawn from the glyph
runs kept from its first shaping (:func:`draw_line`).
"""

from __future__ import annotations

import bisect
from collections.abc import Callable, Sequence
from dataclasses import dataclass, field

from PySide6.QtCore import QPointF, QRectF
from PySide6.QtGui import (
    QColor,
    QFont,
    QFontMetricsF,
    QGlyphRun,
    QPainter,
    QTextLayout,
    QTextOption,
)

from tauscope.report.chart_plan import ChartPlan
from tauscope.report.text_safety import pdf_text
from tauscope.ui.chart_paint import paint_plan
from tauscope.report.pdf_pages import Unit

WIDTH = 1000.0
FAMILIES = ["Segoe UI", "Helvetica Neue", "Arial", "DejaVu Sans", "sans-serif"]
PIXELS_PER_POINT = 96 / 72  # sizes are given in points, laid out in pixels at 96 dpi


def font(points: float, bold: bool = False, italic: bool = False) -> QFont:
    made = QFont()
    made.setFamilies(FAMILIES)
    made.setPixelSize(round(points * PIXELS_PER_POINT))
    made.setBold(bold)
    made.setItalic(italic)
    return made


@dataclass(frozen=True)
class Style:
    """How a run of text looks: font, colour, line height (a multiple of the font's)."""

    font: QFont
    color: str = "#1d2428"
    line_height: float = 1.3
    metrics: QFontMetricsF = field(init=False, compare=False)
    key: str = field(init=False, compare=False)
    """Tells fonts apart in the wrapping cache (the font's description)."""
    shaped: dict[str, tuple[float, tuple[QGlyphRun, ...]]] = field(
        init=False, compare=False, repr=False, default_factory=dict)
    seen: set[str] = field(init=False, compare=False, repr=False, default_factory=set)
    """Lines drawn once in this style and not shaped (yet)."""
    """Lines already shaped in this style (:func:`draw_line`), by text.  Kept with the style,
    which one report's layout makes and drops, never across reports: a glyph run holds the
    font of the thread that shaped it, and the window writes each export in a thread of its
    own, whose fonts go when it ends."""

    def __post_init__(self) -> None:
        object.__setattr__(self, "metrics", QFontMetricsF(self.font))
        object.__setattr__(self, "key", self.font.key())


@dataclass(frozen=True)
class Line:
    text: str
    width: float


_WRAPPED: dict[tuple[str, str, float], tuple[Line, ...]] = {}
"""Lines already wrapped, by text, font and room (a report repeats most of its cell texts)."""


def wrap(text: str, style: Style, room: float) -> tuple[Line, ...]:
    """``text`` in lines at most ``room`` wide ("\\n" starts a new line; a no-break space never
    breaks)."""
    key = (text, style.key, room)
    lines = _WRAPPED.get(key)
    if lines is None:
        if len(_WRAPPED) > 50_000:
            _WRAPPED.clear()
        lines = _WRAPPED[key] = tuple(_wrap(text, style, room))
    return lines


def _wrap(text: str, style: Style, room: float) -> list[Line]:
    lines: list[Line] = []
    metrics = style.metrics
    for part in text.split("\n"):
        advance = metrics.horizontalAdvance(part)
        if advance <= room:
            lines.append(Line(part, advance))
            continue
        layout = QTextLayout(part, style.font)
        option = QTextOption()
        option.setWrapMode(QTextOption.WrapMode.WrapAtWordBoundaryOrAnywhere)
        layout.setTextOption(option)
        layout.beginLayout()
        while True:
            line = layout.createLine()
            if not line.isValid():
                break
            line.setLineWidth(room)
            piece = part[line.textStart():line.textStart() + line.textLength()].rstrip()
            lines.append(Line(piece, metrics.horizontalAdvance(piece)))
        layout.endLayout()
    return lines


def draw_line(painter: QPainter, x: float, baseline: float, text: str, style: Style) -> None:
    """``text`` (one line) with its baseline starting at (``x``, ``baseline``), in the
    painter's pen.

    What ``painter.drawText(QPointF(x, baseline), text)`` draws, but each line is shaped
    (fonts chosen, glyphs placed: ``QTextLayout``) only once per report and its glyph runs kept
    (``style.shaped``): a report repeats most of its cell texts, and shaping costs about half
    of what drawing a line of text on the PDF writer does."""
    shaped = style.shaped.get(text)
    if shaped is None:
        if text not in style.seen:  # drawn once so far: shaping to keep would cost more
            style.seen.add(text)
            painter.drawText(QPointF(x, baseline), text)
            return
        layout = QTextLayout(text, style.font)
        layout.beginLayout()
        line = layout.createLine()
        layout.endLayout()
        shaped = style.shaped[text] = (line.ascent() if line.isValid() else 0.0,
                                       tuple(layout.glyphRuns()))
    ascent, runs = shaped
    origin = QPointF(x, baseline - ascent)
    for run in runs:
        painter.drawGlyphRun(origin, run)


@dataclass(frozen=True)
class Piece:
    """Draws the stretch [``top``, ``bottom``) of the column."""

    top: float
    bottom: float
    draw: Callable[[QPainter], None]


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

    def _add(self, unit: Unit, draw: Callable[[QPainter], None]) -> None:
        if self._keep is not None and not unit.header:
            kept = self.units[self._keep]
            self.units[self._keep] = Unit(kept.top, unit.bottom)
            self._keep = None
        self.units.append(unit)
        self.pieces.append(Piece(unit.top, unit.bottom, draw))

    def space(self, height: float) -> None:
        self.y += height

    def paragraph(self, text: str, style: Style, before: float = 0.0, after: float = 6.0,
                  indent: float = 0.0, heading: bool = False, rule: str | None = None) -> None:
        """Wrapped text (control characters made harmless); ``heading``: kept on a page with
        what follows; ``rule``: the colour of a line drawn under it."""
        text = pdf_text(text)
        self.y += before
        metrics = style.metrics
        step = metrics.height() * style.line_height
        lead = (step - metrics.height()) / 2
        lines = wrap(text, style, WIDTH - indent)
        for k, line in enumerate(lines):
            top = self.y
            baseline = top + lead + metrics.ascent()
            last = rule is not None and k == len(lines) - 1

            def draw(painter: QPainter, text: str = line.text, y: float = baseline,
                     under: float = top + step, last: bool = last) -> None:
                painter.setFont(style.font)
                painter.setPen(QColor(style.color))
                draw_line(painter, indent, y, text, style)
                if last:
                    painter.setPen(QColor(rule))
                    painter.drawLine(QPointF(0, under), QPointF(WIDTH, under))

            self._add(Unit(top, top + step), draw)
            self.y += step
        if heading and lines:
            self._keep = len(self.units) - 1
        self.y += after

    def drawing(self, plan: ChartPlan, width: float, after: float = 6.0) -> None:
        """A report chart drawn as vectors (lines and text, no picture), ``width`` wide."""
        scale = width / plan.width
        top = self.y

        def draw(painter: QPainter) -> None:
            painter.save()
            painter.translate(0, top)
            painter.scale(scale, scale)
            paint_plan(painter, plan)
            painter.restore()

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
        metrics = style.metrics
        step = metrics.height() * style.line_height
        lead = (step - metrics.height()) / 2
        top = self.y
        height = max((len(p[3]) for p in placed), default=1) * step + 2 * PAD_Y

        def draw(painter: QPainter) -> None:
            if fill is not None:
                painter.fillRect(QRectF(0, top, edges[-1], height), QColor(fill))
            painter.setFont(style.font)
            painter.setPen(QColor(style.color))
            for left, right, numeric, lines in placed:
                y = top + PAD_Y + lead + metrics.ascent()
                for text_line in lines:
                    x = right - PAD_X - text_line.width if numeric else left + PAD_X
                    draw_line(painter, x, y, text_line.text, style)
                    y += step
            if line is not None:
                painter.setPen(QColor(line))
                painter.drawLine(QPointF(0, top + height), QPointF(edges[-1], top + height))

        self._add(Unit(top, top + height, key, index, header), draw)
        self.y += height


def draw_slice(painter: QPainter, pieces: Sequence[Piece], tops: Sequence[float], top: float,
               bottom: float) -> None:
    """Every piece that reaches into [``top``, ``bottom``), clipped to it (a piece is only ever
    cut when it is taller than a page)."""
    painter.save()
    painter.setClipRect(QRectF(0, top, WIDTH, bottom - top))
    start = bisect.bisect_left(tops, top)
    while start > 0 and pieces[start - 1].bottom > top:
        start -= 1
    for piece in pieces[start:bisect.bisect_left(tops, bottom)]:
        if piece.bottom > top:
            piece.draw(painter)
    painter.restore()


