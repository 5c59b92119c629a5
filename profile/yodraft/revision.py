"""Revision safety: a build record beside each drawing, and the guard that refuses a silent geometry change.

Each build writes ``<stem>.build.json`` next to the drawing (``<stem>`` = name-revision).
It holds the geometry fingerprint — a hash of the half-profile's exact segments and
every feature's resolved dimensions, rounded to 1e-6 mm (or rad) — and a hash of
the inputs. A later build of the same revision whose geometry differs is refused
unless forced: a machinist must never receive a changed part under an old letter.
"""
from __future__ import annotations

import hashlib
import json
import math
import os
import stat
from collections.abc import Mapping
from pathlib import Path
from typing import TYPE_CHECKING, Any

from .errors import YodraftError
from .geometry import Arc

if TYPE_CHECKING:  # pragma: no cover
    from .builder import Resolved

__all__ = ["RevisionConflict", "RECORD_SUFFIX", "DRAWING_SUFFIXES", "NOT_THE_PART", "geometry_fingerprint",
           "part_fingerprint", "inputs_fingerprint", "record", "read_record", "guard"]

RECORD_SUFFIX = ".build.json"
RECORD_MAX_BYTES = 2**20  # a record is a few hundred bytes
#: files whose presence means a drawing of this revision was already issued
DRAWING_SUFFIXES = (".dxf",)
FORMAT = "yodraft build record 1"
_DIGITS = 6  # 1e-6 mm: far below any turned tolerance, far above float noise


class RevisionConflict(YodraftError):
    """A build would overwrite a drawing of the same revision with different geometry (exit 1)."""

    exit_code = 1

    def __init__(self, path: Path, reason: str) -> None:
        self.path = Path(path)
        self.reason = reason
        super().__init__(str(path), reason)

    def __str__(self) -> str:
        return (f"{self.path}: {self.reason}; bump design.revision (and add a [[revisions]] entry) "
                "or pass --force to overwrite")


def _canon(value: Any) -> Any:
    """JSON-ready, with floats rounded so that float noise does not change a hash."""
    if isinstance(value, bool) or value is None or isinstance(value, (int, str)):
        return value
    if isinstance(value, float):
        r = round(value, _DIGITS)
        return 0.0 if r == 0 else r  # -0.0 and 0.0 alike
    if isinstance(value, Mapping):
        return {str(k): _canon(v) for k, v in sorted(value.items(), key=lambda kv: str(kv[0]))}
    if isinstance(value, (list, tuple, frozenset, set)):
        items = [_canon(v) for v in value]
        return sorted(items, key=repr) if isinstance(value, (set, frozenset)) else items
    return str(value)


def _sha(data: Any) -> str:
    text = json.dumps(data, sort_keys=True, separators=(",", ":"), ensure_ascii=True)
    return hashlib.sha256(text.encode("ascii")).hexdigest()


def _segment(seg: Any) -> list[Any]:
    if isinstance(seg, Arc):  # centre, radius, start and sweep fix it exactly
        start = math.atan2(math.sin(seg.start_angle), math.cos(seg.start_angle))
        return ["arc", _canon(list(seg.center)), _canon(seg.radius), _canon(start), _canon(seg.sweep)]
    return ["line", _canon(list(seg.start)), _canon(list(seg.end))]


def geometry_fingerprint(resolved: "Resolved") -> str:
    """SHA-256 of the half-profile segments and every feature's resolved dimensions.

    Equal for designs that draw the same part, whatever the file's wording or units.
    """
    segments = [_segment(s) for s in resolved.profile.segments] if resolved.profile is not None else None
    dims = {name: {k: v for k, v in f.dims.items()} for name, f in resolved.features.items()}
    return _sha({"profile": segments, "dimensions": _canon(dims)})


