"""The plain words users see for the engine's contract values, in one place.

The contract values stay in ``to_dict()`` as DESIGN §3 names them (``verdict.agreement``:
"confirmed", "conflict", "inconclusive" or None; a step's ``decision``: "reject" or
"do not reject"); the window, the notes, the guide, the reports and the command line show
the words below instead, so that one result reads the same everywhere.  The words are keyed
on the contract values only: however the grade behind "confirmed" is reached, its word
stays the same.  Plain Python (no Qt, no files), so engine, report and ui can all use it.
"""

from __future__ import annotations

# What the cross-checks (KPSS and the other tests turned on) say about the verdict.
CROSS_CHECK_TITLE = "Cross-check"
CROSS_CHECK_WORDS: dict[str | None, str] = {
    "confirmed": "agrees",
    "conflict": "disagrees",
    "inconclusive": "unclear",
    None: "not run",
}
CROSS_CHECK_MEANINGS: dict[str | None, str] = {
    "confirmed": ("Every check points the same way: KPSS, the classic sequence, the verdict at "
                  "1% and 10% and with a longer maximum lag; the test has power at this length "
                  "and no break is suspected. Verdicts graded so were right about 98% of the time "
                  "on the verdict scorecard (pooled over its grid)."),
    "conflict": "The cross-checks point the other way: treat the verdict with care.",
    "inconclusive": "The cross-checks neither clearly support nor contradict the verdict.",
    None: "No cross-check was run (see the testing settings).",
}

# What one step of the decision path did with its null hypothesis (never "accept").
DECISION_WORDS: dict[str, str] = {"reject": "rejected", "do not reject": "not rejected"}

# The column that holds a series' verdict holds, on each step below it, the null hypothesis
# that step tests: its title says both.
VERDICT_TITLE = "Verdict · null tested"


def cross_check_word(agreement: str | None) -> str:
    """The word for ``verdict.agreement`` (an unknown value is shown as it is)."""
    return CROSS_CHECK_WORDS.get(agreement, str(agreement))


def cross_check_meaning(agreement: str | None) -> str:
    """One sentence on what that word means."""
    return CROSS_CHECK_MEANINGS.get(agreement, "")


def decision_word(decision: str) -> str:
    """The word for a step's ``decision``: "rejected" or "not rejected"."""
    return DECISION_WORDS["reject"] if decision == "reject" else DECISION_WORDS["do not reject"]

