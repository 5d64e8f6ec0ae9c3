"""Standardising a series before the regressions, so that its scale and level cannot
spoil the arithmetic.

τ, the Φ statistics, the lag criteria's choices, KPSS, Phillips-Perron, DF-GLS and
Zivot-Andrews do not depend on the unit of the series (multiply y by c ≠ 0 and they
are unchanged), and in the specifications with a constant they do not depend on its
level either (add a constant to y and only the regression's constant moves).  Floating
point arithmetic, however, does: a series around 1e9 makes the constant and y(t−1)
columns nearly collinear, one near 1e308 overflows in sums of squares, one near 1e-12
falls under absolute thresholds.  So the regressions see

    z = y / s,       s = 2^k chosen so that the typical change of z is of order 1,

and, in the specifications with a constant, y(t−1) enters measured from its mean m.
Because s is a power of two, z = y/s is exact in binary floating point: the numbers
are those of the unscaled arithmetic, multiplied back by s (exactly) at the end.
"""

from __future__ import annotations

import math

import numpy as np


def power_of_two_scale(x: np.ndarray) -> float:
    """s = 2^k with the root mean square of Δ(y/s) in [0.5, 1), found without overflow
    (first divided by the power of two above max |y|, so every change stays finite).
    A series without changes, or with no finite value, gets the scale of its size
    (or 1)."""
    values = np.asarray(x, dtype=float)
    finite = values[np.isfinite(values)]
    if finite.size == 0:
        return 1.0
    largest = float(np.max(np.abs(finite)))
    if largest == 0.0:
        return 1.0
    first = math.frexp(largest)[1]  # largest < 2^first
    u = np.ldexp(finite, -first)
    if u.size < 2:
        return _power_of_two(first)
    changes = np.diff(u)
    rms = math.sqrt(float(np.mean(changes * changes)))
    if not rms > 0.0:
        return _power_of_two(first)
    return _power_of_two(first + math.frexp(rms)[1])


def _power_of_two(exponent: int) -> float:
    """2^exponent, kept among the normal floats (2^-1022 … 2^1023)."""
    return math.ldexp(1.0, min(max(exponent, -1022), 1023))


def scaled(x: np.ndarray, scale: float) -> np.ndarray:
    """y / s, exact for s a power of two."""
    return np.asarray(np.asarray(x, dtype=float) / scale)


def level_centre(x: np.ndarray, spec: str) -> float:
    """The value y(t−1) is measured from in the regression ``spec``: its mean when the
    regression has a constant (only the constant's estimate moves, and it is moved
    back), 0 without one (there the level matters)."""
    if spec == "none":
        return 0.0
    return float(np.mean(x))


def centred(x: np.ndarray, spec: str) -> np.ndarray:
    """y − mean(y) for a test with a constant (which does not depend on the level),
    y itself without one."""
    x = np.asarray(x, dtype=float)
    return x if spec == "none" else x - float(np.mean(x))
