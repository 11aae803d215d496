"""The Activities panel: a filter bar over the editable activity table, plus row actions
(insert, delete, move, paste from a spreadsheet, pick predecessors)."""

from __future__ import annotations

from PySide6.QtCore import QItemSelectionModel, Qt, Signal
from PySide6.QtGui import QAction, QFont, QFontMetrics, QGuiApplication, QKeySequence
from PySide6.QtWidgets import (QAbstractItemView, QCheckBox, QComboBox, QHBoxLayout, QHeaderView,
                               QLabel, QLineEdit, QTableView, QVBoxLayout, QWidget)

from workbench.core.commands import AddActivity, MoveActivity, RemoveActivities, SetPredecessors
from workbench.core.model import Activity
from workbench.ui.activities import columns as C
from workbench.ui.activities import predecessor_dialog
from workbench.ui.activities import row_tools
from workbench.ui.activities.filter_model import ActivityFilterModel
from workbench.ui.activities.table_model import ID_ROLE, ActivityTableModel
from workbench.ui.icons import icon
from workbench.ui.activities.paste_rows import paste_command
from workbench.ui.session import Session

ALL_GROUPS = "All groups"
WIDTH_CHARS = {"id": 5, "name": 32, "group": 13, "predecessors": 12, "notes": 20, "distribution": 9,
               "start_no_earlier": 10, "finish_no_later": 10, "early_start": 11, "early_finish": 11,
               "late_start": 11, "late_finish": 11, "critical": 5, "state": 10, "actual_start": 10,
               "actual_finish": 10, "remaining": 9, "baseline_start": 11, "baseline_finish": 11,
               "cost": 9, "crash_cost": 9}
BASELINE_KEYS = ("baseline_start", "baseline_finish", "start_variance", "finish_variance")
DATE_KEYS = {"start_no_earlier", "finish_no_later", "early_start", "early_finish", "late_start", "late_finish", "actual_start",
             "actual_finish", "baseline_start", "baseline_finish"}
DATE_SAMPLE = "Wed 30 Sep 2027"      # the widest date in Slackline's one format


