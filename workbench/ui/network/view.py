"""The Network view: the plan as an activity-on-node diagram.

Geometry comes from ``workbench.figures.network_layout`` (no scheduling math here); one
batched item paints it. Click selects (``session.select``), hovering a node marks its
predecessors and successors, the find field jumps to an id or a name.
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QPoint, QPointF, QRectF, Qt, Signal
from PySide6.QtGui import QKeySequence, QShortcut
from PySide6.QtWidgets import (QCheckBox, QFileDialog, QHBoxLayout, QLabel, QLineEdit,
                               QMessageBox, QPushButton, QVBoxLayout, QWidget)

from workbench.core.errors import PlanError
from workbench.figures import network_style as ns
from workbench.figures.network_labels import column_dates, find_nodes, node_texts, node_tooltip
from workbench.figures.network_layout import LayoutOptions, _driving_links, layout_plan, structure_key
from workbench.figures.network_nav import step

from workbench.ui.network.export import print_pages, save_picture
from workbench.ui.network.item import NetworkItem
from workbench.ui.session import refresh_when_shown

READABLE_SCALE = 0.9     # zoom used when jumping to a found node from far out


class NetworkView(QWidget):
    menu_requested = Signal(list, QPoint)    # right-click on a box: the activities, where (screen)

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.layout_result = None
        self._layout_key = None
        self.options = LayoutOptions()
        self._matches: list[str] = []
        self._match_at = -1
        self._auto_fit = True      # fitted to the view until the user zooms or pans
        self._build()
        self.viewbox.sigRangeChangedManually.connect(self._user_moved)
        refresh_when_shown(self, self.refresh, session.schedule_changed)   # hidden: catch up when shown
        session.selection_changed.connect(self._follow_selection)
        self.when_shown.call(self.refresh)

    # --- widgets ---------------------------------------------------------
    def _build(self) -> None:
        self._build_toolbar()
        self._build_canvas()
        box = QVBoxLayout(self)
        box.setContentsMargins(4, 4, 4, 4)
        box.addWidget(self.toolbar)
        box.addWidget(self.message)
        box.addWidget(self.graphics, 1)

    def _build_toolbar(self) -> None:
        self.find_field = QLineEdit(placeholderText="Find id or name \u21b5")
        self.find_field.setClearButtonEnabled(True)
        self.find_field.returnPressed.connect(self.find_next)
        self.fit_button = QPushButton("Fit")
        self.fit_button.clicked.connect(self.fit)
        self.time_box = QCheckBox("Columns by early start")
        self.time_box.toggled.connect(self._options_changed)
        self.band_box = QCheckBox("Group bands")
        self.band_box.toggled.connect(self._options_changed)
        export = QPushButton("Export\u2026")
        export.clicked.connect(self.export_dialog)
        printing = QPushButton("Print\u2026")
        printing.clicked.connect(self.print_preview)
        self.toolbar = QWidget()
        bar = QHBoxLayout(self.toolbar)
        bar.setContentsMargins(0, 0, 0, 0)
        for w in (self.find_field, self.fit_button, self.time_box, self.band_box, export, printing):
            bar.addWidget(w)
        bar.setStretch(0, 1)

    def _build_canvas(self) -> None:
        self.message = QLabel(alignment=Qt.AlignCenter, wordWrap=True)
        self.message.hide()
        self.graphics = pg.GraphicsView(background="w")
        self.viewbox = pg.ViewBox(invertY=True, lockAspect=True, enableMenu=False)
        self.graphics.setCentralItem(self.viewbox)
        self.item = NetworkItem()
        self.viewbox.addItem(self.item)
        self.item.node_clicked.connect(self._clicked)
        self.item.hovered.connect(self._hovered)
        self.item.node_menu.connect(self._node_menu)
        for key, direction in ((Qt.Key_Left, "left"), (Qt.Key_Right, "right"), (Qt.Key_Up, "up"), (Qt.Key_Down, "down")):
            shortcut = QShortcut(QKeySequence(key), self.graphics, context=Qt.WidgetWithChildrenShortcut)
            shortcut.activated.connect(lambda d=direction: self.move_selection(d))
        for keys in (Qt.Key_Menu, "Shift+F10"):        # the activity menu from the keyboard
            shortcut = QShortcut(QKeySequence(keys), self.graphics, context=Qt.WidgetWithChildrenShortcut)
            shortcut.activated.connect(self.menu_for_selection)

    # --- content ---------------------------------------------------------
    def refresh(self) -> None:
        """Redraw from the session's plan and analysis (on every schedule change)."""
        plan, analysis = self.session.plan, self.session.analysis
        try:
            result = self._layout(plan, analysis)
        except PlanError as exc:
            self._show_message(f"The network cannot be drawn: {exc}")
            return
        first = self.layout_result is None or not self.layout_result.nodes
        if not first and not {n.id for n in self.layout_result.nodes} & set(plan.ids()):
            self._auto_fit = True          # another plan altogether: fitted, not at the old scale
        self.layout_result = result
        self.item.painter.column_labels = column_dates(result, analysis) if self.options.time_scaled else []
        self.item.set_content(result, node_texts(plan, analysis), analysis)
        self._mark_selection(self.session.selected())
        note = getattr(self.session, "analysis_error", None) if analysis is None else None
        if not result.nodes:
            self._show_message("No activities yet: the network appears here as soon as the plan has some.")
        else:
            self._show_message(f"Not scheduled: {note}" if note else "")
        if (first or self._auto_fit) and result.nodes:
            self.fit()

    def _layout(self, plan, analysis):
        """The plan laid out. An edit that keeps the drawing's structure (a duration, an
        estimate, a name) reuses the last layout with its critical marks brought up to date."""
        key = None
        if analysis is not None and not self.options.time_scaled:
            key = (structure_key(plan, self.options), plan.ids(), list(plan.links))
            if key == self._layout_key and self.layout_result is not None:
                return _reflagged(self.layout_result, plan, analysis.schedule)
        result = layout_plan(plan, analysis, self.options)
        self._layout_key = key
        return result

    def _show_message(self, text: str) -> None:
        self.message.setText(text)
        self.message.setVisible(bool(text))

    def _options_changed(self) -> None:
        self.options = LayoutOptions(time_scaled=self.time_box.isChecked(), bands=self.band_box.isChecked())
        self.refresh()
        self.fit()

    def set_present(self, on: bool) -> None:
        """Present mode: no controls, heavier lines and larger type, whole network in view."""
        self.toolbar.setVisible(not on)
        self.item.painter.set_weights(ns.PRESENT if on else ns.WEIGHTS, 4.0 if on else 2.5)
        self.item.update()
        self.fit()

    def fit(self) -> None:
        self.viewbox.autoRange(padding=0.02)

    def _user_moved(self, *_) -> None:
        self._auto_fit = False

    def resizeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        """A first show (a dock opened at its size) or a resize before the user has zoomed
        keeps the whole network in view, so a small plan is never drawn tiny."""
        super().resizeEvent(event)
        if self._auto_fit and self.layout_result is not None and self.layout_result.nodes:
            self.fit()

    # --- selection, hover, find -------------------------------------------
    def _clicked(self, row: int, adding: bool = False) -> None:
        """Click selects one node; Ctrl/Shift-click adds or removes it; empty space clears."""
        if self.layout_result is None:
            return
        if row < 0:
            self.session.select([] if not adding else self.session.selected())
            return
        act_id = self.layout_result.nodes[row].id
        if not adding:
            self.session.select([act_id])
            return
        chosen = self.session.selected()
        self.session.select([i for i in chosen if i != act_id] if act_id in chosen else chosen + [act_id])

    def _node_menu(self, row: int, screen_pos: QPoint) -> None:
        """Right-click on a box: it joins (or becomes) the selection and the window offers
        its menu (``menu_requested``)."""
        if self.layout_result is None or row < 0:
            return
        act_id = self.layout_result.nodes[row].id
        if act_id not in self.session.selected():
            self.session.select([act_id])
        self.menu_requested.emit(self.session.selected(), screen_pos)

    def menu_for_selection(self) -> None:
        """The activity menu of the selection, at its first box (or the view's corner)."""
        ids = self.session.selected()
        if not ids or self.layout_result is None:
            return
        row = self.layout_result.index_of(ids[0])
        point = QPoint(8, 8)
        if row >= 0:
            x, y, w, h = map(float, self.layout_result.boxes[row])
            at = self.graphics.mapFromScene(self.viewbox.mapViewToScene(QPointF(x + w / 2, y + h / 2)))
            point = at if self.graphics.rect().contains(at) else point
        self.menu_requested.emit(ids, self.graphics.mapToGlobal(point))

    def _hovered(self, row: int) -> None:
        plan = self.session.plan
        tip = node_tooltip(plan, self.session.analysis, row) if 0 <= row < len(plan) else ""
        self.graphics.setToolTip(tip)

    def _mark_selection(self, ids) -> set[int]:
        rows = {self.layout_result.index_of(i) for i in ids} - {-1}
        self.item.set_selected(rows)
        return rows

    def _follow_selection(self, ids) -> None:
        if self.layout_result is None or self.when_shown.dirty:   # the pending refresh marks it
            return
        rows = self._mark_selection(ids)
        if len(rows) == 1:
            self._bring_into_view(rows.pop())

    def _bring_into_view(self, row: int) -> None:
        """Pan (same zoom) so a node chosen elsewhere is on screen."""
        x, y, w, h = map(float, self.layout_result.boxes[row])
        view = self.viewbox.viewRect()
        if view.contains(QRectF(x, y, w, h)) or view.width() <= 0:
            return
        self.viewbox.translateBy(t=(x + w / 2 - view.center().x(), y + h / 2 - view.center().y()))

    def move_selection(self, direction: str) -> None:
        """Arrow keys: select a successor, a predecessor, or the node above/below."""
        if self.layout_result is None or not self.layout_result.nodes:
            return
        chosen = self.session.selected()
        row = self.layout_result.index_of(chosen[0]) if chosen else -1
        self.session.select([self.layout_result.nodes[step(self.layout_result, row, direction)].id])

    def find_next(self) -> None:
        """Select the next node whose id or name matches the find field, and show it."""
        matches = find_nodes(self.session.plan, self.find_field.text())
        if matches != self._matches:
            self._matches, self._match_at = matches, -1
        if not matches:
            self.find_field.setStyleSheet("background: #FFE0E0;")
            return
        self.find_field.setStyleSheet("")
        self._match_at = (self._match_at + 1) % len(matches)
        act_id = matches[self._match_at]
        self.session.select([act_id])
        self.show_node(act_id)

    def show_node(self, act_id: str) -> None:
        """Centre the view on a node, zooming in far enough to read it."""
        row = self.layout_result.index_of(act_id) if self.layout_result else -1
        if row < 0:
            return
        x, y, w, h = map(float, self.layout_result.boxes[row])
        view = self.viewbox.viewRect()
        px = self.viewbox.width() or 1.0
        span_w = min(view.width(), px / READABLE_SCALE)
        span_h = view.height() * span_w / max(view.width(), 1e-9)
        self.viewbox.setRange(QRectF(x + w / 2 - span_w / 2, y + h / 2 - span_h / 2, span_w, span_h), padding=0)

    # --- export and print -------------------------------------------------
    def export_picture(self, path: str) -> None:
        save_picture(self.item.painter, path)

    def export_dialog(self) -> None:
        path, _ = QFileDialog.getSaveFileName(self, "Export network", self.session.in_folder("network.png"), "PNG image (*.png);;SVG drawing (*.svg)")
        if not path:
            return
        try:
            self.export_picture(path)
        except (OSError, ValueError) as exc:
            QMessageBox.warning(self, "Export network", str(exc))

    def print_preview(self) -> None:
        self.make_print_preview().exec()

    def make_print_preview(self):
        """A print preview (landscape) whose pages come from the one paint routine."""
        from PySide6.QtGui import QPageLayout
        from PySide6.QtPrintSupport import QPrintPreviewDialog, QPrinter

        printer = QPrinter(QPrinter.HighResolution)
        printer.setPageOrientation(QPageLayout.Landscape)
        self._printer = printer          # the dialog does not own it: keep it alive
        dialog = QPrintPreviewDialog(printer, self)
        dialog.setWindowTitle("Print network")
        dialog.paintRequested.connect(lambda pr: print_pages(self.item.painter, pr))
        return dialog


def _reflagged(layout, plan, schedule):
    """``layout`` with the critical flags of ``schedule`` (same structure, new durations)."""
    crit = np.asarray(schedule.critical, dtype=bool).tolist()
    driving = _driving_links(plan, schedule).tolist()
    nodes = [n if n.critical == c else replace(n, critical=c) for n, c in zip(layout.nodes, crit)]
    links = [k if k.critical == d else replace(k, critical=d) for k, d in zip(layout.links, driving)]
    return replace(layout, nodes=nodes, links=links)
