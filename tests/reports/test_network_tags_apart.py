"""On the pack's Network detail pages, the tags naming a box on another page ("-> I3",
"B4 ->") never print over one another, and a link's type-and-lag label is drawn only where
the page shows it whole."""

import io

import pytest
from reportlab.pdfgen.canvas import Canvas

from workbench.core import analyze
from workbench.core.demo import demo_plan
from workbench.figures.network_layout import layout_plan
from workbench.reports import network_paint
from workbench.reports.context import PackContext
from workbench.reports.network_pages import DETAIL_NOTE_SPACE, HEADING_SPACE, detail_scale, tiles
from workbench.reports.network_paint import NetworkPainter, _free_row, link_bounds

PAGE = (770.0, 449.0 - HEADING_SPACE - DETAIL_NOTE_SPACE)     # an A4 landscape frame
SIZE = 7.5


def demo_pages():
    """The demo's pack context, network layout and detail page windows."""
    plan = demo_plan()
    analysis = analyze(plan)
    layout = layout_plan(plan, analysis)
    return PackContext(plan, analysis, None, None, "a4"), layout, tiles(layout, *PAGE, detail_scale(layout, PAGE[1]))


def overlaps(a, b) -> bool:
    (_, ax, ay, aw), (_, bx, by, bw) = a, b
    return ax - 2 < bx + bw + 2 and bx - 2 < ax + aw + 2 and ay - 2 < by + SIZE + 1 and by - 2 < ay + SIZE + 1


def test_tags_on_every_demo_detail_page_stand_apart(monkeypatch):
    ctx, layout, views = demo_pages()
    pages = []
    real = NetworkPainter._off_page_tag

    def keep(self, c, link, shown, top, placed):
        if not pages or pages[-1] is not placed:
            pages.append(placed)
        return real(self, c, link, shown, top, placed)

    monkeypatch.setattr(NetworkPainter, "_off_page_tag", keep)
    boxes = link_bounds(layout)
    for view in views:
        canvas = Canvas(io.BytesIO(), pagesize=(PAGE[0] + 40, PAGE[1] + 40))
        NetworkPainter(ctx, layout, view, boxes).paint(canvas, *PAGE)
    tags = sum(len(p) for p in pages)
    assert len(views) > 3 and tags > 20
    for placed in pages:
        for i, a in enumerate(placed):
            for b in placed[i + 1:]:
                assert not overlaps(a, b), (a, b)


def test_a_clashing_tag_moves_to_the_nearest_free_row():
    placed = [("-> I3", 100.0, 200.0, 30.0)]
    assert _free_row(placed, 110.0, 202.0, 30.0, SIZE, 0.0, 400.0) == pytest.approx(202.0 - (SIZE + 5.0))
    assert _free_row(placed, 300.0, 200.0, 30.0, SIZE, 0.0, 400.0) == 200.0          # far away: stays
    low = [("a", 100.0, 5.0, 30.0)]
    assert _free_row(low, 100.0, 5.0, 30.0, SIZE, 2.0, 400.0) == pytest.approx(5.0 + SIZE + 5.0)   # no room below


def test_a_lag_label_cut_by_the_page_edge_is_left_to_the_other_page(monkeypatch):
    ctx, layout, views = demo_pages()
    drawn = []
    real = Canvas.drawCentredString

    def record(self, x, y, text, *args, **kwargs):
        drawn.append((self._pagesize, x, y, text))
        return real(self, x, y, text, *args, **kwargs)

    monkeypatch.setattr(Canvas, "drawCentredString", record)
    for view in views:
        canvas = Canvas(io.BytesIO(), pagesize=PAGE)
        drawn.clear()
        NetworkPainter(ctx, layout, view, link_bounds(layout)).paint(canvas, *PAGE)
        page_w, page_h = view.w * view.scale, view.h * view.scale
        for _, x, y, text in drawn:
            if text.startswith(("SS", "FF", "SF", "FS")):
                width = canvas.stringWidth(text, network_paint.styles.BOLD, 7.5)
                assert x - width / 2 >= 0 and x + width / 2 <= page_w and PAGE[1] - page_h <= y - 3, (text, x, y)
