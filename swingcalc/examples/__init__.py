"""Bundled design files (invented scenarios), read with :func:`swingcalc.designfile.load_design`."""

from __future__ import annotations

from importlib import resources

__all__ = ["DEFAULT", "names", "path", "text"]

#: The design the main command runs when no file is given.
DEFAULT = "long_case_clock.toml"


def names() -> list[str]:
    """File names of the bundled designs."""
    return sorted(p.name for p in resources.files(__name__).iterdir()
                  if p.name.endswith(".toml"))


def text(name: str = DEFAULT) -> str:
    """The TOML text of a bundled design."""
    return resources.files(__name__).joinpath(name).read_text(encoding="utf-8")


def path(name: str = DEFAULT):
    """A path-like handle to a bundled design (inside the installed package)."""
    return resources.files(__name__).joinpath(name)
