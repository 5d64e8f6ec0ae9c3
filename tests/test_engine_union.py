"""The union of rejections and its parts against outside references.

* DF-GLS statistics: arch's ``arch.unitroot.DFGLS`` (test-only dependency) on statsmodels'
  macrodata, at the lag order our rule chose.
* The scaling constant κ and the component critical values: an independent simulation
  (another seed), the published limits (MacKinnon 2010 for τ without deterministic terms,
  the DF-GLS constant case's limit law; Elliott, Rothenberg & Stock 1996 Table 1, trend
  case, from memory; for MSB on the demeaned series the Cramér-von Mises limit, from
  scipy), and the bounds any union obeys (1 ≤ κ ≤ the Bonferroni value).
* The union's size on random walks and the trend test's size under I(0) and I(1).
"""

from __future__ import annotations

import numpy as np
import pytest

from tauscope.engine.unitroot.dfgls import dfgls
from tauscope.engine.unitroot.dfgls_many import (
    choose_lags_detrended,
    choose_lags_stacked,
    dfgls_many,
    ols_detrend_many,
)
from tauscope.engine.unitroot.trend_robust import (
    trend_critical_value,
    trend_found,
    trend_statistics,
)
from tauscope.engine.unitroot.union import (
    ASYMPTOTIC,
    COMPONENTS,
    constants_from_draws,
    union_constants,
    union_level,
    union_null,
    union_orders,
)
from tauscope.engine.unitroot.union_components import component_values, components_values, detrended

arch_unitroot = pytest.importorskip("arch.unitroot")
sm_datasets = pytest.importorskip("statsmodels.datasets")


def _macro() -> dict[str, np.ndarray]:
    data = sm_datasets.macrodata.load_pandas().data
    return {
        "log realgdp": np.log(data["realgdp"].to_numpy()),
        "log realcons": np.log(data["realcons"].to_numpy()),
        "infl": data["infl"].to_numpy(),
        "unemp": data["unemp"].to_numpy(),
    }


@pytest.mark.parametrize("spec, trend", [("constant", "c"), ("trend", "ct")])
@pytest.mark.parametrize("name", ["log realgdp", "log realcons", "infl", "unemp"])
def test_dfgls_matches_arch_on_macrodata(name: str, spec: str, trend: str) -> None:
    x = _macro()[name]
    tau, lags = dfgls_many(x[None, :], spec, "maic", 14)
    # Source: arch.unitroot.DFGLS (Sheppard), same series, same lag order.
    reference = arch_unitroot.DFGLS(x, trend=trend, lags=int(lags[0]))
    assert tau[0] == pytest.approx(reference.stat, abs=1e-8)


@pytest.mark.parametrize("rule", ["maic", "aic", "bic", "hqc"])
def test_batched_dfgls_equals_one_series_dfgls(rule: str) -> None:
    rng = np.random.default_rng(4)
    xs = np.cumsum(rng.standard_normal((12, 90)), axis=1)
    for spec in ("constant", "trend"):
        tau, lags = dfgls_many(xs, spec, rule, 10)
        for i, x in enumerate(xs):
            one = dfgls(x, spec, rule, 10)
            assert lags[i] == one.lags
            assert tau[i] == pytest.approx(one.statistic, abs=1e-10)


def test_stacked_lag_choice_and_components_equal_one_call_per_case() -> None:
    # Each row's numbers depend on that row alone, so stacking the deterministic cases (or
    # the components of one detrending) into one call must give the same bits.
    rng = np.random.default_rng(8)
    xs = np.cumsum(rng.standard_normal((9, 120)), axis=1)
    ols = [ols_detrend_many(xs, spec) for spec in ("constant", "trend")]
    stacked = choose_lags_stacked(ols, "maic", 8, 2)
    for spec, rows, lags in zip(("constant", "trend"), ols, stacked, strict=True):
        assert lags.tolist() == choose_lags_detrended(xs, rows, spec, "maic", 8, None, 2).tolist()
    parts = [(detrended(xs, c), c, stacked[c.endswith("trend")]) for c in COMPONENTS["four"]]
    for (rows, component, lags), values in zip(parts, components_values(parts), strict=True):
        np.testing.assert_array_equal(values, component_values(rows, component, lags))


@pytest.mark.parametrize("kind", ["two", "four"])
def test_asymptotic_constants_reproduce_with_another_seed(kind: str) -> None:
    draws = union_null(1_000, 40_000, seed=12345, components=COMPONENTS[kind])
    for alpha, (cvs, kappa) in ASYMPTOTIC[kind].items():
        again_cvs, again_kappa = constants_from_draws(draws, alpha)
        # Monte Carlo error at 40,000 replications plus T = 1,000 against 2,000 (relative:
        # the OLS components, −1/MSB near −5 and −6.5, have a larger scale than the t's).
        assert again_cvs == pytest.approx(cvs, rel=0.02)
        assert again_kappa == pytest.approx(kappa, abs=0.012)


