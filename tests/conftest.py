"""Shared fixtures.  Qt-free at import time: Qt is imported inside the fixtures that need it."""

from __future__ import annotations

import datetime as dt
import os
from collections.abc import Iterator
from pathlib import Path

import numpy as np
import pytest


def write_workbook(path: Path, series: dict[str, np.ndarray], start_year: int = 1990) -> Path:
    """A one-sheet monthly .xlsx: a date column and one column per series (None = missing)."""
    import openpyxl

    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "Monthly"
    names = list(series)
    sheet.append(["Date", *names])
    length = max(len(v) for v in series.values())
    for t in range(length):
        date = dt.date(start_year + t // 12, t % 12 + 1, 1)
        row: list[object] = [date]
        for name in names:
            values = series[name]
            value = values[t] if t < len(values) else None
            row.append(None if value is None or not np.isfinite(value) else float(value))
        sheet.append(row)
    book.save(path)
    return path


def simulated_series(count: int, length: int, seed: int) -> dict[str, np.ndarray]:
    """Alternating random walks with drift and stationary AR(1) series (known truth)."""
    rng = np.random.default_rng(seed)
    out: dict[str, np.ndarray] = {}
    for i in range(count):
        shocks = rng.normal(size=length)
        if i % 2 == 0:
            out[f"walk {i + 1}"] = 100 + np.cumsum(0.2 + shocks)
        else:
            ar = np.zeros(length)
            for t in range(1, length):
                ar[t] = 0.5 * ar[t - 1] + shocks[t]
            out[f"ar {i + 1}"] = 10 + ar
    return out


@pytest.fixture(scope="session", autouse=True)
def _widgets_application_first(request: pytest.FixtureRequest) -> None:
    """When the session includes window tests, start the one QApplication before any other
    test can start a bare QGuiApplication (Qt allows one application object per process,
    and windows need the widgets kind)."""
    if not any(Path(str(item.fspath)).name.startswith("test_ui_") for item in request.session.items):
        return
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtWidgets import QApplication

    if QApplication.instance() is None:
        request.session.stash[_APP_KEY] = QApplication(["tauscope-tests"])


_APP_KEY = pytest.StashKey[object]()


@pytest.fixture(autouse=True)
def _closing_asks_nothing(request: pytest.FixtureRequest, monkeypatch: pytest.MonkeyPatch) -> None:
    """A window closed by a test (or by pytest-qt at the end of one) with unsaved changes
    would wait for an answer in a modal box: in window tests the closing question answers
    "discard", as closing did before it asked.  A test of the question sets its own answer."""
    if not Path(str(request.node.fspath)).name.startswith("test_ui_"):
        return
    from tauscope.ui.controllers.prompts import Prompts

    monkeypatch.setattr(Prompts, "_ask_save_changes", lambda _self, _name: "discard")


@pytest.fixture
def qt_settings_dir(tmp_path: Path) -> Iterator[Path]:
    """Point Tauscope's QSettings (INI, user scope) at a temporary folder."""
    from PySide6.QtCore import QSettings

    folder = tmp_path / "settings"
    folder.mkdir()
    QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, str(folder))
    yield folder


@pytest.fixture
def small_workbook(tmp_path: Path) -> Path:
    """Four simulated monthly series, one constant series and one with a gap."""
    series = simulated_series(4, 150, seed=11)
    series["flat"] = np.full(150, 5.0)
    gappy = simulated_series(1, 150, seed=12)["walk 1"]
    gappy[60:63] = np.nan
    series["with a gap"] = gappy
    return write_workbook(tmp_path / "small.xlsx", series)


@pytest.fixture
def main_window(qtbot, qt_settings_dir):  # type: ignore[no-untyped-def]
    """The real main window at 1280×800, settings in a temporary folder."""
    from tauscope.ui.main_window import MainWindow

    window = MainWindow()
    qtbot.addWidget(window)
    window.resize(1280, 800)
    window.show()
    yield window
    if window.runner.is_running():
        window.runner.stop()
        window.runner.wait(30_000)


@pytest.fixture
def open_in_window(qtbot):  # type: ignore[no-untyped-def]
    """open(window, path): open a file the way the user does and wait until it is read."""

    def open_(window, path):  # type: ignore[no-untyped-def]
        before = len(window.series_panel.model.workbook_paths())
        window.open_files([path])
        qtbot.waitUntil(lambda: window.loader.pending == 0, timeout=30_000)
        assert len(window.series_panel.model.workbook_paths()) == before + 1

    return open_


@pytest.fixture
def run_in_window(qtbot):  # type: ignore[no-untyped-def]
    """run(window, series=None): start a run (selected series by default) and wait for its end."""

    def run(window, series=None, timeout=60_000):  # type: ignore[no-untyped-def]
        started = window.run_selected() if series is None else window.run_series(series)
        assert started
        qtbot.waitUntil(lambda: not window.runner.is_running(), timeout=timeout)
        assert window.last_run is not None

    return run


def pytest_terminal_summary(terminalreporter: pytest.TerminalReporter, config: pytest.Config) -> None:
    """Name the shuffled order's seed even under ``-q``, so a failure's order can be repeated
    with ``--randomly-seed=N`` (or run in file order: ``-p no:randomly``)."""
    seed = getattr(config.option, "randomly_seed", None)
    if seed is not None and config.pluginmanager.hasplugin("randomly"):
        terminalreporter.write_line(f"tests ran in shuffled order: --randomly-seed={seed}")
