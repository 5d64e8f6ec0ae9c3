"""Excel findings read back with openpyxl: summary, every test, about this run, charts."""

from __future__ import annotations

import xml.etree.ElementTree as ElementTree
import zipfile
from pathlib import Path

import openpyxl
import pytest
from openpyxl.worksheet.worksheet import Worksheet

from tauscope import __version__
from tauscope.report import RunRecord, chart_plan, export
from tauscope.report.deciding import union_steps
from tauscope.report.table_types import DIFFERENCE_SHORT
from tauscope.report.tables import marker, tau_steps
from tauscope.report.xlsx_package import Book
from test_report_support import FORMULA_NAME, SOURCE_SHA, make_run

XDR = "{http://schemas.openxmlformats.org/drawingml/2006/spreadsheetDrawing}"


# openpyxl writes floats with 16 significant digits ("%.16g"), Excel keeps 15:
# the last binary digit may differ, nothing more.
def same(value: float | None) -> object:
    return None if value is None else pytest.approx(value, rel=1e-15, abs=0)


@pytest.fixture(scope="module")
def written(tmp_path_factory: pytest.TempPathFactory) -> tuple[RunRecord, Path]:
    run = make_run()
    target = tmp_path_factory.mktemp("xlsx") / "findings.xlsx"
    plan = chart_plan.plan_chart(run.findings[0].result)
    export(target, run, charts={run.findings[0].name: plan} if plan is not None else {})
    return run, target


def _header(sheet: Worksheet) -> list[str]:
    return [c.value for c in sheet[1]]


def test_summary_has_one_row_per_series_with_the_engine_numbers(
        written: tuple[RunRecord, Path]) -> None:
    run, target = written
    sheet = openpyxl.load_workbook(target)["Summary"]
    header = _header(sheet)
    col = {name: i for i, name in enumerate(header)}
    rows = list(sheet.iter_rows(min_row=2, max_row=1 + len(run.findings), values_only=True))
    assert len(rows) == len(run.findings)
    for row, finding in zip(rows, run.findings, strict=True):
        result = finding.result
        assert row[col["Series"]] == finding.name
        assert row[col["Sheet"]] == "Quarterly"
        assert row[col["Verdict"]] == result.verdict.label
        assert row[col["Order of integration"]] == result.verdict.order
        if not result.ok:
            assert row[col["Problem"]] == result.error
            assert row[col["Classic step 1 τ"]] is None
            continue
        assert row[col["Observations"]] == result.nobs
        assert (row[col["First"]], row[col["Last"]]) == result.span
        steps = tau_steps(result)
        for k, step in enumerate(steps, start=1):
            assert row[col[f"Classic step {k} τ"]] == same(step.statistic)
            assert row[col[f"Classic step {k} p"]] == same(step.p_value)
            assert step.test is not None
            assert row[col[f"Classic step {k} sig."]] == (marker(step.test) or None)
        assert steps[-1].test is not None
        assert row[col["Lags, classic deciding τ"]] == steps[-1].test.lags
        assert row[col["Max lags, levels"]] == result.max_lags
        # the numbers that decided under the size-controlled default: the union's M
        union = union_steps(result)
        assert union, "the default strategy decides with the union"
        for d, step in union.items():
            short = DIFFERENCE_SHORT[d]
            assert row[col[f"Union M, {short}"]] == same(step.statistic)
            sign = ">" if step.decision == "reject" else "≤"
            assert row[col[f"Union M decision, {short}"]] == f"{sign} {step.critical_value:.2f}"
        for test in (t for t in result.tests if t.test == "kpss"):
            name = {0: "levels", 1: "first difference", 2: "second difference"}[test.difference]
            assert row[col[f"KPSS, {name}"]] == same(test.statistic)


def test_summary_is_styled_frozen_and_has_the_marker_note(written: tuple[RunRecord, Path]) -> None:
    run, target = written
    sheet = openpyxl.load_workbook(target)["Summary"]
    assert sheet.freeze_panes == "B2"
    assert sheet["A1"].font.bold
    tau_col = _header(sheet).index("Classic step 1 τ") + 1
    assert sheet.cell(row=2, column=tau_col).number_format == "0.000"
    assert sheet.column_dimensions["A"].width >= len(FORMULA_NAME) * 0.9
    note = sheet.cell(row=len(run.findings) + 3, column=1).value
    assert "*** 1%" in note and "** 5%" in note and "* 10%" in note


