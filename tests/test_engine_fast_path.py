"""The fast path (nested QR, batched series) gives the reference path's numbers.

Reference: ``analyse_series(..., path="reference")``, one statsmodels OLS per
regression (statsmodels.regression.linear_model.OLS), statsmodels' ``kpss`` and
MacKinnon functions.  Data: the bundled demo workbook (resources/demo, invented),
statsmodels' macrodata (US quarterly macro data 1959Q1-2009Q3, statsmodels.datasets)
and the generated series of benchmarks/engine_vs_statsmodels.py.  Every number of
every result (statistics, p-values, critical values, coefficients, criteria, the lag
profile) must agree to 1e-8; everything else (lags, nobs, verdicts, decisions, texts)
must be equal.
"""

from __future__ import annotations

import importlib.util
import math
import sys
import warnings
from pathlib import Path
from typing import Any

import numpy as np
import pandas as pd
import pytest
from statsmodels.datasets import macrodata
from statsmodels.tools.sm_exceptions import InterpolationWarning
from statsmodels.tsa.stattools import kpss

from tauscope.engine import Settings, analyse_many, analyse_series
from tauscope.engine.distributions import critical
from tauscope.engine.distributions import tables as fast_tables
from tauscope.engine.procedure import fast_path
from tauscope.engine.procedure.stages import EstimateOptions, plan_for
from tauscope.engine.regression import nested
from tauscope.engine.unitroot.kpss import kpss_test
from tauscope.engine.unitroot.kpss_fast import kpss_fast

ROOT = Path(__file__).resolve().parents[1]
DEMO = ROOT / "resources" / "demo"
TOLERANCE = 1e-8


def _benchmark_module() -> Any:
    path = ROOT / "benchmarks" / "engine_vs_statsmodels.py"
    spec = importlib.util.spec_from_file_location("engine_vs_statsmodels", path)
    assert spec is not None and spec.loader is not None
    module = importlib.util.module_from_spec(spec)
    sys.modules[spec.name] = module
    spec.loader.exec_module(module)
    return module


BENCHMARK = _benchmark_module()


def _mismatches(a: Any, b: Any, path: str = "", relative: float = 0.0) -> list[str]:
    """Where two to_dict() trees differ: numbers by more than TOLERANCE (plus ``relative``
    times their size), anything else at all."""
    if isinstance(a, dict) and isinstance(b, dict):
        if a.keys() != b.keys():
            return [f"{path}: keys {sorted(a)} != {sorted(b)}"]
        return [m for key in a for m in _mismatches(a[key], b[key], f"{path}.{key}", relative)]
    if isinstance(a, list) and isinstance(b, list):
        if len(a) != len(b):
            return [f"{path}: length {len(a)} != {len(b)}"]
        return [m for i, (x, y) in enumerate(zip(a, b, strict=True))
                for m in _mismatches(x, y, f"{path}[{i}]", relative)]
    if isinstance(a, float) and isinstance(b, float):
        if math.isnan(a) and math.isnan(b):
            return []
        close = abs(a - b) <= TOLERANCE + relative * abs(b)
        return [] if close else [f"{path}: {a!r} != {b!r}"]
    return [] if a == b else [f"{path}: {a!r} != {b!r}"]


def assert_same_result(fast: Any, reference: Any) -> None:
    problems = _mismatches(fast.to_dict(), reference.to_dict())
    assert not problems, f"{fast.name}: " + "; ".join(problems[:5])


def _demo_series() -> list[tuple[str, pd.Series]]:
    """Each CSV sheet of the demo: title row, empty row, header "Period", footnote row."""
    out = []
    for csv in sorted(DEMO.glob("harbourline_*.csv")):
        frame = pd.read_csv(csv, skiprows=2, skipfooter=1, engine="python")
        for column in frame.columns[1:]:
            out.append((f"{csv.stem}: {column}", frame[column].astype(float)))
    return out


