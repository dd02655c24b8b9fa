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
- :func:`analyse`: for the period, the rate and load peaks, the worst case (the exact value
  at the two sign corners; the linear stack-up too where it is wider and the output is
  not monotone along some band), the RSS band, and a seeded,
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

import numpy as np

from .designfile import Design, Tolerance, _tolerance_paths, parse_data
from .errors import MISSING, InvalidInput, suggest

__all__ = [
    "DISTRIBUTIONS",
    "Band",
    "Contribution",
    "OutputBand",
    "ToleranceAnalysis",
    "ToleranceInput",
    "analyse",
    "default_outputs",
    "inputs",
    "linear_bands",
    "output_names",
    "perturbed",
]

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
        if t.path == "swing.amplitude" and max(design.amplitudes_rad) + half >= math.pi:
            # past 180 deg there is no swing (and near it the period grows without bound)
            raise InvalidInput(f"tolerance on {t.path}", f"{math.degrees(half):.6g} deg",
                               "a band that keeps every working amplitude below 180 deg",
                               f"the largest amplitude, "
                               f"{math.degrees(max(design.amplitudes_rad)):.6g} deg, would "
                               "reach the inverted position")
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
        (also when they were overridden after reading with :meth:`Design.with_changes`,
        e.g. by ``--gravity``), and so is a point bob replaced by ``--length`` or ``--mass``.
        Other changes made to a ``Design`` after reading are not seen: the file is.

    Notes
    -----
    ``swing.amplitude`` sets the working (first) amplitude: every listed amplitude moves
    by the same amount, each clipped to [0, 180) deg. ``suspension.length`` of a flexible
    suspension moves the parts and named points hung on it by the same amount (a part's
    own position change adds to that). A density set on a part whose file
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
    if design.shorthand and isinstance(data.get("pendulum"), dict):
        # a point bob may have been replaced after reading (--length, --mass, --suspension)
        bob = design.parts[0]
        data["pendulum"].update(length=_si(bob.position, "length"),
                                bob_mass=_si(bob.mass, "mass"),
                                suspension="flexible" if design.suspension.flexible
                                else "rigid")
    # a flexible suspension's length carries what hangs on it: the parts and the named
    # points move down with its end (as sizing lengthens it)
    hung = 0.0
    if "suspension.length" in changes and design.suspension.flexible:
        hung = float(changes["suspension.length"]) - _nominal(design, "suspension.length",
                                                             "length")
    moved = set()
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
            if key == next(p.at for p in design.parts if p.name == name):
                v += hung
                moved.add(name)
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
    if hung and math.isfinite(hung):
        for p in design.parts:
            if p.name not in moved:
                data["part"][_part_index(data, p.name)][p.at] = _si(p.position + hung,
                                                                    "length")
        for t, (_, along, _) in zip(data.get("point") or (), design.points):
            t["along"] = _si(along + hung, "length")
    swing["amplitude"] = [_si(a, "angle") for a in amps]
    try:
        out = parse_data(data, design.source)
    except InvalidInput as exc:
        shown = ", ".join(f"{p} = {float(x):.8g}" for p, x in changes.items())
        where = exc.field.removeprefix(f"{design.source}, ")
        field = f"{design.source}, tolerances" + (f".{next(iter(changes))}"
                                                  if len(changes) == 1 else "")
        raise InvalidInput(field, shown or MISSING, exc.allowed,
                           f"the band reaches a design that is not valid ({where}: "
                           f"{exc.problem or 'invalid value'})") from None
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




# ---------------------------------------------------------------- the full analysis

#: Outputs every design has: the period at the working amplitude and the rate against
#: the target period (or the nominal period when the design gives none).
PERIOD_OUTPUTS = ("period_s", "rate_s_per_day")
DISTRIBUTIONS = ("normal", "uniform")
#: Samples evaluated exactly to check the response surface; its error is flagged above
#: this fraction of the RSS half-width.
CHECK_SAMPLES = 16
SURROGATE_LIMIT = 0.01
_QUANTILES = (0.00135, 0.99865)       # the +-3 sigma points of a normal distribution
_SAMPLES_RANGE = (100, 10_000_000)


