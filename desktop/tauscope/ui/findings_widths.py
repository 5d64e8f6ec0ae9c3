"""How wide each column of the Findings tree needs to be for the texts it shows: measured on
the findings in hand (names, verdicts, the steps' null hypotheses and places), since the rows
below a series are built only when it is expanded."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QTreeView

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


def natural_widths(view: QTreeView, model: FindingsModel) -> list[int]:
    widths = [header_width(view, c) for c in range(len(COLUMNS))]
    for column, texts in SAMPLES.items():
        widths[column] = max(widths[column], text_width(view, texts))
    rows = range(min(model.rowCount(), MEASURED))
    names = [str(model.index(r, NAME).data(Qt.ItemDataRole.DisplayRole) or "") for r in rows]
    labels = [str(model.index(r, VERDICT).data(Qt.ItemDataRole.DisplayRole) or "") for r in rows]
    results = list(model.results().values())[:MEASURED]
    places = {where_text(s.difference, s.spec) for r in results for s in r.steps}
    places |= {f"{EXTRA_TEST_NAMES[t.test]} · {DIFFERENCE_SHORT.get(t.difference, '')}"
               for r in results for t in r.tests if t.test in EXTRA_TEST_NAMES}
    nulls = {s.hypothesis for r in results for s in r.steps}
    nulls |= {"stationarity (the KPSS null)", "a unit root (the null)"}
    nulls |= {f"a unit root; break: new regime from {r.evidence.break_info.first_new_label}"
              for r in results if r.evidence is not None and r.evidence.break_info is not None}
    widths[NAME] = max(widths[NAME], text_width(view, names, 1), text_width(view, sorted(places), 2),
                       text_width(view, ["Regression behind it"], 3))
    widths[VERDICT] = max(widths[VERDICT], text_width(view, labels) + ICON,
                          text_width(view, sorted(nulls)))
    return widths
