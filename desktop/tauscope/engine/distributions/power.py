"""Power of the ADF test at the user's sample size, by simulation.

The true process is a stationary Gaussian AR(1), y_t = φ·y_{t−1} + e_t with
e_t ~ N(0, 1), started from its stationary distribution y_0 ~ N(0, 1/(1 − φ²))
(y_0 = 0 when φ = 1, which gives the test's size).  For each replication the
ADF regression of the chosen spec with p lags is fitted on ``nobs``
observations and τ is compared with the same critical value the testing
sequence uses (MacKinnon 2010 finite-sample value at nobs, or the simulated
"exact" value).  Power is the share of replications that reject.  τ does not
depend on the error variance, nor on a mean (constant spec) or a linear trend
(trend spec), so these cover every stationary AR(1) alternative with that root.

Vectorised over replications (scipy's ``lfilter`` runs the AR recursion for
all rows at once), with a fixed seed, common random numbers across coefficients, and a
cache.  The samples of one length (shocks after y_0) are the same whatever the spec and lag
order, so τ of every spec and lag order a default search reaches there is computed at once
from window sums (:mod:`tauscope.engine.distributions.every_lag`, which equals the batched
regressions of :mod:`tauscope.engine.distributions.batched` lag by lag) and kept for the run.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np
from scipy.signal import lfilter

from tauscope.engine.distributions.critical import tau_critical_value
from tauscope.engine.distributions.every_lag import every_lag_levels
from tauscope.engine.distributions.exact import default_top_lag
from tauscope.engine.distributions.simulate import (
    DEFAULT_REPS,
    DEFAULT_SEED,
    exact_critical_value,
    shock_chunks,
    tau_statistics,
)
from tauscope.engine.regression.design import SPECS
from tauscope.engine.results import PowerResult

COEFFICIENTS = (0.90, 0.95)



def ar1_paths(shocks: np.ndarray, coefficient: float, start: np.ndarray) -> np.ndarray:
    """Rows (y_0, y_1, …, y_L) of a Gaussian AR(1); ``start`` holds standard normal
    draws scaled here to the stationary variance 1/(1 − φ²) (y_0 = 0 when φ = 1)."""
    y0 = np.zeros(shocks.shape[0]) if coefficient >= 1.0 else start / np.sqrt(1.0 - coefficient**2)
    path = lfilter([1.0], [1.0, -coefficient], shocks, axis=1, zi=(coefficient * y0)[:, None])[0]
    return np.concatenate([y0[:, None], path], axis=1)


def critical_value_for(spec: str, nobs: int, alpha: float, lags: int, critical: str) -> float:
    if critical == "exact":
        return exact_critical_value(spec, nobs, alpha, lags)
    return tau_critical_value(spec, nobs, alpha)


@lru_cache(maxsize=512)
def rejection_rates(spec: str, nobs: int, coefficients: tuple[float, ...], alpha: float, lags: int = 0,
                    reps: int = DEFAULT_REPS, seed: int = DEFAULT_SEED,
                    critical: str = "mackinnon") -> tuple[float, ...]:
    """Share of ``reps`` AR(1) samples (nobs regression observations, p = ``lags``) in
    which τ falls below the critical value at ``alpha``, for each coefficient.

    Every coefficient uses the same shocks and starting draws (common random
    numbers), so a rate does not depend on which other coefficients are asked for
    and the comparison between coefficients is not blurred by simulation noise."""
    if any(not 0.0 < c <= 1.0 for c in coefficients):
        raise ValueError("AR coefficients must be in (0, 1]")
    threshold = critical_value_for(spec, nobs, alpha, lags, critical)
    length = nobs + lags
    if nobs < lags + 4:  # too short for the every-lag sums: this regression alone
        return _one_regression(spec, nobs, coefficients, lags, reps, seed, threshold)
    top = max(lags, default_top_lag(length))
    return tuple(float(np.count_nonzero(alternative_taus(length, c, top, reps, seed)[lags][spec] < threshold)) / reps
                 for c in coefficients)


def _one_regression(spec: str, nobs: int, coefficients: tuple[float, ...], lags: int, reps: int, seed: int,
                    threshold: float) -> tuple[float, ...]:
    starts = np.random.default_rng(seed + 1)  # a stream apart from the shocks
    rejections = np.zeros(len(coefficients), dtype=np.int64)
    for shocks in shock_chunks(nobs + lags, reps, seed, width=2 + lags):
        start = np.asarray(starts.standard_normal(shocks.shape[0]))
        for i, coefficient in enumerate(coefficients):
            tau = tau_statistics(ar1_paths(shocks, coefficient, start), lags, spec)
            rejections[i] += int(np.count_nonzero(tau < threshold))
    return tuple(float(r) / reps for r in rejections)


@lru_cache(maxsize=64)
def alternative_taus(length: int, coefficient: float, top: int, reps: int, seed: int
                     ) -> dict[int, dict[str, np.ndarray]]:
    """lag → spec → τ of ``reps`` AR(1) samples of ``length`` shocks after y_0 (the shocks of
    :func:`shock_chunks` with ``seed``, the starts from seed + 1), for every lag order 0 …
    ``top`` the sample allows (nobs = length − p ≥ p + 4) at once
    (:func:`~tauscope.engine.distributions.every_lag.every_lag_levels`): every (spec, lag)
    the run asks for at this length and coefficient reads the same paths."""
    lags = [p for p in range(top + 1) if length - p >= p + 4]
    starts = np.random.default_rng(seed + 1)  # a stream apart from the shocks
    parts: dict[int, dict[str, list[np.ndarray]]] = {p: {s: [] for s in SPECS} for p in lags}
    for shocks in shock_chunks(length, reps, seed, width=2 + top):
        start = np.asarray(starts.standard_normal(shocks.shape[0]))
        statistics = every_lag_levels(ar1_paths(shocks, coefficient, start), lags)
        for p in lags:
            for spec in SPECS:
                parts[p][spec].append(statistics[p][f"tau_{spec}"])
    return {p: {spec: np.concatenate(values) for spec, values in by_spec.items()} for p, by_spec in parts.items()}


def rejection_rate(spec: str, nobs: int, coefficient: float, alpha: float, lags: int = 0,
                   reps: int = DEFAULT_REPS, seed: int = DEFAULT_SEED,
                   critical: str = "mackinnon") -> float:
    """Simulated rejection rate of τ against one AR(1) coefficient."""
    return rejection_rates(spec, nobs, (float(coefficient),), alpha, lags, reps, seed, critical)[0]


def power_at(spec: str, nobs: int, alpha: float, lags: int = 0,
             coefficients: tuple[float, ...] = COEFFICIENTS, reps: int = DEFAULT_REPS,
             seed: int = DEFAULT_SEED, critical: str = "mackinnon") -> PowerResult:
    """Power of τ against each AR(1) coefficient at this sample size and spec."""
    rates = rejection_rates(spec, nobs, tuple(float(c) for c in coefficients), alpha, lags, reps, seed,
                            critical)
    return PowerResult(spec, nobs, lags, alpha, critical_value_for(spec, nobs, alpha, lags, critical),
                       tuple(coefficients), rates, reps)
