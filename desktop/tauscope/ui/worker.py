"""The analysis runs here, in a worker thread, never in the window's thread.

Structure: :func:`iter_results` is the only place that calls the engine.  It
reads each series' values, hands the testable ones to the engine's batched
``iter_analyse`` (results in input order, ``should_stop`` asked before each
series) and yields one :class:`Outcome` per series in the order given, bad data
becoming that series' error.  :class:`AnalysisWorker` lives in a QThread and
turns outcomes into queued signals; :class:`AnalysisRunner` (window thread) owns
the thread, the stop flag and the signals the window listens to.
"""

from __future__ import annotations

import threading
import time
import traceback
from collections import deque
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import pandas as pd
from PySide6.QtCore import QElapsedTimer, QObject, QThread, QTimer, Signal, Slot

from tauscope.engine import SeriesResult, Settings
from tauscope.engine.results import failed_result
from tauscope.ui.engine_process import Pickled
from tauscope.ui.off_thread import BackgroundWork

if TYPE_CHECKING:
    from tauscope.data import SeriesData


# The statistics libraries (statsmodels, scipy) load on the first run, or earlier through
# warm_up_engine(), not before the window shows itself.
def analyse_series(values: Any, settings: Settings, name: str) -> SeriesResult:
    from tauscope.engine.procedure.analyse import analyse_series as analyse

    return analyse(values, settings, name)


def iter_analyse(series: Any, settings: Settings, should_stop: Callable[[], bool] | None = None
                 ) -> Iterator[SeriesResult | Pickled]:
    """The engine's batched ``iter_analyse``, run in the session's analysis process
    (:mod:`tauscope.ui.engine_process`), so the engine never holds this process's
    interpreter lock, its results still pickled (the window's thread unpickles them when it
    shows them, :meth:`AnalysisRunner._drain`); in this thread only when no process can be
    started."""
    from tauscope.ui.engine_process import shared_engine

    engine = shared_engine()
    try:
        engine.start()
    except Exception:  # no process can be started here (a rare system): run in this thread
        from tauscope.engine.procedure.many import iter_analyse as analyse_in_batches

        return analyse_in_batches(series, settings, should_stop=should_stop)
    return engine.iter_pickled(series, settings, should_stop)


def warm_up_engine() -> threading.Thread:
    """Import the statistics in a background thread once the window is up, and start the
    analysis process, so neither the start-up nor the first run waits for them."""

    def load() -> None:
        import tauscope.engine.distributions.simulate
        import tauscope.engine.procedure.many  # noqa: F401
        from tauscope.ui.engine_process import shared_engine

        shared_engine().start_soon()

    thread = threading.Thread(target=load, name="tauscope-warm-up", daemon=True)
    thread.start()
    return thread


@dataclass(frozen=True)
class Job:
    """One series to analyse: its key, its display name and where its values come from."""

    key: str
    name: str
    values: Callable[[], pd.Series]

    @classmethod
    def from_series(cls, series: SeriesData) -> Job:
        return cls(series.key, series.name, series.testable_values)


@dataclass(frozen=True)
class Outcome:
    job: Job
    result: SeriesResult | Pickled  # from the analysis process: unpickled when shown
    crash: str | None = None  # traceback text when something unexpected went wrong


def error_result(name: str, message: str, settings: Settings) -> SeriesResult:
    """A result that carries only an error sentence (same shape as the engine's own)."""
    return failed_result(name, message, settings.to_dict())


def analyse_job(job: Job, settings: Settings) -> Outcome:
    """Analyse one series; bad data and unexpected failures become that series' error."""
    from tauscope.data import DataError

    try:
        values = job.values()
    except DataError as exc:
        return Outcome(job, error_result(job.name, str(exc), settings))
    try:
        return Outcome(job, analyse_series(values, settings, job.name))
    except Exception as exc:  # the engine should never raise; if it does, keep going
        message = (f"“{job.name}” could not be tested: an unexpected problem occurred "
                   f"({type(exc).__name__}: {exc}).")
        return Outcome(job, error_result(job.name, message, settings), traceback.format_exc())


