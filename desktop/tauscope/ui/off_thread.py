"""Work that would freeze the window, done in a helper thread while the window's own event
loop keeps running (it paints, answers input and shows progress), for a caller that waits
for the answer: the export of findings (charts, PDF, workbook) is one.

:func:`wait_off_thread` runs ``work`` in a Python thread and, meanwhile, a local event loop
in the window's thread (as a modal dialog does), checking every few milliseconds whether the
work is done; it returns the work's value or raises its exception in the caller's thread.
While it runs, the interpreter hands the GIL over every millisecond (as during an analysis
run, ``tauscope.ui.worker``), so the window thread waits less for it, and the garbage
collector is off: a full collection walks every object alive and holds the GIL meanwhile
(a third of a second with a thousand findings in memory), which would freeze the window.
The objects alive before are moved out of its way (``gc.freeze``), as the analysis run
does; what the work leaves behind is freed by reference counting.  The work must not
touch widgets: QPainter on a QImage or a PDF writer, fonts and files are fine in any thread.
"""

from __future__ import annotations

import gc
import sys
import threading
from collections.abc import Callable
from typing import TypeVar

from PySide6.QtCore import QEventLoop, QTimer

from tauscope.ui.worker import RUN_SWITCH_INTERVAL

T = TypeVar("T")
POLL_MS = 5


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
    previous = sys.getswitchinterval()
    sys.setswitchinterval(min(previous, RUN_SWITCH_INTERVAL))
    collecting = gc.isenabled()
    gc.freeze()
    gc.disable()
    try:
        thread.start()
        timer.start()
        if thread.is_alive():
            loop.exec()
        thread.join()
    finally:
        timer.stop()
        sys.setswitchinterval(previous)
        if collecting:
            gc.enable()
    if "error" in box:
        raise box["error"]  # type: ignore[misc]
    return box["value"]  # type: ignore[return-value]
