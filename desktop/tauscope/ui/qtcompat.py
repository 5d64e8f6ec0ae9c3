"""Small helpers for reading Qt item data.

PySide6-Essentials is pinned below 6.12 in pyproject.toml: the 6.12.0 wheels
drop a reference to None on every Qt call that returns nothing, which aborts
Python 3.11 after enough calls.
"""

from __future__ import annotations

from typing import Any

from PySide6.QtCore import QModelIndex, QPersistentModelIndex, Qt


def item_value(index: QModelIndex | QPersistentModelIndex, role: int | Qt.ItemDataRole,
               default: Any = None) -> Any:
    """The value of ``role`` at ``index``, or ``default`` when it holds none."""
    if not index.isValid():
        return default
    model = index.model()
    if model is None:
        return default
    return model.itemData(index).get(int(role), default)


def tree_path(index: QModelIndex) -> tuple[int, ...]:
    """Rows from the top down to ``index``: its place in the tree (a hashable identity)."""
    rows: list[int] = []
    while index.isValid():
        rows.append(index.row())
        index = index.parent()
    return tuple(reversed(rows))
