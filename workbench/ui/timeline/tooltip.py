"""Hover text for one Timeline row: dates, PERT numbers, floats, criticality."""

from __future__ import annotations

import math

from workbench.core.formatting import format_date as _date
from workbench.core.formatting import format_number as _num
from workbench.core.formatting import format_whole_percent


def tooltip_text(analysis, simulation, act_id: str) -> str:
    """Plain-text lines for the activity ``act_id``."""
    s, dates = analysis.schedule, analysis.dates()
    i = s.index(act_id)
    day = {k: v[i] for k, v in dates.items()}
    act = analysis.plan.activity(act_id)
    unit = analysis.plan.settings.unit
    title = f"{act.id}  {act.name}".strip()
    lines = [title]
    if s.ef[i] - s.es[i] <= 1e-9:
        lines.append(f"Milestone: {_date(day['early_start'])}")
    else:
        lines.append(f"Early: {_date(day['early_start'])} \u2192 {_date(day['early_finish'])}")
        lines.append(f"Late:  {_date(day['late_start'])} \u2192 {_date(day['late_finish'])}")
    sd = math.sqrt(max(0.0, float(analysis.variances[i])))
    lines.append(f"te {_num(analysis.means[i])} {unit}, \u03c3 {_num(sd)}")
    if act.has_estimate:
        lines.append(f"estimate {act.optimistic:g} / {act.most_likely:g} / {act.pessimistic:g}")
    lines.append(f"total float {_num(s.total_float[i])}, free float {_num(s.free_float[i])}")
    if s.total_float[i] < -1e-9:
        lines.append(f"misses its late finish by {_num(-s.total_float[i])} {unit}")
    if s.critical[i]:
        lines.append("on the critical path")
    crit = _criticality(simulation, s.ids, i)
    if crit is not None:
        lines.append(f"criticality {format_whole_percent(crit)} (simulated)")
    return "\n".join(lines)


def _criticality(simulation, ids, i: int) -> float | None:
    if simulation is None or list(getattr(simulation, "ids", [])) != list(ids):
        return None
    values = getattr(simulation, "criticality", None)
    if values is None:
        return None
    return float(values[i])
