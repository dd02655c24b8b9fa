"""Simple pendulum design quantities (swingcalc.pendulum) and bad input at the boundary.

Point bob of mass m on a light suspension of length L, released from rest at amplitude A.
Tension along the swing: T = m (L omega^2 + g cos theta) (radial equation of motion);
with energy conservation T = m g (3 cos theta - 2 cos A) (REFERENCES.md "Flexible
suspensions" [mem: standard mechanics]). The numerical side is scipy DOP853 at
rtol = atol = 1e-12 over half a swing (error ~1e-11 relative, tolerances 1e-9).
"""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest

import swingcalc
from swingcalc.constants import STANDARD_GRAVITY

from helpers import EPS, mp_period_ratio

L, M, G = 0.75, 2.5, 9.81


def _half_swing(a, length=L, g=G):
    """DOP853 from (A, 0) to the far turning point; returns the solution and the bottom
    crossing state (event at theta = 0, falling)."""
    from scipy.integrate import solve_ivp

    def bottom(_t, y):
        return y[0]
    bottom.direction = -1
    t_half = math.pi * math.sqrt(length / g) * float(mp_period_ratio(a))
    sol = solve_ivp(lambda t, y: [y[1], -g / length * math.sin(y[0])], (0.0, t_half),
                    [a, 0.0], method="DOP853", rtol=1e-12, atol=1e-12, dense_output=True,
                    events=bottom, max_step=t_half / 50)
    assert sol.success
    return sol, sol.y_events[0][0]


def _tension(theta, omega, mass=M, length=L, g=G):
    return mass * (length * omega ** 2 + g * np.cos(theta))


@pytest.mark.parametrize("deg", [5.0, 40.0, 89.0, 120.0, 170.0])
def test_simple_pendulum_periods_speeds_energy_against_hand_formulas(deg):
    """T0 = 2 pi sqrt(L/g); T = T0 (2/pi) K(sin^2(A/2)) (mpmath); f = 1/T; beats per hour
    7200/T (a beat is half a period, common practice); peak angular speed
    2 omega0 sin(A/2) and speed L times that, energy m g L (1 - cos A) (energy
    conservation); separatrix margin 1 - h = cos^2(A/2). 1e-15 relative (a few ulp)."""
    a = math.radians(deg)
    r = swingcalc.simple_pendulum(L, a, mass=M, gravity=G)
    with mpmath.workdps(40):
        am, Lm, gm = mpmath.mpf(a), mpmath.mpf(L), mpmath.mpf(G)
        t0 = 2 * mpmath.pi * mpmath.sqrt(Lm / gm)
        t = t0 * 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(am / 2) ** 2)
        w_peak = 2 * mpmath.sqrt(gm / Lm) * mpmath.sin(am / 2)
        energy = M * gm * Lm * (1 - mpmath.cos(am))
        margin = mpmath.cos(am / 2) ** 2
    assert r.small_angle_period_s == pytest.approx(float(t0), rel=1e-15)
    assert r.period_s == pytest.approx(float(t), rel=1e-15)
    assert r.period_ratio == pytest.approx(float(t / t0), rel=1e-15)
    assert r.frequency_hz == pytest.approx(float(1 / t), rel=1e-15)
    assert r.beats_per_hour == pytest.approx(float(7200 / t), rel=1e-15)
    assert r.peak_angular_speed_rad_s == pytest.approx(float(w_peak), rel=1e-15)
    assert r.peak_speed_m_s == pytest.approx(float(w_peak * Lm), rel=1e-15)
    assert r.energy_J == pytest.approx(float(energy), rel=1e-15)
    assert r.separatrix_margin == pytest.approx(float(margin), rel=1e-15)


def test_seconds_pendulum_beats_3600_per_hour():
    """A seconds pendulum (T = 2 s, L = g/pi^2 at g_n, REFERENCES.md) at a small amplitude
    beats once a second: 3600 per hour less the circular error 3600 A^2/16 (0.1 deg:
    1.7e-4 beats/h; the A^4 term is below 1e-10 of that)."""
    a = math.radians(0.1)
    r = swingcalc.simple_pendulum(STANDARD_GRAVITY / math.pi ** 2, a)
    assert r.small_angle_period_s == pytest.approx(2.0, rel=4 * EPS)
    assert r.beats_per_hour == pytest.approx(3600 * (1 - a * a / 16), rel=1e-13)


