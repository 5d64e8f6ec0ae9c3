"""Configurations of the union of rejections, measured on the scorecard's acceptance rows.

    python benchmarks/union_tuning.py --config NAME [--config NAME ...] [--reps 500]
        [--seed S] [--rows size50,power,ma,size]

Only the verdict's order is computed (no badge evidence), from the engine's own
functions (:mod:`tauscope.engine.unitroot.union`, :mod:`tauscope.engine.unitroot.dfgls_many`)
called with parameters, so a configuration can be tried without changing the engine.
The series are the scorecard's (same generator, same seeds).  A configuration sets:

* ``scale`` c and ``small_scale`` (used below T = 100, default c): maximum lag
  ⌊c (T/100)^{1/4}⌋ (Schwert 1989 form);
* ``null``: "plain" — κ and each cv from driftless random walks without lag augmentation
  (the engine today); "selected" — the same null draws with the data's own lag rule and
  cap applied to them, so the simulated null includes the lag-selection step;
* ``select_on``: "ols" — one lag order per deterministic case, chosen on the OLS-detrended
  series (Perron & Qu 2007, the engine today); "own" — each component's lag order on its
  own detrended series (Ng & Perron 2001 for the GLS pair);
* ``components``: "four" (HLT 2012) or "two" (HLT 2009), or "pretest": the trend test of
  HLT (2007) picks the deterministic case and the union runs over that case's GLS/OLS pair;
* ``null`` may also be "bylag" (each component's cv at its own lag order, Cheung & Lai 1995)
  or "asymptotic" (the engine's large-T table); ``small_null`` replaces it below T = 100;
* ``min_lag`` / ``small_min_lag`` (below T = 100): the smallest lag order the rule may pick
  (chosen on the scorecard; no citation);
* ``rule``: "maic" (Ng & Perron 2001), "aic", "bic", "hqc", "tsig" (Ng & Perron 1995);
* ``statistic`` (the GLS components) and ``ols_statistic`` (the OLS ones): "tau" (the
  Dickey-Fuller t), or an M statistic of Ng & Perron (2001) from the same regression and lag
  (:mod:`tauscope.engine.unitroot.ng_perron_many`): "mzt", "mza", "nmsb" (−1/MSB, so that
  small MSB rejects), "mzt0"/"mza0" with the initial value's term T⁻¹ỹ_1² (needed on
  OLS-detrended series, Perron & Ng 1996; "mzt" on OLS data leaves it out, which is not a
  published statistic).  "msb-ols-short" (= "engine") is the engine's default since the
  M-statistics study (DEVELOPERS.md, "Verdict scorecard"); "tau-union" the union before it.

``--frontier LENGTH:PROCESS`` prints power against the worst size as κ is scaled: it shows
whether any κ at that length meets both rows for a given lag rule and cap.
"""

from __future__ import annotations

import argparse
import sys
import time
from dataclasses import dataclass, replace
from functools import lru_cache
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parent))

from scorecard_processes import by_name, grid
from verdict_scorecard import SEED, simulate

from tauscope.engine.distributions.simulate import DEFAULT_SEED, shock_chunks
from tauscope.engine.regression.lagchoice import choose_lag
from tauscope.engine.unitroot.dfgls_many import (
    VECTOR_RULES,
    dfgls_tau_many,
    lag_criteria_many,
    ols_detrend_many,
)
from tauscope.engine.unitroot.ng_perron_many import m_statistics_many
from tauscope.engine.unitroot.trend_robust import (
    trend_critical_value,
    trend_found,
    trend_statistics,
)
from tauscope.engine.unitroot.union import (
    ASYMPTOTIC,
    COMPONENTS,
    constants_from_draws,
    max_lags_schwert,
    orders_from_rejections,
)
from tauscope.engine.unitroot.union_components import detrended

NULL_REPS = 20_000


