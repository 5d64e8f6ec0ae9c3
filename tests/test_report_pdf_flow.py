"""The PDF report's layout (tauscope.report.pdf_flow): wrapping, headings kept with what
follows, table rows as units that page cutting never splits, header rows marked for
repeating.  Measured in the bundled font (no Qt)."""

from __future__ import annotations

from typing import Any

import pytest

from tauscope.report.pdf_pages import cut_pages

WORDS = ("the null hypothesis of a unit root is not rejected at the five percent level "
         "in the levels, but it is rejected in the first difference ") * 6


class _Module:
    """The flow module with a ``font(points, bold=False)`` in the bundled font."""

    def __init__(self) -> None:
        from tauscope.report import pdf_flow
        from tauscope.report.pdf_direct import DirectFace, bundled_fonts

        self.__dict__.update(vars(pdf_flow))
        fonts = bundled_fonts()

        def font(points: float, bold: bool = False) -> DirectFace:
            return DirectFace(int(bold), fonts[int(bold)], pdf_flow.pixels(points))

        self.font = font


@pytest.fixture
def flow_module() -> Any:
    return _Module()


def test_wrap_keeps_every_word_in_order_and_each_line_within_its_room(flow_module: Any) -> None:
    style = flow_module.Style(flow_module.font(10.5))
    lines = flow_module.wrap(WORDS, style, 300.0)
    assert len(lines) > 3
    assert all(line.width <= 300.0 + 0.5 for line in lines)
    assert " ".join(line.text for line in lines).split() == WORDS.split()


def test_wrap_breaks_at_line_feeds_and_never_at_a_no_break_space(flow_module: Any) -> None:
    style = flow_module.Style(flow_module.font(9.5))
    glued = "0.256***\u00a0(levels)"
    lines = flow_module.wrap(f"{glued}\n0.160\u00a0(Δy)", style, 1000.0)
    assert [line.text for line in lines] == [glued, "0.160\u00a0(Δy)"]
    narrow = flow_module.wrap("a " + glued, style, style.face.advance(glued) + 1)
    assert [line.text for line in narrow] == ["a", glued]


def test_a_heading_stays_with_the_first_row_and_rows_are_never_split(flow_module: Any) -> None:
    f = flow_module
    flow = f.Flow()
    body, head = f.Style(f.font(10.5)), f.Style(f.font(9, bold=True))
    flow.paragraph(WORDS, body)
    flow.paragraph("Decision path", head, heading=True)
    heading = len(flow.units) - 1
    columns = [f.Column("Step", 0.1, numeric=True), f.Column("Null hypothesis", 0.9)]
    rows = [[(str(k), 1), (WORDS[: 40 + 7 * k], 1)] for k in range(30)]
    flow.table(columns, rows, head, body, fill="#2f5d62", line="#d5dfe0")
    table_units = [u for u in flow.units if u.table is not None]
    assert [u.header for u in table_units] == [True] + [False] * 30
    first_row = table_units[1]
    assert flow.units[heading].bottom == first_row.bottom  # was the heading's line alone
    assert flow.units[heading].top < table_units[0].top
    assert len(flow.pieces) == len(flow.units)
    pages = cut_pages(flow.units, flow.y, 160.0)
    assert len(pages) > 3
    for page in pages:
        for unit in table_units:  # wholly on a page, or not on it
            assert unit.bottom <= page.top or unit.top >= page.bottom or \
                (page.top <= unit.top and unit.bottom <= page.bottom)
        if any(u.top == page.top and not u.header for u in table_units):
            assert (page.header_top, page.header_bottom) == (table_units[0].top,
                                                              table_units[0].bottom)
