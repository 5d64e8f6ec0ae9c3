"""Each report describes its own run: read back (openpyxl, html.parser, the .tex text, the PDF's
text, JSON, CSV), the methods text names the critical values the run used (tables or simulated)
and each test that ran, every series shows its sample and observations, and findings made with
other settings are left out with a visible note, never reported as current."""

from __future__ import annotations

import csv
import dataclasses
import json
import re
import shutil
import subprocess
import unicodedata
from pathlib import Path

import openpyxl
import pytest

from tauscope.report import RunRecord, export
from tauscope.report.methods import methods_for
from test_report_html import _Reader
from test_report_support import make_run

ALL_CHECKS = ("kpss", "pp", "dfgls", "za")
SIMULATED = "were simulated for this run"  # methods: simulated critical values
TABLES = "MacKinnon’s (2010) finite-sample response surfaces"  # methods: the published tables
TEST_WORDS = {"kpss": "KPSS test", "pp": "Phillips-Perron Zτ test", "dfgls": "DF-GLS test",
              "za": "Zivot-Andrews test"}


def _runs() -> dict[str, RunRecord]:
    return {"tables": make_run(), "simulated": make_run(exact=True, checks=ALL_CHECKS)}


def _check_methods(text: str, run: RunRecord, hyphens: bool = True) -> None:
    """The methods text matches the record: critical values, and each cross-check iff it ran.

    ``hyphens=False`` compares without hyphens (pdftotext joins "Zivot-" and "Andrews" at a
    line end into one word)."""

    def plain(words: str) -> str:
        return words if hyphens else words.replace("-", "")

    text = plain(" ".join(text.split()))
    simulated = run.settings.critical_values == "exact"
    assert (plain(SIMULATED) in text) == simulated
    assert (plain(TABLES) in text) == (not simulated)
    for test, words in TEST_WORDS.items():
        assert (plain(words) in text) == (test in run.tests_run), words
    assert f"Each of the {len(run.findings)} series" in text


@pytest.fixture(scope="module", params=["tables", "simulated"])
def written(request: pytest.FixtureRequest, tmp_path_factory: pytest.TempPathFactory
            ) -> tuple[RunRecord, Path]:
    run = _runs()[request.param]
    folder = tmp_path_factory.mktemp(request.param)
    for suffix in (".xlsx", ".html", ".tex", ".json"):
        export(folder / f"findings{suffix}", run)
    return run, folder


def test_the_record_knows_its_tests_and_critical_values() -> None:
    runs = _runs()
    assert runs["tables"].critical_value_source == "tables"
    assert runs["simulated"].critical_value_source == "simulated"
    # The size-controlled default adds its DF-GLS components to the tests run.
    assert runs["tables"].tests_run == ("adf", "phi1", "phi2", "phi3", "kpss", "dfgls")
    assert set(runs["simulated"].tests_run) == {"adf", "phi1", "phi2", "phi3", *ALL_CHECKS}
    for run in runs.values():
        _check_methods(methods_for(run).text, run)


def test_xlsx_about_sheet_and_summary(written: tuple[RunRecord, Path]) -> None:
    run, folder = written
    book = openpyxl.load_workbook(folder / "findings.xlsx")
    about = {row[0]: row[1] for row in book["About this run"].iter_rows(values_only=True)
             if row[0]}
    assert about["Critical values"].startswith(
        "simulated" if run.simulated_critical_values else "published tables")
    for test in run.tests_run:
        word = {"adf": "ADF", "phi1": "Φ1", "phi3": "Φ3", "kpss": "KPSS", "pp": "Phillips-Perron",
                "dfgls": "DF-GLS", "za": "Zivot-Andrews"}.get(test)
        if word:
            assert word in about["Tests that ran"]
    cells = [str(c) for row in book["About this run"].iter_rows(values_only=True) for c in row
             if c]
    _check_methods(" ".join(cells[cells.index("Methods") + 1:]), run)
    summary = list(book["Summary"].iter_rows(values_only=True))
    head = summary[0]
    for finding, row in zip(run.findings, summary[1:], strict=False):
        result = finding.result
        assert row[head.index("Series")] == finding.name
        if result.ok:
            assert result.span is not None
            assert row[head.index("Observations")] == result.nobs
            assert (row[head.index("First")], row[head.index("Last")]) == result.span


def test_html_methods_and_summary(written: tuple[RunRecord, Path]) -> None:
    run, folder = written
    reader = _Reader()
    reader.feed((folder / "findings.html").read_text(encoding="utf-8"))
    _check_methods(" ".join(reader.paragraphs), run)
    summary = reader.tables[0]
    head = summary[0]
    for finding, row in zip(run.findings, summary[1:], strict=True):
        result = finding.result
        assert row[0] == finding.name
        if result.ok:
            assert result.span is not None
            assert row[head.index("Obs.")] == str(result.nobs)
            assert row[head.index("Span")] == f"{result.span[0]} – {result.span[1]}"
    meta = reader.paragraphs[0]
    assert ("simulated at each regression" in meta) == run.simulated_critical_values


