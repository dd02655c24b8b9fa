"""Tolerance analysis: resolved bands, exact re-reads of a changed design, first-order
bands against hand error propagation, and the full analysis (worst case, RSS, Monte Carlo
on a response surface) against its statistical and exact checks."""

import math

import numpy as np
import pytest

from swingcalc import STANDARD_GRAVITY, examples
from swingcalc.designfile import Tolerance, parse_design, point_design
from swingcalc.errors import InvalidInput
from swingcalc.sizing import period_at, position_for_period
from swingcalc.tolerance import Band, ToleranceInput, inputs, linear_bands, perturbed

CLOCK = examples.text()


def _clock():
    return parse_design(CLOCK, "clock.toml")


def _period(d):
    return {"period_s": period_at(d.pendulum, d.amplitudes_rad[0])}


# A point bob at zero amplitude in a vacuum: T = 2 pi sqrt(L/g) exactly (textbook simple
# pendulum), so first-order error propagation can be done by hand.
POINT = """\
name = "Point bob"
[pendulum]
length = "1 m"
bob_mass = "1 kg"
suspension = "rigid"
[swing]
amplitude = "0 deg"
[environment]
gravity = "9.80665 m/s^2"
air = false
[tolerances]
"pendulum.length" = "1 mm"
"""


def _point(extra: str = "") -> object:
    return parse_design(POINT + extra, "point.toml")


# ------------------------------------------------------------------ inputs


def test_inputs_resolve_relative_and_default_values_from_the_resolved_design():
    """The clock's bob density comes from its material (brass, 8500 kg/m^3 in the
    materials table, CRC handbook range 8400-8750), the 1 % band is 85 kg/m^3; the
    temperature band is 5 K about 20 degC = 293.15 K (ITS-90 offset 273.15)."""
    got = {i.path: i for i in inputs(_clock())}
    assert set(got) == {"part.bob.centre", "part.bob.density", "environment.temperature",
                        "swing.amplitude"}
    assert got["part.bob.density"] == ToleranceInput("part.bob.density", "density", 8500.0,
                                                     85.0)
    assert got["part.bob.centre"].nominal == pytest.approx(1.00186, rel=1e-15)
    assert got["part.bob.centre"].half_width == pytest.approx(2e-4, rel=1e-15)
    assert got["environment.temperature"].nominal == pytest.approx(293.15, rel=1e-15)
    assert got["environment.temperature"].half_width == 5.0
    assert got["swing.amplitude"].nominal == pytest.approx(math.radians(2), rel=1e-15)


def test_inputs_of_a_defaulted_temperature_and_standard_gravity():
    """A file without a temperature swings at the 20 degC default; 'standard' gravity is
    9.80665 m/s^2 (3rd CGPM, 1901)."""
    d = parse_design(POINT.replace('"9.80665 m/s^2"', '"standard"'), "p.toml")
    tols = (Tolerance("environment.temperature", 2.0, False),
            Tolerance("environment.gravity", 1e-3, True))
    t, g = inputs(d, tols)
    assert t.nominal == pytest.approx(293.15, rel=1e-15) and t.half_width == 2.0
    assert g.nominal == STANDARD_GRAVITY and g.half_width == pytest.approx(9.80665e-3,
                                                                           rel=1e-15)


def test_inputs_reject_unknown_paths_with_a_suggestion_and_duplicates():
    d = _clock()
    with pytest.raises(InvalidInput, match="did you mean 'part.bob.centre'"):
        inputs(d, (Tolerance("part.bob.center", 1e-4, False),))
    with pytest.raises(InvalidInput, match="given twice"):
        inputs(d, (Tolerance("part.bob.centre", 1e-4, False),) * 2)
    with pytest.raises(InvalidInput, match="half-width"):
        inputs(d, (Tolerance("part.bob.centre", -1e-4, False),))


# ------------------------------------------------------------------ perturbed


def test_perturbed_with_no_change_reproduces_the_design_exactly():
    """Every value is written back in its SI unit as the float's repr, which reads back
    to the same float: the re-read design gives the same period to the bit."""
    d = _clock()
    p = perturbed(d, {})
    assert period_at(p.pendulum, p.amplitudes_rad[0]) == period_at(d.pendulum,
                                                                   d.amplitudes_rad[0])
    assert p.environment == d.environment
    assert p.amplitudes_rad == d.amplitudes_rad


