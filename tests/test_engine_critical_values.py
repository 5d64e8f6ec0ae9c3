"""Critical values against published tables.

Sources: MacKinnon (2010), Queen's Economics Department WP 1227, Table 2 (N = 1),
asymptotic values; Dickey & Fuller (1981), Econometrica 49(4), Tables IV-VI
(values from memory, reproduced by a 40,000-replication simulation within ±0.15,
as recorded in the project's reference notes).
"""

from __future__ import annotations

import itertools
import math

import pytest

from tauscope.engine.distributions.critical import (
    normal_lower,
    normal_two_sided,
    phi_critical_value,
    tau_critical_values,
)

# MacKinnon (2010) Table 2, N = 1, asymptotic.
MACKINNON_2010_ASYMPTOTIC = {
    "none": (-2.56574, -1.94100, -1.61682),
    "constant": (-3.43035, -2.86154, -2.56677),
    "trend": (-3.95877, -3.41049, -3.12705),
}


@pytest.mark.parametrize("spec", sorted(MACKINNON_2010_ASYMPTOTIC))
def test_asymptotic_tau_values_equal_mackinnon_2010(spec: str) -> None:
    ours = tau_critical_values(spec, math.inf)
    for level, expected in zip(("1%", "5%", "10%"), MACKINNON_2010_ASYMPTOTIC[spec], strict=True):
        assert ours[level] == pytest.approx(expected, abs=1e-5)


def test_five_percent_without_deterministics_is_minus_1_94() -> None:
    # Common practice: the 5% value without a constant is quoted as -1.94.
    assert round(tau_critical_values("none", math.inf)["5%"], 2) == -1.94


@pytest.mark.parametrize("nobs", [25, 50, 100, 250, math.inf])
def test_adding_constant_then_trend_moves_critical_value_left(nobs: float) -> None:
    for level in ("1%", "5%", "10%"):
        none = tau_critical_values("none", nobs)[level]
        constant = tau_critical_values("constant", nobs)[level]
        trend = tau_critical_values("trend", nobs)[level]
        assert trend < constant < none


def test_finite_sample_tau_close_to_fuller_table() -> None:
    # Fuller (1976) Table 8.5.2, n = 100, 5% (from memory): -1.95, -2.89, -3.45.
    assert tau_critical_values("none", 100)["5%"] == pytest.approx(-1.95, abs=0.02)
    assert tau_critical_values("constant", 100)["5%"] == pytest.approx(-2.89, abs=0.02)
    assert tau_critical_values("trend", 100)["5%"] == pytest.approx(-3.45, abs=0.02)


# Dickey & Fuller (1981) Tables IV-VI (from memory): (n, alpha) -> value.
DF1981 = {
    "phi1": {
        (25, 0.10): 4.12,
        (25, 0.05): 5.18,
        (25, 0.01): 7.88,
        (50, 0.05): 4.86,
        (100, 0.05): 4.71,
        (250, 0.05): 4.63,
        (500, 0.05): 4.61,
        (100, 0.01): 6.70,
        (100, 0.10): 3.86,
    },
    "phi2": {
        (25, 0.05): 5.68,
        (50, 0.05): 5.13,
        (100, 0.05): 4.88,
        (250, 0.05): 4.75,
        (500, 0.05): 4.71,
        (100, 0.01): 6.50,
        (100, 0.10): 4.16,
    },
    "phi3": {
        (25, 0.05): 7.24,
        (50, 0.05): 6.73,
        (100, 0.05): 6.49,
        (250, 0.05): 6.34,
        (500, 0.05): 6.30,
        (100, 0.01): 8.73,
        (100, 0.10): 5.47,
    },
}


@pytest.mark.parametrize("name", sorted(DF1981))
def test_phi_critical_values_reproduce_dickey_fuller_1981(name: str) -> None:
    for (n, alpha), expected in DF1981[name].items():
        assert phi_critical_value(name, n, alpha) == pytest.approx(expected, abs=1e-12)


@pytest.mark.parametrize("name", ["phi1", "phi2", "phi3"])
@pytest.mark.parametrize("alpha", [0.01, 0.05, 0.10])
def test_phi_critical_values_move_monotonically_between_rows(name: str, alpha: float) -> None:
    sizes = list(range(25, 1001, 5))
    values = [phi_critical_value(name, n, alpha) for n in sizes]
    # The tables fall with n, so the interpolation must never rise.
    assert all(b <= a + 1e-12 for a, b in itertools.pairwise(values))
    assert phi_critical_value(name, 10_000_000, alpha) == pytest.approx(
        phi_critical_value(name, math.inf, alpha), abs=1e-3
    )
    # Smaller levels give larger upper-tail critical values.
    assert (
        phi_critical_value(name, 80, 0.01)
        > phi_critical_value(name, 80, 0.05)
        > phi_critical_value(name, 80, 0.10)
    )


def test_normal_values() -> None:
    # Standard normal quantiles (any statistics table).
    assert normal_lower(0.05) == pytest.approx(-1.644854, abs=1e-6)
    assert normal_two_sided(0.05) == pytest.approx(1.959964, abs=1e-6)
