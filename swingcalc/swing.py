"""Exact conservative swing of the simple pendulum: period, regimes, time history, harmonics.

Inputs are SI floats or numpy arrays and angles in radians. Scalars in give floats out,
arrays in give arrays out. The equations, their assumptions and sources are in
``docs/methods/exact-swing.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import lru_cache

import numpy as np
from scipy import special

from ._validate import (amplitude_scalar, amplitudes, finalize,
                        finite_result, positive_array, positive_scalar, real_array,
                        real_scalar)
from .constants import STANDARD_GRAVITY
from .errors import MISSING, InvalidInput, SolverFailure
from .kernels import swing as _k
from .kernels.parallel import blockwise

__all__ = [
    "Regime",
    "SwingState",
    "TimeHistory",
    "natural_angular_frequency",
    "small_angle_period",
    "period_ratio",
    "period_excess",
    "period",
    "rotation_period_ratio",
    "rotation_period",
    "amplitude_for_period_ratio",
    "amplitude_for_period_excess",
    "max_period_excess",
    "time_from_bottom",
    "harmonic_ratio",
    "classify",
    "swing_history",
]

_TWO_OVER_PI = 2.0 / math.pi


_LG_ALLOWED = "a length and a gravity whose ratio sqrt(g/L) is a finite positive number"


class Regime:
    """Names of the kinds of motion :func:`classify` reports."""

    REST = "rest"
    LIBRATION = "libration"
    SEPARATRIX = "separatrix"
    BALANCED = "balanced"
    ROTATION = "rotation"


def natural_angular_frequency(length, gravity=STANDARD_GRAVITY):
    """omega0 = sqrt(g / L) [rad/s] of the linearised pendulum.

    Parameters
    ----------
    length : float or ndarray
        Pivot to bob centre [m], > 0.
    gravity : float or ndarray
        Acceleration of gravity [m/s^2], > 0.
    """
    L, s1 = positive_array(length, "length", "m")
    g, s2 = positive_array(gravity, "gravity", "m/s^2")
    with np.errstate(over="ignore", divide="ignore", under="ignore"):
        omega0 = np.sqrt(g / L)
        period_scale = 1.0 / omega0
    finite_result([omega0, period_scale], "length/gravity", _LG_ALLOWED)
    if np.any(omega0 == 0.0):
        raise InvalidInput("length/gravity", MISSING, _LG_ALLOWED, "sqrt(g/L) underflows to 0")
    return finalize(omega0, s1 and s2)


def small_angle_period(length, gravity=STANDARD_GRAVITY):
    """Small-angle period T0 = 2 pi sqrt(L / g) [s].

    Examples
    --------
    >>> round(small_angle_period(0.993621385566), 9)   # seconds pendulum at g_n
    2.0
    """
    omega0 = natural_angular_frequency(length, gravity)
    return 2.0 * np.pi / omega0


def period_ratio(amplitude):
    """Exact period over the small-angle period, T/T0, for a libration amplitude.

    Parameters
    ----------
    amplitude : float or array_like
        Amplitude theta0 [rad], in [0, pi).

    Returns
    -------
    float or ndarray
        T/T0 = (2/pi) K(m), m = sin^2(theta0/2) (>= 1).

    Notes
    -----
    K is evaluated from the complementary parameter p = cos^2(theta0/2) with
    ``scipy.special.ellipkm1``, so amplitudes within 1e-9 rad of the inverted position
    keep full accuracy (the direct K(sin^2(theta0/2)) loses four or more digits there).
    Source: A&S 17.2.2 / DLMF 19.2.8 with the pendulum period, e.g. Lawden, *Elliptic
    Functions and Applications* (1989) §5.2.

    Examples
    --------
    >>> round(period_ratio(math.pi / 2), 12)
    1.180340599016
    """
    a, scalar = amplitudes(amplitude)
    if scalar:
        c = math.cos(0.5 * float(a))
        return _TWO_OVER_PI * float(special.ellipkm1(c * c))
    flat = np.ascontiguousarray(a).reshape(-1)
    return blockwise(_period_ratio_block, flat).reshape(a.shape)


def _period_ratio_block(a, out):
    np.multiply(a, 0.5, out=out)
    np.cos(out, out=out)
    np.multiply(out, out, out=out)
    special.ellipkm1(out, out=out)
    np.multiply(out, _TWO_OVER_PI, out=out)


def period_excess(amplitude):
    """T/T0 - 1, accurate to full relative precision also at tiny amplitudes.

    Parameters
    ----------
    amplitude : float or array_like
        Amplitude [rad], in [0, pi).

    Notes
    -----
    Below m = 0.5 (amplitude 90 deg) it is summed from (2/pi) K(m) - 1 =
    sum_{n>=1} [(2n)!/(4^n n!^2)]^2 m^n (A&S 17.3.11), which avoids the cancellation of
    ``period_ratio(a) - 1`` (that loses all digits below about 1e-8 rad).
    """
    a, scalar = amplitudes(amplitude)
    m, p = _k.amplitude_parameters(a)
    return finalize(_k.period_excess(m, p), scalar)


def period(length, amplitude, gravity=STANDARD_GRAVITY):
    """Exact period T [s] of a simple pendulum swinging at ``amplitude``.

    Parameters
    ----------
    length : float or ndarray
        Pivot to bob centre [m].
    amplitude : float or ndarray
        Amplitude [rad], in [0, pi).
    gravity : float or ndarray
        [m/s^2].

    Examples
    --------
    >>> round(period(2.0, math.radians(30), 9.80), 6)   # Young & Freedman 14th ed. 14.51
    2.887868
    """
    t0 = small_angle_period(length, gravity)
    ratio = period_ratio(amplitude)
    return t0 * ratio


def rotation_period_ratio(energy_ratio):
    """Period of one revolution over T0 in the over-the-top regime.

    Parameters
    ----------
    energy_ratio : float or array_like
        h = E / E_sep > 1, the energy measured from the bottom over the separatrix
        energy 2 m g L (so h = v_bottom^2 / (4 g L)).

    Notes
    -----
    T_rev / T0 = K(1/h) / (pi sqrt(h)), from theta/2 = am(sqrt(h) omega0 t | 1/h)
    (Lawden 1989 §5.2). The complement 1 - 1/h = (h - 1)/h uses 1 - h, exact in floating
    point for h <= 2; a float h next to 1 carries its own rounding, so for states next to
    the separatrix use :func:`rotation_period` or :func:`classify`, which form 1 - h from
    the speed without cancellation.
    """
    h, scalar = real_array(energy_ratio, "energy_ratio",
                           "a finite energy ratio E/E_sep > 1", low=1.0, low_open=True)
    return finalize(_k.rotation_ratio(h, 1.0 - h), scalar)


def rotation_period(length, bottom_speed, gravity=STANDARD_GRAVITY):
    """Period of one full revolution [s] for a bob passing the bottom at ``bottom_speed``.

    Parameters
    ----------
    length : float
        Pivot to bob centre [m].
    bottom_speed : float or array_like
        Bob speed at the bottom [m/s], > 2 sqrt(g L) (faster than the separatrix).
    gravity : float
        [m/s^2].
    """
    L = positive_scalar(length, "length", "m")
    omega0 = natural_angular_frequency(L, gravity)
    v, scalar = real_array(bottom_speed, "bottom_speed", "a finite speed [m/s]")
    w = np.abs(v) / (2.0 * omega0 * L)
    if np.any(w <= 1.0):
        raise InvalidInput("bottom_speed", float(np.min(np.abs(v))),
                           f"a speed above the separatrix speed 2 sqrt(g L) = "
                           f"{2.0 * omega0 * L:.6g} m/s", "too slow to go over the top")
    with np.errstate(over="ignore"):
        h = w * w
        q = (1.0 - w) * (1.0 + w)
    finite_result([h, q], "bottom_speed", "a finite speed whose square is a finite number")
    return finalize(2.0 * np.pi / omega0 * _k.rotation_ratio(h, q), scalar)


def amplitude_for_period_excess(excess):
    """The libration amplitude [rad] whose T/T0 - 1 equals ``excess`` (>= 0).

    Solved by safeguarded Newton iteration in x = ln(m/p), in which the problem is
    close to linear at both ends (excess ~ m/4 ~ e^x/4 for small amplitudes, T/T0 ~
    (x + ln 16)/pi near the separatrix), with bisection when a step leaves the bracket;
    the amplitude is 2 atan(exp(x/2)).
    """
    top = max_period_excess()
    e, scalar = real_array(excess, "period_excess",
                           f"a finite excess T/T0 - 1 in [0, {top:.6g}] (a larger one needs an "
                           "amplitude that rounds to 180 deg)", low=0.0, high=top)
    e_flat = np.atleast_1d(e).astype(float).ravel()
    out = np.zeros_like(e_flat)
    live = e_flat > 0.0
    if np.any(live):
        out[live] = _solve_logit(e_flat[live])
    out = out.reshape(np.shape(e))
    return finalize(out, scalar)


# x = ln(m/p) spans m from the smallest normal float to the largest amplitude below pi.
_X_LOW, _X_HIGH = -745.0, 2.0 * math.log(math.tan(0.5 * math.nextafter(math.pi, 0.0)))


@lru_cache(maxsize=None)
def max_period_excess() -> float:
    """T/T0 - 1 at the largest float amplitude below pi (22.67): no larger one exists."""
    return float(_k.excess_for_logit(np.array([_X_HIGH]))[0][0])


def _solve_logit(e):
    lo = np.full_like(e, _X_LOW)
    hi = np.full_like(e, _X_HIGH)
    # Starting guesses from the two asymptotes: e ~ m/4 and 1 + e ~ (x + ln 16)/pi.
    x = np.where(e < 0.125, np.log(4.0 * e) - np.log1p(-4.0 * np.minimum(e, 0.2)),
                 np.pi * (1.0 + e) - math.log(16.0))
    x = np.clip(x, lo, hi)
    for _ in range(100):
        f, slope, _, _ = _k.excess_for_logit(x)
        resid = f - e
        lo = np.where(resid < 0.0, x, lo)
        hi = np.where(resid > 0.0, x, hi)
        with np.errstate(divide="ignore", invalid="ignore"):
            step = resid / slope
        x_new = x - step
        outside = ~((x_new > lo) & (x_new < hi)) | ~np.isfinite(x_new)
        x_new = np.where(outside, 0.5 * (lo + hi), x_new)
        x_new = np.where(resid == 0.0, x, x_new)
        done = np.abs(x_new - x) <= 4.0 * np.finfo(float).eps * np.maximum(1.0, np.abs(x))
        x = x_new
        if np.all(done | (resid == 0.0)):
            break
    else:
        raise SolverFailure("amplitude_for_period_ratio: Newton iteration did not converge")
    return 2.0 * np.arctan(np.exp(0.5 * x))


def amplitude_for_period_ratio(ratio):
    """The libration amplitude [rad] whose exact period is ``ratio`` times T0.

    Parameters
    ----------
    ratio : float or array_like
        T/T0 >= 1.

    Examples
    --------
    >>> round(math.degrees(amplitude_for_period_ratio(1.01)), 9)   # REFERENCES: 22.8138492619572
    22.813849262
    """
    top = 1.0 + max_period_excess()
    r, scalar = real_array(ratio, "period ratio",
                           f"a finite ratio T/T0 in [1, {top:.6g}] (a larger one needs an "
                           "amplitude that rounds to 180 deg)", low=1.0, high=top)
    return amplitude_for_period_excess(r - 1.0) if not scalar else \
        float(amplitude_for_period_excess(float(r) - 1.0))


def time_from_bottom(angle, length, *, amplitude=None, bottom_speed=None,
                     gravity=STANDARD_GRAVITY):
    """Time [s] to swing from the bottom to ``angle`` (give the amplitude or the bottom speed).

    Parameters
    ----------
    angle : float or array_like
        Target angle from the downward vertical [rad], |angle| <= pi, reachable.
    length : float
        Pivot to bob centre [m].
    amplitude : float, optional
        Libration amplitude [rad] in [0, pi).
    bottom_speed : float, optional
        Bob speed at the bottom [m/s] (libration, separatrix or rotation).
    gravity : float
        [m/s^2].

    Notes
    -----
    t = (1/omega0) s R_F(h c^2, h - s^2, h), s = sin(angle/2), c = cos(angle/2), h the
    energy over the separatrix energy (DLMF 19.25.5, 19.16.1). It grows without bound,
    as ln(1 / |1 - h|) / 2 / omega0 for angles near the top, when h -> 1.
    """
    if (amplitude is None) == (bottom_speed is None):
        raise InvalidInput("amplitude/bottom_speed", MISSING,
                           "exactly one of amplitude or bottom_speed", "give one of them")
    L = positive_scalar(length, "length", "m")
    omega0 = natural_angular_frequency(L, gravity)
    th, scalar = real_array(angle, "angle", "a finite angle in [-pi, pi] rad",
                            low=-math.pi, high=math.pi)
    half = 0.5 * np.abs(th)
    s = np.sin(half)
    c = np.cos(half)
    if amplitude is not None:
        a = amplitude_scalar(amplitude)
        if np.any(np.abs(th) > a):
            raise InvalidInput("angle", float(np.max(np.abs(th))),
                               f"|angle| <= amplitude = {a:.17g} rad", "never reached")
        h = math.sin(0.5 * a) ** 2
        gap = np.sin(0.5 * (a - np.abs(th))) * np.sin(0.5 * (a + np.abs(th)))
    else:
        v = real_scalar(bottom_speed, "bottom_speed", "a finite speed [m/s]")
        w = abs(v) / (2.0 * omega0 * L)
        with np.errstate(over="ignore"):
            h = w * w
        finite_result([h], "bottom_speed", "a finite speed whose square is a finite number")
        gap = (w - s) * (w + s)
        if np.any(gap < 0.0):
            raise InvalidInput("angle", float(np.max(np.abs(th))),
                               "an angle the bob reaches at this bottom speed", "never reached")
    tau = _k.time_from_bottom(s, gap, h, c)
    return finalize(np.sign(th) * tau / omega0, scalar)


def harmonic_ratio(amplitude, order=3):
    """Amplitude of the odd harmonic ``order`` of theta(t) relative to the fundamental.

    Parameters
    ----------
    amplitude : float or array_like
        Libration amplitude [rad] in [0, pi).
    order : int
        Odd harmonic number >= 1 (3 and 5 are the usual ones).

    Notes
    -----
    From the Fourier series of the libration angle in the nome q (Lawden 1989, §5.2;
    the sn series is DLMF 22.11.1): a_N / a_1 = q^((N-1)/2) (1 + q) / (N (1 + q^N)). For
    small amplitudes q ~ m/16, so a_3/a_1 ~ theta0^2 / 192.
    """
    if not (isinstance(order, (int, np.integer)) and order >= 1 and order % 2 == 1):
        raise InvalidInput("order", order,
                           "an odd integer >= 1 (the libration angle has only odd harmonics)")
    a, scalar = amplitudes(amplitude)
    m, p = _k.amplitude_parameters(a)
    return finalize(_k.harmonic_ratio(m, p, int(order)), scalar)


@dataclass(frozen=True)
class SwingState:
    """What an initial state (angle, angular velocity) of a simple pendulum will do.

    Attributes
    ----------
    regime : str
        One of :class:`Regime`: ``rest``, ``libration``, ``separatrix``, ``balanced``
        (at rest on top), ``rotation``.
    energy_ratio : float
        h = E / E_sep, E measured from the bottom, E_sep = 2 m g L.
    separatrix_margin : float
        1 - h, formed without cancellation (> 0 in libration, < 0 in rotation).
    amplitude_rad : float or None
        Libration amplitude [rad] (0 at rest, pi on the separatrix), None in rotation.
    bottom_angular_speed_rad_s : float
        |omega| at the bottom [rad/s].
    top_angular_speed_rad_s : float or None
        |omega| at the top in rotation [rad/s], None otherwise.
    period_s : float
        Libration period, or the time of one revolution, of the exact state (also
        inside the tolerance band, where it is huge and as sensitive as the state);
        inf only exactly on the separatrix; the small-angle period exactly at rest.
    direction : int
        +1 or -1 for the sense of a rotation, 0 otherwise.
    """

    regime: str
    angle_rad: float
    angular_velocity_rad_s: float
    length_m: float
    gravity_m_s2: float
    tolerance: float
    energy_ratio: float
    separatrix_margin: float
    amplitude_rad: float | None
    bottom_angular_speed_rad_s: float
    top_angular_speed_rad_s: float | None
    period_s: float
    direction: int
    message: str = field(default="")

    def history(self, times):
        """The exact time history from this state; see :func:`swing_history`."""
        return swing_history(self.angle_rad, self.angular_velocity_rad_s, times,
                             self.length_m, self.gravity_m_s2)

    def to_dict(self) -> dict:
        """Plain dict, SI values, units in the key names."""
        return dict(self.__dict__)


def classify(angle, angular_velocity, length, gravity=STANDARD_GRAVITY, tolerance=1e-14):
    """Classify the motion that starts from ``(angle, angular_velocity)``.

    Parameters
    ----------
    angle : float
        Angle from the downward vertical [rad] (any real; 2 pi periodic).
    angular_velocity : float
        [rad/s].
    length : float
        Pivot to bob centre [m].
    gravity : float
        [m/s^2].
    tolerance : float
        Band on the energy ratio h = E/E_sep within which the state counts as on the
        separatrix (|1 - h| <= tolerance) or at rest (h <= tolerance). The default,
        1e-14, is about 50 times the rounding of h itself, so only states on the
        separatrix to within rounding count as on it; as an angle from the top it is
        2 sqrt(tolerance) = 2e-7 rad.

    Returns
    -------
    SwingState
    """
    th = real_scalar(angle, "angle", "a finite angle [rad]")
    om = real_scalar(angular_velocity, "angular_velocity", "a finite angular velocity [rad/s]")
    L = positive_scalar(length, "length", "m")
    g = positive_scalar(gravity, "gravity", "m/s^2")
    tol = real_scalar(tolerance, "tolerance", "a finite tolerance in [0, 0.5)", low=0.0,
                      high=0.5, high_open=True)
    omega0 = natural_angular_frequency(L, g)
    t0 = 2.0 * math.pi / omega0
    w = om / (2.0 * omega0)
    s, c, h, q = (float(v) for v in _k.state_parameters(th, w))
    finite_result([h, q], "angular_velocity",
                  "an angular velocity whose kinetic energy is a finite number")
    bottom = 2.0 * omega0 * math.sqrt(h)
    top = None
    direction = 0
    amplitude = None
    # The regime comes from the tolerance; the numbers are always the exact ones of the
    # state, also inside the tolerance band (they agree with swing_history).
    if q > 0.0:
        amplitude = 2.0 * math.atan2(math.sqrt(h), math.sqrt(q))
        per = t0 * float(_k.period_ratio(q))
    elif q < 0.0:
        direction = 1 if om > 0 else -1
        top = 2.0 * omega0 * math.sqrt(-q)
        per = t0 * float(_k.rotation_ratio(h, q))
    else:
        amplitude, per = math.pi, math.inf
    if h <= tol:
        regime = Regime.REST
        per = t0 if h == 0.0 else per
        amplitude, direction = (amplitude or 0.0), 0
        message = f"at rest at the bottom (energy ratio {h:.3g} <= {tol:.3g})"
    elif abs(q) <= tol:
        regime = Regime.BALANCED if w * w <= tol else Regime.SEPARATRIX
        where = "balanced at the top" if regime == Regime.BALANCED else "on the separatrix"
        message = (f"{where}: |1 - E/E_sep| = {abs(q):.3g} <= {tol:.3g}; the exact period "
                   f"of this state ({per:.6g} s) is as sensitive to it as the state is "
                   "to any disturbance")
    elif q > 0.0:
        regime = Regime.LIBRATION
        message = f"libration, amplitude {math.degrees(amplitude):.10g} deg"
    else:
        regime = Regime.ROTATION
        message = f"rotation ({'+' if direction > 0 else '-'}), over the top"
    return SwingState(regime=regime, angle_rad=th, angular_velocity_rad_s=om, length_m=L,
                      gravity_m_s2=g, tolerance=tol, energy_ratio=h, separatrix_margin=q,
                      amplitude_rad=amplitude, bottom_angular_speed_rad_s=bottom,
                      top_angular_speed_rad_s=top, period_s=per, direction=direction,
                      message=message)


def _reduced_half_angle(theta):
    """sin and cos of theta_r / 2 for theta = theta_r + 2 pi n with |theta_r| <= pi, and n.

    Taken from sin(theta/2), cos(theta/2) of the float theta itself (the libm reduction
    is exact) times (-1)^n, never from theta - 2 pi n in floating point: 2 * math.pi is
    2.4e-16 short of 2 pi, which would put a start at math.pi (1.2e-16 below the top)
    on the far side of it.
    """
    s = math.sin(0.5 * theta)
    c = math.cos(0.5 * theta)
    n = round(theta / (2.0 * math.pi))
    if n % 2:
        s, c = -s, -c
    if c < 0.0:  # theta_r beyond +-pi: one turn more (or less)
        n += 1 if s > 0.0 else -1
        s, c = -s, -c
    return s, c, n


@dataclass(frozen=True)
class TimeHistory:
    """Exact time history of a conservative swing.

    Attributes
    ----------
    time_s, angle_rad, angular_velocity_rad_s : ndarray
        Samples; in rotation the angle is unwrapped (it grows by 2 pi per revolution).
    regime : str
        The regime of the motion (see :class:`Regime`).
    """

    time_s: np.ndarray
    angle_rad: np.ndarray
    angular_velocity_rad_s: np.ndarray
    regime: str

    def to_dict(self) -> dict:
        return {"regime": self.regime, "time_s": self.time_s.tolist(),
                "angle_rad": self.angle_rad.tolist(),
                "angular_velocity_rad_s": self.angular_velocity_rad_s.tolist()}


def swing_history(angle, angular_velocity, times, length, gravity=STANDARD_GRAVITY):
    """Exact theta(t), omega(t) from Jacobi elliptic functions, in both regimes.

    Parameters
    ----------
    angle, angular_velocity : float
        Initial state at t = 0 [rad], [rad/s].
    times : array_like
        Times [s] (any real values, in any order; negative times run backwards).
    length : float
        [m].
    gravity : float
        [m/s^2].

    Returns
    -------
    TimeHistory

    Notes
    -----
    Libration: sin(theta/2) = k sn(u|m), cos(theta/2) = dn(u|m), omega = 2 k omega0 cn(u|m),
    m = k^2 = h, u = omega0 t + u0. Rotation: theta/2 = am(v | 1/h),
    omega = 2 omega0 sqrt(h) dn(v | 1/h), v = sqrt(h) omega0 t + v0 (Lawden 1989 §5.2;
    DLMF 22.19.2). The phases u0, v0 come from Carlson's R_F; the Jacobi functions are
    evaluated with the argument reduced to a quarter period and the complementary
    parameter passed in (see ``kernels/elliptic.py``), so long times and states next to
    the separatrix stay accurate.
    """
    state = classify(angle, angular_velocity, length, gravity, tolerance=0.0)
    t, _ = real_array(times, "times", "finite times [s]")
    t = np.atleast_1d(t).astype(float)
    omega0 = natural_angular_frequency(state.length_m, state.gravity_m_s2)
    with np.errstate(over="ignore"):
        tau = omega0 * t
    finite_result([tau], "times", "times whose phase omega0 t is a finite number")
    th0 = state.angle_rad
    w = state.angular_velocity_rad_s / (2.0 * omega0)
    s, c, turns = _reduced_half_angle(th0)
    h, q = state.energy_ratio, state.separatrix_margin
    if h == 0.0 or (q == 0.0 and w == 0.0):
        theta = np.full_like(t, th0)
        wt = np.zeros_like(t)
    elif q >= 0.0:
        # On the separatrix the motion runs one way only; a state moving backwards is
        # the mirror image (theta, omega) -> (-theta, -omega) of one moving forwards.
        mirror = -1.0 if (q == 0.0 and w < 0.0) else 1.0
        theta, wt = _k.libration_history(tau, mirror * s, c, mirror * w, h, q)
        theta = mirror * theta + 2.0 * math.pi * turns
        wt = mirror * wt
    else:
        theta, wt = _k.rotation_history(tau, s, c, w, h, q, turns)
    return TimeHistory(time_s=t, angle_rad=np.asarray(theta, dtype=float),
                       angular_velocity_rad_s=2.0 * omega0 * np.asarray(wt, dtype=float),
                       regime=state.regime)
