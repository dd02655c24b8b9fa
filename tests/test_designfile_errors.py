"""Malformed design files, table-driven: each case edits one small valid parts-based design
and checks the one-line error it must give.

What every message must carry (PRODUCT.md "Interface conventions" and RULES.md "Bad input
never produces a traceback: one clear line ... naming the input, what was wrong and what
is allowed"; the design-file module states the same contract): it is ONE line with no
control characters, it starts with the file name, it names the field path
(``part.bob.diameter``, ``pivot.friction``), it gives ``line N`` where the TOML parser or
a look at the file can tell it (the N here is found by searching the edited text in this
file, not by the code under test), it shows the offending value as given, it says what
is allowed, and an unknown word gets a "did you mean" hint when a close one exists.

These are input-validation checks: the "expected" side is the schema and the bounds the
product documents (swingcalc/designfile.py docstring, PRODUCT.md), not a computed value.
Where a case that should be refused is accepted, or its message is wrong or unhelpful,
the case is marked xfail(strict=True) with the reason, so a fix turns it into a pass.
"""

from __future__ import annotations

import re
import unicodedata
from dataclasses import dataclass, field

import pytest

from swingcalc.designfile import load_design, parse_design
from swingcalc.errors import InvalidInput

FILE = "regulator.toml"

# A small valid parts-based design: a steel rod, a brass lens bob on it, a point weight,
# a pin pivot with friction, a named point, an [impact] test using that point, a
# [rating] part and [tolerances]. Every case below edits this text.
BASE = '''\
name = "Test regulator"
revision = "A"
date = "2026-01-05"
context = "clock"

[pivot]
kind = "pin"
diameter = "4 mm"
friction = 0.1
static_friction = 0.15

[suspension]
kind = "rigid"

[arm]
material = "steel"

[[part]]
name = "rod"
shape = "rod"
length = "1000 mm"
diameter = "6 mm"
top = "0 mm"
material = "steel"

[[part]]
name = "bob"
shape = "lens"
axis = "pivot"
diameter = "150 mm"
thickness = "30 mm"
centre = "950 mm"
mount = "bottom"
material = "brass"

[[part]]
name = "weight"
shape = "point"
centre = "500 mm"
mass = "0.1 kg"

[[point]]
name = "striker"
along = "960 mm"

[swing]
amplitude = ["2 deg", "4 deg"]
target_period = "2 s"

[environment]
temperature = "20 degC"
humidity = "40 %"

[impact]
drop_angle = "30 deg"
rise_angle = "20 deg"
strike_point = "striker"

[rating]
part = "bob"
nut_pitch = "0.75 mm"

[tolerances]
"part.bob.centre" = "0.2 mm"
"part.bob.density" = "1 %"
"environment.temperature" = "5 K"
'''

# A [pendulum] shorthand design, for the cases about that section.
SHORT = '''\
name = "Shop regulator"
context = "clock"

[pendulum]
length = "994 mm"
bob_mass = "1.2 kg"
suspension = "rigid"

[swing]
amplitude = "2 deg"
'''

PARTS_BLOCK = BASE[BASE.index("[[part]]"):BASE.index("[[point]]")]
RATING_BLOCK = '[rating]\npart = "bob"\nnut_pitch = "0.75 mm"\n'
BOB_TOLERANCES = '"part.bob.centre" = "0.2 mm"\n"part.bob.density" = "1 %"\n'
PIVOT_BODY = 'kind = "pin"\ndiameter = "4 mm"\nfriction = 0.1\nstatic_friction = 0.15'
ENV = 'temperature = "20 degC"'
NO_PARTS = ((PARTS_BLOCK, ""), (RATING_BLOCK, ""), (BOB_TOLERANCES, ""))
PENDULUM = '[pendulum]\nlength = "1 m"\nbob_mass = "1 kg"\nsuspension = "rigid"\n\n'
EXTRA_POINTS = "".join(f'[[part]]\nname = "w{i}"\nshape = "point"\ncentre = "{500 + i} mm"\n'
                       f'mass = "0.01 kg"\n\n' for i in range(198))   # 3 + 198 = 201 parts


def edited(edits, base: str = BASE) -> str:
    """``base`` with each (old, new) replacement made; each old text must occur once."""
    text = base
    for old, new in edits:
        assert text.count(old) == 1, f"edit target not unique or absent: {old!r}"
        assert old != new
        text = text.replace(old, new)
    return text


def line_number(text: str, at) -> int:
    """1-based number of the line of ``text`` equal (stripped) to ``at``; ``(at, k)``
    means its k-th occurrence. Found here, independently of the code under test."""
    marker, k = at if isinstance(at, tuple) else (at, None)
    hits = [n for n, line in enumerate(text.splitlines(), 1) if line.strip() == marker]
    if k is None:
        assert len(hits) == 1, f"line marker not unique: {marker!r} {hits}"
        return hits[0]
    return hits[k - 1]


_NOT_GIVEN = object()


@dataclass
class Case:
    id: str
    edits: tuple
    path: str                  # the field path the message must name ("" for syntax errors)
    allowed: str               # a phrase of the "allowed:" part
    at: object = None          # line marker (see line_number); None: no line is checked
    got: object = _NOT_GIVEN   # the value as shown after "(got "; None: no value shown
    hint: str | None = None    # "did you mean '<hint>'"
    words: tuple = ()
    bug: str | None = None     # xfail reason: a bug found, see the module docstring
    base: str = BASE
    text: str = field(init=False)
    line: int | None = field(init=False)

    def __post_init__(self):
        # Built at import time: a broken edit or marker is an error here, so it can never
        # hide behind an xfail.
        self.text = edited(self.edits, self.base)
        self.line = None if self.at is None else (
            self.at if isinstance(self.at, int) else line_number(self.text, self.at))


def C(id, edits, path, allowed, **kw):
    return Case(id, tuple(edits), path, allowed, **kw)


