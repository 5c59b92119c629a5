"""The half-profile for CAM: one closed LWPOLYLINE of true lines and arcs (as bulges), no dimensions or hatch.

Origin on the spin axis at datum face B (the outer face): x = z − z_B (negative into the part), y = r.
"""
from __future__ import annotations

from ezdxf.document import Drawing

from ..builder import Resolved
from ..geometry import Profile
from .outline import add_loop, model_extents, new_document
from .requests import datum_face_z

__all__ = ["profile_document", "part_profile_document"]


def profile_document(resolved: Resolved) -> Drawing:
    """Model space with the turned half-profile alone on layer ``outline``."""
    d = resolved.design
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}:profile")
    doc.layers.add("outline", color=7, lineweight=50)
    assert resolved.profile is not None
    _loop_alone(doc, resolved.profile, -datum_face_z(resolved))
    return doc


def part_profile_document(resolved: Resolved, name: str) -> Drawing:
    """Model space with one further part's profile (a ring) alone on layer ``outline``, on the same
    origin as the body's (the spin axis at datum face B), so the two files overlay as assembled."""
    d = resolved.design
    part = next(p for p in resolved.parts if p.name == name)
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}:{name}-profile")
    doc.layers.add("outline", color=7, lineweight=50)
    _loop_alone(doc, part.profile, -datum_face_z(resolved))
    return doc


def _loop_alone(doc: Drawing, profile: Profile, dz: float) -> None:
    """The loop in model space, which the file opens on, zoomed to it; finite extents; the one (empty) paper
    layout that a DXF must hold named for what the file is, not left as ezdxf's default."""
    add_loop(doc.modelspace(), profile, "outline", dz=dz)
    z0, r0, z1, r1 = profile.bounds()
    lo, hi = (z0 + dz, r0), (z1 + dz, r1)
    model_extents(doc, lo, hi)
    doc.header["$TILEMODE"] = 1
    doc.set_modelspace_vport(height=(hi[1] - lo[1]) * 1.1, center=((lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2))
    doc.layouts.rename("Layout1", "profile")
