"""``tauscope batch FILE [options]``: the whole analysis without the window.

Reads the workbook (read-only), picks the sheet and series asked for, cuts each to the
sample asked for (``--sample START:END``), handles gaps by the window's rule (``--gaps``:
``refuse`` by default, so a series with missing values inside its sample is reported as
not tested and says how to go on; ``longest`` tests its longest stretch without gaps,
``fill`` fills the gaps by straight lines; the notes say which), applies one
transformation to each, runs the engine on every series and writes the findings
(``--out``, format by suffix) or prints a table.  The .xlsx, .html and .pdf reports hold
each series' chart, made as the window's export makes it (``tauscope.ui.report_charts``) and
drawn per format (the .pdf and the .xlsx's picture on Qt's offscreen platform, so no display
is needed; ``--no-charts`` leaves them out); a chart that cannot be made is left out with a
note on standard error.  The reader's notes (rows skipped, sheets
empty, dates guessed) go to standard error on one line.

From 100 series on, the ``--out`` files are written side by side, one process per idle
core (``--jobs N`` sets how many; ``--jobs 1`` writes them one after the other here): helper
processes start while the series are analysed (:mod:`tauscope.commands.batch_writing`).
The files are the same either way; each is written whole or not at all.

``--out`` never writes over an input file, nor over an existing file that is not one of
our own reports unless ``--replace`` is given (:mod:`tauscope.report.ownership`).

Exit codes: 0 done (also when some series could not be tested; they carry ``error``),
2 usage error, 3 the input cannot be read (one line on standard error), 1 a findings file
could not be written (one line on standard error, naming it and any other not written; the
other files are written).
"""

from __future__ import annotations

import argparse
import dataclasses
import gc
import sys
from collections.abc import Callable, Mapping, Sequence
from pathlib import Path
from typing import NoReturn, TextIO

from tauscope.commands.batch_writing import Writers
from tauscope.commands.console_summary import summary_table
from tauscope.data import DataError, SeriesData, Workbook, make_transform, read_workbook
from tauscope.data.notes import reader_notes
from tauscope.data.sample import GAP_RULES, apply_gap_rule, cut_sample, parse_sample
from tauscope.engine import (
    BREAK_CHECK_MODES,
    LAG_RULES,
    SEASONAL_MODES,
    STRATEGIES,
    SeriesResult,
    Settings,
    iter_analyse,
)
from tauscope.engine.collector import collector_paused
from tauscope.engine.procedure.many import CHUNK
from tauscope.engine.results import failed_result
from tauscope.report import (
    CHART_FORMATS,
    WRITERS,
    Charts,
    Finding,
    RunRecord,
    SourceFile,
    is_own_report,
)
from tauscope.report.ownership import same_file
from tauscope.ui import pdf_report  # noqa: F401  (registers ".pdf"; Qt loads only when used)

EXIT_DONE, EXIT_USAGE, EXIT_INPUT, EXIT_OUTPUT = 0, 2, 3, 1
TRANSFORM_CHOICES = ("none", "log", "diff", "logdiff")


class UsageError(Exception):
    """A command-line mistake; the message is one line."""


class _Parser(argparse.ArgumentParser):
    def error(self, message: str) -> NoReturn:
        raise UsageError(message)

    def exit(self, status: int = 0, message: str | None = None) -> NoReturn:
        if message:
            print(message, file=sys.stderr, end="")
        raise SystemExit(status)


