"""A :class:`~tauscope.report.chart_plan.ChartPlan` as DrawingML shapes for the .xlsx.

The chart is drawn in the workbook as vectors, mark by mark as the plan places them, the
way the .html (SVG) and the .pdf (PDF paths) draw it: one group shape per chart
(ECMA-376, 5th ed., Part 1: §20.5.2.17 ``grpSp`` in a drawing part), holding

* a white rectangle, the chart's box (§20.1.10.56 ``prstGeom`` "rect");
* each run of consecutive strokes with the same pen as one shape of custom geometry
  (§20.1.9.8 ``custGeom``: a ``path`` of ``moveTo`` / ``lnTo``, §20.1.9.15–16; in hundredths
  of a layout unit, the plan's own precision), with its line (§20.1.2.2.24 ``ln``: width in
  EMU, flat caps, round joins, and the dash pattern as ``custDash``, §20.1.8.21, lengths in
  thousandths of a percent of the line's width, as the other formats draw it);
* each label as a text box (§20.1.2.1.1 ``bodyPr`` with no insets and no wrapping; the
  paragraph aligned left, centred or right on its anchor; the box's top one ascent, 0.905
  em, above the baseline).

Nothing is painted or compressed: a chart is some 20 kilobytes of XML made in well under a
millisecond, where a PNG picture of it cost about 5 ms (painting, then zlib), and the
reader gets lines and text sharp at any zoom.  Sizes: a layout unit is a pixel at 96 dpi,
9525 EMU (§20.1.2.1); a text's size in pixels times 0.75 is its size in points.
"""

from __future__ import annotations

from collections.abc import Iterator
from xml.sax.saxutils import escape, quoteattr

import numpy as np

from tauscope.report.chart_plan import ChartPlan, Label, Stroke, text_width
from tauscope.report.text_safety import xml_text

EMU = 9525  # EMU in a layout unit (a pixel at 96 dpi)
PATH_UNITS = 100  # path coordinates per layout unit: the plan's points carry two decimals
ASCENT = 0.905  # the baseline below the top of a text box, in em (Arial's ascent)
FONT = "Arial"
DASHES = {"dash": (6.0, 3.0), "dot": (1.5, 2.5)}  # layout units, as in the SVG and the PDF
ALIGN = {"start": "l", "middle": "ctr", "end": "r"}


def _colour(color: str) -> str:
    return f'<a:solidFill><a:srgbClr val="{color.lstrip("#").upper()}"/></a:solidFill>'


def _name(ids: Iterator[int], name: str, extra: str = "") -> str:
    return f'<xdr:cNvPr id="{next(ids)}" name={quoteattr(name)}{extra}/>'


def _frame(left: float, top: float, width: float, height: float) -> str:
    return (f'<a:xfrm><a:off x="{round(left * EMU)}" y="{round(top * EMU)}"/>'
            f'<a:ext cx="{round(width * EMU)}" cy="{round(height * EMU)}"/></a:xfrm>')


def _path(points: np.ndarray) -> str:
    xs, ys = np.rint(np.asarray(points, dtype=float) * PATH_UNITS).astype(np.int64).T.tolist()
    return f'<a:moveTo><a:pt x="{xs[0]}" y="{ys[0]}"/></a:moveTo>' + "".join(
        map('<a:lnTo><a:pt x="{}" y="{}"/></a:lnTo>'.format, xs[1:], ys[1:]))


def _line(color: str, width: float, dash: str) -> str:
    pattern = ""
    if dash:
        on, off = DASHES[dash]
        pattern = (f'<a:custDash><a:ds d="{round(on / width * 100_000)}" '
                   f'sp="{round(off / width * 100_000)}"/></a:custDash>')
    return (f'<a:ln w="{round(width * EMU)}" cap="flat">{_colour(color)}{pattern}<a:round/>'
            "</a:ln>")


