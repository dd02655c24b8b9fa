"""Tolerance analysis of a design: how the +- bands on its inputs move the period, the
rate and the loads.

The inputs are the design file's ``[tolerances]`` (``"part.bob.centre" = "0.2 mm"``),
each resolved to an absolute SI band about the design's own value at that path
(:func:`inputs`). Every evaluation is exact: :func:`perturbed` re-reads the design file
with the changed values, so everything derived from them (air density from the
temperature, a part's mass from its density, the body's inertia) is recomputed.

- :func:`linear_bands`: the first-order bands of any outputs, from one evaluation at the
  nominal design and one at each end of each input's band (central differences):
  contribution c_i = (f(x_i + t_i) - f(x_i - t_i)) / 2, root-sum-square sqrt(sum c_i^2),
  linear worst case sum |c_i|.
- :func:`analyse`: for the period, the rate and load peaks, the worst case (linear, and the
  exact value at the two sign corners, whichever is wider), the RSS band, and a seeded,
  vectorised Monte Carlo run on a full second-order response surface fitted by central
  differences of exact re-reads, checked against exact evaluations of a few samples.

A tolerance on ``swing.amplitude`` (a list whose first entry is the working amplitude)
moves every listed amplitude by the same amount, each clipped to stay in [0, 180) deg.

Method notes: ``docs/methods/tolerance.md``.
"""

from __future__ import annotations

import copy
import math
from collections.abc import Mapping
from dataclasses import dataclass, replace

from .designfile import Design, Tolerance, _tolerance_paths, parse_data
from .errors import MISSING, InvalidInput, suggest

__all__ = ["Band", "ToleranceInput", "inputs", "linear_bands", "perturbed"]

_TOP_AMPLITUDE = math.nextafter(math.pi, 0.0)


@dataclass(frozen=True)
class ToleranceInput:
    """One toleranced input: its path in the design file, its kind, the design's value
    there (SI) and the absolute +- half-width of its band (SI)."""

    path: str
    kind: str
    nominal: float
    half_width: float

    def to_dict(self) -> dict:
        return {"path": self.path, "kind": self.kind, "nominal": self.nominal,
                "half_width": self.half_width}


@dataclass(frozen=True)
class Band:
    """First-order band of one output: nominal value, root-sum-square and linear
    worst-case half-widths, and the inputs' contributions c_i (SI, signed: the output's
    change from the input's nominal to the upper end of its band, by central difference),
    ranked by |c_i|, largest first."""

    key: str
    nominal: float
    rss: float
    worst: float
    contributions: tuple

    def to_dict(self) -> dict:
        return {"key": self.key, "nominal": self.nominal, "rss": self.rss,
                "worst": self.worst,
                "contributions": [{"path": p, "contribution": c}
                                  for p, c in self.contributions]}


def _data_of(design: Design) -> dict:
    """The parsed design file behind ``design``, or the file a point-bob design built in
    code stands for."""
    if design.data is not None:
        return design.data
    if design.shorthand and not design.environment.air and len(design.parts) == 1:
        bob = design.parts[0]
        env = design.environment
        return {"name": design.name, "context": design.context,
                "pendulum": {"length": _si(bob.position, "length"),
                             "bob_mass": _si(bob.mass, "mass"),
                             "suspension": "flexible" if design.suspension.flexible
                             else "rigid"},
                "swing": {"amplitude": [_si(a, "angle") for a in design.amplitudes_rad]},
                "environment": {"gravity": _si(env.gravity_m_s2, "acceleration"),
                                "temperature": _si(env.temperature_K, "temperature"),
                                "air": False}}
    raise InvalidInput("design", design.name, "a design read from a design file "
                       "(parse_design, load_design) or a point bob from point_design",
                       "built in code: there is no design file to re-read")


def _si(value: float, kind: str):
    """``value`` as design-file text in the kind's SI unit (re-read exactly)."""
    from .quantity import KINDS

    unit = KINDS[kind].identity[0]
    return f"{float(value)!r} {unit}" if unit else float(value)


def _paths(design: Design) -> dict:
    return _tolerance_paths(_data_of(design))


def _split(path: str):
    """(section, part name or None, key) of a tolerance path."""
    if path.startswith("part."):
        name, key = path[5:].rsplit(".", 1)
        return "part", name, key
    section, key = path.split(".", 1)
    return section, None, key


