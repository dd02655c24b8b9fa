"""The ``simulate`` command: damped, driven motion of a simple pendulum or a given body.

``register(app)`` adds the command to the one typer app (``cli/app.py`` calls it). The
command only parses options, calls the library and a report builder, and writes the
report, the per-cycle table (``--cycles-file``) and the time history
(``--history-file``). Ctrl-C keeps what was computed: it is reported and written, and the
exit status is 130.

The body: a design file (or the bundled default), a simple pendulum from
--length/--mass, or a given body from --inertia/--com-distance/--mass.
"""

from __future__ import annotations

import math
import sys
from pathlib import Path
from typing import Annotated

import typer

from ..errors import MISSING, InvalidInput
from . import options as opt

__all__ = ["register"]

#: Cycles run when neither --duration nor --cycles is given.
_DEFAULT_CYCLES = 100

_Text = str | None


def _opt(name: str, metavar: str, help_text: str):
    return typer.Option(name, metavar=metavar, help=help_text)


_KINDS = {"inertia": "inertia", "torque": "torque", "energy": "energy",
          "impulse": "angular_impulse", "viscous": "viscous", "drag": "drag_torque"}


def _si(text: str, kind: str, field: str, positive: bool = True) -> float:
    """A quantity of one of the kinds above -> SI (bare numbers are SI)."""
    from ..quantity import parse_quantity

    bounds = {"minimum": 0.0, "include_min": not positive}
    if kind == "frequency":
        return _angular_frequency(text, field)
    return parse_quantity(text, _KINDS[kind], field, **bounds)


def _angular_frequency(text: str, field: str) -> float:
    """A drive frequency -> rad/s: in Hz (bare), or an angular speed ('2 rad/s', '30 rpm').
    The two are told apart here because pint takes a radian as 1, so 1 rad/s would read
    as 1 Hz, 2 pi times too fast."""
    from ..quantity import parse_quantity, split_magnitude

    allowed = "a frequency > 0: '0.5 Hz' (bare: Hz), or an angular speed '3 rad/s', '30 rpm'"
    _, unit = split_magnitude(text, field, allowed)
    if "rad" in unit or "rpm" in unit or "deg" in unit or "rps" in unit:
        return parse_quantity(text, "angular_velocity", field, allowed=allowed, minimum=0.0,
                              include_min=False)
    return 2.0 * math.pi * parse_quantity(text, "frequency", field, allowed=allowed,
                                          minimum=0.0, include_min=False)


def _angle(text: str, field: str) -> float:
    from ..quantity import parse_quantity

    return parse_quantity(text, "angle", field, minimum=-math.pi, maximum=math.pi,
                          include_min=False, include_max=False,
                          allowed="an angle in (-180, 180) deg, e.g. '10 deg', '0.1 rad' "
                                  "(bare: deg)")


def _fraction(text: str, field: str, high: float | None = None) -> float:
    from ..quantity import parse_quantity

    return parse_quantity(text, "fraction", field, minimum=0.0, maximum=high,
                          allowed=f"a number >= 0{'' if high is None else f' and <= {high:g}'}")


def _design_or_none(design, length, mass, inertia, com_distance, gravity):
    """The design to simulate: the file, or the bundled default when no body is given by
    options (as every design command does); None for a body from options."""
    body_options = {k: v for k, v in (("--length", length), ("--mass", mass),
                                      ("--inertia", inertia),
                                      ("--com-distance", com_distance)) if v is not None}
    if design is None and body_options:
        return None
    if body_options:
        raise InvalidInput(next(iter(body_options)), MISSING,
                           "a design file or the body options, not both",
                           "the design file describes the body")
    from .app import _design

    return _design(design, gravity=gravity)


