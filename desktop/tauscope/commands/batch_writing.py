"""Writing the ``--out`` files of ``tauscope batch``, several at once on a machine with cores
to spare.

Each findings file is written by one writer (``tauscope.report.export``), start to end, and
the files do not depend on each other, so they can be written side by side.  Writers are
Python code that holds the interpreter lock, so threads would take turns; processes of their
own do not.  The files are shared out by their expected cost (largest first, each to the least
loaded writer: Graham, 1969, "Bounds on multiprocessing timing anomalies"); the first share is
this process's.  How a helper starts (:data:`START`):

* on Linux, when the findings are ready, as a copy of this process ("fork"): it holds the run
  and the charts already, writes its share and answers; nothing is pickled;
* elsewhere, :class:`Writers` starts its helpers before the analysis (``multiprocessing``,
  "spawn": a fresh interpreter, the frozen bundle included, where
  ``multiprocessing.freeze_support()`` in the entry point answers the child's start), so that
  their imports run while this process analyses, each warming up only for its own formats;
  when the findings are ready, :meth:`Writers.write` pickles the run and the charts once and
  sends them to each helper from a thread (a helper still starting holds nothing up).

Either way this process writes its own share and then collects what the helpers did.

Every file still goes through :func:`~tauscope.report.export` and so through
``report.atomic``: a file is written whole or not at all, never half.  A writer that fails
gives one sentence naming its file; the other files are still written.  A helper that
cannot be started, or that ends before saying what it wrote, costs nothing but time: the
files it did not report are written here.  Fewer than :data:`PARALLEL_FROM` series, a
single file or no idle core (:func:`writer_count`): everything is written here, one file
after the other, as before.
"""

from __future__ import annotations

import multiprocessing
import os
import pickle
import sys
import threading
import time
from collections.abc import Callable, Sequence
from contextlib import suppress
from dataclasses import dataclass, field
from pathlib import Path
from typing import TYPE_CHECKING, Any

from tauscope.commands.batch_pieces import EncodedPieces
from tauscope.engine.collector import collector_paused
from tauscope.report import Charts, ExportError, Finding, RunRecord, export

if TYPE_CHECKING:
    from multiprocessing.connection import Connection
    from multiprocessing.context import ForkProcess, SpawnProcess

PARALLEL_FROM = 100
"""Fewer series than this: a helper's start (about a second of imports) costs more than
the writing it would save."""

COST = {".pdf": 2.0, ".json": 1.8, ".xlsx": 1.3, ".html": 0.6, ".csv": 0.3, ".tex": 0.1}
"""Milliseconds per series each format took on 500 × 240 with charts
(``benchmarks/batch_writers.py``); only their order and rough size matter here."""

JOIN_S = 5.0  # the longest wait for a helper to end after it has reported every file
QUIET_S = 60.0
QUIET_PER_SERIES_S = 0.02
"""The longest a helper may go without reporting a file, counted from when this process,
its own share written, starts waiting for it: QUIET_S plus QUIET_PER_SERIES_S a series (70 s
for 500; a file of 500 series takes about a second here).  A helper quiet for longer is
taken as stuck: it is ended and the files it did not report are written here."""


def _failure(target: str, exc: Exception) -> str:
    """One sentence naming ``target``: the export's own, or what went wrong in the writer."""
    if isinstance(exc, ExportError):
        return str(exc)
    return f"{target}: could not be written ({type(exc).__name__}: {exc})".replace("\n", " ")


def write_here(targets: Sequence[str], run: RunRecord, charts: Charts | None,
               pieces: EncodedPieces | None = None) -> dict[str, str]:
    """Write ``targets`` one after the other in this process; the failures, by target.  A
    .json file takes its entries from ``pieces`` when they are ready and fit the run."""
    failed: dict[str, str] = {}
    for target in targets:
        try:
            encoded = (pieces.result(run.findings)
                       if pieces is not None and Path(target).suffix.lower() == ".json" else None)
            export(target, run, charts, encoded=encoded)
        except Exception as exc:  # one writer's failure never stops the other files
            failed[target] = _failure(target, exc)
    return failed


