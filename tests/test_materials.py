"""The built-in materials table (swingcalc.materials): every row sourced, values inside the
published ranges, look-up with hints.

Ranges are REFERENCES.md's "Air, materials" section [pub: CRC handbook, material data
sheets; use ranges in tests] unless a test says otherwise.
"""

from __future__ import annotations

import doctest
import re

import pytest

import swingcalc
import swingcalc.materials as mat
from swingcalc import InvalidInput

REQUIRED = ("steel", "stainless-304", "cast-iron", "brass", "bronze", "copper",
            "aluminium", "aluminium-6061", "lead", "zinc", "tungsten", "invar",
            "titanium-6al-4v", "glass", "fused-silica", "spruce", "oak", "concrete",
            "mercury", "nylon", "acetal", "polycarbonate")


def test_every_required_material_is_present_with_a_plain_name():
    """The brief's list, names lower-case plain words joined by '-'."""
    for name in REQUIRED:
        assert name in swingcalc.MATERIALS
    for name in swingcalc.MATERIALS:
        assert re.fullmatch(r"[a-z0-9]+(-[a-z0-9]+)*", name), name


def test_every_row_names_its_source_and_says_when_it_is_from_memory():
    """Every row carries a source; none of them was re-checked against the book here, so
    every source is marked [mem] (an honest table cannot fail this silently)."""
    for m in swingcalc.MATERIALS.values():
        assert m.source.strip() and "[mem]" in m.source, m.name
        assert m.phase in mat.PHASES


@pytest.mark.parametrize("name, low, high", [
    ("steel", 10.8e-6, 13e-6),        # REFERENCES.md carbon steel 10.8-13
    ("brass", 18.7e-6, 20e-6),        # REFERENCES.md brass 18.7-20
    ("invar", 1.0e-6, 1.4e-6),        # REFERENCES.md "about 1.2" (20-100 degC): +-0.2
    ("spruce", 3e-6, 5e-6),           # REFERENCES.md wood along the grain 3-5
    ("oak", 3e-6, 5e-6),
])
def test_expansion_inside_the_published_ranges(name, low, high):
    assert low <= swingcalc.material(name).expansion_per_K <= high


def test_aluminium_expansion_is_the_handbook_value():
    """REFERENCES.md: aluminium 23.1e-6/K, printed 3 digits (+-0.05e-6)."""
    assert swingcalc.material("aluminium").expansion_per_K == pytest.approx(23.1e-6, abs=5e-8)


def test_densities_are_in_the_order_every_handbook_gives():
    """Common practice (CRC Handbook densities [mem]): tungsten > mercury > lead > copper >
    brass > steel > titanium > aluminium > glass > water-like plastics > woods; aluminium
    2700 kg/m^3 and copper 8960 kg/m^3 to 1 %."""
    d = {n: m.density_kg_m3 for n, m in swingcalc.MATERIALS.items()}
    order = ["tungsten", "mercury", "lead", "copper", "brass", "steel", "titanium-6al-4v",
             "aluminium", "glass", "acetal", "nylon", "oak", "spruce"]
    assert [d[n] for n in order] == sorted((d[n] for n in order), reverse=True)
    assert d["aluminium"] == pytest.approx(2700.0, rel=0.01)
    assert d["copper"] == pytest.approx(8960.0, rel=0.01)


def test_wood_notes_warn_about_the_grain_and_moisture():
    """Across the grain the expansion is ~10x (the brief; Wood Handbook [mem]); the notes
    must say so, and that density varies."""
    for name in ("spruce", "oak"):
        note = swingcalc.material(name).note
        assert "across the grain" in note and "10x" in note and "moisture" in note


def test_mercury_is_a_liquid_with_its_volumetric_expansion():
    """Mercury's volumetric expansion 1.81e-4/K near 20 degC (CRC Handbook [mem], printed 3
    digits): the row stores a third as the linear value, and 3 alpha gives it back."""
    hg = swingcalc.material("mercury")
    assert hg.phase == "liquid"
    assert hg.volumetric_expansion_per_K == pytest.approx(1.81e-4, abs=5e-7)
    assert hg.density_kg_m3 == pytest.approx(13546.0, rel=1e-3)   # CRC, 20 degC [mem]


def test_lookup_ignores_case_spaces_and_underscores_and_knows_common_spellings():
    assert swingcalc.material("Stainless 304") is swingcalc.MATERIALS["stainless-304"]
    assert swingcalc.material("  CAST_IRON ") is swingcalc.MATERIALS["cast-iron"]
    assert swingcalc.material("aluminum") is swingcalc.MATERIALS["aluminium"]
    assert swingcalc.material("Ti-6Al-4V") is swingcalc.MATERIALS["titanium-6al-4v"]


@pytest.mark.parametrize("typed, hint", [
    ("brsas", "brass"), ("stainles", "stainless-304"), ("alumnium", "aluminium"),
    ("invr", "invar")])
def test_unknown_name_gets_a_did_you_mean_hint(typed, hint):
    with pytest.raises(InvalidInput) as info:
        swingcalc.material(typed)
    assert info.value.field == "material"
    assert f"did you mean '{hint}'" in str(info.value)


def test_nonsense_names_are_refused_without_a_traceback():
    for bad in ("unobtainium", "", None, 3.0):
        with pytest.raises(InvalidInput):
            swingcalc.material(bad)


def test_user_materials_are_validated():
    """A Material built by a caller is checked like any input: finite positive density,
    a plausible expansion, a known phase, a source."""
    ok = swingcalc.Material("my-alloy", 8100.0, 12e-6, "supplier data sheet")
    assert ok.to_dict()["volumetric_expansion_per_K"] == pytest.approx(36e-6, rel=1e-15)
    for kwargs in ({"density_kg_m3": 0.0}, {"density_kg_m3": float("nan")},
                   {"expansion_per_K": 0.1}, {"phase": "gas"}, {"source": " "}):
        args = {"name": "x", "density_kg_m3": 8000.0, "expansion_per_K": 1e-5, "source": "s"}
        args.update(kwargs)
        with pytest.raises(InvalidInput):
            swingcalc.Material(**args)


def test_table_is_read_only():
    with pytest.raises(TypeError):
        swingcalc.MATERIALS["steel"] = None


def test_materials_docstring_examples_run():
    result = doctest.testmod(mat, verbose=False)
    assert result.failed == 0 and result.attempted >= 1
