"""One self-contained HTML report: summary table, one section per series, methods.

Charts, when supplied, are embedded as SVG drawings in ``data:`` URIs
(:mod:`.chart_svg`), so the single file can be mailed or archived.  The same markup feeds the PDF writer (Qt's rich-text
engine), so it keeps to HTML 4 tables and simple CSS that both render.
"""

from __future__ import annotations

import html
from collections.abc import Callable
from pathlib import Path

from tauscope.report.atomic import write_text_atomic
from tauscope.report.chart_plan import ChartPlan
from tauscope.report.chart_svg import svg_data_uri
from tauscope.report.methods import left_out_note, methods_for
from tauscope.report.report_text import (
    CHART_WIDTH,
    ONE_LINE_EACH,
    PATH_WIDTHS,
    SUMMARY_WIDTHS,
    cell_text,
    merged_markers,
    meta_line,
    origin_line,
    sources_line,
    summary_note,
)
from tauscope.report.run import Charts, Finding, RunRecord, chart_for
from tauscope.report.tables import (
    Column,
    Table,
    Value,
    compact_table,
    path_table,
)
from tauscope.report.text_safety import html_text

ImageSource = Callable[[int, ChartPlan], str]
"""Gives the ``src`` of chart number ``i`` (0-based, in series order) from its plan."""

STYLE = """
body { font-family: 'Segoe UI', 'Helvetica Neue', Arial, sans-serif; font-size: 10.5pt;
       color: #1d2428; margin: 2em auto; max-width: 62em; line-height: 1.4; }
h1 { font-size: 18pt; color: #2f5d62; margin-bottom: 0.2em; }
h2 { font-size: 14pt; color: #2f5d62; border-bottom: 1px solid #9fb8ba; margin-top: 1.6em; }
h3 { font-size: 12pt; margin-bottom: 0.2em; margin-top: 1.4em; }
h4 { font-size: 10.5pt; margin-bottom: 0.2em; }
table { border-collapse: collapse; margin: 0.4em 0; font-size: 9.5pt; }
th { font-size: 9pt; background-color: #2f5d62; color: #ffffff; font-weight: bold; text-align: left;
     padding: 3px 8px; }
td { padding: 3px 8px; border-bottom: 1px solid #d5dfe0; vertical-align: top; }
td.num { text-align: right; }
p.meta { color: #55606a; margin: 0.1em 0; }
p.left-out { color: #8a3b12; }
p.note { color: #55606a; font-style: italic; font-size: 9pt; }
p.verdict { font-size: 11.5pt; font-weight: bold; color: #2f5d62; margin: 0.2em 0; }
span.reject { color: #8a3b12; }
ol.refs li { margin-bottom: 0.3em; }
"""


def data_uri(_index: int, plan: ChartPlan) -> str:
    return svg_data_uri(plan)


_ESCAPED: dict[str, str] = {}
"""Texts already made safe (a report repeats most of its cell texts: each is escaped once)."""


def _esc(text: object) -> str:
    """``text`` safe in HTML: control characters as U+FFFD (:func:`html_text`), then escaped."""
    key = str(text)
    found = _ESCAPED.get(key)
    if found is None:
        if len(_ESCAPED) > 50_000:
            _ESCAPED.clear()
        found = _ESCAPED[key] = html.escape(html_text(key), quote=True)
    return found


def _cell(column: Column, value: Value) -> str:
    numeric = column.kind in ("stat", "p", "int")
    attr = ' class="num" align="right"' if numeric else ""
    text = cell_text(value, column.kind)
    if column.ident in ONE_LINE_EACH:
        inner = "<br>".join(_esc(item).replace(" ", "&nbsp;") for item in text.split("; "))
    else:
        inner = _esc(text)
    return f"<td{attr}>{inner}</td>"


