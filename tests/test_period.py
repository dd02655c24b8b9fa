"""Period of the simple pendulum in libration and rotation, and its inverse.

Conventions: T0 = 2 pi sqrt(L/g); T/T0 = (2/pi) K(m), m = k^2 = sin^2(A/2) (A&S 17.2,
DLMF 19.2.8); excess = T/T0 - 1. References are mpmath at 50 digits stored in
tests/fixtures/references.json (tests/fixtures/make_references.py), evaluated at exactly
the float inputs, and the REFERENCES.md tables.
"""

from __future__ import annotations

import math
from fractions import Fraction

import mpmath
import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import swingcalc
from swingcalc.kernels.swing import theta_series_coefficients

from helpers import EPS, mp_period_ratio, period_cases, references, rel

# Largest float amplitude the library accepts (math.pi itself is rejected as >= pi).
A_MAX = math.nextafter(math.pi, 0.0)


# --- Accuracy against the 50-digit fixture ------------------------------------------------

def test_period_ratio_within_1e15_of_50_digit_mpmath_everywhere():
    """T/T0 over 352 amplitudes in [0, pi), incl. tiny ones and the last floats below pi,
    against the mpmath fixture. Issue 2 target: 1e-15 relative (4.5 ulp). The input is
    exact, so no conditioning enters; measured worst 1.25 ulp."""
    cases = period_cases()
    a = np.array([c[0] for c in cases])
    got = swingcalc.period_ratio(a)
    assert isinstance(got, np.ndarray) and got.shape == a.shape
    worst = max(rel(g, ref) for g, (_, ref, _) in zip(got, cases))
    assert worst <= 1e-15, worst


def test_period_ratio_scalar_gives_float_equal_to_array_element():
    """Scalars in give Python floats out, with the same value as the array path."""
    for a, ref, _ in period_cases()[::7]:
        got = swingcalc.period_ratio(a)
        assert type(got) is float
        assert rel(got, ref) <= 1e-15
        assert got == pytest.approx(float(swingcalc.period_ratio(np.array([a]))[0]), rel=2 * EPS)


def test_period_excess_relative_accuracy_incl_tiny_amplitudes():
    """T/T0 - 1 against the fixture's 2F1 - 1 (DLMF 19.5.1) for every nonzero amplitude,
    down to 1e-150 rad (excess 6e-302), where period_ratio - 1 has no digits left.
    Target ~1e-14 relative (the series sum has ~20 terms, each rounding once); measured
    about 1e-15."""
    cases = [c for c in period_cases() if c[0] > 0.0]
    a = np.array([c[0] for c in cases])
    got = swingcalc.period_excess(a)
    worst = max(rel(g, ex) for g, (_, _, ex) in zip(got, cases))
    assert worst <= 1e-14, worst
    assert swingcalc.period_excess(0.0) == 0.0


def test_direct_form_would_fail_near_pi_so_the_fixture_is_discriminating():
    """Guard on the test itself: K(sin^2(A/2)) from m loses digits near pi (PITFALLS.md),
    so the 1e-15 check above can fail. scipy.special.ellipk(m) at A = pi - 1e-9 is off by
    more than 1e-10 relative."""
    from scipy import special

    a = math.pi - 1e-9
    direct = 2 / math.pi * special.ellipk(math.sin(a / 2) ** 2)
    assert rel(direct, mp_period_ratio(a)) > 1e-10


# --- Published values ---------------------------------------------------------------------

T_TABLE = [(10, 1.00190718814321661), (30, 1.01740879759595601), (60, 1.07318200714936438),
           (90, 1.18034059901609623), (120, 1.37288050061835016), (150, 1.76220372950375603),
           (170, 2.43936271967388406), (179, 3.90106516038908573)]


@pytest.mark.parametrize("deg, expected", T_TABLE)
def test_period_ratio_table_in_degrees(deg, expected):
    """REFERENCES.md T/T0 table [calc, 18 digits] at A = radians(deg).

    The table is at the exact angle; math.radians rounds it by up to 1/2 ulp, which moves
    T/T0 by cond * eps/2 with cond = A (dT/dA) / T (3.2e-15 relative at 179 deg). Tolerance:
    4.5 ulp (issue target) plus that conditioning, computed from mpmath.
    """
    a = math.radians(deg)
    with mpmath.workdps(30):
        f = lambda x: mpmath.log(2 / mpmath.pi * mpmath.ellipk(mpmath.sin(x / 2) ** 2))
        cond = float(abs(mpmath.diff(f, mpmath.mpf(a)) * a))
    assert swingcalc.period_ratio(a) == pytest.approx(expected, rel=1e-15 + cond * EPS)


