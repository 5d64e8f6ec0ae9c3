"""Between the window and a study file: what the window holds, as a ``Study``, and the
checks made before a study is opened again.

The file format, saving, loading, autosave and the re-reading of workbooks are
``tauscope.report.study`` and ``tauscope.report.rerun``; this module only
collects the window's state for them and words what they find.
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING

from tauscope.engine import SeriesResult, Settings
from tauscope.report.study import (
    Study,
    check_sources,
    finding_entry,
    resolve_workbook,
    series_entry,
    workbook_entry,
)

if TYPE_CHECKING:
    from tauscope.data import SeriesData, Workbook


ANALYSED_KEYS = "analysed_keys"  # extra entry of an autosave: the series to analyse again


def build_study(settings: Settings, workbooks: Iterable[Workbook], all_series: Iterable[SeriesData],
                results: Mapping[str, SeriesResult], gap_handling: Mapping[str, str],
                with_findings: bool = True) -> Study:
    """The window's state as a study: every open workbook, every analysed series and
    every series the user made (a transformed copy, gaps cut or filled), the settings
    and the findings in row order.

    ``with_findings=False`` (the autosave) leaves the findings out and lists the analysed
    series' keys instead: recovering re-runs them to the same numbers, and the file stays
    small enough to write without slowing the window.
    """
    books = list(workbooks)
    chosen = [s for s in all_series
              if s.key in results or s.transform is not None or s.key in gap_handling]
    sheets: dict[str, set[str]] = {}
    for s in chosen:
        sheets.setdefault(Path(s.source.file).name, set()).add(s.source.sheet)
    study_workbooks = tuple(
        workbook_entry(b.path, b.sha256, sorted(sheets.get(b.path.name, ()))) for b in books)
    by_name = {b.path.name: str(Path(b.path).resolve()) for b in books}
    entries = []
    for s in chosen:
        entry = series_entry(s, gap_handling.get(s.key, "none"))
        full = by_name.get(Path(entry.file).name)
        if full is not None and entry.file != full:
            entry = type(entry)(entry.key, entry.name, full, entry.sheet, entry.column,
                                entry.transforms, entry.gaps)
        entries.append(entry)
    if not with_findings:
        return Study(settings, study_workbooks, tuple(entries),
                     extra={ANALYSED_KEYS: list(results)})
    findings = tuple(finding_entry(result, key) for key, result in results.items())
    return Study(settings, study_workbooks, tuple(entries), findings)


def analysed_keys(study: Study) -> list[str]:
    """The series a study had analysed: from its findings, or an autosave's list."""
    keys = list(study.results_by_key())
    listed = study.extra.get(ANALYSED_KEYS)
    if isinstance(listed, list):
        keys += [str(k) for k in listed if str(k) not in keys]
    return keys


@dataclass(frozen=True)
class SourceCheck:
    """What was found for each workbook of a study before reopening it."""

    missing: tuple[str, ...]  # saved paths of workbooks not found anywhere
    changed: tuple[str, ...]  # saved paths whose bytes differ (SHA-256)
    moved: tuple[tuple[str, str], ...]  # (saved path, where it was found)

    def warnings(self) -> list[str]:
        lines = [f"{Path(p).name} has changed since the study was saved (its SHA-256 "
                 "fingerprint differs); the numbers may differ from the saved ones."
                 for p in self.changed]
        lines += [f"{Path(old).name} was not at {old}; it was found at {new}."
                  for old, new in self.moved]
        lines += [f"{Path(p).name} was not found (it was at {p}); its series are left out."
                  for p in self.missing]
        return lines


def check_study_sources(study: Study, study_path: Path | str | None) -> SourceCheck:
    status = dict(check_sources(study, study_path))
    moved = []
    for wb in study.workbooks:
        found = resolve_workbook(wb, study_path)
        if found is not None and found.resolve() != Path(wb.path).resolve():
            moved.append((wb.path, str(found)))
    return SourceCheck(
        missing=tuple(p for p, s in status.items() if s == "missing"),
        changed=tuple(p for p, s in status.items() if s == "changed"),
        moved=tuple(moved),
    )
