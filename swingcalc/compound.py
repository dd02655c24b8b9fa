"""A body in its place: gravity, the air and temperature acting on a compound pendulum.

:func:`compound_pendulum` reduces a :class:`~swingcalc.body.Body` in an environment to the
numbers every later calculation uses: the restoring moment (less the air's buoyancy), the
inertia about the pivot (plus the air dragged along), the quadratic-drag coefficient of
its parts, and the small-angle period, with the shift from each air effect shown apart.
:func:`thermal_rate` gives the rate change with temperature and, for a design of two or
more materials, how well it is compensated.

Method notes: ``docs/methods/compound-pendulum.md``, ``docs/methods/air.md``,
``docs/methods/temperature.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

from ._validate import amplitude_scalar, real_scalar
from .body import Body, scaled_for_temperature
from .constants import ISA_SEA_LEVEL_VISCOSITY, SECONDS_PER_DAY, STANDARD_GRAVITY
from .errors import MISSING, InvalidInput

#: Gravity the model accepts [m/s^2]: from a small moon's to far past Jupiter's 24.8
#: (outside it the results are not what anyone means, and the numbers overflow).
GRAVITY_RANGE = (0.01, 1000.0)
#: Viscosity of air used when none is given [Pa s]: ISA sea level (ISO 2533).
AIR_VISCOSITY = ISA_SEA_LEVEL_VISCOSITY

__all__ = ["AIR_VISCOSITY", "AirTerms", "CompoundPendulum", "ThermalRate", "compound_pendulum",
           "GRAVITY_RANGE", "air_terms", "rebuilt", "thermal_rate"]


_PER_PART = ("part", "buoyancy_moment_N_m", "added_inertia_kg_m2", "drag_coefficient_N_m_s2",
             "flow", "drag_cd", "added_volume_m3")


@dataclass(frozen=True)
class AirTerms:
    """What the air does to a body: SI values."""

    air_density_kg_m3: float
    buoyancy_moment_N_m: float       # reduction of the restoring moment (rho V d g summed)
    added_inertia_kg_m2: float       # air carried along, about the pivot
    drag_coefficient_N_m_s2: float   # D in the drag torque -D omega |omega|
    per_part: tuple                  # per part: _PER_PART (flow: the fluids row used)

    def to_dict(self) -> dict:
        d = dict(self.__dict__)
        d["per_part"] = [dict(zip(_PER_PART, row)) for row in self.per_part]
        return d


def air_terms(body: Body, air_density: float, gravity: float = STANDARD_GRAVITY,
              air_viscosity: float = AIR_VISCOSITY, angular_speed: float | None = None
              ) -> AirTerms:
    """Buoyancy, added inertia and quadratic drag of each part of ``body`` in air.

    Parameters
    ----------
    body : Body
    air_density : float
        [kg/m^3]; 0 for a vacuum.
    gravity : float
        [m/s^2], for the buoyancy.
    air_viscosity : float
        [Pa s], for the skin friction of parts that move edgewise.
    angular_speed : float, optional
        Peak angular speed [rad/s] of the swing the drag is for: it sets the Reynolds
        number of the skin friction (default Re = 1e4 when not given).

    Notes
    -----
    Buoyancy: the displaced air's weight acts up at each part's centroid, so the restoring
    moment loses rho g V_i h_i, with h_i the part's distance from the pivot along the line
    through the centre of mass (the hanging direction). Added mass: a part moving at
    omega r_i carries an added mass C_a rho V_i (or a given added mass for thin shapes),
    which adds C_a rho V_i (r_i^2 + l_i^2/12) to the inertia, l_i its length along the arm
    when it moves sideways along its length. Drag: a compact part meets the air with
    0.5 rho C_d A_i (omega r_i)^2 at the arm r_i, a torque D_i omega |omega| with
    D_i = 0.5 rho C_d A_i r_i^3; a part spread along the arm integrates its width:
    D_i = 0.5 rho C_d w_i int |s|^3 ds. The coefficients and their sources:
    :mod:`swingcalc.fluids`.
    """
    rho = real_scalar(air_density, "air density", "a finite density >= 0 [kg/m^3]", low=0.0,
                      high=50.0)
    mu = real_scalar(air_viscosity, "air viscosity", "a finite viscosity > 0 [Pa s]",
                     low=1e-7, high=1e-3)
    cos_t, sin_t = math.cos(body.hang_tilt_rad), math.sin(body.hang_tilt_rad)
    rows = []
    for p in body.parts:
        s, u = p.centre_along_m, p.centre_across_m
        r2 = s * s + u * u
        c = _air_model(p, rho, mu, angular_speed)
        length = p.extent_along_m if c.spread_along_arm else 0.0
        added = rho * c.added_volume_m3 * (r2 + length * length / 12.0)
        if c.spread_along_arm:
            lo, hi = s - 0.5 * length, s + 0.5 * length
            drag = 0.5 * rho * c.drag_coefficient * c.drag_area_m2 * _abs_cube_integral(lo, hi)
        else:
            drag = 0.5 * rho * c.drag_coefficient * c.drag_area_m2 * math.sqrt(r2) ** 3
        moment_arm = s * cos_t + u * sin_t
        rows.append((p.name, rho * gravity * p.volume_m3 * moment_arm, added, drag,
                     " ".join(x for x in c.flow if x), c.drag_coefficient,
                     c.added_volume_m3))
    return AirTerms(air_density_kg_m3=rho,
                    buoyancy_moment_N_m=sum(r[1] for r in rows),
                    added_inertia_kg_m2=sum(r[2] for r in rows),
                    drag_coefficient_N_m_s2=sum(r[3] for r in rows),
                    per_part=tuple(rows))


def _abs_cube_integral(lo: float, hi: float) -> float:
    """int_lo^hi |s|^3 ds."""
    def f(x):
        return math.copysign(x ** 4, x) / 4.0
    return f(hi) - f(lo)


@dataclass(frozen=True)
class CompoundPendulum:
    """A body swinging in its environment, reduced to the numbers the swing needs.

    ``restoring_moment_N_m`` is M in the equation I theta'' = -M sin(theta): m g d less
    the buoyancy; ``inertia_kg_m2`` includes the air carried along. The period shifts
    are relative to the same body in a vacuum; a rate is in seconds per day, positive
    when the clock gains.
    """

    body: Body
    gravity_m_s2: float
    air: AirTerms
    air_viscosity_Pa_s: float
    drag_amplitude_rad: float | None
    restoring_moment_N_m: float
    inertia_kg_m2: float
    natural_angular_frequency_rad_s: float
    small_angle_period_s: float
    vacuum_small_angle_period_s: float
    buoyancy_period_shift_rel: float
    added_mass_period_shift_rel: float
    buoyancy_rate_s_per_day: float
    added_mass_rate_s_per_day: float

    @property
    def mass_kg(self) -> float:
        return self.body.mass_kg

    @property
    def com_distance_m(self) -> float:
        return self.body.com_distance_m

    def to_dict(self) -> dict:
        d = {k: v for k, v in self.__dict__.items() if k not in ("body", "air")}
        d["air"] = self.air.to_dict()
        return d


def compound_pendulum(body: Body, gravity: float = STANDARD_GRAVITY,
                      air_density: float = 0.0, air_viscosity: float = AIR_VISCOSITY,
                      amplitude: float | None = None) -> CompoundPendulum:
    """The small-angle model of ``body`` at ``gravity`` [m/s^2] in air of ``air_density``
    [kg/m^3] (0: a vacuum) and ``air_viscosity`` [Pa s].

    ``amplitude`` [rad], when given, is the swing the drag coefficient is evaluated for
    (it sets the skin friction's Reynolds number; see :func:`air_terms`).

    Notes
    -----
    T0 = 2 pi sqrt(I_eff / M), I_eff = I_O + added inertia, M = g (m d - sum rho V_i h_i).
    Each air effect's shift is the ratio with only that effect applied:
    sqrt(M_vac / M) - 1 for buoyancy, sqrt(I_eff / I_O) - 1 for the added mass; a rate
    change is -86400 shift / (1 + shift) s/day (the clock loses what its period gains).

    Examples
    --------
    >>> from swingcalc.body import assemble, point_bob
    >>> p = compound_pendulum(assemble(*point_bob(0.25 / math.pi**2 * 9.80665, 1.0)))
    >>> round(p.small_angle_period_s, 12)    # a 1 s pendulum at standard gravity
    1.0
    """
    g = real_scalar(gravity, "gravity", f"an acceleration in [{GRAVITY_RANGE[0]:g}, "
                    f"{GRAVITY_RANGE[1]:g}] m/s^2", low=GRAVITY_RANGE[0], high=GRAVITY_RANGE[1])
    m_vac = body.mass_kg * g * body.com_distance_m
    speed = None
    if amplitude is not None:
        speed = 2.0 * math.sqrt(m_vac / body.inertia_pivot_kg_m2) * math.sin(
            0.5 * amplitude_scalar(amplitude))
    air = air_terms(body, air_density, g, air_viscosity, speed)
    moment = m_vac - air.buoyancy_moment_N_m
    if not moment > 0.0:
        raise InvalidInput("parts", MISSING,
                           "parts heavier than the air they displace (check the volumes and "
                           "densities given)",
                           f"the buoyancy of {body.volume_m3:.6g} m^3 in air of "
                           f"{air.air_density_kg_m3:.6g} kg/m^3 cancels the weight's "
                           "restoring moment")
    inertia = body.inertia_pivot_kg_m2 + air.added_inertia_kg_m2
    t_vac = 2.0 * math.pi * math.sqrt(body.inertia_pivot_kg_m2 / m_vac)
    shift_b = math.sqrt(m_vac / moment) - 1.0
    shift_a = math.sqrt(inertia / body.inertia_pivot_kg_m2) - 1.0
    omega0 = math.sqrt(moment / inertia)
    return CompoundPendulum(
        body=body, gravity_m_s2=g, air=air, air_viscosity_Pa_s=air_viscosity,
        drag_amplitude_rad=amplitude, restoring_moment_N_m=moment,
        inertia_kg_m2=inertia, natural_angular_frequency_rad_s=omega0,
        small_angle_period_s=2.0 * math.pi * math.sqrt(inertia / moment),
        vacuum_small_angle_period_s=t_vac,
        buoyancy_period_shift_rel=shift_b, added_mass_period_shift_rel=shift_a,
        buoyancy_rate_s_per_day=_rate(shift_b), added_mass_rate_s_per_day=_rate(shift_a))


def rebuilt(pend: CompoundPendulum, body: Body, gravity: float | None = None
            ) -> CompoundPendulum:
    """``pend``'s environment applied to another body (a changed part, another
    temperature), optionally at another ``gravity`` [m/s^2]."""
    return compound_pendulum(body, pend.gravity_m_s2 if gravity is None else gravity,
                             pend.air.air_density_kg_m3, pend.air_viscosity_Pa_s,
                             pend.drag_amplitude_rad)


def _rate(shift: float) -> float:
    return -SECONDS_PER_DAY * shift / (1.0 + shift)


@dataclass(frozen=True)
class ThermalRate:
    """Rate change of a clock with temperature [s/day per K], positive when it gains as
    it warms; ``plain_rate`` is the same body made all of the arm's material, and
    ``compensation`` = 1 - rate / plain_rate (1 = fully compensated, 0 = not at all)."""

    rate_s_per_day_per_K: float
    plain_rate_s_per_day_per_K: float
    compensation: float | None
    period_change_rel_per_K: float

    def to_dict(self) -> dict:
        return dict(self.__dict__)


def thermal_rate(pendulum: CompoundPendulum) -> ThermalRate:
    """Rate change per kelvin of ``pendulum`` [s/day/K].

    Notes
    -----
    The body is rebuilt 0.5 K above and below the temperature its sizes were given at
    (:func:`swingcalc.body.scaled_for_temperature`: each part grows by its own
    coefficient about its mounting point, which moves with the arm), and the rate change
    is the central difference of the small-angle period: -86400 (dT/dtheta)/T s/day/K.
    Its truncation error is O((alpha dT)^2) ~ 1e-10 relative of the rate, far below the
    spread of published expansion coefficients. Amplitude is held fixed: the circular error does not change with temperature.
    A simple pendulum gives -alpha/2 * 86400 s/day/K.
    """
    body = pendulum.body
    parts = body.inputs

    def period(delta, plain=False):
        src = parts
        if plain:
            src = tuple(replace(p, expansion=body.arm_expansion_per_K) for p in parts)
        b = scaled_for_temperature(body, delta, src)
        return rebuilt(pendulum, b).small_angle_period_s

    h = 0.5
    t0 = pendulum.small_angle_period_s
    dt = (period(h) - period(-h)) / (2.0 * h) / t0
    dplain = (period(h, True) - period(-h, True)) / (2.0 * h) / t0
    rate = -SECONDS_PER_DAY * dt
    plain = -SECONDS_PER_DAY * dplain
    comp = None if plain == 0.0 else 1.0 - rate / plain
    return ThermalRate(rate_s_per_day_per_K=rate, plain_rate_s_per_day_per_K=plain,
                       compensation=comp, period_change_rel_per_K=dt)


@dataclass(frozen=True)
class _AirModel:
    added_volume_m3: float      # added mass / fluid density
    drag_coefficient: float
    drag_area_m2: float         # reference area (compact part) or width per length (spread)
    spread_along_arm: bool
    flow: tuple = ("", "")      # (shape, direction) of the swingcalc.fluids rows used


_EDGE_RE = (1e3, 5e5)           # the laminar skin-friction range of fluids.friction_drag_...
_DEFAULT_RE = 1e4


def _reynolds(length, speed, rho, mu):
    """Reynolds number for skin friction, kept inside the laminar law's range."""
    if speed is None or rho == 0.0:
        return _DEFAULT_RE
    re = rho * speed * length / mu
    return min(max(re, _EDGE_RE[0]), _EDGE_RE[1])


