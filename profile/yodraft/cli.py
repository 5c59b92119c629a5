"""Command line: parse arguments, call the library, print, choose the exit code (0 ok, 1 check failed, 2 bad input)."""
from __future__ import annotations

import argparse
import json
import os
import re
import sys
from collections.abc import Sequence
from pathlib import Path
from typing import Any

from . import __version__
from .errors import CheckFailure, DesignInputError, UsageError, YodraftError, one_line, terminal_safe

__all__ = ["main", "INTERNAL_ERROR"]

#: exit code of an unexpected error inside yodraft (0 ok, 1 a check failed, 2 bad input or usage)
INTERNAL_ERROR = 3


class _Parser(argparse.ArgumentParser):
    """argparse that reports a usage error as one line and exit 2."""

    def error(self, message: str) -> None:  # type: ignore[override]
        raise UsageError(self.prog, message)


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
    p.add_argument("-o", "--output", "--out", dest="out", default="out", help="output folder (default: out)")
    p.add_argument("--force", action="store_true",
                   help="overwrite a drawing of the same revision even if its geometry changed")
    p.set_defaults(run=_build)
    p = sub.add_parser("fit", help="limits and clearance of an ISO 286 fit, e.g. \"6 H7/g6\"")
    p.add_argument("code", help='fit code: size, hole and/or shaft, e.g. "6 H7/g6", "12 H7/h6", "0.25in h6"')
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.set_defaults(run=_fit)
    p = sub.add_parser("solve", help="move one parameter until the design hits a target mass, Izz or gap")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--target", required=True, help='what to hit, e.g. mass=66g, izz=30000g*mm^2, gap=4.2mm')
    p.add_argument("--vary", required=True, help="numeric parameter to move, e.g. features.rim.band_width")
    p.add_argument("-o", "--output", "--out", dest="out",
                   help="where to write the solved design (default: beside it, named by the new revision)")
    p.add_argument("--date", help="date of the new revision, YYYY-MM-DD (default: today)")
    p.set_defaults(run=_solve)
    p = sub.add_parser("keys", help="print the design-file reference: every key, what it takes and its default")
    p.set_defaults(run=_keys)
    _add_revising(sub)
    return top


def _keys(args: argparse.Namespace) -> int:
    from .reference import reference_markdown

    print(reference_markdown(), end="")
    return 0


