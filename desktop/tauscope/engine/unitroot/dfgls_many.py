"""DF-GLS for many series of one length at once (rows of a 2-D array).

The same statistic as :func:`tauscope.engine.unitroot.dfgls.dfgls` (Elliott, Rothenberg &
Stock 1996, "Efficient Tests for an Autoregressive Unit Root", Econometrica 64(4)),
vectorised over series:

1. GLS detrending with ᾱ = 1 + c̄/T (c̄ = −7 constant, −13.5 trend): the projection
   β̂ = pinv(z^ᾱ) y^ᾱ is one fixed matrix for every series of length T, so
   ỹ = y − z β̂ is two matrix products for the whole batch.
2. Lag order on the OLS-detrended series (Perron, P. & Qu, Z. 2007, Economics
   Letters 94) on the common sample of the largest lag (Ng & Perron 1995): MAIC
   (Ng, S. & Perron, P. 2001, Econometrica 69), MAIC(k) = ln σ̂²_k + 2(τ_T(k) + k)/N,
   τ_T(k) = γ̂_k² Σ ỹ²_{t−1} / σ̂²_k; or AIC, BIC, HQC as −2 ln L + c·(k + 1).
   Every lag order's fit comes from the leading block of one set of cross products.
3. Δỹ_t = γ ỹ_{t−1} + Σ_{i≤p} β_i Δỹ_{t−i} + e_t on the longest sample for the
   chosen p; the statistic is t(γ̂), with s² = RSS/(n − p − 1).

Pure functions over numpy arrays; nothing here raises for a single bad row: a row
whose regression cannot be solved gets NaN.
"""

from __future__ import annotations

import math
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.simulate import CrossProducts, solve_moments
from tauscope.engine.unitroot.dfgls import C_BAR, choose_dfgls_lag, deterministic_columns

GLS_SPECS = ("constant", "trend")
_PENALTY = {"aic": lambda n: 2.0, "bic": math.log, "hqc": lambda n: 2.0 * math.log(math.log(n))}
VECTOR_RULES = ("maic", "aic", "bic", "hqc")


def gls_detrend_many(xs: np.ndarray, spec: str) -> np.ndarray:
    """ỹ = y − z β̂, β̂ from the regression of y^ᾱ on z^ᾱ, for every row of ``xs``."""
    length = xs.shape[1]
    abar = 1.0 + C_BAR[spec] / length
    z, projection = _gls_projection(spec, length)
    yq = xs.copy()
    yq[:, 1:] = xs[:, 1:] - abar * xs[:, :-1]
    # einsum, not @: each row's sums must not depend on how many rows share the call, so
    # a series alone gets the same bits as in a batch.
    beta = np.einsum("rn,kn->rk", yq, projection)
    return np.asarray(xs - np.einsum("rk,nk->rn", beta, z))


@lru_cache(maxsize=64)
def _gls_projection(spec: str, length: int) -> tuple[np.ndarray, np.ndarray]:
    """z and pinv(z^ᾱ) at this length (the same for every series; read-only)."""
    abar = 1.0 + C_BAR[spec] / length
    z = deterministic_columns(spec, length)
    zq = z.copy()
    zq[1:] = z[1:] - abar * z[:-1]
    projection = np.linalg.pinv(zq)
    z.setflags(write=False)
    projection.setflags(write=False)
    return z, projection


def ols_detrend_many(xs: np.ndarray, spec: str) -> np.ndarray:
    """OLS residuals of every row on [1] (constant) or [1, t] (trend)."""
    q = _ols_basis(spec, xs.shape[1])
    return np.asarray(xs - np.einsum("rk,nk->rn", np.einsum("rn,nk->rk", xs, q), q))


@lru_cache(maxsize=64)
def _ols_basis(spec: str, length: int) -> np.ndarray:
    """Q of the QR factorisation of [1] or [1, t] at this length (read-only)."""
    q, _ = np.linalg.qr(deterministic_columns(spec, length))
    q.setflags(write=False)
    return q


def _columns(levels: np.ndarray, lags: int, first: int) -> tuple[np.ndarray, list[np.ndarray]]:
    """Response Δy_t and regressors [y_{t−1}, Δy_{t−1}, …, Δy_{t−lags}] from row ``first``
    of Δy on (views), as in :func:`tauscope.engine.design.adf_design` with spec "none"."""
    dy = np.diff(levels, axis=1)
    end = dy.shape[1]
    columns = [levels[:, first:end]] + [dy[:, first - i:end - i] for i in range(1, lags + 1)]
    return dy[:, first:], columns


