"""Sizing: inverse problems solved, then checked by recomputing the forward result
independently (a fresh body, the closed forms of the point mass), and sensitivities
against their closed forms."""

import math

import pytest

from swingcalc import period as simple_period
from swingcalc.body import Part, assemble, point_bob
from swingcalc.compound import compound_pendulum
from swingcalc.errors import InvalidInput
from swingcalc.loads import impact
from swingcalc.sizing import (drop_angle_for_energy, drop_angle_for_speed, length_for_period,
                              max_amplitude_for_limit, period_at, position_for_period,
                              rating_adjustment, sensitivities)

G = 9.80665  # standard gravity (3rd CGPM 1901)


def test_seconds_pendulum_length_at_standard_gravity():
    """T = 2 s at zero amplitude: L = g / pi^2 = 0.993621385566 m (REFERENCES.md [calc],
    12 digits); 'about 0.994 m' [pub]."""
    assert length_for_period(2.0, 0.0, G) == pytest.approx(0.993621385566, abs=5e-13)


@pytest.mark.parametrize("deg", [1.0, 5.0, 30.0, 90.0, 170.0])
def test_length_for_a_period_at_the_working_amplitude_round_trips(deg):
    """Solve for L at amplitude A, then recompute T with swingcalc.period (the foundation's
    exact elliptic period): back to the target within 1e-12."""
    a = math.radians(deg)
    L = length_for_period(2.0, a, G)
    assert simple_period(L, a, G) == pytest.approx(2.0, rel=1e-12)
    assert L < length_for_period(2.0, 0.0, G)      # a real swing needs a shorter pendulum


def clock(bob_at=0.99):
    parts = [Part("rod", "rod", position=0.0, at="top",
                  size={"length": 1.1, "diameter": 0.006}, density=7850.0),
             Part("bob", "lens", position=bob_at,
                  size={"diameter": 0.15, "thickness": 0.03}, density=8500.0)]
    return parts, compound_pendulum(assemble(parts), G, 1.2, amplitude=math.radians(2))


def test_bob_position_for_a_period_round_trips_on_a_fresh_body():
    """Solve for the bob's place, then build the body again from scratch with the bob
    there and recompute the period: within 1e-12 of the target."""
    parts, pend = clock()
    a = math.radians(2.5)
    sol = position_for_period(pend, "bob", 2.0, a)
    moved = [parts[0], Part("bob", "lens", position=sol.position_m,
                            size={"diameter": 0.15, "thickness": 0.03}, density=8500.0)]
    fresh = compound_pendulum(assemble(moved), G, 1.2, amplitude=math.radians(2))
    assert period_at(fresh, a) == pytest.approx(2.0, rel=1e-12)
    assert sol.period_s == pytest.approx(2.0, rel=1e-12)
    assert sol.move_m == pytest.approx(sol.position_m - 0.99, rel=1e-15)


def test_position_search_finds_both_sides_of_the_period_minimum():
    """A sphere on a massless rod: T(d) is least at d = k_G (REFERENCES.md), so a period
    just above the minimum is reached at two distances, one on each side of k_G; both
    are reported, and each gives the target."""
    r = 0.1
    k = math.sqrt(0.4) * r
    bob = Part("bob", "sphere", position=2 * k, size={"diameter": 2 * r}, density=7850.0)
    pend = compound_pendulum(assemble([bob]), G)
    t_min = compound_pendulum(assemble([Part("bob", "sphere", position=k,
                                             size={"diameter": 2 * r}, density=7850.0)]),
                              G).small_angle_period_s
    sol = position_for_period(pend, "bob", 1.05 * t_min, 0.0, lowest=0.2 * k, highest=5 * k)
    roots = sorted((sol.position_m,) + sol.other_positions_m)
    assert len(roots) == 2 and roots[0] < k < roots[1]
    for x in roots:
        p = compound_pendulum(assemble([Part("bob", "sphere", position=x,
                                             size={"diameter": 2 * r}, density=7850.0)]), G)
        assert p.small_angle_period_s == pytest.approx(1.05 * t_min, rel=1e-12)


def test_unreachable_period_is_refused_with_the_shortest_one():
    parts, pend = clock()
    with pytest.raises(InvalidInput, match="no position of 'bob' gives it"):
        position_for_period(pend, "bob", 0.1, 0.0)


def test_drop_angle_for_energy_and_speed_round_trip_through_the_impact_energies():
    """Drop angle for 300 J, then the impact energy at that angle (M (1 - cos alpha),
    ISO 148-1 method) is 300 J; the same for a striking speed of 5.2 m/s."""
    pend = compound_pendulum(assemble(*point_bob(0.8, 22.0)), G)
    a = drop_angle_for_energy(pend, 300.0)
    assert impact(pend, a, 0.8).potential_energy_J == pytest.approx(300.0, rel=1e-13)
    b = drop_angle_for_speed(pend, 5.2, 0.8)
    assert impact(pend, b, 0.8).striking_speed_m_s == pytest.approx(5.2, rel=1e-13)
    # a point mass: v^2 = 2 g R (1 - cos alpha) (REFERENCES.md, impact-test pendulums)
    assert math.cos(b) == pytest.approx(1 - 5.2 ** 2 / (2 * G * 0.8), rel=1e-13)


