"""A batch's JSON entries encoded while the analysis goes on (Linux, a core to spare).

A .json file's "series" entries are each finding's ``to_dict()`` in compact JSON, one after
the other (:func:`tauscope.report.json_export.encode_series`); an entry does not depend on
the others.  So ``tauscope batch`` need not wait for the last series to encode the first:
each time a chunk of findings is ready (:meth:`EncodedPieces.add`), a copy of this process
("fork") encodes that chunk into a temporary file on an idle core while this process
analyses the next chunk, and ends.  When the file is written, :meth:`EncodedPieces.result`
collects the copies' parts and hands them to the JSON writer, which puts them between the
file's head and tail: the same bytes as encoding them there and then.

Nothing is lost when a copy fails: a chunk whose copy cannot be made, ends with an error, or
has not ended by the deadline (:data:`WAIT_S` plus :data:`WAIT_PER_SERIES_S` a series of the
run, counted from :meth:`~EncodedPieces.result`) is encoded by the batch itself there.  The
copies ignore Ctrl+C (the batch's to handle; it is blocked while a copy is made, so none
can reach a copy before it ignores it) and are ended by :meth:`~EncodedPieces.close`.  A
copy that has ended is reaped, and its part read and its file closed, at the next
:meth:`~EncodedPieces.add`, so a long run holds a file and a process only for the copies
still encoding.
"""

from __future__ import annotations

import gc
import os
import signal
import tempfile
import time
from collections.abc import Sequence
from contextlib import suppress
from dataclasses import dataclass
from typing import IO

from tauscope.report import EncodedSeries, Finding
from tauscope.report.json_export import encode_series

WAIT_S = 2.0
WAIT_PER_SERIES_S = 0.004
"""The wait for the copies at writing time: WAIT_S plus WAIT_PER_SERIES_S a series (4 s for
500 series, whose entries the batch encodes in about 0.7 s here); a chunk not encoded by
then is encoded by the batch."""
_POLL_S = 0.002


@dataclass
class _Piece:
    findings: tuple[Finding, ...]
    pid: int | None = None  # the copy encoding it (None: none, or reaped)
    file: IO[bytes] | None = None
    part: bytes | None = None  # the copy's entries once read back


def _encode_and_end(fd: int, findings: Sequence[Finding], mask: set[int | signal.Signals]) -> None:
    """The copy's whole life: ignore Ctrl+C, then the signal mask back to ``mask``; encode
    ``findings`` into ``fd``; end with status 0 (1 on any error), never returning and without
    the interpreter's tidying up (which would free every object copied and flush the
    batch's own buffers a second time)."""
    status = 1
    try:
        signal.signal(signal.SIGINT, signal.SIG_IGN)
        signal.pthread_sigmask(signal.SIG_SETMASK, mask)
        gc.disable()  # short-lived: nothing of its own to collect
        view = memoryview(encode_series(findings))
        while view:
            view = view[os.write(fd, view):]
        status = 0
    finally:
        os._exit(status)


class EncodedPieces:
    """The JSON entries of a batch's findings, encoded chunk by chunk by copies of this
    process (see the module's text)."""

    def __init__(self) -> None:
        self._pieces: list[_Piece] = []

    def add(self, findings: Sequence[Finding]) -> None:
        """Start encoding ``findings`` (the next ones in the run's order) on a copy."""
        if not findings:
            return
        self._reap()
        piece = _Piece(tuple(findings))
        self._pieces.append(piece)
        try:
            file = tempfile.TemporaryFile(prefix="tauscope-json-")  # noqa: SIM115 (closed by _reap, close)
        except OSError:
            return  # encoded by the batch at writing time
        # Ctrl+C blocked while the copy is made: the copy ignores it before it can arrive
        mask = signal.pthread_sigmask(signal.SIG_BLOCK, {signal.SIGINT})
        try:
            pid = os.fork()
        except OSError:
            signal.pthread_sigmask(signal.SIG_SETMASK, mask)
            file.close()
            return
        if pid == 0:  # the copy
            _encode_and_end(file.fileno(), piece.findings, mask)
        signal.pthread_sigmask(signal.SIG_SETMASK, mask)
        piece.pid, piece.file = pid, file

    def result(self, findings: Sequence[Finding],
               wait_s: float | None = None) -> EncodedSeries | None:
        """The entries of ``findings`` (None when the pieces are not those of ``findings``):
        each chunk's from its copy when it ended well by the deadline, else encoded here."""
        covered = tuple(f for piece in self._pieces for f in piece.findings)
        if not EncodedSeries(covered, ()).fits(findings):
            return None
        if wait_s is None:
            wait_s = WAIT_S + WAIT_PER_SERIES_S * len(findings)
        deadline = time.monotonic() + wait_s
        while any(p.pid is not None for p in self._pieces) and time.monotonic() < deadline:
            if not self._reap():
                time.sleep(_POLL_S)
        self._end_copies()  # any copy still running is late
        return EncodedSeries(covered, tuple(p.part if p.part is not None
                                            else encode_series(p.findings)
                                            for p in self._pieces))

    def _reap(self) -> bool:
        """Collect every copy that has ended: its part when it ended well (status 0), its file
        closed; True when any had ended."""
        reaped = False
        for piece in self._pieces:
            if piece.pid is None:
                continue
            try:
                pid, status = os.waitpid(piece.pid, os.WNOHANG)
            except ChildProcessError:
                pid, status = piece.pid, -1
            if not pid:
                continue
            reaped = True
            piece.pid = None
            assert piece.file is not None
            if status != -1 and os.waitstatus_to_exitcode(status) == 0:
                piece.file.seek(0)
                piece.part = piece.file.read()
            piece.file.close()
            piece.file = None
        return reaped

    def _end_copies(self) -> None:
        """End and reap any copy still running; free the temporary files."""
        for piece in self._pieces:
            if piece.pid is not None:
                with suppress(OSError):
                    os.kill(piece.pid, signal.SIGKILL)
                with suppress(OSError):
                    os.waitpid(piece.pid, 0)
                piece.pid = None
            if piece.file is not None:
                piece.file.close()
                piece.file = None

    def close(self) -> None:
        """End any copy still running and free the temporary files."""
        self._end_copies()
        self._pieces = []
