"""The full integrator of the damped, driven swing, checked against results from outside
the code: the exact elliptic period, the textbook linear oscillator (free, viscous,
Coulomb, quadratic drag, forced, pushed) and energy conservation."""

import math
import os
import signal
import sys

import numpy as np
import pytest

from swingcalc import InvalidInput, period
from swingcalc.simulate import (
    HarmonicTorque,
    ImpulseDrive,
    PivotMotion,
    SwingModel,
    simulate,
)

G = 9.80665


def linear_oscillator(**kw):
    """I = 1 kg m^2, k = 100 N m/rad (omega_n = 10 rad/s), linear restoring torque."""
    return SwingModel(inertia=1.0, mass=1.0, com_distance=0.01, restoring_moment=100.0,
                      linear=True, **kw)


def test_damping_off_energy_drift_and_period_against_exact_elliptic_period():
    """1,000 periods at 0.5 rad with damping off (PRODUCT.md quality bar): energy drift at
    most 1e-9 relative, each measured period within 1e-9 of T = 4 sqrt(L/g) K(sin^2(A/2))
    (swingcalc.period, itself checked to 1e-14 against mpmath in test_period.py)."""
    m = SwingModel.simple(1.0, 1.0, G)
    r = simulate(m, 0.5, cycles=1000)
    assert r.success and len(r.cycles) == 1000
    drift = abs(r.energy.final_J - r.energy.initial_J) / r.energy.initial_J
    assert drift <= 1e-9
    exact = period(1.0, 0.5, G)
    assert np.max(np.abs(r.cycles["period_s"] - exact)) / exact <= 1e-9
    # amplitude stays the start angle (turning points located on each step's interpolant)
    assert np.max(np.abs(np.abs(r.cycles.turning_angle_rad) - 0.5)) <= 1e-9


def test_viscous_small_amplitude_log_decrement_and_q_of_linear_oscillator():
    """zeta = 0.01: delta = 2 pi zeta / sqrt(1 - zeta^2) = 0.0628349949001 and
    Q = 1/(2 zeta) = 50 (REFERENCES.md, any vibrations text; digits [calc]). The measured
    decrement comes from turning points one period apart; the interpolant's error there is
    about 1e-10 relative, so 1e-8 is a safe bound."""
    m = linear_oscillator().with_damping_ratio(0.01)
    r = simulate(m, 0.1, cycles=12)
    dec = r.cycles["log_decrement"][:-1]
    assert np.allclose(dec, 0.0628349949001, rtol=1e-8, atol=0)
    assert np.allclose(r.cycles["q"][:-1], 50.0, rtol=1e-8, atol=0)
    # ratio per cycle 0.939098416934 [calc]
    a = r.cycles["amplitude_positive_rad"]
    assert np.allclose(a[1:] / a[:-1], 0.939098416934, rtol=1e-8)
    assert r.energy.closure_rel <= 1e-8


def test_coulomb_friction_half_peaks_and_stop_in_dead_band():
    """m = 1 kg, k = 100 N/m, mu = 0.1 (F = mu m g_n), x0 = 0.1 m: half-peaks -0.0803867,
    0.0607734, -0.0411601, 0.0215468, -0.0019335 m, stops at t = 1.5707963 s
    (REFERENCES.md [calc], printed to 7 decimals, hence 5e-8), inside the dead band
    |x| <= F/k; amplitude falls 4F/k per cycle (textbook)."""
    F = 0.1 * 1.0 * G
    m = linear_oscillator(friction_torque=F)
    r = simulate(m, 0.1, duration=5.0)
    peaks = r.cycles.turning_angle_rad
    want = [-0.0803867, 0.0607734, -0.0411601, 0.0215468, -0.0019335]
    assert np.allclose(peaks, want, atol=5e-8, rtol=0)
    assert np.allclose(np.abs(peaks[:-2]) - np.abs(peaks[2:]), 4 * F / 100.0, rtol=1e-9)
    assert r.summary.at_rest and r.status == "at rest"
    assert abs(r.summary.rest_time_s - 1.5707963) <= 5e-8
    assert abs(r.summary.rest_angle_rad) <= F / 100.0
    assert r.energy.closure_rel <= 1e-8


