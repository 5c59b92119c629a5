"""Finishes and the material families each suits: anodize on aluminium alloys only, titanium and
stainless steels their own finishes, polymers none.

>>> suits("anodize type II", "titanium alloy"), suits("titanium anodize", "titanium alloy")
(False, True)
"""
from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from ..errors import DesignInputError
from .materials import FAMILIES, lookup_material

__all__ = ["Finish", "FINISHES", "suits", "finishes_for", "check_finish", "callout", "seat_turned_finished"]

_METALS = tuple(f for f in FAMILIES if f != "polymer")


@dataclass(frozen=True)
class Finish:
    """A finish a shop applies after turning, and the material families it is made for."""

    name: str
    families: tuple[str, ...]
    source: str
    #: the specification a finisher works to, named on the sheet ("" where there is none)
    spec: str = ""


def callout(name: str) -> str:
    """How the sheet calls for a finish: its name and the specification it is done to, where there is one.

    >>> callout("anodize type II"), callout("bead blast")
    ('anodize type II per MIL-A-8625', 'bead blast')
    """
    spec = FINISHES[name].spec
    return f"{name} per {spec}" if spec else name


def seat_turned_finished(shop: Mapping[str, Any]) -> str:
    """Why the bearing seat is turned to its finished sizes ("uncoated", "no build-up", "seat masked"), or ""
    when it is turned to pre-coat sizes and the finish brings it to size."""
    thickest = max(shop["coating_thickness"], shop["coating_thickness_max"] or 0.0)
    return ("uncoated" if shop["coating"] == "none" else "no build-up" if thickest == 0
            else "seat masked" if shop["mask_seat"] else "")


FINISHES: dict[str, Finish] = {
    f.name: f
    for f in (
        Finish("none", FAMILIES, "no finish"),
        # sulphuric-acid anodizing converts the aluminium surface itself
        Finish("anodize type II", ("aluminium alloy",), "MIL-A-8625 Type II, aluminium and its alloys",
               "MIL-A-8625"),
        Finish("anodize type III", ("aluminium alloy",), "MIL-A-8625 Type III (hard coat), aluminium and its alloys",
               "MIL-A-8625"),
        Finish("titanium anodize", ("titanium alloy",), "AMS 2488, anodic treatment of titanium and titanium alloys",
               "AMS 2488"),
        Finish("passivate", ("stainless steel",), "ASTM A967, chemical passivation of stainless steel parts",
               "ASTM A967"),
        Finish("electroless nickel", ("copper alloy", "stainless steel"), "ASTM B733, autocatalytic nickel-phosphorus on metal",
               "ASTM B733"),
        # blasting leaves a polymer surface torn rather than matte  # common practice, no published source
        Finish("bead blast", _METALS, "glass-bead blasting of metal surfaces (common practice, no published source)"),
    )
}


def suits(finish: str, family: str) -> bool:
    """Whether ``finish`` is made for a material of ``family``."""
    return family in FINISHES[finish].families


def finishes_for(family: str) -> list[str]:
    """The finishes that suit a material of ``family``, in catalog order."""
    return [f.name for f in FINISHES.values() if family in f.families]


def check_finish(finish: str, material: str, source: str, key: str) -> None:
    """A finish must suit its part's material (anodize on aluminium alloys only, polymers none); else exit 2 at ``key``."""
    m = lookup_material(material)
    if not suits(finish, m.family):
        raise DesignInputError(source, key, f"{finish!r} does not suit {m.name} ({m.family})",
                               f"a finish for {m.family}: " + ", ".join(repr(f) for f in finishes_for(m.family)))
