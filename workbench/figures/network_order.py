"""Layer assignment helpers and crossing reduction for the Network view. No Qt.

The drawing follows the layered (hierarchical) drawing framework of Sugiyama, Tagawa and
Toda (1981, IEEE Trans. SMC 11(2)): 1. layers, 2. dummy nodes on links that span several
layers, 3. crossing reduction by barycentre sweeps between adjacent layers, the best order then
refined by adjacent exchanges (``network_exchange``), 4. coordinate
assignment (see ``network_coords``). Everything here is vectorised with numpy; the only
Python loops run over layers and over a bounded number of sweeps.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .network_exchange import exchange_pass

MAX_SWEEPS = 12     # down+up sweep pairs, at most
PATIENCE = 3        # stop after this many pairs without improvement
EXCHANGES = 6       # adjacent-exchange passes on the best order, at most


@dataclass
class LayeredGraph:
    """Real nodes (0..n-1) and dummy nodes (n..), each in one layer; segments join
    adjacent layers only (``layer[seg_v] == layer[seg_u] + 1``)."""

    n: int                    # real nodes
    layer: np.ndarray         # (N,) layer of every item
    seg_u: np.ndarray         # segment upper end (layer l)
    seg_v: np.ndarray         # segment lower end (layer l + 1)
    chains: list[np.ndarray]  # per original link: the items along it, src .. dst
    owner: np.ndarray         # (N,) for a dummy the link it belongs to, -1 for real nodes
    band: np.ndarray          # (N,) band (group) rank of each item; 0 when bands are off

    @property
    def size(self) -> int:
        return self.layer.size

    @property
    def layers(self) -> int:
        return int(self.layer.max()) + 1 if self.layer.size else 0

    def members(self) -> list[np.ndarray]:
        """Items of each layer (a fixed membership list; the order lives in ``pos``)."""
        order = np.argsort(self.layer, kind="stable")
        cuts = np.searchsorted(self.layer[order], np.arange(self.layers + 1))
        return [order[cuts[l]:cuts[l + 1]] for l in range(self.layers)]


def expand(layer: np.ndarray, src: np.ndarray, dst: np.ndarray, band: np.ndarray) -> LayeredGraph:
    """Add one dummy node per skipped layer on every link and cut links into segments."""
    n = layer.size
    span = layer[dst] - layer[src]
    extra = np.maximum(span - 1, 0)
    total = int(extra.sum())
    link_of = np.repeat(np.arange(src.size), extra)
    first = np.concatenate(([0], np.cumsum(extra)[:-1])) if src.size else np.zeros(0, np.int64)
    step = np.arange(total) - np.repeat(first, extra) + 1          # 1 .. span-1
    dummy_ids = n + np.arange(total)
    full_layer = np.concatenate((layer, layer[src[link_of]] + step))
    owner = np.concatenate((np.full(n, -1), link_of))
    full_band = np.concatenate((band, band[src[link_of]]))
    chains, us, vs = [], [], []
    for k in range(src.size):
        mid = dummy_ids[first[k]:first[k] + extra[k]]
        chain = np.concatenate(([src[k]], mid, [dst[k]])).astype(np.int64)
        chains.append(chain)
    if chains:
        us = np.concatenate([c[:-1] for c in chains])
        vs = np.concatenate([c[1:] for c in chains])
    else:
        us = vs = np.zeros(0, np.int64)
    return LayeredGraph(n, full_layer.astype(np.int64), us, vs, chains, owner, full_band.astype(np.int64))


def naive_positions(graph: LayeredGraph, src: np.ndarray) -> np.ndarray:
    """The unreduced order: real nodes in plan order, each dummy next to its link's source
    (keyed by the source's plan row plus a half), bands first when bands are on."""
    key = np.arange(graph.size, dtype=float)
    dummies = graph.owner >= 0
    key[dummies] = src[graph.owner[dummies]] + 0.5
    return _positions_from_key(graph, key)


def _positions_from_key(graph: LayeredGraph, key: np.ndarray) -> np.ndarray:
    pos = np.zeros(graph.size, dtype=np.int64)
    idx = np.lexsort((np.arange(graph.size), key, graph.band, graph.layer))
    lay = graph.layer[idx]
    starts = np.searchsorted(lay, lay)  # first index of the same layer
    pos[idx] = np.arange(idx.size) - starts
    return pos


def count_crossings(graph: LayeredGraph, pos: np.ndarray) -> int:
    """Number of pairwise segment crossings between all pairs of adjacent layers.

    Segments are sorted by (layer, upper position, lower position); a crossing is an
    inversion of the lower positions within one layer. Inversions are counted bit by bit
    of the lower position (pairs first differing at bit b: a one before a zero), which
    needs only sorts and cumulative sums.
    """
    if graph.seg_u.size < 2:
        return 0
    lay = graph.layer[graph.seg_u]
    pu, pv = pos[graph.seg_u], pos[graph.seg_v]
    order = np.lexsort((pv, pu, lay))
    lay, v = lay[order], pv[order]
    total = 0
    for b in range(max(int(v.max()), 1).bit_length()):
        prefix = v >> (b + 1)
        group = lay * (int(prefix.max()) + 1) + prefix
        o = np.argsort(group, kind="stable")
        g, bit = group[o], (v[o] >> b) & 1
        ones = np.cumsum(bit) - bit                     # ones strictly before, globally
        start = np.searchsorted(g, g)                   # first index of each element's group
        before = ones - ones[start]                     # ones before, within the group
        total += int(before[bit == 0].sum())
    return total


class Sweeper:
    """Barycentre ordering sweeps over a layered graph (positions are per layer 0..k-1)."""

    def __init__(self, graph: LayeredGraph):
        self.graph = graph
        self.members = graph.members()
        local = np.zeros(graph.size, dtype=np.int64)
        for items in self.members:
            local[items] = np.arange(items.size)
        self.local = local
        self.down = self._by_layer(graph.seg_v, graph.seg_u)   # per layer: (items here, neighbours above)
        self.up = self._by_layer(graph.seg_u, graph.seg_v)     # per layer: (items here, neighbours below)

    def _by_layer(self, here: np.ndarray, there: np.ndarray) -> list[tuple[np.ndarray, np.ndarray]]:
        lay = self.graph.layer[here]
        order = np.argsort(lay, kind="stable")
        cuts = np.searchsorted(lay[order], np.arange(self.graph.layers + 1))
        return [(self.local[here[order[cuts[l]:cuts[l + 1]]]], there[order[cuts[l]:cuts[l + 1]]])
                for l in range(self.graph.layers)]

    def _reorder(self, l: int, pos: np.ndarray, links: tuple[np.ndarray, np.ndarray]) -> None:
        items = self.members[l]
        if items.size < 2:
            return
        here, there = links
        cur = pos[items].astype(float)
        sums = np.bincount(here, weights=pos[there], minlength=items.size)
        cnt = np.bincount(here, minlength=items.size)
        bary = np.where(cnt > 0, sums / np.maximum(cnt, 1), cur)
        idx = np.lexsort((cur, bary, self.graph.band[items]))
        pos[items[idx]] = np.arange(items.size)

    def sweep(self, pos: np.ndarray) -> None:
        """One downward then one upward barycentre sweep, in place."""
        for l in range(1, self.graph.layers):
            self._reorder(l, pos, self.down[l])
        for l in range(self.graph.layers - 2, -1, -1):
            self._reorder(l, pos, self.up[l])

    def exchange(self, pos: np.ndarray) -> None:
        """Adjacent exchanges (see ``network_exchange``) until none helps, a bounded number of times."""
        for _ in range(EXCHANGES):
            if not exchange_pass(self.members, [self.down, self.up], self.graph.band, pos):
                break

    def reduce(self, pos: np.ndarray, max_sweeps: int = MAX_SWEEPS) -> tuple[np.ndarray, int]:
        """Sweep until no improvement for a few rounds, then refine the best order by
        adjacent exchanges; return it and its crossings."""
        best, best_c = pos.copy(), count_crossings(self.graph, pos)
        stale = 0
        work = pos.copy()
        for _ in range(max_sweeps):
            if best_c == 0 or stale >= PATIENCE:
                break
            self.sweep(work)
            c = count_crossings(self.graph, work)
            if c < best_c:
                best, best_c, stale = work.copy(), c, 0
            else:
                stale += 1
        if best_c:
            self.exchange(best)
            best_c = count_crossings(self.graph, best)
        return best, best_c
