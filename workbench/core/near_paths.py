"""Near-critical paths of a critical-path schedule: every path within a threshold of the finish.

A path is a chain of links from a start activity (no predecessors, or a start constraint)
to the activity where it ends. Its length is the start floor plus each link's offset
between early starts (see ``Network.link_offsets``) plus the last activity's duration —
for finish-to-start links simply the sum of its durations and lags. The search keeps only
prefixes that can still reach ``finish − threshold`` and stops after ``limit`` paths.
"""

from __future__ import annotations

import numpy as np

TOL = 1e-9


def _tails(net, offsets: np.ndarray, d: np.ndarray) -> np.ndarray:
    """Longest remaining length from each activity's start to a path end."""
    tail = d.astype(float).copy()
    out: dict[int, list[int]] = {}
    for k, s in enumerate(net.src.tolist()):
        out.setdefault(s, []).append(k)
    for node in net.topo[::-1].tolist():
        for k in out.get(node, ()):
            tail[node] = max(tail[node], offsets[k] + tail[net.dst[k]])
    return tail, out


def near_critical_paths(schedule, floor: np.ndarray, variances: np.ndarray, threshold: float,
                        limit: int = 50) -> tuple[list[dict], bool]:
    """Paths whose length is within ``threshold`` of the schedule's finish, longest first.

    Each path: ids, ``mean`` (its length on these durations), ``variance`` (from the
    activities' variances, each duration weighted by how it enters the length) and ``gap``
    (finish − mean). Returns (paths, truncated).
    """
    net, d = schedule.network, schedule.durations
    offsets = net.link_offsets(d)
    tail, out = _tails(net, offsets, d)
    target = schedule.finish - float(threshold) - TOL
    has_pred = np.zeros(net.size, dtype=bool)
    has_pred[net.dst] = True
    starts = [i for i in net.topo.tolist() if (not has_pred[i] or floor[i] > 0) and floor[i] + tail[i] >= target]
    found: list[tuple[float, list[int], list[int]]] = []
    stack = [(s, float(floor[s]), [s], []) for s in reversed(starts)]
    while stack and len(found) < limit:
        node, head, nodes, links = stack.pop()
        if head + d[node] >= target and (not out.get(node) or tail[node] == d[node]):
            found.append((head + d[node], nodes, links))
        for k in reversed(out.get(node, [])):
            nxt = int(net.dst[k])
            if head + offsets[k] + tail[nxt] >= target:
                stack.append((nxt, head + offsets[k], nodes + [nxt], links + [k]))
    truncated = bool(stack)
    paths = [_describe(net, length, nodes, links, variances, schedule.finish) for length, nodes, links in found]
    paths.sort(key=lambda p: (-p["mean"], p["ids"]))
    return paths, truncated


def _describe(net, length, nodes, links, variances, finish) -> dict:
    weight: dict[int, float] = {nodes[-1]: 1.0}
    for k in links:
        s, t = int(net.src[k]), int(net.dst[k])
        weight[s] = weight.get(s, 0.0) + float(net.src_fin[k])
        weight[t] = weight.get(t, 0.0) - float(net.dst_fin[k])
    var = sum(w * w * float(variances[i]) for i, w in weight.items())
    return {"ids": [net.ids[i] for i in nodes], "mean": float(length), "variance": var,
            "gap": float(finish - length)}
