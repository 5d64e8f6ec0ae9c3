"""``tauscope batch`` writing its files in helper processes: the same files, failures named."""

from __future__ import annotations

import json
import re
from pathlib import Path

import numpy as np
import pytest

from tauscope.commands.batch import main
from tauscope.commands.batch_writing import Writers, plan_shares, writer_count
from tauscope.engine import Settings, analyse_series
from tauscope.report import Finding, RunRecord, SourceFile


def _workbook(tmp_path: Path) -> Path:
    rng = np.random.default_rng(11)
    walk = np.cumsum(rng.normal(size=48)) + 20
    noise = rng.normal(size=48)
    lines = ["Year,Walk,Noise"] + [f"{1950 + i},{walk[i]:.4f},{noise[i]:.4f}" for i in range(48)]
    path = tmp_path / "two.csv"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def _without_time(path: Path) -> str:
    """The file's text, the run's time stamp left out (each run has its own)."""
    if path.suffix == ".json":
        data = json.loads(path.read_text(encoding="utf-8"))
        data.pop("created")
        return json.dumps(data)
    return re.sub(r"\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d[+-]\d\d:\d\d", "(time)",
                  path.read_text(encoding="utf-8"))


def _noise_run(tmp_path: Path, seed: int) -> RunRecord:
    """A run of one finding ("Noise", white noise of 40 values) said to come from x.csv."""
    rng = np.random.default_rng(seed)
    result = analyse_series(rng.normal(size=40), Settings(max_difference=0), "Noise")
    return RunRecord(Settings(max_difference=0), (SourceFile(str(tmp_path / "x.csv"), "0" * 64),),
                     (Finding(result),))


def _needs_fork() -> None:
    from tauscope.commands import batch_writing

    if "fork" not in batch_writing.multiprocessing.get_all_start_methods():
        pytest.skip("no fork here")


def test_shares_put_the_largest_first_each_to_the_least_loaded() -> None:
    targets = ["a.tex", "a.csv", "a.html", "a.json", "a.xlsx", "a.pdf"]
    assert plan_shares(targets, 1) == [["a.pdf", "a.json", "a.xlsx", "a.html", "a.csv", "a.tex"]]
    # the PDF costs most: first, so always in this process's share (Qt, which it may need,
    # is never started in a forked copy); then each to the least loaded
    assert plan_shares(targets, 2) == [["a.pdf", "a.html", "a.csv", "a.tex"], ["a.json", "a.xlsx"]]
    assert plan_shares(["a.json"], 4) == [["a.json"], [], [], []]


def test_writers_one_per_idle_core_from_enough_series_or_as_asked() -> None:
    assert writer_count(6, 500, None, idle=2.0) == 2
    assert writer_count(6, 500, None, idle=0.2) == 1  # a busy machine: no helper
    assert writer_count(6, 99, None, idle=8.0) == 1  # too few series to pay a helper's start
    assert writer_count(3, 500, None, idle=8.0) == 3  # never more than the files
    assert writer_count(6, 5, 2) == 2 and writer_count(1, 500, 4) == 1
    assert writer_count(6, 500, 0) == 1


def test_the_batch_does_not_count_its_own_work_as_load(monkeypatch: pytest.MonkeyPatch) -> None:
    """On 2 cores, a load average of 1.06 left by a batch busy for the last minute (measured
    after a run in the benchmark's process): both cores write; the same load from other
    processes, with a batch just started, leaves one; a load of 3 leaves none for a helper."""
    from tauscope.commands import batch_writing

    monkeypatch.setattr(batch_writing.os, "cpu_count", lambda: 2)
    assert batch_writing.idle_cores(1.06, own=1.0) > 1.9
    assert writer_count(6, 500, None, idle=batch_writing.idle_cores(1.06, own=1.0)) == 2
    assert writer_count(6, 500, None, idle=batch_writing.idle_cores(1.06, own=0.02)) == 1
    assert batch_writing.idle_cores(3.0, own=1.0) == 0.0
    assert writer_count(6, 500, None, idle=batch_writing.idle_cores(3.0, own=1.0)) == 1
    assert batch_writing.idle_cores(0.0, own=0.0) == 2.0
    monkeypatch.setattr(batch_writing.time, "process_time", lambda: 600.0)  # a busy process
    assert batch_writing.idle_cores(1.5) == 1.5


def test_a_forked_helper_never_gets_a_pdf() -> None:
    """Qt, which a PDF may need (a name the bundled font cannot set), never starts in a copy
    of the batch's process: every .pdf is this process's."""
    writers = Writers(["a.pdf", "b.pdf", "c.xlsx", "d.json"], series=500, jobs=2, start="fork")
    assert {"a.pdf", "b.pdf"} <= set(writers.shares[0])
    assert all(not t.endswith(".pdf") for share in writers.shares[1:] for t in share)
    assert sorted(t for share in writers.shares for t in share) == ["a.pdf", "b.pdf", "c.xlsx",
                                                                    "d.json"]


@pytest.mark.parametrize("start", ["fork", "spawn"])
def test_helpers_write_the_same_files_as_one_writer(tmp_path: Path, start: str,
                                                     monkeypatch: pytest.MonkeyPatch) -> None:
    from tauscope.commands import batch_writing

    if start not in batch_writing.multiprocessing.get_all_start_methods():
        pytest.skip(f"no {start} here")
    monkeypatch.setattr(batch_writing, "START", start)
    source = _workbook(tmp_path)
    texts: dict[str, list[str]] = {}
    for jobs in ("1", "3"):
        folder = tmp_path / jobs
        folder.mkdir()
        outs = [arg for suffix in (".json", ".csv", ".tex", ".html")
                for arg in ("--out", str(folder / f"f{suffix}"))]
        assert main([str(source), "--max-difference", "1", "--jobs", jobs, *outs]) == 0
        texts[jobs] = [_without_time(folder / f"f{s}") for s in (".json", ".csv", ".tex", ".html")]
    assert texts["1"] == texts["3"]
    assert json.loads((tmp_path / "3" / "f.json").read_text(encoding="utf-8"))["series"]


