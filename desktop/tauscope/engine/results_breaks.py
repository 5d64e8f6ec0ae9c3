"""Plain data for breaks: where a break-searching test put its break.  Frozen dataclasses
with ``to_dict()``, like :mod:`tauscope.engine.results`; this module imports nothing of
the engine, so :mod:`tauscope.engine.results` can carry its types."""

from __future__ import annotations

from dataclasses import asdict, dataclass
from typing import Any


@dataclass(frozen=True)
class BreakInfo:
    """Where the Zivot-Andrews search put the break, in the series' own dates.

    ``position`` is the last observation (0-based, in the levels) of the old
    regime, ``first_new`` the first of the new one; labels come from the index.
    """

    model: str
    description: str
    position: int
    first_new: int
    last_old_label: str
    first_new_label: str
    statistic: float
    critical_value: float
    reject: bool
    difference: int

    def to_dict(self) -> dict[str, Any]:
        return asdict(self)
