"""The critical-path engine: forward and backward passes for FS/SS/FF/SF links with lags.

Conventions (standard precedence diagramming):
- nothing starts before the project start (offset 0) or its start-no-earlier-than offset;
- project finish = the latest early finish;
- every late finish ≤ the project finish, or the deadline when one is set (negative float
  then shows the miss), and ≤ the activity's finish-no-later-than offset;
- total float = LS − ES; free float = the smallest slack over outgoing links and
  project finish − EF (the latter alone for an activity without successors; with SS/SF
  links or negative lags an activity's own finish can drive the project finish, and
  counting it keeps free float ≤ total float).

Both passes run level by level with numpy: per level one gather, one segmented
max/min (``reduceat``) and one scatter. A link's effect is folded into one offset between
the two early starts (see :meth:`Network.link_offsets`), so the backward pass runs on late
starts with the same offsets.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from .network import Network, compile_plan

EPS = 1e-9
MAX_PATHS = 64


@dataclass
class Schedule:
    network: Network
    durations: np.ndarray
    es: np.ndarray
    ef: np.ndarray
    ls: np.ndarray
    lf: np.ndarray
    total_float: np.ndarray
    free_float: np.ndarray
    critical: np.ndarray
    finish: float
    deadline: float | None
    paths: list[list[str]] = field(default_factory=list)   # every tied critical path (capped)
    paths_truncated: bool = False

    @property
    def ids(self) -> list[str]:
        return self.network.ids

    def index(self, act_id: str) -> int:
        return self.network.ids.index(act_id)


def forward(net: Network, offsets: np.ndarray, floor: np.ndarray) -> np.ndarray:
    """Early starts: ES_j = max(floor_j, max over links (ES_i + offset))."""
    es = floor.copy()
    p = net.forward
    off = offsets[p.order]
    for lo, hi, nodes, starts in p.levels:
        cand = es[p.far[lo:hi]] + off[lo:hi]
        best = np.maximum.reduceat(cand, starts, axis=0)
        es[nodes] = np.maximum(best, es[nodes])
    return es


def backward(net: Network, offsets: np.ndarray, ceiling: np.ndarray) -> np.ndarray:
    """Late starts: LS_i = min(ceiling_i, min over links (LS_j − offset))."""
    ls = ceiling.copy()
    p = net.backward
    off = offsets[p.order]
    for lo, hi, nodes, starts in p.levels:
        cand = ls[p.far[lo:hi]] - off[lo:hi]
        best = np.minimum.reduceat(cand, starts, axis=0)
        ls[nodes] = np.minimum(best, ls[nodes])
    return ls


def free_float(net: Network, es: np.ndarray, ef: np.ndarray, offsets: np.ndarray, finish) -> np.ndarray:
    ff = finish - ef
    p = net.by_src
    if p.order.size:
        slack = es[p.far] - es[p.near] - offsets[p.order]
        lo, hi, nodes, starts = p.levels[0]
        ff[nodes] = np.minimum(np.minimum.reduceat(slack, starts, axis=0), ff[nodes])
    return ff


class Analyzer:
    """Compiles a network once and re-runs the passes cheaply for new durations."""

    def __init__(self, net: Network, floor=None, fnlt=None):
        self.net = net
        n = net.size
        self.floor = np.zeros(n) if floor is None else np.maximum(np.asarray(floor, float), 0.0)
        self.fnlt = np.full(n, np.inf) if fnlt is None else np.asarray(fnlt, float)

    @classmethod
    def for_plan(cls, plan, calendar=None) -> "Analyzer":
        net = compile_plan(plan)
        floor = np.zeros(net.size)
        fnlt = np.full(net.size, np.inf)
        for i, act in enumerate(plan.activities):
            if act.start_no_earlier is not None:
                floor[i] = max(0.0, _resolve(calendar, act.start_no_earlier, finish=False))
            if act.finish_no_later is not None:
                fnlt[i] = _resolve(calendar, act.finish_no_later, finish=True)
        return cls(net, floor, fnlt)

    def run(self, durations, deadline: float | None = None, paths: bool = True) -> Schedule:
        net = self.net
        d = np.asarray(durations, dtype=float)
        offsets = net.link_offsets(d)
        es = forward(net, offsets, self.floor)
        ef = es + d
        finish = float(ef.max()) if ef.size else 0.0
        ref = finish if deadline is None else float(deadline)
        ceiling = np.minimum(ref, self.fnlt) - d
        ls = backward(net, offsets, ceiling)
        lf = ls + d
        tf = ls - es
        ff = free_float(net, es, ef, offsets, finish)
        critical = tf <= (ref - finish) + EPS
        sched = Schedule(net, d, es, ef, ls, lf, tf, ff, critical, finish,
                         None if deadline is None else float(deadline))
        if paths:
            sched.paths, sched.paths_truncated = critical_paths(sched, offsets)
        return sched


def _resolve(calendar, value, finish: bool) -> float:
    if calendar is None:
        if not isinstance(value, (int, float)):
            raise TypeError("a date constraint needs a calendar")
        return float(value)
    return calendar.resolve(value, finish=finish)


def driving_links(sched: Schedule, offsets: np.ndarray) -> np.ndarray:
    """Indices of links with zero slack between two critical activities."""
    net = sched.network
    slack = sched.es[net.dst] - sched.es[net.src] - offsets
    return np.flatnonzero((np.abs(slack) <= EPS) & sched.critical[net.src] & sched.critical[net.dst])


def _critical_graph(sched: Schedule, offsets: np.ndarray):
    net = sched.network
    succ: dict[int, list[int]] = {}
    has_pred: set[int] = set()
    for k in driving_links(sched, offsets):
        s, t = int(net.src[k]), int(net.dst[k])
        lst = succ.setdefault(s, [])
        if t not in lst:
            lst.append(t)
        has_pred.add(t)
    crit = np.flatnonzero(sched.critical)
    # Start where nothing critical drives the activity, in topological order.
    pos = np.empty(net.size, dtype=np.int64)
    pos[net.topo] = np.arange(net.size)
    starts = sorted((int(i) for i in crit if int(i) not in has_pred), key=lambda i: pos[i])
    return succ, starts, pos


def critical_paths(sched: Schedule, offsets: np.ndarray, limit: int = MAX_PATHS):
    """Every critical path as an ordered list of ids (at most ``limit``; flag if more).

    Depth-first with one shared path (no copying per step), so a 100,000-long chain
    costs linear time; each branch ends at the project finish, so the walk stops after
    ``limit`` paths.
    """
    succ, starts, pos = _critical_graph(sched, offsets)
    children = {s: sorted(t, key=lambda i: pos[i]) for s, t in succ.items()}
    ids = sched.network.ids
    paths: list[list[str]] = []
    for start in starts:
        path, cursor = [start], [0]
        while path:
            nxt = children.get(path[-1], ())
            if not nxt and cursor[-1] == 0:
                if len(paths) >= limit:
                    return paths, True
                paths.append([ids[i] for i in path])
            if cursor[-1] < len(nxt):
                cursor[-1] += 1
                path.append(nxt[cursor[-1] - 1])
                cursor.append(0)
            else:
                path.pop()
                cursor.pop()
    return paths, False


def max_weight_path(sched: Schedule, weights: np.ndarray) -> list[str]:
    """The critical path with the largest total weight (e.g. PERT variance), by dynamic
    programming over the critical subgraph (no enumeration, so no blow-up on ties)."""
    net = sched.network
    offsets = net.link_offsets(sched.durations)
    succ, starts, pos = _critical_graph(sched, offsets)
    crit = sorted((int(i) for i in np.flatnonzero(sched.critical)), key=lambda i: -pos[i])
    best: dict[int, float] = {}
    nxt: dict[int, int | None] = {}
    for node in crit:  # reverse topological: successors first
        options = [(best[t], t) for t in succ.get(node, []) if t in best]
        if options:
            val, t = max(options, key=lambda o: (round(o[0], 9), -pos[o[1]]))
            best[node], nxt[node] = weights[node] + val, t
        else:
            best[node], nxt[node] = float(weights[node]), None
    if not starts:
        return []
    head = max(starts, key=lambda s: (round(best[s], 9), -pos[s]))
    path = [head]
    while nxt[path[-1]] is not None:
        path.append(nxt[path[-1]])
    return [net.ids[i] for i in path]
