"""Date labels that used to fail: Roman quarters, mixed quarter forms, unreadable labels
next to year-like numbers, one repeated year."""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pandas as pd
import pytest

from hostile_files import table_rows, xlsx
from tauscope.data import read_workbook
from tauscope.data.dates import parse_label

VALUES = np.cumsum(np.random.default_rng(4).normal(size=40)) + 50


def _csv(tmp_path: Path, name: str, lines: list[str]) -> Path:
    path = tmp_path / name
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


@pytest.mark.parametrize(("text", "quarter"), [
    ("1959-I", ("Q", 1959, 1, 0)), ("1959-IV", ("Q", 1959, 4, 0)), ("1959 iii", ("Q", 1959, 3, 0)),
    ("II-1960", ("Q", 1960, 2, 0)), ("1959 Q 2", ("Q", 1959, 2, 0)), ("1959–Q3", ("Q", 1959, 3, 0)),
])
def test_quarter_forms_are_understood(text: str, quarter: tuple[str, int, int, int]) -> None:
    assert parse_label(text) == quarter


def test_roman_quarters_read_as_a_quarterly_series(tmp_path: Path) -> None:
    romans = ("I", "II", "III", "IV")
    lines = ["Quarter,GDP"] + [f"{1959 + i // 4}-{romans[i % 4]},{VALUES[i]:.3f}"
                               for i in range(40)]
    (series,) = read_workbook(_csv(tmp_path, "roman.csv", lines)).series()
    assert series.frequency == "quarterly" and series.nobs == 40
    assert series.span == ("1959Q1", "1968Q4")


def test_a_column_mixing_quarter_forms_keeps_every_observation(tmp_path: Path) -> None:
    forms = ("{y}Q{q}", "{y} Q{q}", "{y}-Q{q}")
    rows: list[list[str | float]] = [["Quarter", "GDP"]]
    rows += [[forms[i % 3].format(y=1959 + i // 4, q=i % 4 + 1), float(VALUES[i])]
             for i in range(40)]
    path = tmp_path / "mixed.xlsx"
    path.write_bytes(xlsx(table_rows(rows)))
    book = read_workbook(path)
    (series,) = book.series()
    assert series.nobs == 40 and series.frequency == "quarterly"
    assert series.values.index[0] == pd.Period("1959Q1") and book.sheets[0].notes == ()


def test_unreadable_labels_do_not_turn_year_like_data_into_dates(tmp_path: Path) -> None:
    lines = ["Period,Index,GDP"] + [f"P{i}x,{2213 + i},{VALUES[i]:.3f}" for i in range(39)]
    book = read_workbook(_csv(tmp_path, "labels.csv", lines))
    assert [s.name for s in book.series()] == ["Index", "GDP"]
    assert all(s.nobs == 39 and s.frequency is None for s in book.series())
    assert book.series()[0].values.iloc[0] == 2213.0
    assert book.sheets[0].notes[0] == ("The labels in column 1 could not be read as dates; "
                                       "observations are numbered 1 to 39.")


def test_one_repeated_year_is_named_and_the_year_column_is_no_series(tmp_path: Path) -> None:
    years = [1960 + i for i in range(40)]
    years[20] = years[19]
    lines = ["Year,GDP,CPI"] + [f"{years[i]},{VALUES[i]:.3f},{VALUES[i] * 2:.3f}"
                                for i in range(40)]
    book = read_workbook(_csv(tmp_path, "years.csv", lines))
    assert [s.name for s in book.series()] == ["GDP", "CPI"]
    assert "not in order or repeat (at row 22)" in book.sheets[0].notes[0]
