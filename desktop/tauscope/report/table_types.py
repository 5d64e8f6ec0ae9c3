"""The plain table every writer formats: columns with a kind, rows of plain values."""

from __future__ import annotations

from dataclasses import dataclass

Value = str | int | float | None
DIFFERENCE_SHORT = {0: "levels", 1: "Δy", 2: "Δ²y"}  # the differences in column headers


@dataclass(frozen=True)
class Column:
    """``ident`` names the column in CSV; ``header`` is what a reader sees;
    ``kind`` is ``"text"``, ``"int"``, ``"stat"`` or ``"p"``."""

    ident: str
    header: str
    kind: str = "text"


@dataclass(frozen=True)
class Table:
    columns: tuple[Column, ...]
    rows: tuple[tuple[Value, ...], ...]

    def column(self, ident: str) -> int:
        return next(i for i, c in enumerate(self.columns) if c.ident == ident)
