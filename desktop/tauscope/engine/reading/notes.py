"""Plain-language notes: what the result says, how strong it is, what could mislead.

Style (DESIGN.md §7): evidence first, then its strength, then the caveats.
Sources cited in the sentences: Perron (1989) on level shifts, Shiller &
Perron (1985) on span, West (1988) on normal critical values with a drift.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from tauscope.engine import formatting as fmt
from tauscope.engine.regression.design import SPEC_LABELS
from tauscope.engine.results import LagPoint, Step, TestResult, Verdict

SHORT_SAMPLE = 50
JUMP_FACTOR = 6.0  # a change this many robust standard deviations from the typical change


@dataclass(frozen=True)
class NoteContext:
    verdict: Verdict
    steps: tuple[Step, ...]
    level_adf: dict[str, TestResult]
    lag_profile: tuple[LagPoint, ...]
    chosen_lag: int | None
    nobs: int
    periods_per_year: float | None
    alpha: float
    max_lags_reduced: tuple[int, int] | None
    trimmed: tuple[int, int]
    agreement_text: str | None
    jump_at: str | None
    seasonal_lag: int | None
    level_sequence_tests: int
    evidence_notes: tuple[str, ...] = ()
    break_checked: bool = False


def find_jump(x: np.ndarray) -> int | None:
    """Position of an unusually large one-period change (a candidate level shift), if any.

    Robust rule (common practice): |Δy_t − median| > 6 × 1.4826 × MAD of Δy.
    """
    dx = np.diff(x)
    if dx.size < 8:
        return None
    centre = _median(dx)
    mad = _median(np.abs(dx - centre)) * 1.4826
    if mad <= 0:
        return None
    with np.errstate(over="ignore"):  # a subnormal MAD: any real change scores infinite
        score = np.abs(dx - centre) / mad
    position = int(np.argmax(score))
    return position + 1 if score[position] > JUMP_FACTOR else None


def _median(values: np.ndarray) -> float:
    """``np.median`` of a 1-D array with the same bits (the middle value, or the two middle
    values' sum halved), from one partial sort instead of its general machinery."""
    if not np.isfinite(values).all():
        return float(np.median(values))
    half = values.size // 2
    if values.size % 2:
        return float(np.partition(values, half)[half])
    part = np.partition(values, (half - 1, half))
    return float((part[half - 1] + part[half]) / 2.0)


def seasonal_pattern(x: np.ndarray, periods_per_year: float | None) -> int | None:
    """The seasonal lag s (4 or 12) when the autocorrelation of Δy at lag s is large
    (above 0.3 and beyond two standard errors, common practice)."""
    if periods_per_year not in (4.0, 12.0):
        return None
    s = int(periods_per_year)
    dx = np.diff(x)
    if dx.size <= 3 * s:
        return None
    dx = dx - dx.mean()
    denominator = float(np.dot(dx, dx))
    if denominator <= 0:
        return None
    rho = float(np.dot(dx[s:], dx[:-s])) / denominator
    return s if rho > max(0.3, 2.0 / np.sqrt(dx.size)) else None


def build_notes(ctx: NoteContext) -> tuple[str, ...]:
    notes: list[str] = [ctx.verdict.text]
    a = fmt.percent(ctx.alpha)
    if ctx.agreement_text:
        notes.append(ctx.agreement_text)
    notes.extend(ctx.evidence_notes)
    drift_note = _drift_branch_note(ctx)
    if drift_note:
        notes.append(drift_note)
    if ctx.verdict.unit_root:
        notes.append(
            f"Not rejecting a unit root is not proof of one: it says only that the data hold no evidence "
            f"against it at {a}. Unit-root tests have low power against stationary series whose "
            "autoregressive root is close to one, so a persistent but stationary series often looks like this."
        )
    if ctx.periods_per_year:
        years = ctx.nobs / ctx.periods_per_year
        if years < 30:
            notes.append(
                f"The sample covers about {years:.0f} years. The power of these tests depends on the span in "
                "years more than on the number of observations (Shiller & Perron 1985; common practice), so "
                "a short span makes a unit root hard to rule out."
            )
    decisions = {spec: t.reject for spec, t in ctx.level_adf.items()}
    if len(set(decisions.values())) > 1:
        parts = [
            f"{'rejects' if r else 'does not reject'} with {SPEC_LABELS[s]} "
            f"(τ = {fmt.stat(ctx.level_adf[s].statistic)})"
            for s, r in decisions.items()
        ]
        notes.append(
            "The deterministic terms change the answer on the levels: the ADF test "
            + "; ".join(parts)
            + ". The testing sequence decides which terms belong, but this choice matters."
        )
    notes.extend(_lag_notes(ctx))
    if ctx.jump_at:
        notes.append(
            f"There is an unusually large one-period change at {ctx.jump_at}. A one-off shift in level or "
            "trend biases the Dickey-Fuller test toward finding a unit root (Perron 1989); suggestion: check "
            "the source for a break or a change of definition near that date."
        )
    elif ctx.verdict.unit_root and not ctx.break_checked:
        notes.append(
            "A break in level or trend anywhere in the sample would also bias the test toward a unit root "
            "(Perron 1989); check the source for changes of definition or coverage."
        )
    if ctx.seasonal_lag:
        notes.append(
            f"The changes show a strong seasonal pattern (autocorrelation at lag {ctx.seasonal_lag}). These "
            "tests do not look for seasonal unit roots; suggestion: use seasonally adjusted data or a "
            "seasonal difference."
        )
    if ctx.nobs < SHORT_SAMPLE:
        notes.append(
            f"Only {ctx.nobs} observations: critical values and lag choice are less reliable below about "
            f"{SHORT_SAMPLE} observations (common practice); read the verdict as tentative."
        )
    if ctx.max_lags_reduced:
        wanted, used = ctx.max_lags_reduced
        notes.append(
            f"The sample is too short for a maximum lag order of {wanted}; it was reduced to {used}."
        )
    lead, trail = ctx.trimmed
    if lead or trail:
        notes.append(
            f"Missing values at the start ({lead}) and end ({trail}) of the series were left out before testing."
        )
    if ctx.verdict.strategy == "bootstrap":
        notes.append(
            f"The verdict comes from four unit-root tests taken together, judged against a critical value "
            f"from the wild bootstrap of this series' own shocks (Smeekes & Taylor 2012), so the chance of "
            f"calling a unit root stationary stays near {a} on each difference even when the size of the "
            "shocks changes over the sample."
        )
    elif ctx.verdict.strategy == "union":
        notes.append(
            f"The verdict comes from four unit-root tests taken together with a scaling simulated at this "
            f"length (Harvey, Leybourne & Taylor 2009, 2012), so the chance of calling a unit root stationary "
            f"stays at {a} on each difference, whatever the deterministic terms."
        )
    else:
        notes.append(
            f"The testing sequence runs up to {ctx.level_sequence_tests} tests at {a} on each difference, so the "
            f"chance that at least one of them points the wrong way is larger than {a}."
        )
    notes.append(
        "A test is an aid to judgement, not proof: data definitions, breaks in the source and the purpose "
        "of the model matter as much as the statistics."
    )
    return tuple(notes)


def _lag_notes(ctx: NoteContext) -> list[str]:
    if not ctx.lag_profile or ctx.chosen_lag is None:
        return []
    chosen = next((p for p in ctx.lag_profile if p.lag == ctx.chosen_lag), None)
    if chosen is None:
        return []
    near = [
        p for p in ctx.lag_profile if abs(p.lag - ctx.chosen_lag) <= 2 and p.lag != ctx.chosen_lag
    ]
    changed = [p.lag for p in near if p.reject != chosen.reject]
    low, high = max(0, ctx.chosen_lag - 2), ctx.chosen_lag + 2
    if changed:
        listed = ", ".join(str(lag) for lag in changed)
        return [
            f"The ADF decision depends on the lag order: with {listed} lag{'s' if len(changed) > 1 else ''} "
            f"instead of the chosen {ctx.chosen_lag} it would change. Treat the verdict as fragile."
        ]
    if near:
        return [
            f"The ADF decision is the same for every lag order from {low} to {min(high, ctx.lag_profile[-1].lag)} "
            f"around the chosen {ctx.chosen_lag}."
        ]
    return []


def _drift_branch_note(ctx: NoteContext) -> str | None:
    """Caution when stationarity rests only on the normal test taken after a drift was found.

    That step (West 1988) is justified under a unit root with drift; a series that drifts
    cannot also be stationary around a fixed mean, so the reading is weak.
    """
    if ctx.verdict.order != 0 or ctx.verdict.strategy != "classic":
        return None
    decisive = [s for s in ctx.steps if s.difference == 0 and s.statistic_name == "z" and s.spec == "constant"
                and s.hypothesis.startswith("unit root") and s.rejected]
    if not decisive:
        return None
    trend = ctx.level_adf.get("trend")
    trend_text = (f" With constant and trend the ADF test does not reject (τ = {fmt.stat(trend.statistic)})."
                  if trend is not None and not trend.reject else "")
    return (
        "The unit root was rejected only by the step that compares τ with the standard normal because a "
        "drift was found (West 1988). That step assumes a unit root with drift, and a series that drifts "
        "cannot be stationary around a fixed mean: the most the sequence can say is trend-stationary (the "
        "level grows, but shocks fade), so read this verdict as weak; a unit root with drift remains a "
        "plausible description." + trend_text
    )
