"""The ``spec`` command: every format on the bundled designs, files written atomically and
reproducibly, and bad input refused with one line (exit 2) and nothing written.

Sources of the expectations: PRODUCT.md "Interface conventions" (--format, --output and
--force, JSON in SI with the unit in the key, exit 2 with one line for bad input, nothing
half-written) and "Safety cautions" (cautions in every format, standards named by context);
issue 5 "Spec sheet for drawings" (the rows, CSV for CAD, SVG and one-page PDF with the
cautions at its foot, units selectable). The numbers themselves are checked against the
library and outside values in tests/test_spec.py; here they are plumbing (exact equality:
the same computation on the same file).
"""

from __future__ import annotations

import csv
import io
import json

import pytest
from cli_run import assert_bad, run, run_ok

from swingcalc import examples
from swingcalc.designfile import load_design
from swingcalc.spec import spec_rows


def example(name: str) -> str:
    return str(examples.path(name))


def _csv(text: str) -> dict:
    """{key: row} of the quantity rows of a spec CSV (csv module)."""
    rows = list(csv.reader(io.StringIO(text)))
    assert rows[0][:6] == ["section", "quantity", "value", "unit", "+/- RSS",
                           "+/- worst case"]
    return {r[6]: r for r in rows[1:] if r[6]}


def _cautions(text: str) -> list:
    return [r[1] for r in csv.reader(io.StringIO(text)) if r and r[0] == "cautions"]


# Each bundled design, and what its sheet must carry beyond the common rows.
EXPECTED = {
    "long_case_clock.toml": ("rating_rate_s_per_day_per_m", "rating_rate_s_per_day_per_turn",
                             "thermal_rate_s_per_day_per_K",
                             "rate_per_amplitude_s_per_day_per_rad"),
    "workshop_clock.toml": ("rating_rate_s_per_day_per_m", "thermal_rate_s_per_day_per_K"),
    "impact_hammer.toml": ("impact_energy_J", "striking_speed_m_s", "absorbed_energy_J",
                           "centre_of_percussion_m"),
    "garden_swing_seat.toml": ("amplitude_3.slack_margin_rad", "amplitude_3.slack_angle_rad"),
    "playground_seat.toml": ("amplitude_1.slack_margin_rad", "amplitude_1.seat.peak_felt_g"),
    "crane_hook_load.toml": ("amplitude_1.slack_margin_rad", "amplitude_1.bundle.peak_speed_m_s"),
    "gate_arm.toml": ("slack_margin", "amplitude_1.arm tip.peak_speed_m_s"),
    "tower_damper.toml": ("amplitude_1.slack_margin_rad",),
}
COMMON = ("design_name", "revision", "date", "mass_kg", "com_distance_m",
          "inertia_pivot_kg_m2", "equivalent_length_m", "small_angle_period_s",
          "amplitude_1.period_s", "amplitude_1.small_angle_period_error_rel", "amplitude_1.peak_pivot_load_N",
          "amplitude_1.peak_tension_N", "separatrix_energy_J", "over_top_angular_speed_rad_s",
          "amplitude_1.separatrix_margin")


def test_every_bundled_design_has_an_expectation():
    assert set(EXPECTED) == set(examples.names())


@pytest.mark.slow
@pytest.mark.parametrize("name", sorted(EXPECTED))
def test_every_bundled_design_gives_a_sensible_sheet(name):
    """CSV of each design: the common rows, its own rows, no empty value, the cautions,
    and the design's keys exactly (the library's rows, in order)."""
    out, _ = run_ok("spec", example(name), "--format", "csv")
    rows = _csv(out)
    for key in COMMON + EXPECTED[name]:
        assert key in rows and rows[key][2] != "", key
    d = load_design(examples.path(name))
    assert list(rows) == [r.key for r in spec_rows(d)]
    assert len(_cautions(out)) >= 3
    clock = d.context == "clock"
    assert any(k.endswith("clock_rate_s_per_day") for k in rows) == clock
    # beats for a clock, the frequency for anything else
    beat = ("small_angle_beats_per_hour", "amplitude_1.beats_per_hour")
    freq = ("small_angle_frequency_hz", "amplitude_1.frequency_hz")
    for key in beat if clock else freq:
        assert key in rows and rows[key][2] != "", key
    assert not set(freq if clock else beat) & set(rows)


def test_default_is_the_bundled_clock_as_a_terminal_table():
    out, err = run_ok("spec")
    assert "Spec sheet: Long-case clock, seconds pendulum, rev. C" in out
    assert "rate change per turn of the rating nut" in out and "CAUTION" in out
    assert "+/- RSS" in out                       # the clock has [tolerances]
    assert err == ""


def test_formats_carry_the_same_sheet_and_the_cautions():
    """markdown, json and csv of the hammer: each holds the striking speed and the impact
    standards' caution (ISO 148-2, named in PRODUCT.md)."""
    name = example("impact_hammer.toml")
    md, _ = run_ok("spec", name, "--format", "markdown")
    assert "| impact test |" in md and "ISO 148-2" in md
    js = json.loads(run_ok("spec", name, "--format", "json")[0])
    d = load_design(examples.path("impact_hammer.toml"))
    assert js["values"] == {r.key: r.value for r in spec_rows(d)}
    assert any("ISO 148-2" in c for c in js["cautions"])
    rows = _csv(run_ok("spec", name, "--format", "csv")[0])
    assert float(rows["impact_energy_J"][2]) == pytest.approx(js["values"]["impact_energy_J"],
                                                              rel=1e-6)   # 7 digits shown