def test_perturbed_bob_centre_equals_an_edited_file_and_the_tune_position():
    """Two independent routes to the same design: the TOML text edited by hand
    (1001.86 mm -> 1002.06 mm) and parsed afresh; and the tuning search, which moves the
    bob inside the body model (no re-read) to hit the perturbed period. Tolerance: the
    mm -> m conversion rounds once (1 ulp); the tuning root is exact to ~1e-12 m."""
    d = _clock()
    p = perturbed(d, {"part.bob.centre": 1.00206})
    edited = parse_design(CLOCK.replace('centre = "1001.86 mm"', 'centre = "1002.06 mm"'),
                          "edited.toml")
    a = d.amplitudes_rad[0]
    t_p, t_e = period_at(p.pendulum, a), period_at(edited.pendulum, a)
    assert t_p == pytest.approx(t_e, rel=4e-16)
    assert t_p != period_at(d.pendulum, a)
    sol = position_for_period(d.pendulum, ("bob",), t_p, a)
    assert sol.position_m == pytest.approx(1.00206, abs=1e-10)


def test_perturbed_density_replaces_the_material_and_keeps_its_expansion():
    """Brass at 1 % above its table density, against the file edited to give that density
    and the table's expansion (19e-6 /K) instead of the material name."""
    d = _clock()
    p = perturbed(d, {"part.bob.density": 8585.0})
    bob_text = 'mount = "bottom"             # rests on the rating nut, grows upward when warm\n'
    text = CLOCK.replace(bob_text + 'material = "brass"',
                         bob_text + 'density = "8585 kg/m^3"\nexpansion = "19e-6 /K"')
    assert text != CLOCK
    edited = parse_design(text, "edited.toml")
    a = d.amplitudes_rad[0]
    assert period_at(p.pendulum, a) == pytest.approx(period_at(edited.pendulum, a),
                                                     rel=1e-15)
    assert p.pendulum.mass_kg > d.pendulum.mass_kg


def test_amplitude_change_moves_every_listed_amplitude_by_the_same_amount_clipped():
    d = _clock()                               # 2, 1.5, 3 deg
    p = perturbed(d, {"swing.amplitude": math.radians(2.5)})
    assert np.degrees(p.amplitudes_rad) == pytest.approx([2.5, 2.0, 3.5], rel=1e-13)
    q = perturbed(d, {"swing.amplitude": math.radians(0.25)})
    assert np.degrees(q.amplitudes_rad) == pytest.approx([0.25, 0.0, 1.25], abs=1e-12)


def test_perturbed_keeps_a_gravity_override():
    """A design with its gravity overridden after reading (as --gravity does) keeps it."""
    d = _clock().with_changes(gravity=9.81, gravity_given="9.81 m/s^2")
    p = perturbed(d, {})
    assert p.gravity_m_s2 == 9.81
    assert period_at(p.pendulum, 0.0) == period_at(d.pendulum, 0.0)


def test_temperature_change_recomputes_the_air_density():
    """Dry air at constant pressure: the ideal-gas law gives rho proportional to 1/T, so
    the central difference over +-5 K about 293.15 K is rho0 T0 (1/(T0+5) - 1/(T0-5))/2
    (-0.0206 kg/m^3). CIPM-2007 adds the compressibility Z (about 0.9996; its change over
    10 K is ~1.2e-4: dZ/dT ~ -(p/T) a1 with a1 = -2.93e-8 /Pa, coefficient from memory),
    which steepens the slope by ~0.35 %: tolerance 5e-3 relative."""
    d = parse_design(CLOCK.replace('humidity = "45 %"', 'humidity = "0 %"'), "dry.toml")
    band = linear_bands(d, lambda x: {"rho": x.environment.air_density_kg_m3},
                        (Tolerance("environment.temperature", 5.0, False),))["rho"]
    rho0, t0 = band.nominal, 293.15
    expected = rho0 * t0 * (1 / (t0 + 5) - 1 / (t0 - 5)) / 2
    assert band.contributions[0][1] == pytest.approx(expected, rel=5e-3)
    # Humid air (45 %): water vapour grows with temperature and is lighter than dry air,
    # so the density falls faster than 1/T (CIPM-2007: M_v < M_a); same sign, larger.
    humid = linear_bands(_clock(), lambda x: {"rho": x.environment.air_density_kg_m3},
                         (Tolerance("environment.temperature", 5.0, False),))["rho"]
    assert humid.contributions[0][1] < expected < 0.0


