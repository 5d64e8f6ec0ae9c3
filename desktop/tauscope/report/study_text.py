"""Telling a study whose text was cut short from one whose text was edited into bad JSON.

A file that stops part-way (a copy interrupted, a disk full) is a *prefix* of a
valid JSON text: the decoder fails only because the text ran out.  That holds
wherever the cut falls: between tokens, inside a string (``"C:\\Us``), inside a
number (``1.2e``), a literal (``tru``) or an escape (``\\u00``).  Anything else
is a real syntax error, reported with its line and column.
"""

from __future__ import annotations

import json
import re

# What may be left at the point where the decoder gave up, when the text was only cut:
# the start of a number or of one of the three literals.
_PARTIAL_TOKEN = re.compile(
    r"(?:-?(?:\d+)?(?:\.\d*)?(?:[eE][+-]?\d*)?|t(?:r(?:u)?)?|f(?:a(?:l(?:s)?)?)?|n(?:u(?:l)?)?)\Z"
)
# The tail of a string cut inside a "\uXXXX" escape: up to four hex digits (the decoder
# wants a character after the fourth before it accepts the escape).  A cut right after
# a lone backslash is reported by the decoder as an unterminated string.
_PARTIAL_ESCAPE = re.compile(r"\\?u[0-9a-fA-F]{0,4}\Z")


def ends_before_complete(text: str, error: json.JSONDecodeError) -> bool:
    """True when ``text`` fails to decode only because it stops before its JSON is complete.

    ``error`` is what :func:`json.loads` raised for ``text``; its ``pos`` is where the
    decoder gave up.  The text counts as cut short when what follows that point is
    nothing, an unterminated string (no closing quote before the end), or the
    beginning of a number, a literal or an escape that the end of the text interrupted.
    """
    tail = text[error.pos:].rstrip()
    if not tail:
        return True
    if error.msg.startswith("Unterminated string"):
        return True
    if error.msg.startswith("Invalid \\u"):
        # The decoder points at the "u" (or its backslash) of the escape it could not finish.
        return _PARTIAL_ESCAPE.match(text, error.pos) is not None
    return _PARTIAL_TOKEN.match(tail) is not None
