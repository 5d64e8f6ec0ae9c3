"""The M statistics (Ng & Perron 2001) and the union's components built on them.

References:
* the spectral estimate s²_AR = σ̂²_k / (1 − Σ b̂_j)²: statsmodels OLS of the same
  regression (Δỹ_t on ỹ_{t−1} and k lagged differences);
* the GLS M statistics' 5% limits: Ng & Perron (2001), Table 1 (reference-values.md §6,
  from memory);
* MSB on the OLS-demeaned series: its square's limit ∫ (W − ∫W)² has the Karhunen-Loève
  eigenvalues 1/(kπ)² of the Brownian bridge, so its quantiles are those of the
  Cramér-von Mises statistic's limit, computed by scipy (Anderson & Darling 1952);
* the OLS-detrended MZt and MZα with the initial value's term have the Dickey-Fuller
  limits of τ and T(ρ̂ − 1): MacKinnon (2010) Table 2 for τ; Fuller (1976) Table 10.A.1
  for T(ρ̂ − 1), −14.1 and −21.8 at 5% (from memory).
"""

from __future__ import annotations

import numpy as np
import pytest
from scipy.optimize import brentq

from tauscope.engine.unitroot.dfgls_many import choose_lags_many, gls_detrend_many, ols_detrend_many
from tauscope.engine.unitroot.ng_perron_many import m_statistics_many, spectral_ar_many
from tauscope.engine.unitroot.union_components import (
    SHORT_LENGTH,
    SHORT_MIN_LAG,
    component_statistic,
    min_lag,
    shown,
)

sm = pytest.importorskip("statsmodels.api")


def _walks(reps: int, length: int, seed: int) -> np.ndarray:
    return np.cumsum(np.random.default_rng(seed).standard_normal((reps, length)), axis=1)


@pytest.mark.parametrize("k", [0, 1, 4])
def test_spectral_estimate_matches_statsmodels_ols(k: int) -> None:
    xs = gls_detrend_many(_walks(3, 120, 11), "trend")
    s2 = spectral_ar_many(xs, np.full(3, k))
    for i, y in enumerate(xs):
        dy = np.diff(y)
        columns = [y[k:-1]] + [dy[k - j:len(dy) - j] for j in range(1, k + 1)]
        fit = sm.OLS(dy[k:], np.column_stack(columns)).fit()
        # Source: statsmodels OLS; σ̂² = RSS / (T − 1 − k), Σ b̂_j over the lagged differences.
        expected = (fit.ssr / len(dy[k:])) / (1.0 - fit.params[1:].sum()) ** 2
        assert s2[i] == pytest.approx(expected, rel=1e-10)


def test_msb_and_mzt_are_built_from_mza_as_published() -> None:
    xs = gls_detrend_many(_walks(20, 80, 3), "constant")
    lags = np.arange(20) % 3
    m = m_statistics_many(xs, lags)
    s2 = spectral_ar_many(xs, lags)
    t = xs.shape[1]
    lagged = np.sum(xs[:, :-1] ** 2, axis=1) / t**2
    # Ng & Perron (2001), section 2: MZα = (T⁻¹ỹ_T² − s²)/(2T⁻²Σỹ²), MSB = (T⁻²Σỹ²/s²)^½, MZt = MZα·MSB.
    np.testing.assert_allclose(m["mza"], (xs[:, -1] ** 2 / t - s2) / (2 * lagged), rtol=1e-12)
    np.testing.assert_allclose(m["msb"], np.sqrt(lagged / s2), rtol=1e-12)
    np.testing.assert_allclose(m["mzt"], m["mza"] * m["msb"], rtol=1e-12)


def test_gls_m_statistics_near_the_published_limits() -> None:
    walks = _walks(20_000, 1_000, 2026)
    zeros = np.zeros(walks.shape[0], dtype=int)
    # Ng & Perron (2001) Table 1, 5% (reference-values.md §6, from memory); T = 1,000 and
    # 20,000 replications: Monte Carlo error about 1% plus the finite-sample gap.
    published = {"constant": {"mza": -8.1, "mzt": -1.98, "msb": 0.233},
                 "trend": {"mza": -17.3, "mzt": -2.91, "msb": 0.168}}
    for spec, values in published.items():
        m = m_statistics_many(gls_detrend_many(walks, spec), zeros)
        for name, value in values.items():
            assert float(np.quantile(m[name], 0.05)) == pytest.approx(value, rel=0.07)


