"""Hostile study files end in the study error, never in another exception."""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

import pytest

from tauscope.engine import Settings
from tauscope.report.study import (
    Study,
    StudyError,
    StudyWorkbook,
    load_study,
    resolve_workbook,
    save_study,
    study_to_json,
)
from tauscope.report.study_check import MAX_DEPTH, nesting_depth


def _valid() -> dict[str, Any]:
    study = Study(Settings(), (StudyWorkbook("/data/gdp.xlsx", "0" * 64, ("Data",)),))
    return study_to_json(study)


def _load(tmp_path: Path, text: str) -> StudyError:
    path = tmp_path / "hostile.tauscope"
    path.write_text(text, encoding="utf-8")
    with pytest.raises(StudyError) as caught:
        load_study(path)
    assert "hostile.tauscope" in str(caught.value) and "\n" not in str(caught.value)
    return caught.value


def test_deep_nesting_is_refused_before_decoding(tmp_path: Path) -> None:
    error = _load(tmp_path, '{"format": ' + "[" * 100_000 + "]" * 100_000 + "}")
    assert "nested 100,001 levels deep" in str(error)
    assert nesting_depth('{"a": "[[[[", "b": [[1]]}') == 3  # brackets in strings do not count
    assert nesting_depth("[" * MAX_DEPTH + "]" * MAX_DEPTH) == MAX_DEPTH


def test_a_number_with_100000_digits_is_refused(tmp_path: Path) -> None:
    data = json.dumps(_valid()).replace('"version": 1', '"version": 1' + "0" * 100_000)
    assert "100,001 digits" in str(_load(tmp_path, data))


@pytest.mark.parametrize(("path", "value"), [
    (("settings", "max_lags"), 1e308),
    (("settings", "lags"), "three"),
    (("settings", "max_lags"), 10**25),
    (("settings", "confirm"), [{"x": 1}]),
    (("settings", "alpha"), [0.05]),
    (("workbooks", 0, "sheets"), 5),
    (("workbooks", 0, "path"), 12),
    (("workbooks", 0, "relative"), {"a": 1}),
])
def test_wrong_types_and_huge_values_are_the_study_error(
    tmp_path: Path, path: tuple[Any, ...], value: Any
) -> None:
    data = _valid()
    target = data
    for key in path[:-1]:
        target = target[key]
    target[path[-1]] = value
    _load(tmp_path, json.dumps(data))


def test_a_5000_character_path_is_refused_or_reported_missing(tmp_path: Path) -> None:
    data = _valid()
    data["workbooks"][0]["path"] = "/" + "x" * 5000
    assert "5,001 characters long" in str(_load(tmp_path, json.dumps(data)))
    data["workbooks"][0]["path"] = "/data/" + "z" * 300 + "/book.xlsx"
    assert "longer than 255 characters" in str(_load(tmp_path, json.dumps(data)))
    workbook = StudyWorkbook("/" + "y" * 300 + "/book.xlsx", "0" * 64)
    assert resolve_workbook(workbook, tmp_path / "s.tauscope") is None


def test_a_valid_study_still_loads(tmp_path: Path) -> None:
    path = tmp_path / "fine.tauscope"
    save_study(path, Study(Settings(lag_rule="bic", max_lags=8)))
    assert load_study(path).settings == Settings(lag_rule="bic", max_lags=8)
