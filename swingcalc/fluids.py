"""How air acts on a part's shape: added-mass and drag coefficients, each with its source.

Shapes and directions (the motion relative to the part):

========== ==================================== ==============================================
shape      directions                           aspect_ratio (optional unless stated)
========== ==================================== ==============================================
sphere     any (None, or any direction word)    --
cylinder   "across" (cross-flow), "along" axis  length / diameter
rod        same as cylinder                     length / diameter
spheroid   "along", "across" its symmetry axis  axial semi-axis / equatorial radius (required)
disc       "broadside" (face-on), "edgewise"    --
plate      "broadside", "edgewise"              long side / short side (>= 1), rectangular
lens       "broadside", "edgewise"              thickness / diameter (oblate spheroid)
========== ==================================== ==============================================

Added mass is the fluid mass that moves with the part, m_a = C_a rho_f V, V the part's
volume (:func:`added_mass_coefficient`). A thin disc or plate moving broadside displaces
almost nothing yet carries a finite added mass, so those are given as masses only
(:func:`added_mass`, from the dimensions). Drag is F = C_d (1/2) rho_f v^2 A with the
reference area A each entry names: "frontal" (projected on the plane normal to the motion)
or "planform" (one face, for skin friction of a part moving edgewise). "[mem]" marks a
value written from memory of the named source and not re-checked against it. Method note:
``docs/methods/materials.md`` (fluid coefficients section).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from types import MappingProxyType

import numpy as np

from ._validate import positive_scalar, real_scalar
from .errors import InvalidInput, suggest

__all__ = [
    "ADDED_MASS",
    "EDGE_FORM_DRAG_COEFFICIENT",
    "AXIAL_DIRECTIONS",
    "DRAG",
    "FLAT_DIRECTIONS",
    "SHAPES",
    "AddedMassEntry",
    "DragEntry",
    "added_mass",
    "added_mass_coefficient",
    "added_mass_entry",
    "cylinder_drag_coefficient",
    "drag_coefficient",
    "drag_entry",
    "friction_drag_coefficient",
    "sphere_drag_coefficient",
    "spheroid_added_mass_coefficient",
]

SHAPES = ("sphere", "cylinder", "rod", "spheroid", "disc", "plate", "lens")
#: Directions for parts with an axis (cylinder, rod, spheroid).
AXIAL_DIRECTIONS = ("along", "across")
#: Directions for flat parts (disc, plate, lens): face-on, or in their own plane.
FLAT_DIRECTIONS = ("broadside", "edgewise")
_AXIAL = ("cylinder", "rod", "spheroid")
_FLAT = ("disc", "plate", "lens")

#: Aspect ratios accepted for a spheroid or lens: beyond these it is a needle or a disc.
SPHEROID_ASPECT_MIN, SPHEROID_ASPECT_MAX = 1e-6, 1e6

_LAMB = "Lamb, Hydrodynamics, 6th ed. (1932)"
_STOKES = "G. G. Stokes, Trans. Camb. Phil. Soc. 9 (1851) 8"
_DNV = "DNV-RP-H103 (2011), Table A-2, rectangular plates [mem]"
_HOERNER = "Hoerner, Fluid-Dynamic Drag (1965), ch. 3"
_WHITE = "White, Fluid Mechanics, Table 7.2/7.3 (2-D and 3-D bodies)"


@dataclass(frozen=True)
class AddedMassEntry:
    """One added-mass row: C_a = added mass / displaced fluid mass, or a formula when the
    part displaces nothing. ``coefficient`` is None where the value depends on the aspect
    ratio or is a mass formula (see ``formula``)."""

    shape: str
    direction: str
    coefficient: float | None
    formula: str
    source: str
    note: str = ""

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class DragEntry:
    """One drag row: C_d on the named reference area over a Reynolds range.

    ``reynolds_min`` and ``reynolds_max`` bound where the value applies (Reynolds number on
    the length named in ``reynolds_length``). ``drag_coefficient`` is None where it
    depends on the aspect ratio or the Reynolds number (see ``formula``).
    """

    shape: str
    direction: str
    drag_coefficient: float | None
    reference_area: str
    reynolds_length: str
    reynolds_min: float
    reynolds_max: float
    formula: str
    source: str
    note: str = ""

    def to_dict(self) -> dict:
        return dict(self.__dict__)


_ADDED = (
    AddedMassEntry("sphere", "any", 0.5, "m_a = (1/2) rho (4/3) pi r^3",
                   f"{_STOKES}; {_LAMB} section 92 [mem: section]",
                   "ideal (inviscid) flow; viscosity adds a frequency-dependent part "
                   "(Stokes 1851)"),
    AddedMassEntry("cylinder", "across", 1.0, "m_a = rho pi r^2 L",
                   f"{_LAMB} section 68 [mem: section]",
                   "2-D value (L >> D); a short cylinder carries less (its ends leak), e.g. "
                   "the spheroid of the same L/D gives 1/2 at L/D = 1"),
    AddedMassEntry("cylinder", "along", 0.0, "m_a ~ (8/3) rho r^3 (the end disc)",
                   "approximation (our own): the broadside disc of the same radius",
                   "~0 for a slender rod; with aspect_ratio = L/D the end-disc value "
                   "C_a = 4 / (3 pi L/D), exact as L -> 0"),
    AddedMassEntry("spheroid", "along", None, "C_a = alpha0 / (2 - alpha0)",
                   f"{_LAMB} sections 114-115 [mem: sections]",
                   "alpha0 = abc int dl / ((a^2 + l) Delta) = (2/3) abc R_D(b^2, c^2, a^2)"),
    AddedMassEntry("spheroid", "across", None, "C_a = beta0 / (2 - beta0)",
                   f"{_LAMB} sections 114-115 [mem: sections]",
                   "sphere 1/2; prolate -> 1 (cylinder), oblate -> 0 (disc edgewise)"),
    AddedMassEntry("disc", "broadside", None, "m_a = (8/3) rho a^3",
                   f"{_LAMB} section 108 [mem: section]", "thin disc of radius a"),
    AddedMassEntry("disc", "edgewise", 0.0, "m_a ~ 0", "ideal flow, thin disc",
                   "the edge's thickness adds a little; negligible for a thin disc"),
    AddedMassEntry("plate", "broadside", None, "m_a = C(b/a) rho (pi/4) a^2 b, a <= b",
                   _DNV, "C = 0.579 square, -> 1 for a long strip (the 2-D value "
                   "rho pi a^2 / 4 per length, Lamb section 71 [mem: section])"),
    AddedMassEntry("plate", "edgewise", 0.0, "m_a ~ 0", "ideal flow, thin plate", ""),
    AddedMassEntry("lens", "broadside", None, "oblate spheroid along its axis",
                   f"{_LAMB} sections 114-115 [mem: sections]",
                   "the lens approximated by the oblate spheroid of the same diameter and "
                   "thickness"),
    AddedMassEntry("lens", "edgewise", None, "oblate spheroid across its axis",
                   f"{_LAMB} sections 114-115 [mem: sections]",
                   "small: ~ (pi/4)(t/D) of the displaced mass for a thin lens"),
)

_SUBCRIT = 2e5   # below the sphere's and cylinder's drag crisis (about 3e5)

#: Form drag of a flat part's blunt edge when it moves edgewise, on the edge's frontal
#: area (thickness x extent): our estimate from the rectangular sections of White, Fluid
#: Mechanics, Table 7.2/7.3 (C_d about 0.9-2.1 by proportions) [mem]; added to the
#: faces' skin friction. A sharp rim (a lens bob's) has no blunt edge.
EDGE_FORM_DRAG_COEFFICIENT = 1.0
_DRAG = (
    DragEntry("sphere", "any", 0.47, "frontal", "diameter", 1e3, _SUBCRIT, "C_d = 0.47",
              f"{_WHITE} [mem]; {_HOERNER} [mem]",
              "0.4-0.5 over Re 1e3-2e5 (REFERENCES.md); falls to ~0.1-0.2 past the drag "
              "crisis near Re 3e5; give reynolds for the full-range correlation"),
    DragEntry("cylinder", "across", 1.2, "frontal", "diameter", 1e4, _SUBCRIT,
              "C_d = 1.2 (L/D -> inf); 0.64 .. 0.98 for L/D = 1 .. 40",
              f"{_WHITE} [mem]",
              "about 1.0 near Re 1e3; finite length lowers it (ends open the wake)"),
    DragEntry("cylinder", "along", None, "frontal", "diameter", 1e4, _SUBCRIT,
              "C_d(L/D) = 1.15, 0.90, 0.85, 0.87, 0.99 at L/D = 0.5, 1, 2, 4, 8",
              f"{_WHITE} [mem]", "flat ends facing the flow; needs aspect_ratio"),
    DragEntry("disc", "broadside", 1.17, "frontal", "diameter", 1e3, 1e6, "C_d = 1.17",
              f"{_HOERNER} [mem]; {_WHITE} [mem]",
              "sharp edge: separation is fixed there, so C_d hardly depends on Re"),
    DragEntry("plate", "broadside", None, "frontal", "short side", 1e3, 1e6,
              "C_d = 1.18 (square) .. 2.0 (long strip), by long/short side",
              f"{_WHITE} [mem]; {_HOERNER} [mem]",
              "1.18, 1.2, 1.3, 1.5, 2.0 at b/a = 1, 5, 10, 20, inf; 1.28 for a square "
              "plate is also quoted: the edge shape and free-stream turbulence move it"),
    DragEntry("disc", "edgewise", None, "planform", "diameter", 1e3, 5e5,
              "C_d = 2 x 1.328 / sqrt(Re) (laminar skin friction, both faces)",
              "Blasius (1908) flat-plate friction; White, Fluid Mechanics, ch. 7 [mem]",
              "friction only: small; the edge's thickness adds form drag of about "
              "1 x thickness x width (an estimate), larger than the friction for a thick part"),
    DragEntry("plate", "edgewise", None, "planform", "length along the motion", 1e3, 5e5,
              "C_d = 2 x 1.328 / sqrt(Re) (laminar skin friction, both faces)",
              "Blasius (1908) flat-plate friction; White, Fluid Mechanics, ch. 7 [mem]",
              "as for the disc edgewise"),
    DragEntry("lens", "broadside", 1.0, "frontal", "diameter", 1e3, 1e6, "C_d ~ 1.0",
              "estimate [mem]: a convex disc with a sharp rim, between a hemisphere's convex "
              f"face and the flat disc's 1.17 ({_HOERNER})",
              "rough (0.9-1.17); a lens bob normally swings edgewise"),
    DragEntry("lens", "edgewise", None, "planform", "diameter", 1e3, 5e5,
              "C_d = 2 x 1.328 / sqrt(Re) on pi R^2 (skin friction, both faces)",
              "Blasius (1908) flat-plate friction [mem]; applied to a lens: our estimate",
              "a lower bound: the lens's thickness adds form drag, perhaps doubling it at "
              "t/D ~ 0.2 (an estimate); measure a decay if the Q matters"),
)

#: Added-mass rows by (shape, direction); "rod" uses the cylinder rows.
ADDED_MASS = MappingProxyType({(e.shape, e.direction): e for e in _ADDED})
#: Drag rows by (shape, direction); "rod" uses the cylinder rows.
DRAG = MappingProxyType({(e.shape, e.direction): e for e in _DRAG})

# DNV-RP-H103 Table A-2 [mem]: C_A of a thin rectangular plate a x b (a <= b), broadside,
# on the reference volume (pi/4) a^2 b.
_PLATE_ADDED = ((1.0, 0.579), (1.25, 0.642), (1.5, 0.690), (1.59, 0.704), (2.0, 0.757),
                (2.5, 0.801), (3.0, 0.830), (3.17, 0.840), (4.0, 0.872), (5.0, 0.897),
                (6.25, 0.917), (8.0, 0.934), (10.0, 0.947), (math.inf, 1.0))
# White, Fluid Mechanics, Table 7.3 [mem]: finite circular cylinder in cross-flow (L/D),
# cylinder along its axis (L/D), rectangular plate broadside (b/a).
_CYL_ACROSS = ((1.0, 0.64), (2.0, 0.68), (5.0, 0.74), (10.0, 0.82), (40.0, 0.98),
               (math.inf, 1.20))
_CYL_ALONG = ((0.5, 1.15), (1.0, 0.90), (2.0, 0.85), (4.0, 0.87), (8.0, 0.99))
_PLATE_DRAG = ((1.0, 1.18), (5.0, 1.2), (10.0, 1.3), (20.0, 1.5), (math.inf, 2.0))


def _interp_inverse(table, ratio):
    """Linear interpolation in 1/ratio (so an infinite ratio is the end point x = 0)."""
    xs = [1.0 / r for r, _ in table][::-1]
    ys = [c for _, c in table][::-1]
    return float(np.interp(1.0 / ratio, xs, ys))


def _shape_direction(shape, direction):
    """Normalise and check (shape, direction); "rod" is the cylinder."""
    if not isinstance(shape, str) or shape.strip().lower() not in SHAPES:
        raise InvalidInput("shape", shape, "one of: " + ", ".join(SHAPES),
                           f"unknown shape{suggest(shape, SHAPES)}")
    s = shape.strip().lower()
    base = "cylinder" if s == "rod" else s
    if base == "sphere":
        if direction is not None and direction not in AXIAL_DIRECTIONS + FLAT_DIRECTIONS + (
                "any",):
            raise InvalidInput("direction", direction,
                               "any direction word, or None: a sphere looks the same every way")
        return base, "any"
    words = AXIAL_DIRECTIONS if base in _AXIAL else FLAT_DIRECTIONS
    if direction not in words:
        what = ("'along' or 'across' its axis" if base in _AXIAL
                else "'broadside' (moving face-on) or 'edgewise' (moving in its own plane)")
        raise InvalidInput("direction", direction, f"for a {s}: {what}",
                           f"not a direction for a {s}{suggest(direction, words)}"
                           if isinstance(direction, str) else None)
    return base, direction


def _aspect(value, field="aspect_ratio"):
    return real_scalar(value, field,
                       f"a finite aspect ratio in [{SPHEROID_ASPECT_MIN:g}, "
                       f"{SPHEROID_ASPECT_MAX:g}]",
                       low=SPHEROID_ASPECT_MIN, high=SPHEROID_ASPECT_MAX)


def _spheroid_integrals(r):
    """Lamb's alpha0 (along the axis) and beta0 (across) for semi-axes r (axial), 1, 1.

    alpha0 = abc int_0^inf dl / ((a^2 + l) sqrt((a^2 + l)(b^2 + l)(c^2 + l))) with a the
    axis of motion; the integral is (2/3) R_D of the other two squared axes and a^2
    (DLMF 19.16.5). alpha0 + 2 beta0 = 2.
    """
    from scipy.special import elliprd

    alpha0 = (2.0 / 3.0) * r * float(elliprd(1.0, 1.0, r * r))
    beta0 = (2.0 / 3.0) * r * float(elliprd(r * r, 1.0, 1.0))
    return alpha0, beta0


def spheroid_added_mass_coefficient(aspect_ratio, direction):
    """Added mass over displaced fluid mass of a spheroid in ideal flow.

    Parameters
    ----------
    aspect_ratio : float
        Axial semi-axis over equatorial radius, in [1e-6, 1e6]: < 1 oblate (a lens),
        1 a sphere, > 1 prolate (a cigar).
    direction : {"along", "across"}
        Motion along or across the symmetry axis.

    Notes
    -----
    Lamb, *Hydrodynamics*, 6th ed., sections 114-115 (section numbers from memory):
    C_a = alpha0 / (2 - alpha0) along the axis, beta0 / (2 - beta0) across it, with
    Lamb's integrals evaluated as Carlson's R_D (DLMF 19.16.5) and 2 - alpha0 = 2 beta0,
    2 - beta0 = alpha0 + beta0 so that neither limit cancels. Sphere: 1/2 both ways.
    Thin oblate (r -> 0) along the axis: C_a -> 2 / (pi r), i.e. m_a -> (8/3) rho a^3,
    the disc (Lamb section 108). Slender prolate across: C_a -> 1, the 2-D cylinder.

    Examples
    --------
    >>> spheroid_added_mass_coefficient(1.0, "along")
    0.5
    """
    r = _aspect(aspect_ratio)
    if direction not in AXIAL_DIRECTIONS:
        raise InvalidInput("direction", direction, "'along' or 'across' the spheroid's axis")
    alpha0, beta0 = _spheroid_integrals(r)
    if direction == "along":
        return alpha0 / (2.0 * beta0)
    return beta0 / (alpha0 + beta0)


def _lens_ratio(aspect_ratio):
    """thickness / diameter of a lens is its spheroid's axial / equatorial semi-axis ratio."""
    if aspect_ratio is None:
        raise InvalidInput("aspect_ratio", None,
                           "thickness / diameter of the lens (e.g. 0.2)", "needed for a lens")
    r = _aspect(aspect_ratio)
    if r > 1.0:
        raise InvalidInput("aspect_ratio", aspect_ratio,
                           "thickness / diameter <= 1 for a lens (use a spheroid otherwise)")
    return r


