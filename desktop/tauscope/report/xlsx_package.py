"""A small SpreadsheetML writer: the parts of an .xlsx package the findings workbook uses.

Office Open XML (ECMA-376, 5th ed., Part 1): a ZIP package of XML parts tied together by
relationships (Part 2, Open Packaging Conventions: ``[Content_Types].xml``, ``_rels/.rels``,
each part's ``_rels/*.rels``).  What is written here, by section of Part 1:

* the workbook and its sheets (§18.2.27 ``workbook``, §18.3.1.99 ``worksheet``), each sheet's
  rows and cells (§18.3.1.73 ``row``, §18.3.1.4 ``c``: ``t="s"`` a shared string, ``t="b"`` a
  boolean, no ``t`` a number), column widths (§18.3.1.13 ``col``), a frozen pane
  (§18.3.1.66 ``pane``), a filter over a range (§18.3.1.2 ``autoFilter``, with the hidden
  ``_xlnm._FilterDatabase`` name a spreadsheet keeps for it, §18.2.5);
* every text once in the shared string table (§18.4.9 ``sst``), so a text repeated on
  thousands of rows (a series' name, "do not reject") is written and escaped once;
* the cell formats (§18.8.45 ``xf``: font §18.8.22, fill §18.8.32, border §18.8.4,
  alignment §18.8.1, number format §18.8.30, ``quotePrefix``: the text is text, never a
  formula), each distinct combination once;
* drawings anchored at a cell (a drawing part, §20.5: the anchors' DrawingML is made by the
  caller, :mod:`.xlsx_chart` for the charts, each shape numbered from :attr:`Sheet.shape_ids`);
* the document properties (Part 2 §11 core properties; Part 1 §22.2 extended properties).

Rows are turned into XML text as they are added, which keeps a workbook of several hundred
thousand cells a matter of a fraction of a second in plain Python.
"""

from __future__ import annotations

import datetime as dt
import itertools
import math
from collections.abc import Sequence
from xml.sax.saxutils import escape, quoteattr
from zipfile import ZIP_DEFLATED, ZipFile

from tauscope.report.safety import looks_like_formula
from tauscope.report.text_safety import xml_text
from tauscope.report.xlsx_styles import MAIN, Font, Format, Styles

Value = str | int | float | None
REL = "http://schemas.openxmlformats.org/officeDocument/2006/relationships"
PACKAGE_REL = "http://schemas.openxmlformats.org/package/2006/relationships"
DRAWING = "http://schemas.openxmlformats.org/drawingml/2006/spreadsheetDrawing"
DRAWING_MAIN = "http://schemas.openxmlformats.org/drawingml/2006/main"
TYPE = "application/vnd.openxmlformats-officedocument."
DEFLATE_LEVEL = 1
"""zlib level for the XML parts: on 100 series' 3 MB of XML, 18 ms against level 6's 53 ms, for
32% more bytes (0.55 against 0.42 MB)."""
_HEAD = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n'


def column_letter(index: int) -> str:
    """The column's letters for a 1-based ``index`` (1 → A, 27 → AA)."""
    letters = ""
    while index > 0:
        index, rest = divmod(index - 1, 26)
        letters = chr(65 + rest) + letters
    return letters


_LETTERS = [column_letter(i) for i in range(1, 257)]


def _letter(index: int) -> str:
    return _LETTERS[index - 1] if index <= len(_LETTERS) else column_letter(index)


class Strings:
    """The shared string table: each distinct text once, by its index."""

    def __init__(self) -> None:
        self.index: dict[str, int] = {}
        self.cells: dict[str, tuple[str, bool]] = {}
        """Each text met so far, as written: (its index in the table as text, whether it is
        marked as text because it looks like a formula)."""

    def cell(self, value: str) -> tuple[str, bool]:
        """``value``'s entry (made safe for XML: :func:`xml_text`) and whether a spreadsheet
        could read it as a formula; remembered for the next cell with the same text."""
        text = xml_text(value)
        found = self.index.get(text)
        if found is None:
            found = self.index[text] = len(self.index)
        made = self.cells[value] = (str(found), looks_like_formula(text))
        return made

    def xml(self) -> str:
        items = "".join(
            f'<si><t xml:space="preserve">{escape(t)}</t></si>' if t != t.strip() else
            f"<si><t>{escape(t)}</t></si>" for t in self.index)
        return (f'{_HEAD}<sst xmlns="{MAIN}" count="{len(self.index)}" '
                f'uniqueCount="{len(self.index)}">{items}</sst>')


