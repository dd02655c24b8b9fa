"""TOML design files: read, validate, convert the quantities to SI once.

A design file describes one swinging part::

    name = "Hall clock"
    revision = "B"
    date = "2026-11-20"
    context = "clock"          # clock, ride, gate, impact, damper, load or general

    [pivot]
    kind = "knife-edge"        # knife-edge, pin (diameter, friction) or torque (torque)

    [suspension]
    kind = "rigid"             # rigid, or chain, rope, cable (length, mass_per_length)

    [arm]
    material = "steel"         # moves the parts' mounting points with temperature

    [[part]]
    name = "rod"
    shape = "rod"              # rod, tube, flat_bar, plate, disc, cylinder, sphere, lens,
    length = "1100 mm"         # point, custom; sizes by shape
    diameter = "6 mm"
    top = "-30 mm"             # where it is: centre, top or bottom, along the arm
    material = "steel"         # or density, or mass

    [[point]]
    name = "bob centre"
    along = "994 mm"

    [swing]
    amplitude = ["1.5 deg", "3 deg"]   # one quantity, a list, or a range "0:90:10 deg"
    target_period = "2 s"              # optional, for tuning

    [environment]
    gravity = "standard"       # or a quantity, or give latitude (and elevation)
    temperature = "20 degC"
    air = true                 # buoyancy, added mass, drag; false for a vacuum

A ``[pendulum]`` section (length, bob_mass, suspension = rigid or flexible) is shorthand
for a point bob on a light suspension, in place of ``[[part]]`` and ``[suspension]``.
Optional sections: ``[impact]`` (drop_angle, rise_angle, strike_radius or strike_point),
``[rating]`` (part, nut_pitch), ``[tolerances]`` ("part.bob.mass" = "0.5 %" and the like:
validated now, used by the tolerance analysis).

Quantities are strings with units (a bare number is SI, an angle in degrees). Every error
names the file, the field path (with its line when it can be found), the value and what
is allowed; unknown fields are errors, with a "did you mean" hint.
"""

from __future__ import annotations

import math
import re
import unicodedata
from dataclasses import dataclass, field
from functools import cached_property
from pathlib import Path

from .body import (MOUNTS, ORIENTATIONS, PIVOT_KINDS, SHAPE_SIZES, SUSPENSION_KINDS, Part,
                   Pivot, Suspension, assemble, point_bob, resolve_part,
                   scaled_for_temperature)
from .compound import GRAVITY_RANGE
from .constants import ISA_SEA_LEVEL_VISCOSITY, STANDARD_GRAVITY
from .errors import MISSING, InvalidInput
from .quantity import parse_quantity, parse_values, suggest

__all__ = ["CONTEXTS", "GRAVITY_ALLOWED", "Design", "Environment", "Impact", "Rating",
           "Tolerance", "load_design", "parse_data", "parse_design", "parse_gravity",
           "point_design"]

#: What the swinging part is for; it selects the safety cautions shown with loads.
CONTEXTS = ("clock", "ride", "gate", "impact", "damper", "load", "general")
_MAX_FILE_BYTES = 1_000_000
_MAX_PARTS = 200
_AMPLITUDE_ALLOWED = ("amplitudes in [0, 180) deg, e.g. '5 deg', [\"30 deg\", \"60 deg\"] "
                      "or '0:90:10 deg'")
_SIZE_KEYS = tuple(sorted({k for v in SHAPE_SIZES.values() for k in v}))
_ORIENT_KEYS = tuple(sorted({spec[0] for spec in ORIENTATIONS.values()}))
_PART_KEYS = ("name", "shape", "material", "density", "mass", "expansion", "centre", "top",
              "bottom", "across", "mount", "inertia", "volume") + _ORIENT_KEYS + _SIZE_KEYS
_SCHEMA = {
    "": ("name", "revision", "date", "context", "pendulum", "pivot", "suspension", "arm",
         "part", "point", "swing", "environment", "impact", "rating", "tolerances"),
    "pendulum": ("length", "bob_mass", "suspension"),
    "pivot": ("kind", "diameter", "friction", "static_friction", "torque"),
    "suspension": ("kind", "length", "mass_per_length", "material", "expansion"),
    "arm": ("material", "expansion"),
    "part": _PART_KEYS,
    "point": ("name", "along", "across"),
    "swing": ("amplitude", "target_period"),
    "environment": ("gravity", "latitude", "elevation", "temperature",
                    "reference_temperature", "pressure", "humidity", "air"),
    "impact": ("drop_angle", "rise_angle", "strike_radius", "strike_point"),
    "rating": ("part", "nut_pitch"),
}
# Kinds of the quantity fields, for parsing and for tolerances on them.
_KIND = {
    "pendulum": {"length": "length", "bob_mass": "mass"},
    "pivot": {"diameter": "length", "friction": "fraction", "static_friction": "fraction",
              "torque": "torque"},
    "suspension": {"length": "length", "mass_per_length": "linear_density",
                   "expansion": "expansion"},
    "part": {**{k: "length" for k in _SIZE_KEYS + ("centre", "top", "bottom", "across")},
             "density": "density", "mass": "mass", "expansion": "expansion",
             "inertia": "inertia", "volume": "volume"},
    "swing": {"amplitude": "angle", "target_period": "time"},
    "environment": {"latitude": "angle", "elevation": "length", "temperature": "temperature",
                    "reference_temperature": "temperature", "pressure": "pressure",
                    "humidity": "fraction", "gravity": "acceleration"},
    "impact": {"drop_angle": "angle", "rise_angle": "angle", "strike_radius": "length"},
    "rating": {"nut_pitch": "length"},
}
# Control characters (ESC, BEL, newlines, ...), and line/paragraph separators, would let a
# name move the cursor or recolour a terminal, or break the one-line reports and CSV comments.
_CONTROL_CATEGORIES = ("Cc", "Zl", "Zp")
_TOML_HINT = 'a TOML design file: key = "value" lines, quantities in quotes (length = "994 mm")'