@dataclass(frozen=True)
class Config:
    scale: float = 6.0
    small_scale: float | None = None
    null: str = "plain"
    select_on: str = "ols"
    components: str = "four"
    rule: str = "maic"
    alpha: float = 0.05
    min_lag: int = 0
    small_min_lag: int | None = None  # the smallest lag order below T = 100 (default min_lag)
    small_null: str | None = None  # the null below T = 100 (default null)
    statistic: str = "tau"  # the GLS components: "tau" (DF-GLS) or an M statistic "mzt", "mza"
    ols_statistic: str = "tau"  # the OLS components: "tau" or an M statistic on OLS-detrended data

    def cap(self, length: int) -> int:
        c = self.small_scale if (self.small_scale is not None and length < 100) else self.scale
        return max_lags_schwert(length, None, c)

    def null_at(self, length: int) -> str:
        return self.small_null if (self.small_null is not None and length < 100) else self.null

    def floor(self, length: int) -> int:
        small = self.small_min_lag is not None and length < 100
        return int(self.small_min_lag if small else self.min_lag)  # type: ignore[arg-type]


CONFIGS: dict[str, Config] = {
    "engine": Config(ols_statistic="nmsb", small_null="selected", small_min_lag=2),  # as wired
    "tau-union": Config(),  # the union before the M-statistics study: four t statistics
    "selected-null": Config(null="selected"),
    "own-lags": Config(select_on="own"),
    "two": Config(components="two"),
    "two-selected": Config(components="two", null="selected"),
    "scale4": Config(scale=4.0),
    "scale5": Config(scale=5.0),
    "scale8": Config(scale=8.0),
    "scale12": Config(scale=12.0),
    "scale12-selected": Config(scale=12.0, null="selected"),
    "scale8-selected": Config(scale=8.0, null="selected"),
    "scale4-selected": Config(scale=4.0, null="selected"),
    "scale5-selected": Config(scale=5.0, null="selected"),
    # M statistics (Ng & Perron 2001) as components, and the short-sample rule
    "mzt-gls": Config(statistic="mzt"),
    "mzt-all": Config(statistic="mzt", ols_statistic="mzt0"),
    "msb-ols": Config(ols_statistic="nmsb"),
    "msb-ols-short": Config(ols_statistic="nmsb", small_null="selected", small_min_lag=2),
}


def component_lags(xs: np.ndarray, config: Config) -> dict[str, np.ndarray]:
    """Lag order of each component for every row."""
    cap = config.cap(xs.shape[1])
    names = COMPONENTS[config.components]
    if config.select_on == "ols":
        per_case = {spec: _lags_on(ols_detrend_many(xs, spec), config.rule, cap, config.floor(xs.shape[1]))
                    for spec in ("constant", "trend")}
        return {c: per_case[c.split("-")[1]] for c in names}
    out = {}
    for c in names:
        if c.startswith("ols"):
            out[c] = _lags_on(ols_detrend_many(xs, c.split("-")[1]), config.rule, cap, config.floor(xs.shape[1]))
        else:
            out[c] = _lags_on(detrended(xs, c), config.rule, cap, config.floor(xs.shape[1]))
    return out


def _lags_on(series: np.ndarray, rule: str, cap: int, min_lag: int = 0) -> np.ndarray:
    """The rule's lag order in min_lag … cap on a given detrended series (the same
    criterion and common sample as :func:`choose_lags_many`; ties to the shorter lag)."""
    floor = min(min_lag, cap)
    if rule not in VECTOR_RULES:  # the t rule: row by row on the (OLS-)detrended series
        return np.array([choose_lag(row, "none", rule, cap).lag for row in series])
    if cap == 0:
        return np.zeros(series.shape[0], dtype=int)
    values = lag_criteria_many(series, rule, cap)
    values = np.where(np.isfinite(values), values, np.inf)
    values[:, :floor] = np.inf
    return np.asarray(np.argmin(values, axis=1))


