"""Render the app icon (resources/icon/slackline.svg) to PNG sizes, a Windows .ico and a
macOS .icns, with Qt's SVG renderer and small writers of our own (no Pillow needed).

    python installer/make_icons.py            # writes resources/icon/slackline-<N>.png, .ico, .icns

The outputs are committed; run this again after editing the SVG.
"""

from __future__ import annotations

import os
import struct
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
ICON_DIR = ROOT / "resources" / "icon"
SVG = ICON_DIR / "slackline.svg"

PNG_SIZES = (16, 24, 32, 48, 64, 128, 256, 512, 1024)
ICO_SIZES = (16, 24, 32, 48, 64, 128, 256)
# .icns entry types holding PNG data, by pixel size (the @2x types reuse the same pixels).
ICNS_TYPES = (("icp4", 16), ("icp5", 32), ("icp6", 64), ("ic07", 128), ("ic08", 256), ("ic09", 512),
              ("ic10", 1024), ("ic11", 32), ("ic12", 64), ("ic13", 256), ("ic14", 512))


def render_png(svg: bytes, size: int) -> bytes:
    """The SVG drawn into a transparent ``size``×``size`` square, as PNG bytes."""
    from PySide6.QtCore import QBuffer, QByteArray, QIODevice, QRectF, Qt
    from PySide6.QtGui import QImage, QPainter
    from PySide6.QtSvg import QSvgRenderer

    renderer = QSvgRenderer(QByteArray(svg))
    if not renderer.isValid():
        raise ValueError(f"{SVG}: not a valid SVG drawing")
    image = QImage(size, size, QImage.Format.Format_ARGB32)
    image.fill(Qt.GlobalColor.transparent)
    painter = QPainter(image)
    painter.setRenderHint(QPainter.RenderHint.Antialiasing)
    renderer.render(painter, QRectF(0, 0, size, size))
    painter.end()
    data = QByteArray()
    buffer = QBuffer(data)
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    image.save(buffer, "PNG")
    buffer.close()
    return bytes(data.data())


def ico_bytes(pngs: dict[int, bytes]) -> bytes:
    """A .ico holding one PNG-compressed 32-bit image per size (readable since Windows Vista)."""
    sizes = sorted(pngs)
    header = struct.pack("<HHH", 0, 1, len(sizes))
    offset = len(header) + 16 * len(sizes)
    entries, blobs = [], []
    for size in sizes:
        blob = pngs[size]
        side = 0 if size >= 256 else size  # 0 means 256 in the directory entry
        entries.append(struct.pack("<BBBBHHII", side, side, 0, 0, 1, 32, len(blob), offset))
        blobs.append(blob)
        offset += len(blob)
    return header + b"".join(entries) + b"".join(blobs)


def icns_bytes(pngs: dict[int, bytes]) -> bytes:
    """A .icns of PNG entries: 'icns', total length, then (type, length incl. header, data)."""
    body = b"".join(kind.encode("ascii") + struct.pack(">I", 8 + len(pngs[size])) + pngs[size]
                    for kind, size in ICNS_TYPES)
    return b"icns" + struct.pack(">I", 8 + len(body)) + body


def png_path(size: int) -> Path:
    return ICON_DIR / f"slackline-{size}.png"


def outputs() -> list[Path]:
    return [png_path(s) for s in PNG_SIZES] + [ICON_DIR / "slackline.ico", ICON_DIR / "slackline.icns"]


def up_to_date() -> bool:
    """True when every output exists and is newer than the SVG."""
    source = SVG.stat().st_mtime
    return all(p.exists() and p.stat().st_mtime >= source for p in outputs())


def make_icons() -> list[Path]:
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtGui import QGuiApplication

    app = QGuiApplication.instance() or QGuiApplication([])  # noqa: F841  (fonts/images need one)
    svg = SVG.read_bytes()
    pngs = {size: render_png(svg, size) for size in PNG_SIZES}
    for size, blob in pngs.items():
        png_path(size).write_bytes(blob)
    (ICON_DIR / "slackline.ico").write_bytes(ico_bytes({s: pngs[s] for s in ICO_SIZES}))
    (ICON_DIR / "slackline.icns").write_bytes(icns_bytes(pngs))
    return outputs()


def main() -> int:
    for path in make_icons():
        print(f"wrote {path.relative_to(ROOT)} ({path.stat().st_size} bytes)")
    return 0


if __name__ == "__main__":
    sys.exit(main())
