"""DF-GLS finite-sample critical values and p-values at the series' own length, from the
response surfaces of :mod:`tauscope.engine.distributions.dfgls_surface` (fitted to a
simulation of the engine's whole DF-GLS procedure, lag choice included:
benchmarks/dfgls_critical_surface.py).

q_α(T) = b0 + b1/√T + b2/T + b3/T^1.5 + b4/T² at α = 1%, 2.5%, 5%, 10%, 20%, 50%, 80%,
90%, 95%, 99%, fitted for 10 ≤ T ≤ 1000; longer series get the T = 1000 values (the
surfaces are not extrapolated).  The p-value of a statistic is read off these quantiles
by linear interpolation in α (as MacKinnon 1994 reads p-values off quantile surfaces);
outside the 1%-99% range it is only bounded.  As T grows the values approach, slowly
(the lag search widens with T), the limits of Elliott, Rothenberg & Stock (1996): the
Dickey-Fuller values without deterministic terms in the constant case (5% and 10% within
0.02 at T = 1000, 1% within 0.06), their Table 1 in the trend case (within 0.03-0.11).
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.dfgls_surface import COEFFICIENTS, LARGEST, LEVELS, SMALLEST

LABELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}


@lru_cache(maxsize=1024)
def _quantiles(spec: str, length: int) -> tuple[float, ...]:
    inverse = 1.0 / float(min(length, LARGEST))
    powers = np.array([1.0, inverse**0.5, inverse, inverse**1.5, inverse**2])
    values = np.array(COEFFICIENTS[spec]) @ powers
    return tuple(float(v) for v in np.maximum.accumulate(values))  # never decreasing in α


def covers(length: int) -> bool:
    """Whether the surfaces were fitted at lengths this short."""
    return length >= SMALLEST


def surface_quantiles(spec: str, length: int) -> dict[float, float]:
    """q_α(T) for every fitted level α."""
    return dict(zip(LEVELS, _quantiles(spec, int(length)), strict=True))


def surface_critical_values(spec: str, length: int) -> dict[str, float]:
    """1%, 5% and 10% critical values of DF-GLS ("constant" or "trend") at length T."""
    quantiles = surface_quantiles(spec, length)
    return {label: quantiles[alpha] for label, alpha in LABELS.items()}


def surface_p_value(statistic: float, spec: str, length: int) -> tuple[float, str | None]:
    """(p-value, bound): linear in α between the fitted quantiles; "below" 0.01 or
    "above" 0.99 outside them."""
    quantiles = _quantiles(spec, int(length))
    if statistic < quantiles[0]:
        return LEVELS[0], "below"
    if statistic > quantiles[-1]:
        return LEVELS[-1], "above"
    return float(np.interp(statistic, quantiles, LEVELS)), None