def _warm(suffixes: Sequence[str]) -> None:
    """Import what the helper's formats need, and read the PDF's fonts (Qt starts only if a
    report needs its route: ``tauscope.ui.pdf_report``)."""
    if ".pdf" in suffixes:
        from tauscope.report.pdf_direct import bundled_fonts
        from tauscope.ui import pdf_report  # noqa: F401  (registers ".pdf")

        bundled_fonts()
    for suffix in suffixes:
        module = {".xlsx": "xlsx_export", ".csv": "csv_export", ".tex": "latex_export",
                  ".html": "html_export"}.get(suffix)
        if module is not None:
            __import__(f"tauscope.report.{module}")


def serve(conn: Connection, suffixes: Sequence[str]) -> None:
    """The helper: warm up for ``suffixes``, then receive ``(run, charts)`` pickled in one
    message and its targets in another, write each target and answer ``(target, None)`` when
    written or ``(target, sentence)`` when not, one message each."""
    import signal

    signal.signal(signal.SIGINT, signal.SIG_IGN)  # Ctrl+C is the batch's to handle
    with suppress(Exception):  # a failed warm-up shows again, with its file, when writing
        _warm(suffixes)
    try:
        payload = conn.recv_bytes()
        targets = conn.recv()
    except (OSError, EOFError):
        return  # the batch needed no help after all
    with collector_paused():  # many objects, no cycles: the collector's passes cost 3/4 here
        run, charts = pickle.loads(payload)
    _write_share(conn, targets, run, charts)


def _serve_then_end(conn: Connection, suffixes: Sequence[str]) -> None:
    """The helper process's whole life: :func:`serve`, then an end without the interpreter's
    tidying up.  A spawned child would otherwise free the run's objects one by one before it
    ends (about 0.35 s for 500 series, measured), and the batch waits for it; every file is
    written and closed and every answer sent by then, so nothing is lost."""
    serve(conn, suffixes)
    conn.close()
    os._exit(0)


@dataclass
class _Helper:
    process: SpawnProcess | ForkProcess
    conn: Connection
    targets: list[str] = field(default_factory=list)


def plan_shares(targets: Sequence[str], writers: int) -> list[list[str]]:
    """``targets`` shared among ``writers`` (the first share is this process's): largest
    expected cost first, each to the share with the least so far (Graham, 1969)."""
    shares: list[list[str]] = [[] for _ in range(max(1, writers))]
    loads = [0.0] * len(shares)
    for target in sorted(targets, key=lambda t: -COST.get(Path(t).suffix.lower(), 1.0)):
        least = loads.index(min(loads))
        shares[least].append(target)
        loads[least] += COST.get(Path(target).suffix.lower(), 1.0)
    return shares


def idle_cores(load: float | None = None, own: float | None = None) -> float:
    """Cores no other process is waiting for: the core count less the load average over the
    last minute (``load``, else the system's) less this process's own part of it (``own``,
    else its CPU seconds so far over 60, at most one core: a batch run in a long-lived
    process, as the benchmarks do, counts itself in the load; a fresh ``tauscope batch`` has
    hardly started); all cores where the system gives no load average."""
    cores = os.cpu_count() or 1
    try:
        if load is None:
            load = os.getloadavg()[0]
    except (AttributeError, OSError):  # no load average (Windows)
        return float(cores)
    if own is None:
        own = min(1.0, time.process_time() / 60.0)
    return max(0.0, cores - max(0.0, load - own))


def writer_count(targets: int, series: int, jobs: int | None,
                 idle: float | None = None) -> int:
    """How many writers (this process included): ``jobs`` when given (at most one per
    target); otherwise one per idle core (:func:`idle_cores`, or ``idle``) for
    :data:`PARALLEL_FROM` series or more, else one.  A helper on a machine with no idle core
    only adds its start and the run's pickling to the work (measured on 2 cores at load
    6–10: more wall time and CPU time than one writer)."""
    if jobs is not None:
        return max(1, min(jobs, targets))
    if series < PARALLEL_FROM:
        return 1
    free = idle_cores() if idle is None else idle
    return max(1, min(int(free + 0.5), targets))


