"""Charts in every report: made once per series as plain data (``report/chart_plan``, through
``ui/report_charts.draw_charts``) and read back from the .xlsx (its drawing part's shapes),
the .html (SVG drawings in data: URIs, parsed as XML) and the .pdf (its pages and the paths
its content streams draw), written by the window and by ``tauscope batch`` alike.

The .xlsx's shapes are read with ElementTree (ECMA-376 Part 1: a group per chart, §20.5.2.17,
its size in EMU, 9525 a pixel; each line shape's ``custGeom`` path, §20.1.9.15–16, in the path's
own ``w`` × ``h`` units, and ``ln`` width, colour and dash; each text box's text).  SVG drawings
are read
with ElementTree (W3C, SVG 1.1, 2nd ed.: ``svg`` width and height §5.1.2, ``title`` §5.4,
``polyline`` points §9.6, ``text`` §10.4).  PDF pages are read from the file's objects: a page
object has ``/Type /Page`` (ISO 32000-1:2008, §7.7.3.3), an image XObject ``/Subtype /Image``
(§8.9.5); content streams are inflated (``/FlateDecode``, §7.4.4) and each path's segments
counted: ``x y m`` begins a subpath, each ``x y l`` adds a straight segment (§8.5.2.1), so a
curve through n points is one ``m`` followed by n − 1 ``l``.  Qt's PDF writer keeps every
object in plain view (no object streams, which the test checks), and poppler's pdfinfo and
pdfimages check the same counts where they are installed (CI)."""

from __future__ import annotations

import base64
import posixpath
import re
import shutil
import subprocess
import unicodedata
import xml.etree.ElementTree as ElementTree
import zipfile
import zlib
from html.parser import HTMLParser
from pathlib import Path

import numpy as np
import openpyxl
import pytest

pytest.importorskip("pytestqt")

from conftest import simulated_series, write_workbook
from tauscope.commands.batch import main
from tauscope.report import RunRecord, export
from tauscope.report.chart_plan import ACCENT, CHART_SIZE, LINE, ChartPlan, plan_chart
from tauscope.ui.chart_paint import paint_plan
from tauscope.ui.report_charts import DrawnCharts, draw_charts
from test_report_record import _check_methods
from test_report_support import make_run

EMU = 9525  # EMU in a pixel (a layout unit of the chart)


def painted(plan: ChartPlan) -> bytes:
    """The plan painted by the PDF's painter onto an image of the chart's size: its pixels."""
    from PySide6.QtGui import QImage, QPainter

    image = QImage(round(plan.width), round(plan.height), QImage.Format.Format_RGB32)
    painter = QPainter(image)
    try:
        paint_plan(painter, plan)
    finally:
        painter.end()
    return bytes(image.constBits())


class _Images(HTMLParser):
    """Every <img> with the <h3> heading (the series) it comes under."""

    def __init__(self) -> None:
        super().__init__()
        self.images: list[tuple[str, dict[str, str | None]]] = []
        self._heading = ""
        self._in_h3: list[str] | None = None

    def handle_starttag(self, tag: str, attrs: list[tuple[str, str | None]]) -> None:
        if tag == "h3":
            self._in_h3 = []
        elif tag == "img":
            self.images.append((self._heading, dict(attrs)))

    def handle_endtag(self, tag: str) -> None:
        if tag == "h3" and self._in_h3 is not None:
            self._heading = "".join(self._in_h3)
            self._in_h3 = None

    def handle_data(self, data: str) -> None:
        if self._in_h3 is not None:
            self._in_h3.append(data)


SVG = "{http://www.w3.org/2000/svg}"


def html_charts(path: Path) -> list[tuple[str, bytes]]:
    """(heading, decoded SVG) for every image of the page; each must be an SVG data: URI whose
    drawing is the report's chart size and is titled after the series."""
    reader = _Images()
    reader.feed(path.read_text(encoding="utf-8"))
    out = []
    for heading, attrs in reader.images:
        src = attrs.get("src") or ""
        assert src.startswith("data:image/svg+xml;base64,"), src[:40]
        svg = base64.b64decode(src.split(",", 1)[1], validate=True)
        name = heading.split(". ", 1)[1]
        assert attrs.get("alt") == f"Chart of {name}"
        root = ElementTree.fromstring(svg)
        assert root.tag == f"{SVG}svg"
        assert (float(root.get("width", 0)), float(root.get("height", 0))) == CHART_SIZE
        assert root.findtext(f"{SVG}title") == f"Chart of {name}"
        out.append((heading, svg))
    return out


