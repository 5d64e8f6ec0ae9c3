"""Reading CSV and text files of the shapes economists download (built in tmp_path)."""

from __future__ import annotations

import math
from pathlib import Path

import pandas as pd
import pytest

from tauscope.data import DataError, file_sha256, read_workbook


def _write(path: Path, text: str, encoding: str = "utf-8") -> Path:
    path.write_bytes(text.encode(encoding))
    return path


def _labels(series) -> list[str]:  # type: ignore[no-untyped-def]
    return [str(p) for p in series.values.index]


def _values(series) -> list[float | None]:  # type: ignore[no-untyped-def]
    return [None if math.isnan(v) else v for v in series.values.tolist()]


def test_semicolon_decimal_comma_quarterly_titles_and_footnote(tmp_path: Path) -> None:
    path = _write(tmp_path / "accounts.csv", (
        "Statistics Office of Nowhere\n"
        "Quarterly accounts; seasonally adjusted\n"
        "Quarter;Real GDP;Prices\n"
        "1995Q1;1,5;100,25\n"
        "1995Q2;2,5;..\n"
        "1995Q3;-3,25;101,0\n"
        "1995Q4;1.204,75;102,5\n"
        "Source: invented for this test; see notes.\n"
    ))
    book = read_workbook(path)
    assert [s.name for s in book.series()] == ["Real GDP", "Prices"]
    gdp, prices = book.series()
    assert gdp.frequency == prices.frequency == "quarterly"
    assert isinstance(gdp.values.index, pd.PeriodIndex)
    assert _labels(gdp) == ["1995Q1", "1995Q2", "1995Q3", "1995Q4"]
    assert _values(gdp) == [1.5, 2.5, -3.25, 1204.75]
    assert _values(prices) == [100.25, None, 101.0, 102.5]
    assert [(g.start, g.end, g.count) for g in prices.gaps] == [("1995Q2", "1995Q2", 1)]
    assert gdp.source.first_row == 4 and gdp.source.column == "Real GDP"
    assert gdp.span == ("1995Q1", "1995Q4") and gdp.nobs == 4 and prices.nobs == 3
    notes = " ".join(book.sheets[0].notes)
    assert "2 title or note rows" in notes and "1 row below the data" in notes
    assert "decimal comma" in book.notes[0]
    assert book.sheets[0].name == "accounts"


def test_tab_separated_monthly_with_month_names(tmp_path: Path) -> None:
    path = _write(tmp_path / "monthly.txt", (
        "Month\tExports\tImports\n"
        "Jan 1995\t1.5\tNA\n"
        "Feb 1995\t2\t#N/A\n"
        "Mar 1995\t3\t7\n"
        "Apr 1995\t\t8\n"
        "May 1995\t5\t9.25\n"
    ))
    exports, imports = read_workbook(path).series()
    assert exports.frequency == "monthly"
    assert _labels(exports) == ["1995-01", "1995-02", "1995-03", "1995-04", "1995-05"]
    assert _values(exports) == [1.5, 2.0, 3.0, None, 5.0]
    # leading "NA" and "#N/A" are trimmed: the series starts where its values start
    assert _labels(imports) == ["1995-03", "1995-04", "1995-05"]
    assert _values(imports) == [7.0, 8.0, 9.25]
    assert imports.source.first_row == 4


def test_latin1_with_thousands_separators(tmp_path: Path) -> None:
    path = _write(tmp_path / "budget.csv", (
        "Année;Dépenses (€);Recettes\n"
        "1995;1.234.567,5;2.345\n"
        "1996;1.300.000,25;2.400\n"
        "1997;1.400.000;2.500\n"
    ), encoding="cp1252")  # Windows-1252: Latin-1 plus the euro sign
    book = read_workbook(path)
    spending, receipts = book.series()
    assert spending.name == "Dépenses (€)"
    assert spending.frequency == "annual" and _labels(spending) == ["1995", "1996", "1997"]
    assert _values(spending) == [1234567.5, 1300000.25, 1400000.0]
    assert _values(receipts) == [2345.0, 2400.0, 2500.0]
    assert "Windows-1252" in book.notes[0]


def test_latin1_comma_file_with_quoted_thousands(tmp_path: Path) -> None:
    path = _write(tmp_path / "people.csv", (
        'Jahr,"Bevölkerung, gesamt",Fläche\n'
        '2001,"1,234,567.5",12\n'
        '2002,"1,300,000",13\n'
        '2003,"1,400,000.25",14\n'
    ), encoding="latin-1")
    people, area = read_workbook(path).series()
    assert people.name == "Bevölkerung, gesamt" and area.name == "Fläche"
    assert _values(people) == [1234567.5, 1300000.0, 1400000.25]


