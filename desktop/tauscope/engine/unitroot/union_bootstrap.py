"""The wild bootstrap union of rejections, valid when the shocks' variance changes.

Smeekes, S. & Taylor, A.M.R. (2012), "Bootstrap union tests for unit roots in the
presence of nonstationary volatility", Econometric Theory 28(2), 422-456, building on
Cavaliere, G. & Taylor, A.M.R. (2008), "Bootstrap unit root tests for time series with
nonstationary volatility", Econometric Theory 24(1), 43-71.  Under a variance that
changes over the sample the union's components (:mod:`tauscope.engine.unitroot.union`)
no longer have the Dickey-Fuller limits, so κ·cv_i is the wrong line; the wild
bootstrap keeps each shock's size at its own date and so reproduces their null
distribution whatever the volatility path.

For one series x of n values on a difference level (the null: x has a unit root):

1. null residuals: w_t = Δx_t is regressed by OLS on [1, w_{t−1}, …, w_{t−p}], p the
   larger of the union's two MAIC lag orders on this series (a sieve, Chang & Park
   2003); ε̂_t are its residuals, set to 0 for the first p dates so each keeps its date;
2. wild draws ε*_t = r_t ε̂_t with Rademacher multipliers r_t = ±1 (probability ½
   each): they keep |ε̂_t| exactly and match its second and fourth moments, which
   Davidson, J. & Flachaire, E. (2008, Journal of Econometrics 146) found the most
   accurate choice; Gaussian multipliers (Cavaliere & Taylor 2008) are an option;
3. recolouring with the fitted lag polynomial: u*_t = Σ_j φ̂_j u*_{t−j} + ε*_t, and the
   bootstrap series x*_t = Σ_{s≤t} u*_s from x*_1 = 0 (all components are invariant to
   the level, so the start does not matter);
4. the same union on each x* (same components, the same lag rule and maximum, lags
   chosen afresh on each bootstrap series), M*_b = max_i τ*_i / cv_i with the series'
   own cv_i; the B bootstrap series of one series go through the vectorised DF-GLS of
   :mod:`tauscope.engine.unitroot.dfgls_many` as one batch.

The union rejects at level α when M > q*_α, the ⌈(B + 1)(1 − α)⌉-th smallest M*_b
(so the bootstrap p-value (1 + #{M*_b ≥ M}) / (B + 1) is at most α); q*_α takes the
place of κ.  A replicate whose statistic is not a number counts as +∞ (conservative).

The random numbers of a series come from a seed derived from its own values (a hash of
their bytes, the level and :data:`BOOTSTRAP_SEED`), so a series gets the same answer
alone, in any batch and in any order.
"""

from __future__ import annotations

import hashlib
import math
from dataclasses import dataclass

import numpy as np

from tauscope.engine.seasonal.means import remove_seasonal_means
from tauscope.engine.unitroot.union import UnionLevel, union_level

BOOTSTRAP_REPS = 499  # (B + 1)·α is a whole number at 1%, 5% and 10%
BOOTSTRAP_SEED = 20_120_428
MULTIPLIERS = ("rademacher", "gaussian")
ALPHAS = (0.01, 0.05, 0.10)


@dataclass(frozen=True)
class BootstrapLevel:
    """The bootstrap on one difference level for every series: the critical value q*_α of
    M at 1%, 5% and 10% (rows × 3, in :data:`ALPHAS` order) and the p-value of M."""

    difference: int
    critical: np.ndarray
    p_value: np.ndarray
    reps: int


def series_seed(values: np.ndarray, difference: int, seed: int = BOOTSTRAP_SEED) -> list[int]:
    """The seed of one series: its values' bytes hashed (BLAKE2b, 8 bytes), the level
    and the base seed; nothing about the batch enters it."""
    digest = hashlib.blake2b(np.ascontiguousarray(values, dtype=float).tobytes(), digest_size=8).digest()
    return [seed, int.from_bytes(digest, "little"), difference]


