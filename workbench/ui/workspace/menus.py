"""Menus and the tool bar of the main window, built from the window's parts."""

from __future__ import annotations

from functools import partial
from pathlib import Path

from PySide6.QtCore import QSize
from PySide6.QtGui import QAction, QKeySequence
from PySide6.QtWidgets import QApplication, QMenu, QToolBar

from workbench.core.commands import SetSettings
from workbench.ui import prompts
from workbench.ui.workspace import settings_dialog
from workbench.ui.workspace.living_menu import living_menu
from workbench.ui.icons import icon
from workbench.ui.workspace.pack_export import export_pack
from workbench.ui.workspace.table_transfer import export_table

StandardKey = QKeySequence.StandardKey


def _action(window, text: str, slot, key=None, icon_name: str | None = None, tip: str = "") -> QAction:
    act = QAction(text, window)
    if isinstance(key, StandardKey):
        act.setShortcuts(key)              # all of the system's keys for it, not just the first
    elif key is not None:
        act.setShortcut(QKeySequence(key))
    if icon_name:
        act.setIcon(icon(icon_name))
    act.setToolTip(tip or text.replace("&", "").rstrip("…"))
    act.triggered.connect(lambda *_: slot())
    return act


def edit_settings(window) -> None:
    settings = settings_dialog.edit_settings(window, window.session.plan.settings)
    if settings is not None:
        window.session.push(SetSettings(settings))


def import_dialog(window) -> None:
    path = prompts.ask_open_path(window, "Import a table", prompts.TABLE_FILTER, window.files._folder())
    if path:
        window.files.open_path(path)


def start_present(window) -> None:
    """Present mode (one chart per screen for a projector), when it is installed."""
    try:
        from workbench.ui.present.window import open_present
    except ImportError:
        prompts.show_info(window, "Present", "Present mode is not available in this installation.")
        return
    open_present(window.session, window)


def show_guide(window) -> None:
    from workbench.ui.workspace.help_text import guide_markdown

    prompts.show_guide(window, guide_markdown(getattr(window, "menu_actions", {})))


def show_about(window) -> None:
    from workbench import __version__
    prompts.show_info(window, "About Slackline",
                      f"Slackline {__version__} — a workbench for project planners: critical path, "
                      "PERT odds and schedule risk.")


def _file_actions(window) -> dict[str, QAction]:
    files = window.files
    return {
        "new": _action(window, "&New Plan", lambda: files.new_plan(), StandardKey.New, "new"),
        "open": _action(window, "&Open…", files.open_dialog, StandardKey.Open, "open"),
        "save": _action(window, "&Save", files.save, StandardKey.Save, "save"),
        "save_as": _action(window, "Save &As…", files.save_as, StandardKey.SaveAs, "save_as"),
        "import": _action(window, "&Import Table…", partial(import_dialog, window), "Ctrl+Shift+I", "import"),
        "export": _action(window, "&Export Table…", partial(export_table, window, window.session), "Ctrl+Shift+E", "export"),
        "export_pack": _action(window, "Export Approval &Pack…", partial(export_pack, window), "Ctrl+Shift+P",
                               tip="Write the printed approval pack (PDF) and open it"),
        "settings": _action(window, "Plan Se&ttings…", partial(edit_settings, window), StandardKey.Preferences, "settings"),
        "close": _action(window, "&Close Window", window.close, StandardKey.Close),
        "quit": _action(window, "&Quit", QApplication.closeAllWindows, StandardKey.Quit),
    }


def fill_recent(window, menu: QMenu) -> None:
    menu.clear()
    recent = window.files.recent_files()
    for path in recent:
        act = menu.addAction(Path(path).name)
        act.setToolTip(path)
        act.setStatusTip(path)
        act.triggered.connect(partial(window.open_path, path))
    if recent:
        menu.addSeparator()
    clear = menu.addAction("Clear Recent Files")
    clear.setEnabled(bool(recent))
    clear.triggered.connect(window.files.clear_recent)


def _undo_actions(window) -> dict[str, QAction]:
    stack = window.session.undo_stack
    undo = stack.createUndoAction(window, "&Undo")
    undo.setShortcuts(StandardKey.Undo)     # every key the system uses for it
    undo.setIcon(icon("undo"))
    redo = stack.createRedoAction(window, "&Redo")
    redo.setShortcuts(StandardKey.Redo)     # Ctrl+Shift+Z; Ctrl+Y too where that is the custom
    redo.setIcon(icon("redo"))
    find = _action(window, "&Find…", lambda: window.activities.search.setFocus(), StandardKey.Find)
    return {"undo": undo, "redo": redo, "find": find}


def build_menus(window) -> dict[str, QAction]:
    """Create the menu bar and tool bar; return every action by name."""
    acts = {**_file_actions(window), **_undo_actions(window)}
    panel = window.activities.actions
    _file_menu(window, acts)
    edit_menu = window.menuBar().addMenu("&Edit")
    edit_menu.addActions([acts["undo"], acts["redo"]])
    edit_menu.addSeparator()
    edit_menu.addActions([panel[k] for k in ("insert", "delete", "move_up", "move_down", "paste", "predecessors")])
    edit_menu.addSeparator()
    edit_menu.addAction(acts["find"])
    living_menu(window, acts)
    _view_menu(window, acts)
    help_menu = window.menuBar().addMenu("&Help")
    acts["guide"] = _action(window, "Slackline &Guide", partial(show_guide, window), StandardKey.HelpContents)
    acts["about"] = _action(window, "&About Slackline", partial(show_about, window))
    help_menu.addActions([acts["guide"], acts["about"]])
    _tool_bar(window, acts, panel)
    return {**acts, **{f"row_{k}": v for k, v in panel.items()}}


def _file_menu(window, acts: dict) -> None:
    menu = window.menuBar().addMenu("&File")
    menu.addActions([acts["new"], acts["open"]])
    recent = menu.addMenu("Open &Recent")
    recent.aboutToShow.connect(partial(fill_recent, window, recent))
    window.recent_menu = recent
    for group in (("save", "save_as"), ("import", "export", "export_pack"), ("settings",), ("close", "quit")):
        menu.addActions([acts[k] for k in group])
        if group[0] != "close":
            menu.addSeparator()


def _view_menu(window, acts: dict) -> None:
    menu = window.menuBar().addMenu("&View")
    for title, dock in window.docks.items():
        toggle = dock.toggleViewAction()
        menu.addAction(toggle)
        acts[f"show_{title.lower()}"] = toggle
    menu.addSeparator()
    acts["reset_layout"] = menu.addAction("Reset &Layout")
    acts["reset_layout"].triggered.connect(window.reset_layout)
    menu.addSeparator()
    acts["present"] = _action(window, "&Present", partial(start_present, window), "F5")
    acts["present"].setToolTip("Show the charts full screen, one per slide, for a projector")
    menu.addAction(acts["present"])
    from workbench.ui.workspace import chart_tools
    acts.update(chart_tools.install(window, menu))


def _tool_bar(window, acts: dict, panel: dict) -> None:
    tools = QToolBar("Tools", window)
    tools.setObjectName("toolbar_main")
    tools.setAccessibleName("Main tools")
    tools.setIconSize(QSize(20, 20))
    tools.addActions([acts["new"], acts["open"], acts["save"]])
    tools.addSeparator()
    tools.addActions([acts["undo"], acts["redo"]])
    tools.addSeparator()
    tools.addActions([panel["insert"], panel["delete"], panel["move_up"], panel["move_down"], panel["predecessors"]])
    tools.addSeparator()
    tools.addAction(acts["settings"])
    window.addToolBar(tools)
