"""The engine in a process of its own, so the window's process never waits for it.

A thread of the window's process still holds the interpreter lock for as long as one
C call or one burst of Python lasts, and a loaded machine makes those long: the window
froze for 100–160 ms at a time while a thread analysed a thousand series.  A child
process has its own interpreter, so it cannot hold the window's lock at all.

:class:`EngineProcess` starts one child (``multiprocessing``, the "spawn" start method:
a fresh interpreter, as on every platform, frozen bundle included, where
``multiprocessing.freeze_support()`` in the entry point answers the child's start) and
keeps it for the session: the engine's caches (the simulated critical values of the
seasonal tests take seconds per series length) live in the child and serve every run.
One run at a time goes through :meth:`EngineProcess.iter_analyse`, with the same
signature and results as the engine's ``iter_analyse``:

- the series go to the child one message each (name and values, a few kilobytes), and
  the results come back one message each, each result pickled on its own
  (:class:`Pickled`): :meth:`EngineProcess.iter_analyse` unpickles it in the calling
  thread, :meth:`EngineProcess.iter_pickled` leaves that to the caller.  The window's
  analysis worker thread only receives them, and the window's thread unpickles them a few
  at a time (about a millisecond each) when it shows them: a thread that unpickles holds
  the interpreter lock, and on a busy machine it lost its core while holding it, freezing
  the window for 100–170 ms;
- ``should_stop()`` is asked while the results are awaited; when it says stop, the
  child's stop flag (a shared ``Event``) is set, which the engine asks before each
  series, and the stream ends with the child's end-of-run message.  A stream left
  unfinished (the caller stopped reading) sets the flag too, and the next run first reads
  what the child still sends for the old one;
- an exception raised by the engine in the child is raised again by the stream, the
  child's traceback attached as its cause (the problem dialog shows it); a child that
  dies raises :class:`EngineProcessLost`, and the next run starts a new one;
- :meth:`EngineProcess.shutdown` (called at exit through ``atexit``) ends the child: it
  sets the stop flag, closes the pipe (the child ends when it next reads or writes) and
  terminates a child that has not ended within a second.
"""

from __future__ import annotations

import atexit
import multiprocessing
import os
import pickle
import sys
import threading
import traceback
from collections.abc import Callable, Generator, Iterable, Iterator
from contextlib import closing, suppress
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from tauscope.engine.collector import collector_paused

if TYPE_CHECKING:
    from multiprocessing.connection import Connection
    from multiprocessing.context import SpawnProcess
    from multiprocessing.synchronize import Event

    from tauscope.engine import SeriesResult, Settings

POLL_S = 0.02  # how often the waiting stream asks should_stop() (seconds)
DRAIN_S = 30.0  # the longest wait for the child to end an abandoned run before it is replaced
QUIT_S = 1.0  # the longest wait for the child to end by itself at shutdown
ENGINE = "tauscope.engine.procedure.many:iter_analyse"  # what the child runs


@dataclass(frozen=True)
class Pickled:
    """One result as the child pickled it, unpickled by :meth:`load` where it is wanted."""

    data: bytes

    def load(self) -> Any:
        return pickle.loads(self.data)


class EngineProcessLost(RuntimeError):
    """The analysis process ended (or could not be reached) in the middle of a run."""


class RemoteTraceback(Exception):
    """The child's traceback, attached as the cause of the exception raised again here."""

    def __str__(self) -> str:
        return str(self.args[0]) if self.args else ""


def _send_safely(conn: Connection, message: tuple[Any, ...]) -> bool:
    """Send from the child; False when the window's process has gone."""
    try:
        conn.send(message)
    except (OSError, EOFError):
        return False
    return True


def _picklable(exc: BaseException) -> BaseException:
    """``exc`` itself when it survives pickling, else a RuntimeError that names it."""
    try:
        pickle.loads(pickle.dumps(exc))
    except Exception:
        return RuntimeError(f"{type(exc).__name__}: {exc}")
    return exc


def _engine(name: str) -> Callable[..., Iterator[Any]]:
    """The function ``"module:function"`` names (imported in the child)."""
    import importlib

    module, _, function = name.partition(":")
    return getattr(importlib.import_module(module), function)


