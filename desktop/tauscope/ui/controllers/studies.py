"""Studies: save and open a study file, find a workbook that moved, and keep an autosave
of unsaved changes that is offered back after a crash."""

from __future__ import annotations

import contextlib
import threading
from pathlib import Path
from typing import TYPE_CHECKING

from PySide6.QtCore import QObject, QTimer
from PySide6.QtWidgets import QLabel

from tauscope.report.study import STUDY_SUFFIX, Study
from tauscope.ui import store
from tauscope.ui.controllers.files import FILE_FILTER, FilesController
from tauscope.ui.controllers.prompts import Prompts
from tauscope.ui.controllers.runs import RunsController
from tauscope.ui.controllers.session import Session
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.off_thread import wait_off_thread
from tauscope.ui.series_panel import SeriesPanel
from tauscope.ui.study_state import analysed_keys, build_study, check_study_sources

if TYPE_CHECKING:
    from tauscope.data import SeriesData, Workbook
    from tauscope.engine import SeriesResult, Settings

    # settings, workbooks, every series, the findings by key, the gap handling by key
    _StudyParts = tuple[Settings, list[Workbook], list[SeriesData], dict[str, SeriesResult],
                        dict[str, str]]

STUDY_FILTER = f"Tauscope studies (*{STUDY_SUFFIX});;All files (*)"
AUTOSAVE_MS = 120_000
# After a run, the autosave waits this long: a turn of the event loop of its own, not the
# one that shows the run's last results and ends it (together over 25 ms of the window's
# thread with a thousand series; see benchmarks/ui_latency.py).
AUTOSAVE_AFTER_RUN_MS = 40


def _tail(key: str) -> str:
    """A series key without its file name (a relocated workbook may have a new name)."""
    return key.split("|", 1)[-1]


