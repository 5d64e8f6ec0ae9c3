"""The variance-change check of one series (``SeriesResult.variance``), plain data.

κ2 of Sansó, Aragó & Carrion (2004) on the shocks of the levels' Dickey-Fuller regression
with a trend (:mod:`tauscope.engine.unitroot.variance_change`), computed whatever the
strategy (with the union's lag order when the union decides, with the levels' ADF trend
regression's under the classic sequence).  A change found keeps the verdict below
"confirmed" (:mod:`tauscope.engine.reading.grade`, and the classic sequence's cap in
:mod:`tauscope.engine.procedure.read`).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from tauscope.engine.finite import finite_or_none as _num


@dataclass(frozen=True)
class VarianceCheck:
    """``statistic`` κ2; ``critical_value`` and ``p_value`` (asymptotic: the supremum of a
    Brownian bridge) at ``alpha``; ``found``: the variance changes; ``position`` (0-based,
    in the series) and ``label``: where it changes most."""

    statistic: float
    critical_value: float
    p_value: float
    alpha: float
    found: bool
    position: int
    label: str

    def to_dict(self) -> dict[str, Any]:
        return {
            "test": "kappa2",
            "statistic": _num(self.statistic),
            "critical_value": _num(self.critical_value),
            "p_value": _num(self.p_value),
            "alpha": self.alpha,
            "found": self.found,
            "position": self.position,
            "label": self.label,
        }
