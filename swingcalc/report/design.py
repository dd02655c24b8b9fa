"""Reports on a design (a body in its environment): the pendulum summary, the body, the
loads through the swing, and each sizing result. Builders call the library and return a
:class:`~swingcalc.report.model.Report`; no maths lives here beyond unit scaling."""

from __future__ import annotations

import math

import numpy as np

from .. import clock_rate_error, harmonic_ratio, small_angle_period_error
from ..compound import thermal_rate
from ..constants import SECONDS_PER_DAY
from ..linear import beats_per_hour, rate_against
from ..loads import DEFAULT_SAMPLES, impact, swing_loads
from ..sizing import (SUSPENSION, drop_angle_for_energy, drop_angle_for_speed, length_for_period,
                      max_amplitude_for_limit, period_at, position_for_period,
                      rating_adjustment, sensitivities)
from .builders import _ERROR_NOTE, _PCT, _TRANSPOSE_MAX, _deg, _deg_value
from .cautions import cautions_for
from .model import Column, Item, Report, Table, amplitude_text

__all__ = ["design_report", "body_report", "loads_report", "tune_report", "drop_report",
           "limit_report", "sensitivity_report"]

_DEG = 180.0 / math.pi


def _celsius(kelvin: float) -> str:
    """A temperature kept in K (SI, as JSON has it) shown in degC."""
    return f"{kelvin - 273.15:.4g}"


def _title(what: str, design) -> str:
    rev = f", rev. {design.revision}" if design.revision else ""
    return f"{what}: {design.name}{rev}"


def _design_inputs(design) -> list[Item]:
    env = design.environment
    items = [Item("design_name", "design", design.name),
             Item("design_source", "design file", design.source or "(options)")]
    if design.revision:
        items.append(Item("revision", "revision", design.revision))
    if design.date:
        items.append(Item("date", "date", design.date))
    given = env.gravity_given
    items += [Item("context", "context", design.context),
              Item("gravity_m_s2", "gravity" if given.replace(" ", "") == f"{env.gravity_m_s2}"
                   else f"gravity ({given})", env.gravity_m_s2, "m/s^2", fmt=".8g"),
              Item("temperature_K", "temperature", env.temperature_K, "degC",
                   fmt=_celsius),
              Item("air_density_kg_m3", "air density" if env.air else "air (off: vacuum)",
                   env.air_density_kg_m3, "kg/m^3", fmt=".5g")]
    return items


def _body_items(pend) -> list[Item]:
    b = pend.body
    return [Item("mass_kg", "mass", b.mass_kg, "kg", fmt=".6g"),
            Item("com_distance_m", "pivot to centre of mass", b.com_distance_m, "m", fmt=".6g"),
            Item("inertia_pivot_kg_m2", "inertia about the pivot", b.inertia_pivot_kg_m2,
                 "kg m^2", fmt=".6g"),
            Item("equivalent_length_m", "equivalent simple length I/(m d)",
                 b.equivalent_length_m, "m", fmt=".6g")]


