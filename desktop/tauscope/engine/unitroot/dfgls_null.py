"""The null distribution of DF-GLS as the engine computes it, lag choice included.

The statistic of :func:`tauscope.engine.unitroot.dfgls.dfgls` with MAIC is a procedure:
the lag order k is chosen by MAIC (Ng & Perron 2001) on the OLS-detrended series
(Perron & Qu 2007) over 0 … k_max, then the Dickey-Fuller regression without
deterministic terms is fitted to the GLS-detrended series (Elliott, Rothenberg & Stock
1996) with k lags on its longest sample.  In short samples the lag choice moves the null
distribution a long way from the asymptotic one (at T = 30 the 5% quantile is about
−2.2, not −1.95), so the finite-sample critical values simulate the whole procedure:

* y_t = y_{t−1} + e_t, y_1 = e_1, e_t ~ N(0, 1), t = 1 … T (the statistic does not
  depend on the variance, nor on the level);
* MAIC(k) = ln σ̂²_k + 2(τ_T(k) + k)/N, τ_T(k) = γ̂_k² Σ ỹ²_{t−1} / σ̂²_k, on the common
  sample of N = T − 1 − k_max observations (ties to the shorter lag);
* the t ratio of γ̂ in Δỹ_t = γ ỹ_{t−1} + Σ_{i ≤ k} β_i Δỹ_{t−i} + e_t on T − 1 − k
  observations, ỹ the GLS-detrended series.

Vectorised over replications (batched normal equations of at most k_max + 1 unknowns),
in chunks of the shared random stream of :mod:`tauscope.engine.distributions.simulate`.
"""

from __future__ import annotations

import numpy as np

from tauscope.engine.distributions.simulate import raw_moments, shock_chunks, solve_moments
from tauscope.engine.regression.design import max_lag_cap, schwert_max_lag
from tauscope.engine.regression.nested import detrended
from tauscope.engine.unitroot.dfgls import C_BAR, deterministic_columns


def default_max_lags(length: int) -> int:
    """k_max as the cross-check uses it: Schwert's rule, capped by the sample (T//2 − 3)."""
    return max(min(schwert_max_lag(length), max_lag_cap(length)), 0)


def gls_detrended(paths: np.ndarray, spec: str) -> np.ndarray:
    """ERS (1996) GLS detrending of each row: ỹ = y − z'β̂, β̂ from the quasi-differences
    with ᾱ = 1 + c̄/T (one projection serves every replication)."""
    length = paths.shape[1]
    abar = 1.0 + C_BAR[spec] / length
    z = deterministic_columns(spec, length)
    zq = z.copy()
    zq[1:] = z[1:] - abar * z[:-1]
    projector = np.linalg.pinv(zq).T
    yq = paths.copy()
    yq[:, 1:] = paths[:, 1:] - abar * paths[:, :-1]
    return np.asarray(paths - (yq @ projector) @ z.T)


def _columns(levels: np.ndarray, changes: np.ndarray, first: int, lags: int) -> list[np.ndarray]:
    stop = changes.shape[1]
    return [levels[:, first:stop]] + [changes[:, first - i:stop - i] for i in range(1, lags + 1)]


def maic_choice(paths: np.ndarray, spec: str, max_lags: int) -> np.ndarray:
    """The lag order MAIC picks for each row (as :func:`dfgls.choose_dfgls_lag`)."""
    ols = detrended(paths, spec)
    changes = np.diff(ols, axis=1)
    columns = _columns(ols, changes, max_lags, max_lags)
    response = changes[:, max_lags:]
    n = response.shape[1]
    moments = raw_moments(columns, response)
    level_ss = moments.zz[:, 0, 0]
    values = np.empty((paths.shape[0], max_lags + 1))
    for k in range(max_lags + 1):
        beta, rss, _ = solve_moments(moments.subset(slice(0, k + 1)))
        sigma2 = rss / n
        values[:, k] = np.log(sigma2) + 2.0 * (beta[:, 0] ** 2 * level_ss / sigma2 + k) / n
    return np.asarray(np.argmin(values, axis=1))


def dfgls_statistics(paths: np.ndarray, spec: str, lags: np.ndarray) -> np.ndarray:
    """The DF-GLS t ratio of each row with its own lag order ``lags[row]``."""
    gls = gls_detrended(paths, spec)
    changes = np.diff(gls, axis=1)
    out = np.empty(paths.shape[0])
    for k in np.unique(lags).tolist():
        rows = lags == k
        columns = _columns(gls[rows], changes[rows], k, k)
        beta, rss, inv_diag = solve_moments(raw_moments(columns, changes[rows][:, k:]))
        df = changes.shape[1] - k - len(columns)
        out[rows] = beta[:, 0] / np.sqrt(rss / df * inv_diag[:, 0])
    return out


def procedure_draws(spec: str, length: int, reps: int, seed: int,
                    max_lags: int | None = None) -> np.ndarray:
    """``reps`` DF-GLS statistics under the null at series length ``length``, the lag
    chosen by MAIC up to ``max_lags`` (None: :func:`default_max_lags`)."""
    top = default_max_lags(length) if max_lags is None else int(max_lags)
    if length < top + 8:
        raise ValueError(f"length {length} is too short for up to {top} lags")
    parts = []
    for shocks in shock_chunks(length, reps, seed, width=top + 2):
        paths = np.cumsum(shocks, axis=1)
        parts.append(dfgls_statistics(paths, spec, maic_choice(paths, spec, top)))
    return np.concatenate(parts)
