"""The cross-check's seasonal part: the seasonal unit-root test of a quarterly or monthly
series, beside the fixed seasonal means found when it was prepared.

HEGY (Hylleberg, Engle, Granger & Yoo 1990) for quarters and Beaulieu & Miron (1993)
for months (:mod:`tauscope.engine.seasonal.roots`), with seasonal dummies in the
regression (so the test does not depend on fixed seasonal means), the lag order of
Δ_S y by AIC and critical values simulated at the series' own length and lag order.
Runs whenever the prepared series carries a seasonal decision, i.e. it has quarterly or
monthly dates and the ``seasonal`` setting is not "never"; a series too short for the
test gets one sentence in ``problem`` instead.

The test itself comes from the estimation (``Estimation.seasonal_roots``): the reference
path tests each series alone (:func:`seasonal_roots_alone`), the fast path a batch's
series of one period together (:class:`SeasonalBatch`, the same numbers to 1e-8).
"""

from __future__ import annotations

from collections.abc import Callable

import numpy as np

from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.results_seasonal import SeasonalCheck
from tauscope.engine.seasonal.results import SeasonalRootsResult
from tauscope.engine.seasonal.roots import seasonal_unit_roots
from tauscope.engine.seasonal.roots_many import Outcome, seasonal_unit_roots_many

DETERMINISTIC = "dummies"

RootsTest = Callable[[np.ndarray, int, float], SeasonalRootsResult]


def seasonal_roots_alone(x: np.ndarray, period: int, alpha: float) -> SeasonalRootsResult:
    """The cross-check's seasonal unit-root test of one series (``x``: y / s)."""
    return seasonal_unit_roots(x, period, DETERMINISTIC, alpha=alpha)


def seasonal_check(prepared: PreparedSeries, alpha: float,
                   test: RootsTest = seasonal_roots_alone) -> SeasonalCheck | None:
    """The seasonal means and the seasonal unit-root test, or None when not asked for."""
    means = prepared.seasonal
    if means is None:
        return None
    try:
        roots = test(prepared.standardised, means.period, alpha)
    except (ValueError, ArithmeticError) as exc:
        return SeasonalCheck(means.period, means, None,
                             f"The seasonal unit-root test could not be run: {exc}.")
    return SeasonalCheck(means.period, means, roots)


class SeasonalBatch:
    """The seasonal unit-root tests of a batch's series (``values``: y / s, one length),
    run together per (period, α) at the first request (:func:`seasonal_unit_roots_many`)."""

    def __init__(self, values: np.ndarray) -> None:
        self._values = values
        self._found: dict[tuple[int, int, float], Outcome] = {}

    def prefetch(self, requests: list[tuple[int, int]], alpha: float) -> None:
        """Test the rows ``index`` of each (index, period) request, one call per period."""
        groups: dict[int, set[int]] = {}
        for index, period in requests:
            if (index, period, alpha) not in self._found:
                groups.setdefault(period, set()).add(index)
        for period, indices in groups.items():
            rows = sorted(indices)
            found = seasonal_unit_roots_many(self._values[rows], period, DETERMINISTIC, alpha=alpha)
            for index, item in zip(rows, found, strict=True):
                self._found[(index, period, alpha)] = item

    def result(self, index: int, period: int, alpha: float) -> SeasonalRootsResult:
        """Row ``index``'s test (prefetched, or run alone); raises the error it met."""
        key = (index, period, alpha)
        if key not in self._found:
            self.prefetch([(index, period)], alpha)
        item = self._found[key]
        if isinstance(item, SeasonalRootsResult):
            return item
        raise item
