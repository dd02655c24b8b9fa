"""The spec sheet: rows equal the library's, anchored to outside values; the units table
against the exact definitions; CSV and JSON parse back; SVG and PDF carry their text and
are reproducible.

Sources:
- Period of a point bob, T = 2 pi sqrt(L/g) (2/pi) K(sin^2(A/2)) (Lawden, Elliptic
  Functions and Applications, sec. 5.2; DLMF 19.2.8), evaluated by mpmath at 40+ digits
  (tests/helpers.mp_period_ratio).
- Point mass on a light rod or string: tension m g (3 cos theta - 2 cos A), the
  over-the-top bottom speed sqrt(4 g L) on a rod and sqrt(5 g L) on a string (loop the
  loop), energy to the top 2 m g L [mem: standard mechanics, e.g. Young & Freedman,
  University Physics, ch. 5-7 circular motion and energy].
- Two beats per period, 3600 beats per hour for a seconds pendulum: common practice.
- Unit definitions: inch 0.0254 m, pound 0.45359237 kg, lbf = lb x 9.80665 m/s^2 (exact);
  NIST SP 811 (2008) Appendix B.9 factors lbf -> N 4.448 222, ft lbf -> J 1.355 818,
  lb in^2 -> kg m^2 2.926 397 E-04, lb/ft^3 -> kg/m^3 16.018 46 [mem: SP 811 table
  values recalled, printed to 7 digits].
"""

from __future__ import annotations

import csv
import dataclasses
import functools
import io
import json
import math
import re
import zlib

import mpmath
import pytest
from helpers import mp_period_ratio, rel

from swingcalc import examples
from swingcalc.compound import thermal_rate
from swingcalc.designfile import load_design, parse_design, point_design
from swingcalc.linear import clock_rate_error
from swingcalc.loads import impact, swing_loads
from swingcalc.report import units as U
from swingcalc.report.spec import VALUE_DIGITS, spec_sheet, to_csv, to_json
from swingcalc.sizing import period_at, rating_adjustment
from swingcalc.spec import spec_rows, spec_values

G = 9.80665
# A shown value has VALUE_DIGITS significant digits: it is within half a unit of the
# last digit, 5e-7 relative for 7 digits; 1e-6 leaves room for the float's own rounding.
SHOWN_RTOL = 10.0 ** (1 - VALUE_DIGITS)


def _design(name):
    return load_design(examples.path(name))


@functools.cache
def _clock_sheet(system="si-mm"):
    """The bundled clock's sheet, with its bands (2 n + 1 = 9 evaluations: computed once)."""
    return spec_sheet(_design("long_case_clock.toml"), system)


def _values(rows):
    return {r.key: r.value for r in rows}


def _point(length=0.8, mass=2.0, suspension="rigid", amps_deg=(30.0, 60.0)):
    return point_design(length, mass, suspension, tuple(math.radians(a) for a in amps_deg))


# --- outside anchors --------------------------------------------------------------------


def test_point_bob_period_rows_match_mpmath_elliptic_period():
    """Period at zero and at each amplitude = 2 pi sqrt(L/g) (2/pi) K(sin^2(A/2)), mpmath
    at 40 digits (Lawden sec. 5.2). Tolerance 1e-13: the library is held to 1e-14 of a
    50-digit reference for the ratio (PRODUCT.md), plus a few ulps in sqrt(L/g)."""
    L = 0.8
    d = _point(L)
    v = _values(spec_rows(d))
    with mpmath.workdps(40):
        t0 = 2 * mpmath.pi * mpmath.sqrt(mpmath.mpf(L) / mpmath.mpf(G))
    assert rel(v["small_angle_period_s"], t0) < 1e-13
    for n, a in enumerate(d.amplitudes_rad, start=1):
        assert rel(v[f"amplitude_{n}.period_s"], t0 * mp_period_ratio(a)) < 1e-13
        assert v[f"amplitude_{n}.amplitude_rad"] == a


