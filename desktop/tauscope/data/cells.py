"""Single cells: missing-value codes and numbers written with either decimal mark."""

from __future__ import annotations

import datetime as dt
import math
import re
from collections.abc import Iterable
from dataclasses import dataclass

Cell = str | float | int | bool | dt.datetime | dt.date | dt.time | dt.timedelta | None

MISSING_CODES = frozenset(
    code.casefold()
    for code in (
        "", ".", "..", "...", "…", "-", "--", "---", "–", "—", ":", "NA", "N/A", "N.A.", "n.a",
        "NaN", "null", "none", "nil", "missing", "(NA)", "(D)", "(X)", "(S)", "x", "NV",
        "#N/A", "#NA", "#N/A N/A", "#VALUE!", "#DIV/0!", "#REF!", "#NUM!", "#NAME?", "#NULL!",
        "#GETTING_DATA", "#SPILL!", "#CALC!", "#FIELD!",
    )
)

SPACES = "\u00a0\u202f\u2009 '’"
_NUMBER_SHAPE = re.compile(
    r"^[+-]?(\d[\d.,\u00a0\u202f\u2009 '’]*)?\d(\s?%)?$|^[+-]?[.,]\d+(\s?%)?$")
_PLAIN = re.compile(r"^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$")
# Statistical flags after a value, e.g. "12.3 p" (provisional), "13.1 e" (estimated), "7 b".
_FLAGGED = re.compile(r"^(.*\d)\s*([bcdefinprsuz]{1,3})$")


def printable(text: str) -> str:
    """``text`` as one line of visible characters: control and format characters (ESC,
    carriage returns, zero-width and direction marks) and line breaks become spaces, and
    runs of spaces one space.  Every name read from a file passes through here once."""
    if text.isprintable():
        return " ".join(text.split())
    return " ".join("".join(ch if ch.isprintable() else " " for ch in text).split())


def is_missing_code(text: str) -> bool:
    return text.strip(" \u00a0").casefold() in MISSING_CODES


@dataclass(frozen=True)
class NumberFormat:
    """How numbers are written in one file: decimal mark and thousands separator."""

    decimal: str = "."
    thousands: str = ","

    def parse(self, text: str) -> float | None:
        """The number ``text`` stands for, or None (also for nan and infinity)."""
        s = text.strip().replace("\u2212", "-")
        if not s:
            return None
        if s.startswith("(") and s.endswith(")"):  # accounting negatives: (123)
            inner = self.parse(s[1:-1])
            return -inner if inner is not None else None
        if _PLAIN.match(s) and (self.decimal == "." or "." not in s):
            value = float(s)
            return value if math.isfinite(value) else None
        if not _NUMBER_SHAPE.match(s):
            flagged = _FLAGGED.match(s)
            return self.parse(flagged.group(1)) if flagged else None
        s = s.rstrip("%").rstrip()
        for space in SPACES:
            s = s.replace(space, "")
        return self._grouped(s)

    def _grouped(self, s: str) -> float | None:
        """Check thousands groups of three digits before the one decimal mark, then convert."""
        if s.count(self.decimal) > 1:
            return None
        whole, _, fraction = s.partition(self.decimal)
        if self.thousands and self.thousands in fraction:
            return None
        if self.thousands and self.thousands in whole:
            groups = whole.lstrip("+-").split(self.thousands)
            if not groups[0] or any(len(g) != 3 for g in groups[1:]):
                return None
            whole = whole.replace(self.thousands, "")
        try:
            value = float(f"{whole}.{fraction}" if fraction else whole)
        except ValueError:
            return None
        return value if math.isfinite(value) else None


POINT = NumberFormat(".", ",")
COMMA = NumberFormat(",", ".")


def detect_number_format(texts: Iterable[str], prefer_comma: bool = False) -> NumberFormat:
    """Vote on the decimal mark from number-like texts.

    "1.234,5" or "1,5" votes for a decimal comma, "1,234.5" or "1.5" for a decimal point;
    "1,234" and "1.234" are ambiguous and decided by ``prefer_comma`` (semicolon files).
    """
    comma = point = 0
    for raw in texts:
        s = raw.strip().lstrip("+-−(").rstrip(")%")
        if not s or not _NUMBER_SHAPE.match(s):
            continue
        last_comma, last_point = s.rfind(","), s.rfind(".")
        if last_comma >= 0 and last_point >= 0:
            if last_comma > last_point:
                comma += 1
            else:
                point += 1
        elif last_comma >= 0:
            if s.count(",") > 1:
                point += 1
            elif len(s) - last_comma - 1 != 3 or s.startswith(","):
                comma += 1
        elif last_point >= 0:
            if s.count(".") > 1:
                comma += 1
            elif len(s) - last_point - 1 != 3 or s.startswith("."):
                point += 1
        if comma + point > 2000:
            break
    if comma > point or (comma == point and prefer_comma):
        return COMMA
    return POINT
