"""Phillips-Perron unit-root test (Phillips, P.C.B. & Perron, P. 1988, "Testing for a
Unit Root in Time Series Regression", Biometrika 75, 335-346).

The Dickey-Fuller regression without lagged differences,

    y_t = [a0 + a2·t] + ρ·y_{t−1} + u_t,   t = 2 … T (n = T − 1 observations),

is fitted by OLS, and the serial correlation of u_t is handled by correcting
the statistics with a long-run variance instead of adding lags (formulas as in
Hamilton 1994, Time Series Analysis, eqs. 17.6.8 and 17.6.12):

    γ0 = (1/n) Σ û_t²,    s² = Σ û_t² / (n − k),    σ̂ = se(ρ̂),
    λ² = γ0 + 2 Σ_{j=1..ℓ} (1 − j/(ℓ + 1)) (1/n) Σ_t û_t û_{t−j}
         (Newey & West 1987, Bartlett weights, bandwidth ℓ),
    Zτ = √(γ0/λ²) (ρ̂ − 1)/σ̂ − ½ (λ² − γ0)/λ · n σ̂ / s,
    Zα = n (ρ̂ − 1) − ½ (n² σ̂² / s²)(λ² − γ0).

Zτ has the Dickey-Fuller τ limit law, so MacKinnon (1994, 2010) p-values and
finite-sample critical values apply (via statsmodels); Zα has the limit law
of the coefficient statistic n(ρ̂ − 1), whose critical values here come from
the simulation in :mod:`tauscope.engine.distributions.simulate` at the same sample size.

Bandwidth ℓ: by default chosen from the data by the Newey & West (1994)
plug-in rule for the Bartlett kernel in the form of Hobijn, Franses & Ooms
(1998), the rule the KPSS cross-check uses (statsmodels' ``kpss`` "auto"):

    m = ⌊n^{2/9}⌋,  ŝ0 = γ̂0 + 2 Σ_{j=1..m} γ̂j,  ŝ1 = 2 Σ_{j=1..m} j γ̂j,
    ℓ = ⌊1.1447 ((ŝ1/ŝ0)²)^{1/3} n^{1/3}⌋, at most n − 1.
"""

from __future__ import annotations

import math
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.critical import tau_critical_values, tau_p_value
from tauscope.engine.distributions.simulate import (
    DEFAULT_SEED,
    EXACT_REPS,
    coefficient_null_distribution,
    empirical_p_value,
    lower_critical_values,
)
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.regression.scaling import centred
from tauscope.engine.results import PhillipsPerron, TestResult

BANDWIDTH_RULE = "Newey-West automatic bandwidth (Hobijn, Franses & Ooms 1998)"



def newey_west_bandwidth(resid: np.ndarray) -> int:
    """Automatic Bartlett bandwidth of Newey & West (1994) as in Hobijn, Franses & Ooms (1998)."""
    n = resid.shape[0]
    m = int(n ** (2.0 / 9.0))
    s0 = float(resid @ resid) / n
    s1 = 0.0
    for j in range(1, m + 1):
        gamma_j = float(resid[j:] @ resid[: n - j]) / (n / 2.0)
        s0 += gamma_j
        s1 += j * gamma_j
    if s0 <= 0:
        return 0
    bandwidth = int(1.1447 * ((s1 / s0) ** 2) ** (1.0 / 3.0) * n ** (1.0 / 3.0))
    return min(bandwidth, n - 1)


def long_run_variance(resid: np.ndarray, bandwidth: int) -> float:
    """Newey & West (1987) estimate with Bartlett weights 1 − j/(ℓ + 1), no demeaning."""
    return float(long_run_variance_many(np.asarray(resid, dtype=float)[None, :], bandwidth)[0])


def long_run_variance_many(rows: np.ndarray, bandwidth: int) -> np.ndarray:
    """:func:`long_run_variance` of every row of ``rows`` (R, n): (Σ_t u_t² + 2 Σ_{j≤ℓ}
    (1 − j/(ℓ + 1)) Σ_t u_t u_{t−j}) / n; lags beyond n − 1 are empty sums."""
    n = rows.shape[1]
    total = np.einsum("rn,rn->r", rows, rows)
    for j in range(1, min(bandwidth, n - 1) + 1):
        total += 2.0 * (1.0 - j / (bandwidth + 1.0)) * np.einsum("rn,rn->r", rows[:, j:], rows[:, :-j])
    return np.asarray(total / n)


