"""The main window: the frame (window_frame.py: panels, splitters, status bar), its menus,
toolbar and shortcuts, and the wiring between the panels and the controllers that do the
window's jobs (ui/controllers/: files, runs, studies, export).  It shows what the engine
returns and never computes statistics."""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QSize, Qt
from PySide6.QtGui import QAction, QActionGroup, QCloseEvent, QKeySequence
from PySide6.QtWidgets import (
    QAbstractItemView,
    QApplication,
    QLineEdit,
    QStyle,
    QTextEdit,
    QToolBar,
)

from tauscope import __version__
from tauscope.engine import LAG_RULE_LABELS, Settings
from tauscope.ui import store
from tauscope.ui.appearance import APPEARANCES, apply_appearance
from tauscope.ui.controllers.current import CurrentSeries
from tauscope.ui.controllers.export import ExportController
from tauscope.ui.controllers.files import FilesController, dropped_paths
from tauscope.ui.controllers.prompts import Prompts
from tauscope.ui.controllers.runs import RunsController
from tauscope.ui.controllers.session import Session
from tauscope.ui.controllers.studies import StudiesController
from tauscope.ui.guide_window import GuideWindow
from tauscope.ui.settings_dialog import SettingsDialog
from tauscope.ui.window_api import WindowApi
from tauscope.ui.window_frame import WindowFrame, settings_summary

UNTITLED_STUDY = "Untitled study"


