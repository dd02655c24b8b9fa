"""The ``swingcalc`` command: one typer app; each command parses, calls a report builder
(which calls the library) and renders. Errors become one line on stderr and an exit code:
2 for bad input, 1 for an internal failure; never a traceback."""

from __future__ import annotations

import os
import sys
from contextlib import contextmanager
from pathlib import Path
from typing import Annotated, Optional

import typer
from typer.core import TyperGroup

from ..errors import MISSING, InvalidInput, SwingcalcError
from . import options as opt

__all__ = ["app", "main"]

PROG = "swingcalc"


def _fail(message: str, code: int) -> int:
    sys.stderr.write(f"{PROG}: {' '.join(str(message).split())}\n")
    sys.stderr.flush()
    return code


class _Group(TyperGroup):
    """Maps errors to one line on stderr and an exit status, for the real command and for
    test runners alike."""

    def main(self, args=None, prog_name=None, complete_var=None, standalone_mode=True,
             **extra):
        # typer 0.27-0.28 (the pinned range) vendor click as typer._click and re-export no
        # UsageError, so the vendored exceptions are the ones the parser raises.
        from typer._click.exceptions import ClickException, UsageError

        try:
            rv = super().main(args=args, prog_name=prog_name or PROG,
                              complete_var=complete_var, standalone_mode=False, **extra)
            code = rv if isinstance(rv, int) else 0
        except InvalidInput as exc:
            code = _fail(exc, 2)
        except SwingcalcError as exc:
            code = _fail(f"internal failure: {exc}", 1)
        except UsageError as exc:
            code = _fail(f"{exc.format_message()} (see '{self._command_path(exc, args)} "
                         "--help')", 2)
        except ClickException as exc:
            code = _fail(exc.format_message(), exc.exit_code)
        except typer.Abort:
            code = _fail("aborted", 1)
        except BrokenPipeError:
            # The reader went away (e.g. `| head`): stop quietly, as other tools do.
            devnull = os.open(os.devnull, os.O_WRONLY)
            os.dup2(devnull, sys.stdout.fileno())
            code = 1
        if standalone_mode:
            sys.exit(code)
        return code

    def _command_path(self, exc, args) -> str:
        """The command a usage error is about: a missing option value comes without one."""
        if exc.ctx is not None:
            return exc.ctx.command_path
        words = sys.argv[1:] if args is None else list(args)
        if words and words[0] in self.commands:
            return f"{PROG} {words[0]}"
        return PROG


app = typer.Typer(
    name=PROG, cls=_Group, pretty_exceptions_enable=False, no_args_is_help=False,
    add_completion=False, rich_markup_mode=None,
    context_settings={"help_option_names": ["-h", "--help"]},
    help="Pendulum and swinging-part design calculations: exact period at the real "
         "amplitude, small-angle check, speeds, tensions and energies, with safety cautions. "
         "Run with no command for the bundled example design.")


def _emit(report, kind: str, output: Path | None, force: bool) -> None:
    """Render the report to the screen or to a file (atomically, no overwrite without --force)."""
    from ..report.formats import render

    if output is not None:
        from ..report.files import write_atomic

        write_atomic(output, render(report, kind), force=force)
        sys.stderr.write(f"{PROG}: wrote {kind} report to {output}\n")
        return
    if kind == "table":
        from .render import print_report

        print_report(report)
    else:
        sys.stdout.write(render(report, kind))


def _precheck(fmt, output, force) -> tuple[str, Path | None]:
    """Catch a bad --format or --output before computing anything: (format, output path)."""
    path = opt.output_path(output)
    kind = opt.output_format(fmt, path)
    if path is not None:
        from ..report.files import check_writable

        check_writable(path, force)
    return kind, path


@contextmanager
def _options_named(**given):
    """Report a library error about ``length`` etc. against the option that gave it.

    ``given`` maps library field names to option names, for the options actually given
    (a value from a design file keeps the library's field name)."""
    try:
        yield
    except InvalidInput as exc:
        if exc.field in given:
            raise exc.renamed(given[exc.field]) from None
        raise


def _design(design: Path | None, length=None, mass=None, suspension=None, amplitude=None,
            gravity=None):
    """The design to run: the file, or the bundled default, with the options applied.

    --length, --mass and --suspension describe a point bob: without a file they make a
    plain design (1 kg, 10 deg, rigid, standard gravity); with a file they apply only to a
    ``[pendulum]`` (point bob) design."""
    import dataclasses

    from ..designfile import load_design, parse_design, point_design

    body_options = _given(length=(length, "--length"), mass=(mass, "--mass"),
                          suspension=(suspension, "--suspension"))
    if design is not None:
        d = load_design(design)
    elif not body_options:
        from .. import examples

        d = parse_design(examples.text(), f"bundled example {examples.DEFAULT}")
    else:
        if length is None:
            raise InvalidInput("--length", MISSING, "a length such as '994 mm' (or a design file)",
                               "required with --mass or --suspension when no design file is "
                               "given")
        d = point_design(opt.length(length))
    if body_options:
        if not d.shorthand:
            option = next(iter(body_options.values()))
            raise InvalidInput(option, MISSING, "a design file with a [pendulum] section, or "
                               "no design file", "applies to a point bob; this design is built "
                               "from parts (edit the file instead)")
        bob = d.parts[0]
        L = opt.length(length) if length is not None else bob.position
        m = opt.mass(mass) if mass is not None else bob.mass
        kind = (opt.suspension(suspension) if suspension is not None
                else "rigid" if not d.suspension.flexible else "flexible")
        from ..body import point_bob

        parts, susp = point_bob(L, m, kind)
        d = dataclasses.replace(d, parts=parts, suspension=susp)
    amps = tuple(opt.amplitudes(amplitude)) if amplitude is not None else None
    g, given = opt.gravity(gravity) if gravity is not None else (None, "")
    return d.with_changes(amplitudes=amps, gravity=g, gravity_given=given)


