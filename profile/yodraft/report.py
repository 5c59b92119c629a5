"""The design report kept with the drawing: inputs, resolved dimensions, fits, mass and spin, checks, cautions.

``report_data`` is the ``check --json`` summary plus the revision history, the
inputs as written and the cautions; ``report_markdown`` renders it to read on its
own. Summary sections this module does not know by name (added by later modules)
are rendered as generic tables, so nothing in the summary is left out.
"""
from __future__ import annotations

import os
from collections.abc import Mapping
from pathlib import Path
from typing import TYPE_CHECKING, Any

from .diff import flatten, unit_of
from .units import MM_PER_INCH

if TYPE_CHECKING:  # pragma: no cover
    from .builder import Resolved
    from .diff import DesignDiff

__all__ = ["report_data", "report_markdown", "cautions", "picture_links", "previous_section"]

_KNOWN = ("ok", "design", "revisions", "inputs", "envelope", "profile", "bearing", "bearing_seat", "material",
          "features", "checks", "cautions", "pictures", "previous")


def _written_inputs(raw: Mapping[str, Any]) -> dict[str, Any]:
    """Every key the design file sets, as written, keyed by its path (revisions left to their own table)."""
    return {k: v for k, v in flatten({k: v for k, v in raw.items() if k != "revisions"}).items()}


def cautions(resolved: "Resolved", data: Mapping[str, Any]) -> list[str]:
    """Points the designer or the machinist should read before turning the part (from the results, not rules)."""
    out: list[str] = [str(c) for c in data.get("cautions", [])]
    d = resolved.design
    shop = d["shop"]
    seat = data["bearing_seat"]
    if shop["coating"] != "none" and not shop["mask_seat"]:
        out.append(f"seat not masked: turn the post to Ø{seat['post_precoat_diameter_mm']:.4f} mm and the wall bore "
                   f"to Ø{seat['wall_precoat_bore_mm']:.4f} mm before {shop['coating']}")
    derived = sorted(f"{n}.{k}" for n, f in resolved.features.items() for k in f.derived)
    if derived:
        out.append("derived by yodraft, not given in the file: " + ", ".join(derived))
    mass = data.get("mass", {})
    target = data["envelope"].get("target_mass_g")
    if target is not None and isinstance(mass.get("total_g"), (int, float)):
        out.append(f"predicted assembled mass {mass['total_g']:.2f} g against the target {target:.2f} g "
                   f"({mass['total_g'] - target:+.2f} g)")
    if not d.revisions:
        out.append("no [[revisions]] history in the design file")
    elif d.revision not in [r.letter for r in d.revisions]:
        out.append(f"revision {d.revision} has no entry in the [[revisions]] history")
    for c in resolved.failed:
        out.append(f"check failed: {c.name} [{c.feature}.{c.parameter}] {c.message}")
    return out


def report_data(resolved: "Resolved") -> dict[str, Any]:
    """The report as one JSON-ready dict: the check summary plus revisions, inputs and cautions."""
    from .summary import summary

    data = summary(resolved)
    data["revisions"] = [{"letter": r.letter, "date": r.date, "note": r.note} for r in resolved.design.revisions]
    data["inputs"] = _written_inputs(resolved.design.raw)
    data["cautions"] = cautions(resolved, data)
    if resolved.can_analyse:
        from .bom import bill_of_materials, bom_data

        data["bom"] = bom_data(bill_of_materials(resolved))
    return data


def picture_links(stem: str, pictures_dir: Path, report_dir: Path, overlay: str | None = None) -> list[dict[str, Any]]:
    """The pictures the report shows: the sheet preview and the assembly picture that ``build`` writes into
    ``pictures_dir``, and the overlay with the previous revision when there is one, each with its path
    relative to the report's folder and whether it is there yet."""
    items = [("sheet preview", f"{stem}.svg"), ("assembly", f"{stem}-assembly.svg")]
    if overlay is not None:
        items.append(("overlay with the previous revision", overlay))
    out = []
    for kind, name in items:
        target = pictures_dir / name
        link = Path(os.path.relpath(target.resolve(), report_dir.resolve())).as_posix()
        out.append({"kind": kind, "path": link, "exists": name == overlay or target.is_file()})
    return out


