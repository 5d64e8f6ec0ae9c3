"""Excel findings (openpyxl): summary, every test, decision paths, about this run, charts.

Sheets:
* "Summary": one row per series (``tables.summary_table``), styled frozen
  header, number formats, widths, and a note row for significance markers;
* "All tests": every computed test in long form (``tables.tests_table``);
* "Decision path": each series' steps in order;
* "About this run": program, version, date, settings, methods paragraph,
  and each source file with its SHA-256;
* "Charts": the PNG charts the caller supplied, one block per series.

Every text cell goes through :func:`put`, which keeps text that looks like a
formula as a plain string (formula-injection guard).
"""

from __future__ import annotations

import io
import struct
from pathlib import Path

from openpyxl import Workbook
from openpyxl.cell.cell import Cell
from openpyxl.drawing.image import Image
from openpyxl.styles import Alignment, Border, Font, PatternFill, Side
from openpyxl.utils import get_column_letter
from openpyxl.worksheet.worksheet import Worksheet

from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.methods import critical_words, left_out_note, methods_for, tests_words
from tauscope.report.run import Charts, RunRecord, chart_for
from tauscope.report.safety import looks_like_formula
from tauscope.report.tables import (
    MARKER_NOTE,
    Table,
    Value,
    lag_rule_label,
    path_table,
    summary_table,
    tests_table,
)
from tauscope.report.text_safety import xml_text

NUMBER_FORMATS = {"stat": "0.000", "p": "0.000", "int": "0"}
HEADER_FONT = Font(bold=True, color="FFFFFF")
HEADER_FILL = PatternFill("solid", fgColor="2F5D62")
NOTE_FONT = Font(italic=True, color="555555")
HEADER_BORDER = Border(bottom=Side(style="thin", color="1F3D40"))
MAX_WIDTH = 60


def put(cell: Cell, value: Value) -> None:
    """Write ``value``; text that a spreadsheet could read as a formula stays a string, and
    characters XML cannot hold become U+FFFD (:mod:`.text_safety`)."""
    if isinstance(value, str):
        value = xml_text(value)
    cell.value = value
    if isinstance(value, str) and looks_like_formula(value):
        cell.data_type = "s"
        cell.quotePrefix = True


class _PngImage(Image):
    """An openpyxl image made from PNG bytes without the imaging library.

    The pixel size is read from the PNG header (IHDR: width and height as
    big-endian 32-bit integers at bytes 16-24).
    """

    def __init__(self, png: bytes) -> None:
        if png[:8] != b"\x89PNG\r\n\x1a\n" or len(png) < 24:
            raise ValueError("chart image is not a PNG")
        self.ref = io.BytesIO(png)
        self._png = png
        self.width, self.height = struct.unpack(">II", png[16:24])
        self.format = "png"

    def _data(self) -> bytes:
        return self._png


def _write_table(sheet: Worksheet, table: Table, first_row: int = 1) -> None:
    for j, column in enumerate(table.columns, start=1):
        cell = sheet.cell(row=first_row, column=j)
        put(cell, column.header)
        cell.font = HEADER_FONT
        cell.fill = HEADER_FILL
        cell.border = HEADER_BORDER
        cell.alignment = Alignment(vertical="center", wrap_text=True)
    for i, row in enumerate(table.rows, start=first_row + 1):
        for j, (column, value) in enumerate(zip(table.columns, row, strict=True), start=1):
            cell = sheet.cell(row=i, column=j)
            put(cell, value)
            if isinstance(value, (int, float)) and column.kind in NUMBER_FORMATS:
                cell.number_format = NUMBER_FORMATS[column.kind]
    sheet.freeze_panes = sheet.cell(row=first_row + 1, column=2)
    if table.rows:
        last = get_column_letter(len(table.columns))
        sheet.auto_filter.ref = f"A{first_row}:{last}{first_row + len(table.rows)}"
    _fit_widths(sheet, table)


def _fit_widths(sheet: Worksheet, table: Table) -> None:
    for j, column in enumerate(table.columns, start=1):
        lengths = [len(column.header) * 0.9 + 2]
        for row in table.rows:
            value = row[j - 1]
            if isinstance(value, float):
                lengths.append(8)
            elif value is not None:
                lengths.append(len(str(value)) + 2)
        sheet.column_dimensions[get_column_letter(j)].width = min(MAX_WIDTH, max(8, *lengths))


