"""The augmented Dickey-Fuller test (Dickey & Fuller 1979; Said & Dickey 1984).

τ = γ̂ / se(γ̂) from Δy_t = a0 + a2·t + γ·y_{t−1} + Σ β_i Δy_{t−i} + e_t,
compared with MacKinnon (2010) finite-sample critical values; p-values from
MacKinnon's (1994, 2010) response surfaces (via statsmodels).
"""

from __future__ import annotations

import numpy as np

from tauscope.engine.distributions.critical import (
    tau_critical_value,
    tau_critical_values,
    tau_p_value,
)
from tauscope.engine.regression.design import adf_design, column_names, gamma_column
from tauscope.engine.regression.lagchoice import LagChoice
from tauscope.engine.regression.ols import fit
from tauscope.engine.results import Coefficient, Regression, TestResult


def estimate(x: np.ndarray, spec: str, lags: int, difference: int = 0,
             choice: LagChoice | None = None, centre: float = 0.0) -> Regression:
    """Estimate the ADF regression with ``lags`` lags on the longest sample.

    ``centre`` (specs with a constant): y(t−1) enters the regression measured from it,
    which keeps the design well conditioned for a series far from zero; the constant
    is reported as for y(t−1) itself (:meth:`OLSFit.uncentred`)."""
    y, design = adf_design(x, spec, lags, centre=centre)
    result = fit(y, design)
    params, bse = result.uncentred(0, gamma_column(spec), centre)
    names = column_names(spec, lags)
    coefficients = tuple(
        Coefficient(name, float(b), float(se), float(b / se))
        for name, b, se in zip(names, params, bse, strict=True)
    )
    return Regression(
        spec=spec,
        difference=difference,
        lags=lags,
        lag_rule=choice.rule if choice else "fixed",
        max_lags=choice.max_lags if choice else lags,
        nobs=result.nobs,
        first_observation=lags + 1,
        coefficients=coefficients,
        sigma2=result.sigma2,
        rss=result.ssr,
        lag_criteria=choice.criteria if choice else (),
        design=design,
        response=y,
    )


def adf_test(regression: Regression, alpha: float) -> TestResult:
    """τ with its MacKinnon p-value and critical values at the regression's sample size."""
    tau = regression.tau
    critical = tau_critical_value(regression.spec, regression.nobs, alpha)
    return TestResult(
        test="adf",
        spec=regression.spec,
        difference=regression.difference,
        statistic=tau,
        p_value=tau_p_value(tau, regression.spec),
        lags=regression.lags,
        nobs=regression.nobs,
        critical_values=tau_critical_values(regression.spec, regression.nobs),
        reject=bool(tau < critical),
        critical_value=critical,
        lag_rule=regression.lag_rule,
        regression=regression,
    )
