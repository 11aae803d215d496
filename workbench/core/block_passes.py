"""Critical-path passes over a block of iterations (activities × iterations), in place.

The Monte Carlo engine schedules many sets of durations at once. Each pass (forward,
backward) gets its own numbering of the activities: level by level like the compiled
network, and inside a level by decreasing number of links into the node the pass updates,
so the nodes with more than k links form a prefix of their level. The k-th link of every
such node is one *group*: its candidates are one gather ``take(..., out=)`` into a reused
buffer, combined into the prefix by one ``maximum``/``minimum`` — no segmented reduction,
no temporaries, everything float64, and the buffers live as long as the network.

The arithmetic is that of :mod:`.cpm`, operation for operation, so every column of a block
equals the one-dimensional schedule bit for bit:

- a finish-to-start link without lag (*plain*) offers the predecessor's early finish
  EF_i = ES_i + d_i going forward, and LS_j to the predecessor's late finish going
  backward: LS_i = min(ceiling, LS_j) − d_i rounds exactly like the minimum of the
  differences, rounding being monotone;
- any other link offers ES_i + off and LS_j − off with off = (d_i or 0) − (d_j or 0) + lag,
  computed as :meth:`Network.link_offsets` does.

A block is scored as it is swept backward: total float LS − ES, level by level, compared
with the criticality threshold, counted per activity; late starts are never gathered back
into plan order.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .network import Network

EPS = 1e-9


@dataclass
class _Order:
    """One pass's numbering: ``nodes[r]`` is the activity in row r, ``row`` its inverse;
    ``levels`` lists (first row, end row, plain groups, other groups) in sweep order, each
    group (rows, gather rows, offset parts or None)."""

    nodes: np.ndarray
    row: np.ndarray
    levels: list
    widest: int


def _order(net: Network, near: np.ndarray, far: np.ndarray, plain: np.ndarray, reverse: bool) -> _Order:
    """Rows and groups for the pass that updates ``near`` from ``far`` over each link."""
    n = net.size
    degree = np.bincount(near, minlength=n)
    nodes = np.lexsort((net.rank, -degree, net.level))
    row = np.empty(n, dtype=np.int64)
    row[nodes] = np.arange(n)
    groups: dict[int, tuple[list, list]] = {}
    for part in _groups(net, near, plain, row, degree[nodes]):
        level = int(net.level[near[part[0]]])
        gather = row[far[part]]
        if plain[part].all():
            groups.setdefault(level, ([], []))[0].append((part.size, gather, None))
        else:
            groups.setdefault(level, ([], []))[1].append((part.size, gather, _parts(net, part, row, n)))
    counts = np.bincount(net.level, minlength=1) if n else np.zeros(0, dtype=np.int64)
    edges = np.concatenate(([0], np.cumsum(counts)))
    levels = [(int(a), int(b)) + groups.get(k, ([], [])) for k, (a, b) in enumerate(zip(edges[:-1], edges[1:]))]
    widest = int(counts.max()) if counts.size else 0
    return _Order(nodes, row, levels[::-1] if reverse else levels, widest)


def _groups(net: Network, near: np.ndarray, plain: np.ndarray, row: np.ndarray, degree: np.ndarray):
    """The links in groups, level by level and k = 0, 1, … within a level: group k holds
    the k-th link (plain ones first) of every row with more than k, in row order."""
    first = np.concatenate(([0], np.cumsum(degree)[:-1]))     # first link of each row
    links = np.lexsort((~plain, row[near]))                    # row by row, plain links first
    kth = np.arange(links.size) - first[row[near[links]]]
    by_group = np.lexsort((row[near[links]], kth, net.level[near[links]]))
    links, kth = links[by_group], kth[by_group]
    key = net.level[near[links]] * (int(degree.max(initial=0)) + 1) + kth   # one value per group
    cuts = np.flatnonzero(np.diff(key, prepend=-1, append=-1) != 0) if links.size else np.zeros(1, np.int64)
    return [links[lo:hi] for lo, hi in zip(cuts[:-1], cuts[1:])]


def _parts(net: Network, part: np.ndarray, row: np.ndarray, n: int):
    """Per link of a group, the rows of d_i and d_j in a link's offset (n: the zero row),
    or None when no link needs them; the lags as a column, or None when all are zero."""
    src_rows = np.where(net.src_fin[part] > 0, row[net.src[part]], n)
    dst_rows = np.where(net.dst_fin[part] > 0, row[net.dst[part]], n)
    lag = net.lag[part]
    return (src_rows if (src_rows < n).any() else None, dst_rows if (dst_rows < n).any() else None,
            lag[:, None].copy() if lag.any() else None)


def _offsets(parts, d: np.ndarray, out: np.ndarray, spare: np.ndarray) -> np.ndarray:
    """The links' offsets (d_i or 0) − (d_j or 0) + lag into ``out``."""
    src_rows, dst_rows, lag = parts
    if src_rows is None:
        out.fill(0.0)
    else:
        d.take(src_rows, axis=0, out=out)
    if dst_rows is not None:
        out -= d.take(dst_rows, axis=0, out=spare)
    if lag is not None:
        out += lag
    return out


