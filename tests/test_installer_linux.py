"""The Linux archive and its install/uninstall scripts, on a stand-in bundle in a temp HOME.

The real bundle is built by installer/ci_bundle.sh (minutes); here a one-line shell
program stands in for it, so these tests take seconds.
"""

from __future__ import annotations

import configparser
import os
import shutil
import subprocess
import sys
import tarfile
from pathlib import Path

import pytest

from installer_support import load

REPO = Path(__file__).resolve().parents[1]
INSTALLER = REPO / "installer"

pytestmark = pytest.mark.skipif(not sys.platform.startswith("linux") or shutil.which("sh") is None,
                                reason="the install scripts are for Linux")


build = load("build")


@pytest.fixture
def unpacked(tmp_path: Path) -> Path:
    """A stand-in bundle packed by build.make_linux_archive and unpacked again."""
    bundle = tmp_path / "dist" / "tauscope"
    (bundle / "_internal").mkdir(parents=True)
    program = bundle / "tauscope"
    program.write_text('#!/bin/sh\necho "stand-in tauscope $*"\n')
    program.chmod(0o755)
    (bundle / "_internal" / "data.txt").write_text("bundled file\n")
    (bundle / "_internal" / "link.txt").symlink_to("data.txt")  # PyInstaller makes such links
    archive = build.make_linux_archive(bundle, "9.8.7", tmp_path / "dist")
    assert archive.name == f"tauscope-9.8.7-{build.config.platform_tag()}.tar.gz"
    with tarfile.open(archive) as tar:
        names = tar.getnames()
        assert all(name.startswith("tauscope-9.8.7/") for name in names)
        modes = {m.name: m.mode for m in tar.getmembers() if m.isfile()}
        tar.extractall(tmp_path / "unpacked", filter="tar")
    assert modes["tauscope-9.8.7/install.sh"] == 0o755
    assert modes["tauscope-9.8.7/tauscope/tauscope"] == 0o755
    assert modes["tauscope-9.8.7/tauscope.desktop"] == 0o644
    return tmp_path / "unpacked" / "tauscope-9.8.7"


def run(script: Path, home: Path, *args: str) -> subprocess.CompletedProcess[str]:
    env = {"HOME": str(home), "PATH": os.environ.get("PATH", "/usr/bin:/bin")}
    return subprocess.run(["sh", str(script), *args], capture_output=True, text=True, env=env,
                          timeout=60, check=False)


def desktop_entry(path: Path) -> configparser.SectionProxy:
    parser = configparser.ConfigParser(interpolation=None, strict=True)
    parser.optionxform = str  # type: ignore[assignment,method-assign]
    parser.read(path, encoding="utf-8")
    return parser["Desktop Entry"]


