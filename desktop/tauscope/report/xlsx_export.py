"""Excel findings (openpyxl): summary, every test, decision paths, about this run, charts.

Sheets:
* "Summary": one row per series (``tables.summary_table``), styled frozen
  header, number formats, widths, and a note row for significance markers;
* "All tests": every computed test in long form (``tables.tests_table``);
* "Decision path": each series' steps in order;
* "About this run": program, version, date, settings, methods paragraph,
  and each source file with its SHA-256;
* "Charts": each series' chart the caller supplied, drawn as a PNG picture by the painter
  the Qt layer registers (``report.chart_plan.register_png_painter``), one block per series.

Every text cell goes through :func:`put`, which keeps text that looks like a
formula as a plain string (formula-injection guard).
"""

from __future__ import annotations

import io
import struct
from pathlib import Path
from typing import TypeAlias
from zipfile import ZIP_DEFLATED, ZIP_STORED, ZipFile

from openpyxl import Workbook
from openpyxl.cell.cell import Cell, WriteOnlyCell
from openpyxl.drawing.image import Image
from openpyxl.styles import Alignment, Border, Font, PatternFill, Side
from openpyxl.utils import get_column_letter
from openpyxl.worksheet._write_only import WriteOnlyWorksheet
from openpyxl.writer.excel import ExcelWriter

from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.chart_plan import plan_png
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


Entry: TypeAlias = Value | Cell
"""What a row appended to a write-only sheet holds: a plain value, or a cell with a style."""


def entry(sheet: WriteOnlyWorksheet, value: Value, number_format: str | None = None) -> Entry:
    """``value`` ready to append: as it is when openpyxl may take it plain (a number, or text
    that cannot be read as a formula), else as a cell made by :func:`put`."""
    if isinstance(value, str):
        value = xml_text(value)
        if not looks_like_formula(value):
            return value
    elif number_format is None or not isinstance(value, (int, float)):
        return value
    cell = WriteOnlyCell(sheet)
    put(cell, value)
    if number_format is not None:
        cell.number_format = number_format
    return cell


def styled(sheet: WriteOnlyWorksheet, value: Value, font: Font | None = None,
           border: Border | None = None, fill: PatternFill | None = None,
           alignment: Alignment | None = None) -> Cell:
    cell = WriteOnlyCell(sheet)
    put(cell, value)
    if font is not None:
        cell.font = font
    if border is not None:
        cell.border = border
    if fill is not None:
        cell.fill = fill
    if alignment is not None:
        cell.alignment = alignment
    return cell


class Rows:
    """A write-only sheet and the number of rows appended to it so far."""

    def __init__(self, sheet: WriteOnlyWorksheet) -> None:
        self.sheet = sheet
        self.written = 0

    def add(self, cells: list[Entry]) -> None:
        self.sheet.append(cells)
        self.written += 1

    def skip_to(self, row: int) -> None:
        """Append empty rows until the next row appended is ``row`` (1-based)."""
        while self.written < row - 1:
            self.add([])


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


def _header_cells(sheet: WriteOnlyWorksheet, table: Table) -> list[Entry]:
    header = Alignment(vertical="center", wrap_text=True)
    return [styled(sheet, c.header, HEADER_FONT, HEADER_BORDER, HEADER_FILL, header)
            for c in table.columns]


def _body_cells(sheet: WriteOnlyWorksheet, table: Table, values: tuple[Value, ...]) -> list[Entry]:
    return [entry(sheet, value, NUMBER_FORMATS.get(column.kind))
            for column, value in zip(table.columns, values, strict=True)]


def _write_table(rows: Rows, table: Table) -> None:
    """The table from the sheet's first row: styled header, frozen below it and right of the
    first column, a filter over the table, numbers formatted by kind, widths to fit."""
    sheet = rows.sheet
    sheet.freeze_panes = "B2"
    if table.rows:
        sheet.auto_filter.ref = f"A1:{get_column_letter(len(table.columns))}{1 + len(table.rows)}"
    _fit_widths(sheet, table)
    rows.add(_header_cells(sheet, table))
    for values in table.rows:
        rows.add(_body_cells(sheet, table, values))


def _fit_widths(sheet: WriteOnlyWorksheet, table: Table) -> None:
    for j, column in enumerate(table.columns, start=1):
        lengths = [len(column.header) * 0.9 + 2]
        for row in table.rows:
            value = row[j - 1]
            if isinstance(value, float):
                lengths.append(8)
            elif value is not None:
                lengths.append(len(str(value)) + 2)
        sheet.column_dimensions[get_column_letter(j)].width = min(MAX_WIDTH, max(8, *lengths))