class ActivitiesPanel(QWidget):
    """The central widget: filter bar and table. Actions live in ``self.actions``."""

    message = Signal(str)

    def __init__(self, session: Session, parent=None):
        super().__init__(parent)
        self.session = session
        self.model = ActivityTableModel(session, self)
        self.proxy = ActivityFilterModel(self)
        self.proxy.setSourceModel(self.model)
        self._syncing = False
        self.table = self._make_table()
        layout = QVBoxLayout(self)
        layout.setContentsMargins(4, 4, 4, 0)
        layout.addLayout(self._make_filter_bar())
        layout.addWidget(self.table)
        self.actions = self._make_actions()
        self.column_keys = [c.key for c in C.COLUMNS]
        row_tools.install(self)
        session.selection_changed.connect(self._show_selection)
        session.schedule_changed.connect(self._refresh_groups)
        session.schedule_changed.connect(self._show_baseline_columns)
        self._refresh_groups()
        self._show_baseline_columns()

    # --- building --------------------------------------------------------
    def _make_table(self) -> QTableView:
        table = QTableView(self)
        table.setModel(self.proxy)
        table.setAccessibleName("Activities table")
        table.setSortingEnabled(True)
        table.sortByColumn(-1, Qt.SortOrder.AscendingOrder)
        table.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectItems)
        table.setAlternatingRowColors(True)
        table.setWordWrap(False)
        table.setEditTriggers(QAbstractItemView.EditTrigger.DoubleClicked | QAbstractItemView.EditTrigger.EditKeyPressed
                              | QAbstractItemView.EditTrigger.AnyKeyPressed)
        header = table.horizontalHeader()
        header.setSectionResizeMode(QHeaderView.ResizeMode.Interactive)
        header.setStretchLastSection(False)
        table.verticalHeader().setDefaultSectionSize(table.fontMetrics().height() + 8)
        self._set_widths(table)
        table.selectionModel().selectionChanged.connect(self._on_table_selection)
        return table

    @staticmethod
    def _set_widths(table: QTableView) -> None:
        """Wide enough for the heading and typical content, so the whole schedule fits."""
        metrics, header = table.fontMetrics(), table.horizontalHeader()
        bold = QFont(header.font())
        bold.setBold(True)
        heading = QFontMetrics(bold)
        for i, col in enumerate(C.COLUMNS):
            chars = WIDTH_CHARS.get(col.key, 6)
            sample = DATE_SAMPLE if col.key in DATE_KEYS else "0" * chars
            text = metrics.horizontalAdvance(sample) + 14
            table.setColumnWidth(i, max(text, heading.horizontalAdvance(col.title) + 16))

    def auto_hidden(self) -> set[str]:
        """Columns hidden whatever the user chose: the baseline dates and variances while
        no baseline is compared."""
        return set(BASELINE_KEYS) if self.session.variance() is None else set()

    def _show_baseline_columns(self) -> None:
        """The baseline dates and variances are shown while a baseline is compared (unless
        the user hid them)."""
        row_tools.apply_hidden(self, row_tools.hidden_columns())

    def _make_filter_bar(self) -> QHBoxLayout:
        bar = QHBoxLayout()
        self.search = QLineEdit(self)
        self.search.setPlaceholderText("Find activities (id, name, group, notes)")
        self.search.setAccessibleName("Find activities")
        self.search.setClearButtonEnabled(True)
        self.search.textChanged.connect(self.proxy.set_text)
        self.group_box = QComboBox(self)
        self.group_box.setAccessibleName("Show group")
        self.group_box.currentTextChanged.connect(lambda t: self.proxy.set_group("" if t == ALL_GROUPS else t))
        self.critical_box = QCheckBox("Critical only", self)
        self.critical_box.setAccessibleName("Show critical activities only")
        self.critical_box.toggled.connect(self.proxy.set_critical_only)
        bar.addWidget(QLabel("Find:", self))
        bar.addWidget(self.search, 3)
        bar.addWidget(self.group_box, 1)
        bar.addWidget(self.critical_box)
        return bar

    def _action(self, text: str, slot, shortcut=None, icon_name: str | None = None, tip: str = "") -> QAction:
        act = QAction(text, self)
        if shortcut is not None:
            act.setShortcut(QKeySequence(shortcut))
            act.setShortcutContext(Qt.ShortcutContext.WidgetWithChildrenShortcut)
        if icon_name:
            act.setIcon(icon(icon_name))
        act.setToolTip(tip or text.replace("&", ""))
        act.triggered.connect(slot)
        self.addAction(act)
        return act

    def _make_actions(self) -> dict[str, QAction]:
        return {
            "insert": self._action("&Insert Activity", self.insert_activity, "Ctrl+Ins", "add_row"),
            "delete": self._action("&Delete Activities", self.delete_selected, QKeySequence.StandardKey.Delete, "remove_row"),
            "move_up": self._action("Move &Up", lambda: self.move_selected(-1), "Ctrl+Shift+Up", "move_up"),
            "move_down": self._action("Move Do&wn", lambda: self.move_selected(1), "Ctrl+Shift+Down", "move_down"),
            "paste": self._action("&Paste Rows", self.paste_rows, QKeySequence.StandardKey.Paste, "paste"),
            "predecessors": self._action("Pick P&redecessors…", self.pick_predecessors, "Ctrl+L", "links"),
            "copy": self._action("&Copy Rows", lambda: row_tools.copy_rows(self), QKeySequence.StandardKey.Copy,
                                 tip="Copy the selected rows as tab-separated text, for a spreadsheet"),
        }

    # --- selection ---------------------------------------------------------
    def current_ids(self) -> list[str]:
        rows = {i.row() for i in self.table.selectionModel().selectedIndexes()}
        cur = self.table.currentIndex()
        if not rows and cur.isValid():
            rows = {cur.row()}
        return [self.proxy.index(r, 0).data(ID_ROLE) for r in sorted(rows)]

    def _on_table_selection(self, *_):
        if not self._syncing:
            self._syncing = True
            self.session.select(self.current_ids())
            self._syncing = False

    def _show_selection(self, ids: list[str]) -> None:
        if self._syncing:
            return
        self._syncing = True
        sel = self.table.selectionModel()
        sel.clearSelection()
        flags = QItemSelectionModel.SelectionFlag.Select | QItemSelectionModel.SelectionFlag.Rows
        for act_id in ids:
            index = self.proxy.mapFromSource(self.model.index(self.model.row_of(act_id), 0))
            if index.isValid():
                sel.select(index, flags)
                self.table.scrollTo(index)
        self._syncing = False

    def _refresh_groups(self) -> None:
        groups = [ALL_GROUPS] + self.proxy.groups()
        if groups != [self.group_box.itemText(i) for i in range(self.group_box.count())]:
            current = self.group_box.currentText()
            self.group_box.blockSignals(True)
            self.group_box.clear()
            self.group_box.addItems(groups)
            self.group_box.setCurrentText(current if current in groups else ALL_GROUPS)
            self.group_box.blockSignals(False)
            self.proxy.set_group("" if self.group_box.currentText() == ALL_GROUPS else self.group_box.currentText())

    # --- row actions ---------------------------------------------------------
    def _new_id(self) -> str:
        known, n = set(self.session.plan.ids()), len(self.session.plan) + 1
        while f"N{n}" in known:
            n += 1
        return f"N{n}"

    def insert_activity(self) -> None:
        ids = self.current_ids()
        row = self.model.row_of(ids[-1]) + 1 if ids else len(self.session.plan)
        new = Activity(self._new_id(), "New activity", duration=1.0)
        if self.session.push(AddActivity(new, row)):
            self.session.select([new.id])
            index = self.proxy.mapFromSource(self.model.index(row, C.INDEX["name"]))
            self.table.setCurrentIndex(index)

    def delete_selected(self) -> None:
        self.delete_ids(self.current_ids())

    def delete_ids(self, ids: list[str]) -> None:
        """Delete these activities and their links (one undo step)."""
        if ids:
            self.session.push(RemoveActivities(ids))

    def move_selected(self, step: int) -> None:
        ids = self.current_ids()
        if len(ids) != 1:
            self.message.emit("Select one activity to move.")
            return
        src = self.model.row_of(ids[0])
        dst = src + step
        if 0 <= dst < len(self.session.plan) and self.session.push(MoveActivity(src, dst)):
            self.session.select(ids)

    def paste_rows(self) -> None:
        text = QGuiApplication.clipboard().text()
        ids = self.current_ids()
        row = self.model.row_of(ids[-1]) + 1 if ids else len(self.session.plan)
        command = paste_command(text, self.session.plan, row)
        if isinstance(command, str):
            self.session.refuse(command)
        elif self.session.push(command):
            self.message.emit(command.text)

    def pick_predecessors(self) -> None:
        ids = self.current_ids()
        if len(ids) != 1:
            self.message.emit("Select one activity to pick its predecessors.")
            return
        self.pick_predecessors_of(ids[0])

    def pick_predecessors_of(self, act_id: str) -> None:
        links = predecessor_dialog.pick_predecessors(self, self.session.plan, act_id)
        if links is not None:
            self.session.push(SetPredecessors(act_id, links))

    def clear_filters(self) -> None:
        """Show every row again (find text, group and critical-only cleared)."""
        self.search.clear()
        self.group_box.setCurrentText(ALL_GROUPS)
        self.critical_box.setChecked(False)
