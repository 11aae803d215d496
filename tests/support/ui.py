"""Shared set-up for the window tests (imported by the other test_ui_* files):
temporary QSettings and data folder, dialogs that answer at once, a sample plan."""

import datetime as dt
import importlib

import pytest
from PySide6.QtCore import QSettings

from workbench.core.model import Activity, Link, Plan, Settings
from workbench.ui import prompts

PROMPTS = ("ask_open_path", "ask_save_path", "ask_unsaved", "ask_recovery", "ask_locked",
           "ask_save_as_instead", "ask_owner_change", "show_error", "show_info", "show_guide", "open_externally",
           "ask_printer")
# The dialogs that edit something live beside their dialog classes (not in prompts).
DIALOGS = {"edit_settings": "workbench.ui.workspace.settings_dialog",
           "pick_predecessors": "workbench.ui.activities.predecessor_dialog",
           "preview_import": "workbench.ui.workspace.import_dialog",
           "move_status_date": "workbench.ui.workspace.status_dialog",
           "manage_baselines": "workbench.ui.workspace.baselines_dialog"}


def sample_plan() -> Plan:
    """An invented plan: a short office refit with a parallel branch and an SS link."""
    A = Activity
    acts = [A("S", "Kick-off", group="Start", duration=0),
            A("R", "Survey rooms", group="Design", optimistic=2, most_likely=3, pessimistic=6),
            A("D", "Draw layout", group="Design", optimistic=3, most_likely=5, pessimistic=9),
            A("P", "Order furniture", group="Buy", optimistic=8, most_likely=10, pessimistic=20),
            A("W", "Wiring", group="Build", duration=4, notes="needs permit"),
            A("F", "Fit out", group="Build", optimistic=4, most_likely=6, pessimistic=10),
            A("E", "Move in", group="Finish", duration=0)]
    links = [Link("S", "R"), Link("R", "D"), Link("D", "W"), Link("W", "F", "SS", 2),
             Link("S", "P"), Link("P", "F"), Link("F", "E")]
    return Plan(Settings(title="Office refit", start=dt.date(2026, 3, 2), deadline=dt.date(2026, 4, 30)),
                acts, links)


def plan_state(plan: Plan):
    from workbench.io.planfile import plan_to_dict
    return plan_to_dict(plan)


class Answers:
    """Records each question asked; answers with whatever the test set (else fails)."""

    def __init__(self):
        self.asked: list[tuple[str, tuple]] = []
        self.replies: dict[str, object] = {}

    def make(self, name: str):
        def answer(*args, **kwargs):
            self.asked.append((name, args))
            if name not in self.replies:
                raise AssertionError(f"unexpected dialog {name}{args[1:]}")
            reply = self.replies[name]
            return reply(*args) if callable(reply) else reply
        return answer

    def names(self) -> list[str]:
        return [n for n, _ in self.asked]


@pytest.fixture
def ui_env(qapp, tmp_path, monkeypatch):
    """Temporary settings and data folder; every dialog patched (tests set the answers)."""
    monkeypatch.setenv("SLACKLINE_DATA_DIR", str(tmp_path / "data"))
    monkeypatch.setenv("SLACKLINE_AUTOSAVE_MS", "3600000")
    names = (qapp.organizationName(), qapp.applicationName())
    QSettings.setDefaultFormat(QSettings.Format.IniFormat)
    QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, str(tmp_path / "settings"))
    qapp.setOrganizationName("SlacklineTest")
    qapp.setApplicationName("SlacklineTest")
    QSettings().clear()
    answers = Answers()
    for name in PROMPTS:
        monkeypatch.setattr(prompts, name, answers.make(name))
    for name, module in DIALOGS.items():
        monkeypatch.setattr(importlib.import_module(module), name, answers.make(name))
    yield answers
    QSettings().clear()
    qapp.setOrganizationName(names[0])
    qapp.setApplicationName(names[1])


@pytest.fixture
def window(ui_env, qtbot):
    from workbench.ui.workspace.window import MainWindow
    from workbench.ui.session import Session
    win = MainWindow(Session(sample_plan()))
    win.resize(1400, 900)
    yield win
    ui_env.replies.setdefault("ask_unsaved", "discard")
    win.close()
    win.deleteLater()
    qtbot.wait(1)


def present_at(qtbot, session, slide: int = 0):
    """Present mode shown on a 1024×768 projector, at slide number ``slide``."""
    from workbench.ui.present.window import PresentWindow
    win = PresentWindow(session)
    qtbot.addWidget(win)
    win.resize(1024, 768)
    win.show()
    qtbot.waitExposed(win)
    if slide:
        win.go(slide)
    return win


def shown(qtbot, widget, size: tuple[int, int]):
    """``widget`` handed to qtbot (closed after the test), sized, shown and exposed."""
    qtbot.addWidget(widget)
    widget.resize(*size)
    widget.show()
    qtbot.waitExposed(widget)
    return widget


def in_dock_frame(qtbot, view, size: tuple[int, int], holder: bool = False):
    """``view`` framed as the window frames a dock's view (a holder, optional, inside the
    dock's scroller), in a frame shown at ``size``; returns (frame, scroller)."""
    from PySide6.QtWidgets import QVBoxLayout, QWidget

    from workbench.ui.workspace.screen_fit import scroller
    frame, content = QWidget(), view
    if holder:
        content = QWidget()
        QVBoxLayout(content).setContentsMargins(0, 0, 0, 0)
        content.layout().addWidget(view)
    area = scroller(content, frame)
    QVBoxLayout(frame).setContentsMargins(0, 0, 0, 0)
    frame.layout().addWidget(area)
    shown(qtbot, frame, size)
    return frame, area
