"""The verdict scorecard: how often each strategy's verdict is right on known processes.

    python benchmarks/verdict_scorecard.py [--reps 500] [--quick] [--strategy both]
        [--lag-rule aic] [--union-lag-rule maic] [--alpha 0.05] [--max-lags N] [--lags N]
        [--union-critical finite|asymptotic] [--lengths 50,100,200,500] [--only TEXT]

For every process of :mod:`scorecard_processes` and every length T it simulates
``--reps`` series (fixed seeds: the same series for every strategy and setting) and
prints, per strategy:

* the share of verdicts of each order (I(0), I(1), I(2), unresolved, error);
* the share right on the order, and right on the order and the deterministic terms
  where the process fixes them;
* for unit-root processes, the share called one order too low (the size);
* P(right | badge) and the count for each badge value.

"classic" is the engine's own analysis (``tauscope.engine.analyse_many``, the batched
fast path) with the settings given and strategy "classic"; "engine" is the engine's default
analysis as wired (strategy "union", its own grade); "boot" is the engine with the wild
bootstrap strategy ("bootstrap", Smeekes & Taylor 2012), run beside "engine" on the same
series; "union" is the union of rejections from
:mod:`tauscope.engine.unitroot.union`, graded by the candidate rules of :mod:`scorecard_union`.
Then the acceptance checks of issue 13 with PASS/FAIL, and the badge calibration.
``--quick``: 100 replications, T = 100 and 200, for development.
"""

from __future__ import annotations

import argparse
import sys
import time
import zlib
from collections import defaultdict
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Any

import numpy as np
import pandas as pd

sys.path.insert(0, str(Path(__file__).resolve().parent))

from scorecard_processes import Process, by_name, grid
from scorecard_union import BADGE_RULES, badge, run_union

from tauscope.engine import Settings, analyse_many
from tauscope.engine.unitroot.union import UNION_LAG_SCALE

SEED = 20260513
ACCEPT_POWER = (("AR(1) mean phi=0.5", 100, 0.90, "constant"),
                ("AR(1) mean phi=0.8", 200, 0.85, "constant"),
                ("AR(1) trend phi=0.7", 150, 0.80, "trend"))
# issue 14: (process, T, limit) for I(0) and for a seasonal unit root found
ACCEPT_SEASONAL = (("seasonal AR(1)", 150, 0.85), ("monthly seasonal AR(1)", 150, 0.85))
ACCEPT_SEASONAL_ROOT = (("quarterly seasonal walk", 200, 0.80),)
ORDERS = (0, 1, 2, -1, -2)  # -1 unresolved, -2 error
SHORT = {"confirmed": "conf", "conflict": "cflt", "inconclusive": "inc"}
ORDER_NAMES = {0: "I(0)", 1: "I(1)", 2: "I(2)", -1: "unres", -2: "error"}


@dataclass
class Cell:
    process: Process
    length: int
    order: np.ndarray
    deterministic: list[str | None]
    badge: np.ndarray
    single_adf: np.ndarray | None = None  # a single ADF at alpha with the process's terms
    evidence: dict[str, np.ndarray] = field(default_factory=dict)

    @property
    def right_order(self) -> np.ndarray:
        return np.asarray(self.order == self.process.order)

    @property
    def right(self) -> np.ndarray:
        if self.process.deterministic is None:
            return self.right_order
        det = np.array([d == self.process.deterministic for d in self.deterministic])
        return np.asarray(self.right_order & det)

    @property
    def too_low(self) -> np.ndarray:
        return np.asarray((self.order >= 0) & (self.order < self.process.order))


def simulate(process: Process, length: int, reps: int, seed: int) -> np.ndarray:
    rng = np.random.default_rng([seed, zlib.crc32(process.name.encode()), length])
    return np.asarray(process.make(rng, reps, length), dtype=float)


