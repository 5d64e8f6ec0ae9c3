"""Simulated ("exact") critical values are precise enough to quote: the Monte Carlo
standard error of the 1% value of τ is at most 0.005 (so ±0.01 with 95% confidence).

Sources: MacKinnon (2010), "Critical Values for Cointegration Tests", QED Working Paper
1227, finite-sample response surfaces via statsmodels' ``mackinnoncrit(N=1, regression,
nobs)`` (their own error is far below 0.005); the standard error of a quantile,
sqrt(p(1 − p)/R)/f(q) (e.g. Serfling 1980, Approximation Theorems of Mathematical
Statistics, §2.3), with f estimated by a Gaussian kernel, and by batch means.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from statsmodels.tsa.adfvalues import mackinnoncrit

from tauscope.engine.distributions.exact import EXACT_REPS, streamed_quantiles
from tauscope.engine.distributions.simulate import (
    DEFAULT_SEED,
    P_VALUE_REPS,
    exact_critical_values,
    null_distribution,
)

NOBS = 50
CODES = {"none": "n", "constant": "c", "trend": "ct"}


def _kernel_standard_error(draws: np.ndarray, p: float, reps: int) -> float:
    q = float(np.quantile(draws, p))
    h = 1.06 * float(np.std(draws)) * draws.shape[0] ** (-0.2)  # Silverman's bandwidth
    density = float(np.mean(np.exp(-0.5 * ((draws - q) / h) ** 2))) / (h * math.sqrt(2.0 * math.pi))
    return math.sqrt(p * (1.0 - p) / reps) / density


@pytest.mark.parametrize("spec", ["none", "constant", "trend"])
def test_exact_tau_values_have_standard_error_below_half_a_hundredth(spec: str) -> None:
    quantiles = streamed_quantiles(NOBS, 0, EXACT_REPS, DEFAULT_SEED)[f"tau_{spec}"]
    assert quantiles.standard_errors["1%"] <= 0.005  # batch means
    draws = null_distribution(spec, NOBS, P_VALUE_REPS, DEFAULT_SEED)
    assert _kernel_standard_error(draws, 0.01, EXACT_REPS) <= 0.005  # the asymptotic formula
    # What 10,000 replications gave: an error near 0.03-0.04, too coarse for two decimals.
    assert _kernel_standard_error(draws, 0.01, 10_000) > 0.02
    published = mackinnoncrit(N=1, regression=CODES[spec], nobs=NOBS)  # MacKinnon (2010)
    simulated = exact_critical_values(spec, NOBS)
    for level, value in zip(("1%", "5%", "10%"), published, strict=True):
        assert simulated[level] == pytest.approx(float(value), abs=0.015), (spec, level)


def test_exact_phi_values_carry_their_standard_errors() -> None:
    # The Φ densities are flatter in the upper tail: at 10⁶ replications the 1% value is
    # still within about ±0.03 (two standard errors); 5% and 10% within ±0.02.
    quantiles = streamed_quantiles(NOBS, 0, EXACT_REPS, DEFAULT_SEED)
    for name in ("phi1", "phi2", "phi3"):
        errors = quantiles[name].standard_errors
        assert errors["1%"] <= 0.02, (name, errors)
        assert errors["5%"] <= 0.01 and errors["10%"] <= 0.01, (name, errors)
