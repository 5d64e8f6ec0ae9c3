"""The union's constants, the trend test's critical value and the union's power read from
the pre-simulated table (:mod:`tauscope.engine.unitroot.union_table`), interpolated in 1/T.

Between two grid lengths T_a < T < T_b every tabulated quantity q is taken linearly in
1/T (the finite-sample corrections of Dickey-Fuller type quantiles are power series in
1/T; MacKinnon 1991, 2010):

    q(T) = q(T_a) + (1/T − 1/T_a) / (1/T_b − 1/T_a) · (q(T_b) − q(T_a)).

The power against AR(1) φ = 0.95 depends on T mainly through c = T(1 − φ) (local-to-unity
asymptotics; Phillips 1987, Elliott, Rothenberg & Stock 1996), and rises steeply in T, so it
is interpolated linearly in T on the probit scale instead: Φ⁻¹(p(T)) linear between
Φ⁻¹(p(T_a)) and Φ⁻¹(p(T_b)) (p clipped to [10⁻⁴, 1 − 10⁻⁴]); measured against direct
simulation at T = 33, 87, 173, 333 its largest error is 0.010, against 0.022 linear in 1/T.

Above the largest grid length the values at that length are used (the table's end is
:data:`tauscope.engine.unitroot.union.ASYMPTOTIC`, simulated at T = 2,000); below the
smallest, at an α or a setting the table does not hold, or without the table (before the
generator's first run), every function returns None and the caller simulates directly.

``method="surface"`` instead fits q = b_0 + b_1/T + b_2/T² by weighted least squares
(weights 1/SE²) over the grid lengths of at least :data:`SURFACE_FROM`
(benchmarks/union_tables_check.py compares the two against direct simulation).
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np
from scipy.stats import norm

try:
    from tauscope.engine.unitroot import union_table as table
except ImportError:  # pragma: no cover - only before the generator's first run
    table = None  # type: ignore[assignment]

try:
    from tauscope.engine.unitroot import union_table_plain as plain
except ImportError:  # pragma: no cover - only before the generator's first run
    plain = None  # type: ignore[assignment]

SURFACE_FROM = 20


def _alpha_key(alpha: float) -> float | None:
    if table is None:
        return None
    return next((a for a in table.NULL[table.GRID[0]] if abs(a - alpha) < 1e-12), None)


def bracket(length: int, scale: str = "inverse") -> tuple[int, int, float] | None:
    """(T_a, T_b, w): the grid lengths around ``length`` and the weight of T_b, linear in
    1/T (``scale="inverse"``) or in T (``"length"``); None below the grid."""
    if table is None:
        return None
    grid = table.GRID
    if length < grid[0]:
        return None
    if length >= grid[-1]:
        return grid[-1], grid[-1], 0.0
    hi = next(i for i, g in enumerate(grid) if g > length)
    lo_t, hi_t = grid[hi - 1], grid[hi]
    if scale == "length":
        return lo_t, hi_t, float((length - lo_t) / (hi_t - lo_t))
    weight = (1.0 / length - 1.0 / lo_t) / (1.0 / hi_t - 1.0 / lo_t)
    return lo_t, hi_t, float(weight)


def _linear(values: dict[int, np.ndarray], length: int, scale: str = "inverse") -> np.ndarray | None:
    where = bracket(length, scale)
    if where is None:
        return None
    lo, hi, w = where
    return np.asarray((1.0 - w) * values[lo] + w * values[hi])


def _probit(p: np.ndarray) -> np.ndarray:
    return np.asarray(norm.ppf(np.clip(p, 1e-4, 1.0 - 1e-4)))


@lru_cache(maxsize=32)
def _surface_coefficients(name: str, alpha: float, kind: str) -> tuple[np.ndarray, np.ndarray]:
    """Per column of a quantity: b (3 × columns) of q = b_0 + b_1/T + b_2/T²."""
    grid = [t for t in table.GRID if t >= SURFACE_FROM]
    q = np.array([_row(name, t, alpha, kind)[0] for t in grid])
    se = np.array([_row(name, t, alpha, kind)[1] for t in grid])
    x = np.column_stack([np.ones(len(grid)), 1.0 / np.asarray(grid), 1.0 / np.asarray(grid) ** 2])
    coefs = []
    for j in range(q.shape[1]):
        w = 1.0 / np.maximum(se[:, j], 1e-6)
        coefs.append(np.linalg.lstsq(x * w[:, None], q[:, j] * w, rcond=None)[0])
    return np.column_stack(coefs), np.asarray(grid)


def _row(name: str, length: int, alpha: float, kind: str) -> tuple[np.ndarray, np.ndarray]:
    """(values, their SEs) of one quantity at a grid length."""
    if name == "null":
        cvs, k4, k2, se4, se2 = table.NULL[length][alpha]
        values = (*cvs[: 2 if kind == "two" else 4], k2 if kind == "two" else k4)
        kappa_se = se2 if kind == "two" else se4
        return np.asarray(values), np.full(len(values), kappa_se)  # κ's SE stands for all
    if name == "trend":
        walk, noise, se_walk, se_noise = table.TREND[length][alpha]
        return np.array([walk, noise]), np.array([se_walk, se_noise])
    rates = table.POWER[length][alpha]
    pair = rates[2:4] if kind == "two" else rates[0:2]
    return np.asarray(pair), np.full(2, max(rates[4], 1e-3))


def lookup(name: str, length: int, alpha: float, kind: str = "four",
           method: str = "linear") -> np.ndarray | None:
    """A quantity ("null", "trend" or "power") at ``length``, or None if not tabulated."""
    key = _alpha_key(alpha)
    if key is None or bracket(length) is None:
        return None
    if method == "surface" and name != "power" and length >= SURFACE_FROM:
        coefs, grid = _surface_coefficients(name, key, kind)
        t = float(min(length, grid[-1]))
        return np.asarray(np.array([1.0, 1.0 / t, 1.0 / t ** 2]) @ coefs)
    if name == "power":
        probits = _linear({t: _probit(_row(name, t, key, kind)[0]) for t in table.GRID}, length, "length")
        return None if probits is None else np.asarray(norm.cdf(probits))
    return _linear({t: _row(name, t, key, kind)[0] for t in table.GRID}, length)


def table_constants(length: int, alpha: float, kind: str,
                    method: str = "linear") -> tuple[tuple[float, ...], float, int] | None:
    """(each component's cv, κ, the fewest replications behind them) at ``length``."""
    values = lookup("null", length, alpha, kind, method)
    if values is None:
        return None
    where = bracket(length)
    assert where is not None
    reps = min(table.NULL_REPS[where[0]], table.NULL_REPS[where[1]])
    return tuple(float(v) for v in values[:-1]), float(values[-1]), reps


def table_trend_critical_value(length: int, alpha: float, method: str = "linear") -> float | None:
    """The larger of the interpolated 1 − α quantiles of |z_λ| under I(1) and I(0) and the
    normal two-sided value (the rule of ``trend_critical_value``)."""
    values = lookup("trend", length, alpha, "four", method)
    if values is None:
        return None
    return max(float(norm.ppf(1.0 - alpha / 2.0)), float(values[0]), float(values[1]))


def table_power(length: int, alpha: float, kind: str) -> tuple[float, float] | None:
    """(the union's power, its trend components' power) against AR(1) φ = POWER_PHI."""
    values = lookup("power", length, alpha, kind)
    if values is None:
        return None
    return float(np.clip(values[0], 0.0, 1.0)), float(np.clip(values[1], 0.0, 1.0))


def plain_constants(length: int, alpha: float, kind: str) -> tuple[tuple[float, ...], float, int] | None:
    """(each component's cv, κ, replications) of the null without lag augmentation at a
    length below 100 (a difference of a short series), interpolated in 1/T between the grid
    lengths of :mod:`~tauscope.engine.unitroot.union_table_plain`, and between its last one
    and the main table's T = 100 (plain there); None outside that range."""
    key = _alpha_key(alpha)
    if plain is None or table is None or key is None or not plain.GRID[0] <= length < 100:
        return None
    rows = {t: plain.NULL[t][key] for t in plain.GRID}
    rows[100] = table.NULL[100][key]
    grid = sorted(rows)
    hi = next(i for i, g in enumerate(grid) if g > length)
    lo_t, hi_t = grid[hi - 1], grid[hi]
    w = (1.0 / length - 1.0 / lo_t) / (1.0 / hi_t - 1.0 / lo_t)
    columns = 2 if kind == "two" else 4

    def values(t: int) -> np.ndarray:
        cvs, k4, k2, *_ = rows[t]
        return np.asarray((*cvs[:columns], k2 if kind == "two" else k4))

    got = (1.0 - w) * values(lo_t) + w * values(hi_t)
    return tuple(float(v) for v in got[:-1]), float(got[-1]), int(plain.NULL_REPS)
