"""``tauscope self-test``: analyse the bundled demo workbook headless and check invariants.

    tauscope self-test [--workbook FILE] [--expected FILE] [--quiet]

Runs offline and without Qt, so it works in an installed bundle on a machine
with no display.  For every series of the demo workbook (a series with gaps
is judged on its longest gap-free stretch, as the demo's generator did) it
checks that

- the analysis ran without error (unless the expectation says ``"error": true``);
- the verdict's order and deterministic terms equal ``expected_verdicts.json``
  (``{sheet: {series: {"order": ..., "deterministic": ...}}}``);
- ``to_dict()`` is JSON-serialisable (no NaN or infinity either);
- the tests hold the ADF test for all three specs on the levels;
- critical values are ordered by level: for the left-tailed τ-type tests (ADF, PP,
  DF-GLS, Zivot-Andrews) cv(1%) < cv(5%) < cv(10%); for the right-tailed Φ and KPSS
  statistics the reverse;
- every p-value lies in [0, 1];

and that every expected series was found.  Then the first few series that gave a verdict
are analysed again in the analysis process the window uses (a child process:
``commands/selftest_process.py``), which must give the same results; in a frozen bundle this
checks that the bundle can start that process; and the same findings are written as a PDF
by the report's own writer, which checks that the bundle holds its fonts.  Prints one line per series, then
``self-test passed`` (exit 0) or ``self-test FAILED: ...`` (exit 1).  A workbook
that cannot be read is a failure with one clear line, never a traceback.
"""

from __future__ import annotations

import argparse
import json
import math
import sys
import time
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from tauscope.resources_path import resource_path, resource_roots

WORKBOOK_NAME = "harbourline_demo.xlsx"
EXPECTED_NAME = "expected_verdicts.json"
LEVEL_SPECS = ("trend", "constant", "none")
# Right-tailed statistics (large values reject): the Φ F tests and KPSS.  Every other
# test (ADF, PP, DF-GLS, Zivot-Andrews) rejects for small, negative values.
RIGHT_TAILED = ("phi1", "phi2", "phi3", "kpss")
PROCESS_SERIES = 3  # series analysed again in the analysis process
LEVELS = ("1%", "5%", "10%")
Expected = dict[str, dict[str, dict[str, Any]]]
Analysed = tuple[str, Any, Any]  # (series name, values, SeriesResult)


@dataclass(frozen=True)
class SeriesCheck:
    """What the self-test found for one series: a report line and any problems."""

    line: str
    problems: tuple[str, ...]


def main(argv: list[str]) -> int:
    parser = argparse.ArgumentParser(
        prog="tauscope self-test",
        description="Analyse the bundled demo workbook and check the results (offline, no window).",
    )
    parser.add_argument("--workbook", type=Path, default=None,
                        help="workbook to analyse (default: the bundled demo workbook)")
    parser.add_argument("--expected", type=Path, default=None,
                        help="expected verdicts (default: the bundled expected_verdicts.json)")
    parser.add_argument("--quiet", action="store_true", help="print only the final line")
    try:
        args = parser.parse_args(argv)
    except SystemExit as exc:  # argparse exits 2 on a usage error, 0 on --help
        return int(exc.code or 0)

    started = time.perf_counter()
    try:
        workbook_path = args.workbook or demo_folder() / WORKBOOK_NAME
        expected_path = args.expected or demo_folder() / EXPECTED_NAME
        expected = load_expected(expected_path)
        analysed: list[Analysed] = []
        checks = run_checks(workbook_path, expected, analysed)
    except SelfTestError as exc:
        print(f"self-test FAILED: {exc}")
        return 1
    series_count = len(checks)
    checks.append(process_check(analysed[:PROCESS_SERIES]))
    checks.append(report_check(analysed[:PROCESS_SERIES]))
    problems = [problem for check in checks for problem in check.problems]
    if not args.quiet:
        for check in checks:
            print(check.line)
    elapsed = time.perf_counter() - started
    if problems:
        print(f"self-test FAILED: {len(problems)} problem(s): " + "; ".join(problems))
        return 1
    print(f"self-test passed ({series_count} series, {elapsed:.1f} s)")
    return 0


class SelfTestError(Exception):
    """A problem that stops the self-test before any series is checked."""


