"""Numbers at any scale: τ does not depend on the unit of the series, and in the
specifications with a constant not on its level either (Dickey & Fuller 1979: the
regression's constant absorbs the level), so the engine must give the same τ, Φ and lag
choices for x, 1e-10·x and (with a constant) 1e9 + x, and never refuse them.

Reference: the invariance itself (a property of the OLS t ratio, not of our code), and
least squares in exact rational arithmetic for the coefficients and standard errors in the
series' own units (statsmodels' ``adfuller`` itself loses digits at these scales, so it is
the reference only at the ordinary one).  x is rounded to the 1e9 grid first ((1e9 + x) − 1e9), so
that x and 1e9 + x are both exact in floating point and describe the same data.
"""

from __future__ import annotations

import math
import warnings
from fractions import Fraction

import numpy as np
import pandas as pd
import pytest
from statsmodels.tsa.stattools import adfuller

from tauscope.engine import Settings, analyse_series
from tauscope.engine.regression.design import adf_design
from tauscope.engine.regression.scaling import power_of_two_scale

TOLERANCE = 1e-8
RULES = [Settings(lag_rule="aic"), Settings(lag_rule="maic"), Settings(lag_rule="tsig"),
         Settings(lag_rule="fixed", lags=3)]
PATHS = ("fast", "reference")


def _series() -> list[tuple[str, np.ndarray]]:
    rng = np.random.default_rng(20261202)
    e = rng.standard_normal(160)
    ar = np.zeros(160)
    for t in range(1, 160):
        ar[t] = 0.6 * ar[t - 1] + e[t]
    raw = {
        "random walk": np.cumsum(e),
        "stationary AR(1)": ar,
        "trend plus noise": 0.05 * np.arange(160) + ar,
        "I(2)": np.cumsum(np.cumsum(e[:90])),
    }
    return [(name, (1e9 + x) - 1e9) for name, x in raw.items()]


SERIES = _series()


def _statistics(values: np.ndarray, settings: Settings, path: str) -> dict[tuple[str, str, int], tuple[float, int]]:
    result = analyse_series(values, settings, "scaled", path=path)  # type: ignore[arg-type]
    assert result.error is None, result.error  # a refusal is a failure
    return {(t.test, t.spec, t.difference): (t.statistic, t.lags) for t in result.tests
            if t.test in ("adf", "phi1", "phi2", "phi3")}


def _assert_same(ours: dict[tuple[str, str, int], tuple[float, int]],
                 base: dict[tuple[str, str, int], tuple[float, int]], keep_none: bool) -> None:
    assert ours.keys() == base.keys()
    for key, (statistic, lags) in base.items():
        if key[1] == "none" and key[2] == 0 and not keep_none:
            continue  # without a constant τ depends on the level (and should)
        assert ours[key][1] == lags, key
        assert abs(ours[key][0] - statistic) <= TOLERANCE, (key, ours[key][0], statistic)


@pytest.mark.parametrize("settings", RULES, ids=lambda s: s.lag_rule)
@pytest.mark.parametrize("path", PATHS)
def test_tau_phi_and_lags_do_not_depend_on_scale_or_level(settings: Settings, path: str) -> None:
    for _, x in SERIES:
        base = _statistics(x, settings, path)
        _assert_same(_statistics(1e-10 * x, settings, path), base, keep_none=True)
        _assert_same(_statistics(1e9 + x, settings, path), base, keep_none=False)


def test_values_near_the_float_limit_are_tested_quietly() -> None:
    _, x = SERIES[0]
    u = x / np.abs(x).max()
    base = _statistics(x, Settings(), "fast")
    # (values, whether they are a pure rescaling of x: then τ without a constant agrees too)
    cases = [(1.7e308 * u, True), (-1.7e308 * u, True), (1e-300 * x, True), (1e308 + 1e306 * u, False)]
    for values, rescaled in cases:
        for path in PATHS:
            with warnings.catch_warnings():
                warnings.simplefilter("error", RuntimeWarning)  # no overflow warning may escape
                ours = _statistics(values, Settings(confirm=("kpss", "pp", "dfgls", "za")), path)
            _assert_same({k: v for k, v in ours.items()}, base, keep_none=rescaled)


