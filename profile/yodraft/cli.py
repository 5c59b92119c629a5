"""Command line: parse arguments, call the library, print, choose the exit code (0 ok, 1 check failed, 2 bad input)."""
from __future__ import annotations

import argparse
import json
import sys
from collections.abc import Sequence
from pathlib import Path
from typing import Any

from . import __version__
from .errors import DesignInputError, YodraftError

__all__ = ["main"]


class _Parser(argparse.ArgumentParser):
    """argparse that reports a usage error as one line and exit 2."""

    def error(self, message: str) -> None:  # type: ignore[override]
        raise DesignInputError(self.prog, "", message, f"see '{self.prog} --help'")


def _parser() -> argparse.ArgumentParser:
    top = _Parser(prog="yodraft", description="Half-profile sketcher for ball-bearing yo-yos: checks a design file "
                  "and writes a dimensioned, toleranced DXF shop drawing.")
    top.add_argument("--version", action="version", version=f"yodraft {__version__}")
    sub = top.add_subparsers(dest="command", required=True, parser_class=_Parser)
    p = sub.add_parser("check", help="resolve a design and run every check")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.set_defaults(run=_check)
    p = sub.add_parser("build", help="check a design, then write its drawing into out/")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("-o", "--out", default="out", help="output folder (default: out)")
    p.set_defaults(run=_build)
    p = sub.add_parser("fit", help="limits and clearance of an ISO 286 fit, e.g. \"6 H7/g6\"")
    p.add_argument("code", help='fit code: size, hole and/or shaft, e.g. "6 H7/g6", "12 H7/h6", "0.25in h6"')
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.set_defaults(run=_fit)
    p = sub.add_parser("solve", help="move one parameter until the design hits a target mass, Izz or gap")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--target", required=True, help='what to hit, e.g. mass=66g, izz=30000g*mm^2, gap=4.2mm')
    p.add_argument("--vary", required=True, help="numeric parameter to move, e.g. features.rim.width")
    p.add_argument("-o", "--out", help="where to write the solved design (default: beside it, named by the new revision)")
    p.add_argument("--date", help="date of the new revision, YYYY-MM-DD (default: the design's date of issue)")
    p.set_defaults(run=_solve)
    p = sub.add_parser("keys", help="print the design-file reference: every key, what it takes and its default")
    p.set_defaults(run=_keys)
    return top


def _keys(args: argparse.Namespace) -> int:
    from .reference import reference_markdown

    print(reference_markdown(), end="")
    return 0


def _solve(args: argparse.Namespace) -> int:
    from .design import DATE_PATTERN, load, loads
    from .solve import TARGETS, find_spec, quantity_text, solve
    from .textout import failed_lines
    from .tomledit import add_revision, bump_revision, set_key
    from .units import parse_quantity, UnitError

    design = load(args.design)
    name, _, text = args.target.partition("=")
    if name not in TARGETS or not text:
        raise DesignInputError(args.design, "--target", f"cannot read {args.target!r}",
                               "mass=<mass>, izz=<g*mm^2> or gap=<length>, e.g. mass=66g")
    kind = TARGETS[name][0]
    try:
        goal = (parse_quantity(text, "inertia") if kind == "inertia" else parse_quantity(text, kind))
    except UnitError as exc:
        raise DesignInputError(args.design, "--target", str(exc), f"a {name} with a unit") from None
    parts, spec = find_spec(args.vary, args.design)
    if args.date is not None and not DATE_PATTERN.match(args.date):
        raise DesignInputError(args.design, "--date", f"{args.date!r} is not a date", "YYYY-MM-DD")
    try:
        result = solve(design, name, goal, args.vary)
    except ValueError as exc:
        if isinstance(exc, DesignInputError):
            raise
        print(f"yodraft: {args.design}: {exc}", file=sys.stderr)
        return 1
    if not result.resolved.ok:
        print("\n".join(failed_lines(result.resolved)), file=sys.stderr)
        print(f"yodraft: {args.design}: the solved design breaks the checks above; nothing written", file=sys.stderr)
        return 1
    source = Path(args.design)
    revision = bump_revision(design.revision)
    out = Path(args.out) if args.out else source.with_name(f"{source.stem}-{revision}.toml")
    if out.exists() or out.resolve() == source.resolve():
        raise DesignInputError(str(out), "", "already exists", "a new file name for the solved design (-o)")
    value_text = quantity_text(result.value, spec)
    note = f"{'.'.join(parts)} solved to {value_text} for {name} {text}"
    new = set_key(source.read_text(encoding="utf-8"), ".".join(parts[:-1]), parts[-1], value_text,
                  f"solved for {name} {text}")
    new = set_key(new, "design", "revision", revision)
    new = add_revision(new, revision, args.date or design["design"]["date"], note)
    loads(new, str(out))  # the text written must read back
    from .output import write_atomic

    write_atomic(out, new.encode("utf-8"))
    print(f"{'.'.join(parts)} = {value_text}: {name} {result.achieved:.4f} (target {goal:g}) after "
          f"{result.evaluations} trials; every check passes")
    print(out)
    return 0


def _fit(args: argparse.Namespace) -> int:
    from .textout import fit_text
    from .tolerances.iso286 import FitCodeError, fit_summary, parse_fit

    try:
        fit = parse_fit(args.code)
    except FitCodeError as exc:
        raise DesignInputError("fit", "code", str(exc)) from None
    result = fit_summary(fit)
    print(json.dumps(result, indent=2) if args.json else fit_text(result))
    return 0


def _check(args: argparse.Namespace) -> int:
    from .builder import build
    from .design import load
    from .summary import summary
    from .textout import check_text

    resolved = build(load(args.design))
    if args.json:
        print(json.dumps(summary(resolved), indent=2, sort_keys=False, ensure_ascii=False))
    else:
        print(check_text(resolved))
    return 0 if resolved.ok else 1


def _build(args: argparse.Namespace) -> int:
    from .output import build_outputs

    written, resolved = build_outputs(Path(args.design), Path(args.out))
    if not resolved.ok:
        from .textout import failed_lines

        print("\n".join(failed_lines(resolved)), file=sys.stderr)
        print("nothing written: fix the failed checks first", file=sys.stderr)
        return 1
    for path in written:
        print(path)
    return 0


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the ``yodraft`` command."""
    try:
        args = _parser().parse_args(argv)
        return int(args.run(args))
    except YodraftError as exc:
        print(f"yodraft: {exc}", file=sys.stderr)
        return exc.exit_code
    except KeyboardInterrupt:
        print("yodraft: interrupted", file=sys.stderr)
        return 130