def demo_folder() -> Path:
    """``resources/demo``, in a frozen bundle (``sys._MEIPASS``) or in the source checkout."""
    folder = resource_path("demo")
    if folder is None or not folder.is_dir():
        raise SelfTestError("the bundled demo data is missing (looked in "
                            + ", ".join(str(root / "demo") for root in resource_roots()) + ")")
    return folder


def load_expected(path: Path) -> Expected:
    """Read ``{sheet: {series: {"order", "deterministic"[, "error"]}}}`` from ``path``."""
    try:
        data = json.loads(path.read_text(encoding="utf-8"))
    except OSError as exc:
        raise SelfTestError(f"cannot read the expected verdicts {path}: {exc.strerror}") from exc
    except json.JSONDecodeError as exc:
        raise SelfTestError(f"{path} is not valid JSON (line {exc.lineno})") from exc
    if not isinstance(data, dict) or not all(
        isinstance(series, dict) and all(isinstance(e, dict) for e in series.values())
        for series in data.values()
    ):
        raise SelfTestError(f"{path} must map each sheet to {{series: {{order, deterministic}}}}")
    return data


def run_checks(workbook_path: Path, expected: Expected,
               analysed: list[Analysed] | None = None) -> list[SeriesCheck]:
    """Analyse every series of the workbook and check it against ``expected``; each
    series that gave a verdict is added to ``analysed`` (name, values, result)."""
    from tauscope.data import DataError, read_workbook
    from tauscope.engine import Settings, analyse_series

    try:
        workbook = read_workbook(workbook_path)
    except DataError as exc:
        raise SelfTestError(str(exc)) from exc
    except OSError as exc:
        raise SelfTestError(f"cannot read {workbook_path}: {exc.strerror}") from exc

    settings = Settings()
    checks: list[SeriesCheck] = []
    seen: set[tuple[str, str]] = set()
    for sheet in workbook.sheets:
        for series in sheet.series:
            seen.add((sheet.name, series.name))
            label = f"{sheet.name} / {series.name}"
            want = expected.get(sheet.name, {}).get(series.name)
            try:
                stretch = series.longest_stretch() if series.gaps else series
                values = stretch.testable_values()
            except DataError as exc:
                checks.append(SeriesCheck(f"FAIL {label}: {exc}", (f"{label}: {exc}",)))
                continue
            result = analyse_series(values, settings=settings, name=series.name)
            if analysed is not None and result.error is None:
                analysed.append((series.name, values, result))
            checks.append(check_series(label, result.to_dict(), want, gaps=bool(series.gaps)))
    for sheet_name, wanted in expected.items():
        for series_name in wanted:
            if (sheet_name, series_name) not in seen:
                problem = (f"{sheet_name} / {series_name}: expected but not found in "
                           f"{workbook_path.name}")
                checks.append(SeriesCheck(f"FAIL {problem}", (problem,)))
    return checks


def process_check(analysed: list[Analysed]) -> SeriesCheck:
    """``analysed``'s series analysed again in the window's analysis process: the same
    results, or one problem line."""
    from tauscope.commands.selftest_process import process_problems
    from tauscope.engine import Settings

    label = f"analysis process ({len(analysed)} series)"
    if not analysed:
        return SeriesCheck(f"FAIL {label}: no series gave a verdict to compare",
                           (f"{label}: no series to compare",))
    problems = process_problems([(name, values) for name, values, _ in analysed],
                                [result for _, _, result in analysed], Settings())
    if problems:
        return SeriesCheck(f"FAIL {label}: " + "; ".join(problems),
                           tuple(f"{label}: {p}" for p in problems))
    return SeriesCheck(f"ok   {label}: the same results as in this process", ())


def report_check(analysed: list[Analysed]) -> SeriesCheck:
    """``analysed``'s findings written as a PDF by the report's own writer: its bundled fonts
    are found and read (without them every PDF would go through Qt, slowly), or one problem
    line."""
    from tauscope.engine import Settings
    from tauscope.report import Finding, RunRecord
    from tauscope.report.pdf_direct import MissingGlyphs, run_to_pdf_direct

    label = "PDF report in the bundled font"
    run = RunRecord(Settings(), (), tuple(Finding(result) for _, _, result in analysed))
    try:
        data = run_to_pdf_direct(run)
    except MissingGlyphs as exc:
        return SeriesCheck(f"FAIL {label}: {exc}", (f"{label}: {exc}",))
    if not data.startswith(b"%PDF-") or b"/FontFile2" not in data:
        return SeriesCheck(f"FAIL {label}: not a PDF with its fonts", (f"{label}: no fonts",))
    return SeriesCheck(f"ok   {label}: {len(data) // 1024} KB", ())


