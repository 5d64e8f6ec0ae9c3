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
# Largest allowed bundle (issue 8): 250 MB read strictly, in millions of bytes (the
# stricter of the two readings of "MB"; 250 MiB would allow 262 million bytes).
MAX_BUNDLE_MB = 250.0

# Resource folders copied into the bundle (at <bundle root>/resources/<name>), and the
# files inside them that are build tools rather than things the program reads.
RESOURCE_FOLDERS = ("demo", "fonts", "guide", "icons")
RESOURCE_SKIP = ("*.py", "__pycache__", "*.pyc", "README.md")

# Standard-library modules left out although Python imports them when present: every
# importer falls back when they are missing (asyncio and urllib without ssl, hashlib and
# hmac without OpenSSL's _hashlib).  No TLS means nothing in the bundle could open a
# secure connection even if asked to; no SQL; no interactive line editing.
OPTIONAL_STDLIB = ("ssl", "_ssl", "_hashlib", "sqlite3", "_sqlite3", "readline")
# Excluded modules that are tried and done without (pyqtgraph: ``try: from PySide6 import
# QtTest``); the tests make all of these unimportable and then run the program.
OPTIONAL_MODULES = (*OPTIONAL_STDLIB, "PySide6.QtTest")

# Python packages the program never imports at run time (test, notebook and plotting
# tools that happen to be installed next to it); leaving them out keeps the bundle small.
EXCLUDED_PACKAGES = (
    "tkinter", "_tkinter", "turtle", "idlelib", "pydoc_data", "lib2to3",
    "matplotlib", "IPython", "ipykernel", "jupyter", "jupyter_client", "notebook",
    "pytest", "_pytest", "pytestqt", "hypothesis", "arch", "mypy", "ruff",
    "PyInstaller", "setuptools", "pip", "wheel", "sphinx", "docutils",
    "PyQt5", "PyQt6", "PySide2",
    *OPTIONAL_STDLIB,
    "pyqtgraph.examples", "pyqtgraph.opengl", "pyqtgraph.jupyter",
    "numpy.distutils", "numpy.tests", "scipy.datasets", "scipy.tests",
    "pandas.tests",
    # statsmodels: the engine uses OLS, the ADF tables and KPSS; these parts are never
    # imported by them (checked with sys.modules after a full analysis, and the bundle's
    # self-test proves it on every build).
    "statsmodels.sandbox", "statsmodels.tests", "statsmodels.datasets",
    "statsmodels.tsa.statespace", "statsmodels.tsa.arima", "statsmodels.tsa.vector_ar",
    "statsmodels.tsa.holtwinters", "statsmodels.tsa.exponential_smoothing",
    "statsmodels.tsa.regime_switching", "statsmodels.tsa.forecasting", "statsmodels.tsa.ardl",
    "statsmodels.tsa.x13", "statsmodels.discrete", "statsmodels.genmod", "statsmodels.gam",
    "statsmodels.imputation", "statsmodels.miscmodels", "statsmodels.multivariate",
    "statsmodels.duration", "statsmodels.robust", "statsmodels.treatment",
    "statsmodels.othermod", "statsmodels.nonparametric",
)

