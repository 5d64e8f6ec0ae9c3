"""Plain data about the decision strategies, for :class:`~tauscope.engine.results.SeriesResult`.

This module imports nothing of the engine, like :mod:`tauscope.engine.results`."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

STRATEGY_NAMES = ("union", "classic")


@dataclass(frozen=True)
class ClassicVerdict:
    """The classic Dickey-Fuller sequence's own verdict, kept when another strategy
    decided so that both can be shown (DESIGN §3 ``classic``).  ``weak`` marks a
    conclusion the sequence reached only by comparing τ with the normal after finding
    a drift or a trend (West 1988), which is where it errs most."""

    order: int | None
    deterministic: str | None
    text: str
    weak: bool = False

    def to_dict(self) -> dict[str, Any]:
        return {"order": self.order, "deterministic": self.deterministic, "text": self.text,
                "weak": self.weak}