def design_report(design) -> Report:
    """The main summary: period, beat and the peak loads of the design at each amplitude."""
    pend = design.pendulum
    clock = design.context == "clock"
    points = design.points_dict()
    flexible = pend.body.suspension.flexible
    cols = [Column("amplitude_deg", "amplitude", "deg", fmt=amplitude_text),
            Column("amplitude_rad", "amplitude", "rad", in_text=False),
            Column("period_s", "period T", "s", fmt="#.7g"),
            Column("period_ratio", "T / T0", "", fmt=".7f"),
            Column("small_angle_period_error_rel", "small-angle period error", **_PCT),
            Column("beats_per_hour", "beats per hour", "", fmt="#.6g") if clock else
            Column("frequency_hz", "frequency", "Hz", fmt="#.6g")]
    if clock:
        cols.append(Column("clock_rate_s_per_day", "rate if regulated to T0", "s/day",
                           fmt="#.4g"))
    if design.target_period_s is not None:
        cols.append(Column("rate_vs_target_s_per_day", "rate against the target period",
                           "s/day", fmt="#.4g"))
    cols += [Column("peak_angular_speed_rad_s", "peak angular speed", "rad/s", fmt="#.4g"),
             Column("peak_pivot_load_N", "peak pivot load", "N", fmt="#.5g"),
             Column("peak_pivot_load_per_weight", "peak pivot load / weight", "", fmt="#.4g"),
             Column("least_arm_tension_N",
                    "least suspension tension" if flexible else "least arm tension", "N",
                    fmt="#.5g"),
             Column("energy_J", "swing energy", "J", fmt="#.5g"),
             Column("separatrix_margin", "separatrix margin 1 - E/E_sep", "", fmt="#.4g"),
             Column("zero_tension_angle_deg",
                    "slack angle" if flexible else "arm in compression beyond", "deg",
                    fmt=".4g", missing="never"),
             Column("zero_tension_angle_rad", "zero-tension angle", "rad", in_text=False),
             Column("harmonic_3_rel", "3rd harmonic / fundamental", "%", 100.0, "#.3g")]
    for name in points:
        cols += [Column(f"{name}.peak_speed_m_s", f"{name}: peak speed", "m/s", fmt="#.4g"),
                 Column(f"{name}.peak_felt_g", f"{name}: peak felt acceleration", "g",
                        fmt="#.4g")]
    rows, warnings = [], []
    for a in design.amplitudes_rad:
        loads = swing_loads(pend, a, points=points, samples=3)
        t = period_at(pend, a)
        zero = loads.slack_angle_rad if flexible else loads.compression_angle_rad
        row = [_deg_value(a), a, t, t / pend.small_angle_period_s,
               small_angle_period_error(a), beats_per_hour(t) if clock else 1.0 / t]
        if clock:
            row.append(clock_rate_error(a))
        if design.target_period_s is not None:
            row.append(rate_against(t, design.target_period_s))
        row += [loads.peak("angular_speed_rad_s").value, loads.peak("reaction_N").value,
                loads.peak("reaction_N").value / loads.weight_N,
                loads.least_tension_N,
                loads.energy_J, loads.separatrix_margin,
                None if zero is None else zero * _DEG, zero, harmonic_ratio(a, 3)]
        for name in points:
            row += [abs(loads.peak(f"{name}.speed_m_s").value),
                    abs(loads.peak(f"{name}.felt_g").value)]
        rows.append(tuple(row))
        warnings += [f"at {_deg(a)} deg amplitude: {w}" for w in loads.warnings]
    summary = _body_items(pend) + [
        Item("small_angle_period_s", "small-angle period T0", pend.small_angle_period_s, "s",
             fmt=".8g"),
        Item("weight_N", "weight (static pivot load)", pend.mass_kg * pend.gravity_m_s2, "N",
             fmt=".5g"),
        Item("over_top_angular_speed_rad_s", "bottom angular speed for over the top"
             + (" taut" if flexible else ""), loads.over_top_speed_rad_s, "rad/s", fmt=".4g")]
    if design.environment.air:
        shift = (1 + pend.buoyancy_period_shift_rel) * (1 + pend.added_mass_period_shift_rel) - 1
        # ppm for a clock bob's few tens; a broadside panel's percent as a percent
        big = abs(shift) >= 1e-3
        summary += [Item("air_period_shift_rel", "air's period shift (buoyancy + added mass)",
                         shift, "%" if big else "ppm", 100.0 if big else 1e6, ".4g")]
    if design.target_period_s is not None:
        summary.append(Item("target_period_s", "target period", design.target_period_s, "s",
                            fmt=".8g"))
    if design.impact is not None:
        summary += _impact_items(pend, design.impact)
    notes = [_ERROR_NOTE]
    if flexible:
        notes.append(_FLEXIBLE_NOTE)
    table = Table("swing", "At each working amplitude", tuple(cols), tuple(rows),
                  transpose=len(rows) <= _TRANSPOSE_MAX)
    inputs = _design_inputs(design)
    if design.shorthand:
        bob = pend.body.parts[0]
        inputs += [Item("length_m", "length, pivot to bob centre", bob.centre_along_m, "m",
                        fmt=".6g"),
                   Item("bob_mass_kg", "bob mass (a point)", bob.mass_kg, "kg", fmt=".6g"),
                   Item("suspension", "suspension", "flexible" if flexible else "rigid")]
    return Report("pendulum", _title("Pendulum", design), inputs, summary,
                  [table], notes=notes, warnings=warnings,
                  cautions=cautions_for(design.context, loads=True))


