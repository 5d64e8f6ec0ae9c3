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

from collections.abc import Iterator, Sequence
from dataclasses import dataclass, replace
from functools import lru_cache

import numpy as np

from tauscope.engine.regression.design import SPECS
from tauscope.engine.results import TestResult

DEFAULT_SEED = 19790601
DEFAULT_REPS = 2_000
EXACT_REPS = 10_000
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
PHI_SPEC = {"phi1": "constant", "phi2": "trend", "phi3": "trend"}
_CHUNK_VALUES = 400_000  # floats per chunk of simulated shocks (about 3 MB, cache-friendly)


def _check(spec: str, nobs: int, reps: int, lags: int) -> None:
    if spec not in SPECS:
        raise ValueError(f"spec must be one of {', '.join(SPECS)}, not {spec!r}")
    if lags < 0:
        raise ValueError("lags must be 0 or more")
    if nobs < lags + 4:  # the trend spec needs nobs − (3 + p) ≥ 1 residual degrees of freedom
        raise ValueError(f"nobs = {nobs} is too small for a regression with {lags} lags")
    if reps < 10:
        raise ValueError("reps must be at least 10")


def shock_chunks(length: int, reps: int, seed: int, width: int = 1) -> Iterator[np.ndarray]:
    """Standard normal shocks e_1 … e_length for ``reps`` replications, in chunks of rows.

    ``width`` (regressors per replication) shrinks the chunks so the batched
    design stays near a fixed memory budget.  The stream does not depend on
    the chunk size (rows are drawn in order from one generator)."""
    rng = np.random.default_rng(seed)
    chunk = max(1, _CHUNK_VALUES // max(length * width, 1))
    done = 0
    while done < reps:
        size = min(chunk, reps - done)
        yield rng.standard_normal((size, length))
        done += size


def deterministic_terms(spec: str, nobs: int) -> np.ndarray:
    """Columns of the deterministic part on the regression sample: [], [1] or [1, t]."""
    t = np.arange(1.0, nobs + 1.0)
    if spec == "none":
        return np.empty((nobs, 0))
    if spec == "constant":
        return np.ones((nobs, 1))
    return np.column_stack([np.ones(nobs), t])


@dataclass(frozen=True)
class CrossProducts:
    """Per-replication moments of the regression: Z'Z (r, m, m), Z'y (r, m), y'y (r,),
    with Z = [y_{t−1}, Δy_{t−1}, …, Δy_{t−p}] and y = Δy_t, after partialling
    out fixed deterministic columns (Frisch-Waugh-Lovell):
    Z̃'Z̃ = Z'Z − (Z'Q)(Q'Z), Z̃'ỹ = Z'y − (Z'Q)(Q'y), ỹ'ỹ = y'y − |Q'y|², Q an
    orthonormal basis of the deterministic columns."""

    zz: np.ndarray
    zy: np.ndarray
    yy: np.ndarray

    def partialled(self, columns: Sequence[np.ndarray], y: np.ndarray, terms: np.ndarray) -> CrossProducts:
        """The moments after partialling out ``terms`` from the regressors ``columns``
        (each (r, n)) and the response ``y``."""
        if terms.shape[1] == 0:
            return self
        q, _ = np.linalg.qr(terms)
        zq = np.stack([column @ q for column in columns], axis=1)  # (r, m, d)
        yq = y @ q  # (r, d)
        return CrossProducts(
            self.zz - np.matmul(zq, zq.transpose(0, 2, 1)),
            self.zy - np.einsum("rmd,rd->rm", zq, yq),
            self.yy - np.einsum("rd,rd->r", yq, yq),
        )

    def subset(self, columns: slice) -> CrossProducts:
        return CrossProducts(self.zz[:, columns, columns], self.zy[:, columns], self.yy)


def solve_moments(moments: CrossProducts) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Least squares from cross products: (β̂ (r, m), RSS (r,), diag (Z'Z)^{-1} (r, m)).

    RSS = y'y − β̂'Z'y; these regressions fit far from perfectly, so the
    subtraction loses no meaningful precision."""
    m = moments.zy.shape[1]
    if m == 0:
        empty = np.empty((moments.yy.shape[0], 0))
        return empty, moments.yy, empty
    if m == 1:
        inverse_diag = 1.0 / moments.zz[:, :, 0]
        beta = moments.zy * inverse_diag
    else:
        inverse = np.linalg.inv(moments.zz)
        beta = np.einsum("rml,rl->rm", inverse, moments.zy)
        inverse_diag = np.einsum("rmm->rm", inverse)
    rss = moments.yy - np.einsum("rm,rm->r", beta, moments.zy)
    return beta, rss, inverse_diag


def batched_ols(response: np.ndarray, columns: Sequence[np.ndarray]) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Batched least squares of ``response`` (r, n) on the regressors ``columns`` (each
    (r, n)): (β̂ (r, m), RSS (r,), diag (X'X)^{-1} (r, m))."""
    return solve_moments(raw_moments(columns, response))


def raw_moments(columns: Sequence[np.ndarray], y: np.ndarray) -> CrossProducts:
    """Z'Z, Z'y and y'y per replication from regressor columns given as (r, n) arrays
    (views into the simulated paths: the lagged columns are never copied)."""
    m = len(columns)
    reps = y.shape[0]
    zz = np.empty((reps, m, m))
    zy = np.empty((reps, m))
    for a, first in enumerate(columns):
        zy[:, a] = np.einsum("rn,rn->r", first, y)
        for b in range(a, m):
            zz[:, a, b] = zz[:, b, a] = np.einsum("rn,rn->r", first, columns[b])
    return CrossProducts(zz, zy, np.einsum("rn,rn->r", y, y))


def regression_parts(levels: np.ndarray, lags: int) -> tuple[np.ndarray, list[np.ndarray]]:
    """Response Δy_t and regressors [y_{t−1}, Δy_{t−1}, …, Δy_{t−p}] (views, each (r, n))
    on the regression sample, for paths ``levels`` = (y_0, y_1, …, y_L) in rows;
    nobs = L − p."""
    dy = np.diff(levels, axis=1)  # position i holds Δy_{i+1}
    length = dy.shape[1]
    columns = [levels[:, lags:length]] + [dy[:, lags - i:length - i] for i in range(1, lags + 1)]
    return dy[:, lags:], columns


def random_walks(shocks: np.ndarray) -> np.ndarray:
    """Paths (y_0 = 0, y_1, …, y_L) with y_t = y_{t−1} + e_t."""
    levels = np.zeros((shocks.shape[0], shocks.shape[1] + 1))
    np.cumsum(shocks, axis=1, out=levels[:, 1:])
    return levels


def tau_statistics(levels: np.ndarray, lags: int, spec: str) -> np.ndarray:
    """τ of the ADF regression ``spec`` for each path in ``levels`` (rows y_0 … y_L)."""
    response, regressors = regression_parts(levels, lags)
    terms = deterministic_terms(spec, response.shape[1])
    moments = raw_moments(regressors, response).partialled(regressors, response, terms)
    beta, rss, inv_diag = solve_moments(moments)
    df = response.shape[1] - terms.shape[1] - len(regressors)
    return np.asarray(beta[:, 0] / np.sqrt(rss / df * inv_diag[:, 0]))


def df_statistics(shocks: np.ndarray, lags: int) -> dict[str, np.ndarray]:
    """τ, nobs·γ̂ for every spec and Φ1, Φ2, Φ3 for each simulated random walk
    (one row of shocks each).

    The regression sample is every Δy_t with p lags available, so nobs = L − p
    for L shocks after y_0 = 0.
    """
    response, regressors = regression_parts(random_walks(shocks), lags)
    nobs = response.shape[1]
    raw = raw_moments(regressors, response)
    out: dict[str, np.ndarray] = {}
    rss: dict[str, np.ndarray] = {}
    partialled: dict[str, CrossProducts] = {}
    for spec in SPECS:
        terms = deterministic_terms(spec, nobs)
        partialled[spec] = raw.partialled(regressors, response, terms)
        beta, rss_u, inv_diag = solve_moments(partialled[spec])
        df = nobs - terms.shape[1] - len(regressors)
        out[f"tau_{spec}"] = beta[:, 0] / np.sqrt(rss_u / df * inv_diag[:, 0])
        out[f"rho_{spec}"] = nobs * beta[:, 0]
        rss[spec] = rss_u
    # Restricted models: only the lagged differences (Φ1, Φ2), and a constant with them (Φ3).
    rss_lags = solve_moments(raw.subset(slice(1, None)))[1]
    rss_lags_c = solve_moments(partialled["constant"].subset(slice(1, None)))[1]
    df_c, df_t = nobs - 2 - lags, nobs - 3 - lags
    out["phi1"] = ((rss_lags - rss["constant"]) / 2.0) / (rss["constant"] / df_c)
    out["phi2"] = ((rss_lags - rss["trend"]) / 3.0) / (rss["trend"] / df_t)
    out["phi3"] = ((rss_lags_c - rss["trend"]) / 2.0) / (rss["trend"] / df_t)
    return out


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
    written "below 0.001" (DESIGN.md §7), which is true of any bounded p-value that small."""
    return None if bound == "below" and p_value <= 0.001 else bound


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


def with_exact_values(test: TestResult, alpha: float, use_lags: bool = True, reps: int = EXACT_REPS,
                      seed: int = DEFAULT_SEED) -> TestResult:
    """The same ADF τ or Φ test judged against its simulated null at the test's own
    regression size (and lag order, unless ``use_lags`` is False): critical values,
    decision and p-value replaced; other tests, and tests on samples too short to
    simulate, are returned unchanged."""
    lags = test.lags if use_lags else 0
    level = f"{round(alpha * 100):d}%"
    if test.nobs < lags + 4:
        return test  # too few observations to simulate: the published values stay
    if test.test == "adf":
        draws = null_distribution(test.spec, test.nobs, reps, seed, lags)
        values = lower_critical_values(draws)
        p_value, bound = empirical_p_value(test.statistic, draws)
        reject = test.statistic < values[level]
    elif test.test in PHI_SPEC:
        draws = phi_null_distribution(test.test, test.nobs, reps, seed, lags)
        values = upper_critical_values(draws)
        p_value, bound = empirical_p_value(test.statistic, draws, lower=False)
        reject = test.statistic > values[level]
    else:
        return test
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
