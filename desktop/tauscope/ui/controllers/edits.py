"""The edits that change the series list, as undoable commands (Qt's undo stack): adding a
transformed copy, removing one (with the copies made from it), and mending a series' gaps.
Each command keeps what it needs to put the tree back as it was; the study counts as
changed after each step, forward or back."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

from PySide6.QtGui import QUndoCommand

from tauscope.ui.controllers.current import CurrentSeries
from tauscope.ui.controllers.session import Session
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.series_panel import SeriesPanel

if TYPE_CHECKING:
    from tauscope.data import SeriesData
    from tauscope.engine import SeriesResult


@dataclass(frozen=True)
class EditContext:
    """What an edit changes: the two panels, the series shown and the session."""

    series_panel: SeriesPanel
    findings_panel: FindingsPanel
    current: CurrentSeries
    session: Session


class _Edit(QUndoCommand):
    def __init__(self, text: str, context: EditContext) -> None:
        super().__init__(text)
        self.series_panel = context.series_panel
        self.findings_panel = context.findings_panel
        self.current = context.current
        self.session = context.session

    def _changed(self, select: str = "") -> None:
        self.session.set_modified(True)
        if select and self.series_panel.select_key(select):
            return
        if self.current.key and self.series_panel.model.series_for_key(self.current.key) is None:
            self.current.show("")  # the series shown has gone
        elif self.current.key:
            self.current.show(self.current.key)


class AddTransformed(_Edit):
    """A transformed copy under the series it was made from."""

    def __init__(self, context: EditContext, parent_key: str, derived: SeriesData) -> None:
        super().__init__(f"Add {derived.name}", context)
        self.parent_key = parent_key
        self.derived = derived
        self.replaced: list[tuple[str, int, SeriesData]] = []  # an equal copy shown before

    def redo(self) -> None:
        model = self.series_panel.model
        self.replaced = model.remove_transformed(self.derived.key)
        model.add_transformed(self.parent_key, self.derived)
        self._changed(self.derived.key)

    def undo(self) -> None:
        model = self.series_panel.model
        model.remove_transformed(self.derived.key)
        for parent_key, row, series in self.replaced:
            model.add_transformed(parent_key, series, row)
        self._changed(self.parent_key)


class RemoveTransformed(_Edit):
    """A transformed copy (and the copies made from it) out of the window, with findings."""

    def __init__(self, context: EditContext, key: str, name: str) -> None:
        super().__init__(f"Remove {name}", context)
        self.key = key
        self.removed: list[tuple[str, int, SeriesData]] = []
        self.results: dict[str, SeriesResult] = {}
        self.gaps: dict[str, str] = {}

    def redo(self) -> None:
        self.removed = self.series_panel.model.remove_transformed(self.key)
        for _parent, _row, series in self.removed:
            result = self.findings_panel.model.remove_result(series.key)
            if result is not None:
                self.results[series.key] = result
            if series.key in self.session.gap_handling:
                self.gaps[series.key] = self.session.gap_handling.pop(series.key)
        self._changed(self.removed[0][0] if self.removed else "")

    def undo(self) -> None:
        model = self.series_panel.model
        for parent_key, row, series in self.removed:
            model.add_transformed(parent_key, series, row)
            if series.key in self.results:
                self.findings_panel.model.set_result(series.key, self.results[series.key])
        self.session.gap_handling.update(self.gaps)
        self.results, self.gaps = {}, {}
        self._changed(self.key)


class MendGaps(_Edit):
    """A series cut to its longest stretch without gaps, or its gaps filled."""

    def __init__(self, context: EditContext, original: SeriesData, how: str) -> None:
        what = "Cut" if how == "cut" else "Fill the gaps of"
        super().__init__(f"{what} {original.name}", context)
        self.original = original
        self.mended = original.longest_stretch() if how == "cut" else original.interpolated()
        self.rule = "longest" if how == "cut" else "interpolate"
        self.before = ""  # how its gaps were handled before ("" for as read)

    def redo(self) -> None:
        self.before = self.session.gap_handling.get(self.original.key, "")
        self.series_panel.model.replace_series(self.mended)
        self.session.gap_handling[self.original.key] = self.rule
        self._changed()

    def undo(self) -> None:
        self.series_panel.model.replace_series(self.original)
        if self.before:
            self.session.gap_handling[self.original.key] = self.before
        else:
            self.session.gap_handling.pop(self.original.key, None)
        self._changed()
