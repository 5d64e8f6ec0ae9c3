"""Whether an existing file may be written over by a findings report.

Two rules, for the window and ``tauscope batch`` alike:

* an input of the run (a workbook the findings were read from) is never written
  over, whatever its name (:func:`same_file` compares the files themselves, so a
  second path to the same file counts too);
* an existing file is replaced without asking only when it is one of our own
  reports (:func:`is_own_report`): its first bytes say so (JSON with a "tauscope"
  entry first, the CSV header we write, the HTML title, the LaTeX first comment),
  an xlsx holds exactly our sheets, or a PDF names Tauscope as its creator.
  Anything else needs the user's explicit word (``batch --replace``, or the window's
  save dialog).
"""

from __future__ import annotations

import io
import os
import re
import zipfile
from pathlib import Path

HEAD_BYTES = 64 << 10
XLSX_SHEETS = ("Summary", "All tests", "Decision path", "About this run")
_SHEET_NAME = re.compile(rb'<sheet [^>]*name="([^"]*)"')


def same_file(a: Path | str, b: Path | str) -> bool:
    """True when both paths name the same file (the same file on disk, or the same
    absolute path for files that do not exist yet)."""
    try:
        return os.path.samefile(a, b)
    except OSError:
        return Path(a).expanduser().absolute() == Path(b).expanduser().absolute()


def _head(path: Path) -> bytes:
    with open(path, "rb") as handle:
        return handle.read(HEAD_BYTES)


def _csv_header() -> bytes:
    """The first columns of the CSV header we write (``tables.TEST_COLUMNS``)."""
    from tauscope.report.tables import TEST_COLUMNS

    return ",".join(c.ident for c in TEST_COLUMNS[:9]).encode()


def is_own_report(path: Path | str) -> bool:
    """True when the regular file at ``path`` is a findings report Tauscope wrote."""
    target = Path(path)
    try:
        if not target.is_file():
            return False
        head = _head(target)
        suffix = target.suffix.lower()
        if suffix == ".json":
            return re.match(rb'\s*\{\s*"tauscope"\s*:', head) is not None
        if suffix == ".csv":
            return head.removeprefix(b"\xef\xbb\xbf").startswith(_csv_header())
        if suffix == ".html":
            return b"<title>Tauscope findings</title>" in head
        if suffix == ".tex":
            return head.startswith(b"% Tauscope ")
        if suffix == ".pdf":
            return head.startswith(b"%PDF") and b"Tauscope" in _tail(target)
        if suffix == ".xlsx":
            return _own_workbook(target)
    except OSError:
        return False
    return False


def _tail(path: Path) -> bytes:
    size = path.stat().st_size
    with open(path, "rb") as handle:
        handle.seek(max(size - HEAD_BYTES, 0))
        return handle.read(HEAD_BYTES) + _head(path)


def _own_workbook(path: Path) -> bool:
    if path.stat().st_size > 256 << 20:
        return False
    try:
        with zipfile.ZipFile(io.BytesIO(path.read_bytes())) as archive:
            info = archive.getinfo("xl/workbook.xml")
            if info.file_size > 1 << 20:
                return False
            names = [n.decode("utf-8", "replace") for n in
                     _SHEET_NAME.findall(archive.read(info))]
    except (zipfile.BadZipFile, KeyError, ValueError, EOFError, OSError):
        return False
    return tuple(names[:4]) == XLSX_SHEETS and set(names) <= {*XLSX_SHEETS, "Charts"}
