"""Size of the DF-GLS test (Elliott, Rothenberg & Stock 1996; lag by MAIC, Ng & Perron
2001, up to Schwert's bound) in short samples, with the finite-sample critical values at
the series' own length against what was used before: the asymptotic Dickey-Fuller value
without deterministic terms (−1.95 at 5%) in the constant case, the T = 50 row of ERS
Table 1 below T = 50 in the trend case.

    PYTHONPATH=desktop python benchmarks/dfgls_size.py [--reps 200000] [--loop 2000]

The random walks go through the vectorised simulation of the engine's procedure
(:func:`tauscope.engine.unitroot.dfgls_null.procedure_draws`, seed apart from the one the
surfaces were fitted with); ``loop`` of them also through ``dfgls_test`` one by one, to
check the two agree and to print the time against that reference.
"""

from __future__ import annotations

import argparse
import math
import time

import numpy as np

from tauscope.engine.distributions.dfgls_values import surface_critical_values
from tauscope.engine.unitroot.dfgls import ers_trend_critical_value, table_critical_values
from tauscope.engine.unitroot.dfgls_null import default_max_lags, procedure_draws


def old_value(spec: str, length: int) -> float:
    if spec == "constant":
        return table_critical_values("constant", length, length - 1)["5%"]
    return ers_trend_critical_value(length, 0.05)


def main() -> None:
    parser = argparse.ArgumentParser()
    parser.add_argument("--reps", type=int, default=200_000)
    parser.add_argument("--loop", type=int, default=2_000)
    args = parser.parse_args()
    from tauscope.engine.unitroot.dfgls import dfgls

    for spec, lengths in (("constant", (30, 50, 100)), ("trend", (30, 40, 50))):
        for length in lengths:
            seed = 4242 + length
            start = time.perf_counter()
            draws = procedure_draws(spec, length, args.reps, seed)
            vectorised = time.perf_counter() - start
            shocks = np.random.default_rng(seed).standard_normal((args.loop, length))
            start = time.perf_counter()
            looped = np.array([dfgls(np.cumsum(row), spec, "maic", default_max_lags(length)).statistic
                               for row in shocks])
            loop_time = (time.perf_counter() - start) * args.reps / args.loop
            agree = float(np.max(np.abs(looped - draws[: args.loop])))
            new = surface_critical_values(spec, length)["5%"]
            size_new = float(np.mean(draws < new))
            size_old = float(np.mean(draws < old_value(spec, length)))
            error = math.sqrt(size_new * (1.0 - size_new) / args.reps)
            print(f"{spec:8s} T = {length:3d}: size {size_new:.4f} ± {error:.4f} at {new:.3f} "
                  f"(before: {size_old:.4f} at {old_value(spec, length):.3f}); "
                  f"{vectorised:.1f} s vectorised, loop {loop_time:.1f} s "
                  f"({loop_time / vectorised:.0f}×), largest gap {agree:.1e}")


if __name__ == "__main__":
    main()
