"""Volume, radius of gyration and air-facing profile of the parts of a compound pendulum.

Frame (fixed here, used by every caller): the pivot axis is z, normal to the swing
plane. In the swing plane, s runs along the arm (downward from the pivot at rest) and u
across it (horizontal, the direction of motion at the bottom). Each function describes
one uniform solid about its own centroid, in the orientation its keyword names; the
caller places it along the arm (parallel-axis theorem) and supplies the density.

Orientation strings (anything else raises ValueError naming the allowed values):

=========  =========  =============================================================
function   keyword    values (direction of the face normal or of the symmetry axis)
=========  =========  =============================================================
plate      normal     "pivot" (z: face in the swing plane), "swing" (u: broadside to
                      the air), "arm" (s: a horizontal plate)
disc       axis       "pivot" (z: swings in its own plane), "swing" (u: broadside to
                      the air), "arm" (s: a horizontal disc)
cylinder   axis       "arm" (s, the default), "swing" (u), "pivot" (z)
lens       axis       "pivot" (z: the clock bob seen face-on, the default), "swing"
                      (u: broadside to the air), "arm" (s: a horizontal lens)
=========  =========  =============================================================

rod, tube and flat_bar lie along s; sphere and point have no orientation.

Plain floats only, no validation (swingcalc.body validates). Formulas and sources:
docs/methods/parts.md.
"""

from __future__ import annotations

import math
from typing import NamedTuple

__all__ = [
    "ORIENTATIONS",
    "SHAPES",
    "Shape",
    "cylinder",
    "disc",
    "flat_bar",
    "lens",
    "plate",
    "point",
    "rod",
    "sphere",
    "tube",
]

_PI = math.pi

# Below this thickness-to-diameter ratio the lens side profile is summed from its series
# (the closed form cancels as eps / e^2); 16 terms leave a remainder below 1e-19 there.
_LENS_SERIES_LIMIT = 0.25
_LENS_SERIES_TERMS = 16


class Shape(NamedTuple):
    """One uniform part about its centroid, in the frame of the module notes.

    Attributes
    ----------
    volume : float
        [m^3].
    gyration_sq : float
        I_c / m about the axis through the centroid parallel to z (uniform density) [m^2].
    frontal_area : float
        Area projected on the s-z plane, i.e. seen along u (what the air meets) [m^2].
    frontal_width : float
        Extent of that projection along z [m].
    extent_s : float
        Extent along s, the arm [m].
    extent_u : float
        Extent along u, the direction of motion [m].
    """

    volume: float
    gyration_sq: float
    frontal_area: float
    frontal_width: float
    extent_s: float
    extent_u: float


ORIENTATIONS = {
    "plate": ("pivot", "swing", "arm"),
    "disc": ("pivot", "swing", "arm"),
    "cylinder": ("arm", "swing", "pivot"),
    "lens": ("pivot", "swing", "arm"),
}


def _check(kind, keyword, value):
    allowed = ORIENTATIONS[kind]
    if value not in allowed:
        listed = ", ".join(f"'{a}'" for a in allowed)
        raise ValueError(f"{kind} {keyword} must be one of {listed}; got {value!r}")


def _shape(*values):
    # Plain Python floats whatever numeric type came in (int, numpy scalar).
    return Shape(*(float(v) for v in values))


def _box(ds, du, dz):
    """Rectangular block with edges ds, du, dz along s, u, z [m]."""
    return _shape(ds * du * dz, (ds * ds + du * du) / 12.0, ds * dz, dz, ds, du)


def _round_bar(diameter, length, axis, inner_diameter=0.0):
    """Solid or hollow circular cylinder with its axis along "arm", "swing" or "pivot"."""
    ro = 0.5 * diameter
    ri = 0.5 * inner_diameter
    volume = _PI * (ro - ri) * (ro + ri) * length
    radial = ro * ro + ri * ri
    # About a transverse axis (3 (ro^2 + ri^2) + L^2) / 12; about its own axis (ro^2 + ri^2) / 2.
    transverse = (3.0 * radial + length * length) / 12.0
    if axis == "arm":
        return _shape(volume, transverse, length * diameter, diameter, length, diameter)
    if axis == "swing":
        return _shape(volume, transverse, _PI * ro * ro, diameter, diameter, length)
    return _shape(volume, 0.5 * radial, diameter * length, length, diameter, diameter)


