"""Report of a tolerance analysis: the toleranced inputs, the bands of each output
(worst case, root-sum-square, Monte Carlo) and the inputs ranked by contribution. The
builder calls :func:`swingcalc.tolerance.analyse` and lays out its result; no maths here
beyond unit scaling."""

from __future__ import annotations

import math

from .cautions import cautions_for
from .design import _design_inputs, _title
from .model import Column, Item, Report, Table, amplitude_text

__all__ = ["tolerance_report"]

_DEG = 180.0 / math.pi
# SI unit of each input kind, as the inputs table shows it next to the SI values.
def _si_unit(kind: str) -> str:
    """The SI unit an input of ``kind`` is stored in (as the design file reads it)."""
    from ..quantity import KINDS

    return KINDS[kind].identity[0] if kind in KINDS else ""


_PERIOD_LABELS = {"period_s": ("period at the working amplitude", "s")}
_BODY_LABELS = {"reaction_N": ("peak pivot load", "N"),
                "arm_tension_N": ("peak pull along the arm", "N"),
                "angular_speed_rad_s": ("peak angular speed", "rad/s"),
                "angular_acceleration_rad_s2": ("peak angular acceleration", "rad/s^2")}
_POINT_LABELS = {"speed_m_s": ("peak speed", "m/s"),
                 "felt_g": ("peak felt acceleration", "g"),
                 "felt_normal_g": ("peak felt normal acceleration", "g"),
                 "felt_tangential_g": ("peak felt acceleration along the motion", "g")}


def _label(key: str, reference: str) -> tuple[str, str]:
    """(label, display unit) of an output."""
    if key == "rate_s_per_day":
        return f"rate against the {reference}", "s/day"
    if key in _PERIOD_LABELS:
        return _PERIOD_LABELS[key]
    if key in _BODY_LABELS:
        return _BODY_LABELS[key]
    point, q = key.rsplit(".", 1)
    label, unit = _POINT_LABELS[q]
    return f"{point}: {label}", unit


def tolerance_report(design, outputs=None, samples: int = 100_000, seed: int = 0,
                     distribution: str = "normal") -> Report:
    """Worst-case, RSS and Monte Carlo bands of the design's outputs under its
    ``[tolerances]`` (see :func:`swingcalc.tolerance.analyse`)."""
    from ..tolerance import PERIOD_OUTPUTS, analyse

    res = analyse(design, outputs, samples=samples, seed=seed, distribution=distribution)
    loads = [o.key for o in res.outputs if o.key not in PERIOD_OUTPUTS]
    inputs = _design_inputs(design) + [
        Item("distribution", "input distribution",
             "normal, band = +-3 sigma, truncated at the band ends"
             if res.distribution == "normal" else "uniform over the band"),
        Item("samples", "Monte Carlo samples", res.samples, fmt=".0f"),
        Item("seed", "random seed", res.seed, fmt=".0f")]
    summary = [Item("reference_period_s", f"rate measured against ({res.reference})",
                    res.reference_period_s, "s", fmt=".10g")]
    if res.load_amplitude_rad is not None:
        summary.append(Item("load_amplitude_rad", "load peaks at amplitude (the largest)",
                            res.load_amplitude_rad, "deg", _DEG, fmt=amplitude_text))
    summary += [Item("exact_evaluations", "exact evaluations of the design",
                     res.evaluations, fmt=".0f"),
                Item("check_samples", "samples evaluated exactly to check the surface",
                     res.check_samples, fmt=".0f")]

    in_table = Table(
        "inputs", "Toleranced inputs (SI)",
        (Column("input", "input"), Column("kind", "kind"),
         Column("nominal", "nominal", fmt=".8g"), Column("half_width", "+- half-width",
                                                          fmt=".4g"),
         Column("unit", "unit")),
        tuple((i.path, i.kind, i.nominal, i.half_width, _si_unit(i.kind))
              for i in res.inputs))

    cols = (Column("output", "output"), Column("label", "quantity", in_text=False),
            Column("unit", "unit"),
            Column("nominal", "nominal", fmt=".8g"),
            Column("worst_low", "worst case low", fmt=".8g"),
            Column("worst_high", "worst case high", fmt=".8g"),
            Column("worst_linear", "linear worst-case half-width", fmt=".4g", in_text=False),
            Column("corner_low", "exact sign-corner low", fmt=".8g", in_text=False),
            Column("corner_high", "exact sign-corner high", fmt=".8g", in_text=False),
            Column("rss", "RSS +- half-width", fmt=".4g"),
            Column("mc_mean", "Monte Carlo mean", fmt=".8g"),
            Column("mc_std", "Monte Carlo std", fmt=".4g"),
            Column("mc_low", "Monte Carlo 0.135 %", fmt=".8g"),
            Column("mc_high", "Monte Carlo 99.865 %", fmt=".8g"),
            Column("mc_min", "Monte Carlo min", fmt=".8g", in_text=False),
            Column("mc_max", "Monte Carlo max", fmt=".8g", in_text=False),
            Column("surrogate_error", "response-surface error (checked)", fmt=".2g"))
    rows, contrib_rows = [], []
    for o in res.outputs:
        label, unit = _label(o.key, res.reference)
        rows.append((f"{o.key}", label, unit, o.nominal, o.worst_low, o.worst_high,
                     o.worst_linear, o.corner_low, o.corner_high, o.rss, o.mc_mean, o.mc_std,
                     o.mc_low, o.mc_high, o.mc_min, o.mc_max, o.surrogate_error))
        contrib_rows += [(o.key, c.path, c.value, unit, c.share, c.mc_share)
                         for c in o.contributions]
    bands = Table("bands", "Tolerance bands (values in the unit shown)", cols, tuple(rows),
                  transpose=len(rows) <= 8)
    contrib = Table(
        "contributions", "Inputs ranked by contribution (largest first)",
        (Column("output", "output"), Column("input", "input"),
         Column("contribution", "change at the upper band end", fmt=".4g"),
         Column("unit", "unit"),
         Column("share", "share of variance", "%", 100.0, ".3g"),
         Column("mc_share", "share, from the samples", "%", 100.0, ".3g")),
        tuple(contrib_rows))

    notes = [res.method,
             ("Change at the upper band end: the first-order change of the output when the "
              "input goes from its nominal to the upper end of its band (central "
              "difference), in the output's unit; share of variance c_i^2 / sum c^2.")]
    rate = any(o.key == "rate_s_per_day" for o in res.outputs)
    if rate:
        notes[-1] += " Rates are positive when the clock gains."
    if any(i.path == "swing.amplitude" for i in res.inputs):
        notes.append("A band on swing.amplitude moves every listed amplitude by the same "
                     "amount (each kept in [0, 180) deg).")
    if rate and res.reference == "nominal period":
        notes.append("The design gives no target period: the rate is measured against "
                     "its nominal period, so it is 0 at the nominal design.")
    return Report("tolerance", _title("Tolerance analysis", design), inputs, summary,
                  [in_table, bands, contrib], notes=notes, warnings=list(res.warnings),
                  cautions=cautions_for(design.context, loads=bool(loads)))
