"""The notes on the seasonal part of a quarterly or monthly series' result.

Seasonal unit roots first (they call for a seasonal difference before anything else,
Hylleberg, Engle, Granger & Yoo 1990), then the fixed seasonal means and whether the
unit-root tests allowed for them (Dickey, Bell & Miller 1986).  A series with neither
gets one short sentence.
"""

from __future__ import annotations

from tauscope.engine import formatting as fmt
from tauscope.engine.results_seasonal import SeasonalCheck

METHOD = {4: "HEGY test", 12: "Beaulieu-Miron test"}


def seasonal_found(check: SeasonalCheck | None) -> bool:
    """Seasonal unit roots or fixed seasonal means (found or allowed for) in this result."""
    if check is None:
        return False
    roots = check.roots is not None and bool(check.roots.seasonal_roots)
    means = check.means is not None and (check.means.found or check.means.used)
    return roots or means or check.problem is not None


def seasonal_notes(check: SeasonalCheck | None) -> tuple[str, ...]:
    """The sentences for ``SeriesResult.seasonal`` (none when it was not computed)."""
    if check is None:
        return ()
    notes: list[str] = []
    roots, means = check.roots, check.means
    has_roots = roots is not None and bool(roots.seasonal_roots)
    pattern = means is not None and (means.found or means.used)
    if roots is not None and (has_roots or pattern):
        notes.append(roots.text)
    if means is not None and pattern:
        notes.append(means.text)
    if not has_roots and not pattern and means is not None:
        tail = ""
        if roots is not None:
            tail = (f"; the {METHOD[check.period]} rejects a unit root at every seasonal cycle at "
                    f"{fmt.percent(roots.alpha)}")
        notes.append(means.text.rstrip(".") + tail + ".")
    if check.problem:
        notes.append(check.problem)
    return tuple(notes)
