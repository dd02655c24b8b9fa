"""The part shapes (swingcalc.kernels.inertia) against handbooks, quadrature and limits.

Frame: z is the pivot axis; in the swing plane s runs along the arm, u across it (the
direction of motion). gyration_sq is I/m about the axis through the centroid parallel
to z, uniform density; frontal_area is the shadow on the s-z plane (seen along u).

Independent side: each solid is described here by its geometry alone (a box, a solid of
revolution with its radius or half-length profile, a spherical shell), placed in (s, u, z)
by the orientation words of the API ("arm" = s, "swing" = u, "pivot" = z), and its volume,
its moment of (s^2 + u^2) and its shadow are integrated with scipy.integrate (nquad, quad)
in the solid's natural coordinates. No closed form of the kernel is reused.

Quadrature tolerance: requested epsrel 1e-11, and the comparisons allow exactly that.
The integrands are polynomials or trigonometric polynomials in the inner variables and
smooth (or square-root at one end: the sphere and the hemisphere-capped lens) in the
outer ones, where adaptive Gauss-Kronrod meets its request with a wide margin: measured
agreement is 1.5e-15 or better in every case (docs/methods/parts.md).
"""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest
from helpers import EPS
from scipy import integrate

from swingcalc.kernels import inertia as ki

QUAD = {"epsabs": 0.0, "epsrel": 1e-11, "limit": 200}
NQUAD = [{"epsabs": 0.0, "epsrel": 1e-11, "limit": 200}] * 3
RTOL_QUAD = 1e-11


# --- Independent geometry and quadrature --------------------------------------------------

def _place(axis, x, p, q):
    """(s, u, z) of a point with coordinate x along the solid's axis and p, q across it."""
    if axis == "s":
        return x, p, q
    if axis == "u":
        return p, x, q
    return p, q, x  # axis along z


def _box_integrals(ds, du, dz):
    """Volume, moment of (s^2 + u^2), shadow area of a block with edges ds, du, dz."""
    lim = [(-dz / 2, dz / 2), (-du / 2, du / 2), (-ds / 2, ds / 2)]
    vol = integrate.nquad(lambda z, u, s: 1.0, lim, opts=NQUAD)[0]
    mom = integrate.nquad(lambda z, u, s: s * s + u * u, lim, opts=NQUAD)[0]
    # Shadow on s-z: at each s the z-width of the block.
    shadow = integrate.quad(lambda s: dz, -ds / 2, ds / 2, **QUAD)[0]
    return vol, mom, shadow


def _revolution_integrals(axis, half_length, radius_max, inner=0.0):
    """Volume, moment of (s^2 + u^2) and shadow area of a solid of revolution.

    half_length(rho): half-extent along the axis at distance rho from it, for
    inner <= rho <= radius_max (rho < inner is hollow). Cylindrical coordinates
    (x, rho, phi), volume element rho dx drho dphi.
    """
    def x_range(rho, phi):
        c = half_length(rho)
        return (-c, c)

    lim = [x_range, (inner, radius_max), (0.0, 2.0 * math.pi)]

    def moment(x, rho, phi):
        s, u, _ = _place(axis, x, rho * math.cos(phi), rho * math.sin(phi))
        return rho * (s * s + u * u)

    vol = integrate.nquad(lambda x, rho, phi: rho, lim, opts=NQUAD)[0]
    mom = integrate.nquad(moment, lim, opts=NQUAD)[0]
    if axis == "u":
        # Seen along its axis: the disc of the largest radius.
        width = lambda s: 2.0 * math.sqrt(max(radius_max * radius_max - s * s, 0.0))
        lo, hi = -radius_max, radius_max
    elif axis == "z":
        # Axis in the picture plane along z: at s the z-extent is the section at rho = |s|.
        width = lambda s: 2.0 * half_length(abs(s))
        lo, hi = -radius_max, radius_max
    else:
        # Axis along s: at s the z-extent is twice the radius there, found from the
        # half-length profile by inverting it numerically (bisection on rho).
        def width(s):
            lo_r, hi_r = 0.0, radius_max
            if half_length(hi_r) >= abs(s):
                return 2.0 * hi_r
            for _ in range(200):
                mid = 0.5 * (lo_r + hi_r)
                if half_length(mid) >= abs(s):
                    lo_r = mid
                else:
                    hi_r = mid
            return 2.0 * lo_r
        h0 = half_length(0.0)
        lo, hi = -h0, h0
    shadow = integrate.quad(width, lo, hi, **QUAD)[0]
    return vol, mom, shadow