def test_quadratic_drag_inverse_amplitude_grows_linearly_with_energy_balance_slope():
    """Torque -D w|w| on a linear oscillator: per cycle dE = (8/3) D w0^2 A^3 and
    E = I w0^2 A^2 / 2, so d(1/A)/dn = 8 D / (3 I) (energy balance, first order in
    D A / I = 1e-4 here, so the slope holds to a few 1e-4)."""
    D = 1e-3
    m = linear_oscillator(drag=D)
    r = simulate(m, 0.1, cycles=40)
    inv = 1.0 / r.cycles["amplitude_positive_rad"]
    n = np.arange(inv.size)
    slope, icpt = np.polyfit(n, inv, 1)
    assert slope == pytest.approx(8 * D / 3.0, rel=2e-3)
    assert np.max(np.abs(inv - (slope * n + icpt))) <= 1e-4 * inv.max()   # linear
    assert r.energy.closure_rel <= 1e-8
    assert r.energy.dissipated_J["drag"] > 0


def test_harmonic_forcing_far_from_resonance_steady_amplitude_is_analytic():
    """Linear oscillator, zeta = 0.1, torque 1 N m at r = 0.5: X = (T0/k) /
    sqrt((1 - r^2)^2 + (2 zeta r)^2) (REFERENCES.md, forced response). After 40 s the
    transient is e^-40 of the start, so the turning points are the steady amplitude to the
    integrator's accuracy (1e-8 leaves room)."""
    zeta, r_ = 0.1, 0.5
    m = linear_oscillator().with_damping_ratio(zeta)
    res = simulate(m, 0.0, duration=40.0, drives=[HarmonicTorque(1.0, 10.0 * r_)])
    X = 0.01 / math.sqrt((1 - r_ ** 2) ** 2 + (2 * zeta * r_) ** 2)
    assert res.summary.steady_amplitude_rad == pytest.approx(X, rel=1e-8)
    assert res.summary.settled
    assert res.energy.closure_rel <= 1e-8
    assert res.energy.supplied_J["torque_1"] > 0


def test_impulse_drive_steady_amplitude_against_energy_balance():
    """Linear oscillator with zeta = 0.01 and a push of dE at the bottom every beat. Between
    pushes x = (v/w_d) e^(-zeta w t) sin(w_d t): the next bottom comes at pi/w_d with speed
    v e^(-delta/2) (textbook damped oscillator), so in steady state
    v^2 = 2 dE / (I (1 - e^-delta)); the turning point is A = (v / w_n) e^(-zeta w t_m)
    with tan(w_d t_m) = w_d / (zeta w_n). Tolerance: interpolant and transient, 1e-8."""
    zeta, dE = 0.01, 1e-4
    m = linear_oscillator().with_damping_ratio(zeta)
    wn = 10.0
    wd = wn * math.sqrt(1 - zeta ** 2)
    delta = 2 * math.pi * zeta / math.sqrt(1 - zeta ** 2)
    v = math.sqrt(2 * dE / (1.0 * (1 - math.exp(-delta))))
    tm = math.atan2(wd, zeta * wn) / wd
    A = v / wn * math.exp(-zeta * wn * tm)
    r = simulate(m, A * 1.01, cycles=400, drives=[ImpulseDrive(0.0, energy=dE)])
    assert r.summary.steady_amplitude_rad == pytest.approx(A, rel=1e-8)
    assert r.summary.impulses >= 799
    assert r.energy.closure_rel <= 1e-8


def test_body_at_rest_at_the_bottom_stays_at_rest():
    """A zero right-hand side (PITFALLS.md, scipy #12308): the state must stay exactly at
    rest, with or without damping and friction."""
    for model in (SwingModel.simple(1.0), SwingModel.simple(1.0).with_q(50),
                  SwingModel.simple(1.0, pin_radius=0.002, friction=0.2)):
        r = simulate(model, 0.0, 0.0, duration=20.0)
        assert r.success
        assert np.all(r.history.angle_rad == 0.0)
        assert np.all(r.history.angular_velocity_rad_s == 0.0)
        assert len(r.cycles) == 0


