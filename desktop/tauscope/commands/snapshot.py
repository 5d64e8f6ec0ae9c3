"""``tauscope snapshot [FILE] --out PNG``.  The Qt side lives in :mod:`tauscope.ui.snapshot`."""

from tauscope.ui.snapshot import main

__all__ = ["main"]