#: settings that do not describe the part a machinist turns: the title-block people, title and date,
#: the target mass, and the analysis settings that reach only the report (the spin rate and balance
#: grade do reach the sheet: they set the runout tolerance)
NOT_THE_PART = frozenset({"design.title", "design.owner", "design.identification", "design.creator", "design.approver",
                          "design.date", "envelope.target_mass", "analysis.drag_torque", "analysis.rim_radius_ratio"})


def part_fingerprint(resolved: "Resolved") -> str:
    """SHA-256 of everything the sheet says about the part: the geometry (as ``geometry_fingerprint``) and every
    setting read — material, bearing, shop settings (tolerances, finish, roughness, edge break), balance grade —
    except ``NOT_THE_PART``. Equal whatever the file's wording or units.
    """
    d = resolved.design
    settings = {f"{section}.{key}": value for section, table in d.sections.items() for key, value in table.items()
                if f"{section}.{key}" not in NOT_THE_PART}
    settings.update({f"features.{name}.{key}": value for name, table in d.features.items() for key, value in table.items()})
    return _sha({"geometry": geometry_fingerprint(resolved), "settings": _canon(settings)})


def inputs_fingerprint(resolved: "Resolved") -> str:
    """SHA-256 of the parsed design file (comments and layout do not count)."""
    return _sha(_canon(dict(resolved.design.raw)))


def record(resolved: "Resolved") -> dict[str, Any]:
    """The build record written beside the drawing."""
    from . import __version__

    d = resolved.design
    return {"format": FORMAT, "design": d.name, "revision": d.revision,
            "geometry_sha256": geometry_fingerprint(resolved), "part_sha256": part_fingerprint(resolved),
            "inputs_sha256": inputs_fingerprint(resolved),
            "revisions": [{"letter": r.letter, "date": r.date, "note": r.note} for r in d.revisions],
            "yodraft": __version__}


def read_record(directory: Path, stem: str) -> dict[str, Any] | None:
    """The build record of ``stem`` in ``directory``, or None when there is none (or it is unreadable)."""
    path = Path(directory) / f"{stem}{RECORD_SUFFIX}"
    try:
        if not stat.S_ISREG(os.stat(path).st_mode):  # a pipe planted under the record's name would hang the read
            return None
        with path.open("rb") as handle:
            data = json.loads(handle.read(RECORD_MAX_BYTES).decode("utf-8"))
    except (OSError, ValueError):
        return None
    return data if isinstance(data, dict) else None


def guard(directory: Path, stem: str, resolved: "Resolved", force: bool = False) -> dict[str, bytes]:
    """Refuse (RevisionConflict) to overwrite a drawing of this revision whose geometry differs.

    Returns the build record as ``{filename: bytes}`` for the caller to write with the drawings.
    A drawing found without a readable record is refused too: its geometry cannot be compared.
    """
    rec = record(resolved)
    data = (json.dumps(rec, indent=2, sort_keys=True) + "\n").encode("utf-8")
    out = {f"{stem}{RECORD_SUFFIX}": data}
    if force:
        return out
    directory = Path(directory)
    drawings = [directory / f"{stem}{s}" for s in DRAWING_SUFFIXES if (directory / f"{stem}{s}").exists()]
    if not drawings:
        return out
    old = read_record(directory, stem)
    if old is None or not isinstance(old.get("geometry_sha256"), str):
        raise RevisionConflict(drawings[0], f"a drawing of revision {resolved.design.revision} exists with no "
                               "build record, so a geometry change cannot be ruled out")
    if old["geometry_sha256"] != rec["geometry_sha256"]:
        raise RevisionConflict(drawings[0], f"the geometry differs from the drawing already issued as revision "
                               f"{resolved.design.revision}")
    if "part_sha256" in old and old["part_sha256"] != rec["part_sha256"]:  # records before 0.2 hold geometry only
        raise RevisionConflict(drawings[0], "the material, a tolerance, the finish or another note on the sheet differs "
                               f"from the drawing already issued as revision {resolved.design.revision}")
    return out