def rod(length, diameter):
    """Solid circular rod along the arm.

    Parameters
    ----------
    length : float
        Along s [m].
    diameter : float
        [m].

    Returns
    -------
    Shape
        gyration_sq = L^2/12 + r^2/4; the air meets an L x D rectangle.

    Examples
    --------
    >>> rod(1.0, 0.0).gyration_sq == 1.0 / 12.0
    True
    """
    return _round_bar(diameter, length, "arm")


def tube(length, outer_diameter, inner_diameter):
    """Hollow circular tube along the arm.

    Parameters
    ----------
    length : float
        Along s [m].
    outer_diameter, inner_diameter : float
        [m], 0 <= inner <= outer.

    Returns
    -------
    Shape
        gyration_sq = (3 (ro^2 + ri^2) + L^2) / 12, which tends to ro^2/2 + L^2/12 for a
        thin wall; the volume is formed as pi (ro - ri)(ro + ri) L.
    """
    return _round_bar(outer_diameter, length, "arm", inner_diameter)


def flat_bar(length, width, thickness):
    """Rectangular bar: length along s, width along u, thickness along z (flat in the swing plane).

    Parameters
    ----------
    length, width, thickness : float
        [m].

    Returns
    -------
    Shape
        gyration_sq = (L^2 + w^2) / 12; the air meets the L x t edge.
    """
    return _box(length, width, thickness)


def plate(width, height, thickness, normal="pivot"):
    """Rectangular plate; width and height span the face, thickness runs along the normal.

    Parameters
    ----------
    width, height, thickness : float
        [m].
    normal : {"pivot", "swing", "arm"}
        Direction of the face normal: "pivot" (z; width along u, height along s),
        "swing" (u; width along z, height along s: broadside to the air), "arm"
        (s; width along u, height along z: a horizontal plate).

    Returns
    -------
    Shape
        gyration_sq = (w^2 + h^2)/12 ("pivot"), (h^2 + t^2)/12 ("swing"),
        (w^2 + t^2)/12 ("arm").
    """
    _check("plate", "normal", normal)
    if normal == "pivot":
        return _box(height, width, thickness)
    if normal == "swing":
        return _box(height, thickness, width)
    return _box(thickness, width, height)


def disc(diameter, thickness, axis="pivot"):
    """Solid disc or short cylinder.

    Parameters
    ----------
    diameter, thickness : float
        [m].
    axis : {"pivot", "swing", "arm"}
        Direction of its axis: "pivot" (z: it swings in its own plane), "swing" (u:
        broadside to the air), "arm" (s: a horizontal disc).

    Returns
    -------
    Shape
        gyration_sq = r^2/2 ("pivot"), (3 r^2 + t^2)/12 ("swing", "arm").
    """
    _check("disc", "axis", axis)
    return _round_bar(diameter, thickness, axis)


def cylinder(diameter, length, axis="arm"):
    """Solid circular cylinder.

    Parameters
    ----------
    diameter, length : float
        [m].
    axis : {"arm", "swing", "pivot"}
        Direction of its axis: s, u or z.

    Returns
    -------
    Shape
        gyration_sq = (3 r^2 + L^2)/12 ("arm", "swing"), r^2/2 ("pivot").
    """
    _check("cylinder", "axis", axis)
    return _round_bar(diameter, length, axis)


def sphere(diameter, inner_diameter=0.0):
    """Solid or hollow sphere.

    Parameters
    ----------
    diameter : float
        Outer diameter [m].
    inner_diameter : float
        Diameter of the concentric cavity [m], 0 (solid) to diameter (thin shell).

    Returns
    -------
    Shape
        gyration_sq = (2/5)(ro^5 - ri^5)/(ro^3 - ri^3), evaluated with the common factor
        ro - ri cancelled, so the thin shell ri -> ro gives 2 ro^2 / 3 without 0/0.
    """
    ro = 0.5 * diameter
    ri = 0.5 * inner_diameter
    shell = ro * ro + ro * ri + ri * ri  # (ro^3 - ri^3) / (ro - ri)
    volume = 4.0 / 3.0 * _PI * (ro - ri) * shell
    if shell > 0.0:
        quartic = ro**4 + ro**3 * ri + ro**2 * ri**2 + ro * ri**3 + ri**4
        gyration = 0.4 * quartic / shell
    else:
        gyration = 0.0
    return _shape(volume, gyration, _PI * ro * ro, diameter, diameter, diameter)


