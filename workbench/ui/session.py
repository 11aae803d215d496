"""One open plan in the window: the plan, its undo history, the latest schedule.

Every edit is a core command (``workbench.core.commands``) pushed through
:meth:`Session.push`. The command is applied, the plan is re-analysed by the core and
``schedule_changed`` is emitted once. An edit the core refuses (a loop, a bad number,
a duplicate id) is rolled back so the plan stays exactly as it was, and
``edit_refused(message)`` names the problem.
"""

from __future__ import annotations

import time

from PySide6.QtCore import QObject, Signal
from PySide6.QtGui import QUndoCommand, QUndoStack

from workbench.core.analysis import Analysis, analyze
from workbench.core.errors import PlanError
from workbench.core.model import Plan


class _UndoAdapter(QUndoCommand):
    """A QUndoCommand that runs a core command against the session's plan."""

    def __init__(self, session: "Session", command):
        super().__init__(command.text)
        self.session = session
        self.command = command
        self._skip_first_redo = True  # Session.push has already applied it

    def redo(self) -> None:
        if self._skip_first_redo:
            self._skip_first_redo = False
            return
        self.command.do(self.session.plan)
        self.session.recalculate()

    def undo(self) -> None:
        self.command.undo(self.session.plan)
        self.session.recalculate()


class Session(QObject):
    """One open plan. Views read ``plan``/``analysis``/``simulation`` and listen to signals."""

    schedule_changed = Signal()
    simulation_changed = Signal()
    selection_changed = Signal(list)
    edit_refused = Signal(str)

    def __init__(self, plan: Plan | None = None, parent: QObject | None = None):
        super().__init__(parent)
        self.plan: Plan = plan if plan is not None else Plan()
        self.undo_stack = QUndoStack(self)
        self.analysis: Analysis | None = None
        self.analysis_error: str | None = None
        self.simulation = None
        self.recalc_ms = 0.0
        self.last_refusal: str | None = None
        self._selected: list[str] = []
        self.recalculate(emit=False)

    # --- edits ---------------------------------------------------------
    def push(self, command) -> bool:
        """Apply a core command as one undo step. Returns False (and emits
        ``edit_refused``) when the core refuses it; the plan is then unchanged."""
        was_schedulable = self.analysis is not None
        try:
            command.do(self.plan)
        except PlanError as exc:
            return self.refuse(str(exc))
        analysis, error, ms = self._analyze()
        if error is not None and was_schedulable:
            command.undo(self.plan)
            return self.refuse(error)
        self.undo_stack.push(_UndoAdapter(self, command))
        self._set_analysis(analysis, error, ms)
        return True

    def refuse(self, message: str) -> bool:
        """Report an edit that was not applied (also used for cells that cannot be read)."""
        self.last_refusal = message
        self.edit_refused.emit(message)
        return False

    def load(self, plan: Plan) -> None:
        """Show another plan (open a file, new plan): not undoable, clears the history."""
        self.plan.reset(plan)
        self.undo_stack.clear()
        self.undo_stack.setClean()
        self.select([])
        self.recalculate()

    # --- schedule ------------------------------------------------------
    def _analyze(self):
        t0 = time.perf_counter()
        try:
            result, error = analyze(self.plan), None
        except PlanError as exc:
            result, error = None, str(exc)
        except Exception as exc:  # an engine fault must not take the window (or the edit) with it
            result, error = None, f"the schedule could not be computed ({type(exc).__name__}: {exc})"
        return result, error, (time.perf_counter() - t0) * 1000.0

    def _set_analysis(self, analysis, error, ms, emit: bool = True) -> None:
        self.analysis, self.analysis_error, self.recalc_ms = analysis, error, ms
        had_simulation = self.simulation is not None
        self.simulation = None
        known = set(self.plan.ids())
        self._selected = [i for i in self._selected if i in known]
        if emit:
            self.schedule_changed.emit()
            if had_simulation:
                self.simulation_changed.emit()

    def recalculate(self, emit: bool = True) -> None:
        """Re-analyse the plan and tell every view (once)."""
        self._set_analysis(*self._analyze(), emit=emit)

    def set_simulation(self, result) -> None:
        self.simulation = result
        self.simulation_changed.emit()

    # --- selection -----------------------------------------------------
    def select(self, ids: list[str]) -> None:
        known = set(self.plan.ids())
        ids = [i for i in dict.fromkeys(ids) if i in known]
        if ids != self._selected:
            self._selected = ids
            self.selection_changed.emit(list(ids))

    def selected(self) -> list[str]:
        return list(self._selected)
