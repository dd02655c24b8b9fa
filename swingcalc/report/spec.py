"""The spec sheet for drawings: the rows of :func:`swingcalc.spec.spec_rows` with their
tolerance bands, shown in a unit system, and written as CSV (for a CAD table), JSON (SI),
Markdown or plain text. The vector table (SVG, PDF) is drawn by
:mod:`swingcalc.report.spec_drawing`.

Shown values carry :data:`VALUE_DIGITS` significant digits (what goes on a drawing), the
bands :data:`BAND_DIGITS`; the CSV holds exactly the shown text, so it parses back to the
shown numbers.
"""

from __future__ import annotations

import csv
import io
import json
import math
from dataclasses import dataclass

from .cautions import cautions_for
from .model import Column, Item, Report, Table, _plain
from .units import KINDS as DISPLAY_KINDS
from .units import SYSTEMS, display_unit, to_display

__all__ = [
    "BAND_DIGITS",
    "CSV_HEADER",
    "SECTION_TITLES",
    "VALUE_DIGITS",
    "SheetRow",
    "SpecSheet",
    "sheet_report",
    "spec_sheet",
    "to_csv",
    "to_json",
    "to_text",
]

#: Significant digits of a shown value (a drawing's figure: more than any tolerance needs).
VALUE_DIGITS = 7
#: Significant digits of a shown +- band.
BAND_DIGITS = 3

CSV_HEADER = ("section", "quantity", "value", "unit", "+/- RSS", "+/- worst case", "key")

#: How each section of :data:`swingcalc.spec.SECTIONS` is headed on the sheet.
SECTION_TITLES = {"design": "design", "conditions": "conditions", "body": "body",
                  "period": "period and beat", "loads": "loads through the swing",
                  "margins": "over-the-top and slack margins", "impact": "impact test",
                  "clock": "clock rate and regulation"}


def _number(value: float, digits: int) -> str:
    if math.isnan(value):
        return ""
    if math.isinf(value):
        return "inf" if value > 0 else "-inf"
    text = format(value, f".{digits}g")
    if text.startswith("-") and float(text) == 0.0:     # no "-0"
        text = text[1:]
    return text


@dataclass(frozen=True)
class SheetRow:
    """One row as shown: the SI row and band, and their text in the chosen units."""

    key: str
    section: str
    label: str
    value: float | str          # SI, as spec_rows gives it
    kind: str
    unit: str                   # display unit ("" for a text or a plain ratio)
    shown: str                  # the value's text in the display unit
    rss: float | None = None    # SI half-widths (None: no band)
    worst: float | None = None
    rss_shown: str = ""
    worst_shown: str = ""


@dataclass(frozen=True)
class SpecSheet:
    """The whole sheet: the title block, the rows, notes and cautions."""

    title: str
    name: str
    revision: str
    date: str
    context: str
    system: str
    rows: tuple
    notes: tuple                # the same in every unit system
    cautions: tuple
    tolerances: tuple = ()      # each toleranced input and its band, in the display units
    tolerance_inputs: tuple = ()    # the same in SI (ToleranceInput.to_dict()), for JSON
    units_note: str = ""

    def display_notes(self) -> list:
        """The notes as the text formats show them: the units first, the tolerances last."""
        out = [self.units_note, *self.notes]
        if self.tolerances:
            out.append("Tolerances: " + "; ".join(self.tolerances) + ".")
        return out

    def row(self, key: str) -> SheetRow:
        for r in self.rows:
            if r.key == key:
                return r
        raise KeyError(key)


# A toleranced input's kind (swingcalc.quantity) -> its display kind here; kinds not
# listed are shown in SI with the kind named.
def _tolerance_inputs(design) -> tuple:
    if not design.tolerances:
        return ()
    from ..tolerance import inputs

    return tuple(i.to_dict() for i in inputs(design))