def svg_curves(svg: bytes, color: str) -> list[np.ndarray]:
    """The points of every polyline drawn in ``color``."""
    root = ElementTree.fromstring(svg)
    return [np.array([[float(v) for v in pair.split(",")] for pair in line.get("points", "").split()])
            for line in root.iter(f"{SVG}polyline") if line.get("stroke") == color]


def svg_texts(svg: bytes) -> list[str]:
    return [text.text or "" for text in ElementTree.fromstring(svg).iter(f"{SVG}text")]


XLSX_NS = {
    "main": "http://schemas.openxmlformats.org/spreadsheetml/2006/main",
    "r": "http://schemas.openxmlformats.org/officeDocument/2006/relationships",
    "rel": "http://schemas.openxmlformats.org/package/2006/relationships",
    "xdr": "http://schemas.openxmlformats.org/drawingml/2006/spreadsheetDrawing",
    "a": "http://schemas.openxmlformats.org/drawingml/2006/main",
}


def _part(book: zipfile.ZipFile, base: str, target: str) -> str:
    """A relationship's target as a path in the archive (relative to ``base``'s folder)."""
    return posixpath.normpath(posixpath.join(posixpath.dirname(base), target)).lstrip("/")


def _rels(book: zipfile.ZipFile, part: str) -> dict[str, str]:
    folder, name = posixpath.split(part)
    root = ElementTree.fromstring(book.read(f"{folder}/_rels/{name}.rels"))
    return {r.get("Id", ""): _part(book, part, r.get("Target", ""))
            for r in root.findall("rel:Relationship", XLSX_NS)}


def xlsx_charts(path: Path) -> list[tuple[str, bytes]]:
    """(the series name written above it, its group shape as XML) for every chart of the
    Charts sheet.

    openpyxl reads a sheet's cells but not its shapes, so the drawing is read from the
    package itself (ECMA-376 Part 1: the sheet's drawing part, §20.5, each anchor's top-left
    cell), the name above each with openpyxl."""
    names = openpyxl.load_workbook(path).sheetnames
    if "Charts" not in names:
        return []
    cells = openpyxl.load_workbook(path)["Charts"]
    out = []
    with zipfile.ZipFile(path) as book:
        assert not [n for n in book.namelist() if n.startswith("xl/media/")]  # no picture
        workbook = ElementTree.fromstring(book.read("xl/workbook.xml"))
        sheet_rid = next(s.get(f"{{{XLSX_NS['r']}}}id") for s in
                         workbook.iterfind("main:sheets/main:sheet", XLSX_NS)
                         if s.get("name") == "Charts")
        sheet = _rels(book, "xl/workbook.xml")[sheet_rid or ""]
        root = ElementTree.fromstring(book.read(sheet))
        drawing_rid = root.find("main:drawing", XLSX_NS)
        assert drawing_rid is not None
        drawing = _rels(book, sheet)[drawing_rid.get(f"{{{XLSX_NS['r']}}}id") or ""]
        for anchor in ElementTree.fromstring(book.read(drawing)):
            row = anchor.find("xdr:from/xdr:row", XLSX_NS)
            group = anchor.find("xdr:grpSp", XLSX_NS)
            assert row is not None and group is not None
            # the anchor's row is 0-based: the 1-based row just above the chart, its title
            out.append((str(cells.cell(row=int(row.text or 0), column=1).value),
                        ElementTree.tostring(group)))
    return out


