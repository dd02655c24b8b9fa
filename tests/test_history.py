"""Regimes, exact time history, time from the bottom and harmonics of the simple pendulum.

theta'' = -(g/L) sin theta, omega0 = sqrt(g/L). Energy relative to the separatrix:
h = (omega / (2 omega0))^2 + sin^2(theta/2) (h < 1 libration, h > 1 rotation).

Independent sides: scipy solve_ivp DOP853 at rtol = atol = 1e-12 over a few periods
(tests/helpers.integrate); mpmath at 40 digits with its own phase computation
(mpmath.ellipf, ellipfun) for long times and near the separatrix, where an integration
cannot be trusted: a perturbation near the upright position grows like exp(omega0 t)
while the bob lingers there, so integration errors are amplified by ~ 1/sqrt(1 - h)
per pass over the top.
"""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest

import swingcalc
from swingcalc import Regime

from helpers import EPS, integrate, mp_libration_state, mp_period_ratio, mp_rotation_state

G = 9.80665


def _energy(theta, omega, omega0):
    return (omega / (2 * omega0)) ** 2 + np.sin(theta / 2) ** 2


# --- classify -----------------------------------------------------------------------------

def _mp_energy(theta, omega, L, g):
    with mpmath.workdps(50):
        w0 = mpmath.sqrt(mpmath.mpf(g) / mpmath.mpf(L))
        return (mpmath.mpf(omega) / (2 * w0)) ** 2 + mpmath.sin(mpmath.mpf(theta) / 2) ** 2, w0


def test_classify_rest():
    """At the bottom with no speed: rest, h = 0, amplitude 0, the small-angle period."""
    st = swingcalc.classify(0.0, 0.0, 1.2, G)
    assert st.regime == Regime.REST
    assert st.energy_ratio == 0.0 and st.separatrix_margin == 1.0
    assert st.amplitude_rad == 0.0 and st.direction == 0
    assert st.period_s == pytest.approx(2 * math.pi * math.sqrt(1.2 / G), rel=2 * EPS)


@pytest.mark.parametrize("theta, omega", [(0.7, 0.0), (0.0, 3.0), (-1.2, 2.5), (3.0, -0.1),
                                          (0.7 + 4 * math.pi, 0.0)])
def test_classify_libration_energy_margin_amplitude_period(theta, omega):
    """Libration: h, 1 - h, amplitude 2 asin(sqrt h), bottom speed 2 omega0 sqrt h and
    period T0 (2/pi) K(h), all hand formulas evaluated in mpmath at the float inputs
    (energy conservation; A&S 17.2). Tolerance 8 ulp: the library rounds about five
    operations (omega0, w, s^2, the sum), each 1/2 ulp, cond <= 1 for these states; the
    margin 1 - h is well away from 0 here (cond = h/(1 - h) < 20)."""
    L = 0.8
    st = swingcalc.classify(theta, omega, L, G)
    h, w0 = _mp_energy(theta, omega, L, G)
    assert st.regime == Regime.LIBRATION and st.direction == 0
    assert st.energy_ratio == pytest.approx(float(h), rel=8 * EPS)
    cond = float(h / (1 - h))
    assert st.separatrix_margin == pytest.approx(float(1 - h), rel=8 * EPS * (1 + cond))
    with mpmath.workdps(50):
        amp = 2 * mpmath.asin(mpmath.sqrt(h))
        per = 2 * mpmath.pi / w0 * 2 / mpmath.pi * mpmath.ellipk(h)
    assert st.amplitude_rad == pytest.approx(float(amp), rel=8 * EPS * (1 + cond))
    assert st.bottom_angular_speed_rad_s == pytest.approx(float(2 * w0 * mpmath.sqrt(h)),
                                                          rel=8 * EPS)
    assert st.period_s == pytest.approx(float(per), rel=8 * EPS * (1 + cond))
    assert st.top_angular_speed_rad_s is None