def _add_revising(sub: Any) -> None:
    """Subcommands for revising and exploring: templates, new, report, diff, sweep, watch."""
    p = sub.add_parser("templates", help="list the starter designs")
    p.set_defaults(run=_templates)
    p = sub.add_parser("new", help="write a new design file from a starter design")
    p.add_argument("file", help="design file to create (never overwritten)")
    p.add_argument("-t", "--template", required=True, help="starter design name (see 'yodraft templates')")
    p.add_argument("--name", help="design.name of the new design (default: the template's)")
    p.add_argument("--title", help="design.title for the title block (default: the template's)")
    p.add_argument("--date", help="date of issue, YYYY-MM-DD (default: today)")
    for field in ("owner", "creator", "approver", "identification"):
        p.add_argument(f"--{field}", default="", help=f"design.{field} for the title block (default: blank)")
    p.set_defaults(run=_new)
    p = sub.add_parser("report", help="the design report: inputs, dimensions, fits, mass, checks, cautions")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--format", choices=("md", "json"), default="md", help="Markdown (default) or JSON")
    p.add_argument("-o", "--output", help="write the report to this file instead of printing it")
    p.add_argument("--pictures", metavar="DIR", default="out",
                   help="folder where build wrote the sheet preview and assembly picture (default: out)")
    p.add_argument("--previous", metavar="FILE",
                   help="design file of the previous revision: the overlay with it is written into --pictures")
    p.set_defaults(run=_report)
    p = sub.add_parser("diff", help="what changed between two designs: inputs, derived values, checks")
    p.add_argument("a", help="old design file")
    p.add_argument("b", help="new design file")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.add_argument("--plot", metavar="FILE.svg", help="also write the two half-profiles overlaid, as SVG")
    p.set_defaults(run=_diff)
    p = sub.add_parser("sweep", help="resolve and check a grid of variants over one or two parameters")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--vary", action="append", required=True, metavar="KEY=START:STOP:COUNT",
                   help="e.g. features.rim.band_width=6mm:3mm:4; give once or twice")
    p.add_argument("-o", "--output", "--csv", dest="csv", help="write the CSV here (default: print it)")
    p.add_argument("--plot", metavar="FILE.svg", help="write an SVG plot of the chosen outputs here")
    p.add_argument("--y", metavar="KEY[,KEY...]",
                   help="outputs to plot: mass, izz, gap, rim_share, ... or CSV columns (default: mass,izz)")
    p.add_argument("--jobs", type=int, help="worker processes (default: one per core)")
    p.set_defaults(run=_sweep)
    _add_lot(sub)
    p = sub.add_parser("bom", help="bill of materials and stock for N yo-yos, with the scrap a lot expects")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--units", default="100", help="good yo-yos to make (default: 100)")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.set_defaults(run=_bom)
    p = sub.add_parser("watch", help="rebuild the drawing each time the design file is saved")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("-o", "--output", "--out", dest="out", default="out", help="output folder (default: out)")
    p.add_argument("--interval", type=float, default=0.25, help="seconds between polls (default: 0.25)")
    p.add_argument("--max-builds", type=int, help="stop after this many builds")
    p.add_argument("--timeout", type=float, help="stop after this many seconds")
    p.add_argument("--force", action="store_true", help="as for build: overwrite a drawing whose geometry changed")
    level = p.add_mutually_exclusive_group()
    level.add_argument("-q", "--quiet", action="store_true", help="print only what was built or why not")
    level.add_argument("-v", "--verbose", action="store_true", help="print every changed value after each save")
    p.set_defaults(run=_watch)


def _add_lot(sub: Any) -> None:
    """The production-lot command: a lot of halves drawn within their tolerances."""
    p = sub.add_parser("lot", help="a production lot drawn within the tolerances: fits, gap, mass pairing, balance")
    p.add_argument("design", help="design file (.toml)")
    p.add_argument("--units", default="1000", help="halves in the lot (default: 1000)")
    p.add_argument("--seed", default="1", help="seed of the random draws (default: 1); the same seed gives the same lot")
    p.add_argument("--pair-window", default="0.1 g", help="largest mass difference of a matched pair (default: 0.1 g)")
    p.add_argument("--mass-window", default="1 g", help="± on the target mass of an assembled yo-yo (default: 1 g)")
    p.add_argument("--distribution", choices=("normal", "uniform"), default="normal",
                   help="spread within each band: normal with the band as ±3σ (default) or uniform")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.add_argument("-o", "--output", "--csv", dest="csv", help="write every half of the lot to this CSV file")
    p.add_argument("--plot", help="write an SVG plot of the distributions with their limits here")
    p.set_defaults(run=_lot)


def _whole_number(text: str, option: str, low: int, high: int) -> int:
    if not re.fullmatch(r"\s*\d+\s*", text):
        raise DesignInputError(option, "", f"got {text[:40]!r}", f"a whole number from {low} to {high}")
    value = int(text)
    if not low <= value <= high:
        raise DesignInputError(option, "", f"{value} is out of range", f"a whole number from {low} to {high}")
    return value


def _mass_option(text: str, option: str) -> float:
    from .units import UnitError, parse_quantity

    try:
        value = parse_quantity(text, "mass")
    except UnitError as exc:
        raise DesignInputError(option, "", str(exc), 'a mass with a unit above 0 g, e.g. "0.1 g"') from None
    if not value > 0:
        raise DesignInputError(option, "", f"{text[:40]!r} is not above 0 g", 'a mass with a unit above 0 g, e.g. "0.1 g"')
    return value


