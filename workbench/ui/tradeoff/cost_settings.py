"""The plan's indirect cost and lateness penalty, edited where the trade-off is read; each
change is one undoable settings edit."""

from __future__ import annotations

import math
from dataclasses import replace

from PySide6.QtWidgets import QFormLayout, QLabel, QLineEdit, QWidget

from workbench.core.commands import SetSettings

FIELDS = (("indirect_cost", "Indirect cost per {unit}", "Site overheads, management, hire: what each extra {unit} costs"),
          ("late_penalty", "Penalty per {unit} late", "What each {unit} past the deadline costs (damages, lost revenue)"))


class CostSettings(QWidget):
    def __init__(self, session, parent=None):
        super().__init__(parent)
        self.session = session
        self.edits: dict[str, QLineEdit] = {}
        self.labels: dict[str, QLabel] = {}
        form = QFormLayout(self)
        form.setContentsMargins(0, 0, 0, 0)
        for key, _label, _tip in FIELDS:
            edit = QLineEdit()
            edit.editingFinished.connect(lambda key=key: self.commit(key))
            self.edits[key], self.labels[key] = edit, QLabel()
            form.addRow(self.labels[key], edit)
        self.show_settings()

    def show_settings(self) -> None:
        s = self.session.plan.settings
        unit = s.unit[:-1] if s.unit.endswith("s") else s.unit
        for key, label, tip in FIELDS:
            self.labels[key].setText(label.format(unit=unit))
            self.edits[key].setToolTip(tip.format(unit=unit))
            self.edits[key].setText(f"{getattr(s, key):,.0f}" if getattr(s, key) == round(getattr(s, key))
                                    else f"{getattr(s, key):,.2f}")

    def commit(self, key: str) -> bool:
        """Push the typed figure as one settings edit; refuse text that is not a cost."""
        text = self.edits[key].text().replace(",", "").strip() or "0"
        title = dict((k, l) for k, l, _ in FIELDS)[key].format(unit="unit").lower()
        try:
            value = float(text)
        except ValueError:
            value = math.nan
        if not math.isfinite(value) or value < 0:
            self.show_settings()
            return self.session.refuse(f"{title}: {text!r} is not an amount of at least 0")
        s = self.session.plan.settings
        if value == getattr(s, key):
            return False
        return self.session.push(SetSettings(replace(s, **{key: value}), f"Trade-off: {title}"))
