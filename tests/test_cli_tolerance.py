"""The ``tolerance`` command: every format runs, the JSON numbers are the library's, the
cautions follow the context when loads are shown, and bad input gives one line.

Sources of the expectations: PRODUCT.md "Interface conventions" (--format on every
command, JSON one object with SI values, --output atomic and never overwriting without
--force, bad input exit 2 with one line) and "Safety cautions" (loads carry the cautions
of the design's context, EN 1176 / ASTM F2291 for rides, in every format). The number
checks are PLUMBING: the CLI against the library called directly on the same file, exact
equality (JSON writes repr-exact floats and both sides run the same computation with the
same seed); the physics is checked in tests/test_tolerance.py.
"""

from __future__ import annotations

import csv
import io
import json

import pytest
from cli_run import assert_bad, run, run_ok

from swingcalc import examples
from swingcalc.designfile import load_design, parse_design
from swingcalc.tolerance import analyse

CLOCK = str(examples.path("long_case_clock.toml"))
FAST = ("--samples", "2000")

SWING_TOLERANCES = """
[tolerances]
"pendulum.bob_mass" = "10 %"
"pendulum.length" = "20 mm"
"""


@pytest.fixture
def swing_file(tmp_path):
    path = tmp_path / "swing.toml"
    path.write_text(examples.path("garden_swing_seat.toml").read_text() + SWING_TOLERANCES)
    return path


@pytest.mark.parametrize("fmt", ["table", "csv", "json", "markdown"])
def test_every_format_runs_on_the_bundled_clock(fmt):
    out, _ = run_ok("tolerance", *FAST, "--format", fmt)
    if fmt == "json":
        d = json.loads(out)
        assert d["command"] == "tolerance"
        assert {r["output"] for r in d["tables"]["bands"]} == {"period_s", "rate_s_per_day"}
        assert d["cautions"] == []            # a clock, no load shown
    elif fmt == "csv":
        rows = list(csv.reader(io.StringIO(out)))
        assert ["input", "kind", "nominal", "half_width", "unit"] in rows
        assert any(r and r[0] == "part.bob.centre" for r in rows)
    elif fmt == "markdown":
        assert out.startswith("## Tolerance analysis: Long-case clock")
        assert "### Inputs ranked by contribution" in out
    else:
        assert "Tolerance analysis: Long-case clock" in out
        assert "RSS +- half-width" in out and "part.bob.centre" in out


def test_json_numbers_equal_the_library(swing_file):
    """Same file, same seed and sample count: the same floats."""
    out, _ = run_ok("tolerance", swing_file, "--samples", "5000", "--seed", "9",
                    "--distribution", "uniform", "--format", "json")
    d = json.loads(out)
    lib = analyse(load_design(swing_file), samples=5000, seed=9, distribution="uniform")
    bands = {r["output"]: r for r in d["tables"]["bands"]}
    assert list(bands) == ["period_s", "reaction_N"]
    for o in lib.outputs:
        row = bands[o.key]
        for key in ("nominal", "worst_low", "worst_high", "worst_linear", "corner_low",
                    "corner_high", "rss", "mc_mean", "mc_std", "mc_low", "mc_high",
                    "mc_min", "mc_max", "surrogate_error"):
            assert row[key] == getattr(o, key), (o.key, key)
    got = [(r["output"], r["input"], r["contribution"], r["share"])
           for r in d["tables"]["contributions"]]
    assert got == [(o.key, c.path, c.value, c.share) for o in lib.outputs
                   for c in o.contributions]
    assert [(r["input"], r["nominal"], r["half_width"]) for r in d["tables"]["inputs"]] == [
        (i.path, i.nominal, i.half_width) for i in lib.inputs]
    assert d["summary"]["reference_period_s"] == lib.reference_period_s
    assert d["inputs"]["samples"] == 5000 and d["inputs"]["seed"] == 9


