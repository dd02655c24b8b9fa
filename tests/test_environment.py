"""Gravity, standard atmosphere, moist air, viscosity, and fluid and thermal rates
(swingcalc.environment), each against a published value or an independent model.

Tags as in REFERENCES.md: [pub] stated in the named publication, [calc] computed
independently, [mem] from memory, not re-checked against the document.
"""

from __future__ import annotations

import doctest
import math

import mpmath
import numpy as np
import pytest

import swingcalc
import swingcalc.environment as env
from swingcalc import InvalidInput

# WGS 84 defining constants (NIMA TR8350.2, 3rd ed. [pub: REFERENCES.md and the report's
# chapter 3]), typed here rather than imported, so the tests do not reuse the library's.
A_WGS = 6378137.0
F_WGS = 1.0 / 298.257223563
GAMMA_E = 9.7803253359


# --- Gravity ----------------------------------------------------------------------------

@pytest.mark.parametrize("lat_deg, want", [
    (0.0, 9.7803253359), (45.0, 9.8061977694), (90.0, 9.8321849379)])
def test_wgs84_normal_gravity_on_the_ellipsoid(lat_deg, want):
    """REFERENCES.md [calc] from TR8350.2 eq. 4-1, printed to 11 significant digits
    (half a unit of the last is 5e-11 m/s^2, ~5e-12 relative): 1e-10 relative."""
    got = swingcalc.normal_gravity(math.radians(lat_deg))
    assert got == pytest.approx(want, rel=1e-10)


def test_wgs84_derived_constants_follow_from_the_defining_ones():
    """e^2 = f (2 - f) (TR8350.2 ch. 3, [mem: formula]) matches the printed
    6.69437999013e-3 to its 12 digits; m = omega^2 a^2 b / GM matches TR8350.2's
    0.00344978650684 [mem] to its 12 digits (both 1e-11 relative)."""
    assert F_WGS * (2 - F_WGS) == pytest.approx(swingcalc.constants.WGS84_ECCENTRICITY_SQ,
                                                rel=1e-11)
    assert env._M_RATIO == pytest.approx(0.00344978650684, rel=1e-11)


@pytest.mark.parametrize("lat_deg", [0.0, 30.0, 45.0, 60.0, 90.0])
def test_free_air_gradient_is_the_geodesy_value(lat_deg):
    """Gravity falls about 3.086e-6 s^-2 per metre of height (REFERENCES.md [pub: geodesy
    texts], 0.3086 mGal/m). The normal gradient is 2 gamma / a (1 + f + m - 2 f sin^2 phi),
    which ranges over 3.083e-6 .. 3.088e-6 from pole to equator, so a 3e-9 s^-2 tolerance
    (0.1 %) covers that spread and the rounding of the printed value (5e-10)."""
    phi = math.radians(lat_deg)
    h = 10.0   # quadratic term 3 gamma h^2 / a^2 is 2e-11 of the change here
    grad = (swingcalc.normal_gravity(phi) - swingcalc.normal_gravity(phi, h)) / h
    assert grad == pytest.approx(3.086e-6, abs=3e-9)


def test_height_correction_curvature_is_the_second_order_term():
    """TR8350.2 eq. 4-3's quadratic term is 3 gamma h^2 / a^2, the same as the inverse
    square law gamma (a/(a+h))^2 = gamma (1 - 2h/a + 3h^2/a^2 - ...) (Newton). The second
    difference gamma(2h) - 2 gamma(h) + gamma(0) isolates it: 6 gamma h^2 / a^2. At h = 5
    km it is 3.6e-5 m/s^2; float rounding of the three values is ~3e-15 m/s^2, so 1e-8
    relative."""
    phi = math.radians(37.0)
    h = 5000.0
    g0 = swingcalc.normal_gravity(phi)
    second = (swingcalc.normal_gravity(phi, 2 * h) - 2 * swingcalc.normal_gravity(phi, h) + g0)
    assert second == pytest.approx(6 * g0 * h * h / A_WGS ** 2, rel=1e-8)


