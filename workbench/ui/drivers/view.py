"""The Drivers view: which activities drive the finish, from the latest simulation.

Criticality index and sensitivity (a tornado) as sorted bar charts, the top N shown and
the rest folded into one row; a click selects that activity in every view."""

from __future__ import annotations

from PySide6.QtWidgets import QHBoxLayout, QLabel, QSpinBox, QStackedLayout, QVBoxLayout, QWidget

from workbench.figures import drivers as fdr
from workbench.ui.drivers.chart import DriversChart
from workbench.ui.session import WhenShown, take_simulation

PLACEHOLDER = "No simulation yet. Run a simulation in the Odds view to see what drives the finish."
STALE_NOTE = "Stale: the plan changed since this simulation (shown in grey). Run it again in the Odds view."


class DriversView(QWidget):
    """Criticality and sensitivity rankings for the session's latest simulation."""

    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.result = None
        self.stale = False
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

    def _charts(self) -> QWidget:
        page = QWidget()
        head = QHBoxLayout()
        head.addWidget(QLabel("Show the top"))
        head.addWidget(self.top)
        head.addWidget(QLabel("activities; the rest fold into one row. Vermillion with a heavy edge: on the "
                              "PERT critical path. Click a bar to select the activity."))
        head.addStretch(1)
        charts = QHBoxLayout()
        charts.addWidget(self.criticality, 1)
        charts.addWidget(self.sensitivity, 1)
        lay = QVBoxLayout(page)
        lay.addLayout(head)
        lay.addWidget(self.note)
        lay.addLayout(charts, 1)
        return page

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
