"""The spec sheet as a vector table (SVG or a one-page PDF) to place on a drawing.

matplotlib (the optional ``plot`` extra) is imported only here, inside the functions, and
only the figure and canvas classes (no pyplot: no display, no figure kept alive). Text
stays text: SVG with ``svg.fonttype = 'none'`` (``<text>`` elements), PDF with the 14
core fonts (``pdf.use14corefonts``: Helvetica, no embedded glyph outlines), so labels and
values can be searched and copied. The output is reproducible: no dates in the metadata,
a fixed ``svg.hashsalt``, no math parsing of the labels; the same input gives the same
bytes with the same matplotlib version.
"""

from __future__ import annotations

import io
import textwrap

from ..errors import InvalidInput
from .spec import SECTION_TITLES, SpecSheet

__all__ = ["RC", "VECTOR_FORMATS", "render_vector", "require_matplotlib"]

VECTOR_FORMATS = ("svg", "pdf")

#: The matplotlib settings the sheet is drawn with (reproducible, text kept as text).
RC = {"svg.fonttype": "none", "svg.hashsalt": "swingcalc-spec-sheet",
      "pdf.use14corefonts": True, "pdf.compression": 6, "text.usetex": False,
      "font.family": "sans-serif", "font.size": 6.5, "axes.unicode_minus": False}
# The SVG names a font the reader's viewer supplies; metrics for the layout come from the
# font matplotlib ships (DejaVu Sans), the same on every machine. PDF: Helvetica (core).
# The core Helvetica's regular face is "Medium" in its metrics file: asking for "normal"
# would log a font fallback on every run.
_FONTS = {"svg": {"font.sans-serif": ["DejaVu Sans"]},
          "pdf": {"font.sans-serif": ["Helvetica"], "font.weight": "medium"}}

_PT = 1.0 / 72.0                    # inch per point
_SIZE = 6.5                         # body text [pt]
_ROW = 9.0                          # row pitch [pt]
_MARGIN = 18.0                      # [pt]
_CHAR = 0.56 * _SIZE                # mean character width estimate [pt] (DejaVu/Helvetica)


def require_matplotlib(fmt: str) -> None:
    """Refuse, as bad input, an SVG/PDF request when matplotlib is not installed."""
    try:
        import matplotlib  # noqa: F401
    except ModuleNotFoundError:
        raise InvalidInput("--format", fmt, "table, csv, json or markdown, or install the "
                           "plot extra (pip install 'swingcalc[plot]')",
                           f"{fmt} needs matplotlib, which is not installed") from None


def _columns(sheet: SpecSheet) -> dict:
    """Column x positions [pt], from the longest text in each (an estimate of the width:
    generous, so nothing overlaps in either font)."""
    rows = [r for r in sheet.rows if r.section != "design"]
    label = max([len(r.label) for r in rows] + [20]) * _CHAR
    value = max([len(r.shown) for r in rows] + [8]) * _CHAR
    unit = max([len(r.unit) for r in rows] + [6]) * _CHAR
    band = max([len(r.rss_shown) for r in rows] + [len("+/- worst case")]) * _CHAR
    x = {"label": _MARGIN + 8.0}
    x["value"] = x["label"] + label + 8.0 + value          # right edge of the values
    x["unit"] = x["value"] + 6.0
    x["rss"] = x["unit"] + unit + 8.0 + band               # right edges of the bands
    x["worst"] = x["rss"] + 8.0 + band
    x["right"] = x["worst"] + _MARGIN
    return x


def _lines(sheet: SpecSheet, width_chars: int) -> tuple[list, list]:
    notes = sheet.display_notes()
    wrap = textwrap.TextWrapper(width=width_chars, subsequent_indent="  ")
    note_lines = [line for n in notes for line in wrap.wrap(n)]
    caution_lines = [line for c in sheet.cautions for line in wrap.wrap("- " + c)]
    return note_lines, caution_lines