def test_height_correction_close_to_the_inverse_square_law():
    """Against the independent point-mass model gamma (a/(a+h))^2: the change with height
    differs only by the ellipsoid's (f + m - 2 f sin^2 phi) share of the linear term,
    at most 0.7 % of the change (f ~ m ~ 0.0034), and the third-order term 4 (h/a)^3."""
    for lat in (0.0, 45.0, 90.0):
        phi = math.radians(lat)
        g0 = swingcalc.normal_gravity(phi)
        for h in (100.0, 2000.0, 20000.0):
            lib = swingcalc.normal_gravity(phi, h) - g0
            point = g0 * (A_WGS / (A_WGS + h)) ** 2 - g0
            assert lib < 0 and abs(lib / point - 1) < 0.007


def test_gravity_arrays_broadcast():
    """Array latitudes and elevations give the same values as scalars, elementwise."""
    lats = np.radians([0.0, 45.0, 90.0])
    got = swingcalc.normal_gravity(lats, np.array([0.0, 100.0, 1000.0]))
    want = [swingcalc.normal_gravity(p, h) for p, h in zip(lats, (0.0, 100.0, 1000.0))]
    assert got.shape == (3,)
    np.testing.assert_allclose(got, want, rtol=1e-15)


# --- ISO 2533 standard atmosphere --------------------------------------------------------

def test_isa_sea_level():
    """ISA sea level 288.15 K, 101325 Pa (REFERENCES.md [pub], exact by definition) and
    density p / (R T) with R = 287.05287 J/(kg K) equal to the printed 1.2250 kg/m^3
    (ISO 2533, 5 digits: half a unit is 4e-5 relative)."""
    assert swingcalc.isa_temperature(0.0) == 288.15
    assert swingcalc.isa_pressure(0.0) == 101325.0
    assert 101325.0 / (287.05287 * 288.15) == pytest.approx(1.2250, rel=4e-5)


def test_isa_tropopause_and_20_km():
    """ISO 2533 / ICAO Doc 7488 tables [mem]: at 11 km geopotential (11019.1 m geometric),
    216.65 K and 22632 Pa (printed 2.2632e4: half a unit is 2.2e-5 relative); at 20 km
    geometric, 5529.3 Pa (printed 5 digits, 1e-5 relative) and 216.65 K (US Standard
    Atmosphere 1976, which agrees with ISO 2533 below 32 km [mem])."""
    r0 = 6356766.0
    h11 = r0 * 11000.0 / (r0 - 11000.0)
    assert h11 == pytest.approx(11019.07, abs=0.01)
    assert swingcalc.isa_temperature(h11) == pytest.approx(216.65, abs=1e-9)
    assert swingcalc.isa_pressure(h11) == pytest.approx(22632.0, rel=2.2e-5)
    assert swingcalc.isa_temperature(20000.0) == pytest.approx(216.65, abs=1e-12)
    assert swingcalc.isa_pressure(20000.0) == pytest.approx(5529.3, rel=1e-5)


def test_isa_pressure_by_integrating_the_hydrostatic_equation():
    """Independent method: dp/dH = -p g_n / (R T(H)) integrated numerically (scipy quad of
    1/T), p = p0 exp(-g_n/R int dH/T). quad is asked for 1e-13 (the integrand is smooth on
    each layer); the exponent is < 3, so 1e-12 relative on p."""
    from scipy.integrate import quad

    g, r_gas = 9.80665, 287.05287

    def temp(big_h):
        return 288.15 - 0.0065 * min(big_h, 11000.0)

    r0 = 6356766.0
    for h in (-500.0, 1500.0, 8848.0, 11500.0, 20000.0):
        big_h = r0 * h / (r0 + h)
        pts = [11000.0] if big_h > 11000.0 else None
        integral, _ = quad(lambda x: 1.0 / temp(x), 0.0, big_h, points=pts,
                           epsabs=0, epsrel=1e-13)
        want = 101325.0 * math.exp(-g / r_gas * integral)
        assert swingcalc.isa_pressure(h) == pytest.approx(want, rel=1e-12)


# --- Water vapour and moist air ---------------------------------------------------------

def test_saturation_vapour_pressure_against_iapws_values():
    """IAPWS values [pub, numbers from memory]: triple point 611.657 Pa at 273.16 K
    (printed 6 digits, 1e-5 relative); 2339.3 Pa at 20 degC (IAPWS-IF97 table, 5 digits)
    and 101.418 kPa at 100 degC. The CIPM-2007 fit (coefficients from memory) was made
    for room temperature: 2e-4 relative at 20 degC (a 2e-4 error in p_sv moves the density
    of saturated air by under 1e-5), 0.1 % at 100 degC, the end of the accepted range."""
    assert swingcalc.saturation_vapour_pressure(273.16) == pytest.approx(611.657, rel=1e-5)
    assert swingcalc.saturation_vapour_pressure(293.15) == pytest.approx(2339.3, rel=2e-4)
    assert swingcalc.saturation_vapour_pressure(373.15) == pytest.approx(101418.0, rel=1e-3)


