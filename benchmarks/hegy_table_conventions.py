"""Which conventions reproduce Hylleberg, Engle, Granger & Yoo (1990), Table 1a (t_π1,
t_π2) and Table 1b (F_π3π4), and how precise the published table is itself.

    python benchmarks/hegy_table_conventions.py [--reps 100000] [--presample 0,200,400,700]

Prints, not a speed figure:

1. the variance of the t statistics: the seasonal-dummies case at n = 48 (which does not
   depend on where the walks start) with the OLS s² = RSS/(m − K) and with RSS/m;
2. where the walks start (cases without seasonal dummies): for each ``--presample`` (the
   walks start that many quarters before the series), the mean and largest
   |published − ours| over the 96 t cells and the 48 F cells, and how many exceed 0.05;
3. the published table against itself: without deterministic terms and with seasonal
   dummies t_π1 and t_π2 have one distribution (y_t → (−1)^t y_t swaps frequencies 0 and
   π), so the table prints each quantile twice; the spread of the 32 pairs gives the
   table's own standard error per cell and the replications that would give it.

The published figures are those checked in tests/test_engine_seasonal_critical.py.
"""

from __future__ import annotations

import argparse
import importlib.util
import math
from pathlib import Path
from types import ModuleType

import numpy as np

from tauscope.engine.seasonal.critical import simulate
from tauscope.engine.seasonal.design import n_deterministic, statistics_for

SEED = 20251202
SIZES = (0.01, 0.025, 0.05, 0.10)
LENGTHS = (48, 100, 136, 200)


def _published() -> ModuleType:
    path = Path(__file__).resolve().parent.parent / "tests" / "test_engine_seasonal_critical.py"
    spec = importlib.util.spec_from_file_location("published_seasonal_tables", path)
    assert spec is not None and spec.loader is not None
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def _scale(deterministic: str, n: int) -> float:
    m = n - 4
    return math.sqrt(m / (m - 4 - n_deterministic(deterministic, 4)))


def variance_convention(tables: ModuleType, reps: int) -> None:
    names = [s.name for s in statistics_for(4)]
    draws = simulate(4, "dummies", 48, 0, reps, SEED)
    col = draws[:, names.index("t_pi1")]
    published = tables.HEGY_1A[("t_pi1", "dummies")][48]
    ols = [float(np.quantile(col, p)) for p in SIZES]
    rss_m = [q * _scale("dummies", 48) for q in ols]
    print("1. t_pi1, seasonal dummies, n = 48 (1, 2.5, 5, 10%)")
    print("   published      " + "  ".join(f"{v:7.3f}" for v in published))
    print("   ours, OLS s2   " + "  ".join(f"{v:7.3f}" for v in ols))
    print("   ours, RSS/m    " + "  ".join(f"{v:7.3f}" for v in rss_m))


def start_values(tables: ModuleType, reps: int, presamples: list[int]) -> None:
    names = [s.name for s in statistics_for(4)]
    print("2. cases without seasonal dummies, t with RSS/m: |published - ours|")
    for presample in presamples:
        t_gaps: list[float] = []
        f_gaps: list[float] = []
        for deterministic in ("none", "constant", "trend"):
            for n in LENGTHS:
                draws = simulate(4, deterministic, n, 0, reps, SEED, presample)
                for stat in ("t_pi1", "t_pi2"):
                    col = draws[:, names.index(stat)] * _scale(deterministic, n)
                    for p, value in zip(SIZES, tables.HEGY_1A[(stat, deterministic)][n], strict=True):
                        if value is not None:
                            t_gaps.append(abs(value - float(np.quantile(col, p))))
                col = draws[:, names.index("F_pi3_pi4")]
                for p, value in zip(tables.F_SIZES, tables.HEGY_1B[deterministic][n], strict=True):
                    f_gaps.append(abs(value - float(np.quantile(col, 1.0 - p))))
        t, f = np.array(t_gaps), np.array(f_gaps)
        print(f"   start {presample:4d} quarters back: t cells {t.size}: mean {t.mean():.3f}, "
              f"max {t.max():.3f}, over 0.05: {(t > 0.05).sum()} | F cells {f.size}: "
              f"mean {f.mean():.3f}, max {f.max():.3f}, over 0.05: {(f > 0.05).sum()}")


def published_twins(tables: ModuleType, reps: int) -> None:
    differences = np.array([
        [a - b for a, b in zip(tables.HEGY_1A[("t_pi1", d)][n], tables.HEGY_1A[("t_pi2", d)][n],
                               strict=True)]
        for d in ("none", "dummies") for n in LENGTHS])
    print("3. the published t_pi1 and t_pi2 twins (32 pairs)")
    print(f"   root mean square difference {math.sqrt(float(np.mean(differences ** 2))):.3f}, "
          f"largest {float(np.abs(differences).max()):.2f}")
    for i, p in enumerate(SIZES):
        se_published = math.sqrt(float(np.mean(differences[:, i] ** 2)) / 2.0)
        ours = [tables._quantile(simulate(4, d, 100, 0, reps, SEED)[:, 0], p)[1]
                for d in ("none", "dummies")]
        se_ours = float(np.mean(ours))
        implied = reps * (se_ours / se_published) ** 2
        print(f"   {p:5.3f}: published s.e. per cell {se_published:.4f}; ours {se_ours:.4f} "
              f"at {reps:,} replications; the published one would take about {implied:,.0f}")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--reps", type=int, default=100_000)
    parser.add_argument("--presample", default="0,200,400,700")
    args = parser.parse_args()
    tables = _published()
    variance_convention(tables, args.reps)
    start_values(tables, args.reps, [int(v) for v in args.presample.split(",")])
    published_twins(tables, args.reps)


if __name__ == "__main__":
    main()
