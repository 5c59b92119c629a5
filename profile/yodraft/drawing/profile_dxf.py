"""The half-profile for CAM: one closed LWPOLYLINE of true lines and arcs (as bulges), no dimensions or hatch.

Origin on the spin axis at datum face B (the outer face): x = z − z_B (negative into the part), y = r.
"""
from __future__ import annotations

from ezdxf.document import Drawing

from ..builder import Resolved
from .outline import add_loop, new_document
from .requests import datum_face_z

__all__ = ["profile_document", "part_profile_document"]


def profile_document(resolved: Resolved) -> Drawing:
    """Model space with the turned half-profile alone on layer ``outline``."""
    d = resolved.design
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}:profile")
    doc.layers.add("outline", color=7, lineweight=50)
    assert resolved.profile is not None
    add_loop(doc.modelspace(), resolved.profile, "outline", dz=-datum_face_z(resolved))
    return doc


def part_profile_document(resolved: Resolved, name: str) -> Drawing:
    """Model space with one further part's profile (a ring) alone on layer ``outline``, on the same
    origin as the body's (the spin axis at datum face B), so the two files overlay as assembled."""
    d = resolved.design
    part = next(p for p in resolved.parts if p.name == name)
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}:{name}-profile")
    doc.layers.add("outline", color=7, lineweight=50)
    add_loop(doc.modelspace(), part.profile, "outline", dz=-datum_face_z(resolved))
    return doc
