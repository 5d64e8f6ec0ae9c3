"""Tauscope's statistics: unit-root tests and the order of integration.

No Qt and no files here: arrays and settings in, frozen result objects out.

Names are loaded on first use (PEP 562), so that a window can show itself before
statsmodels and scipy are imported; ``from tauscope.engine import Settings`` stays cheap.
"""

from __future__ import annotations

import importlib
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from tauscope.engine.distributions.simulate import (
        exact_critical_values,
        exact_p_value,
        null_distribution,
    )
    from tauscope.engine.procedure.analyse import analyse_series
    from tauscope.engine.procedure.evidence import gather_evidence
    from tauscope.engine.procedure.many import analyse_many, iter_analyse
    from tauscope.engine.results import (
        BreakInfo,
        Evidence,
        LagPoint,
        PowerResult,
        RecursiveStatistic,
        SeriesResult,
        Step,
        TestResult,
        Verdict,
    )
    from tauscope.engine.settings import (
        BREAK_CHECK_LABELS,
        BREAK_CHECK_MODES,
        LAG_RULE_LABELS,
        LAG_RULES,
        SEASONAL_LABELS,
        SEASONAL_MODES,
        STRATEGIES,
        STRATEGY_LABELS,
        Settings,
    )
    from tauscope.engine.unitroot.union_bootstrap import BOOTSTRAP_REPS

_WHERE = {
    "analyse_series": "procedure.analyse",
    "BreakInfo": "results",
    "Evidence": "results",
    "gather_evidence": "procedure.evidence",
    "analyse_many": "procedure.many",
    "iter_analyse": "procedure.many",
    "PowerResult": "results",
    "LagPoint": "results",
    "SeriesResult": "results",
    "Step": "results",
    "TestResult": "results",
    "Verdict": "results",
    "RecursiveStatistic": "results",
    "BREAK_CHECK_LABELS": "settings",
    "BREAK_CHECK_MODES": "settings",
    "LAG_RULE_LABELS": "settings",
    "LAG_RULES": "settings",
    "SEASONAL_LABELS": "settings",
    "SEASONAL_MODES": "settings",
    "STRATEGIES": "settings",
    "STRATEGY_LABELS": "settings",
    "Settings": "settings",
    "BOOTSTRAP_REPS": "unitroot.union_bootstrap",
    "exact_critical_values": "distributions.simulate",
    "exact_p_value": "distributions.simulate",
    "null_distribution": "distributions.simulate",
}

__all__ = [
    "BOOTSTRAP_REPS",
    "BREAK_CHECK_LABELS",
    "BREAK_CHECK_MODES",
    "LAG_RULES",
    "LAG_RULE_LABELS",
    "SEASONAL_LABELS",
    "SEASONAL_MODES",
    "STRATEGIES",
    "STRATEGY_LABELS",
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
