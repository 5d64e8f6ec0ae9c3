"""Build the Tauscope bundle: ``python installer/build.py``.

Steps (each prints what it did; any failure ends the build with exit code 1):

1. PyInstaller one-folder build from ``installer/tauscope.spec`` into ``dist/tauscope/``
   (work files in ``build/pyinstaller/``), from the repository this script sits in.
2. Linux: strip symbol tables from the bundled libraries that carry them, keeping each
   stripped file only if its loadable segments are still page-aligned (libraries that
   wheels patched with patchelf can be broken by strip; those stay as they were); then
   replace identical copies of a library (numpy's and scipy's Fortran runtime) by links.
3. Print the bundle's size unpacked and fail above the limit (250 MB: million bytes).
4. Linux: check that every Qt library a bundled file links against is in the bundle, and
   warn about libraries the display plugins need that the build machine lacks.
5. Run the bundle's own ``tauscope self-test`` (offscreen; on Linux inside a new network
   namespace when ``unshare`` allows it, which proves it works with no network at all),
   then ``tauscope snapshot`` (the window, offscreen, on the demo workbook).
6. Linux: write ``dist/tauscope-<version>-linux-<machine>.tar.gz`` with the folder, the
   desktop entry, the icons, the file-type definition and install.sh / uninstall.sh.

Options: ``--skip-self-test``, ``--skip-archive``, ``--max-mb N``.
PyInstaller comes from the project's ``bundle`` extra (``pip install -e ".[bundle]"``).
"""

from __future__ import annotations

import argparse
import os
import shutil
import struct
import subprocess
import sys
import tarfile
import tempfile
import time
from collections.abc import Iterator
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))

import bundle_config as config  # noqa: E402

REPO = config.REPO
DIST = REPO / "dist"
WORK = REPO / "build" / "pyinstaller"
SPEC = HERE / "tauscope.spec"
LINUX_FILES = HERE / "linux"
ICONS = REPO / "resources" / "icons"
ELF_MAGIC = b"\x7fELF"
PAGE_SIZE = 4096


class BuildError(Exception):
    """A step failed; the message says which and why."""


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Build the Tauscope one-folder bundle.")
    parser.add_argument("--skip-self-test", action="store_true",
                        help="do not run the bundle's self-test")
    parser.add_argument("--skip-archive", action="store_true",
                        help="do not write the Linux .tar.gz")
    parser.add_argument("--max-mb", type=float, default=config.MAX_BUNDLE_MB,
                        help="largest allowed bundle, MB (million bytes) unpacked "
                             f"(default {config.MAX_BUNDLE_MB:g})")
    args = parser.parse_args(argv)
    started = time.perf_counter()
    try:
        bundle = run_pyinstaller()
        if sys.platform.startswith("linux"):
            saved = strip_bundle(bundle)
            print(f"stripped symbol tables: {saved / 1e6:.1f} MB saved")
            saved = link_duplicates(bundle)
            print(f"identical copies replaced by links: {saved / 1e6:.1f} MB saved")
        size = tree_size(bundle)
        size_mb = size / 1e6
        print(f"bundle size: {size_mb:.1f} MB ({size / 2**20:.1f} MiB) unpacked "
              f"({bundle}); limit {args.max_mb:g} MB")
        if size_mb > args.max_mb:
            raise BuildError(f"the bundle is {size_mb:.1f} MB, over the {args.max_mb:g} MB limit")
        if sys.platform.startswith("linux"):
            missing = missing_qt_libraries(bundle)
            if missing:
                raise BuildError("bundled files link against Qt libraries that are not in the "
                                 "bundle: " + ", ".join(missing))
            for warning in unresolved_display_libraries(bundle):
                print(f"warning: {warning}")
        if not args.skip_self_test:
            run_self_test(bundle)
            run_snapshot(bundle)
        if sys.platform.startswith("linux") and not args.skip_archive:
            archive = make_linux_archive(bundle, config.package_version(), DIST)
            print(f"archive: {archive} ({archive.stat().st_size / 1e6:.1f} MB)")
    except BuildError as exc:
        print(f"build FAILED: {exc}", file=sys.stderr)
        return 1
    print(f"build finished in {time.perf_counter() - started:.0f} s")
    return 0


