"""The series model (gaps, longest stretch, interpolation) and the transformations."""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

from tauscope.data import TRANSFORMS, DataError, SeriesData, make_transform, read_workbook


def _read(tmp_path: Path, text: str, name: str = "s.csv") -> tuple[SeriesData, ...]:
    path = tmp_path / name
    path.write_text(text, encoding="utf-8")
    return read_workbook(path).series()


def _values(series: SeriesData) -> list[float | None]:
    return [None if math.isnan(v) else round(v, 10) for v in series.values.tolist()]


QUARTERLY = "Quarter,Output,Rate\n" + "".join(
    f"{1990 + i // 4}Q{i % 4 + 1},{v},{r}\n"
    for i, (v, r) in enumerate(zip(
        [100, 110, "", "", 130, 140, 150, "NA", 170, 180],
        [1, -2, 3, 4, 5, 6, 7, 8, 9, 10], strict=True))
)


def test_gaps_longest_stretch_and_interpolation(tmp_path: Path) -> None:
    output, rate = _read(tmp_path, QUARTERLY)
    assert [(g.start, g.end, g.count) for g in output.gaps] == [
        ("1990Q3", "1990Q4", 2), ("1991Q4", "1991Q4", 1)]
    assert output.nobs == 7 and len(output.values) == 10
    with pytest.raises(DataError, match="3 missing values inside its sample"):
        output.testable_values()

    stretch = output.longest_stretch()
    assert stretch.span == ("1991Q1", "1991Q3") and _values(stretch) == [130.0, 140.0, 150.0]
    assert not stretch.gaps and "longest stretch" in stretch.notes[-1]
    assert stretch.key == output.key

    filled = output.interpolated()
    assert filled.filled and not filled.gaps
    assert _values(filled) == [100.0, 110.0, 116.6666666667, 123.3333333333, 130.0, 140.0,
                               150.0, 160.0, 170.0, 180.0]
    values = filled.testable_values()
    assert isinstance(values.index, pd.PeriodIndex) and values.name == "Output"
    assert rate.testable_values().tolist() == [1, -2, 3, 4, 5, 6, 7, 8, 9, 10]


def test_transform_names_values_and_keys(tmp_path: Path) -> None:
    output, rate = _read(tmp_path, QUARTERLY, name="acc.csv")
    logged = make_transform(output, "log")
    assert logged.name == "log(Output)" and logged.parent == "Output"
    assert logged.transform == "log" and logged.key == "acc.csv|acc|Output|log"
    assert logged.values.iloc[0] == pytest.approx(math.log(100.0))
    growth = make_transform(output, "logdiff")
    assert growth.name == "growth % (Output)" and growth.span == ("1990Q2", "1992Q2")
    assert growth.values.iloc[0] == pytest.approx(100 * math.log(110 / 100))
    diff = make_transform(rate, "diff")
    assert diff.name == "Δ(Rate)" and _values(diff) == [-3.0, 5.0, 1, 1, 1, 1, 1, 1, 1]
    twice = make_transform(logged, "diff")
    assert twice.key == "acc.csv|acc|Output|log,diff" and twice.parent == "log(Output)"
    seasonal = make_transform(rate, "sdiff")
    assert seasonal.name == "Δ4(Rate)" and _values(seasonal) == [4.0, 8.0, 4.0, 4.0, 4.0, 4.0]
    assert list(TRANSFORMS) == ["log", "diff", "logdiff", "sdiff"]


def test_log_refuses_non_positive_values_naming_series_and_date(tmp_path: Path) -> None:
    _, rate = _read(tmp_path, QUARTERLY)
    with pytest.raises(DataError) as caught:
        make_transform(rate, "log")
    assert str(caught.value) == (
        "s.csv, sheet 's': “Rate” cannot be logged: it has a value of -2 at 1990Q2 "
        "(a log needs values above zero)."
    )


def test_seasonal_difference_needs_quarterly_or_monthly(tmp_path: Path) -> None:
    (annual,) = _read(tmp_path, "Year,A\n2000,1\n2001,2\n2002,4\n")
    with pytest.raises(DataError, match="quarterly or monthly"):
        make_transform(annual, "sdiff")
    monthly_text = "m,x\n" + "".join(f"2000-{m:02d},{m * m}\n" for m in range(1, 13)) + \
        "2001-01,200\n2001-02,300\n"
    (monthly,) = _read(tmp_path, monthly_text, "m.csv")
    assert _values(make_transform(monthly, "sdiff")) == [199.0, 296.0]
    with pytest.raises(DataError, match="no transformation called 'cube'"):
        make_transform(monthly, "cube")


def test_values_are_float64_and_trimmed(tmp_path: Path) -> None:
    (series,) = _read(tmp_path, "Year,A\n2000,..\n2001,1\n2002,2\n2003,NA\n2004,3\n2005,\n")
    assert series.values.dtype == np.float64
    assert series.span == ("2001", "2004") and series.nobs == 3
