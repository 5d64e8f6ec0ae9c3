"""The Findings panel: the tree view of verdicts, decision paths and regressions."""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import replace
from typing import TYPE_CHECKING

from PySide6.QtCore import QItemSelectionModel, QMimeData, QModelIndex, QPoint, Qt, Signal
from PySide6.QtGui import QAction, QGuiApplication, QKeySequence
from PySide6.QtWidgets import QAbstractItemView, QMenu, QTreeView, QVBoxLayout, QWidget

from tauscope.ui.columns import ColumnFitter
from tauscope.ui.findings_model import (
    NAME,
    VERDICT,
    FindingsModel,
    FindingsSortProxy,
)
from tauscope.ui.findings_widths import MEASURED, RowWidths, natural_widths
from tauscope.ui.qtcompat import item_value
from tauscope.ui.roles import GUIDE_ROLE, KEY_ROLE, KIND_ROLE

if TYPE_CHECKING:
    from tauscope.report import RunRecord


class FindingsPanel(QWidget):
    current_changed = Signal(str)  # key of the series the current row belongs to
    guide_requested = Signal(str)  # guide anchor

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.model = FindingsModel(self)
        # keys (row order) -> the findings as a run record; set by the window
        self.record_for: Callable[[list[str]], RunRecord] | None = None
        self._row_widths = RowWidths()  # per-row text widths, kept between fits
        self.proxy = FindingsSortProxy(self)
        self.proxy.setSourceModel(self.model)
        self.view = QTreeView(self)
        self.view.setModel(self.proxy)
        self.view.setAccessibleName("Findings")
        self.view.setAccessibleDescription(
            "Verdict for each analysed series; expand a row for the decision path")
        self.view.setSortingEnabled(True)
        self.view.sortByColumn(-1, Qt.SortOrder.AscendingOrder)  # arrival order until a click
        self.view.setSelectionMode(QAbstractItemView.SelectionMode.ExtendedSelection)
        self.view.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        self.view.setAlternatingRowColors(True)
        self.view.setUniformRowHeights(True)
        self.view.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.view.customContextMenuRequested.connect(self._context_menu)
        self.view.selectionModel().currentRowChanged.connect(self._current_row_changed)
        self.view.setEditTriggers(QAbstractItemView.EditTrigger.NoEditTriggers)
        self.view.expanded.connect(self._expanded)
        self.view.header().setStretchLastSection(False)
        # Every column as wide as its text; spare width to the names and the verdicts.
        self.columns = ColumnFitter(self.view, self._natural_widths, stretch=(NAME, VERDICT))
        self.model.rowsInserted.connect(self._rows_inserted)
        self.model.dataChanged.connect(lambda first, *_args: self._rows_changed(first))
        self.columns.fit()
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.addWidget(self.view)
        self.setFocusProxy(self.view)

    def _current_row_changed(self, current: QModelIndex, _previous: QModelIndex) -> None:
        self.current_changed.emit(str(item_value(current, KEY_ROLE, "")))

    def _rows_inserted(self, parent: QModelIndex, first: int, _last: int) -> None:
        # a series' row (the rows below it are measured with it) among those measured
        if not parent.isValid() and first < MEASURED:
            self.columns.fit_soon()

    def _rows_changed(self, first: QModelIndex) -> None:
        if not first.parent().isValid() and first.row() < MEASURED:
            self.columns.fit_soon()

    def _expanded(self, index: QModelIndex) -> None:
        self.model.populate(self.proxy.mapToSource(index))
        self._span_sentences(index)

    def _span_sentences(self, index: QModelIndex) -> None:
        """A sentence under a series (why it could not be tested) spans the whole row."""
        for r in range(self.proxy.rowCount(index)):
            if item_value(self.proxy.index(r, NAME, index), KIND_ROLE) == "error":
                self.view.setFirstColumnSpanned(r, index, True)

    def _natural_widths(self) -> list[int]:
        return natural_widths(self.view, self.model, self._row_widths)

    def expand_all(self) -> None:
        self.model.populate_all()
        self.view.expandAll()
        for r in range(self.proxy.rowCount()):
            self._span_sentences(self.proxy.index(r, NAME))

    def select_key(self, key: str) -> None:
        row = self.model.row_for_key(key)
        if row is None:
            self.view.clearSelection()
            return
        index = self.proxy.mapFromSource(self.model.index(row, NAME))
        if item_value(self.view.currentIndex(), KEY_ROLE) == key:
            return
        self.view.selectionModel().setCurrentIndex(
            index, QItemSelectionModel.SelectionFlag.ClearAndSelect
            | QItemSelectionModel.SelectionFlag.Rows)
        self.view.scrollTo(index)

    def current_guide_anchor(self) -> str:
        index = self.view.currentIndex()
        return str(item_value(index, GUIDE_ROLE, ""))

    # copying ------------------------------------------------------------
    def selected_keys(self) -> list[str]:
        """Keys of the series with a selected row (or a selected step below them), in the
        order shown."""
        chosen = {str(item_value(i, KEY_ROLE, ""))
                  for i in self.view.selectionModel().selectedRows(NAME)}
        keys = []
        for r in range(self.proxy.rowCount()):
            key = str(item_value(self.proxy.index(r, NAME), KEY_ROLE, ""))
            if key in chosen:
                keys.append(key)
        return keys

    def copy_selection(self) -> RunRecord | None:
        """The selected findings on the clipboard in the report layout
        (``tauscope.report.clipboard``): tab-separated text and an HTML table.  Findings made
        with other settings than the window's are left out, as in every report; the record
        copied (with its ``left_out``) is returned."""
        from tauscope.report.clipboard import findings_html, findings_tsv

        keys = self.selected_keys()
        if not keys or self.record_for is None:
            return None
        run = self.record_for(keys).current()
        order = {k: i for i, k in enumerate(keys)}
        run = replace(run, findings=tuple(sorted(run.findings,
                                                 key=lambda f: order.get(f.key or "", 0))))
        mime = QMimeData()
        mime.setText(findings_tsv(run))
        mime.setHtml(findings_html(run))
        QGuiApplication.clipboard().setMimeData(mime)
        return run

    def _context_menu(self, pos: QPoint) -> None:
        menu = QMenu(self)
        copy = QAction("Copy the selected rows as a table", menu)
        copy.setShortcut(QKeySequence(QKeySequence.StandardKey.Copy))
        copy.triggered.connect(self.copy_selection)
        menu.addAction(copy)
        expand = QAction("Expand all", menu)
        expand.triggered.connect(self.expand_all)
        collapse = QAction("Collapse all", menu)
        collapse.triggered.connect(self.view.collapseAll)
        menu.addAction(expand)
        menu.addAction(collapse)
        index = self.view.indexAt(pos)
        anchor = str(item_value(index, GUIDE_ROLE, ""))
        if anchor:
            explain = QAction("Explain this in the guide", menu)
            explain.triggered.connect(lambda: self.guide_requested.emit(anchor))
            menu.addAction(explain)
        menu.popup(self.view.viewport().mapToGlobal(pos))

