"""A TrueType font read for the PDF report: its metrics, its characters' glyphs, and a subset
of it to embed.

Only what the report needs of the format (Apple, "TrueType Reference Manual"; Microsoft,
"OpenType specification" 1.9, tables ``head``, ``hhea``, ``maxp``, ``hmtx``, ``cmap``,
``loca``, ``glyf``, ``post``, ``OS/2``):

* advance widths by glyph (``hmtx``) and the characters' glyphs (``cmap`` format 4 and 12),
  so text is measured and written as glyph numbers without any shaping: one glyph a
  character, no kerning, no ligatures (enough for the Latin, Greek and symbol text of the
  report);
* a subset that keeps every glyph number but empties the glyphs not used (and not used by a
  composite glyph that is), so the embedded font is small and its glyph numbers are the
  PDF's character codes unchanged (``/CIDToGIDMap /Identity``, ISO 32000-1, 9.7.4.2).
"""

from __future__ import annotations

import struct
from collections.abc import Iterable
from dataclasses import dataclass
from pathlib import Path

_KEPT_TABLES = (b"OS/2", b"cvt ", b"fpgm", b"head", b"hhea", b"hmtx", b"maxp", b"name",
                b"post", b"prep")
"""Tables copied into a subset besides ``glyf`` and ``loca`` (hinting included; no ``cmap``:
the PDF names glyphs by number)."""

# composite glyph flags (``glyf``)
_ARGS_ARE_WORDS, _HAVE_SCALE, _MORE, _HAVE_XY_SCALE, _HAVE_2X2 = 0x1, 0x8, 0x20, 0x40, 0x80


class FontError(ValueError):
    """The file is not a TrueType font this reader understands."""


@dataclass(frozen=True)
class Metrics:
    """Vertical metrics and the box of every glyph, in font units (``units_per_em`` to the
    em), y up."""

    units_per_em: int
    ascent: int
    descent: int  # negative: below the baseline
    cap_height: int
    bbox: tuple[int, int, int, int]
    italic_angle: float


