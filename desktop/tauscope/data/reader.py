"""read_workbook: any supported file into a :class:`Workbook`, or one clear DataError.

The file is opened once, read-only ("rb"), and never written.  Its kind is judged from
its first bytes, not its name, so a workbook saved with a .csv name still opens and a
renamed binary file is refused with a sentence instead of a crash.
"""

from __future__ import annotations

import dataclasses
import hashlib
import os
import stat
from pathlib import Path

from tauscope.data.cells import detect_number_format, printable
from tauscope.data.container import check_zip, is_encrypted_ole2, sniff
from tauscope.data.errors import DataError
from tauscope.data.excel import READER_ERRORS, RawSheet, excel_reader, is_reader_panic
from tauscope.data.layout import build_sheet
from tauscope.data.model import SheetData, Workbook
from tauscope.data.text_table import read_text_table
from tauscope.data.xls_scan import check_xls_sizes

TEXT_SUFFIXES = (".csv", ".txt", ".tsv", ".tab", ".dat", ".prn")
EXCEL_SUFFIXES = (".xlsx", ".xlsm", ".xltx", ".xltm")
MAX_FILE_BYTES = 512 << 20


def file_sha256(path: Path | str) -> str:
    """Hex SHA-256 of the file's bytes."""
    digest = hashlib.sha256()
    with open(path, "rb") as handle:
        for chunk in iter(lambda: handle.read(1 << 20), b""):
            digest.update(chunk)
    return digest.hexdigest()


def _read_bytes(path: Path) -> bytes:
    """The file's bytes, read only from a regular file.

    The file is opened without blocking (a named pipe would otherwise wait for a writer
    forever) and its type is checked on the open handle, so a device such as /dev/zero,
    a pipe or a socket is refused before a byte is read; at most ``MAX_FILE_BYTES`` + 1
    bytes are ever read.
    """
    name = path.name
    try:
        if path.is_dir():
            raise DataError("is a folder, not a file", file=name)
        flags = os.O_RDONLY | getattr(os, "O_NONBLOCK", 0) | getattr(os, "O_BINARY", 0)
        descriptor = os.open(path, flags)
        with os.fdopen(descriptor, "rb") as handle:
            info = os.fstat(handle.fileno())
            if not stat.S_ISREG(info.st_mode):
                raise DataError("is not a regular file (it is a device, a pipe or a socket); "
                                "only files saved on disk can be opened", file=name)
            if info.st_size > MAX_FILE_BYTES:
                raise DataError(f"is too large to open ({info.st_size / 2**20:,.0f} MB)",
                                file=name)
            data = handle.read(MAX_FILE_BYTES + 1)
        if len(data) > MAX_FILE_BYTES:
            raise DataError(f"is too large to open (more than {MAX_FILE_BYTES >> 20} MB)",
                            file=name)
        return data
    except FileNotFoundError:
        raise DataError("does not exist", file=str(path)) from None
    except PermissionError:
        raise DataError("cannot be opened: permission denied", file=name) from None
    except OSError as exc:
        raise DataError(f"cannot be read ({exc.strerror or exc})", file=name) from None


def read_workbook(path: Path | str) -> Workbook:
    """Read a CSV/text file or an Excel workbook into series (see the data-api contract)."""
    target = Path(path).expanduser().absolute()
    name = target.name
    data = _read_bytes(target)
    sha = hashlib.sha256(data).hexdigest()
    kind = sniff(data)
    suffix = target.suffix.lower()
    if kind == "empty":
        raise DataError("is empty", file=name)
    if kind == "zip":
        notes, sheets = _read_excel(data, target, old_format=False)
    elif kind == "ole2":
        if is_encrypted_ole2(data):
            raise DataError("is password-protected (encrypted); save a copy without a password "
                            "and open that", file=name)
        notes, sheets = _read_excel(data, target, old_format=True)
    elif kind == "pdf":
        raise DataError("is a PDF document, not a workbook", file=name)
    elif suffix in EXCEL_SUFFIXES or suffix == ".xls":
        raise DataError("is damaged or not an Excel workbook (it does not start like one)",
                        file=name)
    else:
        notes, sheets = _read_text(data, target)
    if not any(sheet.series for sheet in sheets):
        reasons = {note for sheet in sheets for note in sheet.notes[-1:]}
        detail = f" ({next(iter(reasons)).rstrip('.').lower()})" if len(reasons) == 1 else ""
        raise DataError(f"has no column of numbers that could be read as a series{detail}",
                        file=name)
    return Workbook(target, sha, tuple(sheets), tuple(notes))


def _read_text(data: bytes, target: Path) -> tuple[list[str], list[SheetData]]:
    table = read_text_table(data, target.name)
    sheet = build_sheet(table.rows, file=str(target), sheet=target.stem,
                        numbers=table.numbers, letters=False, arrays=table.arrays)
    return table.notes, [sheet]


def _read_excel(data: bytes, target: Path, old_format: bool) -> tuple[list[str], list[SheetData]]:
    name = target.name
    if old_format:
        check_xls_sizes(data, name)
    else:
        check_zip(data, name)
    try:
        reader = excel_reader(old_format)
        raw = reader(data)
    except ImportError as exc:
        raise DataError(f"cannot be opened: {exc}", file=name) from None
    except READER_ERRORS as exc:
        what = type(exc).__name__
        if "password" in str(exc).lower() or "Password" in what:
            raise DataError("is password-protected (encrypted); save a copy without a "
                            "password and open that", file=name) from None
        raise DataError(f"is damaged or not a workbook the reader understands ({what})",
                        file=name) from None
    except BaseException as exc:  # the reader's Rust panic is a BaseException; nothing else
        if not is_reader_panic(exc):
            raise
        raise DataError("is damaged: the workbook reader stopped on an inconsistency in it",
                        file=name) from None
    sheets = [_sheet(item, target) for item in raw]
    if not sheets:
        raise DataError("has no worksheets", file=name)
    return [f"Read {len(sheets)} sheet{'s' if len(sheets) != 1 else ''} (cached values only)."], sheets


def _sheet(raw: RawSheet, target: Path) -> SheetData:
    rows = raw.rows
    numbers = detect_number_format(c for row in rows[:2000] for c in row if isinstance(c, str))
    sheet = build_sheet(rows, file=str(target), sheet=printable(raw.name), numbers=numbers,
                        letters=True)
    if raw.note:
        sheet = dataclasses.replace(sheet, notes=(*sheet.notes, raw.note))
    return sheet
