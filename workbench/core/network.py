"""Compile a plan's links into arrays processed level by level (topological generations).

Everything here is vectorised with numpy; a 100,000-activity chain is handled without
recursion. Cycles are reported as the loop in order.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .errors import CycleError, PlanError

TYPE_CODES = {"FS": 0, "SS": 1, "FF": 2, "SF": 3}
# Does the link leave from the predecessor's finish / arrive at the successor's finish?
SRC_FINISH = np.array([1.0, 0.0, 1.0, 0.0])
DST_FINISH = np.array([0.0, 0.0, 1.0, 1.0])


@dataclass
class Pass:
    """Links of one sweep sorted by level; per level, the nodes updated and segment starts."""

    order: np.ndarray          # permutation of link indices
    near: np.ndarray           # the node updated (dst forward, src backward), per sorted link
    far: np.ndarray            # the node read, per sorted link
    levels: list[tuple[int, int, np.ndarray, np.ndarray]]  # (lo, hi, nodes, segment starts)


@dataclass
class Network:
    ids: list[str]
    src: np.ndarray
    dst: np.ndarray
    lag: np.ndarray
    src_fin: np.ndarray
    dst_fin: np.ndarray
    topo: np.ndarray           # nodes in a topological order
    level: np.ndarray
    forward: Pass
    backward: Pass
    by_src: Pass               # links grouped by predecessor (free float), one level

    @property
    def size(self) -> int:
        return len(self.ids)

    def link_offsets(self, durations: np.ndarray) -> np.ndarray:
        """Per link, the gap it imposes between ES(pred) and ES(succ) for these durations.

        FS: d_pred + lag; SS: lag; FF: d_pred + lag − d_succ; SF: lag − d_succ.
        Works on 1-D durations (n,) or 2-D (n, iterations).
        """
        d_src = durations[self.src]
        d_dst = durations[self.dst]
        if durations.ndim == 1:
            return self.lag + d_src * self.src_fin - d_dst * self.dst_fin
        return (self.lag[:, None] + d_src * self.src_fin[:, None] - d_dst * self.dst_fin[:, None])


def _levels(n: int, src: np.ndarray, dst: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Longest-path level of each node by frontier sweeps; -1 marks nodes on or behind a cycle."""
    level = np.full(n, -1, dtype=np.int64)
    indeg = np.bincount(dst, minlength=n)
    order = np.argsort(src, kind="stable")
    starts = np.searchsorted(src[order], np.arange(n + 1))
    frontier = np.flatnonzero(indeg == 0)
    topo_parts = []
    depth = 0
    while frontier.size:
        level[frontier] = depth
        topo_parts.append(frontier)
        lo, hi = starts[frontier], starts[frontier + 1]
        count = hi - lo
        if count.sum() == 0:
            break
        idx = np.repeat(lo - np.concatenate(([0], np.cumsum(count)[:-1])), count) + np.arange(count.sum())
        targets = dst[order[idx]]
        dec = np.bincount(targets, minlength=n)
        before = indeg
        indeg = indeg - dec
        frontier = np.flatnonzero((indeg == 0) & (before > 0))
        depth += 1
    topo = np.concatenate(topo_parts) if topo_parts else np.empty(0, dtype=np.int64)
    return level, topo


def _find_loop(ids: list[str], src: np.ndarray, dst: np.ndarray, stuck: np.ndarray) -> list[str]:
    import networkx as nx

    graph = nx.DiGraph()
    mask = stuck[src] & stuck[dst]
    graph.add_edges_from(zip(src[mask].tolist(), dst[mask].tolist()))
    edges = nx.find_cycle(graph)
    loop = [ids[u] for u, _ in edges]
    return loop + [loop[0]]


def _make_pass(near: np.ndarray, far: np.ndarray, key: np.ndarray) -> Pass:
    """Sort links by (key of the near node, near node) and cut them into level segments."""
    order = np.lexsort((near, key[near]))
    near_s, far_s = near[order], far[order]
    lv = key[near_s]
    levels = []
    if order.size:
        cuts = np.flatnonzero(np.diff(lv)) + 1
        bounds = np.concatenate(([0], cuts, [order.size]))
        node_change = np.concatenate(([True], near_s[1:] != near_s[:-1]))
        for lo, hi in zip(bounds[:-1], bounds[1:]):
            seg = np.flatnonzero(node_change[lo:hi])
            levels.append((int(lo), int(hi), near_s[lo + seg], seg))
    return Pass(order, near_s, far_s, levels)


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
    level, topo = _levels(n, src, dst)
    if topo.size < n:
        raise CycleError(_find_loop(ids, src, dst, level < 0))
    rlevel, _ = _levels(n, dst, src)
    empty = np.zeros(0, dtype=np.int64)
    return Network(
        ids=list(ids), src=src, dst=dst, lag=np.asarray(lag, dtype=float),
        src_fin=SRC_FINISH[types] if types.size else np.zeros(0), dst_fin=DST_FINISH[types] if types.size else np.zeros(0),
        topo=topo, level=level,
        forward=_make_pass(dst, src, level),
        backward=_make_pass(src, dst, rlevel),
        by_src=_make_pass(src, dst, np.zeros(n, dtype=np.int64)) if n else Pass(empty, empty, empty, []),
    )


def compile_plan(plan) -> Network:
    """Compile a :class:`~workbench.core.model.Plan` (validates unknown ids, self links, cycles)."""
    ids = plan.ids()
    index = {a: i for i, a in enumerate(ids)}
    src, dst, lag, types = [], [], [], []
    for link in plan.links:
        for end in (link.pred, link.succ):
            if end not in index:
                raise PlanError(f"link {link.pred} \u2192 {link.succ}: unknown activity {end!r}", end)
        src.append(index[link.pred])
        dst.append(index[link.succ])
        lag.append(float(link.lag))
        types.append(TYPE_CODES[link.type])
    return compile_network(ids, np.array(src, dtype=np.int64), np.array(dst, dtype=np.int64),
                           np.array(lag, dtype=float), np.array(types, dtype=np.int64))