def previous_section(d: "DesignDiff") -> dict[str, Any]:
    """What the report says about the previous revision: which design it is and what changed since."""
    return {"name": d.a["name"], "revision": d.a["revision"], "source": d.a["source"],
            "changes": [f"{c.key}: {c.old} → {c.new}" for c in d.inputs if c.key not in ("design.revision", "revisions")]}


def _picture_lines(data: Mapping[str, Any]) -> list[str]:
    lines = ["## Pictures", ""]
    for item in data["pictures"]:
        if item["exists"]:
            lines += [f"![{item['kind']}]({item['path']})", "", f"*{item['kind']}* — [{item['path']}]({item['path']})", ""]
        else:
            lines += [f"*{item['kind']}*: `{item['path']}` is not there yet; `yodraft build` writes it", ""]
    previous = data.get("previous")
    if previous:
        lines += [f"Previous revision: {previous['name']} rev {previous['revision']} (`{previous['source']}`); "
                  f"inputs changed since: " + ("; ".join(_cell(c) for c in previous["changes"]) or "none"), ""]
    return lines


def _cell(value: Any, unit: str = "") -> str:
    if isinstance(value, bool):
        return "yes" if value else "no"
    if isinstance(value, float):
        return f"{value:.6g} {unit}".rstrip()
    if isinstance(value, list):
        return ", ".join(_cell(v, unit) for v in value) or "—"
    if value is None:
        return "—"
    return str(value).replace("|", "\\|")


def _table(header: tuple[str, ...], rows: list[tuple[Any, ...]]) -> list[str]:
    lines = ["| " + " | ".join(header) + " |", "|" + "|".join("---" for _ in header) + "|"]
    lines += ["| " + " | ".join(str(c) for c in row) + " |" for row in rows]
    return lines + [""]


def _key_table(tree: Mapping[str, Any]) -> list[str]:
    flat = flatten(tree)
    return _table(("quantity", "value"), [(k, _cell(v, unit_of(k))) for k, v in flat.items()])


