"""Damped, driven swing: the physical model, the drives, and the full integrator.

The library takes SI floats and radians. A body is reduced to a few numbers
(:class:`SwingModel`); drives are :class:`HarmonicTorque`, :class:`PivotMotion` and
:class:`ImpulseDrive`; :func:`simulate` integrates the motion with a compiled DOP853
stepper, locates every event on the step's own dense output, treats Coulomb pivot
friction as a hybrid system (sliding one way, sliding the other, stuck) and keeps an
energy ledger per mechanism. The equations and their sources are in
``docs/methods/simulation.md``; the long-run model is in :mod:`swingcalc.averaged`.
"""

from __future__ import annotations

import math
import time as _time
from array import array
from dataclasses import dataclass, field, replace

import numpy as np

from ._validate import positive_scalar, real_scalar
from .constants import SECONDS_PER_DAY, STANDARD_GRAVITY
from .errors import MISSING, InvalidInput
from .kernels import dynamics as _k

__all__ = [
    "CycleTable",
    "EnergyBudget",
    "HarmonicTorque",
    "ImpulseDrive",
    "PivotMotion",
    "SimulationHistory",
    "SimulationResult",
    "SimulationSummary",
    "Status",
    "SwingModel",
    "drag_moment_coefficient",
    "simulate",
]

_TWO_PI = 2.0 * math.pi
_NONNEG = "a finite number >= 0"


def _nonneg(value, field, unit):
    return real_scalar(value, field, f"{_NONNEG} [{unit}]", low=0.0)


def drag_moment_coefficient(air_density, drag_coefficient, area, radius):
    """D = 1/2 rho Cd A r^3 [N m s^2] of a small part at ``radius`` from the pivot.

    The drag torque is then -D omega |omega|. Parameters: air density [kg/m^3], drag
    coefficient Cd [-] (e.g. about 0.47 for a sphere at Re 1e3-2.5e5, fluid-mechanics
    texts), frontal area A [m^2], distance of the part's centre from the pivot r [m].
    Parts spread along the arm need the integral of 1/2 rho Cd w(r) r^3 dr instead.
    """
    rho = _nonneg(air_density, "air_density", "kg/m^3")
    cd = _nonneg(drag_coefficient, "drag_coefficient", "-")
    a = _nonneg(area, "area", "m^2")
    r = _nonneg(radius, "radius", "m")
    return 0.5 * rho * cd * a * r ** 3


@dataclass(frozen=True)
class SwingModel:
    """A swinging body reduced to the numbers its motion needs (SI units).

    Attributes
    ----------
    inertia : float
        Moment of inertia about the pivot [kg m^2], including the air's added mass.
    mass : float
        Mass of the body [kg] (for the pivot reaction).
    com_distance : float
        Pivot to centre of mass [m], > 0.
    gravity : float
        [m/s^2].
    restoring_moment : float
        M [N m]: the gravity torque is -M sin(theta). Default m g d; the body model
        lowers it for buoyancy.
    viscous : float
        Viscous pivot damping c [N m s]: torque -c omega.
    drag : float
        Quadratic drag coefficient D [N m s^2]: torque -D omega |omega|.
    pin_radius : float
        Pivot pin radius rho [m], for friction that follows the pivot reaction.
    friction, static_friction : float
        Kinetic and static friction coefficients mu_k, mu_s (static defaults to kinetic):
        sliding friction torque mu_k rho |R|, holding torque up to mu_s rho |R|.
    friction_torque, static_friction_torque : float
        Instead: a constant Coulomb friction torque [N m] (static defaults to it).
    linear : bool
        Linearised restoring torque -M theta (for checks against the linear oscillator).
    name : str
        A label for reports.
    """

    inertia: float
    mass: float
    com_distance: float
    gravity: float = STANDARD_GRAVITY
    restoring_moment: float | None = None
    viscous: float = 0.0
    drag: float = 0.0
    pin_radius: float = 0.0
    friction: float = 0.0
    static_friction: float | None = None
    friction_torque: float = 0.0
    static_friction_torque: float | None = None
    linear: bool = False
    name: str = ""

    def __post_init__(self):
        put = object.__setattr__
        inertia = positive_scalar(self.inertia, "inertia", "kg m^2")
        mass = positive_scalar(self.mass, "mass", "kg")
        d = positive_scalar(self.com_distance, "com_distance", "m")
        g = positive_scalar(self.gravity, "gravity", "m/s^2")
        put(self, "inertia", inertia)
        put(self, "mass", mass)
        put(self, "com_distance", d)
        put(self, "gravity", g)
        if inertia < mass * d * d * (1.0 - 1e-12):
            raise InvalidInput("inertia", inertia,
                               f"at least mass * com_distance^2 = {mass * d * d:.6g} kg m^2 "
                               "(parallel-axis theorem)", "smaller than a point mass allows")
        if self.restoring_moment is None:
            put(self, "restoring_moment", mass * g * d)
        else:
            put(self, "restoring_moment",
                positive_scalar(self.restoring_moment, "restoring_moment", "N m"))
        for name, unit in (("viscous", "N m s"), ("drag", "N m s^2"), ("pin_radius", "m"),
                           ("friction", "-"), ("friction_torque", "N m")):
            put(self, name, _nonneg(getattr(self, name), name, unit))
        mu_k = self.friction
        mu_s = mu_k if self.static_friction is None else _nonneg(
            self.static_friction, "static_friction", "-")
        t_k = self.friction_torque
        t_s = t_k if self.static_friction_torque is None else _nonneg(
            self.static_friction_torque, "static_friction_torque", "N m")
        put(self, "static_friction", mu_s)
        put(self, "static_friction_torque", t_s)
        if mu_s < mu_k:
            raise InvalidInput("static_friction", mu_s, f"a coefficient >= the kinetic one "
                               f"({mu_k:g})", "static friction below kinetic friction")
        if t_s < t_k:
            raise InvalidInput("static_friction_torque", t_s, f"a torque >= the kinetic one "
                               f"({t_k:g} N m)", "static friction below kinetic friction")
        reaction = (mu_k > 0 or mu_s > 0) and self.pin_radius > 0
        if (mu_k > 0 or mu_s > 0) and self.pin_radius == 0:
            raise InvalidInput("pin_radius", 0.0, "a pin radius > 0 [m] with a friction "
                               "coefficient", "friction coefficient given without a pin radius")
        if reaction and (t_k > 0 or t_s > 0):
            raise InvalidInput("friction_torque", t_k, "either a friction coefficient with a "
                               "pin radius, or a constant friction torque", "give only one")
        if reaction and mu_k * self.pin_radius * mass * d / inertia >= 1.0:
            raise InvalidInput("friction", mu_k, "mu_k * pin_radius * mass * com_distance / "
                               "inertia < 1", "friction this large locks the pivot")
        put(self, "linear", bool(self.linear))
        put(self, "name", str(self.name))

    @classmethod
    def simple(cls, length, mass=1.0, gravity=STANDARD_GRAVITY, **options) -> SwingModel:
        """A point bob on a light rigid rod: I = m L^2, d = L.

        Examples
        --------
        >>> m = SwingModel.simple(0.994, 1.2)
        >>> round(m.small_angle_period, 6)
        2.000381
        """
        L = positive_scalar(length, "length", "m")
        mm = positive_scalar(mass, "mass", "kg")
        return cls(inertia=mm * L * L, mass=mm, com_distance=L, gravity=gravity, **options)

    @classmethod
    def from_pendulum(cls, pendulum, pivot=None, name: str = "", **options) -> SwingModel:
        """The model of a body in its place (:class:`~swingcalc.compound.CompoundPendulum`):
        its inertia with the air's added mass, its restoring moment less buoyancy and its
        parts' quadratic drag, with the pivot's friction (:class:`~swingcalc.body.Pivot`:
        a pin of a radius and friction coefficients, a given friction torque, or a knife
        edge). ``options`` (``viscous``, ``drag``, friction fields, ...) override.

        Examples
        --------
        >>> from swingcalc.body import assemble, point_bob
        >>> from swingcalc.compound import compound_pendulum
        >>> m = SwingModel.from_pendulum(compound_pendulum(assemble(*point_bob(0.994, 1.2))))
        >>> round(m.small_angle_period, 6)
        2.000086
        """
        kw = {"inertia": pendulum.inertia_kg_m2, "mass": pendulum.mass_kg,
              "com_distance": pendulum.com_distance_m, "gravity": pendulum.gravity_m_s2,
              "restoring_moment": pendulum.restoring_moment_N_m,
              "drag": pendulum.air.drag_coefficient_N_m_s2, "name": name}
        if pivot is not None and pivot.kind == "pin":
            kw.update(pin_radius=pivot.pin_radius, friction=pivot.friction_coefficient,
                      static_friction=pivot.static_friction_coefficient)
        elif pivot is not None and pivot.kind == "torque":
            kw.update(friction_torque=pivot.friction_torque)
        kw.update(options)
        return cls(**kw)

    @property
    def small_angle_frequency(self) -> float:
        """w0 = sqrt(M / I) [rad/s]."""
        return math.sqrt(self.restoring_moment / self.inertia)

    @property
    def small_angle_period(self) -> float:
        """2 pi sqrt(I / M) [s]."""
        return _TWO_PI / self.small_angle_frequency

    @property
    def damping_ratio(self) -> float:
        """zeta = c / (2 sqrt(I M)) of the viscous damping at small amplitude."""
        return self.viscous / (2.0 * math.sqrt(self.inertia * self.restoring_moment))

    def with_damping_ratio(self, zeta) -> SwingModel:
        """The same model with viscous damping c = 2 zeta sqrt(I M) (zeta in [0, 1))."""
        z = real_scalar(zeta, "damping_ratio", "a damping ratio in [0, 1)", low=0.0,
                        high=1.0, high_open=True)
        return replace(self, viscous=2.0 * z * math.sqrt(self.inertia * self.restoring_moment))

    def with_q(self, q) -> SwingModel:
        """The same model with the viscous damping of quality factor Q = 1 / (2 zeta) (> 0.5)."""
        qq = real_scalar(q, "q", "a quality factor Q > 0.5", low=0.5, low_open=True)
        return self.with_damping_ratio(1.0 / (2.0 * qq))

    @property
    def friction_kind(self) -> str:
        if self.pin_radius > 0 and self.static_friction > 0:
            return "reaction"
        if self.static_friction_torque > 0:
            return "torque"
        return "none"

    def to_dict(self) -> dict:
        return {"name": self.name, "inertia_kg_m2": self.inertia, "mass_kg": self.mass,
                "com_distance_m": self.com_distance, "gravity_m_s2": self.gravity,
                "restoring_moment_N_m": self.restoring_moment,
                "viscous_N_m_s": self.viscous, "drag_N_m_s2": self.drag,
                "pin_radius_m": self.pin_radius, "friction_kinetic": self.friction,
                "friction_static": self.static_friction,
                "friction_torque_N_m": self.friction_torque,
                "static_friction_torque_N_m": self.static_friction_torque,
                "linear": self.linear}


