"""Present mode's Network slide: the diagram in parts whose ids are at least ~16 px high on
a 1024×768 projector; [ and ] step between parts; together the parts show every node."""

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


def test_parts_together_show_every_node_and_keys_step_through_them(shown, qtbot, monkeypatch):
    win, slide = shown
    everything = set(slide.session.plan.ids())
    union = set(drawn_ids(slide, monkeypatch))
    assert slide.part_count >= 2                    # the demo network is too wide for one
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
