"""Everything ``build`` writes for a design, rendered in memory: the sheet composed once and written as
DXF, SVG preview and PDF, plus the CAM profile DXF."""
from __future__ import annotations

from ..builder import Resolved
from .compose import compose
from .dxf_sheet import sheet_document
from .notes import SheetData
from .outline import dxf_bytes
from .pdf_sheet import sheet_pdf
from .profile_dxf import part_profile_document, profile_document
from .sheetdata import Sheet
from .svg_sheet import sheet_svg

__all__ = ["sheet_data", "render_files", "compose_sheet"]


def sheet_data(resolved: Resolved) -> SheetData:
    """Half mass and runout from the analysis (mass properties and ISO 21940-11 balance)."""
    from ..analysis import analyse

    a = analyse(resolved)
    return SheetData(half_mass_g=a.half.mass_g, runout_mm=a.balance.runout_tolerance_mm,
                     balance_grade=a.balance.grade_mm_s, spin_rate_rpm=a.balance.rpm)


def compose_sheet(resolved: Resolved, data: SheetData | None = None) -> Sheet:
    """The sheet as data (what is drawn where on paper)."""
    return compose(resolved, data or sheet_data(resolved))


def render_files(resolved: Resolved, stem: str, data: SheetData | None = None) -> dict[str, bytes]:
    """``{file name: bytes}`` for ``<stem>.dxf``, ``<stem>-profile.dxf``, ``<stem>.svg`` and ``<stem>.pdf``; and
    for a half with a ring, ``<stem>-ring.dxf`` (its own sheet), ``<stem>-ring-profile.dxf``, ``<stem>-ring.svg``
    and ``<stem>-ring.pdf``."""
    data = data or sheet_data(resolved)
    sheet = compose_sheet(resolved, data)
    d = resolved.design["design"]
    files = {
        f"{stem}.dxf": dxf_bytes(sheet_document(sheet, resolved)),
        f"{stem}-profile.dxf": dxf_bytes(profile_document(resolved)),
        f"{stem}.svg": sheet_svg(sheet),
        f"{stem}.pdf": sheet_pdf(sheet, title=d["title"] or resolved.design.name, author=d["owner"],
                                       date=d["date"]),
    }
    for part in resolved.parts[1:]:  # a ring: its own sheet, CAM profile and preview
        from .ring_sheet import compose_ring

        ring_sheet = compose_ring(resolved, data, part.name)
        files[f"{stem}-{part.name}.dxf"] = dxf_bytes(sheet_document(ring_sheet, resolved))
        files[f"{stem}-{part.name}-profile.dxf"] = dxf_bytes(part_profile_document(resolved, part.name))
        files[f"{stem}-{part.name}.svg"] = sheet_svg(ring_sheet)
        files[f"{stem}-{part.name}.pdf"] = sheet_pdf(ring_sheet, title=f"{d['title'] or resolved.design.name}: {part.name}",
                                                     author=d["owner"], date=d["date"])
    return files