def _frequency(value, field):
    return positive_scalar(value, field, "rad/s")


@dataclass(frozen=True)
class HarmonicTorque:
    """A torque amplitude * cos(angular_frequency * t + phase) on the body.

    amplitude [N m]; angular_frequency [rad/s] (> 0); phase [rad].
    """

    amplitude: float
    angular_frequency: float
    phase: float = 0.0

    def __post_init__(self):
        object.__setattr__(self, "amplitude", real_scalar(
            self.amplitude, "torque amplitude", "a finite torque [N m]"))
        object.__setattr__(self, "angular_frequency",
                           _frequency(self.angular_frequency, "torque angular_frequency"))
        object.__setattr__(self, "phase", real_scalar(self.phase, "torque phase",
                                                      "a finite angle [rad]"))

    @property
    def label(self) -> str:
        return "harmonic torque"


@dataclass(frozen=True)
class PivotMotion:
    """The pivot moving as amplitude * cos(angular_frequency * t + phase) along ``axis``
    ('horizontal' or 'vertical'; vertical motion gives parametric resonance).

    amplitude [m]; angular_frequency [rad/s]; phase [rad].
    """

    axis: str
    amplitude: float
    angular_frequency: float
    phase: float = 0.0

    def __post_init__(self):
        axis = str(self.axis).strip().lower()
        if axis not in ("horizontal", "vertical"):
            raise InvalidInput("pivot axis", self.axis, "'horizontal' or 'vertical'")
        object.__setattr__(self, "axis", axis)
        object.__setattr__(self, "amplitude", real_scalar(
            self.amplitude, "pivot amplitude", "a finite displacement [m]"))
        object.__setattr__(self, "angular_frequency",
                           _frequency(self.angular_frequency, "pivot angular_frequency"))
        object.__setattr__(self, "phase", real_scalar(self.phase, "pivot phase",
                                                      "a finite angle [rad]"))

    @property
    def label(self) -> str:
        return f"{self.axis} pivot motion"


@dataclass(frozen=True)
class ImpulseDrive:
    """A push that delivers a set energy or angular impulse as the body passes ``angle``.

    Parameters
    ----------
    angle : float
        Where the push is given [rad] (0: at the bottom).
    energy : float, optional
        Energy delivered per push [J], > 0.
    angular_impulse : float, optional
        Instead: angular impulse per push [N m s], > 0.
    direction : int
        +1: the push is given passing ``angle`` counter-clockwise (omega > 0), -1: clockwise.
        The push is always along the motion.
    per : str
        'swing' (once per period, at ``angle`` in ``direction``) or 'beat' (also at
        ``-angle`` in the other direction: twice per period, like an escapement).
    """

    angle: float = 0.0
    energy: float | None = None
    angular_impulse: float | None = None
    direction: int = 1
    per: str = "beat"

    def __post_init__(self):
        put = object.__setattr__
        put(self, "angle", real_scalar(self.angle, "impulse angle",
                                       "an angle in (-pi, pi) rad", low=-math.pi,
                                       high=math.pi, low_open=True, high_open=True))
        if (self.energy is None) == (self.angular_impulse is None):
            raise InvalidInput("impulse", MISSING, "either an energy [J] or an angular "
                               "impulse [N m s] per push", "give exactly one")
        if self.energy is not None:
            put(self, "energy", positive_scalar(self.energy, "impulse energy", "J"))
        else:
            put(self, "angular_impulse", positive_scalar(self.angular_impulse,
                                                         "angular_impulse", "N m s"))
        if self.direction not in (1, -1):
            raise InvalidInput("impulse direction", self.direction, "+1 or -1")
        per = str(self.per).strip().lower()
        if per not in ("swing", "beat"):
            raise InvalidInput("impulse per", self.per, "'swing' or 'beat'")
        put(self, "per", per)
        put(self, "direction", int(self.direction))

    @property
    def label(self) -> str:
        return "impulse drive"

    def crossings(self):
        """(angle, direction) pairs at which the push is given."""
        first = ((self.angle, self.direction),)
        return first if self.per == "swing" else first + ((-self.angle, -self.direction),)