#: What ``gravity`` may be, in a design file or on the command line.
GRAVITY_ALLOWED = ("'standard' (9.80665 m/s^2) or an acceleration in [0.01, 1000] m/s^2, e.g. "
                   "'9.8123 m/s^2'")
_MAX_TEXT_CHARS = 200
#: Temperature the sizes in a design file are given at, unless it says otherwise.
REFERENCE_TEMPERATURE_K = 293.15
_POSITIVE = dict(minimum=0.0, include_min=False)
_TEN_DEGREES = math.radians(10.0)


def parse_gravity(value, field_name: str) -> tuple[float, str]:
    """(gravity [m/s^2], how it was given): ``None`` or ``"standard"`` is standard gravity."""
    if value is None or (isinstance(value, str) and value.strip().lower() == "standard"):
        return STANDARD_GRAVITY, "standard"
    g = parse_quantity(value, "acceleration", field_name, allowed=GRAVITY_ALLOWED,
                       minimum=GRAVITY_RANGE[0], maximum=GRAVITY_RANGE[1])
    return g, str(value)


@dataclass(frozen=True)
class Environment:
    """Where the pendulum swings: SI values. ``air_density_kg_m3`` is 0 with ``air`` off."""

    gravity_m_s2: float = STANDARD_GRAVITY
    gravity_given: str = "standard"
    latitude_rad: float | None = None
    elevation_m: float = 0.0
    temperature_K: float = REFERENCE_TEMPERATURE_K
    reference_temperature_K: float = REFERENCE_TEMPERATURE_K
    pressure_Pa: float | None = None
    relative_humidity: float = 0.0
    air: bool = False
    air_density_kg_m3: float = 0.0
    air_viscosity_Pa_s: float = ISA_SEA_LEVEL_VISCOSITY

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class Impact:
    """An impact tester's test: drop angle, optional rise angle [rad], strike radius [m]."""

    drop_angle_rad: float
    strike_radius_m: float
    rise_angle_rad: float | None = None
    strike_point: str = ""

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class Rating:
    """The parts moved to regulate a clock (a bob, or a bob with the nut it rests on),
    and the pitch of the rating nut [m]."""

    parts: tuple
    nut_pitch_m: float | None = None

    def to_dict(self) -> dict:
        return {"parts": list(self.parts), "nut_pitch_m": self.nut_pitch_m}


@dataclass(frozen=True)
class Tolerance:
    """A +- band on one input: ``path`` as in the file (``part.bob.mass``); either an
    absolute SI half-width or a relative one (``relative`` True, a fraction)."""

    path: str
    value: float
    relative: bool

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class Design:
    """A validated design: names, the body's parts and suspension, the pivot, named points,
    the working amplitudes, the environment and the optional test, rating and tolerances."""

    name: str
    revision: str
    context: str
    parts: tuple
    suspension: Suspension
    pivot: Pivot
    amplitudes_rad: tuple
    environment: Environment
    points: tuple = ()               # (name, along [m], across [m])
    arm_expansion_per_K: float | None = None
    target_period_s: float | None = None
    impact: Impact | None = None
    rating: Rating | None = None
    tolerances: tuple = ()
    date: str = ""
    source: str = ""
    shorthand: bool = False          # given as a [pendulum] section
    # The parsed TOML it was read from (None when built in code): a tolerance analysis
    # re-reads it with one value changed. Not compared, hashed or shown; do not modify it.
    data: dict | None = field(default=None, repr=False, compare=False)

    @property
    def gravity_m_s2(self) -> float:
        return self.environment.gravity_m_s2

    @cached_property
    def body(self):
        """The assembled body at the working temperature."""
        b = assemble(self.parts, self.suspension, self.arm_expansion_per_K)
        dt = self.environment.temperature_K - self.environment.reference_temperature_K
        return scaled_for_temperature(b, dt) if dt else b

    @cached_property
    def pendulum(self):
        """The body in its environment (:class:`~swingcalc.compound.CompoundPendulum`)."""
        from .compound import compound_pendulum

        env = self.environment
        return compound_pendulum(self.body, env.gravity_m_s2, env.air_density_kg_m3,
                                 env.air_viscosity_Pa_s, self.amplitudes_rad[0])

    def with_changes(self, amplitudes=None, gravity=None, gravity_given: str = "") -> "Design":
        """A copy with other working amplitudes [rad] and/or another gravity [m/s^2]."""
        from dataclasses import replace

        changes = {}
        if amplitudes is not None:
            changes["amplitudes_rad"] = tuple(amplitudes)
        if gravity is not None:
            changes["environment"] = replace(self.environment, gravity_m_s2=gravity,
                                             gravity_given=gravity_given or str(gravity),
                                             latitude_rad=None)
        return replace(self, **changes)

    def points_dict(self) -> dict:
        return {name: (s, u) for name, s, u in self.points}

    def to_dict(self) -> dict:
        return {
            "name": self.name, "revision": self.revision, "date": self.date,
            "context": self.context, "source": self.source,
            "parts": [dict(p.__dict__) for p in self.parts],
            "suspension": dict(self.suspension.__dict__), "pivot": self.pivot.to_dict(),
            "amplitudes_rad": list(self.amplitudes_rad),
            "environment": self.environment.to_dict(),
            "points": [dict(zip(("name", "along_m", "across_m"), p)) for p in self.points],
            "arm_expansion_per_K": self.arm_expansion_per_K,
            "target_period_s": self.target_period_s,
            "impact": self.impact.to_dict() if self.impact else None,
            "rating": self.rating.to_dict() if self.rating else None,
            "tolerances": [t.to_dict() for t in self.tolerances],
        }


