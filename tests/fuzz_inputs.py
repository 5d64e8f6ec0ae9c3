"""Malformed inputs for the batch fuzz campaign, generated from a seed.

Every category the reading-safety work covers has a maker here; ``generate(n, seed,
folder)`` writes ``n`` inputs (cycling through the makers) and returns, per input, the
command-line arguments for ``tauscope batch`` (the input file first).  Categories:
huge declared ranges, truncated and bit-flipped xlsx and xls, entity tricks, zip bombs,
wrong encodings and binary bytes, huge lines and fields, control characters in names,
odd date labels, gaps, values the engine must refuse, random tables, special files, and
``--out`` pointed at the input itself or at a file that is not ours.
"""

from __future__ import annotations

import io
import os
import random
import zipfile
from collections.abc import Callable
from pathlib import Path

from hostile_files import XLS_SEED, number_cell, table_rows, xlsx

Maker = Callable[[random.Random, Path, int], list[str]]
TOKENS = ["", " ", "..", "NA", "n.a.", "#N/A", "-", "1995Q1", "1995-Q5", "1959-IV", "Q2 2001",
          "Jan 1995", "1995M13", "2020-02-30", "31/03/1995", "1995", "0", "-1", "1,5",
          "1.234,5", "(12)", "3.5%", "1e308", "-1e307", "1e309", "nan", "GDP", '"a;b"',
          '"unclosed', "\u00a0", "\x1b[31m", "\r", "1+2j", "44000", "TRUE", "\u202e", "\x00"]


def _base_rows(rng: random.Random, n: int = 30) -> list[list[str | float]]:
    rows: list[list[str | float]] = [["Year", "GDP", "Prices"]]
    level = 100.0
    for i in range(n):
        level += rng.gauss(0.5, 1.0)
        rows.append([f"{1960 + i}", round(level, 3), round(level * 0.5 + rng.gauss(0, 1), 3)])
    return rows


def _valid_xlsx(rng: random.Random) -> bytes:
    return xlsx(table_rows(_base_rows(rng)))


def _write(folder: Path, k: int, suffix: str, data: bytes) -> Path:
    path = folder / f"in{k:05d}{suffix}"
    path.write_bytes(data)
    return path


def huge_range(rng: random.Random, folder: Path, k: int) -> list[str]:
    row = rng.choice([1_048_576, 2_000_000, 65_536, 500_000, 99_999_999])
    col = rng.choice(["B", "Z", "XFD", "AAAA", "ZZ"])
    far = f'<row r="{row}">{number_cell(f"{col}{row}", 2.0)}</row>'
    sheet = table_rows(_base_rows(rng)) + far if rng.random() < 0.5 else \
        f'<row r="1">{number_cell("A1", 1.0)}</row>' + far
    return [str(_write(folder, k, ".xlsx", xlsx(sheet, dimension=f"A1:{col}{row}")))]


def damaged_xlsx(rng: random.Random, folder: Path, k: int) -> list[str]:
    data = bytearray(_valid_xlsx(rng))
    if rng.random() < 0.5:
        data = data[: rng.randrange(1, len(data))]
    else:
        for _ in range(rng.randint(1, 8)):
            data[rng.randrange(len(data))] ^= 1 << rng.randrange(8)
    return [str(_write(folder, k, ".xlsx", bytes(data)))]


def damaged_xls(rng: random.Random, folder: Path, k: int) -> list[str]:
    data = bytearray(XLS_SEED.read_bytes())
    if rng.random() < 0.4:
        data = data[: rng.randrange(1, len(data))]
    else:
        for _ in range(rng.randint(1, 12)):
            data[rng.randrange(len(data))] ^= 1 << rng.randrange(8)
    return [str(_write(folder, k, ".xls", bytes(data))), "--sheet", "Quarterly",
            "--max-difference", "0", "--check", "none"]


