"""Loads the installer's scripts (they are not part of the package) for the installer tests."""

from __future__ import annotations

import importlib.util
import sys
from pathlib import Path
from types import ModuleType

REPO = Path(__file__).resolve().parents[1]
INSTALLER = REPO / "installer"


def load(name: str) -> ModuleType:
    """Import ``installer/<name>.py`` as a module (with installer/ on the path meanwhile)."""
    sys.path.insert(0, str(INSTALLER))
    try:
        spec = importlib.util.spec_from_file_location(name, INSTALLER / f"{name}.py")
        assert spec is not None and spec.loader is not None
        module = importlib.util.module_from_spec(spec)
        spec.loader.exec_module(module)
        return module
    finally:
        sys.path.remove(str(INSTALLER))
