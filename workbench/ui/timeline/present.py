"""The Timeline on a projector: what changes when a TimelineView is shown in Present mode.

A projector at 1024×768 fits only about fifteen rows at a size read from the back of a
room, so the Timeline opens with every group folded to its summary bar (all rows fit,
large). Keys, with the hint shown on the slide: G opens or folds all groups, C shows only
the critical activities (groups open). Row labels never shrink below the Present type:
when the rows do not fit at that size the slide shows a page of them, the top of the label
column says which ("Rows 1–15 of 52"), and ] or N / [ or P turn to the next / previous
rows (the Network slide's parts turn with [ and ] too; the arrows and PgUp / PgDn step
slides). Helpers here also keep the labels of the reference lines apart.
"""

from __future__ import annotations

import math

from PySide6.QtCore import Qt
from PySide6.QtGui import QFontMetricsF

PRESENT_HINT = "G: groups  \u00b7  C: critical path  \u00b7  [ ]: more rows"
NEXT_ROWS = {Qt.Key.Key_BracketRight, Qt.Key.Key_N}
PREVIOUS_ROWS = {Qt.Key.Key_BracketLeft, Qt.Key.Key_P}
NOTE_LINES = 4       # the page note: rows, the group continued, next and previous keys


def group_names(plan) -> set[str]:
    return {a.group for a in plan.activities if a.group}


def fold_all(view, folded: bool) -> None:
    """Fold (or open) every group of the view's plan and show all rows."""
    view.collapsed = group_names(view.session.plan) if folded else set()
    view.row_page = 0
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
        view.row_page = 0
        view.show_critical_path(not view.critical_only)
        return True
    if key in NEXT_ROWS or key in PREVIOUS_ROWS:
        view.row_page += 1 if key in NEXT_ROWS else -1
        view._auto_fit = True    # a page again, also after a resize
        view.fit_all()           # the page is clamped there: no turning past either end
        return True
    return False


def header_for_pages(view, header_px: float, n: int, height: float) -> float:
    """The band above the rows on a slide: when the ``n`` rows do not all fit below it, tall
    enough for the page note too (up to four lines: rows, group, two keys)."""
    if n * view.legible_row_pitch() <= height - header_px:
        return header_px
    return max(header_px, NOTE_LINES * math.ceil(QFontMetricsF(view._font()).height()) + 8.0)


def page_of_rows(view, n: int, height: float, header_px: float) -> tuple[int, int, float]:
    """First row, number of rows and header band (pixels) of the page in view when ``n``
    rows share ``height`` pixels at the pitch that keeps the Present type
    (``legible_row_pitch``). Pages hold the same number of rows; the last ends at the last
    row (it may repeat a few rows of the page before). Sets the page and its note in the
    label column."""
    header_px = header_for_pages(view, header_px, n, height)
    per = max(1, int((height - header_px) / view.legible_row_pitch()))
    if n <= per:
        view.row_page = 0
        return 0, n, header_px
    pages = math.ceil(n / per)
    view.row_page = max(0, min(view.row_page, pages - 1))
    first = min(view.row_page * per, n - per)
    view.row_axis.set_page(first, rows_note(first, per, n, continued_group(view.geometry, first)))
    return first, per, header_px


def continued_group(geo, row: int) -> str:
    """The name of the group whose rows a page starting at ``row`` continues ("" when the
    page starts with a group's own row or an ungrouped activity)."""
    if geo is None or row >= geo.n_rows or geo.kinds[row] == "group" or not geo.depth[row]:
        return ""
    while row > 0 and geo.kinds[row] != "group":
        row -= 1
    return geo.labels[row] if geo.kinds[row] == "group" else ""


def leave_page(view) -> None:
    """The rows were zoomed or dragged by hand: every row is drawn again and the page note
    goes (its row numbers no longer hold); ] / [ or N / P bring the pages back."""
    if view.page_first or view.row_axis.page_note:
        view.page_first = view.item.first_row = 0
        view.row_axis.set_page(0, "")
        view.item.update()


def rows_note(first: int, count: int, n: int, group: str = "") -> str:
    """The label column's note on a page of rows: "Rows 16–30 of 52", the group the page
    continues and, a line each, the keys that reach the others."""
    lines = [f"Rows {first + 1}\u2013{first + count} of {n}"] + ([f"{group}, continued"] if group else [])
    if first + count < n:
        lines.append("] or N: more rows")
    if first > 0:
        lines.append("[ or P: back")
    return "\n".join(lines)


def plot_resized(view) -> None:
    """The chart got another size: on a slide the page of rows is fitted again (as many
    rows as the new height holds at the Present type); the line labels are set apart."""
    if view.present_hint and view._auto_fit and view.geometry is not None:
        view.fit_all()
    else:
        stack_finish_labels(view)


def stack_finish_labels(view) -> None:
    """Set the line labels in the header band above the first row, apart from each other
    (see ``TimelineLines.place_labels``): start and deadline, and the P10 / P90 lines that
    often fall close together. Called whenever the lines or the visible range change."""
    if view._lines:
        view.reference.place_labels(view._font(), view.page_first)
