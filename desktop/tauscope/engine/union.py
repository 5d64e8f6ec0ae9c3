"""The union of rejections over the deterministic terms, and the order it implies.

Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2009), "Unit root testing in practice:
dealing with uncertainty over the trend and initial condition", Econometric Theory
25(3), 587-636; (2012), "Testing for unit roots in the presence of uncertainty over
both the trend and initial condition", Journal of Econometrics 169(2), 188-195.

With τ_μ and τ_τ the DF-GLS statistics with a constant (c̄ = −7) and with a trend
(c̄ = −13.5), and cv_μ, cv_τ their own α-level critical values, the unit root is
rejected when

    τ_μ < κ·cv_μ   or   τ_τ < κ·cv_τ,

i.e. when M = max(τ_μ/cv_μ, τ_τ/cv_τ) > κ.  κ ≥ 1 is the (1 − α) quantile of M under
the null, so the pair has size α together; it is simulated (driftless Gaussian
random walks, no lag augmentation, fixed seed).  Both statistics are invariant to
the level, and τ_τ to a linear trend, so a drifting unit root is no easier to reject.
``critical="finite"`` simulates cv_μ, cv_τ and κ at the series' own length;
``"asymptotic"`` uses the large-T values of :data:`ASYMPTOTIC`.

The order of integration comes from the highest difference down (Dickey, D.A. &
Pantula, S.G. 1987, JBES 5(4)): the union on Δ^d y for d = max, …, 0 while it rejects;
the first non-rejection at d gives I(d + 1).  The deterministic label comes from the
trend test of :mod:`tauscope.engine.trend_robust`, valid under I(0) and I(1).
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.dfgls_many import dfgls_many, dfgls_tau_many, gls_detrend_many
from tauscope.engine.simulate import DEFAULT_SEED, shock_chunks
from tauscope.engine.trend_robust import trend_critical_value, trend_found, trend_statistics

UNION_REPS = 20_000  # finite-sample constants: κ to about ±0.005
ASYMPTOTIC_LENGTH = 2_000
ASYMPTOTIC_REPS = 200_000
# (cv_μ, cv_τ, κ) simulated at T = 2,000 with 200,000 replications, seed DEFAULT_SEED,
# by ``python -m tauscope.engine.union``.
ASYMPTOTIC: dict[float, tuple[float, float, float]] = {
    0.01: (-2.5739, -3.4178, 1.0670),
    0.05: (-1.9474, -2.8571, 1.0992),
    0.10: (-1.6224, -2.5670, 1.1252),
}


@dataclass(frozen=True)
class UnionConstants:
    """Critical values of each DF-GLS statistic and the union's scaling κ at level ``alpha``."""

    alpha: float
    cv_constant: float
    cv_trend: float
    kappa: float
    length: int | None  # None: asymptotic
    reps: int


def union_null(length: int, reps: int = UNION_REPS, seed: int = DEFAULT_SEED) -> tuple[np.ndarray, np.ndarray]:
    """(τ_μ, τ_τ) for ``reps`` driftless Gaussian random walks of ``length`` values, both
    statistics from the same path, DF-GLS without lag augmentation."""
    if length < 10:
        raise ValueError("the union needs at least 10 values")
    mu_parts, tau_parts = [], []
    for shocks in shock_chunks(length, reps, seed, width=4):
        paths = np.cumsum(shocks, axis=1)
        zeros = np.zeros(paths.shape[0], dtype=int)
        mu_parts.append(dfgls_tau_many(gls_detrend_many(paths, "constant"), zeros))
        tau_parts.append(dfgls_tau_many(gls_detrend_many(paths, "trend"), zeros))
    return np.concatenate(mu_parts), np.concatenate(tau_parts)