def component_statistic(xs: np.ndarray, component: str, lags: np.ndarray, config: Config) -> np.ndarray:
    """One component's statistic: τ of the DF regression on the detrended series, or an M
    statistic of Ng & Perron (2001) from the same regression (``config.statistic`` for the
    GLS components, ``config.ols_statistic`` for the OLS ones)."""
    kind = config.statistic if component.startswith("gls") else config.ols_statistic
    series = detrended(xs, component)
    if kind == "tau":
        return dfgls_tau_many(series, lags)
    if kind == "nmsb":  # −1/MSB: rejects for small MSB, so the union's scaling reads MSB < cv/κ
        return -1.0 / m_statistics_many(series, lags)["msb"]
    if kind.endswith("0"):  # "mzt0": with the initial value's term (Perron & Ng 1996)
        return m_statistics_many(series, lags, initial=True)[kind[:-1]]
    return m_statistics_many(series, lags)[kind]


def statistics(xs: np.ndarray, config: Config) -> np.ndarray:
    """(rows, components) union statistics τ_i."""
    lags = component_lags(xs, config)
    return np.column_stack([component_statistic(xs, c, lags[c], config) for c in COMPONENTS[config.components]])


@lru_cache(maxsize=256)
def constants(length: int, config: Config) -> tuple[np.ndarray, float]:
    """cv_i and κ at ``length`` from the configuration's null."""
    parts = []
    names = COMPONENTS[config.components]
    if config.null_at(length) == "asymptotic":
        cvs_a, kappa_a = ASYMPTOTIC[config.components][config.alpha]
        return np.asarray(cvs_a), kappa_a
    for shocks in shock_chunks(length, NULL_REPS, DEFAULT_SEED, width=2 * len(names)):
        paths = np.cumsum(shocks, axis=1)
        if config.null_at(length) == "plain":
            zeros = np.zeros(paths.shape[0], dtype=int)
            parts.append(np.column_stack([component_statistic(paths, c, zeros, config) for c in names]))
        else:
            parts.append(statistics(paths, config))
    cvs, kappa = constants_from_draws(np.vstack(parts), config.alpha)
    return np.asarray(cvs), kappa


@lru_cache(maxsize=1024)
def constants_at_lag(length: int, lag: int, config: Config) -> tuple[np.ndarray, float]:
    """cv_i and κ at ``length`` for a fixed lag order ``lag`` in every component, from
    driftless Gaussian random walks (Cheung, Y.-W. & Lai, K.S. 1995, "Lag order and
    critical values of the augmented Dickey-Fuller test", JBES 13(3); "... of a modified
    Dickey-Fuller test", Oxford Bulletin of Economics and Statistics 57(3), for DF-GLS:
    in finite samples the critical values grow in size with the lag order)."""
    names = COMPONENTS[config.components]
    parts = []
    for shocks in shock_chunks(length, NULL_REPS, DEFAULT_SEED + lag, width=2 * len(names)):
        paths = np.cumsum(shocks, axis=1)
        lags = np.full(paths.shape[0], lag, dtype=int)
        parts.append(np.column_stack([dfgls_tau_many(detrended(paths, c), lags) for c in names]))
    cvs, kappa = constants_from_draws(np.vstack(parts), config.alpha)
    return np.asarray(cvs), kappa


def margins_by_lag(xs: np.ndarray, config: Config) -> np.ndarray:
    """max_i τ_i / cv_i(T, k_i) / κ(T, k), each component's cv at its own lag order and κ
    at the larger of the series' lag orders (Cheung & Lai 1995)."""
    lags = component_lags(xs, config)
    names = COMPONENTS[config.components]
    tau = np.column_stack([dfgls_tau_many(detrended(xs, c), lags[c]) for c in names])
    length = xs.shape[1]
    cap = config.cap(length)
    table = [constants_at_lag(length, k, config) for k in range(cap + 1)]
    cv = np.column_stack([np.array([table[k][0][i] for k in lags[c]]) for i, c in enumerate(names)])
    top = np.max(np.column_stack([lags[c] for c in names]), axis=1)
    kappa = np.array([table[k][1] for k in top])
    with np.errstate(invalid="ignore"):
        return np.asarray(np.max(tau / cv, axis=1) / kappa)