@pytest.mark.parametrize("deg", [5.0, 40.0, 89.0, 120.0, 170.0])
def test_peak_and_min_tension_against_integrated_swing(deg):
    """Peak tension at the bottom from the integrated swing, m (L omega_b^2 + g), equals
    m g (3 - 2 cos A); the minimum over the swing (at the ends) equals m g cos A
    (negative beyond 90 deg: a rigid rod in compression). DOP853 1e-12: 1e-9 relative."""
    a = math.radians(deg)
    r = swingcalc.simple_pendulum(L, a, mass=M, gravity=G)
    sol, y_bottom = _half_swing(a)
    peak = _tension(0.0, y_bottom[1])
    assert r.peak_tension_N == pytest.approx(peak, rel=1e-9)
    assert r.peak_tension_N == pytest.approx(M * G * (3 - 2 * math.cos(a)), rel=4 * EPS)
    t = np.linspace(sol.t[0], sol.t[-1], 4001)
    th, om = sol.sol(t)
    tension = _tension(th, om)
    assert r.min_tension_N == pytest.approx(tension.min(), rel=1e-9, abs=1e-9 * M * G)
    assert r.min_tension_N == pytest.approx(M * G * math.cos(a), rel=4 * EPS, abs=4 * EPS)
    assert tension.max() <= r.peak_tension_N * (1 + 1e-9)


@pytest.mark.parametrize("deg", [100.0, 120.0, 150.0, 179.0])
def test_zero_tension_angle_against_integrated_swing(deg):
    """Beyond 90 deg the tension changes sign at cos(theta_s) = 2 cos(A)/3 (REFERENCES.md:
    T = m g (3 cos theta - 2 cos A)); the same angle from the integrated swing, found as
    the root of m (L omega^2 + g cos theta) on the dense output (1e-9 rad)."""
    from scipy.optimize import brentq

    a = math.radians(deg)
    r = swingcalc.simple_pendulum(L, a, mass=M, gravity=G, suspension="flexible")
    sol, _ = _half_swing(a)
    f = lambda t: _tension(*sol.sol(t))
    # Tension is negative at release and grows to its peak at the bottom.
    t_bottom = sol.t_events[0][0]
    t_s = brentq(f, 0.0, t_bottom, xtol=1e-15)
    theta_s = sol.sol(t_s)[0]
    assert r.zero_tension_angle_rad == pytest.approx(theta_s, abs=1e-9)
    assert r.zero_tension_angle_rad == pytest.approx(math.acos(2 * math.cos(a) / 3), rel=4 * EPS)


def test_over_the_top_speeds_rigid_and_flexible():
    """Rigid rod: bottom speed sqrt(4 g L) reaches the top with zero speed; flexible:
    sqrt(5 g L) reaches it with zero tension, m (v_top^2/L - g) = 0 with
    v_top^2 = v^2 - 4 g L = g L (REFERENCES.md). Checked by hand and with classify: just
    above sqrt(4 g L) the motion is a rotation, just below a libration."""
    r = swingcalc.simple_pendulum(L, 0.3, mass=M, gravity=G)
    assert r.over_top_speed_rigid_m_s == pytest.approx(math.sqrt(4 * G * L), rel=2 * EPS)
    assert r.over_top_speed_flexible_m_s == pytest.approx(math.sqrt(5 * G * L), rel=2 * EPS)
    v5 = r.over_top_speed_flexible_m_s
    top_tension = M * ((v5 ** 2 - 4 * G * L) / L - G)
    assert abs(top_tension) <= 16 * EPS * M * G
    v4 = r.over_top_speed_rigid_m_s
    assert swingcalc.classify(0.0, v4 * (1 + 1e-9) / L, L, G).regime == swingcalc.Regime.ROTATION
    assert swingcalc.classify(0.0, v4 * (1 - 1e-9) / L, L, G).regime == swingcalc.Regime.LIBRATION


