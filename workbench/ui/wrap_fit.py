"""Word-wrapped labels that keep their whole text in a dock's scroller.

A view holding a wrapped label reports a height for its width; a dock's scroller then
makes the view as tall as its layout would *like* at that width (every chart at its
preferred height), not as tall as it *needs*, and the dock scrolls where it need not. A
view that says it has no height for its width, and keeps each wrapped label's least
height at what its text needs at the label's present width (``WrapHeight``), is given
the dock's height down to its true minimum, and only then scrolls."""

from __future__ import annotations

from PySide6.QtCore import QEvent, QObject, QRect, Qt
from PySide6.QtWidgets import QLabel


def wrapped_height(label: QLabel) -> int:
    """The height ``label``'s plain text takes wrapped at the label's width (its own
    ``heightForWidth`` never reports less than the least height already set)."""
    m = label.contentsMargins()
    inner = max(1, label.width() - m.left() - m.right() - 2 * label.margin())
    flags = int(label.alignment()) | int(Qt.TextFlag.TextWordWrap)
    text = label.fontMetrics().boundingRect(QRect(0, 0, inner, 1_000_000), flags, label.text())
    return text.height() + m.top() + m.bottom() + 2 * label.margin()


class WrapHeight(QObject):
    """Keeps each word-wrapped label's least height at what its text needs at its present
    width, so the view's minimum size is honest without reporting a height for its width
    (a dock's scroller would then make the view as tall as it would like, not as it needs)."""

    def __init__(self, labels, parent):
        super().__init__(parent)
        self.labels = list(labels)
        for label in self.labels:
            label.installEventFilter(self)
        for holder in {label.parentWidget() for label in self.labels} - {None}:
            holder.installEventFilter(self)     # a new text asks its holder to lay out again

    def eventFilter(self, obj, event):  # noqa: N802 (Qt override)
        if event.type() == QEvent.Type.Resize and obj in self.labels:
            self.fit(obj)
        elif event.type() == QEvent.Type.LayoutRequest:
            self.fit_all()
        return False

    def fit(self, label: QLabel) -> None:
        need = wrapped_height(label) if label.text() else 0
        if label.minimumHeight() != need:
            label.setMinimumHeight(need)

    def fit_all(self) -> None:
        for label in self.labels:
            self.fit(label)
