"""The union of rejections for a batch of series of one length, as plain data per series.

:func:`union_rows` calls :func:`tauscope.engine.unitroot.union.union_orders` once for
the whole batch (Harvey, Leybourne & Taylor 2009, 2012; from the highest difference
down, Dickey & Pantula 1987) and splits its arrays into one :class:`UnionRow` per
series, with what the reading and the grade need beside the order:

* the order at 1% and at 10% from the same statistics (``rejections_at``);
* the order with Schwert's (1989) long lag maximum ⌊12 (T/100)^{1/4}⌋;
* the trend test's z_λ and critical value (Harvey, Leybourne & Taylor 2007);
* for a unit-root verdict, the union's simulated power at that length against a
  stationary AR(1) with φ = 0.95 (``union_power``);
* the test for a change in the shocks' variance (κ2, Sansó, Aragó & Carrion 2004;
  :mod:`tauscope.engine.unitroot.variance_change`) on the levels.

With ``bootstrap=True`` each level's decision is the wild bootstrap's (Smeekes & Taylor
2012; :mod:`tauscope.engine.unitroot.union_bootstrap`): M against its bootstrap critical
value, which takes κ's place, at 5% and at 1% and 10%; the label is then read for the
bootstrap's order.  The long-lag check and the power stay those of κ.

Every operation is row by row, so one series alone gets the same numbers as inside a
batch: the fast path and the reference path share this computation.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.unitroot.trend_robust import trend_critical_value
from tauscope.engine.unitroot.union import (
    UNION_LAG_SCALE,
    UnionConstants,
    UnionLevel,
    deterministic_labels,
    level_lag_scale,
    level_rows,
    max_lags_schwert,
    orders_from_rejections,
    rejections_at,
    union_constants,
    union_order,
    union_orders,
    union_power,
    union_rule,
)
from tauscope.engine.unitroot.union_bootstrap import ALPHAS as BOOT_ALPHAS
from tauscope.engine.unitroot.union_bootstrap import BOOTSTRAP_REPS, BootstrapLevel, bootstrap_level
from tauscope.engine.unitroot.variance_change import VarianceChange, variance_changes

LONG_LAG_SCALE = 12.0  # Schwert's long rule
POWER_PHI = 0.95
OTHER_ALPHAS = (0.01, 0.10)


@dataclass(frozen=True)
class UnionLevelRow:
    """The union on Δ^d y for one series: each component's statistic and lag order, its
    own critical values at 1/5/10% (``component_values``), κ, M and the decision."""

    difference: int
    nobs: int
    components: tuple[str, ...]
    tau: tuple[float, ...]
    lags: tuple[int, ...]
    max_lags: int
    critical_values: tuple[float, ...]  # cv_i at the level alpha
    component_values: tuple[dict[str, float], ...]
    kappa: float
    statistic: float  # M = max_i τ_i / cv_i
    reject: bool
    p_value: float | None = None  # the bootstrap p-value of M, when the bootstrap decided

    @property
    def margin(self) -> float:
        return self.statistic / self.kappa


@dataclass(frozen=True)
class UnionRow:
    """The union's verdict for one series and the evidence beside it."""

    order: int | None
    deterministic: str | None
    levels: dict[int, UnionLevelRow]
    trend_z: float
    trend_critical_value: float
    trend_difference: int | None  # where the trend test ran (0 levels, 1 first difference)
    orders_at: dict[float, int | None]  # the order at 1% and at 10%
    long_lag_order: int | None
    power: tuple[float, float] | None  # (union, trend components) against AR(1) φ = 0.95
    problem: str | None = None  # one sentence when a statistic the decision used is not a number
    variance: VarianceChange | None = None  # the test for a change in the shocks' variance
    bootstrap_reps: int | None = None  # B, when the wild bootstrap decided


@lru_cache(maxsize=256)
def _constants(length: int | None, alpha: float, period: int | None = None,
               lagged: bool = False) -> UnionConstants:
    """The union's constants at this length and level, kept for the next batch."""
    return union_constants(length, alpha, period=period, lagged=lagged)


def _order(value: int) -> int | None:
    return None if value < 0 else int(value)


