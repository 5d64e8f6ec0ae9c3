"""Seasonal unit-root tests of one series: HEGY for quarters, Beaulieu-Miron for months.

Hylleberg, Engle, Granger & Yoo (1990), *Journal of Econometrics* 44, and
Beaulieu & Miron (1993), *Journal of Econometrics* 55: the auxiliary regression

    Δ_S y_t = μ_t + Σ_{k=1..S} π_k y_{k,t−1} + Σ_{i=1..p} φ_i Δ_S y_{t−i} + e_t

(regressors and deterministic terms in ``seasonal_design``).  Reported:
t_π1 (the long-run, ordinary unit root), t_π2 (frequency π), an F for each
pair of complex frequencies, and the joint F over all seasonal frequencies and
over all frequencies (Ghysels, Lee & Noh 1994).  Critical values and p-values
come from the null at the series' own length and lag order (``null.seasonal_null``):
read from the shipped table for seasonal dummies at the default replications, else
simulated (``critical``).

Lag order p: chosen on the common sample of p_max (Ng & Perron 1995) by

* ``"aic"`` (default) / ``"bic"`` — ln(RSS/m) + c·K/m with c = 2 or ln m,
  K every coefficient, minimised over p = 0 … p_max (every RSS from one QR of
  the nested designs);
* ``"tsig"`` — general to specific: start at p_max and drop the last lag while
  |t| < 1.645 (10% two-sided), Ng & Perron (1995);
* ``"fixed"`` — ``lags`` as given.

The chosen regression is then fitted on its longest sample.  AIC is the
default because it did best when this module was built (quarterly, T = 200,
200 series each, fixed seeds, seasonal means in the regression): a seasonal
random walk kept a seasonal unit root in 100% (AIC) and 99.5% (t rule), while a
stationary AR(0.5) around seasonal means kept one in 0% (AIC) but 8% (the t rule,
which kept 7 of Schwert's 14 lags on average).  BIC did as well as AIC there
but picks no lag at all in 97% of such series, which risks size where the
errors are autocorrelated.  p_max defaults
to Schwert's (1989) rule ⌊12 (n/100)^{1/4}⌋, cut so that at least 10
residual degrees of freedom remain.  The series is divided by the standard
deviation of its seasonal differences first: every statistic is invariant to
the scale of y, and the regression stays well conditioned at any scale.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.seasonal.critical import (
    DEFAULT_REPS,
    DEFAULT_SEED,
    default_max_lags,
    minimum_length,
)
from tauscope.engine.seasonal.design import (
    BatchFit,
    Statistic,
    build,
    check_deterministic,
    check_period,
    deterministic_columns,
    fit,
    n_deterministic,
    statistics,
    statistics_for,
)
from tauscope.engine.seasonal.null import SeasonalNull, seasonal_null
from tauscope.engine.seasonal.reading import reading
from tauscope.engine.seasonal.results import SeasonalRootsResult, SeasonalTest

LAG_RULES = ("aic", "bic", "tsig", "fixed")
ALPHAS = {0.01: "1%", 0.05: "5%", 0.10: "10%"}
_T_DROP = 1.645


def _clean(values: Sequence[float] | np.ndarray, period: int) -> np.ndarray:
    y = np.asarray(values, dtype=float).ravel()
    if y.size == 0 or not np.all(np.isfinite(y)):
        raise ValueError("the series has missing or non-numeric values; fill or trim them first")
    spread = np.std(y[period:] - y[:-period]) if y.size > period else 0.0
    if not np.isfinite(spread) or spread == 0.0:
        raise ValueError(
            "the series changes by exactly the same amount from each year to the next, "
            "so there is nothing for a seasonal unit-root test to measure"
        )
    return y / spread


def _fit_one(y: np.ndarray, period: int, deterministic: str, lags: int, first_row: int) -> BatchFit:
    dependent, regressors, lag_block = build(y[None, :], period, lags, first_row)
    rows = np.arange(first_row, y.size)
    det = deterministic_columns(deterministic, rows, period)
    design = np.concatenate([regressors, lag_block], axis=2)
    return fit(dependent, design, det)


def _nested_rss(y: np.ndarray, period: int, deterministic: str, p_max: int,
                first_row: int) -> np.ndarray:
    """RSS of the regression with p = 0 … p_max lags on one common sample, from one QR.

    The models are nested ([π, Δ_S y_{t−1} … Δ_S y_{t−p}] after μ_t is partialled out),
    so with R the triangular factor of [X_{p_max}, Δ_S y] (K = S + p_max columns before
    the dependent one) RSS_p = Σ_{i = S+p … K} R_{iK}² (Golub & Van Loan 2013, §5.3)."""
    dependent, regressors, lag_block = build(y[None, :], period, p_max, first_row)
    det = deterministic_columns(deterministic, np.arange(first_row, y.size), period)
    augmented = np.concatenate([regressors, lag_block, dependent[:, :, None]], axis=2)[0]
    if det.shape[1]:
        qd, _ = np.linalg.qr(det)
        augmented = augmented - qd @ (qd.T @ augmented)
    r = np.asarray(np.linalg.qr(augmented, mode="r"))
    tail = r[period:, -1] ** 2
    return np.cumsum(tail[::-1])[::-1]


def choose_lags(
    values: Sequence[float] | np.ndarray,
    period: int,
    deterministic: str = "dummies",
    rule: str = "aic",
    max_lags: int | None = None,
) -> int:
    """The lag order p of Δ_S y by ``rule`` on the common sample of p_max."""
    check_period(period)
    check_deterministic(deterministic)
    if rule not in LAG_RULES or rule == "fixed":
        raise ValueError(f"rule must be one of aic, bic, tsig, not {rule!r}")
    y = _clean(values, period)
    p_max = default_max_lags(y.size, period, deterministic) if max_lags is None else max_lags
    if p_max < 0:
        raise ValueError("max_lags must be 0 or more")
    if y.size < minimum_length(period, deterministic, p_max):
        raise ValueError(
            f"a series of {y.size} observations is too short for up to {p_max} lags "
            f"(at least {minimum_length(period, deterministic, p_max)} needed)"
        )
    if p_max == 0:
        return 0
    first = period + p_max
    if rule == "tsig":
        for p in range(p_max, 0, -1):
            res = _fit_one(y, period, deterministic, p, first)
            j = period + p - 1
            t_last = res.coef[0, j] / np.sqrt(res.rss[0] / res.dof * res.cov[0, j, j])
            if abs(t_last) >= _T_DROP:
                return p
        return 0
    m = y.size - first
    penalty = 2.0 if rule == "aic" else float(np.log(m))
    rss = _nested_rss(y, period, deterministic, p_max, first)
    best, best_ic = 0, np.inf
    for p in range(p_max + 1):
        k = n_deterministic(deterministic, period) + period + p
        ic = float(np.log(rss[p] / m) + penalty * k / m)
        if ic < best_ic - 1e-12:
            best, best_ic = p, ic
    return best


def seasonal_statistics(
    values: Sequence[float] | np.ndarray, period: int, deterministic: str, lags: int
) -> dict[str, float]:
    """The statistics of the seasonal regression with ``lags`` lags, on the
    longest sample, by name (``statistics_for(period)`` order)."""
    check_period(period)
    check_deterministic(deterministic)
    y = _clean(values, period)
    if y.size < minimum_length(period, deterministic, lags):
        raise ValueError(
            f"a series of {y.size} observations is too short for the seasonal regression "
            f"with {lags} lags (at least {minimum_length(period, deterministic, lags)} needed)"
        )
    stats = statistics_for(period)
    # y is scaled so that Δ_S y has unit spread: an RSS below 1e-20 per row is an exact fit
    with np.errstate(all="ignore"):
        try:
            res = _fit_one(y, period, deterministic, lags, period + lags)
            values_out = statistics(res, stats)[0]
            exact = bool(res.rss[0] <= 1e-20 * (y.size - period - lags))
        except np.linalg.LinAlgError:
            values_out, exact = np.full(len(stats), np.nan), False
    if exact or not np.all(np.isfinite(values_out)):
        raise ValueError(
            "the seasonal regression cannot be fitted: the series' seasonal pieces move "
            "in lockstep (its regressors are linearly dependent), or it fits exactly"
        )
    return {s.name: float(v) for s, v in zip(stats, values_out, strict=True)}


def check_options(period: int, deterministic: str, alpha: float, lag_rule: str, n: int) -> None:
    """The checks of :func:`seasonal_unit_roots` that do not look at the values."""
    check_period(period)
    check_deterministic(deterministic)
    if alpha not in ALPHAS:
        raise ValueError("alpha must be 0.01, 0.05 or 0.10")
    if lag_rule not in LAG_RULES:
        raise ValueError(f"lag_rule must be one of {', '.join(LAG_RULES)}, not {lag_rule!r}")
    if n < minimum_length(period, deterministic, 0):
        raise ValueError(
            f"a series of {n} observations is too short for a seasonal unit-root test "
            f"(at least {minimum_length(period, deterministic, 0)} needed)"
        )


def seasonal_unit_roots(
    values: Sequence[float] | np.ndarray,
    period: int,
    deterministic: str = "dummies",
    lag_rule: str = "aic",
    lags: int | None = None,
    max_lags: int | None = None,
    alpha: float = 0.05,
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
) -> SeasonalRootsResult:
    """HEGY (period 4) or Beaulieu-Miron (period 12) test of one series.

    Raises ValueError with one plain sentence when the series cannot be tested
    (wrong period, too short, gaps, no year-to-year change)."""
    n = np.asarray(values, dtype=float).size
    check_options(period, deterministic, alpha, lag_rule, n)
    y = _clean(values, period)
    p_max = default_max_lags(n, period, deterministic) if max_lags is None else int(max_lags)
    if lag_rule == "fixed":
        if lags is None or lags < 0:
            raise ValueError("the fixed lag rule needs lags = 0 or more")
        chosen = int(lags)
    else:
        chosen = choose_lags(y, period, deterministic, lag_rule, p_max)
    found = seasonal_statistics(y, period, deterministic, chosen)
    null = seasonal_null(period, deterministic, n, chosen, reps, seed)
    stats = statistics_for(period)
    p_values: list[float | None] = []
    bounds: list[str | None] = []
    for i, stat in enumerate(stats):
        p, bound = null.p_values(i, np.array([found[stat.name]]), stat.kind)
        p_values.append(p[0])
        bounds.append(bound[0])
    return roots_result(RootsKey(period, deterministic, lag_rule, p_max, n, alpha, reps, seed),
                        chosen, [found[stat.name] for stat in stats], null, p_values, bounds)


@dataclass(frozen=True)
class RootsKey:
    """What every series of one batch shares in :func:`roots_result`."""

    period: int
    deterministic: str
    lag_rule: str
    max_lags: int
    n: int
    alpha: float
    reps: int
    seed: int


@lru_cache(maxsize=4)
def _statistics_of(period: int) -> tuple[Statistic, ...]:
    """``statistics_for(period)``, built once per period (the statistics are frozen)."""
    return statistics_for(period)


def roots_result(key: RootsKey, chosen: int, values: Sequence[float], null: SeasonalNull,
                 p_values: Sequence[float | None],
                 bounds: Sequence[str | None]) -> SeasonalRootsResult:
    """The result of one series from its lag order, statistics (``statistics_for``
    order), the null distribution at its length and lag order (critical values, the
    replications behind them) and its p-values with their bounds (``SeasonalNull.p_values``)."""
    period, deterministic, alpha, n = key.period, key.deterministic, key.alpha, key.n
    reps, table = null.reps, null.critical_values
    label = ALPHAS[alpha]
    tests = []
    for stat, value, p, bound in zip(_statistics_of(period), values, p_values, bounds, strict=True):
        crit = table[stat.name]
        reject = value < crit[label] if stat.kind == "t" else value > crit[label]
        tests.append(
            SeasonalTest(
                name=stat.name,
                frequency=stat.words,
                cycles_per_year=stat.cycles_per_year,
                tail="lower" if stat.kind == "t" else "upper",
                statistic=value,
                critical_values=dict(crit),
                p_value=p,
                p_value_bound=bound or ("below" if p is None and math.isfinite(value) else None),
                reject=bool(reject),
            )
        )
    individual = [t for t in tests if t.cycles_per_year not in (None, 0)]
    roots = tuple(t.frequency for t in individual if not t.reject)
    long_run = not tests[0].reject
    text, suggestion = reading(
        period=period,
        deterministic=deterministic,
        lags=chosen,
        alpha=alpha,
        tests=tuple(tests),
        seasonal_roots=roots,
        long_run_root=long_run,
        reps=reps,
        n=n,
        tabulated=null.tabulated,
    )
    return SeasonalRootsResult(
        method="hegy" if period == 4 else "beaulieu_miron",
        period=period,
        deterministic=deterministic,
        lags=chosen,
        lag_rule=key.lag_rule,
        max_lags=key.max_lags,
        n=n,
        nobs=n - period - chosen,
        alpha=alpha,
        reps=reps,
        seed=key.seed,
        tests=tuple(tests),
        seasonal_roots=roots,
        long_run_root=long_run,
        suggestion=suggestion,
        text=text,
    )
