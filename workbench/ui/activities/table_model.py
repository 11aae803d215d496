"""The Activities table: a QAbstractTableModel over the core plan.

The plan announces each change before and after (``Plan.subscribe``); this model maps
them one-to-one onto begin/end insert, remove, move and reset, and ``dataChanged``.
Edits never touch plan fields: ``setData`` builds a core command and hands it to the
session, which applies it as one undo step and recomputes the schedule.
"""

from __future__ import annotations

from functools import lru_cache

from PySide6.QtCore import QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt
from PySide6.QtGui import QBrush, QColor, QFont

from workbench.core.commands import EditActivity, SetPredecessors
from workbench.core import formatting as fm
from workbench.core.errors import PlanError
from workbench.figures import style
from workbench.ui.activities import columns as C
from workbench.ui.activities import progress_columns as PC
from workbench.ui.activities.changed_rows import changed_rows, row_runs
from workbench.ui.activities.living_values import living_columns, progress_value
from workbench.ui.activities.links_text import format_predecessors, parse_predecessors
from workbench.ui.session import Session

SORT_ROLE = Qt.ItemDataRole.UserRole + 1
ID_ROLE = Qt.ItemDataRole.UserRole + 2
CRITICAL_ROLE = Qt.ItemDataRole.UserRole + 3
_EDITABLE = frozenset(c.key for c in C.COLUMNS if c.editable)
COMPUTED = tuple(i for i, c in enumerate(C.COLUMNS) if not c.editable)
_Index = QModelIndex | QPersistentModelIndex
_RIGHT = int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
_R = Qt.ItemDataRole
_ALIGN, _TIP, _FOREGROUND, _FONT = (int(r) for r in (_R.TextAlignmentRole, _R.ToolTipRole, _R.ForegroundRole, _R.FontRole))
_TEXT_ROLES = frozenset((int(_R.DisplayRole), int(_R.EditRole)))
_ROLES = _TEXT_ROLES | {_ALIGN, _TIP, _FOREGROUND, _FONT, int(SORT_ROLE), int(ID_ROLE), int(CRITICAL_ROLE)}


@lru_cache(maxsize=1)
def _critical_brush() -> QBrush:
    return QBrush(QColor(style.CRITICAL))


def _bold_font() -> QFont:
    font = QFont()
    font.setBold(True)
    return font


