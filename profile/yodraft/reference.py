"""The design-file reference: every section and key with what it takes, its default and what it means."""
from __future__ import annotations

from collections.abc import Iterator

from .design import REQUIRED, REVISION_SPECS, SECTIONS
from .features import FEATURES
from .params import ParamSpec
from .units import DISPLAY_UNITS

__all__ = ["reference_rows", "reference_markdown", "catalog_markdown"]


def _default(spec: ParamSpec, table: str) -> str:
    if spec.default is None:
        if spec.name in REQUIRED.get(table, ()) or table == "[revisions]" and spec.name in ("letter", "date"):
            return "required"
        return "derived" if table.startswith("features.") else "optional"
    if spec.kind in DISPLAY_UNITS and spec.kind != "number":
        div, unit, _ = DISPLAY_UNITS[spec.kind]
        return f'"{spec.default / div:.6g} {unit}"'
    if spec.kind == "bool":
        return "true" if spec.default else "false"
    if spec.kind == "text":
        return f'"{spec.default}"'
    return f"{spec.default:g}"


def reference_rows() -> Iterator[tuple[str, str, str, str, str]]:
    """(table, key, expected, default, meaning) for every key a design file may hold."""
    for section, specs in SECTIONS.items():
        for s in specs:
            yield section, s.name, s.expected(), _default(s, section), s.doc
    for s in REVISION_SPECS:
        yield "[revisions]", s.name, s.expected(), _default(s, "[revisions]"), s.doc
    for name, module in FEATURES.items():
        for s in module.PARAMS:
            doc = s.doc + (f" (earlier name `{s.former}`, still read)" if s.former else "")
            yield f"features.{name}", s.name, s.expected(), _default(s, f"features.{name}"), doc
        for array, specs in getattr(module, "TABLES", {}).items():
            table = f"[features.{name}.{array}]"
            for s in specs:
                yield table, s.name, s.expected(), "optional" if s.default is None else _default(s, table), s.doc


def reference_markdown() -> str:
    """The reference as Markdown tables, one per table of the design file."""
    out: list[str] = []
    current = None
    for table, key, expected, default, doc in reference_rows():
        if table != current:
            out += ["", f"`[{table}]`" if not table.startswith("[") else f"`[{table}]` (array of tables)", "",
                    "| key | takes | default | meaning |", "| --- | --- | --- | --- |"]
            current = table
        out.append(f"| `{key}` | {expected.replace('|', '/')} | {default} | {doc} |")
    return "\n".join(out).strip() + "\n\n" + catalog_markdown()


def _cell(text: str) -> str:
    return text.replace("|", "/")


def catalog_markdown() -> str:
    """The catalogs a design names rows of — bearings, pad classes, threads, materials — each row with its source."""
    from .catalog.bearings import BEARINGS, LETTER_SIZES
    from .catalog.materials import MATERIALS
    from .catalog.pads import PAD_CLASSES, SILICONE_RECESS
    from .catalog.threads import THREADS

    letters = {v: k for k, v in LETTER_SIZES.items()}
    out = ["**Catalogs** (`profile/yodraft/catalog/`). Rows marked \"from memory\" are to be confirmed against the "
           "maker's drawing before a production run.", "",
           "Bearings (`bearing.size`: the designation, or a trade letter size)", "",
           "| designation | bore × OD × width (mm) | mass (g) | source |", "| --- | --- | --- | --- |"]
    for b in BEARINGS.values():
        name = b.designation + (f" (size {letters[b.designation]})" if b.designation in letters else "")
        out.append(f"| {name} | {b.bore_mm:.4g} × {b.od_mm:.4g} × {b.width_mm:.4g} | {b.mass_g:g} | {_cell(b.source)} |")
    out += ["", "Pad classes (`features.pad_groove.pad_class`)", "",
            "| class | pad Ø (mm) | groove inner Ø (mm) | groove depth (mm) | pad thickness (mm) | source |",
            "| --- | --- | --- | --- | --- | --- |"]
    for c in PAD_CLASSES.values():
        out.append(f"| {c.name} | {c.pad_diameter_mm:g} | {c.groove_inner_diameter_mm:g} | {c.groove_depth_mm:g} | "
                   f"{c.pad_thickness_mm:g} | {_cell(c.source)}; thickness {_cell(c.thickness_source)} |")
    rec = SILICONE_RECESS
    out += ["", f"Silicone response recess (`features.pad_groove.response = \"silicone\"`): {rec.wall_mm:g} mm of wall "
            f"outside the wall bore, {rec.width_mm:g} mm wide, {rec.depth_mm:g} mm deep, silicone "
            f"{rec.density_g_cm3:g} g/cm³ ({_cell(rec.source)})."]
    out += ["", "Threads (`features.axle_bore.thread`)", "",
            "| thread | major Ø (mm) | pitch (mm) | tap drill (mm) | class | source |", "| --- | --- | --- | --- | --- | --- |"]
    for t in THREADS.values():
        out.append(f"| {t.name} | {t.major_mm:.4g} | {t.pitch_mm:.4g} | {t.tap_drill_mm:.4g} | {t.tolerance_class} | "
                   f"{_cell(t.source)} |")
    out += ["", "Materials (`design.material`)", "",
            "| material | family | density (g/cm³) | E (GPa) | ν | α (1/K) | yield (MPa) | source |",
            "| --- | --- | --- | --- | --- | --- | --- | --- |"]
    for m in MATERIALS.values():
        out.append(f"| {m.name} | {m.family} | {m.density_g_cm3:g} | {m.e_gpa:g} | {m.poisson:g} | {m.alpha_per_k:.3g} | "
                   f"{m.yield_mpa:g} | {_cell(m.source)}; {_cell(m.properties_source)} |")
    return "\n".join(out) + "\n"
