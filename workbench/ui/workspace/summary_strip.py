"""The strip above the table: finish date, odds of the deadline, the date at the target
confidence and the critical path — large enough to read across a meeting room."""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtGui import QFont, QFontMetrics
from PySide6.QtWidgets import QFrame, QGridLayout, QHBoxLayout, QLabel, QPushButton, QSizePolicy

from workbench.core.formatting import format_duration, format_number
from workbench.figures.headline import headline
from workbench.ui.session import Session, take_simulation

PATH_SHOWN = 12
PATH_LEAST = 3          # ids the path line keeps however narrow the strip


def _float_to_deadline(a) -> str:
    """With a deadline the late dates come from it, so the critical path (the least float)
    may have float left, or negative float: say how much, so "critical" with float 6 reads
    right."""
    if a.deadline is None or not len(a.schedule.total_float):
        return ""
    least = float(a.schedule.total_float.min())
    amount = format_duration(abs(least), a.plan.settings.unit)   # rounded like every figure shown
    if format_number(abs(least)) == "0":
        return ""
    return (f"  ·  {amount} of float to the deadline" if least > 0
            else f"  ·  {amount} late for the deadline (negative float)")


class SummaryStrip(QFrame):
    """Three headline figures, each a caption over a large value with the other method
    beside it, the critical path, and a note on where the figures come from. A current
    simulation leads (``workbench.figures.headline``, worded as in Present and the pack)."""

    FIELDS = ("finish", "odds", "target")

    def __init__(self, session: Session, parent=None):
        super().__init__(parent)
        self.session = session
        self.result, self.stale = session.simulation, False
        self.setFrameShape(QFrame.Shape.StyledPanel)
        self.setAccessibleName("Schedule summary")
        self.captions: dict[str, QLabel] = {}
        self.values: dict[str, QLabel] = {}
        self.besides: dict[str, QLabel] = {}
        grid = QGridLayout(self)
        grid.setContentsMargins(10, 6, 10, 6)
        grid.setHorizontalSpacing(28)
        grid.setVerticalSpacing(2)
        for col, key in enumerate(self.FIELDS):
            self._figure(grid, col, key)
        self._path_line(grid)
        self.note = self._label(wrap=True, name="Where the figures come from")
        grid.addWidget(self.note, 4, 0, 1, 4)
        grid.setColumnStretch(3, 1)
        session.schedule_changed.connect(self.refresh)
        session.simulation_changed.connect(self._on_simulation_changed)
        self.refresh()

    def _label(self, scale: float = 1.0, bold: bool = False, wrap: bool = False, name: str = "") -> QLabel:
        label = QLabel("—", self)
        if scale != 1.0 or bold:
            font = QFont(self.font())
            font.setPointSizeF(self.font().pointSizeF() * scale)
            font.setBold(bold)
            label.setFont(font)
        label.setWordWrap(wrap)
        label.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        label.setSizePolicy(QSizePolicy.Policy.Ignored if wrap else QSizePolicy.Policy.Preferred,
                            QSizePolicy.Policy.Preferred)
        label.setAccessibleName(name)
        return label

    def _figure(self, grid: QGridLayout, col: int, key: str) -> None:
        self.captions[key] = cap = self._label(wrap=True, name=f"{key} caption")
        cap.setAlignment(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignBottom)
        self.values[key] = self._label(1.5, True, name=key)
        self.besides[key] = self._label(wrap=True, name=f"{key}, the other method")
        grid.addWidget(cap, 0, col)
        grid.addWidget(self.values[key], 1, col, Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignTop)
        grid.addWidget(self.besides[key], 2, col)

    def _path_line(self, grid: QGridLayout) -> None:
        cap = QLabel("Critical path:", self)
        self.values["path"] = value = self._label(1.25, True, wrap=True, name="Critical path:")
        value.setSizePolicy(QSizePolicy.Policy.Ignored, QSizePolicy.Policy.Preferred)
        line = QHBoxLayout()
        line.addWidget(cap)
        line.addWidget(value, 1)
        line.addWidget(self._checkup_button(value.font()))
        grid.addLayout(line, 3, 0, 1, 4)

    def _checkup_button(self, font) -> QPushButton:
        """"Checkup: 11 of 14 pass": a click shows the Checkup (the window connects it)."""
        from workbench.ui.checkup.keeper import checkup_keeper

        self.checkup = QPushButton("Checkup", self)
        self.checkup.setFont(font)
        self.checkup.setFlat(True)
        self.checkup.setAccessibleName("Checkup summary")
        self.checkup.setToolTip("Schedule quality: the DCMA 14-point assessment and our own checks. Click for details.")
        self.keeper = checkup_keeper(self.session)
        self.keeper.updated.connect(self._show_checkup)
        self._show_checkup()
        return self.checkup

    def _show_checkup(self, _checkup=None) -> None:
        self.checkup.setText(self.keeper.summary_text())

    def _on_simulation_changed(self) -> None:
        take_simulation(self)
        self.refresh()

    def texts(self) -> dict[str, str]:
        """What the strip shows: key -> text (captions as ``<key>_caption``, the other
        method as ``<key>_beside``)."""
        a = self.session.analysis
        if a is None:
            problem = self.session.analysis_error or "no schedule"
            out = {"finish": "cannot schedule", "odds": "—", "target": "—", "path": problem, "note": ""}
            out.update({f"{k}_caption": "" for k in self.FIELDS})
            out.update({f"{k}_beside": "" for k in self.FIELDS})
            return out
        head = headline(a, self.result, self.stale)
        out = {"path": self._path_text(a), "note": head.note, "source": head.source}
        for key, figure in zip(self.FIELDS, head.figures()):
            out[key], out[f"{key}_caption"], out[f"{key}_beside"] = figure.value, figure.caption, figure.beside
        return out

    @staticmethod
    def _path_text(a, most: int = PATH_SHOWN) -> str:
        path = list(a.pert.path)
        shown = " → ".join(path[:most]) + (f" → … ({len(path)} activities)" if len(path) > most else "")
        return (shown + _float_to_deadline(a)) or "—"

    def _fit(self, label: QLabel, candidates: list[str]) -> None:
        """The first wording that fits the label on one line (the last when none does): a
        narrow strip (a 1024×768 projector) keeps every figure to its lines, so the table
        below keeps its rows."""
        width = label.contentsRect().width()
        metrics = QFontMetrics(label.font())
        if not self.isVisible():            # not laid out yet: the whole wording until shown
            text = candidates[0]
        else:
            text = next((t for t in candidates if metrics.horizontalAdvance(t) <= width), candidates[-1])
        if label.text() != text:
            label.setText(text)

    def _fit_all(self, texts: dict[str, str]) -> None:
        for key in self.FIELDS:
            caption, beside = texts[f"{key}_caption"], texts[f"{key}_beside"]
            self._fit(self.captions[key], [caption, caption.replace("(simulation)", "(sim.)")])
            self._fit(self.besides[key], [beside, beside.replace(" (single path)", "")])
        a = self.session.analysis
        if a is not None:
            self._fit(self.values["path"], [self._path_text(a, k) for k in range(PATH_SHOWN, PATH_LEAST - 1, -1)])

    def resizeEvent(self, event) -> None:  # noqa: N802 (Qt override)
        super().resizeEvent(event)
        self._fit_all(self.texts())

    def showEvent(self, event) -> None:  # noqa: N802 (Qt override)
        super().showEvent(event)
        self._fit_all(self.texts())

    def refresh(self) -> None:
        texts = self.texts()
        for key in self.FIELDS:
            self.values[key].setText(texts[key])
            self.captions[key].setText(texts[f"{key}_caption"])
            self.besides[key].setText(texts[f"{key}_beside"])
            self.besides[key].setVisible(bool(texts[f"{key}_beside"]))
        self.values["path"].setText(texts["path"])
        self._fit_all(texts)
        self.note.setText(texts["note"])
        self.note.setStyleSheet("color: #8A3B00; font-weight: bold;" if self.stale and self.result is not None else "")
        self.values["path"].setToolTip(" → ".join(self.session.analysis.pert.path) if self.session.analysis else "")
