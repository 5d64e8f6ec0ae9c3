"""Numbers for the chart that goes with the seasonal unit-root reading.

One line per season (each quarter or month) across the years, after removing the
yearly average: x_{j,s} = y_{jS+s} − (1/S) Σ_{r} y_{jS+r} for year j and season s.
With fixed seasonal means the lines run roughly parallel (a stable pattern); with a
seasonal unit root they wander and cross, the picture behind "the seasonal pattern
wanders from year to year" (the display of seasonal sub-series is common practice;
the link to seasonal unit roots is Hylleberg, Engle, Granger & Yoo 1990).
Plain numpy, no plotting here.
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from tauscope.engine.seasonal.design import check_period


def seasonal_lines(
    values: Sequence[float] | np.ndarray, period: int, first_season: int = 0
) -> np.ndarray:
    """(years, S) array: row j is year j, column s the season (0 = first quarter or
    January), each value minus its year's mean; incomplete years at either end are
    padded with NaN and their means taken over the seasons present.

    ``first_season`` is the season of the first observation (0 … S − 1)."""
    check_period(period)
    if not 0 <= first_season < period:
        raise ValueError(f"first_season must be between 0 and {period - 1}")
    y = np.asarray(values, dtype=float).ravel()
    total = first_season + y.size
    years = -(-total // period)
    flat = np.full(years * period, np.nan)
    flat[first_season:total] = y
    grid = flat.reshape(years, period)
    with np.errstate(all="ignore"):
        counts = np.sum(np.isfinite(grid), axis=1, keepdims=True)
        means = np.where(counts > 0, np.nansum(grid, axis=1, keepdims=True) / counts, np.nan)
    return grid - means