def render_vector(sheet: SpecSheet, fmt: str) -> bytes:
    """The sheet as an SVG or PDF file's bytes (``fmt`` in :data:`VECTOR_FORMATS`)."""
    if fmt not in VECTOR_FORMATS:
        raise ValueError(fmt)
    require_matplotlib(fmt)
    from matplotlib.figure import Figure
    from matplotlib.lines import Line2D

    x = _columns(sheet)
    width = x["right"]
    note_lines, caution_lines = _lines(sheet, int((width - 2 * _MARGIN) / (_CHAR * 0.95)))
    body = [r for r in sheet.rows if r.section != "design"]
    sections = len({r.section for r in body})
    title_h = 4 * _ROW + 10.0
    height = (2 * _MARGIN + title_h + (len(body) + sections + 2) * _ROW
              + (len(note_lines) + len(caution_lines) + 3) * _ROW)
    from ..plots import style

    with style(dict(RC, **_FONTS[fmt])):
        fig = Figure(figsize=(width * _PT, height * _PT))
        tr = fig.dpi_scale_trans

        def text(xp, yp, s, **kw):
            fig.text(xp * _PT, (height - yp) * _PT, s, transform=tr, parse_math=False,
                     va="baseline", **kw)

        def rule(yp, x0=_MARGIN, x1=width - _MARGIN, lw=0.4):
            fig.add_artist(Line2D([x0 * _PT, x1 * _PT], [(height - yp) * _PT] * 2,
                                  transform=tr, color="black", linewidth=lw))

        # Title block: a box holding the design, revision, date, context and units.
        y = _MARGIN
        top = y
        y += _ROW + 4.0
        text(_MARGIN + 6.0, y, sheet.name, fontsize=9.0, fontweight="bold")
        y += _ROW + 2.0
        from .. import __version__

        text(_MARGIN + 6.0, y, f"revision {sheet.revision}    date {sheet.date}    "
             f"context {sheet.context}    units {sheet.system}")
        y += _ROW
        text(_MARGIN + 6.0, y, f"spec sheet, swingcalc {__version__}", color="0.3")
        y += 6.0
        for yy in (top, y):
            rule(yy, lw=0.8)
        for xx in (_MARGIN, width - _MARGIN):
            fig.add_artist(Line2D([xx * _PT] * 2, [(height - top) * _PT, (height - y) * _PT],
                                  transform=tr, color="black", linewidth=0.8))
        # Column heads.
        y += _ROW + 4.0
        text(x["label"], y, "quantity", fontweight="bold")
        text(x["value"], y, "value", fontweight="bold", ha="right")
        text(x["unit"], y, "unit", fontweight="bold")
        text(x["rss"], y, "+/- RSS", fontweight="bold", ha="right")
        text(x["worst"], y, "+/- worst case", fontweight="bold", ha="right")
        y += 3.0
        rule(y, lw=0.6)
        last = None
        for r in body:
            if r.section != last:
                last = r.section
                y += _ROW
                text(_MARGIN + 2.0, y, SECTION_TITLES.get(r.section, r.section),
                     fontweight="bold")
            y += _ROW
            text(x["label"], y, r.label)
            text(x["value"], y, r.shown, ha="right")
            text(x["unit"], y, r.unit)
            text(x["rss"], y, r.rss_shown, ha="right")
            text(x["worst"], y, r.worst_shown, ha="right")
        y += 4.0
        rule(y, lw=0.6)
        for line in note_lines:
            y += _ROW
            text(_MARGIN + 2.0, y, line, color="0.25")
        y += _ROW + 4.0
        text(_MARGIN + 2.0, y, "CAUTIONS", fontweight="bold")
        for line in caution_lines:
            y += _ROW
            text(_MARGIN + 2.0, y, line)
        buf = io.BytesIO()
        if fmt == "svg":
            meta = {"Date": None, "Creator": "swingcalc", "Title": sheet.title}
        else:
            meta = {"CreationDate": None, "ModDate": None, "Creator": "swingcalc",
                    "Title": sheet.title}
        fig.savefig(buf, format=fmt, metadata=meta)
    return buf.getvalue()
