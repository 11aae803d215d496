"""The menu a right-click on a Timeline bar or a Network box opens.

The same gestures as the table's row menu, through the same code (the Activities panel's
actions and ``activities.activity_ops``), on the activities the click selected: edit the
name in the table, add a successor or predecessor, pick predecessors, select the
activities before or after, show the activity in the other chart, hold its start or clear
its date constraints, copy the rows for a spreadsheet, delete. Views only say where and on what the click fell
(``menu_requested(ids, screen_pos)``); the window connects them here.
"""

from __future__ import annotations

from functools import partial

from PySide6.QtWidgets import QMenu

from workbench.core.formatting import format_date
from workbench.ui.activities import activity_ops as ops
from workbench.ui.activities import row_tools

OTHER_VIEW = {"Timeline": "Network", "Network": "Timeline"}


def attach(window, title: str, view) -> None:
    """Give ``view`` (just built in the dock ``title``) the activity menu, if it asks for one."""
    signal = getattr(view, "menu_requested", None)
    if signal is not None:
        signal.connect(partial(show_menu, window, title))


def show_menu(window, title: str, ids: list, screen_pos) -> QMenu | None:
    """Open the menu (not blocking: ``popup``); kept as ``window.activity_menu``."""
    if not ids:
        return None
    menu = build_menu(window, title, ids)
    window.activity_menu = menu
    menu.popup(screen_pos)
    return menu


def build_menu(window, title: str, ids: list) -> QMenu:
    panel, one = window.activities, ids[0]
    single = len(ids) == 1
    menu = QMenu(window)
    menu.setObjectName("activity_menu")
    add = lambda text, slot, enabled=True: menu.addAction(text, slot).setEnabled(enabled)  # noqa: E731
    add(f"Edit {one} in the Table", partial(ops.edit_in_table, panel, one), single)
    add("Add Successor", partial(ops.add_linked, panel, one, True), single)
    add("Add Predecessor", partial(ops.add_linked, panel, one, False), single)
    add("Pick Predecessors\u2026", partial(panel.pick_predecessors_of, one), single)
    menu.addSeparator()
    add("Select Predecessors", partial(ops.select_neighbours, panel, ids, False))
    add("Select Successors", partial(ops.select_neighbours, panel, ids, True))
    other = OTHER_VIEW.get(title)
    if other:
        add(f"Show in {other}", partial(show_in, window, other, one), single)
    menu.addSeparator()
    _constraint_actions(window, menu, ids)
    menu.addSeparator()
    add("Copy as Table Rows", partial(row_tools.copy_ids, panel, list(ids)))
    add(f"Delete {one}" if single else f"Delete {len(ids)} Activities", partial(panel.delete_ids, list(ids)))
    return menu


def _constraint_actions(window, menu: QMenu, ids: list) -> None:
    panel, plan = window.activities, window.session.plan
    if len(ids) == 1 and plan.activity(ids[0]).start_no_earlier is None:
        day = ops.early_start_date(window.session, ids[0])
        if day is not None:
            menu.addAction(f"Start No Earlier Than {format_date(day)}", partial(ops.hold_start, panel, ids[0]))
    clear = menu.addAction("Clear Date Constraints", partial(ops.clear_constraints, panel, ids))
    clear.setEnabled(bool(ops.constrained(plan, ids)))


def show_in(window, title: str, act_id: str) -> None:
    """Bring the dock ``title`` forward with ``act_id`` selected and on screen."""
    dock = window.docks[title]
    dock.show()
    dock.raise_()
    view = window.view(title)
    window.session.select([act_id])
    reveal = getattr(view, "show_activity", None) or getattr(view, "show_node", None)
    helper = getattr(view, "when_shown", None)
    if reveal is not None and helper is not None:
        helper.call(partial(reveal, act_id))     # after the view's own catch-up, once on screen
    elif reveal is not None:
        reveal(act_id)
