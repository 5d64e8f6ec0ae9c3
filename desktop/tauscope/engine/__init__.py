"""Tauscope's statistics: unit-root tests and the order of integration.

No Qt and no files here: arrays and settings in, frozen result objects out.

Names are loaded on first use (PEP 562), so that a window can show itself before
statsmodels and scipy are imported; ``from tauscope.engine import Settings`` stays cheap.
"""

from __future__ import annotations

import importlib
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from tauscope.engine.analyse import analyse_series
    from tauscope.engine.evidence import BreakInfo, Evidence, gather_evidence
    from tauscope.engine.many import analyse_many, iter_analyse
    from tauscope.engine.power import PowerResult
    from tauscope.engine.results import LagPoint, SeriesResult, Step, TestResult, Verdict
    from tauscope.engine.sensitivity import RecursiveStatistic
    from tauscope.engine.settings import LAG_RULE_LABELS, LAG_RULES, Settings
    from tauscope.engine.simulate import exact_critical_values, exact_p_value, null_distribution

_WHERE = {
    "analyse_series": "analyse",
    "BreakInfo": "evidence",
    "Evidence": "evidence",
    "gather_evidence": "evidence",
    "analyse_many": "many",
    "iter_analyse": "many",
    "PowerResult": "power",
    "LagPoint": "results",
    "SeriesResult": "results",
    "Step": "results",
    "TestResult": "results",
    "Verdict": "results",
    "RecursiveStatistic": "sensitivity",
    "LAG_RULE_LABELS": "settings",
    "LAG_RULES": "settings",
    "Settings": "settings",
    "exact_critical_values": "simulate",
    "exact_p_value": "simulate",
    "null_distribution": "simulate",
}

__all__ = [
    "LAG_RULES",
    "LAG_RULE_LABELS",
    "BreakInfo",
    "Evidence",
    "LagPoint",
    "PowerResult",
    "RecursiveStatistic",
    "SeriesResult",
    "Settings",
    "Step",
    "TestResult",
    "Verdict",
    "analyse_many",
    "analyse_series",
    "exact_critical_values",
    "exact_p_value",
    "gather_evidence",
    "iter_analyse",
    "null_distribution",
]


def __getattr__(name: str) -> Any:
    module = _WHERE.get(name)
    if module is None:
        raise AttributeError(f"module 'tauscope.engine' has no attribute {name!r}")
    value = getattr(importlib.import_module(f"tauscope.engine.{module}"), name)
    globals()[name] = value
    return value


def __dir__() -> list[str]:
    return sorted(set(globals()) | set(_WHERE))