@dataclass(frozen=True)
class Contribution:
    """One input's part in an output's band: ``value`` c_i (the output's SI unit; the
    change from the nominal to the upper end of the input's band, first order),
    ``share`` c_i^2 / sum c^2 of the first-order variance, and ``mc_share`` the same
    share estimated from the Monte Carlo samples (squared correlation of input and
    output)."""

    path: str
    value: float
    share: float
    mc_share: float

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class OutputBand:
    """The tolerance band of one output (values in the output's SI unit, named by
    ``key``): nominal; RSS and linear worst-case half-widths; the exact values at the two
    sign corners; the worst case (the wider of the linear and the corner values); the
    Monte Carlo mean, standard deviation, 0.135 % and 99.865 % quantiles and extremes; the
    largest error of the response surface on the exactly evaluated samples."""

    key: str
    nominal: float
    rss: float
    worst_linear: float
    corner_low: float
    corner_high: float
    worst_low: float
    worst_high: float
    mc_mean: float
    mc_std: float
    mc_low: float
    mc_high: float
    mc_min: float
    mc_max: float
    surrogate_error: float
    contributions: tuple

    def to_dict(self) -> dict:
        out = {k: v for k, v in self.__dict__.items() if k != "contributions"}
        out["contributions"] = [c.to_dict() for c in self.contributions]
        return out


@dataclass(frozen=True)
class ToleranceAnalysis:
    """Worst case, root-sum-square and Monte Carlo bands of a design's outputs.

    ``reference_period_s`` is the period the rate is measured against (``reference``
    says which: "target period" or "nominal period"); ``load_amplitude_rad`` the
    amplitude the load peaks are taken at (the largest working amplitude), None when no
    load is analysed; ``evaluations`` the exact re-reads made; ``method`` in words.
    """

    design_name: str
    inputs: tuple
    outputs: tuple
    distribution: str
    samples: int
    seed: int
    reference_period_s: float
    reference: str
    load_amplitude_rad: float | None
    evaluations: int
    check_samples: int
    method: str
    warnings: tuple = ()

    def output(self, key: str) -> OutputBand:
        for o in self.outputs:
            if o.key == key:
                return o
        raise KeyError(key)

    def to_dict(self) -> dict:
        out = {k: v for k, v in self.__dict__.items() if k not in ("inputs", "outputs")}
        out["inputs"] = [i.to_dict() for i in self.inputs]
        out["outputs"] = [o.to_dict() for o in self.outputs]
        out["warnings"] = list(self.warnings)
        return out


def output_names(design: Design) -> tuple:
    """Every output :func:`analyse` can band for ``design``: the period and the rate, the
    load peaks by the names of :func:`swingcalc.loads.peak` (pivot load, arm tension,
    angular speed and acceleration) and each named point's speed and felt accelerations."""
    from .sizing import _POINT_LIMITS, LIMIT_QUANTITIES

    return (PERIOD_OUTPUTS + tuple(LIMIT_QUANTITIES)
            + tuple(f"{p}.{q}" for p, _, _ in design.points for q in _POINT_LIMITS))


def default_outputs(design: Design) -> tuple:
    """A clock's period and rate; for any other design its period and peak pivot load
    (a rate in s/day means nothing for a gate or a damper)."""
    if design.context == "clock":
        return PERIOD_OUTPUTS
    return ("period_s", "reaction_N")


