"""Malformed input: every file ends in a Workbook or in DataError; nothing else escapes."""

from __future__ import annotations

import io
from pathlib import Path

import openpyxl
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from tauscope.data import DataError, Workbook, read_workbook

FUZZ = settings(max_examples=300, deadline=None,
                suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large])

TOKENS = [
    "", " ", "..", "NA", "n/a", "#N/A", "-", ":", "1995Q1", "1995-Q5", "1995 Q4", "Q2 2001",
    "Jan 1995", "Feb-95", "1995M01", "1995M13", "1995-01", "2020-02-30", "31/03/1995",
    "12/31/1999", "29.02.2001", "1995", "9999", "0", "-1", "1,5", "1.234,5", "1,234.5",
    "1 234", "(12)", "3.5%", "1e308", "1e309", "-inf", "nan", "GDP", "Prices", '"a;b"',
    '"unclosed', "\u00a0", "€", "Q", "W53", "2015W53", "2016W53", "1995-03-31", "44000",
    "45000.5", "TRUE", "−3,2", ",5", "1..2", "1,2,3",
]
field = st.one_of(st.sampled_from(TOKENS), st.text(max_size=6))
table = st.lists(st.lists(field, min_size=0, max_size=6), min_size=0, max_size=12)


@pytest.fixture(scope="module")
def folder(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """One folder for the module's inputs, under pytest's own temporary root (cleaned up)."""
    return tmp_path_factory.mktemp("fuzz")


def _read(folder: Path, content: bytes, suffix: str) -> None:
    path = folder / f"input{suffix}"
    path.write_bytes(content)
    try:
        result = read_workbook(path)
    except DataError as exc:
        message = str(exc)
        assert message and "\n" not in message
        return
    assert isinstance(result, Workbook) and result.series()
    for series in result.series():
        assert series.values.dtype == "float64" and series.nobs >= 1


@FUZZ
@given(rows=table, delimiter=st.sampled_from([",", ";", "\t", "|"]),
       newline=st.sampled_from(["\n", "\r\n", "\r"]),
       encoding=st.sampled_from(["utf-8", "utf-8-sig", "cp1252", "utf-16"]))
def test_table_like_texts(folder: Path, rows: list[list[str]], delimiter: str, newline: str,
                          encoding: str) -> None:
    text = newline.join(delimiter.join(r) for r in rows)
    _read(folder, text.encode(encoding, errors="replace"), ".csv")


@FUZZ
@given(text=st.text(max_size=400))
def test_arbitrary_texts(folder: Path, text: str) -> None:
    _read(folder, text.encode("utf-8", errors="surrogatepass"), ".csv")


@FUZZ
@given(data=st.binary(max_size=600), suffix=st.sampled_from([".csv", ".txt", ".xlsx", ".xls"]))
def test_arbitrary_bytes(folder: Path, data: bytes, suffix: str) -> None:
    _read(folder, data, suffix)


def _small_workbook() -> bytes:
    book = openpyxl.Workbook()
    sheet = book.active
    assert sheet is not None
    sheet.append(["Quarter", "A", "B"])
    for i in range(8):
        sheet.append([f"2000Q{i % 4 + 1}" if i < 4 else f"2001Q{i % 4 + 1}", i * 1.5, "NA"])
    buffer = io.BytesIO()
    book.save(buffer)
    return buffer.getvalue()


WORKBOOK = _small_workbook()


@settings(max_examples=300, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(cuts=st.lists(st.tuples(st.integers(0, len(WORKBOOK) - 1), st.integers(0, 255)),
                     min_size=1, max_size=8),
       truncate=st.integers(16, len(WORKBOOK)))
def test_damaged_workbooks(folder: Path, cuts: list[tuple[int, int]], truncate: int) -> None:
    damaged = bytearray(WORKBOOK)
    for position, value in cuts:
        damaged[position] = value
    _read(folder, bytes(damaged[:truncate]), ".xlsx")