CASES = [
    # ------------------------------------------------------------ TOML syntax
    C("syntax-unquoted-quantity", [('length = "1000 mm"', "length = 1000 mm")], "",
      "quantities in quotes", at="length = 1000 mm", got="'length = 1000 mm'",
      words=("TOML syntax error", "put a quantity with a unit in quotes")),
    C("syntax-unclosed-table-header", [("[[point]]", "[[point]")], "", "TOML design file",
      at="[[point]", got="'[[point]'", words=("TOML syntax error",)),
    C("syntax-duplicate-key", [('thickness = "30 mm"',
                                'thickness = "30 mm"\nthickness = "31 mm"')], "",
      "TOML design file", at='thickness = "31 mm"', got="'thickness = \"31 mm\"'",
      words=("TOML syntax error",)),
    C("syntax-section-declared-twice", [("[rating]", "[swing]\n[rating]")], "",
      "TOML design file", at=("[swing]", 2), got="'[swing]'", words=("TOML syntax error",)),
    C("syntax-unterminated-string", [('mount = "bottom"', 'mount = "bottom')], "",
      "TOML design file", at='mount = "bottom', words=("TOML syntax error",)),
    C("syntax-decimal-comma", [("friction = 0.1\n", "friction = 0,1\n")], "",
      "TOML design file", at="friction = 0,1", got="'friction = 0,1'",
      words=("TOML syntax error",)),
    C("syntax-key-without-value", [('mount = "bottom"', "mount")], "", "TOML design file",
      at="mount", got="'mount'", words=("TOML syntax error",)),

    # ------------------------------------------------------------ wrong types
    C("type-number-for-name", [('name = "Test regulator"', "name = 12")], "name",
      "a text in quotes", at="name = 12", got="12", words=("wrong type",)),
    C("type-number-for-part-name", [('name = "bob"', "name = 7")], "part[2].name",
      "a text in quotes", at="name = 7", got="7", words=("wrong type",)),
    C("type-number-for-shape", [('shape = "lens"', "shape = 3")], "part.bob.shape",
      "rod or tube", at="shape = 3", got="3", words=("wrong type",)),
    C("type-number-for-material", [('material = "brass"', "material = 5")],
      "part.bob.material", "a text in quotes", at="material = 5", got="5",
      words=("wrong type",)),
    C("type-number-for-context", [('context = "clock"', "context = 1")], "context",
      "clock or ride", at="context = 1", got="1", words=("wrong type",)),
    C("type-text-for-bool", [(ENV, ENV + '\nair = "yes"')], "environment.air",
      "true or false", at='air = "yes"', got="'yes'", words=("wrong type",)),
    C("type-number-for-bool", [(ENV, ENV + "\nair = 0")], "environment.air",
      "true or false", at="air = 0", got="0", words=("wrong type",)),
    C("type-table-for-quantity", [('centre = "950 mm"', 'centre = { value = "950 mm" }')],
      "part.bob.centre", "a position along the arm", at='centre = { value = "950 mm" }',
      got="{'value': '950 mm'}", words=("wrong type",)),
    C("type-table-for-friction", [("friction = 0.1\n", "friction = { mu = 0.1 }\n")],
      "pivot.friction", "a friction coefficient in [0, 2]", at="friction = { mu = 0.1 }",
      got="{'mu': 0.1}", words=("wrong type",)),
    C("type-list-for-size", [('thickness = "30 mm"', 'thickness = ["30 mm"]')],
      "part.bob.thickness", "a size > 0", at='thickness = ["30 mm"]', got="['30 mm']",
      words=("wrong type",)),
    C("type-bool-for-quantity", [('diameter = "4 mm"', "diameter = true")],
      "pivot.diameter", "a pin diameter > 0", at="diameter = true", got="True",
      words=("wrong type",)),
    C("type-bool-for-point-offset", [('along = "960 mm"', 'along = "960 mm"\nacross = false')],
      "point.striker.across", "an offset across the arm", at="across = false", got="False",
      words=("wrong type",)),
    C("type-bool-for-amplitude", [('amplitude = ["2 deg", "4 deg"]', "amplitude = true")],
      "swing.amplitude", "amplitudes in [0, 180) deg", at="amplitude = true", got="True",
      words=("wrong type",)),
    C("type-number-for-date", [('date = "2026-01-05"', "date = 20260105")], "date",
      "a text in quotes", at="date = 20260105", got="20260105", words=("wrong type",)),
    C("type-value-for-section", [('name = "Test regulator"',
                                  'name = "Test regulator"\npivot = "pin"'),
                                 ("[pivot]\n" + PIVOT_BODY + "\n", "")], "pivot",
      "a [pivot] section", at='pivot = "pin"', got="'pin'", words=("wrong type",)),
    C("type-array-of-tables-for-section", [("[swing]", "[[swing]]")], "swing",
      "a [swing] section", at="[[swing]]", words=("expected a section",)),
    C("type-text-for-part-tables", [('context = "clock"', 'context = "clock"\npart = "rod"'),
                                    *NO_PARTS], "part", "[[part]] tables",
      at='part = "rod"', got="'rod'", words=("wrong type",)),

    # ------------------------------------------------------------ unknown keys, every level
    C("unknown-top-level-field", [('revision = "A"', 'revison = "A"')], "revison",
      "at the top level", at='revison = "A"', got="'revison'", hint="revision",
      words=("unknown field",)),
    C("unknown-section", [("[arm]", "[arms]")], "arms", "at the top level", got="'arms'",
      hint="arm", words=("unknown section",)),
    C("unknown-section-line", [("[environment]", "[enviroment]")], "enviroment",
      "at the top level", at="[enviroment]", hint="environment", words=("unknown section",)),
    C("unknown-in-pivot", [("friction = 0.1\n", "friciton = 0.1\n")], "pivot.friciton",
      "in [pivot]: kind, diameter, friction", at="friciton = 0.1", got="'friciton'",
      hint="friction", words=("unknown field",)),
    C("unknown-in-suspension", [('kind = "rigid"', 'kind = "rigid"\nlenght = "1 m"')],
      "suspension.lenght", "in [suspension]", at='lenght = "1 m"', hint="length",
      words=("unknown field",)),
    C("unknown-in-arm", [('[arm]\nmaterial = "steel"', '[arm]\nmaterail = "steel"')],
      "arm.materail", "in [arm]: material, expansion", at='materail = "steel"',
      hint="material", words=("unknown field",)),
    C("unknown-in-part-typo", [('mount = "bottom"', 'mont = "bottom"')], "part.bob.mont",
      "in [part.bob]", at='mont = "bottom"', got="'mont'", hint="mount",
      words=("unknown field",)),
    C("unknown-in-part", [('mount = "bottom"', 'mount = "bottom"\ncolour = "gold"')],
      "part.bob.colour", "in [part.bob]", at='colour = "gold"', got="'colour'",
      words=("unknown field",)),
    C("unknown-in-point", [('along = "960 mm"', 'along = "960 mm"\nacros = "0 mm"')],
      "point.striker.acros", "in [point.striker]: name, along, across", at='acros = "0 mm"',
      hint="across", words=("unknown field",)),
    C("unknown-in-swing", [('target_period = "2 s"', 'target_periode = "2 s"')],
      "swing.target_periode", "in [swing]", at='target_periode = "2 s"',
      hint="target_period", words=("unknown field",)),
    C("unknown-in-environment", [('humidity = "40 %"', 'humidty = "40 %"')],
      "environment.humidty", "in [environment]", at='humidty = "40 %"', hint="humidity",
      words=("unknown field",)),
    C("unknown-in-impact", [('rise_angle = "20 deg"', 'raise_angle = "20 deg"')],
      "impact.raise_angle", "in [impact]", at='raise_angle = "20 deg"', hint="rise_angle",
      words=("unknown field",)),
    C("unknown-in-rating", [('nut_pitch = "0.75 mm"', 'nut_pich = "0.75 mm"')],
      "rating.nut_pich", "in [rating]: part, nut_pitch", at='nut_pich = "0.75 mm"',
      hint="nut_pitch", words=("unknown field",)),
    C("unknown-in-pendulum", [('bob_mass = "1.2 kg"', 'bobmass = "1.2 kg"')],
      "pendulum.bobmass", "in [pendulum]: length, bob_mass, suspension",
      at='bobmass = "1.2 kg"', hint="bob_mass", words=("unknown field",), base=SHORT),

    # ------------------------------------------------------------ sizes and shapes
    C("size-not-of-the-shape-lens", [('thickness = "30 mm"',
                                      'thickness = "30 mm"\nlength = "30 mm"')],
      "part.bob.length", "the sizes of a lens: diameter, thickness", at='length = "30 mm"',
      got="'30 mm'", words=("not a size of a lens",)),
    C("size-not-of-the-shape-rod", [('diameter = "6 mm"', 'diameter = "6 mm"\nwidth = "6 mm"')],
      "part.rod.width", "the sizes of a rod: length, diameter", at='width = "6 mm"',
      got="'6 mm'", words=("not a size of a rod",)),
    C("size-on-a-point", [('mass = "0.1 kg"', 'mass = "0.1 kg"\ndiameter = "10 mm"')],
      "part.weight.diameter", "the sizes of a point: none", at='diameter = "10 mm"',
      got="'10 mm'"),
    C("size-missing-lens-thickness", [('thickness = "30 mm"\n', "")], "part.bob.thickness",
      "a size > 0", at=("[[part]]", 2), got=None,
      words=("missing required field 'thickness'",)),
    C("size-missing-rod-length", [('length = "1000 mm"\n', "")], "part.rod.length",
      "a size > 0", at=("[[part]]", 1), got=None, words=("missing required field 'length'",)),
    C("shape-missing", [('shape = "lens"\n', "")], "part.bob.shape", "rod or tube",
      at=("[[part]]", 2), got=None, words=("missing required field 'shape'",)),
    C("shape-unknown-typo", [('shape = "lens"', 'shape = "lense"')], "part.bob.shape",
      "rod or tube or flat_bar", at='shape = "lense"', got="'lense'", hint="lens",
      words=("unknown shape",)),
    C("shape-unknown-case", [('shape = "point"', 'shape = "Point"')], "part.weight.shape",
      "sphere or lens or point", at='shape = "Point"', got="'Point'", hint="point"),
    C("size-negative", [('thickness = "30 mm"', 'thickness = "-30 mm"')],
      "part.bob.thickness", "a size > 0", at='thickness = "-30 mm"', got="'-30 mm'",
      words=("out of range",)),
    C("size-zero", [('diameter = "150 mm"', 'diameter = "0 mm"')], "part.bob.diameter",
      "a size > 0", at='diameter = "0 mm"', got="'0 mm'", words=("out of range",)),
    C("size-nan-text", [('diameter = "150 mm"', 'diameter = "nan mm"')], "part.bob.diameter",
      "a size > 0", at='diameter = "nan mm"', got="'nan mm'", words=("not a finite number",)),
    C("size-inf-toml", [('diameter = "150 mm"', "diameter = inf")], "part.bob.diameter",
      "a size > 0", at="diameter = inf", words=("not a finite number",)),
    C("size-wrong-unit-kind", [('thickness = "30 mm"', 'thickness = "30 kg"')],
      "part.bob.thickness", "a size > 0", at='thickness = "30 kg"', got="'30 kg'",
      words=("not a length",)),
    C("size-unknown-unit", [('thickness = "30 mm"', 'thickness = "30 mmm"')],
      "part.bob.thickness", "a size > 0", at='thickness = "30 mmm"', got="'30 mmm'",
      hint="mm", words=("unknown unit",)),
    C("size-overflows", [('diameter = "150 mm"', 'diameter = "1e300 m"')],
      "part.bob.diameter", "", at='diameter = "1e300 m"', got="'1e300 m'"),
    C("tube-inner-equals-outer", [('shape = "rod"\nlength = "1000 mm"\ndiameter = "6 mm"',
                                   ('shape = "tube"\nlength = "1000 mm"\nouter_diameter = '
                                   '"6 mm"\ninner_diameter = "6 mm"'))],
      "part.rod.inner_diameter", "smaller than the outer diameter",
      at='inner_diameter = "6 mm"', got="'6 mm'", words=("no wall",)),
    C("lens-thicker-than-its-diameter", [('thickness = "30 mm"', 'thickness = "160 mm"')],
      "part.bob.thickness", "at most its diameter", at='thickness = "160 mm"',
      got="'160 mm'"),
    C("sphere-shell-without-wall", [(('shape = "lens"\naxis = "pivot"\ndiameter = "150 mm"\n'
                                     'thickness = "30 mm"'),
                                     ('shape = "sphere"\ndiameter = "150 mm"\n'
                                     'inner_diameter = "150 mm"'))],
      "part.bob.inner_diameter", "an inner diameter in [0,", at='inner_diameter = "150 mm"',
      got="'150 mm'"),

    # ------------------------------------------------------------ where a part is
    C("place-two-of-centre-top", [('centre = "950 mm"', 'centre = "950 mm"\ntop = "935 mm"')],
      "part.bob.top", "one of centre, top, bottom", at='top = "935 mm"', got="'935 mm'",
      words=("both 'centre' and 'top'",)),
    C("place-two-of-top-bottom", [('top = "0 mm"', 'top = "0 mm"\nbottom = "1000 mm"')],
      "part.rod.bottom", "one of centre, top, bottom", at='bottom = "1000 mm"',
      words=("both 'top' and 'bottom'",)),
    C("place-missing", [('centre = "950 mm"\n', "")], "part.bob.centre",
      "one of centre, top, bottom", at=("[[part]]", 2), got=None,
      words=("missing required field",)),
    C("point-part-with-top", [('centre = "500 mm"', 'top = "500 mm"')], "part.weight.top",
      "centre", at='top = "500 mm"', got="'500 mm'", words=("placed by its centre",)),
    C("point-part-with-bottom", [('centre = "500 mm"', 'bottom = "500 mm"')],
      "part.weight.bottom", "centre", at='bottom = "500 mm"', words=("placed by its centre",)),
    C("mount-unknown", [('mount = "bottom"', 'mount = "base"')], "part.bob.mount",
      "centre or top or bottom", at='mount = "base"', got="'base'"),

    # ------------------------------------------------------------ mass, material, density
    C("point-without-mass", [('mass = "0.1 kg"\n', "")], "part.weight.mass", "a mass > 0",
      at=("[[part]]", 3), got=None, words=("missing required field 'mass'",)),
    C("lens-without-material", [('mount = "bottom"\nmaterial = "brass"\n',
                                 'mount = "bottom"\n')], "part.bob.material",
      "a material, a density or a mass", at=("[[part]]", 2), got=None,
      words=("missing required field",)),
    C("point-with-density-but-no-mass", [('mass = "0.1 kg"', 'density = "8 g/cm^3"')],
      "part.weight.mass", "a mass > 0", at=("[[part]]", 3)),
    C("mass-and-material", [('material = "brass"\n', 'material = "brass"\nmass = "4 kg"\n')],
      "part.bob.material", "one of mass, density, material", at='material = "brass"',
      words=("both 'mass' and 'material'",)),
    C("material-unknown", [('material = "brass"', 'material = "brasss"')],
      "part.bob.material", "steel", at='material = "brasss"', got="'brasss'", hint="brass",
      words=("unknown material",)),
    C("material-unknown-on-arm", [('[arm]\nmaterial = "steel"', '[arm]\nmaterial = "steal"')],
      "arm.material", "steel", at='material = "steal"', got="'steal'", hint="steel",
      words=("unknown material",)),
    C("mass-negative", [('mass = "0.1 kg"', 'mass = "-0.1 kg"')], "part.weight.mass",
      "a mass > 0", at='mass = "-0.1 kg"', got="'-0.1 kg'", words=("out of range",)),
    C("mass-zero", [('mass = "0.1 kg"', 'mass = "0 kg"')], "part.weight.mass", "a mass > 0",
      at='mass = "0 kg"', got="'0 kg'", words=("out of range",)),
    C("mass-nan-toml", [('mass = "0.1 kg"', "mass = nan")], "part.weight.mass", "a mass > 0",
      at="mass = nan", words=("not a finite number",)),
    C("mass-inf-text", [('mass = "0.1 kg"', 'mass = "inf kg"')], "part.weight.mass",
      "a mass > 0", at='mass = "inf kg"', got="'inf kg'", words=("not a finite number",)),
    C("mass-subnormal", [('mass = "0.1 kg"', 'mass = "1e-320 kg"')], "part.weight.mass",
      "a finite number > 0", at='mass = "1e-320 kg"', got="'1e-320 kg'"),
    C("density-negative", [('material = "brass"', 'density = "-8.4 g/cm^3"')],
      "part.bob.density", "a density > 0", at='density = "-8.4 g/cm^3"',
      got="'-8.4 g/cm^3'", words=("out of range",)),
    C("expansion-out-of-range", [('mount = "bottom"',
                                  'mount = "bottom"\nexpansion = "0.01 /K"')],
      "part.bob.expansion", "(-1e-3, 1e-3) 1/K", at='expansion = "0.01 /K"',
      got="'0.01 /K'", words=("out of range",)),
    C("arm-material-and-expansion", [('[arm]\nmaterial = "steel"',
                                      '[arm]\nmaterial = "steel"\nexpansion = "11e-6 /K"')],
      "arm.expansion", "one of material, expansion", at='expansion = "11e-6 /K"'),
    C("custom-without-inertia", [('shape = "point"', 'shape = "custom"')],
      "part.weight.inertia", "its own inertia", at=("[[part]]", 3), got=None,
      words=("missing required field 'inertia'",)),
    C("custom-negative-inertia", [('shape = "point"',
                                   'shape = "custom"\ninertia = "-0.01 kg m^2"')],
      "part.weight.inertia", ">= 0", at='inertia = "-0.01 kg m^2"', words=("out of range",)),
    C("inertia-on-a-shaped-part", [('mount = "bottom"',
                                    'mount = "bottom"\ninertia = "0.1 kg m^2"')],
      "part.bob.inertia", "only on a custom part", at='inertia = "0.1 kg m^2"',
      got="'0.1 kg m^2'"),
    C("volume-on-a-point", [('mass = "0.1 kg"', 'mass = "0.1 kg"\nvolume = "1 L"')],
      "part.weight.volume", "only on a custom part", at='volume = "1 L"', got="'1 L'"),

    # ------------------------------------------------------------ orientation
    C("orientation-unknown-value", [('axis = "pivot"', 'axis = "vertical"')],
      "part.bob.axis", "pivot or swing or arm", at='axis = "vertical"', got="'vertical'"),
    C("orientation-wrong-keyword", [('axis = "pivot"', 'normal = "pivot"')],
      "part.bob.normal", "for a lens: axis", at='normal = "pivot"', got="'pivot'"),
    C("orientation-on-a-rod", [('diameter = "6 mm"', 'diameter = "6 mm"\naxis = "arm"')],
      "part.rod.axis", "no orientation", at='axis = "arm"', got="'arm'"),
    C("orientation-number", [('axis = "pivot"', "axis = 1")], "part.bob.axis",
      "pivot or swing or arm", at="axis = 1", got="1", words=("wrong type",)),

    # ------------------------------------------------------------ names
    C("duplicate-part-name", [('name = "weight"', 'name = "rod"')], "part.rod.name",
      "a name no other part has", at=("name = \"rod\"", 2), got="'rod'",
      words=("two parts share this name",)),
    C("duplicate-point-name", [("[swing]", ('[[point]]\nname = "striker"\nalong = "900 mm"\n\n'
                                           "[swing]"))],
      "point.striker.name", "a name no other point has", at=('name = "striker"', 2),
      got="'striker'", words=("two points share this name",)),
    C("part-name-reserved", [('name = "weight"', 'name = "suspension"')],
      "part.suspension.name", "not 'suspension'", at='name = "suspension"'),
    C("part-name-punctuation", [('name = "bob"', 'name = "bob!"')], "name",
      "letters, digits, spaces", at='name = "bob!"', got="'bob!'"),
    C("point-name-missing", [('name = "striker"\n', "")], "name", "a text in quotes",
      at="[[point]]", got=None, words=("missing required field 'name'",)),

    # ------------------------------------------------------------ the body must hang
    C("centre-of-mass-above-the-pivot", [('top = "0 mm"', 'top = "-1500 mm"'),
                                         ('centre = "950 mm"', 'centre = "-950 mm"'),
                                         ('centre = "500 mm"', 'centre = "-500 mm"')],
      "", "a centre of mass below the pivot", words=("does not hang",)),

    # ------------------------------------------------------------ suspension
    C("rigid-with-length", [('kind = "rigid"', 'kind = "rigid"\nlength = "1 m"')],
      "suspension.length", "no length or mass per length for a rigid arm", at='length = "1 m"',
      got="'1 m'", words=("for a flexible suspension",)),
    C("rigid-with-mass-per-length", [('kind = "rigid"',
                                      'kind = "rigid"\nmass_per_length = "1 kg/m"')],
      "suspension.mass_per_length", "for a rigid arm", at='mass_per_length = "1 kg/m"',
      got="'1 kg/m'"),
    C("flexible-without-length", [('kind = "rigid"', 'kind = "chain"')], "suspension.length",
      "a length > 0", at="[suspension]", got=None, words=("missing required field",)),
    C("flexible-negative-mass-per-length", [('kind = "rigid"', ('kind = "chain"\nlength = '
                                             '"1 m"\nmass_per_length = "-1 kg/m"'))],
      "suspension.mass_per_length", ">= 0", at='mass_per_length = "-1 kg/m"',
      words=("out of range",)),
    C("flexible-longer-than-the-body-hangs", [('kind = "rigid"',
                                               'kind = "chain"\nlength = "3 m"')],
      "suspension.length", "", at='length = "3 m"'),
    C("suspension-kind-unknown", [('kind = "rigid"', 'kind = "rigid-arm"')],
      "suspension.kind", "rigid or chain or rope or cable", at='kind = "rigid-arm"',
      got="'rigid-arm'", hint="rigid"),

    # ------------------------------------------------------------ pivot
    C("pin-without-diameter", [('diameter = "4 mm"\n', "")], "pivot.diameter",
      "a pin diameter > 0", at="[pivot]", got=None, words=("missing required field",)),
    C("pin-without-friction", [("friction = 0.1\n", "")], "pivot.friction", "[0, 2]",
      at="[pivot]", got=None),
    C("friction-negative", [("friction = 0.1\n", "friction = -0.1\n")], "pivot.friction",
      "a friction coefficient in [0, 2]", at="friction = -0.1", got="-0.1",
      words=("out of range",)),
    C("friction-above-two", [("friction = 0.1\n", "friction = 3\n")], "pivot.friction",
      "[0, 2]", at="friction = 3", got="3", words=("out of range",)),
    C("friction-percent-above-two", [("friction = 0.1\n", 'friction = "300 %"\n')],
      "pivot.friction", "[0, 2]", at='friction = "300 %"', got="'300 %'"),
    C("static-friction-below-kinetic", [("static_friction = 0.15", "static_friction = 0.05")],
      "pivot.static_friction", "[friction = 0.1, 2]", at="static_friction = 0.05",
      got="0.05", words=("out of range",)),
    C("torque-on-a-pin", [("static_friction = 0.15",
                           'static_friction = 0.15\ntorque = "0.01 N m"')],
      "pivot.torque", "for a pin pivot: diameter, friction, static_friction",
      at='torque = "0.01 N m"', got="'0.01 N m'", words=("does not apply to a pin pivot",)),
    C("pin-keys-on-a-torque-pivot", [('kind = "pin"', 'kind = "torque"')], "pivot.diameter",
      "for a torque pivot: torque", at='diameter = "4 mm"',
      words=("does not apply to a torque pivot",)),
    C("friction-on-a-knife-edge", [(PIVOT_BODY, 'kind = "knife-edge"\nfriction = 0.1')],
      "pivot.friction", "only kind", at="friction = 0.1"),
    C("pivot-kind-unknown", [('kind = "pin"', 'kind = "knife"')], "pivot.kind",
      "knife-edge or pin or torque", at='kind = "knife"', got="'knife'", hint="knife-edge"),
    C("torque-wrong-unit-kind", [(PIVOT_BODY, 'kind = "torque"\ntorque = "0.01 N"')],
      "pivot.torque", "a friction torque >= 0", at='torque = "0.01 N"', got="'0.01 N'",
      words=("not a torque",)),
    C("torque-negative", [(PIVOT_BODY, 'kind = "torque"\ntorque = "-0.01 N m"')],
      "pivot.torque", ">= 0", at='torque = "-0.01 N m"', words=("out of range",)),

    # ------------------------------------------------------------ environment
    C("gravity-and-latitude", [(ENV, 'gravity = "9.81 m/s^2"\nlatitude = "45 deg"\n' + ENV)],
      "environment.latitude", "either gravity or a latitude", at='latitude = "45 deg"',
      got="'45 deg'", words=("both gravity and latitude",)),
    C("latitude-above-90", [(ENV, 'latitude = "95 deg"\n' + ENV)], "environment.latitude",
      "a latitude in [-90, 90] deg", at='latitude = "95 deg"', got="'95 deg'",
      words=("out of range",)),
    C("latitude-below-minus-90-bare", [(ENV, 'latitude = "-91"\n' + ENV)],
      "environment.latitude", "[-90, 90] deg", at='latitude = "-91"', got="'-91'"),
    C("latitude-in-metres", [(ENV, 'latitude = "45 m"\n' + ENV)], "environment.latitude",
      "[-90, 90] deg", at='latitude = "45 m"', words=("not an angle",)),
    C("elevation-out-of-range", [(ENV, 'latitude = "45 deg"\nelevation = "30 km"\n' + ENV)],
      "environment.elevation", "[-500 m, 20 km]", at='elevation = "30 km"',
      got="'30 km'"),
    C("temperature-too-hot", [(ENV, 'temperature = "200 degC"')],
      "environment.temperature", "[-60, 80] degC", at='temperature = "200 degC"',
      got="'200 degC'", words=("out of range",)),
    C("temperature-too-cold", [(ENV, 'temperature = "-100 degC"')],
      "environment.temperature", "[-60, 80] degC", at='temperature = "-100 degC"',
      got="'-100 degC'"),
    C("temperature-without-unit", [(ENV, 'temperature = "20"')], "environment.temperature",
      "[-60, 80] degC", at='temperature = "20"', got="'20'", words=("needs a unit",)),
    C("temperature-bare-toml-number", [(ENV, "temperature = 20")], "environment.temperature",
      "[-60, 80] degC", at="temperature = 20", got="20", words=("needs a unit",)),
    C("temperature-wrong-unit-kind", [(ENV, 'temperature = "20 m"')],
      "environment.temperature", "degC", at='temperature = "20 m"',
      words=("not a temperature",)),
    C("reference-temperature-out-of-range", [(ENV, ENV + '\nreference_temperature = '
                                                     '"90 degC"')],
      "environment.reference_temperature", "[-60, 80] degC",
      at='reference_temperature = "90 degC"', got="'90 degC'"),
    C("humidity-above-100-percent", [('humidity = "40 %"', 'humidity = "140 %"')],
      "environment.humidity", "[0, 100] %", at='humidity = "140 %"', got="'140 %'",
      words=("out of range",)),
    C("humidity-negative", [('humidity = "40 %"', 'humidity = "-5 %"')],
      "environment.humidity", "[0, 100] %", at='humidity = "-5 %"', got="'-5 %'"),
    C("pressure-out-of-range", [('humidity = "40 %"', ('humidity = "40 %"\npressure = '
                                                      '"500 kPa"'))],
      "environment.pressure", "[10, 120] kPa", at='pressure = "500 kPa"', got="'500 kPa'"),
    C("gravity-negative", [(ENV, 'gravity = "-9.8 m/s^2"\n' + ENV)], "environment.gravity",
      "'standard'", at='gravity = "-9.8 m/s^2"', got="'-9.8 m/s^2'",
      words=("out of range",)),
    C("gravity-unknown-word", [(ENV, 'gravity = "earth"\n' + ENV)], "environment.gravity",
      "'standard'", at='gravity = "earth"', got="'earth'"),
    C("gravity-wrong-unit-kind", [(ENV, 'gravity = "9.8 m/s"\n' + ENV)],
      "environment.gravity", "an acceleration in [0.01, 1000] m/s^2", at='gravity = "9.8 m/s"',
      words=("not an acceleration",)),

    # ------------------------------------------------------------ swing
    C("amplitude-180", [('amplitude = ["2 deg", "4 deg"]', 'amplitude = ["2 deg", "180 deg"]')],
      "swing.amplitude", "[0, 180) deg", at='amplitude = ["2 deg", "180 deg"]',
      got="'180 deg'", words=("out of range",)),
    C("amplitude-missing", [('amplitude = ["2 deg", "4 deg"]\n', "")], "swing.amplitude",
      "[0, 180) deg", at="[swing]", got=None, words=("missing required field",)),
    C("swing-section-missing", [(('[swing]\namplitude = ["2 deg", "4 deg"]\n'
                                 'target_period = "2 s"\n'), "")], "[swing]",
      "a [swing] section with amplitude", got=None, words=("missing section",)),
    C("target-period-negative", [('target_period = "2 s"', 'target_period = "-2 s"')],
      "swing.target_period", "a period > 0", at='target_period = "-2 s"', got="'-2 s'"),

    # ------------------------------------------------------------ impact
    C("rise-angle-above-drop-angle", [('rise_angle = "20 deg"', 'rise_angle = "40 deg"')],
      "impact.rise_angle", "[0, drop_angle]", at='rise_angle = "40 deg"', got="'40 deg'",
      words=("out of range",)),
    C("drop-angle-zero", [('drop_angle = "30 deg"', 'drop_angle = "0 deg"')],
      "impact.drop_angle", "(0, 180] deg", at='drop_angle = "0 deg"', got="'0 deg'"),
    C("strike-point-names-no-point", [('strike_point = "striker"', 'strike_point = "stiker"')],
      "impact.strike_point", "the name of a [[point]]: striker", at='strike_point = "stiker"',
      got="'stiker'", hint="striker", words=("no such point",)),
    C("strike-radius-and-strike-point", [('strike_point = "striker"',
                                          'strike_point = "striker"\nstrike_radius = "0.9 m"')],
      "impact.strike_point", "one of strike_radius, strike_point",
      at='strike_point = "striker"',
      words=("both 'strike_radius' and 'strike_point'",)),
    C("strike-neither", [('strike_point = "striker"\n', "")], "impact.strike_radius",
      "one of strike_radius, strike_point", at="[impact]", got=None),
    C("strike-radius-negative", [('strike_point = "striker"', 'strike_radius = "-0.9 m"')],
      "impact.strike_radius", "a radius > 0", at='strike_radius = "-0.9 m"', got="'-0.9 m'"),

    # ------------------------------------------------------------ rating
    C("rating-names-no-part", [('part = "bob"', 'part = "bobb"')], "rating.part",
      "the name of a part: rod, bob, weight", at='part = "bobb"', got="'bobb'", hint="bob",
      words=("no such part",)),
    C("rating-list-names-no-part", [('part = "bob"', 'part = ["bob", "nutt"]')],
      "rating.part", "the name of a part", at='part = ["bob", "nutt"]', got="'nutt'",
      words=("no such part",)),
    C("rating-without-part", [('part = "bob"\n', "")], "rating.part", "", at="[rating]",
      got=None, words=("missing required field 'part'",)),
    C("rating-nut-pitch-negative", [('nut_pitch = "0.75 mm"', 'nut_pitch = "-0.75 mm"')],
      "rating.nut_pitch", "a thread pitch > 0", at='nut_pitch = "-0.75 mm"',
      got="'-0.75 mm'"),

    # ------------------------------------------------------------ tolerances
    C("tolerance-unknown-path", [('"part.bob.centre" = "0.2 mm"',
                                  '"part.bob.center" = "0.2 mm"')],
      "part.bob.center", "the path of a quantity in this file", at='"part.bob.center" = "0.2 mm"',
      got="'part.bob.center'", hint="part.bob.centre", words=("no such quantity",)),
    C("tolerance-path-of-no-part", [('"part.bob.centre" = "0.2 mm"',
                                     '"part.bobb.centre" = "0.2 mm"')],
      "part.bobb.centre", "the path of a quantity", at='"part.bobb.centre" = "0.2 mm"',
      hint="part.bob.centre", words=("no such quantity",)),
    C("tolerance-quantity-not-in-file", [('"part.bob.centre" = "0.2 mm"',
                                          '"part.bob.mass" = "0.2 kg"')],
      "part.bob.mass", "the path of a quantity", at='"part.bob.mass" = "0.2 kg"',
      words=("no such quantity",)),
    C("tolerance-wrong-unit-kind", [('"part.bob.centre" = "0.2 mm"',
                                     '"part.bob.centre" = "0.2 kg"')],
      "tolerances.part.bob.centre", "as length with its unit, or a percentage",
      at='"part.bob.centre" = "0.2 kg"', got="'0.2 kg'", words=("not a length",)),
    C("tolerance-temperature-as-length", [('"environment.temperature" = "5 K"',
                                           '"environment.temperature" = "5 mm"')],
      "tolerances.environment.temperature", "temperature difference",
      at='"environment.temperature" = "5 mm"', got="'5 mm'"),
    C("tolerance-negative", [('"part.bob.centre" = "0.2 mm"', '"part.bob.centre" = "-0.2 mm"')],
      "tolerances.part.bob.centre", "half-width >= 0", at='"part.bob.centre" = "-0.2 mm"',
      got="'-0.2 mm'", words=("out of range",)),
    C("tolerance-negative-percent", [('"part.bob.density" = "1 %"',
                                      '"part.bob.density" = "-1 %"')],
      "tolerances.part.bob.density", "half-width >= 0", at='"part.bob.density" = "-1 %"',
      got="'-1 %'", words=("out of range",)),
    C("tolerance-above-100-percent", [('"part.bob.density" = "1 %"',
                                       '"part.bob.density" = "150 %"')],
      "tolerances.part.bob.density", "or a percentage", at='"part.bob.density" = "150 %"',
      got="'150 %'"),
    C("tolerance-bool", [('"part.bob.centre" = "0.2 mm"', '"part.bob.centre" = true')],
      "tolerances.part.bob.centre", "half-width", at='"part.bob.centre" = true', got="True",
      words=("wrong type",)),
    C("tolerance-list", [('"part.bob.centre" = "0.2 mm"', '"part.bob.centre" = ["0.2 mm"]')],
      "tolerances.part.bob.centre", "half-width", at='"part.bob.centre" = ["0.2 mm"]',
      got="['0.2 mm']", words=("wrong type",)),
    C("tolerance-bare-number", [('"part.bob.density" = "1 %"', '"part.bob.density" = 0.01')],
      "tolerances.part.bob.density", "half-width", at='"part.bob.density" = 0.01',
      got="0.01", words=("wrong type",)),
    C("tolerance-unquoted-dotted-path-is-still-checked",
      [('"part.bob.centre" = "0.2 mm"', 'part.bob.centre = "0.2 kg"')],
      "tolerances.part.bob.centre", "half-width", at='part.bob.centre = "0.2 kg"',
      got="'0.2 kg'", words=("is not a length",)),
    C("tolerances-given-as-a-value", [('context = "clock"', ('context = "clock"\n'
                                                            'tolerances = "5 %"')),
                                      ("[tolerances]\n" + BOB_TOLERANCES
                                       + '"environment.temperature" = "5 K"\n', "")],
      "tolerances", "a [tolerances] section", at='tolerances = "5 %"', got="'5 %'",
      words=("wrong type",)),

    # ------------------------------------------------------------ structure
    C("pendulum-together-with-suspension", [*NO_PARTS, ("[swing]", PENDULUM + "[swing]")],
      "suspension", "either a [pendulum] section", at="[suspension]",
      words=("both [pendulum] and [suspension]",)),
    C("pendulum-together-with-parts", [("[swing]", PENDULUM + "[swing]"),
                                       ("[suspension]\nkind = \"rigid\"\n\n", "")],
      "part", "either a [pendulum] section", at=("[[part]]", 1),
      words=("both [pendulum] and [[part]]",)),
    C("pendulum-suspension-word", [('suspension = "rigid"', 'suspension = "chain"')],
      "pendulum.suspension", "rigid or flexible", at='suspension = "chain"', got="'chain'",
      base=SHORT),
    C("no-parts", NO_PARTS, "[[part]]", "[[part]] tables", got=None,
      words=("the design has no parts",)),
    C("empty-part-list", [*NO_PARTS, ('context = "clock"', 'context = "clock"\npart = []')],
      "[[part]]", "[[part]] tables", got=None, words=("the design has no parts",)),
    C("too-many-parts", [("[[point]]", EXTRA_POINTS + "[[point]]")], "part",
      "at most 200 [[part]] tables", got="201", words=("too many",)),

    # ------------------------------------------------------------ texts
    C("name-with-escape", [('name = "Test regulator"', 'name = "Test\\u001b[2Jregulator"')],
      "name", "on one line", at='name = "Test\\u001b[2Jregulator"',
      words=("control character U+001B",)),
    C("part-name-with-bell", [('name = "bob"', 'name = "bob\\u0007"')], "name",
      "on one line", at='name = "bob\\u0007"', words=("control character U+0007",)),
    C("point-name-with-escape", [('name = "striker"', 'name = "st\\u001b[31mriker"')],
      "name", "on one line", at='name = "st\\u001b[31mriker"',
      words=("control character U+001B",)),
    C("name-with-line-separator", [('name = "Test regulator"', 'name = "Test\\u2028reg"')],
      "name", "on one line", at='name = "Test\\u2028reg"',
      words=("control character U+2028",)),
    C("revision-on-two-lines", [('revision = "A"', 'revision = """A\nB"""')], "revision",
      "on one line", at='revision = """A', words=("control character U+000A",)),
    C("date-with-nul", [('date = "2026-01-05"', 'date = "2026\\u0000"')], "date",
      "on one line", at='date = "2026\\u0000"', words=("control character U+0000",)),
    C("name-too-long", [('name = "Test regulator"', 'name = "' + "x" * 300 + '"')], "name",
      "at most 200 characters", at='name = "' + "x" * 300 + '"', words=("too long",)),
]

