"""Text files (.csv, .txt, .tsv): encoding, delimiter and decimal mark, then rows of cells.

Encoding: UTF-8 (with or without byte-order mark), UTF-16 with a byte-order mark, else
Windows-1252, falling back to Latin-1 for the five bytes Windows-1252 leaves undefined.
Delimiter: whichever of tab, semicolon, comma and bar splits the lines into the most
value-like fields (numbers, dates, missing-value codes).
"""

from __future__ import annotations

import codecs
import csv
import io

from tauscope.data.cells import NumberFormat, detect_number_format, is_missing_code
from tauscope.data.dates import parse_label
from tauscope.data.errors import DataError

DELIMITERS = ("\t", ";", ",", "|")
DELIMITER_NAMES = {"\t": "tab", ";": "semicolon", ",": "comma", "|": "bar"}
SAMPLE_LINES = 300
SAMPLE_CHARS = 32_000  # the delimiter vote reads at most this much text (and 5 lines)
MAX_FIELD = 1_000_000


def decode(data: bytes, file: str) -> tuple[str, str]:
    """The text and the name of its encoding; DataError for binary content."""
    if data.startswith(codecs.BOM_UTF8):
        return _strict(data[3:], "utf-8", file), "UTF-8 (with byte-order mark)"
    if data.startswith((codecs.BOM_UTF16_LE, codecs.BOM_UTF16_BE)):
        return _strict(data, "utf-16", file), "UTF-16"
    head = data[:65536]
    controls = sum(1 for b in head if b < 32 and b not in (9, 10, 12, 13))
    if b"\x00" in head or controls > max(2, len(head) // 100):
        raise DataError("is not a text file (it holds binary data); is it a workbook with the "
                        "wrong name ending?", file=file)
    try:
        return data.decode("utf-8"), "UTF-8"
    except UnicodeDecodeError:
        pass
    try:
        return data.decode("cp1252"), "Windows-1252"
    except UnicodeDecodeError:
        return data.decode("latin-1"), "Latin-1"


def _strict(data: bytes, encoding: str, file: str) -> str:
    try:
        text = data.decode(encoding)
    except UnicodeDecodeError:
        raise DataError(f"is not valid {encoding.upper()} text", file=file) from None
    return text.lstrip("\ufeff")


def _value_like(field: str, numbers: NumberFormat) -> bool:
    text = field.strip()
    if not text:
        return False
    return is_missing_code(text) or numbers.parse(text) is not None or parse_label(text) is not None


def lines_of(text: str) -> list[str]:
    """The file's lines.  A file with line feeds ends its lines only there (a carriage
    return before one is dropped, a stray one inside a cell becomes a space), so a form
    feed or other separator inside a cell stays in that cell; a file without any line
    feed is split at carriage returns (old Mac files)."""
    if "\n" in text:
        return [(line[:-1] if line.endswith("\r") else line).replace("\r", " ")
                for line in text.split("\n")]
    return text.split("\r")


def split(text: str, delimiter: str | None) -> list[list[str]]:
    lines = lines_of(text)
    if delimiter is None:
        return [[line] for line in lines]
    csv.field_size_limit(MAX_FIELD)
    reader = csv.reader(io.StringIO("\n".join(lines)), delimiter=delimiter, quotechar='"',
                        skipinitialspace=delimiter != "\t", strict=False)
    try:
        return [list(row) for row in reader]
    except csv.Error as exc:
        raise DataError(f"could not be split into fields ({exc})", file=None) from None


def detect_delimiter(text: str) -> str | None:
    sample_lines: list[str] = []
    size = 0
    for line in lines_of(text[: SAMPLE_CHARS * 4])[:SAMPLE_LINES]:
        if size > SAMPLE_CHARS and len(sample_lines) >= 5:
            break
        sample_lines.append(line)
        size += len(line)
    sample = "\n".join(sample_lines)
    loose = NumberFormat(",", "")
    best: tuple[int, int, str | None] = (0, 0, None)
    for delimiter in DELIMITERS:
        try:
            rows = split(sample, delimiter)
        except DataError:
            continue
        wide = [r for r in rows if len(r) > 1]
        score = sum(1 for r in wide for f in r if _value_like(f, loose) or _value_like(f, NumberFormat()))
        if (score, len(wide)) > best[:2]:
            best = (score, len(wide), delimiter)
    return best[2]


def read_text_rows(data: bytes, file: str) -> tuple[list[list[str]], NumberFormat, list[str]]:
    """Rows of text cells, how numbers are written, and notes on what was detected."""
    text, encoding, delimiter = detect(data, file)
    rows = _split_all(text, delimiter, file)
    numbers = detect_number_format(
        (cell for row in rows[:5000] for cell in row[1:] if cell), prefer_comma=delimiter == ";"
    )
    return rows, numbers, reading_note(encoding, delimiter, numbers)


def detect(data: bytes, file: str) -> tuple[str, str, str | None]:
    text, encoding = decode(data, file)
    if "\x00" in text:
        text = text.replace("\x00", "")
    if not text.strip():
        raise DataError("is empty", file=file)
    return text, encoding, detect_delimiter(text)


def _split_all(text: str, delimiter: str | None, file: str) -> list[list[str]]:
    try:
        return split(text, delimiter)
    except DataError as exc:
        raise DataError(exc.reason, file=file) from None


def reading_note(encoding: str, delimiter: str | None, numbers: NumberFormat) -> list[str]:
    return [f"Read as {encoding} text"
            + (f", fields separated by {DELIMITER_NAMES[delimiter]}" if delimiter else "")
            + (", decimal comma" if numbers.decimal == "," else "") + "."]
