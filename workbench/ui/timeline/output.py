"""PNG, SVG, print and PDF output of the Timeline: one paint routine for all of them.

:func:`render_to` draws the chart (labels, dates, bars, lines) onto any paint device
scaled to fit; the print preview, the printer, PDF, SVG and PNG all go through it.
"""

from __future__ import annotations

import datetime as dt

from PySide6.QtCore import QBuffer, QIODevice, QRectF, QSize, Qt
from PySide6.QtGui import QColor, QFont, QImage, QPainter, QPicture
from PySide6.QtWidgets import QApplication, QFileDialog, QMessageBox

from workbench.core.formatting import format_date
from workbench.figures import style
from workbench.io import atomic


def render_to(view, painter: QPainter, target: QRectF) -> None:
    """Draw the view's chart into ``target`` on an active painter (keeps the aspect ratio).

    The chart is first recorded at its on-screen size (where every item, including the
    labelled lines, works out its geometry for screen pixels) and then replayed scaled
    as vectors: the page, the PDF, the SVG and the image get the very same drawing.
    """
    plot = view.plot
    source = QRectF(plot.viewport().rect())
    picture = QPicture()
    selected = view.item.selected_rows()
    view.item.set_selection([])            # the page shows the plan, not the pointer's state
    recorder = QPainter(picture)
    recorder.setRenderHint(QPainter.RenderHint.Antialiasing)
    recorder.setRenderHint(QPainter.RenderHint.TextAntialiasing)
    plot.render(recorder, source, source.toRect())
    recorder.end()
    view.item.set_selection(selected)
    scale = min(target.width() / source.width(), target.height() / source.height())
    painter.save()
    painter.fillRect(target, QColor(style.BACKGROUND))
    painter.translate(target.left() + (target.width() - source.width() * scale) / 2,
                      target.top() + (target.height() - source.height() * scale) / 2)
    device = painter.device()   # playing a picture rescales it by the dpi ratio: undo that
    painter.scale(scale * picture.logicalDpiX() / device.logicalDpiX(),
                  scale * picture.logicalDpiY() / device.logicalDpiY())
    picture.play(painter)
    painter.restore()


def _with_size(view, size):
    """Context: temporarily lay the view out at ``size`` (pixels) so text stays full size."""
    class _Sized:
        def __enter__(self):
            self.old = view.size()
            if size is not None:
                view.resize(QSize(*size))
            QApplication.processEvents()
            return view

        def __exit__(self, *exc):
            if size is not None:
                view.resize(self.old)
            return False
    return _Sized()


def render_image(view, size=None) -> QImage:
    """The chart as an image of ``size`` = (width, height) pixels (default: as on screen)."""
    with _with_size(view, size):
        vp = view.plot.viewport().size()
        image = QImage(vp, QImage.Format.Format_ARGB32_Premultiplied)
        image.fill(QColor(style.BACKGROUND))
        painter = QPainter(image)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        painter.setRenderHint(QPainter.RenderHint.TextAntialiasing)
        render_to(view, painter, QRectF(image.rect()))
        painter.end()
    return image


OUTPUT_WIDTH = 1800          # pixels: wide enough that the label column holds whole names
MAX_IMAGE_PX = 30000         # an image's height limit (QImage stops near 32,767)
AXIS_PX = 60.0               # the date axis under the rows


class whole_rows:
    """Context: the view laid out at ``size`` showing rows ``first`` .. ``first + count``
    across the whole time span, the label column wide enough for whole labels; the view's
    size, range and label column are put back afterwards."""

    def __init__(self, view, first: int, count: int, size: tuple[int, int]):
        self.view, self.first, self.count, self.size = view, first, count, size

    def __enter__(self):
        view = self.view
        self.old_size, self.old_range = view.size(), view.view_box.viewRange()
        view.resize(QSize(*self.size))
        QApplication.processEvents()
        view.row_axis.setWidth(view.row_axis.preferred_width(view._font(), 0.45 * self.size[0]))
        lo, hi = view.geometry.x_range
        pad = 0.03 * (hi - lo)
        height = max(view.view_box.height(), 200.0)
        header_px = 4.0 * view._font().pixelSize()
        header = header_px * self.count / max(height - header_px, 1.0)
        view.view_box.setRange(xRange=(lo - pad, hi + pad),
                               yRange=(self.first - 0.5 - header, self.first + self.count - 0.4), padding=0)
        QApplication.processEvents()
        return view

    def __exit__(self, *exc):
        view = self.view
        view.resize(self.old_size)
        QApplication.processEvents()
        view.view_box.setRange(xRange=self.old_range[0], yRange=self.old_range[1], padding=0)
        view._fit_label_column()
        return False