class Status:
    """How a run ended."""

    COMPLETED = "completed"
    AT_REST = "at rest"
    STOPPED = "stopped"        # reached the stop amplitude
    INTERRUPTED = "interrupted"
    FAILED = "failed"


# ----------------------------------------------------------------------- results

@dataclass(frozen=True)
class SimulationHistory:
    """Time history at the integrator's step ends (every ``stride``-th step) and at mode
    switches and pushes; arrays of equal length."""

    time_s: np.ndarray
    angle_rad: np.ndarray
    angular_velocity_rad_s: np.ndarray
    stride: int

    def to_dict(self) -> dict:
        return {"stride": self.stride, "time_s": self.time_s.tolist(),
                "angle_rad": self.angle_rad.tolist(),
                "angular_velocity_rad_s": self.angular_velocity_rad_s.tolist()}


@dataclass(frozen=True)
class CycleTable:
    """One row per complete cycle (bottom passage moving counter-clockwise to the next).

    ``columns`` maps a key with its unit (``period_s``, ``amplitude_positive_rad``,
    ``lost_viscous_J``, ...) to an array; ``turning_time_s`` / ``turning_angle_rad`` list
    every turning point (half-peaks), including a final stop.
    """

    columns: dict
    turning_time_s: np.ndarray
    turning_angle_rad: np.ndarray

    def __len__(self) -> int:
        return len(self.columns.get("cycle", ()))

    def __getitem__(self, key):
        return self.columns[key]

    def records(self) -> list[dict]:
        keys = list(self.columns)
        cols = [np.asarray(self.columns[k]).tolist() for k in keys]
        return [dict(zip(keys, row)) for row in zip(*cols)]

    def to_dict(self) -> dict:
        return {"columns": {k: np.asarray(v).tolist() for k, v in self.columns.items()},
                "turning_time_s": self.turning_time_s.tolist(),
                "turning_angle_rad": self.turning_angle_rad.tolist()}


@dataclass(frozen=True)
class EnergyBudget:
    """Energy supplied by each drive and dissipated by each mechanism [J] over the run.

    ``closure_rel`` = |E_final - E_initial - (supplied - dissipated)| / scale, with scale
    the largest of E_initial, E_final, total supplied and total dissipated.
    """

    initial_J: float
    final_J: float
    dissipated_J: dict
    supplied_J: dict
    closure_rel: float

    def to_dict(self) -> dict:
        return {"initial_J": self.initial_J, "final_J": self.final_J,
                "dissipated_J": dict(self.dissipated_J), "supplied_J": dict(self.supplied_J),
                "closure_rel": self.closure_rel}


@dataclass(frozen=True)
class SimulationSummary:
    """Figures of a run (SI; None where they do not apply). See ``docs/methods/simulation.md``
    for the definitions of Q and the logarithmic decrement."""

    duration_s: float
    cycles: int
    half_swings: int
    initial_amplitude_rad: float | None
    final_amplitude_rad: float | None
    first_period_s: float | None
    last_period_s: float | None
    target_period_s: float
    first_rate_s_per_day: float | None
    last_rate_s_per_day: float | None
    log_decrement_first: float | None
    log_decrement_last: float | None
    q_first: float | None
    q_last: float | None
    q_first_amplitude_rad: float | None
    q_last_amplitude_rad: float | None
    loss_q_last: float | None       # 2 pi E / energy lost in the last cycle (holds under a drive)
    decay_fraction: float
    decay_time_s: float | None
    decay_cycles: float | None
    steady_amplitude_rad: float | None
    settled: bool | None
    settle_time_s: float | None
    at_rest: bool
    rest_angle_rad: float | None
    rest_time_s: float | None
    over_the_top: bool
    impulses: int
    peak_angular_speed_rad_s: float
    peak_angular_acceleration_rad_s2: float
    peak_reaction_N: float
    peak_reaction_per_weight: float
    peak_friction_torque_N_m: float

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class SimulationResult:
    """What :func:`simulate` computed. ``success`` is False when the run was interrupted or
    failed; what was computed up to then is kept in every field."""

    success: bool
    status: str
    message: str
    model: SwingModel
    drives: tuple
    history: SimulationHistory
    cycles: CycleTable
    summary: SimulationSummary
    energy: EnergyBudget
    settings: dict = field(default_factory=dict)
    warnings: tuple = ()

    def to_dict(self, history: bool = True) -> dict:
        d = {"success": self.success, "status": self.status, "message": self.message,
             "warnings": list(self.warnings),
             "model": self.model.to_dict(),
             "drives": [dict(kind=dr.label, **dr.__dict__) for dr in self.drives],
             "settings": dict(self.settings), "summary": self.summary.to_dict(),
             "energy": self.energy.to_dict(), "cycles": self.cycles.to_dict()}
        if history:
            d["history"] = self.history.to_dict()
        return d


# ----------------------------------------------------------------------- the run

def _params(model: SwingModel, drives, e_ref: float) -> _k.Params:
    mode = {"none": _k.FRICTION_NONE, "reaction": _k.FRICTION_REACTION,
            "torque": _k.FRICTION_TORQUE}[model.friction_kind]
    if mode == _k.FRICTION_REACTION:
        kin = model.friction * model.pin_radius * model.mass
        sta = model.static_friction * model.pin_radius * model.mass
    elif mode == _k.FRICTION_TORQUE:
        kin, sta = model.friction_torque, model.static_friction_torque
    else:
        kin = sta = 0.0
    torques = tuple((d.amplitude, d.angular_frequency, d.phase) for d in drives
                    if isinstance(d, HarmonicTorque))
    pivots = tuple((1 if d.axis == "vertical" else 0, d.amplitude, d.angular_frequency,
                    d.phase) for d in drives if isinstance(d, PivotMotion))
    return _k.Params(model.inertia, model.restoring_moment, model.mass, model.com_distance,
                     model.gravity, model.linear, model.viscous, model.drag, mode, kin, sta,
                     torques, pivots, e_ref)


class _Interrupt:
    """Ctrl-C sets a flag (the integrator stops at its next step) instead of raising inside
    the compiled stepper's callback, which would abort the process."""

    def __init__(self):
        self.flag = False
        self._old = None

    def __enter__(self):
        import signal
        import threading

        if threading.current_thread() is threading.main_thread():
            try:
                self._old = signal.signal(signal.SIGINT, self._handler)
            except (ValueError, OSError):
                self._old = None
        return self

    def _handler(self, signum, frame):
        self.flag = True

    def __exit__(self, *exc):
        if self._old is not None:
            import signal

            signal.signal(signal.SIGINT, self._old)
        return False


_INT_MAX = 2 ** 31 - 1
_DEFERRED = "deferred"


