"""The numbers that decided each verdict, for the summary tables and the batch console.

Under a size-controlled strategy (the default, and its bootstrap variant) the decision on
each difference is the union of rejections: the statistic M of Harvey, Leybourne & Taylor
(2009, 2012) rejects a unit root when it exceeds its critical value.  Only under the classic
strategy does the ADF τ of the Dickey-Fuller sequence (Dickey & Fuller 1979, 1981) decide.
The spreadsheet summary shows the deciding strategy's M beside the classic path's τ, each
under its own name, and the short summary shows only the numbers that decided, so that a
reader never takes the classic τ for the number that decided.
"""

from __future__ import annotations

from collections.abc import Iterable

from tauscope.engine import SeriesResult, Step
from tauscope.engine import formatting as fmt
from tauscope.report.table_types import DIFFERENCE_SHORT, Column, Value

UNION_NOTE = (
    "Union M: the union of rejections of Harvey, Leybourne & Taylor (2009), which decided "
    "each verdict; it rejects a unit root when it is above its critical value (shown as "
    "\"> value\"; \"≤ value\" when it does not).")
CLASSIC_BESIDE = " The classic τ is shown beside it for the record."
CLASSIC_IN_PATH = " The classic sequence's τ is in each series' decision path, for the record."
BREAK_NOTE = (" A verdict \"around a mean that shifts\" was given by the break test (Lee & "
              "Strazicich 2013), which allows the shift under both hypotheses, after the union "
              "kept a unit root.")


def union_note(results: Iterable[SeriesResult], classic: str = CLASSIC_BESIDE) -> str:
    """:data:`UNION_NOTE` when any of these verdicts was decided by the union, else "";
    then ``classic`` (where the classic τ is shown, if anywhere), and :data:`BREAK_NOTE`
    when the break test then gave any verdict."""
    results = list(results)
    if not any(union_steps(r) for r in results):
        return ""
    note = UNION_NOTE + classic
    if any(break_decided(r) for r in results):
        note += BREAK_NOTE
    return note


def break_decided(result: SeriesResult) -> bool:
    """The verdict was given under a break found by the break test."""
    return (result.breaks is not None and result.breaks.stationary_with_break
            and result.breaks.test is not None)


def union_steps(result: SeriesResult) -> dict[int, Step]:
    """The union step of each difference tested, by difference, when a size-controlled
    strategy decided the verdict (empty under the classic strategy or a failed series)."""
    strategy = result.verdict.strategy
    return {s.difference: s for s in result.steps
            if s.statistic_name == "union" and s.strategy == strategy}


def union_differences(results: Iterable[SeriesResult]) -> list[int]:
    """The differences any result's union was computed on, levels first."""
    return sorted({d for r in results for d in union_steps(r)})


def union_columns(differences: Iterable[int]) -> list[Column]:
    """For each difference: M, whether it rejects, and its critical value."""
    columns: list[Column] = []
    for d in differences:
        short = DIFFERENCE_SHORT.get(d, f"Δ^{d}")
        columns += [Column(f"union{d}", f"Union M, {short}", "stat"),
                    Column(f"union{d}_spec", f"Union M decision, {short}", "text")]
    return columns


def union_cells(result: SeriesResult, differences: Iterable[int]) -> list[Value]:
    steps = union_steps(result)
    cells: list[Value] = []
    for d in differences:
        step = steps.get(d)
        if step is None or step.statistic is None:
            cells += [None, ""]
        else:
            sign = ">" if step.decision == "reject" else "≤"
            critical = "—" if step.critical_value is None else fmt.stat(step.critical_value)
            cells += [step.statistic, f"{sign} {critical}"]
    return cells
