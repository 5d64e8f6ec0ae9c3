"""The findings' export with charts written in the export process: the record sent one
finding at a time and rebuilt there, the same file as the helper thread writes, and a
problem there raised again in the window's process."""

from __future__ import annotations

from pathlib import Path

import pytest

pytest.importorskip("pytestqt")

from tauscope.data import read_workbook
from tauscope.engine import Settings, analyse_series
from tauscope.report import ExportError, RunRecord, SourceFile
from tauscope.report.run import Finding


@pytest.fixture
def record(small_workbook: Path) -> tuple[RunRecord, dict[str, object]]:
    settings = Settings()
    workbook = read_workbook(small_workbook)
    series = workbook.series()[:3]
    findings = tuple(Finding.from_series(analyse_series(s.testable_values(), settings, s.name), s)
                     for s in series)
    run = RunRecord(settings, (SourceFile(str(workbook.path), workbook.sha256),), findings)
    return run, {s.key: s.values for s in series}


def test_the_request_is_one_message_per_finding_and_rebuilds_the_record(
        record, tmp_path: Path, qapp) -> None:  # type: ignore[no-untyped-def]
    from tauscope.report import export
    from tauscope.ui.export_process import Written, iter_export, request
    from tauscope.ui.report_charts import draw_charts

    run, values = record
    messages = request(tmp_path / "there.html", run, values, with_charts=True)
    assert [kind for kind, _body in messages] == ["head", "finding", "finding", "finding"]
    assert messages[0][1].record.findings == ()
    assert list(iter_export(messages)) == [Written(3, 0, "")]
    series = {s.key: s for s in read_workbook(Path(run.sources[0].path)).series()}
    export(tmp_path / "here.html", run, draw_charts(run, series.get).charts)  # in this process
    there = (tmp_path / "there.html").read_text(encoding="utf-8")
    here = (tmp_path / "here.html").read_text(encoding="utf-8")
    assert there.count("data:image/svg+xml;base64,") == 3
    assert there == here


def test_the_export_process_writes_the_file_and_its_problems_come_back(
        record, tmp_path: Path) -> None:  # type: ignore[no-untyped-def]
    from tauscope.ui.export_process import Written, export_elsewhere, shared_exporter

    run, values = record
    written = export_elsewhere(tmp_path / "f.pdf", run, values, with_charts=True)
    assert written == Written(3, 0, "")
    assert shared_exporter().is_alive()
    data = (tmp_path / "f.pdf").read_bytes()
    assert data.startswith(b"%PDF-") and data.rstrip().endswith(b"%%EOF")
    with pytest.raises(ExportError, match="does not exist"):
        export_elsewhere(tmp_path / "no such folder" / "f.xlsx", run, values, with_charts=True)
    assert not (tmp_path / "no such folder").exists()
    again = export_elsewhere(tmp_path / "f.xlsx", run, values, with_charts=True)  # same child
    assert again == Written(3, 0, "") and (tmp_path / "f.xlsx").is_file()


def test_an_export_process_that_dies_leaves_the_writing_to_the_caller(
        record, tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:  # type: ignore[no-untyped-def]
    from tauscope.ui import engine_process, export_process
    from tauscope.ui.engine_process import EngineProcess

    dying = EngineProcess("engine_process_engines:ending")  # ends before it answers
    monkeypatch.setitem(engine_process._SHARED, export_process.EXPORTER, dying)
    run, values = record
    try:
        assert export_process.export_elsewhere(tmp_path / "f.html", run, values, True) is None
        assert not dying.is_alive() and not (tmp_path / "f.html").exists()
    finally:
        dying.shutdown()