class _Run:
    """State of one integration: the hybrid loop, event location and records."""

    def __init__(self, model, drives, theta0, omega0, t_end, max_cycles, stop_amplitude,
                 rtol, atol, history_every, max_history, progress, interrupt):
        self.model = model
        self.impulses = tuple(d for d in drives if isinstance(d, ImpulseDrive))
        self.timed = any(isinstance(d, (HarmonicTorque, PivotMotion)) for d in drives)
        w0 = model.small_angle_frequency
        self.w0 = w0
        amp_scale = max(abs(theta0), abs(omega0) / w0, 1e-3)
        e_ref = 0.5 * model.restoring_moment * amp_scale ** 2
        self.p = _params(model, drives, e_ref)
        self.names = _k.ledger_names(self.p)
        self.n = 2 + len(self.names)
        self.rtol = rtol
        self.atol = atol if atol is not None else 1e-2 * rtol * amp_scale
        periods = [_TWO_PI / w0] + [_TWO_PI / d.angular_frequency for d in drives
                                    if isinstance(d, (HarmonicTorque, PivotMotion))]
        self.max_step = min(periods) / 16.0
        self.t_end = t_end
        self.max_cycles = max_cycles
        self.stop_amplitude = stop_amplitude
        self.history_every = max(1, int(history_every))
        self.max_history = max(16, int(max_history))
        self.progress = progress
        self.interrupt = interrupt
        self.friction = self.p.friction_mode != _k.FRICTION_NONE
        self._rhs = {}
        # records
        self.h_t, self.h_th, self.h_om = array("d"), array("d"), array("d")
        self.stride = self.history_every
        self.bottoms = []     # (t, direction, ledger tuple, energy)
        self.turns = []       # (t, theta, ledger tuple, energy)
        self.kicks = []       # (t, drive index, energy delivered)
        self.up_count = 0
        self.peak_speed = 0.0
        self.rest = None      # (t, theta) when stuck for good
        self.over_top = False
        self.last_h = 0.0
        self.status = Status.COMPLETED
        self.message = ""
        self.t = 0.0
        self.y = np.zeros(self.n)
        self.y[0] = theta0
        self.y[1] = omega0 / w0
        self.e0 = _k.energy(self.p, theta0, omega0)
        self.kick_energy = [0.0] * len(self.impulses)

    # -- helpers
    def rhs(self, s):
        if s not in self._rhs:
            self._rhs[s] = _k.make_rhs(self.p, float(s), np.zeros(self.n))
        return self._rhs[s]

    def rhs_array(self, s):
        key = ("array", s)
        if key not in self._rhs:
            self._rhs[key] = _k.make_rhs_array(self.p, float(s))
        return self._rhs[key]

    def ledger(self, y) -> tuple:
        return tuple(float(v) * self.p.e_ref for v in y[2:])

    def energy_of(self, y) -> float:
        return _k.energy(self.p, float(y[0]), float(y[1]) * self.w0)

    def record(self, t, th, om):
        self.h_t.append(t)
        self.h_th.append(th)
        self.h_om.append(om)
        if len(self.h_t) > self.max_history:
            self.thin_history()

    def thin_history(self):
        for arr in (self.h_t, self.h_th, self.h_om):
            del arr[1::2]
        self.stride *= 2

    # -- main loop
    def run(self):
        p = self.p
        s = None
        if self.friction:
            om = self.y[1]
            if om != 0.0:
                s = 1 if om > 0 else -1
            else:
                s = self._start_direction(self.t, float(self.y[0]))
        self.record(self.t, float(self.y[0]), float(self.y[1]) * self.w0)
        if self.y[0] == 0.0 and self.y[1] > 0.0:
            # starting at the bottom moving counter-clockwise: a cycle starts here
            self.bottoms.append((self.t, 1, self.ledger(self.y), self.e0))
            self.up_count = 1
        started = _time.perf_counter()
        self._clock = started
        while True:
            if self.interrupt.flag:
                self.status = Status.INTERRUPTED
                break
            if self.t >= self.t_end:
                break
            if s == 0:
                t_r = self._release(float(self.y[0]))
                if t_r is None:
                    break
                self.t = t_r
                B, _ = _k.holding(p, t_r, float(self.y[0]))
                s = 1 if B > 0 else -1
                self.record(self.t, float(self.y[0]), 0.0)
                continue
            outcome = self._segment(s if s is not None else 1)
            if outcome is None:
                break
            kind, value = outcome
            if kind == "end":
                break
            if kind == "switch":
                s = value
        return self

    def _start_direction(self, t, theta):
        B, cap = _k.holding(self.p, t, theta)
        if abs(B) <= cap:
            self._stick(t, theta)
            return 0
        return 1 if B > 0 else -1

    def _stick(self, t, theta):
        self.rest = (t, theta)
        self.y[1] = 0.0
        self.record(t, theta, 0.0)

    def _release(self, theta):
        """First time after self.t at which the held body starts to slide, or None."""
        if not self.timed:
            self.status = Status.AT_REST
            return None
        p = self.p
        periods = [_TWO_PI / w for _, w, _ in p.torques] + [_TWO_PI / w for *_, w, _ in
                                                              p.pivots]
        dt = min(periods) / 64.0

        def margin(t):
            B, cap = _k.holding(p, t, theta)
            return abs(B) - cap

        t0 = self.t
        m0 = margin(t0)
        while t0 < self.t_end:
            if self.interrupt.flag:
                self.status = Status.INTERRUPTED
                return None
            t1 = min(t0 + dt, self.t_end)
            m1 = margin(t1)
            if m1 > 0.0:
                # bisect to the first time the holding margin is exceeded (just past it)
                lo, hi = (t0, t1) if m0 <= 0.0 else (t0, t0)
                if m0 <= 0.0:
                    for _ in range(200):
                        mid = 0.5 * (lo + hi)
                        if not lo < mid < hi:
                            break
                        if margin(mid) > 0.0:
                            hi = mid
                        else:
                            lo = mid
                self.rest = None
                return hi
            t0, m0 = t1, m1
        self.t = self.t_end
        return None

    def _segment(self, s):
        """Integrate in sliding direction s (or free) from self.t until an action event,
        the end, an interrupt or a failure. Returns None to stop, or (kind, value)."""
        import warnings

        from scipy.integrate import ode

        rhs = self.rhs(s if self.friction else 1)
        w0 = self.w0
        brackets = []
        impulses = [(a, dn) for dr in self.impulses for a, dn in dr.crossings()]
        friction = self.friction
        stop_amp = self.stop_amplitude
        want_cycles = self.max_cycles
        prev_t = self.t
        prev_y = self.y.tolist()
        n = 0
        up = self.up_count
        interrupt = self.interrupt
        progress = self.progress
        hist_every = self.stride
        h_t, h_th, h_om = self.h_t, self.h_th, self.h_om
        cap = self.max_history
        peak = self.peak_speed
        last_h = self.last_h
        state = rhs.state
        run = self
        # a long stretch's brackets are located while it runs, in chunks (bounded memory)
        flush_at = self._FLUSH if self.batch_events else math.inf

        def solout(x, y):
            # Called after every accepted step: only sign changes of the step's end values
            # are looked at here; the events are located afterwards (_events).
            nonlocal prev_t, prev_y, n, up, peak, progress, hist_every, last_h, flush_at
            try:
                yl = y.tolist()
                th = yl[0]
                w = yl[1]
                pth = prev_y[0]
                pw = prev_y[1]
                n += 1
                if n == 1 and x == prev_t:
                    return 1
                flags = 0
                # bottom passages (wrapped onto the nearest 2 pi k near a full turn)
                if -3.0 < th < 3.0 and -3.0 < pth < 3.0:
                    a_th, a_pth = th, pth
                else:
                    k = round(th / _TWO_PI)
                    a_th, a_pth = th - _TWO_PI * k, pth - _TWO_PI * k
                    if abs(th) > math.pi or abs(pth) > math.pi:
                        run.over_top = True
                if ((a_pth < 0.0 <= a_th) or (a_pth > 0.0 >= a_th)) and abs(a_th - a_pth) < 3.0:
                    flags = 1
                    if a_pth < 0.0:
                        up += 1
                        if want_cycles is not None and up > want_cycles:
                            flags |= 16
                if (pw < 0.0 <= w) or (pw > 0.0 >= w):
                    flags |= 2
                    if friction or stop_amp is not None and max(abs(th), abs(pth)) < stop_amp:
                        flags |= 8
                for a, dn in impulses:
                    if (dn > 0 and pth < a <= th) or (dn < 0 and pth > a >= th):
                        flags |= 4
                if flags:
                    brackets.append((prev_t, prev_y, x, yl, flags))
                    if len(brackets) >= flush_at and not flags & 28:
                        # all of them without actions (an action stops the stepper)
                        if run._batch(brackets, s, defer_actions=True) is _DEFERRED:
                            flush_at = math.inf
                        else:
                            brackets.clear()
                om = w * w0
                if om > peak or -om > peak:
                    peak = abs(om)
                    run.peak_speed = peak
                if n % hist_every == 0:
                    h_t.append(x)
                    h_th.append(th)
                    h_om.append(om)
                    if len(h_t) > cap:
                        run.thin_history()
                        hist_every = run.stride
                last_h = x - prev_t
                prev_t = x
                prev_y = yl
                if state["failed"]:
                    return -1
                if n & 255 == 0:
                    if interrupt.flag:
                        return -1
                    if progress is not None:
                        now = _time.perf_counter()
                        if now - run._clock > 0.1:
                            run._clock = now
                            try:
                                progress(x, run.t_end, up, want_cycles)
                            except Exception:  # noqa: BLE001 - a display must not stop a run
                                run.progress = None
                                progress = None
                return -1 if flags & 28 else 1
            except Exception:  # noqa: BLE001 - never raise inside the compiled stepper
                state["failed"] = True
                return -1

        first = min(self.last_h, self.max_step) if self.last_h > 0 else 0.0
        stepper = ode(rhs).set_integrator("dop853", rtol=self.rtol, atol=self.atol,
                                          nsteps=_INT_MAX, max_step=self.max_step,
                                          first_step=first)
        stepper.set_solout(solout)
        stepper.set_initial_value(self.y.copy(), self.t)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")     # the return code is checked below
            y = stepper.integrate(self.t_end)
        self.last_h = last_h
        x, idid = stepper.t, stepper.get_return_code()
        if rhs.state["failed"] or idid < 0:
            self.status = Status.FAILED
            self.message = ("the integrator failed (" + ("a non-finite state" if
                            rhs.state["failed"] else f"DOP853 code {idid}") +
                            f") at t = {float(prev_t):.9g} s")
            self.t = float(prev_t)
            self.y = np.asarray(prev_y, dtype=float).copy()
            return None
        action = self._events(brackets, rhs, s)
        if action is not None:
            return action
        self.t = float(x)
        self.y = np.asarray(y, dtype=float).copy()
        if interrupt.flag:
            self.status = Status.INTERRUPTED
            return None
        return ("continue", None)

    # Brackets are located in one vectorised pass when a segment has at least this many
    # without a possible action (long free runs); fewer go one by one. Tests switch the
    # pass off (batch_events = False) to check that both give the same events.
    batch_events = True
    _BATCH_MIN = 8
    _FLUSH = 4096

    def _events(self, brackets, rhs, s):
        """Locate the events of each bracket (step with a sign change) and record them in
        order; apply the first action (push, friction switch, end, stop); return
        (kind, value) if one was applied, else None. Only the last bracket of a segment
        can hold an action (solout stops the stepper there)."""
        k = 0
        if self.batch_events:
            while k < len(brackets) and not brackets[k][4] & 28:
                k += 1
            if k >= self._BATCH_MIN:
                action = self._batch(brackets[:k], s)
                if action is not None:
                    return action
            else:
                k = 0
        for bracket in brackets[k:]:
            action = self._bracket(bracket, rhs, s)
            if action is not None:
                return action
        return None

    def _batch(self, brackets, s, defer_actions=False):
        """The bottoms and turns of many brackets without actions, on their quintic Hermite
        interpolants built and solved together (the same interpolant and the same root as
        :meth:`_bracket`, to rounding). With ``defer_actions``, brackets that would hold an
        action are left unrecorded (returns _DEFERRED) for :meth:`_events`."""
        t_a = np.array([b[0] for b in brackets])
        t_b = np.array([b[2] for b in brackets])
        y_a = np.array([b[1] for b in brackets]).T
        y_b = np.array([b[3] for b in brackets]).T
        flags = np.array([b[4] for b in brackets])
        hs = _k.hermite_steps(self.rhs_array(s if self.friction else 1), t_a, y_a, t_b,
                              y_b, self.w0)
        ev_i, ev_x, ev_kind, ev_dir, ev_level = [], [], [], [], []

        def roots(j, level, sel):
            sub = hs.take(sel)
            lev = level[sel]
            f0 = y_a[j, sel] - lev
            f1 = sub.component(j, 1.0) - lev
            ok = (f0 != 0.0) & ((f0 > 0.0) != (f1 > 0.0))
            sub = sub.take(np.flatnonzero(ok))
            lev = lev[ok]
            x = _k.find_roots(lambda u: sub.component(j, u) - lev,
                              lambda u: sub.slope(j, u), f0[ok], f1[ok])
            return sel[ok], x, sub

        sel = np.flatnonzero(flags & 1)
        if sel.size:
            th_b = hs.component(0, 1.0)
            level = np.where(np.abs(th_b) >= 3.0, _TWO_PI * np.round(th_b / _TWO_PI), 0.0)
            idx, x, sub = roots(0, level, sel)
            ev_i.append(idx)
            ev_x.append(x)
            ev_kind.append(np.zeros(idx.size, dtype=int))
            ev_dir.append(np.where(sub.component(1, x) > 0.0, 1, -1))
            ev_level.append(level[idx])
        sel = np.flatnonzero(flags & 2)
        if sel.size:
            idx, x, _ = roots(1, np.zeros(len(brackets)), sel)
            ev_i.append(idx)
            ev_x.append(x)
            ev_kind.append(np.ones(idx.size, dtype=int))
            ev_dir.append(np.zeros(idx.size, dtype=int))
            ev_level.append(np.zeros(idx.size))
        if not ev_i:
            return None
        idx, x, kind = np.concatenate(ev_i), np.concatenate(ev_x), np.concatenate(ev_kind)
        order = np.lexsort((kind, x, idx))      # by bracket, then time, bottom before turn
        idx, x, kind = idx[order], x[order], kind[order]
        direction = np.concatenate(ev_dir)[order]
        level = np.concatenate(ev_level)[order]
        t = t_a[idx] + x * hs.h[idx]
        values = hs.take(idx).value(x)
        bottom = kind == 0
        values[0, bottom] = level[bottom]           # as _apply pins them
        values[1, ~bottom] = 0.0
        th = values[0]
        th_w = np.where(np.abs(th) > math.pi, th - _TWO_PI * np.round(th / _TWO_PI), th)
        ups = bottom & (direction > 0)
        action_due = (
            (self.max_cycles is not None
             and self.up_count + int(ups.sum()) > self.max_cycles)
            or (self.stop_amplitude is not None
                and bool(np.any(~bottom & (np.abs(th_w) < self.stop_amplitude))))
            or (self.friction and s is not None and not bottom.all()))
        if action_due:
            if defer_actions:
                return _DEFERRED
            # an action among them (not expected: solout flags those brackets): one by one
            for t_e, y, kd, dn, lev in zip(t.tolist(), values.T.tolist(), kind.tolist(),
                                           direction.tolist(), level.tolist()):
                action = self._apply(t_e, y, "turn" if kd else "bottom", (dn, lev), s)
                if action is not None:
                    return action
            return None
        # the records _apply would make, in bulk
        e_ref, w0, p, energy = self.p.e_ref, self.w0, self.p, _k.energy
        ledgers = [tuple(v) for v in (values[2:] * e_ref).T.tolist()]
        energies = [energy(p, a, b * w0) for a, b in zip(th.tolist(), values[1].tolist())]
        rows = list(zip(t.tolist(), bottom.tolist(), direction.tolist(), th_w.tolist(),
                        ledgers, energies))
        self.bottoms.extend((r[0], r[2], r[4], r[5]) for r in rows if r[1])
        self.turns.extend((r[0], r[3], r[4], r[5]) for r in rows if not r[1])
        self.up_count += int(ups.sum())
        return None

    def _bracket(self, bracket, rhs, s):
        """The events of one bracket, located on its interpolant: the step's own 7th-order
        dense output where an action may follow, else the quintic Hermite interpolant."""
        t_a, y_a, t_b, y_b, flags = bracket
        if flags & (4 | 8 | 16):
            ds = _k.replay_step(rhs, t_a, np.asarray(y_a, dtype=float), t_b - t_a)
        else:
            ds = _k.hermite_step(rhs, t_a, y_a, t_b, y_b, self.w0)
        found = []   # (x, kind, data)

        def root(j, level):
            f0 = float(y_a[j]) - level
            f1 = ds.component(j, 1.0) - level
            if f0 == 0.0 or (f0 > 0.0) == (f1 > 0.0):
                return None
            return _k.find_root(lambda u: ds.component(j, u) - level, 0.0, 1.0, f0, f1)

        if flags & 1:
            th_b = ds.component(0, 1.0)
            level = _TWO_PI * round(th_b / _TWO_PI) if abs(th_b) >= 3.0 else 0.0
            x = root(0, level)
            if x is not None:
                direction = 1 if ds.component(1, x) > 0.0 else -1
                found.append((x, "bottom", (direction, level)))
        if flags & 2:
            x = root(1, 0.0)
            if x is not None:
                found.append((x, "turn", None))
        if flags & 4:
            for k, dr in enumerate(self.impulses):
                for a, dn in dr.crossings():
                    pa = float(y_a[0])
                    pb = ds.component(0, 1.0)
                    if (dn > 0 and pa < a <= pb) or (dn < 0 and pa > a >= pb):
                        x = root(0, a)
                        if x is None and pb == a:
                            x = 1.0
                        if x is not None:
                            found.append((x, "kick", (k, a)))
        # a push exactly at the bottom coincides with the bottom passage: same time
        kicks_at_bottom = [f[0] for f in found if f[1] == "kick" and f[2][1] == 0.0]
        if kicks_at_bottom:
            found = [(kicks_at_bottom[0], k, d) if k == "bottom" and d[1] == 0.0
                     else (x, k, d) for x, k, d in found]
        found.sort(key=lambda f: (f[0], {"bottom": 0, "turn": 1, "kick": 2}[f[1]]))
        for x, kind, data in found:
            action = self._apply(t_a + x * ds.h, ds.value(x), kind, data, s)
            if action is not None:
                return action
        return None

    def _apply(self, t, y, kind, data, s):
        """Record an event at t with state y (a list or an array, changed in place); return
        (kind, value) if it ends the segment."""
        if kind == "bottom":
            direction, level = data
            y[0] = level
            self.bottoms.append((t, direction, self.ledger(y), self.energy_of(y)))
            if direction > 0:
                self.up_count += 1
                if self.max_cycles is not None and self.up_count > self.max_cycles:
                    return self._finish_at(t, np.array(y, dtype=float))
        elif kind == "turn":
            y[1] = 0.0
            th = float(y[0])
            # the amplitude is measured from the nearest bottom (after turns over the top
            # the angle is unwrapped)
            th_w = th - _TWO_PI * round(th / _TWO_PI) if abs(th) > math.pi else th
            self.turns.append((t, th_w, self.ledger(y), self.energy_of(y)))
            if self.friction and s is not None:
                return self._switch(t, np.array(y, dtype=float), s)
            if self.stop_amplitude is not None and abs(th_w) < self.stop_amplitude:
                self.status = Status.STOPPED
                self.message = (f"stopped at the turning point t = {t:.9g} s: "
                                f"amplitude below {self.stop_amplitude:.6g} rad")
                return self._finish_at(t, np.array(y, dtype=float))
        else:
            k, a = data
            return self._kick(t, np.array(y, dtype=float), k, a, s)
        return None

    def _finish_at(self, t, y):
        self.t = t
        self.y = y.copy()
        self.record(t, float(y[0]), float(y[1]) * self.w0)
        self.t_end = t
        return ("end", None)

    def _switch(self, t, y, s):
        """At a turning point under friction: stick, or slide back."""
        self.t = t
        self.y = y.copy()
        theta = float(y[0])
        B, cap = _k.holding(self.p, t, theta)
        self.record(t, theta, 0.0)
        if abs(B) <= cap:
            self._stick(t, theta)
            return ("switch", 0)
        return ("switch", 1 if B > 0 else -1)

    def _kick(self, t, y, k, a, s):
        dr = self.impulses[k]
        w0 = self.w0
        om = float(y[1]) * w0
        sign = 1.0 if om > 0 else -1.0
        inertia = self.model.inertia
        if dr.energy is not None:
            om_new = sign * math.sqrt(om * om + 2.0 * dr.energy / inertia)
        else:
            om_new = om + sign * dr.angular_impulse / inertia
        delivered = 0.5 * inertia * (om_new * om_new - om * om)
        y = y.copy()
        y[0] = a
        y[1] = om_new / w0
        self.kicks.append((t, k, delivered))
        self.kick_energy[k] += delivered
        self.t = t
        self.y = y
        self.record(t, a, om_new)
        return ("kick", s)


