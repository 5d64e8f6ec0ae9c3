"""Choosing the lag order p of the ADF regression.

* Information criteria (AIC, BIC, HQC) are compared on one common sample, the
  sample of the largest lag order (Ng, S. & Perron, P. 1995, "Unit Root Tests
  in ARMA Models with Data-Dependent Methods for the Selection of the
  Truncation Lag", JASA 90, 268-281).  Ties go to the shorter lag.
* ``tsig``: general-to-specific; start at p_max and drop the last lag while its
  |t| < 1.645, the 10% two-sided normal value (Ng & Perron 1995).
* ``maic``: MAIC(k) = ln σ̂²_k + 2(τ_T(k) + k)/N with
  τ_T(k) = γ̂² Σ ỹ²_{t−1} / σ̂²_k, on the common sample of N observations, ỹ the
  OLS-detrended series (Ng, S. & Perron, P. 2001, "Lag Length Selection and the
  Construction of Unit Root Tests with Good Size and Power", Econometrica 69,
  1519-1554; OLS detrending as in Perron, P. & Qu, Z. 2007, Economics Letters 94).
* ``fixed``: the user's lag order.

The chosen lag is then re-estimated on the longest sample it allows, the same
convention as statsmodels' ``adfuller``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from tauscope.engine.regression.design import DETERMINISTIC_TERMS, adf_design
from tauscope.engine.regression.ols import fit

TSIG_CRITICAL = 1.6448536269514722  # 10% two-sided standard normal


@dataclass(frozen=True)
class LagChoice:
    rule: str
    lag: int
    max_lags: int
    criteria: tuple[float, ...] = ()  # one value per lag 0..max_lags (rule's own measure)


def detrend(x: np.ndarray, spec: str) -> np.ndarray:
    """OLS residuals of x on the deterministic terms of ``spec``."""
    terms = DETERMINISTIC_TERMS[spec]
    if not terms:
        return x.copy()
    t = np.arange(1, x.shape[0] + 1, dtype=float)
    columns = [np.ones_like(t)] + ([t] if "trend" in terms else [])
    z = np.column_stack(columns)
    beta, *_ = np.linalg.lstsq(z, x, rcond=None)
    return np.asarray(x - z @ beta)


def choose_lag(x: np.ndarray, spec: str, rule: str, max_lags: int, fixed: int | None = None,
               centre: float = 0.0) -> LagChoice:
    """The lag order by ``rule``; ``centre`` as in :func:`adf_design` (the choice does
    not depend on it)."""
    if rule == "fixed":
        lag = int(fixed if fixed is not None else 0)
        return LagChoice(rule, lag, max(lag, max_lags))
    if rule in ("aic", "bic", "hqc"):
        values = []
        for lag in range(max_lags + 1):
            y, design = adf_design(x, spec, lag, first=max_lags, centre=centre)
            values.append(fit(y, design).criterion(rule))
        best = min((v, k) for k, v in enumerate(values))[1]
        return LagChoice(rule, best, max_lags, tuple(values))
    if rule == "tsig":
        t_last: list[float] = [math.nan] * (max_lags + 1)
        chosen = 0
        for lag in range(max_lags, 0, -1):
            y, design = adf_design(x, spec, lag, first=max_lags, centre=centre)
            t_last[lag] = float(fit(y, design).tvalues[-1])
            if abs(t_last[lag]) >= TSIG_CRITICAL:
                chosen = lag
                break
        return LagChoice(rule, chosen, max_lags, tuple(t_last))
    if rule == "maic":
        return _maic(x - centre if centre != 0.0 else x, spec, max_lags)
    raise ValueError(f"unknown lag rule {rule!r}")


def _maic(x: np.ndarray, spec: str, max_lags: int) -> LagChoice:
    detrended = detrend(x, spec)
    values = []
    for lag in range(max_lags + 1):
        y, design = adf_design(detrended, "none", lag, first=max_lags)
        result = fit(y, design)
        n = result.nobs
        sigma2 = result.ssr / n
        gamma = float(result.params[0])
        ylag = design[:, 0]
        tau_t = gamma * gamma * float(np.dot(ylag, ylag)) / sigma2
        values.append(math.log(sigma2) + 2.0 * (tau_t + lag) / n)
    best = min((v, k) for k, v in enumerate(values))[1]
    return LagChoice("maic", best, max_lags, tuple(values))


def nested_criterion_lag(x: np.ndarray, cap: int, rule: str = "aic") -> int | None:
    """The lag order 0…``cap`` with the least criterion N (ln 2π + ln(RSS_m/N) + 1) + m·c,
    c = 2 (``"aic"``) or ln N (``"bic"``) (the formula of
    :meth:`tauscope.engine.regression.ols.OLSFit.criterion`) on the common sample of ``cap``
    lags, m = 3 + lag regressors.  RSS_m for every leading block of the design from the one
    factorisation of [X | y] = Q [[R, c], [0, e]]: RSS_m = e² + Σ_{j≥m} c_j² (Golub & Van Loan
    2013, §5.3; see :mod:`tauscope.engine.regression.nested`).  Ties go to the shorter lag.
    None when the design is not of full rank (numpy's ``matrix_rank``: then every leading
    block is, the test :func:`fit` makes) or a fit is within a margin of exact."""
    y, design = adf_design(x, "trend", cap, first=cap)
    n, k = design.shape
    if n <= k + 1 or not np.all(np.isfinite(design)) or np.linalg.matrix_rank(design) < k:
        return None
    r = np.asarray(np.linalg.qr(np.column_stack([design, y]), mode="r"))
    tail = np.cumsum((r[:k, k] ** 2)[::-1])[::-1]  # Σ_{j≥m} c_j², m = 0…k−1
    ssr = r[k, k] ** 2 + np.append(tail[3:], 0.0)  # m = 3…k
    if not np.all(ssr > 1e-12 * max(1.0, float(y @ y))):
        return None
    m = np.arange(3, k + 1)
    penalty = {"aic": 2.0, "bic": math.log(n)}[rule]
    values = n * (math.log(2.0 * math.pi) + np.log(ssr / n) + 1.0) + m * penalty
    return int(np.argmin(values))
