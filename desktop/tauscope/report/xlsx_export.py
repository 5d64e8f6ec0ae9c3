"""Excel findings: summary, every test, decision paths, about this run, charts.

Sheets:
* "Summary": one row per series (``tables.summary_table``), styled frozen
  header, number formats, widths, and a note row for significance markers;
* "All tests": every computed test in long form (``tables.tests_table``);
* "Decision path": each series' steps in order;
* "About this run": program, version, date, settings, methods paragraph,
  and each source file with its SHA-256;
* "Charts": each series' chart the caller supplied, drawn as vector shapes (lines and text
  boxes, :mod:`.xlsx_chart`), one block per series under its name.

The package is written by :mod:`.xlsx_package` (SpreadsheetML, ECMA-376), row by row as
text: several times faster than building the cells as objects.  Every text cell is made
safe for XML, and text that looks like a formula is stored as text, never as a formula
(formula-injection guard, :mod:`.safety`).
"""

from __future__ import annotations

from pathlib import Path

from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.chart_plan import ChartPlan
from tauscope.report.deciding import union_note
from tauscope.report.methods import critical_words, left_out_note, methods_for, tests_words
from tauscope.report.run import Charts, RunRecord, chart_for
from tauscope.report.tables import (
    MARKER_NOTE,
    Table,
    Value,
    lag_rule_label,
    path_table,
    summary_table,
    tests_table,
)
from tauscope.report.xlsx_chart import chart_shapes
from tauscope.report.xlsx_package import Book, Font, Format, Sheet, column_letter

NUMBER_FORMATS = {"stat": "0.000", "p": "0.000", "int": "0"}
HEADER = Format(Font(bold=True, color="FFFFFF"), fill="2F5D62", bottom_border="1F3D40",
                vertical="center", wrap=True)
NOTE = Format(Font(italic=True, color="555555"))
LEFT_OUT = Format(Font(bold=True, color="8A3B12"))
TITLE = Format(Font(bold=True, size=12))
BOLD = Format(Font(bold=True))
BOLD_RULED = Format(Font(bold=True), bottom_border="1F3D40")
WRAPPED = Format(vertical="top", wrap=True)
MAX_WIDTH = 60


def _styled(sheet: Sheet, cells: list[tuple[Value, Format | None]]) -> None:
    """A row of cells, each with its format (None: plain)."""
    styles = sheet.book.styles
    sheet.add([v for v, _f in cells], [styles.xf(f) if f is not None else 0 for _v, f in cells])


def _body_styles(sheet: Sheet, table: Table) -> list[int]:
    """Each column's format for numbers (its kind's number format; 0 for text columns)."""
    styles = sheet.book.styles
    return [styles.xf(Format(number_format=NUMBER_FORMATS[c.kind])) if c.kind in NUMBER_FORMATS
            else 0 for c in table.columns]


def _body(sheet: Sheet, table: Table, numbers: list[int], values: tuple[Value, ...]) -> None:
    """A table row: numbers in their column's number format, text plain."""
    sheet.add(values, [n if n and isinstance(v, (int, float)) else 0
                       for n, v in zip(numbers, values, strict=True)])


def _write_table(sheet: Sheet, table: Table) -> None:
    """The table from the sheet's first row: styled header, frozen below it and right of the
    first column, a filter over the table, numbers formatted by kind, widths to fit."""
    sheet.freeze = "B2"
    if table.rows:
        sheet.filter = f"A1:{column_letter(len(table.columns))}{1 + len(table.rows)}"
    _fit_widths(sheet, table)
    _styled(sheet, [(c.header, HEADER) for c in table.columns])
    numbers = _body_styles(sheet, table)
    for values in table.rows:
        _body(sheet, table, numbers, values)


def _fit_widths(sheet: Sheet, table: Table) -> None:
    """Each column as wide as its header (× 0.9) or its longest text or whole number, plus 2;
    8 at least (a decimal number's width), MAX_WIDTH at most.  Each distinct value once."""
    by_column = list(zip(*table.rows, strict=True)) if table.rows else [()] * len(table.columns)
    for j, (column, values) in enumerate(zip(table.columns, by_column, strict=True), start=1):
        widest = max(8.0, len(column.header) * 0.9 + 2)
        for text in {str(v) for v in values if v is not None and not isinstance(v, float)}:
            widest = max(widest, len(text) + 2)
        sheet.widths[j] = min(MAX_WIDTH, widest)


