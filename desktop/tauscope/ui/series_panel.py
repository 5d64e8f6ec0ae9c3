"""The Series panel: filter box and the tree of workbooks, sheets and series."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from PySide6.QtCore import (
    QItemSelectionModel,
    QModelIndex,
    QPoint,
    QSortFilterProxyModel,
    Qt,
    Signal,
)
from PySide6.QtGui import QAction
from PySide6.QtWidgets import (
    QAbstractItemView,
    QHeaderView,
    QLineEdit,
    QMenu,
    QTreeView,
    QVBoxLayout,
    QWidget,
)

from tauscope.ui.columns import ColumnFitter
from tauscope.ui.qtcompat import item_value, tree_path
from tauscope.ui.roles import KEY_ROLE, KIND_ROLE, SORT_ROLE
from tauscope.ui.series_model import COLUMNS, FREQUENCY, NAME, SHAPE, SeriesTreeModel
from tauscope.ui.series_widths import SeriesWidths
from tauscope.ui.sparkline import SparklineDelegate

if TYPE_CHECKING:
    from tauscope.data import SeriesData


class SeriesPanel(QWidget):
    """Shows the open workbooks; emits the series the user points at."""

    current_changed = Signal(str)  # key of the current series ("" when none)
    transform_requested = Signal(str, str)  # series key, transform key
    gaps_requested = Signal(str, str)  # series key, "cut" or "fill"
    remove_requested = Signal(str)  # key of a transformed copy to take out
    run_requested = Signal()

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.model = SeriesTreeModel(self)
        self.proxy = QSortFilterProxyModel(self)
        self.proxy.setSourceModel(self.model)
        self.proxy.setRecursiveFilteringEnabled(True)
        self.proxy.setAutoAcceptChildRows(True)
        self.proxy.setFilterCaseSensitivity(Qt.CaseSensitivity.CaseInsensitive)
        self.proxy.setFilterKeyColumn(NAME)
        self.proxy.setSortRole(SORT_ROLE)

        self.filter_box = QLineEdit(self)
        self.filter_box.setPlaceholderText("Filter series by name (Ctrl+F)")
        self.filter_box.setClearButtonEnabled(True)
        self.filter_box.setAccessibleName("Filter series")
        self.filter_box.setToolTip("Show only the series whose name contains this text.")
        self.filter_box.textChanged.connect(self._filter)

        self.view = QTreeView(self)
        self.view.setModel(self.proxy)
        self.view.setAccessibleName("Series")
        self.view.setAccessibleDescription("Open workbooks, their sheets and series")
        self.view.setSelectionMode(QAbstractItemView.SelectionMode.ExtendedSelection)
        self.view.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        self.view.setUniformRowHeights(True)
        self.view.setAlternatingRowColors(True)
        self.view.setSortingEnabled(False)
        self.view.setItemDelegateForColumn(SHAPE, SparklineDelegate(self.model.spark, self.view))
        self.view.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.view.customContextMenuRequested.connect(self._context_menu)
        self.view.selectionModel().currentRowChanged.connect(self._current_row_changed)
        header = self.view.header()
        header.setStretchLastSection(False)
        header.setSectionResizeMode(QHeaderView.ResizeMode.Interactive)
        self.view.setIndentation(14)
        # Every column as wide as its text; the names get the spare width; the frequency
        # (also in each series' tooltip and readable from the span) goes first when short.
        # The widths are those of every row, folded away or not (see SeriesWidths).
        self.widths = SeriesWidths(self.view, self.model)
        self.columns = ColumnFitter(self.view, self.widths.natural, stretch=(NAME,),
                                    optional=(FREQUENCY,))
        self.model.rowsInserted.connect(lambda *_args: self.columns.fit_soon())
        self.model.rowsRemoved.connect(lambda *_args: self.columns.fit_soon())
        self.model.dataChanged.connect(lambda *_args: self.columns.fit_soon())
        self.columns.fit()

        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.setSpacing(4)
        layout.addWidget(self.filter_box)
        layout.addWidget(self.view)
        self.setFocusProxy(self.view)

    # selection ----------------------------------------------------------
    def _filter(self, text: str) -> None:
        self.proxy.setFilterFixedString(text)
        if text:
            self.view.expandAll()

    def _current_row_changed(self, current: QModelIndex, _previous: QModelIndex) -> None:
        key = ""
        if current.isValid() and item_value(current, KIND_ROLE) == "series":
            key = str(item_value(current.siblingAtColumn(NAME), KEY_ROLE))
        self.current_changed.emit(key)

    def selected_series(self) -> list[SeriesData]:
        """Series picked by the user (a workbook or sheet stands for all its series), in order,
        each once; all series when nothing is selected.

        One walk down the tree: a series is picked when its own row is selected or a
        workbook or sheet above it is (with every workbook selected, asking each selected
        row for the series below it walked the tree three times: 20–30 ms of the window's
        thread at the start of a run of a thousand series)."""
        last = len(COLUMNS) - 1
        chosen: set[tuple[int, ...]] = set()
        # no filter and no sorting: a row of the view is the same row of the model
        same_rows = not self.proxy.filterRegularExpression().pattern() \
            and self.proxy.sortColumn() < 0
        selection = self.view.selectionModel().selection()
        for block in (selection.at(i) for i in range(selection.count())):  # whole rows
            if block.left() != 0 or block.right() != last:
                continue
            parent = block.parent()
            place = tree_path(self.proxy.mapToSource(parent))
            rows = range(block.top(), block.bottom() + 1)
            if same_rows:
                chosen.update((*place, r) for r in rows)
                continue
            for r in rows:
                chosen.add((*place, self.proxy.mapToSource(self.proxy.index(r, NAME, parent)).row()))
        if not chosen:
            return self.model.all_series()
        return self.model.series_picked(chosen)

    def select_all_series(self) -> None:
        self.view.expandAll()
        self.view.selectAll()

    def select_key(self, key: str) -> bool:
        item = self.model.item_for_key(key)
        if item is None:
            return False
        index = self.proxy.mapFromSource(item.index())
        if not index.isValid():
            return False
        self.view.scrollTo(index)
        flags = (QItemSelectionModel.SelectionFlag.ClearAndSelect
                 | QItemSelectionModel.SelectionFlag.Rows)
        self.view.selectionModel().setCurrentIndex(index, flags)
        return True

    def current_key(self) -> str:
        index = self.view.currentIndex()
        if index.isValid() and item_value(index, KIND_ROLE) == "series":
            return str(item_value(index.siblingAtColumn(NAME), KEY_ROLE))
        return ""

    # context menu ------------------------------------------------------
    def _context_menu(self, pos: QPoint) -> None:
        index = self.view.indexAt(pos)
        menu = QMenu(self)
        if index.isValid() and item_value(index, KIND_ROLE) == "series":
            key = str(item_value(index.siblingAtColumn(NAME), KEY_ROLE))
            transforms = self._transform_menu(menu, key)
            menu.addMenu(transforms)
            series = self.model.series_for_key(key)
            if series is not None and series.parent:
                remove = QAction("Remove this transformed copy", menu)
                remove.triggered.connect(lambda: self.remove_requested.emit(key))
                menu.addAction(remove)
            if series is not None and series.gaps:
                cut = QAction("Keep the longest stretch without gaps", menu)
                cut.triggered.connect(lambda: self.gaps_requested.emit(key, "cut"))
                fill = QAction("Fill the gaps by linear interpolation", menu)
                fill.triggered.connect(lambda: self.gaps_requested.emit(key, "fill"))
                menu.addAction(cut)
                menu.addAction(fill)
        run = QAction("Analyse the selected series", menu)
        run.triggered.connect(self.run_requested.emit)
        menu.addAction(run)
        menu.popup(self.view.viewport().mapToGlobal(pos))

    def _transform_menu(self, parent: QWidget, key: str) -> QMenu:
        from tauscope.data import TRANSFORMS

        menu = QMenu("Add a transformed copy", parent)
        for transform_key, label in TRANSFORMS.items():
            action = QAction(str(label), menu)
            action.triggered.connect(
                lambda _checked=False, k=key, t=transform_key: self.transform_requested.emit(k, t)
            )
            menu.addAction(action)
        return menu

    def expand_workbook(self, item: Any) -> None:
        index = self.proxy.mapFromSource(item.index())
        self.view.expand(index)
        for r in range(self.proxy.rowCount(index)):
            self.view.expand(self.proxy.index(r, 0, index))
