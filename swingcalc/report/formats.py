"""Report -> text: JSON, CSV, Markdown and plain text. Cautions appear in every format."""

from __future__ import annotations

import csv
import io
import json
import math

from .model import Report

__all__ = ["FORMATS", "render", "to_csv", "to_json", "to_markdown", "to_text"]

#: Format names accepted by :func:`render` ("table" is plain text here; the terminal
#: table with colour is built in ``swingcalc.cli.render``).
FORMATS = ("table", "csv", "json", "markdown")


def to_json(report: Report) -> str:
    """One JSON object, SI values, the unit in every key name, always a ``cautions`` list."""
    return json.dumps(report.to_dict(), indent=2, allow_nan=False, ensure_ascii=False) + "\n"


def _csv_value(value):
    if value is None:
        return ""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, float):
        if math.isnan(value):
            return ""
        if math.isinf(value):
            return "inf" if value > 0 else "-inf"
        return repr(float(value) + 0.0)     # + 0.0: -0.0 becomes 0.0
    return value


def _comment(text) -> str:
    """One raw comment line: '#' first, whatever the text holds (no CSV quoting)."""
    return "# " + " ".join(str(text).splitlines())


def to_csv(report: Report) -> str:
    """Rectangular tables (header of unit-suffixed keys, full-precision SI values).

    The title, inputs, summary, notes, warnings and cautions are comment lines that start
    with ``#`` (``pandas.read_csv(..., comment="#")`` skips them; a spreadsheet shows
    them): ``# input: length_m = 0.994``, ``# caution: ...``. The data tables are proper
    CSV, separated by a blank line.
    """
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    lines = [_comment(report.title)]
    for kind, items in (("input", report.inputs), ("summary", report.summary)):
        lines += [_comment(f"{kind}: {i.key} = {_csv_value(i.value)}") for i in items]
    buf.write("\n".join(lines) + "\n")
    for n, t in enumerate(report.tables):
        if n:
            buf.write("\n")
        w.writerow([c.key for c in t.columns])
        for row in t.rows:
            w.writerow([_csv_value(v) for v in row])
    for kind, texts in (("note", report.notes), ("warning", report.warnings),
                        ("caution", report.cautions)):
        for text in texts:
            buf.write(_comment(f"{kind}: {text}") + "\n")
    return buf.getvalue()


def _md_cell(text: str) -> str:
    return str(text).replace("|", "\\|")


def _md_table(heads, rows) -> list[str]:
    out = ["| " + " | ".join(_md_cell(h) for h in heads) + " |",
           "|" + "|".join("---" for _ in heads) + "|"]
    out += ["| " + " | ".join(_md_cell(c) for c in r) + " |" for r in rows]
    return out


def to_markdown(report: Report) -> str:
    lines = [f"## {report.title}", ""]
    items = report.inputs + report.summary
    if items:
        lines += _md_table(["quantity", "value"], [[i.label, i.shown] for i in items]) + [""]
    for t in report.tables:
        heads, rows = t.text_grid()
        lines += [f"### {t.title}", ""] + _md_table(heads, rows) + [""]
    for text in report.notes:
        lines += [f"**{text}**", ""]
    if report.warnings:
        lines += ["### Warnings", ""] + [f"- {w}" for w in report.warnings] + [""]
    if report.cautions:
        lines += ["### Cautions", ""] + [f"- {c}" for c in report.cautions] + [""]
    return "\n".join(lines)


def _aligned(heads, rows, numeric_from: int = 1) -> list[str]:
    widths = [max(len(str(x)) for x in col) for col in zip(heads, *rows)]

    def fmt(cells):
        return "  ".join(str(c).ljust(w) if j < numeric_from else str(c).rjust(w)
                         for j, (c, w) in enumerate(zip(cells, widths))).rstrip()

    return [fmt(heads), "  ".join("-" * w for w in widths)] + [fmt(r) for r in rows]


def _wrap(prefix: str, text: str, width: int = 88) -> list[str]:
    import textwrap

    return textwrap.wrap(text, width=width, initial_indent=prefix,
                         subsequent_indent=" " * len(prefix)) or [prefix]


def to_text(report: Report) -> str:
    """Plain aligned text (for files and pipes); the same content as the terminal table."""
    lines = [report.title, "=" * len(report.title), ""]
    items = report.inputs + report.summary
    if items:
        width = max(len(i.label) for i in items)
        lines += [f"{i.label.ljust(width)}  {i.shown}" for i in items] + [""]
    for t in report.tables:
        heads, rows = t.text_grid()
        lines += [t.title, ""] + _aligned(heads, rows, 2 if t.transpose else 1) + [""]
    for text in report.notes:
        lines += _wrap("", text) + [""]
    for w in report.warnings:
        lines += _wrap("WARNING: ", w)
    if report.warnings:
        lines.append("")
    if report.cautions:
        lines.append("CAUTION")
        for c in report.cautions:
            lines += _wrap("  - ", c)
        lines.append("")
    return "\n".join(lines)


def render(report: Report, fmt: str) -> str:
    """Text of ``report`` in one of :data:`FORMATS` (``table`` gives plain text)."""
    return {"table": to_text, "csv": to_csv, "json": to_json, "markdown": to_markdown}[fmt](report)
