"""Tolerance analysis: resolved bands, exact re-reads of a changed design, first-order
bands against hand error propagation, and the full analysis (worst case, RSS, Monte Carlo
on a response surface) against its statistical and exact checks."""

import math

import numpy as np
import pytest
from scipy.stats import truncnorm

from swingcalc import STANDARD_GRAVITY, examples
from swingcalc.designfile import Tolerance, parse_design, point_design
from swingcalc.errors import InvalidInput
from swingcalc.sizing import period_at, position_for_period
from swingcalc.tolerance import (
    Band,
    ToleranceInput,
    analyse,
    inputs,
    linear_bands,
    perturbed,
)

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


# ------------------------------------------------------------------ analyse

# Standard deviation of a normal distribution truncated at +-3 sigma, in sigma
# (scipy.stats.truncnorm; about 0.98658): the "normal" inputs are cut at their band ends.
TRUNCATED_SD = float(truncnorm(-3.0, 3.0).std())


def _small_point(tols: str, amplitude: str = "0 deg", mass: str = "1 kg"):
    text = (POINT.split("[tolerances]")[0].replace('amplitude = "0 deg"',
                                                   f'amplitude = "{amplitude}"')
            .replace('bob_mass = "1 kg"', f'bob_mass = "{mass}"'))
    return parse_design(text + "[tolerances]\n" + tols, "point.toml")


def test_monte_carlo_std_converges_to_rss_over_three_for_small_tolerances():
    """Normal inputs, band = +-3 sigma: for a linear response the output's sigma is
    RSS/3 (GUM propagation of standard uncertainties), times the truncated-normal factor
    (scipy.stats.truncnorm at +-3) since samples outside a band are rejected. L +- 0.01 mm
    and g +- 20 ppm keep the response linear to ~1e-5 relative. Tolerance: the standard
    error of a standard deviation estimate is ~sigma/sqrt(2N) = 0.22 % at N = 1e5; four
    of them, 0.9 %."""
    d = _small_point('"pendulum.length" = "0.01 mm"\n"environment.gravity" = "20 ppm"\n')
    r = analyse(d, outputs=["period_s"], samples=100_000, seed=7)
    band = r.output("period_s")
    t0 = 2 * math.pi * math.sqrt(1.0 / STANDARD_GRAVITY)
    assert band.rss == pytest.approx(0.5 * t0 * math.hypot(1e-5, 2e-5), rel=1e-6)
    assert band.mc_std == pytest.approx(TRUNCATED_SD * band.rss / 3.0, rel=0.009)
    assert band.mc_mean == pytest.approx(t0, abs=4 * band.rss / 3 / math.sqrt(1e5))
    # the +-3 sigma quantiles of a truncated normal are just inside the +-RSS band
    assert band.nominal - band.rss < band.mc_low < band.mc_high < band.nominal + band.rss
    assert band.worst_linear == pytest.approx(0.5 * t0 * 3e-5, rel=1e-6)


def test_uniform_std_of_one_linear_input_is_its_half_width_over_root_three():
    """Uniform on [-t, t] has sigma = t/sqrt(3) (any statistics text). Tolerance: the
    standard error of the std of a uniform sample is sigma sqrt((9/5 - 1)/(4N)) = 0.14 %
    at N = 1e5; four of them, 0.6 %."""
    d = _small_point('"pendulum.length" = "0.01 mm"\n')
    band = analyse(d, outputs=["period_s"], distribution="uniform", seed=3).output("period_s")
    assert band.mc_std == pytest.approx(band.rss / math.sqrt(3.0), rel=0.006)
    assert band.mc_min >= band.worst_low and band.mc_max <= band.worst_high
    assert band.mc_max - band.mc_min == pytest.approx(2 * band.rss, rel=1e-3)


def test_pivot_load_band_of_a_bob_mass_tolerance():
    """Point bob on a light rod: the peak pivot load is m g (3 - 2 cos A) at the bottom
    (energy conservation, textbook), linear in m: a +-2 % mass band gives
    c = 0.02 m g (3 - 2 cos A) exactly (tolerance a few ulp of the differences)."""
    d = _small_point('"pendulum.bob_mass" = "2 %"\n', amplitude="40 deg", mass="3 kg")
    band = analyse(d, outputs=["reaction_N"], samples=1000).output("reaction_N")
    expected = 3.0 * STANDARD_GRAVITY * (3 - 2 * math.cos(math.radians(40)))
    assert band.nominal == pytest.approx(expected, rel=1e-13)
    assert band.rss == pytest.approx(0.02 * expected, rel=1e-11)
    assert band.worst_low == pytest.approx(0.98 * expected, rel=1e-12)
    assert band.corner_high == pytest.approx(1.02 * expected, rel=1e-12)


