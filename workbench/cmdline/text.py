"""Plain-text tables for the command line (no Qt, no colours: terminals and logs)."""

from __future__ import annotations

import math

import numpy as np

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


def nums(values, places: int = 2) -> list[str]:
    """:func:`num` for a whole column at once."""
    x = np.asarray(values, dtype=float)
    whole = (np.abs(x - np.round(x)) < 1e-9).tolist()
    return [str(int(round(v))) if w else (f"{v:.{places}f}" if math.isfinite(v) else num(v))
            for v, w in zip(x.tolist(), whole)]


def column_table(headers: list[str], columns: list[list[str]], right: set[int] = frozenset()) -> str:
    """:func:`table` given column lists (fast for 100,000 rows)."""
    widths = [max([len(h)] + [len(c) for c in col]) for h, col in zip(headers, columns)]
    fmt = "  ".join(f"{{:{'>' if i in right else '<'}{w}}}" for i, w in enumerate(widths))
    sep = "  ".join("-" * w for w in widths)
    lines = [fmt.format(*headers).rstrip(), sep]
    lines += [fmt.format(*row).rstrip() for row in zip(*columns)]
    return "\n".join(lines)


def elide(text: str, width: int) -> str:
    return text if len(text) <= width else text[: width - 1] + "\u2026"
