"""The rows of the Findings tree: its columns, and the cells of a decision step, the
regression behind it, a KPSS cross-check and the other unit-root tests.  Everything shown
comes from the engine's results; numbers go through tauscope.engine.formatting."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtGui import QStandardItem

from tauscope.engine import SeriesResult, Step, TestResult
from tauscope.engine import formatting as fmt
from tauscope.engine.reading.words import CROSS_CHECK_TITLE, VERDICT_TITLE, decision_word
from tauscope.ui.roles import GUIDE_ROLE, KEY_ROLE, KIND_ROLE, PENDING_ROLE, SORT_ROLE, VALUE_ROLE
from tauscope.ui.texts import (
    DIFFERENCE_NAMES,
    DIFFERENCE_SHORT,
    EXTRA_TEST_NAMES,
    GUIDE_ANCHORS,
    GUIDE_HINT,
    LAG_RULE_SHORT,
    SPEC_SHORT,
    STATISTIC_SYMBOLS,
    STATISTIC_TIPS,
    decision_text,
    lag_text,
    statistic_text,
    where_text,
)

COLUMNS = ("Series and steps", VERDICT_TITLE, "Statistic", "Critical value", "p-value", "Decision",
           CROSS_CHECK_TITLE, "Lags", "Obs.")
NAME, VERDICT, STATISTIC, CRITICAL, PVALUE, DECISION, CHECK, LAGS, NOBS = range(len(COLUMNS))
COLUMN_TIPS = (
    "Each analysed series. Expand a row to see the decision path step by step, and under each "
    "step the regression behind it.",
    "The order of integration the testing sequence arrived at, and the deterministic terms "
    "(mean, drift, trend). The shape beside it tells the verdicts apart without colour. "
    "On a step below a series: the null hypothesis that step tests.",
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
        DECISION: _cell(decision_word("reject" if test.reject else "do not reject"), text,
                        "decisions"),
        LAGS: _right(_cell(str(test.lags), "Bandwidth (lags) of the long-run variance "
                           "estimate used by KPSS.", "kpss")),
        NOBS: _right(_cell(str(test.nobs), COLUMN_TIPS[NOBS], "kpss")),
    }
    return _row("kpss", key, cells)


def error_row(key: str, text: str) -> list[QStandardItem]:
    """The one row under a series that could not be tested: why."""
    return _row("error", key, {NAME: _cell(text, text)})


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
        DECISION: _cell(decision_word("reject" if test.reject else "do not reject"), text,
                        "decisions"),
        LAGS: _right(_cell(lag_text(test.lags, test.lag_rule),
                           "Bandwidth of the long-run variance (Phillips-Perron) or number of "
                           f"lagged differences; chosen by: {test.lag_rule or 'the settings'}.",
                           guide)),
        NOBS: _right(_cell(str(test.nobs), COLUMN_TIPS[NOBS], guide)),
    }
    return _row(test.test, key, cells)