def run_pyinstaller() -> Path:
    """Run PyInstaller on the spec; return the bundle folder."""
    try:
        import PyInstaller  # noqa: F401
    except ImportError as exc:
        raise BuildError('PyInstaller is not installed; run: python -m pip install -e ".[bundle]"'
                         ) from exc
    command = [sys.executable, "-m", "PyInstaller", "--noconfirm", "--clean", "--log-level", "WARN",
               "--distpath", str(DIST), "--workpath", str(WORK), str(SPEC)]
    print("running: " + " ".join(command), flush=True)
    started = time.perf_counter()
    if subprocess.run(command, cwd=REPO, check=False).returncode != 0:
        raise BuildError("PyInstaller failed (see its messages above)")
    print(f"PyInstaller finished in {time.perf_counter() - started:.0f} s")
    bundle = DIST / config.APP_NAME
    if sys.platform == "darwin":
        return DIST / f"{config.DISPLAY_NAME}.app" if (DIST / f"{config.DISPLAY_NAME}.app").is_dir() \
            else bundle
    return bundle


def executable(bundle: Path) -> Path:
    """The program inside the bundle (the console twin on Windows)."""
    if sys.platform == "win32":
        return bundle / f"{config.APP_NAME}-console.exe"
    if bundle.suffix == ".app":
        return bundle / "Contents" / "MacOS" / config.APP_NAME
    return bundle / config.APP_NAME


def tree_size(folder: Path) -> int:
    """Bytes of all regular files under ``folder`` (symbolic links count as nothing)."""
    total = 0
    for root, _dirs, files in os.walk(folder):
        for name in files:
            path = Path(root) / name
            if not path.is_symlink():
                total += path.stat().st_size
    return total


def elf_files(folder: Path) -> Iterator[Path]:
    for root, _dirs, files in os.walk(folder):
        for name in files:
            path = Path(root) / name
            if path.is_symlink() or not path.is_file():
                continue
            with path.open("rb") as handle:
                if handle.read(4) == ELF_MAGIC:
                    yield path


def elf_header(data: bytes) -> tuple[str, int, int, int, int, int, int] | None:
    """(byte order, phoff, phentsize, phnum, shoff, shentsize, shnum) of a 64-bit ELF file."""
    if len(data) < 64 or data[:4] != ELF_MAGIC or data[4] != 2:
        return None
    order = "<" if data[5] == 1 else ">"
    phoff, shoff = struct.unpack_from(order + "QQ", data, 0x20)
    phentsize, phnum, shentsize, shnum = struct.unpack_from(order + "HHHH", data, 0x36)
    return order, phoff, phentsize, phnum, shoff, shentsize, shnum


def load_segments_aligned(data: bytes) -> bool:
    """True when every PT_LOAD segment satisfies the loader's rule
    (p_vaddr - p_offset) mod page size == 0, which glibc checks before mapping."""
    header = elf_header(data)
    if header is None:
        return False
    order, phoff, phentsize, phnum, _shoff, _shentsize, _shnum = header
    for index in range(phnum):
        base = phoff + index * phentsize
        p_type, _flags, p_offset, p_vaddr = struct.unpack_from(order + "IIQQ", data, base)
        if p_type == 1 and (p_vaddr - p_offset) % PAGE_SIZE != 0:
            return False
    return True


def has_symbol_table(data: bytes) -> bool:
    """True when the file has a .symtab section (SHT_SYMTAB), i.e. strip would shrink it."""
    header = elf_header(data)
    if header is None:
        return False
    order, _phoff, _phentsize, _phnum, shoff, shentsize, shnum = header
    for index in range(shnum):
        base = shoff + index * shentsize
        if base + 8 > len(data):
            return False
        (sh_type,) = struct.unpack_from(order + "I", data, base + 4)
        if sh_type == 2:
            return True
    return False