def _model(length, mass, inertia, com_distance, gravity, q, damping_ratio, viscous, drag,
           pin_radius, friction, static_friction, friction_torque, linear, design=None):
    from ..simulate import SwingModel

    g, _ = opt.gravity(gravity)
    kw = {}
    if drag is not None:
        kw["drag"] = _si(drag, "drag", "--drag", positive=False)
    if viscous is not None:
        kw["viscous"] = _si(viscous, "viscous", "--viscous", positive=False)
    if pin_radius is not None:
        kw["pin_radius"] = opt.length(pin_radius, "--pin-radius")
    if friction is not None:
        kw["friction"] = _fraction(friction, "--friction")
    if static_friction is not None:
        kw["static_friction"] = _fraction(static_friction, "--static-friction")
    if friction_torque is not None:
        kw["friction_torque"] = _si(friction_torque, "torque", "--friction-torque",
                                    positive=False)
    if design is not None:
        if linear:
            kw["linear"] = True
        # friction options change the design's pivot field by field; a friction torque
        # and a pin's coefficients exclude each other
        if "friction_torque" in kw:
            kw.update(pin_radius=0.0, friction=0.0, static_friction=None)
        elif any(k in kw for k in ("pin_radius", "friction", "static_friction")):
            kw.update(friction_torque=0.0, static_friction_torque=None)
            if "friction" in kw and "static_friction" not in kw:
                kw["static_friction"] = max(kw["friction"],
                                            design.pivot.static_friction_coefficient)
        model = SwingModel.from_pendulum(design.pendulum, design.pivot, name=design.name,
                                         **kw)
    elif inertia is not None or com_distance is not None:
        if length is not None:
            raise InvalidInput("--length", length, "either --length (simple pendulum) or "
                               "--inertia with --com-distance", "give only one body")
        if inertia is None or com_distance is None:
            raise InvalidInput("--inertia" if inertia is None else "--com-distance", MISSING,
                               "--inertia and --com-distance together (with --mass)",
                               "missing")
        m = opt.mass(mass) if mass is not None else 1.0
        model = SwingModel(inertia=_si(inertia, "inertia", "--inertia"), mass=m,
                           com_distance=opt.length(com_distance, "--com-distance"), gravity=g,
                           linear=linear, name="body from options", **kw)
    else:
        L = opt.length(length) if length is not None else 1.0
        m = opt.mass(mass) if mass is not None else 1.0
        model = SwingModel.simple(L, m, g, linear=linear, **kw)
        model = SwingModel(**{**model.__dict__, "name": "simple pendulum"})
    given = [x is not None for x in (q, damping_ratio, viscous)]
    if sum(given) > 1:
        raise InvalidInput("--q", q, "one of --q, --damping-ratio or --viscous",
                           "give only one")
    if q is not None:
        value = _q_value(q)
        model = _named("--q", lambda: model.with_q(value))
    if damping_ratio is not None:
        z = _fraction(damping_ratio, "--damping-ratio")
        model = _named("--damping-ratio", lambda: model.with_damping_ratio(z))
    return model


def _named(option, fn):
    try:
        return fn()
    except InvalidInput as exc:
        raise exc.renamed(option) from None


def _drives(torque, torque_frequency, pivot, pivot_amplitude, pivot_frequency,
            push_energy, push_impulse, push_angle, push_per, push_direction=None):
    from ..simulate import HarmonicTorque, ImpulseDrive, PivotMotion

    out = []
    if torque is not None or torque_frequency is not None:
        if torque is None or torque_frequency is None:
            raise InvalidInput("--torque" if torque is None else "--torque-frequency",
                               MISSING, "--torque with --torque-frequency", "missing")
        out.append(HarmonicTorque(_si(torque, "torque", "--torque"),
                                  _si(torque_frequency, "frequency", "--torque-frequency")))
    if pivot is not None:
        axis = pivot.strip().lower()
        if axis not in ("horizontal", "vertical"):
            raise InvalidInput("--pivot-motion", pivot, "horizontal or vertical")
        if pivot_amplitude is None or pivot_frequency is None:
            raise InvalidInput("--pivot-amplitude" if pivot_amplitude is None
                               else "--pivot-frequency", MISSING,
                               "--pivot-amplitude and --pivot-frequency with --pivot-motion",
                               "missing")
        out.append(PivotMotion(axis, opt.length(pivot_amplitude, "--pivot-amplitude"),
                               _si(pivot_frequency, "frequency", "--pivot-frequency")))
    if push_energy is None and push_impulse is None:
        for name, value in (("--push-angle", push_angle), ("--push-per", push_per),
                            ("--push-direction", push_direction)):
            if value is not None:
                raise InvalidInput(name, value, "with --push-energy or --push-impulse",
                                   "there is no push to place")
    if push_energy is not None or push_impulse is not None:
        if push_energy is not None and push_impulse is not None:
            raise InvalidInput("--push-impulse", push_impulse,
                               "either --push-energy or --push-impulse", "give only one")
        per = (push_per or "beat").strip().lower()
        if per not in ("beat", "swing"):
            raise InvalidInput("--push-per", push_per, "beat or swing")
        angle = _angle(push_angle, "--push-angle") if push_angle is not None else 0.0
        direction = 1
        if push_direction is not None:
            word = push_direction.strip().lower()
            if word not in _DIRECTIONS:
                raise InvalidInput("--push-direction", push_direction,
                                   "counter-clockwise (ccw, +) or clockwise (cw, -)")
            direction = _DIRECTIONS[word]
        out.append(ImpulseDrive(
            angle, direction=direction,
            energy=None if push_energy is None else _si(push_energy, "energy",
                                                        "--push-energy"),
            angular_impulse=None if push_impulse is None else _si(push_impulse, "impulse",
                                                                  "--push-impulse"),
            per=per))
    return out


