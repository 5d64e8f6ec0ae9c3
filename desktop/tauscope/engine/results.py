"""Frozen result objects, plain data.  The window, the reports and the command line all
read these, so a number shown anywhere is the same number (DESIGN.md §2).

This module imports none of the tests, the regressions or the simulation: every
module of the engine may import it, and it imports nothing of the engine but the
plain-data leaves `finite`, `results_breaks` and `results_strategy`."""

from __future__ import annotations

from dataclasses import asdict, dataclass, field
from typing import Any, NamedTuple

import numpy as np
import pandas as pd

from tauscope.engine.finite import finite_or_none as _num
from tauscope.engine.results_breaks import BreakCheck, BreakInfo
from tauscope.engine.results_seasonal import SeasonalCheck
from tauscope.engine.results_strategy import ClassicVerdict
from tauscope.engine.results_variance import VarianceCheck


class Coefficient(NamedTuple):
    """One regressor's estimate, standard error and t ratio.  A named tuple rather than a
    frozen dataclass: built some 45,000 times in an analysis of 500 series, in half the time."""

    name: str
    estimate: float
    std_error: float
    t_value: float

    def to_dict(self) -> dict[str, Any]:
        # Written out rather than dataclasses.asdict, which deep-copies each field: a
        # report of 500 series holds some 70,000 coefficients.
        return {"name": self.name, "estimate": self.estimate, "std_error": self.std_error,
                "t_value": self.t_value}


@dataclass(frozen=True)
class Regression:
    """An estimated ADF regression: coefficients, σ̂², RSS, sample and lag choice.

    ``design`` and ``response`` are kept for charts (the fitted deterministic
    part); they are not part of ``to_dict()``.
    """

    spec: str
    difference: int
    lags: int
    lag_rule: str
    max_lags: int
    nobs: int
    first_observation: int
    coefficients: tuple[Coefficient, ...]
    sigma2: float
    rss: float
    lag_criteria: tuple[float, ...] = ()
    design: np.ndarray = field(default_factory=lambda: np.empty((0, 0)), compare=False, repr=False)
    response: np.ndarray = field(default_factory=lambda: np.empty(0), compare=False, repr=False)

    def coefficient(self, name: str) -> Coefficient:
        for coef in self.coefficients:
            if coef.name == name:
                return coef
        raise KeyError(name)

    @property
    def gamma(self) -> Coefficient:
        return self.coefficient("y(t-1)")

    @property
    def tau(self) -> float:
        return self.gamma.t_value

    def to_dict(self) -> dict[str, Any]:
        return {
            "spec": self.spec, "difference": self.difference, "lags": self.lags,
            "lag_rule": self.lag_rule, "max_lags": self.max_lags, "nobs": self.nobs,
            "first_observation": self.first_observation,
            "coefficients": [c.to_dict() for c in self.coefficients],
            "sigma2": self.sigma2, "rss": self.rss, "lag_criteria": list(self.lag_criteria),
        }


@dataclass(frozen=True)
class TestResult:
    """One computed test: ``test`` is ``"adf"``, ``"phi1"``, ``"phi2"``,
    ``"phi3"`` or ``"kpss"``; ``difference`` is how often the series was
    differenced first; ``reject`` is the decision at the chosen level.
    ``p_value_bound`` is ``"below"`` or ``"above"`` when a table only bounds
    the p-value (KPSS outside its table)."""

    __test__ = False  # not a pytest test class

    test: str
    spec: str
    difference: int
    statistic: float
    p_value: float | None
    lags: int
    nobs: int
    critical_values: dict[str, float]
    reject: bool
    critical_value: float
    p_value_bound: str | None = None
    lag_rule: str = ""
    regression: Regression | None = field(default=None, compare=False)

    def to_dict(self) -> dict[str, Any]:
        return {
            "test": self.test,
            "spec": self.spec,
            "difference": self.difference,
            "statistic": _num(self.statistic),
            "p_value": _num(self.p_value),
            "p_value_bound": self.p_value_bound,
            "lags": self.lags,
            "lag_rule": self.lag_rule,
            "nobs": self.nobs,
            "critical_values": {k: _num(v) for k, v in self.critical_values.items()},
            "critical_value": _num(self.critical_value),
            "reject": self.reject,
            "regression": self.regression.to_dict() if self.regression is not None else None,
        }


