"""Minimum LM unit-root test with one level shift, allowed under the null and under the
alternative (Lee, J. & Strazicich, M.C. 2013, "Minimum LM unit root test with one
structural break", Economics Bulletin 33(4), 2483-2492; the two-break version is Lee &
Strazicich 2003, Review of Economics and Statistics 85(4), 1082-1089; the LM principle
is Schmidt & Phillips 1992, Oxford Bulletin of Economics and Statistics 54(3)).

Model A ("crash"): y_t = δ'Z_t + e_t, e_t = β e_{t−1} + ε_t, Z_t = [1, t, D_t]',
D_t = 1(t > TB), TB the last observation of the old regime.  β = 1 is the null (a unit
root whose level may jump at TB), β < 1 the alternative (stationary around a trend
whose level shifts at TB).  For a candidate TB:

    δ̃ from Δy_t = δ'ΔZ_t + u_t, t = 2..T, with ΔZ_t = [1, B_t], B_t = 1(t = TB + 1):
        δ̃_t = (Σ_{t≥2} Δy_t − Δy_{TB+1}) / (T − 2),   δ̃_D = Δy_{TB+1} − δ̃_t;
    S̃_t = y_t − y_1 − (t − 1) δ̃_t − D_t δ̃_D          (S̃_1 = 0);
    Δy_t = c + d·B_t + φ S̃_{t−1} + Σ_{i=1..k} γ_i ΔS̃_{t−i} + u_t,
    τ̃(TB) = φ̂ / se(φ̂).

The statistic is min over TB of τ̃(TB), TB from ⌊0.1 T⌉ to T − ⌊0.1 T⌉ (1-based, Lee &
Strazicich's 10% trimming); the break is the TB at the minimum.  The lag order k is
fixed for every candidate (what the analysis uses), or chosen candidate by candidate by
general-to-specific testing from k_max down (|t| of the last lag above 1.645; Ng &
Perron 1995, as Lee & Strazicich do).  Under the null the statistic's distribution does
not depend on the size or place of the shift (Lee & Strazicich 2013), so critical values
come from a random walk without a break (:mod:`tauscope.engine.distributions.break_null`,
no lags).  Those fit a fixed lag order; choosing it candidate by candidate makes the
minimum more negative (measured at T = 100 with k_max = 8: 5% quantile −3.74 against
−3.49 with no lags), so that variant needs its own critical values.

All candidate breaks are solved as one batch: every candidate's cross products come from
sums over the sample (:mod:`tauscope.engine.unitroot.lm_break_sums`); the impulse B_t
takes its row out of the fit, which is done by taking that row's products out of the
cross products instead of adding a column.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from tauscope.engine.errors import UntestableSeries
from tauscope.engine.unitroot.lm_break_sums import candidate_moments, detrending

TRIM = 0.10
MAX_LAGS = 8  # Lee & Strazicich's upper bound for the lag search
LAG_T = 1.645  # |t| of the last lag kept: 10% two-sided (Ng & Perron 1995)


@dataclass(frozen=True)
class LMBreakSearch:
    """The minimum LM statistic, where it was found, and the whole profile.

    ``position``: TB as a 0-based position, the last observation of the old regime.
    ``shift``: δ̃_D, the estimated jump in level at the break, in the series' units;
    ``slope``: δ̃_t, the estimated slope per period.
    """

    statistic: float
    position: int
    lags: int
    nobs: int
    shift: float
    slope: float
    positions: np.ndarray
    statistics: np.ndarray
    lags_by_candidate: np.ndarray

    @property
    def first_new(self) -> int:
        return self.position + 1


def candidate_positions(length: int, trim: float = TRIM) -> np.ndarray:
    """0-based TB searched: round(trim·T) … T − round(trim·T) − 1 (1-based: round(trim·T) + 1
    … T − round(trim·T), as Lee & Strazicich), at least two observations after the break."""
    cut = round(length * trim)
    first = max(cut, 1)
    last = min(length - cut - 1, length - 3)
    if length < 10 or last < first:
        raise UntestableSeries("the series is too short to search for a break")
    return np.arange(first, last + 1)


def _fit(x: np.ndarray, positions: np.ndarray, k: int) -> tuple[np.ndarray, np.ndarray]:
    """(τ̃, t ratio of the last lag) for every candidate with k lags, rows r = k … T−2 of Δy
    less the impulse's row (the cross products from sums: :func:`candidate_moments`)."""
    c = positions.shape[0]
    m = 2 + k
    n = x.shape[0] - 1 - k
    gram, cross, yy = candidate_moments(x, positions, k)
    scale = np.sqrt(np.einsum("cii->ci", gram))
    scale = np.where(scale > 0, scale, 1.0)
    inverse = np.linalg.inv(gram / scale[:, :, None] / scale[:, None, :]) / scale[:, :, None] / scale[:, None, :]
    beta = np.einsum("cij,cj->ci", inverse, cross)
    rss = yy - np.einsum("ci,ci->c", beta, cross)
    df = n - m - (positions >= k).astype(float)
    sigma2 = np.maximum(rss, 0.0) / df
    with np.errstate(invalid="ignore", divide="ignore"):
        tau = beta[:, 1] / np.sqrt(sigma2 * inverse[:, 1, 1])
        last = beta[:, m - 1] / np.sqrt(sigma2 * inverse[:, m - 1, m - 1]) if k > 0 else np.zeros(c)
    return tau, last