@pytest.mark.parametrize("home_name", ["home", "home with space"])
def test_install_then_uninstall_in_a_temporary_home(unpacked: Path, tmp_path: Path,
                                                    home_name: str) -> None:
    home = tmp_path / home_name
    home.mkdir()
    share = home / ".local" / "share"
    # Things of the user's that must survive both scripts.
    (home / ".local" / "bin").mkdir(parents=True)
    (home / ".local" / "bin" / "other-tool").write_text("keep me\n")
    (share / "applications").mkdir(parents=True)
    (share / "applications" / "other.desktop").write_text("[Desktop Entry]\n")

    done = run(unpacked / "install.sh", home)
    assert done.returncode == 0, done.stderr
    app = share / "tauscope"
    assert (app / "tauscope").is_file() and os.access(app / "tauscope", os.X_OK)
    assert (app / "_internal" / "data.txt").read_text() == "bundled file\n"
    assert os.readlink(app / "_internal" / "link.txt") == "data.txt"
    link = home / ".local" / "bin" / "tauscope"
    assert link.is_symlink() and Path(os.readlink(link)) == app / "tauscope"
    ran = subprocess.run([str(link), "self-test"], capture_output=True, text=True, check=False)
    assert ran.stdout == "stand-in tauscope self-test\n"

    installed_entry = share / "applications" / "tauscope.desktop"
    validator = shutil.which("desktop-file-validate")
    if validator is not None:  # freedesktop.org's own checker, where installed
        checked = subprocess.run([validator, str(installed_entry)], capture_output=True,
                                 text=True, check=False)
        assert checked.returncode == 0 and "error" not in checked.stdout, checked.stdout
    entry = desktop_entry(installed_entry)
    assert entry["Exec"] == f'"{app / "tauscope"}" %F'
    assert entry["Icon"] == "tauscope" and entry["Type"] == "Application"
    assert entry["MimeType"] == "application/x-tauscope-study;"
    for size in (16, 32, 48, 64, 128, 256, 512):
        icon = share / "icons" / "hicolor" / f"{size}x{size}" / "apps" / "tauscope.png"
        assert icon.read_bytes() == (REPO / "resources" / "icons" / f"tauscope-{size}.png").read_bytes()
    assert (share / "icons" / "hicolor" / "scalable" / "apps" / "tauscope.svg").is_file()
    mime = (share / "mime" / "packages" / "tauscope.xml").read_text()
    assert '<glob pattern="*.tauscope"/>' in mime
    assert (app / "uninstall.sh").is_file()

    done = run(app / "uninstall.sh", home)
    assert done.returncode == 0, done.stderr
    assert not app.exists() and not link.exists() and not link.is_symlink()
    assert not (share / "applications" / "tauscope.desktop").exists()
    assert not list((share / "icons").rglob("tauscope.*"))
    assert not (share / "mime" / "packages" / "tauscope.xml").exists()
    assert (home / ".local" / "bin" / "other-tool").read_text() == "keep me\n"
    assert (share / "applications" / "other.desktop").exists()


def test_reinstalling_replaces_the_earlier_installation(unpacked: Path, tmp_path: Path) -> None:
    home = tmp_path / "home"
    home.mkdir()
    assert run(unpacked / "install.sh", home).returncode == 0
    stale = home / ".local" / "share" / "tauscope" / "_internal" / "old-version-file"
    stale.write_text("from an earlier version\n")
    assert run(unpacked / "install.sh", home).returncode == 0
    assert not stale.exists()
    assert (home / ".local" / "share" / "tauscope" / "tauscope").is_file()


def test_install_refuses_to_overwrite_a_folder_it_did_not_make(unpacked: Path,
                                                               tmp_path: Path) -> None:
    home = tmp_path / "home"
    foreign = home / ".local" / "share" / "tauscope"
    foreign.mkdir(parents=True)
    (foreign / "notes.txt").write_text("someone else's\n")
    done = run(unpacked / "install.sh", home)
    assert done.returncode == 1
    assert "was not made by this installer" in done.stderr
    assert (foreign / "notes.txt").read_text() == "someone else's\n"
    done = run(unpacked / "uninstall.sh", home)
    assert done.returncode == 1
    assert (foreign / "notes.txt").exists()


def test_install_leaves_a_foreign_tauscope_command_alone(unpacked: Path, tmp_path: Path) -> None:
    home = tmp_path / "home"
    (home / ".local" / "bin").mkdir(parents=True)
    own = home / ".local" / "bin" / "tauscope"
    own.write_text("#!/bin/sh\necho mine\n")
    done = run(unpacked / "install.sh", home)
    assert done.returncode == 0
    assert "leaving" in done.stderr and own.read_text() == "#!/bin/sh\necho mine\n"
    assert run(home / ".local" / "share" / "tauscope" / "uninstall.sh", home).returncode == 0
    assert own.read_text() == "#!/bin/sh\necho mine\n"


def test_desktop_entry_template_keys() -> None:
    entry = desktop_entry(INSTALLER / "linux" / "tauscope.desktop")
    assert entry["Name"] == "Tauscope"
    assert entry["Exec"] == "tauscope %F"
    assert entry["Terminal"] == "false"
    assert entry["Categories"].endswith(";") and entry["MimeType"].endswith(";")
