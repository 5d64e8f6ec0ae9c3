"""One rule for numbers in plain-data results: a finite float, or None (JSON has no NaN)."""

from __future__ import annotations

import math


def finite_or_none(value: float | None) -> float | None:
    """``value`` as a float when it is finite; None when it is None, NaN or infinite."""
    if value is None:
        return None
    value = float(value)
    return value if math.isfinite(value) else None