@pytest.mark.parametrize("v2_over_gl, deg", [(3.0, 109.4712206), (4.0, 131.8103149)])
def test_slack_angle_reference_values(v2_over_gl, deg):
    """cos(theta_s) = (2 - v0^2/(g L))/3 for 2 gL < v0^2 < 5 gL: v0^2/(gL) = 3 gives
    109.4712206 deg, 4 gives 131.8103149 deg (REFERENCES.md [calc], 7 decimals: 5e-8 deg).
    slack_angle takes h = v0^2/(4 g L)."""
    got = swingcalc.slack_angle(v2_over_gl / 4)
    assert math.degrees(got) == pytest.approx(deg, abs=5e-8)


def test_slack_angle_outside_its_range_is_none():
    """Below h = 1/2 (amplitude under 90 deg) the tension never vanishes; from h = 5/4
    (v0^2 = 5 g L) up the bob passes the top with tension to spare (REFERENCES.md)."""
    for h in (0.0, 0.3, 0.5, 1.25, 2.0):
        assert swingcalc.slack_angle(h) is None
    assert math.degrees(swingcalc.slack_angle(0.5 + 1e-9)) == pytest.approx(90.0, abs=1e-6)
    assert math.degrees(swingcalc.slack_angle(1.25 - 1e-12)) == pytest.approx(180.0, abs=1e-3)


def test_slack_onset_at_90_degrees_and_warnings():
    """A flexible suspension goes slack only for amplitudes beyond 90 deg (tension at
    release m g cos A, REFERENCES.md); the result then carries a warning that the
    results do not hold past the slack point; a rigid rod gets a compression warning;
    amplitudes within 1e-3 of the separatrix energy get a warning too."""
    below = swingcalc.simple_pendulum(L, math.radians(89.9), suspension="flexible")
    assert below.zero_tension_angle_rad is None and below.warnings == ()
    above = swingcalc.simple_pendulum(L, math.radians(90.1), suspension="flexible")
    assert above.zero_tension_angle_rad is not None
    assert math.degrees(above.zero_tension_angle_rad) < 90.1
    assert math.degrees(above.zero_tension_angle_rad) == pytest.approx(
        math.degrees(math.acos(2 * math.cos(math.radians(90.1)) / 3)), rel=1e-14)
    assert any("slack" in w for w in above.warnings)
    rigid = swingcalc.simple_pendulum(L, math.radians(120), suspension="rigid")
    assert any("compression" in w for w in rigid.warnings)
    near = swingcalc.simple_pendulum(L, math.pi - 0.01)
    assert any("separatrix" in w for w in near.warnings)
    far = swingcalc.simple_pendulum(L, math.pi - 0.1)  # 1 - h = 2.5e-3 > 1e-3
    assert not any("separatrix" in w for w in far.warnings)


def test_simple_pendulum_defaults_and_to_dict():
    """Default gravity is g_n = 9.80665 m/s^2 (3rd CGPM 1901) and mass 1 kg; to_dict is
    plain data."""
    r = swingcalc.simple_pendulum(1.0, 0.2)
    assert r.gravity_m_s2 == 9.80665 and r.mass_kg == 1.0 and r.suspension == "rigid"
    d = r.to_dict()
    assert d["period_s"] == r.period_s and isinstance(d["warnings"], list)


# --- Bad input ----------------------------------------------------------------------------

NAN, INF = float("nan"), float("inf")