def _tolerance_texts(design, system: str) -> tuple:
    """Each toleranced input and its +- half-width in the display units (a relative
    tolerance also as the percentage the file gave)."""
    from ..tolerance import inputs

    out = []
    for tol, inp in zip(design.tolerances, inputs(design)):
        # a kind the display table has no row for (a torque, a volume) is shown in SI
        kind = inp.kind if inp.kind in DISPLAY_KINDS else None
        if kind is None:
            half = f"{_number(inp.half_width, BAND_DIGITS)} (SI {inp.kind})"
        else:
            u = display_unit(kind, system)
            half = _number(to_display(inp.half_width, kind, system, difference=True),
                           BAND_DIGITS)
            half = f"{half} {u.unit}".rstrip()
        if tol.relative:
            half += f" ({tol.value * 100:g} %)"
        out.append(f"{tol.path} +/- {half}")
    return tuple(out)


def spec_sheet(design, system: str = "si") -> SpecSheet:
    """The spec sheet of ``design`` shown in ``system`` (one of
    :data:`swingcalc.report.units.SYSTEMS`); values stay SI in the rows."""
    from ..spec import spec_bands, spec_rows, spec_warnings

    if system not in SYSTEMS:
        raise ValueError(system)
    rows = spec_rows(design)
    bands = spec_bands(design)
    out = []
    for r in rows:
        u = display_unit(r.kind, system)
        if not r.numeric:
            out.append(SheetRow(r.key, r.section, r.label, r.value, r.kind, "", r.value))
            continue
        band = bands.get(r.key)
        rss = worst = None
        rss_text = worst_text = ""
        if band is not None:
            rss, worst = float(band.rss), float(band.worst)
            rss_text = _number(abs(to_display(rss, r.kind, system, difference=True)),
                               BAND_DIGITS)
            worst_text = _number(abs(to_display(worst, r.kind, system, difference=True)),
                                 BAND_DIGITS)
        out.append(SheetRow(r.key, r.section, r.label, r.value, r.kind, u.unit,
                            _number(to_display(r.value, r.kind, system), VALUE_DIGITS),
                            rss, worst, rss_text, worst_text))
    units_note = (f"Units: {system} (display only: the JSON output and the library keep "
                  f"SI). Values to {VALUE_DIGITS} significant digits, bands to "
                  f"{BAND_DIGITS}.")
    notes = [("Small-angle error is (T0 - T)/T: negative, the linear model is short. Two "
              "beats per period. Loads are peaks over one conservative swing at each working "
              "amplitude.")]
    if design.suspension.flexible:
        notes.append("Slack margin: 90 deg less the amplitude A; below 0 the suspension "
                     "goes slack during the swing (at the slack angle shown).")
    if design.context == "clock":
        notes.append("Rates are positive when the clock gains.")
    notes[:0] = [f"WARNING: {w}" for w in spec_warnings(design)]
    if design.tolerances:
        notes.append("+/- bands: linear sensitivities to the design file's [tolerances]; RSS "
                     "is the root-sum-square, worst case the sum of the magnitudes "
                     "(first order: the exact worst case is the tolerance command's).")
    else:
        notes.append("No [tolerances] in the design file: no +/- bands.")
    rev = f", rev. {design.revision}" if design.revision else ""
    return SpecSheet(title=f"Spec sheet: {design.name}{rev}", name=design.name,
                     revision=design.revision or "-", date=design.date or "-",
                     context=design.context, system=system, rows=tuple(out),
                     notes=tuple(notes),
                     cautions=tuple(cautions_for(design.context, loads=True)),
                     tolerances=_tolerance_texts(design, system) if design.tolerances
                     else (), tolerance_inputs=_tolerance_inputs(design),
                     units_note=units_note)


