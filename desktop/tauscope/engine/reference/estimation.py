"""The reference estimation: every regression through statsmodels OLS
(:mod:`tauscope.engine.regression.ols`), lag choice by refitting each lag order
(:mod:`tauscope.engine.regression.lagchoice`), KPSS by statsmodels' ``kpss``."""

from __future__ import annotations

import numpy as np

from tauscope.engine.distributions import tables
from tauscope.engine.procedure.seasonal_roots import seasonal_roots_alone
from tauscope.engine.procedure.stages import EstimateOptions
from tauscope.engine.procedure.union_estimate import UnionRow, union_rows
from tauscope.engine.procedure.units import level_in_units
from tauscope.engine.regression.design import SPECS
from tauscope.engine.regression.lagchoice import choose_lag
from tauscope.engine.regression.scaling import level_centre
from tauscope.engine.results import LagPoint, LevelTests, RecursiveStatistic, TestResult
from tauscope.engine.seasonal.results import SeasonalRootsResult
from tauscope.engine.unitroot.adf import adf_test, estimate
from tauscope.engine.unitroot.kpss import kpss_test
from tauscope.engine.unitroot.phi import phi_test
from tauscope.engine.unitroot.recursive import recursive_tau


def level_tests(x: np.ndarray, difference: int, options: EstimateOptions, max_lags: int) -> LevelTests:
    """ADF for the three specs with the lag the rule chooses, and Φ1, Φ2, Φ3, on Δ^d y = x
    (with a constant, y(t−1) measured from its mean: :mod:`tauscope.engine.regression.scaling`)."""
    adf: dict[str, TestResult] = {}
    for spec in SPECS:
        centre = level_centre(x, spec)
        choice = choose_lag(x, spec, options.lag_rule, max_lags, options.lags, centre)
        adf[spec] = adf_test(estimate(x, spec, choice.lag, difference, choice, centre), options.alpha)
    trend_reg, constant_reg = adf["trend"].regression, adf["constant"].regression
    assert trend_reg is not None and constant_reg is not None
    phi = {
        "phi1": phi_test(constant_reg, "phi1", options.alpha),
        "phi2": phi_test(trend_reg, "phi2", options.alpha),
        "phi3": phi_test(trend_reg, "phi3", options.alpha),
    }
    return LevelTests(difference, adf, phi)


def lag_profile(x: np.ndarray, spec: str, difference: int, max_lags: int) -> tuple[LagPoint, ...]:
    """τ for every lag order 0…max on its longest sample, with the 5% critical value."""
    points = []
    centre = level_centre(x, spec)
    for lag in range(max_lags + 1):
        reg = estimate(x, spec, lag, difference, centre=centre)
        critical = tables.tau_critical_value(spec, reg.nobs, 0.05)
        points.append(LagPoint(lag, reg.tau, critical, bool(reg.tau < critical)))
    return tuple(points)


class ReferenceEstimation:
    """One statsmodels OLS per regression; the fast path must equal it."""

    def level_tests(self, x: np.ndarray, difference: int, options: EstimateOptions,
                    max_lags: int, scale: float) -> LevelTests:
        return level_in_units(level_tests(x, difference, options, max_lags), scale)

    def lag_profile(self, x: np.ndarray, spec: str, difference: int,
                    max_lags: int) -> tuple[LagPoint, ...]:
        return lag_profile(x, spec, difference, max_lags)

    def kpss(self, x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult:
        return kpss_test(x, spec, difference, alpha)

    def union(self, x: np.ndarray, options: EstimateOptions, period: int | None = None) -> UnionRow:
        """The union of rejections on this series alone (the same numbers as in a batch:
        every operation of :mod:`tauscope.engine.procedure.union_estimate` is row by row)."""
        o = options
        return union_rows(x[None, :], o.lag_rule, o.alpha, o.max_difference, o.max_lags,
                          o.lags if o.lag_rule == "fixed" else None, o.bootstrap, period)[0]

    def recursive(self, x: np.ndarray, spec: str, lags: int, difference: int,
                  alpha: float) -> RecursiveStatistic:
        """τ on expanding windows of ``x`` (Δ^d y), one series."""
        return recursive_tau(x, spec, lags, alpha)

    def seasonal_roots(self, x: np.ndarray, period: int, alpha: float) -> SeasonalRootsResult:
        """The seasonal unit-root test of this series alone."""
        return seasonal_roots_alone(x, period, alpha)


REFERENCE = ReferenceEstimation()
