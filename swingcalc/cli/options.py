"""Shared command-line options: their declarations and the parsers that turn them into SI.

Every option arrives as text and is parsed here (not by the option framework), so that a
bad value gives one line naming the option, what was wrong and what is allowed.
"""

from __future__ import annotations

import math
from pathlib import Path
from typing import Annotated, Optional

import typer

from ..designfile import parse_gravity
from ..errors import InvalidInput
from ..pendulum import SUSPENSIONS
from ..quantity import parse_quantity, parse_values, split_magnitude, suggest
from ..report.formats import FORMATS

__all__ = [
    "Amplitude", "Cycles", "Force", "Format", "Gravity", "Length", "Mass", "Output",
    "Suspension", "Tolerance", "amplitudes", "cycles", "gravity", "length", "mass",
    "output_format", "output_path", "positive_time", "suspension", "tolerance",
]

_SUFFIX_FORMATS = {".csv": "csv", ".json": "json", ".md": "markdown", ".markdown": "markdown",
                   ".txt": "table", ".text": "table"}
_AMPLITUDE_ALLOWED = ("libration amplitudes in [0, 180) deg: one value, a list '10, 20, 30' "
                      "or a range '0:90:10' (bare numbers in deg; units such as '0.5 rad')")

# Option declarations, shared by the commands (all text; parsed by the functions below).
Length = Annotated[Optional[str], typer.Option(
    "--length", metavar="LENGTH", help="Pivot to bob centre, e.g. '994 mm', '2.5 ft' (bare: m).")]
Amplitude = Annotated[Optional[str], typer.Option(
    "--amplitude", metavar="ANGLES",
    help="Amplitude(s): '15', '10, 20, 30', a range '0:90:10' or with a unit '0:1:0.1 rad' "
         "(bare: deg).")]
Gravity = Annotated[Optional[str], typer.Option(
    "--gravity", metavar="ACCEL",
    help="'standard' (9.80665 m/s^2) or an acceleration, e.g. '9.8123 m/s^2' (bare: m/s^2).")]
Mass = Annotated[Optional[str], typer.Option(
    "--mass", metavar="MASS", help="Bob mass, e.g. '1.2 kg', '25 lb' (bare: kg).")]
Suspension = Annotated[Optional[str], typer.Option(
    "--suspension", metavar="KIND",
    help="'rigid' (light rod) or 'flexible' (chain, rope, cable: tension only).")]
Tolerance = Annotated[str, typer.Option(
    "--tolerance", metavar="FRACTION",
    help="Accepted relative period error, e.g. '0.1 %' or 0.001.")]
Cycles = Annotated[str, typer.Option(
    "--cycles", metavar="N", help="Number of periods for the accumulated phase error.")]
Format = Annotated[Optional[str], typer.Option(
    "--format", metavar="FORMAT",
    help="table, csv, json or markdown (default: table, or from the --output suffix).")]
# Text, not a Path: the option framework would turn '' into '.', a folder.
Output = Annotated[Optional[str], typer.Option(
    "--output", "-o", metavar="FILE", help="Write to FILE (atomically) instead of the screen.")]
Force = Annotated[bool, typer.Option("--force", help="Replace an existing --output file.")]


def length(text: str, field: str = "--length") -> float:
    return parse_quantity(text, "length", field, minimum=0.0, include_min=False,
                          allowed="a length > 0, e.g. '994 mm', '2.5 ft' or a bare number in m")


def mass(text: str, field: str = "--mass") -> float:
    return parse_quantity(text, "mass", field, minimum=0.0, include_min=False,
                          allowed="a mass > 0, e.g. '1.2 kg', '25 lb' or a bare number in kg")


def gravity(text: str | None, field: str = "--gravity") -> tuple[float, str]:
    """(gravity [m/s^2], how it was given); None or 'standard' is standard gravity."""
    return parse_gravity(text, field)


def amplitudes(text: str, field: str = "--amplitude") -> list[float]:
    return parse_values(text, "angle", field, minimum=0.0, maximum=math.pi, include_max=False,
                        allowed=_AMPLITUDE_ALLOWED)


