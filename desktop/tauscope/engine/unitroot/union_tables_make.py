"""Writes :mod:`tauscope.engine.unitroot.union_table`: the union's constants, the trend
test's null quantiles and the union's power on a grid of lengths, simulated once.

Run by hand (fixed seed, at most two processes)::

    python -m tauscope.engine.unitroot.union_tables_make --processes 2

``--short`` simulates only the rows below 100 values (those the short-sample rule touches,
after a change of ``SHORT_MIN_LAG``) and keeps the others from the current table.

Each quantity comes from the same simulator and seed as the direct path, only with more
replications:

* the union's null (:func:`~tauscope.engine.unitroot.union.union_null`, seed
  ``DEFAULT_SEED``; below 100 values with the lag choice included, so the grid holds
  T = 99, the last short length, beside T = 100): every component's α quantile cv_i and κ, the (1 − α) quantile of
  max_i τ_i / cv_i (Harvey, Leybourne & Taylor 2009, 2012), for the four-test and (its
  first two columns, the same draws) the two-test union; at T = 2,000 with the
  replications of ``union.ASYMPTOTIC``, so the table's end reproduces it;
* the trend test's null (Harvey, Leybourne & Taylor 2007): the 1 − α quantiles of |z_λ|
  for driftless random walks and for white noise, drawn in the order of
  :func:`~tauscope.engine.unitroot.trend_robust.trend_critical_value`, MAIC lags up to
  ⌊6 (T/100)^{1/4}⌋ (the union's default; at least ``SHORT_MIN_LAG`` below 100 values);
* the union's power against a stationary AR(1) with φ = 0.95, drawn in the order of
  :func:`~tauscope.engine.unitroot.union.union_power`, with the table's own constants.

Monte Carlo standard errors come from batch means (the draws split into 20 equal batches,
the statistic computed on each: SE = sd / √20) and are written beside each value.
"""

from __future__ import annotations

import argparse
import time
from collections.abc import Iterator
from concurrent.futures import ProcessPoolExecutor
from pathlib import Path

import numpy as np

from tauscope.engine.distributions.simulate import DEFAULT_SEED
from tauscope.engine.unitroot.dfgls_many import choose_lags_many, dfgls_many
from tauscope.engine.unitroot.trend_robust import trend_statistics
from tauscope.engine.unitroot.union import (
    ASYMPTOTIC_LENGTH,
    ASYMPTOTIC_REPS,
    COMPONENTS,
    UNION_LAG_SCALE,
    constants_from_draws,
    max_lags_schwert,
    union_null,
)
from tauscope.engine.unitroot.union_components import component_statistic, min_lag, short

GRID = (10, 12, 15, 20, 25, 30, 40, 50, 60, 75, 99, 100, 125, 150, 200, 250, 300, 400, 500,
        750, 1000, 2000)
ALPHAS = (0.01, 0.05, 0.10)
POWER_PHI = 0.95
NULL_REPS = 300_000  # κ SE at 5% about 0.0008 (T = 100); 1,000,000 before the M statistics
TREND_REPS = 20_000
POWER_REPS = 20_000
BATCHES = 20
_CHUNK_VALUES = 2_000_000  # values drawn at once (rows × length)
OUTPUT = Path(__file__).with_name("union_table.py")
PLAIN_OUTPUT = Path(__file__).with_name("union_table_plain.py")

NullEntry = dict[float, tuple[tuple[float, ...], float, float, float, float]]
TrendEntry = dict[float, tuple[float, float, float, float]]
PowerEntry = dict[float, tuple[float, ...]]
Entry = tuple[int, NullEntry, TrendEntry, PowerEntry, float]


def null_reps(length: int) -> int:
    """Replications of the union's null at ``length`` (ASYMPTOTIC's at its length)."""
    return ASYMPTOTIC_REPS if length == ASYMPTOTIC_LENGTH else NULL_REPS


def _batches(values: np.ndarray) -> list[np.ndarray]:
    return np.array_split(values, BATCHES)


def _se(estimates: list[float]) -> float:
    return float(np.std(estimates, ddof=1) / np.sqrt(len(estimates)))


def null_entry(length: int, reps: int | None = None) -> NullEntry:
    """Per α: (cv of the four components, κ four, κ two, SE of κ four, SE of κ two)."""
    draws = union_null(length, null_reps(length) if reps is None else reps, DEFAULT_SEED, COMPONENTS["four"],
                       lagged=short(length))
    return null_summary(draws)


def null_summary(draws: np.ndarray) -> NullEntry:
    """:func:`null_entry` from (reps, 4) draws of the four components."""
    out = {}
    for alpha in ALPHAS:
        cvs, kappa4 = constants_from_draws(draws, alpha)
        _, kappa2 = constants_from_draws(draws[:, :2], alpha)
        se4 = _se([constants_from_draws(b, alpha)[1] for b in _batches(draws)])
        se2 = _se([constants_from_draws(b[:, :2], alpha)[1] for b in _batches(draws)])
        out[alpha] = (cvs, kappa4, kappa2, se4, se2)
    return out


