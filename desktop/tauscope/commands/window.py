"""``tauscope [FILE ...]``: open the window.  The Qt side lives in :mod:`tauscope.ui.launch`."""

from tauscope.ui.launch import SHOWN_MARKER, build, main

__all__ = ["SHOWN_MARKER", "build", "main"]
