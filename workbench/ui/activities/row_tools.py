"""What a planner reaches for on the table: Ctrl+C copies the selected rows as
tab-separated text (pastes into a spreadsheet), a right-click menu on a row (edit, insert,
delete, copy, add a successor or predecessor, select predecessors/successors, pick
predecessors), and a right-click menu
on the headings that shows or hides columns, remembered per user."""

from __future__ import annotations

from functools import partial

from PySide6.QtCore import QSettings, Qt
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import QMenu

from workbench.ui.activities import activity_ops
from workbench.ui.activities.columns import COLUMNS

HIDDEN_KEY = "table/hidden_columns"
SHOWN_KEY = "table/shown_columns"      # columns hidden at first that the user showed


def selected_rows(panel) -> list[int]:
    """The selected rows in the order they are shown (the current row when none is)."""
    rows = {i.row() for i in panel.table.selectionModel().selectedIndexes()}
    if not rows and panel.table.currentIndex().isValid():
        rows = {panel.table.currentIndex().row()}
    return sorted(rows)


def rows_as_text(panel, rows: list[int], model=None) -> str:
    """The rows' shown columns as tab-separated lines under a heading line (rows of the
    table as shown, or of ``model``: the unfiltered activity model)."""
    proxy, table = model or panel.proxy, panel.table
    columns = [c for c in range(proxy.columnCount()) if not table.isColumnHidden(c)]
    clean = lambda v: "" if v is None else str(v).replace("\t", " ").replace("\n", " ")  # noqa: E731
    lines = ["\t".join(clean(proxy.headerData(c, Qt.Orientation.Horizontal)) for c in columns)]
    for r in rows:
        lines.append("\t".join(clean(proxy.index(r, c).data()) for c in columns))
    return "\n".join(lines) + "\n"


def copy_rows(panel) -> int:
    rows = selected_rows(panel)
    if not rows:
        return 0
    QGuiApplication.clipboard().setText(rows_as_text(panel, rows))
    panel.message.emit(f"Copied {len(rows)} row{'s' if len(rows) != 1 else ''}: paste them into a spreadsheet")
    return len(rows)


def copy_ids(panel, ids) -> int:
    """Copy the activities ``ids`` as the table's rows (shown columns, even when a filter
    hides a row), tab-separated for a spreadsheet."""
    rows = [panel.model.row_of(i) for i in ids]
    if not rows:
        return 0
    QGuiApplication.clipboard().setText(rows_as_text(panel, rows, panel.model))
    panel.message.emit(f"Copied {len(rows)} row{'s' if len(rows) != 1 else ''}: paste them into a spreadsheet")
    return len(rows)


def select_neighbours(panel, successors: bool) -> None:
    activity_ops.select_neighbours(panel, panel.current_ids(), successors)


def add_linked(panel, successor: bool) -> None:
    ids = panel.current_ids()
    if len(ids) != 1:
        panel.message.emit(f"Select one activity to add a {'successor' if successor else 'predecessor'} to.")
        return
    activity_ops.add_linked(panel, ids[0], successor)


def row_menu(panel, pos) -> QMenu:
    """The menu a right-click on a row opens (built, not shown: see ``show_row_menu``)."""
    menu = QMenu(panel.table)
    index = panel.table.indexAt(pos)
    if index.isValid() and not panel.table.selectionModel().isSelected(index):
        panel.table.setCurrentIndex(index)
    edit = menu.addAction("Edit Cell", lambda: panel.table.edit(panel.table.currentIndex()))
    edit.setEnabled(index.isValid())
    menu.addActions([panel.actions["insert"], panel.actions["delete"], panel.actions["copy"]])
    menu.addAction("Add Successor", partial(add_linked, panel, True)).setEnabled(index.isValid())
    menu.addAction("Add Predecessor", partial(add_linked, panel, False)).setEnabled(index.isValid())
    menu.addSeparator()
    menu.addAction("Select Predecessors", partial(select_neighbours, panel, False))
    menu.addAction("Select Successors", partial(select_neighbours, panel, True))
    menu.addAction(panel.actions["predecessors"])
    return menu


def show_row_menu(panel, pos) -> None:
    row_menu(panel, pos).exec(panel.table.viewport().mapToGlobal(pos))


# --- columns shown -------------------------------------------------------------
def _setting(key: str) -> set[str]:
    value = QSettings().value(key, [])
    return {value} if isinstance(value, str) and value else set(value or [])


def hidden_columns() -> set[str]:
    """The columns the user hid, and those hidden at first (the cost columns) that the
    user has not shown."""
    return _setting(HIDDEN_KEY) | ({c.key for c in COLUMNS if c.hidden} - _setting(SHOWN_KEY))


def apply_hidden(panel, keys) -> None:
    keys = set(keys) | panel.auto_hidden()
    for i, key in enumerate(panel.column_keys):
        panel.table.setColumnHidden(i, key in keys)


def set_column_shown(panel, key: str, shown: bool) -> None:
    keys = hidden_columns()
    keys = keys - {key} if shown else keys | {key}
    if len(keys) >= len(panel.column_keys):   # at least one column stays
        return
    hidden, shown_at_first_hidden = _setting(HIDDEN_KEY), _setting(SHOWN_KEY)
    if shown:
        hidden, shown_at_first_hidden = hidden - {key}, shown_at_first_hidden | {key}
    else:
        hidden, shown_at_first_hidden = hidden | {key}, shown_at_first_hidden - {key}
    QSettings().setValue(HIDDEN_KEY, sorted(hidden))
    QSettings().setValue(SHOWN_KEY, sorted(shown_at_first_hidden))
    apply_hidden(panel, keys)


def column_menu(panel) -> QMenu:
    menu = QMenu(panel.table)
    hidden = hidden_columns()
    for i, key in enumerate(panel.column_keys):
        title = panel.proxy.headerData(i, Qt.Orientation.Horizontal)
        act = menu.addAction(str(title))
        act.setCheckable(True)
        act.setChecked(key not in hidden)
        act.toggled.connect(partial(set_column_shown, panel, key))
    return menu


def install(panel) -> None:
    """Right-click menus on rows and headings; the columns the user hid stay hidden."""
    table = panel.table
    table.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
    table.customContextMenuRequested.connect(partial(show_row_menu, panel))
    header = table.horizontalHeader()
    header.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
    header.customContextMenuRequested.connect(
        lambda pos: column_menu(panel).exec(header.mapToGlobal(pos)))
    apply_hidden(panel, hidden_columns())
