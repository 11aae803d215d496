"""A trade-off result as plain JSON-ready data (the ``tradeoff --json`` layout)."""

from __future__ import annotations

import math

from .calendar import round_offset
from .crash_lp import shown


def _money(value: float) -> float:
    return round(float(value), 2)


def _chance(value: float) -> float | None:
    return None if value is None or math.isnan(value) else round(float(value), 4)


def _confidence(result, plan) -> dict:
    base = result.problem.base_cost
    reachable = plan.reachable
    return {"target": plan.target,
            "cost": _money(base + plan.extra_cost) if reachable else None,
            "extra_cost": _money(plan.extra_cost) if reachable else None,
            "crashed": result.crashed(plan.days) if reachable else {},
            "chance_in_sample": _chance(plan.chance_in_sample),
            "chance_out_of_sample": _chance(plan.chance_out_of_sample),
            "standard_error": _chance(plan.standard_error),
            "reachable": reachable}


def tradeoff_to_dict(result, target: float | None = None) -> dict:
    """``curve``, ``optimum``, ``to_deadline`` and ``to_confidence`` (the plan for
    ``target``, else the first one asked), plus the deadline, costs and seed used, and
    ``not_shortened``: the activities left as they are for want of half their crash data
    ({id: "crash cost" or "crash estimate"})."""
    curve = result.curve
    o = result.optimum
    out = {
        "deadline": None if result.deadline is None else round_offset(result.deadline),
        "unit": result.problem.plan.settings.unit,
        "indirect_cost": result.indirect_cost, "penalty": result.penalty,
        "curve": [{"duration": shown(p.duration), "direct_cost": _money(p.direct_cost),
                   "crashed": curve.crashed(p)} for p in curve.points],
        "optimum": {"duration": shown(o.duration), "direct_cost": _money(o.direct_cost),
                    "indirect_cost": _money(result.indirect_cost * o.duration),
                    "total_cost": _money(result.total_cost(o.duration, o.direct_cost))},
        "to_deadline": None, "to_confidence": None,
        "seed": result.seed, "iterations": result.iterations or None,
        "not_shortened": dict(result.problem.incomplete),
    }
    d = result.to_deadline
    if d is not None:
        out["to_deadline"] = {"cost": _money(d.point.direct_cost),
                              "extra_cost": _money(d.point.direct_cost - result.problem.base_cost),
                              "crashed": result.crashed(d.point.days), "chance": _chance(d.chance),
                              "standard_error": _chance(d.standard_error)}
    plans = result.confidence
    chosen = next((p for p in plans if target is not None and abs(p.target - target) < 1e-12), plans[0] if plans else None)
    if chosen is not None:
        out["to_confidence"] = _confidence(result, chosen)
    return out