class _Reader:
    """Field access on the parsed TOML, with error messages that point into the file.

    A section is named ``"pivot"``, or ``"part#2"`` for the third ``[[part]]`` table; its
    path in messages is ``pivot.kind`` or ``part.bob.diameter`` (by the part's name)."""

    def __init__(self, data: dict, text: str, source: str):
        self.data = data
        self.lines = text.splitlines()
        self.source = source
        self.labels: dict[str, str] = {}

    def _headers(self):
        """(line number, section id) of every table header."""
        counts: dict[str, int] = {}
        for n, line in enumerate(self.lines, start=1):
            m = re.match(r"^\s*(\[\[?)\s*([A-Za-z0-9_.\-]+)\s*\]\]?", line)
            if not m:
                continue
            name = m.group(2)
            if m.group(1) == "[[":
                i = counts.get(name, 0)
                counts[name] = i + 1
                yield n, f"{name}#{i}"
            else:
                yield n, name

    def line_of(self, section: str, key: str) -> int | None:
        pattern = re.compile(rf"^\s*[\"']?{re.escape(key)}[\"']?\s*=") if key else None
        starts = list(self._headers())
        if not section:
            end = starts[0][0] if starts else len(self.lines) + 1
            for n in range(1, end):
                if pattern and pattern.match(self.lines[n - 1]):
                    return n
            # a top-level key given as a [section] or [[section]] header
            return next((n for n, sid in starts if sid in (key, f"{key}#0")), None)
        for i, (n, sid) in enumerate(starts):
            if sid != section:
                continue
            if not key:
                return n
            end = starts[i + 1][0] if i + 1 < len(starts) else len(self.lines) + 1
            for k in range(n + 1, end):
                if pattern.match(self.lines[k - 1]):
                    return k
        return None

    def path(self, section: str, key: str) -> str:
        label = self.labels.get(section, section)
        return f"{label}.{key}" if label and key else (label or key)

    def where(self, section: str, key: str) -> str:
        n = self.line_of(section, key)
        path = self.path(section, key)
        return f"{self.source}, line {n}, {path}" if n else f"{self.source}, {path}"

    def check_known(self, section: str, table: dict, kind: str | None = None) -> None:
        known = _SCHEMA[kind if kind is not None else section]
        for key in table:
            if key not in known:
                what = "section" if isinstance(table[key], dict) else "field"
                place = f"in [{self.path(section, '')}]" if section else "at the top level"
                raise InvalidInput(self.where(section, key), key,
                                   f"{place}: " + ", ".join(known),
                                   f"unknown {what}{suggest(key, known)}")

    def table(self, name: str, required: bool = False) -> dict:
        value = self.data.get(name)
        if value is None:
            if required:
                raise InvalidInput(f"{self.source}, [{name}]", MISSING,
                                   f"a [{name}] section with " + ", ".join(_SCHEMA[name]),
                                   "missing section")
            return {}
        if not isinstance(value, dict):
            raise InvalidInput(self.where("", name), value, f"a [{name}] section",
                               "wrong type: expected a section")
        self.check_known(name, value)
        return value

    def tables(self, name: str) -> list[dict]:
        value = self.data.get(name)
        if value is None:
            return []
        if not (isinstance(value, list) and all(isinstance(v, dict) for v in value)):
            raise InvalidInput(self.where("", name), value,
                               f"[[{name}]] tables, one per {name}",
                               "wrong type: expected [[" + name + "]] tables")
        if len(value) > _MAX_PARTS:
            raise InvalidInput(self.where("", name), len(value),
                               f"at most {_MAX_PARTS} [[{name}]] tables", "too many")
        return value

    def required(self, section: str, table: dict, key: str, allowed: str):
        if key not in table:
            where = self.where(section, "") if section else self.source
            raise InvalidInput(where, MISSING, f"{self.path(section, key)}: {allowed}",
                               f"missing required field '{key}'")
        return table[key]

    def quantity(self, section, table, key, allowed=None, kind=None, default=MISSING,
                 **bounds) -> float | None:
        kind = kind or _KIND[section.split("#")[0]][key]
        if key not in table:
            if default is not MISSING:
                return default
            self.required(section, table, key, allowed or kind)
        value = table[key]
        if isinstance(value, bool) or not isinstance(value, (str, int, float)):
            raise InvalidInput(self.where(section, key), value, allowed or kind,
                               "wrong type: expected a quantity string such as \"994 mm\"")
        return parse_quantity(value, kind, self.where(section, key), allowed=allowed, **bounds)

    def word(self, section, table, key, choices, default=None) -> str:
        if key not in table and default is not None:
            return default
        value = self.required(section, table, key, " or ".join(choices))
        if not isinstance(value, str):
            raise InvalidInput(self.where(section, key), value, " or ".join(choices),
                               "wrong type: expected a word in quotes")
        if value not in choices:
            raise InvalidInput(self.where(section, key), value, " or ".join(choices),
                               f"unknown {key}{suggest(value, choices)}")
        return value

    def flag(self, section, table, key, default: bool) -> bool:
        value = table.get(key, default)
        if not isinstance(value, bool):
            raise InvalidInput(self.where(section, key), value, "true or false",
                               "wrong type: expected true or false (no quotes)")
        return value

    def text(self, section, table, key: str, default: str | None = None) -> str:
        if key not in table and default is not None:
            return default
        value = self.required(section, table, key, "a text in quotes")
        allowed = f"a text in quotes of at most {_MAX_TEXT_CHARS} characters, on one line"
        if not isinstance(value, str):
            raise InvalidInput(self.where(section, key), value, allowed,
                               "wrong type: expected a text in quotes")
        if len(value) > _MAX_TEXT_CHARS:
            raise InvalidInput(self.where(section, key), value, allowed, "too long")
        bad = [c for c in value if unicodedata.category(c) in _CONTROL_CATEGORIES]
        if bad:
            raise InvalidInput(self.where(section, key), value, allowed,
                               f"contains the control character U+{ord(bad[0]):04X}")
        return value

    def exclusive(self, section, table, keys, what: str, required: bool = True):
        """The one of ``keys`` present (or None); two of them is an error."""
        present = [k for k in keys if k in table]
        if len(present) > 1:
            raise InvalidInput(self.where(section, present[1]), table[present[1]],
                               f"one of {', '.join(keys)} for {what}",
                               f"both '{present[0]}' and '{present[1]}' are given")
        if not present:
            if required:
                self.required(section, table, keys[0], f"one of {', '.join(keys)} for {what}")
            return None
        return present[0]