def xlsx_marks(xml: bytes) -> tuple[tuple[float, float],
                                    list[tuple[str, float, str, np.ndarray]], list[str]]:
    """A chart's group read back: its size in pixels, every subpath as (colour, width in
    pixels, dash, k × 2 points in pixels) in drawing order, and its texts in order."""
    group = ElementTree.fromstring(xml)
    ext = group.find("xdr:grpSpPr/a:xfrm/a:ext", XLSX_NS)
    assert ext is not None
    size = (int(ext.get("cx", 0)) / EMU, int(ext.get("cy", 0)) / EMU)
    lines: list[tuple[str, float, str, np.ndarray]] = []
    texts: list[str] = []
    for shape in group.findall("xdr:sp", XLSX_NS):
        box = shape.find("xdr:spPr/a:xfrm/a:ext", XLSX_NS)
        line = shape.find("xdr:spPr/a:ln", XLSX_NS)
        for path in shape.findall("xdr:spPr/a:custGeom/a:pathLst/a:path", XLSX_NS):
            assert box is not None and line is not None
            scale = np.array([int(box.get("cx", 0)) / int(path.get("w", 1)),
                              int(box.get("cy", 0)) / int(path.get("h", 1))]) / EMU
            colour = line.find("a:solidFill/a:srgbClr", XLSX_NS)
            assert colour is not None
            dash = "dash" if line.find("a:custDash", XLSX_NS) is not None else ""
            points: list[list[float]] = []
            for step in path:
                point = step.find("a:pt", XLSX_NS)
                assert point is not None
                if step.tag.endswith("moveTo") and points:
                    lines.append((f"#{colour.get('val', '').lower()}",
                                  int(line.get("w", 0)) / EMU, dash, np.array(points) * scale))
                    points = []
                points.append([int(point.get("x", 0)), int(point.get("y", 0))])
            if points:
                lines.append((f"#{colour.get('val', '').lower()}", int(line.get("w", 0)) / EMU,
                              dash, np.array(points) * scale))
        texts += ["".join(t.text or "" for t in shape.iter(f"{{{XLSX_NS['a']}}}t"))
                  for _body in shape.findall("xdr:txBody", XLSX_NS)]
    return size, lines, texts


def assert_draws(group: bytes, plan: ChartPlan) -> None:
    """The group draws the plan: its size, each stroke (colour, width, dashed or not, every
    point to the plan's hundredth of a pixel) in order, each label's text in order."""
    size, lines, texts = xlsx_marks(group)
    assert size == (plan.width, plan.height)
    assert len(lines) == len(plan.strokes)
    for (colour, width, dash, points), stroke in zip(lines, plan.strokes, strict=True):
        assert (colour, dash != "") == (stroke.color.lower(), stroke.dash != "")
        assert width == pytest.approx(stroke.width, abs=1 / EMU)
        assert points.shape == stroke.points.shape
        assert np.allclose(points, stroke.points, atol=0.005, rtol=0)
    assert texts == [label.text for label in plan.labels]


def pdf_objects(path: Path) -> tuple[int, list[tuple[int, int]]]:
    """The number of pages and the (width, height) of every image XObject."""
    data = path.read_bytes()
    assert data.startswith(b"%PDF-") and b"/ObjStm" not in data  # every object in plain view
    pages = len(re.findall(rb"/Type\s*/Page\b", data))
    images = []
    for found in re.finditer(rb"<<(?:(?!>>).)*?/Subtype\s*/Image(?:(?!>>).)*>>", data, re.S):
        block = found.group(0)
        width = re.search(rb"/Width\s+(\d+)", block)
        height = re.search(rb"/Height\s+(\d+)", block)
        assert width and height
        images.append((int(width.group(1)), int(height.group(1))))
    if shutil.which("pdfinfo"):
        info = subprocess.run(["pdfinfo", str(path)], capture_output=True, text=True, check=True,
                              timeout=60).stdout
        counted = re.search(r"Pages:\s+(\d+)", info)
        assert counted is not None and int(counted.group(1)) == pages
    if shutil.which("pdfimages"):
        listing = subprocess.run(["pdfimages", "-list", str(path)], capture_output=True,
                                 text=True, check=True, timeout=60).stdout.splitlines()[2:]
        sizes = [(int(r.split()[3]), int(r.split()[4])) for r in listing if r.split()[2] == "image"]
        assert sizes == images
    return pages, images


PATH_RUN = re.compile(rb"[-\d.]+ [-\d.]+ m\n(?:[-\d.]+ [-\d.]+ l\n)+")


