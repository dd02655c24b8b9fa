"""Dimensionless kernels of the conservative simple pendulum  theta'' = -omega0^2 sin(theta).

Conventions (fixed here, used by every caller):

- time is scaled by omega0 = sqrt(g/L): tau = omega0 t;
- the state is (theta, w) with w = omega / (2 omega0);
- h = w^2 + sin^2(theta/2) is the energy relative to the separatrix energy
  (E / E_sep with E measured from the bottom, E_sep = 2 m g L);
- q = 1 - h = cos^2(theta/2) - w^2, formed as (|c| - |w|)(|c| + |w|), which adds no
  cancellation to the rounding of c and w themselves (from the bottom, c = 1, or from a
  turning point, w = 0, q keeps full relative accuracy as q -> 0; from a general state
  its relative error is about eps / |q|);
- in libration (0 <= h < 1) the elliptic parameter is m = h, its complement p = q;
  in rotation (h > 1) it is m = 1/h, complement p = -q/h.

Plain floats and numpy arrays, radians, no validation (the public API validates).
"""

from __future__ import annotations

import math
from fractions import Fraction
from functools import lru_cache

import numpy as np
from scipy import special

from .elliptic import carlson_rf, ellipk, jacobi_sncndn, nome

__all__ = [
    "fill_where",
    "amplitude_parameters",
    "state_parameters",
    "period_ratio",
    "period_excess",
    "rotation_ratio",
    "time_from_bottom",
    "x_minus_sin_over_cube",
    "theta_series_coefficients",
    "excess_for_logit",
    "libration_history",
    "rotation_history",
    "harmonic_ratio",
]

_TWO_OVER_PI = 2.0 / np.pi
# Below this parameter (amplitude 90 deg) the excess T/T0 - 1 is summed from its series
# in m, which keeps full relative accuracy as m -> 0, where (2/pi) K(m) - 1 cancels; 60
# terms leave a remainder below 1e-19 of the sum at m = 0.5.
_SERIES_LIMIT = 0.5
_SERIES_TERMS = 60


def fill_where(out, mask, fn, *args):
    """``out`` with ``fn`` of the masked ``args`` written where ``mask`` holds.

    The kernels evaluate a cheap general formula everywhere, then overwrite the
    entries where it cancels with a series; this does the masking for 0-d and n-d
    arrays alike.
    """
    if not np.any(mask):
        return out
    if np.ndim(out) == 0:
        return fn(*args)
    out[mask] = fn(*(np.broadcast_to(a, out.shape)[mask] for a in args))
    return out


def amplitude_parameters(amplitude):
    """(m, p) = (sin^2(A/2), cos^2(A/2)) for a libration amplitude A, both accurate."""
    half = 0.5 * np.asarray(amplitude, dtype=float)
    s = np.sin(half)
    c = np.cos(half)
    return s * s, c * c


def state_parameters(theta, w):
    """s, c, h, q for the state (theta, w); see the module notes."""
    half = 0.5 * np.asarray(theta, dtype=float)
    s = np.sin(half)
    c = np.cos(half)
    w = np.asarray(w, dtype=float)
    ac, aw = np.abs(c), np.abs(w)
    with np.errstate(over="ignore"):  # callers check h and q for overflow
        h = w * w + s * s
        q = (ac - aw) * (ac + aw)
    return s, c, h, q


def period_ratio(p):
    """T/T0 = (2/pi) K(m) from the complement p = cos^2(A/2) (A&S 17.2; DLMF 19.2.8)."""
    return _TWO_OVER_PI * ellipk(p)


@lru_cache(maxsize=None)
def _k_series_coefficients(terms: int = _SERIES_TERMS) -> np.ndarray:
    """c_n = [(2n)! / (4^n n!^2)]^2, n = 0..terms-1: (2/pi) K(m) = sum c_n m^n (A&S 17.3.11)."""
    coef = [1.0]
    ratio = Fraction(1)
    for n in range(1, terms):
        ratio *= Fraction(2 * n - 1, 2 * n)
        coef.append(float(ratio * ratio))
    return np.array(coef)


