"""``python -m swingcalc``: the same as the ``swingcalc`` command."""

from swingcalc.cli.app import main

main()
