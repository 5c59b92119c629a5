"""Text metrics of a TrueType font read straight from its tables: advance widths, cap height,
x-height and descender, for laying out sheet text the way it will print.

Only the few tables needed are read (head, hhea, maxp, hmtx, cmap, loca, glyf) and only the glyphs
asked for are looked up, so a large font costs about a millisecond instead of a full parse.
"""
from __future__ import annotations

import struct
from bisect import bisect_left
from dataclasses import dataclass
from typing import Callable

__all__ = ["FontMetrics", "from_tables", "estimate", "font_of_file", "mtext_extent", "wrap", "LINE_SPACING"]

LINE_SPACING = 1.667  # baseline to baseline per cap height for MTEXT, "3 on 5" line spacing


@dataclass(frozen=True)
class FontMetrics:
    """Metrics per cap height (the height of 'A'): ``width("A B")`` × cap height gives the width.

    >>> m = estimate()
    >>> round(m.width("HH") / m.width("H"), 3)
    2.0
    """

    family: str
    em_per_cap: float  # font size per cap height
    x_height: float  # 'x' height per cap height
    descender: float  # depth of 'p' below the baseline per cap height
    advance: Callable[[str], float]  # advance width of one character per cap height

    def width(self, text: str) -> float:
        """Advance width of ``text`` per cap height (no kerning)."""
        return sum(self.advance(ch) for ch in text)


def font_of_file(font_file: str) -> FontMetrics:
    """Metrics of a text style's font as ezdxf's font manager finds it on this machine, else an estimate."""
    try:
        from ezdxf.fonts import fonts

        face = fonts.get_font_face(font_file)
        ttf = fonts.font_manager.get_ttf_font(face.filename)
        # the tables as stored in the file: a table that someone else decompiled and would
        # compile again may be laid out differently from the stored 'loca'
        return from_tables(lambda tag: ttf.reader[tag], face.family)
    except Exception:  # no readable TrueType file on this machine
        return estimate()


def mtext_extent(lines: list[str], cap_height: float, font: FontMetrics) -> tuple[float, float]:
    """(width, height) of plain text ``lines`` set at ``cap_height``: the widest line, and the
    first cap height plus the line pitch for each further line.

    >>> w, h = mtext_extent(["HH", "H"], 2.0, estimate())
    >>> round(w / (2.0 * estimate().width("HH")), 6), round(h, 3)
    (1.0, 5.334)
    """
    width = max((font.width(line) for line in lines), default=0.0) * cap_height
    return width, cap_height * (1 + (len(lines) - 1) * LINE_SPACING)


def wrap(paragraphs: list[str], cap_height: float, width: float, font: FontMetrics) -> list[str]:
    """Plain text ``paragraphs`` broken into lines no wider than ``width``, word by word (greedy).

    >>> wrap(["aa bb cc"], 1.0, 2.05 * estimate().width("aa "), estimate())
    ['aa bb', 'cc']
    """
    lines: list[str] = []
    for paragraph in paragraphs:
        line = ""
        for word in paragraph.split(" "):
            trial = f"{line} {word}" if line else word
            if line and font.width(trial) * cap_height > width + 1e-9:
                lines.append(line)
                line = word
            else:
                line = trial
        lines.append(line)
    return lines


def estimate(family: str = "sans-serif") -> FontMetrics:
    """Mean metrics of a sans-serif face, for when the style's font file is not on this machine."""
    return FontMetrics(family, 1.0 / 0.72, 0.75, 0.29, lambda ch: 0.85)


