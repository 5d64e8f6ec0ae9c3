"""The window's state and questions as scripts and tests reach them: read through the
window from the controllers that hold them (``MainWindow`` mixes this in)."""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path

from PySide6.QtWidgets import QMessageBox

from tauscope.engine import Settings
from tauscope.ui.controllers.files import FilesController
from tauscope.ui.controllers.prompts import Prompts
from tauscope.ui.controllers.runs import RunsController
from tauscope.ui.controllers.session import Session
from tauscope.ui.loader import WorkbookLoader
from tauscope.ui.problem_dialog import ProblemDialog
from tauscope.ui.worker import AnalysisRunner


class WindowApi:
    """Properties over the controllers (set by the window's constructor)."""

    session: Session
    prompts: Prompts
    files: FilesController
    runs: RunsController

    # state the controllers hold, read (and the questions replaced) through the window
    @property
    def settings(self) -> Settings:
        return self.session.settings

    @property
    def study_path(self) -> Path | None:
        return self.session.study_path

    @property
    def runner(self) -> AnalysisRunner:
        return self.runs.runner

    @property
    def last_run(self) -> tuple[bool, int] | None:
        return self.runs.last_run

    @property
    def loader(self) -> WorkbookLoader:
        return self.files.loader

    @property
    def message_box(self) -> QMessageBox | None:
        return self.prompts.message_box

    @property
    def problem_dialog(self) -> ProblemDialog | None:
        return self.prompts.problem_dialog

    @property
    def ask_save_path(self) -> Callable[[str, str, str], str]:
        return self.prompts.ask_save_path

    @ask_save_path.setter
    def ask_save_path(self, ask: Callable[[str, str, str], str]) -> None:
        self.prompts.ask_save_path = ask

    @property
    def ask_open_path(self) -> Callable[[str, str, str], str]:
        return self.prompts.ask_open_path

    @ask_open_path.setter
    def ask_open_path(self, ask: Callable[[str, str, str], str]) -> None:
        self.prompts.ask_open_path = ask

    @property
    def ask_yes_no(self) -> Callable[[str, str], bool]:
        return self.prompts.ask_yes_no

    @ask_yes_no.setter
    def ask_yes_no(self, ask: Callable[[str, str], bool]) -> None:
        self.prompts.ask_yes_no = ask

    @property
    def ask_save_changes(self) -> Callable[[str], str]:
        return self.prompts.ask_save_changes

    @ask_save_changes.setter
    def ask_save_changes(self, ask: Callable[[str], str]) -> None:
        self.prompts.ask_save_changes = ask
