"""DF-GLS unit-root test (Elliott, G., Rothenberg, T.J. & Stock, J.H. 1996, "Efficient
Tests for an Autoregressive Unit Root", Econometrica 64(4), 813-836).

1. GLS detrending under a local alternative ᾱ = 1 + c̄/T, c̄ = −7 (constant) or
   −13.5 (constant and trend): quasi-difference the series and the
   deterministic terms z_t = 1 or (1, t),

       y^ᾱ = (y_1, y_2 − ᾱ y_1, …, y_T − ᾱ y_{T−1}),  z^ᾱ likewise,

   regress y^ᾱ on z^ᾱ by OLS to get β̂, and form ỹ_t = y_t − z_t'β̂.
2. Run the Dickey-Fuller regression on ỹ without deterministic terms,
   Δỹ_t = γ ỹ_{t−1} + Σ_{i=1..p} β_i Δỹ_{t−i} + e_t, on the longest sample for p;
   the statistic is the t ratio of γ̂.

Lag order: MAIC by default (Ng, S. & Perron, P. 2001, Econometrica 69), with
the lag chosen on the OLS-detrended series (Perron, P. & Qu, Z. 2007,
Economics Letters 94); the other rules of :mod:`tauscope.engine.regression.lagchoice`
work the same way.

Critical values and p-values at the series' own length T: with the lag chosen by
MAIC, response surfaces fitted to a simulation of the whole procedure, lag choice
included (:mod:`tauscope.engine.distributions.dfgls_values`; the asymptotic values,
the Dickey-Fuller ones without deterministic terms for the constant case and ERS 1996
Table 1 for the trend case, hold only for long series: at T = 30 the constant case's
asymptotic −1.95 rejects a true unit root about 9-14% of the time); with a fixed lag
order, the null at T with that lag ("exact": always the latter), read from a table simulated
once (10⁶ walks per length and lag, :mod:`tauscope.engine.distributions.dfgls_grid`) when the
request is the default one and the table brackets T, else simulated here.
:func:`table_critical_values` keeps the published asymptotic and ERS values.
"""

from __future__ import annotations

import math
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.critical import tau_critical_values
from tauscope.engine.distributions.dfgls_grid import dfgls_quantiles
from tauscope.engine.distributions.dfgls_values import (
    covers,
    surface_critical_values,
    surface_p_value,
)
from tauscope.engine.distributions.exact_grid import distribution_at, quantile_at
from tauscope.engine.distributions.simulate import (
    DEFAULT_SEED,
    EXACT_REPS,
    empirical_p_value,
    lower_critical_values,
    raw_moments,
    reportable_bound,
    shock_chunks,
    solve_moments,
)
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.regression.design import adf_design
from tauscope.engine.regression.lagchoice import choose_lag, detrend
from tauscope.engine.regression.ols import fit
from tauscope.engine.regression.scaling import centred
from tauscope.engine.results import DFGLS, TestResult

C_BAR = {"constant": -7.0, "trend": -13.5}
DFGLS_P_VALUE_REPS = 50_000  # a fixed lag order: Monte Carlo error of the 5% value about ±0.01
LEVELS = ("1%", "5%", "10%")

# Elliott, Rothenberg & Stock (1996), Table 1, trend case (from memory; checked by
# simulation in the tests to ±0.05).  Rows: T = 50, 100, 200, ∞; columns 1%, 5%, 10%.
ERS_TREND_SIZES = (50.0, 100.0, 200.0, float("inf"))
ERS_TREND_TABLE = (
    (-3.77, -3.19, -2.89),
    (-3.58, -3.03, -2.74),
    (-3.46, -2.93, -2.64),
    (-3.48, -2.89, -2.57),
)



def deterministic_columns(spec: str, length: int) -> np.ndarray:
    t = np.arange(1.0, length + 1.0)
    if spec == "constant":
        return np.ones((length, 1))
    if spec == "trend":
        return np.column_stack([np.ones(length), t])
    raise ValueError("DF-GLS needs the 'constant' or 'trend' specification")


def gls_detrend(x: np.ndarray, spec: str) -> np.ndarray:
    """ỹ = y − z'β̂ with β̂ from the quasi-differenced regression (ERS 1996)."""
    length = x.shape[0]
    abar = 1.0 + C_BAR[spec] / length
    z = deterministic_columns(spec, length)
    zq = z.copy()
    zq[1:] = z[1:] - abar * z[:-1]
    yq = x.copy()
    yq[1:] = x[1:] - abar * x[:-1]
    beta, *_ = np.linalg.lstsq(zq, yq, rcond=None)
    return np.asarray(x - z @ beta)


_PENALTY = {"aic": lambda n: 2.0, "bic": math.log, "hqc": lambda n: 2.0 * math.log(math.log(n))}


