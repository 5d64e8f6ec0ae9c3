"""The union of rejections over the deterministic terms, and the order it implies.

Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2009), "Unit root testing in practice:
dealing with uncertainty over the trend and initial condition", Econometric Theory
25(3), 587-636; (2012), "Testing for unit roots in the presence of uncertainty over
both the trend and initial condition", Journal of Econometrics 169(2), 188-195.

Components: the Dickey-Fuller t statistic on the GLS-detrended series (DF-GLS, c̄ = −7
with a constant, −13.5 with a trend; Elliott, Rothenberg & Stock 1996) and, in the
four-test form of HLT (2012), a statistic on the OLS-detrended series, which keeps its
power when the initial observation is far from the mean, where the GLS versions lose it:
here MSB (Stock 1999; Perron & Ng 1996) with Ng & Perron's (2001) s²_AR, which keeps more
power with MAIC lags (:mod:`tauscope.engine.unitroot.union_components`, which also holds
the short-sample rule: on the levels (d = 0) of fewer than 100 values a minimum lag
(``SHORT_MIN_LAG``) and a null simulated with the lag choice included).
Each component i has its own α-level critical value cv_i (τ_i below stands for any
component's statistic); the unit root is rejected when any

    τ_i < κ·cv_i,   i.e. when   M = max_i τ_i / cv_i > κ,

and κ ≥ 1, the (1 − α) quantile of M under the null, makes the union's size α.  The
null is simulated (driftless Gaussian random walks, fixed seed; no lag augmentation except
on a level that takes the short-sample rule):
``critical="finite"`` at the series' own length, read from the table simulated once on a
grid of lengths and interpolated in 1/T (:mod:`tauscope.engine.unitroot.union_lookup`;
simulated directly, cached, below the grid), ``"simulate"`` always simulated directly at
the series' length, ``"asymptotic"`` the large-T values of :data:`ASYMPTOTIC`.  All
components are invariant to the level, and the trend ones to a linear trend, so a drifting
unit root is no easier to reject.  The lag order of each deterministic case is chosen
once, on the OLS-detrended series (MAIC, Ng & Perron 2001; Perron & Qu 2007), and used
by both of its components.  The engine takes MAIC here whatever the user's lag rule (a
fixed order excepted): Ng & Perron (2001) built MAIC for these statistics and HLT (2009,
2012) use it; AIC's long lags on an over-differenced series leave MSB without power
(:func:`union_rule`).

The order of integration comes from the highest difference down (Dickey, D.A. &
Pantula, S.G. 1987, JBES 5(4)): the union on Δ^d y for d = max, …, 0 while it rejects;
the first non-rejection at d gives I(d + 1).  The deterministic label comes from the
trend test of :mod:`tauscope.engine.unitroot.trend_robust`, valid under I(0) and I(1).

Fixed seasonal means (``period`` S = 4 or 12): every level Δ^d y has its seasonal means
removed first (OLS on [1, t, seasonal contrasts], :mod:`tauscope.engine.seasonal.means`),
which gives each component its limit with seasonal dummies in the deterministic set: that
without them (Dickey, Bell & Miller 1986).  The constants are then simulated directly at the
series' own length with the same removal applied to the simulated walks (cached per length;
the asymptotic ones are unchanged).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.simulate import DEFAULT_SEED
from tauscope.engine.seasonal.means import remove_seasonal_means
from tauscope.engine.unitroot.dfgls_many import (
    VECTOR_RULES,
    choose_lags_detrended,
    choose_lags_stacked,
)
from tauscope.engine.unitroot.trend_robust import (
    trend_critical_value,
    trend_found,
    trend_statistics,
)
from tauscope.engine.unitroot.union_components import components_values, detrended, min_lag
from tauscope.engine.unitroot.union_critical import ASYMPTOTIC as ASYMPTOTIC
from tauscope.engine.unitroot.union_critical import ASYMPTOTIC_LENGTH as ASYMPTOTIC_LENGTH
from tauscope.engine.unitroot.union_critical import ASYMPTOTIC_REPS as ASYMPTOTIC_REPS
from tauscope.engine.unitroot.union_critical import COMPONENTS as COMPONENTS
from tauscope.engine.unitroot.union_critical import DIFFERENCE_LAG_SCALE as DIFFERENCE_LAG_SCALE
from tauscope.engine.unitroot.union_critical import POWER_PHI as POWER_PHI
from tauscope.engine.unitroot.union_critical import POWER_REPS as POWER_REPS
from tauscope.engine.unitroot.union_critical import UNION_LAG_SCALE as UNION_LAG_SCALE
from tauscope.engine.unitroot.union_critical import UNION_REPS as UNION_REPS
from tauscope.engine.unitroot.union_critical import UnionConstants as UnionConstants
from tauscope.engine.unitroot.union_critical import constants_from_draws as constants_from_draws
from tauscope.engine.unitroot.union_critical import level_lag_scale as level_lag_scale
from tauscope.engine.unitroot.union_critical import max_lags_schwert as max_lags_schwert
from tauscope.engine.unitroot.union_critical import union_constants as union_constants
from tauscope.engine.unitroot.union_critical import union_null as union_null
from tauscope.engine.unitroot.union_critical import union_rule as union_rule
from tauscope.engine.unitroot.union_lookup import table_power


@dataclass(frozen=True)
class UnionLevel:
    """The union on one difference level for every series: each component's statistic,
    the lag order per deterministic case, the constants, the margin M/κ (> 1: reject)
    and the decision."""

    difference: int
    tau: dict[str, np.ndarray]
    lags: dict[str, np.ndarray]
    constants: UnionConstants
    margin: np.ndarray
    reject: np.ndarray
    # The detrended rows by component ("ols-constant" …), kept so that another run on
    # the same level (another lag maximum) detrends once; not part of the result.
    detrended: dict[str, np.ndarray] = field(default_factory=dict, repr=False, compare=False)

    @property
    def tau_trend(self) -> np.ndarray:
        """DF-GLS with a trend (the U of the trend test)."""
        return self.tau["gls-trend"]


def margins(tau: dict[str, np.ndarray], constants: UnionConstants) -> np.ndarray:
    """M/κ = max_i (τ_i / cv_i) / κ for every series."""
    ratios = np.column_stack([tau[c] / cv for c, cv in zip(constants.components, constants.critical_values,
                                                          strict=True)])
    with np.errstate(invalid="ignore"):
        return np.asarray(np.max(ratios, axis=1) / constants.kappa)


def union_level(xs: np.ndarray, difference: int, rule: str, max_lags: int, alpha: float,
                fixed: int | None = None, critical: str = "finite",
                components: str = "four", known: UnionLevel | None = None,
                period: int | None = None) -> UnionLevel:
    """The union of rejections on every row of ``xs`` (already differenced ``difference`` times,
    and with its seasonal means removed when ``period`` is given).

    ``known``: the union on the same rows of the same level with another lag maximum;
    its detrended series are reused, and so is a component's statistic on every row
    whose lag order comes out the same (each row's statistic depends only on that row
    and its lag order, so the numbers are those computed afresh)."""
    series = dict(known.detrended) if known is not None else {}

    def rows_of(component: str) -> np.ndarray:
        if component not in series:
            series[component] = detrended(xs, component)
        return series[component]

    floor = min_lag(xs.shape[1], rule, difference)
    specs = ("constant", "trend")
    if rule in VECTOR_RULES and max_lags > 0:  # both cases' criteria in one call
        chosen = choose_lags_stacked([rows_of(f"ols-{spec}") for spec in specs], rule, max_lags, floor)
        lags = dict(zip(specs, chosen, strict=True))
    else:
        lags = {spec: choose_lags_detrended(xs, None, spec, rule, max_lags, fixed, floor) for spec in specs}
    names = COMPONENTS[components]
    tau = dict(zip(names, _component_taus([(rows_of(c), lags[c.split("-")[1]], c) for c in names], known),
                   strict=True))
    constants = union_constants(None if critical == "asymptotic" else xs.shape[1], alpha, components,
                                source=_source(critical), period=period, lagged=floor > 0)
    margin = margins(tau, constants)
    return UnionLevel(difference, tau, lags, constants, margin, np.asarray(margin > 1.0), series)


def _component_taus(parts: list[tuple[np.ndarray, np.ndarray, str]], known: UnionLevel | None
                    ) -> list[np.ndarray]:
    """Each component's statistic of every row (DF-GLS t, or −1/MSB) for (detrended rows,
    lag orders, component), taken from ``known`` where it used the same lag order; the
    others computed together (:func:`components_values`)."""
    out: list[np.ndarray] = []
    asked: list[tuple[np.ndarray, str, np.ndarray]] = []
    where: list[tuple[int, np.ndarray | None]] = []
    for rows, lags, component in parts:
        spec = component.split("-")[1]
        if known is None or component not in known.tau or spec not in known.lags:
            where.append((len(out), None))
            out.append(np.empty(0))
            asked.append((rows, component, lags))
            continue
        tau = np.array(known.tau[component], dtype=float)
        fresh = np.flatnonzero(np.asarray(known.lags[spec]) != lags)
        if fresh.size:
            where.append((len(out), fresh))
            asked.append((rows[fresh], component, lags[fresh]))
        out.append(tau)
    for (j, rows_asked), values in zip(where, components_values(asked), strict=True):
        if rows_asked is None:
            out[j] = values
        else:
            out[j][rows_asked] = values
    return out


def _source(critical: str) -> str:
    """"simulate" for ``critical="simulate"`` (direct simulation), else "table"."""
    return "simulate" if critical == "simulate" else "table"


@dataclass(frozen=True)
class UnionOrders:
    """Per series: ``order`` (−1: unresolved, more than ``max_difference``), the
    deterministic label, the trend test's z_λ used for it, and every level visited."""

    order: np.ndarray
    deterministic: tuple[str | None, ...]
    trend_z: np.ndarray
    levels: dict[int, UnionLevel]


