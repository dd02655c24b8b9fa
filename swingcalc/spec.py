"""The spec sheet of a design: the quantities a drawing carries, as plain rows.

Each :class:`SpecRow` holds one quantity in SI (or a text), keyed with its unit in the
name like the reports (``mass_kg``, ``amplitude_1.period_s``), with the section it
belongs to, a label for people and its *kind* (``length``, ``force``, ...), which is all a
display layer needs to convert it (:mod:`swingcalc.report.units`). Every value comes from
the library: :mod:`swingcalc.compound`, :mod:`swingcalc.loads`, :mod:`swingcalc.sizing`,
:mod:`swingcalc.linear`; nothing is recomputed here.

Rows per working amplitude use the amplitude's place in the design file
(``amplitude_1``, ``amplitude_2``, ...), not its value, so the keys stay the same when a
tolerance moves the amplitude (the bands of :func:`spec_bands` match rows by key).

Method notes: ``docs/spec-sheet.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from .compound import thermal_rate
from .linear import (
    beats_per_hour,
    clock_rate_error,
    rate_against,
    small_angle_period_error,
)
from .loads import impact, swing_loads
from .sizing import period_at, rating_adjustment, sensitivities

__all__ = [
    "SECTIONS",
    "SLACK_FREE_AMPLITUDE_RAD",
    "SpecRow",
    "spec_bands",
    "spec_rows",
    "spec_values",
    "spec_warnings",
]

#: Largest amplitude [rad] a flexible suspension swings through without going slack:
#: at the turning point omega = 0 and the payload end carries m_p g cos A
#: (:func:`swingcalc.loads.swing_loads`, Notes), which reaches zero at A = 90 deg.
SLACK_FREE_AMPLITUDE_RAD = 0.5 * math.pi

#: Sections in the order the sheet shows them.
SECTIONS = ("design", "conditions", "body", "period", "loads", "margins", "impact", "clock")

# Samples over the swing for the least tension: the tension falls monotonically with
# |theta| (m ((2 d k + g) cos theta - 2 d k cos A)), so the ends -A, 0, A hold its least
# value exactly; the peaks are found by swing_loads' own refined search.
_LOAD_SAMPLES = 3


@dataclass(frozen=True)
class SpecRow:
    """One quantity of the sheet.

    Attributes
    ----------
    key : str
        Name with the SI unit in it (``mass_kg``); per working amplitude
        ``amplitude_<n>.<name>``; per named point ``amplitude_<n>.<point>.<name>``.
    section : str
        One of :data:`SECTIONS`.
    label : str
        What the value is, for people.
    value : float or str
        SI value (radians for angles, a fraction for relative values), or a text.
    kind : str
        Quantity kind for display conversion (:data:`swingcalc.report.units.KINDS`);
        ``text`` for a text value.
    """

    key: str
    section: str
    label: str
    value: float | str
    kind: str

    @property
    def numeric(self) -> bool:
        return isinstance(self.value, float)

    def to_dict(self) -> dict:
        return dict(self.__dict__)


def _deg_text(a: float) -> str:
    return f"{math.degrees(a):.6g} deg"


def spec_rows(design) -> tuple:
    """The spec sheet rows of ``design`` (a :class:`swingcalc.designfile.Design`).

    Returns
    -------
    tuple of SpecRow
        Design name, revision and date; the conditions (gravity, temperature); the mass
        properties; the period and beat rate at zero amplitude and at each working
        amplitude, with the small-angle error; the peak speeds, pivot load, arm or
        suspension tension and the named points' felt accelerations at each working
        amplitude; the over-the-top and slack margins; the impact test's energies
        (``[impact]``); for a clock (context ``clock``) the rate at each amplitude, the
        rate change per degree of amplitude and per kelvin, and the rating adjustment.

    Notes
    -----
    Period T = T0 (2/pi) K(sin^2(A/2)) (:func:`swingcalc.sizing.period_at`); beats per
    hour 2 x 3600 / T (two beats per period). Loads: :func:`swingcalc.loads.swing_loads`.
    Over the top: the swing energy against 2 M (the energy at the inverted position), and
    the bottom angular speed needed to go over (:func:`swingcalc.loads.over_top_speed`)
    against the working one. Rate per degree of amplitude: the amplitude entry of
    :func:`swingcalc.sizing.sensitivities`; per kelvin:
    :func:`swingcalc.compound.thermal_rate`; rating: :func:`swingcalc.sizing.rating_adjustment`.
    """
    pend = design.pendulum
    body = pend.body
    flexible = body.suspension.flexible
    points = design.points_dict()
    clock = design.context == "clock"
    env = design.environment
    rows = [SpecRow("design_name", "design", "design", design.name, "text"),
            SpecRow("revision", "design", "revision", design.revision or "-", "text"),
            SpecRow("date", "design", "date", design.date or "-", "text"),
            SpecRow("context", "design", "context", design.context, "text"),
            SpecRow("gravity_m_s2", "conditions", "gravity", env.gravity_m_s2, "acceleration"),
            SpecRow("temperature_K", "conditions", "temperature", env.temperature_K,
                    "temperature"),
            SpecRow("air_density_kg_m3", "conditions",
                    "air density" if env.air else "air density (air off: vacuum)",
                    env.air_density_kg_m3, "density"),
            SpecRow("suspension", "body", "suspension",
                    "flexible (tension only)" if flexible else "rigid arm", "text"),
            SpecRow("mass_kg", "body", "mass", body.mass_kg, "mass"),
            SpecRow("com_distance_m", "body", "pivot to centre of mass", body.com_distance_m,
                    "length"),
            SpecRow("inertia_pivot_kg_m2", "body", "inertia about the pivot",
                    body.inertia_pivot_kg_m2, "inertia"),
            SpecRow("equivalent_length_m", "body", "equivalent simple length I/(m d)",
                    body.equivalent_length_m, "length"),
            SpecRow("weight_N", "body", "weight (static pivot load)",
                    pend.mass_kg * pend.gravity_m_s2, "force")]
    t0 = pend.small_angle_period_s
    rows += [SpecRow("small_angle_period_s", "period", "period at zero amplitude T0", t0,
                     "time"),
             _beat_row("small_angle_", "at zero amplitude", t0, clock)]
    if design.target_period_s is not None:
        rows.append(SpecRow("target_period_s", "period", "target period",
                            design.target_period_s, "time"))
    loads_rows, margin_rows, clock_rows = [], [], []
    over_top = None
    for n, a in enumerate(design.amplitudes_rad, start=1):
        at = f"amplitude_{n}."
        tag = f"at {_deg_text(a)}"
        t = period_at(pend, a)
        rows += [SpecRow(f"{at}amplitude_rad", "period", f"working amplitude {n}", a, "angle"),
                 SpecRow(f"{at}period_s", "period", f"period {tag}", t, "time"),
                 _beat_row(at, tag, t, clock),
                 SpecRow(f"{at}small_angle_period_error_rel", "period",
                         f"small-angle period error (T0 - T)/T {tag}",
                         float(small_angle_period_error(a)), "fraction")]
        loads = swing_loads(pend, a, points=points, samples=_LOAD_SAMPLES)
        over_top = loads.over_top_speed_rad_s
        peak_omega = loads.peak("angular_speed_rad_s").value
        held = "suspension (payload end)" if flexible else "arm"
        tension = "payload_tension_N" if flexible else "arm_tension_N"
        loads_rows += [
            SpecRow(f"{at}peak_angular_speed_rad_s", "loads", f"peak angular speed {tag}",
                    peak_omega, "angular_speed"),
            SpecRow(f"{at}peak_pivot_load_N", "loads", f"peak pivot load {tag}",
                    loads.peak("reaction_N").value, "force"),
            SpecRow(f"{at}peak_tension_N", "loads", f"peak {held} tension {tag}",
                    loads.peak(tension).value, "force"),
            SpecRow(f"{at}least_tension_N", "loads",
                    f"least {held} tension {tag}" + ("" if flexible else
                                                     " (negative: compression)"),
                    loads.least_tension_N, "force")]
        for pm in loads.points:
            loads_rows += [
                SpecRow(f"{at}{pm.name}.peak_speed_m_s", "loads",
                        f"{pm.name}: peak speed {tag}",
                        abs(loads.peak(f"{pm.name}.speed_m_s").value), "speed"),
                SpecRow(f"{at}{pm.name}.peak_felt_g", "loads",
                        f"{pm.name}: peak felt acceleration {tag}",
                        abs(loads.peak(f"{pm.name}.felt_g").value), "felt_g")]
        margin_rows += [
            SpecRow(f"{at}energy_J", "margins", f"swing energy {tag}", loads.energy_J,
                    "energy"),
            SpecRow(f"{at}separatrix_margin", "margins",
                    f"over-the-top margin 1 - E/E_top {tag}",
                    1.0 - loads.energy_J / (0.5 * pend.inertia_kg_m2 * over_top ** 2)
                    if flexible else loads.separatrix_margin, "ratio"),
            SpecRow(f"{at}over_top_speed_ratio", "margins",
                    f"bottom speed to go over the top / working bottom speed {tag}",
                    over_top / peak_omega if peak_omega > 0.0 else math.inf, "ratio")]
        if flexible:
            slack = loads.slack_angle_rad
            margin_rows += [
                SpecRow(f"{at}slack_margin_rad", "margins",
                        f"slack margin (90 deg - A) {tag}",
                        SLACK_FREE_AMPLITUDE_RAD - a, "angle"),
                SpecRow(f"{at}slack_angle_rad", "margins", f"slack angle {tag}",
                        "never (taut throughout)" if slack is None else slack,
                        "text" if slack is None else "angle")]
        else:
            comp = loads.compression_angle_rad
            margin_rows.append(SpecRow(
                f"{at}compression_angle_rad", "margins",
                f"arm in compression beyond (swinging {_deg_text(a)})",
                "never" if comp is None else comp, "text" if comp is None else "angle"))
        if clock:
            clock_rows += [
                SpecRow(f"{at}clock_rate_s_per_day", "clock",
                        f"rate if regulated to T0 {tag} (circular error)",
                        float(clock_rate_error(a)), "rate")]
            if design.target_period_s is not None:
                clock_rows.append(SpecRow(
                    f"{at}rate_vs_target_s_per_day", "clock", f"rate against the target {tag}",
                    rate_against(t, design.target_period_s), "rate"))
    # the bottom speed and energy that carry the body over the top (a flexible suspension
    # also staying taut there: more than the rigid arm's 2 M g d)
    margin_rows[:0] = [
        SpecRow("separatrix_energy_J", "margins", "energy at the bottom to go over the top"
                + (" taut" if flexible else ""),
                0.5 * pend.inertia_kg_m2 * over_top ** 2, "energy"),
        SpecRow("over_top_angular_speed_rad_s", "margins",
                "bottom angular speed to go over the top" + (" taut" if flexible else ""),
                over_top, "angular_speed")]
    if not flexible:
        margin_rows.insert(2, SpecRow("slack_margin", "margins", "slack margin",
                                      "rigid: none", "text"))
    rows += loads_rows + margin_rows
    if design.impact is not None:
        rows += _impact_rows(pend, design.impact)
    if clock:
        rows += clock_rows + _clock_rows(design, pend)
    return tuple(rows)


def spec_warnings(design) -> tuple:
    """The load warnings at the working amplitudes (a suspension going slack, an arm in
    compression), each once, for the sheet's foot."""
    pend, points = design.pendulum, design.points_dict()
    out = []
    for a in design.amplitudes_rad:
        for w in swing_loads(pend, a, points=points, samples=3).warnings:
            if w not in out:
                out.append(w)
    return tuple(out)


