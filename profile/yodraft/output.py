"""Writing outputs: atomically (temp file in the same folder, then rename) and inside the output folder."""
from __future__ import annotations

import errno
import os
import re
import stat
import tempfile
from pathlib import Path
from collections.abc import Iterator, Sequence
from contextlib import contextmanager

from .errors import DesignInputError

__all__ = ["write_atomic", "write_files", "safe_stem", "output_path", "prepare_directory", "writable_target",
           "directory_lock", "clean_stale_parts"]


def write_atomic(path: Path, data: bytes) -> None:
    """Write ``data`` to ``path`` so that a reader sees the old file or the new one, never half of one."""
    write_files({Path(path): data})


def write_files(files: "dict[Path, bytes]") -> None:
    """Write several files as one step: every one is staged in a hidden temporary file in its
    folder and flushed to disk before any is renamed into place, so a failure (a folder stands
    under a name, the disk is full) leaves every old file as it was.

    A name that cannot be written is a DesignInputError naming the file.
    """
    staged: list[tuple[str, Path]] = []
    for path in files:
        writable_target(path)
    try:
        for path, data in files.items():
            if path.is_dir():  # the one way a rename in the same folder can still fail
                raise IsADirectoryError(errno.EISDIR, os.strerror(errno.EISDIR), str(path))
            staged.append((_stage(path, data), path))
        for tmp, path in staged:
            os.replace(tmp, path)
    except BaseException as exc:
        for tmp, _ in staged:
            try:
                os.unlink(tmp)
            except FileNotFoundError:
                pass
        if isinstance(exc, OSError):
            name = exc.filename if isinstance(exc.filename, str) else str(next(iter(files)))
            raise DesignInputError(name, "", f"cannot be written ({exc.strerror})",
                                   "a file name free of folders in a writable output folder") from None
        raise


def _stage(path: Path, data: bytes) -> str:
    """``data`` in a hidden temporary file beside ``path``, on disk; returns its name."""
    fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".part", dir=path.parent)
    try:
        os.fchmod(fd, _file_mode(path))  # mkstemp makes the file private (0600); a drawing is for sharing
        with os.fdopen(fd, "wb") as handle:
            handle.write(data)
            handle.flush()
            os.fsync(handle.fileno())
    except BaseException:
        os.unlink(tmp)
        raise
    return tmp


#: longest stem, leaving room for suffixes such as ".sheet.dxf" under the usual 255-byte name limit
STEM_MAX = 100


def _file_mode(path: Path) -> int:
    """The permissions the written file gets: those of the file it replaces, else what the umask allows."""
    try:
        return stat.S_IMODE(os.stat(path).st_mode)
    except OSError:
        mask = os.umask(0o022)
        os.umask(mask)
        return 0o666 & ~mask


def safe_stem(name: str, revision: str) -> str:
    """A file stem ``<name>-<revision>`` with anything but letters, digits, '.', '_' and '-' replaced.

    It never starts with '.' (a hidden file) or '-' (read as an option by shell tools)
    and is at most STEM_MAX characters long.

    >>> safe_stem("ls56/../x", "B")
    'ls56_.._x-B'
    >>> safe_stem("-rf", "A"), safe_stem("", "")
    ('rf-A', 'design')
    """
    clean = re.sub(r"[^A-Za-z0-9._-]", "_", f"{name[:STEM_MAX]}-{revision[:20]}").lstrip(".-")
    return clean[:STEM_MAX] or "design"


def output_path(directory: Path, filename: str) -> Path:
    """``directory / filename``, refusing any name that would leave the directory.

    The name itself is not resolved: a link already standing under that name is
    replaced by the new file, never followed out of the folder.

    >>> output_path(Path("/tmp"), "x-A.dxf")
    PosixPath('/tmp/x-A.dxf')
    """
    directory = Path(directory).resolve()
    if filename in ("", ".", "..") or "/" in filename or "\\" in filename or "\x00" in filename:
        raise ValueError(f"output name {filename!r} leaves {directory}")
    target = directory / filename
    if target.parent != directory:
        raise ValueError(f"output name {filename!r} leaves {directory}")
    return target


def prepare_directory(directory: Path) -> Path:
    """The output folder, created if needed; DesignInputError if it cannot be written."""

    directory = Path(directory)
    try:
        if directory.exists() and not directory.is_dir():
            raise DesignInputError(str(directory), "", "is not a folder", "an output folder")
        directory.mkdir(parents=True, exist_ok=True)
        probe = tempfile.NamedTemporaryFile(dir=directory, prefix=".yodraft-probe-")
        probe.close()
    except OSError as exc:
        raise DesignInputError(str(directory), "", f"cannot be written ({exc.strerror})", "a writable output folder") from None
    return directory


def writable_target(path: Path, inputs: Sequence[Path | str] = ()) -> Path:
    """``path`` if yodraft may write a file there, else DesignInputError naming it: its folder must exist, and
    nothing but a regular file (or a link) may stand under its name — never a device, a pipe or a folder, which a
    rename would replace — and it must not be one of ``inputs`` (the design files a command reads).
    """
    path = Path(path)
    name = str(path)
    try:
        st = os.lstat(path)
    except FileNotFoundError:
        st = None
    except OSError as exc:
        raise DesignInputError(name, "", f"cannot be written ({exc.strerror})", "a file name in a writable folder") from None
    if st is not None and not (stat.S_ISREG(st.st_mode) or stat.S_ISLNK(st.st_mode)):
        what = "a folder" if stat.S_ISDIR(st.st_mode) else "a device, pipe or socket, not a file"
        raise DesignInputError(name, "", f"is {what}", "a file name to write")
    if not path.parent.is_dir():
        raise DesignInputError(name, "", "its folder does not exist", "a file in an existing folder")
    for source in inputs:
        try:
            same = st is not None and os.path.samefile(path, source)
        except OSError:
            same = False
        if same:
            raise DesignInputError(name, "", "is one of the input files; not overwritten", "another file name")
    return path


@contextmanager
def directory_lock(directory: Path) -> Iterator[None]:
    """Hold an exclusive lock on the output folder (no file is left behind): two builds writing into one folder
    take turns, so a drawing and its build record always come from the same build."""
    import fcntl

    fd = os.open(directory, os.O_RDONLY)
    try:
        fcntl.flock(fd, fcntl.LOCK_EX)
        yield
    finally:
        os.close(fd)  # closing releases the lock


def clean_stale_parts(paths: Sequence[Path]) -> None:
    """Remove the hidden ``.part`` files a killed writer of one of ``paths`` left behind (call it under the
    folder's lock, so no live writer of the same file is at work)."""
    for path in paths:
        for stale in path.parent.glob(f".{_glob_escape(path.name)}.*.part"):
            try:
                stale.unlink()
            except OSError:
                pass


def _glob_escape(name: str) -> str:
    return re.sub(r"([*?\[])", r"[\1]", name)
