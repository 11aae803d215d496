"""The predecessor cell: ``A; B SS 2; C FF -1``.

Items are separated by ``;`` (a ``,`` works too). Each item is an activity id alone
(finish-to-start, no lag) or ``ID TYPE`` or ``ID TYPE LAG``; the type is one of FS, SS,
FF, SF in any case, the lag a number in plan units (it may be negative).
"""

from __future__ import annotations

import math
import re

from workbench.core.errors import PlanError
from workbench.core.model import LINK_TYPES, MAX_UNITS, Link

_SPLIT = re.compile(r"[;,]")
_SPLIT_DECIMAL_COMMA = re.compile(r";|,(?!\d)|(?<!\d),")  # keeps the comma of "-0,5"


def format_number(value: float) -> str:
    """Shortest text that reads back to exactly the same float (``2`` not ``2.0``)."""
    value = float(value)
    if value.is_integer() and abs(value) < 1e15:
        return str(int(value))
    return repr(value)


def parse_lag(text: str, item: str, succ_id: str, decimal_comma: bool = False) -> float:
    if decimal_comma:
        text = text.replace(",", ".")
    try:
        lag = float(text) if "_" not in text else float("x")
    except ValueError:
        raise PlanError(f"activity {succ_id}: lag {text!r} in {item!r} is not a number", succ_id) from None
    if not math.isfinite(lag):
        raise PlanError(f"activity {succ_id}: lag in {item!r} must be a finite number", succ_id)
    if abs(lag) > MAX_UNITS:
        raise PlanError(f"activity {succ_id}: lag in {item!r} is beyond {MAX_UNITS:,.0f} plan units", succ_id)
    return lag


def parse_item(item: str, succ_id: str, decimal_comma: bool = False) -> Link:
    """One ``ID [TYPE [LAG]]`` item as a link into ``succ_id``."""
    parts = item.split()
    if len(parts) > 3:
        raise PlanError(f"activity {succ_id}: cannot read predecessor {item!r} (write ID, or ID TYPE LAG as in 'B SS 2')", succ_id)
    pred = parts[0]
    kind = parts[1].upper() if len(parts) > 1 else "FS"
    if kind not in LINK_TYPES:
        raise PlanError(f"activity {succ_id}: unknown link type {parts[1]!r} in {item!r} (use FS, SS, FF or SF)", succ_id)
    lag = parse_lag(parts[2], item, succ_id, decimal_comma) if len(parts) > 2 else 0.0
    if pred == succ_id:
        raise PlanError(f"activity {succ_id} cannot be its own predecessor", succ_id)
    return Link(pred, succ_id, kind, lag)


def parse_predecessors(text: str, succ_id: str, decimal_comma: bool = False) -> list[Link]:
    """Read a predecessor cell into links ending at ``succ_id``.

    With ``decimal_comma`` (tables from a ``;``-separated CSV) a comma between two digits
    is a decimal mark (``C FF -0,5``), any other comma still separates items.

    Raises :class:`PlanError` naming the activity and the item that cannot be read, or
    a predecessor given twice with the same type. Whether the predecessor ids exist is the caller's check.
    """
    links: list[Link] = []
    seen: set[tuple[str, str]] = set()
    for raw in (_SPLIT_DECIMAL_COMMA if decimal_comma else _SPLIT).split(text or ""):
        item = raw.strip()
        if not item:
            continue
        link = parse_item(item, succ_id, decimal_comma)
        if (link.pred, link.type) in seen:
            raise PlanError(f"activity {succ_id}: predecessor {link.pred} {link.type} is listed twice", succ_id)
        seen.add((link.pred, link.type))
        links.append(link)
    return links


def format_link(link: Link) -> str:
    if link.type == "FS" and link.lag == 0:
        return link.pred
    if link.lag == 0:
        return f"{link.pred} {link.type}"
    return f"{link.pred} {link.type} {format_number(link.lag)}"


def format_predecessors(links) -> str:
    """The cell text for a list of links into one activity: ``A; B SS 2; C FF -1``."""
    return "; ".join(format_link(link) for link in links)
