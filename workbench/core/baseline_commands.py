"""Undoable baseline and status-date edits (see ``commands`` for the protocol). No Qt.

>>> cmd = RecordBaseline(make_baseline("Board approval", analysis, plan_hash(plan), approved=True))
>>> cmd.do(plan); cmd.undo(plan)
"""

from __future__ import annotations

import datetime as dt

from . import baseline as bl
from .commands import Command, EditActivity, Group, SetSettings, settings_with
from .errors import PlanError
from .model import Plan
from .progress_fields import Progress


class SetBaselines(Command):
    """Replace the plan's baselines by a list computed from them (one undo step)."""

    def __init__(self, change, text: str):
        self.change, self.text = change, text
        self.old: list | None = None

    def do(self, plan: Plan) -> None:
        new = self.change(plan.baselines)        # raises PlanError before anything changes
        self.old = plan.set_baselines(new)

    def undo(self, plan: Plan) -> None:
        plan.set_baselines(self.old)


def RecordBaseline(new: bl.Baseline) -> SetBaselines:
    return SetBaselines(lambda old: bl.with_baseline(old, new), f"Record baseline {new.name}")


def RenameBaseline(old_name: str, new_name: str) -> SetBaselines:
    return SetBaselines(lambda old: bl.renamed(old, old_name, new_name), f"Rename baseline {old_name}")


def ApproveBaseline(name: str | None) -> SetBaselines:
    return SetBaselines(lambda old: bl.approved_as(old, name),
                        f"Mark baseline {name} approved" if name else "No approved baseline")


def DeleteBaseline(name: str) -> SetBaselines:
    return SetBaselines(lambda old: bl.without(old, name), f"Delete baseline {name}")


class RecordTrendPoint(Command):
    """Add (or replace) the odds trend point of one status date."""

    def __init__(self, point: bl.TrendPoint):
        self.point, self.old = point, None
        self.text = f"Odds trend point {point.status_date.isoformat()}"

    def do(self, plan: Plan) -> None:
        self.old = plan.set_odds_trend(bl.with_trend_point(plan.odds_trend, self.point))

    def undo(self, plan: Plan) -> None:
        plan.set_odds_trend(self.old)


def MoveStatusDate(plan: Plan, day: dt.date, progress: dict[str, Progress], rule: str | None = None) -> Group:
    """One undo step: the new status date and the progress given for it (per activity id;
    ``None`` clears an activity's progress); ``rule`` changes the progress rule too."""
    parts = [SetSettings(settings_with(plan.settings, status_date=day, progress_rule=rule or plan.settings.progress_rule))]
    parts += [EditActivity(act_id, progress=p) for act_id, p in progress.items()]
    return Group(parts, f"Move the status date to {day.isoformat()}")


def refusal_of(plan: Plan, command) -> PlanError | None:
    """The PlanError the core would meet applying ``command`` to ``plan`` and scheduling the
    result (naming the activity and, where known, the field), or None. Tried on a snapshot:
    ``plan`` itself is left alone and nobody listening to it hears anything."""
    from .analysis import analyze

    trial = plan.snapshot()
    try:
        command.do(trial)
        analyze(trial)
    except PlanError as exc:
        return exc
    return None