def _summary(sheet: Sheet, run: RunRecord) -> None:
    table = summary_table(run)
    sheet.heights[1] = 32
    _write_table(sheet, table)
    sheet.skip_to(len(table.rows) + 3)
    _styled(sheet, [(MARKER_NOTE, NOTE)])
    union = union_note(f.result for f in run.findings)
    if union:
        _styled(sheet, [(union, NOTE)])
    left = left_out_note(run)
    if left is not None:
        _styled(sheet, [(left, LEFT_OUT)])


def _all_tests(sheet: Sheet, run: RunRecord) -> None:
    _write_table(sheet, tests_table(run))


def _paths(sheet: Sheet, run: RunRecord) -> None:
    for j, width in enumerate((6, 18, 22, 48, 10, 10, 14, 10, 14), start=1):
        sheet.widths[j] = width
    numbers: list[int] | None = None
    for finding in run.findings:
        result = finding.result
        _styled(sheet, [(f"{finding.name}: {result.verdict.label}", TITLE)])
        if not result.ok:
            sheet.add([result.error])
            sheet.add([])
            continue
        table = path_table(result)
        _styled(sheet, [(c.header, BOLD_RULED) for c in table.columns])
        numbers = numbers or _body_styles(sheet, table)
        for values in table.rows:
            _body(sheet, table, numbers, values)
        sheet.add([result.verdict.text])
        sheet.add([])


def about_rows(run: RunRecord) -> list[tuple[str, Value]]:
    settings = run.settings
    rows: list[tuple[str, Value]] = [
        ("Program", "Tauscope"),
        ("Version", run.version),
        ("Created (UTC)", run.created),
        ("Significance level", settings.alpha),
        ("Lag rule", lag_rule_label(settings)),
        ("Maximum lag order", settings.max_lags if settings.max_lags is not None
         else "Schwert (1989) rule, floor(12 (T/100)^(1/4))"),
        ("Highest difference tested", settings.max_difference),
        ("Confirmation tests", ", ".join(t.upper() for t in settings.confirm) or "none"),
        ("Critical values", critical_words(run)),
        ("Tests that ran", tests_words(run)),
        ("Series", len(run.findings)),
    ]
    note = left_out_note(run)
    if note is not None:
        rows.append(("Left out", note))
    return rows


def _about(sheet: Sheet, run: RunRecord) -> None:
    sheet.widths.update({1: 28, 2: 100, 3: 60})
    for label, value in about_rows(run):
        _styled(sheet, [(label, BOLD), (value, None)])
    sheet.add([])
    _styled(sheet, [("Source file", BOLD_RULED), ("SHA-256", BOLD_RULED)])
    for source in run.sources:
        sheet.add([source.name, source.sha256, source.path])
    sheet.add([])
    _styled(sheet, [("Methods", BOLD)])
    methods = methods_for(run)
    for paragraph in (*methods.paragraphs, "References:", *methods.references):
        _styled(sheet, [(None, None), (paragraph, WRAPPED)])


def _charts(sheet: Sheet, plans: list[tuple[str, ChartPlan]]) -> None:
    """Each chart below its series' name, on rows of the default 20 pixels."""
    row = 1
    for name, plan in plans:
        sheet.skip_to(row)
        _styled(sheet, [(name, TITLE)])
        sheet.anchor(chart_shapes(plan, row, sheet.shape_ids))
        row += 2 + int(plan.height / 20) + 1


def _plans(run: RunRecord, charts: Charts | None) -> list[tuple[str, ChartPlan]]:
    """(series name, chart) for each finding with a chart, in the findings' order."""
    out = []
    for finding in run.findings:
        plan = chart_for(finding, charts)
        if plan is not None:
            out.append((finding.name, plan))
    return out


def run_to_xlsx(run: RunRecord, charts: Charts | None = None) -> bytes:
    """The workbook's bytes."""
    book = Book(f"Tauscope {run.version}")
    _summary(book.sheet("Summary"), run)
    _all_tests(book.sheet("All tests"), run)
    _paths(book.sheet("Decision path"), run)
    _about(book.sheet("About this run"), run)
    plans = _plans(run, charts)
    if plans:
        _charts(book.sheet("Charts"), plans)
    return book.package()


def write_xlsx(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_xlsx(run, charts))
