"""The seasonal part of a series' result, as frozen plain data (``SeriesResult.seasonal``).

Nothing here computes and nothing of the engine is imported but the finite-number
rule; the window, the reports and the command line read these objects.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from tauscope.engine.finite import finite_or_none as _num
from tauscope.engine.seasonal.results import SeasonalRootsResult


@dataclass(frozen=True)
class SeasonalMeans:
    """Fixed seasonal means of a quarterly (``period`` 4) or monthly (12) series.

    ``mode``: the ``seasonal`` setting ("automatic", "always", "never");
    ``statistic``, ``p_value``, ``df``: the F test of the seasonal dummies in the ADF
    regression of Δy with a constant, y(t−1) and ``lags`` lagged changes
    (:mod:`tauscope.engine.seasonal.means`), None when the series is too short for it;
    ``found``: the test rejects at 1%; ``used``: the unit-root tests allowed for the
    seasonal means (seasonal dummies); ``effects``: each season's effect (season minus
    the average over the year), first quarter or January first; ``seasons``: their
    names; ``text``: one plain sentence."""

    period: int
    mode: str
    statistic: float | None
    p_value: float | None
    df: tuple[int, int] | None
    lags: int | None
    found: bool
    used: bool
    effects: tuple[float, ...]
    seasons: tuple[str, ...]
    text: str

    def to_dict(self) -> dict[str, Any]:
        return {
            "period": self.period,
            "mode": self.mode,
            "statistic": _num(self.statistic),
            "p_value": _num(self.p_value),
            "df": None if self.df is None else list(self.df),
            "lags": self.lags,
            "found": self.found,
            "used": self.used,
            "effects": [_num(v) for v in self.effects],
            "seasons": list(self.seasons),
            "text": self.text,
        }


@dataclass(frozen=True)
class SeasonalCheck:
    """The seasonal part of a quarterly or monthly series' result: the fixed seasonal
    means (``means``) and the seasonal unit-root test (``roots``: HEGY 1990 for quarters,
    Beaulieu & Miron 1993 for months), each None when not computed; ``problem``: one
    sentence when the seasonal unit-root test could not be run."""

    period: int
    means: SeasonalMeans | None
    roots: SeasonalRootsResult | None = None
    problem: str | None = None

    def to_dict(self) -> dict[str, Any]:
        return {
            "period": self.period,
            "means": None if self.means is None else self.means.to_dict(),
            "roots": None if self.roots is None else self.roots.to_dict(),
            "problem": self.problem,
        }