START = "fork" if sys.platform.startswith("linux") else "spawn"
"""How helpers start: on Linux a copy of this process made when the findings are ready
("fork"), which holds the run already, so nothing is pickled (measured: pickling 500
findings here 0.45 s, unpickling them in a helper 0.3 s); elsewhere a fresh interpreter
started with the analysis ("spawn": macOS's system libraries and Windows allow no copy)."""


def _write_share(conn: Connection, targets: Sequence[str], run: RunRecord,
                 charts: Charts | None) -> None:
    """Write each of ``targets`` and answer ``(target, None)`` when written or ``(target,
    sentence)`` when not, one message each: a spawned helper once it has the run
    (:func:`serve`), a forked one (which ends without the interpreter's tidying up:
    ``multiprocessing`` ends a forked child so) from the run it was copied with."""
    import signal

    signal.signal(signal.SIGINT, signal.SIG_IGN)  # Ctrl+C is the batch's to handle
    for target in targets:
        failed = write_here([target], run, charts)
        try:
            conn.send((target, failed.get(target)))
        except OSError:
            return


def _forked(ours: Sequence[Connection], conn: Connection, targets: Sequence[str],
            run: RunRecord, charts: Charts | None) -> None:
    """A forked helper: close the copies of this process's ends of the helpers' pipes first
    (so that when the batch closes them, on Ctrl+C say, the helper's next answer fails and
    it stops), then :func:`_write_share`."""
    for end in ours:
        end.close()
    _write_share(conn, targets, run, charts)


def _started(method: str, share: list[str],
             job: Callable[[Connection, Connection], tuple[Callable[..., None], tuple[Any, ...]]]
             ) -> _Helper | None:
    """A helper process started by ``method`` ("fork" or "spawn") for ``share``, running
    what ``job(its end, this process's end)`` gives (a function and its arguments), with a
    pipe to it; None when it cannot be started."""
    try:
        context = (multiprocessing.get_context("fork") if method == "fork"
                   else multiprocessing.get_context("spawn"))
        here, there = context.Pipe(duplex=True)
        target, args = job(there, here)
        process = context.Process(target=target, args=args, name="tauscope-writer", daemon=True)
        process.start()
        there.close()
    except Exception:
        return None
    return _Helper(process, here, list(share))


