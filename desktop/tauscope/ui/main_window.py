"""The main window: menus, toolbar, the four panels, the status bar and the wiring
between them.  It shows what the engine returns and never computes statistics."""

from __future__ import annotations

import contextlib
import threading
from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING, Any

from PySide6.QtCore import QByteArray, QSize, Qt, QTimer
from PySide6.QtGui import (
    QAction,
    QActionGroup,
    QCloseEvent,
    QDragEnterEvent,
    QDropEvent,
    QKeySequence,
)
from PySide6.QtWidgets import (
    QApplication,
    QFileDialog,
    QLabel,
    QLineEdit,
    QMainWindow,
    QMessageBox,
    QProgressBar,
    QSplitter,
    QStyle,
    QTextBrowser,
    QToolBar,
    QVBoxLayout,
    QWidget,
)

from tauscope import __version__
from tauscope.engine import LAG_RULE_LABELS, SeriesResult, Settings
from tauscope.report.study import STUDY_SUFFIX, Study
from tauscope.resources_path import demo_workbook
from tauscope.ui import store
from tauscope.ui.appearance import APPEARANCES, apply_appearance
from tauscope.ui.charts.panel import ChartPanel
from tauscope.ui.findings_export import CHART_SUFFIXES, EXPORT_FILTERS, build_run, export_filter
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.guide_window import GuideWindow
from tauscope.ui.loader import WorkbookLoader
from tauscope.ui.problem_dialog import ProblemDialog
from tauscope.ui.reading_panel import ReadingPanel
from tauscope.ui.series_panel import SeriesPanel
from tauscope.ui.settings_dialog import SettingsDialog
from tauscope.ui.study_state import analysed_keys, build_study, check_study_sources
from tauscope.ui.texts import LAG_RULE_SHORT
from tauscope.ui.worker import AnalysisRunner, Job

if TYPE_CHECKING:
    from tauscope.data import SeriesData, Workbook
    from tauscope.report import RunRecord

FILE_FILTER = "Workbooks (*.xlsx *.xlsm *.xls *.csv *.tsv *.txt);;All files (*)"
READABLE_SUFFIXES = {".xlsx", ".xlsm", ".xls", ".csv", ".tsv", ".txt"}
STUDY_FILTER = f"Tauscope studies (*{STUDY_SUFFIX});;All files (*)"
AUTOSAVE_MS = 120_000
UNTITLED_STUDY = "Untitled study"


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
    rule = LAG_RULE_SHORT.get(settings.lag_rule, settings.lag_rule)
    lags = (f"{settings.lags} lags" if settings.lag_rule == "fixed"
            else f"lags by {rule}" + (f" ≤ {settings.max_lags}" if settings.max_lags is not None
                                      else ""))
    names = {"kpss": "KPSS", "pp": "PP", "dfgls": "DF-GLS", "za": "ZA"}
    checks = [names[c] for c in ("kpss", "pp", "dfgls", "za") if c in settings.confirm]
    check = (" · " + ", ".join(checks)) if checks else ""
    exact = " · exact critical values" if settings.critical_values == "exact" else ""
    return (f"{settings.alpha_label} · {lags} · up to I({settings.max_difference}){check}"
            f"{exact}")


def _tail(key: str) -> str:
    """A series key without its file name (a relocated workbook may have a new name)."""
    return key.split("|", 1)[-1]