@lru_cache(maxsize=256)
def pair_constants(length: int, config: Config) -> dict[str, tuple[np.ndarray, float]]:
    """cv_i and κ of the constant pair (GLS and OLS demeaned) and of the trend pair,
    from the same plain null draws as the four-component union."""
    names = COMPONENTS["four"]
    draws = np.vstack([
        np.column_stack([component_statistic(np.cumsum(s, axis=1), c, np.zeros(s.shape[0], dtype=int), config)
                         for c in names])
        for s in shock_chunks(length, NULL_REPS, DEFAULT_SEED, width=2 * len(names))])
    out = {}
    for spec, cols in (("constant", [0, 2]), ("trend", [1, 3])):
        cvs, kappa = constants_from_draws(draws[:, cols], config.alpha)
        out[spec] = (np.asarray(cvs), kappa)
    return out


def pretest_reject(xd: np.ndarray, config: Config) -> np.ndarray:
    """The trend test of Harvey, Leybourne & Taylor (2007) (valid under I(0) and I(1))
    picks the deterministic case; the union then runs over that case's GLS and OLS pair
    only (the trend pre-test strategy HLT 2009 compare with the union; from memory)."""
    four = replace(config, components="four")
    lags = component_lags(xd, four)
    names = COMPONENTS["four"]
    tau = np.column_stack([component_statistic(xd, c, lags[c], config) for c in names])
    z = trend_statistics(xd, dfgls_tau_many(detrended(xd, "gls-trend"), lags["gls-trend"]))["z"]
    cv = trend_critical_value(xd.shape[1], config.alpha, config.rule, config.cap(xd.shape[1]))
    trend = trend_found(z, cv)
    table = pair_constants(xd.shape[1], config)
    reject = np.zeros(xd.shape[0], dtype=bool)
    for spec, cols, rows in (("constant", [0, 2], ~trend), ("trend", [1, 3], trend)):
        cvs, kappa = table[spec]
        with np.errstate(invalid="ignore"):
            reject[rows] = np.max(tau[rows][:, cols] / cvs, axis=1) > kappa
    return reject


def orders(xs: np.ndarray, config: Config, max_difference: int = 2) -> np.ndarray:
    reject = {}
    for d in range(max_difference, -1, -1):
        xd = np.diff(xs, n=d, axis=1) if d else xs
        if config.components == "pretest":
            reject[d] = pretest_reject(xd, config)
            continue
        if config.null_at(xd.shape[1]) == "bylag":
            reject[d] = np.asarray(margins_by_lag(xd, config) > 1.0)
            continue
        cvs, kappa = constants(xd.shape[1], config)
        tau = statistics(xd, config)
        with np.errstate(invalid="ignore"):
            reject[d] = np.asarray(np.max(tau / cvs, axis=1) > kappa)
    return orders_from_rejections(reject, max_difference)


UNIT_ROOT = [p.name for p in grid() if p.unit_root]
ROWS = {
    "size50": [(name, 50) for name in UNIT_ROOT],
    "size": [(name, n) for n in (100, 200, 500) for name in UNIT_ROOT],
    "power": [("AR(1) mean phi=0.5", 100), ("AR(1) mean phi=0.8", 200), ("AR(1) trend phi=0.7", 150)],
    "ma": [("ARIMA(0,1,1) theta=-0.8", 200)],
    "power50": [("AR(1) mean phi=0.5", 50), ("AR(1) mean phi=0.8", 50), ("AR(1) trend phi=0.5", 50)],
}
LIMITS = {"AR(1) mean phi=0.5": 0.90, "AR(1) mean phi=0.8": 0.85, "AR(1) trend phi=0.7": 0.80}