def _air_model(p, rho, mu, angular_speed) -> _AirModel:
    """How one part meets the air when it moves sideways (along u): its added volume,
    drag coefficient and reference area, from :mod:`swingcalc.fluids`.

    Parts moving edgewise (a plate in the swing plane, a flat bar) have skin friction on
    their faces, at the Reynolds number of the part's peak speed, plus the form drag of
    their blunt edge; a lens bob's sharp rim has skin friction only (a lower bound). A
    cylinder moving across its axis carries the added mass of the spheroid of the same
    proportions (the 2-D value when slender, little for a squat drum)."""
    from . import fluids as f

    sz, o = p.size_m, p.orientation
    speed = None if angular_speed is None else angular_speed * math.hypot(
        p.centre_along_m, p.centre_across_m)

    flat = "disc" if p.shape == "disc" else "plate"

    def friction(area, length):
        # skin friction on one face's area plus the blunt edge's form drag, both on the
        # face area: C_d = C_f + C_edge (edge area / face area)
        cf = f.friction_drag_coefficient(_reynolds(length, speed, rho, mu))
        edge = f.EDGE_FORM_DRAG_COEFFICIENT * p.frontal_area_m2 / area
        return _AirModel(0.0, cf + edge, area, False, (flat, "edgewise"))

    def across_axis(radius, length, area, spread):
        # a finite cylinder moving across its axis carries the spheroid's share of its
        # volume (-> 1, the 2-D value, when slender; small for a squat drum): the
        # spheroid of the same proportions stands in for the cylinder (our approximation)
        # (the coefficient's table stops at aspect 1e6, where it is 1 to 1e-11)
        ca = f.spheroid_added_mass_coefficient(min(max(length / (2.0 * radius), 1e-6), 1e6),
                                               "across")
        volume = math.pi * radius * radius * length
        cd = f.drag_coefficient("cylinder", "across",
                                aspect_ratio=max(length / (2.0 * radius), 1.0))
        return _AirModel(ca * volume, cd, area, spread, ("cylinder", "across"))

    if p.shape in ("rod", "tube"):
        d = sz.get("diameter", sz.get("outer_diameter"))
        return across_axis(0.5 * d, sz["length"], d, True)
    if p.shape == "flat_bar":
        # per length along the arm: both faces' friction on the width, the edge's form
        # drag on the thickness
        re = _reynolds(sz["width"], speed, rho, mu)
        width = (f.friction_drag_coefficient(re) * sz["width"]
                 + f.EDGE_FORM_DRAG_COEFFICIENT * sz["thickness"])
        return _AirModel(0.0, 1.0, width, True, ("plate", "edgewise"))
    if p.shape == "plate":
        w, h = sz["width"], sz["height"]
        if o == "swing":
            return _AirModel(f.added_mass("plate", "broadside", 1.0, length=h, width=w),
                             f.drag_coefficient("plate", "broadside",
                                                aspect_ratio=max(w, h) / min(w, h)),
                             w * h, False, ("plate", "broadside"))
        return friction(w * h, w)
    if p.shape == "disc":
        r = 0.5 * sz["diameter"]
        if o == "swing":
            return _AirModel(f.added_mass("disc", "broadside", 1.0, radius=r),
                             f.drag_coefficient("disc", "broadside"), math.pi * r * r, False,
                             ("disc", "broadside"))
        return friction(math.pi * r * r, 2.0 * r)
    if p.shape == "cylinder":
        r, length = 0.5 * sz["diameter"], sz["length"]
        if o == "swing":
            return _AirModel(f.added_mass("cylinder", "along", 1.0, radius=r),
                             f.drag_coefficient("cylinder", "along",
                                                aspect_ratio=min(max(length / (2 * r), 0.5),
                                                                 8.0)),
                             math.pi * r * r, False, ("cylinder", "along"))
        return across_axis(r, length, 2.0 * r * length, False)
    if p.shape == "sphere":
        r = 0.5 * sz["diameter"]
        return _AirModel(f.added_mass("sphere", None, 1.0, radius=r),
                         f.drag_coefficient("sphere"), math.pi * r * r, False,
                         ("sphere", "any"))
    if p.shape == "lens":
        r, thick = 0.5 * sz["diameter"], sz["thickness"]
        if o == "swing":
            return _AirModel(f.added_mass("lens", "broadside", 1.0, radius=r, thickness=thick),
                             f.drag_coefficient("lens", "broadside"), math.pi * r * r, False,
                             ("lens", "broadside"))
        return _AirModel(f.added_mass("lens", "edgewise", 1.0, radius=r, thickness=thick),
                         f.friction_drag_coefficient(_reynolds(2 * r, speed, rho, mu)),
                         math.pi * r * r, False, ("lens", "edgewise"))
    return _AirModel(0.0, 0.0, 0.0, False)      # point, custom, suspension line
