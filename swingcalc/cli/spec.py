"""The ``spec`` command: a design file's spec sheet for drawings, as a terminal table,
CSV (for a CAD table), JSON (SI), Markdown, or a vector table in SVG or PDF."""

from __future__ import annotations

import sys
from typing import Annotated

import typer

from ..errors import MISSING, InvalidInput
from . import options as opt
from .designs import DesignArg

__all__ = ["register"]

#: The vector formats this command writes besides the text ones, with their file suffix.
VECTOR_SUFFIXES = {"svg": ".svg", "pdf": ".pdf"}

Units = Annotated[str, typer.Option(
    "--units", metavar="SYSTEM",
    help="Units shown: si, si-mm (lengths in mm, inertia in kg mm^2) or inch-pound "
         "(in, lb, lbf, ft lbf, ft/s). Display only: JSON stays SI.")]
SpecFormat = Annotated[str | None, typer.Option(
    "--format", metavar="FORMAT",
    help="table, csv, json, markdown, svg or pdf (svg and pdf need --output and the plot "
         "extra; default: table, or from the --output suffix).")]


def _write(sheet, kind: str, path, force: bool) -> None:
    from ..report.spec import sheet_report, to_csv, to_json, to_text

    if kind in VECTOR_SUFFIXES:
        from ..report.spec_drawing import render_vector

        data = render_vector(sheet, kind)
    elif kind == "csv":
        data = to_csv(sheet)
    elif kind == "json":
        data = to_json(sheet)
    elif kind == "markdown":
        from ..report.formats import to_markdown

        data = to_markdown(sheet_report(sheet))
    elif path is None:
        _print(sheet)
        return
    else:
        data = to_text(sheet)
    if path is None:
        sys.stdout.write(data)
        return
    from ..report.files import write_atomic
    from .app import PROG

    write_atomic(path, data, force=force)
    sys.stderr.write(f"{PROG}: wrote {kind} spec sheet to {path}\n")


def _print(sheet) -> None:
    """The sheet on the terminal: one rich table, section heads as rows of their own,
    labels folding when the screen is narrow (values and units never do)."""
    from rich import box
    from rich.table import Table
    from rich.text import Text

    from ..report.spec import SECTION_TITLES
    from .render import _console

    console = _console()
    console.print(Text(sheet.title, style="bold"))
    head = [r for r in sheet.rows if r.section == "design"]
    console.print(Text("  ".join(f"{r.label} {r.shown}" for r in head[1:])
                       + f"  units {sheet.system}"))
    table = Table(box=box.SIMPLE_HEAD, pad_edge=False)
    table.add_column("quantity", overflow="fold")
    table.add_column("value", justify="right", no_wrap=True)
    table.add_column("unit", no_wrap=True)
    banded = any(r.rss_shown for r in sheet.rows)      # no bands: no empty columns
    if banded:
        table.add_column("+/- RSS", justify="right", no_wrap=True)
        table.add_column("+/- worst", justify="right", no_wrap=True)
    last = None
    for r in sheet.rows:
        if r.section == "design":
            continue
        if r.section != last:
            last = r.section
            table.add_row(Text(SECTION_TITLES.get(r.section, r.section), style="bold"))
        cells = ("  " + r.label, r.shown, r.unit, r.rss_shown, r.worst_shown)
        table.add_row(*cells[:5 if banded else 3])
    console.print(table)
    for n in sheet.display_notes():
        console.print(Text(n, style="dim"))
    console.print()
    grid = Table(title="CAUTION", title_justify="left", title_style="bold red", box=None,
                 show_header=False, pad_edge=False, padding=(0, 1, 0, 0))
    grid.add_column(no_wrap=True)
    grid.add_column(overflow="fold")
    for c in sheet.cautions:
        grid.add_row("  -", c)
    console.print(grid)


def register(app: typer.Typer) -> None:
    """Add the ``spec`` command to ``app``."""

    @app.command("spec")
    def spec(design: DesignArg = None, units: Units = "si", amplitude: opt.Amplitude = None,
             gravity: opt.Gravity = None, fmt: SpecFormat = None, output: opt.Output = None,
             force: opt.Force = False) -> None:
        """Spec sheet for drawings: design name, revision and date; mass properties;
        period and beat rate at zero and each working amplitude, small-angle error; peak
        speeds, loads and felt accelerations; over-the-top and slack margins; impact
        energies; a clock's rates and rating adjustment; +/- bands from the design's
        [tolerances]; the safety cautions at its foot."""
        from ..report.units import unit_system
        from . import app as a

        system = unit_system(units)
        path = opt.output_path(output)
        kind = opt.output_format(fmt, path, extra=VECTOR_SUFFIXES)
        if kind in VECTOR_SUFFIXES:
            if path is None:
                raise InvalidInput("--output", MISSING, f"a file, e.g. 'sheet.{kind}'",
                                   f"required with --format {kind}: a vector drawing is "
                                   "written to a file, not to the screen")
            from ..report.spec_drawing import require_matplotlib

            require_matplotlib(kind)
        if path is not None:
            from ..report.files import check_writable

            check_writable(path, force)
        d = a._design(design, amplitude=amplitude, gravity=gravity)
        from ..report.spec import spec_sheet

        with a._options_named(**a._given(gravity=(gravity, "--gravity"),
                                         amplitude=(amplitude, "--amplitude"))):
            sheet = spec_sheet(d, system)
        _write(sheet, kind, path, force)