@pytest.mark.parametrize("fmt", ["table", "csv", "json", "markdown"])
def test_loads_bring_the_rides_cautions_in_every_format(swing_file, fmt):
    """A ride (the garden swing, whose default outputs include the pivot load): the rides
    and playgrounds standards, in every format."""
    out, _ = run_ok("tolerance", swing_file, "--samples", "100", "--format", fmt)
    if fmt == "json":
        cautions = json.loads(out)["cautions"]
        assert any("EN 1176" in c for c in cautions)
        assert any("ASTM F2291" in c for c in cautions)
    else:
        assert "EN 1176" in out and "ASTM F2291" in out


def test_a_clock_with_a_load_asked_for_gets_the_clocks_caution():
    clock = json.loads(run_ok("tolerance", "--quantity", "period_s, reaction_N",
                              "--samples", "100", "--format", "json")[0])
    assert any("falling bob" in c for c in clock["cautions"])


def test_quantity_gravity_and_the_rate_reference():
    """--gravity applies to the analysis (the nominal period is the library's on the
    design with that gravity); --quantity picks and orders the outputs."""
    out, _ = run_ok("tolerance", "--quantity", "rate_s_per_day, bob centre.felt_g",
                    "--gravity", "9.81", *FAST, "--format", "json")
    d = json.loads(out)
    assert d["inputs"]["gravity_m_s2"] == 9.81
    assert [r["output"] for r in d["tables"]["bands"]] == ["rate_s_per_day",
                                                           "bob centre.felt_g"]
    design = parse_design(examples.text(), "clock").with_changes(gravity=9.81,
                                                                  gravity_given="9.81")
    lib = analyse(design, ["rate_s_per_day"], samples=2000)
    assert d["tables"]["bands"][0]["nominal"] == lib.outputs[0].nominal
    assert d["tables"]["bands"][0]["rss"] == lib.outputs[0].rss


def test_output_file_and_no_overwrite_without_force(tmp_path):
    target = tmp_path / "bands.csv"
    code, out, err = run("tolerance", *FAST, "--output", target)
    assert code == 0 and out == "" and "wrote csv report" in err
    first = target.read_text()
    assert first.startswith("# Tolerance analysis")
    assert_bad(["tolerance", *FAST, "--output", target], "exists")
    assert target.read_text() == first
    run_ok("tolerance", *FAST, "--output", target, "--force")


def test_a_design_without_tolerances_says_how_to_add_them():
    gate = str(examples.path("gate_arm.toml"))
    assert_bad(["tolerance", gate], "gate_arm.toml", "no tolerances", "[tolerances]",
               '"part.bob.centre" = "0.2 mm"')


@pytest.mark.parametrize("args, words", [
    (["--quantity", "period"], ["--quantity", "did you mean 'period_s'"]),
    (["--quantity", "bob center.felt_g"], ["--quantity", "bob centre.felt_g"]),
    (["--quantity", "period_s,,rate_s_per_day"], ["--quantity", "empty name"]),
    (["--samples", "5"], ["--samples", "[100, 10000000]"]),
    (["--samples", "1e5.5"], ["--samples"]),
    (["--samples", "2.5"], ["--samples", "whole number"]),
    (["--seed", "-1"], ["--seed", "out of range"]),
    (["--distribution", "gauss"], ["--distribution", "normal or uniform"]),
    (["--format", "pdf"], ["--format", "unknown format"]),
    (["--gravity", "fast"], ["--gravity"]),
])
def test_bad_options_give_one_line(args, words):
    assert_bad(["tolerance", *args], *words)


def test_a_band_that_breaks_the_design_gives_one_line(tmp_path):
    """A 100 % density band reaches a bob of zero density at its lower end."""
    path = tmp_path / "clock.toml"
    path.write_text(examples.text().replace('"part.bob.density" = "1 %"',
                                            '"part.bob.density" = "100 %"'))
    assert_bad(["tolerance", path, *FAST], "part.bob.density", "not valid")