def simulate(model: SwingModel, angle, angular_velocity=0.0, *, duration=None, cycles=None,
             drives=(), rtol=1e-12, atol=None, target_period=None, decay_fraction=0.5,
             stop_amplitude=None, settle_tolerance=1e-3, history_every=1,
             max_history=200_000, progress=None) -> SimulationResult:
    """Integrate the damped, driven swing of ``model`` from (``angle``, ``angular_velocity``).

    Parameters
    ----------
    model : SwingModel
    angle : float
        Start angle from the downward vertical [rad].
    angular_velocity : float
        Start angular velocity [rad/s].
    duration : float, optional
        Simulated time [s]. At least one of ``duration`` and ``cycles`` is needed.
    cycles : int, optional
        Stop at the end of this many complete cycles.
    drives : sequence of HarmonicTorque, PivotMotion, ImpulseDrive
    rtol, atol : float
        Tolerances of the DOP853 stepper (atol [rad] on the angle and on omega / w0;
        default 0.01 rtol times the start amplitude, at least 1e-5 rtol).
    target_period : float, optional
        Period [s] against which the rate error is reported (default: the small-angle
        period 2 pi sqrt(I / M)).
    decay_fraction : float
        The summary reports the time and cycles to decay to this fraction of the start
        amplitude (0 < fraction < 1).
    stop_amplitude : float, optional
        Stop at the first turning point below this amplitude [rad].
    settle_tolerance : float
        Relative band within which a driven amplitude counts as steady.
    history_every : int
        Keep every n-th step in the time history.
    max_history : int
        At most this many history samples; beyond it the history is thinned by two.
    progress : callable, optional
        Called as ``progress(t, t_end, cycles_done, cycles_wanted)`` about ten times a
        second during long runs (it must be quick; an exception switches it off).

    Returns
    -------
    SimulationResult
        ``success`` is False if the run was interrupted (Ctrl-C: what was computed is
        kept) or the integrator failed.

    Examples
    --------
    >>> m = SwingModel.simple(1.0).with_q(200)
    >>> r = simulate(m, 0.1, cycles=20)
    >>> r.success, len(r.cycles)
    (True, 20)
    """
    if not isinstance(model, SwingModel):
        raise InvalidInput("model", type(model).__name__, "a SwingModel")
    theta0 = real_scalar(angle, "angle", "a finite angle [rad]")
    omega0 = real_scalar(angular_velocity, "angular_velocity",
                         "a finite angular velocity [rad/s]")
    drives = tuple(drives)
    for d in drives:
        if not isinstance(d, (HarmonicTorque, PivotMotion, ImpulseDrive)):
            raise InvalidInput("drives", type(d).__name__,
                               "HarmonicTorque, PivotMotion or ImpulseDrive objects")
    if duration is None and cycles is None:
        raise InvalidInput("duration", MISSING, "a duration [s] or a number of cycles",
                           "give at least one")
    t_end = math.inf if duration is None else positive_scalar(duration, "duration", "s")
    n_cycles = None
    if cycles is not None:
        n = real_scalar(cycles, "cycles", "a whole number of cycles >= 1", low=1.0)
        if n != int(n):
            raise InvalidInput("cycles", cycles, "a whole number of cycles >= 1",
                               "not a whole number")
        n_cycles = int(n)
    rt = real_scalar(rtol, "rtol", "a relative tolerance in [1e-14, 1e-3]", low=1e-14,
                     high=1e-3)
    at = None if atol is None else positive_scalar(atol, "atol", "rad")
    target = (model.small_angle_period if target_period is None
              else positive_scalar(target_period, "target_period", "s"))
    frac = real_scalar(decay_fraction, "decay_fraction", "a fraction in (0, 1)", low=0.0,
                       high=1.0, low_open=True, high_open=True)
    stop = None if stop_amplitude is None else positive_scalar(stop_amplitude,
                                                               "stop_amplitude", "rad")
    settle = real_scalar(settle_tolerance, "settle_tolerance", "a fraction in (0, 0.5)",
                         low=0.0, high=0.5, low_open=True, high_open=True)
    with _Interrupt() as interrupt:
        run = _Run(model, drives, theta0, omega0, t_end, n_cycles, stop, rt, at,
                   history_every, max_history, progress, interrupt)
        run.run()
    if run.status == Status.INTERRUPTED:
        run.message = (f"interrupted at t = {run.t:.9g} s after {run.up_count} cycles; the "
                       "results up to then are kept")
    if math.isinf(run.t_end) and run.status == Status.COMPLETED:
        run.t_end = run.t
    return _result(run, drives, target, frac, settle,
                   {"rtol": rt, "atol": run.atol, "max_step_s": run.max_step,
                        "duration_s": duration, "cycles": n_cycles, "target_period_s": target})


