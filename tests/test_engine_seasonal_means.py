"""Fixed seasonal means (issue 14): the F test of seasonal dummies, their removal before the
unit-root tests, the ``seasonal`` setting, and the verdicts on seasonal processes.

References: statsmodels OLS (the F test of the dummies, the removal as OLS residuals);
Dickey, Bell & Miller (1986) for the regression; the scorecard's processes
(benchmarks/scorecard_processes.py) for the acceptance rows of issue 14, here with fewer
replications and the limits widened by about two Monte Carlo standard errors.
"""

from __future__ import annotations

import numpy as np
import pandas as pd
import pytest
import statsmodels.api as sm

from bench_modules import load_benchmark
from tauscope.engine import Settings, analyse_many, analyse_series
from tauscope.engine.seasonal.means import (
    contrasts,
    remove_seasonal_means,
    seasonal_means_test,
    seasonal_means_tests,
)
from tauscope.engine.unitroot.union import union_constants, union_level

SCORECARD = load_benchmark("verdict_scorecard")


def _seasonal_ar(rng: np.random.Generator, n: int, period: int, size: float = 1.0) -> np.ndarray:
    effects = np.resize(np.array([1.5, -0.5, 1.0, -2.0, 0.5, 1.0, -1.0, 0.0, 2.0, -1.5, 0.5, -1.5])[:period], n)
    effects = effects - effects[:period].mean()
    u = np.zeros(n + 100)
    e = rng.standard_normal(n + 100)
    for t in range(1, n + 100):
        u[t] = 0.5 * u[t - 1] + e[t]
    return 3.0 + size * effects + u[100:]


def _dated(x: np.ndarray, period: int) -> pd.Series:
    freq, start = ("Q", "1980Q1") if period == 4 else ("M", "1980-01")
    return pd.Series(x, index=pd.period_range(start, periods=x.size, freq=freq))


@pytest.mark.parametrize("period", [4, 12])
def test_f_statistic_equals_statsmodels(period: int) -> None:
    # reference: statsmodels OLS f_test of the S − 1 dummies in the same regression
    rng = np.random.default_rng(1)
    y = _seasonal_ar(rng, 120, period, size=0.3)
    fit = seasonal_means_test(y, period)
    assert fit is not None
    p = fit.lags
    dy = np.diff(y)
    rows = np.arange(p, dy.size)
    lagged = [dy[rows - i] for i in range(1, p + 1)]
    x = np.column_stack([np.ones(rows.size), y[rows], *lagged, contrasts(y.size, period)[1:][rows]])
    res = sm.OLS(dy[rows], x).fit()
    restriction = np.zeros((period - 1, x.shape[1]))
    restriction[:, x.shape[1] - period + 1:] = np.eye(period - 1)
    f = res.f_test(restriction)
    assert fit.statistic == pytest.approx(float(np.squeeze(f.fvalue)), rel=1e-8)
    assert fit.p_value == pytest.approx(float(f.pvalue), rel=1e-6, abs=1e-12)


def test_removal_is_the_ols_residual_of_the_contrasts() -> None:
    # reference: statsmodels OLS of y on [1, t, contrasts]; the removal keeps the constant
    # and trend parts and takes out the contrasts' fitted part
    rng = np.random.default_rng(2)
    y = _seasonal_ar(rng, 90, 12)
    c = contrasts(90, 12)
    t = np.arange(90.0)
    res = sm.OLS(y, np.column_stack([np.ones(90), t, c])).fit()
    expected = y - c @ res.params[2:]
    assert np.allclose(remove_seasonal_means(y, 12), expected, atol=1e-10)
    batch = remove_seasonal_means(np.vstack([y, 2 * y]), 12)
    assert np.array_equal(batch[0], remove_seasonal_means(y, 12))  # a row alone: the same bits


