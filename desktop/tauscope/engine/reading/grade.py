"""The grade of a size-controlled verdict ("confirmed", "conflict", "inconclusive").

"confirmed" is granted only where every condition below holds; on the verdict scorecard
(benchmarks/verdict_scorecard.py, 500 replications per cell, T = 50 … 500) verdicts so
graded were right (order and terms) 98.1% of the time pooled (10.3% of series confirmed; the
union of DF-GLS and MSB), at least 95.2% in every cell with 20 or more confirmed (issue 13 asks
for 90%); without condition 12 all 20 confirmed verdicts of ARIMA(0,1,1) θ = −0.8, T = 150 were
wrong:

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
11. for a unit-root verdict without drift, enough observations for the trend test to see a
    drift of δ = 0.1 shock standard deviations per period 90% of the time: under I(1) the
   trend test is asymptotically the t ratio of the mean of Δy (Harvey, Leybourne & Taylor
   2007), whose mean under a drift δ is about δ√T, so T ≥ ((z_{0.975} + z_{0.90})/δ)² ≈
   1,051.  The same rule as 6 (a non-rejection is confirmed only where the test had power),
   for the label; it was added when the union's power at T = 500 rose above 90% (the MSB
   components) and random walks with a drift of 0.1σ, whose drift the trend test misses
   about 40% of the time at T = 500, were confirmed "no drift".
12. for an I(0) verdict, the first-order autocorrelation r₁ of Δy (its fixed seasonal means
    removed when the tests allow for them) is not below :data:`MA_CANCEL_BELOW`.  A unit
    root whose moving average nearly cancels it, Δy_t = e_t + θ e_{t−1} with θ near −1, has
    ρ₁ = θ/(1 + θ²) (−0.49 at θ = −0.8, −0.40 at θ = −0.5), close to the −0.5 of a
    white-noise series differenced once, and there the unit-root tests over-reject and
    cannot tell the two apart (Schwert 1989; Pantula 1991); a stationary AR(1) with φ ≥ 0.5
    gives ρ₁ = −(1 − φ)/2 ≥ −0.25.  The threshold is this project's choice, measured on the
    verdict scorecard (DEVELOPERS.md, "Verdict scorecard").

"conflict": every KPSS check contradicts the verdict at the chosen level; otherwise
"inconclusive".  The reasons a verdict was not confirmed are kept, for the notes.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from statistics import NormalDist

import numpy as np

from tauscope.engine import formatting as fmt
from tauscope.engine.results import TestResult

MIN_LENGTH = 150
POWER_NEEDED = 0.90
KPSS_KEEP_ABOVE = 0.10
KPSS_REJECT_BELOW = 0.01
NO_DRIFT_DELTA = 0.1  # the smallest drift of the verdict scorecard, in shock standard deviations
MA_CANCEL_BELOW = -0.35  # condition 12: r₁ of Δy below this withholds "confirmed" from an I(0) verdict
NO_DRIFT_LENGTH = math.ceil(((NormalDist().inv_cdf(0.975) + NormalDist().inv_cdf(POWER_NEEDED)) / NO_DRIFT_DELTA) ** 2)


@dataclass(frozen=True)
class Grade:
    agreement: str | None
    missing: tuple[str, ...]  # plain reasons "confirmed" was not granted


# The reason a change in the shocks' size (κ2) gives for withholding "confirmed".
VARIANCE_CHANGED = "the size of the shocks changes over the sample"


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
          variance_changed: bool = False, seasonal_roots: Sequence[str] = (),
          difference_autocorrelation: float | None = None) -> Grade:
    """The grade of the union's verdict from all the evidence (conditions 1-12 above);
    ``seasonal_roots``: the plain names of the seasonal unit roots found ("twice a year" …);
    ``difference_autocorrelation``: r₁ of Δy (:func:`first_autocorrelation`)."""
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
    if order >= 1 and deterministic == "none" and nobs < NO_DRIFT_LENGTH:
        missing.append(f"fewer than {NO_DRIFT_LENGTH:,} observations, too few to rule out a small drift")
    if nobs < MIN_LENGTH:
        missing.append(f"fewer than {MIN_LENGTH} observations")
    if break_found:
        missing.append("a break is suspected")
    if variance_changed:
        missing.append(VARIANCE_CHANGED)
    if seasonal_roots:
        missing.append(seasonal_root_reason(seasonal_roots))
    r1 = difference_autocorrelation
    if order == 0 and r1 is not None and r1 < MA_CANCEL_BELOW:
        missing.append(f"the changes of the series alternate strongly (first autocorrelation {fmt.stat(r1)}): "
                       "a unit root whose moving average nearly cancels it looks just like this, and the "
                       "tests cannot tell the two apart")
    if not missing:
        return Grade("confirmed", ())
    if all(test.reject != expect for test, expect in checks):
        return Grade("conflict", tuple(missing))
    return Grade("inconclusive", tuple(missing))


def first_autocorrelation(x: np.ndarray) -> float | None:
    """r₁ = Σ (x_t − x̄)(x_{t−1} − x̄) / Σ (x_t − x̄)² (Box & Jenkins 1970); None below three
    values or for a constant series."""
    x = np.asarray(x, dtype=float)
    if x.size < 3:
        return None
    c = x - x.mean()
    denom = float(c @ c)
    return None if denom <= 0.0 or not np.isfinite(denom) else float(c[1:] @ c[:-1]) / denom
