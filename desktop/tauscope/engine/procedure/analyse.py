"""analyse_series: the whole testing job for one series.

Order of integration from the highest difference down (Dickey, D.A. &
Pantula, S.G. 1987, "Determining the Order of Differencing in Autoregressive
Processes", JBES 5(4); Pantula, S.G. 1989, Econometric Theory 5): the
sequence of :mod:`tauscope.engine.procedure.decide.classic` runs on Δ^d y for
d = max_difference, …, 0 and moves down only while the unit root is rejected.
The first non-rejection at d gives I(d + 1); rejection all the way gives I(0).
A KPSS cross-check (Kwiatkowski et al. 1992) follows.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from functools import lru_cache
from typing import Any, Literal, Protocol

import numpy as np
import pandas as pd

from tauscope.engine.distributions import tables as fast_tables
from tauscope.engine.distributions.simulate import with_exact_values
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.procedure.decide.classic import SequenceOutcome, run_sequence
from tauscope.engine.procedure.evidence import EXTRA_TESTS, gather_evidence, settled_difference
from tauscope.engine.procedure.fast_path import NeedsReference, SeriesBatch
from tauscope.engine.procedure.prepare import PreparedSeries, prepare
from tauscope.engine.reading.notes import NoteContext, build_notes, find_jump, seasonal_pattern
from tauscope.engine.reading.verdicts import agreement, agreement_note, build_verdict
from tauscope.engine.regression.design import SPECS, max_lag_cap, schwert_max_lag
from tauscope.engine.regression.lagchoice import choose_lag
from tauscope.engine.results import (
    LagPoint,
    LevelTests,
    SeriesResult,
    Step,
    TestResult,
    failed_result,
)
from tauscope.engine.settings import Settings
from tauscope.engine.unitroot.adf import adf_test, estimate
from tauscope.engine.unitroot.kpss import kpss_test
from tauscope.engine.unitroot.phi import phi_test

_COMPUTATION_ERRORS = (np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)
# What sends a series from the fast path to the reference path, which then decides.
FALLBACK_ERRORS = (NeedsReference, UntestableSeries, *_COMPUTATION_ERRORS)
Path = Literal["fast", "reference"]
PATHS: tuple[str, ...] = ("fast", "reference")


class Estimation(Protocol):
    """Where the regressions of one series come from: the reference path (statsmodels
    OLS per regression) or the fast path (:mod:`tauscope.engine.procedure.fast_path`).  Everything
    else of the analysis (the sequence, the verdict, the notes) is shared."""

    def level_tests(self, x: np.ndarray, difference: int, settings: Settings,
                    max_lags: int) -> LevelTests: ...

    def lag_profile(self, x: np.ndarray, spec: str, difference: int,
                    max_lags: int) -> tuple[LagPoint, ...]: ...

    def kpss(self, x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult: ...


class ReferenceEstimation:
    """One statsmodels OLS per regression (:mod:`ols`); the fast path must equal it."""

    def level_tests(self, x: np.ndarray, difference: int, settings: Settings,
                    max_lags: int) -> LevelTests:
        return level_tests(x, difference, settings, max_lags)

    def lag_profile(self, x: np.ndarray, spec: str, difference: int,
                    max_lags: int) -> tuple[LagPoint, ...]:
        return lag_profile(x, spec, difference, max_lags)

    def kpss(self, x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult:
        return kpss_test(x, spec, difference, alpha)


REFERENCE = ReferenceEstimation()


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
    settings = settings or Settings()
    try:
        prepared = prepare(values)
    except UntestableSeries as exc:
        return _failed(name, settings, f"“{name}” could not be tested: {exc}.")
    except _COMPUTATION_ERRORS as exc:
        return _failed(name, settings, _computation_failed(name, exc))
    if path == "fast":
        return analyse_prepared(prepared, settings, name,
                                SeriesBatch([prepared.values], settings).estimation(0))
    return analyse_prepared(prepared, settings, name, REFERENCE)


def analyse_prepared(prepared: PreparedSeries, settings: Settings, name: str,
                     estimation: Estimation) -> SeriesResult:
    """The analysis of a validated series with the given estimation; never raises for
    bad data.  When a fast estimation declines the series, or anything goes wrong on
    the way, the reference path analyses it again and its outcome (or its message)
    is the result."""
    if estimation is not REFERENCE:
        try:
            return _analyse(prepared, settings, name, estimation)
        except FALLBACK_ERRORS:
            pass
    try:
        return _analyse(prepared, settings, name, REFERENCE)
    except UntestableSeries as exc:
        return _failed(name, settings, f"“{name}” could not be tested: {exc}.")
    except _COMPUTATION_ERRORS as exc:
        return _failed(name, settings, _computation_failed(name, exc))


def _computation_failed(name: str, exc: Exception) -> str:
    return f"“{name}” could not be tested: the computation failed ({exc})."


def _failed(name: str, settings: Settings, message: str) -> SeriesResult:
    return failed_result(name, message, settings.to_dict())


def max_lags_for(n: int, settings: Settings) -> tuple[int, tuple[int, int] | None]:
    """The maximum lag order for a series of n values, and (wanted, used) if reduced."""
    cap = max_lag_cap(n)
    if cap < 0:
        raise UntestableSeries(f"with {n} values there are too few observations for the regressions")
    if settings.lag_rule == "fixed":
        assert settings.lags is not None
        if settings.lags > cap:
            raise UntestableSeries(
                f"a fixed lag order of {settings.lags} is too large for {n} values (at most {cap})"
            )
        return settings.lags, None
    wanted = settings.max_lags if settings.max_lags is not None else schwert_max_lag(n)
    if wanted > cap:
        return cap, (wanted, cap)
    return wanted, None


def level_tests(x: np.ndarray, difference: int, settings: Settings, max_lags: int) -> LevelTests:
    adf: dict[str, TestResult] = {}
    for spec in SPECS:
        choice = choose_lag(x, spec, settings.lag_rule, max_lags, settings.lags)
        adf[spec] = adf_test(estimate(x, spec, choice.lag, difference, choice), settings.alpha)
    trend_reg, constant_reg = adf["trend"].regression, adf["constant"].regression
    assert trend_reg is not None and constant_reg is not None
    phi = {
        "phi1": phi_test(constant_reg, "phi1", settings.alpha),
        "phi2": phi_test(trend_reg, "phi2", settings.alpha),
        "phi3": phi_test(trend_reg, "phi3", settings.alpha),
    }
    return LevelTests(difference, adf, phi)


def lag_profile(x: np.ndarray, spec: str, difference: int, max_lags: int) -> tuple[LagPoint, ...]:
    """τ for every lag order 0…max on its longest sample, with the 5% critical value."""
    points = []
    for lag in range(max_lags + 1):
        reg = estimate(x, spec, lag, difference)
        critical = fast_tables.tau_critical_value(spec, reg.nobs, 0.05)
        points.append(LagPoint(lag, reg.tau, critical, bool(reg.tau < critical)))
    return tuple(points)


def _with_alpha(points: tuple[LagPoint, ...], x: np.ndarray, spec: str, alpha: float) -> tuple[LagPoint, ...]:
    out = []
    for p in points:
        critical = fast_tables.tau_critical_value(spec, x.shape[0] - 1 - p.lag, alpha)
        out.append(LagPoint(p.lag, p.statistic, critical, bool(p.statistic < critical)))
    return tuple(out)


def fitted_deterministic(x: np.ndarray, order: int | None, deterministic: str | None) -> np.ndarray | None:
    """The deterministic path the verdict implies, in levels, for charts.

    I(0): OLS fit on [1, t] (trend), the mean (constant) or zero (none).
    I(1) with drift: y_1 + μ̂ (t − 1) with μ̂ the mean change; with trend: OLS on [1, t, t²].
    """
    if order is None or deterministic is None:
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


def _kpss_checks(x: np.ndarray, order: int | None, deterministic: str | None,
                 settings: Settings, estimation: Estimation) -> list[tuple[TestResult, bool]]:
    if "kpss" not in settings.confirm or order is None:
        return []
    if order == 0:
        spec = "trend" if deterministic == "trend" else "constant"
        return [(estimation.kpss(x, spec, 0, settings.alpha), False)]
    below = np.diff(x, n=order - 1) if order > 1 else x
    spec_below = "trend" if deterministic in ("trend", "constant") else "constant"
    return [
        (estimation.kpss(below, spec_below, order - 1, settings.alpha), True),
        (estimation.kpss(np.diff(x, n=order), "constant", order, settings.alpha), False),
    ]


@dataclass(frozen=True)
class Decision:
    """The testing sequence's outcome on every difference level it visited (the first
    half of the analysis; :func:`finish` adds the cross-check, lag profile and notes)."""

    levels: dict[int, LevelTests]
    outcomes: list[SequenceOutcome]
    max_lags: dict[int, int]
    reduced: tuple[int, int] | None
    order: int | None

    @property
    def deciding(self) -> Step:
        """The last τ step: its spec and difference are the lag profile's."""
        return [s for o in self.outcomes for s in o.steps if s.statistic_name == "tau"][-1]

    @property
    def profile_request(self) -> tuple[str, int, int]:
        """(spec, difference, maximum lag) of the lag profile :func:`finish` will ask for."""
        step = self.deciding
        return step.spec, step.difference, self.max_lags[step.difference]


