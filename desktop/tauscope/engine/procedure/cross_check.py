"""The cross-check stage: what else the data say about the decided order.

* KPSS (Kwiatkowski, Phillips, Schmidt & Shin 1992) on the levels for I(0), and on the
  difference below and at the verdict for I(1) and I(2);
* the extra tests the user turned on, on the difference where the verdict was settled
  (the levels for I(0) and I(1), the first difference for I(2)), with the deterministic
  terms of the stationary alternative the verdict competes with: Phillips-Perron Zτ
  (Phillips & Perron 1988), DF-GLS (Elliott, Rothenberg & Stock 1996), Zivot-Andrews
  with one break (Zivot & Andrews 1992);
* the power of the deciding ADF test against AR(1) coefficients 0.90 and 0.95 at this
  sample size, and τ on an expanding window;
* τ of the deciding regression for every lag order (the lag profile);
* the break check (:mod:`tauscope.engine.procedure.breaks`): when a break is suspected,
  the minimum LM test with one level shift (Lee & Strazicich 2013); not run when the
  ``break_check`` setting is "off".
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from dataclasses import replace

import numpy as np
import pandas as pd

from tauscope.engine import formatting as fmt
from tauscope.engine.distributions.power import power_at
from tauscope.engine.distributions.simulate import (
    DEFAULT_REPS,
    DEFAULT_SEED,
    EXACT_REPS,
    P_VALUE_REPS,
    empirical_p_value,
    exact_critical_values,
    null_distribution,
    reportable_bound,
)
from tauscope.engine.distributions.tables import tau_critical_value
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.procedure.breaks import check_breaks, swing_request
from tauscope.engine.procedure.seasonal_roots import seasonal_check
from tauscope.engine.procedure.stages import (
    EXTRA_TESTS,
    CrossCheck,
    CrossCheckOptions,
    Decision,
    Estimation,
    ExtraEvidence,
)
from tauscope.engine.regression.design import max_lag_cap, schwert_max_lag
from tauscope.engine.regression.lagchoice import choose_lag
from tauscope.engine.results import (
    DFGLS,
    BreakInfo,
    LagPoint,
    PhillipsPerron,
    PowerResult,
    RecursiveStatistic,
    TestResult,
)
from tauscope.engine.unitroot.dfgls import DFGLS_P_VALUE_REPS, dfgls_test
from tauscope.engine.unitroot.phillips_perron import pp_test, z_alpha_critical_values
from tauscope.engine.unitroot.recursive import recursive_tau
from tauscope.engine.unitroot.variance_change import variance_change
from tauscope.engine.unitroot.zivot_andrews import MODEL_LABELS, BreakSearch, za_test

_FAILURES = (UntestableSeries, np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)
_KPSS_FAILURES = (ValueError, np.linalg.LinAlgError, ZeroDivisionError)


def cross_check(decision: Decision, options: CrossCheckOptions, estimation: Estimation) -> CrossCheck:
    """KPSS, the extra evidence and the lag profile for a decided series."""
    estimates = decision.estimates
    prepared = estimates.prepared
    x = prepared.standardised  # y / s (exact); the statistics do not depend on s
    # Δ^d y / s as the ADF regressions saw it: with the fixed seasonal means removed when
    # the tests allow for them (PreparedSeries.level), so KPSS and the extra tests judge
    # the same adjusted series as the verdict.
    level = prepared.level
    order, deterministic = decision.order, decision.deterministic
    checks: list[tuple[TestResult, bool]] = []
    kpss_problem: str | None = None
    try:
        checks = kpss_checks(level, order, deterministic, options, estimation)
    except _KPSS_FAILURES as exc:
        kpss_problem = f"The KPSS cross-check could not be computed ({exc})."
    deciding = decision.deciding
    settled = settled_difference(order)
    extra = extra_evidence(
        x, prepared.index, order=order, deterministic=deterministic, alpha=options.alpha,
        tests=options.extra, deciding_adf=deciding.test, lag_rule=options.lag_rule,
        lags=options.lags, max_lags=estimates.max_lags[settled],
        za_lags=estimates.levels[settled].adf["trend"].lags, break_model=options.break_model,
        critical_values=options.critical_values, power=options.power,
        recursive_by=estimation.recursive, level_of=level,
    )
    extra = _in_units(extra, prepared.scale)
    spec, difference, max_lags = decision.profile_request
    decisive_x = prepared.level(difference)
    profile = _with_alpha(estimation.lag_profile(decisive_x, spec, difference, max_lags),
                          decisive_x, spec, options.alpha)
    level_adf = estimates.levels[0].adf
    breaks = check_breaks(prepared, order, checks, level_adf["constant"].lags, options.alpha,
                          estimation.recursive) if options.break_check else None
    # The union's row has κ2 with its own lag order; the classic sequence's is computed here,
    # with the levels' trend regression's lag, on the same standardised levels.
    variance = variance_change(x, level_adf["trend"].lags, options.alpha) \
        if estimates.union is None else None
    return CrossCheck(decision, tuple(checks), kpss_problem, extra, profile, breaks,
                      seasonal_check(prepared, options.alpha, estimation.seasonal_roots), variance)


def recursive_requests(decision: Decision) -> list[tuple[str, int, int]]:
    """(spec, lag order, difference) of every τ on expanding windows the cross-check asks
    its estimation for: the deciding regression's (the extra evidence) and the levels'
    with a constant (the break check's swing), so a batch can compute them together."""
    requests = [swing_request(decision.estimates.levels[0].adf["constant"].lags)]
    test = decision.deciding.test
    if test is not None:
        requests.append((test.spec, test.lags, test.difference))
    return requests


def _in_units(extra: ExtraEvidence, scale: float) -> ExtraEvidence:
    """The few numbers of the extra evidence that carry the series' unit, put back:
    the Phillips-Perron variances (× s²) and the GLS-detrended series (× s)."""
    if scale == 1.0:
        return extra
    pp, gls = extra.phillips_perron, extra.dfgls
    with np.errstate(over="ignore"):  # a detrended value beyond the float range reads as inf
        detrended = None if gls is None else gls.detrended * scale
    return replace(
        extra,
        phillips_perron=None if pp is None else replace(
            pp, short_run_variance=pp.short_run_variance * scale * scale,
            long_run_variance=pp.long_run_variance * scale * scale),
        dfgls=None if gls is None or detrended is None else replace(gls, detrended=detrended),
    )


def kpss_checks(level: Callable[[int], np.ndarray], order: int | None, deterministic: str | None,
                options: CrossCheckOptions, estimation: Estimation) -> list[tuple[TestResult, bool]]:
    """(KPSS result, whether the verdict expects it to reject) on the differences that
    bracket the verdict: I(0) expects stationarity in the levels; I(d) expects a
    rejection on Δ^(d−1) y and none on Δ^d y.  ``level(d)`` is Δ^d y as the ADF
    regressions saw it (``PreparedSeries.level``: the fixed seasonal means removed when
    the tests allow for them)."""
    if not options.kpss:
        return []
    return [(estimation.kpss(level(d), spec, d, options.alpha), expects)
            for spec, d, expects in _kpss_plan(order, deterministic)]


def kpss_requests(decision: Decision, options: CrossCheckOptions) -> list[tuple[str, int]]:
    """(spec, difference) of every KPSS test the cross-check asks its estimation for (on
    ``PreparedSeries.level(difference)``), so a batch can compute them together."""
    if not options.kpss:
        return []
    return [(spec, d) for spec, d, _ in _kpss_plan(decision.order, decision.deterministic)]


def _kpss_plan(order: int | None, deterministic: str | None) -> list[tuple[str, int, bool]]:
    """(spec, difference, whether the verdict expects a rejection) of the KPSS tests."""
    if order is None:
        return []
    if order == 0:
        return [("trend" if deterministic == "trend" else "constant", 0, False)]
    spec_below = "trend" if deterministic in ("trend", "constant") else "constant"
    return [(spec_below, order - 1, True), ("constant", order, False)]


def _with_alpha(points: tuple[LagPoint, ...], x: np.ndarray, spec: str, alpha: float) -> tuple[LagPoint, ...]:
    out = []
    for p in points:
        critical = tau_critical_value(spec, x.shape[0] - 1 - p.lag, alpha)
        if critical == p.critical_value:  # already judged at this level: the point as it is
            out.append(p)
        else:
            out.append(LagPoint(p.lag, p.statistic, critical, bool(p.statistic < critical)))
    return tuple(out)


def settled_difference(order: int | None) -> int:
    """The difference on which the verdict was settled: order − 1 for I(1) and I(2), else 0."""
    return max(order - 1, 0) if order is not None else 0


def alternative_spec(order: int | None, deterministic: str | None) -> str:
    """Deterministic terms of the stationary alternative the verdict competes with."""
    if order is None:
        return "trend"
    if deterministic == "trend" or (order >= 1 and deterministic == "constant"):
        return "trend"
    if order == 0 and deterministic == "none":
        return "none"
    return "constant"


def _label(index: pd.Index | None, position: int) -> str:
    if index is not None and 0 <= position < len(index):
        return str(index[position])
    return f"observation {position + 1}"


def _max_lags(n: int, max_lags: int | None) -> int:
    cap = max(max_lag_cap(n), 0)
    wanted = schwert_max_lag(n) if max_lags is None else max_lags
    return min(wanted, cap)


def extra_evidence(
    x: np.ndarray,
    index: pd.Index | None = None,
    *,
    order: int | None,
    deterministic: str | None,
    alpha: float = 0.05,
    tests: Sequence[str] = EXTRA_TESTS,
    deciding_adf: TestResult | None = None,
    lag_rule: str = "aic",
    lags: int | None = None,
    max_lags: int | None = None,
    za_lags: int | None = None,
    break_model: str = "ct",
    critical_values: str = "mackinnon",
    power: bool = True,
    recursive: bool = True,
    reps: int = DEFAULT_REPS,
    exact_reps: int = EXACT_REPS,
    seed: int = DEFAULT_SEED,
    recursive_by: Callable[[np.ndarray, str, int, int, float], RecursiveStatistic] | None = None,
    level_of: Callable[[int], np.ndarray] | None = None,
) -> ExtraEvidence:
    """Run the extra tests the user turned on, the power simulation and the recursive τ.

    ``x``: the prepared levels (float array); ``index``: its dates, if any.
    ``order``/``deterministic``: the verdict.  ``deciding_adf``: the ADF test
    of the last τ step (its spec, lags and sample drive the power simulation
    and the recursive statistic).  ``lag_rule``/``lags``/``max_lags``: the
    user's lag choice (DF-GLS uses MAIC unless the lag order is fixed).
    ``za_lags``: the Zivot-Andrews lag order, normally the lag the user's rule
    chose for the ADF regression with constant and trend on the same difference
    (pass it to save the search; None: chosen here by the same rule).
    ``critical_values``: "mackinnon" (published tables and response surfaces) or
    "exact" (simulated at this sample size).  ``recursive_by(x, spec, lags, difference,
    alpha)``: where τ on expanding windows comes from (an estimation's ``recursive``;
    None: :func:`recursive_tau` here).  ``level_of(d)``: Δ^d of ``x`` as the ADF regressions
    saw it (``PreparedSeries.level``: the fixed seasonal means removed when the tests allow
    for them); None: Δ^d x.  Failures become ``problems``, one sentence each.
    """
    unknown = [t for t in tests if t not in EXTRA_TESTS]
    if unknown:
        raise ValueError(f"unknown test(s): {', '.join(unknown)}")
    x = np.asarray(x, dtype=float)

    def at(difference: int) -> np.ndarray:
        if level_of is not None:
            return np.asarray(level_of(difference), dtype=float)
        return np.diff(x, n=difference) if difference else x

    d = settled_difference(order)
    xd = at(d)
    spec = alternative_spec(order, deterministic)
    top = _max_lags(xd.shape[0], max_lags)
    fixed = lag_rule == "fixed"
    results: list[TestResult] = []
    problems: list[str] = []
    pp_details: PhillipsPerron | None = None
    z_alpha_cv: dict[str, float] | None = None
    gls: DFGLS | None = None
    break_info: BreakInfo | None = None

    if "pp" in tests:
        try:
            pp, pp_details = pp_test(xd, spec, alpha, d)
            if critical_values == "exact":
                draws = null_distribution(spec, pp.nobs, min(exact_reps, P_VALUE_REPS), seed)
                cv = exact_critical_values(spec, pp.nobs, reps=exact_reps, seed=seed)
                p_value, bound = empirical_p_value(pp.statistic, draws)
                level = fmt.percent(alpha)
                pp = TestResult(pp.test, pp.spec, pp.difference, pp.statistic, p_value, pp.lags,
                                pp.nobs, cv, bool(pp.statistic < cv[level]), cv[level],
                                reportable_bound(p_value, bound), pp.lag_rule)
                z_alpha_cv = z_alpha_critical_values(spec, pp.nobs, min(exact_reps, P_VALUE_REPS), seed)
            results.append(pp)
        except _FAILURES as exc:
            problems.append(f"The Phillips-Perron test could not be computed ({exc}).")

    if "dfgls" in tests:
        gls_spec = "constant" if spec == "none" else spec
        try:
            gls_result, gls = dfgls_test(
                xd, gls_spec, alpha, d, lag_rule="fixed" if fixed else "maic", max_lags=top,
                lags=lags if fixed else None, critical="exact" if critical_values == "exact" else "table",
                reps=exact_reps if critical_values == "exact" else DFGLS_P_VALUE_REPS, seed=seed)
            results.append(gls_result)
        except _FAILURES as exc:
            problems.append(f"The DF-GLS test could not be computed ({exc}).")

    if "za" in tests:
        try:
            if za_lags is not None:
                za_lag = int(za_lags)
            elif fixed and lags is not None:
                za_lag = int(lags)
            else:
                za_lag = choose_lag(xd, "trend", lag_rule, top).lag
            za_result, search = za_test(xd, alpha, break_model, za_lag, difference=d,
                                        lag_rule="fixed" if fixed else lag_rule)
            results.append(za_result)
            break_info = _break_info(search, za_result, index, d)
        except _FAILURES as exc:
            problems.append(f"The Zivot-Andrews test could not be computed ({exc}).")

    power_result: PowerResult | None = None
    recursive_result: RecursiveStatistic | None = None
    if deciding_adf is not None:
        xa = at(deciding_adf.difference)
        if power and order != 0:  # the power matters when the verdict rests on not rejecting
            try:
                power_result = power_at(deciding_adf.spec, deciding_adf.nobs, alpha,
                                        deciding_adf.lags, reps=reps, seed=seed,
                                        critical="exact" if critical_values == "exact" else "mackinnon")
            except _FAILURES as exc:
                problems.append(f"The power simulation could not be run ({exc}).")
        if recursive:
            try:
                if recursive_by is None:
                    recursive_result = recursive_tau(xa, deciding_adf.spec, deciding_adf.lags, alpha)
                else:
                    recursive_result = recursive_by(xa, deciding_adf.spec, deciding_adf.lags,
                                                    deciding_adf.difference, alpha)
            except _FAILURES as exc:
                problems.append(f"The recursive statistic could not be computed ({exc}).")

    return ExtraEvidence(d, spec, tuple(results), fixed, break_model, break_info, power_result,
                         recursive_result, pp_details, z_alpha_cv, gls, tuple(problems))


def _break_info(search: BreakSearch, test: TestResult, index: pd.Index | None, d: int) -> BreakInfo:
    # Position p in the d-times differenced series is position p + d of the levels.
    position = search.position + d
    return BreakInfo(
        model=search.model,
        description=MODEL_LABELS[search.model],
        position=position,
        first_new=position + 1,
        last_old_label=_label(index, position),
        first_new_label=_label(index, position + 1),
        statistic=search.statistic,
        critical_value=test.critical_value,
        reject=test.reject,
        difference=d,
    )
