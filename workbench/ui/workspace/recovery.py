"""Recovery copies of unsaved work, kept in the user data folder (never over the
planner's own file).

Each open plan writes ``<key>.slw`` and ``<key>.json`` (which file it came from, when)
into ``<data>/recovery`` and holds ``<key>.lock`` while it runs. A copy whose lock is
free at start-up was left by a window that did not close cleanly: it is offered back.
"""

from __future__ import annotations

import datetime as dt
import hashlib
import json
import os
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


class RecoveryStore:
    """Writes and finds recovery copies for one window."""

    def __init__(self, folder: Path | None = None):
        self.folder = (folder or data_dir()) / "recovery"
        self.key: str | None = None
        self._lock: QLockFile | None = None

    # --- this window's copy -------------------------------------------------
    def claim(self, source: str | None) -> None:
        """Start a recovery slot for the plan opened from ``source`` (None: new plan)."""
        self.release(remove=True)
        seed = os.path.abspath(source) if source else f"new-{uuid.uuid4().hex}"
        self.key = hashlib.sha1(seed.encode("utf-8")).hexdigest()[:16]
        self.source = source
        self.folder.mkdir(parents=True, exist_ok=True)
        self._lock = QLockFile(str(self.folder / f"{self.key}.lock"))
        self._lock.setStaleLockTime(0)
        self._lock.tryLock(100)

    def write(self, plan: Plan) -> Path:
        """Write (atomically) the recovery copy of ``plan``."""
        from workbench.io.planfile import save_plan
        if self.key is None:
            self.claim(None)
        path = self.folder / f"{self.key}.slw"
        save_plan(plan, path, backup=False)
        meta = {"source": self.source, "title": plan.settings.title,
                "written": dt.datetime.now().isoformat(timespec="seconds")}
        tmp = self.folder / f"{self.key}.json.tmp"
        tmp.write_text(json.dumps(meta), encoding="utf-8")
        os.replace(tmp, self.folder / f"{self.key}.json")
        return path

    def discard(self) -> None:
        """Remove this window's copy (after a save or a clean close)."""
        if self.key:
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
        lock = QLockFile(str(self.folder / f"{key}.lock"))
        lock.setStaleLockTime(0)
        if lock.tryLock(0):
            lock.unlock()
            return False
        return True


def remove_copy(folder: Path, key: str) -> None:
    for suffix in (".slw", ".json", ".slw.bak"):
        try:
            (folder / f"{key}{suffix}").unlink()
        except FileNotFoundError:
            pass
