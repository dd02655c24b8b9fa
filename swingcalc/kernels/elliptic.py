"""Complete elliptic integral, nome and Jacobi elliptic functions in the parameter m.

Every function here takes the parameter m = k^2 *and* its complement p = 1 - m, each
computed accurately by the caller. Near the separatrix of a pendulum m is within a few
ulp of 1 and ``1 - m`` formed in floating point has no correct digits left; the callers
in this package always know p directly (p = cos^2(theta0/2) for an amplitude theta0), so
no function here ever forms ``1 - m`` itself.

Plain floats and numpy arrays only, no validation (callers validate).
"""

from __future__ import annotations

import numpy as np
from scipy import special

__all__ = ["ellipk", "nome", "jacobi_sncndn", "carlson_rf"]

_EPS = np.finfo(float).eps
_MAX_LANDEN_STEPS = 40


def ellipk(p):
    """K(m) from the complementary parameter p = 1 - m.

    ``scipy.special.ellipkm1`` takes p directly and keeps full relative accuracy as
    p -> 0 (m -> 1), where ``ellipk(1 - p)`` has lost every digit of p.
    """
    return special.ellipkm1(p)


def nome(m, p):
    """Jacobi nome q = exp(-pi K'(m) / K(m)), K'(m) = K(1 - m) (DLMF 22.2.1)."""
    return np.exp(-np.pi * special.ellipkm1(m) / special.ellipkm1(p))


def carlson_rf(x, y, z):
    """Carlson's symmetric integral R_F(x, y, z) (DLMF 19.16.1)."""
    return special.elliprf(x, y, z)


def jacobi_sncndn(u, m, p):
    """Jacobi sn, cn, dn of argument u and parameter m, given p = 1 - m as well.

    Parameters
    ----------
    u : float or ndarray
        Argument (any real value; reduced here).
    m, p : float or ndarray
        Parameter in [0, 1] and its complement 1 - m, both accurate.

    Returns
    -------
    sn, cn, dn : ndarray
        Broadcast to the common shape of the inputs.

    Notes
    -----
    ``scipy.special.ellipj`` reduces nothing itself and is wrong for m within about 1e-9
    of 1 once u passes the quarter period K (scipy issue 8480). Here u is reduced with
    the quarter-period symmetries (DLMF 22.4.3, 22.4.4 and Table 22.4.3) to [0, K/2],
    where the functions are evaluated by the descending Landen transformation written as
    the arithmetic-geometric mean (DLMF 22.20(ii)) started from b0 = sqrt(p), so m close
    to 1 costs no digits. On (K/2, K] the reflection u -> K - u,

        sn(K - v) = cn v / dn v,  cn(K - v) = k' sn v / dn v,  dn(K - v) = k' / dn v,

    keeps dn (and cn) with full relative accuracy near u = K, where they are as small as
    k' = sqrt(p). At m = 1 exactly the closed forms sn = tanh, cn = dn = sech are used.
    """
    u, m, p = np.broadcast_arrays(
        np.asarray(u, dtype=float), np.asarray(m, dtype=float), np.asarray(p, dtype=float)
    )
    shape = u.shape
    u, m, p = u.ravel(), m.ravel(), p.ravel()
    sn = np.empty_like(u)
    cn = np.empty_like(u)
    dn = np.empty_like(u)

    sep = p <= 0.0
    if np.any(sep):
        us = u[sep]
        sn[sep] = np.tanh(us)
        # sech u = 2 e^-|u| / (1 + e^-2|u|): no overflow of cosh for |u| > 710.
        decay = np.exp(-np.abs(us))
        cn[sep] = dn[sep] = 2.0 * decay / (1.0 + decay * decay)
    per = ~sep
    if np.any(per):
        s, c, d = _periodic(u[per], m[per], p[per])
        sn[per], cn[per], dn[per] = s, c, d
    return sn.reshape(shape), cn.reshape(shape), dn.reshape(shape)


def _periodic(u, m, p):
    quarter = special.ellipkm1(p)
    kprime = np.sqrt(p)
    r = np.mod(u, 4.0 * quarter)
    sign_sn = np.ones_like(r)
    sign_cn = np.ones_like(r)
    # sn(u + 2K) = -sn u, cn(u + 2K) = -cn u, dn(u + 2K) = dn u.
    second_half = r >= 2.0 * quarter
    r = np.where(second_half, r - 2.0 * quarter, r)
    sign_sn[second_half] = -1.0
    sign_cn[second_half] = -1.0
    # sn(2K - u) = sn u, cn(2K - u) = -cn u, dn(2K - u) = dn u.
    falling = r > quarter
    r = np.where(falling, 2.0 * quarter - r, r)
    sign_cn[falling] *= -1.0
    # Reflect (K/2, K] onto [0, K/2).
    reflect = r > 0.5 * quarter
    v = np.where(reflect, quarter - r, r)
    v = np.clip(v, 0.0, None)
    s, c, d = _landen(v, m, p)
    sn = np.where(reflect, c / d, s)
    cn = np.where(reflect, kprime * s / d, c)
    dn = np.where(reflect, kprime / d, d)
    return sign_sn * sn, sign_cn * cn, dn


def _landen(u, m, p):
    """sn, cn, dn by the AGM / descending Landen scheme (DLMF 22.20(ii)), in co-angles.

    The scheme's angles phi_n tend to pi/2 as m -> 1, where cos(phi_0) = cn and the dn
    quotient lose their relative accuracy. It is run here in psi_n = pi/2 - phi_n with

        psi_{n-1} = (psi_n + chi_n) / 2,  chi_n = acos(r_n cos psi_n) = pi/2 - asin(r_n sin phi_n),
        1 - r_n cos psi_n = b_{n-1} / a_n + 2 r_n sin^2(psi_n / 2),  r_n = c_n / a_n,

    where 1 - r_n = b_{n-1} / a_n exactly (a_n - c_n = b_{n-1}), so no step cancels.
    Then sn = cos psi_0, cn = sin psi_0, dn = sin psi_0 / cos(psi_0 - psi_1).
    """
    a = np.ones_like(u)
    b = np.sqrt(p)
    c = np.sqrt(m)
    ratios = []
    complements = []
    for _ in range(_MAX_LANDEN_STEPS):
        a_next = 0.5 * (a + b)
        # c_n = c_{n-1}^2 / (4 a_n) avoids the cancellation in (a - b) / 2.
        c = c * c / (4.0 * a_next)
        complements.append(b / a_next)
        b = np.sqrt(a * b)
        a = a_next
        ratios.append(c / a)
        if not np.any(ratios[-1] > _EPS):
            break
    psi = 0.5 * np.pi - np.ldexp(a * u, len(ratios))
    psi_next = psi
    for ratio, complement in zip(reversed(ratios), reversed(complements)):
        psi_next = psi
        half_gap = 0.5 * complement + ratio * np.sin(0.5 * psi) ** 2
        chi = 2.0 * np.arcsin(np.sqrt(np.minimum(half_gap, 1.0)))
        psi = 0.5 * (psi + chi)
    sn = np.cos(psi)
    cn = np.sin(psi)
    dn = cn / np.cos(psi - psi_next)
    return sn, cn, dn