def _summary(sheet: Worksheet, run: RunRecord) -> None:
    table = summary_table(run)
    _write_table(sheet, table)
    note = sheet.cell(row=len(table.rows) + 3, column=1)
    put(note, MARKER_NOTE)
    note.font = NOTE_FONT
    left = left_out_note(run)
    if left is not None:
        cell = sheet.cell(row=len(table.rows) + 4, column=1)
        put(cell, left)
        cell.font = Font(bold=True, color="8A3B12")
    sheet.row_dimensions[1].height = 32


def _all_tests(sheet: Worksheet, run: RunRecord) -> None:
    _write_table(sheet, tests_table(run))


def _paths(sheet: Worksheet, run: RunRecord) -> None:
    row = 1
    for finding in run.findings:
        result = finding.result
        title = sheet.cell(row=row, column=1)
        put(title, f"{finding.name}: {result.verdict.label}")
        title.font = Font(bold=True, size=12)
        row += 1
        if not result.ok:
            put(sheet.cell(row=row, column=1), result.error)
            row += 2
            continue
        table = path_table(result)
        for j, column in enumerate(table.columns, start=1):
            cell = sheet.cell(row=row, column=j)
            put(cell, column.header)
            cell.font = Font(bold=True)
            cell.border = HEADER_BORDER
        for values in table.rows:
            row += 1
            for j, (column, value) in enumerate(zip(table.columns, values, strict=True), start=1):
                cell = sheet.cell(row=row, column=j)
                put(cell, value)
                if isinstance(value, (int, float)) and column.kind in NUMBER_FORMATS:
                    cell.number_format = NUMBER_FORMATS[column.kind]
        row += 1
        put(sheet.cell(row=row, column=1), result.verdict.text)
        row += 2
    for letter, width in zip("ABCDEFGHI", (6, 18, 22, 48, 10, 10, 14, 10, 14), strict=True):
        sheet.column_dimensions[letter].width = width


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


def _about(sheet: Worksheet, run: RunRecord) -> None:
    rows = about_rows(run)
    for i, (label, value) in enumerate(rows, start=1):
        put(sheet.cell(row=i, column=1), label)
        sheet.cell(row=i, column=1).font = Font(bold=True)
        put(sheet.cell(row=i, column=2), value)
    row = len(rows) + 2
    put(sheet.cell(row=row, column=1), "Source file")
    put(sheet.cell(row=row, column=2), "SHA-256")
    for j in (1, 2):
        sheet.cell(row=row, column=j).font = Font(bold=True)
        sheet.cell(row=row, column=j).border = HEADER_BORDER
    for source in run.sources:
        row += 1
        put(sheet.cell(row=row, column=1), source.name)
        put(sheet.cell(row=row, column=2), source.sha256)
        put(sheet.cell(row=row, column=3), source.path)
    row += 2
    put(sheet.cell(row=row, column=1), "Methods")
    sheet.cell(row=row, column=1).font = Font(bold=True)
    methods = methods_for(run)
    for paragraph in (*methods.paragraphs, "References:", *methods.references):
        row += 1
        cell = sheet.cell(row=row, column=2)
        put(cell, paragraph)
        cell.alignment = Alignment(wrap_text=True, vertical="top")
    sheet.column_dimensions["A"].width = 28
    sheet.column_dimensions["B"].width = 100
    sheet.column_dimensions["C"].width = 60


def _charts(sheet: Worksheet, run: RunRecord, charts: Charts) -> None:
    row = 1
    for finding in run.findings:
        png = chart_for(finding, charts)
        if png is None:
            continue
        title = sheet.cell(row=row, column=1)
        put(title, finding.name)
        title.font = Font(bold=True, size=12)
        image = _PngImage(png)
        if image.width > 900:
            scale = 900 / image.width
            image.width, image.height = 900, int(image.height * scale)
        sheet.add_image(image, f"A{row + 1}")
        row += 2 + int(image.height / 20) + 1


def run_to_xlsx(run: RunRecord, charts: Charts | None = None) -> bytes:
    book = Workbook()
    summary = book.active
    assert summary is not None
    summary.title = "Summary"
    _summary(summary, run)
    _all_tests(book.create_sheet("All tests"), run)
    _paths(book.create_sheet("Decision path"), run)
    _about(book.create_sheet("About this run"), run)
    if charts and any(chart_for(f, charts) is not None for f in run.findings):
        _charts(book.create_sheet("Charts"), run, charts)
    buffer = io.BytesIO()
    book.save(buffer)
    return buffer.getvalue()


def write_xlsx(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_xlsx(run, charts))
