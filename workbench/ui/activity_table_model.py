"""The Activities table: a QAbstractTableModel over the core plan.

The plan announces each change before and after (``Plan.subscribe``); this model maps
them one-to-one onto begin/end insert, remove, move and reset, and ``dataChanged``.
Edits never touch plan fields: ``setData`` builds a core command and hands it to the
session, which applies it as one undo step and recomputes the schedule.
"""

from __future__ import annotations

from PySide6.QtCore import QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt
from PySide6.QtGui import QBrush, QColor, QFont

from workbench.core.commands import EditActivity, SetPredecessors
from workbench.core.errors import PlanError
from workbench.figures import style
from workbench.ui import columns as C
from workbench.ui.links_text import format_predecessors, parse_predecessors
from workbench.ui.session import Session

SORT_ROLE = Qt.ItemDataRole.UserRole + 1
ID_ROLE = Qt.ItemDataRole.UserRole + 2
CRITICAL_ROLE = Qt.ItemDataRole.UserRole + 3
COMPUTED = tuple(i for i, c in enumerate(C.COLUMNS) if not c.editable)
_Index = QModelIndex | QPersistentModelIndex


class ActivityTableModel(QAbstractTableModel):
    """One row per activity, columns as in :mod:`workbench.ui.columns`."""

    def __init__(self, session: Session, parent=None):
        super().__init__(parent)
        self.session = session
        self.plan = session.plan
        self._dates: dict | None = None
        self._pending_move: tuple[int, int] | None = None
        self.plan.subscribe(self._on_plan_event)
        session.schedule_changed.connect(self._on_schedule_changed)
        plan = self.plan
        self.destroyed.connect(lambda *_: plan.unsubscribe(self._on_plan_event))
        self._on_schedule_changed(emit=False)

    # --- plan events ----------------------------------------------------
    def _on_plan_event(self, event: str, info: dict) -> None:
        kind, row = info.get("kind"), info.get("row")
        before = event == "about_to_change"
        if kind == "activity_inserted":
            self.beginInsertRows(QModelIndex(), row, row) if before else self.endInsertRows()
        elif kind == "activity_removed":
            self.beginRemoveRows(QModelIndex(), row, row) if before else self.endRemoveRows()
        elif kind == "activity_moved":
            self._on_move(before, row, info.get("to"))
        elif kind == "reset":
            self.beginResetModel() if before else self.endResetModel()
        elif not before and kind == "activity_changed":
            self.dataChanged.emit(self.index(row, 0), self.index(row, self.columnCount() - 1))
        elif not before and kind in ("links_changed", "settings_changed"):
            self._all_changed()

    def _on_move(self, before: bool, src: int, dst: int) -> None:
        if before:
            target = dst + 1 if dst > src else dst
            moved = src != dst and self.beginMoveRows(QModelIndex(), src, src, QModelIndex(), target)
            self._pending_move = (src, dst) if moved else None
        elif self._pending_move is not None:
            self._pending_move = None
            self.endMoveRows()

    def _all_changed(self) -> None:
        if self.rowCount():
            self.dataChanged.emit(self.index(0, 0), self.index(self.rowCount() - 1, self.columnCount() - 1))

    def _on_schedule_changed(self, emit: bool = True) -> None:
        analysis = self.session.analysis
        self._dates = analysis.dates() if analysis is not None else None
        if emit and self.rowCount():
            self.dataChanged.emit(self.index(0, COMPUTED[0]), self.index(self.rowCount() - 1, COMPUTED[-1]))

    # --- shape ----------------------------------------------------------
    def rowCount(self, parent: _Index = QModelIndex()) -> int:
        return 0 if parent.isValid() else len(self.plan)

    def columnCount(self, parent: _Index = QModelIndex()) -> int:
        return 0 if parent.isValid() else len(C.COLUMNS)

    def headerData(self, section: int, orientation, role: int = Qt.ItemDataRole.DisplayRole):
        if orientation == Qt.Orientation.Vertical:
            return str(section + 1) if role == Qt.ItemDataRole.DisplayRole and 0 <= section < self.rowCount() else None
        if not 0 <= section < len(C.COLUMNS):
            return None
        col = C.COLUMNS[section]
        if role == Qt.ItemDataRole.DisplayRole:
            return col.title
        if role == Qt.ItemDataRole.ToolTipRole:
            return col.tip + ("" if col.editable else " (computed)")
        return None

    def flags(self, index: _Index):
        if not index.isValid():
            return Qt.ItemFlag.NoItemFlags
        base = Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsSelectable
        return base | Qt.ItemFlag.ItemIsEditable if C.COLUMNS[index.column()].editable else base

    # --- reading --------------------------------------------------------
    def computed_row(self, row: int) -> int | None:
        """The row's index in the latest schedule, or None while it cannot be scheduled."""
        analysis = self.session.analysis
        if analysis is None or self._dates is None:
            return None
        ids = analysis.schedule.ids
        if row < len(ids) and ids[row] == self.plan.activities[row].id:
            return row
        return None

    def value(self, row: int, key: str):
        """The raw value behind a cell (numbers, dates, text, bool) for sorting and filters."""
        act = self.plan.activities[row]
        if key == "predecessors":
            return format_predecessors(self.plan.predecessors(act.id))
        if C.COLUMNS[C.INDEX[key]].editable:
            return getattr(act, key)
        i = self.computed_row(row)
        if i is None:
            return None
        a = self.session.analysis
        if key in self._dates:
            return self._dates[key][i]
        s = a.schedule
        table = {"te": a.means, "sd": a.variances ** 0.5, "total_float": s.total_float,
                 "free_float": s.free_float, "critical": s.critical}
        return table[key][i].item()

    def display(self, row: int, key: str) -> str:
        if key == "predecessors":
            return self.value(row, key)
        if C.COLUMNS[C.INDEX[key]].editable:
            return C.edit_text(self.plan.activities[row], key)
        value = self.value(row, key)
        if value is None:
            return ""
        if key == "critical":
            return C.CRITICAL_MARK if value else ""
        if key in self._dates:
            return C.format_date(value)
        return C.format_number(value)

    def data(self, index: _Index, role: int = Qt.ItemDataRole.DisplayRole):
        if not index.isValid() or not (0 <= index.row() < self.rowCount()):
            return None
        row, key = index.row(), C.KEYS[index.column()]
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole):
            return self.display(row, key)
        if role == SORT_ROLE:
            return self.value(row, key)
        if role == ID_ROLE:
            return self.plan.activities[row].id
        if role == CRITICAL_ROLE:
            return bool(self.value(row, "critical"))
        return self._style(row, key, role)

    def _style(self, row: int, key: str, role: int):
        col = C.COLUMNS[C.INDEX[key]]
        if role == Qt.ItemDataRole.TextAlignmentRole and col.numeric:
            return int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        if role == Qt.ItemDataRole.ToolTipRole:
            return col.tip
        critical = role in (Qt.ItemDataRole.ForegroundRole, Qt.ItemDataRole.FontRole) and bool(self.value(row, "critical"))
        if role == Qt.ItemDataRole.ForegroundRole and key in ("critical", "id") and critical:
            return QBrush(QColor(style.CRITICAL))
        if role == Qt.ItemDataRole.FontRole and critical and key in ("critical", "id"):
            font = QFont()
            font.setBold(True)
            return font
        return None

    # --- editing --------------------------------------------------------
    def setData(self, index: _Index, value, role: int = Qt.ItemDataRole.EditRole) -> bool:
        if not index.isValid() or role != Qt.ItemDataRole.EditRole or not C.COLUMNS[index.column()].editable:
            return False
        act = self.plan.activities[index.row()]
        key = C.KEYS[index.column()]
        text = "" if value is None else str(value)
        if text == self.display(index.row(), key):
            return False
        try:
            command = self._command_for(act, key, text)
        except PlanError as exc:
            self.session.refuse(str(exc))
            return False
        return self.session.push(command)

    def _command_for(self, act, key: str, text: str):
        if key == "predecessors":
            links = parse_predecessors(text, act.id)
            known = set(self.plan.ids())
            for link in links:
                if link.pred not in known:
                    raise PlanError(f"activity {act.id}: predecessor {link.pred!r} is not an activity of this plan", act.id)
            return SetPredecessors(act.id, links)
        return EditActivity(act.id, **C.changes_for(act, key, text))

    def row_of(self, act_id: str) -> int:
        return self.plan.row_of(act_id)