def test_saturation_vapour_pressure_against_magnus():
    """Independent fit: Magnus-type formula over water, e = 611.2 exp(17.62 t / (243.12 + t))
    Pa (WMO-No. 8, Guide to Instruments and Methods of Observation [mem]), stated good to
    about 0.5 % from -45 to 60 degC: 0.5 % relative."""
    for t_c in (-40.0, -20.0, 0.0, 10.0, 20.0, 30.0, 40.0, 60.0):
        magnus = 611.2 * math.exp(17.62 * t_c / (243.12 + t_c))
        got = swingcalc.saturation_vapour_pressure(t_c + 273.15)
        assert got == pytest.approx(magnus, rel=5e-3)


def test_dry_air_at_isa_sea_level_is_the_isa_density_plus_the_real_gas_correction():
    """At 288.15 K, 101325 Pa, dry, the ISA gives 1.2250 kg/m^3 (REFERENCES.md [pub]) for an
    ideal gas of M = 28.9644 g/mol (R* = 8.31432). CIPM-2007 differs by (i) M_a = 28.96546
    g/mol at 400 ppm CO2 and R = 8.314472: ratio 1.0000183; (ii) 1/Z: air's second virial
    coefficient near 288 K is about -9 +- 1.5 cm^3/mol [mem], so 1 - Z = -B p / (R T) =
    (3.8 +- 0.6)e-4. With the 4e-5 rounding of 1.2250 the ratio rho / 1.2250 must lie in
    [1.0003, 1.00055]: denser than the ISA, by the compressibility effect."""
    rho = swingcalc.air_density(288.15, 101325.0, 0.0)
    assert 1.0003 < rho / 1.2250 < 1.00055


def test_cipm_agrees_with_an_ideal_gas_of_the_same_vapour_pressure():
    """Independent simpler model: ideal mixture of dry air (R_d = 287.05287 J/(kg K), the
    ISA's) and water vapour (R_v = 461.52 J/(kg K), M_v = 18.015 g/mol, common practice)
    at the CIPM water mole fraction. They differ by the compressibility, 1 - Z ~ -B p/(R T)
    with air's second virial coefficient B ~ -13 cm^3/mol at 0 degC and ~ -6 at 40 degC
    [mem]: at most 6.1e-4 (0 degC, 105 kPa), plus 4e-5 for the molar masses, so within
    7e-4 everywhere; and the ideal model is the lighter at 1 atm and above (Z < 1)."""
    for t_c in (0.0, 15.0, 20.0, 30.0, 40.0):
        for p in (70000.0, 90000.0, 101325.0, 105000.0):
            for h in (0.0, 0.3, 0.6, 1.0):
                a = swingcalc.air(t_c + 273.15, p, h)
                e = a.water_vapour_fraction * p
                t = a.temperature_K
                ideal = (p - e) / (287.05287 * t) + e / (461.52 * t)
                assert a.density_kg_m3 == pytest.approx(ideal, rel=7e-4)
                if p >= 101325.0:
                    assert a.density_kg_m3 > ideal


def test_humid_air_is_lighter_and_monotone_in_humidity():
    """Water (18.015 g/mol) is lighter than dry air (28.96 g/mol), so at fixed T and p the
    density falls as the humidity rises (common practice; Picard et al. 2008): strictly
    decreasing on a grid, by about 0.38 x_v in relative terms (x_v = 0.023 saturated at
    20 degC gives -0.88 %, to +-0.05 % for the enhancement factor and Z terms)."""
    for t_c in (5.0, 20.0, 35.0):
        hs = np.linspace(0.0, 1.0, 11)
        rho = swingcalc.air_density(t_c + 273.15, 101325.0, hs)
        assert np.all(np.diff(rho) < 0)
    drop = 1 - swingcalc.air_density(293.15, 101325.0, 1.0) / swingcalc.air_density(
        293.15, 101325.0, 0.0)
    assert drop == pytest.approx(0.0088, abs=5e-4)


