"""Reports of the damped, driven simulation and of the cycle-averaged model.

The builders turn a :class:`~swingcalc.simulate.SimulationResult` or an
:class:`~swingcalc.averaged.AveragedResult` into a :class:`Report` (summary, a sample of
the per-cycle table, warnings and the cautions), and the per-cycle table and time history
into their own reports for the ``--cycles-file`` / ``--history-file`` outputs.
"""

from __future__ import annotations

import math

import numpy as np

from .cautions import cautions_for
from .model import Column, Item, Report, Table

__all__ = ["SAMPLE_ROWS", "averaged_cycles_report", "averaged_report", "cycles_report",
           "history_report", "simulation_report"]

_DEG = 180.0 / math.pi
#: The main report shows the first and last this many cycles (the file has all).
SAMPLE_ROWS = 8

_COLUMN_LOOK = {
    "cycle": ("cycle", "", 1.0, "d"),
    "start_time_s": ("start", "s", 1.0, ".8g"),
    "period_s": ("period", "s", 1.0, ".10g"),
    "amplitude_positive_rad": ("amplitude +", "deg", _DEG, ".6g"),
    "amplitude_negative_rad": ("amplitude -", "deg", _DEG, ".6g"),
    "amplitude_rad": ("amplitude", "deg", _DEG, ".6g"),
    "amplitude_start_rad": ("amplitude at start", "deg", _DEG, ".6g"),
    "amplitude_half_rad": ("amplitude half way", "deg", _DEG, ".6g"),
    "amplitude_end_rad": ("amplitude at end", "deg", _DEG, ".6g"),
    "rate_s_per_day": ("rate", "s/day", 1.0, ".5g"),
    "energy_start_J": ("energy", "J", 1.0, ".6g"),
    "log_decrement": ("log decrement", "", 1.0, ".5g"),
    "q": ("Q", "", 1.0, ".5g"),
    "loss_q": ("loss Q", "", 1.0, ".5g"),
}


def _look(key):
    if key in _COLUMN_LOOK:
        label, unit, scale, fmt = _COLUMN_LOOK[key]
        return Column(key, label, unit, scale, fmt if fmt != "d" else (lambda v: f"{v:.0f}"))
    if key.startswith("lost_"):
        return Column(key, f"lost to {key[5:-2]}", "J", fmt=".4g")
    if key.startswith("supplied_"):
        return Column(key, f"from {_source(key[9:-2])}", "J", fmt=".4g")
    return Column(key, key, "", fmt=".6g")


def _source(name: str) -> str:
    """A drive's name as shown: the impulse drive delivers a push (energy or impulse)."""
    return "the push" if name == "impulse" else name.replace("_", " ")


def _messages(result) -> tuple[list, list]:
    """(warnings, notes) of a run: its message once, as a warning when the run failed."""
    warnings = list(result.warnings)
    if not result.success and result.message not in warnings:
        warnings.append(result.message)
    notes = [] if result.message in warnings else [result.message]
    return warnings, notes


def _rows(columns: dict, index) -> tuple:
    keys = list(columns)
    out = []
    for i in index:
        row = []
        for k in keys:
            v = columns[k][i]
            v = v.item() if hasattr(v, "item") else v
            if isinstance(v, float) and not math.isfinite(v):
                v = None
            row.append(v)
        out.append(tuple(row))
    return tuple(out)


def _sample_index(n: int):
    if n <= 2 * SAMPLE_ROWS:
        return list(range(n))
    return list(range(SAMPLE_ROWS)) + list(range(n - SAMPLE_ROWS, n))


def _table(name, title, columns: dict, index) -> Table:
    return Table(name, title, tuple(_look(k) for k in columns), _rows(columns, index))