def union_orders(xs: np.ndarray, rule: str = "maic", alpha: float = 0.05, max_difference: int = 2,
                 max_lags: int | None = None, fixed: int | None = None,
                 critical: str = "finite", lag_scale: float = UNION_LAG_SCALE,
                 components: str = "four", known: UnionOrders | None = None,
                 period: int | None = None) -> UnionOrders:
    """Order of integration of every row of ``xs`` by the union from the highest
    difference down (Dickey & Pantula 1987), and its deterministic label:

    * I(0): "trend" if the trend test finds a trend in the levels, else "constant";
    * I(1): "constant" (a drift) if it finds a trend in the levels, else "none";
    * I(2): "constant" if it finds a trend in the first difference, else "none".

    ``known``: the same call on the same rows with another ``lag_scale``, whose work is
    reused where it applies (:func:`union_level`).
    With ``period`` (4 or 12), each level's fixed seasonal means are removed first.
    """
    xs = np.asarray(xs, dtype=float)
    levels: dict[int, UnionLevel] = {}
    for d in range(max_difference, -1, -1):
        xd = level_rows(xs, d, period)
        p = fixed if rule == "fixed" else max_lags_schwert(xd.shape[1], max_lags, level_lag_scale(d, lag_scale))
        levels[d] = union_level(xd, d, rule, int(p or 0), alpha, fixed, critical, components,
                                None if known is None else known.levels.get(d), period)
    order = orders_from_rejections({d: level.reject for d, level in levels.items()}, max_difference)
    labels, z = deterministic_labels(xs, order, levels, rule, alpha, max_lags, fixed, critical, lag_scale,
                                     period)
    return UnionOrders(order, labels, z, levels)