def strip_bundle(bundle: Path) -> int:
    """Strip every ELF file that has a symbol table, keeping only results that still load."""
    strip = shutil.which("strip")
    if strip is None:
        print("strip is not available; libraries left as they are")
        return 0
    saved = 0
    with tempfile.TemporaryDirectory() as scratch:
        for path in elf_files(bundle):
            data = path.read_bytes()
            if not has_symbol_table(data):
                continue
            target = Path(scratch) / "stripped"
            done = subprocess.run([strip, "-o", str(target), str(path)], capture_output=True,
                                  check=False)
            if done.returncode != 0:
                continue
            stripped = target.read_bytes()
            if len(stripped) < len(data) and load_segments_aligned(stripped):
                mode = path.stat().st_mode
                path.write_bytes(stripped)
                path.chmod(mode)
                saved += len(data) - len(stripped)
    return saved


def link_duplicates(bundle: Path, smallest: int = 65536) -> int:
    """Replace byte-identical copies of a file with the same name by relative symbolic links.

    numpy's and scipy's wheels each bring the same Fortran runtime (libgfortran,
    libquadmath); PyInstaller copies it into both ``numpy.libs`` and ``scipy.libs``.
    The loader follows the link, so both still find it next to their OpenBLAS.
    """
    groups: dict[tuple[str, int], list[Path]] = {}
    for root, _dirs, files in os.walk(bundle):
        for name in files:
            path = Path(root) / name
            if not path.is_symlink() and path.stat().st_size >= smallest:
                groups.setdefault((name, path.stat().st_size), []).append(path)
    saved = 0
    for paths in groups.values():
        if len(paths) < 2:
            continue
        keep, *others = sorted(paths)
        content = keep.read_bytes()
        for other in others:
            if other.read_bytes() == content:
                other.unlink()
                other.symlink_to(os.path.relpath(keep, other.parent))
                saved += len(content)
    return saved


def needed_libraries(path: Path) -> list[str]:
    """DT_NEEDED names of an ELF file, read with readelf (empty if unavailable)."""
    readelf = shutil.which("readelf")
    if readelf is None:
        return []
    done = subprocess.run([readelf, "-d", str(path)], capture_output=True, text=True,
                          check=False)
    return [line.split("[", 1)[1].split("]", 1)[0]
            for line in done.stdout.splitlines() if "(NEEDED)" in line]


def missing_qt_libraries(bundle: Path) -> list[str]:
    """Qt libraries (libQt6*) that some bundled file needs but the bundle lacks."""
    present = {path.name for path in bundle.rglob("libQt6*")}
    missing: set[str] = set()
    for path in elf_files(bundle):
        for name in needed_libraries(path):
            if name.startswith("libQt6") and name not in present:
                missing.add(f"{name} (needed by {path.relative_to(bundle)})")
    return sorted(missing)


def unresolved_display_libraries(bundle: Path) -> list[str]:
    """Libraries the X11/Wayland display plugins need that neither the bundle nor this
    machine has, other than the ones every desktop provides (``SYSTEM_LIBRARIES``): the
    bundle would fail to open a window on a desktop lacking them too.  The build machine
    should have them installed, so that they get bundled."""
    ldd = shutil.which("ldd")
    internal = bundle / "_internal"
    if ldd is None or not internal.is_dir():
        return []
    env = {**os.environ, "LD_LIBRARY_PATH": str(internal)}
    warnings = []
    for plugin in sorted((internal / "PySide6" / "Qt" / "plugins" / "platforms").glob("*.so")):
        done = subprocess.run([ldd, str(plugin)], capture_output=True, text=True, env=env,
                              check=False)
        missing = sorted({name for name in (line.split("=>")[0].strip()
                                            for line in done.stdout.splitlines()
                                            if "not found" in line)
                          if not name.startswith(config.SYSTEM_LIBRARIES)})
        if missing:
            warnings.append(f"{plugin.name} needs {', '.join(missing)}, missing on this build "
                            "machine; install them and rebuild (see installer/README.md)")
    return warnings