@pytest.mark.parametrize("delta", [1e-3, 1e-5, 1e-7, 1e-9, 1e-12, 1e-15])
def test_period_ratio_near_180_logarithmic_asymptote(delta):
    """T/T0 ~ (2/pi) ln(8/(pi - A)) (REFERENCES.md; from K ~ ln(4/k'), DLMF 19.12.1).

    Next term: with k' = cos(A/2) ~ d/2, d = pi - A, K = ln(4/k') + (k'^2/4)(ln(4/k') - 1)
    + ... and ln(4/k') = ln(8/d) + d^2/24 + ..., so the difference is about
    (2/pi)(d^2/16) ln(8/d); the test allows twice that plus 4 ulp. d is taken in mpmath
    as pi - mpf(A) (math.pi is 1.2e-16 below pi, which matters at d = 1e-9).
    """
    a = math.pi - delta
    with mpmath.workdps(30):
        d = mpmath.pi - mpmath.mpf(a)
        asym = float(2 / mpmath.pi * mpmath.log(8 / d))
        bound = float(2 * (2 / mpmath.pi) * d ** 2 / 16 * mpmath.log(8 / d))
    got = swingcalc.period_ratio(a)
    assert abs(got - asym) <= bound + 4 * EPS * asym


def test_period_ratio_young_freedman_14_51():
    """Young & Freedman, University Physics 14th ed., problem 14.51 [pub: setup]: L = 2.00 m,
    30 deg, g = 9.80: small-angle 2.8384538 s, exact 2.8878679 s (REFERENCES.md [calc],
    7 decimals: tolerance 5e-8 s, half a unit in the last printed place)."""
    a = math.radians(30)
    assert swingcalc.small_angle_period(2.0, 9.80) == pytest.approx(2.8384538, abs=5e-8)
    assert swingcalc.period(2.0, a, 9.80) == pytest.approx(2.8878679, abs=5e-8)


def test_three_term_series_conventions_young_freedman_14_51():
    """The "three-term series" 2.8877800 s of REFERENCES.md is the k-series
    1 + k^2/4 + 9k^4/64 (A&S 17.3.11); swingcalc's series is in the amplitude,
    1 + A^2/16 + 11 A^4/3072 (OEIS A223067/A223068), whose 3-term value at 30 deg is
    closer to the exact 2.8878679 s: its next term 173 A^6/737280 is 4.8e-6 relative."""
    a = math.radians(30)
    t0 = 2 * math.pi * math.sqrt(2.0 / 9.80)
    k2 = math.sin(a / 2) ** 2
    assert t0 * (1 + k2 / 4 + 9 * k2 * k2 / 64) == pytest.approx(2.8877800, abs=5e-8)
    series3 = swingcalc.small_angle_period(2.0, 9.80) * swingcalc.series_period_ratio(a, 3)
    expected = t0 * (1 + a * a / 16 + 11 * a ** 4 / 3072)
    assert series3 == pytest.approx(expected, rel=4 * EPS)
    assert abs(series3 - 2.8878679) < 2e-5 < abs(2.8877800 - 2.8878679)


def test_lima_arun_approximation_error_at_90_deg():
    """-ln(a)/(1 - a), a = cos(A/2) (Lima & Arun, Am. J. Phys. 74, 892 (2006) [pub]) is
    +0.2487 % above the exact T/T0 at 90 deg (REFERENCES.md [calc], 4 digits: 5e-7)."""
    a = math.cos(math.pi / 4)
    approx = -math.log(a) / (1 - a)
    err = approx / swingcalc.period_ratio(math.pi / 2) - 1
    assert err == pytest.approx(0.002487, abs=5e-7)


