"""The elliptic kernels (swingcalc.kernels.elliptic) against mpmath, closed forms and tables.

Parameter convention: m = k^2 (A&S 17.2; DLMF 19.2), and every kernel also takes the
complement p = 1 - m, which the tests pass exactly (for m near 1 the test chooses p and
evaluates mpmath at m = 1 - mpf(p), not at the rounded float 1 - p).

Tolerances for the Jacobi functions come from the accuracy the kernel documents and that
was measured on it: about 1e-15 absolute for sn and cn; dn is kept to relative accuracy,
about 1e-15 / p**0.25 near m = 1 (near u = K dn is as small as sqrt(p)). The tests allow
2e-15 (9 ulp) absolute for sn, cn and 2e-15 / p**0.25 relative for dn, plus the argument
reduction: u mod 4K carries an absolute error of about |u| eps in the reduced argument,
and |d sn/du|, |d cn/du| <= 1, so a further |u| eps * 4 absolute is allowed.
"""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest

from swingcalc.kernels import elliptic as ke

from helpers import EPS

# p from 1 (m = 0) down to 1e-20 (m within 1e-20 of 1, where 1 - p rounds to 1).
COMPLEMENTS = [1.0, 0.9, 0.5, 0.1, 1e-2, 1e-4, 1e-6, 1e-9, 1e-12, 1e-16, 1e-20]


def _mp_sncndn(u, p, dps=45):
    """sn, cn, dn and K at m = 1 - p exactly (mpmath.ellipfun, DLMF 22.2)."""
    with mpmath.workdps(dps):
        pm = mpmath.mpf(p)
        m = 1 - pm
        return (mpmath.ellipfun("sn", u, m=m), mpmath.ellipfun("cn", u, m=m),
                mpmath.ellipfun("dn", u, m=m), mpmath.ellipk(m))


def _m_float(p):
    # The kernel's m argument: the float nearest 1 - p (exact for the p used here,
    # or the rounding is far below the tolerance since p carries the accuracy).
    return 1.0 - p


def _check(u, p, sn, cn, dn, ref_sn, ref_cn, ref_dn):
    reduction = 4.0 * abs(float(u)) * EPS
    assert abs(sn - float(ref_sn)) <= 2e-15 + reduction, (u, p, sn, ref_sn)
    assert abs(cn - float(ref_cn)) <= 2e-15 + reduction, (u, p, cn, ref_cn)
    # dn relative: 2e-15 / p^0.25 (documented kernel accuracy near m = 1), plus the
    # reduction error relative to dn (|d dn/du| = m |sn cn| <= 1).
    dn_tol = 2e-15 / p ** 0.25 + reduction / float(ref_dn)
    assert abs(dn - float(ref_dn)) <= dn_tol * float(ref_dn), (u, p, dn, ref_dn)


@pytest.mark.parametrize("p", COMPLEMENTS)
def test_jacobi_sncndn_matches_mpmath_ellipfun_over_several_periods(p):
    """sn, cn, dn against mpmath.ellipfun at 45 digits, u over [-2.5 x 4K, 2.5 x 4K].

    Includes the quarter-period points u = K/2, K, 2K, 3K, 4K and points next to them,
    where the kernel switches between its reduction branches.
    """
    _, _, _, K = _mp_sncndn(0, p)
    Kf = float(K)
    us = [0.0, 1e-8, 0.3, 0.5 * Kf, Kf, 2 * Kf, 3 * Kf, 4 * Kf, 1.5 * Kf, 0.999 * Kf,
          1.001 * Kf, 0.5 * Kf * (1 + 1e-12), -0.7 * Kf, -Kf, -5.3 * Kf]
    us += list(np.linspace(-10 * Kf, 10 * Kf, 37))
    m = _m_float(p)
    sn, cn, dn = ke.jacobi_sncndn(np.array(us), m, p)
    for i, u in enumerate(us):
        ref = _mp_sncndn(mpmath.mpf(u), p)
        _check(u, p, sn[i], cn[i], dn[i], *ref[:3])


@pytest.mark.parametrize("p", COMPLEMENTS)
def test_jacobi_functions_bounded_and_pythagorean(p):
    """|sn|, |cn| <= 1, 0 < dn <= 1, sn^2 + cn^2 = 1 and dn^2 + m sn^2 = 1 (DLMF 22.6.1).

    Rounding of three products allows 4 ulp in the identities.
    """
    m = _m_float(p)
    u = np.linspace(-300.0, 300.0, 4001)
    sn, cn, dn = ke.jacobi_sncndn(u, m, p)
    assert np.all(np.abs(sn) <= 1.0) and np.all(np.abs(cn) <= 1.0)
    # dn may round one ulp above 1 at m = 0 (the Landen scheme's last division).
    assert np.all(dn > 0.0) and np.all(dn <= 1.0 + 2 * EPS)
    assert np.max(np.abs(sn * sn + cn * cn - 1.0)) <= 4 * EPS
    # dn^2 + m sn^2 = 1 in the form dn^2 - p sn^2 = cn^2 (no cancellation near m = 1).
    assert np.max(np.abs(dn * dn - p * sn * sn - cn * cn)) <= 4 * EPS


