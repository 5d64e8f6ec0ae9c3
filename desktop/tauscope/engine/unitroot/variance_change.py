"""A test for a change in the shocks' variance: the κ2 statistic of Sansó, Aragó & Carrion.

Sansó, A., Aragó, V. & Carrion-i-Silvestre, J.L. (2004), "Testing for changes in the
unconditional variance of financial time series", Revista de Economía Financiera 4,
32-53, which corrects the cumulative sum of squares test of Inclán, C. & Tiao, G.C.
(1994), JASA 89(427), 913-923, for shocks that are not normal and for dependence in the
squares.  On the residuals e_1 … e_T:

    C_k = Σ_{t≤k} e_t²,   G_k = C_k − (k/T) C_T,   κ2 = max_k |G_k| / √(T ω̂₄),

where ω̂₄ is the long-run variance of e_t² − C_T/T (Bartlett weights 1 − l/(m + 1),
m = ⌊4 (T/100)^{2/9}⌋, common practice after Newey & West 1994).  Under a constant
variance κ2 tends to sup_r |B(r)| for a Brownian bridge B, whose distribution is
Kolmogorov's (scipy's ``kstwobign``): 5% critical value 1.358.  The k of the maximum
dates the change (Inclán & Tiao 1994).

The residuals are those of the Dickey-Fuller regression with a constant and a trend,
Δy_t on [1, t, y_{t−1}, Δy_{t−1}, …, Δy_{t−p}], the shocks whether or not y has a unit
root.  Nothing here raises for a bad series: a regression that cannot be solved gives
``None``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np
from scipy.special import kolmogorov
from scipy.stats import kstwobign

from tauscope.engine.unitroot.phillips_perron import long_run_variance


@dataclass(frozen=True)
class VarianceChange:
    """κ2, its asymptotic critical value and p-value at ``alpha``, whether the variance
    is found to change, and the position (0-based, in the series) where it changes most."""

    statistic: float
    critical_value: float
    p_value: float
    alpha: float
    found: bool
    position: int


def bartlett_bandwidth(length: int) -> int:
    """m = ⌊4 (T/100)^{2/9}⌋ (common practice after Newey & West 1994)."""
    return math.floor(4.0 * (length / 100.0) ** (2.0 / 9.0))


def kappa2(residuals: np.ndarray, bandwidth: int | None = None) -> tuple[float, int]:
    """(κ2, the 0-based index k − 1 of the largest |G_k|) for one residual series."""
    e2 = np.asarray(residuals, dtype=float) ** 2
    t = e2.shape[0]
    c = np.cumsum(e2)
    g = c - np.arange(1, t + 1) / t * c[-1]
    d = e2 - c[-1] / t
    m = bartlett_bandwidth(t) if bandwidth is None else bandwidth
    omega = long_run_variance(d, m)  # terms beyond t − 1 lags are empty sums
    k = int(np.argmax(np.abs(g)))
    if not omega > 0.0:
        return float("nan"), k
    return float(abs(g[k]) / math.sqrt(t * omega)), k


@lru_cache(maxsize=16)
def critical_value(alpha: float) -> float:
    """The (1 − α) quantile of sup |B(r)| (Kolmogorov's distribution); looked up once per
    level."""
    return float(kstwobign.ppf(1.0 - alpha))


def trend_residuals(y: np.ndarray, lags: int) -> np.ndarray | None:
    """OLS residuals of Δy_t on [1, t, y_{t−1}, Δy_{t−1}, …, Δy_{t−p}] (p = ``lags``)."""
    y = np.asarray(y, dtype=float)
    dy = np.diff(y)
    n = dy.shape[0] - lags
    if n < lags + 8:
        return None
    columns = [np.ones(n), np.arange(n, dtype=float), y[lags:-1]]
    columns += [dy[lags - j:dy.shape[0] - j] for j in range(1, lags + 1)]
    design = np.column_stack(columns)
    if not np.all(np.isfinite(design)):
        return None
    beta, _, rank, _ = np.linalg.lstsq(design, dy[lags:], rcond=None)
    if rank < design.shape[1]:
        return None
    return np.asarray(dy[lags:] - design @ beta)


def variance_change(y: np.ndarray, lags: int, alpha: float = 0.05) -> VarianceChange | None:
    """The κ2 test on the shocks of ``y`` (the Dickey-Fuller regression with a trend and
    ``lags`` lagged differences); ``None`` when that regression cannot be computed."""
    residuals = trend_residuals(y, lags)
    if residuals is None:
        return None
    statistic, k = kappa2(residuals)
    if not math.isfinite(statistic):
        return None
    cv = critical_value(alpha)
    # kolmogorov is kstwobign's survival function itself, without scipy.stats' checks.
    return VarianceChange(statistic, cv, float(kolmogorov(statistic)), alpha, statistic > cv,
                          k + lags + 2)