class MainWindow(WindowFrame, WindowApi):
    def __init__(self) -> None:
        settings = store.load_settings()
        super().__init__(settings)
        self.setWindowTitle("Tauscope")
        self.session = Session(settings, self)
        self.prompts = Prompts(self)
        self.guide: GuideWindow | None = None
        self.current = CurrentSeries(self.series_panel, self.findings_panel, self.chart_panel,
                                     self.reading_panel)
        panels = (self.series_panel, self.findings_panel)
        self.files = FilesController(*panels, self.current, self.session, self.prompts,
                                     self.status_label, self)
        self.runs = RunsController(*panels, self.current, self.session, self.prompts,
                                   self.status_label, self.progress, self)
        self.studies = StudiesController(*panels, self.session, self.prompts, self.status_label,
                                         self.files, self.runs, self)
        self.export = ExportController(*panels, self.session, self.prompts, self.status_label,
                                       self)
        self.files.accept_drops_on(self)
        self._build_actions()
        self._build_menus()
        self._build_toolbar()
        self._connect()
        self._restore_window_state()
        self._update_run_state()
        self._update_title()
        self.studies.autosave_timer.start()
        # The controllers' entry points, also on the window (scripts and tests use them).
        self.open_files = self.files.open_files
        self.open_demo = self.files.open_demo
        self.add_workbook = self.files.add_workbook
        self.close_all = self.files.close_all
        self.add_transform = self.files.add_transform
        self.mend_gaps = self.files.mend_gaps
        self.remove_transform = self.files.remove_transform
        self.undo_stack = self.files.undo_stack
        self.run_selected = self.runs.run_selected
        self.run_all = self.runs.run_all
        self.run_series = self.runs.run_series
        self.stop_run = self.runs.stop_run
        self.save_study = self.studies.save_study
        self.open_study = self.studies.open_study
        self.autosave = self.studies.autosave
        self.autosave_running = self.studies.autosave_running
        self.offer_recovery = self.studies.offer_recovery
        self.export_findings = self.export.export_findings
        self.findings_record = self.export.findings_record
        self.copy = self.export.copy
        self.tell = self.prompts.tell
        self._dropped_paths = dropped_paths

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
        self.open_action = self._action("&Open workbooks…", self.files.choose_files,
                                        QKeySequence.StandardKey.Open,
                                        "Open one or more workbooks (Excel or CSV)",
                                        sp.SP_DialogOpenButton)
        self.demo_action = self._action("Open the &demo workbook", self.files.open_demo, None,
                                        "Open the example workbook that comes with Tauscope",
                                        sp.SP_FileDialogInfoView)
        self.export_action = self._action("&Export findings…", self.export.export_findings, "Ctrl+E",
                                          "Write the findings to Excel, CSV, JSON, LaTeX, a web "
                                          "page or PDF", sp.SP_DialogSaveButton)
        self.open_study_action = self._action("Open s&tudy…", self.studies.choose_study, None,
                                              "Open a saved study and analyse its series again")
        self.save_study_action = self._action("&Save study", self.studies.save_study,
                                              QKeySequence.StandardKey.Save,
                                              "Save the workbooks, series, settings and findings "
                                              "of this study")
        if not self.save_study_action.shortcuts():
            self.save_study_action.setShortcut(QKeySequence("Ctrl+S"))
        self.save_study_as_action = self._action("Save study &as…", self.studies.save_study_as,
                                                 "Ctrl+Shift+S", "Save this study under a new name")
        self.close_all_action = self._action("&Close all workbooks", self.files.close_all, None,
                                             "Remove every workbook and finding from the window")
        self.quit_action = self._action("&Quit", self.close, QKeySequence.StandardKey.Quit,
                                        "Close Tauscope")
        if not self.quit_action.shortcuts():
            self.quit_action.setShortcut(QKeySequence("Ctrl+Q"))
        stack = self.files.undo_stack
        self.undo_action = stack.createUndoAction(self, "&Undo")
        self.redo_action = stack.createRedoAction(self, "&Redo")
        for action, standard in ((self.undo_action, QKeySequence.StandardKey.Undo),
                                 (self.redo_action, QKeySequence.StandardKey.Redo)):
            action.setShortcuts(QKeySequence.keyBindings(standard))
            self.addAction(action)
        self.copy_action = self._action("&Copy", self.export.copy, QKeySequence.StandardKey.Copy,
                                        "Copy the selected findings as a table")
        self.copy_action.setShortcutContext(Qt.ShortcutContext.WindowShortcut)
        self.select_all_action = self._action("Select &all", self.select_all,
                                              QKeySequence.StandardKey.SelectAll,
                                              "Select every series of every workbook (every "
                                              "finding when the Findings have the focus)")
        self.find_action = self._action("&Filter series", self.focus_filter,
                                        QKeySequence.StandardKey.Find,
                                        "Type part of a name to show only matching series")
        self.settings_action = self._action("Testing &settings…", self.edit_settings,
                                            QKeySequence.StandardKey.Preferences,
                                            "Significance level, lag rule, differences, cross-check",
                                            sp.SP_FileDialogDetailedView)
        if not self.settings_action.shortcuts():
            self.settings_action.setShortcut(QKeySequence("Ctrl+,"))
        self.run_action = self._action("&Run the analysis", self.runs.run_selected, "F5",
                                       "Analyse the selected series (all when none is selected)",
                                       sp.SP_MediaPlay)
        self.stop_action = self._action("&Stop", self.runs.stop_run, "Esc",
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
        self.recent_menu.aboutToShow.connect(lambda: self.files.fill_recent_menu(self.recent_menu))
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
        edit_menu.addAction(self.undo_action)
        edit_menu.addAction(self.redo_action)
        edit_menu.addSeparator()
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

    def _connect(self) -> None:
        self.series_panel.current_changed.connect(self.current.follow_series_panel)
        self.series_panel.transform_requested.connect(self.files.add_transform)
        self.series_panel.gaps_requested.connect(self.files.mend_gaps)
        self.series_panel.remove_requested.connect(self.files.remove_transform)
        self.series_panel.run_requested.connect(self.runs.run_selected)
        self.findings_panel.current_changed.connect(self.current.follow_findings_panel)
        self.findings_panel.guide_requested.connect(self.open_guide)
        self.reading_panel.guide_requested.connect(self.open_guide)
        self.runs.running_changed.connect(lambda _running: self._update_run_state())
        self.session.modified_changed.connect(self._show_modified)
        self.session.study_path_changed.connect(lambda _path: self._update_title())
        self.session.settings_changed.connect(
            lambda settings: self.settings_label.setText(settings_summary(settings)))
        self.findings_panel.model.marker_color = self.palette().color(self.foregroundRole())
        self.findings_panel.record_for = self.export.findings_record
        self.chart_panel.save_path_asker = lambda title, start, filters: self.prompts.ask_save_path(
            title, start, filters)

    def _update_run_state(self) -> None:
        running = self.runs.is_running()
        self.run_action.setEnabled(not running)
        self.stop_action.setEnabled(running)
        self.settings_action.setEnabled(not running)
        self.close_all_action.setEnabled(not running)
        self.open_study_action.setEnabled(not running)

    def _show_modified(self, modified: bool) -> None:
        self.setWindowModified(modified)
        self._update_title()

    def set_modified(self, modified: bool) -> None:
        self.session.set_modified(modified)

    def _update_title(self) -> None:
        path = self.session.study_path
        self.setWindowTitle(f"{path.stem if path is not None else UNTITLED_STUDY}[*] — Tauscope")

    # current series -----------------------------------------------------
    def current_key(self) -> str:
        return self.current.key

    def select_series(self, key: str) -> bool:
        return self.series_panel.select_key(key)

    def select_all(self) -> None:
        """Edit → Select all: the text or rows of the focused box or list when it has its own
        (filter, reading, findings), else every series."""
        focus = QApplication.focusWidget()
        if focus is not None and focus is not self.series_panel.view \
                and isinstance(focus, QLineEdit | QTextEdit | QAbstractItemView):
            focus.selectAll()
            return
        self.select_all_series()

    def select_all_series(self) -> None:
        self.series_panel.select_all_series()
        self.series_panel.view.setFocus()

    def focus_filter(self) -> None:
        self.series_panel.filter_box.setFocus()
        self.series_panel.filter_box.selectAll()

    def edit_settings(self) -> None:
        dialog = SettingsDialog(self.settings, self)
        if dialog.exec():
            self.apply_settings(dialog.settings())

    def apply_settings(self, settings: Settings) -> None:
        if settings != self.settings:
            self.set_modified(True)
        self.session.set_settings(settings)  # (the settings line follows)
        self.findings_panel.model.mark_out_of_date(settings)
        store.save_settings(settings)
        self.settings_label.setToolTip(
            f"Lag rule: {LAG_RULE_LABELS[settings.lag_rule]}. Press F5 to analyse again with "
            "these settings.")

    def set_appearance(self, appearance: str) -> None:
        store.set_value(store.KEY_APPEARANCE, appearance)
        app = QApplication.instance()
        if isinstance(app, QApplication):
            apply_appearance(app, appearance)
        self.findings_panel.model.set_marker_color(self.palette().color(self.foregroundRole()))

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

    # closing ------------------------------------------------------------
    def may_close(self) -> bool:
        """With unsaved changes, ask: save them (and close if saved), discard them, or stay."""
        if not self.session.modified or self.session.closing:
            return True
        path = self.session.study_path
        answer = self.prompts.ask_save_changes(path.name if path is not None else UNTITLED_STUDY)
        if answer == "save":
            return self.studies.save_study()
        return answer == "discard"

    def closeEvent(self, event: QCloseEvent) -> None:
        if self.export.busy:  # an export is being written (a few seconds): close after it
            event.ignore()
            return
        if not self.may_close():
            event.ignore()
            return
        self.session.closing = True
        self.runs.stop_and_wait(30_000)
        self.files.loader.wait(10_000)
        self.save_window_state()
        self.studies.close()  # a clean close: nothing to recover next time
        if self.guide is not None:
            self.guide.close()
        event.accept()
