"""Commands on a design file: the body, the loads through the swing, and the sizing
results. Each parses its options, calls one report builder and renders it."""

from __future__ import annotations

from pathlib import Path
from typing import Annotated, Optional

import typer

from ..errors import MISSING, InvalidInput
from . import options as opt

__all__ = ["register"]

DesignArg = Annotated[Optional[Path], typer.Argument(
    metavar="DESIGN.toml", help="Design file (TOML). Default: the bundled long-case clock.",
    show_default=False)]
OneAmplitude = Annotated[Optional[str], typer.Option(
    "--amplitude", metavar="ANGLE",
    help="One amplitude, e.g. '45 deg' (bare: deg). Default: from the design file.")]
Part = Annotated[Optional[str], typer.Option(
    "--part", metavar="NAMES", help="The part to move, or parts moved together: 'bob, "
    "rating nut' (default: the design's [rating] parts).")]

# What each limited quantity is measured in, for parsing --max.
_LIMIT_KINDS = {"reaction_N": "force", "arm_tension_N": "force",
                "angular_speed_rad_s": "angular_velocity",
                "angular_acceleration_rad_s2": "angular_acceleration",
                "speed_m_s": "speed", "felt_g": "g", "felt_normal_g": "g",
                "felt_tangential_g": "g"}


def _app():
    from . import app as a

    return a


def _run(design, fmt, output, force, build, amplitude=None, gravity=None):
    """The common path: check the output, load the design, build, render."""
    a = _app()
    kind, path = a._precheck(fmt, output, force)
    d = a._design(design, amplitude=amplitude, gravity=gravity)
    report = build(d)
    a._emit(report, kind, path, force)


def _one_amplitude(text: str | None) -> float | None:
    if text is None:
        return None
    values = opt.amplitudes(text)
    if len(values) != 1:
        raise InvalidInput("--amplitude", text, "one amplitude, e.g. '45 deg'",
                           "more than one value")
    return values[0]