def lm_profile(x: np.ndarray, positions: np.ndarray, max_lags: int,
               fixed: bool = False) -> tuple[np.ndarray, np.ndarray]:
    """τ̃ and the lag order used at every candidate TB in ``positions``.

    ``fixed``: use ``max_lags`` lags everywhere; otherwise general-to-specific from
    ``max_lags`` down, candidate by candidate.
    """
    x = np.asarray(x, dtype=float)
    dx_raw = np.diff(x)
    spread = float(np.std(dx_raw))
    if not np.isfinite(spread) or spread <= 0:
        raise UntestableSeries("the series does not change, so it cannot be tested for a break")
    x = (x - x[0]) / spread  # τ̃ does not depend on the level or the scale
    if x.shape[0] - 1 - max_lags - (max_lags + 2) < 4:
        raise UntestableSeries(f"too few observations ({x.shape[0]}) for the break test with {max_lags} lags")
    stats = np.full(positions.shape[0], np.nan)
    chosen = np.full(positions.shape[0], -1)
    open_ = np.ones(positions.shape[0], dtype=bool)
    for k in ([max_lags] if fixed else range(max_lags, -1, -1)):
        tau, last = _fit(x, positions[open_], k)
        keep = np.ones(tau.shape[0], dtype=bool) if (fixed or k == 0) else np.abs(last) > LAG_T
        where = np.flatnonzero(open_)[keep]
        stats[where] = tau[keep]
        chosen[where] = k
        open_[where] = False
        if not open_.any():
            break
    return stats, chosen


def lm_break(x: np.ndarray, max_lags: int | None = None, lags: int | None = None,
             trim: float = TRIM) -> LMBreakSearch:
    """Search every candidate break and return the minimum τ̃ (Lee & Strazicich 2013).

    ``lags``: a fixed lag order; None: general-to-specific from ``max_lags``
    (default :data:`MAX_LAGS`, cut so the regression keeps enough observations).
    """
    x = np.asarray(x, dtype=float)
    if x.ndim != 1 or not np.all(np.isfinite(x)):
        raise UntestableSeries("the break test needs a finite series")
    positions = candidate_positions(x.shape[0], trim)
    top = MAX_LAGS if max_lags is None else int(max_lags)
    top = int(lags) if lags is not None else max(0, min(top, (x.shape[0] - 12) // 3))
    statistics, used = lm_profile(x, positions, top, fixed=lags is not None)
    if not np.all(np.isfinite(statistics)):
        raise UntestableSeries("the break regressions could not be computed (terms linearly dependent)")
    best = int(np.argmin(statistics))
    slope, jump = detrending(x, positions[best:best + 1])
    k = int(used[best])
    return LMBreakSearch(
        statistic=float(statistics[best]), position=int(positions[best]), lags=k,
        nobs=int(x.shape[0] - 2 - k), shift=float(jump[0]), slope=float(slope[0]),
        positions=positions, statistics=statistics, lags_by_candidate=used,
    )


def lm_statistic_no_lags(paths: np.ndarray, positions: np.ndarray) -> np.ndarray:
    """τ̃ without lags for many series at once, shape (series, candidates), from prefix
    sums (the same numbers as :func:`lm_profile` with no lags, in O(series × T)).

    With w_r = y_r − y_0, a = δ̃_t, b = δ̃_D and rows r = 0 … T−2 except r = TB (the
    impulse's row), the regressor is s_r = w_r − r a − 1(r > TB) b and the response Δy_r;
    every sum the regression on [1, s] needs is a full sum less the row TB, or a sum over
    r > TB taken from a reversed cumulative sum.
    """
    y = np.asarray(paths, dtype=float)
    length = y.shape[1]
    dx = np.diff(y, axis=1)
    w = (y - y[:, :1])[:, :-1]  # w_r for r = 0 … T−2
    r = np.arange(length - 1, dtype=float)
    p = positions
    n = length - 2
    slope = (dx.sum(axis=1)[:, None] - dx[:, p]) / n
    jump = dx[:, p] - slope

    def after(values: np.ndarray) -> np.ndarray:  # Σ_{r > TB} values_r for every candidate
        tail = np.cumsum(values[..., ::-1], axis=-1)[..., ::-1]
        padded = np.concatenate([tail, np.zeros((*values.shape[:-1], 1))], axis=-1)
        return padded[..., p + 1]

    wp, dp, rp = w[:, p], dx[:, p], r[p]
    count_after = (length - 2 - p).astype(float)
    sum_r, sum_r2 = r.sum() - rp, (r * r).sum() - rp * rp
    sum_s = (w.sum(axis=1)[:, None] - wp) - slope * sum_r - jump * count_after
    sum_s2 = ((w * w).sum(axis=1)[:, None] - wp * wp) + slope ** 2 * sum_r2 + jump ** 2 * count_after \
        - 2 * slope * ((w * r).sum(axis=1)[:, None] - rp * wp) - 2 * jump * after(w) \
        + 2 * slope * jump * after(r)
    sum_sy = ((w * dx).sum(axis=1)[:, None] - wp * dp) - slope * ((r * dx).sum(axis=1)[:, None] - rp * dp) \
        - jump * after(dx)
    sum_y = dx.sum(axis=1)[:, None] - dp
    sum_y2 = (dx * dx).sum(axis=1)[:, None] - dp * dp
    sxx = sum_s2 - sum_s * sum_s / n
    sxy = sum_sy - sum_s * sum_y / n
    syy = sum_y2 - sum_y * sum_y / n
    phi = sxy / sxx
    sigma2 = (syy - phi * sxy) / (n - 2)
    return np.asarray(phi / np.sqrt(sigma2 / sxx))
