"""Reports: plain-data tables built from library results, and their text formats.

``model`` holds the data objects, ``builders`` makes them from library results,
``formats`` turns them into CSV, JSON, Markdown or plain text, ``cautions`` holds the
safety texts, and ``files`` writes a report file atomically.
"""

from .cautions import cautions_for
from .files import write_atomic
from .formats import FORMATS, render
from .model import Column, Item, Report, Table

__all__ = ["Column", "FORMATS", "Item", "Report", "Table", "cautions_for", "render",
           "write_atomic"]