def _parser() -> _Parser:
    parser = _Parser(prog="tauscope batch", description=(
        "Analyse every series of a workbook without opening the window."))
    parser.add_argument("file", help="CSV or Excel file to analyse")
    parser.add_argument("--sheet", help="analyse only this sheet")
    parser.add_argument("--series", action="append", default=[], metavar="NAME",
                        help="analyse only this series (repeat for more)")
    parser.add_argument("--transform", choices=TRANSFORM_CHOICES, default="none",
                        help="transform each series first (default: none)")
    parser.add_argument("--lag-rule", choices=LAG_RULES, default="maic",
                        help="how the lag order is chosen (default: maic)")
    parser.add_argument("--strategy", choices=STRATEGIES, default="union",
                        help="how the verdict is decided: union (size-controlled, the default), "
                             "bootstrap (size-controlled, robust to changing volatility: the union "
                             "against a wild-bootstrap critical value; slower) or classic (the "
                             "Dickey-Fuller sequence; it is shown in every case)")
    parser.add_argument("--seasonal", choices=SEASONAL_MODES, default="automatic",
                        help="quarterly and monthly series: allow for fixed seasonal means in the "
                             "tests (seasonal dummies) when a test finds them (automatic, the "
                             "default), always, or never (no seasonal means, no seasonal "
                             "unit-root test)")
    parser.add_argument("--break-check", choices=BREAK_CHECK_MODES, default="automatic",
                        help="when the evidence points to a break (a jump, a KPSS conflict, a swing "
                             "of tau), test for a level shift and give the verdict under it "
                             "(automatic, the default), or off")
    parser.add_argument("--lags", type=_count, help="lag order for --lag-rule fixed")
    parser.add_argument("--max-lags", type=_count, help="largest lag order tried")
    parser.add_argument("--alpha", type=float, choices=(0.01, 0.05, 0.10), default=0.05,
                        help="significance level: 0.01, 0.05 or 0.10 (default 0.05)")
    parser.add_argument("--max-difference", type=int, choices=(0, 1, 2), default=2,
                        help="highest order of integration considered (default 2)")
    parser.add_argument("--check", default="kpss", metavar="TESTS",
                        help="cross-check tests, comma-separated from kpss, pp, dfgls, za "
                             "(default: kpss; 'none' for no cross-check)")
    parser.add_argument("--exact", action="store_true",
                        help="judge τ and Φ against critical values simulated at each series' "
                             "own sample size (slower)")
    parser.add_argument("--gaps", choices=GAP_RULES, default="refuse",
                        help="series with missing values inside their sample: refuse (report "
                             "them as not tested, the window's rule; the default), longest "
                             "(test the longest stretch without gaps) or fill (straight lines "
                             "across the gaps)")
    parser.add_argument("--sample", metavar="START:END", type=_sample,
                        help="test only observations from START to END, e.g. 1990Q1:2007Q4, "
                             "1990: or :2007-12 (observation numbers for series without dates)")
    parser.add_argument("--out", action="append", default=[], metavar="FILE",
                        help="write the findings here; the format follows the suffix (repeatable)")
    parser.add_argument("--no-charts", action="store_true",
                        help="leave the charts out of .xlsx, .html and .pdf reports (faster; "
                             "by default each series' chart is drawn, as in the window)")
    parser.add_argument("--jobs", type=_count, metavar="N",
                        help="write the --out files with up to N processes at once (default: "
                             "one per idle core from 100 series on; 1: one after the other)")
    parser.add_argument("--replace", action="store_true",
                        help="allow --out to write over an existing file that is not a "
                             "Tauscope report (an input file is never written over)")
    return parser


def _sample(text: str) -> tuple[str | None, str | None]:
    try:
        return parse_sample(text)
    except ValueError as exc:
        raise argparse.ArgumentTypeError(str(exc)) from None


def _count(text: str) -> int:
    try:
        value = int(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"'{text}' is not a whole number") from None
    if value < 0:
        raise argparse.ArgumentTypeError(f"'{text}' must be 0 or more")
    return value


def main(argv: list[str]) -> int:
    try:
        args = _parser().parse_args(argv)
        settings = _settings(args)
        _check_outputs(args.out, args.file, args.replace)
    except UsageError as exc:
        print(f"tauscope batch: {exc}", file=sys.stderr)
        return EXIT_USAGE
    except SystemExit as exc:  # --help
        return int(exc.code or 0) if isinstance(exc.code, int | None) else EXIT_USAGE
    try:
        workbook = read_workbook(args.file)
        chosen = choose_series(workbook, args.sheet, args.series)
    except DataError as exc:
        print(f"tauscope batch: {exc}", file=sys.stderr)
        return EXIT_INPUT
    except Exception as exc:  # a reader bug must still end in one line, never a traceback
        print(f"tauscope batch: {Path(args.file).name}: could not be read "
              f"({type(exc).__name__}: {exc})".replace("\n", " "), file=sys.stderr)
        return EXIT_INPUT
    notes = reader_notes(workbook, args.sheet, chosen)
    plan = Plan(None if args.transform == "none" else args.transform, args.gaps,
                args.sample or (None, None))
    with Writers(args.out, len(chosen), args.jobs) as writers:  # helpers start meanwhile
        return _analyse_and_write(args, workbook, chosen, settings, plan, notes, writers)


