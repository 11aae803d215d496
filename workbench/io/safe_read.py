"""Reading an input file: only a regular file, never more than a limit.

A named pipe (FIFO) would block the reader forever and a link to a device such as
``/dev/zero`` never ends, so the file is opened without blocking, checked to be a regular
file through the open descriptor (no race between the check and the read), and read up
to the limit.
"""

from __future__ import annotations

import os
import stat
from pathlib import Path


class NotReadable(Exception):
    """Why a path cannot be read as an input file (the message names the path)."""


def _kind(mode: int) -> str:
    if stat.S_ISDIR(mode):
        return "a folder"
    if stat.S_ISFIFO(mode):
        return "a pipe (FIFO)"
    if stat.S_ISCHR(mode) or stat.S_ISBLK(mode):
        return "a device"
    if stat.S_ISSOCK(mode):
        return "a socket"
    return "not a regular file"


def read_regular_file(path, limit: int, advice: str = "") -> bytes:
    """The bytes of ``path`` if it is a regular file of at most ``limit`` bytes.

    Raises :class:`NotReadable` (a folder, pipe, device, too large) or ``OSError``."""
    path = Path(path)
    flags = os.O_RDONLY | getattr(os, "O_NONBLOCK", 0) | getattr(os, "O_BINARY", 0) | getattr(os, "O_CLOEXEC", 0)
    if path.is_dir():
        raise NotReadable(f"cannot read {path.name}: it is a folder, not a file")
    fd = os.open(path, flags)
    try:
        st = os.fstat(fd)
        if not stat.S_ISREG(st.st_mode):
            raise NotReadable(f"cannot read {path.name}: it is {_kind(st.st_mode)}, not a regular file; only files can be read")
        if st.st_size > limit:
            raise NotReadable(f"{path.name}: is {st.st_size / 2**20:,.0f} MB, more than the "
                              f"{limit / 2**20:,.0f} MB limit{advice}")
        chunks, total = [], 0
        while True:
            chunk = os.read(fd, min(1 << 24, limit + 1 - total))
            if not chunk:
                break
            chunks.append(chunk)
            total += len(chunk)
            if total > limit:
                raise NotReadable(f"{path.name}: grew past the {limit / 2**20:,.0f} MB limit while being read")
        return b"".join(chunks)
    finally:
        os.close(fd)
