"""Compile a plan's links into arrays processed level by level (topological generations).

Nodes are renumbered once in topological order (by longest-path level), so each level's
activities occupy one contiguous block of the working arrays: a pass over a level is one
gather, one add and one segmented max/min written straight into that block. Each
activity also gets one "bound" entry (its floor going forward, its ceiling going
backward) read from a spare row at index n, so no separate clamp is needed.

Everything is vectorised with numpy; a 100,000-activity chain is handled without
recursion. Cycles are reported as the loop in order.
"""

from __future__ import annotations

import sys
from dataclasses import dataclass, field
from operator import attrgetter

import numpy as np

from .errors import CycleError, PlanError

TYPE_CODES = {"FS": 0, "SS": 1, "FF": 2, "SF": 3}
# From this many links, scipy's counting sort pays for its import (about 0.4 s) in
# :func:`group_order`; below it numpy's radix sort is used unless scipy.sparse is loaded.
SPARSE_FROM = 2_000_000
# Does the link leave from the predecessor's finish / arrive at the successor's finish?
SRC_FINISH = np.array([1.0, 0.0, 1.0, 0.0])
DST_FINISH = np.array([0.0, 0.0, 1.0, 1.0])


@dataclass
class Pass:
    """Entries of one sweep, grouped by the activity they update: its links, led by one
    bound entry per activity in the backward pass (where some activities have no links).
    ``idx`` points into ``concatenate([link values, per-activity bounds])``; ``far`` is
    the renumbered node read (n for a bound entry).
    ``steps`` per level: (first node, end node, entry lo, entry hi, segment starts, far slice,
    near slice);
    ``levels`` the same as (lo, hi, original node ids, segment starts)."""

    idx: np.ndarray
    far: np.ndarray
    near: np.ndarray            # the renumbered node each entry updates
    starts: np.ndarray          # segment start of each updated node, in ``nodes`` order
    nodes: np.ndarray           # renumbered nodes in the order their segments appear
    origin: np.ndarray          # the same nodes as original indices
    steps: list[tuple]
    levels: list[tuple[int, int, np.ndarray, np.ndarray]]


@dataclass
class Network:
    ids: list[str]
    src: np.ndarray
    dst: np.ndarray
    lag: np.ndarray
    src_fin: np.ndarray
    dst_fin: np.ndarray
    topo: np.ndarray           # nodes in a topological order (level by level)
    rank: np.ndarray           # position of each node in ``topo`` (its renumbered index)
    level: np.ndarray          # longest-path level (links from the sources)
    forward: Pass
    backward: Pass
    _fin: tuple | None = field(default=None, repr=False)
    _out: tuple | None = field(default=None, repr=False)

    @property
    def size(self) -> int:
        return len(self.ids)

    def link_offsets(self, durations: np.ndarray) -> np.ndarray:
        """Per link, the gap it imposes between ES(pred) and ES(succ) for these durations.

        FS: d_pred + lag; SS: lag; FF: d_pred + lag − d_succ; SF: lag − d_succ.
        Works on 1-D durations (n,) or 2-D (n, iterations).
        """
        durations = np.asarray(durations, dtype=float)
        if self._fin is None:
            self._fin = (np.flatnonzero(self.src_fin), np.flatnonzero(self.dst_fin), bool(self.lag.any()))
        from_fin, to_fin, has_lag = self._fin
        m = self.src.size
        if from_fin.size == m and to_fin.size == 0:          # finish-to-start only
            off = durations.take(self.src, axis=0)
        else:
            off = np.zeros((m,) + durations.shape[1:])
            off[from_fin] = durations.take(self.src[from_fin], axis=0)
            off[to_fin] -= durations.take(self.dst[to_fin], axis=0)
        if has_lag:
            off += self.lag if off.ndim == 1 else self.lag[:, None]
        return off

    def out_links(self, nodes: np.ndarray) -> np.ndarray:
        """Indices of the links leaving ``nodes`` (original indices), ascending."""
        p = self.backward
        if self._out is None:
            lo = np.empty(self.size, dtype=np.int64)
            lo[p.origin] = p.starts
            hi = np.empty(self.size, dtype=np.int64)
            hi[p.origin] = np.append(p.starts[1:], p.idx.size)
            self._out = (lo, hi)
        lo, hi = self._out
        entries = p.idx[_ranges(lo[nodes], hi[nodes])]
        return np.sort(entries[entries < self.src.size])


