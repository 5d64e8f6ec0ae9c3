"""The window's frame: the four panels in their splitters, the status bar and the
remembered size and layout.  ``MainWindow`` (main_window.py) adds the actions, the
controllers and the wiring between them."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QByteArray, Qt, QTimer
from PySide6.QtWidgets import (
    QApplication,
    QLabel,
    QMainWindow,
    QProgressBar,
    QSplitter,
    QVBoxLayout,
    QWidget,
)

from tauscope.engine import Settings
from tauscope.ui import store
from tauscope.ui.charts.panel import ChartPanel
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.reading_panel import ReadingPanel
from tauscope.ui.series_panel import SeriesPanel
from tauscope.ui.texts import LAG_RULE_SHORT


def _panel(title: str, body: QWidget, extra: QWidget | None = None) -> QWidget:
    """A panel: a bold title line above its content."""
    box = QWidget()
    layout = QVBoxLayout(box)
    layout.setContentsMargins(4, 4, 4, 4)
    layout.setSpacing(3)
    label = QLabel(f"<b>{title}</b>", box)
    label.setBuddy(body)
    layout.addWidget(label)
    if extra is not None:
        layout.addWidget(extra)
    layout.addWidget(body)
    box.setAccessibleName(title)
    return box


def settings_summary(settings: Settings) -> str:
    """The status bar's line of settings, e.g. "5% · lags by AIC ≤ 12 · up to I(2) · KPSS"."""
    rule = LAG_RULE_SHORT.get(settings.lag_rule, settings.lag_rule)
    lags = (f"{settings.lags} lags" if settings.lag_rule == "fixed"
            else f"lags by {rule}" + (f" ≤ {settings.max_lags}" if settings.max_lags is not None
                                      else ""))
    names = {"kpss": "KPSS", "pp": "PP", "dfgls": "DF-GLS", "za": "ZA"}
    checks = [names[c] for c in ("kpss", "pp", "dfgls", "za") if c in settings.confirm]
    check = (" · " + ", ".join(checks)) if checks else ""
    exact = " · exact critical values" if settings.critical_values == "exact" else ""
    robust = " · robust to changing volatility" if settings.strategy == "bootstrap" else ""
    return (f"{settings.alpha_label} · {lags} · up to I({settings.max_difference}){check}"
            f"{exact}{robust}")


class WindowFrame(QMainWindow):
    """Series, Chart and Reading side by side at the top, the Findings across the window
    below them, the status bar."""

    def __init__(self, settings: Settings) -> None:
        super().__init__()
        self.series_panel = SeriesPanel(self)
        self.chart_panel = ChartPanel(self)
        self.reading_panel = ReadingPanel(self)
        self.findings_panel = FindingsPanel(self)
        self._build_layout()
        self._build_status_bar(settings)

    # layout -------------------------------------------------------------
    def _build_layout(self) -> None:
        self.series_box = _panel("Series", self.series_panel)
        self.chart_box = _panel("Chart", self.chart_panel)
        self.reading_box = _panel("Reading", self.reading_panel)
        self.findings_box = _panel("Findings", self.findings_panel)
        # Series, Chart and Reading side by side; the Findings below across the whole width
        # (its columns need it: verdicts, null hypotheses and numbers, all readable).
        self.top_splitter = QSplitter(Qt.Orientation.Horizontal)
        self.top_splitter.addWidget(self.series_box)
        self.top_splitter.addWidget(self.chart_box)
        self.top_splitter.addWidget(self.reading_box)
        self.outer_splitter = QSplitter(Qt.Orientation.Vertical)
        self.outer_splitter.addWidget(self.top_splitter)
        self.outer_splitter.addWidget(self.findings_box)
        for splitter in self._splitters():
            splitter.setChildrenCollapsible(False)
        self.setCentralWidget(self.outer_splitter)
        self._default_sizes()
        QWidget.setTabOrder(self.series_panel.filter_box, self.series_panel.view)
        QWidget.setTabOrder(self.series_panel.view, self.chart_panel.tabs)
        QWidget.setTabOrder(self.chart_panel.tabs, self.reading_panel.browser)
        QWidget.setTabOrder(self.reading_panel.browser, self.findings_panel.view)

    def _splitters(self) -> tuple[QSplitter, QSplitter]:
        return (self.outer_splitter, self.top_splitter)

    def _default_sizes(self) -> None:
        """The Series as wide as its columns need at 1280 pixels (40%, at most 600), the Chart
        as wide as its tabs need (or 38%), the Reading the rest; the top 57% of the height
        for them, the Findings the rest; and fitted column widths."""
        width = max(self.width(), 1000)
        central = self.centralWidget()
        height = max(central.height() if central is not None else 0, 560)
        series = min(max(int(width * 0.40), 420), 600)
        chart = max(self.chart_panel.tabs.tabBar().sizeHint().width() + 12, int(width * 0.38))
        self.top_splitter.setSizes([series, chart, max(width - series - chart, 240)])
        top = int(height * 0.57)
        self.outer_splitter.setSizes([top, height - top])
        for fitter in (self.series_panel.columns, self.findings_panel.columns):
            fitter.reset()

    def _build_status_bar(self, settings: Settings) -> None:
        bar = self.statusBar()
        self.status_label = QLabel("Ready", self)
        self.status_label.setAccessibleName("Status")
        self.progress = QProgressBar(self)
        self.progress.setMaximumWidth(220)
        self.progress.setAccessibleName("Analysis progress")
        self.progress.setFormat("%v of %m")
        self.progress.hide()
        self.settings_label = QLabel(settings_summary(settings), self)
        self.settings_label.setToolTip("The testing settings in use (Analysis → Testing settings)")
        bar.addWidget(self.status_label, 1)
        bar.addPermanentWidget(self.progress)
        bar.addPermanentWidget(self.settings_label)

    # state --------------------------------------------------------------
    def _restore_window_state(self) -> None:
        geometry = store.get_value(store.KEY_GEOMETRY)
        if isinstance(geometry, QByteArray) and not geometry.isEmpty():
            self.restoreGeometry(geometry)
        else:
            self.resize(1280, 800)
            self._default_sizes()
        states = store.get_value(store.KEY_SPLITTERS)
        if isinstance(states, list) and len(states) == len(self._splitters()):
            for splitter, state in zip(self._splitters(), states, strict=True):
                if isinstance(state, QByteArray):
                    splitter.restoreState(state)
        window_state = store.get_value(store.KEY_STATE)
        if isinstance(window_state, QByteArray):
            self.restoreState(window_state)
        columns = store.get_value(store.KEY_COLUMNS)
        if isinstance(columns, list) and len(columns) == 2:
            self.series_panel.columns.restore(columns[0])
            self.findings_panel.columns.restore(columns[1])

    def save_window_state(self) -> None:
        store.set_value(store.KEY_GEOMETRY, self.saveGeometry())
        store.set_value(store.KEY_STATE, self.saveState())
        store.set_value(store.KEY_SPLITTERS, [s.saveState() for s in self._splitters()])
        store.set_value(store.KEY_COLUMNS, [self.series_panel.columns.state() or QByteArray(),
                                            self.findings_panel.columns.state() or QByteArray()])

    def showEvent(self, event: Any) -> None:
        super().showEvent(event)
        QTimer.singleShot(0, self._focus_series)

    def _focus_series(self) -> None:
        if QApplication.focusWidget() is None:
            self.series_panel.view.setFocus()
