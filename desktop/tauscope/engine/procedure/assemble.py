"""The assemble stage: one :class:`~tauscope.engine.results.SeriesResult` from the reading.

``tests`` holds the ADF and Φ tests of every difference the classic sequence visited and
of the levels (always), then the union's DF-GLS components (when it decided), then KPSS,
then the extra tests (an extra DF-GLS only where the union has none for its spec and
difference); ``fitted`` is the deterministic path
the verdict implies, for the charts.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

import numpy as np
import pandas as pd

from tauscope.engine.procedure.breaks import fitted_under_break
from tauscope.engine.procedure.stages import Reading
from tauscope.engine.results import SeriesResult, TestResult
from tauscope.engine.results_breaks import BreakCheck
from tauscope.engine.results_variance import VarianceCheck


def assemble(reading: Reading, name: str, settings: dict[str, Any]) -> SeriesResult:
    checked = reading.cross_check
    decision = checked.decision
    estimates = decision.estimates
    prepared = estimates.prepared
    x = prepared.values
    tests: list[TestResult] = []
    for d in sorted({*decision.visited, 0}):
        tests.extend(estimates.levels[d].adf.values())
        tests.extend(estimates.levels[d].phi.values())
    tests.extend(decision.union_tests)
    tests.extend(test for test, _ in checked.kpss)
    union_dfgls = {(t.spec, t.difference) for t in decision.union_tests}
    # The union's DF-GLS entries already stand for DF-GLS on that difference and spec.
    tests.extend(t for t in reading.evidence.tests
                 if t.test != "dfgls" or (t.spec, t.difference) not in union_dfgls)
    deciding = decision.deciding
    index = prepared.index if prepared.index is not None else pd.RangeIndex(1, x.shape[0] + 1)
    return SeriesResult(
        name=name,
        nobs=int(x.shape[0]),
        error=None,
        verdict=reading.verdict,
        steps=decision.steps,
        tests=tuple(tests),
        notes=reading.notes,
        settings=settings,
        max_lags=estimates.max_lags[0],
        lag_profile=checked.lag_profile,
        lag_profile_spec=deciding.spec,
        lag_profile_difference=deciding.difference,
        span=(prepared.label(0), prepared.label(x.shape[0] - 1)),
        values=pd.Series(x, index=index, name=name),
        fitted=_break_path_in_units(prepared.standardised, prepared.scale, checked.breaks)
        if checked.breaks is not None and checked.breaks.stationary_with_break
        else _fitted_in_units(prepared.standardised, prepared.scale, decision.order,
                              decision.deterministic),
        evidence=reading.evidence,
        classic=reading.classic,
        breaks=checked.breaks,
        seasonal=checked.seasonal,
        variance=_variance_check(reading, prepared.label),
    )


def _variance_check(reading: Reading, label: Callable[[int], str]) -> VarianceCheck | None:
    """κ2 as plain data: the union's when it decided, else the cross-check's (None when it
    could not be computed)."""
    row = reading.cross_check.decision.estimates.union
    v = reading.cross_check.variance if row is None else row.variance
    if v is None:
        return None
    return VarianceCheck(float(v.statistic), float(v.critical_value), float(v.p_value), float(v.alpha),
                         bool(v.found), int(v.position), label(int(v.position)))


def _break_path_in_units(z: np.ndarray, scale: float, check: BreakCheck | None
                         ) -> np.ndarray | None:
    """The path under the break, fitted on the standardised series and put back in units."""
    fitted = fitted_under_break(z, check)
    return None if fitted is None else fitted * scale


def _fitted_in_units(z: np.ndarray, scale: float, order: int | None,
                     deterministic: str | None) -> np.ndarray | None:
    """The fitted path computed on y / s (no overflow near ±1e308) and multiplied back."""
    fitted = fitted_deterministic(z, order, deterministic)
    if fitted is None:
        return None
    with np.errstate(over="ignore"):  # a fitted value beyond the float range draws as inf
        return np.asarray(fitted * scale)


def fitted_deterministic(x: np.ndarray, order: int | None, deterministic: str | None) -> np.ndarray | None:
    """The deterministic path the verdict implies, in levels, for charts.

    I(0): OLS fit on [1, t] (trend), the mean (constant) or zero (none).
    I(1) with drift: y_1 + μ̂ (t − 1) with μ̂ the mean change; with trend: OLS on [1, t, t²].
    I(2): OLS on [1, t, t²] when its differences drift; none without drift (no deterministic
    path to draw).
    """
    if order is None or deterministic is None or (order >= 2 and deterministic == "none"):
        return None
    n = x.shape[0]
    t = np.arange(n, dtype=float)
    if order == 0:
        if deterministic == "trend":
            z = np.column_stack([np.ones(n), t])
        elif deterministic == "constant":
            return np.full(n, float(x.mean()))
        else:
            return np.zeros(n)
    elif order == 1 and deterministic == "constant":
        return x[0] + float(np.mean(np.diff(x))) * t
    elif order == 1 and deterministic == "none":
        return np.full(n, float(x[0]))
    else:
        z = np.column_stack([np.ones(n), t, t * t])
    beta, *_ = np.linalg.lstsq(z, x, rcond=None)
    return np.asarray(z @ beta)