_FLEXIBLE_NOTE = ("Flexible suspension: while taut it swings with the payload as one body "
                  "(its own mass as a straight line from the pivot); tensions are at the "
                  "payload end, where it first goes slack.")


def _impact_items(pend, imp) -> list[Item]:
    r = impact(pend, imp.drop_angle_rad, imp.strike_radius_m, imp.rise_angle_rad)
    items = [Item("drop_angle_rad", "drop angle", r.drop_angle_rad, "deg", _DEG, ".6g"),
             Item("potential_energy_J", "energy at the strike (potential energy at drop)",
                  r.potential_energy_J, "J", fmt=".6g"),
             Item("striking_speed_m_s", "striking speed at the centre of strike",
                  r.striking_speed_m_s, "m/s", fmt=".5g"),
             Item("strike_radius_m", "pivot to the centre of strike", r.strike_radius_m, "m",
                  fmt=".6g"),
             Item("centre_of_percussion_m", "pivot to the centre of percussion",
                  r.centre_of_percussion_m, "m", fmt=".6g"),
             Item("percussion_offset_rel", "centre of strike beyond the centre of percussion",
                  r.percussion_offset_rel, "%", 100.0, ".3g")]
    if r.absorbed_J is not None:
        items += [Item("rise_angle_rad", "rise angle", r.rise_angle_rad, "deg", _DEG,
                       fmt=".6g"),
                  Item("absorbed_J", "energy absorbed (no friction or windage deducted)",
                       r.absorbed_J, "J", fmt=".6g")]
    return items


