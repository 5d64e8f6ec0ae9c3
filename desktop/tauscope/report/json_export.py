"""JSON findings (DESIGN.md §3): {"tauscope", "settings", "source", "series", ...}.

Each entry of "series" is exactly ``SeriesResult.to_dict()``; where each series
came from is kept alongside in "origins" (same order).  "critical_values" ("tables" or
"simulated") and "tests_run" describe the run; "left_out" lists the findings kept out
because they were made with other settings.

The file is compact (no indentation, no spaces after separators): that lets ``json`` use its
C encoder, which for 500 series is many times faster than the indented pure-Python one and
makes the file about a third the size.  Any JSON viewer lays it out again for reading.
"""

from __future__ import annotations

import json
import math
from pathlib import Path
from typing import Any

from tauscope.report.atomic import write_text_atomic
from tauscope.report.run import RunRecord

COMPACT = (",", ":")
"""``json.dumps`` separators without spaces."""


def json_clean(value: Any) -> Any:
    """``value`` with non-finite floats as None and tuples as lists: what JSON gives back."""
    if isinstance(value, float):
        return value if math.isfinite(value) else None
    if isinstance(value, dict):
        return {str(k): json_clean(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [json_clean(v) for v in value]
    return value


def run_to_json(run: RunRecord) -> dict[str, Any]:
    sources = [{"file": s.path, "sha256": s.sha256} for s in run.sources]
    return {
        "tauscope": run.version,
        "created": run.created,
        "settings": run.settings.to_dict(),
        "source": sources[0] if len(sources) == 1 else None,
        "sources": sources,
        "series": [f.result.to_dict() for f in run.findings],
        "origins": [f.origin() for f in run.findings],
        "critical_values": run.critical_value_source,
        "tests_run": list(run.tests_run),
        "left_out": [{"name": f.name, "key": f.key, "changed": list(f.changed), "reason": f.reason}
                     for f in run.left_out],
    }


def write_json(path: Path, run: RunRecord) -> None:
    text = json.dumps(run_to_json(run), ensure_ascii=False, separators=COMPACT)
    write_text_atomic(path, text + "\n")
