"""The small-angle (linear) model's errors, bounds and inverse (swingcalc.linear).

Error convention (linear.py): the relative error of an approximation X_approx of the exact
X is (X_approx - X) / X, so the small-angle period's error is negative. References are
hand formulas evaluated in mpmath at exactly the float amplitude, with the working
precision raised by the digits each subtraction cancels; relative tolerances are stated
per test (a handful of ulp where the library avoids cancellation).
"""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest

import swingcalc

from helpers import EPS

AMPLITUDES = [1e-30, 1e-12, 1e-6, 1e-3, 0.05, 0.3, 0.49, 0.5, 0.51, 1.0, 1.5, 2.0, 2.5, 3.0,
              math.pi - 1e-6, math.pi - 1e-12]

# OEIS A223067 / A223068 (REFERENCES.md [pub]): T/T0 = 1 + A^2/16 + 11A^4/3072 + 173A^6/737280
SERIES = [mpmath.mpf(1), mpmath.mpf(1) / 16, mpmath.mpf(11) / 3072, mpmath.mpf(173) / 737280]


def _dps_for(a, power):
    """Digits to keep a quantity of size ~ a^power after cancelling against 1."""
    return 60 + max(0, int(-power * math.log10(a)) + 5)


def _mp_ratio(a):
    am = mpmath.mpf(a)
    return 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(am / 2) ** 2)


def _normal(x) -> bool:
    return abs(x) >= 2.3e-308


@pytest.mark.parametrize("a", AMPLITUDES)
def test_small_angle_period_error_against_mpmath(a):
    """(T0 - T)/T = 1/(T/T0) - 1, mpmath; 1e-15 relative (the library forms -e/(1 + e)
    from the accurate excess e, three roundings)."""
    with mpmath.workdps(_dps_for(a, 2)):
        ref = 1 / _mp_ratio(a) - 1
    got = swingcalc.small_angle_period_error(a)
    assert got < 0.0
    assert got == pytest.approx(float(ref), rel=1e-15)


@pytest.mark.parametrize("terms", [2, 3, 4])
@pytest.mark.parametrize("a", AMPLITUDES)
def test_series_period_error_against_mpmath(a, terms):
    """(S_n - T/T0) / (T/T0) for the n-term amplitude series, coefficients from OEIS
    A223067/A223068 (not from the library), mpmath at the cancelled digits plus 60.

    The error is ~ -a_n A^(2n) at small A, so it must keep relative accuracy there;
    tolerance 1e-14 relative (the library sums the series tail below A = 0.5; above,
    the head minus the excess cancels by at most a factor ~10 at 0.5 rad, costing
    ~1 digit of the 1e-15 excess). Cases where the true value underflows are skipped.
    """
    with mpmath.workdps(_dps_for(a, 2 * terms)):
        am = mpmath.mpf(a)
        r = _mp_ratio(a)
        s = sum(SERIES[j] * am ** (2 * j) for j in range(terms))
        ref = (s - r) / r
    if not _normal(float(ref)):
        pytest.skip("true value below the float range")
    got = swingcalc.series_period_error(a, terms)
    assert got <= 0.0  # every coefficient is positive: a truncated series is short
    assert got == pytest.approx(float(ref), rel=1e-14)


def test_series_period_ratio_values():
    """n-term series at 1 rad from the published coefficients, 2 ulp."""
    a = 1.0
    for terms in (2, 3, 4):
        expected = float(sum(SERIES[j] for j in range(terms)))
        assert swingcalc.series_period_ratio(a, terms) == pytest.approx(expected, rel=2 * EPS)


@pytest.mark.parametrize("a", AMPLITUDES + [1e-150])
def test_peak_speed_error_against_mpmath(a):
    """Linear model's peak angular speed omega0 A vs the exact 2 omega0 sin(A/2) (energy
    conservation, REFERENCES.md "Flexible suspensions" setting): error (A/2)/sin(A/2) - 1
    > 0, ~ A^2/24 at small A. 1e-15 relative wherever the true value is a normal float
    (at 1e-150 rad it is 4.2e-302)."""
    with mpmath.workdps(_dps_for(a, 2)):
        am = mpmath.mpf(a)
        ref = (am / 2) / mpmath.sin(am / 2) - 1
    got = swingcalc.peak_speed_error(a)
    assert got > 0.0
    assert got == pytest.approx(float(ref), rel=1e-15)