def test_drop_energy_above_the_top_is_refused():
    pend = compound_pendulum(assemble(*point_bob(0.8, 22.0)), G)
    with pytest.raises(InvalidInput, match="drop from the top"):
        drop_angle_for_energy(pend, 2 * 22 * G * 0.8 * 1.0001)


def test_largest_amplitude_under_a_pivot_load_limit_matches_the_point_mass_closed_form():
    """Point mass: the peak pivot load is m g (3 - 2 cos A) at the bottom (REFERENCES.md),
    so the limit F gives cos A = (3 - F/(m g))/2."""
    m, L = 80.0, 2.0
    pend = compound_pendulum(assemble(*point_bob(L, m)), G)
    F = 2.0 * m * G
    a = max_amplitude_for_limit(pend, "reaction_N", F)
    assert math.cos(a) == pytest.approx((3 - F / (m * G)) / 2, abs=1e-14)


def test_largest_amplitude_under_a_speed_and_a_felt_g_limit():
    """Point bob: peak speed 2 sqrt(g L) sin(A/2); felt acceleration at the bottom
    3 - 2 cos A in g (energy conservation, any mechanics text)."""
    L = 2.0
    pend = compound_pendulum(assemble(*point_bob(L, 30.0, "chain")), G)
    pts = {"seat": (L, 0.0)}
    a = max_amplitude_for_limit(pend, "seat.speed_m_s", 3.0, pts)
    assert 2 * math.sqrt(G * L) * math.sin(a / 2) == pytest.approx(3.0, rel=1e-13)
    b = max_amplitude_for_limit(pend, "seat.felt_g", 2.5, pts)
    assert 3 - 2 * math.cos(b) == pytest.approx(2.5, rel=1e-13)


def test_limit_below_the_value_at_rest_or_above_every_swing():
    pend = compound_pendulum(assemble(*point_bob(1.0, 1.0)), G)
    with pytest.raises(InvalidInput, match="at rest"):
        max_amplitude_for_limit(pend, "reaction_N", 0.5 * G)
    assert max_amplitude_for_limit(pend, "reaction_N", 10 * G) == math.pi
    with pytest.raises(InvalidInput, match="did you mean"):
        max_amplitude_for_limit(pend, "reaction_n", 10.0)


def test_sensitivities_of_a_simple_pendulum_are_its_closed_forms():
    """T = 2 pi sqrt(L/g) R(A): (L/T) dT/dL = 1/2, (g/T) dT/dg = -1/2, mass has no
    effect, and the rating adjustment is -86400/(2L) s/day per m of bob travel. Central
    differences with a 1e-5 relative step: truncation ~1e-10, so 1e-8."""
    L = 0.994
    pend = compound_pendulum(assemble(*point_bob(L, 1.2)), G)
    a = math.radians(3)
    by = {s.input: s for s in sensitivities(pend, a)}
    assert by["part.bob.centre"].relative == pytest.approx(0.5, rel=1e-8)
    assert by["environment.gravity"].relative == pytest.approx(-0.5, rel=1e-8)
    assert abs(by["part.bob.mass"].relative) < 1e-9
    adj = rating_adjustment(pend, "bob", a, nut_pitch=0.75e-3)
    assert adj["rate_s_per_day_per_mm"] == pytest.approx(-86400 / (2 * L) * 1e-3, rel=1e-8)
    assert adj["rate_s_per_day_per_turn"] == pytest.approx(
        -86400 / (2 * L) * 0.75e-3, rel=1e-8)


def test_amplitude_sensitivity_is_the_slope_of_the_circular_error():
    """d ln T / dA = (1/R) dR/dA with R = 1 + A^2/16 + 11 A^4/3072 + ... (series of
    REFERENCES.md, OEIS A223067/A223068): at 3 deg the first two terms give it to 1e-7."""
    pend = compound_pendulum(assemble(*point_bob(1.0, 1.0)), G)
    a = math.radians(3)
    s = {x.input: x for x in sensitivities(pend, a)}["swing.amplitude"]
    r = 1 + a * a / 16 + 11 * a ** 4 / 3072
    dr = a / 8 + 44 * a ** 3 / 3072
    assert s.relative == pytest.approx(a * dr / r, rel=1e-6)