# ----------------------------------------------------------------------- tables

def _result(run: _Run, drives, target, frac, settle, settings) -> SimulationResult:
    w0 = run.w0
    y_final = run.y
    if run.h_t[-1] != run.t:
        run.record(run.t, float(y_final[0]), float(y_final[1]) * w0)
    final_t = run.t
    if run.status == Status.AT_REST and math.isfinite(run.t_end) and run.t_end > run.t:
        # held for good: it stays where it stopped until the end of the asked duration
        final_t = run.t_end
        run.record(final_t, float(y_final[0]), 0.0)
    hist = SimulationHistory(np.frombuffer(run.h_t, dtype=float).copy(),
                             np.frombuffer(run.h_th, dtype=float).copy(),
                             np.frombuffer(run.h_om, dtype=float).copy(), run.stride)
    names = run.names
    impulse_names = [f"impulse_{k + 1}" for k in range(len(run.impulses))]
    cycles = _cycle_table(run, names, impulse_names, target)
    e_final = run.energy_of(y_final)
    ledger = run.ledger(y_final)
    dissipated = {nm: v for nm, v in zip(names, ledger) if nm in ("viscous", "drag",
                                                                   "friction")}
    supplied = {nm: v for nm, v in zip(names, ledger) if nm not in dissipated}
    supplied.update({nm: v for nm, v in zip(impulse_names, run.kick_energy)})
    total_s = sum(supplied.values())
    total_d = sum(dissipated.values())
    scale = max(abs(run.e0), abs(e_final), abs(total_s), abs(total_d))
    closure = (abs((e_final - run.e0) - (total_s - total_d)) / scale) if scale > 0 else 0.0
    budget = EnergyBudget(run.e0, e_final, dissipated, supplied, closure)
    summary = _summary(run, hist, cycles, target, frac, settle, final_t)
    ok = run.status in (Status.COMPLETED, Status.AT_REST, Status.STOPPED)
    message = run.message or {
        Status.COMPLETED: f"completed: {summary.cycles} cycles in {summary.duration_s:.9g} s",
        Status.AT_REST: (f"came to rest at {summary.rest_angle_rad:.6g} rad "
                         f"(t = {summary.rest_time_s:.9g} s): static friction holds it"
                         if summary.rest_angle_rad is not None else "at rest"),
    }.get(run.status, run.status)
    warnings = []
    if not run.model.linear and run.e0 > 0.0:
        # Near the separatrix the period grows like ln(1 / (1 - E/E_sep)): the integrator's
        # energy error (~rtol) moves it by about rtol / (1 - E/E_sep) relative.
        margin = 1.0 - run.e0 / (2.0 * run.model.restoring_moment)
        if 0.0 < margin and run.rtol / margin > 1e-9:
            warnings.append(
                f"the start is within {margin:.2g} of the separatrix energy: the integrated "
                f"periods can be off by about {min(run.rtol / margin, 1.0):.1g} relative; "
                "the exact conservative period is swingcalc.period (the 'periods' command)")
    return SimulationResult(ok, run.status, message, run.model, tuple(drives), hist, cycles,
                            summary, budget, settings, tuple(warnings))