class BlockPasses:
    """Forward and backward passes over blocks of iterations, reusing its buffers.

    ``floor`` and ``fnlt`` are the activities' start floors and finish-no-later offsets
    (plan order, as :class:`~.cpm.Analyzer` keeps them)."""

    def __init__(self, net: Network, floor: np.ndarray, fnlt: np.ndarray, finish_floor=None, done=None):
        self.net, n = net, net.size
        plain = (net.src_fin > 0) & (net.dst_fin == 0) & (net.lag == 0)
        self.fwd = _order(net, net.dst, net.src, plain, reverse=False)
        self.bwd = _order(net, net.src, net.dst, plain, reverse=True)
        self.floor = self.base_floor = np.asarray(floor, dtype=float)[self.fwd.nodes][:, None]
        # Progress (see core/progress.py): finish floors EF ≥ f become start floors f − d per
        # iteration; done activities are never counted critical.
        self.finish_floor = None if finish_floor is None else np.asarray(finish_floor, float)[self.fwd.nodes][:, None]
        self.done = None if done is None else np.asarray(done, dtype=bool)
        self.fnlt = np.asarray(fnlt, dtype=float)[self.bwd.nodes][:, None]
        self.es_rows = self.fwd.row[self.bwd.nodes]        # forward row of each backward row
        self.bounded = [bool(np.isfinite(self.fnlt[a:b]).any()) for a, b, _, _ in self.bwd.levels]
        self.size = n
        self._flat: dict[str, np.ndarray] = {}
        self._width = 0

    def _buffers(self, width: int) -> dict[str, np.ndarray]:
        """Contiguous (rows, width) views of buffers kept across blocks (grown as needed)."""
        rows = {"d_f": self.size + 1, "es": self.size, "ef": self.size, "d_b": self.size + 1,
                "ls": self.size, "tmp": max(self.fwd.widest, 1), "spare": max(self.fwd.widest, 1)}
        if width > self._width:
            self._flat = {k: np.empty(r * width) for k, r in rows.items()}
            self._flat["crit"] = np.empty(self.size * width, dtype=bool)
            self._width = width
        views = {k: self._flat[k][: r * width].reshape(r, width) for k, r in rows.items()}
        views["crit"] = self._flat["crit"][: self.size * width].reshape(self.size, width)
        views["d_f"][self.size] = 0.0
        views["d_b"][self.size] = 0.0
        return views

    def run(self, d: np.ndarray, deadline: float | None, valid: int | None = None):
        """Finish per iteration and, per activity (plan order), the number of the first
        ``valid`` iterations in which it is critical, for durations ``d`` (n, iterations)."""
        n, width = d.shape
        valid = width if valid is None else valid
        if n == 0:
            return np.zeros(width), np.zeros(0, dtype=np.int64)
        buf = self._buffers(width)
        d.take(self.fwd.nodes, axis=0, out=buf["d_f"][:n])
        d.take(self.bwd.nodes, axis=0, out=buf["d_b"][:n])
        if self.finish_floor is not None:
            self.floor = np.maximum(self.base_floor, self.finish_floor - buf["d_f"][:n])
        self._forward(buf)
        finish = buf["ef"].max(axis=0)
        ref = finish if deadline is None else np.full(width, float(deadline))
        threshold = ref - finish + EPS
        self._backward(buf, ref)
        counts = self._critical(buf, threshold, valid)
        if self.done is not None:
            counts[self.done] = 0
        return finish, counts

    def _forward(self, buf) -> None:
        es, ef, d, tmp, spare = buf["es"], buf["ef"], buf["d_f"], buf["tmp"], buf["spare"]
        floor = self.floor
        for a, b, plain, other in self.fwd.levels:
            start = a                          # rows from here on start from their floor
            for c, gather, _ in plain:
                ef.take(gather, axis=0, out=tmp[:c])
                if start == a:                 # the first group also applies the floor
                    start = a + c
                    np.maximum(tmp[:c], floor[a:start], out=es[a:start])
                    es[start:b] = floor[start:b]
                else:
                    np.maximum(es[a:a + c], tmp[:c], out=es[a:a + c])
            if start == a:
                es[a:b] = floor[a:b]
            for c, gather, parts in other:
                _offsets(parts, d, tmp[:c], spare[:c])
                tmp[:c] += es.take(gather, axis=0, out=spare[:c])
                np.maximum(es[a:a + c], tmp[:c], out=es[a:a + c])
            np.add(es[a:b], d[a:b], out=ef[a:b])

    def _backward(self, buf, ref: np.ndarray) -> None:
        ls, d, tmp, spare = buf["ls"], buf["d_b"], buf["tmp"], buf["spare"]
        fnlt = self.fnlt
        for (a, b, plain, other), bounded in zip(self.bwd.levels, self.bounded):
            start = a                          # rows from here on start from their bound
            for c, gather, _ in plain:
                ls.take(gather, axis=0, out=tmp[:c])
                if start == a and not bounded:  # the first group also applies the bound
                    start = a + c
                    np.minimum(tmp[:c], ref, out=ls[a:start])
                else:
                    if start == a:
                        start = b
                        np.minimum(fnlt[a:b], ref, out=ls[a:b])
                    np.minimum(ls[a:a + c], tmp[:c], out=ls[a:a + c])
            if start < b:
                np.minimum(fnlt[start:b], ref, out=ls[start:b])
            ls[a:b] -= d[a:b]
            for c, gather, parts in other:
                _offsets(parts, d, tmp[:c], spare[:c])
                np.subtract(ls.take(gather, axis=0, out=spare[:c]), tmp[:c], out=tmp[:c])
                np.minimum(ls[a:a + c], tmp[:c], out=ls[a:a + c])

    def _critical(self, buf, threshold: np.ndarray, valid: int) -> np.ndarray:
        """Per activity (plan order): iterations among the first ``valid`` where LS − ES ≤ threshold."""
        ls, es, tmp, crit = buf["ls"], buf["es"], buf["tmp"], buf["crit"]
        for a, b, _, _ in self.bwd.levels:
            es.take(self.es_rows[a:b], axis=0, out=tmp[: b - a])
            np.subtract(ls[a:b], tmp[: b - a], out=tmp[: b - a])
            np.less_equal(tmp[: b - a], threshold, out=crit[a:b])
        counts = np.empty(self.size, dtype=np.int64)
        counts[self.bwd.nodes] = np.count_nonzero(crit[:, :valid], axis=1)
        return counts
