"""yodraft: resolve, check and draw the half-profile of a ball-bearing yo-yo.

>>> import yodraft
>>> resolved = yodraft.build(yodraft.loads(yodraft.EXAMPLE))
>>> round(resolved["bearing_seat.gap"], 4)
4.3625
>>> yodraft.analyse(resolved).assembly.total_g > 2 * yodraft.analyse(resolved).half.mass_g
True
"""
from __future__ import annotations

__version__ = "0.1.0"

from .analysis import Analysis, analyse
from .builder import Resolved, build
from .checks import Check
from .design import Design, load, loads
from .errors import CheckFailure, DesignInputError, YodraftError
from .geometry import Arc, Line, Profile
from .summary import summary

__all__ = ["__version__", "load", "loads", "build", "analyse", "summary", "Analysis", "Design", "Resolved", "Check", "Profile", "Line",
           "Arc", "YodraftError", "DesignInputError", "CheckFailure", "EXAMPLE"]

#: the smallest design file: everything else takes its default
EXAMPLE = """
[design]
name = "example"
[envelope]
diameter = "56 mm"
width = "44 mm"
"""