@dataclass(frozen=True)
class Step:
    """One decision of the testing sequence."""

    difference: int
    spec: str
    hypothesis: str
    statistic_name: str
    statistic: float
    critical_value: float
    p_value: float | None
    decision: str
    text: str
    test: TestResult | None = field(default=None, compare=False, repr=False)
    strategy: str = "classic"  # the strategy the step belongs to ("union", "classic")

    @property
    def rejected(self) -> bool:
        return self.decision == "reject"

    def to_dict(self, tests: tuple[TestResult, ...] = ()) -> dict[str, Any]:
        index = next((i for i, t in enumerate(tests) if t is self.test), None)
        return {
            "difference": self.difference,
            "spec": self.spec,
            "hypothesis": self.hypothesis,
            "statistic_name": self.statistic_name,
            "strategy": self.strategy,
            "statistic": _num(self.statistic),
            "critical_value": _num(self.critical_value),
            "p_value": _num(self.p_value),
            "decision": self.decision,
            "text": self.text,
            "test_index": index,
        }


@dataclass(frozen=True)
class Verdict:
    """``order``: 0, 1, 2 or None; ``deterministic``: the terms of the regression
    that settled the verdict ("constant" for an I(1) series means a drift)."""

    order: int | None
    deterministic: str | None
    unit_root: bool | None
    agreement: str | None
    label: str
    text: str
    strategy: str | None = None  # which strategy decided ("union", "classic")

    def to_dict(self) -> dict[str, Any]:
        return asdict(self)


EMPTY_VERDICT = Verdict(None, None, None, None, "Not tested", "The series could not be tested.")


@dataclass(frozen=True)
class LagPoint:
    lag: int
    statistic: float
    critical_value: float
    reject: bool

    def to_dict(self) -> dict[str, Any]:
        return {"lag": self.lag, "statistic": _num(self.statistic),
                "critical_value": _num(self.critical_value), "reject": self.reject}


@dataclass(frozen=True)
class SeriesResult:
    """Everything the analysis found for one series (DESIGN.md §3)."""

    name: str
    nobs: int
    error: str | None
    verdict: Verdict
    steps: tuple[Step, ...]
    tests: tuple[TestResult, ...]
    notes: tuple[str, ...]
    settings: dict[str, Any] = field(default_factory=dict)
    max_lags: int | None = None
    lag_profile: tuple[LagPoint, ...] = ()
    lag_profile_spec: str | None = None
    lag_profile_difference: int | None = None
    span: tuple[str, str] | None = None
    values: pd.Series | None = field(default=None, compare=False, repr=False)
    fitted: np.ndarray | None = field(default=None, compare=False, repr=False)
    evidence: Evidence | None = field(default=None, compare=False, repr=False)
    classic: ClassicVerdict | None = None  # the classic verdict when another strategy decided
    breaks: BreakCheck | None = field(default=None, compare=False, repr=False)
    seasonal: SeasonalCheck | None = field(default=None, compare=False, repr=False)
    variance: VarianceCheck | None = field(default=None, compare=False, repr=False)

    @property
    def ok(self) -> bool:
        return self.error is None

    def find(self, test: str, spec: str | None = None, difference: int = 0) -> TestResult | None:
        """The first test of this kind (and spec) on the given difference, if computed."""
        for t in self.tests:
            if t.test == test and t.difference == difference and (spec is None or t.spec == spec):
                return t
        return None

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "nobs": self.nobs,
            "error": self.error,
            "verdict": self.verdict.to_dict(),
            "classic": self.classic.to_dict() if self.classic is not None else None,
            "steps": [s.to_dict(self.tests) for s in self.steps],
            "tests": [t.to_dict() for t in self.tests],
            "notes": list(self.notes),
            "settings": dict(self.settings),
            "max_lags": self.max_lags,
            "span": list(self.span) if self.span else None,
            "lag_profile": {
                "spec": self.lag_profile_spec,
                "difference": self.lag_profile_difference,
                "points": [p.to_dict() for p in self.lag_profile],
            },
            "evidence": self.evidence.to_dict() if self.evidence is not None else None,
            "breaks": self.breaks.to_dict() if self.breaks is not None else None,
            "seasonal": self.seasonal.to_dict() if self.seasonal is not None else None,
            "variance": self.variance.to_dict() if self.variance is not None else None,
        }


