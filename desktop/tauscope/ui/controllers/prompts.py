"""The window's questions and messages.  The questions are attributes, replaceable in
tests: (title, folder, filter) -> path or "", (title, text) -> yes or no, and (study name)
-> "save", "discard" or "cancel"."""

from __future__ import annotations

from collections.abc import Callable

from PySide6.QtCore import QObject, Qt
from PySide6.QtWidgets import QFileDialog, QMessageBox, QWidget

from tauscope.ui.problem_dialog import ProblemDialog


class Prompts(QObject):
    """Asks and tells on behalf of a window (the parent of every dialog)."""

    def __init__(self, window: QWidget) -> None:
        super().__init__(window)
        self.window = window
        self.message_box: QMessageBox | None = None  # the last message shown
        self.problem_dialog: ProblemDialog | None = None  # the last problem shown
        self.ask_open_paths: Callable[[str, str, str], list[str]] = self._ask_open_paths
        self.ask_save_path: Callable[[str, str, str], str] = self._ask_save_path
        self.ask_open_path: Callable[[str, str, str], str] = self._ask_open_path
        self.ask_yes_no: Callable[[str, str], bool] = self._ask_yes_no
        self.ask_save_changes: Callable[[str], str] = self._ask_save_changes

    def _ask_open_paths(self, title: str, start: str, filters: str) -> list[str]:
        paths, _chosen = QFileDialog.getOpenFileNames(self.window, title, start, filters)
        return list(paths)

    def _ask_save_path(self, title: str, start: str, filters: str) -> str:
        path, _chosen = QFileDialog.getSaveFileName(self.window, title, start, filters)
        return path

    def _ask_open_path(self, title: str, start: str, filters: str) -> str:
        path, _chosen = QFileDialog.getOpenFileName(self.window, title, start, filters)
        return path

    def _ask_yes_no(self, title: str, text: str) -> bool:
        answer = QMessageBox.question(self.window, title, text)
        return answer == QMessageBox.StandardButton.Yes

    def _ask_save_changes(self, name: str) -> str:
        buttons = QMessageBox.StandardButton
        box = QMessageBox(QMessageBox.Icon.Question, "Unsaved changes",
                          f"Save the changes to {name} before closing?",
                          buttons.Save | buttons.Discard | buttons.Cancel, self.window)
        box.setInformativeText("A study keeps the workbooks, the transformed series, the "
                               "settings and the findings. Changes not saved are lost.")
        box.setDefaultButton(buttons.Save)
        box.setEscapeButton(buttons.Cancel)
        answer = box.exec()
        return {buttons.Save: "save", buttons.Discard: "discard"}.get(
            buttons(answer), "cancel")

    def tell(self, text: str, title: str = "Tauscope") -> None:
        """A short message in a window-modal box that does not block the event loop."""
        box = QMessageBox(QMessageBox.Icon.Information, title, text, QMessageBox.StandardButton.Ok,
                          self.window)
        box.setWindowModality(Qt.WindowModality.WindowModal)
        box.open()
        self.message_box = box

    def show_problem(self, summary: str, details: str) -> None:
        """Something unexpected: a sentence, and details the user can copy."""
        dialog = ProblemDialog(summary, details, self.window)
        dialog.open()
        self.problem_dialog = dialog
