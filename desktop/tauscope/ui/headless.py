"""A Qt application for drawing without a screen: the command line's charts and PDF.

Qt draws text and pictures only inside a running application.  When none runs (``tauscope
batch``), one is started on Qt's offscreen platform, which needs no display, whatever
``QT_QPA_PLATFORM`` or ``DISPLAY`` say: the command line's reports come out the same on a
server without a screen as on a laptop.  It is a widgets application (not just a GUI one),
because the charts are the window's own chart views, and so that a window opened later in
the same process can still use it.  PySide6 is imported inside the function: importing this
module does not load Qt.
"""

from __future__ import annotations

import os
from typing import Any

_APP: list[Any] = []  # keeps the application started here alive


def ensure_application() -> None:
    """Start an offscreen widgets application unless one is running already."""
    from PySide6.QtCore import QCoreApplication
    from PySide6.QtWidgets import QApplication

    if QCoreApplication.instance() is None:
        os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
        _APP.append(QApplication(["tauscope", "-platform", "offscreen"]))
