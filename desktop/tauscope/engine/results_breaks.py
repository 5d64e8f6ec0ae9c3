"""Plain data for breaks: where the Zivot-Andrews search put its break, why a break was
suspected, the break test's outcome and its reading.  Frozen dataclasses with ``to_dict()``,
like :mod:`tauscope.engine.results`; this module imports nothing of the engine but the
plain-number rule of :mod:`tauscope.engine.finite`, so
:mod:`tauscope.engine.results` can carry its types.
"""

from __future__ import annotations

from dataclasses import asdict, dataclass
from typing import Any

from tauscope.engine.finite import finite_or_none as _num

# Why a break was suspected (``BreakCheck.reasons``), in plain words for the reading.
REASONS = {
    "jump": "an unusually large one-period change",
    "conflict": "the ADF test and KPSS contradict each other",
    "swing": "the ADF statistic on an expanding window swings across its critical value",
}

# ``BreakCheck.outcome``
NOT_SUSPECTED = "not suspected"  # no sign of a break: the test did not run
STATIONARY_WITH_BREAK = "stationary with a break"  # the test rejects a unit root and the shift is clear
SHIFT_UNCLEAR = "no unit root, shift unclear"  # it rejects, but the verdict stays (see procedure/breaks.py)
UNIT_ROOT_WITH_BREAK = "unit root even with a break"  # it does not reject
NOT_RUN = "not run"  # suspected, but switched off or too short
FAILED = "failed"  # suspected, but the test could not be computed


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


@dataclass(frozen=True)
class BreakTest:
    """The minimum LM test with one shift in level (Lee & Strazicich 2013, model A).

    ``position``/``first_new``: last observation of the old regime and first of the new
    one (0-based, in the levels); the labels come from the series' index.  ``shift`` is
    the estimated jump in level and ``slope`` the slope per period, in the series' units.
    ``deterministic``: "constant" when the stationary path is a mean that shifts,
    "trend" when the slope is significant (``trend_t``, its t ratio at the break);
    ``shift_t``: the shift's t ratio at the break, ``shift_clear`` whether it passes the
    sup-type critical value (the break date was searched for).
    """

    statistic: float
    critical_values: dict[str, float]
    critical_value: float
    p_value: float | None
    p_value_bound: str | None
    reject: bool
    lags: int
    nobs: int
    position: int
    first_new: int
    last_old_label: str
    first_new_label: str
    shift: float
    slope: float
    trend_t: float
    deterministic: str
    reps: int
    shift_t: float = float("nan")
    shift_clear: bool = False

    def to_dict(self) -> dict[str, Any]:
        return {
            "test": "lm_break", "model": "level shift",
            "statistic": _num(self.statistic),
            "critical_values": {k: _num(v) for k, v in self.critical_values.items()},
            "critical_value": _num(self.critical_value),
            "p_value": _num(self.p_value), "p_value_bound": self.p_value_bound,
            "reject": self.reject, "lags": self.lags, "nobs": self.nobs,
            "position": self.position, "first_new": self.first_new,
            "last_old_label": self.last_old_label, "first_new_label": self.first_new_label,
            "shift": _num(self.shift), "slope": _num(self.slope), "trend_t": _num(self.trend_t),
            "shift_t": _num(self.shift_t), "shift_clear": self.shift_clear,
            "deterministic": self.deterministic, "reps": self.reps,
        }


@dataclass(frozen=True)
class BreakCheck:
    """Whether the evidence points to a break, and what the break test then found.

    ``suspected``: at least one sign of a break (``reasons``, keys of :data:`REASONS`);
    ``jump_label``: where the jump detector saw its change, if it did; ``outcome``: one of
    the module's outcome strings; ``test``: the break test, when it ran; ``sentence``:
    the reading's sentence on it (None when nothing is suspected); ``problem``: why the
    test could not run.
    """

    suspected: bool
    reasons: tuple[str, ...]
    outcome: str
    test: BreakTest | None = None
    jump_label: str | None = None
    sentence: str | None = None
    problem: str | None = None

    @property
    def stationary_with_break(self) -> bool:
        """The verdict is to be given under the break: I(0) around a path that shifts."""
        return self.outcome == STATIONARY_WITH_BREAK

    def to_dict(self) -> dict[str, Any]:
        return {
            "break_suspected": self.suspected,
            "reasons": list(self.reasons),
            "outcome": self.outcome,
            "stationary_with_break": self.stationary_with_break,
            "test": self.test.to_dict() if self.test is not None else None,
            "jump_label": self.jump_label,
            "sentence": self.sentence,
            "problem": self.problem,
        }