def test_utf8_bom_and_missing_codes(tmp_path: Path) -> None:
    path = tmp_path / "codes.csv"
    path.write_bytes(
        b"\xef\xbb\xbfYear,A\n2000,1\n2001,..\n2002,NA\n2003,#N/A\n2004,n/a\n2005,-\n2006,:\n"
        b"2007,\n2008,2\n"
    )
    (series,) = read_workbook(path).series()
    assert series.name == "A"
    assert _values(series) == [1.0, *[None] * 7, 2.0]
    assert [(g.start, g.end, g.count) for g in series.gaps] == [("2001", "2007", 7)]


@pytest.mark.parametrize(
    ("label_form", "expected", "frequency"),
    [
        ("{y}-Q{q}", "1995Q1", "quarterly"),
        ("{y} Q{q}", "1995Q1", "quarterly"),
        ("{y}M{m:02d}", "1995-01", "monthly"),
        ("{y}-{m:02d}", "1995-01", "monthly"),
    ],
)
def test_period_label_forms(tmp_path: Path, label_form: str, expected: str, frequency: str) -> None:
    step = 3 if frequency == "quarterly" else 1
    lines = ["when,x"]
    for i in range(6):
        month = 1 + step * i
        year, within = 1995 + (month - 1) // 12, (month - 1) % 12
        lines.append(f"{label_form.format(y=year, q=within // 3 + 1, m=within + 1)},{i}")
    (series,) = read_workbook(_write(tmp_path / "f.csv", "\n".join(lines))).series()
    assert series.frequency == frequency
    assert str(series.values.index[0]) == expected
    assert _values(series) == [0.0, 1.0, 2.0, 3.0, 4.0, 5.0]


def test_day_first_dates_at_quarter_ends_are_quarterly(tmp_path: Path) -> None:
    text = "date,x\n31/03/1995,1\n30/06/1995,2\n30/09/1995,3\n31/12/1995,4\n"
    (series,) = read_workbook(_write(tmp_path / "q.csv", text)).series()
    assert series.frequency == "quarterly"
    assert _labels(series) == ["1995Q1", "1995Q2", "1995Q3", "1995Q4"]


def test_iso_daily_business_days_and_weekly(tmp_path: Path) -> None:
    weekdays = list(pd.bdate_range("2020-01-01", periods=30))
    del weekdays[10]  # a holiday
    text = "date,x\n" + "".join(f"{d:%Y-%m-%d},{i}\n" for i, d in enumerate(weekdays))
    (business,) = read_workbook(_write(tmp_path / "b.csv", text)).series()
    assert business.frequency == "business-day" and business.nobs == 29 and not business.gaps
    assert business.span == ("2020-01-01", "2020-02-11")

    days = list(pd.date_range("2020-01-01", periods=30))
    del days[10]
    text = "date,x\n" + "".join(f"{d:%Y-%m-%d},{i}\n" for i, d in enumerate(days))
    (daily,) = read_workbook(_write(tmp_path / "d.csv", text)).series()
    assert daily.frequency == "daily"
    assert [(g.start, g.count) for g in daily.gaps] == [("2020-01-11", 1)]

    fridays = list(pd.date_range("2020-01-03", periods=20, freq="7D"))[::-1]  # newest first
    text = "date,x\n" + "".join(f"{d:%d.%m.%Y},{i}\n" for i, d in enumerate(fridays))
    (weekly,) = read_workbook(_write(tmp_path / "w.csv", text)).series()
    assert weekly.frequency == "weekly"
    assert weekly.span == ("2020-01-03", "2020-05-15")
    assert weekly.values.iloc[0] == 19.0  # read oldest first
    assert any("newest to oldest" in n for n in read_workbook(tmp_path / "w.csv").sheets[0].notes)


def test_irregular_dates_fall_back_to_observation_numbers(tmp_path: Path) -> None:
    text = "date,x\n2020-01-01,1\n2020-01-02,2\n2020-03-17,3\n2020-11-30,4\n2021-01-01,5\n"
    book = read_workbook(_write(tmp_path / "odd.csv", text))
    (series,) = book.series()
    assert series.frequency is None
    assert isinstance(series.values.index, pd.RangeIndex)
    assert list(series.values.index) == [1, 2, 3, 4, 5] and series.span == ("1", "5")
    assert any("not regularly spaced" in n for n in book.sheets[0].notes)


