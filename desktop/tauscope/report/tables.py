"""Tables built from a run, shared by every writer.

* :func:`summary_table`: one row per series (the spreadsheet summary);
* :func:`compact_table`: the short summary for HTML, PDF and the clipboard;
* :func:`tests_table`: every computed test in long form (CSV, xlsx);
* :func:`path_table`: the decision path of one series, step by step.

Cells hold plain values (text, int, float or None) so each writer applies its
own formatting; floats are the engine's numbers, unrounded.
"""

from __future__ import annotations

from statistics import NormalDist

from tauscope.engine import LAG_RULE_LABELS, SeriesResult, Settings, Step, TestResult
from tauscope.engine import formatting as fmt
from tauscope.engine.reading.words import CROSS_CHECK_WORDS
from tauscope.engine.regression.design import SPEC_LABELS
from tauscope.report.deciding import union_cells, union_columns, union_differences
from tauscope.report.run import Finding, RunRecord
from tauscope.report.table_types import DIFFERENCE_SHORT, Column, Table, Value

DIFFERENCE_NAMES = {0: "levels", 1: "first difference", 2: "second difference"}
SPEC_CODES = {"trend": "ct", "constant": "c", "none": "n"}
STATISTIC_SYMBOLS = {"tau": "τ", "phi1": "Φ1", "phi2": "Φ2", "phi3": "Φ3", "z": "z", "dfgls": "DF-GLS t",
                     "union": "M (union)", "trend": "z_λ (trend)", "msb": "MSB"}
UNION_SPEC_WORDS = "all deterministic cases"  # the union step's spec ("union")
TEST_LABELS = {
    "adf": "ADF τ",
    "phi1": "Φ1 (joint F)",
    "phi2": "Φ2 (joint F)",
    "phi3": "Φ3 (joint F)",
    "kpss": "KPSS",
}
AGREEMENT_WORDS = {k: v for k, v in CROSS_CHECK_WORDS.items() if k is not None}
MARKER_LEVELS = (("1%", "***"), ("5%", "**"), ("10%", "*"))
_NORMAL = NormalDist()
MARKER_NOTE = (
    "Significance: *** 1%, ** 5%, * 10% (ADF τ below, KPSS above the critical value at that "
    "level; τ critical values from MacKinnon 2010, KPSS from Kwiatkowski et al. 1992)."
)


def marker(test: TestResult) -> str:
    """*** / ** / * when the test rejects at 1% / 5% / 10%, by its own critical values.

    ADF τ rejects below its (lower-tail) critical value; KPSS and Φ above theirs.
    """
    lower_tail = test.test == "adf"
    for level, mark in MARKER_LEVELS:
        critical = test.critical_values.get(level)
        if critical is None:
            continue
        if (test.statistic < critical) if lower_tail else (test.statistic > critical):
            return mark
    return ""


def lag_rule_label(settings: Settings) -> str:
    if settings.lag_rule == "fixed":
        return f"fixed lag order ({settings.lags})"
    return LAG_RULE_LABELS[settings.lag_rule]


def where(difference: int) -> str:
    return DIFFERENCE_NAMES.get(difference, f"difference {difference}")


def deterministic_words(result: SeriesResult) -> str:
    """The verdict's deterministic terms in words ("drift" for an I(1) constant)."""
    det, order = result.verdict.deterministic, result.verdict.order
    if det is None:
        return ""
    if order == 0:
        return {"trend": "trend", "constant": "mean", "none": "none"}[det]
    return {"trend": "drift and trend", "constant": "drift", "none": "none"}[det]


def tau_steps(result: SeriesResult) -> tuple[Step, ...]:
    """The ADF τ steps of the classic sequence's path (the size-controlled strategy's own
    steps, shown before it, are not ADF regressions)."""
    return tuple(s for s in result.steps if s.statistic_name == "tau" and s.strategy == "classic")


def deciding_tau(result: SeriesResult, difference: int) -> TestResult | None:
    """The ADF test of the last τ step the sequence took on this difference."""
    steps = [s for s in tau_steps(result) if s.difference == difference]
    return steps[-1].test if steps else None


NORMAL_MARK = "†"
NORMAL_NOTE = ("† τ compared with the standard normal, because a trend or drift was found to "
               "belong (West 1988); its stars then use the normal's critical values.")


def normal_step(result: SeriesResult, difference: int) -> Step | None:
    """The step that judged this difference's deciding τ against the standard normal (the
    sequence does so once Φ3 or Φ1 finds a trend or drift; West 1988), if it did: a "z" step
    on the same regression whose statistic is that τ (the other "z" steps test a trend's or a
    constant's own t)."""
    test = deciding_tau(result, difference)
    if test is None:
        return None
    return next((s for s in result.steps if s.statistic_name == "z" and s.difference == difference
                 and s.test is test and s.statistic == test.statistic), None)


