"""A batch's JSON entries encoded while the analysis goes on (Linux, a core to spare).

A .json file's "series" entries are each finding's ``to_dict()`` in compact JSON, one after
the other (:func:`tauscope.report.json_export.encode_series`); an entry does not depend on
the others.  So ``tauscope batch`` need not wait for the last series to encode the first:
each time a chunk of findings is ready (:meth:`EncodedPieces.add`), a copy of this process
("fork") encodes that chunk into a temporary file on an idle core while this process
analyses the next chunk, and ends.  When the file is written, :meth:`EncodedPieces.result`
waits for the copies, reads their parts back and hands them to the JSON writer, which puts
them between the file's head and tail: the same bytes as encoding them there and then.

Nothing is lost when this fails: a copy that cannot be made, that ends with an error or
that takes longer than :data:`WAIT_S`, makes :meth:`~EncodedPieces.result` answer None, and
the file is encoded whole as before.  The copies ignore Ctrl+C (the batch's to handle) and
are ended by :meth:`~EncodedPieces.close`.
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

WAIT_S = 120.0
"""The longest wait for all the copies at writing time; then the entries are encoded here."""
_POLL_S = 0.002


@dataclass
class _Piece:
    pid: int
    file: IO[bytes]
    findings: tuple[Finding, ...]
    ended: bool = False


def _encode_and_end(fd: int, findings: Sequence[Finding]) -> None:
    """The copy's whole life: encode ``findings`` into ``fd``, end with status 0 (1 on any
    error), never returning and without the interpreter's tidying up (which would free
    every object copied and flush the batch's own buffers a second time)."""
    status = 1
    try:
        signal.signal(signal.SIGINT, signal.SIG_IGN)
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
        self._broken = False

    def add(self, findings: Sequence[Finding]) -> None:
        """Start encoding ``findings`` (the next ones in the run's order) on a copy."""
        if self._broken or not findings:
            return
        try:
            file = tempfile.TemporaryFile(prefix="tauscope-json-")  # noqa: SIM115 (closed by close())
        except OSError:
            self._broken = True
            return
        try:
            pid = os.fork()
        except OSError:
            file.close()
            self._broken = True
            return
        if pid == 0:  # the copy
            _encode_and_end(file.fileno(), findings)
        self._pieces.append(_Piece(pid, file, tuple(findings)))

    def result(self, findings: Sequence[Finding], wait_s: float = WAIT_S) -> EncodedSeries | None:
        """The entries of ``findings`` once every copy has ended well, or None (a copy failed
        or was late, or the pieces are not those of ``findings``)."""
        if self._broken:
            return None
        deadline = time.monotonic() + wait_s
        parts = []
        for piece in self._pieces:
            if not self._ended_well(piece, deadline):
                self._broken = True
                return None
            piece.file.seek(0)
            parts.append(piece.file.read())
        encoded = EncodedSeries(tuple(f for piece in self._pieces for f in piece.findings),
                                tuple(parts))
        return encoded if encoded.fits(findings) else None

    @staticmethod
    def _ended_well(piece: _Piece, deadline: float) -> bool:
        """Wait for ``piece``'s copy until ``deadline``; True when it ended with status 0."""
        while not piece.ended:
            try:
                pid, status = os.waitpid(piece.pid, os.WNOHANG)
            except ChildProcessError:
                return False
            if pid:
                piece.ended = True
                return os.waitstatus_to_exitcode(status) == 0
            if time.monotonic() > deadline:
                return False
            time.sleep(_POLL_S)
        return True

    def close(self) -> None:
        """End any copy still running and free the temporary files."""
        for piece in self._pieces:
            if not piece.ended:
                with suppress(OSError):
                    os.kill(piece.pid, signal.SIGKILL)
                with suppress(OSError):
                    os.waitpid(piece.pid, 0)
                piece.ended = True
            piece.file.close()
        self._pieces = []