def _output_targets(design: str, targets: Sequence[str | None]) -> None:
    """Refuse, before any work, an output file that is the design file itself, a device or pipe, or one in a
    folder that does not exist."""
    from .output import writable_target

    for target in targets:
        if target is not None:
            writable_target(Path(target), [design])


def _lot(args: argparse.Namespace) -> int:
    from .builder import build
    from .design import load
    from .lot import MAX_UNITS, lot_csv, lot_summary, lot_svg, lot_text, run_lot

    units = _whole_number(args.units, "--units", 2, MAX_UNITS)
    seed = _whole_number(args.seed, "--seed", 0, 2**63 - 1)
    pair_window = _mass_option(args.pair_window, "--pair-window")
    mass_window = _mass_option(args.mass_window, "--mass-window")
    _output_targets(args.design, (args.csv, args.plot))
    if args.csv and args.plot and Path(args.csv).resolve() == Path(args.plot).resolve():
        raise DesignInputError(args.plot, "", "is also the --csv file", "two different files for --csv and --plot")
    design = load(args.design)
    resolved = build(design)
    if not resolved.can_analyse:
        from .textout import failed_lines

        print("\n".join(failed_lines(resolved)))
        raise CheckFailure(str(args.design), resolved.failed)
    try:
        result = run_lot(design, units=units, seed=seed, distribution=args.distribution, pair_window_g=pair_window,
                         mass_window_g=mass_window, resolved=resolved)
    except ValueError as exc:  # a tolerance band that breaks the profile: a design matter, not bad input
        if isinstance(exc, DesignInputError):
            raise
        print(f"yodraft: {args.design}: {exc}", file=sys.stderr)
        return 1
    data = lot_summary(result)
    files = {}
    if args.csv:
        files[Path(args.csv)] = lot_csv(result).encode("utf-8")
    if args.plot:
        files[Path(args.plot)] = lot_svg(result, data).encode("utf-8")
    if files:
        from .output import write_files

        write_files(files)
    print(json.dumps(data, indent=2, ensure_ascii=False) if args.json else lot_text(data), end="" if not args.json else "\n")
    for path in files:
        print(path, file=sys.stderr)
    if not resolved.ok:
        raise CheckFailure(str(args.design), resolved.failed)
    return 0


def _bom(args: argparse.Namespace) -> int:
    from .bom import bill_of_materials, bom_data, bom_text
    from .builder import build
    from .design import load

    units = _whole_number(args.units, "--units", 1, 1_000_000)
    resolved = build(load(args.design))
    if not resolved.can_analyse:
        from .textout import failed_lines

        print("\n".join(failed_lines(resolved)))
        raise CheckFailure(str(args.design), resolved.failed)
    data = bom_data(bill_of_materials(resolved, units))
    print(json.dumps(data, indent=2, ensure_ascii=False) if args.json else bom_text(data), end="\n" if args.json else "")
    if not resolved.ok:
        raise CheckFailure(str(args.design), resolved.failed)
    return 0


def _write_or_print(text: str, target: str | None, inputs: Sequence[str] = ()) -> None:
    """Print ``text``, or write it atomically to ``target`` — never over one of ``inputs`` (the design files read)."""
    if target is None:
        print(text, end="" if text.endswith("\n") else "\n")
        return
    from .output import writable_target, write_atomic

    path = writable_target(Path(target), inputs)
    write_atomic(path, text.encode("utf-8"))
    print(path, file=sys.stderr)


def _templates(args: argparse.Namespace) -> int:
    from .templates import list_templates

    items = list_templates()
    if not items:
        raise DesignInputError("templates", "", "no templates folder found", "templates/*.toml beside profile/")
    width = max(len(t.name) for t in items)
    for t in items:
        print(f"{t.name:<{width}}  {t.description}")
    return 0