def added_mass_coefficient(shape, direction=None, aspect_ratio=None):
    """Added mass over displaced fluid mass, C_a, for a part's shape and direction of motion.

    Parameters
    ----------
    shape : str
        See the module table.
    direction : str, optional
        See the module table (None for a sphere).
    aspect_ratio : float, optional
        Required for a spheroid and a lens; for a cylinder moving along its axis, L/D
        (without it, the slender limit 0).

    Raises
    ------
    InvalidInput
        For a thin disc or plate moving broadside: it displaces almost nothing, so its
        added mass is no multiple of its volume; use :func:`added_mass`.

    Examples
    --------
    >>> added_mass_coefficient("sphere")
    0.5
    >>> added_mass_coefficient("rod", "across")
    1.0
    """
    base, d = _shape_direction(shape, direction)
    if base == "spheroid":
        if aspect_ratio is None:
            raise InvalidInput("aspect_ratio", None, "axial semi-axis / equatorial radius",
                               "needed for a spheroid")
        return spheroid_added_mass_coefficient(aspect_ratio, d)
    if base == "lens":
        r = _lens_ratio(aspect_ratio)
        return spheroid_added_mass_coefficient(r, "along" if d == "broadside" else "across")
    if base in ("disc", "plate") and d == "broadside":
        raise InvalidInput("shape", shape, "use added_mass(...) with the dimensions",
                           f"a thin {base} moving broadside has a finite added mass but "
                           "almost no volume, so no coefficient of displaced mass")
    if base == "cylinder" and d == "along" and aspect_ratio is not None:
        ratio = positive_scalar(aspect_ratio, "aspect_ratio", "length / diameter")
        return 4.0 / (3.0 * math.pi * ratio)
    return float(ADDED_MASS[(base, d)].coefficient)


