"""Start-up time: from launching Tauscope to its window being shown (offscreen).

    python benchmarks/startup.py [--repeat N] [--bundle DIST/tauscope/tauscope]

Measures, in one run and on the same machine:

- reference: a bare PySide6 program that shows one empty window and quits (the floor
  any Qt program pays: interpreter start plus Qt start);
- package:   ``python -m tauscope`` from the installed package;
- bundle:    the PyInstaller bundle's executable, if ``dist/tauscope/`` exists.

Each program is launched with ``TAUSCOPE_EXIT_AFTER_SHOW=1`` in a fresh, empty home
folder (no remembered settings); the window prints ``tauscope: window shown`` once it is
on screen and quits.  The time counted is from launch to that line.  Prints the median
of ``--repeat`` runs (after one untimed warm-up run each, so the disk cache is warm),
the ratio of each to the reference, and the 3 s budget from issue 8.
"""

from __future__ import annotations

import argparse
import os
import queue
import statistics
import subprocess
import sys
import tempfile
import threading
import time
from pathlib import Path

REPO = Path(__file__).resolve().parents[1]
MARKER = "tauscope: window shown"
BUDGET_SECONDS = 3.0
REFERENCE = f"""
import sys
from PySide6.QtCore import QTimer
from PySide6.QtWidgets import QApplication, QMainWindow
app = QApplication(sys.argv)
window = QMainWindow()
window.resize(1280, 800)
window.show()
def done():
    print({MARKER!r}, flush=True)
    app.quit()
QTimer.singleShot(0, done)
sys.exit(app.exec())
"""


def time_to_marker(command: list[str], timeout: float = 120.0) -> float | None:
    """Seconds from launching ``command`` until it prints the marker line; None if it does not
    within ``timeout`` (the program is then stopped)."""
    with tempfile.TemporaryDirectory() as home:
        env = {**os.environ, "QT_QPA_PLATFORM": "offscreen", "TAUSCOPE_EXIT_AFTER_SHOW": "1",
               "HOME": home, "XDG_CONFIG_HOME": str(Path(home) / ".config"),
               "XDG_DATA_HOME": str(Path(home) / ".local" / "share")}
        started = time.perf_counter()
        process = subprocess.Popen(command, stdout=subprocess.PIPE, stderr=subprocess.DEVNULL,
                                   text=True, env=env, cwd=home)
        lines: queue.Queue[tuple[float, str]] = queue.Queue()

        def read() -> None:
            assert process.stdout is not None
            for line in process.stdout:
                lines.put((time.perf_counter(), line))
            lines.put((time.perf_counter(), ""))  # end of output

        threading.Thread(target=read, daemon=True).start()
        elapsed: float | None = None
        deadline = started + timeout
        while elapsed is None:
            try:
                when, line = lines.get(timeout=max(0.01, deadline - time.perf_counter()))
            except queue.Empty:
                break
            if MARKER in line:
                elapsed = when - started
            elif line == "":
                break
        try:
            process.wait(timeout=30.0 if elapsed is not None else 0.1)
        except subprocess.TimeoutExpired:
            process.kill()
            process.wait()
        return elapsed


def measure(label: str, command: list[str], repeat: int) -> float | None:
    if time_to_marker(command) is None:  # warm-up, and a check that the marker comes at all
        print(f"{label:<10} never reported a shown window: {' '.join(command)}")
        return None
    times = [t for t in (time_to_marker(command) for _ in range(repeat)) if t is not None]
    if not times:
        return None
    median = statistics.median(times)
    spread = ", ".join(f"{t:.2f}" for t in times)
    print(f"{label:<10} {median:6.2f} s   (runs: {spread})")
    return median


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[1])
    parser.add_argument("--repeat", type=int, default=3)
    parser.add_argument("--bundle", type=Path, default=REPO / "dist" / "tauscope" / "tauscope")
    args = parser.parse_args(argv)

    print(f"start-up to a shown window, offscreen, median of {args.repeat} (budget "
          f"{BUDGET_SECONDS:g} s)")
    reference = measure("reference", [sys.executable, "-c", REFERENCE], args.repeat)
    results = {"package": measure("package", [sys.executable, "-m", "tauscope"], args.repeat)}
    if args.bundle.is_file():
        results["bundle"] = measure("bundle", [str(args.bundle)], args.repeat)
    else:
        print(f"bundle     not built ({args.bundle} missing; run python installer/build.py)")
    for label, seconds in results.items():
        if seconds is None:
            continue
        ratio = f"{seconds / reference:.2f}x the bare Qt window" if reference else "no reference"
        verdict = "within" if seconds <= BUDGET_SECONDS else "OVER"
        print(f"{label:<10} {ratio}; {verdict} the {BUDGET_SECONDS:g} s budget")
    package, bundle = results.get("package"), results.get("bundle")
    if package and bundle:
        print(f"bundle / package: {bundle / package:.2f}")
    return 0 if all(v is not None for v in results.values()) else 1


if __name__ == "__main__":
    sys.exit(main())
