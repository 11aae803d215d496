"""One open plan in the window: the plan, its undo history, the latest schedule.

Every edit is a core command (``workbench.core.commands``) pushed through
:meth:`Session.push`. The command is applied, the plan is re-analysed by the core and
``schedule_changed`` is emitted once. An edit the core refuses (a loop, a bad number,
a duplicate id) is rolled back so the plan stays exactly as it was, and
``edit_refused(message)`` names the problem.
"""

from __future__ import annotations

import time
from pathlib import Path

from PySide6.QtCore import QEvent, QObject, QTimer, Signal
from PySide6.QtGui import QUndoCommand, QUndoStack
from PySide6.QtWidgets import QDockWidget

from workbench.core.analysis import Analysis, analyze
from workbench.core.errors import PlanError, StatusDateMissing
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


class _PlanOnlyAdapter(QUndoCommand):
    """A QUndoCommand for a change that leaves the schedule as it is (an odds trend point)."""

    def __init__(self, session: "Session", command):
        super().__init__(command.text)
        self.session, self.command, self._skip_first_redo = session, command, True

    def redo(self) -> None:
        if self._skip_first_redo:
            self._skip_first_redo = False
            return
        self.command.do(self.session.plan)
        self.session.simulation_changed.emit()

    def undo(self) -> None:
        self.command.undo(self.session.plan)
        self.session.simulation_changed.emit()


STATUS_DATE_WAY = ("set one with Progress \u2192 Move the Status Date\u2026 "
                   "(or File \u2192 Plan Settings\u2026)")


def as_the_window_says(exc: PlanError) -> str:
    """A refusal in the window's words: a missing status date names the window's own
    controls (the command line names its option instead)."""
    return exc.with_way(STATUS_DATE_WAY) if isinstance(exc, StatusDateMissing) else str(exc)


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
        self.plan_generation = 0
        self.folder = str(Path.home())   # the open plan's folder: where export dialogs start
        self.recalc_ms = 0.0
        self.last_refusal: str | None = None
        self._selected: list[str] = []
        self.compare_baseline: str | None = None   # variance against this baseline (None: the approved one)
        self._variance: tuple | None = None
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
        """Show another plan (open a file, new plan): not undoable, clears the history.
        Every result of the old plan goes: ``plan_generation`` counts the plans shown, and
        views drop a simulation from an earlier one (see :func:`take_simulation`)."""
        self.plan.reset(plan)
        self.plan_generation += 1
        self.undo_stack.clear()
        self.undo_stack.setClean()
        self.select([])
        had_simulation = self.simulation is not None
        self.recalculate()
        if not had_simulation:
            self.simulation_changed.emit()   # views holding an out-of-date run let it go

    # --- schedule ------------------------------------------------------
    def _analyze(self):
        t0 = time.perf_counter()
        try:
            result, error = analyze(self.plan), None
        except PlanError as exc:
            result, error = None, as_the_window_says(exc)
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

    # --- the living schedule -------------------------------------------
    def variance(self):
        """The analysis compared with the chosen baseline (else the approved one): a core
        Variance, or None without a baseline or a schedule. Computed once per analysis."""
        from workbench.core.baseline import approved
        from workbench.core.variance import variance_against

        if self.analysis is None:
            return None
        names = {b.name: b for b in self.plan.baselines}
        base = names.get(self.compare_baseline) or approved(self.plan.baselines)
        key = (id(self.analysis), base)
        if self._variance is None or self._variance[0] != key:
            self._variance = (key, None if base is None else variance_against(self.analysis, base))
        return self._variance[1]

    def compare_with(self, name: str | None) -> None:
        """Choose the baseline the variance columns and bars compare with (a view choice,
        not an edit of the plan)."""
        self.compare_baseline = name
        self.schedule_changed.emit()

    def record_trend(self, point) -> None:
        """Add the odds trend point of a finished simulation as one undo step, keeping the
        simulation on screen (a trend point does not change the schedule)."""
        from workbench.core.baseline_commands import RecordTrendPoint

        command = RecordTrendPoint(point)
        command.do(self.plan)
        self.undo_stack.push(_PlanOnlyAdapter(self, command))

    def in_folder(self, name: str) -> str:
        """``name`` in the open plan's folder: what an export dialog suggests."""
        return str(Path(self.folder) / name)

    # --- selection -----------------------------------------------------
    def select(self, ids: list[str]) -> None:
        known = set(self.plan.ids())
        ids = [i for i in dict.fromkeys(ids) if i in known]
        if ids != self._selected:
            self._selected = ids
            self.selection_changed.emit(list(ids))

    def selected(self) -> list[str]:
        return list(self._selected)


