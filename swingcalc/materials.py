"""Built-in materials: density and linear thermal expansion near room temperature.

Each row names its source; "[mem]" marks a value written from memory of that source and
not re-checked against it. Values are typical for the grade named; alloys, heat
treatment, moisture (wood, nylon) and porosity move them, as each row's note says, so a
drawing should quote the supplier's figure when the rate matters. Method note:
``docs/methods/materials.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from types import MappingProxyType

from .errors import InvalidInput, suggest

__all__ = ["MATERIALS", "PHASES", "Material", "material", "material_names"]

#: States of matter a material may be in.
PHASES = ("solid", "liquid")


@dataclass(frozen=True)
class Material:
    """A material's density and thermal expansion near 20 degC.

    Attributes
    ----------
    name : str
        Lower-case plain name (``"steel"``, ``"stainless-304"``).
    density_kg_m3 : float
        [kg/m^3] at about 20 degC.
    expansion_per_K : float
        Mean linear expansion coefficient [1/K] near room temperature (usually the
        20-100 degC mean). For a liquid, one third of its volumetric coefficient.
    source : str
        Where the numbers come from; "[mem]" if written from memory.
    note : str
        How much the values vary, and what else to watch.
    phase : {"solid", "liquid"}
    """

    name: str
    density_kg_m3: float
    expansion_per_K: float
    source: str
    note: str = ""
    phase: str = "solid"

    def __post_init__(self):
        if not isinstance(self.name, str) or not self.name.strip():
            raise InvalidInput("material.name", self.name, "a non-empty name")
        rho = self.density_kg_m3
        if not (isinstance(rho, (int, float)) and math.isfinite(rho) and rho > 0.0):
            raise InvalidInput(f"{self.name}: density_kg_m3", rho, "a finite density > 0 [kg/m^3]")
        alpha = self.expansion_per_K
        if not (isinstance(alpha, (int, float)) and math.isfinite(alpha)
                and -1e-4 <= alpha <= 1e-3):
            raise InvalidInput(f"{self.name}: expansion_per_K", alpha,
                               "a finite linear expansion coefficient in [-1e-4, 1e-3] 1/K")
        if self.phase not in PHASES:
            raise InvalidInput(f"{self.name}: phase", self.phase, " or ".join(PHASES))
        if not (isinstance(self.source, str) and self.source.strip()):
            raise InvalidInput(f"{self.name}: source", self.source,
                               "the source of the values (a handbook, a data sheet)")

    @property
    def volumetric_expansion_per_K(self) -> float:
        """Volumetric expansion coefficient [1/K], 3 alpha (isotropic, first order)."""
        return 3.0 * self.expansion_per_K

    def to_dict(self) -> dict:
        d = dict(self.__dict__)
        d["volumetric_expansion_per_K"] = self.volumetric_expansion_per_K
        return d


_CRC = "CRC Handbook of Chemistry and Physics (density; thermal expansion of the elements) [mem]"
_ASM1 = "ASM Handbook vol. 1, properties of irons and steels [mem]"
_ASM2 = "ASM Handbook vol. 2, properties of nonferrous alloys [mem]"
_WOOD = ("Wood Handbook, USDA Forest Products Laboratory FPL-GTR-190 (2010), ch. 4-5: "
         "specific gravity at 12 % moisture, expansion parallel to the grain [mem]")
_SHEETS = "manufacturers' data sheets [mem]"
_WOOD_NOTE = ("along the grain; density varies +-15 % between trees; across the grain the "
              "expansion is about 10x larger (30-50e-6/K), and moisture changes the length "
              "more than temperature does, so wooden rods are sealed (common practice)")

_ROWS = (
    Material("steel", 7850.0, 11.7e-6, _ASM1,
             "carbon steel (~0.2 % C, e.g. AISI 1020); 10.8-13e-6/K with carbon and alloy "
             "content (REFERENCES.md), 7800-7870 kg/m^3"),
    Material("stainless-304", 8000.0, 17.3e-6, _ASM1 + "; " + _SHEETS,
             "austenitic 18Cr-8Ni; 7900-8000 kg/m^3; 17.3e-6/K is the 0-100 degC mean"),
    Material("cast-iron", 7200.0, 10.5e-6, _ASM1,
             "grey iron; 6950-7350 kg/m^3 and 9-12e-6/K with grade and graphite form"),
    Material("brass", 8500.0, 19.0e-6, _CRC + "; " + _ASM2,
             "CuZn37-CuZn39 clock and engraving brasses; 8400-8750 kg/m^3 and 18.7-20.8e-6/K "
             "by alloy (REFERENCES.md: 18.7-20e-6/K), leaded free-cutting grades highest"),
    Material("bronze", 8800.0, 17.8e-6, _ASM2,
             "tin (phosphor) bronze such as C51000; 8700-8900 kg/m^3, 17-18.5e-6/K"),
    Material("copper", 8960.0, 16.5e-6, _CRC, "pure copper at 20-25 degC"),
    Material("aluminium", 2700.0, 23.1e-6, _CRC,
             "pure aluminium at 25 degC (REFERENCES.md: 23.1e-6/K)"),
    Material("aluminium-6061", 2700.0, 23.6e-6, _ASM2,
             "6061-T6, 20-100 degC mean; other wrought alloys 21-24e-6/K"),
    Material("lead", 11340.0, 28.9e-6, _CRC,
             "pure lead; creeps under sustained load, so lead bobs are cased or supported"),
    Material("zinc", 7140.0, 30.2e-6, _CRC,
             "polycrystalline mean; single crystals are strongly anisotropic (zinc rods were "
             "used with steel in compensated pendulums)"),
    Material("tungsten", 19300.0, 4.5e-6, _CRC,
             "pure tungsten; sintered heavy alloys (W-Ni-Fe) are 17000-18500 kg/m^3, about "
             "5e-6/K"),
    Material("invar", 8050.0, 1.2e-6, _SHEETS,
             "Fe-36Ni, annealed, 20-100 degC (REFERENCES.md: about 1.2e-6/K); 0.6-2e-6/K with "
             "heat treatment and cold work; it grows slowly with age and its expansion rises "
             "steeply above about 200 degC"),
    Material("titanium-6al-4v", 4430.0, 8.6e-6, _ASM2, "Ti-6Al-4V, annealed, 20-100 degC"),
    Material("glass", 2500.0, 9.0e-6, _CRC + "; " + _SHEETS,
             "soda-lime glass; 8.5-9.5e-6/K by composition"),
    Material("fused-silica", 2200.0, 0.55e-6, _SHEETS,
             "vitreous SiO2, 20-100 degC; 0.5-0.6e-6/K"),
    Material("spruce", 450.0, 3.5e-6, _WOOD, _WOOD_NOTE + "; 400-500 kg/m^3"),
    Material("oak", 750.0, 4.5e-6, _WOOD, _WOOD_NOTE + "; 600-900 kg/m^3"),
    Material("concrete", 2400.0, 10e-6,
             "EN 1992-1-1 (Eurocode 2) section 3.1.3 design value [mem]",
             "normal-weight concrete; 2300-2500 kg/m^3, 6-13e-6/K with the aggregate"),
    Material("mercury", 13546.0, 181.0e-6 / 3.0, _CRC,
             "liquid at 20 degC; volumetric expansion 1.81e-4/K (the stored linear value is a "
             "third of it); a column in a jar of linear expansion a_j rises by "
             "(1.81e-4 - 2 a_j) per K, which is what compensates a mercury pendulum",
             phase="liquid"),
    Material("nylon", 1140.0, 80e-6, _SHEETS,
             "PA6 / PA66, dry; 70-100e-6/K; absorbs 2-9 % water, which swells it, and creeps"),
    Material("acetal", 1410.0, 110e-6, _SHEETS,
             "POM homopolymer; 80-120e-6/K by grade and temperature range"),
    Material("polycarbonate", 1200.0, 65e-6, _SHEETS, "65-70e-6/K"),
)

#: Built-in materials by name (read-only).
MATERIALS = MappingProxyType({m.name: m for m in _ROWS})

# Other spellings people type for the same rows.
_ALIASES = {
    "aluminum": "aluminium", "aluminum-6061": "aluminium-6061", "al-6061": "aluminium-6061",
    "carbon-steel": "steel", "mild-steel": "steel", "stainless": "stainless-304",
    "ss304": "stainless-304", "grey-iron": "cast-iron", "gray-iron": "cast-iron",
    "fe-36ni": "invar", "invar-36": "invar", "ti-6al-4v": "titanium-6al-4v",
    "soda-lime-glass": "glass", "quartz-glass": "fused-silica", "silica": "fused-silica",
    "pom": "acetal", "pc": "polycarbonate",
}


def material_names() -> tuple:
    """Names of the built-in materials, in table order."""
    return tuple(MATERIALS)


def _normalise(name: str) -> str:
    return "-".join(name.strip().lower().replace("_", " ").split())


def material(name):
    """The built-in :class:`Material` called ``name`` (case, spaces and underscores ignored).

    Raises
    ------
    InvalidInput
        For an unknown name, with the closest names as a hint.

    Examples
    --------
    >>> material("Stainless 304").density_kg_m3
    8000.0
    """
    allowed = "one of: " + ", ".join(MATERIALS)
    if not isinstance(name, str):
        raise InvalidInput("material", name, allowed, "not a material name")
    key = _normalise(name)
    key = _ALIASES.get(key, key)
    try:
        return MATERIALS[key]
    except KeyError:
        hint = suggest(key, MATERIALS, fallback=_ALIASES)
        raise InvalidInput("material", name, allowed, f"unknown material{hint}") from None
