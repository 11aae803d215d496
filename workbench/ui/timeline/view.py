"""The Timeline view: a Gantt chart that shows float at a glance.

Bars from early start to early finish (critical in vermillion with a heavy dark edge,
other work in blue), the slack line from early to late finish ending in an upright tick,
milestones as diamonds, deadline / status / project-start lines, P10–P90 whiskers when a
simulation has run. Geometry comes from ``workbench.figures.timeline``; this file only
draws it and turns gestures into session calls and core commands.
"""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import QPoint, Qt, Signal
from PySide6.QtGui import QAction, QFont
from PySide6.QtWidgets import QToolBar, QToolTip, QVBoxLayout, QWidget

from workbench.figures import style
from workbench.figures.timeline import critical_ids, timeline_geometry
from workbench.ui.session import refresh_when_shown
from workbench.ui.timeline.bar_drag import BarDrag
from workbench.ui.timeline.reveal import menu_keys
from workbench.ui.timeline.date_axis import TimelineDateAxis
from workbench.ui.timeline.item import TimelineItem, nonworking_finder
from workbench.ui.timeline.lines import TimelineLines
from workbench.ui.timeline.navigation import TimelineNavigation
from workbench.ui.timeline.loading_band import LoadingBand, remember_band
from workbench.ui.timeline.present import PRESENT_HINT, fold_all, leave_page, plot_resized, stack_finish_labels
from workbench.ui.timeline.row_axis import FLOOR_PX, TimelineRowAxis
from workbench.ui.timeline.tooltip import tooltip_text


