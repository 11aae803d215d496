"""Palette, line weights and type sizes shared by screen, Present mode and paper.

Colours are the colour-blind-safe palette from the design notes, named by the role they
play in a chart (never by hue), as ``#RRGGBB`` strings. Qt code turns them into QColor,
reportlab into its own colour objects (``rgb01`` helps). No Qt here.
"""

from __future__ import annotations

from dataclasses import dataclass

# --- roles -------------------------------------------------------------------
CRITICAL = "#D55E00"      # vermillion: critical activities, critical path
WORK = "#0072B2"          # blue: other (non-critical) work
FLOAT = "#56B4E9"         # sky blue: float, the slack line
PROBABILITY = "#E69F00"   # orange: shaded probability areas, P10–P90 whiskers
DEADLINE = "#CC79A7"      # reddish purple: the deadline line
STATUS = "#009E73"        # bluish green: the status-date line
TEXT = "#000000"          # black: text, milestones, axes

# Derived neutrals and edges (not signals in their own right).
MILESTONE = TEXT
CRITICAL_EDGE = "#000000"   # heavy dark outline: critical still reads in grayscale
WORK_EDGE = "#00456B"       # thin darker-blue outline of ordinary bars
NEGATIVE_FLOAT = DEADLINE   # float that cannot be met: deadline colour, own mark shape
SUMMARY = "#404040"         # group summary bars
GRID = "#DDDDDD"
NONWORKING = "#F0F0F0"      # shading of non-working days
SELECTION = "#FFE9A8"       # pale band behind selected rows
BACKGROUND = "#FFFFFF"
MUTED_TEXT = "#555555"

ROLES = {
    "critical": CRITICAL, "work": WORK, "float": FLOAT, "probability": PROBABILITY,
    "deadline": DEADLINE, "status": STATUS, "text": TEXT,
}


@dataclass(frozen=True)
class Weights:
    """Line widths in points (1 pt = 1 px on a 96-dpi screen at 100 %) and type sizes."""

    bar_outline: float
    critical_outline: float
    float_line: float
    float_tick: float
    reference_line: float   # project start, deadline, status date
    connector: float
    whisker: float
    grid: float
    font_size: float
    label_font_size: float
    row_height: float       # pixels per row at 1:1 zoom on screen
    bar_fraction: float     # share of a row's height a bar takes


SCREEN = Weights(bar_outline=1.0, critical_outline=2.5, float_line=3.0, float_tick=3.0,
                 reference_line=3.0, connector=1.0, whisker=1.5, grid=1.0,
                 font_size=10.0, label_font_size=10.5, row_height=24.0, bar_fraction=0.6)

PRESENT = Weights(bar_outline=1.5, critical_outline=4.0, float_line=3.5, float_tick=3.5,
                  reference_line=3.5, connector=1.5, whisker=2.5, grid=1.0,
                  font_size=16.0, label_font_size=16.0, row_height=40.0, bar_fraction=0.62)

PAPER = Weights(bar_outline=0.5, critical_outline=1.5, float_line=1.0, float_tick=1.0,
                reference_line=1.0, connector=0.5, whisker=0.8, grid=0.3,
                font_size=7.0, label_font_size=7.0, row_height=12.0, bar_fraction=0.6)


def weights(mode: str = "screen") -> Weights:
    """Line weights for ``"screen"``, ``"present"`` or ``"paper"``."""
    table = {"screen": SCREEN, "present": PRESENT, "paper": PAPER}
    try:
        return table[mode]
    except KeyError:
        raise ValueError(f"style: unknown mode {mode!r} (use screen, present or paper)") from None


def rgb255(colour: str) -> tuple[int, int, int]:
    """``"#D55E00"`` → ``(213, 94, 0)``."""
    text = colour.lstrip("#")
    if len(text) != 6:
        raise ValueError(f"style: colour {colour!r} is not of the form #RRGGBB")
    return tuple(int(text[i:i + 2], 16) for i in (0, 2, 4))


def rgb01(colour: str) -> tuple[float, float, float]:
    """``"#D55E00"`` → components in 0..1 (for reportlab)."""
    return tuple(c / 255.0 for c in rgb255(colour))


def gray_level(colour: str) -> float:
    """Luminance 0..1 as a grayscale print would show it (Rec. 601 weights)."""
    r, g, b = rgb01(colour)
    return 0.299 * r + 0.587 * g + 0.114 * b
