"""The pieces a controller works with, built without the main window: the four panels, the
session, the prompts (answers injected by the test), the status line and the progress bar."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from tauscope.engine import Settings


@dataclass
class Parts:
    host: Any  # the widget the dialogs belong to
    series_panel: Any
    findings_panel: Any
    chart_panel: Any
    reading_panel: Any
    session: Any
    prompts: Any
    status: Any
    progress: Any
    current: Any


def build_parts(qtbot: Any, settings: Settings | None = None) -> Parts:
    from PySide6.QtWidgets import QLabel, QProgressBar, QWidget

    from tauscope.ui.charts.panel import ChartPanel
    from tauscope.ui.controllers.current import CurrentSeries
    from tauscope.ui.controllers.prompts import Prompts
    from tauscope.ui.controllers.session import Session
    from tauscope.ui.findings_panel import FindingsPanel
    from tauscope.ui.reading_panel import ReadingPanel
    from tauscope.ui.series_panel import SeriesPanel

    host = QWidget()
    qtbot.addWidget(host)
    series_panel, findings_panel = SeriesPanel(host), FindingsPanel(host)
    chart_panel, reading_panel = ChartPanel(host), ReadingPanel(host)
    current = CurrentSeries(series_panel, findings_panel, chart_panel, reading_panel)
    series_panel.current_changed.connect(current.follow_series_panel)
    session = Session(settings or Settings(), host)
    return Parts(host, series_panel, findings_panel, chart_panel, reading_panel, session,
                 Prompts(host), QLabel(host), QProgressBar(host), current)


def files_controller(parts: Parts) -> Any:
    from tauscope.ui.controllers.files import FilesController

    return FilesController(parts.series_panel, parts.findings_panel, parts.current,
                           parts.session, parts.prompts, parts.status, parts.host)


def runs_controller(parts: Parts) -> Any:
    from tauscope.ui.controllers.runs import RunsController

    return RunsController(parts.series_panel, parts.findings_panel, parts.current,
                          parts.session, parts.prompts, parts.status, parts.progress, parts.host)


def open_and_wait(qtbot: Any, files: Any, path: Any) -> None:
    before = len(files.series_panel.model.workbook_paths())
    files.open_files([path])
    qtbot.waitUntil(lambda: files.loader.pending == 0, timeout=30_000)
    assert len(files.series_panel.model.workbook_paths()) == before + 1