def test_units_change_the_display_not_the_json():
    """--units inch-pound: CSV in lb/in/lbf; JSON identical to the SI run (display only)."""
    name = example("playground_seat.toml")
    si = _csv(run_ok("spec", name, "--format", "csv")[0])
    ip = _csv(run_ok("spec", name, "--format", "csv", "--units", "inch-pound")[0])
    assert (si["mass_kg"][3], ip["mass_kg"][3]) == ("kg", "lb")
    assert ip["com_distance_m"][3] == "in" and ip["amplitude_1.peak_pivot_load_N"][3] == "lbf"
    assert float(ip["mass_kg"][2]) == pytest.approx(float(si["mass_kg"][2]) / 0.45359237,
                                                    rel=1e-6)
    a = run_ok("spec", name, "--format", "json")[0]
    b = run_ok("spec", name, "--format", "json", "--units", "inch-pound")[0]
    assert a == b


def test_plain_text_file_has_one_line_per_quantity(tmp_path):
    target = tmp_path / "sheet.txt"
    run_ok("spec", example("workshop_clock.toml"), "-o", target)
    lines = target.read_text().splitlines()
    assert lines[0] == "Spec sheet: Workshop regulator, seconds pendulum, rev. A"
    mass = next(line for line in lines if line.startswith("  mass "))
    assert mass.split()[-2:] == ["1.2", "kg"]
    assert "CAUTION" in lines and any("bob moves down" in line for line in lines)


def test_output_file_written_once_then_refused_without_force(tmp_path):
    target = tmp_path / "sheet.csv"
    _, err = run_ok("spec", example("gate_arm.toml"), "--output", target)
    assert "wrote csv spec sheet" in err
    first = target.read_text()
    assert first.startswith("section,quantity,value,unit")
    assert_bad(["spec", example("gate_arm.toml"), "--output", target], "--output",
               "file exists")
    run_ok("spec", example("gate_arm.toml"), "--output", target, "--units", "si-mm",
           "--force")
    assert target.read_text() != first and "mm" in target.read_text()


@pytest.mark.slow
@pytest.mark.parametrize("fmt", ["svg", "pdf"])
def test_vector_files_are_written_and_byte_identical_on_a_second_run(tmp_path, fmt):
    pytest.importorskip("matplotlib", reason="the plot extra (matplotlib) is not installed")
    a, b = tmp_path / f"a.{fmt}", tmp_path / f"b.{fmt}"
    run_ok("spec", example("garden_swing_seat.toml"), "--output", a)        # from the suffix
    run_ok("spec", example("garden_swing_seat.toml"), "--format", fmt, "--output", b)
    data = a.read_bytes()
    assert len(data) > 1000 and data == b.read_bytes()
    assert (b"<svg" in data) if fmt == "svg" else data.startswith(b"%PDF-")
    assert not [p.name for p in tmp_path.iterdir() if p.name.startswith(".")]  # no temp left


@pytest.mark.parametrize("args, words", [
    (["--units", "bogus"], ["--units", "bogus", "si, si-mm, inch-pound"]),
    (["--units", "inch"], ["--units", "did you mean"]),
    (["--format", "svg"], ["--output", "required with --format svg"]),
    (["--format", "pdf"], ["--output", "required with --format pdf"]),
    (["--format", "png"], ["--format", "svg, pdf"]),
    (["--amplitude", "200"], ["--amplitude"]),
    (["--gravity", "-3"], ["--gravity"]),
])
def test_bad_options_exit_2_with_one_line(args, words):
    assert_bad(["spec", *args], *words)


def test_bad_inputs_write_nothing(tmp_path):
    """Each refused run leaves the folder empty (checked before any computing)."""
    assert_bad(["spec", tmp_path / "missing.toml", "--output", tmp_path / "s.csv"],
               "missing.toml")
    assert_bad(["spec", "--units", "bogus", "--output", tmp_path / "s.csv"], "--units")
    assert_bad(["spec", "--output", tmp_path / "s.png"], "--output", ".svg or .pdf")
    assert_bad(["spec", "--output", tmp_path / "nofolder" / "s.pdf"], "--output")
    assert list(tmp_path.iterdir()) == []


def test_vector_format_without_matplotlib_is_one_line(tmp_path, monkeypatch):
    import sys

    monkeypatch.setitem(sys.modules, "matplotlib", None)       # as if not installed
    assert_bad(["spec", "--format", "pdf", "--output", tmp_path / "s.pdf"], "--format",
               "matplotlib", "pip install 'swingcalc[plot]'")
    assert list(tmp_path.iterdir()) == []


def test_other_commands_still_refuse_the_vector_formats(tmp_path):
    """svg/pdf belong to spec only: the other commands list their own four formats."""
    line = assert_bad(["pendulum", "--format", "svg"], "--format",
                      "table, csv, json, markdown")
    assert "pdf" not in line
    assert_bad(["body", "--output", tmp_path / "b.svg"], "--output",
               "a file ending in .csv, .json, .md or .txt")


def test_help_lists_the_command():
    code, out, _ = run("--help")
    assert code == 0 and "spec" in out
    out, _ = run_ok("spec", "--help")
    assert "--units" in out and "inch-pound" in out


def test_a_format_that_contradicts_the_file_name_is_refused(tmp_path):
    """CSV into a file called .svg is a mistake; a .txt file takes any text format."""
    out = tmp_path / "x.svg"
    assert_bad(("spec", "--format", "csv", "-o", out), "--format", "svg")
    assert not out.exists()
    txt = tmp_path / "x.txt"
    run_ok("spec", "--format", "csv", "-o", txt)
    assert ",mass_kg\n" in txt.read_text()
