"""Pictures a designer looks at: the assembled yo-yo, two designs overlaid, sweep plots (SVG, our own small writer).

Each module renders one picture from resolved designs to SVG bytes, in memory and
deterministically; the CLI and ``release.build_outputs`` write them.
"""
from __future__ import annotations

from .assembly import assembly_svg

__all__ = ["assembly_svg"]
