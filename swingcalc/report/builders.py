"""Build reports from library results. The commands call these; no maths lives in the CLI."""

from __future__ import annotations

import math

import numpy as np

from .. import (classify, clock_rate_error, harmonic_ratio, peak_speed_error,
                peak_tension_error, period_excess, period_ratio, period_ratio_bounds, phase_error,
                series_period_error, series_period_ratio, small_angle_check,
                small_angle_period, small_angle_period_error, swing_history)
from ..errors import MISSING, InvalidInput
from ..linear import SERIES_TERMS
from .cautions import cautions_for
from .model import Column, Item, Report, Table, amplitude_text

__all__ = ["MAX_HISTORY_SAMPLES", "periods_report", "small_angle_report",
           "motion_report"]

_DEG = 180.0 / math.pi
_PCT = dict(unit="%", scale=100.0, fmt="#.3g")
# Up to this many cases a text table shows one column per case (quantities down the side).
_TRANSPOSE_MAX = 8
_ERROR_NOTE = ("Errors are (approximation - exact) / exact: negative means the "
               "approximation is short.")


#: Most samples of a time history.
MAX_HISTORY_SAMPLES = 10_000


def _deg_value(a: float) -> float:
    """Degrees for display columns, rounded to 12 digits (30, not 29.999999999999996),
    but never up to 180 (an amplitude is below it)."""
    d = float(f"{a * _DEG:.12g}")
    return d if d < 180.0 or a * _DEG >= 180.0 else a * _DEG


def _deg(a: float) -> str:
    """An amplitude [rad] as degrees for notes and warnings (as many digits as the table)."""
    return amplitude_text(_deg_value(a))


def _limit_text(degrees: float) -> str:
    """A computed amplitude limit: 6 digits are plenty (the inputs get 10)."""
    return amplitude_text(degrees, 6)


def _amplitude_columns() -> list[Column]:
    return [Column("amplitude_deg", "amplitude", "deg", fmt=amplitude_text),
            Column("amplitude_rad", "amplitude", "rad", in_text=False)]


def _floats(values) -> list[float]:
    """Python floats from a library array (numpy scalars would print as np.float64(...))."""
    return np.asarray(values, dtype=float).tolist()


def periods_report(amplitudes, length: float, gravity: float, gravity_given: str = "") -> Report:
    """Amplitude-dependent period table: exact, small-angle, series and bounds."""
    t0 = small_angle_period(length, gravity)
    cols = _amplitude_columns() + [
        Column("period_ratio", "T / T0", "", fmt=".8f"),
        Column("period_s", "period T", "s", fmt="#.7g"),
        Column("small_angle_period_s", "small-angle period T0", "s", in_text=False),
        Column("small_angle_period_error_rel", "T0 error", **_PCT)]
    for n in SERIES_TERMS:
        cols += [Column(f"series_{n}_terms_period_ratio", f"{n}-term series T/T0", "",
                        fmt=".8f", in_text=False),
                 Column(f"series_{n}_terms_error_rel", f"{n}-term error", **_PCT)]
    cols += [Column("bound_lower_period_ratio", "T/T0 lower bound", "", fmt=".6f"),
             # grows like 1/cos^2(A/2): significant digits, not fixed decimals
             Column("bound_upper_period_ratio", "T/T0 upper bound", "", fmt="#.7g"),
             Column("agm_bound_lower_period_ratio", "AGM lower bound", "", in_text=False),
             Column("agm_bound_upper_period_ratio", "AGM upper bound", "", in_text=False),
             Column("harmonic_3_rel", "3rd harmonic / fundamental", "%", 100.0, "#.3g",
                    in_text=False),
             Column("harmonic_5_rel", "5th harmonic / fundamental", "%", 100.0, "#.3g",
                    in_text=False)]
    amps = np.asarray(amplitudes, dtype=float)
    ratio = period_ratio(amps)
    columns = [[_deg_value(a) for a in _floats(amps)], _floats(amps), _floats(ratio),
               _floats(t0 * ratio), [t0] * amps.size, _floats(small_angle_period_error(amps))]
    for n in SERIES_TERMS:
        columns += [_floats(series_period_ratio(amps, n)), _floats(series_period_error(amps, n))]
    columns += [_floats(b) for b in period_ratio_bounds(amps, "series")]
    columns += [_floats(b) for b in period_ratio_bounds(amps, "agm")]
    columns += [_floats(harmonic_ratio(amps, n)) for n in (3, 5)]
    rows = list(zip(*columns))
    inputs = [Item("length_m", "length, pivot to bob centre", length, "m", fmt=".6g"),
              Item("gravity_m_s2", "gravity" + (" (standard)" if gravity_given == "standard"
                                                else ""), gravity, "m/s^2", fmt=".6g")]
    summary = [Item("small_angle_period_s", "small-angle period T0 = 2 pi sqrt(L/g)", t0, "s",
                    fmt=".7g")]
    notes = [_ERROR_NOTE,
             "Bounds: 1 + k^2/4 <= T/T0 <= (4 - 3k^2)/(4 - 4k^2), k = sin(amplitude/2); "
             "the AGM bounds (CSV/JSON) are tighter at large amplitudes."]
    return Report("periods", "Period against amplitude (exact elliptic-integral result)",
                  inputs, summary, [Table("periods", "Period and small-angle errors",
                                          tuple(cols), tuple(rows))], notes=notes)