def _model_items(model) -> list:
    items = [Item("inertia_kg_m2", "inertia about pivot + added air mass",
                  model.inertia, "kg m^2", fmt=".6g"),
             Item("mass_kg", "mass", model.mass, "kg", fmt=".6g"),
             Item("com_distance_m", "pivot to centre of mass", model.com_distance, "m",
                  fmt=".6g"),
             Item("gravity_m_s2", "gravity", model.gravity, "m/s^2", fmt=".6g"),
             Item("restoring_moment_N_m", "restoring moment", model.restoring_moment, "N m",
                  fmt=".6g"),
             Item("small_angle_period_s", "small-angle period", model.small_angle_period, "s",
                  fmt=".8g")]
    if model.viscous:
        items += [Item("viscous_N_m_s", "viscous damping", model.viscous, "N m s", fmt=".6g"),
                  Item("damping_ratio", "damping ratio (small amplitude)", model.damping_ratio,
                       fmt=".6g")]
    if model.drag:
        items.append(Item("drag_N_m_s2", "quadratic drag coefficient", model.drag, "N m s^2",
                          fmt=".6g"))
    if model.friction_kind == "reaction":
        items += [Item("pin_radius_m", "pin radius", model.pin_radius, "mm", 1e3, ".6g"),
                  Item("friction_kinetic", "friction coefficient (kinetic)", model.friction,
                       fmt=".4g"),
                  Item("friction_static", "friction coefficient (static)",
                       model.static_friction, fmt=".4g")]
    elif model.friction_kind == "torque":
        items += [Item("friction_torque_N_m", "friction torque (kinetic)",
                       model.friction_torque, "N m", fmt=".6g"),
                  Item("static_friction_torque_N_m", "friction torque (static)",
                       model.static_friction_torque, "N m", fmt=".6g")]
    if model.linear:
        items.append(Item("linear", "restoring torque", "linear (-M theta)"))
    return items


def _drive_items(drives) -> list:
    items = []
    for k, d in enumerate(drives, start=1):
        key = f"drive_{k}"
        if d.label == "impulse drive":
            how = (f"{d.energy:.6g} J" if d.energy is not None
                   else f"{d.angular_impulse:.6g} N m s")
            text = (f"push of {how} at {d.angle * _DEG:.6g} deg, per {d.per}, "
                    f"{'counter-clockwise' if d.direction > 0 else 'clockwise'}")
        elif d.label == "harmonic torque":
            text = f"torque {d.amplitude:.6g} N m at {d.angular_frequency:.6g} rad/s"
        else:
            text = (f"{d.label} {d.amplitude:.6g} m at {d.angular_frequency:.6g} rad/s")
        items.append(Item(key, f"drive {k}", text))
    return items


