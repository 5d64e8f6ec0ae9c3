"""Where two results' to_dict() trees differ (engine/compare.py): the self-test and the
benchmarks that check a faster route against the reference read it."""

from __future__ import annotations

from tauscope.engine.compare import differences, first_difference

A = {"verdict": {"order": 1}, "tests": [{"statistic": -2.5}, {"statistic": float("nan")}]}


def test_first_difference_reads_nested_data() -> None:
    close = {"verdict": {"order": 1}, "tests": [{"statistic": -2.5 + 1e-12}, {"statistic": float("nan")}]}
    assert first_difference(A, close, 1e-8) is None
    apart = {"verdict": {"order": 1}, "tests": [{"statistic": -2.4}, {"statistic": float("nan")}]}
    assert first_difference(A, apart, 1e-8) == "tests.[0].statistic"
    assert first_difference(A, {"verdict": {"order": 0}, "tests": A["tests"]}, 1e-8) == "verdict.order"
    assert first_difference(A, {"verdict": {"order": 1}}, 1e-8) == "keys"
    nan_against_number = {"verdict": {"order": 1}, "tests": [{"statistic": -2.5}, {"statistic": 1.0}]}
    assert first_difference(A, nan_against_number, 1e-8) == "tests.[1].statistic"


def test_tolerance_is_relative_above_one() -> None:
    assert first_difference({"f": 1e6}, {"f": 1e6 + 1e-3}, 1e-8) is None  # 1e-9 relative
    assert first_difference({"f": 1e6}, {"f": 1e6 + 1.0}, 1e-8) == "f"
    assert first_difference({"f": 0.5}, {"f": 0.5 + 2e-8}, 1e-8) == "f"  # absolute below one


def test_every_difference_with_its_size() -> None:
    b = {"verdict": {"order": 2}, "tests": [{"statistic": -2.0}, {"statistic": float("nan")}]}
    assert list(differences(A, b)) == [(None, 1.0, "verdict.order"), (0.5, 2.5, "tests.[0].statistic")]