def stacked_moments(columns: list[np.ndarray], y: np.ndarray) -> CrossProducts:
    """Z'Z, Z'y and y'y of every row, the regressors stacked into one (r, m, n) array so
    that each row's products are one matrix product (BLAS); each row's numbers depend on
    that row alone, so a series gets the same bits alone as in a batch."""
    z = np.stack(columns, axis=1)
    return CrossProducts(np.matmul(z, z.transpose(0, 2, 1)), np.matmul(z, y[:, :, None])[:, :, 0],
                         np.einsum("rn,rn->r", y, y))


def lag_criteria_many(detrended: np.ndarray, rule: str, max_lags: int) -> np.ndarray:
    """The rule's criterion for lag orders 0 … max_lags, one row per series (r, max_lags + 1),
    on the common sample of ``max_lags`` (the regression without deterministic terms).

    Every lag order's fit comes from one Cholesky factor Z'Z = LL' of the largest
    regression: with w = L⁻¹Z'y, the fit on the first k + 1 regressors has
    RSS_k = y'y − Σ_{j≤k} w_j² and γ̂_k = Σ_{j≤k} (L⁻¹)_{j0} w_j (the leading blocks of L
    and L⁻¹ are those of the smaller regression).  A row whose Z'Z is not positive
    definite is solved lag order by lag order instead."""
    y, columns = _columns(detrended, max_lags, max_lags)
    n = y.shape[1]
    full = stacked_moments(columns, y)
    try:
        rss, gamma = _nested_fits(full)
    except np.linalg.LinAlgError:
        rss, gamma = np.empty((y.shape[0], max_lags + 1)), np.empty((y.shape[0], max_lags + 1))
        for row in range(y.shape[0]):
            one = CrossProducts(full.zz[row:row + 1], full.zy[row:row + 1], full.yy[row:row + 1])
            try:
                rss[row], gamma[row] = (v[0] for v in _nested_fits(one))
            except np.linalg.LinAlgError:
                rss[row], gamma[row] = (v[0] for v in _fits_one_by_one(one))
    level_ss = full.zz[:, 0, 0][:, None]
    orders = np.arange(max_lags + 1)
    with np.errstate(divide="ignore", invalid="ignore"):
        sigma2 = rss / n
        if rule == "maic":
            return np.asarray(np.log(sigma2) + 2.0 * (gamma ** 2 * level_ss / sigma2 + orders) / n)
        log_likelihood = -n / 2.0 * (math.log(2.0 * math.pi) + np.log(sigma2) + 1.0)
        return np.asarray(-2.0 * log_likelihood + _PENALTY[rule](n) * (orders + 1))


def _nested_fits(moments: CrossProducts) -> tuple[np.ndarray, np.ndarray]:
    """(RSS, γ̂) for the first 1, 2, … m regressors of every row, from one Cholesky factor
    (raises LinAlgError when a row's Z'Z is not positive definite)."""
    lower = np.linalg.cholesky(moments.zz)
    inverse = np.linalg.inv(lower)
    w = np.matmul(inverse, moments.zy[:, :, None])[:, :, 0]
    rss = moments.yy[:, None] - np.cumsum(w * w, axis=1)
    return rss, np.cumsum(inverse[:, :, 0] * w, axis=1)


def _fits_one_by_one(moments: CrossProducts) -> tuple[np.ndarray, np.ndarray]:
    """(RSS, γ̂) for the first 1, 2, … m regressors, each solved on its own."""
    m = moments.zy.shape[1]
    rss, gamma = np.empty((moments.yy.shape[0], m)), np.empty((moments.yy.shape[0], m))
    with np.errstate(divide="ignore", invalid="ignore"):
        for k in range(m):
            beta, rss[:, k], _ = solve_moments(moments.subset(slice(0, k + 1)))
            gamma[:, k] = beta[:, 0]
    return rss, gamma


def choose_lags_many(xs: np.ndarray, spec: str, rule: str, max_lags: int,
                     fixed: int | None = None, min_lag: int = 0) -> np.ndarray:
    """Lag order per row, chosen on the OLS-detrended series (Perron & Qu 2007); ties go
    to the shorter lag.  ``rule`` "fixed" uses ``fixed``; "tsig" asks the one-series
    rule of :mod:`tauscope.engine.unitroot.dfgls` row by row.  The choice is among
    ``min(min_lag, max_lags)`` … ``max_lags``."""
    return choose_lags_detrended(xs, None, spec, rule, max_lags, fixed, min_lag)