@pytest.mark.parametrize("sign", [1, -1])
def test_classify_rotation_both_directions(sign):
    """Rotation: direction = sign of omega, top speed 2 omega0 sqrt(h - 1), revolution time
    T0 K(1/h) / (pi sqrt h) (Lawden 1989 §5.2), no amplitude; mpmath hand formulas,
    8 ulp as above (h - 1 = 1.6, cond < 2)."""
    L, theta, omega = 0.8, 0.4, sign * 11.0
    st = swingcalc.classify(theta, omega, L, G)
    h, w0 = _mp_energy(theta, omega, L, G)
    assert st.regime == Regime.ROTATION and st.direction == sign
    assert st.amplitude_rad is None
    assert st.energy_ratio == pytest.approx(float(h), rel=8 * EPS)
    assert st.separatrix_margin == pytest.approx(float(1 - h), rel=16 * EPS)
    with mpmath.workdps(50):
        top = 2 * w0 * mpmath.sqrt(h - 1)
        per = 2 * mpmath.pi / w0 * mpmath.ellipk(1 / h) / (mpmath.pi * mpmath.sqrt(h))
    assert st.top_angular_speed_rad_s == pytest.approx(float(top), rel=16 * EPS)
    assert st.period_s == pytest.approx(float(per), rel=16 * EPS)


def test_classify_balanced_at_top():
    """At the top with no speed (angle = math.pi, 1.2e-16 from the true top): balanced,
    h = 1 to rounding, margin cos^2(pi/2) ~ 4e-33. The numbers stay those of the exact
    float state, a libration of amplitude math.pi: period T0 (2/pi) K(sin^2(pi_f/2))
    from mpmath at 50 digits (K from its complement, relative 1e-15: 4 ulp of a result
    that is 25 T0), the same state that swing_history follows."""
    L = 1.0
    st = swingcalc.classify(math.pi, 0.0, L, G)
    assert st.regime == Regime.BALANCED
    assert st.energy_ratio == pytest.approx(1.0, abs=2 * EPS)
    assert abs(st.separatrix_margin) < 1e-30
    assert st.amplitude_rad == pytest.approx(math.pi, abs=1e-15)
    with mpmath.workdps(50):
        half = mpmath.mpf(math.pi) / 2
        t0 = 2 * mpmath.pi * mpmath.sqrt(mpmath.mpf(L) / G)
        expected = t0 * 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(half) ** 2)
    assert st.period_s == pytest.approx(float(expected), rel=1e-15)


def test_classify_separatrix_within_tolerance():
    """From the bottom at omega = 2 omega0 (1 + d): separatrix iff |1 - h| <= tolerance.
    g = 4, L = 1 makes omega0 = 2 and w = omega/4 exact, so 1 - h = -(2d + d^2) exactly
    up to the rounding of omega itself (checked in mpmath)."""
    for d, tol, regime in [(0.0, 0.0, Regime.SEPARATRIX), (1e-13, 1e-12, Regime.SEPARATRIX),
                           (-1e-13, 1e-12, Regime.SEPARATRIX), (1e-11, 1e-12, Regime.ROTATION),
                           (-1e-11, 1e-12, Regime.LIBRATION), (1e-7, 1e-6, Regime.SEPARATRIX)]:
        omega = 4.0 * (1.0 + d)
        st = swingcalc.classify(0.0, omega, 1.0, 4.0, tolerance=tol)
        assert st.regime == regime, (d, tol, st)
        h, _ = _mp_energy(0.0, omega, 1.0, 4.0)
        # margin = (1 - w)(1 + w), both factors exact or one rounding: 2 ulp relative.
        assert st.separatrix_margin == pytest.approx(float(1 - h), rel=2 * EPS, abs=0.0) \
            or float(1 - h) == st.separatrix_margin == 0.0
        if d == 0.0:
            # Exactly on the separatrix (q = 0): the period is unbounded.
            assert st.period_s == math.inf


def test_classify_margin_keeps_relative_accuracy_next_to_separatrix():
    """1 - h formed without cancellation: at theta = pi - 1e-8, omega = 0 (g = 4, L = 1)
    1 - h = cos^2(theta/2) = 2.5e-17 (mpmath), which 1 - sin^2 would round to 0 or 1 ulp."""
    theta = math.pi - 1e-8
    st = swingcalc.classify(theta, 0.0, 1.0, 4.0, tolerance=0.0)
    with mpmath.workdps(50):
        ref = mpmath.cos(mpmath.mpf(theta) / 2) ** 2
    assert st.regime == Regime.LIBRATION
    assert st.separatrix_margin == pytest.approx(float(ref), rel=4 * EPS)
    assert st.amplitude_rad == pytest.approx(theta, rel=4 * EPS)