def added_mass(shape, direction, fluid_density, *, radius=None, length=None, width=None,
               thickness=None):
    """Added mass [kg] of a part moving through a fluid in the given direction.

    Parameters
    ----------
    shape, direction : str
        See the module table.
    fluid_density : float
        [kg/m^3] >= 0.
    radius : float
        [m]: sphere, cylinder/rod, disc, lens (its rim radius), spheroid (equatorial).
    length : float
        [m]: cylinder/rod (along its axis), plate (one side), spheroid (full axial length).
    width : float
        [m]: plate (the other side).
    thickness : float
        [m]: lens (at the centre). Ignored for a thin disc or plate.

    Notes
    -----
    sphere (1/2) rho (4/3) pi r^3; cylinder across rho pi r^2 L; cylinder along
    (8/3) rho r^3 (end disc, our approximation); disc broadside (8/3) rho r^3 (Lamb
    section 108); plate broadside C(b/a) rho (pi/4) a^2 b with a <= b the sides
    (DNV-RP-H103 Table A-2 [mem]); spheroid and lens from
    :func:`spheroid_added_mass_coefficient` times rho (4/3) pi R^2 c, c the axial
    semi-axis; edgewise flat parts 0.
    """
    base, d = _shape_direction(shape, direction)
    rho = real_scalar(fluid_density, "fluid_density", "a finite fluid density >= 0 [kg/m^3]",
                      low=0.0)

    def need(value, name):
        if value is None:
            raise InvalidInput(name, None, f"the {name} of the {shape} [m]", f"needed for a {shape}")
        return positive_scalar(value, name, "m")

    try:
        if base == "sphere":
            r = need(radius, "radius")
            out = 0.5 * rho * 4.0 / 3.0 * math.pi * r ** 3
        elif base == "cylinder":
            r = need(radius, "radius")
            if d == "across":
                out = rho * math.pi * r * r * need(length, "length")
            else:
                out = 8.0 / 3.0 * rho * r ** 3
        elif base == "disc":
            r = need(radius, "radius")
            out = 8.0 / 3.0 * rho * r ** 3 if d == "broadside" else 0.0
        elif base == "plate":
            a, b = sorted((need(length, "length"), need(width, "width")))
            out = (_interp_inverse(_PLATE_ADDED, b / a) * rho * math.pi / 4.0 * a * a * b
                   if d == "broadside" else 0.0)
        else:  # spheroid, lens
            r = need(radius, "radius")
            c = 0.5 * (need(length, "length") if base == "spheroid" else need(thickness, "thickness"))
            ratio = c / r
            if base == "lens":
                ratio = _lens_ratio(ratio)
                d = "along" if d == "broadside" else "across"
            coef = spheroid_added_mass_coefficient(ratio, d)
            out = coef * rho * 4.0 / 3.0 * math.pi * r * r * c
    except OverflowError:
        out = math.inf
    if not math.isfinite(out):
        raise InvalidInput("dimensions/fluid_density", rho, "values whose added mass is finite",
                           "the inputs are too large: the added mass overflows")
    return out