class Sheet:
    """One worksheet, its rows written as XML as they are added."""

    def __init__(self, book: Book, name: str) -> None:
        self.book = book
        self.name = name
        self.rows: list[str] = []
        self.widths: dict[int, float] = {}
        self.heights: dict[int, float] = {}
        self.freeze: str | None = None  # the top-left cell that scrolls, e.g. "B2"
        self.filter: str | None = None  # a range, e.g. "A1:W501"
        self.anchors: list[str] = []  # the drawing part's anchors, as DrawingML
        self.shape_ids = itertools.count(2)  # a shape's id, unique in the drawing part

    @property
    def written(self) -> int:
        return len(self.rows)

    def add(self, values: Sequence[Value], styles: Sequence[int] | None = None) -> None:
        """A row of ``values`` (None: no cell), each with the format of the same position in
        ``styles`` (0: none). Text is made safe for XML (:func:`xml_text`) and text that a
        spreadsheet could read as a formula is marked as text (``quotePrefix``)."""
        number = len(self.rows) + 1
        known = self.book.strings.cells
        letters = _LETTERS if len(values) <= len(_LETTERS) else [
            column_letter(i) for i in range(1, len(values) + 1)]
        cells = []
        for j, value in enumerate(values):
            style = styles[j] if styles is not None else 0
            if type(value) is float and value - value == 0:  # finite (inf - inf, NaN: NaN)
                kind_attribute, content = "", repr(value)
            elif type(value) is str and value:
                found = known.get(value)
                if found is None:
                    found = self.book.strings.cell(value)
                content, quoted = found
                if quoted:
                    style = self.book.styles.quoted(style)
                kind_attribute = ' t="s"'
            else:
                cell = self._other(value)
                if cell is None:
                    if style:
                        cells.append(f'<c r="{letters[j]}{number}" s="{style}"/>')
                    continue
                kind_attribute, content, quoted = cell
                if quoted:
                    style = self.book.styles.quoted(style)
            s = f' s="{style}"' if style else ""
            cells.append(f'<c r="{letters[j]}{number}"{s}{kind_attribute}><v>{content}</v></c>')
        height = self.heights.get(number)
        attributes = f' ht="{height:g}" customHeight="1"' if height is not None else ""
        self.rows.append(f'<row r="{number}"{attributes}>{"".join(cells)}</row>'
                         if cells or attributes else "")

    def _other(self, value: Value) -> tuple[str, str, bool] | None:
        """A value that is not a plain finite float or non-empty text: (type attribute,
        content, marked as text), or None for no value (None, "", NaN, infinity)."""
        if value is None or value == "":
            return None
        if isinstance(value, str):
            content, quoted = self.book.strings.cell(value)
            return ' t="s"', content, quoted
        if isinstance(value, bool):
            return ' t="b"', str(int(value)), False
        if isinstance(value, int):
            return "", str(value), False
        if math.isfinite(value):
            return "", repr(float(value)), False
        return None  # a spreadsheet has no NaN or infinity: an empty cell

    def skip_to(self, row: int) -> None:
        """Leave rows empty until the next row added is ``row`` (1-based)."""
        while len(self.rows) < row - 1:
            self.rows.append("")

    def anchor(self, drawing: str) -> None:
        """Add an anchor of the sheet's drawing part (``xdr:oneCellAnchor`` or another, as
        DrawingML; its shapes numbered from :attr:`shape_ids`)."""
        self.anchors.append(drawing)

    def xml(self, first: bool, drawing: str | None) -> str:
        view = ' tabSelected="1"' if first else ""
        if self.freeze is not None:
            column, row = _split(self.freeze)
            panes = (f'<pane xSplit="{column - 1}" ySplit="{row - 1}" topLeftCell="{self.freeze}"'
                     ' activePane="bottomRight" state="frozen"/><selection pane="bottomRight" '
                     f'activeCell="{self.freeze}" sqref="{self.freeze}"/>')
            views = f'<sheetView{view} workbookViewId="0">{panes}</sheetView>'
        else:
            views = f'<sheetView{view} workbookViewId="0"/>'
        columns = "".join(f'<col min="{j}" max="{j}" width="{w:g}" customWidth="1"/>'
                          for j, w in sorted(self.widths.items()))
        return "".join((
            f'{_HEAD}<worksheet xmlns="{MAIN}" xmlns:r="{REL}"><sheetViews>{views}</sheetViews>'
            '<sheetFormatPr defaultRowHeight="15"/>',
            f"<cols>{columns}</cols>" if columns else "",
            "<sheetData>", *self.rows, "</sheetData>",
            f'<autoFilter ref="{self.filter}"/>' if self.filter else "",
            '<pageMargins left="0.75" right="0.75" top="1" bottom="1" header="0.5" '
            'footer="0.5"/>',
            f'<drawing r:id="{drawing}"/>' if drawing else "",
            "</worksheet>"))


