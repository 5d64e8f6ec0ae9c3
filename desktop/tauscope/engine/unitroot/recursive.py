"""Recursive ADF statistic: τ on an expanding window, for the charts.

For every window end e the ADF regression of the chosen spec and lag order p
is fitted on the first e + 1 values of the series (the same design as the full
sample, so the trend keeps its observation numbers), and τ_e = γ̂_e / se(γ̂_e)
is recorded with the MacKinnon (2010) critical value for that window's size
(the response surface evaluated for all window sizes at once).
A statistic that drifts across the critical value as the sample grows shows
how much the verdict owes to the latest data; a sudden jump points to a break.

All windows are solved at once: with X = QR for the full sample, the window
of the first w rows has X_w'X_w = R'G_wR and X_w'y_w = R'c_w, G_w and c_w being
running sums of q_t q_t' and q_t y_t; then β̂_w = R^{-1}G_w^{-1}c_w,
RSS_w = y_w'y_w − c_w'G_w^{-1}c_w and (X_w'X_w)^{-1} = R^{-1}G_w^{-1}R^{-T}.
(The lag-sensitivity table is ``SeriesResult.lag_profile``.)
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np
from statsmodels.tsa.adfvalues import tau_2010s

from tauscope.engine.distributions.critical import SPEC_CODES
from tauscope.engine.regression.design import adf_design, gamma_column
from tauscope.engine.regression.scaling import centred
from tauscope.engine.results import RecursiveStatistic

MIN_WINDOW = 20  # regression observations in the first window (common practice: ≥ 20)
NEAR_EXACT = 1e-6  # RSS below this share of Σy²: the window is left to the solves (see below)
SMALL_FACTOR = 5  # Gram matrices up to this size are factorised elementwise (_last_row); the
# choice depends on the size alone, so a row gets the same numbers alone as in a batch



def tau_critical_values_for_sizes(spec: str, sizes: np.ndarray, alpha: float) -> np.ndarray:
    """MacKinnon (2010) finite-sample τ critical values for many sample sizes at once:
    b0 + b1/T + b2/T² + b3/T³ with the coefficients statsmodels' ``mackinnoncrit`` uses
    (``statsmodels.tsa.adfvalues.tau_2010s``, N = 1)."""
    row = {0.01: 0, 0.05: 1, 0.10: 2}[next(a for a in (0.01, 0.05, 0.10) if abs(a - alpha) < 1e-12)]
    coefficients = np.asarray(tau_2010s[SPEC_CODES[spec]][0][row], dtype=float)
    inverse = 1.0 / np.asarray(sizes, dtype=float)
    return np.asarray(sum(c * inverse**i for i, c in enumerate(coefficients)))


def first_window(columns: int) -> int:
    """Smallest regression sample used: 20 observations or four per coefficient."""
    return max(MIN_WINDOW, 4 * columns)


def recursive_tau(x: np.ndarray, spec: str, lags: int, alpha: float = 0.05) -> RecursiveStatistic:
    """τ for every expanding window from :func:`first_window` to the whole sample."""
    x = centred(np.asarray(x, dtype=float), spec)  # with a constant, the level only moves it
    y, design = adf_design(x, spec, lags)
    n, k = design.shape
    start = first_window(k)
    if n < start:
        empty = np.empty(0)
        return RecursiveStatistic(spec, lags, empty.astype(int), empty.astype(int), empty, empty, alpha)
    scale = np.sqrt(np.sum(design * design, axis=0))
    q, r = np.linalg.qr(design / scale)
    gram = np.cumsum(q[:, :, None] * q[:, None, :], axis=0)[start - 1:]
    cross = np.cumsum(q * y[:, None], axis=0)[start - 1:]
    yy = np.cumsum(y * y)[start - 1:]
    g = gamma_column(spec)
    row = np.linalg.inv(r)[g]  # γ̂ = row · (QᵀQ)⁻¹ Qᵀy on each window, rescaled
    # One batched solve for both right-hand sides instead of inverting every window's Gram.
    solved = np.linalg.solve(gram, np.stack([cross, np.broadcast_to(row, cross.shape)], axis=2))
    fitted_part = np.einsum("wk,wk->w", cross, solved[:, :, 0])
    sizes = np.arange(start, n + 1)
    s2 = np.maximum(yy - fitted_part, 0.0) / (sizes - k)  # round-off can dip below zero
    beta_gamma = solved[:, :, 0] @ row / scale[g]
    var_gamma = s2 * (solved[:, :, 1] @ row) / scale[g] ** 2
    fitted_exactly = ~(var_gamma > 0)  # a window the regression fits without error: no τ
    tau = beta_gamma / np.sqrt(np.where(fitted_exactly, 1.0, var_gamma))
    tau[fitted_exactly] = np.nan
    critical = tau_critical_values_for_sizes(spec, sizes, alpha)
    ends = sizes + lags  # window of regression size m ends at series position m + p
    return RecursiveStatistic(spec, lags, ends, sizes, tau, critical, alpha)


def recursive_tau_many(xs: np.ndarray, spec: str, lags: int, alpha: float = 0.05,
                       rows_per_call: int = 16) -> list[RecursiveStatistic]:
    """:func:`recursive_tau` for every row of ``xs`` (series of one length) at once: the
    same formulas, with the QR factorisations, the running sums and the window solves
    batched over the rows (``rows_per_call`` at a time, to bound the memory of the
    running Gram matrices).  Each row's numbers depend on that row alone, so a series
    gets the same numbers alone as in a batch."""
    xs = np.asarray(xs, dtype=float)
    out: list[RecursiveStatistic] = []
    for first in range(0, xs.shape[0], rows_per_call):
        out.extend(_recursive_rows(xs[first:first + rows_per_call], spec, lags, alpha))
    return out


def _recursive_rows(xs: np.ndarray, spec: str, lags: int, alpha: float,
                    alone_as_pair: bool = False) -> list[RecursiveStatistic]:
    # numpy takes other kernels for a stack of one where the solves decide, or where the
    # design has one column: then a single row is computed as a pair
    if alone_as_pair or (xs.shape[0] == 1 and spec == "none" and lags == 0):
        return _recursive_rows(np.vstack([xs, xs]), spec, lags, alpha)[:1]
    given = xs
    if spec != "none":
        xs = xs - xs.mean(axis=1)[:, None]
    dx = np.diff(xs, axis=1)
    rows = np.arange(lags, dx.shape[1])
    columns = []
    if spec in ("trend", "constant"):
        columns.append(np.ones((xs.shape[0], rows.shape[0])))
    if spec == "trend":
        columns.append(np.broadcast_to((rows + 1).astype(float), (xs.shape[0], rows.shape[0])))
    columns.append(xs[:, rows])
    columns += [dx[:, rows - i] for i in range(1, lags + 1)]
    design = np.stack(columns, axis=2)  # (B, n, k)
    y = dx[:, rows]
    batch, n, k = design.shape
    start = first_window(k)
    if n < start:
        empty = np.empty(0)
        return [RecursiveStatistic(spec, lags, empty.astype(int), empty.astype(int), empty, empty, alpha)
                for _ in range(batch)]
    scale = np.sqrt(np.sum(design * design, axis=1))  # (B, k)
    g = gamma_column(spec)
    sizes = np.arange(start, n + 1)
    ends = sizes + lags
    tau_by_factor = _tau_by_cholesky(design / scale[:, None, :], y, g, start)
    if tau_by_factor is not None:
        critical = _critical_values(spec, start, n, alpha)
        return [RecursiveStatistic(spec, lags, ends, sizes, tau_by_factor[b], critical, alpha)
                for b in range(batch)]
    if batch == 1:
        return _recursive_rows(given, spec, lags, alpha, alone_as_pair=True)
    q, r = np.linalg.qr(design / scale[:, None, :])
    gram = np.cumsum(q[:, :, :, None] * q[:, :, None, :], axis=1)[:, start - 1:]
    cross = np.cumsum(q * y[:, :, None], axis=1)[:, start - 1:]
    yy = np.cumsum(y * y, axis=1)[:, start - 1:]
    row = np.linalg.inv(r)[:, g, :]  # (B, k)
    solved = np.linalg.solve(gram, np.stack([cross, np.broadcast_to(row[:, None, :], cross.shape)], axis=3))
    fitted_part = np.einsum("bwk,bwk->bw", cross, solved[..., 0])
    s2 = np.maximum(yy - fitted_part, 0.0) / (sizes - k)
    scale_g = scale[:, g][:, None]
    beta_gamma = np.einsum("bwk,bk->bw", solved[..., 0], row) / scale_g
    var_gamma = s2 * np.einsum("bwk,bk->bw", solved[..., 1], row) / scale_g ** 2
    fitted_exactly = ~(var_gamma > 0)
    tau = beta_gamma / np.sqrt(np.where(fitted_exactly, 1.0, var_gamma))
    tau[fitted_exactly] = np.nan
    critical = tau_critical_values_for_sizes(spec, sizes, alpha)
    return [RecursiveStatistic(spec, lags, ends, sizes, tau[b], critical, alpha) for b in range(batch)]


def _tau_by_cholesky(design: np.ndarray, y: np.ndarray, g: int, start: int) -> np.ndarray | None:
    """τ on every window of every row from one Cholesky factor per window, or None when a
    factor fails or a window is fitted almost exactly (then the solves above decide).

    With the columns ordered so that y(t−1) is last, X = QR for the full sample and
    Z_w the first w rows of Q, the window's augmented Gram [Z_w y_w]ᵀ[Z_w y_w] = LLᵀ
    gives, L's last row being (…, l, m): the last coefficient on Z, over its standard
    error without σ̂, is l, and RSS_w = m² (the Cholesky form of least squares: Golub,
    G.H. & Van Loan, C.F. 2013, Matrix Computations, 4th ed., §5.3).  γ̂ = that
    coefficient / R_kk, so τ_w = sign(R_kk) · l · √(w − k) / |m|."""
    batch, n, k = design.shape
    order = [j for j in range(k) if j != g] + [g]
    q, r = np.linalg.qr(design[:, :, order])
    # [Q y] held row by row (B, k+1, n): the running sums of the products of each pair of
    # its columns on the lower triangle (all the factorisation reads) run along memory
    augmented = np.empty((batch, k + 1, n))
    augmented[:, :k, :] = q.transpose(0, 2, 1)
    augmented[:, k, :] = y
    rows, cols = _lower_triangle(k + 1)
    sums = np.cumsum(augmented[:, rows, :] * augmented[:, cols, :], axis=2)[:, :, start - 1:]
    sizes = np.arange(start, n + 1)
    sign = np.sign(r[:, k - 1, k - 1])[:, None]
    if k + 1 <= SMALL_FACTOR:
        last = _last_row(sums, k + 1)
        if last is None:
            return None
        yy = sums[:, -1]  # the running Σy², the Gram's last diagonal entry
        l_gamma, m = last[k - 1], last[k]
    else:
        gram = np.zeros((batch, sums.shape[2], k + 1, k + 1))
        gram[:, :, rows, cols] = sums.transpose(0, 2, 1)
        try:
            factor = np.linalg.cholesky(gram)  # reads the lower triangle only
        except np.linalg.LinAlgError:
            return None
        yy = gram[..., k, k]
        l_gamma, m = factor[..., k, k - 1], factor[..., k, k]
    rss = m**2
    if not np.all(rss > NEAR_EXACT * yy):
        return None
    return np.asarray(sign * l_gamma * np.sqrt(sizes - k) / np.sqrt(rss))


def _last_row(sums: np.ndarray, size: int) -> list[np.ndarray] | None:
    """The last row of the Cholesky factor L of every window's Gram matrix, from its lower
    triangle held as running sums (B, size(size+1)/2, W) in ``np.tril_indices`` order; None
    when a pivot is not positive.  Column by column, G_jj = Σ_l L_jl² and G_ij = Σ_l L_il L_jl
    (Golub & Van Loan 2013, §4.2), every operation elementwise over the windows, so a row's
    numbers depend on that row alone.  For small matrices this is much cheaper than a
    factorisation call per window."""
    position = _pair_positions(size)
    factor: dict[tuple[int, int], np.ndarray] = {}
    for j in range(size):
        pivot = sums[:, position[(j, j)]]
        for col in range(j):
            pivot = pivot - factor[(j, col)] ** 2
        if not np.all(pivot > 0.0):
            return None
        factor[(j, j)] = np.sqrt(pivot)
        for i in range(j + 1, size):
            entry = sums[:, position[(i, j)]]
            for col in range(j):
                entry = entry - factor[(i, col)] * factor[(j, col)]
            factor[(i, j)] = entry / factor[(j, j)]
    return [factor[(size - 1, col)] for col in range(size)]


@lru_cache(maxsize=16)
def _lower_triangle(size: int) -> tuple[np.ndarray, np.ndarray]:
    """Row and column indices of the lower triangle of a size × size matrix."""
    rows, cols = np.tril_indices(size)
    rows.setflags(write=False)
    cols.setflags(write=False)
    return rows, cols


@lru_cache(maxsize=16)
def _pair_positions(size: int) -> dict[tuple[int, int], int]:
    """(row, column) → its place in ``np.tril_indices(size)`` order."""
    rows, cols = _lower_triangle(size)
    return {pair: p for p, pair in enumerate(zip(rows.tolist(), cols.tolist(), strict=True))}


@lru_cache(maxsize=256)
def _critical_values(spec: str, start: int, n: int, alpha: float) -> np.ndarray:
    """:func:`tau_critical_values_for_sizes` for the windows start … n, once per request
    (read-only: every series of that spec, length and lag order shares it)."""
    critical = tau_critical_values_for_sizes(spec, np.arange(start, n + 1), alpha)
    critical.setflags(write=False)
    return critical
