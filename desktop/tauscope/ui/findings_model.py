"""The Findings panel's model: one row per series, its decision path below,
and under each step the regression behind it.  Everything shown comes from
the engine's SeriesResult; the rows are built in findings_rows."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QModelIndex, QPersistentModelIndex, QSortFilterProxyModel, Qt
from PySide6.QtGui import QColor, QStandardItem, QStandardItemModel

from tauscope.engine import SeriesResult, Settings
from tauscope.engine.reading.words import cross_check_meaning, cross_check_word
from tauscope.ui.findings_rows import (
    CHECK,
    COLUMN_GUIDE,
    COLUMN_TIPS,
    COLUMNS,
    CRITICAL,
    DECISION,
    LAGS,
    NAME,
    NOBS,
    ORDER_SORT,
    PENDING_SERIES,
    PENDING_STEP,
    PVALUE,
    STATISTIC,
    VERDICT,
    error_row,
    kpss_row,
    p_text,
    regression_rows,
    step_row,
    unit_root_test_row,
)
from tauscope.ui.markers import MARKERS, marker_icon, marker_kind
from tauscope.ui.qtcompat import item_value
from tauscope.ui.roles import GUIDE_ROLE, KEY_ROLE, KIND_ROLE, PENDING_ROLE, SORT_ROLE, VALUE_ROLE
from tauscope.ui.texts import GUIDE_HINT, OUT_OF_DATE

# The column numbers and p_text are used from here by the panel and the tests.
__all__ = ["CHECK", "COLUMNS", "CRITICAL", "DECISION", "LAGS", "NAME", "NOBS", "PVALUE",
           "STATISTIC", "VERDICT", "FindingsModel", "FindingsSortProxy", "p_text"]

class FindingsModel(QStandardItemModel):
    """One top-level row per analysed series, keyed by the series key."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(0, len(COLUMNS), parent)
        self._results: dict[str, SeriesResult] = {}  # Python objects stay out of Qt item data
        self._rows: dict[str, QPersistentModelIndex] = {}
        self.marker_color = QColor(Qt.GlobalColor.black)
        for column, (title, tip) in enumerate(zip(COLUMNS, COLUMN_TIPS, strict=True)):
            header = QStandardItem(title)
            header.setToolTip(tip + GUIDE_HINT)
            self.setHorizontalHeaderItem(column, header)

    def series_roles(self, key: str, result: SeriesResult) -> list[dict[int, Any]]:
        """Every role of every cell of a series row, so that the row can be filled with one
        call per cell (see :meth:`set_result`)."""
        kind = marker_kind(result)
        word, meaning = MARKERS[kind]
        verdict = result.verdict
        verdict_tip = verdict.text if result.error is None else str(result.error)
        agreement = verdict.agreement if result.error is None else None
        display = Qt.ItemDataRole.DisplayRole
        tooltip = Qt.ItemDataRole.ToolTipRole
        right = int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        cells: list[dict[int, Any]] = [
            {display: "", tooltip: COLUMN_TIPS[c] + GUIDE_HINT, GUIDE_ROLE: COLUMN_GUIDE[c],
             SORT_ROLE: ""} for c in range(len(COLUMNS))]
        cells[NAME].update({display: result.name, tooltip: verdict_tip + GUIDE_HINT,
                            GUIDE_ROLE: "verdicts", SORT_ROLE: result.name.lower(),
                            PENDING_ROLE: PENDING_SERIES})
        cells[VERDICT].update({
            display: verdict.label, tooltip: f"{verdict_tip}\nMarker: {meaning}{GUIDE_HINT}",
            GUIDE_ROLE: "verdicts", SORT_ROLE: f"{ORDER_SORT[kind]} {verdict.label}",
            Qt.ItemDataRole.DecorationRole: marker_icon(kind, self.marker_color),
            Qt.ItemDataRole.AccessibleTextRole: f"{word}: {verdict.label}"})
        cells[CHECK].update({display: cross_check_word(agreement),
                             tooltip: cross_check_meaning(agreement) + GUIDE_HINT,
                             SORT_ROLE: cross_check_word(agreement)})
        cells[NOBS].update({display: str(result.nobs), SORT_ROLE: float(result.nobs),
                            VALUE_ROLE: float(result.nobs), Qt.ItemDataRole.TextAlignmentRole: right})
        if result.error is not None:
            cells[DECISION].update({display: "error", tooltip: str(result.error)})
        for roles in cells:
            roles.update({KIND_ROLE: "series", KEY_ROLE: key})
        return [{int(r): v for r, v in roles.items()} for roles in cells]

    # children are built when first shown: a series row (and each step row) starts with
    # one placeholder child, replaced by the real rows when the row is expanded -------
    @staticmethod
    def _placeholder() -> QStandardItem:
        item = QStandardItem("…")
        item.setData("placeholder", KIND_ROLE)
        return item

    def populate(self, index: QModelIndex | QPersistentModelIndex) -> None:
        """Build the children of a series row (decision path, KPSS) or of a step row
        (the regression behind it), once."""
        tag = str(item_value(index, PENDING_ROLE, ""))
        item = self.itemFromIndex(index)
        if not tag or item is None:
            return
        item.setData("", PENDING_ROLE)
        item.removeRows(0, item.rowCount())  # the placeholder
        key = str(item_value(index, KEY_ROLE, ""))
        result = self._results.get(key)
        if result is None:
            return
        if tag == PENDING_SERIES:
            for row in self.child_rows(key, result):
                item.appendRow(row)
        elif tag.startswith(PENDING_STEP):
            step = result.steps[int(tag[len(PENDING_STEP):])]
            if step.test is not None:
                for row in regression_rows(key, step.test):
                    item.appendRow(row)

    def child_rows(self, key: str, result: SeriesResult) -> list[list[QStandardItem]]:
        if result.error is not None:
            return [error_row(key, str(result.error))]
        rows = []
        for number, step in enumerate(result.steps):
            row = step_row(key, step)
            if step.test is not None and step.test.regression is not None:
                row[NAME].setData(f"{PENDING_STEP}{number}", PENDING_ROLE)
                row[NAME].appendRow(self._placeholder())
            rows.append(row)
        rows.extend(kpss_row(key, test) for test in result.tests if test.test == "kpss")
        for name in ("pp", "dfgls", "za"):
            rows.extend(unit_root_test_row(key, test, result)
                        for test in result.tests if test.test == name)
        return rows

    def populate_all(self, parent: QModelIndex | None = None) -> None:
        """Build every child row (for copying everything, and for tests)."""
        parent = parent if parent is not None else QModelIndex()
        for r in range(self.rowCount(parent)):
            index = self.index(r, NAME, parent)
            self.populate(index)
            self.populate_all(index)

    def set_result(self, key: str, result: SeriesResult) -> int:
        """Show a result, replacing the series' earlier row if there is one; returns the row."""
        self._results[key] = result
        # Few calls into Qt per result: while the engine runs, each call may have to wait
        # for the worker thread to hand back the GIL.
        row = [QStandardItem() for _ in COLUMNS]
        existing = self.row_for_key(key)
        if existing is None:
            self.appendRow(row)
            position = self.rowCount() - 1
        else:
            self.removeRow(existing)
            self.insertRow(existing, row)
            position = existing
        for column, roles in enumerate(self.series_roles(key, result)):
            self.setItemData(self.index(position, column), roles)
        row[NAME].appendRow(self._placeholder())
        self._rows[key] = QPersistentModelIndex(self.index(position, NAME))
        return position

    def set_marker_color(self, color: QColor) -> None:
        """Redraw the verdict shapes in a new text colour (light or dark palette)."""
        self.marker_color = QColor(color)
        for key, result in self._results.items():
            row = self.row_for_key(key)
            if row is not None:
                self.setData(self.index(row, VERDICT), marker_icon(marker_kind(result), color),
                             Qt.ItemDataRole.DecorationRole)

    def mark_out_of_date(self, settings: Settings) -> int:
        """Add a visible word to the verdict of every finding computed with other settings
        (or remove it when the settings are back); returns how many are out of date."""
        wanted = settings.to_dict()
        stale = 0
        for key, result in self._results.items():
            row = self.row_for_key(key)
            if row is None:
                continue
            old = dict(result.settings) if result.settings else {}
            out_of_date = any(k in old and old[k] != v for k, v in wanted.items())
            stale += out_of_date
            label = result.verdict.label + (f" {OUT_OF_DATE}" if out_of_date else "")
            self.setData(self.index(row, VERDICT), label, Qt.ItemDataRole.DisplayRole)
        return stale

    def remove_result(self, key: str) -> SeriesResult | None:
        """Take a series' finding out (its series left the window); returns it."""
        row = self.row_for_key(key)
        if row is not None:
            self.removeRow(row)
        self._rows.pop(key, None)
        return self._results.pop(key, None)

    def row_for_key(self, key: str) -> int | None:
        index = self._rows.get(key)
        return index.row() if index is not None and index.isValid() else None

    def result_for_key(self, key: str) -> SeriesResult | None:
        return self._results.get(key)

    def results(self) -> dict[str, SeriesResult]:
        """Results in row order."""
        rows = {key: self.row_for_key(key) for key in self._results}
        ordered = sorted((row, key) for key, row in rows.items() if row is not None)
        return {key: self._results[key] for _row, key in ordered}

    def clear_results(self) -> None:
        self.removeRows(0, self.rowCount())
        self._results.clear()
        self._rows.clear()


class FindingsSortProxy(QSortFilterProxyModel):
    """Sorts the series rows; the steps under a series keep the order of the decision path."""

    def __init__(self, parent: Any = None) -> None:
        super().__init__(parent)
        self.setSortRole(SORT_ROLE)

    def lessThan(self, left: QModelIndex | QPersistentModelIndex,
                 right: QModelIndex | QPersistentModelIndex) -> bool:
        if left.parent().isValid():
            ascending = self.sortOrder() == Qt.SortOrder.AscendingOrder
            return left.row() < right.row() if ascending else left.row() > right.row()
        a, b = item_value(left, SORT_ROLE), item_value(right, SORT_ROLE)
        if a is None or b is None:
            return (a is None) and (b is not None)
        try:
            return bool(a < b)
        except TypeError:
            return str(a) < str(b)