def test_seconds_pendulum_beats_3600_per_hour():
    """L = g / pi^2 swings with T0 = 2 s: 3600 beats per hour at zero amplitude (two beats
    per period: common practice). 1e-13: a few roundings in L and T0."""
    from dataclasses import replace

    d = point_design(G / math.pi ** 2, 1.0, "rigid", (math.radians(2.0),))
    v = _values(spec_rows(replace(d, context="clock")))
    assert v["small_angle_beats_per_hour"] == pytest.approx(3600.0, rel=1e-13)
    # at 2 deg the period is longer by the elliptic ratio, so fewer beats (mpmath):
    want = 3600.0 / mp_period_ratio(math.radians(2.0))
    assert rel(v["amplitude_1.beats_per_hour"], want) < 1e-13
    # anything but a clock gets its frequency instead: 1/T0 = 0.5 Hz
    v = _values(spec_rows(d))
    assert "small_angle_beats_per_hour" not in v
    assert v["small_angle_frequency_hz"] == pytest.approx(0.5, rel=1e-13)
    assert rel(v["amplitude_1.frequency_hz"], want / 7200.0) < 1e-13


def test_point_bob_loads_and_margins_match_circular_motion():
    """Rigid rod, point mass (standard mechanics, from memory): peak tension and pivot
    load m g (3 - 2 cos A), least tension m g cos A, energy to the top 2 m g L, bottom
    angular speed to go over sqrt(4 g / L), swing energy m g L (1 - cos A).
    Tolerances: 1e-12, a few roundings of closed forms (the library's peak search refines
    to the float; its energies are the sin^2 forms of the same quantities)."""
    L, m = 0.8, 2.0
    d = _point(L, m)
    v = _values(spec_rows(d))
    for n, a in enumerate(d.amplitudes_rad, start=1):
        at = f"amplitude_{n}."
        assert v[at + "peak_tension_N"] == pytest.approx(m * G * (3 - 2 * math.cos(a)),
                                                         rel=1e-12)
        assert v[at + "peak_pivot_load_N"] == pytest.approx(m * G * (3 - 2 * math.cos(a)),
                                                            rel=1e-12)
        assert v[at + "least_tension_N"] == pytest.approx(m * G * math.cos(a), rel=1e-12)
        assert v[at + "energy_J"] == pytest.approx(m * G * L * (1 - math.cos(a)), rel=1e-12)
        # peak angular speed sqrt(2 g (1 - cos A) / L): the over-the-top ratio follows
        ratio = math.sqrt(4 * G / L) / math.sqrt(2 * G * (1 - math.cos(a)) / L)
        assert v[at + "over_top_speed_ratio"] == pytest.approx(ratio, rel=1e-12)
    assert v["separatrix_energy_J"] == pytest.approx(2 * m * G * L, rel=1e-14)
    assert v["over_top_angular_speed_rad_s"] == pytest.approx(math.sqrt(4 * G / L),
                                                              rel=1e-14)
    assert next(r for r in spec_rows(d) if r.key == "slack_margin").value == "rigid: none"


def test_point_bob_on_a_string_slack_and_loop_the_loop_speed():
    """Flexible suspension, point mass (from memory, standard): over the top needs
    omega_b = sqrt(5 g / L) at the bottom; the string goes slack where
    3 cos theta = 2 cos A, only for A > 90 deg; no slack at 60 deg. 1e-12: closed forms."""
    L = 2.0
    d = _point(L, 80.0, "flexible", (60.0, 100.0))
    v = _values(spec_rows(d))
    assert v["over_top_angular_speed_rad_s"] == pytest.approx(math.sqrt(5 * G / L), rel=1e-12)
    assert v["amplitude_1.slack_angle_rad"] == "never (taut throughout)"
    assert v["amplitude_1.slack_margin_rad"] == pytest.approx(math.radians(30.0), rel=1e-14)
    a = math.radians(100.0)
    assert v["amplitude_2.slack_angle_rad"] == pytest.approx(
        math.acos(2 * math.cos(a) / 3), rel=1e-12)
    assert v["amplitude_2.slack_margin_rad"] == pytest.approx(-math.radians(10.0), rel=1e-12)
    assert v["amplitude_2.least_tension_N"] == 0.0
    # the energy at the bottom that carries it over the top taut is 1/2 m L^2 (5 g/L) =
    # 2.5 m g L (not the rigid arm's 2 m g L), and the margin is measured against it:
    # 1 - m g L (1 - cos A) / (2.5 m g L) (closed forms, 1e-12)
    m = 80.0
    assert v["separatrix_energy_J"] == pytest.approx(2.5 * m * G * L, rel=1e-12)
    assert v["amplitude_2.separatrix_margin"] == pytest.approx(1 - (1 - math.cos(a)) / 2.5,
                                                               rel=1e-12)


