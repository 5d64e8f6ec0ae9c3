"""Work that would freeze the window, done in a helper thread while the window's own event
loop keeps running (it paints, answers input and shows progress), for a caller that waits
for the answer: the export of findings (charts, PDF, workbook) is one.

:func:`wait_off_thread` runs ``work`` in a Python thread and, meanwhile, a local event loop
in the window's thread (as a modal dialog does), checking every few milliseconds whether the
work is done; it returns the work's value or raises its exception in the caller's thread.
While it runs, the interpreter is set for background work (:class:`BackgroundWork`, shared
with the analysis run of ``tauscope.ui.worker``).  The work must not touch widgets: QPainter
on a QImage or a PDF writer, fonts and files are fine in any thread.
"""

from __future__ import annotations

import gc
import sys
import threading
from collections.abc import Callable
from typing import TypeVar

from PySide6.QtCore import QEventLoop, QTimer

T = TypeVar("T")
POLL_MS = 5
RUN_SWITCH_INTERVAL = 0.001  # seconds (Python's default is 0.005)
OLDEST_THRESHOLD = 1 << 30  # collections of the middle generation before the oldest's (default 10)


class BackgroundWork:
    """The interpreter set for a helper thread working while the window's thread answers.

    - The GIL is handed over every millisecond instead of every 5 ms, so the window thread
      waits less for it when it wakes.
    - No full garbage collection: it walks every object alive and holds the GIL meanwhile
      (0.4–0.7 s with a thousand findings in memory), which would freeze the window.  The
      objects alive are moved out of its way (``gc.freeze``), and the oldest generation is
      not collected while the work runs (its threshold raised); the young generations still
      are, so the short-lived reference cycles the work makes are freed as it goes.
    - When the work ends, what it made and kept (a thousand results, say) is moved out of the
      way in turn before the threshold is back: otherwise the first full collection after
      it would walk them all from the window's thread.  Frozen objects are still freed by
      reference counting; only reference cycles among them stay until the program ends.
    """

    _active = 0  # helpers working now (an export may run during an analysis)
    _saved: tuple[float, tuple[int, int, int]] = (0.005, (700, 10, 10))

    def __init__(self) -> None:
        self._entered = False

    def enter(self) -> None:
        if self._entered:
            return
        self._entered = True
        cls = BackgroundWork
        if cls._active == 0:
            cls._saved = (sys.getswitchinterval(), gc.get_threshold())
            sys.setswitchinterval(min(cls._saved[0], RUN_SWITCH_INTERVAL))
            gc.set_threshold(cls._saved[1][0], cls._saved[1][1], OLDEST_THRESHOLD)
        cls._active += 1
        gc.freeze()

    def leave(self) -> None:
        if not self._entered:
            return
        self._entered = False
        cls = BackgroundWork
        cls._active -= 1
        gc.freeze()
        if cls._active == 0:
            sys.setswitchinterval(cls._saved[0])
            gc.set_threshold(*cls._saved[1])


def freeze_long_lived() -> None:
    """Move every object alive now out of the way of full garbage collections
    (``gc.freeze``), once something large and long-lived has been built: a workbook read and
    shown.  Else the first full collection after it walks it all from the window's thread
    at whatever comes next, the start of a run say (150 ms with a thousand series of 240
    values; see benchmarks/ui_latency.py).  As after a run (:class:`BackgroundWork`), frozen
    objects are still freed by reference counting; only reference cycles among them stay
    until the program ends."""
    gc.freeze()


def wait_off_thread(work: Callable[[], T]) -> T:
    """``work()`` run in a helper thread while the window's events go on; its value, or its
    exception raised here."""
    box: dict[str, object] = {}

    def run() -> None:
        try:
            box["value"] = work()
        except BaseException as exc:  # handed back to the caller's thread
            box["error"] = exc

    thread = threading.Thread(target=run, name="tauscope-off-thread", daemon=True)
    loop = QEventLoop()
    timer = QTimer()
    timer.setInterval(POLL_MS)
    timer.timeout.connect(lambda: None if thread.is_alive() else loop.quit())
    background = BackgroundWork()
    background.enter()
    try:
        thread.start()
        timer.start()
        if thread.is_alive():
            loop.exec()
        thread.join()
    finally:
        timer.stop()
        background.leave()
    if "error" in box:
        raise box["error"]  # type: ignore[misc]
    return box["value"]  # type: ignore[return-value]