# Qt modules Tauscope does not use.  QtOpenGL and QtOpenGLWidgets (about 9 MB) are among
# them: pyqtgraph imports both by name whenever a plot module loads, but draws with OpenGL
# only when asked to, which Tauscope never does; installer/entry.py puts placeholders in
# their place in the bundle.  A module named anywhere in the package source
# (``PySide6.QtX`` or ``from PySide6 import QtX``) is kept even if listed here, so the
# window's code can start using one without a silent break in the bundle.
UNUSED_QT_MODULES = (
    "Qt3DAnimation", "Qt3DCore", "Qt3DExtras", "Qt3DInput", "Qt3DLogic", "Qt3DRender",
    "QtBluetooth", "QtCharts", "QtConcurrent", "QtDataVisualization", "QtDBus", "QtDesigner",
    "QtGraphs", "QtGraphsWidgets", "QtHelp", "QtHttpServer", "QtLabsStyleKit", "QtLocation",
    "QtMultimedia", "QtMultimediaWidgets", "QtNetwork", "QtNetworkAuth", "QtNfc",
    "QtOpenGL", "QtOpenGLWidgets",
    "QtPdf", "QtPdfWidgets", "QtPositioning", "QtQml", "QtQmlFeatures",
    "QtQuick", "QtQuick3D", "QtQuickControls2", "QtQuickTest", "QtQuickWidgets",
    "QtRemoteObjects", "QtScxml", "QtSensors", "QtSerialBus", "QtSerialPort",
    "QtSpatialAudio", "QtSql", "QtStateMachine", "QtTest", "QtTextToSpeech", "QtUiTools",
    "QtWebChannel", "QtWebEngineCore", "QtWebEngineQuick", "QtWebEngineWidgets",
    "QtWebSockets", "QtXml",
)

# Qt plugin folders worth shipping, and within "platforms" the display back-ends:
# offscreen (self-test, snapshots), minimal, and each platform's own default
# (xcb and wayland on Linux, windows on Windows, cocoa on macOS).
# The window draws with the raster engine (no OpenGL), so the OpenGL glue for X11 and
# Wayland (xcbglintegrations, wayland-graphics-integration-client) stays out.
KEPT_PLUGIN_TYPES = (
    "platforms", "platformthemes", "platforminputcontexts", "imageformats", "iconengines",
    "styles", "wayland-decoration-client", "wayland-shell-integration",
)
KEPT_PLATFORMS = ("offscreen", "minimal", "xcb", "wayland", "wayland-egl", "windows", "cocoa")
KEPT_IMAGE_FORMATS = ("svg", "ico", "icns")
# Wayland shells other than the standard xdg-shell serve car dashboards, kiosks and Qt's
# own compositors.
DROPPED_WAYLAND_SHELLS = ("ivi-shell", "fullscreen-shell-v1", "wl-shell-plugin", "qt-shell")
# The GTK theme plugin would drag in (and pin) a second copy of GTK's libraries, which
# then clash with the user's own; the desktop portal plugin gives native dialogs instead.
DROPPED_PLUGINS = ("gtk3",)
# Qt libraries collected only for plugins or modules left out above.
DROPPED_QT_LIBRARIES = ("Qt6Network", "Qt6EglFSDeviceIntegration", "Qt6EglFsKmsSupport")
# Other packages' files we never show: pyqtgraph's own logo in bitmap sizes (its SVG stays,
# so a call that looks for it still finds it).
DROPPED_DATA = ("pyqtgraph/icons/peegee/*.png",)


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


def dropped_qt_libraries(package: Path = PACKAGE) -> tuple[str, ...]:
    """``DROPPED_QT_LIBRARIES``, keeping Qt6Network if the package ever uses QtNetwork."""
    used = used_qt_modules(package)
    return tuple(n for n in DROPPED_QT_LIBRARIES if n.replace("Qt6", "Qt") not in used)


def keep_qt_file(destination: str, dropped_libraries: Iterable[str] = DROPPED_QT_LIBRARIES) -> bool:
    """False for Qt plugin, library and translation files the bundle does not need.

    ``destination`` is the file's path inside the bundle, e.g.
    ``PySide6/Qt/plugins/platforms/libqvnc.so``.
    """
    parts = Path(destination).as_posix().split("/")
    if any(Path(destination).match(pattern) for pattern in DROPPED_DATA):
        return False
    if "translations" in parts and "PySide6" in parts:
        # Qt's own translations: the program's texts are English, so only Qt's
        # standard dialog texts would change; leaving them out saves ~14 MB.
        return False
    for name in dropped_libraries:
        variants = (f"lib{name}.so", f"{name}.dll", f"{name.replace('Qt6', 'Qt')}.framework")
        if any(part.startswith(variant) for part in parts for variant in variants):
            return False
    if "plugins" not in parts:
        return True
    index = parts.index("plugins")
    if len(parts) < index + 3:
        return True
    plugin_type, file_name = parts[index + 1], parts[-1]
    stem = re.sub(r"^(lib)?q", "", file_name.split(".")[0])
    if plugin_type not in KEPT_PLUGIN_TYPES or stem in DROPPED_PLUGINS:
        return False
    if plugin_type == "platforms":
        return stem in KEPT_PLATFORMS
    if plugin_type == "imageformats":
        return stem in KEPT_IMAGE_FORMATS
    if plugin_type == "wayland-shell-integration":
        return file_name.split(".")[0].removeprefix("lib") not in DROPPED_WAYLAND_SHELLS
    return True


