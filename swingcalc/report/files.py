"""Atomic, no-clobber writing of report files."""

from __future__ import annotations

import errno
import os
import tempfile
from pathlib import Path

from ..errors import InvalidInput

__all__ = ["check_writable", "write_atomic"]

_ALLOWED = "a path to a new file in a writable folder (add --force to replace a file)"


def check_writable(path, force: bool = False, field: str = "--output") -> Path:
    """Fail early (before any computing) if ``path`` cannot be written."""
    p = Path(path)
    if p.is_dir():
        raise InvalidInput(field, str(path), _ALLOWED, "is a folder, not a file")
    if p.exists() and not force:
        raise InvalidInput(field, str(path), _ALLOWED, "file exists; add --force to replace it")
    parent = p.parent if str(p.parent) else Path(".")
    if not parent.is_dir():
        raise InvalidInput(field, str(path), _ALLOWED, "its folder does not exist")
    if not os.access(parent, os.W_OK | os.X_OK):
        raise InvalidInput(field, str(path), _ALLOWED, "its folder is not writable")
    return p


def write_atomic(path, text: str, force: bool = False, field: str = "--output") -> Path:
    """Write ``text`` to ``path`` all at once, or not at all.

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
        raise InvalidInput(field, str(path), _ALLOWED,
                           f"cannot write there ({exc.strerror or exc})") from None
    try:
        try:
            with os.fdopen(fd, "w", encoding="utf-8", newline="") as f:
                f.write(text)
                f.flush()
                os.fsync(f.fileno())
            os.chmod(tmp, 0o666 & ~_umask())
            if force:
                os.replace(tmp, p)
            else:
                _link_no_clobber(tmp, p)
        except FileExistsError:
            raise InvalidInput(field, str(path), _ALLOWED,
                               "file exists; add --force to replace it") from None
        except OSError as exc:
            raise InvalidInput(field, str(path), _ALLOWED,
                               f"cannot write there ({exc.strerror or exc})") from None
    finally:
        if os.path.exists(tmp):
            os.unlink(tmp)
    return p


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
