"""JSON findings (DESIGN.md §3): {"tauscope", "settings", "source", "series", ...}.

Each entry of "series" is exactly ``SeriesResult.to_dict()``; where each series
came from is kept alongside in "origins" (same order).  "critical_values" ("tables" or
"simulated") and "tests_run" describe the run; "left_out" lists the findings kept out
because they were made with other settings.

The file is compact (no indentation, no spaces after separators): that lets ``json`` use its
C encoder, which for 500 series is many times faster than the indented pure-Python one and
makes the file about a third the size.  Any JSON viewer lays it out again for reading.

Compact JSON is context-free: an entry of a list is encoded the same alone as inside the
list.  So the file is written as its head, the "series" entries and its tail, and the
entries may come already encoded (:class:`EncodedSeries`: ``tauscope batch`` encodes them
chunk by chunk while the analysis goes on); the bytes are the same either way.
"""

from __future__ import annotations

import json
import math
from collections.abc import Iterator, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.run import Finding, RunRecord

COMPACT = (",", ":")
"""``json.dumps`` separators without spaces."""


def json_clean(value: Any) -> Any:
    """``value`` with non-finite floats as None and tuples as lists: what JSON gives back."""
    if isinstance(value, float):
        return value if math.isfinite(value) else None
    if isinstance(value, dict):
        return {str(k): json_clean(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [json_clean(v) for v in value]
    return value


def _head(run: RunRecord) -> dict[str, Any]:
    """The file's keys before "series", in order."""
    sources = [{"file": s.path, "sha256": s.sha256} for s in run.sources]
    return {
        "tauscope": run.version,
        "created": run.created,
        "settings": run.settings.to_dict(),
        "source": sources[0] if len(sources) == 1 else None,
        "sources": sources,
    }


def _tail(run: RunRecord) -> dict[str, Any]:
    """The file's keys after "series", in order."""
    return {
        "origins": [f.origin() for f in run.findings],
        "critical_values": run.critical_value_source,
        "tests_run": list(run.tests_run),
        "left_out": [{"name": f.name, "key": f.key, "changed": list(f.changed), "reason": f.reason}
                     for f in run.left_out],
    }


def run_to_json(run: RunRecord) -> dict[str, Any]:
    return {**_head(run), "series": [f.result.to_dict() for f in run.findings], **_tail(run)}


def _dumps(value: Any) -> str:
    return json.dumps(value, ensure_ascii=False, separators=COMPACT)


def encode_series(findings: Sequence[Finding]) -> bytes:
    """The "series" entries of ``findings`` (each ``to_dict()``), compact JSON joined by ","
    (no brackets), as UTF-8."""
    return ",".join([_dumps(f.result.to_dict()) for f in findings]).encode("utf-8")


@dataclass(frozen=True)
class EncodedSeries:
    """"series" entries encoded ahead (:func:`encode_series`), a run of findings per part."""

    findings: tuple[Finding, ...]
    parts: tuple[bytes, ...]

    def fits(self, findings: Sequence[Finding]) -> bool:
        """True when these are the entries of exactly ``findings`` (the same objects, in order)."""
        return len(self.findings) == len(findings) and all(
            a is b for a, b in zip(self.findings, findings, strict=True))


def json_bytes(run: RunRecord, encoded: EncodedSeries | None = None) -> Iterator[bytes]:
    """The file's bytes in pieces: ``_dumps(run_to_json(run))`` and a line end, the "series"
    entries taken from ``encoded`` when it fits ``run.findings``."""
    if encoded is not None and encoded.fits(run.findings):
        parts: Sequence[bytes] = encoded.parts
    else:
        parts = (encode_series(run.findings),)
    head, tail = _dumps(_head(run)), _dumps(_tail(run))
    yield head[:-1].encode("utf-8") + b',"series":['  # head[:-1]: without its closing "}"
    first = True
    for part in parts:
        if part:
            if not first:
                yield b","
            yield part
            first = False
    yield b"]," + tail[1:].encode("utf-8") + b"\n"  # tail[1:]: without its opening "{"


def write_json(path: Path, run: RunRecord, encoded: EncodedSeries | None = None) -> None:
    write_bytes_atomic(path, json_bytes(run, encoded))
