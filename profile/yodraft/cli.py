"""Command line: parse arguments, call the library, print, choose the exit code (0 ok, 1 check failed, 2 bad input)."""
from __future__ import annotations

import argparse
import json
import sys
from collections.abc import Sequence
from pathlib import Path
from typing import Any

from . import __version__
from .errors import CheckFailure, DesignInputError, YodraftError

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
    return top


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
    if not resolved.ok:
        raise CheckFailure(str(args.design), resolved.failed)  # the report is on stdout; one line on stderr
    return 0


def _build(args: argparse.Namespace) -> int:
    from .output import build_outputs

    written, resolved = build_outputs(Path(args.design), Path(args.out))
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
    try:
        args = _parser().parse_args(argv)
        return int(args.run(args))
    except YodraftError as exc:
        print(f"yodraft: {exc}", file=sys.stderr)
        return exc.exit_code
    except KeyboardInterrupt:
        print("yodraft: interrupted", file=sys.stderr)
        return 130
