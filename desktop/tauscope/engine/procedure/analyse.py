"""analyse_series: the whole testing job for one series, as a pipeline of stages.

    prepare → estimate → decide → cross-check → read → assemble

(:mod:`tauscope.engine.procedure.stages` describes what flows between them.)  The
settings are read once, into a :class:`~tauscope.engine.procedure.stages.Plan`; each
stage gets its own part.  The fast path estimates with :mod:`.fast_path`; a series it
declines, or one that fails on the way, runs the whole pipeline again on the reference
path (:mod:`tauscope.engine.reference`), whose outcome or message is the result.
"""

from __future__ import annotations

from typing import Any, Literal

import numpy as np

from tauscope.engine.errors import UntestableSeries
from tauscope.engine.procedure.assemble import assemble
from tauscope.engine.procedure.cross_check import cross_check
from tauscope.engine.procedure.decide import STRATEGIES
from tauscope.engine.procedure.estimate import estimate
from tauscope.engine.procedure.fast_path import NeedsReference, SeriesBatch
from tauscope.engine.procedure.prepare import PreparedSeries, prepare
from tauscope.engine.procedure.read import read
from tauscope.engine.procedure.seasonal_means import with_seasonal
from tauscope.engine.procedure.stages import Decision, Estimation, Plan, plan_for
from tauscope.engine.reference.estimation import REFERENCE
from tauscope.engine.results import SeriesResult, failed_result
from tauscope.engine.settings import Settings

COMPUTATION_ERRORS = (np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)
# What sends a series from the fast path to the reference path, which then decides.
FALLBACK_ERRORS = (NeedsReference, UntestableSeries, *COMPUTATION_ERRORS)
Path = Literal["fast", "reference"]
PATHS: tuple[str, ...] = ("fast", "reference")


def analyse_series(values: Any, settings: Settings | None = None, name: str = "series", *,
                   path: Path = "fast") -> SeriesResult:
    """Run the full testing sequence on one series; never raises for bad data.

    ``values``: array-like or a pandas Series (a PeriodIndex or DatetimeIndex
    is kept for dates in notes and plots).  A series that cannot be tested
    comes back with ``error`` set to one sentence.

    ``path``: ``"fast"`` (default) computes every lag length from one QR
    factorisation (:mod:`tauscope.engine.procedure.fast_path`); ``"reference"`` runs one
    statsmodels regression per model.  Both give the same numbers (the tests check
    1e-8); the fast path hands a series it cannot promise that for (a nearly
    collinear design, a nearly perfect fit) to the reference path.
    """
    if path not in PATHS:
        raise ValueError(f"path must be one of {', '.join(PATHS)}, not {path!r}")
    plan = plan_for(settings or Settings())
    try:
        prepared = with_seasonal(prepare(values), plan.estimate.seasonal)
    except UntestableSeries as exc:
        return failed(name, plan, f"“{name}” could not be tested: {exc}.")
    except COMPUTATION_ERRORS as exc:
        return failed(name, plan, _computation_failed(name, exc))
    if path == "fast":
        return analyse_prepared(prepared, plan, name,
                                SeriesBatch([prepared.standardised], plan.estimate,
                                            prepared.dummies_period).estimation(0))
    return analyse_prepared(prepared, plan, name, REFERENCE)


def analyse_prepared(prepared: PreparedSeries, plan: Plan, name: str,
                     estimation: Estimation) -> SeriesResult:
    """The pipeline on a validated series with the given estimation; never raises for
    bad data.  When a fast estimation declines the series, or anything goes wrong on
    the way, the reference path analyses it again and its outcome (or its message)
    is the result."""
    if estimation is not REFERENCE:
        try:
            return finish(decide(prepared, plan, estimation), plan, name, estimation)
        except FALLBACK_ERRORS:
            pass
    try:
        return finish(decide(prepared, plan, REFERENCE), plan, name, REFERENCE)
    except UntestableSeries as exc:
        return failed(name, plan, f"“{name}” could not be tested: {exc}.")
    except COMPUTATION_ERRORS as exc:
        return failed(name, plan, _computation_failed(name, exc))


def decide(prepared: PreparedSeries, plan: Plan, estimation: Estimation) -> Decision:
    """The first half of the pipeline: estimate, then the plan's strategy decides."""
    return STRATEGIES[plan.decide.strategy](estimate(prepared, plan.estimate, estimation), plan.decide)


def finish(decision: Decision, plan: Plan, name: str, estimation: Estimation) -> SeriesResult:
    """The second half: cross-check, read, assemble."""
    checked = cross_check(decision, plan.cross_check, estimation)
    return assemble(read(checked, plan.read), name, plan.settings_dict())


def failed(name: str, plan: Plan, message: str) -> SeriesResult:
    return failed_result(name, message, plan.settings_dict())


def _computation_failed(name: str, exc: Exception) -> str:
    return f"“{name}” could not be tested: the computation failed ({exc})."
