"""Simulated ("exact") critical values precise to about ±0.01 at 1%.

The Monte Carlo standard error of a simulated p-quantile is sqrt(p(1 − p)/R)/f(q), f the
density at the quantile.  For τ at 1%, f ≈ 0.02-0.03, so 10,000 replications leave an
error of 0.03-0.05 (one in twenty values off by 0.06 or more) and ±0.01 with 95%
confidence needs R ≈ 10⁶.  The replications are therefore streamed through the
vectorised regressions of :mod:`tauscope.engine.distributions.batched` in chunks (the
draws are kept only until their quantiles are taken, about 80 MB for a moment), the
quantiles are cached per (nobs, lags, R, seed), and each comes with its own standard
error from B = 10 independent batches of the stream, sd(q̂_b)/sqrt(B) (batch means, e.g.
Asmussen & Glynn 2007, Stochastic Simulation, §III.5).  The 1% value of the Φ statistics
has a flatter density out there (f ≈ 0.01), so its error is about 0.01-0.015 at this R.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.batched import df_statistics, shock_chunks

EXACT_REPS = 1_000_000
BATCHES = 10
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
UPPER_TAIL = ("phi1", "phi2", "phi3")


@dataclass(frozen=True)
class Quantiles:
    """Critical values of one statistic at 1%, 5%, 10% (lower tail for τ, upper for Φ)
    and their Monte Carlo standard errors (batch means)."""

    values: dict[str, float]
    standard_errors: dict[str, float]


def _quantiles(draws: np.ndarray, upper: bool) -> Quantiles:
    probabilities = [1.0 - a if upper else a for a in LEVELS.values()]
    values = np.quantile(draws, probabilities)
    batches = np.array([np.quantile(part, probabilities) for part in np.array_split(draws, BATCHES)])
    errors = batches.std(axis=0, ddof=1) / math.sqrt(BATCHES)
    return Quantiles({level: float(v) for level, v in zip(LEVELS, values, strict=True)},
                     {level: float(e) for level, e in zip(LEVELS, errors, strict=True)})


@lru_cache(maxsize=256)
def streamed_quantiles(nobs: int, lags: int, reps: int, seed: int) -> dict[str, Quantiles]:
    """τ (``tau_<spec>``) and Φ critical values at regression size ``nobs`` with ``lags``
    lagged differences, from ``reps`` random walks (the stream of
    :func:`~tauscope.engine.distributions.batched.shock_chunks` with ``seed``, so the first
    draws equal those of :func:`~tauscope.engine.distributions.simulate.null_distribution`)."""
    parts: dict[str, list[np.ndarray]] = {}
    for shocks in shock_chunks(nobs + lags, reps, seed, width=2 + lags):
        for key, values in df_statistics(shocks, lags).items():
            if key.startswith("tau_") or key in UPPER_TAIL:
                parts.setdefault(key, []).append(values)
    return {key: _quantiles(np.concatenate(values), key in UPPER_TAIL) for key, values in parts.items()}
