"""Control characters in text written to reports, per format.

Names are cleaned once when they are read (:func:`tauscope.data.cells.printable`), but a
report may still be handed text from elsewhere (a name typed in the window, a study
file).  Each writer passes its text through the helper for its format:

* xlsx: XML 1.0 forbids C0 control characters other than tab, line feed and carriage
  return; openpyxl refuses them (``IllegalCharacterError``).  They become U+FFFD.
* HTML: the same characters are parse errors in HTML; they become U+FFFD before the
  usual escaping.
* LaTeX: a control character in the source stops or confuses TeX (a blank line ends
  a table cell's paragraph); tab and line breaks become spaces, the others "?".
* PDF (drawn line by line): tab and line breaks become spaces, as they are in HTML, and the
  others U+FFFD.
"""

from __future__ import annotations

import re

REPLACEMENT = "\ufffd"
_CONTROL = re.compile(r"[\x00-\x08\x0b\x0c\x0e-\x1f\x7f]")
_ANY_CONTROL = re.compile(r"[\x00-\x1f\x7f]")


def xml_text(text: str) -> str:
    """``text`` with the characters XML 1.0 cannot hold replaced by U+FFFD."""
    return _CONTROL.sub(REPLACEMENT, text)


def html_text(text: str) -> str:
    """``text`` with control characters (tab and line breaks kept) replaced by U+FFFD."""
    return _CONTROL.sub(REPLACEMENT, text)


def tex_text(text: str) -> str:
    """``text`` with tab and line breaks as spaces and other control characters as "?"."""
    return _ANY_CONTROL.sub(lambda m: " " if m.group() in "\t\n\r" else "?", text)


def pdf_text(text: str) -> str:
    """``text`` with tab and line breaks as spaces and other control characters as U+FFFD."""
    return _ANY_CONTROL.sub(lambda m: " " if m.group() in "\t\n\r" else REPLACEMENT, text)