def union_order(xs: np.ndarray, rule: str = "maic", alpha: float = 0.05, max_difference: int = 2,
                max_lags: int | None = None, fixed: int | None = None, critical: str = "finite",
                lag_scale: float = UNION_LAG_SCALE, components: str = "four",
                known: UnionOrders | None = None, period: int | None = None) -> np.ndarray:
    """``union_orders(...).order`` alone, without the deterministic label: each level is
    computed only on the rows still open there (those rejected on every level above), as
    Dickey & Pantula's (1987) order reads no other row; every row's numbers depend on that
    row alone, so the orders are those of :func:`union_orders`."""
    xs = np.asarray(xs, dtype=float)
    reject: dict[int, np.ndarray] = {}
    open_rows = np.arange(xs.shape[0])
    for d in range(max_difference, -1, -1):
        reject[d] = np.zeros(xs.shape[0], dtype=bool)
        if open_rows.size == 0:
            continue
        xd = level_rows(xs[open_rows], d, period)
        p = fixed if rule == "fixed" else max_lags_schwert(xd.shape[1], max_lags, level_lag_scale(d, lag_scale))
        before = None if known is None else known.levels.get(d)
        level = union_level(xd, d, rule, int(p or 0), alpha, fixed, critical, components,
                            None if before is None else _rows_of_level(before, open_rows), period)
        reject[d][open_rows] = level.reject
        open_rows = open_rows[level.reject]
    return orders_from_rejections(reject, max_difference)