def test_clock_rate_per_degree_of_amplitude_matches_mpmath_derivative():
    """A clock regulated at its working amplitude A gains 86400 (T(A)/T(x) - 1) s/day at
    amplitude x: its slope at x = A is -86400 R'(A)/R(A), R = T/T0 = (2/pi) K(sin^2(A/2))
    (mpmath derivative at 30 digits). Tolerance 1e-6: the library's central difference
    with step 1e-5 of A (measured 3e-8 to 8e-8 at a clock's few degrees, sizing docs)."""
    d = parse_design('name = "c"\ncontext = "clock"\n[pendulum]\nlength = "994 mm"\n'
                     'bob_mass = "1 kg"\nsuspension = "rigid"\n[swing]\namplitude = "2 deg"\n',
                     "<test>")
    v = _values(spec_rows(d))
    a = math.radians(2.0)
    with mpmath.workdps(30):
        def ratio(x):
            return 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(x / 2) ** 2)
        x = mpmath.mpf(a)
        want = -86400 * mpmath.diff(ratio, x) / ratio(x)
    assert rel(v["rate_per_amplitude_s_per_day_per_rad"], want) < 1e-6
    # the shown unit is per degree: pi/180 of the per-radian SI value (definition)
    assert U.to_display(1.0, "rate_per_angle") == pytest.approx(math.pi / 180, rel=1e-15)


# --- the sheet equals the library --------------------------------------------------------


@pytest.mark.parametrize("name", examples.names())
def test_rows_equal_the_library_called_directly(name):
    """Plumbing: each row is the library's value for the same design (exact: the same
    computation on the same inputs)."""
    d = _design(name)
    v = _values(spec_rows(d))
    pend = d.pendulum
    assert v["design_name"] == d.name
    assert v["mass_kg"] == pend.body.mass_kg
    assert v["inertia_pivot_kg_m2"] == pend.body.inertia_pivot_kg_m2
    assert v["equivalent_length_m"] == pend.body.equivalent_length_m
    points = d.points_dict()
    flexible = pend.body.suspension.flexible
    for n, a in enumerate(d.amplitudes_rad, start=1):
        at = f"amplitude_{n}."
        assert v[at + "period_s"] == period_at(pend, a)
        loads = swing_loads(pend, a, points=points, samples=3)
        assert v[at + "peak_pivot_load_N"] == loads.peak("reaction_N").value
        tension = "payload_tension_N" if flexible else "arm_tension_N"
        assert v[at + "peak_tension_N"] == loads.peak(tension).value
        for p in points:
            assert v[f"{at}{p}.peak_felt_g"] == abs(loads.peak(f"{p}.felt_g").value)
        assert (f"{at}slack_margin_rad" in v) == flexible
        if d.context == "clock":
            assert v[at + "clock_rate_s_per_day"] == clock_rate_error(a)
    if d.context == "clock":
        assert v["thermal_rate_s_per_day_per_K"] == thermal_rate(pend).rate_s_per_day_per_K
    if d.impact is not None:
        r = impact(pend, d.impact.drop_angle_rad, d.impact.strike_radius_m,
                   d.impact.rise_angle_rad)
        assert v["impact_energy_J"] == r.potential_energy_J
        assert v["striking_speed_m_s"] == r.striking_speed_m_s
        assert v["absorbed_energy_J"] == r.absorbed_J
    rows = spec_rows(d)
    assert len(v) == len(rows)              # keys are unique
    for r in rows:                          # every kind has a unit in every system
        for system in U.SYSTEMS:
            U.display_unit(r.kind, system)


def test_clock_rating_rows_equal_rating_adjustment():
    """The bundled clock's rating rows: rating_adjustment per mm (stored per m) and per
    turn of its 0.75 mm nut."""
    d = _design("long_case_clock.toml")
    v = _values(spec_rows(d))
    adj = rating_adjustment(d.pendulum, d.rating.parts, d.amplitudes_rad[0],
                            d.rating.nut_pitch_m)
    assert v["rating_rate_s_per_day_per_m"] == pytest.approx(
        adj["rate_s_per_day_per_mm"] * 1e3, rel=1e-15)
    assert v["rating_rate_s_per_day_per_turn"] == adj["rate_s_per_day_per_turn"]
    # A seconds pendulum loses about 86400 / (2 L) s/day per m of lowering: ~43 s/day per
    # mm (dT/T = dL / 2L, common practice); the compound bob is close to it (10 %).
    assert v["rating_rate_s_per_day_per_m"] * 1e-3 == pytest.approx(-43.5, rel=0.1)


