"""Fixed seasonal means: the test that finds them and their removal before the
zero-frequency unit-root tests.

**The test.** In the augmented Dickey-Fuller regression with a constant and
seasonal dummies,

    Δy_t = c + Σ_{s=1..S−1} δ_s (D_{s,t} − D_{S,t}) + γ y_{t−1}
           + Σ_{i=1..p} φ_i Δy_{t−i} + e_t,

the seasonal effects are tested with the usual F statistic of δ_1 = … = δ_{S−1} = 0
against F(S − 1, m − k).  The centred dummies are stationary regressors with mean
zero, so the F statistic has its usual χ²(S − 1)/(S − 1) limit whether γ = 0 (a unit
root) or γ < 0 (stationary): Sims, Stock & Watson (1990), *Econometrica* 58, on
coefficients of stationary regressors in regressions with integrated ones; the
regression itself is that of Dickey, Bell & Miller (1986), *The American
Statistician* 40.  p is chosen by AIC among 0 … ⌊4 (T/100)^{1/4}⌋ (Schwert's 1989
short rule) on the common sample, with the dummies in, so that the lags cannot
stand in for the seasonal means (the problem the test is there for: with lags up to
S, AIC lets Δy_{t−S} absorb fixed seasonal means and the unit-root test loses its
power).  A pattern is "found" at :data:`FIND_LEVEL` (1%): dummies cost S − 1 degrees
of freedom, so they are added on clear evidence only.

**The removal.** Each series (or each difference Δ^d y) is regressed by OLS on
[1, t, S − 1 seasonal contrasts] and the contrasts' fitted part is subtracted:

    ỹ_t = y_t − Σ_s δ̂_s (D_{s,t} − D_{S,t}).

The level and the trend stay, so every later test keeps its own deterministic
terms.  Under a unit root, the seasonal means of the levels are estimated with an
error of order T^{−1/2} (the difference of two seasons' means averages independent
within-year increments), and under stationarity they are consistent, so removing
them first gives the zero-frequency statistics the limits they have with seasonal
dummies in the regression, which are those without dummies (Dickey, Bell & Miller
1986).  In finite samples the statistics move slightly: the union of rejections
simulates its constants with the same removal at the series' own length
(:mod:`tauscope.engine.unitroot.union`); the measured size of the classic sequence's
τ with the published values is in DEVELOPERS.md.

Pure numpy over rows; one series alone gets the same bits as in a batch (einsum).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from scipy.special import fdtrc

PERIODS = (4, 12)
FIND_LEVEL = 0.01  # a seasonal pattern is "found" when the F test's p-value is below this


def contrasts(n: int, period: int, first_season: int = 0) -> np.ndarray:
    """(n, S − 1) centred seasonal dummies D_s − D_S, s = 1 … S − 1, in the calendar's
    seasons (``first_season`` is the season of the first value, 0-based)."""
    season = (np.arange(n) + first_season) % period
    dummies = (season[:, None] == np.arange(period)[None, :]).astype(float)
    return dummies[:, :-1] - dummies[:, [-1]]


def _trend_and_contrasts(n: int, period: int, first_season: int) -> tuple[np.ndarray, np.ndarray]:
    """([1, (t − t̄)/n, contrasts], the contrasts): the regression the seasonal means are
    estimated from."""
    c = contrasts(n, period, first_season)
    t = np.arange(n, dtype=float)
    return np.column_stack([np.ones(n), (t - t.mean()) / n, c]), c


def remove_seasonal_means(xs: np.ndarray, period: int, first_season: int = 0) -> np.ndarray:
    """Every row of ``xs`` (R, n) minus the fitted seasonal contrasts of its OLS regression
    on [1, t, contrasts]; a 1-D array gives a 1-D array."""
    values = np.asarray(xs, dtype=float)
    rows = np.atleast_2d(values)
    design, c = _trend_and_contrasts(rows.shape[1], period, first_season)
    coef = np.einsum("rn,kn->rk", rows, np.linalg.pinv(design))
    out = rows - np.einsum("rk,nk->rn", coef[:, 2:], c)
    return out[0] if values.ndim == 1 else out


@dataclass(frozen=True)
class SeasonalMeansFit:
    """The F test of the seasonal dummies and the estimated seasonal effects."""

    statistic: float
    p_value: float
    df_num: int
    df_den: int
    lags: int
    effects: tuple[float, ...]  # season s's mean minus the average over seasons, s = 0 … S − 1

    @property
    def found(self) -> bool:
        return bool(self.p_value < FIND_LEVEL)


def _short_max_lags(n: int) -> int:
    return math.floor(4.0 * (n / 100.0) ** 0.25)


def _ols(y: np.ndarray, x: np.ndarray) -> tuple[np.ndarray, float]:
    coef, *_ = np.linalg.lstsq(x, y, rcond=None)
    resid = y - x @ coef
    return coef, float(resid @ resid)


def seasonal_means_test(x: np.ndarray, period: int, first_season: int = 0) -> SeasonalMeansFit | None:
    """The F test of the module docstring on one series; None when the series is too
    short for it (fewer than 3 S + 10 values) or the regression cannot be solved."""
    if period not in PERIODS:
        raise ValueError(f"seasonal means are tested for quarterly (4) or monthly (12) series, not {period}")
    y = np.asarray(x, dtype=float)
    n = y.size
    if n < 3 * period + 10 or not np.all(np.isfinite(y)):
        return None
    dy = np.diff(y)
    c = contrasts(n, period, first_season)[1:]  # season of Δy_t is that of y_t
    p_max = max(0, min(_short_max_lags(n), (n - 3 * period - 10) // 2))
    first = p_max  # common sample: rows t = p_max … n − 2 of Δy
    rows = np.arange(first, dy.size)

    def design(p: int, start: int) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        r = np.arange(start, dy.size)
        lagged = [dy[r - i] for i in range(1, p + 1)]
        base = np.column_stack([np.ones(r.size), y[r], *lagged]) if lagged else np.column_stack(
            [np.ones(r.size), y[r]])
        return dy[r], base, c[r]

    best, best_ic = 0, np.inf
    with np.errstate(all="ignore"):
        # Every lag order's RSS on the common sample from one QR of the nested designs
        # [1, y_{t−1}, contrasts, Δy_{t−1} … Δy_{t−p_max}, Δy_t] (column order does not
        # change an RSS): RSS_p = Σ_{i ≥ 1 + S + p} R_{iK}² (Golub & Van Loan 2013, §5.3).
        target, base, dummies = design(p_max, first)
        r = np.asarray(np.linalg.qr(np.column_stack([base[:, :2], dummies, base[:, 2:], target]),
                                    mode="r"))
        all_rss = np.cumsum((r[1 + period:, -1] ** 2)[::-1])[::-1]
        for p in range(p_max + 1):
            rss = float(all_rss[p])
            k = 2 + p + dummies.shape[1]
            ic = math.log(max(rss, 1e-300) / rows.size) + 2.0 * k / rows.size
            if ic < best_ic - 1e-12:
                best, best_ic = p, ic
        target, base, dummies = design(best, best)
        _, rss_u = _ols(target, np.column_stack([base, dummies]))
        _, rss_r = _ols(target, base)
    df_num = period - 1
    df_den = target.size - base.shape[1] - dummies.shape[1]
    if df_den < 1 or not rss_u > 0.0 or not np.isfinite(rss_r):
        return None
    f = ((rss_r - rss_u) / df_num) / (rss_u / df_den)
    p_value = float(fdtrc(df_num, df_den, f))  # the function scipy.stats.f.sf calls: same value
    return SeasonalMeansFit(float(f), p_value, df_num, df_den, best, seasonal_effects(y, period, first_season))


def seasonal_effects(x: np.ndarray, period: int, first_season: int = 0) -> tuple[float, ...]:
    """Each calendar season's fixed effect (S values summing to zero, season 0 first: the
    first quarter or January), from the OLS regression of y on [1, t, contrasts]."""
    y = np.asarray(x, dtype=float)
    design, _ = _trend_and_contrasts(y.size, period, first_season)
    coef, _ = _ols(y, design)
    delta = coef[2:]
    effects = np.append(delta, -delta.sum())
    return tuple(float(v) for v in effects)


def seasonal_means_tests(xs: np.ndarray, period: int,
                         first_season: int = 0) -> list[SeasonalMeansFit | None]:
    """:func:`seasonal_means_test` for every row of ``xs`` (R, n; one length and first
    season), the same numbers to rounding: each row's lag search from one QR of its nested
    designs, the QRs stacked; the F statistic of the chosen lag order from one QR of
    [1, y_{t−1}, Δy lags, contrasts, Δy_t] (the contrasts' rows of R hold RSS_r − RSS_u,
    Golub & Van Loan 2013, §5.3), the rows of one lag order stacked; the effects from one
    least-squares solve for all rows.  Rows with a gap get None, as alone."""
    if period not in PERIODS:
        raise ValueError(f"seasonal means are tested for quarterly (4) or monthly (12) series, not {period}")
    ys = np.atleast_2d(np.asarray(xs, dtype=float))
    count, n = ys.shape
    out: list[SeasonalMeansFit | None] = [None] * count
    if n < 3 * period + 10:
        return out
    keep = np.flatnonzero(np.isfinite(ys).all(axis=1))
    if keep.size == 0:
        return out
    y = ys[keep]
    dy = np.diff(y, axis=1)
    c = contrasts(n, period, first_season)[1:]
    p_max = max(0, min(_short_max_lags(n), (n - 3 * period - 10) // 2))

    def design(p: int, start: int, rows: np.ndarray) -> np.ndarray:
        """[1, y_{t−1}, contrasts, Δy_{t−1} … Δy_{t−p}, Δy_t] for rows t = start … (B, m, ·)."""
        r = np.arange(start, dy.shape[1])
        out = np.empty((rows.size, r.size, period + p + 2))  # filled column by column
        out[:, :, 0] = 1.0
        out[:, :, 1] = y[rows][:, r]
        out[:, :, 2:1 + period] = c[r][None, :, :]
        dy_rows = dy[rows]
        out[:, :, 1 + period:1 + period + p] = dy_rows[:, r[:, None] - np.arange(1, p + 1)[None, :]]
        out[:, :, -1] = dy_rows[:, r]
        return out

    every = np.arange(keep.size)
    m = dy.shape[1] - p_max
    with np.errstate(all="ignore"):
        r = np.asarray(np.linalg.qr(design(p_max, p_max, every), mode="r"))
        all_rss = np.cumsum((r[:, 1 + period:, -1] ** 2)[:, ::-1], axis=1)[:, ::-1]
        best = np.zeros(keep.size, dtype=int)
        best_ic = np.full(keep.size, np.inf)
        for p in range(p_max + 1):
            k = 2 + p + period - 1
            ic = np.log(np.maximum(all_rss[:, p], 1e-300) / m) + 2.0 * k / m
            better = ic < best_ic - 1e-12
            best[better], best_ic[better] = p, ic[better]
        effects = _effects_many(y, period, first_season)
        df_num = period - 1
        for p in np.unique(best):
            members = np.flatnonzero(best == p)
            full = design(int(p), int(p), members)
            # contrasts last among the regressors: [1, y, lags, contrasts, Δy_t]
            order = [0, 1, *range(1 + period, 1 + period + int(p)), *range(2, 1 + period), full.shape[2] - 1]
            rr = np.asarray(np.linalg.qr(full[:, :, order], mode="r"))
            rss_u = rr[:, -1, -1] ** 2
            gain = np.sum(rr[:, 2 + int(p):-1, -1] ** 2, axis=1)  # RSS_r − RSS_u
            df_den = full.shape[1] - (full.shape[2] - 1)
            if df_den < 1:
                continue
            f = (gain / df_num) / (rss_u / df_den)
            p_values = fdtrc(df_num, df_den, f)
            for j, member in enumerate(members):
                if not (rss_u[j] > 0.0 and np.isfinite(rss_u[j] + gain[j])):
                    continue  # None, as alone
                out[int(keep[member])] = SeasonalMeansFit(
                    float(f[j]), float(p_values[j]), df_num, df_den, int(p),
                    tuple(float(v) for v in effects[member]))
    return out


def _effects_many(y: np.ndarray, period: int, first_season: int) -> np.ndarray:
    """:func:`seasonal_effects` of every row (R, S): one product with the design's
    pseudo-inverse (as :func:`remove_seasonal_means` does)."""
    design, _ = _trend_and_contrasts(y.shape[1], period, first_season)
    delta = np.einsum("rn,kn->rk", y, np.linalg.pinv(design)[2:])
    return np.concatenate([delta, -delta.sum(axis=1, keepdims=True)], axis=1)
