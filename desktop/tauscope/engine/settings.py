"""Testing choices shared by every part of the analysis."""

from __future__ import annotations

from dataclasses import asdict, dataclass
from typing import Any

LAG_RULES = ("aic", "bic", "hqc", "tsig", "maic", "fixed")
ALPHAS = (0.01, 0.05, 0.10)
CONFIRMATION_TESTS = ("kpss", "pp", "dfgls", "za")
CRITICAL_VALUE_SOURCES = ("mackinnon", "exact")
BREAK_MODELS = ("c", "t", "ct")
STRATEGIES = ("union", "bootstrap", "classic")
UNION_STRATEGIES = ("union", "bootstrap")  # the strategies that decide with the union of rejections
SEASONAL_MODES = ("automatic", "always", "never")
SEASONAL_LABELS = {
    "automatic": "When a fixed seasonal pattern is found",
    "always": "Always, for quarterly and monthly series",
    "never": "Never",
}
BREAK_CHECK_MODES = ("automatic", "off")
BREAK_CHECK_LABELS = {
    "automatic": "When the evidence points to a break",
    "off": "Off",
}
STRATEGY_LABELS = {
    "union": "Size-controlled (recommended)",
    "bootstrap": "Size-controlled, robust to changing volatility",
    "classic": "Classic Dickey-Fuller sequence",
}

LAG_RULE_LABELS = {
    "aic": "Akaike information criterion (AIC)",
    "bic": "Schwarz-Bayes information criterion (BIC)",
    "hqc": "Hannan-Quinn criterion (HQC)",
    "tsig": "general-to-specific t test on the last lag at 10% (Ng & Perron 1995)",
    "maic": "modified AIC (Ng & Perron 2001)",
    "fixed": "fixed lag order",
}


@dataclass(frozen=True)
class Settings:
    """The choices that define one analysis.

    ``lag_rule`` picks the lag order p of the ADF regression: ``"aic"``,
    ``"bic"``, ``"hqc"`` (information criteria on a common sample, Ng & Perron
    1995), ``"tsig"`` (general-to-specific on the last lag's t at 10%,
    Ng & Perron 1995), ``"maic"`` (modified AIC, Ng & Perron 2001) or
    ``"fixed"`` (use ``lags``).  ``max_lags`` bounds the search; ``None`` means
    Schwert's (1989) rule floor(12 (T/100)^(1/4)).  ``alpha`` is the
    significance level of every test in the sequence; ``max_difference`` is the
    highest order of integration considered; ``confirm`` lists the
    stationarity-null tests used as a cross-check.  ``strategy`` decides the order:
    ``"union"`` (the default) the union of rejections over the deterministic terms
    (Harvey, Leybourne & Taylor 2009, 2012), whose size is controlled over the whole
    decision; ``"classic"`` the Dickey-Fuller sequence (Dolado, Jenkinson &
    Sosvilla-Rivero 1990), which is always computed and shown as well;
    ``"bootstrap"`` the same union with its critical value from the wild bootstrap
    (Smeekes & Taylor 2012), valid when the shocks' variance changes over the sample.
    ``seasonal`` says when the unit-root tests of a quarterly or monthly series allow
    for fixed seasonal means (seasonal dummies, Dickey, Bell & Miller 1986):
    ``"automatic"`` (the default) when the F test of
    :mod:`tauscope.engine.seasonal.means` finds them, ``"always"`` or ``"never"``.
    ``break_check`` says whether the break check runs (:mod:`tauscope.engine.procedure.breaks`:
    the signs of a break, then the break test of Lee & Strazicich when one fires):
    ``"automatic"`` (the default) or ``"off"`` (no signs, no test, no verdict under a break).
    """

    lag_rule: str = "maic"
    lags: int | None = None
    max_lags: int | None = None
    alpha: float = 0.05
    max_difference: int = 2
    confirm: tuple[str, ...] = ("kpss",)
    critical_values: str = "mackinnon"
    break_model: str = "ct"
    power: bool = True
    strategy: str = "union"
    seasonal: str = "automatic"
    break_check: str = "automatic"

    def __post_init__(self) -> None:
        if self.lag_rule not in LAG_RULES:
            raise ValueError(
                f"lag_rule must be one of {', '.join(LAG_RULES)}, not {self.lag_rule!r}"
            )
        if self.lag_rule == "fixed" and (self.lags is None or self.lags < 0):
            raise ValueError("lag_rule 'fixed' needs a lag order 'lags' of 0 or more")
        if self.lags is not None and self.lags < 0:
            raise ValueError("lags must be 0 or more")
        if self.max_lags is not None and self.max_lags < 0:
            raise ValueError("max_lags must be 0 or more")
        if not any(abs(self.alpha - a) < 1e-12 for a in ALPHAS):
            raise ValueError("alpha must be 0.01, 0.05 or 0.10")
        if self.max_difference not in (0, 1, 2):
            raise ValueError("max_difference must be 0, 1 or 2")
        object.__setattr__(self, "confirm", tuple(self.confirm))
        if self.critical_values not in CRITICAL_VALUE_SOURCES:
            raise ValueError("critical_values must be 'mackinnon' or 'exact'")
        if self.break_model not in BREAK_MODELS:
            raise ValueError("break_model must be 'c', 't' or 'ct'")
        if self.strategy not in STRATEGIES:
            raise ValueError(f"strategy must be one of {', '.join(STRATEGIES)}, not {self.strategy!r}")
        if self.seasonal not in SEASONAL_MODES:
            raise ValueError(f"seasonal must be one of {', '.join(SEASONAL_MODES)}, not {self.seasonal!r}")
        if self.break_check not in BREAK_CHECK_MODES:
            raise ValueError(
                f"break_check must be one of {', '.join(BREAK_CHECK_MODES)}, not {self.break_check!r}")
        unknown = [c for c in self.confirm if c not in CONFIRMATION_TESTS]
        if unknown:
            raise ValueError(f"unknown confirmation test(s): {', '.join(unknown)}")

    def to_dict(self) -> dict[str, Any]:
        data = asdict(self)
        data["confirm"] = list(self.confirm)
        return data

    @classmethod
    def from_dict(cls, data: dict[str, Any]) -> Settings:
        known = {k: data[k] for k in cls.__dataclass_fields__ if k in data}
        if "confirm" in known:
            known["confirm"] = tuple(known["confirm"])
        return cls(**known)

    @property
    def alpha_label(self) -> str:
        """The significance level as people write it: "5%"."""
        return f"{round(self.alpha * 100):d}%"