def test_no_dates_at_all_numbers_observations(tmp_path: Path) -> None:
    (a, b) = read_workbook(_write(tmp_path / "plain.csv", "a,b\n1.5,2\n2.5,3\n3.5,4\n")).series()
    assert list(a.values.index) == [1, 2, 3] and a.frequency is None
    assert _values(b) == [2.0, 3.0, 4.0]


def test_transposed_layout_with_duplicate_and_blank_names(tmp_path: Path) -> None:
    text = (
        "Table 7\n"
        "Series,1995-01,1995-02,1995-03,1995-04\n"
        "GDP,1,2,3,4\n"
        "CPI,5,..,7,8\n"
        "GDP,9,10,11,12\n"
        ",13,14,15,16\n"
    )
    book = read_workbook(_write(tmp_path / "wide.csv", text))
    names = [s.name for s in book.series()]
    assert names == ["GDP", "CPI", "GDP (2)", "Row 6"]
    gdp, cpi, gdp2, _ = book.series()
    assert gdp.frequency == "monthly"
    assert _labels(gdp) == ["1995-01", "1995-02", "1995-03", "1995-04"]
    assert _values(cpi) == [5.0, None, 7.0, 8.0]
    assert _values(gdp2) == [9.0, 10.0, 11.0, 12.0] and gdp2.source.first_row == 5
    assert gdp2.source.column == "GDP"
    assert gdp.key != gdp2.key
    notes = " ".join(book.sheets[0].notes)
    assert "GDP (2)" in notes and "Row 6" in notes


def test_two_header_rows_with_a_merged_group_label(tmp_path: Path) -> None:
    text = "Quarter,Output,,Prices\n,nominal,real,\n2000Q1,1,2,3\n2000Q2,4,5,6\n"
    names = [s.name for s in read_workbook(_write(tmp_path / "h.csv", text)).series()]
    assert names == ["Output nominal", "Output real", "Prices"]


def test_reading_leaves_the_file_unchanged(tmp_path: Path) -> None:
    path = _write(tmp_path / "x.csv", "Year,A\n2000,1\n2001,2\n2002,3\n")
    before = file_sha256(path)
    book = read_workbook(path)
    assert book.sha256 == before == file_sha256(path)


@pytest.mark.parametrize(
    ("content", "fragment"),
    [
        (b"", "is empty"),
        (b"   \n\n", "is empty"),
        (b"name,town\nAnna,Oslo\nBen,Rome\n", "no column of numbers"),
        (bytes(range(256)) * 8, "binary"),
        (b"%PDF-1.4\n...", "PDF"),
    ],
)
def test_bad_text_files_give_one_sentence(tmp_path: Path, content: bytes, fragment: str) -> None:
    path = tmp_path / "bad.csv"
    path.write_bytes(content)
    with pytest.raises(DataError) as caught:
        read_workbook(path)
    message = str(caught.value)
    assert fragment in message and message.startswith("bad.csv") and "\n" not in message
    assert caught.value.file == "bad.csv"


def test_missing_file_is_a_data_error(tmp_path: Path) -> None:
    with pytest.raises(DataError, match="does not exist"):
        read_workbook(tmp_path / "nowhere.csv")


def test_utf16_tab_export(tmp_path: Path) -> None:
    # the "Unicode text" export of spreadsheet programs: UTF-16 with byte-order mark, tabs
    path = tmp_path / "export.txt"
    path.write_bytes("Période\tPIB\n2001Q1\t1,5\n2001Q2\t2,5\n2001Q3\t3,5\n".encode("utf-16"))
    book = read_workbook(path)
    (series,) = book.series()
    assert series.name == "PIB" and _values(series) == [1.5, 2.5, 3.5]
    assert series.frequency == "quarterly" and "UTF-16" in book.notes[0]


def test_statistical_flags_after_values(tmp_path: Path) -> None:
    text = "geo\\time\t2019\t2020\t2021\nDE\t12.3 p\t13.1 e\t:\nFR\t1 234.5\t:\t14.2 b\n"
    germany, france = read_workbook(_write(tmp_path / "flags.tsv", text)).series()
    assert (germany.name, germany.frequency) == ("DE", "annual")
    assert _values(germany) == [12.3, 13.1] and germany.span == ("2019", "2020")
    assert _values(france) == [1234.5, None, 14.2]
