"""Fitting, zooming, panning and the Timeline's keys (a part of ``TimelineView``).

Kept apart from the view's construction and drawing; every method works on the view's
own ``view_box``, ``geometry`` and ``row_axis``.
"""

from __future__ import annotations

from PySide6.QtCore import QEvent, QObject, Qt

from workbench.figures import style
from workbench.ui.timeline.present import page_of_rows, present_key, stack_finish_labels
from workbench.ui.timeline.row_axis import legible_pitch

HEADER_PX = 44.0       # empty band above row 0, at least: the reference lines' labels
HEADER_AIR_PX = 4.0    # below the last line of labels
MIN_FULL_ROWS = 5      # a fit on opening keeps full-height rows when this many fit


class TimelineNavigation:
    """Mixed into ``TimelineView``: what the view shows of the plan, and moving it."""

    def fit_all(self, rows_to_fit: bool = False, every_row: bool | None = None) -> None:
        """Fit the plan's dates to the width, and as many rows as stay legible from the top.

        Rows shrink to fit the height, but not below the pitch where each row keeps its
        own label (``legible_pitch``); the rows below are reached by scrolling. With
        ``rows_to_fit`` rows stay at full size; with ``every_row`` every row is squeezed
        in (labels in smaller type, or thinned). Present mode shows every row when they
        fit at that pitch, else the page ``row_page`` of them (``page_of_rows``).
        """
        geo = self.geometry
        if geo is None:
            return
        paged = every_row is None and self._weights is style.PRESENT
        lo, hi = geo.x_range
        pad = 0.03 * (hi - lo)
        height = self.view_box.height() if self.view_box.height() > 1 else 200.0   # 200: not laid out yet
        header_px = min(self._header_px((lo - pad, hi + pad)), max(height - self.legible_row_pitch(), 0.5 * height))
        self.row_axis.set_page(0, "")
        if paged:
            first, n, header_px = page_of_rows(self, max(geo.n_rows, 1), height, header_px)
        else:
            first, n = 0, self._rows_in_fit(max(geo.n_rows, 1), height - header_px, rows_to_fit, bool(every_row))
        self.page_first = self.item.first_row = first
        header = header_px * n / max(height - header_px, 1.0)
        self.view_box.setLimits(yMin=min(self.view_box.state["limits"]["yLimits"][0], -0.5 - header))
        bottom = first + n - (0.5 if paged else 0.4)          # a page: no part of the next row
        self.view_box.setRange(xRange=(lo - pad, hi + pad), yRange=(first - 0.5 - header, bottom), padding=0)
        stack_finish_labels(self)

    def _header_px(self, x_range: tuple[float, float]) -> float:
        """The band above row 0 for the line labels at ``x_range``: as many lines as they
        take apart from each other (``TimelineLines.header_lines``), at least ``HEADER_PX``."""
        lines = self.reference.header_lines(x_range, self.view_box.width())
        return max(HEADER_PX, lines * (self.reference.label_height() + 1.0) + HEADER_AIR_PX)

    def _rows_in_fit(self, n: int, room_px: float, rows_to_fit: bool, every_row: bool) -> int:
        """How many rows (from the top) a fit shows in ``room_px`` pixels: never so many
        that a row falls below the legible pitch (the rest are reached by scrolling),
        except with ``every_row``; with ``rows_to_fit`` at full row height when at least
        a few rows fit so."""
        if every_row:            # asked for (Every row)
            return n
        legible = max(1, int(room_px / self.legible_row_pitch() - 0.1))
        if rows_to_fit:
            full = int(room_px / self._weights.row_height)
            return min(n, full if full >= MIN_FULL_ROWS else legible)
        return min(n, legible)

    def legible_row_pitch(self) -> float:
        """Row pitch in pixels below which the label column starts thinning labels."""
        return legible_pitch(self._font())

    def fit_every_row(self) -> None:
        """Squeeze every row into the view (labels thinned when rows are short)."""
        self.fit_all(every_row=True)

    def zoom(self, factor: float) -> None:
        self._auto_fit = False
        self.view_box.scaleBy((1.0 / factor, 1.0))

    def pan(self, dx_frac: float = 0.0, dy_rows: float = 0.0) -> None:
        self._auto_fit = False
        (x0, x1), _ = self.view_box.viewRange()
        self.view_box.translateBy(x=dx_frac * (x1 - x0), y=dy_rows)

    def eventFilter(self, obj: QObject, event: QEvent) -> bool:
        if event.type() == QEvent.Type.KeyPress and obj is getattr(self, "plot", None):
            return self._key(event.key())
        return super().eventFilter(obj, event)

    def _key(self, key) -> bool:
        K = Qt.Key
        actions = {K.Key_Plus: lambda: self.zoom(1.25), K.Key_Equal: lambda: self.zoom(1.25),
                   K.Key_Minus: lambda: self.zoom(0.8), K.Key_Left: lambda: self.pan(-0.1),
                   K.Key_Right: lambda: self.pan(0.1), K.Key_Up: lambda: self.pan(dy_rows=-3),
                   K.Key_Down: lambda: self.pan(dy_rows=3), K.Key_Home: self.fit_all,
                   K.Key_0: self.fit_all, K.Key_Escape: self.cancel_drag}
        if self.present_hint and present_key(self, key):
            return True
        if key in actions:
            actions[key]()
            return True
        return False