def small_angle_report(amplitudes, tolerance: float, cycles: float) -> Report:
    """Is the small-angle model good enough at these amplitudes?

    The first amplitude goes through :func:`~swingcalc.small_angle_check` (which validates
    the tolerance and cycles and finds the largest amplitude within the tolerance); the
    table columns come from the same library functions applied to all amplitudes at once.
    """
    first = small_angle_check(amplitudes[0], tolerance=tolerance, cycles=cycles)
    tolerance, cycles, limit = first.tolerance_rel, first.cycles, first.max_amplitude_rad
    amps = np.asarray(amplitudes, dtype=float)
    error = small_angle_period_error(amps)
    # the verdict of small_angle_check: |period error| <= tolerance
    acceptable = (np.abs(error) <= tolerance).tolist()
    phase = phase_error(amps, cycles)
    lower, upper = period_ratio_bounds(amps)
    columns = ([[_deg_value(a) for a in _floats(amps)], _floats(amps),
                _floats(1.0 + period_excess(amps)), _floats(error)]
               + [_floats(series_period_error(amps, n)) for n in SERIES_TERMS]
               + [_floats(lower), _floats(upper), _floats(peak_speed_error(amps)),
                  _floats(peak_tension_error(amps)), _floats(phase * _DEG), _floats(phase),
                  _floats(clock_rate_error(amps)), acceptable])
    rows = list(zip(*columns))
    cols = _amplitude_columns() + [
        Column("period_ratio", "T / T0", "", fmt=".8f"),
        Column("period_error_rel", "period error", **_PCT)]
    for n in SERIES_TERMS:
        cols.append(Column(f"series_{n}_terms_error_rel", f"{n}-term series error", **_PCT))
    cols += [Column("bound_lower_period_ratio", "T/T0 lower bound", "", fmt=".8f"),
             Column("bound_upper_period_ratio", "T/T0 upper bound", "", fmt="#.9g"),
             Column("peak_speed_error_rel", "peak speed error", **_PCT),
             Column("peak_tension_error_rel", "peak tension error", **_PCT),
             Column("phase_error_deg", f"phase lead after {cycles:g} cycles", "deg", fmt="#.4g"),
             Column("phase_error_rad", "phase lead", "rad", in_text=False),
             Column("clock_rate_s_per_day", "clock rate", "s/day", fmt="#.4g"),
             Column("within_tolerance", "within tolerance", "")]
    notes = []
    tol_text = f"{tolerance * 100:.3g} %"
    ok = [a for a, good in zip(_floats(amps), acceptable) if good]
    bad = [(a, e) for a, e, good in zip(_floats(amps), _floats(error), acceptable) if not good]
    if not bad:
        verdict = "acceptable"
        notes.append(f"Verdict: ACCEPTABLE. The small-angle period is within {tol_text} at "
                     f"{_listing(ok)} deg (it stays within up to "
                     f"{_limit_text(limit * _DEG)} deg).")
    else:
        verdict = "not acceptable" if not ok else "acceptable at some amplitudes only"
        worst = max(abs(e) for _, e in bad)
        notes.append(f"Verdict: NOT ACCEPTABLE at {_listing(a for a, _ in bad)} deg. The "
                     f"small-angle period is off by up to {worst * 100:.3g} %, more than "
                     f"{tol_text}; it stays within {tol_text} only up to "
                     f"{_limit_text(limit * _DEG)} deg."
                     + (f" Acceptable at {_listing(ok)} deg." if ok else ""))
    notes.append(_ERROR_NOTE + " The phase lead is how far the linear model runs ahead; "
                 "a negative clock rate means a clock regulated to T0 loses.")
    inputs = [Item("tolerance_rel", "accepted period error", tolerance, "%", 100.0, ".3g"),
              Item("cycles", "cycles for the phase error", cycles, "", fmt=".6g")]
    summary = [Item("max_amplitude_rad", "largest amplitude within the tolerance", limit,
                    "deg", _DEG, _limit_text)]
    table = Table("checks", "Errors of the small-angle model", tuple(cols), tuple(rows),
                  transpose=len(rows) <= _TRANSPOSE_MAX)
    return Report("small-angle", f"Small-angle check, period tolerance {tol_text}", inputs,
                  summary, [table], notes=notes,
                  extra={"verdict": verdict, "acceptable": not bad})


def _listing(amplitudes) -> str:
    return ", ".join(_deg(a) for a in amplitudes)


