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
and Dickey & Fuller (1981).  The "exact" values of an analysis (10⁶ replications, the
default seed) are read from a table simulated once with this stream
(:mod:`tauscope.engine.distributions.exact_grid`) when it holds the regression, and
simulated per series length otherwise (:func:`tauscope.engine.distributions.exact.lag_null`).
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.batched import CrossProducts as CrossProducts
from tauscope.engine.distributions.batched import batched_ols as batched_ols
from tauscope.engine.distributions.batched import deterministic_terms as deterministic_terms
from tauscope.engine.distributions.batched import df_statistics as df_statistics
from tauscope.engine.distributions.batched import random_walks as random_walks
from tauscope.engine.distributions.batched import raw_moments as raw_moments
from tauscope.engine.distributions.batched import regression_parts as regression_parts
from tauscope.engine.distributions.batched import shock_chunks as shock_chunks
from tauscope.engine.distributions.batched import solve_moments as solve_moments
from tauscope.engine.distributions.batched import tau_statistics as tau_statistics
from tauscope.engine.distributions.exact import EXACT_REPS as EXACT_REPS
from tauscope.engine.distributions.exact import lag_null
from tauscope.engine.distributions.exact_grid import (
    PROBABILITIES,
    distribution_at,
    quantile_at,
    table_quantiles,
)
from tauscope.engine.regression.design import SPECS
from tauscope.engine.results import TestResult

DEFAULT_SEED = 19790601
DEFAULT_REPS = 2_000
P_VALUE_REPS = 100_000  # draws kept for exact p-values and the chart (p near 0.05: ±0.0007)
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
PHI_SPEC = {"phi1": "constant", "phi2": "trend", "phi3": "trend"}


def _check(spec: str, nobs: int, reps: int, lags: int) -> None:
    if spec not in SPECS:
        raise ValueError(f"spec must be one of {', '.join(SPECS)}, not {spec!r}")
    if lags < 0:
        raise ValueError("lags must be 0 or more")
    if nobs < lags + 4:  # the trend spec needs nobs − (3 + p) ≥ 1 residual degrees of freedom
        raise ValueError(f"nobs = {nobs} is too small for a regression with {lags} lags")
    if reps < 10:
        raise ValueError("reps must be at least 10")


@lru_cache(maxsize=32)
def _simulate(nobs: int, reps: int, seed: int, lags: int) -> dict[str, np.ndarray]:
    parts: dict[str, list[np.ndarray]] = {}
    for shocks in shock_chunks(nobs + lags, reps, seed, width=2 + lags):
        for key, values in df_statistics(shocks, lags).items():
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


def reportable_bound(p_value: float, bound: str | None) -> str | None:
    """Drop a "below" bound the plain p-value already says: a value under 0.001 is
    written "below 0.001" (DESIGN.md §7), which is true of any bounded p-value that small.
    A bound at 0.001 itself (the tables' last quantile) is kept: plain, 0.001 would read "0.001"."""
    return None if bound == "below" and p_value < 0.001 else bound


def _p_reps(reps: int) -> int:
    return min(int(reps), P_VALUE_REPS)


def _from_table(name: str, nobs: int, lags: int, reps: int, seed: int) -> np.ndarray | None:
    """The table's quantiles for (nobs, lags) (:mod:`tauscope.engine.distributions.exact_grid`),
    when the request is the default one (10⁶ replications, the default seed) and the grid
    brackets it; otherwise None."""
    if reps != EXACT_REPS or seed != DEFAULT_SEED:
        return None
    return table_quantiles(name, nobs, lags)


def null_critical_values(name: str, nobs: int, lags: int, reps: int = EXACT_REPS,
                         seed: int = DEFAULT_SEED) -> dict[str, float]:
    """1%, 5%, 10% critical values of ``name`` (``tau_<spec>``, lower tail; ``phi1``-``phi3``,
    upper tail) for the regression (nobs, lags): read from the table when it holds them,
    else simulated with every lag order of this series length (:func:`lag_null`)."""
    if reps == EXACT_REPS and seed == DEFAULT_SEED:
        read = _table_critical_values(name, int(nobs), int(lags))
        if read is not None:
            return dict(read)
    return dict(lag_null(int(nobs), int(lags), int(reps), int(seed), _p_reps(reps)).quantiles[name].values)


@lru_cache(maxsize=1024)
def _table_critical_values(name: str, nobs: int, lags: int) -> tuple[tuple[str, float], ...] | None:
    """:func:`null_critical_values` read from the table (None when it does not hold the
    regression), kept per key: every series of one regression size reads the same values."""
    table = table_quantiles(name, nobs, lags)
    if table is None:
        return None
    upper = name in PHI_SPEC
    return tuple((level, quantile_at(table, 1.0 - a if upper else a)) for level, a in LEVELS.items())