_IDS = [c.id for c in CASES]
assert len(_IDS) == len(set(_IDS)), "case ids must be unique"


def _params():
    for c in CASES:
        marks = [pytest.mark.xfail(strict=True, reason=c.bug)] if c.bug else []
        yield pytest.param(c, id=c.id, marks=marks)


def check_message(msg: str, c: Case) -> None:
    assert "\n" not in msg and "\r" not in msg, msg
    bad = [ch for ch in msg if unicodedata.category(ch) in ("Cc", "Zl", "Zp")]
    assert not bad, f"raw control characters in the message: {bad!r}"
    assert msg.startswith((FILE + ",", FILE + ":")), msg
    assert not re.search(r"\w#\d", msg), f"internal section id in the message: {msg}"
    head, sep, allowed = msg.partition("; allowed: ")
    assert sep and allowed.strip(), f"does not say what is allowed: {msg}"
    assert c.allowed in allowed, (c.allowed, msg)
    if c.path:
        assert c.path in msg, (c.path, msg)
    if c.line is not None:
        assert re.findall(r"\bline (\d+)\b", head) == [str(c.line)], (c.line, msg)
    if c.got is None:
        assert "(got" not in head, msg
    elif c.got is not _NOT_GIVEN:
        assert f"(got {c.got}" in head, (c.got, msg)
    if c.hint:
        assert f"did you mean '{c.hint}'" in head, (c.hint, msg)
    for w in c.words:
        assert w in msg, (w, msg)


