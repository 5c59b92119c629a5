"""The section of one half at 1:1 in model space: the loop and its mirror on ``outline``, the axis as a centre line."""
from __future__ import annotations

import datetime
import io
import uuid

import ezdxf
from ezdxf.document import Drawing
from ezdxf.layouts import BaseLayout
from ezdxf.tools.juliandate import juliandate

from ..builder import Resolved
from ..geometry import Arc, Profile

__all__ = ["add_loop", "outline_document", "dxf_bytes", "new_document"]

LAYER_OUTLINE = "outline"
LAYER_CENTRE = "centre"


def new_document(date: str, identity: str) -> Drawing:
    """An R2013 drawing in millimetres whose header dates come from ``date`` and whose GUIDs
    come from ``identity``, so the same design always gives the same bytes."""
    doc = ezdxf.new("R2013", units=ezdxf.units.MM, setup=False)
    doc.header["$MEASUREMENT"] = 1
    stamp = juliandate(datetime.datetime.fromisoformat(date))
    fingerprint = "{" + str(uuid.uuid5(uuid.NAMESPACE_URL, "yodraft:" + identity)).upper() + "}"
    version = "{" + str(uuid.uuid5(uuid.NAMESPACE_URL, "yodraft:version:" + identity)).upper() + "}"
    update = doc._update_metadata  # ezdxf stamps the time of writing here; we stamp the design's date

    def fixed_metadata() -> None:
        update()
        # ezdxf adds a CLASS for each entity type in use from a set, whose order follows the hash seed
        doc.classes.classes = dict(sorted(doc.classes.classes.items()))
        for var in ("$TDCREATE", "$TDUCREATE", "$TDUPDATE", "$TDUUPDATE"):
            doc.header[var] = stamp
        doc.header["$TDINDWG"] = 0.0
        doc.header["$TDUSRTIMER"] = 0.0
        doc.header["$FINGERPRINTGUID"] = fingerprint
        doc.header["$VERSIONGUID"] = version
        meta = doc.ezdxf_metadata()
        for key in ("CREATED_BY_EZDXF", "WRITTEN_BY_EZDXF"):
            meta[key] = f"ezdxf {ezdxf.__version__}"

    doc._update_metadata = fixed_metadata  # type: ignore[method-assign]
    return doc


def model_extents(doc: Drawing, lo: tuple[float, float], hi: tuple[float, float]) -> None:
    """Model space's extents and limits (ezdxf copies them into the header when it writes)."""
    msp = doc.modelspace()
    msp.dxf.extmin, msp.dxf.extmax = (*lo, 0.0), (*hi, 0.0)
    msp.dxf.limmin, msp.dxf.limmax = lo, hi


def add_loop(layout: BaseLayout, profile: Profile, layer: str, dz: float = 0.0) -> None:
    """A closed LWPOLYLINE of the loop (x = z + dz, y = r), arcs as bulges."""
    points = []
    for seg in profile.segments:
        bulge = seg.bulge if isinstance(seg, Arc) else 0.0
        points.append((seg.start[0] + dz, seg.start[1], 0.0, 0.0, bulge))
    layout.add_lwpolyline(points, format="xyseb", close=True, dxfattribs={"layer": layer})


def outline_document(resolved: Resolved) -> Drawing:
    """Model space with the half-section at 1:1 and its mirror about the spin axis."""
    d = resolved.design
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}")
    doc.layers.add(LAYER_OUTLINE, color=7, lineweight=50)
    doc.layers.add(LAYER_CENTRE, color=1, linetype="CENTER", lineweight=25)
    msp = doc.modelspace()
    profile = resolved.profile
    assert profile is not None
    add_loop(msp, profile, LAYER_OUTLINE)
    add_loop(msp, profile.mirrored(), LAYER_OUTLINE)
    z_max = profile.bounds()[2]
    msp.add_line((-3.0, 0.0), (z_max + 3.0, 0.0), dxfattribs={"layer": LAYER_CENTRE})
    return doc


def dxf_bytes(doc: Drawing) -> bytes:
    """The drawing as DXF bytes."""
    stream = io.StringIO()
    doc.write(stream)
    return stream.getvalue().encode("utf-8")
