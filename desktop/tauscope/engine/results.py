"""Frozen result objects.  The window, the reports and the command line all
read these, so a number shown anywhere is the same number (DESIGN.md §2)."""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

import numpy as np
import pandas as pd

from tauscope.engine.regression.record import Regression

if TYPE_CHECKING:
    from tauscope.engine.procedure.evidence import Evidence


def _num(value: float | None) -> float | None:
    if value is None:
        return None
    value = float(value)
    return value if math.isfinite(value) else None


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

    def to_dict(self) -> dict[str, Any]:
        return {
            "order": self.order,
            "deterministic": self.deterministic,
            "unit_root": self.unit_root,
            "agreement": self.agreement,
            "label": self.label,
            "text": self.text,
        }


EMPTY_VERDICT = Verdict(None, None, None, None, "Not tested", "The series could not be tested.")


@dataclass(frozen=True)
class LagPoint:
    lag: int
    statistic: float
    critical_value: float
    reject: bool

    def to_dict(self) -> dict[str, Any]:
        return {
            "lag": self.lag,
            "statistic": _num(self.statistic),
            "critical_value": _num(self.critical_value),
            "reject": self.reject,
        }


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
        }


def failed_result(name: str, message: str, settings: dict[str, Any]) -> SeriesResult:
    """The result of a series that could not be tested: ``message`` is its one sentence."""
    return SeriesResult(name=name, nobs=0, error=message, verdict=EMPTY_VERDICT, steps=(), tests=(),
                        notes=(message,), settings=dict(settings))
