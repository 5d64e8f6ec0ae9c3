"""The grid of the DF-GLS null table and how it is read.

The table (:mod:`tauscope.engine.distributions.dfgls_table`, written by
:mod:`~tauscope.engine.distributions.dfgls_table_make`) holds, for each series length T on
:data:`DFGLS_LENGTHS` and each fixed lag order p that a default search reaches before the next
length, the quantiles at :data:`~tauscope.engine.distributions.exact_grid.PROBABILITIES` of the
DF-GLS t ratio (Elliott, Rothenberg & Stock 1996; constant and trend) under a driftless Gaussian
random walk of T values, each from 10⁶ walks with the seed of the direct simulation
(:func:`tauscope.engine.unitroot.dfgls.dfgls_null_distribution`), so a cell holds that
simulation's quantiles to rounding.  A request (spec, T, p) is read at its own lag from the two
cells whose lengths bracket T, interpolated linearly in 1/df, df = T − 2 − 2p the regression's
residual degrees of freedom (finite-sample terms of such quantiles are close to polynomials in
1/T: MacKinnon 1994, 2010; Cheung & Lai 1995 fit the DF-GLS ones in T and p, from memory; with many lags on
a short series the distortion follows df rather than T: read in 1/T, the 1% value at T = 30,
9 lags was off by 0.2, in 1/df by 0.08, hence the lengths 30 and 40 on the grid), as the τ
table is read (:mod:`~tauscope.engine.distributions.exact_grid`); every lag has its own cells.
A request the grid does not bracket, or one whose shorter cell keeps fewer than
:data:`MIN_DF` residual degrees of freedom (T between 25 and 30 with 7 or 8 lags), gets
``None`` (the caller simulates); ``benchmarks/dfgls_table_check.py`` measures the rest.
"""

from __future__ import annotations

import bisect
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.exact_grid import decode

DFGLS_LENGTHS = (25, 30, 35, 40, 50, 75, 110, 160, 250)
DFGLS_SPECS = ("constant", "trend")
MIN_DF = 10  # between two lengths, the shorter cell's regression keeps at least this many


def _df(length: int, lags: int) -> int:
    """Residual degrees of freedom of the DF-GLS regression: (T − 1 − p) − (p + 1)."""
    return length - 2 - 2 * lags


def _schwert(values: int) -> int:
    return int(np.floor(12.0 * (values / 100.0) ** 0.25))


def dfgls_table_lags(length: int) -> tuple[int, ...]:
    """The lags held at grid length ``length``: 0 up to Schwert's (1989) maximum at the next grid
    length (every default search between two lengths is bracketed; at the last length its own),
    within the engine's cap ⌊T/2⌋ − 3."""
    i = DFGLS_LENGTHS.index(length)
    reach = _schwert(DFGLS_LENGTHS[min(i + 1, len(DFGLS_LENGTHS) - 1)])
    return tuple(range(min(reach, length // 2 - 3) + 1))


@lru_cache(maxsize=1)
def _table() -> dict[tuple[int, int], dict[str, np.ndarray]]:
    try:
        from tauscope.engine.distributions import dfgls_table
    except ImportError:  # not generated yet
        return {}
    return decode(dfgls_table.CELLS, dfgls_table.DATA, DFGLS_SPECS)


@lru_cache(maxsize=1024)
def dfgls_quantiles(spec: str, length: int, lags: int) -> np.ndarray | None:
    """The quantiles of the DF-GLS t ratio (``spec``, a series of ``length`` values, ``lags``
    fixed lags) at :data:`~tauscope.engine.distributions.exact_grid.PROBABILITIES`, read from
    the table, or None when the grid does not bracket the request; read-only."""
    table = _table()
    i = bisect.bisect_left(DFGLS_LENGTHS, length)
    if spec not in DFGLS_SPECS or i == len(DFGLS_LENGTHS):
        return None
    if DFGLS_LENGTHS[i] == length:
        cell = table.get((length, lags))
        out = None if cell is None else np.array(cell[spec])
    elif i == 0:
        return None
    else:
        short, long = DFGLS_LENGTHS[i - 1], DFGLS_LENGTHS[i]
        low, high = table.get((short, lags)), table.get((long, lags))
        if low is None or high is None or _df(short, lags) < MIN_DF:
            return None
        x, x0, x1 = 1.0 / _df(length, lags), 1.0 / _df(short, lags), 1.0 / _df(long, lags)
        w = (x - x1) / (x0 - x1)
        out = np.asarray(w * low[spec] + (1.0 - w) * high[spec])
    if out is not None:
        out.setflags(write=False)
    return out
