"""Hover text for one Timeline row: dates, PERT numbers, floats, criticality."""

from __future__ import annotations

import math

from workbench.core.calendar import round_offset


def _num(value: float) -> str:
    return f"{round_offset(value):g}"


def _date(d) -> str:
    return f"{d:%a} {d.day} {d:%b %Y}"


def tooltip_text(analysis, simulation, act_id: str) -> str:
    """Plain-text lines for the activity ``act_id``."""
    s, cal = analysis.schedule, analysis.calendar
    i = s.index(act_id)
    act = analysis.plan.activity(act_id)
    unit = analysis.plan.settings.unit
    title = f"{act.id}  {act.name}".strip()
    lines = [title]
    if s.ef[i] - s.es[i] <= 1e-9:
        lines.append(f"Milestone: {_date(cal.start_date(s.es[i]))}")
    else:
        lines.append(f"Early: {_date(cal.start_date(s.es[i]))} \u2192 {_date(cal.finish_date(s.ef[i]))}")
        lines.append(f"Late:  {_date(cal.start_date(s.ls[i]))} \u2192 {_date(cal.finish_date(s.lf[i]))}")
    sd = math.sqrt(max(0.0, float(analysis.variances[i])))
    lines.append(f"te {_num(analysis.means[i])} {unit}, \u03c3 {_num(round(sd, 3))}")
    if act.has_estimate:
        lines.append(f"estimate {act.optimistic:g} / {act.most_likely:g} / {act.pessimistic:g}")
    lines.append(f"total float {_num(s.total_float[i])}, free float {_num(s.free_float[i])}")
    if s.total_float[i] < -1e-9:
        lines.append(f"misses its late finish by {_num(-s.total_float[i])} {unit}")
    if s.critical[i]:
        lines.append("on the critical path")
    crit = _criticality(simulation, s.ids, i)
    if crit is not None:
        lines.append(f"criticality {crit:.0%} (simulated)")
    return "\n".join(lines)


def _criticality(simulation, ids, i: int) -> float | None:
    if simulation is None or list(getattr(simulation, "ids", [])) != list(ids):
        return None
    values = getattr(simulation, "criticality", None)
    if values is None:
        return None
    return float(values[i])
