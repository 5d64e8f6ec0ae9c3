"""Known processes for the verdict scorecard (benchmarks/verdict_scorecard.py).

Every generator draws ``reps`` series of ``length`` values from a numpy Generator,
with Gaussian shocks e_t ~ N(0, 1) and a burn-in of 100 values for the stationary
parts (so the start is drawn from near the stationary distribution).  Each process
carries what a right verdict is: the order of integration and, where the terms are
part of the design, the deterministic label (``None``: the label is not judged).
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

import numpy as np

BURN = 100
MEAN = 3.0  # level of the "around a mean" processes, in shock standard deviations
SLOPE = 0.1  # slope of the "around a trend" processes per period, in shock standard deviations

Generator = Callable[[np.random.Generator, int, int], np.ndarray]


@dataclass(frozen=True)
class Process:
    name: str
    make: Generator
    order: int
    deterministic: str | None
    unit_root: bool  # counts for the size rows (a true unit root in the levels)
    period: int | None = None  # 4 or 12: the series get quarterly or monthly dates
    seasonal_root: bool = False  # a unit root at a seasonal frequency (issue 14)


def ar1(rng: np.random.Generator, reps: int, length: int, phi: float,
        shocks: np.ndarray | None = None) -> np.ndarray:
    """u_t = φ u_{t−1} + e_t after a burn-in."""
    e = rng.standard_normal((reps, length + BURN)) if shocks is None else shocks
    u = np.empty_like(e)
    u[:, 0] = e[:, 0]
    for t in range(1, e.shape[1]):
        u[:, t] = phi * u[:, t - 1] + e[:, t]
    return u[:, BURN:]


def _ar_mean(phi: float) -> Generator:
    return lambda rng, reps, n: MEAN + ar1(rng, reps, n, phi)


def _ar_trend(phi: float) -> Generator:
    return lambda rng, reps, n: MEAN + SLOPE * np.arange(1.0, n + 1.0) + ar1(rng, reps, n, phi)


def _walk(drift: float) -> Generator:
    return lambda rng, reps, n: np.cumsum(drift + rng.standard_normal((reps, n)), axis=1)


def _arima110(phi: float) -> Generator:
    return lambda rng, reps, n: np.cumsum(ar1(rng, reps, n, phi), axis=1)


def _arima011(theta: float) -> Generator:
    def make(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
        e = rng.standard_normal((reps, n + 1))
        return np.cumsum(e[:, 1:] + theta * e[:, :-1], axis=1)
    return make


def _i2(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
    return np.cumsum(np.cumsum(rng.standard_normal((reps, n)), axis=1), axis=1)


def _level_shift(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
    """AR(1), φ = 0.5, around a mean that rises by 4 shock standard deviations halfway."""
    shift = np.where(np.arange(n) >= n // 2, 4.0, 0.0)
    return MEAN + shift + ar1(rng, reps, n, 0.5)


def _garch_walk(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
    """Random walk whose shocks are GARCH(1,1): h_t = 0.05 + 0.10 ε²_{t−1} + 0.85 h_{t−1}
    (unconditional variance 1)."""
    z = rng.standard_normal((reps, n + BURN))
    eps = np.empty_like(z)
    h = np.ones(reps)
    for t in range(n + BURN):
        eps[:, t] = np.sqrt(h) * z[:, t]
        h = 0.05 + 0.10 * eps[:, t] ** 2 + 0.85 * h
    return np.cumsum(eps[:, BURN:], axis=1)


def _variance_walk(scale: float) -> Generator:
    """Random walk whose shocks' standard deviation is multiplied by ``scale`` from mid-sample
    (scale √3: the variance triples; scale 3: the standard deviation triples)."""
    def make(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
        sd = np.where(np.arange(n) >= n // 2, scale, 1.0)
        return np.cumsum(sd * rng.standard_normal((reps, n)), axis=1)
    return make


def _seasonal(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
    """AR(1), φ = 0.5, around a mean with fixed quarterly effects (1.5, −0.5, 1, −2)."""
    pattern = np.resize(np.array([1.5, -0.5, 1.0, -2.0]), n)
    return MEAN + pattern + ar1(rng, reps, n, 0.5)


MONTHLY_EFFECTS = np.array([1.5, -0.5, 1.0, -2.0, 0.5, 1.0, -1.0, 0.0, 2.0, -1.5, 0.5, -1.5])


def _seasonal_monthly(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
    """AR(1), φ = 0.5, around a mean with fixed monthly effects (MONTHLY_EFFECTS, summing to 0)."""
    return MEAN + np.resize(MONTHLY_EFFECTS, n) + ar1(rng, reps, n, 0.5)


def _seasonal_walk(rng: np.random.Generator, reps: int, n: int) -> np.ndarray:
    """Quarterly seasonal random walk y_t = y_{t−4} + e_t from zero starts (a unit root at every
    seasonal frequency and at the long run; Hylleberg, Engle, Granger & Yoo 1990)."""
    years = -(-n // 4)
    e = rng.standard_normal((reps, years * 4))
    return MEAN + e.reshape(reps, years, 4).cumsum(axis=1).reshape(reps, -1)[:, :n]


def grid() -> list[Process]:
    """The scorecard's processes (issue 13 §1)."""
    out: list[Process] = []
    for phi in (0.5, 0.8, 0.9, 0.95):
        out.append(Process(f"AR(1) mean phi={phi}", _ar_mean(phi), 0, "constant", False))
    for phi in (0.5, 0.8, 0.9, 0.95):
        out.append(Process(f"AR(1) trend phi={phi}", _ar_trend(phi), 0, "trend", False))
    out.append(Process("random walk", _walk(0.0), 1, "none", True))
    for drift in (0.1, 0.25, 0.5, 1.0):
        out.append(Process(f"random walk drift={drift}", _walk(drift), 1, "constant", True))
    for phi in (0.3, 0.6):
        out.append(Process(f"ARIMA(1,1,0) phi={phi}", _arima110(phi), 1, "none", True))
    for theta in (-0.8, -0.5, -0.2, 0.2, 0.5):
        out.append(Process(f"ARIMA(0,1,1) theta={theta}", _arima011(theta), 1, "none",
                           theta >= -0.5))
    out.append(Process("I(2)", _i2, 2, "none", True))
    out.append(Process("level shift", _level_shift, 0, None, False))
    out.append(Process("GARCH random walk", _garch_walk, 1, "none", False))
    # issue 14 §4: a random walk whose shock variance triples (or whose sd triples) halfway;
    # judged by its own acceptance row, not the size row.
    out.append(Process("variance x3 walk", _variance_walk(float(np.sqrt(3.0))), 1, "none", False))
    out.append(Process("sd x3 walk", _variance_walk(3.0), 1, "none", False))
    # the variance falls to a third halfway: the case where the usual critical values are too
    # liberal (Cavaliere 2004), so the one that shows what the bootstrap is for
    out.append(Process("variance /3 walk", _variance_walk(float(np.sqrt(1.0 / 3.0))), 1, "none", False))
    out.append(Process("seasonal AR(1)", _seasonal, 0, None, False, period=4))
    out.append(Process("monthly seasonal AR(1)", _seasonal_monthly, 0, None, False, period=12))
    out.append(Process("quarterly seasonal walk", _seasonal_walk, 1, None, False, period=4,
                       seasonal_root=True))
    return out


def by_name(name: str) -> Process:
    extra = {"AR(1) trend phi=0.7": Process("AR(1) trend phi=0.7", _ar_trend(0.7), 0, "trend", False)}
    for p in grid():
        if p.name == name:
            return p
    return extra[name]