DEMO_SERIES = _demo_series()
MACRO = macrodata.load_pandas().data
MACRO_COLUMNS = {
    "log realgdp": np.log(MACRO["realgdp"].to_numpy()),
    "log cpi": np.log(MACRO["cpi"].to_numpy()),
    "infl": MACRO["infl"].to_numpy(),
    "unemp": MACRO["unemp"].to_numpy(),
    "tbilrate": MACRO["tbilrate"].to_numpy(),
    "log m1": np.log(MACRO["m1"].to_numpy()),
}
RULES = [
    Settings(lag_rule="aic"),
    Settings(lag_rule="bic"),
    Settings(lag_rule="hqc"),
    Settings(lag_rule="tsig", alpha=0.10),
    Settings(lag_rule="maic"),
    Settings(lag_rule="fixed", lags=4),
]


def test_demo_workbook_read_as_expected() -> None:
    # resources/demo/README.md: eight series over three sheets.
    assert len(DEMO_SERIES) == 8
    assert all(len(values) >= 30 for _, values in DEMO_SERIES)


@pytest.mark.parametrize("settings", [Settings(), Settings(lag_rule="maic", alpha=0.01)],
                         ids=["aic", "maic-1%"])
def test_demo_workbook_fast_equals_reference(settings: Settings) -> None:
    fast = analyse_many(DEMO_SERIES, settings)
    for (name, values), result in zip(DEMO_SERIES, fast, strict=True):
        reference = analyse_series(values, settings, name, path="reference")
        assert_same_result(result, reference)
        assert_same_result(analyse_series(values, settings, name), reference)


@pytest.mark.parametrize("settings", RULES, ids=[s.lag_rule for s in RULES])
def test_macrodata_fast_equals_reference_for_every_lag_rule(settings: Settings) -> None:
    series = list(MACRO_COLUMNS.items())
    fast = analyse_many(series, settings)
    tested = 0
    for (name, values), result in zip(series, fast, strict=True):
        reference = analyse_series(values, settings, name, path="reference")
        assert_same_result(result, reference)
        tested += result.error is None
    assert tested == len(series)


def test_benchmark_series_fast_equals_reference() -> None:
    """All of the benchmark's 500 series (length 240; I(0), I(1) and I(2) kinds): the fast
    path equals the statsmodels path (about a minute on 2 cores, most of it the reference)."""
    subset = BENCHMARK.benchmark_series(500, 240, 7)
    fast = analyse_many(subset)
    orders = set()
    for (name, values), result in zip(subset, fast, strict=True):
        assert_same_result(result, analyse_series(values, Settings(), name, path="reference"))
        orders.add(result.verdict.order)
    assert {0, 1, 2} <= orders  # the mix holds I(0), I(1) and I(2) verdicts


def test_analyse_series_default_is_the_fast_path(monkeypatch: pytest.MonkeyPatch) -> None:
    name, values = BENCHMARK.benchmark_series(3, 240, 7)[2]
    calls: list[int] = []
    original = fast_path.SeriesBatch.level

    def spy(self: fast_path.SeriesBatch, difference: int, max_lags: int) -> fast_path.LevelBatch:
        calls.append(difference)
        return original(self, difference, max_lags)

    monkeypatch.setattr(fast_path.SeriesBatch, "level", spy)
    analyse_series(values, Settings(), name)
    assert sorted(set(calls)) == [0, 1, 2]
    calls.clear()
    analyse_series(values, Settings(), name, path="reference")
    assert calls == []
    with pytest.raises(ValueError, match="path"):
        analyse_series(values, Settings(), name, path="quick")  # type: ignore[arg-type]


def test_perfect_fit_goes_to_the_reference_with_the_same_message() -> None:
    x = 5.0 * 0.9 ** np.arange(60)  # an exact AR(1): every regression fits perfectly
    fast, reference = analyse_series(x, name="exact"), analyse_series(x, name="exact",
                                                                         path="reference")
    assert reference.error is not None
    assert_same_result(fast, reference)
    batch = fast_path.level_batch(x[None, :], 0, plan_for(Settings()).estimate, 5)
    assert batch.declined.tolist() == [True]