def _lens_half_length(a, h):
    """Half-thickness of a biconvex lens at radius rho: sqrt(R^2 - rho^2) - (R - h)."""
    R = (a * a + h * h) / (2.0 * h)
    return lambda rho: math.sqrt(max(R * R - rho * rho, 0.0)) - (R - h)


def _sphere_integrals(ro, ri):
    """Volume, moment of (s^2 + u^2), shadow of a spherical shell, spherical coordinates.

    s = r sin(th) cos(ph), u = r sin(th) sin(ph), z = r cos(th); element r^2 sin(th).
    """
    lim = [(ri, ro), (0.0, math.pi), (0.0, 2.0 * math.pi)]
    vol = integrate.nquad(lambda r, th, ph: r * r * math.sin(th), lim, opts=NQUAD)[0]
    mom = integrate.nquad(lambda r, th, ph: r**4 * math.sin(th) ** 3, lim, opts=NQUAD)[0]
    shadow = integrate.quad(lambda s: 2.0 * math.sqrt(max(ro * ro - s * s, 0.0)), -ro, ro,
                            **QUAD)[0]
    return vol, mom, shadow


def _check_against(shape, vol, mom, shadow, extents):
    assert shape.volume == pytest.approx(vol, rel=RTOL_QUAD)
    assert shape.gyration_sq == pytest.approx(mom / vol, rel=RTOL_QUAD)
    assert shape.frontal_area == pytest.approx(shadow, rel=RTOL_QUAD)
    # Extents are read off the geometry directly (exact inputs, 1 ulp of rounding).
    ds, du, dz = extents
    assert shape.extent_s == pytest.approx(ds, rel=2 * EPS)
    assert shape.extent_u == pytest.approx(du, rel=2 * EPS)
    assert shape.frontal_width == pytest.approx(dz, rel=2 * EPS)


# Dimensions are unequal on purpose, so an exchanged pair of axes shows.
L, D, DI, W, T = 0.9, 0.13, 0.08, 0.21, 0.017

BOX_CASES = [
    # (call, edges along s, u, z as the API text places them)
    ("flat_bar", lambda: ki.flat_bar(L, W, T), (L, W, T)),
    ("plate pivot", lambda: ki.plate(W, L, T, normal="pivot"), (L, W, T)),   # width u, height s
    ("plate swing", lambda: ki.plate(W, L, T, normal="swing"), (L, T, W)),   # width z, height s
    ("plate arm", lambda: ki.plate(W, L, T, normal="arm"), (T, W, L)),       # width u, height z
]


@pytest.mark.parametrize("name, call, edges", BOX_CASES, ids=[c[0] for c in BOX_CASES])
def test_box_shapes_match_triple_quadrature(name, call, edges):
    """flat_bar and plate in every orientation: volume, gyration about z, shadow by nquad."""
    vol, mom, shadow = _box_integrals(*edges)
    _check_against(call(), vol, mom, shadow, edges)


ROUND_CASES = [
    # (name, call, axis, half-length profile, outer radius, inner radius, extents s, u, z)
    ("rod", lambda: ki.rod(L, D), "s", lambda r: L / 2, D / 2, 0.0, (L, D, D)),
    ("tube", lambda: ki.tube(L, D, DI), "s", lambda r: L / 2, D / 2, DI / 2, (L, D, D)),
    ("disc pivot", lambda: ki.disc(D, T, axis="pivot"), "z", lambda r: T / 2, D / 2, 0.0,
     (D, D, T)),
    ("disc swing", lambda: ki.disc(D, T, axis="swing"), "u", lambda r: T / 2, D / 2, 0.0,
     (D, T, D)),
    ("disc arm", lambda: ki.disc(D, T, axis="arm"), "s", lambda r: T / 2, D / 2, 0.0,
     (T, D, D)),
    ("cylinder arm", lambda: ki.cylinder(D, W, axis="arm"), "s", lambda r: W / 2, D / 2, 0.0,
     (W, D, D)),
    ("cylinder swing", lambda: ki.cylinder(D, W, axis="swing"), "u", lambda r: W / 2, D / 2,
     0.0, (D, W, D)),
    ("cylinder pivot", lambda: ki.cylinder(D, W, axis="pivot"), "z", lambda r: W / 2, D / 2,
     0.0, (D, D, W)),
]


@pytest.mark.parametrize("name, call, axis, half, ro, ri, extents", ROUND_CASES,
                         ids=[c[0] for c in ROUND_CASES])
def test_round_shapes_match_cylindrical_quadrature(name, call, axis, half, ro, ri, extents):
    """rod, tube, disc and cylinder in every orientation, by nquad in (x, rho, phi)."""
    vol, mom, shadow = _revolution_integrals(axis, half, ro, ri)
    _check_against(call(), vol, mom, shadow, extents)