def test_tex_notes_and_rows(written: tuple[RunRecord, Path]) -> None:
    run, folder = written
    tex = (folder / "findings.tex").read_text(encoding="utf-8")
    notes = tex.split("\\parbox", 1)[1]
    assert ("simulated for this run" in notes) == run.simulated_critical_values
    assert ("MacKinnon (2010) for $\\tau$" in notes) == (not run.simulated_critical_values)
    for finding in run.findings:
        result = finding.result
        if result.ok:
            assert result.span is not None
            assert f"{result.span[0]}–{result.span[1]}".replace("–", "--") in tex
            assert f"$T = {result.nobs}$" in tex


def test_json_states_the_record(written: tuple[RunRecord, Path]) -> None:
    run, folder = written
    data = json.loads((folder / "findings.json").read_text(encoding="utf-8"))
    assert data["critical_values"] == run.critical_value_source
    assert data["tests_run"] == list(run.tests_run)
    assert data["settings"]["critical_values"] == run.settings.critical_values
    assert data["left_out"] == []


@pytest.mark.skipif(shutil.which("pdftotext") is None,
                    reason="poppler-utils (pdftotext) is not installed; .ci/run installs it")
@pytest.mark.parametrize("name", ["tables", "simulated"])
def test_pdf_methods_and_series(name: str, tmp_path: Path) -> None:
    import tauscope.ui.pdf_report  # noqa: F401  (registers ".pdf")

    run = _runs()[name]
    export(tmp_path / "findings.pdf", run)
    text = subprocess.run(["pdftotext", str(tmp_path / "findings.pdf"), "-"], capture_output=True,
                          text=True, check=True, timeout=60).stdout
    text = unicodedata.normalize("NFKC", text)  # ligatures ("ﬁ") back to letters
    _check_methods(text.split("Methods", 1)[-1], run, hyphens=False)
    flat = " ".join(text.split())
    for finding in run.findings:
        result = finding.result
        if result.ok:
            assert result.span is not None
            assert f"{result.span[0]} to {result.span[1]} · {result.nobs} observations" in flat


# --- findings made with other settings --------------------------------------------------------

@pytest.fixture(scope="module")
def mixed(tmp_path_factory: pytest.TempPathFactory) -> tuple[RunRecord, Path]:
    """A record at the 5% level holding one finding made at 10% (the window after a settings
    change and a run of only some series)."""
    current, old = make_run(alpha=0.05), make_run(alpha=0.10)
    findings = (current.findings[0], old.findings[1], current.findings[2])
    run = dataclasses.replace(current, findings=findings)
    folder = tmp_path_factory.mktemp("mixed")
    for suffix in (".xlsx", ".html", ".tex", ".json", ".csv"):
        written = export(folder / f"findings{suffix}", run)
        assert [f.name for f in written.findings] == [findings[0].name, findings[2].name]
        assert [f.name for f in written.left_out] == [findings[1].name]
    return run, folder


def test_the_record_moves_findings_made_with_other_settings_out() -> None:
    current, old = make_run(alpha=0.05), make_run(alpha=0.10)
    run = dataclasses.replace(current, findings=(current.findings[0], old.findings[1]))
    kept = run.current()
    assert [f.name for f in kept.findings] == [current.findings[0].name]
    assert kept.left_out[0].changed == ("alpha",)
    assert "significance level" in kept.left_out[0].reason
    assert current.current() is current  # nothing to leave out
    assert kept.select([old.findings[1].name]).left_out == kept.left_out


def test_stale_finding_is_left_out_of_every_report_with_a_note(mixed: tuple[RunRecord, Path]
                                                               ) -> None:
    run, folder = mixed
    stale = run.findings[1].name
    note = re.compile(re.escape(stale) + r": analysed with a different significance level")
    book = openpyxl.load_workbook(folder / "findings.xlsx")
    names = [r[0] for r in book["Summary"].iter_rows(min_row=2, values_only=True) if r[0]]
    assert stale not in names[:2] and any(note.search(str(n)) for n in names)
    about = [str(r[1]) for r in book["About this run"].iter_rows(values_only=True) if r[0]]
    assert any(note.search(text) for text in about)
    reader = _Reader()
    reader.feed((folder / "findings.html").read_text(encoding="utf-8"))
    assert stale not in [row[0] for row in reader.tables[0]]
    assert any(note.search(p) for p in reader.paragraphs)
    assert "Each of the 2 series" in " ".join(reader.paragraphs)
    tex = (folder / "findings.tex").read_text(encoding="utf-8")
    assert tex.count("\\raggedright") == 2 and "analysed with a different significance" in tex
    data = json.loads((folder / "findings.json").read_text(encoding="utf-8"))
    assert stale not in [s["name"] for s in data["series"]]
    assert data["left_out"][0]["name"] == stale and data["left_out"][0]["changed"] == ["alpha"]
    with (folder / "findings.csv").open(encoding="utf-8-sig", newline="") as handle:
        rows = list(csv.DictReader(handle))
    left = [r for r in rows if r["series"] == stale]
    assert len(left) == 1 and note.search(left[0]["error"]) and not left[0]["statistic"]
