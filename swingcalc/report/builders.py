"""Build reports from library results. The commands call these; no maths lives in the CLI."""

from __future__ import annotations

import math

from .. import (classify, clock_rate_error, period_ratio, period_ratio_bounds,
                series_period_error, series_period_ratio, simple_pendulum, small_angle_check,
                small_angle_period, small_angle_period_error, swing_history)
from ..linear import SERIES_TERMS
from .cautions import cautions_for
from .model import Column, Item, Report, Table

__all__ = ["pendulum_report", "periods_report", "small_angle_report", "motion_report"]

_DEG = 180.0 / math.pi
_PCT = dict(unit="%", scale=100.0, fmt="#.3g")
# Up to this many cases a text table shows one column per case (quantities down the side).
_TRANSPOSE_MAX = 8
_ERROR_NOTE = ("Errors are (approximation - exact) / exact: negative means the "
               "approximation is short.")


def _deg_value(a: float) -> float:
    """Degrees for display columns, rounded to 12 digits (30, not 29.999999999999996)."""
    return float(f"{a * _DEG:.12g}")


def _deg(a: float) -> str:
    return format(a * _DEG, ".4g")


def _amplitude_columns() -> list[Column]:
    return [Column("amplitude_deg", "amplitude", "deg", fmt=".4g"),
            Column("amplitude_rad", "amplitude", "rad", in_text=False)]


