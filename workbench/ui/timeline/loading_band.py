"""The loading band under the Timeline: each resource's units in use against its units
available, one lane per resource (small multiples, each at its own scale), on the
Timeline's date axis — its x range is linked to the Timeline's, so the two pan and zoom
together. Shown only when the plan has resources; the Timeline's "Loading" button hides it.
The numbers come from ``core.loading``, the geometry from ``figures.loading``."""

from __future__ import annotations

import pyqtgraph as pg
from PySide6.QtCore import QSettings, Qt
from PySide6.QtGui import QFontMetrics
from PySide6.QtWidgets import QLabel, QSizePolicy, QVBoxLayout, QWidget

from workbench.core.loading import plan_loading
from workbench.figures import style
from workbench.figures.loading import loading_figure
from workbench.ui.loading_plot import LEGEND, add_loading

LANE_FILL = 0.78           # share of a lane the chart takes (the rest keeps lanes apart)
SHOWN_KEY = "timeline/loading_band"


def band_wanted() -> bool:
    """Whether the user last left the band on (on until turned off)."""
    return str(QSettings().value(SHOWN_KEY, "true")).lower() in ("true", "1")


def remember_band(on: bool) -> None:
    QSettings().setValue(SHOWN_KEY, "true" if on else "false")


class LoadingBand(QWidget):
    """``LoadingBand(timeline_view_box)``: lanes of loading, x linked to the given view box."""

    def __init__(self, x_view, on_user_zoom=None, parent=None):
        super().__init__(parent)
        self.loads, self.figures, self.items, self._ticks = [], [], [], []
        self.legend = QLabel(LEGEND)
        self.legend.setStyleSheet(f"color: {style.TEXT}; padding: 2px 4px;")
        self.legend.setSizePolicy(QSizePolicy.Policy.Preferred, QSizePolicy.Policy.Fixed)
        self.setSizePolicy(QSizePolicy.Policy.Preferred, QSizePolicy.Policy.Fixed)
        self.plot = pg.PlotWidget(background=style.BACKGROUND)
        pi = self.plot.getPlotItem()
        pi.hideButtons()
        pi.setMenuEnabled(False)
        pi.hideAxis("bottom")
        self.axis = pi.getAxis("left")
        self.axis.setPen(pg.mkPen(style.TEXT))
        self.axis.setTextPen(pg.mkPen(style.TEXT))
        self.axis.setStyle(textFillLimits=[(0, 100.0)])   # every lane keeps its name, however short
        self.view_box = pi.getViewBox()
        self.view_box.setMouseEnabled(x=True, y=False)
        self.view_box.setXLink(x_view)
        if on_user_zoom is not None:           # the Timeline stops refitting, as after its own zoom
            self.view_box.sigRangeChangedManually.connect(on_user_zoom)
        self.hide()
        self.plot.setFocusPolicy(Qt.FocusPolicy.NoFocus)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.setSpacing(0)
        layout.addWidget(self.legend)
        layout.addWidget(self.plot)

    def set_font(self, font) -> None:
        self.axis.setStyle(tickFont=font)
        self.legend.setFont(font)
        self._apply_ticks()
        self._fit_height()

    def set_label_width(self, width: float) -> None:
        """As wide as the Timeline's label column, so both charts start at the same x."""
        self.axis.setWidth(int(width))
        self._label_width = int(width)
        self._apply_ticks()

    def _apply_ticks(self) -> None:
        """Lane names, shortened with '…' to the label column (a name wider than the axis
        would not be drawn at all)."""
        font = self.axis.style.get("tickFont") or self.font()
        metrics = QFontMetrics(font)
        room = max(getattr(self, "_label_width", 120) - 16, 30)
        ticks = [(y, metrics.elidedText(text, Qt.TextElideMode.ElideMiddle, room)) for y, text in self._ticks]
        self.axis.setTicks([ticks, []])

    def update_for(self, analysis, allowed: bool = True, toggle=None) -> bool:
        """Draw and show the band when the plan has resources, the user wants it and the
        mode ``allowed`` it (not in Present); ``toggle`` (the toolbar's action) is offered
        only for a plan with resources. Returns whether the plan has resources."""
        has = bool(analysis is not None and analysis.plan.resources)
        wanted = band_wanted()
        if has and wanted and allowed:
            self.set_analysis(analysis)
        self.setVisible(has and wanted and allowed)
        if toggle is not None:
            toggle.setVisible(has)
            toggle.setChecked(wanted)
        return has

    def set_analysis(self, analysis) -> bool:
        """Redraw for ``analysis``; False (and nothing drawn) when the plan has no resources."""
        self.plot.clear()
        self.items = []
        if analysis is None or not analysis.plan.resources:
            self.loads, self.figures = [], []
            return False
        finish = float(analysis.schedule.finish)
        self.loads = plan_loading(analysis)
        self.figures = [loading_figure(load, until=finish) for load in self.loads]
        n = len(self.figures)
        ticks = []
        for k, fig in enumerate(self.figures):
            base = n - 1 - k + 0.5 * (1 - LANE_FILL)
            self.items.append(add_loading(self.plot, fig, base, LANE_FILL, line=1.2))
            ticks.append((n - 1 - k + 0.5, self._lane_label(fig)))
        self._ticks = ticks
        self._apply_ticks()
        self.view_box.setYRange(-0.1, n, padding=0)
        self._fit_height()
        return True

    @staticmethod
    def _lane_label(fig) -> str:
        top = float(fig.available.max()) if fig.available.size else 0.0
        mark = "Over: " if fig.over else ""
        return f"{mark}{fig.name} ({top:g})"

    def fit_to(self, view_height: int) -> None:
        """The band takes at most about a third of the Timeline's height (the bars come first)."""
        self._room = int(0.34 * view_height)
        self._fit_height()

    def _fit_height(self) -> None:
        n = max(len(self.figures), 1)
        line = self.legend.fontMetrics().height()
        pitch = max(36, int(2.6 * line))
        room = getattr(self, "_room", None)
        if room is not None:            # lanes shrink to fit, never below one line of label
            pitch = max(int(1.25 * line), min(pitch, (room - self.legend.sizeHint().height() - 12) // n))
        self.plot.setFixedHeight(n * pitch + 12)
