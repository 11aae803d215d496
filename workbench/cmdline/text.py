"""Plain-text tables for the command line (no Qt, no colours: terminals and logs)."""

from __future__ import annotations

import math

CAUTION = ("Caution: estimates are judgement. PERT assumes one path decides the finish and "
           "durations are independent; it is optimistic where paths merge. Commitments rest "
           "with your organisation's own approval rules.")


def num(value: float, places: int = 2) -> str:
    """A plan-unit number: whole numbers without decimals, others to ``places``."""
    if value is None or (isinstance(value, float) and math.isnan(value)):
        return "-"
    if math.isinf(value):
        return "inf" if value > 0 else "-inf"
    if abs(value - round(value)) < 1e-9:
        return str(int(round(value)))
    return f"{value:.{places}f}"


def pct(p: float) -> str:
    return f"{p:.4f} ({p * 100:.2f} %)"


def table(headers: list[str], rows: list[list[str]], right: set[int] = frozenset()) -> str:
    widths = [len(h) for h in headers]
    for row in rows:
        widths = [max(w, len(c)) for w, c in zip(widths, row)]

    def line(cells):
        out = [c.rjust(w) if i in right else c.ljust(w) for i, (c, w) in enumerate(zip(cells, widths))]
        return "  ".join(out).rstrip()

    sep = "  ".join("-" * w for w in widths)
    return "\n".join([line(headers), sep] + [line(r) for r in rows])


def elide(text: str, width: int) -> str:
    return text if len(text) <= width else text[: width - 1] + "\u2026"