def constants_from_draws(mu: np.ndarray, tau: np.ndarray, alpha: float) -> tuple[float, float, float]:
    """cv_μ, cv_τ (lower α quantiles) and κ, the (1 − α) quantile of max(τ_μ/cv_μ, τ_τ/cv_τ)."""
    cv_mu = float(np.quantile(mu, alpha))
    cv_tau = float(np.quantile(tau, alpha))
    kappa = float(np.quantile(np.maximum(mu / cv_mu, tau / cv_tau), 1.0 - alpha))
    return cv_mu, cv_tau, kappa


@lru_cache(maxsize=64)
def _simulated(length: int, reps: int, seed: int) -> tuple[np.ndarray, np.ndarray]:
    mu, tau = union_null(length, reps, seed)
    mu.setflags(write=False)
    tau.setflags(write=False)
    return mu, tau


def union_constants(length: int | None, alpha: float = 0.05, reps: int = UNION_REPS,
                    seed: int = DEFAULT_SEED) -> UnionConstants:
    """The constants at the series' own ``length`` (simulated, cached), or the asymptotic
    ones for ``length=None``."""
    if length is None:
        key = min(ASYMPTOTIC, key=lambda a: abs(a - alpha)) if ASYMPTOTIC else None
        if key is None or abs(key - alpha) > 1e-12:
            raise ValueError(f"no asymptotic union constants for alpha = {alpha}")
        cv_mu, cv_tau, kappa = ASYMPTOTIC[key]
        return UnionConstants(alpha, cv_mu, cv_tau, kappa, None, ASYMPTOTIC_REPS)
    mu, tau = _simulated(int(length), reps, seed)
    return UnionConstants(alpha, *constants_from_draws(mu, tau, alpha), int(length), reps)


@dataclass(frozen=True)
class UnionLevel:
    """The union on one difference level for every series: statistics, lags, constants,
    the margin M/κ (> 1: reject) and the decision."""

    difference: int
    tau_constant: np.ndarray
    tau_trend: np.ndarray
    lags_constant: np.ndarray
    lags_trend: np.ndarray
    constants: UnionConstants
    margin: np.ndarray
    reject: np.ndarray


def union_level(xs: np.ndarray, difference: int, rule: str, max_lags: int, alpha: float,
                fixed: int | None = None, critical: str = "finite") -> UnionLevel:
    """The union of rejections on every row of ``xs`` (already differenced ``difference`` times)."""
    mu, lags_mu = dfgls_many(xs, "constant", rule, max_lags, fixed)
    tau, lags_tau = dfgls_many(xs, "trend", rule, max_lags, fixed)
    constants = union_constants(None if critical == "asymptotic" else xs.shape[1], alpha)
    with np.errstate(invalid="ignore"):
        margin = np.maximum(mu / constants.cv_constant, tau / constants.cv_trend) / constants.kappa
    reject = np.asarray(margin > 1.0)
    return UnionLevel(difference, mu, tau, lags_mu, lags_tau, constants, margin, reject)


@dataclass(frozen=True)
class UnionOrders:
    """Per series: ``order`` (−1: unresolved, more than ``max_difference``), the
    deterministic label, the trend test's z_λ used for it, and every level visited."""

    order: np.ndarray
    deterministic: tuple[str | None, ...]
    trend_z: np.ndarray
    levels: dict[int, UnionLevel]