def body_report(design) -> Report:
    """The body: each part's mass and inertia, the mass properties, air and temperature."""
    pend = design.pendulum
    b = pend.body
    cols = (Column("part", "part"), Column("shape", "shape"),
            Column("material", "material", missing=""),
            Column("mass_kg", "mass", "kg", fmt=".5g"),
            Column("centre_along_m", "centre along arm", "mm", 1e3, ".6g"),
            Column("centre_across_m", "across", "mm", 1e3, ".4g"),
            Column("own_inertia_kg_m2", "own inertia", "kg m^2", fmt=".4g"),
            Column("inertia_pivot_kg_m2", "inertia about pivot", "kg m^2", fmt=".5g"),
            Column("volume_m3", "volume", "L", 1e3, ".4g"),
            Column("expansion_per_K", "expansion", "1e-6/K", 1e6, ".3g"))
    rows = tuple((p.name, p.shape if p.orientation is None else f"{p.shape} ({p.orientation})",
                  p.material, p.mass_kg, p.centre_along_m, p.centre_across_m,
                  p.own_inertia_kg_m2, p.inertia_pivot_kg_m2, p.volume_m3, p.expansion_per_K)
                 for p in b.parts)
    summary = _body_items(pend) + [
        Item("com_along_m", "centre of mass along the arm", b.com_along_m, "m", fmt=".6g"),
        Item("com_across_m", "centre of mass across the arm", b.com_across_m, "m", fmt=".4g"),
        Item("hang_tilt_rad", "arm tilt when hanging at rest", b.hang_tilt_rad, "deg", _DEG,
             fmt=".4g"),
        Item("inertia_com_kg_m2", "inertia about the centre of mass", b.inertia_com_kg_m2,
             "kg m^2", fmt=".6g"),
        Item("gyration_pivot_m", "radius of gyration about the pivot", b.gyration_pivot_m,
             "m", fmt=".6g"),
        Item("gyration_com_m", "radius of gyration about the centre of mass",
             b.gyration_com_m, "m", fmt=".6g"),
        Item("centre_of_percussion_m", "pivot to the centre of percussion",
             b.centre_of_percussion_m, "m", fmt=".6g"),
        Item("vacuum_small_angle_period_s", "small-angle period in a vacuum",
             pend.vacuum_small_angle_period_s, "s", fmt=".8g"),
        Item("small_angle_period_s", "small-angle period here", pend.small_angle_period_s, "s",
             fmt=".8g")]
    clock = design.context == "clock"
    if design.environment.air:
        summary.append(Item("buoyancy_period_shift_rel", "buoyancy: period shift",
                            pend.buoyancy_period_shift_rel, "ppm", 1e6, ".4g"))
        if clock:
            summary.append(Item("buoyancy_rate_s_per_day", "buoyancy: rate change",
                                pend.buoyancy_rate_s_per_day, "s/day", fmt=".4g"))
        summary.append(Item("added_mass_period_shift_rel", "air carried along: period shift",
                            pend.added_mass_period_shift_rel, "ppm", 1e6, ".4g"))
        if clock:
            summary.append(Item("added_mass_rate_s_per_day", "air carried along: rate change",
                                pend.added_mass_rate_s_per_day, "s/day", fmt=".4g"))
        summary.append(Item("drag_coefficient_N_m_s2", "quadratic drag: torque / omega^2",
                            pend.air.drag_coefficient_N_m_s2, "N m s^2", fmt=".4g"))
    th = thermal_rate(pend)
    summary += _thermal_items(th, clock)
    if clock:
        summary.append(Item("plain_thermal_rate_s_per_day_per_K",
                            "the same, all of the arm's material",
                            th.plain_rate_s_per_day_per_K, "s/day/K", fmt=".4g"))
    if clock and th.compensation is not None and any(
            p.expansion_per_K != b.arm_expansion_per_K for p in b.parts if p.mass_kg > 0):
        summary.append(Item("thermal_compensation_rel", "temperature compensation achieved",
                            th.compensation, "%", 100.0, ".4g"))
    notes = ["A part grows about its mount point, which moves with the arm's expansion."]
    if clock:
        notes.insert(0, "Rate changes are positive when the clock gains.")
    if b.suspension.flexible:
        notes.append(_FLEXIBLE_NOTE)
    table = Table("parts", "Parts (the suspension line last, if flexible)", cols, rows)
    tables = [table]
    if design.environment.air:
        tables.append(_air_table(pend))
        notes.append("Air coefficients: the swingcalc.fluids rows named under 'flow' (a "
                     "part moving along the swing's direction at the bottom); sources: "
                     + "; ".join(_air_sources(pend)) + ". See docs/methods/air.md.")
    return Report("body", _title("Body", design), _design_inputs(design), summary, tables,
                  notes=notes, cautions=cautions_for(design.context, loads=True))


def _air_table(pend) -> Table:
    cols = (Column("part", "part"), Column("flow", "meets the air as"),
            Column("drag_cd", "drag coefficient C_d", fmt=".3g"),
            Column("drag_coefficient_N_m_s2", "drag torque / omega^2", "N m s^2", fmt=".3g"),
            Column("added_volume_m3", "added mass / air density", "L", 1e3, ".3g"),
            Column("added_inertia_kg_m2", "added inertia", "kg m^2", fmt=".3g"),
            Column("buoyancy_moment_N_m", "buoyancy moment", "N m", fmt=".3g"))
    rows = tuple((r[0], r[4] or "-", r[5], r[3], r[6], r[2], r[1])
                 for r in pend.air.per_part)
    return Table("air", "Air on each part", cols, rows)


