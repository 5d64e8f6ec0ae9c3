"""The grid of the exact critical-value table and how it is read.

The table (:mod:`tauscope.engine.distributions.exact_table`, written by
:mod:`~tauscope.engine.distributions.exact_table_make`) holds, for each series length L on
:data:`LENGTH_GRID` (shocks per path) and lag order p on :data:`LAG_GRID`, the quantiles at
:data:`PROBABILITIES` of τ (three specs) and Φ1, Φ2, Φ3 of the ADF regression on nobs = L − p
observations, each from 10⁶ random walks.  A request (nobs, p) is read at its own lag p from
the two cells whose lengths bracket nobs + p, interpolated linearly in 1/nobs (finite-sample
terms of these quantiles are close to polynomials in 1/T, MacKinnon 1994, 2010; the union's
table is read the same way).  Every lag order has its own cells: at a fixed nobs the quantiles
move in steps of two lags (0 ≈ 1, 2 ≈ 3, …), so reading between lags is not linear
(``benchmarks/exact_table_check.py``).  A request the grid does not bracket gets ``None`` (the
caller simulates).  A p-value is the
interpolated distribution function at the statistic, linear in the normal score of the
probability between stored quantiles; beyond the outermost quantiles it is bounded.
"""

from __future__ import annotations

import base64
import bisect
import lzma
from functools import lru_cache
from statistics import NormalDist

import numpy as np

LENGTH_GRID = (25, 35, 50, 75, 110, 160, 250, 400)
LAG_GRID = tuple(range(21))  # every lag: the quantiles move in steps of two lags, not linearly
_LOWER = (0.001, 0.0025, 0.005, 0.01, 0.02, 0.025, 0.03, 0.05, 0.075, 0.10, 0.15, 0.20, 0.30,
          0.40)
PROBABILITIES = (*_LOWER, 0.5, *(round(1.0 - p, 4) for p in reversed(_LOWER)))
TABLE_STATISTICS = ("tau_none", "tau_constant", "tau_trend", "phi1", "phi2", "phi3")
UNIT = 1e-4  # quantiles are stored rounded to this
_SCORES = np.array([NormalDist().inv_cdf(p) for p in PROBABILITIES])


def _schwert(length: int) -> int:
    return int(np.floor(12.0 * (length / 100.0) ** 0.25))


def table_lags(length: int) -> tuple[int, ...]:
    """The grid lags held at ``length``: up to the lag Schwert's (1989) rule allows at the next
    grid length (so every default search between two lengths is bracketed), at most
    ⌊(L + 1)/2⌋ − 3 (the engine's lag cap)."""
    i = LENGTH_GRID.index(length)
    above = LENGTH_GRID[min(i + 1, len(LENGTH_GRID) - 1)]
    wanted = _schwert(above + 1)
    cap = (length + 1) // 2 - 3
    lags = [p for p in LAG_GRID if p <= cap]
    reach = next((p for p in LAG_GRID if p >= wanted), LAG_GRID[-1])
    return tuple(p for p in lags if p <= reach)


def decode(cells: tuple[tuple[int, int], ...], data: str, names: tuple[str, ...] = TABLE_STATISTICS
           ) -> dict[tuple[int, int], dict[str, np.ndarray]]:
    """The table's quantiles: (length, lag) → statistic (``names``, in the order written) →
    values at :data:`PROBABILITIES`."""
    raw = np.frombuffer(lzma.decompress(base64.b64decode(data)), dtype="<i4")
    values = np.cumsum(raw.reshape(len(cells), len(names), len(PROBABILITIES)), axis=2) * UNIT
    return {key: {name: values[c, s] for s, name in enumerate(names)}
            for c, key in enumerate(cells)}


@lru_cache(maxsize=1)
def _table() -> dict[tuple[int, int], dict[str, np.ndarray]]:
    try:
        from tauscope.engine.distributions import exact_table
    except ImportError:  # not generated yet
        return {}
    return decode(exact_table.CELLS, exact_table.DATA)


def _at_lag(table: dict[tuple[int, int], dict[str, np.ndarray]], name: str, nobs: int, lag: int
            ) -> np.ndarray | None:
    length = nobs + lag
    i = bisect.bisect_left(LENGTH_GRID, length)
    if i < len(LENGTH_GRID) and LENGTH_GRID[i] == length:
        cell = table.get((length, lag))
        return None if cell is None else cell[name]
    if i == 0 or i == len(LENGTH_GRID):
        return None
    short, long = LENGTH_GRID[i - 1], LENGTH_GRID[i]
    low, high = table.get((short, lag)), table.get((long, lag))
    if low is None or high is None:
        return None
    x, x0, x1 = 1.0 / nobs, 1.0 / (short - lag), 1.0 / (long - lag)
    w = (x - x1) / (x0 - x1)
    return np.asarray(w * low[name] + (1.0 - w) * high[name])


@lru_cache(maxsize=4096)
def table_quantiles(name: str, nobs: int, lags: int) -> np.ndarray | None:
    """The quantiles of ``name`` at :data:`PROBABILITIES` for the regression (nobs, lags),
    interpolated from the table, or None when the grid does not bracket the request."""
    table = _table()
    if not table or lags not in LAG_GRID:
        return None
    out = _at_lag(table, name, nobs, lags)
    if out is not None:
        out.setflags(write=False)
    return out


def quantile_at(quantiles: np.ndarray, probability: float) -> float:
    """The stored quantile at ``probability`` (one of :data:`PROBABILITIES`)."""
    return float(quantiles[PROBABILITIES.index(round(probability, 4))])


def distribution_at(quantiles: np.ndarray, statistic: float) -> tuple[float, str | None]:
    """F(statistic) from the stored quantiles, linear in the normal score between them;
    (0.001, "below") or (0.999, "above") beyond the outermost ones."""
    if statistic < quantiles[0]:
        return PROBABILITIES[0], "below"
    if statistic > quantiles[-1]:
        return PROBABILITIES[-1], "above"
    score = float(np.interp(statistic, quantiles, _SCORES))
    return NormalDist().cdf(score), None
