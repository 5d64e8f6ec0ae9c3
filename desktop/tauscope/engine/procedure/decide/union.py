"""The size-controlled strategy: the union of rejections over the deterministic terms.

Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2009), Econometric Theory 25(3);
(2012), Journal of Econometrics 169(2).  On each difference level, from the highest
down (Dickey & Pantula 1987), four statistics (DF-GLS t with a constant and with a
trend; MSB of Stock 1999 and Perron & Ng 1996, with Ng & Perron's 2001 s²_AR, on the
OLS-demeaned and -detrended series) are compared with their own critical values scaled
by κ: the unit root is rejected when M = max_i τ_i / cv_i > κ (MSB enters as −1/MSB), and
κ makes the size of the whole union α.  The first level where it is not rejected at d gives I(d + 1).

The deterministic label comes from the trend test of Harvey, Leybourne & Taylor (2007),
valid whether the series is I(0) or I(1) (never from a pre-test that assumes the
answer): for I(0) "trend" or "constant" (around a mean), for I(1) a trend in the levels
is a drift ("constant") or "none", for I(2) the same on the first difference.

The numbers come from the estimate stage (:class:`~tauscope.engine.procedure.union_estimate.UnionRow`);
the classic sequence (:mod:`.classic`) is always run too, and its path follows the
union's steps.
"""

from __future__ import annotations

from tauscope.engine import formatting as fmt
from tauscope.engine.procedure.decide import classic
from tauscope.engine.procedure.stages import DecideOptions, Decision, Estimates
from tauscope.engine.procedure.union_estimate import UnionLevelRow, UnionRow
from tauscope.engine.results import Step, TestResult
from tauscope.engine.results_strategy import ClassicVerdict
from tauscope.engine.unitroot.union import union_rule
from tauscope.engine.unitroot.union_components import shown

STRATEGY = "union"
_WHERE = classic.DIFFERENCE_WORDS
_COMPONENT_WORDS = {
    "gls-constant": ("constant", "dfgls", "DF-GLS with a constant only"),
    "gls-trend": ("trend", "dfgls", "DF-GLS with a constant and trend"),
    "ols-constant": ("constant", "msb", "MSB on the demeaned series"),
    "ols-trend": ("trend", "msb", "MSB on the detrended series"),
}


def dfgls_tests(row: UnionRow, alpha: float, lag_rule: str) -> dict[tuple[int, str], TestResult]:
    """The GLS components as ``tests`` entries ("dfgls", per spec and difference), each
    judged on its own critical value (Elliott, Rothenberg & Stock 1996; simulated at the
    level's length with the union's constants)."""
    out = {}
    key = f"{round(alpha * 100)}%"
    for d, level in row.levels.items():
        for j, name in enumerate(level.components):
            spec, kind, _ = _COMPONENT_WORDS[name]
            if kind != "dfgls":
                continue
            values = level.component_values[j]
            out[(d, name)] = TestResult(
                "dfgls", spec, d, level.tau[j], None, level.lags[j], level.nobs - level.lags[j] - 1,
                dict(values), bool(level.tau[j] < values[key]), values[key], lag_rule=union_rule(lag_rule))
    return out


def _component_step(level: UnionLevelRow, j: int, alpha: float, test: TestResult | None,
                    strategy: str = STRATEGY) -> Step:
    name = level.components[j]
    spec, kind, words = _COMPONENT_WORDS[name]
    reject = level.tau[j] < level.kappa * level.critical_values[j]
    # MSB is held as −1/MSB (rejects below κ·cv like the t statistics); shown as MSB
    value = shown(name, level.tau[j])
    critical = shown(name, level.kappa * level.critical_values[j])
    a = fmt.percent(alpha)
    scaled = "scaled for the union" if level.p_value is None else "scaled by the union's bootstrap value"
    text = (
        f"On {_WHERE[level.difference]}, {words} (lag {level.lags[j]}): {fmt.stat(value)} against "
        f"its {a} value {scaled}, {fmt.stat(critical)} "
        f"({'rejects' if reject else 'does not reject'} on its own)."
    )
    return Step(level.difference, spec, f"unit root, {words}", kind, value, critical, None,
                "reject" if reject else "do not reject", text, test, strategy)


