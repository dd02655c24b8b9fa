"""The ``plot`` command: a figure of a design file as PNG or SVG.

``register(app)`` adds the command to the one typer app (``cli/app.py`` calls it). The
command checks its options and the output file before anything is computed, calls
:func:`swingcalc.plots.design_figure` and writes the file atomically, never over an
existing one without --force.
"""

from __future__ import annotations

import math
import sys
from pathlib import Path
from typing import Annotated

import typer

from ..errors import MISSING, InvalidInput, suggest
from . import options as opt

__all__ = ["register"]

_FORMATS = {".png": "png", ".svg": "svg"}
_OUTPUT_ALLOWED = "a file ending in .png or .svg (or give --format png|svg)"


def _text(name: str, metavar: str, help_text: str):
    return typer.Option(name, metavar=metavar, help=help_text)


def _kind(text: str) -> str:
    from ..plots import KINDS  # here: the command line starts without the plot module

    word = text.strip().lower()
    if word not in KINDS:
        raise InvalidInput("KIND", text, ", ".join(KINDS), f"unknown plot{suggest(word, KINDS)}")
    return word


def _output(output: str | None, fmt: str | None, force: bool) -> tuple[Path, str]:
    """The output path and format (png or svg), checked before any computing."""
    from ..report.files import check_writable

    if output is None:
        raise InvalidInput("--output", MISSING, _OUTPUT_ALLOWED, "required (a plot is a file)")
    path = opt.output_path(output)
    if fmt is not None:
        word = fmt.strip().lower()
        if word not in _FORMATS.values():
            raise InvalidInput("--format", fmt, "png or svg",
                               f"unknown plot format{suggest(word, _FORMATS.values())}")
        named = _FORMATS.get(path.suffix.lower())
        if named is not None and named != word:
            raise InvalidInput("--format", fmt, f"{named}, as the --output name says, or a "
                               f"file name ending in .{word}",
                               f"the file name says {named}")
    else:
        word = _FORMATS.get(path.suffix.lower())
        if word is None:
            raise InvalidInput("--output", str(path), _OUTPUT_ALLOWED,
                               "cannot tell the format from the file name")
    check_writable(path, force)
    return path, word


def _angle(text: str, field: str) -> float:
    from ..quantity import parse_quantity

    return parse_quantity(text, "angle", field, minimum=0.0, maximum=math.pi,
                          include_max=False,
                          allowed="an amplitude in [0, 180) deg, e.g. '30 deg' (bare: deg)")


def register(app: typer.Typer) -> None:
    """Add the ``plot`` command to ``app``."""

    @app.command("plot")
    def plot(
        kind: Annotated[str, typer.Argument(
            metavar="KIND", help="period (period against amplitude), phase (phase "
            "portrait), loads (loads through the swing) or decay (simulated amplitude "
            "decay).", show_default=False)],
        design: Annotated[Path | None, typer.Argument(
            metavar="[DESIGN.toml]", help="Design file (TOML). Default: the bundled "
            "long-case clock.", show_default=False)] = None,
        amplitude: Annotated[str | None, _text(
            "--amplitude", "ANGLES", "Working amplitude(s) instead of the design's (bare: "
            "deg). loads: the largest is drawn; decay: the first is the start.")] = None,
        low: Annotated[str | None, _text(
            "--from", "ANGLE", "period: amplitude range from (default 0 deg).")] = None,
        high: Annotated[str | None, _text(
            "--to", "ANGLE", "period: amplitude range to (default 170 deg).")] = None,
        cycles: Annotated[str | None, _text(
            "--cycles", "N", "decay: complete cycles to simulate (default 100).")] = None,
        samples: Annotated[str | None, _text(
            "--samples", "N", "Points per curve (period, phase) or angles (loads), "
            "3-20001.")] = None,
        gravity: opt.Gravity = None,
        fmt: Annotated[str | None, _text(
            "--format", "FORMAT", "png or svg (default: from the --output suffix).")] = None,
        output: Annotated[str | None, typer.Option(
            "--output", "-o", metavar="FILE", help="The file to write (.png or .svg); "
            "required.")] = None,
        force: opt.Force = False,
    ) -> None:
        """A figure of a design as PNG or SVG: period against amplitude (exact, small-angle,
        series, tolerance band), the phase portrait (separatrix, orbits, the working orbit,
        a flexible suspension's slack region), the loads through the swing (with the safety
        cautions), or the decay of a simulated swing. Needs the plot extra (matplotlib)."""
        _run(kind, design, amplitude, low, high, cycles, samples, gravity, fmt, output, force)


def _run(kind, design, amplitude, low, high, cycles, samples, gravity, fmt, output, force):
    from . import app as a

    word = _kind(kind)
    path, file_format = _output(output, fmt, force)
    from ..plots import design_figure, figure_bytes, require_matplotlib

    require_matplotlib()
    for name, value, wanted in (("--from", low, "period"), ("--to", high, "period"),
                                ("--cycles", cycles, "decay")):
        if value is not None and word != wanted:
            raise InvalidInput(name, value, f"'{a.PROG} plot {wanted} ... {name} ...'",
                               f"applies to the {wanted} plot only")
    lo = _angle(low, "--from") if low is not None else None
    hi = _angle(high, "--to") if high is not None else None
    if (lo if lo is not None else 0.0) >= (hi if hi is not None else math.radians(170.0)):
        raise InvalidInput("--to" if high is not None else "--from", high or low,
                           "--from below --to (default range 0 to 170 deg)", "empty range")
    n_cycles = opt.count(cycles, "--cycles", 1, 100_000) if cycles is not None else 100
    # the phase portrait needs enough points per orbit to show its shape
    n = (opt.count(samples, "--samples", 21 if word == "phase" else 3, 20_001)
         if samples is not None else None)
    d = a._design(design, amplitude=amplitude, gravity=gravity)
    start = None
    if amplitude is not None:
        start = max(d.amplitudes_rad) if word == "loads" else d.amplitudes_rad[0]
        if word in ("loads", "decay") and start == 0.0:
            raise InvalidInput("--amplitude", amplitude, "an amplitude > 0, e.g. '10 deg'",
                               "nothing swings at 0")
    with a._options_named(**a._given(amplitude=(amplitude, "--amplitude"),
                                     gravity=(gravity, "--gravity"))):
        fig = design_figure(word, d, low=lo, high=hi, amplitude=start, cycles=n_cycles,
                            samples=n)
        data = figure_bytes(fig, file_format)
    from ..report.files import write_atomic

    write_atomic(path, data, force=force)
    sys.stderr.write(f"{a.PROG}: wrote the {word} plot ({file_format}) to {path}\n")
