"""The analysis process (tauscope.ui.engine_process): results equal the engine's own, the
engine's exceptions and a dying process reach the caller, stopping and abandoning a run
leave the process ready for the next, and shutting down leaves no process behind."""

from __future__ import annotations

import os
from collections.abc import Iterator

import numpy as np
import pytest

from tauscope.engine import Settings
from tauscope.engine.procedure.many import iter_analyse
from tauscope.ui.engine_process import EngineProcess, EngineProcessLost, RemoteTraceback


def pairs(count: int, length: int = 80) -> list[tuple[str, np.ndarray]]:
    rng = np.random.default_rng(11)
    return [(f"s{i}", np.cumsum(rng.normal(size=length))) for i in range(count)]


@pytest.fixture
def engine_for() -> Iterator:  # type: ignore[type-arg]
    started: list[EngineProcess] = []

    def make(name: str) -> EngineProcess:
        engine = EngineProcess(f"engine_process_engines:{name}")
        started.append(engine)
        return engine

    yield make
    for engine in started:
        engine.shutdown()


def alive(pid: int) -> bool:
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    return True


def test_results_from_the_process_equal_the_engine_run_here() -> None:
    engine = EngineProcess()
    try:
        data = pairs(3)
        here = [r.to_dict() for r in iter_analyse(data, Settings())]
        there = [r.to_dict() for r in engine.iter_analyse(data, Settings())]
        assert there == here
        assert engine.pid is not None and engine.pid != os.getpid()
    finally:
        engine.shutdown()


def test_results_can_come_still_pickled_for_the_caller_to_unpickle(engine_for) -> None:  # type: ignore[no-untyped-def]
    from tauscope.ui.engine_process import Pickled

    engine = engine_for("lengths")
    packed = list(engine.iter_pickled(pairs(2, 50), None))
    assert all(isinstance(p, Pickled) for p in packed)
    assert [p.load()[:2] for p in packed] == [("s0", 50), ("s1", 50)]
    assert [r[:2] for r in engine.iter_analyse(pairs(2, 50), None)] == [("s0", 50), ("s1", 50)]


def test_runs_share_one_process(engine_for) -> None:  # type: ignore[no-untyped-def]
    engine = engine_for("lengths")
    first = list(engine.iter_analyse(pairs(3, 50), None))
    second = list(engine.iter_analyse(pairs(2, 60), None))
    assert [(n, k) for n, k, _ in first] == [("s0", 50), ("s1", 50), ("s2", 50)]
    assert [(n, k) for n, k, _ in second] == [("s0", 60), ("s1", 60)]
    assert {pid for *_, pid in first + second} == {engine.pid}


def test_an_exception_in_the_child_is_raised_here_with_its_traceback(engine_for) -> None:  # type: ignore[no-untyped-def]
    engine = engine_for("failing")
    stream = engine.iter_analyse(pairs(4), None)
    assert next(stream)[0] == "s0"
    with pytest.raises(ValueError, match="simulated failure in the child") as raised:
        next(stream)
    assert isinstance(raised.value.__cause__, RemoteTraceback)
    assert "failing" in str(raised.value.__cause__)  # the child's own traceback
    pid = engine.pid
    assert [n for n, *_ in engine.iter_analyse(pairs(1), None)] == ["s0"]  # ready again
    assert engine.pid == pid


def test_stop_ends_the_run_and_the_next_run_gets_only_its_own_results(engine_for) -> None:  # type: ignore[no-untyped-def]
    engine = engine_for("endless")
    stop = [False]
    received = []
    for item in engine.iter_analyse([("old", np.zeros(5))], None, lambda: stop[0]):
        received.append(item)
        if len(received) == 3:
            stop[0] = True
    assert len(received) >= 3  # the stream ended once the child saw the flag
    stream = engine.iter_analyse([("new", np.zeros(7))], None)
    assert next(stream)[:2] == ("new", 7)
    stream.close()


def test_an_abandoned_stream_leaves_nothing_for_the_next_run(engine_for) -> None:  # type: ignore[no-untyped-def]
    engine = engine_for("endless")
    stream = engine.iter_analyse([("old", np.zeros(5))], None)
    assert next(stream)[0] == "old"
    del stream  # dropped unfinished: the child is told to stop
    stream = engine.iter_analyse([("new", np.zeros(7))], None)
    assert [next(stream)[0] for _ in range(3)] == ["new"] * 3
    stream.close()


def test_a_dying_child_raises_lost_and_the_next_run_starts_another(engine_for) -> None:  # type: ignore[no-untyped-def]
    engine = engine_for("dying")
    stream = engine.iter_analyse(pairs(3), None)
    first = next(stream)
    with pytest.raises(EngineProcessLost, match="ended unexpectedly"):
        next(stream)
    assert not alive(first[2])
    name, _, pid = next(engine.iter_analyse([("live", np.zeros(4))], None))
    assert name == "live" and pid != first[2]


def test_shutdown_leaves_no_process(engine_for) -> None:  # type: ignore[no-untyped-def]
    engine = engine_for("endless")
    stream = engine.iter_analyse([("busy", np.zeros(5))], None)
    pid = next(stream)[2]
    engine.shutdown()  # in the middle of a run
    assert not engine.is_alive() and not alive(pid)


@pytest.mark.skipif(not hasattr(os, "nice"), reason="no process niceness on this platform")
def test_the_child_runs_below_the_windows_priority(engine_for) -> None:  # type: ignore[no-untyped-def]
    from tauscope.ui.engine_process import HELPER_NICENESS

    engine = engine_for("niceness")
    found = list(engine.iter_analyse(pairs(1), Settings()))
    assert found == [min(19, os.nice(0) + HELPER_NICENESS)]
