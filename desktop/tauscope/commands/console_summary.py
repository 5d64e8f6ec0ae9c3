"""The plain-text summary ``tauscope batch`` prints when it writes no file: one line per series."""

from __future__ import annotations

import re
from collections.abc import Sequence

from tauscope.engine import SeriesResult
from tauscope.engine.reading.words import cross_check_word
from tauscope.report import Finding

_PREPARED_NOTE = re.compile(r"longest stretch|were filled|Sample chosen")


def _difference_label(d: int) -> str:
    return ("levels", "Δ", "Δ²")[d] if 0 <= d <= 2 else f"Δ^{d}"


def tau_steps(result: SeriesResult) -> str:
    """The τ of each step taken, e.g. "Δ² constant −6.31; Δ constant −4.52; levels trend −1.80"."""
    parts = [
        f"{_difference_label(s.difference)} {s.spec} {s.statistic:.2f}".replace("-", "−")
        for s in result.steps if s.statistic_name == "tau" and s.strategy == "classic"
    ]
    return "; ".join(parts) or "—"


def summary_table(findings: Sequence[Finding]) -> str:
    """A plain-text table: series, observations, span, verdict, τ of each step, cross-check agreement."""
    header = ("Series", "Obs", "Span", "Verdict", "Cross-check", "τ of each step (difference, terms, τ)")
    rows = []
    for f in findings:
        r = f.result
        span = f"{r.span[0]} to {r.span[1]}" if r.span else "—"
        verdict = r.verdict.label if r.ok else "Not tested"
        kpss = cross_check_word(r.verdict.agreement) if r.ok else "—"
        last = tau_steps(r) if r.ok else (r.error or "")
        rows.append((r.name, str(r.nobs), span, verdict, kpss, last))
    widths = [max(len(row[i]) for row in (header, *rows)) for i in range(len(header) - 1)]
    lines = []
    for row in (header, *rows):
        cells = [c.ljust(w) if i != 1 else c.rjust(w) for i, (c, w) in
                 enumerate(zip(row, widths, strict=False))]
        lines.append("  ".join([*cells, row[-1]]).rstrip())
    notes = [f"{f.result.name}: {f.result.notes[0]}" for f in findings
             if f.result.ok and f.result.notes and _PREPARED_NOTE.search(f.result.notes[0])]
    if notes:
        lines.append("")
        lines.extend(notes)
    return "\n".join(lines)
