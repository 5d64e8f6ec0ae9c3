"""Study files: save and reopen, damaged files, changed sources, autosave, and a re-run
to identical numbers through the data layer."""

from __future__ import annotations

import json
import os
import re
from dataclasses import replace
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

from tauscope.data import file_sha256
from tauscope.engine import Settings
from tauscope.report.study import (
    STUDY_FORMAT,
    STUDY_VERSION,
    Study,
    StudyError,
    StudySeries,
    autosave_path,
    check_sources,
    discard_autosave,
    findings_from_run,
    load_study,
    recover,
    recoverable_autosave,
    relocate,
    save_study,
    workbook_entry,
    write_autosave,
)
from test_report_support import make_run


def _csv_workbook(folder: Path, seed: int = 9) -> Path:
    """A small quarterly CSV with a random walk with drift and an AR(1) series."""
    rng = np.random.default_rng(seed)
    n = 100
    quarters = pd.period_range("1995Q1", periods=n, freq="Q").astype(str)
    level = np.exp(4.0 + np.cumsum(0.005 + 0.01 * rng.normal(size=n)))
    ar = np.zeros(n)
    for t in range(1, n):
        ar[t] = 0.5 * ar[t - 1] + rng.normal()
    lines = ["Quarter,Real output,Interest spread"]
    lines += [f"{q},{a:.6f},{b:.6f}" for q, a, b in zip(quarters, level, ar, strict=True)]
    path = folder / "macro.csv"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def _study(folder: Path) -> Study:
    source = _csv_workbook(folder)
    run = make_run()
    series = (
        StudySeries("macro.csv|macro|Real output|log,diff", "Δ(log(Real output))", str(source),
                    "macro", "Real output", ("log", "diff")),
        StudySeries("macro.csv|macro|Interest spread|", "Interest spread", str(source), "macro",
                    "Interest spread", (), "interpolate"),
    )
    return Study(Settings(lag_rule="bic", alpha=0.10, max_lags=6),
                 (workbook_entry(source, sheets=["macro"]),), series, findings_from_run(run))


def test_saved_study_reopens_with_the_same_settings_series_and_findings(tmp_path: Path) -> None:
    study = _study(tmp_path)
    path = tmp_path / "analysis.tauscope"
    saved = save_study(path, study)
    loaded = load_study(path)
    assert loaded.settings == study.settings
    assert loaded.keys == study.keys
    assert loaded.series == study.series
    assert loaded.workbooks[0].path == study.workbooks[0].path
    assert loaded.workbooks[0].sha256 == file_sha256(tmp_path / "macro.csv")
    assert loaded.findings == study.findings
    assert loaded.saved == saved.saved
    raw = json.loads(path.read_text(encoding="utf-8"))
    assert (raw["format"], raw["version"]) == (STUDY_FORMAT, STUDY_VERSION)
    assert raw["workbooks"][0]["relative"] == "macro.csv"


def test_findings_in_the_study_are_the_engine_dictionaries(tmp_path: Path) -> None:
    run = make_run()
    path = tmp_path / "s.tauscope"
    save_study(path, Study(run.settings, findings=findings_from_run(run)))
    loaded = load_study(path)
    assert [f["key"] for f in loaded.findings] == [f.key for f in run.findings]
    first = run.findings[0].result
    stored = loaded.findings[0]["result"]
    assert stored["verdict"] == first.verdict.to_dict()
    assert [s["statistic"] for s in stored["steps"]] == [s.statistic for s in first.steps]
    assert [t["p_value"] for t in stored["tests"]] == [t.p_value for t in first.tests]