def _beat_row(at: str, tag: str, period: float, clock: bool) -> SpecRow:
    """A clock's beats per hour (two beats per period); for anything else the frequency."""
    if clock:
        return SpecRow(f"{at}beats_per_hour", "period", f"beats per hour {tag}",
                       beats_per_hour(period), "beat_rate")
    return SpecRow(f"{at}frequency_hz", "period", f"frequency {tag}", 1.0 / period,
                   "frequency")


def _impact_rows(pend, imp) -> list:
    r = impact(pend, imp.drop_angle_rad, imp.strike_radius_m, imp.rise_angle_rad)
    rows = [SpecRow("drop_angle_rad", "impact", "drop angle", r.drop_angle_rad, "angle"),
            SpecRow("impact_energy_J", "impact", "energy at the strike (potential energy at "
                    "the drop)", r.potential_energy_J, "energy"),
            SpecRow("striking_speed_m_s", "impact", "striking speed at the centre of strike",
                    r.striking_speed_m_s, "speed"),
            SpecRow("strike_radius_m", "impact", "pivot to the centre of strike",
                    r.strike_radius_m, "length"),
            SpecRow("centre_of_percussion_m", "impact", "pivot to the centre of percussion",
                    r.centre_of_percussion_m, "length"),
            SpecRow("percussion_offset_rel", "impact",
                    "centre of strike beyond the centre of percussion",
                    r.percussion_offset_rel, "fraction")]
    if r.absorbed_J is not None:
        rows += [SpecRow("rise_angle_rad", "impact", "rise angle", r.rise_angle_rad, "angle"),
                 SpecRow("absorbed_energy_J", "impact",
                         "energy absorbed (no friction or windage deducted)", r.absorbed_J,
                         "energy")]
    return rows


