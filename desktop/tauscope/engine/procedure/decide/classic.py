"""The classic strategy: the Dickey-Fuller testing sequence on each difference level,
from the highest difference down (Dickey, D.A. & Pantula, S.G. 1987, "Determining the
Order of Differencing in Autoregressive Processes", JBES 5(4); Pantula, S.G. 1989,
Econometric Theory 5): the sequence runs on Δ^d y for d = max_difference, …, 0 and moves
down only while the unit root is rejected.  The first non-rejection at d gives I(d + 1);
rejection all the way gives I(0).

The sequence on one difference level:

Dolado, J.J., Jenkinson, T. & Sosvilla-Rivero, S. (1990), "Cointegration and
Unit Roots", Journal of Economic Surveys 4(3), 249-273:

1. Trend spec: τ_τ.  If it rejects, there is no unit root; the trend's own t
   (asymptotically normal under stationarity) says whether the series moves
   around a trend, and otherwise the constant's t in the constant spec says
   around a mean or around zero.
2. Otherwise Φ3 (a2 = γ = 0).  If the trend belongs, γ = 0 is tested against
   the standard normal (West 1988) and the sequence stops.
3. Otherwise the constant spec: τ_μ (rejects → stationary around a mean or
   zero, as above); if not, Φ1 (a0 = γ = 0).  If the drift belongs, γ = 0
   against the standard normal; the sequence stops.
4. Otherwise the spec without deterministic terms: τ.
"""

from __future__ import annotations

from dataclasses import dataclass

from tauscope.engine import formatting as fmt
from tauscope.engine.distributions.critical import (
    normal_lower,
    normal_lower_p,
    normal_two_sided,
    normal_two_sided_p,
)
from tauscope.engine.procedure.stages import DecideOptions, Decision, Estimates
from tauscope.engine.regression.design import SPEC_LABELS
from tauscope.engine.results import LevelTests, Step, TestResult

DIFFERENCE_WORDS = {0: "the levels", 1: "the first difference", 2: "the second difference"}



@dataclass(frozen=True)
class SequenceOutcome:
    difference: int
    steps: tuple[Step, ...]
    unit_root: bool
    deterministic: str
    settled_spec: str
    weak: bool = False  # γ rejected only against the normal after a drift or trend was found


def _where(difference: int) -> str:
    return DIFFERENCE_WORDS.get(difference, f"difference {difference}")


def _tau_step(test: TestResult, alpha: float) -> Step:
    label = SPEC_LABELS[test.spec]
    a = fmt.percent(alpha)
    stat_text = (
        f"τ = {fmt.stat(test.statistic)}, {a} critical value {fmt.stat(test.critical_value)}, "
        f"p = {fmt.p_value(test.p_value)}"
    )
    if test.reject:
        text = (
            f"On {_where(test.difference)}, with {label}, the ADF test rejects a unit root at {a} "
            f"({stat_text})."
        )
    else:
        text = (
            f"On {_where(test.difference)}, with {label}, the ADF test finds no evidence against "
            f"a unit root at {a} ({stat_text})."
        )
    return Step(
        test.difference,
        test.spec,
        f"unit root (γ = 0), regression with {label}",
        "tau",
        test.statistic,
        test.critical_value,
        test.p_value,
        "reject" if test.reject else "do not reject",
        text,
        test,
    )


_PHI_WORDS = {
    "phi1": (
        "no drift and a unit root (a0 = γ = 0)",
        "Φ1",
        "the constant (a drift) belongs in the regression",
        "the constant can be dropped",
    ),
    "phi2": (
        "no constant, no trend and a unit root (a0 = a2 = γ = 0)",
        "Φ2",
        "some deterministic term belongs in the regression",
        "the deterministic terms can be dropped",
    ),
    "phi3": (
        "no trend and a unit root (a2 = γ = 0)",
        "Φ3",
        "the trend belongs in the regression",
        "the trend can be dropped",
    ),
}


def _phi_step(test: TestResult, alpha: float) -> Step:
    hypothesis, symbol, yes, no = _PHI_WORDS[test.test]
    a = fmt.percent(alpha)
    numbers = (
        f"{symbol} = {fmt.stat(test.statistic)}, {a} critical value {fmt.stat(test.critical_value)}"
    )
    if test.reject:
        text = f"The joint F test of {hypothesis} rejects at {a} ({numbers}): {yes}."
    else:
        text = f"The joint F test of {hypothesis} does not reject at {a} ({numbers}): {no}."
    return Step(
        test.difference,
        test.spec,
        hypothesis,
        test.test,
        test.statistic,
        test.critical_value,
        None,
        "reject" if test.reject else "do not reject",
        text,
        test,
    )


WEAK_WORDS = (
    "this conclusion is weak: it rests on the normal critical value after a drift was found "
    "(West 1988), a step at which the sequence often calls a unit root stationary"
)