def table_html(table: Table, css_class: str, widths: dict[str, int] | None = None,
               note_column: str | None = None) -> str:
    """A table with header; numeric columns right-aligned; ``widths`` in percent by column.

    ``note_column``: a column shown only where it has text (why a series could not be
    tested), as one cell spanning the statistics of that row instead of a narrow column.
    """
    widths = widths or {}
    note = next((i for i, c in enumerate(table.columns) if c.ident == note_column), None)
    shown = [i for i in range(len(table.columns)) if i != note]
    head = "".join(
        f'<th width="{widths[c.ident]}%">{_esc(c.header)}</th>' if c.ident in widths
        else f"<th>{_esc(c.header)}</th>"
        for c in (table.columns[i] for i in shown)
    )
    first_stat = next((k for k, i in enumerate(shown)
                       if table.columns[i].kind in ("stat", "p")), len(shown))
    body = []
    for row in table.rows:
        if note is not None and row[note]:
            cells = [_cell(table.columns[i], row[i]) for i in shown[:first_stat]]
            cells.append(f'<td colspan="{len(shown) - first_stat}">{_esc(row[note])}</td>')
        else:
            cells = [_cell(table.columns[i], row[i]) for i in shown]
        body.append("<tr>" + "".join(cells) + "</tr>")
    return (f'<table class="{css_class}" cellspacing="0" cellpadding="4">'
            f"<thead><tr>{head}</tr></thead><tbody>{''.join(body)}</tbody></table>")


def _series_section(number: int, finding: Finding, image: str | None) -> str:
    result = finding.result
    out = [f'<h3 id="series-{number}">{number}. {_esc(finding.name)}</h3>',
           f'<p class="meta">{_esc(origin_line(finding))}</p>',
           f'<p class="verdict">{_esc(result.verdict.label)}</p>']
    if not result.ok:
        out.append(f"<p>{_esc(result.error)}</p>")
        return "\n".join(out)
    out.append("<h4>Decision path</h4>")
    out.append(table_html(path_table(result), "path", PATH_WIDTHS))
    if image is not None:
        out.append("<h4>Chart</h4>")
        out.append(f'<p><img src="{_esc(image)}" width="{CHART_WIDTH}" '
                   f'alt="Chart of {_esc(finding.name)}"></p>')
    out.append("<h4>Reading</h4>")
    out.append("".join(f"<p>{_esc(note)}</p>" for note in result.notes))
    return "\n".join(out)


def run_to_html(run: RunRecord, charts: Charts | None = None,
                image_source: ImageSource = data_uri) -> str:
    """The whole report as one HTML document (charts embedded by ``image_source``)."""
    sources = sources_line(run)
    meta = meta_line(run)
    parts = [
        "<!DOCTYPE html>",
        '<html lang="en"><head><meta charset="utf-8">',
        "<title>Tauscope findings</title>",
        f"<style>{STYLE}</style></head><body>",
        "<h1>Order of integration: findings</h1>",
        f'<p class="meta">{_esc(meta)}</p>',
    ]
    if sources:
        parts.append(f'<p class="meta">Data: {_esc(sources)}</p>')
    left = left_out_note(run)
    if left is not None:
        parts.append(f'<p class="left-out"><b>{_esc(left)}</b></p>')
    parts += ["<h2>Summary</h2>", table_html(merged_markers(compact_table(run)), "summary",
                                                SUMMARY_WIDTHS, note_column="error"),
              f'<p class="note">{_esc(summary_note(run))}</p>',
              "<h2>Series</h2>"]
    index = 0
    for number, finding in enumerate(run.findings, start=1):
        plan = chart_for(finding, charts)
        image = None
        if plan is not None:
            image = image_source(index, plan)
            index += 1
        parts.append(_series_section(number, finding, image))
    methods = methods_for(run)
    parts.append("<h2>Methods</h2>")
    parts += [f"<p>{_esc(p)}</p>" for p in methods.paragraphs]
    parts.append("<h3>References</h3>")
    parts.append('<ol class="refs">' + "".join(f"<li>{_esc(r)}</li>" for r in methods.references)
                 + "</ol>")
    parts.append("</body></html>")
    return "\n".join(parts) + "\n"


def write_html(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_text_atomic(path, run_to_html(run, charts))