def test_reaction_friction_stick_slip_stops_inside_static_band_and_budget_closes():
    """Pin friction mu_k rho |R| with the reaction solved exactly: the swing decays, stops
    where static friction holds it (|M sin theta| <= mu_s rho m g at rest, common practice
    statics), and the energy budget closes to 1e-8 (issue requirement)."""
    m = SwingModel.simple(1.0, 2.0, pin_radius=0.01, friction=0.15, static_friction=0.2)
    r = simulate(m, 0.2, duration=600.0)
    assert r.summary.at_rest
    th = r.summary.rest_angle_rad
    assert abs(m.restoring_moment * math.sin(th)) <= 0.2 * 0.01 * 2.0 * G
    # the last turning point before the stop was outside the band the one before
    assert r.energy.closure_rel <= 1e-8
    assert r.energy.dissipated_J["friction"] == pytest.approx(r.energy.initial_J
                                                               - r.energy.final_J, rel=1e-8)
    # the friction torque follows |R|: its peak is above mu_k rho m g (the bottom reaction
    # exceeds the weight)
    assert r.summary.peak_friction_torque_N_m > 0.15 * 0.01 * 2.0 * G


def test_friction_loss_per_cycle_is_about_four_mu_rho_m_g_amplitude():
    """Small amplitude, pin friction: |R| ~ m g, so the loss per cycle is close to
    4 mu rho m g A (work of a constant torque over 4A, textbook Coulomb); the reaction's
    swing terms add O(A^2)."""
    m = SwingModel.simple(1.0, 1.0, pin_radius=0.001, friction=0.1)
    r = simulate(m, 0.05, cycles=3)
    A = r.cycles["amplitude_rad"][0]
    lost = r.cycles["lost_friction_J"][0]
    assert lost == pytest.approx(4 * 0.1 * 0.001 * 1.0 * G * A, rel=5e-3)


def test_vertical_pivot_motion_parametric_resonance_grows_and_budget_closes():
    """Pivot driven vertically at twice the natural frequency: parametric resonance, the
    swing grows when the drive beats the damping (Mathieu instability, common practice);
    the work of the pivot closes the energy budget."""
    m = SwingModel.simple(1.0).with_q(200)
    w = 2 * m.small_angle_frequency
    r = simulate(m, 0.02, duration=60.0, drives=[PivotMotion("vertical", 0.02, w)])
    assert r.summary.final_amplitude_rad > 0.04
    assert r.energy.supplied_J["pivot_1"] > 0
    assert r.energy.closure_rel <= 1e-8


def test_interrupt_keeps_what_was_computed():
    """Ctrl-C (SIGINT) stops the run at its next step: success is False, the message says
    it was interrupted, and the cycles so far are kept."""
    calls = []

    def progress(t, t_end, done, wanted):
        calls.append(t)
        if len(calls) == 1:
            os.kill(os.getpid(), signal.SIGINT)

    m = SwingModel.simple(1.0).with_q(1e4)
    r = simulate(m, 0.1, duration=1e6, progress=progress)
    assert not r.success and r.status == "interrupted"
    assert "interrupted" in r.message
    assert 0 < len(r.cycles) < 1e6 / 2
    assert r.summary.duration_s < 1e6


def test_rate_error_against_target_period():
    """Rate = (target / period - 1) x 86400 s/day: with the target equal to the exact period
    the rate is zero (to the period's 1e-9), with the small-angle target it is the
    circular error (T0/T - 1) x 86400 [definition]."""
    m = SwingModel.simple(0.994)
    T = period(0.994, 0.05, G)
    r = simulate(m, 0.05, cycles=3, target_period=T)
    assert np.max(np.abs(r.cycles["rate_s_per_day"])) <= 1e-9 * 86400
    r0 = simulate(m, 0.05, cycles=3)
    want = (m.small_angle_period / T - 1) * 86400
    assert np.allclose(r0.cycles["rate_s_per_day"], want, atol=1e-9 * 86400)