class ActivityTableModel(QAbstractTableModel):
    """One row per activity, columns as in :mod:`workbench.ui.activities.columns`."""

    def __init__(self, session: Session, parent=None):
        super().__init__(parent)
        self.session = session
        self.plan = session.plan
        self._dates: dict | None = None
        self._pending_move: tuple[int, int] | None = None
        self._acts = self.plan.activities  # cached: Plan.activities builds a new tuple per call
        self._links_key = None
        self._into: dict = {}
        self._columns: dict = {}
        self._computed_ids = ()
        self.plan.subscribe(self._on_plan_event)
        session.schedule_changed.connect(self._on_schedule_changed)
        plan = self.plan
        self.destroyed.connect(lambda *_: plan.unsubscribe(self._on_plan_event))
        self._on_schedule_changed(emit=False)

    # --- plan events ----------------------------------------------------
    def _on_plan_event(self, event: str, info: dict) -> None:
        kind, row = info.get("kind"), info.get("row")
        before = event == "about_to_change"
        if before and kind == "activity_changed" and row is not None and 0 <= row < len(self._acts):
            self._old_id = self._acts[row].id
        if not before:
            self._acts = self.plan.activities
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
            if getattr(self, "_old_id", None) != self._acts[row].id:   # a rename shows in its successors' cells too
                pred = C.INDEX["predecessors"]
                self.dataChanged.emit(self.index(0, pred), self.index(self.rowCount() - 1, pred))
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
        old_columns, old_ids = self._columns, self._computed_ids
        self._dates = analysis.dates() if analysis is not None else None
        self._columns, self._computed_ids = {}, ()
        if analysis is not None:
            s = analysis.schedule
            self._columns = {"te": analysis.means, "sd": analysis.variances ** 0.5, "total_float": s.total_float,
                             "free_float": s.free_float, "critical": s.critical, **self._dates,
                             **living_columns(analysis, self.session.variance())}
            self._computed_ids = s.ids
        if emit and self.rowCount():
            rows = changed_rows(old_columns, self._columns, old_ids, self._computed_ids)
            runs = [(0, self.rowCount() - 1)] if rows is None else row_runs(rows)
            for first, last in runs:     # only the rows whose figures moved: repainted, re-sorted, re-filtered
                self.dataChanged.emit(self.index(first, COMPUTED[0]), self.index(last, COMPUTED[-1]))

    # --- shape ----------------------------------------------------------
    def rowCount(self, parent: _Index = QModelIndex()) -> int:
        return 0 if parent.isValid() else len(self._acts)

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
        if row < len(ids) and ids[row] == self._acts[row].id:
            return row
        return None

    def value(self, row: int, key: str):
        """The raw value behind a cell (numbers, dates, text, bool) for sorting and filters."""
        act = self._acts[row]
        if key == "predecessors":
            return format_predecessors(self._links_into().get(act.id, ()))
        if key in PC.EDITABLE:
            return progress_value(act, key)
        if key in _EDITABLE:
            return getattr(act, key)
        i = self.computed_row(row)
        if i is None:
            return None
        value = self._columns[key][i]
        if key in PC.COMPUTED:
            return None if value is None or value != value else value     # NaN: not in the baseline
        return value if key in self._dates else value.item()

    def _links_into(self) -> dict:
        """Incoming links by activity, rebuilt only when the link list changed."""
        links = self.plan.links
        if self._links_key is not links:
            into: dict[str, list] = {}
            for link in links:
                into.setdefault(link.succ, []).append(link)
            self._links_key, self._into = links, into
        return self._into

    def display(self, row: int, key: str) -> str:
        if key == "predecessors":
            return self.value(row, key)
        if key in _EDITABLE:
            return C.edit_text(self._acts[row], key)
        value = self.value(row, key)
        if value is None:
            return ""
        if key == "critical":
            return C.CRITICAL_MARK if value else ""
        if key == "state":
            return value
        if key in self._dates or key in ("baseline_start", "baseline_finish"):
            return C.format_date(value)
        return fm.format_number(value)       # computed figures, rounded for people

    def data(self, index: _Index, role: int = Qt.ItemDataRole.DisplayRole):
        role = int(role)
        if role not in _ROLES or not index.isValid():
            return None
        row = index.row()
        if row >= len(self._acts):
            return None
        key = C.KEYS[index.column()]
        if role in _TEXT_ROLES:
            return self.display(row, key)
        if role == SORT_ROLE:
            return self.value(row, key)
        if role == ID_ROLE:
            return self._acts[row].id
        if role == CRITICAL_ROLE:
            return bool(self.value(row, "critical"))
        return self._style(row, key, role)

    def _style(self, row: int, key: str, role: int):
        if role == _ALIGN:
            return _RIGHT if C.COLUMNS[C.INDEX[key]].numeric else None
        if role == _TIP:
            return C.COLUMNS[C.INDEX[key]].tip
        if key not in ("critical", "id") or not self.value(row, "critical"):
            return None
        return _critical_brush() if role == _FOREGROUND else _bold_font()

    # --- editing --------------------------------------------------------
    def setData(self, index: _Index, value, role: int = Qt.ItemDataRole.EditRole) -> bool:
        if not index.isValid() or role != Qt.ItemDataRole.EditRole or not C.COLUMNS[index.column()].editable:
            return False
        act = self._acts[index.row()]
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

    def activity_at(self, row: int):
        return self._acts[row]

    def row_of(self, act_id: str) -> int:
        return self.plan.row_of(act_id)
