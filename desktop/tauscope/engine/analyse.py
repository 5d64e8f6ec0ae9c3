"""analyse_series: the whole testing job for one series.

Order of integration from the highest difference down (Dickey, D.A. &
Pantula, S.G. 1987, "Determining the Order of Differencing in Autoregressive
Processes", JBES 5(4); Pantula, S.G. 1989, Econometric Theory 5): the
sequence of :mod:`tauscope.engine.sequence` runs on Δ^d y for
d = max_difference, …, 0 and moves down only while the unit root is rejected.
The first non-rejection at d gives I(d + 1); rejection all the way gives I(0).
A KPSS cross-check (Kwiatkowski et al. 1992) follows.
"""

from __future__ import annotations

from typing import Any

import numpy as np
import pandas as pd

from tauscope.engine.adf import adf_test, estimate
from tauscope.engine.critical import tau_critical_value
from tauscope.engine.design import SPECS, max_lag_cap, schwert_max_lag
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.joint import phi_test
from tauscope.engine.lagchoice import choose_lag
from tauscope.engine.notes import NoteContext, build_notes, find_jump, seasonal_pattern
from tauscope.engine.prepare import PreparedSeries, prepare
from tauscope.engine.results import EMPTY_VERDICT, LagPoint, SeriesResult, Step, TestResult
from tauscope.engine.sequence import LevelTests, SequenceOutcome, run_sequence
from tauscope.engine.settings import Settings
from tauscope.engine.stationarity import kpss_test
from tauscope.engine.verdicts import agreement, agreement_note, build_verdict


def analyse_series(values: Any, settings: Settings | None = None, name: str = "series") -> SeriesResult:
    """Run the full testing sequence on one series; never raises for bad data.

    ``values``: array-like or a pandas Series (a PeriodIndex or DatetimeIndex
    is kept for dates in notes and plots).  A series that cannot be tested
    comes back with ``error`` set to one sentence.
    """
    settings = settings or Settings()
    try:
        prepared = prepare(values)
        return _analyse(prepared, settings, name)
    except UntestableSeries as exc:
        return _failed(name, settings, f"“{name}” could not be tested: {exc}.")
    except (np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError) as exc:
        return _failed(name, settings, f"“{name}” could not be tested: the computation failed ({exc}).")


def _failed(name: str, settings: Settings, message: str) -> SeriesResult:
    return SeriesResult(name=name, nobs=0, error=message, verdict=EMPTY_VERDICT, steps=(), tests=(),
                        notes=(message,), settings=settings.to_dict())


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
        critical = tau_critical_value(spec, reg.nobs, 0.05)
        points.append(LagPoint(lag, reg.tau, critical, bool(reg.tau < critical)))
    return tuple(points)


def _with_alpha(points: tuple[LagPoint, ...], x: np.ndarray, spec: str, alpha: float) -> tuple[LagPoint, ...]:
    out = []
    for p in points:
        critical = tau_critical_value(spec, x.shape[0] - 1 - p.lag, alpha)
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
                 settings: Settings) -> list[tuple[TestResult, bool]]:
    if "kpss" not in settings.confirm or order is None:
        return []
    if order == 0:
        spec = "trend" if deterministic == "trend" else "constant"
        return [(kpss_test(x, spec, 0, settings.alpha), False)]
    below = np.diff(x, n=order - 1) if order > 1 else x
    spec_below = "trend" if deterministic in ("trend", "constant") else "constant"
    return [
        (kpss_test(below, spec_below, order - 1, settings.alpha), True),
        (kpss_test(np.diff(x, n=order), "constant", order, settings.alpha), False),
    ]


def _analyse(prepared: PreparedSeries, settings: Settings, name: str) -> SeriesResult:
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
        levels[d] = level_tests(xd, d, settings, max_lags[d])
        outcome = run_sequence(levels[d], settings.alpha)
        outcomes.append(outcome)
        if outcome.unit_root:
            order = d + 1 if d < settings.max_difference else None
            break
    if 0 not in levels:
        max_lags[0], reduced = max_lags_for(x.shape[0], settings)
        levels[0] = level_tests(x, 0, settings, max_lags[0])

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
        checks = _kpss_checks(x, order, deterministic, settings)
    except (ValueError, np.linalg.LinAlgError, ZeroDivisionError) as exc:
        kpss_problem = f"The KPSS cross-check could not be computed ({exc})."
    tests.extend(test for test, _ in checks)
    status = agreement(order, checks)
    if order is None and "kpss" in settings.confirm:
        status = "inconclusive"
    verdict = build_verdict(order, deterministic, unit_root, status, settings.alpha, settings.max_difference)

    tau_steps = [s for s in steps if s.statistic_name == "tau"]
    deciding = tau_steps[-1]
    decisive_x = np.diff(x, n=deciding.difference) if deciding.difference else x
    profile = _with_alpha(
        lag_profile(decisive_x, deciding.spec, deciding.difference, max_lags[deciding.difference]),
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
        agreement_text=agreement_note(order, status, checks, settings.alpha) or kpss_problem,
        jump_at=_jump_label(prepared),
        seasonal_lag=seasonal_pattern(x, prepared.periods_per_year),
        level_sequence_tests=3,
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
        settings=settings.to_dict(),
        max_lags=max_lags[0],
        lag_profile=profile,
        lag_profile_spec=deciding.spec,
        lag_profile_difference=deciding.difference,
        span=(prepared.label(0), prepared.label(x.shape[0] - 1)),
        values=values,
        fitted=fitted_deterministic(x, order, deterministic),
    )


def _jump_label(prepared: PreparedSeries) -> str | None:
    position = find_jump(prepared.values)
    if position is None:
        return None
    return f"{prepared.label(position)} (from {prepared.label(position - 1)})"
