"""How numbers appear in plain-language text (DESIGN.md section 7)."""

from __future__ import annotations

import math
from functools import lru_cache


def stat(value: float | None, decimals: int = 2) -> str:
    """A statistic as a reader would copy it, with a true minus sign."""
    if value is None or not math.isfinite(value):
        return "n/a"
    text = f"{value:.{decimals}f}"
    if text[0] != "-":
        return text
    digits = text[1:]
    return digits if digits.strip("0.") == "" else "\u2212" + digits  # no "−0.00"


def p_value(value: float | None, bound: str | None = None) -> str:
    """A p-value: "0.031", "below 0.001", or a table bound said in words."""
    if value is None or not math.isfinite(value):
        return "not available"
    if bound in ("below", "above"):
        return f"{bound} {value:.2f}" if value >= 0.01 else f"{bound} {value:.3f}"
    if value < 0.001:
        return "below 0.001"
    if value > 0.999:
        return "above 0.999"
    return f"{value:.3f}"


@lru_cache(maxsize=64)
def percent(alpha: float) -> str:
    return f"{round(alpha * 100):d}%"