def test_decay_time_and_cycles_to_half_amplitude_linear_viscous():
    """Linear viscous decay A(t) = A0 e^(-zeta w t) at the turning points (textbook):
    half amplitude after ln 2 / (zeta w) s, i.e. ln 2 / delta cycles. Interpolated between
    half-peaks, so within a fraction of a half period."""
    zeta = 0.02
    m = linear_oscillator().with_damping_ratio(zeta)
    r = simulate(m, 0.1, cycles=20, decay_fraction=0.5)
    t_half = math.log(2) / (zeta * 10.0)
    assert r.summary.decay_time_s == pytest.approx(t_half, abs=0.05 * math.pi / 10)
    delta = 2 * math.pi * zeta / math.sqrt(1 - zeta ** 2)
    assert r.summary.decay_cycles == pytest.approx(math.log(2) / delta, abs=0.1)


def test_bad_inputs_name_the_field():
    with pytest.raises(InvalidInput, match="inertia"):
        SwingModel(inertia=0.5, mass=1.0, com_distance=1.0)
    with pytest.raises(InvalidInput, match="pin_radius"):
        SwingModel.simple(1.0, friction=0.1)
    with pytest.raises(InvalidInput, match="static_friction"):
        SwingModel.simple(1.0, pin_radius=0.01, friction=0.2, static_friction=0.1)
    with pytest.raises(InvalidInput, match="duration"):
        simulate(SwingModel.simple(1.0), 0.1)
    with pytest.raises(InvalidInput, match="impulse"):
        ImpulseDrive(0.0)
    with pytest.raises(InvalidInput, match="pivot axis"):
        PivotMotion("sideways", 0.1, 1.0)
    with pytest.raises(InvalidInput, match="angle"):
        simulate(SwingModel.simple(1.0), float("nan"), duration=1.0)


def test_result_to_dict_is_json_ready():
    import json

    r = simulate(SwingModel.simple(1.0).with_q(100), 0.1, cycles=3,
                 drives=[ImpulseDrive(0.0, energy=1e-4)])
    text = json.dumps(r.to_dict(), allow_nan=True)
    assert "cycles" in text and "energy" in text


def test_model_from_a_design_carries_its_body_air_and_pivot():
    """The bundled gate arm (a pin pivot, air on): the model's inertia, restoring moment
    and drag are the compound pendulum's, its friction the pin's; the small-angle period
    is the design's (plumbing check: both sides come from the library)."""
    from swingcalc import examples
    from swingcalc.designfile import parse_design
    from swingcalc.simulate import SwingModel

    d = parse_design(examples.text("gate_arm.toml"))
    m = SwingModel.from_pendulum(d.pendulum, d.pivot)
    assert m.inertia == d.pendulum.inertia_kg_m2
    assert m.restoring_moment == d.pendulum.restoring_moment_N_m
    assert m.drag == d.pendulum.air.drag_coefficient_N_m_s2 > 0
    assert m.pin_radius == d.pivot.pin_radius and m.friction == d.pivot.friction_coefficient
    assert m.static_friction == d.pivot.static_friction_coefficient
    assert m.small_angle_period == pytest.approx(d.pendulum.small_angle_period_s, rel=1e-15)


def test_loss_q_under_a_drive_is_the_damping_q_not_the_decrement_one():
    """A viscously damped pendulum (Q = 1/(2 zeta) = 300 at small amplitude, any
    vibrations text) kept swinging near 1 deg by a push each beat: the measured decrement
    means nothing there (the pushes undo it), but 2 pi E / (energy lost per cycle) is the
    damping's Q. At 1 deg the pendulum's nonlinearity moves it by ~A^2/16 ~ 2e-5 and the
    run has not fully settled in 400 cycles; 1 % covers both."""
    m = SwingModel.simple(1.0, 1.0).with_q(300)
    e_push = 0.5 * (2 * math.pi * 9.80665 * (1 - math.cos(math.radians(1))) / 300)
    r = simulate(m, math.radians(1), cycles=400, drives=[ImpulseDrive(0.0, energy=e_push)])
    assert r.summary.loss_q_last == pytest.approx(300, rel=1e-2)


