"""Safety cautions shown with any reported load, adapted to the design's context.

Every format carries them (JSON in its ``cautions`` list); no option hides them.
"""

from __future__ import annotations

from ..designfile import CONTEXTS

__all__ = ["cautions_for"]

_IDEALISED = (
    "Idealised model: rigid parts on a rigid arm or an inextensible suspension, only the "
    "friction and air effects stated (a frictionless pivot unless shown), no flexing, "
    "fatigue or wear, and no dynamic amplification from impacts, jerks or snatch loads; "
    "real loads can be higher.")
_NO_APPROVAL = (
    "These results are no design approval: a licensed engineer must check any part that "
    "carries people or a heavy load, against the governing standards and local regulations.")

_BY_CONTEXT = {
    "clock": (
        "A falling bob or weight can injure: check the suspension spring, the rod and the "
        "case fixing for the full bob weight with a margin.",),
    "ride": (
        "Passenger-carrying devices are governed by their standards, for example ASTM F2291 "
        "and EN 13814 for amusement rides, and by local regulations.",
        "Playground swings are governed by EN 1176 and ASTM F1487 (including seat, chain, "
        "clearance and impact-area rules), and by local regulations.",),
    "gate": (
        "A swinging gate or arm can trap or strike people: machinery-safety rules and local "
        "regulations apply to its guards, stops and speeds.",),
    "impact": (
        "Impact test machines are verified to their own standards, for example ISO 148-2 "
        "and ASTM E23; keep people out of the swing path and fit guards and a latch.",),
    "damper": (
        "Pendulum dampers in buildings and structures are designed and checked under the "
        "structural codes in force; allow for the stops, the fixings and the largest swing.",),
    "load": (
        "Suspended loads and lifting attachments are governed by their standards, for example "
        "EN 13001 and ASME B30.20, and by local regulations; never stand under a suspended load.",),
    "general": (
        "Where people ride or a heavy part swings, the governing standards apply, for example "
        "ASTM F2291 / EN 13814 (amusement rides), EN 1176 / ASTM F1487 (playgrounds), "
        "ISO 148-2 / ASTM E23 (impact test machines), EN 13001 / ASME B30.20 (suspended loads).",),
}


def cautions_for(context: str = "general", loads: bool = True) -> list[str]:
    """The caution texts for a report in ``context``; empty when no load is reported."""
    if not loads:
        return []
    extra = _BY_CONTEXT.get(context if context in CONTEXTS else "general", _BY_CONTEXT["general"])
    return [_IDEALISED, *extra, _NO_APPROVAL]