def normal_marker(statistic: float) -> str:
    """*** / ** / * when a lower-tail test rejects at 1% / 5% / 10% against the standard normal
    (−2.326, −1.645, −1.282)."""
    for level, mark in MARKER_LEVELS:
        if statistic < _NORMAL.inv_cdf(float(level.rstrip("%")) / 100):
            return mark
    return ""


def tau_marker(result: SeriesResult, difference: int) -> str:
    """The deciding τ's stars, by the critical values the sequence judged it with, and
    :data:`NORMAL_MARK` when those were the standard normal's."""
    test = deciding_tau(result, difference)
    if test is None:
        return ""
    if normal_step(result, difference) is not None:
        return normal_marker(test.statistic) + NORMAL_MARK
    return marker(test)


def kpss_tests(result: SeriesResult) -> dict[int, TestResult]:
    return {t.difference: t for t in result.tests if t.test == "kpss"}


def p_text(test: TestResult) -> Value:
    """The p-value as a number, or as words when a table only bounds it."""
    if test.p_value is None:
        return None
    if test.p_value_bound is not None:
        return fmt.p_value(test.p_value, test.p_value_bound)
    return test.p_value


def step_place(step: Step) -> str:
    return f"{where(step.difference)}, {SPEC_LABELS.get(step.spec, UNION_SPEC_WORDS)}"


def _source_cells(finding: Finding) -> tuple[Value, ...]:
    return (finding.name, finding.file_name, finding.sheet or "", finding.column or "")


def summary_table(run: RunRecord) -> Table:
    """One row per series: origin, verdict, the union's M on each difference when a
    size-controlled strategy decided (``deciding``), every τ step of the classic path, lags,
    KPSS and agreement."""
    n_steps = max((len(tau_steps(f.result)) for f in run.findings), default=0)
    kpss_diffs = sorted({d for f in run.findings for d in kpss_tests(f.result)})
    columns = [
        Column("series", "Series"),
        Column("file", "File"),
        Column("sheet", "Sheet"),
        Column("column", "Column"),
        Column("frequency", "Frequency"),
        Column("first", "First"),
        Column("last", "Last"),
        Column("nobs", "Observations", "int"),
        Column("verdict", "Verdict"),
        Column("order", "Order of integration", "int"),
        Column("deterministic", "Deterministic terms"),
    ]
    union_diffs = union_differences(f.result for f in run.findings)
    columns += union_columns(union_diffs)
    for k in range(1, n_steps + 1):
        columns += [
            Column(f"step{k}_on", f"Classic step {k} on"),
            Column(f"step{k}_tau", f"Classic step {k} τ", "stat"),
            Column(f"step{k}_p", f"Classic step {k} p", "p"),
            Column(f"step{k}_sig", f"Classic step {k} sig."),
        ]
    columns += [
        Column("lags", "Lags, classic deciding τ", "int"),
        Column("lag_rule", "Lag rule"),
        Column("max_lags", "Max lags, levels", "int"),
    ]
    for d in kpss_diffs:
        name = where(d)
        columns += [
            Column(f"kpss{d}", f"KPSS, {name}", "stat"),
            Column(f"kpss{d}_p", f"KPSS, {name}, p", "p"),
            Column(f"kpss{d}_sig", f"KPSS, {name}, sig."),
        ]
    columns += [Column("agreement", "Cross-check"), Column("problem", "Problem")]

    rule = lag_rule_label(run.settings)
    rows = []
    for finding in run.findings:
        result = finding.result
        first, last = result.span or ("", "")
        row: list[Value] = [
            *_source_cells(finding),
            finding.frequency or "",
            first,
            last,
            result.nobs if result.ok else None,
            result.verdict.label,
            result.verdict.order,
            deterministic_words(result),
        ]
        row += union_cells(result, union_diffs)
        steps = tau_steps(result)
        for k in range(n_steps):
            if k < len(steps):
                step = steps[k]
                row += [step_place(step), step.statistic, step.p_value,
                        marker(step.test) if step.test is not None else ""]
            else:
                row += ["", None, None, ""]
        deciding = steps[-1].test if steps else None
        row += [deciding.lags if deciding is not None else None, rule if result.ok else "",
                result.max_lags]
        kpss = kpss_tests(result)
        for d in kpss_diffs:
            test = kpss.get(d)
            row += ([test.statistic, p_text(test), marker(test)] if test is not None
                    else [None, None, ""])
        row += [AGREEMENT_WORDS.get(result.verdict.agreement or "", ""), result.error or ""]
        rows.append(tuple(row))
    return Table(tuple(columns), tuple(rows))


