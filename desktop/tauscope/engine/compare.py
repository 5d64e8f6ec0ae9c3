"""Where two ``to_dict()`` trees of results differ: numbers by how much, anything else at all.

Used by the self-test (the analysis process against this one) and by the benchmarks that
check a faster route against the reference (``benchmarks/engine_vs_statsmodels.py``,
``benchmarks/results_unchanged.py``).
"""

from __future__ import annotations

import math
from collections.abc import Iterator
from typing import Any


def differences(a: Any, b: Any) -> Iterator[tuple[float | None, float, str]]:
    """Every place where two trees of dicts, lists and plain values differ, in order:
    (absolute difference, max(1, |a|, |b|), path) for two floats that differ (both NaN is
    no difference), (None, 1.0, path) for anything else that differs (keys, lengths, texts,
    a NaN against a number)."""
    if isinstance(a, dict) and isinstance(b, dict):
        if a.keys() != b.keys():
            yield None, 1.0, "keys"
            return
        for key in a:
            for gap, size, path in differences(a[key], b[key]):
                yield gap, size, f"{key}.{path}" if path else str(key)
    elif isinstance(a, list | tuple) and isinstance(b, list | tuple):
        if len(a) != len(b):
            yield None, 1.0, "length"
            return
        for i, (x, y) in enumerate(zip(a, b, strict=True)):
            for gap, size, path in differences(x, y):
                yield gap, size, f"[{i}].{path}" if path else f"[{i}]"
    elif isinstance(a, float) and isinstance(b, float):
        if math.isnan(a) or math.isnan(b):
            if not (math.isnan(a) and math.isnan(b)):
                yield None, 1.0, ""
        elif a != b:
            yield abs(a - b), max(1.0, abs(a), abs(b)), ""
    elif a != b:
        yield None, 1.0, ""


def first_difference(a: Any, b: Any, tolerance: float) -> str | None:
    """The path of the first place where ``a`` and ``b`` differ by more than ``tolerance``
    (relative for numbers above 1 in size), or None."""
    for gap, size, path in differences(a, b):
        if gap is None or gap > tolerance * size:
            return path or "(the whole value)"
    return None