def test_ols_msb_matches_the_cramer_von_mises_limit() -> None:
    from scipy.stats._hypotests import _cdf_cvm_inf  # the CvM statistic's limiting CDF

    walks = _walks(20_000, 1_000, 77)
    msb = m_statistics_many(ols_detrend_many(walks, "constant"), np.zeros(20_000, dtype=int))["msb"]
    for alpha in (0.01, 0.05, 0.10):
        # Source: scipy's Cramér-von Mises limit; MSB² → ∫ (W − ∫W)² in law.
        limit = np.sqrt(brentq(lambda x, a=alpha: float(_cdf_cvm_inf(x)) - a, 1e-4, 1.0))
        assert float(np.quantile(msb, alpha)) == pytest.approx(limit, abs=0.004)


def test_ols_m_statistics_with_the_initial_term_have_dickey_fuller_limits() -> None:
    walks = _walks(20_000, 1_000, 5)
    zeros = np.zeros(20_000, dtype=int)
    # MacKinnon (2010) Table 2, 5%: −2.86154 (constant), −3.41049 (trend); Fuller (1976)
    # T(ρ̂ − 1), 5%: −14.1, −21.8 (from memory).
    for spec, tau, rho in (("constant", -2.86154, -14.1), ("trend", -3.41049, -21.8)):
        m = m_statistics_many(ols_detrend_many(walks, spec), zeros, initial=True)
        assert float(np.quantile(m["mzt"], 0.05)) == pytest.approx(tau, abs=0.04)
        assert float(np.quantile(m["mza"], 0.05)) == pytest.approx(rho, abs=0.5)


def test_components_and_their_shown_values() -> None:
    xs = _walks(6, 150, 9)
    lags = np.array([0, 1, 2, 0, 1, 2])
    ols = component_statistic(xs, "ols-trend", lags)
    msb = m_statistics_many(ols_detrend_many(xs, "trend"), lags)["msb"]
    np.testing.assert_allclose(ols, -1.0 / msb, rtol=1e-12)
    np.testing.assert_allclose([shown("ols-trend", v) for v in ols], msb, rtol=1e-12)
    gls = component_statistic(xs, "gls-constant", lags)
    assert [shown("gls-constant", v) for v in gls] == list(gls)


def test_short_sample_rule_sets_the_smallest_lag() -> None:
    assert min_lag(SHORT_LENGTH - 1, "maic") == SHORT_MIN_LAG
    assert min_lag(SHORT_LENGTH, "maic") == 0
    assert min_lag(50, "fixed") == 0
    xs = np.random.default_rng(1).standard_normal((200, 60))  # white noise: MAIC mostly picks 0
    free = choose_lags_many(xs, "constant", "maic", 5)
    floored = choose_lags_many(xs, "constant", "maic", 5, min_lag=2)
    assert (free < 2).any() and floored.min() >= 2
    np.testing.assert_array_equal(floored[free >= 2], free[free >= 2])
    assert (choose_lags_many(xs, "constant", "maic", 1, min_lag=2) == 1).all()  # capped by the maximum


def test_an_exact_fit_in_the_batch_leaves_the_other_rows_alone() -> None:
    """A row whose regression is singular gets NaN; the others equal their own one-row
    results (the fast path batches series of one length; tests/test_engine_fast_path.py)."""
    from tauscope.engine.unitroot.dfgls_many import dfgls_tau_many

    walks = gls_detrend_many(_walks(3, 40, 21), "constant")
    exact = gls_detrend_many(np.full((1, 40), 7.0), "constant")  # a constant: Z'Z is zero
    rows = np.vstack([walks[:2], exact, walks[2:]])
    lags = np.full(4, 2)
    tau = dfgls_tau_many(rows, lags)
    s2 = spectral_ar_many(rows, lags)
    assert np.isnan(tau[2]) and np.isnan(s2[2])
    for i, r in ((0, 0), (1, 1), (3, 2)):
        assert tau[i] == dfgls_tau_many(walks[r:r + 1], lags[:1])[0]
        assert s2[i] == spectral_ar_many(walks[r:r + 1], lags[:1])[0]