def _exact_ols(y: np.ndarray, x: np.ndarray) -> tuple[list[float], list[float]]:
    """OLS in exact rational arithmetic (fractions.Fraction; every float is a rational):
    the normal equations solved by Gauss-Jordan elimination, σ̂² = RSS/(n − k),
    se_i = sqrt(σ̂² (X'X)⁻¹_ii).  A reference no rounding can spoil, at any scale."""
    n, k = x.shape
    xs = [[Fraction(float(v)) for v in row] for row in x]
    ys = [Fraction(float(v)) for v in y]
    gram = [[sum((xs[t][i] * xs[t][j] for t in range(n)), Fraction(0)) for j in range(k)] for i in range(k)]
    cross = [sum((xs[t][i] * ys[t] for t in range(n)), Fraction(0)) for i in range(k)]
    augmented = [gram[i] + [cross[i]] + [Fraction(int(i == j)) for j in range(k)] for i in range(k)]
    for c in range(k):
        pivot = next(r for r in range(c, k) if augmented[r][c] != 0)
        augmented[c], augmented[pivot] = augmented[pivot], augmented[c]
        head = augmented[c][c]
        augmented[c] = [v / head for v in augmented[c]]
        for r in range(k):
            if r != c and augmented[r][c] != 0:
                factor = augmented[r][c]
                augmented[r] = [a - factor * b for a, b in zip(augmented[r], augmented[c], strict=True)]
    beta = [augmented[i][k] for i in range(k)]
    rss = sum(((ys[t] - sum((xs[t][i] * beta[i] for i in range(k)), Fraction(0))) ** 2 for t in range(n)),
              Fraction(0))
    sigma2 = rss / (n - k)
    return ([float(b) for b in beta], [math.sqrt(float(sigma2 * augmented[i][k + 1 + i])) for i in range(k)])


@pytest.mark.parametrize("spec", ["constant", "trend"])
def test_coefficients_reported_in_the_series_units_as_exact_ols(spec: str) -> None:
    _, x = SERIES[1]
    x = x[:70]
    for values in (x, 1e9 + x, 1e-10 * x):
        result = analyse_series(values, Settings(lag_rule="fixed", lags=2, max_difference=0))
        assert result.error is None
        test = next(t for t in result.tests if t.test == "adf" and t.spec == spec and t.difference == 0)
        assert test.regression is not None
        y, design = adf_design(values, spec, 2)
        beta, se = _exact_ols(y, design)
        for j, coefficient in enumerate(test.regression.coefficients):
            assert coefficient.estimate == pytest.approx(beta[j], rel=1e-8, abs=1e-14 * abs(beta[j]) + 1e-300), \
                coefficient.name
            assert coefficient.std_error == pytest.approx(se[j], rel=1e-8), coefficient.name
        if values is x:
            # and statsmodels' adfuller agrees on τ at the ordinary scale
            tau = adfuller(values, maxlag=2, autolag=None, regression="c" if spec == "constant" else "ct",
                           result_object=False)[0]
            assert test.statistic == pytest.approx(float(tau), abs=TOLERANCE)


def test_scale_is_a_power_of_two_with_changes_of_order_one() -> None:
    for _, x in SERIES:
        for factor in (1.0, 1e-10, 1e9, 1.7e308 / np.abs(x).max()):
            scale = power_of_two_scale(factor * x)
            mantissa, _ = np.frexp(scale)
            assert mantissa == 0.5
            changes = np.diff((factor * x) / scale)
            assert 0.5 <= float(np.sqrt(np.mean(changes * changes))) < 1.0


def test_scale_stays_a_normal_float_at_the_ends_of_the_range() -> None:
    # Found by the fuzz test: values of 1.49e308 and 0 would ask for 2^1024.
    for values in (np.r_[np.zeros(5), 1.49e308, 0.0, 1.49e308], np.r_[0.0, 5e-324, 0.0, 1e-323]):
        scale = power_of_two_scale(values)
        assert np.isfinite(scale) and scale >= np.finfo(float).tiny
        assert np.isfinite(values / scale).all()


def test_a_refusal_names_the_real_reason() -> None:
    # A series that stays put except for three changes: the lagged changes are linearly
    # dependent on the common sample; the sentence must say so, not blame a scale.
    rng = np.random.default_rng(0)
    x = np.cumsum(np.r_[np.zeros(30), rng.standard_normal(3), np.zeros(7)])
    for values in (x, 1e9 + x, 1e-10 * x):
        result = analyse_series(values, Settings(lag_rule="aic"), "flat")
        assert result.error is not None
        assert "changes in only a few observations" in result.error


def test_dated_series_near_the_float_limit_read_the_same_as_at_unit_scale() -> None:
    # Quarterly dates bring the seasonal check and the jump detector in; both are
    # scale-free, so the verdict and every note must be those of the same data at unit
    # scale, and no overflow warning may escape on the way.
    rng = np.random.default_rng(5)
    index = pd.period_range("1990Q1", periods=120, freq="Q")
    noise = np.clip(rng.standard_normal(120) / 3.0, -1.0, 1.0)
    walk = np.cumsum(rng.standard_normal(120))
    for unit in (noise, walk / np.abs(walk).max()):
        base = analyse_series(pd.Series(unit, index=index), Settings(), "s")
        with warnings.catch_warnings():
            warnings.simplefilter("error", RuntimeWarning)
            big = analyse_series(pd.Series(1.7e308 * unit, index=index), Settings(), "s")
        assert big.error is None and base.error is None
        assert big.verdict.text == base.verdict.text
        assert big.notes == base.notes