def _analyse_and_write(args: argparse.Namespace, workbook: Workbook, chosen: list[SeriesData],
                       settings: Settings, plan: Plan, notes: str, writers: Writers) -> int:
    analysed = analyse_with_series(chosen, settings, plan, ready=writers.ready)
    findings = [finding for finding, _series in analysed]
    run = RunRecord(settings, (SourceFile(str(workbook.path), workbook.sha256),), tuple(findings))
    if not args.out:
        print(summary_table(findings))
    charts: Charts | None = None
    if not args.no_charts and any(Path(t).suffix.lower() in CHART_FORMATS for t in args.out):
        charts, chart_notes = draw_report_charts(
            run, {f.key: series for f, series in analysed if f.key is not None})
        notes = "; ".join(n for n in (notes, chart_notes) if n)
    failed = writers.write(run, charts)
    if failed:  # one line: the first file not written, and any other
        others = "; ".join(failed[1:])
        print(f"tauscope batch: {failed[0]}" + (f" (also not written: {others})" if others
                                                 else ""), file=sys.stderr)
        return EXIT_OUTPUT
    if notes:  # after the writes, so that standard error holds one line in every case
        print(f"tauscope batch: {workbook.path.name}: {notes}", file=sys.stderr)
    return EXIT_DONE


def draw_report_charts(run: RunRecord, series: Mapping[str, SeriesData]) -> tuple[Charts, str]:
    """Each finding's chart, made as the window's export makes it
    (``tauscope.ui.report_charts``: plain data, which each format draws; no display needed),
    and one sentence on any chart that could not be made ("" when all were): such a chart is
    left out, the reports are still written."""
    try:
        from tauscope.ui.report_charts import draw_charts, problems_text

        drawn = draw_charts(run, series.get)
    except Exception as exc:  # Qt missing or broken: reports without charts, never a traceback
        reason = f"{type(exc).__name__}: {exc}".replace("\n", " ")
        return {}, f"the charts could not be drawn ({reason}); the reports hold none"
    return drawn.charts, problems_text(drawn)


def _settings(args: argparse.Namespace) -> Settings:
    if args.lag_rule == "fixed" and args.lags is None:
        raise UsageError("--lag-rule fixed needs --lags N")
    try:
        checks = tuple(t.strip() for t in args.check.split(",") if t.strip() not in ("", "none"))
        return Settings(lag_rule=args.lag_rule, lags=args.lags, max_lags=args.max_lags,
                        alpha=args.alpha, max_difference=args.max_difference, confirm=checks,
                        critical_values="exact" if args.exact else "mackinnon",
                        strategy=args.strategy, seasonal=args.seasonal,
                        break_check=args.break_check)
    except ValueError as exc:
        raise UsageError(str(exc)) from None


def _check_outputs(outputs: Sequence[str], source: str, replace: bool) -> None:
    for target in outputs:
        suffix = Path(target).suffix.lower()
        if suffix not in WRITERS:
            known = ", ".join(sorted(WRITERS))
            raise UsageError(f"--out {target}: unknown output format '{suffix or 'none'}' "
                             f"(known: {known})")
        if same_file(target, source):
            raise UsageError(f"--out {target}: that is the input file, which is never "
                             "written over; choose another name")
        path = Path(target)
        if path.exists() and not path.is_file():
            raise UsageError(f"--out {target}: is not a regular file")
        if path.exists() and not replace and not is_own_report(path):
            raise UsageError(f"--out {target}: the file exists and is not a Tauscope report; "
                             "add --replace to write over it")


def choose_series(workbook: Workbook, sheet: str | None, names: Sequence[str]) -> list[SeriesData]:
    """The series asked for, in workbook order; DataError naming what is not there."""
    pool = list(workbook.sheet(sheet).series if sheet is not None else workbook.series())
    if not names:
        if not pool:
            raise DataError(f"sheet '{sheet}' has no column of numbers", file=workbook.path.name)
        return pool
    chosen: list[SeriesData] = []
    for wanted in names:
        matches = [s for s in pool if s.name == wanted] or [
            s for s in pool if s.name.casefold() == wanted.strip().casefold()]
        if not matches:
            known = ", ".join(dict.fromkeys(s.name for s in pool))
            raise DataError(f"has no series '{wanted}' (series: {known})",
                            file=workbook.path.name, sheet=sheet)
        chosen.extend(m for m in matches if m not in chosen)
    return chosen


