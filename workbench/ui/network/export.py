"""Export (PNG, SVG) and printing of the Network, through the one paint routine."""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QRectF, QSize, Qt
from PySide6.QtGui import QColor, QImage, QPainter

from workbench.ui.network.paint import NetworkPainter

MAX_PIXELS = 12000    # longest side of an exported image
MIN_NODE_MM = 24.0    # printed nodes narrower than this are unreadable: tile instead
PAD = 40.0


def _extent(net: NetworkPainter) -> QRectF:
    lay = net.layout
    left = min([b.x for b in lay.bands], default=0.0)
    return QRectF(left - PAD, -PAD, lay.width - 2 * left + 2 * PAD, lay.height + 2 * PAD)


def paint_into(net: NetworkPainter, p: QPainter, target: QRectF) -> None:
    """Fit the whole drawing into ``target`` (device coordinates), keeping its proportions."""
    src = _extent(net)
    scale = min(target.width() / src.width(), target.height() / src.height())
    p.save()
    p.translate(target.left() + (target.width() - src.width() * scale) / 2,
                target.top() + (target.height() - src.height() * scale) / 2)
    p.scale(scale, scale)
    p.translate(-src.left(), -src.top())
    net.paint(p, src, scale)
    p.restore()


def render_image(net: NetworkPainter, scale: float = 1.0) -> QImage:
    src = _extent(net)
    scale = min(scale, MAX_PIXELS / max(src.width(), src.height()))
    image = QImage(QSize(max(1, int(src.width() * scale)), max(1, int(src.height() * scale))),
                   QImage.Format_ARGB32)
    image.fill(QColor(Qt.white))
    p = QPainter(image)
    paint_into(net, p, QRectF(0, 0, image.width(), image.height()))
    p.end()
    return image


def save_picture(net: NetworkPainter, path: str | Path) -> None:
    """Write the whole Network to ``.png`` or ``.svg``; raises ValueError for other suffixes
    and OSError when the file cannot be written."""
    path = Path(path)
    suffix = path.suffix.lower()
    if net.layout is None:
        raise ValueError("there is no network to export")
    if suffix == ".png":
        if not render_image(net).save(str(path), "PNG"):
            raise OSError(f"could not write {path}")
    elif suffix == ".svg":
        _save_svg(net, path)
    else:
        raise ValueError(f"cannot export the network as {suffix or 'a file without extension'} (use .png or .svg)")


def _save_svg(net: NetworkPainter, path: Path) -> None:
    from PySide6.QtSvg import QSvgGenerator

    src = _extent(net)
    gen = QSvgGenerator()
    gen.setFileName(str(path))
    gen.setSize(QSize(int(src.width()), int(src.height())))
    gen.setViewBox(QRectF(0, 0, src.width(), src.height()))
    gen.setTitle("Network")
    p = QPainter(gen)
    paint_into(net, p, QRectF(0, 0, src.width(), src.height()))
    p.end()
    if not path.exists():
        raise OSError(f"could not write {path}")


def print_pages(net: NetworkPainter, printer) -> int:
    """Print the Network: one page when nodes stay at least ``MIN_NODE_MM`` wide, else
    tiled over as many pages as that size needs (left to right, then down). Returns the
    number of pages."""
    page = printer.pageLayout().paintRectPixels(printer.resolution())
    src = _extent(net)
    fit = min(page.width() / src.width(), page.height() / src.height())
    node_w = float(net.layout.boxes[0, 2]) if len(net.layout.boxes) else 1.0
    need = MIN_NODE_MM / 25.4 * printer.resolution() / node_w
    p = QPainter(printer)
    if fit >= need:
        paint_into(net, p, QRectF(0, 0, page.width(), page.height()))
        p.end()
        return 1
    tiles = _tiles(src, page.width() / need, page.height() / need)
    for i, tile in enumerate(tiles):
        if i:
            printer.newPage()
        p.save()
        p.setClipRect(QRectF(0, 0, page.width(), page.height()))
        p.scale(need, need)
        p.translate(-tile.left(), -tile.top())
        net.paint(p, tile, need)
        p.restore()
    p.end()
    return len(tiles)


def _tiles(src: QRectF, w: float, h: float) -> list[QRectF]:
    cols = max(1, int(-(-src.width() // w)))
    rows = max(1, int(-(-src.height() // h)))
    return [QRectF(src.left() + c * w, src.top() + r * h, w, h) for r in range(rows) for c in range(cols)]
