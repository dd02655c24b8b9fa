"""Loads through the swing: the pivot reaction and suspension tension against an
independent numerical integration of the body, the point-mass closed forms, the slack
onset, the impact-tester energies, and the peaks."""

import math

import numpy as np
import pytest

from swingcalc.body import Part, Suspension, assemble, point_bob
from swingcalc.compound import compound_pendulum
from swingcalc.errors import InvalidInput
from swingcalc.loads import impact, over_top_speed, point_motion, swing_loads

G = 9.80665  # standard gravity (3rd CGPM 1901)


def hammer():
    """A rod arm with a heavy offset head: a body whose reaction has both components."""
    return compound_pendulum(assemble([
        Part("arm", "rod", position=0.0, at="top", size={"length": 0.8, "diameter": 0.03},
             density=7850.0),
        Part("head", "plate", position=0.8, across=0.03,
             size={"width": 0.2, "height": 0.15, "thickness": 0.05}, density=7850.0)]), G)


def _point_masses(n=40):
    """The hammer of :func:`hammer` cut into point masses by hand (midpoint cells): the
    rod as n cells along its length, the plate as n x n cells over its face. Its I and
    M = g sum m s come from these points, not from swingcalc.body."""
    rho = 7850.0
    pts = []
    L, r = 0.8, 0.015
    m_rod = rho * math.pi * r * r * L
    for i in range(n):
        pts.append((m_rod / n, (i + 0.5) * L / n, 0.0))
    w, h, th = 0.2, 0.15, 0.05
    m_pl = rho * w * h * th
    for i in range(n):
        for j in range(n):
            pts.append((m_pl / n ** 2, 0.8 - h / 2 + (j + 0.5) * h / n,
                        0.03 - w / 2 + (i + 0.5) * w / n))
    return pts


def _integrate(pend, amplitude, n_out=400):
    """Integrate I theta'' = -M sin(theta) from rest at the amplitude with DOP853 at tight
    tolerances, with I and M of the point-mass model of :func:`_point_masses` (plus the
    rod's r^2/4 and the plate's thickness, which the midpoint cells leave out: both are
    in I only, as m r^2/4 and nothing); return the dense solution and sample times."""
    from scipy.integrate import solve_ivp

    pts = _point_masses()
    inertia = sum(m * (s * s + u * u) for m, s, u in pts) + 7850 * math.pi * 0.015 ** 2 \
        * 0.8 * 0.015 ** 2 / 4
    d = math.hypot(sum(m * s for m, s, u in pts), sum(m * u for m, s, u in pts))
    k = G * d / inertia
    # the cells' midpoint rule leaves (cell size)^2/12 per cell out of I: 1e-3 relative
    # at n = 40, so compare k with the body's to that before integrating with it
    assert k == pytest.approx(pend.restoring_moment_N_m / pend.inertia_kg_m2, rel=2e-3)
    k = pend.restoring_moment_N_m / pend.inertia_kg_m2
    t_half = 0.5 * 2 * math.pi / math.sqrt(k) * 1.6
    sol = solve_ivp(lambda t, y: (y[1], -k * math.sin(y[0])), (0.0, t_half),
                    (amplitude, 0.0), method="DOP853", rtol=1e-13, atol=1e-14,
                    dense_output=True)
    t = np.linspace(0.05 * t_half, 0.95 * t_half, n_out)
    return sol, t


def test_pivot_reaction_equals_the_rate_of_change_of_momentum_from_an_integration():
    """Independent route: integrate the swing numerically, sum the momentum of the parts
    (m_i * velocity of each part's centroid), differentiate it in time with a 5-point
    stencil, and add the weight: R = dP/dt - sum m_i g (Newton's second law for the
    whole body). Compare with swing_loads at the integrated angles. The stencil's error
    is ~h^4 P^(5) ~ 1e-9 relative at h = 1e-4 T plus the integrator's 1e-12; 1e-7
    relative to the weight covers both."""
    pend = hammer()
    a = math.radians(120)
    sol, t = _integrate(pend, a)
    body = pend.body
    tilt = body.hang_tilt_rad

    def momentum(tt):
        th, om = sol.sol(tt)
        px = py = 0.0
        for p in body.parts:
            r = math.hypot(p.centre_along_m, p.centre_across_m)
            phi = math.atan2(p.centre_across_m, p.centre_along_m) - tilt
            psi = th + phi
            # position r (sin psi, -cos psi): velocity omega r (cos psi, sin psi)
            px += p.mass_kg * om * r * math.cos(psi)
            py += p.mass_kg * om * r * math.sin(psi)
        return np.array([px, py])

    h = 1e-4 * 2 * math.pi / pend.natural_angular_frequency_rad_s
    weight = body.mass_kg * G
    worst = 0.0
    for tt in t[::20]:
        dp = (momentum(tt - 2 * h) - 8 * momentum(tt - h) + 8 * momentum(tt + h)
              - momentum(tt + 2 * h)) / (12 * h)
        rx, ry = dp[0], dp[1] + weight
        th = float(sol.sol(tt)[0])
        got = _reaction_at(pend, a, th)
        worst = max(worst, abs(got[0] - rx) / weight, abs(got[1] - ry) / weight)
    assert worst < 1e-7