def choose_lags_detrended(xs: np.ndarray, ols: np.ndarray | None, spec: str, rule: str,
                          max_lags: int, fixed: int | None = None, min_lag: int = 0) -> np.ndarray:
    """:func:`choose_lags_many` given ``ols``, the rows of ``xs`` OLS-detrended with
    ``spec`` (:func:`ols_detrend_many`; None: detrended here), so that a caller that
    needs them anyway detrends once."""
    rows = xs.shape[0]
    if rule == "fixed":
        return np.full(rows, int(fixed or 0))
    floor = min(int(min_lag), max_lags)
    if max_lags == 0 or floor == max_lags:
        return np.full(rows, max_lags, dtype=int)
    if rule in VECTOR_RULES:
        values = lag_criteria_many(ols_detrend_many(xs, spec) if ols is None else ols, rule, max_lags)
        return _smallest(values, floor)
    return np.array([max(floor, choose_dfgls_lag(row, spec, rule, max_lags)) for row in xs])


def choose_lags_stacked(ols: list[np.ndarray], rule: str, max_lags: int, min_lag: int = 0) -> list[np.ndarray]:
    """:func:`choose_lags_detrended` with a vector ``rule`` (:data:`VECTOR_RULES`) for several
    arrays of OLS-detrended rows of one length (one per deterministic case) in one call of
    :func:`lag_criteria_many`: every row's criteria depend on that row alone, so the lag
    orders are those of one call per array."""
    if rule not in VECTOR_RULES:
        raise ValueError(f"{rule!r} is not a rule computed for many rows at once")
    floor = min(int(min_lag), max_lags)
    if max_lags == 0 or floor == max_lags:
        return [np.full(o.shape[0], max_lags, dtype=int) for o in ols]
    chosen = _smallest(lag_criteria_many(np.vstack(ols), rule, max_lags), floor)
    return np.split(chosen, np.cumsum([o.shape[0] for o in ols])[:-1])


def _smallest(values: np.ndarray, floor: int) -> np.ndarray:
    """The lag order of the smallest finite criterion from ``floor`` on (ties: the shorter)."""
    values = np.where(np.isfinite(values), values, np.inf)
    values[:, :floor] = np.inf
    return np.asarray(np.argmin(values, axis=1))


def dfgls_tau_many(detrended: np.ndarray, lags: np.ndarray) -> np.ndarray:
    """t(γ̂) of the DF-GLS regression for each row of GLS-detrended series, with the row's
    own lag order, on the longest sample for that order (NaN if it cannot be solved)."""
    tau = np.full(detrended.shape[0], np.nan)
    length = detrended.shape[1]
    for lag in np.unique(lags):
        k = int(lag)
        rows = np.flatnonzero(lags == k)
        y, columns = _columns(detrended[rows], k, k)
        df = (length - 1 - k) - (k + 1)
        if df < 1:
            continue
        with np.errstate(divide="ignore", invalid="ignore"):
            beta, rss, inv_diag = solve_rows(stacked_moments(columns, y))
            tau[rows] = beta[:, 0] / np.sqrt(rss / df * inv_diag[:, 0])
    return tau


def solve_rows(moments: CrossProducts) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """:func:`solve_moments` for every row; when one row's Z'Z is singular (an exact fit),
    the rows are solved one by one and that row alone gets NaN, so a row's result never
    depends on which other rows share its batch."""
    try:
        return solve_moments(moments)
    except np.linalg.LinAlgError:
        pass
    rows, m = moments.zy.shape
    beta, rss, inv_diag = np.full((rows, m), np.nan), np.full(rows, np.nan), np.full((rows, m), np.nan)
    for r in range(rows):
        try:
            b, s, d = solve_moments(CrossProducts(moments.zz[r:r + 1], moments.zy[r:r + 1], moments.yy[r:r + 1]))
        except np.linalg.LinAlgError:
            continue
        beta[r], rss[r], inv_diag[r] = b[0], s[0], d[0]
    return beta, rss, inv_diag


def dfgls_many(xs: np.ndarray, spec: str, rule: str = "maic", max_lags: int = 0,
               fixed: int | None = None, min_lag: int = 0) -> tuple[np.ndarray, np.ndarray]:
    """(τ^GLS, lag order) for every row of ``xs`` (series of one length)."""
    xs = np.asarray(xs, dtype=float)
    lags = choose_lags_many(xs, spec, rule, max_lags, fixed, min_lag)
    return dfgls_tau_many(gls_detrend_many(xs, spec), lags), lags