def test_a_start_next_to_the_separatrix_is_warned_about():
    """At A = pi - 1e-6 the period is 4 K(m)/w0 with 1 - m = 2.5e-13 and it depends on
    ln(1/(1 - m)) (DLMF 19.12.1 [mem: number]): the integrator's energy error of ~rtol
    moves it by percent, so the run must say so; at 1 rad it must not."""
    near = simulate(SwingModel.simple(1.0, 1.0), math.pi - 1e-6, cycles=1)
    assert any("separatrix" in w for w in near.warnings)
    assert simulate(SwingModel.simple(1.0, 1.0), 1.0, cycles=1).warnings == ()


# --- the vectorised event pass against the one-bracket-at-a-time path ---------------------
# These compare two code paths of the integrator (the fast path must reproduce the path it
# replaces); the outside anchors of the results themselves are the tests above.

def _run_both(monkeypatch, *args, **kw):
    """The run with the vectorised pass (checked to be used), with it in small chunks during
    the run, and without it."""
    run_cls = sys.modules["swingcalc.simulate"]._Run
    batch = run_cls._batch
    used = []

    def counted(self, brackets, s, **kw):
        used.append(len(brackets))
        return batch(self, brackets, s, **kw)

    monkeypatch.setattr(run_cls, "_batch", counted)
    fast = simulate(*args, **kw)
    assert used and max(used) >= run_cls._BATCH_MIN
    # located in chunks while the stepper runs (as long runs are)
    used.clear()
    monkeypatch.setattr(run_cls, "_FLUSH", 16)
    chunked = simulate(*args, **kw)
    assert used.count(16) >= 2
    monkeypatch.setattr(run_cls, "batch_events", False)
    slow = simulate(*args, **kw)
    monkeypatch.undo()
    return fast, chunked, slow


def _assert_same(fast, slow, rel):
    assert fast.status == slow.status and len(fast.cycles) == len(slow.cycles)
    for key, col in slow.cycles.columns.items():
        got = np.asarray(fast.cycles[key], dtype=float)
        want = np.asarray(col, dtype=float)
        assert np.array_equal(np.isnan(got), np.isnan(want)), key
        ok = ~np.isnan(want)
        scale = max(np.max(np.abs(want[ok]), initial=0.0), 1e-300)
        assert np.max(np.abs(got[ok] - want[ok]), initial=0.0) <= rel * scale, key
    for a, b in ((fast.cycles.turning_time_s, slow.cycles.turning_time_s),
                 (fast.cycles.turning_angle_rad, slow.cycles.turning_angle_rad)):
        assert a.shape == b.shape
        assert np.max(np.abs(a - b), initial=0.0) <= rel * np.max(np.abs(b), initial=1e-300)
    assert fast.energy.final_J == pytest.approx(slow.energy.final_J, rel=rel)
    assert fast.energy.closure_rel <= 1e-8


@pytest.mark.parametrize("case", ["free", "damped", "linear_drag", "driven", "over_top",
                                  "stop"])
