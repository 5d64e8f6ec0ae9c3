"""What goes into the bundle (installer/bundle_config.py) and build.py's helpers.

No bundle is built here (installer/ci_bundle.sh does that); these check the choices.
"""

from __future__ import annotations

import json
import os
import re
import struct
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest

import tauscope
from installer_support import load
from tauscope.engine import analyse_series

REPO = Path(__file__).resolve().parents[1]
INSTALLER = REPO / "installer"


config = load("bundle_config")
build = load("build")


@pytest.mark.parametrize(("destination", "kept"), [
    ("PySide6/Qt/plugins/platforms/libqxcb.so", True),
    ("PySide6/Qt/plugins/platforms/libqoffscreen.so", True),
    ("PySide6/Qt/plugins/platforms/libqwayland.so", True),
    ("PySide6/Qt/plugins/platforms/qwindows.dll", True),
    ("PySide6/Qt/plugins/platforms/libqcocoa.dylib", True),
    ("PySide6/Qt/plugins/platforms/libqvnc.so", False),
    ("PySide6/Qt/plugins/platforms/libqeglfs.so", False),
    ("PySide6/Qt/plugins/platformthemes/libqgtk3.so", False),
    ("PySide6/Qt/plugins/platformthemes/libqxdgdesktopportal.so", True),
    ("PySide6/Qt/plugins/imageformats/libqsvg.so", True),
    ("PySide6/Qt/plugins/imageformats/libqtiff.so", False),
    ("PySide6/Qt/plugins/imageformats/libqjpeg.so", False),
    ("PySide6/Qt/plugins/wayland-shell-integration/libxdg-shell.so", True),
    ("PySide6/Qt/plugins/wayland-shell-integration/libivi-shell.so", False),
    ("PySide6/Qt/plugins/xcbglintegrations/libqxcb-glx-integration.so", False),
    ("PySide6/Qt/plugins/sqldrivers/libqsqlite.so", False),
    ("PySide6/Qt/plugins/tls/libqopensslbackend.so", False),
    ("PySide6/Qt/translations/qtbase_de.qm", False),
    ("PySide6/Qt/lib/libQt6Network.so.6", False),
    ("PySide6/Qt/lib/libQt6Widgets.so.6", True),
    ("pyqtgraph/icons/peegee/peegee_512px.png", False),
    ("pyqtgraph/icons/auto.png", True),
    ("numpy/_core/_multiarray_umath.cpython-311-x86_64-linux-gnu.so", True),
])
def test_keep_qt_file(destination: str, kept: bool) -> None:
    assert config.keep_qt_file(destination) is kept


def test_a_qt_module_the_package_uses_is_never_excluded(tmp_path: Path) -> None:
    package = tmp_path / "pkg"
    package.mkdir()
    (package / "a.py").write_text("from PySide6 import QtCore, QtNetwork\n")
    (package / "b.py").write_text("import PySide6.QtSql\n")
    assert {"QtCore", "QtNetwork", "QtSql"} <= config.used_qt_modules(package)
    excluded = config.excluded_modules(package)
    assert "PySide6.QtNetwork" not in excluded and "PySide6.QtSql" not in excluded
    assert "PySide6.QtWebEngineCore" in excluded and "tkinter" in excluded
    assert config.dropped_qt_libraries(package) == ("Qt6EglFSDeviceIntegration",
                                                    "Qt6EglFsKmsSupport")


def test_nothing_the_program_imports_is_excluded(tmp_path: Path) -> None:
    """Run the headless path (a full analysis, the data and report layers, the self-test on
    a small CSV) and import the window's modules, with the optional standard-library modules
    made unimportable as in the bundle; it must still pass and must import nothing else on
    the exclusion list."""
    rng = np.random.default_rng(3)
    walk = np.cumsum(rng.normal(size=100))
    csv = tmp_path / "small.csv"
    csv.write_text("Period,Walk\n" + "".join(f"{1900 + i},{v:.5f}\n" for i, v in enumerate(walk)))
    verdict = analyse_series(np.round(walk, 5), name="Walk").verdict
    expected = tmp_path / "expected.json"
    expected.write_text(json.dumps({"small": {"Walk": {"order": verdict.order,
                                                        "deterministic": verdict.deterministic}}}))
    code = (
        "import json, sys\n"
        f"for name in {config.OPTIONAL_MODULES!r}:\n"
        "    sys.modules[name] = None  # import now raises ImportError, as in the bundle\n"
        "import tauscope.data, tauscope.report\n"
        "import tauscope.ui.main_window  # the window's imports (pyqtgraph, Qt)\n"
        "from tauscope.cli import main\n"
        f"rc = main(['self-test', '--quiet', '--workbook', {str(csv)!r}, "
        f"'--expected', {str(expected)!r}])\n"
        "print(json.dumps([rc, sorted(m for m, v in sys.modules.items() if v is not None)]))\n"
    )
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                          timeout=300, check=False)
    assert done.returncode == 0, done.stderr
    rc, imported = json.loads(done.stdout.strip().splitlines()[-1])
    assert rc == 0, done.stdout
    excluded = config.excluded_modules()
    clashes = [m for m in imported if any(m == e or m.startswith(e + ".") for e in excluded)]
    # pyqtgraph imports Qt's OpenGL modules by name; the bundle gives it placeholders
    # (installer/entry.py, tested below).
    assert sorted(clashes) == ["PySide6.QtOpenGL", "PySide6.QtOpenGLWidgets"]