def lag_criteria(detrended: np.ndarray, rule: str, max_lags: int) -> np.ndarray:
    """The lag rule's criterion for every lag order 0 … max_lags on the common sample,
    for the regression without deterministic terms on an (OLS-)detrended series.

    One QR factorisation of the largest design serves every lag order, because the
    model with k lags uses the leading k + 1 columns [ỹ_{t−1}, Δỹ_{t−1}, …, Δỹ_{t−k}]:
    RSS_k = y'y − |Q_k'y|², γ̂_k = first element of R_k^{-1} Q_k'y.  The criteria are
    those of :mod:`tauscope.engine.regression.lagchoice` (AIC, BIC, HQC as −2 ln L + c·(k + 1);
    MAIC(k) = ln σ̂²_k + 2(τ_T(k) + k)/N with τ_T(k) = γ̂_k² Σ ỹ²_{t−1} / σ̂²_k)."""
    y, design = adf_design(detrended, "none", max_lags, first=max_lags)
    n = y.shape[0]
    q, r = np.linalg.qr(design)
    qty = q.T @ y
    yy = float(y @ y)
    level_ss = float(design[:, 0] @ design[:, 0])
    values = np.empty(max_lags + 1)
    for k in range(max_lags + 1):
        m = k + 1
        rss = yy - float(qty[:m] @ qty[:m])
        if not rss > 1e-20 * max(1.0, yy):
            raise UntestableSeries("the lag-selection regression fits the series exactly")
        sigma2 = rss / n
        if rule == "maic":
            gamma = float(np.linalg.solve(r[:m, :m], qty[:m])[0])
            values[k] = math.log(sigma2) + 2.0 * (gamma * gamma * level_ss / sigma2 + k) / n
        else:
            log_likelihood = -n / 2.0 * (math.log(2.0 * math.pi) + math.log(sigma2) + 1.0)
            values[k] = -2.0 * log_likelihood + _PENALTY[rule](n) * m
    return values


def choose_dfgls_lag(x: np.ndarray, spec: str, rule: str, max_lags: int) -> int:
    """Lag order for DF-GLS chosen on the OLS-detrended series (Perron & Qu 2007)."""
    detrended = detrend(x, spec)
    if rule in ("maic", "aic", "bic", "hqc"):
        return int(np.argmin(lag_criteria(detrended, rule, max_lags)))  # ties: the shorter lag
    return choose_lag(detrended, "none", rule, max_lags).lag


def dfgls(x: np.ndarray, spec: str, lag_rule: str = "maic", max_lags: int = 0,
          lags: int | None = None) -> DFGLS:
    """The DF-GLS statistic; ``lags`` fixes the lag order, else ``lag_rule`` chooses it
    up to ``max_lags`` on the OLS-detrended series (Perron & Qu 2007)."""
    x = centred(np.asarray(x, dtype=float), "constant")  # GLS detrending removes any level
    if lags is None:
        lag, rule, top = choose_dfgls_lag(x, spec, lag_rule, max_lags), lag_rule, max_lags
    else:
        lag, rule, top = int(lags), "fixed", int(lags)
    detrended = gls_detrend(x, spec)
    y, design = adf_design(detrended, "none", lag)
    if y.shape[0] <= design.shape[1] + 1:
        raise UntestableSeries(f"too few observations for the DF-GLS regression with {lag} lags")
    result = fit(y, design)
    return DFGLS(spec, float(result.tvalues[0]), lag, rule, top, result.nobs, detrended)


def ers_trend_critical_value(length: float, alpha: float) -> float:
    """ERS (1996) Table 1, trend case, linear in 1/T; below T = 50 the T = 50 row."""
    column = {0.01: 0, 0.05: 1, 0.10: 2}[_alpha_key(alpha)]
    inverse = np.array([1.0 / t for t in ERS_TREND_SIZES])[::-1]
    values = np.array([row[column] for row in ERS_TREND_TABLE])[::-1]
    return float(np.interp(1.0 / max(float(length), ERS_TREND_SIZES[0]), inverse, values))


def _alpha_key(alpha: float) -> float:
    for key in (0.01, 0.05, 0.10):
        if abs(alpha - key) < 1e-12:
            return key
    raise ValueError(f"unsupported significance level {alpha}")


def table_critical_values(spec: str, length: int, nobs: int) -> dict[str, float]:
    """ERS critical values: DF without deterministic terms (constant), Table 1 (trend)."""
    if spec == "constant":
        return tau_critical_values("none", nobs)
    return {level: ers_trend_critical_value(length, a)
            for level, a in zip(LEVELS, (0.01, 0.05, 0.10), strict=True)}