def _row_chunks(rng: np.random.Generator, reps: int, length: int) -> Iterator[np.ndarray]:
    """Rows of ``rng.standard_normal((reps, length))`` in chunks (the same stream)."""
    step = max(1, _CHUNK_VALUES // length)
    for start in range(0, reps, step):
        yield rng.standard_normal((min(step, reps - start), length))


def trend_null_z(length: int, reps: int = TREND_REPS, rule: str = "maic",
                 max_lags: int | None = None) -> tuple[np.ndarray, np.ndarray]:
    """|z_λ| under I(1) and under I(0), drawn as ``trend_critical_value`` draws them."""
    p = max_lags_schwert(length, None, UNION_LAG_SCALE) if max_lags is None else max_lags
    rng = np.random.default_rng([DEFAULT_SEED, length, 7])
    out = []
    for walk in (True, False):
        parts = []
        for shocks in _row_chunks(rng, reps, length):
            xs = np.cumsum(shocks, axis=1) if walk else shocks
            u, _ = dfgls_many(xs, "trend", rule, p, None, min_lag(length, rule))
            parts.append(np.abs(trend_statistics(xs, u)["z"]))
        out.append(np.concatenate(parts))
    return out[0], out[1]


def trend_entry(length: int, reps: int = TREND_REPS) -> TrendEntry:
    """Per α: (quantile under I(1), quantile under I(0), their SEs)."""
    walk, noise = trend_null_z(length, reps)
    out = {}
    for alpha in ALPHAS:
        q = [float(np.nanquantile(z, 1.0 - alpha)) for z in (walk, noise)]
        se = [_se([float(np.nanquantile(b, 1.0 - alpha)) for b in _batches(z)]) for z in (walk, noise)]
        out[alpha] = (q[0], q[1], se[0], se[1])
    return out


def power_rejections(length: int, constants: dict[float, tuple[tuple[float, ...], float, float]],
                     reps: int = POWER_REPS, phi: float = POWER_PHI) -> dict[tuple[float, str], np.ndarray]:
    """Per (α, components): (reps, 2) booleans, the union's and its trend components'
    rejections of AR(1) series drawn as ``union_power`` draws them; ``constants`` maps α
    to (cv of the four components, κ four, κ two)."""
    rng = np.random.default_rng([DEFAULT_SEED, length, round(phi * 1000)])
    p = max_lags_schwert(length, None, UNION_LAG_SCALE)
    parts: dict[tuple[float, str], list[np.ndarray]] = {}
    for e in _row_chunks(rng, reps, length):
        y = np.empty_like(e)
        y[:, 0] = e[:, 0] / np.sqrt(1.0 - phi * phi)
        for t in range(1, length):
            y[:, t] = phi * y[:, t - 1] + e[:, t]
        lags = {spec: choose_lags_many(y, spec, "maic", p, None, min_lag(length, "maic"))
                for spec in ("constant", "trend")}
        tau = np.column_stack([component_statistic(y, c, lags[c.split("-")[1]]) for c in COMPONENTS["four"]])
        for alpha, (cvs, kappa4, kappa2) in constants.items():
            for kind, kappa in (("four", kappa4), ("two", kappa2)):
                m = len(COMPONENTS[kind])
                below = tau[:, :m] < kappa * np.asarray(cvs[:m])
                trend = below[:, [i for i, c in enumerate(COMPONENTS[kind]) if c.endswith("trend")]]
                parts.setdefault((alpha, kind), []).append(
                    np.column_stack([below.any(axis=1), trend.any(axis=1)]))
    return {key: np.vstack(v) for key, v in parts.items()}


def power_entry(length: int, constants: dict[float, tuple[tuple[float, ...], float, float]],
                reps: int = POWER_REPS) -> PowerEntry:
    """Per α: (four: union, trend; two: union, trend; the largest SE of the four)."""
    hits = power_rejections(length, constants, reps)
    out = {}
    for alpha in ALPHAS:
        rates = [float(np.mean(hits[(alpha, k)][:, j])) for k in ("four", "two") for j in (0, 1)]
        se = max(float(np.sqrt(r * (1.0 - r) / reps)) for r in rates)
        out[alpha] = (*rates, se)
    return out


def grid_entry(length: int) -> Entry:
    """Every quantity at one grid length (one process's job)."""
    start = time.perf_counter()
    null = null_entry(length)
    trend = trend_entry(length)
    power = power_entry(length, {a: v[:3] for a, v in null.items()})
    return length, null, trend, power, time.perf_counter() - start


def _fmt(values: tuple[float, ...] | list[float], digits: int = 5) -> str:
    return "(" + ", ".join(f"{v:.{digits}f}" for v in values) + ("," if len(values) == 1 else "") + ")"


def render(entries: list[Entry]) -> str:
    """The table module's text (plain literals, one line per length and α)."""
    lines = ['"""Simulated once by ``python -m tauscope.engine.unitroot.union_tables_make`` (do not edit).',
             "", "Keys: length T, then α.  NULL: (cv of the four components (gls-constant, gls-trend,",
             "ols-constant, ols-trend), κ four, κ two, SE κ four, SE κ two).  TREND: 1 − α quantiles of",
             "|z_λ| (under I(1), under I(0), their SEs).  POWER at φ = 0.95: (four union, four trend",
             "components, two union, two trend components, largest SE).  SEs: batch means.", '"""', "",
             f"SEED = {DEFAULT_SEED}", f"GRID = {tuple(e[0] for e in entries)!r}",
             "NULL_REPS = {",
             *(f"    {e[0]}: {null_reps(e[0])}," for e in entries), "}",
             f"TREND_REPS = {TREND_REPS}", f"POWER_REPS = {POWER_REPS}", f"POWER_PHI = {POWER_PHI}",
             f"LAG_SCALE = {UNION_LAG_SCALE}", ""]
    for name, hint in (("NULL", "tuple[tuple[float, ...], float, float, float, float]"),
                       ("TREND", "tuple[float, float, float, float]"),
                       ("POWER", "tuple[float, float, float, float, float]")):
        lines.append(f"{name}: dict[int, dict[float, {hint}]] = {{")
        for entry in entries:
            lines.append(f"    {entry[0]}: {{")
            texts: dict[float, str] = {}
            if name == "NULL":
                texts = {a: f"({_fmt(v[0])}, {_fmt(v[1:])[1:-1]})" for a, v in entry[1].items()}
            elif name == "TREND":
                texts = {a: _fmt(v) for a, v in entry[2].items()}
            else:
                texts = {a: _fmt(v) for a, v in entry[3].items()}
            for alpha, text in texts.items():
                lines.append(f"        {alpha}: {text},")
            lines.append("    },")
        lines.append("}")
        lines.append("")
    return "\n".join(lines)


def plain_entry(length: int) -> tuple[int, NullEntry]:
    """The null without lag augmentation at a short grid length (the differences of a short
    series, which do not take the short-sample rule)."""
    return length, null_summary(union_null(length, NULL_REPS, DEFAULT_SEED, COMPONENTS["four"]))


def render_plain(entries: list[tuple[int, NullEntry]]) -> str:
    """The module of the short lengths' null without lag augmentation (NULL's layout)."""
    lines = ['"""Simulated once by ``python -m tauscope.engine.unitroot.union_tables_make --plain`` '
             "(do not edit).", "", "The union's null without lag augmentation at the grid lengths "
             "below 100 (NULL's layout in", "union_table.py, whose rows there include the lag choice).",
             '"""', "", f"SEED = {DEFAULT_SEED}", f"GRID = {tuple(e[0] for e in entries)!r}",
             f"NULL_REPS = {NULL_REPS}", "",
             "NULL: dict[int, dict[float, tuple[tuple[float, ...], float, float, float, float]]] = {"]
    for length, null in entries:
        lines.append(f"    {length}: {{")
        lines += [f"        {a}: ({_fmt(v[0])}, {_fmt(v[1:])[1:-1]})," for a, v in null.items()]
        lines.append("    },")
    return "\n".join([*lines, "}", ""])


def kept_entry(length: int) -> Entry:
    """The current table's row at ``length``, as :func:`grid_entry` returns it (``--short``)."""
    from tauscope.engine.unitroot import union_table

    power: PowerEntry = {a: tuple(v) for a, v in union_table.POWER[length].items()}
    return length, union_table.NULL[length], union_table.TREND[length], power, 0.0


def main(argv: list[str] | None = None) -> None:  # pragma: no cover - run by hand
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--processes", type=int, default=2)
    parser.add_argument("--out", type=Path, default=None)
    parser.add_argument("--plain", action="store_true",
                        help="only the short lengths' null without lag augmentation")
    parser.add_argument("--short", action="store_true",
                        help="only the rows below 100 values (the short-sample rule's); the others kept")
    args = parser.parse_args(argv)
    if args.plain:
        plain = [plain_entry(t) for t in GRID if short(t)]
        out = args.out or PLAIN_OUTPUT
        out.write_text(render_plain(plain), encoding="utf-8")
        print(f"wrote {out}")
        return
    args.out = args.out or OUTPUT
    order = sorted((t for t in GRID if short(t) or not args.short), reverse=True)  # the longest first
    entries = [] if not args.short else [kept_entry(t) for t in GRID if not short(t)]
    with ProcessPoolExecutor(max_workers=max(1, min(args.processes, 2))) as pool:
        for entry in pool.map(grid_entry, order):
            print(f"T = {entry[0]}: {entry[4]:.1f} s", flush=True)
            entries.append(entry)
    entries.sort(key=lambda e: e[0])
    args.out.write_text(render(entries), encoding="utf-8")
    print(f"wrote {args.out}")


if __name__ == "__main__":  # pragma: no cover
    main()