DesignArg = Annotated[Optional[Path], typer.Argument(
    metavar="DESIGN.toml", help="Design file (TOML). Default: the bundled long-case clock.",
    show_default=False)]


def _show_version(value: bool) -> None:
    if value:
        from .. import __version__

        sys.stdout.write(f"{PROG} {__version__}\n")
        raise typer.Exit()


@app.callback(invoke_without_command=True)
def _root(ctx: typer.Context,
          version: Annotated[bool, typer.Option(
              "--version", callback=_show_version, is_eager=True,
              help="Print the version and exit.")] = False,
          fmt: opt.Format = None, output: opt.Output = None, force: opt.Force = False) -> None:
    """Pendulum design calculations. With no command: `pendulum` on the bundled example
    (--format, --output and --force apply to it)."""
    if ctx.invoked_subcommand is None:
        _pendulum(None, None, None, None, None, None, fmt, output, force)
    elif fmt is not None or output is not None or force:
        given = "--format" if fmt is not None else "--output" if output is not None else "--force"
        raise InvalidInput(given, MISSING,
                           f"the option after the command, e.g. "
                           f"'{PROG} {ctx.invoked_subcommand} {given} ...'",
                           "given before the command")


@app.command("pendulum")
def pendulum(design: DesignArg = None, length: opt.Length = None, amplitude: opt.Amplitude = None,
             mass: opt.Mass = None, suspension: opt.Suspension = None,
             gravity: opt.Gravity = None, fmt: opt.Format = None, output: opt.Output = None,
             force: opt.Force = False) -> None:
    """Pendulum summary at each working amplitude: period, beat, rate, peak speeds and
    loads, energy, over-the-top and slack limits, with warnings and safety cautions.

    --amplitude and --gravity override the design file; --length, --mass and --suspension
    apply to a point-bob ([pendulum]) design. Without a file: the bundled example, or,
    given --length/--mass/--suspension, a point bob (1 kg, 10 deg, rigid, standard gravity).
    """
    _pendulum(design, length, amplitude, mass, suspension, gravity, fmt, output, force)


def _pendulum(design, length, amplitude, mass, suspension, gravity, fmt, output, force):
    from ..report.design import design_report

    kind, path = _precheck(fmt, output, force)
    d = _design(design, length, mass, suspension, amplitude, gravity)
    with _options_named(**_given(length=(length, "--length"), mass=(mass, "--mass"),
                                 gravity=(gravity, "--gravity"),
                                 amplitude=(amplitude, "--amplitude"))):
        report = design_report(d)
    _emit(report, kind, path, force)


def _given(**pairs) -> dict:
    """{library field: option} for the options given (value not None)."""
    return {name: option for name, (value, option) in pairs.items() if value is not None}


@app.command("periods")
def periods(amplitude: Annotated[str, typer.Option(
                "--amplitude", metavar="ANGLES",
                help="Amplitudes: a range '0:90:10', a list '5, 10, 20' or one value "
                     "(bare: deg).")] = "0:90:10",
            length: opt.Length = None, gravity: opt.Gravity = None,
            fmt: opt.Format = None, output: opt.Output = None, force: opt.Force = False) -> None:
    """Period against amplitude: exact T/T0 and T, the small-angle period and its error,
    the 2-, 3- and 4-term series and rigorous bounds. Default length 1 m."""
    from ..report.builders import periods_report

    kind, path = _precheck(fmt, output, force)
    amps = opt.amplitudes(amplitude)
    L = opt.length(length) if length is not None else 1.0
    g, given = opt.gravity(gravity)
    with _options_named(**_given(length=(length, "--length"), gravity=(gravity, "--gravity"),
                                 amplitude=(amplitude, "--amplitude"))):
        report = periods_report(amps, L, g, given)
    _emit(report, kind, path, force)