def group_order(key: np.ndarray, size: int) -> tuple[np.ndarray, np.ndarray]:
    """A stable counting sort: the permutation grouping ``key`` (ints in [0, size)) and
    each group's start (``size + 1`` bounds), in linear time. scipy's sparse-matrix
    builder does the counting in C: a matrix with one entry per key (row = key, column =
    position) converted to row-compressed form lists the positions row by row."""
    key = np.asarray(key, dtype=np.int64)
    if key.size == 0 or size == 0:
        return np.zeros(0, dtype=np.int64), np.zeros(size + 1, dtype=np.int64)
    if key.size < SPARSE_FROM and "scipy.sparse" not in sys.modules:
        return _radix_order(key, size), np.concatenate(([0], np.cumsum(np.bincount(key, minlength=size))))
    try:
        from scipy.sparse import _sparsetools
        it = np.int32 if max(size, key.size) < 2**31 - 1 else np.int64
        ptr = np.empty(size + 1, dtype=it)
        order = np.empty(key.size, dtype=it)
        _sparsetools.coo_tocsr(size, key.size, key.size, key.astype(it), np.arange(key.size, dtype=it),
                               np.zeros(key.size, np.int8), ptr, order, np.empty(key.size, np.int8))
        return order.astype(np.int64), ptr.astype(np.int64)
    except (ImportError, AttributeError, TypeError, ValueError):  # the public, slower route
        from scipy.sparse import coo_array
        ones = np.ones(key.size, dtype=np.int8)
        csr = coo_array((ones, (key, np.arange(key.size))), shape=(size, key.size)).tocsr()
        return csr.indices.astype(np.int64), csr.indptr.astype(np.int64)


def _radix_order(key: np.ndarray, size: int) -> np.ndarray:
    """The stable order of ``key`` by numpy's radix sort on 16-bit digits (two passes
    above 65,536 groups): linear time, and no scipy import for plans of ordinary size."""
    if size <= 1 << 16:
        return np.argsort(key.astype(np.uint16), kind="stable")
    if size > 1 << 32:
        return np.argsort(key, kind="stable")
    low = np.argsort((key & 0xFFFF).astype(np.uint16), kind="stable")
    return low[np.argsort((key[low] >> 16).astype(np.uint16), kind="stable")]


def _ranges(lo: np.ndarray, hi: np.ndarray) -> np.ndarray:
    """Concatenation of arange(lo[k], hi[k]) for all k."""
    count = hi - lo
    ends = np.cumsum(count)
    if not ends.size:
        return ends
    lo = lo - ends
    lo += count                        # lo[k] minus the entries before group k
    out = np.repeat(lo, count)
    out += np.arange(int(ends[-1]))
    return out


