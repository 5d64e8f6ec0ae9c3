"""Re-open a study's series from its workbooks and analyse them again.

Uses only what ``tauscope.data`` offers (``read_workbook``, ``make_transform``,
``SeriesData.longest_stretch`` / ``interpolated``), so the numbers come out of
the same reading and the same engine as the first time.
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING

from tauscope.engine import analyse_series
from tauscope.report.run import Finding, RunRecord, SourceFile
from tauscope.report.study import Study, StudySeries, resolve_workbook

if TYPE_CHECKING:
    from tauscope.data import SeriesData, Workbook


@dataclass(frozen=True)
class Reopened:
    """The series found again (entry and data, in study order) and one sentence per problem."""

    series: tuple[tuple[StudySeries, SeriesData], ...]
    workbooks: tuple[Workbook, ...]
    problems: tuple[str, ...]


def reopen_series(study: Study, study_path: Path | str | None = None) -> Reopened:
    """Read every workbook of the study once and rebuild each selected series."""
    from tauscope.data import DataError, make_transform, read_workbook

    problems: list[str] = []
    books: dict[str, Workbook] = {}
    for entry in study.workbooks:
        found = resolve_workbook(entry, study_path)
        if found is None:
            problems.append(f"{Path(entry.path).name} was not found at {entry.path}.")
            continue
        try:
            books[entry.path] = read_workbook(found)
        except DataError as exc:
            problems.append(str(exc))
    rebuilt: list[tuple[StudySeries, SeriesData]] = []
    for item in study.series:
        book = books.get(item.file)
        if book is None:
            continue
        base = next((s for s in book.series() if s.source.sheet == item.sheet
                     and s.source.column == item.column and s.transform is None), None)
        if base is None:
            problems.append(f"{Path(item.file).name}: sheet “{item.sheet}” has no column "
                            f"“{item.column}” any more.")
            continue
        try:
            series = base
            for key in item.transforms:
                series = make_transform(series, key)
        except DataError as exc:
            problems.append(str(exc))
            continue
        if item.gaps == "longest":
            series = series.longest_stretch()
        elif item.gaps == "interpolate":
            series = series.interpolated()
        rebuilt.append((item, series))
    return Reopened(tuple(rebuilt), tuple(books.values()), tuple(problems))


def rerun(study: Study, study_path: Path | str | None = None) -> tuple[RunRecord, tuple[str, ...]]:
    """Analyse the study's series again with its settings; returns the run and any problems."""
    from tauscope.data import DataError

    reopened = reopen_series(study, study_path)
    problems = list(reopened.problems)
    findings = []
    for _item, series in reopened.series:
        try:
            values = series.testable_values()
        except DataError as exc:
            problems.append(str(exc))
            continue
        result = analyse_series(values, settings=study.settings, name=series.name)
        findings.append(Finding.from_series(result, series))
    sources = tuple(SourceFile(str(b.path), b.sha256) for b in reopened.workbooks)
    return RunRecord(study.settings, sources, tuple(findings)), tuple(problems)