def test_component_critical_values_match_published_limits() -> None:
    cvs, _ = ASYMPTOTIC["four"][0.05]
    gls_constant, gls_trend, ols_constant, ols_trend = cvs
    # MacKinnon (2010) Table 2, no deterministic terms, 5%: -1.94100 (the DF-GLS constant
    # case has the same limit law, Elliott, Rothenberg & Stock 1996).
    assert gls_constant == pytest.approx(-1.941, abs=0.02)
    # Elliott, Rothenberg & Stock (1996) Table 1, trend case, T = ∞, 5%: -2.89 (from memory).
    assert gls_trend == pytest.approx(-2.89, abs=0.05)
    # The OLS components are −1/MSB (Stock 1999; Perron & Ng 1996).  On the demeaned series
    # MSB² → ∫ (W − ∫W)², whose eigenvalues 1/(kπ)² are the Brownian bridge's, so its
    # quantiles are the Cramér-von Mises limit's (scipy; Anderson & Darling 1952).
    from scipy.optimize import brentq
    from scipy.stats._hypotests import _cdf_cvm_inf

    def msb_limit(alpha: float) -> float:
        return float(np.sqrt(brentq(lambda x: float(_cdf_cvm_inf(x)) - alpha, 1e-4, 1.0)))

    assert -1.0 / ols_constant == pytest.approx(msb_limit(0.05), abs=0.004)
    # With a trend, MSB lies below the demeaned case's and above zero (the limit of a
    # detrended Brownian motion's mean square is smaller).
    assert 0.0 < -1.0 / ols_trend < -1.0 / ols_constant
    cvs1, _ = ASYMPTOTIC["four"][0.01]
    assert cvs1[0] == pytest.approx(-2.566, abs=0.03)  # MacKinnon (2010), 1%: -2.56574
    assert cvs1[1] == pytest.approx(-3.48, abs=0.07)  # ERS (1996), T = ∞, 1%: -3.48 (from memory)
    assert -1.0 / cvs1[2] == pytest.approx(msb_limit(0.01), abs=0.004)


@pytest.mark.parametrize("kind", ["two", "four"])
def test_kappa_lies_between_one_and_the_bonferroni_bound(kind: str) -> None:
    """A union of m level-α tests rejects at least as often as any one (κ ≥ 1) and at most
    as often as their sum, so κ is at most the scaling that puts each test at α/m."""
    draws = union_null(1_000, 40_000, seed=777, components=COMPONENTS[kind])
    m = draws.shape[1]
    for alpha, (cvs, kappa) in ASYMPTOTIC[kind].items():
        bound = max(float(np.quantile(draws[:, i], alpha / m)) / cvs[i] for i in range(m))
        assert 1.0 < kappa < bound + 0.01


def test_union_size_on_random_walks() -> None:
    rng = np.random.default_rng(31)
    walks = np.cumsum(rng.standard_normal((3_000, 100)), axis=1)
    fixed = union_level(walks, 0, "fixed", 0, 0.05, fixed=0)
    # No lags: the finite-sample constants come from this very design, so 5% ± Monte Carlo error.
    assert abs(float(np.mean(fixed.reject)) - 0.05) < 0.012
    chosen = union_level(walks, 0, "maic", 6, 0.05)
    assert float(np.mean(chosen.reject)) < 0.06
    with_drift = union_level(walks + 0.5 * np.arange(100.0), 0, "fixed", 0, 0.05, fixed=0)
    assert float(np.mean(with_drift.reject)) < 0.062


def test_finite_constants_approach_the_asymptotic_ones() -> None:
    large = union_constants(1_500, 0.05)
    assert large.kappa == pytest.approx(ASYMPTOTIC["four"][0.05][1], abs=0.015)
    # DF-GLS with a constant: its finite-sample value lies left of the limit (ERS 1996).
    assert union_constants(50, 0.05).critical_values[0] < large.critical_values[0]


def test_trend_test_size_under_i0_and_i1_and_power() -> None:
    rng = np.random.default_rng(8)
    n, reps = 200, 1_000
    cv = trend_critical_value(n, 0.05, "maic", 7)
    noise = rng.standard_normal((reps, n))
    walks = np.cumsum(rng.standard_normal((reps, n)), axis=1)
    trending = 0.1 * np.arange(n) + rng.standard_normal((reps, n))
    rates = []
    for xs in (noise, walks, trending):
        u, _ = dfgls_many(xs, "trend", "maic", 7)
        rates.append(float(np.mean(trend_found(trend_statistics(xs, u)["z"], cv))))
    assert rates[0] < 0.07 and rates[1] < 0.07  # nominal 5% under I(0) and under I(1)
    assert rates[2] > 0.95


def test_order_from_the_highest_difference_down() -> None:
    rng = np.random.default_rng(5)
    e = rng.standard_normal((200, 200))
    result = union_orders(np.vstack([e[:100], np.cumsum(e[100:], axis=1)]), "maic", lag_scale=6)
    assert float(np.mean(result.order[:100] == 0)) > 0.9  # white noise
    assert float(np.mean(result.order[100:] == 1)) > 0.8  # random walks
    assert set(result.deterministic) <= {"constant", "trend", "none"}
