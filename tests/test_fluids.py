"""Added-mass and drag coefficients per part shape (swingcalc.fluids), against closed
forms in mpmath, the classical limits, and the handbook values they quote."""

from __future__ import annotations

import doctest
import math

import mpmath
import pytest

import swingcalc
import swingcalc.fluids as fl
from swingcalc import InvalidInput


def _mp_spheroid(r):
    """Lamb's alpha0, beta0 in closed form (Lamb, Hydrodynamics, 6th ed., sections 114-115
    [mem: sections]) for semi-axes r (axial), 1, 1, via the eccentricity e:
    prolate (r > 1, e^2 = 1 - 1/r^2):
        alpha0 = 2 (1 - e^2)/e^3 (atanh(e) - e),   beta0 = 1/e^2 - (1 - e^2)/e^3 atanh(e)
    oblate (r < 1, e^2 = 1 - r^2):
        alpha0 = 2/e^2 (1 - sqrt(1 - e^2) asin(e)/e),   beta0 = 1 - alpha0/2.
    A different route from the library's Carlson R_D."""
    with mpmath.workdps(60):
        r = mpmath.mpf(r)
        if r > 1:
            e = mpmath.sqrt(1 - 1 / r ** 2)
            a0 = 2 * (1 - e * e) / e ** 3 * (mpmath.atanh(e) - e)
            b0 = 1 / e ** 2 - (1 - e * e) / e ** 3 * mpmath.atanh(e)
        else:
            e = mpmath.sqrt(1 - r ** 2)
            a0 = 2 / e ** 2 * (1 - mpmath.sqrt(1 - e * e) * mpmath.asin(e) / e)
            b0 = 1 - a0 / 2
        return a0 / (2 - a0), b0 / (2 - b0)


@pytest.mark.parametrize("r", [1e-4, 0.01, 0.2, 0.5, 0.9, 0.999, 1.001, 1.5, 2.0, 10.0, 1e3])
def test_spheroid_coefficients_against_lambs_closed_forms(r):
    """mpmath at 60 digits; scipy's R_D is good to a few ulp, and the library forms
    2 - alpha0 as 2 beta0 (no cancellation): 1e-13 relative."""
    along, across = _mp_spheroid(r)
    assert swingcalc.spheroid_added_mass_coefficient(r, "along") == pytest.approx(
        float(along), rel=1e-13)
    assert swingcalc.spheroid_added_mass_coefficient(r, "across") == pytest.approx(
        float(across), rel=1e-13)


def test_sphere_limit_is_one_half():
    """Stokes 1851; Lamb section 92: C_a = 1/2 for a sphere, both ways (1e-15: R_D(1,1,1)
    = 1 exactly, DLMF 19.20.18)."""
    for d in ("along", "across"):
        assert swingcalc.spheroid_added_mass_coefficient(1.0, d) == pytest.approx(0.5, rel=1e-15)
    assert swingcalc.added_mass_coefficient("sphere") == 0.5
    r = 0.03
    assert swingcalc.added_mass("sphere", None, 1.2, radius=r) == pytest.approx(
        0.5 * 1.2 * 4 / 3 * math.pi * r ** 3, rel=1e-15)


def test_thin_lens_broadside_tends_to_the_disc_value():
    """Lamb section 108 [mem: section]: a disc of radius a moving broadside carries
    (8/3) rho a^3. An oblate spheroid differs from it by
    O(t/D): at t/D = 1e-6 (the smallest ratio accepted), 2e-6 relative."""
    a, rho = 0.12, 1.2
    lens = swingcalc.added_mass("lens", "broadside", rho, radius=a, thickness=2 * a * 1e-6)
    disc = swingcalc.added_mass("disc", "broadside", rho, radius=a)
    assert disc == pytest.approx(8 / 3 * rho * a ** 3, rel=1e-15)
    assert lens == pytest.approx(disc, rel=2e-6)


def test_slender_spheroid_across_tends_to_the_cylinder():
    """Lamb: the 2-D circular cylinder carries its displaced mass (C_a = 1) across its axis.
    A prolate spheroid of 1000:1 differs by ~ln(2r)/r^2 = 8e-6: 2e-5 absolute. Along the
    axis it tends to 0."""
    assert swingcalc.spheroid_added_mass_coefficient(1e3, "across") == pytest.approx(1.0, abs=2e-5)
    assert swingcalc.spheroid_added_mass_coefficient(1e3, "along") < 1e-5
    assert swingcalc.added_mass_coefficient("rod", "across") == 1.0
    assert swingcalc.added_mass_coefficient("cylinder", "along") == 0.0