def _rows_of_level(level: UnionLevel, rows: np.ndarray) -> UnionLevel:
    """The union on some rows of a level (every array row-wise)."""
    return UnionLevel(level.difference, {k: v[rows] for k, v in level.tau.items()},
                      {k: v[rows] for k, v in level.lags.items()}, level.constants, level.margin[rows],
                      level.reject[rows], {k: v[rows] for k, v in level.detrended.items()})


def deterministic_labels(xs: np.ndarray, order: np.ndarray, levels: dict[int, UnionLevel], rule: str,
                         alpha: float, max_lags: int | None, fixed: int | None, critical: str = "finite",
                         lag_scale: float = UNION_LAG_SCALE, period: int | None = None,
                         ) -> tuple[tuple[str | None, ...], np.ndarray]:
    """The label of every row's ``order`` from the trend test (Harvey, Leybourne & Taylor
    2007) on the levels (I(0), I(1)) or the first difference (I(2)), and its z_λ
    (``period``: the seasonal means removed first, as in :func:`union_orders`)."""
    rows = xs.shape[0]
    z = np.full(rows, np.nan)
    trend = np.zeros(rows, dtype=bool)
    for o, d in ((0, 0), (1, 0), (2, 1)):
        chosen = order == o
        if not chosen.any() or d not in levels:
            continue
        xd = level_rows(xs[chosen], d, period)
        z[chosen] = trend_statistics(xd, levels[d].tau_trend[chosen])["z"]
        p = fixed if rule == "fixed" else max_lags_schwert(xd.shape[1], max_lags, level_lag_scale(d, lag_scale))
        critical_value = trend_critical_value(xd.shape[1], alpha, rule, int(p or 0), source=_source(critical),
                                              difference=d)
        trend[chosen] = trend_found(z[chosen], critical_value)
    labels: list[str | None] = []
    for o, t in zip(order, trend, strict=True):
        if o < 0:
            labels.append(None)
        elif o == 0:
            labels.append("trend" if t else "constant")
        else:
            labels.append("constant" if t else "none")
    return tuple(labels), z


def level_rows(xs: np.ndarray, d: int, period: int | None = None) -> np.ndarray:
    """Δ^d of every row, its fixed seasonal means removed when ``period`` is given."""
    xd = np.diff(xs, n=d, axis=1) if d else xs
    return xd if period is None else np.asarray(remove_seasonal_means(xd, period))


