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

Both passes run level by level with numpy over a renumbered copy of the network (see
:mod:`.network`): per level one gather, one add and one segmented max/min written into
the level's block. A link's effect is folded into one offset between the two early
starts (see :meth:`Network.link_offsets`), so the backward pass runs on late starts
with the same offsets. Re-running with new durations reuses the compiled network, and
the critical paths when the driving links have not changed.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from operator import attrgetter

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
    graph: tuple | None = field(default=None, repr=False, compare=False)  # critical subgraph

    @property
    def ids(self) -> list[str]:
        return self.network.ids

    def index(self, act_id: str) -> int:
        return self.network.ids.index(act_id)


def _stack(values: np.ndarray, bounds) -> np.ndarray:
    """Link values followed by one bound per activity (either may be 1-D or 2-D)."""
    values, bounds = np.asarray(values, dtype=float), np.asarray(bounds, dtype=float)
    if values.ndim == 2 and bounds.ndim == 1:
        bounds = np.broadcast_to(bounds[:, None], (bounds.size, values.shape[1]))
    elif values.ndim == 1 and bounds.ndim == 2:
        values = np.broadcast_to(values[:, None], (values.size, bounds.shape[1]))
    return np.concatenate((values, bounds))


def _sweep(steps, work: np.ndarray, entry: np.ndarray, reduce, add: bool) -> np.ndarray:
    """One pass, level by level, each node starting from its own bound in ``work``.
    1-D: an unbuffered ``reduce.at`` into the level's nodes; 2-D: a segmented
    ``reduceat`` per level, then combined with the nodes' bounds."""
    flat = work.ndim == 1
    for a, b, lo, hi, seg, far, near in steps:
        cand = work.take(far, axis=0)
        if add:
            cand += entry[lo:hi]
        else:
            cand -= entry[lo:hi]
        if flat:
            reduce.at(work, near, cand)
        else:
            block = work[a:b]
            reduce(block, reduce.reduceat(cand, seg, axis=0), out=block)
    return work


def _work(net: Network, init, trailing) -> np.ndarray:
    """Renumbered working array starting from ``init`` (its spare row n is zero)."""
    work = np.zeros((net.size + 1,) + trailing)
    init = np.asarray(init, dtype=float)
    if trailing and init.ndim == 1:
        init = init[:, None]
    work[:net.size] = init[net.topo]
    return work


def _forward_work(net: Network, offsets: np.ndarray, floor: np.ndarray) -> np.ndarray:
    offsets = np.asarray(offsets, dtype=float)
    floor = np.asarray(floor, dtype=float)
    trailing = offsets.shape[1:] or floor.shape[1:]
    if offsets.ndim == 1 and trailing:
        offsets = offsets[:, None]
    work = _work(net, floor, trailing)
    entry = offsets.take(net.forward.idx, axis=0)   # links only: the floor starts in ``work``
    return _sweep(net.forward.steps, work, entry, np.maximum, True)


def _backward_work(net: Network, offsets: np.ndarray, ceiling: np.ndarray, keep: list | None = None):
    entry = _stack(offsets, -np.asarray(ceiling, dtype=float))[net.backward.idx]
    if keep is not None:
        keep.append(entry)              # reused by the free float
    work = _work(net, ceiling, entry.shape[1:])
    return _sweep(net.backward.steps, work, entry, np.minimum, False)


def forward(net: Network, offsets: np.ndarray, floor: np.ndarray) -> np.ndarray:
    """Early starts: ES_j = max(floor_j, max over links (ES_i + offset))."""
    return _forward_work(net, offsets, floor)[net.rank]


def backward(net: Network, offsets: np.ndarray, ceiling: np.ndarray) -> np.ndarray:
    """Late starts: LS_i = min(ceiling_i, min over links (LS_j − offset))."""
    return _backward_work(net, offsets, ceiling)[net.rank]


def _free_float(net: Network, es_work: np.ndarray, entry: np.ndarray, d: np.ndarray, finish: float):
    """Smallest slack over outgoing links and project finish − EF, per activity.

    ``entry`` holds the backward pass's per-entry offsets (overwritten here): the slack of
    a link is ES_j − offset − ES_i, and a bound entry, read from the spare row set to the
    finish, gives finish − d_i − ES_i."""
    p = net.backward
    ff = np.empty(net.size)
    if not net.size:
        return ff
    entry[p.starts] = d[p.origin]
    es_work[net.size] = finish
    cand = es_work.take(p.far)
    es_work[net.size] = 0.0
    cand -= entry
    least = np.full(net.size + 1, np.inf)
    np.minimum.at(least, p.near, cand)             # unbuffered, faster than reduceat in 1-D
    ff[p.origin] = least[p.nodes] - es_work[p.nodes]
    return ff


