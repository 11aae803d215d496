"""The Timeline on a projector: what changes when a TimelineView is shown in Present mode.

A projector at 1024×768 fits only about a dozen rows at a size read from the back of a
room, so the Timeline opens with every group folded to its summary bar (all rows fit,
large). Keys, with the hint shown on the slide: G opens or folds all groups, C shows only
the critical activities (groups open). Helpers here also keep the labels of the reference lines apart.
"""

from __future__ import annotations

from PySide6.QtCore import Qt

PRESENT_HINT = "G: open or fold the groups  \u00b7  C: critical path only"
LABEL_GAP_PX = 6.0


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
    """Put the "Finish P10" label one label height above "Finish P90": the two lines are
    often close together and their labels would otherwise cover each other."""
    p10, p90 = view._lines.get("p10"), view._lines.get("p90")
    if p10 is None or p90 is None:
        return
    height = max(view.view_box.height(), 1.0)
    label = p90.label.boundingRect().height() + LABEL_GAP_PX
    p90.label.setPosition(0.99)
    p10.label.setPosition(max(0.5, 0.99 - label / height))