def compact_table(run: RunRecord) -> Table:
    """The short summary: verdict, the numbers that decided on each difference (the union's M
    under a size-controlled strategy; otherwise the classic path's deciding τ, with markers),
    KPSS, agreement, and the reason a series could not be tested when any could not.  The
    classic τ under a size-controlled strategy stays in each series' decision path."""
    union_diffs = union_differences(f.result for f in run.findings)
    diffs = [] if union_diffs else sorted(
        {d for f in run.findings for d in range(3) if deciding_tau(f.result, d)})
    columns = [Column("series", "Series"), Column("verdict", "Verdict"),
               Column("nobs", "Obs.", "int"), Column("span", "Span"),
               *union_columns(union_diffs)]
    for d in diffs:
        columns += [Column(f"tau{d}", f"τ, {DIFFERENCE_SHORT[d]}", "stat"),
                    Column(f"tau{d}_sig", "", "text"),
                    Column(f"tau{d}_spec", f"Terms, lags ({DIFFERENCE_SHORT[d]})")]
    columns += [Column("kpss", "KPSS"), Column("agreement", "Cross-check")]
    problems = any(f.result.error for f in run.findings)
    if problems:  # why a series could not be tested, only when one could not
        columns.append(Column("error", "Problem"))
    rows = []
    for finding in run.findings:
        result = finding.result
        span = f"{result.span[0]} – {result.span[1]}" if result.span else ""
        row: list[Value] = [finding.name, result.verdict.label,
                            result.nobs if result.ok else None, span,
                            *union_cells(result, union_diffs)]
        for d in diffs:
            test = deciding_tau(result, d)
            if test is None:
                row += [None, "", ""]
            else:
                row += [test.statistic, tau_marker(result, d), f"{SPEC_CODES[test.spec]}, {test.lags}"]
        kpss = "; ".join(
            f"{fmt.stat(t.statistic, 3)}{marker(t)} ({DIFFERENCE_SHORT[t.difference]})"
            for t in kpss_tests(result).values()
        )
        row += [kpss, AGREEMENT_WORDS.get(result.verdict.agreement or "", "")]
        if problems:
            row.append(result.error or "")
        rows.append(tuple(row))
    return Table(tuple(columns), tuple(rows))


TEST_COLUMNS = (
    Column("series", "Series"),
    Column("file", "File"),
    Column("sheet", "Sheet"),
    Column("column", "Column"),
    Column("key", "Series key"),
    Column("test", "Test"),
    Column("spec", "Regression"),
    Column("difference", "Difference", "int"),
    Column("statistic", "Statistic", "stat"),
    Column("p_value", "p-value", "p"),
    Column("p_value_bound", "p-value bound"),
    Column("lags", "Lags", "int"),
    Column("lag_rule", "Lag rule"),
    Column("nobs", "Observations", "int"),
    Column("cv_1", "Critical value 1%", "stat"),
    Column("cv_5", "Critical value 5%", "stat"),
    Column("cv_10", "Critical value 10%", "stat"),
    Column("critical_value", "Critical value used", "stat"),
    Column("alpha", "Level", "p"),
    Column("decision", "Decision"),
    Column("marker", "Sig."),
    Column("in_path", "In decision path"),
    Column("error", "Problem"),
)


def tests_table(run: RunRecord) -> Table:
    """Every test of every series, one per row (engine codes in ``test`` and ``spec``).

    A series that could not be tested gets one row with its problem and no test; so does
    a finding left out of the run because it was made with other settings.
    """
    rows = []
    for finding in run.findings:
        result = finding.result
        origin = (*_source_cells(finding), finding.key or "")
        if not result.ok:
            rows.append((*origin, *([None] * (len(TEST_COLUMNS) - 6)), result.error))
            continue
        in_path = {id(s.test) for s in result.steps if s.test is not None}
        for test in result.tests:
            cv = test.critical_values
            rows.append((
                *origin,
                test.test,
                test.spec,
                test.difference,
                test.statistic,
                test.p_value,
                test.p_value_bound or "",
                test.lags,
                test.lag_rule,
                test.nobs,
                cv.get("1%"),
                cv.get("5%"),
                cv.get("10%"),
                test.critical_value,
                run.settings.alpha,
                "reject" if test.reject else "do not reject",
                marker(test),
                "yes" if id(test) in in_path else "no",
                "",
            ))
    for left in run.left_out:  # made with other settings: named, with why, never as numbers
        rows.append((left.name, "", "", "", left.key or "",
                     *([None] * (len(TEST_COLUMNS) - 6)), left.reason))
    return Table(TEST_COLUMNS, tuple(rows))


PATH_COLUMNS = (
    Column("step", "Step", "int"),
    Column("on", "On"),
    Column("regression", "Regression"),
    Column("hypothesis", "Null hypothesis"),
    Column("symbol", "Statistic"),
    Column("value", "Value", "stat"),
    Column("critical", "Critical value", "stat"),
    Column("p_value", "p-value", "p"),
    Column("decision", "Decision"),
)


def path_table(result: SeriesResult) -> Table:
    rows = tuple(
        (k, where(s.difference), SPEC_LABELS.get(s.spec, UNION_SPEC_WORDS), s.hypothesis,
         STATISTIC_SYMBOLS.get(s.statistic_name, s.statistic_name), s.statistic,
         s.critical_value, s.p_value, s.decision)
        for k, s in enumerate(result.steps, start=1)
    )
    return Table(PATH_COLUMNS, rows)
