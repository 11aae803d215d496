"""Undoable edits to a plan. Pure Python, no Qt.

Every command has ``do(plan)``, ``undo(plan)`` and a human ``text``. ``do`` either
changes the plan completely or raises :class:`PlanError` leaving it as it was; ``undo``
restores exactly what ``do`` changed. The window wraps them in a thin QUndoCommand;
scripts can use them directly:

>>> cmd = EditActivity("A", name="Survey")
>>> cmd.do(plan); cmd.undo(plan)
"""

from __future__ import annotations

from dataclasses import fields, replace
from typing import Iterable, Sequence

from .errors import PlanError
from .long_texts import check_entered, check_entered_settings
from .model import Activity, Link, Plan, Settings

ACTIVITY_FIELDS = tuple(f.name for f in fields(Activity))


class Command:
    """Base class: a named, reversible change to a plan."""

    text = "Edit"

    def do(self, plan: Plan) -> None:  # pragma: no cover - abstract
        raise NotImplementedError

    def undo(self, plan: Plan) -> None:  # pragma: no cover - abstract
        raise NotImplementedError


class EditActivity(Command):
    """Change fields of one activity (``id=`` renames it; links follow)."""

    def __init__(self, act_id: str, **changes):
        unknown = set(changes) - set(ACTIVITY_FIELDS)
        if unknown:
            raise PlanError(f"activity {act_id}: unknown field(s) {', '.join(sorted(unknown))}", act_id)
        self.act_id = act_id
        self.changes = changes
        self.old: Activity | None = None
        names = ", ".join(k.replace("_", " ") for k in changes)
        self.text = f"Edit {act_id}: {names}"

    def do(self, plan: Plan) -> None:
        old = plan.activity(self.act_id)
        new = old.with_(**self.changes)
        check_entered(new, old)                     # a text typed now keeps to its limit
        plan.replace_activity(self.act_id, new)
        self.old = old
        changed = [k for k, v in self.changes.items() if getattr(old, k) != v]
        if changed:   # the history names what changed, not every field the gesture touched
            self.text = f"Edit {self.act_id}: {', '.join(k.replace('_', ' ') for k in changed)}"

    def undo(self, plan: Plan) -> None:
        new_id = self.changes.get("id", self.act_id)
        plan.replace_activity(new_id, self.old)


class AddActivity(Command):
    """Insert one activity at ``row`` (end of the plan when None), with optional links."""

    def __init__(self, activity: Activity, row: int | None = None, links: Iterable[Link] = ()):
        self.activity = activity
        self.row = row
        self.links = list(links)
        self.text = f"Add activity {activity.id}"
        self._old_links: list[Link] | None = None

    def do(self, plan: Plan) -> None:
        check_entered(self.activity)
        row = len(plan) if self.row is None else self.row
        plan.insert_activity(row, self.activity)
        if self.links:
            try:
                self._old_links = plan.set_links(plan.links + self.links)
            except PlanError:
                plan.remove_activity(self.activity.id)
                raise

    def undo(self, plan: Plan) -> None:
        if self._old_links is not None:
            plan.set_links(self._old_links)
        plan.remove_activity(self.activity.id)


class AddActivities(Command):
    """Insert several activities (a paste, an import into an open plan) and their links."""

    def __init__(self, activities: Sequence[Activity], row: int | None = None,
                 links: Iterable[Link] = (), text: str | None = None):
        self.activities = list(activities)
        self.row = row
        self.links = list(links)
        self.text = text or f"Add {len(self.activities)} activities"
        self._old_links: list[Link] | None = None
        self._done = 0

    def do(self, plan: Plan) -> None:
        for act in self.activities:                 # a paste is entry: its texts keep to the limits
            check_entered(act)
        row = len(plan) if self.row is None else self.row
        self._done = 0
        try:
            for i, act in enumerate(self.activities):
                plan.insert_activity(row + i, act)
                self._done += 1
            self._old_links = plan.set_links(plan.links + self.links)
        except PlanError:
            self._remove_added(plan)
            raise

    def _remove_added(self, plan: Plan) -> None:
        for act in reversed(self.activities[:self._done]):
            plan.remove_activity(act.id)
        self._done = 0

    def undo(self, plan: Plan) -> None:
        plan.set_links(self._old_links)
        self._done = len(self.activities)
        self._remove_added(plan)


