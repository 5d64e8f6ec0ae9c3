"""The graded badge of a size-controlled verdict and the sentences on the two strategies
(reading/grade.py, reading/strategies.py).  The rule is the one calibrated on the verdict
scorecard (benchmarks/verdict_scorecard.py; DEVELOPERS.md): KPSS p-values from KPSS (1992)
Table 1 interpolation are bounded to 0.01-0.10, so "strict" means at those bounds."""

from __future__ import annotations

from tauscope.engine.reading.grade import grade
from tauscope.engine.reading.strategies import disagreement_note, grade_note, level_note
from tauscope.engine.results import TestResult


def _kpss(p: float, reject: bool, difference: int = 0) -> TestResult:
    return TestResult("kpss", "constant", difference, 0.5, p, 4, 200, {"1%": 0.739, "5%": 0.463, "10%": 0.347},
                      reject, 0.463)


GOOD_I1 = dict(order=1, deterministic="constant",
               checks=[(_kpss(0.01, True), True), (_kpss(0.10, False, 1), False)],
               classic_order=1, orders_at={0.01: 1, 0.10: 1}, long_lag_order=1, power=(0.99, 0.95),
               nobs=200, break_found=False)


def test_every_condition_met_is_confirmed() -> None:
    assert grade(**GOOD_I1).agreement == "confirmed"  # type: ignore[arg-type]


def test_each_missing_condition_withholds_confirmed() -> None:
    changes = {
        "checks": [(_kpss(0.02, True), True), (_kpss(0.10, False, 1), False)],  # KPSS not at 1%
        "classic_order": 0,
        "orders_at": {0.01: 1, 0.10: 0},
        "long_lag_order": 2,
        "power": (0.99, 0.80),  # drift found: the trend components' power counts
        "nobs": 149,
        "break_found": True,
        "variance_changed": True,  # κ2 found a change in the shocks' variance (issue 14)
        "seasonal_roots": ("twice a year",),  # HEGY found a seasonal unit root (issue 14)
    }
    for key, value in changes.items():
        graded = grade(**{**GOOD_I1, key: value})  # type: ignore[arg-type]
        assert graded.agreement == "inconclusive", key
        assert len(graded.missing) == 1, key


def test_the_seasonal_and_variance_reasons_are_plain_words() -> None:
    graded = grade(**{**GOOD_I1, "seasonal_roots": ("once a year", "twice a year")})  # type: ignore[arg-type]
    (reason,) = graded.missing
    assert "seasonal unit root" in reason and "once a year, twice a year" in reason
    assert "seasonal difference" in reason
    graded = grade(**{**GOOD_I1, "variance_changed": True})  # type: ignore[arg-type]
    assert graded.missing == ("the size of the shocks changes over the sample",)


def test_every_kpss_check_against_the_verdict_is_a_conflict() -> None:
    against = [(_kpss(0.2, False), True), (_kpss(0.01, True, 1), False)]
    assert grade(**{**GOOD_I1, "checks": against}).agreement == "conflict"  # type: ignore[arg-type]


def test_no_kpss_means_no_grade_and_unresolved_is_inconclusive() -> None:
    assert grade(**{**GOOD_I1, "checks": []}).agreement is None  # type: ignore[arg-type]
    assert grade(**{**GOOD_I1, "order": None}).agreement == "inconclusive"  # type: ignore[arg-type]


def test_notes_say_when_the_level_or_the_strategy_changes_the_verdict() -> None:
    assert level_note(1, {0.01: 1, 0.10: 1}, 0.05) is None
    note = level_note(1, {0.01: 1, 0.10: 0}, 0.05)
    assert note is not None and "at 10% it would be I(0)" in note
    assert disagreement_note(1, "constant", 1, "constant", False, "maic") is None
    lower = disagreement_note(1, "constant", 0, "trend", True, "maic")
    assert lower is not None and "trust" in lower and "10–13%" in lower and "weak" in lower
    # Figures are quoted only for lag rules the scorecard measured.
    other = disagreement_note(1, "constant", 0, "trend", False, "bic")
    assert other is not None and "%" not in other
    assert grade_note("inconclusive", ("fewer than 150 observations",)) == (
        "Cross-check unclear: the verdict is not confirmed, because fewer than 150 observations.")


def test_no_drift_is_confirmed_only_where_a_small_drift_would_be_seen() -> None:
    """Condition 9: the trend test's mean under a drift δ is about δ√T (a t ratio of the
    mean of Δy; Harvey, Leybourne & Taylor 2007), so 90% power at 5% two-sided against
    δ = 0.1 needs T ≥ ((1.95996 + 1.28155)/0.1)² = 1,050.7 (normal quantiles, common
    practice)."""
    from tauscope.engine.reading.grade import NO_DRIFT_LENGTH

    assert NO_DRIFT_LENGTH == 1051
    walk = {**GOOD_I1, "deterministic": "none", "nobs": 500}
    graded = grade(**walk)  # type: ignore[arg-type]
    assert graded.agreement == "inconclusive" and "small drift" in graded.missing[0]
    assert grade(**{**walk, "nobs": 1051}).agreement == "confirmed"  # type: ignore[arg-type]
    # a drift found, or a stationary verdict, is not held to it
    assert grade(**{**walk, "deterministic": "constant"}).agreement == "confirmed"  # type: ignore[arg-type]


GOOD_I0 = dict(order=0, deterministic="constant",
               checks=[(_kpss(0.10, False), False)], classic_order=0, orders_at={0.01: 0, 0.10: 0},
               long_lag_order=0, power=None, nobs=200, break_found=False)


def test_a_near_cancelling_negative_ma_withholds_confirmed_from_i0() -> None:
    """Condition 11: r₁ of Δy near −0.5 (θ = −0.8 gives θ/(1 + θ²) = −0.49) fits a unit root
    whose MA nearly cancels it as well as a stationary series; an AR(1) with φ = 0.5 gives
    −(1 − φ)/2 = −0.25 and keeps its grade."""
    from tauscope.engine.reading.grade import MA_CANCEL_BELOW

    assert grade(**GOOD_I0).agreement == "confirmed"  # type: ignore[arg-type]
    assert grade(**GOOD_I0, difference_autocorrelation=-0.25).agreement == "confirmed"  # type: ignore[arg-type]
    graded = grade(**GOOD_I0, difference_autocorrelation=-0.49)  # type: ignore[arg-type]
    assert graded.agreement == "inconclusive" and len(graded.missing) == 1
    assert "\u22120.49" in graded.missing[0] and "cannot tell" in graded.missing[0]
    assert -0.49 < MA_CANCEL_BELOW < -0.25
    # Only an I(0) verdict: a differenced random walk's Δ²y has ρ₁ = −0.5 whatever the truth.
    assert grade(**GOOD_I1, difference_autocorrelation=-0.5).agreement == "confirmed"  # type: ignore[arg-type]


def test_first_autocorrelation_matches_statsmodels_acf() -> None:
    import numpy as np
    from statsmodels.tsa.stattools import acf

    from tauscope.engine.reading.grade import first_autocorrelation

    x = np.random.default_rng(3).standard_normal(120).cumsum()
    assert abs(first_autocorrelation(np.diff(x)) - acf(np.diff(x), nlags=1)[1]) < 1e-12  # type: ignore[operator]
    assert first_autocorrelation(np.ones(10)) is None and first_autocorrelation(np.ones(2)) is None