def _summary(rows: Rows, run: RunRecord) -> None:
    table = summary_table(run)
    rows.sheet.row_dimensions[1].height = 32
    _write_table(rows, table)
    rows.skip_to(len(table.rows) + 3)
    rows.add([styled(rows.sheet, MARKER_NOTE, NOTE_FONT)])
    left = left_out_note(run)
    if left is not None:
        rows.add([styled(rows.sheet, left, Font(bold=True, color="8A3B12"))])


def _all_tests(rows: Rows, run: RunRecord) -> None:
    _write_table(rows, tests_table(run))


def _paths(rows: Rows, run: RunRecord) -> None:
    sheet = rows.sheet
    for letter, width in zip("ABCDEFGHI", (6, 18, 22, 48, 10, 10, 14, 10, 14), strict=True):
        sheet.column_dimensions[letter].width = width
    title_font, bold = Font(bold=True, size=12), Font(bold=True)
    for finding in run.findings:
        result = finding.result
        rows.add([styled(sheet, f"{finding.name}: {result.verdict.label}", title_font)])
        if not result.ok:
            rows.add([entry(sheet, result.error)])
            rows.add([])
            continue
        table = path_table(result)
        rows.add([styled(sheet, c.header, bold, HEADER_BORDER) for c in table.columns])
        for values in table.rows:
            rows.add(_body_cells(sheet, table, values))
        rows.add([entry(sheet, result.verdict.text)])
        rows.add([])


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


def _about(rows: Rows, run: RunRecord) -> None:
    sheet = rows.sheet
    sheet.column_dimensions["A"].width = 28
    sheet.column_dimensions["B"].width = 100
    sheet.column_dimensions["C"].width = 60
    bold = Font(bold=True)
    for label, value in about_rows(run):
        rows.add([styled(sheet, label, bold), entry(sheet, value)])
    rows.add([])
    rows.add([styled(sheet, "Source file", bold, HEADER_BORDER),
              styled(sheet, "SHA-256", bold, HEADER_BORDER)])
    for source in run.sources:
        rows.add([entry(sheet, source.name), entry(sheet, source.sha256),
                  entry(sheet, source.path)])
    rows.add([])
    rows.add([styled(sheet, "Methods", bold)])
    methods = methods_for(run)
    wrap = Alignment(wrap_text=True, vertical="top")
    for paragraph in (*methods.paragraphs, "References:", *methods.references):
        rows.add([None, styled(sheet, paragraph, alignment=wrap)])


def _charts(rows: Rows, pictures: list[tuple[str, bytes]]) -> None:
    row = 1
    for name, png in pictures:
        rows.skip_to(row)
        rows.add([styled(rows.sheet, name, Font(bold=True, size=12))])
        image = _PngImage(png)
        if image.width > 900:
            scale = 900 / image.width
            image.width, image.height = 900, int(image.height * scale)
        rows.sheet.add_image(image, f"A{row + 1}")
        row += 2 + int(image.height / 20) + 1


def _pictures(run: RunRecord, charts: Charts | None) -> list[tuple[str, bytes]]:
    """(series name, PNG) for each finding with a chart, drawn by the registered painter
    (``tauscope.ui.chart_paint``); none without one."""
    out = []
    for finding in run.findings:
        plan = chart_for(finding, charts)
        png = plan_png(plan) if plan is not None else None
        if png is not None:
            out.append((finding.name, png))
    return out


def run_to_xlsx(run: RunRecord, charts: Charts | None = None) -> bytes:
    """The workbook, written in openpyxl's write-only mode: each sheet is streamed row by row
    (settings that go before the rows, such as widths and frozen panes, are made first), so
    the cells never sit in memory as a whole workbook of objects."""
    book = Workbook(write_only=True)
    _summary(Rows(book.create_sheet("Summary")), run)
    _all_tests(Rows(book.create_sheet("All tests")), run)
    _paths(Rows(book.create_sheet("Decision path")), run)
    _about(Rows(book.create_sheet("About this run")), run)
    pictures = _pictures(run, charts)
    if pictures:
        _charts(Rows(book.create_sheet("Charts")), pictures)
    buffer = io.BytesIO()
    with ZipFile(buffer, "w", ZIP_DEFLATED, allowZip64=True) as archive:
        _StoredPictures(book, archive).save()
    return buffer.getvalue()


class _StoredPictures(ExcelWriter):
    """openpyxl's writer (what ``Workbook.save`` runs), with the charts' PNG files stored in
    the package as they are: PNG data is compressed already, and deflating it a second time
    took about half of the workbook's time for the gain of a few per cent."""

    def _write_images(self) -> None:
        for image in self._images:
            self._archive.writestr(image.path[1:], image._data(), compress_type=ZIP_STORED)


def write_xlsx(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_xlsx(run, charts))
