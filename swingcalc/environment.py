"""Where the pendulum swings: local gravity, the air, and what air and heat do to the rate.

Normal gravity on and above the WGS 84 ellipsoid; the ISO 2533 standard atmosphere up to
20 km; the density of moist air from the CIPM-2007 equation; the viscosity of air from
Sutherland's law; the period factor of a point bob in a fluid (buoyancy and added mass);
the thermal rate change of a simple pendulum. SI floats or arrays in, angles in radians.
Method notes: ``docs/methods/environment.md``.

Rates are in seconds per day of a clock regulated for the reference condition (vacuum,
or zero temperature change): positive gains, negative loses, as in
:func:`swingcalc.linear.clock_rate_error`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ._validate import finalize, finite_result, real_array
from .constants import (
    ISA_EARTH_RADIUS,
    ISA_GAS_CONSTANT,
    ISA_LAPSE_RATE,
    ISA_SEA_LEVEL_PRESSURE,
    ISA_SEA_LEVEL_TEMPERATURE,
    ISA_TROPOPAUSE_GEOPOTENTIAL,
    SECONDS_PER_DAY,
    STANDARD_GRAVITY,
    SUTHERLAND_BETA,
    SUTHERLAND_S,
    WGS84_ANGULAR_VELOCITY,
    WGS84_ECCENTRICITY_SQ,
    WGS84_EQUATORIAL_GRAVITY,
    WGS84_GM,
    WGS84_INVERSE_FLATTENING,
    WGS84_SEMI_MAJOR_AXIS,
    WGS84_SOMIGLIANA_K,
    ZERO_CELSIUS,
)
from .errors import InvalidInput

__all__ = [
    "ELEVATION_MAX",
    "ELEVATION_MIN",
    "PRESSURE_MAX",
    "PRESSURE_MIN",
    "TEMPERATURE_MAX",
    "TEMPERATURE_MIN",
    "Air",
    "added_mass_rate_shift",
    "air",
    "air_density",
    "air_viscosity",
    "buoyancy_rate_shift",
    "fluid_period_factor",
    "fluid_rate_shift",
    "isa_pressure",
    "isa_temperature",
    "normal_gravity",
    "rate_change_per_kelvin",
    "saturation_vapour_pressure",
]

#: Lowest elevation accepted [m]: the shore of the Dead Sea, the lowest dry land, is about
#: -430 m. Deeper (a mine) the pendulum is inside the Earth's masses, where neither the
#: free-air height correction nor the standard atmosphere applies.
ELEVATION_MIN = -500.0
#: Highest elevation accepted [m]: above every mountain (8.85 km) with room for aircraft
#: and balloons. There the second-order height series of normal gravity is still good to
#: ~1e-7 (its next term is ~4 (h/a)^3) and ISO 2533's isothermal layer ends (20 km
#: geopotential is 20.063 km geometric).
ELEVATION_MAX = 20000.0
#: Temperatures accepted by the air and water-vapour equations [K]: -60 degC .. +100 degC
#: (the coldest sites, and the ISA's 216.65 K above 11 km). CIPM-2007 was fitted for
#: 15-27 degC; outside that it is an extrapolation whose non-ideal terms stay below 0.1 %
#: of the density (see the method note).
TEMPERATURE_MIN = 213.15
TEMPERATURE_MAX = 373.15
#: Pressures accepted for air [Pa]: from a clock in an evacuated case (1 Pa) to above the
#: highest sea-level pressure recorded (about 108.4 kPa). CIPM-2007 was fitted for
#: 60-110 kPa; at lower pressure air is more nearly ideal, so the extrapolation is benign.
PRESSURE_MIN = 1.0
PRESSURE_MAX = 120000.0

_LATITUDE_ALLOWED = "a finite latitude in [-pi/2, pi/2] rad, i.e. [-90, 90] deg"
_ELEVATION_ALLOWED = (f"a finite elevation in [{ELEVATION_MIN:g}, {ELEVATION_MAX:g}] m "
                      "(lowest dry land to 20 km)")
_TEMPERATURE_ALLOWED = (f"a finite temperature in [{TEMPERATURE_MIN:g}, {TEMPERATURE_MAX:g}] K "
                        "(-60 to 100 degC)")
_PRESSURE_ALLOWED = f"a finite pressure in [{PRESSURE_MIN:g}, {PRESSURE_MAX:g}] Pa"
_HUMIDITY_ALLOWED = "a finite relative humidity in [0, 1] (0.5 for 50 %)"
_CO2_ALLOWED = "a finite CO2 mole fraction in [0, 0.01] (0.0004 for 400 ppm)"
_DENSITY_ALLOWED = "a finite density > 0 [kg/m^3]"
_FLUID_ALLOWED = "a finite fluid density >= 0 [kg/m^3], less than the body's density"
_ADDED_MASS_ALLOWED = "a finite added-mass coefficient >= 0 (1/2 for a sphere)"
_EXPANSION_ALLOWED = "a finite linear expansion coefficient in [-1e-4, 1e-3] 1/K"

_FLATTENING = 1.0 / WGS84_INVERSE_FLATTENING
_SEMI_MINOR = WGS84_SEMI_MAJOR_AXIS * (1.0 - _FLATTENING)
# m = omega^2 a^2 b / GM (TR8350.2, the "m" of eq. 4-3; 0.00344978650684 there).
_M_RATIO = WGS84_ANGULAR_VELOCITY ** 2 * WGS84_SEMI_MAJOR_AXIS ** 2 * _SEMI_MINOR / WGS84_GM

# CIPM-2007 (Picard, Davis, Glaeser, Fujii, Metrologia 45 (2008) 149-155). All coefficients
# below are written from memory; the tests check them against independent values (the
# IAPWS triple-point pressure, the ISA sea-level density, an ideal-gas model).
_R_MOLAR = 8.314472            # J/(mol K), the value CIPM-2007 adopted (CODATA 2006)
_M_WATER = 18.01528e-3         # kg/mol
_M_DRY_400PPM = 28.96546e-3    # kg/mol, dry air with x_CO2 = 0.0004
_M_CO2_SLOPE = 12.011e-3       # kg/mol per unit x_CO2 (CO2 replaces O2: 44.01 - 32.00)
_PSV = (1.2378847e-5, -1.9121316e-2, 33.93711047, -6.3431645e3)   # A [K^-2], B [K^-1], C, D [K]
_ENH = (1.00062, 3.14e-8, 5.6e-7)    # alpha, beta [1/Pa], gamma [1/K^2] (t in degC)
_Z_A = (1.58123e-6, -2.9331e-8, 1.1043e-10)   # a0 [K/Pa], a1 [1/Pa], a2 [1/(K Pa)]
_Z_B = (5.707e-6, -2.051e-8)                  # b0 [K/Pa], b1 [1/Pa]
_Z_C = (1.9898e-4, -2.376e-6)                 # c0 [K/Pa], c1 [1/Pa]
_Z_D, _Z_E = 1.83e-11, -0.765e-8              # [K^2/Pa^2]


def _elevation(value, field="elevation"):
    return real_array(value, field, _ELEVATION_ALLOWED, low=ELEVATION_MIN, high=ELEVATION_MAX)


def _temperature(value, field="temperature"):
    return real_array(value, field, _TEMPERATURE_ALLOWED, low=TEMPERATURE_MIN,
                      high=TEMPERATURE_MAX)


def normal_gravity(latitude, elevation=0.0):
    """Normal gravity [m/s^2] of the WGS 84 ellipsoid at a latitude and a height above it.

    Parameters
    ----------
    latitude : float or array_like
        Geodetic latitude [rad] in [-pi/2, pi/2].
    elevation : float or array_like
        Height above the ellipsoid [m] in [-500, 20000]. Height above sea level differs
        from it by the geoid undulation (within about +-110 m worldwide), worth up to
        3e-4 m/s^2 here.

    Returns
    -------
    float or ndarray
        gamma_h [m/s^2].

    Notes
    -----
    On the ellipsoid, Somigliana's closed form (NIMA TR8350.2, 3rd ed., eq. 4-1)::

        gamma = gamma_e (1 + k sin^2 phi) / sqrt(1 - e^2 sin^2 phi)

    with gamma_e = 9.7803253359 m/s^2, k = 0.00193185265241, e^2 = 6.69437999013e-3.
    Above it, the second-order series in the height h (TR8350.2 eq. 4-3)::

        gamma_h = gamma [1 - (2/a)(1 + f + m - 2 f sin^2 phi) h + (3/a^2) h^2]

    with a = 6378137 m, f = 1/298.257223563, m = omega^2 a^2 b / GM. Its linear term is
    the free-air gradient, 3.083e-6 (poles) to 3.088e-6 s^-2 (equator), about the
    3.086e-6 s^-2 of geodesy texts. Normal gravity is a smooth model of the Earth: the
    real gravity at a site differs by the local anomaly, typically a few 1e-4 m/s^2 and
    up to ~3e-3 m/s^2 in mountains (from memory), i.e. several seconds a day for a clock.

    Examples
    --------
    >>> round(normal_gravity(math.radians(45)), 10)
    9.8061977694
    """
    phi, s1 = real_array(latitude, "latitude", _LATITUDE_ALLOWED,
                         low=-0.5 * math.pi, high=0.5 * math.pi)
    h, s2 = _elevation(elevation)
    s2phi = np.sin(phi) ** 2
    gamma = (WGS84_EQUATORIAL_GRAVITY * (1.0 + WGS84_SOMIGLIANA_K * s2phi)
             / np.sqrt(1.0 - WGS84_ECCENTRICITY_SQ * s2phi))
    a = WGS84_SEMI_MAJOR_AXIS
    linear = (2.0 / a) * (1.0 + _FLATTENING + _M_RATIO - 2.0 * _FLATTENING * s2phi)
    return finalize(gamma * (1.0 - linear * h + 3.0 * (h / a) ** 2), s1 and s2)


def _geopotential(h):
    """ISO 2533 geopotential height H = r h / (r + h) [m] of a geometric height h [m]."""
    return ISA_EARTH_RADIUS * h / (ISA_EARTH_RADIUS + h)


_T11 = ISA_SEA_LEVEL_TEMPERATURE - ISA_LAPSE_RATE * ISA_TROPOPAUSE_GEOPOTENTIAL   # 216.65 K
_EXPONENT = STANDARD_GRAVITY / (ISA_GAS_CONSTANT * ISA_LAPSE_RATE)                # 5.25588
_P11 = ISA_SEA_LEVEL_PRESSURE * (_T11 / ISA_SEA_LEVEL_TEMPERATURE) ** _EXPONENT   # 22632.04 Pa


def isa_temperature(elevation):
    """Temperature [K] of the ISO 2533 standard atmosphere at a height above sea level.

    Parameters
    ----------
    elevation : float or array_like
        Geometric height above mean sea level [m] in [-500, 20000].

    Notes
    -----
    With the geopotential height H = r h / (r + h), r = 6356766 m (ISO 2533; ICAO Doc
    7488): T = 288.15 K - 0.0065 K/m * H up to the tropopause at H = 11 km, then 216.65 K
    (isothermal to H = 20 km). A standard, not a forecast: the temperature of a room or a
    site is whatever it is; pass it to :func:`air`.
    """
    h, scalar = _elevation(elevation)
    big_h = _geopotential(h)
    t = np.where(big_h <= ISA_TROPOPAUSE_GEOPOTENTIAL,
                 ISA_SEA_LEVEL_TEMPERATURE - ISA_LAPSE_RATE * big_h, _T11)
    return finalize(t, scalar)


def isa_pressure(elevation):
    """Pressure [Pa] of the ISO 2533 standard atmosphere at a height above sea level.

    Parameters
    ----------
    elevation : float or array_like
        Geometric height above mean sea level [m] in [-500, 20000].

    Notes
    -----
    Hydrostatic equilibrium of a perfect gas (R = 287.05287 J/(kg K), g_n) with the
    temperatures of :func:`isa_temperature` (ISO 2533; ICAO Doc 7488)::

        p = 101325 Pa (T / 288.15 K)^(g_n / (R L)),           H <= 11 km, L = 0.0065 K/m
        p = p_11 exp(-g_n (H - 11 km) / (R 216.65 K)),        11 km < H <= 20 km

    p_11 = 22632.04 Pa. The actual pressure at a site moves with the weather by a few
    percent (about +-3 kPa at sea level); a barometer reading beats this default.

    Examples
    --------
    >>> round(isa_pressure(0.0))
    101325
    """
    h, scalar = _elevation(elevation)
    big_h = _geopotential(h)
    low = big_h <= ISA_TROPOPAUSE_GEOPOTENTIAL
    t = ISA_SEA_LEVEL_TEMPERATURE - ISA_LAPSE_RATE * np.minimum(big_h,
                                                                ISA_TROPOPAUSE_GEOPOTENTIAL)
    p_trop = ISA_SEA_LEVEL_PRESSURE * (t / ISA_SEA_LEVEL_TEMPERATURE) ** _EXPONENT
    p_strat = _P11 * np.exp(-STANDARD_GRAVITY * (big_h - ISA_TROPOPAUSE_GEOPOTENTIAL)
                            / (ISA_GAS_CONSTANT * _T11))
    return finalize(np.where(low, p_trop, p_strat), scalar)


def _psv(t_k):
    a, b, c, d = _PSV
    return np.exp(a * t_k * t_k + b * t_k + c + d / t_k)


def saturation_vapour_pressure(temperature):
    """Saturation vapour pressure of water over a plane liquid surface [Pa].

    Parameters
    ----------
    temperature : float or array_like
        [K] in [213.15, 373.15] (over supercooled water below 273.15 K, the usual
        convention for relative humidity).

    Notes
    -----
    The CIPM-2007 formula (Picard et al., Metrologia 45 (2008) 149, eq. A1.6, number
    from memory; coefficients from memory, see the module source)::

        p_sv = 1 Pa * exp(A T^2 + B T + C + D / T)

    It gives the IAPWS triple-point pressure 611.657 Pa at 273.16 K to 6 digits and
    101.38 kPa at 373.15 K (IAPWS: 101.418 kPa, 0.03 % higher).

    Examples
    --------
    >>> round(saturation_vapour_pressure(273.16), 2)
    611.66
    """
    t, scalar = _temperature(temperature)
    return finalize(_psv(t), scalar)


def _moist_air(t_k, p, h, x_co2):
    """CIPM-2007: (density [kg/m^3], water mole fraction x_v, compressibility Z, M_a)."""
    t_c = t_k - ZERO_CELSIUS
    alpha, beta, gamma = _ENH
    enhancement = alpha + beta * p + gamma * t_c * t_c
    x_v = h * enhancement * _psv(t_k) / p
    a0, a1, a2 = _Z_A
    b0, b1 = _Z_B
    c0, c1 = _Z_C
    p_t = p / t_k
    z = (1.0 - p_t * (a0 + a1 * t_c + a2 * t_c * t_c + (b0 + b1 * t_c) * x_v
                      + (c0 + c1 * t_c) * x_v * x_v)
         + p_t * p_t * (_Z_D + _Z_E * x_v * x_v))
    m_a = _M_DRY_400PPM + _M_CO2_SLOPE * (x_co2 - 0.0004)
    rho = p * m_a / (z * _R_MOLAR * t_k) * (1.0 - x_v * (1.0 - _M_WATER / m_a))
    return rho, x_v, z, m_a


def _air_inputs(temperature, pressure, relative_humidity, co2_fraction):
    t, s1 = _temperature(temperature)
    p, s2 = real_array(pressure, "pressure", _PRESSURE_ALLOWED, low=PRESSURE_MIN,
                       high=PRESSURE_MAX)
    h, s3 = real_array(relative_humidity, "relative_humidity", _HUMIDITY_ALLOWED,
                       low=0.0, high=1.0)
    x, s4 = real_array(co2_fraction, "co2_fraction", _CO2_ALLOWED, low=0.0, high=0.01)
    try:
        t, p, h, x = np.broadcast_arrays(t, p, h, x)
    except ValueError:
        raise InvalidInput("temperature/pressure/relative_humidity/co2_fraction",
                           (np.shape(t), np.shape(p), np.shape(h), np.shape(x)),
                           "scalars or arrays of shapes that broadcast together",
                           "shapes do not match") from None
    out = _moist_air(t, p, h, x)
    x_v = out[1]
    if np.any(x_v > 1.0):
        i = np.unravel_index(int(np.argmax(x_v)), np.shape(x_v)) if np.ndim(x_v) else ()
        raise InvalidInput(
            "relative_humidity", float(np.asarray(h)[i]),
            "a humidity whose water vapour pressure is below the total pressure",
            f"at {float(np.asarray(t)[i]):g} K and {float(np.asarray(p)[i]):g} Pa the water "
            "vapour alone would exceed the total pressure")
    return out, s1 and s2 and s3 and s4


def air_density(temperature, pressure, relative_humidity=0.0, co2_fraction=0.0004):
    """Density of moist air [kg/m^3] from the CIPM-2007 equation.

    Parameters
    ----------
    temperature : float or array_like
        Air temperature [K] in [213.15, 373.15].
    pressure : float or array_like
        Total pressure [Pa] in [1, 120000].
    relative_humidity : float or array_like
        h in [0, 1] (0.5 for 50 %), over liquid water.
    co2_fraction : float or array_like
        Mole fraction of CO2 in [0, 0.01]; default 0.0004 (400 ppm; a room with people in
        it is often 0.0006-0.001).

    Notes
    -----
    CIPM-2007 (A. Picard, R. S. Davis, M. Glaeser, K. Fujii, "Revised formula for the
    density of moist air (CIPM-2007)", Metrologia 45 (2008) 149-155)::

        rho = p M_a / (Z R T) [1 - x_v (1 - M_v / M_a)]
        x_v = h f(p, t) p_sv(T) / p,   f = 1.00062 + 3.14e-8 p + 5.6e-7 t^2  (t in degC)
        M_a = [28.96546 + 12.011 (x_CO2 - 0.0004)] 1e-3 kg/mol,  M_v = 18.01528e-3 kg/mol
        Z = 1 - (p/T)[a0 + a1 t + a2 t^2 + (b0 + b1 t) x_v + (c0 + c1 t) x_v^2]
              + (p/T)^2 (d + e x_v^2),   R = 8.314472 J/(mol K)

    All coefficients are written from memory (not re-checked against the paper); the tests
    cross-check them. The fit's range is 15-27 degC and 60-110 kPa with a relative
    uncertainty of 2.2e-5 there (from memory); outside it, an extrapolation.
    Humid air is lighter than dry air at the same p and T (M_v < M_a).

    Examples
    --------
    >>> round(air_density(288.15, 101325.0), 4)
    1.2255
    """
    (rho, _x_v, _z, _m), scalar = _air_inputs(temperature, pressure, relative_humidity,
                                               co2_fraction)
    return finalize(rho, scalar)


def air_viscosity(temperature):
    """Dynamic viscosity of air [Pa s] from Sutherland's law.

    Parameters
    ----------
    temperature : float or array_like
        [K] in [213.15, 373.15].

    Notes
    -----
    mu = beta_s T^(3/2) / (T + S), beta_s = 1.458e-6 kg/(m s K^0.5), S = 110.4 K
    (ISO 2533; gives the ISA sea-level 1.7894e-5 Pa s at 288.15 K). Independent of
    pressure for a gas well above its critical point, as air is here; water vapour
    changes it by well under 1 % at room humidities (from memory), so it is ignored.

    Examples
    --------
    >>> round(air_viscosity(288.15) * 1e5, 4)
    1.7894
    """
    t, scalar = _temperature(temperature)
    return finalize(SUTHERLAND_BETA * t ** 1.5 / (t + SUTHERLAND_S), scalar)


@dataclass(frozen=True)
class Air:
    """The air a pendulum swings in: state, density and viscosity, SI units in the names.

    Attributes
    ----------
    density_kg_m3 : float
        CIPM-2007 moist-air density.
    temperature_K, pressure_Pa : float
    relative_humidity : float
        In [0, 1].
    co2_fraction : float
        Mole fraction.
    water_vapour_fraction : float
        Mole fraction x_v of water vapour.
    compressibility : float
        Z of the CIPM-2007 equation (1 for an ideal gas).
    viscosity_Pa_s : float
        Sutherland's law.
    kinematic_viscosity_m2_s : float
        viscosity / density.
    elevation_m : float
        Height above sea level used for the standard-atmosphere defaults.
    temperature_source, pressure_source : str
        ``"given"`` or ``"isa"`` (filled from the standard atmosphere at the elevation).
    """

    density_kg_m3: float
    temperature_K: float
    pressure_Pa: float
    relative_humidity: float
    co2_fraction: float
    water_vapour_fraction: float
    compressibility: float
    viscosity_Pa_s: float
    kinematic_viscosity_m2_s: float
    elevation_m: float
    temperature_source: str
    pressure_source: str

    def to_dict(self) -> dict:
        return dict(self.__dict__)


def _scalar(value, field, allowed, **limits):
    arr, scalar = real_array(value, field, allowed, **limits)
    if not scalar:
        raise InvalidInput(field, value, f"a single value: {allowed}", "not a scalar")
    return float(arr)


def air(temperature=None, pressure=None, relative_humidity=0.0, elevation=0.0,
        co2_fraction=0.0004):
    """The air at a site: density, viscosity and state, with standard-atmosphere defaults.

    Parameters
    ----------
    temperature : float, optional
        [K] in [213.15, 373.15]; default: the ISA temperature at ``elevation``.
    pressure : float, optional
        [Pa] in [1, 120000]; default: the ISA pressure at ``elevation``.
    relative_humidity : float
        In [0, 1].
    elevation : float
        Height above sea level [m] in [-500, 20000], used only for the defaults.
    co2_fraction : float
        CO2 mole fraction in [0, 0.01].

    Returns
    -------
    Air

    Notes
    -----
    Density: :func:`air_density` (CIPM-2007); viscosity: :func:`air_viscosity`
    (Sutherland); defaults: :func:`isa_temperature`, :func:`isa_pressure` (ISO 2533).
    At ISA sea level the CIPM density is 1.2255 kg/m^3, 0.04 % above the ISA's 1.2250,
    which treats air as an ideal gas (Z = 0.99959 here) of molar mass 28.9644 g/mol.

    Examples
    --------
    >>> round(air(293.15, 101325.0, 0.5).density_kg_m3, 4)
    1.1993
    """
    h = _scalar(elevation, "elevation", _ELEVATION_ALLOWED, low=ELEVATION_MIN,
                high=ELEVATION_MAX)
    t_source = "isa" if temperature is None else "given"
    p_source = "isa" if pressure is None else "given"
    t = isa_temperature(h) if temperature is None else _scalar(
        temperature, "temperature", _TEMPERATURE_ALLOWED, low=TEMPERATURE_MIN,
        high=TEMPERATURE_MAX)
    p = isa_pressure(h) if pressure is None else _scalar(
        pressure, "pressure", _PRESSURE_ALLOWED, low=PRESSURE_MIN, high=PRESSURE_MAX)
    rh = _scalar(relative_humidity, "relative_humidity", _HUMIDITY_ALLOWED, low=0.0, high=1.0)
    x = _scalar(co2_fraction, "co2_fraction", _CO2_ALLOWED, low=0.0, high=0.01)
    (rho, x_v, z, _m), _ = _air_inputs(t, p, rh, x)
    mu = air_viscosity(t)
    return Air(density_kg_m3=float(rho), temperature_K=t, pressure_Pa=p,
               relative_humidity=rh, co2_fraction=x, water_vapour_fraction=float(x_v),
               compressibility=float(z), viscosity_Pa_s=mu,
               kinematic_viscosity_m2_s=mu / float(rho), elevation_m=h,
               temperature_source=t_source, pressure_source=p_source)


# --- a bob in a fluid -----------------------------------------------------------------------

def _fluid_inputs(body_density, fluid_density):
    rb, s1 = real_array(body_density, "body_density", _DENSITY_ALLOWED, low=0.0, low_open=True)
    rf, s2 = real_array(fluid_density, "fluid_density", _FLUID_ALLOWED, low=0.0)
    try:
        rb, rf = np.broadcast_arrays(rb, rf)
    except ValueError:
        raise InvalidInput("body_density/fluid_density", (np.shape(rb), np.shape(rf)),
                           "scalars or arrays of shapes that broadcast together",
                           "shapes do not match") from None
    bad = rb <= rf
    if np.any(bad):
        i = np.unravel_index(int(np.argmax(bad)), bad.shape) if bad.ndim else ()
        raise InvalidInput(
            "body_density", float(rb[i]),
            f"a body density greater than the fluid's ({float(rf[i]):g} kg/m^3)",
            "a body no denser than the fluid floats or hovers; it does not hang as a pendulum")
    return rb, rf, s1 and s2


def _added_mass_input(value):
    return real_array(value, "added_mass_coefficient", _ADDED_MASS_ALLOWED, low=0.0)


def _rate(log_ratio):
    """86400 (T0/T - 1) from ln(T0/T), without cancellation."""
    return SECONDS_PER_DAY * np.expm1(log_ratio)


def fluid_period_factor(body_density, fluid_density, added_mass_coefficient):
    """Period in a fluid over the period in vacuum, T/T0, for a point bob.

    Parameters
    ----------
    body_density : float or array_like
        Density of the bob [kg/m^3], > ``fluid_density``.
    fluid_density : float or array_like
        Density of the surrounding fluid [kg/m^3] >= 0 (air: :func:`air_density`).
    added_mass_coefficient : float or array_like
        Added mass over displaced fluid mass, >= 0 (1/2 for a sphere, Stokes 1851; see
        :mod:`swingcalc.fluids`).

    Notes
    -----
    Buoyancy lowers the restoring weight to (rho_b - rho_f) V g; the fluid dragged along
    raises the inertia to (rho_b + k rho_f) V. For a point bob on a light rod::

        T / T0 = sqrt((rho_b + k rho_f) / (rho_b - rho_f))

    (G. G. Stokes, "On the effect of the internal friction of fluids on the motion of
    pendulums", Trans. Camb. Phil. Soc. 9 (1851) 8; REFERENCES.md "Air, materials").
    Inviscid: the viscous boundary layer adds a further, frequency-dependent, inertia
    (Stokes 1851, of order sqrt(nu T) / radius) that this omits. A compound body needs the
    per-part version (the body model).

    Examples
    --------
    >>> round(fluid_period_factor(8500.0, 1.225, 0.5), 9)
    1.000108098
    """
    rb, rf, scalar = _fluid_inputs(body_density, fluid_density)
    k, s3 = _added_mass_input(added_mass_coefficient)
    r = rf / rb
    out = np.exp(0.5 * (np.log1p(k * r) - np.log1p(-r)))
    finite_result([out], "body_density/fluid_density/added_mass_coefficient",
                  "values whose period factor is a finite number")
    return finalize(out, scalar and s3)


def buoyancy_rate_shift(body_density, fluid_density):
    """Rate change [s/day] from buoyancy alone, against the same clock in vacuum (negative).

    86400 (sqrt((rho_b - rho_f) / rho_b) - 1) ~ -43200 rho_f / rho_b. A brass bob
    (8500 kg/m^3) in ISA sea-level air (1.225 kg/m^3): -6.23 s/day (REFERENCES.md:
    about 6.2 s/day). Parameters as in :func:`fluid_period_factor`.
    """
    rb, rf, scalar = _fluid_inputs(body_density, fluid_density)
    return finalize(_rate(0.5 * np.log1p(-rf / rb)), scalar)


def added_mass_rate_shift(body_density, fluid_density, added_mass_coefficient):
    """Rate change [s/day] from the added mass alone, against the same clock in vacuum.

    86400 (sqrt(rho_b / (rho_b + k rho_f)) - 1) ~ -43200 k rho_f / rho_b. The brass bob
    of :func:`buoyancy_rate_shift` as a sphere (k = 1/2): -3.11 s/day. Parameters as in
    :func:`fluid_period_factor`. The buoyancy and added-mass factors multiply; their
    rates add to within (rho_f / rho_b)^2.
    """
    rb, rf, scalar = _fluid_inputs(body_density, fluid_density)
    k, s3 = _added_mass_input(added_mass_coefficient)
    out = _rate(-0.5 * np.log1p(k * rf / rb))
    return finalize(out, scalar and s3)


def fluid_rate_shift(body_density, fluid_density, added_mass_coefficient):
    """Rate change [s/day] from buoyancy and added mass together: 86400 (T0/T - 1).

    The brass sphere of :func:`buoyancy_rate_shift`: -9.34 s/day (REFERENCES.md: about
    9.3 s/day). Parameters as in :func:`fluid_period_factor`.
    """
    rb, rf, scalar = _fluid_inputs(body_density, fluid_density)
    k, s3 = _added_mass_input(added_mass_coefficient)
    out = _rate(0.5 * (np.log1p(-rf / rb) - np.log1p(k * rf / rb)))
    finite_result([out], "body_density/fluid_density/added_mass_coefficient",
                  "values whose rate change is a finite number")
    return finalize(out, scalar and s3)


def rate_change_per_kelvin(expansion_coefficient):
    """Rate change [s/day per K] of a simple pendulum whose length expands with temperature.

    Parameters
    ----------
    expansion_coefficient : float or array_like
        Linear expansion coefficient alpha [1/K] in [-1e-4, 1e-3] of the rod (solids lie
        within about +-2e-4; see :mod:`swingcalc.materials`).

    Notes
    -----
    T is proportional to sqrt(L) and L to (1 + alpha dT), so at dT -> 0::

        d(rate)/dT = -86400 alpha / 2   s/day per K

    Steel (alpha ~ 11.5e-6): -0.50 s/day per K (REFERENCES.md). A compound body whose parts
    expand differently (a compensated pendulum) needs the body model; this also leaves out
    the temperature change of the air density and of a suspension spring's stiffness.

    Examples
    --------
    >>> round(rate_change_per_kelvin(11.5e-6), 4)
    -0.4968
    """
    alpha, scalar = real_array(expansion_coefficient, "expansion_coefficient",
                               _EXPANSION_ALLOWED, low=-1e-4, high=1e-3)
    return finalize(-0.5 * SECONDS_PER_DAY * alpha, scalar)