def _gamma_normal_step(test: TestResult, alpha: float, why: str) -> Step:
    critical = normal_lower(alpha)
    reject = test.statistic < critical
    a = fmt.percent(alpha)
    p = normal_lower_p(test.statistic)
    numbers = f"τ = {fmt.stat(test.statistic)}, {a} normal critical value {fmt.stat(critical, 3)}, p = {fmt.p_value(p)}"
    if reject:
        text = (
            f"Because {why}, τ is compared with the standard normal (West 1988): it rejects a unit "
            f"root at {a} ({numbers}), so the sequence concludes trend-stationary: the level grows, "
            f"but shocks fade; {WEAK_WORDS}."
        )
    else:
        text = (
            f"Because {why}, τ is compared with the standard normal (West 1988): no evidence "
            f"against a unit root at {a} ({numbers})."
        )
    return Step(
        test.difference,
        test.spec,
        "unit root (γ = 0), normal critical value",
        "z",
        test.statistic,
        critical,
        p,
        "reject" if reject else "do not reject",
        text,
        test,
    )


def _term_step(test: TestResult, term: str, alpha: float) -> Step:
    assert test.regression is not None
    t_value = test.regression.coefficient(term).t_value
    critical = normal_two_sided(alpha)
    reject = abs(t_value) > critical
    a = fmt.percent(alpha)
    p = normal_two_sided_p(t_value)
    numbers = f"t = {fmt.stat(t_value)}, two-sided {a} normal value {fmt.stat(critical, 3)}, p = {fmt.p_value(p)}"
    if term == "trend":
        meaning = "the series moves around a trend" if reject else "the trend is not significant"
    else:
        meaning = (
            "the series moves around a non-zero mean"
            if reject
            else "the mean is not distinguishable from zero"
        )
    text = f"With the unit root rejected, the {term}'s t is compared with the standard normal ({numbers}): {meaning}."
    return Step(
        test.difference,
        test.spec,
        f"no {term} (coefficient = 0), series stationary",
        "z",
        t_value,
        critical,
        p,
        "reject" if reject else "do not reject",
        text,
        test,
    )


def run_sequence(level: LevelTests, alpha: float) -> SequenceOutcome:
    steps: list[Step] = []
    d = level.difference
    trend, constant, none = level.adf["trend"], level.adf["constant"], level.adf["none"]

    def stationary_terms(first: TestResult) -> SequenceOutcome:
        if first.spec == "trend":
            trend_step = _term_step(first, "trend", alpha)
            steps.append(trend_step)
            if trend_step.rejected:
                return SequenceOutcome(d, tuple(steps), False, "trend", "trend")
        constant_step = _term_step(constant, "constant", alpha)
        steps.append(constant_step)
        det = "constant" if constant_step.rejected else "none"
        return SequenceOutcome(d, tuple(steps), False, det, first.spec)

    steps.append(_tau_step(trend, alpha))
    if trend.reject:
        return stationary_terms(trend)
    phi3 = _phi_step(level.phi["phi3"], alpha)
    steps.append(phi3)
    if phi3.rejected:
        z = _gamma_normal_step(trend, alpha, "the trend is significant")
        steps.append(z)
        return SequenceOutcome(d, tuple(steps), not z.rejected, "trend", "trend", z.rejected)
    steps.append(_tau_step(constant, alpha))
    if constant.reject:
        return stationary_terms(constant)
    phi1 = _phi_step(level.phi["phi1"], alpha)
    steps.append(phi1)
    if phi1.rejected:
        z = _gamma_normal_step(constant, alpha, "a drift is present")
        steps.append(z)
        # A drift with the unit root rejected is a level that grows: trend-stationary, not
        # "around a mean" (issue 13 §4).
        det = "trend" if z.rejected else "constant"
        return SequenceOutcome(d, tuple(steps), not z.rejected, det, "constant", z.rejected)
    last = _tau_step(none, alpha)
    steps.append(last)
    return SequenceOutcome(d, tuple(steps), not last.rejected, "none", "none")


def decide(estimates: Estimates, options: DecideOptions) -> Decision:
    """Order of integration from the highest difference down (Dickey & Pantula 1987)."""
    outcomes: list[SequenceOutcome] = []
    order: int | None = 0
    for d in range(options.max_difference, -1, -1):
        outcome = run_sequence(estimates.levels[d], options.alpha)
        outcomes.append(outcome)
        if outcome.unit_root:
            order = d + 1 if d < options.max_difference else None
            break
    steps = tuple(s for o in outcomes for s in o.steps)
    deterministic = None if order is None else outcomes[-1].deterministic
    deciding = [s for s in steps if s.statistic_name == "tau"][-1]
    weak = order is not None and any(o.weak for o in outcomes)
    return Decision(estimates, "classic", tuple(o.difference for o in outcomes), steps, order,
                    deterministic, deciding, weak=weak)