def _check_outputs(design: Design, outputs) -> tuple:
    if outputs is None:
        return default_outputs(design)
    names = output_names(design)
    out = []
    for key in outputs:
        if key not in names:
            raise InvalidInput("quantity", key, ", ".join(names),
                               f"not an output of this design{suggest(key, names)}")
        if key not in out:
            out.append(key)
    if not out:
        raise InvalidInput("quantity", MISSING, ", ".join(names), "no output named")
    return tuple(out)


def _evaluator(outputs: tuple, reference: float):
    from .linear import rate_against
    from .loads import peak
    from .sizing import period_at

    loads = [k for k in outputs if k not in PERIOD_OUTPUTS]

    def evaluate(d: Design) -> dict:
        pend = d.pendulum
        t = period_at(pend, d.amplitudes_rad[0])
        out = {"period_s": t, "rate_s_per_day": rate_against(t, reference)}
        if loads:
            a, points = max(d.amplitudes_rad), d.points_dict()
            for k in loads:
                # only the point the quantity is about: the peak search then skips the rest
                name = k.rsplit(".", 1)[0] if "." in k else None
                mine = {name: points[name]} if name is not None else {}
                out[k] = abs(peak(pend, a, k, mine).value)
        return {k: out[k] for k in outputs}

    return evaluate


def _sample(rng, n: int, m: int, distribution: str):
    """n samples of m inputs in band units (the band is [-1, 1])."""
    if distribution == "uniform":
        return rng.uniform(-1.0, 1.0, size=(n, m))
    u = rng.standard_normal((n, m)) / 3.0
    bad = np.abs(u) > 1.0
    while bad.any():                    # parts outside their band are rejected: redraw
        u[bad] = rng.standard_normal(int(bad.sum())) / 3.0
        bad = np.abs(u) > 1.0
    return u