def max_lags_schwert(length: int, max_lags: int | None = None, scale: float = 12.0) -> int:
    """Schwert (1989), ⌊c (T/100)^{1/4}⌋ (c = 12 the long rule, 4 the short one), capped at
    T//2 − 3 as the engine does; ``max_lags`` overrides it."""
    wanted = int(np.floor(scale * (length / 100.0) ** 0.25)) if max_lags is None else max_lags
    return max(0, min(wanted, length // 2 - 3))


def union_orders(xs: np.ndarray, rule: str = "maic", alpha: float = 0.05, max_difference: int = 2,
                 max_lags: int | None = None, fixed: int | None = None,
                 critical: str = "finite", lag_scale: float = 12.0) -> UnionOrders:
    """Order of integration of every row of ``xs`` by the union from the highest
    difference down (Dickey & Pantula 1987), and its deterministic label:

    * I(0): "trend" if the trend test finds a trend in the levels, else "constant";
    * I(1): "constant" (a drift) if it finds a trend in the levels, else "none";
    * I(2): "constant" if it finds a trend in the first difference, else "none".
    """
    xs = np.asarray(xs, dtype=float)
    rows = xs.shape[0]
    levels: dict[int, UnionLevel] = {}
    for d in range(max_difference, -1, -1):
        xd = np.diff(xs, n=d, axis=1) if d else xs
        p = fixed if rule == "fixed" else max_lags_schwert(xd.shape[1], max_lags, lag_scale)
        levels[d] = union_level(xd, d, rule, int(p or 0), alpha, fixed, critical)
    order = orders_from_rejections({d: level.reject for d, level in levels.items()}, max_difference)
    z = np.full(rows, np.nan)
    trend = np.zeros(rows, dtype=bool)
    for o, d in ((0, 0), (1, 0), (2, 1)):
        chosen = order == o
        if not chosen.any() or d not in levels:
            continue
        xd = np.diff(xs[chosen], axis=1) if d else xs[chosen]
        z[chosen] = trend_statistics(xd, levels[d].tau_trend[chosen])["z"]
        p = fixed if rule == "fixed" else max_lags_schwert(xd.shape[1], max_lags, lag_scale)
        critical_value = trend_critical_value(xd.shape[1], alpha, rule, int(p or 0))
        trend[chosen] = trend_found(z[chosen], critical_value)
    labels: list[str | None] = []
    for o, t in zip(order, trend, strict=True):
        if o < 0:
            labels.append(None)
        elif o == 0:
            labels.append("trend" if t else "constant")
        else:
            labels.append("constant" if t else "none")
    return UnionOrders(order, tuple(labels), z, levels)


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


def rejections_at(levels: dict[int, UnionLevel], alpha: float, critical: str = "finite") -> dict[int, np.ndarray]:
    """The union's decision on every level at another level ``alpha`` (same statistics)."""
    out = {}
    for d, level in levels.items():
        c = union_constants(None if critical == "asymptotic" else level.constants.length, alpha)
        with np.errstate(invalid="ignore"):
            m = np.maximum(level.tau_constant / c.cv_constant, level.tau_trend / c.cv_trend) / c.kappa
        out[d] = np.asarray(m > 1.0)
    return out


@lru_cache(maxsize=64)
def union_power(length: int, phi: float, rule: str = "maic", alpha: float = 0.05,
                lag_scale: float = 12.0, reps: int = 2_000, seed: int = DEFAULT_SEED) -> tuple[float, float]:
    """Simulated power at ``length`` against a stationary Gaussian AR(1) with coefficient
    ``phi``, started from its stationary distribution: (the union's rejection rate, the
    trend component's alone).  Both statistics are invariant to the level and τ_τ to a
    linear trend, so the first covers every "around a mean" alternative and the second
    bounds the union's power against "around a trend" ones from below."""
    rng = np.random.default_rng([seed, length, round(phi * 1000)])
    e = rng.standard_normal((reps, length))
    y = np.empty_like(e)
    y[:, 0] = e[:, 0] / np.sqrt(1.0 - phi * phi)
    for t in range(1, length):
        y[:, t] = phi * y[:, t - 1] + e[:, t]
    level = union_level(y, 0, rule, max_lags_schwert(length, None, lag_scale), alpha)
    c = level.constants
    return float(np.mean(level.reject)), float(np.mean(level.tau_trend < c.kappa * c.cv_trend))


def _print_asymptotic() -> None:  # pragma: no cover - run by hand
    mu, tau = union_null(ASYMPTOTIC_LENGTH, ASYMPTOTIC_REPS, DEFAULT_SEED)
    for alpha in (0.01, 0.05, 0.10):
        print(alpha, tuple(round(v, 4) for v in constants_from_draws(mu, tau, alpha)))


if __name__ == "__main__":  # pragma: no cover
    _print_asymptotic()
