"""What the web page and the PDF say alike: a cell's text by its kind, the summary's markers
glued to their statistics, a finding's origin line, the report's lines on the run, and the
tables' shared widths (in characters) and one-line columns.  The words only: each format
escapes and lays them out itself (:mod:`.html_export`, :mod:`.pdf_layout`)."""

from __future__ import annotations

from tauscope.engine import formatting as fmt
from tauscope.report.deciding import CLASSIC_IN_PATH, union_note
from tauscope.report.methods import critical_words, tests_words
from tauscope.report.run import Finding, RunRecord
from tauscope.report.tables import (
    MARKER_NOTE,
    NORMAL_NOTE,
    Table,
    Value,
    lag_rule_label,
    normal_step,
)

CHART_WIDTH = 620
PATH_WIDTHS = {"step": 6, "on": 11, "regression": 12, "hypothesis": 24, "symbol": 9, "value": 9,
               "critical": 9, "p_value": 9, "decision": 11}
SUMMARY_WIDTHS = {"series": 13, "verdict": 14, "nobs": 6, "span": 11, "kpss": 14,
                  "agreement": 11}
ONE_LINE_EACH = {"kpss"}
"""Columns whose "; "-separated items each get a line of their own that never wraps
(a KPSS value with the difference it was computed on)."""


def cell_text(value: Value, kind: str) -> str:
    if value is None:
        return ""
    if isinstance(value, str):
        return value
    if kind == "stat":
        return fmt.stat(float(value), 3)
    if kind == "p":
        return fmt.p_value(float(value))
    return str(value)


def merged_markers(table: Table) -> Table:
    """Glue each "…_sig" and "…_spec" column onto the statistic before it: −3.51** (ct, 2)."""
    glued = ("_sig", "_spec")
    keep = [i for i, c in enumerate(table.columns) if not c.ident.endswith(glued)]
    columns = tuple(table.columns[i] for i in keep)
    rows = []
    for row in table.rows:
        out: list[Value] = []
        for i in keep:
            value = row[i]
            column = table.columns[i]
            if value is None or column.kind not in ("stat", "p"):
                out.append(value)
                continue
            text = cell_text(value, column.kind)
            for j in range(i + 1, len(row)):
                ident = table.columns[j].ident
                if not ident.endswith(glued):
                    break
                if ident.endswith("_sig"):
                    text += str(row[j] or "")
                elif row[j]:
                    text += " (" + str(row[j]).replace(" ", "\u00a0") + ")"  # wraps as one
            out.append(text)
        rows.append(tuple(out))
    return Table(columns, tuple(rows))


def summary_note(run: RunRecord) -> str:
    """The note under the summary: markers, terms, and † when a τ in the summary was judged
    against the standard normal."""
    note = (f"{MARKER_NOTE} Terms: ct constant and trend, c constant, n none; then the lag "
            "order.")
    if any(normal_step(f.result, d) is not None for f in run.findings for d in range(3)):
        note += " " + NORMAL_NOTE
    union = union_note((f.result for f in run.findings), CLASSIC_IN_PATH)
    return f"{note} {union}" if union else note


def meta_line(run: RunRecord) -> str:
    """Version, date, series, level, lag rule, critical values and tests, in one line."""
    settings = run.settings
    return (f"Tauscope {run.version} · {run.created} · {len(run.findings)} series · "
            f"significance level {fmt.percent(settings.alpha)} · lag rule: "
            f"{lag_rule_label(settings)} · critical values: {critical_words(run)} · "
            f"tests that ran: {tests_words(run)}")


def sources_line(run: RunRecord) -> str:
    return "; ".join(f"{s.name} (SHA-256 {s.sha256[:16]}…)" for s in run.sources)


def origin_line(finding: Finding) -> str:
    result = finding.result
    parts = []
    if finding.file:
        where = finding.file_name
        if finding.sheet:
            where += f", sheet “{finding.sheet}”"
        if finding.column and finding.column != finding.name:
            where += f", column “{finding.column}”"
        parts.append(where)
    if finding.frequency:
        parts.append(finding.frequency)
    if result.span:
        parts.append(f"{result.span[0]} to {result.span[1]}")
    if result.ok:
        parts.append(f"{result.nobs} observations")
    return " · ".join(parts)
