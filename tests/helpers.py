"""Shared helpers for the numerical tests: the mpmath fixture and reference integrators.

Nothing here calls swingcalc; these are the independent sides of the comparisons.
"""

from __future__ import annotations

import json
import math
from functools import lru_cache
from pathlib import Path

import mpmath
import numpy as np

EPS = float(np.finfo(float).eps)  # 2.22e-16, one ulp of 1
FIXTURE = Path(__file__).parent / "fixtures" / "references.json"


@lru_cache(maxsize=None)
def references() -> dict:
    """The JSON written by tests/fixtures/make_references.py (mpmath, 50 digits)."""
    return json.loads(FIXTURE.read_text())


def period_cases():
    """(amplitude float, T/T0 mpf, T/T0 - 1 mpf) for every stored amplitude."""
    with mpmath.workdps(60):
        return [(float.fromhex(r["amplitude_hex"]), mpmath.mpf(r["period_ratio"]),
                 mpmath.mpf(r["period_excess"])) for r in references()["period_ratio"]]


def mp_period_ratio(a, dps=40):
    """(2/pi) K(sin^2(A/2)) with mpmath at exactly mpf(a) (A&S 17.2; DLMF 19.2.8).

    At least 60 digits: for the last floats below pi, 1 - m is 1e-33 and must survive.
    """
    with mpmath.workdps(max(dps, 60)):
        return 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(mpmath.mpf(a) / 2) ** 2)


def rel(got, want) -> float:
    """|got - want| / |want| evaluated in mpmath (want may be an mpf)."""
    with mpmath.workdps(40):
        want = mpmath.mpf(want)
        return float(abs(mpmath.mpf(got) - want) / abs(want))


def pendulum_rhs(omega0_sq):
    def rhs(_t, y):
        return [y[1], -omega0_sq * math.sin(y[0])]
    return rhs


def integrate(theta0, omega0_dot, times, length, gravity, rtol=1e-12, atol=1e-12):
    """theta(t), omega(t) of theta'' = -(g/L) sin theta by scipy DOP853 at the given tolerances.

    Times may be negative (then it integrates backwards); they are sorted internally.
    """
    from scipy.integrate import solve_ivp

    times = np.asarray(times, dtype=float)
    out_th = np.empty_like(times)
    out_om = np.empty_like(times)
    for sign in (1.0, -1.0):
        sel = (times >= 0.0) if sign > 0 else (times < 0.0)
        if not np.any(sel):
            continue
        ts = times[sel]
        order = np.argsort(sign * ts)
        t_end = ts[order][-1]
        if t_end == 0.0:
            out_th[sel] = theta0
            out_om[sel] = omega0_dot
            continue
        sol = solve_ivp(pendulum_rhs(gravity / length), (0.0, t_end), [theta0, omega0_dot],
                        method="DOP853", rtol=rtol, atol=atol, dense_output=True)
        assert sol.success, sol.message
        y = sol.sol(ts)
        out_th[sel] = y[0]
        out_om[sel] = y[1]
    return out_th, out_om


def mp_libration_state(theta0, omegadot0, t, length, gravity, dps=40):
    """Exact theta(t), omega(t) of a libration by mpmath (own phase computation).

    Energy: h = (omega/(2 omega0))^2 + sin^2(theta/2) < 1, m = h, k = sqrt(h).
    sin(theta/2) = k sn(u|m), cos(theta/2) = dn(u|m), omega = 2 omega0 k cn(u|m),
    u = omega0 t + u0 with u0 = F(asin(s/k) | m) while rising (omega >= 0) and 2K - F
    while falling (Lawden, Elliptic Functions and Applications, 1989, §5.2; DLMF 22.19.2).
    """
    with mpmath.workdps(dps):
        th, om = mpmath.mpf(theta0), mpmath.mpf(omegadot0)
        L, g = mpmath.mpf(length), mpmath.mpf(gravity)
        w0 = mpmath.sqrt(g / L)
        w = om / (2 * w0)
        s = mpmath.sin(th / 2)
        h = w * w + s * s
        k = mpmath.sqrt(h)
        phi = mpmath.asin(s / k)
        f = mpmath.ellipf(phi, h)
        u0 = f if om >= 0 else 2 * mpmath.ellipk(h) - f
        u = w0 * mpmath.mpf(t) + u0
        sn = mpmath.ellipfun("sn", u, m=h)
        cn = mpmath.ellipfun("cn", u, m=h)
        theta = 2 * mpmath.asin(k * sn)
        return theta, 2 * w0 * k * cn


def mp_rotation_state(theta0, omegadot0, t, length, gravity, dps=40):
    """Exact unwrapped theta(t), omega(t) of a rotation by mpmath, for |theta0| <= pi.

    theta/2 = am(v | 1/h), omega = 2 omega0 sqrt(h) dn(v | 1/h), v = sqrt(h) omega0 t + v0,
    v0 = F(theta0/2 | 1/h) for omega > 0; the other direction is the mirror image
    (Lawden 1989 §5.2; DLMF 22.16.1). am is unwrapped with am(v + 2K) = am(v) + pi.
    """
    with mpmath.workdps(dps):
        th, om = mpmath.mpf(theta0), mpmath.mpf(omegadot0)
        sign = 1 if om > 0 else -1
        th, om = sign * th, sign * om
        L, g = mpmath.mpf(length), mpmath.mpf(gravity)
        w0 = mpmath.sqrt(g / L)
        w = om / (2 * w0)
        h = w * w + mpmath.sin(th / 2) ** 2
        m = 1 / h
        K = mpmath.ellipk(m)
        v0 = mpmath.ellipf(th / 2, m)
        v = mpmath.sqrt(h) * w0 * mpmath.mpf(t) + v0
        n = mpmath.nint(v / (2 * K))
        r = v - 2 * K * n
        sn = mpmath.ellipfun("sn", r, m=m)
        cn = mpmath.ellipfun("cn", r, m=m)
        dn = mpmath.ellipfun("dn", r, m=m)
        half = n * mpmath.pi + mpmath.atan2(sn, cn)
        return sign * 2 * half, sign * 2 * w0 * mpmath.sqrt(h) * dn
