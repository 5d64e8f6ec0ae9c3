"""The PDF report read back: its pages, rows never split across a page break, headers repeated,
the summary's KPSS cell one line per difference; and the page cutting on its own."""

from __future__ import annotations

import html
import json
import re
import shutil
import subprocess
import unicodedata
import xml.etree.ElementTree as ElementTree
from pathlib import Path
from typing import Any

import pytest

from tauscope.report.html_export import run_to_html
from tauscope.report.pdf_pages import Unit, cut_pages
from test_report_support import make_run

DEMO = Path(__file__).resolve().parents[1] / "resources" / "demo" / "harbourline_demo.xlsx"
PAGE_MARGIN_PT = 18.0 / 25.4 * 72  # report.pdf_direct.MARGIN_MM
A4_HEIGHT_PT = 841.89

poppler = pytest.mark.skipif(
    shutil.which("pdftotext") is None or shutil.which("pdfinfo") is None,
    reason="poppler-utils (pdftotext, pdfinfo) is not installed; .ci/run installs it")


# --- cutting pages, without Qt --------------------------------------------------------------

def test_pages_end_between_units_and_a_tall_unit_is_cut_only_when_it_must_be() -> None:
    units = [Unit(0, 30), Unit(30, 70), Unit(70, 95), Unit(95, 200), Unit(200, 210)]
    pages = cut_pages(units, 210, 100)
    assert [(p.top, p.bottom) for p in pages] == [(0, 95), (95, 195), (195, 210)]
    # only the 105-unit block, taller than a page, was cut inside


def test_a_table_row_is_never_cut_and_its_header_is_repeated() -> None:
    header = Unit(10, 20, table=1, row=0, header=True)
    rows = [Unit(20 + 15 * k, 35 + 15 * k, table=1, row=k + 1) for k in range(12)]  # 20..200
    lines = [Unit(200 + 10 * k, 210 + 10 * k) for k in range(5)]
    pages = cut_pages([Unit(0, 10), header, *rows, *lines], 250, 100)
    row_tops = {r.top for r in rows}
    for page in pages:
        assert page.bottom - page.top + page.header_height <= 100
        for row in rows:  # a row lies wholly on one page
            assert row.bottom <= page.top or row.top >= page.bottom or \
                (page.top <= row.top and row.bottom <= page.bottom)
        if page.top in row_tops:  # a page starting inside the table repeats its header
            assert (page.header_top, page.header_bottom) == (10, 20)
    assert pages[0].header_height == 0
    assert any(p.header_height for p in pages)
    assert pages[-1].bottom == 250


def test_a_heading_unit_that_reaches_into_the_next_keeps_them_together() -> None:
    # the layout makes a heading one unit with the first line after it (80..105 here)
    units = [Unit(0, 80), Unit(80, 95), Unit(80, 105), Unit(105, 120)]
    pages = cut_pages(units, 120, 100)
    assert pages[0].bottom == 80  # not at 95, inside the heading's unit


# --- the PDF read back --------------------------------------------------------------------

def _visible_words(pdf: Path, page: int) -> list[tuple[float, float, str]]:
    """(y, x, word) of the words drawn inside the page's text area (not in the margins)."""
    out = subprocess.run(["pdftotext", "-bbox", "-f", str(page), "-l", str(page), str(pdf), "-"],
                         capture_output=True, text=True, check=True, timeout=60).stdout
    root = ElementTree.fromstring(re.sub(r'xmlns="[^"]*"', "", out.split("<body>", 1)[1]
                                         .rsplit("</body>", 1)[0].join(["<b>", "</b>"])))
    words = []
    for word in root.iter("word"):
        y = float(word.attrib["yMin"])
        if PAGE_MARGIN_PT - 2 <= y <= A4_HEIGHT_PT - PAGE_MARGIN_PT:
            text = unicodedata.normalize("NFKC", word.text or "")  # "ﬁrst" → "first"
            words.append((round(y, 1), float(word.attrib["xMin"]), text))
    return sorted(words)


def _column_text(words: list[tuple[float, float, str]], left: float, right: float) -> str:
    """The words between x = left and right, line by line from the top, as one string."""
    return " ".join(w for _y, x, w in words if left - 1 <= x < right - 1)


