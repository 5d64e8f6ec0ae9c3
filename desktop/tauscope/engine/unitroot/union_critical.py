"""The union of rejections' null distribution and constants, and its lag settings.

Moved out of :mod:`tauscope.engine.unitroot.union` (which re-exports every name), where the
method is described (Harvey, Leybourne & Taylor 2009, 2012): each component i has its own
α-level critical value cv_i, and κ, the (1 − α) quantile of M = max_i τ_i / cv_i over
driftless Gaussian random walks, makes the union's size α.  The null is simulated with a
fixed seed, without lag augmentation, or with the lag choice included on a level that takes
the short-sample rule (:mod:`tauscope.engine.unitroot.union_components`); the constants are
read from the pre-simulated tables where they hold them (:mod:`~tauscope.engine.unitroot.union_lookup`).
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.simulate import DEFAULT_SEED, shock_chunks
from tauscope.engine.seasonal.means import remove_seasonal_means
from tauscope.engine.unitroot.dfgls_many import choose_lags_many
from tauscope.engine.unitroot.union_components import component_values, detrended, min_lag, short
from tauscope.engine.unitroot.union_lookup import plain_constants, table_constants

COMPONENTS = {
    "two": ("gls-constant", "gls-trend"),
    "four": ("gls-constant", "gls-trend", "ols-constant", "ols-trend"),
}
# The union's maximum lag order is ⌊c (T/100)^{1/4}⌋ (Schwert 1989 uses c = 12 and c = 4).
# MAIC picks long lags when the series is far from a unit root, which costs power there
# (white noise called I(1), random walks called I(2)); c = 6 was chosen on the verdict
# scorecard as the value that keeps ARIMA(0,1,1) with θ = −0.8 near its size and the
# AR(1) alternatives near their power (benchmarks/verdict_scorecard.py).
UNION_LAG_SCALE = 6.0
# On the differences (d ≥ 1) the maximum is Schwert's short rule ⌊4 (T/100)^{1/4}⌋: there the
# question is whether the series was over-differenced, and on an over-differenced or white-noise
# series MAIC's τ-term favours long lags, which pull α̂ toward 0 and leave the unit root of
# the difference unrejected (random walks of 50 values called I(2) 19.6% with c = 6, 12.7% with
# c = 4; 2,000 series; DEVELOPERS.md, "Verdict scorecard").  The levels keep c = 6.
DIFFERENCE_LAG_SCALE = 4.0
UNION_REPS = 20_000  # finite-sample constants simulated directly: κ to about ±0.005
POWER_PHI = 0.95  # the tabulated power's AR(1) alternative (the badge's condition)
POWER_REPS = 2_000  # union_power's default replications when simulated directly
ASYMPTOTIC_LENGTH = 2_000
ASYMPTOTIC_REPS = 200_000
# cv of each component (the OLS ones as −1/MSB) and κ, simulated at T = 2,000 with 200,000
# replications, seed DEFAULT_SEED (the same draws as the table's T = 2,000 row; also printed
# by ``python -m tauscope.engine.unitroot.union``).
ASYMPTOTIC: dict[str, dict[float, tuple[tuple[float, ...], float]]] = {
    "two": {
        0.01: ((-2.5739, -3.4178), 1.0670),
        0.05: ((-1.9474, -2.8571), 1.0992),
        0.10: ((-1.6224, -2.5670), 1.1252),
    },
    "four": {
        0.01: ((-2.5739, -3.4178, -6.3076, -7.5595), 1.0993),
        0.05: ((-1.9474, -2.8571, -5.2163, -6.5127), 1.1405),
        0.10: ((-1.6224, -2.5670, -4.6519, -5.9711), 1.1732),
    },
}


def union_rule(rule: str) -> str:
    """The lag rule of the union's components: the user's fixed order, else MAIC whatever
    the user chose (Ng & Perron 2001 built MAIC for the M statistics, and HLT 2009/2012 use
    it; with AIC's long lags MSB does not reject on an over-differenced series, so plainly
    stationary series came out unresolved).  The user's rule still drives the classic
    sequence and the cross-checks."""
    return "fixed" if rule == "fixed" else "maic"


@dataclass(frozen=True)
class UnionConstants:
    """Each component's critical value and the union's scaling κ at level ``alpha``."""

    alpha: float
    components: tuple[str, ...]
    critical_values: tuple[float, ...]
    kappa: float
    length: int | None  # None: asymptotic
    reps: int
    lagged: bool = False  # the null with the lag choice included (the short-sample rule)


def union_null(length: int, reps: int = UNION_REPS, seed: int = DEFAULT_SEED,
               components: tuple[str, ...] = COMPONENTS["four"], period: int | None = None,
               lagged: bool = False) -> np.ndarray:
    """(reps, components) statistics for driftless Gaussian random walks of ``length``
    values, all components from the same path: without lag augmentation, or, with
    ``lagged`` (a level that takes the short-sample rule,
    :func:`~tauscope.engine.unitroot.union_components.short`), with the default lag choice
    applied to each path (MAIC up to ⌊6 (T/100)^{1/4}⌋, at least the short-sample minimum),
    so that the null includes the lag-selection step.  With ``period``, each walk's fixed
    seasonal means are removed first."""
    if length < 10:
        raise ValueError("the union needs at least 10 values")
    parts = []
    cap = max_lags_schwert(length, None, UNION_LAG_SCALE)
    for shocks in shock_chunks(length, reps, seed, width=2 * len(components)):
        paths = np.cumsum(shocks, axis=1)
        if period is not None:
            paths = remove_seasonal_means(paths, period)
        if lagged:
            chosen = {spec: choose_lags_many(paths, spec, "maic", cap, None, min_lag(length, "maic"))
                      for spec in ("constant", "trend")}
            lags = [chosen[c.split("-")[1]] for c in components]
        else:
            lags = [np.zeros(paths.shape[0], dtype=int)] * len(components)
        parts.append(np.column_stack([component_values(detrended(paths, c), c, k)
                                      for c, k in zip(components, lags, strict=True)]))
    return np.vstack(parts)


def constants_from_draws(draws: np.ndarray, alpha: float) -> tuple[tuple[float, ...], float]:
    """Lower α quantile of each column, and κ, the (1 − α) quantile of max_i τ_i/cv_i."""
    cvs = np.quantile(draws, alpha, axis=0)
    kappa = float(np.quantile(np.max(draws / cvs, axis=1), 1.0 - alpha))
    return tuple(float(c) for c in cvs), kappa


@lru_cache(maxsize=64)
def _simulated(length: int, reps: int, seed: int, components: tuple[str, ...],
               period: int | None = None, lagged: bool = False) -> np.ndarray:
    draws = union_null(length, reps, seed, components, period, lagged)
    draws.setflags(write=False)
    return draws


def union_constants(length: int | None, alpha: float = 0.05, components: str = "four",
                    reps: int = UNION_REPS, seed: int = DEFAULT_SEED,
                    source: str = "table", period: int | None = None,
                    lagged: bool = False) -> UnionConstants:
    """The constants at the series' own ``length``, or the asymptotic ones for
    ``length=None``.  ``source="table"``: interpolated from the pre-simulated table when it
    holds this length and α (and ``reps`` and ``seed`` are the defaults), else simulated;
    ``"simulate"``: simulated at ``length`` with ``reps`` replications (cached).  With
    ``period``, simulated with the seasonal means removed (the table holds none).
    ``lagged``: the null with the lag choice included (the short-sample rule, levels of
    fewer than 100 values); the table holds that null below 100 values and the plain one
    from 100, and ``union_table_plain`` the plain one below 100.  Kept per key (the
    same constants are asked for every batch of series of one length)."""
    return _union_constants(None if length is None else int(length), float(alpha), components, int(reps),
                            int(seed), source, period, bool(lagged))


@lru_cache(maxsize=512)
def _union_constants(length: int | None, alpha: float, components: str, reps: int, seed: int,
                     source: str, period: int | None, lagged: bool) -> UnionConstants:
    names = COMPONENTS[components]
    if length is None:
        table = ASYMPTOTIC[components]
        key = next((a for a in table if abs(a - alpha) < 1e-12), None)
        if key is None:
            raise ValueError(f"no asymptotic union constants for alpha = {alpha}")
        cvs, kappa = table[key]
        return UnionConstants(alpha, names, cvs, kappa, None, ASYMPTOTIC_REPS)
    lagged = bool(lagged and short(int(length)))
    if source == "table" and reps == UNION_REPS and seed == DEFAULT_SEED and period is None:
        tabled = (table_constants(int(length), alpha, components) if lagged == short(int(length))
                  else plain_constants(int(length), alpha, components))
        if tabled is not None:
            return UnionConstants(alpha, names, tabled[0], tabled[1], int(length), tabled[2], lagged)
    cvs, kappa = constants_from_draws(
        _simulated(int(length), reps, seed, names, period, lagged), alpha)
    return UnionConstants(alpha, names, cvs, kappa, int(length), reps, lagged)


def level_lag_scale(difference: int, lag_scale: float = UNION_LAG_SCALE) -> float:
    """The union's lag-maximum constant c on the level Δ^``difference``: the default c = 6 on
    the levels and :data:`DIFFERENCE_LAG_SCALE` on the differences (another ``lag_scale``,
    such as the long-lag check's c = 12, applies on every level)."""
    return DIFFERENCE_LAG_SCALE if difference > 0 and lag_scale == UNION_LAG_SCALE else lag_scale


def max_lags_schwert(length: int, max_lags: int | None = None, scale: float = 12.0) -> int:
    """Schwert (1989), ⌊c (T/100)^{1/4}⌋ (c = 12 the long rule, 4 the short one), capped at
    T//2 − 3 as the engine does; ``max_lags`` overrides it."""
    wanted = int(np.floor(scale * (length / 100.0) ** 0.25)) if max_lags is None else max_lags
    return max(0, min(wanted, length // 2 - 3))
