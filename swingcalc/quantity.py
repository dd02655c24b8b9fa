"""User strings with units -> SI floats, at the boundary (design files, command line).

A bare number is SI, except an angle, which is in degrees (the trade's habit). A number
with a unit (``"850 mm"``, ``"2.5 ft"``, ``"30 deg"``, ``"0.5 %"``) is converted with pint,
which is imported only when a string carries a unit it cannot convert by definition (the
kind's SI unit, degrees, percent, the SI-prefixed and inch-pound units of ``_EXACT``,
degC and degF are converted here), so most runs never pay for pint's registry.

Parsing is deliberately narrow: the magnitude is split off with a regular expression and
read with :func:`float`; the unit part is limited in length and characters, may hold
numbers only as small integer exponents, and is handed to pint's unit parser (never to a
definition file). The result must have the dimension of the expected kind.

Value lists: ``"10, 20, 30"``, ranges ``"0:90:10"`` (start:stop:step, the stop is included
when it falls on the grid) and mixtures, with a trailing unit applying to bare parts
(``"0:90:5 deg"``, ``"850, 900 mm"``).
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass

import numpy as np

from .errors import MISSING, InvalidInput, suggest

__all__ = ["KINDS", "parse_quantity", "parse_values", "split_magnitude", "suggest"]

#: Longest accepted single quantity string, and longest value list.
MAX_QUANTITY_CHARS = 100
MAX_LIST_CHARS = 2000
#: Most values a list or range may expand to.
MAX_VALUES = 10_000
_MAX_EXPONENT = 4

_NUMBER = re.compile(r"[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?")
_UNIT_CHARS = re.compile(r"[A-Za-z_µμ°%Ω][A-Za-z0-9_µμ°%Ω */^()\-]*")
_EXPONENT = re.compile(r"(\*\*|\^)\s*(\(\s*)?(-?\d+)(\s*\))?")
_NAME = re.compile(r"[A-Za-z_µμ°%Ω][A-Za-z0-9_µμ°%Ω]*")
_NOT_FINITE = re.compile(r"[+-]?(nan|inf|infinity)\b", re.IGNORECASE)


@dataclass(frozen=True)
class Kind:
    """A physical kind of input: its SI unit, how to recognise it, what to suggest."""

    name: str
    si: str                 # pint spelling of the SI unit the library takes
    described: str          # in words, for error messages
    examples: str
    identity: tuple         # unit spellings that need no conversion (no pint)
    suggestions: tuple      # units offered in "did you mean"


KINDS = {
    "length": Kind("length", "m", "a length", "'850 mm', '2.5 ft' or a bare number in m",
                   ("m", "metre", "metres", "meter", "meters"),
                   ("m", "mm", "cm", "km", "um", "in", "ft", "yd", "mi")),
    "angle": Kind("angle", "rad", "an angle", "'30 deg', '0.5 rad' or a bare number in deg",
                  ("rad", "radian", "radians"),
                  ("deg", "rad", "degree", "radian", "arcmin", "arcsec", "turn", "grad")),
    "mass": Kind("mass", "kg", "a mass", "'1.2 kg', '2.5 lb' or a bare number in kg",
                 ("kg", "kilogram", "kilograms"),
                 ("kg", "g", "t", "lb", "oz")),
    "acceleration": Kind("acceleration", "m/s^2", "an acceleration",
                         "'9.81 m/s^2', '1 g0' or a bare number in m/s^2",
                         ("m/s^2", "m/s**2", "m s^-2", "m*s^-2", "m*s**-2"),
                         ("m/s^2", "ft/s^2", "g0", "Gal")),
    "speed": Kind("speed", "m/s", "a speed", "'3 m/s', '10 km/h' or a bare number in m/s",
                  ("m/s",), ("m/s", "km/h", "ft/s", "mph", "knot")),
    "angular_velocity": Kind("angular_velocity", "rad/s", "an angular speed",
                             "'1.5 rad/s', '90 deg/s', '10 rpm' or a bare number in rad/s",
                             ("rad/s", "radian/second"), ("rad/s", "deg/s", "rpm", "rps")),
    "angular_acceleration": Kind(
        "angular_acceleration", "rad/s^2", "an angular acceleration",
        "'3 rad/s^2', '200 deg/s^2' or a bare number in rad/s^2", ("rad/s^2", "rad/s**2"),
        ("rad/s^2", "deg/s^2")),
    "time": Kind("time", "s", "a time", "'2 s', '500 ms', '1 h' or a bare number in s",
                 ("s", "second", "seconds"), ("s", "ms", "min", "h", "day")),
    "temperature": Kind("temperature", "K", "a temperature", "'20 degC', '293.15 K', '68 degF'",
                        ("K", "kelvin"), ("degC", "K", "degF")),
    "temperature_difference": Kind(
        "temperature_difference", "K", "a temperature difference", "'5 K', '5 degC' or '9 degF'",
        ("K", "kelvin"), ("K", "degC", "degF")),
    "density": Kind("density", "kg/m^3", "a density", "'8.4 g/cm^3', '7850 kg/m^3'",
                    ("kg/m^3", "kg/m**3", "kg m^-3"), ("kg/m^3", "g/cm^3", "lb/in^3", "lb/ft^3")),
    "linear_density": Kind("linear_density", "kg/m", "a mass per length",
                           "'0.9 kg/m', '0.6 lb/ft'", ("kg/m",), ("kg/m", "g/m", "lb/ft")),
    "pressure": Kind("pressure", "Pa", "a pressure", "'101.3 kPa', '1013 hPa', '29.9 inHg'",
                     ("Pa", "pascal"), ("Pa", "hPa", "kPa", "bar", "mbar", "psi", "inHg")),
    "torque": Kind("torque", "N*m", "a torque", "'0.02 N m', '0.2 lbf ft'",
                   ("N*m", "N m", "N.m", "N·m"), ("N*m", "N*mm", "lbf*ft", "lbf*in")),
    "energy": Kind("energy", "J", "an energy", "'300 J', '220 ft lbf'", ("J", "joule"),
                   ("J", "kJ", "ft*lbf")),
    "force": Kind("force", "N", "a force", "'2 kN', '450 lbf'", ("N", "newton"),
                  ("N", "kN", "lbf", "kgf")),
    "inertia": Kind("inertia", "kg*m^2", "a moment of inertia", "'0.35 kg m^2'",
                    ("kg*m^2", "kg m^2", "kg*m**2"), ("kg*m^2", "kg*cm^2", "lb*ft^2", "lb*in^2")),
    "volume": Kind("volume", "m^3", "a volume", "'120 cm^3', '0.5 L'", ("m^3", "m**3"),
                   ("m^3", "cm^3", "L", "mm^3", "in^3")),
    "expansion": Kind("expansion", "1/K", "a thermal expansion coefficient",
                      "'11.5e-6 /K', '11.5 ppm/K'", ("1/K", "/K", "K^-1"),
                      ("1/K", "ppm/K")),
    "viscous": Kind("viscous", "N*m*s", "a viscous damping coefficient (torque per angular speed)",
                    "'0.002 N m s'", ("N*m*s", "N m s"), ("N*m*s",)),
    "angular_impulse": Kind("angular_impulse", "N*m*s", "an angular impulse",
                            "'0.001 N m s'", ("N*m*s", "N m s"), ("N*m*s", "mN*m*s")),
    "drag_torque": Kind("drag_torque", "N*m*s^2",
                        "a quadratic drag coefficient (torque per angular speed squared)",
                        "'0.002 N m s^2'", ("N*m*s^2", "N m s^2", "kg m^2", "kg*m^2"),
                        ("N*m*s^2",)),
    "frequency": Kind("frequency", "Hz", "a frequency", "'0.5 Hz', '30 1/min'",
                      ("Hz", "1/s"), ("Hz", "mHz", "1/min")),
    "fraction": Kind("fraction", "dimensionless", "a fraction",
                     "'0.5 %', '200 ppm' or a bare number such as 0.005",
                     ("",), ("%", "percent", "ppm")),
}

_DEGREE_SPELLINGS = ("deg", "degree", "degrees", "°")
_CELSIUS = ("degC", "°C", "celsius")
_FAHRENHEIT = ("degF", "°F", "fahrenheit")
# The commonest units of a design file, exact by definition (SI prefixes; the inch, foot
# and pound by the 1959 international yard and pound agreement, NIST SP 811 B.8), as
# (multiplier, divisor): converted without pint, whose registry costs most of a second.
_EXACT = {
    "length": {"mm": (1.0, 1e3), "cm": (1.0, 1e2), "km": (1e3, 1.0), "um": (1.0, 1e6),
               "in": (0.0254, 1.0), "ft": (0.3048, 1.0)},
    "mass": {"g": (1.0, 1e3), "t": (1e3, 1.0), "lb": (0.45359237, 1.0)},
    "density": {"g/cm^3": (1e3, 1.0), "kg/L": (1e3, 1.0)},
    "volume": {"L": (1.0, 1e3), "cm^3": (1.0, 1e6), "mm^3": (1.0, 1e9)},
    "time": {"ms": (1.0, 1e3), "min": (60.0, 1.0), "h": (3600.0, 1.0),
             "day": (86400.0, 1.0)},
    "pressure": {"hPa": (1e2, 1.0), "kPa": (1e3, 1.0), "bar": (1e5, 1.0)},
    "force": {"kN": (1e3, 1.0), "MN": (1e6, 1.0)},
    "energy": {"kJ": (1e3, 1.0)},
    "inertia": {"kg m^2": (1.0, 1.0)},
    "torque": {"N m": (1.0, 1.0), "N mm": (1.0, 1e3)},
    "linear_density": {"g/m": (1.0, 1e3)},
    "viscous": {"N m s": (1.0, 1.0)},
    "angular_impulse": {"N m s": (1.0, 1.0)},
    "drag_torque": {"N m s^2": (1.0, 1.0)},
    "fraction": {"ppm": (1.0, 1e6)},
    "expansion": {"ppm/K": (1.0, 1e6), "1/K": (1.0, 1.0)},
}
_DIFFERENCE_SCALES = {"degC": 1.0, "°C": 1.0, "delta_degC": 1.0, "degF": 5.0 / 9.0,
                      "°F": 5.0 / 9.0, "delta_degF": 5.0 / 9.0}
_REGISTRY = None


def _registry():
    """The one pint registry, created on first use (it costs a few tenths of a second)."""
    global _REGISTRY
    if _REGISTRY is None:
        try:
            import pint
        except ImportError:  # pragma: no cover - pint is a declared dependency
            raise InvalidInput("unit", MISSING, "bare numbers (SI; angles in deg)",
                               "units need the 'pint' package, which is not installed") from None
        _REGISTRY = pint.UnitRegistry()
    return _REGISTRY


def _kind(kind: str) -> Kind:
    try:
        return KINDS[kind]
    except KeyError:
        raise ValueError(f"unknown quantity kind {kind!r}; one of {sorted(KINDS)}") from None


def _allowed(k: Kind, allowed: str | None) -> str:
    return allowed or f"{k.described}, e.g. {k.examples}"


def _normalise(text: str) -> str:
    return (text.replace("\u2212", "-").replace("\u00a0", " ").replace("\u202f", " ")
            .replace("·", "*").replace("²", "^2").replace("³", "^3").strip())


def split_magnitude(text: str, field: str, allowed: str) -> tuple[float, str]:
    """Split ``"850 mm"`` into ``(850.0, "mm")``; the unit is ``""`` for a bare number."""
    t = _normalise(text)
    if not t:
        raise InvalidInput(field, text, allowed, "empty value")
    if len(t) > MAX_QUANTITY_CHARS:
        raise InvalidInput(field, text, allowed,
                           f"longer than {MAX_QUANTITY_CHARS} characters")
    if _NOT_FINITE.match(t):
        raise InvalidInput(field, text, allowed, "not a finite number")
    m = _NUMBER.match(t)
    if not m:
        raise InvalidInput(field, text, allowed, "does not start with a number")
    value = float(m.group(0))
    if not math.isfinite(value):
        raise InvalidInput(field, text, allowed, "not a finite number (too large)")
    return value, t[m.end():].strip()


def _check_unit_text(unit: str, field: str, original: str, allowed: str) -> None:
    if not _UNIT_CHARS.fullmatch(unit):
        raise InvalidInput(field, original, allowed,
                           "the unit may contain only letters, spaces, '*', '/', '^', "
                           "'(', ')', '%' and small integer exponents")
    for m in _EXPONENT.finditer(unit):
        if abs(int(m.group(3))) > _MAX_EXPONENT:
            raise InvalidInput(field, original, allowed,
                               f"unit exponents are limited to +-{_MAX_EXPONENT}")
    rest = _NAME.sub("", _EXPONENT.sub("", unit))
    if re.search(r"[\d\-]", rest):
        raise InvalidInput(field, original, allowed,
                           "numbers may appear in a unit only as exponents ('m/s^2')")


def _parse_unit(unit: str, k: Kind, field: str, original: str, allowed: str):
    """Parse a unit string with pint and check its dimension; returns the pint unit."""
    _check_unit_text(unit, field, original, allowed)
    ureg = _registry()
    import pint

    try:
        parsed = ureg.parse_units(unit)
        probe = ureg.Quantity(1.0, parsed)
        root = probe.to_root_units()
    except pint.errors.UndefinedUnitError as exc:
        names = getattr(exc, "unit_names", None) or (unit,)
        name = names[0] if isinstance(names, (tuple, list)) else str(names)
        raise InvalidInput(field, original, allowed,
                           f"unknown unit '{name}'"
                           f"{suggest(name, k.suggestions, _unit_names(ureg))}") from None
    except (pint.errors.PintError, ValueError, TypeError, AttributeError, SyntaxError,
            KeyError, ZeroDivisionError, IndexError):
        raise InvalidInput(field, original, allowed, f"cannot read the unit '{unit}'") from None
    if not _dimension_ok(k, probe, root, ureg):
        raise InvalidInput(field, original, allowed,
                           f"'{unit}' is not {k.described} (it is {_describe(probe, root)})")
    return parsed


def _unit_names(ureg) -> list[str]:
    return [n for n in dir(ureg) if not n.startswith("_")]


def _dimension_ok(k: Kind, probe, root, ureg) -> bool:
    if k.name == "angle":
        return root.units == ureg.radian
    if k.name == "angular_velocity":
        return root.units == ureg.radian / ureg.second
    if k.name == "angular_acceleration":
        return root.units == ureg.radian / ureg.second ** 2
    if k.name == "fraction":
        return root.units == ureg.dimensionless
    return probe.dimensionality == ureg.Quantity(1.0, k.si).dimensionality


def _describe(probe, root) -> str:
    dim = str(probe.dimensionality)
    if dim == "dimensionless":
        return "an angle" if "radian" in str(root.units) else "a plain number"
    if dim == "1 / [time]":
        return "a frequency (give rad/s, deg/s or rpm for an angular speed)" \
            if "radian" not in str(root.units) else "an angular speed"
    return dim


def _to_si(mags: np.ndarray, unit: str, k: Kind, field: str, original: str,
           allowed: str) -> np.ndarray:
    """Convert magnitudes given in ``unit`` ('' for bare) to the kind's SI unit."""
    mags = np.asarray(mags, dtype=float)
    if unit == "":
        if k.name == "angle":
            return np.radians(mags)
        if k.name == "temperature":
            raise InvalidInput(field, original, allowed,
                               "a temperature needs a unit (degC, K or degF)")
        return mags
    if k.name == "angle" and unit in _DEGREE_SPELLINGS:
        return np.radians(mags)
    if k.name == "temperature_difference" and unit in _DIFFERENCE_SCALES:
        # A difference in degC is one in K; pint would read "5 degC" as 278.15 K.
        return mags * _DIFFERENCE_SCALES[unit]
    if k.name == "expansion" and unit == "/K":
        return mags
    if unit in k.identity:
        return mags
    if k.name == "fraction" and unit in ("%", "percent"):
        return mags / 100.0
    if k.name == "temperature" and unit in _CELSIUS + _FAHRENHEIT:
        # the two offset scales, by definition (SI Brochure; NIST SP 811 B.8)
        if unit in _CELSIUS:
            return mags + 273.15
        return (mags - 32.0) * (5.0 / 9.0) + 273.15
    exact = _EXACT.get(k.name, {}).get(" ".join(unit.split()))
    if exact is not None:               # exact by definition: no need to load pint
        mul, div = exact
        return mags * mul / div
    parsed = _parse_unit(unit, k, field, original, allowed)
    ureg = _registry()
    import pint

    try:
        out = np.asarray(ureg.Quantity(mags, parsed).to(k.si).magnitude, dtype=float)
    except (pint.errors.PintError, ValueError, TypeError):
        raise InvalidInput(field, original, allowed,
                           f"cannot convert '{unit}' to {k.si}") from None
    if not np.all(np.isfinite(out)):
        raise InvalidInput(field, original, allowed, "not a finite number after conversion")
    return out


