"""Bringing one activity's row on screen (asked for from another view's menu), and the
keyboard's way to the activity menu (the Menu key or Shift+F10 on the chart)."""

from __future__ import annotations

from functools import partial

from PySide6.QtCore import QPoint, QPointF, Qt
from PySide6.QtGui import QKeySequence, QShortcut


def show_activity(view, act_id: str) -> None:
    """Scroll ``view`` (a TimelineView; same zoom) so the row of ``act_id`` is on screen,
    opening its group when it is folded."""
    geo = view.geometry
    if geo is not None and act_id not in geo.row_of:
        group = view.session.plan.activity(act_id).group
        if group in view.collapsed:
            view.toggle_group(group)
        geo = view.geometry
    if geo is None or act_id not in geo.row_of:
        return
    row = geo.row_of[act_id]
    _, (y0, y1) = view.view_box.viewRange()
    if not y0 + 0.5 <= row <= y1 - 0.5:
        view.view_box.translateBy(y=row - (y0 + y1) / 2)


def menu_for_selection(view) -> bool:
    """Ask for the activity menu of the selection, at its first bar on screen (or the
    chart's corner): what a right-click does, from the keyboard."""
    ids, geo = view.session.selected(), view.geometry
    if not ids or geo is None:
        return False
    row = geo.row_of.get(ids[0])
    viewport = view.plot.viewport()
    point = QPoint(8, 8)
    if row is not None:
        (x0, x1), _ = view.view_box.viewRange()
        at = view.item.deviceTransform_().map(QPointF((x0 + x1) / 2, row))
        point = QPoint(round(at.x()), round(at.y()))
    view.menu_requested.emit(ids, viewport.mapToGlobal(point))
    return True


def menu_keys(view) -> None:
    """The Menu key and Shift+F10 on the chart open the selection's activity menu."""
    for keys in (Qt.Key.Key_Menu, "Shift+F10"):
        shortcut = QShortcut(QKeySequence(keys), view.plot, context=Qt.ShortcutContext.WidgetWithChildrenShortcut)
        shortcut.activated.connect(partial(menu_for_selection, view))
