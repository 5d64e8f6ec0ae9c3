"""The sizes an old binary .xls workbook declares, read before any reader builds a sheet.

An .xls file is an OLE2 compound file (Microsoft, [MS-CFB]) whose "Workbook" stream
holds BIFF8 records ([MS-XLS]): a 2-byte type, a 2-byte length, then the data.  Each
sheet is a run of records from a BOF (0x0809) to an EOF (0x000A); every cell record
starts with its row and column (two 2-byte numbers), MULRK/MULBLANK end with their
last column.  One flipped bit in a cell record can name row 65,535 and column
65,535, and a reader would then lay out a 4-billion-cell rectangle and abort the
process.  This module walks the container's sector chains (each step counted, so a
loop in a damaged chain ends) and the records, and returns per sheet the last row and
column and the number of cells, for :func:`tauscope.data.sheet_size.check_size`.
It also checks the declared count of shared strings against the stream's size.
Anything it cannot follow is left to the reader, which reports damage on its own.
"""

from __future__ import annotations

import struct

from tauscope.data.errors import DataError
from tauscope.data.sheet_size import SheetSize, check_size

FREE, END_OF_CHAIN = 0xFFFFFFFF, 0xFFFFFFFE
CELL_RECORDS = {0x0006, 0x00FD, 0x0203, 0x0204, 0x0205, 0x027E, 0x00D6, 0x0201}
MULTI_RECORDS = {0x00BD, 0x00BE}  # MULRK, MULBLANK: row, first column, ..., last column
BOF, EOF, SST, BOUNDSHEET = 0x0809, 0x000A, 0x00FC, 0x0085


