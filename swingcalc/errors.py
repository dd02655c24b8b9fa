"""Error classes.

Every error the library raises on purpose is a :class:`SwingcalcError`. Errors about
what a caller passed in also subclass :class:`ValueError`, carry the offending field and
value, and build their one-line message once, so a command-line front end can print it
as it is.
"""

from __future__ import annotations

__all__ = ["SwingcalcError", "InvalidInput", "SolverFailure", "MISSING", "suggest"]


class _Missing:
    def __repr__(self) -> str:
        return "MISSING"


#: Stands for an absent input in :class:`InvalidInput` (so no "(got ...)" is shown).
MISSING = _Missing()


class SwingcalcError(Exception):
    """Base class of every error swingcalc raises on purpose."""


class InvalidInput(SwingcalcError, ValueError):
    """An input is outside what the model allows.

    Parameters
    ----------
    field : str
        Name of the input as the caller knows it (``"amplitude"``, ``"--length"``,
        ``"design.toml: swing.amplitude"``).
    value : object
        The offending value, as given, or :data:`MISSING` when the input is absent
        (the message then shows no value).
    allowed : str
        What would have been accepted, in words (``"a finite angle in [0, 180) deg"``).
    problem : str, optional
        What was wrong, when that is not obvious from ``allowed``.
    """

    def __init__(self, field: str, value: object, allowed: str, problem: str | None = None):
        self.field = field
        self.value = value
        self.allowed = allowed
        self.problem = problem
        if value is MISSING:
            head = f"{field}: {problem or 'missing'}"
        elif problem:
            head = f"{field}: {problem} (got {_short(value)})"
        else:
            head = f"{field}: invalid value {_short(value)}"
        super().__init__(f"{head}; allowed: {allowed}")

    def renamed(self, field: str) -> "InvalidInput":
        """Return the same error reported against another field name (CLI option, file path)."""
        return InvalidInput(field, self.value, self.allowed, self.problem)


class SolverFailure(SwingcalcError, RuntimeError):
    """A numerical method did not converge; the message says which and where."""


def _short(value: object, limit: int = 60) -> str:
    text = repr(value)
    return text if len(text) <= limit else text[: limit - 3] + "..."


def suggest(word, choices, fallback=()) -> str:
    """``"; did you mean 'x'?"`` for the closest of ``choices`` (then of ``fallback``), or ``""``.

    A match that differs only in case wins outright; otherwise up to three close matches
    are offered.
    """
    import difflib

    word = str(word)
    pool = list(choices)
    exact = [c for c in pool if c.lower() == word.lower()]
    if exact:
        return f"; did you mean '{exact[0]}'?"
    close = difflib.get_close_matches(word, pool, n=3, cutoff=0.5)
    if not close and fallback:
        close = difflib.get_close_matches(word, list(fallback), n=3, cutoff=0.75)
    if not close:
        return ""
    return "; did you mean " + " or ".join(f"'{c}'" for c in close) + "?"