def dated(xs: np.ndarray, period: int | None) -> list[tuple[str, Any]]:
    """The series as (name, values), with quarterly or monthly dates when ``period`` says so."""
    if period is None:
        return [(f"s{i}", row) for i, row in enumerate(xs)]
    index = pd.period_range("1960Q1" if period == 4 else "1960-01", periods=xs.shape[1],
                            freq="Q" if period == 4 else "M")
    return [(f"s{i}", pd.Series(row, index=index)) for i, row in enumerate(xs)]


def classic_cell(process: Process, length: int, xs: np.ndarray, settings: Settings,
                 period: int | None = None) -> Cell:
    results = analyse_many(dated(xs, process.period or period), settings)
    order = np.array([-2 if r.error else (-1 if r.verdict.order is None else r.verdict.order)
                      for r in results])
    det = [r.verdict.deterministic for r in results]
    grade = np.array([r.verdict.agreement or "none" for r in results])
    spec = "trend" if process.deterministic == "trend" else "constant"
    single = np.array([bool(t.reject) if (t := r.find("adf", spec, 0)) is not None else False
                       for r in results])
    roots = np.array([r.seasonal is not None and r.seasonal.roots is not None
                      and bool(r.seasonal.roots.seasonal_roots) for r in results])
    means = np.array([r.seasonal is not None and r.seasonal.means is not None
                      and r.seasonal.means.used for r in results])
    return Cell(process, length, order, det, grade, single,
                {"seasonal_root": roots, "seasonal_means": means})


def union_cell(process: Process, length: int, xs: np.ndarray, settings: Settings,
               critical: str, classic: Cell | None, rule: str, lag_scale: float,
               components: str, lag_rule: str) -> Cell:
    run = run_union(xs, lag_rule, settings.alpha, settings.max_difference,
                    settings.max_lags, settings.lags, critical,
                    classic.order if classic is not None else None, lag_scale, components)
    return Cell(process, length, run.order, list(run.deterministic),
                badge(run.order, run.evidence, rule), None, run.evidence)


def _pct(x: float) -> str:
    return f"{100 * x:5.1f}" if np.isfinite(x) else "    -"


def print_table(strategy: str, cells: list[Cell]) -> None:
    print(f"\n== {strategy} ==")
    print(f"{'process':28s} {'T':>4s} " + " ".join(f"{ORDER_NAMES[o]:>5s}" for o in ORDERS)
          + "  order  right   low | P(right|badge) n")
    for c in cells:
        shares = " ".join(_pct(float(np.mean(c.order == o))) for o in ORDERS)
        low = _pct(float(np.mean(c.too_low))) if c.process.order > 0 else "    -"
        grades = []
        for g in ("confirmed", "conflict", "inconclusive"):
            mask = c.badge == g
            if mask.any():
                grades.append(f"{SHORT[g]} {_pct(float(np.mean(c.right[mask])))} {int(mask.sum())}")
        print(f"{c.process.name:28s} {c.length:4d} {shares}  {_pct(float(np.mean(c.right_order)))} "
              f"{_pct(float(np.mean(c.right)))} {low} | " + "; ".join(grades))


def volatility(strategy: str, cells: list[Cell], default: dict[tuple[str, int], Cell]) -> None:
    """Issue 14 §4: a random walk whose shock variance changes halfway is called I(0) at most
    8% of the time under the bootstrap strategy; the default strategy's figure beside it."""
    for c in cells:
        if "x3 walk" not in c.process.name and "/3 walk" not in c.process.name:
            continue
        share = float(np.mean(c.order == 0))
        ref = default.get((c.process.name, c.length))
        beside = f"; default strategy {_pct(float(np.mean(ref.order == 0)))}%" if ref is not None else ""
        verdict = ("PASS" if share <= 0.08 else "FAIL") if strategy == "boot" else "    "
        print(f"{verdict} changing volatility: {c.process.name} T={c.length}: I(0) {_pct(share)}% "
              f"(at most 8% under the bootstrap strategy){beside}")


