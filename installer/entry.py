"""The bundle's executable: the same command line as ``tauscope`` (window, batch, snapshot,
self-test).  PyInstaller freezes this file; everything else comes from the package."""

import multiprocessing
import sys
import types
from collections.abc import Callable
from importlib.util import find_spec

# Left out of the bundle (installer/bundle_config.py) and replaced by placeholders here.
PLACEHOLDER_MODULES = ("PySide6.QtOpenGL", "PySide6.QtOpenGLWidgets")


class _NotBundled:
    """Stands in for a Qt OpenGL class the bundle leaves out; using it is an error."""

    def __init__(self, *args: object, **kwargs: object) -> None:
        raise RuntimeError("OpenGL drawing is not part of this Tauscope bundle")


class _PlaceholderModule(types.ModuleType):
    def __getattr__(self, name: str) -> type:
        if name.startswith("__"):
            raise AttributeError(name)
        return type(name, (_NotBundled,), {})


def _stand_in_for_opengl(missing: Callable[[str], bool] | None = None) -> None:
    """pyqtgraph imports PySide6.QtOpenGL and QtOpenGLWidgets by name when its plot modules
    load, but only draws with OpenGL when asked to, which Tauscope never does.  The bundle
    leaves both out (about 9 MB); placeholders keep pyqtgraph's imports working."""
    is_missing = missing or (lambda name: find_spec(name) is None)
    for name in PLACEHOLDER_MODULES:
        if name not in sys.modules and is_missing(name):
            sys.modules[name] = _PlaceholderModule(name)


if __name__ == "__main__":
    multiprocessing.freeze_support()  # harmless unless a worker process is ever started
    if getattr(sys, "frozen", False):
        _stand_in_for_opengl()
    from tauscope.cli import main

    sys.exit(main())
