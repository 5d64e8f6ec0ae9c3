"""analyse_series never raises on bad data; the error is one sentence."""

from __future__ import annotations

import math

import numpy as np
import pandas as pd
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from tauscope.engine import Settings, analyse_series

values = st.one_of(
    st.floats(allow_nan=True, allow_infinity=True, width=64),
    st.sampled_from([math.nan, math.inf, -math.inf, 0.0, 1.0, 1e300, -1e-300]),
)


@settings(max_examples=150, deadline=None)
@given(st.lists(values, min_size=0, max_size=40), st.integers(min_value=0, max_value=5))
def test_always_returns_and_sets_error_when_untestable(data: list[float], run: int) -> None:
    x = np.array(data + [7.0] * run, dtype=float)
    result = analyse_series(x, Settings(max_difference=1), name="fuzz")
    clean = x[~np.isnan(x)]
    if result.error is None:
        assert np.isfinite(clean).all()
        assert result.verdict.label
        assert result.steps
        assert result.nobs >= 12
    else:
        assert result.error.endswith(".")
        assert "\n" not in result.error
        assert result.steps == ()
    result.to_dict()


@pytest.mark.parametrize(
    ("data", "fragment"),
    [
        ([], "no observations"),
        ([math.nan] * 5, "every value is missing"),
        ([1.0, 2.0, math.inf] + [1.0] * 20, "infinite"),
        ([3.0] * 30, "constant"),
        (list(range(8)), "only 8 observations"),
        (
            [1.0, 2.0, 3.0, math.nan, *np.random.default_rng(0).standard_normal(30)],
            "missing value inside",
        ),
        (list(np.arange(40, dtype=float)), "difference is constant"),
    ],
)
def test_clear_sentences(data: list[float], fragment: str) -> None:
    result = analyse_series(np.array(data, dtype=float), name="gdp")
    assert result.error is not None
    assert fragment in result.error
    assert result.error.startswith("“gdp” could not be tested")


def test_non_numeric_values() -> None:
    result = analyse_series(["a", "b"] * 10, name="labels")
    assert result.error is not None and "not numbers" in result.error


def test_leading_and_trailing_missing_are_trimmed_and_noted() -> None:
    rng = np.random.default_rng(3)
    core = 10 + rng.standard_normal(80)
    x = np.concatenate([[math.nan] * 3, core, [math.nan] * 2])
    result = analyse_series(x, name="trimmed")
    assert result.error is None
    assert result.nobs == 80
    assert any("start (3) and end (2)" in n for n in result.notes)


def test_fixed_lag_too_large() -> None:
    rng = np.random.default_rng(4)
    result = analyse_series(rng.standard_normal(30), Settings(lag_rule="fixed", lags=20))
    assert result.error is not None and "too large" in result.error


def test_gap_reports_date() -> None:
    index = pd.period_range("2000Q1", periods=40, freq="Q")
    x = pd.Series(np.random.default_rng(5).standard_normal(40), index=index)
    x.iloc[10] = math.nan
    result = analyse_series(x, name="gap")
    assert result.error is not None and "2002Q3" in result.error


def test_settings_validation() -> None:
    with pytest.raises(ValueError):
        Settings(lag_rule="guess")
    with pytest.raises(ValueError):
        Settings(alpha=0.2)
    with pytest.raises(ValueError):
        Settings(lag_rule="fixed")
    assert Settings.from_dict(Settings(alpha=0.01).to_dict()) == Settings(alpha=0.01)


def test_kpss_with_a_zero_bandwidth_sum_says_so_without_a_warning() -> None:
    """A series (found by search) whose autocovariance sum in the automatic bandwidth rule
    (Hobijn, Franses & Ooms 1998) is zero: statsmodels divides by zero there; the test gives
    one sentence and no numpy warning reaches the user."""
    import warnings

    from tauscope.engine.unitroot.kpss import kpss_test

    x = np.array([-1, 2, -2, -1, -1, 1, 0, -1, 1, -1, -2, -2, 2, -2, 0, -2, 2, -2], dtype=float)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with pytest.raises(ValueError, match="automatic bandwidth is not finite"):
            kpss_test(x, "constant", 0, 0.05)
