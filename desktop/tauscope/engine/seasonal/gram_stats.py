"""The seasonal statistics of many replications from their cross products, by one
Cholesky factor each (for the simulated null distributions).

With the columns ordered [lags, π1 … πS, Δ_S y_t] and G = A'M_D A = L L' (L lower
triangular), the bottom-right block of L is the Cholesky factor of the π regression
after the lags are partialled out (Frisch-Waugh-Lovell):

    [[Λ, 0], [c', r]],   so   b = Λ'⁻¹c,   (X'X)⁻¹_ππ = V = Λ'⁻¹Λ⁻¹,   RSS = r².

The sums of squares the F statistics need then follow from the rows of the factor
(Golub & Van Loan 2013, §5.3): adding π1 … πS to the lags lowers the RSS by c'c, and
adding π2 … πS to [lags, π1] by Σ_{i≥2} c_i², so the joint F statistics of Ghysels,
Lee & Noh (1994) are F_all = c'c / (S s²) and F_seasonal = Σ_{i≥2} c_i² / ((S − 1) s²),
with s² = r²/(m − d − k).  The t statistics are b_j / √(s² V_jj) and each pair's F is
b_B'V_BB⁻¹b_B / (2 s²) with V_BB⁻¹ written out (2 × 2).  The same numbers as
``design.fit_from_gram`` followed by ``design.statistics`` (to rounding), for about a
third of their cost.
"""

from __future__ import annotations

import numpy as np

from tauscope.engine.seasonal.design import Statistic, statistics_for


def columns_lags_first(period: int, lags: int) -> list[int]:
    """The regression's columns [π1 … πS, lags, Δ_S y_t] reordered as [lags, π, Δ_S y_t]."""
    k = period + lags
    return [*range(period, k), *range(period), k]


def statistics_lags_first(gram: np.ndarray, period: int, lags: int, dof: int) -> np.ndarray:
    """(R, len(statistics_for(period))) from G (R, k + 1, k + 1), its columns in the
    order of :func:`columns_lags_first`; ``dof`` = m − d − k."""
    factor = np.linalg.cholesky(gram)[:, lags:, lags:]
    lam, c = factor[:, :period, :period], factor[:, period, :period]
    s2 = factor[:, period, period] ** 2 / dof
    lam_inv = _lower_inverse(lam)
    coef = np.einsum("rji,rj->ri", lam_inv, c)
    cov = np.swapaxes(lam_inv, 1, 2) @ lam_inv
    squares = c * c
    stats = statistics_for(period)
    out = np.empty((gram.shape[0], len(stats)))
    for i, stat in enumerate(stats):
        if stat.kind == "t":
            j = stat.columns[0]
            out[:, i] = coef[:, j] / np.sqrt(s2 * cov[:, j, j])
        else:
            out[:, i] = _quadratic(stat, coef, cov, squares, period) / (len(stat.columns) * s2)
    return out


def _quadratic(stat: Statistic, coef: np.ndarray, cov: np.ndarray, squares: np.ndarray,
               period: int) -> np.ndarray:
    """b_B'V_BB⁻¹b_B for the statistic's columns B (R,)."""
    cols = stat.columns
    if cols == tuple(range(period)):
        return squares.sum(axis=1)
    if cols == tuple(range(1, period)):
        return squares[:, 1:].sum(axis=1)
    if len(cols) == 2:
        a, b = cols
        va, vb, vab = cov[:, a, a], cov[:, b, b], cov[:, a, b]
        ba, bb = coef[:, a], coef[:, b]
        return (ba * ba * vb - 2.0 * ba * bb * vab + bb * bb * va) / (va * vb - vab * vab)
    sub = cov[:, list(cols)][:, :, list(cols)]
    chosen = coef[:, list(cols)]
    return np.einsum("ri,ri->r", chosen, np.linalg.solve(sub, chosen[:, :, None])[:, :, 0])


def _lower_inverse(lower: np.ndarray) -> np.ndarray:
    """Λ⁻¹ of a stack of lower-triangular matrices (R, S, S) by forward substitution,
    row by row over the whole stack: X_i = (e_i − Λ_{i,<i} X_{<i}) / Λ_ii."""
    reps, size, _ = lower.shape
    out = np.zeros((reps, size, size))
    for i in range(size):
        row = -np.einsum("rj,rjk->rk", lower[:, i, :i], out[:, :i, :]) if i else out[:, 0, :]
        row[:, i] += 1.0
        out[:, i, :] = row / lower[:, i, i, None]
    return out
