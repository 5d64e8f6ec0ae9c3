"""SHA-256 fingerprint of a file's bytes, read in chunks (the file is only read)."""

from __future__ import annotations

import hashlib
from pathlib import Path

CHUNK = 1 << 20


def file_sha256(path: Path | str) -> str:
    digest = hashlib.sha256()
    with open(path, "rb") as handle:
        while chunk := handle.read(CHUNK):
            digest.update(chunk)
    return digest.hexdigest()