def evaluate(name: str, config: Config, rows: list[str], reps: int, seed: int) -> bool:
    start = time.perf_counter()
    ok = True
    out = []
    for group in rows:
        worst = (0.0, "")
        by_length: dict[int, tuple[float, str]] = {}
        for pname, n in ROWS[group]:
            process = by_name(pname)
            order = orders(simulate(process, n, reps, seed), config)
            if group in ("size50", "size"):
                low = float(np.mean((order >= 0) & (order < process.order)))
                if low > worst[0]:
                    worst = (low, f"{pname} T={n}")
                if low >= by_length.get(n, (-1.0, ""))[0]:
                    by_length[n] = (low, pname)
            elif group == "power50":
                out.append(f"{pname} T={n} I(0) {100 * float(np.mean(order == 0)):.1f}% (no limit)")
            elif group == "power":
                share = float(np.mean(order == 0))
                passed = share >= LIMITS[pname]
                ok &= passed
                out.append(f"{pname} T={n} I(0) {100 * share:.1f}% {'ok' if passed else 'FAIL'}")
            else:
                share = float(np.mean(order == 0))
                ok &= share <= 0.25
                out.append(f"theta=-0.8 T={n} I(0) {100 * share:.1f}% {'ok' if share <= 0.25 else 'FAIL'}")
        if group == "size":
            out.append("size per T: " + "; ".join(f"T={n} {100 * v:.1f}% ({p})" for n, (v, p) in by_length.items()))
        if group in ("size50", "size"):
            ok &= worst[0] <= 0.07
            out.append(f"{group} worst too-low {100 * worst[0]:.1f}% ({worst[1]}) "
                       f"{'ok' if worst[0] <= 0.07 else 'FAIL'}")
    print(f"[{name}] {config}  ({time.perf_counter() - start:.0f} s)")
    for line in out:
        print("   " + line)
    checked = any(group != "power50" for group in rows)
    print(f"   => {('ALL PASS' if ok else 'fails') if checked else 'no acceptance rows'}", flush=True)
    return ok


def main(argv: list[str] | None = None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--config", action="append", default=[],
                        help="a name of CONFIGS, or fields as key=value,... (e.g. scale=6,null=selected)")
    parser.add_argument("--reps", type=int, default=500)
    parser.add_argument("--seed", type=int, default=SEED)
    parser.add_argument("--rows", default="size50,power,ma")
    parser.add_argument("--frontier", default="",
                        help="LENGTH:PROCESS (e.g. '100:AR(1) mean phi=0.5'): power against the worst "
                             "one-order-too-low of the I(1) processes as kappa is scaled, levels only")
    args = parser.parse_args(argv)
    if args.frontier:
        length, process = args.frontier.split(":", 1)
        for name in args.config or ["engine"]:
            frontier(CONFIGS[name] if name in CONFIGS else parse(name), int(length), process,
                     args.reps, args.seed)
        return
    for name in args.config or ["engine"]:
        evaluate(name, CONFIGS[name] if name in CONFIGS else parse(name), args.rows.split(","),
                 args.reps, args.seed)


def frontier(config: Config, length: int, process: str, reps: int, seed: int) -> None:
    """Power against ``process`` and the worst size over the I(1) unit-root processes at
    ``length``, as κ is multiplied by 0.92 … 1.20 (the levels' union alone: for these
    processes the differences reject in every replication)."""
    cvs, kappa = constants(length, config)
    names = [p.name for p in grid() if p.unit_root and p.order == 1] + [process]
    margin = {}
    for name in names:
        xs = simulate(by_name(name), length, reps, seed)
        margin[name] = np.max(statistics(xs, config) / cvs, axis=1) / kappa
    print(f"[frontier] {config} T={length} power against {process}")
    for f in (0.92, 0.96, 1.0, 1.02, 1.04, 1.08, 1.12, 1.16, 1.20):
        size = max((float(np.mean(margin[n] > f)), n) for n in names[:-1])
        print(f"   kappa x{f:.2f}: power {100 * np.mean(margin[process] > f):5.1f}%  "
              f"worst size {100 * size[0]:5.1f}% ({size[1]})")


def parse(text: str) -> Config:
    """A configuration from "key=value,..." over the fields of :class:`Config`."""
    fields: dict[str, object] = {}
    for item in text.split(","):
        key, value = item.split("=")
        if key in ("scale", "small_scale", "alpha"):
            fields[key] = float(value)
        elif key in ("min_lag", "small_min_lag"):
            fields[key] = int(value)
        else:
            fields[key] = value
    return Config(**fields)  # type: ignore[arg-type]


if __name__ == "__main__":
    main()
