"""The Resources slide of Present mode: shown for a plan with resources, the levelling
sentence and up to four loading charts, the most over-allocated resource first; left out
for a plan without resources; worked out again after an edit."""

import numpy as np
from reportlab.pdfbase.pdfmetrics import stringWidth

from support.ui import present_at, sample_plan
from workbench.core.commands import EditActivity
from workbench.core.demo import demo_plan
from workbench.core.levelling import level
from workbench.core.loading import Loading
from workbench.reports import styles
from workbench.reports.resource_pages import chart_title
from workbench.ui.present.resources_slide import PresentResourcesSlide, most_over_first
from workbench.ui.present.slides import build_slides
from workbench.ui.session import Session


def slide_titled(win, title):
    for k in range(win.slide_count()):
        win.go(k)
        if win.current_title() == title:
            return win.stack.currentWidget()
    raise AssertionError(f"no {title} slide")


def test_the_demo_has_a_resources_slide_with_the_core_levelling(qtbot):
    session = Session(demo_plan())
    win = present_at(qtbot, session)
    slide = slide_titled(win, "Resources")
    assert isinstance(slide, PresentResourcesSlide)
    slide.grab()                                              # paints without error
    result, pairs = slide.levelled()
    expected = level(session.plan, analysis=session.analysis)
    assert result.finish == expected.finish and len(result.moves) == len(expected.moves) == 13
    assert len(pairs) == len(session.plan.resources) == 4
    assert pairs[0][0].over and not pairs[-1][0].over           # over-allocated first, a resource within its units last


def test_the_levelling_follows_an_edit(qtbot):
    session = Session(demo_plan())
    win = present_at(qtbot, session)
    slide = slide_titled(win, "Resources")
    before, _ = slide.levelled()
    act = next(a for a in session.plan.activities if a.resources and a.duration is None)
    assert session.push(EditActivity(act.id, optimistic=act.optimistic + 5, most_likely=act.most_likely + 5,
                                      pessimistic=act.pessimistic + 5))
    after, _ = slide.levelled()
    assert after is not before and after.starts.tolist() == level(session.plan, analysis=session.analysis).starts.tolist()


def test_no_resources_slide_without_resources():
    slides = build_slides(Session(sample_plan()))
    assert "Resources" not in [title for title, _ in slides]
    for _, widget in slides:
        widget.deleteLater()


def loading(name, over):
    t = np.array([0.0, 10.0])
    return Loading(name, name, t, np.array([1.0, 0.0]), np.array([1.0, 1.0]), over)


def test_most_over_allocated_first_by_units_times_time():
    a = loading("A", [(0, 2, 3, 1)])            # 2 units over for 2 days: 4
    b = loading("B", [])
    c = loading("C", [(0, 10, 2, 1)])           # 1 unit over for 10 days: 10
    d = loading("D", [(5, 7, 3, 1)])            # 4, ties with A: plan order
    order = [early.resource for early, _ in most_over_first([a, b, c, d], [a, b, c, d])]
    assert order == ["C", "A", "D", "B"]


class Metrics:
    def stringWidth(self, text, font, size):  # noqa: N802 (reportlab's name)
        return stringWidth(text, font, size)


def test_a_chart_title_drops_its_detail_before_it_is_cut():
    title = "Electricians: over-allocated by 1 unit (5 in use, 4 available)"
    c = Metrics()
    assert chart_title(c, title, 1000) == (title, 10)
    short = "Electricians: over-allocated by 1 unit"
    assert chart_title(c, title, stringWidth(short, styles.BOLD, 10) + 1) == (short, 10)
    assert chart_title(c, title, stringWidth(short, styles.BOLD, 9) + 1) == (short, 9)
    cut, size = chart_title(c, title, 80)
    assert size == 9 and cut.startswith("Electricians") and cut.endswith("...")
    assert stringWidth(cut, styles.BOLD, 9) <= 80
