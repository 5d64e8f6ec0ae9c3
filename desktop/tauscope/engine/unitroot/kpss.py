"""KPSS stationarity test (Kwiatkowski, Phillips, Schmidt & Shin 1992,
Journal of Econometrics 54, 159-178): null of stationarity around a level
(η_μ) or a trend (η_τ), automatic bandwidth of Hobijn, Franses & Ooms (1998),
Bartlett kernel; via statsmodels.  The p-value is interpolated in KPSS
Table 1 and only bounded outside 0.01-0.10."""

from __future__ import annotations

import warnings

import numpy as np
from statsmodels.tools.sm_exceptions import InterpolationWarning
from statsmodels.tsa.stattools import kpss

from tauscope.engine.regression.scaling import centred
from tauscope.engine.results import TestResult

_KPSS_LEVEL = {0.01: "1%", 0.05: "5%", 0.10: "10%"}


def kpss_test(x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult:
    """``spec`` is ``"constant"`` (level null) or ``"trend"`` (trend null).  Raises
    ValueError (one sentence) when the automatic bandwidth is not finite."""
    x = centred(np.asarray(x, dtype=float), spec)  # the level only moves the fitted mean
    # A zero autocovariance sum in the bandwidth rule divides by zero (numpy warns) and then
    # overflows (caught below, with our own sentence): the warning would only repeat it.
    with warnings.catch_warnings(), np.errstate(divide="ignore"):
        warnings.simplefilter("ignore", InterpolationWarning)
        try:
            result = kpss(x, regression="ct" if spec == "trend" else "c", nlags="auto", result_object=True)
        except OverflowError:  # the bandwidth rule divides by a zero autocovariance sum
            raise ValueError("its automatic bandwidth is not finite for this series") from None
    critical_values = {k: float(v) for k, v in result.critical_values.items() if k in ("1%", "5%", "10%")}
    level = next(v for a, v in _KPSS_LEVEL.items() if abs(a - alpha) < 1e-12)
    p = float(result.pvalue)
    bound = "below" if p <= 0.01 else "above" if p >= 0.10 else None
    return TestResult(
        test="kpss",
        spec=spec,
        difference=difference,
        statistic=float(result.statistic),
        p_value=p,
        lags=int(result.lags),
        nobs=int(x.shape[0]),
        critical_values=critical_values,
        reject=bool(result.statistic > critical_values[level]),
        critical_value=critical_values[level],
        p_value_bound=bound,
        lag_rule="Hobijn-Franses-Ooms automatic bandwidth",
    )
