"""Compound pendulums from parts: mass properties, equivalent length, centre of
percussion, air effects and the rate change with temperature, each against a handbook
result, a closed form derived independently here, or the environment module's point-bob
formula."""

import math

import pytest

from swingcalc.body import Part, Suspension, assemble, point_bob, scaled_for_temperature
from swingcalc.compound import compound_pendulum, thermal_rate
from swingcalc.environment import fluid_rate_shift
from swingcalc.errors import InvalidInput

G = 9.80665  # standard gravity, exact (3rd CGPM 1901)
EPS = 2.220446049250313e-16


def rod(length=1.0, diameter=1e-5, **kw):
    kw.setdefault("density", 7850.0)
    return Part("rod", "rod", position=kw.pop("position", 0.0), at=kw.pop("at", "top"),
                size={"length": length, "diameter": diameter}, **kw)


def test_uniform_rod_about_one_end_has_the_handbook_period_and_centre_of_percussion():
    """Thin rod about one end: I = m L^2 / 3 (Young & Freedman, University Physics,
    Table 9.2), so L_eq = 2L/3, the centre of percussion, and T0 = 2 pi sqrt(2L/(3g))
    = 1.638226327 s for L = 1 m at g_n (REFERENCES.md [calc]). The rod is 10 um thick:
    a solid cylinder about a transverse end axis has I = m (L^2/3 + r^2/4) (Machinery's
    Handbook, moments of inertia [mem]), so L_eq = 2L/3 + r^2/(2L), 1.9e-11 above 2L/3:
    checked exactly, and 2L/3 to 3e-11."""
    r = 5e-6
    b = assemble([rod()])
    assert b.equivalent_length_m == pytest.approx(2.0 / 3.0 + r * r / 2, rel=4 * EPS)
    assert b.equivalent_length_m == pytest.approx(2.0 / 3.0, rel=3e-11)
    assert b.centre_of_percussion_m == b.equivalent_length_m
    assert b.inertia_pivot_kg_m2 == pytest.approx(b.mass_kg / 3.0, rel=3e-11)
    p = compound_pendulum(b, G)
    assert p.small_angle_period_s == pytest.approx(2 * math.pi * math.sqrt(2 / (3 * G)),
                                                   rel=2e-11)
    assert p.small_angle_period_s == pytest.approx(1.638226327, abs=5e-10)


def test_disc_pivoted_at_its_rim_has_equivalent_length_three_halves_radius():
    """Disc about a rim point, axis normal to it: I = m R^2/2 + m R^2, L_eq = 3R/2
    (REFERENCES.md, rigid bodies [mem: standard])."""
    disc = Part("disc", "disc", position=0.2, size={"diameter": 0.4, "thickness": 0.01},
                density=2700.0)
    b = assemble([disc])
    assert b.equivalent_length_m == pytest.approx(0.3, rel=4 * EPS)


def test_sphere_on_a_massless_rod_has_the_textbook_equivalent_length():
    """Sphere of radius r at distance l: L_eq = l + 2 r^2 / (5 l) (REFERENCES.md)."""
    r, l = 0.05, 0.9
    b = assemble([Part("bob", "sphere", position=l, size={"diameter": 2 * r},
                       density=8500.0)])
    assert b.equivalent_length_m == pytest.approx(l + 2 * r * r / (5 * l), rel=4 * EPS)
    assert b.gyration_com_m == pytest.approx(math.sqrt(0.4) * r, rel=4 * EPS)


def test_point_bob_is_the_simple_pendulum_exactly():
    """A point bob: I = m L^2, d = L, L_eq = L, I_G = 0 (computed about the centre of
    mass, so only the mean's last-bit rounding, squared, is left: < 1e-30)."""
    b = assemble(*point_bob(0.994, 1.2))
    assert b.inertia_com_kg_m2 < 1e-30
    assert b.equivalent_length_m == pytest.approx(0.994, rel=EPS)
    p = compound_pendulum(b, G)
    assert p.small_angle_period_s == pytest.approx(2 * math.pi * math.sqrt(0.994 / G),
                                                   rel=2 * EPS)