def check_series(label: str, result: dict[str, Any], want: dict[str, Any] | None,
                 gaps: bool = False) -> SeriesCheck:
    """Check one ``SeriesResult.to_dict()`` against its expectation and the invariants."""
    problems: list[str] = []
    verdict = result.get("verdict") or {}
    error = result.get("error")
    expect_error = bool(want and want.get("error"))
    if want is None:
        problems.append("no expected verdict for this series")
    elif expect_error:
        if error is None:
            problems.append("expected the analysis to fail, but it gave a verdict")
    elif error is not None:
        problems.append(f"analysis failed: {error}")
    else:
        for key in ("order", "deterministic"):
            if verdict.get(key) != want.get(key):
                problems.append(f"{key} is {verdict.get(key)!r}, expected {want.get(key)!r}")
    try:
        json.dumps(result, allow_nan=False)
    except (TypeError, ValueError) as exc:
        problems.append(f"to_dict() is not JSON-serialisable ({exc})")
    if error is None:
        problems.extend(check_tests(result.get("tests") or []))
        problems.extend(check_steps(result.get("steps") or []))
    status = "ok  " if not problems else "FAIL"
    shown = "could not be tested" if error is not None else (
        f"I({verdict.get('order')}), {verdict.get('deterministic')}")
    stretch = ", longest gap-free stretch" if gaps else ""
    line = f"{status} {label}: {shown} (n = {result.get('nobs')}{stretch})"
    if problems:
        line += " — " + "; ".join(problems)
    return SeriesCheck(line, tuple(f"{label}: {p}" for p in problems))


def check_tests(tests: list[dict[str, Any]]) -> list[str]:
    """Invariants of the ``tests`` list: ADF for the three specs on the levels,
    critical values ordered by level, p-values in [0, 1]."""
    problems: list[str] = []
    for spec in LEVEL_SPECS:
        if not any(t.get("test") == "adf" and t.get("spec") == spec and t.get("difference") == 0
                   for t in tests):
            problems.append(f"no ADF test with spec {spec!r} on the levels")
    for test in tests:
        name = f"{test.get('test')} ({test.get('spec')}, difference {test.get('difference')})"
        problems.extend(_check_p_value(name, test.get("p_value")))
        table = test.get("critical_values") or {}
        if not all(isinstance(table.get(level), int | float) and math.isfinite(table[level])
                   for level in LEVELS):
            problems.append(f"{name}: critical values missing for 1%, 5% or 10%")
            continue
        values = [float(table[level]) for level in LEVELS]
        left = test.get("test") not in RIGHT_TAILED
        ordered = values[0] < values[1] < values[2] if left else values[0] > values[1] > values[2]
        if not ordered:
            relation = "<" if left else ">"
            problems.append(f"{name}: critical values not ordered 1% {relation} 5% {relation} 10% "
                            f"({', '.join(f'{v:.3f}' for v in values)})")
    return problems


def check_steps(steps: list[dict[str, Any]]) -> list[str]:
    """Every step of the decision path has a p-value in [0, 1] (or none) and a decision."""
    problems: list[str] = []
    if not steps:
        problems.append("the decision path is empty")
    for step in steps:
        name = (f"step {step.get('statistic_name')} ({step.get('spec')}, "
                f"difference {step.get('difference')})")
        problems.extend(_check_p_value(name, step.get("p_value")))
        if step.get("decision") not in ("reject", "do not reject"):
            problems.append(f"{name}: decision is {step.get('decision')!r}")
    return problems


def _check_p_value(name: str, p_value: float | None) -> list[str]:
    if p_value is None:
        return []
    if not (isinstance(p_value, int | float) and 0.0 <= p_value <= 1.0):
        return [f"{name}: p-value {p_value!r} is outside [0, 1]"]
    return []


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
