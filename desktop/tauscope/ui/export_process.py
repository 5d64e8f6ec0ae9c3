"""The findings written with their charts (.xlsx, .html, .pdf) in a process of their own.

Written in a helper thread of the window's process, these writers held the window's
interpreter lock for one long call at a time (the PDF's closing call embeds the fonts,
50–76 ms; a page of a thousand charts is joined and encoded in one piece), and on a busy
machine the window stood still for as long as the thread holding the lock waited for a core.
A child process has an interpreter of its own.

:func:`shared_exporter` is one child for the session, started at the first such export and
kept (later exports skip its start): an :class:`tauscope.ui.engine_process.EngineProcess`
that runs :func:`iter_export` instead of the engine, with the same messages, stop flag and
handling of a child that fails or dies.  :func:`export_elsewhere` sends the request as one
message for the record without its findings, then one per finding with the values its chart
is drawn from, so the sending thread pickles one finding at a time and the window's thread is
never kept waiting for a long one.  The child rebuilds the record, draws the charts
(:func:`tauscope.ui.report_charts.draw_charts`, plain data) and writes the file through
``tauscope.report.export``: the same files as batch's.  It needs no Qt, unless a PDF goes
through Qt's route (``tauscope.ui.pdf_report``), which then starts Qt without a screen
(``tauscope.ui.headless``).  It answers with :class:`Written`;
an ``ExportError`` there is raised again here.
"""

from __future__ import annotations

from collections.abc import Iterable, Iterator, Mapping
from dataclasses import dataclass, replace
from pathlib import Path
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    import pandas as pd

    from tauscope.report import Finding, RunRecord
    from tauscope.ui.engine_process import EngineProcess

EXPORTER = "tauscope.ui.export_process:iter_export"  # what the child runs


@dataclass(frozen=True)
class Written:
    """What an export wrote: findings written, findings left out (made with other settings),
    and the sentence on charts that could not be drawn ("" when none)."""

    findings: int
    left_out: int
    problems: str = ""


@dataclass(frozen=True)
class _Head:
    path: str
    record: RunRecord  # its findings follow one message each
    with_charts: bool


@dataclass(frozen=True)
class _Values:
    """The part of a series a chart is drawn from (``SeriesData.values``)."""

    values: pd.Series


def request(path: Path, run: RunRecord, values: Mapping[str, Any],
            with_charts: bool) -> list[tuple[str, Any]]:
    """The messages of one export: the record without its findings, then each finding with
    the values of its series (``values`` by key; None when the series is not open)."""
    messages: list[tuple[str, Any]] = [("head", _Head(str(path), replace(run, findings=()),
                                                     with_charts))]
    messages += [("finding", (f, values.get(f.key) if f.key is not None else None))
                 for f in run.findings]
    return messages


def iter_export(messages: Iterable[tuple[str, Any]], _settings: Any = None,
                _should_stop: Any = None) -> Iterator[Written]:
    """The child's side: one export per request (see the module's docstring)."""
    import tauscope.ui.pdf_report  # noqa: F401  (registers the ".pdf" writer)
    from tauscope.report import export
    from tauscope.ui.report_charts import draw_charts, problems_text

    head: _Head | None = None
    findings: list[Finding] = []
    series: dict[str, _Values] = {}
    for kind, body in messages:
        if kind == "head":
            head = body
            continue
        finding, values = body
        findings.append(finding)
        if finding.key is not None and values is not None:
            series[finding.key] = _Values(values)
    if head is None:
        raise ValueError("an export request without its record")
    run = replace(head.record, findings=tuple(findings))
    charts, problems = None, ""
    if head.with_charts:  # the same charts as tauscope batch's
        drawn = draw_charts(run, series.get)
        charts, problems = drawn.charts, problems_text(drawn)
    written = export(Path(head.path), run, charts)
    yield Written(len(written.findings), len(written.left_out), problems)


def shared_exporter() -> EngineProcess:
    """The session's export process (one per program, started when first used)."""
    from tauscope.ui.engine_process import shared_process

    return shared_process(EXPORTER)


def export_elsewhere(path: Path, run: RunRecord, values: Mapping[str, Any],
                     with_charts: bool) -> Written | None:
    """Write ``run`` to ``path`` in the export process (from a helper thread: it waits for the
    answer); None when no process can be started here or it ended before answering, for the
    caller to write the file itself (the next export starts another).  The child's
    ``ExportError`` is raised again here."""
    from tauscope.ui.engine_process import EngineProcessLost

    exporter = shared_exporter()
    try:
        exporter.start()
    except Exception:  # no process can be started on this system
        return None
    try:
        answers: list[Any] = list(exporter.iter_analyse(
            request(path, run, values, with_charts), run.settings))
    except EngineProcessLost:
        return None
    if len(answers) != 1 or not isinstance(answers[0], Written):
        raise RuntimeError("the export process gave no answer")
    return answers[0]
