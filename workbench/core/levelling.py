"""Resource levelling: a schedule that keeps every link and never asks a resource for more
units than it has.

1. **Priority rule + serial scheme** (:mod:`.sgs`; Kolisch 1996): latest finish first
   (``lft``, the default), least total float (``float``) or most successors, counting
   every activity that follows directly or indirectly (``successors``).
2. **Forward–backward improvement** (double justification; V. Valls, F. Ballestín,
   S. Quintanilla, "Justification and RCPSP: a technique that pays", European Journal of
   Operational Research 165, 2005): right-justify the schedule (latest finish first, as
   late as the resources allow before the finish), then left-justify it again (earliest
   start first); repeat while the finish improves. Never worse than where it started.
3. **Genetic algorithm** over activity lists within a schedule budget (:mod:`.level_ga`;
   S. Hartmann, "A competitive genetic algorithm for resource-constrained project
   scheduling", Naval Research Logistics 45, 1998).

Durations are the PERT means the critical-path engine uses; the result is levelled start
offsets, the finish delay levelling causes, and for each moved activity what held it.
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass, field

import numpy as np

from .analysis import analyze
from .errors import PlanError
from .progress import engine_inputs
from .sgs import EPS, Profile, ResourceProblem

RULES = ("lft", "float", "successors")


@dataclass
class Move:
    """An activity the levelled schedule starts later than the logic-only one."""

    id: str
    logic_start: float
    start: float
    held_by: str             # a resource id, or "after <activity id>" when a predecessor moved it


@dataclass
class LevelResult:
    ids: list[str]
    starts: np.ndarray
    finishes: np.ndarray
    finish: float
    logic_finish: float
    rule: str
    schedules_tried: int
    order: np.ndarray                      # priority key per activity (lower goes first)
    moves: list[Move] = field(default_factory=list)

    @property
    def delay(self) -> float:
        return max(self.finish - self.logic_finish, 0.0)

    def start_of(self, act_id: str) -> float:
        return float(self.starts[self.ids.index(act_id)])


def profile_for(plan, calendar) -> Profile:
    """Every resource's free units over time, from its usual units and availability periods
    (a period given in dates runs from the start of its first day to the end of its last)."""
    cuts = {0.0}
    spans = []
    for r in plan.resources:
        rs = []
        for p in r.periods:
            a = max(calendar.resolve(p.start, finish=False), 0.0)
            b = calendar.resolve(p.end, finish=True)
            if b > a + EPS:
                rs.append((a, b, float(p.units)))
                cuts.update((a, b))
        spans.append(rs)
    times = sorted(cuts)
    free = []
    for r, rs in zip(plan.resources, spans):
        row = []
        for t in times:
            units = float(r.units)
            for a, b, u in rs:
                if a - EPS <= t < b - EPS:
                    units = u
            row.append(units)
        free.append(row)
    return Profile(times, free)


def engine_bounds(plan, analysis):
    """The start floors, finish floors (or None) and done mask ``analysis`` was scheduled
    with: the constraints' floors, or from a status date those of progress (see
    :mod:`.progress`: done work sits on its actuals, remaining work starts after the
    status date)."""
    base = plan._analyzer
    n = len(plan.activities)
    if analysis.progress is None:
        return np.asarray(base.floor, dtype=float), None, np.zeros(n, dtype=bool)
    frame = dataclasses.replace(analysis.progress, warnings=[])      # its warnings were given once
    inputs = engine_inputs(frame, base.net, base.floor)
    ff = None if inputs.finish_floor is None else np.asarray(inputs.finish_floor, dtype=float)
    return np.asarray(inputs.floor, dtype=float), ff, np.asarray(inputs.done, dtype=bool)


class Leveller:
    """A plan compiled for levelling: the logic-only analysis, the serial-scheme problem,
    the mean durations and link offsets."""

    def __init__(self, plan, analysis=None):
        self.plan = plan
        self.analysis = analysis if analysis is not None else analyze(plan)
        a = self.analysis
        net = a.schedule.network            # from a status date: with the links progress cut
        index = {r.id: k for k, r in enumerate(plan.resources)}
        self.floor, self.finish_floor, self.done = engine_bounds(plan, a)
        needs = [[] if done else [(index[r], float(u)) for r, u in act.resources if u > 0]
                 for act, done in zip(plan.activities, self.done)]     # done work holds no one now
        self.durations = [float(x) for x in a.schedule.durations]
        self.problem = ResourceProblem(net.ids, net.src, net.dst, self.floors(a.schedule.durations), needs,
                                       profile_for(plan, a.calendar), [r.id for r in plan.resources])
        self.offsets = [float(x) for x in net.link_offsets(np.asarray(self.durations))]
        self.schedules = 0

    def floors(self, durations) -> np.ndarray:
        """Start floors for these durations: a finish floor EF ≥ f (an SF link from started
        work) is a start floor f − d. Works on (n,) or (n, iterations) durations."""
        d = np.asarray(durations, dtype=float)
        base = self.floor if d.ndim == 1 else self.floor[:, None]
        if self.finish_floor is None:
            return np.broadcast_to(base, d.shape).copy()
        ff = self.finish_floor if d.ndim == 1 else self.finish_floor[:, None]
        return np.maximum(base, ff - d)

    # --- priorities -----------------------------------------------------
    def priority(self, rule: str) -> list[float]:
        s = self.analysis.schedule
        if rule == "lft":
            return [float(v) for v in s.lf]
        if rule == "float":
            return [float(v) for v in s.total_float]
        if rule == "successors":
            return [-float(c) for c in self.successor_counts()]
        raise PlanError(f"unknown levelling rule {rule!r} (use {', '.join(RULES)})", "rule")

    def successor_counts(self) -> list[int]:
        """How many activities follow each one, directly or indirectly (bit sets, last first)."""
        p = self.problem
        topo = self.analysis.schedule.network.topo
        below = [0] * p.n
        for i in reversed(topo.tolist()):
            bits = 0
            for j in p.succs[i]:
                bits |= below[j] | (1 << j)
            below[i] = bits
        return [b.bit_count() for b in below]

    # --- schedules -------------------------------------------------------
    def forward(self, key, explain: bool = False):
        self.schedules += 1
        return self.problem.schedule(key, self.durations, self.offsets, explain)

    def makespan(self, starts) -> float:
        return self.problem.makespan(starts, self.durations)

    def justify(self, starts) -> list[float]:
        """One forward–backward improvement: right-justify, then left-justify; returns
        the better of the given and the new schedule (both keep every link and limit)."""
        d, horizon = self.durations, self.makespan(starts)
        mirror, back = self.problem.reversed(self.offsets, d, horizon)
        finish_key = [-(s + x) for s, x in zip(starts, d)]          # latest finish first
        self.schedules += 1
        rev = mirror.schedule(finish_key, d, back)
        right = [horizon - (s + x) for s, x in zip(rev, d)]
        left = self.forward(right)                                  # earliest start first
        return left if self.makespan(left) < self.makespan(starts) - EPS else starts

    def improve(self, starts, rounds: int = 4) -> list[float]:
        for _ in range(rounds):
            better = self.justify(starts)
            if better is starts:
                return starts
            starts = better
        return starts

    def result(self, starts, rule: str) -> LevelResult:
        key = list(starts)
        starts, why = self.problem.schedule(key, self.durations, self.offsets, True)   # the same one, with reasons
        d = np.asarray(self.durations)
        st = np.asarray(starts, dtype=float)
        return LevelResult(self.problem.ids, st, st + d, float(self.makespan(starts)),
                           float(self.analysis.schedule.finish), rule, self.schedules,
                           np.argsort(np.argsort(st, kind="stable"), kind="stable").astype(float),
                           self._moves(st, why))

    def _moves(self, starts, why) -> list[Move]:
        es, ids, out = self.analysis.schedule.es, self.problem.ids, []
        for j in np.flatnonzero(starts > es + 1e-6).tolist():
            reason = why[j].resource
            if reason is None:
                driver = max(self.problem.preds[j], key=lambda p: starts[p[0]] + self.offsets[p[1]], default=None)
                reason = f"after {ids[driver[0]]}" if driver else "its constraint"
            out.append(Move(ids[j], float(es[j]), float(starts[j]), reason))
        return out


def level(plan, rule: str = "lft", budget: int = 0, seed: int = 0, analysis=None) -> LevelResult:
    """Level the plan's resources. ``rule``: the priority rule; ``budget``: the most
    schedules levelling builds in all — the rule's, the improvement's and the genetic
    algorithm's, which gets what the first two leave (0: no genetic algorithm). The rule
    and the improvement always run, so a budget smaller than they need is exceeded by
    them alone (``schedules_tried`` says how many were built).
    Raises PlanError naming the culprit (an unknown rule, an activity that never fits)."""
    if rule not in RULES:
        raise PlanError(f"unknown levelling rule {rule!r} (use {', '.join(RULES)})", "rule")
    if isinstance(budget, bool) or not isinstance(budget, int) or budget < 0:
        raise PlanError(f"the schedule budget must be a whole number ≥ 0, not {budget!r}", "budget")
    lev = Leveller(plan, analysis)
    best = lev.improve(lev.forward(lev.priority(rule)))
    left = budget - lev.schedules
    if budget > 0 and left > 0 and lev.problem.n > 1:
        from .level_ga import evolve

        best = evolve(lev, best, left, seed)
    return lev.result(best, rule)


def keep_levelled(plan, result: LevelResult):
    """One undoable step that makes the levelled dates the plan's schedule: each activity a
    resource held gets a start-no-earlier constraint at its levelled start (the rest follow
    by their links) and a note saying what held it."""
    from .commands import EditActivity, Group

    edits = []
    for move in result.moves:
        if move.held_by.startswith("after ") or move.held_by == "its constraint":
            continue
        act = plan.activity(move.id)
        note = f"Levelled: waits for {move.held_by} (start no earlier than offset {move.start:g})."
        notes = f"{act.notes}\n{note}".strip() if note not in act.notes else act.notes
        edits.append(EditActivity(move.id, start_no_earlier=float(move.start), notes=notes))
    return Group(edits, f"Keep the levelled schedule ({len(edits)} activities held by resources)")
