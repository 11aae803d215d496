"""Every row in view keeps its label: Present's Timeline slide with the groups open shows
a page of rows in full type; "Every row" in a small dock gives rows shorter than the
label type smaller type (down to a floor). Only rows shorter than even the floor share labels, and the column says so."""

import datetime as dt
import math

from PySide6.QtCore import Qt
from PySide6.QtGui import QFontMetricsF

from support.ui import shown, present_at
from workbench.core import Activity, Link, Plan, Settings
from workbench.ui.present.shots import _plan
from workbench.ui.session import Session
from workbench.ui.timeline.row_axis import FLOOR_PX
from workbench.ui.timeline.view import TimelineView


def _rows_in_view(view) -> list[int]:
    _, (top, bottom) = view.view_box.viewRange()
    return list(range(max(0, math.ceil(top)), min(view.geometry.n_rows - 1, math.floor(bottom)) + 1))


def _labels(view):
    specs = view.row_axis.generateDrawSpecs(None)[2]
    return specs, specs.specs()


def test_present_timeline_with_groups_open_labels_every_row_of_its_page_in_full_type(qtbot):
    win = present_at(qtbot, Session(_plan(None)), 1)
    view = win.stack.currentWidget()
    qtbot.keyClick(view.plot, Qt.Key.Key_G)                    # open every group
    qtbot.wait(20)
    rows = _rows_in_view(view)
    labels, specs = _labels(view)
    assert view.geometry.n_rows > 40 and 10 <= len(rows) < view.geometry.n_rows   # a page of the rows
    assert labels.step == 1 and len(specs) == len(rows)
    assert set(labels.rows.tolist()) == set(rows)
    assert all(text for *_, text, _ in specs)                   # each label has text (elided if need be)
    assert labels.font.pixelSize() == view._font().pixelSize() > FLOOR_PX   # never smaller on a slide
    line = QFontMetricsF(labels.font).height()
    tops = sorted(top for _, top, *_ in specs)
    assert all(b - a >= line - 1.5 for a, b in zip(tops, tops[1:]))   # labels do not overlap


def chain(n: int) -> Plan:
    acts = [Activity(f"R{i}", f"Room {i} fit-out", duration=2) for i in range(n)]
    return Plan(Settings(start=dt.date(2027, 3, 1)), acts, [Link(f"R{i}", f"R{i + 1}") for i in range(n - 1)])


def _dock(qtbot, n, size):
    view = shown(qtbot, TimelineView(Session(chain(n))), size)
    view.fit_every_row()
    qtbot.wait(10)
    return view


def test_every_row_in_a_small_dock_keeps_every_label_in_smaller_type(qtbot):
    view = _dock(qtbot, 30, (590, 480))
    labels, specs = _labels(view)
    rows = _rows_in_view(view)
    assert len(rows) == 30
    assert labels.step == 1 and len(specs) == 30
    assert FLOOR_PX <= labels.font.pixelSize() < view._font().pixelSize()     # smaller type, above the floor
    assert view.row_axis.thinning_note(labels.step) == ""


def test_rows_shorter_than_the_floor_share_labels_and_the_column_says_so(qtbot):
    view = _dock(qtbot, 120, (590, 330))
    labels, specs = _labels(view)
    assert labels.step > 1 and labels.font.pixelSize() == FLOOR_PX
    assert f"1 label in {labels.step} rows" in view.row_axis.thinning_note(labels.step)
    assert len(specs) >= len(_rows_in_view(view)) // labels.step - 1