def test_worst_case_brackets_every_sample_and_exactly_evaluated_points():
    """On the clock (four inputs, curved response): the worst case contains every Monte
    Carlo sample, and the period at 12 random points of the tolerance box evaluated
    exactly by re-reading the design (an independent route: the surface is not used)."""
    d = _clock()
    r = analyse(d, outputs=["period_s", "rate_s_per_day"], samples=100_000, seed=11)
    assert r.warnings == ()
    band = r.output("period_s")
    assert band.worst_low <= band.mc_min <= band.mc_max <= band.worst_high
    rng = np.random.default_rng(5)
    ins = r.inputs
    for _ in range(12):
        u = rng.choice([-1.0, 1.0], size=len(ins)) * rng.uniform(0.5, 1.0, size=len(ins))
        p = perturbed(d, {i.path: i.nominal + x * i.half_width for i, x in zip(ins, u)})
        t = period_at(p.pendulum, p.amplitudes_rad[0])
        assert band.worst_low <= t <= band.worst_high
    # the rate falls as the period grows: its sign corners are the period's, swapped
    rate = r.output("rate_s_per_day")
    assert rate.corner_high == pytest.approx(86400 * (2.0 / band.corner_low - 1), rel=1e-12)
    assert rate.corner_low == pytest.approx(86400 * (2.0 / band.corner_high - 1), rel=1e-12)


def test_surrogate_is_checked_and_a_poor_fit_is_warned_of():
    """A smooth band (the clock) fits to far under 1 % of the RSS band; an amplitude band
    that is clipped at zero (1 deg +- 5 deg) has a kink the quadratic surface cannot
    follow: the period is flat for amplitudes clipped to 0, so the fit is off by tens of
    per cent of the band there (T ~ T0 (1 + A^2/16), textbook series), and it says so."""
    smooth = analyse(_clock(), outputs=["period_s"], samples=1000).output("period_s")
    assert 0.0 < smooth.surrogate_error < 1e-3 * smooth.rss
    kink = analyse(_small_point('"swing.amplitude" = "5 deg"\n', amplitude="1 deg"),
                   outputs=["period_s"], samples=1000)
    band = kink.output("period_s")
    assert band.surrogate_error > 0.01 * band.rss
    assert any("response surface" in w for w in kink.warnings)


def test_ranking_is_the_same_under_different_seeds():
    """Shares from the Monte Carlo samples (squared input-output correlation) rank the
    inputs as the first-order shares c_i^2 / sum c^2 do, whatever the seed; an input the
    output does not depend on (the bob mass of a point pendulum: T = 2 pi sqrt(L/g),
    textbook) comes last with share 0. By hand, with T ~ T0 (1 + A^2/16) (textbook
    series): amplitude 10 +- 1 deg gives c/T ~ (A/8) dA = 3.8e-4, length 1 m +- 0.5 mm
    2.5e-4, gravity +- 0.01 % 5e-5."""
    d = _small_point('"pendulum.bob_mass" = "5 %"\n"pendulum.length" = "0.5 mm"\n'
                     '"environment.gravity" = "0.01 %"\n"swing.amplitude" = "1 deg"\n',
                     amplitude="10 deg")
    rankings = []
    for seed in (1, 2, 3):
        band = analyse(d, outputs=["period_s"], samples=20_000, seed=seed).output("period_s")
        by_share = [c.path for c in band.contributions]
        by_mc = [c.path for c in sorted(band.contributions[:-1], key=lambda c: -c.mc_share)]
        assert by_mc == by_share[:-1]
        rankings.append(by_share)
        last = band.contributions[-1]
        assert last.path == "pendulum.bob_mass" and last.value == 0.0 and last.share == 0.0
        assert sum(c.share for c in band.contributions) == pytest.approx(1.0, rel=1e-12)
    assert rankings[0][:3] == ["swing.amplitude", "pendulum.length", "environment.gravity"]


def test_same_seed_same_numbers_other_seed_other_samples():
    d = _small_point('"pendulum.length" = "1 mm"\n')
    a, b = (analyse(d, outputs=["period_s"], samples=2000, seed=4) for _ in range(2))
    c = analyse(d, outputs=["period_s"], samples=2000, seed=5)
    assert a == b
    assert a.output("period_s").mc_mean != c.output("period_s").mc_mean


def test_rate_is_against_the_target_period_or_else_the_nominal_period():
    """rate = 86400 (T_ref / T - 1) s/day (a clock beating T instead of T_ref; common
    practice, positive when it gains)."""
    clock = analyse(_clock(), outputs=["rate_s_per_day", "period_s"], samples=1000)
    t = clock.output("period_s").nominal
    assert clock.reference == "target period" and clock.reference_period_s == 2.0
    assert clock.output("rate_s_per_day").nominal == pytest.approx(86400 * (2.0 / t - 1),
                                                                   rel=1e-12)
    point = analyse(_small_point('"pendulum.length" = "1 mm"\n'),
                    outputs=["period_s", "rate_s_per_day"], samples=1000)
    assert point.reference == "nominal period"
    assert point.output("rate_s_per_day").nominal == 0.0
    # first order: d(rate) = -86400 dT / T
    assert point.output("rate_s_per_day").rss == pytest.approx(
        86400 * point.output("period_s").rss / point.reference_period_s, rel=1e-6)


