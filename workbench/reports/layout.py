"""The pack's document: portrait text pages, landscape chart pages, section bookmarks."""

from __future__ import annotations

from reportlab.platypus import BaseDocTemplate, Flowable, Frame, NextPageTemplate, PageBreak, PageTemplate

from . import styles

PORTRAIT, LANDSCAPE = "portrait", "landscape"


class PackDocument(BaseDocTemplate):
    """A4 or letter; page templates ``portrait`` and ``landscape``; invariant output."""

    def __init__(self, target, paper: str, title: str, author: str, creator: str, on_page=None):
        size = styles.page_size(paper)
        super().__init__(target, pagesize=size, invariant=1, title=title, author=author,
                         creator=creator, subject="Approval pack", pageCompression=1)
        self.addPageTemplates([_template(PORTRAIT, size, on_page),
                               _template(LANDSCAPE, styles.landscape_size(paper), on_page)])


def _template(name: str, size: tuple[float, float], on_page=None) -> PageTemplate:
    frame = Frame(styles.MARGIN, styles.MARGIN + styles.FOOTER_SPACE - 12,
                  size[0] - 2 * styles.MARGIN, size[1] - 2 * styles.MARGIN - styles.FOOTER_SPACE + 12,
                  leftPadding=0, rightPadding=0, topPadding=0, bottomPadding=0, id=name)
    hook = on_page or (lambda canvas, doc: None)
    return PageTemplate(id=name, frames=[frame], pagesize=size, onPage=hook)


def frame_size(paper: str, orientation: str) -> tuple[float, float]:
    """Width and height available to flowables on a page of this orientation."""
    size = styles.page_size(paper) if orientation == PORTRAIT else styles.landscape_size(paper)
    return (size[0] - 2 * styles.MARGIN, size[1] - 2 * styles.MARGIN - styles.FOOTER_SPACE + 12)


def new_page(orientation: str) -> list[Flowable]:
    """Flowables that start a fresh page in the given orientation."""
    return [NextPageTemplate(orientation), PageBreak()]


class Section(Flowable):
    """An invisible marker: a bookmark and an outline entry for the page it lands on."""

    def __init__(self, title: str, key: str):
        super().__init__()
        self.title, self.key = title, key
        self.width = self.height = 0

    def wrap(self, available_width, available_height):
        return 0, 0

    def draw(self):
        self.canv.bookmarkPage(self.key)
        self.canv.addOutlineEntry(self.title, self.key, level=0, closed=False)