def _read_values(job: Job, settings: Settings) -> pd.Series | SeriesResult:
    """The job's values, or an error result when the data cannot be tested as they are."""
    from tauscope.data import DataError

    try:
        return job.values()
    except DataError as exc:
        return error_result(job.name, str(exc), settings)


def iter_results(jobs: Sequence[Job], settings: Settings, should_stop: Callable[[], bool],
                 on_start: Callable[[int, Job], None]) -> Iterator[Outcome]:
    """One outcome per series, in order, until done or ``should_stop()`` says stop.

    The testable series go through ``iter_analyse`` (batched; equal to analyse_series
    on each).  If the batch stream itself fails, the series concerned is marked with the
    problem and the rest continue one at a time through :func:`analyse_job`.
    """
    payloads = [_read_values(job, settings) for job in jobs]
    testable = [(job.name, p) for job, p in zip(jobs, payloads, strict=True)
                if not isinstance(p, SeriesResult)]
    stream: Iterator[SeriesResult | Pickled] | None = iter_analyse(testable, settings,
                                                                    should_stop)
    for number, (job, payload) in enumerate(zip(jobs, payloads, strict=True)):
        if should_stop():
            return
        on_start(number, job)
        if isinstance(payload, SeriesResult):
            yield Outcome(job, payload)
            continue
        if stream is None:
            yield analyse_job(job, settings)
            continue
        try:
            result = next(stream)
        except StopIteration:
            return  # the engine stopped because should_stop() said so
        except Exception as exc:
            stream = None
            message = (f"“{job.name}” could not be tested: an unexpected problem occurred "
                       f"({type(exc).__name__}: {exc}).")
            yield Outcome(job, error_result(job.name, message, settings), traceback.format_exc())
            continue
        yield Outcome(job, result)


class AnalysisWorker(QObject):
    """Runs :func:`iter_results` in its thread.

    Outcomes go into ``outbox`` (a deque: appending and popping from two threads is
    safe) instead of one queued signal each, so a fast engine cannot flood the
    window's event queue; the runner drains the outbox on a timer, within a time
    budget per tick.
    """

    finished = Signal(bool)  # True when stopped before the end

    def __init__(self, jobs: Sequence[Job], settings: Settings, stop: threading.Event) -> None:
        super().__init__()
        self._jobs = list(jobs)
        self._settings = settings
        self._stop = stop
        self.outbox: deque[Outcome] = deque()
        self.current = ""  # name of the series being analysed
        self.crash_details = ""  # traceback text of unexpected failures, set before ``done``
        self.done = False

    def unpacked(self, outcome: Outcome) -> SeriesResult:
        """The outcome's result, unpickled here when it came pickled (in the thread that
        calls, the window's: see :func:`iter_analyse`)."""
        if not isinstance(outcome.result, Pickled):
            return outcome.result
        try:
            result: SeriesResult = outcome.result.load()
        except Exception as exc:  # never expected: the series is marked, the run goes on
            message = (f"“{outcome.job.name}” could not be tested: its result could not be "
                       f"read back ({type(exc).__name__}: {exc}).")
            return error_result(outcome.job.name, message, self._settings)
        return result

    def _started(self, _number: int, job: Job) -> None:
        self.current = job.name

    @Slot()
    def run(self) -> None:
        crashes: list[str] = []
        try:
            for outcome in iter_results(self._jobs, self._settings, self._stop.is_set,
                                        self._started):
                self.outbox.append(outcome)
                if outcome.crash:
                    crashes.append(outcome.crash)
        except Exception:
            crashes.append(traceback.format_exc())
        # Read by the runner when it ends the run, so the problem is reported before the
        # run's end, never after it (a queued signal could arrive after "Done").
        self.crash_details = "\n\n".join(crashes)
        self.done = True
        self.finished.emit(self._stop.is_set())
        # End the thread's event loop from inside, so waiting for the thread never depends
        # on the window thread handling the finished signal first (it may be blocked closing).
        thread = QThread.currentThread()
        if thread is not None:
            thread.quit()