def _air_sources(pend) -> list[str]:
    """The sources of the fluid-table rows the parts use (each named once)."""
    from .. import fluids

    out = []
    for r in pend.air.per_part:
        if not r[4]:
            continue
        shape, direction = r[4].split(" ")
        for getter in (fluids.added_mass_entry, fluids.drag_entry):
            try:
                src = getter(shape, None if shape == "sphere" else direction).source
            except (KeyError, ValueError):
                continue
            if src not in out:
                out.append(src)
    return out


def loads_report(design, amplitude: float | None = None,
                 samples: int = DEFAULT_SAMPLES) -> Report:
    """Loads and motion over one swing at ``amplitude`` (default: the design's largest)."""
    pend = design.pendulum
    a = max(design.amplitudes_rad) if amplitude is None else amplitude
    points = design.points_dict()
    loads = swing_loads(pend, a, points=points, samples=samples)
    flexible = pend.body.suspension.flexible
    cols = [Column("angle_deg", "angle", "deg", fmt=".6g"),
            Column("angle_rad", "angle", "rad", in_text=False),
            Column("angular_speed_rad_s", "angular speed", "rad/s", fmt=".5g"),
            Column("angular_acceleration_rad_s2", "angular acceleration", "rad/s^2", fmt=".5g"),
            Column("arm_tension_N", "pull along arm", "N", fmt=".6g"),
            Column("reaction_tangential_N", "across arm", "N", fmt=".5g"),
            Column("reaction_N", "pivot load", "N", fmt=".6g"),
            Column("reaction_x_N", "pivot reaction x", "N", fmt=".5g", in_text=False),
            Column("reaction_y_N", "pivot reaction y", "N", fmt=".5g", in_text=False),
            Column("kinetic_energy_J", "kinetic energy", "J", fmt=".5g"),
            Column("potential_energy_J", "potential energy", "J", fmt=".5g")]
    series = [loads.angle_rad * _DEG, loads.angle_rad, loads.angular_speed_rad_s,
              loads.angular_acceleration_rad_s2, loads.arm_tension_N,
              loads.reaction_tangential_N, loads.reaction_N, loads.reaction_x_N,
              loads.reaction_y_N, loads.kinetic_energy_J, loads.potential_energy_J]
    if flexible:
        cols += [Column("payload_tension_N", "suspension tension at payload", "N", fmt=".6g"),
                 Column("taut", "taut (model holds)")]
        series += [loads.payload_tension_N, loads.taut]
    for pm in loads.points:
        cols += [Column(f"{pm.name}.speed_m_s", f"{pm.name}: speed", "m/s", fmt=".4g"),
                 Column(f"{pm.name}.acceleration_m_s2", f"{pm.name}: acceleration", "m/s^2",
                        fmt=".4g"),
                 Column(f"{pm.name}.tangential_acceleration_m_s2",
                        f"{pm.name}: tangential acceleration", "m/s^2", in_text=False),
                 Column(f"{pm.name}.normal_acceleration_m_s2",
                        f"{pm.name}: acceleration toward the pivot", "m/s^2", in_text=False),
                 Column(f"{pm.name}.felt_normal_g", f"{pm.name}: felt normal", "g", fmt=".4g"),
                 Column(f"{pm.name}.felt_tangential_g", f"{pm.name}: felt along", "g",
                        fmt=".3g"),
                 Column(f"{pm.name}.felt_g", f"{pm.name}: felt total", "g", fmt=".4g")]
        series += [pm.speed_m_s, np.hypot(pm.tangential_acceleration_m_s2,
                                          pm.normal_acceleration_m_s2),
                   pm.tangential_acceleration_m_s2, pm.normal_acceleration_m_s2,
                   pm.felt_normal_g, pm.felt_tangential_g, pm.felt_g]
    rows = tuple(zip(*[np.asarray(s).tolist() for s in series]))
    peaks = Table("peaks", "Peaks over the swing (largest magnitude, and where)",
                  (Column("quantity", "quantity"), Column("value", "value", fmt=".6g"),
                   Column("unit", "unit"),
                   Column("angle_deg", "at angle", "deg", fmt=".5g"),
                   Column("angle_rad", "at angle", "rad", in_text=False)),
                  tuple((p.quantity, p.value, _unit_of(p.quantity), p.angle_rad * _DEG,
                         p.angle_rad) for p in loads.peaks))
    summary = [Item("amplitude_rad", "amplitude", a, "deg", _DEG, fmt=amplitude_text),
               Item("period_s", "period", period_at(pend, a), "s", fmt=".8g"),
               Item("energy_J", "swing energy", loads.energy_J, "J", fmt=".6g"),
               Item("separatrix_energy_J", "energy at the separatrix (inverted, at rest)",
                    loads.separatrix_energy_J, "J", fmt=".6g"),
               Item("separatrix_margin", "separatrix margin 1 - E/E_sep", loads.separatrix_margin,
                    "", fmt=".4g"),
               Item("over_top_angular_speed_rad_s", "bottom angular speed for over the top"
                    + (" taut" if flexible else ""), loads.over_top_speed_rad_s, "rad/s",
                    fmt=".5g"),
               Item("weight_N", "weight (static pivot load)", loads.weight_N, "N", fmt=".6g")]
    zero = loads.slack_angle_rad if flexible else loads.compression_angle_rad
    summary.append(Item("slack_angle_rad" if flexible else "compression_angle_rad",
                        "suspension goes slack at" if flexible else "arm in compression beyond",
                        zero, "deg", _DEG, fmt=".5g", missing="never"))
    if design.impact is not None:
        summary += _impact_items(pend, design.impact)
    notes = ["Angles from the hanging position; pivot load is the force the pivot carries "
             "(the reaction on the body, reversed). 'Pull along arm' is positive in tension. "
             "Felt accelerations are acceleration less gravity, in g: 'normal' presses toward "
             "the pivot side, 1 g at rest."]
    if flexible:
        notes.append(_FLEXIBLE_NOTE)
    table = Table("loads", f"Through the swing at {_deg(a)} deg", tuple(cols), rows)
    return Report("loads", _title("Loads through the swing", design), _design_inputs(design),
                  summary, [table, peaks], notes=notes, warnings=list(loads.warnings),
                  cautions=cautions_for(design.context, loads=True))