def report_markdown(data: Mapping[str, Any]) -> str:
    """The report as Markdown that reads on its own."""
    d = data["design"]
    title = f"# {d['name']} rev {d['revision']}" + (f" — {d['title']}" if d.get("title") else "")
    passed = sum(c["ok"] for c in data["checks"])
    lines = [title, "", f"Design file: `{d['source']}` · checks: {passed} of {len(data['checks'])} passed"
             f" · {'ready to draw' if data['ok'] else 'NOT ready: a check failed'}", ""]
    if data.get("pictures"):
        lines += _picture_lines(data)
    lines += ["## Revisions", ""]
    lines += _table(("rev", "date", "note"), [(r["letter"], r["date"], _cell(r["note"])) for r in data["revisions"]]) \
        if data["revisions"] else ["(no revision history)", ""]
    lines += ["## Inputs (as written)", ""] + _table(("key", "value"), [(k, _cell(v)) for k, v in data["inputs"].items()])
    lines += ["## Envelope and profile", ""] + _key_table({"envelope": data["envelope"], "profile": data["profile"]})
    b, m = data["bearing"], data["material"]
    lines += ["## Bearing and material", "",
              f"Bearing {b['designation']} {b['bore_mm']:.3f} × {b['od_mm']:.3f} × {b['width_mm']:.4f} mm, "
              f"{b['precision']} (bore {b['bore_deviation_um'][0]:+g}/{b['bore_deviation_um'][1]:+g} µm, "
              f"outside diameter {b['od_deviation_um'][0]:+g}/{b['od_deviation_um'][1]:+g} µm). "
              f"Material {m['name']}, {m['density_g_cm3']:.3f} g/cm³.", ""]
    s = data["bearing_seat"]
    lines += ["## Fit table (bearing seat, finished sizes)", ""]
    rows = []
    for part, size, tol, precoat, cl, rss, p in (
            ("post", "post_diameter_mm", "post_tolerance_mm", "post_precoat_diameter_mm", "clearance",
             "clearance_rss", "post_p_no_slide"),
            ("wall bore", "wall_bore_mm", "wall_tolerance_mm", "wall_precoat_bore_mm", "wall_clearance",
             "wall_clearance_rss", "wall_p_no_slide")):
        rows.append((part, f"Ø{s[size]:.4f} ± {s[tol]:.4f} mm",
                     f"Ø{s[size] / MM_PER_INCH:.4f} ± {s[tol] / MM_PER_INCH:.4f} in", f"Ø{s[precoat]:.4f} mm",
                     f"{s[cl + '_min_mm'] * 1000:.1f} to {s[cl + '_max_mm'] * 1000:.1f} µm",
                     f"{s[rss + '_min_mm'] * 1000:.1f} to {s[rss + '_max_mm'] * 1000:.1f} µm", f"{s[p]:.2g}"))
    lines += _table(("part", "nominal", "inch", "turn before coating", "clearance, worst case",
                     "clearance, RSS (±3σ)", "P(no slide)"), rows)
    lines += ["## Axial stack (gap and seat depth)", ""]
    rows = [("gap (assembled)", f"{data['profile']['gap_mm']:.3f} mm", f"halves ± {s['gap_tolerance_mm']:.3f} mm",
             f"{s['gap_worst_mm'][0]:.3f} to {s['gap_worst_mm'][1]:.3f} mm",
             f"{s['gap_rss_mm'][0]:.3f} to {s['gap_rss_mm'][1]:.3f} mm"),
            ("wall offset from seat face", f"{data['features']['bearing_seat']['dimensions']['wall_offset_mm']:.3f} mm",
             f"± {s['wall_offset_tolerance_mm']:.3f} mm", "", ""),
            ("post length from seat face", f"{data['profile']['post_length_mm']:.3f} mm",
             f"± {s['post_length_tolerance_mm']:.3f} mm", f"post faces ≥ {s['post_spacing_worst_min_mm']:.3f} mm apart", "")]
    if "seat_depth_mm" in s:
        rows += [("seat face below outer face B", f"{s['seat_depth_mm']:.3f} mm", f"± {s['seat_depth_tolerance_mm']:.3f} mm",
                  "", ""),
                 ("assembled width", f"{data['profile']['width_mm']:.3f} mm", "",
                  f"{s['width_worst_mm'][0]:.3f} to {s['width_worst_mm'][1]:.3f} mm",
                  f"{s['width_rss_mm'][0]:.3f} to {s['width_rss_mm'][1]:.3f} mm")]
    lines += _table(("length", "nominal", "tolerance", "worst case (bearing width included)", "RSS (±3σ)"), rows)
    lines += ["## Resolved dimensions (* derived)", ""]
    for name, feature in data["features"].items():
        derived = set(feature.get("derived", []))
        rows = []
        for key, value in feature.get("dimensions", {}).items():
            base = key.rsplit("_", 1)[0] if unit_of(key) else key
            rows.append((("* " if base in derived else "") + key, _cell(value, unit_of(key))))
        lines += [f"### {name}", ""] + _table(("dimension", "value"), rows)
    for section in [k for k in data if k not in _KNOWN]:  # mass, spin, balance … as they land
        value = data[section]
        heading = {"mass": "Mass budget", "spin": "Spin metrics", "balance": "Balance",
                   "parts": "Parts of one half", "bom": "Bill of materials and stock"}.get(section, section)
        lines += [f"## {heading}", ""]
        if section == "parts":
            lines += _table(("part", "material", "mass", "Izz"), [
                (p["name"], p["material"], _cell(p["mass_g"], "g"), _cell(p["izz_g_mm2"], "g·mm²")) for p in value])
        elif section == "bom":
            from .bom import bom_text

            lines += [f"For {value['units']} good yo-yos (`yodraft bom --units N` for another count):", ""]
            lines += _table(("quantity", "item", "description"), [
                (i["quantity"], i["name"], _cell(i["description"])) for i in value["items"]])
            lines += [f"- {line.strip()}" for line in bom_text(value).splitlines()[len(value["items"]) + 1:]] + [""]
        else:
            lines += _key_table(value) if isinstance(value, Mapping) else [_cell(value), ""]
    lines += ["## Checks", ""]
    lines += _table(("", "check", "where", "result"), [
        ("ok" if c["ok"] else "**FAIL**", c["name"], f"{c['feature']}.{c['parameter']}", _cell(c["message"]))
        for c in data["checks"]])
    lines += ["## Cautions", ""] + ([f"- {c}" for c in data["cautions"]] or ["(none)"]) + [""]
    return "\n".join(lines)