@pytest.mark.parametrize("ratio, k1, k2", [
    (1.5, 0.305, 0.621), (2.0, 0.209, 0.702), (2.99, 0.122, 0.803), (4.99, 0.059, 0.895),
    (9.97, 0.021, 0.960)])
def test_prolate_spheroid_against_lambs_table(ratio, k1, k2):
    """Lamb's table of k1 (along) and k2 (across) for prolate spheroids [mem: numbers and
    the a/b column]. Printed to 3 decimals against a/b values that are themselves rounded,
    so 2.5e-3 absolute (a swapped direction or a wrong integral is off by > 0.1)."""
    assert swingcalc.spheroid_added_mass_coefficient(ratio, "along") == pytest.approx(k1, abs=2.5e-3)
    assert swingcalc.spheroid_added_mass_coefficient(ratio, "across") == pytest.approx(k2, abs=2.5e-3)


def test_lens_edgewise_is_small():
    """An oblate spheroid moving in its own plane: C_a -> (pi/4)(t/D) for a thin lens
    (from the oblate closed form, beta0 ~ (pi/2) r); at t/D = 0.01 within 2 % of it."""
    c = swingcalc.added_mass_coefficient("lens", "edgewise", aspect_ratio=0.01)
    assert c == pytest.approx(math.pi / 4 * 0.01, rel=0.02)


def test_square_plate_close_to_the_disc_of_equal_area():
    """DNV-RP-H103 Table A-2 [mem]: square plate C_A = 0.579 on (pi/4) a^3, i.e. 0.4547
    rho a^3. The disc of the same area ((8/3) rho (a/sqrt(pi))^3 = 0.4789 rho a^3) must be
    within 6 % (the two shapes differ only at the corners); the long-strip end of the table
    tends to the 2-D value rho pi a^2/4 per length (Lamb section 71 [mem: section])."""
    a = 0.2
    sq = swingcalc.added_mass("plate", "broadside", 1.0, length=a, width=a)
    assert sq == pytest.approx(0.579 * math.pi / 4 * a ** 3, rel=1e-12)
    disc = swingcalc.added_mass("disc", "broadside", 1.0, radius=a / math.sqrt(math.pi))
    assert sq == pytest.approx(disc, rel=0.06)
    long = swingcalc.added_mass("plate", "broadside", 1.0, length=a, width=1000 * a)
    assert long / (1000 * a) == pytest.approx(math.pi * a * a / 4, rel=1e-3)


def test_cylinder_along_uses_the_end_disc():
    """Our approximation: a cylinder moving along its axis carries the end disc's
    (8/3) rho r^3, i.e. C_a = 4/(3 pi L/D) of its displaced mass."""
    m = swingcalc.added_mass("cylinder", "along", 1.0, radius=0.05, length=0.4)
    assert m == pytest.approx(swingcalc.added_mass("disc", "broadside", 1.0, radius=0.05))
    c = swingcalc.added_mass_coefficient("cylinder", "along", aspect_ratio=4.0)
    assert c * math.pi * 0.05 ** 2 * 0.4 == pytest.approx(m, rel=1e-14)


def test_edgewise_flat_parts_carry_no_added_mass():
    for shape in ("disc", "plate"):
        assert swingcalc.added_mass_coefficient(shape, "edgewise") == 0.0
    assert swingcalc.added_mass("plate", "edgewise", 1.2, length=0.1, width=0.2) == 0.0


# --- Drag -------------------------------------------------------------------------------

def test_sphere_drag_value_and_correlation():
    """REFERENCES.md [pub: fluid mechanics texts]: 0.4-0.5 over Re 1e3-2.5e5, 0.47 commonly
    quoted. The correlation tends to Stokes's 24/Re (Stokes 1851): at Re = 1e-3 within
    0.2 % (the 0.15 Re^0.687 term is 1.3e-3); continuous at Re = 1000 to 0.4 %
    (0.4383 below, 0.44 above)."""
    assert swingcalc.drag_coefficient("sphere") == 0.47
    for re in (1e3, 3e3, 1e4, 5e4, 1e5, 2e5):
        assert 0.4 <= swingcalc.sphere_drag_coefficient(re) <= 0.5
    assert swingcalc.sphere_drag_coefficient(1e-3) == pytest.approx(24e3, rel=2e-3)
    below = swingcalc.sphere_drag_coefficient(999.999)
    assert below == pytest.approx(swingcalc.sphere_drag_coefficient(1000.0), rel=4e-3)
    assert swingcalc.drag_coefficient("sphere", reynolds=50.0) > 1.0