def test_window_works_with_the_opengl_placeholders(tmp_path: Path) -> None:
    """The bundle leaves Qt's OpenGL modules out; with the entry point's placeholders the
    window's modules import and draw a plot, and using an OpenGL class says why it fails."""
    code = (
        "import sys\n"
        f"sys.path.insert(0, {str(REPO / 'installer')!r})\n"
        "import entry\n"
        "entry._stand_in_for_opengl(missing=lambda name: True)\n"
        "from PySide6.QtWidgets import QApplication\n"
        "app = QApplication([])\n"
        "import pyqtgraph, tauscope.ui.main_window\n"
        "plot = pyqtgraph.PlotWidget(); plot.plot([1.0, 3.0, 2.0]); plot.resize(200, 100)\n"
        f"plot.grab().save({str(tmp_path / 'plot.png')!r})\n"
        "from PySide6 import QtOpenGL\n"
        "try:\n"
        "    QtOpenGL.QOpenGLBuffer()\n"
        "except RuntimeError as error:\n"
        "    print('placeholder:', error)\n"
    )
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                          timeout=300, check=False,
                          env={**os.environ, "QT_QPA_PLATFORM": "offscreen"})
    assert done.returncode == 0, done.stderr
    assert "placeholder: OpenGL drawing is not part of this Tauscope bundle" in done.stdout
    assert (tmp_path / "plot.png").stat().st_size > 0


def test_resources_in_the_bundle() -> None:
    pairs = config.resource_datas()
    files = {Path(source).name: target for source, target in pairs}
    assert files["harbourline_demo.xlsx"] == "resources/demo"
    assert files["expected_verdicts.json"] == "resources/demo"
    assert files["tauscope-256.png"] == "resources/icons"
    assert files["tauscope.svg"] == "resources/icons"
    assert "make_demo.py" not in files and "make_icons.py" not in files
    assert all(Path(source).is_file() for source, _ in pairs)


def test_version_is_read_without_importing_the_package() -> None:
    assert config.package_version() == tauscope.__version__


def test_inno_setup_script_matches_the_package() -> None:
    script = (INSTALLER / "windows" / "tauscope.iss").read_text(encoding="utf-8")
    default = re.search(r'#define AppVersion "([^"]+)"', script)
    assert default is not None and default.group(1) == tauscope.__version__
    assert re.search(r"^PrivilegesRequired=lowest$", script, re.M)
    assert re.search(r"^ChangesAssociations=yes$", script, re.M)
    assert 'Subkey: "Software\\Classes\\.tauscope"' in script
    assert '{app}\\{#AppExeName}"" ""%1"""' in script
    for icon in re.findall(r"\{#RepoRoot\}\\(resources\\[^\s\"]+)", script):
        assert (REPO / icon.replace("\\", "/")).is_file()


def test_tree_size_counts_files_once_and_ignores_links(tmp_path: Path) -> None:
    (tmp_path / "a").write_bytes(b"x" * 1000)
    (tmp_path / "sub").mkdir()
    (tmp_path / "sub" / "b").write_bytes(b"y" * 24)
    (tmp_path / "link").symlink_to(tmp_path / "a")
    assert build.tree_size(tmp_path) == 1024


def test_identical_copies_become_links(tmp_path: Path) -> None:
    payload = bytes(range(256)) * 300
    for folder in ("numpy.libs", "scipy.libs"):
        (tmp_path / folder).mkdir()
        (tmp_path / folder / "libgfortran.so.5").write_bytes(payload)
    (tmp_path / "scipy.libs" / "libother.so").write_bytes(payload)  # same bytes, other name
    (tmp_path / "x.libs").mkdir()
    (tmp_path / "x.libs" / "libgfortran.so.5").write_bytes(payload[:-1] + b"!")  # same size
    assert build.link_duplicates(tmp_path) == len(payload)
    copy = tmp_path / "scipy.libs" / "libgfortran.so.5"
    assert copy.is_symlink() and os.readlink(copy) == "../numpy.libs/libgfortran.so.5"
    assert copy.read_bytes() == payload
    assert not (tmp_path / "scipy.libs" / "libother.so").is_symlink()
    assert not (tmp_path / "x.libs" / "libgfortran.so.5").is_symlink()


def test_load_segment_check_catches_a_misaligned_segment() -> None:
    data = bytearray(Path(sys.executable).resolve().read_bytes())
    if data[:4] != b"\x7fELF" or data[4] != 2:
        pytest.skip("needs a 64-bit ELF interpreter")
    assert build.load_segments_aligned(bytes(data))
    order, phoff, phentsize, phnum, *_ = build.elf_header(bytes(data))
    for index in range(phnum):
        base = phoff + index * phentsize
        p_type, _flags, p_offset = struct.unpack_from(order + "IIQ", data, base)
        if p_type == 1 and p_offset > 0:
            struct.pack_into(order + "Q", data, base + 8, p_offset + 8)  # what a bad strip does
            break
    assert not build.load_segments_aligned(bytes(data))


def test_archive_name_and_platform_tag() -> None:
    tag = config.platform_tag()
    assert re.fullmatch(r"(linux|windows|macos)-[a-z0-9_]+", tag)