def test_seconds_pendulum_length_g_over_pi_squared():
    """T = 2 s at L = g/pi^2 = 0.993621385566 m at g_n (REFERENCES.md [calc, 12 digits]:
    T0 within 2e-12 s); and the small-angle period scales as sqrt(L)."""
    g = swingcalc.STANDARD_GRAVITY
    assert g == 9.80665  # g_n, exact by definition (3rd CGPM 1901; NIST SP 330)
    assert swingcalc.small_angle_period(0.993621385566, g) == pytest.approx(2.0, abs=2e-12)
    assert swingcalc.small_angle_period(g / math.pi ** 2, g) == pytest.approx(2.0, rel=4 * EPS)
    assert swingcalc.small_angle_period(4 * 0.993621385566, g) == pytest.approx(4.0, abs=4e-12)
    assert swingcalc.natural_angular_frequency(0.993621385566, g) == pytest.approx(math.pi,
                                                                                   rel=1e-12)


# --- Series coefficients ------------------------------------------------------------------

def test_theta_series_first_coefficients_are_oeis_a223067_over_a223068():
    """1, 1/16, 11/3072, 173/737280, 22931/1321205760 (OEIS A223067 numerators, A223068
    denominators, REFERENCES.md [pub]); the 6th and 7th, 1319183/951268147200 and
    233526463/2009078326886400, are from memory [mem] and agree with mpmath below."""
    expected = [Fraction(1), Fraction(1, 16), Fraction(11, 3072), Fraction(173, 737280),
                Fraction(22931, 1321205760), Fraction(1319183, 951268147200),
                Fraction(233526463, 2009078326886400)]
    assert list(theta_series_coefficients(7)) == expected


def test_theta_series_coefficients_match_mpmath_taylor_of_exact_ratio():
    """a_j = [A^(2j)] of (2/pi) K(sin^2(A/2)), by mpmath.taylor at 60 digits (numerical
    differentiation in extended precision: 1e-40 relative is far above its error and far
    below the spacing of these rationals), j up to 11; odd coefficients vanish."""
    coef = theta_series_coefficients(12)
    with mpmath.workdps(60):
        f = lambda x: 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(x / 2) ** 2)
        t = mpmath.taylor(f, 0, 23)
        for j in range(12):
            exact = mpmath.mpf(coef[j].numerator) / coef[j].denominator
            assert abs(t[2 * j] - exact) <= mpmath.mpf(10) ** -40 * exact
            assert abs(t[2 * j + 1]) <= mpmath.mpf(10) ** -40


def test_k_series_abramowitz_stegun_17_3_11():
    """(2/pi) K(m) = sum [(2n)!/(4^n n!^2)]^2 m^n = 1 + m/4 + 9m^2/64 + 25m^3/256 + ...
    (A&S 17.3.11 [mem: number]); the coefficients are checked against mpmath.taylor, and
    period_excess at small m against the series summed in mpmath (1e-14 relative, the
    period_excess target)."""
    with mpmath.workdps(50):
        t = mpmath.taylor(lambda m: 2 / mpmath.pi * mpmath.ellipk(m), 0, 6)
        for n in range(7):
            c = mpmath.mpf(math.factorial(2 * n)) / (4 ** n * math.factorial(n) ** 2)
            assert abs(t[n] - c ** 2) <= mpmath.mpf(10) ** -35
    assert [Fraction(1), Fraction(1, 4), Fraction(9, 64), Fraction(25, 256)] == [
        Fraction(math.factorial(2 * n), 4 ** n * math.factorial(n) ** 2) ** 2 for n in range(4)]
    for a in (1e-6, 1e-3, 0.05, 0.3):
        with mpmath.workdps(60):
            m = mpmath.sin(mpmath.mpf(a) / 2) ** 2
            s = mpmath.nsum(lambda n: (mpmath.factorial(2 * n)
                                       / (4 ** n * mpmath.factorial(n) ** 2)) ** 2 * m ** n,
                            [1, mpmath.inf])
        assert rel(swingcalc.period_excess(a), s) <= 1e-14


# --- Properties and bounds ----------------------------------------------------------------

amplitudes = st.floats(min_value=0.0, max_value=A_MAX, allow_nan=False)


@settings(max_examples=300, deadline=None)
@given(amplitudes)
def test_period_ratio_at_least_one_and_excess_nonnegative(a):
    """T/T0 >= 1 and T/T0 - 1 >= 0 for every libration amplitude (K(m) >= pi/2)."""
    assert swingcalc.period_ratio(a) >= 1.0
    assert swingcalc.period_excess(a) >= 0.0


