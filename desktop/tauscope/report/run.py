"""What one analysis run produced, in the form every writer consumes."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, field
from typing import Any

from tauscope import __version__
from tauscope.engine import SeriesResult, Settings


@dataclass(frozen=True)
class SourceFile:
    path: str
    sha256: str


@dataclass(frozen=True)
class Finding:
    """One analysed series with where it came from."""

    result: SeriesResult
    file: str | None = None
    sheet: str | None = None
    column: str | None = None
    frequency: str | None = None
    transform: str | None = None

    def origin(self) -> dict[str, Any]:
        return {
            "name": self.result.name,
            "file": self.file,
            "sheet": self.sheet,
            "column": self.column,
            "frequency": self.frequency,
            "transform": self.transform,
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