def suspension(text: str, field: str = "--suspension") -> str:
    word = text.strip().lower()
    if word not in SUSPENSIONS:
        raise InvalidInput(field, text, " or ".join(SUSPENSIONS),
                           f"unknown suspension{suggest(word, SUSPENSIONS)}")
    return word


def tolerance(text: str, field: str = "--tolerance") -> float:
    from ..linear import max_period_error_tolerance

    top = max_period_error_tolerance()
    return parse_quantity(text, "fraction", field, minimum=0.0, maximum=top, include_min=False,
                          include_max=True,
                          allowed=f"a relative error in (0, {top:.6g}], e.g. '0.1 %', "
                                  "'500 ppm' or 0.001")


def cycles(text: str, field: str = "--cycles") -> float:
    allowed = "a number of periods >= 0, e.g. 100"
    value, unit = split_magnitude(text, field, allowed)
    if unit:
        raise InvalidInput(field, text, allowed, "a count takes no unit")
    if value < 0.0:
        raise InvalidInput(field, text, allowed, "out of range")
    return value


def count(text: str, field: str, low: int, high: int) -> int:
    """A whole number in [low, high]."""
    allowed = f"a whole number in [{low}, {high}]"
    value, unit = split_magnitude(text, field, allowed)
    if unit or value != int(value):
        raise InvalidInput(field, text, allowed, "not a whole number")
    if not low <= value <= high:
        raise InvalidInput(field, text, allowed, "out of range")
    return int(value)


def limit_value(text: str, kind: str, field: str = "--max") -> float:
    """A limit > 0 of the given kind; kind "g" takes '2.5 g', '2.5' or an acceleration."""
    if kind != "g":
        return parse_quantity(text, kind, field, minimum=0.0, include_min=False)
    from ..constants import STANDARD_GRAVITY

    allowed = "a felt acceleration > 0 in g, e.g. '2.5 g', 2.5 or '25 m/s^2'"
    value, unit = split_magnitude(text, field, allowed)
    if unit in ("", "g", "g0", "gn"):
        out = value
    else:
        out = parse_quantity(text, "acceleration", field, allowed=allowed) / STANDARD_GRAVITY
    if not out > 0.0:
        raise InvalidInput(field, text, allowed, "out of range")
    return out


def positive_time(text: str, field: str) -> float:
    return parse_quantity(text, "time", field, minimum=0.0, include_min=False,
                          allowed="a time > 0, e.g. '10 s', '2 min' or a bare number in s")


def output_path(text: str | None, field: str = "--output") -> Path | None:
    """The --output path; an empty one is refused here (as a Path it would be '.')."""
    if text is None:
        return None
    if not text.strip():
        raise InvalidInput(field, text, "an output file path, e.g. 'report.csv'", "empty value")
    return Path(text)


def output_format(fmt: str | None, output: Path | None, extra: dict | None = None) -> str:
    """The format to write: --format if given, else from the --output suffix, else table.

    ``extra`` maps further format names a command writes to their file suffix (the spec
    sheet's ``{"svg": ".svg", "pdf": ".pdf"}``); the other commands take the text formats
    only."""
    extra = extra or {}
    formats = FORMATS + tuple(extra)
    suffixes = {**_SUFFIX_FORMATS, **{suffix: name for name, suffix in extra.items()}}
    if fmt is not None:
        word = fmt.strip().lower()
        if word == "md":
            word = "markdown"
        if word not in formats:
            raise InvalidInput("--format", fmt, ", ".join(formats),
                               f"unknown format{suggest(word, formats)}")
        named = None if output is None else suffixes.get(output.suffix.lower())
        if named not in (None, "table", word):
            # CSV in a file called .svg is a mistake (a .txt file takes any text format)
            raise InvalidInput("--format", fmt, f"{named}, as the --output name says, or "
                               "another file name", f"the file name says {named}")
        return word
    if output is None:
        return "table"
    suffix = output.suffix.lower()
    if suffix not in suffixes:
        shown = [".csv", ".json", ".md", ".txt", *extra.values()]
        ends = ", ".join(shown[:-1]) + " or " + shown[-1]
        raise InvalidInput("--output", str(output),
                           f"a file ending in {ends}, or give --format",
                           "cannot tell the format from the file name")
    return suffixes[suffix]
