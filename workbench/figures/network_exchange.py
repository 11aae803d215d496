"""Adjacent exchange: the refinement step after the ordering sweeps. No Qt.

Two neighbours u, v in a column are swapped when that removes more crossings than it adds
among their own links (the "transpose" step of Gansner, Koutsofios, North and Vo, 1993,
IEEE Trans. Software Eng. 19(3)). Swapping u and v only changes crossings between links of
u and links of v, so disjoint pairs — every other pair, alternating parity — are decided
together with numpy: per pair, counts of neighbour positions below one another.
"""

from __future__ import annotations

import numpy as np


def _pair_costs(first: np.ndarray, second: np.ndarray, owner: np.ndarray, value: np.ndarray,
                size: int) -> tuple[np.ndarray, np.ndarray]:
    """For pairs (first[i] above second[i]): crossings among their links as they stand,
    and after a swap. ``owner``/``value``: each link's end in this column and the position
    of its other end."""
    if not owner.size:
        return np.zeros(first.size), np.zeros(first.size)
    big = int(value.max()) + 2
    keys = np.sort(owner * big + value)
    partner = np.full(size, -1, dtype=np.int64)
    pair_of = np.full(size, -1, dtype=np.int64)
    partner[first], partner[second] = second, first
    pair_of[first] = pair_of[second] = np.arange(first.size)
    mine = partner[owner] >= 0
    o, v, other = owner[mine], value[mine], partner[owner[mine]]
    below = np.searchsorted(keys, other * big + v) - np.searchsorted(keys, other * big)
    is_first = np.zeros(size, dtype=bool)
    is_first[first] = True
    now = np.bincount(pair_of[o[is_first[o]]], weights=below[is_first[o]], minlength=first.size)
    swapped = np.bincount(pair_of[o[~is_first[o]]], weights=below[~is_first[o]], minlength=first.size)
    return now, swapped


def exchange_pass(members: list[np.ndarray], sides: list[list[tuple[np.ndarray, np.ndarray]]],
                  band: np.ndarray, pos: np.ndarray) -> int:
    """One pass over every column, both parities; swaps in place; returns the swap count.

    ``sides``: per side (above, below), per column, (local index of the item here, item there).
    """
    size, swaps = pos.size, 0
    for l, items in enumerate(members):
        if items.size < 2:
            continue
        for parity in (0, 1):
            order = items[np.argsort(pos[items])]
            first, second = order[parity:-1:2], order[parity + 1::2]
            first = first[:second.size]
            now, after = np.zeros(first.size), np.zeros(first.size)
            for side in sides:
                here, there = side[l]
                a, b = _pair_costs(first, second, items[here], pos[there], size)
                now, after = now + a, after + b
            swap = (after < now) & (band[first] == band[second])
            if swap.any():
                u, v = first[swap], second[swap]
                pu = pos[u].copy()
                pos[u], pos[v] = pos[v], pu
                swaps += int(swap.sum())
    return swaps