def parse_design(text: str, source: str = "<design>") -> Design:
    """Validate design-file text and return a :class:`Design` with SI floats.

    Parameters
    ----------
    text : str
        The TOML text.
    source : str
        How to name the file in error messages.

    Raises
    ------
    InvalidInput
        On a syntax error, an unknown, missing or wrong-typed field, a value out of range,
        or a body that cannot hang (naming the file and the field).
    """
    import tomllib

    if len(text) > _MAX_FILE_BYTES:
        raise InvalidInput(source, MISSING, "a TOML design file under 1 MB", "too large")
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise _syntax_error(exc, text, source) from None
    return parse_data(data, source, text)


def parse_data(data: dict, source: str = "<design>", text: str = "") -> Design:
    """Validate an already parsed design file (the dict ``tomllib`` gives) and return a
    :class:`Design`; ``text``, when given, lets error messages name line numbers.

    The tolerance analysis uses it to re-read a design with one value changed."""
    r = _Reader(data, text, source)
    r.check_known("", data)
    shorthand = "pendulum" in data
    if shorthand:
        for other, header in (("part", "[[part]]"), ("suspension", "[suspension]")):
            if other in data:
                n = r.line_of("part#0" if other == "part" else other, "")
                raise InvalidInput(f"{source}, line {n}, {header}" if n
                                   else f"{source}, {header}",
                                   MISSING, "either a [pendulum] section (a point bob) or "
                                   "[[part]] tables with a [suspension]",
                                   f"both [pendulum] and {header} are given")
        parts, suspension = _shorthand(r, r.table("pendulum"))
    else:
        suspension = _suspension(r, r.table("suspension"))
        parts = _parts(r, suspension)
    pivot = _pivot(r, r.table("pivot"))
    arm_expansion = _arm(r, r.table("arm"))
    swing = r.table("swing", required=True)
    amplitudes = _amplitudes(r, swing)
    target = r.quantity("swing", swing, "target_period", "a period > 0, e.g. \"2 s\"",
                        default=None, **_POSITIVE)
    env = _environment(r, r.table("environment"))
    points = _points(r, parts)
    context = r.word("", data, "context", CONTEXTS, default="general")
    design = Design(
        name=r.text("", data, "name", Path(source).stem if source else "design"),
        revision=r.text("", data, "revision", ""), date=_date(r, data),
        context=context, parts=parts, suspension=suspension, pivot=pivot,
        amplitudes_rad=tuple(amplitudes), environment=env, points=points,
        arm_expansion_per_K=arm_expansion, target_period_s=target,
        impact=_impact(r, r.table("impact"), points),
        rating=_rating(r, r.table("rating"), parts),
        tolerances=_tolerances(r, data.get("tolerances"), data),
        source=source, shorthand=shorthand, data=data)
    try:
        design.body  # noqa: B018 - assemble now, so a body that cannot hang is a file error
        design.pendulum  # noqa: B018
    except InvalidInput as exc:
        raise exc.renamed(f"{source}, {exc.field}") from None
    return design


def point_design(length: float, mass: float = 1.0, suspension: str = "rigid",
                 amplitudes=(_TEN_DEGREES,), name: str = "pendulum from options"
                 ) -> Design:
    """A design for a point bob of ``mass`` [kg] at ``length`` [m] on a light rigid or
    flexible suspension, in a vacuum at standard gravity (what ``[pendulum]`` gives)."""
    parts, susp = point_bob(length, mass, suspension)
    return Design(name=name, revision="", context="general", parts=parts, suspension=susp,
                  pivot=Pivot(), amplitudes_rad=tuple(amplitudes),
                  environment=Environment(), shorthand=True)


def _date(r: _Reader, data: dict) -> str:
    """The design's date: a TOML date (2026-11-24) or a text, kept as text."""
    import datetime

    value = data.get("date", "")
    if isinstance(value, (datetime.date, datetime.datetime, datetime.time)):
        return value.isoformat()
    return r.text("", data, "date", "")


def load_design(path, source: str | None = None) -> Design:
    """Read and validate a design file (see :func:`parse_design`)."""
    p = Path(path)
    name = source or str(path)
    try:
        if p.stat().st_size > _MAX_FILE_BYTES:
            raise InvalidInput(name, MISSING, "a TOML design file under 1 MB", "too large")
        raw = p.read_bytes()
    except FileNotFoundError:
        raise InvalidInput(name, MISSING, "a readable TOML design file",
                           "no such file") from None
    except IsADirectoryError:
        raise InvalidInput(name, MISSING, "a TOML design file", "is a directory") from None
    except OSError as exc:
        raise InvalidInput(name, MISSING, "a readable TOML design file",
                           f"cannot read it ({exc.strerror or exc})") from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError:
        raise InvalidInput(name, MISSING, "a UTF-8 text file", "not UTF-8 text") from None
    return parse_design(text, name)