def _header_x(words: list[tuple[float, float, str]], first: str, following: str) -> float | None:
    for i, (y, x, w) in enumerate(words[:-1]):
        if w == first and words[i + 1][2] == following and words[i + 1][0] == y:
            return x
    return None


@pytest.fixture(scope="module")
def long_pdf(tmp_path_factory: pytest.TempPathFactory) -> tuple[Path, dict[str, Any]]:
    """The demo workbook through ``tauscope batch`` with every cross-check: a PDF of about ten
    pages whose summary and decision paths run over page breaks; the JSON of the same run."""
    from tauscope.commands import batch

    folder = tmp_path_factory.mktemp("pdf")
    pdf, data = folder / "findings.pdf", folder / "findings.json"
    assert batch.main([str(DEMO), "--check", "kpss,pp,dfgls,za", "--out", str(pdf),
                       "--out", str(data)]) == 0
    return pdf, json.loads(data.read_text(encoding="utf-8"))


@poppler
def test_page_count_read_back_two_ways(long_pdf: tuple[Path, dict[str, Any]]) -> None:
    path, _run = long_pdf
    info = subprocess.run(["pdfinfo", str(path)], capture_output=True, text=True, check=True,
                          timeout=60).stdout
    pages = int(re.search(r"^Pages:\s+(\d+)", info, re.M).group(1))  # type: ignore[union-attr]
    assert pages >= 5
    # a small reader: every page object of the file (PDF 1.4, §3.6.2: /Type /Page)
    assert len(re.findall(rb"/Type\s*/Page(?![a-zA-Z])", path.read_bytes())) == pages


@poppler
def test_no_table_row_is_split_across_a_page_break(long_pdf: tuple[Path, dict[str, Any]]) -> None:
    """Each step's null hypothesis (it wraps over two lines) is read whole on one page, as often
    as the decision paths hold it; each page that opens inside a decision path repeats the
    header and starts with a whole step (its number first)."""
    path, run = long_pdf
    info = subprocess.run(["pdfinfo", str(path)], capture_output=True, text=True, check=True,
                          timeout=60).stdout
    pages = int(re.search(r"^Pages:\s+(\d+)", info, re.M).group(1))  # type: ignore[union-attr]
    expected: dict[str, int] = {}
    for series in run["series"]:
        for step in series["steps"]:
            expected[step["hypothesis"]] = expected.get(step["hypothesis"], 0) + 1
    found = dict.fromkeys(expected, 0)
    labels = {series["verdict"]["label"] for series in run["series"]}
    label_count = dict.fromkeys(labels, 0)
    continued = 0
    for page in range(1, pages + 1):
        words = _visible_words(path, page)
        null_x = _header_x(words, "Null", "hypothesis")
        stat_x = _header_x(words, "Statistic", "Value")
        if null_x is not None and stat_x is not None:
            column = _column_text(words, null_x, stat_x)
            for hypothesis in expected:
                found[hypothesis] += column.count(hypothesis)
            header_y = next(y for y, x, w in words if w == "Null" and x == null_x)
            body = [(y, x, w) for y, x, w in words if y > header_y + 12]
            if words[0][2] == "Step":  # the page opens with a repeated path header
                continued += 1
                assert body and body[0][2].isdigit(), f"page {page} opens mid-row: {body[:6]}"
        verdict_x = _header_x(words, "Verdict", "Obs.")
        obs_x = _header_x(words, "Obs.", "Span")
        if verdict_x is not None and obs_x is not None:
            column = _column_text(words, verdict_x, obs_x)
            # Longest first, each taken out once counted: one label can begin another
            # ("… around a mean" and "… around a mean that shifts (2009Q1)").
            for label in sorted(labels, key=len, reverse=True):
                label_count[label] += column.count(label)
                column = column.replace(label, " ")
    assert found == expected
    assert continued >= 1  # a decision path did run over a page break
    for label in labels:  # each verdict whole in the summary (and again over its section)
        assert label_count[label] == sum(1 for series in run["series"]
                                         if series["verdict"]["label"] == label)