def pdf_curves(path: Path, shortest: int = 20) -> list[bytes]:
    """Every path of at least ``shortest`` straight segments the pages draw, in order, as its
    operators (a chart's curves: the table rules and grid lines are single segments)."""
    data = path.read_bytes()
    out = []
    # The data runs to the end-of-line before "endstream"; a compressed stream may itself end
    # in a \r byte, so only the \n is taken off here, and the inflater leaves any \r of a
    # \r\n end-of-line unused (a pattern that also took "\r?" cut such a stream short).
    for header, body in re.findall(rb"<<((?:(?!>>).)*?)>>\s*stream\r?\n(.*?)\nendstream",
                                   data, re.S):
        if b"/FlateDecode" in header:
            inflater = zlib.decompressobj()
            body = inflater.decompress(body)
            assert inflater.eof and inflater.unused_data in (b"", b"\r"), "a stream cut short"
        out += [m.group(0) for m in PATH_RUN.finditer(body)
                if m.group(0).count(b" l\n") >= shortest]
    return out


def segments(curves: list[bytes]) -> list[int]:
    return [curve.count(b" l\n") for curve in curves]


def expected_segments(run: RunRecord) -> list[int]:
    """Per charted series (``charted``), the segments of its curves: the series and its
    deterministic path (n − 1 each) in the Fitted path view, else the series (n − 1) and its
    first difference (n − 2) in the Data view."""
    out = []
    for finding in run.findings:
        result = finding.result
        if not result.ok or result.values is None:
            continue
        n = len(result.values)
        out += [n - 1, n - 1] if result.fitted is not None else [n - 1, n - 2]
    return out


def charted(run: RunRecord) -> list[str]:
    """The series whose chart the HTML and the PDF show: tested, with values to draw."""
    return [f.name for f in run.findings if f.result.ok and f.result.values is not None]


# --- the drawing ---------------------------------------------------------------------------

@pytest.fixture(scope="module")
def drawn() -> tuple[RunRecord, DrawnCharts]:
    run = make_run()
    return run, draw_charts(run)


def test_each_tested_series_gets_one_chart_of_the_fixed_size(
        drawn: tuple[RunRecord, DrawnCharts]) -> None:
    run, charts = drawn
    assert charts.problems == ()
    with_values = [f for f in run.findings if f.result.values is not None]
    assert set(charts.charts) == {f.key for f in with_values}
    assert len(with_values) == 3  # the series too short to test carries no values: no chart
    pictures = []
    for plan in charts.charts.values():
        assert (plan.width, plan.height) == CHART_SIZE
        pictures.append(painted(plan))
    assert len(set(pictures)) == len(pictures)  # each its own drawing


def test_each_chart_draws_its_series_and_what_the_verdict_implies(
        drawn: tuple[RunRecord, DrawnCharts]) -> None:
    """The Fitted path view holds the series and the deterministic path through every
    observation, titled "name: verdict", with a key; the Data view (no path implied) the
    series and its first difference.  Points keep the data's order and shape: the x positions
    rise, and the heights are the values mapped linearly (checked by a straight-line fit)."""
    run, charts = drawn
    from tauscope.report.chart_svg import chart_svg

    views = set()
    for finding in run.findings:
        plan = charts.charts.get(finding.key or "")
        result = finding.result
        if plan is None:
            continue
        svg = chart_svg(plan).encode("utf-8")
        values = np.asarray(result.values, dtype=float)
        series = svg_curves(svg, LINE)[0]  # then the key's sample line, if any
        assert len(series) == len(values) and np.all(np.diff(series[:, 0]) > 0)
        assert np.all((series >= 0) & (series <= np.array(CHART_SIZE)))
        slope, _ = np.polyfit(values, series[:, 1], 1)  # y grows downwards on the page
        assert slope < 0
        assert np.allclose(np.polyval(np.polyfit(values, series[:, 1], 1), values),
                           series[:, 1], atol=0.01)
        others = svg_curves(svg, ACCENT)
        texts = svg_texts(svg)
        if result.fitted is not None:
            views.add("fitted")
            path = others[0]  # then the key's sample line
            assert len(path) == len(values)
            assert np.allclose(np.polyval(np.polyfit(values, series[:, 1], 1),
                                          np.asarray(result.fitted, dtype=float)), path[:, 1],
                               atol=0.01)
            assert f"{finding.name}: {result.verdict.label}" in texts
            assert "series" in texts and "deterministic path" in texts
        else:
            views.add("data")
            assert len(others[0]) == len(values) - 1
            assert finding.name in texts and "First difference" in texts
    assert views == {"fitted", "data"}


