"""Design files: the bundled examples parse, and each kind of mistake gives one line that
names the file, the field (and line), the value and what is allowed."""

import math

import pytest

from swingcalc import STANDARD_GRAVITY, examples
from swingcalc.designfile import load_design, parse_design
from swingcalc.errors import InvalidInput

GOOD = """\
name = "Test arm"
revision = "2"
context = "gate"

[pendulum]
length = "850 mm"
bob_mass = "12 kg"
suspension = "rigid"

[swing]
amplitude = ["10 deg", "0.5 rad"]

[environment]
gravity = "9.81 m/s^2"
"""


def _with(old: str, new: str) -> str:
    assert old in GOOD
    return GOOD.replace(old, new)


def _error(text: str) -> str:
    with pytest.raises(InvalidInput) as err:
        parse_design(text, "arm.toml")
    msg = str(err.value)
    assert "\n" not in msg
    assert msg.startswith("arm.toml")
    return msg


def test_good_file_converts_every_quantity_to_si():
    d = parse_design(GOOD, "arm.toml")
    assert d.name == "Test arm" and d.revision == "2" and d.context == "gate"
    bob, = d.parts
    assert bob.shape == "point" and bob.position == pytest.approx(0.85, rel=1e-15)
    assert bob.mass == 12.0
    assert d.suspension.kind == "rigid"
    assert d.amplitudes_rad == pytest.approx((math.radians(10), 0.5), rel=1e-15)
    assert d.gravity_m_s2 == 9.81


def test_bundled_examples_parse():
    names = examples.names()
    assert examples.DEFAULT in names and len(names) >= 2
    clock = parse_design(examples.text(), examples.DEFAULT)
    assert clock.context == "clock" and clock.suspension.kind == "rigid"
    assert clock.gravity_m_s2 == STANDARD_GRAVITY
    seat = parse_design(examples.text("garden_swing_seat.toml"), "seat")
    assert seat.suspension.flexible
    # at least one amplitude past the slack limit of a point bob on a chain: the slack
    # angle exists when sin^2(A/2) > 1/2, i.e. A > 90 deg (energy + radial equation).
    assert max(seat.amplitudes_rad) > math.pi / 2


def test_gravity_defaults_to_standard_and_amplitude_may_be_a_range():
    text = _with('[environment]\ngravity = "9.81 m/s^2"\n', "").replace(
        'amplitude = ["10 deg", "0.5 rad"]', 'amplitude = "0:30:10 deg"')
    d = parse_design(text, "arm.toml")
    assert d.gravity_m_s2 == STANDARD_GRAVITY
    assert len(d.amplitudes_rad) == 4


def test_syntax_error_names_the_line_and_hints_at_quotes():
    msg = _error(_with('length = "850 mm"', "length = 850 mm"))
    assert "line 6" in msg and "TOML syntax error" in msg and "in quotes" in msg


def test_unknown_field_suggests_the_right_one():
    msg = _error(_with('bob_mass = "12 kg"', 'bob_mas = "12 kg"'))
    assert "pendulum.bob_mas" in msg and "did you mean 'bob_mass'" in msg and "line 7" in msg


def test_unknown_section_suggests_the_right_one():
    msg = _error(_with("[environment]", "[enviroment]"))
    assert "did you mean 'environment'" in msg


def test_wrong_type_is_named():
    msg = _error(_with('length = "850 mm"', "length = true"))
    assert "pendulum.length" in msg and "wrong type" in msg


def test_missing_length_is_named():
    msg = _error(_with('length = "850 mm"\n', ""))
    assert "missing required field 'length'" in msg and "got None" not in msg


def test_missing_section_is_named():
    msg = _error(_with('[swing]\namplitude = ["10 deg", "0.5 rad"]\n', ""))
    assert "[swing]" in msg and "missing section" in msg


def _error_mentioning(old, new, words):
    """The error of the example file edited old -> new, checked to contain every word."""
    msg = _error(_with(old, new))
    for w in words:
        assert w in msg, (w, msg)
    return msg


@pytest.mark.parametrize("old, new, words", [
    ('length = "850 mm"', 'length = "-850 mm"', ["pendulum.length", "out of range"]),
    ('length = "850 mm"', 'length = "850 kg"', ["pendulum.length", "not a length"]),
    ('amplitude = ["10 deg", "0.5 rad"]', 'amplitude = ["10 deg", "180 deg"]',
     ["swing.amplitude", "out of range", "180 deg"]),
    ('amplitude = ["10 deg", "0.5 rad"]', "amplitude = []", ["swing.amplitude", "empty"]),
    ('suspension = "rigid"', 'suspension = "chain"', ["pendulum.suspension", "rigid or flexible"]),
    ('context = "gate"', 'context = "rides"', ["context", "did you mean 'ride'"]),
    ('gravity = "9.81 m/s^2"', 'gravity = "nan m/s^2"', ["environment.gravity", "finite"]),
])
def test_bad_values_name_field_value_and_allowed(old, new, words):
    msg = _error_mentioning(old, new, words)
    assert "allowed:" in msg


def test_missing_file_is_an_invalid_input(tmp_path):
    with pytest.raises(InvalidInput, match="no such file"):
        load_design(tmp_path / "none.toml")


def test_non_utf8_file_is_an_invalid_input(tmp_path):
    p = tmp_path / "bad.toml"
    p.write_bytes(b"name = \"\xff\xfe\"\n")
    with pytest.raises(InvalidInput, match="UTF-8"):
        load_design(p)


@pytest.mark.parametrize("old, new, words", [
    ('name = "Test arm"', "name = 3", ["name", "wrong type", "text in quotes"]),
    ('revision = "2"', "revision = 2", ["revision", "wrong type"]),
    ('name = "Test arm"', 'name = "Arm \\u001b[31mred"', ["name", "control character U+001B"]),
    ('revision = "2"', 'revision = "2\\u0007"', ["revision", "control character U+0007"]),
    ('name = "Test arm"', 'name = """Two\nlines"""', ["name", "control character U+000A"]),
])
def test_design_strings_are_plain_one_line_texts(old, new, words):
    _error_mentioning(old, new, words)


def test_absent_values_show_no_got():
    for text in (_with('length = "850 mm"\n', ""),
                 _with('[swing]\namplitude = ["10 deg", "0.5 rad"]\n', "")):
        msg = _error(text)
        assert "(got" not in msg, msg


def test_case_only_slip_in_a_word_is_suggested():
    msg = _error(_with('context = "gate"', 'context = "Gate"'))
    assert "did you mean 'gate'" in msg


def test_gravity_word_any_case_and_wrong_type():
    d = parse_design(_with('gravity = "9.81 m/s^2"', 'gravity = " Standard "'), "arm.toml")
    assert d.gravity_m_s2 == STANDARD_GRAVITY and d.environment.gravity_given == "standard"
    msg = _error(_with('gravity = "9.81 m/s^2"', "gravity = true"))
    assert "environment.gravity" in msg and "wrong type" in msg


def test_a_toml_date_is_taken_as_the_design_date():
    """A bare TOML date (RFC 3339 full-date, TOML 1.0 "Local Date") is a date: kept as its
    ISO text, as a quoted date would be."""
    d = parse_design('date = 2026-11-24\n' + GOOD, "arm.toml")
    assert d.date == "2026-11-24"
