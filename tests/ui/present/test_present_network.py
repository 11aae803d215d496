"""Present mode's Network slide: the diagram in parts whose ids are at least ~16 px high on
a 1024×768 projector, wrapped onto one slide while they fit; [ and ] step between slides;
together they show every node."""

from __future__ import annotations

import pytest
from PySide6.QtCore import Qt

from workbench.reports import styles
from workbench.ui.present import canvas as present_canvas
from workbench.ui.present.network_slide import ID_PX, PresentNetworkSlide
from workbench.ui.present.shots import _plan
from workbench.ui.session import Session

from support.ui import present_at


@pytest.fixture
def shown(qtbot):
    win = present_at(qtbot, Session(_plan(None)), 2)
    slide = win.stack.currentWidget()
    assert isinstance(slide, PresentNetworkSlide)
    return win, slide


def drawn_ids(slide, monkeypatch) -> dict[str, float]:
    """Node ids drawn on the slide and their height in screen pixels (font size × scale)."""
    ids = set(slide.session.plan.ids())
    seen: dict[str, float] = {}
    original = present_canvas.PresentCanvas._text

    def spy(canvas, x, y, text, anchor):
        name, size = canvas._font
        if name == styles.BOLD and str(text) in ids:
            seen[str(text)] = size * slide.scale_and_origin()[0]
        return original(canvas, x, y, text, anchor)
    monkeypatch.setattr(present_canvas.PresentCanvas, "_text", spy)
    slide.grab()
    return seen


def test_ids_are_large_enough_to_read_on_a_projector(shown, monkeypatch):
    _, slide = shown
    seen = drawn_ids(slide, monkeypatch)
    assert len(seen) >= 5
    assert min(seen.values()) >= 16.0 and ID_PX >= 16.0


def test_a_wide_network_wraps_onto_one_slide_with_every_node(shown, monkeypatch):
    """The demo is too wide for one row at a readable size: its parts are set one under
    another on the same slide rather than split across slides."""
    _, slide = shown
    seen = drawn_ids(slide, monkeypatch)
    assert slide.part_count == 1 and set(seen) == set(slide.session.plan.ids())
    assert min(seen.values()) >= 16.0


def test_parts_together_show_every_node_and_keys_step_through_them(qtbot, monkeypatch):
    from support.plans import long_plan
    win = present_at(qtbot, Session(long_plan(150)), 2)
    slide = win.stack.currentWidget()
    everything = set(slide.session.plan.ids())
    union = set(drawn_ids(slide, monkeypatch))
    assert slide.part_count >= 2                    # 150 activities need more than one slide
    for k in range(1, slide.part_count):
        qtbot.keyClick(slide, Qt.Key.Key_BracketRight)
        assert slide.part == k and win.current_title() == "Network"
        union |= set(drawn_ids(slide, monkeypatch))
    assert union == everything
    qtbot.keyClick(slide, Qt.Key.Key_BracketRight)  # stops at the last part
    assert slide.part == slide.part_count - 1
    qtbot.keyClick(slide, Qt.Key.Key_BracketLeft)
    assert slide.part == slide.part_count - 2


def test_a_small_network_shows_whole_on_one_part(qtbot, monkeypatch):
    from support.plans import footbridge_plan
    slide = PresentNetworkSlide(Session(footbridge_plan()))
    qtbot.addWidget(slide)
    slide.resize(1024, 640)
    seen = drawn_ids(slide, monkeypatch)
    assert slide.part_count == 1 and set(seen) == set(slide.session.plan.ids())
    assert min(seen.values()) >= 16.0


def inked_box(image) -> tuple[int, int, int, int]:
    """Bounding box (left, top, right, bottom) of the pixels that are not white."""
    import numpy as np
    from PySide6.QtGui import QImage
    image = image.convertToFormat(QImage.Format.Format_RGB32)
    rgb = np.frombuffer(image.constBits(), np.uint8).reshape(image.height(), image.bytesPerLine() // 4, 4)
    ink = (rgb[:, :image.width(), :3] < 235).any(axis=2)
    rows, cols = np.flatnonzero(ink.any(axis=1)), np.flatnonzero(ink.any(axis=0))
    return int(cols[0]), int(rows[0]), int(cols[-1]), int(rows[-1])


def test_the_wrapped_demo_fills_the_slide(shown, monkeypatch):
    """At 1024×768 the demo's strips together use most of the slide's width and height."""
    _, slide = shown
    left, top, right, bottom = inked_box(slide.grab().toImage())
    assert (right - left) >= 0.9 * slide.width(), (left, right, slide.width())
    assert (bottom - top) >= 0.85 * slide.height(), (top, bottom, slide.height())
    seen = drawn_ids(slide, monkeypatch)
    assert slide.part_count == 1 and set(seen) == set(slide.session.plan.ids())
    assert min(seen.values()) >= ID_PX


def test_a_small_network_fills_the_slide_in_one_strip(qtbot, monkeypatch):
    from support.plans import footbridge_plan
    slide = PresentNetworkSlide(Session(footbridge_plan()))
    qtbot.addWidget(slide)
    slide.resize(1024, 640)
    left, top, right, bottom = inked_box(slide.grab().toImage())
    assert (right - left) >= 0.9 * slide.width() or (bottom - top) >= 0.9 * slide.height()


@pytest.mark.parametrize("count", [1, 2, 3, 5])
def test_strips_hold_every_box_once_and_whole(count):
    from support.plans import long_plan
    from workbench.core import analyze
    from workbench.figures.network_layout import layout_plan
    from workbench.ui.present.network_wrap import strips
    for plan in (_plan(None), long_plan(60)):
        layout = layout_plan(plan, analyze(plan))
        views = strips(layout, count)
        assert 1 <= len(views) <= count
        rows = [r for v in views for r in v.rows]
        assert sorted(rows) == list(range(len(layout.boxes)))          # each box in one strip
        for v in views:
            b = layout.boxes[sorted(v.rows)]
            assert (b[:, 0] >= v.x0).all() and (b[:, 0] + b[:, 2] <= v.x0 + v.w).all()
            assert (b[:, 1] >= v.y0).all() and (b[:, 1] + b[:, 3] <= v.y0 + v.h).all()


def test_the_part_keys_are_named_only_when_there_are_parts(qtbot, shown):
    from support.plans import long_plan
    from workbench.ui.present.network_slide import PARTS_HINT
    win, _ = shown
    assert PARTS_HINT not in win.counter.text()              # the demo wraps onto one slide
    many = present_at(qtbot, Session(long_plan(150)), 2)
    assert PARTS_HINT in many.counter.text()                 # 150 activities come in parts