def added_mass_entry(shape, direction=None) -> AddedMassEntry:
    """The :class:`AddedMassEntry` (value, formula, source, note) for a shape and direction."""
    return ADDED_MASS[_shape_direction(shape, direction)]


def drag_entry(shape, direction=None) -> DragEntry:
    """The :class:`DragEntry` (value, reference area, Reynolds range, source) for a shape."""
    base, d = _shape_direction(shape, direction)
    if base == "spheroid":
        raise InvalidInput("shape", shape, "sphere, cylinder, rod, disc, plate or lens",
                           "no drag coefficient is tabulated for a general spheroid")
    return DRAG[(base, d)]


def _reynolds(value, entry: DragEntry, needed=False):
    allowed = (f"a Reynolds number on the {entry.reynolds_length} in "
               f"[{entry.reynolds_min:g}, {entry.reynolds_max:g}] for a "
               f"{entry.shape} {entry.direction}")
    if value is None:
        if needed:
            raise InvalidInput("reynolds", None, allowed, "needed: the value depends on it")
        return None
    return real_scalar(value, "reynolds", allowed, low=entry.reynolds_min,
                       high=entry.reynolds_max)


def friction_drag_coefficient(reynolds):
    """Laminar skin-friction drag coefficient of a flat plate, both faces, on one face's area.

    C_d = 2 x 1.328 / sqrt(Re_L), Re_L on the length along the motion, for 1e3 <= Re_L <=
    5e5 (Blasius 1908; White, *Fluid Mechanics*, ch. 7 [mem]). Below 1e3 the boundary
    layer is too thick for the thin-layer result (it under-estimates); above 5e5 the
    layer may turn turbulent.
    """
    re = real_scalar(reynolds, "reynolds",
                     "a Reynolds number in [1e3, 5e5] (laminar boundary layer)",
                     low=1e3, high=5e5)
    return 2.0 * 1.328 / math.sqrt(re)


