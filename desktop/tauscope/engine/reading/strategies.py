"""Sentences about the two strategies: the classic sequence's own verdict, where the two
disagree and which to trust, a verdict that changes with the level, and the grade.

Figures quoted here are the verdict scorecard's (benchmarks/verdict_scorecard.py, 500
replications per cell, T = 50 … 500; DEVELOPERS.md): random walks called stationary by
the classic sequence 15–21% of the time with AIC lags and 10–13% with MAIC lags, by the
size-controlled union 3.0–5.8% (its default since the M-statistics study; 2.4–5.0% before).
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Protocol

from tauscope.engine import formatting as fmt
from tauscope.engine.reading.verdicts import verdict_label
from tauscope.engine.reading.words import cross_check_word
from tauscope.engine.settings import STRATEGY_LABELS


class VarianceReading(Protocol):
    """What the volatility note reads of the variance-change test."""

    @property
    def statistic(self) -> float: ...
    @property
    def critical_value(self) -> float: ...
    @property
    def alpha(self) -> float: ...
    @property
    def found(self) -> bool: ...
    @property
    def position(self) -> int: ...


# Random walks called I(0) by the classic sequence on the scorecard, by lag rule.
CLASSIC_RANDOM_WALK_I0 = {"aic": "15–21%", "maic": "10–13%"}
UNION_RANDOM_WALK_I0 = "3.0–5.8%"


def short_label(order: int | None, deterministic: str | None, weak: bool = False) -> str:
    """The verdict's label; the classic sequence's weak trend-stationary reading in words."""
    if weak and order == 0 and deterministic == "trend":
        return "I(0) — trend-stationary: the level grows, but shocks fade (weak)"
    return verdict_label(order, deterministic)


WEAK_REASON = ("the unit root was rejected only against the normal critical value after a drift or trend "
               "was found (West 1988), the step at which the sequence most often calls a unit root "
               "stationary")


def weak_verdict_sentence(alpha: float) -> str:
    """The verdict sentence when the classic sequence decided on that weak step."""
    return (f"The series is trend-stationary, I(0): the level grows, but shocks fade (the unit root is "
            f"rejected at {fmt.percent(alpha)}). This conclusion is weak: {WEAK_REASON}; a unit root "
            "with drift remains a plausible description, and the size-controlled strategy is the safer "
            "choice here.")


def classic_sentence(order: int | None, deterministic: str | None, weak: bool, alpha: float) -> str:
    """One sentence on the classic sequence's verdict, for the ``classic`` block."""
    a = fmt.percent(alpha)
    if order is None:
        return f"The classic Dickey-Fuller sequence leaves the order unresolved at {a}."
    text = f"The classic Dickey-Fuller sequence, each step at {a}, gives {short_label(order, deterministic, weak)}."
    if weak:
        text += f" This conclusion is weak: {WEAK_REASON}."
    return text


def disagreement_note(order: int | None, deterministic: str | None, classic_order: int | None,
                      classic_deterministic: str | None, weak: bool, lag_rule: str) -> str | None:
    """When the two strategies give different verdicts: say so, and which to trust and why."""
    if (order, deterministic) == (classic_order, classic_deterministic):
        return None
    union = verdict_label(order, deterministic)
    other = short_label(classic_order, classic_deterministic, weak)
    if order == classic_order:
        return (f"The two strategies agree on the order but not on the deterministic terms: the "
                f"size-controlled verdict is {union}, the classic sequence says {other}. The "
                "size-controlled label comes from a trend test that holds with or without a unit root "
                "(Harvey, Leybourne & Taylor 2007); the classic sequence picks the terms with tests that "
                "assume one, so trust the size-controlled label.")
    figure = CLASSIC_RANDOM_WALK_I0.get(lag_rule)
    measured = (f" (on the verdict scorecard it called random walks stationary {figure} of the time with "
                f"these lags, against {UNION_RANDOM_WALK_I0} for the size-controlled test)"
                if figure else "")
    lower = classic_order is not None and (order is None or classic_order < order)
    why = ("Each step of the classic sequence tests at the chosen level on its own, so together they "
           f"call a unit root stationary too often{measured}; the size-controlled test keeps that chance "
           "at the chosen level over the whole decision, so trust it."
           if lower else
           "The size-controlled test keeps the chance of calling a unit root stationary at the chosen level "
           "over the whole decision and pays for it with some power against stationary series whose root is "
           "close to one; it is the one to report, but a persistent stationary series is possible.")
    return f"The strategies disagree: the size-controlled test gives {union}, the classic sequence {other}. {why}"


def level_note(order: int | None, orders_at: dict[float, int | None], alpha: float) -> str | None:
    """When the union's verdict would change at 1% or at 10%."""
    changes = [(a, o) for a, o in sorted(orders_at.items()) if o != order and abs(a - alpha) > 1e-12]
    if not changes:
        return None
    parts = [f"at {fmt.percent(a)} it would be {'unresolved' if o is None else f'I({o})'}"
             for a, o in changes]
    return (f"The verdict depends on the significance level: {'; '.join(parts)}. The evidence is close "
            "to the line, so read the verdict as tentative.")


def grade_note(agreement: str | None, missing: tuple[str, ...]) -> str | None:
    """Why the grade is what it is."""
    if agreement is None:
        return None
    word = cross_check_word(agreement)
    if agreement == "confirmed":
        return (f"Cross-check {word}: KPSS backs the verdict strictly, the classic sequence agrees, and "
                "neither the level (1%, 10%) nor a longer maximum lag changes it; on the verdict scorecard "
                "such verdicts were right 98.1% of the time.")
    return f"Cross-check {word}: the verdict is not confirmed, because {'; '.join(missing)}."




def volatility_note(variance: VarianceReading | None, strategy: str,
                    label: Callable[[int], str]) -> str | None:
    """When the shocks' variance changes (κ2, Sansó, Aragó & Carrion 2004): say where, and
    under the default strategy suggest the wild bootstrap one."""
    if variance is None or not variance.found:
        return None
    found = (f"The size of the shocks changes over the sample, most clearly around {label(variance.position)} "
             f"(κ2 = {fmt.stat(variance.statistic)} against {fmt.stat(variance.critical_value)} at "
             f"{fmt.percent(variance.alpha)}; Sansó, Aragó & Carrion 2004).")
    if strategy == "bootstrap":
        return (f"{found} The verdict's critical values come from a wild bootstrap that keeps each shock's size "
                "at its own date (Smeekes & Taylor 2012), so it allows for this.")
    name = STRATEGY_LABELS["bootstrap"]
    return (f"{found} The usual critical values assume a constant size and can then call a unit root "
            f"stationary too often: analyse again with the strategy “{name}” (in the settings, or "
            "--strategy bootstrap on the command line), which allows for it.")
