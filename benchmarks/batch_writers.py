"""What writing the findings costs ``tauscope batch``: every format against none, same run.

    python benchmarks/batch_writers.py [--series 500] [--length 240] [--rounds 2] [--jobs N]

Writes a generated workbook of ``--series`` monthly series of ``--length`` observations (a
fixed mix of I(0), I(1) and I(2), with and without trend or drift) to a temporary folder,
then runs ``tauscope batch`` on it in this process (``tauscope.commands.batch.main``),
alternating, ``--rounds`` times each:

- writing nothing (no ``--out``: the summary table goes to standard output, here discarded);
- writing every format: ``--out`` .xlsx, .csv, .json, .tex, .html and .pdf, with each
  series' chart (``ui/report_charts.draw_charts``, as the window's export makes them: plain
  data drawn as SVG in the .html, vectors in the .pdf, DrawingML shapes in the .xlsx), as
  batch does by default;
- writing every format with ``--no-charts``;
- writing every format, charts drawn, with ``--jobs 1``: every file written in this process,
  one after the other (by default batch shares the files out among helper processes, one
  per idle core, from 100 series on: ``tauscope.commands.batch_writing``, copies of this
  process on Linux; on a machine whose load average leaves no core idle besides the batch's
  own it writes as ``--jobs 1`` does, and the two runs agree).

``--jobs N`` passes ``--jobs N`` to the every-format runs with and without charts; by default
the batch chooses by the load average at that moment, and on a machine where the runs before
have raised it, it may choose one writer (the count the same rule gives just before each run
is printed).  It prints the best time of each and their ratios to writing nothing (the target
of issue 15 is at most 2), in wall time and in CPU time: this process's and its helper
processes' (the writers', counted once they have ended), so CPU time shows the work done, not
its overlap.  Then, on the findings of one analysis, the charts drawn alone (milliseconds per
series: the plans, then each drawn as SVG and as the .xlsx's shapes) and each format alone
through ``tauscope.report.export`` with those charts (best of ``--rounds``), in milliseconds
per series, with the file's size.

A first small run writing every format (charts included) comes before the timed ones, so that
imports (and the fonts' first reading) are not counted; its time is printed.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import contextlib
import datetime as dt
import io
import os
import sys
import tempfile
import time
from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING

import numpy as np

if TYPE_CHECKING:
    from tauscope.report.chart_plan import ChartPlan

FORMATS = (".xlsx", ".csv", ".json", ".tex", ".html", ".pdf")
KINDS = ("I(0)", "I(0) with trend", "I(1)", "I(1) with drift", "I(2)")


def series_matrix(count: int, length: int, seed: int = 7) -> np.ndarray:
    """``length`` × ``count`` values cycling through :data:`KINDS` (AR(1) noise, φ in
    [0.3, 0.8] for I(0), [0, 0.5] for the increments of I(1); I(2) cumulates an I(1))."""
    rng = np.random.default_rng(seed)
    t = np.arange(length, dtype=float)
    out = np.empty((length, count))
    for i in range(count):
        kind = KINDS[i % len(KINDS)]
        e = rng.standard_normal(length)
        phi = rng.uniform(0.3, 0.8) if kind.startswith("I(0)") else rng.uniform(0.0, 0.5)
        x = np.empty(length)
        x[0] = e[0]
        for s in range(1, length):
            x[s] = phi * x[s - 1] + e[s]
        if kind.startswith("I(0)"):
            x = x + 10.0 + (0.05 * t if kind.endswith("trend") else 0.0)
        else:
            x = 100.0 + np.cumsum((0.2 if kind.endswith("drift") else 0.0) + x)
            if kind == "I(2)":
                x = np.cumsum(x - 100.0) / 10.0
        out[:, i] = x
    return out


def write_workbook(path: Path, count: int, length: int) -> None:
    import openpyxl

    data = series_matrix(count, length)
    book = openpyxl.Workbook(write_only=True)
    sheet = book.create_sheet("Monthly")
    sheet.append(["Month", *[f"{KINDS[i % len(KINDS)]} #{i + 1}" for i in range(count)]])
    for t in range(length):
        sheet.append([dt.date(1990 + t // 12, t % 12 + 1, 1), *data[t].tolist()])
    book.save(path)


CPU: list[float] = []
"""The CPU seconds of each :func:`batch` run (this process and its ended helper processes),
in order (its wall seconds are returned): on a machine shared with other work, CPU time moves
far less from run to run."""


def cpu_seconds() -> float:
    """This process's CPU seconds and those of the child processes it has waited for."""
    times = os.times()
    return time.process_time() + times.children_user + times.children_system


def batch(argv: list[str]) -> float:
    from tauscope.commands.batch import main

    start, cpu = time.perf_counter(), cpu_seconds()
    with contextlib.redirect_stdout(io.StringIO()), contextlib.redirect_stderr(io.StringIO()):
        code = main(argv)
    elapsed = time.perf_counter() - start
    CPU.append(cpu_seconds() - cpu)
    if code != 0:
        raise SystemExit(f"tauscope batch {' '.join(argv)} ended with exit code {code}")
    return elapsed


