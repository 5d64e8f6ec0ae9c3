"""Small hand-made workbooks for the reading-safety tests and the fuzz campaign.

``xlsx(sheet_xml)`` wraps one worksheet's XML in the fewest parts a reader accepts, so a
test can say exactly which cells a sheet names; ``XLS_SEED`` is a real .xls file that
ships with statsmodels (a Tauscope dependency), used as the seed for damaged .xls files.
"""

from __future__ import annotations

import io
import zipfile
from pathlib import Path

import statsmodels

CONTENT_TYPES = (
    '<?xml version="1.0" encoding="UTF-8"?>'
    '<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">'
    '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/>'
    '<Default Extension="xml" ContentType="application/xml"/>'
    '<Override PartName="/xl/workbook.xml" '
    'ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>'
    '<Override PartName="/xl/worksheets/sheet1.xml" '
    'ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>'
    "</Types>")
ROOT_RELS = (
    '<?xml version="1.0" encoding="UTF-8"?>'
    '<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">'
    '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/'
    'relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>')
WORKBOOK = (
    '<?xml version="1.0" encoding="UTF-8"?>'
    '<workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" '
    'xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships">'
    '<sheets><sheet name="Data" sheetId="1" r:id="rId1"/></sheets></workbook>')
WORKBOOK_RELS = (
    '<?xml version="1.0" encoding="UTF-8"?>'
    '<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">'
    '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/'
    'relationships/worksheet" Target="worksheets/sheet1.xml"/></Relationships>')
SHEET_HEAD = ('<?xml version="1.0" encoding="UTF-8"?>'
              '<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">')

XLS_SEED = (Path(statsmodels.__file__).parent / "datasets" / "macrodata" / "src" /
            "macrodata.xls" / "macrodata.xls")


def xlsx(sheet_data: str, dimension: str | None = None) -> bytes:
    """A workbook with one sheet "Data" whose ``<sheetData>`` content is ``sheet_data``."""
    head = SHEET_HEAD + (f'<dimension ref="{dimension}"/>' if dimension else "")
    sheet = f"{head}<sheetData>{sheet_data}</sheetData></worksheet>"
    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as archive:
        archive.writestr("[Content_Types].xml", CONTENT_TYPES)
        archive.writestr("_rels/.rels", ROOT_RELS)
        archive.writestr("xl/workbook.xml", WORKBOOK)
        archive.writestr("xl/_rels/workbook.xml.rels", WORKBOOK_RELS)
        archive.writestr("xl/worksheets/sheet1.xml", sheet)
    return buffer.getvalue()


def number_cell(ref: str, value: float) -> str:
    return f'<c r="{ref}"><v>{value}</v></c>'


def text_cell(ref: str, text: str) -> str:
    return f'<c r="{ref}" t="inlineStr"><is><t>{text}</t></is></c>'


def table_rows(rows: list[list[str | float]]) -> str:
    """``<row>`` elements for a small table starting at A1."""
    out = []
    for i, row in enumerate(rows, start=1):
        cells = []
        for j, value in enumerate(row):
            ref = f"{chr(65 + j)}{i}"
            cells.append(number_cell(ref, value) if isinstance(value, float)
                         else text_cell(ref, value))
        out.append(f'<row r="{i}">{"".join(cells)}</row>')
    return "".join(out)
