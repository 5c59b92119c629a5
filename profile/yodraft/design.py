"""Design file (TOML) → Design: plain floats in mm, g and rad, with key paths kept for messages."""
from __future__ import annotations

import datetime
import functools
import os
import re
import stat
import tomllib
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from .catalog.finishes import FINISHES, check_finish
from .errors import DesignInputError, toml_shown
from .features import FEATURES
from .params import SMALLEST, ParamSpec, check_name, check_unknown, current_names, read_table
from .units import MM_PER_INCH as IN

__all__ = ["Design", "Revision", "SECTIONS", "load", "loads", "find_param", "with_values", "NAME_PATTERN",
           "OUTPUT_WORDS"]

NAME_PATTERN = re.compile(r"^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$")
DATE_PATTERN = re.compile(r"^\d{4}-\d{2}-\d{2}$")
#: no design file comes near this; a larger one is the wrong file (or /dev/zero)
MAX_DESIGN_BYTES = 2**20  # a design is a few kilobytes; a megabyte is already a mistake
#: the deepest key path a design file needs (features.rim.band_width is three parts)
MAX_KEY_PARTS = 6
#: words a build puts after ``<name>-<revision>`` in its file names: a revision may not be one of them,
#: or design ``x-A`` at revision ``profile`` would write over the CAM profile of design ``x`` at revision ``A``
OUTPUT_WORDS = frozenset({"profile", "ring", "assembly", "sheet", "build", "report", "lot", "bom", "overlay"})
#: most tables one array of a feature may hold (a sketch of more points is a pasted point cloud)
MAX_ARRAY = 200

