"""What the reader noticed, as one line for a status bar or standard error."""

from __future__ import annotations

from collections.abc import Sequence

from tauscope.data.model import SeriesData, Workbook


def reader_notes(workbook: Workbook, sheet: str | None = None,
                 chosen: Sequence[SeriesData] | None = None) -> str:
    """The workbook's notes (how it was read), its sheets' notes (rows skipped, sheets
    empty, dates guessed) and the chosen series' notes (cells read as missing), for the
    sheet asked for (all when None), as one line without repeats; "" when there are none.
    ``tauscope batch`` prints it on standard error and the window shows it when a
    workbook has been read."""
    wanted = workbook.sheet(sheet).name if sheet is not None else None
    sheets = [s for s in workbook.sheets if wanted is None or s.name == wanted]
    parts = [*workbook.notes]
    for item in sheets:
        label = f"sheet '{item.name}': " if len(workbook.sheets) > 1 else ""
        parts.extend(label + note for note in item.notes)
    series = chosen if chosen is not None else [s for item in sheets for s in item.series]
    parts.extend(note for s in series for note in s.notes)
    return " ".join(" ".join(p.split()) for p in dict.fromkeys(parts))
