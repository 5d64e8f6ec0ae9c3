"""Critical values and p-values of :mod:`tauscope.engine.distributions.critical`, cached and without
per-call overhead, for the fast path.

The numbers are the same as critical.py's (the tests check equality):

* τ critical values: MacKinnon (2010) finite-sample response surfaces (statsmodels'
  ``mackinnoncrit``), cached by (spec, nobs): a whole analysis asks for a handful of
  sample sizes hundreds of times.
* τ p-values: MacKinnon (1994) approximate p-values, p = Φ(Σ_i c_i τ^i) with the
  small-p or large-p polynomial as statsmodels' ``mackinnonp`` chooses it, 0 below and
  1 above the tabulated range.  Φ is evaluated with ``scipy.special.ndtr``, the
  function ``scipy.stats.norm.cdf`` calls, so the value is identical.
* Φ1, Φ2, Φ3 critical values: Dickey & Fuller (1981), Tables IV-VI, cached by
  (name, nobs).
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np
from scipy.special import ndtr
from statsmodels.tsa import adfvalues

from tauscope.engine.distributions import critical

_CODES = ("n", "c", "ct")
_MAX = {code: float(adfvalues._tau_maxs[code][0]) for code in _CODES}
_MIN = {code: float(adfvalues._tau_mins[code][0]) for code in _CODES}
_STAR = {code: float(adfvalues._tau_stars[code][0]) for code in _CODES}
# Highest power first, as numpy's polyval takes them.
_SMALL_P = {code: [float(v) for v in adfvalues._tau_smallps[code][0][::-1]] for code in _CODES}
_LARGE_P = {code: [float(v) for v in adfvalues._tau_largeps[code][0][::-1]] for code in _CODES}
_LEVELS = {0.01: "1%", 0.05: "5%", 0.10: "10%"}


def level_label(alpha: float) -> str:
    """The key of ``alpha`` in the critical-value dicts: "1%", "5%" or "10%"."""
    return _level(alpha)


def _level(alpha: float) -> str:
    label = _LEVELS.get(alpha)
    if label is not None:
        return label
    for value, name in _LEVELS.items():
        if abs(alpha - value) < 1e-12:
            return name
    raise ValueError(f"unsupported significance level {alpha}")


@lru_cache(maxsize=8192)
def _tau_critical(spec: str, nobs: int) -> dict[str, float]:
    return critical.tau_critical_values(spec, nobs)


def tau_critical_values(spec: str, nobs: int) -> dict[str, float]:
    """MacKinnon (2010) critical values of τ at 1%, 5%, 10% (a fresh dict each call)."""
    return dict(_tau_critical(spec, nobs))


def tau_critical_value(spec: str, nobs: int, alpha: float) -> float:
    return _tau_critical(spec, nobs)[_level(alpha)]


def tau_p_value(statistic: float, spec: str) -> float:
    """MacKinnon (1994) approximate lower-tail p-value of τ (one series, N = 1).

    The polynomial is evaluated by Horner's rule in the order numpy's ``polyval``
    uses (multiply, then add), so the result is the same to the last bit.
    """
    code = critical.SPEC_CODES[spec]
    if statistic > _MAX[code]:
        return 1.0
    if statistic < _MIN[code]:
        return 0.0
    coefficients = _SMALL_P[code] if statistic <= _STAR[code] else _LARGE_P[code]
    value = 0.0
    for coefficient in coefficients:
        value = value * statistic + coefficient
    return float(ndtr(value))


def tau_p_values(statistics: np.ndarray, spec: str) -> np.ndarray:
    """:func:`tau_p_value` of every element (the same operations elementwise, so the same
    bits: Horner's rule multiply-then-add, then ``ndtr``)."""
    code = critical.SPEC_CODES[spec]
    x = np.asarray(statistics, dtype=float)
    with np.errstate(all="ignore"):
        polynomial = {}
        for name, coefficients in (("small", _SMALL_P[code]), ("large", _LARGE_P[code])):
            value = np.zeros_like(x)
            for coefficient in coefficients:
                value = value * x + coefficient
            polynomial[name] = value
        p = ndtr(np.where(x <= _STAR[code], polynomial["small"], polynomial["large"]))
    return np.asarray(np.where(x > _MAX[code], 1.0, np.where(x < _MIN[code], 0.0, p)))


@lru_cache(maxsize=8192)
def _phi_critical(name: str, nobs: int) -> dict[str, float]:
    return critical.phi_critical_values(name, nobs)


def phi_critical_values(name: str, nobs: int) -> dict[str, float]:
    """Dickey & Fuller (1981) critical values of Φ at 1%, 5%, 10% (a fresh dict each call)."""
    return dict(_phi_critical(name, nobs))


def phi_critical_value(name: str, nobs: int, alpha: float) -> float:
    return _phi_critical(name, nobs)[_level(alpha)]