def register(app: typer.Typer) -> None:
    """Add the design commands to ``app``."""

    @app.command("body")
    def body(design: DesignArg = None, gravity: opt.Gravity = None, fmt: opt.Format = None,
             output: opt.Output = None, force: opt.Force = False) -> None:
        """The body: each part's mass, place and inertia; mass, centre of mass, inertia
        about the pivot, radius of gyration, equivalent length, centre of percussion; the
        air's buoyancy and added mass; the rate change with temperature."""
        from ..report.design import body_report

        _run(design, fmt, output, force, body_report, gravity=gravity)

    @app.command("loads")
    def loads(design: DesignArg = None, amplitude: OneAmplitude = None,
              samples: Annotated[str, typer.Option(
                  "--samples", metavar="N", help="Angles over the swing, -A..A (3-100001).")]
              = "37",
              gravity: opt.Gravity = None, fmt: opt.Format = None, output: opt.Output = None,
              force: opt.Force = False) -> None:
        """Speeds, accelerations, pivot load, suspension tension, felt accelerations at the
        design's named points and energies through one swing, with the peaks and where
        they occur (default amplitude: the design's largest)."""
        from ..report.design import loads_report

        a = _one_amplitude(amplitude)
        n = opt.count(samples, "--samples", low=3, high=100_001)
        _run(design, fmt, output, force, lambda d: loads_report(d, a, n), gravity=gravity)

    @app.command("tune")
    def tune(design: DesignArg = None,
             period: Annotated[Optional[str], typer.Option(
                 "--period", metavar="TIME",
                 help="Target period, e.g. '2 s' (default: the design's target_period).")]
             = None,
             amplitude: OneAmplitude = None, part: Part = None,
             search_from: Annotated[Optional[str], typer.Option(
                 "--from", metavar="POSITION", help="Search the part's positions from here "
                 "(e.g. '-400 mm', above the pivot; default: as far above as below).")]
             = None,
             search_to: Annotated[Optional[str], typer.Option(
                 "--to", metavar="POSITION", help="... to here (default: twice the present "
                 "position or the body's reach).")] = None,
             gravity: opt.Gravity = None,
             fmt: opt.Format = None, output: opt.Output = None, force: opt.Force = False
             ) -> None:
        """Length (point bob) or part position (a bob on its rod) that gives the target
        period at the working amplitude, not at zero amplitude."""
        from ..quantity import parse_quantity
        from ..report.design import tune_report

        target = opt.positive_time(period, "--period") if period is not None else None
        a = _one_amplitude(amplitude)
        allowed = "a position along the arm, e.g. '850 mm' (negative above the pivot)"
        lo = (parse_quantity(search_from, "length", "--from", allowed=allowed)
              if search_from is not None else None)
        hi = (parse_quantity(search_to, "length", "--to", allowed=allowed)
              if search_to is not None else None)

        def build(d):
            t = target if target is not None else d.target_period_s
            if t is None:
                raise InvalidInput("--period", MISSING, "a target period, e.g. '2 s'",
                                   "required when the design has no swing.target_period")
            names = None if part is None else tuple(n.strip() for n in part.split(","))
            with _app()._options_named(part="--part", **{"target period": "--period",
                                                         "position range": "--from"}):
                return tune_report(d, t, d.amplitudes_rad[0] if a is None else a, names,
                                   lowest=lo, highest=hi)

        _run(design, fmt, output, force, build, gravity=gravity)

    @app.command("drop")
    def drop(design: DesignArg = None,
             energy: Annotated[Optional[str], typer.Option(
                 "--energy", metavar="ENERGY", help="Target energy at the bottom, e.g. "
                 "'300 J'.")] = None,
             speed: Annotated[Optional[str], typer.Option(
                 "--speed", metavar="SPEED", help="Or: target striking speed, e.g. "
                 "'5.2 m/s'.")] = None,
             radius: Annotated[Optional[str], typer.Option(
                 "--radius", metavar="LENGTH", help="Strike radius for --speed (default: "
                 "the design's [impact] strike point).")] = None,
             gravity: opt.Gravity = None, fmt: opt.Format = None, output: opt.Output = None,
             force: opt.Force = False) -> None:
        """Drop angle for a target energy, or for a striking speed at a radius."""
        from ..quantity import parse_quantity
        from ..report.design import drop_report

        if (energy is None) == (speed is None):
            raise InvalidInput("--energy", energy if energy is not None else MISSING,
                               "exactly one of --energy or --speed",
                               "give one of them" if energy is None else "give only one")
        e = (parse_quantity(energy, "energy", "--energy", minimum=0.0, include_min=False)
             if energy is not None else None)
        v = (parse_quantity(speed, "speed", "--speed", minimum=0.0, include_min=False)
             if speed is not None else None)
        r = opt.length(radius, "--radius") if radius is not None else None
        names = {"target energy": "--energy", "striking speed": "--speed",
                 "strike radius": "--radius"}
        with _app()._options_named(**names):
            _run(design, fmt, output, force, lambda d: drop_report(d, e, v, r),
                 gravity=gravity)

    @app.command("limit")
    def limit(design: DesignArg = None,
              quantity: Annotated[str, typer.Option(
                  "--quantity", metavar="NAME",
                  help="reaction_N (pivot load), arm_tension_N, angular_speed_rad_s, "
                       "angular_acceleration_rad_s2, or '<point>.speed_m_s', "
                       "'<point>.felt_g' for a named point.")] = "reaction_N",
              maximum: Annotated[Optional[str], typer.Option(
                  "--max", metavar="VALUE",
                  help="The limit, with a unit: '2 kN', '3 m/s', '2.5 g', '90 deg/s'.")]
              = None,
              gravity: opt.Gravity = None, fmt: opt.Format = None, output: opt.Output = None,
              force: opt.Force = False) -> None:
        """The largest amplitude that keeps a peak load, speed or felt acceleration at or
        under a limit."""
        from ..report.design import limit_report

        if maximum is None:
            raise InvalidInput("--max", MISSING, "a limit with a unit, e.g. '2 kN', '2.5 g'",
                               "required")
        kind = _LIMIT_KINDS.get(quantity.rsplit(".", 1)[-1])
        value = opt.limit_value(maximum, kind) if kind else None

        def build(d):
            if value is None:
                from ..sizing import max_amplitude_for_limit

                max_amplitude_for_limit(d.pendulum, quantity, 1.0, d.points_dict())
            return limit_report(d, quantity, value)

        with _app()._options_named(**{"limit quantity": "--quantity", "limit": "--max"}):
            _run(design, fmt, output, force, build, gravity=gravity)

    @app.command("sensitivity")
    def sensitivity(design: DesignArg = None, amplitude: OneAmplitude = None,
                    gravity: opt.Gravity = None, fmt: opt.Format = None,
                    output: opt.Output = None, force: opt.Force = False) -> None:
        """How the period and a clock's rate move with each dimension, mass, gravity and
        the amplitude; the rating adjustment per mm and per turn of the nut."""
        from ..report.design import sensitivity_report

        a = _one_amplitude(amplitude)
        _run(design, fmt, output, force, lambda d: sensitivity_report(d, a), gravity=gravity)