def _part_index(data: dict, name: str) -> int:
    for i, t in enumerate(data.get("part") or ()):
        if isinstance(t, dict) and t.get("name", f"part{i + 1}") == name:
            return i
    raise KeyError(name)


def _nominal(design: Design, path: str, kind: str) -> float:
    """The design's value at ``path`` [SI], from the resolved design where the file may
    leave it to a default or a material, else from the file's text."""
    section, name, key = _split(path)
    env = design.environment
    if section == "environment":
        if key == "pressure" and env.pressure_Pa is None:
            from .environment import isa_pressure

            return isa_pressure(env.elevation_m)
        value = {"gravity": env.gravity_m_s2, "temperature": env.temperature_K,
                 "reference_temperature": env.reference_temperature_K,
                 "pressure": env.pressure_Pa, "humidity": env.relative_humidity,
                 "latitude": env.latitude_rad, "elevation": env.elevation_m}[key]
        if value is None:
            raise InvalidInput(f"tolerance on {path}", MISSING, "a tolerance on the gravity "
                               "given to the design", "the design's gravity was given "
                               "directly, not from a latitude")
        return float(value)
    if section == "swing":
        return float(design.amplitudes_rad[0] if key == "amplitude"
                     else design.target_period_s)
    if section == "part":
        part = next(p for p in design.parts if p.name == name)
        if key == part.at:
            return float(part.position)
        if key in part.size:
            return float(part.size[key])
        return float(getattr(part, key))
    if section == "pendulum":
        bob = design.parts[0]
        return float(bob.position if key == "length" else bob.mass)
    from .quantity import parse_quantity

    return parse_quantity(_data_of(design)[section][key], kind, path)


def _tolerance_tuple(design: Design, tolerances) -> tuple:
    if tolerances is None:
        return tuple(design.tolerances)
    out = tuple(tolerances)
    for t in out:
        if not isinstance(t, Tolerance):
            raise InvalidInput("tolerances", t, "Tolerance(path, value, relative) objects",
                               "wrong type")
        if not (isinstance(t.value, (int, float)) and math.isfinite(t.value)
                and t.value >= 0.0):
            raise InvalidInput(f"tolerance on {t.path}", t.value,
                               "a finite half-width >= 0 (SI, or a fraction if relative)")
    return out


def inputs(design: Design, tolerances=None) -> tuple:
    """The design's tolerances resolved to absolute SI bands.

    Parameters
    ----------
    design : Design
        A design read from a file (or a point bob from ``point_design``).
    tolerances : sequence of Tolerance, optional
        In place of the design file's ``[tolerances]``.

    Returns
    -------
    tuple of ToleranceInput
        In the order given; a relative tolerance is applied to |nominal|.

    Raises
    ------
    InvalidInput
        A path that names no quantity of the design (with a "did you mean"), a path given
        twice, or a negative or non-finite half-width.
    """
    tols = _tolerance_tuple(design, tolerances)
    paths = _paths(design)
    out, seen = [], set()
    for t in tols:
        if t.path not in paths:
            raise InvalidInput(f"tolerance on {t.path}", t.path, "the path of a quantity in "
                               "the design file, e.g. \"part.bob.mass\"",
                               f"no such quantity{suggest(t.path, paths)}")
        if t.path in seen:
            raise InvalidInput(f"tolerance on {t.path}", t.path, "one tolerance per input",
                               "given twice")
        seen.add(t.path)
        kind = paths[t.path]
        nominal = _nominal(design, t.path, kind)
        half = abs(nominal) * t.value if t.relative else float(t.value)
        out.append(ToleranceInput(t.path, kind, nominal, half))
    return tuple(out)


