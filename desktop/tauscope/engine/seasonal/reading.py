"""Plain-language reading of the seasonal unit-root tests.

A seasonal unit root at a frequency means the seasonal pattern at that cycle
wanders instead of repeating around fixed seasonal means; the seasonal
difference Δ_S y_t = y_t − y_{t−S} removes every seasonal root and the long-run
one together (Hylleberg, Engle, Granger & Yoo 1990).  Not rejecting is not
proof: the reading says so, and how many years of data the test had
(common practice: the span in years, not the count of observations, drives
power; Shiller & Perron 1985).
"""

from __future__ import annotations

from collections.abc import Sequence

from tauscope.engine.seasonal.results import SeasonalTest

_METHOD = {4: "HEGY test", 12: "Beaulieu-Miron test"}
_TERMS = {
    "none": "no constant",
    "constant": "a constant",
    "dummies": "seasonal means",
    "trend": "a constant and a trend",
    "dummies_trend": "seasonal means and a trend",
}
_UNIT = {4: "quarter", 12: "month"}


def _join(words: Sequence[str]) -> str:
    if len(words) <= 1:
        return "".join(words)
    return ", ".join(words[:-1]) + " and " + words[-1]


def _num(value: float) -> str:
    return f"{value:.2f}".replace("-", "\u2212")


def _cycle(words: str) -> str:
    """ "twice a year" → "twice-a-year" (the adjective before "cycle")."""
    return words.replace(" ", "-")


def _evidence(test: SeasonalTest, label: str, named: bool = True) -> str:
    symbol = "t" if test.name.startswith("t_") else "F"
    head = f"{test.frequency}: " if named else ""
    return (
        f"{head}{symbol} = {_num(test.statistic)}, "
        f"{label} critical value {_num(test.critical_values[label])}"
    )


def _partial_filter(period: int, roots: Sequence[str]) -> str | None:
    """The filter that removes only the quarterly seasonal unit roots found, or None
    (HEGY 1990: 1 + L carries the root −1, twice a year; 1 + L² the pair ±i, once a
    year; 1 + L + L² + L³ all three)."""
    if period != 4:
        return None
    found = set(roots)
    if found == {"twice a year"}:
        return "the sum of neighbouring quarters, y_t + y_{t−1}"
    if found == {"once a year"}:
        return "the sum of quarters half a year apart, y_t + y_{t−2}"
    return "the sum of the last four quarters, y_t + y_{t−1} + y_{t−2} + y_{t−3}"


def reading(
    period: int,
    deterministic: str,
    lags: int,
    alpha: float,
    tests: Sequence[SeasonalTest],
    seasonal_roots: Sequence[str],
    long_run_root: bool,
    reps: int,
    n: int,
    tabulated: bool = False,
) -> tuple[str, str | None]:
    """(text, suggestion) for one series; suggestion is None when no seasonal
    unit root was found."""
    label = f"{round(alpha * 100):d}%"
    method = _METHOD[period]
    setup = (
        f"the {method} (with {_TERMS[deterministic]}, {lags or 'no'} lagged seasonal "
        f"difference{'s' if lags != 1 else ''}, critical values "
        + (f"read at this length from a table simulated with {reps:,} replications a length)"
           if tabulated else f"simulated at this length from {reps:,} replications)")
    )
    by_cycle = [t for t in tests if t.cycles_per_year not in (None, 0)]
    long_run = next(t for t in tests if t.cycles_per_year == 0)
    unit = _UNIT[period]
    sentences: list[str] = []
    if seasonal_roots:
        kept = [t for t in by_cycle if not t.reject]
        sentences.append(
            f"Seasonal unit root{'s' if len(kept) > 1 else ''} at the "
            f"{_join([_cycle(t.frequency) for t in kept])} cycle{'s' if len(kept) > 1 else ''}: "
            f"{setup} finds no evidence against "
            f"{'them' if len(kept) > 1 else 'it'} at {label} "
            f"({'; '.join(_evidence(t, label) for t in kept)})."
        )
        rejected = [t for t in by_cycle if t.reject]
        if rejected:
            sentences.append(
                f"At the {_join([_cycle(t.frequency) for t in rejected])} "
                f"cycle{'s' if len(rejected) > 1 else ''} the unit root is rejected."
            )
        sentences.append(
            "The seasonal pattern wanders from year to year instead of repeating around "
            "fixed seasonal means."
        )
        difference = f"the seasonal difference Δ{period} y (each {unit} minus the same {unit} a year earlier)"
        partial = None if long_run_root else _partial_filter(period, seasonal_roots)
        if long_run_root:
            suggestion = difference
            sentences.append(f"Suggestion: take {difference} before other tests.")
        else:
            sentences.append(
                "The long-run (ordinary) unit root is rejected "
                f"({_evidence(long_run, label, named=False)}), so the seasonal difference "
                "would also difference away a long run that is already stable."
            )
            if partial is None:
                suggestion = difference
                sentences.append(
                    f"Suggestion: take {difference}, or a filter that removes only the "
                    "seasonal roots found, before other tests."
                )
            else:
                suggestion = partial
                sentences.append(
                    f"Suggestion: use {partial}, which removes only the seasonal "
                    f"root{'s' if len(kept) > 1 else ''} found, before other tests."
                )
    else:
        sentences.append(
            f"No seasonal unit roots: {setup} rejects a unit root at every seasonal cycle "
            f"at {label} ({'; '.join(_evidence(t, label) for t in by_cycle)})."
        )
        sentences.append(
            "The seasonal pattern repeats around stable seasonal means, so seasonal dummies, "
            "not a seasonal difference, describe it."
        )
        suggestion = None
    if long_run_root:
        sentences.append(
            f"The long-run (ordinary) unit root is not rejected ({_evidence(long_run, label, named=False)}); "
            "the ordinary unit-root tests settle how often to difference."
        )
    elif not seasonal_roots:
        sentences.append(
            f"The long-run (ordinary) unit root is rejected ({_evidence(long_run, label, named=False)})."
        )
    years = n / period
    span = f"{years:.0f} years" if years >= 1.5 else "about a year"
    if seasonal_roots or long_run_root:
        sentences.append(
            f"A unit root that is not rejected is not proven: with {span} of data these "
            "tests can miss a slowly changing but stable seasonal pattern."
        )
    sentences.append("A test informs judgement; it does not replace it.")
    return " ".join(sentences), suggestion
