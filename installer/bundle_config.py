"""What goes into the bundle: shared by ``tauscope.spec``, ``build.py`` and the tests.

Kept apart from the spec so that the choices (which resources, which Qt modules
and plugins to leave out) can be read and tested without running PyInstaller.
"""

from __future__ import annotations

import re
import sys
from collections.abc import Iterable
from pathlib import Path

REPO = Path(__file__).resolve().parents[1]
PACKAGE = REPO / "desktop" / "tauscope"
RESOURCES = REPO / "resources"
APP_NAME = "tauscope"
DISPLAY_NAME = "Tauscope"
BUNDLE_ID = "org.tauscope.Tauscope"
STUDY_SUFFIX = ".tauscope"
STUDY_MIME_TYPE = "application/x-tauscope-study"
MAX_BUNDLE_MB = 250.0

# Resource folders copied into the bundle (at <bundle root>/resources/<name>), and the
# files inside them that are build tools rather than things the program reads.
RESOURCE_FOLDERS = ("demo", "guide", "icons")
RESOURCE_SKIP = ("*.py", "__pycache__", "*.pyc", "README.md")

# Python packages the program never imports at run time (test, notebook and plotting
# tools that happen to be installed next to it); leaving them out keeps the bundle small.
EXCLUDED_PACKAGES = (
    "tkinter", "_tkinter", "turtle", "idlelib", "pydoc_data", "lib2to3",
    "matplotlib", "IPython", "ipykernel", "jupyter", "jupyter_client", "notebook",
    "pytest", "_pytest", "pytestqt", "hypothesis", "arch", "mypy", "ruff",
    "PyInstaller", "setuptools", "pip", "wheel", "sphinx", "docutils",
    "PyQt5", "PyQt6", "PySide2",
    "pyqtgraph.examples", "pyqtgraph.opengl", "pyqtgraph.jupyter",
    "statsmodels.sandbox", "scipy.datasets", "pandas.tests", "numpy.tests",
    "scipy.tests", "statsmodels.tests",
)

# Qt modules Tauscope does not use.  A module named anywhere in the package source
# (``PySide6.QtX`` or ``from PySide6 import QtX``) is kept even if listed here, so
# the window's code can start using one without a silent break in the bundle.
UNUSED_QT_MODULES = (
    "Qt3DAnimation", "Qt3DCore", "Qt3DExtras", "Qt3DInput", "Qt3DLogic", "Qt3DRender",
    "QtBluetooth", "QtCharts", "QtConcurrent", "QtDataVisualization", "QtDBus", "QtDesigner",
    "QtGraphs", "QtGraphsWidgets", "QtHelp", "QtHttpServer", "QtLabsStyleKit", "QtLocation",
    "QtMultimedia", "QtMultimediaWidgets", "QtNetwork", "QtNetworkAuth", "QtNfc", "QtOpenGL",
    "QtOpenGLWidgets", "QtPdf", "QtPdfWidgets", "QtPositioning", "QtQml", "QtQmlFeatures",
    "QtQuick", "QtQuick3D", "QtQuickControls2", "QtQuickTest", "QtQuickWidgets",
    "QtRemoteObjects", "QtScxml", "QtSensors", "QtSerialBus", "QtSerialPort",
    "QtSpatialAudio", "QtSql", "QtStateMachine", "QtTest", "QtTextToSpeech", "QtUiTools",
    "QtWebChannel", "QtWebEngineCore", "QtWebEngineQuick", "QtWebEngineWidgets",
    "QtWebSockets", "QtXml",
)

# Qt plugin folders worth shipping, and within "platforms" the display back-ends:
# offscreen (self-test, snapshots), minimal, and each platform's own default
# (xcb and wayland on Linux, windows on Windows, cocoa on macOS).
KEPT_PLUGIN_TYPES = (
    "platforms", "platformthemes", "platforminputcontexts", "imageformats", "iconengines",
    "styles", "xcbglintegrations", "wayland-decoration-client",
    "wayland-graphics-integration-client", "wayland-shell-integration",
)
KEPT_PLATFORMS = ("offscreen", "minimal", "xcb", "wayland", "wayland-egl", "windows", "cocoa")
KEPT_IMAGE_FORMATS = ("svg", "ico", "icns", "jpeg", "gif")


