"""How responsive the window stays while it analyses many series (default 500 × 240).

A QTimer in the window thread ticks every 5 ms during a full run started from
the real window (open workbook → select all → run); the longest gap between
ticks minus the interval is the longest stall of the event loop, measured until a
moment after the run ends (so the work done when it ends, such as the autosave of
the study, counts too).  Target: under 50 ms.  With each longest stall the window thread's
own CPU time within it is printed: the rest it spent waiting (for the interpreter lock, or
for a core when the machine is busy).  The workbook (monthly, random walks)
is generated in a temporary folder and opened through the window's real loader.
Then the same findings are exported as the window does it (Ctrl+E) to .xlsx, .html and .pdf,
charts included, and the longest stall while they are written is measured the same way
(``--no-export`` leaves this out).
As a reference measured in the same run, the script also times the same
analysis done directly (what the window would freeze for if it ran the engine
on its own thread) and prints the ratio.

    QT_QPA_PLATFORM=offscreen python benchmarks/ui_latency.py [--series 500] [--length 240]

``--trace FILE`` says where a stall comes from: whenever the window's loop has not ticked
for ``STALL_DUMP_MS``, ``faulthandler`` (a C thread, so it runs even while another thread
holds the GIL) writes every Python thread's stack to FILE, again every ``STALL_DUMP_MS``
until the loop ticks; each stall over that is then marked in FILE with its length, and
garbage collections longer than 5 ms are listed at the end with their generation and thread.
"""

from __future__ import annotations

import argparse
import datetime as dt
import os
import sys
import tempfile
import threading
import time
from collections.abc import Callable
from pathlib import Path
from typing import IO

import numpy as np

TICK_MS = 5
TARGET_MS = 50.0
STALL_DUMP_MS = 25


class StallTrace:
    """Stacks of every thread during each stall, and the long garbage collections."""

    def __init__(self, handle: IO[str]) -> None:
        import faulthandler
        import gc

        self.handle = handle
        self.collections: list[tuple[float, float, int, str]] = []
        self._starts: dict[int, float] = {}
        self._arm: Callable[[], None] = lambda: faulthandler.dump_traceback_later(
            STALL_DUMP_MS / 1000, repeat=True, file=handle)
        self._cancel = faulthandler.cancel_dump_traceback_later
        handle.write(f"window thread: 0x{threading.get_ident():016x}\n")
        handle.flush()
        gc.callbacks.append(self._on_collection)

    def _on_collection(self, phase: str, info: dict[str, int]) -> None:
        now = time.perf_counter()
        ident = threading.get_ident()
        if phase == "start":
            self._starts[ident] = now
            return
        took = now - self._starts.pop(ident, now)
        if took > 0.005:
            self.collections.append((now - took, took, info["generation"],
                                     threading.current_thread().name))

    def tick(self, gap_ms: float) -> None:
        if gap_ms > STALL_DUMP_MS:
            self.handle.write(f"=== stall of {gap_ms:.1f} ms ended (stacks above) ===\n\n")
            self.handle.flush()
        self._arm()

    def pause(self) -> None:
        self._cancel()
        self.handle.write("=== measuring paused ===\n\n")
        self.handle.flush()

    def close(self) -> None:
        self._cancel()
        for _start, took, generation, thread in self.collections:
            self.handle.write(f"collection of generation {generation} in {thread}: "
                              f"{took * 1000:.1f} ms\n")
        self.handle.close()