SECTIONS: dict[str, tuple[ParamSpec, ...]] = {
    "design": (
        ParamSpec("name", "text", "design name, used in output file names (letters, digits, . _ -)", max_length=64),
        ParamSpec("revision", "text", "revision letter or number shown in the title block", "A", max_length=8),
        ParamSpec("title", "text", "title shown in the title block", ""),
        ParamSpec("owner", "text", "legal owner of the drawing (title block)", "", max_length=60),  # what its title-block cell holds at 1.8 mm
        ParamSpec("identification", "text", "drawing identification number (title block)", "", max_length=60),  # what its title-block cell holds at 1.8 mm
        ParamSpec("creator", "text", "who drew it (title block)", "", max_length=40),  # what its title-block cell holds at 1.8 mm
        ParamSpec("approver", "text", "who approved it (title block)", "", max_length=40),  # what its title-block cell holds at 1.8 mm
        ParamSpec("date", "text", "date of issue, YYYY-MM-DD; also fixes the DXF header dates", "2026-01-01", max_length=10),
        ParamSpec("material", "text", "body material from the catalog", "6061-T6", max_length=40),
        ParamSpec("density", "density", "overrides the catalog density of the material", None, 0.1, 25.0),
    ),
    "envelope": (
        ParamSpec("diameter", "length", "largest outer diameter allowed", None, 10.0, 120.0),
        ParamSpec("width", "length", "largest assembled overall width allowed", None, 10.0, 120.0),
        ParamSpec("target_mass", "mass", "assembled mass the design aims at (for solve and the report)", None, 1.0, 1000.0),
        ParamSpec("target_izz", "inertia", "assembled Izz the design aims at (drawn on sweep plots)", None, 1.0, 1e8),
        ParamSpec("target_gap", "length", "gap the design aims at (drawn on sweep plots)", None, 0.1, 20.0),
    ),
    "bearing": (
        ParamSpec("size", "text", 'trade letter size ("C") or catalog designation ("MR105ZZ")', "C", max_length=20),
        ParamSpec("bore", "length", "explicit bearing bore (with od and width, instead of size)", None, 0.6, 18.0),
        ParamSpec("od", "length", "explicit bearing outside diameter", None, 2.5, 30.0),
        ParamSpec("width", "length", "explicit bearing width", None, 0.5, 20.0),
        ParamSpec("mass", "mass", "overrides the catalog bearing mass", None, 0.0, 100.0, lo_closed=True),
        ParamSpec("precision", "text", 'precision class, ISO 492 ("P4") or ABEC ("ABEC 7")', "ABEC 1", max_length=12),
        ParamSpec("bore_tolerance", "length", "overrides the class: bore deviation 0/−this",
                  None, 0.0, 0.05, lo_closed=True, least=SMALLEST),
        ParamSpec("od_tolerance", "length", "overrides the class: outside-diameter deviation 0/−this",
                  None, 0.0, 0.05, lo_closed=True, least=SMALLEST),
        ParamSpec("width_tolerance", "length", "overrides the class: inner ring width deviation 0/−this",
                  None, 0.0, 0.5, lo_closed=True, least=SMALLEST),
    ),
    "shop": (
        ParamSpec("machine_tolerance", "length", "± the lathe holds on a turned diameter", 0.0002 * IN, 0.0, 0.5),
        ParamSpec("fit_clearance", "length", "diametral clearance wanted at the seat on top of the worst case",
                  0.0005 * IN, 0.0, 0.5, lo_closed=True, least=SMALLEST),
        ParamSpec("coating", "text", "finish of the body (it must suit the body material: anodize on aluminium alloys only)",
                  "none", choices=tuple(FINISHES)),
        ParamSpec("coating_thickness", "length", "coating thickness (its thin end when coating_thickness_max is given)",
                  0.0, 0.0, 0.1, lo_closed=True, least=SMALLEST),
        ParamSpec("coating_thickness_max", "length", "thick end of the coating's thickness range; default coating_thickness (no scatter)",
                  None, 0.0, 0.1, lo_closed=True, least=SMALLEST),
        ParamSpec("coating_outward_share", "number", "share of the coating thickness that builds outward", 0.5, 0.0, 1.0, lo_closed=True),
        ParamSpec("mask_seat", "bool", "mask the bearing seat from coating (else turn it to pre-coat size)", False),
        ParamSpec("general_tolerance", "text", "general tolerance for unmarked dimensions", "ISO 2768-m",
                  choices=("ISO 2768-f", "ISO 2768-m", "ISO 2768-c")),
        ParamSpec("min_wall", "length", "thinnest wall the shop will turn", 0.5, 0.05, 10.0),
        ParamSpec("seat_roughness", "roughness", "surface roughness Ra of the bearing seat", 0.8, 0.0, 25.0),
        ParamSpec("break_edges", "length", "edge break for unmarked edges (ISO 13715)", 0.2, 0.0, 2.0, lo_closed=True),
        # stock allowances: common practice, no published source
        ParamSpec("stock_turning_allowance", "length", "diametral allowance turned off the bar's outside (bill of stock)",
                  2.0, 0.0, 20.0, lo_closed=True),
        ParamSpec("stock_facing_allowance", "length", "length faced off a half's two faces together (bill of stock)",
                  1.0, 0.0, 20.0, lo_closed=True),
        ParamSpec("stock_parting_allowance", "length", "length lost to the parting tool per half (bill of stock)",
                  3.0, 0.0, 20.0, lo_closed=True),
    ),
    "parts": (
        ParamSpec("axle_mass", "mass", "overrides the computed axle mass", None, 0.0, 100.0, lo_closed=True),
        ParamSpec("pad_mass", "mass", "overrides the computed mass of one response pad", None, 0.0, 50.0, lo_closed=True),
    ),
    "analysis": (
        ParamSpec("spin_rate", "speed", "reference spin rate for energy, momentum and balance", 10000.0, 1.0, 100000.0),
        ParamSpec("drag_torque", "torque", "drag torque of bearing and string in a sleep, for the spin-down estimate (a rough default: measure yours)",
                  0.2, 0.0, 100.0),
        ParamSpec("balance_grade", "number", "ISO 21940-11 balance quality grade G (mm/s)", 6.3, 0.0, 4000.0),
        # below 1: at the whole outer radius nothing lies outside, and the spin estimate refuses a share of 1
        ParamSpec("rim_radius_ratio", "number", "rim-weight share counts Izz outside this share of the outer radius", 0.8, 0.0, 0.99),
    ),
}
REVISION_SPECS = (
    ParamSpec("letter", "text", "revision letter", max_length=8),
    ParamSpec("date", "text", "date of the revision, YYYY-MM-DD", max_length=10),
    ParamSpec("note", "text", "what changed", "", max_length=200),
)
REQUIRED = {"design": ("name",), "envelope": ("diameter", "width")}