def _clock_rows(design, pend) -> list:
    a = design.amplitudes_rad[0]
    tag = f"at {_deg_text(a)}"
    slope = next(s.rate_s_per_day_per_unit for s in sensitivities(pend, a)
                 if s.input == "swing.amplitude") if a > 0.0 else 0.0
    rows = [SpecRow("rate_per_amplitude_s_per_day_per_rad", "clock",
                    f"rate change per degree of amplitude {tag}", slope, "rate_per_angle"),
            SpecRow("thermal_rate_s_per_day_per_K", "clock",
                    "rate change per kelvin (expansion; air density held)",
                    thermal_rate(pend).rate_s_per_day_per_K, "rate_per_temperature")]
    if design.rating is not None:
        parts, pitch = design.rating.parts, design.rating.nut_pitch_m
    elif design.shorthand:
        parts, pitch = (design.parts[0].name,), None
    else:
        rows.append(SpecRow("rating", "clock", "rating adjustment",
                            "none: the design has no [rating] section", "text"))
        return rows
    adj = rating_adjustment(pend, parts, a, pitch)
    moved = " and ".join(parts)
    rows.append(SpecRow("rating_rate_s_per_day_per_m", "clock",
                        f"rate change as the {moved} move{'s' if len(parts) == 1 else ''} "
                        "down",
                        adj["rate_s_per_day_per_mm"] * 1e3, "rate_per_length"))
    if adj["rate_s_per_day_per_turn"] is not None:
        rows.append(SpecRow("rating_rate_s_per_day_per_turn", "clock",
                            f"rate change per turn of the rating nut lowering it "
                            f"(pitch {pitch * 1e3:g} mm)",
                            adj["rate_s_per_day_per_turn"], "rate_per_turn"))
    return rows


def spec_values(design) -> dict:
    """{key: SI value} of the numeric rows of :func:`spec_rows` (what the bands need)."""
    return {r.key: r.value for r in spec_rows(design) if r.numeric}


def spec_bands(design) -> dict:
    """{key: :class:`swingcalc.tolerance.Band`} for the numeric rows, from the design's
    ``[tolerances]`` ({} when it has none): linear bands, RSS and worst case, of
    :func:`swingcalc.tolerance.linear_bands`."""
    if not design.tolerances:
        return {}
    from .tolerance import linear_bands

    return linear_bands(design, spec_values)
