"""The Network slide of Present mode: the pack's activity-on-node diagram, filling the
slide (its logical page takes the screen's shape). A wide network wraps like text into
strips set one under another, as many as make the diagram largest (``network_wrap``).
When even that leaves an id below ID_PX pixels, the diagram is shown in parts just large
enough that every id reads from the back of a room, set one under another on a slide while
they fit; [ and ] step between slides only when there is more than one."""

from __future__ import annotations

from reportlab.pdfbase.pdfmetrics import stringWidth

from workbench.figures.network_layout import layout_plan
from workbench.reports import styles
from workbench.reports.network_pages import MARGIN_UNITS, overview_view, tiles
from workbench.reports.network_paint import MIN_DETAIL_SCALE, NetworkPainter, View

from workbench.ui.present.chart_slide import LOGICAL_H, LOGICAL_W, MARGIN_PX, PresentChartSlide, session_context
from workbench.ui.present.network_wrap import ROW_GAP, placed, wrapped

PARTS_HINT = "[ and ]: other parts of the network"
ID_PX = 17.0          # smallest id on the projector, in pixels
OVERVIEW_ID_SHARE = 0.6   # overview boxes set their id at up to this share of the box height
OVERVIEW_ID_MAX = 14.0    # … and at most this many points


def id_points(layout, scale: float) -> float:
    """Size (points) at which the overview draws the tightest id at ``scale`` points per unit."""
    b = layout.boxes
    if not len(b):
        return OVERVIEW_ID_MAX
    widths = [stringWidth(n.id, styles.BOLD, 1.0) for n in layout.nodes]
    by_width = min((w * scale - 4) / max(sw, 1e-6) for w, sw in zip(b[:, 2], widths))
    return min(OVERVIEW_ID_MAX, OVERVIEW_ID_SHARE * float(b[:, 3].min()) * scale, by_width)


def readable_scale(layout, px_per_point: float, fit: float) -> float:
    """The smallest scale (points per unit, not below ``fit``) at which ids reach ID_PX."""
    lo, hi = fit, MIN_DETAIL_SCALE * 0.95      # stay in overview drawing (ids fill the box)
    if id_points(layout, lo) * px_per_point >= ID_PX:
        return lo
    for _ in range(40):                         # bisection: id size grows with the scale
        mid = (lo + hi) / 2
        lo, hi = (lo, mid) if id_points(layout, mid) * px_per_point >= ID_PX else (mid, hi)
    return hi


def network_parts(layout, w: float, h: float, px_per_point: float) -> list[View]:
    """Windows of the layout that fill w × h points with ids at least ID_PX high."""
    whole = overview_view(layout, w, h)
    scale = readable_scale(layout, px_per_point, whole.scale)
    if scale <= whole.scale + 1e-12:
        return [whole]
    views = _occupied(layout, tiles(layout, w, h, scale))
    # as many parts, but sharing the width evenly (a larger scale, no near-empty last part)
    even = min(len(views) * w / (layout.width + 2 * MARGIN_UNITS), h / (layout.height + 2 * MARGIN_UNITS),
               MIN_DETAIL_SCALE * 0.95)
    if even > scale:
        wider = _occupied(layout, tiles(layout, w, h, even))
        if len(wider) == len(views):
            views = wider
    return views or [whole]


def _occupied(layout, views: list[View]) -> list[View]:
    b = layout.boxes
    return [v for v in views if ((b[:, 0] + b[:, 2] >= v.x0) & (b[:, 0] <= v.x0 + v.w)
                                 & (b[:, 1] + b[:, 3] >= v.y0) & (b[:, 1] <= v.y0 + v.h)).any()]


def slide_groups(views: list[View], h: float) -> list[list[View]]:
    """Parts grouped into slides: a wide, shallow network wraps like text, its parts set
    one under another while they fit the slide's height, so it splits only when it must."""
    groups: list[list[View]] = []
    used = h + 1.0
    for view in views:
        tall = view.h * view.scale
        if groups and used + ROW_GAP + tall <= h:
            groups[-1].append(view)
            used += ROW_GAP + tall
        else:
            groups.append([view])
            used = tall
    return groups