class Writers:
    """The writers of one batch: this process and, when worth it, helper processes (see the
    module's text and :data:`START`).  ``jobs``: how many writers at most (None: one per
    core); ``start``: "fork" or "spawn" (None: :data:`START`)."""

    def __init__(self, targets: Sequence[str], series: int, jobs: int | None = None,
                 start: str | None = None) -> None:
        self.targets = list(targets)
        self.quiet_s = QUIET_S + QUIET_PER_SERIES_S * series
        self.shares = plan_shares(self.targets, writer_count(len(self.targets), series, jobs))
        self.start = start or START
        self.helpers: list[_Helper] = []
        self.pieces: EncodedPieces | None = None
        if self.start == "fork":  # copied when the findings are ready (write)
            self._encode_json_ahead(series, jobs)
            # every .pdf written here: Qt, which a report may need, never starts in a copy
            pdfs = [t for share in self.shares[1:] for t in share if t.lower().endswith(".pdf")]
            self.shares = [[t for t in self.shares[0] if not t.lower().endswith(".json")] + pdfs
                           + [t for t in self.shares[0] if t.lower().endswith(".json")],
                           *([t for t in share if t not in pdfs] for share in self.shares[1:])]
            return
        self._add_helpers(self._start)

    def _add_helpers(self, start: Callable[[list[str]], _Helper | None]) -> None:
        """A helper for each share but this process's, started by ``start``; a share whose
        helper cannot be started is written here."""
        for share in self.shares[1:]:
            if not share:
                continue
            helper = start(share)
            if helper is None:
                self.shares[0].extend(share)
            else:
                self.helpers.append(helper)

    def _encode_json_ahead(self, series: int, jobs: int | None) -> None:
        """With a core to spare, the .json files' entries are encoded while the analysis goes
        on (:mod:`.batch_pieces`, fed by :meth:`ready`) and the files written here, last: the
        copies that encode them are this process's children.  The other files are shared out
        among the writers as before."""
        jsons = [t for t in self.targets if Path(t).suffix.lower() == ".json"]
        if not jsons or writer_count(2, series, jobs) < 2:
            return
        self.pieces = EncodedPieces()
        rest = [t for t in self.targets if t not in jsons]
        self.shares = plan_shares(rest, writer_count(len(rest), series, jobs)) if rest else [[]]
        self.shares[0].extend(jsons)

    def ready(self, findings: Sequence[Finding]) -> None:
        """The next ``findings`` of the run, in order, as the analysis makes them."""
        if self.pieces is not None:
            self.pieces.add(findings)

    def _fork(self, share: list[str], run: RunRecord, charts: Charts | None) -> _Helper | None:
        ours = [helper.conn for helper in self.helpers]
        return _started("fork", share, lambda there, here: (_forked, ([here, *ours], there,
                                                                      share, run, charts)))

    @staticmethod
    def _start(share: list[str]) -> _Helper | None:
        suffixes = sorted({Path(t).suffix.lower() for t in share})
        return _started("spawn", share, lambda there, _here: (_serve_then_end,
                                                              (there, suffixes)))

    def write(self, run: RunRecord, charts: Charts | None) -> list[str]:
        """Write every target; the sentences of those that could not be written, in the
        order of the targets given (empty when all were)."""
        failed: dict[str, str] = {}
        sending: list[tuple[_Helper, threading.Thread, list[bool]]] = []
        if self.start == "fork":
            self._add_helpers(lambda share: self._fork(share, run, charts))
            failed.update(write_here(self.shares[0], run, charts, self.pieces))
            for helper in self.helpers:
                failed.update(self._collect(helper, run, charts, self.quiet_s))
            self.close()
            return [failed[t] for t in self.targets if t in failed]
        if self.helpers:
            try:
                payload: bytes | None = pickle.dumps((run, charts), pickle.HIGHEST_PROTOCOL)
            except Exception:
                payload = None  # cannot be pickled: everything is written here
            for helper in self.helpers:
                if payload is None:
                    self.shares[0].extend(helper.targets)
                    continue
                # sent from a thread: a helper still starting does not hold up this share
                sent: list[bool] = []
                thread = threading.Thread(target=self._send, args=(helper, payload, sent),
                                          name="tauscope-writer-send", daemon=True)
                thread.start()
                sending.append((helper, thread, sent))
        failed.update(write_here(self.shares[0], run, charts))
        for helper, thread, sent in sending:
            thread.join()
            failed.update(self._collect(helper, run, charts, self.quiet_s) if sent
                          else write_here(helper.targets, run, charts))
        self.close()
        return [failed[t] for t in self.targets if t in failed]

    @staticmethod
    def _send(helper: _Helper, payload: bytes, sent: list[bool]) -> None:
        """Send the run and the targets to ``helper``; ``sent`` gets True when done."""
        try:
            helper.conn.send_bytes(payload)
            helper.conn.send(helper.targets)
        except Exception:
            return
        sent.append(True)

    @staticmethod
    def _collect(helper: _Helper, run: RunRecord, charts: Charts | None,
                 quiet_s: float) -> dict[str, str]:
        """What ``helper`` reports; the files it did not report (it ended, or said nothing for
        ``quiet_s`` seconds and was ended) written here."""
        failed: dict[str, str] = {}
        waiting = list(helper.targets)
        try:
            while waiting:
                if not helper.conn.poll(quiet_s):
                    helper.process.kill()
                    helper.process.join(JOIN_S)  # reaped: its temporary file is seen as stale
                    raise EOFError("the helper was stuck")
                target, sentence = helper.conn.recv()
                waiting.remove(target)
                if sentence is not None:
                    failed[target] = sentence
        except (OSError, EOFError, ValueError):
            failed.update(write_here(waiting, run, charts))
        return failed

    def close(self) -> None:
        """End the helpers (after they have reported, or unused) and the copies encoding
        JSON entries."""
        if self.pieces is not None:
            self.pieces.close()
        for helper in self.helpers:
            with suppress(OSError):
                helper.conn.close()
        for helper in self.helpers:
            helper.process.join(JOIN_S)
            if helper.process.is_alive():
                helper.process.terminate()
                helper.process.join(JOIN_S)
        self.helpers = []

    def __enter__(self) -> Writers:
        return self

    def __exit__(self, *exc: Any) -> None:
        self.close()
