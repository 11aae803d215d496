"""Resource-constrained test instances of our own making, a checker for levelled schedules,
and the exact optimum from an outside solver (OR-Tools CP-SAT, a test dependency only).

Instances are drawn like the small class of the classic benchmark sets (30 activities,
4 renewable resources, 1–3 successors each, durations 1–10, each activity needing 1–2 of
the resources; common practice for such generators) but are ours, generated from a seed.
"""

from __future__ import annotations

import datetime as dt
import random

import numpy as np

from workbench.core.model import Activity, Link, Plan, Resource, Settings


def random_instance(seed: int, n: int = 30, resources: int = 4, tightness: float = 0.5,
                    link_types: bool = False) -> Plan:
    """A plan of ``n`` activities on ``resources`` resources; ``tightness`` (0–1) sets how
    scarce the units are between the largest single need and the sum of all needs at once."""
    rnd = random.Random(seed)
    acts, links = [], []
    need = [[0] * resources for _ in range(n)]
    for j in range(n):
        for r in rnd.sample(range(resources), rnd.randint(1, 2)):
            need[j][r] = rnd.randint(1, 10)
    caps = []
    for r in range(resources):
        top = max(need[j][r] for j in range(n))
        total = sum(need[j][r] for j in range(n))
        caps.append(max(top, int(round(top + (1 - tightness) * (total / 4 - top)))))
    for j in range(n):
        acts.append(Activity(f"J{j}", duration=float(rnd.randint(1, 10)),
                             resources=tuple((f"R{r}", float(need[j][r])) for r in range(resources) if need[j][r])))
    for j in range(1, n):
        for i in rnd.sample(range(j), min(j, rnd.randint(1, 2) if j > 3 else 1)):
            kind = rnd.choice(["FS", "FS", "SS", "FF", "SF"]) if link_types else "FS"
            lag = float(rnd.randint(-2, 3)) if link_types else 0.0
            links.append(Link(f"J{i}", f"J{j}", kind, lag))
    res = [Resource(f"R{r}", f"resource {r}", float(caps[r])) for r in range(resources)]
    return Plan(Settings(title=f"instance {seed}", start=dt.date(2027, 1, 4)), acts, links, resources=res)


def violations(plan: Plan, starts, durations) -> list[str]:
    """Every link or resource limit the schedule breaks (empty when it keeps them all)."""
    index = {a.id: k for k, a in enumerate(plan.activities)}
    s, d = np.asarray(starts, float), np.asarray(durations, float)
    f = s + d
    bad = []
    for l in plan.links:
        i, j = index[l.pred], index[l.succ]
        lhs, rhs = {"FS": (s[j], f[i]), "SS": (s[j], s[i]), "FF": (f[j], f[i]), "SF": (f[j], s[i])}[l.type]
        if lhs < rhs + l.lag - 1e-6:
            bad.append(f"link {l.pred}->{l.succ} {l.type} {l.lag}")
    for t in sorted(set(s.tolist())):
        for r in plan.resources:
            use = sum(u for k, a in enumerate(plan.activities) for rid, u in a.resources
                      if rid == r.id and s[k] <= t + 1e-9 < f[k] - 1e-9)
            if use > r.units + 1e-6:
                bad.append(f"{r.id} at {t}: {use} > {r.units}")
    if (s < -1e-9).any():
        bad.append("a start before 0")
    return bad


def optimal_finish(plan: Plan, seconds: float = 20.0) -> tuple[float, bool]:
    """The shortest finish that keeps every link and limit (CP-SAT, integer durations and
    lags), and whether CP-SAT proved it optimal within ``seconds``."""
    from ortools.sat.python import cp_model

    m = cp_model.CpModel()
    acts = plan.activities
    horizon = int(sum(a.duration for a in acts) + sum(abs(l.lag) for l in plan.links)) + 1
    start = {a.id: m.NewIntVar(0, horizon, a.id) for a in acts}
    end = {a.id: start[a.id] + int(a.duration) for a in acts}
    for l in plan.links:
        lhs = {"FS": start[l.succ], "SS": start[l.succ], "FF": end[l.succ], "SF": end[l.succ]}[l.type]
        rhs = {"FS": end[l.pred], "SS": start[l.pred], "FF": end[l.pred], "SF": start[l.pred]}[l.type]
        m.Add(lhs >= rhs + int(l.lag))
    for r in plan.resources:
        intervals, demands = [], []
        for a in acts:
            for rid, u in a.resources:
                if rid == r.id and a.duration > 0:
                    intervals.append(m.NewIntervalVar(start[a.id], int(a.duration), end[a.id], f"{a.id}-{rid}"))
                    demands.append(int(u))
        m.AddCumulative(intervals, demands, int(r.units))
    span = m.NewIntVar(0, horizon, "finish")
    m.AddMaxEquality(span, list(end.values()))
    m.Minimize(span)
    solver = cp_model.CpSolver()
    solver.parameters.max_time_in_seconds = seconds
    solver.parameters.num_workers = 2
    status = solver.Solve(m)
    return float(solver.Value(span)), status == cp_model.OPTIMAL