def test_the_drawing_does_not_depend_on_the_window_palette(
        drawn: tuple[RunRecord, DrawnCharts]) -> None:
    """Reports are drawn in paper colours: a dark window palette changes nothing."""
    from PySide6.QtWidgets import QApplication

    from tauscope.ui.appearance import dark_palette

    run, charts = drawn
    app = QApplication.instance()
    assert isinstance(app, QApplication)
    before_pictures = [painted(p) for p in charts.charts.values()]
    before = app.palette()
    app.setPalette(dark_palette())
    try:
        again = draw_charts(run)
        pictures = [painted(p) for p in again.charts.values()]
    finally:
        app.setPalette(before)
    assert list(again.charts) == list(charts.charts)
    assert all(a.same_as(b) for a, b in zip(again.charts.values(), charts.charts.values(),
                                            strict=True))
    assert pictures == before_pictures


def test_a_chart_that_fails_is_left_out_with_a_sentence(
        drawn: tuple[RunRecord, DrawnCharts], monkeypatch: pytest.MonkeyPatch) -> None:
    import tauscope.ui.report_charts as report_charts

    run, charts = drawn
    bad = run.findings[0]

    def failing(result: object, values: object = None) -> ChartPlan | None:
        if getattr(result, "name", None) == bad.name:
            raise ValueError("a drawing that fails")
        return plan_chart(result, values)  # type: ignore[arg-type]

    monkeypatch.setattr(report_charts, "plan_chart", failing)
    again = draw_charts(run)
    assert again.problems == (f"{bad.name}: its chart could not be drawn "
                              "(ValueError: a drawing that fails)",)
    assert set(again.charts) == set(charts.charts) - {bad.key}


# --- each format read back -----------------------------------------------------------------

def test_xlsx_holds_each_chart_under_its_series_name(
        drawn: tuple[RunRecord, DrawnCharts], tmp_path: Path) -> None:
    run, charts = drawn
    export(tmp_path / "f.xlsx", run, charts.charts)
    found = xlsx_charts(tmp_path / "f.xlsx")
    assert [name for name, _group in found] == [f.name for f in run.findings
                                               if f.key in charts.charts]
    for finding, (_name, group) in zip((f for f in run.findings if f.key in charts.charts),
                                       found, strict=True):
        assert_draws(group, charts.charts[finding.key or ""])


def test_html_embeds_each_chart_as_an_svg_data_uri(drawn: tuple[RunRecord, DrawnCharts],
                                                   tmp_path: Path) -> None:
    from tauscope.report.chart_svg import chart_svg

    run, charts = drawn
    export(tmp_path / "f.html", run, charts.charts)
    found = html_charts(tmp_path / "f.html")
    names = charted(run)
    assert [heading.split(". ", 1)[1] for heading, _svg in found] == names
    by_name = {f.name: f.key for f in run.findings}
    for heading, svg in found:
        assert svg == chart_svg(charts.charts[by_name[heading.split(". ", 1)[1]] or ""]).encode()


def test_pdf_draws_each_chart_as_vectors(drawn: tuple[RunRecord, DrawnCharts],
                                         tmp_path: Path) -> None:
    """No picture in the PDF: each charted series' curves are paths through all its points."""
    import tauscope.ui.pdf_report  # noqa: F401  (registers ".pdf")

    run, charts = drawn
    export(tmp_path / "with.pdf", run, charts.charts)
    export(tmp_path / "without.pdf", run)
    pages, images = pdf_objects(tmp_path / "with.pdf")
    bare_pages, bare_images = pdf_objects(tmp_path / "without.pdf")
    assert images == [] and bare_images == []
    assert segments(pdf_curves(tmp_path / "with.pdf")) == expected_segments(run)
    assert pdf_curves(tmp_path / "without.pdf") == []
    assert pages > bare_pages >= 1  # three charts of 620 × 300 units take room


# --- tauscope batch ------------------------------------------------------------------------

def _workbook(tmp_path: Path) -> Path:
    series = simulated_series(3, 120, seed=21)
    series["drifting"] = np.cumsum(0.4 + np.random.default_rng(5).standard_normal(120))
    return write_workbook(tmp_path / "quarterly data.xlsx", series)


