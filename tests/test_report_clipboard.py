"""Clipboard text: tab-separated and HTML forms of the selected findings."""

from __future__ import annotations

from html.parser import HTMLParser

import pytest

from tauscope.report.clipboard import findings_html, findings_tsv
from tauscope.report.deciding import union_steps
from tauscope.report.tables import deciding_tau
from test_report_support import make_run


class _Cells(HTMLParser):
    def __init__(self) -> None:
        super().__init__()
        self.rows: list[list[str]] = []
        self._in_cell = False

    def handle_starttag(self, tag: str, attrs: list[tuple[str, str | None]]) -> None:
        if tag == "tr":
            self.rows.append([])
        elif tag in ("td", "th"):
            self._in_cell = True
            self.rows[-1].append("")

    def handle_endtag(self, tag: str) -> None:
        if tag in ("td", "th"):
            self._in_cell = False

    def handle_data(self, data: str) -> None:
        if self._in_cell:
            self.rows[-1][-1] += data


@pytest.mark.parametrize("strategy", ["union", "classic"])
def test_selection_as_tab_separated_text(strategy: str) -> None:
    run = make_run(strategy=strategy)
    chosen = run.select([run.findings[2].key or "", run.findings[0].name])
    assert [f.name for f in chosen.findings] == [run.findings[0].name, run.findings[2].name]
    lines = findings_tsv(chosen).splitlines()
    header = lines[0].split("\t")
    assert len(lines) == 3
    for line, finding in zip(lines[1:], chosen.findings, strict=True):
        cells = line.split("\t")
        assert len(cells) == len(header)
        assert cells[0] == finding.name
        assert cells[1] == finding.result.verdict.label
        compared = 0
        union = union_steps(finding.result)  # what decided under the size-controlled default
        for d, title in enumerate(("Union M, levels", "Union M, Δy", "Union M, Δ²y")):
            step = union.get(d)
            if step is None:
                assert title not in header or cells[header.index(title)] == ""
                continue
            assert float(cells[header.index(title)]) == round(step.statistic, 3)
            compared += 1
        assert (compared > 0) == (strategy == "union")
        for d, title in enumerate(("τ, levels", "τ, Δy", "τ, Δ²y")):
            if strategy == "union":  # the classic τ stays in the decision path only
                assert title not in header
                continue
            test = deciding_tau(finding.result, d)
            if test is None:
                assert title not in header or cells[header.index(title)] == ""
                continue
            assert float(cells[header.index(title)]) == round(test.statistic, 3)
            compared += 1
        assert compared >= 1


def test_html_table_holds_the_same_cells_as_the_text() -> None:
    run = make_run()
    parser = _Cells()
    parser.feed(findings_html(run))
    tsv = [line.split("\t") for line in findings_tsv(run).splitlines()]
    assert parser.rows == tsv
    assert findings_html(run).startswith("<table")


def test_summary_says_why_a_series_could_not_be_tested() -> None:
    run = make_run()
    failed = [f for f in run.findings if f.result.error]
    assert failed
    lines = findings_tsv(run).splitlines()
    header = lines[0].split("\t")
    assert header[-1] == "Problem"
    rows = {line.split("\t")[0]: line.split("\t") for line in lines[1:]}
    for finding in run.findings:
        assert rows[finding.name][-1] == (finding.result.error or "")
    tested_only = run.select([f.key or f.name for f in run.findings if not f.result.error])
    assert "Problem" not in findings_tsv(tested_only).splitlines()[0].split("\t")