def test_rating_moves_the_bob_and_its_nut_together():
    """Moving a point bob and a point nut (masses m_b, m_n at s_b, s_n) together by x:
    T = 2 pi sqrt(I/(g sum m s)) with I = sum m s^2, dI/dx = 2 sum m s and
    d(sum m s)/dx = sum m, so d ln T/dx = (1/2)(2 sum m s / I - sum m / sum m s)
    (derived here); the rate change is -86400 d ln T/dx."""
    mb, sb, mn, sn = 2.0, 0.99, 0.05, 1.02
    parts = [Part("bob", "point", position=sb, mass=mb),
             Part("nut", "point", position=sn, mass=mn)]
    pend = compound_pendulum(assemble(parts), G)
    inertia = mb * sb ** 2 + mn * sn ** 2
    moment = mb * sb + mn * sn
    dlnt = 0.5 * (2 * moment / inertia - (mb + mn) / moment)
    adj = rating_adjustment(pend, ("bob", "nut"), 0.0, nut_pitch=1e-3)
    # central difference, relative step 1e-5: truncation ~1e-10 relative
    assert adj["rate_s_per_day_per_mm"] == pytest.approx(-86400 * dlnt * 1e-3, rel=1e-8)
    alone = rating_adjustment(pend, "bob", 0.0)
    assert abs(alone["rate_s_per_day_per_mm"]) < abs(adj["rate_s_per_day_per_mm"])
    sol = position_for_period(pend, ("bob", "nut"), 2.0, 0.0)
    assert sol.parts == ("bob", "nut")
    moved = [Part("bob", "point", position=sb + sol.move_m, mass=mb),
             Part("nut", "point", position=sn + sol.move_m, mass=mn)]
    assert compound_pendulum(assemble(moved), G).small_angle_period_s == pytest.approx(
        2.0, rel=1e-12)


def test_tuning_at_another_temperature_gives_the_position_to_write_in_the_file():
    """The bundled clock at 30 degC: the tuned position is for the file (sizes at the
    reference 20 degC); writing it back and rebuilding at 30 degC gives the target period
    (1e-12), and the sensitivities keep their meaning (rod diameter within 1 % of the
    20 degC value: the temperature changes sizes by ~1e-4)."""
    import re

    from swingcalc import examples
    from swingcalc.designfile import parse_design

    text = examples.text().replace('temperature = "20 degC"', 'temperature = "30 degC"')
    warm = parse_design(text)
    a = warm.amplitudes_rad[1]
    sol = position_for_period(warm.pendulum, warm.rating.parts, 2.0, a)
    centre = re.search(r'centre = "([0-9.]+) mm"', text).group(1)
    nut = re.search(r'top = "([0-9.]+) mm"            # under', text).group(1)
    moved = (text.replace(f'centre = "{centre} mm"', f'centre = "{sol.position_m!r} m"')
             .replace(f'top = "{nut} mm"', f'top = "{float(nut) * 1e-3 + sol.move_m!r} m"'))
    again = parse_design(moved)
    assert period_at(again.pendulum, a) == pytest.approx(2.0, rel=1e-12)
    cold = parse_design(examples.text())
    s_warm = {s.input: s for s in sensitivities(warm.pendulum, a)}
    s_cold = {s.input: s for s in sensitivities(cold.pendulum, a)}
    assert set(s_warm) == set(s_cold)
    assert s_warm["part.rod.diameter"].period_per_unit == pytest.approx(
        s_cold["part.rod.diameter"].period_per_unit, rel=1e-2)


def test_tuning_a_damper_lengthens_its_cables_with_the_mass_on_them():
    """A point mass on a 2 m chain of 1 kg/m: tune by the line's length (the mass hangs
    at its end). Rebuilt by hand with the solved length L (point at L, line of L kg):
    T0 = 2 pi sqrt(I/M) with I = m L^2 + (lambda L) L^2/3, M = g (m L + lambda L L/2)
    (parallel axis; a thin rod about its end, Young & Freedman Table 9.2) equals the
    target to 1e-12."""
    from swingcalc.body import Suspension
    from swingcalc.sizing import SUSPENSION

    m, lam = 50.0, 1.0
    pend = compound_pendulum(assemble([Part("mass", "point", position=2.0, mass=m)],
                                      Suspension("chain", 2.0, lam)), G)
    sol = position_for_period(pend, SUSPENSION, 3.0, 0.0)
    L = sol.position_m
    inertia = m * L * L + lam * L * L * L / 3
    moment = G * (m * L + lam * L * L / 2)
    assert 2 * math.pi * math.sqrt(inertia / moment) == pytest.approx(3.0, rel=1e-12)
    by = {s.input: s for s in sensitivities(pend, 0.0)}
    assert "suspension.length" in by and "suspension.mass_per_length" in by


def test_a_counterweight_above_the_pivot_is_tuned_there():
    """Two point masses, 1 kg at 1 m and a 0.5 kg counterweight above the pivot at
    -0.2 m: with the counterweight at c < 0, T0 = 2 pi sqrt(I/(g m d)), I = 1 + 0.5 c^2,
    m d = 1 + 0.5 c (hand calculation). Solving for T0 = 2.5 s with the search above the
    pivot and putting the counterweight there gives 2.5 s to 1e-12."""
    parts = [Part("bob", "point", position=1.0, mass=1.0),
             Part("cw", "point", position=-0.2, mass=0.5)]
    pend = compound_pendulum(assemble(parts), G)
    sol = position_for_period(pend, "cw", 2.5, 0.0, lowest=-0.9, highest=-0.01)
    c = sol.position_m
    assert c < 0
    assert 2 * math.pi * math.sqrt((1 + 0.5 * c * c) / (G * (1 + 0.5 * c))) == pytest.approx(
        2.5, rel=1e-12)
