"""Quantity strings -> SI floats: conversion factors from published definitions, lists,
ranges and the rejections.

Conversion tolerances: pint multiplies chains of defining factors in binary floating
point, so a converted value can be a few units in the last place away from the exact
decimal definition; rel=4e-16 (about 2 ulp) allows that and nothing more.
"""

import math

import numpy as np
import pytest

from swingcalc.errors import InvalidInput
from swingcalc.quantity import MAX_VALUES, parse_quantity, parse_values

ULP2 = 4e-16


@pytest.mark.parametrize("text, kind, expected, source", [
    # NIST SP 811 (2008), Appendix B.8: 1 ft = 0.3048 m exactly; 1 in = 2.54 cm exactly.
    ("1 ft", "length", 0.3048, "NIST SP 811 B.8"),
    ("2.5 ft", "length", 0.762, "NIST SP 811 B.8"),
    ("1 in", "length", 0.0254, "NIST SP 811 B.8"),
    ("10 in", "length", 0.254, "NIST SP 811 B.8"),
    ("850 mm", "length", 0.85, "SI prefix milli = 1e-3 (SI Brochure, 9th ed., Table 7)"),
    # NIST SP 811 B.8: 1 lb (avoirdupois) = 0.45359237 kg exactly.
    ("1 lb", "mass", 0.45359237, "NIST SP 811 B.8"),
    ("1200 g", "mass", 1.2, "SI Brochure, 9th ed., Table 7"),
    # SI Brochure 9th ed. 2.3.1: t/degC = T/K - 273.15.
    ("20 degC", "temperature", 293.15, "SI Brochure 2.3.1"),
    ("0 degC", "temperature", 273.15, "SI Brochure 2.3.1"),
    # NIST SP 811 B.8: degF: T/K = (t/degF + 459.67) / 1.8.
    ("32 degF", "temperature", 273.15, "NIST SP 811 B.8"),
    # Standard gravity 9.80665 m/s^2 (3rd CGPM 1901).
    ("1 g0", "acceleration", 9.80665, "3rd CGPM (1901)"),
    ("1 ft/s^2", "acceleration", 0.3048, "NIST SP 811 B.8"),
    ("36 km/h", "speed", 10.0, "definition of km and h"),
    # 1 rpm = 2 pi / 60 rad/s (one revolution = 2 pi rad per minute) - definition.
    ("60 rpm", "angular_velocity", 2 * math.pi, "definition of the revolution"),
    ("180 deg/s", "angular_velocity", math.pi, "degree = pi/180 rad (SI Brochure Table 8)"),
    ("0.5 %", "fraction", 0.005, "percent = 1/100 (ISO 80000-1)"),
    ("200 ppm", "fraction", 2e-4, "ppm = 1e-6 (ISO 80000-1)"),
    ("2 min", "time", 120.0, "SI Brochure Table 8"),
])
def test_units_convert_by_their_published_definitions(text, kind, expected, source):
    assert parse_quantity(text, kind, "x") == pytest.approx(expected, rel=ULP2, abs=0), source


@pytest.mark.parametrize("text, expected", [
    # SI Brochure 9th ed. Table 8: 1 deg = (pi/180) rad; the trade gives bare angles in deg.
    ("30", math.pi / 6), ("30 deg", math.pi / 6), ("30°", math.pi / 6),
    ("0.5 rad", 0.5), ("90 degree", math.pi / 2), ("60 arcmin", math.pi / 180),
])
def test_angles_bare_in_degrees_units_honoured(text, expected):
    assert parse_quantity(text, "angle", "--amplitude") == pytest.approx(expected, rel=ULP2)


def test_bare_numbers_are_si():
    assert parse_quantity("0.994", "length", "--length") == 0.994
    assert parse_quantity(1.2, "mass", "--mass") == 1.2
    assert parse_quantity("9.81", "acceleration", "--gravity") == 9.81
    assert parse_quantity("0.001", "fraction", "--tolerance") == 0.001
    assert parse_quantity("1e-3", "length", "--length") == 0.001


def test_range_includes_stop_on_grid_and_exact_degrees():
    vals = parse_values("0:90:10", "angle", "--amplitude")
    assert len(vals) == 10
    assert vals[-1] == math.pi / 2          # 90 deg exactly pi/2 after rounding
    assert vals[3] == math.radians(30)


def test_range_stop_off_grid_is_excluded():
    assert parse_values("0:1:0.3", "length", "x") == pytest.approx([0, 0.3, 0.6, 0.9])


def test_range_on_decimal_grid_has_no_drift():
    # 0:1:0.1 should give the decimal grid points, not 0.30000000000000004.
    assert parse_values("0:1:0.1", "length", "x")[3] == 0.3


def test_trailing_unit_applies_to_bare_parts():
    assert parse_values("850, 900 mm", "length", "x") == pytest.approx([0.85, 0.9])
    assert parse_values("0:90:45 deg", "angle", "x") == pytest.approx(
        [0, math.pi / 4, math.pi / 2])
    assert parse_values("0.5, 1 rad", "angle", "x") == [0.5, 1.0]
    # a part with its own unit keeps it
    assert parse_values("850 mm, 1.2", "length", "x") == pytest.approx([0.85, 1.2])