def _new(args: argparse.Namespace) -> int:
    from .templates import PERSONAL, new_design

    people = {key: getattr(args, key) for key in PERSONAL}
    print(new_design(Path(args.file), args.template, args.name, date=args.date, people=people, title=args.title))
    return 0


def _report(args: argparse.Namespace) -> int:
    from .builder import build
    from .design import load
    from .output import safe_stem
    from .report import picture_links, report_data, report_markdown

    resolved = build(load(args.design))
    data = report_data(resolved)
    stem = safe_stem(resolved.design.name, resolved.design.revision)
    pictures, report_dir = Path(args.pictures), Path(args.output).parent if args.output else Path(".")
    overlay: tuple[Path, bytes] | None = None
    if args.previous is not None:
        overlay = _overlay_with_previous(args, resolved, pictures, stem)
        data["previous"] = overlay[2]
    data["pictures"] = picture_links(stem, pictures, report_dir, overlay[0].name if overlay else None)
    text = json.dumps(data, indent=2, ensure_ascii=False) + "\n" if args.format == "json" else report_markdown(data)
    if overlay is None:
        _write_or_print(text, args.output, [args.design])
    else:  # the overlay and the report as one step: both files or neither
        from .output import write_files

        files = {overlay[0]: overlay[1]}
        if args.output is not None:
            _check_picture_target(args.output, [args.design, args.previous])
            files[Path(args.output)] = text.encode("utf-8")
        write_files(files)
        print(overlay[0], file=sys.stderr)
        if args.output is None:
            print(text, end="")
        else:
            print(args.output, file=sys.stderr)
    return 0 if resolved.ok else 1


def _overlay_with_previous(args: argparse.Namespace, resolved: Any, pictures: Path, stem: str) -> Any:
    """(path, SVG bytes, report section) of the overlay of the previous revision (A) with this one (B)."""
    from .builder import build
    from .design import load
    from .diff import diff
    from .output import safe_stem
    from .pictures.overlay import overlay_svg
    from .report import previous_section

    if not pictures.is_dir():
        raise DesignInputError(str(pictures), "", "is not a folder", "the folder build wrote into (--pictures)")
    previous = build(load(args.previous))
    for source, r in ((args.previous, previous), (args.design, resolved)):
        if r.profile is None:
            raise DesignInputError(source, "", "has no closed half-profile to draw",
                                   "designs whose loops close (see 'yodraft check')")
    target = pictures / f"{stem}-overlay-{safe_stem(previous.design.name, previous.design.revision)}.svg"
    _check_picture_target(str(target), [args.design, args.previous] + ([args.output] if args.output else []))
    d = diff(previous, resolved)
    return target, overlay_svg(previous, resolved, d), previous_section(d)


def _diff(args: argparse.Namespace) -> int:
    from .builder import build
    from .design import load
    from .diff import diff, diff_text

    if args.plot is not None:
        _check_picture_target(args.plot, [args.a, args.b])
    a, b = build(load(args.a)), build(load(args.b))
    result = diff(a, b)
    if args.plot is not None:
        from .output import write_atomic
        from .pictures.overlay import overlay_svg

        for source, resolved in ((args.a, a), (args.b, b)):
            if resolved.profile is None:
                raise DesignInputError(source, "", "has no closed half-profile to draw",
                                       "designs whose loops close (see 'yodraft check')")
        write_atomic(Path(args.plot), overlay_svg(a, b, result))
    print(json.dumps(result.as_dict(), indent=2, ensure_ascii=False) if args.json else diff_text(result))
    if args.plot is not None:
        print(args.plot, file=sys.stderr)
    return 0


def _check_picture_target(target: str, inputs: Sequence[str | None]) -> None:
    """A picture goes to a new or replaceable file in an existing folder, never over an input."""
    from .output import writable_target

    writable_target(Path(target), [i for i in inputs if i])


def _progress(done: int, total: int) -> None:
    filled = round(30 * done / total)
    end = "\n" if done == total else ""
    print(f"\r[{'#' * filled}{'.' * (30 - filled)}] {done}/{total}", end=end, file=sys.stderr, flush=True)