_UNITS = (("_rad_s2", "rad/s^2"), ("_rad_s", "rad/s"), ("_m_s", "m/s"), ("_N", "N"),
          ("_g", "g"))


def _unit_of(key: str) -> str:
    """The display unit carried by a key's suffix (``reaction_N`` -> N)."""
    return next((unit for suffix, unit in _UNITS if key.endswith(suffix)), "")


def tune_report(design, target: float, amplitude: float, part: str | None,
                lowest: float | None = None, highest: float | None = None) -> Report:
    """Length or part position for the target period at the working amplitude."""
    pend = design.pendulum
    inputs = _design_inputs(design) + [
        Item("target_period_s", "target period", target, "s", fmt=".10g"),
        Item("amplitude_rad", "at amplitude", amplitude, "deg", _DEG, fmt=amplitude_text)]
    if design.shorthand and part is None:
        L = length_for_period(target, amplitude, pend.gravity_m_s2)
        summary = [Item("length_m", "length, pivot to bob centre", L, "mm", 1e3, ".10g"),
                   Item("length_now_m", "length as given", pend.body.com_distance_m, "mm", 1e3,
                        ".10g"),
                   Item("change_m", "change", L - pend.body.com_distance_m, "mm", 1e3, ".6g"),
                   Item("zero_amplitude_length_m", "length for the target at zero amplitude",
                        length_for_period(target, 0.0, pend.gravity_m_s2), "mm", 1e3, ".10g")]
        notes = ["A point bob on a light rod; air effects are not applied to a point bob."]
    else:
        name = part or (design.rating.parts if design.rating else None)
        if name is None and design.suspension.flexible:
            name = (SUSPENSION,)
        if name is None:
            from ..errors import MISSING, InvalidInput

            raise InvalidInput("--part", MISSING, "the name of the part to move: "
                               + ", ".join(p.name for p in design.parts),
                               "required for a design of parts without a [rating] part")
        sol = position_for_period(pend, name, target, amplitude, lowest, highest)
        at = ("length" if sol.parts[0] == SUSPENSION else
              next(p.at for p in pend.body.reference if p.name == sol.parts[0]))
        zero = position_for_period(pend, name, target, 0.0, lowest, highest)
        summary = [Item("parts", "moved", ", ".join(sol.parts)),
                   Item("position_m", "new suspension length" if at == "length" else
                        f"new position of {sol.parts[0]} (its {at})",
                        sol.position_m, "mm", 1e3, ".10g")]
        if at != "centre" or sol.centre_m != sol.position_m:
            # the centre at the working temperature, when it is not the line above
            summary.append(Item("centre_m", f"{sol.parts[0]} centre at temperature"
                                if at != "length" else "suspension length at temperature",
                                sol.centre_m, "mm", 1e3, ".10g"))
        summary += [Item("move_m", "move (positive: down the arm)", sol.move_m, "mm",
                        1e3, ".6g"),
                   Item("period_s", "period there, recomputed", sol.period_s, "s", fmt=".13g"),
                   Item("zero_amplitude_position_m", "position for the target at zero amplitude",
                        zero.position_m, "mm", 1e3, ".10g")]
        if sol.other_positions_m:
            summary.append(Item("other_positions_m", "other positions with the same period",
                                list(sol.other_positions_m), "mm", 1e3, ".10g"))
        notes = ["The period includes the air's buoyancy and added mass when air is on, and "
                 "the part positions at the working temperature."]
    return Report("tune", _title("Tuning for a target period", design), inputs, summary, [],
                  notes=notes, cautions=cautions_for(design.context, loads=True))


