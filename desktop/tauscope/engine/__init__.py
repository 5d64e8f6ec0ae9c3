"""Tauscope's statistics: unit-root tests and the order of integration.

No Qt and no files here: arrays and settings in, frozen result objects out.
"""

from tauscope.engine.analyse import analyse_series
from tauscope.engine.evidence import BreakInfo, Evidence, gather_evidence
from tauscope.engine.many import analyse_many, iter_analyse
from tauscope.engine.power import PowerResult
from tauscope.engine.results import LagPoint, SeriesResult, Step, TestResult, Verdict
from tauscope.engine.sensitivity import RecursiveStatistic
from tauscope.engine.settings import LAG_RULE_LABELS, LAG_RULES, Settings
from tauscope.engine.simulate import exact_critical_values, exact_p_value, null_distribution

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
