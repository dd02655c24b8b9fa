"""Start-up stays light: checked in fresh interpreters, since this test process has
imported everything already."""

import json
import os
import subprocess
import sys

HEAVY_FOR_LIBRARY = ("typer", "rich", "pint", "matplotlib", "mpmath", "scipy.integrate")
HEAVY_FOR_CLI = ("pint", "mpmath", "scipy.integrate", "matplotlib")


def _loaded_after(code: str) -> set:
    probe = (code + "\nimport json, sys\n"
             "sys.__stdout__.write('\\nMODULES=' + json.dumps(sorted(sys.modules)))\n")
    env = dict(os.environ, _TYPER_FORCE_DISABLE_TERMINAL="1", COLUMNS="200")
    out = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True,
                         env=env, timeout=120)
    assert out.returncode == 0, out.stderr
    line = out.stdout.rsplit("MODULES=", 1)[1]
    return set(json.loads(line))


def test_import_swingcalc_does_not_load_the_heavy_packages():
    loaded = _loaded_after("import swingcalc")
    assert not [m for m in HEAVY_FOR_LIBRARY if m in loaded]


def _run_cli(args) -> str:
    return ("from swingcalc.cli.app import app\n"
            "try:\n"
            f"    app({list(args)!r}, prog_name='swingcalc')\n"
            "except SystemExit as e:\n"
            "    assert e.code == 0, e.code\n")


def test_cli_with_bare_numbers_does_not_load_pint_or_integrators():
    for fmt in ("table", "json"):
        loaded = _loaded_after(_run_cli(["periods", "--amplitude", "0:90:10", "--length",
                                         "1.5", "--format", fmt]))
        assert not [m for m in HEAVY_FOR_CLI if m in loaded], fmt
        loaded = _loaded_after(_run_cli(["small-angle", "--amplitude", "5, 10",
                                         "--tolerance", "0.1 %", "--format", fmt]))
        assert not [m for m in HEAVY_FOR_CLI if m in loaded], fmt


def test_cli_loads_pint_only_for_a_unit_it_cannot_convert_by_definition():
    """850 mm and 20 degC are converted by definition (SI prefixes, the Celsius offset);
    a furlong needs pint's registry."""
    loaded = _loaded_after(_run_cli(["periods", "--length", "850 mm", "--format", "csv"]))
    assert "pint" not in loaded and "mpmath" not in loaded and "scipy.integrate" not in loaded
    loaded = _loaded_after(_run_cli(["periods", "--length", "0.005 furlong", "--format",
                                     "csv"]))
    assert "pint" in loaded


def test_quantity_module_alone_does_not_load_pint():
    loaded = _loaded_after("from swingcalc.quantity import parse_values\n"
                           "parse_values('0:90:10 deg', 'angle', 'x')")
    assert "pint" not in loaded
