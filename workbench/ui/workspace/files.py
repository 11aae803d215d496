"""Files for one window: new, open, save, save as, recent files, the unsaved-changes
question, plan locks, autosave to a recovery copy and recovery after a crash."""

from __future__ import annotations

import os
import threading
from pathlib import Path

from PySide6.QtCore import QObject, QSettings, QTimer, Signal

from workbench.core.errors import PlanError
from workbench.core.formatting import format_stored_timestamp
from workbench.core.model import Plan
from workbench.ui import prompts, workers
from workbench.ui.workspace import recovery
from workbench.ui.workspace.lock import PlanLock
from workbench.ui.workspace.recovery import RecoveryStore
from workbench.ui.session import Session

RECENT_KEY = "files/recent"
LAST_KEY = "files/last"
RECENT_MAX = 8
AUTOSAVE_MS = 3 * 60 * 1000
AUTOSAVE_WAIT_S = 60.0   # the longest a failed save waits for a recovery copy being written
TABLE_SUFFIXES = (".csv", ".xlsx")


class FileController(QObject):
    """Keeps the session, the file it came from and the recovery copy in step."""

    path_changed = Signal()
    saved = Signal(str)          # the path just written
    recent_changed = Signal()
    message = Signal(str)

    def __init__(self, session: Session, parent_widget, store: RecoveryStore | None = None):
        super().__init__(parent_widget)
        self.session = session
        self.widget = parent_widget
        self.path: str | None = None
        self.read_only = False
        self._lock: PlanLock | None = None
        self.store = store or RecoveryStore()
        self.store.claim(None)
        self._autosave_due = False
        self._autosaving: workers.Job | None = None
        self._discard = threading.Event()
        session.undo_stack.indexChanged.connect(self._mark_due)
        self.timer = QTimer(self)
        self.timer.setInterval(int(os.environ.get("SLACKLINE_AUTOSAVE_MS", AUTOSAVE_MS)))
        self.timer.timeout.connect(self.autosave)
        self.timer.start()

    # --- state -----------------------------------------------------------
    @property
    def modified(self) -> bool:
        return not self.session.undo_stack.isClean()

    def display_name(self) -> str:
        return Path(self.path).name if self.path else (self.session.plan.settings.title or "Untitled plan")

    def _mark_due(self, *_):
        self._autosave_due = True

    def _set_path(self, path: str | None, read_only: bool = False) -> None:
        self._drop_autosave()
        if self._lock is not None:
            self._lock.release()
            self._lock = None
        self.path, self.read_only = path, read_only
        if path:
            self.session.folder = str(Path(path).parent)
        if path and not read_only:
            self._lock = PlanLock(path)
            self._lock.acquire()
        if path:
            self._remember(path)
        self.store.claim(path)
        self.path_changed.emit()

    # --- new / open ----------------------------------------------------------
    def new_plan(self, plan: Plan | None = None) -> bool:
        if not self.maybe_save():
            return False
        self.session.load(plan or Plan())
        self._set_path(None)
        return True

    def open_dialog(self) -> bool:
        path = prompts.ask_open_path(self.widget, folder=self._folder())
        return self.open_path(path) if path else False

    def open_path(self, path: str, ask: bool = True) -> bool:
        """Open a .slw plan, or import a .csv/.xlsx table into the open plan."""
        if Path(path).suffix.lower() in TABLE_SUFFIXES:
            from workbench.ui.workspace.table_transfer import import_table
            return import_table(self.widget, self.session, path, start_new=self.new_plan)
        if ask and not self.maybe_save():
            return False
        may_edit = True if _bundled(path) else self._may_edit(path)   # a copy is opened: no lock
        if may_edit is None:
            return False
        read_only = not may_edit
        try:
            from workbench.io.planfile import load_plan
            plan = load_plan(path)
        except (PlanError, OSError) as exc:
            prompts.show_error(self.widget, "Cannot open plan", _describe(exc, path))
            return False
        self.session.load(plan)
        if _bundled(path):   # the demos shipped with Slackline stay as shipped: Save asks where
            self._set_path(None)
            self.message.emit(f"Opened {Path(path).name} as an untitled copy; Save asks where to keep it")
            return True
        self._set_path(str(Path(path).resolve()), read_only)
        self.message.emit(f"Opened {Path(path).name}" + (" (read-only)" if read_only else ""))
        from workbench.ui.workspace.table_transfer import tell_long_texts
        tell_long_texts(self.widget, plan, Path(path).name)
        return True

    def _may_edit(self, path: str):
        """False to open read-only, None to give up, True to edit."""
        resolved = str(Path(path).resolve())
        if resolved == self.path and self._lock is not None and self._lock.held:
            return True
        lock = PlanLock(resolved)
        if lock.acquire():
            lock.release()
            return True
        if prompts.ask_locked(self.widget, path, lock.holder()) == "readonly":
            return False
        return None

    # --- save ------------------------------------------------------------------
    def save(self) -> bool:
        if not self.path or self.read_only:
            if self.read_only:
                self.message.emit("This plan is open read-only; choose a new name.")
            return self.save_as()
        written = self._write(self.path)
        if written and written != self.path:
            self._set_path(written)
        return written is not None

    def save_as(self) -> bool:
        written = self._choose_and_write()
        if written:
            self._set_path(written)
        return written is not None

    def _choose_and_write(self) -> str | None:
        suggested = self.path or str(Path(self._folder()) / f"{self.session.plan.settings.title or 'plan'}.slw")
        path = prompts.ask_save_path(self.widget, suggested=suggested)
        if not path:
            return None
        if not path.lower().endswith(".slw"):
            path += ".slw"
        return self._write(path)

    def _write(self, path: str, accept_owner_change: bool = False) -> str | None:
        """Save to ``path``; on failure keep the recovery copy and offer another name.
        Returns the path written (None: not saved, and the window must stay open)."""
        from workbench.io import planfile
        try:
            planfile.save_plan(self.session.plan, path, accept_owner_change=accept_owner_change)
        except planfile.OwnershipChange as exc:
            return self._owner_change(path, exc)
        except Exception as exc:  # noqa: BLE001 - whatever went wrong, the work stays
            kept = self._keep_recovery_copy()
            note = "\n\nNothing is lost: the window stays open" + (" and a recovery copy was written." if kept else ".")
            if prompts.ask_save_as_instead(self.widget, f"Could not save {Path(path).name}.\n{_describe(exc, path).removeprefix('not saved: ')}{note}"):
                return self._choose_and_write()
            return None
        self.session.undo_stack.setClean()
        self._drop_autosave()
        self.store.discard()
        self._autosave_due = False
        self.message.emit(f"Saved {Path(path).name}")
        self.saved.emit(str(Path(path).resolve()))
        return str(Path(path).resolve())

    def _owner_change(self, path: str, exc: Exception) -> str | None:
        """Asked before anything is written: save anyway, save under another name, or not."""
        answer = prompts.ask_owner_change(self.widget, str(exc))
        if answer == "save":
            return self._write(path, accept_owner_change=True)
        return self._choose_and_write() if answer == "save_as" else None

    def _keep_recovery_copy(self) -> bool:
        """After a failed save: the unsaved work goes to the recovery copy at once."""
        if not self.modified:
            return False
        self.finish_autosave()
        try:
            self.store.write(self.session.plan.snapshot())
        except Exception as exc:  # noqa: BLE001
            self.message.emit(f"Could not write the recovery copy either: {exc}")
            return False
        return True

    def maybe_save(self) -> bool:
        """Ask about unsaved changes; True when it is fine to go on."""
        if not self.modified:
            return True
        answer = prompts.ask_unsaved(self.widget, self.display_name())
        if answer == "save":
            return self.save()
        return answer == "discard"

    def close(self) -> None:
        """After a clean close: no recovery copy, no lock."""
        self.timer.stop()
        self._drop_autosave()
        self.store.release(remove=True)
        if self._lock is not None:
            self._lock.release()

    # --- autosave and recovery ---------------------------------------------------
    def autosave(self) -> bool:
        """Start writing the recovery copy: the plan is snapshotted here (cheap) and
        serialised and written in a worker thread that gets plain data only (the snapshot,
        the folder and the copy's key), so typing never waits for it.
        True when a write was started."""
        if not (self.modified and self._autosave_due) or self.autosave_running:
            return False
        if self.store.key is None:
            self.store.claim(None)
        if not self.store.owns:
            self.message.emit(f"Could not write the recovery copy: the slot {self.store.key} is held by another window")
            return False
        snapshot = self.session.plan.snapshot()
        self._autosave_due = False
        self._discard = threading.Event()
        self._autosaving = workers.start(recovery.autosave_copy, self.store.folder, self.store.key, self.store.source,
                                         snapshot, self._discard, on_done=self._autosave_finished,
                                         on_failed=self._autosave_failed, name="slackline-autosave")
        return True

    @property
    def autosave_running(self) -> bool:
        return self._autosaving is not None and self._autosaving.running

    def _autosave_finished(self, path) -> None:
        if path is not None:
            self.message.emit("Recovery copy written")

    def _autosave_failed(self, exc: Exception) -> None:
        self._autosave_due = True  # try again at the next tick
        self.message.emit(f"Could not write the recovery copy: {exc}")

    def finish_autosave(self, timeout: float = AUTOSAVE_WAIT_S) -> bool:
        """Wait, at most ``timeout`` seconds, for a recovery copy being written (before
        writing one at once after a failed save; tests). True when none is being written."""
        return self._autosaving is None or self._autosaving.wait(timeout)

    def _drop_autosave(self) -> None:
        """The work was saved, or the window closes or moves to another slot: a copy being
        written is not waited for; it is removed as soon as it lands."""
        if self._autosaving is not None:   # kept: no new autosave starts until this one has ended
            self._discard.set()
            self._autosaving.abandon()
            self._autosaving.wait(workers.CLOSE_WAIT_S)

    def offer_recovery(self) -> bool:
        """Offer each copy left by a window that did not close; True if one was restored."""
        for found in self.store.orphans():
            source = found.source or "a new, never saved plan"
            answer = prompts.ask_recovery(self.widget, f"Slackline found unsaved work on “{found.title}”.",
                                          f"From {source}, written {format_stored_timestamp(found.written)}.")
            if answer == "restore" and self._restore(found):
                return True
            if answer == "open" and found.source and Path(found.source).exists():
                self.store.remove_orphan(found.key)
                return self.open_path(found.source, ask=False)
            if answer == "discard":
                self.store.remove_orphan(found.key)
        return False

    def _restore(self, found) -> bool:
        from workbench.io.planfile import load_plan
        try:
            plan = load_plan(found.plan_path)
        except (PlanError, OSError) as exc:
            prompts.show_error(self.widget, "Cannot restore", _describe(exc, str(found.plan_path)))
            return False
        self.session.load(plan)
        self._set_path(found.source if found.source and Path(found.source).exists() else None)
        self.store.remove_orphan(found.key)
        self.session.undo_stack.resetClean()  # restored work is unsaved until saved
        self.store.write(self.session.plan)
        self.message.emit("Recovered unsaved work; save it to keep it.")
        self.path_changed.emit()
        return True

    # --- recent files ---------------------------------------------------------------
    def recent_files(self) -> list[str]:
        value = QSettings().value(RECENT_KEY, [])
        items = [value] if isinstance(value, str) else list(value or [])
        return [p for p in items if p]

    def _remember(self, path: str) -> None:
        items = [path] + [p for p in self.recent_files() if p != path]
        settings = QSettings()
        settings.setValue(RECENT_KEY, items[:RECENT_MAX])
        settings.setValue(LAST_KEY, path)
        self.recent_changed.emit()

    def clear_recent(self) -> None:
        QSettings().setValue(RECENT_KEY, [])
        self.recent_changed.emit()

    def _folder(self) -> str:
        return str(Path(self.path).parent) if self.path else str(Path.home())


def _bundled(path: str) -> bool:
    """True for a plan shipped in Slackline's resources (the demo)."""
    from workbench.resources import resources_dir
    try:
        return Path(path).resolve().is_relative_to(resources_dir().resolve())
    except OSError:
        return False


def _describe(exc: Exception, path: str) -> str:
    if isinstance(exc, PermissionError):
        return f"{path}: this location is read-only or locked ({exc.strerror})."
    if isinstance(exc, OSError):
        return f"{path}: {exc.strerror or exc}"
    return str(exc)
