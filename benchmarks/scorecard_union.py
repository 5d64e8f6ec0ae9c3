"""The union strategy evaluated straight from the engine's functions, for the scorecard,
with the evidence its grade ("badge") can draw on.

Evidence per series (all computed, none assumed):

* ``kpss``: the KPSS checks of the verdict agree (Kwiatkowski et al. 1992, as the
  engine reads them: I(0) — no rejection on the levels; I(d), d ≥ 1 — rejection on
  Δ^{d−1} y and none on Δ^d y);
* ``kpss_strict``: the same at stricter levels: no rejection even at 10% where none is
  expected, a rejection at 1% where one is;
* ``kpss_against``: every KPSS check contradicts the verdict;
* ``classic``: the classic sequence gives the same order;
* ``alpha``: the union gives the same order at 1% and at 10%;
* ``lags``: the union gives the same order with the other maximum lag (Schwert's long
  rule ⌊12 (T/100)^{1/4}⌋ if a shorter one decided, else the short rule, c = 4);
* ``power90``, ``power95``: for I(1) and I(2), the union had at least 90% power at this
  length against a stationary AR(1) with φ = 0.90 (0.95) (the trend component alone when
  a drift was found); always true for I(0);
* ``length``: the number of observations;
* ``margin``: the deciding statistic's distance from its critical value, M/κ on the
  level that settled the verdict (> 1 rejects).

Candidate grading rules are functions of that evidence; the scorecard measures
P(right | confirmed) for each, so the engine's rule is chosen on figures.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

import numpy as np
from tauscope.engine.unitroot.kpss_fast import kpss_fast

from tauscope.engine.unitroot.union import (
    orders_from_rejections,
    rejections_at,
    union_orders,
    union_power,
)

POWER_PHIS = (0.90, 0.95)  # stationary alternatives a unit-root verdict must have been able to see
POWER_NEEDED = 0.90


@dataclass(frozen=True)
class UnionRun:
    order: np.ndarray
    deterministic: tuple[str | None, ...]
    evidence: dict[str, np.ndarray]


def _kpss_checks(x: np.ndarray, order: int, det: str | None, alpha: float) -> list[tuple[bool, float]]:
    """Each KPSS check of the verdict (as the engine's _kpss_checks): (whether the verdict
    expects a rejection, the p-value; interpolated in KPSS Table 1, so bounded to 0.01-0.10)."""
    if order < 0:
        return []
    if order == 0:
        spec = "trend" if det == "trend" else "constant"
        return [(False, _p(kpss_fast(x, spec, 0, alpha).p_value))]
    below = np.diff(x, n=order - 1) if order > 1 else x
    spec_below = "trend" if det in ("trend", "constant") else "constant"
    return [(True, _p(kpss_fast(below, spec_below, order - 1, alpha).p_value)),
            (False, _p(kpss_fast(np.diff(x, n=order), "constant", order, alpha).p_value))]


def _p(value: float | None) -> float:
    return float("nan") if value is None else float(value)


def _agree(checks: list[tuple[bool, float]], keep_above: float, reject_at: float) -> bool:
    """Every check on the verdict's side: p ≥ ``keep_above`` where no rejection is expected,
    p ≤ ``reject_at`` where one is (the table p-value is 0.01 at and beyond the 1% value)."""
    return bool(checks) and all(p <= reject_at if expect else p >= keep_above for expect, p in checks)


def run_union(xs: np.ndarray, rule: str, alpha: float, max_difference: int,
              max_lags: int | None, fixed: int | None, critical: str,
              classic_order: np.ndarray | None, lag_scale: float = 6.0,
              components: str = "four") -> UnionRun:
    result = union_orders(xs, rule, alpha, max_difference, max_lags, fixed, critical, lag_scale,
                          components)
    order = result.order
    same = np.ones(order.shape[0], dtype=bool)
    for a in (0.01, 0.10):
        other = orders_from_rejections(rejections_at(result.levels, a, critical), max_difference)
        same &= other == order
    kpss_ok = np.zeros(order.shape[0], dtype=bool)
    kpss_strict = np.zeros(order.shape[0], dtype=bool)
    kpss_against = np.zeros(order.shape[0], dtype=bool)
    for i, (o, det) in enumerate(zip(order, result.deterministic, strict=True)):
        checks = _kpss_checks(xs[i], int(o), det, alpha)
        kpss_ok[i] = _agree(checks, alpha, alpha)
        kpss_strict[i] = _agree(checks, 0.10, 0.01)
        kpss_against[i] = bool(checks) and not any(
            p <= alpha if expect else p >= alpha for expect, p in checks)
    other_scale = 4.0 if lag_scale >= 8.0 else 12.0
    other_lags = union_orders(xs, rule, alpha, max_difference, max_lags, fixed, critical, other_scale,
                              components)
    margin = np.full(order.shape[0], np.nan)
    for i, o in enumerate(order):
        level = max_difference if o < 0 else (int(o) - 1 if o > 0 else 0)
        margin[i] = result.levels[level].margin[i]
    powerful = {phi: np.ones(order.shape[0], dtype=bool) for phi in POWER_PHIS}
    for i, (o, det) in enumerate(zip(order, result.deterministic, strict=True)):
        for phi in POWER_PHIS if o >= 1 else ():
            union_rate, trend_rate = union_power(xs.shape[1] - (int(o) - 1), phi, rule, alpha, lag_scale,
                                                 components)
            powerful[phi][i] = (trend_rate if det == "constant" else union_rate) >= POWER_NEEDED
    evidence = {
        "length": np.full(order.shape[0], xs.shape[1]),
        "power90": powerful[0.90],
        "power95": powerful[0.95],
        "kpss": kpss_ok,
        "kpss_strict": kpss_strict,
        "kpss_against": kpss_against,
        "classic": (classic_order == order) if classic_order is not None else np.zeros_like(kpss_ok),
        "alpha": same,
        "lags": other_lags.order == order,
        "margin": margin,
        "resolved": order >= 0,
    }
    return UnionRun(order, result.deterministic, evidence)


Rule = Callable[[np.ndarray, dict[str, np.ndarray]], np.ndarray]


def _clear(order: np.ndarray, e: dict[str, np.ndarray], reject_at: float, keep_at: float) -> np.ndarray:
    """The deciding statistic clearly on its side: M/κ > ``reject_at`` for I(0), and
    M/κ < ``keep_at`` on the level that kept the unit root for I(1) and I(2)."""
    m = e["margin"]
    return np.where(order == 0, m > reject_at, m < keep_at)


BADGE_RULES: dict[str, Rule] = {
    "KPSS agrees": lambda o, e: e["resolved"] & e["kpss"],
    "KPSS + classic": lambda o, e: e["resolved"] & e["kpss"] & e["classic"],
    "KPSS + classic + alpha": lambda o, e: e["resolved"] & e["kpss"] & e["classic"] & e["alpha"],
    "KPSS + classic + alpha + lags": lambda o, e: (
        e["resolved"] & e["kpss"] & e["classic"] & e["alpha"] & e["lags"]),
    "KPSS + classic + alpha + lags + margin": lambda o, e: (
        e["resolved"] & e["kpss"] & e["classic"] & e["alpha"] & e["lags"] & _clear(o, e, 1.25, 0.75)),
    "KPSS + alpha + lags": lambda o, e: e["resolved"] & e["kpss"] & e["alpha"] & e["lags"],
    "KPSS + classic + alpha + lags + power90": lambda o, e: (
        e["resolved"] & e["kpss"] & e["classic"] & e["alpha"] & e["lags"] & e["power90"]),
    "KPSS + classic + alpha + lags + power95": lambda o, e: (
        e["resolved"] & e["kpss"] & e["classic"] & e["alpha"] & e["lags"] & e["power95"]),
    "strict KPSS + classic + alpha + lags + power90": lambda o, e: (
        e["resolved"] & e["kpss_strict"] & e["classic"] & e["alpha"] & e["lags"] & e["power90"]),
    "strict KPSS + classic + alpha + lags + power95": lambda o, e: (
        e["resolved"] & e["kpss_strict"] & e["classic"] & e["alpha"] & e["lags"] & e["power95"]),
    # The proposal: measured on the full grid (500 replications, T = 50 … 500).
    "proposed: strict KPSS + classic + alpha + lags + power95, T >= 150": lambda o, e: (
        e["resolved"] & e["kpss_strict"] & e["classic"] & e["alpha"] & e["lags"] & e["power95"]
        & (e["length"] >= 150)),
    "KPSS + classic + alpha + lags + power95 + margin": lambda o, e: (
        e["resolved"] & e["kpss"] & e["classic"] & e["alpha"] & e["lags"] & e["power95"]
        & _clear(o, e, 1.25, 0.75)),
}


def badge(order: np.ndarray, evidence: dict[str, np.ndarray], rule: str) -> np.ndarray:
    """"confirmed" where ``rule`` holds, "conflict" where every KPSS check contradicts the
    verdict, else "inconclusive"."""
    confirmed = BADGE_RULES[rule](order, evidence)
    return np.where(confirmed, "confirmed", np.where(evidence["kpss_against"], "conflict", "inconclusive"))