def test_scipy_issue_8480_case_u50_near_m1():
    """u = 50, m = 0.99999999997^2, where scipy.special.ellipj gave |cn| >> 1 (scipy #8480).

    Reference: mpmath.ellipfun at 45 digits at the same m. p = 1 - k^2 = (1 - k)(1 + k)
    is formed exactly enough from k (3e-11 carries 5 correct-digit-losses at most).
    """
    k = 0.99999999997
    with mpmath.workdps(45):
        km = mpmath.mpf(k)
        pm = (1 - km) * (1 + km)
    p = float(pm)
    m = k * k
    sn, cn, dn = (float(x) for x in ke.jacobi_sncndn(50.0, m, p))
    with mpmath.workdps(45):
        mm = 1 - mpmath.mpf(p)
        ref = [mpmath.ellipfun(f, 50, m=mm) for f in ("sn", "cn", "dn")]
    assert abs(cn) <= 1.0 and abs(sn) <= 1.0
    _check(50.0, p, sn, cn, dn, *ref)


def test_dn_at_quarter_period_is_sqrt_of_complement():
    """dn(K | m) = k' = sqrt(1 - m), sn(K) = 1, cn(K) = 0 (DLMF 22.5.1; scipy #3904 trap).

    u is the float nearest K (from mpmath); with |d dn/du| = m |sn cn| ~ k' |u - K| the
    rounding of u moves dn by far less than its own relative tolerance 2e-15 / p^0.25.
    """
    for p in COMPLEMENTS[1:]:
        with mpmath.workdps(45):
            K = mpmath.ellipk(1 - mpmath.mpf(p))
        sn, cn, dn = (float(x) for x in ke.jacobi_sncndn(float(K), 1.0 - p, p))
        assert abs(sn - 1.0) <= 2e-15
        assert abs(cn) <= 2e-15 * max(1.0, math.sqrt(p) * 10) + 4 * float(K) * EPS * math.sqrt(p)
        assert abs(dn - math.sqrt(p)) <= (2e-15 / p ** 0.25) * math.sqrt(p) + 2 * EPS * math.sqrt(p), p


def test_m_equal_one_gives_tanh_and_sech():
    """m = 1 exactly: sn = tanh u, cn = dn = sech u (DLMF 22.5.3), even for u > 355,
    where scipy's ellipj returns NaN (PITFALLS.md). 2 ulp: numpy's tanh/cosh.

    |u| = 800 and 1000 make cosh overflow to inf (sech underflows to 0, the correct float
    answer); the kernel must return that without a RuntimeWarning, which this project
    turns into an error (pyproject filterwarnings). A separatrix history at t > 710/omega0
    reaches this case.
    """
    u = np.array([-800.0, -20.0, -1.0, 0.0, 0.5, 3.0, 40.0, 356.0, 1000.0])
    sn, cn, dn = ke.jacobi_sncndn(u, 1.0, 0.0)
    with mpmath.workdps(30):
        for i, x in enumerate(u):
            assert sn[i] == pytest.approx(float(mpmath.tanh(x)), rel=2 * EPS, abs=1e-300)
            sech = float(mpmath.sech(x))
            assert cn[i] == pytest.approx(sech, rel=4 * EPS, abs=1e-300)
            assert dn[i] == pytest.approx(sech, rel=4 * EPS, abs=1e-300)


def test_m_equal_zero_gives_sin_cos_and_one():
    """m = 0: sn = sin u, cn = cos u, dn = 1 (DLMF 22.5.2); 2e-15 absolute plus reduction."""
    u = np.linspace(-40.0, 40.0, 801)
    sn, cn, dn = ke.jacobi_sncndn(u, 0.0, 1.0)
    tol = 2e-15 + 4 * np.abs(u) * EPS
    assert np.all(np.abs(sn - np.sin(u)) <= tol)
    assert np.all(np.abs(cn - np.cos(u)) <= tol)
    assert np.all(np.abs(dn - 1.0) <= 2 * EPS)


