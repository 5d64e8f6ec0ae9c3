"""Cost and precision of the simulated ("exact") critical values, same run.

    PYTHONPATH=desktop python benchmarks/exact_values.py [--nobs 100 240] [--loop 200]

For each regression size: the streamed 10⁶-replication quantiles of every τ and Φ
(:func:`tauscope.engine.distributions.exact.streamed_quantiles`, cache cleared first),
their batch-means standard errors, the same at 10,000 replications (what the engine used
before), and a plain loop over statsmodels' ``adfuller`` (constant only) on ``loop``
random walks scaled to 10⁶, as the reference for the time.  MacKinnon (2010) via
statsmodels' ``mackinnoncrit`` is printed beside the simulated 1% values.  Nothing here
is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import time

import numpy as np
from statsmodels.tsa.adfvalues import mackinnoncrit
from statsmodels.tsa.stattools import adfuller

from tauscope.engine.distributions.exact import EXACT_REPS, streamed_quantiles

CODES = {"none": "n", "constant": "c", "trend": "ct"}


def loop_seconds(nobs: int, count: int) -> float:
    rng = np.random.default_rng(7)
    start = time.perf_counter()
    for _ in range(count):
        adfuller(np.cumsum(rng.standard_normal(nobs + 1)), maxlag=0, autolag=None, result_object=False)
    return (time.perf_counter() - start) * EXACT_REPS / count


def main() -> None:
    parser = argparse.ArgumentParser()
    parser.add_argument("--nobs", type=int, nargs="+", default=[100, 240])
    parser.add_argument("--loop", type=int, default=200)
    args = parser.parse_args()
    for nobs in args.nobs:
        for reps in (10_000, EXACT_REPS):
            streamed_quantiles.cache_clear()
            start = time.perf_counter()
            quantiles = streamed_quantiles(nobs, 0, reps, 19790601)
            seconds = time.perf_counter() - start
            worst_tau = max(quantiles[f"tau_{s}"].standard_errors["1%"] for s in CODES)
            worst_phi = max(quantiles[n].standard_errors["1%"] for n in ("phi1", "phi2", "phi3"))
            print(f"nobs {nobs}, {reps:>9,} replications: {seconds:6.2f} s; 1% standard error "
                  f"τ ≤ {worst_tau:.4f}, Φ ≤ {worst_phi:.4f}")
        for spec, code in CODES.items():
            published = mackinnoncrit(N=1, regression=code, nobs=nobs)[0]
            print(f"    τ {spec:8s} 1%: simulated {quantiles[f'tau_{spec}'].values['1%']:.3f}, "
                  f"MacKinnon (2010) {published:.3f}")
        reference = loop_seconds(nobs, args.loop)
        print(f"    a statsmodels loop for {EXACT_REPS:,} τ (one spec): {reference:.1f} s, "
              f"ratio {reference / seconds:.1f}× (all three specs and Φ here)")


if __name__ == "__main__":
    main()
