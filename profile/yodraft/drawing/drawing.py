"""Everything ``build`` writes for a design, rendered in memory: sheet DXF, CAM profile DXF, SVG preview."""
from __future__ import annotations

from ..builder import Resolved
from .notes import SheetData
from .outline import dxf_bytes
from .preview import svg_bytes
from .profile_dxf import profile_document
from .sheet import LAYOUT_NAME, PAPER, sheet_document

__all__ = ["sheet_data", "render_files"]


def sheet_data(resolved: Resolved) -> SheetData:
    """Half mass and runout from the analysis (mass properties and ISO 21940-11 balance)."""
    from ..analysis import analyse

    a = analyse(resolved)
    return SheetData(half_mass_g=a.half.mass_g, runout_mm=a.balance.runout_tolerance_mm,
                     balance_grade=a.balance.grade_mm_s, spin_rate_rpm=a.balance.rpm)


def render_files(resolved: Resolved, stem: str, data: SheetData | None = None) -> dict[str, bytes]:
    """``{file name: bytes}`` for ``<stem>.dxf``, ``<stem>-profile.dxf`` and ``<stem>.svg``."""
    data = data or sheet_data(resolved)
    doc = sheet_document(resolved, data)
    return {
        f"{stem}.dxf": dxf_bytes(doc),
        f"{stem}-profile.dxf": dxf_bytes(profile_document(resolved)),
        f"{stem}.svg": svg_bytes(doc, LAYOUT_NAME, PAPER),
    }
