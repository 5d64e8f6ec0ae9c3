"""Item-data roles shared by the models and views."""

from __future__ import annotations

from PySide6.QtCore import Qt

_BASE = int(Qt.ItemDataRole.UserRole)

KIND_ROLE = _BASE + 1  # "workbook", "sheet", "series"; findings: "series", "step", "regression", ...
KEY_ROLE = _BASE + 2  # SeriesData.key
SERIES_ROLE = _BASE + 3  # the SeriesData object
WORKBOOK_ROLE = _BASE + 4  # the Workbook object
SPARK_ROLE = _BASE + 5  # numpy array in 0..1 for the small drawing (NaN breaks the line)
SORT_ROLE = _BASE + 6  # value used for sorting (number or text)
RESULT_ROLE = _BASE + 7  # the SeriesResult of a findings row
GUIDE_ROLE = _BASE + 8  # anchor in the guide that explains this cell
VALUE_ROLE = _BASE + 9  # the raw number behind a formatted cell