@pytest.mark.parametrize("period", [4, 12])
def test_detection_on_simulated_seasonal_and_plain_ar(period: int) -> None:
    # A seasonal AR(0.5) with effects of 1.5 shock standard deviations is found nearly always;
    # a plain AR(0.5) rarely (the test is at 1%; 100 series: at most 5 expected by chance
    # with a wide margin, common practice)
    rng = np.random.default_rng(3)
    seasonal = [seasonal_means_test(_seasonal_ar(rng, 100, period), period) for _ in range(100)]
    plain = [seasonal_means_test(_seasonal_ar(rng, 100, period, size=0.0), period) for _ in range(100)]
    assert np.mean([f is not None and f.found for f in seasonal]) >= 0.95
    assert np.mean([f is not None and f.found for f in plain]) <= 0.05


def test_the_setting_switches_the_dummies() -> None:
    rng = np.random.default_rng(4)
    x = _dated(_seasonal_ar(rng, 120, 12), 12)
    never = analyse_series(x, Settings(seasonal="never"))
    auto = analyse_series(x, Settings(seasonal="automatic"))
    always = analyse_series(x, Settings(seasonal="always"))
    assert never.seasonal is None
    assert auto.seasonal is not None and auto.seasonal.means is not None and auto.seasonal.means.used
    assert always.seasonal is not None and always.seasonal.means is not None and always.seasonal.means.used
    tau_never, tau_auto = (r.find("adf", "constant", 0) for r in (never, auto))
    assert tau_never is not None and tau_auto is not None
    assert tau_never.statistic != tau_auto.statistic  # the tests see another series
    assert auto.to_dict()["seasonal"]["means"]["used"] is True
    assert len(auto.seasonal.means.effects) == 12
    # "always" on a series without seasonal means: allowed for though not found
    plain = _dated(_seasonal_ar(rng, 120, 4, size=0.0), 4)
    forced = analyse_series(plain, Settings(seasonal="always"))
    assert forced.seasonal is not None and forced.seasonal.means is not None
    assert forced.seasonal.means.used
    # an undated series has no seasons: the setting changes nothing
    bare = analyse_series(_seasonal_ar(rng, 120, 4), Settings(seasonal="always"))
    assert bare.seasonal is None


def test_settings_round_trip_and_old_records() -> None:
    assert Settings().seasonal == "automatic"
    assert Settings.from_dict({"alpha": 0.05}).seasonal == "automatic"  # records from before
    assert Settings.from_dict(Settings(seasonal="never").to_dict()).seasonal == "never"
    with pytest.raises(ValueError):
        Settings(seasonal="sometimes")


def test_fast_and_reference_paths_agree_with_dummies() -> None:
    rng = np.random.default_rng(5)
    x = _dated(_seasonal_ar(rng, 100, 4), 4)
    fast = analyse_series(x, Settings())
    reference = analyse_series(x, Settings(), path="reference")
    assert fast.verdict.order == reference.verdict.order
    for a, b in zip(fast.tests, reference.tests, strict=True):
        if np.isfinite(a.statistic):
            assert a.statistic == pytest.approx(b.statistic, abs=1e-8), (a.test, a.spec, a.difference)


@pytest.mark.parametrize("period", [4, 12])
def test_union_size_with_the_seasonal_means_removed(period: int) -> None:
    # The union's constants simulated with the removal (seed of the engine) give size 5% on
    # other random walks: 4,000 walks, 5% ± 1.5 points (about 4.5 standard errors)
    rng = np.random.default_rng(6)
    walks = np.cumsum(rng.standard_normal((4_000, 100)), axis=1)
    level = union_level(remove_seasonal_means(walks, period), 0, "fixed", 0, 0.05, fixed=0,
                        period=period)
    assert level.constants.length == 100
    assert abs(float(np.mean(level.reject)) - 0.05) <= 0.015
    plain = union_constants(100, 0.05)
    assert level.constants.kappa != plain.kappa  # simulated with the removal, not the table


@pytest.mark.parametrize("name", ["seasonal AR(1)", "monthly seasonal AR(1)"])
def test_acceptance_seasonal_ar_is_called_stationary(name: str) -> None:
    # issue 14: I(0) in at least 85% at T = 150; here 120 series, limit 85% − 7 points
    process = SCORECARD.by_name(name)
    xs = SCORECARD.simulate(process, 150, 120, SCORECARD.SEED)
    results = analyse_many(SCORECARD.dated(xs, process.period), Settings(power=False))
    assert np.mean([r.verdict.order == 0 for r in results]) >= 0.78


