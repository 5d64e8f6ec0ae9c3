"""``tauscope snapshot [FILE] --out PNG [--size WxH] [--chart VIEW]``: a picture of the
analysed window.

Opens the window offscreen at 1280×800 (or ``--size``) with a throw-away settings folder (the
user's remembered layout and settings are neither used nor changed), reads
FILE or the demo workbook, analyses every series, waits for the end, selects
the first series, shows the chart view asked for (``--chart``, default: the data) and saves
the whole window as a PNG.
"""

from __future__ import annotations

import argparse
import os
import sys
import tempfile
from pathlib import Path

WIDTH, HEIGHT = 1280, 800
CHART_VIEWS = ("data", "fitted", "lags", "window", "null", "seasons")  # the Chart panel's tabs, in order


def window_size(text: str) -> tuple[int, int]:
    """"1280x800" (or "1280×800") as (width, height), each between 640 and 7680."""
    parts = text.lower().replace("×", "x").split("x")
    try:
        width, height = (int(p) for p in parts)
    except ValueError:
        raise argparse.ArgumentTypeError(f"size must look like 1280x800, not {text!r}") from None
    if not (640 <= width <= 7680 and 480 <= height <= 4320):
        raise argparse.ArgumentTypeError(f"size {width}x{height} is outside 640x480 to 7680x4320")
    return width, height


class _Parser(argparse.ArgumentParser):
    def error(self, message: str) -> None:  # type: ignore[override]
        self.print_usage(sys.stderr)
        print(f"tauscope snapshot: {message}", file=sys.stderr)
        raise SystemExit(2)


def parse(argv: list[str]) -> argparse.Namespace:
    parser = _Parser(prog="tauscope snapshot",
                     description="Save a picture of the window after analysing a workbook.")
    parser.add_argument("file", nargs="?", help="workbook to open (default: the demo workbook)")
    parser.add_argument("--out", required=True, help="PNG file to write")
    parser.add_argument("--size", type=window_size, default=(WIDTH, HEIGHT), metavar="WxH",
                        help=f"window size in pixels (default {WIDTH}x{HEIGHT})")
    parser.add_argument("--chart", choices=CHART_VIEWS, default="data",
                        help="the chart view to show (default: data)")
    parser.add_argument("--timeout", type=float, default=600.0, help=argparse.SUPPRESS)
    return parser.parse_args(argv)


def main(argv: list[str]) -> int:
    args = parse(argv)
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from tauscope.resources_path import demo_workbook

    source = Path(args.file) if args.file else demo_workbook()
    if source is None:
        print("tauscope snapshot: the demo workbook is missing; give a FILE.", file=sys.stderr)
        return 3
    if not source.is_file():
        print(f"tauscope snapshot: {source} does not exist.", file=sys.stderr)
        return 3
    with tempfile.TemporaryDirectory(prefix="tauscope-snapshot-") as settings_dir:
        return _snapshot(source, Path(args.out), settings_dir, args.timeout, args.size,
                         CHART_VIEWS.index(args.chart))


def _snapshot(source: Path, out: Path, settings_dir: str, timeout: float,
              size: tuple[int, int] = (WIDTH, HEIGHT), chart: int = 0) -> int:
    from PySide6.QtCore import QElapsedTimer, QSettings, QThread
    from PySide6.QtWidgets import QApplication

    from tauscope.data import DataError, read_workbook
    from tauscope.ui.appearance import apply_appearance, dispose, prepare_application
    from tauscope.ui.main_window import MainWindow

    QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, settings_dir)
    try:
        workbook = read_workbook(source)
    except DataError as exc:
        print(f"tauscope snapshot: {exc}", file=sys.stderr)
        return 3
    app = prepare_application([])
    apply_appearance(app, "light")
    window = MainWindow()
    window.prompts.ask_save_changes = lambda _name: "discard"  # a picture, not a study
    window.resize(*size)
    window.show()
    window.add_workbook(workbook)
    QApplication.processEvents()
    window.run_all()
    clock = QElapsedTimer()
    clock.start()
    while window.runner.is_running() and clock.elapsed() < timeout * 1000:
        app.processEvents()
        QThread.msleep(10)
    if window.runner.is_running():
        print("tauscope snapshot: the analysis did not finish in time.", file=sys.stderr)
        dispose(window)
        return 1
    app.processEvents()
    first = workbook.series()[0].key if workbook.series() else ""
    if first:
        window.series_panel.view.clearSelection()
        window.select_series(first)
        window.findings_panel.view.expand(window.findings_panel.proxy.index(0, 0))
    window.chart_panel.tabs.setCurrentIndex(chart)
    _settle(app, 3000, window)
    picture = window.grab()
    out.parent.mkdir(parents=True, exist_ok=True)
    ok = picture.save(str(out), "PNG")
    dispose(window)
    if not ok:
        print(f"tauscope snapshot: could not write {out}.", file=sys.stderr)
        return 1
    print(f"tauscope snapshot: wrote {out} ({picture.width()}×{picture.height()})")
    return 0


def _settle(app: object, msecs: int, window: object) -> None:
    """Let pending drawing (and the null-distribution simulation) finish."""
    from PySide6.QtCore import QElapsedTimer, QThreadPool
    from PySide6.QtWidgets import QApplication

    clock = QElapsedTimer()
    clock.start()
    while clock.elapsed() < msecs:
        QApplication.processEvents()
        if QThreadPool.globalInstance().activeThreadCount() == 0 and clock.elapsed() > 300:
            break
        QThreadPool.globalInstance().waitForDone(20)
    QApplication.processEvents()