def package_version(init_file: Path = PACKAGE / "__init__.py") -> str:
    """``__version__`` read from the package's ``__init__.py`` without importing it."""
    match = re.search(r'^__version__\s*=\s*["\']([^"\']+)["\']', init_file.read_text(), re.M)
    if match is None:
        raise ValueError(f"no __version__ in {init_file}")
    return match.group(1)


def used_qt_modules(package: Path = PACKAGE) -> set[str]:
    """Qt module names the package's source mentions (``PySide6.QtX``, ``from PySide6 import``)."""
    found: set[str] = set()
    for source in package.rglob("*.py"):
        text = source.read_text(encoding="utf-8", errors="replace")
        found.update(re.findall(r"PySide6\.(Qt\w+)", text))
        for names in re.findall(r"from\s+PySide6\s+import\s+\(?([\w\s,]+)\)?", text):
            found.update(n.strip() for n in names.split(",") if n.strip().startswith("Qt"))
    return found


def excluded_modules(package: Path = PACKAGE) -> list[str]:
    """Every module PyInstaller should leave out."""
    used = used_qt_modules(package)
    qt = [f"PySide6.{name}" for name in UNUSED_QT_MODULES if name not in used]
    return [*EXCLUDED_PACKAGES, *qt]


def resource_datas(resources: Path = RESOURCES) -> list[tuple[str, str]]:
    """``(source file, folder inside the bundle)`` pairs for the resources that exist."""
    pairs: list[tuple[str, str]] = []
    for folder_name in RESOURCE_FOLDERS:
        folder = resources / folder_name
        if not folder.is_dir():
            continue
        for path in sorted(folder.rglob("*")):
            if path.is_dir() or _skipped(path.relative_to(folder)):
                continue
            target = Path("resources") / folder_name / path.relative_to(folder).parent
            pairs.append((str(path), target.as_posix()))
    return pairs


def _skipped(relative: Path) -> bool:
    return any(relative.match(pattern) or pattern in relative.parts for pattern in RESOURCE_SKIP)


def keep_qt_file(destination: str) -> bool:
    """False for Qt plugin and translation files the bundle does not need.

    ``destination`` is the file's path inside the bundle, e.g.
    ``PySide6/Qt/plugins/platforms/libqvnc.so``.
    """
    parts = Path(destination).as_posix().split("/")
    if "translations" in parts and "PySide6" in parts:
        # Qt's own translations: the program's texts are English, so only Qt's
        # standard dialog texts would change; leaving them out saves ~20 MB.
        return False
    if "plugins" not in parts:
        return True
    index = parts.index("plugins")
    if len(parts) < index + 3:
        return True
    plugin_type, file_name = parts[index + 1], parts[-1]
    if plugin_type not in KEPT_PLUGIN_TYPES:
        return False
    stem = re.sub(r"^(lib)?q", "", file_name.split(".")[0])
    if plugin_type == "platforms":
        return stem in KEPT_PLATFORMS
    if plugin_type == "imageformats":
        return stem in KEPT_IMAGE_FORMATS
    return True


def filter_toc(entries: Iterable[tuple[str, str, str]]) -> list[tuple[str, str, str]]:
    """A PyInstaller TOC without the Qt files ``keep_qt_file`` rejects."""
    return [entry for entry in entries if keep_qt_file(entry[0])]


def platform_tag() -> str:
    """``linux-x86_64``, ``windows-x86_64``, ``macos-arm64``... for archive names."""
    import platform

    system = {"linux": "linux", "win32": "windows", "darwin": "macos"}.get(sys.platform, sys.platform)
    machine = platform.machine().lower().replace("amd64", "x86_64").replace("aarch64", "arm64")
    return f"{system}-{machine}"
