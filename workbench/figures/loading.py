"""Geometry of a resource loading chart, shared by the window and the pack: the use as
steps, the availability line, the over-allocated spans, the y range. No Qt."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np


@dataclass
class LoadingFigure:
    name: str
    edges: np.ndarray          # step edges (len = len(use) + 1)
    use: np.ndarray            # units in use between consecutive edges
    available: np.ndarray      # units available between consecutive edges
    over: list[tuple[float, float]]
    top: float                 # a round y maximum above the peak and the availability
    peak: float

    @property
    def title(self) -> str:
        return f"{self.name}: peak {self.peak:g} of {self.available.max():g} units" if self.available.size else self.name


def loading_figure(load, until: float | None = None) -> LoadingFigure:
    """The chart of one :class:`~workbench.core.loading.Loading`; ``until`` extends the
    last step (the schedule's finish) so the availability line runs to the end."""
    times = np.asarray(load.times, dtype=float)
    end = max(float(times[-1]) if times.size else 0.0, until or 0.0)
    edges = np.append(times, end if end > times[-1] else times[-1] + 1.0) if times.size else np.array([0.0, 1.0])
    use = np.asarray(load.use, dtype=float)[: edges.size - 1]
    avail = np.asarray(load.available, dtype=float)[: edges.size - 1]
    if use.size == 0:
        use, avail = np.zeros(1), np.zeros(1)
    top = _nice_top(max(float(use.max()), float(avail.max()), 1.0))
    return LoadingFigure(load.name or load.resource, edges, use, avail, [(a, b) for a, b, *_ in load.over],
                         top, float(use.max()))


def _nice_top(value: float) -> float:
    """The next of 1, 2, 5 × 10^k at or above 1.15 × value (room for a label above the peak)."""
    target = value * 1.15
    base = 10 ** np.floor(np.log10(target))
    for step in (1, 2, 5, 10):
        if step * base >= target:
            return float(step * base)
    return float(10 * base)