def _check_bounds(values: np.ndarray, field: str, original: str, allowed: str,
                  minimum, maximum, include_min: bool, include_max: bool) -> None:
    if values.size == 0:
        return
    lo, hi = float(values.min()), float(values.max())
    if minimum is not None and (lo < minimum or (not include_min and lo == minimum)):
        raise InvalidInput(field, original, allowed, "out of range")
    if maximum is not None and (hi > maximum or (not include_max and hi == maximum)):
        raise InvalidInput(field, original, allowed, "out of range")


def parse_quantity(text, kind: str, field: str, *, allowed: str | None = None,
                   minimum: float | None = None, maximum: float | None = None,
                   include_min: bool = True, include_max: bool = True) -> float:
    """One quantity string (or a number) -> SI float.

    Parameters
    ----------
    text : str or float
        ``"850 mm"``, ``"30 deg"``, ``"0.5"``; a Python number counts as bare.
    kind : str
        One of :data:`KINDS`.
    field : str
        Name of the input for error messages (``"--length"``, ``"clock.toml: pendulum.length"``).
    allowed : str, optional
        What is allowed, in words; derived from the kind when not given.
    minimum, maximum : float, optional
        SI bounds; ``include_*`` say whether the bound itself is allowed.

    Raises
    ------
    InvalidInput
        Naming ``field``, the text, what was wrong and what is allowed.
    """
    k = _kind(kind)
    allow = _allowed(k, allowed)
    original = text
    if isinstance(text, bool):
        raise InvalidInput(field, text, allow, "not a number")
    if isinstance(text, (int, float)):
        text = repr(float(text))
    if not isinstance(text, str):
        raise InvalidInput(field, original, allow, "not a number or a quantity string")
    mag, unit = split_magnitude(text, field, allow)
    value = _to_si(np.array([mag]), unit, k, field, original, allow)
    _check_bounds(value, field, original, allow, minimum, maximum, include_min, include_max)
    return float(value[0])


