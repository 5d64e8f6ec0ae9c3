"""Nested least squares: every lag length from one QR factorisation, many series at once.

Same numbers as the reference path (one statsmodels OLS per regression:
:mod:`tauscope.engine.reference`); the tests check equality to 1e-8.

Nested models.  Order the regressors of one specification as

    [deterministic terms, y(t−1), Δy(t−1), …, Δy(t−p)]  (+ the terms it leaves out, last)

so that the model with k lags uses the leading m = k_det + 1 + k columns.  The QR
factorisation of the augmented design [X | y] on the common sample of p lags
(Ng & Perron 1995 compare lag orders there) is the upper-triangular
A = [[R, c], [0, e]], c = Qᵀy, and for every leading block of m columns
(Golub, G.H. & Van Loan, C.F. 2013, Matrix Computations, 4th ed., §5.3):

* RSS_m = e² + Σ_{j≥m} c_j²;
* b^(m) = R_m⁻¹ c_m, and R_m⁻¹ is the leading block of R⁻¹, so each coefficient of
  each block is a prefix sum b_i^(m) = Σ_{j<m} (R⁻¹)_ij c_j;
* Var b_i^(m) = σ̂²_m Σ_{j<m} (R⁻¹)_ij², σ̂²_m = RSS_m / (N − m).

Hence AIC/BIC/HQC (the formula of :meth:`tauscope.engine.regression.ols.OLSFit.criterion`),
the last lag's t (general-to-specific), and γ̂ with the sums MAIC needs, for all
lag orders at once.  Columns that a block leaves out (the zero-filled lags before
the start of the series, the terms a specification drops) never touch its numbers.

One factorisation per difference level: the trend specification's design is
factorised on the common sample; the constant-only and no-deterministic
specifications are the QR of that A with its columns permuted (the dropped terms
moved last), a (K+1)×(K+1) matrix.  The chosen lag's longest sample adds the rows
k…p−1: its factorisation is the QR of [A; those rows] (row updating, Golub & Van
Loan §6.5), about 2K rows instead of T.  Each Φ restricted regression's RSS (Dickey &
Fuller 1981) follows from that fit by the Wald identity (:func:`restricted_rss`).
τ for every lag on its own longest sample (the lag profile) comes from one more
factorisation with row indicators (see :func:`profile_tau`).  Everything works on
a batch of series of one length at once.

The batches, the decision to hand a series to the reference path and the result
objects are in :mod:`tauscope.engine.procedure.fast_path`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.regression.design import DETERMINISTIC_TERMS
from tauscope.engine.regression.lagchoice import TSIG_CRITICAL

# Columns of the full design: 0 constant, 1 trend, 2 y(t−1), 3… Δy(t−1…p), then y.
Y_LAG = 2
PHI_SPEC = {"phi1": "constant", "phi2": "trend", "phi3": "trend"}
PHI_KEPT_TERMS = {"phi1": 0, "phi2": 0, "phi3": 1}  # deterministic terms the restriction keeps
PHI_NAMES = ("phi1", "phi2", "phi3")
_LOG_2PI = math.log(2.0 * math.pi)


def spec_order(spec: str, p: int) -> list[int]:
    """Full-design columns in the order of ``spec``: its terms, y(t−1), the lags, the rest."""
    terms = {"trend": [0, 1], "constant": [0], "none": []}[spec]
    dropped = [c for c in (0, 1) if c not in terms]
    return [*terms, *range(Y_LAG, Y_LAG + 1 + p), *dropped]


def full_design(xs: np.ndarray, p: int, centres: np.ndarray | None = None) -> np.ndarray:
    """Every row of Δy with the regressors and y last: shape (B, T−1, p + 4).

    Row r is Δy_{r+1} (r counts the differences from 0); lags that fall before the
    start are zero, and only models with at most r lags ever use row r.  The trend
    is r + 1, as in :func:`tauscope.engine.regression.design.adf_design`.  With
    ``centres`` (B,), y(t−1) is measured from them (as ``adf_design``'s ``centre``).
    """
    batch, n = xs.shape
    k = p + 3
    dx = np.diff(xs, axis=1)
    # Column by column in memory (what LAPACK reads), seen as (B, rows, columns).
    columns = np.empty((batch, k + 1, n - 1))
    columns[:, 0, :] = 1.0
    columns[:, 1, :] = np.arange(1, n, dtype=float)
    columns[:, Y_LAG, :] = xs[:, :-1] if centres is None else xs[:, :-1] - centres[:, None]
    for i in range(1, p + 1):
        columns[:, Y_LAG + i, :i] = 0.0
        columns[:, Y_LAG + i, i:] = dx[:, :-i]
    columns[:, k, :] = dx
    return columns.transpose(0, 2, 1)


def r_factor(rows: np.ndarray) -> np.ndarray:
    """The (W+1)×(W+1) R factor of a batch of augmented designs (B, M, W+1), M ≥ W+1."""
    return np.asarray(np.linalg.qr(rows, mode="r"))


def upper_inverse(r: np.ndarray) -> np.ndarray:
    """Inverse of a batch of upper-triangular matrices (B, W, W) by back substitution,
    one row at a time for the whole batch: (R⁻¹)_ii = 1/R_ii and, for j > i,
    (R⁻¹)_ij = −(Σ_{i<l≤j} R_il (R⁻¹)_lj) / R_ii.  (LAPACK's general inverse spends
    most of its time on call overhead for matrices this small.)"""
    width = r.shape[1]
    inverse = np.zeros_like(r)
    inv_diag = 1.0 / np.diagonal(r, axis1=1, axis2=2)
    for i in range(width - 1, -1, -1):
        inverse[:, i, i] = inv_diag[:, i]
        if i < width - 1:
            inverse[:, i, i + 1:] = -np.matmul(
                r[:, i:i + 1, i + 1:], inverse[:, i + 1:, i + 1:]
            )[:, 0, :] * inv_diag[:, i, None]
    return inverse


def _leading(width: int, m: np.ndarray) -> np.ndarray:
    """(B, W) mask of the leading m[b] columns."""
    return np.arange(width)[None, :] < m[:, None]


@dataclass(frozen=True)
class BlockFits:
    """Every lag length 0…p on the common sample, for a batch (arrays (B, p+1))."""

    rss: np.ndarray
    gamma: np.ndarray
    last_t: np.ndarray  # t of the last lag's coefficient (column 0 is not a lag)
    used: np.ndarray  # number of regressors, (p+1,)


def block_fits(a: np.ndarray, n_terms: int, p: int, nobs: int) -> BlockFits:
    """RSS, γ̂ and the last lag's t of every leading block k_det + 1 + k, k = 0…p."""
    batch, width1, _ = a.shape
    width = width1 - 1
    r, c, e = a[:, :width, :width], a[:, :width, width], a[:, width, width]
    tail = np.zeros((batch, width + 1))
    tail[:, :width] = np.cumsum((c * c)[:, ::-1], axis=1)[:, ::-1]
    lags = np.arange(p + 1)
    used = n_terms + 1 + lags
    rss = e[:, None] ** 2 + tail[:, used]
    sigma2 = rss / (nobs - used)
    gamma = np.cumsum(upper_inverse(r)[:, n_terms, :] * c, axis=1)[:, used - 1]
    # The last coefficient of block m is c_{m−1}/R_{m−1,m−1} with standard error
    # σ̂_m/|R_{m−1,m−1}|, so its t is c_{m−1}·sign(R_{m−1,m−1})/σ̂_m.
    last = used - 1
    last_t = c[:, last] * np.sign(r[:, last, last]) / np.sqrt(sigma2)
    return BlockFits(rss, gamma, last_t, used)


def criterion_values(fits: BlockFits, rule: str, nobs: int) -> np.ndarray:
    """AIC/BIC/HQC of :meth:`tauscope.engine.regression.ols.OLSFit.criterion` for every lag:
    −2 ln L + c·k, ln L = −N/2 (ln 2π + ln(RSS/N) + 1), c = 2, ln N or 2 ln ln N."""
    penalty = {"aic": 2.0, "bic": math.log(nobs), "hqc": 2.0 * math.log(math.log(nobs))}[rule]
    llf = -nobs / 2.0 * (_LOG_2PI + np.log(fits.rss / nobs) + 1.0)
    return np.asarray(-2.0 * llf + penalty * fits.used)


def maic_values(fits: BlockFits, lag_sum_sq: np.ndarray, nobs: int) -> np.ndarray:
    """MAIC(k) = ln σ̂²_k + 2(τ_T(k) + k)/N, τ_T(k) = γ̂_k² Σ ỹ²_{t−1} / σ̂²_k
    (Ng & Perron 2001), σ̂²_k = RSS_k / N."""
    sigma2 = fits.rss / nobs
    tau_t = fits.gamma**2 * lag_sum_sq[:, None] / sigma2
    lags = np.arange(fits.rss.shape[1])
    return np.asarray(np.log(sigma2) + 2.0 * (tau_t + lags) / nobs)


def detrended(xs: np.ndarray, spec: str) -> np.ndarray:
    """OLS residuals on [1] or [1, t], t = 1…T, as :func:`lagchoice.detrend`, for a batch."""
    q = _trend_basis(xs.shape[1], spec)
    return np.asarray(xs - (xs @ q) @ q.T)


@lru_cache(maxsize=64)
def _trend_basis(n: int, spec: str) -> np.ndarray:
    """Q of the QR factorisation of [1] or [1, t], t = 1…n (the same for every batch; read-only)."""
    columns = [np.ones(n)]
    if spec == "trend":
        columns.append(np.arange(1, n + 1, dtype=float))
    q, _ = np.linalg.qr(np.column_stack(columns))
    q.setflags(write=False)
    return q


@dataclass(frozen=True)
class Estimates:
    """The chosen lag of each series re-estimated on its longest sample."""

    a: np.ndarray  # (B, K+1, K+1) R factor, columns in the spec's order
    r_inv: np.ndarray  # (B, K, K) the inverse of its leading K×K block
    params: np.ndarray  # (B, K); only the leading ``used`` entries are coefficients
    bse: np.ndarray  # (B, K)
    rss: np.ndarray  # (B,)
    nobs: np.ndarray  # (B,)
    used: np.ndarray  # (B,)


def longest_sample(a_common: np.ndarray, first_rows: np.ndarray, n_terms: int,
                   lags: np.ndarray, n_rows: int, centres: np.ndarray | None = None) -> Estimates:
    """Lag ``lags[b]`` on its longest sample (rows lags[b]… of n_rows), by adding the
    rows lags[b]…p−1 (``first_rows``, (B, p, K+1)) to the common-sample factor.

    ``centres``: y(t−1) entered measured from them; the constant is reported as for
    y(t−1) itself, a0 = a0* − m·γ̂ with Var a0 = Var a0* + m² Var γ̂ − 2m Cov(a0*, γ̂),
    the covariance σ̂² Σ_l (R⁻¹)_0l (R⁻¹)_γl (as OLSFit.uncentred)."""
    p = first_rows.shape[1]
    extra = first_rows * (np.arange(p)[None, :] >= lags[:, None])[:, :, None]
    a = r_factor(np.concatenate([a_common, extra], axis=1))
    width = a.shape[1] - 1
    used = n_terms + 1 + lags
    nobs = n_rows - lags
    inside = _leading(width, used)
    r_inv = upper_inverse(a[:, :width, :width])
    c = a[:, :width, width]
    params = np.einsum("bij,bj->bi", r_inv, np.where(inside, c, 0.0))
    rss = a[:, width, width] ** 2 + np.where(inside, 0.0, c * c).sum(axis=1)
    sigma2 = rss / (nobs - used)
    bse = np.sqrt(sigma2[:, None] * np.einsum("bij,bij->bi", r_inv, r_inv * inside[:, None, :]))
    if centres is not None and n_terms > 0:
        cov = sigma2 * np.einsum("bj,bj->b", r_inv[:, 0, :], r_inv[:, n_terms, :] * inside)
        params[:, 0] = params[:, 0] - centres * params[:, n_terms]
        variance = bse[:, 0] ** 2 + centres**2 * bse[:, n_terms] ** 2 - 2.0 * centres * cov
        bse[:, 0] = np.sqrt(np.maximum(variance, 0.0))
    return Estimates(a, r_inv, params, bse, rss, nobs, used)


@lru_cache(maxsize=64)
def _interleaved(n_terms: int, p: int, width: int) -> tuple[np.ndarray, np.ndarray]:
    """Column positions, in the profile matrix, of the spec-ordered columns (and y last)
    and of the row indicators D_0…D_{p−1}: [terms, y(t−1), D_0, Δy(t−1), D_1, Δy(t−2),
    …, D_{p−1}, Δy(t−p), the rest, y]."""
    spec_position = []
    for j in range(width + 1):
        if j <= n_terms:
            spec_position.append(j)
        elif j <= n_terms + p:
            spec_position.append(n_terms + 2 * (j - n_terms))
        else:
            spec_position.append(j + p)
    indicator_position = [n_terms + 1 + 2 * r for r in range(p)]
    return np.array(spec_position, dtype=int), np.array(indicator_position, dtype=int)


def profile_tau(a_common: np.ndarray, first_rows: np.ndarray, n_terms: int,
                n_rows: int) -> tuple[np.ndarray, np.ndarray]:
    """τ for every lag k = 0…p on its own longest sample (rows k…), for a batch:
    ``a_common`` (B, W+1, W+1) and ``first_rows`` (B, p, W+1) give (B, p+1) and the
    sample sizes (p+1,).

    One factorisation gives them all.  Dropping row r from a regression is the same
    as adding its indicator column D_r (Frisch-Waugh-Lovell), so with the columns
    [terms, y(t−1), D_0, Δy(t−1), D_1, Δy(t−2), …] the model with k lags on rows k…
    is the leading block of m = k_det + 1 + 2k columns of [A; rows 0…p−1], and its
    residual degrees of freedom come out right by themselves: (T−1) − m =
    (T−1−k) − (k_det + 1 + k).
    """
    batch, p, _ = first_rows.shape
    width = a_common.shape[1] - 1
    spec_position, indicator_position = _interleaved(n_terms, p, width)
    size = width + p + 1
    matrix = np.zeros((batch, width + 1 + p, size))
    matrix[:, : width + 1, spec_position] = a_common
    matrix[:, width + 1:, spec_position] = first_rows
    matrix[:, width + 1 + np.arange(p), indicator_position] = 1.0
    a = r_factor(matrix)
    regressors = size - 1
    c, e = a[:, :regressors, regressors], a[:, regressors, regressors]
    lags = np.arange(p + 1)
    m = n_terms + 1 + 2 * lags
    tail = np.zeros((batch, regressors + 1))
    tail[:, :regressors] = np.cumsum((c * c)[:, ::-1], axis=1)[:, ::-1]
    nobs = n_rows - lags
    sigma2 = (e[:, None] ** 2 + tail[:, m]) / (nobs - (n_terms + 1 + lags))
    gamma_row = upper_inverse(a[:, :regressors, :regressors])[:, n_terms, :]
    gamma = np.cumsum(gamma_row * c, axis=1)[:, m - 1]
    variance = sigma2 * np.cumsum(gamma_row * gamma_row, axis=1)[:, m - 1]
    return np.asarray(gamma / np.sqrt(variance)), nobs


def restricted_rss(estimates: Estimates, name: str) -> np.ndarray:
    """RSS of the Φ restricted regression on the same sample and lags (Dickey & Fuller
    1981), from the unrestricted fit by the Wald identity for exclusion restrictions
    β_S = 0 (e.g. Greene, W.H. 2012, Econometric Analysis, 7th ed., §5.3):

        RSS_r = RSS_u + b_S' (W_SS)⁻¹ b_S,  W = (X'X)⁻¹ = R⁻¹R⁻ᵀ over the used columns,

    S the restricted columns (the dropped terms and y(t−1)); q = |S| is 2 or 3, so
    (W_SS)⁻¹ is written out (:func:`_quadratic_form`).  b is read in the centred
    parametrisation of the factor (y(t−1) measured from its centre): with γ = 0 in the
    restriction, a constant of zero means the same there, so S is the same subspace."""
    spec = PHI_SPEC[name]
    n_terms = len(DETERMINISTIC_TERMS[spec])
    restricted = list(range(PHI_KEPT_TERMS[name], n_terms + 1))
    a = estimates.a
    width = a.shape[1] - 1
    inside = _leading(width, estimates.used)
    rows = estimates.r_inv[:, restricted, :] * inside[:, None, :]  # (B, q, K): rows S of R⁻¹
    b = np.einsum("bqk,bk->bq", rows, a[:, :width, width])
    w = np.einsum("bqk,brk->bqr", rows, rows)
    return np.asarray(estimates.rss + _quadratic_form(w, b))


def _quadratic_form(w: np.ndarray, b: np.ndarray) -> np.ndarray:
    """b' W⁻¹ b for a batch of symmetric 2×2 or 3×3 W (B, q, q) and b (B, q), by the
    adjugate: W⁻¹ = adj(W) / det(W).  A singular W gives inf or NaN, never an error."""
    if w.shape[1] == 2:
        a11, a12, a22 = w[:, 0, 0], w[:, 0, 1], w[:, 1, 1]
        det = a11 * a22 - a12 * a12
        x, y = b[:, 0], b[:, 1]
        return np.asarray((a22 * x * x - 2.0 * a12 * x * y + a11 * y * y) / det)
    adj = np.empty_like(w)
    for i in range(3):
        for j in range(3):
            r = [k for k in range(3) if k != j]  # the cofactor of (j, i) gives adj[i, j]
            c = [k for k in range(3) if k != i]
            minor = w[:, r[0], c[0]] * w[:, r[1], c[1]] - w[:, r[0], c[1]] * w[:, r[1], c[0]]
            adj[:, i, j] = minor if (i + j) % 2 == 0 else -minor
    det = np.einsum("bj,bj->b", w[:, 0, :], adj[:, :, 0])
    return np.asarray(np.einsum("bi,bij,bj->b", b, adj, b) / det)


def column_norms(rows: np.ndarray) -> np.ndarray:
    """‖x_j‖ of every column of a batch of designs (B, M, W) → (B, W)."""
    return np.sqrt(np.einsum("bij,bij->bj", rows, rows))


def column_share(a: np.ndarray, norms: np.ndarray) -> np.ndarray:
    """min over the leading columns (as many as ``norms`` has) of |R_jj| / ‖x_j‖: the
    sine of the angle between each column and the span of the ones before it."""
    width = norms.shape[1]
    diag = np.abs(np.diagonal(a[:, :width, :width], axis1=1, axis2=2))
    share = np.where(norms > 0, diag / np.where(norms > 0, norms, 1.0), 0.0)
    return np.asarray(share.min(axis=1))


@dataclass(frozen=True)
class LagChoices:
    """The lag each series of a batch gets by ``rule``, and its criteria by lag 0…p in
    the rule's own measure (NaN where the rule has none; no columns for a fixed lag), as
    :class:`tauscope.engine.regression.lagchoice.LagChoice` holds them for one series."""

    rule: str
    max_lags: int
    lags: np.ndarray  # (B,) int
    criteria: np.ndarray  # (B, p+1), or (B, 0) for a fixed lag


def fixed_lag_choices(batch: int, lag: int, p: int) -> LagChoices:
    return LagChoices("fixed", max(lag, p), np.full(batch, lag, dtype=int), np.empty((batch, 0)))


def lag_choices(rule: str, fits: BlockFits, values: np.ndarray, p: int) -> LagChoices:
    """The reference's choice: the smallest criterion (ties to the shorter lag), or the
    longest lag whose last coefficient has |t| ≥ 1.645 (Ng & Perron 1995), 0 if none;
    then its criteria are the t's of the lags from max(chosen, 1) on."""
    if rule in ("aic", "bic", "hqc", "maic"):
        return LagChoices(rule, p, np.argmin(values, axis=1), values)
    t = fits.last_t
    significant = np.abs(t[:, 1:]) >= TSIG_CRITICAL  # lags 1…p; NaN is never significant
    chosen = np.max(np.where(significant, np.arange(1, p + 1)[None, :], 0), axis=1, initial=0)
    low = np.maximum(chosen, 1)
    criteria = np.where(np.arange(p + 1)[None, :] >= low[:, None], t, math.nan)
    return LagChoices(rule, p, chosen, criteria)