BATCH_PLANS: list[dict[str, ChartPlan]] = []


@pytest.fixture
def batch_reports(tmp_path: Path, capsys: pytest.CaptureFixture[str],
                  monkeypatch: pytest.MonkeyPatch) -> tuple[Path, str]:
    """The batch's reports; the charts it made are kept in ``BATCH_PLANS`` (its last run)."""
    import tauscope.commands.batch as batch

    made = batch.draw_report_charts

    def keeping(*args: object) -> object:
        charts, notes = made(*args)  # type: ignore[arg-type]
        BATCH_PLANS[:] = [dict(charts)]
        return charts, notes

    monkeypatch.setattr(batch, "draw_report_charts", keeping)
    source = _workbook(tmp_path)
    outs = [str(tmp_path / f"batch{s}") for s in (".xlsx", ".html", ".pdf", ".json")]
    assert main([str(source), *[a for o in outs for a in ("--out", o)]]) == 0
    return tmp_path, capsys.readouterr().err


def test_batch_reports_hold_every_chart_and_say_what_the_run_did(
        batch_reports: tuple[Path, str]) -> None:
    import json

    folder, err = batch_reports
    # at most the reader's one line; no stray line from Qt, no note on a chart
    assert len(err.splitlines()) <= 1 and "chart" not in err and "plugin" not in err
    data = json.loads((folder / "batch.json").read_text(encoding="utf-8"))
    names = [s["name"] for s in data["series"]]
    assert len(names) == 4
    xlsx = xlsx_charts(folder / "batch.xlsx")
    html = html_charts(folder / "batch.html")
    assert [n for n, _group in xlsx] == names
    assert [h.split(". ", 1)[1] for h, _svg in html] == names
    # every format draws the one chart made for each series
    from tauscope.report.chart_svg import chart_svg

    plans = list(BATCH_PLANS[0].values())
    assert [p.name for p in plans] == names
    for (_n, group), plan in zip(xlsx, plans, strict=True):
        assert_draws(group, plan)
    assert [svg for _h, svg in html] == [chart_svg(p).encode() for p in plans]
    for item, (_h, svg) in zip(data["series"], html, strict=True):
        assert len(svg_curves(svg, LINE)[0]) == item["nobs"]  # the series, every observation
    pages, images = pdf_objects(folder / "batch.pdf")
    assert images == [] and pages >= 2
    fitted = [bool(svg_curves(svg, ACCENT)[0].shape[0] == item["nobs"])
              for item, (_h, svg) in zip(data["series"], html, strict=True)]
    assert segments(pdf_curves(folder / "batch.pdf")) == [
        k for item, path in zip(data["series"], fitted, strict=True)
        for k in (item["nobs"] - 1, item["nobs"] - (1 if path else 2))]
    # Each series' observations and sample, and the methods text of this run, are still there.
    book = openpyxl.load_workbook(folder / "batch.xlsx")
    summary = list(book["Summary"].iter_rows(values_only=True))
    head = summary[0]
    for item, row in zip(data["series"], summary[1:], strict=False):
        assert row[head.index("Series")] == item["name"]
        assert row[head.index("Observations")] == item["nobs"]
        assert [row[head.index("First")], row[head.index("Last")]] == item["span"]
    about = [str(c) for r in book["About this run"].iter_rows(values_only=True) for c in r if c]
    run = _record_of(folder / "batch.json")
    _check_methods(" ".join(about[about.index("Methods") + 1:]), run)


def _record_of(path: Path) -> RunRecord:
    """What ``_check_methods`` reads (settings, tests run, number of series), from the JSON."""
    import json
    from types import SimpleNamespace

    from tauscope.engine import Settings

    data = json.loads(path.read_text(encoding="utf-8"))
    known = set(Settings.__dataclass_fields__)
    settings = Settings(**{k: tuple(v) if isinstance(v, list) else v
                           for k, v in data["settings"].items() if k in known})
    return SimpleNamespace(settings=settings, tests_run=tuple(data["tests_run"]),  # type: ignore[return-value]
                           findings=data["series"])


@pytest.mark.skipif(shutil.which("pdftotext") is None,
                    reason="poppler-utils (pdftotext) is not installed; .ci/run installs it")
