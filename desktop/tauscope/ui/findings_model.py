"""The Findings panel's model: one row per series, its decision path below,
and under each step the regression behind it.  Everything shown comes from
the engine's SeriesResult; numbers go through tauscope.engine.formatting."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QModelIndex, QPersistentModelIndex, QSortFilterProxyModel, Qt
from PySide6.QtGui import QColor, QStandardItem, QStandardItemModel

from tauscope.engine import SeriesResult, Settings, Step, TestResult
from tauscope.engine import formatting as fmt
from tauscope.ui.markers import MARKERS, marker_icon, marker_kind
from tauscope.ui.qtcompat import item_value
from tauscope.ui.roles import GUIDE_ROLE, KEY_ROLE, KIND_ROLE, PENDING_ROLE, SORT_ROLE, VALUE_ROLE
from tauscope.ui.texts import (
    AGREEMENT_TIPS,
    AGREEMENT_WORDS,
    DIFFERENCE_NAMES,
    DIFFERENCE_SHORT,
    EXTRA_TEST_NAMES,
    GUIDE_ANCHORS,
    GUIDE_HINT,
    LAG_RULE_SHORT,
    OUT_OF_DATE,
    SPEC_SHORT,
    STATISTIC_SYMBOLS,
    STATISTIC_TIPS,
    decision_text,
    lag_text,
    statistic_text,
    where_text,
)

COLUMNS = ("Series and steps", "Verdict", "Statistic", "Critical value", "p-value", "Decision",
           "Cross-check", "Lags", "Obs.")
NAME, VERDICT, STATISTIC, CRITICAL, PVALUE, DECISION, CHECK, LAGS, NOBS = range(len(COLUMNS))
COLUMN_TIPS = (
    "Each analysed series. Expand a row to see the decision path step by step, and under each "
    "step the regression behind it.",
    "The order of integration the testing sequence arrived at, and the deterministic terms "
    "(mean, drift, trend). The shape beside it tells the verdicts apart without colour. "
    "On a step: the null hypothesis that step tests.",
    "The test statistic of this step: τ for the unit-root t ratio, Φ1/Φ2/Φ3 for the joint "
    "F tests, z when the normal distribution applies, KPSS for the cross-check.",
    "The value the statistic must pass for the step to reject, at the chosen significance level.",
    "The probability of a statistic at least this extreme if the null hypothesis were true.",
    "Whether the step rejected its null hypothesis at the chosen level. “Not rejected” means no "
    "evidence against it, not proof that it holds.",
    "Whether the cross-checks turned on in the settings (KPSS, which starts from stationarity "
    "instead of a unit root, and Phillips-Perron, DF-GLS, Zivot-Andrews) point the same way as "
    "the verdict.",
    "Number of lagged differences in the regression, and the rule that chose it.",
    "Observations used in the regression (after differencing and lags).",
)
COLUMN_GUIDE = ("sequence", "verdicts", "statistics", "critical", "pvalues", "decisions", "kpss",
                "lags", "lags")

PENDING_SERIES = "series"
PENDING_STEP = "step:"

NO_P_VALUE = ("No p-value: this statistic is judged by its critical value only (the published "
              "tables give critical values, not a p-value).")


def p_text(value: float | None) -> str:
    """A p-value as the engine formats it, or "n/a" when the test has none."""
    return "n/a" if value is None else fmt.p_value(value)


ORDER_SORT = {"i0": 0, "i1": 1, "i2": 2, "unresolved": 3, "error": 4}


def _cell(text: str = "", tip: str = "", guide: str = "") -> QStandardItem:
    item = QStandardItem(text)
    item.setEditable(False)
    if tip:
        item.setToolTip(tip + (GUIDE_HINT if guide else ""))
    item.setData(guide, GUIDE_ROLE)
    item.setData("", PENDING_ROLE)
    item.setData(text.lower(), SORT_ROLE)
    item.setData(float("nan"), VALUE_ROLE)
    return item


def _right(item: QStandardItem) -> QStandardItem:
    item.setTextAlignment(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
    return item


def _row(kind: str, key: str, cells: dict[int, QStandardItem]) -> list[QStandardItem]:
    row = [cells.get(c) or _cell() for c in range(len(COLUMNS))]
    for column, item in enumerate(row):
        item.setData(kind, KIND_ROLE)
        item.setData(key, KEY_ROLE)
        if not item.toolTip() and column < len(COLUMN_TIPS):
            item.setToolTip(COLUMN_TIPS[column])
        if not item.data(GUIDE_ROLE):
            item.setData(COLUMN_GUIDE[column], GUIDE_ROLE)
    return row


def _number_cell(text: str, value: float | None, tip: str = "", guide: str = "") -> QStandardItem:
    item = _right(_cell(text, tip, guide))
    if value is not None:  # no None into Qt item data: keep "missing" as an absent role
        item.setData(float(value), VALUE_ROLE)
    item.setData(float(value) if value is not None else float("inf"), SORT_ROLE)
    return item


def step_row(key: str, step: Step) -> list[QStandardItem]:
    name = step.statistic_name
    tip = STATISTIC_TIPS.get(name, "")
    guide = GUIDE_ANCHORS.get(name, "statistics")
    test = step.test
    cells = {
        NAME: _cell(where_text(step.difference, step.spec), step.text, "sequence"),
        VERDICT: _cell(step.hypothesis, "Null hypothesis of this step: " + step.hypothesis, guide),
        STATISTIC: _number_cell(statistic_text(name, step.statistic), step.statistic, tip, guide),
        CRITICAL: _number_cell(fmt.stat(step.critical_value), step.critical_value,
                               COLUMN_TIPS[CRITICAL], "critical"),
        PVALUE: _number_cell(p_text(step.p_value), step.p_value,
                             COLUMN_TIPS[PVALUE] if step.p_value is not None else NO_P_VALUE,
                             "pvalues"),
        DECISION: _cell(decision_text(step.decision), step.text, "decisions"),
    }
    if test is not None:
        cells[LAGS] = _right(_cell(lag_text(test.lags, test.lag_rule), COLUMN_TIPS[LAGS], "lags"))
        cells[NOBS] = _right(_cell(str(test.nobs), COLUMN_TIPS[NOBS], "lags"))
    row = _row("step", key, cells)
    row[NAME].setData(step.statistic_name, VALUE_ROLE)
    return row


def regression_rows(key: str, test: TestResult) -> list[list[QStandardItem]]:
    """A summary row for the regression behind a test, then one row per coefficient."""
    reg = test.regression
    if reg is None:
        return []
    rule = LAG_RULE_SHORT.get(reg.lag_rule, reg.lag_rule or "given")
    how = (f"lag order {reg.lags} fixed in the settings" if reg.lag_rule == "fixed"
           else f"lag order {reg.lags} chosen by {rule} from 0 to {reg.max_lags}")
    summary = (f"{reg.nobs} observations; {how}; residual variance {fmt.stat(reg.sigma2, 4)}, "
               f"sum of squared residuals {fmt.stat(reg.rss, 3)}")
    rows = [_row("regression", key, {
        NAME: _cell("Regression behind it", summary, "regression"),
        VERDICT: _cell(how, summary, "lags"),
        LAGS: _right(_cell(lag_text(reg.lags, reg.lag_rule), how, "lags")),
        NOBS: _right(_cell(str(reg.nobs), summary, "lags")),
    })]
    for coef in reg.coefficients:
        words = (f"{coef.name}: estimate {fmt.stat(coef.estimate, 4)}, standard error "
                 f"{fmt.stat(coef.std_error, 4)}, t = {fmt.stat(coef.t_value)}")
        rows.append(_row("coefficient", key, {
            NAME: _cell(coef.name, words, "regression"),
            VERDICT: _cell(f"estimate {fmt.stat(coef.estimate, 4)}, "
                           f"std. error {fmt.stat(coef.std_error, 4)}", words, "regression"),
            STATISTIC: _number_cell(f"t = {fmt.stat(coef.t_value)}", coef.t_value, words,
                                    "regression"),
        }))
    return rows


def kpss_row(key: str, test: TestResult) -> list[QStandardItem]:
    tip = STATISTIC_TIPS["kpss"]
    text = (f"KPSS with {'a trend' if test.spec == 'trend' else 'a constant'}: stationarity "
            f"{'rejected' if test.reject else 'not rejected'} at the chosen level")
    cells = {
        NAME: _cell(f"KPSS · {DIFFERENCE_SHORT.get(test.difference, str(test.difference))}",
                    f"KPSS on {DIFFERENCE_NAMES.get(test.difference, 'the series').lower()}, "
                    f"with {'a trend' if test.spec == 'trend' else 'a constant'}. {tip}", "kpss"),
        VERDICT: _cell("stationarity (the KPSS null)", text, "kpss"),
        STATISTIC: _number_cell(f"KPSS = {fmt.stat(test.statistic, 3)}", test.statistic, tip, "kpss"),
        CRITICAL: _number_cell(fmt.stat(test.critical_value, 3), test.critical_value,
                               COLUMN_TIPS[CRITICAL], "critical"),
        PVALUE: _number_cell(fmt.p_value(test.p_value, test.p_value_bound), test.p_value,
                             COLUMN_TIPS[PVALUE], "pvalues"),
        DECISION: _cell("rejected" if test.reject else "not rejected", text, "decisions"),
        LAGS: _right(_cell(str(test.lags), "Bandwidth (lags) of the long-run variance "
                           "estimate used by KPSS.", "kpss")),
        NOBS: _right(_cell(str(test.nobs), COLUMN_TIPS[NOBS], "kpss")),
    }
    return _row("kpss", key, cells)


def unit_root_test_row(key: str, test: TestResult, result: SeriesResult) -> list[QStandardItem]:
    """A row for a Phillips-Perron, DF-GLS or Zivot-Andrews test (null: a unit root)."""
    name = EXTRA_TEST_NAMES[test.test]
    tip = STATISTIC_TIPS[test.test]
    guide = GUIDE_ANCHORS[test.test]
    where = DIFFERENCE_SHORT.get(test.difference, str(test.difference))
    verdict = "a unit root (the null)"
    info = result.evidence.break_info if result.evidence is not None else None
    if test.test == "za" and info is not None:
        verdict = f"a unit root; break: new regime from {info.first_new_label}"
    text = (f"{name} on {DIFFERENCE_NAMES.get(test.difference, 'the series').lower()} "
            f"({SPEC_SHORT.get(test.spec, test.spec)}): a unit root "
            f"{'rejected' if test.reject else 'not rejected'} at the chosen level")
    if test.test == "za" and info is not None:
        text += (f"; most likely break: {info.description}, the new regime starting at "
                 f"{info.first_new_label}")
    symbol = STATISTIC_SYMBOLS[test.test]
    cells = {
        NAME: _cell(f"{name} · {where}", f"{text}. {tip}", guide),
        VERDICT: _cell(verdict, text, guide),
        STATISTIC: _number_cell(f"{symbol} = {fmt.stat(test.statistic)}", test.statistic, tip,
                                guide),
        CRITICAL: _number_cell(fmt.stat(test.critical_value), test.critical_value,
                               COLUMN_TIPS[CRITICAL], "critical"),
        PVALUE: _number_cell(fmt.p_value(test.p_value, test.p_value_bound)
                             if test.p_value is not None else "n/a", test.p_value,
                             COLUMN_TIPS[PVALUE] if test.p_value is not None else NO_P_VALUE,
                             "pvalues"),
        DECISION: _cell("rejected" if test.reject else "not rejected", text, "decisions"),
        LAGS: _right(_cell(lag_text(test.lags, test.lag_rule),
                           "Bandwidth of the long-run variance (Phillips-Perron) or number of "
                           "lagged differences.", guide)),
        NOBS: _right(_cell(str(test.nobs), COLUMN_TIPS[NOBS], guide)),
    }
    return _row(test.test, key, cells)


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
        cells[CHECK].update({display: AGREEMENT_WORDS.get(agreement, str(agreement)),
                             tooltip: AGREEMENT_TIPS.get(agreement, "") + GUIDE_HINT,
                             SORT_ROLE: AGREEMENT_WORDS.get(agreement, "")})
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
            return [_row("error", key, {NAME: _cell(str(result.error), str(result.error))})]
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

    def row_for_key(self, key: str) -> int | None:
        index = self._rows.get(key)
        return index.row() if index is not None and index.isValid() else None

    def result_for_key(self, key: str) -> SeriesResult | None:
        return self._results.get(key)

    def results(self) -> dict[str, SeriesResult]:
        """Results in row order."""
        keys = [str(item_value(self.index(r, NAME), KEY_ROLE)) for r in range(self.rowCount())]
        return {k: self._results[k] for k in keys if k in self._results}

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
