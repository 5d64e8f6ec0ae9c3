"""Control characters in names: cleaned once when read, escaped by every writer."""

from __future__ import annotations

import io
import json
import zipfile
from pathlib import Path

import numpy as np

from tauscope.commands.batch import main
from tauscope.data import read_workbook
from tauscope.data.cells import printable
from tauscope.engine import Settings, analyse_series
from tauscope.report import Finding, RunRecord, export
from tauscope.report.text_safety import html_text, tex_text, xml_text

ESC = "\x1b"


def _csv_with_control_names(tmp_path: Path) -> Path:
    rng = np.random.default_rng(7)
    lines = [f'Year,Real{ESC}[31m GDP,"Prices\rindex",Plain']
    for year in range(1960, 2000):
        a, b, c = rng.normal(size=3)
        lines.append(f"{year},{a:.3f},{b:.3f},{c:.3f}")
    path = tmp_path / "controls.csv"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def test_names_are_cleaned_once_when_read(tmp_path: Path) -> None:
    names = [s.name for s in read_workbook(_csv_with_control_names(tmp_path)).series()]
    assert names == ["Real [31m GDP", "Prices index", "Plain"]
    assert printable("a\u200bb\u202ec\x07d") == "a b c d"


def test_batch_writes_every_format_for_a_name_with_escape(tmp_path: Path) -> None:
    source = _csv_with_control_names(tmp_path)
    outs = [tmp_path / f"out{s}" for s in (".xlsx", ".csv", ".html", ".tex", ".json")]
    args = [str(source), "--max-difference", "0"]
    for out in outs:
        args += ["--out", str(out)]
    assert main(args) == 0
    for out in outs:
        data = out.read_bytes()
        if out.suffix == ".xlsx":
            with zipfile.ZipFile(io.BytesIO(data)) as archive:
                # every part, the charts' drawing (its titles hold the names) included
                data = b"".join(archive.read(n) for n in archive.namelist())
                assert any(n.startswith("xl/drawings/") for n in archive.namelist())
        assert b"\x1b" not in data and b"Real [31m GDP" in data.replace(b"Real&#x1b;", b"")
    series = json.loads(outs[-1].read_text(encoding="utf-8"))["series"]
    assert [s["name"] for s in series] == ["Real [31m GDP", "Prices index", "Plain"]


def test_each_writer_escapes_control_characters_it_is_handed(tmp_path: Path) -> None:
    values = np.cumsum(np.random.default_rng(1).normal(size=50))
    name = f"bad{ESC}name\x00\x07"
    result = analyse_series(values, Settings(max_difference=0), name=name)
    run = RunRecord(Settings(max_difference=0), (), (Finding(result),))
    for suffix in (".xlsx", ".html", ".tex"):
        target = tmp_path / f"direct{suffix}"
        export(target, run)
        data = target.read_bytes()
        if suffix == ".xlsx":
            with zipfile.ZipFile(io.BytesIO(data)) as archive:
                data = b"".join(archive.read(n) for n in archive.namelist())
        assert not any(byte in data for byte in (b"\x1b", b"\x00", b"\x07")), suffix
    assert xml_text("a\x1bb\tc") == "a\ufffdb\tc"
    assert html_text("a\x00b\nc") == "a\ufffdb\nc"
    assert tex_text("a\x1bb\nc") == "a?b c"


def test_a_bare_carriage_return_in_a_header_cell_keeps_the_names_in_place(
    tmp_path: Path,
) -> None:
    rng = np.random.default_rng(2)
    lines = ["Year,Real\rGDP,Prices,Jobs"]
    lines += [f"{1960 + i},{a:.3f},{b:.3f},{c:.3f}" for i, (a, b, c) in
              enumerate(rng.normal(size=(30, 3)))]
    path = tmp_path / "cr.csv"
    path.write_bytes(("\r\n".join(lines) + "\r\n").encode())
    book = read_workbook(path)
    assert [s.name for s in book.series()] == ["Real GDP", "Prices", "Jobs"]
    assert book.series()[0].nobs == 30