def _sweep(args: argparse.Namespace) -> int:
    from .design import load
    from .sweep import csv_text, parse_vary, sweep

    design = load(args.design)
    axes = [parse_vary(text, design) for text in args.vary]
    if len(axes) > 2:
        raise DesignInputError("--vary", "", f"given {len(axes)} times", "one or two --vary options")
    if args.jobs is not None and args.jobs < 1:
        raise DesignInputError("--jobs", "", f"got {args.jobs}", "at least 1")
    if args.y is not None and args.plot is None:
        raise DesignInputError("--y", "", "chooses what --plot draws", "--plot FILE.svg with it")
    if args.plot is not None:  # the plot's module is loaded only for a plot (a sweep's start-up is part of its time)
        from .pictures.sweep_plot import design_targets, parse_y, sweep_svg
    y_keys = parse_y(args.y) if args.y is not None else None
    _output_targets(args.design, (args.csv, args.plot))  # refused before the work, not after it
    if args.csv is not None and args.plot is not None and Path(args.csv).absolute() == Path(args.plot).absolute():
        raise DesignInputError(args.plot, "", "is also the CSV file", "two different file names for --csv and --plot")
    result = sweep(design, axes, workers=args.jobs, progress=_progress if sys.stderr.isatty() else None)
    _write_or_print(csv_text(result), args.csv, [args.design])
    if args.plot:
        from .output import write_atomic

        write_atomic(Path(args.plot), sweep_svg(result, y_keys, design_targets(design)))
        print(args.plot, file=sys.stderr)
    print(f"{result.passed} of {len(result.variants)} variants pass every check", file=sys.stderr)
    return 0 if result.passed else 1


#: changed values a watch shows after each save, unless --verbose (all) or --quiet (none)
WATCH_LINES = 6


def _watch(args: argparse.Namespace) -> int:
    from .diff import diff_text
    from .watch import watch

    for name, value in (("--max-builds", args.max_builds), ("--timeout", args.timeout), ("--interval", args.interval)):
        if value is not None and value <= 0:
            raise DesignInputError(name, "", f"got {value}", "a positive number")
    if not Path(args.design).is_file():
        raise DesignInputError(args.design, "", "no such file" if not Path(args.design).exists() else "is not a file",
                               "a design file (.toml) to watch")
    print(f"watching {args.design} (Ctrl-C to stop)", flush=True)
    try:
        for event in watch(Path(args.design), Path(args.out), interval=args.interval, max_builds=args.max_builds,
                           timeout=args.timeout, force=args.force):
            if event.kind == "built":
                print("built: " + ", ".join(str(p) for p in event.written), flush=True)
            elif event.kind == "failed":
                print(f"check failed; last good outputs kept in {args.out}", flush=True)
                for line in event.failed:
                    print(f"  FAILED {line}", flush=True)
            else:
                print(f"not built: {event.message}", flush=True)
            if event.changes is not None and not event.changes.same and not args.quiet:
                label = "changed since the last good build" if event.kind == "failed" else "changed"
                print(f"{label}:\n" + diff_text(event.changes, limit=None if args.verbose else WATCH_LINES), flush=True)
    except KeyboardInterrupt:
        pass
    return 0


