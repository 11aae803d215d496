"""The ``costs`` section of a version-3 plan file: indirect cost, lateness penalty, the
trade-off option last applied, and per activity its costs and crash estimate.

    "costs": {"indirect_cost": 1200.0, "late_penalty": 0.0, "bought": null,
              "activities": [{"id": "B3", "cost": 42000.0, "crash_cost": 51000.0,
                              "crash_optimistic": 8.0, "crash_most_likely": 10.0,
                              "crash_pessimistic": 17.0, "crash_duration": null}]}

Only activities with some cost data are listed; every field of an entry is written.
Absent in a file (older writers), the section reads as empty.
"""

from __future__ import annotations

from dataclasses import replace
from operator import attrgetter

from workbench.core.model import BoughtTime, Plan, Settings

from .errors import PlanFileError
from .fields import Fields

COST_FIELDS = ("cost", "crash_cost", "crash_optimistic", "crash_most_likely", "crash_pessimistic", "crash_duration")


def empty_section() -> dict:
    return {"indirect_cost": 0.0, "late_penalty": 0.0, "bought": None, "activities": []}


def add_empty_costs(data: dict) -> dict:
    """Version 2 → 3 step: a plan without cost data."""
    return dict(data, costs=empty_section())


def _num(value):
    return None if value is None else float(value)


def _bought_to_dict(b: BoughtTime | None):
    if b is None:
        return None
    return {"label": b.label, "cost": float(b.cost), "chance": _num(b.chance),
            "standard_error": _num(b.standard_error),
            "crashed": [{"id": i, "amount": float(x)} for i, x in b.crashed]}


def costs_to_dict(plan: Plan) -> dict:
    s = plan.settings
    acts = plan.activities
    costed = set()                  # rows with any cost field, found a column at a time
    for k in COST_FIELDS:
        column = list(map(attrgetter(k), acts))
        if column.count(None) != len(column):
            costed.update(i for i, v in enumerate(column) if v is not None)
    rows = [{"id": a.id, **{k: _num(getattr(a, k)) for k in COST_FIELDS}} for a in map(acts.__getitem__, sorted(costed))]
    return {"indirect_cost": float(s.indirect_cost), "late_penalty": float(s.late_penalty),
            "bought": _bought_to_dict(s.bought), "activities": rows}


def _bought(f: Fields) -> BoughtTime | None:
    raw = f.raw("bought")
    if raw is None:
        return None
    g = Fields(raw, "costs bought")
    crashed = []
    for i, item in enumerate(g.raw_list("crashed"), 1):
        h = Fields.entry(item, "costs bought crashed", i)
        crashed.append((h.text("id", required=True), h.number("amount", required=True)))
        h.done()
    out = BoughtTime(g.text("label"), g.number("cost", default=0.0), g.number("chance"),
                     g.number("standard_error"), tuple(crashed))
    g.done()
    return out


def read_costs(data, settings: Settings) -> tuple[Settings, dict[str, dict]]:
    """Settings with the plan-level figures, and per activity id its cost fields."""
    f = Fields({} if data is None else data, "costs")
    settings = replace(settings, indirect_cost=f.number("indirect_cost", default=0.0),
                       late_penalty=f.number("late_penalty", default=0.0), bought=_bought(f))
    per: dict[str, dict] = {}
    for i, item in enumerate(f.raw_list("activities"), 1):
        g = Fields.entry(item, "costs activity", i)
        act_id = g.text("id", required=True)
        if act_id in per:
            raise g.error("id", "lists the activity twice")
        per[act_id] = {k: g.number(k) for k in COST_FIELDS}
        g.done()
    f.done()
    return settings, per


def merge_costs(acts: list, per: dict[str, dict]) -> list:
    """The activities with their cost fields filled in; an unknown id is refused."""
    if not per:
        return acts
    known = {a.id for a in acts}
    for act_id in per:
        if act_id not in known:
            raise PlanFileError(f"costs: activity {act_id!r} is not in the plan", act_id)
    return [a.with_(**per[a.id]) if a.id in per else a for a in acts]
