"""Writing a file so that nothing is lost and nothing outside the target is touched.

Every file Slackline writes (plan, backup, recovery copy, export, pack) goes through
:func:`write_file`: a temporary file beside the target with an unpredictable name
(``.NAME.<host>-<pid>-<random>.tmp``), created exclusively and never through a planted
link (``O_EXCL | O_NOFOLLOW``), filled, synced, given the permissions — and, where the
operating system allows, the owner and group — of the file it replaces, then renamed over
the target. The target's name therefore always holds the old or the new content.

A process killed while writing leaves its temporary file behind; the next write to the
same target removes the ones whose process is gone (:func:`sweep_leftovers`; on Windows,
the ones over an hour old).

Owner and group are kept on POSIX systems only; on Windows the replaced file takes its
access from its folder, as any new file there does (:func:`ownership_problem`).

All system calls go through this module's ``os`` name, one at a time, so a test can stop
the write between any two of them.
"""

from __future__ import annotations

import errno
import hashlib
import os
import re
import secrets
import socket
import stat
import threading
import time
from dataclasses import dataclass
from pathlib import Path
from typing import Callable

from workbench.core.errors import PlanError

CHUNK = 1 << 20
_TEMP = re.compile(r"^\.(?P<name>.+)\.(?P<host>[0-9a-f]{4})-(?P<pid>\d+)-[0-9a-f]{12}\.tmp$")
_UMASK_LOCK = threading.Lock()
LEFTOVER_AGE_S = 3600   # Windows: a temporary file this old was left by a write that ended


class OwnershipChange(PlanError):
    """Saving would change the owner or group of a file (the OS does not let this user
    keep them). Raised *before* anything is written; the caller asks the planner and
    saves again with ``accept_owner_change=True``."""


@dataclass(frozen=True)
class Keep:
    """What a written file takes over from the file it replaces."""

    mode: int
    uid: int | None = None
    gid: int | None = None


def _host_tag() -> str:
    return hashlib.sha1(socket.gethostname().encode("utf-8", "replace")).hexdigest()[:4]


def temp_name(target_name: str) -> str:
    return f".{target_name}.{_host_tag()}-{os.getpid()}-{secrets.token_hex(6)}.tmp"


def default_mode() -> int:
    """The mode a new file gets from the process's umask (read without changing it where
    the OS tells it, else swapped and restored under a lock)."""
    try:
        with open("/proc/self/status", encoding="ascii") as status:
            for line in status:
                if line.startswith("Umask:"):
                    return 0o666 & ~int(line.split()[1], 8)
    except (OSError, ValueError):
        pass
    with _UMASK_LOCK:
        mask = os.umask(0o022)
        os.umask(mask)
    return 0o666 & ~mask


def keep_of(like: Path) -> Keep:
    """Mode, owner and group of ``like`` (an existing file), or the defaults for a new one."""
    try:
        st = os.stat(like)
    except FileNotFoundError:
        return Keep(default_mode())
    if not stat.S_ISREG(st.st_mode):
        return Keep(default_mode())
    return Keep(stat.S_IMODE(st.st_mode), st.st_uid, st.st_gid)


def ownership_problem(like: Path, keep: Keep | None = None) -> str | None:
    """What a save by this user would change about ``like``'s owner or group, or None.

    A user may keep a file's group when they belong to it; only an administrator may give
    a file to another owner. POSIX only: on Windows a file's owner and access are its
    access control list, which a replaced file takes from its folder; Slackline neither
    copies nor checks it there (None), and keeps only the read-only flag of the mode."""
    keep = keep or keep_of(like)
    if keep.uid is None or os.name == "nt" or not hasattr(os, "geteuid"):
        return None
    euid = os.geteuid()
    if euid == 0:
        return None
    lost = []
    if keep.uid != euid:
        lost.append(f"owner {_user_name(keep.uid)}")
    if keep.gid != os.getegid() and keep.gid not in os.getgroups():
        lost.append(f"group {_group_name(keep.gid)}")
    if not lost:
        return None
    return (f"{Path(like).name} belongs to {' and '.join(lost)}; saving it as {_user_name(euid)} "
            f"makes the new file yours, and others may lose access to it")


def _user_name(uid: int) -> str:
    try:
        import pwd
        return pwd.getpwuid(uid).pw_name
    except (ImportError, KeyError):
        return str(uid)


def _group_name(gid: int) -> str:
    try:
        import grp
        return grp.getgrgid(gid).gr_name
    except (ImportError, KeyError):
        return str(gid)


def _open_temp(folder: Path, target_name: str) -> tuple[int, Path]:
    flags = (os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_NOFOLLOW", 0)
             | getattr(os, "O_CLOEXEC", 0) | getattr(os, "O_BINARY", 0))
    for _ in range(100):
        tmp = folder / temp_name(target_name)
        try:
            return os.open(tmp, flags, 0o600), tmp
        except FileExistsError:
            continue
    raise FileExistsError(errno.EEXIST, "could not create a temporary file", str(folder))


def _write_fd(fd: int, data) -> None:
    view = memoryview(data)
    while view:
        done = os.write(fd, view[:CHUNK])
        view = view[done:]