def test_non_clock_designs_have_no_clock_rows_and_impact_only_with_impact():
    d = _design("gate_arm.toml")
    sections = {r.section for r in spec_rows(d)}
    assert "clock" not in sections and "impact" not in sections
    assert "impact" in {r.section for r in spec_rows(_design("impact_hammer.toml"))}


def test_keys_do_not_depend_on_the_amplitude_value():
    """Band matching needs the same keys when a tolerance moves the amplitude."""
    d = _point(amps_deg=(30.0,))
    moved = d.with_changes(amplitudes=(math.radians(31.0),))
    assert [r.key for r in spec_rows(d)] == [r.key for r in spec_rows(moved)]


def test_spec_values_holds_only_the_numbers():
    v = spec_values(_design("long_case_clock.toml"))
    assert all(isinstance(x, float) for x in v.values())
    assert "design_name" not in v and "mass_kg" in v


# --- units ------------------------------------------------------------------------------


def test_unit_factors_match_the_exact_definitions():
    """Exact definitions (1959 agreement; NIST SP 811 App. B): compared exactly or to the
    last bit, as they are products of exact decimals."""
    assert U.to_display(0.0254, "length", "inch-pound") == pytest.approx(1.0, rel=1e-15)
    assert U.to_display(0.3048, "speed", "inch-pound") == pytest.approx(1.0, rel=1e-15)
    assert U.to_display(0.45359237, "mass", "inch-pound") == pytest.approx(1.0, rel=1e-15)
    assert U.POUND_FORCE_N == pytest.approx(0.45359237 * 9.80665, rel=1e-16)
    assert U.to_display(1.0, "length", "si-mm") == 1000.0
    assert U.to_display(1.0, "inertia", "si-mm") == 1e6
    # 20 degC = 68 degF = 293.15 K (definitions of the scales)
    assert U.to_display(293.15, "temperature", "inch-pound") == pytest.approx(68.0, rel=1e-14)
    assert U.to_display(293.15, "temperature", "si") == pytest.approx(20.0, rel=1e-13)
    assert U.to_display(5.0, "temperature", "inch-pound", difference=True) == pytest.approx(9.0)
    # a rate per kelvin is 5/9 of it per degF; per mm 1/1000 of it per m
    assert U.to_display(1.0, "rate_per_temperature", "inch-pound") == pytest.approx(5 / 9)
    assert U.to_display(1.0, "rate_per_length", "si-mm") == pytest.approx(1e-3, rel=1e-15)


@pytest.mark.parametrize("kind, si_per_unit", [
    ("force", 4.448222), ("energy", 1.355818), ("inertia", 2.926397e-4),
    ("density", 16.01846)])
def test_unit_factors_match_nist_sp811_printed_values(kind, si_per_unit):
    """NIST SP 811 App. B.9 (values recalled from memory, printed to 7 digits): the SI
    value of one inch-pound unit. Tolerance 5e-7: half a unit of the 7th digit."""
    one_unit_in_si = U.from_display(1.0, kind, "inch-pound")
    assert one_unit_in_si == pytest.approx(si_per_unit, rel=5e-7)


def test_inch_pound_sheet_shows_the_same_quantities_converted():
    """Same keys, labels and SI values; each shown value is the SI one converted (within
    the 7-digit rounding of each side)."""
    d = _design("impact_hammer.toml")
    si, ip = spec_sheet(d, "si"), spec_sheet(d, "inch-pound")
    assert [(r.key, r.label, r.value) for r in si.rows] == \
           [(r.key, r.label, r.value) for r in ip.rows]
    units = {r.key: r.unit for r in ip.rows}
    assert units["mass_kg"] == "lb" and units["impact_energy_J"] == "ft lbf"
    assert units["strike_radius_m"] == "in" and units["striking_speed_m_s"] == "ft/s"
    for a, b in zip(si.rows, ip.rows):
        if isinstance(a.value, float) and a.kind != "temperature":
            f = U.to_display(1.0, a.kind, "inch-pound") / U.to_display(1.0, a.kind, "si")
            assert float(b.shown) == pytest.approx(float(a.shown) * f, rel=2 * SHOWN_RTOL)
    # 300 J hammer: 221.3 ft lbf (1 ft lbf = 1.355818 J, SP 811), from the SI row
    e = float(ip.row("impact_energy_J").shown)
    assert e == pytest.approx(si.row("impact_energy_J").value / 1.355818, rel=1e-6)