@dataclass(frozen=True)
class Revision:
    """One line of the revision history."""

    letter: str
    date: str
    note: str


@dataclass(frozen=True)
class Design:
    """A design file read into plain values (mm, g, rad) per section and per feature."""

    source: str
    sections: Mapping[str, Mapping[str, Any]]
    features: Mapping[str, Mapping[str, Any]]
    given: frozenset[str]
    revisions: tuple[Revision, ...] = field(default=())
    raw: Mapping[str, Any] = field(default_factory=dict, compare=False, repr=False)

    def __getitem__(self, section: str) -> Mapping[str, Any]:
        return self.sections[section]

    @property
    def name(self) -> str:
        return self.sections["design"]["name"]

    @property
    def revision(self) -> str:
        return self.sections["design"]["revision"]

    def is_given(self, key: str) -> bool:
        """Whether ``key`` (e.g. "features.rim.band_width") was written in the file."""
        return key in self.given


def find_param(key: str) -> tuple[list[str], ParamSpec] | None:
    """The TOML path and spec of a design key such as "features.rim.band_width", "rim.band_width" (a feature's
    key without "features.") or "shop.fit_clearance"; None when there is no such key. A key's earlier name
    finds its current path.

    A table of a feature's array is named by its place, from 0: "features.shape.points[2].radius".

    >>> find_param("rim.band_width")[0], find_param("features.rim.width")[0]
    (['features', 'rim', 'band_width'], ['features', 'rim', 'band_width'])
    >>> find_param("shape.points[2].arc_radius")[0]
    ['features', 'shape', 'points[2]', 'arc_radius']
    """
    found = _param_path(key)
    return None if found is None else (list(found[0]), found[1])


#: a table of a feature's array by its place: "points[2]" → ("points", "2")
_ITEM = re.compile(r"^([a-z_]+)\[(\d{1,4})\]$")


@functools.lru_cache(maxsize=256)  # a sweep makes its variants by the same few keys again and again
def _param_path(key: str) -> tuple[tuple[str, ...], ParamSpec] | None:
    """``find_param`` with the path as a tuple (kept: the specs never change)."""
    parts = key.split(".")
    if parts[0] in FEATURES:
        parts = ["features"] + parts
    item = _ITEM.match(parts[2]) if len(parts) == 4 and parts[0] == "features" and parts[1] in FEATURES else None
    if item and item.group(1) in getattr(FEATURES[parts[1]], "TABLES", {}):
        specs = FEATURES[parts[1]].TABLES[item.group(1)]
    elif len(parts) == 3 and parts[0] == "features" and parts[1] in FEATURES:
        specs = FEATURES[parts[1]].PARAMS
    elif len(parts) == 2 and parts[0] in SECTIONS:
        specs = SECTIONS[parts[0]]
    else:
        return None
    spec = next((s for s in specs if parts[-1] in (s.name, s.former)), None)
    return None if spec is None else (tuple(parts[:-1]) + (spec.name,), spec)


def load(path: str | Path) -> Design:
    """Read a design file; DesignInputError names the file and key for anything wrong."""
    p = Path(path)
    name = str(path)
    try:
        mode = os.stat(p).st_mode
    except FileNotFoundError:
        raise DesignInputError(name, "", "no such file", "a design file (.toml)") from None
    except OSError as exc:
        raise DesignInputError(name, "", f"cannot be read ({exc.strerror})", "a readable design file") from None
    if stat.S_ISDIR(mode):
        raise DesignInputError(name, "", "is a directory", "a design file (.toml)")
    if stat.S_ISFIFO(mode) or stat.S_ISSOCK(mode):  # reading a pipe nobody writes to would wait for ever
        raise DesignInputError(name, "", "is a named pipe or socket", "a design file (.toml)")
    try:
        with p.open("rb") as handle:  # read with a limit: /dev/zero or a runaway pipe would fill the memory
            data = handle.read(MAX_DESIGN_BYTES + 1)
    except FileNotFoundError:
        raise DesignInputError(name, "", "no such file", "a design file (.toml)") from None
    except OSError as exc:
        raise DesignInputError(name, "", f"cannot be read ({exc.strerror})", "a readable design file") from None
    if len(data) > MAX_DESIGN_BYTES:
        raise DesignInputError(name, "", f"is larger than {MAX_DESIGN_BYTES // 2**10} KiB",
                               "a design file (a few kilobytes of TOML)")
    try:
        text = data.decode("utf-8-sig")  # an editor's byte-order mark is not part of the design
    except UnicodeDecodeError as exc:
        raise DesignInputError(name, "", f"is not UTF-8 text (byte {exc.start})", "a UTF-8 TOML design file") from None
    return loads(text, name)


