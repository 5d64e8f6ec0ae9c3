"""Write a file so that a crash never leaves it half-written: temporary file, then rename.

The temporary file is created next to the target (same file system, so the
rename is atomic) and removed again if anything fails, leaving the previous
version of the target untouched.  A replaced file keeps its permissions; a new
one is readable by others like an ordinary saved file (0644), not private as a
temporary file would be.

A write cut off by a power failure or a killed process cannot remove its temporary
file.  Such files are named ``.TARGET.tauscope-PID-RANDOM.part``; the next write into
the same folder (and the window at start-up, in its own data folder) removes those
whose process is gone or that are older than ``STALE_AFTER`` seconds
(:func:`remove_stale_temporaries`).  Files not named this way are never touched.
"""

from __future__ import annotations

import os
import re
import stat
import tempfile
import time
from collections.abc import Iterable
from pathlib import Path

NEW_FILE_MODE = 0o644
STALE_AFTER = 24 * 3600
_TEMPORARY = re.compile(r"^\..+\.tauscope-(\d+)-[A-Za-z0-9_]+\.part$")


def _process_alive(pid: int) -> bool:
    if pid == os.getpid():
        return True
    if os.name != "posix":
        return True  # no cheap check: rely on the age alone
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except OSError:  # exists but belongs to someone else
        return True
    return True


def remove_stale_temporaries(folder: Path | str, now: float | None = None) -> list[Path]:
    """Remove our temporary files left in ``folder`` by interrupted writes; the removed."""
    removed: list[Path] = []
    moment = time.time() if now is None else now
    try:
        entries = list(os.scandir(folder))
    except OSError:
        return removed
    for entry in entries:
        match = _TEMPORARY.match(entry.name)
        if match is None:
            continue
        try:
            if not entry.is_file(follow_symlinks=False):
                continue
            old = moment - entry.stat(follow_symlinks=False).st_mtime > STALE_AFTER
            if old or not _process_alive(int(match.group(1))):
                os.unlink(entry.path)
                removed.append(Path(entry.path))
        except OSError:
            continue
    return removed


def write_bytes_atomic(path: Path, data: bytes | Iterable[bytes]) -> None:
    """``data`` (or its pieces, written one after the other) as ``path``, whole or not at all."""
    path = Path(path)
    remove_stale_temporaries(path.parent)
    try:
        mode = stat.S_IMODE(path.stat().st_mode)
    except OSError:
        mode = NEW_FILE_MODE
    fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.tauscope-{os.getpid()}-", suffix=".part",
                               dir=path.parent)
    try:
        with os.fdopen(fd, "wb") as handle:
            if isinstance(data, bytes):
                handle.write(data)
            else:
                for piece in data:
                    handle.write(piece)
            handle.flush()
            os.fsync(handle.fileno())
        os.chmod(tmp, mode)
        os.replace(tmp, path)
    except BaseException:
        Path(tmp).unlink(missing_ok=True)
        raise


def write_text_atomic(path: Path, text: str | Iterable[str]) -> None:
    """``text`` (or its pieces, each encoded as it is written) as UTF-8."""
    if isinstance(text, str):
        write_bytes_atomic(path, text.encode("utf-8"))
    else:
        write_bytes_atomic(path, (piece.encode("utf-8") for piece in text))