def test_declined_series_do_not_disturb_the_rest_of_its_batch() -> None:
    rng = np.random.default_rng(11)
    good = np.cumsum(rng.standard_normal(80))
    exact = 5.0 * 0.9 ** np.arange(80)
    series = [("good", good), ("exact", exact), ("good again", good + 1.0)]
    results = analyse_many(series)
    for (name, values), result in zip(series, results, strict=True):
        assert_same_result(result, analyse_series(values, Settings(), name, path="reference"))
    assert results[1].error is not None and results[0].error is None


EDGE_SETTINGS = [
    Settings(max_lags=0),
    Settings(lag_rule="fixed", lags=0),
    Settings(lag_rule="tsig", max_lags=3, max_difference=1),
    Settings(lag_rule="maic", max_difference=0, alpha=0.10),
    Settings(lag_rule="bic", max_lags=2, confirm=()),
]


@pytest.mark.parametrize("settings", EDGE_SETTINGS, ids=range(len(EDGE_SETTINGS)))
def test_short_series_and_small_lag_bounds(settings: Settings) -> None:
    """Lengths 12-70, no lags at all, low bounds, one or no difference, large scales and
    exact fits (which both paths must turn into the same message).  Coefficients, RSS and
    σ̂² scale with the data, so those compare at 1e-9 relative as well."""
    rng = np.random.default_rng(8)
    series = []
    for i in range(18):
        n = int(rng.integers(12, 71))
        e = rng.standard_normal(n)
        kinds = [e, np.cumsum(e), np.cumsum(np.cumsum(e)), 3.0 + 0.2 * np.arange(n) + e,
                 1e6 * np.cumsum(e), 5.0 * 0.9 ** np.arange(n)]
        series.append((f"series {i}", kinds[i % len(kinds)]))
    results = analyse_many(series, settings)
    for (name, values), result in zip(series, results, strict=True):
        reference = analyse_series(values, settings, name, path="reference")
        problems = _mismatches(result.to_dict(), reference.to_dict(), relative=1e-9)
        assert not problems, f"{name}: " + "; ".join(problems[:5])
    assert sum(r.error is not None for r in results) == 3  # the exact fits


def _mixed_series() -> list[tuple[str, Any]]:
    rng = np.random.default_rng(3)
    return [
        ("walk 100", np.cumsum(rng.standard_normal(100))),
        ("noise 60", rng.standard_normal(60)),
        ("too short", [1.0, 2.0, 3.0]),
        ("walk 100 b", np.cumsum(rng.standard_normal(100))),
        ("text", ["a", "b"]),
        ("trend 60", np.arange(60.0) * 0.3 + rng.standard_normal(60)),
        ("constant", np.ones(40)),
        ("straight line", 1.0 + 2.0 * np.arange(50.0)),
    ]


def test_analyse_many_keeps_input_order_and_carries_on_after_bad_series() -> None:
    series = _mixed_series()
    progress: list[tuple[int, int, str]] = []
    results = analyse_many(iter(series), progress=lambda d, t, n: progress.append((d, t, n)))
    assert [r.name for r in results] == [name for name, _ in series]
    assert progress == [(i + 1, len(series), name) for i, (name, _) in enumerate(series)]
    assert [r.error is None for r in results] == [True, True, False, True, False, True, False,
                                                  False]
    for (name, values), result in zip(series, results, strict=True):
        assert_same_result(result, analyse_series(values, Settings(), name, path="reference"))


def test_analyse_many_stops_between_series_when_asked() -> None:
    series = _mixed_series()
    done: list[str] = []
    results = analyse_many(series, progress=lambda d, t, n: done.append(n),
                           should_stop=lambda: len(done) >= 2)
    assert [r.name for r in results] == [name for name, _ in series[:2]]
    assert analyse_many(series, should_stop=lambda: True) == []


