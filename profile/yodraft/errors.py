"""The error family: bad input (exit 2) and a failed design rule (exit 1)."""
from __future__ import annotations

import datetime
import re
import unicodedata
from collections.abc import Mapping, Sequence
from typing import TYPE_CHECKING

if TYPE_CHECKING:  # pragma: no cover
    from .checks import Check

__all__ = ["YodraftError", "DesignInputError", "UsageError", "CheckFailure", "one_line", "shortened", "terminal_safe",
           "toml_shown"]


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


def toml_shown(raw: object) -> str:
    """A value read from a design file, named as TOML writes it (for "got ..." in a message).

    >>> [toml_shown(v) for v in (True, 5, "5 kg", [1, 2], {"a": 1})]
    ['the boolean true', 'the bare number 5', "'5 kg'", 'an array [1, 2]', 'a table {a = 1}']
    """
    if isinstance(raw, bool):
        return f"the boolean {str(raw).lower()}"
    if isinstance(raw, (int, float)):
        return f"the bare number {raw!r}"
    if isinstance(raw, str):
        return repr(raw[:60])
    if isinstance(raw, Mapping):
        inner = ", ".join(f"{k} = {v!r}" for k, v in list(raw.items())[:4])
        return f"a table {{{inner[:40]}}}"
    if isinstance(raw, (list, tuple)):
        return f"an array {str(list(raw))[:40]}"
    if isinstance(raw, (datetime.date, datetime.time)):
        return f"the unquoted date {raw.isoformat()}"
    return f"{raw!r}"[:40]


#: characters that act on a terminal instead of showing: C0 controls but tab, newline and carriage return, DEL,
#: the C1 controls, and the invisible format characters (bidirectional overrides and isolates, zero-width marks)
_UNSAFE = re.compile("[\x00-\x08\x0b\x0c\x0e-\x1f\x7f-\x9f\u00ad\u061c\u180e\u200b-\u200f\u202a-\u202e"
                     "\u2060-\u2064\u2066-\u206f\ufeff\ufff9-\ufffb\U000110bd\U0001d173-\U0001d17a\U000e0001"
                     "\U000e0020-\U000e007f]")


def _escape(match: re.Match[str]) -> str:
    code = ord(match.group(0))
    if code > 0xFFFF:  # as a JSON-style surrogate pair, so that escaped JSON stays valid JSON
        code -= 0x10000
        return f"\\u{0xD800 + (code >> 10):04x}\\u{0xDC00 + (code & 0x3FF):04x}"
    return f"\\u{code:04x}"


def terminal_safe(text: str) -> str:
    r"""``text`` with every character that would act on a terminal shown as a ``\uXXXX`` escape
    (valid inside a JSON string too); line breaks and tabs are kept.

    >>> terminal_safe("LS-56\u202e65-SL\n\x1b[2J")
    'LS-56\\u202e65-SL\n\\u001b[2J'
    """
    return _UNSAFE.sub(_escape, text)


#: longest file name shown in a message: a longer one keeps its start and its end
FILE_SHOWN = 160


def shortened(name: str) -> str:
    """A file name short enough for a one-line message (the middle of a very long path is cut).

    >>> shortened("/tmp/" + "a" * 300 + ".toml")[-12:], len(shortened("/" + "a" * 300))
    ('aaaaaaa.toml', 160)
    """
    if len(name) <= FILE_SHOWN:
        return name
    half = (FILE_SHOWN - 3) // 2
    return name[:half] + "..." + name[-(FILE_SHOWN - 3 - half):]


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
        file = shortened(self.file)
        text = f"{file}: {key}: {self.problem}" if key else f"{file}: {self.problem}"
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
        return one_line(f"{shortened(self.file)}: {len(self.failed)} check(s) failed: {names}")
