"""Costs and crash estimates of one activity: checks, and the linear time–cost model.

An activity may carry its normal direct ``cost``; with a ``crash_cost`` and the fastest
achievable estimate (three crash points, or a fixed ``crash_duration``) it can be shortened.
Between the normal and the crash estimate the cost is linear in the PERT mean te (the
linear time–cost model of J. E. Kelley, "Critical-path planning and scheduling:
mathematical basis", Operations Research 9(3), 1961):

    cost(days bought) = cost + slope · days,  slope = (crash_cost − cost) / (te − te_crash)

and the estimate moves with it: a crash of ``days`` out of the ``te − te_crash`` available
takes the fraction f = days / (te − te_crash), and every point (optimistic, most likely,
pessimistic) lies on the straight line between its normal and its crash value at f, so te
falls by exactly ``days``.
"""

from __future__ import annotations

import math

from .errors import PlanError

CRASH_POINTS = ("crash_optimistic", "crash_most_likely", "crash_pessimistic")
SLACK = 1e-9   # rounding allowed when comparing a crash estimate with the normal one


def _fail(act, what: str):
    raise PlanError(f"activity {act.id}: {what}", act.id)


def _money(act, name: str) -> None:
    value = getattr(act, name)
    if value is None:
        return
    if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value):
        _fail(act, f"{name.replace('_', ' ')} must be a finite number, not {value!r}")
    if value < 0:
        _fail(act, f"{name.replace('_', ' ')} must not be negative ({value:g})")


def normal_points(act) -> tuple[float, float, float]:
    """The normal estimate as three points (a fixed duration d as d, d, d)."""
    if act.has_estimate:
        return float(act.optimistic), float(act.most_likely), float(act.pessimistic)
    d = float(act.duration or 0.0)
    return d, d, d


def crash_points(act) -> tuple[float, float, float] | None:
    """The crash estimate as three points, or None when the activity has none."""
    if act.crash_optimistic is not None:
        return float(act.crash_optimistic), float(act.crash_most_likely), float(act.crash_pessimistic)
    if act.crash_duration is not None:
        d = float(act.crash_duration)
        return d, d, d
    return None


def _check_shape(act) -> None:
    points = [getattr(act, k) for k in CRASH_POINTS]
    given = [p is not None for p in points]
    if any(given) and not all(given):
        _fail(act, "a crash estimate needs crash optimistic, crash most likely and crash pessimistic")
    if all(given) and act.crash_duration is not None:
        _fail(act, "give either a crash duration or a three-point crash estimate, not both")
    for name in CRASH_POINTS + ("crash_duration",):
        _money(act, name)
    if all(given) and not points[0] <= points[1] <= points[2]:
        _fail(act, "crash estimates out of order: crash optimistic \u2264 crash most likely \u2264 "
                   "crash pessimistic does not hold")


def _check_not_longer(act) -> None:
    crash = crash_points(act)
    normal = normal_points(act)
    te_crash = (crash[0] + 4 * crash[1] + crash[2]) / 6
    if te_crash > act.mean + SLACK:
        _fail(act, f"the crash estimate (te {te_crash:g}) is longer than the normal one (te {act.mean:g})")
    if act.crash_optimistic is not None:
        for label, c, n in zip(("optimistic", "most likely", "pessimistic"), crash, normal):
            if c > n + SLACK:
                _fail(act, f"crash {label} {c:g} is longer than the normal {label} {n:g}")


def check_costs(act) -> None:
    """Refuse, naming the activity: negative costs, a crash cost below the normal cost or
    without it, a crash estimate longer than the normal one, or a half-given three-point
    crash estimate. A crash estimate without a crash cost (or the reverse) is kept: the
    activity cannot be shortened until both are given (see ``missing_crash_data``)."""
    _money(act, "cost")
    _money(act, "crash_cost")
    _check_shape(act)
    if act.crash_cost is not None and act.cost is None:
        _fail(act, "a crash cost needs the normal cost too")
    if act.crash_cost is not None and act.crash_cost < act.cost:
        _fail(act, f"crash cost {act.crash_cost:g} is below the normal cost {act.cost:g}")
    if act.has_crash:
        _check_not_longer(act)


def missing_crash_data(act) -> str | None:
    """What an activity with half its crash data lacks ("crash cost" or "crash estimate"),
    or None when it has both or neither."""
    if act.has_crash and act.crash_cost is None:
        return "crash cost"
    if act.crash_cost is not None and not act.has_crash:
        return "crash estimate"
    return None


def crash_range(act) -> float:
    """How many plan units of te the activity can give up (0 without crash data)."""
    crash = crash_points(act)
    if crash is None or act.crash_cost is None:
        return 0.0
    return max(0.0, act.mean - (crash[0] + 4 * crash[1] + crash[2]) / 6)


def cost_slope(act) -> float:
    """Extra direct cost per plan unit bought (0 when the activity cannot be shortened)."""
    span = crash_range(act)
    return (act.crash_cost - act.cost) / span if span > 0 else 0.0


def crashed(act, days: float):
    """The activity shortened by ``days`` of te (clipped to its range): estimates on the
    straight line towards the crash estimate, cost raised along the slope. Its crash
    estimate and crash cost stay, so it can be shortened further at the same slope."""
    span = crash_range(act)
    days = min(max(float(days), 0.0), span)
    if days <= 0:
        return act
    keep = 0.0 if days >= span else 1.0 - days / span    # share of the normal-to-crash gap kept
    crash = crash_points(act)
    points = [c + keep * (n - c) for n, c in zip(normal_points(act), crash)]
    cost = act.crash_cost if keep == 0.0 else act.cost + cost_slope(act) * days
    if act.has_estimate or act.crash_optimistic is not None:
        return act.with_(optimistic=points[0], most_likely=points[1], pessimistic=points[2],
                         duration=act.duration if act.has_estimate else None, cost=min(cost, act.crash_cost))
    return act.with_(duration=points[0], cost=min(cost, act.crash_cost))