def loads(text: str, source: str = "<design>") -> Design:
    """Read design-file text; ``source`` names it in messages."""
    if "\x00" in text:
        raise DesignInputError(source, "", "contains NUL bytes (a binary file?)", "a TOML design file")
    if len(text) > MAX_DESIGN_BYTES:
        raise DesignInputError(source, "", f"is longer than {MAX_DESIGN_BYTES // 2**10} KiB", "a design file of a few kilobytes")
    _check_key_depth(text, source)
    try:
        raw = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise DesignInputError(source, "", f"is not valid TOML: {exc}", "TOML syntax") from None
    except RecursionError:  # tomllib reads nested arrays and inline tables recursively
        raise DesignInputError(source, "", "nests arrays or inline tables too deeply to read",
                               "a design file of plain tables and values") from None
    return from_dict(raw, source)


_KEY_PART = re.compile(r"""\s*(?:[A-Za-z0-9_-]+|"(?:[^"\\\n]|\\.)*"|'[^'\n]*')\s*""")


def _check_key_depth(text: str, source: str) -> None:
    """Refuse, before parsing, a key or table name of more parts than any design key has
    (tomllib would build a table for every part: 20,000 parts take seconds and gigabytes).

    >>> _check_key_depth('a.b.c = 1', "x.toml")
    >>> _check_key_depth('a' + '.a' * 9 + ' = 1', "x.toml")
    Traceback (most recent call last):
    ...
    yodraft.errors.DesignInputError: x.toml: line 1: a key of 10 dotted parts (expected at most 6 parts, e.g. features.rim.band_width)
    """
    for number, line in enumerate(text.splitlines(), 1):
        head = line.lstrip().lstrip("[")
        pos, parts = 0, 0
        while True:
            m = _KEY_PART.match(head, pos)
            if not m or m.end() == pos:
                break
            parts, pos = parts + 1, m.end()
            if pos >= len(head) or head[pos] != ".":
                break
            pos += 1
        if parts > MAX_KEY_PARTS:
            raise DesignInputError(source, f"line {number}", f"a key of {parts} dotted parts",
                                   f"at most {MAX_KEY_PARTS} parts, e.g. features.rim.band_width")


def array_table(design: Design, parts: Sequence[str]) -> Mapping[str, Any]:
    """The table of a feature's array a key path names, e.g. ("features", "shape", "points[2]", "radius"): the
    design's third point; DesignInputError when the design has no table at that place."""
    item = _ITEM.match(parts[2])
    assert item is not None, parts
    tables = design.features[parts[1]][item.group(1)]
    place = int(item.group(2))
    if place >= len(tables):
        raise DesignInputError(design.source, ".".join(parts[:3]), f"is past the {len(tables)} tables the design has",
                               f"a place from 0 to {len(tables) - 1}" if tables
                               else f"a [[{parts[0]}.{parts[1]}.{item.group(1)}]] table first")
    table: Mapping[str, Any] = tables[place]
    return table