def _levels(n: int, dst: np.ndarray, order: np.ndarray, starts: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Longest-path level of each node by frontier sweeps (work proportional to the links
    leaving each frontier); -1 marks nodes on or behind a cycle. ``order``/``starts``
    group the links by predecessor (see :func:`group_order`)."""
    out = dst[order]
    degree = np.diff(starts)
    indeg = np.bincount(dst, minlength=n)
    first = np.full(n, -1, dtype=np.int64)      # de-duplicates a frontier without sorting
    frontier = np.flatnonzero(indeg == 0)
    parts = []
    while frontier.size:
        parts.append(frontier)
        if frontier.size == 1:
            f = int(frontier[0])
            targets = out[starts[f]:starts[f + 1]]
        else:
            targets = out[_ranges(starts[frontier], starts[frontier] + degree[frontier])]
        frontier = _released(targets, indeg, first)
    level = np.full(n, -1, dtype=np.int64)
    if parts:
        topo = np.concatenate(parts)
        level[topo] = np.repeat(np.arange(len(parts)), [p.size for p in parts])
    else:
        topo = np.empty(0, dtype=np.int64)
    return level, topo


def _released(targets: np.ndarray, indeg: np.ndarray, first: np.ndarray) -> np.ndarray:
    """Count one link into each target; return the targets left with none, once each."""
    if targets.size == 1:                    # a chain: stay scalar
        t = int(targets[0])
        indeg[t] -= 1
        return targets if indeg[t] == 0 else targets[:0]
    np.subtract.at(indeg, targets, 1)
    ready = targets[indeg[targets] == 0]
    where = np.arange(ready.size)
    first[ready[::-1]] = where[::-1]
    return ready[first[ready] == where]


def _find_loop(ids: list[str], src: np.ndarray, dst: np.ndarray, stuck: np.ndarray) -> list[str]:
    """One loop among the stuck nodes, in link order, starting at its earliest plan row."""
    import networkx as nx

    graph = nx.DiGraph()
    mask = stuck[src] & stuck[dst]
    graph.add_edges_from(zip(src[mask].tolist(), dst[mask].tolist()))
    nodes = [u for u, _ in nx.find_cycle(graph)]
    first = nodes.index(min(nodes))     # start at the activity listed first in the plan
    loop = [ids[u] for u in nodes[first:] + nodes[:first]]
    return loop + [loop[0]]


def _make_pass(near_end: np.ndarray, far_end: np.ndarray, origin: np.ndarray, position: np.ndarray,
               rank: np.ndarray, blocks: list[tuple[int, int]], topo: np.ndarray, bounds: bool) -> Pass:
    """Entries for the nodes ``origin`` (original indices, in update order; ``position``
    maps a node to its place in it): the links whose ``near_end`` it is, led by one bound
    entry per node when ``bounds``. ``blocks`` gives each level's renumbered range [a, b)."""
    n, m, k = rank.size, near_end.size, origin.size
    b = k if bounds else 0
    keys = np.concatenate((np.arange(b), position[near_end]))
    order, cut = group_order(keys, k)           # stable: a bound entry leads its group
    if b:
        idx = np.concatenate((m + origin, np.arange(m)))[order]
        far = np.concatenate((np.full(b, n), rank[far_end]))[order]
    else:
        idx, far = order, rank[far_end[order]]
    nodes = rank[origin]
    near = np.repeat(nodes, np.diff(cut))
    return Pass(idx, far, near, cut[:-1], nodes, origin, *_steps(cut, far, near, blocks, topo))


def _steps(cut: np.ndarray, far: np.ndarray, near: np.ndarray, blocks, topo):
    starts = cut[:-1]
    steps, levels, j = [], [], 0
    for a, b in blocks:
        lo, hi = int(cut[j]), int(cut[j + b - a])
        seg = starts[j:j + b - a] - lo
        steps.append((a, b, lo, hi, seg, far[lo:hi], near[lo:hi]))
        levels.append((lo, hi, topo[a:b], seg))
        j += b - a
    return steps, levels


def _passes(n: int, src: np.ndarray, dst: np.ndarray, topo: np.ndarray, level: np.ndarray):
    rank = np.empty(n, dtype=np.int64)
    rank[topo] = np.arange(n)
    per_level = np.bincount(level) if n else np.zeros(0, dtype=np.int64)
    edges = np.concatenate(([0], np.cumsum(per_level)))
    blocks = [(int(a), int(b)) for a, b in zip(edges[:-1], edges[1:])]
    n0 = blocks[0][1] if blocks else 0
    fwd = _make_pass(dst, src, topo[n0:], rank - n0, rank, blocks[1:], topo, bounds=False)
    # Backward: levels last to first, each block's nodes in ascending renumbered order.
    lvl = level[topo]
    back_pos = n - edges[lvl + 1] + (np.arange(n) - edges[lvl])   # by renumbered node
    order = np.empty(n, dtype=np.int64)
    order[back_pos] = np.arange(n)
    bwd = _make_pass(src, dst, topo[order], back_pos[rank], rank, blocks[::-1], topo, bounds=True)
    return rank, fwd, bwd


def compile_network(ids: list[str], src: np.ndarray, dst: np.ndarray, lag: np.ndarray,
                    types: np.ndarray) -> Network:
    """Build the sweep structure from link arrays (indices into ``ids``; type codes 0..3)."""
    n = len(ids)
    src = np.asarray(src, dtype=np.int64)
    dst = np.asarray(dst, dtype=np.int64)
    types = np.asarray(types, dtype=np.int64)
    self_links = np.flatnonzero(src == dst)
    if self_links.size:
        raise PlanError(f"activity {ids[src[self_links[0]]]} is linked to itself", ids[src[self_links[0]]])
    by_src = group_order(src, n)
    level, topo = _levels(n, dst, *by_src)
    if topo.size < n:
        raise CycleError(_find_loop(ids, src, dst, level < 0))
    rank, fwd, bwd = _passes(n, src, dst, topo, level)
    return Network(
        ids=list(ids), src=src, dst=dst, lag=np.asarray(lag, dtype=float),
        src_fin=SRC_FINISH[types] if types.size else np.zeros(0),
        dst_fin=DST_FINISH[types] if types.size else np.zeros(0),
        topo=topo, rank=rank, level=level, forward=fwd, backward=bwd,
    )


def compile_plan(plan) -> Network:
    """Compile a :class:`~workbench.core.model.Plan` (validates unknown ids, self links, cycles)."""
    ids = plan.ids()
    index = getattr(plan, "_index", None)       # the plan's own id -> row map, when it keeps one
    if not isinstance(index, dict) or len(index) != len(ids) or list(map(index.get, ids)) != list(range(len(ids))):
        index = {a: i for i, a in enumerate(ids)}
    links = plan.links
    m = len(links)
    try:
        src, dst = (np.fromiter(map(index.__getitem__, map(attrgetter(name), links)), np.int64, m)
                    for name in ("pred", "succ"))
        kinds = list(map(attrgetter("type"), links))
        types = (np.zeros(m, dtype=np.int64) if kinds.count("FS") == m
                 else np.fromiter(map(TYPE_CODES.__getitem__, kinds), np.int64, m))
    except KeyError:
        raise _unknown_end(links, index) from None
    lag = np.fromiter(map(attrgetter("lag"), links), dtype=float, count=m)
    return compile_network(ids, src, dst, lag, types)


def _unknown_end(links, index) -> PlanError:
    for link in links:
        for end in (link.pred, link.succ):
            if end not in index:
                return PlanError(f"link {link.pred} \u2192 {link.succ}: unknown activity {end!r}", end)
        if link.type not in TYPE_CODES:
            return PlanError(f"link {link.pred} \u2192 {link.succ}: unknown link type {link.type!r}", link.succ)
    return PlanError("a link is invalid")