@pytest.mark.parametrize("ri", [0.0, DI / 2])
def test_sphere_matches_spherical_quadrature(ri):
    """Solid and hollow sphere by nquad in (r, theta, phi)."""
    vol, mom, shadow = _sphere_integrals(D / 2, ri)
    _check_against(ki.sphere(D, 2 * ri), vol, mom, shadow, (D, D, D))


LENS_T = [0.2 * D, 0.6 * D, D]


@pytest.mark.parametrize("t", LENS_T)
@pytest.mark.parametrize("orientation, axis", [("pivot", "z"), ("swing", "u"), ("arm", "s")])
def test_lens_matches_cylindrical_quadrature(t, orientation, axis):
    """Lens of several thicknesses (up to the sphere t = D) in each orientation.

    The lens is built from its definition, two caps of a sphere of radius
    R = (a^2 + h^2)/(2h) base to base (half-thickness sqrt(R^2 - rho^2) - (R - h)), and
    integrated in (x, rho, phi) about its own axis; the shadow is integrated over s from
    the section (axis z), the largest disc (axis u), or the radius found by bisection
    along the axis (axis s), three different routes to the side profile and the circle.
    """
    half = _lens_half_length(D / 2, t / 2)
    vol, mom, shadow = _revolution_integrals(axis, half, D / 2)
    extents = {"z": (D, D, t), "u": (D, t, D), "s": (t, D, D)}[axis]
    _check_against(ki.lens(D, t, axis=orientation), vol, mom, shadow, extents)


def test_point_is_all_zero():
    """A point mass has no size: every field 0 (definition)."""
    assert tuple(ki.point()) == (0.0,) * 6


# --- Handbook values ------------------------------------------------------------------------

# Closed forms applied to exact inputs on both sides: 4 ulp covers the different orders
# of rounding.
HB = 4 * EPS


def test_thin_rod_about_centre_young_freedman():
    """Slender rod about its centre, I = M L^2 / 12 (Young & Freedman, University Physics,
    Table 9.2): rod with zero diameter."""
    assert ki.rod(1.7, 0.0).gyration_sq == pytest.approx(1.7**2 / 12, rel=HB)


def test_disc_about_axis_and_diameter():
    """Disc about its axis M R^2 / 2 (Young & Freedman Table 9.2, solid cylinder) and about
    a diameter M R^2 / 4 (thin disc; REFERENCES.md lists it under the same table, which is
    from memory [mem]; it also follows from the perpendicular-axis theorem, R^2/2 = 2 x R^2/4).
    axis "pivot" turns about its own axis; axis "swing" with t = 0 about a diameter."""
    R = 0.15
    assert ki.disc(2 * R, 0.04, axis="pivot").gyration_sq == pytest.approx(R * R / 2, rel=HB)
    assert ki.disc(2 * R, 0.0, axis="swing").gyration_sq == pytest.approx(R * R / 4, rel=HB)
    assert ki.disc(2 * R, 0.0, axis="arm").gyration_sq == pytest.approx(R * R / 4, rel=HB)


def test_solid_sphere_and_thin_shell_young_freedman():
    """Solid sphere 2 M R^2 / 5, thin-walled hollow sphere 2 M R^2 / 3 (Young & Freedman
    Table 9.2); the shell is sphere(D, inner_diameter=D) exactly, no 0/0."""
    R = 0.11
    assert ki.sphere(2 * R).gyration_sq == pytest.approx(0.4 * R * R, rel=HB)
    shell = ki.sphere(2 * R, 2 * R)
    assert shell.volume == 0.0
    assert shell.gyration_sq == pytest.approx(2.0 * R * R / 3.0, rel=HB)


def test_rectangular_plate_about_normal_young_freedman():
    """Rectangular plate a x b about the normal through its centre, M (a^2 + b^2)/12
    (Young & Freedman Table 9.2): plate(normal="pivot"), thickness irrelevant."""
    a, b = 0.4, 0.25
    assert ki.plate(a, b, 0.01, normal="pivot").gyration_sq == pytest.approx(
        (a * a + b * b) / 12, rel=HB)


