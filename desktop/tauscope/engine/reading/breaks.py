"""The reading of the break check: a sentence on why a break was suspected and what the
break test found, the verdict given under the break, and the cap the badge takes.

A shift in level the Dickey-Fuller test ignores biases it toward a unit root (Perron
1989); the minimum LM test (Lee & Strazicich 2013) allows the shift under both
hypotheses, so its rejection says "stationary around a path that shifts once" and its
non-rejection "a unit root, even allowing a shift".
"""

from __future__ import annotations

from dataclasses import replace

from tauscope.engine import formatting as fmt
from tauscope.engine.results import Verdict
from tauscope.engine.results_breaks import REASONS, BreakCheck, BreakTest

SHIFTING = {
    "constant": "stationary around a mean that shifts",
    "trend": "stationary around a trend whose level shifts",
}
TEST_WORDS = ("the break test (an LM unit-root test that allows one shift in level, at a date it "
              "picks from the data, with or without a unit root; Lee & Strazicich 2013)")
NEITHER = ("Neither the ADF test nor KPSS allows a shift in level, so neither can confirm or "
           "contradict the verdict given under the break.")


def _join(words: list[str]) -> str:
    return words[0] if len(words) == 1 else ", ".join(words[:-1]) + " and " + words[-1]


def _numbers(test: BreakTest, alpha: float) -> str:
    a = fmt.percent(alpha)
    return (f"statistic {fmt.stat(test.statistic)}, {a} critical value {fmt.stat(test.critical_value)} "
            f"simulated at this length, p {fmt.p_value(test.p_value, test.p_value_bound)}")


def break_sentence(check: BreakCheck, alpha: float) -> str | None:
    """One or two sentences: why a break was suspected, and what the break test says."""
    if not check.suspected:
        return None
    a = fmt.percent(alpha)
    why = _join([REASONS[r] + (f" (at {check.jump_label})" if r == "jump" and check.jump_label else "")
                 for r in check.reasons])
    lead = f"The evidence points to a break: {why}."
    test = check.test
    if test is None:
        return lead + (f" The break test could not be run ({check.problem})." if check.problem else "")
    if test.reject and not check.stationary_with_break:
        return (f"{lead} {TEST_WORDS[0].upper()}{TEST_WORDS[1:]} rejects a unit root at {a} "
                f"({_numbers(test, alpha)}), but the shift it allows (most likely at "
                f"{test.first_new_label}, estimated {fmt.stat(test.shift)}) is not clear "
                f"(t = {fmt.stat(test.shift_t)}) or the verdict is not about the levels, so the verdict "
                "stands; a break remains possible.")
    if test.reject:
        return (f"{lead} {TEST_WORDS[0].upper()}{TEST_WORDS[1:]} rejects a unit root at {a} "
                f"({_numbers(test, alpha)}): the series is {SHIFTING[test.deterministic]} in "
                f"{test.first_new_label} (estimated shift {fmt.stat(test.shift)}). Suggestion: check "
                f"the source near {test.first_new_label}, and use the levels with a shift from that date.")
    return (f"{lead} Even allowing for one shift in level (most likely at {test.first_new_label}), "
            f"{TEST_WORDS} finds no evidence against a unit root at {a} ({_numbers(test, alpha)}), so the "
            "break does not explain the unit root away.")


def verdict_under_break(verdict: Verdict, check: BreakCheck | None, alpha: float) -> Verdict:
    """The verdict given under the break when the break test rejects a unit root:
    order 0, the deterministic terms of the stationary path, the date in the label and
    the sentence.  KPSS without a break cannot confirm such a verdict, so its agreement
    is "inconclusive".  Any other verdict is returned unchanged."""
    if check is None or not check.stationary_with_break or check.test is None:
        return verdict
    test = check.test
    a = fmt.percent(alpha)
    words = SHIFTING[test.deterministic]
    return replace(
        verdict,
        order=0,
        deterministic=test.deterministic,
        unit_root=False,
        agreement="inconclusive",
        label=f"I(0) \u2014 {words} ({test.first_new_label})",
        text=(f"The series is {words} in {test.first_new_label}, I(0): allowing one shift in level, "
              f"the break test rejects a unit root at {a} ({_numbers(test, alpha)}); use it in levels "
              f"with a shift from {test.first_new_label}."),
    )


def agreement_under_break(previous: Verdict, text: str | None, check: BreakCheck | None) -> str | None:
    """The cross-check's sentence, said of the verdict without the break when the verdict is
    given under the break (``previous``: the verdict the testing sequence gave); unchanged
    otherwise."""
    if check is None or not check.stationary_with_break:
        return text
    return " ".join(part for part in (
        f"Without allowing for a break, the testing sequence gives {previous.label}.", text, NEITHER) if part)


def badge_cap(check: BreakCheck | None) -> str | None:
    """The highest badge a verdict may carry given the break check (for the badge's owner):

    * nothing suspected, or no check: None (no cap);
    * a break suspected, whatever the break test found (or if it could not run):
      "inconclusive" — never "confirmed", because the confirming tests (ADF, KPSS) assume
      no break, and a verdict given under the break rests on one test.
    """
    if check is None or not check.suspected:
        return None
    return "inconclusive"


def capped_agreement(agreement: str | None, check: BreakCheck | None) -> str | None:
    """``agreement`` lowered to the cap: "confirmed" becomes "inconclusive" when a break is
    suspected; "conflict", "inconclusive" and None are kept."""
    cap = badge_cap(check)
    if cap is not None and agreement == "confirmed":
        return cap
    return agreement