def free_float(net: Network, es: np.ndarray, ef: np.ndarray, offsets: np.ndarray, finish) -> np.ndarray:
    """Free float from early dates in plan order (see :func:`_free_float`)."""
    work = _work(net, es, ())
    entry = _stack(offsets, np.zeros(net.size))[net.backward.idx]
    return _free_float(net, work, entry, np.asarray(ef) - np.asarray(es), float(finish))


def _snap(values: np.ndarray) -> np.ndarray:
    """Floats within rounding noise of zero become exactly zero (no "-0.0" floats)."""
    values[np.abs(values) <= EPS] = 0.0
    return values


class Analyzer:
    """Compiles a network once and re-runs the passes cheaply for new durations."""

    def __init__(self, net: Network, floor=None, fnlt=None):
        self.net = net
        n = net.size
        self.floor = np.zeros(n) if floor is None else np.maximum(np.asarray(floor, float), 0.0)
        self.fnlt = np.full(n, np.inf) if fnlt is None else np.asarray(fnlt, float)
        self._cache: tuple | None = None   # (driving links, critical flags, graph, paths, truncated)
        self.links: list | None = None     # the plan links compiled, when made by ``reusing``
        self.finish_floor: np.ndarray | None = None   # progress: EF_j ≥ finish_floor_j
        self.done: np.ndarray | None = None           # progress: activities fixed on their actuals

    def from_status(self, inputs) -> "Analyzer":
        """An analyzer scheduling from the status date (see :mod:`.progress`): the same
        compiled network with some links cut, and the floors of progress."""
        kept = getattr(self, "_status", None)
        if kept is not None and _same_inputs(kept, inputs):
            return kept                  # and with it the remembered critical paths
        fresh = Analyzer(inputs.network, None, self.fnlt)
        fresh.floor, fresh.finish_floor, fresh.done = inputs.floor, inputs.finish_floor, inputs.done
        self._status = fresh
        return fresh

    @classmethod
    def for_plan(cls, plan, calendar=None) -> "Analyzer":
        return cls(compile_plan(plan), *constraint_bounds(plan, calendar))

    @classmethod
    def reusing(cls, previous: "Analyzer | None", plan, calendar=None) -> "Analyzer":
        """An analyzer for ``plan``, reusing ``previous`` (its compiled network and remembered
        critical paths) when the activity ids and links are unchanged."""
        floor, fnlt = constraint_bounds(plan, calendar)
        if previous is None or previous.net.ids != plan.ids() or previous.links != plan.links:
            fresh = cls(compile_plan(plan), floor, fnlt)
        elif np.array_equal(previous.floor, floor) and np.array_equal(previous.fnlt, fnlt):
            return previous
        else:
            fresh = cls(previous.net, floor, fnlt)
        fresh.links = list(plan.links)
        return fresh

    def run(self, durations, deadline: float | None = None, paths: bool = True) -> Schedule:
        net = self.net
        d = np.asarray(durations, dtype=float)
        offsets = net.link_offsets(d)
        floor = self.floor if self.finish_floor is None else np.maximum(self.floor, self.finish_floor - d)
        es_work = _forward_work(net, offsets, floor)
        es = es_work[net.rank]
        ef = es + d
        finish = float(ef.max()) if ef.size else 0.0
        ref = finish if deadline is None else float(deadline)
        kept: list = []
        ls = _backward_work(net, offsets, np.minimum(ref, self.fnlt) - d, kept)[net.rank]
        tf = _snap(ls - es)
        ff = _snap(_free_float(net, es_work, kept[0], d, finish))
        critical = tf <= (ref - finish) + EPS
        if self.done is not None:        # done work: on its actuals, no float, not critical
            ls[self.done], tf[self.done], ff[self.done], critical[self.done] = es[self.done], 0.0, 0.0, False
        sched = Schedule(net, d, es, ef, ls, ls + d, tf, ff, critical, finish,
                         None if deadline is None else float(deadline))
        if paths:
            self._critical(sched, offsets)
        return sched

    def _critical(self, sched: Schedule, offsets: np.ndarray) -> None:
        """Critical subgraph and paths, reused while the driving links stay the same."""
        driving = driving_links(sched, offsets)
        c = self._cache
        if c is None or not (np.array_equal(c[0], driving) and np.array_equal(c[1], sched.critical)):
            graph = _critical_graph(sched, offsets, driving)
            found, cut = critical_paths(sched, offsets, graph=graph)
            c = self._cache = (driving, sched.critical.copy(), graph, found, cut)
        sched.graph = c[2]
        sched.paths, sched.paths_truncated = list(c[3]), c[4]