def acceptance(strategy: str, cells: list[Cell], classic: dict[tuple[str, int], Cell],
               default: dict[tuple[str, int], Cell] | None = None) -> None:
    default = default or {}
    print(f"\n-- acceptance: {strategy} --")
    size = [c for c in cells if c.process.unit_root]
    if size:
        worst = max(size, key=lambda c: float(np.mean(c.too_low)))
        share = float(np.mean(worst.too_low))
        print(f"{'PASS' if share <= 0.07 else 'FAIL'} size: worst one-order-too-low "
              f"{_pct(share)}% ({worst.process.name}, T={worst.length}); limit 7%")
        for c in size:
            if float(np.mean(c.too_low)) > 0.07:
                print(f"      over: {c.process.name} T={c.length}: {_pct(float(np.mean(c.too_low)))}%")
    for name, length, limit, _ in ACCEPT_POWER:
        cell = next((c for c in cells if c.process.name == name and c.length == length), None)
        if cell is None:
            continue
        share = float(np.mean(cell.order == 0))
        ref = classic.get((name, length))
        adf = (f"; single 5% ADF {_pct(float(np.mean(ref.single_adf)))}%"
               if ref is not None and ref.single_adf is not None else "")
        print(f"{'PASS' if share >= limit else 'FAIL'} power: {name} T={length}: I(0) "
              f"{_pct(share)}% (at least {100 * limit:.0f}%){adf}")
    volatility(strategy, cells, default)
    for name, length, limit in ACCEPT_SEASONAL:
        cell = next((c for c in cells if c.process.name == name and c.length == length), None)
        if cell is not None:
            share = float(np.mean(cell.order == 0))
            means = cell.evidence.get("seasonal_means")
            used = f"; seasonal means allowed for {_pct(float(np.mean(means)))}%" if means is not None else ""
            print(f"{'PASS' if share >= limit else 'FAIL'} seasonal: {name} T={length}: I(0) "
                  f"{_pct(share)}% (at least {100 * limit:.0f}%){used}")
    for name, length, limit in ACCEPT_SEASONAL_ROOT:
        cell = next((c for c in cells if c.process.name == name and c.length == length), None)
        if cell is not None and "seasonal_root" in cell.evidence:
            share = float(np.mean(cell.evidence["seasonal_root"]))
            print(f"{'PASS' if share >= limit else 'FAIL'} seasonal root: {name} T={length}: found "
                  f"{_pct(share)}% (at least {100 * limit:.0f}%)")
    ma = next((c for c in cells if c.process.name == "ARIMA(0,1,1) theta=-0.8" and c.length == 200), None)
    if ma is not None:
        share = float(np.mean(ma.order == 0))
        print(f"{'PASS' if share <= 0.25 else 'FAIL'} negative MA: theta=-0.8 T=200: I(0) {_pct(share)}% "
              "(at most 25%)")
    badge_check(cells)
    badge_check(cells, order_only=True)


def badge_check(cells: list[Cell], order_only: bool = False, quiet: bool = False) -> tuple[float, float]:
    """Pooled P(right | confirmed) and the worst cell with 20 or more confirmed; "right" is
    the order and the terms (or the order alone with ``order_only``)."""
    def right(c: Cell) -> np.ndarray:
        return c.right_order if order_only else c.right

    hits = np.concatenate([right(c)[c.badge == "confirmed"] for c in cells])
    pooled = float(np.mean(hits)) if hits.size else float("nan")
    worst, where = 1.0, "-"
    for c in cells:
        mask = c.badge == "confirmed"
        if mask.sum() >= 20 and float(np.mean(right(c)[mask])) < worst:
            worst, where = float(np.mean(right(c)[mask])), f"{c.process.name} T={c.length}"
    coverage = hits.size / sum(c.order.size for c in cells)
    ok = pooled >= 0.95 and worst >= 0.90
    what = "order" if order_only else "order and terms"
    if not quiet:
        print(f"{'PASS' if ok else 'FAIL'} badge ({what}): P(right|confirmed) pooled {_pct(pooled)}%, "
              f"worst cell {_pct(worst)}% ({where}); confirmed for {_pct(coverage)}% of series")
    return pooled, worst


