"""Simulated null distributions of the Dickey-Fuller statistics at the user's sample size.

Under the null the series is a driftless Gaussian random walk,
y_t = y_{t−1} + e_t, y_0 = 0, e_t ~ N(0, 1), and the ADF regression

    Δy_t = a0 + a2·t + γ·y_{t−1} + Σ_{i=1..p} β_i Δy_{t−i} + e_t

is fitted on ``nobs`` observations (the regression sample, as in MacKinnon
2010, so the series has nobs + p + 1 values).  For every replication the
module returns τ = γ̂/se(γ̂), the coefficient statistic nobs·γ̂ and the joint F
statistics of Dickey & Fuller (1981):

    Φ = ((RSS_r − RSS_u)/q) / (RSS_u/(nobs − k_u)),

Φ1 (constant spec, a0 = γ = 0), Φ2 (trend spec, a0 = a2 = γ = 0) and Φ3
(trend spec, a2 = γ = 0).  The statistics are invariant to the error variance;
τ and Φ3 in the trend spec are also invariant to a drift.

Computation is vectorised over replications: the deterministic terms are
partialled out with one fixed projection (Frisch-Waugh-Lovell) and the
remaining 1 + p regressors are solved as a batch of small normal equations.
Replications are drawn in chunks to bound memory; the random stream does not
depend on the chunk size, so a (nobs, reps, seed, lags) key always gives the
same numbers.  Results are cached and returned read-only.

Finite-sample critical values and p-values from these draws complement the
response surfaces of MacKinnon (1994, 2010) and the tables of Fuller (1976)
and Dickey & Fuller (1981).
"""

from __future__ import annotations

from collections.abc import Iterator
from functools import lru_cache

import numpy as np

from tauscope.engine.design import SPECS

DEFAULT_SEED = 19790601
DEFAULT_REPS = 2_000
EXACT_REPS = 10_000
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
PHI_SPEC = {"phi1": "constant", "phi2": "trend", "phi3": "trend"}
_CHUNK_VALUES = 2_000_000  # floats per chunk of simulated paths (about 16 MB)


def _check(spec: str, nobs: int, reps: int, lags: int) -> None:
    if spec not in SPECS:
        raise ValueError(f"spec must be one of {', '.join(SPECS)}, not {spec!r}")
    if lags < 0:
        raise ValueError("lags must be 0 or more")
    if nobs < lags + 6:
        raise ValueError(f"nobs = {nobs} is too small for a regression with {lags} lags")
    if reps < 10:
        raise ValueError("reps must be at least 10")


