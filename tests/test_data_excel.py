"""Reading Excel workbooks, and refusing damaged, encrypted and oversized ones."""

from __future__ import annotations

import datetime as dt
import io
import math
import zipfile
from pathlib import Path

import openpyxl
import pandas as pd
import pytest

from tauscope.data import DataError, file_sha256, read_workbook
from tauscope.data.container import OLE2_MAGIC
from tauscope.data.excel import read_with_calamine, read_with_openpyxl

DEMO = Path(__file__).resolve().parents[1] / "resources" / "demo" / "harbourline_demo.xlsx"


def _values(series) -> list[float | None]:  # type: ignore[no-untyped-def]
    return [None if math.isnan(v) else v for v in series.values.tolist()]


def _two_sheet_book(path: Path) -> Path:
    book = openpyxl.Workbook()
    monthly = book.active
    assert monthly is not None
    monthly.title = "Monthly"
    monthly.append(["Central Bank of Nowhere: money and prices"])
    monthly.append(["Date", "Money", "Prices"])
    for i in range(6):
        # Excel date numbers: days since 1899-12-30, formatted as dates (first of each month)
        serial = (dt.date(2001, 1 + i, 1) - dt.date(1899, 12, 30)).days
        monthly.append([serial, 10.0 + i, "#N/A" if i == 2 else 100 + i])
        monthly.cell(row=monthly.max_row, column=1).number_format = "yyyy-mm-dd"
    monthly.append(["Note: invented figures."])
    annual = book.create_sheet("Annual")
    annual.append(["Year", "Output", "Output"])
    for year in range(1990, 1995):
        annual.append([year, float(year - 1989), year * 2])
    raw = book.create_sheet("Serials")
    raw.append(["when", "x"])
    for i in range(5):  # plain date numbers without a date format: quarter ends
        end = pd.Period(year=2010, quarter=1, freq="Q") + i
        raw.append([(end.end_time.date() - dt.date(1899, 12, 30)).days, i * 1.5])
    book.create_sheet("Notes").append(["Nothing but words here."])
    book.save(path)
    return path


def test_two_sheets_with_excel_date_numbers(tmp_path: Path) -> None:
    book = read_workbook(_two_sheet_book(tmp_path / "bank.xlsx"))
    assert [s.name for s in book.sheets] == ["Monthly", "Annual", "Serials", "Notes"]
    money, prices = book.sheet("Monthly").series
    assert money.name == "Money" and money.frequency == "monthly"
    assert [str(p) for p in money.values.index] == [f"2001-0{m}" for m in range(1, 7)]
    assert _values(money) == [10.0, 11.0, 12.0, 13.0, 14.0, 15.0]
    assert _values(prices) == [100.0, 101.0, None, 103.0, 104.0, 105.0]
    assert money.source.first_row == 3 and money.source.sheet == "Monthly"
    output, output2 = book.sheet("Annual").series
    assert (output.name, output2.name) == ("Output", "Output (2)")
    assert output.frequency == "annual" and output.span == ("1990", "1994")
    assert _values(output2) == [3980.0, 3982.0, 3984.0, 3986.0, 3988.0]
    assert any("Output (2)" in n for n in book.sheet("Annual").notes)
    (serial,) = book.sheet("Serials").series
    assert serial.frequency == "quarterly" and serial.span == ("2010Q1", "2011Q1")
    assert book.sheet("Notes").series == ()
    assert len(book.series()) == 5


def test_transposed_sheet(tmp_path: Path) -> None:
    book = openpyxl.Workbook()
    sheet = book.active
    assert sheet is not None
    sheet.append(["Indicator", "2019Q1", "2019Q2", "2019Q3", "2019Q4", "2020Q1"])
    sheet.append(["Exports", 1, 2, 3, 4, 5])
    sheet.append(["Imports", 6, "..", 8, 9, 10])
    sheet.append(["Source: invented."])
    book.save(tmp_path / "wide.xlsx")
    exports, imports = read_workbook(tmp_path / "wide.xlsx").series()
    assert exports.name == "Exports" and exports.frequency == "quarterly"
    assert [str(p) for p in exports.values.index] == [
        "2019Q1", "2019Q2", "2019Q3", "2019Q4", "2020Q1"]
    assert _values(imports) == [6.0, None, 8.0, 9.0, 10.0]
    assert imports.source.first_row == 3


def test_datetime_cells_and_cached_formula_values(tmp_path: Path) -> None:
    book = openpyxl.Workbook()
    sheet = book.active
    assert sheet is not None
    sheet.append(["Day", "x", "formula"])
    for i, day in enumerate(pd.bdate_range("2024-01-01", periods=8)):
        sheet.append([day.to_pydatetime(), float(i), f"=B{i + 2}*2"])
    book.save(tmp_path / "f.xlsx")
    read = read_workbook(tmp_path / "f.xlsx")
    (x,) = read.series()  # formulas without cached values are never evaluated: no numbers
    assert x.frequency == "business-day" and x.span == ("2024-01-01", "2024-01-10")


def test_engines_read_the_same_cells(tmp_path: Path) -> None:
    data = _two_sheet_book(tmp_path / "same.xlsx").read_bytes()

    def rectangle(rows: list[list[object]]) -> list[list[object]]:
        width = max((len(r) for r in rows), default=0)
        return [r + [None] * (width - len(r)) for r in rows]

    by_openpyxl = [(name, rectangle(rows)) for name, rows, _ in read_with_openpyxl(data)]
    by_calamine = [(name, rectangle(rows)) for name, rows, _ in read_with_calamine(data)]
    assert by_openpyxl == by_calamine


