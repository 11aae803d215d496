"""Redo answers to every key the system uses for it, and the guide lists the keys as the
actions have them; the guide covers the views and the terms; About gives the version."""

from PySide6.QtGui import QKeySequence

from workbench import __version__
from workbench.ui.workspace.help_text import guide_markdown

Std = QKeySequence.StandardKey


def native(keys):
    return [k.toString(QKeySequence.SequenceFormat.NativeText) for k in keys]


def test_undo_and_redo_use_all_the_platform_keys(window):
    acts = window.menu_actions
    assert acts["redo"].shortcuts() == QKeySequence.keyBindings(Std.Redo)
    assert acts["undo"].shortcuts() == QKeySequence.keyBindings(Std.Undo)
    assert len(QKeySequence.keyBindings(Std.Redo)) >= 1


def test_the_guide_lists_the_keys_it_has_and_covers_views_and_terms(window, ui_env):
    shown = []
    ui_env.replies["show_guide"] = lambda parent, text: shown.append(text)
    window.menu_actions["guide"].trigger()
    text = shown[0]
    for key in native(window.menu_actions["redo"].shortcuts()):
        assert f"| Redo | " in text and key in text
    for heading in ("# The Timeline view", "# The Network view", "# The Odds and Drivers views",
                    "# Terms used in Slackline"):
        assert heading in text
    assert "Total float" in text and "Merge bias" in text
    assert guide_markdown(window.menu_actions) == text


def test_about_gives_the_version(window, ui_env):
    said = []
    ui_env.replies["show_info"] = lambda parent, title, message: said.append(message)
    window.menu_actions["about"].trigger()
    assert f"Slackline {__version__}" in said[0]


def test_the_frozen_app_carries_every_guide_page():
    from pathlib import Path
    from workbench.ui.workspace.help_text import PAGES
    spec = (Path(__file__).resolve().parents[3] / "installer" / "slackline.spec").read_text(encoding="utf-8")
    for name, _title in PAGES:
        assert f'"{name}"' in spec
