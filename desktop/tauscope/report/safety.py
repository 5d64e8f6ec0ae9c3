"""Spreadsheet formula injection guard for every text cell written to CSV or xlsx.

A spreadsheet treats a cell that starts with ``=``, ``+``, ``-`` or ``@`` (and,
in some programs, a leading tab or carriage return) as a formula.  A series
name or a header taken from a downloaded workbook must never run as one, so
such text is written as text: with a leading apostrophe in CSV, and as a
string-typed cell marked as text in xlsx (see :meth:`tauscope.report.xlsx_package.Sheet.add`).
"""

from __future__ import annotations

FORMULA_STARTS = ("=", "+", "-", "@", "\t", "\r")


def looks_like_formula(text: str) -> bool:
    """True when a spreadsheet could read ``text`` as a formula."""
    return text.startswith(FORMULA_STARTS)


def guard_text(text: str) -> str:
    """``text`` safe for a CSV cell: an apostrophe in front when it looks like a formula."""
    return "'" + text if looks_like_formula(text) else text