def whole_plan_size(view) -> tuple[int, int]:
    """An image size holding every row at a legible pitch (labels whole)."""
    n = max(view.geometry.n_rows, 1) if view.geometry is not None else 1
    pitch = view.legible_row_pitch() * 1.15
    header = 4.0 * view._font().pixelSize()
    return max(OUTPUT_WIDTH, view.width()), int(min(MAX_IMAGE_PX, header + AXIS_PX + n * pitch + 40))


def export_png(view, path, size=None) -> None:
    """The whole plan as one image: every row, the whole time span, labels whole."""
    if view.geometry is None:
        image = render_image(view, size)
    else:
        size = size or whole_plan_size(view)
        with whole_rows(view, 0, max(view.geometry.n_rows, 1), size):
            image = render_image(view)
    buffer = QBuffer()
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    if not image.save(buffer, "PNG"):
        raise OSError(f"could not write the PNG file {path}")
    atomic.write_file(path, bytes(buffer.data()), accept_owner_change=True)


def export_svg(view, path) -> None:
    from PySide6.QtSvg import QSvgGenerator
    vp = view.plot.viewport().size()
    gen, buffer = QSvgGenerator(), QBuffer()
    gen.setOutputDevice(buffer)
    gen.setSize(vp)
    gen.setViewBox(QRectF(0, 0, vp.width(), vp.height()))
    gen.setTitle("Timeline")
    painter = QPainter(gen)
    render_to(view, painter, QRectF(0, 0, vp.width(), vp.height()))
    painter.end()
    if not buffer.data().size():
        raise OSError(f"could not write the SVG file {path}")
    atomic.write_file(path, bytes(buffer.data()), accept_owner_change=True)


PAGE_VIEW = (1600, 1000)     # the layout each printed page is drawn at, then scaled to the paper


def page_rows(view) -> list[tuple[int, int]]:
    """(first row, count) per printed page: every row, as many a page as stay legible,
    shared evenly (no page with a last row or two)."""
    n = max(view.geometry.n_rows, 1) if view.geometry is not None else 1
    room = PAGE_VIEW[1] - 4.0 * view._font().pixelSize() - AXIS_PX - 60
    per_page = max(5, int(room / (view.legible_row_pitch() * 1.1)))
    pages = -(-n // per_page)
    size = -(-n // pages)
    return [(k, min(size, n - k)) for k in range(0, n, size)]


def paint_page(view, printer) -> None:
    """The printer/PDF/preview paint routine: the whole plan, tiled by rows over as many
    pages as it needs, each page the whole time span with whole labels."""
    painter = QPainter(printer)
    page = QRectF(painter.viewport())
    font = QFont()
    font.setPixelSize(max(12, int(page.height() / 45)))
    font.setBold(True)
    tiles = page_rows(view) if view.geometry is not None else [None]
    for k, tile in enumerate(tiles):
        if k:
            printer.newPage()
        painter.setFont(font)
        head = painter.fontMetrics().height() * 1.6
        title = _page_title(view) + (f"   \u00b7   page {k + 1} of {len(tiles)}" if len(tiles) > 1 else "")
        painter.drawText(QRectF(page.left(), page.top(), page.width(), head),
                         int(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignVCenter), title)
        if tile is None:
            render_to(view, painter, page.adjusted(0, head, 0, 0))
            continue
        with whole_rows(view, tile[0], tile[1], PAGE_VIEW):
            render_to(view, painter, page.adjusted(0, head, 0, 0))
    painter.end()


def _page_title(view) -> str:
    settings = view.session.plan.settings
    parts = [f"Timeline \u2014 {settings.title}"]
    if settings.revision:
        parts.append(f"revision {settings.revision}")
    parts.append(f"printed {format_date(dt.date.today())}")
    return "   \u00b7   ".join(parts)


def print_preview(view) -> None:
    from PySide6.QtPrintSupport import QPrintPreviewDialog, QPrinter
    from PySide6.QtGui import QPageLayout
    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    printer.setPageOrientation(QPageLayout.Orientation.Landscape)
    dialog = QPrintPreviewDialog(printer, view)
    dialog.paintRequested.connect(lambda p: paint_page(view, p))
    dialog.exec()


def export_pdf(view, path) -> None:
    from PySide6.QtPrintSupport import QPrinter
    from PySide6.QtGui import QPageLayout
    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    printer.setOutputFormat(QPrinter.OutputFormat.PdfFormat)
    printer.setOutputFileName(str(path))
    printer.setPageOrientation(QPageLayout.Orientation.Landscape)
    paint_page(view, printer)


def ask_and_export(view, kind: str) -> None:
    filters = {"png": "PNG image (*.png)", "svg": "SVG drawing (*.svg)"}
    path, _ = QFileDialog.getSaveFileName(view, f"Export the Timeline as {kind.upper()}",
                                          view.session.in_folder(f"timeline.{kind}"), filters[kind])
    if not path:
        return
    try:
        (export_png if kind == "png" else export_svg)(view, path)
    except OSError as exc:
        QMessageBox.warning(view, "Export", str(exc))