class WhenShown(QObject):
    """Redraws of one view: run now while the view is on screen, else remembered and run
    once when it comes on screen (a dock tab brought forward, a closed dock reopened, a
    Present slide reached).

    On screen means shown and not covered: a dock behind another dock's tab stays
    "visible" to Qt but has an empty visible region. A view with no parent (a standalone
    widget, as in tests and picture exports) is always brought up to date at once."""

    def __init__(self, view):
        super().__init__(view)
        self.view = view
        self._pending: dict = {}          # slot -> None, in the order first asked for
        self._dock = None
        self._check = QTimer(self, singleShot=True, interval=0)
        self._check.timeout.connect(self._catch_up_if_on_screen)
        view.installEventFilter(self)

    def on_screen(self) -> bool:
        view = self.view
        return view.isWindow() or (view.isVisible() and not view.visibleRegion().isEmpty())

    def call(self, slot) -> None:
        """Run ``slot()`` now if the view is on screen, else once when it comes on screen."""
        if self.on_screen():
            self._pending.pop(slot, None)
            slot()
            return
        self._pending.setdefault(slot, None)
        self._watch_dock()

    @property
    def dirty(self) -> bool:
        """True while redraws wait for the view to come on screen."""
        return bool(self._pending)

    def catch_up(self) -> None:
        pending, self._pending = list(self._pending), {}
        for slot in pending:
            slot()

    def wrap(self, slot) -> "_Relay":
        """An object whose ``fire`` runs ``slot`` through :meth:`call`; connect signals to
        ``wrap(slot).fire`` (a QObject's method, so Qt drops the link when the view goes)."""
        return _Relay(self, slot)

    def _watch_dock(self) -> None:
        """Follow the dock holding the view: its tab being selected shows no widget anew."""
        dock = self.view.parentWidget()
        while dock is not None and not isinstance(dock, QDockWidget):
            dock = dock.parentWidget()
        if dock is not None and dock is not self._dock:
            self._dock = dock
            dock.visibilityChanged.connect(self._dock_visibility)

    def _dock_visibility(self, visible: bool) -> None:
        if visible and self._pending:
            self.catch_up()

    def _catch_up_if_on_screen(self) -> None:
        if self._pending and self.on_screen():
            self.catch_up()

    def eventFilter(self, watched, event) -> bool:  # noqa: N802 (Qt override)
        # getattr: while a closed view is torn down its helper may already have lost its
        # Python attributes (the collector clears a cycle before Qt deletes the widgets)
        if (event.type() in (QEvent.Type.Show, QEvent.Type.Resize) and getattr(self, "_pending", None)
                and watched is getattr(self, "view", None)):
            self._check.start()   # once the layout has settled: is it really on screen?
        return False


class _Relay(QObject):
    def __init__(self, helper: WhenShown, slot):
        super().__init__(helper)
        self.helper, self.slot = helper, slot

    def fire(self, *_) -> None:
        self.helper.call(self.slot)


def take_simulation(view) -> None:
    """Keep ``view.result``/``view.stale`` in step with the session: a new run replaces the
    shown result; a cleared one (the plan changed) leaves it on screen, marked stale; a
    run of a plan no longer open (New, Open, Import as a new plan) is dropped."""
    sim, generation = view.session.simulation, view.session.plan_generation
    if sim is not None:
        view.result, view.stale = sim, False
    elif getattr(view, "plan_generation", generation) != generation:
        view.result, view.stale = None, False     # another plan was loaded: nothing of the old stays
    elif view.result is not None:
        view.stale = True
    view.plan_generation = generation


def refresh_when_shown(view, slot, *signals) -> WhenShown:
    """Connect ``signals`` to ``slot`` so a hidden ``view`` does no work until it is shown.
    One line for a view: ``refresh_when_shown(self, self.refresh, session.schedule_changed)``.
    Returns the view's WhenShown (also kept as ``view.when_shown``)."""
    helper = getattr(view, "when_shown", None) or WhenShown(view)
    view.when_shown = helper
    relay = helper.wrap(slot)
    for signal in signals:
        signal.connect(relay.fire)
    return helper
