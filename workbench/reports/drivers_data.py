"""The simulation's risk drivers for the summary: the tornado's order with both measures."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from workbench.figures.drivers import sensitivity_bars


@dataclass(frozen=True)
class Driver:
    id: str
    name: str
    criticality: float   # share of runs on the critical path, 0..1
    sensitivity: float   # correlation of duration with the finish, -1..1


def top_drivers(ctx, n: int) -> list[Driver]:
    """The n activities with the strongest sensitivity (the Drivers view's tornado order)."""
    sim = ctx.simulation
    index = {act_id: i for i, act_id in enumerate(sim.ids)}
    crit = np.nan_to_num(np.asarray(sim.criticality, dtype=float))
    bars = [b for b in sensitivity_bars(sim, ctx.plan, top=n) if not b.is_folded][:n]
    return [Driver(b.act_id, ctx.name_of(b.act_id), float(crit[index[b.act_id]]), b.value) for b in bars]