@pytest.mark.parametrize("a", AMPLITUDES)
def test_peak_tension_error_against_mpmath(a):
    """Exact peak tension m g (3 - 2 cos A) (REFERENCES.md "Flexible suspensions" [mem:
    standard mechanics]); the linear model's m g (1 + A^2) (its own peak speed, as
    linear.py documents). Error (1 + A^2)/(3 - 2 cos A) - 1 ~ A^4/12; 1e-15 relative."""
    with mpmath.workdps(_dps_for(a, 4)):
        am = mpmath.mpf(a)
        ref = (1 + am ** 2) / (3 - 2 * mpmath.cos(am)) - 1
    if not _normal(float(ref)):
        pytest.skip("true value below the float range")
    got = swingcalc.peak_tension_error(a)
    assert got == pytest.approx(float(ref), rel=1e-15)


def test_peak_errors_zero_at_rest():
    assert swingcalc.peak_speed_error(0.0) == 0.0
    assert swingcalc.peak_tension_error(0.0) == 0.0
    assert swingcalc.small_angle_period_error(0.0) == 0.0


@pytest.mark.parametrize("a, cycles", [(1e-6, 1.0), (0.1, 86400.0), (1.0, 3.5), (3.0, 0.0)])
def test_phase_error_is_two_pi_n_times_excess(a, cycles):
    """After N exact periods (time N T) the linear model has done N T/T0 cycles: it leads
    by 2 pi N (T/T0 - 1) rad (hand derivation); mpmath, 1e-15 relative."""
    with mpmath.workdps(_dps_for(a, 2)):
        ref = 2 * mpmath.pi * cycles * (_mp_ratio(a) - 1)
    assert swingcalc.phase_error(a, cycles) == pytest.approx(float(ref), rel=1e-15)


def test_clock_rate_error_against_mpmath_and_circular_error_rule():
    """A clock regulated on T0 but swinging at A loses 86400 (T - T0)/T s/day (each beat
    takes T instead of T0). mpmath at several amplitudes (1e-15 relative); and the
    clockmakers' circular-error rule of thumb, loss ~ 86400 A^2/16 s/day (common
    practice, the first series term), which at 3 deg gives 14.8 s/day: within 0.1 %
    (the next term is ~ (11/192 - 1/16) A^2 relative)."""
    for a in (1e-4, math.radians(3), 0.5, 2.0):
        with mpmath.workdps(_dps_for(a, 2)):
            r = _mp_ratio(a)
            ref = -86400 * (r - 1) / r
        assert swingcalc.clock_rate_error(a) == pytest.approx(float(ref), rel=1e-15)
    a = math.radians(3)
    rule = 86400 * a * a / 16
    assert -swingcalc.clock_rate_error(a) == pytest.approx(rule, rel=1e-3)


def test_max_amplitude_inverse_of_small_angle_period_error():
    """max_amplitude_for_period_error(tol) is where |small_angle_period_error| = tol
    (exact definition), for tol from 1e-10 to 0.5; 1e-13 relative (well conditioned:
    the error is ~ -A^2/16)."""
    for tol in (1e-10, 1e-6, 1e-3, 0.01, 0.1, 0.5):
        a = swingcalc.max_amplitude_for_period_error(tol)
        with mpmath.workdps(_dps_for(a, 2)):
            err = 1 / _mp_ratio(a) - 1
        assert float(-err) == pytest.approx(tol, rel=1e-13)
    tols = np.array([1e-3, 1e-2])
    got = swingcalc.max_amplitude_for_period_error(tols)
    assert got.shape == (2,)