def write_workbook(path: Path, count: int, length: int, seed: int = 7) -> None:
    import openpyxl

    rng = np.random.default_rng(seed)
    data = np.cumsum(rng.normal(size=(length, count)), axis=0) + 100
    book = openpyxl.Workbook(write_only=True)
    sheet = book.create_sheet("Monthly")
    sheet.append(["Date", *[f"series {i + 1}" for i in range(count)]])
    for t in range(length):
        sheet.append([dt.date(1990 + t // 12, t % 12 + 1, 1), *data[t].tolist()])
    book.save(path)


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--series", type=int, default=500)
    parser.add_argument("--length", type=int, default=240)
    parser.add_argument("--no-export", action="store_true",
                        help="leave out the export's stall (Ctrl+E to .xlsx, .html and .pdf)")
    parser.add_argument("--trace", type=Path, default=None,
                        help="write the threads' stacks during each stall to this file")
    args = parser.parse_args()
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

    from PySide6.QtCore import QElapsedTimer, QSettings, QTimer

    from tauscope.data import read_workbook
    from tauscope.engine import iter_analyse
    from tauscope.ui.appearance import dispose, prepare_application
    from tauscope.ui.main_window import MainWindow

    with tempfile.TemporaryDirectory(prefix="tauscope-latency-") as folder:
        QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, folder)
        path = Path(folder) / "many.xlsx"
        write_workbook(path, args.series, args.length)
        app = prepare_application([])
        window = MainWindow()
        window.prompts.ask_save_changes = lambda _name: "discard"  # closing asks nothing here
        window.resize(1280, 800)
        window.show()
        window.open_files([path])
        while window.loader.pending:
            app.processEvents()
            time.sleep(0.005)
        app.processEvents()

        clock = QElapsedTimer()
        longest = [0.0]
        last = [0.0]
        # the window thread's own CPU time within the longest stall (the rest of the stall it
        # waited: for the interpreter lock, or for a core on a busy machine)
        longest_cpu = [0.0]
        last_cpu = [0.0]

        trace = StallTrace(args.trace.open("w")) if args.trace else None

        def tick() -> None:
            now = clock.nsecsElapsed() / 1e6
            now_cpu = time.thread_time() * 1000
            if now - last[0] - TICK_MS > longest[0]:
                longest[0] = now - last[0] - TICK_MS
                longest_cpu[0] = now_cpu - last_cpu[0]
            last_cpu[0] = now_cpu
            if trace is not None:
                trace.tick(now - last[0] - TICK_MS)
            last[0] = now

        timer = QTimer()
        timer.setInterval(TICK_MS)
        timer.timeout.connect(tick)
        window.select_all_series()
        for _ in range(50):  # let the selection be drawn before measuring
            app.processEvents()
            time.sleep(0.002)
        clock.start()
        last_cpu[0] = time.thread_time() * 1000
        timer.start()
        started = time.perf_counter()
        window.run_selected()
        while window.runner.is_running():
            app.processEvents()
            time.sleep(0.001)
        windowed = time.perf_counter() - started
        # What the window does when the run ends counts too: the autosave of the study
        # (written by a background thread) until it is done, then a moment more.
        settle_until = time.perf_counter() + 0.3
        while time.perf_counter() < settle_until or window.autosave_running():
            app.processEvents()
            time.sleep(0.001)
        timer.stop()
        if trace is not None:
            trace.pause()
        busy_stall, busy_cpu = longest[0], longest_cpu[0]

        # baseline on this machine, same loop, nothing running: what any program would see
        longest[0] = 0.0
        last[0] = clock.nsecsElapsed() / 1e6
        last_cpu[0] = time.thread_time() * 1000
        timer.start()
        idle_until = time.perf_counter() + min(windowed, 5.0)
        while time.perf_counter() < idle_until:
            app.processEvents()
            time.sleep(0.001)
        timer.stop()
        if trace is not None:
            trace.pause()
        idle_stall = longest[0]
        received = window.last_run[1] if window.last_run else 0

        export_stall, export_cpu, exported = 0.0, 0.0, 0.0
        if not args.no_export:
            longest[0] = 0.0
            last[0] = clock.nsecsElapsed() / 1e6
            last_cpu[0] = time.thread_time() * 1000
            timer.start()
            started = time.perf_counter()
            for suffix in (".xlsx", ".html", ".pdf"):
                if not window.export_findings(Path(folder) / f"findings{suffix}"):
                    raise SystemExit(f"the export to {suffix} failed")
            exported = time.perf_counter() - started
            app.processEvents()
            timer.stop()
            if trace is not None:
                trace.pause()
            export_stall, export_cpu = longest[0], longest_cpu[0]

        series = read_workbook(path).series()
        pairs = [(s.name, s.testable_values()) for s in series]
        started = time.perf_counter()
        for _ in iter_analyse(pairs, window.settings):
            pass
        direct = time.perf_counter() - started
        if trace is not None:
            trace.close()
        dispose(window)

    print(f"series analysed in the window : {received} of {len(series)} in {windowed:.2f} s")
    print(f"longest event-loop stall      : {busy_stall:.1f} ms (target under {TARGET_MS:.0f} ms); "
          f"the window thread's CPU time in it: {busy_cpu:.1f} ms")
    if not args.no_export:
        print(f"export (Ctrl+E) to .xlsx, .html and .pdf with charts: {exported:.2f} s, "
              f"longest stall {export_stall:.1f} ms (window thread's CPU time in it: "
              f"{export_cpu:.1f} ms)")
    print(f"same loop idle (machine noise): {idle_stall:.1f} ms")
    print(f"reference: the same analysis on the window thread would block it for {direct * 1000:.0f} ms")
    print(f"ratio stall / reference block : {busy_stall / (direct * 1000):.4f}")
    print(f"ratio window run / direct run : {windowed / direct:.2f}")
    return 0 if max(busy_stall, export_stall) < TARGET_MS else 1


if __name__ == "__main__":
    sys.exit(main())