@settings(max_examples=300, deadline=None)
@given(amplitudes, amplitudes)
def test_period_ratio_nondecreasing_in_amplitude(a, b):
    """K(m) increases with m, so T/T0 is nondecreasing in the amplitude (monotone in floats
    too: checked exactly, no tolerance)."""
    lo, hi = min(a, b), max(a, b)
    assert swingcalc.period_ratio(lo) <= swingcalc.period_ratio(hi)
    assert swingcalc.period_excess(lo) <= swingcalc.period_excess(hi)


@settings(max_examples=200, deadline=None)
@given(amplitudes)
def test_period_ratio_bounds_bracket_mpmath_value(a):
    """Both bound methods bracket the 30-digit mpmath T/T0 at the same float amplitude.

    Allowance 4 ulp of the bound: each bound is two or three correctly rounded operations
    on m, p = sin^2, cos^2 (each a few ulp), and at tiny amplitudes the true gap between
    bound and value (9k^4/64) is below one ulp, so exact float brackets cannot be asked.
    """
    ref = mp_period_ratio(a, dps=30)
    for method in ("series", "agm"):
        lo, hi = swingcalc.period_ratio_bounds(a, method=method)
        assert lo <= float(ref) * (1 + 4 * EPS), (method, a, lo, ref)
        assert hi >= float(ref) * (1 - 4 * EPS), (method, a, hi, ref)
        assert lo <= hi


def test_period_ratio_bounds_are_not_trivial():
    """The bounds must be close enough to mean something (so the bracket test can fail).

    AGM pair at 90 deg: one step of the AGM from (1, c), c = cos 45 deg, gives
    a1 = (1 + c)/2 = 0.85355, b1 = sqrt(c) = 0.84090, so each bound is within
    (a1 - b1)/b1 = 1.5 % of T/T0 (hand derivation; the pair is 1.5 % wide). Series pair at
    1 deg: within 1e-6 relative (the gaps are 9k^4/64 ~ 1e-9 low, ~k^4/16 high)."""
    lo, hi = swingcalc.period_ratio_bounds(math.pi / 2, method="agm")
    ref = float(mp_period_ratio(math.pi / 2))
    c = math.cos(math.pi / 4)
    width = ((1 + c) / 2 - math.sqrt(c)) / math.sqrt(c)
    assert (hi - lo) / ref < width * 1.01
    assert ref / lo - 1 < width and hi / ref - 1 < width
    lo, hi = swingcalc.period_ratio_bounds(math.radians(1), method="series")
    ref = float(mp_period_ratio(math.radians(1)))
    assert (hi - lo) / ref < 1e-6


@pytest.mark.parametrize("deg, lower, exact, upper", [
    (10, 2.0109014, 2.0109178, 2.0109306),
    (42, 2.0715314, 2.0766474, 2.0810269),
])
def test_stewart_bounds_values_l1_g98(deg, lower, exact, upper):
    """Stewart, Calculus: Early Transcendentals 8th ed., §11.11 ex. 38 [pub]:
    2 pi sqrt(L/g)(1 + k^2/4) < T < 2 pi sqrt(L/g)(4 - 3k^2)/(4 - 4k^2), L = 1 m,
    g = 9.8; values from REFERENCES.md [calc] with 8 digits: tolerance 5e-8 s."""
    a = math.radians(deg)
    t0 = swingcalc.small_angle_period(1.0, 9.8)
    lo, hi = swingcalc.period_ratio_bounds(a, method="series")
    assert t0 * lo == pytest.approx(lower, abs=5e-8)
    assert t0 * hi == pytest.approx(upper, abs=5e-8)
    assert swingcalc.period(1.0, a, 9.8) == pytest.approx(exact, abs=5e-8)


def test_agm_bounds_closed_forms():
    """AGM method: 2/(1 + cos(A/2)) <= T/T0 <= 1/sqrt(cos(A/2)) (one step of Gauss's AGM,
    T/T0 = 1/AGM(1, cos(A/2)), DLMF 19.8.5), hand-evaluated at 120 deg."""
    a = math.radians(120)
    c = math.cos(a / 2)
    lo, hi = swingcalc.period_ratio_bounds(a, method="agm")
    assert lo == pytest.approx(2 / (1 + c), rel=4 * EPS)
    assert hi == pytest.approx(1 / math.sqrt(c), rel=4 * EPS)