def test_conventional_reference_air_density():
    """OIML R 111-1's conventional air density 1.2 kg/m^3 corresponds to air near 20 degC,
    101.325 kPa and 50 % humidity [mem]. The convention is printed to 2 digits, so 0.5 %:
    any sign or factor error in the humidity or CO2 terms would break it."""
    rho = swingcalc.air_density(293.15, 101325.0, 0.5)
    assert rho == pytest.approx(1.2, rel=5e-3)


def test_co2_makes_air_denser():
    """CO2 (44.01 g/mol) replacing O2 (32.00 g/mol): M_a rises 12.011 g/mol per unit mole
    fraction (CIPM-2007 [mem]); 0.0004 -> 0.0014 raises the density by
    12.011e-3 * 0.001 / 28.96546 = 4.15e-4 relative (dry air), to 1 % of that change."""
    lo = swingcalc.air_density(293.15, 101325.0, 0.0, 0.0004)
    hi = swingcalc.air_density(293.15, 101325.0, 0.0, 0.0014)
    assert hi / lo - 1 == pytest.approx(12.011 * 0.001 / 28.96546, rel=1e-2)


# --- Viscosity and the Air result ----------------------------------------------------------

def test_sutherland_viscosity_isa_values():
    """ISA sea level mu = 1.7894e-5 Pa s at 288.15 K (REFERENCES.md [pub]) and 1.4216e-5
    Pa s at 216.65 K (ISO 2533 table at 11 km [mem]); printed 5 digits, so half a unit of
    the last is 2.8e-5 and 3.5e-5 relative."""
    assert swingcalc.air_viscosity(288.15) == pytest.approx(1.7894e-5, rel=3e-5)
    assert swingcalc.air_viscosity(216.65) == pytest.approx(1.4216e-5, rel=3.6e-5)


def test_air_at_11_km_uses_the_tropopause_state():
    """air() at 11 km (ISA defaults) reports 216.65 K, the ISA pressure and the tropopause
    viscosity; its density is within 0.1 % of the ISO 2533 table's 0.36392 kg/m^3 [mem]
    (the table is an ideal gas; the real-gas correction is ~2e-4 at that p/T, and the
    table is printed to 5 digits)."""
    r0 = 6356766.0
    a = swingcalc.air(elevation=r0 * 11000.0 / (r0 - 11000.0))
    assert a.temperature_K == pytest.approx(216.65, abs=1e-9)
    assert a.density_kg_m3 == pytest.approx(0.36392, rel=1e-3)
    assert a.viscosity_Pa_s == pytest.approx(1.4216e-5, rel=3.6e-5)


def test_air_fills_the_standard_atmosphere_and_reports_its_state():
    """air() with no temperature or pressure uses the ISA at the elevation (and says so);
    the density is air_density of those, the kinematic viscosity mu / rho."""
    a = swingcalc.air(elevation=1500.0)
    assert a.temperature_source == "isa" and a.pressure_source == "isa"
    assert a.temperature_K == swingcalc.isa_temperature(1500.0)
    assert a.pressure_Pa == swingcalc.isa_pressure(1500.0)
    assert a.density_kg_m3 == swingcalc.air_density(a.temperature_K, a.pressure_Pa)
    assert a.kinematic_viscosity_m2_s == pytest.approx(a.viscosity_Pa_s / a.density_kg_m3,
                                                       rel=1e-15)
    b = swingcalc.air(293.15, 98000.0, 0.4)
    assert b.temperature_source == "given" and b.pressure_source == "given"
    assert b.relative_humidity == 0.4 and 0.0 < b.water_vapour_fraction < 0.02
    assert 0.999 < b.compressibility < 1.0
    d = b.to_dict()
    assert d["density_kg_m3"] == b.density_kg_m3 and d["pressure_Pa"] == 98000.0
    with pytest.raises(AttributeError):
        b.density_kg_m3 = 1.0   # frozen


# --- Bob in a fluid -------------------------------------------------------------------------

def _mp_factor(rb, rf, k):
    with mpmath.workdps(40):
        rb, rf, k = mpmath.mpf(rb), mpmath.mpf(rf), mpmath.mpf(k)
        return mpmath.sqrt((rb + k * rf) / (rb - rf))


