"""The read stage: the verdict, how far the cross-checks back it, and the notes.

The words live in :mod:`tauscope.engine.reading` (verdict sentences, the KPSS and the
extra evidence's reading, the notes); this stage decides what is said about one series.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import replace

from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.procedure.stages import (
    CrossCheck,
    Decision,
    ExtraEvidence,
    Reading,
    ReadOptions,
)
from tauscope.engine.reading.breaks import (
    agreement_under_break,
    capped_agreement,
    verdict_under_break,
)
from tauscope.engine.reading.evidence import combined_agreement, evidence_notes, reading
from tauscope.engine.reading.grade import (
    VARIANCE_CHANGED,
    first_autocorrelation,
    grade,
    seasonal_root_reason,
)
from tauscope.engine.reading.notes import NoteContext, build_notes, seasonal_pattern
from tauscope.engine.reading.seasonal import seasonal_found, seasonal_notes
from tauscope.engine.reading.strategies import (
    classic_sentence,
    disagreement_note,
    grade_note,
    level_note,
    short_label,
    volatility_note,
    weak_verdict_sentence,
)
from tauscope.engine.reading.verdicts import agreement, agreement_note, build_verdict
from tauscope.engine.results import Evidence, TestResult, Verdict
from tauscope.engine.results_strategy import ClassicVerdict
from tauscope.engine.settings import UNION_STRATEGIES


def read(checked: CrossCheck, options: ReadOptions) -> Reading:
    decision = checked.decision
    estimates = decision.estimates
    prepared = estimates.prepared
    order, deterministic = decision.order, decision.deterministic
    checks = list(checked.kpss)
    kpss_status = agreement(order, checks)
    if order is None and options.kpss:
        kpss_status = "inconclusive"
    evidence = read_evidence(checked.extra, order, [t for t, _ in checks], kpss_status, options.alpha,
                             classic_decides=decision.strategy == "classic")
    status = evidence.agreement if evidence.tests else kpss_status
    strategy_notes: list[str] = []
    classic: ClassicVerdict | None = None
    breaks = checked.breaks  # a verdict given under a break replaces the one without (reading/breaks.py)
    if decision.strategy in UNION_STRATEGIES:
        status, classic, strategy_notes = _union_reading(checked, evidence, options)
        status = capped_agreement(status, breaks)
    else:
        status, strategy_notes = _classic_capped(status, checked)
        volatility = volatility_note(checked.variance, decision.strategy, prepared.label)
        if volatility:
            strategy_notes.append(volatility)
    sequence_verdict = build_verdict(order, deterministic, order != 0, status, options.alpha,
                                     options.max_difference)
    sequence_verdict = replace(sequence_verdict, strategy=decision.strategy)
    if decision.strategy == "classic" and decision.weak:
        sequence_verdict = _weak(sequence_verdict, decision, options.alpha)
    verdict = verdict_under_break(sequence_verdict, breaks, options.alpha)
    deciding = decision.deciding
    x = prepared.values
    ctx = NoteContext(
        verdict=verdict,
        steps=decision.steps,
        level_adf=estimates.levels[0].adf,
        lag_profile=checked.lag_profile,
        chosen_lag=deciding.test.lags if deciding.test is not None else None,
        nobs=int(x.shape[0]),
        periods_per_year=prepared.periods_per_year,
        alpha=options.alpha,
        max_lags_reduced=estimates.reduced,
        trimmed=(prepared.leading_trimmed, prepared.trailing_trimmed),
        agreement_text=agreement_under_break(
            sequence_verdict,
            agreement_note(order, kpss_status, checks, options.alpha, kpss_only=decision.strategy != "classic")
            or checked.kpss_problem, breaks),
        jump_at=_jump_label(prepared),
        seasonal_lag=None if checked.seasonal is not None
        else seasonal_pattern(prepared.standardised, prepared.periods_per_year),
        level_sequence_tests=3,
        evidence_notes=evidence.notes + ((breaks.sentence,) if breaks is not None and breaks.sentence else ()),
        break_checked=evidence.break_info is not None or (breaks is not None and breaks.test is not None),
    )
    notes = build_notes(ctx)
    seasonal = seasonal_notes(checked.seasonal)
    if seasonal_found(checked.seasonal):  # right after the verdict: it may call for Δ_S y
        ordered = (*notes[:1], *seasonal, *strategy_notes, *notes[1:])
    else:  # nothing seasonal found: one line before the closing caution
        ordered = (*notes[:1], *strategy_notes, *notes[1:-1], *seasonal, *notes[-1:])
    return Reading(checked, verdict, evidence, ordered, classic)


def _union_reading(checked: CrossCheck, evidence: Evidence,
                   options: ReadOptions) -> tuple[str | None, ClassicVerdict, list[str]]:
    """The union's grade from all the evidence, the classic sequence's verdict beside it,
    and the notes on where the two differ and where the verdict is close to the line."""
    decision = checked.decision
    row = decision.estimates.union
    classic = decision.classic
    assert row is not None and classic is not None
    order, deterministic = decision.order, decision.deterministic
    nobs = int(decision.estimates.prepared.values.shape[0])
    found = (evidence.break_info is not None and evidence.break_info.reject) or (
        checked.breaks is not None and checked.breaks.suspected)
    variance = row.variance
    changed = variance is not None and variance.found
    r1 = first_autocorrelation(decision.estimates.prepared.level(1)) if order == 0 else None
    graded = grade(order, deterministic, list(checked.kpss), classic.order, row.orders_at,
                   row.long_lag_order, row.power, nobs, found, changed, seasonal_roots_found(checked),
                   difference_autocorrelation=r1)
    block = ClassicVerdict(classic.order, classic.deterministic,
                           classic_sentence(classic.order, classic.deterministic, classic.weak,
                                            options.alpha), classic.weak)
    notes = [grade_note(graded.agreement, graded.missing),
             disagreement_note(order, deterministic, classic.order, classic.deterministic, classic.weak,
                               options.lag_rule),
             level_note(order, row.orders_at, options.alpha),
             volatility_note(variance, decision.strategy, decision.estimates.prepared.label)]
    return graded.agreement, block, [n for n in notes if n]


def seasonal_roots_found(checked: CrossCheck) -> tuple[str, ...]:
    """The plain names of the seasonal unit roots the cross-check found (none: ())."""
    roots = None if checked.seasonal is None else checked.seasonal.roots
    return () if roots is None else roots.seasonal_roots


def _classic_capped(status: str | None, checked: CrossCheck) -> tuple[str | None, list[str]]:
    """The classic sequence's KPSS agreement with two of the grade's conditions
    (:mod:`tauscope.engine.reading.grade`): a seasonal unit root found, or a change in the size
    of the shocks (κ2), turns "confirmed" into "inconclusive", with the reasons as a note."""
    reasons = []
    roots = seasonal_roots_found(checked)
    if roots:
        reasons.append(seasonal_root_reason(roots))
    if checked.variance is not None and checked.variance.found:
        reasons.append(VARIANCE_CHANGED)
    if status != "confirmed" or not reasons:
        return status, []
    return "inconclusive", [f"The cross-checks agree, but the verdict is not confirmed: {'; '.join(reasons)}."]


def _weak(verdict: Verdict, decision: Decision, alpha: float) -> Verdict:
    """The classic sequence's verdict when it rests on the normal after a drift: its own
    words, marked weak."""
    if decision.order != 0:  # a weak step on a difference, but the verdict is a unit root
        sentence = classic_sentence(decision.order, decision.deterministic, True, alpha)
        return replace(verdict, text=f"{verdict.text} {sentence}")
    return replace(verdict, label=short_label(decision.order, decision.deterministic, True),
                   text=weak_verdict_sentence(alpha))


def read_evidence(extra: ExtraEvidence, order: int | None, kpss: Sequence[TestResult],
                  kpss_status: str | None, alpha: float, *, classic_decides: bool = True) -> Evidence:
    """The extra evidence with its reading against the ADF verdict, the combined
    agreement (KPSS's own status counting as one vote) and its sentences.
    ``classic_decides``: whether the classic sequence decided the verdict (the power
    sentence then speaks of the deciding ADF test, otherwise of the classic sequence's)."""
    d = extra.difference
    adf_stationary = None if order is None else (order == 0 if d == 0 else False)
    kpss_here = next((k for k in kpss if k.difference == d), None)
    text = reading(adf_stationary, extra.spec, d, alpha, extra.tests, kpss_here, extra.break_info)
    status = combined_agreement(adf_stationary, kpss_status, extra.tests) if extra.tests else kpss_status
    notes = evidence_notes(extra.tests, alpha, extra.fixed_lags, extra.break_info, extra.power,
                           classic_decides=classic_decides)
    all_notes = ([text] if text else []) + notes + list(extra.problems)
    return Evidence(d, extra.spec, extra.tests, tuple(all_notes), text, status, extra.break_info,
                    extra.power, extra.recursive, extra.phillips_perron, extra.z_alpha_critical_values,
                    extra.dfgls, extra.problems)


def _jump_label(prepared: PreparedSeries) -> str | None:
    position = prepared.jump  # on the standardised series: scale-free, no overflow near 1e308
    if position is None:
        return None
    return f"{prepared.label(position)} (from {prepared.label(position - 1)})"