def _excess_series(m):
    acc = np.zeros_like(m)
    for c in _k_series_coefficients()[:0:-1]:
        acc = (acc + c) * m
    return acc


def _slope_series(m, p):
    coef = _k_series_coefficients()
    acc = np.zeros_like(m)
    for n in range(len(coef) - 1, 0, -1):
        acc = acc * m + n * coef[n]
    return acc * m * p


def period_excess(m, p):
    """T/T0 - 1 to about 1e-15 relative for every amplitude (also as m -> 0)."""
    m = np.asarray(m, dtype=float)
    p = np.asarray(p, dtype=float)
    return fill_where(period_ratio(p) - 1.0, m < _SERIES_LIMIT, _excess_series, m)


def period_excess_slope(m, p):
    """d(T/T0)/dx with x = ln(m/p): (E(m) - p K(m)) / pi, by series for small m."""
    m = np.asarray(m, dtype=float)
    p = np.asarray(p, dtype=float)
    out = (special.ellipe(m) - p * ellipk(p)) / np.pi
    return fill_where(out, m < _SERIES_LIMIT, _slope_series, m, p)


def excess_for_logit(x):
    """(T/T0 - 1, slope, m, p) at x = ln(m/p); m = expit(x), p = expit(-x)."""
    m = special.expit(x)
    p = special.expit(-x)
    return period_excess(m, p), period_excess_slope(m, p), m, p


def rotation_ratio(h, q):
    """Revolution period over T0 for h > 1: K(1/h) / (pi sqrt(h)), complement -q/h."""
    return ellipk(-q / h) / (np.pi * np.sqrt(h))


def time_from_bottom(s, gap, h, c):
    """Scaled time omega0 t from the bottom (theta = 0) to the angle with sin(theta/2) = s.

    ``gap`` is h - s^2 (= w^2 at that angle), which the caller forms accurately;
    c = cos(theta/2). Valid for |theta| <= pi and any h >= s^2:

        omega0 t = int_0^{theta/2} dphi / sqrt(h - sin^2 phi) = s R_F(h c^2, h - s^2, h),

    which is F(asin(s/sqrt h) | h) in libration and F(theta/2 | 1/h) / sqrt(h) in
    rotation (DLMF 19.25.5 with R_F homogeneous of degree -1/2, DLMF 19.16.1).
    """
    return s * carlson_rf(h * c * c, gap, h)


def _x_minus_sin_series(x):
    # 1/3! - x^2/5! + x^4/7! - ... - x^22/25!, by Horner from the smallest term.
    x2 = x * x
    acc = np.zeros_like(x)
    for j in range(12, 0, -1):
        acc = acc * x2 + (-1) ** (j + 1) / math.factorial(2 * j + 1)
    return acc


def x_minus_sin_over_cube(x):
    """(x - sin x) / x^3 without cancellation or underflow (Taylor series for |x| < 1)."""
    x = np.asarray(x, dtype=float)
    with np.errstate(invalid="ignore", divide="ignore"):
        out = (x - np.sin(x)) / x**3
    return fill_where(out, np.abs(x) < 1.0, _x_minus_sin_series, x)


