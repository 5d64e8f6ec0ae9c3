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
from typing import Any

from tauscope.data.cells import Cell

Rows = list[list[Cell]]

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


def read_with_calamine(data: bytes) -> list[tuple[str, Rows]]:
    """Every worksheet as rows of normalised cells (python-calamine)."""
    if python_calamine is None:
        raise ImportError("python-calamine is not installed")
    book = python_calamine.CalamineWorkbook.from_filelike(io.BytesIO(data))
    sheets: list[tuple[str, Rows]] = []
    for meta in book.sheets_metadata:
        if str(meta.typ).rsplit(".", 1)[-1].lower() not in ("worksheet", "sheettypeenum.worksheet"):
            continue
        sheet = book.get_sheet_by_name(meta.name)
        rows = [[v if type(v) is float else normalise(v) for v in row]
                for row in sheet.to_python(skip_empty_area=False)]
        sheets.append((meta.name, rows))
    return sheets


def read_with_openpyxl(data: bytes) -> list[tuple[str, Rows]]:
    """Every worksheet as rows of normalised cells (openpyxl, cached values, read-only)."""
    import openpyxl

    book = openpyxl.load_workbook(io.BytesIO(data), read_only=True, data_only=True,
                                  keep_vba=False, keep_links=False)
    try:
        sheets: list[tuple[str, Rows]] = []
        for ws in book.worksheets:
            if not hasattr(ws, "iter_rows"):
                continue
            rows = [[v if type(v) is float else normalise(v) for v in row]
                    for row in ws.iter_rows(values_only=True)]
            sheets.append((ws.title, rows))
        return sheets
    finally:
        book.close()


def excel_reader(old_format: bool) -> Callable[[bytes], list[tuple[str, Rows]]]:
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