def analyse(design: Design, outputs=None, tolerances=None, samples: int = 100_000,
            seed: int = 0, distribution: str = "normal") -> ToleranceAnalysis:
    """Worst-case, root-sum-square and Monte Carlo tolerance bands of a design's outputs.

    Parameters
    ----------
    design : Design
        With a ``[tolerances]`` section, or give ``tolerances``.
    outputs : sequence of str, optional
        Names from :func:`output_names`: ``period_s`` (at the working amplitude [s]),
        ``rate_s_per_day`` (86400 (T_ref / T - 1) [s/day], positive when the clock gains,
        T_ref the design's target period or else its nominal period), and load peaks
        such as ``reaction_N`` or ``"bob centre.felt_g"`` (magnitudes at the largest
        working amplitude, in their SI unit; g for felt accelerations). Default:
        :func:`default_outputs`.
    tolerances : sequence of Tolerance, optional
        In place of the design's own.
    samples : int
        Monte Carlo samples, in [100, 1e7].
    seed : int
        Seed of the numpy random generator (the same seed gives the same numbers).
    distribution : str
        ``"normal"``: each input normal with its band at +-3 sigma (common practice in
        tolerance stack-up), truncated at the band's ends (parts outside it are rejected);
        ``"uniform"``: uniform over the band.

    Returns
    -------
    ToleranceAnalysis

    Notes
    -----
    With u_i = (x_i - x0_i) / t_i the position of input i in its band [-1, 1], the exact
    evaluations at u = 0, +-e_i and (+-e_i +- e_j) give the central differences
    g_i = (f(e_i) - f(-e_i)) / 2, H_ii = f(e_i) - 2 f(0) + f(-e_i),
    H_ij = (f(e_i + e_j) - f(e_i - e_j) - f(-e_i + e_j) + f(-e_i - e_j)) / 4
    (2 n^2 + 1 re-reads for n inputs). RSS = sqrt(sum g_i^2) (first-order propagation,
    ISO/IEC Guide 98-3); linear worst case f0 +- sum |g_i|; the sign corners u = +-sign(g)
    are evaluated exactly. Where the output is monotone along every input's band (the
    axis evaluations tell), the corners are the worst case (the linear stack-up would
    overshoot a curved response); otherwise the wider of the two is kept. The Monte Carlo
    samples are evaluated on the response surface f0 + g.u + u.H.u / 2 (vectorised, as an
    exact re-read per sample would take minutes); :data:`CHECK_SAMPLES` of them are also
    evaluated exactly, and a warning is given when the surface is off by more than
    :data:`SURROGATE_LIMIT` of the RSS half-width.

    Raises
    ------
    InvalidInput
        No tolerances, an unknown output (with a "did you mean"), a bad sample count,
        seed or distribution, or a band that takes the design out of its valid range.
    """
    if distribution not in DISTRIBUTIONS:
        raise InvalidInput("distribution", distribution, " or ".join(DISTRIBUTIONS),
                           f"unknown distribution{suggest(distribution, DISTRIBUTIONS)}")
    if (isinstance(samples, bool) or not isinstance(samples, (int, np.integer))
            or not _SAMPLES_RANGE[0] <= samples <= _SAMPLES_RANGE[1]):
        raise InvalidInput("samples", samples, "a whole number in [100, 10000000]")
    if (isinstance(seed, bool) or not isinstance(seed, (int, np.integer)) or seed < 0):
        raise InvalidInput("seed", seed, "a whole number >= 0")
    keys = _check_outputs(design, outputs)
    ins = inputs(design, tolerances)
    if not ins:
        raise InvalidInput("tolerances", MISSING, "a [tolerances] section in the design "
                           "file, e.g. \"part.bob.centre\" = \"0.2 mm\"",
                           "the design has no tolerances")
    from .sizing import period_at

    target = design.target_period_s
    reference = target if target is not None else period_at(design.pendulum,
                                                            design.amplitudes_rad[0])
    evaluate = _evaluator(keys, reference)
    active = [i for i in ins if i.half_width > 0.0]
    m = len(active)
    cache: dict = {}

    def exact(u) -> dict:
        """Outputs at the point u (band units) of the active inputs, exactly."""
        key = tuple(float(x) for x in u)
        if key not in cache:
            changes = {inp.path: inp.nominal + x * inp.half_width
                       for inp, x in zip(active, key) if x != 0.0}
            cache[key] = evaluate(perturbed(design, changes) if changes else design)
        return cache[key]

    def unit(*pairs):
        u = np.zeros(m)
        for i, s in pairs:
            u[i] = s
        return u

    f0 = exact(unit())
    grad = {k: np.zeros(m) for k in keys}
    hess = {k: np.zeros((m, m)) for k in keys}
    axes = []
    for i in range(m):
        hi, lo = exact(unit((i, 1.0))), exact(unit((i, -1.0)))
        axes.append((hi, lo))
        for k in keys:
            grad[k][i] = 0.5 * (hi[k] - lo[k])
            hess[k][i, i] = hi[k] - 2.0 * f0[k] + lo[k]
        for j in range(i):
            pp, pm = exact(unit((i, 1.0), (j, 1.0))), exact(unit((i, 1.0), (j, -1.0)))
            mp, mm = exact(unit((i, -1.0), (j, 1.0))), exact(unit((i, -1.0), (j, -1.0)))
            for k in keys:
                hess[k][i, j] = hess[k][j, i] = 0.25 * (pp[k] - pm[k] - mp[k] + mm[k])
    warnings = []
    for k in keys:
        values = [v[k] for v in cache.values()]
        if not all(_finite(v) for v in values):
            raise InvalidInput(f"tolerance analysis of {k}", MISSING, "bands within which "
                               "the output is defined", "not finite within the bands")

    surface = len(cache)
    rng = np.random.default_rng(int(seed))
    u = _sample(rng, int(samples), m, distribution)
    check = u[:CHECK_SAMPLES]
    exact_checks = [exact(row) for row in check]
    bands = []
    for k in keys:
        g, h = grad[k], hess[k]
        f = f0[k] + u @ g + 0.5 * np.einsum("ij,ij->i", u @ h, u)
        rss = float(math.sqrt(float(g @ g)))
        lin = float(np.sum(np.abs(g)))
        s = np.sign(g)
        c_hi, c_lo = exact(s)[k], exact(-s)[k]
        corner_low, corner_high = min(c_hi, c_lo), max(c_hi, c_lo)
        err = max((abs(e[k] - f[n]) for n, e in enumerate(exact_checks)), default=0.0)
        if rss > 0.0 and err > SURROGATE_LIMIT * rss:
            warnings.append(f"{k}: the response surface is off by {err:.3g} on the exactly "
                            f"evaluated samples, {err / rss:.2%} of the RSS half-width "
                            f"(limit {SURROGATE_LIMIT:.0%}): treat the Monte Carlo figures "
                            "as approximate")
        std = float(np.std(f, ddof=1))
        q_lo, q_hi = (float(x) for x in np.quantile(f, _QUANTILES))
        total = float(g @ g)
        contrib = []
        for n, inp in enumerate(active):
            share = float(g[n] ** 2 / total) if total > 0.0 else 0.0
            if std > 0.0:
                r = float(np.corrcoef(u[:, n], f)[0, 1])
                mc_share = r * r if math.isfinite(r) else 0.0
            else:
                mc_share = 0.0
            contrib.append(Contribution(inp.path, float(g[n]), share, mc_share))
        contrib += [Contribution(i.path, 0.0, 0.0, 0.0) for i in ins if i.half_width == 0.0]
        contrib.sort(key=lambda c: -abs(c.value))
        nominal = float(f0[k])
        # monotone along every input's band: the exact sign corners are the extremes, the
        # linear stack-up overshoots a curved response; otherwise keep the wider of both
        monotone = all((hi_[k] - f0[k]) * (f0[k] - lo_[k]) >= 0.0 for hi_, lo_ in axes)
        worst_low = corner_low if monotone else min(nominal - lin, corner_low)
        worst_high = corner_high if monotone else max(nominal + lin, corner_high)
        bands.append(OutputBand(
            key=k, nominal=nominal, rss=rss, worst_linear=lin, corner_low=float(corner_low),
            corner_high=float(corner_high), worst_low=float(worst_low),
            worst_high=float(worst_high), mc_mean=float(np.mean(f)),
            mc_std=std, mc_low=q_lo, mc_high=q_hi, mc_min=float(np.min(f)),
            mc_max=float(np.max(f)), surrogate_error=float(err),
            contributions=tuple(contrib)))
        if float(np.min(f)) < bands[-1].worst_low or float(np.max(f)) > bands[-1].worst_high:
            warnings.append(f"{k}: Monte Carlo samples fall outside the worst case (the "
                            "response is not monotone over the bands); the worst case is "
                            "not a bound here")
    loads = [k for k in keys if k not in PERIOD_OUTPUTS]
    shape = ("normal, +-3 sigma at the band ends, truncated there" if distribution == "normal"
             else "uniform over the band")
    method = (f"Inputs independent, {shape}. Worst case: the exact values at the two "
              "sign corners (also the linear sum where it is wider and the output is not "
              "monotone along some band). RSS: first-order "
              "propagation, sqrt(sum c_i^2). Monte Carlo: seeded numpy generator, samples "
              "evaluated on a full second-order response surface (central differences of "
              f"{surface} exact evaluations), checked on {len(exact_checks)} samples "
              "evaluated exactly.")
    return ToleranceAnalysis(
        design_name=design.name, inputs=ins, outputs=tuple(bands), distribution=distribution,
        samples=int(samples), seed=int(seed), reference_period_s=float(reference),
        reference="target period" if target is not None else "nominal period",
        load_amplitude_rad=max(design.amplitudes_rad) if loads else None,
        evaluations=len(cache), check_samples=len(exact_checks), method=method,
        warnings=tuple(warnings))