def _failed(name: str, settings: Settings, message: str) -> SeriesResult:
    return failed_result(name, message, settings.to_dict())


@dataclasses.dataclass(frozen=True)
class Plan:
    """What is done to each series before the engine sees it, in this order: the sample
    (labels, None for an open side), the gap rule, the transformation (None: none)."""

    transform: str | None = None
    gaps: str = "refuse"
    sample: tuple[str | None, str | None] = (None, None)


@dataclasses.dataclass(frozen=True)
class _Prepared:
    """A series made ready for the engine, or the sentence saying why it could not be."""

    series: SeriesData
    name: str
    values: object | None
    notes: tuple[str, ...]
    problem: str | None


_GAP_HINT = "; run again with --gaps longest or --gaps fill to test it"


def prepare_one(series: SeriesData, plan: Plan | str | None = None) -> _Prepared:
    """Sample, gap rule and transformation (see :class:`Plan`); the notes say what was done."""
    if not isinstance(plan, Plan):
        plan = Plan(transform=plan)
    name = series.name
    read_notes = len(series.notes)
    try:
        series = cut_sample(series, *plan.sample)
        series = apply_gap_rule(series, plan.gaps)
        done = series.notes[read_notes:]
        if plan.transform is not None:
            series = make_transform(series, plan.transform)
            name = series.name
        try:
            values = series.testable_values()
        except DataError as exc:
            return _Prepared(series, name, None, done, exc.reason.rstrip(".") + _GAP_HINT)
        return _Prepared(series, name, values, done, None)
    except DataError as exc:
        return _Prepared(series, name, None, (), exc.reason)
    except Exception as exc:  # one bad series never stops the batch
        reason = f"“{name}” could not be tested: {type(exc).__name__}: {exc}".replace("\n", " ")
        return _Prepared(series, name, None, (), reason)


def analyse_all(chosen: Sequence[SeriesData], settings: Settings, plan: Plan | str | None = None,
                progress: TextIO | None = None) -> list[Finding]:
    """Prepare every series, then run the engine on all of them at once (``analyse_many``
    batches series of equal length); results keep the input order.  Progress lines go to
    ``progress`` when given, else to standard error when it is a terminal."""
    return [finding for finding, _series in analyse_with_series(chosen, settings, plan, progress)]


def analyse_with_series(chosen: Sequence[SeriesData], settings: Settings,
                        plan: Plan | str | None = None, progress: TextIO | None = None,
                        ready: Callable[[list[Finding]], None] | None = None,
                        ) -> list[tuple[Finding, SeriesData]]:
    """:func:`analyse_all`, each finding with the series it was made from (sample cut, gap
    rule and transformation applied), which its chart draws.  ``ready(findings)`` is given
    the findings in order as they are made, a chunk of the engine's at a time (the last
    ones when all are made), while the engine works on the next chunk."""
    stream = progress or sys.stderr
    show = progress is not None or stream.isatty()
    prepared = [prepare_one(series, plan) for series in chosen]
    testable = [p for p in prepared if p.problem is None]
    results = iter_analyse([(p.name, p.values) for p in testable], settings)
    analysed: list[tuple[Finding, SeriesData]] = []
    given = done = 0
    # The collector paused over the whole run, as analyse_many does: every result is kept.
    with collector_paused():
        for item in prepared:
            if item.problem is not None:
                result = _failed(item.name, settings, item.problem)
            else:
                result = next(results)
                done += 1
                if show:
                    print(f"[{done}/{len(testable)}] {item.name}", file=stream, flush=True)
                if item.notes:
                    result = dataclasses.replace(result, notes=(*item.notes, *result.notes))
            analysed.append((Finding.from_series(result, item.series), item.series))
            if ready is not None and done % CHUNK == 0 and done and item.problem is None:
                ready([finding for finding, _ in analysed[given:]])
                given = len(analysed)
        if ready is not None and given < len(analysed):
            ready([finding for finding, _ in analysed[given:]])
    if gc.isenabled():
        gc.collect(0)  # the young generation (this run's objects) once, as analyse_many does
    return analysed