def null_p_value(statistic: float, name: str, nobs: int, lags: int, reps: int = EXACT_REPS,
                 seed: int = DEFAULT_SEED) -> tuple[float, str | None]:
    """The p-value of ``statistic`` under the null of ``name`` at (nobs, lags) and its bound:
    from the table's quantiles when it holds them (bounded at 0.001), else the share of the
    first :data:`P_VALUE_REPS` simulated draws at least as extreme."""
    lower = name.startswith("tau_")
    table = _from_table(name, nobs, lags, reps, seed)
    if table is not None:
        share, side = distribution_at(table, statistic)
        if lower:
            return share, "below" if side == "below" else None
        if side == "above":
            return PROBABILITIES[0], "below"  # the grid is symmetric: 1 − 0.999
        return 1.0 - share, None
    draws = lag_null(int(nobs), int(lags), int(reps), int(seed), _p_reps(reps)).kept[name]
    return empirical_p_value(statistic, draws, lower)


def exact_critical_values(spec: str, nobs: int, lags: int = 0, reps: int = EXACT_REPS,
                          seed: int = DEFAULT_SEED) -> dict[str, float]:
    """Finite-sample τ critical values at the user's exact regression size, from ``reps``
    replications (:func:`null_critical_values`)."""
    _check(spec, nobs, reps, lags)
    return null_critical_values(f"tau_{spec}", nobs, lags, reps, seed)


def exact_p_value(statistic: float, spec: str, nobs: int, lags: int = 0, reps: int = EXACT_REPS,
                  seed: int = DEFAULT_SEED) -> float:
    """Finite-sample lower-tail p-value of τ (:func:`null_p_value`)."""
    _check(spec, nobs, reps, lags)
    return null_p_value(statistic, f"tau_{spec}", nobs, lags, reps, seed)[0]


def exact_phi_critical_values(name: str, nobs: int, lags: int = 0, reps: int = EXACT_REPS,
                              seed: int = DEFAULT_SEED) -> dict[str, float]:
    """Finite-sample upper-tail critical values of Φ1, Φ2 or Φ3 (as τ's)."""
    if name not in PHI_SPEC:
        raise ValueError(f"name must be one of {', '.join(PHI_SPEC)}, not {name!r}")
    _check(PHI_SPEC[name], nobs, reps, lags)
    return null_critical_values(name, nobs, lags, reps, seed)


def exact_phi_p_value(statistic: float, name: str, nobs: int, lags: int = 0,
                      reps: int = EXACT_REPS, seed: int = DEFAULT_SEED) -> float:
    """Finite-sample upper-tail p-value of Φ1, Φ2 or Φ3."""
    if name not in PHI_SPEC:
        raise ValueError(f"name must be one of {', '.join(PHI_SPEC)}, not {name!r}")
    _check(PHI_SPEC[name], nobs, reps, lags)
    return null_p_value(statistic, name, nobs, lags, reps, seed)[0]


def exact_critical_value(spec: str, nobs: int, alpha: float, lags: int = 0,
                         reps: int = EXACT_REPS, seed: int = DEFAULT_SEED) -> float:
    """One finite-sample τ critical value at level ``alpha`` (0.01, 0.05 or 0.10)."""
    return exact_critical_values(spec, nobs, lags, reps, seed)[f"{round(alpha * 100):d}%"]


def with_exact_values(test: TestResult, alpha: float, use_lags: bool = True, reps: int = EXACT_REPS,
                      seed: int = DEFAULT_SEED) -> TestResult:
    """The same ADF τ or Φ test judged against its simulated null at the test's own
    regression size (and lag order, unless ``use_lags`` is False): critical values,
    decision and p-value replaced (:func:`null_critical_values`, :func:`null_p_value`);
    other tests, and tests on samples too short to simulate, are returned unchanged."""
    lags = test.lags if use_lags else 0
    level = f"{round(alpha * 100):d}%"
    if test.nobs < lags + 4:
        return test  # too few observations to simulate: the published values stay
    if test.test == "adf":
        name = f"tau_{test.spec}"
    elif test.test in PHI_SPEC:
        name = test.test
    else:
        return test
    values = null_critical_values(name, test.nobs, lags, reps, seed)
    p_value, bound = null_p_value(test.statistic, name, test.nobs, lags, reps, seed)
    reject = test.statistic > values[level] if name in PHI_SPEC else test.statistic < values[level]
    return replace(test, critical_values=values, critical_value=values[level], reject=bool(reject),
                   p_value=p_value, p_value_bound=reportable_bound(p_value, bound))


@dataclass(frozen=True)
class DensityPicture:
    """What the null-distribution chart draws: a density histogram of the simulated draws
    (``edges`` has one more entry than ``heights``) and the standard normal density on
    ``grid`` for comparison (the limit of τ once a drift or trend is present, West 1988)."""

    edges: np.ndarray
    heights: np.ndarray
    grid: np.ndarray
    normal: np.ndarray
    draws: int


def density_picture(draws: np.ndarray, bins: int = 60) -> DensityPicture:
    finite = np.asarray(draws, dtype=float)
    finite = finite[np.isfinite(finite)]
    heights, edges = np.histogram(finite, bins=bins, density=True)
    grid = np.linspace(min(float(edges[0]), -4.5), max(float(edges[-1]), 4.5), 300)
    normal = np.exp(-0.5 * grid * grid) / np.sqrt(2.0 * np.pi)
    return DensityPicture(edges, heights, grid, normal, int(finite.size))
