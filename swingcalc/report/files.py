"""Atomic, no-clobber writing of report files."""

from __future__ import annotations

import errno
import os
import tempfile
from pathlib import Path

from ..errors import InvalidInput

__all__ = ["check_writable", "write_atomic"]

_ALLOWED = "a path to a new file in a writable folder (or --force to replace a file)"


def check_writable(path, force: bool = False, field: str = "--output") -> Path:
    """Fail early (before any computing) if ``path`` cannot be written."""
    if str(path) == "":
        raise InvalidInput(field, path, "an output file path, e.g. 'report.csv'", "empty value")
    p = Path(path)
    parent = p.parent if str(p.parent) else Path(".")
    try:
        problem = ("is a folder, not a file" if p.is_dir()
                   else "is not a regular file (a device, pipe or socket is never replaced)"
                   if p.exists() and not p.is_file()
                   else "file exists" if p.exists() and not force
                   else "its folder does not exist" if not parent.is_dir()
                   else "its folder is not writable" if not os.access(parent, os.W_OK | os.X_OK)
                   else None)
    except OSError as exc:      # e.g. a name over 255 bytes: ENAMETOOLONG from stat
        problem = f"cannot use this path ({exc.strerror or type(exc).__name__})"
    except ValueError:          # a NUL byte in the name
        problem = "the path contains a NUL byte"
    if problem:
        raise InvalidInput(field, _shown(path), _ALLOWED, problem)
    return p


def write_atomic(path, text: str | bytes, force: bool = False, field: str = "--output") -> Path:
    """Write ``text`` (str: UTF-8 text; bytes: as they are, e.g. a PDF) to ``path`` all at
    once, or not at all.

    The text goes to a temporary file in the same folder, is flushed to disk, and is then
    renamed into place (``force``) or hard-linked into place, which fails if the name
    already exists, so a file that appeared meanwhile is never overwritten. A reader
    never sees a half-written file.
    """
    p = check_writable(path, force, field)
    parent = p.parent if str(p.parent) else Path(".")
    try:
        fd, tmp = tempfile.mkstemp(prefix=f".{p.name}.", suffix=".tmp", dir=parent)
    except OSError as exc:
        raise InvalidInput(field, _shown(path), _ALLOWED,
                           f"cannot write there ({exc.strerror or exc})") from None
    try:
        try:
            binary = isinstance(text, (bytes, bytearray))
            with (os.fdopen(fd, "wb") if binary
                  else os.fdopen(fd, "w", encoding="utf-8", newline="")) as f:
                f.write(text)
                f.flush()
                os.fsync(f.fileno())
            os.chmod(tmp, 0o666 & ~_umask())
            if force:
                os.replace(tmp, p)
            else:
                _link_no_clobber(tmp, p)
        except FileExistsError:
            raise InvalidInput(field, _shown(path), _ALLOWED, "file exists") from None
        except OSError as exc:
            raise InvalidInput(field, _shown(path), _ALLOWED,
                               f"cannot write there ({exc.strerror or exc})") from None
    finally:
        if os.path.exists(tmp):
            os.unlink(tmp)
    return p


def _shown(path) -> str:
    """The path for a message, shortened in the middle when long (names can be 4 KB)."""
    text = str(path)
    return text if len(text) <= 50 else f"{text[:30]}...{text[-17:]}"


def _link_no_clobber(tmp: str, target: Path) -> None:
    try:
        os.link(tmp, target)
    except OSError as exc:
        if exc.errno not in (errno.EPERM, errno.ENOTSUP, errno.EOPNOTSUPP, errno.EXDEV,
                             errno.EMLINK):
            raise
        # No hard links here (some network or FAT file systems): claim the name with an
        # exclusive create, then rename the finished file over the empty placeholder.
        fd = os.open(target, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o666)
        os.close(fd)
        os.replace(tmp, target)


def _umask() -> int:
    mask = os.umask(0)
    os.umask(mask)
    return mask