# --- swing_history against integration ---------------------------------------------------

STATES = [
    ("libration from rest at 60 deg", math.radians(60), 0.0),
    ("libration from the bottom moving backwards", 0.0, -4.0),
    ("libration at 170 deg", math.radians(170), 0.0),
    ("rotation forwards", 0.3, 9.0),
    ("rotation backwards", -2.0, -8.0),
    ("rotation from beyond one turn", 2.0 * math.pi + 1.0, 7.5),
]


@pytest.mark.parametrize("name, theta0, omega0_dot", STATES, ids=[s[0] for s in STATES])
def test_history_matches_dop853_over_a_few_periods_forwards_and_backwards(name, theta0,
                                                                          omega0_dot):
    """theta(t), omega(t) over +-3 periods against DOP853 at rtol = atol = 1e-13.

    DOP853's own error grows as the swing nears the separatrix: at 170 deg over 3 periods
    it was measured at 1.3e-9 rad with rtol 1e-12, 1.2e-10 with 1e-13 and 2e-11 with 2e-14
    (converging on the library's values). Tolerance 1e-9 rad, and 1e-9 rad/s times
    (1 + 2 omega0) for omega."""
    L = 0.9
    omega0 = math.sqrt(G / L)
    st = swingcalc.classify(theta0, omega0_dot, L, G)
    t = np.linspace(-3 * st.period_s, 3 * st.period_s, 121)
    hist = swingcalc.swing_history(theta0, omega0_dot, t, L, G)
    th, om = integrate(theta0, omega0_dot, t, L, G, rtol=1e-13, atol=1e-13)
    assert hist.regime == st.regime
    assert np.max(np.abs(hist.angle_rad - th)) <= 1e-9
    assert np.max(np.abs(hist.angular_velocity_rad_s - om)) <= 1e-9 * (1 + 2 * omega0)
    # Energy: h = (omega / 2 omega0)^2 + sin^2(theta/2) is constant (to ~1e-15 relative
    # of h: the history's sn, cn, dn are each good to ~1e-15).
    e = _energy(hist.angle_rad, hist.angular_velocity_rad_s, omega0)
    assert np.max(np.abs(e - st.energy_ratio)) <= 4e-15 * max(1.0, st.energy_ratio)


def test_history_starts_at_the_initial_state_and_accepts_unordered_times():
    """t = 0 reproduces the input (2 ulp), and times in any order give the same samples."""
    L = 1.1
    t = np.array([3.0, 0.0, -1.5, 0.7])
    hist = swingcalc.swing_history(0.9, -1.3, t, L, G)
    assert hist.angle_rad[1] == pytest.approx(0.9, rel=4 * EPS)
    assert hist.angular_velocity_rad_s[1] == pytest.approx(-1.3, rel=8 * EPS)
    order = np.argsort(t)
    sorted_hist = swingcalc.swing_history(0.9, -1.3, t[order], L, G)
    np.testing.assert_array_equal(sorted_hist.angle_rad, hist.angle_rad[order])


def test_history_at_rest_stays_put():
    """At rest at the bottom nothing moves (DOP853 even fails on an identically zero
    right-hand side, scipy #12308, so this is a special case)."""
    t = np.array([-5.0, 0.0, 1e6])
    rest = swingcalc.swing_history(0.0, 0.0, t, 1.0, G)
    assert np.all(rest.angle_rad == 0.0) and np.all(rest.angular_velocity_rad_s == 0.0)


@pytest.mark.parametrize("theta0", [math.pi, -math.pi, 3 * math.pi])
def test_history_released_at_float_pi_is_a_libration_of_that_amplitude(theta0):
    """math.pi is 1.2e-16 below the true top, so a bob released there at rest librates with
    amplitude math.pi (period ~24.6 T0) and first falls back towards the bottom on its own
    side (theta'' = -omega0^2 sin(math.pi) < 0). Reference: mpmath libration at the float
    state (helpers.mp_libration_state), reduced by the true 2 pi; |theta - 2 pi n| stays
    within math.pi. Tolerance as for long times."""
    L = 1.0
    omega0 = math.sqrt(G / L)
    t = np.array([-5.0, 3.0, 20.0, 1e3])
    hist = swingcalc.swing_history(theta0, 0.0, t, L, G)
    with mpmath.workdps(50):
        turns = int(mpmath.nint(mpmath.mpf(theta0) / (2 * mpmath.pi)))
        red = mpmath.mpf(theta0) - 2 * mpmath.pi * turns
        shift = 2 * mpmath.pi * turns
    for i, ti in enumerate(t):
        th, om = mp_libration_state(red, 0.0, ti, L, G, dps=50)
        th = th + shift
        tol = _long_time_tol(ti, omega0, float(th))
        assert abs(hist.angle_rad[i] - float(th)) <= tol, (theta0, ti, hist.angle_rad[i], th)
        assert abs(hist.angular_velocity_rad_s[i] - float(om)) <= 2 * omega0 * tol