def _solve(args: argparse.Namespace) -> int:
    from .design import DATE_PATTERN, load
    from .output import writable_target, write_atomic
    from .solve import TARGET_UNITS, parse_target, quantity_text, solve, solved_text
    from .textout import failed_lines
    from .tomledit import bump_revision

    design = load(args.design)
    name, goal = parse_target(args.target, args.design)
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
        print("\n".join(failed_lines(result.resolved)))
        print(f"the solved design ({quantity_text(result.value, result.spec)}) breaks these checks; nothing written")
        raise CheckFailure(str(args.design), result.resolved.failed)
    source = Path(args.design)
    revision = bump_revision(design.revision)
    out = Path(args.out) if args.out else source.with_name(f"{source.stem}-{revision}.toml")
    if out.exists() or out.resolve() == source.resolve():
        raise DesignInputError(str(out), "", "already exists", "a new file name for the solved design (-o)")
    text = solved_text(source.read_text(encoding="utf-8"), result, args.target.partition("=")[2], revision,
                       args.date or _today(), str(out))
    write_atomic(writable_target(out, [args.design]), text.encode("utf-8"))
    unit = TARGET_UNITS[name]
    print(f"{result.key} = {quantity_text(result.value, result.spec)}: {name} {result.achieved:.4f} {unit} "
          f"(target {goal:g} {unit}) after {result.evaluations} trials; every check passes")
    print(out)
    return 0


def _today() -> str:
    """Today's date, YYYY-MM-DD (the date a new revision or a new design gets unless --date is given)."""
    import datetime

    return datetime.date.today().isoformat()


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
        if not resolved.ok:  # the failures again at the end, one line each, as build, lot and bom give them
            from .textout import failed_lines

            print("\n" + "\n".join(failed_lines(resolved)))
    if not resolved.ok:
        raise CheckFailure(str(args.design), resolved.failed)  # the report is on stdout; one line on stderr
    return 0


def _build(args: argparse.Namespace) -> int:
    from .release import build_outputs

    written, resolved = build_outputs(Path(args.design), Path(args.out), force=args.force)
    if not resolved.ok:
        from .textout import failed_lines

        print("\n".join(failed_lines(resolved)))
        print("nothing written: fix the failed checks first")
        raise CheckFailure(str(args.design), resolved.failed)
    for path in written:
        print(path)
    return 0


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the ``yodraft`` command."""
    argv = sys.argv[1:] if argv is None else list(argv)
    code = 0
    streams = sys.stdout, sys.stderr
    sys.stdout, sys.stderr = _SafeStream(sys.stdout), _SafeStream(sys.stderr)  # user text never acts on a terminal
    try:
        if not argv:  # a first try with no arguments: show what the program does, not an error
            _parser().print_help()
            return 0
        args = _parser().parse_args(argv)
        code = int(args.run(args))
        sys.stdout.flush()
        return code
    except BrokenPipeError:  # the reader (e.g. `| head`) had enough: not an error of ours
        _silence_stdout()
        return code
    except YodraftError as exc:
        print(f"yodraft: {exc}", file=sys.stderr)
        return exc.exit_code
    except KeyboardInterrupt:
        print("yodraft: interrupted", file=sys.stderr)
        return 130
    except OSError as exc:  # the system refused a path given on the command line (too long, no access, full disk)
        name = exc.filename if isinstance(exc.filename, str) else "yodraft"
        print(f"yodraft: {DesignInputError(name, '', f'cannot be used ({exc.strerror or exc})', 'a usable path')}",
              file=sys.stderr)
        return 2
    except Exception as exc:  # a bug in yodraft, not in the design: still one line, unless asked for the trace
        if os.environ.get("YODRAFT_TRACEBACK"):
            raise
        print(f"yodraft: internal error ({one_line(f'{type(exc).__name__}: {exc}')}); please report it with the "
              "design file, or set YODRAFT_TRACEBACK=1 to see where", file=sys.stderr)
        return INTERNAL_ERROR
    finally:
        sys.stdout, sys.stderr = streams


class _SafeStream:
    """A text stream that shows control and format characters of what it is given as escapes."""

    def __init__(self, stream: Any) -> None:
        self._stream = stream

    def write(self, text: str) -> int:
        return self._stream.write(terminal_safe(text))

    def __getattr__(self, name: str) -> Any:  # flush, isatty, fileno … of the real stream
        return getattr(self._stream, name)


def _silence_stdout() -> None:
    """Point stdout at the null device so the interpreter's last flush cannot fail again."""
    try:
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
    except (OSError, ValueError):
        pass