def test_broadcasting_of_u_m_p():
    """Arrays of u and of (m, p) broadcast together; each element matches its scalar call.

    Not bit for bit: the Landen loop runs as many steps as the slowest element needs, so
    elements may differ from their scalar evaluation by rounding (allow 4 ulp).
    """
    u = np.array([[0.1], [1.0], [7.0]])
    p = np.array([0.5, 1e-3, 1e-12])
    sn, cn, dn = ke.jacobi_sncndn(u, 1.0 - p, p)
    assert sn.shape == (3, 3)
    for i in range(3):
        for j in range(3):
            s1, c1, d1 = ke.jacobi_sncndn(u[i, 0], 1.0 - p[j], p[j])
            assert sn[i, j] == pytest.approx(float(s1), rel=4 * EPS, abs=4 * EPS)
            assert cn[i, j] == pytest.approx(float(c1), rel=4 * EPS, abs=4 * EPS)
            assert dn[i, j] == pytest.approx(float(d1), rel=4 * EPS)


# --- Complete integral K(m) ---------------------------------------------------------------

# K values with 20 digits, REFERENCES.md "Elliptic integrals" [calc]; tolerance 1e-15
# relative (4.5 ulp): ellipkm1 is accurate to a few ulp and rounding of p is negligible
# (|d ln K / d ln p| <= 1/2 / K).
K_TABLE = [
    (0.1, 1.6124413487202193982),
    (0.9, 2.5780921133481731882),
    (0.99, 3.6956373629898746778),
]


@pytest.mark.parametrize("m, expected", K_TABLE)
def test_ellipk_table_values(m, expected):
    """K(0.1), K(0.9), K(0.99) (REFERENCES.md, mpmath 20 digits), from p = 1 - m."""
    # p = 1 - m exactly in decimal: use the float nearest the decimal complement.
    p = float(mpmath.mpf(1) - mpmath.mpf(str(m)))
    assert float(ke.ellipk(p)) == pytest.approx(expected, rel=1e-15)


def test_ellipk_one_minus_1e_minus_6():
    """K(1 - 1e-6) = 8.2940514636154399853 (REFERENCES.md [calc]); p = 1e-6 passed directly."""
    assert float(ke.ellipk(1e-6)) == pytest.approx(8.2940514636154399853, rel=1e-15)


def test_ellipk_one_half_from_gamma_closed_form():
    """K(1/2) = Gamma(1/4)^2 / (4 sqrt(pi)), the lemniscatic case (REFERENCES.md; standard
    closed form [mem: DLMF equation number not re-checked]), computed here with math.gamma (accurate to a couple of ulp), and the 20-digit
    REFERENCES.md value 1.8540746773013719184."""
    closed = math.gamma(0.25) ** 2 / (4.0 * math.sqrt(math.pi))
    assert float(ke.ellipk(0.5)) == pytest.approx(closed, rel=1e-15)
    assert float(ke.ellipk(0.5)) == pytest.approx(1.8540746773013719184, rel=1e-15)


@pytest.mark.parametrize("alpha_deg, expected", [
    (10, 1.5828428043383507487),
    (30, 1.6857503548125960429),
    (60, 2.1565156474996432354),
    (80, 3.1533852518878387648),
    (89, 5.4349098296255635192),
])
def test_ellipk_abramowitz_stegun_table_17_1_modular_angle(alpha_deg, expected):
    """A&S Table 17.1 form, m = sin^2(alpha), values from REFERENCES.md [calc, 20 digits].

    p = cos^2(alpha) in floats: cos has relative error < 1 ulp, so p carries about 3 ulp,
    which moves K by at most 1.5 ulp / K; 1e-15 relative covers that plus ellipkm1.
    """
    p = math.cos(math.radians(alpha_deg)) ** 2
    assert float(ke.ellipk(p)) == pytest.approx(expected, rel=1e-15)


def test_ellipk_near_one_logarithmic_asymptote():
    """K ~ ln(4 / sqrt(p)) as p -> 0 (DLMF 19.12.1 [mem: number]); the next term is
    (p/4)(ln(4/sqrt p) - 1), so the difference must be below p ln(4/sqrt p) / 2."""
    for p in (1e-8, 1e-12, 1e-16, 1e-20, 1e-100):
        lead = math.log(4.0 / math.sqrt(p))
        assert abs(float(ke.ellipk(p)) - lead) <= p * lead / 2 + 4 * EPS * lead


def test_nome_matches_mpmath_qfrom():
    """q = exp(-pi K'/K) against mpmath.qfrom(m=...) (DLMF 22.2.1) at 40 digits.

    At m near 1 (q near 1) the float exponent has error ~ eps * pi K'/K, i.e. q to a few ulp.
    """
    for p in (1.0 - 1e-12, 0.9, 0.5, 1e-3, 1e-12):
        m = 1.0 - p
        with mpmath.workdps(40):
            ref = mpmath.qfrom(m=1 - mpmath.mpf(p))
        got = float(ke.nome(m, p))
        assert got == pytest.approx(float(ref), rel=1e-14, abs=1e-300), p