# --- swing_history against mpmath at long times and near the separatrix -------------------

def _long_time_tol(t, omega0, value_scale):
    # The phase u = omega0 t + u0 carries about 3 |u| eps (the product omega0 t, and the
    # reduction modulo 4K with K to 1 ulp); |dtheta/du| <= 2, |d omega/du| <= 2 omega0 *
    # (1 + ...): allow 8 |u| eps, plus one ulp of the (unwrapped) value and 1e-14.
    u = omega0 * abs(t)
    return 8 * u * EPS + math.ulp(value_scale) + 1e-14


@pytest.mark.parametrize("theta0, omega0_dot", [(1.0, 0.0), (0.3, 2.0), (-0.5, -1.0),
                                                (math.radians(175), 0.0)])
def test_libration_history_long_times_against_mpmath(theta0, omega0_dot):
    """t up to 1e6 s (~1.6e5 periods) against mpmath.ellipfun at 40 digits with the phase
    from mpmath.ellipf (helpers.mp_libration_state). Integration is useless here (its
    global error grows with t); the library's error should grow only like |u| eps."""
    L = 1.0
    omega0 = math.sqrt(G / L)
    t = np.array([0.37, -25.0, 1e3, -1e4, 1e5, 1e6, -1e6])
    hist = swingcalc.swing_history(theta0, omega0_dot, t, L, G)
    for i, ti in enumerate(t):
        th, om = mp_libration_state(theta0, omega0_dot, ti, L, G)
        tol = _long_time_tol(ti, omega0, float(th))
        assert abs(hist.angle_rad[i] - float(th)) <= tol, (ti, hist.angle_rad[i], th)
        assert abs(hist.angular_velocity_rad_s[i] - float(om)) <= 2 * omega0 * tol, ti


@pytest.mark.parametrize("theta0, omega0_dot", [(0.0, 7.0), (2.0, -7.0), (-3.0, 12.0)])
def test_rotation_history_long_times_against_mpmath(theta0, omega0_dot):
    """Unwrapped theta(t) of a rotation for t up to 1e6 s against mpmath
    (helpers.mp_rotation_state: am via atan2(sn, cn) plus n pi). Same tolerance as for
    libration, with one ulp of the unwrapped angle (~1e-9 rad at 1e7 rad)."""
    L = 1.0
    omega0 = math.sqrt(G / L)
    t = np.array([0.37, -25.0, 1e3, -1e4, 1e5, 1e6])
    hist = swingcalc.swing_history(theta0, omega0_dot, t, L, G)
    h, _ = _mp_energy(theta0, omega0_dot, L, G)
    for i, ti in enumerate(t):
        th, om = mp_rotation_state(theta0, omega0_dot, ti, L, G)
        tol = _long_time_tol(ti * math.sqrt(float(h)), omega0, float(th))
        assert abs(hist.angle_rad[i] - float(th)) <= tol, (ti, hist.angle_rad[i], th)
        assert abs(hist.angular_velocity_rad_s[i] - float(om)) <= 2 * omega0 * tol, ti