@lru_cache(maxsize=None)
def theta_series_coefficients(terms: int) -> tuple[Fraction, ...]:
    """Exact a_j with T/T0 = sum_j a_j A^(2j), j = 0..terms-1.

    Built by composing (2/pi) K(m) = sum c_n m^n (A&S 17.3.11) with
    m = sin^2(A/2) = (1 - cos A) / 2 in exact rational arithmetic. The first five are
    1, 1/16, 11/3072, 173/737280, 22931/1321205760 (OEIS A223067 / A223068).
    """
    # m as a series in y = A^2: m = sum_{j>=1} (-1)^(j+1) y^j / (2 (2j)!)
    m_series = [Fraction(0)] + [
        Fraction((-1) ** (j + 1), 2 * math.factorial(2 * j)) for j in range(1, terms)
    ]
    result = [Fraction(0)] * terms
    power = [Fraction(1)] + [Fraction(0)] * (terms - 1)  # m^0
    c_n = Fraction(1)
    for n in range(terms):
        if n > 0:
            c_n *= Fraction(2 * n - 1, 2 * n) ** 2
            power = _mul_series(power, m_series, terms)
        for j in range(terms):
            result[j] += c_n * power[j]
    return tuple(result)


def _mul_series(a, b, terms):
    out = [Fraction(0)] * terms
    for i, ai in enumerate(a):
        if ai == 0:
            continue
        for j in range(terms - i):
            if b[j]:
                out[i + j] += ai * b[j]
    return out


def libration_history(tau, s, c, w, h, q):
    """theta, w along a libration (0 < h < 1) from the state (s, c, w) at tau = 0.

    sin(theta/2) = k sn(u | h), cos(theta/2) = dn(u | h), w = k cn(u | h), k = sqrt(h),
    u = tau + u0. The phase u0 follows from sn(u0) = s/k, cn(u0) = w/k with
    F(phi | m) = sin(phi) R_F(cos^2 phi, 1 - m sin^2 phi, 1) (DLMF 19.25.5), scaled by
    homogeneity to s R_F(w^2, h c^2, h); on the falling half (w < 0) u0 = 2K - F.
    """
    quarter = ellipk(q)
    f0 = s * carlson_rf(w * w, h * c * c, h)
    u0 = np.where(w >= 0.0, f0, 2.0 * quarter - f0)
    sn, cn, dn = jacobi_sncndn(tau + u0, h, q)
    k = np.sqrt(h)
    theta = 2.0 * np.arctan2(k * sn, dn)
    return theta, k * cn


def rotation_history(tau, s, c, w, h, q, turns):
    """theta, w along a rotation (h > 1), theta unwrapped from its start.

    With the direction taken out (w > 0), theta/2 = am(v | 1/h), w = sqrt(h) dn(v | 1/h),
    v = sqrt(h) tau + v0, v0 = F(theta0/2 | 1/h) = s sqrt(h) R_F(h c^2, w^2, h) for the
    start reduced to [-pi, pi] (``turns`` whole turns taken out by the caller).
    am is unwrapped with am(v + 2nK) = am(v) + n pi (DLMF 22.16.2).
    """
    direction = np.where(w >= 0.0, 1.0, -1.0)
    s_dir = s * direction
    root_h = np.sqrt(h)
    m_rot = 1.0 / h
    p_rot = -q / h
    quarter = ellipk(p_rot)
    v0 = s_dir * root_h * carlson_rf(h * c * c, w * w, h)
    v = root_h * tau + v0
    n = np.round(v / (2.0 * quarter))
    r = v - 2.0 * quarter * n
    sn, cn, dn = jacobi_sncndn(r, m_rot, p_rot)
    half_angle = n * np.pi + np.arctan2(sn, cn)
    theta = direction * 2.0 * half_angle + 2.0 * np.pi * turns
    return theta, direction * root_h * dn


def harmonic_ratio(m, p, order):
    """Amplitude of the odd harmonic ``order`` of theta(t) over the fundamental.

    theta(t) = 8 sum_{n>=0} q^(n+1/2) / ((2n+1)(1 + q^(2n+1))) sin((2n+1) pi u / (2K)),
    q the nome, so a_N / a_1 = q^((N-1)/2) (1 + q) / (N (1 + q^N)) for odd N.
    """
    qn = nome(m, p)
    return qn ** ((order - 1) // 2) * (1.0 + qn) / (order * (1.0 + qn**order))
