"""A PDF file put together from page contents and TrueType fonts (ISO 32000-1:2008, "Document
management: Portable document format, Part 1: PDF 1.7").

What the report needs and no more: pages of one size, each a content stream compressed
with Flate (§7.4.4); every font embedded as a subset and used as a composite font
(``/Type0``, ``/Encoding /Identity-H``, a ``/CIDFontType2`` descendant whose character codes
are glyph numbers, ``/CIDToGIDMap /Identity``: §9.7), with the glyphs' widths (``/W``,
§9.7.4.3) and a ``/ToUnicode`` map (§9.10.3) so that the text can be searched, copied and
read back; a document information dictionary (§14.3.3); a cross-reference table (§7.5.4).
"""

from __future__ import annotations

import hashlib
import zlib
from collections.abc import Sequence

from tauscope.report.ttf import TrueTypeFont

OBJECTS_PER_FONT = 5  # Type0, CIDFontType2, descriptor, font file, ToUnicode
_FIXED = 4  # catalog, page tree, information, shared resources


def pdf_string(text: str) -> str:
    """A literal string (§7.3.4.2): ASCII as it is (with ``\\``, ``(`` and ``)`` escaped),
    anything else as UTF-16BE with its byte order mark, in hexadecimal."""
    if text.isascii() and text.isprintable():
        return "(" + text.replace("\\", "\\\\").replace("(", "\\(").replace(")", "\\)") + ")"
    return "<FEFF" + text.encode("utf-16-be").hex().upper() + ">"


class PdfFile:
    """A PDF being written: ``fonts`` (named ``/F0``, ``/F1``, … in the page contents), pages of
    ``width`` × ``height`` points added in order, and the characters each font was used for
    (``used``: their glyphs are embedded, and mapped back to text)."""

    def __init__(self, width: float, height: float, fonts: Sequence[TrueTypeFont]) -> None:
        self.width, self.height = width, height
        self.fonts = list(fonts)
        self.used: list[set[str]] = [set() for _ in self.fonts]
        self._pages: list[bytes] = []

    def add_page(self, content: str) -> None:
        """A page drawn by ``content`` (operators, §8 and §9; latin-1 text)."""
        self._pages.append(zlib.compress(content.encode("latin-1"), 3))

    def finish(self, title: str, creator: str) -> bytes:
        """The whole file."""
        out = _Output()
        first_page = _FIXED + 1 + OBJECTS_PER_FONT * len(self.fonts)
        kids = " ".join(f"{first_page + 2 * k} 0 R" for k in range(len(self._pages)))
        out.put(1, "<< /Type /Catalog /Pages 2 0 R >>")
        out.put(2, f"<< /Type /Pages /Kids [{kids}] /Count {len(self._pages)} >>")
        out.put(3, f"<< /Title {pdf_string(title)} /Creator {pdf_string(creator)} "
                   f"/Producer {pdf_string(creator)} >>")
        names = " ".join(f"/F{k} {_FIXED + 1 + OBJECTS_PER_FONT * k} 0 R"
                         for k in range(len(self.fonts)))
        out.put(4, f"<< /Font << {names} >> >>")
        for k, font in enumerate(self.fonts):
            self._font(out, _FIXED + 1 + OBJECTS_PER_FONT * k, k, font)
        box = f"[0 0 {self.width:.2f} {self.height:.2f}]"
        for k, content in enumerate(self._pages):
            number = first_page + 2 * k
            out.put(number, f"<< /Type /Page /Parent 2 0 R /MediaBox {box} /Resources 4 0 R "
                            f"/Contents {number + 1} 0 R >>")
            out.stream(number + 1, content)
        return out.close(first_page + 2 * len(self._pages))

    def _font(self, out: _Output, first: int, index: int, font: TrueTypeFont) -> None:
        """The five objects of font ``index``, numbered from ``first``."""
        glyph_of = font.glyphs
        text_of: dict[int, str] = {}
        for char in sorted(self.used[index]):  # the lowest character wins a shared glyph
            glyph = glyph_of.get(ord(char))
            if glyph is not None:
                text_of.setdefault(glyph, char)
        metrics = font.metrics
        scale = 1000 / metrics.units_per_em
        digest = hashlib.sha256(f"{font.name}:{sorted(text_of)}".encode()).digest()
        tag = "".join(chr(65 + byte % 26) for byte in digest[:6])  # the subset's (§9.6.4)
        name = f"{tag}+{font.name}"
        widths = " ".join(f"{g} [{round(font.advances[g] * scale)}]" for g in sorted(text_of))
        box = " ".join(str(round(v * scale)) for v in metrics.bbox)
        # symbolic (characters beyond the standard Latin set), italic: §9.8.2
        flags = 4 + (64 if metrics.italic_angle else 0)
        out.put(first, f"<< /Type /Font /Subtype /Type0 /BaseFont /{name} /Encoding /Identity-H "
                       f"/DescendantFonts [{first + 1} 0 R] /ToUnicode {first + 4} 0 R >>")
        out.put(first + 1, f"<< /Type /Font /Subtype /CIDFontType2 /BaseFont /{name} "
                       "/CIDSystemInfo << /Registry (Adobe) /Ordering (Identity) /Supplement 0 >> "
                       f"/FontDescriptor {first + 2} 0 R /DW 1000 /W [{widths}] "
                       "/CIDToGIDMap /Identity >>")
        out.put(first + 2, f"<< /Type /FontDescriptor /FontName /{name} /Flags {flags} "
                       f"/FontBBox [{box}] /ItalicAngle {metrics.italic_angle:g} "
                       f"/Ascent {round(metrics.ascent * scale)} "
                       f"/Descent {round(metrics.descent * scale)} "
                       f"/CapHeight {round(metrics.cap_height * scale)} /StemV 80 "
                       f"/FontFile2 {first + 3} 0 R >>")
        program = font.subset(text_of)
        out.stream(first + 3, zlib.compress(program, 6), f" /Length1 {len(program)}")
        out.stream(first + 4, zlib.compress(_to_unicode(text_of).encode("ascii"), 6))


