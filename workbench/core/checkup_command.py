"""The undoable edit of a plan's Checkup thresholds (one undo step per change)."""

from __future__ import annotations

from .commands import Command
from .model import Plan


class SetCheckupThresholds(Command):
    """Replace the plan's own Checkup thresholds; keys left out follow the defaults."""

    def __init__(self, values: dict[str, float], text: str = "Checkup thresholds"):
        self.values = dict(values)
        self.text = text
        self.old: dict[str, float] | None = None

    def do(self, plan: Plan) -> None:
        self.old = plan.set_checkup_thresholds(self.values)

    def undo(self, plan: Plan) -> None:
        plan.set_checkup_thresholds(self.old or {})
