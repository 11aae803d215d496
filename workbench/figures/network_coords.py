"""Coordinate assignment and link routing for the layered Network drawing. No Qt.

Vertical positions: each layer keeps the order found by crossing reduction; nodes are
pulled toward the median height of their neighbours in the layer above (downward pass)
or below (upward pass), then the layer is made overlap-free with the least weighted
movement — an isotonic regression on ``y − cumulative separation`` (pool adjacent
violators, ``scipy.optimize.isotonic_regression``). Dummy nodes weigh more than real
ones, so long links and simple chains come out straight.

Routes: a link leaves its predecessor's right side, crosses each skipped column
horizontally in the lane kept free for it by its dummy node, and enters its successor's
left side. Segments between columns lie in the empty gap between columns, so a route
never passes through a node box. Ports are spread along a side when several links meet.
"""

from __future__ import annotations

import numpy as np

from .network_order import LayeredGraph

ROUNDS = 4            # down+up passes of coordinate assignment
DUMMY_WEIGHT = 4.0    # long links pull harder: they stay straight
LONE_WEIGHT = 0.05    # a node with no neighbour on the side being looked at barely resists


class Placer:
    """Vertical placement of every item (real nodes and dummies) in fixed layer orders."""

    def __init__(self, graph: LayeredGraph, pos: np.ndarray, height: np.ndarray,
                 node_gap: float, lane_gap: float):
        self.graph = graph
        self.height = height
        self.rows = [items[np.argsort(pos[items])] for items in graph.members()]
        self.offsets = [self._offsets(items, node_gap, lane_gap) for items in self.rows]
        self.rank = np.zeros(graph.size, dtype=np.int64)
        for items in self.rows:
            self.rank[items] = np.arange(items.size)
        self.above = self._neighbours(graph.seg_v, graph.seg_u)
        self.below = self._neighbours(graph.seg_u, graph.seg_v)
        self.weight = np.where(graph.owner >= 0, DUMMY_WEIGHT, 1.0)

    def _offsets(self, items: np.ndarray, node_gap: float, lane_gap: float) -> np.ndarray:
        """Cumulative centre-to-centre separation along a layer (the tightest packing)."""
        h = self.height[items]
        real = self.graph.owner[items] < 0
        gap = np.where(real[:-1] & real[1:], node_gap, lane_gap)
        return np.concatenate(([0.0], np.cumsum((h[:-1] + h[1:]) / 2 + gap)))

    def _neighbours(self, here: np.ndarray, there: np.ndarray) -> list[tuple[np.ndarray, np.ndarray]]:
        lay = self.graph.layer[here] if here.size else here
        order = np.argsort(lay, kind="stable")
        cuts = np.searchsorted(lay[order], np.arange(self.graph.layers + 1))
        out = []
        for l in range(self.graph.layers):
            sl = order[cuts[l]:cuts[l + 1]]
            out.append((here[sl], there[sl]))
        return out

    def place(self) -> np.ndarray:
        y = np.zeros(self.graph.size)
        for items, c in zip(self.rows, self.offsets):
            if items.size:
                y[items] = c - c[-1] / 2
        last = self.graph.layers - 1
        for _ in range(ROUNDS):
            for l in range(1, last + 1):
                self._settle(l, y, [self.above[l]])
            for l in range(last - 1, -1, -1):
                self._settle(l, y, [self.below[l]])
        for l in range(last + 1):
            self._settle(l, y, [self.above[l], self.below[l]])
        return y

    def _settle(self, l: int, y: np.ndarray, sides: list[tuple[np.ndarray, np.ndarray]]) -> None:
        items, c = self.rows[l], self.offsets[l]
        if not items.size:
            return
        here = np.concatenate([s[0] for s in sides])
        there = np.concatenate([s[1] for s in sides])
        want, has = _medians(items.size, self.rank[here], y[there])
        want = np.where(has, want, y[items])
        w = np.where(has, self.weight[items], LONE_WEIGHT)
        if items.size == 1:
            y[items] = want
            return
        from scipy.optimize import isotonic_regression   # imported with the first layout, not at start-up

        fit = isotonic_regression(want - c, weights=w, increasing=True).x
        y[items] = fit + c


def _medians(k: int, rank: np.ndarray, vals: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Median of ``vals`` grouped by ``rank`` (0..k-1); mean of the two middles when even."""
    med = np.zeros(k)
    cnt = np.bincount(rank, minlength=k)
    has = cnt > 0
    if not rank.size:
        return med, has
    o = np.lexsort((vals, rank))
    v = vals[o]
    start = np.cumsum(cnt) - cnt
    lo, hi = start + (cnt - 1) // 2, start + cnt // 2
    med[has] = (v[lo[has]] + v[hi[has]]) / 2
    return med, has


def spread_ports(ends: np.ndarray, toward_y: np.ndarray, centre: np.ndarray,
                 height: float, n: int) -> np.ndarray:
    """Port heights on one side of each node: links sorted by where they come from/go to,
    spaced evenly over the middle of the side (at most 14 units apart)."""
    if not ends.size:
        return np.zeros(0)
    order = np.lexsort((toward_y, ends))
    cnt = np.bincount(ends, minlength=n)
    start = np.cumsum(cnt) - cnt
    rank = np.empty(ends.size)
    rank[order] = np.arange(ends.size) - start[ends[order]]
    k = cnt[ends]
    step = np.minimum(14.0, 0.6 * height / np.maximum(k - 1, 1))
    return centre[ends] + (rank - (k - 1) / 2) * step


def route_links(graph: LayeredGraph, y: np.ndarray, column_x: np.ndarray, width: float,
                height: float) -> list[np.ndarray]:
    """Polyline (m, 2) per link, from the predecessor's right side to the successor's left."""
    chains = graph.chains
    if not chains:
        return []
    src = np.array([c[0] for c in chains])
    dst = np.array([c[-1] for c in chains])
    nxt = np.array([c[1] for c in chains])
    prv = np.array([c[-2] for c in chains])
    out_y = spread_ports(src, y[nxt], y, height, graph.n)
    in_y = spread_ports(dst, y[prv], y, height, graph.n)
    routes = []
    for k, chain in enumerate(chains):
        mid = chain[1:-1]
        xs = column_x[graph.layer[mid]]
        inner = np.column_stack((np.repeat(xs, 2) + np.tile([0.0, width], mid.size), np.repeat(y[mid], 2)))
        start = [column_x[graph.layer[src[k]]] + width, out_y[k]]
        end = [column_x[graph.layer[dst[k]]], in_y[k]]
        routes.append(_simplify(np.vstack(([start], inner.reshape(-1, 2), [end]))))
    return routes


def _simplify(points: np.ndarray) -> np.ndarray:
    """Drop interior points that lie on the straight line through their neighbours."""
    if len(points) < 3:
        return points
    a, b, c = points[:-2], points[1:-1], points[2:]
    cross = (b[:, 0] - a[:, 0]) * (c[:, 1] - a[:, 1]) - (b[:, 1] - a[:, 1]) * (c[:, 0] - a[:, 0])
    keep = np.concatenate(([True], np.abs(cross) > 1e-6, [True]))
    return points[keep] if keep.all() else _simplify(points[keep])


def label_anchor(route: np.ndarray, reach: float) -> tuple[float, float]:
    """Where a link's label sits: on its last segment, ``reach`` units before the arrow."""
    (x0, y0), (x1, y1) = route[-2], route[-1]
    span = max(x1 - x0, 1e-9)
    t = max(0.0, 1.0 - reach / span)
    return (float(x0 + t * (x1 - x0)), float(y0 + t * (y1 - y0)))
