"""Preview of a CSV/XLSX import: what would come in, or every row-level problem."""

from __future__ import annotations

from pathlib import Path

from PySide6.QtWidgets import (QDialog, QDialogButtonBox, QLabel, QListWidget, QTableWidget,
                               QTableWidgetItem, QVBoxLayout)

from workbench.ui.activities.columns import format_number
from workbench.ui.activities.links_text import format_predecessors

HEADINGS = ["ID", "Name", "Group", "Optimistic", "Most likely", "Pessimistic", "Duration", "Predecessors"]


class ImportDialog(QDialog):
    """Accepting applies the import as one undo step; with problems only Close is offered."""

    def __init__(self, path: str, plan, problems: list[str], parent=None):
        super().__init__(parent)
        name = Path(path).name
        self.setWindowTitle(f"Import {name}")
        layout = QVBoxLayout(self)
        if problems or plan is None:
            layout.addWidget(QLabel(f"<b>{name}</b> cannot be imported; nothing has changed. "
                                    f"{len(problems)} problem{'s' if len(problems) != 1 else ''} to fix in the file:", self))
            self.problems = QListWidget(self)
            self.problems.setAccessibleName("Import problems")
            self.problems.addItems(problems)
            layout.addWidget(self.problems)
            buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Close, self)
        else:
            layout.addWidget(QLabel(f"<b>{name}</b>: {len(plan)} activities, {len(plan.links)} links. "
                                    "Importing replaces the activities of the open plan (one undo step).", self))
            layout.addWidget(self._preview(plan))
            buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self)
            buttons.button(QDialogButtonBox.StandardButton.Ok).setText("Import")
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        layout.addWidget(buttons)
        self.resize(820, 520)

    def _preview(self, plan) -> QTableWidget:
        table = QTableWidget(min(len(plan), 2000), len(HEADINGS), self)
        table.setAccessibleName("Activities to import")
        table.setHorizontalHeaderLabels(HEADINGS)
        table.setEditTriggers(QTableWidget.EditTrigger.NoEditTriggers)
        for row, act in enumerate(plan.activities[:2000]):
            cells = [act.id, act.name, act.group, format_number(act.optimistic), format_number(act.most_likely),
                     format_number(act.pessimistic), format_number(act.duration),
                     format_predecessors(plan.predecessors(act.id))]
            for col, text in enumerate(cells):
                table.setItem(row, col, QTableWidgetItem(text))
        table.resizeColumnsToContents()
        return table


def preview_import(parent, path: str, plan, problems: list[str]) -> bool:
    """Show what an import would bring in (or why it cannot); True to apply it."""
    dialog = ImportDialog(path, plan, problems, parent)
    return bool(dialog.exec()) and plan is not None