def test_list_and_range_mix_in_order():
    assert parse_values("5, 10:30:10, 45", "angle", "x") == pytest.approx(
        [math.radians(v) for v in (5, 10, 20, 30, 45)])


def test_mixed_unit_range_is_laid_out_in_si():
    vals = parse_values("0 rad:1 rad:0.5 rad", "angle", "x")
    assert vals == [0.0, 0.5, 1.0]


@pytest.mark.parametrize("text, problem", [
    ("nan", "not a finite number"), ("inf", "not a finite number"),
    ("-inf m", "not a finite number"), ("1e999", "not a finite number"),
    ("NaN mm", "not a finite number"),
    ("3 flurb", "unknown unit"), ("3 kg", "is not a length"), ("3 deg", "is not a length"),
    ("", "empty"), ("m", "does not start with a number"), ("abc", "does not start"),
    ("3 m^9", "exponents"), ("3 m*2", "numbers may appear"),
    ("3 m; rm -rf", "may contain only"), ("3 __import__('os')", "may contain only"),
    ("1" * 101, "longer than"),
])
def test_bad_quantities_raise_one_line_naming_the_field(text, problem):
    with pytest.raises(InvalidInput) as err:
        parse_quantity(text, "length", "--length")
    msg = str(err.value)
    assert msg.startswith("--length: ")
    assert problem in msg
    assert "\n" not in msg


@pytest.mark.parametrize("text, kind, field, match", [
    # unknown units suggest the close one
    ("3 KG", "mass", "--mass", "did you mean 'kg'"),
    ("3 mmm", "length", "--length", "did you mean 'mm'"),
    # Hz is cycles per second without the 2 pi: ambiguous as an angular speed, refused
    ("2 Hz", "angular_velocity", "--angular-speed", "frequency"),
    # percent is not an angle, degrees are not a fraction
    ("10 %", "angle", "x", "not an angle"),
    ("10 deg", "fraction", "x", "not a fraction"),
    # a bare temperature would be read as kelvin: it needs a unit
    ("20", "temperature", "x", "needs a unit"),
])
def test_refused_quantities_say_why(text, kind, field, match):
    with pytest.raises(InvalidInput, match=match):
        parse_quantity(text, kind, field)


def test_bounds_are_checked_and_reported_with_the_text():
    with pytest.raises(InvalidInput, match=r"out of range \(got '0 mm'\)"):
        parse_quantity("0 mm", "length", "--length", minimum=0.0, include_min=False)
    with pytest.raises(InvalidInput, match="out of range"):
        parse_values("0:180:10", "angle", "--amplitude", minimum=0, maximum=math.pi,
                     include_max=False)


@pytest.mark.parametrize("text, problem", [
    ("0:90", "three parts"), ("0:90:10:5", "three parts"), ("90:0:10", "start must not"),
    ("0:90:0", "step must be > 0"), ("0:90:-5", "step must be > 0"), ("0:x:5", "number"),
    ("1,,2", "empty item"), (",", "empty item"), ("0:1e9:1", "more than"),
    ("0:nan:1", "not a finite"),
])
def test_malformed_lists_and_ranges(text, problem):
    with pytest.raises(InvalidInput) as err:
        parse_values(text, "angle", "--amplitude")
    assert problem in str(err.value)
    assert str(err.value).startswith("--amplitude: ")


def test_value_count_limit():
    assert len(parse_values(f"1:{MAX_VALUES}:1", "length", "x")) == MAX_VALUES
    with pytest.raises(InvalidInput, match="more than"):
        parse_values(f"0:{MAX_VALUES}:1", "length", "x")


def test_suggest_prefers_a_case_only_match_then_close_ones():
    from swingcalc.quantity import suggest

    assert suggest("FT", ("m", "ft", "in")) == "; did you mean 'ft'?"
    assert suggest("flexibel", ("rigid", "flexible")) == "; did you mean 'flexible'?"
    assert suggest("zzz", ("rigid", "flexible")) == ""
    assert suggest("metres", (), fallback=("metre", "meter")) .startswith("; did you mean")


def test_units_converted_without_pint_agree_with_pint():
    """The units swingcalc.quantity converts by definition (to spare loading pint) against
    pint's own conversion (the general-purpose reference): 2 ulp allows the two routes'
    rounding (a division by 1000 against pint's multiplication by 0.001)."""
    import pint

    from swingcalc import quantity as Q

    ureg = pint.UnitRegistry()
    for kind, table in Q._EXACT.items():
        si = Q.KINDS[kind].si
        for unit in table:
            for mag in (1.0, 850.0, 0.3):
                got = Q._to_si(np.array([mag]), unit, Q.KINDS[kind], "x", unit, "")[0]
                want = ureg.Quantity(mag, ureg.parse_units(unit)).to(si).magnitude
                assert got == pytest.approx(want, rel=4.5e-16), (kind, unit, mag)
    for unit in Q._CELSIUS[:1] + Q._FAHRENHEIT[:1]:
        got = Q._to_si(np.array([68.0]), unit, Q.KINDS["temperature"], "x", unit, "")[0]
        want = ureg.Quantity(68.0, unit).to("K").magnitude
        assert got == pytest.approx(want, rel=4.5e-16), unit