def _shorthand(r: _Reader, pend: dict):
    from .pendulum import SUSPENSIONS

    length = r.quantity("pendulum", pend, "length",
                        "a length > 0 from pivot to bob centre, e.g. \"994 mm\"", **_POSITIVE)
    mass = r.quantity("pendulum", pend, "bob_mass", "a mass > 0, e.g. \"1.2 kg\"", **_POSITIVE)
    return point_bob(length, mass, r.word("pendulum", pend, "suspension", SUSPENSIONS))


def _suspension(r: _Reader, t: dict) -> Suspension:
    kind = r.word("suspension", t, "kind", SUSPENSION_KINDS, default="rigid")
    if kind == "rigid":
        for key in ("length", "mass_per_length", "material", "expansion"):
            if key in t:
                raise InvalidInput(r.where("suspension", key), t[key],
                                   "no length or mass per length for a rigid arm (its parts "
                                   "make it up)", f"'{key}' is for a flexible suspension")
        return Suspension("rigid")
    length = r.quantity("suspension", t, "length",
                        "a length > 0 from the pivot to the payload attachment", **_POSITIVE)
    lam = r.quantity("suspension", t, "mass_per_length", "a mass per length >= 0, e.g. "
                     "\"0.9 kg/m\"", default=0.0, minimum=0.0)
    expansion = 0.0
    key = r.exclusive("suspension", t, ("material", "expansion"), "the line's expansion",
                      required=False)
    if key == "material":
        expansion = _material(r, "suspension", t).expansion_per_K
    elif key == "expansion":
        expansion = r.quantity("suspension", t, "expansion", "a coefficient in (-1e-3, 1e-3) "
                               "1/K, e.g. \"12e-6 /K\"", minimum=-1e-3, maximum=1e-3)
    return Suspension(kind, length=length, mass_per_length=lam, expansion=expansion)


def _pivot(r: _Reader, t: dict) -> Pivot:
    kind = r.word("pivot", t, "kind", PIVOT_KINDS, default="knife-edge")
    allowed_by_kind = {"knife-edge": (), "pin": ("diameter", "friction", "static_friction"),
                       "torque": ("torque",)}
    for key in t:
        if key != "kind" and key not in allowed_by_kind[kind]:
            raise InvalidInput(r.where("pivot", key), t[key],
                               f"for a {kind} pivot: " + (", ".join(allowed_by_kind[kind])
                                                          or "only kind"),
                               f"'{key}' does not apply to a {kind} pivot")
    if kind == "pin":
        diameter = r.quantity("pivot", t, "diameter", "a pin diameter > 0, e.g. \"12 mm\"",
                              **_POSITIVE)
        allowed = "a friction coefficient in [0, 2], e.g. 0.15"
        mu = r.quantity("pivot", t, "friction", allowed, minimum=0.0, maximum=2.0)
        mu_s = r.quantity("pivot", t, "static_friction",
                          f"a static coefficient in [friction = {mu:g}, 2]", default=mu,
                          minimum=mu, maximum=2.0)
        return Pivot("pin", pin_radius=0.5 * diameter, friction_coefficient=mu,
                     static_friction_coefficient=mu_s)
    if kind == "torque":
        torque = r.quantity("pivot", t, "torque", "a friction torque >= 0, e.g. \"0.02 N m\"",
                            minimum=0.0)
        return Pivot("torque", friction_torque=torque)
    return Pivot("knife-edge")


def _material(r: _Reader, section: str, t: dict):
    from .materials import material

    value = r.text(section, t, "material")
    try:
        return material(value)
    except InvalidInput as exc:
        raise exc.renamed(r.where(section, "material")) from None


def _arm(r: _Reader, t: dict) -> float | None:
    key = r.exclusive("arm", t, ("material", "expansion"), "the arm's expansion",
                      required=False)
    if key == "material":
        return _material(r, "arm", t).expansion_per_K
    if key == "expansion":
        return r.quantity("arm", t, "expansion", "a coefficient in (-1e-3, 1e-3) 1/K, e.g. "
                          "\"11.5e-6 /K\"", minimum=-1e-3, maximum=1e-3)
    return None


def _parts(r: _Reader, suspension: Suspension) -> tuple:
    tables = r.tables("part")
    if not tables:
        raise InvalidInput(f"{r.source}, [[part]]", MISSING,
                           "[[part]] tables (or a [pendulum] section for a point bob)",
                           "the design has no parts")
    parts, resolved, names = [], [], set()
    for i, t in enumerate(tables):
        sid = f"part#{i}"
        r.labels[sid] = _label("part", t.get("name"), i)
        r.check_known(sid, t, "part")
        name = r.text(sid, t, "name", f"part{i + 1}")
        if not _NAME.fullmatch(name) or name == "suspension":
            raise InvalidInput(r.where(sid, "name"), name,
                               "letters, digits, spaces, '_' and '-', not 'suspension'",
                               "not a usable part name")
        if name in names:
            raise InvalidInput(r.where(sid, "name"), name, "a name no other part has",
                               "two parts share this name")
        names.add(name)
        part = _part(r, sid, t, name)
        try:
            resolved.append(resolve_part(part))
        except InvalidInput as exc:
            raise _part_error(r, sid, t, part, exc) from None
        parts.append(part)
    _check_reach(r, resolved, suspension)
    return tuple(parts)


