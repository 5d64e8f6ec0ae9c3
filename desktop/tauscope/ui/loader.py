"""Reading workbooks off the window's thread, so a large file never freezes it."""

from __future__ import annotations

import traceback
from pathlib import Path

from PySide6.QtCore import QObject, QRunnable, QThreadPool, Signal


class LoaderSignals(QObject):
    loaded = Signal(str, object)  # path, Workbook
    failed = Signal(str, str, str)  # path, one clear sentence, details ("" for bad input)


class _LoadTask(QRunnable):
    def __init__(self, path: str, signals: LoaderSignals) -> None:
        super().__init__()
        self.path = path
        self.signals = signals

    def run(self) -> None:
        from tauscope.data import DataError, read_workbook

        try:
            workbook = read_workbook(self.path)
        except DataError as exc:
            self.signals.failed.emit(self.path, str(exc), "")
        except Exception as exc:
            self.signals.failed.emit(
                self.path, f"{Path(self.path).name} could not be read ({type(exc).__name__}: {exc}).",
                traceback.format_exc())
        else:
            self.signals.loaded.emit(self.path, workbook)


class WorkbookLoader(QObject):
    """Starts one background read per file and counts the reads still running."""

    loaded = Signal(str, object)
    failed = Signal(str, str, str)

    def __init__(self, parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.signals = LoaderSignals(self)
        self.signals.loaded.connect(self._loaded)
        self.signals.failed.connect(self._failed)
        self.pool = QThreadPool(self)
        self.pool.setMaxThreadCount(2)
        self.pending = 0

    def load(self, path: str) -> None:
        self.pending += 1
        self.pool.start(_LoadTask(path, self.signals))

    def _loaded(self, path: str, workbook: object) -> None:
        self.pending -= 1
        self.loaded.emit(path, workbook)

    def _failed(self, path: str, message: str, details: str) -> None:
        self.pending -= 1
        self.failed.emit(path, message, details)

    def wait(self, msecs: int = 10_000) -> bool:
        return self.pool.waitForDone(msecs)