def _union_step(level: UnionLevelRow, alpha: float, strategy: str = STRATEGY) -> Step:
    a = fmt.percent(alpha)
    where = _WHERE[level.difference]
    if level.p_value is not None:
        line = "its wild-bootstrap critical value q*"
        if level.reject:
            text = (f"On {where}, the union of the four tests rejects a unit root at {a} overall against "
                    f"{line} (M = {fmt.stat(level.statistic)} > q* = {fmt.stat(level.kappa)}; bootstrap "
                    f"p-value {fmt.p_value(level.p_value)}).")
        else:
            text = (f"On {where}, the union of the four tests finds no evidence against a unit root at {a} "
                    f"overall against {line} (M = {fmt.stat(level.statistic)} ≤ q* = "
                    f"{fmt.stat(level.kappa)}; bootstrap p-value {fmt.p_value(level.p_value)}).")
    elif level.reject:
        text = (f"On {where}, the union of the four tests rejects a unit root at {a} overall "
                f"(M = {fmt.stat(level.statistic)} > κ = {fmt.stat(level.kappa)}).")
    else:
        text = (f"On {where}, the union of the four tests finds no evidence against a unit root at "
                f"{a} overall (M = {fmt.stat(level.statistic)} ≤ κ = {fmt.stat(level.kappa)}).")
    return Step(level.difference, "union", "unit root, whatever the deterministic terms", "union",
                level.statistic, level.kappa, level.p_value, "reject" if level.reject else "do not reject",
                text, None, strategy)


def _trend_step(row: UnionRow, alpha: float, strategy: str = STRATEGY) -> Step | None:
    d = row.trend_difference
    if d is None or row.order is None:
        return None
    found = abs(row.trend_z) > row.trend_critical_value
    a = fmt.percent(alpha)
    numbers = f"z = {fmt.stat(row.trend_z)}, {a} critical value ±{fmt.stat(row.trend_critical_value)}"
    if row.order == 0:
        meaning = "the series moves around a trend" if found else "the series moves around a mean"
    elif row.order == 1:
        meaning = "the series drifts (a trend in the levels)" if found else "no drift"
    else:
        meaning = "the growth rate drifts" if found else "no drift in the growth rate"
    text = (f"The trend test that holds with or without a unit root (Harvey, Leybourne & Taylor "
            f"2007) on {_WHERE[d]}: {numbers}: {meaning}.")
    return Step(d, "trend", "no linear trend (valid under I(0) and I(1))", "trend", row.trend_z,
                row.trend_critical_value, None, "reject" if found else "do not reject", text, None,
                strategy)


def union_steps(row: UnionRow, alpha: float, max_difference: int,
                tests: dict[tuple[int, str], TestResult], strategy: str = STRATEGY) -> tuple[Step, ...]:
    """Per level visited from the highest down: its four components and the union; then
    the label step."""
    steps: list[Step] = []
    for d in range(max_difference, -1, -1):
        level = row.levels[d]
        for j, name in enumerate(level.components):
            steps.append(_component_step(level, j, alpha, tests.get((d, name)), strategy))
        steps.append(_union_step(level, alpha, strategy))
        if not level.reject:
            break
    label = _trend_step(row, alpha, strategy)
    return (*steps, label) if label is not None else tuple(steps)


def decide(estimates: Estimates, options: DecideOptions) -> Decision:
    """The union's order and label; the classic sequence's path and verdict beside it."""
    return decide_as(estimates, options, STRATEGY)


def decide_as(estimates: Estimates, options: DecideOptions, strategy: str) -> Decision:
    """:func:`decide`, its steps and decision marked ``strategy`` (the union with κ, or
    with the wild bootstrap's critical value when the estimates carry it)."""
    row = estimates.union
    if row is None:
        raise ValueError("the union strategy needs the union's estimates")
    sequence = classic.decide(estimates, options)
    tests = dfgls_tests(row, options.alpha, options.lag_rule)
    steps = (*union_steps(row, options.alpha, options.max_difference, tests, strategy), *sequence.steps)
    verdict = ClassicVerdict(sequence.order, sequence.deterministic, "", sequence.weak)
    return Decision(estimates, strategy, sequence.visited, steps, row.order, row.deterministic,
                    sequence.deciding, classic=verdict, weak=False, union_tests=tuple(tests.values()))
