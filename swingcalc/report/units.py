"""Display units: the one table that turns an SI value of a given kind into the unit a
person reads in a chosen unit system. Display only: stored values and JSON stay SI.

Every factor is exact by definition:

- inch = 0.0254 m and foot = 12 in = 0.3048 m (the international yard and pound
  agreement of 1959; NIST SP 811, 2008 ed., Appendix B.8 and B.9, from memory);
- pound (avoirdupois) = 0.453 592 37 kg (same agreement and tables);
- pound-force = the pound's weight at standard gravity, 0.453 592 37 kg x 9.806 65 m/s^2
  = 4.448 221 615 260 5 N (NIST SP 811 B.8/B.9, from memory; g_n from the 3rd CGPM);
- degree = pi/180 rad; kelvin to degree Celsius: t = T - 273.15; a temperature
  difference of 1 K = 1.8 degF (ITS-90 / SP 811 B.8, from memory).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from ..constants import STANDARD_GRAVITY
from ..errors import InvalidInput

__all__ = [
    "FOOT_M",
    "FOOT_POUND_FORCE_J",
    "INCH_M",
    "KINDS",
    "POUND_FORCE_N",
    "POUND_KG",
    "SYSTEMS",
    "DisplayUnit",
    "display_unit",
    "from_display",
    "to_display",
    "unit_system",
]

#: Unit systems: SI; SI with lengths in millimetres (as drawings are dimensioned);
#: inch-pound (US customary).
SYSTEMS = ("si", "si-mm", "inch-pound")

INCH_M = 0.0254                             # exact
FOOT_M = 12.0 * INCH_M                      # 0.3048 m, exact
POUND_KG = 0.45359237                       # exact
POUND_FORCE_N = POUND_KG * STANDARD_GRAVITY   # 4.4482216152605 N, exact product
FOOT_POUND_FORCE_J = FOOT_M * POUND_FORCE_N   # 1.3558179483314004 J
_DEG = 180.0 / math.pi
_ZERO_C = 273.15


@dataclass(frozen=True)
class DisplayUnit:
    """How one kind shows in one system: ``display = value * scale + offset``."""

    unit: str
    scale: float = 1.0
    offset: float = 0.0


def _same(unit: str, scale: float = 1.0, offset: float = 0.0) -> tuple:
    u = DisplayUnit(unit, scale, offset)
    return (u, u, u)


# kind -> (si, si-mm, inch-pound)
KINDS = {
    "text": _same(""),
    "length": (DisplayUnit("m"), DisplayUnit("mm", 1e3), DisplayUnit("in", 1.0 / INCH_M)),
    "mass": (DisplayUnit("kg"), DisplayUnit("kg"), DisplayUnit("lb", 1.0 / POUND_KG)),
    "inertia": (DisplayUnit("kg m^2"), DisplayUnit("kg mm^2", 1e6),
                DisplayUnit("lb in^2", 1.0 / (POUND_KG * INCH_M ** 2))),
    "force": (DisplayUnit("N"), DisplayUnit("N"), DisplayUnit("lbf", 1.0 / POUND_FORCE_N)),
    "energy": (DisplayUnit("J"), DisplayUnit("J"),
               DisplayUnit("ft lbf", 1.0 / FOOT_POUND_FORCE_J)),
    "speed": (DisplayUnit("m/s"), DisplayUnit("m/s"), DisplayUnit("ft/s", 1.0 / FOOT_M)),
    "acceleration": (DisplayUnit("m/s^2"), DisplayUnit("m/s^2"),
                     DisplayUnit("ft/s^2", 1.0 / FOOT_M)),
    "density": (DisplayUnit("kg/m^3"), DisplayUnit("kg/m^3"),
                DisplayUnit("lb/ft^3", FOOT_M ** 3 / POUND_KG)),
    "temperature": (DisplayUnit("degC", 1.0, -_ZERO_C), DisplayUnit("degC", 1.0, -_ZERO_C),
                    DisplayUnit("degF", 1.8, 32.0 - 1.8 * _ZERO_C)),
    "felt_g": _same("g"),                   # kept in g (felt acceleration / g_n)
    "time": _same("s"),
    "angle": _same("deg", _DEG),
    "angular_speed": _same("rad/s"),
    "beat_rate": _same("beats/h"),
    "frequency": _same("Hz"),
    "fraction": _same("%", 100.0),
    "ratio": _same(""),
    "rate": _same("s/day"),
    "rate_per_angle": _same("s/day per deg", 1.0 / _DEG),
    "rate_per_temperature": (DisplayUnit("s/day per K"), DisplayUnit("s/day per K"),
                             DisplayUnit("s/day per degF", 1.0 / 1.8)),
    # The rating figure is per mm in both SI systems, as clockmakers quote it.
    "rate_per_length": (DisplayUnit("s/day per mm", 1e-3), DisplayUnit("s/day per mm", 1e-3),
                        DisplayUnit("s/day per in", INCH_M)),
    "rate_per_turn": _same("s/day per turn"),
}


def unit_system(text: str, field: str = "--units") -> str:
    """A unit-system name from :data:`SYSTEMS` (case and spaces ignored)."""
    word = str(text).strip().lower().replace("_", "-").replace(" ", "-")
    if word not in SYSTEMS:
        from ..errors import suggest

        raise InvalidInput(field, text, ", ".join(SYSTEMS),
                           f"unknown unit system{suggest(word, SYSTEMS)}")
    return word


def display_unit(kind: str, system: str = "si") -> DisplayUnit:
    """The display unit of ``kind`` in ``system``."""
    return KINDS[kind][SYSTEMS.index(system)]


def to_display(value: float, kind: str, system: str = "si", difference: bool = False) -> float:
    """``value`` [SI] of ``kind`` in the system's display unit; ``difference`` for a
    half-width or change (no offset: a 5 K band is 9 degF, whatever the temperature)."""
    u = display_unit(kind, system)
    return value * u.scale + (0.0 if difference else u.offset)


def from_display(shown: float, kind: str, system: str = "si") -> float:
    """The SI value of a displayed one (the inverse of :func:`to_display`)."""
    u = display_unit(kind, system)
    return (shown - u.offset) / u.scale
