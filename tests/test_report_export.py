"""The shared export() entry: every suffix, clear errors, atomic writes, JSON read back,
and the demo workbook end to end."""

from __future__ import annotations

import csv
import json
import os
import stat
import sys
from pathlib import Path

import openpyxl
import pytest

from tauscope.engine import Settings, analyse_series
from tauscope.report import WRITERS, ExportError, Finding, RunRecord, SourceFile, export
from tauscope.report.study import json_clean
from test_report_support import make_run

DEMO = Path(__file__).resolve().parents[1] / "resources" / "demo" / "harbourline_demo.xlsx"


def test_one_writer_per_suffix() -> None:
    import tauscope.ui.pdf_report  # noqa: F401  (the Qt-based PDF writer registers ".pdf")

    assert {".json", ".csv", ".xlsx", ".tex", ".html"} <= set(WRITERS)
    assert set(WRITERS) == {".json", ".csv", ".xlsx", ".tex", ".html", ".pdf"}


def test_report_itself_loads_no_qt() -> None:
    import subprocess

    code = ("import sys, tauscope.report, tauscope.commands.batch; "
            "print(any(m.startswith('PySide6') for m in sys.modules))")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True,
                         timeout=60).stdout.strip()
    assert out == "False"


def test_unknown_suffix_names_the_file_and_the_known_formats(tmp_path: Path) -> None:
    with pytest.raises(ExportError, match=r"findings\.docx: unknown output format '\.docx'.*\.xlsx"):
        export(tmp_path / "findings.docx", make_run())
    assert not (tmp_path / "findings.docx").exists()


def test_missing_folder_is_one_clear_error(tmp_path: Path) -> None:
    with pytest.raises(ExportError, match="does not exist"):
        export(tmp_path / "no such folder" / "findings.csv", make_run())


def test_json_reads_back_as_the_engine_dictionaries(tmp_path: Path) -> None:
    run = make_run()
    export(tmp_path / "findings.json", run)
    data = json.loads((tmp_path / "findings.json").read_text(encoding="utf-8"))
    assert data["tauscope"] == run.version
    assert data["settings"] == run.settings.to_dict()
    assert data["source"] == {"file": run.sources[0].path, "sha256": run.sources[0].sha256}
    assert data["series"] == [json_clean(f.result.to_dict()) for f in run.findings]
    assert [o["key"] for o in data["origins"]] == [f.key for f in run.findings]


def test_a_failed_write_leaves_the_old_file_and_no_temporary(tmp_path: Path,
                                                            monkeypatch: pytest.MonkeyPatch) -> None:
    target = tmp_path / "findings.csv"
    target.write_text("old findings\n", encoding="utf-8")

    def refuse(*_args: object) -> None:
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "replace", refuse)
    with pytest.raises(ExportError, match="No space left on device"):
        export(target, make_run())
    assert target.read_text(encoding="utf-8") == "old findings\n"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["findings.csv"]


@pytest.mark.skipif(sys.platform == "win32", reason="POSIX permissions")
def test_new_files_are_not_private(tmp_path: Path) -> None:
    export(tmp_path / "findings.tex", make_run())
    assert stat.S_IMODE((tmp_path / "findings.tex").stat().st_mode) == 0o644


def _demo_run() -> RunRecord:
    try:
        from tauscope.data import read_workbook
    except ImportError:
        pytest.skip("tauscope.data has no read_workbook yet (data layer not written)")
    if not DEMO.is_file():
        pytest.skip(f"the demo workbook {DEMO.name} has not been generated")
    book = read_workbook(DEMO)
    settings = Settings()
    findings = []
    for series in book.series()[:4]:
        values = series.longest_stretch().testable_values()
        findings.append(Finding.from_series(analyse_series(values, settings, series.name), series))
    return RunRecord(settings, (SourceFile(str(book.path), book.sha256),), tuple(findings))


def test_demo_workbook_round_trips_through_csv_and_xlsx(tmp_path: Path) -> None:
    run = _demo_run()
    export(tmp_path / "demo.csv", run)
    export(tmp_path / "demo.xlsx", run)
    with open(tmp_path / "demo.csv", encoding="utf-8-sig", newline="") as handle:
        rows = [r for r in csv.DictReader(handle) if r["test"]]
    expected = [(f, t) for f in run.findings for t in f.result.tests]
    assert [(r["series"], r["test"], float(r["statistic"])) for r in rows] == [
        (f.name, t.test, t.statistic) for f, t in expected]
    assert {r["key"] for r in rows} == {f.key for f in run.findings}
    summary = openpyxl.load_workbook(tmp_path / "demo.xlsx")["Summary"]
    header = [c.value for c in summary[1]]
    got = [(r[header.index("Series")], r[header.index("Verdict")], r[header.index("File")])
           for r in summary.iter_rows(min_row=2, max_row=1 + len(run.findings), values_only=True)]
    assert got == [(f.name, f.result.verdict.label, DEMO.name) for f in run.findings]
    about = {r[0]: r[1] for r in openpyxl.load_workbook(tmp_path / "demo.xlsx")[
        "About this run"].iter_rows(values_only=True) if r[0]}
    assert about[DEMO.name] == run.sources[0].sha256