class RemoveActivities(Command):
    """Remove activities and every link touching them, as one step."""

    def __init__(self, act_ids: Sequence[str]):
        self.act_ids = list(dict.fromkeys(act_ids))
        self.removed: list[tuple[int, Activity, list]] = []
        shown = ", ".join(self.act_ids[:3]) + ("…" if len(self.act_ids) > 3 else "")
        self.text = f"Delete {shown}"

    def do(self, plan: Plan) -> None:
        for act_id in self.act_ids:
            plan.activity(act_id)  # raises for an unknown id before anything changes
        self.removed = [plan.remove_activity(act_id) for act_id in self.act_ids]

    def undo(self, plan: Plan) -> None:
        for row, act, links in reversed(self.removed):
            plan.restore_activity(row, act, links)
        self.removed = []


def RemoveActivity(act_id: str) -> RemoveActivities:
    """Remove one activity and its links."""
    return RemoveActivities([act_id])


class SetPredecessors(Command):
    """Replace the incoming links of one activity."""

    def __init__(self, act_id: str, links: Iterable[Link]):
        self.act_id = act_id
        self.links = list(links)
        for link in self.links:
            if link.succ != act_id:
                raise PlanError(f"activity {act_id}: a predecessor link must end at {act_id}, not at {link.succ}", act_id)
        self.text = f"Predecessors of {act_id}"
        self._old: list[Link] | None = None

    def do(self, plan: Plan) -> None:
        plan.activity(self.act_id)
        keep = [l for l in plan.links if l.succ != self.act_id]
        self._old = plan.set_links(keep + self.links)

    def undo(self, plan: Plan) -> None:
        plan.set_links(self._old)


class SetLinks(Command):
    """Replace every link of the plan."""

    def __init__(self, links: Iterable[Link], text: str = "Edit links"):
        self.links = list(links)
        self.text = text
        self._old: list[Link] | None = None

    def do(self, plan: Plan) -> None:
        self._old = plan.set_links(self.links)

    def undo(self, plan: Plan) -> None:
        plan.set_links(self._old)


class MoveActivity(Command):
    """Move the activity at row ``src`` to row ``dst``."""

    def __init__(self, src: int, dst: int):
        self.src, self.dst = src, dst
        self.text = f"Move row {src + 1} to {dst + 1}"

    def do(self, plan: Plan) -> None:
        n = len(plan)
        if not (0 <= self.src < n and 0 <= self.dst < n):
            raise PlanError(f"cannot move row {self.src + 1} to {self.dst + 1}: the plan has {n} rows", "row")
        plan.move_activity(self.src, self.dst)

    def undo(self, plan: Plan) -> None:
        plan.move_activity(self.dst, self.src)


class SetSettings(Command):
    """Replace the plan settings (title, calendar, deadline, …) in one step."""

    def __init__(self, settings: Settings, text: str = "Plan settings"):
        self.settings = settings
        self.text = text
        self._old: Settings | None = None

    def do(self, plan: Plan) -> None:
        check_entered_settings(self.settings, plan.settings)
        self._old = plan.set_settings(self.settings)

    def undo(self, plan: Plan) -> None:
        plan.set_settings(self._old)


class ReplacePlan(Command):
    """Take over the whole content of another plan (an import) as one step."""

    def __init__(self, other: Plan, text: str = "Replace plan"):
        self.other = other.copy()
        self.text = text
        self._old: Plan | None = None

    def do(self, plan: Plan) -> None:
        old = plan.copy()
        plan.reset(self.other.copy())
        self._old = old

    def undo(self, plan: Plan) -> None:
        plan.reset(self._old.copy())


class Group(Command):
    """Several commands applied as one step; on failure the done part is undone."""

    def __init__(self, commands: Sequence[Command], text: str):
        self.commands = list(commands)
        self.text = text

    def do(self, plan: Plan) -> None:
        done: list[Command] = []
        try:
            for cmd in self.commands:
                cmd.do(plan)
                done.append(cmd)
        except PlanError:
            for cmd in reversed(done):
                cmd.undo(plan)
            raise

    def undo(self, plan: Plan) -> None:
        for cmd in reversed(self.commands):
            cmd.undo(plan)


def settings_with(settings: Settings, **changes) -> Settings:
    """A copy of ``settings`` with some fields changed (calendar and sign-off copied)."""
    base = replace(settings, calendar=replace(settings.calendar), sign_off=list(settings.sign_off))
    return replace(base, **changes)
