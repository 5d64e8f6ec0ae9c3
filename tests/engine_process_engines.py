"""Stand-in engines for tests/test_ui_engine_process.py, importable by name in the child
process (``EngineProcess(engine="engine_process_engines:...")``).  Each takes the engine's
arguments (pairs, settings, should_stop) and yields plain data."""

from __future__ import annotations

import os
import time
from collections.abc import Callable, Iterator
from typing import Any


def lengths(pairs: list[tuple[str, Any]], _settings: Any,
            should_stop: Callable[[], bool]) -> Iterator[tuple[str, int, int]]:
    """(name, number of values, the child's process id) per series."""
    for name, values in pairs:
        if should_stop():
            return
        yield name, len(values), os.getpid()


def failing(pairs: list[tuple[str, Any]], settings: Any,
            should_stop: Callable[[], bool]) -> Iterator[tuple[str, int, int]]:
    """The first series, then a failure."""
    for number, item in enumerate(lengths(pairs, settings, should_stop)):
        if number == 1:
            raise ValueError("simulated failure in the child")
        yield item


def endless(pairs: list[tuple[str, Any]], _settings: Any,
            should_stop: Callable[[], bool]) -> Iterator[tuple[str, int, int]]:
    """The first series' answer again and again until told to stop."""
    name, values = pairs[0]
    while not should_stop():
        yield name, len(values), os.getpid()
        time.sleep(0.01)


def dying(pairs: list[tuple[str, Any]], settings: Any,
          should_stop: Callable[[], bool]) -> Iterator[tuple[str, int, int]]:
    """The first series' answer, then the process ends abruptly; a series named "live"
    alone is answered normally (the next run, in a new process)."""
    if [name for name, _ in pairs] == ["live"]:
        yield from lengths(pairs, settings, should_stop)
        return
    yield next(lengths(pairs, settings, should_stop))
    os._exit(3)


def silent(pairs: list[tuple[str, Any]], _settings: Any,
           should_stop: Callable[[], bool]) -> Iterator[tuple[str, int, int]]:
    """Never answers (until told to stop): a child that hangs."""
    while not should_stop():
        time.sleep(0.01)
    yield from ()


def ending(pairs: list[tuple[str, Any]], _settings: Any,
           _should_stop: Callable[[], bool]) -> Iterator[Any]:
    """The process ends abruptly before answering, whatever it was sent."""
    os._exit(3)
    yield pairs  # never reached: makes this a generator like the others


def niceness(pairs: list[tuple[str, Any]], _settings: Any,
             _should_stop: Callable[[], bool]) -> Iterator[int]:
    """The child's niceness (Unix only)."""
    yield os.nice(0)
