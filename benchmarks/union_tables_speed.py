"""What a new series length costs the union: direct simulation against the table, same run.

    python benchmarks/union_tables_speed.py [--count 20] [--first 101]

For ``count`` lengths never seen before in the process (``first``, ``first`` + 7, …) it
times, per length and at α = 5%, the union's constants (four components), the trend test's
critical value (MAIC, the union's lag maximum) and the union's power against AR(1)
φ = 0.95 — once simulated directly at the length (``source="simulate"``, what every new
length cost before the table) and once read from the table (``source="table"``), and
prints both totals and their ratio.  Then the first ``union_orders`` call on ``rows``
random walks of a new length (differences 2, 1, 0: three lengths' constants and the trend
test's critical values), ``critical="simulate"`` against the table, and the power for the
series' length as the badge asks for it.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import time

import numpy as np

from tauscope.engine.unitroot.trend_robust import trend_critical_value
from tauscope.engine.unitroot.union import (
    max_lags_schwert,
    union_constants,
    union_orders,
    union_power,
)


def one_length(length: int, source: str) -> float:
    """Seconds for the three quantities at ``length``."""
    start = time.perf_counter()
    union_constants(length, 0.05, "four", source=source)
    trend_critical_value(length, 0.05, "maic", max_lags_schwert(length, None, 6.0), source=source)
    union_power(length, 0.95, "maic", 0.05, source=source)
    return time.perf_counter() - start


def first_call(xs: np.ndarray, critical: str) -> float:
    """Seconds for ``union_orders`` and the power at the series' length, at a new length."""
    start = time.perf_counter()
    union_orders(xs, critical=critical)
    union_power(xs.shape[1], 0.95, source="simulate" if critical == "simulate" else "table")
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--count", type=int, default=20)
    parser.add_argument("--first", type=int, default=101)
    parser.add_argument("--step", type=int, default=7)
    parser.add_argument("--rows", type=int, default=500)
    parser.add_argument("--length", type=int, default=241)
    args = parser.parse_args()
    lengths = [args.first + args.step * i for i in range(args.count)]
    table = sum(one_length(n, "table") for n in lengths)
    direct = sum(one_length(n, "simulate") for n in lengths)
    print(f"{len(lengths)} new lengths ({lengths[0]}..{lengths[-1]}): constants + trend critical value + power")
    print(f"  simulated directly: {direct:8.3f} s ({direct / len(lengths):.3f} s per length)")
    print(f"  from the table:     {table:8.4f} s ({1000 * table / len(lengths):.3f} ms per length)")
    print(f"  ratio: {direct / table:,.0f}x")
    walks = np.cumsum(np.random.default_rng(5).standard_normal((args.rows, args.length)), axis=1)
    with_table = first_call(walks, "finite")
    again = first_call(walks, "finite")
    simulated = first_call(walks[:, :-1], "simulate")  # another new length
    print(f"union_orders + power, {args.rows} x {args.length}, first call at a new length:")
    print(f"  simulated directly: {simulated:8.3f} s")
    print(f"  from the table:     {with_table:8.3f} s (second call, same length: {again:.3f} s)")
    print(f"  ratio: {simulated / with_table:.1f}x")


if __name__ == "__main__":
    main()