def _cut_positions(text: bytes) -> list[int]:
    """Cut points of every kind: between tokens, inside a path string, inside an escape,
    inside a number and a literal, inside a multi-byte character, and a spread of others
    (the study's length depends on the folder it is saved in, so no single cut is enough)."""
    end = len(text.rstrip())  # a cut in the trailing newline leaves the study whole
    positions = {1, 2, end // 2, end - 1, end - 2}
    positions.update(range(3, end - 1, max(1, end // 97)))
    for marker in (b'"path": "', b"\\u", b"\\", b"e-0", b".", b"true", b"false", b"null",
                   "Δ".encode(), b'": ', b"],", b"},"):
        start = text.find(marker)
        if start >= 0:
            positions.update(range(start, min(end - 1, start + len(marker) + 6)))
    return sorted(p for p in positions if 0 < p < end)


def test_cut_short_study_gives_a_clear_error_wherever_the_cut_falls(tmp_path: Path) -> None:
    path = tmp_path / "cut.tauscope"
    save_study(path, _study(tmp_path))
    whole = path.read_bytes()
    positions = _cut_positions(whole)
    assert len(positions) > 100
    for cut in positions:
        path.write_bytes(whole[:cut])
        with pytest.raises(StudyError) as caught:
            load_study(path)
        message = str(caught.value)
        assert "cut.tauscope" in message and "cut short" in message, (cut, whole[cut - 20:cut])
        assert "Traceback" not in message
        assert path.read_bytes() == whole[:cut]  # loading never writes


def test_cut_short_rule_holds_at_every_position_of_a_text_with_every_token_kind() -> None:
    """Every proper prefix of a JSON text with strings, escapes, numbers and literals is cut
    short; the rule does not depend on where the cut falls (json module as the reference)."""
    from tauscope.report.study_text import ends_before_complete

    document = {"a": [1, -2.5e-3, True, False, None, 'x\\y"z\u00e9\u2603 \n\t'],
                "path": "C:\\Users\\me\\data.xlsx", "e": [], "f": {}, "g": 0, "h": 1e10}
    for ascii_only in (True, False):
        for indent in (None, 2):
            text = json.dumps(document, indent=indent, ensure_ascii=ascii_only)
            for cut in range(1, len(text)):
                with pytest.raises(json.JSONDecodeError) as caught:
                    json.loads(text[:cut])
                assert ends_before_complete(text[:cut], caught.value), text[:cut]


@pytest.mark.parametrize("broken", ['{"a": tru}', '{"a": 1,, "b": 2}', '{"a": "x"  "b"}',
                                    '{"a": [1 2]}', '{"a": "\\q"}', '{"a" 1}', '{"a": 1}}'])
def test_edited_json_is_not_mistaken_for_a_cut(broken: str) -> None:
    from tauscope.report.study_text import ends_before_complete

    with pytest.raises(json.JSONDecodeError) as caught:
        json.loads(broken)
    assert not ends_before_complete(broken, caught.value)


def test_study_edited_into_invalid_json_names_line_and_column(tmp_path: Path) -> None:
    path = tmp_path / "edited.tauscope"
    save_study(path, _study(tmp_path))
    text = path.read_text(encoding="utf-8")
    opening = re.search(r'"settings":\s*\{', text)  # the file is compact JSON; any spacing
    assert opening is not None
    broken = text[: opening.end()] + "," + text[opening.end():]
    path.write_text(broken, encoding="utf-8")
    line = broken[: opening.start()].count("\n") + 1
    with pytest.raises(StudyError, match=rf"edited\.tauscope .*not valid JSON at line {line}, "):
        load_study(path)
    assert path.read_text(encoding="utf-8") == broken


@pytest.mark.parametrize(("content", "message"), [
    ("", "is empty"),
    ("[1, 2]", "not a Tauscope study"),
    ('{"format": "something-else", "version": 1}', "not a Tauscope study"),
    ('{"format": "tauscope-study", "version": 99}', "newer Tauscope"),
    ('{"format": "tauscope-study", "version": 1, "settings": {"alpha": 0.2}, "workbooks": [],'
     ' "series": []}', "settings are not valid"),
    ('{"format": "tauscope-study", "version": 1, "settings": {}, "workbooks": [{}], "series": []}',
     "workbook entry 1 has no “path”"),
])
def test_wrong_content_gives_one_sentence(tmp_path: Path, content: str, message: str) -> None:
    path = tmp_path / "odd.tauscope"
    path.write_text(content, encoding="utf-8")
    with pytest.raises(StudyError, match=message):
        load_study(path)


def test_missing_study_file_is_a_study_error(tmp_path: Path) -> None:
    with pytest.raises(StudyError, match="does not exist"):
        load_study(tmp_path / "nowhere.tauscope")


def test_failed_save_keeps_the_previous_study(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    path = tmp_path / "keep.tauscope"
    save_study(path, _study(tmp_path))
    before = path.read_bytes()

    def refuse(*_args: object) -> None:
        raise OSError(13, "Permission denied")

    monkeypatch.setattr(os, "replace", refuse)
    with pytest.raises(StudyError, match="previous version is unchanged"):
        save_study(path, Study(Settings()))
    assert path.read_bytes() == before
    assert sorted(p.name for p in tmp_path.iterdir()) == ["keep.tauscope", "macro.csv"]


def test_changed_moved_and_missing_sources_are_detected(tmp_path: Path) -> None:
    study = _study(tmp_path)
    study_path = tmp_path / "a.tauscope"
    source = tmp_path / "macro.csv"
    assert check_sources(study, study_path) == [(str(source.resolve()), "ok")]
    data = source.read_bytes()
    source.write_bytes(data.replace(b"1995Q1,", b"1995Q1,1", 1))  # one digit more
    assert check_sources(study, study_path) == [(str(source.resolve()), "changed")]
    source.write_bytes(data)
    assert check_sources(study, study_path)[0][1] == "ok"
    source.unlink()
    assert check_sources(study, study_path) == [(str(source.resolve()), "missing")]


def test_study_moved_together_with_its_workbook_still_finds_it(tmp_path: Path) -> None:
    first = tmp_path / "first"
    first.mkdir()
    save_study(first / "s.tauscope", _study(first))
    moved = tmp_path / "moved"
    first.rename(moved)
    study = load_study(moved / "s.tauscope")
    assert check_sources(study, moved / "s.tauscope")[0][1] == "ok"
    assert check_sources(study)[0][1] == "missing"  # without the study's place


def test_relocate_points_workbook_and_series_at_the_new_file(tmp_path: Path) -> None:
    study = _study(tmp_path)
    new = tmp_path / "macro_v2.csv"
    (tmp_path / "macro.csv").rename(new)
    old_path = study.workbooks[0].path
    found = relocate(study, old_path, new)
    assert found.workbooks[0].path == str(new.resolve())
    assert found.workbooks[0].sha256 == study.workbooks[0].sha256
    assert [s.key.split("|")[0] for s in found.series] == ["macro_v2.csv", "macro_v2.csv"]
    assert check_sources(found) == [(str(new.resolve()), "ok")]


def test_autosave_is_offered_back_only_when_newer_and_readable(tmp_path: Path) -> None:
    study_path = tmp_path / "work.tauscope"
    assert autosave_path(study_path, tmp_path) == tmp_path / "work.tauscope.autosave"
    assert autosave_path(None, tmp_path / "data") == tmp_path / "data" / "untitled.tauscope.autosave"
    study = _study(tmp_path)
    save_study(study_path, study)
    assert recoverable_autosave(study_path, tmp_path) is None
    auto = write_autosave(study_path, tmp_path, study)
    later = study_path.stat().st_mtime + 5
    os.utime(auto, (later, later))
    assert recoverable_autosave(study_path, tmp_path) == auto
    recovered = recover(study_path, tmp_path)
    assert recovered is not None and recovered.keys == study.keys
    earlier = study_path.stat().st_mtime - 5
    os.utime(auto, (earlier, earlier))
    assert recoverable_autosave(study_path, tmp_path) is None  # the saved study is newer
    os.utime(auto, (later, later))
    auto.write_text('{"format": "tauscope-study", "vers', encoding="utf-8")
    os.utime(auto, (later, later))
    assert recoverable_autosave(study_path, tmp_path) is None  # damaged autosave
    discard_autosave(study_path, tmp_path)
    assert not auto.exists()
    assert study_path.exists()


def test_untitled_autosave_round_trip(tmp_path: Path) -> None:
    study = Study(Settings(alpha=0.01))
    write_autosave(None, tmp_path, study)
    recovered = recover(None, tmp_path)
    assert recovered is not None and recovered.settings == study.settings


def test_study_reruns_to_identical_numbers(tmp_path: Path) -> None:
    try:
        from tauscope.data import make_transform, read_workbook
    except ImportError:
        pytest.skip("tauscope.data has no read_workbook yet (data layer not written)")
    from tauscope.report.rerun import rerun
    from tauscope.report.study import series_entry

    source = _csv_workbook(tmp_path)
    book = read_workbook(source)
    level, spread = book.series()
    chosen = [(make_transform(make_transform(level, "log"), "diff"), "none"), (level, "none"),
              (spread, "none")]
    settings = Settings(lag_rule="hqc", alpha=0.10)
    first = Study(settings, (workbook_entry(book.path, book.sha256, ["macro"]),),
                  tuple(series_entry(s, gaps) for s, gaps in chosen))
    run, problems = rerun(first)
    assert problems == ()
    study = Study(first.settings, first.workbooks, first.series, findings_from_run(run))
    path = tmp_path / "rerun.tauscope"
    save_study(path, study)
    del study, run

    reopened = load_study(path)
    assert check_sources(reopened, path) == [(str(source.resolve()), "ok")]
    again, problems = rerun(reopened, path)
    assert problems == ()
    assert [f.key for f in again.findings] == list(reopened.keys)
    assert findings_from_run(again) == reopened.findings  # every number, exactly
    assert again.findings[0].name == "Δ(log(Real output))"


def test_findings_handed_over_unclean_are_cleaned_when_saved(tmp_path: Path) -> None:
    """A finding with a non-finite number (JSON has none) is saved with null in its place."""
    path = tmp_path / "unclean.tauscope"
    study = _study(tmp_path)
    unclean = {"key": "k", "result": {"statistic": float("nan"), "values": (1.0, float("inf"))}}
    save_study(path, replace(study, findings=(*study.findings, unclean)))
    saved = json.loads(path.read_text(encoding="utf-8"))["findings"][-1]
    assert saved == {"key": "k", "result": {"statistic": None, "values": [1.0, None]}}
    assert load_study(path).findings[:-1] == study.findings


def test_compact_text_equals_one_call_and_still_refuses_non_finite_numbers() -> None:
    """The study's text made finding by finding (so no single call holds the interpreter lock
    for long), joined, is the very text of one json.dumps call on the whole."""
    from tauscope.report.study_text import compact_dumps

    data = {"format": "x", "findings": [{"key": "a", "v": [1.5, None, "é"]}, {"key": "b"}],
            "tail": {"z": 1}}
    one = json.dumps(data, ensure_ascii=False, allow_nan=False, separators=(",", ":")) + "\n"
    assert "".join(compact_dumps(data)) == one
    assert len(compact_dumps(data)) == 4  # the head, each finding, the tail: written in turn
    assert compact_dumps({"findings": []}) == ['{"findings":[]}\n']
    with pytest.raises(ValueError):  # save_study then cleans the findings and tries again
        compact_dumps({"findings": [{"v": float("nan")}]})