def sphere_drag_coefficient(reynolds):
    """Drag coefficient of a smooth sphere on its frontal area, for 0 < Re <= 2e5.

    Notes
    -----
    Schiller & Naumann (1933) below Re = 1000 and the constant 0.44 above, up to the drag
    crisis (both as given in Clift, Grace & Weber, *Bubbles, Drops and Particles*, 1978
    [mem])::

        C_d = 24/Re (1 + 0.15 Re^0.687),   Re < 1000
        C_d = 0.44,                         1000 <= Re <= 2e5

    It tends to Stokes's 24/Re (F = 6 pi mu a U, Stokes 1851) as Re -> 0 and is
    continuous to 0.4 % at Re = 1000. Scatter about measured data: ~5-10 % (from memory).
    """
    re = real_scalar(reynolds, "reynolds",
                     "a Reynolds number in (0, 2e5] (below the drag crisis)",
                     low=0.0, high=_SUBCRIT, low_open=True)
    if re < 1000.0:
        out = 24.0 / re * (1.0 + 0.15 * re ** 0.687)
        if not math.isfinite(out):
            raise InvalidInput("reynolds", reynolds, "a Reynolds number in (0, 2e5]",
                               "too small: the drag coefficient overflows")
        return out
    return 0.44


def cylinder_drag_coefficient(reynolds):
    """Drag coefficient of a long circular cylinder in cross-flow on its frontal area (2-D).

    C_d = 1 + 10 Re^(-2/3) for 1 <= Re <= 2e5 (White, *Fluid Mechanics*, ch. 7, the curve
    fit to the measured 2-D cylinder drag [mem]); 1.46 at Re = 100, 1.02 at 1e4, where the
    measured values are about 1.4 and 1.1-1.2 (the fit is about 10 % low there).
    """
    re = real_scalar(reynolds, "reynolds", "a Reynolds number in [1, 2e5]", low=1.0,
                     high=_SUBCRIT)
    return 1.0 + 10.0 * re ** (-2.0 / 3.0)