def test_summary_kpss_cell_gives_each_difference_its_own_line() -> None:
    run = make_run()
    page = run_to_html(run)
    summary = page.split("<h2>Summary</h2>", 1)[1].split("</table>", 1)[0]
    for finding in run.findings:
        kpss = [t for t in finding.result.tests if t.test == "kpss"]
        if len(kpss) < 2:
            continue
        heads = re.findall(r"<th[^>]*>(.*?)</th>", summary)
        row = next(r for r in summary.split("<tr>") if html.escape(finding.name) in r)
        cell = re.findall(r"<td[^>]*>(.*?)</td>", row)[heads.index("KPSS")]
        items = cell.split("<br>")
        assert len(items) == len(kpss)
        assert all(" " not in item for item in items)  # no break inside one item


# --- the report's own PDF writer ------------------------------------------------------------

def _renamed(name: str) -> Any:
    import dataclasses

    run = make_run()
    first = run.findings[0]
    finding = dataclasses.replace(first, result=dataclasses.replace(first.result, name=name))
    return dataclasses.replace(run, findings=(finding, *run.findings[1:]))


def test_every_cross_reference_points_at_its_object() -> None:
    """ISO 32000-1, 7.5.4: entry n of the table gives the byte offset of "n 0 obj"."""
    from tauscope.report.pdf_direct import run_to_pdf_direct

    data = run_to_pdf_direct(make_run())
    start = int(data.rsplit(b"startxref", 1)[1].split()[0])
    assert data[start:start + 4] == b"xref"
    lines = data[start:].split(b"\n")
    first, count = map(int, lines[1].split())
    assert first == 0 and count > 10
    for number, entry in enumerate(lines[2:2 + count]):
        if number == 0:
            assert entry.endswith(b"f ")
            continue
        offset = int(entry[:10])
        assert data[offset:offset + len(b"%d 0 obj" % number)] == b"%d 0 obj" % number
    assert b"/Size %d" % count in data


@poppler
def test_the_fonts_are_embedded_subsets_and_the_text_reads_back(tmp_path: Path) -> None:
    from tauscope.report.pdf_direct import run_to_pdf_direct

    name = "Índice de precios (Δ² log) – ΦτκΣ"
    path = tmp_path / "direct.pdf"
    path.write_bytes(run_to_pdf_direct(_renamed(name)))
    fonts = subprocess.run(["pdffonts", str(path)], capture_output=True, text=True, check=True,
                           timeout=60).stdout.splitlines()[2:]
    assert len(fonts) == 3
    for line in fonts:  # name, type (two words), encoding, then emb, sub, uni: all "yes"
        assert "CID TrueType" in line and line.split()[-5:-2] == ["yes", "yes", "yes"]
    text = subprocess.run(["pdftotext", "-f", "1", "-l", "3", str(path), "-"],
                          capture_output=True, text=True, check=True, timeout=60).stdout
    assert name in unicodedata.normalize("NFC", text)


@pytest.mark.parametrize("name", ["国内総生産", "שלום עולם", "الناتج المحلي", "मुद्रास्फीति",
                                  "x\u202ey"])
def test_text_this_writer_cannot_set_is_reported(name: str) -> None:
    """A character the bundled font lacks (Chinese), or text that needs shaping: written right
    to left and joined (Hebrew, Arabic, whose letters DejaVu Sans has), reordered (Devanagari),
    or a direction override; Qt's route writes such a report."""
    from tauscope.report.pdf_direct import MissingGlyphs, run_to_pdf_direct

    with pytest.raises(MissingGlyphs, match="cannot set"):
        run_to_pdf_direct(_renamed(name))


def test_a_tab_in_a_chart_title_is_written_as_a_space() -> None:
    from tauscope.report.chart_plan import ChartPlan, Label
    from tauscope.report.pdf_direct import run_to_pdf_direct

    run = _renamed("Output\tgap")
    plan = ChartPlan("Output\tgap", 620.0, 300.0, (), (Label(310.0, 20.0, "Output\tgap", 15.0),))
    data = run_to_pdf_direct(run, {run.findings[0].name: plan})
    assert data.startswith(b"%PDF-")