def test_libration_history_near_separatrix_amplitude_pi_minus_1e8():
    """Released at A = pi - 1e-8 (h = 1 - 2.5e-17): the bob hangs near the top for
    ~ ln(8/1e-8)/omega0 per half swing. Against mpmath at 40 digits over 10 periods and at
    1e5 s; tolerance as for long times (phase error ~ |u| eps). DOP853 cannot serve here:
    near the top errors grow like exp(omega0 t)."""
    L, g = 1.0, G
    omega0 = math.sqrt(g / L)
    a = math.pi - 1e-8
    per = swingcalc.period(L, a, g)
    t = np.concatenate([np.linspace(0, 10 * per, 41), [1e5, -3.3e4]])
    hist = swingcalc.swing_history(a, 0.0, t, L, g)
    assert hist.regime == Regime.LIBRATION
    for i, ti in enumerate(t):
        th, om = mp_libration_state(a, 0.0, ti, L, g)
        tol = _long_time_tol(ti, omega0, float(th))
        assert abs(hist.angle_rad[i] - float(th)) <= tol, (ti, hist.angle_rad[i], th)
        assert abs(hist.angular_velocity_rad_s[i] - float(om)) <= 2 * omega0 * tol, ti
    assert np.all(np.abs(hist.angle_rad) <= a * (1 + 2 * EPS))


@pytest.mark.parametrize("d", [1e-10, -1e-10])
def test_history_next_to_separatrix_from_the_bottom(d):
    """From the bottom at omega = 2 omega0 (1 + d), d = +-1e-10 (rotation / libration).
    g = 4, L = 1: omega0 = 2 and w = omega/4 exact, so the library's h - 1 is exact and the
    comparison with mpmath shows its own accuracy, up to 1e4 s. (With g_n the rounding of
    w moves h - 1 by ~1e-6 relative, which shifts the revolution time; errors then grow
    with t for a reason outside the method.)"""
    L, g = 1.0, 4.0
    omega = 4.0 * (1.0 + d)
    t = np.array([0.5, 3.0, 11.0, 25.0, 1e3, 1e4, -1e3])
    hist = swingcalc.swing_history(0.0, omega, t, L, g)
    ref = mp_rotation_state if d > 0 else mp_libration_state
    for i, ti in enumerate(t):
        th, om = ref(0.0, omega, ti, L, g, dps=50)
        tol = _long_time_tol(ti, 2.0, float(th))
        assert abs(hist.angle_rad[i] - float(th)) <= tol, (ti, hist.angle_rad[i], th)
        assert abs(hist.angular_velocity_rad_s[i] - float(om)) <= 4.0 * tol, ti


def test_history_on_the_separatrix_is_the_gudermannian():
    """Exactly on the separatrix from the bottom (g = 4, L = 1, omega = 4 = 2 omega0):
    theta(t) = 4 atan(exp(omega0 t)) - pi, omega = 2 omega0 sech(omega0 t) (closed form
    with sn = tanh, dn = sech, DLMF 22.5.3). Times up to 1000 s (omega0 t = 2000, where
    cosh overflows: the answer must still be finite, theta -> pi, omega -> 0, and raise no
    RuntimeWarning). Tolerance 4 ulp of pi plus 4 |u| eps."""
    t = np.array([-3.0, -0.2, 0.0, 0.4, 2.0, 10.0, 360.0, 1000.0])
    hist = swingcalc.swing_history(0.0, 4.0, t, 1.0, 4.0)
    assert hist.regime == Regime.SEPARATRIX
    with mpmath.workdps(40):
        for i, ti in enumerate(t):
            u = 2 * mpmath.mpf(ti)
            th = 4 * mpmath.atan(mpmath.exp(u)) - mpmath.pi
            om = 4 * mpmath.sech(u)
            tol = 4 * math.ulp(math.pi) + 4 * abs(float(u)) * EPS
            assert abs(hist.angle_rad[i] - float(th)) <= tol
            assert abs(hist.angular_velocity_rad_s[i] - float(om)) <= tol * 4


def test_time_history_energy_conserved_near_separatrix():
    """Energy along a 1e4 s history at A = pi - 1e-6: |h(t) - h(0)| <= 8 eps (absolute:
    theta near the top has sin^2(theta/2) = 1 - O(1e-12), and each of sn, cn, dn is good to
    ~1e-15 absolute)."""
    L = 2.0
    omega0 = math.sqrt(G / L)
    a = math.pi - 1e-6
    t = np.linspace(0.0, 1e4, 2001)
    hist = swingcalc.swing_history(a, 0.0, t, L, G)
    e = _energy(hist.angle_rad, hist.angular_velocity_rad_s, omega0)
    assert np.max(np.abs(e - math.sin(a / 2) ** 2)) <= 8 * EPS


