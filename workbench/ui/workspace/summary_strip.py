"""The strip above the table: finish date, odds of the deadline, the date at the target
confidence and the critical path — large enough to read across a meeting room."""

from __future__ import annotations

from workbench.figures.odds import confidence_label

from PySide6.QtCore import Qt
from PySide6.QtGui import QFont
from PySide6.QtWidgets import QFrame, QGridLayout, QHBoxLayout, QLabel, QSizePolicy

from workbench.ui.session import Session

DATE = "%a %d %b %Y"
PATH_SHOWN = 12


def _percent(p: float) -> str:
    if p >= 0.9995:
        return "> 99.9 %"
    if p <= 0.0005:
        return "< 0.1 %"
    return f"{p * 100:.1f} %" if p < 0.1 or p > 0.9 else f"{p * 100:.0f} %"


def _float_to_deadline(a) -> str:
    """With a deadline the late dates come from it, so the critical path (the least float)
    may have float left, or negative float: say how much, so "critical" with float 6 reads
    right."""
    if a.deadline is None or not len(a.schedule.total_float):
        return ""
    least = float(a.schedule.total_float.min())
    if abs(least) < 1e-9:
        return ""
    unit = a.plan.settings.unit
    amount = f"{abs(least):g} {unit if abs(least) != 1 else unit[:-1]}"
    return (f"  ·  {amount} of float to the deadline" if least > 0
            else f"  ·  {amount} late for the deadline (negative float)")


class SummaryStrip(QFrame):
    """Four figures, each a caption over a large value; refreshed on ``schedule_changed``."""

    FIELDS = (("finish", "Project finish (PERT mean)"), ("odds", "Chance of meeting the deadline (PERT)"),
              ("target", "Finish at target confidence"), ("path", "Critical path:"))

    def __init__(self, session: Session, parent=None):
        super().__init__(parent)
        self.session = session
        self.setFrameShape(QFrame.Shape.StyledPanel)
        self.setAccessibleName("Schedule summary")
        self.values: dict[str, QLabel] = {}
        grid = QGridLayout(self)
        grid.setContentsMargins(10, 6, 10, 6)
        grid.setHorizontalSpacing(28)
        big = QFont(self.font())
        big.setPointSizeF(self.font().pointSizeF() * 1.5)
        big.setBold(True)
        path_font = QFont(self.font())
        path_font.setPointSizeF(self.font().pointSizeF() * 1.25)
        path_font.setBold(True)
        for col, (key, caption) in enumerate(self.FIELDS):
            cap = QLabel(caption, self)
            cap.setAlignment(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignBottom)
            value = QLabel("—", self)
            value.setFont(big)
            value.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
            value.setAccessibleName(caption)
            if key == "path":
                value.setWordWrap(True)
                value.setFont(path_font)
                value.setSizePolicy(QSizePolicy.Policy.Expanding, QSizePolicy.Policy.Preferred)
            if key == "path":
                line = QHBoxLayout()
                line.addWidget(cap)
                line.addWidget(value, 1)
                grid.addLayout(line, 2, 0, 1, 4)
            else:
                grid.addWidget(cap, 0, col)
                grid.addWidget(value, 1, col, Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop)
            self.values[key] = value
        grid.setColumnStretch(3, 1)
        grid.setColumnMinimumWidth(3, 0)
        grid.setVerticalSpacing(2)
        session.schedule_changed.connect(self.refresh)
        self.refresh()

    def texts(self) -> dict[str, str]:
        a = self.session.analysis
        if a is None:
            problem = self.session.analysis_error or "no schedule"
            return {"finish": "cannot schedule", "odds": "—", "target": "—", "path": problem}
        settings = a.plan.settings
        odds = a.probability_by_deadline()
        deadline = "" if a.deadline is None else f" by {a.date_of_duration(a.deadline).strftime('%d %b %Y')}"
        conf = settings.target_confidence
        path = list(a.pert.path)
        shown = " → ".join(path[:PATH_SHOWN]) + (f" → … ({len(path)} activities)" if len(path) > PATH_SHOWN else "")
        shown += _float_to_deadline(a)
        return {
            "finish": a.finish_date.strftime(DATE),
            "odds": "no deadline set" if odds is None else f"{_percent(odds)}{deadline}",
            "target": f"{a.date_at(conf).strftime(DATE)} ({confidence_label(conf)})",
            "path": shown or "—",
        }

    def refresh(self) -> None:
        for key, text in self.texts().items():
            self.values[key].setText(text)
        self.values["path"].setToolTip(" → ".join(self.session.analysis.pert.path) if self.session.analysis else "")