@app.command("small-angle")
def small_angle(amplitude: Annotated[str, typer.Option(
                    "--amplitude", metavar="ANGLES",
                    help="Working amplitude(s): '15', '2, 5, 10' or a range (bare: deg).")]
                = "2, 5, 10, 15, 20, 30",
                tolerance: opt.Tolerance = "0.1 %", cycles: opt.Cycles = "100",
                fmt: opt.Format = None, output: opt.Output = None,
                force: opt.Force = False) -> None:
    """Is the small-angle model good enough? Errors in period, series, peak speed and
    tension, phase lead after N cycles, clock rate, the largest amplitude within the
    tolerance, and a verdict."""
    from ..report.builders import small_angle_report

    kind, path = _precheck(fmt, output, force)
    amps = opt.amplitudes(amplitude)
    tol = opt.tolerance(tolerance)
    n = opt.cycles(cycles)
    with _options_named(amplitude="--amplitude", tolerance="--tolerance", cycles="--cycles"):
        report = small_angle_report(amps, tol, n)
    _emit(report, kind, path, force)


@app.command("motion")
def motion(angle: Annotated[str, typer.Option(
               "--angle", metavar="ANGLE", help="Start angle from the downward vertical "
               "(bare: deg).")] = "0",
           angular_speed: Annotated[Optional[str], typer.Option(
               "--angular-speed", metavar="RATE",
               help="Start angular speed, e.g. '1.2 rad/s', '90 deg/s' (bare: rad/s).")] = None,
           bottom_speed: Annotated[Optional[str], typer.Option(
               "--bottom-speed", metavar="SPEED",
               help="Instead: start at the bottom with this bob speed, e.g. '6 m/s'.")] = None,
           length: opt.Length = None, gravity: opt.Gravity = None,
           duration: Annotated[Optional[str], typer.Option(
               "--duration", metavar="TIME",
               help="Tabulate the exact time history over this time, e.g. '4 s'.")] = None,
           step: Annotated[Optional[str], typer.Option(
               "--step", metavar="TIME", help="Time step of the history (default: duration/40).")]
           = None,
           fmt: opt.Format = None, output: opt.Output = None, force: opt.Force = False) -> None:
    """Classify a start state (libration, rotation, separatrix, rest, balanced) and
    optionally tabulate its exact time history."""
    from ..quantity import parse_quantity
    from ..report.builders import motion_report

    kind, path = _precheck(fmt, output, force)
    L = opt.length(length) if length is not None else 1.0
    g, _ = opt.gravity(gravity)
    theta = parse_quantity(angle, "angle", "--angle",
                           allowed="a finite angle, e.g. '30 deg', '0.5 rad' (bare: deg)")
    if angular_speed is not None and bottom_speed is not None:
        raise InvalidInput("--bottom-speed", bottom_speed,
                           "either --angular-speed or --bottom-speed", "give only one of them")
    omega = v = None
    if angular_speed is not None:
        omega = parse_quantity(angular_speed, "angular_velocity", "--angular-speed")
    if bottom_speed is not None:
        if theta != 0.0:
            raise InvalidInput("--angle", angle, "0 (or leave it out) with --bottom-speed",
                               "--bottom-speed starts the swing at the bottom")
        v = parse_quantity(bottom_speed, "speed", "--bottom-speed")
    T = opt.positive_time(duration, "--duration") if duration is not None else None
    dt = opt.positive_time(step, "--step") if step is not None else None
    if dt is not None and T is None:
        raise InvalidInput("--duration", MISSING, "a time, e.g. '4 s', with --step",
                           "--step needs --duration")
    names = _given(angle=(angle, "--angle"), length=(length, "--length"),
                   gravity=(gravity, "--gravity"), duration=(duration, "--duration"),
                   step=(step, "--step"), bottom_speed=(bottom_speed, "--bottom-speed"),
                   angular_velocity=(angular_speed or bottom_speed,
                                     "--angular-speed" if angular_speed else "--bottom-speed"))
    with _options_named(**names):
        report = motion_report(theta, omega, L, g, bottom_speed=v, duration=T, step=dt)
    _emit(report, kind, path, force)


from . import designs as _designs  # noqa: E402 - registers the design commands on the app
from .simulate import register as _register_simulate  # noqa: E402 - the simulate command
from .plot import register as _register_plot  # noqa: E402 - the plot command
from .spec import register as _register_spec  # noqa: E402 - the spec command
from .tolerance import register as _register_tolerance  # noqa: E402 - the tolerance command

_designs.register(app)
_register_simulate(app)
_register_spec(app)
_register_tolerance(app)
_register_plot(app)


def main(argv=None) -> None:
    """Console-script entry point."""
    try:
        app(args=argv, prog_name=PROG)
    except SystemExit:
        raise
    except (InvalidInput, SwingcalcError) as exc:  # raised outside a command (defensive)
        sys.exit(_fail(exc, 2 if isinstance(exc, InvalidInput) else 1))
    except KeyboardInterrupt:
        sys.exit(_fail("interrupted", 130))
    except Exception as exc:  # noqa: BLE001 - last resort: never show a traceback
        sys.exit(_fail(f"internal error ({type(exc).__name__}: {exc}); please report it", 1))


if __name__ == "__main__":  # pragma: no cover
    main()