def test_the_base_designs_are_valid():
    """The cases are edits of designs that parse: a failure is the edit's doing."""
    d = parse_design(BASE, FILE)
    assert [p.name for p in d.parts] == ["rod", "bob", "weight"]
    assert d.pivot.kind == "pin" and d.impact is not None and d.rating is not None
    # the strike point "striker" is 960 mm down the arm, on it (u = 0)
    assert d.impact.strike_radius_m == pytest.approx(0.960, rel=1e-15)
    assert len(d.tolerances) == 3
    assert parse_design(SHORT, FILE).shorthand
    assert len(CASES) >= 60


@pytest.mark.parametrize("case", list(_params()))
def test_malformed_design_gives_one_clear_line(case):
    with pytest.raises(InvalidInput) as err:
        parse_design(case.text, FILE)
    check_message(str(err.value), case)


# ---------------------------------------------------------------- whole files

def _huge(tmp_path):
    p = tmp_path / FILE
    p.write_text(BASE + "# " + "x" * 1_100_000 + "\n")   # a valid design padded past 1 MB
    return p, ("too large", "under 1 MB")


def _not_utf8(tmp_path):
    p = tmp_path / FILE
    p.write_bytes(BASE.encode().replace(b"Test regulator", b"Test \xff regulator"))
    return p, ("not UTF-8", "UTF-8")


