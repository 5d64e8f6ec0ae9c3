"""The reading of the extra evidence: a sentence per extra test and for the power, a
plain reading of where the tests agree with the ADF verdict, and the confirmation rule.

A break the Dickey-Fuller test ignores biases it toward a unit root (Perron 1989), which
is why the Zivot-Andrews result is read against the ADF verdict.
"""

from __future__ import annotations

from collections.abc import Sequence

from tauscope.engine import formatting as fmt
from tauscope.engine.regression.design import SPEC_LABELS
from tauscope.engine.results import BreakInfo, PowerResult, TestResult

TEST_NAMES = {"pp": "Phillips-Perron", "dfgls": "DF-GLS", "za": "Zivot-Andrews", "adf": "ADF"}
TEST_WHAT = {
    "pp": "a unit-root test that corrects for autocorrelation in the errors instead of adding lags",
    "dfgls": "a more powerful version of the Dickey-Fuller test that removes the mean or trend "
             "by GLS first",
    "za": "a unit-root test that allows one break, at a date it picks from the data",
}
AROUND = {"trend": "around a trend", "constant": "around a mean", "none": "around zero"}
WHERE = {0: "the levels", 1: "the first difference", 2: "the second difference"}


def _decision(test: TestResult, alpha: float) -> str:
    a = fmt.percent(alpha)
    return (f"rejects a unit root at {a}" if test.reject
            else f"finds no evidence against a unit root at {a}")


def _p_text(test: TestResult) -> str:
    return fmt.p_value(test.p_value, test.p_value_bound)


def evidence_sentence(test: TestResult, alpha: float, spec_words: str, extra: str = "") -> str:
    a = fmt.percent(alpha)
    return (f"{TEST_NAMES[test.test]} ({TEST_WHAT[test.test]}), on "
            f"{WHERE.get(test.difference, 'the series')} {spec_words}: statistic {fmt.stat(test.statistic)}, {a} "
            f"critical value {fmt.stat(test.critical_value)}, p {_p_text(test)}; it "
            f"{_decision(test, alpha)}{extra}.")


def power_sentence(power: PowerResult, *, classic_decides: bool = True) -> str:
    """The simulated power of the classic sequence's last ADF test, in words.  When another
    strategy decided the verdict, the sentence names the test it describes and says the
    verdict's own test is another one, so the figures are not read as the verdict's power."""
    a = fmt.percent(power.alpha)
    parts = []
    for coefficient, rate in sorted(zip(power.coefficients, power.rates, strict=True), reverse=True):
        parts.append(f"against a coefficient of {coefficient:.2f} it rejects "
                     f"{'only ' if rate < 0.5 else ''}{rate:.0%} of the time")
    lag_words = f"{power.lags} lag{'s' if power.lags != 1 else ''}"
    which = ("the deciding ADF test" if classic_decides
             else "the last ADF test of the classic sequence")
    return (f"How often {which} ({SPEC_LABELS[power.spec]}, {lag_words}, {a}, "
            f"{power.nobs} observations) would reject a unit root if the series were in fact "
            f"stationary with an autoregressive coefficient close to one: " + "; ".join(parts)
            + f" at this sample size (simulation, {power.reps:,} replications). "
            + ("A test that often misses stationarity makes not rejecting a unit root weak evidence "
               "for one." if min(power.rates) < 0.8 else
               "With power this high, not rejecting a unit root says more than usual, though a root "
               "closer to one than 0.95 would still be hard to detect.")
            + ("" if classic_decides else
               " The verdict itself comes from the size-controlled strategy (DF-GLS and MSB), not "
               "from this ADF test; the guide gives its measured rates."))


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


SPEC_WORDS = {"trend": "with constant and trend", "constant": "with a constant",
              "none": "without constant or trend"}


def evidence_notes(tests: Sequence[TestResult], alpha: float, fixed_lags: bool,
                   break_info: BreakInfo | None, power: PowerResult | None, *,
                   classic_decides: bool = True) -> list[str]:
    """One sentence per extra test, in the order they ran, then the power's."""
    notes = []
    for test in tests:
        if test.test == "pp":
            notes.append(evidence_sentence(test, alpha, SPEC_WORDS[test.spec],
                                           f" (Newey-West bandwidth {test.lags})"))
        elif test.test == "dfgls":
            lags = f"{test.lags} lag{'s' if test.lags != 1 else ''}"
            notes.append(evidence_sentence(test, alpha, SPEC_WORDS[test.spec],
                                           f" ({lags}, {'fixed' if fixed_lags else 'chosen by MAIC'})"))
        elif test.test == "za" and break_info is not None:
            notes.append(evidence_sentence(
                test, alpha, f"allowing {break_info.description}",
                f" (most likely break: the new regime starts at {break_info.first_new_label})"))
    if power is not None:
        notes.append(power_sentence(power, classic_decides=classic_decides))
    return notes
