"""Generate every application icon from the one source, ``tauscope.svg``.

    python resources/icons/make_icons.py [--out DIR]

Writes, next to this script unless ``--out`` says otherwise:

- ``tauscope-<N>.png`` for N in 16, 24, 32, 48, 64, 128, 256, 512 (window icon,
  Linux hicolor theme sizes);
- ``tauscope.ico`` (Windows: one PNG-compressed image per size, 16 to 256);
- ``tauscope.icns`` (macOS: PNG-based entries ic07 128, ic08 256, ic09 512 and
  ic10 1024, i.e. 512 at double density).

The SVG is drawn with Qt's own SVG renderer (QtSvg ships with
PySide6-Essentials) on the offscreen platform, so no display and no extra
imaging package are needed.  The two container formats are simple enough to
write by hand:

- ICO: a 6-byte header (reserved 0, type 1, image count), one 16-byte
  directory entry per image (width and height, 0 meaning 256; colour count 0;
  reserved 0; planes 1; 32 bits per pixel; data size; data offset), then the
  images; since Windows Vista an image may be a complete PNG file.
- ICNS: the magic ``icns`` and the total file length (big-endian 32 bit), then
  entries of a 4-byte type, a 4-byte length that includes this 8-byte entry
  header, and the data; types ic07 to ic10 hold PNG files.
"""

from __future__ import annotations

import argparse
import os
import struct
import sys
from collections.abc import Iterable, Mapping
from pathlib import Path

HERE = Path(__file__).resolve().parent
SOURCE = HERE / "tauscope.svg"
PNG_SIZES = (16, 24, 32, 48, 64, 128, 256, 512)
ICO_SIZES = (16, 24, 32, 48, 64, 128, 256)
ICNS_TYPES = {128: b"ic07", 256: b"ic08", 512: b"ic09", 1024: b"ic10"}
PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"


def ico_bytes(pngs: Mapping[int, bytes]) -> bytes:
    """An ICO file holding the given square PNG images (size in pixels -> PNG bytes)."""
    sizes = sorted(pngs)
    for size in sizes:
        if not 1 <= size <= 256:
            raise ValueError(f"an ICO image must be 1 to 256 pixels wide, not {size}")
    header = struct.pack("<HHH", 0, 1, len(sizes))
    offset = len(header) + 16 * len(sizes)
    entries = b""
    for size in sizes:
        dimension = 0 if size == 256 else size
        data = pngs[size]
        entries += struct.pack("<BBBBHHII", dimension, dimension, 0, 0, 1, 32, len(data), offset)
        offset += len(data)
    return header + entries + b"".join(pngs[size] for size in sizes)


def icns_bytes(pngs: Mapping[int, bytes]) -> bytes:
    """An ICNS file with one PNG entry per size (128, 256, 512, 1024)."""
    body = b""
    for size in sorted(pngs):
        if size not in ICNS_TYPES:
            raise ValueError(f"no PNG-based ICNS entry for {size} px (use {sorted(ICNS_TYPES)})")
        data = pngs[size]
        body += ICNS_TYPES[size] + struct.pack(">I", 8 + len(data)) + data
    return b"icns" + struct.pack(">I", 8 + len(body)) + body


def render_pngs(svg: Path, sizes: Iterable[int]) -> dict[int, bytes]:
    """Draw ``svg`` at each size onto a transparent square and return the PNG bytes."""
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtCore import QBuffer, QByteArray, QIODevice, Qt
    from PySide6.QtGui import QImage, QPainter
    from PySide6.QtSvg import QSvgRenderer
    from PySide6.QtWidgets import QApplication

    # A widgets application (not a plain GUI one), so a window opened later in the same
    # process (the test session) can still use it.
    _app = QApplication.instance() or QApplication([sys.argv[0]])
    renderer = QSvgRenderer(str(svg))
    if not renderer.isValid():
        raise ValueError(f"{svg} is not a readable SVG file")
    result: dict[int, bytes] = {}
    for size in sizes:
        image = QImage(size, size, QImage.Format.Format_ARGB32_Premultiplied)
        image.fill(Qt.GlobalColor.transparent)
        painter = QPainter(image)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        painter.setRenderHint(QPainter.RenderHint.SmoothPixmapTransform)
        renderer.render(painter)
        painter.end()
        array = QByteArray()
        buffer = QBuffer(array)
        buffer.open(QIODevice.OpenModeFlag.WriteOnly)
        image.convertToFormat(QImage.Format.Format_ARGB32).save(buffer, "PNG")  # type: ignore[call-overload]  # stubs say bytes; runtime wants str
        buffer.close()
        result[size] = bytes(array.data())
    return result


def make_icons(out: Path, svg: Path = SOURCE) -> list[Path]:
    """Write every icon file into ``out``; return the paths written."""
    out.mkdir(parents=True, exist_ok=True)
    pngs = render_pngs(svg, sorted({*PNG_SIZES, *ICO_SIZES, *ICNS_TYPES}))
    written: list[Path] = []
    for size in PNG_SIZES:
        path = out / f"tauscope-{size}.png"
        path.write_bytes(pngs[size])
        written.append(path)
    ico = out / "tauscope.ico"
    ico.write_bytes(ico_bytes({size: pngs[size] for size in ICO_SIZES}))
    icns = out / "tauscope.icns"
    icns.write_bytes(icns_bytes({size: pngs[size] for size in ICNS_TYPES}))
    return [*written, ico, icns]


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Generate the Tauscope icons from tauscope.svg.")
    parser.add_argument("--out", type=Path, default=HERE, help="folder for the generated files")
    parser.add_argument("--svg", type=Path, default=SOURCE, help="the SVG source")
    args = parser.parse_args(argv)
    for path in make_icons(args.out, args.svg):
        print(f"wrote {path} ({path.stat().st_size} bytes)")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