def _part_error(r: _Reader, sid: str, t: dict, part: Part, exc: InvalidInput) -> InvalidInput:
    """A body-model error about a part, pointed at the file's field and its text."""
    key = exc.field.split(": ", 1)[-1]
    if key == "size":                  # about the part's sizes as a whole: the largest one
        given = {**part.size, "mass": part.mass or 0.0, "across": part.across,
                 part.at: part.position}
        key = max((k for k in given if k in t), key=lambda k: abs(given[k]), default="shape")
    if key not in t and key == "mass" and "density" in t:
        key = "density"
    value = t[key] if key in t else exc.value
    return InvalidInput(r.where(sid, key) if key in t else r.where(sid, ""),
                        value, exc.allowed, exc.problem)


def _check_reach(r: _Reader, resolved, suspension: Suspension) -> None:
    """A flexible suspension must end within the payload (else it hangs slack past it)."""
    if not suspension.flexible:
        return
    lowest = max(p.centre_along_m + 0.5 * p.extent_along_m for p in resolved)
    if suspension.length > lowest * (1.0 + 1e-12):
        raise InvalidInput(r.where("suspension", "length"), r.data["suspension"]["length"],
                           f"a length that ends at the payload, at most {lowest:.6g} m (the "
                           "lowest point of the parts)",
                           "the suspension would hang below every part")


_NAME = re.compile(r"[A-Za-z0-9][A-Za-z0-9 _\-]*")


def _label(kind: str, name, i: int) -> str:
    """How a [[part]] or [[point]] table is named in messages: by its name when that is a
    plain name, else by its place (a name with control characters never reaches a path)."""
    if isinstance(name, str) and len(name) <= _MAX_TEXT_CHARS and _NAME.fullmatch(name):
        return f"{kind}.{name}"
    return f"{kind}[{i + 1}]" if name is not None else f"{kind}.{kind}{i + 1}"


def _part(r: _Reader, sid: str, t: dict, name: str) -> Part:
    shape = r.word(sid, t, "shape", tuple(SHAPE_SIZES))
    sizes_allowed = SHAPE_SIZES[shape]
    spec = ORIENTATIONS.get(shape)
    orient_key = spec[0] if spec else None
    for key in t:
        if key in _SIZE_KEYS and key not in sizes_allowed:
            raise InvalidInput(r.where(sid, key), t[key],
                               f"the sizes of a {shape}: " + (", ".join(sizes_allowed)
                                                              or "none"),
                               f"'{key}' is not a size of a {shape}"
                               f"{suggest(key, sizes_allowed)}")
        if key in _ORIENT_KEYS and key != orient_key:
            raise InvalidInput(r.where(sid, key), t[key],
                               f"for a {shape}: " + (orient_key or "no orientation"),
                               f"a {shape} has no '{key}'")
        if key in ("inertia", "volume") and shape != "custom":
            raise InvalidInput(r.where(sid, key), t[key], "only on a custom part",
                               f"a {shape}'s shape fixes its {key}")
    size = {}
    for key in sizes_allowed:
        optional = key == "inner_diameter" and shape == "sphere"
        if optional and key not in t:
            continue
        size[key] = r.quantity(sid, t, key, "a size >= 0, e.g. \"12 mm\"" if optional
                               else "a size > 0, e.g. \"40 mm\"",
                               **({"minimum": 0.0} if optional else _POSITIVE))
    orientation = None
    if orient_key is not None:
        orientation = r.word(sid, t, orient_key, spec[1], default=spec[2])
    at = r.exclusive(sid, t, ("centre", "top", "bottom"), "the part's place along the arm")
    if shape in ("point", "custom") and at != "centre":
        raise InvalidInput(r.where(sid, at), t[at], "centre (a point has no top or bottom)",
                           f"a {shape} part is placed by its centre")
    position = r.quantity(sid, t, at, "a position along the arm, e.g. \"994 mm\" (negative "
                          "above the pivot)")
    across = r.quantity(sid, t, "across", "an offset across the arm, e.g. \"0 mm\"",
                        default=0.0)
    mount = r.word(sid, t, "mount", MOUNTS, default=at)
    density, expansion, material_name = None, 0.0, ""
    if shape in ("point", "custom"):
        # the mass is given; a density or material may say what volume it displaces
        r.exclusive(sid, t, ("density", "material", "volume"), "the displaced volume",
                    required=False)
        how = "mass" if "mass" in t else None
    else:
        how = r.exclusive(sid, t, ("mass", "density", "material"), "the part's mass",
                          required=False)
    if "material" in t:
        mat = _material(r, sid, t)
        density, expansion, material_name = mat.density_kg_m3, mat.expansion_per_K, mat.name
    if "density" in t:
        density = r.quantity(sid, t, "density", "a density > 0, e.g. \"8.4 g/cm^3\"",
                             **_POSITIVE)
    mass = None
    if how == "mass":
        mass = r.quantity(sid, t, "mass", "a mass > 0, e.g. \"1.2 kg\"", **_POSITIVE)
    elif shape in ("point", "custom"):      # a density alone gives a point no mass
        r.required(sid, t, "mass", "a mass > 0, e.g. \"1.2 kg\"")
    elif how is None:
        r.required(sid, t, "material", "a material, a density or a mass")
    if "expansion" in t:
        expansion = r.quantity(sid, t, "expansion", "a coefficient in (-1e-3, 1e-3) 1/K, "
                               "e.g. \"19e-6 /K\"", minimum=-1e-3, maximum=1e-3)
    inertia = volume = None
    if shape == "custom":
        inertia = r.quantity(sid, t, "inertia", "its own inertia about its centre of mass "
                             ">= 0, e.g. \"0.12 kg m^2\"", minimum=0.0)
        volume = r.quantity(sid, t, "volume", "a displaced volume >= 0, e.g. \"0.5 L\"",
                            default=None, minimum=0.0)
    return Part(name=name, shape=shape, position=position, size=size, at=at,
                orientation=orientation, across=across, mass=mass, density=density,
                expansion=expansion, inertia=inertia, volume=volume, mount=mount,
                material=material_name)