class AnalysisRunner(QObject):
    """Owns one run at a time: starts the worker thread, stops it, and hands results to
    the window a few at a time from a timer (at most ``budget_ms`` of work per tick)."""

    started = Signal(int)  # number of series in the run
    progress = Signal(int, int, str)  # done, total, name of the series being analysed
    result_ready = Signal(str, object)  # key, SeriesResult
    crashed = Signal(str)
    finished = Signal(bool, int)  # stopped?, number of results delivered

    TICK_MS = 15
    PROGRESS_MS = 100
    budget_ms = 4.0  # results unpickled and shown per tick (was 8: with the unpickling here, 19 ms ticks)

    def __init__(self, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self._thread: QThread | None = None
        self._worker: AnalysisWorker | None = None
        self._stop = threading.Event()
        self._stopped = False
        self._total = 0
        self._received = 0
        self._background = BackgroundWork()
        self._timer = QTimer(self)
        self._timer.setInterval(self.TICK_MS)
        self._timer.timeout.connect(self._drain)
        self._since_progress = QElapsedTimer()
        self._since_progress.start()

    def is_running(self) -> bool:
        return self._worker is not None

    def start(self, jobs: Sequence[Job], settings: Settings) -> bool:
        if self._worker is not None or not jobs:
            return False
        self._stop = threading.Event()
        self._stopped = False
        self._total = len(jobs)
        self._received = 0
        thread = QThread()
        thread.setObjectName("tauscope-analysis")
        worker = AnalysisWorker(jobs, settings, self._stop)
        worker.moveToThread(thread)
        thread.started.connect(worker.run)
        worker.finished.connect(self._on_worker_finished)
        self._thread, self._worker = thread, worker
        self.started.emit(self._total)
        # GIL handed over every 1 ms and no garbage collection while the engine thread
        # runs (see BackgroundWork and benchmarks/ui_latency.py).
        self._background.enter()
        thread.start()
        self._timer.start()
        return True

    def stop(self) -> None:
        """Ask the run to end after the series in hand (results so far are kept)."""
        self._stop.set()

    def wait(self, msecs: int = 10_000) -> bool:
        """Block until the worker thread has ended, then end the run without delivering
        what is left.  Only for closing the window: to wait for results, let the event
        loop run until ``finished``."""
        thread = self._thread
        if thread is None:
            return True
        done = bool(thread.wait(msecs))
        if done:
            self._finish()
        return done

    def _drain(self) -> None:
        worker = self._worker
        if worker is None:
            self._timer.stop()
            return
        deadline = time.perf_counter() + self.budget_ms / 1000
        delivered = False
        while worker.outbox and time.perf_counter() < deadline:
            outcome = worker.outbox.popleft()
            self._received += 1
            delivered = True
            self.result_ready.emit(outcome.job.key, worker.unpacked(outcome))
        # The progress bar and the status line at most every PROGRESS_MS (each update
        # lays out and paints the status bar: up to 7 ms on a busy machine), in a tick whose
        # budget the results left room for (else the next one, at most a few ticks later),
        # and always once the results are all in.
        finishing = worker.done and not worker.outbox
        since = self._since_progress.elapsed()
        room = time.perf_counter() < deadline or since >= 3 * self.PROGRESS_MS
        if (delivered or worker.current) and (
                finishing or (room and since >= self.PROGRESS_MS)):
            self._since_progress.start()
            name = "" if worker.done else worker.current
            self.progress.emit(self._received, self._total, name)
        # The run ends in a tick after the one that showed its last results: the end (the
        # progress bar hidden, the status line, the current series shown again) costs the
        # window's thread as much again.
        if worker.done and not worker.outbox and not delivered and self._thread is not None \
                and self._thread.isFinished():
            self._finish()

    def _on_worker_finished(self, stopped: bool) -> None:
        self._stopped = stopped

    def _finish(self) -> None:
        self._timer.stop()
        self._background.leave()
        crash_details = ""
        if self._worker is not None:
            self._stopped = self._stopped or self._stop.is_set()
            crash_details = self._worker.crash_details if self._worker.done else ""
            self._worker.deleteLater()
        if self._thread is not None:
            self._thread.wait()
            self._thread.deleteLater()
        self._worker, self._thread = None, None
        if crash_details:
            self.crashed.emit(crash_details)
        self.finished.emit(self._stopped, self._received)