_DIRECTIONS = {"counter-clockwise": 1, "ccw": 1, "+": 1, "clockwise": -1, "cw": -1, "-": -1}


def _progress_bar():
    """A rich progress bar on stderr that appears only once a run has taken a second."""
    import time

    state = {"bar": None, "task": None, "start": time.perf_counter()}

    def update(t, t_end, done, wanted):
        if state["bar"] is None:
            if time.perf_counter() - state["start"] < 1.0 or not sys.stderr.isatty():
                return
            from rich.console import Console
            from rich.progress import BarColumn, Progress, TextColumn, TimeElapsedColumn

            state["bar"] = Progress(TextColumn("simulating"), BarColumn(),
                                    TextColumn("{task.percentage:>5.1f} %"),
                                    TimeElapsedColumn(), TextColumn("Ctrl-C keeps results"),
                                    console=Console(stderr=True), transient=True)
            state["bar"].start()
            state["task"] = state["bar"].add_task("run", total=1.0)
        frac = 0.0
        if math.isfinite(t_end) and t_end > 0:
            frac = t / t_end
        if wanted:
            frac = max(frac, done / (wanted + 1))
        state["bar"].update(state["task"], completed=min(frac, 1.0))

    def close():
        if state["bar"] is not None:
            state["bar"].stop()

    update.close = close
    return update


