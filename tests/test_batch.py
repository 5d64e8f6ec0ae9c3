"""``tauscope batch``: JSON equal to the engine's own results, tables, exit codes."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest

from tauscope.commands.batch import main
from tauscope.data import file_sha256, read_workbook
from tauscope.engine import Settings, analyse_series

DEMO = Path(__file__).resolve().parents[1] / "resources" / "demo" / "harbourline_demo.xlsx"


def _demo_like(tmp_path: Path) -> Path:
    """A workbook laid out like the demo: title row, blank row, header, quarterly labels."""
    rng = np.random.default_rng(3)
    walk = np.cumsum(rng.normal(size=60)) + 50
    noise = rng.normal(size=60)
    lines = ["Invented statistics office", "", "Period,Walk,Noise,Gappy"]
    for i in range(60):
        gappy = "NA" if i in (10, 11) else f"{walk[i] * 2:.4f}"
        lines.append(f"{1990 + i // 4}Q{i % 4 + 1},{walk[i]:.4f},{noise[i]:.4f},{gappy}")
    lines.append("Source: invented.")
    path = tmp_path / "demo_like.csv"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def _run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", "tauscope", "batch", *args],
                          capture_output=True, text=True, timeout=120, check=False)


def test_json_entries_equal_the_engine_and_input_is_unchanged(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    before = file_sha256(source)
    out = tmp_path / "findings.json"
    done = _run(str(source), "--series", "Walk", "--series", "Noise", "--max-difference", "1",
                "--lag-rule", "bic", "--out", str(out))
    assert done.returncode == 0, done.stderr
    assert file_sha256(source) == before
    written = json.loads(out.read_text(encoding="utf-8"))
    assert written["source"] == {"file": str(source.resolve()), "sha256": before}
    settings = Settings(lag_rule="bic", max_difference=1)
    assert written["settings"] == settings.to_dict()
    expected = [
        analyse_series(s.testable_values(), settings, name=s.name).to_dict()
        for s in read_workbook(source).series()[:2]
    ]
    assert written["series"] == json.loads(json.dumps(expected))
    assert [o["column"] for o in written["origins"]] == ["Walk", "Noise"]
    assert written["origins"][0]["frequency"] == "quarterly"


def test_gappy_series_is_refused_by_default_like_the_window(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "refused.json"
    assert main([str(source), "--series", "gappy", "--out", str(out)]) == 0
    (entry,) = json.loads(out.read_text(encoding="utf-8"))["series"]
    assert entry["nobs"] == 0 and entry["tests"] == []
    assert "2 missing values inside its sample (first at 1992Q3)" in entry["error"]
    assert "--gaps longest or --gaps fill" in entry["error"]


def test_gappy_series_filled_when_asked_and_says_so(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "filled.json"
    assert main([str(source), "--series", "gappy", "--gaps", "fill", "--max-difference", "1",
                 "--out", str(out)]) == 0
    (entry,) = json.loads(out.read_text(encoding="utf-8"))["series"]
    filled = read_workbook(source).series()[2].interpolated()
    expected = analyse_series(filled.testable_values(), Settings(max_difference=1), name="Gappy")
    assert entry["nobs"] == expected.nobs == 60 and entry["span"] == ["1990Q1", "2004Q4"]
    assert entry["tests"] == json.loads(json.dumps(expected.to_dict()["tests"]))
    assert "2 missing values inside “Gappy” were filled" in entry["notes"][0]


def test_sample_start_and_end_cut_the_series(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "sample.json"
    assert main([str(source), "--series", "walk", "--sample", "1995:2001Q2",
                 "--max-difference", "1", "--out", str(out)]) == 0
    (entry,) = json.loads(out.read_text(encoding="utf-8"))["series"]
    walk = read_workbook(source).series()[0]
    part = walk.values.loc["1995Q1":"2001Q2"]
    expected = analyse_series(part, Settings(max_difference=1), name="Walk")
    assert entry["span"] == ["1995Q1", "2001Q2"] and entry["nobs"] == expected.nobs
    assert entry["tests"] == json.loads(json.dumps(expected.to_dict()["tests"]))
    assert entry["notes"][0].startswith("Sample chosen for “Walk”: 1995Q1 to 2001Q2 (26 ")


def test_sample_outside_the_data_is_that_series_problem(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "outside.json"
    assert main([str(source), "--series", "walk", "--sample", "2010Q1:", "--out", str(out)]) == 0
    (entry,) = json.loads(out.read_text(encoding="utf-8"))["series"]
    assert "no observation at '2010Q1'" in entry["error"]


def test_a_sample_that_is_not_start_end_is_a_usage_error(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    assert main([str(_demo_like(tmp_path)), "--sample", "1995"]) == 2
    assert "START:END" in capsys.readouterr().err


def test_gappy_series_uses_longest_stretch_when_asked_and_says_so(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "g.json"
    assert main([str(source), "--series", "gappy", "--gaps", "longest", "--max-difference", "1",
                 "--out", str(out)]) == 0
    (entry,) = json.loads(out.read_text(encoding="utf-8"))["series"]
    gappy = read_workbook(source).series()[2]
    stretch = gappy.longest_stretch()
    assert stretch.span == ("1993Q1", "2004Q4")
    expected = analyse_series(stretch.testable_values(), Settings(max_difference=1), name="Gappy")
    assert entry["nobs"] == expected.nobs == 48
    assert entry["tests"] == json.loads(json.dumps(expected.to_dict()["tests"]))
    assert "longest stretch" in entry["notes"][0] and "1993Q1 to 2004Q4" in entry["notes"][0]


def test_table_on_stdout_and_transform(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    source = _demo_like(tmp_path)
    assert main([str(source), "--series", "Walk", "--transform", "log",
                 "--max-difference", "1"]) == 0
    out = capsys.readouterr().out.splitlines()
    assert out[0].split()[:4] == ["Series", "Obs", "Span", "Verdict"]
    result = analyse_series(
        np.log(read_workbook(source).series()[0].testable_values()), Settings(max_difference=1),
        name="log(Walk)")
    row = out[1]
    assert row.startswith("log(Walk)") and " 60 " in row and "1990Q1 to 2004Q4" in row
    assert result.verdict.label in row
    # the numbers that decided under the default strategy: the union's M on each difference
    union = [f"M {s.statistic:.2f}" for s in result.steps
             if s.statistic_name == "union" and s.strategy == result.verdict.strategy]
    assert union and all(m in row for m in union)


def test_log_of_negative_series_carries_an_error_and_batch_goes_on(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "e.json"
    assert main([str(source), "--series", "Noise", "--series", "Walk", "--transform", "log",
                 "--max-difference", "1", "--out", str(out)]) == 0
    noise, walk = json.loads(out.read_text(encoding="utf-8"))["series"]
    assert noise["error"].startswith("“Noise” cannot be logged")
    assert noise["verdict"]["order"] is None
    assert walk["error"] is None and walk["name"] == "log(Walk)"


@pytest.mark.skipif(not DEMO.exists(), reason="demo workbook not generated")
def test_demo_workbook_sheet(tmp_path: Path) -> None:
    out = tmp_path / "demo.json"
    done = _run(str(DEMO), "--sheet", "Annual", "--out", str(out))
    assert done.returncode == 0, done.stderr
    written = json.loads(out.read_text(encoding="utf-8"))
    (series,) = read_workbook(DEMO).sheet("Annual").series
    expected = analyse_series(series.testable_values(), Settings(), name=series.name).to_dict()
    assert written["series"] == [json.loads(json.dumps(expected))]
    assert written["source"]["sha256"] == file_sha256(DEMO)


@pytest.mark.parametrize(
    ("content", "suffix", "fragment"),
    [
        (bytes(range(256)) * 30, ".csv", "binary"),
        (b"PK\x03\x04" + bytes(200), ".xlsx", "damaged"),
        (b"", ".csv", "is empty"),
        (b"name,town\nAnna,Oslo\n", ".csv", "no column of numbers"),
    ],
)
def test_unreadable_input_exits_3_with_one_line(
    tmp_path: Path, capsys: pytest.CaptureFixture[str], content: bytes, suffix: str, fragment: str
) -> None:
    path = tmp_path / f"broken{suffix}"
    path.write_bytes(content)
    assert main([str(path)]) == 3
    captured = capsys.readouterr()
    assert captured.out == ""
    lines = captured.err.strip().splitlines()
    assert len(lines) == 1 and fragment in lines[0] and f"broken{suffix}" in lines[0]


def test_corrupt_workbook_as_subprocess_exits_3_without_traceback(tmp_path: Path) -> None:
    path = tmp_path / "corrupt.xlsx"
    path.write_bytes(b"PK\x03\x04" + bytes(range(256)) * 4)
    before = file_sha256(path)
    done = _run(str(path), "--out", str(tmp_path / "never.json"))
    assert done.returncode == 3
    assert done.stdout == "" and "Traceback" not in done.stderr
    (line,) = done.stderr.strip().splitlines()
    assert line.startswith("tauscope batch: corrupt.xlsx: ") and "damaged" in line
    assert not (tmp_path / "never.json").exists() and file_sha256(path) == before


def test_missing_sheet_and_series_exit_3(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    source = _demo_like(tmp_path)
    assert main([str(source), "--sheet", "Weekly"]) == 3
    assert capsys.readouterr().err.strip() == (
        "tauscope batch: demo_like.csv: has no sheet 'Weekly' (sheets: demo_like).")
    assert main([str(source), "--series", "Nothing"]) == 3
    assert "has no series 'Nothing' (series: Walk, Noise, Gappy)" in capsys.readouterr().err
    assert main([str(tmp_path / "absent.csv")]) == 3


@pytest.mark.parametrize(
    "args",
    [
        [],
        ["x.csv", "--alpha", "0.2"],
        ["x.csv", "--lags", "-1"],
        ["x.csv", "--lag-rule", "fixed"],
        ["x.csv", "--transform", "square"],
        ["x.csv", "--out", "findings.docx"],
        ["x.csv", "--max-difference", "3"],
        ["x.csv", "--bogus"],
    ],
)
def test_usage_errors_exit_2_with_one_line(
    args: list[str], capsys: pytest.CaptureFixture[str]
) -> None:
    assert main(args) == 2
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1 and err[0].startswith("tauscope batch:")


def test_unknown_output_format_is_named(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["x.csv", "--out", "a.docx"]) == 2
    assert capsys.readouterr().err.strip().startswith(
        "tauscope batch: --out a.docx: unknown output format '.docx' (known: ")


def test_lag_rule_choices_match_the_engine() -> None:
    from tauscope.commands.batch import _parser
    from tauscope.engine import LAG_RULES

    (action,) = [a for a in _parser()._actions if a.dest == "lag_rule"]
    assert tuple(action.choices or ()) == LAG_RULES


def test_progress_lines_for_many_series(tmp_path: Path) -> None:
    import io

    from tauscope.commands.batch import analyse_all

    rng = np.random.default_rng(5)
    lines = ["Year," + ",".join(f"S{k}" for k in range(6))]
    for year in range(1990, 2010):
        lines.append(f"{year}," + ",".join(f"{v:.3f}" for v in rng.normal(size=6)))
    path = tmp_path / "six.csv"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    stream = io.StringIO()
    findings = analyse_all(read_workbook(path).series(), Settings(max_difference=0), None,
                           progress=stream)
    assert stream.getvalue().splitlines() == [f"[{k + 1}/6] S{k}" for k in range(6)]
    assert [f.result.name for f in findings] == [f"S{k}" for k in range(6)]


def test_unwritable_output_exits_1_with_one_line(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    source = _demo_like(tmp_path)
    target = tmp_path / "no such folder" / "f.json"
    assert main([str(source), "--series", "Noise", "--max-difference", "0",
                 "--out", str(target)]) == 1
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1 and "f.json" in err[0]


def test_cross_checks_and_exact_critical_values_reach_the_engine(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "findings.json"
    assert main([str(source), "--series", "Noise", "--max-difference", "1",
                 "--check", "kpss,pp,dfgls", "--out", str(out)]) == 0
    written = json.loads(out.read_text(encoding="utf-8"))
    settings = Settings(max_difference=1, confirm=("kpss", "pp", "dfgls"))
    assert written["settings"] == settings.to_dict()
    series = read_workbook(source).series()[1]
    expected = analyse_series(series.testable_values(), settings, name=series.name).to_dict()
    assert written["series"] == [json.loads(json.dumps(expected))]
    assert {t["test"] for t in written["series"][0]["tests"]} >= {"kpss", "pp", "dfgls"}
    assert main([str(source), "--series", "Noise", "--max-difference", "0", "--check", "none",
                 "--exact", "--out", str(out)]) == 0
    written = json.loads(out.read_text(encoding="utf-8"))
    assert written["settings"]["critical_values"] == "exact"
    assert written["settings"]["confirm"] == []


def test_break_check_switch_reaches_the_engine(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    source = _demo_like(tmp_path)
    out = tmp_path / "findings.json"
    assert main([str(source), "--series", "Noise", "--break-check", "off", "--out", str(out)]) == 0
    written = json.loads(out.read_text(encoding="utf-8"))
    assert written["settings"] == Settings(break_check="off").to_dict()
    assert written["series"][0]["breaks"] is None
    assert main([str(source), "--series", "Noise", "--out", str(out)]) == 0
    assert json.loads(out.read_text(encoding="utf-8"))["settings"]["break_check"] == "automatic"
    assert main([str(source), "--break-check", "sometimes"]) == 2
    assert "sometimes" in capsys.readouterr().err


def test_unknown_cross_check_is_a_usage_error(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["whatever.csv", "--check", "kpss,guess"]) == 2
    assert "guess" in capsys.readouterr().err


def test_out_never_writes_over_the_input(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    book = tmp_path / "book.xlsx"
    book.write_bytes(DEMO.read_bytes())
    before, mtime = file_sha256(book), book.stat().st_mtime_ns
    for target in (book, tmp_path / "." / "book.xlsx"):
        assert main([str(book), "--out", str(target), "--replace"]) == 2
        err = capsys.readouterr().err.strip().splitlines()
        assert len(err) == 1 and "is the input file" in err[0]
    assert file_sha256(book) == before and book.stat().st_mtime_ns == mtime


def test_out_asks_before_writing_over_a_file_that_is_not_ours(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    source = _demo_like(tmp_path)
    theirs = tmp_path / "thesis.tex"
    theirs.write_text("\\documentclass{article}\n", encoding="utf-8")
    args = [str(source), "--series", "Noise", "--max-difference", "0", "--out", str(theirs)]
    assert main(args) == 2
    assert "add --replace" in capsys.readouterr().err
    assert theirs.read_text(encoding="utf-8") == "\\documentclass{article}\n"
    assert main([*args, "--replace"]) == 0
    assert theirs.read_text(encoding="utf-8").startswith("% Tauscope ")


def test_our_own_reports_are_replaced_without_asking(tmp_path: Path) -> None:
    source = _demo_like(tmp_path)
    outs = [tmp_path / f"findings{suffix}" for suffix in (".json", ".csv", ".html", ".tex", ".xlsx")]
    args = [str(source), "--series", "Noise", "--max-difference", "0"]
    for out in outs:
        args += ["--out", str(out)]
    assert main(args) == 0
    first = {out: out.read_bytes() for out in outs}
    assert main([*args, "--lag-rule", "bic"]) == 0  # every file recognised as ours
    assert all(out.read_bytes() != first[out] for out in outs if out.suffix != ".csv")


def test_reader_notes_go_to_stderr_on_one_line(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    source = _demo_like(tmp_path)
    assert main([str(source), "--series", "Noise", "--max-difference", "0"]) == 0
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1
    assert "1 title or note row above the header was skipped" in err[0]
    assert "1 row below the data (from row 64) was skipped" in err[0]
