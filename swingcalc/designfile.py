"""TOML design files: read, validate, convert the quantities to SI once.

A design file describes one swinging part. This first form is a simple pendulum (a point
bob on a light suspension)::

    name = "Bench regulator"
    revision = "B"
    context = "clock"          # clock, ride, gate, impact, damper, load or general

    [pendulum]
    length = "994 mm"          # pivot to bob centre
    bob_mass = "1.2 kg"
    suspension = "rigid"       # rigid or flexible

    [swing]
    amplitude = ["1.5 deg", "3 deg"]   # one quantity, a list, or a range "0:90:10 deg"

    [environment]
    gravity = "standard"       # or a quantity, "9.8123 m/s^2"

Quantities are strings with units (a bare number is SI, an angle in degrees). Every
error names the file, the field path (with its line when it can be found), the value and
what is allowed; unknown fields are errors, with a "did you mean" hint. Later forms
(compound bodies) add sections; the :class:`Design` keeps the body in its own object.
"""

from __future__ import annotations

import math
import re
import unicodedata
from dataclasses import asdict, dataclass, field
from pathlib import Path

from .constants import STANDARD_GRAVITY
from .errors import MISSING, InvalidInput
from .pendulum import SUSPENSIONS
from .quantity import parse_quantity, parse_values, suggest

__all__ = ["CONTEXTS", "GRAVITY_ALLOWED", "SimpleBody", "Design", "load_design", "parse_design",
           "parse_gravity"]

#: What the swinging part is for; it selects the safety cautions shown with loads.
CONTEXTS = ("clock", "ride", "gate", "impact", "damper", "load", "general")
_MAX_FILE_BYTES = 1_000_000
_AMPLITUDE_ALLOWED = ("amplitudes in [0, 180) deg, e.g. '5 deg', [\"30 deg\", \"60 deg\"] "
                      "or '0:90:10 deg'")
_SCHEMA = {
    "": ("name", "revision", "context", "pendulum", "swing", "environment"),
    "pendulum": ("length", "bob_mass", "suspension"),
    "swing": ("amplitude",),
    "environment": ("gravity",),
}
# Control characters (ESC, BEL, newlines, ...), and line/paragraph separators, would let a
# name move the cursor or recolour a terminal, or break the one-line reports and CSV comments.
_CONTROL_CATEGORIES = ("Cc", "Zl", "Zp")
_TOML_HINT = 'a TOML design file: key = "value" lines, quantities in quotes (length = "994 mm")'

#: What ``gravity`` may be, in a design file or on the command line.
GRAVITY_ALLOWED = "'standard' (9.80665 m/s^2) or an acceleration > 0, e.g. '9.8123 m/s^2'"
_MAX_TEXT_CHARS = 200


def parse_gravity(value, field_name: str) -> tuple[float, str]:
    """(gravity [m/s^2], how it was given): ``None`` or ``"standard"`` is standard gravity."""
    if value is None or (isinstance(value, str) and value.strip().lower() == "standard"):
        return STANDARD_GRAVITY, "standard"
    g = parse_quantity(value, "acceleration", field_name, allowed=GRAVITY_ALLOWED,
                       minimum=0.0, include_min=False)
    return g, str(value)


@dataclass(frozen=True)
class SimpleBody:
    """A point bob on a light suspension. SI values."""

    length_m: float
    bob_mass_kg: float
    suspension: str
    kind: str = field(default="simple")


@dataclass(frozen=True)
class Design:
    """A validated design: names, the body, the working amplitudes and the environment."""

    name: str
    revision: str
    context: str
    body: SimpleBody
    amplitudes_rad: tuple
    gravity_m_s2: float
    gravity_given: str = "standard"
    source: str = ""

    def to_dict(self) -> dict:
        d = asdict(self)
        d["amplitudes_rad"] = list(self.amplitudes_rad)
        return d