def register(app) -> None:
    """Add the ``simulate`` command to ``app``."""

    @app.command("simulate")
    def simulate(
        design: Annotated[Path | None, typer.Argument(
            metavar="[DESIGN.toml]", help="Design file (TOML). Default: the bundled long-case "
            "clock, unless a body is given by options.",
            show_default=False)] = None,
        length: opt.Length = None, mass: opt.Mass = None, gravity: opt.Gravity = None,
        inertia: Annotated[_Text, _opt("--inertia", "INERTIA",
                                       "Instead of --length: inertia about the pivot "
                                       "[kg m^2] (with --com-distance, --mass).")] = None,
        com_distance: Annotated[_Text, _opt("--com-distance", "LENGTH",
                                            "Pivot to centre of mass (with --inertia).")] = None,
        amplitude: Annotated[_Text, _opt("--amplitude", "ANGLE",
                                         "Start angle, released at rest (bare: deg; default: "
                                         "the design's first amplitude, or 10 deg).")] = None,
        angular_speed: Annotated[_Text, _opt("--angular-speed", "RATE",
                                             "Start angular speed (bare: rad/s).")] = None,
        duration: Annotated[_Text, _opt("--duration", "TIME",
                                        "Simulated time, e.g. '60 s', '7 day'.")] = None,
        cycles: Annotated[_Text, _opt("--cycles", "N", "Stop after N complete cycles "
                                      "(default 100 when no --duration).")] = None,
        q: Annotated[_Text, _opt("--q", "Q", "Viscous damping given as Q at small "
                                 "amplitude.")] = None,
        damping_ratio: Annotated[_Text, _opt("--damping-ratio", "ZETA",
                                             "Viscous damping as a damping ratio.")] = None,
        viscous: Annotated[_Text, _opt("--viscous", "C", "Viscous coefficient [N m s].")] = None,
        drag: Annotated[_Text, _opt("--drag", "D", "Quadratic drag coefficient D "
                                    "[N m s^2]: torque -D w|w|.")] = None,
        pin_radius: Annotated[_Text, _opt("--pin-radius", "LENGTH",
                                          "Pivot pin radius (friction follows the "
                                          "reaction).")] = None,
        friction: Annotated[_Text, _opt("--friction", "MU",
                                        "Kinetic friction coefficient at the pin.")] = None,
        static_friction: Annotated[_Text, _opt("--static-friction", "MU",
                                               "Static friction coefficient (default: "
                                               "kinetic).")] = None,
        friction_torque: Annotated[_Text, _opt("--friction-torque", "TORQUE",
                                               "Instead: a constant friction torque "
                                               "[N m].")] = None,
        linear: Annotated[bool, typer.Option("--linear", help="Linear restoring torque "
                                             "(the textbook oscillator).")] = False,
        torque: Annotated[_Text, _opt("--torque", "TORQUE", "Harmonic torque amplitude "
                                      "[N m].")] = None,
        torque_frequency: Annotated[_Text, _opt("--torque-frequency", "FREQ",
                                                "Its frequency (bare: Hz; or rad/s).")] = None,
        pivot_motion: Annotated[_Text, _opt("--pivot-motion", "AXIS",
                                            "Move the pivot: horizontal or vertical.")] = None,
        pivot_amplitude: Annotated[_Text, _opt("--pivot-amplitude", "LENGTH",
                                               "Pivot motion amplitude.")] = None,
        pivot_frequency: Annotated[_Text, _opt("--pivot-frequency", "FREQ",
                                               "Pivot motion frequency (bare: Hz).")] = None,
        push_energy: Annotated[_Text, _opt("--push-energy", "ENERGY",
                                           "Push: energy per push [J].")] = None,
        push_impulse: Annotated[_Text, _opt("--push-impulse", "IMPULSE",
                                            "Push: angular impulse per push [N m s].")] = None,
        push_angle: Annotated[_Text, _opt("--push-angle", "ANGLE",
                                          "Where the push is given (default 0: the "
                                          "bottom).")] = None,
        push_per: Annotated[_Text, _opt("--push-per", "WHEN",
                                        "beat (each half swing) or swing (once per "
                                        "period).")] = None,
        push_direction: Annotated[_Text, _opt("--push-direction", "DIR",
                                              "Push passing the angle counter-clockwise "
                                              "(default) or clockwise.")] = None,
        decay_fraction: Annotated[_Text, _opt("--decay-fraction", "FRACTION",
                                              "Report the time and cycles to decay to this "
                                              "fraction of the start amplitude (default "
                                              "50 %).")] = None,
        target_period: Annotated[_Text, _opt("--target-period", "TIME",
                                             "Period for the rate error (default: the "
                                             "small-angle period).")] = None,
        rtol: Annotated[_Text, _opt("--rtol", "TOL", "Relative tolerance of the "
                                    "integrator (default 1e-12).")] = None,
        averaged: Annotated[bool, typer.Option("--averaged", help="Use the cycle-averaged "
                                               "model (weeks of running in a second).")]
        = False,
        context: Annotated[_Text, _opt("--context", "CONTEXT",
                                       "clock, ride, gate, impact, damper, load or general "
                                       "(for the cautions).")] = None,
        cycles_file: Annotated[_Text, _opt("--cycles-file", "FILE",
                                           "Write the whole per-cycle table (.csv, .json, "
                                           ".md, .txt).")] = None,
        history_file: Annotated[_Text, _opt("--history-file", "FILE",
                                            "Write the time history (.csv, .json, .md, "
                                            ".txt).")] = None,
        fmt: opt.Format = None, output: opt.Output = None, force: opt.Force = False,
    ) -> None:
        """Damped, driven motion: decay, Q, rate, steady amplitude under a push or a
        forcing, energy budget per mechanism, stick-slip pivot friction, peak loads.

        A design file (its body, air drag and pivot friction; default: the bundled
        long-case clock), or a simple pendulum from --length/--mass (1 m, 1 kg by
        default), or a body from --inertia/--com-distance/--mass. Damping and friction
        options add to (or, for the pivot, replace) the design's. --averaged runs the
        cycle-averaged model."""
        _run(**locals())