def test_parallel_axis_and_centre_of_mass_of_two_parts_by_hand():
    """Rod (0..1 m, 2 kg) plus a 3 kg point at 0.8 m, 0.1 m across: m = 5 kg,
    s_G = (2*0.5 + 3*0.8)/5 = 0.68, u_G = 0.06, I_O = 2/3 + 3*(0.64 + 0.01) (hand
    calculation with the parallel-axis theorem)."""
    parts = [Part("rod", "rod", position=0.0, at="top",
                  size={"length": 1.0, "diameter": 1e-9}, mass=2.0),
             Part("weight", "point", position=0.8, across=0.1, mass=3.0)]
    b = assemble(parts)
    assert b.mass_kg == 5.0
    assert b.com_along_m == pytest.approx(0.68, rel=4 * EPS)
    assert b.com_across_m == pytest.approx(0.06, rel=4 * EPS)
    assert b.hang_tilt_rad == pytest.approx(math.atan2(0.06, 0.68), rel=4 * EPS)
    # 1e-17 absolute: the rod's 1 nm diameter adds m r^2/4 = 5e-19 kg m^2
    assert b.inertia_pivot_kg_m2 == pytest.approx(2 / 3 + 3 * 0.65, abs=1e-15)
    assert b.inertia_com_kg_m2 == pytest.approx(
        b.inertia_pivot_kg_m2 - 5.0 * (0.68 ** 2 + 0.06 ** 2), rel=1e-13)


def test_period_is_least_where_the_centre_of_mass_is_one_gyration_radius_from_the_pivot():
    """T of a compound pendulum as a function of the pivot distance d has its minimum at
    d = k_G (REFERENCES.md, rigid bodies). A uniform sphere on a massless rod, moved along
    it: scan d on a fine grid and compare the argmin with k_G = sqrt(2/5) r."""
    r = 0.1
    k = math.sqrt(0.4) * r

    def t0(d):
        b = assemble([Part("bob", "sphere", position=d, size={"diameter": 2 * r},
                           density=7850.0)])
        return compound_pendulum(b, G).small_angle_period_s

    ds = [k * (0.8 + 0.4 * i / 400) for i in range(401)]
    best = min(ds, key=t0)
    assert best == pytest.approx(k, abs=0.4 * k / 400)   # within one grid step


def test_counterweight_above_the_pivot_raises_the_equivalent_length():
    """A counterweight above the pivot lowers m d faster than I: L_eq grows (common
    practice: how a metronome or a counterweighted arm slows down). Numbers by hand:
    point masses 1 kg at 1 m and 0.5 kg at -0.2 m: m d = 0.9, I = 1.02, L_eq = 1.1333."""
    b = assemble([Part("bob", "point", position=1.0, mass=1.0),
                  Part("counterweight", "point", position=-0.2, mass=0.5)])
    assert b.equivalent_length_m == pytest.approx(1.02 / 0.9, rel=4 * EPS)


def test_a_body_balanced_or_top_heavy_is_refused():
    with pytest.raises(InvalidInput, match="does not hang"):
        assemble([Part("a", "point", position=1.0, mass=1.0),
                  Part("b", "point", position=-1.0, mass=1.0)])
    with pytest.raises(InvalidInput, match="does not hang"):
        assemble([Part("a", "point", position=-0.5, mass=1.0)])


def test_flexible_suspension_adds_its_own_mass_as_a_line_from_the_pivot():
    """Chain of 1 kg/m, 2 m, plus a point payload of 10 kg at its end: the line is a thin
    rod about its end, I = m_c L^2 / 3 (Young & Freedman Table 9.2): I = 10*4 + 2*4/3."""
    parts, _ = point_bob(2.0, 10.0)
    b = assemble(parts, Suspension("chain", 2.0, 1.0))
    assert b.mass_kg == 12.0
    assert b.inertia_pivot_kg_m2 == pytest.approx(40 + 8 / 3, rel=4 * EPS)
    assert b.com_distance_m == pytest.approx((20 + 2) / 12, rel=4 * EPS)


def test_buoyancy_and_added_mass_of_a_sphere_bob_match_the_point_bob_formula():
    """A brass sphere on a hair-thin rod against the point-bob closed form
    T = T0 sqrt((rho_b + k rho_f)/(rho_b - rho_f)), k = 1/2 for a sphere (Stokes 1851;
    swingcalc.environment.fluid_rate_shift). The body model adds the sphere's own size:
    its gyration (2/5 r^2) and the parallel axis carry the added mass at r_i, not at
    L_eq, which differs by k_G^2/L^2 = 1e-3 relative of the shift; hence 2e-3."""
    rho_b, rho_f = 8500.0, 1.225
    b = assemble([Part("bob", "sphere", position=1.0, size={"diameter": 0.1},
                       density=rho_b)])
    p = compound_pendulum(b, G, rho_f)
    total = p.buoyancy_rate_s_per_day + p.added_mass_rate_s_per_day
    assert total == pytest.approx(fluid_rate_shift(rho_b, rho_f, 0.5), rel=2e-3)
    # REFERENCES.md: brass bob in air about 6.2 s/day from buoyancy, 9.3 with added mass
    assert p.buoyancy_rate_s_per_day == pytest.approx(-6.2, abs=0.05)
    assert total == pytest.approx(-9.3, abs=0.1)
    assert p.small_angle_period_s > p.vacuum_small_angle_period_s