def _reaction_at(pend, a, theta):
    """The library's reaction components at one angle of the swing (the kernel that
    swing_loads tabulates, called at an arbitrary angle)."""
    from swingcalc import loads as L

    omega2, alpha = L._kinematics(pend, a, np.array([theta]))
    _, _, _, rx, ry = L._reaction(pend, np.array([theta]), omega2, alpha)
    return float(rx[0]), float(ry[0])


def test_point_mass_tension_is_m_g_three_cos_minus_two_cos_amplitude():
    """Point mass from rest at A: T = m g (3 cos theta - 2 cos A) (REFERENCES.md,
    flexible suspensions [mem: standard mechanics]); no force across the arm."""
    m, L, a = 80.0, 2.2, math.radians(75)
    pend = compound_pendulum(assemble(*point_bob(L, m, "flexible")), G)
    loads = swing_loads(pend, a, samples=41)
    expect = m * G * (3 * np.cos(loads.angle_rad) - 2 * math.cos(a))
    np.testing.assert_allclose(loads.arm_tension_N, expect, rtol=1e-13, atol=1e-12)
    np.testing.assert_allclose(loads.payload_tension_N, expect, rtol=1e-13, atol=1e-12)
    assert np.all(loads.reaction_tangential_N == 0.0)
    assert loads.peak("arm_tension_N").value == pytest.approx(m * G * (3 - 2 * math.cos(a)),
                                                              rel=1e-14)
    assert loads.peak("arm_tension_N").angle_rad == 0.0


@pytest.mark.parametrize("deg", [60.0, 89.9, 90.0])
def test_point_mass_on_a_chain_stays_taut_up_to_ninety_degrees(deg):
    """Tension at the end of the swing is m g cos A: zero at 90 deg, so slack begins
    only beyond 90 deg (REFERENCES.md)."""
    pend = compound_pendulum(assemble(*point_bob(2.0, 30.0, "chain")), G)
    loads = swing_loads(pend, math.radians(deg))
    assert loads.slack_angle_rad is None and not loads.warnings


@pytest.mark.parametrize("h, slack_deg", [(3.0, 109.4712206)])
def test_slack_angle_matches_the_published_values(h, slack_deg):
    """From the bottom with v0^2 = h g L: cos theta_s = (2 - h)/3 gives 109.4712206 deg
    for h = 3 (REFERENCES.md [calc], printed to 7 decimals). The amplitude of that swing
    is cos A = 1 - h/2. (h = 4 reaches the top of a rigid swing: no libration amplitude;
    tests/test_pendulum.py checks its 131.8103149 deg through the energy form.)"""
    pend = compound_pendulum(assemble(*point_bob(1.5, 10.0, "rope")), G)
    a = math.acos(1 - h / 2)
    loads = swing_loads(pend, a)
    assert math.degrees(loads.slack_angle_rad) == pytest.approx(slack_deg, abs=5e-8)
    assert any("slack" in w for w in loads.warnings)


def test_slack_onset_just_past_ninety_degrees_is_just_past_ninety():
    """As A -> 90 deg from above, cos theta_s = (2/3) cos A -> 0-: theta_s -> 90 deg from
    above, inside the swing (90 < theta_s < A)."""
    pend = compound_pendulum(assemble(*point_bob(1.0, 1.0, "chain")), G)
    loads = swing_loads(pend, math.radians(90.001))
    assert 90.0 < math.degrees(loads.slack_angle_rad) < 90.001


def test_rigid_rod_goes_into_compression_where_a_chain_would_go_slack():
    pend = compound_pendulum(assemble(*point_bob(1.0, 1.0)), G)
    loads = swing_loads(pend, math.radians(120))
    assert math.degrees(loads.compression_angle_rad) == pytest.approx(109.4712206, abs=5e-8)
    assert loads.slack_angle_rad is None
    assert min(loads.arm_tension_N) < 0