def simulation_report(result, context: str = "general", extra_warnings=()) -> Report:
    """Summary, energy budget and a sample of the per-cycle table of a simulation."""
    s = result.summary
    e = result.energy
    ang = {"unit": "deg", "scale": _DEG, "fmt": ".6g"}
    summary = [Item("status", "status", result.status),
               Item("duration_s", "simulated time", s.duration_s, "s", fmt=".9g"),
               Item("cycles", "complete cycles", s.cycles, fmt=".0f"),
               Item("initial_amplitude_rad", "start amplitude", s.initial_amplitude_rad, **ang),
               Item("final_amplitude_rad", "last amplitude", s.final_amplitude_rad, **ang),
               Item("first_period_s", "first period", s.first_period_s, "s", fmt=".10g"),
               Item("last_period_s", "last period", s.last_period_s, "s", fmt=".10g"),
               Item("target_period_s", "target period", s.target_period_s, "s", fmt=".10g")]
    clock = context == "clock"
    if clock:
        summary.append(Item("last_rate_s_per_day", "rate against the target (last cycle)",
                            s.last_rate_s_per_day, "s/day", fmt=".5g"))
    if result.drives:
        # a drive feeds energy in: the decrement of the turning points says nothing of
        # the losses, only the loss Q does
        summary.append(Item("loss_q_last", "loss Q, last cycle (2 pi E / energy lost)",
                            s.loss_q_last, fmt=".6g"))
    else:
        summary += [
            Item("q_first", "Q (first cycles)", s.q_first, fmt=".6g"),
            Item("q_first_amplitude_rad", "  at amplitude", s.q_first_amplitude_rad, **ang),
            Item("q_last", "Q (last cycles)", s.q_last, fmt=".6g"),
            Item("q_last_amplitude_rad", "  at amplitude", s.q_last_amplitude_rad, **ang),
            Item("loss_q_last", "loss Q, last cycle (2 pi E / energy lost)", s.loss_q_last,
                 fmt=".6g"),
            Item("log_decrement_first", "log decrement (first)", s.log_decrement_first,
                 fmt=".6g"),
            Item("log_decrement_last", "log decrement (last)", s.log_decrement_last,
                 fmt=".6g")]
    summary += [Item("decay_fraction", "decay to", s.decay_fraction, "%", 100.0, ".4g"),
               Item("decay_time_s", "  time to decay", s.decay_time_s, "s", fmt=".6g"),
               Item("decay_cycles", "  cycles to decay", s.decay_cycles, fmt=".6g"),
               Item("steady_amplitude_rad", "steady amplitude", s.steady_amplitude_rad, **ang),
               Item("settled", "settled", s.settled),
               Item("settle_time_s", "  time to settle", s.settle_time_s, "s", fmt=".6g"),
               Item("at_rest", "came to rest", s.at_rest),
               Item("rest_angle_rad", "  rest angle", s.rest_angle_rad, **ang),
               Item("rest_time_s", "  at time", s.rest_time_s, "s", fmt=".8g"),
               Item("over_the_top", "went over the top", s.over_the_top),
               Item("impulses", "pushes delivered", s.impulses, fmt=".0f"),
               Item("peak_angular_speed_rad_s", "peak angular speed", s.peak_angular_speed_rad_s,
                    "rad/s", fmt=".6g"),
               Item("peak_angular_acceleration_rad_s2", "peak angular acceleration",
                    s.peak_angular_acceleration_rad_s2, "rad/s^2", fmt=".6g"),
               Item("peak_reaction_N", "peak pivot reaction", s.peak_reaction_N, "N", fmt=".6g"),
               Item("peak_reaction_per_weight", "peak pivot reaction / weight",
                    s.peak_reaction_per_weight, fmt=".5g"),
               Item("peak_friction_torque_N_m", "peak friction torque",
                    s.peak_friction_torque_N_m, "N m", fmt=".5g"),
               Item("energy_initial_J", "energy at start", e.initial_J, "J", fmt=".8g"),
               Item("energy_final_J", "energy at end", e.final_J, "J", fmt=".8g")]
    summary += [Item(f"dissipated_{k}_J", f"dissipated by {k}", v, "J", fmt=".8g")
                for k, v in e.dissipated_J.items()]
    summary += [Item(f"supplied_{k}_J", f"supplied by {_source(k)}", v, "J",
                     fmt=".8g") for k, v in e.supplied_J.items()]
    summary.append(Item("energy_closure_rel", "energy budget closure", e.closure_rel,
                        fmt=".3g"))
    inputs = _model_items(result.model) + _drive_items(result.drives) + [
        Item("rtol", "relative tolerance", result.settings.get("rtol"), fmt=".3g")]
    # a rate in s/day means something for a clock; the files keep every column
    cols = {k: v for k, v in result.cycles.columns.items()
            if clock or k != "rate_s_per_day"}
    n = len(result.cycles)
    tables = []
    if n:
        title = ("Per cycle" if n <= 2 * SAMPLE_ROWS else
                 f"Per cycle (first and last {SAMPLE_ROWS} of {n})")
        tables.append(_table("cycles", title, cols, _sample_index(n)))
    warnings, notes = _messages(result)
    warnings += list(extra_warnings)
    if s.over_the_top:
        warnings.append("the body went over the top: amplitudes are not defined there")
    notes += [("Q is that of the linear oscillator with the measured logarithmic decrement, "
              "sqrt(4 pi^2 + delta^2) / (2 delta); loss Q is 2 pi E / energy dissipated per "
              "cycle.")]
    if clock:
        notes.append("The rate is (target / period - 1) x 86400 s/day (positive: gaining).")
    name = result.model.name
    return Report("simulate", "Damped, driven swing" + (f": {name}" if name else ""),
                  inputs, summary, tables, notes=notes, warnings=warnings,
                  cautions=cautions_for(context, loads=True))


def cycles_report(result) -> Report:
    """The whole per-cycle table of a simulation (for --cycles-file)."""
    cols = dict(result.cycles.columns)
    return Report("simulate-cycles", "Per-cycle table", [], [],
                  [_table("cycles", "Per cycle", cols, range(len(result.cycles)))])