def random_walk_chunks(length: int, reps: int, seed: int, width: int = 1) -> Iterator[np.ndarray]:
    """Driftless Gaussian random walks y_1 … y_length (y_0 = 0), ``reps`` rows in chunks.

    ``width`` (regressors per replication) shrinks the chunks so the batched
    design stays near a fixed memory budget."""
    rng = np.random.default_rng(seed)
    chunk = max(1, _CHUNK_VALUES // max(length * width, 1))
    done = 0
    while done < reps:
        size = min(chunk, reps - done)
        yield np.cumsum(rng.standard_normal((size, length)), axis=1)
        done += size


def deterministic_terms(spec: str, nobs: int) -> np.ndarray:
    """Columns of the deterministic part on the regression sample: [], [1] or [1, t]."""
    t = np.arange(1.0, nobs + 1.0)
    if spec == "none":
        return np.empty((nobs, 0))
    if spec == "constant":
        return np.ones((nobs, 1))
    return np.column_stack([np.ones(nobs), t])


def partial_out(values: np.ndarray, terms: np.ndarray) -> np.ndarray:
    """Residuals of each row (last axis = time) on the fixed columns ``terms``."""
    if terms.shape[1] == 0:
        return values
    q, _ = np.linalg.qr(terms)
    coef = np.tensordot(values, q, axes=([-1], [0]))
    return np.asarray(values - np.tensordot(coef, q.T, axes=([-1], [0])))


def batched_ols(response: np.ndarray, regressors: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Batched least squares of ``response`` (r, n) on ``regressors`` (r, n, m).

    Returns (coefficients (r, m), residual sums of squares (r,), the diagonal
    of (X'X)^{-1} (r, m)), from the normal equations of each replication.
    """
    if regressors.shape[2] == 0:
        return (np.empty((response.shape[0], 0)), np.einsum("rn,rn->r", response, response),
                np.empty((response.shape[0], 0)))
    xtx = np.einsum("rnm,rnl->rml", regressors, regressors)
    xty = np.einsum("rnm,rn->rm", regressors, response)
    inverse = np.linalg.inv(xtx)
    beta = np.einsum("rml,rl->rm", inverse, xty)
    fitted = np.einsum("rnm,rm->rn", regressors, beta)
    resid = response - fitted
    rss = np.einsum("rn,rn->r", resid, resid)
    return beta, rss, np.einsum("rmm->rm", inverse)


def _regression_parts(paths: np.ndarray, lags: int) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Response Δy_t, the level y_{t−1} and the lagged differences on the regression sample."""
    dy = np.diff(paths, axis=1, prepend=0.0)  # Δy_1 = y_1 − y_0 with y_0 = 0
    levels = np.concatenate([np.zeros((paths.shape[0], 1)), paths], axis=1)  # y_0 … y_L
    length = paths.shape[1]
    rows = np.arange(lags, length)  # index of Δy in dy (0-based)
    response = dy[:, rows]
    level = levels[:, rows]  # y_{t−1}: levels[i] is y_i, Δy index i is Δy_{i+1}
    lagged = np.stack([dy[:, rows - i] for i in range(1, lags + 1)], axis=2) if lags else (
        np.empty((paths.shape[0], rows.shape[0], 0)))
    return response, level, lagged


def df_statistics(paths: np.ndarray, lags: int) -> dict[str, np.ndarray]:
    """τ, nobs·γ̂ for every spec and Φ1, Φ2, Φ3 for each simulated path (one row each).

    The regression sample is every Δy_t with p lags available, so nobs = L − p
    for a path of L values after y_0 = 0.
    """
    response, level, lagged = _regression_parts(paths, lags)
    nobs = response.shape[1]
    out: dict[str, np.ndarray] = {}
    rss: dict[str, np.ndarray] = {}
    for spec in SPECS:
        terms = deterministic_terms(spec, nobs)
        y = partial_out(response, terms)
        x = partial_out(np.concatenate([level[:, :, None], lagged], axis=2).transpose(0, 2, 1),
                        terms).transpose(0, 2, 1)
        beta, rss_u, inv_diag = batched_ols(y, x)
        df = nobs - terms.shape[1] - x.shape[2]
        se = np.sqrt(rss_u / df * inv_diag[:, 0])
        out[f"tau_{spec}"] = beta[:, 0] / se
        out[f"rho_{spec}"] = nobs * beta[:, 0]
        rss[spec] = rss_u
    # Restricted models: only the lagged differences (Φ1, Φ2), and a constant with them (Φ3).
    _, rss_lags, _ = batched_ols(response, lagged)
    constant = deterministic_terms("constant", nobs)
    _, rss_lags_c, _ = batched_ols(
        partial_out(response, constant),
        partial_out(lagged.transpose(0, 2, 1), constant).transpose(0, 2, 1),
    )
    df_c, df_t = nobs - 2 - lags, nobs - 3 - lags
    out["phi1"] = ((rss_lags - rss["constant"]) / 2.0) / (rss["constant"] / df_c)
    out["phi2"] = ((rss_lags - rss["trend"]) / 3.0) / (rss["trend"] / df_t)
    out["phi3"] = ((rss_lags_c - rss["trend"]) / 2.0) / (rss["trend"] / df_t)
    return out


@lru_cache(maxsize=32)
def _simulate(nobs: int, reps: int, seed: int, lags: int) -> dict[str, np.ndarray]:
    parts: dict[str, list[np.ndarray]] = {}
    for paths in random_walk_chunks(nobs + lags, reps, seed, width=2 + lags):
        for key, values in df_statistics(paths, lags).items():
            parts.setdefault(key, []).append(values)
    result = {key: np.concatenate(values) for key, values in parts.items()}
    for values in result.values():
        values.setflags(write=False)
    return result


@lru_cache(maxsize=256)
def null_distribution(spec: str, nobs: int, reps: int = DEFAULT_REPS, seed: int = DEFAULT_SEED,
                      lags: int = 0) -> np.ndarray:
    """Simulated τ under the unit-root null for the ADF regression ``spec``
    ("trend", "constant" or "none") with ``lags`` lagged differences on
    ``nobs`` regression observations; a read-only array of ``reps`` values."""
    _check(spec, nobs, reps, lags)
    return _simulate(int(nobs), int(reps), int(seed), int(lags))[f"tau_{spec}"]


@lru_cache(maxsize=256)
def coefficient_null_distribution(spec: str, nobs: int, reps: int = DEFAULT_REPS,
                                  seed: int = DEFAULT_SEED, lags: int = 0) -> np.ndarray:
    """Simulated nobs·γ̂ (the coefficient form of the Dickey-Fuller test; also the
    limit law of the Phillips-Perron Zα) under the null; read-only."""
    _check(spec, nobs, reps, lags)
    return _simulate(int(nobs), int(reps), int(seed), int(lags))[f"rho_{spec}"]


@lru_cache(maxsize=256)
def phi_null_distribution(name: str, nobs: int, reps: int = DEFAULT_REPS, seed: int = DEFAULT_SEED,
                          lags: int = 0) -> np.ndarray:
    """Simulated Φ1, Φ2 or Φ3 (Dickey & Fuller 1981) under its null; read-only."""
    if name not in PHI_SPEC:
        raise ValueError(f"name must be one of {', '.join(PHI_SPEC)}, not {name!r}")
    _check(PHI_SPEC[name], nobs, reps, lags)
    return _simulate(int(nobs), int(reps), int(seed), int(lags))[name]


def lower_critical_values(draws: np.ndarray) -> dict[str, float]:
    """1%, 5% and 10% lower-tail quantiles of simulated draws."""
    return {level: float(np.quantile(draws, a)) for level, a in LEVELS.items()}


def upper_critical_values(draws: np.ndarray) -> dict[str, float]:
    """1%, 5% and 10% upper-tail quantiles (for the F statistics Φ)."""
    return {level: float(np.quantile(draws, 1.0 - a)) for level, a in LEVELS.items()}


def empirical_p_value(statistic: float, draws: np.ndarray, lower: bool = True) -> tuple[float, str | None]:
    """Share of simulated draws at least as extreme as ``statistic``.

    When no draw is that extreme the p-value is only bounded: (1/reps, "below").
    """
    reps = draws.shape[0]
    count = int(np.count_nonzero(draws <= statistic if lower else draws >= statistic))
    if count == 0:
        return 1.0 / reps, "below"
    return count / reps, None


def exact_critical_values(spec: str, nobs: int, lags: int = 0, reps: int = EXACT_REPS,
                          seed: int = DEFAULT_SEED) -> dict[str, float]:
    """Finite-sample τ critical values at the user's exact regression sample size."""
    return lower_critical_values(null_distribution(spec, nobs, reps, seed, lags))


def exact_p_value(statistic: float, spec: str, nobs: int, lags: int = 0, reps: int = EXACT_REPS,
                  seed: int = DEFAULT_SEED) -> float:
    """Finite-sample lower-tail p-value of τ (the share of null draws at or below it)."""
    return empirical_p_value(statistic, null_distribution(spec, nobs, reps, seed, lags))[0]


def exact_phi_critical_values(name: str, nobs: int, lags: int = 0, reps: int = EXACT_REPS,
                              seed: int = DEFAULT_SEED) -> dict[str, float]:
    """Finite-sample upper-tail critical values of Φ1, Φ2 or Φ3."""
    return upper_critical_values(phi_null_distribution(name, nobs, reps, seed, lags))


def exact_phi_p_value(statistic: float, name: str, nobs: int, lags: int = 0,
                      reps: int = EXACT_REPS, seed: int = DEFAULT_SEED) -> float:
    """Finite-sample upper-tail p-value of Φ1, Φ2 or Φ3."""
    return empirical_p_value(statistic, phi_null_distribution(name, nobs, reps, seed, lags),
                             lower=False)[0]


def exact_critical_value(spec: str, nobs: int, alpha: float, lags: int = 0,
                         reps: int = EXACT_REPS, seed: int = DEFAULT_SEED) -> float:
    """One finite-sample τ critical value at level ``alpha`` (0.01, 0.05 or 0.10)."""
    return float(np.quantile(null_distribution(spec, nobs, reps, seed, lags), alpha))
