"""Physical constants, each with its source."""

from __future__ import annotations

__all__ = [
    "STANDARD_GRAVITY", "SECONDS_PER_DAY", "SECONDS_PER_HOUR",
    "WGS84_SEMI_MAJOR_AXIS", "WGS84_INVERSE_FLATTENING", "WGS84_GM", "WGS84_ANGULAR_VELOCITY",
    "WGS84_EQUATORIAL_GRAVITY", "WGS84_SOMIGLIANA_K", "WGS84_ECCENTRICITY_SQ",
    "ISA_SEA_LEVEL_TEMPERATURE", "ISA_SEA_LEVEL_PRESSURE", "ISA_SEA_LEVEL_DENSITY",
    "ISA_LAPSE_RATE", "ISA_TROPOPAUSE_GEOPOTENTIAL", "ISA_GAS_CONSTANT",
    "ISA_EARTH_RADIUS", "ISA_SEA_LEVEL_VISCOSITY", "SUTHERLAND_BETA", "SUTHERLAND_S",
    "ZERO_CELSIUS",
]

#: Standard acceleration of gravity g_n [m/s^2], exact by definition
#: (3rd CGPM, 1901; ISO 80000-3; NIST SP 330).
STANDARD_GRAVITY = 9.80665

#: Seconds in a mean solar day [s] (definition of the day as 86 400 s of SI time).
SECONDS_PER_DAY = 86400.0

#: Seconds in an hour [s].
SECONDS_PER_HOUR = 3600.0

# --- WGS 84 (NIMA TR8350.2, 3rd ed., 2000, chapter 3: the four defining parameters and the
# derived constants; table numbers below are from memory). gamma_e, k and e^2 are as in
# REFERENCES.md; tests/test_environment.py re-derives e^2 = f (2 - f) from the flattening.

#: Semi-major axis a of the WGS 84 ellipsoid [m] (defining parameter).
WGS84_SEMI_MAJOR_AXIS = 6378137.0
#: Reciprocal flattening 1/f of the WGS 84 ellipsoid [-] (defining parameter).
WGS84_INVERSE_FLATTENING = 298.257223563
#: Earth's gravitational constant GM, atmosphere included [m^3/s^2] (defining parameter).
WGS84_GM = 3.986004418e14
#: Nominal angular velocity of the Earth omega [rad/s] (defining parameter).
WGS84_ANGULAR_VELOCITY = 7.292115e-5
#: Normal gravity at the equator gamma_e [m/s^2] (TR8350.2 Table 3.4).
WGS84_EQUATORIAL_GRAVITY = 9.7803253359
#: Somigliana's constant k = (b gamma_p)/(a gamma_e) - 1 [-] (TR8350.2 Table 3.4).
WGS84_SOMIGLIANA_K = 0.00193185265241
#: First eccentricity squared e^2 of the WGS 84 ellipsoid [-] (TR8350.2 Table 3.3).
WGS84_ECCENTRICITY_SQ = 6.69437999013e-3

# --- ISO 2533:1975 / ICAO Doc 7488 standard atmosphere (defining values; REFERENCES.md gives
# the sea-level ones, the rest are from memory and checked in the tests against the
# printed 11 km and 20 km table values) ---------------------------------------------------

#: ISA sea-level temperature [K].
ISA_SEA_LEVEL_TEMPERATURE = 288.15
#: ISA sea-level pressure [Pa].
ISA_SEA_LEVEL_PRESSURE = 101325.0
#: ISA sea-level density [kg/m^3] (as printed, 1.2250; it is p/(R T) rounded).
ISA_SEA_LEVEL_DENSITY = 1.225
#: ISA temperature gradient in the troposphere, -dT/dH [K/m] of geopotential height.
ISA_LAPSE_RATE = 0.0065
#: Geopotential height of the ISA tropopause [m]; isothermal above it up to 20 km.
ISA_TROPOPAUSE_GEOPOTENTIAL = 11000.0
#: Specific gas constant of dry air in the ISA, R*/M = 8314.32/28.9644 [J/(kg K)].
ISA_GAS_CONSTANT = 287.05287
#: Nominal Earth radius for converting geometric to geopotential height in ISO 2533 [m].
ISA_EARTH_RADIUS = 6356766.0
#: Sutherland's constant beta_s of ISO 2533 for the viscosity of air [kg/(m s K^0.5)].
SUTHERLAND_BETA = 1.458e-6
#: Sutherland's temperature S of ISO 2533 [K].
SUTHERLAND_S = 110.4

#: Dynamic viscosity of air at ISA sea level [Pa s] (ISO 2533), the default where no
#: temperature is known.
ISA_SEA_LEVEL_VISCOSITY = 1.7894e-5

#: 0 degC in kelvin [K] (exact, SI Brochure 9th ed.).
ZERO_CELSIUS = 273.15
