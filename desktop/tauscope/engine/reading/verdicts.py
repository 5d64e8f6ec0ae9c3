"""Verdict labels and sentences, and the reading of the KPSS cross-check."""

from __future__ import annotations

from tauscope.engine import formatting as fmt
from tauscope.engine.reading.words import cross_check_word
from tauscope.engine.results import TestResult, Verdict

_I0 = {
    "trend": "stationary around a trend",
    "constant": "stationary around a mean",
    "none": "stationary around zero",
}
_I1 = {
    "trend": "unit root with drift and trend",
    "constant": "unit root with drift",
    "none": "unit root without drift",
}
_I2 = {
    "trend": "two unit roots, trending growth",
    "constant": "two unit roots, drift in the growth rate",
    "none": "two unit roots",
}


def verdict_label(order: int | None, deterministic: str | None) -> str:
    if order is None:
        return "Unresolved"
    det = deterministic or "none"
    words = {0: _I0, 1: _I1, 2: _I2}[order][det]
    return f"I({order}) \u2014 {words}"


def verdict_sentence(
    order: int | None, deterministic: str | None, alpha: float, max_difference: int
) -> str:
    a = fmt.percent(alpha)
    if order is None:
        if max_difference == 0:
            return (
                f"A unit root in the levels is not rejected at {a}; differences were not tested "
                "(the highest difference allowed is 0), so the order of integration is unresolved."
            )
        return (
            f"Even after differencing {max_difference} time{'s' if max_difference > 1 else ''} a unit "
            f"root is not rejected at {a}, so the order of integration is unresolved; check the data."
        )
    det = deterministic or "none"
    if order == 0:
        return (
            f"The series is {_I0[det]}, I(0): the unit root is rejected at {a}; use it in levels."
        )
    if order == 1:
        return (
            f"The series has a {_I1[det]}, I(1): a unit root is not rejected at {a} in the levels but is "
            "rejected in the first difference; suggestion: difference once before using it in a regression."
        )
    return (
        f"The series has {_I2[det]}, I(2): a unit root is not rejected at {a} in the first difference but "
        "is rejected in the second; suggestion: difference twice, or check whether logs or growth rates "
        "are the better unit."
    )


def agreement(order: int | None, checks: list[tuple[TestResult, bool]]) -> str | None:
    """ "confirmed", "conflict" or "inconclusive" from KPSS checks.

    Each check is (KPSS result, whether the verdict expects it to reject).
    """
    if not checks:
        return None
    if order is None:
        return "inconclusive"
    matches = [test.reject == expected for test, expected in checks]
    if all(matches):
        return "confirmed"
    if not any(matches):
        return "conflict"
    return "inconclusive"


_KPSS_ONLY = {"confirmed": "KPSS agrees", "inconclusive": "KPSS agrees in part", "conflict": "KPSS disagrees"}


def agreement_note(
    order: int | None, status: str | None, checks: list[tuple[TestResult, bool]], alpha: float,
    kpss_only: bool = False,
) -> str | None:
    """The KPSS cross-check in words.  ``kpss_only``: the grade is set by more than KPSS
    (reading/grade.py), so the note names KPSS's side only, not the grade."""
    note = _agreement_note(order, status, checks, alpha)
    if note is None or not kpss_only or status is None:
        return note
    head, _, rest = note.partition(": ")
    return f"{_KPSS_ONLY.get(status, head)}: {rest}" if head.startswith("Cross-check") else note


def _agreement_note(
    order: int | None, status: str | None, checks: list[tuple[TestResult, bool]], alpha: float
) -> str | None:
    if status is None or not checks:
        return None
    a = fmt.percent(alpha)
    parts = []
    for test, _expected in checks:
        null = "a trend" if test.spec == "trend" else "a constant mean"
        where = {0: "the levels", 1: "the first difference", 2: "the second difference"}[
            test.difference
        ]
        outcome = "rejects" if test.reject else "does not reject"
        parts.append(
            f"on {where}, KPSS (which takes stationarity around {null} as its null) {outcome} it at {a} "
            f"(statistic {fmt.stat(test.statistic, 3)}, {a} critical value {fmt.stat(test.critical_value, 3)}, "
            f"p {fmt.p_value(test.p_value, test.p_value_bound)})"
        )
    detail = "; ".join(parts)
    word = cross_check_word(status)  # the same word as the window's Cross-check column
    if status == "confirmed":
        return f"Cross-check {word}: {detail}. Both kinds of test point the same way."
    if status == "inconclusive" and order is None:
        return f"Cross-check: {detail}. With the order unresolved, the cross-check cannot confirm anything."
    if status == "inconclusive":
        return (
            f"Cross-check {word}: {detail}. The stationarity test agrees with the verdict on one "
            "difference but not on the other; read the verdict as tentative."
        )
    if order == 0:
        return (
            f"Cross-check {word}: {detail}. Both tests reject their null; this often means a break "
            "in level or trend, a slowly changing mean, or long memory, and the verdict should be read "
            "with care."
        )
    return (
        f"Cross-check {word}: {detail}. Neither test rejects its null; the data cannot tell a unit "
        "root from a persistent stationary process, which is common over a short span or with a "
        "root close to one."
    )


def build_verdict(
    order: int | None,
    deterministic: str | None,
    unit_root: bool | None,
    status: str | None,
    alpha: float,
    max_difference: int,
) -> Verdict:
    return Verdict(
        order=order,
        deterministic=deterministic,
        unit_root=unit_root,
        agreement=status,
        label=verdict_label(order, deterministic),
        text=verdict_sentence(order, deterministic, alpha, max_difference),
    )
