"""A study's text: written compactly without holding the interpreter lock for long
(:func:`compact_dumps`), and, read back, telling a text cut short from one edited into bad JSON.

A file that stops part-way (a copy interrupted, a disk full) is a *prefix* of a
valid JSON text: the decoder fails only because the text ran out.  That holds
wherever the cut falls: between tokens, inside a string (``"C:\\Us``), inside a
number (``1.2e``), a literal (``tru``) or an escape (``\\u00``).  Anything else
is a real syntax error, reported with its line and column.
"""

from __future__ import annotations

import json
import re
import uuid
from typing import Any

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


def compact_dumps(data: dict[str, Any]) -> list[str]:
    """Compact JSON in pieces, the findings encoded one call each: joined, the very text of one
    ``json.dumps`` call on the whole (plus a newline).  json's C encoder holds the interpreter
    lock for the length of a call, and a thousand findings (some 55 MB) in one call held it
    for over a second, freezing the window while a helper thread saved the study; the pieces
    are written one after the other, never joined (``atomic.write_text_atomic``)."""
    findings = data.get("findings")
    if not isinstance(findings, list) or not findings:
        return [json.dumps(data, **_COMPACT) + "\n"]
    marker = f"findings-{uuid.uuid4().hex}"  # a string no study holds
    head, _, tail = json.dumps({**data, "findings": marker}, **_COMPACT).partition(json.dumps(marker))
    pieces = [head + "["]
    for number, finding in enumerate(findings):
        pieces.append(("," if number else "") + json.dumps(finding, **_COMPACT))
    pieces.append("]" + tail + "\n")
    return pieces


_COMPACT: dict[str, Any] = {"ensure_ascii": False, "allow_nan": False, "separators": (",", ":")}