def test_vacuum_has_no_air_effects():
    b = assemble([Part("bob", "sphere", position=1.0, size={"diameter": 0.1},
                       density=8500.0)])
    p = compound_pendulum(b, G, 0.0)
    assert p.buoyancy_period_shift_rel == 0.0 and p.added_mass_period_shift_rel == 0.0
    assert p.air.drag_coefficient_N_m_s2 == 0.0
    assert p.small_angle_period_s == p.vacuum_small_angle_period_s


def test_drag_coefficient_of_a_sphere_bob_is_the_textbook_torque():
    """Quadratic drag of a sphere at arm r: torque = (1/2) rho C_d (pi R^2) (omega r)^2 r,
    C_d = 0.47 (REFERENCES.md, subcritical sphere): D = 0.5 rho C_d pi R^2 r^3."""
    rho = 1.2
    b = assemble([Part("bob", "sphere", position=0.8, size={"diameter": 0.1},
                       density=8500.0)])
    p = compound_pendulum(b, G, rho)
    expect = 0.5 * rho * 0.47 * math.pi * 0.05 ** 2 * 0.8 ** 3
    assert p.air.drag_coefficient_N_m_s2 == pytest.approx(expect, rel=4 * EPS)


def test_drag_of_a_rod_integrates_its_width_along_the_arm():
    """A rod from the pivot to L meets the air along its length: D = (1/2) rho C_d w L^4/4
    (integral of the strip drag w ds (omega s)^2 times s); compare with summing 10^5
    strips (midpoint rule, error ~ (L/n)^2 relative)."""
    rho, L, w = 1.2, 1.0, 0.01
    b = assemble([rod(L, w)])
    p = compound_pendulum(b, G, rho)
    # White, Fluid Mechanics, Table 7.3 [mem]: a cylinder in cross-flow, L/D = 40: 0.98,
    # L/D -> inf: 1.20; this rod has L/D = 100, so C_d lies between them
    n = 100_000
    strips = sum(((i + 0.5) * L / n) ** 3 for i in range(n)) * (L / n)
    lo, hi = (0.5 * rho * cd * w * strips for cd in (0.98, 1.20))
    assert lo * (1 - 1e-9) <= p.air.drag_coefficient_N_m_s2 <= hi * (1 + 1e-9)


def test_simple_pendulum_rate_change_with_temperature_is_half_the_expansion():
    """A bob hung from a rod that expands with alpha: L grows by alpha per K, the rate
    changes by -alpha/2 * 86400 s/day/K (REFERENCES.md [calc]; steel about -0.5)."""
    alpha = 11.5e-6
    parts = [Part("rod", "rod", position=0.0, at="top",
                  size={"length": 1.0, "diameter": 1e-6}, density=1e-3, expansion=alpha),
             Part("bob", "point", position=0.994, mass=1.0)]
    p = compound_pendulum(assemble(parts), G)
    th = thermal_rate(p)
    # the rod weighs 1e-15 kg: its own share of the inertia is far below 1e-9
    assert th.rate_s_per_day_per_K == pytest.approx(-alpha / 2 * 86400, rel=1e-9)


def test_bob_resting_on_its_nut_compensates_by_the_closed_form():
    """A light rod (alpha_r) holds a nut at s_n; a sphere bob (alpha_b, radius R) rests on
    it, its centre at s = s_n - R. Warming by dT: ds/dT = alpha_r s_n - alpha_b R, the
    gyration k^2 = (2/5) R^2 grows by 2 alpha_b. With L_eq = s + k^2/s,
    dL_eq/dT = (1 - k^2/s^2) ds/dT + 2 alpha_b k^2 / s and the rate is
    -86400/2 (dL_eq/dT)/L_eq (derived here from T = 2 pi sqrt(L_eq/g)). The finite
    difference in thermal_rate is exact to O((alpha dT)^2); 1e-7 allows that and the
    rod's 1e-12 kg."""
    a_r, a_b, R, s_n = 11.5e-6, 19e-6, 0.1, 1.0
    parts = [Part("rod", "rod", position=0.0, at="top",
                  size={"length": 1.1, "diameter": 1e-6}, density=1.0, expansion=a_r),
             Part("bob", "sphere", position=s_n, at="bottom", size={"diameter": 2 * R},
                  density=8500.0, expansion=a_b)]
    p = compound_pendulum(assemble(parts, arm_expansion=a_r), G)
    s = s_n - R
    k2 = 0.4 * R * R
    ds = a_r * s_n - a_b * R
    dleq = (1 - k2 / s ** 2) * ds + 2 * a_b * k2 / s
    expect = -86400 / 2 * dleq / (s + k2 / s)
    th = thermal_rate(p)
    assert th.rate_s_per_day_per_K == pytest.approx(expect, rel=1e-7)
    # the plain design (all steel) would lose alpha_r/2 per K nearly; this one does better
    assert abs(th.rate_s_per_day_per_K) < abs(th.plain_rate_s_per_day_per_K)
    assert 0.0 < th.compensation < 1.0