def test_analyse_rejects_bad_requests_in_one_line():
    d = _clock()
    no_tol = parse_design(CLOCK.split("[tolerances]")[0], "c.toml")
    cases = [(lambda: analyse(no_tol), "no tolerances"),
             (lambda: analyse(d, outputs=["period"]), "did you mean 'period_s'"),
             (lambda: analyse(d, outputs=["bob centre.felt"]), "bob centre.felt_g"),
             (lambda: analyse(d, samples=10), "samples"),
             (lambda: analyse(d, samples=1.5e5), "samples"),
             (lambda: analyse(d, seed=-1), "seed"),
             (lambda: analyse(d, distribution="gauss"), "normal or uniform")]
    for call, text in cases:
        with pytest.raises(InvalidInput) as err:
            call()
        assert text in str(err.value) and "\n" not in str(err.value)


def test_perturbed_follows_a_point_bob_replaced_after_reading():
    """As --length and --mass do: the re-read keeps the replaced bob. T = 2 pi sqrt(L/g)
    at zero amplitude (textbook); tolerance a few ulp."""
    import dataclasses

    from swingcalc.body import point_bob

    d = _point()
    parts, susp = point_bob(0.64, 2.0, "rigid")
    d = dataclasses.replace(d, parts=parts, suspension=susp)
    assert inputs(d)[0].nominal == 0.64
    p = perturbed(d, {})
    assert p.parts[0].position == 0.64 and p.parts[0].mass == 2.0
    assert period_at(p.pendulum, 0.0) == pytest.approx(
        2 * math.pi * math.sqrt(0.64 / STANDARD_GRAVITY), rel=4e-16)


# A point mass at the end of a light chain: while taut it is the simple pendulum of the
# chain's length, T0 = 2 pi sqrt(L/g) (textbook), so a band on the chain's length moves T0
# by (T0/2) dL/L to first order, as the payload hangs from the chain's end.
CHAIN = """\
name = "Chain and weight"
[suspension]
kind = "chain"
length = "2 m"
mass_per_length = "0 kg/m"
[[part]]
name = "weight"
shape = "point"
mass = "5 kg"
centre = "2 m"
[[point]]
name = "weight"
along = "2 m"
[swing]
amplitude = "0 deg"
[environment]
gravity = "9.80665 m/s^2"
air = false
"""


def test_a_suspension_length_band_carries_the_payload_and_its_points_down():
    d = parse_design(CHAIN, "chain.toml")
    t0 = 2 * math.pi * math.sqrt(2.0 / 9.80665)
    band = linear_bands(d, _period, (Tolerance("suspension.length", 3e-3, False),))
    # first order (T0/2)(dL/L); the central difference's error is O((dL/L)^2) ~ 2e-6
    assert band["period_s"].rss == pytest.approx(0.5 * t0 * 3e-3 / 2.0, rel=1e-5)
    p = perturbed(d, {"suspension.length": 2.003})
    assert p.suspension.length == pytest.approx(2.003, rel=1e-15)
    assert p.parts[0].position == pytest.approx(2.003, rel=1e-15)
    assert p.points[0][1] == pytest.approx(2.003, rel=1e-15)
    # a part's own change adds to the chain's
    q = perturbed(d, {"suspension.length": 2.003, "part.weight.centre": 2.001})
    assert q.parts[0].position == pytest.approx(2.004, rel=1e-15)


def test_a_curved_monotone_response_takes_the_exact_corners_as_its_worst_case():
    """150 +- 25 deg: the period rises steeply with the amplitude (T/T0 = (2/pi) K(m),
    mpmath), so the linear stack-up f0 - |c| overshoots, close to T0; the worst case is the exact period at 125 and 175 deg (mpmath at 40 digits; 1e-13: the
    elliptic kernel's accuracy, docs/methods/period.md)."""
    from helpers import mp_period_ratio

    d = _small_point('"swing.amplitude" = "25 deg"\n', amplitude="150 deg")
    band = analyse(d, outputs=["period_s"], samples=1000, seed=1).output("period_s")
    t0 = 2 * math.pi * math.sqrt(1.0 / 9.80665)
    assert band.worst_low == pytest.approx(t0 * float(mp_period_ratio(math.radians(125))),
                                           rel=1e-13)
    assert band.worst_high == pytest.approx(t0 * float(mp_period_ratio(math.radians(175))),
                                            rel=1e-13)
    assert t0 < band.nominal - band.worst_linear < 0.75 * band.worst_low


def test_an_amplitude_band_reaching_the_inverted_position_is_refused():
    """Past 180 deg there is no swing: 170 +- 15 deg is refused, naming the tolerance."""
    d = _small_point('"swing.amplitude" = "15 deg"\n', amplitude="170 deg")
    with pytest.raises(InvalidInput, match="tolerance on swing.amplitude.*inverted"):
        inputs(d)


def test_default_outputs_are_a_clocks_rate_or_anything_elses_pivot_load():
    assert analyse(_clock(), samples=100).outputs[1].key == "rate_s_per_day"
    keys = [o.key for o in analyse(_small_point('"pendulum.length" = "1 mm"\n'),
                                   samples=100).outputs]
    assert keys == ["period_s", "reaction_N"]
