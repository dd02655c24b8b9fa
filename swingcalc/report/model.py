"""Plain-data report objects: what a command found, before any formatting.

A :class:`Report` holds the inputs and summary as :class:`Item` rows and the results as
:class:`Table` objects. Values are SI floats (or text), keyed by a name that carries the
unit (``period_s``, ``amplitude_rad``, ``peak_tension_N``, ``period_error_rel`` for a
relative value). Each row and column also says how to show the value to a person
(scale, unit, number format), which only the text formats use.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

__all__ = ["Item", "Column", "Table", "Report", "amplitude_text", "show_value"]

# From here up a fixed-point format shows digits that mean nothing (3.2e25 as 26 digits).
_FIXED_LIMIT = 1e9


def show_value(value, scale: float = 1.0, fmt=".6g", unit: str = "",
               missing: str = "-") -> str:
    """Text for one value: ``value * scale`` in ``fmt``, then the unit.

    ``fmt`` is a format spec or a function of the scaled value that returns its text. A
    fixed-point spec (``".6f"``) gives way to 7 significant digits from 1e9 up, where it
    would print a long run of meaningless digits; a trailing '.' left by a ``#`` spec
    ("1478.") is dropped.
    """
    if value is None:
        return missing
    if isinstance(value, bool):
        return "yes" if value else "no"
    if isinstance(value, (list, tuple)):
        shown = ", ".join(show_value(v, scale, fmt, "", missing) for v in value)
        return f"{shown} {unit}".rstrip() if unit else shown
    if isinstance(value, str):
        return value
    v = float(value) * scale
    if math.isinf(v):
        text = "inf" if v > 0 else "-inf"
    elif math.isnan(v):
        return missing
    elif callable(fmt):
        text = fmt(v)
    else:
        if fmt[-1:] in ("f", "F") and abs(v) >= _FIXED_LIMIT:
            fmt = "#.7g"
        text = format(v, fmt)
        text = text[:-1] if text.endswith(".") else text.replace(".e", "e")
        if text.startswith("-") and float(text) == 0.0:     # no "-0" or "-0.000"
            text = text[1:]
    return f"{text} {unit}".rstrip() if unit else text


def amplitude_text(degrees: float, digits: int = 10) -> str:
    """An amplitude [deg] with up to ``digits`` significant digits, trailing zeros dropped;
    more digits when that would round it up to 180 (which is not an amplitude)."""
    for digits in range(digits, 18):
        text = format(degrees, f".{digits}g")
        if float(text) < 180.0 or degrees >= 180.0:
            return text
    return repr(degrees)


@dataclass(frozen=True)
class Item:
    """One named value: an input or a summary figure."""

    key: str
    label: str
    value: object
    unit: str = ""          # display unit
    scale: float = 1.0      # SI value * scale = display value
    fmt: object = ".6g"     # format spec, or a function of the display value
    missing: str = "-"      # shown for a value of None (JSON has null)

    @property
    def shown(self) -> str:
        return show_value(self.value, self.scale, self.fmt,
                          "" if self.value is None else self.unit, self.missing)


@dataclass(frozen=True)
class Column:
    """One column of a table: the data key (unit in the name) and how to show it."""

    key: str
    label: str
    unit: str = ""
    scale: float = 1.0
    fmt: object = ".6g"     # format spec, or a function of the display value
    in_text: bool = True    # shown in terminal/plain-text/markdown tables
    missing: str = "-"

    def show(self, value) -> str:
        return show_value(value, self.scale, self.fmt, "", self.missing)

    @property
    def heading(self) -> str:
        return f"{self.label} [{self.unit}]" if self.unit else self.label


@dataclass(frozen=True)
class Table:
    """Rows of values, one per case (e.g. per amplitude).

    ``transpose`` asks text formats to show one column per case and one row per
    quantity (easier to read when there are many quantities and few cases).
    """

    name: str
    title: str
    columns: tuple
    rows: tuple
    transpose: bool = False

    def records(self) -> list[dict]:
        keys = [c.key for c in self.columns]
        return [dict(zip(keys, row)) for row in self.rows]

    def text_grid(self) -> tuple[list[str], list[list[str]]]:
        """(headings, rows of cell text) for the text formats, transposed if asked."""
        cols = [c for c in self.columns if c.in_text]
        idx = [self.columns.index(c) for c in cols]
        cells = [[c.show(row[i]) for c, i in zip(cols, idx)] for row in self.rows]
        if not self.transpose:
            return [c.heading for c in cols], cells
        first, rest = cols[0], cols[1:]
        heads = [first.label, "unit"] + [f"{r[0]} {first.unit}".strip() for r in cells]
        body = [[c.label, c.unit] + [r[j + 1] for r in cells] for j, c in enumerate(rest)]
        return heads, body


@dataclass
class Report:
    """Everything one command run reports.

    ``cautions`` are safety texts that every format carries; ``warnings`` are about these
    particular numbers (slack, compression, near the separatrix); ``notes`` are
    neutral remarks such as a verdict.
    """

    command: str
    title: str
    inputs: list = field(default_factory=list)
    summary: list = field(default_factory=list)
    tables: list = field(default_factory=list)
    notes: list = field(default_factory=list)
    warnings: list = field(default_factory=list)
    cautions: list = field(default_factory=list)
    extra: dict = field(default_factory=dict)   # further JSON members (e.g. a verdict)

    def to_dict(self) -> dict:
        """One JSON-ready object: SI values, the unit in every key name."""
        from .. import __version__

        d = {"swingcalc_version": __version__, "command": self.command, "title": self.title,
             "inputs": {i.key: _plain(i.value) for i in self.inputs},
             "summary": {i.key: _plain(i.value) for i in self.summary},
             "tables": {t.name: [{k: _plain(v) for k, v in r.items()} for r in t.records()]
                        for t in self.tables}}
        d.update({k: _plain(v) for k, v in self.extra.items()})
        d["notes"] = list(self.notes)
        d["warnings"] = list(self.warnings)
        d["cautions"] = list(self.cautions)
        return d


def _plain(value):
    """JSON has no inf/NaN: they become null (the text formats say 'inf'); -0.0 is 0.0."""
    if isinstance(value, bool):
        return value
    if isinstance(value, float):
        return float(value) + 0.0 if math.isfinite(value) else None
    if isinstance(value, (list, tuple)):
        return [_plain(v) for v in value]
    if isinstance(value, dict):
        return {k: _plain(v) for k, v in value.items()}
    return value
