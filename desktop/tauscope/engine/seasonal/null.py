"""Where a seasonal unit-root test gets its null distribution: the shipped table or a simulation.

For the cross-check's design (seasonal dummies) at the default replications and seed, a
request the table covers (:func:`tauscope.engine.seasonal.table_grid.seasonal_quantiles`) is
read from it: critical values are the stored quantiles at 1, 5, 10% (lower tail for t, upper
for F), interpolated in 1/df between grid lengths, from the ``REPS`` replications of the
cells read; a p-value is the distribution function interpolated between the stored quantiles, linear in the
normal score (``exact_grid.distribution_at``), bounded "below 0.001" beyond the outermost
quantile on the rejecting side.  Any other request simulates at the series' own length
(:mod:`~tauscope.engine.seasonal.critical`: ``reps`` replications, p-values between order
statistics, None beyond every draw).  The one-series test and the batched one both come
here, so they read the same numbers.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from scipy.special import ndtr, ndtri

from tauscope.engine.distributions.exact_grid import PROBABILITIES, quantile_at
from tauscope.engine.seasonal.critical import (
    DEFAULT_REPS,
    DEFAULT_SEED,
    LEVELS,
    critical_values,
    p_values_sorted,
    sorted_draws,
)
from tauscope.engine.seasonal.design import statistics_for
from tauscope.engine.seasonal.table_grid import seasonal_quantiles, table_reps

_SCORES = ndtri(np.array(PROBABILITIES))
_LOWEST = PROBABILITIES[0]


@dataclass(frozen=True)
class SeasonalNull:
    """Critical values ({statistic: {"1%", "5%", "10%"}}), the replications behind them, whether
    they were read from the table, and the p-values of statistics of each column."""

    critical_values: dict[str, dict[str, float]]
    reps: int
    tabulated: bool
    _sorted: np.ndarray | None = None  # (k, reps) sorted draws, when simulated
    _quantiles: tuple[np.ndarray, ...] | None = None  # per statistic, when read

    def p_values(self, column: int, values: np.ndarray, kind: str
                 ) -> tuple[list[float | None], list[str | None]]:
        """(p-values, bounds) of ``values`` of statistic ``column`` (``kind`` "t": lower tail,
        "F": upper tail).  Simulated: None beyond every draw; read: 0.001 with bound "below"
        beyond the stored quantile at 0.1% (0.999) on the rejecting side."""
        if self._sorted is not None:
            found = p_values_sorted(self._sorted[column], values, kind)
            return found, [None] * len(found)
        assert self._quantiles is not None
        return _table_p_values(self._quantiles[column], np.asarray(values, dtype=float), kind)


def _table_p_values(quantiles: np.ndarray, values: np.ndarray, kind: str
                    ) -> tuple[list[float | None], list[str | None]]:
    with np.errstate(invalid="ignore"):
        shares = ndtr(np.interp(values, quantiles, _SCORES))
        if kind == "t":
            p, beyond, inside = shares, values < quantiles[0], values > quantiles[-1]
        else:
            p, beyond, inside = 1.0 - shares, values > quantiles[-1], values < quantiles[0]
    out: list[float | None] = []
    bounds: list[str | None] = []
    # plain Python values first (tolist gives each float as float(v) does)
    for value, share, far, near in zip(values.tolist(), np.asarray(p).tolist(), beyond.tolist(),
                                       inside.tolist(), strict=True):
        if not math.isfinite(value):
            out.append(None)
            bounds.append(None)
        elif far:
            out.append(_LOWEST)
            bounds.append("below")
        else:
            out.append(1.0 if near else share)
            bounds.append(None)
    return out, bounds


def seasonal_null(period: int, deterministic: str, n: int, lags: int,
                  reps: int = DEFAULT_REPS, seed: int = DEFAULT_SEED) -> SeasonalNull:
    """The null distribution of the test (period, deterministic) of ``n`` values with ``lags``
    lags: read from the table when it covers the request at the default ``reps`` and
    ``seed``, else simulated with them."""
    read = None
    if reps == DEFAULT_REPS and seed == DEFAULT_SEED:
        read = seasonal_quantiles(period, deterministic, int(n), int(lags))
    if read is None:
        return SeasonalNull(critical_values(period, deterministic, n, lags, reps, seed), reps, False,
                            _sorted=sorted_draws(period, deterministic, n, lags, reps, seed))
    table: dict[str, dict[str, float]] = {}
    for stat in statistics_for(period):
        table[stat.name] = {
            label: quantile_at(read[stat.name], size if stat.kind == "t" else 1.0 - size)
            for label, size in LEVELS.items()}
    return SeasonalNull(table, table_reps(period, int(n)), True,
                        _quantiles=tuple(read[stat.name] for stat in statistics_for(period)))