def orders_from_rejections(reject: dict[int, np.ndarray], max_difference: int) -> np.ndarray:
    """Dickey-Pantula from the decisions on each difference level: the first
    non-rejection from the top at d gives d + 1 (−1 when d is the highest level)."""
    rows = reject[max_difference].shape[0]
    order = np.zeros(rows, dtype=int)
    open_rows = np.ones(rows, dtype=bool)
    for d in range(max_difference, -1, -1):
        stop = open_rows & ~reject[d]
        order[stop] = d + 1 if d < max_difference else -1
        open_rows &= ~stop
    return order


def rejections_at(levels: dict[int, UnionLevel], alpha: float, critical: str = "finite",
                  period: int | None = None) -> dict[int, np.ndarray]:
    """The union's decision on every level at another level ``alpha`` (same statistics)."""
    out = {}
    for d, level in levels.items():
        kind = next(k for k, v in COMPONENTS.items() if v == level.constants.components)
        c = union_constants(None if critical == "asymptotic" else level.constants.length, alpha, kind,
                            source=_source(critical), period=period, lagged=level.constants.lagged)
        out[d] = np.asarray(margins(level.tau, c) > 1.0)
    return out


@lru_cache(maxsize=64)
def union_power(length: int, phi: float, rule: str = "maic", alpha: float = 0.05,
                lag_scale: float = UNION_LAG_SCALE, components: str = "four", reps: int = 2_000,
                seed: int = DEFAULT_SEED, source: str = "table") -> tuple[float, float]:
    """Simulated power at ``length`` against a stationary Gaussian AR(1) with coefficient
    ``phi``, started from its stationary distribution: (the union's rejection rate, the
    rate of its trend components alone).  Every component is invariant to the level and
    the trend ones to a linear trend, so the first covers every "around a mean"
    alternative and the second bounds the power against "around a trend" ones from below.

    ``source="table"``: read from the pre-simulated table (interpolated in 1/T, simulated
    with 20,000 replications) when it holds φ, α and this length and every other argument
    is its default; ``"simulate"``: always simulated here, with directly simulated
    constants."""
    if (source == "table" and abs(phi - POWER_PHI) < 1e-12 and rule == "maic" and reps == POWER_REPS
            and lag_scale == UNION_LAG_SCALE and seed == DEFAULT_SEED):
        tabled = table_power(int(length), alpha, components)
        if tabled is not None:
            return tabled
    rng = np.random.default_rng([seed, length, round(phi * 1000)])
    e = rng.standard_normal((reps, length))
    y = np.empty_like(e)
    y[:, 0] = e[:, 0] / np.sqrt(1.0 - phi * phi)
    for t in range(1, length):
        y[:, t] = phi * y[:, t - 1] + e[:, t]
    level = union_level(y, 0, rule, max_lags_schwert(length, None, lag_scale), alpha,
                        critical="simulate" if source == "simulate" else "finite", components=components)
    c = level.constants
    trend_only = np.zeros(reps, dtype=bool)
    for name, cv in zip(c.components, c.critical_values, strict=True):
        if name.endswith("trend"):
            trend_only |= level.tau[name] < c.kappa * cv
    return float(np.mean(level.reject)), float(np.mean(trend_only))


def _print_asymptotic() -> None:  # pragma: no cover - run by hand
    for kind, names in COMPONENTS.items():
        draws = union_null(ASYMPTOTIC_LENGTH, ASYMPTOTIC_REPS, DEFAULT_SEED, names)
        for alpha in (0.01, 0.05, 0.10):
            cvs, kappa = constants_from_draws(draws, alpha)
            print(kind, alpha, tuple(round(v, 4) for v in cvs), round(kappa, 4))


if __name__ == "__main__":  # pragma: no cover
    _print_asymptotic()