def _strokes(plan: ChartPlan, strokes: list[Stroke], ids: Iterator[int]) -> str:
    """Strokes with one pen (drawn one after the other) as one shape."""
    first = strokes[0]
    w, h = round(plan.width * PATH_UNITS), round(plan.height * PATH_UNITS)
    return ("<xdr:sp><xdr:nvSpPr>" + _name(ids, "Lines") + "<xdr:cNvSpPr/></xdr:nvSpPr>"
            "<xdr:spPr>" + _frame(0, 0, plan.width, plan.height)
            + '<a:custGeom><a:avLst/><a:gdLst/><a:ahLst/><a:cxnLst/>'
            '<a:rect l="0" t="0" r="r" b="b"/><a:pathLst>'
            f'<a:path w="{w}" h="{h}" fill="none">'
            + "".join([_path(s.points) for s in strokes])
            + "</a:path></a:pathLst></a:custGeom><a:noFill/>"
            + _line(first.color, first.width, first.dash) + "</xdr:spPr></xdr:sp>")


def _label(label: Label, ids: Iterator[int]) -> str:
    text = xml_text(label.text)
    width = text_width(text, label.size) * 1.5 + 2 * label.size
    left = {"start": label.x, "middle": label.x - width / 2, "end": label.x - width}[label.anchor]
    top = label.y - ASCENT * label.size
    return ("<xdr:sp><xdr:nvSpPr>" + _name(ids, "Text") + '<xdr:cNvSpPr txBox="1"/>'
            "</xdr:nvSpPr><xdr:spPr>" + _frame(left, top, width, label.size * 1.25)
            + '<a:prstGeom prst="rect"><a:avLst/></a:prstGeom><a:noFill/></xdr:spPr>'
            '<xdr:txBody><a:bodyPr wrap="none" lIns="0" tIns="0" rIns="0" bIns="0" anchor="t">'
            f'<a:noAutofit/></a:bodyPr><a:lstStyle/><a:p><a:pPr algn="{ALIGN[label.anchor]}"/>'
            f'<a:r><a:rPr lang="en-US" sz="{round(label.size * 75)}">{_colour(label.color)}'
            f'<a:latin typeface="{FONT}"/><a:cs typeface="{FONT}"/></a:rPr>'
            f"<a:t>{escape(text)}</a:t></a:r></a:p></xdr:txBody></xdr:sp>")


def chart_shapes(plan: ChartPlan, row: int, ids: Iterator[int]) -> str:
    """The chart as one group shape anchored at column A of the 0-based ``row`` (a
    ``oneCellAnchor`` of a drawing part, §20.5.2.24), its shapes numbered from ``ids``."""
    width, height = round(plan.width * EMU), round(plan.height * EMU)
    top = row * 20 * EMU  # where the default rows (20 pixels) put it; the anchor decides
    parts = ["<xdr:oneCellAnchor><xdr:from><xdr:col>0</xdr:col><xdr:colOff>0</xdr:colOff>"
             f"<xdr:row>{row}</xdr:row><xdr:rowOff>0</xdr:rowOff></xdr:from>"
             f'<xdr:ext cx="{width}" cy="{height}"/><xdr:grpSp><xdr:nvGrpSpPr>'
             + _name(ids, f"Chart of {xml_text(plan.name)}")
             + "<xdr:cNvGrpSpPr/></xdr:nvGrpSpPr><xdr:grpSpPr>"
             f'<a:xfrm><a:off x="0" y="{top}"/><a:ext cx="{width}" cy="{height}"/>'
             f'<a:chOff x="0" y="0"/><a:chExt cx="{width}" cy="{height}"/></a:xfrm>'
             "</xdr:grpSpPr>",
             "<xdr:sp><xdr:nvSpPr>" + _name(ids, "Box") + "<xdr:cNvSpPr/></xdr:nvSpPr>"
             "<xdr:spPr>" + _frame(0, 0, plan.width, plan.height)
             + '<a:prstGeom prst="rect"><a:avLst/></a:prstGeom>' + _colour(plan.background)
             + "<a:ln><a:noFill/></a:ln></xdr:spPr></xdr:sp>"]
    run: list[Stroke] = []
    for stroke in plan.strokes:
        if run and (stroke.color, stroke.width, stroke.dash) != (
                run[0].color, run[0].width, run[0].dash):
            parts.append(_strokes(plan, run, ids))
            run = []
        run.append(stroke)
    if run:
        parts.append(_strokes(plan, run, ids))
    parts += [_label(label, ids) for label in plan.labels]
    parts.append("</xdr:grpSp><xdr:clientData/></xdr:oneCellAnchor>")
    return "".join(parts)
