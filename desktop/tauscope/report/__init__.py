"""Writing findings out: JSON now; xlsx, csv, tex, html with the reports issue."""

from __future__ import annotations

from pathlib import Path

from tauscope.report.json_export import run_to_json, write_json
from tauscope.report.run import Finding, RunRecord, SourceFile

WRITERS = {".json": write_json}


class ExportError(Exception):
    """A findings file could not be written; the message says which and why."""


def export(path: Path | str, run: RunRecord) -> None:
    """Write ``run`` to ``path`` in the format its suffix names."""
    target = Path(path)
    writer = WRITERS.get(target.suffix.lower())
    if writer is None:
        known = ", ".join(sorted(WRITERS))
        raise ExportError(f"{target.name}: unknown output format '{target.suffix}' (known: {known})")
    try:
        writer(target, run)
    except OSError as exc:
        raise ExportError(f"{target}: could not be written ({exc.strerror or exc})") from exc


__all__ = ["WRITERS", "ExportError", "Finding", "RunRecord", "SourceFile", "export", "run_to_json", "write_json"]
