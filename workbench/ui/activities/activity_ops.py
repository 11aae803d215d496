"""Edits and selections on named activities, shared by the table's row menu and the
menus on Timeline bars and Network boxes (the window builds those from these, so a bar
and a row offer the same gestures through the same core commands).

Each takes the Activities panel and explicit activity ids; nothing here computes a
schedule: dates shown or stored come from the session's analysis.
"""

from __future__ import annotations

from workbench.core.commands import AddActivity, EditActivity, Group
from workbench.core.formatting import as_date
from workbench.core.model import Activity, Link
from workbench.ui.activities import columns as C


def neighbours(plan, ids, successors: bool) -> list[str]:
    """The activities linked after (or before) ``ids``, in link order, each once."""
    picked = []
    for act_id in ids:
        links = plan.successors(act_id) if successors else plan.predecessors(act_id)
        picked += [link.succ if successors else link.pred for link in links]
    return list(dict.fromkeys(picked))


def select_neighbours(panel, ids, successors: bool) -> None:
    panel.session.select(neighbours(panel.session.plan, ids, successors))


def add_linked(panel, act_id: str, successor: bool) -> str | None:
    """A new one-day activity linked finish-to-start after (or before) ``act_id``, placed
    beside it in the table, selected, its name ready to type. One undo step."""
    new = Activity(panel._new_id(), "New activity", duration=1.0)
    row = panel.model.row_of(act_id) + (1 if successor else 0)
    link = Link(act_id, new.id) if successor else Link(new.id, act_id)
    command = AddActivity(new, row, [link])
    command.text = f"Add {'successor' if successor else 'predecessor'} {new.id} {'after' if successor else 'before'} {act_id}"
    if not panel.session.push(command):
        return None
    edit_in_table(panel, new.id)
    return new.id


def edit_in_table(panel, act_id: str, key: str = "name") -> None:
    """Select ``act_id`` and open its cell ``key`` for typing (a filter hiding the row is cleared)."""
    panel.session.select([act_id])
    index = panel.proxy.mapFromSource(panel.model.index(panel.model.row_of(act_id), C.INDEX[key]))
    if not index.isValid():
        panel.clear_filters()
        index = panel.proxy.mapFromSource(panel.model.index(panel.model.row_of(act_id), C.INDEX[key]))
    panel.table.setCurrentIndex(index)
    panel.table.scrollTo(index)
    panel.table.setFocus()
    panel.table.edit(index)


def constrained(plan, ids) -> list[str]:
    """Those of ``ids`` with a start-no-earlier or finish-no-later date."""
    acts = (plan.activity(i) for i in ids)
    return [a.id for a in acts if a.start_no_earlier is not None or a.finish_no_later is not None]


def clear_constraints(panel, ids) -> bool:
    ids = constrained(panel.session.plan, ids)
    if not ids:
        return False
    edits = [EditActivity(i, start_no_earlier=None, finish_no_later=None) for i in ids]
    return panel.session.push(edits[0] if len(edits) == 1 else Group(edits, f"Clear constraints of {len(ids)} activities"))


def early_start_date(session, act_id: str):
    """The activity's early start date in the current schedule (None without one)."""
    analysis = session.analysis
    if analysis is None:
        return None
    return as_date(analysis.dates()["early_start"][analysis.schedule.index(act_id)])


def hold_start(panel, act_id: str) -> bool:
    """Start no earlier than its present early start: the activity keeps its date when
    the work before it finishes sooner. One undo step."""
    day = early_start_date(panel.session, act_id)
    return day is not None and panel.session.push(EditActivity(act_id, start_no_earlier=day))