def phillips_perron(x: np.ndarray, spec: str, bandwidth: int | None = None) -> PhillipsPerron:
    """Zτ and Zα for ``spec`` "trend", "constant" or "none"; ``bandwidth`` None: automatic.
    With a constant the series is first measured from its mean (the statistics do not
    depend on the level; the arithmetic does)."""
    x = centred(np.asarray(x, dtype=float), spec)
    n = x.shape[0] - 1
    columns = [x[:-1]]
    if spec in ("constant", "trend"):
        columns.append(np.ones(n))
    if spec == "trend":
        columns.append(np.arange(1.0, n + 1.0))
    design = np.column_stack(columns)
    k = design.shape[1]
    if n <= k + 2:
        raise UntestableSeries(f"too few observations ({n}) for the Phillips-Perron regression")
    q, r = np.linalg.qr(design)
    if np.min(np.abs(np.diag(r))) <= 1e-12 * np.max(np.abs(np.diag(r))):
        raise UntestableSeries("the Phillips-Perron regression terms are linearly dependent")
    coef = np.linalg.solve(r, q.T @ x[1:])
    resid = x[1:] - design @ coef
    rss = float(resid @ resid)
    if not rss > 1e-20 * max(1.0, float(x[1:] @ x[1:])):
        raise UntestableSeries("the Phillips-Perron regression fits the series exactly")
    r_inv = np.linalg.inv(r)
    xtx_inv_00 = float(r_inv[0] @ r_inv[0])
    s2 = rss / (n - k)
    s = math.sqrt(s2)
    sigma = math.sqrt(s2 * xtx_inv_00)
    rho = float(coef[0])
    ell = newey_west_bandwidth(resid) if bandwidth is None else int(bandwidth)
    if ell < 0 or ell >= n:
        raise UntestableSeries(f"a bandwidth of {ell} is not possible with {n} observations")
    gamma0 = rss / n
    lam2 = long_run_variance(resid, ell)
    if lam2 <= 0:
        raise UntestableSeries("the long-run variance estimate is not positive")
    lam = math.sqrt(lam2)
    z_tau = math.sqrt(gamma0 / lam2) * (rho - 1.0) / sigma - 0.5 * (lam2 - gamma0) / lam * n * sigma / s
    z_alpha = n * (rho - 1.0) - 0.5 * (n * n * sigma * sigma / s2) * (lam2 - gamma0)
    return PhillipsPerron(spec, z_tau, z_alpha, rho, n, ell, gamma0, lam2)


def z_alpha_critical_values(spec: str, nobs: int, reps: int = EXACT_REPS,
                            seed: int = DEFAULT_SEED) -> dict[str, float]:
    """Simulated lower-tail critical values of Zα (the coefficient statistic n(ρ̂ − 1)); the
    quantiles of a key are taken once and kept (a fresh copy each call)."""
    return dict(_z_alpha_critical_values(spec, int(nobs), int(reps), int(seed)))


@lru_cache(maxsize=256)
def _z_alpha_critical_values(spec: str, nobs: int, reps: int, seed: int) -> dict[str, float]:
    return lower_critical_values(coefficient_null_distribution(spec, nobs, reps, seed))


def z_alpha_p_value(statistic: float, spec: str, nobs: int, reps: int = EXACT_REPS,
                    seed: int = DEFAULT_SEED) -> tuple[float, str | None]:
    return empirical_p_value(statistic, coefficient_null_distribution(spec, nobs, reps, seed))


def pp_test(x: np.ndarray, spec: str, alpha: float, difference: int = 0,
            bandwidth: int | None = None) -> tuple[TestResult, PhillipsPerron]:
    """Zτ as a :class:`TestResult` (test "pp"; ``lags`` holds the bandwidth), with the details."""
    pp = phillips_perron(x, spec, bandwidth)
    critical_values = tau_critical_values(spec, pp.nobs)
    level = f"{round(alpha * 100):d}%"
    critical = critical_values[level]
    result = TestResult(
        test="pp",
        spec=spec,
        difference=difference,
        statistic=pp.z_tau,
        p_value=tau_p_value(pp.z_tau, spec),
        lags=pp.bandwidth,
        nobs=pp.nobs,
        critical_values=critical_values,
        reject=bool(pp.z_tau < critical),
        critical_value=critical,
        lag_rule=BANDWIDTH_RULE if bandwidth is None else "fixed bandwidth",
    )
    return result, pp