@lru_cache(maxsize=128)
def dfgls_null_distribution(spec: str, length: int, reps: int = EXACT_REPS,
                            seed: int = DEFAULT_SEED, lags: int = 0) -> np.ndarray:
    """Simulated DF-GLS statistics under a driftless Gaussian random walk of ``length``
    values (ERS's T), vectorised: the GLS detrending projection is the same for every
    replication; read-only array of ``reps`` values."""
    if length < lags + 8:
        raise ValueError(f"length {length} is too short for {lags} lags")
    abar = 1.0 + C_BAR[spec] / length
    z = deterministic_columns(spec, length)
    zq = z.copy()
    zq[1:] = z[1:] - abar * z[:-1]
    projector = np.linalg.pinv(zq).T  # β̂ = pinv(z^ᾱ) y^ᾱ for every replication at once
    parts = []
    for shocks in shock_chunks(length, reps, seed, width=2 + lags):
        y = np.cumsum(shocks, axis=1)
        yq = y.copy()
        yq[:, 1:] = y[:, 1:] - abar * y[:, :-1]
        detrended = y - (yq @ projector) @ z.T
        dy = np.diff(detrended, axis=1)
        columns = [detrended[:, lags:length - 1]] + [dy[:, lags - i:length - 1 - i] for i in range(1, lags + 1)]
        beta, rss, inv_diag = solve_moments(raw_moments(columns, dy[:, lags:]))
        df = length - 1 - lags - len(columns)
        parts.append(beta[:, 0] / np.sqrt(rss / df * inv_diag[:, 0]))
    draws = np.concatenate(parts)
    draws.setflags(write=False)
    return draws


def fixed_lag_values(statistic: float, spec: str, length: int, lags: int, reps: int, seed: int
                     ) -> tuple[dict[str, float], float, str | None]:
    """Critical values, p-value and its bound under the null of a series of ``length`` values
    with ``lags`` fixed lags: read from the DF-GLS table
    (:mod:`tauscope.engine.distributions.dfgls_grid`) when the request is the default one
    (10⁶ replications, the default seed) and the grid brackets it (the p-value bounded at
    0.001), else from ``reps`` draws simulated here (:func:`dfgls_null_distribution`)."""
    table = dfgls_quantiles(spec, length, lags) if reps == EXACT_REPS and seed == DEFAULT_SEED else None
    if table is not None:
        values = {level: quantile_at(table, a) for level, a in zip(LEVELS, (0.01, 0.05, 0.10), strict=True)}
        share, side = distribution_at(table, statistic)
        return values, share, "below" if side == "below" else None
    draws = dfgls_null_distribution(spec, length, reps, seed, lags)
    p_value, bound = empirical_p_value(statistic, draws)
    return lower_critical_values(draws), p_value, bound


def dfgls_test(x: np.ndarray, spec: str, alpha: float, difference: int = 0,
               lag_rule: str = "maic", max_lags: int = 0, lags: int | None = None,
               critical: str = "table", reps: int = DFGLS_P_VALUE_REPS,
               seed: int = DEFAULT_SEED) -> tuple[TestResult, DFGLS]:
    """DF-GLS as a :class:`TestResult` (test "dfgls").  ``critical`` "table": finite-sample
    values at this series' length T, from the response surfaces of the whole procedure
    with its lag choice (:mod:`tauscope.engine.distributions.dfgls_values`), or, when the
    lag order is fixed, from the null simulated at T with that lag; "exact" takes the
    null at T with the chosen lag order (:func:`fixed_lag_values`: the table when ``reps``
    and ``seed`` are the defaults of an exact run).  ``reps``: replications of those nulls."""
    result = dfgls(x, spec, lag_rule, max_lags, lags)
    length = int(np.asarray(x).shape[0])
    bound: str | None = None
    if critical != "exact" and lags is None and covers(length):
        # the lag was chosen (by MAIC): the whole procedure's null at this length
        critical_values = surface_critical_values(spec, length)
        p_value, bound = surface_p_value(result.statistic, spec, length)
    else:
        # "exact", or a lag order fixed by the user: the null at this length and this lag
        critical_values, p_value, bound = fixed_lag_values(result.statistic, spec, length,
                                                           result.lags, reps, seed)
    level = f"{round(alpha * 100):d}%"
    return TestResult(
        test="dfgls",
        spec=spec,
        difference=difference,
        statistic=result.statistic,
        p_value=p_value,
        lags=result.lags,
        nobs=result.nobs,
        critical_values=critical_values,
        reject=bool(result.statistic < critical_values[level]),
        critical_value=critical_values[level],
        p_value_bound=reportable_bound(p_value, bound),
        lag_rule=result.lag_rule,
    ), result