def test_state_history_method_matches_function():
    """SwingState.history is swing_history from the same state."""
    st = swingcalc.classify(0.2, 1.0, 1.0, G)
    t = np.array([0.0, 1.0, 2.0])
    a = st.history(t)
    b = swingcalc.swing_history(0.2, 1.0, t, 1.0, G)
    np.testing.assert_array_equal(a.angle_rad, b.angle_rad)


# --- time_from_bottom ---------------------------------------------------------------------

def _mp_time_amplitude(angle, a, L, g):
    """t = int_0^angle dtheta / sqrt(2 g/L (cos theta - cos A)) by mpmath.quad (energy)."""
    with mpmath.workdps(40):
        A, th = mpmath.mpf(a), mpmath.mpf(angle)
        k = 2 * mpmath.mpf(g) / mpmath.mpf(L)
        # cos x - cos A = 2 sin((A + x)/2) sin((A - x)/2), no cancellation near x = A.
        f = lambda x: 1 / mpmath.sqrt(k * 2 * mpmath.sin((A + x) / 2) * mpmath.sin((A - x) / 2))
        return mpmath.quad(f, [0, th / 2, th])


def _mp_time_speed(angle, v, L, g):
    """t = int_0^angle dtheta / sqrt(v^2/L^2 - 2 (g/L)(1 - cos theta)) (energy form)."""
    with mpmath.workdps(40):
        v, L, g, th = (mpmath.mpf(x) for x in (v, L, g, angle))
        f = lambda x: 1 / mpmath.sqrt(v ** 2 / L ** 2 - 4 * g / L * mpmath.sin(x / 2) ** 2)
        return mpmath.quad(f, [0, th / 2, th])


@pytest.mark.parametrize("a, frac", [(0.3, 0.5), (1.5, 0.9), (2.5, 1.0), (3.1, 0.99),
                                     (math.pi - 1e-6, 0.999)])
def test_time_from_bottom_with_amplitude_against_quadrature(a, frac):
    """Time to reach frac * A from the bottom vs mpmath.quad of the energy integral.
    Tolerance 1e-14 relative: R_F is good to a few ulp and the library forms
    h - s^2 = sin((A - x)/2) sin((A + x)/2) without cancellation; at frac = 1 the
    endpoint is the turning point."""
    L, g = 1.7, G
    angle = frac * a
    got = swingcalc.time_from_bottom(angle, L, amplitude=a, gravity=g)
    assert got == pytest.approx(float(_mp_time_amplitude(angle, a, L, g)), rel=1e-14)
    assert swingcalc.time_from_bottom(-angle, L, amplitude=a, gravity=g) == -got


@pytest.mark.parametrize("a", [0.01, 1.0, 2.0, 3.0, math.pi - 1e-9])
def test_time_to_the_turning_point_is_a_quarter_period(a):
    """t(A) = T/4 = (1/omega0) K(sin^2(A/2)) (mpmath at the float amplitude), 1e-14."""
    L, g = 0.6, G
    with mpmath.workdps(60):
        q = mpmath.sqrt(mpmath.mpf(L) / mpmath.mpf(g)) * mpmath.ellipk(
            mpmath.sin(mpmath.mpf(a) / 2) ** 2)
    got = swingcalc.time_from_bottom(a, L, amplitude=a, gravity=g)
    assert got == pytest.approx(float(q), rel=1e-14)
    assert got == pytest.approx(swingcalc.period(L, a, g) / 4, rel=1e-14)


def _cond_tol(t_ref, angle, omega_at_angle, dt_dparam_rel):
    """1e-14 + 4 eps * (condition numbers of t in the angle and in the other input).

    cond_angle = |angle * (dt/dangle) / t| = |angle / (omega(angle) t)|; the second comes
    from mpmath. A backward-stable evaluation at float inputs is within a few ulp times
    these (the library also rounds sin(angle/2), which is exactly such a perturbation)."""
    cond_angle = abs(angle / (omega_at_angle * t_ref)) if angle else 0.0
    return 1e-14 + 4 * EPS * (cond_angle + abs(dt_dparam_rel))


@pytest.mark.parametrize("factor, frac", [(0.5, 0.7), (1.0 - 1e-9, 0.9), (1.0 - 1e-9, 0.999),
                                          (1.0, 0.9), (1.0 + 1e-9, 1.0), (1.0 + 1e-9, 0.999),
                                          (3.0, 1.0)])
