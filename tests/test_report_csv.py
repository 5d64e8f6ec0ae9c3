"""CSV findings read back with the csv module equal the engine's numbers; injection guard."""

from __future__ import annotations

import csv
from pathlib import Path

import pytest
from hypothesis import given
from hypothesis import strategies as st

from tauscope.report import export
from tauscope.report.safety import guard_text, looks_like_formula
from test_report_support import FORMULA_NAME, make_run


def _read(path: Path) -> list[dict[str, str]]:
    with open(path, encoding="utf-8-sig", newline="") as handle:
        return list(csv.DictReader(handle))


def test_every_test_is_one_row_with_the_engine_numbers(tmp_path: Path) -> None:
    run = make_run()
    target = tmp_path / "findings.csv"
    export(target, run)
    rows = _read(target)
    expected = [(f, t) for f in run.findings for t in f.result.tests]
    failed = [f for f in run.findings if not f.result.ok]
    assert len(rows) == len(expected) + len(failed)
    tested_rows = [r for r in rows if r["test"]]
    for row, (finding, test) in zip(tested_rows, expected, strict=True):
        assert row["series"] == (f"'{finding.name}" if finding.name == FORMULA_NAME
                                 else finding.name)
        assert row["test"] == test.test
        assert row["spec"] == test.spec
        assert int(row["difference"]) == test.difference
        assert float(row["statistic"]) == test.statistic  # unrounded, exact round trip
        if test.p_value is None:
            assert row["p_value"] == ""
        else:
            assert float(row["p_value"]) == test.p_value
        assert int(row["lags"]) == test.lags
        assert int(row["nobs"]) == test.nobs
        assert float(row["cv_5"]) == test.critical_values["5%"]
        assert float(row["critical_value"]) == test.critical_value
        assert row["decision"] == ("reject" if test.reject else "do not reject")


def test_a_series_that_could_not_be_tested_keeps_its_row_and_reason(tmp_path: Path) -> None:
    run = make_run()
    target = tmp_path / "findings.csv"
    export(target, run)
    failed = next(f for f in run.findings if not f.result.ok)
    row = next(r for r in _read(target) if r["error"])
    assert row["series"] == "'" + failed.name  # "-3 too short" starts with a minus sign
    assert row["error"] == failed.result.error
    assert row["test"] == ""


def test_tests_in_the_decision_path_are_marked(tmp_path: Path) -> None:
    run = make_run()
    target = tmp_path / "findings.csv"
    export(target, run)
    rows = [r for r in _read(target) if r["test"]]
    expected = [
        "yes" if any(s.test is t for s in f.result.steps) else "no"
        for f in run.findings for t in f.result.tests
    ]
    assert [r["in_path"] for r in rows] == expected
    assert "yes" in expected and "no" in expected


@pytest.mark.parametrize("text", ["=1+2", "+A1", "-2+3", "@SUM(A1)", "\tcmd", "\r=x",
                                  '=HYPERLINK("http://x")'])
def test_formula_like_text_is_written_as_text(text: str) -> None:
    assert looks_like_formula(text)
    assert guard_text(text) == "'" + text


@pytest.mark.parametrize("text", ["Real GDP", "", "−3.5 (true minus)", "log(x) = y", "'quoted"])
def test_ordinary_text_is_left_alone(text: str) -> None:
    assert not looks_like_formula(text)
    assert guard_text(text) == text


def test_no_cell_of_the_csv_starts_like_a_formula(tmp_path: Path) -> None:
    target = tmp_path / "findings.csv"
    export(target, make_run())
    with open(target, encoding="utf-8-sig", newline="") as handle:
        cells = [c for row in csv.reader(handle) for c in row]
    text_cells = [c for c in cells if c and not _is_number(c)]
    assert any(c == "'" + FORMULA_NAME for c in text_cells)
    assert not [c for c in text_cells if looks_like_formula(c)]


def _is_number(text: str) -> bool:
    try:
        float(text)
    except ValueError:
        return False
    return True


@given(st.text(max_size=40))
def test_guarded_text_never_starts_like_a_formula_and_keeps_the_text(text: str) -> None:
    guarded = guard_text(text)
    assert not looks_like_formula(guarded)
    assert guarded in (text, "'" + text)