def test_analyse_many_streams_in_chunks(monkeypatch: pytest.MonkeyPatch) -> None:
    from tauscope.engine.procedure import many

    monkeypatch.setattr(many, "CHUNK", 2)
    batches: list[int] = []
    original = fast_path.SeriesBatch.__init__

    def spy(self: fast_path.SeriesBatch, values: list[np.ndarray], options: EstimateOptions,
            period: int | None = None) -> None:
        batches.append(len(values))
        original(self, values, options, period)

    monkeypatch.setattr(fast_path.SeriesBatch, "__init__", spy)
    series = _mixed_series()
    results = analyse_many(series)
    assert max(batches) <= 2  # never more than one chunk of designs at a time
    assert [r.name for r in results] == [name for name, _ in series]
    checked = {"walk 100", "walk 100 b"}
    for (name, values), result in zip(series, results, strict=True):
        if name in checked:
            assert_same_result(result, analyse_series(values, Settings(), name, path="reference"))


def _kpss_inputs() -> list[np.ndarray]:
    rng = np.random.default_rng(21)
    out = [values for values in MACRO_COLUMNS.values()]
    for i in range(60):
        n = int(rng.integers(12, 400))
        e = rng.standard_normal(n)
        out.append([e, np.cumsum(e), np.cumsum(np.cumsum(e)), e + 0.05 * np.arange(n)][i % 4])
    return out


@pytest.mark.parametrize("spec", ["constant", "trend"])
def test_numpy_kpss_equals_statsmodels_kpss(spec: str) -> None:
    # Reference: statsmodels.tsa.stattools.kpss, nlags="auto" (Hobijn et al. 1998 bandwidth).
    for x in _kpss_inputs():
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", InterpolationWarning)
            ref = kpss(x, regression="ct" if spec == "trend" else "c", nlags="auto",
                       result_object=True)
        ours = kpss_fast(np.asarray(x), spec, 0, 0.05)
        assert ours.lags == ref.lags
        assert ours.statistic == pytest.approx(ref.statistic, rel=1e-10, abs=1e-10)
        assert ours.p_value == pytest.approx(ref.pvalue, abs=1e-10)
        assert _mismatches(ours.to_dict(), kpss_test(np.asarray(x), spec, 0, 0.05).to_dict()) == []


def test_cached_tables_equal_critical_module() -> None:
    # Source of both: statsmodels' mackinnonp/mackinnoncrit and Dickey & Fuller (1981) tables.
    statistics = np.concatenate([np.linspace(-25.0, 4.0, 2901), [-30.0, 10.0]])
    for spec in ("trend", "constant", "none"):
        for value in statistics.tolist():
            assert fast_tables.tau_p_value(value, spec) == critical.tau_p_value(value, spec)
        # Elementwise over an array: the same bits as one value at a time.
        assert fast_tables.tau_p_values(statistics, spec).tolist() == [
            fast_tables.tau_p_value(value, spec) for value in statistics.tolist()]
        for nobs in (12, 25, 99, 100, 237, 1000):
            assert fast_tables.tau_critical_values(spec, nobs) == critical.tau_critical_values(
                spec, nobs)
            for alpha in (0.01, 0.05, 0.10):
                assert fast_tables.tau_critical_value(spec, nobs, alpha) == (
                    critical.tau_critical_value(spec, nobs, alpha))
    for name in ("phi1", "phi2", "phi3"):
        for nobs in (12, 25, 60, 237, 800):
            assert fast_tables.phi_critical_values(name, nobs) == critical.phi_critical_values(
                name, nobs)


