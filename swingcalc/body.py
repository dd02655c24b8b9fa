"""Compound pendulums from parts: mass, centre of mass, inertia about the pivot, equivalent
length, centre of percussion, and the length change of each part with temperature.

Frame: the pivot axis is z. In the swing plane, ``s`` runs along the arm (downward from
the pivot when the body hangs at rest; a part above the pivot, such as a counterweight,
has s < 0) and ``u`` across it. Each part is placed by its centroid ``(s, u)`` and has a
shape from :mod:`swingcalc.kernels.inertia` (its own inertia about its centroid) or is a
custom part with a given mass, position and inertia.

Method notes: ``docs/methods/compound-pendulum.md`` and ``docs/methods/parts.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, replace

from ._validate import finite_result, positive_scalar, real_scalar
from .errors import MISSING, InvalidInput, suggest
from .kernels import inertia as _shape

__all__ = ["SHAPE_SIZES", "ORIENTATIONS", "MOUNTS", "PIVOT_KINDS", "SUSPENSION_KINDS", "Part",
           "Pivot", "Suspension", "resolve_part", "with_parts",
           "PartProperties", "Body", "assemble", "point_bob", "scaled_for_temperature"]

#: The size parameters [m] of each shape, in the order the shape kernel takes them.
#: Parameters marked optional have a default (a solid sphere has inner_diameter 0).
SHAPE_SIZES = {
    "rod": ("length", "diameter"),
    "tube": ("length", "outer_diameter", "inner_diameter"),
    "flat_bar": ("length", "width", "thickness"),
    "plate": ("width", "height", "thickness"),
    "disc": ("diameter", "thickness"),
    "cylinder": ("diameter", "length"),
    "sphere": ("diameter", "inner_diameter"),
    "lens": ("diameter", "thickness"),
    "point": (),
    "custom": (),
}
_OPTIONAL_SIZES = {("sphere", "inner_diameter"): 0.0}
#: Orientation keyword of each shape that has one, its allowed values (from the shape
#: kernel) and its default: "pivot" = along the pivot axis z, "swing" = along u (the
#: direction of motion at the bottom), "arm" = along s.
ORIENTATIONS = {
    shape: (keyword, _shape.ORIENTATIONS[shape], _shape.ORIENTATIONS[shape][0])
    for shape, keyword in (("plate", "normal"), ("disc", "axis"), ("cylinder", "axis"),
                           ("lens", "axis"))
}
#: Where a part is held on the arm; with temperature that point moves with the arm and
#: the part grows from it (a bob resting on a rating nut is held at its "bottom").
MOUNTS = ("centre", "top", "bottom")
#: Kinds of pivot: a knife edge (no friction torque modelled), a pin of a radius with a
#: friction coefficient, a given constant friction torque.
PIVOT_KINDS = ("knife-edge", "pin", "torque")
#: Kinds of suspension. "rigid": the arm is made of the parts themselves. The others are
#: flexible (tension only) and carry a mass per length.
SUSPENSION_KINDS = ("rigid", "chain", "rope", "cable")


@dataclass(frozen=True)
class Part:
    """One part of a swinging body, in SI units.

    Parameters
    ----------
    name : str
        The part's name in reports and error messages.
    shape : str
        A key of :data:`SHAPE_SIZES`.
    position : float
        Pivot to the part's centroid (or its top or bottom, see ``at``) along the arm [m]
        (s; negative above the pivot).
    size : dict
        The shape's size parameters [m] (see :data:`SHAPE_SIZES`).
    at : str
        Which point of the part ``position`` gives: "centre", "top" (the end nearer the
        pivot side, smaller s) or "bottom".
    orientation : str, optional
        For a plate (its normal), a disc, a cylinder or a lens (its axis): "pivot",
        "swing" or "arm" (see :data:`ORIENTATIONS`).
    across : float
        Offset of the centroid across the arm [m] (u).
    mass : float, optional
        Mass [kg]. Either a mass or a density (or a material's density) is needed for a
        shape with volume; a point or custom part needs a mass.
    density : float, optional
        [kg/m^3]; with a mass, it gives the displaced volume of a point or custom part.
    expansion : float, optional
        Linear thermal expansion coefficient [1/K] (0 when not given).
    inertia : float, optional
        Custom part only: own moment of inertia about its centroid, z axis [kg m^2].
    volume : float, optional
        Custom part only: displaced volume [m^3] for buoyancy (default mass/density, or 0).
    mount : str, optional
        Where the part is held on the arm: "centre", "top" or "bottom" (for temperature);
        default: the point ``at`` names.
    material : str
        The material's name, for reports only (the caller resolves density and expansion).
    """

    name: str
    shape: str
    position: float
    size: dict = field(default_factory=dict)
    at: str = "centre"
    orientation: str | None = None
    across: float = 0.0
    mass: float | None = None
    density: float | None = None
    expansion: float = 0.0
    inertia: float | None = None
    volume: float | None = None
    mount: str | None = None
    material: str = ""


@dataclass(frozen=True)
class Pivot:
    """How the body is held at the pivot, for the friction models of the simulation.

    ``pin_radius`` [m] with kinetic and static friction coefficients for a pin (the
    friction torque is coefficient x pin radius x |pivot reaction|); ``friction_torque``
    [N m] for a given constant torque; nothing for a knife edge.
    """

    kind: str = "knife-edge"
    pin_radius: float = 0.0
    friction_coefficient: float = 0.0
    static_friction_coefficient: float = 0.0
    friction_torque: float = 0.0

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class Suspension:
    """How the body hangs: a rigid arm (the parts), or a flexible line of a given length
    and mass per length from the pivot to the payload."""

    kind: str = "rigid"
    length: float = 0.0              # [m], flexible only
    mass_per_length: float = 0.0     # [kg/m], flexible only
    expansion: float = 0.0           # [1/K], flexible only: the line's own expansion

    @property
    def flexible(self) -> bool:
        return self.kind != "rigid"


@dataclass(frozen=True)
class PartProperties:
    """A part resolved to SI numbers."""

    name: str
    shape: str
    orientation: str | None
    mass_kg: float
    volume_m3: float
    centre_along_m: float
    centre_across_m: float
    own_inertia_kg_m2: float
    inertia_pivot_kg_m2: float
    frontal_area_m2: float
    frontal_width_m: float
    extent_along_m: float
    extent_across_m: float
    expansion_per_K: float
    mount: str
    material: str
    size_m: dict

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class Body:
    """A rigid swinging body about a fixed pivot; SI values, units in the names.

    ``com_distance_m`` is the pivot to centre-of-mass distance d; the body hangs with its
    centre of mass straight below the pivot, which tilts the arm by ``hang_tilt_rad``
    when the centre of mass is off the arm's line. ``equivalent_length_m`` = I/(m d) is
    the length of the simple pendulum with the same small-angle period, and the centre
    of percussion lies that far from the pivot on the line through the centre of mass.
    """

    parts: tuple
    suspension: Suspension
    mass_kg: float
    com_along_m: float
    com_across_m: float
    com_distance_m: float
    hang_tilt_rad: float
    inertia_pivot_kg_m2: float
    inertia_com_kg_m2: float
    gyration_pivot_m: float
    gyration_com_m: float
    equivalent_length_m: float
    centre_of_percussion_m: float
    volume_m3: float
    arm_expansion_per_K: float
    inputs: tuple = field(default=(), repr=False)   # the Part objects it was built from
    # The parts and suspension as given (at the reference temperature), and how far the
    # body is from that temperature [K]; `inputs` are the parts at this temperature.
    reference: tuple = field(default=(), repr=False)
    reference_suspension: Suspension | None = field(default=None, repr=False)
    delta_t_K: float = 0.0

    def part(self, name: str) -> PartProperties:
        for p in self.parts:
            if p.name == name:
                return p
        raise InvalidInput("part", name, "one of " + ", ".join(p.name for p in self.parts),
                           "no such part")

    def to_dict(self) -> dict:
        d = {k: v for k, v in self.__dict__.items()
             if k not in ("parts", "suspension", "inputs", "reference",
                          "reference_suspension")}
        d["suspension"] = dict(self.suspension.__dict__)
        d["parts"] = [p.to_dict() for p in self.parts]
        return d


def point_bob(length, mass, suspension: str = "rigid") -> tuple:
    """``(parts, suspension)`` for a point bob of ``mass`` [kg] at ``length`` [m] on a
    light suspension (the simple pendulum as a body)."""
    L = positive_scalar(length, "length", "m")
    susp = (Suspension("rigid") if suspension == "rigid"
            else Suspension("rope", length=L, mass_per_length=0.0))
    return (Part("bob", "point", position=L, mass=mass),), susp


def _where(p: Part, key: str) -> str:
    return f"part '{p.name}': {key}"


def resolve_part(p: Part) -> PartProperties:
    """Validate one part and compute its properties (errors name ``part '<name>': <field>``)."""
    if p.shape not in SHAPE_SIZES:
        raise InvalidInput(_where(p, "shape"), p.shape, ", ".join(SHAPE_SIZES),
                           f"unknown shape{suggest(p.shape, SHAPE_SIZES)}")
    if p.at not in MOUNTS:
        raise InvalidInput(_where(p, "at"), p.at, " or ".join(MOUNTS))
    position = real_scalar(p.position, _where(p, p.at), "a finite position along the arm [m]")
    u = real_scalar(p.across, _where(p, "across"), "a finite offset across the arm [m]")
    alpha = real_scalar(p.expansion, _where(p, "expansion"),
                        "a finite expansion coefficient in (-1e-3, 1e-3) [1/K]",
                        low=-1e-3, high=1e-3)
    mount = p.at if p.mount is None else p.mount
    if mount not in MOUNTS:
        raise InvalidInput(_where(p, "mount"), mount, " or ".join(MOUNTS))
    orientation = _orientation(p)
    mass = None if p.mass is None else positive_scalar(p.mass, _where(p, "mass"), "kg")
    density = (None if p.density is None
               else positive_scalar(p.density, _where(p, "density"), "kg/m^3"))
    if p.shape in ("point", "custom"):
        if mass is None:
            raise InvalidInput(_where(p, "mass"), MISSING, "a mass > 0 [kg]",
                               f"a {p.shape} part needs a mass")
        if p.shape == "custom":
            if p.inertia is None:
                raise InvalidInput(_where(p, "inertia"), MISSING,
                                   "the part's own inertia about its centroid >= 0 [kg m^2]",
                                   "a custom part needs its own inertia")
            own = real_scalar(p.inertia, _where(p, "inertia"),
                              "a finite inertia >= 0 [kg m^2]", low=0.0)
        else:
            own = 0.0
        if p.volume is not None:
            volume = real_scalar(p.volume, _where(p, "volume"), "a finite volume >= 0 [m^3]",
                                 low=0.0)
        else:
            volume = mass / density if density else 0.0
        geo = _shape.Shape(volume, own / mass, 0.0, 0.0, 0.0, 0.0)
        sizes = {}
    else:
        sizes = _sizes(p)
        args = [sizes[k] for k in SHAPE_SIZES[p.shape]]
        try:
            geo = (_shape.SHAPES[p.shape](*args, orientation) if orientation
                   else _shape.SHAPES[p.shape](*args))
        except ValueError as exc:
            raise InvalidInput(_where(p, "size"), sizes, "a realisable shape", str(exc)) from None
        volume = geo.volume
        if not volume > 0.0:
            raise InvalidInput(_where(p, "size"), sizes, "sizes that give the part a volume",
                               "the part has no volume")
        if mass is None:
            if density is None:
                raise InvalidInput(_where(p, "mass"), MISSING,
                                   "a mass, a density or a material with a density",
                                   "the part's mass cannot be found")
            mass = density * volume
        if p.volume is not None or p.inertia is not None:
            raise InvalidInput(_where(p, "inertia" if p.inertia is not None else "volume"),
                               p.inertia if p.inertia is not None else p.volume,
                               "inertia and volume only on a custom part",
                               "given for a shaped part (its shape fixes them)")
    own = mass * geo.gyration_sq
    s = position + {"centre": 0.0, "top": 0.5, "bottom": -0.5}[p.at] * geo.extent_s
    finite_result((mass, volume, own, mass * (s * s + u * u)), _where(p, "size"),
                  "sizes, masses and positions whose volume, mass and inertia are finite")
    return PartProperties(
        name=p.name, shape=p.shape, orientation=orientation, mass_kg=mass, volume_m3=volume,
        centre_along_m=s, centre_across_m=u, own_inertia_kg_m2=own,
        inertia_pivot_kg_m2=own + mass * (s * s + u * u), frontal_area_m2=geo.frontal_area,
        frontal_width_m=geo.frontal_width, extent_along_m=geo.extent_s,
        extent_across_m=geo.extent_u, expansion_per_K=alpha, mount=mount,
        material=p.material, size_m=sizes)


def _orientation(p: Part) -> str | None:
    spec = ORIENTATIONS.get(p.shape)
    if spec is None:
        if p.orientation is not None:
            raise InvalidInput(_where(p, "orientation"), p.orientation,
                               "no orientation for this shape",
                               f"a {p.shape} has no orientation to choose")
        return None
    key, choices, default = spec
    value = default if p.orientation is None else p.orientation
    if value not in choices:
        raise InvalidInput(_where(p, key), value, " or ".join(choices))
    return value


def _sizes(p: Part) -> dict:
    names = SHAPE_SIZES[p.shape]
    extra = sorted(set(p.size) - set(names))
    if extra:
        raise InvalidInput(_where(p, extra[0]), p.size[extra[0]],
                           f"the sizes of a {p.shape}: " + ", ".join(names),
                           f"not a size of a {p.shape}{suggest(extra[0], names)}")
    out = {}
    for k in names:
        if k not in p.size:
            if (p.shape, k) in _OPTIONAL_SIZES:
                out[k] = _OPTIONAL_SIZES[(p.shape, k)]
                continue
            raise InvalidInput(_where(p, k), MISSING, f"the sizes of a {p.shape}: "
                               + ", ".join(names), f"missing size '{k}'")
        if (p.shape, k) in _OPTIONAL_SIZES:
            out[k] = real_scalar(p.size[k], _where(p, k), "a finite size >= 0 [m]", low=0.0)
        else:
            out[k] = positive_scalar(p.size[k], _where(p, k), "m")
    if p.shape == "tube" and not out["inner_diameter"] < out["outer_diameter"]:
        raise InvalidInput(_where(p, "inner_diameter"), out["inner_diameter"],
                           "an inner diameter smaller than the outer diameter "
                           f"({out['outer_diameter']:g} m)", "the tube has no wall")
    if p.shape == "sphere" and not out["inner_diameter"] < out["diameter"]:
        raise InvalidInput(_where(p, "inner_diameter"), out["inner_diameter"],
                           f"an inner diameter in [0, {out['diameter']:g}) m",
                           "the shell has no wall")
    if p.shape == "lens" and not out["thickness"] <= out["diameter"]:
        raise InvalidInput(_where(p, "thickness"), out["thickness"],
                           f"a lens thickness at most its diameter ({out['diameter']:g} m)",
                           "thicker than a sphere")
    return out


def assemble(parts, suspension: Suspension | None = None,
             arm_expansion: float | None = None) -> Body:
    """Assemble parts into a rigid body swinging about the pivot.

    Parameters
    ----------
    parts : sequence of Part
        The parts; names must be unique.
    suspension : Suspension, optional
        Rigid (default) or flexible. A flexible suspension adds its own mass as a thin
        line from the pivot to ``suspension.length``; while it is taut the whole body
        swings as one rigid body (the point-mass-plus-chain model).
    arm_expansion : float, optional
        Expansion coefficient [1/K] of the arm that sets the parts' mounting points;
        default: a flexible suspension's own, else that of the longest rod, tube or flat
        bar (0 when none is known).

    Returns
    -------
    Body

    Notes
    -----
    m = sum m_i; centre of mass (s, u) = sum m_i (s_i, u_i) / m; I_O = sum (I_i + m_i
    (s_i^2 + u_i^2)) (parallel-axis theorem); I_G = I_O - m d^2; equivalent length
    L_eq = I_O / (m d) = d + k_G^2 / d; centre of percussion at L_eq from the pivot
    (any rigid-body dynamics text, e.g. Meriam & Kraige, Engineering Mechanics:
    Dynamics, on the centre of percussion [mem]).

    Examples
    --------
    >>> rod = Part("rod", "rod", position=0.0, at="top",
    ...            size={"length": 1.0, "diameter": 1e-6}, density=7850.0)
    >>> b = assemble([rod])
    >>> round(b.equivalent_length_m, 9)         # 2L/3 for a uniform rod about its end
    0.666666667
    """
    parts = tuple(parts)
    if not parts:
        raise InvalidInput("parts", MISSING, "at least one part", "the body has no parts")
    names = [p.name for p in parts]
    dup = next((n for n in names if names.count(n) > 1), None)
    if dup is not None:
        raise InvalidInput("parts", dup, "unique part names", "two parts share a name")
    suspension = suspension or Suspension()
    if suspension.kind not in SUSPENSION_KINDS:
        raise InvalidInput("suspension", suspension.kind, " or ".join(SUSPENSION_KINDS))
    resolved = [resolve_part(p) for p in parts]
    if suspension.flexible:
        resolved.append(_line(suspension, names))
    mass = sum(p.mass_kg for p in resolved)
    s = sum(p.mass_kg * p.centre_along_m for p in resolved) / mass
    u = sum(p.mass_kg * p.centre_across_m for p in resolved) / mass
    d = math.hypot(s, u)
    inertia = sum(p.inertia_pivot_kg_m2 for p in resolved)
    if not (s > 0.0 and d > 1e-9 * math.sqrt(inertia / mass)):
        raise InvalidInput("parts", MISSING,
                           "a centre of mass below the pivot (positive along the arm): put "
                           "the heavy parts below it",
                           f"the centre of mass is at {s:.6g} m along the arm, {u:.6g} m "
                           "across: the body does not hang below the pivot as drawn (it "
                           "would hang the other way up, or balance)")
    # About the centre of mass directly (I_O - m d^2 would leave rounding for a point bob).
    i_com = sum(p.own_inertia_kg_m2 + p.mass_kg * ((p.centre_along_m - s) ** 2
                                                   + (p.centre_across_m - u) ** 2)
                for p in resolved)
    l_eq = inertia / (mass * d)
    if arm_expansion is None:
        # a flexible line carries the payload, so its coefficient sets the mounts
        arm_expansion = (suspension.expansion if suspension.flexible
                         else _default_arm_expansion(resolved))
    else:
        arm_expansion = real_scalar(arm_expansion, "arm expansion",
                                    "a finite coefficient in (-1e-3, 1e-3) [1/K]",
                                    low=-1e-3, high=1e-3)
    return Body(parts=tuple(resolved), suspension=suspension, mass_kg=mass, com_along_m=s,
                com_across_m=u, com_distance_m=d, hang_tilt_rad=math.atan2(u, s),
                inertia_pivot_kg_m2=inertia, inertia_com_kg_m2=i_com,
                gyration_pivot_m=math.sqrt(inertia / mass),
                gyration_com_m=math.sqrt(i_com / mass), equivalent_length_m=l_eq,
                centre_of_percussion_m=l_eq,
                volume_m3=sum(p.volume_m3 for p in resolved),
                arm_expansion_per_K=arm_expansion, inputs=parts, reference=parts,
                reference_suspension=suspension)


def _line(susp: Suspension, names) -> PartProperties:
    """The flexible suspension as a thin straight line of mass from the pivot down."""
    if "suspension" in names:
        raise InvalidInput("parts", "suspension", "part names other than 'suspension'",
                           "the name is taken by the flexible suspension")
    L = positive_scalar(susp.length, "suspension.length", "m")
    lam = real_scalar(susp.mass_per_length, "suspension.mass_per_length",
                      "a finite mass per length >= 0 [kg/m]", low=0.0)
    m = lam * L
    return PartProperties(
        name="suspension", shape="line", orientation=None, mass_kg=m, volume_m3=0.0,
        centre_along_m=0.5 * L, centre_across_m=0.0, own_inertia_kg_m2=m * L * L / 12.0,
        inertia_pivot_kg_m2=m * L * L / 3.0, frontal_area_m2=0.0, frontal_width_m=0.0,
        extent_along_m=L, extent_across_m=0.0, expansion_per_K=susp.expansion, mount="top",
        material=susp.kind, size_m={"length": L})


def _default_arm_expansion(parts) -> float:
    """On a rigid arm the longest rod, tube or flat bar sets the mounts; else 0."""
    arms = [p for p in parts if p.shape in ("rod", "tube", "flat_bar")]
    if not arms:
        return 0.0
    return max(arms, key=lambda p: p.extent_along_m).expansion_per_K


def scaled_for_temperature(body: Body, delta_t: float, parts=None) -> Body:
    """The body rebuilt ``delta_t`` [K] away from the temperature its sizes were given at.

    Every size of a part grows by (1 + alpha_part dT); its mounting point (its centre,
    top or bottom) sits at a distance from the pivot that grows with the arm's
    coefficient, and the part grows about that point. Masses do not change.
    ``parts`` replaces the body's own :class:`Part` inputs (same order and names), e.g.
    with other expansion coefficients.
    """
    dt = real_scalar(delta_t, "temperature change", "a finite change [K]")
    parts = body.inputs if parts is None else tuple(parts)
    arm = body.arm_expansion_per_K
    out = []
    for p, r in zip(parts, body.parts):
        grow = 1.0 + p.expansion * dt
        half = 0.5 * r.extent_along_m
        offset = {"centre": 0.0, "top": -half, "bottom": half}[r.mount]
        mount_at = r.centre_along_m + offset
        centre = mount_at * (1.0 + arm * dt) - offset * grow
        size = {k: v * grow for k, v in p.size.items()}
        inertia = None if p.inertia is None else p.inertia * grow * grow
        volume = r.volume_m3 * grow ** 3 if p.shape in ("point", "custom") else None
        out.append(replace(p, position=centre, at="centre", mount=r.mount,
                           across=p.across * (1.0 + arm * dt), size=size,
                           inertia=inertia, volume=volume, mass=r.mass_kg, density=None))
    susp = body.suspension
    if susp.flexible:
        susp = replace(susp, length=susp.length * (1.0 + arm * dt),
                       mass_per_length=susp.mass_per_length / (1.0 + arm * dt))
    warm = assemble(out, susp, arm_expansion=arm)
    return replace(warm, reference=body.reference, delta_t_K=body.delta_t_K + dt,
                   reference_suspension=body.reference_suspension)


def with_parts(body: Body, parts, suspension: Suspension | None = None) -> Body:
    """``body`` built again from other parts (and optionally another suspension) given at
    its reference temperature (a moved bob, a changed size, a longer cable), brought to
    the same temperature as ``body``."""
    fresh = assemble(parts, suspension or body.reference_suspension or body.suspension,
                     body.arm_expansion_per_K)
    return scaled_for_temperature(fresh, body.delta_t_K) if body.delta_t_K else fresh
