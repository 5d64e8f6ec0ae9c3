"""``tauscope self-test``: the bundled demo passes, and a wrong expectation makes it fail."""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path
from typing import Any

import numpy as np
import pytest

from tauscope.commands import selftest
from tauscope.engine import analyse_series

REPO = Path(__file__).resolve().parents[1]
DEMO_EXPECTED = REPO / "resources" / "demo" / "expected_verdicts.json"


def run_cli(*args: str, cwd: Path | None = None) -> subprocess.CompletedProcess[str]:
    env = {**os.environ, "QT_QPA_PLATFORM": "offscreen"}
    return subprocess.run([sys.executable, "-m", "tauscope", *args], capture_output=True,
                          text=True, cwd=cwd, env=env, timeout=300, check=False)


@pytest.fixture(scope="module")
def tiny_workbook(tmp_path_factory: pytest.TempPathFactory) -> tuple[Path, dict[str, Any]]:
    """A two-series CSV and the verdicts the engine gives on the same numbers, so that the
    self-test is checked against an expectation computed here, not typed in."""
    folder = tmp_path_factory.mktemp("tiny")
    rng = np.random.default_rng(20240601)
    walk = np.cumsum(rng.normal(size=120)) + 50.0
    noise = rng.normal(size=120) + 10.0
    lines = ["Period,Walk,Noise"]
    for i in range(120):
        lines.append(f"{2000 + i // 4}Q{i % 4 + 1},{walk[i]:.6f},{noise[i]:.6f}")
    path = folder / "tiny.csv"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    expected: dict[str, Any] = {}
    for name, values in (("Walk", walk), ("Noise", noise)):
        rounded = np.array([float(f"{v:.6f}") for v in values])
        verdict = analyse_series(rounded, name=name).verdict
        expected[name] = {"order": verdict.order, "deterministic": verdict.deterministic}
    return path, {"tiny": expected}


def write_json(path: Path, data: Any) -> Path:
    path.write_text(json.dumps(data), encoding="utf-8")
    return path


def test_bundled_demo_passes_from_the_command_line() -> None:
    done = run_cli("self-test")
    assert done.returncode == 0, done.stdout + done.stderr
    expected = json.loads(DEMO_EXPECTED.read_text(encoding="utf-8"))
    count = sum(len(series) for series in expected.values())
    ok_lines = [line for line in done.stdout.splitlines() if line.startswith("ok ")]
    assert len(ok_lines) == count + 2  # every series, the analysis process, the PDF's fonts
    assert ok_lines[-2].startswith("ok   analysis process (3 series): the same results")
    assert ok_lines[-1].startswith("ok   PDF report in the bundled font: ")
    assert f"self-test passed ({count} series," in done.stdout
    for sheet, series in expected.items():
        for name, want in series.items():
            line = next(line for line in ok_lines if f"{sheet} / {name}:" in line)
            assert f"I({want['order']}), {want['deterministic']}" in line
    assert done.stdout.splitlines()[-1].startswith("self-test passed")
    assert "Traceback" not in done.stderr


def test_passes_on_a_small_workbook_with_matching_expectations(
        tiny_workbook: tuple[Path, dict[str, Any]], tmp_path: Path,
        capsys: pytest.CaptureFixture[str]) -> None:
    path, expected = tiny_workbook
    code = selftest.main(["--workbook", str(path),
                          "--expected", str(write_json(tmp_path / "e.json", expected))])
    out = capsys.readouterr().out
    assert code == 0, out
    assert out.splitlines()[-1].startswith("self-test passed (2 series")


