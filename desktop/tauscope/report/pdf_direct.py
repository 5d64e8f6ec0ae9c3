"""The PDF report written by Tauscope itself: the laid-out report
(:func:`~tauscope.report.pdf_layout.layout_report`) drawn as PDF operators, in the bundled
DejaVu Sans (regular, bold, oblique; ``resources/fonts``), embedded as subsets
(:mod:`tauscope.report.pdf_file`).  No Qt.

Text is written one line a ``Tj`` (ISO 32000-1, §9.4.3), each character its glyph at the
font's own advance, so the file holds about one number a line where a general painter
places every glyph on its own; with no shaping and no font look-up the report costs a
fraction of what it costs through Qt (``benchmarks/batch_writers.py``).

The bundled font covers Latin, Greek, Cyrillic and the symbols the report uses, not every
script a series' name may be written in, and this writer does not shape text: a report holding
a character the font lacks, or one of a script written right to left or whose letters join
(:func:`writable`), raises :class:`MissingGlyphs`, and ``tauscope.ui.pdf_report`` then writes
it through Qt, which shapes it and finds a system font for it.
"""

from __future__ import annotations

import unicodedata
from collections.abc import Sequence
from functools import lru_cache
from typing import NamedTuple

from tauscope.report.chart_plan import ChartPlan
from tauscope.report.pdf_file import PdfFile
from tauscope.report.pdf_flow import WIDTH, Style, draw_page, pixels
from tauscope.report.pdf_layout import layout_report
from tauscope.report.pdf_pages import cut_pages
from tauscope.report.run import Charts, RunRecord
from tauscope.report.text_safety import pdf_text
from tauscope.report.ttf import FontError, TrueTypeFont
from tauscope.resources_path import resource_path

A4 = (595.276, 841.890)  # points (210 × 297 mm)
MARGIN_MM = 18.0  # the page's margin on every side (Qt's route too)
MARGIN = MARGIN_MM / 25.4 * 72  # in points
FONT_FILES = (("DejaVuSans.ttf", "DejaVuSans"), ("DejaVuSans-Bold.ttf", "DejaVuSans-Bold"),
              ("DejaVuSans-Oblique.ttf", "DejaVuSans-Oblique"))
"""Regular, bold, oblique: the report's three faces (``/F0``, ``/F1``, ``/F2``)."""
DASHES = {"": "[] 0 d", "dash": "[6 3] 0 d", "dot": "[1.5 2.5] 0 d"}


class MissingGlyphs(Exception):
    """The report holds characters the bundled font has no glyph for (or the font is
    missing)."""


@lru_cache(maxsize=1)
def bundled_fonts() -> tuple[TrueTypeFont, ...]:
    """The three fonts, read once a process."""
    fonts = []
    for file_name, name in FONT_FILES:
        path = resource_path("fonts", file_name)
        if path is None:
            raise MissingGlyphs(f"the report's font {file_name} is not installed")
        try:
            fonts.append(TrueTypeFont.from_file(path, name))
        except (OSError, FontError) as exc:
            raise MissingGlyphs(f"the report's font {file_name} cannot be read: {exc}") from exc
    return tuple(fonts)


@lru_cache(maxsize=3)
def _char_widths(font: TrueTypeFont) -> dict[str, int]:
    return {chr(code): font.advances[glyph] for code, glyph in font.glyphs.items()}


_ESCAPED = {ord("("): "\\(", ord(")"): "\\)", ord("\\"): "\\\\", ord("\r"): "\\r"}


_BIDI_NOT_LEFT_TO_RIGHT = {"R", "AL", "AN", "RLE", "RLO", "RLI", "FSI", "LRE", "LRO", "PDF", "LRI",
                          "PDI"}
_SHAPED_SCRIPTS = ((0x0590, 0x08FF), (0x0900, 0x0DFF), (0x0E00, 0x0FFF), (0x1000, 0x109F),
                   (0x1780, 0x18AF), (0xFB1D, 0xFDFF), (0xFE70, 0xFEFF))
"""Hebrew, Arabic, Syriac, Thaana, N'Ko; the Indic scripts; Thai, Lao, Tibetan; Myanmar;
Khmer, Mongolian; Hebrew and Arabic presentation forms."""