def test_acceptance_quarterly_seasonal_walk_has_a_seasonal_root() -> None:
    # issue 14: a seasonal unit root found in at least 80% at T = 200; 120 series, limit 73%
    process = SCORECARD.by_name("quarterly seasonal walk")
    xs = SCORECARD.simulate(process, 200, 120, SCORECARD.SEED)
    results = analyse_many(SCORECARD.dated(xs, 4), Settings(power=False))
    found = [r.seasonal is not None and r.seasonal.roots is not None and bool(r.seasonal.roots.seasonal_roots)
             for r in results]
    assert np.mean(found) >= 0.73
    words = {w for r in results if r.seasonal and r.seasonal.roots for w in r.seasonal.roots.seasonal_roots}
    assert words <= {"twice a year", "once a year"}
    assert any("seasonal difference" in note or "sum of the last four quarters" in note
               for r in results for note in r.notes)


def test_effects_are_named_by_calendar_season_whatever_the_first_quarter() -> None:
    """A quarterly series with +5 in Q1 and −5 in Q3 reports those effects under Q1 and Q3
    whether it starts in a first or a third quarter (constructed example)."""
    rng = np.random.default_rng(1)
    for start in ("1990Q1", "1990Q3"):
        index = pd.period_range(start, periods=160, freq="Q")
        quarter = np.array([p.quarter for p in index])
        level = np.select([quarter == 1, quarter == 3], [5.0, -5.0], 0.0)
        result = analyse_series(pd.Series(level + rng.standard_normal(160), index=index), name="s")
        assert result.seasonal is not None
        means = result.seasonal.means
        effects = dict(zip(means.seasons, means.effects, strict=True))
        assert abs(effects["Q1"] - 5.0) < 0.5 and abs(effects["Q3"] + 5.0) < 0.5


@pytest.mark.parametrize("period,start", [(4, 0), (4, 3), (12, 5)])
def test_many_series_at_once_equal_each_alone(period: int, start: int) -> None:
    # the batched F test (seasonal_means_tests) against seasonal_means_test row by row
    rng = np.random.default_rng(31)
    n = 150
    rows = [_seasonal_ar(rng, n, period, size) for size in (0.0, 0.2, 1.0, 3.0)]
    rows += [np.cumsum(rng.standard_normal(n)) for _ in range(3)]
    gap = _seasonal_ar(rng, n, period)
    gap[40] = np.nan
    rows.append(gap)
    values = np.vstack(rows)
    many = seasonal_means_tests(values, period, start)
    assert many[-1] is None and seasonal_means_test(gap, period, start) is None
    for row, got in zip(values[:-1], many[:-1], strict=True):
        want = seasonal_means_test(row, period, start)
        assert want is not None and got is not None
        assert (got.lags, got.df_num, got.df_den, got.found) == (want.lags, want.df_num, want.df_den,
                                                                 want.found)
        assert got.statistic == pytest.approx(want.statistic, rel=1e-10, abs=1e-10)
        assert got.p_value == pytest.approx(want.p_value, abs=1e-10)
        np.testing.assert_allclose(got.effects, want.effects, rtol=1e-10, atol=1e-10)
    assert seasonal_means_tests(values[:, :3 * period + 9], period, start) == [None] * len(rows)
    # a row alone gets the batch's very bits (analyse_series and analyse_many agree exactly)
    for i, got in enumerate(many):
        assert seasonal_means_tests(values[i:i + 1], period, start)[0] == got


def test_analyse_many_takes_the_same_seasonal_decision_as_each_series_alone() -> None:
    rng = np.random.default_rng(32)
    series = [(f"s{i}", _dated(_seasonal_ar(rng, 96, 4, size), 4)) for i, size in
              enumerate((0.0, 0.5, 2.0))]
    settings = Settings(power=False)
    for (name, values), batched in zip(series, analyse_many(series, settings), strict=True):
        alone = analyse_series(values, settings, name)
        assert batched.seasonal is not None and alone.seasonal is not None
        assert batched.seasonal.means.found == alone.seasonal.means.found
        assert batched.seasonal.means.statistic == pytest.approx(alone.seasonal.means.statistic,
                                                                 rel=1e-10)
