"""The TrueType reading behind the report's own PDF writer (tauscope.report.ttf), checked
against Qt's font engine (QRawFont, FreeType underneath) as the outside reference: the same
glyph for each character, the same advance widths, and a subset whose kept glyphs have the
same outlines as the full font's."""

from __future__ import annotations

import os
import struct
from pathlib import Path
from typing import Any

import pytest

from tauscope.report.ttf import FontError, TrueTypeFont

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")  # the reference is Qt's, no display
FONTS = Path(__file__).resolve().parents[1] / "resources" / "fonts"
SAMPLE = ("Order of integration: ΔΦτκ² − “I(1)” ≤ 5%\u00a0(Δ²y) Ng & Perron — é ü ß "
          "Привет 0123456789 ±×…")


@pytest.fixture(scope="module", params=["DejaVuSans.ttf", "DejaVuSans-Bold.ttf",
                                        "DejaVuSans-Oblique.ttf"])
def font_pair(request: pytest.FixtureRequest, qapp: Any) -> tuple[TrueTypeFont, Any]:
    from PySide6.QtGui import QFont, QRawFont

    path = FONTS / request.param
    ours = TrueTypeFont.from_file(path, path.stem)
    reference = QRawFont(str(path), ours.metrics.units_per_em,
                         QFont.HintingPreference.PreferNoHinting)
    assert reference.isValid()
    return ours, reference


def test_glyphs_and_advances_match_qt(font_pair: tuple[TrueTypeFont, Any]) -> None:
    ours, reference = font_pair
    glyphs = reference.glyphIndexesForString(SAMPLE)
    assert list(glyphs) == [ours.glyphs[ord(c)] for c in SAMPLE]
    advances = [a.x() for a in reference.advancesForGlyphIndexes(glyphs)]
    assert advances == [float(ours.advances[g]) for g in glyphs]  # em = units per em
    assert ours.metrics.ascent == round(reference.ascent())
    assert -ours.metrics.descent == round(reference.descent())
    assert ours.metrics.cap_height == round(reference.capHeight())  # OS/2 v1: the "H"'s top


def test_a_subset_keeps_the_used_outlines_and_empties_the_rest(
        font_pair: tuple[TrueTypeFont, Any]) -> None:
    from PySide6.QtGui import QFont, QRawFont

    ours, reference = font_pair
    used = {ours.glyphs[ord(c)] for c in SAMPLE}
    data = ours.subset(used)
    assert len(data) < len(ours.data) / 4
    subset = QRawFont(data, ours.metrics.units_per_em, QFont.HintingPreference.PreferNoHinting)
    assert subset.isValid()
    for glyph in used:
        assert subset.pathForGlyph(glyph) == reference.pathForGlyph(glyph)
    unused = ours.glyphs[ord("Z")] if "Z" not in SAMPLE else None
    assert unused is not None and unused not in used
    assert subset.pathForGlyph(unused).elementCount() == 0
    assert reference.pathForGlyph(unused).elementCount() > 0
    # the whole file's checksum comes out as the sfnt format asks (OpenType, "head" table)
    padded = data + b"\0" * (-len(data) % 4)
    assert sum(struct.unpack(f">{len(padded) // 4}I", padded)) & 0xFFFFFFFF == 0xB1B0AFBA


def test_a_composite_glyph_brings_its_parts_into_the_subset(qapp: Any) -> None:
    from PySide6.QtGui import QFont, QRawFont

    path = FONTS / "DejaVuSans.ttf"
    ours = TrueTypeFont.from_file(path, path.stem)
    reference = QRawFont(str(path), 2048, QFont.HintingPreference.PreferNoHinting)
    glyph = ours.glyphs[ord("é")]  # e and an acute accent, composed
    parts = ours._components(ours._outline(glyph, ours._locations()))
    assert len(parts) >= 2 and ours.glyphs[ord("e")] in parts
    subset = QRawFont(ours.subset([glyph]), 2048, QFont.HintingPreference.PreferNoHinting)
    assert subset.pathForGlyph(glyph) == reference.pathForGlyph(glyph)
    assert subset.pathForGlyph(glyph).elementCount() > 0


def test_the_format_4_map_agrees_with_the_format_12_map() -> None:
    """DejaVu Sans carries both Unicode maps; the reader takes format 12, and its format-4
    code (fonts with the basic plane only) must give the same glyphs there."""
    ours = TrueTypeFont.from_file(FONTS / "DejaVuSans.ttf", "DejaVuSans")
    cmap = ours._table(b"cmap")
    count = struct.unpack(">H", cmap[2:4])[0]
    offset = next(o for p, e, o in (struct.unpack(">HHI", cmap[4 + 8 * k:12 + 8 * k])
                                   for k in range(count))
                  if (p, e) == (3, 1))
    basic = {c: g for c, g in TrueTypeFont._format4(cmap, offset).items() if g}
    assert len(basic) > 3000
    assert basic == {c: g for c, g in ours.glyphs.items() if c <= 0xFFFF}


def test_a_file_that_is_not_a_truetype_font_is_refused(tmp_path: Path) -> None:
    with pytest.raises(FontError):
        TrueTypeFont(b"OTTO" + b"\0" * 60, "cff")
    with pytest.raises(FontError):
        TrueTypeFont(b"\0\1\0\0\0\1" + b"\0" * 10, "cut short")
