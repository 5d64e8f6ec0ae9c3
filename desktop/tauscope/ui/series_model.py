"""The Series panel's model: open workbooks → sheets → series (→ transformed copies)."""

from __future__ import annotations

from collections.abc import Iterator
from typing import TYPE_CHECKING, Any

import numpy as np
from PySide6.QtCore import Qt
from PySide6.QtGui import QStandardItem, QStandardItemModel

from tauscope.ui.qtcompat import item_value
from tauscope.ui.roles import KEY_ROLE, KIND_ROLE, SORT_ROLE
from tauscope.ui.sparkline import sparkline_points

if TYPE_CHECKING:
    from tauscope.data import SeriesData, Workbook

COLUMNS = ("Series", "Shape", "Obs.", "Gaps", "Span", "Frequency")
COLUMN_TIPS = (
    "Workbooks you opened, their sheets and the series found in each. Right-click a series "
    "to add a transformed copy (log, difference, growth, seasonal difference).",
    "A small drawing of the series, first value on the left.",
    "Number of observations that have a value.",
    "Stretches of missing values inside the series. A series with gaps must be cut to its "
    "longest stretch or filled before it can be tested.",
    "First and last date (or observation number when the dates could not be read).",
    "How often the series is observed, as read from its dates (shown when the panel is wide "
    "enough; always in the series' tooltip).",
)
NAME, SHAPE, OBS, GAPS, SPAN, FREQUENCY = range(6)


def _item(text: str, tip: str = "") -> QStandardItem:
    """A read-only cell with every role the panel reads already set."""
    item = QStandardItem(text)
    item.setEditable(False)
    item.setData("", KIND_ROLE)
    item.setData("", KEY_ROLE)
    item.setData(text.lower(), SORT_ROLE)
    if tip:
        item.setToolTip(tip)
    return item


def gaps_text(series: SeriesData) -> str:
    missing = sum(g.count for g in series.gaps)
    if not series.gaps:
        if series.filled:
            return "filled"
        return "cut" if any("longest stretch" in n for n in series.notes) else "none"
    return f"{missing} missing"


def series_tooltip(series: SeriesData) -> str:
    lines = [series.name]
    src = series.source
    lines.append(f"From {src.file}, sheet {src.sheet}, column {src.column}")
    if series.parent:
        lines.append(f"Derived from {series.parent}")
    lines.append(f"{series.nobs} {series.frequency or 'irregular'} observations, "
                 f"{series.span[0]} to {series.span[1]}")
    if series.gaps:
        lines.append("Gaps: " + "; ".join(f"{g.start} to {g.end} ({g.count})" for g in series.gaps))
    lines.extend(series.notes)
    return "\n".join(lines)


def row_texts(series: SeriesData) -> tuple[str, str, str, str, str]:
    """What one series' row shows in the Series, Obs., Gaps, Span and Frequency columns."""
    return (series.name, str(series.nobs), gaps_text(series),
            f"{series.span[0]}–{series.span[1]}", series.frequency or "irregular")


