"""The size-controlled strategy robust to changing volatility: the wild bootstrap union.

Smeekes, S. & Taylor, A.M.R. (2012), Econometric Theory 28(2); Cavaliere, G. & Taylor,
A.M.R. (2008), Econometric Theory 24(1).  The same union of rejections as :mod:`.union`
(four Dickey-Fuller t statistics, from the highest difference down, the label from the
trend test of Harvey, Leybourne & Taylor 2007), with the union statistic M judged against
its wild-bootstrap critical value instead of κ (computed in the estimate stage,
:mod:`tauscope.engine.unitroot.union_bootstrap`); every step is marked ``"bootstrap"``.
"""

from __future__ import annotations

from tauscope.engine.procedure.decide import union
from tauscope.engine.procedure.stages import DecideOptions, Decision, Estimates

STRATEGY = "bootstrap"


def decide(estimates: Estimates, options: DecideOptions) -> Decision:
    """The bootstrap union's order and label; the classic sequence beside it."""
    return union.decide_as(estimates, options, STRATEGY)
