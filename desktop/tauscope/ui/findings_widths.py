"""How wide each column of the Findings tree needs to be for the texts it shows: measured on
the findings in hand (names, verdicts, the steps' null hypotheses and places), since the rows
below a series are built only when it is expanded."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QTreeView

from tauscope.engine import SeriesResult
from tauscope.engine.reading.words import CROSS_CHECK_WORDS
from tauscope.ui.columns import header_width, text_width
from tauscope.ui.findings_model import FindingsModel
from tauscope.ui.findings_rows import (
    CHECK,
    COLUMNS,
    CRITICAL,
    DECISION,
    LAGS,
    NAME,
    NOBS,
    PVALUE,
    STATISTIC,
    VERDICT,
)
from tauscope.ui.roles import KEY_ROLE
from tauscope.ui.texts import DIFFERENCE_SHORT, EXTRA_TEST_NAMES, where_text

MEASURED = 300  # findings measured (the first ones, in row order): enough for their wording
ICON = 22  # the verdict's shape beside its label
SAMPLES = {  # the widest texts these columns show
    STATISTIC: ("τ-GLS = −10.31", "KPSS = 0.217", "t = −10.31"),
    CRITICAL: ("−10.31",),
    PVALUE: ("below 0.001", "above 0.999"),
    DECISION: ("not rejected",),
    CHECK: tuple(CROSS_CHECK_WORDS.values()),
    LAGS: ("12 (MAIC)", "12 (fixed)", "12 (auto)"),
    NOBS: ("10000",),
}


class RowWidths:
    """The widths each finding's own texts need, kept per series key and measured again only
    when its result or the font changes: fitting the columns after every few results of a
    run of a thousand series then costs a few milliseconds instead of sixty (everything was
    measured again each time; see benchmarks/ui_latency.py)."""

    def __init__(self) -> None:
        self._font = ""
        self._rows: dict[str, tuple[SeriesResult, str, tuple[int, int, int, int]]] = {}
        self._advances: dict[str, int] = {}  # text -> its width in the view's font

    def _width(self, view: QTreeView, texts: set[str] | list[str], indent: int = 0) -> int:
        """:func:`text_width` with this object's kept widths (the steps' places and null
        hypotheses repeat from one finding to the next)."""
        return text_width(view, texts, indent, self._advances)

    def measure(self, view: QTreeView, key: str, result: SeriesResult,
                label: str) -> tuple[int, int, int, int]:
        """(name, places, verdict label with its shape, null hypotheses) widths of one row."""
        font = view.font().key()
        if font != self._font:
            self._font, self._rows, self._advances = font, {}, {}
        known = self._rows.get(key)
        if known is not None and known[0] is result and known[1] == label:
            return known[2]
        places = {where_text(s.difference, s.spec) for s in result.steps}
        places |= {f"{EXTRA_TEST_NAMES[t.test]} · {DIFFERENCE_SHORT.get(t.difference, '')}"
                   for t in result.tests if t.test in EXTRA_TEST_NAMES}
        nulls = {s.hypothesis for s in result.steps}
        if result.evidence is not None and result.evidence.break_info is not None:
            nulls.add("a unit root; break: new regime from "
                      f"{result.evidence.break_info.first_new_label}")
        widths = (text_width(view, [result.name], 1), self._width(view, places, 2),
                  self._width(view, [label]) + ICON, self._width(view, nulls))
        self._rows[key] = (result, label, widths)
        return widths

    def forget(self, keep: set[str]) -> None:
        """Drop the rows no longer shown."""
        for key in set(self._rows) - keep:
            del self._rows[key]


def natural_widths(view: QTreeView, model: FindingsModel,
                   rows: RowWidths | None = None) -> list[int]:
    """Each column's width: its title, the widest sample text, and the texts of the first
    :data:`MEASURED` findings in row order."""
    rows = rows if rows is not None else RowWidths()
    widths = [header_width(view, c) for c in range(len(COLUMNS))]
    for column, texts in SAMPLES.items():
        widths[column] = max(widths[column], text_width(view, texts))
    fixed = text_width(view, ["stationarity (the KPSS null)", "a unit root (the null)"])
    widths[NAME] = max(widths[NAME], text_width(view, ["Regression behind it"], 3))
    widths[VERDICT] = max(widths[VERDICT], fixed)
    keys: set[str] = set()
    for r in range(min(model.rowCount(), MEASURED)):
        key = str(model.index(r, NAME).data(KEY_ROLE) or "")
        result = model.result_for_key(key)
        if result is None:
            continue
        keys.add(key)
        label = str(model.index(r, VERDICT).data(Qt.ItemDataRole.DisplayRole) or "")
        name, places, verdict, nulls = rows.measure(view, key, result, label)
        widths[NAME] = max(widths[NAME], name, places)
        widths[VERDICT] = max(widths[VERDICT], verdict, nulls)
    rows.forget(keys)
    return widths
