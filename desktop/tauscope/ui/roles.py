"""Item-data roles shared by the models and views.  Only plain values (text, numbers)
go into Qt item data; Python objects are kept in the models' own dictionaries."""

from __future__ import annotations

from PySide6.QtCore import Qt

_BASE = int(Qt.ItemDataRole.UserRole)

KIND_ROLE = _BASE + 1  # "workbook", "sheet", "series"; findings: "series", "step", "regression", ...
KEY_ROLE = _BASE + 2  # SeriesData.key (or the workbook path for workbook rows)
SORT_ROLE = _BASE + 6  # value used for sorting (number or text)
GUIDE_ROLE = _BASE + 8  # anchor in the guide that explains this cell
VALUE_ROLE = _BASE + 9  # the raw number behind a formatted cell
PENDING_ROLE = _BASE + 10  # children not built yet: "series" or "step:<n>" ("" when built)
