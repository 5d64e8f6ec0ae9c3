"""How big each sheet of a workbook really is, found before any reader builds it.

A spreadsheet reader lays a sheet out as one rectangle from its first to its last
cell, so a file of a few hundred bytes that puts one cell in A1 and another in
XFD1048576 asks for 17 billion cells (hundreds of GB).  Before python-calamine is
asked for a sheet, the sheet's XML (.xlsx) or its cell records (.xls, see
:mod:`tauscope.data.xls_scan`) are scanned in bounded pieces for the last row and
column any cell names and for the number of cells; a sheet beyond ``MAX_CELLS`` (or
beyond the largest sheet Excel allows) is refused with a sentence naming it.

The .xlsx scan reads each worksheet part in ``CHUNK`` pieces with an overlap, so it
never holds more than a few MB of XML, and uses only regular expressions over bytes
(no XML parser, so nothing in the file is expanded).
"""

from __future__ import annotations

import re
import zipfile
from collections.abc import Iterator
from dataclasses import dataclass

import numpy as np
from defusedxml import ElementTree

from tauscope.data.errors import DataError

EXCEL_ROWS, EXCEL_COLUMNS = 1_048_576, 16_384
MAX_CELLS = 6_000_000  # rectangle of one sheet (a 5,000 x 500 sheet has 2.5 million)
MAX_SHEET_CELLS = 8_000_000  # cells written in one sheet (duplicates count)
CHUNK = 8 << 20
OVERLAP = 64
MAX_INDEX_BYTES = 4 << 20  # workbook.xml and its relations are small

_PREFIXED = re.compile(rb"<[A-Za-z_][\w.-]*:(?:c|row)[\s>/]")
_MARK = np.frombuffer(b' r="', dtype=np.uint8)


@dataclass
class SheetSize:
    """The last row and column (1-based) any cell names, and how many cells there are."""

    rows: int = 0
    columns: int = 0
    cells: int = 0
    row_elements: int = 0
    unreferenced: int = 0  # cells without an "r" attribute (placed one after another)

    @property
    def area(self) -> int:
        """Cells in the rectangle a reader will build."""
        width = max(self.columns, 1 if self.cells else 0)
        if self.unreferenced:  # such cells run on to the right of the last referenced one
            width = max(width, self.columns + self.unreferenced)
        return max(self.rows, self.row_elements) * width


def column_number(letters: bytes) -> int:
    """Spreadsheet column letters to a number: A → 1, Z → 26, AA → 27, XFD → 16384."""
    number = 0
    for code in letters:
        number = number * 26 + code - 64
    return number


def _pieces(archive: zipfile.ZipFile, name: str) -> Iterator[bytes]:
    with archive.open(name) as stream:
        tail = b""
        while True:
            block = stream.read(CHUNK)
            if not block:
                return
            yield tail + block
            tail = block[-OVERLAP:]


def references(piece: bytes) -> tuple[int, int, int]:
    """The largest row number and column number among ``r="..."`` attributes in ``piece``
    (a row's ``r="12"`` or a cell's ``r="AB12"``), and how many carry column letters.

    Vectorised over the bytes (numpy): every place the four bytes `` r="`` start is
    found, then up to four letters and eight digits after it are read as numbers.  A
    reference with more letters or digits than that counts as beyond any sheet.
    """
    raw = np.frombuffer(piece, dtype=np.uint8)
    n = raw.size - 16
    if n <= 0:
        return 0, 0, 0
    hit = raw[:n] == _MARK[0]
    for k in (1, 2, 3):
        hit &= raw[k : n + k] == _MARK[k]
    starts = np.flatnonzero(hit) + 4
    if starts.size == 0:
        return 0, 0, 0
    column = np.zeros(starts.size, dtype=np.int64)
    letters = np.zeros(starts.size, dtype=np.int64)
    going = np.ones(starts.size, dtype=bool)
    for k in range(5):
        code = raw[starts + k].astype(np.int64)
        going &= (code >= 65) & (code <= 90)
        column = np.where(going, column * 26 + code - 64, column)
        letters += going
    row = np.zeros(starts.size, dtype=np.int64)
    going = np.ones(starts.size, dtype=bool)
    after = starts + letters
    for k in range(9):
        code = raw[after + k].astype(np.int64)
        going &= (code >= 48) & (code <= 57)
        row = np.where(going, row * 10 + code - 48, row)
    too_big = (letters > 3) | (row > 99_999_999)
    if too_big.any():
        return EXCEL_ROWS + 1, EXCEL_COLUMNS + 1, int((letters > 0).sum())
    return int(row.max()), int(column.max()), int((letters > 0).sum())


