"""The floor the start-up benchmarks compare against: start Python, import ezdxf, pint, shapely and numpy, save an
empty DXF — what any tool built on these libraries pays before it does any work."""
from __future__ import annotations

import os
import subprocess
import sys
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
TEMPLATE = ROOT / "templates" / "string-trick.toml"
#: run as ``python -c FLOOR empty.dxf``
FLOOR = (
    "import ezdxf, pint, shapely, numpy, sys\n"
    "doc = ezdxf.new('R2013', units=ezdxf.units.MM)\n"
    "doc.saveas(sys.argv[1])\n"
)
#: what the timed commands run with: yodraft from the source tree, nothing from the caller's environment
ENV = {"PYTHONPATH": str(ROOT / "profile"), "PATH": ""}


_compiled = False


def compile_package() -> None:
    """Write yodraft's bytecode (``__pycache__``) before the first timed run, as an installed package has it: where
    the environment asks Python not to write bytecode (PYTHONDONTWRITEBYTECODE), every run would otherwise compile
    every module it imports, which adds a third to a check and next to nothing to a long sweep."""
    global _compiled
    if not _compiled:
        import compileall

        compileall.compile_dir(str(ROOT / "profile" / "yodraft"), quiet=1)
        _compiled = True


def timed(argv: list[str]) -> float:
    """Seconds one ``python -m yodraft ARGV`` takes as a whole process (start-up included, bytecode written
    beforehand: ``compile_package``); exit 0 or 1 only."""
    compile_package()
    env = dict(os.environ, PYTHONPATH=str(ROOT / "profile"))
    start = time.perf_counter()
    done = subprocess.run([sys.executable, "-m", "yodraft", *argv], env=env, capture_output=True, text=True)
    elapsed = time.perf_counter() - start
    if done.returncode not in (0, 1):
        raise SystemExit(f"yodraft {' '.join(argv)} failed: {done.stderr.strip()}")
    return elapsed