def test_vectorised_event_pass_matches_the_one_by_one_path(monkeypatch, case):
    """Both paths build the same quintic Hermite interpolant of each bracket and solve it
    for its root (Newton in the bracket vs the Illinois method, both to the last bits of
    x), so the events agree to rounding: 1e-12 of each column's scale leaves room for the
    difference of a few ulps in the roots, amplified up to ~1e3 in the decrement and Q
    (a ratio of two nearly equal amplitudes)."""
    cases = {
        "free": ((SwingModel.simple(1.0, 1.0, G), 0.5), {"cycles": 60}),
        "damped": ((SwingModel.simple(1.0, 1.0, drag=1e-4).with_q(2000), 0.5),
                   {"cycles": 60, "rtol": 1e-10}),
        "linear_drag": ((linear_oscillator(drag=1e-3), 0.1), {"cycles": 20}),
        "driven": ((linear_oscillator().with_damping_ratio(0.1), 0.0),
                   {"duration": 20.0, "drives": [HarmonicTorque(1.0, 5.0)]}),
        "over_top": ((SwingModel.simple(1.0).with_q(40), 0.0, 7.0), {"duration": 30.0}),
        "stop": ((SwingModel.simple(1.0).with_q(30), 0.3),
                 {"duration": 500.0, "stop_amplitude": 0.05}),
    }
    args, kw = cases[case]
    fast, chunked, slow = _run_both(monkeypatch, *args, **kw)
    _assert_same(fast, slow, 1e-12)
    _assert_same(chunked, slow, 1e-12)


def test_array_right_hand_side_matches_the_scalar_one():
    """make_rhs_array is make_rhs elementwise, for every mechanism and both sliding
    directions (same formulas, same order: equal to rounding, 4 ulp allowed)."""
    from swingcalc.kernels import dynamics as k

    models = [
        (SwingModel.simple(1.0), ()),
        (SwingModel.simple(1.0).with_q(100), ()),
        (SwingModel.simple(1.0, drag=1e-3).with_q(100), ()),
        (linear_oscillator(drag=1e-3), ()),
        (SwingModel.simple(1.0, pin_radius=0.01, friction=0.2).with_q(50),
         (HarmonicTorque(0.3, 2.0, 0.4), PivotMotion("vertical", 0.01, 6.0),
          PivotMotion("horizontal", 0.02, 3.0, 1.0))),
        (linear_oscillator(friction_torque=0.2), (HarmonicTorque(1.0, 5.0),)),
    ]
    rng = np.random.default_rng(7)
    sim = sys.modules["swingcalc.simulate"]
    for model, drives in models:
        p = sim._params(model, drives, 0.37)
        n = 2 + len(k.ledger_names(p))
        t = rng.uniform(0.0, 50.0, 40)
        Y = rng.uniform(-2.0, 2.0, (n, 40))
        for s in (1.0, -1.0):
            scalar = k.make_rhs(p, s, np.zeros(n))
            want = np.array([scalar(t[i], Y[:, i].copy()).copy() for i in range(40)]).T
            got = k.make_rhs_array(p, s)(t, Y)
            assert np.allclose(got, want, rtol=4 * 2.2e-16, atol=4 * 2.2e-16 * np.abs(want).max())


def test_find_roots_against_numpy_polynomial_roots():
    """Roots of random quintics with a sign change on [0, 1] against numpy.roots (the
    companion-matrix eigenvalues, a general-purpose reference): 1e-12 covers the
    eigenvalue solver's own error on these well-separated simple roots."""
    from swingcalc.kernels import dynamics as k

    rng = np.random.default_rng(3)
    coef = rng.normal(size=(6, 400))
    coef[1] += 4.0 * np.sign(coef[1])              # mostly monotone, as in a step
    f0 = coef[0]
    f1 = coef.sum(axis=0)
    keep = (f0 > 0) != (f1 > 0)
    c = coef[:, keep]

    def fun(x):
        return c[0] + x * (c[1] + x * (c[2] + x * (c[3] + x * (c[4] + x * c[5]))))

    def slope(x):
        return c[1] + x * (2 * c[2] + x * (3 * c[3] + x * (4 * c[4] + x * 5 * c[5])))

    x = k.find_roots(fun, slope, c[0], c.sum(axis=0))
    assert np.all((x >= 0.0) & (x <= 1.0))
    for i in range(c.shape[1]):
        r = np.roots(c[::-1, i])
        r = r[np.abs(r.imag) < 1e-9].real
        r = r[(r >= -1e-12) & (r <= 1 + 1e-12)]
        assert np.min(np.abs(r - x[i])) <= 1e-12
