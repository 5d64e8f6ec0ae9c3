"""The break check of the cross-check stage: is a break suspected, and if so, does a unit
root survive a test that allows one shift in level under both hypotheses?

A break is suspected on any of three signs:

* ``jump``: the jump detector (:func:`tauscope.engine.reading.notes.find_jump`) finds an
  unusually large one-period change;
* ``conflict``: the ADF verdict and KPSS contradict each other (agreement "conflict");
* ``swing``: τ with a constant on an expanding window of the levels
  (:func:`tauscope.engine.unitroot.recursive.recursive_tau`, the lag order the user's
  rule chose for that regression but at most :data:`SWING_LAGS`: long lags chosen on the
  whole sample soak up the shift and hide the swing) clearly rejects a unit root for a window ending at least
  a quarter into the sample (τ below its critical value by more than :data:`SWING`), and
  τ then rises by more than :data:`SWING_RISE` by the full sample.  A shift in level later
  in the sample does exactly this to a stationary series (Perron 1989), whose τ otherwise
  only falls as the window grows.  Measured (150 series each, T = 200 and 500): fires for
  97% and 100% of AR(0.5) series with a 5σ shift at mid-sample, 1.3% and 0% of random
  walks, 1.3% and 0% of ARIMA(1,1,0), 0% of AR(0.5) without a shift.

When one fires, the minimum LM test with one level shift (Lee & Strazicich 2013,
:mod:`tauscope.engine.unitroot.lm_break`) runs on the levels, with one lag order for every
candidate break and critical values simulated at the series' length
(:mod:`tauscope.engine.distributions.break_null`).  The lag order is chosen by the
Akaike criterion, AIC (Akaike 1974), on the ADF regression of the levels with constant and
trend, up to min(8, ⌊12 (T/100)^{1/4}⌋) (8 is Lee & Strazicich's bound; the second is
Schwert 1989's), whatever rule the strategy uses: that regression leaves the shift out, and
MAIC's penalty lets long lags soak it up, which takes the test's power.  The heavier penalty
of BIC does better on a shift but keeps too few lags against a negative MA, where the test
then rejects falsely.  Measured (default settings otherwise): AR(0.5) with a 5σ shift at
T = 200, right verdict (``benchmarks/break_verdicts.py``, 300 series) 58% with the MAIC
order, 91% with BIC, see DEVELOPERS.md for AIC; ARIMA(0,1,1) with θ = −0.8 at T = 200 called
I(0) (200 series) 18% with MAIC, 21.5% with AIC, 28.5% with BIC (stationary with a break
3%, 8%, 17.5%).  When it rejects, the regression
Δy_t = c + b·t + θ DU_t + d B_t + α y_{t−1} + Σ c_j Δy_{t−j} + e_t at the break (Perron 1989,
model A; stationary under this alternative) gives two t ratios:

* the slope's, against the normal (two-sided at the chosen level): a mean or a trend;
* the shift's (θ), against a sup-type critical value, because the date was searched for:
  :data:`SHIFT_T`, the square roots of the sup-Wald quantiles for one coefficient with 10%
  trimming (our simulation, 4,000 series of 1,000: 7.75, 9.41, 13.58 at 10%, 5%, 1%; the
  15%-trimmed values, 8.69 at 5%, agree with Andrews 1993, Econometrica 61, Table 1, 8.85
  (from memory)).

The verdict is given under the break (outcome "stationary with a break") only when the
test rejects, the shift is clear and the testing sequence found order 0 or 1: a unit root
the shift explains away, or stationarity whose mean in fact shifts.  An I(2) or unresolved
verdict is left alone (a test on the levels cannot settle it), as is a rejection whose
shift is not clear ("no unit root, shift unclear"): then the series is no more
stationary around a shifting mean than around a fixed one, and the verdict stands.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from functools import lru_cache

import numpy as np
from scipy.stats import norm

from tauscope.engine import formatting as fmt
from tauscope.engine.distributions.break_null import (
    BREAK_REPS,
    break_critical_values,
    break_p_value,
)
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.reading.breaks import break_sentence
from tauscope.engine.reading.verdicts import agreement
from tauscope.engine.regression.lagchoice import choose_lag, nested_criterion_lag
from tauscope.engine.results import RecursiveStatistic, TestResult
from tauscope.engine.results_breaks import (
    FAILED,
    NOT_SUSPECTED,
    SHIFT_UNCLEAR,
    STATIONARY_WITH_BREAK,
    UNIT_ROOT_WITH_BREAK,
    BreakCheck,
    BreakTest,
)
from tauscope.engine.unitroot.lm_break import MAX_LAGS, lm_break
from tauscope.engine.unitroot.recursive import recursive_tau

SHIFT_T = {0.10: 2.78, 0.05: 3.07, 0.01: 3.69}  # see the module's docstring
SWING = 1.0  # how far below its critical value an earlier window's τ must be
SWING_RISE = 1.5  # how far τ must rise from that window to the full sample
SWING_LAGS = 1  # at most this many lags in the expanding-window τ
SWING_START = 0.25  # windows ending before this share of the sample are not counted
BREAK_LAG_RULE = "aic"  # see the module's docstring
SIMULATED_LENGTH_CAP = 300  # longer series use the null simulated at 300 observations
_FAILURES = (UntestableSeries, np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)


def break_reasons(x: np.ndarray, order: int | None, kpss: Sequence[tuple[TestResult, bool]],
                  recursive: RecursiveStatistic | None, jump: int | None) -> tuple[str, ...]:
    """The signs of a break that fire; ``jump``: the jump detector's position on ``x``
    (:func:`tauscope.engine.reading.notes.find_jump`, held as ``PreparedSeries.jump``) or None."""
    reasons: list[str] = []
    if jump is not None:
        reasons.append("jump")
    if kpss and agreement(order, list(kpss)) == "conflict":
        reasons.append("conflict")
    if recursive is not None and swings(recursive, x.shape[0]):
        reasons.append("swing")
    return tuple(reasons)


def swings(recursive: RecursiveStatistic, length: int) -> bool:
    """The window (ending at least SWING_START into the sample) whose τ is furthest below
    its critical value rejects by more than SWING, and τ rises by more than SWING_RISE from
    it to the full sample."""
    stats, critical = np.asarray(recursive.statistics), np.asarray(recursive.critical_values)
    counted = np.flatnonzero(np.asarray(recursive.ends)[: stats.size] >= SWING_START * length)
    margins = (stats - critical)[counted]
    if counted.size < 2 or not np.all(np.isfinite(margins)):
        return False
    deepest = int(counted[np.argmin(margins)])
    return bool(margins.min() < -SWING and stats[-1] - stats[deepest] > SWING_RISE)


def break_t_ratios(x: np.ndarray, position: int, lags: int) -> tuple[float, float]:
    """t ratios of the slope b and the shift θ in
    Δy_t = c + b t + θ DU_t + d B_t + α y_{t−1} + Σ c_j Δy_{t−j} + e_t,
    DU_t = 1(t > TB), B_t = 1(t = TB + 1), TB = ``position`` (0-based)."""
    x = (x - x.mean()) / np.std(x)  # t ratios depend on neither level nor scale
    dx = np.diff(x)
    rows = np.arange(lags, dx.shape[0])  # Δy index; its time is row + 1
    t = (rows + 1).astype(float)
    columns = [np.ones(rows.shape[0]), t / t[-1], (t > position).astype(float),
               (t == position + 1).astype(float), x[rows]]
    columns += [dx[rows - j] for j in range(1, lags + 1)]
    design = np.column_stack(columns)
    beta, *_ = np.linalg.lstsq(design, dx[rows], rcond=None)
    resid = dx[rows] - design @ beta
    df = rows.shape[0] - design.shape[1]
    if df <= 0:
        raise UntestableSeries("too few observations to judge the trend at the break")
    sigma2 = float(resid @ resid) / df
    inverse = np.linalg.pinv(design.T @ design)
    # Round-off can leave a variance a hair below zero where it is really zero.
    variances = np.maximum(sigma2 * np.diag(inverse), np.finfo(float).tiny)
    t_ratios = beta / np.sqrt(variances)
    return float(t_ratios[1]), float(t_ratios[2])


def run_break_test(prepared: PreparedSeries, lags: int, alpha: float) -> BreakTest:
    """The minimum LM test on the levels, judged against the null simulated at this length."""
    # The statistic depends on neither level nor scale: it is searched on the standardised
    # series (safe from overflow at any magnitude), and the shift and slope are put back
    # into the series' units.  Where the unit-root tests allow for fixed seasonal means, the
    # break test does too: it reads the levels with those means removed, as the tests do.
    x = prepared.level(0)
    search = lm_break(x, lags=min(max(int(lags), 0), MAX_LAGS))
    length = min(int(x.shape[0]), SIMULATED_LENGTH_CAP)
    critical_values = break_critical_values(length)
    level = fmt.percent(alpha)
    p_value, bound = break_p_value(search.statistic, length)
    reject = bool(search.statistic < critical_values[level])
    trend_t, shift_t = break_t_ratios(x, search.position, search.lags)
    trend = abs(trend_t) > _two_sided_normal(alpha)
    shift_level = min(SHIFT_T, key=lambda a: abs(a - alpha))
    return BreakTest(
        statistic=search.statistic, critical_values=critical_values,
        critical_value=critical_values[level], p_value=p_value, p_value_bound=bound,
        reject=reject, lags=search.lags, nobs=search.nobs, position=search.position,
        first_new=search.first_new, last_old_label=prepared.label(search.position),
        first_new_label=prepared.label(search.first_new), shift=search.shift * prepared.scale,
        slope=search.slope * prepared.scale,
        trend_t=trend_t, deterministic="trend" if trend else "constant", reps=BREAK_REPS,
        shift_t=shift_t, shift_clear=bool(abs(shift_t) > SHIFT_T[shift_level]),
    )


@lru_cache(maxsize=16)
def _two_sided_normal(alpha: float) -> float:
    """The two-sided critical value of the standard normal at ``alpha``, once per level."""
    return float(norm.ppf(1.0 - alpha / 2.0))


def break_outcome(test: BreakTest, order: int | None) -> str:
    """What the break test means for the verdict (see the module's docstring)."""
    if not test.reject:
        return UNIT_ROOT_WITH_BREAK
    if test.shift_clear and order in (0, 1):
        return STATIONARY_WITH_BREAK
    return SHIFT_UNCLEAR


def break_lags(x: np.ndarray) -> int:
    """The break test's lag order: AIC on the ADF regression with constant and trend, up to
    min(MAX_LAGS, ⌊12 (T/100)^{1/4}⌋) (see the module's docstring).  Every lag order from
    one QR (:func:`nested_criterion_lag`); a design that is not clearly of full rank, or a
    fit that is nearly exact, goes to :func:`choose_lag` (one regression per lag order, with
    its refusals)."""
    cap = min(MAX_LAGS, int(12.0 * (x.shape[0] / 100.0) ** 0.25), max(x.shape[0] // 4 - 2, 0))
    lag = nested_criterion_lag(x, cap, BREAK_LAG_RULE)
    return choose_lag(x, "trend", BREAK_LAG_RULE, cap).lag if lag is None else lag


def swing_request(constant_lags: int) -> tuple[str, int, int]:
    """(spec, lag order, difference) of the swing's τ on expanding windows."""
    return "constant", min(constant_lags, SWING_LAGS), 0


def check_breaks(prepared: PreparedSeries, order: int | None, kpss: Sequence[tuple[TestResult, bool]],
                 constant_lags: int, alpha: float,
                 recursive_by: Callable[[np.ndarray, str, int, int, float], RecursiveStatistic] | None = None,
                 ) -> BreakCheck:
    """The break check for one series: the signs, and the break test when one fires.

    ``constant_lags``: the lag order the user's rule chose for the ADF regression on the
    levels with a constant (for the swing); the break test chooses its own
    (:func:`break_lags`).  ``recursive_by(x, spec, lags, difference, alpha)``: where τ on
    expanding windows comes from (an estimation's ``recursive``; None: computed here).
    """
    x = prepared.standardised  # the signs depend on neither level nor scale
    try:
        spec, lags, difference = swing_request(constant_lags)
        # the swing's τ on the levels as the ADF regressions see them (the fixed seasonal
        # means removed when the tests allow for them), as the cross-check's recursive τ
        swing_x = prepared.level(difference)
        recursive: RecursiveStatistic | None = (
            recursive_tau(swing_x, spec, lags, alpha) if recursive_by is None
            else recursive_by(swing_x, spec, lags, difference, alpha))
    except _FAILURES:
        recursive = None
    jump = prepared.jump
    reasons = break_reasons(x, order, kpss, recursive, jump)
    jump_label = None if jump is None else prepared.label(jump)
    if not reasons:
        return BreakCheck(False, (), NOT_SUSPECTED)
    try:
        test = run_break_test(prepared, break_lags(prepared.level(0)), alpha)
    except _FAILURES as exc:
        check = BreakCheck(True, reasons, FAILED, None, jump_label, problem=str(exc))
    else:
        check = BreakCheck(True, reasons, break_outcome(test, order), test, jump_label)
    return BreakCheck(check.suspected, check.reasons, check.outcome, check.test, check.jump_label,
                      break_sentence(check, alpha), check.problem)


def fitted_under_break(x: np.ndarray, check: BreakCheck | None) -> np.ndarray | None:
    """The path a verdict given under the break implies, for charts: OLS of y on
    [1, DU_t] (a mean that shifts) or [1, t, DU_t] (a trend whose level shifts)."""
    if check is None or check.test is None:
        return None
    n = x.shape[0]
    t = np.arange(n, dtype=float)
    columns = [np.ones(n), (t > check.test.position).astype(float)]
    if check.test.deterministic == "trend":
        columns.append(t)
    z = np.column_stack(columns)
    beta, *_ = np.linalg.lstsq(z, x, rcond=None)
    return np.asarray(z @ beta)