def test_brass_bob_in_air_loses_6_2_and_9_3_seconds_a_day():
    """REFERENCES.md [calc]: a brass bob in air loses about 6.2 s/day from buoyancy and
    9.3 s/day with the sphere's added mass (k = 1/2, Stokes 1851). Brass from the materials
    table (8500 kg/m^3), ISA sea-level air 1.225 kg/m^3; the figures are printed to 2
    significant digits, so +-0.05 s/day."""
    rho_b = swingcalc.material("brass").density_kg_m3
    rho_f = 1.225
    assert swingcalc.buoyancy_rate_shift(rho_b, rho_f) == pytest.approx(-6.2, abs=0.05)
    assert swingcalc.fluid_rate_shift(rho_b, rho_f, 0.5) == pytest.approx(-9.3, abs=0.05)
    assert swingcalc.added_mass_rate_shift(rho_b, rho_f, 0.5) == pytest.approx(-3.1, abs=0.05)


@pytest.mark.parametrize("rb, rf, k", [
    (8500.0, 1.225, 0.5), (7850.0, 998.2, 0.5), (19300.0, 1.2, 1.0), (11340.0, 0.0, 0.5),
    (2.0, 1.0, 0.0), (8000.0, 1e-6, 0.5)])
def test_fluid_period_factor_and_rates_against_mpmath(rb, rf, k):
    """T/T0 = sqrt((rho_b + k rho_f)/(rho_b - rho_f)) (Stokes 1851; REFERENCES.md) and the
    rates 86400 (T0/T - 1), buoyancy-only and added-mass-only, by mpmath at 40 digits.
    The library forms them with log1p/expm1, so even the 1e-10 s/day rate of a 1e-6
    kg/m^3 fluid keeps full accuracy: 1e-14 relative (a few roundings)."""
    fac = _mp_factor(rb, rf, k)
    assert swingcalc.fluid_period_factor(rb, rf, k) == pytest.approx(float(fac), rel=1e-14)
    with mpmath.workdps(40):
        total = 86400 * (1 / fac - 1)
        buoy = 86400 * (mpmath.sqrt((mpmath.mpf(rb) - rf) / rb) - 1)
        added = 86400 * (mpmath.sqrt(mpmath.mpf(rb) / (mpmath.mpf(rb) + k * mpmath.mpf(rf))) - 1)
    for got, want in ((swingcalc.fluid_rate_shift(rb, rf, k), total),
                      (swingcalc.buoyancy_rate_shift(rb, rf), buoy),
                      (swingcalc.added_mass_rate_shift(rb, rf, k), added)):
        if want == 0:
            assert got == 0.0
        else:
            assert got == pytest.approx(float(want), rel=1e-13)


def test_buoyancy_and_added_mass_rates_add_to_second_order():
    """The two period factors multiply, so their rates add up to a cross term of order
    r^2 = (rho_f/rho_b)^2: for brass in air 86400 k r^2 / 4 ~ 2e-4 s/day, below the
    bound 86400 r^2 = 1.8e-3 s/day used here, and not zero."""
    rb, rf, k = 8500.0, 1.225, 0.5
    total = swingcalc.fluid_rate_shift(rb, rf, k)
    parts = swingcalc.buoyancy_rate_shift(rb, rf) + swingcalc.added_mass_rate_shift(rb, rf, k)
    r = rf / rb
    assert abs(total - parts) < 86400 * r * r
    assert total != parts


def test_fluid_functions_take_arrays():
    """Arrays broadcast: one body in several fluids."""
    out = swingcalc.fluid_rate_shift(8500.0, np.array([0.0, 1.0, 1.2]), 0.5)
    assert out.shape == (3,) and out[0] == 0.0 and np.all(np.diff(out) < 0)


# --- Thermal rate ---------------------------------------------------------------------------

def test_steel_rod_rate_half_a_second_a_day_per_kelvin():
    """REFERENCES.md [calc]: alpha/2 x 86400 s/day per K, steel about 0.5 (printed 1
    digit: +-0.05), a loss for warming. With the table's steel alpha (11.7e-6): -0.505."""
    alpha = swingcalc.material("steel").expansion_per_K
    rate = swingcalc.rate_change_per_kelvin(alpha)
    assert rate == pytest.approx(-0.5, abs=0.05)


