"""Excel workbooks into rows of cells: cached values only, never formulas or macros.

.xlsx/.xlsm are read with python-calamine (Rust; reads the cached value of every formula
cell and never evaluates or runs anything) and, if calamine is missing, with openpyxl in
``read_only=True, data_only=True`` mode (cached values; VBA is not loaded).
benchmarks/read_workbook.py measures both on a 5,000 × 500 sheet and checks that they give
the same cells (they do, after trailing empty cells are padded); calamine was 7 to 12 times
faster than openpyxl in our runs, so it is used whenever it is installed.
XML is parsed safely by both: openpyxl goes through defusedxml whenever defusedxml is
installed (``openpyxl.xml.DEFUSEDXML`` is then True; defusedxml is a Tauscope dependency),
which forbids entity declarations, so neither entity expansion ("billion laughs") nor
external entities get through; python-calamine's parser refuses any entity it does not
know ("unrecognized entity"), internal or external.  tests/test_data_excel.py checks both.
Zip containers are checked against
decompression bombs first (:mod:`tauscope.data.container`).
.xls (the old binary format) is read with python-calamine only.
"""

from __future__ import annotations

import datetime as dt
import importlib
import io
import math
import zipfile
from collections.abc import Callable
from typing import Any, NamedTuple

from tauscope.data.cells import Cell

Rows = list[list[Cell]]
MAX_EMPTY_RUN = 10_000

python_calamine: Any
try:  # optional at import time so a missing wheel gives a clear message, not a crash
    python_calamine = importlib.import_module("python_calamine")
except ImportError:  # pragma: no cover - depends on the installation
    python_calamine = None


def normalise(value: Any) -> Cell:
    """One cell value in the form both engines agree on: float, str, datetime or None."""
    if value is None or value == "":
        return None
    if isinstance(value, bool):
        return str(value).upper()
    if isinstance(value, int | float):
        number = float(value)
        return number if math.isfinite(number) else None
    if isinstance(value, dt.datetime):
        return value
    if isinstance(value, dt.date):
        return dt.datetime(value.year, value.month, value.day)
    if isinstance(value, str):
        return None if value.startswith("#") and value.upper() in _ERRORS else value
    return str(value)


_ERRORS = {"#N/A", "#VALUE!", "#DIV/0!", "#REF!", "#NUM!", "#NAME?", "#NULL!", "#SPILL!",
           "#CALC!", "#GETTING_DATA", "#FIELD!"}


class RawSheet(NamedTuple):
    """One worksheet as rows of normalised cells, and a note when rows were left unread."""

    name: str
    rows: Rows
    note: str | None = None


def read_with_calamine(data: bytes) -> list[RawSheet]:
    """Every worksheet as rows of normalised cells (python-calamine).

    Call only after :mod:`tauscope.data.sheet_size` has checked the sheets' sizes: the
    reader lays each sheet out whole.  Rows are then taken one at a time, empty rows kept
    as empty lists, and reading stops at a run of ``MAX_EMPTY_RUN`` empty rows followed
    by more cells (a stray cell far below the table), which the note reports.
    """
    if python_calamine is None:
        raise ImportError("python-calamine is not installed")
    book = python_calamine.CalamineWorkbook.from_filelike(io.BytesIO(data))
    sheets: list[RawSheet] = []
    for meta in book.sheets_metadata:
        if str(meta.typ).rsplit(".", 1)[-1].lower() not in ("worksheet", "sheettypeenum.worksheet"):
            continue
        sheet = book.get_sheet_by_name(meta.name)
        sheets.append(_sheet_rows(meta.name, sheet))
    return sheets


def _sheet_rows(name: str, sheet: Any) -> RawSheet:
    pad: list[Cell] = [None] * int(sheet.start[1]) if sheet.start else []
    rows: Rows = []
    empty = 0
    for number, raw in enumerate(sheet.iter_rows(), start=1):
        if not any(v != "" for v in raw):
            empty += 1
            continue
        if empty >= MAX_EMPTY_RUN and rows:
            return RawSheet(name, rows, f"Cells from row {number:,} on were not read: they lie "
                                        f"below {empty:,} empty rows.")
        rows.extend([] for _ in range(empty))
        empty = 0
        rows.append([*pad, *(v if type(v) is float else normalise(v) for v in raw)])
    return RawSheet(name, rows)


def is_reader_panic(exc: BaseException) -> bool:
    """True for the panic python-calamine raises when its Rust code fails an internal check
    (pyo3's ``PanicException``, a ``BaseException``; its class is made only at the first
    panic, so it is recognised by module and name)."""
    kind = type(exc)
    return kind.__name__ == "PanicException" and kind.__module__ == "pyo3_runtime"


def read_with_openpyxl(data: bytes) -> list[RawSheet]:
    """Every worksheet as rows of normalised cells (openpyxl, cached values, read-only)."""
    import openpyxl

    book = openpyxl.load_workbook(io.BytesIO(data), read_only=True, data_only=True,
                                  keep_vba=False, keep_links=False)
    try:
        sheets: list[RawSheet] = []
        for ws in book.worksheets:
            if not hasattr(ws, "iter_rows"):
                continue
            rows = [[v if type(v) is float else normalise(v) for v in row]
                    for row in ws.iter_rows(values_only=True)]
            sheets.append(RawSheet(ws.title, rows))
        return sheets
    finally:
        book.close()


def excel_reader(old_format: bool) -> Callable[[bytes], list[RawSheet]]:
    if python_calamine is not None:
        return read_with_calamine
    if old_format:
        raise ImportError("reading .xls files needs python-calamine, which is not installed")
    return read_with_openpyxl


#: What the readers may raise on a damaged file; turned into DataError by the caller.
READER_ERRORS: tuple[type[BaseException], ...] = (
    zipfile.BadZipFile, KeyError, ValueError, TypeError, IndexError, AttributeError, OSError,
    EOFError, UnicodeDecodeError, AssertionError, LookupError, ArithmeticError, ImportError,
    *((python_calamine.CalamineError,) if python_calamine is not None else ()),
)