def test_nested_blocks_equal_separate_regressions() -> None:
    """RSS, γ̂ and the last lag's t of every lag length from one factorisation equal
    separate least-squares fits (numpy lstsq) on the common sample."""
    rng = np.random.default_rng(5)
    x = np.cumsum(rng.standard_normal(120))
    p = 6
    design = nested.full_design(x[None, :], p)[0, p:, :]
    a = nested.r_factor(design[None])
    fits = nested.block_fits(a, 2, p, design.shape[0])
    for lag in range(p + 1):
        columns = design[:, : 3 + lag]
        beta, rss, *_ = np.linalg.lstsq(columns, design[:, -1], rcond=None)
        assert fits.rss[0, lag] == pytest.approx(float(rss[0]), rel=1e-10)
        assert fits.gamma[0, lag] == pytest.approx(beta[2], rel=1e-9, abs=1e-12)
        if lag:
            sigma2 = float(rss[0]) / (design.shape[0] - columns.shape[1])
            cov = sigma2 * np.linalg.inv(columns.T @ columns)
            t_last = beta[-1] / math.sqrt(cov[-1, -1])
            assert fits.last_t[0, lag] == pytest.approx(t_last, rel=1e-8)


@pytest.mark.parametrize("name", nested.PHI_NAMES)
def test_restricted_rss_equals_the_restricted_fit(name: str) -> None:
    """Φ's restricted RSS by the Wald identity equals the restricted regression fitted
    separately (numpy lstsq without the restricted columns), for two lag choices in one
    batch, with y(t−1) centred as the fast path enters it."""
    rng = np.random.default_rng(11)
    xs = np.cumsum(rng.standard_normal((2, 150)), axis=1) + np.array([[3.0], [-40.0]])
    p = 5
    spec = nested.PHI_SPEC[name]
    n_terms = len(nested.DETERMINISTIC_TERMS[spec])
    centres = xs.mean(axis=1)
    design = nested.full_design(xs, p, centres)
    order = [*nested.spec_order(spec, p), p + 3]
    a_common = nested.r_factor(np.ascontiguousarray(design[:, p:, :][:, :, order]))
    lags = np.array([1, 4])
    est = nested.longest_sample(a_common, design[:, :p, :][:, :, order], n_terms, lags,
                                xs.shape[1] - 1, centres)
    found = nested.restricted_rss(est, name)
    kept = nested.PHI_KEPT_TERMS[name]
    for b, lag in enumerate(lags.tolist()):
        rows = design[b, lag:, :][:, order]
        columns = [*range(kept), *range(n_terms + 1, n_terms + 1 + lag)]  # kept terms, the lags
        _, rss, *_ = np.linalg.lstsq(rows[:, columns], rows[:, -1], rcond=None)
        assert found[b] == pytest.approx(float(rss[0]), rel=1e-10)


def test_quadratic_form_of_the_adjugate_equals_a_solve() -> None:
    rng = np.random.default_rng(3)
    for q in (2, 3):
        m = rng.standard_normal((4, q, q + 2))
        w = m @ m.transpose(0, 2, 1)
        b = rng.standard_normal((4, q))
        expected = np.einsum("bi,bi->b", b, np.linalg.solve(w, b[..., None])[..., 0])
        assert np.allclose(nested._quadratic_form(w, b), expected, rtol=1e-12, atol=0)


@pytest.mark.parametrize("p", [0, 1, 6])
def test_general_to_specific_choices_equal_the_rule_series_by_series(p: int) -> None:
    """The batch's t-sig choice (Ng & Perron 1995: the longest lag whose last coefficient has
    |t| ≥ 1.645, else 0; criteria the t's from max(chosen, 1) on) against the rule written
    out for one series at a time, NaN t's included, and a maximum lag of 0."""
    rng = np.random.default_rng(p)
    t = rng.normal(scale=1.6, size=(40, p + 1))
    t[::7, -1] = np.nan
    fits = nested.BlockFits(np.ones_like(t), np.ones_like(t), t, np.arange(p + 1))
    found = nested.lag_choices("tsig", fits, t[:, 1:], p)
    for b, row in enumerate(t.tolist()):
        chosen = next((lag for lag in range(p, 0, -1) if abs(row[lag]) >= 1.645), 0)
        low = max(chosen, 1)
        expected = [row[lag] if lag >= low else math.nan for lag in range(p + 1)]
        assert int(found.lags[b]) == chosen
        assert np.array_equal(found.criteria[b], expected, equal_nan=True)
