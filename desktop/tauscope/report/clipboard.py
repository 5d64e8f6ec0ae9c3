"""The selected findings for the clipboard: tab-separated text and an HTML table.

Both hold the same short summary (``tables.compact_table``); numbers use a
plain hyphen-minus so a spreadsheet pasting either form reads them as numbers.
The window puts both on the clipboard; a word processor takes the HTML, a
spreadsheet or a text editor the tabs.
"""

from __future__ import annotations

import html

from tauscope.engine import formatting as fmt
from tauscope.report.run import RunRecord
from tauscope.report.tables import Table, Value, compact_table


def _plain(value: Value, kind: str) -> str:
    if value is None:
        return ""
    if isinstance(value, float):
        return fmt.p_value(value) if kind == "p" else f"{value:.3f}"
    return " ".join(str(value).split())  # no tabs or line breaks inside a cell


def _rows(table: Table) -> list[list[str]]:
    header = [c.header if c.header else "Sig." for c in table.columns]
    body = [[_plain(v, c.kind) for c, v in zip(table.columns, row, strict=True)]
            for row in table.rows]
    return [header, *body]


def findings_tsv(run: RunRecord) -> str:
    """Tab-separated summary of the findings in ``run`` (use ``run.select`` for a selection)."""
    return "".join("\t".join(row) + "\n" for row in _rows(compact_table(run)))


def findings_html(run: RunRecord) -> str:
    """The same summary as an HTML table fragment."""
    rows = _rows(compact_table(run))
    head = "".join(f"<th>{html.escape(h)}</th>" for h in rows[0])
    body = "".join("<tr>" + "".join(f"<td>{html.escape(c)}</td>" for c in row) + "</tr>"
                   for row in rows[1:])
    return (f'<table border="1" cellspacing="0" cellpadding="3"><thead><tr>{head}</tr></thead>'
            f"<tbody>{body}</tbody></table>")
