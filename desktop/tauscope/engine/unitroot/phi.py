"""Dickey & Fuller (1981) joint F statistics.

F = ((RSS_r − RSS_u)/q) / (RSS_u/(n − k_u)), restricted and unrestricted
regressions on the same sample and the same lagged differences:

* Φ1, constant spec: a0 = γ = 0 (no drift and a unit root), q = 2;
* Φ2, trend spec: a0 = a2 = γ = 0, q = 3;
* Φ3, trend spec: a2 = γ = 0 (no trend and a unit root; a0 free), q = 2.

Critical values: Dickey & Fuller (1981), Econometrica 49(4), Tables IV-VI.
"""

from __future__ import annotations

import numpy as np

from tauscope.engine.distributions import tables as fast_tables
from tauscope.engine.regression.ols import fit
from tauscope.engine.results import Regression, TestResult
from tauscope.engine.results_build import new_test_result

RESTRICTED_OUT = {
    "phi1": ("constant", "y(t-1)"),
    "phi2": ("constant", "trend", "y(t-1)"),
    "phi3": ("trend", "y(t-1)"),
}
PHI_SPEC = {"phi1": "constant", "phi2": "trend", "phi3": "trend"}


def restricted_rss(regression: Regression, name: str) -> float:
    dropped = RESTRICTED_OUT[name]
    keep = [i for i, c in enumerate(regression.coefficients) if c.name not in dropped]
    y = regression.response
    if not keep:
        return float(np.dot(y, y))
    return fit(y, regression.design[:, keep]).ssr


def f_statistic(rss_restricted: float, regression: Regression, name: str) -> float:
    """F = ((RSS_r − RSS_u)/q) / (RSS_u/(n − k_u)) for Φ ``name`` on the unrestricted ``regression``."""
    if regression.spec != PHI_SPEC[name]:
        raise ValueError(f"{name} needs the {PHI_SPEC[name]} specification")
    q = len(RESTRICTED_OUT[name])
    k = len(regression.coefficients)
    rss_u = regression.rss
    return ((rss_restricted - rss_u) / q) / (rss_u / (regression.nobs - k))


def phi_statistic(regression: Regression, name: str) -> float:
    return f_statistic(restricted_rss(regression, name), regression, name)


def phi_result(regression: Regression, name: str, statistic: float, alpha: float) -> TestResult:
    """The Φ test result with its Dickey & Fuller (1981) critical values (cached tables)."""
    critical = fast_tables.phi_critical_value(name, regression.nobs, alpha)
    return new_test_result(name, regression.spec, regression.difference, statistic, None,
                           regression.lags, regression.nobs,
                           fast_tables.phi_critical_values(name, regression.nobs),
                           bool(statistic > critical), critical, None, regression.lag_rule, regression)


def phi_test(regression: Regression, name: str, alpha: float) -> TestResult:
    return phi_result(regression, name, phi_statistic(regression, name), alpha)