def _analyse(prepared: PreparedSeries, settings: Settings, name: str,
             estimation: Estimation) -> SeriesResult:
    return finish(prepared, settings, name, estimation, decide(prepared, settings, estimation))


def decide(prepared: PreparedSeries, settings: Settings, estimation: Estimation) -> Decision:
    """Order of integration from the highest difference down (Dickey & Pantula 1987)."""
    x = prepared.values
    levels: dict[int, LevelTests] = {}
    outcomes: list[SequenceOutcome] = []
    max_lags: dict[int, int] = {}
    reduced: tuple[int, int] | None = None
    order: int | None = 0
    for d in range(settings.max_difference, -1, -1):
        xd = np.diff(x, n=d) if d else x
        if np.ptp(xd) == 0:
            raise UntestableSeries(
                f"its {'first' if d == 1 else 'second'} difference is constant, so the series is an exact "
                "deterministic path with nothing random to test"
            )
        max_lags[d], cut = max_lags_for(xd.shape[0], settings)
        if d == 0 and cut:
            reduced = cut
        levels[d] = _judged(estimation.level_tests(xd, d, settings, max_lags[d]), settings)
        outcome = run_sequence(levels[d], settings.alpha)
        outcomes.append(outcome)
        if outcome.unit_root:
            order = d + 1 if d < settings.max_difference else None
            break
    if 0 not in levels:
        max_lags[0], reduced = max_lags_for(x.shape[0], settings)
        levels[0] = _judged(estimation.level_tests(x, 0, settings, max_lags[0]), settings)
    return Decision(levels, outcomes, max_lags, reduced, order)