def _range(part: str, trailing: str, k: Kind, field: str, allow: str,
           budget: int, limit: int = MAX_VALUES) -> np.ndarray:
    segs = part.split(":")
    if len(segs) != 3:
        raise InvalidInput(field, part, allow,
                           "a range needs three parts, start:stop:step (e.g. '0:90:10')")
    mags, units = [], []
    for seg in segs:
        mag, unit = split_magnitude(seg, field, allow)
        mags.append(mag)
        units.append(unit or trailing)
    start, stop, step = mags
    if units[0] == units[1] == units[2]:
        unit = units[0]
    else:  # mixed units: lay the grid out in SI
        start, stop, step = (float(_to_si(np.array([m]), u, k, field, part, allow)[0])
                             for m, u in zip(mags, units))
        unit = None
    if not step > 0.0:
        raise InvalidInput(field, part, allow, "the range step must be > 0")
    if start > stop:
        raise InvalidInput(field, part, allow, "the range start must not exceed its stop")
    span = (stop - start) / step
    if not math.isfinite(span) or span + 1 > budget:
        raise InvalidInput(field, part, allow, f"the range gives more than {limit} values")
    # The stop belongs to the grid when it lies on it to within rounding of the division.
    count = int(math.floor(span + 1e-9)) + 1
    if count > 1 and abs(span - (count - 1)) <= 1e-9 * span:
        # On the grid: divide the span, so 0:1:0.1 gives 0.3 and not 0.30000000000000004.
        grid = start + (stop - start) * (np.arange(count, dtype=float) / (count - 1))
        grid[-1] = stop
    else:
        grid = start + step * np.arange(count, dtype=float)
    if unit is None:
        return grid
    return _to_si(grid, unit, k, field, part, allow)


