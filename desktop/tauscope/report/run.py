"""What one analysis run produced, in the form every writer consumes."""

from __future__ import annotations

import datetime as dt
from collections.abc import Mapping
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Protocol

from tauscope import __version__
from tauscope.engine import SeriesResult, Settings

Charts = Mapping[str, bytes]
"""PNG bytes per series, keyed by ``Finding.key`` or by series name."""


@dataclass(frozen=True)
class SourceFile:
    path: str
    sha256: str

    @property
    def name(self) -> str:
        return Path(self.path).name


class SourceLike(Protocol):
    @property
    def file(self) -> str: ...
    @property
    def sheet(self) -> str: ...
    @property
    def column(self) -> str: ...


class SeriesLike(Protocol):
    """The parts of ``tauscope.data.SeriesData`` a finding records (data-api.md)."""

    @property
    def source(self) -> SourceLike: ...
    @property
    def frequency(self) -> str | None: ...
    @property
    def transform(self) -> str | None: ...
    @property
    def key(self) -> str: ...


@dataclass(frozen=True)
class Finding:
    """One analysed series with where it came from.

    ``key`` is the series' stable identity (``SeriesData.key``), used by study
    files and by the chart mapping; it may be None for arrays without a source.
    """

    result: SeriesResult
    file: str | None = None
    sheet: str | None = None
    column: str | None = None
    frequency: str | None = None
    transform: str | None = None
    key: str | None = None

    @classmethod
    def from_series(cls, result: SeriesResult, series: SeriesLike) -> Finding:
        """A finding for ``result`` computed on a ``tauscope.data.SeriesData``."""
        return cls(
            result=result,
            file=series.source.file,
            sheet=series.source.sheet,
            column=series.source.column,
            frequency=series.frequency,
            transform=series.transform,
            key=series.key,
        )

    @property
    def name(self) -> str:
        return self.result.name

    @property
    def file_name(self) -> str:
        return Path(self.file).name if self.file else ""

    def origin(self) -> dict[str, Any]:
        return {
            "name": self.result.name,
            "file": self.file,
            "sheet": self.sheet,
            "column": self.column,
            "frequency": self.frequency,
            "transform": self.transform,
            "key": self.key,
        }


@dataclass(frozen=True)
class RunRecord:
    settings: Settings
    sources: tuple[SourceFile, ...]
    findings: tuple[Finding, ...]
    version: str = __version__
    created: str = field(
        default_factory=lambda: dt.datetime.now(dt.UTC).replace(microsecond=0).isoformat()
    )

    def select(self, keys_or_names: list[str] | tuple[str, ...]) -> RunRecord:
        """The same run restricted to the findings whose key (or name) is listed, in run order."""
        wanted = set(keys_or_names)
        chosen = tuple(f for f in self.findings if f.key in wanted or f.name in wanted)
        return RunRecord(self.settings, self.sources, chosen, self.version, self.created)


def chart_for(finding: Finding, charts: Charts | None) -> bytes | None:
    """The PNG the caller supplied for this finding: looked up by key, then by series name."""
    if not charts:
        return None
    if finding.key is not None and finding.key in charts:
        return charts[finding.key]
    return charts.get(finding.name)
