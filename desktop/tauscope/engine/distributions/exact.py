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

A run reads these values from a table simulated once (:mod:`~tauscope.engine.distributions.exact_grid`);
what the table does not hold is simulated here per series length: the random walks of L
shocks serve every lag order p (nobs = L − p), so :func:`length_nulls` simulates every lag a
default search reaches at that length at once (:mod:`~tauscope.engine.distributions.every_lag`)
and keeps them for the whole run; :func:`streamed_quantiles` is the same one key at a time.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.batched import df_statistics, shock_chunks
from tauscope.engine.distributions.every_lag import STATISTICS, every_lag_statistics

EXACT_REPS = 1_000_000
BATCHES = 10
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
UPPER_TAIL = ("phi1", "phi2", "phi3")
_LENGTH_CHUNK_VALUES = 2_000_000  # shocks drawn at once for every lag of one length
_HELD_VALUES = 25_000_000  # draws held at once (float64) while a length's quantiles are taken


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


@dataclass(frozen=True)
class LagNull:
    """One lag order's simulated null at one series length: the critical values (with their
    standard errors) of each τ and Φ, and the first draws of each, kept for p-values."""

    quantiles: dict[str, Quantiles]
    kept: dict[str, np.ndarray]


def default_top_lag(length: int) -> int:
    """The largest lag order a default search reaches on a series whose regressions have
    ``length`` shocks (T = length + 1 values): Schwert's (1989) ⌊12 (T/100)^{1/4}⌋, within the
    engine's cap ⌊T/2⌋ − 3 (:mod:`tauscope.engine.regression.design`)."""
    values = length + 1
    return max(0, min(int(np.floor(12.0 * (values / 100.0) ** 0.25)), values // 2 - 3))


def _lag_group(length: int, lags: list[int], names: list[str], reps: int, seed: int,
               keep: int) -> dict[int, LagNull]:
    draws = {p: {name: np.empty(reps) for name in names} for p in lags}
    rng = np.random.default_rng(seed)  # rows in order: the stream of shock_chunks
    done = 0
    while done < reps:
        size = min(_LENGTH_CHUNK_VALUES // length + 1, reps - done)
        statistics = every_lag_statistics(rng.standard_normal((size, length)), lags)
        for p in lags:
            for name in names:
                draws[p][name][done:done + size] = statistics[p][name]
        done += size
    out = {}
    for p in lags:
        kept = {name: values[:keep].copy() for name, values in draws[p].items()}
        for values in kept.values():
            values.setflags(write=False)
        out[p] = LagNull({name: _quantiles(draws[p][name], name in UPPER_TAIL) for name in names}, kept)
    return out


@lru_cache(maxsize=8)
def length_nulls(length: int, top: int, reps: int, seed: int, keep: int) -> dict[int, LagNull]:
    """Every lag order 0 … ``top`` at one series length (``length`` shocks per path) from the
    stream of ``reps`` random walks that :func:`streamed_quantiles` draws at nobs = length − p
    (so the quantiles are its own, to rounding), through
    :func:`~tauscope.engine.distributions.every_lag.every_lag_statistics`; the first ``keep``
    draws of each statistic are kept for p-values.  Lags are taken a few at a time (the
    stream drawn again for each group) so the draws held stay near 200 MB."""
    lags = [p for p in range(top + 1) if length - p >= p + 4]
    names = [name for name in STATISTICS if name.startswith("tau_") or name in UPPER_TAIL]
    size = max(1, _HELD_VALUES // (reps * len(names)))
    out: dict[int, LagNull] = {}
    for first in range(0, len(lags), size):
        out.update(_lag_group(length, lags[first:first + size], names, reps, seed, keep))
    return out


def lag_null(nobs: int, lags: int, reps: int, seed: int, keep: int) -> LagNull:
    """The simulated null of the regression (nobs, lags), from the cache of its series length
    (every lag a default search reaches there, simulated together)."""
    length = nobs + lags
    return length_nulls(length, max(lags, default_top_lag(length)), reps, seed, keep)[lags]