def entity_trick(rng: random.Random, folder: Path, k: int) -> list[str]:
    doctype = rng.choice([
        '<!DOCTYPE x [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">'
        '<!ENTITY c "&b;&b;&b;&b;&b;&b;&b;&b;&b;&b;"><!ENTITY d "&c;&c;&c;&c;&c;&c;&c;&c;">]>',
        '<!DOCTYPE x [<!ENTITY e SYSTEM "file:///etc/passwd">]>',
        '<!DOCTYPE x [<!ENTITY % p SYSTEM "http://127.0.0.1:9/x"> %p;]>'])
    body = table_rows(_base_rows(rng, 12)).replace("<t>GDP</t>", "<t>&d;&e;</t>")
    data = xlsx(body)
    buffer = io.BytesIO()
    with zipfile.ZipFile(io.BytesIO(data)) as old, zipfile.ZipFile(buffer, "w") as new:
        for item in old.infolist():
            part = old.read(item)
            if item.filename.endswith("sheet1.xml"):
                part = part.replace(b"?>", b"?>" + doctype.encode(), 1)
            new.writestr(item, part)
    return [str(_write(folder, k, ".xlsx", buffer.getvalue()))]


_BOMB_CACHE: dict[int, bytes] = {}


def zip_bomb(rng: random.Random, folder: Path, k: int) -> list[str]:
    size = rng.choice([40 << 20, 64 << 20])
    if size not in _BOMB_CACHE:
        buffer = io.BytesIO()
        with zipfile.ZipFile(io.BytesIO(_valid_xlsx(rng))) as old, \
                zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as new:
            for item in old.infolist():
                new.writestr(item.filename, old.read(item))
            new.writestr("xl/worksheets/sheet2.xml", b"<a>" + b" " * size + b"</a>")
        _BOMB_CACHE[size] = buffer.getvalue()
    return [str(_write(folder, k, ".xlsx", _BOMB_CACHE[size]))]


def _table_text(rng: random.Random, rows: int, columns: int) -> str:
    delimiter = rng.choice([",", ";", "\t", "|"])
    lines = []
    for _ in range(rows):
        lines.append(delimiter.join(rng.choice(TOKENS) if rng.random() < 0.5
                                    else f"{rng.gauss(100, 20):.3f}" for _ in range(columns)))
    return rng.choice(["\n", "\r\n", "\r"]).join(lines)


def wrong_encoding(rng: random.Random, folder: Path, k: int) -> list[str]:
    text = _table_text(rng, rng.randint(1, 40), rng.randint(1, 5))
    encoding = rng.choice(["utf-16-le", "utf-16-be", "utf-32", "cp1252", "latin-1", "utf-8"])
    data = text.encode(encoding, errors="replace")
    if rng.random() < 0.3:
        data = bytes(rng.randrange(256) for _ in range(rng.randint(1, 3000)))
    elif rng.random() < 0.3:
        cut = rng.randrange(1, max(2, len(data)))
        data = data[:cut] + b"\xff\xfe\x00\xc3" + data[cut:]
    return [str(_write(folder, k, rng.choice([".csv", ".txt", ".xlsx", ".xls"]), data))]


def huge_line(rng: random.Random, folder: Path, k: int) -> list[str]:
    kind = rng.randrange(3)
    if kind == 0:
        data = b"Year,GDP\n" + b"1" * rng.choice([1 << 20, 3 << 20]) + b"\n1990,1\n"
    elif kind == 1:
        data = b"Year," + b",".join(b"S%d" % j for j in range(rng.choice([5000, 20000]))) + b"\n"
        data += b"1990," + b",".join(b"1" for _ in range(100)) + b"\n"
    else:
        data = b'Year,"' + b"x" * (2 << 20) + b'"\n1990,1\n1991,2\n'
    return [str(_write(folder, k, ".csv", data)), "--max-difference", "0", "--check", "none"]


def control_names(rng: random.Random, folder: Path, k: int) -> list[str]:
    rows = _base_rows(rng, 24)
    control = rng.choice(["\x1b", "\x07", "\x00", "\u202e", "\x0b", "\x0c"])
    rows[0][1] = f"GDP{control}real"
    lines = [",".join(str(c) for c in row) for row in rows]
    path = _write(folder, k, ".csv", "\n".join(lines).encode())
    out = folder / f"out{k:05d}{rng.choice(['.xlsx', '.html', '.tex', '.csv', '.json'])}"
    return [str(path), "--max-difference", "0", "--check", "none", "--out", str(out)]