def test_cylinders_about_transverse_axis_machinerys_handbook():
    """Solid cylinder about a transverse axis through its centre M (3 r^2 + L^2)/12 and
    thick-walled tube M (3 (r1^2 + r2^2) + L^2)/12 (Machinery's Handbook, table of moments
    of inertia of solids [mem: edition and page not re-checked])."""
    r, r1, r2, length = 0.05, 0.05, 0.035, 1.2
    expected_solid = (3 * r * r + length * length) / 12
    assert ki.rod(length, 2 * r).gyration_sq == pytest.approx(expected_solid, rel=HB)
    assert ki.cylinder(2 * r, length, axis="arm").gyration_sq == pytest.approx(
        expected_solid, rel=HB)
    assert ki.cylinder(2 * r, length, axis="swing").gyration_sq == pytest.approx(
        expected_solid, rel=HB)
    expected_tube = (3 * (r1 * r1 + r2 * r2) + length * length) / 12
    assert ki.tube(length, 2 * r1, 2 * r2).gyration_sq == pytest.approx(expected_tube, rel=HB)


def test_lens_volume_is_two_spherical_caps_crc():
    """Cap of height h on a sphere of radius R: V = pi h^2 (3R - h) / 3 (CRC Standard
    Mathematical Tables [mem]); the lens is two of them with R = (a^2 + h^2)/(2h).

    For t/D >= 0.01 forming R costs at most a few ulp; 1e-14 relative."""
    a = 0.1
    for t in (0.002, 0.03, 0.1, 0.17, 0.2):
        h = t / 2
        R = (a * a + h * h) / (2 * h)
        cap = math.pi * h * h * (3 * R - h) / 3
        assert ki.lens(2 * a, t).volume == pytest.approx(2 * cap, rel=1e-14), t


def test_lens_side_profile_matches_mpmath_circular_segments():
    """Side profile (frontal area, axis "pivot") = two circular segments, each
    R^2 (alpha - sin(alpha) cos(alpha)) with sin(alpha) = a/R (standard geometry), by mpmath
    at 50 digits, across the kernel's switch from series to closed form (t/D = 0.25).

    The closed form cancels by about 3/(8 e^2) at e = h/a; at the switch (e = 0.25) that is
    6 ulp: 4e-15 relative covers it."""
    a = 0.5
    for e in (1e-9, 1e-4, 0.01, 0.1, 0.2499999, 0.25, 0.2500001, 0.5, 0.9, 1.0):
        with mpmath.workdps(50):
            am = mpmath.mpf(a)
            hm = am * mpmath.mpf(e)
            R = (am * am + hm * hm) / (2 * hm)
            alpha = mpmath.asin(am / R)
            ref = 2 * R * R * (alpha - mpmath.sin(alpha) * mpmath.cos(alpha))
        got = ki.lens(2 * a, 2 * a * e, axis="pivot").frontal_area
        assert got == pytest.approx(float(ref), rel=4e-15), e


# --- Limits -----------------------------------------------------------------------------

def test_tube_tends_to_rod_as_bore_closes():
    """tube(L, D, 0) is the rod; a 1e-9 m bore changes gyration by ~ (d/2)^2/4 / k^2."""
    assert tuple(ki.tube(L, D, 0.0)) == pytest.approx(tuple(ki.rod(L, D)), rel=HB)
    near = ki.tube(L, D, 1e-9)
    assert near.gyration_sq == pytest.approx(ki.rod(L, D).gyration_sq, rel=HB)


def test_thin_walled_tube_limit():
    """Thin-walled tube: r^2/2 + L^2/12 about a transverse axis (thin-walled hollow cylinder
    M R^2 about its axis, Young & Freedman Table 9.2, with the perpendicular-axis split R^2/2
    for a diameter, plus the rod term [mem: standard]); volume 0, no NaN."""
    r = D / 2
    thin = ki.tube(L, D, D)
    assert thin.volume == 0.0
    assert thin.gyration_sq == pytest.approx(r * r / 2 + L * L / 12, rel=HB)


def test_thin_shell_limit_is_continuous():
    """sphere(D, D (1 - d)) -> 2 r^2 / 3 as d -> 0; the error is O(d) (the mean of r^2
    over a wall of relative thickness d), so allow 2 d."""
    r = D / 2
    for d in (1e-3, 1e-6, 1e-9, 1e-13):
        got = ki.sphere(D, D * (1 - d)).gyration_sq
        assert got == pytest.approx(2 * r * r / 3, rel=2 * d + HB), d
        assert math.isfinite(got)


