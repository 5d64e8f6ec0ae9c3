"""Workbooks that name huge ranges, damaged .xls files and the reader's panic: each ends
in one DataError sentence (or a readable workbook) instead of a dead process."""

from __future__ import annotations

import os
import random
import struct
from pathlib import Path

import pytest

from hostile_files import XLS_SEED, number_cell, table_rows, xlsx
from tauscope.data import DataError, read_workbook
from tauscope.data import reader as reader_module
from tauscope.data.sheet_size import EXCEL_COLUMNS, EXCEL_ROWS, SheetSize, check_size, references
from tauscope.data.xls_scan import _Container, scan_biff

TABLE = [["Year", "GDP"]] + [[f"{1950 + i}", float(i * i % 17 + i)] for i in range(40)]


def _write(tmp_path: Path, name: str, data: bytes) -> Path:
    path = tmp_path / name
    path.write_bytes(data)
    return path


def test_two_corner_cells_are_refused_before_any_sheet_is_built(tmp_path: Path) -> None:
    sheet = (f'<row r="1">{number_cell("A1", 1.0)}</row>'
             f'<row r="1048576">{number_cell("XFD1048576", 2.0)}</row>')
    path = _write(tmp_path, "corners.xlsx", xlsx(sheet, dimension="A1:XFD1048576"))
    assert path.stat().st_size < 2000
    with pytest.raises(DataError, match=r"sheet 'Data'.*too large to read.*16,384"):
        read_workbook(path)


def test_a_row_beyond_the_largest_sheet_is_refused(tmp_path: Path) -> None:
    sheet = table_rows(TABLE) + f'<row r="2000000">{number_cell("A2000000", 2.0)}</row>'
    with pytest.raises(DataError, match="beyond the largest sheet Excel allows"):
        read_workbook(_write(tmp_path, "rows.xlsx", xlsx(sheet)))


def test_a_stray_cell_far_below_the_table_is_left_out_with_a_note(tmp_path: Path) -> None:
    sheet = table_rows(TABLE) + f'<row r="1048576">{number_cell("B1048576", 9.0)}</row>'
    book = read_workbook(_write(tmp_path, "stray.xlsx", xlsx(sheet)))
    (series,) = book.series()
    assert series.name == "GDP" and series.nobs == 40
    assert any("row 1,048,576" in note and "not read" in note for note in book.sheets[0].notes)


def test_references_reads_rows_and_columns_from_the_bytes() -> None:
    piece = b'<row r="12"><c r="AB12"><v>1</v></c><c r="C7"/></row>' + b" " * 32
    assert references(piece) == (12, 28, 2)  # AB = 28 (1-based), two cell references
    assert references(b'<c r="AAAA1"/>' + b" " * 32)[1] > EXCEL_COLUMNS


def test_check_size_names_the_sheet() -> None:
    check_size(SheetSize(rows=5000, columns=500, cells=2_500_000), "f.xlsx", "S")
    with pytest.raises(DataError, match="sheet 'S'"):
        check_size(SheetSize(rows=EXCEL_ROWS, columns=EXCEL_COLUMNS, cells=2), "f.xlsx", "S")


def test_the_xls_scan_finds_the_sheets_of_a_real_file() -> None:
    stream = _Container(XLS_SEED.read_bytes()).stream(("Workbook", "Book"))
    assert stream is not None
    sizes = dict(scan_biff(stream))
    # macrodata.xls (statsmodels): README, Monthly and Quarterly sheets; Quarterly holds
    # 252 rows by 6 columns (as python-calamine lays it out).
    assert list(sizes) == ["README", "Monthly", "Quarterly"]
    assert (sizes["Quarterly"].rows, sizes["Quarterly"].columns) == (252, 6)


def _cell_record_offset(data: bytes) -> int:
    """The offset in the file of the first NUMBER record (0x0203) of a sheet."""
    return data.index(struct.pack("<HH", 0x0203, 14), 4096)


def test_an_xls_cell_moved_far_away_by_damage_is_refused(tmp_path: Path) -> None:
    data = bytearray(XLS_SEED.read_bytes())
    at = _cell_record_offset(bytes(data))
    struct.pack_into("<HH", data, at + 4, 60_000, 250)  # row 60,001, column 251: 15 million
    with pytest.raises(DataError, match="too large to read"):
        read_workbook(_write(tmp_path, "moved.xls", bytes(data)))


def test_truncated_and_bit_flipped_xls_end_in_a_sentence(tmp_path: Path) -> None:
    seed = XLS_SEED.read_bytes()
    rng = random.Random(16)
    for k in range(40):
        data = bytearray(seed[: rng.randrange(512, len(seed))] if k % 2 else seed)
        if not k % 2:
            for _ in range(5):
                data[rng.randrange(len(data))] ^= 1 << rng.randrange(8)
        path = _write(tmp_path, f"damaged{k}.xls", bytes(data))
        try:
            read_workbook(path)
        except DataError as exc:
            assert "\n" not in str(exc) and str(exc).startswith(path.name)


def test_the_reader_panic_becomes_a_data_error(tmp_path: Path,
                                               monkeypatch: pytest.MonkeyPatch) -> None:
    panic = type("PanicException", (BaseException,), {"__module__": "pyo3_runtime"})

    def reader(data: bytes) -> list[object]:
        raise panic("assertion `left == right` failed")

    monkeypatch.setattr(reader_module, "excel_reader", lambda old_format: reader)
    path = _write(tmp_path, "panics.xls", XLS_SEED.read_bytes())
    with pytest.raises(DataError, match=r"panics\.xls: is damaged"):
        read_workbook(path)


def test_other_base_exceptions_are_not_swallowed(tmp_path: Path,
                                                 monkeypatch: pytest.MonkeyPatch) -> None:
    def reader(data: bytes) -> list[object]:
        raise KeyboardInterrupt

    monkeypatch.setattr(reader_module, "excel_reader", lambda old_format: reader)
    with pytest.raises(KeyboardInterrupt):
        read_workbook(_write(tmp_path, "stop.xls", XLS_SEED.read_bytes()))


def test_devices_are_refused_without_reading() -> None:
    with pytest.raises(DataError, match="not a regular file"):
        read_workbook("/dev/zero")


@pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="named pipes are a POSIX feature")
def test_a_named_pipe_is_refused_without_waiting_for_a_writer(tmp_path: Path) -> None:
    pipe = tmp_path / "series.csv"
    os.mkfifo(pipe)
    with pytest.raises(DataError, match=r"series\.csv: is not a regular file"):
        read_workbook(pipe)