def series_row(series: SeriesData, texts: tuple[str, str, str, str, str] | None = None,
               ) -> list[QStandardItem]:
    """Cells for one series (``texts``: its :func:`row_texts`, when in hand).  Only text and
    the key go into Qt; the Python objects stay in the model's dictionaries (keeps object
    lifetimes out of Qt's hands)."""
    tip = series_tooltip(series)
    name_text, obs_text, gaps_label, span_text, freq_text = texts or row_texts(series)
    name = _item(name_text, tip)
    name.setData("series", KIND_ROLE)
    name.setData(series.key, KEY_ROLE)
    name.setData(series.name.lower(), SORT_ROLE)
    shape = _item("", tip)
    shape.setData(f"Drawing of {series.name}", Qt.ItemDataRole.AccessibleTextRole)
    obs = _item(obs_text, tip)
    obs.setData(series.nobs, SORT_ROLE)
    obs.setTextAlignment(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
    freq = _item(freq_text, tip)
    span = _item(span_text, tip)
    gaps = _item(gaps_label, tip)
    row = [name, shape, obs, gaps, span, freq]
    for cell in row[1:]:
        cell.setData("series", KIND_ROLE)
        cell.setData(series.key, KEY_ROLE)
    return row


def _container_row(text: str, kind: str, tip: str) -> list[QStandardItem]:
    first = _item(text, tip)
    first.setData(kind, KIND_ROLE)
    first.setData(text.lower(), SORT_ROLE)
    rest = [_item("") for _ in COLUMNS[1:]]
    for cell in rest:
        cell.setData(kind, KIND_ROLE)
    return [first, *rest]


class SeriesTreeModel(QStandardItemModel):
    """Workbooks at the top, sheets below, series below each sheet."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(0, len(COLUMNS), parent)
        self._series: dict[str, SeriesData] = {}
        self._sparks: dict[str, np.ndarray] = {}
        # each series' level (the rows above it: 2 under a sheet) and its row's texts
        self._shown: dict[str, tuple[int, tuple[str, str, str, str, str]]] = {}
        self._workbooks: dict[str, Workbook] = {}
        for column, (title, tip) in enumerate(zip(COLUMNS, COLUMN_TIPS, strict=True)):
            header = QStandardItem(title)
            header.setToolTip(tip)
            self.setHorizontalHeaderItem(column, header)

    # building -----------------------------------------------------------
    def add_workbook(self, workbook: Workbook) -> QStandardItem:
        """Add (or replace, when the same file is open) a workbook; returns its item."""
        self.remove_workbook(str(workbook.path))
        notes = "\n".join(workbook.notes)
        tip = str(workbook.path) + (f"\n{notes}" if notes else "")
        row = _container_row(workbook.path.name, "workbook", tip)
        self._workbooks[str(workbook.path)] = workbook
        row[0].setData(str(workbook.path), KEY_ROLE)
        for sheet in workbook.sheets:
            sheet_tip = f"Sheet {sheet.name} of {workbook.path.name}"
            if sheet.notes:
                sheet_tip += "\n" + "\n".join(sheet.notes)
            sheet_row = _container_row(sheet.name, "sheet", sheet_tip)
            sheet_row[SHAPE].setText(f"{len(sheet.series)} series")
            sheet_row[SHAPE].setToolTip("Number of series on this sheet")
            for series in sheet.series:
                sheet_row[0].appendRow(self._series_row(series, 2))
            row[0].appendRow(sheet_row)
        self.appendRow(row)
        return row[0]

    def _series_row(self, series: SeriesData, depth: int) -> list[QStandardItem]:
        self._series[series.key] = series
        texts = row_texts(series)
        self._shown[series.key] = (depth, texts)
        self._sparks[series.key] = sparkline_points(series.values)
        return series_row(series, texts)

    def _depth(self, key: str) -> int:
        shown = self._shown.get(key)
        return shown[0] if shown is not None else 2

    def remove_workbook(self, path: str) -> bool:
        for r in range(self.rowCount()):
            item = self.item(r, 0)
            if item_value(item.index(), KEY_ROLE) == path:
                for child in self.iter_series_items(item):
                    key = str(item_value(child.index(), KEY_ROLE))
                    self._series.pop(key, None)
                    self._sparks.pop(key, None)
                    self._shown.pop(key, None)
                self._workbooks.pop(path, None)
                self.removeRow(r)
                return True
        return False

    def clear_all(self) -> None:
        self.removeRows(0, self.rowCount())
        self._series.clear()
        self._sparks.clear()
        self._shown.clear()
        self._workbooks.clear()

    def spark(self, key: str) -> np.ndarray | None:
        return self._sparks.get(key)

    def add_transformed(self, parent_key: str, series: SeriesData,
                        position: int | None = None) -> QStandardItem | None:
        """Add a transformed copy under the series it came from (replacing an equal one), last
        or at row ``position`` among its siblings."""
        parent = self.item_for_key(parent_key)
        if parent is None:
            return None
        existing = self.item_for_key(series.key)
        if existing is not None and existing.parent() is not None:
            self.remove_transformed(series.key)
        row = self._series_row(series, self._depth(parent_key) + 1)
        if position is None or not 0 <= position <= parent.rowCount():
            parent.appendRow(row)
        else:
            parent.insertRow(position, row)
        return row[0]

    def remove_transformed(self, key: str) -> list[tuple[str, int, SeriesData]]:
        """Take a transformed copy (and the copies made from it) out of the tree; returns each
        removed series with its parent's key and its row there, parents first, so that adding
        them back in that order restores the tree."""
        item = self.item_for_key(key)
        parent = item.parent() if item is not None else None
        if item is None or parent is None or parent.data(KIND_ROLE) != "series":
            return []
        removed: list[tuple[str, int, SeriesData]] = []

        def collect(node: QStandardItem, parent_key: str) -> None:
            node_key = str(node.data(KEY_ROLE))
            removed.append((parent_key, node.row(), self._series[node_key]))
            for r in range(node.rowCount()):
                child = node.child(r, 0)
                if child is not None and child.data(KIND_ROLE) == "series":
                    collect(child, node_key)

        collect(item, str(parent.data(KEY_ROLE)))
        for _parent_key, _row, series in removed:
            self._series.pop(series.key, None)
            self._sparks.pop(series.key, None)
            self._shown.pop(series.key, None)
        parent.removeRow(item.row())
        return removed

    def replace_series(self, series: SeriesData) -> bool:
        """Show new data for a series already in the tree (same key), e.g. after its gaps
        were cut away or filled."""
        item = self.item_for_key(series.key)
        if item is None:
            return False
        parent = item.parent() or self.invisibleRootItem()
        self._series[series.key] = series
        self._sparks[series.key] = sparkline_points(series.values)
        texts = row_texts(series)
        self._shown[series.key] = (self._depth(series.key), texts)
        for column, fresh in enumerate(series_row(series, texts)):
            cell = parent.child(item.row(), column)
            if cell is not None:
                cell.setText(fresh.text())
                cell.setToolTip(fresh.toolTip())
        return True

    # lookup -------------------------------------------------------------
    def iter_series_items(self, root: QStandardItem | None = None) -> Iterator[QStandardItem]:
        """Every series item (depth first, in display order) under root (default: all)."""
        start = root if root is not None else self.invisibleRootItem()
        for r in range(start.rowCount()):
            child = start.child(r, 0)
            if child is None:
                continue
            if child.data(KIND_ROLE) == "series":
                yield child
            yield from self.iter_series_items(child)

    def item_for_key(self, key: str) -> QStandardItem | None:
        for item in self.iter_series_items():
            if item_value(item.index(), KEY_ROLE) == key:
                return item
        return None

    def series_texts(self) -> Iterator[tuple[str, int, tuple[str, str, str, str, str]]]:
        """Every series in the tree (in no set order): its key, its level (the rows above
        it: a workbook's and a sheet's, 2; one more for each transform of a copy) and its
        row's texts (:func:`row_texts`; a new tuple when they change)."""
        return ((key, depth, texts) for key, (depth, texts) in self._shown.items())

    def container_names(self) -> Iterator[tuple[str, int]]:
        """The workbooks' and sheets' rows: their names and levels (0 and 1)."""
        for workbook in self._workbooks.values():
            yield workbook.path.name, 0
            for sheet in workbook.sheets:
                yield sheet.name, 1

    def series_for_key(self, key: str) -> SeriesData | None:
        return self._series.get(key)

    def all_series(self) -> list[SeriesData]:
        return [self._series[str(item.data(KEY_ROLE))] for item in self.iter_series_items()]

    def series_picked(self, chosen: set[tuple[int, ...]]) -> list[SeriesData]:
        """The series of the rows at the places ``chosen`` (rows from the top down), in
        display order, each once: a series row stands for itself, a workbook's or sheet's
        row for every series below it, transformed copies included."""
        picked: list[SeriesData] = []

        def walk(node: QStandardItem, place: tuple[int, ...], covered: bool) -> None:
            for r in range(node.rowCount()):
                child = node.child(r, 0)
                if child is None:
                    continue
                here = (*place, r)
                if child.data(KIND_ROLE) == "series":
                    if covered or here in chosen:
                        picked.append(self._series[str(child.data(KEY_ROLE))])
                    if child.hasChildren():  # transformed copies
                        walk(child, here, covered)
                else:
                    walk(child, here, covered or here in chosen)

        walk(self.invisibleRootItem(), (), False)
        return picked

    def workbooks(self) -> list[Workbook]:
        """The open workbooks, in the order shown."""
        return [self._workbooks[p] for p in self.workbook_paths() if p in self._workbooks]

    def workbook_paths(self) -> list[str]:
        return [str(item_value(self.index(r, 0), KEY_ROLE)) for r in range(self.rowCount())]