def calibration(union_runs: list[tuple[Cell, dict[str, np.ndarray]]]) -> None:
    print("\n-- badge calibration (union): each candidate rule, judged on the order and terms, "
          "then on the order alone --")
    for rule in BADGE_RULES:
        cells = [Cell(c.process, c.length, c.order, c.deterministic, badge(c.order, ev, rule))
                 for c, ev in union_runs]
        print(f"  [{rule}]")
        badge_check(cells)
        badge_check(cells, order_only=True)


def save(path: str, run: dict[str, list[Cell]]) -> None:
    """Every cell's arrays, keyed "strategy|process|T|field", for calibrating the badge offline."""
    arrays: dict[str, Any] = {}
    for strategy, cells in run.items():
        for c in cells:
            key = f"{strategy}|{c.process.name}|{c.length}"
            arrays[f"{key}|order"] = c.order
            arrays[f"{key}|deterministic"] = np.array([d or "" for d in c.deterministic])
            arrays[f"{key}|badge"] = c.badge
            arrays[f"{key}|right"] = c.right
            arrays[f"{key}|right_order"] = c.right_order
            for name, values in c.evidence.items():
                arrays[f"{key}|evidence_{name}"] = values
    np.savez_compressed(path, **arrays)


def main(argv: list[str] | None = None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--reps", type=int, default=500)
    parser.add_argument("--quick", action="store_true")
    parser.add_argument("--lengths", default="50,100,200,500")
    parser.add_argument("--strategy", choices=("classic", "union", "both", "engine", "boot", "all"),
                        default="both",
                        help="classic: the engine with strategy 'classic'; union: the union from its "
                             "functions with the candidate badge rules; engine: the engine's default "
                             "analysis as wired (strategy 'union', its own badge); boot: the engine "
                             "with strategy 'bootstrap' beside the engine's default; all: classic, "
                             "union and engine")
    parser.add_argument("--lag-rule", default=Settings().lag_rule,
                        help="the classic strategy's lag rule (default: the engine's default)")
    parser.add_argument("--union-lag-rule", default="maic")
    parser.add_argument("--alpha", type=float, default=0.05)
    parser.add_argument("--max-lags", type=int, default=None)
    parser.add_argument("--lags", type=int, default=None)
    parser.add_argument("--union-critical", choices=("finite", "asymptotic"), default="finite")
    parser.add_argument("--badge-rule", choices=tuple(BADGE_RULES),
                        default="proposed: strict KPSS + classic + alpha + lags + power95, T >= 150")
    parser.add_argument("--union-components", choices=("four", "two"), default="four",
                        help="four: GLS and OLS detrending (HLT 2012); two: the DF-GLS pair (HLT 2009)")
    parser.add_argument("--union-lag-scale", type=float, default=UNION_LAG_SCALE,
                        help="the union's maximum lag is floor(c (T/100)^(1/4)); 12: Schwert's long rule")
    parser.add_argument("--only", default="",
                        help="only processes whose name contains one of these (comma-separated)")
    parser.add_argument("--seed", type=int, default=SEED)
    parser.add_argument("--seasonal", choices=("automatic", "always", "never"), default="automatic",
                        help="the engine's seasonal setting (classic and engine strategies)")
    parser.add_argument("--period", type=int, choices=(4, 12), default=None,
                        help="give every process quarterly (4) or monthly (12) dates, so that the "
                             "seasonal means test runs on the non-seasonal processes too")
    parser.add_argument("--classic-from", default="",
                        help="take the classic verdicts (for the union's evidence) from a --save file "
                             "instead of running the classic strategy")
    parser.add_argument("--save", default="", help="write every cell's verdicts and evidence to this .npz")
    args = parser.parse_args(argv)
    reps, lengths = args.reps, [int(v) for v in args.lengths.split(",")]
    if args.quick:
        reps, lengths = min(reps, 100), [100, 200]
    settings = Settings(lag_rule=args.lag_rule, alpha=args.alpha, max_lags=args.max_lags,
                        lags=args.lags, power=False, strategy="classic", seasonal=args.seasonal)
    engine_settings = replace(settings, strategy="union", lag_rule=args.union_lag_rule)
    boot_settings = replace(engine_settings, strategy="bootstrap")
    print(f"settings: {settings.to_dict()}; reps {reps}; lengths {lengths}; seed {args.seed}; "
          f"union {args.union_components} components, lag rule {args.union_lag_rule}, "
          f"critical values {args.union_critical}, "
          f"lag scale {args.union_lag_scale}; "
          f"badge rule {args.badge_rule!r}")
    wanted = args.only.split(",")
    jobs = [(p, n) for p in grid() if any(w in p.name for w in wanted) for n in lengths]
    jobs += [(by_name(name), n) for name, n, _, _ in ACCEPT_POWER
             if any(w in name for w in wanted) and (name, n) not in {(p.name, m) for p, m in jobs}]
    jobs += [(by_name(name), n) for name, n, _ in (*ACCEPT_SEASONAL, *ACCEPT_SEASONAL_ROOT)
             if any(w in name for w in wanted) and (name, n) not in {(p.name, m) for p, m in jobs}]
    run: dict[str, list[Cell]] = defaultdict(list)
    classic_by: dict[tuple[str, int], Cell] = {}
    union_runs: list[tuple[Cell, dict[str, np.ndarray]]] = []
    clock = {"classic": 0.0, "union": 0.0, "engine": 0.0, "boot": 0.0}
    saved = np.load(args.classic_from) if args.classic_from else None
    for process, n in jobs:
        xs = simulate(process, n, reps, args.seed)
        classic = None
        if args.strategy in ("classic", "both", "all"):
            start = time.perf_counter()
            classic = classic_cell(process, n, xs, settings, args.period)
            clock["classic"] += time.perf_counter() - start
            run["classic"].append(classic)
            classic_by[(process.name, n)] = classic
        if classic is None and saved is not None:
            key = f"classic|{process.name}|{n}|order"
            if key not in saved or saved[key].size != reps:
                raise SystemExit(f"{args.classic_from} has no classic run of {reps} series for "
                                 f"{process.name}, T = {n} (same --reps, --lengths and --seed needed)")
            order = saved[key]
            classic = Cell(process, n, order, [None] * order.size, np.array(["none"] * order.size))
        if args.strategy in ("engine", "all", "boot"):
            start = time.perf_counter()
            run["engine"].append(classic_cell(process, n, xs, engine_settings, args.period))
            clock["engine"] += time.perf_counter() - start
        if args.strategy == "boot":
            start = time.perf_counter()
            run["boot"].append(classic_cell(process, n, xs, boot_settings))
            clock["boot"] += time.perf_counter() - start
        if args.strategy in ("union", "both", "all"):
            start = time.perf_counter()
            cell = union_cell(process, n, xs, settings, args.union_critical, classic, args.badge_rule,
                              args.union_lag_scale, args.union_components, args.union_lag_rule)
            clock["union"] += time.perf_counter() - start
            run["union"].append(cell)
            union_runs.append((cell, cell.evidence))
    for strategy, cells in run.items():
        print_table(strategy, cells)
    default_by = {(c.process.name, c.length): c for c in run.get("engine", [])}
    for strategy, cells in run.items():
        acceptance(strategy, cells, classic_by, default_by)
    if union_runs:
        calibration(union_runs)
    if args.save:
        save(args.save, run)
    print(f"\ntime: classic {clock['classic']:.1f} s, union (with its evidence) {clock['union']:.1f} s, "
          f"engine default {clock['engine']:.1f} s, bootstrap strategy {clock['boot']:.1f} s")


if __name__ == "__main__":
    main()
