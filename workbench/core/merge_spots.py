"""Merge hot spots: where several paths, each critical in a good share of simulation runs,
converge — the places PERT's optimism comes from (our own check).

From sampled durations (activities × runs) the critical-path passes run on all runs at once.
In a run, a link is *critical* when both its ends are critical and it has no slack. A merge
hot spot is an activity with at least two predecessors whose links into it are each critical
in at least ``share`` of the runs. The *merge bias* attributed to it is what the merge alone
adds to its own start on average: the mean over runs of the latest arrival through its links
minus the latest of the mean arrivals (never negative: the mean of a maximum is at least the
maximum of the means). Each converging path is traced back from the predecessor along the
link most often critical.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .cpm import backward, constraint_bounds, forward

EPS = 1e-9
VALUES_BUDGET = 3_000_000      # activity-or-link × run values per array in a replay
MIN_RUNS = 200


@dataclass
class MergeSpot:
    merge: str
    branches: list[tuple[str, float, list[str]]]   # predecessor, share of runs, path to it
    bias: float                                     # plan units


def replay_runs(result, plan) -> int:
    """Runs replayed for the merge analysis: all of the result's, within the memory budget."""
    width = max(1, len(plan) + len(plan.links))
    return int(min(result.iterations, max(MIN_RUNS, VALUES_BUDGET // width)))


def sampled_durations(result, plan) -> np.ndarray:
    """The run's sampled durations: kept in the result, else replayed at its seed."""
    kept = getattr(result, "durations", None)
    if kept is not None and kept.shape[0] == len(plan):
        return kept
    from .montecarlo import simulate
    replay = simulate(plan, replay_runs(result, plan), seed=result.seed, deadline=result.deadline,
                      keep_durations=True)
    return replay.durations


def link_shares(net, floor: np.ndarray, fnlt: np.ndarray, d: np.ndarray):
    """Per link the share of runs in which it is critical, per link the arrival (ES of the
    predecessor + the link's offset) in every run, and the early starts."""
    off = net.link_offsets(d)
    es = forward(net, off, floor)
    finish = (es + d).max(axis=0)
    ls = backward(net, off, np.minimum(finish[None, :], fnlt[:, None]) - d)
    critical = (ls - es) <= EPS
    arrival = es[net.src] + off
    tight = np.abs(es[net.dst] - arrival) <= EPS
    on = critical[net.src] & critical[net.dst] & tight
    return on.mean(axis=1), arrival


def _trace(net, share: np.ndarray, into: dict, start: int, limit: int = 200) -> list[str]:
    """The path back from ``start`` along the most often critical link, first activity first."""
    path, node, seen = [start], start, {start}
    while node in into and len(path) < limit:
        k = max(into[node], key=lambda k: share[k])
        node = int(net.src[k])
        if node in seen:
            break
        seen.add(node)
        path.append(node)
    return [net.ids[i] for i in reversed(path)]


def merge_hot_spots(plan, d: np.ndarray, share: float = 0.10, calendar=None) -> list[MergeSpot]:
    """Hot spots from sampled durations ``d`` (activities × runs), largest merge bias first."""
    from .analysis import analyze
    analysis = analyze(plan)
    net = analysis.schedule.network
    floor, fnlt = constraint_bounds(plan, calendar or analysis.calendar)
    shares, arrival = link_shares(net, floor, fnlt, np.asarray(d, dtype=float))
    into: dict[int, list[int]] = {}
    for k, j in enumerate(net.dst.tolist()):
        into.setdefault(j, []).append(k)
    spots = []
    for j, links in into.items():
        best: dict[int, float] = {}
        for k in links:                      # parallel links from one predecessor: one branch
            i = int(net.src[k])
            best[i] = max(best.get(i, 0.0), float(shares[k]))
        hot = [(i, s) for i, s in best.items() if s >= share - EPS]
        if len(hot) < 2:
            continue
        arr = np.vstack([arrival[links], np.broadcast_to(floor[j], (1, arrival.shape[1]))])
        bias = float(arr.max(axis=0).mean() - arr.mean(axis=1).max())
        hot.sort(key=lambda x: -x[1])
        spots.append(MergeSpot(net.ids[j], [(net.ids[i], s, _trace(net, shares, into, i)) for i, s in hot],
                               max(0.0, bias)))
    spots.sort(key=lambda m: (-m.bias, m.merge))
    return spots
