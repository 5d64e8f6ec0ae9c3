"""Large text files parsed by pandas' compiled (C) parser after our own detection.

The encoding, delimiter and decimal mark are detected as for every text file
(:mod:`tauscope.data.textfile`).  A file of at least ``FAST_FROM_LINES`` lines is then
split in two: the rows above the first row that looks like data (title, notes, header)
are split and classified by our own cell rules, and everything from that row on is
parsed by ``pandas.read_csv(engine="c")`` with our missing-value codes as its only NA
strings and our decimal mark.  Columns the C parser reads as numbers are taken as they
are (a float64 column: every cell a number or empty); any column it cannot read as
numbers (text, dates, numbers with thousands separators or flags) is classified cell by
cell by our rules, so the result is the one the cell-by-cell path gives, except that a
missing-value code in an all-number column counts as an empty cell.  Smaller files,
files whose head has a quoted line break and anything the C parser refuses take the
cell-by-cell path.  ``benchmarks/read_workbook.py`` times both against ``read_csv``.
"""

from __future__ import annotations

import io
from dataclasses import dataclass

import numpy as np
import pandas as pd

from tauscope.data.cells import MISSING_CODES, Cell, NumberFormat, detect_number_format
from tauscope.data.errors import DataError
from tauscope.data.grid import EMPTY, MISSING, NUMBER, TEXT, classify_grid
from tauscope.data.sheet_size import MAX_CELLS
from tauscope.data.textfile import detect, lines_of, read_text_rows, reading_note, split

FAST_FROM_LINES = 2000
HEAD_LINES = 300
HEAD_CHARS = 64_000
HEAD_MIN_LINES = 20
BOXED_COLUMNS = 4  # number columns kept cell by cell: the layout's date candidates (3) + 1
BOXED_ROWS = 80  # rows kept cell by cell in every column: the layout's row scan (60) + room
_CASES = (str.lower, str.upper, str.title, lambda s: s)
NA_STRINGS = sorted({case(code) for code in MISSING_CODES for case in _CASES} | {""})

Arrays = tuple[np.ndarray, np.ndarray, np.ndarray]
CODECS = {"UTF-8": "utf-8", "UTF-8 (with byte-order mark)": "utf-8-sig", "UTF-16": "utf-16",
          "Windows-1252": "cp1252", "Latin-1": "latin-1"}


def _first_data_row(codes: np.ndarray) -> int | None:
    """The first row with a number and no text beyond its first filled cell."""
    for i in range(codes.shape[0]):
        row = codes[i]
        filled = np.flatnonzero(row != EMPTY)
        if filled.size and (row == NUMBER).any() and not (row[filled[1:]] == TEXT).any():
            return i
    return None


def _head(lines: list[str]) -> list[str]:
    """The first lines: up to ``HEAD_LINES``, and beyond ``HEAD_CHARS`` characters only
    until ``HEAD_MIN_LINES`` lines are taken."""
    size = 0
    for count, line in enumerate(lines[:HEAD_LINES]):
        if size > HEAD_CHARS and count >= HEAD_MIN_LINES:
            return lines[:count]
        size += len(line)
    return lines[:HEAD_LINES]


def _pad(rows: list[list[str]], width: int) -> list[list[Cell]]:
    return [[*row, *([None] * (width - len(row)))] for row in rows]


def fast_arrays(data: bytes, text: str, encoding: str, delimiter: str | None,
                numbers: NumberFormat) -> Arrays | None:
    """(cells, kinds, numbers) of the whole file as arrays, or None for the cell-by-cell
    path (see the module docstring).  The C parser reads the file's own bytes; ``text``
    is the decoded file, or for UTF-8 only its head."""
    codec = CODECS.get(encoding)
    line_feeds = data.count(b"\n") if codec != "utf-16" else text.count("\n")
    if delimiter is None or codec is None or line_feeds < FAST_FROM_LINES:
        return None
    odd = (text.count("\r") != text.count("\r\n") if codec == "utf-16" else
           b"\x00" in data or (b"\r" in data and data.count(b"\r") != data.count(b"\r\n")))
    if odd:
        return None  # lone carriage returns and NUL bytes: the cell-by-cell rules apply
    head_lines = _head(lines_of(text[: HEAD_CHARS * 4]))
    head = split("\n".join(head_lines), delimiter)
    if len(head) != len(head_lines):
        return None  # a quoted field runs over a line break: leave it to the csv module
    rows = line_feeds + 1
    width = max(len(row) for row in head)
    head_codes, _ = classify_grid(_pad(head, width), numbers)
    skip = _first_data_row(head_codes)
    if skip is None:
        return None
    frame = _parse(data, codec, delimiter, numbers, skip, width, rows)
    if frame is None:  # a row further down is wider than the head: count every row's fields
        if codec == "utf-16":
            width = max(map(lambda line: line.count(delimiter), text.split("\n"))) + 1
        else:
            mark = delimiter.encode()
            width = max(map(lambda line: line.count(mark), data.split(b"\n"))) + 1
        frame = _parse(data, codec, delimiter, numbers, skip, width, rows)
    if frame is None:
        return None
    return _combine(_pad(head[:skip], frame.shape[1]), frame, numbers)


