"""analyse_many: the whole testing job for many series, batched.

Series are read in chunks of :data:`CHUNK` in input order; within a chunk the
series of equal length (after trimming) share one :class:`fast_path.SeriesBatch`, so
their regressions are factorised together (:mod:`tauscope.engine.regression.nested`).  Only
one chunk's design matrices exist at a time, so the working memory does not grow
with the number of series.  Each result equals ``analyse_series(values, settings,
name)``; a series the fast path declines is analysed by the reference path.
"""

from __future__ import annotations

import gc
from collections.abc import Callable, Iterable, Iterator, Sequence
from contextlib import suppress
from itertools import islice
from typing import Any

import numpy as np

from tauscope.engine.blas_threads import single_blas_thread
from tauscope.engine.collector import collector_paused
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.procedure.analyse import (
    FALLBACK_ERRORS,
    analyse_prepared,
    analyse_series,
    decide,
    finish,
)
from tauscope.engine.procedure.cross_check import kpss_requests, recursive_requests
from tauscope.engine.procedure.fast_path import SeriesBatch
from tauscope.engine.procedure.prepare import PreparedSeries, prepare
from tauscope.engine.procedure.seasonal_means import with_seasonal_many
from tauscope.engine.procedure.stages import Decision, Plan, plan_for
from tauscope.engine.reference.estimation import REFERENCE
from tauscope.engine.results import SeriesResult
from tauscope.engine.settings import Settings

# Series per chunk: 128 measured fastest (1,000 series × 240, median CPU of five runs
# each: 64 → 2.60 s, 100 → 2.53 s, 128 → 2.50 s, 160 → 2.54 s); fewer numpy calls per
# series, at a working memory of about 25 MB at T = 240 (12.8 MB with 64).
CHUNK = 128
_PREPARE_ERRORS = (np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)

Progress = Callable[[int, int, str], None]
ShouldStop = Callable[[], bool]


def analyse_many(
    series: Iterable[tuple[str, Any]],
    settings: Settings | None = None,
    progress: Progress | None = None,
    should_stop: ShouldStop | None = None,
) -> list[SeriesResult]:
    """Analyse every series; results in input order.

    ``series``: (name, values) pairs, ``values`` as for :func:`analyse_series`
    (array-like or a pandas Series).  An iterator is read into a list first, to know
    the total.  ``progress(done, total, name)`` is called after each series;
    ``should_stop()`` is asked before each series and before each batch, and when it
    returns True the results finished so far are returned.  A series that cannot be
    tested comes back with ``error`` set, and the others carry on.
    """
    items = series if isinstance(series, Sequence) else list(series)
    results: list[SeriesResult] = []
    # Every result is kept until the end, so the collector stays paused over the whole run
    # rather than a chunk at a time: its passes at each chunk's end would walk the results
    # kept so far again and again, and find nothing to free (see iter_analyse).
    with collector_paused():
        for result in iter_analyse(items, settings, should_stop):
            results.append(result)
            if progress is not None:
                progress(len(results), len(items), result.name)
    if gc.isenabled():
        gc.collect(0)  # the young generation (this run's objects) once, here, not at every chunk
    return results


def iter_analyse(
    series: Iterable[tuple[str, Any]],
    settings: Settings | None = None,
    should_stop: ShouldStop | None = None,
) -> Iterator[SeriesResult]:
    """One result per series, in input order, computed a chunk at a time; stops early
    when ``should_stop()`` returns True (asked before each series and each chunk).  BLAS
    runs on one thread meanwhile (:mod:`tauscope.engine.blas_threads`)."""
    settings = settings or Settings()
    plan = plan_for(settings)
    stop = should_stop or (lambda: False)
    pairs = iter(series)
    with single_blas_thread():
        while True:
            if stop():
                return
            chunk = list(islice(pairs, CHUNK))
            if not chunk:
                return
            # The collector is paused while a chunk is worked on (not across the yields, so
            # the caller's own work between results is untouched): the stages make many
            # short-lived objects and no cycles, and its passes cost about a tenth of the run.
            with collector_paused():
                results = list(_analyse_chunk(chunk, settings, plan, stop))
            for result in results:
                if stop():  # asked before each series handed over, as before each computed
                    return
                yield result
            if len(results) < len(chunk):
                return  # stopped within the chunk