def test_thin_lens_limit_by_quadrature_of_a_parabolic_lamina():
    """As t -> 0 the lens is a lamina of areal density proportional to its thickness,
    2 (sqrt(R^2 - rho^2) - (R - h)) -> (a^2 - rho^2) / R (the paraboloid). Its mean rho^2
    (by quad, independent of the kernel) is the gyration about the axis ("pivot"); about a
    diameter it is half that (perpendicular-axis theorem for a lamina, Young & Freedman,
    from memory [mem]). At t = 0 exactly: volume 0, finite gyration, no NaN. The lens
    differs from the lamina by O((t/D)^2): allow 2 (t/D)^2 relative."""
    a = 0.1
    num = integrate.quad(lambda r: r**3 * (a * a - r * r), 0, a, **QUAD)[0]
    den = integrate.quad(lambda r: r * (a * a - r * r), 0, a, **QUAD)[0]
    axis_limit = num / den
    for t in (0.0, 1e-12, 1e-6, 1e-3):
        ratio_sq = (t / (2 * a)) ** 2
        face = ki.lens(2 * a, t, axis="pivot")
        edge = ki.lens(2 * a, t, axis="swing")
        assert face.gyration_sq == pytest.approx(axis_limit, rel=2 * ratio_sq + RTOL_QUAD)
        assert edge.gyration_sq == pytest.approx(axis_limit / 2, rel=2 * ratio_sq + RTOL_QUAD)
        for field in (*face, *edge):
            assert math.isfinite(field)
        # Volume of the paraboloid lamina: pi a^2 (t/2) (exact to O((t/D)^2) relative).
        assert face.volume == pytest.approx(math.pi * a * a * t / 2, rel=2 * ratio_sq)
        # Side profile: two parabolic segments, 2 x (2/3)(2a)(t/2) (Archimedes).
        assert face.frontal_area == pytest.approx(4 * a * t / 3, rel=2 * ratio_sq + HB)
    assert ki.lens(2 * a, 0.0).volume == 0.0


@pytest.mark.parametrize("orientation", ["pivot", "swing", "arm"])
def test_lens_of_thickness_equal_to_diameter_is_the_sphere(orientation):
    """t = D: two hemispheres make the sphere (geometry). Every field equals sphere(D)'s,
    to 4 ulp (the two closed forms round in different orders)."""
    for diameter in (0.01, 0.2, 3.0):
        assert tuple(ki.lens(diameter, diameter, axis=orientation)) == pytest.approx(
            tuple(ki.sphere(diameter)), rel=HB)


def test_zero_size_parts_stay_finite():
    """Zero diameter sphere or lens (a point in the limit) gives zeros, not 0/0."""
    for shape in (ki.sphere(0.0), ki.sphere(0.0, 0.0), ki.lens(0.0, 0.0),
                  ki.lens(0.0, 0.0, axis="swing")):
        assert all(math.isfinite(v) for v in shape)
        assert shape.gyration_sq == 0.0 and shape.volume == 0.0


# --- Interface ----------------------------------------------------------------------------

@pytest.mark.parametrize("fn, keyword, allowed", [
    (lambda o: ki.plate(0.1, 0.2, 0.01, normal=o), "normal", ("pivot", "swing", "arm")),
    (lambda o: ki.disc(0.1, 0.01, axis=o), "axis", ("pivot", "swing", "arm")),
    (lambda o: ki.cylinder(0.1, 0.3, axis=o), "axis", ("arm", "swing", "pivot")),
    (lambda o: ki.lens(0.1, 0.03, axis=o), "axis", ("pivot", "swing", "arm")),
])
def test_unknown_orientation_raises_value_error_listing_allowed(fn, keyword, allowed):
    """Anything but the listed strings (including other case, or the axis letters) is a
    ValueError whose message names the keyword, every allowed value and the bad one."""
    for bad in ("Pivot", "z", "up", ""):
        with pytest.raises(ValueError) as err:
            fn(bad)
        message = str(err.value)
        assert keyword in message and repr(bad) in message
        for word in allowed:
            assert f"'{word}'" in message
    for good in allowed:
        fn(good)


def test_shapes_table_and_plain_float_results():
    """SHAPES maps each documented name to its function; results are plain floats for int
    and numpy inputs (the body module sums them as Python floats)."""
    assert set(ki.SHAPES) == {"rod", "tube", "flat_bar", "plate", "disc", "cylinder",
                              "sphere", "lens", "point"}
    for name, fn in ki.SHAPES.items():
        assert fn is getattr(ki, name)
    for shape in (ki.rod(1, 0), ki.tube(np.float64(1.0), 2, 1), ki.sphere(np.float32(0.5)),
                  ki.lens(2, 1, axis="arm"), ki.plate(1, 2, 3, normal="swing"), ki.point()):
        assert all(type(v) is float for v in shape)
    assert ki.Shape._fields == ("volume", "gyration_sq", "frontal_area", "frontal_width",
                                "extent_s", "extent_u")
