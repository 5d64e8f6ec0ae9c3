"""How the verdict fares with one shift in level, and how often a random walk is called
stationary with a break (issue 14, item 3).  Fixed seeds; prints rates, not timings.

Processes (T = 200 by default, Gaussian shocks e_t ~ N(0, 1), 100 values of burn-in):

* level shift: y_t = 3 + 5·1(t ≥ T/2) + u_t, u_t = 0.5 u_{t−1} + e_t (a shift of five shock
  standard deviations halfway); the right verdict is I(0) around a mean that shifts;
* random walk: y_t = y_{t−1} + e_t; the wrong verdict counted is "stationary with a break";
* random walk with a jump of 10 shock standard deviations at 60% of the sample (a break
  under the null: the break test must not explain the unit root away);
* ARIMA(1,1,0), Δy_t = 0.5 Δy_{t−1} + e_t (serially correlated changes);
* AR(0.5) around a mean, no break (the break reading must leave it alone).

Run: PYTHONPATH=desktop python benchmarks/break_verdicts.py [--reps 300] [--length 200]
"""

from __future__ import annotations

import argparse
import time
from collections import Counter

import numpy as np
import pandas as pd

from tauscope.engine import Settings
from tauscope.engine.procedure.analyse import analyse_series
from tauscope.engine.reading.breaks import capped_agreement

SEED = 20_140_314
SHIFT = 5.0


def level_shift(rng: np.random.Generator, reps: int, length: int, shift: float = SHIFT) -> np.ndarray:
    e = rng.standard_normal((reps, length + 100))
    u = np.empty_like(e)
    u[:, 0] = e[:, 0]
    for t in range(1, e.shape[1]):
        u[:, t] = 0.5 * u[:, t - 1] + e[:, t]
    return 3.0 + shift * (np.arange(length) >= length // 2) + u[:, 100:]


def random_walk(rng: np.random.Generator, reps: int, length: int) -> np.ndarray:
    return np.cumsum(rng.standard_normal((reps, length)), axis=1)


def walk_with_jump(rng: np.random.Generator, reps: int, length: int) -> np.ndarray:
    return random_walk(rng, reps, length) + 10.0 * (np.arange(length) >= int(0.6 * length))


def arima110(rng: np.random.Generator, reps: int, length: int) -> np.ndarray:
    return np.cumsum(level_shift(rng, reps, length, 0.0) - 3.0, axis=1)


def measure(series: np.ndarray, settings: Settings, true_order: int,
            true_break: int | None = None) -> dict[str, float]:
    """Shares over the series: verdicts, the break check's outcomes and the badges."""
    length = series.shape[1]
    index = pd.period_range("1960Q1", periods=length, freq="Q")
    counts: Counter[str] = Counter()
    for values in series:
        result = analyse_series(pd.Series(values, index=index), settings=settings, name="x")
        verdict, check = result.verdict, result.breaks
        shifting_mean = verdict.order == 0 and verdict.deterministic == "constant"
        right = shifting_mean if true_order == 0 else verdict.order == true_order
        counts["right verdict"] += right
        counts["order 0, around a (shifting) mean"] += shifting_mean
        counts["I(0) of any kind"] += verdict.order == 0
        counts["I(1)"] += verdict.order == 1
        counts["confirmed and wrong"] += verdict.agreement == "confirmed" and not right
        capped = capped_agreement(verdict.agreement, check)
        counts["confirmed and wrong, badge capped (reading/breaks.py)"] += capped == "confirmed" and not right
        if check is None:
            continue
        counts["break suspected"] += check.suspected
        for reason in check.reasons:
            counts[f"  sign: {reason}"] += 1
        counts["stationary with a break"] += check.stationary_with_break
        if true_break is not None and check.test is not None and check.stationary_with_break:
            counts["  break dated within 2 periods"] += abs(check.test.first_new - true_break) <= 2
    return {key: value / series.shape[0] for key, value in sorted(counts.items())}


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--reps", type=int, default=300)
    parser.add_argument("--length", type=int, default=200)
    args = parser.parse_args()
    settings = Settings()
    rng = np.random.default_rng(SEED)
    n = args.length
    for name, data, order, true_break in (
        ("level shift (AR 0.5, 5σ at mid-sample)", level_shift(rng, args.reps, n), 0, n // 2),
        ("random walk (no break)", random_walk(rng, args.reps, n), 1, None),
        ("random walk with a 10σ jump at 60%", walk_with_jump(rng, args.reps, n), 1, None),
        ("ARIMA(1,1,0), φ = 0.5", arima110(rng, args.reps, n), 1, None),
        ("AR(0.5) around a mean, no break", level_shift(rng, args.reps, n, 0.0), 0, None),
    ):
        start = time.perf_counter()
        shares = measure(data, settings, order, true_break)
        print(f"{name}, T = {n}, {args.reps} series ({time.perf_counter() - start:.0f} s)")
        for key, share in shares.items():
            print(f"  {key:<58} {share:6.1%}")


if __name__ == "__main__":
    main()
