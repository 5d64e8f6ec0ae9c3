"""Files: opening workbooks (from the dialog, the recent list, the demo or a drop) and
reading them in the background; transformed copies and mended gaps of the series, each an
undoable edit (controllers/edits.py) on the controller's undo stack."""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING, Any

from PySide6.QtCore import QEvent, QObject, Signal
from PySide6.QtGui import QDragEnterEvent, QDropEvent, QUndoStack
from PySide6.QtWidgets import QLabel, QMenu, QWidget

from tauscope.data.notes import reader_notes
from tauscope.report.study import STUDY_SUFFIX
from tauscope.resources_path import demo_workbook
from tauscope.ui import store
from tauscope.ui.controllers.current import CurrentSeries
from tauscope.ui.controllers.edits import AddTransformed, EditContext, MendGaps, RemoveTransformed
from tauscope.ui.controllers.prompts import Prompts
from tauscope.ui.controllers.session import Session
from tauscope.ui.engine_process import shared_engine
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.loader import WorkbookLoader
from tauscope.ui.off_thread import freeze_long_lived
from tauscope.ui.series_panel import SeriesPanel

if TYPE_CHECKING:
    from tauscope.data import Workbook

FILE_FILTER = "Workbooks (*.xlsx *.xlsm *.xls *.csv *.tsv *.txt);;All files (*)"
READABLE_SUFFIXES = {".xlsx", ".xlsm", ".xls", ".csv", ".tsv", ".txt"}


def dropped_paths(mime: Any) -> list[str]:
    """The local workbook and study files among dropped data."""
    if not mime.hasUrls():
        return []
    return [url.toLocalFile() for url in mime.urls()
            if url.isLocalFile()
            and Path(url.toLocalFile()).suffix.lower() in READABLE_SUFFIXES | {STUDY_SUFFIX}]


class FilesController(QObject):
    """Workbooks into the Series panel."""

    study_requested = Signal(str)  # a study file was opened or dropped: its path

    def __init__(self, series_panel: SeriesPanel, findings_panel: FindingsPanel,
                 current: CurrentSeries, session: Session, prompts: Prompts, status: QLabel,
                 parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.series_panel = series_panel
        self.findings_panel = findings_panel
        self.current = current
        self.session = session
        self.prompts = prompts
        self.status = status
        self.loader = WorkbookLoader(self)
        self.loader.loaded.connect(self._workbook_loaded)
        self.loader.failed.connect(self._workbook_failed)
        self.undo_stack = QUndoStack(self)
        self.edits = EditContext(series_panel, findings_panel, current, session)

    # opening ------------------------------------------------------------
    def choose_files(self) -> None:
        start = str(Path(store.recent_files()[0]).parent) if store.recent_files() else ""
        self.open_files(self.prompts.ask_open_paths("Open workbooks", start, FILE_FILTER))

    def open_files(self, paths: list[str] | list[Path]) -> None:
        """Read each file in the background; the series appear when it is read.
        A study file (.tauscope) is opened as a study."""
        for path in paths:
            text = str(Path(path).expanduser().resolve())
            if Path(text).suffix.lower() == STUDY_SUFFIX:
                self.study_requested.emit(text)
                continue
            self.status.setText(f"Reading {Path(text).name}…")
            self.loader.load(text)

    def open_demo(self) -> None:
        path = demo_workbook()
        if path is None:
            self.prompts.tell("The demo workbook is missing from this installation.")
            return
        self.open_files([path])

    def add_workbook(self, workbook: Workbook) -> None:
        if str(workbook.path) in self.series_panel.model.workbook_paths():
            self.undo_stack.clear()  # the edits were made to the copy read before
        item = self.series_panel.model.add_workbook(workbook)
        self.series_panel.expand_workbook(item)
        store.add_recent_file(workbook.path)
        count = len(workbook.series())
        notes = reader_notes(workbook)  # what the reader noticed, as batch prints it
        self.status.setText(f"Opened {workbook.path.name}: {count} series"
                            + (f" — {notes}" if notes else ""))
        self.status.setToolTip(notes)
        self.session.set_modified(True)
        shared_engine().start_soon()  # the analysis process loads while the user chooses
        if not self.current.key and workbook.series():
            self.series_panel.select_key(workbook.series()[0].key)
        freeze_long_lived()  # the workbook and its rows stay while it is open

    def _workbook_loaded(self, _path: str, workbook: Any) -> None:
        if not self.session.closing:
            self.add_workbook(workbook)

    def _workbook_failed(self, path: str, message: str, details: str) -> None:
        if self.session.closing:
            return
        self.status.setText(message)
        if details:
            self.prompts.show_problem(message, details)
        else:
            self.prompts.tell(message)

    def close_all(self) -> None:
        self.undo_stack.clear()
        self.series_panel.model.clear_all()
        self.findings_panel.model.clear_results()
        self.session.gap_handling.clear()
        self.current.show("")
        self.session.set_modified(True)

    def fill_recent_menu(self, menu: QMenu) -> None:
        menu.clear()
        files = store.recent_files()
        for number, path in enumerate(files, start=1):
            action = menu.addAction(f"&{number} {Path(path).name}")
            action.setToolTip(path)
            action.triggered.connect(lambda _checked=False, p=path: self.open_files([p]))
        if not files:
            empty = menu.addAction("No recent workbooks")
            empty.setEnabled(False)
        else:
            menu.addSeparator()
            menu.addAction("Clear the list", store.clear_recent_files)

    # drag and drop ------------------------------------------------------
    def accept_drops_on(self, widget: QWidget) -> None:
        """Open the workbooks and studies dropped on ``widget``."""
        widget.setAcceptDrops(True)
        widget.installEventFilter(self)

    def eventFilter(self, watched: QObject, event: QEvent) -> bool:
        # (type, not isinstance: a drag-move event is a kind of drop event)
        if event.type() == QEvent.Type.DragEnter and isinstance(event, QDragEnterEvent):
            if dropped_paths(event.mimeData()):
                event.acceptProposedAction()
            else:
                event.ignore()
            return True
        if event.type() == QEvent.Type.Drop and isinstance(event, QDropEvent):
            paths = dropped_paths(event.mimeData())
            if paths:
                event.acceptProposedAction()
                self.open_files(paths)
            return True
        return super().eventFilter(watched, event)

    # series made from series --------------------------------------------
    def add_transform(self, key: str, transform: str) -> None:
        from tauscope.data import DataError, make_transform

        series = self.series_panel.model.series_for_key(key)
        if series is None:
            return
        try:
            derived = make_transform(series, transform)
        except DataError as exc:
            self.prompts.tell(str(exc))
            return
        self.undo_stack.push(AddTransformed(self.edits, key, derived))
        self.status.setText(f"Added {derived.name} (Edit → Undo takes it back)")

    def remove_transform(self, key: str) -> None:
        """Take a transformed copy (and the copies made from it) out of the window."""
        series = self.series_panel.model.series_for_key(key)
        if series is None or not series.parent:
            return
        self.undo_stack.push(RemoveTransformed(self.edits, key, series.name))
        self.status.setText(f"Removed {series.name} (Edit → Undo brings it back)")

    def mend_gaps(self, key: str, how: str) -> None:
        """Cut a series to its longest gap-free stretch, or fill its gaps (the file is untouched;
        the series' notes say what was done)."""
        series = self.series_panel.model.series_for_key(key)
        if series is None or not series.gaps:
            return
        self.undo_stack.push(MendGaps(self.edits, series, how))
        what = "cut to its longest stretch without gaps" if how == "cut" else "gaps filled"
        self.status.setText(f"{series.name}: {what}. Press F5 to analyse it.")
