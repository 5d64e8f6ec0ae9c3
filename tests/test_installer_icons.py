"""The application icon: committed ICO/ICNS/PNG files are well-formed and match the SVG.

Container layouts checked against the published formats: ICO directory entries as in
Microsoft's "Icons" documentation (ICONDIR / ICONDIRENTRY, PNG images allowed since
Windows Vista); ICNS as in Apple's icon family format (magic "icns", big-endian lengths,
ic07-ic10 holding PNG data at 128, 256, 512 and 1024 pixels).
"""

from __future__ import annotations

import importlib.util
import struct
from pathlib import Path
from types import ModuleType

import pytest

ICONS = Path(__file__).resolve().parents[1] / "resources" / "icons"


def load_make_icons() -> ModuleType:
    spec = importlib.util.spec_from_file_location("make_icons", ICONS / "make_icons.py")
    assert spec is not None and spec.loader is not None
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


make_icons = load_make_icons()


def png_size(data: bytes) -> tuple[int, int]:
    """Width and height from a PNG's IHDR chunk (PNG specification, section 11.2.2)."""
    assert data[:8] == b"\x89PNG\r\n\x1a\n"
    assert data[12:16] == b"IHDR"
    width, height = struct.unpack(">II", data[16:24])
    return width, height


def parse_ico(data: bytes) -> dict[int, bytes]:
    reserved, kind, count = struct.unpack_from("<HHH", data, 0)
    assert (reserved, kind) == (0, 1)
    images: dict[int, bytes] = {}
    for index in range(count):
        width, height, colours, _res, planes, bits, size, offset = struct.unpack_from(
            "<BBBBHHII", data, 6 + 16 * index)
        assert (colours, planes, bits) == (0, 1, 32)
        assert offset + size <= len(data)
        image = data[offset:offset + size]
        pixels = 256 if width == 0 else width
        assert png_size(image) == (pixels, 256 if height == 0 else height)
        images[pixels] = image
    return images


def parse_icns(data: bytes) -> dict[bytes, bytes]:
    assert data[:4] == b"icns"
    (total,) = struct.unpack(">I", data[4:8])
    assert total == len(data)
    entries: dict[bytes, bytes] = {}
    position = 8
    while position < total:
        kind = data[position:position + 4]
        (length,) = struct.unpack(">I", data[position + 4:position + 8])
        entries[kind] = data[position + 8:position + length]
        position += length
    assert position == total
    return entries


def test_committed_ico_holds_one_png_per_size() -> None:
    images = parse_ico((ICONS / "tauscope.ico").read_bytes())
    assert sorted(images) == [16, 24, 32, 48, 64, 128, 256]


def test_committed_icns_holds_png_entries_ic07_to_ic10() -> None:
    entries = parse_icns((ICONS / "tauscope.icns").read_bytes())
    sizes = {kind: png_size(data) for kind, data in entries.items()}
    assert sizes == {b"ic07": (128, 128), b"ic08": (256, 256), b"ic09": (512, 512),
                     b"ic10": (1024, 1024)}


@pytest.mark.parametrize("size", [16, 24, 32, 48, 64, 128, 256, 512])
def test_committed_pngs_have_their_size(size: int) -> None:
    assert png_size((ICONS / f"tauscope-{size}.png").read_bytes()) == (size, size)


def test_ico_writer_round_trips_and_encodes_256_as_zero() -> None:
    fake = {16: make_png_header(16), 256: make_png_header(256)}
    data = make_icons.ico_bytes(fake)
    assert data[6] == 16 and data[6 + 16] == 0  # width bytes of the two directory entries
    assert parse_ico(data) == fake
    with pytest.raises(ValueError, match="1 to 256 pixels"):
        make_icons.ico_bytes({512: make_png_header(512)})


def test_icns_writer_round_trips_and_rejects_other_sizes() -> None:
    fake = {128: make_png_header(128), 1024: make_png_header(1024)}
    assert parse_icns(make_icons.icns_bytes(fake)) == {b"ic07": fake[128], b"ic10": fake[1024]}
    with pytest.raises(ValueError, match="no PNG-based ICNS entry for 48"):
        make_icons.icns_bytes({48: make_png_header(48)})


def make_png_header(size: int) -> bytes:
    """The first bytes of a PNG (signature and IHDR), enough for the size check."""
    ihdr = struct.pack(">II", size, size) + bytes([8, 6, 0, 0, 0])
    return b"\x89PNG\r\n\x1a\n" + struct.pack(">I", 13) + b"IHDR" + ihdr + b"\0\0\0\0"


def test_committed_icons_are_what_the_svg_renders_to(tmp_path: Path) -> None:
    """Regenerating from tauscope.svg gives the committed pictures (up to small rendering
    differences between Qt versions), so nobody edits one and forgets the other."""
    from PySide6.QtGui import QImage

    written = make_icons.make_icons(tmp_path)
    assert sorted(p.name for p in written) == sorted(
        p.name for p in ICONS.iterdir() if p.suffix in (".png", ".ico", ".icns"))
    for size in (32, 256):
        fresh = QImage(str(tmp_path / f"tauscope-{size}.png"))
        committed = QImage(str(ICONS / f"tauscope-{size}.png"))
        assert (fresh.width(), fresh.height()) == (committed.width(), committed.height())
        difference = 0
        for y in range(0, size, max(1, size // 32)):
            for x in range(0, size, max(1, size // 32)):
                a, b = fresh.pixelColor(x, y), committed.pixelColor(x, y)
                difference += abs(a.red() - b.red()) + abs(a.green() - b.green()) \
                    + abs(a.blue() - b.blue()) + abs(a.alpha() - b.alpha())
        samples = len(range(0, size, max(1, size // 32))) ** 2
        assert difference / samples < 8.0  # mean over 4 channels, 0-255 each


def test_icon_has_transparent_corners_and_the_ink_blue_face() -> None:
    from PySide6.QtGui import QImage

    image = QImage(str(ICONS / "tauscope-256.png"))
    assert image.pixelColor(0, 0).alpha() == 0  # rounded corner: transparent
    centre_left = image.pixelColor(40, 128)
    assert centre_left.alpha() == 255
    assert centre_left.name() == "#17324d"  # the ink-blue face, from tauscope.svg