def perturbed(design: Design, changes: Mapping[str, float]) -> Design:
    """The design re-read with the given paths set to new values.

    Parameters
    ----------
    design : Design
    changes : mapping path -> float
        New SI values at tolerance paths (``{"part.bob.centre": 1.0021}``).

    Returns
    -------
    Design
        Exact: the design file is re-read with the values replaced, so everything derived
        from them (air density and viscosity from the temperature, a part's mass from its
        density) is recomputed. The working amplitudes and gravity of ``design`` are kept
        (also when they were overridden after reading, e.g. by ``--gravity``).

    Notes
    -----
    ``swing.amplitude`` sets the working (first) amplitude: every listed amplitude moves
    by the same amount, each clipped to [0, 180) deg. A density set on a part whose file
    gives a material replaces the material's density and keeps its expansion.

    Raises
    ------
    InvalidInput
        An unknown path, a non-finite value, or a changed design that is not valid (a
        size below zero, a body that cannot hang), naming the path and the value.
    """
    data = copy.deepcopy(_data_of(design))
    paths = _tolerance_paths(data)
    env = design.environment
    swing = data.setdefault("swing", {})
    amps = list(design.amplitudes_rad)
    envt = data.setdefault("environment", {})
    if env.latitude_rad is None:
        envt.pop("latitude", None)
        envt["gravity"] = _si(env.gravity_m_s2, "acceleration")
    for path, value in changes.items():
        if path not in paths:
            raise InvalidInput(f"change of {path}", path, "the path of a quantity in the "
                               "design file", f"no such quantity{suggest(path, paths)}")
        v = float(value)
        if not math.isfinite(v):
            raise InvalidInput(f"change of {path}", value, "a finite value (SI)")
        section, name, key = _split(path)
        kind = paths[path]
        if path == "swing.amplitude":
            delta = v - amps[0]
            amps = [min(max(a + delta, 0.0), _TOP_AMPLITUDE) for a in amps]
            continue
        if section == "part":
            t = data["part"][_part_index(data, name)]
            if key == "density" and "material" in t:
                part = next(p for p in design.parts if p.name == name)
                t.pop("material")
                t.setdefault("expansion", _si(part.expansion, "expansion"))
            t[key] = _si(v, kind)
            continue
        if path == "environment.gravity":
            envt.pop("latitude", None)
        elif path == "environment.latitude":
            envt.pop("gravity", None)
        data.setdefault(section, {})[key] = _si(v, kind)
    swing["amplitude"] = [_si(a, "angle") for a in amps]
    try:
        out = parse_data(data, design.source)
    except InvalidInput as exc:
        shown = ", ".join(f"{p} = {float(x):.8g}" for p, x in changes.items())
        raise InvalidInput(f"{design.source}: tolerances", shown or MISSING,
                           "changes that leave a valid design",
                           f"the design re-read with {shown} is not valid: {exc}") from None
    if env.latitude_rad is None and "environment.gravity" not in changes:
        out = replace(out, environment=replace(out.environment,
                                               gravity_given=env.gravity_given))
    return out


def _finite(value) -> bool:
    return value is not None and isinstance(value, (int, float)) and math.isfinite(value)


def linear_bands(design: Design, evaluate, tolerances=None) -> dict:
    """First-order (central-difference) bands of the outputs of ``evaluate``.

    Parameters
    ----------
    design : Design
    evaluate : callable
        ``evaluate(design) -> Mapping[str, float]``: SI values by key. Called on the
        nominal design and on the design with each input at each end of its band
        (2 n + 1 calls; an input with a zero band is not evaluated).
    tolerances : sequence of Tolerance, optional
        In place of the design's ``[tolerances]``.

    Returns
    -------
    dict key -> Band
        For each key whose value is finite on every call; ``{}`` with no tolerances.

    Notes
    -----
    c_i = (f(x + t_i e_i) - f(x - t_i e_i)) / 2 is t_i times the central-difference
    derivative; RSS = sqrt(sum c_i^2) is the first-order law of propagation of
    independent uncertainties (ISO/IEC Guide 98-3, GUM, applied to half-widths) and
    sum |c_i| the linear worst case.
    """
    ins = inputs(design, tolerances)
    if not ins:
        return {}
    base = dict(evaluate(design))
    keys = [k for k, v in base.items() if _finite(v)]
    contrib = {k: [] for k in keys}
    for inp in ins:
        if inp.half_width == 0.0:
            for k in keys:
                contrib[k].append((inp.path, 0.0))
            continue
        hi = evaluate(perturbed(design, {inp.path: inp.nominal + inp.half_width}))
        lo = evaluate(perturbed(design, {inp.path: inp.nominal - inp.half_width}))
        for k in list(keys):
            a, b = hi.get(k), lo.get(k)
            if not (_finite(a) and _finite(b)):
                keys.remove(k)
                continue
            contrib[k].append((inp.path, 0.5 * (float(a) - float(b))))
    out = {}
    for k in keys:
        cs = contrib[k]
        ranked = tuple(sorted(cs, key=lambda pc: -abs(pc[1])))
        out[k] = Band(k, float(base[k]), math.sqrt(sum(c * c for _, c in cs)),
                      sum(abs(c) for _, c in cs), ranked)
    return out


