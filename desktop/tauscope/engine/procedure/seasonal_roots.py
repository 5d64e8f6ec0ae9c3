"""The cross-check's seasonal part: the seasonal unit-root test of a quarterly or monthly
series, beside the fixed seasonal means found when it was prepared.

HEGY (Hylleberg, Engle, Granger & Yoo 1990) for quarters and Beaulieu & Miron (1993)
for months (:mod:`tauscope.engine.seasonal.roots`), with seasonal dummies in the
regression (so the test does not depend on fixed seasonal means), the lag order of
Δ_S y by AIC and critical values simulated at the series' own length and lag order.
Runs whenever the prepared series carries a seasonal decision, i.e. it has quarterly or
monthly dates and the ``seasonal`` setting is not "never"; a series too short for the
test gets one sentence in ``problem`` instead.
"""

from __future__ import annotations

from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.results_seasonal import SeasonalCheck
from tauscope.engine.seasonal.roots import seasonal_unit_roots

DETERMINISTIC = "dummies"


def seasonal_check(prepared: PreparedSeries, alpha: float) -> SeasonalCheck | None:
    """The seasonal means and the seasonal unit-root test, or None when not asked for."""
    means = prepared.seasonal
    if means is None:
        return None
    try:
        roots = seasonal_unit_roots(prepared.standardised, means.period, DETERMINISTIC, alpha=alpha)
    except (ValueError, ArithmeticError) as exc:
        return SeasonalCheck(means.period, means, None,
                             f"The seasonal unit-root test could not be run: {exc}.")
    return SeasonalCheck(means.period, means, roots)
