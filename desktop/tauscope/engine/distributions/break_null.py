"""Critical values and p-values of the minimum LM break statistic (Lee & Strazicich 2013,
model A), simulated at the series' own length.

Under the null (a unit root whose level may jump once) the statistic's distribution
does not depend on the size or the place of the jump nor on the drift (Lee & Strazicich
2013), so it is simulated from Gaussian random walks y_t = Σ_{s≤t} ε_s without a break:
the statistic without lags at every candidate break, from prefix sums
(:func:`tauscope.engine.unitroot.lm_break.lm_statistic_no_lags`), minimised over the
candidates.  A fixed seed makes the values the same on every run; the sorted draws are
cached per (length, replications, seed).  With 20,000 replications the Monte Carlo
standard error of the 5% quantile is about 0.01 and of the 1% quantile about 0.02.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from tauscope.engine.unitroot.lm_break import TRIM, candidate_positions, lm_statistic_no_lags

BREAK_REPS = 20_000
BREAK_SEED = 20_130_404
_CHUNK_VALUES = 1_000_000
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}


@lru_cache(maxsize=64)
def break_null_draws(length: int, reps: int = BREAK_REPS, seed: int = BREAK_SEED,
                     trim: float = TRIM) -> np.ndarray:
    """Sorted simulated minimum LM statistics for series of ``length`` observations."""
    rng = np.random.default_rng(seed)
    positions = candidate_positions(length, trim)
    chunk = max(1, _CHUNK_VALUES // (length + positions.shape[0]))
    out = np.empty(reps)
    for start in range(0, reps, chunk):
        size = min(chunk, reps - start)
        paths = np.cumsum(rng.standard_normal((size, length)), axis=1)
        out[start:start + size] = lm_statistic_no_lags(paths, positions).min(axis=1)
    out.sort()
    out.setflags(write=False)
    return out


def break_critical_values(length: int, reps: int = BREAK_REPS, seed: int = BREAK_SEED,
                          trim: float = TRIM) -> dict[str, float]:
    """The 1%, 5% and 10% quantiles of the simulated null at ``length`` observations (a
    fresh dict; the quantiles are computed once per key)."""
    return dict(_break_quantiles(length, reps, seed, trim))


@lru_cache(maxsize=64)
def _break_quantiles(length: int, reps: int, seed: int, trim: float) -> tuple[tuple[str, float], ...]:
    draws = break_null_draws(length, reps, seed, trim)
    return tuple((label, float(np.quantile(draws, level))) for label, level in LEVELS.items())


def break_p_value(statistic: float, length: int, reps: int = BREAK_REPS, seed: int = BREAK_SEED,
                  trim: float = TRIM) -> tuple[float, str | None]:
    """(p-value, bound): (1 + the number of simulated statistics at or below
    ``statistic``) / (1 + reps), the usual Monte Carlo p-value; the bound is always None
    (below 1 / (1 + reps) the reading says "below 0.001")."""
    draws = break_null_draws(length, reps, seed, trim)
    count = int(np.searchsorted(draws, statistic, side="right"))
    return (1 + count) / (1 + reps), None