def test_thermal_rate_is_the_derivative_of_the_exact_rate():
    """Independent: a rod of L (1 + alpha dT) swings with T0 sqrt(1 + alpha dT), so the
    clock's rate is 86400 ((1 + alpha dT)^(-1/2) - 1) (mpmath). Its slope at dT -> 0 by a
    central difference (dT = +-0.01 K, truncation ~ (alpha dT)^2 ~ 1e-14 relative) equals
    rate_change_per_kelvin to 1e-9 relative."""
    alpha = 19.0e-6
    with mpmath.workdps(40):
        def rate(dt):
            return 86400 * ((1 + mpmath.mpf(alpha) * dt) ** mpmath.mpf(-0.5) - 1)
        slope = (rate(mpmath.mpf("0.01")) - rate(mpmath.mpf("-0.01"))) / mpmath.mpf("0.02")
    assert swingcalc.rate_change_per_kelvin(alpha) == pytest.approx(float(slope), rel=1e-9)


# --- Bad input ------------------------------------------------------------------------------

@pytest.mark.parametrize("call, field", [
    (lambda: swingcalc.normal_gravity(2.0), "latitude"),
    (lambda: swingcalc.normal_gravity(float("nan")), "latitude"),
    (lambda: swingcalc.normal_gravity(0.5, 30000.0), "elevation"),
    (lambda: swingcalc.normal_gravity(0.5, -600.0), "elevation"),
    (lambda: swingcalc.normal_gravity("north"), "latitude"),
    (lambda: swingcalc.isa_pressure(float("inf")), "elevation"),
    (lambda: swingcalc.isa_temperature(25000.0), "elevation"),
    (lambda: swingcalc.saturation_vapour_pressure(20.0), "temperature"),
    (lambda: swingcalc.air_density(293.15, 101325.0, 1.5), "relative_humidity"),
    (lambda: swingcalc.air_density(293.15, -5.0), "pressure"),
    (lambda: swingcalc.air_density(293.15, 2e5), "pressure"),
    (lambda: swingcalc.air_density(293.15, 101325.0, 0.0, 0.5), "co2_fraction"),
    (lambda: swingcalc.air_density(293.15, 1000.0, 1.0), "relative_humidity"),
    (lambda: swingcalc.air_density([293.15, 300.0], [1e5, 1e5, 1e5]),
     "temperature/pressure/relative_humidity/co2_fraction"),
    (lambda: swingcalc.air_viscosity(0.0), "temperature"),
    (lambda: swingcalc.air(temperature=[290.0, 300.0]), "temperature"),
    (lambda: swingcalc.air(pressure=None, elevation=1e6), "elevation"),
    (lambda: swingcalc.fluid_period_factor(1.0, 1.2, 0.5), "body_density"),
    (lambda: swingcalc.fluid_period_factor(1.2, 1.2, 0.5), "body_density"),
    (lambda: swingcalc.fluid_period_factor(0.0, 0.0, 0.5), "body_density"),
    (lambda: swingcalc.fluid_period_factor(8500.0, -1.0, 0.5), "fluid_density"),
    (lambda: swingcalc.fluid_period_factor(8500.0, 1.2, -0.5), "added_mass_coefficient"),
    (lambda: swingcalc.buoyancy_rate_shift(8500.0, float("nan")), "fluid_density"),
    (lambda: swingcalc.added_mass_rate_shift(8500.0, 1.2, float("inf")),
     "added_mass_coefficient"),
    (lambda: swingcalc.rate_change_per_kelvin(0.01), "expansion_coefficient"),
])
def test_bad_input_is_refused_by_name(call, field):
    """Every refusal is an InvalidInput (a ValueError) naming the input, never a NaN out
    or a numpy traceback."""
    with pytest.raises(InvalidInput) as info:
        call()
    assert info.value.field == field
    assert "allowed" in str(info.value)


def test_a_body_lighter_than_the_fluid_gets_a_clear_reason():
    """A body no denser than the fluid does not hang as a pendulum: the message says so."""
    with pytest.raises(InvalidInput, match="does not hang as a pendulum"):
        swingcalc.fluid_rate_shift(900.0, 998.0, 0.5)


def test_water_vapour_above_the_total_pressure_is_refused_with_a_reason():
    """At 20 degC saturated vapour is 2.34 kPa, so 100 % humidity at 1 kPa total is
    impossible (x_v > 1): refused, naming the humidity."""
    with pytest.raises(InvalidInput, match="exceed the total pressure"):
        swingcalc.air(293.15, 1000.0, 1.0)


def test_environment_docstring_examples_run():
    """The numbers in the docstring examples are those the tests above check."""
    result = doctest.testmod(env, extraglobs={"math": math}, verbose=False)
    assert result.failed == 0 and result.attempted >= 8