def _analyse_chunk(chunk: list[tuple[str, Any]], settings: Settings, plan: Plan,
                   stop: ShouldStop) -> Iterator[SeriesResult]:
    """The pipeline stage by stage over a chunk: prepare every series; estimate and
    decide every series (each difference level factorised once for all series of one
    length); every lag profile of one kind in one call; then cross-check, read and
    assemble series by series.  Stops early (fewer results) when ``stop()`` says so."""
    prepared: list[PreparedSeries | None] = []
    for _, values in chunk:
        try:
            prepared.append(prepare(values))
        except (UntestableSeries, *_PREPARE_ERRORS):
            prepared.append(None)  # analyse_series gives the message
    prepared = with_seasonal_many(prepared, plan.estimate.seasonal)  # likewise None on failure
    by_length: dict[tuple[int, int | None], list[int]] = {}
    for position, item in enumerate(prepared):
        if item is not None:
            by_length.setdefault((item.values.shape[0], item.dummies_period), []).append(position)
    slots: dict[int, tuple[SeriesBatch, int]] = {}
    for (_, period), positions in by_length.items():
        batch = SeriesBatch([_values(prepared[i]) for i in positions], plan.estimate, period)
        for slot, position in enumerate(positions):
            slots[position] = (batch, slot)

    decisions: dict[int, Decision] = {}
    wanted: dict[SeriesBatch, list[tuple[int, str, int, int]]] = {}
    windows: dict[SeriesBatch, list[tuple[int, str, int, int]]] = {}
    seasonal: dict[SeriesBatch, list[tuple[int, int]]] = {}
    kpss: dict[SeriesBatch, list[tuple[int, np.ndarray, str, int]]] = {}
    for position, item in enumerate(prepared):
        if stop():
            return
        if item is None:
            continue
        batch, slot = slots[position]
        try:
            decision = decide(item, plan, batch.estimation(slot))
        except FALLBACK_ERRORS:
            continue  # the reference path takes this series below
        decisions[position] = decision
        wanted.setdefault(batch, []).append((slot, *decision.profile_request))
        windows.setdefault(batch, []).extend((slot, *request) for request in recursive_requests(decision))
        if item.seasonal is not None:
            seasonal.setdefault(batch, []).append((slot, item.seasonal.period))
        with suppress(*FALLBACK_ERRORS):  # a level that fails is met again in the cross-check
            kpss.setdefault(batch, []).extend(
                (slot, item.level(d), spec, d) for spec, d in kpss_requests(decision, plan.cross_check))
    for batch, requests in wanted.items():
        # On failure each series asks on its own below, and falls back if it must.
        with suppress(*FALLBACK_ERRORS):
            batch.prefetch_profiles(requests)
    for batch, requests in windows.items():
        with suppress(*FALLBACK_ERRORS):  # likewise: a failing series asks alone below
            batch.prefetch_recursive(requests, plan.cross_check.alpha)
    for batch, pairs in seasonal.items():  # errors are kept per series: none escapes here
        batch.seasonal.prefetch(pairs, plan.cross_check.alpha)
    for batch, tests in kpss.items():
        with suppress(*FALLBACK_ERRORS):  # likewise: a failing series asks alone below
            batch.kpss_tests.prefetch(tests, plan.cross_check.alpha)

    for position, (name, values) in enumerate(chunk):
        if stop():
            return
        item = prepared[position]
        if item is None:
            yield analyse_series(values, settings, name)
            continue
        yield _finish_one(item, plan, name, slots[position], decisions.get(position))


def _finish_one(item: PreparedSeries, plan: Plan, name: str,
                slot: tuple[SeriesBatch, int], decision: Decision | None) -> SeriesResult:
    if decision is not None:
        batch, index = slot
        try:
            return finish(decision, plan, name, batch.estimation(index))
        except FALLBACK_ERRORS:
            pass
    return analyse_prepared(item, plan, name, REFERENCE)


def _values(item: PreparedSeries | None) -> np.ndarray:
    assert item is not None
    return item.standardised
