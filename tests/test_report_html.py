"""HTML report read back with html.parser; PDF of the same through Qt's PDF writer."""

from __future__ import annotations

import base64
import shutil
import subprocess
import unicodedata
from html.parser import HTMLParser
from pathlib import Path

import pytest

from tauscope.engine import formatting as fmt
from tauscope.report import RunRecord, export
from tauscope.report.chart_plan import ChartPlan, plan_chart
from tauscope.report.chart_svg import chart_svg
from tauscope.report.deciding import union_steps
from tauscope.report.methods import methods_for
from tauscope.report.tables import deciding_tau, marker
from test_report_support import FORMULA_NAME, make_run


class _Reader(HTMLParser):
    """Tables as lists of rows of cell texts, headings, and every src/href attribute."""

    def __init__(self) -> None:
        super().__init__()
        self.tables: list[list[list[str]]] = []
        self.headings: list[str] = []
        self.links: list[str] = []
        self.paragraphs: list[str] = []
        self._cell: list[str] | None = None
        self._text: list[str] | None = None

    def handle_starttag(self, tag: str, attrs: list[tuple[str, str | None]]) -> None:
        for name, value in attrs:
            if name in ("src", "href") and value is not None:
                self.links.append(value)
        if tag == "table":
            self.tables.append([])
        elif tag == "tr":
            self.tables[-1].append([])
        elif tag in ("td", "th"):
            self._cell = []
        elif tag in ("h1", "h2", "h3", "p"):
            self._text = []

    def handle_endtag(self, tag: str) -> None:
        if tag in ("td", "th") and self._cell is not None:
            self.tables[-1][-1].append("".join(self._cell))
            self._cell = None
        elif tag in ("h1", "h2", "h3") and self._text is not None:
            self.headings.append("".join(self._text))
            self._text = None
        elif tag == "p" and self._text is not None:
            self.paragraphs.append("".join(self._text))
            self._text = None

    def handle_data(self, data: str) -> None:
        if self._cell is not None:
            self._cell.append(data)
        if self._text is not None:
            self._text.append(data)


@pytest.fixture(scope="module")
def page() -> _Reader:
    run = make_run()
    from tauscope.report.html_export import run_to_html

    reader = _Reader()
    reader.feed(run_to_html(run, charts={run.findings[1].name: _plan(run, 1)}))
    return reader


def _plan(run: RunRecord, index: int) -> ChartPlan:
    plan = plan_chart(run.findings[index].result)
    assert plan is not None
    return plan


def test_summary_table_shows_each_verdict_and_tau(page: _Reader) -> None:
    run = make_run()
    summary = page.tables[0]
    header, rows = summary[0], summary[1:]
    assert len(rows) == len(run.findings)
    for row, finding in zip(rows, run.findings, strict=True):
        result = finding.result
        assert row[header.index("Series")] == finding.name
        assert row[header.index("Verdict")] == result.verdict.label
        union = union_steps(result).get(0)
        if union is not None:  # the number that decided under the default strategy
            sign = ">" if union.decision == "reject" else "≤"
            assert row[header.index("Union M, levels")] == (
                f"{fmt.stat(union.statistic, 3)} ({sign}\u00a0{union.critical_value:.2f})")
        assert "τ, levels" not in header  # under the default the classic τ is in the path only
    classic = make_run(strategy="classic")
    from tauscope.report.html_export import run_to_html

    page_classic = _Reader()
    page_classic.feed(run_to_html(classic))
    header, rows = page_classic.tables[0][0], page_classic.tables[0][1:]
    for row, finding in zip(rows, classic.findings, strict=True):
        test = deciding_tau(finding.result, 0)
        if test is None:
            continue
        cell = row[header.index("τ, levels")]
        assert cell.startswith(fmt.stat(test.statistic, 3) + marker(test))


def test_one_section_per_series_with_its_decision_path(page: _Reader) -> None:
    run = make_run()
    for number, finding in enumerate(run.findings, start=1):
        assert f"{number}. {finding.name}" in page.headings
    path_tables = page.tables[1:]
    tested = [f.result for f in run.findings if f.result.ok]
    assert len(path_tables) == len(tested)
    for table, result in zip(path_tables, tested, strict=True):
        header, rows = table[0], table[1:]
        assert len(rows) == len(result.steps)
        assert [r[header.index("Decision")] for r in rows] == [s.decision for s in result.steps]
        assert [r[header.index("Value")] for r in rows] == [
            fmt.stat(s.statistic, 3) for s in result.steps]


def test_notes_and_methods_are_in_the_page(page: _Reader) -> None:
    run = make_run()
    for finding in run.findings:
        for note in finding.result.notes:
            assert note in page.paragraphs
    for paragraph in methods_for(run).paragraphs:
        assert paragraph in page.paragraphs
    assert "Methods" in page.headings and "References" in page.headings


def test_self_contained_with_the_chart_embedded(page: _Reader) -> None:
    assert page.links, "the chart should be there"
    assert all(link.startswith("data:image/svg+xml;base64,") for link in page.links)
    run = make_run()
    assert base64.b64decode(page.links[0].split(",", 1)[1]).decode() == chart_svg(_plan(run, 1))


def test_markup_special_characters_are_escaped(tmp_path: Path) -> None:
    export(tmp_path / "r.html", make_run())
    text = (tmp_path / "r.html").read_text(encoding="utf-8")
    assert "Real output &amp; &lt;prices&gt;" in text
    assert "<prices>" not in text
    assert FORMULA_NAME.replace('"', "&quot;") in text


def test_pdf_is_written_with_every_series(tmp_path: Path, qapp: object) -> None:
    import tauscope.ui.pdf_report  # noqa: F401  (registers the ".pdf" writer, which needs Qt)

    run = make_run()
    target = tmp_path / "findings.pdf"
    export(target, run, charts={run.findings[0].name: _plan(run, 0)})
    data = target.read_bytes()
    assert data.startswith(b"%PDF-")
    assert data.rstrip().endswith(b"%%EOF")
    if shutil.which("pdftotext") is None:
        pytest.skip("pdftotext (poppler-utils) is not installed to read the text back")
    text = subprocess.run(["pdftotext", "-layout", str(target), "-"], capture_output=True,
                          text=True, check=True, timeout=60).stdout
    flat = " ".join(unicodedata.normalize("NFKC", text).split())  # undo the "ﬁ" ligature
    for finding in run.findings:
        assert finding.result.verdict.label in flat
    assert "Order of integration: findings" in flat
    assert "Dolado" in flat