def test_perturbed_rejects_unknown_paths_and_invalid_results_in_one_line():
    d = _clock()
    with pytest.raises(InvalidInput, match="no such quantity"):
        perturbed(d, {"part.bob.colour": 1.0})
    with pytest.raises(InvalidInput) as err:
        perturbed(d, {"part.bob.density": -5.0})
    assert "\n" not in str(err.value) and "part.bob.density" in str(err.value)


def test_point_design_built_in_code_can_be_perturbed():
    """point_design has no file; it stands for a [pendulum] file. T = 2 pi sqrt(L/g)
    (textbook) at zero amplitude; tolerance a few ulp."""
    d = point_design(1.0, amplitudes=(0.0,))
    p = perturbed(d, {"pendulum.length": 1.21})
    assert period_at(p.pendulum, 0.0) == pytest.approx(
        2 * math.pi * math.sqrt(1.21 / STANDARD_GRAVITY), rel=4e-16)


# ------------------------------------------------------------------ linear_bands


def test_rss_of_a_length_tolerance_is_half_the_relative_length_tolerance():
    """T = 2 pi sqrt(L/g): dT/T = (1/2) dL/L to first order (textbook error propagation).
    L = 1 m +- 1 mm: c = T/2 * 1e-3. The central difference of sqrt differs from the
    derivative by (dL/L)^2 / 8 = 1.25e-7 relative: tolerance 2e-7."""
    band = linear_bands(_point(), _period)["period_s"]
    t0 = 2 * math.pi * math.sqrt(1.0 / STANDARD_GRAVITY)
    assert band.nominal == pytest.approx(t0, rel=4e-16)
    assert band.rss == pytest.approx(0.5 * t0 * 1e-3, rel=2e-7)
    assert band.worst == band.rss
    assert band.contributions == (("pendulum.length", pytest.approx(0.5 * t0 * 1e-3,
                                                                     rel=2e-7)),)


def test_two_independent_inputs_add_in_quadrature_and_linearly_for_the_worst_case():
    """L +- 1 mm and g +- 0.2 %, T = 2 pi sqrt(L/g) (textbook): by hand, the central
    differences are c_L = T0 (sqrt(1 + 1e-3) - sqrt(1 - 1e-3)) / 2 and
    c_g = T0 ((1 + 2e-3)^-1/2 - (1 - 2e-3)^-1/2) / 2 (about (T/2) 1e-3 and -(T/2) 2e-3);
    RSS = sqrt(c_L^2 + c_g^2), worst = |c_L| + |c_g| (GUM law of propagation for
    independent inputs; the linear stack-up, common practice). Tolerance 1e-12: the
    differences of nearby periods cancel about 3 digits of 16."""
    d = _point('"environment.gravity" = "0.2 %"\n')
    band = linear_bands(d, _period)["period_s"]
    t0 = 2 * math.pi * math.sqrt(1.0 / STANDARD_GRAVITY)
    c_l = t0 * (math.sqrt(1 + 1e-3) - math.sqrt(1 - 1e-3)) / 2
    c_g = t0 * ((1 + 2e-3) ** -0.5 - (1 - 2e-3) ** -0.5) / 2
    assert band.rss == pytest.approx(math.hypot(c_l, c_g), rel=1e-12)
    assert band.worst == pytest.approx(abs(c_l) + abs(c_g), rel=1e-12)
    assert [p for p, _ in band.contributions] == ["environment.gravity", "pendulum.length"]
    assert band.contributions[0][1] == pytest.approx(c_g, rel=1e-12)


def test_linear_bands_drop_keys_that_are_not_finite_and_are_empty_without_tolerances():
    calls = []

    def evaluate(d):
        calls.append(d)
        length = d.parts[0].position
        return {"period_s": period_at(d.pendulum, 0.0), "none": None,
                "nan_above": math.nan if length > 1.0 else 1.0}

    bands = linear_bands(_point(), evaluate)
    assert set(bands) == {"period_s"} and isinstance(bands["period_s"], Band)
    assert len(calls) == 3                     # 2 n + 1 with n = 1
    assert linear_bands(_point(), evaluate, ()) == {}
    no_tol = parse_design(POINT.split("[tolerances]")[0], "p.toml")
    assert linear_bands(no_tol, evaluate) == {}
