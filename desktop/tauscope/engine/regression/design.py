"""The augmented Dickey-Fuller regression design.

Δy_t = a0 + a2·t + γ·y_{t−1} + Σ_{i=1..p} β_i Δy_{t−i} + e_t   (Said & Dickey 1984)

Columns are ordered [constant, trend, y(t−1), Δy(t−1), …, Δy(t−p)], so every
shorter lag model is a leading block of a longer one.  The trend is the
observation number of y_t in the series being tested (1 for the first value),
which changes only the constant's estimate, never τ or the Φ statistics.
"""

from __future__ import annotations

import numpy as np

SPECS = ("trend", "constant", "none")
DETERMINISTIC_TERMS = {"trend": ("constant", "trend"), "constant": ("constant",), "none": ()}
SPEC_LABELS = {
    "trend": "constant and trend",
    "constant": "constant only",
    "none": "no constant or trend",
}


def column_names(spec: str, lags: int) -> tuple[str, ...]:
    names = [*DETERMINISTIC_TERMS[spec], "y(t-1)"]
    names += [f"Δy(t-{i})" for i in range(1, lags + 1)]
    return tuple(names)


def adf_design(
    x: np.ndarray, spec: str, lags: int, first: int | None = None, centre: float = 0.0
) -> tuple[np.ndarray, np.ndarray]:
    """Response Δy_t and design for lag order ``lags``.

    ``first`` is the first usable row of Δy (default ``lags``: the longest
    sample for this lag order; pass the maximum lag to get the common sample
    used when comparing lag orders, Ng & Perron 1995).  ``centre``: y(t−1) enters
    as y(t−1) − centre (only with a constant, which then absorbs γ·centre; see
    :mod:`tauscope.engine.regression.scaling`).
    """
    if centre != 0.0 and spec == "none":
        raise ValueError("only a regression with a constant can measure y(t-1) from a centre")
    start = lags if first is None else first
    if start < lags:
        raise ValueError("the sample cannot start before the lags are available")
    dx = np.diff(x)
    rows = np.arange(start, dx.shape[0])
    columns: list[np.ndarray] = []
    if spec in ("trend", "constant"):
        columns.append(np.ones(rows.shape[0]))
    if spec == "trend":
        columns.append((rows + 1).astype(float))
    columns.append(x[rows] - centre if centre != 0.0 else x[rows])
    for i in range(1, lags + 1):
        columns.append(dx[rows - i])
    return dx[rows], np.column_stack(columns)


def gamma_column(spec: str) -> int:
    """Index of y(t−1) in the design."""
    return len(DETERMINISTIC_TERMS[spec])


def max_lag_cap(n: int) -> int:
    """Largest lag order the sample allows: n//2 − 3 (n//2 − k_det − 1 with the
    two deterministic terms of the trend spec, the bound statsmodels uses), so
    all three specifications share one maximum."""
    return n // 2 - 3


def schwert_max_lag(n: int) -> int:
    """Schwert (1989) long rule: floor(12 (n/100)^(1/4))."""
    return int(np.floor(12.0 * (n / 100.0) ** 0.25))
