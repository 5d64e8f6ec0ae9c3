"""Speed of the simulated null distribution against a plain loop over statsmodels, same run.

    python benchmarks/null_distribution.py [--reps 100000] [--nobs 100] [--loop 300]

Times

- tauscope.engine.null_distribution: ``reps`` driftless random walks at once, τ of the
  Dickey-Fuller regression (lag 0) for all three specifications plus Φ1, Φ2, Φ3, with
  the cache cleared first;
- a plain Python loop calling statsmodels' ``adfuller(x, maxlag=0, autolag=None)`` (one
  specification, constant only) on ``loop`` random walks, scaled to ``reps``;

checks that both give the same 5% critical value within Monte Carlo error, and prints the
two times and their ratio.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import time

import numpy as np
from statsmodels.tsa.stattools import adfuller

from tauscope.engine.distributions import simulate


def time_vectorised(nobs: int, reps: int, seed: int) -> tuple[float, np.ndarray]:
    simulate._simulate.cache_clear()
    simulate.null_distribution.cache_clear()
    start = time.perf_counter()
    draws = simulate.null_distribution("constant", nobs, reps=reps, seed=seed)
    return time.perf_counter() - start, draws


def time_loop(nobs: int, count: int, seed: int) -> tuple[float, np.ndarray]:
    rng = np.random.default_rng(seed)
    taus = np.empty(count)
    start = time.perf_counter()
    for i in range(count):
        x = np.concatenate([[0.0], np.cumsum(rng.standard_normal(nobs))])  # nobs + 1 values
        taus[i] = adfuller(x, maxlag=0, autolag=None, regression="c", result_object=False)[0]
    return time.perf_counter() - start, taus


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--reps", type=int, default=100_000)
    parser.add_argument("--nobs", type=int, default=100)
    parser.add_argument("--loop", type=int, default=300)
    args = parser.parse_args()

    fast_time, draws = time_vectorised(args.nobs, args.reps, seed=1)
    loop_time, loop_taus = time_loop(args.nobs, args.loop, seed=2)
    scaled = loop_time * args.reps / args.loop

    print(f"null distribution, T = {args.nobs}, {args.reps:,} replications")
    print(f"  tauscope (vectorised, 3 specs + Φ1-Φ3): {fast_time:8.3f} s")
    print(f"  statsmodels adfuller loop, {args.loop} reps:  {loop_time:8.3f} s"
          f"  -> scaled to {args.reps:,}: {scaled:8.1f} s")
    print(f"  ratio loop / tauscope: {scaled / fast_time:,.0f}x")
    print(f"  5% critical value, tauscope: {np.quantile(draws, 0.05):.3f}; "
          f"loop ({args.loop} reps, rough): {np.quantile(loop_taus, 0.05):.3f}")


if __name__ == "__main__":
    main()
