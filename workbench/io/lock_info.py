"""Who holds a plan's lock, read without Qt (the command line honours the window's lock).

A window that opens a plan for editing holds ``.NAME.slw.lock`` beside it (a Qt lock file:
the holder's process id, program name and host name on the first three lines). The lock
is held while that process runs; a lock left by a process that is gone is stale.
"""

from __future__ import annotations

import os
import socket
from dataclasses import dataclass
from pathlib import Path


def lock_path(plan_path) -> Path:
    p = Path(plan_path)
    return p.with_name(f".{p.name}.lock")


@dataclass(frozen=True)
class Holder:
    pid: int
    program: str
    host: str

    def describe(self) -> str:
        return f"process {self.pid} ({self.program or 'unknown program'}) on {self.host or 'an unknown computer'}"


def _alive(pid: int) -> bool:
    if os.name == "nt":  # os.kill would end the process: assume it runs
        return True
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except OSError:
        return True
    return True


def lock_holder(plan_path) -> Holder | None:
    """The process holding ``plan_path``'s lock, or None when it is free or stale. A lock
    taken on another computer is taken as held (it cannot be checked from here)."""
    try:
        with open(lock_path(Path(plan_path).resolve()), "rb") as handle:
            lines = handle.read(4096).decode("utf-8", "replace").splitlines()
    except (FileNotFoundError, NotADirectoryError):
        return None
    except OSError:
        return Holder(0, "", "")  # present but unreadable: someone holds it
    try:
        pid = int(lines[0])
    except (IndexError, ValueError):
        return None
    program = lines[1] if len(lines) > 1 else ""
    host = lines[2] if len(lines) > 2 else ""
    if host and host != socket.gethostname():
        return Holder(pid, program, host)
    if pid == os.getpid() or not _alive(pid):
        return None
    return Holder(pid, program, host)