class TrueTypeFont:
    """A TrueType font read from ``data`` (the bytes of a .ttf file)."""

    def __init__(self, data: bytes, name: str) -> None:
        self.data = data
        self.name = name
        """The PostScript name the PDF gives it (without a subset tag)."""
        try:
            self._tables = self._directory(data)
            head, hhea = self._table(b"head"), self._table(b"hhea")
            units, *box = struct.unpack(">H16x4h", head[18:44])
            self._long_loca = struct.unpack(">h", head[50:52])[0] == 1
            ascent, descent = struct.unpack(">hh", hhea[4:8])
            metric_count = struct.unpack(">H", hhea[34:36])[0]
            self.glyph_count = struct.unpack(">H", self._table(b"maxp")[4:6])[0]
            italic = struct.unpack(">i", self._table(b"post")[4:8])[0] / 65536
            self.advances = self._advances(metric_count)
            self.glyphs = self._cmap()
            self.metrics = Metrics(units, ascent, descent, self._cap_height(ascent),
                                   (box[0], box[1], box[2], box[3]), italic)
        except (KeyError, struct.error, IndexError) as exc:
            raise FontError(f"{name}: not a TrueType font this reader understands "
                            f"({type(exc).__name__}: {exc})") from exc

    def _cap_height(self, fallback: int) -> int:
        """The height of capital letters: OS/2's ``sCapHeight`` (version 2 on), else the top
        of the glyph "H" (its ``yMax`` in ``glyf``), else ``fallback``."""
        os2 = self._tables.get(b"OS/2")
        if os2 is not None and struct.unpack(">H", self.data[os2[0]:os2[0] + 2])[0] >= 2:
            return int(struct.unpack(">h", self.data[os2[0] + 88:os2[0] + 90])[0])
        glyph = self.glyphs.get(ord("H"))
        outline = self._outline(glyph, self._locations()) if glyph is not None else b""
        if len(outline) < 10:
            return fallback
        return int(struct.unpack(">h", outline[8:10])[0])

    @classmethod
    def from_file(cls, path: Path, name: str) -> TrueTypeFont:
        return cls(path.read_bytes(), name)

    @staticmethod
    def _directory(data: bytes) -> dict[bytes, tuple[int, int]]:
        version, count = struct.unpack(">IH", data[:6])
        if version not in (0x00010000, 0x74727565):  # 1.0 or "true": TrueType outlines
            raise FontError(f"not a TrueType font (version {version:#x})")
        tables: dict[bytes, tuple[int, int]] = {}
        for k in range(count):
            tag, _checksum, offset, length = struct.unpack(">4sIII", data[12 + 16 * k:28 + 16 * k])
            tables[tag] = (offset, length)
        return tables

    def _table(self, tag: bytes) -> bytes:
        offset, length = self._tables[tag]
        return self.data[offset:offset + length]

    def _advances(self, metric_count: int) -> list[int]:
        hmtx = self._table(b"hmtx")
        pairs = struct.unpack(f">{2 * metric_count}H", hmtx[:4 * metric_count])
        widths = list(pairs[::2])  # (advance, left side bearing) a glyph
        return widths + [widths[-1]] * (self.glyph_count - metric_count)

    def _cmap(self) -> dict[int, int]:
        """Character → glyph, from the Unicode subtable (format 12 if there is one, else 4)."""
        cmap = self._table(b"cmap")
        count = struct.unpack(">H", cmap[2:4])[0]
        found: dict[int, int] = {}
        by_format: dict[int, int] = {}
        for k in range(count):
            platform, encoding, offset = struct.unpack(">HHI", cmap[4 + 8 * k:12 + 8 * k])
            if (platform, encoding) in ((3, 10), (0, 4), (3, 1), (0, 3)):
                by_format.setdefault(struct.unpack(">H", cmap[offset:offset + 2])[0], offset)
        if 12 in by_format:
            offset = by_format[12]
            groups = struct.unpack(">I", cmap[offset + 12:offset + 16])[0]
            for g in range(groups):
                start, end, glyph = struct.unpack(
                    ">III", cmap[offset + 16 + 12 * g:offset + 28 + 12 * g])
                for code in range(start, end + 1):
                    found[code] = glyph + code - start
        elif 4 in by_format:
            found = self._format4(cmap, by_format[4])
        else:
            raise FontError("no Unicode character map (format 4 or 12)")
        return {code: glyph for code, glyph in found.items() if 0 < glyph < self.glyph_count}

    @staticmethod
    def _format4(cmap: bytes, offset: int) -> dict[int, int]:
        segments = struct.unpack(">H", cmap[offset + 6:offset + 8])[0] // 2
        at = offset + 14
        ends = struct.unpack(f">{segments}H", cmap[at:at + 2 * segments])
        at += 2 * segments + 2
        starts = struct.unpack(f">{segments}H", cmap[at:at + 2 * segments])
        at += 2 * segments
        deltas = struct.unpack(f">{segments}h", cmap[at:at + 2 * segments])
        at += 2 * segments
        ranges_at = at
        ranges = struct.unpack(f">{segments}H", cmap[at:at + 2 * segments])
        found: dict[int, int] = {}
        for s in range(segments):
            for code in range(starts[s], ends[s] + 1):
                if code == 0xFFFF:
                    continue
                if ranges[s] == 0:
                    glyph = (code + deltas[s]) & 0xFFFF
                else:  # idRangeOffset counts bytes from its own place in the array
                    place = ranges_at + 2 * s + ranges[s] + 2 * (code - starts[s])
                    glyph = struct.unpack(">H", cmap[place:place + 2])[0]
                    if glyph:
                        glyph = (glyph + deltas[s]) & 0xFFFF
                found[code] = glyph
        return found

    # --- glyph outlines and the subset ---------------------------------------------------

    def _locations(self) -> list[int]:
        loca = self._table(b"loca")
        n = self.glyph_count + 1
        if self._long_loca:
            return list(struct.unpack(f">{n}I", loca[:4 * n]))
        return [2 * v for v in struct.unpack(f">{n}H", loca[:2 * n])]

    def _outline(self, glyph: int, locations: list[int]) -> bytes:
        """Glyph ``glyph``'s data in ``glyf`` (empty for a glyph with no outline)."""
        start = self._tables[b"glyf"][0]
        return self.data[start + locations[glyph]:start + locations[glyph + 1]]

    def _components(self, glyph: bytes) -> list[int]:
        """The glyphs a composite glyph is made of (none for a simple one)."""
        if len(glyph) < 10 or struct.unpack(">h", glyph[:2])[0] >= 0:
            return []
        parts: list[int] = []
        at = 10
        while True:
            flags, index = struct.unpack(">HH", glyph[at:at + 4])
            parts.append(index)
            at += 4 + (4 if flags & _ARGS_ARE_WORDS else 2)
            if flags & _HAVE_SCALE:
                at += 2
            elif flags & _HAVE_XY_SCALE:
                at += 4
            elif flags & _HAVE_2X2:
                at += 8
            if not flags & _MORE:
                return parts

    def subset(self, used: Iterable[int]) -> bytes:
        """This font with only ``used`` glyphs (and .notdef, and the parts of composite
        glyphs) kept; every other glyph empty, glyph numbers unchanged."""
        locations = self._locations()
        keep = {0}
        todo = [g for g in used if 0 <= g < self.glyph_count]
        while todo:
            g = todo.pop()
            if g not in keep:
                keep.add(g)
                todo.extend(self._components(self._outline(g, locations)))
        pieces: list[bytes] = []
        offsets = [0]
        for g in range(self.glyph_count):
            if g in keep:
                piece = self._outline(g, locations)
                piece += b"\0" * (-len(piece) % 4)
                pieces.append(piece)
                offsets.append(offsets[-1] + len(piece))
            else:
                offsets.append(offsets[-1])
        tables = {tag: self._table(tag) for tag in _KEPT_TABLES if tag in self._tables}
        tables[b"glyf"] = b"".join(pieces)
        tables[b"loca"] = struct.pack(f">{len(offsets)}I", *offsets)
        tables[b"post"] = struct.pack(">I", 0x00030000) + tables[b"post"][4:32]  # no names
        head = bytearray(tables[b"head"])
        head[8:12] = b"\0\0\0\0"  # checkSumAdjustment, set below
        head[50:52] = struct.pack(">h", 1)  # long offsets in loca
        tables[b"head"] = bytes(head)
        font = _assemble(tables)
        adjustment = (0xB1B0AFBA - _checksum(font)) & 0xFFFFFFFF
        head_at = font.index(tables[b"head"])
        return font[:head_at + 8] + struct.pack(">I", adjustment) + font[head_at + 12:]


def _checksum(data: bytes) -> int:
    padded = data + b"\0" * (-len(data) % 4)
    return sum(struct.unpack(f">{len(padded) // 4}I", padded)) & 0xFFFFFFFF


def _assemble(tables: dict[bytes, bytes]) -> bytes:
    """An sfnt file of ``tables``: the directory (sorted by tag), then each table padded to
    four bytes."""
    tags = sorted(tables)
    count = len(tags)
    power = 1 << (count.bit_length() - 1)
    header = struct.pack(">IHHHH", 0x00010000, count, 16 * power,
                         power.bit_length() - 1, 16 * count - 16 * power)
    offset = 12 + 16 * count
    directory = b""
    body = b""
    for tag in tags:
        table = tables[tag]
        directory += struct.pack(">4sIII", tag, _checksum(table), offset + len(body), len(table))
        body += table + b"\0" * (-len(table) % 4)
    return header + directory + body