def _take_over(fd: int, keep: Keep, strict: bool) -> None:
    """Give the temporary file the owner, group and mode it must end with (the owner and
    group on POSIX only: see :func:`ownership_problem`)."""
    if keep.uid is not None and os.name != "nt" and hasattr(os, "fchown"):
        try:
            os.fchown(fd, keep.uid, keep.gid)
        except PermissionError:
            try:
                os.fchown(fd, -1, keep.gid)
            except PermissionError:
                if strict:
                    raise OwnershipChange("the operating system does not let this user keep the file's owner "
                                          "and group; nothing was saved", "owner") from None
            if strict and os.fstat(fd).st_uid != keep.uid:
                raise OwnershipChange("the operating system does not let this user keep the file's owner; "
                                      "nothing was saved", "owner")
    if hasattr(os, "fchmod"):   # POSIX; Windows from Python 3.13 (the read-only flag only)
        os.fchmod(fd, keep.mode)


def write_file(target, fill: Callable[[int], None] | bytes, *, like=None, accept_owner_change: bool = False,
               sync: bool = True, check: Callable[[Path], None] | None = None) -> Path:
    """Write ``target`` atomically. ``fill`` is the content (bytes) or a function that
    writes it to the open descriptor it is given. ``like`` is the file whose permissions,
    owner and group the result takes (default: ``target`` itself when it exists).
    ``check``, when given, is called with the written temporary file before it takes the
    target's name, and raises (``OSError``) to leave the target unchanged.

    Raises :class:`OwnershipChange` before writing when the owner or group cannot be kept
    (unless ``accept_owner_change``); ``OSError`` on failure, the target then unchanged."""
    target = Path(target)
    keep = keep_of(Path(like) if like is not None else target)
    problem = None if accept_owner_change else ownership_problem(target if like is None else Path(like), keep)
    if problem:
        raise OwnershipChange(problem, "owner")
    sweep_leftovers(target)
    fd, tmp = _open_temp(target.parent, target.name)
    try:
        try:
            fill(fd) if callable(fill) else _write_fd(fd, fill)
            if sync:
                os.fsync(fd)
            _take_over(fd, keep, strict=not accept_owner_change)
        finally:
            os.close(fd)
        if check is not None:
            check(tmp)
        os.replace(tmp, target)
    except BaseException:
        _unlink_quietly(tmp)
        raise
    if sync:
        fsync_folder(target.parent)
    return target


def write_with(target, writer: Callable[[object], None], *, accept_owner_change: bool = True) -> Path:
    """Like :func:`write_file` for a library that writes to a file object (CSV, XLSX, PDF):
    ``writer`` receives a binary file object opened on the exclusive temporary file."""
    def fill(fd: int) -> None:
        handle = os.fdopen(os.dup(fd), "wb")
        with handle:
            writer(handle)
    return write_file(target, fill, accept_owner_change=accept_owner_change)


def parts_filler(parts, digest) -> Callable[[int], None]:
    """A ``fill`` for :func:`write_file` that writes ``parts`` (bytes, in order) and feeds
    each to ``digest`` (a hashlib object), to be compared with :func:`file_digest`."""
    def fill(fd: int) -> None:
        for part in parts:
            digest.update(part)
            _write_fd(fd, part)
    return fill


def file_digest(path, digest) -> str:
    """``digest`` (a fresh hashlib object) of the file at ``path``, read back from the
    disk in chunks (hashing a large chunk lets other threads run)."""
    fd = os.open(path, os.O_RDONLY | getattr(os, "O_BINARY", 0))
    try:
        while chunk := os.read(fd, CHUNK):
            digest.update(chunk)
    finally:
        os.close(fd)
    return digest.hexdigest()


def fsync_folder(folder: Path) -> None:
    """Make a rename durable; not every OS lets a folder be opened (then skip)."""
    if os.name == "nt":
        return
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _pid_gone(pid: int) -> bool:
    """POSIX: True when no process ``pid`` runs (signal 0 only asks)."""
    if pid == os.getpid():
        return False
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return True
    except (PermissionError, OSError):
        return False
    return False


def _left_behind(path: Path, pid: int) -> bool:
    """Was the temporary file ``path`` (written by process ``pid``) left by a write that
    can no longer finish?

    POSIX: its process is gone. Windows has no harmless way to ask that (``os.kill``
    there *ends* the process whatever the signal), so there a leftover counts as left
    behind only when it is older than :data:`LEFTOVER_AGE_S` — no save takes that long —
    and Windows itself refuses to delete a file a running save still holds open. (The
    Windows rule is tested by simulating ``os.name``; it has not been run on Windows.)"""
    if pid == os.getpid():
        return False
    if os.name != "nt":
        return _pid_gone(pid)
    try:
        return time.time() - os.stat(path).st_mtime > LEFTOVER_AGE_S
    except OSError:
        return False


def sweep_leftovers(target) -> list[Path]:
    """Remove temporary files a killed write to ``target`` left behind: only ours (this
    host, a write that can no longer finish: :func:`_left_behind`), never another user's
    or a running save's."""
    target = Path(target)
    removed = []
    try:
        names = os.listdir(target.parent)
    except OSError:
        return removed
    host = _host_tag()
    for name in names:
        m = _TEMP.match(name)
        if m and m["name"] == target.name and m["host"] == host \
                and _left_behind(target.parent / name, int(m["pid"])):
            if _unlink_quietly(target.parent / name):
                removed.append(target.parent / name)
    return removed


def _unlink_quietly(path: Path) -> bool:
    try:
        os.unlink(path)
        return True
    except OSError:
        return False