def _parse(data: bytes, codec: str, delimiter: str, numbers: NumberFormat, skip: int,
           width: int, rows: int) -> pd.DataFrame | None:
    """The rows from ``skip`` on through pandas' C parser, ``width`` columns; None when the
    parser refuses them (or they would be more than ``MAX_CELLS`` cells)."""
    if width * rows > MAX_CELLS:
        return None  # the cell-by-cell path refuses or reads it with its own bounds
    try:
        return pd.read_csv(
            io.BytesIO(data), encoding=codec, sep=delimiter, header=None, skiprows=skip,
            names=range(width), engine="c", keep_default_na=False, na_values=NA_STRINGS,
            decimal=numbers.decimal, quotechar='"', skipinitialspace=delimiter != "\t",
            skip_blank_lines=False, dtype=None, low_memory=False)
    except (ValueError, pd.errors.ParserError, OverflowError, UnicodeError):
        return None


def _combine(head: list[list[Cell]], frame: pd.DataFrame, numbers: NumberFormat) -> Arrays:
    width, top = frame.shape[1], len(head)
    rows = top + frame.shape[0]
    grid = np.empty((rows, width), dtype=object)
    codes = np.full((rows, width), EMPTY, dtype=np.int8)
    nums = np.full((rows, width), np.nan)
    if head:
        grid[:top] = np.array(head, dtype=object).reshape(top, width)
        codes[:top], nums[:top] = classify_grid(head, numbers)
    numeric = [j for j in range(width) if frame[j].dtype.kind in "fi"]
    if numeric:  # columns the C parser read as numbers, all at once
        place: slice | list[int] = numeric
        if numeric == list(range(numeric[0], numeric[-1] + 1)):
            place = slice(numeric[0], numeric[-1] + 1)
        block = frame.iloc[:, place].to_numpy(dtype=np.float64)
        finite = np.isfinite(block)
        kinds = np.where(finite, NUMBER, EMPTY).astype(np.int8)
        if not finite.all():
            kinds[np.isinf(block)] = MISSING
            block = np.where(finite, block, np.nan)
        nums[top:, place] = block
        codes[top:, place] = kinds
        # The layout reads numbers from ``nums``; it looks at number cells themselves only
        # in the first rows and in the first few filled columns (dates, years), so only
        # those are kept as objects.
        first = block[:BOXED_ROWS].astype(object)
        first[~finite[:BOXED_ROWS]] = None
        grid[top : top + first.shape[0], numeric] = first
        filled_columns = [k for k in range(len(numeric)) if finite[:, k].any()]
        for k in filled_columns[:BOXED_COLUMNS]:
            cells = block[:, k].astype(object)
            cells[~finite[:, k]] = None
            grid[top:, numeric[k]] = cells
    for j in sorted(set(range(width)) - set(numeric)):
        cells = frame[j].to_numpy(dtype=object)
        cells[pd.isna(cells)] = None
        kinds, found = classify_grid([[cell] for cell in cells], numbers)
        codes[top:, j], nums[top:, j] = kinds[:, 0], found[:, 0]
        grid[top:, j] = cells
    filled = np.flatnonzero((codes != EMPTY).any(axis=1))
    last = int(filled[-1]) + 1 if filled.size else 0
    return grid[:last], codes[:last], nums[:last]


@dataclass(frozen=True)
class TextTable:
    """A text file read: its rows of cells (cell-by-cell path) or its cells already laid
    out as arrays (compiled-parser path, :mod:`tauscope.data.text_table`)."""

    rows: list[list[Cell]]
    arrays: tuple[np.ndarray, np.ndarray, np.ndarray] | None
    numbers: NumberFormat
    notes: list[str]


def read_text_table(data: bytes, file: str) -> TextTable:
    """The file's cells: large files through pandas' C parser, others cell by cell.

    A large file whose head reads as UTF-8 is detected on its head alone and handed to
    the C parser as bytes (the parser checks the rest is UTF-8; if not, the whole file is
    decoded and detected as usual)."""
    if data.count(b"\n") >= FAST_FROM_LINES:
        head = data[: HEAD_CHARS * 4]
        head = head[: head.rfind(b"\n") + 1] or head
        try:
            text, encoding, delimiter = detect(head, file)
        except DataError:
            encoding = ""
        if encoding.startswith("UTF-8"):
            table = _fast_table(data, text, encoding, delimiter)
            if table is not None:
                return table
    text, encoding, delimiter = detect(data, file)
    table = _fast_table(data, text, encoding, delimiter)
    if table is not None:
        return table
    rows, numbers, notes = read_text_rows(data, file)
    return TextTable([list(r) for r in rows], None, numbers, notes)


def _fast_table(data: bytes, text: str, encoding: str, delimiter: str | None) -> TextTable | None:
    sample = split("\n".join(_head(lines_of(text[: HEAD_CHARS * 4]))), delimiter) \
        if delimiter else []
    numbers = detect_number_format(
        (cell for row in sample for cell in row[1:] if cell), prefer_comma=delimiter == ";")
    arrays = fast_arrays(data, text, encoding, delimiter, numbers)
    if arrays is None:
        return None
    return TextTable([], arrays, numbers, reading_note(encoding, delimiter, numbers))
