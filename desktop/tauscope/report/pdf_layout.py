"""The PDF report laid out: what the HTML report says, in the same order (title, run, summary
table, one section per series with its decision path, chart and reading, methods,
references), as one long column (:class:`~tauscope.report.pdf_flow.Flow`) that either PDF
route cuts into pages and draws: the report's own writer (:mod:`tauscope.report.pdf_direct`)
or Qt's (``tauscope.ui.pdf_report``).
"""

from __future__ import annotations

from collections.abc import Callable

from tauscope.report.methods import left_out_note, methods_for
from tauscope.report.pdf_flow import Column, Face, Flow, Style
from tauscope.report.report_text import (
    CHART_WIDTH,
    ONE_LINE_EACH,
    PATH_WIDTHS,
    SUMMARY_WIDTHS,
    cell_text,
    merged_markers,
    meta_line,
    origin_line,
    sources_line,
    summary_note,
)
from tauscope.report.run import Charts, RunRecord, chart_for
from tauscope.report.tables import Table, Value, compact_table, path_table
from tauscope.report.text_safety import pdf_text

FaceMaker = Callable[..., Face]
"""Makes a face: ``font(points, bold=False, italic=False)``."""


class _Styles:
    """The report's type, as in the HTML report's style sheet (sizes in points)."""

    def __init__(self, font: FaceMaker) -> None:
        teal = "#2f5d62"
        self.h1 = Style(font(18, bold=True), teal)
        self.h2 = Style(font(14, bold=True), teal)
        self.h3 = Style(font(12, bold=True))
        self.h4 = Style(font(10.5, bold=True))
        self.body = Style(font(10.5))
        self.meta = Style(font(10.5), "#55606a")
        self.left_out = Style(font(10.5, bold=True), "#8a3b12")
        self.note = Style(font(9, italic=True), "#55606a")
        self.verdict = Style(font(11.5, bold=True), teal)
        self.cell = Style(font(9.5), line_height=1.2)
        self.head = Style(font(9, bold=True), "#ffffff", line_height=1.2)


def _text(table: Table, index: int, value: Value) -> str:
    column = table.columns[index]
    text = pdf_text(cell_text(value, column.kind))
    if column.ident in ONE_LINE_EACH:  # one item a line, never broken inside
        return "\n".join(item.replace(" ", "\u00a0") for item in text.split("; "))
    return text


def _table(flow: Flow, styles: _Styles, table: Table, widths: dict[str, int],
           note_column: str | None = None) -> None:
    """The table as the HTML report shows it: ``widths`` in percent by column, the others
    sharing what is left; ``note_column`` shown only where it has text, across the
    statistics of its row."""
    note = next((i for i, c in enumerate(table.columns) if c.ident == note_column), None)
    shown = [i for i in range(len(table.columns)) if i != note]
    fixed = sum(widths.get(table.columns[i].ident, 0) for i in shown)
    free = [i for i in shown if table.columns[i].ident not in widths]
    rest = max(100 - fixed, 0) / len(free) if free else 0.0
    columns: list[Column] = [
        Column(table.columns[i].header, widths.get(table.columns[i].ident, rest) / 100,
               table.columns[i].kind in ("stat", "p", "int"))
        for i in shown]
    first_stat = next((k for k, i in enumerate(shown)
                       if table.columns[i].kind in ("stat", "p")), len(shown))
    rows = []
    for row in table.rows:
        if note is not None and row[note]:
            cells = [(_text(table, i, row[i]), 1) for i in shown[:first_stat]]
            cells.append((pdf_text(str(row[note])), len(shown) - first_stat))
        else:
            cells = [(_text(table, i, row[i]), 1) for i in shown]
        rows.append(cells)
    flow.table(columns, rows, styles.head, styles.cell, fill="#2f5d62", line="#d5dfe0")


def layout_report(run: RunRecord, charts: Charts | None, font: FaceMaker) -> Flow:
    """The whole report laid out in one long column, in the faces ``font`` makes."""
    styles = _Styles(font)
    flow = Flow()
    flow.paragraph("Order of integration: findings", styles.h1, after=4)
    flow.paragraph(meta_line(run), styles.meta, after=2)
    sources = sources_line(run)
    if sources:
        flow.paragraph(f"Data: {sources}", styles.meta, after=2)
    left = left_out_note(run)
    if left is not None:
        flow.paragraph(left, styles.left_out)
    _heading2(flow, styles, "Summary")
    _table(flow, styles, merged_markers(compact_table(run)), SUMMARY_WIDTHS, note_column="error")
    flow.paragraph(summary_note(run), styles.note)
    _heading2(flow, styles, "Series")
    for number, finding in enumerate(run.findings, start=1):
        result = finding.result
        flow.paragraph(f"{number}. {finding.name}", styles.h3, before=14, after=2, heading=True)
        flow.paragraph(origin_line(finding), styles.meta, after=2)
        flow.paragraph(result.verdict.label, styles.verdict, after=4)
        if not result.ok:
            flow.paragraph(result.error or "", styles.body)
            continue
        flow.paragraph("Decision path", styles.h4, before=4, after=2, heading=True)
        _table(flow, styles, path_table(result), PATH_WIDTHS)
        plan = chart_for(finding, charts)
        if plan is not None:
            flow.paragraph("Chart", styles.h4, before=4, after=2, heading=True)
            flow.drawing(plan, CHART_WIDTH)
        flow.paragraph("Reading", styles.h4, before=4, after=2, heading=True)
        for note in result.notes:
            flow.paragraph(note, styles.body)
    methods = methods_for(run)
    _heading2(flow, styles, "Methods")
    for paragraph in methods.paragraphs:
        flow.paragraph(paragraph, styles.body)
    flow.paragraph("References", styles.h3, before=10, after=4, heading=True)
    for number, reference in enumerate(methods.references, start=1):
        flow.paragraph(f"{number}. {reference}", styles.body, indent=12, after=3)
    return flow


def _heading2(flow: Flow, styles: _Styles, text: str) -> None:
    flow.paragraph(text, styles.h2, before=18, after=8, heading=True, rule="#9fb8ba")