def test_batch_pdf_with_charts_still_shows_samples_and_methods(
        batch_reports: tuple[Path, str]) -> None:
    import json

    folder, _err = batch_reports
    text = subprocess.run(["pdftotext", str(folder / "batch.pdf"), "-"], capture_output=True,
                          text=True, check=True, timeout=60).stdout
    text = unicodedata.normalize("NFKC", text)
    flat = " ".join(text.split())
    for item in json.loads((folder / "batch.json").read_text(encoding="utf-8"))["series"]:
        assert f"{item['span'][0]} to {item['span'][1]} · {item['nobs']} observations" in flat
    _check_methods(text.split("Methods", 1)[-1], _record_of(folder / "batch.json"),
                   hyphens=False)


def test_batch_no_charts_leaves_them_out(tmp_path: Path) -> None:
    source = _workbook(tmp_path)
    outs = [str(tmp_path / f"bare{s}") for s in (".xlsx", ".html", ".pdf")]
    assert main([str(source), "--no-charts", *[a for o in outs for a in ("--out", o)]]) == 0
    assert xlsx_charts(tmp_path / "bare.xlsx") == []
    with zipfile.ZipFile(tmp_path / "bare.xlsx") as book:
        assert not [n for n in book.namelist() if n.startswith(("xl/media/", "xl/drawings/"))]
    assert html_charts(tmp_path / "bare.html") == []
    assert pdf_objects(tmp_path / "bare.pdf")[1] == []
    assert pdf_curves(tmp_path / "bare.pdf") == []


def test_batch_goes_on_when_a_chart_fails(tmp_path: Path, monkeypatch: pytest.MonkeyPatch,
                                          capsys: pytest.CaptureFixture[str]) -> None:
    import tauscope.ui.report_charts as report_charts

    source = _workbook(tmp_path)
    failed: list[str] = []

    def fails_once(result: object, values: object = None) -> ChartPlan | None:
        if not failed:
            failed.append(str(getattr(result, "name", "")))
            raise RuntimeError("no room to draw")
        return plan_chart(result, values)  # type: ignore[arg-type]

    monkeypatch.setattr(report_charts, "plan_chart", fails_once)
    assert main([str(source), "--out", str(tmp_path / "f.html"), "--out",
                 str(tmp_path / "f.xlsx"), "--out", str(tmp_path / "f.pdf")]) == 0
    err = capsys.readouterr().err
    assert "Traceback" not in err and len(err.strip().splitlines()) == 1
    assert (f"{failed[0]}: its chart could not be drawn (RuntimeError: no room to draw)"
            f" (left out of the reports)") in err
    assert len(html_charts(tmp_path / "f.html")) == 3
    assert failed[0] not in [n for n, _group in xlsx_charts(tmp_path / "f.xlsx")]
    assert len(xlsx_charts(tmp_path / "f.xlsx")) == 3
    assert len(pdf_curves(tmp_path / "f.pdf")) == 6  # two curves for each of three charts


# --- the window and batch: one report path ---------------------------------------------------

def test_window_and_batch_reports_carry_the_same_charts(  # type: ignore[no-untyped-def]
        main_window, open_in_window, run_in_window, tmp_path, capsys):
    import tauscope.ui.pdf_report  # noqa: F401  (registers ".pdf")
    from tauscope.commands.batch import _parser, _settings

    source = _workbook(tmp_path)
    window = main_window
    window.apply_settings(_settings(_parser().parse_args([str(source)])))  # batch's defaults
    open_in_window(window, source)
    run_in_window(window, window.series_panel.model.all_series())
    for suffix in (".xlsx", ".html", ".pdf"):
        assert window.export_findings(tmp_path / f"window{suffix}")
    assert main([str(source), *[a for s in (".xlsx", ".html", ".pdf")
                                for a in ("--out", str(tmp_path / f"batch{s}"))]]) == 0
    window_html = html_charts(tmp_path / "window.html")
    assert len(window_html) == 4
    assert window_html == html_charts(tmp_path / "batch.html")
    assert xlsx_charts(tmp_path / "window.xlsx") == xlsx_charts(tmp_path / "batch.xlsx")
    assert pdf_objects(tmp_path / "window.pdf") == pdf_objects(tmp_path / "batch.pdf")
    window_curves = pdf_curves(tmp_path / "window.pdf")
    assert len(window_curves) == 8  # two curves for each of four charts, point by point:
    assert window_curves == pdf_curves(tmp_path / "batch.pdf")