def _points(r: _Reader, parts) -> tuple:
    out, names = [], set()
    for i, t in enumerate(r.tables("point")):
        sid = f"point#{i}"
        r.labels[sid] = _label("point", t.get("name"), i)
        r.check_known(sid, t, "point")
        name = r.text(sid, t, "name")
        if not _NAME.fullmatch(name):
            raise InvalidInput(r.where(sid, "name"), name,
                               "letters, digits, spaces, '_' and '-'", "not a usable name")
        if name in names:
            raise InvalidInput(r.where(sid, "name"), name, "a name no other point has",
                               "two points share this name")
        names.add(name)
        along = r.quantity(sid, t, "along", "a position along the arm, e.g. \"2.1 m\"",
                           kind="length")
        across = r.quantity(sid, t, "across", "an offset across the arm, e.g. \"0 m\"",
                            kind="length", default=0.0)
        out.append((name, along, across))
    return tuple(out)


def _amplitudes(r: _Reader, swing: dict) -> list[float]:
    where = r.where("swing", "amplitude")
    value = r.required("swing", swing, "amplitude", _AMPLITUDE_ALLOWED)
    bounds = dict(minimum=0.0, maximum=math.pi, include_max=False, allowed=_AMPLITUDE_ALLOWED)
    if isinstance(value, list):
        if not value:
            raise InvalidInput(where, value, _AMPLITUDE_ALLOWED, "empty list")
        if len(value) > 1000:
            raise InvalidInput(where, len(value), _AMPLITUDE_ALLOWED, "more than 1000 values")
        out = []
        for item in value:
            if isinstance(item, bool) or not isinstance(item, (str, int, float)):
                raise InvalidInput(where, item, _AMPLITUDE_ALLOWED,
                                   "wrong type: expected angle strings such as \"30 deg\"")
            out.append(parse_quantity(item, "angle", where, **bounds))
        return out
    if isinstance(value, bool) or not isinstance(value, (str, int, float)):
        raise InvalidInput(where, value, _AMPLITUDE_ALLOWED,
                           "wrong type: expected an angle string such as \"30 deg\"")
    return parse_values(value, "angle", where, max_values=1000, **bounds)


def _environment(r: _Reader, t: dict) -> Environment:
    s = "environment"
    if "gravity" in t and "latitude" in t:
        raise InvalidInput(r.where(s, "latitude"), t["latitude"],
                           "either gravity or a latitude (with an elevation) for WGS 84 "
                           "normal gravity", "both gravity and latitude are given")
    elevation = r.quantity(s, t, "elevation", "an elevation in [-500 m, 20 km]",
                           default=0.0, minimum=-500.0, maximum=20_000.0)
    latitude = None
    if "latitude" in t:
        latitude = r.quantity(s, t, "latitude", "a latitude in [-90, 90] deg",
                              minimum=-0.5 * math.pi, maximum=0.5 * math.pi)
        from .environment import normal_gravity

        g = normal_gravity(latitude, elevation)
        given = (f"WGS 84 normal gravity at {math.degrees(latitude):.6g} deg latitude, "
                 f"{elevation:.6g} m")
    else:
        value = t.get("gravity", "standard")
        where = r.where(s, "gravity")
        if isinstance(value, bool) or not isinstance(value, (str, int, float)):
            raise InvalidInput(where, value, GRAVITY_ALLOWED,
                               "wrong type: expected \"standard\" or a quantity such as "
                               "\"9.81 m/s^2\"")
        g, given = parse_gravity(value, where)
    temp_allowed = "a temperature in [-60, 80] degC, e.g. \"20 degC\""
    bounds = dict(minimum=213.15, maximum=353.15)
    temperature = r.quantity(s, t, "temperature", temp_allowed,
                             default=REFERENCE_TEMPERATURE_K, **bounds)
    reference = r.quantity(s, t, "reference_temperature", temp_allowed,
                           default=REFERENCE_TEMPERATURE_K, **bounds)
    humidity = r.quantity(s, t, "humidity", "a relative humidity in [0, 100] %, e.g. "
                          "\"45 %\" (a bare number is a fraction: 0.45)",
                          default=0.0, minimum=0.0, maximum=1.0)
    pressure = r.quantity(s, t, "pressure", "an air pressure in [10, 120] kPa",
                          default=None, minimum=10e3, maximum=120e3)
    air = r.flag(s, t, "air", default=True)
    from .environment import air_viscosity

    density = 0.0
    if air:
        from .environment import air_density, isa_pressure

        p = pressure if pressure is not None else isa_pressure(elevation)
        density = air_density(temperature, p, humidity)
        pressure = p
    return Environment(air_viscosity_Pa_s=air_viscosity(temperature),gravity_m_s2=g, gravity_given=given, latitude_rad=latitude,
                       elevation_m=elevation, temperature_K=temperature,
                       reference_temperature_K=reference, pressure_Pa=pressure,
                       relative_humidity=humidity, air=air, air_density_kg_m3=density)


def _impact(r: _Reader, t: dict, points) -> Impact | None:
    if not t:
        return None
    s = "impact"
    allowed = "an angle in (0, 180] deg from the hanging position"
    drop = r.quantity(s, t, "drop_angle", allowed, minimum=0.0, include_min=False,
                      maximum=math.pi)
    rise = r.quantity(s, t, "rise_angle", "an angle in [0, drop_angle] deg", default=None,
                      minimum=0.0, maximum=drop)
    key = r.exclusive(s, t, ("strike_radius", "strike_point"), "the centre of strike")
    if key == "strike_point":
        name = r.text(s, t, "strike_point")
        known = {p[0]: p for p in points}
        if name not in known:
            raise InvalidInput(r.where(s, "strike_point"), name,
                               "the name of a [[point]]: " + (", ".join(known) or "none given"),
                               f"no such point{suggest(name, known)}")
        _, along, across = known[name]
        return Impact(drop, math.hypot(along, across), rise, name)
    radius = r.quantity(s, t, "strike_radius", "a radius > 0 from the pivot", **_POSITIVE)
    return Impact(drop, radius, rise)