def with_values(base: Design, assignments: Sequence[tuple[str, float]]) -> Design:
    """A variant of ``base``: each key path (``features.rim.band_width``, ``shop.fit_clearance``, a sketch point's
    ``features.shape.points[2].radius``) set to a value in base units (mm, g, rad …), its parsed TOML updated alike.
    The one way a sweep, a solve or a lot makes a variant.

    >>> d = with_values(loads(EXAMPLE_TEXT), [("features.rim.thickness", 5.0)])
    >>> d.features["rim"]["thickness"], d.raw["features"]["rim"]["thickness"], d.is_given("features.rim.thickness")
    (5.0, '5 mm', True)
    """
    changed: dict[tuple[str, ...], dict[str, tuple[float, Any]]] = {}  # table path → key → (value, as written)
    keys = []
    for key, value in assignments:
        found = _param_path(key)
        if found is None:
            raise DesignInputError(base.source, key, "is not a design key",
                                   "a key path such as features.rim.band_width or shop.fit_clearance")
        parts, spec = found
        if len(parts) == 4:
            array_table(base, parts)  # the table must be there
        keys.append(".".join(parts))
        changed.setdefault(parts[:-1], {})[parts[-1]] = (value, spec.written(value))
    sections, features, raw = dict(base.sections), dict(base.features), dict(base.raw)
    raw_features = dict(raw.get("features", {}))
    for table, items in changed.items():  # each changed table copied once
        values = {k: v for k, (v, _) in items.items()}
        written = {k: w for k, (_, w) in items.items()}
        item = _ITEM.match(table[2]) if len(table) == 3 else None
        if item:  # one table of a feature's array: the array copied with that table replaced
            name, place = item.group(1), int(item.group(2))
            tables = list(features[table[1]][name])
            tables[place] = {**tables[place], **values}
            features[table[1]] = {**features[table[1]], name: tuple(tables)}
            raw_table = dict(raw_features.get(table[1], {}))
            raw_items = list(raw_table.get(name, []))
            raw_items[place] = {**raw_items[place], **written}
            raw_features[table[1]] = {**raw_table, name: raw_items}
            raw["features"] = raw_features
        elif table[0] == "features":
            features[table[1]] = {**features[table[1]], **values}
            raw_features[table[1]] = {**raw_features.get(table[1], {}), **written}
            raw["features"] = raw_features
        else:
            sections[table[0]] = {**sections[table[0]], **values}
            raw[table[0]] = {**raw.get(table[0], {}), **written}
    return Design(base.source, sections, features, base.given | frozenset(keys), base.revisions, raw)


#: a design for doctests: everything but the envelope takes its default
EXAMPLE_TEXT = '''[design]
name = "example"
[envelope]
diameter = "56 mm"
width = "44 mm"
'''


def from_dict(raw: Mapping[str, Any], source: str = "<design>") -> Design:
    """Build a Design from an already parsed TOML mapping."""
    if not raw:
        raise DesignInputError(source, "", "is empty", "at least [design] and [envelope] sections")
    known = list(SECTIONS) + ["features", "revisions"]
    check_unknown(raw, known, source, "", "section")
    sections: dict[str, dict[str, Any]] = {}
    given: set[str] = set()
    for section, specs in SECTIONS.items():
        table = raw.get(section, {})
        values = read_table(table, specs, source, section)
        for key in REQUIRED.get(section, ()):
            if values[key] is None:
                spec = next(s for s in specs if s.name == key)
                raise DesignInputError(source, f"{section}.{key}", "is missing", spec.expected())
        given.update(f"{section}.{k}" for k in table)
        sections[section] = values
    _check_design_section(sections["design"], source)
    _check_catalog_names(sections, source)
    check_finish(sections["shop"]["coating"], sections["design"]["material"], source, "shop.coating")
    feature_tables = raw.get("features", {})
    if not isinstance(feature_tables, Mapping):
        raise DesignInputError(source, "features", f"got {toml_shown(feature_tables)}", "a table of feature tables")
    check_unknown(feature_tables, list(FEATURES), source, "features", "feature")
    # a key written under its earlier name is read, and kept in ``raw``, under its current one
    feature_tables = {fname: current_names(table, FEATURES[fname].PARAMS, source, f"features.{fname}")
                      if isinstance(table, Mapping) else table for fname, table in feature_tables.items()}
    if "features" in raw:
        raw = {**raw, "features": feature_tables}
    features: dict[str, dict[str, Any]] = {}
    for fname, module in FEATURES.items():
        table = feature_tables.get(fname, {})
        arrays = getattr(module, "TABLES", {})
        if isinstance(table, Mapping) and arrays:
            values = read_table({k: v for k, v in table.items() if k not in arrays}, module.PARAMS, source,
                                f"features.{fname}")
            for key, specs in arrays.items():
                values[key] = _read_array(table.get(key, []), specs, source, f"features.{fname}.{key}")
            features[fname] = values
        else:
            features[fname] = read_table(table, module.PARAMS, source, f"features.{fname}")
        given.update(f"features.{fname}.{k}" for k in table)
        if hasattr(module, "validate"):  # a feature's own cross-key rules (a ring's material, finish and fit)
            module.validate(features[fname], source, f"features.{fname}")
    revisions = _read_revisions(raw.get("revisions", []), source)
    return Design(source, sections, features, frozenset(given), revisions, raw)