def parse_values(text, kind: str, field: str, *, allowed: str | None = None,
                 minimum: float | None = None, maximum: float | None = None,
                 include_min: bool = True, include_max: bool = True,
                 max_values: int = MAX_VALUES) -> list[float]:
    """A value, a comma list or a range (or a mixture) -> list of SI floats, in order.

    ``"10, 20, 30"``, ``"0:90:10"`` (start:stop:step; step > 0, start <= stop, the stop is
    included when it falls on the grid within rounding), ``"0:90:5 deg"``,
    ``"850, 900 mm"``: a unit on the last part applies to the parts without one.
    Bounds and errors as :func:`parse_quantity`.
    """
    k = _kind(kind)
    allow = _allowed(k, allowed)
    if isinstance(text, (int, float)) and not isinstance(text, bool):
        return [parse_quantity(text, kind, field, allowed=allowed, minimum=minimum,
                               maximum=maximum, include_min=include_min,
                               include_max=include_max)]
    if not isinstance(text, str):
        raise InvalidInput(field, text, allow, "not a value list")
    t = _normalise(text)
    if not t:
        raise InvalidInput(field, text, allow, "empty value")
    if len(t) > MAX_LIST_CHARS:
        raise InvalidInput(field, text, allow, f"longer than {MAX_LIST_CHARS} characters")
    parts = [p.strip() for p in t.split(",")]
    if any(not p for p in parts):
        raise InvalidInput(field, text, allow, "empty item in the list")
    _, trailing = split_magnitude(parts[-1].split(":")[-1], field, allow)
    out: list[float] = []
    for part in parts:
        budget = max_values - len(out)
        if ":" in part:
            vals = _range(part, trailing, k, field, allow, budget, max_values)
        else:
            mag, unit = split_magnitude(part, field, allow)
            vals = _to_si(np.array([mag]), unit or trailing, k, field, part, allow)
        _check_bounds(vals, field, part, allow, minimum, maximum, include_min, include_max)
        out.extend(float(v) for v in vals)
        if len(out) > max_values:
            raise InvalidInput(field, text, allow, f"more than {max_values} values")
    return out