def failed_result(name: str, message: str, settings: dict[str, Any]) -> SeriesResult:
    """The result of a series that could not be tested: ``message`` is its one sentence."""
    return SeriesResult(name=name, nobs=0, error=message, verdict=EMPTY_VERDICT, steps=(), tests=(),
                        notes=(message,), settings=dict(settings))


@dataclass(frozen=True)
class LevelTests:
    """Every test computed on Δ^d y: the ADF for each spec and the Φ statistics."""

    difference: int
    adf: dict[str, TestResult]
    phi: dict[str, TestResult]


@dataclass(frozen=True)
class PowerResult:
    """Simulated rejection rates of τ at ``alpha`` against AR(1) coefficients."""

    spec: str
    nobs: int
    lags: int
    alpha: float
    critical_value: float
    coefficients: tuple[float, ...]
    rates: tuple[float, ...]
    reps: int

    def rate(self, coefficient: float) -> float:
        for c, r in zip(self.coefficients, self.rates, strict=True):
            if abs(c - coefficient) < 1e-12:
                return r
        raise KeyError(coefficient)

    def to_dict(self) -> dict[str, Any]:
        return {
            "spec": self.spec, "nobs": self.nobs, "lags": self.lags, "alpha": self.alpha,
            "critical_value": self.critical_value, "reps": self.reps,
            "power": {f"{c:.2f}": r for c, r in zip(self.coefficients, self.rates, strict=True)},
        }


@dataclass(frozen=True)
class RecursiveStatistic:
    """τ on expanding windows: ``ends`` are 0-based positions of each window's last value."""

    spec: str
    lags: int
    ends: np.ndarray
    nobs: np.ndarray
    statistics: np.ndarray
    critical_values: np.ndarray
    alpha: float

    def to_dict(self) -> dict[str, Any]:
        return {
            "spec": self.spec, "lags": self.lags, "alpha": self.alpha,
            "ends": [int(e) for e in self.ends],
            "statistics": [float(v) for v in self.statistics],
            "critical_values": [float(v) for v in self.critical_values],
        }


@dataclass(frozen=True)
class PhillipsPerron:
    """Both Phillips-Perron statistics and the pieces behind them."""

    spec: str
    z_tau: float
    z_alpha: float
    rho: float
    nobs: int
    bandwidth: int
    short_run_variance: float  # γ0
    long_run_variance: float  # λ²


@dataclass(frozen=True)
class DFGLS:
    """The DF-GLS statistic, its lag choice and the GLS-detrended series."""

    spec: str
    statistic: float
    lags: int
    lag_rule: str
    max_lags: int
    nobs: int
    detrended: np.ndarray


@dataclass(frozen=True)
class Evidence:
    """The cross-checks beyond KPSS and their reading; ``tests`` join ``SeriesResult.tests``."""

    difference: int
    spec: str
    tests: tuple[TestResult, ...]
    notes: tuple[str, ...]
    reading: str | None
    agreement: str | None
    break_info: BreakInfo | None = None
    power: PowerResult | None = None
    recursive: RecursiveStatistic | None = None
    phillips_perron: PhillipsPerron | None = field(default=None, compare=False)
    z_alpha_critical_values: dict[str, float] | None = None
    dfgls: DFGLS | None = field(default=None, compare=False, repr=False)
    problems: tuple[str, ...] = ()

    def find(self, test: str) -> TestResult | None:
        return next((t for t in self.tests if t.test == test), None)

    def to_dict(self) -> dict[str, Any]:
        pp = self.phillips_perron
        return {
            "difference": self.difference,
            "spec": self.spec,
            "reading": self.reading,
            "agreement": self.agreement,
            "break": self.break_info.to_dict() if self.break_info else None,
            "power": self.power.to_dict() if self.power else None,
            "recursive": self.recursive.to_dict() if self.recursive else None,
            "phillips_perron": None if pp is None else {
                "z_tau": pp.z_tau, "z_alpha": pp.z_alpha, "bandwidth": pp.bandwidth,
                "long_run_variance": pp.long_run_variance,
                "short_run_variance": pp.short_run_variance,
                "z_alpha_critical_values": self.z_alpha_critical_values,
            },
            "problems": list(self.problems),
        }
