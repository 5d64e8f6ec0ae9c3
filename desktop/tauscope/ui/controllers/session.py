"""The open study as the window's jobs share it: its settings, its file, whether it has
unsaved changes, how gaps were mended, and whether the window is closing."""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QObject, Signal

from tauscope.engine import Settings


class Session(QObject):
    """State the controllers share; the window shows it (title, settings line)."""

    modified_changed = Signal(bool)
    study_path_changed = Signal(object)  # Path or None
    settings_changed = Signal(object)  # Settings

    def __init__(self, settings: Settings, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.settings = settings
        self.study_path: Path | None = None  # None until saved
        self.modified = False
        self.gap_handling: dict[str, str] = {}  # series key -> "longest" or "interpolate"
        self.closing = False

    def set_modified(self, modified: bool) -> None:
        self.modified = modified
        self.modified_changed.emit(modified)

    def set_study_path(self, path: Path | None) -> None:
        self.study_path = path
        self.study_path_changed.emit(path)

    def set_settings(self, settings: Settings) -> None:
        self.settings = settings
        self.settings_changed.emit(settings)
