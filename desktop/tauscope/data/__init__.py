"""Reading workbooks into series: CSV/text and Excel files, dates and frequencies,
missing values, gaps and transformations.  Imports nothing of Tauscope outside itself.
"""

from tauscope.data.errors import DataError
from tauscope.data.model import Gap, SeriesData, SheetData, Source, Workbook
from tauscope.data.reader import file_sha256, read_workbook
from tauscope.data.transforms import TRANSFORMS, make_transform

__all__ = [
    "TRANSFORMS",
    "DataError",
    "Gap",
    "SeriesData",
    "SheetData",
    "Source",
    "Workbook",
    "file_sha256",
    "make_transform",
    "read_workbook",
]
