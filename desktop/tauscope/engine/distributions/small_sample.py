"""Φ1, Φ2, Φ3 critical values below the smallest size Dickey & Fuller (1981) tabulate.

Their Tables IV-VI start at n = 25; reusing that row for shorter regressions makes a 5%
test reject a true null 7-8.5% of the time at n = 12-15.  Below n = 25 the values are
therefore simulated at the regression's own size: a driftless Gaussian random walk,
the regressions of :func:`tauscope.engine.distributions.simulate.df_statistics` without
lagged differences (as in the tables), upper quantiles of

    Φ = ((RSS_r − RSS_u)/q) / (RSS_u/(n − k_u)).

Vectorised and streamed in chunks with a fixed seed, so a size always gives the same
numbers; only the quantiles are kept (cached per size).  With 500,000 replications the
Monte Carlo standard error of the 1% quantile, sqrt(p(1 − p)/R)/f(q), is about 0.01-0.02
at these sizes (the density f is low out there); at 5% and 10% it is under 0.01.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.simulate import df_statistics, shock_chunks

PHI_NAMES = ("phi1", "phi2", "phi3")
SMALL_PHI_REPS = 500_000
SMALL_PHI_SEED = 19810701
SMALLEST = 4  # the trend spec needs n − 3 ≥ 1 residual degrees of freedom
UPPER = {"1%": 0.99, "5%": 0.95, "10%": 0.90}


def simulated_phi_draws(nobs: int, reps: int, seed: int) -> dict[str, np.ndarray]:
    """Φ1, Φ2, Φ3 under the null for ``reps`` random walks with ``nobs`` regression
    observations and no lagged differences."""
    if nobs < SMALLEST:
        raise ValueError(f"nobs = {nobs} is too small for the Φ regressions")
    parts: dict[str, list[np.ndarray]] = {name: [] for name in PHI_NAMES}
    for shocks in shock_chunks(nobs, reps, seed, width=2):
        statistics = df_statistics(shocks, 0)
        for name in PHI_NAMES:
            parts[name].append(statistics[name])
    return {name: np.concatenate(values) for name, values in parts.items()}


@lru_cache(maxsize=64)
def _simulated_values(nobs: int, reps: int, seed: int) -> dict[str, dict[str, float]]:
    draws = simulated_phi_draws(nobs, reps, seed)
    return {name: {level: float(np.quantile(values, q)) for level, q in UPPER.items()}
            for name, values in draws.items()}


def small_sample_phi_values(name: str, nobs: int, reps: int = SMALL_PHI_REPS,
                            seed: int = SMALL_PHI_SEED) -> dict[str, float]:
    """Simulated upper-tail critical values of Φ ``name`` at 1%, 5% and 10% for a
    regression on ``nobs`` observations (a fresh dict each call)."""
    if name not in PHI_NAMES:
        raise ValueError(f"name must be one of {', '.join(PHI_NAMES)}, not {name!r}")
    return dict(_simulated_values(int(nobs), int(reps), int(seed))[name])