def filter_toc(entries: Iterable[tuple[str, str, str]]) -> list[tuple[str, str, str]]:
    """A PyInstaller TOC without the Qt files ``keep_qt_file`` rejects."""
    dropped = dropped_qt_libraries()
    return [entry for entry in entries if keep_qt_file(entry[0], dropped)]


def platform_tag() -> str:
    """``linux-x86_64``, ``windows-x86_64``, ``macos-arm64``... for archive names."""
    import platform

    system = {"linux": "linux", "win32": "windows", "darwin": "macos"}.get(sys.platform, sys.platform)
    machine = platform.machine().lower().replace("amd64", "x86_64").replace("aarch64", "arm64")
    return f"{system}-{machine}"


# Libraries every Linux desktop provides, taken from the user's system rather than bundled:
# a bundled copy that is older than the system's configuration files (fonts, D-Bus, X11)
# is a well-known cause of crashes and missing fonts.  The less common xcb extension
# libraries Qt needs (xcb-cursor, xcb-icccm, ...) stay bundled.
SYSTEM_LIBRARIES = (
    "libX11.so", "libX11-xcb.so", "libXau.so", "libXdmcp.so", "libxcb.so",
    "libfontconfig.so", "libfreetype.so", "libdbus-1.so", "libsystemd.so", "libgcrypt.so",
    "libgpg-error.so", "libglib-2.0.so", "libgthread-2.0.so", "libgobject-2.0.so",
    "libgio-2.0.so", "libGL.so", "libEGL.so", "libOpenGL.so", "libGLX.so",
    "libwayland-client.so", "libwayland-cursor.so", "libwayland-egl.so",
)


def prune_unreferenced_libraries(entries: list[tuple[str, str, str]]) -> list[tuple[str, str, str]]:
    """Drop ``SYSTEM_LIBRARIES``, and libraries at the bundle root no remaining binary needs.

    PyInstaller collects a plugin's dependencies before the spec filters the plugin out,
    so leaving out e.g. the GTK theme plugin leaves GTK's libraries behind.  Roots are all
    binaries except the ``lib*.so*`` files at the top level (other than libpython); a
    top-level library stays only if a root needs it, directly or through another library.
    Linux only: elsewhere the entries come back unchanged.
    """
    if not sys.platform.startswith("linux"):
        return entries
    from PyInstaller.depend.bindepend import get_imports

    def candidate(dest: str) -> bool:
        return "/" not in dest and dest.startswith("lib") and ".so" in dest \
            and not dest.startswith("libpython")

    def system(dest: str) -> bool:
        return any(dest.startswith(prefix) for prefix in SYSTEM_LIBRARIES)

    entries = [entry for entry in entries if not (candidate(entry[0]) and system(entry[0]))]
    by_name = {dest: src for dest, src, _ in entries if candidate(dest)}
    queue = [src for dest, src, _ in entries if not candidate(dest)]
    reached: set[str] = set()
    seen: set[str] = set()
    while queue:
        source = queue.pop()
        if source in seen:
            continue
        seen.add(source)
        try:
            imports = get_imports(source)
        except Exception:
            return entries
        for name, _path in imports:
            base = Path(name).name
            if base in by_name and base not in reached:
                reached.add(base)
                queue.append(by_name[base])
    return [entry for entry in entries if not candidate(entry[0]) or entry[0] in reached]