def union_rows(xs: np.ndarray, rule: str, alpha: float, max_difference: int,
               max_lags: int | None, fixed: int | None, bootstrap: bool = False,
               period: int | None = None) -> list[UnionRow]:
    """One :class:`UnionRow` per row of ``xs`` (series of one length); with ``period``,
    every level's fixed seasonal means are removed first (seasonal dummies).  The union's
    lag rule is MAIC whatever ``rule`` says, a fixed order excepted (:func:`union_rule`)."""
    xs = np.asarray(xs, dtype=float)
    rule = union_rule(rule)
    with np.errstate(all="ignore"):
        result = union_orders(xs, rule, alpha, max_difference, max_lags, fixed, period=period)
        at = {a: orders_from_rejections(rejections_at(result.levels, a, period=period), max_difference)
              for a in OTHER_ALPHAS}
        long = union_order(xs, rule, alpha, max_difference, max_lags, fixed,
                           lag_scale=LONG_LAG_SCALE, known=result, period=period)
    boot: dict[int, BootstrapLevel] = {}
    order_all, labels, trend_z = result.order, result.deterministic, result.trend_z
    if bootstrap:
        boot = _bootstrap(xs, result.levels, rule, max_lags, fixed, period)
        decided = {a: orders_from_rejections(
            {d: _margin(result.levels[d].margin * result.levels[d].constants.kappa, boot[d], a) > 1.0
             for d in boot}, max_difference) for a in BOOT_ALPHAS}
        order_all = decided[_alpha_key(alpha)]
        at = {a: decided[_alpha_key(a)] for a in OTHER_ALPHAS}
        with np.errstate(all="ignore"):
            labels, trend_z = deterministic_labels(xs, order_all, result.levels, rule, alpha, max_lags, fixed,
                                                   period=period)
    per_alpha = {d: {a: _constants(level.constants.length, a, period, level.constants.lagged)
                     for a in (0.01, 0.05, 0.10)}
                 for d, level in result.levels.items()}
    # Everything that is the same for every row of a level, and each array as a list once
    # (the same Python numbers as indexing element by element).
    shared = {}
    for d, level in result.levels.items():
        c = level.constants
        comps = c.components
        n = xs.shape[1] - d
        values = tuple({f"{round(a * 100)}%": per_alpha[d][a].critical_values[j]
                        for a in (0.01, 0.05, 0.10)} for j in range(len(comps)))
        # Per row: the tuple of its components' lag orders and statistics (zip transposes).
        lag_lists = [[int(v) for v in level.lags[name.split("-")[1]].tolist()] for name in comps]
        tau_lists = [level.tau[name].tolist() for name in comps]
        shared[d] = (c, comps, n, values, _level_max_lags(n, d, rule, max_lags, fixed),
                     list(zip(*lag_lists, strict=True)), list(zip(*tau_lists, strict=True)),
                     level.margin.tolist(), [bool(v) for v in level.reject.tolist()])
    trend_values: dict[int, float] = {}
    orders, z_list, long_list = order_all.tolist(), trend_z.tolist(), long.tolist()
    at_lists = {a: at[a].tolist() for a in OTHER_ALPHAS}
    variances = _variances(xs, result.levels[0].lags["trend"], alpha)
    rows = []
    for i in range(xs.shape[0]):
        order = _order(int(orders[i]))
        det = labels[i]
        levels = {}
        for d, (c, comps, n, values, level_max, lag_rows, tau_rows, margin, rejects) in shared.items():
            statistic = margin[i] * c.kappa
            kappa, reject, p_value = c.kappa, rejects[i], None
            if d in boot:
                kappa = float(boot[d].critical[i, BOOT_ALPHAS.index(_alpha_key(alpha))])
                reject, p_value = bool(statistic > kappa), float(boot[d].p_value[i])
            levels[d] = UnionLevelRow(
                d, n, comps, tau_rows[i], lag_rows[i], level_max,
                c.critical_values, values, kappa, statistic, reject, p_value)
        problem = _problem(levels, order, max_difference)
        trend_d = None if order is None else (1 if order == 2 else 0)
        trend_cv = float("nan")
        if trend_d is not None:
            if trend_d not in trend_values:
                n = xs.shape[1] - trend_d
                trend_values[trend_d] = trend_critical_value(
                    n, alpha, rule, _level_max_lags(n, trend_d, rule, max_lags, fixed), difference=trend_d)
            trend_cv = trend_values[trend_d]
        power = None
        if order is not None and order >= 1 and problem is None:
            power = union_power(xs.shape[1] - (order - 1), POWER_PHI, rule, alpha)
        rows.append(UnionRow(order, det, levels, float(z_list[i]), trend_cv, trend_d,
                             {a: _order(int(at_lists[a][i])) for a in OTHER_ALPHAS},
                             _order(int(long_list[i])), power, problem,
                             variances[i],
                             BOOTSTRAP_REPS if bootstrap else None))
    return rows


def _alpha_key(alpha: float) -> float:
    return min(BOOT_ALPHAS, key=lambda a: abs(a - alpha))


def _margin(statistic: np.ndarray, level: BootstrapLevel, alpha: float) -> np.ndarray:
    """M / q*_α for every row (NaN stays NaN: no rejection)."""
    with np.errstate(all="ignore"):
        return np.asarray(statistic / level.critical[:, BOOT_ALPHAS.index(alpha)])


def _bootstrap(xs: np.ndarray, levels: dict[int, UnionLevel], rule: str, max_lags: int | None,
               fixed: int | None, period: int | None = None) -> dict[int, BootstrapLevel]:
    """The wild bootstrap of the union on every difference level (each series alone)."""
    out = {}
    for d, level in levels.items():
        xd = level_rows(xs, d, period)
        out[d] = bootstrap_level(xd, level, rule, _level_max_lags(xd.shape[1], d, rule, max_lags, fixed), fixed,
                                 period=period)
    return out


def _variances(xs: np.ndarray, lags: np.ndarray, alpha: float) -> list[VarianceChange | None]:
    """κ2 on the shocks of every row's levels, with the union's lag order for the trend case."""
    with np.errstate(all="ignore"):
        return variance_changes(xs, np.asarray(lags, dtype=int), alpha)


def _level_max_lags(n: int, d: int, rule: str, max_lags: int | None, fixed: int | None) -> int:
    """The union's maximum lag order on the level Δ^d of n values (as ``union_orders``)."""
    if rule == "fixed":
        return int(fixed or 0)
    return max_lags_schwert(n, max_lags, level_lag_scale(d, UNION_LAG_SCALE))


def _problem(levels: dict[int, UnionLevelRow], order: int | None, max_difference: int) -> str | None:
    """A statistic that is not a number on a level the decision used is an error (the
    estimate stage raises it for that series), never a silent "do not reject"."""
    lowest = max_difference if order is None else max(order - 1, 0)
    for d in range(max_difference, lowest - 1, -1):
        if not np.isfinite(levels[d].statistic):
            where = {0: "the levels", 1: "the first difference", 2: "the second difference"}[d]
            return (f"the size-controlled unit-root test could not be computed on {where} "
                    "(a statistic is not a number)")
    return None
