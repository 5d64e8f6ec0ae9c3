"""What a new series length costs the union: direct simulation against the table, same run.

    python benchmarks/union_tables_speed.py [--count 20] [--first 101]

For ``count`` lengths never seen before in the process (``first``, ``first`` + 7, …) it
times, per length and at α = 5%, the union's constants (four components), the trend test's
critical value (MAIC, the union's lag maximum) and the union's power against AR(1)
φ = 0.95 — once simulated directly at the length (``source="simulate"``, what every new
length cost before the table) and once read from the table (``source="table"``), and
prints both totals and their ratio.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import time

from tauscope.engine.unitroot.trend_robust import trend_critical_value
from tauscope.engine.unitroot.union import max_lags_schwert, union_constants, union_power


def one_length(length: int, source: str) -> float:
    """Seconds for the three quantities at ``length``."""
    start = time.perf_counter()
    union_constants(length, 0.05, "four", source=source)
    trend_critical_value(length, 0.05, "maic", max_lags_schwert(length, None, 6.0), source=source)
    union_power(length, 0.95, "maic", 0.05, source=source)
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--count", type=int, default=20)
    parser.add_argument("--first", type=int, default=101)
    parser.add_argument("--step", type=int, default=7)
    args = parser.parse_args()
    lengths = [args.first + args.step * i for i in range(args.count)]
    table = sum(one_length(n, "table") for n in lengths)
    direct = sum(one_length(n, "simulate") for n in lengths)
    print(f"{len(lengths)} new lengths ({lengths[0]}..{lengths[-1]}): constants + trend critical value + power")
    print(f"  simulated directly: {direct:8.3f} s ({direct / len(lengths):.3f} s per length)")
    print(f"  from the table:     {table:8.4f} s ({1000 * table / len(lengths):.3f} ms per length)")
    print(f"  ratio: {direct / table:,.0f}x")


if __name__ == "__main__":
    main()
