"""Random activity networks for tests and benchmarks.

``layered_network`` builds a random layered DAG: activities sit in layers, and each draws
about ``preds`` predecessors from the few layers before its own, so the network is acyclic
by construction and its depth is about n / width. Returned as plain numpy arrays, which
``workbench.core.compile_network`` takes directly, or turned into a Plan by ``to_plan``.
"""

from __future__ import annotations

import datetime as dt
import math

import numpy as np

TYPE_NAMES = ("FS", "SS", "FF", "SF")
LOOKBACK = 3  # predecessors come from at most this many earlier layers


def _layer_of(n: int, width: int) -> np.ndarray:
    return np.arange(n, dtype=np.int64) // max(1, width)


def _draw_links(n: int, width: int, preds: int, rng: np.random.Generator) -> tuple[np.ndarray, np.ndarray]:
    """Each activity outside the first layer gets 1..2*preds-1 (mean ~preds) predecessors."""
    layer = _layer_of(n, width)
    first = np.flatnonzero(layer > 0)
    if first.size == 0:
        return np.zeros(0, dtype=np.int64), np.zeros(0, dtype=np.int64)
    counts = rng.integers(1, 2 * preds, size=first.size) if preds > 1 else np.ones(first.size, dtype=np.int64)
    dst = np.repeat(first, counts)
    lay = layer[dst]
    back = np.minimum(rng.integers(1, LOOKBACK + 1, size=dst.size), lay)
    # Bias towards the previous layer: half the links go exactly one layer back.
    back = np.where(rng.random(dst.size) < 0.5, 1, back)
    src_layer = lay - back
    lo = src_layer * width
    hi = np.minimum(lo + width, n)
    src = lo + (rng.random(dst.size) * (hi - lo)).astype(np.int64)
    key = np.unique(src * n + dst)  # drop duplicate pairs
    return key // n, key % n


def _estimates(n: int, rng: np.random.Generator) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    m = np.round(rng.uniform(1.0, 20.0, size=n), 1)
    a = np.round(m * rng.uniform(0.5, 1.0, size=n), 1)
    b = np.round(m * rng.uniform(1.0, 2.5, size=n), 1)
    return a, m, b


def layered_network(n: int, preds: int = 3, seed: int = 0, link_types: bool = False,
                    width: int | None = None) -> dict:
    """A random layered DAG of ``n`` activities with about ``preds`` predecessors each.

    Returns a dict with ``ids`` (list of str), ``src``, ``dst`` (int64 indices),
    ``lag`` (float), ``types`` (int64, 0..3 = FS, SS, FF, SF), ``optimistic``,
    ``most_likely``, ``pessimistic`` (float). With ``link_types`` the links mix all four
    types and carry lags, some negative; otherwise all are FS with zero lag.
    """
    rng = np.random.default_rng(seed)
    width = int(width) if width else max(1, int(round(math.sqrt(n) * 2)))
    src, dst = _draw_links(n, width, preds, rng)
    if link_types:
        types = rng.choice(4, size=src.size, p=[0.55, 0.2, 0.15, 0.1]).astype(np.int64)
        lag = np.where(rng.random(src.size) < 0.4, rng.integers(-3, 6, size=src.size), 0).astype(float)
    else:
        types = np.zeros(src.size, dtype=np.int64)
        lag = np.zeros(src.size)
    a, m, b = _estimates(n, rng)
    ids = [f"A{i}" for i in range(n)]
    return {"ids": ids, "src": src, "dst": dst, "lag": lag, "types": types,
            "optimistic": a, "most_likely": m, "pessimistic": b}


def chain(n: int, duration: float = 1.0) -> dict:
    """``n`` activities in one FS chain, fixed estimates equal to ``duration``."""
    ids = [f"C{i}" for i in range(n)]
    src = np.arange(n - 1, dtype=np.int64) if n > 1 else np.zeros(0, dtype=np.int64)
    d = np.full(n, float(duration))
    return {"ids": ids, "src": src, "dst": src + 1, "lag": np.zeros(src.size),
            "types": np.zeros(src.size, dtype=np.int64),
            "optimistic": d.copy(), "most_likely": d.copy(), "pessimistic": d.copy()}


def te(net: dict) -> np.ndarray:
    """PERT expected durations (a + 4m + b) / 6 of a generated network."""
    return (net["optimistic"] + 4.0 * net["most_likely"] + net["pessimistic"]) / 6.0


def to_plan(net: dict, title: str = "Random network", start: dt.date = dt.date(2027, 1, 4)):
    """A :class:`~workbench.core.model.Plan` with the same activities and links."""
    from workbench.core.model import Activity, Link, Plan, Settings

    ids = net["ids"]
    a, m, b = (net[k].tolist() for k in ("optimistic", "most_likely", "pessimistic"))
    acts = [Activity(id=ids[i], name=f"Activity {ids[i]}", optimistic=a[i], most_likely=m[i],
                     pessimistic=b[i]) for i in range(len(ids))]
    links = [Link(ids[s], ids[t], TYPE_NAMES[k], float(g)) for s, t, k, g in
             zip(net["src"].tolist(), net["dst"].tolist(), net["types"].tolist(), net["lag"].tolist())]
    return Plan(Settings(title=title, start=start), acts, links)
