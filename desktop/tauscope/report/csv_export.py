"""CSV findings in long form: one computed test per row (see ``tables.tests_table``).

Numbers are written unrounded (Python's shortest round-trip form), so reading
the file back gives the engine's numbers exactly; every text cell passes the
formula-injection guard.  UTF-8 with a byte-order mark so spreadsheet programs
read the Greek letters right.
"""

from __future__ import annotations

import csv
import io
from pathlib import Path

from tauscope.report.atomic import write_bytes_atomic
from tauscope.report.run import Charts, RunRecord
from tauscope.report.safety import guard_text
from tauscope.report.tables import Table, Value, tests_table


def _cell(value: Value) -> str:
    if value is None:
        return ""
    if isinstance(value, str):
        return guard_text(value)
    return repr(value) if isinstance(value, float) else str(value)


def table_to_csv(table: Table) -> str:
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\r\n")
    writer.writerow([guard_text(c.ident) for c in table.columns])
    for row in table.rows:
        writer.writerow([_cell(v) for v in row])
    return buffer.getvalue()


def run_to_csv(run: RunRecord) -> str:
    return table_to_csv(tests_table(run))


def write_csv(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_bytes_atomic(path, run_to_csv(run).encode("utf-8-sig"))
