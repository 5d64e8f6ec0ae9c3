"""Tauscope's statistics: unit-root tests and the order of integration.

No Qt and no files here: arrays and settings in, frozen result objects out.
"""

from tauscope.engine.analyse import analyse_series
from tauscope.engine.many import analyse_many, iter_analyse
from tauscope.engine.results import LagPoint, SeriesResult, Step, TestResult, Verdict
from tauscope.engine.settings import LAG_RULE_LABELS, LAG_RULES, Settings

__all__ = [
    "LAG_RULES",
    "LAG_RULE_LABELS",
    "LagPoint",
    "SeriesResult",
    "Settings",
    "Step",
    "TestResult",
    "Verdict",
    "analyse_many",
    "analyse_series",
    "iter_analyse",
]