class MainWindow(QMainWindow):
    def __init__(self) -> None:
        super().__init__()
        self.setWindowTitle("Tauscope")
        self.setAcceptDrops(True)
        self.settings = store.load_settings()
        self.runner = AnalysisRunner(self)
        self.loader = WorkbookLoader(self)
        self.guide: GuideWindow | None = None
        self.problem_dialog: ProblemDialog | None = None
        self.message_box: QMessageBox | None = None
        self._current_key = ""
        self._closing = False
        self.last_run: tuple[bool, int] | None = None  # (stopped, results) of the last run
        # The open study: its file (None until saved), unsaved changes, how gaps were mended.
        self.study_path: Path | None = None
        self._gap_handling: dict[str, str] = {}
        self._quiet_run = False  # a study's re-run does not count as a change
        self._autosave_thread: threading.Thread | None = None
        # Questions to the user, replaceable in tests: (title, folder, filter) -> path or "".
        self.ask_save_path: Callable[[str, str, str], str] = self._ask_save_path
        self.ask_open_path: Callable[[str, str, str], str] = self._ask_open_path
        self.ask_yes_no: Callable[[str, str], bool] = self._ask_yes_no
        self.autosave_timer = QTimer(self)
        self.autosave_timer.setInterval(AUTOSAVE_MS)
        self.autosave_timer.timeout.connect(self.autosave)

        self.series_panel = SeriesPanel(self)
        self.chart_panel = ChartPanel(self)
        self.reading_panel = ReadingPanel(self)
        self.findings_panel = FindingsPanel(self)
        self._build_layout()
        self._build_actions()
        self._build_menus()
        self._build_toolbar()
        self._build_status_bar()
        self._connect()
        self._restore_window_state()
        self._update_run_state()
        self._update_title()
        self.autosave_timer.start()

    # layout -------------------------------------------------------------
    def _build_layout(self) -> None:
        self.series_box = _panel("Series", self.series_panel)
        self.chart_box = _panel("Chart", self.chart_panel)
        self.reading_box = _panel("Reading", self.reading_panel)
        self.findings_box = _panel("Findings", self.findings_panel)
        self.top_splitter = QSplitter(Qt.Orientation.Horizontal)
        self.top_splitter.addWidget(self.chart_box)
        self.top_splitter.addWidget(self.reading_box)
        self.right_splitter = QSplitter(Qt.Orientation.Vertical)
        self.right_splitter.addWidget(self.top_splitter)
        self.right_splitter.addWidget(self.findings_box)
        self.outer_splitter = QSplitter(Qt.Orientation.Horizontal)
        self.outer_splitter.addWidget(self.series_box)
        self.outer_splitter.addWidget(self.right_splitter)
        for splitter in self._splitters():
            splitter.setChildrenCollapsible(False)
        self.setCentralWidget(self.outer_splitter)
        self._default_sizes()
        QWidget.setTabOrder(self.series_panel.filter_box, self.series_panel.view)
        QWidget.setTabOrder(self.series_panel.view, self.chart_panel.tabs)
        QWidget.setTabOrder(self.chart_panel.tabs, self.reading_panel.browser)
        QWidget.setTabOrder(self.reading_panel.browser, self.findings_panel.view)

    def _splitters(self) -> tuple[QSplitter, QSplitter, QSplitter]:
        return (self.outer_splitter, self.right_splitter, self.top_splitter)

    def _default_sizes(self) -> None:
        self.outer_splitter.setSizes([356, 924])
        self.right_splitter.setSizes([420, 310])
        self.top_splitter.setSizes([560, 348])

    # actions ------------------------------------------------------------
    def _action(self, text: str, slot: Any, shortcut: Any = None, tip: str = "",
                icon: QStyle.StandardPixmap | None = None) -> QAction:
        action = QAction(text, self)
        if shortcut is not None:
            if isinstance(shortcut, QKeySequence.StandardKey):
                action.setShortcuts(QKeySequence.keyBindings(shortcut))
            else:
                action.setShortcut(QKeySequence(shortcut))
        if tip:
            action.setToolTip(tip)
            action.setStatusTip(tip)
        if icon is not None:
            action.setIcon(self.style().standardIcon(icon))
        action.triggered.connect(lambda _checked=False: slot())
        self.addAction(action)
        return action

    def _build_actions(self) -> None:
        sp = QStyle.StandardPixmap
        self.open_action = self._action("&Open workbooks…", self.choose_files,
                                        QKeySequence.StandardKey.Open,
                                        "Open one or more workbooks (Excel or CSV)",
                                        sp.SP_DialogOpenButton)
        self.demo_action = self._action("Open the &demo workbook", self.open_demo, None,
                                        "Open the example workbook that comes with Tauscope",
                                        sp.SP_FileDialogInfoView)
        self.export_action = self._action("&Export findings…", self.export_findings, "Ctrl+E",
                                          "Write the findings to Excel, CSV, JSON, LaTeX, a web "
                                          "page or PDF", sp.SP_DialogSaveButton)
        self.open_study_action = self._action("Open s&tudy…", self.choose_study, None,
                                              "Open a saved study and analyse its series again")
        self.save_study_action = self._action("&Save study", self.save_study,
                                              QKeySequence.StandardKey.Save,
                                              "Save the workbooks, series, settings and findings "
                                              "of this study")
        if not self.save_study_action.shortcuts():
            self.save_study_action.setShortcut(QKeySequence("Ctrl+S"))
        self.save_study_as_action = self._action("Save study &as…", self.save_study_as,
                                                 "Ctrl+Shift+S", "Save this study under a new name")
        self.close_all_action = self._action("&Close all workbooks", self.close_all, None,
                                             "Remove every workbook and finding from the window")
        self.quit_action = self._action("&Quit", self.close, QKeySequence.StandardKey.Quit,
                                        "Close Tauscope")
        if not self.quit_action.shortcuts():
            self.quit_action.setShortcut(QKeySequence("Ctrl+Q"))
        self.copy_action = self._action("&Copy", self.copy, QKeySequence.StandardKey.Copy,
                                        "Copy the selected findings as a table")
        self.copy_action.setShortcutContext(Qt.ShortcutContext.WindowShortcut)
        self.select_all_action = self._action("Select &all series", self.select_all_series,
                                              "Ctrl+Shift+A", "Select every series of every workbook")
        self.find_action = self._action("&Filter series", self.focus_filter,
                                        QKeySequence.StandardKey.Find,
                                        "Type part of a name to show only matching series")
        self.settings_action = self._action("Testing &settings…", self.edit_settings,
                                            QKeySequence.StandardKey.Preferences,
                                            "Significance level, lag rule, differences, cross-check",
                                            sp.SP_FileDialogDetailedView)
        if not self.settings_action.shortcuts():
            self.settings_action.setShortcut(QKeySequence("Ctrl+,"))
        self.run_action = self._action("&Run the analysis", self.run_selected, "F5",
                                       "Analyse the selected series (all when none is selected)",
                                       sp.SP_MediaPlay)
        self.stop_action = self._action("&Stop", self.stop_run, "Esc",
                                        "Stop the running analysis; finished results are kept",
                                        sp.SP_MediaStop)
        self.guide_action = self._action("&Guide", self.open_guide_for_focus,
                                         QKeySequence.StandardKey.HelpContents,
                                         "The built-in guide: the tests, the charts, the verdicts",
                                         sp.SP_MessageBoxQuestion)
        if not self.guide_action.shortcuts():
            self.guide_action.setShortcut(QKeySequence("F1"))
        self.about_action = self._action("&About Tauscope", self.about)
        self.reset_layout_action = self._action("Restore the default &layout", self._default_sizes)
        self.appearance_group = QActionGroup(self)
        self.appearance_actions: dict[str, QAction] = {}
        current = str(store.get_value(store.KEY_APPEARANCE) or "system")
        for key, text in zip(APPEARANCES, ("Follow the &system", "&Light", "&Dark"), strict=True):
            action = QAction(text, self, checkable=True)
            action.setChecked(key == current)
            action.triggered.connect(lambda _checked=False, k=key: self.set_appearance(k))
            self.appearance_group.addAction(action)
            self.appearance_actions[key] = action

    def _build_menus(self) -> None:
        bar = self.menuBar()
        file_menu = bar.addMenu("&File")
        file_menu.addAction(self.open_action)
        self.recent_menu = file_menu.addMenu("Open &recent")
        self.recent_menu.aboutToShow.connect(self._fill_recent_menu)
        file_menu.addAction(self.demo_action)
        file_menu.addSeparator()
        file_menu.addAction(self.open_study_action)
        file_menu.addAction(self.save_study_action)
        file_menu.addAction(self.save_study_as_action)
        file_menu.addSeparator()
        file_menu.addAction(self.export_action)
        file_menu.addSeparator()
        file_menu.addAction(self.close_all_action)
        file_menu.addSeparator()
        file_menu.addAction(self.quit_action)
        edit_menu = bar.addMenu("&Edit")
        edit_menu.addAction(self.copy_action)
        edit_menu.addAction(self.select_all_action)
        edit_menu.addAction(self.find_action)
        edit_menu.addSeparator()
        edit_menu.addAction(self.settings_action)
        analysis_menu = bar.addMenu("&Analysis")
        analysis_menu.addAction(self.run_action)
        analysis_menu.addAction(self.stop_action)
        analysis_menu.addSeparator()
        analysis_menu.addAction(self.settings_action)
        view_menu = bar.addMenu("&View")
        appearance_menu = view_menu.addMenu("&Appearance")
        for action in self.appearance_actions.values():
            appearance_menu.addAction(action)
        view_menu.addAction(self.reset_layout_action)
        help_menu = bar.addMenu("&Help")
        help_menu.addAction(self.guide_action)
        help_menu.addAction(self.about_action)

    def _build_toolbar(self) -> None:
        toolbar = QToolBar("Main tools", self)
        toolbar.setObjectName("main-toolbar")
        toolbar.setMovable(False)
        toolbar.setIconSize(QSize(18, 18))
        toolbar.setToolButtonStyle(Qt.ToolButtonStyle.ToolButtonTextBesideIcon)
        for action in (self.open_action, self.demo_action, None, self.run_action, self.stop_action,
                       None, self.settings_action, self.copy_action, self.export_action, None,
                       self.guide_action):
            if action is None:
                toolbar.addSeparator()
            else:
                toolbar.addAction(action)
        self.addToolBar(toolbar)
        self.toolbar = toolbar

    def _build_status_bar(self) -> None:
        bar = self.statusBar()
        self.status_label = QLabel("Ready", self)
        self.status_label.setAccessibleName("Status")
        self.progress = QProgressBar(self)
        self.progress.setMaximumWidth(220)
        self.progress.setAccessibleName("Analysis progress")
        self.progress.setFormat("%v of %m")
        self.progress.hide()
        self.settings_label = QLabel(settings_summary(self.settings), self)
        self.settings_label.setToolTip("The testing settings in use (Analysis → Testing settings)")
        bar.addWidget(self.status_label, 1)
        bar.addPermanentWidget(self.progress)
        bar.addPermanentWidget(self.settings_label)

    def _connect(self) -> None:
        self.series_panel.current_changed.connect(self._series_current_changed)
        self.series_panel.transform_requested.connect(self.add_transform)
        self.series_panel.gaps_requested.connect(self.mend_gaps)
        self.series_panel.run_requested.connect(self.run_selected)
        self.findings_panel.current_changed.connect(self._findings_current_changed)
        self.findings_panel.guide_requested.connect(self.open_guide)
        self.reading_panel.guide_requested.connect(self.open_guide)
        self.runner.started.connect(self._run_started)
        self.runner.progress.connect(self._run_progress)
        self.runner.result_ready.connect(self._result_ready)
        self.runner.crashed.connect(self._run_crashed)
        self.runner.finished.connect(self._run_finished)
        self.loader.loaded.connect(self._workbook_loaded)
        self.loader.failed.connect(self._workbook_failed)
        self.findings_panel.model.marker_color = self.palette().color(self.foregroundRole())
        self.findings_panel.record_for = self.findings_record
        self.chart_panel.save_path_asker = lambda title, start, filters: self.ask_save_path(
            title, start, filters)

    # state --------------------------------------------------------------
    def _restore_window_state(self) -> None:
        geometry = store.get_value(store.KEY_GEOMETRY)
        if isinstance(geometry, QByteArray) and not geometry.isEmpty():
            self.restoreGeometry(geometry)
        else:
            self.resize(1280, 800)
        states = store.get_value(store.KEY_SPLITTERS)
        if isinstance(states, list) and len(states) == len(self._splitters()):
            for splitter, state in zip(self._splitters(), states, strict=True):
                if isinstance(state, QByteArray):
                    splitter.restoreState(state)
        window_state = store.get_value(store.KEY_STATE)
        if isinstance(window_state, QByteArray):
            self.restoreState(window_state)

    def save_window_state(self) -> None:
        store.set_value(store.KEY_GEOMETRY, self.saveGeometry())
        store.set_value(store.KEY_STATE, self.saveState())
        store.set_value(store.KEY_SPLITTERS, [s.saveState() for s in self._splitters()])

    def _update_run_state(self) -> None:
        running = self.runner.is_running()
        self.run_action.setEnabled(not running)
        self.stop_action.setEnabled(running)
        self.settings_action.setEnabled(not running)
        self.close_all_action.setEnabled(not running)
        self.open_study_action.setEnabled(not running)

    # files --------------------------------------------------------------
    def choose_files(self) -> None:
        start = str(Path(store.recent_files()[0]).parent) if store.recent_files() else ""
        paths, _ = QFileDialog.getOpenFileNames(self, "Open workbooks", start, FILE_FILTER)
        self.open_files(paths)

    def open_files(self, paths: list[str] | list[Path]) -> None:
        """Read each file in the background; the series appear when it is read.
        A study file (.tauscope) is opened as a study."""
        for path in paths:
            text = str(Path(path).expanduser().resolve())
            if Path(text).suffix.lower() == STUDY_SUFFIX:
                self.open_study(text)
                continue
            self.status_label.setText(f"Reading {Path(text).name}…")
            self.loader.load(text)

    def open_demo(self) -> None:
        path = demo_workbook()
        if path is None:
            self.tell("The demo workbook is missing from this installation.")
            return
        self.open_files([path])

    def add_workbook(self, workbook: Workbook) -> None:
        item = self.series_panel.model.add_workbook(workbook)
        self.series_panel.expand_workbook(item)
        store.add_recent_file(workbook.path)
        count = len(workbook.series())
        self.status_label.setText(f"Opened {workbook.path.name}: {count} series")
        self.set_modified(True)
        if not self._current_key and workbook.series():
            self.series_panel.select_key(workbook.series()[0].key)

    def _workbook_loaded(self, _path: str, workbook: Any) -> None:
        if not self._closing:
            self.add_workbook(workbook)

    def _workbook_failed(self, path: str, message: str, details: str) -> None:
        if self._closing:
            return
        self.status_label.setText(message)
        if details:
            self.show_problem(message, details)
        else:
            self.tell(message)

    def close_all(self) -> None:
        self.series_panel.model.clear_all()
        self.findings_panel.model.clear_results()
        self._gap_handling.clear()
        self._show_key("")
        self.set_modified(True)

    def _fill_recent_menu(self) -> None:
        self.recent_menu.clear()
        files = store.recent_files()
        for number, path in enumerate(files, start=1):
            action = self.recent_menu.addAction(f"&{number} {Path(path).name}")
            action.setToolTip(path)
            action.triggered.connect(lambda _checked=False, p=path: self.open_files([p]))
        if not files:
            empty = self.recent_menu.addAction("No recent workbooks")
            empty.setEnabled(False)
        else:
            self.recent_menu.addSeparator()
            self.recent_menu.addAction("Clear the list", store.clear_recent_files)

    def dragEnterEvent(self, event: QDragEnterEvent) -> None:
        if self._dropped_paths(event.mimeData()):
            event.acceptProposedAction()
        else:
            event.ignore()

    def dropEvent(self, event: QDropEvent) -> None:
        paths = self._dropped_paths(event.mimeData())
        if paths:
            event.acceptProposedAction()
            self.open_files(paths)

    @staticmethod
    def _dropped_paths(mime: Any) -> list[str]:
        if not mime.hasUrls():
            return []
        return [url.toLocalFile() for url in mime.urls()
                if url.isLocalFile()
                and Path(url.toLocalFile()).suffix.lower() in READABLE_SUFFIXES | {STUDY_SUFFIX}]

    # transforms ---------------------------------------------------------
    def add_transform(self, key: str, transform: str) -> None:
        from tauscope.data import DataError, make_transform

        series = self.series_panel.model.series_for_key(key)
        if series is None:
            return
        try:
            derived = make_transform(series, transform)
        except DataError as exc:
            self.tell(str(exc))
            return
        item = self.series_panel.model.add_transformed(key, derived)
        if item is not None:
            self.series_panel.select_key(derived.key)
            self.status_label.setText(f"Added {derived.name}")
            self.set_modified(True)

    def mend_gaps(self, key: str, how: str) -> None:
        """Cut a series to its longest gap-free stretch, or fill its gaps (the file is untouched;
        the series' notes say what was done)."""
        series = self.series_panel.model.series_for_key(key)
        if series is None or not series.gaps:
            return
        mended = series.longest_stretch() if how == "cut" else series.interpolated()
        self.series_panel.model.replace_series(mended)
        self._gap_handling[key] = "longest" if how == "cut" else "interpolate"
        self.set_modified(True)
        if key == self._current_key:
            self._current_key = ""
            self._show_key(key)
        what = "cut to its longest stretch without gaps" if how == "cut" else "gaps filled"
        self.status_label.setText(f"{series.name}: {what}. Press F5 to analyse it.")

    # analysis -----------------------------------------------------------
    def run_selected(self) -> bool:
        return self.run_series(self.series_panel.selected_series())

    def run_all(self) -> bool:
        return self.run_series(self.series_panel.model.all_series())

    def run_series(self, series: list[Any]) -> bool:
        if self.runner.is_running():
            return False
        if not series:
            self.status_label.setText("Open a workbook first (Ctrl+O), or the demo workbook.")
            return False
        return self.runner.start([Job.from_series(s) for s in series], self.settings)

    def stop_run(self) -> None:
        if self.runner.is_running():
            self.runner.stop()
            self.status_label.setText("Stopping after the series in hand…")

    def _run_started(self, total: int) -> None:
        self.last_run = None
        self.progress.setRange(0, total)
        self.progress.setValue(0)
        self.progress.show()
        self.status_label.setText(f"Analysing {total} series…")
        self._update_run_state()

    def _run_progress(self, done: int, total: int, name: str) -> None:
        self.progress.setValue(done)
        if name:
            self.status_label.setText(f"Analysing {name} ({done + 1} of {total})")

    def _result_ready(self, key: str, result: SeriesResult) -> None:
        self.findings_panel.model.set_result(key, result)
        if key == self._current_key:
            self._show_key(key)

    def _run_finished(self, stopped: bool, received: int) -> None:
        self.progress.hide()
        self.last_run = (stopped, received)
        self._update_run_state()
        if self._closing:
            return
        if received and not self._quiet_run:
            self.set_modified(True)
        self._quiet_run = False
        QTimer.singleShot(0, self.autosave)  # its own event: the window answers in between
        total = self.progress.maximum()
        errors = sum(1 for r in self.findings_panel.model.results().values() if r.error)
        if stopped:
            text = f"Stopped: {received} of {total} series analysed; their results are kept."
        else:
            text = f"Done: {received} series analysed."
        if errors:
            text += f" {errors} could not be tested (see Findings)."
        self.status_label.setText(text)
        if self._current_key:
            self._show_key(self._current_key)
            self.findings_panel.select_key(self._current_key)

    def _run_crashed(self, details: str) -> None:
        if not self._closing:
            self.show_problem("Something unexpected happened during the analysis. The series "
                              "concerned are marked as not tested; the others are unaffected.",
                              details)

    # current series -----------------------------------------------------
    def _series_current_changed(self, key: str) -> None:
        if key:
            self._show_key(key)
            self.findings_panel.select_key(key)

    def _findings_current_changed(self, key: str) -> None:
        if key and key != self._current_key:
            self._show_key(key)

    def _show_key(self, key: str) -> None:
        self._current_key = key
        series = self.series_panel.model.series_for_key(key) if key else None
        result = self.findings_panel.model.result_for_key(key) if key else None
        if series is None and result is None:
            self.chart_panel.show_nothing()
            self.reading_panel.display(None, None)
            return
        self.chart_panel.display(series, result)
        self.reading_panel.display(series, result)

    def current_key(self) -> str:
        return self._current_key

    def select_series(self, key: str) -> bool:
        return self.series_panel.select_key(key)

    def select_all_series(self) -> None:
        self.series_panel.select_all_series()
        self.series_panel.view.setFocus()

    def focus_filter(self) -> None:
        self.series_panel.filter_box.setFocus()
        self.series_panel.filter_box.selectAll()

    # edit ---------------------------------------------------------------
    def copy(self) -> None:
        focus = QApplication.focusWidget()
        if isinstance(focus, QLineEdit | QTextBrowser):
            focus.copy()
            return
        if self.findings_panel.copy_selection() is not None:
            self.status_label.setText("Copied the selected findings as a table.")
        else:
            self.status_label.setText("Select rows in Findings to copy them.")

    def edit_settings(self) -> None:
        dialog = SettingsDialog(self.settings, self)
        if dialog.exec():
            self.apply_settings(dialog.settings())

    def apply_settings(self, settings: Settings) -> None:
        if settings != self.settings:
            self.set_modified(True)
        self.settings = settings
        self.findings_panel.model.mark_out_of_date(settings)
        store.save_settings(settings)
        self.settings_label.setText(settings_summary(settings))
        self.settings_label.setToolTip(
            f"Lag rule: {LAG_RULE_LABELS[settings.lag_rule]}. Press F5 to analyse again with "
            "these settings.")

    def set_appearance(self, appearance: str) -> None:
        store.set_value(store.KEY_APPEARANCE, appearance)
        app = QApplication.instance()
        if isinstance(app, QApplication):
            apply_appearance(app, appearance)
        self.findings_panel.model.set_marker_color(self.palette().color(self.foregroundRole()))

    # findings out ------------------------------------------------------
    def findings_record(self, keys: list[str] | None = None) -> RunRecord:
        """The findings on screen (all, or those of ``keys`` in row order) as a run record."""
        model = self.series_panel.model
        run = build_run(self.findings_panel.model.results(), model.series_for_key,
                        model.workbooks(), self.settings)
        return run if keys is None else run.select(keys)

    def export_findings(self, target: str | Path | None = None) -> bool:
        """Write every finding through ``tauscope.report.export`` (the writers ``tauscope batch``
        uses); charts go into Excel, the web page and the PDF."""
        import tauscope.ui.pdf_report  # noqa: F401  (registers the ".pdf" writer)
        from tauscope.report import ExportError, export
        from tauscope.ui.findings_export import render_charts, suffix_for_filter

        results = self.findings_panel.model.results()
        if not results:
            self.tell("There are no findings to export yet: analyse some series first (F5).")
            return False
        if target is None:
            start = str(self.study_path.with_suffix(".xlsx")) if self.study_path else "findings.xlsx"
            answer = self.ask_save_path("Export findings", start, export_filter())
            if not answer:
                return False
            target = answer
        path = Path(target)
        known = {suffix for _label, suffix in EXPORT_FILTERS}
        if path.suffix.lower() not in known:
            path = path.with_name(path.name + suffix_for_filter(""))
        run = self.findings_record()
        charts = (render_charts(results, self.series_panel.model.series_for_key)
                  if path.suffix.lower() in CHART_SUFFIXES else None)
        try:
            export(path, run, charts)
        except ExportError as exc:
            self.tell(str(exc), title="The findings were not exported")
            return False
        self.status_label.setText(f"Exported {len(run.findings)} findings to {path.name}.")
        return True

    # studies ------------------------------------------------------------
    def current_study(self) -> Study:
        model = self.series_panel.model
        return build_study(self.settings, model.workbooks(), model.all_series(),
                           self.findings_panel.model.results(), self._gap_handling)

    def set_modified(self, modified: bool) -> None:
        self.setWindowModified(modified)
        self._update_title()

    def _update_title(self) -> None:
        name = self.study_path.stem if self.study_path is not None else UNTITLED_STUDY
        self.setWindowTitle(f"{name}[*] — Tauscope")

    def _set_study_path(self, path: Path | None) -> None:
        self.study_path = path
        store.set_value(store.KEY_LAST_STUDY, str(path) if path is not None else "")
        if path is not None:
            store.set_value(store.KEY_STUDY_FOLDER, str(path.parent))
        self._update_title()

    def save_study(self) -> bool:
        if self.study_path is None:
            return self.save_study_as()
        return self.save_study_to(self.study_path)

    def save_study_as(self) -> bool:
        folder = str(store.get_value(store.KEY_STUDY_FOLDER) or "")
        start = str(Path(folder) / f"study{STUDY_SUFFIX}") if folder else f"study{STUDY_SUFFIX}"
        answer = self.ask_save_path("Save study as", start, STUDY_FILTER)
        if not answer:
            return False
        path = Path(answer)
        if path.suffix.lower() != STUDY_SUFFIX:
            path = path.with_name(path.name + STUDY_SUFFIX)
        return self.save_study_to(path)

    def save_study_to(self, path: Path | str) -> bool:
        from tauscope.report.study import StudyError
        from tauscope.report.study import save_study as write_study

        target = Path(path).resolve()
        try:
            write_study(target, self.current_study())
        except StudyError as exc:
            self.tell(str(exc), title="The study was not saved")
            return False
        self._discard_autosave()  # the autosave of the study as it was called before
        self._set_study_path(target)
        self._discard_autosave()
        self.set_modified(False)
        self.status_label.setText(f"Saved the study {target.name}.")
        return True

    def choose_study(self) -> None:
        folder = str(store.get_value(store.KEY_STUDY_FOLDER) or "")
        answer = self.ask_open_path("Open study", folder, STUDY_FILTER)
        if answer:
            self.open_study(answer)

    def open_study(self, path: Path | str) -> bool:
        """Open a study: re-read its workbooks (warning when one changed or moved, offering to
        locate a missing one), restore its series and settings, and analyse them again."""
        from tauscope.report.study import StudyError, load_study

        if self.runner.is_running():
            self.tell("Stop the running analysis (Esc) before opening a study.")
            return False
        source = Path(path).resolve()
        try:
            study = load_study(source)
        except StudyError as exc:
            self.tell(str(exc), title="The study was not opened")
            return False
        return self.restore_study(study, source, modified=False)

    def restore_study(self, study: Study, path: Path | None, modified: bool) -> bool:
        from tauscope.report.rerun import reopen_series
        from tauscope.report.study import relocate

        check = check_study_sources(study, path)
        for missing in check.missing:
            located = self.ask_open_path(
                f"Where is {Path(missing).name} now?", str(Path(missing).parent), FILE_FILTER)
            if located:
                study = relocate(study, missing, located)
        check = check_study_sources(study, path)
        reopened = reopen_series(study, path)
        self.close_all()
        for book in reopened.workbooks:
            self.series_panel.model.add_workbook(book)
        for item, series in reopened.series:
            if item.transforms:
                self._restore_transformed(series)
            elif item.gaps != "none":
                self.series_panel.model.replace_series(series)
            if item.gaps != "none":
                self._gap_handling[series.key] = item.gaps
        for row in range(self.series_panel.model.rowCount()):
            self.series_panel.expand_workbook(self.series_panel.model.item(row, 0))
        self.settings = study.settings
        store.save_settings(study.settings)
        self.settings_label.setText(settings_summary(study.settings))
        self._set_study_path(path)
        problems = check.warnings() + [p for p in reopened.problems
                                       if not any(Path(m).name in p for m in check.missing)]
        analysed = {_tail(k) for k in analysed_keys(study)}
        to_run = [s for item, s in reopened.series if _tail(item.key) in analysed]
        if to_run and self.run_series(to_run):
            self._quiet_run = not modified
            self.series_panel.select_key(to_run[0].key)
        self.set_modified(modified)
        name = path.name if path is not None else "the recovered study"
        self.status_label.setText(f"Opened {name}: analysing {len(to_run)} series again…"
                                  if to_run else f"Opened {name}.")
        if problems:
            self.tell("Opening the study:\n• " + "\n• ".join(problems),
                      title="The study's workbooks")
        return True

    def _restore_transformed(self, series: SeriesData) -> None:
        """Put a transformed copy back under the series it was made from."""
        head, _sep, chain = series.key.rpartition("|")
        steps = [c for c in chain.split(",") if c]
        model = self.series_panel.model
        for cut in range(len(steps) - 1, -1, -1):
            parent = f"{head}|{','.join(steps[:cut])}"
            if model.item_for_key(parent) is not None:
                model.add_transformed(parent, series)
                return

    # autosave -----------------------------------------------------------
    def autosave(self, wait: bool = False) -> Path | None:
        """Keep a copy of the open study with unsaved changes, offered back after a crash.

        The autosave lists the analysed series instead of their findings (recovering analyses
        them again, to the same numbers): hundreds of findings as JSON take seconds to write.
        What to save is collected here; a background thread writes it.  ``wait``: block
        until written and return its path.
        """
        from tauscope.report.study import StudyError, autosave_path, write_autosave

        if not self.isWindowModified() or self._closing:
            return None
        if self._autosave_thread is not None and self._autosave_thread.is_alive():
            if not wait:
                return None  # the one under way is recent enough
            self._autosave_thread.join()
        model = self.series_panel.model
        parts = (self.settings, model.workbooks(), model.all_series(),
                 self.findings_panel.model.results(), dict(self._gap_handling))
        study_path, folder = self.study_path, store.data_folder()

        def write() -> None:
            with contextlib.suppress(StudyError, OSError, ValueError):
                write_autosave(study_path, folder, build_study(*parts, with_findings=False))

        thread = threading.Thread(target=write, name="tauscope-autosave", daemon=True)
        self._autosave_thread = thread
        thread.start()
        if not wait:
            return None
        thread.join()
        target = autosave_path(study_path, folder)
        return target if target.is_file() else None

    def autosave_running(self) -> bool:
        return self._autosave_thread is not None and self._autosave_thread.is_alive()

    def _wait_for_autosave(self) -> None:
        if self._autosave_thread is not None:
            self._autosave_thread.join()
            self._autosave_thread = None

    def _discard_autosave(self) -> None:
        from tauscope.report.study import discard_autosave

        self._wait_for_autosave()  # else it could write the file again after it is removed
        with contextlib.suppress(OSError):
            discard_autosave(self.study_path, store.data_folder())

    def offer_recovery(self) -> bool:
        """After an abnormal exit, offer back the autosaved study; returns True when restored."""
        from tauscope.report.study import (
            StudyError,
            discard_autosave,
            load_study,
            recoverable_autosave,
        )

        last = str(store.get_value(store.KEY_LAST_STUDY) or "")
        study_path = Path(last) if last else None
        folder = store.data_folder()
        candidate = recoverable_autosave(study_path, folder)
        if candidate is None:
            return False
        name = study_path.name if study_path is not None else "an unsaved study"
        if not self.ask_yes_no("Recover unsaved work?",
                               f"Tauscope did not close normally last time. Recover the unsaved "
                               f"changes to {name}? (No discards them.)"):
            discard_autosave(study_path, folder)
            return False
        try:
            study = load_study(candidate)
        except StudyError as exc:
            self.tell(str(exc))
            return False
        return self.restore_study(study, study_path, modified=True)

    # questions ----------------------------------------------------------
    def _ask_save_path(self, title: str, start: str, filters: str) -> str:
        path, _chosen = QFileDialog.getSaveFileName(self, title, start, filters)
        return path

    def _ask_open_path(self, title: str, start: str, filters: str) -> str:
        path, _chosen = QFileDialog.getOpenFileName(self, title, start, filters)
        return path

    def _ask_yes_no(self, title: str, text: str) -> bool:
        answer = QMessageBox.question(self, title, text)
        return answer == QMessageBox.StandardButton.Yes

    # help ---------------------------------------------------------------
    def open_guide(self, anchor: str = "start") -> None:
        if self.guide is None:
            self.guide = GuideWindow(self)
        self.guide.show_section(anchor)

    def open_guide_for_focus(self) -> None:
        focus = QApplication.focusWidget()
        anchor = "start"
        if focus is self.findings_panel.view:
            anchor = self.findings_panel.current_guide_anchor() or "verdicts"
        elif focus is not None and self.chart_panel.isAncestorOf(focus):
            anchor = self.chart_panel.current_guide_anchor()
        elif focus is self.reading_panel.browser:
            anchor = "verdicts"
        self.open_guide(anchor)

    def about(self) -> None:
        self.tell(f"Tauscope {__version__}: unit-root testing for applied economists. "
                  "Press F1 for the guide.", title="About Tauscope")

    # messages -----------------------------------------------------------
    def tell(self, text: str, title: str = "Tauscope") -> None:
        """A short message in a window-modal box that does not block the event loop."""
        box = QMessageBox(QMessageBox.Icon.Information, title, text, QMessageBox.StandardButton.Ok,
                          self)
        box.setWindowModality(Qt.WindowModality.WindowModal)
        box.open()
        self.message_box = box

    def show_problem(self, summary: str, details: str) -> None:
        dialog = ProblemDialog(summary, details, self)
        dialog.open()
        self.problem_dialog = dialog

    # closing ------------------------------------------------------------
    def closeEvent(self, event: QCloseEvent) -> None:
        self._closing = True
        if self.runner.is_running():
            self.runner.stop()
            self.runner.wait(30_000)
        self.loader.wait(10_000)
        self.save_window_state()
        self.autosave_timer.stop()
        self._discard_autosave()  # a clean close: nothing to recover next time
        if self.guide is not None:
            self.guide.close()
        event.accept()

    def showEvent(self, event: Any) -> None:
        super().showEvent(event)
        QTimer.singleShot(0, self._focus_series)

    def _focus_series(self) -> None:
        if QApplication.focusWidget() is None:
            self.series_panel.view.setFocus()