@pytest.mark.parametrize("call, field", [
    (lambda: swingcalc.simple_pendulum(-1.0, 0.2), "length"),
    (lambda: swingcalc.simple_pendulum(0.0, 0.2), "length"),
    (lambda: swingcalc.simple_pendulum(NAN, 0.2), "length"),
    (lambda: swingcalc.simple_pendulum(1.0, math.pi), "amplitude"),
    (lambda: swingcalc.simple_pendulum(1.0, 4.0), "amplitude"),
    (lambda: swingcalc.simple_pendulum(1.0, -0.1), "amplitude"),
    (lambda: swingcalc.simple_pendulum(1.0, INF), "amplitude"),
    (lambda: swingcalc.simple_pendulum(1.0, 0.2, mass=0.0), "mass"),
    (lambda: swingcalc.simple_pendulum(1.0, 0.2, gravity=-9.8), "gravity"),
    (lambda: swingcalc.simple_pendulum(1.0, 0.2, suspension="chain"), "suspension"),
    (lambda: swingcalc.simple_pendulum(1.0, [0.1, 0.2]), "amplitude"),
    (lambda: swingcalc.slack_angle(NAN), "energy_ratio"),
    (lambda: swingcalc.slack_angle(INF), "energy_ratio"),
    (lambda: swingcalc.slack_angle("high"), "energy_ratio"),
    # exact-swing API
    (lambda: swingcalc.period_ratio(NAN), "amplitude"),
    (lambda: swingcalc.period_ratio(math.pi), "amplitude"),
    (lambda: swingcalc.period_ratio(np.array([0.1, INF])), "amplitude"),
    (lambda: swingcalc.period_excess(-1e-300), "amplitude"),
    (lambda: swingcalc.period(-1.0, 0.1), "length"),
    (lambda: swingcalc.period(1.0, 0.1, 0.0), "gravity"),
    (lambda: swingcalc.small_angle_period(INF), "length"),
    (lambda: swingcalc.natural_angular_frequency(1.0, NAN), "gravity"),
    (lambda: swingcalc.rotation_period(1.0, 1.0, G), "bottom_speed"),
    (lambda: swingcalc.rotation_period(1.0, NAN, G), "bottom_speed"),
    (lambda: swingcalc.rotation_period_ratio(1.0), "energy_ratio"),
    (lambda: swingcalc.rotation_period_ratio(0.5), "energy_ratio"),
    (lambda: swingcalc.amplitude_for_period_ratio(0.5), "period ratio"),
    (lambda: swingcalc.amplitude_for_period_ratio(NAN), "period ratio"),
    (lambda: swingcalc.amplitude_for_period_ratio(1e6), "period ratio"),
    (lambda: swingcalc.amplitude_for_period_excess(-0.1), "period_excess"),
    (lambda: swingcalc.time_from_bottom(0.1, 1.0), "amplitude/bottom_speed"),
    (lambda: swingcalc.time_from_bottom(0.1, 1.0, amplitude=0.5, bottom_speed=1.0),
     "amplitude/bottom_speed"),
    (lambda: swingcalc.time_from_bottom(0.6, 1.0, amplitude=0.5), "angle"),
    (lambda: swingcalc.time_from_bottom(4.0, 1.0, bottom_speed=100.0), "angle"),
    (lambda: swingcalc.time_from_bottom(3.0, 1.0, bottom_speed=1.0), "angle"),
    (lambda: swingcalc.time_from_bottom(0.1, 1.0, amplitude=math.pi), "amplitude"),
    (lambda: swingcalc.harmonic_ratio(0.5, 2), "order"),
    (lambda: swingcalc.harmonic_ratio(0.5, 0), "order"),
    (lambda: swingcalc.harmonic_ratio(0.5, 3.0), "order"),
    (lambda: swingcalc.classify(NAN, 0.0, 1.0), "angle"),
    (lambda: swingcalc.classify(0.0, INF, 1.0), "angular_velocity"),
    (lambda: swingcalc.classify(0.0, 1.0, 0.0), "length"),
    (lambda: swingcalc.classify(0.0, 1.0, 1.0, tolerance=0.5), "tolerance"),
    (lambda: swingcalc.swing_history(0.1, 0.0, [0.0, INF], 1.0), "times"),
    (lambda: swingcalc.swing_history(0.1, 0.0, [0.0, 1.0], -1.0), "length"),
])
def test_bad_input_raises_invalid_input_naming_the_field(call, field):
    """Bad input raises swingcalc.InvalidInput (a ValueError) with the field name first in
    its one-line message (errors.py; RULES: no traceback-only failures)."""
    with pytest.raises(swingcalc.InvalidInput) as info:
        call()
    assert isinstance(info.value, ValueError)
    assert info.value.field == field
    assert str(info.value).startswith(field)
    assert "\n" not in str(info.value)
