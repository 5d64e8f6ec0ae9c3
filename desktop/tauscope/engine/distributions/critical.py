"""Critical values and p-values for the Dickey-Fuller statistics.

* τ (tau): MacKinnon (1994, 1996) response-surface p-values and MacKinnon
  (2010) finite-sample critical values, as implemented in statsmodels
  (``mackinnonp``, ``mackinnoncrit``).  MacKinnon, J.G. (2010), "Critical
  Values for Cointegration Tests", Queen's Economics Department Working Paper
  1227.
* Φ1, Φ2, Φ3: Dickey, D.A. & Fuller, W.A. (1981), "Likelihood Ratio
  Statistics for Autoregressive Time Series with a Unit Root", Econometrica
  49(4), Tables IV-VI, interpolated linearly in 1/n between the tabulated
  sample sizes (so the value moves monotonically between table rows); below the
  table's n = 25, simulated at the regression's own size.
* Standard normal values for the steps where a drift or trend makes the
  statistic asymptotically normal (West 1988).
"""

from __future__ import annotations

import math

import numpy as np
from scipy import special
from statsmodels.tsa.adfvalues import mackinnoncrit, mackinnonp

from tauscope.engine.distributions.small_sample import SMALLEST, small_sample_phi_values

SPEC_CODES = {"trend": "ct", "constant": "c", "none": "n"}
LEVELS = ("1%", "5%", "10%")
_ALPHA_INDEX = {0.01: 0, 0.05: 1, 0.10: 2}

# Dickey & Fuller (1981), Tables IV-VI: upper-tail critical values by sample size n.
# Columns: 10%, 5%, 2.5%, 1%.
_PHI_SIZES = (25.0, 50.0, 100.0, 250.0, 500.0, math.inf)
_PHI_ALPHAS = (0.10, 0.05, 0.025, 0.01)
PHI_TABLES: dict[str, tuple[tuple[float, float, float, float], ...]] = {
    "phi1": (
        (4.12, 5.18, 6.30, 7.88),
        (3.94, 4.86, 5.80, 7.06),
        (3.86, 4.71, 5.57, 6.70),
        (3.81, 4.63, 5.45, 6.52),
        (3.79, 4.61, 5.41, 6.47),
        (3.78, 4.59, 5.38, 6.43),
    ),
    "phi2": (
        (4.67, 5.68, 6.75, 8.21),
        (4.31, 5.13, 5.94, 7.02),
        (4.16, 4.88, 5.59, 6.50),
        (4.07, 4.75, 5.40, 6.22),
        (4.05, 4.71, 5.35, 6.15),
        (4.03, 4.68, 5.31, 6.09),
    ),
    "phi3": (
        (5.91, 7.24, 8.65, 10.61),
        (5.61, 6.73, 7.81, 9.31),
        (5.47, 6.49, 7.44, 8.73),
        (5.39, 6.34, 7.25, 8.43),
        (5.36, 6.30, 7.20, 8.34),
        (5.34, 6.25, 7.16, 8.27),
    ),
}


def _alpha_key(alpha: float) -> float:
    for key in _ALPHA_INDEX:
        if abs(alpha - key) < 1e-12:
            return key
    raise ValueError(f"unsupported significance level {alpha}")


def tau_critical_values(spec: str, nobs: int | float) -> dict[str, float]:
    """MacKinnon (2010) finite-sample critical values of τ at 1%, 5%, 10%."""
    values = mackinnoncrit(N=1, regression=SPEC_CODES[spec], nobs=nobs)
    return {level: float(v) for level, v in zip(LEVELS, values, strict=True)}


def tau_critical_value(spec: str, nobs: int | float, alpha: float) -> float:
    return float(
        mackinnoncrit(N=1, regression=SPEC_CODES[spec], nobs=nobs)[_ALPHA_INDEX[_alpha_key(alpha)]]
    )


def tau_p_value(statistic: float, spec: str) -> float:
    """MacKinnon (1994, 2010) approximate p-value of τ (lower tail)."""
    return float(mackinnonp(statistic, regression=SPEC_CODES[spec], N=1))


def phi_critical_value(name: str, nobs: float, alpha: float) -> float:
    """Dickey & Fuller (1981) critical value of Φ1/Φ2/Φ3 at sample size ``nobs``.

    Linear interpolation in 1/n between tabulated sizes; below n = 25, where the
    table stops, the value simulated at this size
    (:mod:`tauscope.engine.distributions.small_sample`).
    """
    key = _alpha_key(alpha)
    if SMALLEST <= nobs < _PHI_SIZES[0]:
        return small_sample_phi_values(name, int(nobs))[f"{round(key * 100):d}%"]
    column = _PHI_ALPHAS.index(key)
    table = PHI_TABLES[name]
    inverse_sizes = np.array([1.0 / n for n in _PHI_SIZES])  # decreasing, ends at 0
    values = np.array([row[column] for row in table])
    x = 1.0 / max(float(nobs), _PHI_SIZES[0])
    # np.interp needs increasing x.
    return float(np.interp(x, inverse_sizes[::-1], values[::-1]))


def phi_critical_values(name: str, nobs: float) -> dict[str, float]:
    return {
        level: phi_critical_value(name, nobs, a)
        for level, a in zip(LEVELS, (0.01, 0.05, 0.10), strict=True)
    }


def normal_lower(alpha: float) -> float:
    """One-sided lower critical value of the standard normal (−1.645 at 5%)."""
    return float(special.ndtri(alpha))


def normal_two_sided(alpha: float) -> float:
    """Two-sided critical value of |z| (1.960 at 5%)."""
    return float(special.ndtri(1.0 - alpha / 2.0))


def normal_lower_p(z: float) -> float:
    return float(special.ndtr(z))


def normal_two_sided_p(z: float) -> float:
    return float(2.0 * special.ndtr(-abs(z)))
