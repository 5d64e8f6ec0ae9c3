"""What the window hands to the report writers: the run record of the findings on
screen, and each series' chart as plain data (a chart plan).

The charts are drawn by :mod:`tauscope.ui.report_charts`.  The writers themselves are
``tauscope.report`` 's (``export``): the window and ``tauscope batch --out`` write through
the same code.
"""

from __future__ import annotations

from collections.abc import Callable, Iterable, Mapping
from typing import TYPE_CHECKING

from tauscope.engine import SeriesResult, Settings
from tauscope.report import Finding, RunRecord, SourceFile

if TYPE_CHECKING:
    from tauscope.data import SeriesData, Workbook

EXPORT_FILTERS = (
    ("Excel workbook", ".xlsx"),
    ("Web page (one file, charts included)", ".html"),
    ("PDF document", ".pdf"),
    ("LaTeX table", ".tex"),
    ("CSV, one test per row", ".csv"),
    ("JSON", ".json"),
)


def export_filter() -> str:
    """The save dialog's list of formats, e.g. "Excel workbook (*.xlsx);;…"."""
    return ";;".join(f"{label} (*{suffix})" for label, suffix in EXPORT_FILTERS)


def suffix_for_filter(chosen: str) -> str:
    for label, suffix in EXPORT_FILTERS:
        if chosen.startswith(label):
            return suffix
    return ".xlsx"


def build_run(results: Mapping[str, SeriesResult], series_for_key: Callable[[str], SeriesData | None],
              workbooks: Iterable[Workbook], settings: Settings) -> RunRecord:
    """The findings on screen (in row order) as the record every writer consumes.

    A result whose series is no longer open is still written, without its source.
    ``settings``: the window's current settings, the ones the record states.  A finding
    made with other settings (marked "settings changed" on screen) stays in the record;
    ``tauscope.report.export`` leaves it out of every report with a visible note
    (``RunRecord.current``), so its numbers are never passed off as this run's.
    """
    findings = []
    for key, result in results.items():
        series = series_for_key(key)
        findings.append(Finding.from_series(result, series) if series is not None
                        else Finding(result=result, key=key))
    used = {f.file for f in findings if f.file}
    sources = tuple(SourceFile(str(b.path), b.sha256) for b in workbooks
                    if str(b.path) in used or b.path.name in used or not used)
    return RunRecord(settings, sources, tuple(findings))