def test_small_angle_check_fields_match_independent_values():
    """small_angle_check at 20 deg, tolerance 1 %: every field vs mpmath hand formulas,
    acceptable since 20 deg < 22.93 deg (REFERENCES.md, 1 % of T), and not at 25 deg."""
    a = math.radians(20)
    chk = swingcalc.small_angle_check(a, tolerance=0.01, cycles=1000.0)
    with mpmath.workdps(60):
        am = mpmath.mpf(a)
        r = _mp_ratio(a)
        lower = 1 + mpmath.sin(am / 2) ** 2 / 4
        k2 = mpmath.sin(am / 2) ** 2
        upper = (4 - 3 * k2) / (4 - 4 * k2)
    assert chk.amplitude_rad == a and chk.tolerance_rel == 0.01
    assert chk.period_ratio == pytest.approx(float(r), rel=1e-15)
    assert chk.period_error_rel == pytest.approx(float(1 / r - 1), rel=1e-15)
    for n in (2, 3, 4):
        with mpmath.workdps(60):
            s = sum(SERIES[j] * am ** (2 * j) for j in range(n))
            ref = (s - r) / r
        assert chk.series_error_rel[n] == pytest.approx(float(ref), rel=1e-14)
    assert chk.bounds[0] == pytest.approx(float(lower), rel=4 * EPS)
    assert chk.bounds[1] == pytest.approx(float(upper), rel=4 * EPS)
    assert chk.bounds[0] <= chk.period_ratio <= chk.bounds[1]
    assert chk.phase_error_rad == pytest.approx(float(2 * mpmath.pi * 1000 * (r - 1)), rel=1e-15)
    assert chk.clock_rate_s_per_day == pytest.approx(float(-86400 * (r - 1) / r), rel=1e-15)
    assert math.degrees(chk.max_amplitude_rad) == pytest.approx(22.9277266306748, rel=5e-15)
    assert chk.acceptable is True
    assert chk.peak_speed_error_rel == pytest.approx(
        float((am / 2) / mpmath.sin(am / 2) - 1), rel=1e-15)
    assert chk.peak_tension_error_rel == pytest.approx(
        float((1 + am ** 2) / (3 - 2 * mpmath.cos(am)) - 1), rel=1e-15)
    assert swingcalc.small_angle_check(math.radians(25), tolerance=0.01).acceptable is False
    d = chk.to_dict()
    assert d["series_error_rel"]["3_terms"] == chk.series_error_rel[3]
    assert d["bounds"] == {"lower": chk.bounds[0], "upper": chk.bounds[1]}


# --- Bad input ----------------------------------------------------------------------------

@pytest.mark.parametrize("call, field", [
    (lambda: swingcalc.small_angle_period_error(float("nan")), "amplitude"),
    (lambda: swingcalc.small_angle_period_error(math.pi), "amplitude"),
    (lambda: swingcalc.series_period_error(-0.1, 3), "amplitude"),
    (lambda: swingcalc.series_period_error(0.1, 5), "terms"),
    (lambda: swingcalc.series_period_ratio(0.1, 1), "terms"),
    (lambda: swingcalc.period_ratio_bounds(0.1, method="taylor"), "method"),
    (lambda: swingcalc.period_ratio_bounds(float("inf")), "amplitude"),
    (lambda: swingcalc.peak_speed_error(4.0), "amplitude"),
    (lambda: swingcalc.peak_tension_error([0.1, float("nan")]), "amplitude"),
    (lambda: swingcalc.phase_error(0.1, -1.0), "cycles"),
    (lambda: swingcalc.phase_error(0.1, float("inf")), "cycles"),
    (lambda: swingcalc.clock_rate_error("ten degrees"), "amplitude"),
    (lambda: swingcalc.max_amplitude_for_period_error(0.0), "tolerance"),
    (lambda: swingcalc.max_amplitude_for_period_error(1.0), "tolerance"),
    (lambda: swingcalc.max_amplitude_for_period_error(0.01, relative_to="T"), "relative_to"),
    (lambda: swingcalc.small_angle_check(0.1, tolerance=float("nan")), "tolerance"),
    (lambda: swingcalc.small_angle_check([0.1, 0.2]), "amplitude"),
])
def test_bad_input_raises_invalid_input_naming_the_field(call, field):
    """Bad input raises InvalidInput (a ValueError) whose message starts with the field."""
    with pytest.raises(swingcalc.InvalidInput) as info:
        call()
    assert isinstance(info.value, ValueError)
    assert info.value.field == field
    assert str(info.value).startswith(field)


def test_tolerance_beyond_the_largest_reachable_error_is_refused_by_name():
    """No amplitude below 180 deg has a small-angle error above e/(1 + e), e = T/T0 - 1 at
    the largest float amplitude (22.67, from mpmath in test_period.py): a tolerance of 0.99
    is refused as a tolerance, not as a 'period ratio' the caller never gave."""
    top = swingcalc.max_period_error_tolerance()
    with mpmath.workdps(50):
        a_max = mpmath.mpf(math.nextafter(math.pi, 0.0))
        e = 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(a_max / 2) ** 2) - 1
        expected = float(e / (1 + e))
    assert top == pytest.approx(expected, rel=1e-14)
    for call in (lambda: swingcalc.small_angle_check(0.1, tolerance=0.99),
                 lambda: swingcalc.max_amplitude_for_period_error(0.99)):
        with pytest.raises(swingcalc.InvalidInput, match="^tolerance"):
            call()
    assert swingcalc.max_amplitude_for_period_error(top) == pytest.approx(
        math.nextafter(math.pi, 0.0), abs=4e-16)
