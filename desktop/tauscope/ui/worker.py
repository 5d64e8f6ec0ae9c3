"""The analysis runs here, in a worker thread, never in the window's thread.

Structure: :func:`iter_results` is the only place that calls the engine.  It
yields one ``(job, result)`` pair per series and checks the stop flag between
series; swapping the loop for ``tauscope.engine.analyse_many`` (when it lands)
is a change to that one function.  :class:`AnalysisWorker` lives in a QThread
and turns the pairs into queued signals; :class:`AnalysisRunner` (in the window
thread) owns the thread, the stop flag and the signals the window listens to.
"""

from __future__ import annotations

import threading
import traceback
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import pandas as pd
from PySide6.QtCore import QObject, QThread, Signal, Slot

from tauscope.engine import SeriesResult, Settings, analyse_series
from tauscope.engine.results import EMPTY_VERDICT

if TYPE_CHECKING:
    from tauscope.data import SeriesData


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
    result: SeriesResult
    crash: str | None = None  # traceback text when something unexpected went wrong


def error_result(name: str, message: str, settings: Settings) -> SeriesResult:
    """A result that carries only an error sentence (same shape as the engine's own)."""
    return SeriesResult(name=name, nobs=0, error=message, verdict=EMPTY_VERDICT, steps=(),
                        tests=(), notes=(message,), settings=settings.to_dict())


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


def iter_results(jobs: Sequence[Job], settings: Settings, should_stop: Callable[[], bool],
                 on_start: Callable[[int, Job], None]) -> Iterator[Outcome]:
    """One outcome per series, in order, until done or ``should_stop()`` says stop."""
    for number, job in enumerate(jobs):
        if should_stop():
            return
        on_start(number, job)
        yield analyse_job(job, settings)


class AnalysisWorker(QObject):
    """Runs :func:`iter_results` in its thread and reports through queued signals."""

    series_started = Signal(int, str)  # number of finished series, name of the next one
    series_done = Signal(str, object)  # key, SeriesResult
    crashed = Signal(str)  # traceback text of an unexpected failure
    finished = Signal(bool)  # True when stopped before the end

    def __init__(self, jobs: Sequence[Job], settings: Settings, stop: threading.Event) -> None:
        super().__init__()
        self._jobs = list(jobs)
        self._settings = settings
        self._stop = stop

    @Slot()
    def run(self) -> None:
        crashes: list[str] = []
        try:
            for outcome in iter_results(self._jobs, self._settings, self._stop.is_set,
                                        lambda n, job: self.series_started.emit(n, job.name)):
                self.series_done.emit(outcome.job.key, outcome.result)
                if outcome.crash:
                    crashes.append(outcome.crash)
        except Exception:
            crashes.append(traceback.format_exc())
        if crashes:
            self.crashed.emit("\n\n".join(crashes))
        self.finished.emit(self._stop.is_set())


class AnalysisRunner(QObject):
    """Owns one run at a time: starts the worker thread, stops it, forwards its signals."""

    started = Signal(int)  # number of series in the run
    progress = Signal(int, int, str)  # done, total, name of the series being analysed
    result_ready = Signal(str, object)  # key, SeriesResult
    crashed = Signal(str)
    finished = Signal(bool, int)  # stopped?, number of results received

    def __init__(self, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self._thread: QThread | None = None
        self._worker: AnalysisWorker | None = None
        self._stop = threading.Event()
        self._total = 0
        self._received = 0

    def is_running(self) -> bool:
        return self._thread is not None

    def start(self, jobs: Sequence[Job], settings: Settings) -> bool:
        if self._thread is not None or not jobs:
            return False
        self._stop = threading.Event()
        self._total = len(jobs)
        self._received = 0
        thread = QThread()
        thread.setObjectName("tauscope-analysis")
        worker = AnalysisWorker(jobs, settings, self._stop)
        worker.moveToThread(thread)
        thread.started.connect(worker.run)
        worker.series_started.connect(self._on_series_started)
        worker.series_done.connect(self._on_series_done)
        worker.crashed.connect(self.crashed)
        worker.finished.connect(self._on_worker_finished)
        self._thread, self._worker = thread, worker
        self.started.emit(self._total)
        thread.start()
        return True

    def stop(self) -> None:
        """Ask the run to end after the series in hand (results so far are kept)."""
        self._stop.set()

    def wait(self, msecs: int = 10_000) -> bool:
        """Block until the worker thread has ended (used when the window closes)."""
        thread = self._thread
        if thread is None:
            return True
        done = thread.wait(msecs)
        if done:
            self._cleanup()
        return done

    def _on_series_started(self, done: int, name: str) -> None:
        self.progress.emit(done, self._total, name)

    def _on_series_done(self, key: str, result: Any) -> None:
        self._received += 1
        self.result_ready.emit(key, result)
        self.progress.emit(self._received, self._total, "")

    def _on_worker_finished(self, stopped: bool) -> None:
        thread = self._thread
        if thread is not None:
            thread.quit()
            thread.wait()
        self._cleanup()
        self.finished.emit(stopped, self._received)

    def _cleanup(self) -> None:
        if self._worker is not None:
            self._worker.deleteLater()
        if self._thread is not None:
            self._thread.deleteLater()
        self._worker, self._thread = None, None
