"""A platypus flowable that hands a rectangle of the page to a chart-drawing function."""

from __future__ import annotations

from reportlab.platypus import Flowable


class ChartFlowable(Flowable):
    """Draws ``paint(canvas, width, height)`` with the origin at its lower-left corner."""

    def __init__(self, width: float, height: float, paint):
        super().__init__()
        self.width, self.height, self.paint = width, height, paint

    def wrap(self, available_width, available_height):
        return self.width, self.height

    def draw(self):
        self.canv.saveState()
        self.paint(self.canv, self.width, self.height)
        self.canv.restoreState()