def drop_report(design, energy: float | None, speed: float | None,
                radius: float | None) -> Report:
    """Drop angle for a target energy or striking speed, and what that drop gives."""
    pend = design.pendulum
    imp = design.impact
    r = radius if radius is not None else (imp.strike_radius_m if imp else None)
    if speed is not None:
        if r is None:
            from ..errors import MISSING, InvalidInput

            raise InvalidInput("--radius", MISSING, "a strike radius, e.g. '0.8 m'",
                               "needed with --speed when the design has no [impact] section")
        alpha = drop_angle_for_speed(pend, speed, r)
        target = Item("target_speed_m_s", "target striking speed", speed, "m/s", fmt=".6g")
    else:
        alpha = drop_angle_for_energy(pend, energy)
        target = Item("target_energy_J", "target energy", energy, "J", fmt=".6g")
    res = impact(pend, alpha, r if r is not None else pend.body.centre_of_percussion_m)
    summary = [Item("drop_angle_rad", "drop angle from the hanging position", alpha, "deg",
                    _DEG, ".8g"),
               Item("potential_energy_J", "energy at the bottom", res.potential_energy_J, "J",
                    fmt=".8g"),
               Item("striking_speed_m_s", "speed at the strike radius", res.striking_speed_m_s,
                    "m/s", fmt=".6g"),
               Item("strike_radius_m", "strike radius", res.strike_radius_m, "m", fmt=".6g"),
               Item("energy_rise_m", "drop height of the centre of mass",
                    pend.body.com_distance_m * (1 - math.cos(alpha)), "m", fmt=".5g")]
    return Report("drop", _title("Drop angle", design), _design_inputs(design) + [target],
                  summary, [], notes=["Friction and windage losses are not deducted."],
                  cautions=cautions_for(design.context, loads=True))


