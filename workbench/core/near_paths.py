"""Near-critical paths of a critical-path schedule: every path within a threshold of the finish.

A path is a chain of links from a start activity (no predecessors, or a start constraint)
to the activity where it ends: one without successors, or one whose own finish comes
later than anything its links lead to (possible with start-to-start or start-to-finish
links). A path never stops short of a successor that would keep it as long, so a path
through a final milestone is listed once, with the milestone. Its length is the start
floor plus each link's offset between early starts (see ``Network.link_offsets``) plus
the last activity's duration — for finish-to-start links simply the sum of its durations
and lags. The search is best
first: partial paths wait keyed by the longest length they can still reach (exact, from
the longest tails), so paths come out longest first, only prefixes that can still reach
``finish − threshold`` are kept, and the search stops after the ``limit`` longest.
"""

from __future__ import annotations

import heapq

import numpy as np

TOL = 1e-9


def _tails(net, offsets: np.ndarray, d: np.ndarray):
    """Per activity, the longest continuation through its links (from its start to a path
    end; −inf without successors) and the longest remaining length, at least its duration."""
    onward = np.full(net.size, -np.inf)
    tail = d.astype(float).copy()
    out: dict[int, list[int]] = {}
    for k, s in enumerate(net.src.tolist()):
        out.setdefault(s, []).append(k)
    for node in net.topo[::-1].tolist():
        for k in out.get(node, ()):
            onward[node] = max(onward[node], offsets[k] + tail[net.dst[k]])
        tail[node] = max(tail[node], onward[node])
    return tail, onward, out


def near_critical_paths(schedule, floor: np.ndarray, variances: np.ndarray, threshold: float,
                        limit: int = 50) -> tuple[list[dict], bool]:
    """Paths whose length is within ``threshold`` of the schedule's finish, longest first.

    Each path: ids, ``mean`` (its length on these durations), ``variance`` (from the
    activities' variances, each duration weighted by how it enters the length) and ``gap``
    (finish − mean). Returns (paths, truncated): the ``limit`` longest paths, and whether
    more were within the threshold. Where parallel links give the same activities several
    lengths, the longest is kept.
    """
    net, d = schedule.network, schedule.durations
    offsets = net.link_offsets(d)
    tail, onward, out = _tails(net, offsets, d)
    target = schedule.finish - float(threshold) - TOL
    has_pred = np.zeros(net.size, dtype=bool)
    has_pred[net.dst] = True
    starts = [i for i in net.topo.tolist() if (not has_pred[i] or floor[i] > 0) and floor[i] + tail[i] >= target]
    heap = [(-(float(floor[s]) + tail[s]), k, False, s, float(floor[s]), (s,), ()) for k, s in enumerate(starts)]
    heapq.heapify(heap)
    found, seen, count = [], set(), len(heap)
    while heap and len(found) < limit:
        _, _, ended, node, head, nodes, links = heapq.heappop(heap)
        if ended:
            if nodes not in seen:
                seen.add(nodes)
                found.append(_describe(net, head + d[node], nodes, links, variances, schedule.finish))
            continue
        for item in _moves(net, out, offsets, tail, onward, d, target, node, head, nodes, links):
            count += 1
            heapq.heappush(heap, (item[0], count) + item[1:])
    found.sort(key=lambda p: (-p["mean"], p["ids"]))
    return found, bool(heap)


def _moves(net, out, offsets, tail, onward, d, target, node, head, nodes, links):
    """Heap entries after reaching ``node``: the path ending there (when it may), then each
    link onward that can still reach ``target``; keyed by the longest length reachable, so
    paths leave the heap longest first."""
    if head + d[node] >= target and onward[node] < d[node] - TOL:     # the path may end here
        yield -(head + d[node]), True, node, head, nodes, links
    for k in out.get(node, ()):
        nxt = int(net.dst[k])
        reach = head + offsets[k] + tail[nxt]
        if reach >= target:
            yield -reach, False, nxt, head + offsets[k], nodes + (nxt,), links + (k,)


def _describe(net, length, nodes, links, variances, finish) -> dict:
    weight: dict[int, float] = {nodes[-1]: 1.0}
    for k in links:
        s, t = int(net.src[k]), int(net.dst[k])
        weight[s] = weight.get(s, 0.0) + float(net.src_fin[k])
        weight[t] = weight.get(t, 0.0) - float(net.dst_fin[k])
    var = sum(w * w * float(variances[i]) for i, w in weight.items())
    return {"ids": [net.ids[i] for i in nodes], "mean": float(length), "variance": var,
            "gap": float(finish - length)}
