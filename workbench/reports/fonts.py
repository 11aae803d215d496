"""Unicode text in the approval pack: the bundled fonts, a fallback font for the scripts the
main one lacks, and right-to-left text put in reading order.

The pack prints in DejaVu Sans Condensed (regular and bold, from ``resources/fonts``); a
character it lacks is printed in Droid Sans Fallback (Chinese, Japanese); one neither holds as
U+FFFD. Hebrew and Arabic are reordered for display (the Unicode bidirectional algorithm,
``python-bidi``) and Arabic letters take their joined forms (``arabic-reshaper``), since
PDF text is drawn left to right glyph by glyph. ``resources/fonts/README.md`` lists what
each font covers.
"""

from __future__ import annotations

import functools
import unicodedata
from xml.sax.saxutils import escape

from reportlab.lib.fonts import addMapping
from reportlab.pdfbase import pdfmetrics
from reportlab.pdfbase.ttfonts import TTFont

from workbench.resources import resources_dir

FONT, BOLD, FALLBACK = "SlacklineSans", "SlacklineSans-Bold", "SlacklineFallback"
FILES = {FONT: "DejaVuSansCondensed.ttf", BOLD: "DejaVuSansCondensed-Bold.ttf", FALLBACK: "DroidSansFallbackFull.ttf"}
MISSING = "\ufffd"
_RTL = frozenset(("R", "AL"))


@functools.lru_cache(maxsize=1)
def register() -> bool:
    """Register the pack's main fonts with reportlab once per process (the fallback font,
    a larger file, only when some text needs it: :func:`coverage`)."""
    _load(FONT, BOLD)
    _load(BOLD, BOLD)
    return True


def _load(name: str, bold: str) -> None:
    pdfmetrics.registerFont(TTFont(name, str(resources_dir() / "fonts" / FILES[name])))
    for is_bold, is_italic in ((0, 0), (0, 1), (1, 0), (1, 1)):
        addMapping(name, is_bold, is_italic, bold if is_bold else name)


@functools.lru_cache(maxsize=4)
def coverage(font: str) -> frozenset:
    register()
    if font == FALLBACK:
        _load(FALLBACK, FALLBACK)
    return frozenset(pdfmetrics.getFont(font).face.charToGlyph)


def visual(text: str) -> str:
    """Text in the order it is drawn: right-to-left runs reversed, Arabic letters joined."""
    if text.isascii() or not any(unicodedata.bidirectional(ch) in _RTL for ch in text):
        return text
    import arabic_reshaper
    from bidi.algorithm import get_display

    return get_display(arabic_reshaper.reshape(text))


def runs(text: str, font: str = FONT) -> list[tuple[str, str]]:
    """(piece, font) runs: the main font where it has the glyph, else the fallback, else
    the main font with U+FFFD in place of the character."""
    main = coverage(font)
    if text.isascii() or all(ord(ch) in main for ch in text):
        return [(text, font)]
    other = coverage(FALLBACK)
    out: list[tuple[str, str]] = []
    for ch in text:
        code = ord(ch)
        use = font if code in main else FALLBACK if code in other else font
        ch = ch if code in main or code in other else MISSING
        if out and out[-1][1] == use:
            out[-1] = (out[-1][0] + ch, use)
        else:
            out.append((ch, use))
    return out


def width(text: str, font: str, size: float) -> float:
    """Width in points of ``text`` as :func:`draw` prints it."""
    return sum(pdfmetrics.stringWidth(piece, name, size) for piece, name in runs(text, font))


def draw(c, x: float, y: float, text: str, align: str = "left") -> None:
    """Draw ``text`` at (x, y) in the canvas's current font and size, switching to the
    fallback font where needed; ``align`` is left, right or centre."""
    font, size = getattr(c, "_fontname", None), getattr(c, "_fontsize", None)
    if font is None:            # a canvas that lays text out itself (the Present slides' Qt one)
        _ALIGNED[align](c)(x, y, _keep_order(text))
        return
    parts = runs(text, font)
    if len(parts) == 1 and parts[0][1] == font:
        _ALIGNED[align](c)(x, y, parts[0][0])
        return
    total = sum(pdfmetrics.stringWidth(p, f, size) for p, f in parts)
    x -= {"left": 0.0, "right": total, "centre": total / 2}[align]
    for piece, name in parts:
        c.setFont(name, size)
        c.drawString(x, y, piece)
        x += pdfmetrics.stringWidth(piece, name, size)
    c.setFont(font, size)


_ALIGNED = {"left": lambda c: c.drawString, "right": lambda c: c.drawRightString,
            "centre": lambda c: c.drawCentredString}


def _keep_order(text: str) -> str:
    """Text already in drawing order, marked so a layout engine that applies the
    bidirectional algorithm itself draws it left to right as it stands."""
    if text.isascii() or not any(unicodedata.bidirectional(ch) in _RTL for ch in text):
        return text
    return "\u202d" + text + "\u202c"          # left-to-right override … pop


def markup(text: str) -> str:
    """Paragraph markup for ``text``: escaped, fallback runs in their own font."""
    parts = runs(text)
    if len(parts) == 1 and parts[0][1] == FONT:
        return escape(parts[0][0])
    return "".join(escape(p) if f == FONT else f'<font name="{f}">{escape(p)}</font>' for p, f in parts)
