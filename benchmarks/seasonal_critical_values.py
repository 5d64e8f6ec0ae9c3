"""Speed of the simulated seasonal unit-root critical values against a statsmodels loop, same run.

    python benchmarks/seasonal_critical_values.py [--reps 20000] [--loop 200]

For quarterly series (HEGY 1990, n = 200) and monthly series (Beaulieu & Miron 1993,
n = 240), with seasonal means in the regression and no lags, times

- tauscope.engine.seasonal.critical: ``reps`` seasonal random walks at once, every
  statistic (t_π1, t_π2, the F for each pair, the joint F's), cache cleared first;
- a plain Python loop: build the regressors of each walk with numpy and fit them with
  statsmodels OLS (t values and one F test per pair), on ``loop`` walks, scaled to ``reps``;

checks that both give the same 5% critical value of t_π1 within Monte Carlo error, and
prints the two times and their ratio.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import time

import numpy as np
import statsmodels.api as sm

from tauscope.engine.seasonal import critical as seasonal_critical
from tauscope.engine.seasonal.design import build, deterministic_columns, statistics_for


def time_batched(period: int, n: int, reps: int) -> tuple[float, np.ndarray]:
    seasonal_critical._simulate.cache_clear()
    start = time.perf_counter()
    draws = seasonal_critical.simulate(period, "dummies", n, 0, reps, seed=1)
    return time.perf_counter() - start, draws[:, 0]


def time_loop(period: int, n: int, count: int) -> tuple[float, np.ndarray]:
    stats = statistics_for(period)
    det = deterministic_columns("dummies", np.arange(period, n), period)
    walks = np.concatenate(list(seasonal_critical.seasonal_random_walks(period, n, count, 2)))
    t_pi1 = np.empty(count)
    start = time.perf_counter()
    for i in range(count):
        dep, regs, _ = build(walks[i : i + 1], period, 0)
        x = np.column_stack([regs[0], det])
        res = sm.OLS(dep[0], x).fit()
        t_pi1[i] = res.tvalues[0]
        for stat in stats:
            if stat.kind == "F":
                restriction = np.zeros((len(stat.columns), x.shape[1]))
                restriction[np.arange(len(stat.columns)), list(stat.columns)] = 1.0
                res.f_test(restriction)
    return time.perf_counter() - start, t_pi1


def main() -> None:
    parser = argparse.ArgumentParser(
        description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter
    )
    parser.add_argument("--reps", type=int, default=20_000)
    parser.add_argument("--loop", type=int, default=200)
    args = parser.parse_args()
    for period, n in ((4, 200), (12, 240)):
        fast, draws = time_batched(period, n, args.reps)
        slow, loop_draws = time_loop(period, n, args.loop)
        scaled = slow * args.reps / args.loop
        print(f"period {period}, n = {n}, {args.reps:,} replications, seasonal means")
        print(f"  tauscope (batched, every statistic):   {fast:8.3f} s")
        print(
            f"  statsmodels OLS loop, {args.loop} walks:      {slow:8.3f} s"
            f"  -> scaled to {args.reps:,}: {scaled:8.1f} s"
        )
        print(f"  ratio: {scaled / fast:8.1f}x")
        q_fast = float(np.quantile(draws, 0.05))
        q_loop = float(np.quantile(loop_draws, 0.05))
        print(f"  5% critical value of t_pi1: {q_fast:.3f} (batched), {q_loop:.3f} (loop)")


if __name__ == "__main__":
    main()