def _latin1(tmp_path):
    p = tmp_path / FILE
    p.write_bytes(BASE.replace("Test regulator", "Régulateur").encode("latin-1"))
    return p, ("not UTF-8",)


def _missing(tmp_path):
    return tmp_path / FILE, ("no such file",)


def _directory(tmp_path):
    p = tmp_path / FILE
    p.mkdir()
    return p, ("is a directory",)


FILE_CASES = {"huge-file": _huge, "not-utf8": _not_utf8, "latin-1": _latin1,
              "missing-file": _missing, "directory": _directory}


@pytest.mark.parametrize("make", FILE_CASES.values(), ids=FILE_CASES.keys())
def test_unreadable_file_is_one_line_naming_it(tmp_path, monkeypatch, make):
    """Given as a short relative path, as a user usually types it."""
    monkeypatch.chdir(tmp_path)
    _path, words = make(tmp_path)
    with pytest.raises(InvalidInput) as err:
        load_design(FILE)
    msg = str(err.value)
    assert "\n" not in msg
    assert FILE in msg
    assert "; allowed: " in msg
    for w in words:
        assert w in msg, (w, msg)


def test_unreadable_file_in_a_deep_folder_is_still_named(tmp_path):
    folder = tmp_path / "projects" / "clock-workshop" / "designs" / "regulators"
    folder.mkdir(parents=True)
    path, _ = _not_utf8(folder)
    with pytest.raises(InvalidInput) as err:
        load_design(path)
    assert FILE in str(err.value)


@pytest.mark.parametrize("make", [
    pytest.param(f, id=k) for k, f in FILE_CASES.items() if k in ("huge-file", "not-utf8")])
def test_unreadable_file_message_starts_with_the_file_name(tmp_path, monkeypatch, make):
    monkeypatch.chdir(tmp_path)
    make(tmp_path)
    with pytest.raises(InvalidInput) as err:
        load_design(FILE)
    assert str(err.value).startswith(FILE)


def test_valid_file_under_the_size_limit_loads(tmp_path):
    """The size limit is on bytes (1 MB), not on a design with long comments under it."""
    p = tmp_path / FILE
    p.write_text(BASE + "# " + "x" * 900_000 + "\n")
    assert load_design(p).name == "Test regulator"