class PresentNetworkSlide(PresentChartSlide):
    """The diagram part by part; ``part`` is the one shown."""

    @property
    def present_hint(self) -> str:
        """The keys, said only when the diagram is in parts (not when it wraps onto one slide)."""
        ctx = session_context(self.session)
        if ctx is None or self._legible_strips(layout_plan(ctx.plan, ctx.analysis), *self.logical):
            return ""
        return PARTS_HINT

    def __init__(self, session, parent=None):
        super().__init__(session, self._paint_network, parent)
        self.part = 0
        self.part_count = 1
        session.schedule_changed.connect(self._reset)

    def _reset(self) -> None:
        self.part = 0

    def parts(self, ctx, w: float, h: float) -> tuple[object, list[View]]:
        layout = layout_plan(ctx.plan, ctx.analysis)
        return layout, network_parts(layout, w, h, self.scale_and_origin()[0])

    def resizeEvent(self, event):  # noqa: N802 (Qt override)
        """The logical page takes the slide's shape (at the other slides' points per pixel),
        so the diagram can use the whole screen."""
        super().resizeEvent(event)
        room_w, room_h = max(self.width() - 2 * MARGIN_PX, 1), max(self.height() - 2 * MARGIN_PX, 1)
        k = max(min(room_w / LOGICAL_W, room_h / LOGICAL_H), 0.1)
        self.logical = (room_w / k, room_h / k)

    def _legible_strips(self, layout, w: float, h: float) -> list:
        """The strips that fill w × h points, when their ids read (else empty); worked out
        once per analysis and page size."""
        key = (w, h, self.scale_and_origin()[0])
        kept = getattr(self, "_kept_strips", None)
        if kept is not None and kept[0] is self.session.analysis and kept[1] == key:
            return kept[2]
        views = self._strips_now(layout, w, h)
        self._kept_strips = (self.session.analysis, key, views)
        return views

    def _strips_now(self, layout, w: float, h: float) -> list:
        views = wrapped(layout, w, h)
        legible = views and id_points(layout, views[0].scale) * self.scale_and_origin()[0] >= ID_PX
        return views if legible else []

    def _paint_network(self, canvas, ctx, w, h) -> None:
        layout = layout_plan(ctx.plan, ctx.analysis)
        views = self._legible_strips(layout, w, h)
        if views:
            self.part_count, self.part = 1, 0
            for view, (left, top) in zip(views, placed(views, w, h)):
                canvas.saveState()
                canvas.translate(left, 0)
                NetworkPainter(ctx, layout, view).paint(canvas, w, top)
                canvas.restoreState()
            return
        self._paint_parts(canvas, ctx, w, h)

    def _paint_parts(self, canvas, ctx, w, h) -> None:
        """The diagram in parts at the smallest scale at which every id reads (too large
        to wrap onto one slide legibly)."""
        layout, views = self.parts(ctx, w, h - 16)      # a line at the top names the part
        groups = slide_groups(views, h - 16) if len(views) > 1 else [views]
        self.part_count = len(groups)
        self.part = min(self.part, len(groups) - 1)
        top = h - 16 if len(groups) > 1 else h
        for view in groups[self.part]:
            NetworkPainter(ctx, layout, view).paint(canvas, w, top)
            top -= view.h * view.scale + ROW_GAP
        if len(groups) > 1:
            canvas.setFont(styles.BOLD, 10)
            canvas.setFillColor(styles.TEXT)
            canvas.drawString(0, h - 10, f"Part {self.part + 1} of {len(groups)}")

    def step_part(self, step: int) -> None:
        self.part = max(0, min(self.part + step, self.part_count - 1))
        self.update()

    def keyPressEvent(self, event):  # noqa: N802
        from PySide6.QtCore import Qt
        steps = {Qt.Key.Key_BracketLeft: -1, Qt.Key.Key_BracketRight: 1}
        if event.key() in steps:
            self.step_part(steps[event.key()])
        else:
            super().keyPressEvent(event)
