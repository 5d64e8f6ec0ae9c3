"""Large text files go through pandas' C parser; the result equals the cell-by-cell path."""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest

from tauscope.data import read_workbook, text_table


def _large_csv(path: Path, delimiter: str = ",", decimal: str = ".") -> Path:
    rng = np.random.default_rng(21)
    rows, columns = 2500, 12
    values = np.round(rng.normal(100, 15, size=(rows, columns)), 4)
    lines = ["Invented statistics office, monthly data", "",
             delimiter.join(["Month", *[f"Series {j}" for j in range(columns)]])]
    for i in range(rows):
        cells = [f"{v}".replace(".", decimal) for v in values[i]]
        if i % 97 == 5:
            cells[3] = "n.a."
        if i % 211 == 7:
            cells[5] = ""
        if i == 40:
            cells[7] = "12,5 p" if decimal == "," else "12.5 p"  # a flagged number
        lines.append(delimiter.join([f"{1800 + i // 12}-{i % 12 + 1:02d}", *cells]))
    lines += ["", "Source: invented.", "Note: n.a. means not available."]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


@pytest.mark.parametrize(("delimiter", "decimal"), [(",", "."), (";", ","), ("\t", ".")])
def test_the_compiled_parser_gives_what_the_cell_by_cell_path_gives(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, delimiter: str, decimal: str
) -> None:
    path = _large_csv(tmp_path / "large.csv", delimiter, decimal)
    calls: list[int] = []
    original = text_table._combine

    def spy(*args: object) -> object:
        calls.append(1)
        return original(*args)  # type: ignore[arg-type]

    monkeypatch.setattr(text_table, "_combine", spy)
    fast = read_workbook(path)
    assert calls == [1]  # the compiled parser was used
    monkeypatch.setattr(text_table, "FAST_FROM_LINES", 10**9)
    slow = read_workbook(path)
    assert calls == [1]
    assert [s.name for s in fast.series()] == [s.name for s in slow.series()]
    for a, b in zip(fast.series(), slow.series(), strict=True):
        assert a.values.index.equals(b.values.index) and a.frequency == b.frequency == "monthly"
        np.testing.assert_array_equal(a.values.to_numpy(), b.values.to_numpy())
        assert a.gaps == b.gaps and a.notes == b.notes and a.source == b.source
    assert fast.sheets[0].notes == slow.sheets[0].notes
    assert fast.series()[7].values.iloc[40] == 12.5


def test_a_row_wider_than_the_head_still_reads(tmp_path: Path) -> None:
    path = _large_csv(tmp_path / "wide.csv")
    text = path.read_text(encoding="utf-8").replace("Source: invented.",
                                                    "Source: invented,,,,,,,,,,,,,,,,,,extra")
    path.write_text(text, encoding="utf-8")
    book = read_workbook(path)
    assert len(book.series()) == 12 and book.series()[0].nobs == 2500