def _cycle_table(run: _Run, names, impulse_names, target) -> CycleTable:
    ups = [b for b in run.bottoms if b[1] > 0]
    turns_t = np.array([tp[0] for tp in run.turns], dtype=float)
    turns_th = np.array([tp[1] for tp in run.turns], dtype=float)
    cols: dict = {}
    n = max(0, len(ups) - 1)
    t_up = np.array([u[0] for u in ups], dtype=float)
    start = t_up[:-1] if n else np.zeros(0)
    end = t_up[1:] if n else np.zeros(0)
    period = end - start
    amp_pos = np.full(n, np.nan)
    amp_neg = np.full(n, np.nan)
    first_turn = np.full(n, np.nan)
    if n and turns_t.size:
        idx = np.searchsorted(turns_t, start, side="left")
        idx_end = np.searchsorted(turns_t, end, side="left")
        for i in range(n):
            seg = turns_th[idx[i]:idx_end[i]]
            if seg.size:
                first_turn[i] = abs(seg[0])
                pos = seg[seg > 0]
                neg = seg[seg < 0]
                if pos.size:
                    amp_pos[i] = pos.max()
                if neg.size:
                    amp_neg[i] = -neg.min()
    cols["cycle"] = np.arange(1, n + 1)
    cols["start_time_s"] = start
    cols["period_s"] = period
    cols["amplitude_positive_rad"] = amp_pos
    cols["amplitude_negative_rad"] = amp_neg
    cols["amplitude_rad"] = 0.5 * (amp_pos + amp_neg)
    with np.errstate(divide="ignore", invalid="ignore"):
        cols["rate_s_per_day"] = (target / period - 1.0) * SECONDS_PER_DAY
    e_start = np.array([u[3] for u in ups[:-1]], dtype=float) if n else np.zeros(0)
    cols["energy_start_J"] = e_start
    led = np.array([u[2] for u in ups], dtype=float).reshape(len(ups), len(names))
    dled = np.diff(led, axis=0) if n else np.zeros((0, len(names)))
    lost_total = np.zeros(n)
    for j, nm in enumerate(names):
        if nm in ("viscous", "drag", "friction"):
            cols[f"lost_{nm}_J"] = dled[:, j]
            lost_total = lost_total + dled[:, j]
        else:
            cols[f"supplied_{nm}_J"] = dled[:, j]
    if impulse_names:
        kick_t = np.array([k[0] for k in run.kicks], dtype=float)
        kick_i = np.array([k[1] for k in run.kicks], dtype=int)
        kick_e = np.array([k[2] for k in run.kicks], dtype=float)
        which = np.searchsorted(start, kick_t, side="right") - 1 if n else np.zeros(0, int)
        for k, nm in enumerate(impulse_names):
            tot = np.zeros(n)
            if n:
                sel = (kick_i == k) & (which >= 0) & (kick_t < end[np.clip(which, 0, n - 1)])
                np.add.at(tot, which[sel], kick_e[sel])
            cols[f"supplied_{nm}_J"] = tot
    # decrement: the first turning point of this cycle against that of the next one
    dec = np.full(n, np.nan)
    if n > 1:
        with np.errstate(divide="ignore", invalid="ignore"):
            dec[:-1] = np.log(first_turn[:-1] / first_turn[1:])
    cols["log_decrement"] = dec
    with np.errstate(divide="ignore", invalid="ignore"):
        q = np.sqrt(4.0 * math.pi ** 2 + dec * dec) / (2.0 * dec)
        q[~(dec > 0)] = np.nan
        cols["q"] = q
        loss_q = _TWO_PI * e_start / lost_total
        loss_q[~(lost_total > 0)] = np.nan
        cols["loss_q"] = loss_q
    return CycleTable(cols, turns_t, turns_th)


