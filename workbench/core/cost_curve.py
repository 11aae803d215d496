"""The exact time–cost curve: least direct cost for every project duration.

The least extra cost C(T) of finishing by T is the value of a linear programme whose
right-hand side moves with T, so it is convex and piecewise linear in T. Its breakpoints
are found exactly by tangent intersection (the method of J. Eisner and D. Severance for
parametric problems): evaluate C and a subgradient s (the sum of the duals of the rows
that hold T) at both ends of an interval; the two tangent lines meet at T*; if C(T*)
lies on them, C is exactly the two lines on the interval and T* is its only breakpoint,
else split at T* and repeat. When the tangents meet at an end of the interval, that end
(an earlier probe) is itself a breakpoint: the curve is one line up to it and bends there.
Each breakpoint costs about two LP solves, re-solved in one kept model (:mod:`.duration_lp`). Between two
breakpoints the cheapest crash is the straight-line blend of theirs.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from .crash_lp import shown
from .crash_problem import FEASIBLE_SLACK, CrashProblem

MAX_SOLVES = 20_000


@dataclass
class Breakpoint:
    duration: float
    direct_cost: float
    days: np.ndarray            # days bought per activity (network order)


@dataclass
class _Probe:
    T: float
    extra: float
    slope: float
    days: np.ndarray


@dataclass
class CostCurve:
    problem: CrashProblem
    points: list[Breakpoint] = field(default_factory=list)    # shortest first
    solves: int = 0

    @property
    def shortest(self) -> float:
        return self.points[0].duration

    @property
    def normal(self) -> float:
        return self.points[-1].duration

    def crashed(self, point: Breakpoint) -> dict[str, float]:
        ids = self.problem.ids
        return {ids[i]: shown(point.days[i]) for i in np.flatnonzero(point.days > 1e-9)}

    def at(self, T: float) -> Breakpoint | None:
        """The cheapest crash finishing by T: on a segment, the blend of its ends; past the
        normal finish, nothing; None if shorter than the shortest reachable."""
        pts = self.points
        if T >= pts[-1].duration:
            return Breakpoint(float(T), pts[-1].direct_cost, pts[-1].days)
        if T < pts[0].duration - 1e-9 * max(1.0, abs(T)):
            return None
        hi = next(k for k, p in enumerate(pts) if p.duration >= T)
        if hi == 0 or pts[hi].duration == T:
            return Breakpoint(float(T), pts[hi].direct_cost, pts[hi].days)
        a, b = pts[hi - 1], pts[hi]
        w = (T - a.duration) / (b.duration - a.duration)
        return Breakpoint(float(T), a.direct_cost + w * (b.direct_cost - a.direct_cost), a.days + w * (b.days - a.days))


def _tolerance(problem: CrashProblem) -> float:
    spend = float(np.dot(problem.slope, problem.span))
    return 1e-7 * max(1.0, spend)


def _probe(problem: CrashProblem, T: float, curve: CostCurve) -> _Probe:
    curve.solves += 1
    sol = problem.at(T)
    if sol is None:    # numerically just below the shortest: nudge up
        T = T + FEASIBLE_SLACK * max(1.0, abs(T))
        sol = problem.at(T)
    return _Probe(T, sol.cost, sol.slope, problem.days(sol.values))


def _between(problem, left: _Probe, right: _Probe, curve: CostCurve, tol: float) -> list[_Probe]:
    """Breakpoints strictly between ``left`` and ``right`` (iteratively)."""
    found: dict[int, _Probe] = {}
    todo = [(left, right)]
    while todo and curve.solves < MAX_SOLVES:
        lo, hi = todo.pop()
        if hi.slope - lo.slope <= 1e-12 * (1.0 + abs(lo.slope)) or hi.T - lo.T <= 1e-9:
            continue                      # one straight piece
        t_star = (hi.extra - lo.extra + lo.slope * lo.T - hi.slope * hi.T) / (lo.slope - hi.slope)
        if not lo.T + 1e-9 < t_star < hi.T - 1e-9:
            # the tangents meet at an end: the curve is one line up to that end, which is
            # a kink (its subgradient differs from the line's): an earlier probe was a breakpoint
            end = lo if t_star <= lo.T + 1e-9 else hi
            if end is not left and end is not right:
                found[id(end)] = end
            continue
        mid = _probe(problem, t_star, curve)
        if mid.extra <= lo.extra + lo.slope * (t_star - lo.T) + tol:
            found[id(mid)] = mid          # the two tangents meet on the curve: one breakpoint
            continue
        todo.append((mid, hi))
        todo.append((lo, mid))
    return list(found.values())


def cost_curve(plan=None, problem: CrashProblem | None = None) -> CostCurve:
    """Every breakpoint of the least-direct-cost curve, from the shortest reachable
    duration to the all-normal one. Raises PlanError when the plan has no cost data."""
    problem = problem or CrashProblem(plan)
    curve = CostCurve(problem)
    t_max = problem.normal_finish
    zero = Breakpoint(t_max, problem.base_cost, np.zeros(problem.size))
    t_min = problem.shortest()
    if t_max - t_min <= 1e-9 * max(1.0, t_max):
        curve.points = [zero]
        return curve
    lo = _probe(problem, t_min, curve)
    hi = _Probe(t_max, 0.0, 0.0, zero.days)    # nothing to buy there; 0 is a subgradient at T_max
    found = _between(problem, lo, hi, curve, _tolerance(problem))
    probes = [lo] + sorted(found, key=lambda p: p.T)
    curve.points = [Breakpoint(p.T, problem.direct_cost(p.days), p.days) for p in probes] + [zero]
    return curve