def _is_date(text: str) -> bool:
    """YYYY-MM-DD and a real day of the calendar (no 2026-02-30)."""
    if not DATE_PATTERN.match(text):
        return False
    try:
        datetime.date.fromisoformat(text)
    except ValueError:
        return False
    return True


def _check_design_section(values: dict[str, Any], source: str) -> None:
    if not NAME_PATTERN.match(values["name"]):
        raise DesignInputError(source, "design.name", f"{values['name'][:40]!r} cannot name a file",
                               "letters, digits, '.', '_' or '-', starting with a letter or digit, at most 64")
    if not _is_date(values["date"]):
        raise DesignInputError(source, "design.date", f"{values['date']!r} is not a date", "YYYY-MM-DD")
    if not re.match(r"^[A-Za-z0-9]{1,8}$", values["revision"]):
        raise DesignInputError(source, "design.revision", f"{values['revision']!r} is not a revision mark",
                               "letters or digits, e.g. A or 2")
    if values["revision"].lower() in OUTPUT_WORDS:
        raise DesignInputError(source, "design.revision", f"{values['revision']!r} is a word yodraft puts in its file names",
                               "a revision mark such as A, B or 2")


def _check_catalog_names(sections: Mapping[str, Mapping[str, Any]], source: str) -> None:
    """Material, bearing size and precision class must name catalog rows (checked here, where the key is known)."""
    from .catalog.bearings import BEARINGS, LETTER_SIZES, lookup_bearing
    from .catalog.materials import MATERIALS, lookup_material
    from .tolerances.bearings import PRECISION_CLASSES, normalise_precision

    check_name(sections["design"]["material"], lookup_material, list(MATERIALS), source, "design.material", "material")
    bearing = sections["bearing"]
    if all(bearing[k] is None for k in ("bore", "od", "width")):
        check_name(bearing["size"], lookup_bearing, list(LETTER_SIZES) + list(BEARINGS), source, "bearing.size",
                   "bearing")
    check_name(bearing["precision"], normalise_precision, list(PRECISION_CLASSES), source, "bearing.precision",
               "precision class")


def _read_array(items: Any, specs: tuple[ParamSpec, ...], source: str, path: str) -> tuple[dict[str, Any], ...]:
    """An array of tables (``[[features.shape.points]]``), each read against ``specs``."""
    if not isinstance(items, list):
        raise DesignInputError(source, path, f"got {toml_shown(items)}", f"an array of [[{path}]] tables")
    if len(items) > MAX_ARRAY:
        raise DesignInputError(source, path, f"has {len(items)} tables", f"at most {MAX_ARRAY}")
    return tuple(read_table(item, specs, source, f"{path}[{i}]") for i, item in enumerate(items))


def _read_revisions(items: Any, source: str) -> tuple[Revision, ...]:
    if not isinstance(items, list):
        raise DesignInputError(source, "revisions", f"got {toml_shown(items)}", "an array of [[revisions]] tables")
    out = []
    for i, item in enumerate(items):
        path = f"revisions[{i}]"
        values = read_table(item, REVISION_SPECS, source, path)
        for key in ("letter", "date"):
            if values[key] is None:
                raise DesignInputError(source, f"{path}.{key}", "is missing", REVISION_SPECS[0 if key == "letter" else 1].expected())
        if not _is_date(values["date"]):
            raise DesignInputError(source, f"{path}.date", f"{values['date']!r} is not a date", "YYYY-MM-DD")
        out.append(Revision(values["letter"], values["date"], values["note"]))
    return tuple(out)