def pendulum_report(design) -> Report:
    """Simple-pendulum summary of a :class:`~swingcalc.designfile.Design` at each amplitude."""
    b = design.body
    g = design.gravity_m_s2
    results = [simple_pendulum(b.length_m, a, mass=b.bob_mass_kg, gravity=g,
                               suspension=b.suspension) for a in design.amplitudes_rad]
    clock = design.context == "clock"
    flexible = b.suspension == "flexible"
    cols = _amplitude_columns() + [
        Column("period_s", "period T", "s", fmt="#.7g"),
        Column("period_ratio", "T / T0", "", fmt=".7f"),
        Column("small_angle_period_error_rel", "small-angle period error", **_PCT),
        Column("frequency_hz", "frequency", "Hz", fmt="#.6g"),
        Column("beats_per_hour", "beats per hour", "", fmt="#.6g"),
    ]
    if clock:
        cols.append(Column("clock_rate_s_per_day", "rate if regulated to T0", "s/day",
                           fmt="#.4g"))
    cols += [
        Column("peak_angular_speed_rad_s", "peak angular speed", "rad/s", fmt="#.4g"),
        Column("peak_speed_m_s", "peak bob speed", "m/s", fmt="#.4g"),
        Column("peak_tension_N", "peak tension (bottom)", "N", fmt="#.5g"),
        Column("peak_tension_per_weight", "peak tension / weight", "", fmt="#.4g"),
        Column("min_tension_N", "least tension (ends)", "N", fmt="#.5g"),
        Column("energy_J", "swing energy", "J", fmt="#.5g"),
        Column("zero_tension_angle_deg",
               "slack angle" if flexible else "rod in compression beyond", "deg",
               fmt=".4g", missing="never"),
        Column("zero_tension_angle_rad", "zero-tension angle", "rad", in_text=False),
        Column("separatrix_margin", "separatrix margin 1 - E/E_sep", "", fmt="#.4g"),
    ]
    rows, warnings = [], []
    for a, r in zip(design.amplitudes_rad, results):
        z = r.zero_tension_angle_rad
        row = [_deg_value(a), a, r.period_s, r.period_ratio, small_angle_period_error(a),
               r.frequency_hz, r.beats_per_hour]
        if clock:
            row.append(clock_rate_error(a))
        row += [r.peak_angular_speed_rad_s, r.peak_speed_m_s, r.peak_tension_N,
                r.peak_tension_N / (r.mass_kg * r.gravity_m_s2), r.min_tension_N, r.energy_J,
                None if z is None else z * _DEG, z, r.separatrix_margin]
        rows.append(tuple(row))
        warnings += [f"at {_deg(a)} deg amplitude: {w}" for w in r.warnings]
    first = results[0]
    title = f"Simple pendulum: {design.name}" + (f", rev. {design.revision}"
                                                 if design.revision else "")
    inputs = [Item("design_name", "design", design.name),
              Item("design_source", "design file", design.source or "(options)"),
              Item("context", "context", design.context),
              Item("length_m", "length, pivot to bob centre", b.length_m, "m", fmt=".6g"),
              Item("bob_mass_kg", "bob mass", b.bob_mass_kg, "kg", fmt=".6g"),
              Item("suspension", "suspension", b.suspension),
              Item("gravity_m_s2", "gravity" + (" (standard)" if design.gravity_given ==
                                                "standard" else ""), g, "m/s^2", fmt=".6g")]
    summary = [Item("small_angle_period_s", "small-angle period T0", first.small_angle_period_s,
                    "s", fmt=".7g"),
               Item("weight_N", "bob weight (static tension)", b.bob_mass_kg * g, "N", fmt=".5g"),
               Item("over_top_speed_rigid_m_s", "bottom speed for over the top, rigid rod",
                    first.over_top_speed_rigid_m_s, "m/s", fmt=".4g"),
               Item("over_top_speed_flexible_m_s",
                    "bottom speed for over the top, flexible",
                    first.over_top_speed_flexible_m_s, "m/s", fmt=".4g")]
    table = Table("swing", "At each working amplitude", tuple(cols), tuple(rows),
                  transpose=len(rows) <= _TRANSPOSE_MAX)
    return Report("pendulum", title, inputs, summary, [table], notes=[_ERROR_NOTE],
                  warnings=warnings, cautions=cautions_for(design.context, loads=True))


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
             Column("bound_upper_period_ratio", "T/T0 upper bound", "", fmt=".6f"),
             Column("agm_bound_lower_period_ratio", "AGM lower bound", "", in_text=False),
             Column("agm_bound_upper_period_ratio", "AGM upper bound", "", in_text=False)]
    rows = []
    for a in amplitudes:
        ratio = period_ratio(a)
        row = [_deg_value(a), a, ratio, t0 * ratio, t0, small_angle_period_error(a)]
        for n in SERIES_TERMS:
            row += [series_period_ratio(a, n), series_period_error(a, n)]
        lo, hi = period_ratio_bounds(a, "series")
        alo, ahi = period_ratio_bounds(a, "agm")
        rows.append(tuple(row + [lo, hi, alo, ahi]))
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
    """Is the small-angle model good enough at these amplitudes?"""
    checks = [small_angle_check(a, tolerance=tolerance, cycles=cycles) for a in amplitudes]
    cols = _amplitude_columns() + [
        Column("period_ratio", "T / T0", "", fmt=".8f"),
        Column("period_error_rel", "period error", **_PCT)]
    for n in SERIES_TERMS:
        cols.append(Column(f"series_{n}_terms_error_rel", f"{n}-term series error", **_PCT))
    cols += [Column("bound_lower_period_ratio", "T/T0 lower bound", "", fmt=".8f"),
             Column("bound_upper_period_ratio", "T/T0 upper bound", "", fmt=".8f"),
             Column("peak_speed_error_rel", "peak speed error", **_PCT),
             Column("peak_tension_error_rel", "peak tension error", **_PCT),
             Column("phase_error_deg", f"phase lead after {cycles:g} cycles", "deg", fmt="#.4g"),
             Column("phase_error_rad", "phase lead", "rad", in_text=False),
             Column("clock_rate_s_per_day", "clock rate", "s/day", fmt="#.4g"),
             Column("within_tolerance", "within tolerance", "")]
    rows, notes = [], []
    for c in checks:
        row = [_deg_value(c.amplitude_rad), c.amplitude_rad, c.period_ratio, c.period_error_rel]
        row += [c.series_error_rel[n] for n in SERIES_TERMS]
        row += [c.bounds[0], c.bounds[1], c.peak_speed_error_rel, c.peak_tension_error_rel,
                c.phase_error_rad * _DEG, c.phase_error_rad, c.clock_rate_s_per_day,
                c.acceptable]
        rows.append(tuple(row))
    limit = checks[0].max_amplitude_rad
    tol_text = f"{tolerance * 100:.3g} %"
    ok = [c for c in checks if c.acceptable]
    bad = [c for c in checks if not c.acceptable]
    if not bad:
        verdict = "acceptable"
        notes.append(f"Verdict: ACCEPTABLE. The small-angle period is within {tol_text} at "
                     + _listing(checks) + f" deg (it stays within up to {_deg(limit)} deg).")
    else:
        verdict = "not acceptable" if not ok else "acceptable at some amplitudes only"
        worst = max(bad, key=lambda c: abs(c.period_error_rel))
        notes.append(f"Verdict: NOT ACCEPTABLE at {_listing(bad)} deg. The small-angle period "
                     f"is off by up to {abs(worst.period_error_rel) * 100:.3g} %, more than "
                     f"{tol_text}; it stays within {tol_text} only up to {_deg(limit)} deg."
                     + (f" Acceptable at {_listing(ok)} deg." if ok else ""))
    notes.append(_ERROR_NOTE + " The phase lead is how far the linear model runs ahead; "
                 "a negative clock rate means a clock regulated to T0 loses.")
    summary = [Item("tolerance_rel", "accepted period error", tolerance, "%", 100.0, ".3g"),
               Item("cycles", "cycles for the phase error", cycles, "", fmt=".6g"),
               Item("max_amplitude_rad", "largest amplitude within the tolerance", limit,
                    "deg", _DEG, ".6g")]
    table = Table("checks", "Errors of the small-angle model", tuple(cols), tuple(rows),
                  transpose=len(rows) <= _TRANSPOSE_MAX)
    return Report("small-angle", f"Small-angle check, period tolerance {tol_text}", [],
                  summary, [table], notes=notes,
                  extra={"verdict": verdict, "acceptable": not bad})


