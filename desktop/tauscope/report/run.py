"""What one analysis run produced, in the form every writer consumes."""

from __future__ import annotations

import datetime as dt
from collections.abc import Mapping
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Any, Protocol

from tauscope import __version__
from tauscope.engine import SeriesResult, Settings
from tauscope.report.chart_plan import ChartPlan

Charts = Mapping[str, ChartPlan]
"""Each series' chart as plain data (:class:`~tauscope.report.chart_plan.ChartPlan`), keyed by
``Finding.key`` or by series name; each format draws it in its own way."""

CHART_FORMATS = frozenset({".xlsx", ".html", ".pdf"})
"""The formats that hold a chart per series (the others are tables and text)."""


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


SETTING_WORDS = {
    "lag_rule": "lag rule",
    "lags": "lag order",
    "max_lags": "maximum lag order",
    "alpha": "significance level",
    "max_difference": "highest difference",
    "confirm": "cross-checks",
    "critical_values": "source of critical values",
    "break_model": "break model",
    "power": "power check",
    "strategy": "how the verdict is decided",
}
"""Each setting in the words a reader knows (the note on findings left out of a report)."""

TEST_ORDER = ("adf", "phi1", "phi2", "phi3", "kpss", "pp", "dfgls", "za")
"""The order in which reports name the tests that ran."""


def changed_settings(made_with: Mapping[str, Any], settings: Settings) -> tuple[str, ...]:
    """The settings (as ``Settings`` field names) whose value in ``made_with`` (a result's own
    ``settings`` record) differs from ``settings``; a field the record lacks is not counted."""
    return _changed(made_with, settings.to_dict())


def _changed(made_with: Mapping[str, Any], wanted: Mapping[str, Any]) -> tuple[str, ...]:
    return tuple(k for k, v in wanted.items() if k in made_with and made_with[k] != v)


@dataclass(frozen=True)
class LeftOut:
    """A finding kept out of a report because its numbers were made with other settings
    than the run's; ``changed`` names those settings (``Settings`` field names)."""

    name: str
    key: str | None
    changed: tuple[str, ...]

    @property
    def reason(self) -> str:
        words = [SETTING_WORDS.get(k, k.replace("_", " ")) for k in self.changed]
        listed = words[0] if len(words) == 1 else ", ".join(words[:-1]) + " and " + words[-1]
        return (f"{self.name}: analysed with a different {listed}; run the analysis again to "
                "include it")


@dataclass(frozen=True)
class RunRecord:
    """The record a report is written from: the settings the findings' numbers were made with,
    the source files, the findings, and the findings left out because they were made with
    other settings (``left_out``; see :meth:`current`).

    What the methods text states is read from here: ``settings`` (lag rule, level, ...),
    :attr:`critical_value_source` and :attr:`tests_run`.
    """

    settings: Settings
    sources: tuple[SourceFile, ...]
    findings: tuple[Finding, ...]
    version: str = __version__
    created: str = field(
        default_factory=lambda: dt.datetime.now(dt.UTC).replace(microsecond=0).isoformat()
    )
    left_out: tuple[LeftOut, ...] = ()

    def select(self, keys_or_names: list[str] | tuple[str, ...]) -> RunRecord:
        """The same run restricted to the findings whose key (or name) is listed, in run order."""
        wanted = set(keys_or_names)
        chosen = tuple(f for f in self.findings if f.key in wanted or f.name in wanted)
        left = tuple(f for f in self.left_out if f.key in wanted or f.name in wanted)
        return replace(self, findings=chosen, left_out=left)

    def current(self) -> RunRecord:
        """The same run with every finding whose own settings record differs from ``settings``
        moved to ``left_out``: a report never passes off numbers made with other settings as
        this run's.  A finding without a settings record is kept."""
        kept: list[Finding] = []
        left = list(self.left_out)
        wanted = self.settings.to_dict()
        for finding in self.findings:
            changed = _changed(finding.result.settings or {}, wanted)
            if changed:
                left.append(LeftOut(finding.name, finding.key, changed))
            else:
                kept.append(finding)
        if len(kept) == len(self.findings):
            return self
        return replace(self, findings=tuple(kept), left_out=tuple(left))

    @property
    def simulated_critical_values(self) -> bool:
        """True when τ and Φ were judged against nulls simulated at each regression's size."""
        return self.settings.critical_values == "exact"

    @property
    def critical_value_source(self) -> str:
        """"simulated" or "tables" (MacKinnon's response surfaces and Dickey & Fuller's tables)."""
        return "simulated" if self.simulated_critical_values else "tables"

    @property
    def tests_run(self) -> tuple[str, ...]:
        """The tests computed for at least one finding (engine codes, in :data:`TEST_ORDER`)."""
        found = {t.test for f in self.findings for t in f.result.tests}
        return tuple(t for t in TEST_ORDER if t in found) + tuple(sorted(found - set(TEST_ORDER)))


def chart_for(finding: Finding, charts: Charts | None) -> ChartPlan | None:
    """The chart the caller supplied for this finding: looked up by key, then by series name."""
    if not charts:
        return None
    if finding.key is not None and finding.key in charts:
        return charts[finding.key]
    return charts.get(finding.name)
