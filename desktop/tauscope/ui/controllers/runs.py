"""Runs: the analysis of the chosen series in the worker thread, its progress bar and
status line, stopping it, and the problem dialog when something unexpected happens."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QObject, Signal
from PySide6.QtWidgets import QLabel, QProgressBar

from tauscope.engine import SeriesResult
from tauscope.ui.controllers.current import CurrentSeries
from tauscope.ui.controllers.prompts import Prompts
from tauscope.ui.controllers.session import Session
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.series_panel import SeriesPanel
from tauscope.ui.worker import AnalysisRunner, Job


class RunsController(QObject):
    """One analysis at a time; results go to the Findings panel as they come."""

    running_changed = Signal(bool)
    ended = Signal()  # a run ended and the window is not closing (time to autosave)

    def __init__(self, series_panel: SeriesPanel, findings_panel: FindingsPanel,
                 current: CurrentSeries, session: Session, prompts: Prompts, status: QLabel,
                 progress: QProgressBar, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.series_panel = series_panel
        self.findings_panel = findings_panel
        self.current = current
        self.session = session
        self.prompts = prompts
        self.status = status
        self.progress = progress
        self.last_run: tuple[bool, int] | None = None  # (stopped, results) of the last run
        self._quiet = False  # a study's re-run does not count as a change
        self._untested = 0  # series of the run in hand that could not be tested
        self.runner = AnalysisRunner(self)
        self.runner.started.connect(self._run_started)
        self.runner.progress.connect(self._run_progress)
        self.runner.result_ready.connect(self._result_ready)
        self.runner.crashed.connect(self._run_crashed)
        self.runner.finished.connect(self._run_finished)

    def is_running(self) -> bool:
        return self.runner.is_running()

    def run_selected(self) -> bool:
        return self.run_series(self.series_panel.selected_series())

    def run_all(self) -> bool:
        return self.run_series(self.series_panel.model.all_series())

    def run_series(self, series: list[Any], quiet: bool = False) -> bool:
        """Start analysing ``series`` with the session's settings; ``quiet``: the results
        do not count as a change to the study (a study opened again)."""
        if self.runner.is_running():
            return False
        if not series:
            self.status.setText("Open a workbook first (Ctrl+O), or the demo workbook.")
            return False
        started = self.runner.start([Job.from_series(s) for s in series], self.session.settings)
        if started:
            self._quiet = quiet
        return started

    def stop_run(self) -> None:
        if self.runner.is_running():
            self.runner.stop()
            self.status.setText("Stopping after the series in hand…")

    def stop_and_wait(self, msecs: int) -> None:
        """The window is closing: stop the run and wait for the worker to end."""
        if self.runner.is_running():
            self.runner.stop()
            self.runner.wait(msecs)

    def _run_started(self, total: int) -> None:
        self.last_run = None
        self._untested = 0
        self.progress.setRange(0, total)
        self.progress.setValue(0)
        self.progress.show()
        self.status.setText(f"Analysing {total} series…")
        self.running_changed.emit(True)

    def _run_progress(self, done: int, total: int, name: str) -> None:
        self.progress.setValue(done)
        if name:
            self.status.setText(f"Analysing {name} ({done + 1} of {total})")

    def _result_ready(self, key: str, result: SeriesResult) -> None:
        self.findings_panel.model.set_result(key, result)
        self._untested += result.error is not None
        if key == self.current.key:
            self.current.show(key)

    def _run_finished(self, stopped: bool, received: int) -> None:
        self.progress.hide()
        self.last_run = (stopped, received)
        self.running_changed.emit(False)
        if self.session.closing:
            return
        if received and not self._quiet:
            self.session.set_modified(True)
        self._quiet = False
        self.ended.emit()
        total = self.progress.maximum()
        errors = self._untested  # of this run only, not of earlier findings still shown
        if stopped:
            text = f"Stopped: {received} of {total} series analysed; their results are kept."
        else:
            text = f"Done: {received} series analysed."
        if errors:
            text += f" {errors} could not be tested (see Findings)."
        self.status.setText(text)
        key = self.current.key
        if key:
            self.current.show(key)
            self.findings_panel.select_key(key)

    def _run_crashed(self, details: str) -> None:
        if not self.session.closing:
            self.prompts.show_problem(
                "Something unexpected happened during the analysis. The series concerned are "
                "marked as not tested; the others are unaffected.", details)
