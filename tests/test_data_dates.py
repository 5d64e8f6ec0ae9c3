"""Date labels, frequency inference and number forms, cell by cell and column by column."""

from __future__ import annotations

import datetime as dt

import pandas as pd
import pytest

from tauscope.data.cells import COMMA, POINT, detect_number_format, is_missing_code
from tauscope.data.dates import build_axis, parse_label


@pytest.mark.parametrize(
    ("text", "label"),
    [
        ("1995Q1", ("Q", 1995, 1, 0)),
        ("1995-Q2", ("Q", 1995, 2, 0)),
        ("1995 Q3", ("Q", 1995, 3, 0)),
        ("Q4 1995", ("Q", 1995, 4, 0)),
        ("1995M01", ("M", 1995, 1, 0)),
        ("1995-01", ("M", 1995, 1, 0)),
        ("Jan 1995", ("M", 1995, 1, 0)),
        ("September 2001", ("M", 2001, 9, 0)),
        ("Feb-95", ("M", 1995, 2, 0)),
        ("Mar-05", ("M", 2005, 3, 0)),
        ("1995W07", ("W", 1995, 7, 0)),
        ("1995-03-31", ("D", 1995, 3, 31)),
        ("31/03/1995", ("S", 31, 3, 1995)),
        ("1995", ("Y", 1995, 0, 0)),
        (1995, ("Y", 1995, 0, 0)),
        (1995.0, ("Y", 1995, 0, 0)),
        (dt.datetime(1995, 3, 31, 0, 0), ("D", 1995, 3, 31)),
    ],
)
def test_labels_understood(text: object, label: tuple[str, int, int, int]) -> None:
    assert parse_label(text) == label  # type: ignore[arg-type]


@pytest.mark.parametrize("text", ["1995Q5", "1995M13", "2020-02-30", "GDP", "", None, 1995.5,
                                  "Foo 1995", "12345", True])
def test_not_dates(text: object) -> None:
    assert parse_label(text) is None  # type: ignore[arg-type]


def _axis(cells: list[object]) -> tuple[list[str], str | None]:
    axis = build_axis(cells)  # type: ignore[arg-type]
    return [str(p) for p in axis.periods], axis.frequency


def test_column_level_day_order_and_frequency() -> None:
    # one day above 12 in the second place makes the whole column month-first
    assert _axis(["01/31/2000", "02/29/2000", "03/31/2000"]) == (
        ["2000-01", "2000-02", "2000-03"], "monthly")
    # ambiguous everywhere: day-first (the European reading) is taken
    assert _axis(["01/02/2000", "01/03/2000", "01/04/2000"]) == (
        ["2000-02", "2000-03", "2000-04"], "monthly")
    assert _axis(["2000-12-31", "2001-12-31", "2002-12-31"]) == (
        ["2000", "2001", "2002"], "annual")


def test_excel_date_numbers_only_when_regular() -> None:
    serials = [(dt.date(2000, m, 1) - dt.date(1899, 12, 30)).days for m in (1, 2, 3, 4)]
    assert _axis(serials) == (["2000-01", "2000-02", "2000-03", "2000-04"], "monthly")
    employment = [25010.0, 25400.0, 24990.0, 26100.0]  # numbers in the same range, not dates
    assert build_axis(employment).kind is None  # type: ignore[arg-type]


def test_whole_numbers_are_years_only_in_order() -> None:
    assert _axis([1990, 1991, 1992]) == (["1990", "1991", "1992"], "annual")
    assert build_axis([1990, 1500, 2400]).kind is None  # type: ignore[arg-type]


def test_weekly_periods_end_on_the_dates_weekday() -> None:
    fridays = [d.to_pydatetime() for d in pd.date_range("2021-01-01", periods=4, freq="7D")]
    axis = build_axis(fridays)  # type: ignore[arg-type]
    assert axis.frequency == "weekly"
    assert [p.end_time.date() for p in axis.periods if p is not None] == [
        d.date() for d in fridays]


@pytest.mark.parametrize(
    ("text", "point", "comma"),
    [
        ("1,234.5", 1234.5, None),
        ("1.234,5", None, 1234.5),
        ("1 234,5", None, 1234.5),
        ("1 234.5", 1234.5, None),
        ("-3,25", None, -3.25),
        ("−2.5", -2.5, None),
        ("1.234.567", None, 1234567.0),
        ("(12)", -12.0, -12.0),
        ("12.3 p", 12.3, None),
        ("7 %", 7.0, 7.0),
        ("1e309", None, None),
        ("nan", None, None),
        ("1..2", None, None),
    ],
)
def test_number_forms(text: str, point: float | None, comma: float | None) -> None:
    assert POINT.parse(text) == point
    assert COMMA.parse(text) == comma


def test_decimal_mark_vote() -> None:
    assert detect_number_format(["1,5", "2,25", "1.000"]) == COMMA
    assert detect_number_format(["1.5", "2,345.25"]) == POINT
    assert detect_number_format(["1.234"], prefer_comma=True) == COMMA
    assert detect_number_format(["1.234"]) == POINT


@pytest.mark.parametrize("code", ["..", "NA", "n/a", "-", ":", "#N/A", "", " ", "N.A.", "—"])
def test_missing_codes(code: str) -> None:
    assert is_missing_code(code)