def test_heavy_chain_tension_at_the_payload_against_the_payload_equation():
    """Chain plus payload swinging as one body; the payload end carries
    m_p (d_p omega^2 + g cos theta) with omega^2 from the whole body's energy, and the
    pivot end carries that plus the chain's own share: the pivot pull equals the whole
    body's m (d omega^2 + g cos theta) (Newton's law for the centre of mass)."""
    parts, _ = point_bob(2.0, 10.0)
    pend = compound_pendulum(assemble(parts, Suspension("chain", 2.0, 2.0)), G)
    a = math.radians(40)
    loads = swing_loads(pend, a, samples=21)
    # by hand: I = 10 * 2^2 + (2 kg/m * 2 m) * 2^2 / 3, M = g (10 * 2 + 4 * 1)
    k = G * (10 * 2 + 4 * 1) / (10 * 4 + 4 * 4 / 3)
    omega2 = 2 * k * (np.cos(loads.angle_rad) - math.cos(a))
    np.testing.assert_allclose(loads.payload_tension_N,
                               10 * (2.0 * omega2 + G * np.cos(loads.angle_rad)),
                               rtol=1e-12)
    assert np.all(loads.arm_tension_N > loads.payload_tension_N)


def test_over_the_top_speeds_are_four_and_five_g_l():
    """Bottom speed to pass the top: sqrt(4 g L) on a rigid rod, sqrt(5 g L) on a
    flexible suspension (REFERENCES.md, flexible suspensions)."""
    L = 2.0
    rigid = compound_pendulum(assemble(*point_bob(L, 1.0)), G)
    flex = compound_pendulum(assemble(*point_bob(L, 1.0, "chain")), G)
    assert over_top_speed(rigid) * L == pytest.approx(math.sqrt(4 * G * L), rel=1e-15)
    assert over_top_speed(flex) * L == pytest.approx(math.sqrt(5 * G * L), rel=1e-15)


def test_impact_energies_and_striking_speed_match_the_worked_example():
    """REFERENCES.md, impact-test pendulums [calc]: m = 20 kg, R = 0.8 m, alpha = 150 deg,
    beta = 60 deg: K_P = 292.7913 J, K = 214.3381 J, v = 5.411020 m/s (printed to 7
    significant figures)."""
    pend = compound_pendulum(assemble(*point_bob(0.8, 20.0)), G)
    r = impact(pend, math.radians(150), 0.8, math.radians(60))
    assert r.potential_energy_J == pytest.approx(292.7913, abs=5e-5)
    assert r.absorbed_J == pytest.approx(214.3381, abs=5e-5)
    assert r.striking_speed_m_s == pytest.approx(5.411020, abs=5e-7)
    assert r.percussion_offset_rel == pytest.approx(0.0, abs=1e-15)


def test_impact_rise_above_the_drop_is_refused():
    pend = compound_pendulum(assemble(*point_bob(0.8, 20.0)), G)
    with pytest.raises(InvalidInput, match="rise angle"):
        impact(pend, math.radians(120), 0.8, math.radians(130))


def test_point_bob_feels_no_tangential_force_and_one_g_at_rest():
    """A simple-pendulum bob feels only the string's pull: the felt force is along the
    string (common practice: a pendulum bob is 'weightless' along its path)."""
    pend = compound_pendulum(assemble(*point_bob(1.0, 1.0)), G)
    th = np.linspace(-1.0, 1.0, 11)
    pm = point_motion(pend, "bob", 1.0, 0.0, 1.0, th)
    np.testing.assert_allclose(pm.felt_tangential_g, 0.0, atol=1e-15)
    rest = point_motion(pend, "bob", 1.0, 0.0, 0.0, np.array([0.0]))
    assert rest.felt_normal_g[0] == pytest.approx(1.0, rel=1e-15)


def test_point_at_the_centre_of_percussion_of_a_rod_feels_no_tangential_force():
    """The centre of percussion of a rod about its end is at 2L/3: there the tangential
    acceleration alpha r equals -g sin(theta), so the felt tangential force vanishes
    (the defining property of the centre of oscillation, common practice)."""
    pend = compound_pendulum(assemble([Part(
        "rod", "rod", position=0.0, at="top", size={"length": 1.0, "diameter": 1e-6},
        density=7850.0)]), G)
    th = np.linspace(-1.2, 1.2, 13)
    at_cop = point_motion(pend, "cop", pend.body.centre_of_percussion_m, 0.0, 1.2, th)
    np.testing.assert_allclose(at_cop.felt_tangential_g, 0.0, atol=1e-14)
    tip = point_motion(pend, "tip", 1.0, 0.0, 1.2, th)
    assert np.max(np.abs(tip.felt_tangential_g)) > 0.1


