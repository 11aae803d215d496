"""Texts shown in Network nodes, and finding a node by id or name. No Qt."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from workbench.core.formatting import format_date


@dataclass(frozen=True)
class NodeText:
    id: str
    name: str
    te: str
    es: str
    ef: str
    ls: str
    lf: str
    total_float: str
    negative: bool = False   # float below zero: a deadline that cannot be met


def number(value: float) -> str:
    """Compact number for a small cell: at most one decimal, no trailing zeros."""
    v = round(float(value), 1)
    if v == 0:
        v = 0.0
    text = f"{v:.1f}".rstrip("0").rstrip(".")
    return text.replace("-", "\u2212")


def numbers(values) -> list[str]:
    """:func:`number` for a whole array at once."""
    v = np.round(np.asarray(values, dtype=float), 1) + 0.0   # + 0.0 turns -0.0 into 0.0
    return [f"{x:.1f}".rstrip("0").rstrip(".").replace("-", "\u2212") for x in v.tolist()]


def node_texts(plan, analysis=None) -> list[NodeText]:
    """One NodeText per activity in plan order; dates cells are empty without an analysis."""
    acts = plan.activities
    if analysis is None:
        return [NodeText(a.id, a.name, number(a.mean), "", "", "", "", "") for a in acts]
    s = analysis.schedule
    columns = [numbers(analysis.means), numbers(s.es), numbers(s.ef), numbers(s.ls), numbers(s.lf),
               numbers(s.total_float)]
    late = (s.total_float < -1e-9).tolist()
    return [NodeText(a.id, a.name, te, es, ef, ls, lf, tf, neg)
            for a, te, es, ef, ls, lf, tf, neg in zip(acts, *columns, late)]


DATE_KEYS = ("early_start", "early_finish", "late_start", "late_finish")


def date_cells(dates: dict, row: int) -> tuple[str, str, str, str]:
    """Early start, early finish, late start, late finish of one node as people read
    dates (``Thu 2 Sep 2027``, as in the table); ``dates`` is ``analysis.dates()``."""
    return tuple(format_date(dates[key][row]) for key in DATE_KEYS)


def find_nodes(plan, text: str) -> list[str]:
    """Ids matching ``text``: an exact id first, then ids starting with it, then names
    containing it (all case-insensitive), each in plan order."""
    needle = text.strip().casefold()
    if not needle:
        return []
    acts = plan.activities
    exact = [a.id for a in acts if a.id.casefold() == needle]
    prefix = [a.id for a in acts if a.id.casefold().startswith(needle) and a.id not in exact]
    seen = set(exact) | set(prefix)
    named = [a.id for a in acts if needle in a.name.casefold() and a.id not in seen]
    return exact + prefix + named


def node_tooltip(plan, analysis, row: int) -> str:
    """A few lines about one activity for a hover tip: name, dates and floats."""
    act = plan.activities[row]
    lines = [f"{act.id}  {act.name}".rstrip()]
    if act.group:
        lines.append(f"group {act.group}")
    if analysis is None:
        return "\n".join(lines + [f"te {number(act.mean)} (not scheduled)"])
    s, dates = analysis.schedule, analysis.dates()
    day = {k: str(v[row]) for k, v in dates.items()}
    lines += [f"te {number(act.mean)}   \u03c3 {number(act.variance ** 0.5)}",
              f"early {day['early_start']} \u2192 {day['early_finish']}",
              f"late  {day['late_start']} \u2192 {day['late_finish']}",
              f"total float {number(s.total_float[row])}   free float {number(s.free_float[row])}"]
    if s.critical[row]:
        lines.append("on the critical path")
    return "\n".join(lines)


def column_dates(layout, analysis) -> list[tuple[float, str]]:
    """Headings of columns placed by early start: per occupied column, its centre x and
    the date of its nominal start (columns are early starts binned in equal steps)."""
    geo = getattr(layout, "geometry", None)
    if analysis is None or geo is None or geo.column_start is None or not layout.nodes:
        return []
    width = layout.nodes[0].w
    used = sorted({n.layer for n in layout.nodes})
    out = []
    for col in used:
        day = analysis.calendar.start_date(round(geo.column_start[col], 6))
        out.append((float(geo.column_x[col] + width / 2), f"{day.day} {day:%b %Y}"))
    return out