def date_labels(rng: random.Random, folder: Path, k: int) -> list[str]:
    forms = ["{y}Q{q}", "{y} Q{q}", "{y}-Q{q}", "{y}-{r}", "Q{q} {y}", "P{i}x", "{y}"]
    chosen = rng.sample(forms, rng.randint(1, 3))
    romans = ("I", "II", "III", "IV")
    lines = ["Period,Value,Other"]
    for i in range(rng.randint(3, 40)):
        label = rng.choice(chosen).format(y=1959 + i // 4, q=i % 4 + 1, r=romans[i % 4], i=i)
        if rng.random() < 0.05:
            label = "1960"
        lines.append(f"{label},{2213 + i},{rng.gauss(0, 1):.3f}")
    return [str(_write(folder, k, ".csv", "\n".join(lines).encode())), "--max-difference", "1"]


def gaps_and_samples(rng: random.Random, folder: Path, k: int) -> list[str]:
    rows = _base_rows(rng, rng.randint(5, 60))
    for _ in range(rng.randint(0, 4)):
        rows[rng.randrange(1, len(rows))][1] = rng.choice(["n.a.", "", "NA", "x"])
    text = "\n".join(",".join(str(c) for c in row) for row in rows)
    args = [str(_write(folder, k, ".csv", text.encode())), "--max-difference", "1",
            "--gaps", rng.choice(["refuse", "longest", "fill"])]
    if rng.random() < 0.5:
        args += ["--sample", rng.choice(["1965:1980", "1990:", ":1961", "2050:", "x:y",
                                         "1970Q1:1975", "1980:1970"])]
    return args


def refused_values(rng: random.Random, folder: Path, k: int) -> list[str]:
    rows = _base_rows(rng, 30)
    scale = rng.choice(["1e306", "-1e307", "1e308", "1+2j", "1e-320"])
    for row in rows[1:]:
        row[2] = f"{row[2]}{scale[1:] if scale.startswith('1e') else ''}" if "e" in scale \
            else scale
    text = "\n".join(",".join(str(c) for c in row) for row in rows)
    return [str(_write(folder, k, ".csv", text.encode())), "--max-difference", "0"]


def random_table(rng: random.Random, folder: Path, k: int) -> list[str]:
    text = _table_text(rng, rng.randint(0, 30), rng.randint(1, 6))
    return [str(_write(folder, k, rng.choice([".csv", ".tsv", ".txt"]),
                       text.encode("utf-8", "surrogatepass"))),
            "--max-difference", "0", "--check", "none"]


def special_file(rng: random.Random, folder: Path, k: int) -> list[str]:
    choice = rng.randrange(3)
    if choice == 0 or not hasattr(os, "mkfifo"):
        return ["/dev/zero"]
    if choice == 1:
        pipe = folder / f"pipe{k:05d}.csv"
        os.mkfifo(pipe)
        return [str(pipe)]
    return [str(folder)]


def out_over_input(rng: random.Random, folder: Path, k: int) -> list[str]:
    path = _write(folder, k, ".xlsx", _valid_xlsx(rng))
    if rng.random() < 0.5:
        return [str(path), "--out", str(path), *(["--replace"] if rng.random() < 0.5 else [])]
    theirs = _write(folder, k + 500_000, ".tex", b"\\documentclass{article}")
    return [str(path), "--max-difference", "0", "--out", str(theirs)]


MAKERS: list[Maker] = [huge_range, damaged_xlsx, damaged_xls, entity_trick, zip_bomb,
                       wrong_encoding, huge_line, control_names, date_labels, gaps_and_samples,
                       refused_values, random_table, special_file, out_over_input,
                       damaged_xlsx, damaged_xls, random_table, wrong_encoding]


def generate(count: int, seed: int, folder: Path) -> list[list[str]]:
    """``count`` argument lists, each naming a freshly written malformed input."""
    rng = random.Random(seed)
    return [MAKERS[k % len(MAKERS)](rng, folder, k) for k in range(count)]
