"""Where the bundled resources live: a PyInstaller bundle, an installed package, or a
source checkout.

A frozen one-folder bundle unpacks them to ``sys._MEIPASS/resources``; an installed
package carries them as ``tauscope.bundled`` (pyproject maps ``resources/`` there); in a
source checkout the package sits at ``<repo>/desktop/tauscope`` and the resources at
``<repo>/resources``.
"""

from __future__ import annotations

import sys
from pathlib import Path

DEMO_WORKBOOK = ("demo", "harbourline_demo.xlsx")


def resource_roots() -> list[Path]:
    """Candidate resource folders, the frozen bundle first."""
    roots: list[Path] = []
    frozen = getattr(sys, "_MEIPASS", None)
    if frozen:
        roots.append(Path(frozen) / "resources")
    installed = Path(__file__).resolve().parent / "bundled"
    if installed.is_dir():
        roots.append(installed)
    roots.append(Path(__file__).resolve().parents[2] / "resources")
    return roots


def resource_path(*parts: str) -> Path | None:
    """The first existing ``resources/<parts>``, or None when it is not there."""
    for root in resource_roots():
        candidate = root.joinpath(*parts)
        if candidate.exists():
            return candidate
    return None


def demo_workbook() -> Path | None:
    """The bundled demo workbook, or None when it is missing."""
    return resource_path(*DEMO_WORKBOOK)