def test_a_wrong_expected_order_fails(tiny_workbook: tuple[Path, dict[str, Any]],
                                      tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    path, expected = tiny_workbook
    wrong = json.loads(json.dumps(expected))
    wrong["tiny"]["Walk"]["order"] = 7  # no series is I(7): the self-test must notice
    code = selftest.main(["--workbook", str(path),
                          "--expected", str(write_json(tmp_path / "e.json", wrong))])
    out = capsys.readouterr().out
    assert code == 1
    last = out.splitlines()[-1]
    assert last.startswith("self-test FAILED: 1 problem(s)")
    assert "tiny / Walk: order is" in last and "expected 7" in last
    assert any(line.startswith("ok   tiny / Noise") for line in out.splitlines())


def test_a_wrong_deterministic_term_fails(tiny_workbook: tuple[Path, dict[str, Any]],
                                          tmp_path: Path,
                                          capsys: pytest.CaptureFixture[str]) -> None:
    path, expected = tiny_workbook
    wrong = json.loads(json.dumps(expected))
    wrong["tiny"]["Noise"]["deterministic"] = "quadratic"
    code = selftest.main(["--workbook", str(path), "--quiet",
                          "--expected", str(write_json(tmp_path / "e.json", wrong))])
    out = capsys.readouterr().out
    assert code == 1
    assert out.count("\n") == 1  # --quiet: only the final line
    assert "tiny / Noise: deterministic is" in out


def test_an_expected_series_missing_from_the_workbook_fails(
        tiny_workbook: tuple[Path, dict[str, Any]], tmp_path: Path,
        capsys: pytest.CaptureFixture[str]) -> None:
    path, expected = tiny_workbook
    more = json.loads(json.dumps(expected))
    more["tiny"]["Tide height"] = {"order": 0, "deterministic": "constant"}
    code = selftest.main(["--workbook", str(path),
                          "--expected", str(write_json(tmp_path / "e.json", more))])
    out = capsys.readouterr().out
    assert code == 1
    assert "tiny / Tide height: expected but not found in tiny.csv" in out


def test_a_series_without_expectation_fails(tiny_workbook: tuple[Path, dict[str, Any]],
                                            tmp_path: Path,
                                            capsys: pytest.CaptureFixture[str]) -> None:
    path, expected = tiny_workbook
    fewer = json.loads(json.dumps(expected))
    del fewer["tiny"]["Noise"]
    code = selftest.main(["--workbook", str(path),
                          "--expected", str(write_json(tmp_path / "e.json", fewer))])
    assert code == 1
    assert "tiny / Noise: no expected verdict" in capsys.readouterr().out


def test_unreadable_inputs_give_one_line_and_exit_1(
        tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    broken = write_json(tmp_path / "e.json", {"a": 1})
    assert selftest.main(["--expected", str(broken)]) == 1
    assert capsys.readouterr().out.splitlines() == [
        f"self-test FAILED: {broken} must map each sheet to {{series: {{order, deterministic}}}}"]
    not_json = tmp_path / "bad.json"
    not_json.write_text("{oops", encoding="utf-8")
    assert selftest.main(["--expected", str(not_json)]) == 1
    assert capsys.readouterr().out == f"self-test FAILED: {not_json} is not valid JSON (line 1)\n"
    missing = tmp_path / "nowhere.xlsx"
    assert selftest.main(["--workbook", str(missing), "--expected", str(DEMO_EXPECTED)]) == 1
    out = capsys.readouterr().out
    assert out.startswith("self-test FAILED:") and "nowhere.xlsx" in out
    assert out.count("\n") == 1


def test_self_test_does_not_import_qt(tiny_workbook: tuple[Path, dict[str, Any]],
                                      tmp_path: Path) -> None:
    path, expected = tiny_workbook
    expected_file = write_json(tmp_path / "e.json", expected)
    code = (
        "import sys\n"
        "from tauscope.cli import main\n"
        f"rc = main(['self-test', '--quiet', '--workbook', {str(path)!r}, "
        f"'--expected', {str(expected_file)!r}])\n"
        "qt = sorted(m for m in sys.modules if m.startswith(('PySide6', 'shiboken6', 'pyqtgraph')))\n"
        "print('QT-MODULES', qt)\n"
        "sys.exit(rc)\n"
    )
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                          timeout=300, check=False)
    assert done.returncode == 0, done.stdout + done.stderr
    assert "QT-MODULES []" in done.stdout


# --- the invariant checks, on hand-made result dictionaries -------------------------------

def adf(spec: str, cv: tuple[float, float, float] = (-3.5, -2.9, -2.6),
        p: float | None = 0.2) -> dict[str, Any]:
    return {"test": "adf", "spec": spec, "difference": 0, "p_value": p,
            "critical_values": {"1%": cv[0], "5%": cv[1], "10%": cv[2]}}


def good_result() -> dict[str, Any]:
    return {
        "name": "x", "nobs": 100, "error": None,
        "verdict": {"order": 1, "deterministic": "constant"},
        "steps": [{"statistic_name": "tau", "spec": "trend", "difference": 0,
                   "p_value": 0.4, "decision": "do not reject"}],
        "tests": [adf("trend"), adf("constant"), adf("none"),
                  {"test": "kpss", "spec": "constant", "difference": 0, "p_value": 0.01,
                   "critical_values": {"1%": 0.739, "5%": 0.463, "10%": 0.347}}],
    }


WANT = {"order": 1, "deterministic": "constant"}


def test_check_series_accepts_a_consistent_result() -> None:
    check = selftest.check_series("S / x", good_result(), WANT)
    assert check.problems == ()
    assert check.line == "ok   S / x: I(1), constant (n = 100)"


@pytest.mark.parametrize(("change", "problem"), [
    (lambda r: r["tests"].pop(2), "no ADF test with spec 'none' on the levels"),
    (lambda r: r["tests"].__setitem__(0, adf("trend", cv=(-2.9, -3.5, -2.6))),
     "critical values not ordered 1% < 5% < 10%"),
    (lambda r: r["tests"][3]["critical_values"].__setitem__("1%", 0.1),
     "critical values not ordered 1% > 5% > 10%"),
    (lambda r: r["tests"].append({**adf("trend", cv=(-3.1, -3.4, -4.0)), "test": "pp"}),
     "pp (trend, difference 0): critical values not ordered 1% < 5% < 10%"),
    (lambda r: r["tests"].__setitem__(1, adf("constant", p=1.2)), "p-value 1.2 is outside [0, 1]"),
    (lambda r: r["steps"][0].__setitem__("p_value", -0.1), "p-value -0.1 is outside [0, 1]"),
    (lambda r: r["tests"][0]["critical_values"].pop("10%"), "critical values missing"),
    (lambda r: r.__setitem__("notes", [float("nan")]), "not JSON-serialisable"),
    (lambda r: r.__setitem__("error", "too short"), "analysis failed: too short"),
    (lambda r: r.__setitem__("steps", []), "the decision path is empty"),
])
def test_check_series_reports_each_broken_invariant(change: Any, problem: str) -> None:
    result = good_result()
    change(result)
    check = selftest.check_series("S / x", result, WANT)
    assert check.line.startswith("FAIL S / x")
    assert any(problem in p for p in check.problems), check.problems


def test_an_expected_error_is_accepted_only_when_the_analysis_fails() -> None:
    failed = {**good_result(), "error": "too few observations", "tests": [], "steps": []}
    assert selftest.check_series("S / x", failed, {"error": True}).problems == ()
    assert selftest.check_series("S / x", good_result(), {"error": True}).problems == (
        "S / x: expected the analysis to fail, but it gave a verdict",)


def test_the_pdf_check_fails_when_the_bundled_fonts_are_missing(monkeypatch: Any) -> None:
    """A bundle without resources/fonts would write every PDF through Qt: the self-test says
    so instead of passing."""
    from tauscope.commands import selftest
    from tauscope.report import pdf_direct

    monkeypatch.setattr(pdf_direct, "resource_path", lambda *parts: None)
    pdf_direct.bundled_fonts.cache_clear()
    try:
        check = selftest.report_check([])
    finally:
        pdf_direct.bundled_fonts.cache_clear()
    assert check.line.startswith("FAIL PDF report in the bundled font: ")
    assert "DejaVuSans.ttf" in check.line and check.problems
