"""What a file really is, judged by its first bytes, and checks on zip containers.

An .xlsx/.xlsm file is a zip archive of XML parts.  Before any reader opens one, the
archive's directory is checked: too many parts, a part that would unpack beyond
``MAX_PART_BYTES``, a total beyond ``MAX_TOTAL_BYTES``, or a large part compressed more
than ``MAX_RATIO`` times (the mark of a decompression bomb) are refused.  Python's
zipfile never hands out more bytes than a part's declared size, so the declared sizes
checked here bound what the readers can unpack.
"""

from __future__ import annotations

import io
import zipfile
import zlib

from tauscope.data.errors import DataError
from tauscope.data.sheet_size import check_xlsx_sizes

ZIP_MAGIC = b"PK\x03\x04"
OLE2_MAGIC = b"\xd0\xcf\x11\xe0\xa1\xb1\x1a\xe1"
MAX_PARTS = 10_000
MAX_PART_BYTES = 1 << 30  # 1 GiB of XML for one sheet
MAX_TOTAL_BYTES = 2 << 30
MAX_RATIO = 200
RATIO_CHECK_FROM = 16 << 20  # ratios matter only for parts above 16 MiB


def sniff(data: bytes) -> str:
    """ "zip", "ole2", "pdf", "empty" or "other"."""
    if not data:
        return "empty"
    if data.startswith(ZIP_MAGIC) or data.startswith(b"PK\x05\x06"):
        return "zip"
    if data.startswith(OLE2_MAGIC):
        return "ole2"
    if data.startswith(b"%PDF"):
        return "pdf"
    return "other"


def is_encrypted_ole2(data: bytes) -> bool:
    """An encrypted .xlsx is an OLE2 container holding "EncryptionInfo"/"EncryptedPackage"."""
    return "EncryptedPackage".encode("utf-16-le") in data or \
        "EncryptionInfo".encode("utf-16-le") in data


def check_zip(data: bytes, file: str) -> None:
    """Refuse archives that are broken, not workbooks, or would unpack to huge sizes."""
    try:
        with zipfile.ZipFile(io.BytesIO(data)) as archive:
            parts = archive.infolist()
            _check_parts(parts, file)
            check_xlsx_sizes(archive, file)
    except (zipfile.BadZipFile, zipfile.LargeZipFile, OSError, ValueError, EOFError,
            NotImplementedError, zlib.error):
        raise DataError("is damaged or not a workbook (its zip structure cannot be read)",
                        file=file) from None


def _check_parts(parts: list[zipfile.ZipInfo], file: str) -> None:
    if len(parts) > MAX_PARTS:
        raise DataError(f"has {len(parts)} parts, more than a workbook plausibly has; "
                        "it was not opened", file=file)
    names = {p.filename for p in parts}
    if "[Content_Types].xml" not in names or not any(n.startswith("xl/") for n in names):
        raise DataError("is a zip archive but not an Excel workbook", file=file)
    total = 0
    for part in parts:
        if part.flag_bits & 0x1:
            raise DataError("is encrypted; save it without a password and try again", file=file)
        total += part.file_size
        ratio = part.file_size / max(part.compress_size, 1)
        if part.file_size > MAX_PART_BYTES or (
            part.file_size > RATIO_CHECK_FROM and ratio > MAX_RATIO
        ):
            raise DataError(
                f"is refused: its part '{part.filename}' would unpack to "
                f"{part.file_size / 2**20:,.0f} MB (compressed {ratio:,.0f} times), which looks "
                "like a decompression bomb", file=file)
    if total > MAX_TOTAL_BYTES:
        raise DataError(f"is refused: it would unpack to {total / 2**30:,.1f} GB", file=file)
