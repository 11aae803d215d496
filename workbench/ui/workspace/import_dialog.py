"""Preview of a CSV/XLSX import: what would come in, or every row-level problem."""

from __future__ import annotations

from pathlib import Path

from PySide6.QtWidgets import (QButtonGroup, QDialog, QDialogButtonBox, QLabel, QListWidget,
                               QRadioButton, QTableWidget, QTableWidgetItem, QVBoxLayout)

from workbench.ui.activities.columns import format_number
from workbench.ui.activities.links_text import format_predecessors

NEW, KEEP = "new", "keep"    # start a new plan from the table / keep the open plan's settings
HEADINGS = ["ID", "Name", "Group", "Optimistic", "Most likely", "Pessimistic", "Duration", "Predecessors"]


class ImportDialog(QDialog):
    """Accepting applies the import as one undo step; with problems only Close is offered."""

    def __init__(self, path: str, plan, problems: list[str], parent=None, open_settings=None):
        super().__init__(parent)
        self.choice = NEW
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
            layout.addWidget(QLabel(f"<b>{name}</b>: {len(plan)} activities, {len(plan.links)} links.", self))
            layout.addWidget(self._preview(plan))
            self._choices(layout, Path(path).stem, open_settings)
            buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self)
            buttons.button(QDialogButtonBox.StandardButton.Ok).setText("Import")
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        layout.addWidget(buttons)
        self.resize(820, 520)

    def _choices(self, layout, stem: str, kept) -> None:
        """Start a new plan (the default) or keep the open plan's settings, said in full."""
        self.new_button = QRadioButton(f"Start a new plan “{stem}” from this table (no deadline; "
                                       "set the start and deadline in Plan Settings)", self)
        self.keep_button = QRadioButton("Replace the activities of the open plan and keep its settings "
                                        "(one undo step)" + (":" if kept else ""), self)
        self.kept = QLabel(kept or "", self)     # wrapped under its choice: the dialog stays narrow
        self.kept.setWordWrap(True)
        self.kept.setContentsMargins(24, 0, 0, 0)
        self.new_button.setChecked(True)
        group = QButtonGroup(self)
        for button, key in ((self.new_button, NEW), (self.keep_button, KEEP)):
            button.setAccessibleName(button.text())
            group.addButton(button)
            button.toggled.connect(lambda on, k=key: on and setattr(self, "choice", k))
            layout.addWidget(button)
        layout.addWidget(self.kept)

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


def preview_import(parent, path: str, plan, problems: list[str], open_settings: str = "") -> str | None:
    """Show what an import would bring in (or why it cannot): NEW to start a new plan from
    it, KEEP to replace the open plan's activities keeping its settings (``open_settings``
    says which), None to leave everything as it is."""
    dialog = ImportDialog(path, plan, problems, parent, open_settings)
    if not dialog.exec() or plan is None:
        return None
    return dialog.choice