# --- formats ----------------------------------------------------------------------------


@pytest.mark.parametrize("system", U.SYSTEMS)
def test_csv_parses_back_to_the_values_at_the_shown_precision(system):
    """csv module: header, one row per quantity; each number, read back and converted to
    SI, is the row's SI value within the 7-digit rounding."""
    d = dataclasses.replace(_design("long_case_clock.toml"), tolerances=())   # bands: below
    rows = {r.key: r for r in spec_rows(d)}
    text = to_csv(spec_sheet(d, system))
    table = list(csv.reader(io.StringIO(text)))
    assert table[0][:6] == ["section", "quantity", "value", "unit", "+/- RSS",
                            "+/- worst case"]
    seen = 0
    for section, label, value, unit, _rss, _worst, key in table[1:]:
        if section in ("notes", "cautions", "tolerances"):
            continue
        r = rows[key]
        assert label == r.label and section == r.section
        if isinstance(r.value, float):
            assert unit == U.display_unit(r.kind, system).unit
            back = U.from_display(float(value), r.kind, system)
            assert back == pytest.approx(r.value, rel=SHOWN_RTOL, abs=1e-12)
            seen += 1
        else:
            assert value == r.value
    assert seen == sum(isinstance(r.value, float) for r in rows.values())
    assert any(row[0] == "cautions" for row in table)


def test_json_keeps_si_and_the_cautions():
    """JSON: SI values exactly (repr round-trips), whatever --units shows."""
    d = _design("garden_swing_seat.toml")
    out = json.loads(to_json(spec_sheet(d, "inch-pound")))
    assert out["values"]["mass_kg"] == d.pendulum.body.mass_kg
    assert out["values"] == {k: v for k, v in _values(spec_rows(d)).items()}
    assert any("EN 1176" in c for c in out["cautions"])
    assert out["design"]["name"] == d.name


# --- vector table ------------------------------------------------------------------------


def _pdf_text(data: bytes) -> str:
    """The text of every Flate stream of a PDF (zlib), joined."""
    out = []
    for m in re.finditer(rb"stream\r?\n(.*?)\r?\nendstream", data, re.DOTALL):
        try:
            out.append(zlib.decompress(m.group(1)).decode("latin-1"))
        except zlib.error:
            continue
    return "\n".join(out)


@pytest.mark.slow
@pytest.mark.parametrize("fmt", ["svg", "pdf"])
def test_vector_sheet_holds_labels_and_values_as_text_and_is_reproducible(fmt):
    pytest.importorskip("matplotlib", reason="the plot extra (matplotlib) is not installed")
    from swingcalc.report.spec_drawing import render_vector

    d = _design("long_case_clock.toml")
    sheet = _clock_sheet("si-mm")
    data = render_vector(sheet, fmt)
    # byte-identical on a second run (a whole second CLI run: tests/test_cli_spec.py)
    assert data == render_vector(sheet, fmt)
    if fmt == "svg":
        text = data.decode("utf-8")
        assert text.startswith("<?xml") and "<svg" in text
        found = re.findall(r"<text[^>]*>([^<]*)</text>", text)
    else:
        assert data.startswith(b"%PDF-") and data.rstrip().endswith(b"%%EOF")
        assert data.count(b"/Type /Page ") == 1                  # one page
        content = _pdf_text(data)
        # (string) Tj, long strings on lines of their own; \( \) \\ are escapes
        found = re.findall(r"\(((?:[^()\\]|\\.)*)\)\s*Tj", content)
        found = [re.sub(r"\\(.)", r"\1", s) for s in found]
        assert b"/CreationDate" not in data
    assert d.name in found and "revision C    date 2026-11-24    context clock    units " \
        "si-mm" in found
    for key in ("mass_kg", "amplitude_1.period_s", "rating_rate_s_per_day_per_turn",
                "inertia_pivot_kg_m2"):
        r = sheet.row(key)
        assert r.label in found and r.shown in found, key
    assert "kg mm^2" in found and "CAUTIONS" in found
    assert "a licensed engineer must check" in " ".join(" ".join(found).split())


