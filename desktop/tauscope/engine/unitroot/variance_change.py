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

from tauscope.engine.unitroot.phillips_perron import long_run_variance_many


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
    statistic, k = kappa2_many(np.asarray(residuals, dtype=float)[None, :], bandwidth)
    return float(statistic[0]), int(k[0])


def kappa2_many(residuals: np.ndarray, bandwidth: int | None = None) -> tuple[np.ndarray, np.ndarray]:
    """(κ2, the 0-based index k − 1 of the largest |G_k|) for every row of ``residuals``
    (R, T); κ2 is NaN where ω̂₄ is not positive.  ``bandwidth`` None: Bartlett's m above;
    the Newey-West sum stops at T − 1 lags (further terms are empty sums)."""
    e2 = residuals ** 2
    t = e2.shape[1]
    c = np.cumsum(e2, axis=1)
    g = c - np.arange(1, t + 1)[None, :] / t * c[:, -1:]
    d = e2 - c[:, -1:] / t
    omega = long_run_variance_many(d, bartlett_bandwidth(t) if bandwidth is None else bandwidth)
    k = np.argmax(np.abs(g), axis=1)
    top = np.abs(g[np.arange(g.shape[0]), k])
    with np.errstate(all="ignore"):
        statistic = np.where(omega > 0.0, top / np.sqrt(t * omega), np.nan)
    return statistic, k


@lru_cache(maxsize=16)
def critical_value(alpha: float) -> float:
    """The (1 − α) quantile of sup |B(r)| (Kolmogorov's distribution); looked up once per
    level."""
    return float(kstwobign.ppf(1.0 - alpha))


def trend_residuals_many(ys: np.ndarray, lags: np.ndarray) -> list[np.ndarray | None]:
    """OLS residuals of Δy_t on [1, t, y_{t−1}, Δy_{t−1}, …, Δy_{t−p}] for every row of ``ys``
    (series of one length), p its own lag order (None where fewer than p + 8 rows remain):
    the rows of one lag order fitted together, each by its own QR (e = Δy − Q Q'Δy, LAPACK
    and the products matrix by matrix over the stack, so a row gets the same numbers alone
    as in a batch).  A design that is not finite, or of deficient rank by lstsq's rule (a
    singular value of R at or below ε·max(M, N) times the largest), gives None."""
    ys = np.asarray(ys, dtype=float)
    out: list[np.ndarray | None] = [None] * ys.shape[0]
    dys = np.diff(ys, axis=1)
    for p, rows in _lag_groups(np.asarray(lags)):
        n = dys.shape[1] - p
        if n < p + 8:
            continue
        design = np.empty((rows.size, n, 3 + p))
        design[:, :, 0] = 1.0
        design[:, :, 1] = np.arange(n, dtype=float)
        design[:, :, 2] = ys[rows, p:-1]
        for j in range(1, p + 1):
            design[:, :, 2 + j] = dys[rows, p - j:dys.shape[1] - j]
        response = dys[rows, p:]
        finite = np.isfinite(design).all(axis=(1, 2)) & np.isfinite(response).all(axis=1)
        if not finite.any():
            continue
        rows, design, response = rows[finite], design[finite], response[finite]
        q, r = np.linalg.qr(design)
        singular = np.linalg.svd(r, compute_uv=False)
        full_rank = (singular > np.finfo(float).eps * max(design.shape[1:]) * singular[:, :1]).all(axis=1)
        fitted = q @ (np.swapaxes(q, 1, 2) @ response[:, :, None])
        residuals = response - fitted[:, :, 0]
        for row, keep, e in zip(rows.tolist(), full_rank.tolist(), residuals, strict=True):
            if keep:
                out[row] = e
    return out


def _lag_groups(lags: np.ndarray) -> list[tuple[int, np.ndarray]]:
    return [(int(p), np.flatnonzero(lags == p)) for p in np.unique(lags).tolist()]


def variance_change(y: np.ndarray, lags: int, alpha: float = 0.05) -> VarianceChange | None:
    """The κ2 test on the shocks of ``y`` (the Dickey-Fuller regression with a trend and
    ``lags`` lagged differences); ``None`` when that regression cannot be computed."""
    return variance_changes(np.asarray(y, dtype=float)[None, :], np.array([lags]), alpha)[0]


def variance_changes(ys: np.ndarray, lags: np.ndarray, alpha: float = 0.05) -> list[VarianceChange | None]:
    """:func:`variance_change` of every row of ``ys`` (series of one length), each with its
    own lag order (the regressions of one lag order fitted together)."""
    lags = np.asarray(lags)
    residuals = trend_residuals_many(ys, lags)
    out: list[VarianceChange | None] = [None] * len(residuals)
    cv = critical_value(alpha)
    for p, rows in _lag_groups(lags):
        kept = [row for row in rows.tolist() if residuals[row] is not None]
        if not kept:
            continue
        statistic, k = kappa2_many(np.stack([residuals[row] for row in kept]))
        # kolmogorov is kstwobign's survival function itself, without scipy.stats' checks.
        p_values = kolmogorov(statistic)
        for row, value, where, p_value in zip(kept, statistic.tolist(), k.tolist(), p_values.tolist(),
                                              strict=True):
            if math.isfinite(value):
                out[row] = VarianceChange(value, cv, p_value, alpha, value > cv, where + p + 2)
    return out
