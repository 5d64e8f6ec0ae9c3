"""Result of one ADF (or restricted) regression, kept for display and reports."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

import numpy as np


@dataclass(frozen=True)
class Coefficient:
    name: str
    estimate: float
    std_error: float
    t_value: float

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "estimate": self.estimate,
            "std_error": self.std_error,
            "t_value": self.t_value,
        }


@dataclass(frozen=True)
class Regression:
    """An estimated ADF regression: coefficients, σ̂², RSS, sample and lag choice.

    ``design`` and ``response`` are kept for charts (the fitted deterministic
    part); they are not part of ``to_dict()``.
    """

    spec: str
    difference: int
    lags: int
    lag_rule: str
    max_lags: int
    nobs: int
    first_observation: int
    coefficients: tuple[Coefficient, ...]
    sigma2: float
    rss: float
    lag_criteria: tuple[float, ...] = ()
    design: np.ndarray = field(default_factory=lambda: np.empty((0, 0)), compare=False, repr=False)
    response: np.ndarray = field(default_factory=lambda: np.empty(0), compare=False, repr=False)

    def coefficient(self, name: str) -> Coefficient:
        for coef in self.coefficients:
            if coef.name == name:
                return coef
        raise KeyError(name)

    @property
    def gamma(self) -> Coefficient:
        return self.coefficient("y(t-1)")

    @property
    def tau(self) -> float:
        return self.gamma.t_value

    def to_dict(self) -> dict[str, Any]:
        return {
            "spec": self.spec,
            "difference": self.difference,
            "lags": self.lags,
            "lag_rule": self.lag_rule,
            "max_lags": self.max_lags,
            "nobs": self.nobs,
            "first_observation": self.first_observation,
            "coefficients": [c.to_dict() for c in self.coefficients],
            "sigma2": self.sigma2,
            "rss": self.rss,
            "lag_criteria": list(self.lag_criteria),
        }