def test_time_from_bottom_with_bottom_speed_against_quadrature(factor, frac):
    """From the bottom speed v = factor * 2 sqrt(gL) (libration, separatrix, rotation)
    to angle = frac * (highest angle reached, or pi): mpmath.quad of the energy form,
    cross-checked in the generator of these values against mpmath.ellipf.
    g = 4, L = 1: w = v/4 exact. Tolerance: 1e-14 plus 4 ulp times the condition numbers
    of t in the angle and in v (see _cond_tol); frac = 1 in rotation is the top."""
    L, g = 1.0, 4.0
    v = 4.0 * factor
    top = math.pi if factor >= 1.0 else 2 * math.asin(factor)
    angle = frac * top
    got = swingcalc.time_from_bottom(angle, L, bottom_speed=v, gravity=g)
    ref = _mp_time_speed(angle, v, L, g)
    with mpmath.workdps(40):
        om = mpmath.sqrt(mpmath.mpf(v) ** 2 - 16 * mpmath.sin(mpmath.mpf(angle) / 2) ** 2)
        # Central difference in v at relative step 1e-15 (40-digit values: the truncation
        # error is ~1e-30 relative, far below what matters here).
        dlt = mpmath.mpf("1e-15")
        dv = (_mp_time_speed(angle, v * (1 + dlt), L, g)
              - _mp_time_speed(angle, v * (1 - dlt), L, g)) / (2 * dlt * ref)
    # Near the separatrix t is ill-conditioned in v (cond_v = 2.7e4 at 1 - 1e-9, 0.999):
    # a backward-stable result may be off by cond_v eps there (measured 1.3e-12).
    tol = _cond_tol(float(ref), angle, float(om), float(dv))
    assert got == pytest.approx(float(ref), rel=tol)


def test_time_to_turning_point_grows_by_ln10_over_2omega0_per_decade_of_margin():
    """Near the separatrix the quarter period is K(m)/omega0 with K ~ ln(4/sqrt(1 - h))
    (DLMF 19.12.1), so each decade of 1 - h adds ln(10)/(2 omega0) to the time from the
    bottom to the turning point (and, in rotation, to the top). The next term of K is
    O((1 - h) ln(1 - h)): below 1e-6 s for 1 - h <= 1e-7. The margins are taken from the
    actual floats (g = 4, L = 1, omega0 = 2, w = v/4 exact)."""
    L, g = 1.0, 4.0
    omega0 = 2.0
    for sign in (-1.0, 1.0):
        times, gaps = [], []
        for k in range(7, 14):
            w = 1.0 + sign * 10.0 ** -k
            gap = abs((1 - w) * (1 + w))
            angle = math.pi if sign > 0 else 2 * math.asin(w)
            times.append(swingcalc.time_from_bottom(angle, L, bottom_speed=4.0 * w, gravity=g))
            gaps.append(gap)
        for i in range(len(times) - 1):
            expected = math.log(gaps[i] / gaps[i + 1]) / (2 * omega0)
            assert abs(expected - math.log(10) / (2 * omega0)) < 0.01
            assert times[i + 1] - times[i] == pytest.approx(expected, abs=1e-6)


# --- harmonics ----------------------------------------------------------------------------

def _fourier_ratios(a, samples=2048):
    """|a3/a1|, |a5/a1| of theta(t) over one period, from DOP853 (rtol = atol = 1e-12)
    sampled uniformly from the bottom and an FFT (the trapezoid rule, exact for a
    band-limited periodic signal; the aliasing here is ~ q^1000, nil). The period is
    from mpmath."""
    L, g = 1.0, G
    omega0 = math.sqrt(g / L)
    per = 2 * math.pi / omega0 * float(mp_period_ratio(a))
    t = np.arange(samples) * (per / samples)
    th, _ = integrate(0.0, 2 * omega0 * math.sin(a / 2), t, L, g)
    c = np.fft.rfft(th) / samples
    # From the bottom theta(t) is odd in t: a pure sine series (imaginary parts).
    b = -2 * c.imag
    return b[3] / b[1], b[5] / b[1], b