def test_demo_workbook_reads_as_described() -> None:
    if not DEMO.exists():
        pytest.skip("demo workbook not generated")
    book = read_workbook(DEMO)
    assert [s.name for s in book.sheets] == ["Quarterly", "Monthly", "Annual"]
    quarterly = book.sheet("Quarterly").series
    assert quarterly[0].name == "Real output (log)" and quarterly[0].frequency == "quarterly"
    assert book.sheet("Monthly").series[0].frequency == "monthly"
    assert book.sheet("Annual").series[0].frequency == "annual"


def test_nonexistent_sheet_names_the_sheets(tmp_path: Path) -> None:
    book = read_workbook(_two_sheet_book(tmp_path / "b.xlsx"))
    with pytest.raises(DataError) as caught:
        book.sheet("Weekly")
    assert str(caught.value) == (
        "b.xlsx: has no sheet 'Weekly' (sheets: Monthly, Annual, Serials, Notes)."
    )


def _zip(members: dict[str, bytes], compression: int = zipfile.ZIP_DEFLATED) -> bytes:
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", compression) as archive:
        for name, data in members.items():
            archive.writestr(name, data)
    return buffer.getvalue()


BAD_WORKBOOKS = {
    "random bytes": (bytes(range(256)) * 40, "not an Excel workbook"),
    "text renamed": (b"Year,A\n2000,1\n", "not an Excel workbook"),
    "truncated zip": (b"PK\x03\x04" + bytes(300), "damaged"),
    "zip without workbook": (_zip({"hello.txt": b"hi"}), "not an Excel workbook"),
    "encrypted (OLE2 container)": (
        OLE2_MAGIC + bytes(100) + "EncryptedPackage".encode("utf-16-le") + bytes(400),
        "password-protected",
    ),
    "decompression bomb": (
        _zip({"[Content_Types].xml": b"<Types/>", "xl/workbook.xml": b"<workbook/>",
              "xl/worksheets/sheet1.xml": b"<" + b"0" * (17 << 20) + b">"}),
        "decompression bomb",
    ),
    "broken workbook xml": (
        _zip({"[Content_Types].xml": b"<Types/>", "xl/workbook.xml": b"<workbook"}),
        "damaged",
    ),
}


@pytest.mark.parametrize("case", list(BAD_WORKBOOKS))
def test_bad_workbooks_give_one_sentence_and_stay_unchanged(tmp_path: Path, case: str) -> None:
    content, fragment = BAD_WORKBOOKS[case]
    path = tmp_path / "input.xlsx"
    path.write_bytes(content)
    before = file_sha256(path)
    with pytest.raises(DataError) as caught:
        read_workbook(path)
    message = str(caught.value)
    assert fragment in message, message
    assert message.startswith("input.xlsx:") and "\n" not in message
    assert file_sha256(path) == before


def _with_sheet_xml(replace: tuple[str, str], prefix: str) -> bytes:
    good = io.BytesIO()
    book = openpyxl.Workbook()
    sheet = book.active
    assert sheet is not None
    sheet["A1"], sheet["A2"], sheet["A3"], sheet["A4"] = "hello", 1.0, 2.0, 3.0
    book.save(good)
    with zipfile.ZipFile(io.BytesIO(good.getvalue())) as source:
        members = {name: source.read(name) for name in source.namelist()}
    xml = members["xl/worksheets/sheet1.xml"].decode()
    members["xl/worksheets/sheet1.xml"] = (prefix + xml.replace(*replace)).encode()
    return _zip(members)


ENTITIES = ('<?xml version="1.0"?><!DOCTYPE worksheet [<!ENTITY a "aaaaaaaaaa">'
            '<!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">'
            '<!ENTITY x SYSTEM "file:///etc/hostname">]>')


@pytest.mark.parametrize("entity", ["&b;", "&x;"])
def test_xml_entities_are_refused_by_both_engines(tmp_path: Path, entity: str) -> None:
    # openpyxl parses through defusedxml when it is installed (openpyxl.xml.DEFUSEDXML);
    # python-calamine refuses entities it does not know
    from openpyxl.xml import DEFUSEDXML

    assert DEFUSEDXML
    data = _with_sheet_xml(("<t>hello</t>", f"<t>{entity}</t>"), ENTITIES)
    path = tmp_path / "entities.xlsx"
    path.write_bytes(data)
    with pytest.raises(DataError, match="damaged"):
        read_workbook(path)
    with pytest.raises(Exception, match="unrecognized entity"):  # calamine's own words
        read_with_calamine(data)
    with pytest.raises(Exception) as caught:  # the cause is what matters
        read_with_openpyxl(data)
    causes = []
    error: BaseException | None = caught.value
    while error is not None:
        causes.append(type(error).__name__)
        error = error.__cause__ or error.__context__
    assert any(name in ("EntitiesForbidden", "DTDForbidden") for name in causes), causes


def test_kind_is_judged_by_content_not_name(tmp_path: Path) -> None:
    data = _two_sheet_book(tmp_path / "b.xlsx").read_bytes()
    renamed = tmp_path / "really_a_workbook.csv"
    renamed.write_bytes(data)
    assert [s.name for s in read_workbook(renamed).sheets][:2] == ["Monthly", "Annual"]
    macro_name = tmp_path / "b.xlsm"
    macro_name.write_bytes(data)
    assert len(read_workbook(macro_name).series()) == 5