def null_fit(x: np.ndarray, lags: int) -> tuple[np.ndarray, np.ndarray]:
    """(φ̂, ε̂): the AR(p) of Δx with a constant by OLS, and its residuals aligned to the
    dates of Δx (n − 1 values, the first p set to 0)."""
    w = np.diff(np.asarray(x, dtype=float))
    m = w.shape[0]
    p = int(max(0, min(lags, m - 3)))
    residuals = np.zeros(m)
    if p == 0:
        residuals[:] = w - w.mean()
        return np.zeros(0), residuals
    design = np.column_stack([np.ones(m - p)] + [w[p - j:m - j] for j in range(1, p + 1)])
    beta, *_ = np.linalg.lstsq(design, w[p:], rcond=None)
    residuals[p:] = w[p:] - design @ beta
    return beta[1:], residuals


def bootstrap_series(x: np.ndarray, lags: int, reps: int, rng: np.random.Generator,
                     multipliers: str = "rademacher", recolour: bool = True) -> np.ndarray:
    """(reps, n) bootstrap series under the unit-root null for one series x (steps 1-3)."""
    phi, residuals = null_fit(x, lags)
    if multipliers == "rademacher":
        r = rng.integers(0, 2, size=(reps, residuals.shape[0])) * 2.0 - 1.0
    elif multipliers == "gaussian":
        r = rng.standard_normal((reps, residuals.shape[0]))
    else:
        raise ValueError(f"multipliers must be one of {', '.join(MULTIPLIERS)}")
    u = r * residuals
    if recolour and phi.size:
        for t in range(u.shape[1]):
            k = min(t, phi.size)
            if k:
                u[:, t] += u[:, t - k:t][:, ::-1] @ phi[:k]
    paths = np.zeros((reps, x.shape[0]))
    paths[:, 1:] = np.cumsum(u, axis=1)
    return paths


def critical_index(reps: int, alpha: float) -> int:
    """0-based index of the ⌈(B + 1)(1 − α)⌉-th smallest of B replicates."""
    return min(reps - 1, max(0, math.ceil(round((reps + 1) * (1.0 - alpha), 9)) - 1))


def bootstrap_level(xd: np.ndarray, level: UnionLevel, rule: str, max_lags: int,
                    fixed: int | None = None, reps: int = BOOTSTRAP_REPS,
                    seed: int = BOOTSTRAP_SEED, multipliers: str = "rademacher",
                    recolour: bool = True, period: int | None = None) -> BootstrapLevel:
    """The bootstrap critical values and p-value of the union on every row of ``xd``
    (the level ``level.difference`` of each series; ``level`` its union).  With ``period``,
    ``xd`` has had its fixed seasonal means removed and so has every bootstrap series."""
    rows = xd.shape[0]
    c = level.constants
    critical = np.full((rows, len(ALPHAS)), np.nan)
    p_value = np.full(rows, np.nan)
    statistic = level.margin * c.kappa
    for i in range(rows):
        lags = max(int(level.lags["constant"][i]), int(level.lags["trend"][i]))
        rng = np.random.default_rng(series_seed(xd[i], level.difference, seed))
        paths = bootstrap_series(xd[i], lags, reps, rng, multipliers, recolour)
        if period is not None:
            paths = np.asarray(remove_seasonal_means(paths, period))
        with np.errstate(all="ignore"):
            boot = union_level(paths, level.difference, rule, max_lags, c.alpha, fixed, period=period)
            ratios = np.column_stack([boot.tau[name] / cv for name, cv in
                                      zip(c.components, c.critical_values, strict=True)])
            m_star = np.max(ratios, axis=1)
        m_star = np.sort(np.where(np.isfinite(m_star), m_star, np.inf))
        critical[i] = [m_star[critical_index(reps, a)] for a in ALPHAS]
        if np.isfinite(statistic[i]):
            p_value[i] = (1.0 + np.count_nonzero(m_star >= statistic[i])) / (reps + 1.0)
    return BootstrapLevel(level.difference, critical, p_value, reps)
