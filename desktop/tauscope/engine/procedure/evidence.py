"""More evidence per series: the tests that cross-check the Dickey-Fuller verdict,
the power of the deciding test at this sample size, the recursive statistic,
and a plain reading of where the tests agree or disagree.

* Phillips-Perron Zτ (Phillips & Perron 1988): :mod:`tauscope.engine.unitroot.phillips_perron`.
* DF-GLS (Elliott, Rothenberg & Stock 1996): :mod:`tauscope.engine.unitroot.dfgls`.
* Zivot-Andrews with one break (Zivot & Andrews 1992): :mod:`tauscope.engine.unitroot.zivot_andrews`.
* Power against AR(1) coefficients 0.90 and 0.95: :mod:`tauscope.engine.distributions.power`.
* τ on an expanding window: :mod:`tauscope.engine.unitroot.recursive`.

The extra tests run on the difference where the verdict was settled (the
levels for I(0) and I(1), the first difference for I(2)), with the
deterministic terms of the stationary alternative the verdict competes with:
a trend for a trending series or a unit root with drift, a mean otherwise.
A break the Dickey-Fuller test ignores biases it toward a unit root (Perron
1989), which is why the Zivot-Andrews result is read against the ADF verdict.
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np
import pandas as pd

from tauscope.engine import formatting as fmt
from tauscope.engine.distributions.power import power_at
from tauscope.engine.distributions.simulate import (
    DEFAULT_REPS,
    DEFAULT_SEED,
    EXACT_REPS,
    empirical_p_value,
    exact_critical_values,
    null_distribution,
    reportable_bound,
)
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.regression.design import SPEC_LABELS, max_lag_cap, schwert_max_lag
from tauscope.engine.regression.lagchoice import choose_lag
from tauscope.engine.results import (
    DFGLS,
    BreakInfo,
    Evidence,
    PhillipsPerron,
    PowerResult,
    RecursiveStatistic,
    TestResult,
)
from tauscope.engine.unitroot.dfgls import DFGLS_P_VALUE_REPS, dfgls_test
from tauscope.engine.unitroot.phillips_perron import (
    pp_test,
    z_alpha_critical_values,
)
from tauscope.engine.unitroot.recursive import recursive_tau
from tauscope.engine.unitroot.zivot_andrews import MODEL_LABELS, BreakSearch, za_test

EXTRA_TESTS = ("pp", "dfgls", "za")
TEST_NAMES = {"pp": "Phillips-Perron", "dfgls": "DF-GLS", "za": "Zivot-Andrews", "adf": "ADF"}
TEST_WHAT = {
    "pp": "a unit-root test that corrects for autocorrelation in the errors instead of adding lags",
    "dfgls": "a more powerful version of the Dickey-Fuller test that removes the mean or trend "
             "by GLS first",
    "za": "a unit-root test that allows one break, at a date it picks from the data",
}
AROUND = {"trend": "around a trend", "constant": "around a mean", "none": "around zero"}
WHERE = {0: "the levels", 1: "the first difference", 2: "the second difference"}
_FAILURES = (UntestableSeries, np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)




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


def _decision(test: TestResult, alpha: float) -> str:
    a = fmt.percent(alpha)
    return (f"rejects a unit root at {a}" if test.reject
            else f"finds no evidence against a unit root at {a}")


def _p_text(test: TestResult) -> str:
    return fmt.p_value(test.p_value, test.p_value_bound)


def _test_sentence(test: TestResult, alpha: float, spec_words: str, extra: str = "") -> str:
    a = fmt.percent(alpha)
    return (f"{TEST_NAMES[test.test]} ({TEST_WHAT[test.test]}), on "
            f"{WHERE.get(test.difference, 'the series')} {spec_words}: statistic {fmt.stat(test.statistic)}, {a} "
            f"critical value {fmt.stat(test.critical_value)}, p {_p_text(test)}; it "
            f"{_decision(test, alpha)}{extra}.")


def _power_sentence(power: PowerResult) -> str:
    a = fmt.percent(power.alpha)
    parts = []
    for coefficient, rate in sorted(zip(power.coefficients, power.rates, strict=True), reverse=True):
        parts.append(f"against a coefficient of {coefficient:.2f} it rejects "
                     f"{'only ' if rate < 0.5 else ''}{rate:.0%} of the time")
    lag_words = f"{power.lags} lag{'s' if power.lags != 1 else ''}"
    return (f"How often the deciding ADF test ({SPEC_LABELS[power.spec]}, {lag_words}, {a}, "
            f"{power.nobs} observations) would reject a unit root if the series were in fact "
            f"stationary with an autoregressive coefficient close to one: " + "; ".join(parts)
            + f" at this sample size (simulation, {power.reps:,} replications). "
            + ("A test that often misses stationarity makes not rejecting a unit root weak evidence "
               "for one." if min(power.rates) < 0.8 else
               "With power this high, not rejecting a unit root says more than usual, though a root "
               "closer to one than 0.95 would still be hard to detect."))


def _join(names: Sequence[str]) -> str:
    if len(names) <= 1:
        return "".join(names)
    return ", ".join(names[:-1]) + " and " + names[-1]


def reading(adf_stationary: bool | None, spec: str, difference: int, alpha: float,
            extra: Sequence[TestResult], kpss: TestResult | None,
            break_info: BreakInfo | None) -> str | None:
    """A plain reading of agreement and disagreement with the ADF verdict on one difference."""
    if adf_stationary is None:
        return None
    a = fmt.percent(alpha)
    where = WHERE.get(difference, "the series")
    around = AROUND[spec]
    standard = [t for t in extra if t.test in ("pp", "dfgls")]
    sentences: list[str] = []
    if not adf_stationary:
        against = [TEST_NAMES[t.test] for t in standard if t.reject]
        kpss_agrees_stationary = kpss is not None and not kpss.reject
        if against:
            backers = list(against) + (["KPSS"] if kpss_agrees_stationary else [])
            kind = "trend-stationarity" if spec == "trend" else "stationarity"
            sentences.append(
                f"On {where}, the ADF test does not reject a unit root at {a}, but {_join(backers)} "
                f"point{'s' if len(backers) == 1 else ''} to stationarity {around}: the evidence leans "
                f"toward {kind}; consider a break or an autoregressive root close to one, and read the "
                "unit-root verdict as tentative.")
        elif standard:
            sentences.append(
                f"On {where}, {_join([TEST_NAMES[t.test] for t in standard])} agree"
                f"{'s' if len(standard) == 1 else ''} with the ADF test: no evidence against a unit "
                f"root at {a}.")
        if break_info is not None:
            if break_info.reject:
                sentences.append(
                    f"Allowing for {break_info.description} (the new regime starting at "
                    f"{break_info.first_new_label}), the Zivot-Andrews test rejects a unit root at {a}: "
                    "the series may be stationary around a path that shifts once, which the ADF test "
                    "mistakes for a unit root (Perron 1989); suggestion: check the source near "
                    f"{break_info.first_new_label}.")
            else:
                sentences.append(
                    f"Even allowing for {break_info.description}, the Zivot-Andrews test finds no "
                    f"evidence against a unit root at {a} (most likely break: the new regime starting "
                    f"at {break_info.first_new_label}).")
    else:
        dissent = [TEST_NAMES[t.test] for t in standard if not t.reject]
        if dissent:
            sentences.append(
                f"On {where}, the ADF test rejects a unit root at {a} but {_join(dissent)} "
                f"do{'es' if len(dissent) == 1 else ''} not: the evidence for stationarity {around} "
                "rests on fewer tests than it seems; read the verdict as tentative.")
        elif standard:
            sentences.append(
                f"On {where}, {_join([TEST_NAMES[t.test] for t in standard])} agree"
                f"{'s' if len(standard) == 1 else ''} with the ADF test: each rejects a unit root at "
                f"{a}.")
    return " ".join(sentences) if sentences else None


def combined_agreement(adf_stationary: bool | None, kpss_status: str | None,
                       extra: Sequence[TestResult]) -> str | None:
    """The confirmation rule over every test turned on: "confirmed" when all point the
    verdict's way, "conflict" when none does, "inconclusive" otherwise (KPSS's own status
    counts as one vote: confirmed = agrees, conflict = disagrees)."""
    if adf_stationary is None:
        return "inconclusive" if (extra or kpss_status) else None
    votes = [t.reject == adf_stationary for t in extra]
    if kpss_status in ("confirmed", "conflict"):
        votes.append(kpss_status == "confirmed")
    elif kpss_status == "inconclusive":
        return "inconclusive"
    if not votes:
        return None
    if all(votes):
        return "confirmed"
    if not any(votes):
        return "conflict"
    return "inconclusive"


def _max_lags(n: int, max_lags: int | None) -> int:
    cap = max(max_lag_cap(n), 0)
    wanted = schwert_max_lag(n) if max_lags is None else max_lags
    return min(wanted, cap)


def gather_evidence(
    x: np.ndarray,
    index: pd.Index | None = None,
    *,
    order: int | None,
    deterministic: str | None,
    alpha: float = 0.05,
    tests: Sequence[str] = EXTRA_TESTS,
    deciding_adf: TestResult | None = None,
    kpss: Sequence[TestResult] = (),
    kpss_status: str | None = None,
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
) -> Evidence:
    """Run the extra tests the user turned on and say what they add.

    ``x``: the prepared levels (float array); ``index``: its dates, if any.
    ``order``/``deterministic``: the verdict.  ``deciding_adf``: the ADF test
    of the last τ step (its spec, lags and sample drive the power simulation
    and the recursive statistic).  ``kpss``: KPSS results already computed;
    ``kpss_status``: their agreement.  ``lag_rule``/``lags``/``max_lags``: the
    user's lag choice (DF-GLS uses MAIC unless the lag order is fixed).
    ``za_lags``: the Zivot-Andrews lag order, normally the lag the user's rule
    chose for the ADF regression with constant and trend on the same difference
    (pass it to save the search; None: chosen here by the same rule).  ``critical_values``: "mackinnon" (published
    tables and response surfaces) or "exact" (simulated at this sample size).
    """
    unknown = [t for t in tests if t not in EXTRA_TESTS]
    if unknown:
        raise ValueError(f"unknown test(s): {', '.join(unknown)}")
    x = np.asarray(x, dtype=float)
    d = settled_difference(order)
    xd = np.diff(x, n=d) if d else x
    spec = alternative_spec(order, deterministic)
    spec_words = {"trend": "with constant and trend", "constant": "with a constant",
                  "none": "without constant or trend"}
    top = _max_lags(xd.shape[0], max_lags)
    fixed = lag_rule == "fixed"
    results: list[TestResult] = []
    notes: list[str] = []
    problems: list[str] = []
    pp_details: PhillipsPerron | None = None
    z_alpha_cv: dict[str, float] | None = None
    gls: DFGLS | None = None
    break_info: BreakInfo | None = None

    if "pp" in tests:
        try:
            pp, pp_details = pp_test(xd, spec, alpha, d)
            if critical_values == "exact":
                draws = null_distribution(spec, pp.nobs, exact_reps, seed)
                cv = exact_critical_values(spec, pp.nobs, reps=exact_reps, seed=seed)
                p_value, bound = empirical_p_value(pp.statistic, draws)
                level = fmt.percent(alpha)
                pp = TestResult(pp.test, pp.spec, pp.difference, pp.statistic, p_value, pp.lags,
                                pp.nobs, cv, bool(pp.statistic < cv[level]), cv[level],
                                reportable_bound(p_value, bound), pp.lag_rule)
                z_alpha_cv = z_alpha_critical_values(spec, pp.nobs, exact_reps, seed)
            results.append(pp)
            notes.append(_test_sentence(pp, alpha, spec_words[spec],
                                        f" (Newey-West bandwidth {pp.lags})"))
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
            notes.append(_test_sentence(gls_result, alpha, spec_words[gls_spec],
                                        f" ({gls_result.lags} lag{'s' if gls_result.lags != 1 else ''}, "
                                        f"{'fixed' if fixed else 'chosen by MAIC'})"))
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
            notes.append(_test_sentence(
                za_result, alpha, f"allowing {MODEL_LABELS[break_model]}",
                f" (most likely break: the new regime starts at {break_info.first_new_label})"))
        except _FAILURES as exc:
            problems.append(f"The Zivot-Andrews test could not be computed ({exc}).")

    adf_stationary = None if order is None else (order == 0 if d == 0 else False)
    kpss_here = next((k for k in kpss if k.difference == d), None)
    text = reading(adf_stationary, spec, d, alpha, results, kpss_here, break_info)
    status = combined_agreement(adf_stationary, kpss_status, results) if results else kpss_status

    power_result: PowerResult | None = None
    recursive_result: RecursiveStatistic | None = None
    if deciding_adf is not None:
        xa = np.diff(x, n=deciding_adf.difference) if deciding_adf.difference else x
        if power and order != 0:  # the power matters when the verdict rests on not rejecting
            try:
                power_result = power_at(deciding_adf.spec, deciding_adf.nobs, alpha,
                                        deciding_adf.lags, reps=reps, seed=seed,
                                        critical="exact" if critical_values == "exact" else "mackinnon")
                notes.append(_power_sentence(power_result))
            except _FAILURES as exc:
                problems.append(f"The power simulation could not be run ({exc}).")
        if recursive:
            try:
                recursive_result = recursive_tau(xa, deciding_adf.spec, deciding_adf.lags, alpha)
            except _FAILURES as exc:
                problems.append(f"The recursive statistic could not be computed ({exc}).")

    all_notes = ([text] if text else []) + notes + problems
    return Evidence(d, spec, tuple(results), tuple(all_notes), text, status, break_info,
                    power_result, recursive_result, pp_details, z_alpha_cv, gls, tuple(problems))


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
