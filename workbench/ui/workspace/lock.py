"""A lock beside an open plan file, so a second window warns before editing it too."""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QLockFile


def lock_path(plan_path: str) -> str:
    p = Path(plan_path)
    return str(p.with_name(f".{p.name}.lock"))


class PlanLock:
    """Holds the lock of one plan file while it is open for editing."""

    def __init__(self, plan_path: str):
        self.plan_path = plan_path
        self._lock = QLockFile(lock_path(plan_path))
        self._lock.setStaleLockTime(0)  # only a dead owner makes it stale, never its age
        self.held = False

    def acquire(self) -> bool:
        """True if this window now holds the lock (or the folder cannot hold locks at all)."""
        self.held = self._lock.tryLock(0)
        if self.held:
            return True
        return self._lock.error() != QLockFile.LockError.LockFailedError

    def holder(self) -> str:
        """A short description of who holds it: ' (process 1234 on host)'."""
        info = self._lock.getLockInfo()
        if isinstance(info, tuple) and len(info) >= 2 and info[0]:
            pid, host = info[-3], info[-2]
            return f" (process {pid} on {host})"
        return ""

    def release(self) -> None:
        if self.held:
            self._lock.unlock()
            self.held = False