def test_energies_sum_to_the_swing_energy_at_every_angle():
    pend = hammer()
    a = math.radians(100)
    loads = swing_loads(pend, a, samples=101)
    total = loads.kinetic_energy_J + loads.potential_energy_J
    np.testing.assert_allclose(total, loads.energy_J, rtol=1e-13)
    assert loads.energy_J == pytest.approx(pend.restoring_moment_N_m * (1 - math.cos(a)),
                                           rel=1e-14)


def test_peaks_are_at_least_every_sample_and_refined_inside_the_grid():
    """The reported peak is the largest magnitude over the swing: never below any sample
    of a fine table, and found between samples when it lies there."""
    pend = hammer()
    loads = swing_loads(pend, math.radians(150), samples=4001)
    for key, arr in (("reaction_N", loads.reaction_N),
                     ("reaction_tangential_N", loads.reaction_tangential_N),
                     ("angular_acceleration_rad_s2", loads.angular_acceleration_rad_s2)):
        assert abs(loads.peak(key).value) >= np.max(np.abs(arr)) * (1 - 1e-15), key
    # the peak angular acceleration of a swing past 90 deg is at 90 deg: k sin(90)
    k = pend.restoring_moment_N_m / pend.inertia_kg_m2
    pk = loads.peak("angular_acceleration_rad_s2")
    assert abs(pk.value) == pytest.approx(k, rel=1e-15)
    assert abs(abs(pk.angle_rad) - math.pi / 2) < 1e-6


def test_samples_out_of_range_are_refused():
    pend = hammer()
    for n in (2, 0, 10 ** 6, 3.5, True):
        with pytest.raises(InvalidInput, match="samples"):
            swing_loads(pend, 0.5, samples=n)


def test_rows_past_the_slack_angle_are_flagged_and_left_out_of_the_peaks():
    """A point mass on a chain at 120 deg goes slack at 109.47 deg (REFERENCES.md): the
    rows beyond are not taut (there the taut model's tension is negative), the taut rows
    carry tension, and the peaks come from the taut part only."""
    pend = compound_pendulum(assemble(*point_bob(1.0, 1.0, "chain")), G)
    loads = swing_loads(pend, math.radians(120), samples=121)
    past = np.abs(loads.angle_rad) > loads.slack_angle_rad
    assert np.all(~loads.taut[past]) and np.all(loads.taut[~past])
    assert np.all(loads.payload_tension_N[past] < 0)
    assert np.all(loads.payload_tension_N[~past] >= -1e-12)
    for p in loads.peaks:
        assert abs(p.angle_rad) <= loads.slack_angle_rad * (1 + 1e-15), p.quantity


def test_first_slack_of_a_history_on_a_line_and_none_on_a_rigid_arm():
    """Payload-end tension m (L omega^2 + g cos theta) of a point mass on a line (textbook
    circular motion): at theta = 100 deg it is negative below omega^2 = -g cos(theta)/L,
    positive above; a rigid arm never goes slack."""
    import math

    import numpy as np

    from swingcalc.loads import first_slack, payload_tension

    L, g = 2.0, 9.80665
    line = compound_pendulum(assemble(*point_bob(L, 1.0, "flexible")), g, 0.0)
    th = math.radians(100.0)
    w_edge = math.sqrt(-g * math.cos(th) / L)
    assert payload_tension(line, th, w_edge) == pytest.approx(0.0, abs=1e-12)
    t = np.array([0.0, 1.0, 2.0])
    assert first_slack(line, t, [0.1, th, th], [0.0, 1.01 * w_edge, 0.99 * w_edge]) == (
        2.0, th)
    assert first_slack(line, t, [0.1, 0.2, 0.3], [0.0, 0.0, 0.0]) is None
    rigid = compound_pendulum(assemble(*point_bob(L, 1.0, "rigid")), g, 0.0)
    assert first_slack(rigid, t, [th] * 3, [0.0] * 3) is None


def test_least_tension_at_a_90_degree_turning_point_is_zero_not_rounding():
    """At a 90 deg turning point the line carries m g cos 90 deg = 0 (textbook): the
    float cos(pi/2) = 6e-17 must not show as 1e-14 N, on a line or on a rigid arm."""
    import math

    for kind in ("flexible", "rigid"):
        pend = compound_pendulum(assemble(*point_bob(2.2, 80.0, kind)), G)
        assert swing_loads(pend, math.pi / 2).least_tension_N == 0.0