# --- Rotation (over the top) --------------------------------------------------------------

def test_rotation_period_ratio_against_quadrature_fixture():
    """T_rev/T0 = (1/pi) int_0^{pi/2} dphi / sqrt(h - sin^2 phi), an mpmath quadrature of the
    energy equation (fixture, 40 digits), for h = 1 + 1e-14 .. 1e4. h - 1 is exact in floats
    for h in (1, 2] (Sterbenz), so no input conditioning: 1e-15 relative (issue: "to the
    same accuracy" as the libration period)."""
    for r in references()["rotation"]["by_energy_ratio"]:
        h = float.fromhex(r["energy_ratio_hex"])
        assert rel(swingcalc.rotation_period_ratio(h), r["revolution_ratio"]) <= 1e-15, h
    hs = np.array([float.fromhex(r["energy_ratio_hex"])
                   for r in references()["rotation"]["by_energy_ratio"]])
    assert swingcalc.rotation_period_ratio(hs).shape == hs.shape


def test_rotation_period_from_bottom_speed_against_quadrature_fixture():
    """rotation_period(L, v, g) against the quadrature fixture, incl. v = 2 sqrt(gL)(1 + 1e-10).

    With g = 4, L = 1 the library's w = v / (2 sqrt(gL)) = v/4 is exact, so 1e-15 applies.
    For g = g_n, L = 0.75 forming w costs up to ~2 ulp, magnified near the separatrix by
    cond = |d ln T / d ln v| (= 1/((h - 1) ln(8/sqrt(h - 1))) roughly; 2.3e8 at 1 + 1e-10):
    tolerance 1e-15 + 3 eps cond, cond from mpmath.
    """
    for r in references()["rotation"]["by_bottom_speed"]:
        g = float.fromhex(r["gravity_hex"])
        L = float.fromhex(r["length_hex"])
        v = float.fromhex(r["speed_hex"])
        exact_w = (g, L) == (4.0, 1.0)
        with mpmath.workdps(40):
            f = lambda x: mpmath.log(mpmath.ellipk(4 * g * L / x ** 2) / x)
            cond = float(abs(mpmath.diff(f, mpmath.mpf(v)) * v))
        tol = 1e-15 + (0.0 if exact_w else 3 * EPS * cond)
        assert rel(swingcalc.rotation_period(L, v, g), r["revolution_period_s"]) <= tol, r
        # Direction does not matter.
        assert rel(swingcalc.rotation_period(L, -v, g), r["revolution_period_s"]) <= tol


@pytest.mark.parametrize("h", [1.0 + 1e-6, 1.5, 4.0])
def test_rotation_period_against_dop853_time_to_advance_two_pi(h):
    """scipy solve_ivp DOP853 (rtol = atol = 1e-12) from the bottom at speed 2 sqrt(h g L),
    terminal event at theta = 2 pi. The event time of DOP853's dense output at rtol 1e-12
    over one revolution is good to ~1e-10 relative; tolerance 1e-9."""
    from scipy.integrate import solve_ivp

    L, g = 1.3, 9.80665
    v = 2 * math.sqrt(h * g * L)

    def turned(_t, y):
        return y[0] - 2 * math.pi
    turned.terminal = True
    turned.direction = 1
    t0 = 2 * math.pi * math.sqrt(L / g)
    sol = solve_ivp(lambda t, y: [y[1], -g / L * math.sin(y[0])], (0, 100 * t0),
                    [0.0, v / L], method="DOP853", rtol=1e-12, atol=1e-12, events=turned,
                    max_step=t0 / 20)
    t_rev = sol.t_events[0][0]
    assert swingcalc.rotation_period(L, v, g) == pytest.approx(t_rev, rel=1e-9)
    assert swingcalc.rotation_period_ratio(h) * t0 == pytest.approx(t_rev, rel=1e-9)


