"""Recovery copies of unsaved work, kept in the user data folder (never over the
planner's own file).

Each window owns its own copy: ``<key>.slw`` and ``<key>.json`` (which file it came from,
when, which process) in ``<data>/recovery``, where the key is unique to that window and
session (two windows on one plan never share a copy), and holds ``<key>.lock`` while it
runs. Only the owner writes or removes its copy. A copy whose lock is free at start-up was
left by a window that did not close cleanly: a new window adopts it (takes its lock) before
offering it back or removing it.
"""

from __future__ import annotations

import datetime as dt
import hashlib
import json
import os
import socket
import uuid
from dataclasses import dataclass
from pathlib import Path

from PySide6.QtCore import QLockFile

from workbench.core.model import Plan

DATA_ENV = "SLACKLINE_DATA_DIR"


def data_dir() -> Path:
    """The user data folder (``SLACKLINE_DATA_DIR`` overrides it, e.g. in tests)."""
    override = os.environ.get(DATA_ENV)
    if override:
        return Path(override)
    from platformdirs import user_data_dir
    return Path(user_data_dir("Slackline", appauthor=False))


@dataclass
class Recovered:
    """A recovery copy found at start-up."""

    key: str
    plan_path: Path
    source: str | None  # the file it was editing, None for an unsaved new plan
    title: str
    written: str


def _new_key(source: str | None) -> str:
    """Unique to one window in one session; begins with a digest of the plan's path."""
    seed = os.path.abspath(source) if source else "new"
    return f"{hashlib.sha1(seed.encode('utf-8')).hexdigest()[:12]}-{uuid.uuid4().hex[:12]}"


def _lock(folder: Path, key: str) -> QLockFile | None:
    """The lock of ``key``'s copy, taken now; None when another live window holds it."""
    lock = QLockFile(str(folder / f"{key}.lock"))
    lock.setStaleLockTime(0)  # only a dead owner makes it stale, never its age
    return lock if lock.tryLock(0) else None


class RecoveryStore:
    """Writes and finds recovery copies for one window."""

    def __init__(self, folder: Path | None = None):
        self.folder = (folder or data_dir()) / "recovery"
        self.key: str | None = None
        self.source: str | None = None
        self._lock: QLockFile | None = None

    # --- this window's copy -------------------------------------------------
    def claim(self, source: str | None) -> None:
        """Start this window's recovery slot for the plan opened from ``source`` (None: a
        new plan); the previous slot's copy is removed (its work was saved or dropped)."""
        self.release(remove=True)
        self.folder.mkdir(parents=True, exist_ok=True)
        self.key, self.source = _new_key(source), source
        self._lock = _lock(self.folder, self.key)

    @property
    def owns(self) -> bool:
        return self.key is not None and self._lock is not None

    def write(self, plan: Plan) -> Path:
        """Write (atomically) this window's recovery copy of ``plan``."""
        if self.key is None:
            self.claim(None)
        if not self.owns:
            raise OSError(f"the recovery slot {self.key} is held by another window")
        return write_copy(self.folder, self.key, self.source, plan)

    def discard(self) -> None:
        """Remove this window's own copy (after a save or a clean close); never another's."""
        if self.owns:
            remove_copy(self.folder, self.key)

    def release(self, remove: bool = True) -> None:
        if remove:
            self.discard()
        if self._lock is not None:
            self._lock.unlock()
            self._lock = None
        self.key = None

    # --- left-over copies ---------------------------------------------------------
    def orphans(self) -> list[Recovered]:
        """Copies whose window is gone (their lock is free or stale)."""
        found = []
        if not self.folder.is_dir():
            return found
        for meta_path in sorted(self.folder.glob("*.json")):
            key = meta_path.stem
            if key == self.key or not (self.folder / f"{key}.slw").exists() or self._held(key):
                continue
            try:
                meta = json.loads(meta_path.read_text(encoding="utf-8"))
            except (OSError, ValueError):
                continue
            found.append(Recovered(key, self.folder / f"{key}.slw", meta.get("source"),
                                   meta.get("title", ""), meta.get("written", "")))
        return found

    def _held(self, key: str) -> bool:
        lock = _lock(self.folder, key)
        if lock is None:
            return True
        lock.unlock()
        return False

    def remove_orphan(self, key: str) -> bool:
        """Remove a copy left by a window that is gone, after taking its lock (so a copy a
        live window owns is never removed). False when another window holds it."""
        lock = _lock(self.folder, key)
        if lock is None:
            return False
        try:
            remove_copy(self.folder, key)
        finally:
            lock.unlock()
        return True


def write_copy(folder: Path, key: str, source: str | None, plan: Plan) -> Path:
    """Write the recovery copy ``key`` of ``plan`` into ``folder``, atomically. Takes plain
    data only, so the autosave's worker thread runs it on a snapshot of the plan.

    The copy is not parsed back (a parse of a large plan would hold Python's lock and stall
    the window): it is the serialiser's output, and the written temporary file is read back
    from the disk and must hold exactly those bytes (same SHA-256) before it takes the
    copy's name; otherwise the previous copy stays. A text the file cannot hold (a lone
    surrogate) is kept cleaned rather than losing the work."""
    from workbench.io import atomic
    from workbench.io.planfile import PlanFileError, encode_parts, storable_copy
    try:
        parts = encode_parts(plan)
    except PlanFileError as exc:
        if exc.culprit != "text":
            raise
        parts = encode_parts(storable_copy(plan))
    digest = hashlib.sha256()

    def same_bytes(tmp: Path) -> None:
        if atomic.file_digest(tmp, hashlib.sha256()) != digest.hexdigest():
            raise OSError(f"the recovery copy read back from {tmp.parent} differs from what was written")

    path = atomic.write_file(folder / f"{key}.slw", atomic.parts_filler(parts, digest),
                             accept_owner_change=True, check=same_bytes)
    meta = {"source": source, "title": plan.settings.title, "pid": os.getpid(),
            "host": socket.gethostname(), "written": dt.datetime.now().isoformat(timespec="seconds")}
    atomic.write_file(folder / f"{key}.json", json.dumps(meta).encode("utf-8"), accept_owner_change=True)
    return path


def autosave_copy(folder: Path, key: str, source: str | None, snapshot: Plan, discard) -> Path | None:
    """The autosave worker's job (plain data only: see :mod:`workbench.ui.workers`): write
    the copy, unless the window saved or closed meanwhile (``discard``, a
    ``threading.Event``, is set); a copy that lands after that is removed again, so no
    copy of outdated work outlives its window. None when nothing was kept."""
    if discard.is_set():
        return None
    path = write_copy(folder, key, source, snapshot)
    if discard.is_set():
        remove_copy(folder, key)
        return None
    return path


def remove_copy(folder: Path, key: str) -> None:
    for suffix in (".slw", ".json", ".slw.bak"):
        try:
            (folder / f"{key}{suffix}").unlink()
        except FileNotFoundError:
            pass
