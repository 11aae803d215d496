"""Trade-off: what it costs to buy time — the exact curve, the total-cost optimum, the
deterministic crash to the deadline and the cheapest crash to a confidence.

>>> result = tradeoff(plan, confidence=0.9, iterations=2000, seed=1)
>>> result.to_dict()["to_confidence"]["chance_out_of_sample"]
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from .calendar import round_offset
from .crash_lp import shown
from .confidence_crash import ConfidencePlan, crash_to_confidence
from .cost_curve import Breakpoint, CostCurve, cost_curve
from .crash_problem import CrashProblem
from .crash_scenarios import ScenarioSet
from .errors import PlanError
from .montecarlo import _check_iterations, _check_seed

@dataclass
class DeadlinePlan:
    """The textbook answer: crash the PERT-mean schedule just to the deadline."""

    point: Breakpoint
    chance: float               # simulated on the independent scenario set
    standard_error: float


@dataclass
class Tradeoff:
    problem: CrashProblem
    curve: CostCurve
    indirect_cost: float
    penalty: float
    deadline: float | None
    optimum: Breakpoint
    seed: int | None = None
    iterations: int = 0
    to_deadline: DeadlinePlan | None = None
    confidence: list[ConfidencePlan] = field(default_factory=list)   # target order as asked

    def total_cost(self, T: float, direct: float) -> float:
        late = max(0.0, T - self.deadline) if self.deadline is not None else 0.0
        return direct + self.indirect_cost * T + self.penalty * late

    def crashed(self, days: np.ndarray) -> dict[str, float]:
        ids = self.problem.ids
        return {ids[i]: shown(days[i]) for i in np.flatnonzero(days > 1e-6)}

    def to_dict(self, target: float | None = None) -> dict:
        from .tradeoff_json import tradeoff_to_dict
        return tradeoff_to_dict(self, target)


def _with_deadline(curve: CostCurve, deadline: float | None) -> list[Breakpoint]:
    extra = curve.at(deadline) if deadline is not None else None
    return [extra] if extra is not None else []


def deadline_offset(plan, deadline=None) -> float | None:
    from .calendar import WorkCalendar
    chosen = plan.settings.deadline if deadline is None else deadline
    return WorkCalendar(plan.settings).resolve(chosen, finish=True)


def tradeoff(plan, deadline=None, targets=(), iterations: int = 2000, seed=None, *,
             indirect_cost=None, penalty=None, progress=None, cancel=None) -> Tradeoff:
    """The curve and optimum always; with a deadline, the crash to it and to each target.

    Raises PlanError when the plan has no cost data, or when the deadline cannot be met
    even with every activity fully crashed."""
    problem = CrashProblem(plan)
    s = plan.settings
    indirect = _amount(s.indirect_cost if indirect_cost is None else indirect_cost, "indirect cost")
    late = _amount(s.late_penalty if penalty is None else penalty, "penalty")
    curve = cost_curve(problem=problem)
    dl = deadline_offset(plan, deadline)
    result = Tradeoff(problem, curve, indirect, late, dl, curve.points[-1])
    total = result.total_cost
    # the total is convex and piecewise linear: least at a breakpoint or at the deadline
    result.optimum = min(curve.points + _with_deadline(curve, dl),
                         key=lambda p: (round(total(p.duration, p.direct_cost), 6), p.duration))
    if dl is None:
        return result
    point = curve.at(dl)
    if point is None:
        raise PlanError(f"the deadline (offset {round_offset(dl):g}) cannot be met even with every activity fully "
                        f"crashed: the shortest the plan can finish is {shown(curve.shortest):g} "
                        f"{s.unit}", "deadline")
    _odds(result, point, targets, _check_iterations(iterations), _check_seed(seed), progress, cancel)
    return result


def _amount(value, what: str) -> float:
    if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value) or value < 0:
        raise PlanError(f"{what} must be a number of at least 0, not {value!r}", what.replace(" ", "_"))
    return float(value)


def _odds(result: Tradeoff, point: Breakpoint, targets, iterations: int, seed: int, progress, cancel) -> None:
    problem, dl = result.problem, result.deadline
    for t in targets:
        if isinstance(t, bool) or not isinstance(t, (int, float)) or not 0.0 < t < 1.0:
            raise PlanError(f"confidence must lie between 0 and 1, not {t!r}", "confidence")
    result.seed, result.iterations = seed, iterations
    outside = ScenarioSet(problem, iterations, seed + 1, dl)
    chance = outside.chance(point.days)
    result.to_deadline = DeadlinePlan(point, chance, math.sqrt(chance * (1 - chance) / iterations))
    if not targets:
        return
    inside = ScenarioSet(problem, iterations, seed, dl)
    starts = [np.zeros(problem.size), point.days]
    steps = len(targets)
    for k, t in enumerate(targets):
        sub = None if progress is None else (lambda d, n, k=k: progress(k * n + d, steps * n))
        result.confidence.append(crash_to_confidence(problem, float(t), inside, outside, starts, sub, cancel))