def network_isolation() -> list[str]:
    """A command prefix that runs a program with no network, or [] where that is not possible."""
    unshare = shutil.which("unshare")
    if not sys.platform.startswith("linux") or unshare is None:
        return []
    for prefix in ([unshare, "--net"], [unshare, "--map-root-user", "--net"]):
        if subprocess.run([*prefix, "true"], capture_output=True, check=False).returncode == 0:
            return prefix
    return []


def run_self_test(bundle: Path) -> None:
    """Run ``<bundle>/tauscope self-test`` headless (and offline where possible)."""
    program = executable(bundle)
    env = {**os.environ, "QT_QPA_PLATFORM": "offscreen"}
    prefix = network_isolation()
    where = "with no network (new network namespace)" if prefix else "network isolation unavailable"
    print(f"running the bundle's self-test, {where}: {program} self-test", flush=True)
    with tempfile.TemporaryDirectory() as home:
        # A fresh home and working folder: the bundle must not depend on the build tree.
        env["HOME"] = home
        done = subprocess.run([*prefix, str(program), "self-test"], cwd=home, env=env, check=False)
    if done.returncode != 0:
        raise BuildError(f"the bundle's self-test failed (exit code {done.returncode})")


def run_snapshot(bundle: Path) -> None:
    """Open the bundle's window offscreen on the demo workbook and save a picture: proves
    that the Qt plugins, pyqtgraph and the window's code all made it into the bundle."""
    program = executable(bundle)
    with tempfile.TemporaryDirectory() as home:
        picture = Path(home) / "snapshot.png"
        env = {**os.environ, "QT_QPA_PLATFORM": "offscreen", "HOME": home}
        print(f"running the bundle's window offscreen: {program} snapshot --out {picture}",
              flush=True)
        done = subprocess.run([*network_isolation(), str(program), "snapshot", "--out",
                               str(picture)], cwd=home, env=env, capture_output=True, text=True,
                              check=False)
        if done.returncode != 0 or not picture.is_file():
            raise BuildError(f"the bundle's window did not open (exit code {done.returncode}): "
                             + (done.stderr.strip().splitlines() or ["no message"])[-1])
        print(f"window picture saved ({picture.stat().st_size / 1e3:.0f} kB)")


def make_linux_archive(bundle: Path, version: str, out_dir: Path) -> Path:
    """Write ``tauscope-<version>-<platform>.tar.gz``: the bundle, desktop entry, icons,
    file-type definition and the install/uninstall scripts, under ``tauscope-<version>/``."""
    top = f"{config.APP_NAME}-{version}"
    archive = out_dir / f"{top}-{config.platform_tag()}.tar.gz"
    out_dir.mkdir(parents=True, exist_ok=True)
    extras = [
        (LINUX_FILES / "install.sh", "install.sh"),
        (LINUX_FILES / "uninstall.sh", "uninstall.sh"),
        (LINUX_FILES / "tauscope.desktop", "tauscope.desktop"),
        (LINUX_FILES / "tauscope-mime.xml", "tauscope-mime.xml"),
        (LINUX_FILES / "README.txt", "README.txt"),
        (ICONS / "tauscope.svg", "icons/tauscope.svg"),
        *[(png, f"icons/{png.name}") for png in sorted(ICONS.glob("tauscope-*.png"))],
    ]
    for source, _name in extras:
        if not source.is_file():
            raise BuildError(f"{source} is missing")

    def normalise(info: tarfile.TarInfo) -> tarfile.TarInfo:
        info.uid = info.gid = 0
        info.uname = info.gname = "root"
        if info.isfile() or info.isdir():
            executable_bit = info.isdir() or info.mode & 0o100
            info.mode = 0o755 if executable_bit else 0o644
        return info

    partial = archive.with_name(archive.name + ".partial")
    with tarfile.open(partial, "w:gz", compresslevel=6) as tar:
        tar.add(bundle, arcname=f"{top}/{config.APP_NAME}", filter=normalise)
        for source, name in extras:
            tar.add(source, arcname=f"{top}/{name}", filter=normalise)
    partial.replace(archive)
    return archive


if __name__ == "__main__":
    sys.exit(main())
