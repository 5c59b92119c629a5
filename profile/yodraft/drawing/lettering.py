"""The sheet's lettering: one font (DejaVu Sans), its metrics, and the box every text takes on paper.

DejaVu Sans is installed with most Linux desktops and many programs; where it is missing, Bitstream Vera
Sans (shipped with the PDF library, the face DejaVu Sans grew from, with the same advance widths) measures
and embeds the same. Widths are measured with it and with Helvetica's metrics (the common substitute for a
missing sans), the wider of the two taken and a margin added, so a reader that substitutes a font still
finds each text inside the room the layout gave it.
"""
from __future__ import annotations

import os
import struct
from dataclasses import dataclass, field
from functools import lru_cache
from pathlib import Path

from .ttf_metrics import FontMetrics, estimate, from_tables

__all__ = ["FONT_FILE", "FONT_FAMILY", "Lettering", "lettering", "WIDTH_MARGIN", "PITCH"]

FONT_FILE = "DejaVuSans.ttf"
FONT_FAMILY = "DejaVu Sans"
WIDTH_MARGIN = 1.04  # room kept over the widest measured width
PITCH = 1.5  # baseline to baseline of stacked lines, per cap height
_FONT_DIRS = ("/usr/share/fonts", "/usr/local/share/fonts", "~/.local/share/fonts", "~/.fonts", "/Library/Fonts",
              "/System/Library/Fonts", "~/Library/Fonts", os.path.join(os.environ.get("WINDIR", "C:/Windows"), "Fonts"))


def _find(name: str) -> Path | None:
    for folder in _FONT_DIRS:
        root = Path(folder).expanduser()
        if not root.is_dir():
            continue
        for sub in ("", "truetype/dejavu", "dejavu", "TTF", "dejavu-sans-fonts"):  # where distributions put it
            direct = root / sub / name
            if direct.is_file():
                return direct
        for dirpath, _, files in os.walk(root):
            if name in files:
                return Path(dirpath) / name
    return None


def _vera() -> Path | None:
    try:
        import reportlab
    except ImportError:  # pragma: no cover - a dependency
        return None
    path = Path(reportlab.__file__).parent / "fonts" / "Vera.ttf"
    return path if path.is_file() else None


def _tables(data: bytes):  # type: ignore[no-untyped-def]
    """``tag -> bytes`` of a TrueType file's table directory."""
    n = struct.unpack_from(">H", data, 4)[0]
    where = {}
    for i in range(n):
        tag, _, offset, length = struct.unpack_from(">4sIII", data, 12 + 16 * i)
        where[tag.decode("latin-1")] = (offset, length)

    def table(tag: str) -> bytes:
        offset, length = where[tag]
        return data[offset:offset + length]

    return table


@dataclass(frozen=True)
class Lettering:
    """The font file the sheet uses (None: only an estimate), its metrics, and Helvetica's widths."""

    path: Path | None
    metrics: FontMetrics
    helvetica: object  # callable(text) -> width per cap height, or None
    _widths: dict = field(default_factory=dict, compare=False, repr=False)

    def width(self, text: str, height: float) -> float:
        """Paper width (mm) the layout keeps for ``text`` at cap height ``height``."""
        w = self._widths.get(text)
        if w is None:
            w = self.metrics.width(text)
            if self.helvetica is not None:
                w = max(w, self.helvetica(text))  # type: ignore[operator]
            self._widths[text] = w
        return w * height * WIDTH_MARGIN

    def exact_width(self, text: str, height: float) -> float:
        """Advance width of ``text`` in the sheet's own font (mm)."""
        return self.metrics.width(text) * height

    @property
    def descender(self) -> float:
        return self.metrics.descender


@lru_cache(maxsize=1)
def lettering() -> Lettering:
    """The sheet's font, found once per process."""
    path = _find(FONT_FILE) or _vera()
    metrics = estimate(FONT_FAMILY)
    if path is not None:
        try:
            metrics = from_tables(_tables(path.read_bytes()), FONT_FAMILY)
        except (ValueError, KeyError, struct.error):
            path = None
    helvetica = None
    try:
        from reportlab.pdfbase.pdfmetrics import stringWidth

        cap = 0.718  # Helvetica cap height per em (its AFM file)

        def helvetica(text: str) -> float:
            return stringWidth(text, "Helvetica", 1.0) / cap
    except ImportError:  # pragma: no cover - a dependency
        pass
    return Lettering(path, metrics, helvetica)