def _lens_profile(a, e):
    """Area of the lens's section through its axis (two circular segments), e = h / a.

    A segment of half-angle alpha = 2 atan(e) on a circle of radius R = a (1 + e^2)/(2e)
    has area R^2 (alpha - sin(alpha) cos(alpha)); for both,

        area = (a / e)^2 [(1 + e^2)^2 atan(e) - e (1 - e^2)]
             = 8 a^2 sum_{n>=1} (-1)^n e^(2n-1) / ((2n+1)(2n-1)(2n-3)),

    the series (from the Taylor series of atan) used for small e where the first form
    cancels.
    """
    if e < _LENS_SERIES_LIMIT:
        e2 = e * e
        term = e
        total = 0.0
        for n in range(1, _LENS_SERIES_TERMS + 1):
            total += (-1) ** n * term / ((2 * n + 1) * (2 * n - 1) * (2 * n - 3))
            term *= e2
        return 8.0 * a * a * total
    return (a / e) ** 2 * ((1.0 + e * e) ** 2 * math.atan(e) - e * (1.0 - e * e))


def lens(diameter, thickness, axis="pivot"):
    """Symmetric biconvex lens bob: two equal spherical caps base to base.

    Parameters
    ----------
    diameter : float
        Rim diameter D [m].
    thickness : float
        Centre thickness t [m], 0 <= t <= D (t = D is a sphere).
    axis : {"pivot", "swing", "arm"}
        Direction of its symmetry axis: "pivot" (z: the usual clock bob seen face-on,
        edge-on to the air), "swing" (u: broadside to the air), "arm" (s: horizontal).

    Returns
    -------
    Shape
        With a = D/2, h = t/2, A = a^2:
        volume = pi h (3 A + h^2) / 3;
        gyration_sq about the symmetry axis ("pivot") = (10 A^2 + 5 A h^2 + h^4) / (10 (3 A + h^2)),
        about a diameter through the centroid ("swing", "arm")
        = (10 A^2 + 15 A h^2 + 7 h^4) / (20 (3 A + h^2)).
        Both are finite as t -> 0 (A/3 and A/6, the thin lens) and equal 2 A / 5 at t = D.

    Notes
    -----
    The cap radius R = (a^2 + h^2)/(2h) grows without bound as t -> 0; every formula
    here is written in a and h only. Derivation: docs/methods/parts.md.
    """
    _check("lens", "axis", axis)
    a = 0.5 * diameter
    h = 0.5 * thickness
    A = a * a
    h2 = h * h
    base = 3.0 * A + h2
    volume = _PI * h * base / 3.0
    if base > 0.0:
        if axis == "pivot":
            gyration = (10.0 * A * A + 5.0 * A * h2 + h2 * h2) / (10.0 * base)
        else:
            gyration = (10.0 * A * A + 15.0 * A * h2 + 7.0 * h2 * h2) / (20.0 * base)
    else:
        gyration = 0.0
    if axis == "swing":
        return _shape(volume, gyration, _PI * A, diameter, diameter, thickness)
    profile = _lens_profile(a, h / a) if a > 0.0 else 0.0
    if axis == "pivot":
        return _shape(volume, gyration, profile, thickness, diameter, diameter)
    return _shape(volume, gyration, profile, diameter, thickness, diameter)


def point():
    """A point mass: no volume, no gyration, nothing for the air to meet."""
    return _shape(0.0, 0.0, 0.0, 0.0, 0.0, 0.0)


SHAPES = {
    "rod": rod,
    "tube": tube,
    "flat_bar": flat_bar,
    "plate": plate,
    "disc": disc,
    "cylinder": cylinder,
    "sphere": sphere,
    "lens": lens,
    "point": point,
}