def limit_report(design, quantity: str, limit: float) -> Report:
    """The largest amplitude that keeps one peak quantity under a limit."""
    pend = design.pendulum
    points = design.points_dict()
    a = max_amplitude_for_limit(pend, quantity, limit, points)
    unit = _unit_of(quantity)
    key = f"limit_{quantity.rsplit('.', 1)[-1]}"
    summary = [Item("quantity", "limited quantity", quantity),
               Item(key, "limit", limit, unit, fmt=".6g")]
    notes = []
    flexible = pend.body.suspension.flexible
    if a >= math.pi or (flexible and a == 0.5 * math.pi):
        summary += [Item("max_amplitude_rad", "largest amplitude", a, "deg", _DEG, ".8g")]
        notes.append("The suspension goes slack beyond 90 deg: that, not this limit, bounds "
                     "the swing." if flexible else
                     "The limit is not reached by any swing short of going over the top.")
    else:
        peak = swing_loads(pend, a, points=points, samples=3).peak(quantity)
        summary += [Item("max_amplitude_rad", "largest amplitude", a, "deg", _DEG, ".8g"),
                    Item(f"peak_at_limit_{quantity.rsplit('.', 1)[-1]}",
                         "peak there, recomputed", abs(peak.value), unit, fmt=".10g"),
                    Item("period_s", "period there", period_at(pend, a), "s", fmt=".8g")]
    return Report("limit", _title("Largest amplitude under a limit", design),
                  _design_inputs(design), summary, [], notes=notes,
                  cautions=cautions_for(design.context, loads=True))


def _thermal_items(th, clock: bool) -> list[Item]:
    """The rate change with temperature for a clock (s/day/K); for anything else the
    period's relative change per kelvin (ppm/K), which is what a tuned damper or a test
    rig is specified by."""
    if clock:
        return [Item("thermal_rate_s_per_day_per_K",
                     "rate change with temperature (expansion; air density held)",
                     th.rate_s_per_day_per_K, "s/day/K", fmt=".4g")]
    return [Item("thermal_period_change_rel_per_K",
                 "period change with temperature (expansion; air density held)",
                 -th.rate_s_per_day_per_K / SECONDS_PER_DAY, "ppm/K", 1e6, ".4g")]


def sensitivity_report(design, amplitude: float | None = None) -> Report:
    """How the period and rate move with each input, and the rating adjustment."""
    pend = design.pendulum
    a = design.amplitudes_rad[0] if amplitude is None else amplitude
    sens = sensitivities(pend, a)
    clock = design.context == "clock"
    cols = (Column("input", "input"), Column("value", "value", fmt=".6g"),
            Column("unit", "unit"),
            Column("period_per_unit", "dT/dx", "s per unit", fmt=".5g"),
            Column("relative", "(x/T) dT/dx", "", fmt=".4g"),
            Column("rate_s_per_day_per_unit", "rate change", "s/day per unit", fmt=".5g",
                   in_text=clock))
    rows = tuple((s.input, s.value, s.unit, s.period_per_unit, s.relative,
                  s.rate_s_per_day_per_unit) for s in sens)
    summary = [Item("amplitude_rad", "at amplitude", a, "deg", _DEG, fmt=amplitude_text),
               Item("period_s", "period", period_at(pend, a), "s", fmt=".10g")]
    if design.rating is not None:
        adj = rating_adjustment(pend, design.rating.parts, a, design.rating.nut_pitch_m)
        moved = " and ".join(design.rating.parts)
        summary.append(Item("rate_s_per_day_per_mm",
                            f"rate change per mm the {moved} move down",
                            adj["rate_s_per_day_per_mm"], "s/day", fmt=".5g"))
        if adj["rate_s_per_day_per_turn"] is not None:
            summary.append(Item("rate_s_per_day_per_turn",
                                f"per turn of the nut (pitch "
                                f"{design.rating.nut_pitch_m * 1e3:g} mm) lowering it",
                                adj["rate_s_per_day_per_turn"], "s/day", fmt=".5g"))
    summary += _thermal_items(thermal_rate(pend), clock)
    table = Table("sensitivities", "Sensitivity of the period to each input", cols, rows)
    return Report("sensitivity", _title("Sensitivities", design), _design_inputs(design),
                  summary, [table],
                  notes=[("Rate changes are positive when the clock gains; " if clock else "")
                         + "'per unit' is per SI unit of the input (m, kg, m/s^2, rad)."],
                  cautions=cautions_for(design.context, loads=True))
