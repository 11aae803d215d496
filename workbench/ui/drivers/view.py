"""The Drivers view: which activities drive the finish, from the latest simulation.

Criticality index and sensitivity (a tornado) as sorted bar charts, the top N shown and
the rest folded into one row; a click selects that activity in every view."""

from __future__ import annotations

from PySide6.QtWidgets import QHBoxLayout, QLabel, QSpinBox, QStackedLayout, QTabBar, QVBoxLayout, QWidget

from workbench.figures import drivers as fdr
from workbench.ui.drivers.chart import DriversChart
from workbench.ui.session import WhenShown, take_simulation
from workbench.ui.wrap_fit import WrapHeight

PLACEHOLDER = "No simulation yet. Run a simulation in the Odds view to see what drives the finish."
LEGEND = ("activities; the rest fold into one row. Vermillion with a heavy edge: on the PERT critical path. "
          "Click a bar to select the activity.")
WIDE = 640     # px: narrower, the two charts are shown one at a time (each needs ~300 to read)
STALE_NOTE = "Stale: the plan changed since this simulation (shown in grey). Run it again in the Odds view."


class DriversView(QWidget):
    """Criticality and sensitivity rankings for the session's latest simulation."""

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.result = None
        self.stale = False
        self.narrow = False
        self.when_shown = WhenShown(self)   # while hidden, redraws wait until it is shown
        self._build()
        session.simulation_changed.connect(self._on_simulation_changed)
        session.selection_changed.connect(self._on_selection_changed)
        self._on_simulation_changed()

    def _build(self) -> None:
        self.placeholder = QLabel(PLACEHOLDER)
        self.placeholder.setWordWrap(True)
        self.placeholder.setStyleSheet("font-size: 16pt; color: #555555; padding: 40px;")
        self.criticality = DriversChart("Criticality index",
                                        "share of iterations critical", signed=False)
        self.sensitivity = DriversChart("Sensitivity",
                                        "correlation with the finish", signed=True)
        for chart in (self.criticality, self.sensitivity):
            chart.activity_clicked.connect(lambda act_id: self.session.select([act_id]))
        self.top = QSpinBox()
        self.top.setRange(3, 100)
        self.top.setValue(12)
        self.top.valueChanged.connect(self._redraw)
        self.note = QLabel()
        self.note.setWordWrap(True)
        self.stack = QStackedLayout()
        self.stack.addWidget(self.placeholder)
        self.stack.addWidget(self._charts())
        outer = QVBoxLayout(self)
        outer.addLayout(self.stack)
        self.wraps = WrapHeight((self.placeholder, self.legend, self.note), self)

    def hasHeightForWidth(self) -> bool:  # noqa: N802 (Qt override)
        # the wrapped labels keep their own least heights (WrapHeight): in a dock the view
        # gets the dock's height, so the placeholder shows in the middle of what is seen
        return False

    def _charts(self) -> QWidget:
        page = QWidget()
        head = QHBoxLayout()
        head.addWidget(QLabel("Show the top"))
        head.addWidget(self.top)
        self.legend = QLabel(LEGEND)
        self.legend.setWordWrap(True)          # wraps at the dock's width (a 1024×768 projector)
        head.addWidget(self.legend, 1)
        self.tabs = QTabBar()                  # one chart at a time in a narrow dock
        for chart in (self.criticality, self.sensitivity):
            self.tabs.addTab(chart.chart_title)
        self.tabs.setExpanding(False)
        self.tabs.setVisible(False)
        self.tabs.currentChanged.connect(self._show_chart)
        charts = QHBoxLayout()
        charts.addWidget(self.criticality, 1)
        charts.addWidget(self.sensitivity, 1)
        lay = QVBoxLayout(page)
        lay.addLayout(head)
        lay.addWidget(self.note)
        lay.addWidget(self.tabs)
        lay.addLayout(charts, 1)
        return page

    def resizeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        narrow = event.size().width() < WIDE
        if narrow != self.narrow:
            self.narrow = narrow        # True while the charts are shown one at a time
            self.tabs.setVisible(narrow)
            self._show_chart(self.tabs.currentIndex())
        super().resizeEvent(event)

    def _show_chart(self, index: int) -> None:
        for i, chart in enumerate((self.criticality, self.sensitivity)):
            chart.setVisible(not self.narrow or i == index)

    def _on_simulation_changed(self) -> None:
        take_simulation(self)
        self.when_shown.call(self._redraw)

    def _redraw(self) -> None:
        if self.result is None:
            self.stack.setCurrentIndex(0)
            return
        self.stack.setCurrentIndex(1)
        plan, top = self.session.plan, self.top.value()
        analysis = self.session.analysis
        critical = set(analysis.pert.path) if analysis is not None else set()
        self.criticality.set_bars(fdr.criticality_bars(self.result, plan, top), self.stale, critical)
        self.sensitivity.set_bars(fdr.sensitivity_bars(self.result, plan, top), self.stale, critical)
        self.note.setText(STALE_NOTE if self.stale else self._summary())
        self.note.setStyleSheet("color: #8A3B00; font-weight: bold;" if self.stale else "")
        self._on_selection_changed(self.session.selected())

    def _summary(self) -> str:
        r = self.result
        return (f"From {len(r.finish):,} iterations (seed {getattr(r, 'seed', None)}). "
                "Sensitivity shows association, not cause: a long bar means the finish moved "
                "with that activity's duration in this run.")

    def _on_selection_changed(self, ids) -> None:
        if self.when_shown.dirty:   # the pending redraw marks the selection
            return
        for chart in (self.criticality, self.sensitivity):
            chart.set_selected(ids)