def _listing(checks) -> str:
    return ", ".join(_deg(c.amplitude_rad) for c in checks)


def motion_report(angle: float, angular_velocity: float, length: float, gravity: float,
                  times=None) -> Report:
    """Classify an initial state and, given times, tabulate its exact time history."""
    s = classify(angle, angular_velocity, length, gravity)
    inputs = [Item("angle_rad", "start angle", angle, "deg", _DEG, ".6g"),
              Item("angular_velocity_rad_s", "start angular speed", angular_velocity,
                   "rad/s", fmt=".6g"),
              Item("length_m", "length, pivot to bob centre", length, "m", fmt=".6g"),
              Item("gravity_m_s2", "gravity", gravity, "m/s^2", fmt=".6g")]
    summary = [Item("regime", "motion", s.regime),
               Item("energy_ratio", "energy / separatrix energy E/E_sep", s.energy_ratio,
                    fmt=".8g"),
               Item("separatrix_margin", "separatrix margin 1 - E/E_sep", s.separatrix_margin,
                    fmt=".6g"),
               Item("amplitude_rad", "amplitude", s.amplitude_rad, "deg", _DEG, ".6g"),
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
        h = swing_history(angle, angular_velocity, times, length, gravity)
        rows = tuple((float(t), float(th) * _DEG, float(th), float(w))
                     for t, th, w in zip(h.time_s, h.angle_rad, h.angular_velocity_rad_s))
        tables.append(Table("history", "Exact time history", (
            Column("time_s", "time", "s", fmt=".6g"),
            Column("angle_deg", "angle", "deg", fmt=".4f"),
            Column("angle_rad", "angle", "rad", in_text=False),
            Column("angular_velocity_rad_s", "angular velocity", "rad/s", fmt=".6f")), rows))
    notes = [s.message] if s.message else []
    return Report("motion", "Motion from an initial state", inputs, summary, tables,
                  notes=notes)