def drag_coefficient(shape, direction=None, aspect_ratio=None, reynolds=None):
    """Quadratic-drag coefficient C_d of a part, on the reference area its entry names.

    Parameters
    ----------
    shape, direction : str
        See the module table (a spheroid has no drag entry).
    aspect_ratio : float, optional
        cylinder/rod: L/D (across: >= 1, default infinite; along: 0.5-8, required);
        plate broadside: long side / short side (>= 1, default 1).
    reynolds : float, optional
        Reynolds number on the entry's ``reynolds_length``. Checked against the entry's
        range when given; required for edgewise parts (skin friction). For a sphere it
        selects :func:`sphere_drag_coefficient`; for a cylinder across its axis
        :func:`cylinder_drag_coefficient` (1 <= Re <= 2e5), scaled by the finite-length
        factor C_d(L/D) / 1.2 when ``aspect_ratio`` is given (that factor was measured near
        Re 1e5; using it at low Re is our approximation).

    Examples
    --------
    >>> drag_coefficient("sphere")
    0.47
    >>> drag_coefficient("rod", "across", aspect_ratio=10.0)
    0.82
    """
    base, d = _shape_direction(shape, direction)
    entry = drag_entry(base, None if base == "sphere" else d)
    if base == "sphere":
        if reynolds is not None:
            return sphere_drag_coefficient(reynolds)
        return entry.drag_coefficient
    if entry.reference_area == "planform":
        return friction_drag_coefficient(_reynolds(reynolds, entry, needed=True))
    if base == "cylinder" and d == "across":
        ratio = None if aspect_ratio is None else real_scalar(
            aspect_ratio, "aspect_ratio",
            "length / diameter >= 1 (shorter cylinders are not tabulated)", low=1.0)
        if reynolds is not None:
            factor = 1.0 if ratio is None else _interp_inverse(_CYL_ACROSS, ratio) / 1.2
            return cylinder_drag_coefficient(reynolds) * factor
        return entry.drag_coefficient if ratio is None else _interp_inverse(_CYL_ACROSS, ratio)
    _reynolds(reynolds, entry)
    if base == "cylinder":
        if aspect_ratio is None:
            raise InvalidInput("aspect_ratio", None, "length / diameter in [0.5, 8]",
                               "needed for a cylinder moving along its axis")
        ratio = real_scalar(aspect_ratio, "aspect_ratio", "length / diameter in [0.5, 8]",
                            low=0.5, high=8.0)
        xs, ys = zip(*_CYL_ALONG)
        return float(np.interp(ratio, xs, ys))
    if base == "plate":
        ratio = 1.0 if aspect_ratio is None else real_scalar(
            aspect_ratio, "aspect_ratio", "long side / short side >= 1", low=1.0)
        return _interp_inverse(_PLATE_DRAG, ratio)
    return entry.drag_coefficient