_MOTION_MODEL_NOTE = (
    "Model: a point bob on a light rigid rod about a frictionless pivot, with no air drag. "
    "A flexible suspension (chain, rope) would go slack in a libration above 90 deg, and in "
    "a rotation whose bob speed at the top is below sqrt(g L).")


def motion_report(angle: float, angular_velocity: float | None, length: float, gravity: float,
                  *, bottom_speed: float | None = None, duration: float | None = None,
                  step: float | None = None, times=None) -> Report:
    """Classify an initial state and, given a duration (or times), tabulate its exact
    time history.

    Parameters
    ----------
    angle : float
        Start angle from the downward vertical [rad].
    angular_velocity : float or None
        Start angular velocity [rad/s]; ``None`` with ``bottom_speed``, or for a start at
        rest.
    length, gravity : float
        Pivot to bob centre [m]; [m/s^2].
    bottom_speed : float, optional
        Instead of ``angular_velocity``: the bob speed [m/s] at the start, which must be at
        the bottom (``angle == 0``).
    duration, step : float, optional
        The history runs from 0 to ``duration`` [s] in steps of ``step`` [s] (default
        ``duration / 40``), at most :data:`MAX_HISTORY_SAMPLES` steps.
    times : array_like, optional
        Instead of ``duration``: the times [s] to tabulate.
    """
    if bottom_speed is not None:
        if angular_velocity is not None:
            raise InvalidInput("bottom_speed", bottom_speed, "either angular_velocity or "
                               "bottom_speed", "give only one of them")
        if angle != 0.0:
            raise InvalidInput("angle", angle, "0 with bottom_speed",
                               "bottom_speed starts the swing at the bottom")
        angular_velocity = bottom_speed / length
    omega = 0.0 if angular_velocity is None else angular_velocity
    if duration is not None:
        times = _time_grid(duration, step)
    elif step is not None:
        raise InvalidInput("duration", MISSING, "a duration [s] with step", "step needs duration")
    s = classify(angle, omega, length, gravity)
    inputs = [Item("angle_rad", "start angle", angle, "deg", _DEG, ".6g"),
              Item("angular_velocity_rad_s", "start angular speed", omega,
                   "rad/s", fmt=".6g"),
              Item("length_m", "length, pivot to bob centre", length, "m", fmt=".6g"),
              Item("gravity_m_s2", "gravity", gravity, "m/s^2", fmt=".6g")]
    summary = [Item("regime", "motion", s.regime),
               Item("energy_ratio", "energy / separatrix energy E/E_sep", s.energy_ratio,
                    fmt=".8g"),
               Item("separatrix_margin", "separatrix margin 1 - E/E_sep", s.separatrix_margin,
                    fmt=".6g"),
               Item("amplitude_rad", "amplitude", s.amplitude_rad, "deg", _DEG, amplitude_text),
               Item("bottom_angular_speed_rad_s", "angular speed at the bottom",
                    s.bottom_angular_speed_rad_s, "rad/s", fmt=".6g"),
               Item("bottom_speed_m_s", "bob speed at the bottom",
                    s.bottom_angular_speed_rad_s * length, "m/s", fmt=".6g"),
               Item("top_angular_speed_rad_s", "angular speed at the top",
                    s.top_angular_speed_rad_s, "rad/s", fmt=".6g"),
               Item("period_s", "period" if s.regime != "rotation" else "time per revolution",
                    s.period_s, "s", fmt=".7g")]
    tables = []
    if times is not None:
        h = swing_history(angle, omega, times, length, gravity)
        rows = tuple(zip(_floats(h.time_s), _floats(h.angle_rad * _DEG), _floats(h.angle_rad),
                         _floats(h.angular_velocity_rad_s)))
        tables.append(Table("history", "Exact time history", (
            Column("time_s", "time", "s", fmt=".6g"),
            Column("angle_deg", "angle", "deg", fmt=".4f"),
            Column("angle_rad", "angle", "rad", in_text=False),
            Column("angular_velocity_rad_s", "angular velocity", "rad/s", fmt=".6f")), rows))
    notes = ([s.message] if s.message else []) + [_MOTION_MODEL_NOTE]
    return Report("motion", "Motion from an initial state", inputs, summary, tables,
                  notes=notes, cautions=cautions_for("general", loads=True))


def _time_grid(duration: float, step: float | None) -> np.ndarray:
    """0, step, 2 step, ... up to ``duration`` (included when on the grid within half a step)."""
    for name, value in (("duration", duration), ("step", step)):
        if value is not None and not (math.isfinite(value) and value > 0.0):
            raise InvalidInput(name, value, "a finite time > 0 [s]", "out of range")
    if step is None:
        step = duration / 40.0
    if duration / step > MAX_HISTORY_SAMPLES:
        raise InvalidInput("step", step, f"at most {MAX_HISTORY_SAMPLES} steps over the duration",
                           "too many samples")
    return np.arange(0.0, duration + 0.5 * step, step)