@pytest.mark.parametrize("a", [0.5, 1.5, 2.5, 3.0])
def test_harmonic_ratios_against_fourier_coefficients_of_integrated_swing(a):
    """harmonic_ratio(A, 3) and (A, 5) vs the Fourier coefficients of the integrated swing.

    DOP853's error (~1e-11 rad) over one period bounds the coefficient error by ~1e-11,
    i.e. 1e-11 / a1 in the ratios: tolerance 1e-9 absolute plus 1e-8 relative. Even
    harmonics vanish (theta(t + T/2) = -theta(t))."""
    r3, r5, b = _fourier_ratios(a)
    assert swingcalc.harmonic_ratio(a, 3) == pytest.approx(r3, rel=1e-8, abs=1e-9)
    assert swingcalc.harmonic_ratio(a, 5) == pytest.approx(r5, rel=1e-8, abs=1e-9)
    assert swingcalc.harmonic_ratio(a, 1) == 1.0
    assert abs(b[2]) < 1e-9 and abs(b[4]) < 1e-9


@pytest.mark.parametrize("a", [1e-4, 1e-3, 1e-2])
def test_third_harmonic_small_amplitude_limit_a_squared_over_192(a):
    """a3/a1 -> A^2/192 as A -> 0 (Lindstedt-Poincare to second order:
    theta = A cos wt + (A^3/192)(cos 3wt - cos wt) + O(A^5), standard result [mem]).
    The relative correction is O(A^2); tolerance A^2 (a coefficient-1 allowance, far from
    the factor 2 a wrong leading term would give)."""
    got = swingcalc.harmonic_ratio(a, 3)
    assert got / (a * a / 192) == pytest.approx(1.0, abs=a * a + 4 * EPS)


def test_harmonic_ratio_arrays_and_large_amplitude_growth():
    """Arrays work, and a3/a1 grows with amplitude toward 1/3 as A -> pi (q -> 1 in
    q (1 + q) / (3 (1 + q^3)), the sawtooth-like limit of theta near the separatrix)."""
    a = np.array([0.1, 1.0, 2.0, 3.0, math.pi - 1e-9])
    r = swingcalc.harmonic_ratio(a, 3)
    assert r.shape == a.shape and np.all(np.diff(r) > 0)
    assert 0.2 < r[-1] < 1 / 3


# --- Random states ------------------------------------------------------------------------

from hypothesis import assume, given, settings  # noqa: E402
from hypothesis import strategies as st  # noqa: E402


@settings(max_examples=60, deadline=None)
@given(theta0=st.floats(-3 * math.pi, 3 * math.pi), omega=st.floats(-15.0, 15.0),
       t=st.floats(-1e3, 1e3))
def test_history_random_states_against_mpmath(theta0, omega, t):
    """Random (theta0, omega0, t), L = 1, g = g_n, against the mpmath libration/rotation
    state, with the start reduced by the true 2 pi in mpmath. Tolerance: the long-time
    bound 8 |u| eps, times (1 + h/|1 - h|) because the library rounds w = omega/(2 omega0)
    (about 2 ulp), which moves the period by ~2 eps h/|1 - h| relative; states within
    1e-6 of the separatrix energy are left to the dedicated tests above."""
    L = 1.0
    omega0 = math.sqrt(G / L)
    h, _ = _mp_energy(theta0, omega, L, G)
    hf = float(h)
    assume(abs(1 - hf) > 1e-6 and hf > 1e-12)
    with mpmath.workdps(50):
        turns = mpmath.nint(mpmath.mpf(theta0) / (2 * mpmath.pi))
        red = mpmath.mpf(theta0) - 2 * mpmath.pi * turns
        shift = 2 * mpmath.pi * turns
    ref = mp_libration_state if hf < 1 else mp_rotation_state
    th, om = ref(red, omega, t, L, G, dps=50)
    th = float(th + shift)
    hist = swingcalc.swing_history(theta0, omega, [t], L, G)
    u = omega0 * abs(t) * math.sqrt(max(hf, 1.0))
    tol = 8 * u * EPS * (1 + hf / abs(1 - hf)) + math.ulp(abs(th) + 4 * math.pi) * 4 + 1e-13
    assert abs(hist.angle_rad[0] - th) <= tol, (hist.angle_rad[0], th)
    assert abs(hist.angular_velocity_rad_s[0] - float(om)) <= 2 * omega0 * tol * math.sqrt(
        max(hf, 1.0))