class _Container:
    """Just enough of an OLE2 compound file to read one stream by name."""

    def __init__(self, data: bytes) -> None:
        self.data = data
        self.shift = struct.unpack_from("<H", data, 0x1E)[0]
        self.mini_shift = struct.unpack_from("<H", data, 0x20)[0]
        if not 7 <= self.shift <= 16 or not 1 <= self.mini_shift < self.shift:
            raise ValueError("bad sector size")
        self.size = 1 << self.shift
        self.limit = len(data) // self.size + 2  # no chain is longer than the file
        fat_count, self.dir_start = struct.unpack_from("<II", data, 0x2C)
        self.cutoff, self.minifat_start = struct.unpack_from("<II", data, 0x38)
        difat_start, difat_count = struct.unpack_from("<II", data, 0x44)
        sectors = [s for s in struct.unpack_from("<109I", data, 0x4C) if s < 0xFFFFFFFA]
        per = self.size // 4 - 1
        next_difat, hops = difat_start, 0
        while next_difat < 0xFFFFFFFA and hops < min(difat_count, self.limit):
            block = self._sector(next_difat)
            values = struct.unpack_from(f"<{per + 1}I", block)
            sectors.extend(s for s in values[:per] if s < 0xFFFFFFFA)
            next_difat, hops = values[per], hops + 1
        table = bytearray()
        for sector in sectors[: min(fat_count, self.limit)]:
            table += self._sector(sector)
        self.fat = struct.unpack(f"<{len(table) // 4}I", bytes(table[: len(table) // 4 * 4]))

    def _sector(self, number: int) -> bytes:
        start = (number + 1) * self.size
        if start + self.size > len(self.data):
            raise ValueError("sector beyond the end of the file")
        return self.data[start : start + self.size]

    def _chain(self, start: int, table: tuple[int, ...], read: object, limit: int) -> bytes:
        out = bytearray()
        sector, steps = start, 0
        while sector not in (FREE, END_OF_CHAIN) and steps < limit:
            out += read(sector)  # type: ignore[operator]
            if sector >= len(table):
                break
            sector, steps = table[sector], steps + 1
        return bytes(out)

    def stream(self, names: tuple[str, ...]) -> bytes | None:
        directory = self._chain(self.dir_start, self.fat, self._sector, self.limit)
        root_start = root_size = None
        for offset in range(0, len(directory) - 127, 128):
            entry = directory[offset : offset + 128]
            length = min(struct.unpack_from("<H", entry, 64)[0], 64)
            name = entry[: max(length - 2, 0)].decode("utf-16-le", "replace")
            kind = entry[66]
            start, size = struct.unpack_from("<II", entry, 116)
            if kind == 5:
                root_start, root_size = start, size
            elif kind == 2 and name in names:
                if size >= self.cutoff or root_start is None:
                    return self._chain(start, self.fat, self._sector, self.limit)[:size]
                return self._mini(start, size, root_start, root_size or 0)
        return None

    def _mini(self, start: int, size: int, root_start: int, root_size: int) -> bytes:
        mini = self._chain(root_start, self.fat, self._sector, self.limit)[:root_size]
        raw = self._chain(self.minifat_start, self.fat, self._sector, self.limit)
        table = struct.unpack(f"<{len(raw) // 4}I", raw[: len(raw) // 4 * 4])
        step = 1 << self.mini_shift

        def read(sector: int) -> bytes:
            return mini[sector * step : (sector + 1) * step]

        return self._chain(start, table, read, len(mini) // step + 2)[:size]


def _sheet_name(body: bytes, biff8: bool) -> str:
    """A BOUNDSHEET record's name: a length byte, (BIFF8) a flags byte, the characters."""
    if len(body) < 8:
        return ""
    count, flags = body[6], body[7] if biff8 else 0
    start = 8 if biff8 else 7
    raw = body[start : start + count * (2 if flags & 1 else 1)]
    return raw.decode("utf-16-le" if flags & 1 else "latin-1", "replace")


def scan_biff(stream: bytes) -> list[tuple[str, SheetSize]]:
    """Per sheet (each top-level BOF..EOF substream after the workbook globals): its name
    and its last row and column (1-based) and number of cells.  ValueError when the
    workbook declares more shared strings than its stream could hold."""
    names: list[str] = []
    sheets: list[tuple[str, SheetSize]] = []
    current: SheetSize | None = None
    depth = substreams = 0
    biff8 = True
    position, end = 0, len(stream)
    while position + 4 <= end:
        kind, length = struct.unpack_from("<HH", stream, position)
        body = stream[position + 4 : position + 4 + length]
        position += 4 + length
        if kind == BOF:
            depth += 1
            if depth == 1:
                substreams += 1
                if substreams == 1 and len(body) >= 2:
                    biff8 = struct.unpack_from("<H", body)[0] >= 0x0600
                if substreams > 1:
                    current = SheetSize()
                    number = len(sheets)
                    name = names[number] if number < len(names) else f"#{number + 1}"
                    sheets.append((name or f"#{number + 1}", current))
        elif kind == EOF:
            depth = max(depth - 1, 0)
            if depth == 0:
                current = None
        elif kind == BOUNDSHEET and substreams == 1:
            names.append(_sheet_name(body, biff8))
        elif kind == SST and len(body) >= 8:
            unique = struct.unpack_from("<I", body, 4)[0]
            if unique > len(stream):  # every string takes at least three bytes
                raise ValueError(f"declares {unique:,} shared strings in {len(stream):,} bytes")
        elif current is not None and len(body) >= 4 and (kind in CELL_RECORDS
                                                         or kind in MULTI_RECORDS):
            row, column = struct.unpack_from("<HH", body)
            if kind in MULTI_RECORDS and len(body) >= 6:
                last = struct.unpack_from("<H", body, len(body) - 2)[0]
                current.cells += max(last - column + 1, 1)
                column = max(column, last)
            else:
                current.cells += 1
            current.rows = max(current.rows, row + 1)
            current.columns = max(current.columns, column + 1)
    return sheets


def check_xls_sizes(data: bytes, file: str) -> None:
    """DataError when a sheet of this .xls declares more cells than can be laid out, or the
    workbook declares more shared strings than it could hold."""
    try:
        stream = _Container(data).stream(("Workbook", "Book"))
    except (ValueError, struct.error, IndexError):
        return  # not a container this scan understands; the reader reports the damage
    if stream is None:
        return
    try:
        sheets = scan_biff(stream)
    except ValueError as exc:
        raise DataError(f"is damaged: it {exc}", file=file) from None
    for name, size in sheets:
        check_size(size, file, name)