def _files(cycles_file, history_file, force):
    from ..report.files import check_writable

    out = {}
    for name, text in (("--cycles-file", cycles_file), ("--history-file", history_file)):
        if text is None:
            continue
        path = opt.output_path(text, name)
        kind = _file_format(path, name)
        check_writable(path, force, name)
        out[name] = (path, kind)
    return out


def _file_format(path: Path, field: str) -> str:
    suffix = path.suffix.lower()
    kinds = {".csv": "csv", ".json": "json", ".md": "markdown", ".txt": "table"}
    if suffix not in kinds:
        raise InvalidInput(field, str(path), "a file ending in .csv, .json, .md or .txt",
                           "cannot tell the format from the file name")
    return kinds[suffix]


def _cycles_value(text: str) -> int:
    from ..quantity import split_magnitude

    value, unit = split_magnitude(text, "--cycles", "a whole number of cycles >= 1")
    if unit or value < 1 or value != int(value) or value > 1e9:
        raise InvalidInput("--cycles", text, "a whole number of cycles in [1, 1e9]")
    return int(value)


def _q_value(text: str) -> float:
    from .._validate import real_scalar
    from ..quantity import split_magnitude

    value, unit = split_magnitude(text, "--q", "a quality factor Q > 0.5")
    if unit:
        raise InvalidInput("--q", text, "a quality factor Q > 0.5", "Q takes no unit")
    return real_scalar(value, "--q", "a quality factor Q > 0.5", low=0.5, low_open=True)


def _rtol_value(text: str) -> float:
    from ..quantity import parse_quantity

    return parse_quantity(text, "fraction", "--rtol", minimum=1e-14, maximum=1e-3,
                          allowed="a relative tolerance in [1e-14, 1e-3]")


def _decay_value(text: str) -> float:
    from ..quantity import parse_quantity

    return parse_quantity(
        text, "fraction", "--decay-fraction", minimum=0.0, maximum=1.0, include_min=False,
        include_max=False, allowed="a fraction in (0, 1) of the start amplitude, e.g. '10 %' "
                                   "or 0.1")


def _word(text: str, field: str, words, allowed: str | None = None) -> str:
    word = text.strip().lower()
    if word not in words:
        raise InvalidInput(field, text, allowed or " or ".join(words))
    return word


def _check_values(given: dict) -> None:
    """Each given option's value on its own, before any check of how the options go
    together (a missing partner, two that exclude each other, what --averaged refuses), so
    that a bad value is named first."""
    from .._validate import real_scalar
    from ..quantity import parse_quantity

    def ratio(v):
        real_scalar(_fraction(v, "--damping-ratio"), "--damping-ratio",
                    "a damping ratio in [0, 1)", low=0.0, high=1.0, high_open=True)

    parsers = {
        "--length": opt.length, "--mass": opt.mass, "--gravity": opt.gravity,
        "--inertia": lambda v: _si(v, "inertia", "--inertia"),
        "--com-distance": lambda v: opt.length(v, "--com-distance"),
        "--amplitude": lambda v: _angle(v, "--amplitude"),
        "--angular-speed": lambda v: parse_quantity(v, "angular_velocity", "--angular-speed"),
        "--duration": lambda v: opt.positive_time(v, "--duration"),
        "--cycles": _cycles_value, "--q": _q_value, "--damping-ratio": ratio,
        "--viscous": lambda v: _si(v, "viscous", "--viscous", positive=False),
        "--drag": lambda v: _si(v, "drag", "--drag", positive=False),
        "--pin-radius": lambda v: opt.length(v, "--pin-radius"),
        "--friction": lambda v: _fraction(v, "--friction"),
        "--static-friction": lambda v: _fraction(v, "--static-friction"),
        "--friction-torque": lambda v: _si(v, "torque", "--friction-torque", positive=False),
        "--torque": lambda v: _si(v, "torque", "--torque"),
        "--torque-frequency": lambda v: _si(v, "frequency", "--torque-frequency"),
        "--pivot-motion": lambda v: _word(v, "--pivot-motion", ("horizontal", "vertical")),
        "--pivot-amplitude": lambda v: opt.length(v, "--pivot-amplitude"),
        "--pivot-frequency": lambda v: _si(v, "frequency", "--pivot-frequency"),
        "--push-energy": lambda v: _si(v, "energy", "--push-energy"),
        "--push-impulse": lambda v: _si(v, "impulse", "--push-impulse"),
        "--push-angle": lambda v: _angle(v, "--push-angle"),
        "--push-per": lambda v: _word(v, "--push-per", ("beat", "swing")),
        "--push-direction": lambda v: _word(v, "--push-direction", _DIRECTIONS,
                                            "counter-clockwise (ccw, +) or clockwise (cw, -)"),
        "--decay-fraction": _decay_value,
        "--target-period": lambda v: opt.positive_time(v, "--target-period"),
        "--rtol": _rtol_value,
    }
    for name, value in given.items():
        if value is not None:
            parsers[name](value)