@lru_cache(maxsize=3)
def writable(font: TrueTypeFont) -> frozenset[str]:
    """The characters this writer can set in ``font``: those it has a glyph for, less those
    that need more than one glyph a character at its advance, left to right: right-to-left
    text and its direction marks (Unicode Standard Annex #9) and scripts whose letters join
    or reorder (Hebrew and Arabic, the Indic scripts, Thai, Lao, Tibetan, Myanmar, Khmer,
    Mongolian).  Text with any other character goes through Qt, which shapes it."""
    return frozenset(
        char for char in _char_widths(font)
        if unicodedata.bidirectional(char) not in _BIDI_NOT_LEFT_TO_RIGHT
        and not any(low <= ord(char) <= high for low, high in _SHAPED_SCRIPTS))


@lru_cache(maxsize=3)
def _glyph_codes(font: TrueTypeFont) -> dict[int, str]:
    """``str.translate`` table: each character to its glyph number as the two bytes of a
    literal string (§7.3.4.2: "(", ")", "\\" and carriage return escaped), written as
    latin-1 characters."""
    def byte(value: int) -> str:
        return _ESCAPED.get(value, chr(value))

    return {code: byte(glyph >> 8) + byte(glyph & 0xFF) for code, glyph in font.glyphs.items()}


class DirectFace:
    """One of the bundled fonts (``index``) at ``size`` layout units to the em."""

    def __init__(self, index: int, font: TrueTypeFont, size: int) -> None:
        self.index, self.font, self.size = index, font, size
        self.key = f"direct:{index}:{size}"
        scale = size / font.metrics.units_per_em
        self._scale = scale
        self.ascent = font.metrics.ascent * scale
        self.height = (font.metrics.ascent - font.metrics.descent) * scale
        self._widths = _char_widths(font)
        self._advance: dict[str, float] = {}

    def advance(self, text: str) -> float:
        found = self._advance.get(text)
        if found is None:
            widths = self._widths
            notdef = self.font.advances[0]
            found = self._advance[text] = sum(widths.get(c, notdef) for c in text) * self._scale
        return found


class _State(NamedTuple):
    """What the content stream has set and the next ``Q`` would undo."""

    fill: str
    stroke: str
    width: float
    font: str


_NO_STATE = _State("", "", -1.0, "")


