"""The command-line reference (``docs/cli.md``), generated from the app itself.

Walks the command tree and writes each command's help, arguments and options (metavar,
default, help text) as Markdown. Plain text only: no terminal width, no rich markup, no
dates, so the same code gives the same file. Regenerate with::

    python -m swingcalc.cli.reference > docs/cli.md
"""

from __future__ import annotations

import inspect
import sys

__all__ = ["reference"]

_HEADER = """\
# Command-line reference

Generated from the app by `python -m swingcalc.cli.reference > docs/cli.md`; do not edit
by hand (`tests/test_docs.py` fails when this file is stale). Every command also takes
`-h`/`--help`. Values take units (`850 mm`, `30 deg`); a bare number is SI, except angles,
which are degrees. Worked examples: [examples/](examples/); the design-file format:
[design-files.md](design-files.md).
"""


def _paragraphs(text: str | None) -> list[str]:
    """The help text as paragraphs, each on one line (so the Markdown does not depend on
    how the docstring was wrapped)."""
    if not text:
        return []
    text = inspect.cleandoc(text)
    return [" ".join(p.split()) for p in text.split("\n\n") if p.strip()]


def _cell(text: str) -> str:
    return " ".join(str(text).split()).replace("|", "\\|")


def _code(text: str) -> str:
    return f"`{text}`" if text else ""


def _default(param) -> str:
    if getattr(param, "is_flag", False):
        return "off" if not param.default else "on"
    default = param.default
    if default is None or default == () or callable(default):
        return ""
    return _code(str(default))


def _names(param) -> str:
    return ", ".join(_code(o) for o in sorted(param.opts + param.secondary_opts,
                                             key=lambda o: (not o.startswith("--"), o)))


def _usage(command, ctx) -> str:
    pieces = command.collect_usage_pieces(ctx)
    return " ".join([ctx.command_path, *pieces])


def _params(command) -> list[str]:
    args = [p for p in command.params if p.param_type_name == "argument"]
    opts = [p for p in command.params if p.param_type_name == "option"]
    lines: list[str] = []
    if args:
        lines += ["| Argument | Help |", "|---|---|"]
        for p in args:
            name = p.metavar or p.name.upper()
            lines.append(f"| {_code(name)} | {_cell(getattr(p, 'help', '') or '')} |")
        lines.append("")
    if opts:
        lines += ["| Option | Value | Default | Help |", "|---|---|---|---|"]
        for p in opts:
            value = "" if p.is_flag else _code(p.metavar or p.name.upper())
            lines.append(f"| {_names(p)} | {value} | {_default(p)} | "
                         f"{_cell(p.help or '')} |")
        lines.append("")
    return lines


def _section(command, ctx, level: int) -> list[str]:
    lines = [f"{'#' * level} `{ctx.command_path}`", "",
             f"Usage: `{_usage(command, ctx)}`", ""]
    for p in _paragraphs(command.help):
        lines += [p, ""]
    return lines + _params(command)


def reference() -> str:
    """The Markdown reference of every ``swingcalc`` command, in the order of ``--help``."""
    import typer.main

    from .app import PROG, app

    root = typer.main.get_command(app)
    root_ctx = root.context_class(root, info_name=PROG)
    names = root.list_commands(root_ctx)
    lines = [_HEADER, "## Commands", ""]
    for name in names:
        command = root.get_command(root_ctx, name)
        first = _paragraphs(command.help)
        summary = first[0] if first else ""
        lines.append(f"- [`{name}`](#{PROG}-{name}): {summary}")
    lines.append("")
    lines += _section(root, root_ctx, 2)
    for name in names:
        command = root.get_command(root_ctx, name)
        ctx = command.context_class(command, info_name=name, parent=root_ctx)
        lines += _section(command, ctx, 2)
    return "\n".join(lines).rstrip("\n") + "\n"


if __name__ == "__main__":  # pragma: no cover
    sys.stdout.write(reference())
