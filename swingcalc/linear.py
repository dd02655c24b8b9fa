"""How wrong the small-angle (linear) model is: period, series, bounds, speed, load, phase.

Error convention, used by every function here: the relative error of an approximation
X_approx of an exact X is (X_approx - X) / X. The small-angle period is short, so its
error is negative. :func:`max_amplitude_for_period_error` also offers the other common
definition, (T - T0) / T0. Method notes: ``docs/methods/small-angle.md``.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from ._validate import amplitudes, finalize, real_array, real_scalar
from .constants import SECONDS_PER_DAY
from .errors import InvalidInput
from .kernels import swing as _k
from .swing import amplitude_for_period_excess, max_period_excess

__all__ = [
    "SERIES_TERMS",
    "small_angle_period_error",
    "series_period_ratio",
    "series_period_error",
    "period_ratio_bounds",
    "peak_speed_error",
    "peak_tension_error",
    "phase_error",
    "clock_rate_error",
    "rate_against",
    "beats_per_hour",
    "max_amplitude_for_period_error",
    "max_period_error_tolerance",
    "SmallAngleCheck",
    "small_angle_check",
]

#: Series lengths offered, counted with the leading 1: 2 terms is 1 + A^2/16.
SERIES_TERMS = (2, 3, 4)
# Series errors at amplitudes below this are summed from the tail of the series
# (no cancellation). The A^2 series converges like (A/pi)^(2j), so 24 terms leave a
# remainder below 1e-19 of the tail at 1 rad; above it the plain difference keeps
# better than 1e-12 relative accuracy (the 4-term error is then > 1.7e-5).
_TAIL_LIMIT = 1.0
_TAIL_TERMS = 24


def _excess(a):
    return _k.period_excess(*_k.amplitude_parameters(a))


def small_angle_period_error(amplitude):
    """Relative error (T0 - T) / T of the small-angle period (negative: T0 is short).

    Parameters
    ----------
    amplitude : float or array_like
        Amplitude [rad] in [0, pi).
    """
    a, scalar = amplitudes(amplitude)
    e = _excess(a)
    return finalize(-e / (1.0 + e), scalar)


def _check_terms(terms):
    if terms not in SERIES_TERMS:
        raise InvalidInput("terms", terms, "2, 3 or 4 (terms of the series, counting the 1)")


def series_period_ratio(amplitude, terms=3):
    """T/T0 from the first ``terms`` terms of its power series in the amplitude.

    T/T0 = 1 + A^2/16 + 11 A^4/3072 + 173 A^6/737280 + ... (OEIS A223067 / A223068).
    """
    _check_terms(terms)
    a, scalar = amplitudes(amplitude)
    coef = _k.theta_series_coefficients(terms)
    a2 = a * a
    acc = np.zeros_like(a2)
    for c in reversed(coef):
        acc = acc * a2 + float(c)
    return finalize(acc, scalar)


def series_period_error(amplitude, terms=3):
    """Relative error (T_series - T) / T of the ``terms``-term series (negative: short)."""
    _check_terms(terms)
    a, scalar = amplitudes(amplitude)
    excess = _excess(a)
    ratio = 1.0 + excess
    coef = [float(c) for c in _k.theta_series_coefficients(_TAIL_TERMS)]
    a2 = a * a
    head = np.zeros_like(a2)
    for c in reversed(coef[1:terms]):
        head = (head + c) * a2
    out = (head - excess) / ratio

    def tail(a2_small, ratio_small):
        acc = np.zeros_like(a2_small)
        for c in reversed(coef[terms:]):
            acc = (acc + c) * a2_small
        return -acc * a2_small ** (terms - 1) / ratio_small

    out = _k.fill_where(out, a < _TAIL_LIMIT, tail, a2, ratio)
    return finalize(out, scalar)


def period_ratio_bounds(amplitude, method="series", steps=1):
    """Rigorous lower and upper bounds on T/T0.

    Parameters
    ----------
    amplitude : float or array_like
        Amplitude [rad] in [0, pi).
    method : {"series", "agm"}
        ``series``: 1 + k^2/4 <= T/T0 <= (4 - 3k^2) / (4 - 4k^2), k = sin(A/2)
        (Stewart, *Calculus: Early Transcendentals*, 8th ed., §11.11, exercise 38);
        the lower bound is the two-term series in k^2, the upper bounds every further
        coefficient of A&S 17.3.11 by 1/4. Tight at small amplitudes, the upper one
        grows like 1/cos^2(A/2) near the top.
        ``agm``: ``steps`` steps of Gauss's arithmetic-geometric mean,
        T/T0 = 1/AGM(1, cos(A/2)) (DLMF 19.8.5), whose means bracket the limit,
        b_n <= AGM <= a_n, so 1/a_n <= T/T0 <= 1/b_n. One step gives
        2 / (1 + cos(A/2)) <= T/T0 <= 1 / sqrt(cos(A/2)), -0.74 % / +0.75 % at 90 deg;
        the bracket then narrows quadratically (two steps: about 1e-5 at 90 deg).
    steps : int
        AGM steps for ``method="agm"`` (>= 1).

    Returns
    -------
    lower, upper : float or ndarray
    """
    a, scalar = amplitudes(amplitude)
    m, p = _k.amplitude_parameters(a)
    if method == "series":
        lower = 1.0 + 0.25 * m
        with np.errstate(divide="ignore"):
            upper = 1.0 + 0.25 * m / p
    elif method == "agm":
        if not (isinstance(steps, (int, np.integer)) and steps >= 1):
            raise InvalidInput("steps", steps, "an integer number of AGM steps >= 1")
        a_n, b_n = np.ones_like(p), np.sqrt(p)
        for _ in range(int(steps)):
            a_n, b_n = 0.5 * (a_n + b_n), np.sqrt(a_n * b_n)
        lower = 1.0 / a_n
        with np.errstate(divide="ignore"):
            upper = 1.0 / b_n
    else:
        raise InvalidInput("method", method, "'series' or 'agm'")
    return finalize(lower, scalar), finalize(upper, scalar)


def peak_speed_error(amplitude):
    """Relative error of the linear model's peak angular speed omega0 A.

    The exact peak (at the bottom) is 2 omega0 sin(A/2), from energy conservation, so
    the error is (A/2) / sin(A/2) - 1 = (x - sin x) / sin x, x = A/2 (positive: the
    linear model overstates the speed).
    """
    a, scalar = amplitudes(amplitude)
    x = 0.5 * a
    with np.errstate(invalid="ignore", divide="ignore"):
        sinc = np.where(x > 0.0, np.sin(x) / x, 1.0)
    # (x - sin x) / sin x = x^2 [(x - sin x) / x^3] / (sin x / x): no underflow of x^3.
    return finalize(x * x * _k.x_minus_sin_over_cube(x) / sinc, scalar)


def peak_tension_error(amplitude):
    """Relative error of the linear model's peak suspension tension.

    Exact peak tension at the bottom: m g (3 - 2 cos A) = m g (1 + 4 sin^2(A/2)). The
    linear model's estimate is m g + m L (omega0 A)^2 = m g (1 + A^2), the centripetal
    load of its own peak speed. Error: (A^2 - 4 sin^2(A/2)) / (1 + 4 sin^2(A/2)),
    with A - 2 sin(A/2) = 2 (x - sin x) formed without cancellation.
    """
    a, scalar = amplitudes(amplitude)
    x = 0.5 * a
    s = np.sin(x)
    diff = 2.0 * x * x * _k.x_minus_sin_over_cube(x) * (x * (a + 2.0 * s))
    return finalize(diff / (1.0 + 4.0 * s * s), scalar)


def phase_error(amplitude, cycles):
    """Phase [rad] the linear model runs ahead after ``cycles`` exact periods.

    In N periods of the real swing (time N T) the linear model completes N T / T0
    cycles, so it leads by 2 pi N (T/T0 - 1) radians, i.e. by N (T - T0) seconds.
    """
    a, s1 = amplitudes(amplitude)
    n, s2 = real_array(cycles, "cycles", "a finite number of cycles >= 0", low=0.0)
    return finalize(2.0 * np.pi * n * _excess(a), s1 and s2)


def clock_rate_error(amplitude):
    """Rate [s/day] of a clock regulated by the small-angle period but swinging at ``amplitude``.

    Each beat takes T instead of T0, so in a day the clock shows 86400 T0 / T seconds:
    the rate is -86400 (T - T0) / T s/day (negative: the clock loses).
    """
    a, scalar = amplitudes(amplitude)
    e = _excess(a)
    return finalize(-SECONDS_PER_DAY * e / (1.0 + e), scalar)


def rate_against(period, target):
    """Rate [s/day] of a clock whose pendulum swings with ``period`` [s] when its dial
    counts ``target`` [s] per swing: 86400 (target / period - 1), positive when it gains."""
    return SECONDS_PER_DAY * (target / period - 1.0)


def beats_per_hour(period):
    """Beats per hour of a pendulum with ``period`` [s]: two beats (ticks) per period, as
    clockmakers count them (common practice)."""
    return 2.0 * 3600.0 / period


def max_period_error_tolerance(relative_to="exact") -> float:
    """Largest small-angle period error any amplitude below 180 deg reaches.

    0.957759 for ``exact`` ((T - T0)/T = e/(1 + e)) and 22.6736 for ``small_angle``
    ((T - T0)/T0 = e), with e = :func:`~swingcalc.swing.max_period_excess`.
    """
    top = max_period_excess()
    if relative_to == "exact":
        return top / (1.0 + top)
    if relative_to == "small_angle":
        return top
    raise InvalidInput("relative_to", relative_to, "'exact' or 'small_angle'")


def max_amplitude_for_period_error(tolerance, relative_to="exact"):
    """Largest amplitude [rad] at which the small-angle period is within ``tolerance``.

    Parameters
    ----------
    tolerance : float or array_like
        Allowed relative error (0.001 for 0.1 %), in (0, 0.9577] for ``exact`` and
        (0, 22.67] for ``small_angle``: larger errors need an amplitude of 180 deg.
    relative_to : {"exact", "small_angle"}
        ``exact``: |T0 - T| / T <= tolerance (this module's convention);
        ``small_angle``: (T - T0) / T0 <= tolerance.

    Examples
    --------
    >>> round(math.degrees(max_amplitude_for_period_error(0.01)), 9)
    22.927726631
    """
    limit = max_period_error_tolerance(relative_to)
    top = max_period_excess()
    tol, scalar = real_array(
        tolerance, "tolerance",
        f"a finite relative error in (0, {limit:.6g}] (a larger one is never reached "
        "below 180 deg)", low=0.0, high=limit, low_open=True)
    excess = tol / (1.0 - tol) if relative_to == "exact" else tol
    return finalize(amplitude_for_period_excess(np.minimum(excess, top)), scalar)


@dataclass(frozen=True)
class SmallAngleCheck:
    """Is the linear model good enough at this amplitude? All errors relative, signed.

    Attributes
    ----------
    amplitude_rad : float
    tolerance_rel : float
        The accepted relative period error.
    period_error_rel : float
        (T0 - T) / T.
    series_error_rel : dict
        {terms: (T_series - T) / T} for 2, 3 and 4 terms.
    bounds : tuple
        Rigorous (lower, upper) on T/T0, series method.
    period_ratio : float
    peak_speed_error_rel, peak_tension_error_rel : float
    cycles : float
    phase_error_rad : float
        Lead of the linear model after ``cycles`` periods.
    clock_rate_s_per_day : float
    max_amplitude_rad : float
        Largest amplitude within the tolerance.
    acceptable : bool
        |period_error_rel| <= tolerance_rel.
    """

    amplitude_rad: float
    tolerance_rel: float
    period_ratio: float
    period_error_rel: float
    series_error_rel: dict
    bounds: tuple
    peak_speed_error_rel: float
    peak_tension_error_rel: float
    cycles: float
    phase_error_rad: float
    clock_rate_s_per_day: float
    max_amplitude_rad: float
    acceptable: bool
    message: str = field(default="")

    def to_dict(self) -> dict:
        d = dict(self.__dict__)
        d["series_error_rel"] = {f"{k}_terms": v for k, v in self.series_error_rel.items()}
        d["bounds"] = {"lower": self.bounds[0], "upper": self.bounds[1]}
        return d


def small_angle_check(amplitude, tolerance=0.001, cycles=100.0):
    """Every small-angle error at one amplitude, and whether the period error is acceptable.

    Parameters
    ----------
    amplitude : float
        [rad] in [0, pi).
    tolerance : float
        Accepted relative period error, in (0, 0.9577] (see
        :func:`max_period_error_tolerance`). Default 0.1 %.
    cycles : float
        Number of periods for the accumulated phase error (default 100).
    """
    a, scalar = amplitudes(amplitude)
    if not scalar:
        raise InvalidInput("amplitude", amplitude, "a single amplitude [rad]", "not a scalar")
    a = float(a)
    top = max_period_error_tolerance()
    tol = real_scalar(tolerance, "tolerance", f"a finite relative error in (0, {top:.6g}]",
                      low=0.0, high=top, low_open=True)
    n_cycles = real_scalar(cycles, "cycles", "a finite number of cycles >= 0", low=0.0)
    err = small_angle_period_error(a)
    limit = max_amplitude_for_period_error(tol)
    ok = abs(err) <= tol
    msg = (f"the small-angle period is within {tol:.3g} of the exact one"
           if ok else f"the small-angle period is off by {abs(err):.3g}, more than {tol:.3g}")
    return SmallAngleCheck(
        amplitude_rad=a, tolerance_rel=tol,
        period_ratio=1.0 + float(_excess(a)),
        period_error_rel=err,
        series_error_rel={n: series_period_error(a, n) for n in SERIES_TERMS},
        bounds=period_ratio_bounds(a),
        peak_speed_error_rel=peak_speed_error(a),
        peak_tension_error_rel=peak_tension_error(a),
        cycles=n_cycles, phase_error_rad=phase_error(a, n_cycles),
        clock_rate_s_per_day=clock_rate_error(a),
        max_amplitude_rad=limit, acceptable=bool(ok), message=msg)
