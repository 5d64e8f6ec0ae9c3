"""The grade of a size-controlled verdict ("confirmed", "conflict", "inconclusive").

"confirmed" is granted only where every condition below holds; on the verdict scorecard
(benchmarks/verdict_scorecard.py, 500 replications per cell, T = 50 … 500) verdicts so
graded were right (order and terms) 97.9% of the time pooled, and at least 95.2% in every
cell with 20 or more of them:

1. the order is resolved;
2. KPSS (Kwiatkowski, Phillips, Schmidt & Shin 1992) agrees strictly: no rejection even
   at 10% where the verdict expects none (p ≥ 0.10), a rejection at 1% where it expects
   one (p ≤ 0.01);
3. the classic Dickey-Fuller sequence gives the same order;
4. the union gives the same order at 1% and at 10%;
5. the union gives the same order with Schwert's (1989) long lag maximum;
6. for a unit-root verdict, the union had at least 90% power at this length against a
   stationary AR(1) with φ = 0.95 (its trend components alone when a drift was found);
7. at least 150 observations;
8. no break was found (a Zivot-Andrews rejection caps the grade below "confirmed");
9. no change in the shocks' variance was found (κ2, Sansó, Aragó & Carrion 2004): under
   one KPSS, the classic sequence and the tabulated power, which the other conditions
   use, all assume a constant variance, whichever strategy decided;
10. no seasonal unit root was found (HEGY 1990 for quarters, Beaulieu & Miron 1993 for
   months): the tests of the order assume none, and a seasonal difference may be needed.

"conflict": every KPSS check contradicts the verdict at the chosen level; otherwise
"inconclusive".  The reasons a verdict was not confirmed are kept, for the notes.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from tauscope.engine.results import TestResult

MIN_LENGTH = 150
POWER_NEEDED = 0.90
KPSS_KEEP_ABOVE = 0.10
KPSS_REJECT_BELOW = 0.01


@dataclass(frozen=True)
class Grade:
    agreement: str | None
    missing: tuple[str, ...]  # plain reasons "confirmed" was not granted


def seasonal_root_reason(roots: Sequence[str]) -> str:
    """Why a seasonal unit root keeps the grade down, in plain words."""
    which = ", ".join(roots)
    return (f"a seasonal unit root was found (the cycle {which} wanders instead of returning to a fixed "
            "pattern), which the tests of the order do not allow for: a seasonal difference may be needed")


def _kpss_strict(checks: Sequence[tuple[TestResult, bool]]) -> bool:
    if not checks:
        return False
    for test, expect in checks:
        p = test.p_value
        if p is None:
            return False
        if expect and not p <= KPSS_REJECT_BELOW:
            return False
        if not expect and not p >= KPSS_KEEP_ABOVE:
            return False
    return True


def grade(order: int | None, deterministic: str | None, checks: Sequence[tuple[TestResult, bool]],
          classic_order: int | None, orders_at: dict[float, int | None], long_lag_order: int | None,
          power: tuple[float, float] | None, nobs: int, break_found: bool,
          variance_changed: bool = False, seasonal_roots: Sequence[str] = ()) -> Grade:
    """The grade of the union's verdict from all the evidence (conditions 1-10 above);
    ``seasonal_roots``: the plain names of the seasonal unit roots found ("twice a year" …)."""
    if not checks:
        return Grade(None, ())
    if order is None:
        return Grade("inconclusive", ("the order of integration is unresolved",))
    missing = []
    if not _kpss_strict(checks):
        missing.append("KPSS does not back it strictly (no rejection even at 10% where none is expected, "
                       "a rejection at 1% where one is)")
    if classic_order != order:
        missing.append("the classic sequence gives another order")
    if any(o != order for o in orders_at.values()):
        missing.append("the verdict changes between 1% and 10%")
    if long_lag_order != order:
        missing.append("it changes with a longer maximum lag")
    if order >= 1:
        rate = 0.0 if power is None else (power[1] if deterministic == "constant" else power[0])
        if rate < POWER_NEEDED:
            missing.append(f"at this length the test sees a stationary series with φ = 0.95 less than "
                           f"{round(POWER_NEEDED * 100)}% of the time")
    if nobs < MIN_LENGTH:
        missing.append(f"fewer than {MIN_LENGTH} observations")
    if break_found:
        missing.append("a break is suspected")
    if variance_changed:
        missing.append("the size of the shocks changes over the sample")
    if seasonal_roots:
        missing.append(seasonal_root_reason(seasonal_roots))
    if not missing:
        return Grade("confirmed", ())
    if all(test.reject != expect for test, expect in checks):
        return Grade("conflict", tuple(missing))
    return Grade("inconclusive", tuple(missing))