def _rating(r: _Reader, t: dict, parts) -> Rating | None:
    if not t:
        return None
    names = [p.name for p in parts]
    value = r.required("rating", t, "part", "a part name, or a list of the parts the nut "
                       "moves together")
    given = value if isinstance(value, list) else [value]
    if not given or not all(isinstance(v, str) for v in given):
        raise InvalidInput(r.where("rating", "part"), value,
                           "a part name in quotes, or a list of them: [\"bob\", \"nut\"]",
                           "wrong type")
    for name in given:
        if name not in names:
            raise InvalidInput(r.where("rating", "part"), name, "the name of a part: "
                               + ", ".join(names), f"no such part{suggest(name, names)}")
    if len(set(given)) != len(given):
        raise InvalidInput(r.where("rating", "part"), value, "different part names",
                           "a part is named twice")
    pitch = r.quantity("rating", t, "nut_pitch", "a thread pitch > 0, e.g. \"1 mm\"",
                       default=None, **_POSITIVE)
    return Rating(tuple(given), pitch)


def _tolerances(r: _Reader, t, data: dict) -> tuple:
    if t is None:
        return ()
    if not isinstance(t, dict):
        raise InvalidInput(r.where("", "tolerances"), t, "a [tolerances] section",
                           "wrong type: expected a section")
    out = []
    allowed_paths = _tolerance_paths(data)
    for path, value in _flatten(t):
        where = r.where("tolerances", path)
        if r.line_of("tolerances", path) is None and "." in path:
            n = r.line_of("tolerances", path.split(".")[0])
            where = (f"{r.source}, line {n}, tolerances.{path}" if n
                     else f"{r.source}, tolerances.{path}")
        if path not in allowed_paths:
            raise InvalidInput(where, path, "the path of a quantity in this file, e.g. "
                               "\"part.bob.mass\", \"environment.temperature\"",
                               f"no such quantity{suggest(path, allowed_paths)}")
        kind = allowed_paths[path]
        if kind == "temperature":
            kind = "temperature_difference"
        allowed = (f"a +- half-width >= 0 as {kind.replace('_', ' ')} with its unit, or a "
                   "percentage, in quotes: \"0.5 mm\", \"1 %\"")
        if not isinstance(value, str):
            raise InvalidInput(where, value, allowed,
                               "wrong type: expected a quantity string with a unit")
        text = value.strip().lstrip("±").strip()
        if text.startswith("+-") or text.startswith("+/-"):
            text = text.split("-", 1)[1].strip()
        from .quantity import split_magnitude

        if not split_magnitude(text, where, allowed)[1]:
            raise InvalidInput(where, value, allowed,
                               "a bare number is ambiguous here: give its unit or a %")
        if text.endswith("%") or text.endswith("ppm"):
            v = parse_quantity(text, "fraction", where, allowed=allowed, minimum=0.0,
                               maximum=1.0)
            out.append(Tolerance(path, v, True))
        else:
            v = parse_quantity(text, kind, where, allowed=allowed, minimum=0.0)
            out.append(Tolerance(path, v, False))
    return tuple(out)


def _flatten(table: dict, prefix: str = ""):
    """(dotted path, value) pairs: `part.bob.mass = ...` written without quotes is the
    same TOML as the quoted path, as nested tables."""
    for key, value in table.items():
        path = f"{prefix}{key}"
        if isinstance(value, dict):
            yield from _flatten(value, path + ".")
        else:
            yield path, value


def _tolerance_paths(data: dict) -> dict:
    """Every quantity path a tolerance may name, with its kind."""
    paths = {}
    for section in ("pendulum", "pivot", "suspension", "swing", "environment", "impact",
                    "rating"):
        table = data.get(section)
        if isinstance(table, dict):
            for key in table:
                kind = _KIND.get(section, {}).get(key)
                if kind:
                    paths[f"{section}.{key}"] = kind
    for key in ("temperature", "gravity", "pressure", "humidity"):
        paths.setdefault(f"environment.{key}", _KIND["environment"][key])
    parts = data.get("part") if isinstance(data.get("part"), list) else []
    for i, t in enumerate(parts):
        if not isinstance(t, dict):
            continue
        name = t.get("name", f"part{i + 1}")
        for key in t:
            kind = _KIND["part"].get(key)
            if kind:
                paths[f"part.{name}.{key}"] = kind
        if "material" in t and "density" not in t:
            paths[f"part.{name}.density"] = "density"
    return paths


def _syntax_error(exc, text: str, source: str) -> InvalidInput:
    msg = str(exc)
    m = re.search(r"\(at line (\d+), column (\d+)\)", msg)
    problem = re.sub(r"\s*\(at line \d+, column \d+\)", "", msg) or "invalid TOML"
    problem = problem[0].lower() + problem[1:]
    field_name = source
    shown = MISSING
    if m:
        n = int(m.group(1))
        field_name = f"{source}, line {n}"
        lines = text.splitlines()
        line = lines[n - 1].strip() if 1 <= n <= len(lines) else ""
        if line:
            shown = line
            if re.search(r"=\s*[-+]?[\d.]+(?:[eE][-+]?\d+)?\s+[^\s#]", line):
                problem += "; put a quantity with a unit in quotes"
    return InvalidInput(field_name, shown, _TOML_HINT, f"TOML syntax error: {problem}")