def test_a_series_name_with_markup_characters_is_drawn_as_written(tmp_path: Path) -> None:
    """A name with markup characters ("Real output & <prices>") comes out as written in the
    SVG's title and text (escaped once, read back by an XML parser)."""
    from tauscope.report.chart_svg import chart_svg

    run = make_run()
    finding = run.findings[0]
    assert finding.name == "Real output & <prices>"
    plan = plan_chart(finding.result)
    assert plan is not None
    svg = chart_svg(plan).encode()
    assert f"{finding.name}: {finding.result.verdict.label}" in svg_texts(svg)
    assert ElementTree.fromstring(svg).findtext(f"{SVG}title") == f"Chart of {finding.name}"


def test_each_chart_depends_on_its_own_series_and_leaves_room_for_its_labels() -> None:
    """A chart is the same whatever was made before it, and the room left of the plot holds
    its widest tick label ("1000" and more on the I(2) series, which climbs past 1,000)."""
    from tauscope.report.chart_plan import TICK_SIZE, text_width

    run = make_run()
    climbing = run.findings[2].result  # the I(2) series: no deterministic path, Data view
    assert climbing.fitted is None and climbing.values is not None
    assert float(climbing.values.max()) > 1000
    for finding in run.findings[:2]:
        plan_chart(finding.result)
    after = plan_chart(climbing)
    alone = plan_chart(make_run().findings[2].result)
    assert after is not None and alone is not None and after.same_as(alone)
    axis = after.strokes[[s.color for s in after.strokes].index("#1a1a1a")]
    left = float(axis.points[0, 0])
    ticks = [label for label in after.labels if label.anchor == "end"]
    assert any(len(t.text) >= 4 for t in ticks)
    assert all(t.x - text_width(t.text, TICK_SIZE) >= 0 and t.x < left for t in ticks)


def test_batch_draws_its_charts_without_a_display_or_a_platform_named(tmp_path: Path) -> None:
    """A server without a screen: no DISPLAY, no WAYLAND_DISPLAY, no QT_QPA_PLATFORM."""
    import os
    import sys

    source = _workbook(tmp_path)
    env = {k: v for k, v in os.environ.items()
           if k not in ("DISPLAY", "WAYLAND_DISPLAY", "QT_QPA_PLATFORM")}
    done = subprocess.run([sys.executable, "-m", "tauscope", "batch", str(source), "--out",
                           str(tmp_path / "f.html")], capture_output=True, text=True,
                          timeout=300, check=False, env=env)
    assert done.returncode == 0, done.stderr
    assert "Traceback" not in done.stderr and "chart" not in done.stderr
    assert len(html_charts(tmp_path / "f.html")) == 4


def test_decimal_years_are_kept_by_the_dates_and_cannot_be_changed() -> None:
    """A dated index's decimal years are worked out once for the series that share its dates
    (``chart_plan.x_values``): the same numbers as worked out afresh, read-only, and other
    dates give their own."""
    import numpy as np
    import pandas as pd

    from tauscope.report import chart_plan

    monthly = pd.period_range("1999-11", periods=30, freq="M")
    first, dated = chart_plan.x_values(monthly)
    again, _ = chart_plan.x_values(pd.period_range("1999-11", periods=30, freq="M"))
    fresh, _ = chart_plan._x_values(monthly)
    assert dated and again is first and np.array_equal(first, fresh)
    assert first[0] == 1999 + 304 / 365 and first[2] == 2000.0  # 1 November 1999, 1 January 2000
    assert not first.flags.writeable
    quarterly, _ = chart_plan.x_values(pd.period_range("1999Q4", periods=30, freq="Q"))
    assert quarterly[1] == 2000.0 and not np.array_equal(quarterly, first)
    tz = pd.date_range("2001-03-01", periods=5, freq="D", tz="Europe/Berlin")
    assert np.array_equal(chart_plan.x_values(tz)[0], chart_plan._x_values(tz)[0])
    assert chart_plan.x_values(pd.Index([3, 4, 5]))[0].tolist() == [3.0, 4.0, 5.0]