# How far below the window's own priority its helper processes run (Unix niceness; 0 to 19).
HELPER_NICENESS = 10


def _yield_to_the_window() -> None:
    """Run this child below the window's priority, so that when both want a core the window's
    thread gets it first and its event loop does not wait behind the analysis (on a machine
    with few cores and other work): niceness ``HELPER_NICENESS`` on Unix, the "below normal"
    priority class on Windows (not exercised by the tests, which run on Unix).  A refusal
    leaves the priority as it is."""
    if not HELPER_NICENESS:
        return
    if hasattr(os, "nice"):
        with suppress(OSError):
            os.nice(HELPER_NICENESS)
    elif sys.platform == "win32":
        import ctypes

        below_normal = 0x00004000  # BELOW_NORMAL_PRIORITY_CLASS
        kernel32 = ctypes.windll.kernel32  # type: ignore[attr-defined]
        with suppress(OSError, AttributeError):
            kernel32.SetPriorityClass(kernel32.GetCurrentProcess(), below_normal)


def serve(conn: Connection, stop: Event, engine: str = ENGINE) -> None:
    """The child's loop: one run per request, until "quit" or the pipe closes.

    A request is ``("run", number, settings, count)`` followed by ``count`` messages
    ``(name, values)``; the answer is one ``("result", number, SeriesResult)`` per series
    in order (fewer when stopped), an ``("error", number, exception, traceback text)`` if
    the engine raised, then ``("end", number)``.
    """
    import signal

    signal.signal(signal.SIGINT, signal.SIG_IGN)  # Ctrl+C in a terminal is the window's
    _yield_to_the_window()
    iter_analyse = _engine(engine)
    while True:
        try:
            request = conn.recv()
            if request[0] != "run":
                return
            _, number, settings, count = request
            # Unpickling makes many objects and no cycles: with the collector on, its passes
            # took about two thirds of the time for an export's 500 findings (0.5 against
            # 0.2 s, measured).
            with collector_paused():
                pairs = [conn.recv() for _ in range(count)]
        except (OSError, EOFError):
            return
        try:
            for result in iter_analyse(pairs, settings, stop.is_set):
                packed = Pickled(pickle.dumps(result, pickle.HIGHEST_PROTOCOL))
                if not _send_safely(conn, ("result", number, packed)):
                    return
        except Exception as exc:  # reported to the window, which marks the series concerned
            if not _send_safely(conn, ("error", number, _picklable(exc), traceback.format_exc())):
                return
        if not _send_safely(conn, ("end", number)):
            return


