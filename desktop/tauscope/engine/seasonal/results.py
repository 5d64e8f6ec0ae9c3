"""Frozen, plain-data results of the seasonal unit-root tests (HEGY 1990 for
quarters, Beaulieu & Miron 1993 for months).  Nothing here computes; the
window, the reports and the command line read these objects."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from tauscope.engine.finite import finite_or_none as _num


@dataclass(frozen=True)
class SeasonalTest:
    """One statistic of the seasonal regression.

    ``name``: ``"t_pi1"``, ``"t_pi2"``, ``"F_pi3_pi4"`` …, ``"F_seasonal"``
    (every seasonal frequency at once) or ``"F_all"`` (those and the long run);
    ``frequency``: plain words (``"long run"``, ``"twice a year"``, …);
    ``cycles_per_year``: k of the frequency 2πk/S (0 for the long run, None for a
    joint test); ``tail``: ``"lower"`` (t) or ``"upper"`` (F);
    ``critical_values``: {"1%", "5%", "10%"} simulated at the series' length;
    ``p_value``: interpolated in the simulated distribution, None when the
    statistic lies beyond every draw (``p_value_bound`` is then ``"below"``);
    ``reject``: the unit root(s) at this frequency rejected at ``alpha``."""

    name: str
    frequency: str
    cycles_per_year: int | None
    tail: str
    statistic: float
    critical_values: dict[str, float]
    p_value: float | None
    p_value_bound: str | None
    reject: bool

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "frequency": self.frequency,
            "cycles_per_year": self.cycles_per_year,
            "tail": self.tail,
            "statistic": _num(self.statistic),
            "critical_values": {k: _num(v) for k, v in self.critical_values.items()},
            "p_value": _num(self.p_value),
            "p_value_bound": self.p_value_bound,
            "reject": self.reject,
        }


@dataclass(frozen=True)
class SeasonalRootsResult:
    """The seasonal unit-root test of one series.

    ``method``: ``"hegy"`` (quarterly) or ``"beaulieu_miron"`` (monthly);
    ``deterministic``: ``"none"``, ``"constant"``, ``"dummies"`` (seasonal
    means), ``"trend"`` or ``"dummies_trend"``; ``lags``: lagged seasonal
    differences in the regression, chosen by ``lag_rule`` up to ``max_lags``;
    ``n``: length of the series, ``nobs``: rows of the regression;
    ``seasonal_roots``: plain names of the seasonal frequencies whose unit root
    was not rejected; ``long_run_root``: the zero-frequency root not rejected;
    ``suggestion``: the transformation the evidence points to, or None;
    ``text``: the plain-language reading."""

    method: str
    period: int
    deterministic: str
    lags: int
    lag_rule: str
    max_lags: int
    n: int
    nobs: int
    alpha: float
    reps: int
    seed: int
    tests: tuple[SeasonalTest, ...]
    seasonal_roots: tuple[str, ...]
    long_run_root: bool
    suggestion: str | None
    text: str

    def test(self, name: str) -> SeasonalTest:
        """The statistic called ``name`` (KeyError if it was not computed)."""
        for item in self.tests:
            if item.name == name:
                return item
        raise KeyError(name)

    def to_dict(self) -> dict[str, Any]:
        return {
            "method": self.method,
            "period": self.period,
            "deterministic": self.deterministic,
            "lags": self.lags,
            "lag_rule": self.lag_rule,
            "max_lags": self.max_lags,
            "n": self.n,
            "nobs": self.nobs,
            "alpha": self.alpha,
            "reps": self.reps,
            "seed": self.seed,
            "tests": [t.to_dict() for t in self.tests],
            "seasonal_roots": list(self.seasonal_roots),
            "long_run_root": self.long_run_root,
            "suggestion": self.suggestion,
            "text": self.text,
        }