def test_cylinder_and_flat_part_drag_values():
    """Brief and White Table 7.2/7.3, Hoerner [mem]: cylinder in cross-flow about 1.0-1.2,
    lower when short; disc broadside 1.17-1.2; square plate 1.17-1.28 (both figures are
    quoted), rising towards 2.0 for a long strip."""
    assert 1.0 <= swingcalc.drag_coefficient("cylinder", "across") <= 1.2
    for re in (1e4, 5e4, 2e5):
        assert 1.0 <= swingcalc.cylinder_drag_coefficient(re) <= 1.2
    short = [swingcalc.drag_coefficient("rod", "across", aspect_ratio=r) for r in (1, 5, 40)]
    assert short == sorted(short) and short[-1] < 1.2
    assert 1.17 <= swingcalc.drag_coefficient("disc", "broadside") <= 1.2
    sq = swingcalc.drag_coefficient("plate", "broadside")
    assert 1.17 <= sq <= 1.28
    assert swingcalc.drag_coefficient("plate", "broadside", aspect_ratio=20.0) == 1.5
    assert swingcalc.drag_coefficient("lens", "broadside") < 1.17


def test_edgewise_drag_is_blasius_friction():
    """Blasius (1908): laminar flat-plate friction 1.328/sqrt(Re_L) per face [mem: number,
    White ch. 7]; two faces: at Re 1e4, 0.02656 (1e-12: one square root)."""
    for shape in ("disc", "plate", "lens"):
        got = swingcalc.drag_coefficient(shape, "edgewise", reynolds=1e4)
        assert got == pytest.approx(2 * 1.328 / 100.0, rel=1e-12)
    assert fl.drag_entry("plate", "edgewise").reference_area == "planform"


def test_every_row_has_a_source_and_a_range():
    for e in list(fl.ADDED_MASS.values()) + list(fl.DRAG.values()):
        assert e.source.strip() and e.formula.strip()
        assert e.to_dict()["shape"] == e.shape
    for e in fl.DRAG.values():
        assert 0 < e.reynolds_min < e.reynolds_max
        assert e.reference_area in ("frontal", "planform")


# --- Bad input -------------------------------------------------------------------------

@pytest.mark.parametrize("call, field, text", [
    (lambda: swingcalc.added_mass_coefficient("sphear"), "shape", "did you mean 'sphere'"),
    (lambda: swingcalc.added_mass_coefficient("disc", "across"), "direction", "broadside"),
    (lambda: swingcalc.added_mass_coefficient("rod", "edgewise"), "direction", "along"),
    (lambda: swingcalc.added_mass_coefficient("rod"), "direction", "along"),
    (lambda: swingcalc.added_mass_coefficient("disc", "broadside"), "shape", "added_mass"),
    (lambda: swingcalc.added_mass_coefficient("spheroid", "along"), "aspect_ratio", "needed"),
    (lambda: swingcalc.added_mass_coefficient("lens", "broadside", aspect_ratio=2.0),
     "aspect_ratio", "lens"),
    (lambda: swingcalc.spheroid_added_mass_coefficient(0.0, "along"), "aspect_ratio", ""),
    (lambda: swingcalc.spheroid_added_mass_coefficient(float("nan"), "along"),
     "aspect_ratio", ""),
    (lambda: swingcalc.added_mass("sphere", None, 1.2), "radius", "needed"),
    (lambda: swingcalc.added_mass("sphere", None, -1.0, radius=0.1), "fluid_density", ""),
    (lambda: swingcalc.added_mass("plate", "broadside", 1.2, length=0.1), "width", "needed"),
    (lambda: swingcalc.added_mass("sphere", None, 1e300, radius=1e200), "dimensions/fluid_density",
     "overflows"),
    (lambda: swingcalc.drag_coefficient("plate", "edgewise"), "reynolds", "needed"),
    (lambda: swingcalc.drag_coefficient("disc", "broadside", reynolds=10.0), "reynolds", ""),
    (lambda: swingcalc.drag_coefficient("cylinder", "along"), "aspect_ratio", "needed"),
    (lambda: swingcalc.drag_coefficient("cylinder", "across", aspect_ratio=0.5),
     "aspect_ratio", ""),
    (lambda: swingcalc.drag_coefficient("spheroid", "along"), "shape", "spheroid"),
    (lambda: swingcalc.sphere_drag_coefficient(0.0), "reynolds", ""),
    (lambda: swingcalc.sphere_drag_coefficient(1e6), "reynolds", "drag crisis"),
    (lambda: swingcalc.friction_drag_coefficient(1e7), "reynolds", "laminar"),
])
def test_bad_input_is_refused_by_name(call, field, text):
    with pytest.raises(InvalidInput) as info:
        call()
    assert info.value.field == field
    assert text in str(info.value)


def test_fluids_docstring_examples_run():
    result = doctest.testmod(fl, extraglobs={"math": math}, verbose=False)
    assert result.failed == 0 and result.attempted >= 5
