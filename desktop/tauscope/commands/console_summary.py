"""The plain-text summary ``tauscope batch`` prints when it writes no file: one line per series."""

from __future__ import annotations

import re
from collections.abc import Sequence

from tauscope.engine import SeriesResult
from tauscope.engine.reading.words import cross_check_word
from tauscope.report import Finding
from tauscope.report.deciding import break_decided, union_note, union_steps

_PREPARED_NOTE = re.compile(r"longest stretch|were filled|Sample chosen")


def _difference_label(d: int) -> str:
    return ("levels", "Δ", "Δ²")[d] if 0 <= d <= 2 else f"Δ^{d}"


def deciding_steps(result: SeriesResult) -> str:
    """The steps that decided, in the order taken: under a size-controlled strategy the union's
    M on each difference against its critical value, e.g. "Δ² M 9.32 > 1.13; Δ M 5.04 > 1.13;
    levels M 1.10 ≤ 1.13"; under the classic strategy the τ of each step of its path, e.g.
    "Δ² constant τ −6.31; Δ constant τ −4.52; levels trend τ −1.80"; then the break test's
    LM τ when the verdict was given under a shift (Lee & Strazicich 2013)."""
    union = union_steps(result)
    if union:
        parts = [f"{_difference_label(d)} M {s.statistic:.2f} "
                 f"{'>' if s.decision == 'reject' else '≤'} {s.critical_value:.2f}"
                 for d, s in union.items() if s.statistic is not None and s.critical_value is not None]
    else:
        parts = [f"{_difference_label(s.difference)} {s.spec} τ {s.statistic:.2f}"
                 for s in result.steps if s.statistic_name == "tau" and s.strategy == "classic"]
    if break_decided(result) and result.breaks is not None and result.breaks.test is not None:
        test = result.breaks.test
        parts.append(f"levels, shift from {test.first_new_label}: LM τ {test.statistic:.2f} "
                     f"< {test.critical_value:.2f}")
    return "; ".join(parts).replace("-", "−") or "—"


def summary_table(findings: Sequence[Finding]) -> str:
    """A plain-text table: series, observations, span, verdict, cross-check agreement and the
    steps that decided (:func:`deciding_steps`), then what M is when the union decided."""
    header = ("Series", "Obs", "Span", "Verdict", "Cross-check", "Steps that decided")
    rows = []
    for f in findings:
        r = f.result
        span = f"{r.span[0]} to {r.span[1]}" if r.span else "—"
        verdict = r.verdict.label if r.ok else "Not tested"
        kpss = cross_check_word(r.verdict.agreement) if r.ok else "—"
        last = deciding_steps(r) if r.ok else (r.error or "")
        rows.append((r.name, str(r.nobs), span, verdict, kpss, last))
    widths = [max(len(row[i]) for row in (header, *rows)) for i in range(len(header) - 1)]
    lines = []
    for row in (header, *rows):
        cells = [c.ljust(w) if i != 1 else c.rjust(w) for i, (c, w) in
                 enumerate(zip(row, widths, strict=False))]
        lines.append("  ".join([*cells, row[-1]]).rstrip())
    notes = [f"{f.result.name}: {f.result.notes[0]}" for f in findings
             if f.result.ok and f.result.notes and _PREPARED_NOTE.search(f.result.notes[0])]
    union = union_note((f.result for f in findings), classic="")
    if union:
        notes.append(union)
    if notes:
        lines.append("")
        lines.extend(notes)
    return "\n".join(lines)