def _split(cell: str) -> tuple[int, int]:
    letters = cell.rstrip("0123456789")
    column = 0
    for letter in letters:
        column = column * 26 + ord(letter) - 64
    return column, int(cell[len(letters):])


class Book:
    """A workbook being written: its sheets in order, the shared strings and the formats."""

    def __init__(self, creator: str) -> None:
        self.creator = creator
        self.sheets: list[Sheet] = []
        self.strings = Strings()
        self.styles = Styles()

    def sheet(self, name: str) -> Sheet:
        made = Sheet(self, name)
        self.sheets.append(made)
        return made

    def package(self) -> bytes:
        """The .xlsx file's bytes."""
        import io

        buffer = io.BytesIO()
        with ZipFile(buffer, "w", ZIP_DEFLATED, allowZip64=True,
                     compresslevel=DEFLATE_LEVEL) as archive:
            self._write(archive)
        return buffer.getvalue()

    def _write(self, archive: ZipFile) -> None:
        overrides = [("/xl/workbook.xml", TYPE + "spreadsheetml.sheet.main+xml"),
                     ("/xl/styles.xml", TYPE + "spreadsheetml.styles+xml"),
                     ("/xl/sharedStrings.xml", TYPE + "spreadsheetml.sharedStrings+xml"),
                     ("/docProps/core.xml", "application/vnd.openxmlformats-package.core-"
                                            "properties+xml"),
                     ("/docProps/app.xml", TYPE + "extended-properties+xml")]
        book_rels = []
        sheets_xml = []
        names = []
        drawings = 0
        for number, sheet in enumerate(self.sheets, start=1):
            part = f"xl/worksheets/sheet{number}.xml"
            overrides.append((f"/{part}", TYPE + "spreadsheetml.worksheet+xml"))
            book_rels.append((f"rId{number}", REL + "/worksheet", f"worksheets/sheet{number}.xml"))
            sheets_xml.append(f'<sheet name={quoteattr(sheet.name)} sheetId="{number}" '
                              f'r:id="rId{number}"/>')
            if sheet.filter:
                column_a, row_a = sheet.filter.split(":")
                names.append(f'<definedName name="_xlnm._FilterDatabase" '
                             f'localSheetId="{number - 1}" hidden="1">'
                             f"{escape(_absolute(sheet.name, column_a, row_a))}</definedName>")
            drawing = None
            if sheet.anchors:
                drawings += 1
                drawing = "rId1"
                _part(archive, f"xl/worksheets/_rels/sheet{number}.xml.rels", _rels(
                    [("rId1", REL + "/drawing", f"../drawings/drawing{drawings}.xml")]))
                overrides.append((f"/xl/drawings/drawing{drawings}.xml", TYPE + "drawing+xml"))
                _part(archive, f"xl/drawings/drawing{drawings}.xml",
                      f'{_HEAD}<xdr:wsDr xmlns:xdr="{DRAWING}" xmlns:a="{DRAWING_MAIN}" '
                      f'xmlns:r="{REL}">{"".join(sheet.anchors)}</xdr:wsDr>')
            _part(archive, part, sheet.xml(number == 1, drawing))
        count = len(self.sheets)
        book_rels += [(f"rId{count + 1}", REL + "/styles", "styles.xml"),
                      (f"rId{count + 2}", REL + "/sharedStrings", "sharedStrings.xml")]
        _part(archive, "xl/workbook.xml",
              f'{_HEAD}<workbook xmlns="{MAIN}" xmlns:r="{REL}"><bookViews><workbookView '
              f'activeTab="0"/></bookViews><sheets>{"".join(sheets_xml)}</sheets>'
              + (f'<definedNames>{"".join(names)}</definedNames>' if names else "")
              + "</workbook>")
        _part(archive, "xl/_rels/workbook.xml.rels", _rels(book_rels))
        _part(archive, "xl/styles.xml", self.styles.xml())
        _part(archive, "xl/sharedStrings.xml", self.strings.xml())
        _part(archive, "docProps/core.xml", self._core())
        _part(archive, "docProps/app.xml",
              f'{_HEAD}<Properties xmlns="http://schemas.openxmlformats.org/officeDocument/2006/'
              f'extended-properties"><Application>{escape(self.creator)}</Application>'
              "</Properties>")
        _part(archive, "_rels/.rels", _rels([
            ("rId1", REL + "/officeDocument", "xl/workbook.xml"),
            ("rId2", PACKAGE_REL + "/metadata/core-properties", "docProps/core.xml"),
            ("rId3", REL + "/extended-properties", "docProps/app.xml")]))
        types = "".join(f'<Override PartName="{p}" ContentType="{t}"/>' for p, t in overrides)
        _part(archive, "[Content_Types].xml",
              f'{_HEAD}<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">'
              '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.'
              'relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>'
              f'{types}</Types>')

    def _core(self) -> str:
        now = dt.datetime.now(dt.UTC).strftime("%Y-%m-%dT%H:%M:%SZ")
        return (f'{_HEAD}<cp:coreProperties xmlns:cp="http://schemas.openxmlformats.org/package/'
                '2006/metadata/core-properties" xmlns:dc="http://purl.org/dc/elements/1.1/" '
                'xmlns:dcterms="http://purl.org/dc/terms/" '
                'xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">'
                f"<dc:creator>{escape(self.creator)}</dc:creator>"
                f'<dcterms:created xsi:type="dcterms:W3CDTF">{now}</dcterms:created>'
                f'<dcterms:modified xsi:type="dcterms:W3CDTF">{now}</dcterms:modified>'
                "</cp:coreProperties>")


def _absolute(sheet: str, first: str, last: str) -> str:
    """``'Sheet'!$A$1:$W$501`` (a quote in the name doubled)."""
    def cell(ref: str) -> str:
        letters = ref.rstrip("0123456789")
        return f"${letters}${ref[len(letters):]}"

    return "'" + sheet.replace("'", "''") + f"'!{cell(first)}:{cell(last)}"


def _rels(relations: Sequence[tuple[str, str, str]]) -> str:
    items = "".join(f'<Relationship Id="{i}" Type="{t}" Target="{target}"/>'
                    for i, t, target in relations)
    return f'{_HEAD}<Relationships xmlns="{PACKAGE_REL}">{items}</Relationships>'


def _part(archive: ZipFile, name: str, text: str) -> None:
    archive.writestr(name, text.encode("utf-8"))


__all__ = ["Book", "Font", "Format", "Sheet", "Styles", "Value", "column_letter"]