def finish(prepared: PreparedSeries, settings: Settings, name: str, estimation: Estimation,
           decision: Decision) -> SeriesResult:
    """KPSS cross-check, verdict, lag profile and notes for a decided series."""
    x = prepared.values
    levels, outcomes, max_lags = decision.levels, decision.outcomes, decision.max_lags
    reduced, order = decision.reduced, decision.order
    last = outcomes[-1]
    if order == 0:
        deterministic: str | None = last.deterministic
    elif order is None:
        deterministic = None
    else:
        deterministic = last.deterministic
    unit_root = order != 0

    steps: tuple[Step, ...] = tuple(s for o in outcomes for s in o.steps)
    tests: list[TestResult] = []
    for d in sorted(levels):
        tests.extend(levels[d].adf.values())
        tests.extend(levels[d].phi.values())

    checks: list[tuple[TestResult, bool]] = []
    kpss_problem: str | None = None
    try:
        checks = _kpss_checks(x, order, deterministic, settings, estimation)
    except (ValueError, np.linalg.LinAlgError, ZeroDivisionError) as exc:
        kpss_problem = f"The KPSS cross-check could not be computed ({exc})."
    tests.extend(test for test, _ in checks)
    kpss_status = agreement(order, checks)
    if order is None and "kpss" in settings.confirm:
        kpss_status = "inconclusive"

    deciding = decision.deciding
    settled = settled_difference(order)
    evidence = gather_evidence(
        x, prepared.index, order=order, deterministic=deterministic, alpha=settings.alpha,
        tests=tuple(t for t in settings.confirm if t in EXTRA_TESTS),
        deciding_adf=deciding.test, kpss=[t for t, _ in checks], kpss_status=kpss_status,
        lag_rule=settings.lag_rule, lags=settings.lags, max_lags=max_lags[settled],
        za_lags=levels[settled].adf["trend"].lags, break_model=settings.break_model,
        critical_values=settings.critical_values, power=settings.power,
    )
    tests.extend(evidence.tests)
    status = evidence.agreement if evidence.tests else kpss_status
    verdict = build_verdict(order, deterministic, unit_root, status, settings.alpha, settings.max_difference)
    decisive_x = np.diff(x, n=deciding.difference) if deciding.difference else x
    profile = _with_alpha(
        estimation.lag_profile(decisive_x, deciding.spec, deciding.difference,
                               max_lags[deciding.difference]),
        decisive_x, deciding.spec, settings.alpha,
    )
    chosen_lag = deciding.test.lags if deciding.test is not None else None

    ctx = NoteContext(
        verdict=verdict,
        steps=steps,
        level_adf=levels[0].adf,
        lag_profile=profile,
        chosen_lag=chosen_lag,
        nobs=int(x.shape[0]),
        periods_per_year=prepared.periods_per_year,
        alpha=settings.alpha,
        max_lags_reduced=reduced,
        trimmed=(prepared.leading_trimmed, prepared.trailing_trimmed),
        agreement_text=agreement_note(order, kpss_status, checks, settings.alpha) or kpss_problem,
        jump_at=_jump_label(prepared),
        seasonal_lag=seasonal_pattern(x, prepared.periods_per_year),
        level_sequence_tests=3,
        evidence_notes=evidence.notes,
        break_checked=evidence.break_info is not None,
    )
    values = pd.Series(x, index=prepared.index if prepared.index is not None else pd.RangeIndex(1, x.shape[0] + 1),
                       name=name)
    return SeriesResult(
        name=name,
        nobs=int(x.shape[0]),
        error=None,
        verdict=verdict,
        steps=steps,
        tests=tuple(tests),
        notes=build_notes(ctx),
        settings=_settings_dict(settings),
        max_lags=max_lags[0],
        lag_profile=profile,
        lag_profile_spec=deciding.spec,
        lag_profile_difference=deciding.difference,
        span=(prepared.label(0), prepared.label(x.shape[0] - 1)),
        values=values,
        fitted=fitted_deterministic(x, order, deterministic),
        evidence=evidence,
    )


@lru_cache(maxsize=32)
def _settings_record(settings: Settings) -> tuple[tuple[str, Any], ...]:
    return tuple(settings.to_dict().items())


def _settings_dict(settings: Settings) -> dict[str, Any]:
    """``settings.to_dict()``, a fresh dict each time, without re-walking the dataclass."""
    return {key: list(value) if isinstance(value, list) else value
            for key, value in _settings_record(settings)}


def _judged(level: LevelTests, settings: Settings) -> LevelTests:
    """With ``critical_values="exact"``, every τ and Φ is judged against its null simulated
    at its own regression size and lag order (:mod:`tauscope.engine.distributions.simulate`)."""
    if settings.critical_values != "exact":
        return level
    return replace(
        level,
        adf={k: with_exact_values(t, settings.alpha) for k, t in level.adf.items()},
        phi={k: with_exact_values(t, settings.alpha) for k, t in level.phi.items()},
    )


def _jump_label(prepared: PreparedSeries) -> str | None:
    position = find_jump(prepared.values)
    if position is None:
        return None
    return f"{prepared.label(position)} (from {prepared.label(position - 1)})"