def _same_inputs(kept: "Analyzer", inputs) -> bool:
    ff_a, ff_b = kept.finish_floor, inputs.finish_floor
    return (np.array_equal(kept.net.lag, inputs.network.lag) and np.array_equal(kept.floor, inputs.floor)
            and np.array_equal(kept.done, inputs.done)
            and (ff_a is ff_b is None or (ff_a is not None and ff_b is not None and np.array_equal(ff_a, ff_b))))


def constraint_bounds(plan, calendar=None) -> tuple[np.ndarray, np.ndarray]:
    """Per activity the start-no-earlier offset (floor, ≥ 0) and the finish-no-later
    offset (+inf when none), dates resolved through ``calendar``."""
    acts = plan.activities
    n = len(acts)
    floor, fnlt = np.zeros(n), np.full(n, np.inf)
    sne, fnl = (list(map(attrgetter(k), acts)) for k in ("start_no_earlier", "finish_no_later"))
    if sne.count(None) == n and fnl.count(None) == n:
        return floor, fnlt                      # the common case: no constraint at all
    for i, act in enumerate(acts):
        if act.start_no_earlier is not None:
            floor[i] = max(0.0, _resolve(calendar, act.start_no_earlier, finish=False))
        if act.finish_no_later is not None:
            fnlt[i] = _resolve(calendar, act.finish_no_later, finish=True)
    return floor, fnlt


def _resolve(calendar, value, finish: bool) -> float:
    if calendar is None:
        if not isinstance(value, (int, float)):
            raise TypeError("a date constraint needs a calendar")
        return float(value)
    return calendar.resolve(value, finish=finish)


def driving_links(sched: Schedule, offsets: np.ndarray) -> np.ndarray:
    """Indices of links with zero slack between two critical activities (ascending)."""
    net = sched.network
    links = net.out_links(np.flatnonzero(sched.critical))
    src, dst = net.src[links], net.dst[links]
    slack = sched.es[dst] - sched.es[src] - offsets[links]
    return links[(np.abs(slack) <= EPS) & sched.critical[dst]]


def _critical_graph(sched: Schedule, offsets: np.ndarray, driving=None):
    net = sched.network
    if driving is None:
        driving = driving_links(sched, offsets)
    succ: dict[int, list[int]] = {}
    has_pred: set[int] = set()
    for s, t in zip(net.src[driving].tolist(), net.dst[driving].tolist()):
        lst = succ.setdefault(s, [])
        if t not in lst:
            lst.append(t)
        has_pred.add(t)
    crit = np.flatnonzero(sched.critical)
    pos = net.rank
    # Start where nothing critical drives the activity, in topological order.
    starts = sorted((i for i in crit.tolist() if i not in has_pred), key=lambda i: pos[i])
    return succ, starts, pos, {}   # the dict remembers max-weight paths per weights


def critical_paths(sched: Schedule, offsets: np.ndarray, limit: int = MAX_PATHS, graph=None):
    """Every critical path as an ordered list of ids (at most ``limit``; flag if more).

    Depth-first with one shared path (no copying per step), so a 100,000-long chain
    costs linear time; each branch ends at the project finish, so the walk stops after
    ``limit`` paths.
    """
    succ, starts, pos, _ = graph or _critical_graph(sched, offsets)
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
    return [sched.network.ids[i] for i in max_weight_indices(sched, weights)]


def max_weight_indices(sched: Schedule, weights: np.ndarray) -> list[int]:
    """:func:`max_weight_path` as activity indices."""
    net = sched.network
    if sched.graph is None:
        sched.graph = _critical_graph(sched, net.link_offsets(sched.durations))
    succ, starts, pos, memo = sched.graph
    if not starts:
        return []
    w = np.asarray(weights, dtype=float)
    if "weights" in memo and np.array_equal(memo["weights"], w):
        return list(memo["path"])
    memo["path"] = _heaviest(succ, starts, pos, sched.critical, w)
    memo["weights"] = w.copy()
    return list(memo["path"])


def _heaviest(succ, starts, pos, critical, weights) -> list[int]:
    """Dynamic programme over the critical subgraph, successors first; ties go to the
    earlier activity in topological order."""
    crit = np.flatnonzero(critical)
    crit = crit[np.argsort(-pos[crit], kind="stable")].tolist()   # successors first
    w = dict(zip(crit, weights[crit].tolist()))
    rank = dict(zip(crit, pos[crit].tolist()))
    best: dict[int, float] = {}
    nxt: dict[int, int | None] = {}
    for node in crit:
        options = [(round(best[t], 9), -rank[t], t) for t in succ.get(node, ()) if t in best]
        if options:
            val, _, t = max(options)
            best[node], nxt[node] = w[node] + best[t], t
        else:
            best[node], nxt[node] = w[node], None
    head = max(starts, key=lambda s: (round(best[s], 9), -rank[s]))
    path = [head]
    while nxt[path[-1]] is not None:
        path.append(nxt[path[-1]])
    return path
