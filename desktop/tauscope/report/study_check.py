"""The shape of a study file, checked before any of it is used.

A study file may come from anywhere (a colleague, a download, a damaged disk), so it is
checked in bounded steps, each ending in one short reason (``ValueError``) that
:func:`tauscope.report.study.load_study` turns into its ``StudyError``:

1. size: at most ``MAX_STUDY_BYTES``;
2. nesting: brackets are counted outside strings, in C-speed passes (regular
   expressions and numpy), and more than ``MAX_DEPTH`` levels are refused before the
   JSON decoder, which would recurse, ever sees the text;
3. numbers: whole numbers longer than ``MAX_DIGITS`` digits are refused while decoding
   (Python refuses to convert beyond 4,300 digits anyway, with an error of its own);
4. types: every entry Tauscope uses has the expected type and a sensible range (paths
   and names of bounded length, whole numbers for lag orders), see :func:`check_settings`
   and :func:`check_text`.
"""

from __future__ import annotations

import json
import re
from typing import Any

import numpy as np

MAX_STUDY_BYTES = 64 << 20
MAX_DEPTH = 64
MAX_DIGITS = 30
MAX_PATH = 4096
MAX_NAME = 1000
MAX_LAGS = 10_000
_STRING = re.compile(r'"(?:[^"\\]|\\.)*"?', re.DOTALL)
_NOT_BRACKET = re.compile(r"[^\[\]{}]+")

# Settings entries and the type each must have (None allowed where the engine allows it).
SETTING_TYPES: dict[str, tuple[type, ...]] = {
    "lag_rule": (str,), "lags": (int, type(None)), "max_lags": (int, type(None)),
    "alpha": (float, int), "max_difference": (int,), "confirm": (list,),
    "critical_values": (str,), "break_model": (str,),
}


def nesting_depth(text: str) -> int:
    """The deepest nesting of ``[`` and ``{`` outside strings."""
    brackets = _NOT_BRACKET.sub("", _STRING.sub("", text))
    if not brackets:
        return 0
    codes = np.frombuffer(brackets.encode("ascii"), dtype=np.uint8)
    steps = np.where((codes == ord("[")) | (codes == ord("{")), 1, -1)
    return int(np.cumsum(steps).max())


def _whole_number(text: str) -> int:
    if len(text.lstrip("-")) > MAX_DIGITS:
        raise ValueError(f"it holds a number with {len(text):,} digits")
    return int(text)


def decode(text: str) -> Any:
    """JSON text into Python values after the size and nesting checks; the decoder's own
    ``json.JSONDecodeError`` passes through (the caller explains it)."""
    if len(text) > MAX_STUDY_BYTES:
        raise ValueError(f"it is larger than a study can be ({len(text) >> 20:,} MB)")
    depth = nesting_depth(text)
    if depth > MAX_DEPTH:
        raise ValueError(f"it is nested {depth:,} levels deep, more than a study ever is")
    return json.loads(text, parse_int=_whole_number)


def check_text(value: Any, where: str, limit: int = MAX_NAME) -> str:
    """``value`` when it is a string of at most ``limit`` characters without NUL."""
    if not isinstance(value, str):
        raise ValueError(f"{where} is not text")
    if len(value) > limit or "\x00" in value:
        raise ValueError(f"{where} is {len(value):,} characters long or holds a NUL character")
    return value


def check_path(value: Any, where: str) -> str:
    """A file path as a study stores it: text of bounded length, each part at most 255."""
    path = check_text(value, where, MAX_PATH)
    if any(len(part) > 255 for part in re.split(r"[\\/]", path)):
        raise ValueError(f"{where} has a folder or file name longer than 255 characters")
    return path


def check_settings(data: dict[str, Any]) -> dict[str, Any]:
    """The settings entries with the types the engine expects, whole numbers in range."""
    for key, kinds in SETTING_TYPES.items():
        if key not in data:
            continue
        value = data[key]
        if isinstance(value, bool) or not isinstance(value, kinds):
            raise ValueError(f"the setting “{key}” has the wrong type")
        if isinstance(value, int) and not 0 <= value <= MAX_LAGS:
            raise ValueError(f"the setting “{key}” is out of range ({value})")
        if isinstance(value, list) and not all(isinstance(t, str) and len(t) < 20 for t in value):
            raise ValueError("the setting “confirm” is not a list of test names")
    return data


def check_string_list(value: Any, where: str) -> list[str]:
    if not isinstance(value, list):
        raise ValueError(f"{where} is not a list")
    return [check_text(item, where) for item in value]


def require(data: dict[str, Any], key: str, kind: type | tuple[type, ...], where: str) -> Any:
    """``data[key]`` when present and of type ``kind``; ValueError naming it otherwise."""
    if key not in data:
        raise ValueError(f"{where} has no “{key}”")
    value = data[key]
    if not isinstance(value, kind):
        raise ValueError(f"{where}: “{key}” has the wrong type")
    return value