def scan_xml_sheet(archive: zipfile.ZipFile, part: str) -> SheetSize:
    """Bounds of one worksheet part, read in bounded pieces.

    Counts err on the safe side: every tag starting ``<c`` counts as a cell and every
    ``<row`` as a row (a tag overlapping two pieces counts twice); the last row and
    column come from the references (:func:`references`).
    """
    size = SheetSize()
    for piece in _pieces(archive, part):
        cells, rows = piece.count(b"<c"), piece.count(b"<row")
        if b":c" in piece or b":row" in piece:
            extra = len(_PREFIXED.findall(piece))
            cells, rows = cells + extra, rows + extra
        last_row, last_column, referenced = references(piece)
        size.cells += cells
        size.row_elements += rows
        size.unreferenced += max(cells - referenced, 0)
        size.rows, size.columns = max(size.rows, last_row), max(size.columns, last_column)
        if size.cells > MAX_SHEET_CELLS or size.rows > EXCEL_ROWS:
            return size
    return size


def _xml(archive: zipfile.ZipFile, name: str) -> object | None:
    try:
        info = archive.getinfo(name)
    except KeyError:
        return None
    if info.file_size > MAX_INDEX_BYTES:
        return None
    try:
        return ElementTree.fromstring(archive.read(name))
    except Exception:
        return None


def sheet_parts(archive: zipfile.ZipFile) -> dict[str, str]:
    """Worksheet part name → the sheet's name (the part name when the index is unreadable).
    Every part under xl/worksheets/ is listed, named or not."""
    names = {i.filename for i in archive.infolist()}
    parts = {n: n.rsplit("/", 1)[-1] for n in names
             if n.startswith("xl/worksheets/") and n.endswith(".xml") and "/_rels/" not in n}
    book, rels = _xml(archive, "xl/workbook.xml"), _xml(archive, "xl/_rels/workbook.xml.rels")
    if book is None or rels is None:
        return parts
    targets = {}
    for rel in rels.iter():  # type: ignore[attr-defined]
        target, ident = rel.get("Target"), rel.get("Id")
        if target and ident:
            target = target.lstrip("/")
            targets[ident] = target if target.startswith("xl/") else f"xl/{target}"
    for sheet in book.iter():  # type: ignore[attr-defined]
        if not str(sheet.tag).endswith("}sheet"):
            continue
        ident = next((v for k, v in sheet.attrib.items() if k.endswith("}id")), None)
        part = targets.get(ident or "")
        if part in names and sheet.get("name"):
            parts[part] = sheet.get("name")
    return parts


def check_xlsx_sizes(archive: zipfile.ZipFile, file: str) -> None:
    """DataError for a worksheet too large to lay out (see the module docstring)."""
    for part, sheet in sheet_parts(archive).items():
        check_size(scan_xml_sheet(archive, part), file, sheet)


def check_size(size: SheetSize, file: str, sheet: str) -> None:
    """Refuse a sheet whose cells lie beyond Excel's largest sheet or span too many cells."""
    if size.rows > EXCEL_ROWS or size.columns > EXCEL_COLUMNS:
        raise DataError("is damaged: it names a cell beyond the largest sheet Excel allows "
                        f"({EXCEL_ROWS:,} rows, {EXCEL_COLUMNS:,} columns)", file=file, sheet=sheet)
    if size.area > MAX_CELLS or size.cells > MAX_SHEET_CELLS:
        raise DataError(
            f"is too large to read: its cells reach row {max(size.rows, size.row_elements):,} "
            f"and column {max(size.columns, 1):,} ({size.area:,} cells to lay out; Tauscope "
            f"reads up to {MAX_CELLS:,}); delete unused rows and columns and save again",
            file=file, sheet=sheet)
