"""The seasonal unit-root null table against direct simulation at lengths between its grid points.

    python benchmarks/seasonal_table_check.py [--reps 100000] [--cases 12:200 4:120 ...] [--lags 0 4 8]

For each case (period:length, off the grid of ``seasonal/table_grid.py``) and lag order, the
1, 5 and 10% critical values of every statistic (seasonal dummies) read from the table
(interpolated in 1/df) against those of ``critical.simulate`` at that length with ``--reps``
replications and another seed; prints the largest difference per statistic and the
batch-means standard errors of the table's 1% values (``table_grid.table_errors``), the precision of a cell.
A difference is interpolation error plus the noise of both simulations.  Nothing here is a
pass/fail threshold.
"""

from __future__ import annotations

import argparse
import math
import time

import numpy as np

from tauscope.engine.distributions.exact_grid import quantile_at
from tauscope.engine.seasonal.critical import LEVELS, simulate_lags
from tauscope.engine.seasonal.design import statistics_for
from tauscope.engine.seasonal.table_grid import (
    DETERMINISTIC,
    seasonal_quantiles,
    table_errors,
    table_reps,
)

SEED = 20261203  # not the table's
BATCHES = 10


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--reps", type=int, default=100_000)
    parser.add_argument("--cases", nargs="+", default=["12:200", "12:100", "4:120", "4:60"])
    parser.add_argument("--lags", type=int, nargs="+", default=[0, 4, 8])
    args = parser.parse_args()
    print(f"table: {table_reps():,} replications a cell; direct: {args.reps:,}, seed {SEED}")
    for period in (4, 12):
        se = np.array(list(table_errors(period).values()))
        if se.size:
            names = [s.name for s in statistics_for(period)]
            worst = {name: float(se[:, i].max()) for i, name in enumerate(names)}
            print(f"S = {period}: largest batch-means SE of a cell's 1% value: "
                  + ", ".join(f"{k} {v:.4f}" for k, v in worst.items()))
    for case in args.cases:
        period, length = (int(v) for v in case.split(":"))
        lags = tuple(p for p in args.lags if seasonal_quantiles(period, DETERMINISTIC, length, p)
                     is not None)
        if not lags:
            print(f"S = {period}, n = {length}: not covered by the table")
            continue
        start = time.process_time()
        draws = simulate_lags(period, DETERMINISTIC, length, lags, args.reps, SEED)
        cpu = time.process_time() - start
        for p in lags:
            read = seasonal_quantiles(period, DETERMINISTIC, length, p)
            assert read is not None
            gaps = []
            for i, stat in enumerate(statistics_for(period)):
                for size in LEVELS.values():
                    prob = size if stat.kind == "t" else 1.0 - size
                    direct = float(np.quantile(draws[p][:, i], prob))
                    gaps.append((abs(quantile_at(read[stat.name], prob) - direct), stat.name, size))
            worst_t = max(g for g in gaps if g[1].startswith("t_"))
            worst_f = max(g for g in gaps if g[1].startswith("F_"))
            at1 = max(g[0] for g in gaps if g[2] == 0.01 and g[1].startswith("t_"))
            parts = np.array_split(draws[p][:, 0], BATCHES)
            noise = float(np.std([np.quantile(part, 0.01) for part in parts], ddof=1)
                          / math.sqrt(BATCHES))
            print(f"S = {period}, n = {length}, p = {p}: largest |table − direct| t "
                  f"{worst_t[0]:.4f} ({worst_t[1]} {worst_t[2]:.0%}), F {worst_f[0]:.4f} "
                  f"({worst_f[1]} {worst_f[2]:.0%}); t at 1% {at1:.4f} (direct's own SE of "
                  f"t_pi1 at 1%: {noise:.4f})  [{cpu:.0f} s CPU direct]")


if __name__ == "__main__":
    main()