class TimelineView(TimelineNavigation, QWidget):
    """``TimelineView(session)``: the Timeline of the session's plan."""

    duration_dragging = Signal(str, float)   # activity id, most likely value (continuous)
    duration_dragged = Signal(str, float)    # once, on release (after the edit is pushed)
    menu_requested = Signal(list, QPoint)    # right-click on a bar: the activities, where (screen)

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.collapsed: set[str] = set()
        self.critical_only = False
        self.late_bars = False
        self.connectors = False
        self._weights = style.SCREEN
        self.present_hint = ""     # keys shown on the Present slide
        self.row_page = 0          # Present: the page of rows shown when they do not all fit
        self.page_first = 0        # the first row of that page (0 outside Present)
        self.geometry = None
        self._auto_fit = True      # refit on resize until the user zooms or pans
        self._build()
        # while hidden (a dock behind a tab, a Present slide not reached) redraws wait
        refresh_when_shown(self, self._catch_up, session.schedule_changed, session.simulation_changed)
        session.selection_changed.connect(self._follow_selection)
        self.when_shown.call(self._catch_up)

    # --- construction ---------------------------------------------------------
    def _build(self) -> None:
        self.row_axis = TimelineRowAxis()
        self.date_axis = TimelineDateAxis("bottom")
        self.plot = pg.PlotWidget(background=style.BACKGROUND,
                                  axisItems={"left": self.row_axis, "bottom": self.date_axis})
        self.plot.setFocusPolicy(Qt.FocusPolicy.StrongFocus)
        self.plot.installEventFilter(self)
        self.setFocusProxy(self.plot)
        pi = self.plot.getPlotItem()
        pi.hideButtons()
        pi.setMenuEnabled(False)
        self.view_box = pi.getViewBox()
        self.view_box.invertY(True)
        self.view_box.sigRangeChangedManually.connect(self._stop_auto_fit)
        for name in ("left", "bottom"):
            pi.getAxis(name).setPen(pg.mkPen(style.TEXT))
            pi.getAxis(name).setTextPen(pg.mkPen(style.TEXT))
        self.item = TimelineItem(self._weights)
        self.item.on_click, self.item.on_drag, self.item.on_hover = self._click, self._drag_event, self._hover
        self.item.on_menu = self._menu
        pi.addItem(self.item)
        self.reference = TimelineLines(self.plot)
        self._lines = self.reference.lines      # name → labelled line (tests, Present)
        self.view_box.sigResized.connect(lambda *_: plot_resized(self))   # labels apart, a page refitted
        self.view_box.sigXRangeChanged.connect(lambda *_: stack_finish_labels(self))
        self._message = pg.TextItem("", color=style.TEXT, anchor=(0, 0))
        self._message.setVisible(False)
        pi.addItem(self._message, ignoreBounds=True)
        self.bar_drag = BarDrag(self)
        menu_keys(self)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        self.toolbar = self._toolbar()
        layout.addWidget(self.toolbar)
        layout.addWidget(self.plot, 1)
        self.band = LoadingBand(self.view_box, self._stop_auto_fit)   # crews' loading, same date axis
        layout.addWidget(self.band)
        self._apply_weights()

    def _toolbar(self) -> QToolBar:
        bar = QToolBar("Timeline", self)
        self.actions_by_name = {}
        for name, text, slot, checkable in (
                ("fit", "Fit all", lambda: self.fit_all(), False),
                ("fit_rows", "Every row", self.fit_every_row, False),
                ("critical", "Critical path", self.show_critical_path, True),
                ("late", "Late dates", self.set_late_bars, True),
                ("links", "Links", self.set_connectors, True),
                ("loading", "Loading", self.set_loading_band, True),
                ("png", "Export PNG\u2026", lambda: self._export_dialog("png"), False),
                ("svg", "Export SVG\u2026", lambda: self._export_dialog("svg"), False),
                ("print", "Print\u2026", self.print_preview, False)):
            action = QAction(text, self, checkable=checkable)
            action.triggered.connect(slot)
            bar.addAction(action)
            self.actions_by_name[name] = action
        return bar

    # --- session → drawing -------------------------------------------------------
    def _catch_up(self) -> None:
        self.refresh()
        if self._auto_fit:
            self.fit_all(rows_to_fit=True)

    def refresh(self) -> None:
        """Rebuild the geometry from the session's latest analysis (and simulation)."""
        analysis = self.session.analysis
        if analysis is None:
            self.geometry = None
            self.item.set_geometry(None)
            self.row_axis.set_geometry(None)
            self.band.hide()
            self._show_message("The plan cannot be scheduled:\n" + (self.session.analysis_error or "no schedule yet"))
            return
        only = critical_ids(analysis) if self.critical_only else None
        self.geometry = timeline_geometry(analysis, self.session.simulation, collapsed=self.collapsed,
                                          late_bars=self.late_bars, connectors=self.connectors, only=only,
                                          variance=self.session.variance())
        self._message.setVisible(False)
        if not self.geometry.n_rows:
            self._show_message("No activities yet: add some in the Activities table." if only is None
                               else "No critical activities to show.")
        self.date_axis.set_calendar(analysis.calendar)
        self.item.set_nonworking(nonworking_finder(analysis.calendar))
        self.item.set_geometry(self.geometry)
        self.row_axis.set_geometry(self.geometry)
        self._set_limits()
        self.set_loading_band()
        self._fit_label_column()
        self._update_lines()
        self._follow_selection(self.session.selected())

    def set_loading_band(self, on: bool | None = None) -> None:
        """Show or hide the resource loading band (remembered); None: as last chosen."""
        if on is not None:
            remember_band(bool(on))
        self.band.update_for(self.session.analysis, self._weights is not style.PRESENT, self.actions_by_name["loading"])

    def _set_limits(self) -> None:
        """Keep zoom and pan near the plan: a little beyond its dates and rows."""
        lo, hi = self.geometry.x_range
        n = max(self.geometry.n_rows, 1)
        span = hi - lo
        self.view_box.setLimits(xMin=lo - span, xMax=hi + span, minXRange=0.5,
                                yMin=-0.5 - max(3.0, 0.05 * n), yMax=n + 2.0, minYRange=2.0)

    def _fit_label_column(self) -> None:
        """Label column as wide as the longest labels need, at most a third of the view."""
        limit = max(140.0, 0.32 * max(self.width(), 600))
        self.row_axis.setWidth(self.row_axis.preferred_width(self._font(), limit))
        self.band.set_label_width(self.row_axis.preferred_width(self._font(), limit))

    def resizeEvent(self, event) -> None:
        super().resizeEvent(event)
        self.band.fit_to(self.height())
        if self.geometry is not None:
            self._fit_label_column()
            if self._auto_fit:
                self.fit_all(rows_to_fit=True)
            stack_finish_labels(self)

    def _stop_auto_fit(self, *args) -> None:
        self._auto_fit = False
        leave_page(self)

    def _font(self, bold: bool = False) -> QFont:
        """Type sized in pixels (points at 96 dpi), so that print, PDF and SVG scale it
        together with the chart instead of re-resolving points on their own resolution."""
        font = QFont()
        font.setPixelSize(round(self._weights.label_font_size * 96.0 / 72.0))
        font.setBold(bold)
        return font

    def _show_message(self, text: str) -> None:
        self._message.setText(text)
        self._message.setPos(0, 0)
        self._message.setVisible(True)
        self._update_lines()

    def _update_lines(self) -> None:
        analysis = self.session.analysis
        geo = self.geometry if analysis is not None else None
        self.reference.update(geo, None if analysis is None else analysis.calendar,
                              self._weights.reference_line, self._font(bold=True))
        stack_finish_labels(self)

    def _row_at(self, pos) -> int | None:
        """The row under ``pos`` (data units); None off the rows and above a Present page."""
        row = None if self.geometry is None else self.geometry.row_at(pos.y())
        return None if row is None or row < self.page_first else row

    # --- selection -----------------------------------------------------------------
    def _follow_selection(self, ids) -> None:
        geo = self.geometry
        rows = [] if geo is None else [geo.row_of[i] for i in ids if i in geo.row_of]
        self.item.set_selection(rows)

    def _click(self, pos, modifiers) -> None:
        geo = self.geometry
        row = self._row_at(pos)
        if row is None:
            self.session.select([])
            return
        if geo.kinds[row] == "group":
            self.toggle_group(geo.keys[row])
            return
        act_id = geo.keys[row]
        if modifiers & Qt.KeyboardModifier.ControlModifier:
            chosen = self.session.selected()
            ids = [i for i in chosen if i != act_id] if act_id in chosen else chosen + [act_id]
            self.session.select(ids)
        else:
            self.session.select([act_id])

    def _menu(self, pos, screen_pos) -> None:
        """Right-click on an activity's row: it joins (or becomes) the selection and the
        window offers its menu (``menu_requested``)."""
        geo = self.geometry
        row = self._row_at(pos)
        if row is None or geo.kinds[row] == "group":
            return
        act_id = geo.keys[row]
        if act_id not in self.session.selected():
            self.session.select([act_id])
        self.menu_requested.emit(self.session.selected(), screen_pos)

    def show_activity(self, act_id: str) -> None:
        """Scroll (same zoom) so the activity's row is on screen, opening its group."""
        from workbench.ui.timeline.reveal import show_activity
        show_activity(self, act_id)

    def toggle_group(self, name: str) -> None:
        self.collapsed ^= {name}
        self.refresh()
        if self.present_hint:      # a slide: the rows (and their pages) are fitted again
            self.fit_all()

    # --- hover (see bar_drag.py for the grab zone) ------------------------------------
    def _hover(self, pos, screen_pos) -> None:
        geo = self.geometry
        if self.bar_drag.active is not None:
            return                   # no hover text over a drag in progress
        row = None if pos is None else self._row_at(pos)
        if row is None or geo.kinds[row] == "group":
            self.item.setCursor(Qt.CursorShape.ArrowCursor)
            self.item.setToolTip("")
            QToolTip.hideText()
            return
        near_end = self.bar_drag.near_end(row, pos.x())
        self.item.setCursor(Qt.CursorShape.SizeHorCursor if near_end else Qt.CursorShape.ArrowCursor)
        text = tooltip_text(self.session.analysis, self.session.simulation, geo.keys[row])
        if screen_pos is not None:
            QToolTip.showText(screen_pos, text, self.plot)
        # The scene answers Qt's tooltip event (sent once the pointer rests) from the item
        # under the pointer: with the text on the item it keeps the tooltip, not hides it.
        self.item.setToolTip(text)

    # --- duration drag (see bar_drag.py) ---------------------------------------------
    def _drag_event(self, phase: str, pos) -> bool:
        """'start' (return True to take the drag), 'move', 'finish' with the pointer in data units."""
        if phase == "start":
            return self._drag_start(pos)
        drag = self.bar_drag
        if drag.active is None:
            return False
        if phase == "move":
            self.duration_dragging.emit(drag.active[0], drag.move(pos.x()))
            return True
        done = drag.finish(pos.x())
        if done is not None:
            self.duration_dragged.emit(*done)
        return True

    def cancel_drag(self) -> None:
        """Forget a duration drag in progress (Escape): the plan stays as it was."""
        self.bar_drag.cancel()

    def _drag_start(self, pos) -> bool:
        geo = self.geometry
        row = self._row_at(pos)
        if row is None or geo.index[row] < 0 or not self.bar_drag.near_end(row, pos.x()):
            return False
        self.bar_drag.start(geo.keys[row], row)
        self.item.setToolTip("")
        QToolTip.hideText()          # the hover text would cover the drag note and the bars
        return True

    # --- zoom, pan, filters -------------------------------------------------------------
    def show_critical_path(self, on: bool = True) -> None:
        """Show only the critical rows (or all rows again) and fit them."""
        self.critical_only = bool(on)
        self.actions_by_name["critical"].setChecked(self.critical_only)
        self.refresh()
        self.fit_all()

    def set_late_bars(self, on: bool) -> None:
        self.late_bars = bool(on)
        self.refresh()

    def set_connectors(self, on: bool) -> None:
        self.connectors = bool(on)
        self.refresh()

    # --- Present mode and output -------------------------------------------------------------
    def set_present(self, on: bool) -> None:
        """Bigger type and heavier lines for a projector; groups folded so every row fits
        (keys G, C and the row pages, see ``timeline.present``)."""
        self._weights = style.PRESENT if on else style.SCREEN
        self.present_hint = PRESENT_HINT if on else ""
        self._apply_weights()
        if on:
            fold_all(self, True)

    @property
    def present_caution(self) -> str:
        """On a Present slide with the simulated finish lines (P10–P90) drawn, the odds
        caution goes under the slide, as on the Odds and Summary slides."""
        if not self.present_hint or self.session.simulation is None:
            return ""
        from workbench.figures.headline import CAUTION
        return CAUTION

    def _apply_weights(self) -> None:
        font = self._font()
        self.row_axis.floor_px = font.pixelSize() if self._weights is style.PRESENT else FLOOR_PX
        self.row_axis.set_font(font)
        self._fit_label_column()
        self.date_axis.setStyle(tickFont=font)
        self.item.set_weights(self._weights)
        self.bar_drag.readout.set_font_px(1.15 * self._font().pixelSize())
        self.band.set_font(font)
        if self.geometry is not None:
            self.set_loading_band()
        if hasattr(self, "toolbar"):
            self.toolbar.setVisible(self._weights is not style.PRESENT)
        self.reference.clear()
        self._update_lines()

    def drop_paint_caches(self) -> None:
        """Forget every cached drawing: the next paint starts from scratch (benchmark)."""
        for part in (self.item, self.row_axis, self.date_axis):
            part.drop_cache()

    def export_png(self, path, size=None) -> None:
        from workbench.ui.timeline.output import export_png
        export_png(self, path, size)

    def export_svg(self, path) -> None:
        from workbench.ui.timeline.output import export_svg
        export_svg(self, path)

    def print_preview(self) -> None:
        from workbench.ui.timeline.output import print_preview
        print_preview(self)

    def _export_dialog(self, kind: str) -> None:
        from workbench.ui.timeline.output import ask_and_export
        ask_and_export(self, kind)
