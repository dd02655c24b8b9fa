"""Sizing: the inverse problems of a pendulum design.

- the length (simple pendulum) or a part's position on the arm (compound) that gives a
  target period at the working amplitude, not at zero amplitude;
- the drop angle for a target energy, or a striking speed at a radius;
- the largest amplitude that keeps a peak load, acceleration or speed under a limit;
- the sensitivity of the period to each input, and the rating adjustment of a clock.

Method notes: ``docs/methods/sizing.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

from ._validate import amplitude_scalar, positive_scalar
from .body import with_parts
from .compound import CompoundPendulum, rebuilt
from .constants import SECONDS_PER_DAY
from .errors import InvalidInput, SolverFailure, suggest
from .kernels import swing as _k
from .loads import peak

__all__ = ["SUSPENSION", "PositionSolution", "Sensitivity", "length_for_period", "position_for_period",
           "drop_angle_for_energy", "drop_angle_for_speed", "max_amplitude_for_limit",
           "period_at", "sensitivities", "rating_adjustment", "LIMIT_QUANTITIES"]

_XTOL = 1e-15


def _ratio(amplitude: float) -> float:
    m, p = (float(v) for v in _k.amplitude_parameters(amplitude))
    return 1.0 + float(_k.period_excess(m, p))


def period_at(pend: CompoundPendulum, amplitude: float) -> float:
    """Period [s] of ``pend`` at ``amplitude`` [rad]: T0 (2/pi) K(sin^2(A/2))."""
    return pend.small_angle_period_s * _ratio(amplitude_scalar(amplitude))


def length_for_period(period, amplitude, gravity) -> float:
    """Simple-pendulum length [m] whose period at ``amplitude`` [rad] is ``period`` [s].

    Notes
    -----
    T = 2 pi sqrt(L/g) R(A), R = (2/pi) K(sin^2(A/2)), so L = g (T / (2 pi R(A)))^2
    exactly: no iteration. At zero amplitude and T = 2 s this is the seconds pendulum,
    g / pi^2 = 0.993621 m at standard gravity.

    Examples
    --------
    >>> round(length_for_period(2.0, 0.0, 9.80665), 9)
    0.993621386
    """
    t = positive_scalar(period, "target period", "s")
    a = amplitude_scalar(amplitude)
    g = positive_scalar(gravity, "gravity", "m/s^2")
    return g * (t / (2.0 * math.pi * _ratio(a))) ** 2


@dataclass(frozen=True)
class PositionSolution:
    """Where to put a part (and the parts that move with it) so the period at the working
    amplitude is the target. Positions are of the first part moved, as its ``at`` point."""

    parts: tuple                # the parts moved together (the first one is reported)
    position_m: float           # the first part's position along the arm
    centre_m: float             # its centroid there
    period_s: float             # recomputed at the solution
    target_period_s: float
    amplitude_rad: float
    move_m: float               # position - the given position (positive: away from pivot)
    other_positions_m: tuple    # other positions in the range with the same period

    def to_dict(self) -> dict:
        d = dict(self.__dict__)
        d["parts"] = list(self.parts)
        d["other_positions_m"] = list(self.other_positions_m)
        return d


#: The name that moves a flexible suspension's end: the line lengthens and every part
#: hangs lower by the same distance (how a pendulum damper or a hung load is tuned).
SUSPENSION = "suspension"


def _names(body, parts) -> tuple:
    """The parts to move, as a tuple of names (one name or several), checked."""
    names = (parts,) if isinstance(parts, str) else tuple(parts)
    known = [p.name for p in body.reference]
    if body.suspension.flexible:
        known.append(SUSPENSION)
    if SUSPENSION in names and len(names) > 1:
        raise InvalidInput("part", parts, f"'{SUSPENSION}' alone (it moves every part)")
    for n in names:
        if n not in known:
            raise InvalidInput("part", n, "one of " + ", ".join(known), "no such part")
    if not names or len(set(names)) != len(names):
        raise InvalidInput("part", parts, "one or more different part names")
    return names


def _moved(body, names: tuple, shift: float):
    """The body with the named parts moved by ``shift`` [m] along the arm (for
    :data:`SUSPENSION`: the line lengthened by it and every part lowered with it)."""
    if names == (SUSPENSION,):
        susp = body.reference_suspension or body.suspension
        parts = tuple(replace(p, position=p.position + shift) for p in body.reference)
        return with_parts(body, parts, replace(susp, length=susp.length + shift))
    parts = tuple(replace(p, position=p.position + shift) if p.name in names else p
                  for p in body.reference)
    return with_parts(body, parts)


def _position(body, name: str) -> float:
    if name == SUSPENSION:
        return (body.reference_suspension or body.suspension).length
    return next(p for p in body.reference if p.name == name).position


def position_for_period(pend: CompoundPendulum, part, target_period: float,
                        amplitude: float, lowest=None, highest=None) -> PositionSolution:
    """Position of ``part`` along the arm that gives ``target_period`` [s] at ``amplitude``.

    Parameters
    ----------
    pend : CompoundPendulum
        The design as it is (its body remembers its parts).
    part : str or sequence of str
        The part to move (a bob on its rod, a sliding weight), or several parts moved
        together by the same distance (a bob and the rating nut it rests on), or
        :data:`SUSPENSION` to lengthen a flexible suspension with the payload on it
        (the position is then the suspension's length).
    target_period : float
        [s].
    amplitude : float
        Working amplitude [rad].
    lowest, highest : float, optional
        Range of the first part's position [m] to search; default: as far above the
        pivot as below it, out to twice the present position or the body's reach,
        whichever is further (positions where the body would not hang are skipped).

    Notes
    -----
    The period of a compound pendulum as a function of one mass's position has a
    minimum (where the equivalent length is least), so a target can have two solutions
    or none. The range is scanned on 200 points for sign changes of T(x) - target; each
    is solved with Brent's method to the float, and the one nearest the present position
    is returned (the others are listed). The period is recomputed at the solution.
    """
    t = positive_scalar(target_period, "target period", "s")
    a = amplitude_scalar(amplitude)
    body = pend.body
    names = _names(body, part)
    now = _position(body, names[0])
    reach = max(max(abs(p.centre_along_m) + 0.5 * p.extent_along_m for p in body.parts),
                2.0 * abs(now))
    lo = -reach if lowest is None else float(lowest)
    hi = reach if highest is None else float(highest)
    if not (math.isfinite(lo) and math.isfinite(hi) and lo < hi):
        raise InvalidInput("position range", (lowest, highest), "a finite range low < high [m]",
                           "the search range is empty")
    ratio = _ratio(a)

    def excess(x):
        try:
            b = _moved(body, names, x - now)
        except InvalidInput:
            return math.nan
        return rebuilt(pend, b).small_angle_period_s * ratio - t

    from scipy.optimize import brentq

    n = 200
    xs = [lo + (hi - lo) * i / n for i in range(n + 1)]
    fs = [excess(x) for x in xs]
    roots = []
    for x0, x1, f0, f1 in zip(xs, xs[1:], fs, fs[1:]):
        if math.isnan(f0) or math.isnan(f1):
            continue
        if f0 == 0.0:
            roots.append(x0)
        elif f0 * f1 < 0.0:
            roots.append(brentq(excess, x0, x1, xtol=_XTOL * max(abs(x0), abs(x1)),
                                rtol=8.9e-16, maxiter=200))
    if fs[-1] == 0.0:
        roots.append(xs[-1])
    what = "', '".join(names)
    if not roots:
        finite = [f + t for f in fs if not math.isnan(f)]
        raise InvalidInput("target period", t,
                           f"a period between {min(finite):.9g} and {max(finite):.9g} s "
                           f"(what '{names[0]}' reaches in [{lo:.6g}, {hi:.6g}] m)"
                           if finite else "a period the part can reach",
                           f"no position of '{what}' gives it")
    best = min(roots, key=lambda x: abs(x - now))
    b = _moved(body, names, best - now)
    period = rebuilt(pend, b).small_angle_period_s * ratio
    centre = b.suspension.length if names[0] == SUSPENSION else b.part(names[0]).centre_along_m
    return PositionSolution(parts=names, position_m=best, centre_m=centre, period_s=period,
                            target_period_s=t, amplitude_rad=a, move_m=best - now,
                            other_positions_m=tuple(x for x in roots if x != best))


def drop_angle_for_energy(pend: CompoundPendulum, energy) -> float:
    """Drop angle [rad] from the hanging position that gives ``energy`` [J] at the bottom.

    M (1 - cos alpha) = E, solved as alpha = 2 asin(sqrt(E / 2M)) (no cancellation for
    small E). E may be at most the separatrix energy 2M (a drop from the top).
    """
    e = positive_scalar(energy, "target energy", "J")
    M = pend.restoring_moment_N_m
    if e > 2.0 * M:
        raise InvalidInput("target energy", e, f"an energy up to 2 M = {2.0 * M:.6g} J (a "
                           "drop from the top)", "more than a drop from the top gives")
    return 2.0 * math.asin(math.sqrt(e / (2.0 * M)))


def drop_angle_for_speed(pend: CompoundPendulum, speed, radius) -> float:
    """Drop angle [rad] for a striking ``speed`` [m/s] of the point at ``radius`` [m]:
    (1/2) I (v/r)^2 = M (1 - cos alpha)."""
    v = positive_scalar(speed, "striking speed", "m/s")
    r = positive_scalar(radius, "strike radius", "m")
    energy = 0.5 * pend.inertia_kg_m2 * (v / r) ** 2
    M = pend.restoring_moment_N_m
    if energy > 2.0 * M:
        vmax = 2.0 * math.sqrt(M / pend.inertia_kg_m2) * r
        raise InvalidInput("striking speed", v, f"a speed up to {vmax:.6g} m/s at {r:.6g} m "
                           "(a drop from the top)", "more than a drop from the top gives")
    return drop_angle_for_energy(pend, energy)


#: Peak quantities a limit may be set on (keys of SwingLoads.peaks, or of a named point).
LIMIT_QUANTITIES = ("reaction_N", "arm_tension_N", "angular_speed_rad_s",
                    "angular_acceleration_rad_s2")
_POINT_LIMITS = ("speed_m_s", "felt_g", "felt_normal_g", "felt_tangential_g")


def _peak_value(pend, amplitude, quantity, points) -> float:
    return abs(peak(pend, amplitude, quantity, points).value)


def max_amplitude_for_limit(pend: CompoundPendulum, quantity: str, limit,
                            points=None) -> float:
    """Largest amplitude [rad] at which the peak of ``quantity`` stays at or under ``limit``.

    Parameters
    ----------
    quantity : str
        One of :data:`LIMIT_QUANTITIES`, or ``"<point>.speed_m_s"``, ``"<point>.felt_g"``
        (and the felt normal and tangential parts) for a named point.
    limit : float
        In the quantity's SI unit (g for the felt accelerations).
    points : mapping name -> (along, across), optional

    Notes
    -----
    Each of these peaks grows with the amplitude (more energy, faster and harder swing),
    so the answer is the root of peak(A) = limit, found with Brent's method on
    [0, pi): exact to the float. A limit below the value at rest (the pivot's static
    load, 1 g felt) cannot be met by any swing; a limit above the peak just short of
    the top is met by every libration, and pi is reported as the bound. On a flexible
    suspension the search stops at 90 deg, where it would go slack; pi/2 is reported
    when the limit is not reached below that.
    """
    points = dict(points or {})
    names = set(LIMIT_QUANTITIES) | {f"{p}.{q}" for p in points for q in _POINT_LIMITS}
    if quantity not in names:
        raise InvalidInput("limit quantity", quantity, ", ".join(sorted(names)),
                           f"not a limited quantity{suggest(quantity, names)}")
    lim = positive_scalar(limit, "limit", "SI unit of the quantity")
    flexible = pend.body.suspension.flexible
    # A flexible suspension goes slack beyond 90 deg: no swing past that is valid.
    top = 0.5 * math.pi if flexible else math.nextafter(math.pi, 0.0)
    f0 = _peak_value(pend, 0.0, quantity, points)
    if f0 > lim:
        raise InvalidInput("limit", lim, f"a limit above the value at rest ({f0:.6g})",
                           "even a body at rest exceeds it")
    f_top = _peak_value(pend, top, quantity, points)
    if f_top <= lim:
        return top if flexible else math.pi
    from scipy.optimize import brentq

    try:
        return brentq(lambda a: _peak_value(pend, a, quantity, points) - lim, 0.0, top,
                      xtol=1e-14, rtol=8.9e-16, maxiter=200)
    except (RuntimeError, ValueError) as exc:  # pragma: no cover - bracketed above
        raise SolverFailure(f"largest amplitude for the {quantity} limit: {exc}") from None


@dataclass(frozen=True)
class Sensitivity:
    """The period's sensitivity to one input: dT/dx [s per SI unit of x], the relative
    sensitivity (x/T) dT/dx, and the clock rate change per unit of x [s/day per unit]."""

    input: str
    value: float
    unit: str
    period_per_unit: float
    relative: float
    rate_s_per_day_per_unit: float

    def to_dict(self) -> dict:
        return dict(self.__dict__)


_REL_STEP = 1e-5


def sensitivities(pend: CompoundPendulum, amplitude: float) -> tuple:
    """Sensitivity of the period at ``amplitude`` to every size, position and mass of the
    parts, to gravity, and to the amplitude itself.

    Notes
    -----
    Central differences of the recomputed period with a relative step of 1e-5: the
    truncation error is ~1e-10 of the derivative; the rounding is ~eps / (1e-5 s) for a
    relative sensitivity s, so ~1e-11 for a length and up to ~1e-7 for the amplitude at a
    clock's few degrees (s ~ 1e-4; measured 3e-8 to 8e-8 against mpmath), far below any
    design tolerance. The amplitude's sensitivity is the circular error's slope.
    """
    a = amplitude_scalar(amplitude)
    body = pend.body
    g = pend.gravity_m_s2
    ratio = _ratio(a)
    t0 = pend.small_angle_period_s * ratio
    out = []

    def period_with(parts=None, gravity=g, amp=a):
        b = body if parts is None else with_parts(body, parts)
        p = rebuilt(pend, b, gravity)
        return p.small_angle_period_s * (ratio if amp == a else _ratio(amp))

    def period_at_body(b):
        return rebuilt(pend, b).small_angle_period_s * ratio

    def diff(label, unit, x, f):
        h = _REL_STEP * (abs(x) if x else 1e-3)
        try:
            d = (f(x + h) - f(x - h)) / (2.0 * h)
        except InvalidInput:
            return
        out.append(Sensitivity(label, x, unit, d, d * x / t0, -SECONDS_PER_DAY * d / t0))

    ref = body.reference
    for i, p in enumerate(ref):
        for label, unit, x, change in _part_inputs(body, p):
            diff(f"part.{p.name}.{label}", unit, x,
                 lambda v, i=i, p=p, change=change: period_with(
                     ref[:i] + (replace(p, **change(v)),) + ref[i + 1:]))
    susp = body.reference_suspension or body.suspension
    if susp.flexible:
        diff("suspension.length", "m", susp.length,
             lambda x: period_at_body(_moved(body, (SUSPENSION,), x - susp.length)))
        if susp.mass_per_length > 0:
            diff("suspension.mass_per_length", "kg/m", susp.mass_per_length,
                 lambda x: period_at_body(with_parts(body, body.reference,
                                                     replace(susp, mass_per_length=x))))
    diff("environment.gravity", "m/s^2", g, lambda x: period_with(gravity=x))
    if a > 0.0:
        diff("swing.amplitude", "rad", a, lambda x: period_with(amp=x))
    return tuple(out)


def _part_inputs(body, p):
    """(label, unit, value, change) for each input of part ``p``: change(v) gives the
    dataclass fields that set that input to v."""
    out = [(p.at, "m", p.position, lambda v: {"position": v})]
    for key, v in p.size.items():
        if key == "inner_diameter" and v == 0.0:
            continue
        out.append((key, "m", v, lambda x, key=key: {"size": {**p.size, key: x}}))
    # A shaped part's mass is then given outright (its density no longer sets it); a
    # point or custom part keeps its density, which sets its displaced volume.
    keep = p.density if p.shape in ("point", "custom") else None
    out.append(("mass", "kg", body.part(p.name).mass_kg,
                lambda v: {"mass": v, "density": keep}))
    return out


def rating_adjustment(pend: CompoundPendulum, part, amplitude: float,
                      nut_pitch=None) -> dict:
    """How a clock's rate changes as ``part`` (the bob, or the bob with its rating nut:
    a name or several names moved together) moves along the arm.

    Returns ``{"rate_s_per_day_per_mm": ..., "rate_s_per_day_per_turn": ... or None}``:
    the rate change for 1 mm of travel away from the pivot (negative: the clock loses),
    and for one turn of a rating nut of ``nut_pitch`` [m] that lowers the parts by one
    pitch. Central difference of the recomputed period (step 1e-5 of the period's scale
    length; see :func:`sensitivities` for its error).
    """
    a = amplitude_scalar(amplitude)
    body = pend.body
    names = _names(body, part)
    ratio = _ratio(a)
    t0 = pend.small_angle_period_s * ratio
    h = _REL_STEP * body.equivalent_length_m

    def period(shift):
        return rebuilt(pend, _moved(body, names, shift)).small_angle_period_s * ratio

    per_m = -SECONDS_PER_DAY * (period(h) - period(-h)) / (2.0 * h) / t0
    per_turn = None
    if nut_pitch is not None:
        per_turn = per_m * positive_scalar(nut_pitch, "nut pitch", "m")
    return {"rate_s_per_day_per_mm": per_m * 1e-3, "rate_s_per_day_per_turn": per_turn}
