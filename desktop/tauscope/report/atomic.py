"""Write a file so that a crash never leaves it half-written: temporary file, then rename.

The temporary file is created next to the target (same file system, so the
rename is atomic) and removed again if anything fails, leaving the previous
version of the target untouched.  A replaced file keeps its permissions; a new
one is readable by others like an ordinary saved file (0644), not private as a
temporary file would be.
"""

from __future__ import annotations

import os
import stat
import tempfile
from pathlib import Path

NEW_FILE_MODE = 0o644


def write_bytes_atomic(path: Path, data: bytes) -> None:
    path = Path(path)
    try:
        mode = stat.S_IMODE(path.stat().st_mode)
    except OSError:
        mode = NEW_FILE_MODE
    fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".part", dir=path.parent)
    try:
        with os.fdopen(fd, "wb") as handle:
            handle.write(data)
            handle.flush()
            os.fsync(handle.fileno())
        os.chmod(tmp, mode)
        os.replace(tmp, path)
    except BaseException:
        Path(tmp).unlink(missing_ok=True)
        raise


def write_text_atomic(path: Path, text: str) -> None:
    write_bytes_atomic(path, text.encode("utf-8"))
