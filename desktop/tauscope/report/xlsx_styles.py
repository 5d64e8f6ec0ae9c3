"""Cell formats of an .xlsx workbook (ECMA-376, 5th ed., Part 1, §18.8: the styles part).

A cell names one cell format (§18.8.45 ``xf``), which points at a font (§18.8.22), a fill
(§18.8.32; fills 0 and 1 are reserved: none and "gray125"), a border (§18.8.4) and a number
format (§18.8.30; ids below 164 are built in, ours start at 164), with an alignment
(§18.8.1) and ``quotePrefix`` (the cell's text is text, never read as a formula).
:class:`Styles` gives each distinct :class:`Format` its index once and writes the part.
"""

from __future__ import annotations

from dataclasses import dataclass
from xml.sax.saxutils import quoteattr

MAIN = "http://schemas.openxmlformats.org/spreadsheetml/2006/main"
HEAD = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n'


@dataclass(frozen=True)
class Font:
    bold: bool = False
    italic: bool = False
    color: str | None = None  # "RRGGBB"
    size: float = 11.0


@dataclass(frozen=True)
class Format:
    """How a cell looks: font, solid fill colour, thin bottom border colour, alignment
    (vertical, wrapped), number format code, and whether text is marked as text."""

    font: Font = Font()
    fill: str | None = None
    bottom_border: str | None = None
    vertical: str | None = None
    wrap: bool = False
    number_format: str | None = None
    quote: bool = False


class Styles:
    """The workbook's cell formats: :meth:`xf` gives a format's index, adding it once."""

    def __init__(self) -> None:
        self._fonts: dict[Font, int] = {Font(): 0}
        self._fills: dict[str | None, int] = {None: 0}  # 1 is the reserved "gray125"
        self._borders: dict[str | None, int] = {None: 0}
        self._numbers: dict[str, int] = {}
        self._xfs: dict[Format, int] = {Format(): 0}

    def xf(self, cell: Format) -> int:
        found = self._xfs.get(cell)
        if found is None:
            found = self._xfs[cell] = len(self._xfs)
            self._fonts.setdefault(cell.font, len(self._fonts))
            if cell.fill is not None:
                self._fills.setdefault(cell.fill, len(self._fills) + 1)
            self._borders.setdefault(cell.bottom_border, len(self._borders))
            if cell.number_format is not None and cell.number_format not in BUILT_IN_FORMATS:
                self._numbers.setdefault(cell.number_format, 164 + len(self._numbers))
        return found

    def quoted(self, index: int) -> int:
        """The format ``index`` with text marked as text (``quotePrefix``)."""
        cell = next(c for c, i in self._xfs.items() if i == index)
        return self.xf(Format(cell.font, cell.fill, cell.bottom_border, cell.vertical, cell.wrap,
                              cell.number_format, True))

    def xml(self) -> str:
        numbers = "".join(f'<numFmt numFmtId="{i}" formatCode={quoteattr(code)}/>'
                          for code, i in self._numbers.items())
        fonts = "".join(_font_xml(f) for f in self._fonts)
        fills = '<fill><patternFill patternType="none"/></fill><fill><patternFill ' \
                'patternType="gray125"/></fill>' + "".join(
                    f'<fill><patternFill patternType="solid"><fgColor rgb="FF{c}"/>'
                    '<bgColor indexed="64"/></patternFill></fill>'
                    for c in self._fills if c is not None)
        borders = "".join(
            "<border><left/><right/><top/><bottom/><diagonal/></border>" if c is None else
            f'<border><left/><right/><top/><bottom style="thin"><color rgb="FF{c}"/></bottom>'
            "<diagonal/></border>" for c in self._borders)
        return (f'{HEAD}<styleSheet xmlns="{MAIN}">'
                + (f'<numFmts count="{len(self._numbers)}">{numbers}</numFmts>'
                   if self._numbers else "")
                + f'<fonts count="{len(self._fonts)}">{fonts}</fonts>'
                + f'<fills count="{len(self._fills) + 1}">{fills}</fills>'
                + f'<borders count="{len(self._borders)}">{borders}</borders>'
                + '<cellStyleXfs count="1"><xf numFmtId="0" fontId="0" fillId="0" '
                  'borderId="0"/></cellStyleXfs>'
                + f'<cellXfs count="{len(self._xfs)}">'
                + "".join(self._xf_xml(c) for c in self._xfs) + "</cellXfs>"
                + '<cellStyles count="1"><cellStyle name="Normal" xfId="0" builtinId="0"/>'
                  "</cellStyles></styleSheet>")

    def _xf_xml(self, cell: Format) -> str:
        number = 0
        if cell.number_format is not None:
            number = BUILT_IN_FORMATS.get(cell.number_format) or self._numbers[cell.number_format]
        attributes = (f'numFmtId="{number}" fontId="{self._fonts[cell.font]}" '
                      f'fillId="{self._fills[cell.fill] if cell.fill is not None else 0}" '
                      f'borderId="{self._borders[cell.bottom_border]}" xfId="0"')
        attributes += ''.join((
            ' applyNumberFormat="1"' if number else "",
            ' applyFont="1"' if cell.font != Font() else "",
            ' applyFill="1"' if cell.fill is not None else "",
            ' applyBorder="1"' if cell.bottom_border is not None else "",
            ' quotePrefix="1"' if cell.quote else ""))
        if cell.vertical is None and not cell.wrap:
            return f"<xf {attributes}/>"
        align = (f' vertical="{cell.vertical}"' if cell.vertical else "") + (
            ' wrapText="1"' if cell.wrap else "")
        return f'<xf {attributes} applyAlignment="1"><alignment{align}/></xf>'


BUILT_IN_FORMATS = {"General": 0, "0": 1, "0.00": 2}
"""Number formats every spreadsheet knows by number (§18.8.30)."""


def _font_xml(font: Font) -> str:
    return ("<font>" + ("<b/>" if font.bold else "") + ("<i/>" if font.italic else "")
            + f'<sz val="{font.size:g}"/>'
            + (f'<color rgb="FF{font.color}"/>' if font.color else "")
            + '<name val="Calibri"/><family val="2"/></font>')