class StudiesController(QObject):
    """The open study: its file, and its autosave."""

    def __init__(self, series_panel: SeriesPanel, findings_panel: FindingsPanel,
                 session: Session, prompts: Prompts, status: QLabel, files: FilesController,
                 runs: RunsController, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.series_panel = series_panel
        self.findings_panel = findings_panel
        self.session = session
        self.prompts = prompts
        self.status = status
        self.files = files
        self.runs = runs
        self._autosave_thread: threading.Thread | None = None
        self.saving = False  # a study is being written
        self.autosave_timer = QTimer(self)
        self.autosave_timer.setInterval(AUTOSAVE_MS)
        self.autosave_timer.timeout.connect(self.autosave)
        self._autosave_later = QTimer(self)
        self._autosave_later.setSingleShot(True)
        self._autosave_later.setInterval(AUTOSAVE_AFTER_RUN_MS)
        self._autosave_later.timeout.connect(self.autosave)
        files.study_requested.connect(self.open_study)
        runs.ended.connect(self.autosave_soon)

    def _study_parts(self) -> _StudyParts:
        """What :func:`build_study` makes a study from, taken now on the window's thread (copies,
        so a helper thread can build and write it while the window goes on)."""
        model = self.series_panel.model
        return (self.session.settings, list(model.workbooks()), list(model.all_series()),
                dict(self.findings_panel.model.results()), dict(self.session.gap_handling))

    def _set_study_path(self, path: Path | None) -> None:
        store.set_value(store.KEY_LAST_STUDY, str(path) if path is not None else "")
        if path is not None:
            store.set_value(store.KEY_STUDY_FOLDER, str(path.parent))
        self.session.set_study_path(path)

    # saving -------------------------------------------------------------
    def save_study(self) -> bool:
        if self.session.study_path is None:
            return self.save_study_as()
        return self.save_study_to(self.session.study_path)

    def save_study_as(self) -> bool:
        folder = str(store.get_value(store.KEY_STUDY_FOLDER) or "")
        start = str(Path(folder) / f"study{STUDY_SUFFIX}") if folder else f"study{STUDY_SUFFIX}"
        answer = self.prompts.ask_save_path("Save study as", start, STUDY_FILTER)
        if not answer:
            return False
        path = Path(answer)
        if path.suffix.lower() != STUDY_SUFFIX:
            path = path.with_name(path.name + STUDY_SUFFIX)
        return self.save_study_to(path)

    def save_study_to(self, path: Path | str) -> bool:
        from tauscope.report.study import StudyError
        from tauscope.report.study import save_study as write_study

        if self.saving:  # Ctrl+S again while the study is being written: one at a time
            return False
        target = Path(path).resolve()
        parts = self._study_parts()
        # The findings as JSON (seconds with a thousand of them) are made and written in a
        # helper thread; the window keeps answering meanwhile.
        self.status.setText(f"Saving the study {target.name}…")
        self.saving = True
        try:
            wait_off_thread(lambda: write_study(target, build_study(*parts)))
        except StudyError as exc:
            self.status.setText("")
            self.prompts.tell(str(exc), title="The study was not saved")
            return False
        finally:
            self.saving = False
        self.discard_autosave()  # the autosave of the study as it was called before
        self._set_study_path(target)
        self.discard_autosave()
        self.session.set_modified(False)
        self.status.setText(f"Saved the study {target.name}.")
        return True

    # opening ------------------------------------------------------------
    def choose_study(self) -> None:
        folder = str(store.get_value(store.KEY_STUDY_FOLDER) or "")
        answer = self.prompts.ask_open_path("Open study", folder, STUDY_FILTER)
        if answer:
            self.open_study(answer)

    def open_study(self, path: Path | str) -> bool:
        """Open a study: re-read its workbooks (warning when one changed or moved, offering to
        locate a missing one), restore its series and settings, and analyse them again."""
        from tauscope.report.study import StudyError, load_study

        if self.runs.is_running():
            self.prompts.tell("Stop the running analysis (Esc) before opening a study.")
            return False
        source = Path(path).resolve()
        try:
            study = load_study(source)
        except StudyError as exc:
            self.prompts.tell(str(exc), title="The study was not opened")
            return False
        return self.restore_study(study, source, modified=False)

    def restore_study(self, study: Study, path: Path | None, modified: bool) -> bool:
        from tauscope.report.rerun import reopen_series
        from tauscope.report.study import relocate

        check = check_study_sources(study, path)
        for missing in check.missing:
            located = self.prompts.ask_open_path(
                f"Where is {Path(missing).name} now?", str(Path(missing).parent), FILE_FILTER)
            if located:
                study = relocate(study, missing, located)
        check = check_study_sources(study, path)
        reopened = reopen_series(study, path)
        self.files.close_all()
        model = self.series_panel.model
        for book in reopened.workbooks:
            model.add_workbook(book)
        for item, series in reopened.series:
            if item.transforms:
                self._restore_transformed(series)
            elif item.gaps != "none":
                model.replace_series(series)
            if item.gaps != "none":
                self.session.gap_handling[series.key] = item.gaps
        for row in range(model.rowCount()):
            self.series_panel.expand_workbook(model.item(row, 0))
        self.session.set_settings(study.settings)
        store.save_settings(study.settings)
        self._set_study_path(path)
        problems = check.warnings() + [p for p in reopened.problems
                                       if not any(Path(m).name in p for m in check.missing)]
        analysed = {_tail(k) for k in analysed_keys(study)}
        to_run = [s for item, s in reopened.series if _tail(item.key) in analysed]
        if to_run and self.runs.run_series(to_run, quiet=not modified):
            self.series_panel.select_key(to_run[0].key)
        self.session.set_modified(modified)
        name = path.name if path is not None else "the recovered study"
        self.status.setText(f"Opened {name}: analysing {len(to_run)} series again…"
                            if to_run else f"Opened {name}.")
        if problems:
            self.prompts.tell("Opening the study:\n• " + "\n• ".join(problems),
                              title="The study's workbooks")
        return True

    def _restore_transformed(self, series: SeriesData) -> None:
        """Put a transformed copy back under the series it was made from."""
        head, _sep, chain = series.key.rpartition("|")
        steps = [c for c in chain.split(",") if c]
        model = self.series_panel.model
        for cut in range(len(steps) - 1, -1, -1):
            parent = f"{head}|{','.join(steps[:cut])}"
            if model.item_for_key(parent) is not None:
                model.add_transformed(parent, series)
                return

    # autosave -----------------------------------------------------------
    def autosave(self, wait: bool = False) -> Path | None:
        """Keep a copy of the open study with unsaved changes, offered back after a crash.

        The autosave lists the analysed series instead of their findings (recovering analyses
        them again, to the same numbers): hundreds of findings as JSON take seconds to write.
        What to save is collected here; a background thread writes it.  ``wait``: block
        until written and return its path.
        """
        from tauscope.report.study import StudyError, autosave_path, write_autosave

        if not self.session.modified or self.session.closing:
            return None
        if self._autosave_thread is not None and self._autosave_thread.is_alive():
            if not wait:
                return None  # the one under way is recent enough
            self._autosave_thread.join()
        self._autosave_later.stop()  # this one will do: the one due after a run is not needed
        parts = self._study_parts()
        study_path, folder = self.session.study_path, store.data_folder()

        def write() -> None:
            with contextlib.suppress(StudyError, OSError, ValueError):
                write_autosave(study_path, folder, build_study(*parts, with_findings=False))

        thread = threading.Thread(target=write, name="tauscope-autosave", daemon=True)
        self._autosave_thread = thread
        thread.start()
        if not wait:
            return None
        thread.join()
        target = autosave_path(study_path, folder)
        return target if target.is_file() else None

    def autosave_soon(self) -> None:
        """Autosave in an event of its own, :data:`AUTOSAVE_AFTER_RUN_MS` from now: the
        window answers in between."""
        self._autosave_later.start()

    def autosave_running(self) -> bool:
        """An autosave is due (:meth:`autosave_soon`) or being written."""
        return self._autosave_later.isActive() or (
            self._autosave_thread is not None and self._autosave_thread.is_alive())

    def _wait_for_autosave(self) -> None:
        if self._autosave_thread is not None:
            self._autosave_thread.join()
            self._autosave_thread = None

    def discard_autosave(self) -> None:
        from tauscope.report.study import discard_autosave

        self._wait_for_autosave()  # else it could write the file again after it is removed
        with contextlib.suppress(OSError):
            discard_autosave(self.session.study_path, store.data_folder())

    def close(self) -> None:
        """A clean close: no more autosaves, and nothing to recover next time."""
        self.autosave_timer.stop()
        self.discard_autosave()

    def offer_recovery(self) -> bool:
        """After an abnormal exit, offer back the autosaved study; returns True when restored."""
        from tauscope.report.study import (
            StudyError,
            discard_autosave,
            load_study,
            recoverable_autosave,
        )

        last = str(store.get_value(store.KEY_LAST_STUDY) or "")
        study_path = Path(last) if last else None
        folder = store.data_folder()
        candidate = recoverable_autosave(study_path, folder)
        if candidate is None:
            return False
        name = study_path.name if study_path is not None else "an unsaved study"
        if not self.prompts.ask_yes_no("Recover unsaved work?",
                                       f"Tauscope did not close normally last time. Recover the "
                                       f"unsaved changes to {name}? (No discards them.)"):
            discard_autosave(study_path, folder)
            return False
        try:
            study = load_study(candidate)
        except StudyError as exc:
            self.prompts.tell(str(exc))
            return False
        return self.restore_study(study, study_path, modified=True)
