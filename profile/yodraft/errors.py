"""The error family: bad input (exit 2) and a failed design rule (exit 1)."""
from __future__ import annotations

import unicodedata
from collections.abc import Sequence
from typing import TYPE_CHECKING

if TYPE_CHECKING:  # pragma: no cover
    from .checks import Check

__all__ = ["YodraftError", "DesignInputError", "UsageError", "CheckFailure", "one_line"]


def one_line(text: str) -> str:
    r"""``text`` as one terminal-safe line: whitespace runs become one space, and control or
    format characters (an escape sequence in a key name, a right-to-left override) are shown
    as escapes instead of acting on the terminal.

    >>> one_line("a.toml:\n design.\x1b[31mred: unknown key")
    'a.toml: design.\\x1b[31mred: unknown key'
    """
    text = " ".join(text.split())
    return "".join(
        (f"\\x{ord(c):02x}" if ord(c) < 0x100 else f"\\u{ord(c):04x}") if unicodedata.category(c) in ("Cc", "Cf") else c
        for c in text)


#: longest key path shown in a message; a longer one (a pasted paragraph used as a key) is cut
KEY_SHOWN = 120


class YodraftError(Exception):
    """Base of every error yodraft raises on purpose."""

    exit_code = 2


class DesignInputError(YodraftError, ValueError):
    """Input that cannot be read: names the file, the key path and what was expected.

    >>> str(DesignInputError("a.toml", "envelope.diameter", "got 56", "a length with a unit, e.g. \\"56 mm\\""))
    'a.toml: envelope.diameter: got 56 (expected a length with a unit, e.g. "56 mm")'
    """

    exit_code = 2

    def __init__(self, file: str, key: str, problem: str, expected: str = "") -> None:
        self.file = file
        self.key = key
        self.problem = problem
        self.expected = expected
        super().__init__(file, key, problem, expected)

    def __str__(self) -> str:
        key = self.key if len(self.key) <= KEY_SHOWN else self.key[:KEY_SHOWN - 3] + "..."
        text = f"{self.file}: {key}: {self.problem}" if key else f"{self.file}: {self.problem}"
        if self.expected:
            text += f" (expected {self.expected})"
        return one_line(text)


class UsageError(YodraftError, ValueError):
    """A command line that cannot be read: names the command and where to find its usage.

    >>> str(UsageError("yodraft new", "the following arguments are required: -t/--template"))
    "new: the following arguments are required: -t/--template (see 'yodraft new --help')"
    """

    exit_code = 2

    def __init__(self, prog: str, problem: str) -> None:
        self.prog = prog
        self.problem = problem
        super().__init__(prog, problem)

    def __str__(self) -> str:
        command = self.prog.partition(" ")[2]
        text = f"{command}: {self.problem}" if command else self.problem
        return one_line(f"{text} (see '{self.prog} --help')")


class CheckFailure(YodraftError):
    """A design that reads fine but breaks one or more of the trade's rules."""

    exit_code = 1

    def __init__(self, file: str, failed: Sequence["Check"]) -> None:
        self.file = file
        self.failed = tuple(failed)
        super().__init__(file, self.failed)

    def __str__(self) -> str:
        names = ", ".join(f"{c.name} ({c.feature}.{c.parameter})" for c in self.failed)
        return one_line(f"{self.file}: {len(self.failed)} check(s) failed: {names}")
