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
        """Plain words: 'Electricians: over-allocated by 1 unit (5 in use, 4 available)'."""
        if not self.available.size:
            return self.name
        if not self.over:
            return f"{self.name}: within its {self.available.max():g} available (peak {self.peak:g} in use)"
        excess = float(np.max(self.use - self.available))
        plural = "" if abs(excess - 1.0) < 1e-9 else "s"
        at_peak = float(self.available[int(np.argmax(self.use - self.available))])
        return (f"{self.name}: over-allocated by {excess:g} unit{plural} "
                f"({excess + at_peak:g} in use, {at_peak:g} available)")

    @property
    def over_mask(self) -> np.ndarray:
        """Per step, True where the step lies in an over-allocated period."""
        mid = 0.5 * (self.edges[:-1] + self.edges[1:])
        mask = np.zeros(mid.size, dtype=bool)
        for a, b in self.over:
            mask |= (mid > a) & (mid < b)
        return mask


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