def test_a_file_that_cannot_be_written_is_named_and_the_others_are_written(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    source = _workbook(tmp_path)
    good, bad = tmp_path / "good.csv", tmp_path / "no such folder" / "bad.json"
    assert main([str(source), "--max-difference", "0", "--jobs", "2",
                 "--out", str(bad), "--out", str(good)]) == 1
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1 and "bad.json" in err[0] and "good.csv" not in err[0]
    assert good.read_text(encoding="utf-8").lstrip("\ufeff").startswith("series,")
    assert not bad.parent.exists()


def test_files_a_lost_helper_did_not_write_are_written_here(tmp_path: Path) -> None:
    run = _noise_run(tmp_path, 2)
    targets = [str(tmp_path / "a.json"), str(tmp_path / "b.csv")]
    writers = Writers(targets, series=1, jobs=2, start="spawn")
    assert len(writers.helpers) == 1
    helper = writers.helpers[0]
    helper.process.kill()
    helper.process.join(30)
    assert writers.write(run, None) == []
    assert writers.helpers == []
    assert json.loads((tmp_path / "a.json").read_text(encoding="utf-8"))["series"][0]["name"] == (
        "Noise")
    assert (tmp_path / "b.csv").read_text(encoding="utf-8").lstrip("\ufeff").startswith("series,")


def test_files_a_lost_forked_helper_did_not_write_are_written_here(
        tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    from tauscope.commands import batch_writing
    _needs_fork()
    run = _noise_run(tmp_path, 3)
    targets = [str(tmp_path / "a.json"), str(tmp_path / "b.csv"), str(tmp_path / "c.tex")]
    # the copy ends before it writes or answers anything (copied with this stand-in)
    monkeypatch.setattr(batch_writing, "_write_share", lambda *args: batch_writing.os._exit(3))
    writers = Writers(targets, series=1, jobs=2, start="fork")
    assert len(writers.shares) == 2 and writers.shares[1]  # a share for a helper
    assert writers.helpers == []  # none until the findings are ready
    assert writers.write(run, None) == []
    assert json.loads((tmp_path / "a.json").read_text(encoding="utf-8"))["series"][0]["name"] == (
        "Noise")
    assert (tmp_path / "b.csv").read_text(encoding="utf-8").lstrip("\ufeff").startswith("series,")
    assert "Noise" in (tmp_path / "c.tex").read_text(encoding="utf-8")


def test_json_entries_encoded_during_the_analysis_make_the_same_file(
        tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    """With a core to spare on Linux, the .json file's entries are encoded by copies of the
    batch while it analyses (``batch_pieces``), and the file is written by the batch itself;
    its bytes are those one writer makes."""
    from tauscope.commands import batch_pieces, batch_writing
    _needs_fork()
    monkeypatch.setattr(batch_writing, "START", "fork")
    writers = Writers(["a.json", "b.xlsx", "c.csv", "d.pdf"], series=500, jobs=2)
    assert writers.pieces is not None and writers.shares[0][-1] == "a.json"  # written last
    assert Writers(["a.json", "b.csv"], series=500, jobs=1).pieces is None
    assert Writers(["a.json"], series=500, jobs=2, start="spawn").pieces is None
    used: list[bool] = []
    result = batch_pieces.EncodedPieces.result

    def watched(self: batch_pieces.EncodedPieces, *args: object, **kwargs: object) -> object:
        found = result(self, *args, **kwargs)  # type: ignore[arg-type]
        used.append(found is not None)
        return found

    monkeypatch.setattr(batch_pieces.EncodedPieces, "result", watched)
    source = _workbook(tmp_path)
    for jobs in ("1", "2"):
        if jobs == "2":  # the batch itself must not encode the entries: its copies did
            from tauscope.report import json_export

            def refused(findings: object) -> bytes:
                raise AssertionError("the entries were encoded at writing time")

            monkeypatch.setattr(json_export, "encode_series", refused)
        assert main([str(source), "--jobs", jobs, "--out", str(tmp_path / f"{jobs}.json"),
                     "--out", str(tmp_path / f"{jobs}.tex")]) == 0
    assert used == [True]
    one, two = ((tmp_path / f"{jobs}.json").read_bytes() for jobs in ("1", "2"))
    created = re.compile(rb'"created":"[^"]*"')
    assert created.sub(b"", one) == created.sub(b"", two)


def test_a_stuck_helper_is_ended_and_its_files_written_here(
        tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    """A helper that says nothing for longer than the batch allows (here 0.5 s) is ended, and
    the files it did not report are written by the batch: the batch never hangs on it."""
    import time

    from tauscope.commands import batch_writing
    _needs_fork()
    run = _noise_run(tmp_path, 4)
    targets = [str(tmp_path / "a.csv"), str(tmp_path / "b.tex")]
    monkeypatch.setattr(batch_writing, "_write_share", lambda *args: time.sleep(20))
    writers = Writers(targets, series=1, jobs=2, start="fork")
    writers.quiet_s = 0.5
    started = time.monotonic()
    assert writers.write(run, None) == []
    assert time.monotonic() - started < 10  # the stand-in sleeps 20 s
    assert (tmp_path / "a.csv").read_text(encoding="utf-8").lstrip("\ufeff").startswith("series,")
    assert "Noise" in (tmp_path / "b.tex").read_text(encoding="utf-8")