def test_rotation_period_grows_logarithmically_near_separatrix():
    """T_rev/T0 ~ (1/pi) ln(4 / sqrt(h - 1)) as h -> 1+ (K(1/h)/(pi sqrt h) with
    DLMF 19.12.1): per decade of h - 1 the ratio grows by ln(10)/(2 pi) = 0.3665, to
    within the next term O((h - 1) ln(h - 1)) < 1e-5 for h - 1 <= 1e-7. The float
    h = 1 + 10^-k holds h - 1 only to 2.2e-16 absolute (2 % at 1e-14), so the expected
    step uses the exact h - 1 of each float: (1/(2 pi)) ln(gap_k / gap_k+1)."""
    hs = [1 + 10.0 ** -k for k in range(7, 15)]
    vals = [swingcalc.rotation_period_ratio(h) for h in hs]
    for i in range(len(hs) - 1):
        step = math.log((hs[i] - 1) / (hs[i + 1] - 1)) / (2 * math.pi)
        assert abs(step - math.log(10) / (2 * math.pi)) < 0.02
        assert vals[i + 1] - vals[i] == pytest.approx(step, abs=1e-5)


# --- Inverse: amplitude for a period ratio or excess --------------------------------------

@pytest.mark.parametrize("a", [1e-150, 1e-20, 1e-8, 1e-3, 0.1, 1.0, 2.0, 3.0, math.pi - 1e-6,
                               math.pi - 1e-12, A_MAX])
def test_amplitude_for_period_excess_round_trip(a):
    """A -> T/T0 - 1 -> A. The excess determines A well everywhere (A ~ 4 sqrt(excess) at
    small A, cond 1/2; near pi d(pi - A)/(pi - A) = (pi/2) d(T/T0), cond < 1e-14), so
    the round trip is limited by the solver, which works in x = ln(m/p): its absolute
    error ~ |x| eps costs |x| eps / 2 relative in A (8e-14 at A = 1e-150, |x| = 690).
    Tolerance 1e-12 relative."""
    back = swingcalc.amplitude_for_period_excess(swingcalc.period_excess(a))
    assert back == pytest.approx(a, rel=1e-12)


@pytest.mark.parametrize("a", [0.05, 0.3, 1.0, 2.0, 3.0, math.pi - 1e-9, A_MAX])
def test_amplitude_for_period_ratio_round_trip_where_well_conditioned(a):
    """A -> T/T0 -> A to 1e-12 relative for A >= 0.05 rad. Not below: T/T0 = 1 + A^2/16
    rounds to 1 within eps/2, which leaves A uncertain by 4 eps / A^2 relative (1e-12 at
    A = 0.03); the excess form above has no such loss. Near pi the ratio over-resolves
    the float amplitude, so the round trip is fine there."""
    back = swingcalc.amplitude_for_period_ratio(swingcalc.period_ratio(a))
    assert back == pytest.approx(a, rel=1e-12)


@pytest.mark.parametrize("ratio", [1.0 + 1e-6, 1.001, 1.18034059901609623, 2.0, 3.0, 10.0,
                                   20.0, 23.0])
def test_ratio_round_trip_limited_by_float_amplitude_near_pi(ratio):
    """T/T0 -> A -> T/T0. Far from pi, to 1e-12. Near pi T/T0 ~ (2/pi) ln(8/(pi - A)):
    one ulp of A (4.4e-16 there) moves T/T0 by (2/pi) ulp / (pi - A), so the best a float
    amplitude can do is half that; the test allows one full step (plus 4 ulp)."""
    a = swingcalc.amplitude_for_period_ratio(ratio)
    assert 0.0 <= a < math.pi
    with mpmath.workdps(30):
        d = float(mpmath.pi - mpmath.mpf(a))
    step = (2 / math.pi) * (math.ulp(a) / d) * 1.0
    got = swingcalc.period_ratio(a)
    assert abs(got - ratio) <= max(1e-12 * ratio, step + 4 * EPS * ratio), (ratio, a, got)


def test_amplitude_for_period_ratio_of_one_is_zero_and_arrays_work():
    """T/T0 = 1 only at rest; arrays in give arrays out, element for element."""
    assert swingcalc.amplitude_for_period_ratio(1.0) == 0.0
    r = np.array([1.0, 1.01, 2.0])
    got = swingcalc.amplitude_for_period_ratio(r)
    assert got.shape == (3,)
    for x, g in zip(r, got):
        assert g == pytest.approx(swingcalc.amplitude_for_period_ratio(float(x)), rel=4 * EPS)