def best(rounds: int, work: Callable[[], float]) -> float:
    return min(work() for _ in range(rounds))


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--series", type=int, default=500)
    parser.add_argument("--length", type=int, default=240)
    parser.add_argument("--rounds", type=int, default=2)
    parser.add_argument("--jobs", type=int, default=None,
                        help="writers for the every-format runs (default: the batch's own "
                             "choice, one per idle core by the load average)")
    args = parser.parse_args()
    from tauscope.commands.batch_writing import writer_count

    jobs = [] if args.jobs is None else ["--jobs", str(args.jobs)]
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

    with tempfile.TemporaryDirectory(prefix="tauscope-writers-") as name:
        folder = Path(name)
        source = folder / "batch.xlsx"
        write_workbook(source, args.series, args.length)
        small = folder / "small.xlsx"
        write_workbook(small, 10, args.length)
        outputs = [str(folder / f"findings{suffix}") for suffix in FORMATS]
        every = [arg for target in outputs for arg in ("--out", target)]

        warm = batch([str(small), *[a.replace("findings", "small-findings") for a in every]])
        print(f"warm-up: 10 series, every format, imports included: {warm:.2f} s")

        nothing: list[float] = []
        everything: list[float] = []
        bare: list[float] = []
        serial: list[float] = []
        CPU.clear()
        chosen: list[int] = []  # the writers the batch chose for each every-format run
        for _ in range(args.rounds):
            nothing.append(batch([str(source)]))
            chosen.append(writer_count(len(FORMATS), args.series, args.jobs))
            everything.append(batch([str(source), "--replace", *jobs, *every]))
            chosen.append(writer_count(len(FORMATS), args.series, args.jobs))
            bare.append(batch([str(source), "--replace", "--no-charts", *jobs, *every]))
            serial.append(batch([str(source), "--replace", "--jobs", "1", *every]))
        cpu_n, cpu_e, cpu_b, cpu_s = (min(CPU[k::4]) for k in range(4))
        n, e, b, s = min(nothing), min(everything), min(bare), min(serial)
        print(f"\ntauscope batch, {args.series} series × {args.length} observations "
              f"(best of {args.rounds})")
        for label, times in (("writing nothing:", nothing),
                             ("every format, charts drawn:", everything),
                             ("every format, --no-charts:", bare),
                             ("every format, --jobs 1:", serial)):
            print(f"  {label:28} {min(times):7.2f} s   (each run: "
                  f"{', '.join(f'{x:.2f}' for x in times)})")
        print(f"  writers for the every-format runs by the batch's rule just before each "
              f"(with charts, --no-charts, by round): "
              f"{', '.join(map(str, chosen))}" + (" (--jobs)" if jobs else " (load average)"))
        print(f"  ratio every format with charts / nothing: {e / n:.2f}  "
              "(issue 15 target: at most 2)")
        print(f"  ratio every format, --no-charts / nothing: {b / n:.2f}")
        print(f"  ratio every format, --jobs 1 / nothing: {s / n:.2f}  "
              f"(cores: {os.cpu_count()})")
        print(f"  in CPU time (best of {args.rounds}): nothing {cpu_n:.2f} s, every format "
              f"{cpu_e:.2f} s, --no-charts {cpu_b:.2f} s, --jobs 1 {cpu_s:.2f} s; ratios "
              f"{cpu_e / cpu_n:.2f} with charts, {cpu_b / cpu_n:.2f} without, "
              f"{cpu_s / cpu_n:.2f} with --jobs 1")

        per_format(source, folder, args.series, args.rounds)
    return 0


def per_format(source: Path, folder: Path, count: int, rounds: int) -> None:
    from tauscope.commands.batch import _parser, _settings, analyse_all, choose_series
    from tauscope.data import read_workbook
    from tauscope.report import RunRecord, SourceFile, export

    workbook = read_workbook(source)
    settings = _settings(_parser().parse_args([str(source)]))  # the batch's own defaults
    findings = analyse_all(choose_series(workbook, None, ()), settings,
                           progress=io.StringIO())
    from tauscope.ui.report_charts import draw_charts

    run = RunRecord(settings, (SourceFile(str(workbook.path), workbook.sha256),),
                    tuple(findings))
    drawings = [draw_charts(run) for _ in range(rounds)]
    drawn = min(drawings, key=lambda d: d.seconds)
    charts = drawn.charts
    print(f"\ncharts made alone, same {count} findings (best of {rounds}): "
          f"{drawn.seconds * 1000 / count:.2f} ms per series, {len(charts)} charts")
    import itertools

    from tauscope.report.chart_svg import chart_svg
    from tauscope.report.xlsx_chart import chart_shapes

    def shapes(plan: ChartPlan) -> str:
        return chart_shapes(plan, 0, itertools.count(2))

    for label, draw in (("as SVG", chart_svg), ("as the .xlsx's shapes", shapes)):
        start = time.perf_counter()
        size = sum(len(draw(plan)) for plan in charts.values())
        seconds = time.perf_counter() - start
        print(f"  drawn {label:20} {seconds * 1000 / count:6.2f} ms per series, "
              f"{size / 1e6:.2f} MB")
    print(f"\neach format alone with those charts, same {count} findings (best of {rounds}):")
    total = drawn.seconds
    for suffix in FORMATS:
        target = folder / f"alone{suffix}"

        def write(target: Path = target) -> float:
            start = time.perf_counter()
            export(target, run, charts)
            return time.perf_counter() - start

        seconds = best(rounds, write)
        total += seconds
        print(f"  {suffix:6} {seconds * 1000 / count:7.2f} ms per series  "
              f"{seconds:6.2f} s  {target.stat().st_size / 1e6:7.2f} MB")
    print(f"  all (charts included) {total * 1000 / count:7.2f} ms per series  {total:6.2f} s")


if __name__ == "__main__":
    sys.exit(main())
