"""PNG, SVG, print and PDF output of the Timeline: one paint routine for all of them.

:func:`render_to` draws the chart (labels, dates, bars, lines) onto any paint device
scaled to fit; the print preview, the printer, PDF, SVG and PNG all go through it.
"""

from __future__ import annotations

import datetime as dt
from pathlib import Path

from PySide6.QtCore import QRectF, QSize, Qt
from PySide6.QtGui import QColor, QFont, QImage, QPainter, QPicture
from PySide6.QtWidgets import QApplication, QFileDialog, QMessageBox

from workbench.figures import style


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


def export_png(view, path, size=None) -> None:
    image = render_image(view, size)
    if not image.save(str(path), "PNG"):
        raise OSError(f"could not write the PNG file {path}")


def export_svg(view, path) -> None:
    from PySide6.QtSvg import QSvgGenerator
    vp = view.plot.viewport().size()
    gen = QSvgGenerator()
    gen.setFileName(str(path))
    gen.setSize(vp)
    gen.setViewBox(QRectF(0, 0, vp.width(), vp.height()))
    gen.setTitle("Timeline")
    painter = QPainter(gen)
    render_to(view, painter, QRectF(0, 0, vp.width(), vp.height()))
    painter.end()
    if not Path(path).exists():
        raise OSError(f"could not write the SVG file {path}")


def paint_page(view, printer) -> None:
    """The printer/PDF/preview paint routine: the chart fitted to the printable page."""
    painter = QPainter(printer)
    page = QRectF(painter.viewport())
    title = _page_title(view)
    font = QFont()
    font.setPixelSize(max(12, int(page.height() / 45)))
    font.setBold(True)
    painter.setFont(font)
    head = painter.fontMetrics().height() * 1.6
    painter.drawText(QRectF(page.left(), page.top(), page.width(), head),
                     int(Qt.AlignmentFlag.AlignLeft | Qt.AlignmentFlag.AlignVCenter), title)
    render_to(view, painter, page.adjusted(0, head, 0, 0))
    painter.end()


def _page_title(view) -> str:
    settings = view.session.plan.settings
    parts = [f"Timeline \u2014 {settings.title}"]
    if settings.revision:
        parts.append(f"revision {settings.revision}")
    parts.append(f"printed {dt.date.today():%d %b %Y}")
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