def test_amplitude_for_period_ratio_at_1_01_is_22_81_deg():
    """T/T0 = 1.01 at 22.8138492619572 deg (REFERENCES.md [calc], 15 digits: 5e-15 relative
    covers the printed half unit plus the solver's |x| eps / 2)."""
    a = swingcalc.amplitude_for_period_ratio(1.01)
    assert math.degrees(a) == pytest.approx(22.8138492619572, rel=5e-15)


MAX_AMPLITUDE_TABLE = [(1e-4, 2.29172614409746), (1e-3, 7.24408665960318),
                       (5e-3, 16.1686584741847), (1e-2, 22.8138492619572),
                       (2e-2, 32.1175402063786), (5e-2, 50.1040452501255),
                       (0.1, 69.3251459638768)]


@pytest.mark.parametrize("tol, deg", MAX_AMPLITUDE_TABLE)
def test_max_amplitude_for_period_error_relative_to_small_angle(tol, deg):
    """Amplitude at which (T - T0)/T0 = X, REFERENCES.md [calc, 15 significant digits].

    Tolerance 5e-15 relative: the printed half unit (up to 2.2e-15 at 2.29 deg) plus the
    inverse solver's error, about |ln(m/p)| eps / 2 (measured 3.3e-15 at 0.01 %)."""
    a = swingcalc.max_amplitude_for_period_error(tol, relative_to="small_angle")
    assert math.degrees(a) == pytest.approx(deg, rel=5e-15)


def test_max_amplitude_for_period_error_relative_to_exact():
    """With X = (T - T0)/T: 1 % at 22.9277266306748 deg (REFERENCES.md [calc]); this is the
    default definition (linear.py: error of the approximation relative to the exact)."""
    a = swingcalc.max_amplitude_for_period_error(0.01, relative_to="exact")
    assert math.degrees(a) == pytest.approx(22.9277266306748, rel=5e-15)
    assert swingcalc.max_amplitude_for_period_error(0.01) == a
    # And at that amplitude the small-angle period is short by exactly 1 % of T.
    assert swingcalc.small_angle_period_error(a) == pytest.approx(-0.01, rel=1e-13)


def test_period_scales_with_small_angle_period():
    """T = T0 (T/T0): T0 = 2 pi sqrt(L/g) hand-evaluated, L = 0.25 m, g = 9.81, 60 deg."""
    t = swingcalc.period(0.25, math.radians(60), 9.81)
    expected = 2 * math.pi * math.sqrt(0.25 / 9.81) * float(mp_period_ratio(math.radians(60)))
    assert t == pytest.approx(expected, rel=2e-15)


@pytest.mark.parametrize("m, K", [(0.5, 1.8540746773013719184), (0.1, 1.6124413487202193982),
                                  (0.9, 2.5780921133481731882), (0.99, 3.6956373629898746778)])
def test_period_ratio_reproduces_k_table_at_amplitude_2_asin_sqrt_m(m, K):
    """T/T0 = (2/pi) K(m) at A = 2 asin(sqrt m), with K from REFERENCES.md [calc, 20 digits].

    The float A is not exactly 2 asin(sqrt m): its rounding (and that of asin, sqrt) moves
    T/T0 by cond * 2 eps with cond = A (dT/dA)/T, large as m -> 1 (1e3 at 1 - 1e-6), so the
    tolerance is 1e-15 + 4 eps cond, cond from mpmath. (m = 1 - 1e-6 is left to the
    kernel test with p given: here asin near 1 would amplify the rounding of sqrt(m) by
    1/sqrt(1 - m) = 1e3 on top, so the check would be about the input, not the library.)"""
    a = 2 * math.asin(math.sqrt(m))
    with mpmath.workdps(40):
        f = lambda x: mpmath.log(2 / mpmath.pi * mpmath.ellipk(mpmath.sin(x / 2) ** 2))
        cond = float(abs(mpmath.diff(f, mpmath.mpf(a)) * a))
    assert swingcalc.period_ratio(a) == pytest.approx(2 / math.pi * K, rel=1e-15 + 4 * EPS * cond)