def from_tables(table: Callable[[str], bytes], family: str) -> FontMetrics:
    """Metrics from raw TrueType tables; ``table(tag)`` returns a table's bytes as stored in the font file
    (e.g. ``TTFont.reader[tag]`` of fontTools). Raises ``ValueError``/``KeyError``/``struct.error`` on a font it cannot read."""
    head, hhea, maxp = table("head"), table("hhea"), table("maxp")
    upem = struct.unpack_from(">H", head, 18)[0]
    loc_format = struct.unpack_from(">h", head, 50)[0]
    n_metrics = struct.unpack_from(">H", hhea, 34)[0]
    n_glyphs = struct.unpack_from(">H", maxp, 4)[0]
    hmtx = table("hmtx")
    advances = struct.unpack_from(f">{n_metrics * 2}H", hmtx, 0)[0::2]
    glyph_of = _cmap_lookup(table("cmap"))
    loca, glyf = table("loca"), table("glyf")

    def bounds(ch: str) -> tuple[int, int]:
        gid = glyph_of(ord(ch))
        if loc_format == 0:
            start = struct.unpack_from(">H", loca, gid * 2)[0] * 2
        else:
            start = struct.unpack_from(">I", loca, gid * 4)[0]
        _, y_min, _, y_max = struct.unpack_from(">4h", glyf, start + 2)
        return y_min, y_max

    cap = float(bounds("A")[1])
    if cap <= 0 or not 0 < n_metrics <= n_glyphs:
        raise ValueError("no usable cap height")
    x_height = bounds("x")[1] / cap
    descender = -bounds("p")[0] / cap
    cache: dict[str, float] = {}

    def advance(ch: str) -> float:
        w = cache.get(ch)
        if w is None:
            gid = glyph_of(ord(ch))
            w = advances[min(gid, n_metrics - 1)] / cap
            cache[ch] = w
        return w

    return FontMetrics(family, upem / cap, x_height, descender, advance)


def _cmap_lookup(cmap: bytes) -> Callable[[int], int]:
    """Character code → glyph index from the Unicode subtable (format 12 preferred, else format 4)."""
    n = struct.unpack_from(">H", cmap, 2)[0]
    records = [struct.unpack_from(">HHI", cmap, 4 + 8 * i) for i in range(n)]
    best: dict[int, int] = {}
    for platform, encoding, offset in records:
        fmt = struct.unpack_from(">H", cmap, offset)[0]
        if (platform, encoding) in ((3, 10), (0, 4), (0, 6)) and fmt == 12:
            best.setdefault(12, offset)
        elif (platform, encoding) in ((3, 1), (0, 3), (0, 4)) and fmt == 4:
            best.setdefault(4, offset)
    if 12 in best:
        return _format12(cmap, best[12])
    if 4 in best:
        return _format4(cmap, best[4])
    raise ValueError("no Unicode cmap subtable")


def _format4(cmap: bytes, at: int) -> Callable[[int], int]:
    seg2 = struct.unpack_from(">H", cmap, at + 6)[0]
    seg = seg2 // 2
    ends = struct.unpack_from(f">{seg}H", cmap, at + 14)
    starts_at = at + 16 + seg2
    starts = struct.unpack_from(f">{seg}H", cmap, starts_at)
    deltas = struct.unpack_from(f">{seg}h", cmap, starts_at + seg2)
    ranges_at = starts_at + 2 * seg2
    ranges = struct.unpack_from(f">{seg}H", cmap, ranges_at)

    def glyph(code: int) -> int:
        i = bisect_left(ends, code)
        if i >= seg or starts[i] > code:
            return 0
        if ranges[i] == 0:
            return (code + deltas[i]) & 0xFFFF
        where = ranges_at + 2 * i + ranges[i] + 2 * (code - starts[i])
        g = struct.unpack_from(">H", cmap, where)[0]
        return (g + deltas[i]) & 0xFFFF if g else 0

    return glyph


def _format12(cmap: bytes, at: int) -> Callable[[int], int]:
    n = struct.unpack_from(">I", cmap, at + 12)[0]
    groups = [struct.unpack_from(">III", cmap, at + 16 + 12 * i) for i in range(n)]
    ends = [g[1] for g in groups]

    def glyph(code: int) -> int:
        i = bisect_left(ends, code)
        if i >= n or groups[i][0] > code:
            return 0
        return groups[i][2] + code - groups[i][0]

    return glyph