class _Reader:
    """Field access on the parsed TOML, with error messages that point into the file."""

    def __init__(self, data: dict, text: str, source: str):
        self.data = data
        self.lines = text.splitlines()
        self.source = source

    def line_of(self, section: str, key: str) -> int | None:
        current = ""
        pattern = re.compile(rf"^\s*\"?{re.escape(key)}\"?\s*=")
        for n, line in enumerate(self.lines, start=1):
            head = re.match(r"^\s*\[\s*([A-Za-z0-9_.\-]+)\s*\]", line)
            if head:
                current = head.group(1)
                if current == section and not key:
                    return n
                continue
            if current == section and key and pattern.match(line):
                return n
        return None

    def where(self, section: str, key: str) -> str:
        path = f"{section}.{key}" if section and key else (section or key)
        n = self.line_of(section, key)
        return f"{self.source}, line {n}, {path}" if n else f"{self.source}, {path}"

    def check_known(self, section: str, table: dict) -> None:
        known = _SCHEMA[section]
        for key in table:
            if key not in known:
                kind = "section" if isinstance(table[key], dict) else "field"
                place = f"in [{section}]" if section else "at the top level"
                raise InvalidInput(self.where(section, key), key,
                                   f"{place}: " + ", ".join(known),
                                   f"unknown {kind}{suggest(key, known)}")

    def table(self, name: str, required: bool) -> dict:
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

    def required(self, section: str, table: dict, key: str, allowed: str):
        if key not in table:
            raise InvalidInput(self.where(section, "") if section else self.source, MISSING,
                               f"{section}.{key}: {allowed}", f"missing required field '{key}'")
        return table[key]

    def quantity(self, section, table, key, kind, allowed, **bounds) -> float:
        value = self.required(section, table, key, allowed)
        if isinstance(value, bool) or not isinstance(value, (str, int, float)):
            raise InvalidInput(self.where(section, key), value, allowed,
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

    def text(self, key: str, default: str) -> str:
        value = self.data.get(key, default)
        allowed = f"a text in quotes of at most {_MAX_TEXT_CHARS} characters, on one line"
        if not isinstance(value, str):
            raise InvalidInput(self.where("", key), value, allowed,
                               "wrong type: expected a text in quotes")
        if len(value) > _MAX_TEXT_CHARS:
            raise InvalidInput(self.where("", key), value, allowed, "too long")
        bad = [c for c in value if unicodedata.category(c) in _CONTROL_CATEGORIES]
        if bad:
            raise InvalidInput(self.where("", key), value, allowed,
                               f"contains the control character U+{ord(bad[0]):04X}")
        return value


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
        On a syntax error, an unknown, missing or wrong-typed field, or a value out of range.
    """
    import tomllib

    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise _syntax_error(exc, text, source) from None
    r = _Reader(data, text, source)
    r.check_known("", data)
    pend = r.table("pendulum", required=True)
    swing = r.table("swing", required=True)
    env = r.table("environment", required=False)

    length = r.quantity("pendulum", pend, "length", "length",
                        "a length > 0 from pivot to bob centre, e.g. \"994 mm\"",
                        minimum=0.0, include_min=False)
    mass = r.quantity("pendulum", pend, "bob_mass", "mass", "a mass > 0, e.g. \"1.2 kg\"",
                      minimum=0.0, include_min=False)
    suspension = r.word("pendulum", pend, "suspension", SUSPENSIONS)
    amplitudes = _amplitudes(r, swing)
    gravity, given = _gravity(r, env)
    context = r.word("", data, "context", CONTEXTS, default="general")
    name = r.text("name", Path(source).stem if source else "design")
    revision = r.text("revision", "")
    return Design(name=name, revision=revision, context=context,
                  body=SimpleBody(length_m=length, bob_mass_kg=mass, suspension=suspension),
                  amplitudes_rad=tuple(amplitudes), gravity_m_s2=gravity,
                  gravity_given=given, source=source)


def load_design(path, source: str | None = None) -> Design:
    """Read and validate a design file (see :func:`parse_design`)."""
    p = Path(path)
    name = source or str(path)
    try:
        if p.stat().st_size > _MAX_FILE_BYTES:
            raise InvalidInput("design file", name, "a TOML design file under 1 MB", "too large")
        raw = p.read_bytes()
    except FileNotFoundError:
        raise InvalidInput("design file", name, "a readable TOML design file",
                           "no such file") from None
    except IsADirectoryError:
        raise InvalidInput("design file", name, "a TOML design file", "is a directory") from None
    except OSError as exc:
        raise InvalidInput("design file", name, "a readable TOML design file",
                           f"cannot read it ({exc.strerror or exc})") from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError:
        raise InvalidInput("design file", name, "a UTF-8 text file", "not UTF-8 text") from None
    return parse_design(text, name)


def _amplitudes(r: _Reader, swing: dict) -> list[float]:
    where = r.where("swing", "amplitude")
    value = r.required("swing", swing, "amplitude", _AMPLITUDE_ALLOWED)
    bounds = dict(minimum=0.0, maximum=math.pi, include_max=False, allowed=_AMPLITUDE_ALLOWED)
    if isinstance(value, list):
        if not value:
            raise InvalidInput(where, value, _AMPLITUDE_ALLOWED, "empty list")
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


def _gravity(r: _Reader, env: dict) -> tuple[float, str]:
    value = env.get("gravity", "standard")
    where = r.where("environment", "gravity")
    if isinstance(value, bool) or not isinstance(value, (str, int, float)):
        raise InvalidInput(where, value, GRAVITY_ALLOWED,
                           "wrong type: expected \"standard\" or a quantity such as "
                           "\"9.81 m/s^2\"")
    return parse_gravity(value, where)


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