def sheet_report(sheet: SpecSheet) -> Report:
    """The sheet as a :class:`~swingcalc.report.model.Report` of shown text, for the
    terminal table, plain text and Markdown (the section shown once, where it starts)."""
    cols = (Column("section", "section"), Column("quantity", "quantity"),
            Column("value", "value"), Column("unit", "unit"),
            Column("rss", "+/- RSS"), Column("worst", "+/- worst case"))
    body, last = [], None
    for r in sheet.rows:
        if r.section == "design":
            continue
        head = SECTION_TITLES.get(r.section, r.section) if r.section != last else ""
        last = r.section
        body.append((head, r.label, r.shown, r.unit, r.rss_shown, r.worst_shown))
    inputs = [Item(r.key, r.label, r.shown) for r in sheet.rows if r.section == "design"]
    inputs.append(Item("units", "units", sheet.system))
    notes = sheet.display_notes()
    return Report("spec", sheet.title, inputs, [],
                  [Table("spec", "Spec sheet", cols, tuple(body))], notes=notes,
                  cautions=list(sheet.cautions))


def to_text(sheet: SpecSheet) -> str:
    """Plain aligned text (for a file or a pipe): the title block, one line per quantity
    under its section, the notes and the cautions."""
    import textwrap

    body = [r for r in sheet.rows if r.section != "design"]
    banded = any(r.rss_shown for r in body)
    heads = ("quantity", "value", "unit") + (("+/- RSS", "+/- worst") if banded else ())
    cells = [("  " + r.label, r.shown, r.unit) + ((r.rss_shown, r.worst_shown) if banded
                                                  else ()) for r in body]
    widths = [max(len(c[j]) for c in [heads, *cells]) for j in range(len(heads))]

    def line(c):
        out = [c[0].ljust(widths[0]), c[1].rjust(widths[1]), c[2].ljust(widths[2])]
        out += [x.rjust(w) for x, w in zip(c[3:], widths[3:])]
        return "  ".join(out).rstrip()

    head = [r for r in sheet.rows if r.section == "design"]
    lines = [sheet.title, "=" * len(sheet.title),
             "  ".join(f"{r.label} {r.shown}" for r in head[1:]) + f"  units {sheet.system}",
             "", line(heads), "  ".join("-" * w for w in widths)]
    last = None
    for r, c in zip(body, cells):
        if r.section != last:
            last = r.section
            lines.append(SECTION_TITLES.get(r.section, r.section))
        lines.append(line(c))
    lines.append("")
    for n in sheet.display_notes():
        lines += textwrap.wrap(n, 88, subsequent_indent="  ")
    lines += ["", "CAUTION"]
    for c in sheet.cautions:
        lines += textwrap.wrap(c, 88, initial_indent="  - ", subsequent_indent="    ")
    return "\n".join(lines) + "\n"


def to_csv(sheet: SpecSheet) -> str:
    """CSV for a CAD table: a header row, then one row per quantity (the shown text in
    the display unit), then the notes and cautions as rows of their own sections."""
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(CSV_HEADER)
    for r in sheet.rows:
        w.writerow((r.section, r.label, r.shown, r.unit, r.rss_shown, r.worst_shown, r.key))
    for t in sheet.tolerances:
        w.writerow(("tolerances", t, "", "", "", "", ""))
    for n in [sheet.units_note, *sheet.notes]:
        w.writerow(("notes", n, "", "", "", "", ""))
    for c in sheet.cautions:
        w.writerow(("cautions", c, "", "", "", "", ""))
    return buf.getvalue()


def to_json(sheet: SpecSheet) -> str:
    """One JSON object: SI values with the unit in each key, the bands in SI, the
    cautions; the display units are not applied."""
    from .. import __version__

    d = {"swingcalc_version": __version__, "command": "spec", "title": sheet.title,
         "units": "SI, the unit in each key (angles in rad, relative values as fractions)",
         "design": {"name": sheet.name, "revision": sheet.revision, "date": sheet.date,
                    "context": sheet.context},
         "values": {r.key: _plain(r.value) for r in sheet.rows},
         "bands": {r.key: {"rss": _plain(r.rss), "worst": _plain(r.worst)}
                   for r in sheet.rows if r.rss is not None},
         "rows": [{"key": r.key, "section": r.section, "label": r.label, "kind": r.kind}
                  for r in sheet.rows],
         "tolerances": list(sheet.tolerance_inputs),
         "notes": list(sheet.notes), "cautions": list(sheet.cautions)}
    return json.dumps(d, indent=2, allow_nan=False, ensure_ascii=False) + "\n"