class EngineProcess:
    """One analysis process for the session, started when first needed.

    ``engine`` names the function the child runs (``"module:function"``, importable in the
    child), the engine's batched ``iter_analyse`` unless a test gives its own.
    """

    def __init__(self, engine: str = ENGINE) -> None:
        self.engine = engine
        self._lock = threading.Lock()
        self._process: SpawnProcess | None = None
        self._conn: Connection | None = None
        self._stop: Event | None = None
        self._runs = 0
        self._unfinished: int | None = None  # a run whose end the child has yet to send
        self._exit_hook = False

    def start(self) -> None:
        """Start the child now (it loads the statistics while the window waits for input)."""
        with self._lock:
            self._ready()

    def start_soon(self) -> None:
        """Start the child from a helper thread (the caller never waits for the lock)."""
        if self.is_alive():
            return

        def start() -> None:
            with suppress(Exception):  # the run itself tries again, and says why it cannot
                self.start()

        threading.Thread(target=start, name="tauscope-engine-start", daemon=True).start()

    def is_alive(self) -> bool:
        return self._process is not None and self._process.is_alive()

    @property
    def pid(self) -> int | None:
        return None if self._process is None else self._process.pid

    def _spawn(self) -> None:
        context = multiprocessing.get_context("spawn")
        here, there = context.Pipe(duplex=True)
        stop = context.Event()
        process = context.Process(target=serve, args=(there, stop, self.engine),
                                  name="tauscope-engine", daemon=True)
        process.start()
        there.close()
        self._process, self._conn, self._stop = process, here, stop
        self._unfinished = None
        if not self._exit_hook:
            atexit.register(self.shutdown)
            self._exit_hook = True

    def _ready(self) -> tuple[Connection, Event]:
        """The child, alive and idle: started when needed; the rest of an abandoned run read."""
        if not self.is_alive():
            self._discard()
            self._spawn()
        conn, stop = self._conn, self._stop
        assert conn is not None and stop is not None
        if self._unfinished is not None:
            stop.set()
            try:
                while True:
                    if not conn.poll(DRAIN_S):
                        raise EngineProcessLost("the analysis process did not end its run")
                    message = conn.recv()
                    if message[0] == "end" and message[1] == self._unfinished:
                        break
            except (OSError, EOFError, EngineProcessLost):
                self._discard()
                return self._ready()
            self._unfinished = None
        stop.clear()
        return conn, stop

    def _discard(self) -> None:
        """Forget the child, ending it if it still runs."""
        process, conn, stop = self._process, self._conn, self._stop
        self._process, self._conn, self._stop, self._unfinished = None, None, None, None
        if stop is not None:
            stop.set()
        if conn is not None:
            conn.close()
        if process is not None:
            process.join(QUIT_S)
            if process.is_alive():
                process.terminate()
                process.join(QUIT_S)
            if process.is_alive():
                process.kill()
                process.join()
            process.close()

    def shutdown(self) -> None:
        """End the child (the window is closing, or the program exits)."""
        with self._lock:
            self._discard()

    def _lost(self, exc: BaseException) -> EngineProcessLost:
        code = None if self._process is None else self._process.exitcode
        self._discard()
        ended = "" if code is None else f" (exit code {code})"
        return EngineProcessLost(f"the analysis process ended unexpectedly{ended}: "
                                 f"{type(exc).__name__}")

    def iter_analyse(self, series: Iterable[tuple[str, Any]], settings: Settings,
                     should_stop: Callable[[], bool] | None = None) -> Iterator[SeriesResult]:
        """The engine's ``iter_analyse`` run in the child: one result per series, in order."""
        with closing(self.iter_pickled(series, settings, should_stop)) as stream:
            for packed in stream:
                yield packed.load()

    def iter_pickled(self, series: Iterable[tuple[str, Any]], settings: Settings,
                     should_stop: Callable[[], bool] | None = None
                     ) -> Generator[Pickled, None, None]:
        """:meth:`iter_analyse` with each result still pickled, for the caller to unpickle
        where it wants (the window's thread, a few at a time: see ``tauscope.ui.worker``)."""
        pairs = list(series)
        asked_to_stop = should_stop or (lambda: False)
        with self._lock:
            conn, stop = self._ready()
            self._runs += 1
            number = self._runs
            try:
                conn.send(("run", number, settings, len(pairs)))
                for pair in pairs:
                    conn.send(pair)
            except (OSError, EOFError) as exc:
                raise self._lost(exc) from exc
            self._unfinished = number
        try:
            while True:
                if asked_to_stop():
                    stop.set()
                try:
                    if not conn.poll(POLL_S):
                        if not self.is_alive():
                            raise EOFError
                        continue
                    kind, tag, *rest = conn.recv()
                except (OSError, EOFError) as exc:
                    with self._lock:
                        raise self._lost(exc) from exc
                if tag != number:
                    continue
                if kind == "result":
                    yield rest[0]
                elif kind == "error":
                    error, text = rest
                    raise error from RemoteTraceback(text)
                else:  # "end"
                    self._unfinished = None
                    return
        finally:
            if self._unfinished == number:
                stop.set()  # the child ends the run; the next run reads what it still sends


_SHARED: dict[str, EngineProcess] = {}  # one child per function it runs, for the session
_shared_lock = threading.Lock()


def shared_process(engine: str = ENGINE) -> EngineProcess:
    """The session's child running ``engine`` (one per program, made when first asked for)."""
    with _shared_lock:
        found = _SHARED.get(engine)
        if found is None:
            found = _SHARED[engine] = EngineProcess(engine)
        return found


def shared_engine() -> EngineProcess:
    """The session's analysis process (one per program)."""
    return shared_process(ENGINE)