def _run(design=None, length=None, mass=None, gravity=None, inertia=None, com_distance=None,
         amplitude=None, angular_speed=None, duration=None, cycles=None, q=None,
         damping_ratio=None, viscous=None, drag=None, pin_radius=None, friction=None,
         static_friction=None, friction_torque=None, linear=False, torque=None,
         torque_frequency=None, pivot_motion=None, pivot_amplitude=None, pivot_frequency=None,
         push_energy=None, push_impulse=None, push_angle=None, push_per=None,
         push_direction=None, decay_fraction=None, target_period=None, rtol=None, averaged=False, context=None, cycles_file=None,
         history_file=None, fmt=None, output=None, force=False):
    from ..designfile import CONTEXTS
    from ..quantity import parse_quantity, suggest
    from ..report.files import write_atomic
    from ..report.formats import render
    from .app import _emit, _precheck

    kind, path = _precheck(fmt, output, force)
    files = _files(cycles_file, history_file, force)
    _check_values({
        "--length": length, "--mass": mass, "--gravity": gravity, "--inertia": inertia,
        "--com-distance": com_distance, "--amplitude": amplitude,
        "--angular-speed": angular_speed, "--duration": duration, "--cycles": cycles,
        "--q": q, "--damping-ratio": damping_ratio, "--viscous": viscous, "--drag": drag,
        "--pin-radius": pin_radius, "--friction": friction,
        "--static-friction": static_friction, "--friction-torque": friction_torque,
        "--torque": torque, "--torque-frequency": torque_frequency,
        "--pivot-motion": pivot_motion, "--pivot-amplitude": pivot_amplitude,
        "--pivot-frequency": pivot_frequency, "--push-energy": push_energy,
        "--push-impulse": push_impulse, "--push-angle": push_angle, "--push-per": push_per,
        "--push-direction": push_direction, "--decay-fraction": decay_fraction,
        "--target-period": target_period, "--rtol": rtol})
    if averaged and "--history-file" in files:
        raise InvalidInput("--history-file", str(files["--history-file"][0]),
                           "no history file with --averaged (it has no time history)")
    d = _design_or_none(design, length, mass, inertia, com_distance, gravity)
    ctx = (d.context if d is not None else "general") if context is None \
        else context.strip().lower()
    if ctx not in CONTEXTS:
        raise InvalidInput("--context", context, ", ".join(CONTEXTS),
                           f"unknown context{suggest(ctx, CONTEXTS)}")
    model = _model(length, mass, inertia, com_distance, gravity, q, damping_ratio, viscous,
                   drag, pin_radius, friction, static_friction, friction_torque, linear,
                   design=d)
    drives = _drives(torque, torque_frequency, pivot_motion, pivot_amplitude, pivot_frequency,
                     push_energy, push_impulse, push_angle, push_per, push_direction)
    if amplitude is not None:
        theta0 = _angle(amplitude, "--amplitude")
    else:
        theta0 = d.amplitudes_rad[0] if d is not None else math.radians(10.0)
    if target_period is None and d is not None and d.target_period_s is not None:
        target_period = f"{d.target_period_s!r} s"
    omega0 = 0.0 if angular_speed is None else parse_quantity(angular_speed,
                                                              "angular_velocity",
                                                              "--angular-speed")
    T = opt.positive_time(duration, "--duration") if duration is not None else None
    if T is not None and T > 1e9 * model.small_angle_period:
        # the same bound as --cycles: more would run for days and fill the memory
        raise InvalidInput("--duration", duration, "at most 1e9 small-angle periods "
                           f"({1e9 * model.small_angle_period:.4g} s here); for long runs "
                           "use --averaged", "too long")
    n = _cycles_value(cycles) if cycles is not None else None
    if T is None and n is None:
        n = _DEFAULT_CYCLES
    target = (opt.positive_time(target_period, "--target-period")
              if target_period is not None else None)
    tol = 1e-12 if rtol is None else _rtol_value(rtol)
    extra = {}
    if decay_fraction is not None:
        extra["decay_fraction"] = _decay_value(decay_fraction)
    if averaged and extra:
        raise InvalidInput("--decay-fraction", decay_fraction, "the full integrator (no "
                           "--averaged)", "the averaged model reports no decay time")
    if averaged:
        from ..averaged import averaged as run_averaged
        from ..report.simulation import averaged_cycles_report, averaged_report
        from ..simulate import ImpulseDrive

        pushes = [d for d in drives if isinstance(d, ImpulseDrive)]
        others = [d for d in drives if not isinstance(d, ImpulseDrive)]
        if abs(theta0) == 0.0:
            raise InvalidInput("--amplitude", amplitude, "a start amplitude > 0 with "
                               "--averaged", "out of range")
        if omega0 != 0.0:
            raise InvalidInput("--angular-speed", angular_speed, "no start speed with "
                               "--averaged (it starts at a turning point)")
        res = run_averaged(model, abs(theta0), cycles=n,
                           duration=T if n is None else None,
                           drive=pushes[0] if pushes else None, drives=others,
                           target_period=target)
        extra_warnings = []
        if d is not None and d.suspension.flexible:
            top = float(res.amplitude(res.energy_turn_J).max())
            if top > 0.5 * math.pi:
                extra_warnings.append(
                    f"the amplitude reaches {math.degrees(top):.4g} deg: past 90 deg the "
                    "suspension goes slack near the turning points, which this model does "
                    "not follow; results from there on are not those of the real swing")
        report = averaged_report(res, ctx, extra_warnings)
        for name, (fpath, fkind) in files.items():   # only --cycles-file (checked above)
            if fkind == "csv":
                res.write_cycles_csv(fpath, force=force)
            else:
                write_atomic(fpath, render(averaged_cycles_report(res), fkind), force=force,
                             field=name)
        _emit(report, kind, path, force)
        return
    from ..report.simulation import cycles_report, history_report, simulation_report
    from ..simulate import simulate as run_simulate

    bar = _progress_bar()
    try:
        res = run_simulate(model, theta0, omega0, duration=T, cycles=n, drives=drives,
                           rtol=tol, target_period=target, progress=bar, **extra)
    finally:
        bar.close()
    extra_warnings = []
    if d is not None and d.suspension.flexible:
        from ..loads import first_slack

        h = res.history
        slack = first_slack(d.pendulum, h.time_s, h.angle_rad, h.angular_velocity_rad_s)
        if slack is not None:
            extra_warnings.append(
                f"the suspension would go slack at t = {slack[0]:.6g} s (angle "
                f"{math.degrees(slack[1]):.4g} deg): the integrator keeps it taut, so the "
                "motion and the loads from there on are not those of the real swing")
    report = simulation_report(res, ctx, extra_warnings)
    for name, (fpath, fkind) in files.items():
        rep = cycles_report(res) if name == "--cycles-file" else history_report(res)
        write_atomic(fpath, render(rep, fkind), force=force, field=name)
    _emit(report, kind, path, force)
    if res.status == "interrupted":
        sys.stderr.write("swingcalc: interrupted; the results up to then were written\n")
        raise typer.Exit(130)
    if res.status == "failed":
        sys.stderr.write(f"swingcalc: {res.message}\n")
        raise typer.Exit(1)
