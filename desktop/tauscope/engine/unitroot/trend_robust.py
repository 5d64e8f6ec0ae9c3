"""A test for a linear trend that holds whether the series is I(0) or I(1).

Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2007), "A simple, robust and powerful
test of the trend hypothesis", Journal of Econometrics 141(2), 1302-1330.  For
y_t = α + β t + u_t, with u_t either I(0) or I(1):

* z_0 = β̂ / √(ω̂²_u / Σ (t − t̄)²): β̂ the OLS slope, ω̂²_u the long-run variance of
  the OLS residuals û_t (valid when u is I(0));
* z_1 = β̃ / √(ω̂²_v / (T − 1)): β̃ = mean of Δy_t, ω̂²_v the long-run variance of
  Δy_t − β̃ (valid when u is I(1));
* λ = exp(−g (U/S)²), U the DF-GLS t statistic with a trend (ERS 1996) and
  S = Σ_t (Σ_{i≤t} û_i)² / (T² ω̂²_u) the KPSS statistic for trend stationarity:
  under I(0) |U/S| grows and λ → 0, under I(1) U/S → 0 and λ → 1;
* z_λ = (1 − λ) z_0 + λ z_1, standard normal in the limit under both;
  a trend is found when |z_λ| exceeds the two-sided normal critical value.

g = 0.00025 is the paper's constant for a two-sided 5% test (from memory).  Long-run
variances: Bartlett kernel, bandwidth ⌊4 (T/100)^{1/4}⌋ (common practice).

In finite samples λ is not yet near 1 under I(1) (at T = 100 a driftless random walk
gets a "trend" 12% of the time against ±1.96), so :func:`trend_critical_value`
simulates the 1 − α quantile of |z_λ| at the series' own length under both nulls
(a driftless Gaussian random walk and Gaussian white noise, fixed seed, the same lag
rule) and uses the larger of the two and the normal value.  For MAIC lags up to the
union's maximum ⌊6 (T/100)^{1/4}⌋ both quantiles are read from a table simulated once on
a grid of lengths and interpolated in 1/T (:mod:`tauscope.engine.unitroot.union_lookup`).

Applied to the levels it labels an I(0) verdict "around a trend" or "around a mean"
and finds the drift of an I(1) series (a trend in the levels is a drift in the
differences) without first deciding which of the two the series is.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np
from scipy.stats import norm

from tauscope.engine.distributions.simulate import DEFAULT_SEED
from tauscope.engine.unitroot.dfgls_many import dfgls_many
from tauscope.engine.unitroot.phillips_perron import long_run_variance_many
from tauscope.engine.unitroot.union_components import min_lag
from tauscope.engine.unitroot.union_lookup import table_trend_critical_value

HLT_G = 0.00025  # Harvey, Leybourne & Taylor (2007), two-sided 5% (from memory)
TABLE_LAG_SCALE = 6.0  # the lag maximum the table was simulated with (the union's, c = 6)


def bartlett_bandwidth(length: int) -> int:
    """⌊4 (T/100)^{1/4}⌋ (common practice)."""
    return int(np.floor(4.0 * (length / 100.0) ** 0.25))


def trend_statistics(xs: np.ndarray, dfgls_trend: np.ndarray) -> dict[str, np.ndarray]:
    """z_0, z_1, λ and z_λ for every row of ``xs``; ``dfgls_trend`` is U, each row's
    DF-GLS statistic with a trend."""
    n = xs.shape[1]
    t = np.arange(1.0, n + 1.0)
    tc = t - t.mean()
    sxx = float(tc @ tc)
    mean = xs.mean(axis=1, keepdims=True)
    slope = np.einsum("rn,n->r", xs - mean, tc) / sxx  # row by row, the same bits alone or batched
    resid = xs - mean - slope[:, None] * tc[None, :]
    bandwidth = bartlett_bandwidth(n)
    with np.errstate(divide="ignore", invalid="ignore"):
        omega_u = long_run_variance_many(resid, bandwidth)
        z0 = slope / np.sqrt(omega_u / sxx)
        dx = np.diff(xs, axis=1)
        drift = dx.mean(axis=1)
        omega_v = long_run_variance_many(dx - drift[:, None], bandwidth)
        z1 = drift / np.sqrt(omega_v / (n - 1))
        kpss = np.einsum("rn,rn->r", np.cumsum(resid, axis=1), np.cumsum(resid, axis=1)) / (
            n * n * omega_u)
        weight = np.exp(-HLT_G * (dfgls_trend / kpss) ** 2)
    weight = np.where(np.isfinite(weight), weight, 1.0)
    return {"z0": z0, "z1": z1, "lambda": weight, "z": (1.0 - weight) * z0 + weight * z1}


@lru_cache(maxsize=64)
def trend_critical_value(length: int, alpha: float = 0.05, rule: str = "maic", max_lags: int = 0,
                         reps: int = 2_000, seed: int = DEFAULT_SEED, source: str = "table",
                         difference: int = 0) -> float:
    """The larger of the 1 − α quantiles of |z_λ| for driftless random walks and for white
    noise of ``length`` values (U with the same lag rule and maximum), and the normal
    two-sided value.  ``source="table"``: interpolated from the table (20,000 replications
    per null) when ``rule`` is MAIC, ``max_lags`` the union's ⌊6 (T/100)^{1/4}⌋ (capped
    at T//2 − 3) and ``reps`` and ``seed`` the defaults; ``"simulate"``: always simulated.
    U's lag order has the union's floor on the level Δ^``difference`` (the short-sample rule
    on the levels; the table holds the levels' floor)."""
    floor = min_lag(length, rule, difference)
    if (source == "table" and rule == "maic" and reps == 2_000 and seed == DEFAULT_SEED
            and max_lags == _union_max_lags(length) and floor == min_lag(length, rule)):
        tabled = table_trend_critical_value(length, alpha)
        if tabled is not None:
            return tabled
    rng = np.random.default_rng([seed, length, 7])
    quantiles = [float(norm.ppf(1.0 - alpha / 2.0))]
    for xs in (np.cumsum(rng.standard_normal((reps, length)), axis=1),
               rng.standard_normal((reps, length))):
        u, _ = dfgls_many(xs, "trend", rule, max_lags, None, floor)
        z = trend_statistics(xs, u)["z"]
        quantiles.append(float(np.nanquantile(np.abs(z), 1.0 - alpha)))
    return max(quantiles)


def _union_max_lags(length: int) -> int:
    """⌊6 (T/100)^{1/4}⌋ capped at T//2 − 3 (``union.max_lags_schwert`` with c = 6)."""
    return max(0, min(int(np.floor(TABLE_LAG_SCALE * (length / 100.0) ** 0.25)), length // 2 - 3))


def trend_found(z: np.ndarray, critical_value: float) -> np.ndarray:
    """|z_λ| beyond ``critical_value`` (NaN: no)."""
    with np.errstate(invalid="ignore"):
        return np.asarray(np.abs(z) > critical_value)