def test_vector_formats_refused_without_matplotlib(monkeypatch):
    """No matplotlib: a one-line bad-input error naming the extra (no traceback)."""
    import sys

    from swingcalc.errors import InvalidInput
    from swingcalc.report.spec_drawing import require_matplotlib

    monkeypatch.setitem(sys.modules, "matplotlib", None)       # import fails
    with pytest.raises(InvalidInput, match=r"plot extra"):
        require_matplotlib("pdf")


# --- tolerance bands ----------------------------------------------------------------------

_BANDED = '''name = "banded bob"
[pendulum]
length = "1 m"
bob_mass = "2 kg"
suspension = "rigid"
[swing]
amplitude = "30 deg"
[tolerances]
"pendulum.length" = "1 mm"
"pendulum.bob_mass" = "1 %"
'''


def test_bands_of_a_point_bob_match_hand_error_propagation():
    """Point bob, L = 1 m +- 1 mm, m = 2 kg +- 1 %, A = 30 deg (by hand, outside the code):
    the period does not depend on the mass, so its band is the length's alone,
    c = 2 pi / sqrt(g) R(A) (sqrt(L + t) - sqrt(L - t)) / 2 (mpmath, 40 digits), and
    RSS = worst case; the peak pivot load m g (3 - 2 cos A) does not depend on L, so its
    band is 1 % of it. Tolerances: 1e-9, the bands are differences of two periods that
    each carry ~1e-15 relative (a difference of 1e-3 of the period keeps ~1e-12)."""
    d = parse_design(_BANDED, "<banded>")
    sheet = spec_sheet(d, "si")
    a = math.radians(30.0)
    with mpmath.workdps(40):
        L, t = mpmath.mpf(1), mpmath.mpf("0.001")
        want = (2 * mpmath.pi / mpmath.sqrt(mpmath.mpf(G)) * mp_period_ratio(a)
                * (mpmath.sqrt(L + t) - mpmath.sqrt(L - t)) / 2)
    period = sheet.row("amplitude_1.period_s")
    assert rel(period.rss, want) < 1e-9 and rel(period.worst, want) < 1e-9
    load = sheet.row("amplitude_1.peak_pivot_load_N")
    peak = 2.0 * G * (3 - 2 * math.cos(a))
    assert load.rss == pytest.approx(0.01 * peak, rel=1e-9)
    assert load.worst == pytest.approx(0.01 * peak, rel=1e-9)
    assert sheet.row("mass_kg").rss == pytest.approx(0.02, rel=1e-12)
    # shown: 3 significant digits in the display unit
    assert sheet.row("amplitude_1.period_s").rss_shown == f"{float(want):.3g}"
    assert "pendulum.length +/- 1 mm" in " ".join(spec_sheet(d, "si-mm").tolerances)


def test_no_tolerances_no_bands():
    sheet = spec_sheet(_design("gate_arm.toml"), "si")
    assert all(r.rss is None and r.rss_shown == "" for r in sheet.rows)
    assert any("no +/- bands" in n for n in sheet.notes)


@pytest.mark.slow
def test_clock_bands_in_csv_parse_back_and_rss_within_worst():
    """The bundled clock's [tolerances]: every numeric row has a band; RSS <= worst case
    (a root-sum-square never exceeds the sum of magnitudes); the CSV shows them in the
    display unit to 3 digits (half a unit of the 3rd digit: 5e-3 relative)."""
    sheet = _clock_sheet("si-mm")
    numeric = [r for r in sheet.rows if isinstance(r.value, float)]
    assert all(r.rss is not None for r in numeric)
    assert all(r.rss <= r.worst * (1 + 1e-12) for r in numeric)
    table = {row[6]: row for row in csv.reader(io.StringIO(to_csv(sheet))) if row[6]}
    for r in numeric:
        if r.rss > 0:
            shown = float(table[r.key][4])
            back = U.to_display(r.rss, r.kind, "si-mm", difference=True)
            assert shown == pytest.approx(abs(back), rel=5e-3)
    # the period's band is dominated by the bob's position: 0.2 mm on ~1 m moves the
    # period by about T dL / 2L = 2e-4 s (first order, common practice)
    assert sheet.row("amplitude_1.period_s").rss == pytest.approx(2e-4, rel=0.3)