class DirectCanvas:
    """Page contents in PDF operators, drawn in layout units (y down) mapped onto the text
    area of an A4 page; every colour and line width set only when it changes."""

    def __init__(self, pdf: PdfFile) -> None:
        self.pdf = pdf
        self.scale = (A4[0] - 2 * MARGIN) / WIDTH
        self.page_height = (A4[1] - 2 * MARGIN) / self.scale
        self.missing: set[str] = set()
        self._codes: list[dict[str, str]] = [{} for _ in pdf.fonts]
        self._tables = [_glyph_codes(font) for font in pdf.fonts]
        self._covered = [writable(font) for font in pdf.fonts]
        self._ops: list[str] = []
        self._state = _NO_STATE
        self._stack: list[_State] = []
        self._label_faces: dict[int, DirectFace] = {}

    def begin_page(self) -> None:
        self._ops = [f"{self.scale:.6f} 0 0 {-self.scale:.6f} {MARGIN:.3f} "
                     f"{A4[1] - MARGIN:.3f} cm\n"]
        self._state = _NO_STATE
        self._stack = []

    def end_page(self) -> None:
        """The page added to the file; :class:`MissingGlyphs` if it needed a character the
        font lacks (found at the first such page: the rest is not drawn)."""
        if self.missing:
            shown = "".join(sorted(self.missing))[:20]
            raise MissingGlyphs(f"this writer cannot set {shown!r} (the font has no glyph for "
                                "it, or it needs shaping)")
        self.pdf.add_page("".join(self._ops))

    def _fill(self, color: str) -> None:
        if self._state.fill != color:
            self._ops.append(f"{_rgb(color)} rg\n")
            self._state = self._state._replace(fill=color)

    def _stroke(self, color: str, width: float) -> None:
        if self._state.stroke != color:
            self._ops.append(f"{_rgb(color)} RG\n")
        if self._state.width != width:
            self._ops.append(f"{width:g} w\n")
        self._state = self._state._replace(stroke=color, width=width)

    def _glyphs(self, index: int, text: str) -> str:
        found = self._codes[index].get(text)
        if found is None:
            chars = set(text)
            self.missing |= chars - self._covered[index]
            self.pdf.used[index] |= chars
            found = self._codes[index][text] = text.translate(self._tables[index])
        return found

    def text(self, x: float, baseline: float, text: str, style: Style) -> None:
        self.texts(((x, baseline, text),), style)

    def texts(self, placed: Sequence[tuple[float, float, str]], style: Style) -> None:
        face = style.face
        assert isinstance(face, DirectFace)
        self._fill(style.color)
        if self._state.font != face.key:  # the font is part of the graphics state (§9.3.1)
            self._ops.append(f"/F{face.index} {face.size} Tf\n")
            self._state = self._state._replace(font=face.key)
        known = self._codes[face.index].get
        glyphs, index = self._glyphs, face.index
        self._ops.append("BT\n" + "".join([
            f"1 0 0 -1 {x:.2f} {y:.2f} Tm ({known(text) or glyphs(index, text)}) Tj\n"
            for x, y, text in placed]) + "ET\n")

    def fill_rect(self, x: float, y: float, width: float, height: float, color: str) -> None:
        self._fill(color)
        self._ops.append(f"{x:.2f} {y:.2f} {width:.2f} {height:.2f} re f\n")

    def line(self, x1: float, y1: float, x2: float, y2: float, color: str) -> None:
        self._stroke(color, 1.0)
        self._ops.append(f"{x1:.2f} {y1:.2f} m {x2:.2f} {y2:.2f} l S\n")

    def chart(self, plan: ChartPlan, top: float, scale: float) -> None:
        """``plan`` with its top-left corner at (0, ``top``), ``scale`` layout units to its
        unit: lines with flat ends and round joins, text in the regular face."""
        self.save()
        self._ops.append(f"{scale:.6f} 0 0 {scale:.6f} 0 {top:.3f} cm 0 J 1 j\n")
        self.fill_rect(0, 0, round(plan.width), round(plan.height), plan.background)
        dash = ""
        for stroke in plan.strokes:
            self._stroke(stroke.color, stroke.width)
            if stroke.dash != dash:
                self._ops.append(DASHES[stroke.dash] + "\n")
                dash = stroke.dash
            xs, ys = stroke.points.T.tolist()
            if not xs:
                continue
            path = "".join(map("{:.2f} {:.2f} l\n".format, xs, ys))
            self._ops.append(path.replace(" l\n", " m\n", 1) + "S\n")
        for label in plan.labels:
            face = self._label_face(round(label.size))
            text = pdf_text(label.text)  # a name typed in the window may hold a tab
            x = label.x
            if label.anchor != "start":
                advance = face.advance(text)
                x -= advance if label.anchor == "end" else advance / 2
            self.text(x, label.y, text, Style(face, label.color))
        self.restore()

    def _label_face(self, size: int) -> DirectFace:
        face = self._label_faces.get(size)
        if face is None:
            face = self._label_faces[size] = DirectFace(0, self.pdf.fonts[0], size)
        return face

    def save(self) -> None:
        self._stack.append(self._state)
        self._ops.append("q\n")

    def restore(self) -> None:
        self._state = self._stack.pop()
        self._ops.append("Q\n")

    def translate(self, dx: float, dy: float) -> None:
        self._ops.append(f"1 0 0 1 {dx:.3f} {dy:.3f} cm\n")

    def clip(self, x: float, y: float, width: float, height: float) -> None:
        self._ops.append(f"{x:.2f} {y:.2f} {width:.2f} {height:.2f} re W n\n")


@lru_cache(maxsize=64)
def _rgb(color: str) -> str:
    """"#rrggbb" as the three numbers of ``rg`` and ``RG``."""
    value = color.lstrip("#")
    return " ".join(f"{int(value[k:k + 2], 16) / 255:.3f}" for k in (0, 2, 4))


def run_to_pdf_direct(run: RunRecord, charts: Charts | None = None) -> bytes:
    """The report on A4 pages, as PDF bytes; :class:`MissingGlyphs` when the bundled font
    cannot write every character of it."""
    fonts = bundled_fonts()
    faces: dict[tuple[int, bool, bool], DirectFace] = {}

    def font(points: float, bold: bool = False, italic: bool = False) -> DirectFace:
        key = (pixels(points), bold, italic)
        face = faces.get(key)
        if face is None:
            index = 1 if bold else 2 if italic else 0
            face = faces[key] = DirectFace(index, fonts[index], key[0])
        return face

    flow = layout_report(run, charts, font)
    pdf = PdfFile(A4[0], A4[1], fonts)
    canvas = DirectCanvas(pdf)
    tops = [piece.top for piece in flow.pieces]
    for page in cut_pages(flow.units, flow.y, canvas.page_height):
        canvas.begin_page()
        draw_page(canvas, flow, tops, page)
        canvas.end_page()
    return pdf.finish("Tauscope findings", f"Tauscope {run.version}")