def _opt(x):
    if x is None:
        return None
    x = float(x)
    return x if math.isfinite(x) else None


def _summary(run: _Run, hist, cycles: CycleTable, target, frac, settle, final_t):
    p = run.p
    n = len(cycles)
    state0 = (float(hist.angle_rad[0]), float(hist.angular_velocity_rad_s[0]))
    e0 = run.e0
    if p.linear:
        a0 = math.sqrt(2.0 * e0 / p.restoring)
    else:
        h = e0 / (2.0 * p.restoring)
        a0 = 2.0 * math.asin(math.sqrt(h)) if h < 1.0 else None
    if e0 == 0.0:
        a0 = abs(state0[0])
    turns_t, turns_a = cycles.turning_time_s, np.abs(cycles.turning_angle_rad)
    final_amp = float(turns_a[-1]) if turns_a.size else None
    col = cycles.columns
    period = col["period_s"]
    dec = col["log_decrement"]
    q = col["q"]
    amp = col["amplitude_rad"]
    good = np.flatnonzero(np.isfinite(q))
    q_first = q_last = qa_first = qa_last = dec_first = dec_last = None
    if good.size:
        i, j = good[0], good[-1]
        q_first, q_last = float(q[i]), float(q[j])
        dec_first, dec_last = float(dec[i]), float(dec[j])
        qa_first, qa_last = _opt(amp[i]), _opt(amp[j])
    lq = col["loss_q"][np.isfinite(col["loss_q"])] if n else np.array([])
    loss_q_last = float(lq[-1]) if lq.size else None
    decay_t = decay_n = None
    if a0 and turns_a.size:
        goal = frac * a0
        below = np.flatnonzero(turns_a <= goal)
        if below.size:
            k = int(below[0])
            if k == 0:
                decay_t = float(turns_t[0])
            else:
                la, lb = math.log(turns_a[k - 1]), math.log(turns_a[k])
                if turns_a[k] > 0 and la != lb:
                    w = (la - math.log(goal)) / (la - lb)
                else:
                    w = 1.0
                decay_t = float(turns_t[k - 1] + w * (turns_t[k] - turns_t[k - 1]))
            # in periods from the start (the mean period of the cycles run)
            mean_T = float(np.mean(period)) if n else 2.0 * math.pi / run.w0
            decay_n = decay_t / mean_T
    steady = settled = settle_t = None
    if (run.impulses or run.timed) and n >= 4:
        a_pos = col["amplitude_positive_rad"]
        a_pos = np.where(np.isfinite(a_pos), a_pos, col["amplitude_negative_rad"])
        fin = np.isfinite(a_pos)
        if fin.sum() >= 4:
            a_pos = a_pos[fin]
            starts = col["start_time_s"][fin]
            steady = float(a_pos[-1])
            off = np.abs(a_pos - steady) > settle * steady
            tail = max(3, a_pos.size // 10)
            settled = bool(not off[-tail:].any())
            if settled:
                last_off = np.flatnonzero(off)
                settle_t = float(starts[last_off[-1] + 1] if last_off.size else starts[0])
    # peak loads from the history samples (step ends) and the recorded events
    t, th, om = hist.time_s, hist.angle_rad, hist.angular_velocity_rad_s
    B = _k.other_torque_array(p, t, th, om)
    # at omega == 0 the body slides the way B pushes, unless friction holds it
    s = np.where(om != 0.0, np.sign(om), np.sign(B))
    f = _k.friction_torque_array(p, t, th, om, B, s)
    alpha = (B + f) / p.inertia
    if p.friction_mode != _k.FRICTION_NONE:
        held = (om == 0.0) & (np.sign(alpha) != s)
        f = np.where(held, -B, f)
        alpha = np.where(held, 0.0, alpha)
    radial, tangential = _k.reaction_array(p, t, th, om, alpha)
    reaction = np.hypot(radial, tangential)
    peak_r = float(reaction.max()) if reaction.size else 0.0
    rest = run.rest
    return SimulationSummary(
        duration_s=float(final_t), cycles=n, half_swings=len(run.turns),
        initial_amplitude_rad=_opt(a0), final_amplitude_rad=_opt(final_amp),
        first_period_s=_opt(period[0]) if n else None,
        last_period_s=_opt(period[-1]) if n else None, target_period_s=target,
        first_rate_s_per_day=_opt(col["rate_s_per_day"][0]) if n else None,
        last_rate_s_per_day=_opt(col["rate_s_per_day"][-1]) if n else None,
        log_decrement_first=dec_first, log_decrement_last=dec_last,
        q_first=q_first, q_last=q_last, loss_q_last=loss_q_last,
        q_first_amplitude_rad=qa_first,
        q_last_amplitude_rad=qa_last, decay_fraction=frac, decay_time_s=decay_t,
        decay_cycles=decay_n, steady_amplitude_rad=steady, settled=settled,
        settle_time_s=settle_t, at_rest=rest is not None,
        rest_angle_rad=None if rest is None else float(rest[1]),
        rest_time_s=None if rest is None else float(rest[0]),
        over_the_top=bool(run.over_top), impulses=len(run.kicks),
        peak_angular_speed_rad_s=float(max(run.peak_speed, np.abs(om).max(initial=0.0))),
        peak_angular_acceleration_rad_s2=float(np.abs(alpha).max(initial=0.0)),
        peak_reaction_N=peak_r,
        peak_reaction_per_weight=peak_r / (p.mass * p.gravity),
        peak_friction_torque_N_m=float(np.abs(f).max(initial=0.0)))