def history_report(result) -> Report:
    """The time history of a simulation (for --history-file)."""
    h = result.history
    cols = {"time_s": h.time_s, "angle_rad": h.angle_rad,
            "angular_velocity_rad_s": h.angular_velocity_rad_s}
    t = Table("history", f"Time history (every {h.stride}. step)",
              (Column("time_s", "time", "s", fmt=".10g"),
               Column("angle_rad", "angle", "rad", fmt=".10g"),
               Column("angular_velocity_rad_s", "angular velocity", "rad/s", fmt=".10g")),
              tuple(zip(*(np.asarray(v).tolist() for v in cols.values()))))
    return Report("simulate-history", "Time history", [], [], [t])


def averaged_report(result, context: str = "general", extra_warnings=()) -> Report:
    """Summary and a sample of the per-cycle table of the cycle-averaged model."""
    s = result.summary
    ang = {"unit": "deg", "scale": _DEG, "fmt": ".6g"}
    summary = [Item("model", "model", "cycle-averaged (beat by beat)"),
               Item("assumptions_hold", "assumptions hold", result.assumptions_hold),
               Item("beats", "beats", s.get("beats"), fmt=".0f"),
               Item("cycles", "cycles", s.get("cycles"), fmt=".0f"),
               Item("duration_s", "running time", s.get("duration_s"), "s", fmt=".9g"),
               Item("initial_amplitude_rad", "start amplitude", s.get("initial_amplitude_rad"),
                    **ang),
               Item("final_amplitude_rad", "final amplitude", s.get("final_amplitude_rad"),
                    **ang),
               Item("first_period_s", "first period", s.get("first_period_s"), "s",
                    fmt=".10g"),
               Item("last_period_s", "last period", s.get("last_period_s"), "s", fmt=".10g")]
    clock = context == "clock"
    if clock:
        summary += [Item("last_rate_s_per_day", "rate at the end", s.get("last_rate_s_per_day"),
                         "s/day", fmt=".5g"),
                    Item("mean_rate_s_per_day", "mean rate over the run",
                         s.get("mean_rate_s_per_day"), "s/day", fmt=".5g"),
                    Item("accumulated_error_s", "accumulated time error",
                         s.get("accumulated_error_s"), "s", fmt=".5g")]
    inputs = _model_items(result.model) + (_drive_items([result.drive]) if result.drive
                                            else [])
    n = result.cycles_count
    tables = []
    if n:
        idx = _sample_index(n)
        head = result.cycle_columns(0, min(n, SAMPLE_ROWS if n > 2 * SAMPLE_ROWS else n))
        cols = head
        if n > 2 * SAMPLE_ROWS:
            tail = result.cycle_columns(n - SAMPLE_ROWS, n)
            cols = {k: np.concatenate((head[k], tail[k])) for k in head}
        # a rate in s/day means something for a clock; the files keep every column
        cols = {k: v for k, v in cols.items() if clock or k != "rate_s_per_day"}
        title = ("Per cycle" if n <= 2 * SAMPLE_ROWS else
                 f"Per cycle (first and last {SAMPLE_ROWS} of {n})")
        tables.append(_table("cycles", title, cols, range(len(idx))))
    warnings, notes = _messages(result)
    warnings += list(extra_warnings)
    notes += [("Cycle-averaged model: losses over the exact conservative orbit at each beat's "
              "amplitude, the push's energy per beat, the exact period at that amplitude. "
              "Where the assumptions fail (low Q, forcing near resonance, stick-slip) use the "
              "full integrator (swingcalc simulate without --averaged).")]
    name = result.model.name
    return Report("simulate", "Cycle-averaged long run" + (f": {name}" if name else ""), inputs, summary, tables, notes=notes,
                  warnings=warnings, cautions=cautions_for(context, loads=True))


def averaged_cycles_report(result) -> Report:
    """The whole per-cycle table of the averaged model (JSON/markdown/text files; CSV
    files are streamed by :meth:`~swingcalc.averaged.AveragedResult.write_cycles_csv`)."""
    cols = result.cycle_columns()
    return Report("simulate-cycles", "Per-cycle table (cycle-averaged)", [], [],
                  [_table("cycles", "Per cycle", cols, range(result.cycles_count))])
