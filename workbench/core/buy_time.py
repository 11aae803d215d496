"""Applying a trade-off option to a plan: the crashed estimates and costs, a note on each
activity saying what was bought, and the option remembered in the settings (for the pack).
Built as one core command so the window makes it one undo step."""

from __future__ import annotations

from dataclasses import replace

from .calendar import round_offset
from .commands import Command
from .crash_terms import crashed
from .model import BoughtTime, Plan


def _amount(x: float) -> str:
    return f"{x:,.0f}"


def bought_activities(plan: Plan, days: dict[str, float], label: str) -> dict:
    """Per activity id the activity after buying ``days`` of it, its note extended."""
    unit = plan.settings.unit
    out = {}
    for act_id, x in days.items():
        act = plan.activity(act_id)
        new = crashed(act, x)
        if new is act:
            continue
        spent = (new.cost or 0.0) - (act.cost or 0.0)
        note = f"Trade-off ({label}): shortened by {round(x, 2):g} {unit} for {_amount(spent)} extra."
        new = new.with_(notes=(act.notes + "\n" + note).strip())
        out[act_id] = new
    return out


class BuyTimeCommand(Command):
    """Replace the crashed activities and record the option in the settings, as one step."""

    def __init__(self, days: dict[str, float], label: str, cost: float,
                 chance: float | None = None, standard_error: float | None = None):
        self.days, self.label, self.cost = dict(days), label, float(cost)
        self.chance, self.standard_error = chance, standard_error
        self.old: dict = {}
        self.old_settings = None
        self.text = f"Buy time: {label}"

    def do(self, plan: Plan) -> None:
        new = bought_activities(plan, self.days, self.label)
        self.old = {i: plan.activity(i) for i in new}
        self.old_settings = plan.settings
        bought = BoughtTime(self.label, self.cost, self.chance, self.standard_error,
                            tuple((i, round_offset(self.days[i])) for i in new))
        for act_id, act in new.items():
            plan.replace_activity(act_id, act)
        plan.set_settings(replace(plan.settings, bought=bought))

    def undo(self, plan: Plan) -> None:
        plan.set_settings(self.old_settings)
        for act_id, act in self.old.items():
            plan.replace_activity(act_id, act)
