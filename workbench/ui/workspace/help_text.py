"""The Help guide: the window, each view, the simulation and the terms (the pages of
docs/), and the keys as the window's own actions have them on this system."""

from __future__ import annotations

from PySide6.QtGui import QKeySequence

from workbench.resources import docs_dir

PAGES = (("window.md", "The window"), ("timeline.md", "Timeline"), ("network.md", "Network"),
         ("odds.md", "Odds and Drivers"), ("simulation.md", "Simulation"),
         ("approval-pack.md", "Approval pack and Present"), ("terms.md", "Terms"))


def _page(name: str, title: str) -> str:
    path = docs_dir() / name
    if not path.exists():
        return ""
    return path.read_text(encoding="utf-8")


def keys_section(actions: dict) -> str:
    """Every action with a shortcut, with all the keys that trigger it here."""
    rows = []
    for action in actions.values():
        keys = [k.toString(QKeySequence.SequenceFormat.NativeText) for k in action.shortcuts() if not k.isEmpty()]
        if keys:
            rows.append(f"| {action.text().replace('&', '').rstrip('…')} | {' or '.join(keys)} |")
    return "# Keys\n\n| action | keys |\n|---|---|\n" + "\n".join(sorted(set(rows)))


def guide_markdown(actions: dict) -> str:
    """The whole guide: contents, the keys, then each page."""
    pages = [(title, _page(name, title)) for name, title in PAGES]
    pages = [(title, text) for title, text in pages if text]
    contents = "# Slackline guide\n\n" + " · ".join(["Keys"] + [t for t, _ in pages])
    return "\n\n".join([contents, keys_section(actions)] + [text for _, text in pages])
