"""The Timeline on a projector: what changes when a TimelineView is shown in Present mode.

A projector at 1024×768 fits only about a dozen rows at a size read from the back of a
room, so the Timeline opens with every group folded to its summary bar (all rows fit,
large). Keys, with the hint shown on the slide: G opens or folds all groups, C shows only
the critical activities (groups open). Helpers here also keep the labels of the reference lines apart.
"""

from __future__ import annotations

from PySide6.QtCore import Qt

PRESENT_HINT = "G: open or fold the groups  \u00b7  C: critical path only"


def group_names(plan) -> set[str]:
    return {a.group for a in plan.activities if a.group}


def fold_all(view, folded: bool) -> None:
    """Fold (or open) every group of the view's plan and show all rows."""
    view.collapsed = group_names(view.session.plan) if folded else set()
    view.refresh()
    view.fit_all()


def present_key(view, key) -> bool:
    """Keys of the Timeline slide; True when the key was used."""
    if key == Qt.Key.Key_G:
        fold_all(view, not (view.collapsed & group_names(view.session.plan)))
        return True
    if key == Qt.Key.Key_C:        # the critical activities themselves, not folded groups
        if not view.critical_only:
            view.collapsed = set()
        view.show_critical_path(not view.critical_only)
        return True
    return False


def stack_finish_labels(view) -> None:
    """Set the line labels in the header band above the first row, apart from each other
    (see ``TimelineLines.place_labels``): start and deadline, and the P10 / P90 lines that
    often fall close together. Called whenever the lines or the visible range change."""
    if view._lines:
        view.reference.place_labels(view._font())
