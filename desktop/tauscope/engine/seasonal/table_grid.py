"""The grid of the seasonal unit-root null table and how it is read.

The table (the modules of :data:`PARTS`, ``table_quarterly_short`` …, written by
:mod:`~tauscope.engine.seasonal.table_make`) holds, for seasonal dummies in the regression
(the cross-check's design), each period S (4, 12), each series length n on :data:`LENGTHS`
and each lag order p that a default search reaches before the next length, the quantiles at
:data:`~tauscope.engine.distributions.exact_grid.PROBABILITIES` of every statistic of
``design.statistics_for(S)`` (HEGY 1990; Beaulieu & Miron 1993) under the seasonal random
walk of :func:`tauscope.engine.seasonal.critical.simulate`, from ``REPS`` walks (each module's) with
that simulation's seed: a cell holds the direct simulation's quantiles at that many
replications, to rounding (10⁻⁴).

A request (S, n, p) is read at its own lag from the two cells whose lengths bracket n,
interpolated linearly in 1/df, df = n − 2S − 2p − S the regression's residual degrees of
freedom (finite-sample terms of such quantiles are close to polynomials in 1/T: MacKinnon
1994, 2010; the τ and DF-GLS tables are read the same way).  A request the grid does not
bracket, or whose lag the shorter cell cannot hold, gets ``None`` (the caller simulates);
``benchmarks/seasonal_table_check.py`` measures the rest against direct simulation.
"""

from __future__ import annotations

import bisect
import importlib
from functools import lru_cache
from types import ModuleType

import numpy as np

from tauscope.engine.distributions.exact_grid import decode
from tauscope.engine.regression.design import schwert_max_lag
from tauscope.engine.seasonal.design import n_deterministic, statistics_for

DETERMINISTIC = "dummies"  # the only design tabulated
LENGTHS = {
    4: (24, 28, 32, 40, 52, 72, 100, 140, 200, 280, 400),
    12: (48, 60, 72, 96, 120, 168, 240, 360, 480),
}

# the generated modules (each under the 400-line limit): name → (period, its grid lengths)
PARTS = {
    "table_quarterly_short": (4, LENGTHS[4][:6]),
    "table_quarterly_long": (4, LENGTHS[4][6:]),
    "table_monthly_short": (12, LENGTHS[12][:5]),
    "table_monthly_long": (12, LENGTHS[12][5:]),
}


def _room(period: int, length: int) -> int:
    """The largest lag the regression fits at ``length`` with 10 residual degrees of freedom
    (``critical.minimum_length``: 2S + 2p + d + 10 ≤ n)."""
    return (length - 2 * period - n_deterministic(DETERMINISTIC, period) - 10) // 2


def _df(period: int, length: int, lags: int) -> int:
    return length - 2 * period - 2 * lags - n_deterministic(DETERMINISTIC, period)


def table_lags(period: int, length: int) -> tuple[int, ...]:
    """The lags held at grid length ``length``: 0 up to Schwert's (1989) maximum at the next
    grid length (every default search between two lengths is bracketed; at the last length its
    own), within what the regression fits at ``length``."""
    grid = LENGTHS[period]
    i = grid.index(length)
    reach = schwert_max_lag(grid[min(i + 1, len(grid) - 1)])
    return tuple(range(min(reach, _room(period, length)) + 1))


def names(period: int) -> tuple[str, ...]:
    """The statistics stored for ``period``, in the table's order."""
    return tuple(stat.name for stat in statistics_for(period))


def _parts(period: int) -> list[ModuleType]:
    """The generated modules of ``period``'s cells (none before the maker's first run)."""
    found = []
    for name, (owner, _) in PARTS.items():
        if owner != period:
            continue
        try:
            found.append(importlib.import_module(f"tauscope.engine.seasonal.{name}"))
        except ImportError:  # not generated yet
            continue
    return found


@lru_cache(maxsize=2)
def _table(period: int) -> dict[tuple[int, int], dict[str, np.ndarray]]:
    out: dict[tuple[int, int], dict[str, np.ndarray]] = {}
    for module in _parts(period):
        if module.CELLS:
            out.update(decode(module.CELLS, module.DATA, names(period)))
    return out


def part_of(period: int, length: int) -> str:
    """The name of the module of :data:`PARTS` that holds grid length ``length``."""
    return next(name for name, (owner, lengths) in PARTS.items()
                if owner == period and length in lengths)


def _part_reps(name: str) -> int:
    try:
        module = importlib.import_module(f"tauscope.engine.seasonal.{name}")
    except ImportError:  # not generated yet
        return 0
    return int(module.REPS) if module.CELLS else 0


def table_reps(period: int | None = None, length: int | None = None) -> int:
    """The replications behind the table's cells (0 where nothing is generated).

    Each module of :data:`PARTS` states its own.  For (``period``, ``length``): the fewer of
    the two grid lengths that bracket ``length`` (a value read between two lengths is no more
    precise than its less precise cell; 0 when either is not generated); without them, the
    fewest over the generated parts."""
    if period is None:
        found = [reps for reps in map(_part_reps, PARTS) if reps]
        return min(found) if found else 0
    grid = LENGTHS[period]
    i = bisect.bisect_left(grid, length if length is not None else grid[0])
    if i == len(grid):
        return 0
    around = grid[i:i + 1] if grid[i] == length else grid[max(i - 1, 0):i + 1]
    return min(_part_reps(part_of(period, n)) for n in around)


def table_errors(period: int) -> dict[tuple[int, int], tuple[float, ...]]:
    """(n, p) → batch-means SE of each statistic's 1% critical value (``statistics_for``
    order), as the maker measured them."""
    out: dict[tuple[int, int], tuple[float, ...]] = {}
    for module in _parts(period):
        out.update(module.SE_1)
    return out


@lru_cache(maxsize=1024)
def seasonal_quantiles(period: int, deterministic: str, length: int, lags: int
                       ) -> dict[str, np.ndarray] | None:
    """Statistic name → its quantiles at
    :data:`~tauscope.engine.distributions.exact_grid.PROBABILITIES` for a series of ``length``
    values and ``lags`` lags, read from the table, or None when it does not cover the request;
    read-only arrays."""
    if deterministic != DETERMINISTIC or period not in LENGTHS:
        return None
    table, grid = _table(period), LENGTHS[period]
    i = bisect.bisect_left(grid, length)
    if not table or i == len(grid):
        return None
    if grid[i] == length:
        cell = table.get((length, lags))
        if cell is None:
            return None
        out = {name: np.array(values) for name, values in cell.items()}
    elif i == 0:
        return None
    else:
        short, long = grid[i - 1], grid[i]
        low, high = table.get((short, lags)), table.get((long, lags))
        if low is None or high is None:
            return None
        x = 1.0 / _df(period, length, lags)
        x0, x1 = 1.0 / _df(period, short, lags), 1.0 / _df(period, long, lags)
        w = (x - x1) / (x0 - x1)
        out = {name: np.asarray(w * low[name] + (1.0 - w) * high[name]) for name in low}
    for values in out.values():
        values.setflags(write=False)
    return out