def test_all_tests_sheet_is_the_long_form(written: tuple[RunRecord, Path]) -> None:
    run, target = written
    sheet = openpyxl.load_workbook(target)["All tests"]
    header = _header(sheet)
    rows = list(sheet.iter_rows(min_row=2, values_only=True))
    tested = [r for r in rows if r[header.index("Test")] is not None]
    expected = [t for f in run.findings for t in f.result.tests]
    assert len(tested) == len(expected)
    for row, test in zip(tested, expected, strict=True):
        assert row[header.index("Test")] == test.test
        assert row[header.index("Statistic")] == same(test.statistic)
        assert row[header.index("p-value")] == same(test.p_value)
        assert row[header.index("Critical value 1%")] == same(test.critical_values["1%"])
        assert row[header.index("Decision")] == ("reject" if test.reject else "do not reject")


def test_about_sheet_names_version_settings_and_source_fingerprint(
        written: tuple[RunRecord, Path]) -> None:
    run, target = written
    sheet = openpyxl.load_workbook(target)["About this run"]
    pairs = {r[0]: r[1] for r in sheet.iter_rows(values_only=True) if r[0]}
    assert pairs["Version"] == __version__
    assert pairs["Created (UTC)"] == run.created
    assert pairs["Significance level"] == run.settings.alpha
    assert pairs["Source file"] == "SHA-256"
    assert pairs["macro quarterly.xlsx"] == SOURCE_SHA
    text = " ".join(str(r[1]) for r in sheet.iter_rows(values_only=True) if r[1])
    assert "Dolado" in text and "MacKinnon" in text


def test_formula_like_names_are_stored_as_strings(written: tuple[RunRecord, Path]) -> None:
    _run, target = written
    sheet = openpyxl.load_workbook(target)["Summary"]
    cell = next(c for c in sheet["A"] if c.value == FORMULA_NAME)
    assert cell.data_type == "s"
    with zipfile.ZipFile(target) as archive:
        sheets = [n for n in archive.namelist() if n.startswith("xl/worksheets/sheet")]
        assert sheets
        for name in sheets:
            assert b"<f>" not in archive.read(name)  # no formula anywhere


def test_requested_chart_is_embedded(written: tuple[RunRecord, Path]) -> None:
    """The chart is drawn in the workbook as shapes (one group under the series' name), by the
    report layer itself: no picture, no painter."""
    run, target = written
    book = openpyxl.load_workbook(target)
    assert "Charts" in book.sheetnames
    assert book["Charts"]["A1"].value == run.findings[0].name
    with zipfile.ZipFile(target) as archive:
        names = archive.namelist()
        assert not [n for n in names if n.startswith("xl/media/")]
        drawings = [n for n in names if n.startswith("xl/drawings/drawing")]
        assert len(drawings) == 1
        root = ElementTree.fromstring(archive.read(drawings[0]))
    groups = root.findall(f"{XDR}oneCellAnchor/{XDR}grpSp")
    assert len(groups) == 1
    title = groups[0].find(f"{XDR}nvGrpSpPr/{XDR}cNvPr")
    assert title is not None and title.get("name") == f"Chart of {run.findings[0].result.name}"
    ids = [int(e.get("id", 0)) for e in root.iter(f"{XDR}cNvPr")]
    assert len(set(ids)) == len(ids)  # every shape of the drawing part numbered once


def test_no_chart_sheet_without_charts(tmp_path: Path) -> None:
    target = tmp_path / "plain.xlsx"
    export(target, make_run())
    assert "Charts" not in openpyxl.load_workbook(target).sheetnames


@pytest.mark.parametrize("text", ["=1+1", "+1", "-1-1", "@A1", "\t=2", "=cmd|' /C calc'!A0"])
def test_formula_like_text_is_kept_as_the_same_plain_string(tmp_path: Path, text: str) -> None:
    book = Book("Tauscope test")
    book.sheet("Sheet").add([text])
    book.sheets[0].add([1.5])
    (tmp_path / "guard.xlsx").write_bytes(book.package())
    back = openpyxl.load_workbook(tmp_path / "guard.xlsx").active
    assert back is not None
    assert back["A1"].value == text and back["A1"].data_type == "s"
    assert back["A1"].quotePrefix
    assert back["A2"].value == 1.5 and back["A2"].data_type == "n"
    with zipfile.ZipFile(tmp_path / "guard.xlsx") as archive:
        assert b"<f>" not in archive.read("xl/worksheets/sheet1.xml")