class _Output:
    """The file's bytes as they are written, and where each object starts."""

    def __init__(self) -> None:
        self.parts: list[bytes] = [b"%PDF-1.4\n%\xe2\xe3\xcf\xd3\n"]  # binary marker (7.5.2)
        self.size = len(self.parts[0])
        self.offsets: dict[int, int] = {}

    def put(self, number: int, body: str | bytes) -> None:
        data = body.encode("ascii") if isinstance(body, str) else body
        piece = b"%d 0 obj\n" % number + data + b"\nendobj\n"
        self.offsets[number] = self.size
        self.parts.append(piece)
        self.size += len(piece)

    def stream(self, number: int, data: bytes, extra: str = "") -> None:
        """A stream already compressed with Flate."""
        self.put(number, f"<< /Length {len(data)} /Filter /FlateDecode{extra} >>\nstream\n"
                 .encode("ascii") + data + b"\nendstream")

    def close(self, count: int) -> bytes:
        """The cross-reference table of objects 1 … ``count`` − 1 and the trailer added."""
        xref = [f"xref\n0 {count}\n0000000000 65535 f \n"]
        xref.extend(f"{self.offsets[n]:010d} 00000 n \n" for n in range(1, count))
        xref.append(f"trailer\n<< /Size {count} /Root 1 0 R /Info 3 0 R >>\n"
                    f"startxref\n{self.size}\n%%EOF\n")
        return b"".join(self.parts) + "".join(xref).encode("ascii")


def _to_unicode(text_of: dict[int, str]) -> str:
    """The ``/ToUnicode`` CMap: each glyph number (two bytes) to its character in UTF-16BE
    (§9.10.3; at most 100 entries a ``bfchar`` block)."""
    pairs = [f"<{g:04X}> <{c.encode('utf-16-be').hex().upper()}>" for g, c in
             sorted(text_of.items())]
    blocks = [f"{len(chunk)} beginbfchar\n" + "\n".join(chunk) + "\nendbfchar"
              for chunk in (pairs[k:k + 100] for k in range(0, len(pairs), 100))]
    return ("/CIDInit /ProcSet findresource begin\n12 dict begin\nbegincmap\n"
            "/CIDSystemInfo << /Registry (Adobe) /Ordering (UCS) /Supplement 0 >> def\n"
            "/CMapName /Adobe-Identity-UCS def\n/CMapType 2 def\n"
            "1 begincodespacerange\n<0000> <FFFF>\nendcodespacerange\n"
            + "\n".join(blocks) +
            "\nendcmap\nCMapName currentdict /CMap defineresource pop\nend\nend\n")
