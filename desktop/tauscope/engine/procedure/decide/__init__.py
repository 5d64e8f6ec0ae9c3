"""The decide stage: a strategy turns the estimates into an order of integration.

A strategy is one module with one function ``decide(estimates, options) -> Decision``
(:data:`tauscope.engine.procedure.stages.Strategy`), registered here by name.  It reads
only :class:`~tauscope.engine.procedure.stages.Estimates`; the cross-check, the reading
and the result are shared by every strategy.

* ``classic``: the Dickey-Fuller testing sequence of Dolado, Jenkinson &
  Sosvilla-Rivero (1990) on each difference, from the highest down (:mod:`.classic`);
* ``union``: the size-controlled default, the union of rejections over the deterministic
  terms (Harvey, Leybourne & Taylor 2009, 2012) from the highest difference down, the
  classic path shown beside it (:mod:`.union`);
* ``bootstrap``: the same union with its critical value from the wild bootstrap
  (Smeekes & Taylor 2012), valid when the shocks' variance changes (:mod:`.bootstrap`).
"""

from __future__ import annotations

from tauscope.engine.procedure.decide import bootstrap, classic, union
from tauscope.engine.procedure.stages import Strategy

STRATEGIES: dict[str, Strategy] = {"union": union.decide, "bootstrap": bootstrap.decide,
                                   "classic": classic.decide}
