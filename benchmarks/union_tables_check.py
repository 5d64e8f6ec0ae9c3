"""The union's table against direct simulation at lengths off its grid.

For each length (default 33, 87, 173, 333) it simulates the union's null, the trend test's
null and the power at φ = 0.95 directly (the generator's functions, same seeds), reads the
same quantities from the table, linear in 1/T and by the response surface
q = b_0 + b_1/T + b_2/T², and prints each difference and its size in units of the
combined Monte Carlo standard error √(SE_direct² + SE_table²) (batch means, binomial for
power; a component's cv has no SE in the table, whose replications equal the direct ones
here, so its combined SE is √2 · SE_direct).  A |z| mostly below 2 means the interpolation
error is below the simulation error.

    python benchmarks/union_tables_check.py [--lengths 33 87 173 333] [--null-reps 400000]
"""

from __future__ import annotations

import argparse

import numpy as np

from tauscope.engine.unitroot import union_table as table
from tauscope.engine.unitroot import union_tables_make as make
from tauscope.engine.unitroot.union import COMPONENTS, union_null
from tauscope.engine.unitroot.union_lookup import bracket, lookup


def _table_se(name: str, length: int, alpha: float, index: int) -> float:
    """The larger SE of the two grid rows around ``length`` (an interpolated value's SE is
    at most that)."""
    where = bracket(length)
    assert where is not None
    out = []
    for t in where[:2]:
        if name == "null":
            row = table.NULL[t][alpha]
            out.append(row[4] if index else row[3])
        elif name == "trend":
            trend = table.TREND[t][alpha]
            out.append(trend[3] if index else trend[2])
        else:
            out.append(table.POWER[t][alpha][4])
    return float(max(out))


def check(length: int, null_reps: int, trend_reps: int, power_reps: int) -> list[tuple[str, float, float, float]]:
    """Rows (quantity, direct, |linear − direct| / SE, |surface − direct| / SE)."""
    draws = union_null(length, null_reps, make.DEFAULT_SEED, COMPONENTS["four"])
    null = make.null_summary(draws)
    cv_se = {alpha: [make._se([float(np.quantile(b[:, j], alpha)) for b in make._batches(draws)])
                     for j in range(4)] for alpha in make.ALPHAS}
    trend = make.trend_entry(length, trend_reps)
    power = make.power_entry(length, {a: v[:3] for a, v in null.items()}, power_reps)
    rows = []
    for alpha in make.ALPHAS:
        cvs, k4, k2, se4, se2 = null[alpha]
        for kind, kappa, se, index in (("four", k4, se4, 0), ("two", k2, se2, 1)):
            combined = float(np.hypot(se, _table_se("null", length, alpha, index)))
            lin = lookup("null", length, alpha, kind, "linear")
            sur = lookup("null", length, alpha, kind, "surface")
            assert lin is not None and sur is not None
            rows.append((f"kappa {kind} a={alpha}", kappa, abs(lin[-1] - kappa) / combined,
                         abs(sur[-1] - kappa) / combined))
            if kind == "four":
                for j, cv in enumerate(cvs):
                    combined_cv = float(np.sqrt(2.0) * cv_se[alpha][j])
                    rows.append((f"cv{j} a={alpha}", cv, abs(lin[j] - cv) / combined_cv,
                                 abs(sur[j] - cv) / combined_cv))
        walk, noise, se_walk, se_noise = trend[alpha]
        lin_t = lookup("trend", length, alpha, "four", "linear")
        sur_t = lookup("trend", length, alpha, "four", "surface")
        assert lin_t is not None and sur_t is not None
        for j, (value, se) in enumerate(((walk, se_walk), (noise, se_noise))):
            combined = float(np.hypot(se, _table_se("trend", length, alpha, j)))
            rows.append((f"trend {'I(1)' if j == 0 else 'I(0)'} a={alpha}", value,
                         abs(lin_t[j] - value) / combined, abs(sur_t[j] - value) / combined))
        rates = power[alpha]
        for kind, offset in (("four", 0), ("two", 2)):
            lin_p = lookup("power", length, alpha, kind)
            assert lin_p is not None
            for j in range(2):
                combined = float(np.hypot(rates[4], _table_se("power", length, alpha, 0)))
                rows.append((f"power {kind} {'union' if j == 0 else 'trend'} a={alpha}", rates[offset + j],
                             abs(lin_p[j] - rates[offset + j]) / combined, float("nan")))
    return rows


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--lengths", type=int, nargs="+", default=[33, 87, 173, 333])
    parser.add_argument("--null-reps", type=int, default=make.NULL_REPS)
    parser.add_argument("--trend-reps", type=int, default=make.TREND_REPS)
    parser.add_argument("--power-reps", type=int, default=make.POWER_REPS)
    args = parser.parse_args()
    worst = {"linear": 0.0, "surface": 0.0}
    over2 = {"linear": 0, "surface": 0}
    count = 0
    for length in args.lengths:
        print(f"T = {length}")
        for name, direct, z_lin, z_sur in check(length, args.null_reps, args.trend_reps, args.power_reps):
            label = "probit in T" if name.startswith("power") else "linear"
            print(f"  {name:28s} direct {direct:9.5f}   |z| {label} {z_lin:5.2f}   surface {z_sur:5.2f}")
            count += 1
            worst["linear"] = max(worst["linear"], z_lin)
            over2["linear"] += z_lin > 2
            if np.isfinite(z_sur):
                worst["surface"] = max(worst["surface"], z_sur)
                over2["surface"] += z_sur > 2
    print("(power rows: interpolated on the probit scale, linear in T; no surface)")
    for method in ("linear", "surface"):
        print(f"{method}: largest |z| {worst[method]:.2f}; |z| > 2 in {over2[method]} of {count} "
              f"(about 5% expected from simulation error alone)")


if __name__ == "__main__":
    main()
