"""The reading layer's one error type: a single clear sentence about a file."""

from __future__ import annotations


class DataError(Exception):
    """A workbook, sheet or series could not be read or transformed.

    ``str(err)`` is one sentence that starts with where the problem is (file name,
    then sheet and row when known) and says what is wrong, e.g.
    ``"gdp.xlsx, sheet 'Monthly', row 12: the date '1995Q5' is not a date."``.
    The parts are also kept as attributes for callers that lay them out themselves.
    """

    def __init__(
        self,
        reason: str,
        *,
        file: str | None = None,
        sheet: str | None = None,
        row: int | None = None,
    ) -> None:
        self.reason = reason.rstrip(".") + "."
        self.file = file
        self.sheet = sheet
        self.row = row
        super().__init__(self._sentence())

    def _sentence(self) -> str:
        where = []
        if self.file:
            where.append(self.file)
        if self.sheet is not None:
            where.append(f"sheet '{self.sheet}'")
        if self.row is not None:
            where.append(f"row {self.row}")
        text = " ".join(self.reason.split())  # always one line
        return f"{', '.join(where)}: {text}" if where else text[:1].upper() + text[1:]
