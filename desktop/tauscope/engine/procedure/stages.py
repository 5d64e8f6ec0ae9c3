"""What flows between the stages of the analysis, as plain frozen data.

    prepare → estimate → decide → cross-check → read → assemble

:func:`plan_for` reads the :class:`~tauscope.engine.settings.Settings` once and gives
each stage only the options it needs.  Every stage takes the previous stage's output
and returns its own, which carries the earlier ones along, so no stage calls back up:

* :class:`~tauscope.engine.procedure.prepare.PreparedSeries` (prepare.py): the clean values;
* :class:`Estimates` (estimate.py): every ADF and Φ test on every difference;
* :class:`Decision` (decide/): the strategy's order of integration and its path;
* :class:`CrossCheck` (cross_check.py): KPSS, the extra tests, power, the lag profile;
* :class:`Reading` (read.py): verdict, evidence reading, notes;
* :class:`~tauscope.engine.results.SeriesResult` (assemble.py).

Where the regressions come from is the :class:`Estimation` handed to the estimate and
cross-check stages: the fast path (:mod:`tauscope.engine.procedure.fast_path`) or the
reference path (:mod:`tauscope.engine.reference`).
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from functools import lru_cache
from typing import Any, Protocol

import numpy as np

from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.procedure.union_estimate import UnionRow
from tauscope.engine.results import (
    DFGLS,
    BreakInfo,
    Evidence,
    LagPoint,
    LevelTests,
    PhillipsPerron,
    PowerResult,
    RecursiveStatistic,
    Step,
    TestResult,
    Verdict,
)
from tauscope.engine.results_breaks import BreakCheck
from tauscope.engine.results_seasonal import SeasonalCheck
from tauscope.engine.results_strategy import ClassicVerdict
from tauscope.engine.seasonal.results import SeasonalRootsResult
from tauscope.engine.settings import UNION_STRATEGIES, Settings
from tauscope.engine.unitroot.variance_change import VarianceChange

EXTRA_TESTS = ("pp", "dfgls", "za")


@dataclass(frozen=True)
class EstimateOptions:
    """What the estimate stage needs: the lag choice, the level, the differences."""

    lag_rule: str
    lags: int | None
    max_lags: int | None
    alpha: float
    max_difference: int
    exact: bool  # judge τ and Φ against nulls simulated at their own size
    union: bool = False  # also compute the union of rejections (union_estimate.py)
    bootstrap: bool = False  # judge the union against its wild-bootstrap critical value
    seasonal: str = "never"  # the seasonal setting (procedure/seasonal_means.py)


@dataclass(frozen=True)
class DecideOptions:
    strategy: str
    alpha: float
    max_difference: int
    lag_rule: str = "maic"


@dataclass(frozen=True)
class CrossCheckOptions:
    alpha: float
    kpss: bool
    extra: tuple[str, ...]  # the extra tests turned on, among EXTRA_TESTS
    lag_rule: str
    lags: int | None
    break_model: str
    critical_values: str
    power: bool
    break_check: bool = True  # the break check runs (the break_check setting not "off")


@dataclass(frozen=True)
class ReadOptions:
    alpha: float
    max_difference: int
    kpss: bool
    lag_rule: str = "maic"


@dataclass(frozen=True)
class Plan:
    """The settings, read once, split by stage; ``record`` is ``settings.to_dict()``."""

    estimate: EstimateOptions
    decide: DecideOptions
    cross_check: CrossCheckOptions
    read: ReadOptions
    record: tuple[tuple[str, Any], ...]

    def settings_dict(self) -> dict[str, Any]:
        """``settings.to_dict()``, a fresh dict each time, without re-walking the dataclass."""
        return {key: list(value) if isinstance(value, list) else value for key, value in self.record}


@lru_cache(maxsize=32)
def plan_for(settings: Settings) -> Plan:
    s = settings
    return Plan(
        estimate=EstimateOptions(s.lag_rule, s.lags, s.max_lags, s.alpha, s.max_difference,
                                 s.critical_values == "exact", s.strategy in UNION_STRATEGIES,
                                 s.strategy == "bootstrap", s.seasonal),
        decide=DecideOptions(s.strategy, s.alpha, s.max_difference, s.lag_rule),
        cross_check=CrossCheckOptions(s.alpha, "kpss" in s.confirm,
                                      tuple(t for t in s.confirm if t in EXTRA_TESTS), s.lag_rule,
                                      s.lags, s.break_model, s.critical_values, s.power,
                                      s.break_check != "off"),
        read=ReadOptions(s.alpha, s.max_difference, "kpss" in s.confirm, s.lag_rule),
        record=tuple(s.to_dict().items()),
    )


class Estimation(Protocol):
    """Where the regressions of one series come from: the reference path (statsmodels
    OLS per regression) or the fast path (nested QR, series batched).  Both give the
    same numbers (the tests check 1e-8)."""

    def level_tests(self, x: np.ndarray, difference: int, options: EstimateOptions,
                    max_lags: int, scale: float) -> LevelTests:
        """The ADF and Φ tests on ``x`` = Δ^d y / ``scale`` (the standardised series),
        their regressions put back into the units of y (:mod:`tauscope.engine.procedure.units`)."""

    def lag_profile(self, x: np.ndarray, spec: str, difference: int,
                    max_lags: int) -> tuple[LagPoint, ...]: ...

    def kpss(self, x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult: ...

    def union(self, x: np.ndarray, options: EstimateOptions, period: int | None = None) -> UnionRow: ...

    def recursive(self, x: np.ndarray, spec: str, lags: int, difference: int,
                  alpha: float) -> RecursiveStatistic: ...

    def seasonal_roots(self, x: np.ndarray, period: int, alpha: float) -> SeasonalRootsResult:
        """The seasonal unit-root test of ``x`` (y / s) at ``period``; raises ValueError
        with one sentence when the series cannot be tested."""


@dataclass(frozen=True)
class Estimates:
    """Every ADF (three specs, lag chosen) and Φ test on Δ^d y, d = max_difference … 0."""

    prepared: PreparedSeries
    levels: dict[int, LevelTests]
    max_lags: dict[int, int]
    reduced: tuple[int, int] | None  # (wanted, used) when the levels' maximum lag was cut
    union: UnionRow | None = None  # the union of rejections, when the plan asks for it


@dataclass(frozen=True)
class Decision:
    """A strategy's order of integration: ``visited`` are the differences it looked at,
    highest first; ``deciding`` is its last τ step (the lag profile's and the power's)."""

    estimates: Estimates
    strategy: str
    visited: tuple[int, ...]
    steps: tuple[Step, ...]
    order: int | None
    deterministic: str | None
    deciding: Step
    classic: ClassicVerdict | None = None  # the classic sequence's verdict, when it did not decide
    weak: bool = False  # the classic sequence's conclusion rests on the normal after a drift
    union_tests: tuple[TestResult, ...] = ()  # the union's DF-GLS components as ``tests`` entries

    @property
    def profile_request(self) -> tuple[str, int, int]:
        """(spec, difference, maximum lag) of the lag profile the cross-check asks for."""
        step = self.deciding
        return step.spec, step.difference, self.estimates.max_lags[step.difference]


Strategy = Callable[[Estimates, DecideOptions], Decision]


@dataclass(frozen=True)
class ExtraEvidence:
    """The extra tests on the difference where the verdict was settled, with the
    deterministic terms of the alternative (``spec``), and what backs them up."""

    difference: int
    spec: str
    tests: tuple[TestResult, ...]
    fixed_lags: bool
    break_model: str
    break_info: BreakInfo | None = None
    power: PowerResult | None = None
    recursive: RecursiveStatistic | None = None
    phillips_perron: PhillipsPerron | None = None
    z_alpha_critical_values: dict[str, float] | None = None
    dfgls: DFGLS | None = None
    problems: tuple[str, ...] = ()


@dataclass(frozen=True)
class CrossCheck:
    """KPSS checks as (result, whether the verdict expects it to reject), the extra
    evidence, τ of the deciding regression for every lag order, the break check, the
    seasonal check and, when the classic sequence decides, the κ2 variance-change test."""

    decision: Decision
    kpss: tuple[tuple[TestResult, bool], ...]
    kpss_problem: str | None
    extra: ExtraEvidence
    lag_profile: tuple[LagPoint, ...]
    breaks: BreakCheck | None = None  # the break check (procedure/breaks.py)
    seasonal: SeasonalCheck | None = None  # seasonal means and roots (procedure/seasonal_roots.py)
    # κ2 on the levels when the classic sequence decides (the union's row carries its own)
    variance: VarianceChange | None = None


@dataclass(frozen=True)
class Reading:
    cross_check: CrossCheck
    verdict: Verdict
    evidence: Evidence
    notes: tuple[str, ...]
    classic: ClassicVerdict | None = None  # the classic sequence's verdict when it did not decide
