"""Every question the window asks the planner, in one place.

Each function opens a modal dialog and returns the answer. Keeping them here lets
tests replace them with functions that answer at once.
"""

from __future__ import annotations

from PySide6.QtWidgets import QFileDialog, QMessageBox, QWidget

PLAN_FILTER = "Slackline plans (*.slw)"
OPEN_FILTER = "Plans and tables (*.slw *.csv *.xlsx);;Slackline plans (*.slw);;Tables (*.csv *.xlsx)"
TABLE_FILTER = "Tables (*.csv *.xlsx)"
EXPORT_FILTER = "CSV table (*.csv);;XLSX workbook (*.xlsx)"
PDF_FILTER = "PDF documents (*.pdf)"


def ask_open_path(parent: QWidget, title: str = "Open plan", filters: str = OPEN_FILTER,
                  folder: str = "") -> str | None:
    path, _ = QFileDialog.getOpenFileName(parent, title, folder, filters)
    return path or None


def ask_save_path(parent: QWidget, title: str = "Save plan as", suggested: str = "",
                  filters: str = PLAN_FILTER) -> str | None:
    path, _ = QFileDialog.getSaveFileName(parent, title, suggested, filters)
    return path or None


TITLE_ROOM = 160   # what a window frame takes beside its title: icon, buttons, margins


def message_box(parent, title: str, text: str, icon=QMessageBox.Icon.Question, detail: str = "") -> QMessageBox:
    """A message box wide enough that the window manager need not cut its title short."""
    box = QMessageBox(icon, title, text, QMessageBox.StandardButton.NoButton, parent)
    if detail:
        box.setInformativeText(detail)
    from PySide6.QtWidgets import QSizePolicy, QSpacerItem
    width = box.fontMetrics().horizontalAdvance(title) * 1.3 + TITLE_ROOM
    grid = box.layout()
    grid.addItem(QSpacerItem(int(width), 0, QSizePolicy.Policy.Minimum, QSizePolicy.Policy.Minimum),
                 grid.rowCount(), 0, 1, grid.columnCount())
    return box


def _choose(parent, title: str, text: str, buttons: list[tuple[str, str, QMessageBox.ButtonRole]],
            icon=QMessageBox.Icon.Question, detail: str = "") -> str:
    box = message_box(parent, title, text, icon, detail)
    made = {box.addButton(label, role): key for key, label, role in buttons}
    box.setDefaultButton(next(iter(made)))
    box.exec()
    return made.get(box.clickedButton(), buttons[-1][0])


def ask_unsaved(parent: QWidget, name: str) -> str:
    """'save', 'discard' or 'cancel'."""
    R = QMessageBox.ButtonRole
    return _choose(parent, "Unsaved changes", f"Save the changes to {name}?",
                   [("save", "Save", R.AcceptRole), ("discard", "Don't Save", R.DestructiveRole),
                    ("cancel", "Cancel", R.RejectRole)],
                   detail="Changes you don't save are lost.")


def ask_recovery(parent: QWidget, text: str, detail: str) -> str:
    """'restore', 'open' (the saved file) or 'discard'."""
    R = QMessageBox.ButtonRole
    return _choose(parent, "Recover unsaved work", text,
                   [("restore", "Restore Recovered Work", R.AcceptRole),
                    ("open", "Open Saved File", R.ActionRole),
                    ("discard", "Discard Recovered Work", R.DestructiveRole)],
                   detail=detail)


def ask_locked(parent: QWidget, path: str, holder: str) -> str:
    """'readonly' or 'cancel'."""
    R = QMessageBox.ButtonRole
    return _choose(parent, "Plan in use", f"{path} is open in another Slackline window{holder}.",
                   [("readonly", "Open Read-Only", R.AcceptRole), ("cancel", "Cancel", R.RejectRole)],
                   icon=QMessageBox.Icon.Warning,
                   detail="Editing it in two places would lose one set of changes.")


def ask_save_as_instead(parent: QWidget, message: str) -> bool:
    R = QMessageBox.ButtonRole
    return _choose(parent, "Cannot save here", message,
                   [("save_as", "Save As…", R.AcceptRole), ("cancel", "Cancel", R.RejectRole)],
                   icon=QMessageBox.Icon.Warning) == "save_as"


def ask_owner_change(parent: QWidget, message: str) -> str:
    """Before saving a file whose owner or group cannot be kept: 'save', 'save_as' or 'cancel'."""
    R = QMessageBox.ButtonRole
    return _choose(parent, "Saving changes who owns the file", message,
                   [("save_as", "Save As…", R.AcceptRole), ("save", "Save Anyway", R.DestructiveRole),
                    ("cancel", "Cancel", R.RejectRole)], icon=QMessageBox.Icon.Warning,
                   detail="Colleagues who share the file through its owner or group may no longer open it.")


def ask_printer(parent: QWidget, doc_name: str):
    """The system's print dialog; the chosen QPrinter, or None when cancelled."""
    from PySide6.QtPrintSupport import QPrintDialog, QPrinter
    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    printer.setDocName(doc_name)
    return printer if QPrintDialog(printer, parent).exec() else None


def show_error(parent: QWidget, title: str, message: str) -> None:
    QMessageBox.warning(parent, title, message)


def show_info(parent: QWidget, title: str, message: str) -> None:
    QMessageBox.information(parent, title, message)


def open_externally(parent: QWidget, path: str) -> bool:
    """Open a file in the system's viewer for its type (a PDF reader for the pack)."""
    from PySide6.QtCore import QUrl
    from PySide6.QtGui import QDesktopServices
    opened = QDesktopServices.openUrl(QUrl.fromLocalFile(path))
    if not opened:
        show_info(parent, "Open", f"{path} was written; no viewer could be started for it here.")
    return opened


def show_guide(parent: QWidget, markdown: str) -> None:
    """A scrollable guide written in Markdown."""
    from PySide6.QtWidgets import QDialog, QDialogButtonBox, QTextBrowser, QVBoxLayout
    dialog = QDialog(parent)
    dialog.setWindowTitle("Slackline guide")
    text = QTextBrowser(dialog)
    text.setAccessibleName("Slackline guide")
    text.setMarkdown(markdown)
    buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Close, dialog)
    buttons.rejected.connect(dialog.reject)
    layout = QVBoxLayout(dialog)
    layout.addWidget(text)
    layout.addWidget(buttons)
    dialog.resize(760, 640)
    dialog.exec()
