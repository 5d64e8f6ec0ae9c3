"""Writing findings out: JSON, CSV, Excel, LaTeX and HTML; study files.

``export(path, run, charts)`` is the one entry the window and ``tauscope
batch --out`` share; the format follows the suffix (``WRITERS``).  Writers
that need Qt live in ``tauscope.ui`` and add themselves with
:func:`register_writer` when imported (``tauscope.ui.pdf_report`` adds ``.pdf``).
"""

from __future__ import annotations

import importlib
from collections.abc import Callable
from pathlib import Path

from tauscope.engine.collector import collector_paused
from tauscope.report.json_export import EncodedSeries, run_to_json, write_json
from tauscope.report.ownership import is_own_report, same_file
from tauscope.report.run import CHART_FORMATS, Charts, Finding, LeftOut, RunRecord, SourceFile

Writer = Callable[[Path, RunRecord, Charts | None], None]


def _lazy(module: str, name: str) -> Writer:
    """A writer whose module (openpyxl, Qt, ...) is imported only when a file is written,
    so opening the window does not pay for every format."""

    def write(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
        writer: Writer = getattr(importlib.import_module(f"tauscope.report.{module}"), name)
        writer(path, run, charts)

    write.__name__ = name
    return write


def _json(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_json(path, run)


WRITERS: dict[str, Writer] = {
    ".json": _json,
    ".csv": _lazy("csv_export", "write_csv"),
    ".xlsx": _lazy("xlsx_export", "write_xlsx"),
    ".tex": _lazy("latex_export", "write_latex"),
    ".html": _lazy("html_export", "write_html"),
}


def register_writer(suffix: str, writer: Writer) -> None:
    """Add (or replace) the writer for ``suffix`` (e.g. ``".pdf"``), so that
    :func:`export` and ``tauscope batch --out`` accept it."""
    if not suffix.startswith(".") or suffix != suffix.lower():
        raise ValueError(f"a suffix is lower case and starts with a dot, not {suffix!r}")
    WRITERS[suffix] = writer


class ExportError(Exception):
    """A findings file could not be written; the message says which and why."""


def export(path: Path | str, run: RunRecord, charts: Charts | None = None, *,
           encoded: EncodedSeries | None = None) -> RunRecord:
    """Write ``run`` to ``path`` in the format its suffix names; return the record written.

    Findings made with other settings than ``run.settings`` are never written as current:
    they move to the record's ``left_out`` (:meth:`RunRecord.current`), which every report
    lists with a visible note.  ``charts``: optional chart plans per series (keyed by
    ``Finding.key`` or series name), used by .xlsx, .html and .pdf.  Raises
    :class:`ExportError` with one sentence for an unknown suffix, a file that cannot be
    written, or a target that is one of the run's input files (never written over; see
    :mod:`.ownership`).  ``encoded``: a .json file's "series" entries encoded ahead, used when
    they are those of the findings written (:class:`~.json_export.EncodedSeries`).
    """
    target = Path(path)
    writer = WRITERS.get(target.suffix.lower())
    if writer is None:
        known = ", ".join(sorted(WRITERS))
        raise ExportError(f"{target.name}: unknown output format '{target.suffix}' (known: {known})")
    for source in run.sources:
        if same_file(target, source.path):
            raise ExportError(f"{target}: not written: it is the input workbook {source.name}, "
                              "which Tauscope never writes over; choose another name")
    if not target.parent.is_dir():
        raise ExportError(f"{target}: could not be written (the folder {target.parent} does not "
                          "exist)")
    record = run.current()
    try:
        with collector_paused():
            if encoded is not None and target.suffix.lower() == ".json":
                write_json(target, record, encoded)
            else:
                writer(target, record, charts)
    except OSError as exc:
        raise ExportError(f"{target}: could not be written ({exc.strerror or exc})") from exc
    return record


__all__ = [
    "CHART_FORMATS",
    "WRITERS",
    "Charts",
    "EncodedSeries",
    "ExportError",
    "Finding",
    "LeftOut",
    "RunRecord",
    "SourceFile",
    "export",
    "is_own_report",
    "register_writer",
    "run_to_json",
    "write_json",
]
