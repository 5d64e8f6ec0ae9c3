"""Each cell of a sheet's grid classified: empty, missing-value code, number, text or date."""

from __future__ import annotations

import datetime as dt
import math

import numpy as np

from tauscope.data.cells import Cell, NumberFormat, is_missing_code

EMPTY, MISSING, NUMBER, TEXT, DATE = range(5)


def classify(cell: Cell, numbers: NumberFormat) -> tuple[int, float]:
    kind = type(cell)
    if kind is float:
        value = float(cell)  # type: ignore[arg-type]
        return (NUMBER, value) if math.isfinite(value) else (MISSING, math.nan)
    if cell is None:
        return EMPTY, math.nan
    if kind is int:
        return NUMBER, float(cell)  # type: ignore[arg-type]
    if isinstance(cell, str):
        text = cell.strip()
        if not text:
            return EMPTY, math.nan
        if is_missing_code(text):
            return MISSING, math.nan
        parsed = numbers.parse(text)
        return (TEXT, math.nan) if parsed is None else (NUMBER, parsed)
    if isinstance(cell, dt.date):
        return DATE, math.nan
    return TEXT, math.nan


def classify_grid(grid: list[list[Cell]], numbers: NumberFormat) -> tuple[np.ndarray, np.ndarray]:
    """Per cell: its kind (EMPTY, MISSING, NUMBER, TEXT, DATE) and its number (else NaN)."""
    codes: list[list[int]] = []
    values: list[list[float]] = []
    nan = math.nan
    point = numbers.decimal == "."
    for row in grid:
        code_row: list[int] = []
        value_row: list[float] = []
        for cell in row:
            if type(cell) is float and cell == cell:  # finite numbers, the common case
                code_row.append(NUMBER)
                value_row.append(cell)
            elif cell is None:
                code_row.append(EMPTY)
                value_row.append(nan)
            elif type(cell) is str and (point or "." not in cell) and "_" not in cell:
                try:  # plain numbers as text ("12.5"): what float() reads is what parse() reads
                    number = float(cell)
                except ValueError:
                    number = nan
                if math.isfinite(number):
                    code_row.append(NUMBER)
                    value_row.append(number)
                else:
                    code, value = classify(cell, numbers)
                    code_row.append(code)
                    value_row.append(value)
            else:
                code, value = classify(cell, numbers)
                code_row.append(code)
                value_row.append(value)
        codes.append(code_row)
        values.append(value_row)
    return np.array(codes, dtype=np.int8), np.array(values, dtype=np.float64)