def test_scaled_body_moves_mounts_with_the_arm_and_grows_parts_about_them():
    """A 0.1 m sphere mounted at its top at s = 1 m on an arm of alpha_a: after +10 K the
    top is at 1 (1 + 10 alpha_a) and the centre 0.05 (1 + 10 alpha_b) below it."""
    a_a, a_b = 10e-6, 20e-6
    b = assemble([Part("bob", "sphere", position=1.0, at="top", size={"diameter": 0.1},
                       density=8000.0, expansion=a_b)], arm_expansion=a_a)
    warm = scaled_for_temperature(b, 10.0)
    expect = 1.0 * (1 + 10 * a_a) + 0.05 * (1 + 10 * a_b)
    assert warm.part("bob").centre_along_m == pytest.approx(expect, rel=4 * EPS)
    assert warm.mass_kg == pytest.approx(b.mass_kg, rel=4 * EPS)


@pytest.mark.parametrize("part, words", [
    (Part("x", "rod", position=0.0, size={"length": 1.0}), "missing size 'diameter'"),
    (Part("x", "rod", position=0.0, size={"length": 1.0, "diameter": -1.0}, density=1.0),
     "part 'x': diameter"),
    (Part("x", "tube", position=0.0, size={"length": 1.0, "outer_diameter": 0.02,
                                           "inner_diameter": 0.03}, density=1.0),
     "no wall"),
    (Part("x", "lens", position=1.0, size={"diameter": 0.1, "thickness": 0.2},
          density=1.0), "thicker than a sphere"),
    (Part("x", "disc", position=1.0, size={"diameter": 0.1, "thickness": 0.01},
          orientation="up", density=1.0), "part 'x': axis"),
    (Part("x", "point", position=1.0), "needs a mass"),
    (Part("x", "sphere", position=1.0, size={"diameter": 0.1}), "mass cannot be found"),
    (Part("x", "blob", position=1.0, mass=1.0), "unknown shape"),
    (Part("x", "custom", position=1.0, mass=1.0), "needs its own inertia"),
])
def test_bad_parts_name_the_part_and_the_field(part, words):
    with pytest.raises(InvalidInput) as err:
        assemble([part])
    assert words in str(err.value)


def test_added_mass_of_a_slender_rod_is_the_two_dimensional_value():
    """A rod of L/D = 1000 moving across its axis carries the 2-D added mass rho pi r^2 per
    length (Lamb, Hydrodynamics, section 68 [mem: section]); integrated along the arm it
    adds rho pi r^2 L (s_c^2 + L^2/12) to the inertia. The spheroid coefficient used for
    finite cylinders is 1 - O((D/L)^2 ln(L/D)) there: 1e-4 covers it."""
    rho, L, d = 1.2, 1.0, 1e-3
    p = compound_pendulum(assemble([rod(L, d)]), G, rho)
    expect = rho * math.pi * (d / 2) ** 2 * L * (0.25 + L * L / 12)
    assert p.air.added_inertia_kg_m2 == pytest.approx(expect, rel=1e-4)


def test_a_squat_drum_carries_far_less_air_than_the_two_dimensional_value():
    """A drum 1.2 m across and 0.23 m tall moving across its axis: an oblate body, whose
    ideal-flow added mass tends to 0 as it flattens (Lamb, sections 114-115 [mem]); the
    model's coefficient is under 0.2 of the displaced volume, not the 2-D 1."""
    rho = 1.2
    drum = Part("mass", "cylinder", position=2.7, size={"diameter": 1.2, "length": 0.23},
                density=7850.0)
    p = compound_pendulum(assemble([drum]), G, rho)
    volume = math.pi * 0.6 ** 2 * 0.23
    ca = p.air.added_inertia_kg_m2 / (rho * volume * 2.7 ** 2)
    assert 0.05 < ca < 0.2
