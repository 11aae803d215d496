"""Rows pasted from a spreadsheet (tab-separated text) become activities through the
same checks as a file import (``workbench.io.tabular.rows_to_plan``)."""

from __future__ import annotations

from workbench.core.commands import AddActivities
from workbench.core.errors import PlanError
from workbench.core.model import Plan
from workbench.ui.activities.links_text import parse_predecessors

# Heading assumed for each pasted column when the rows come without a heading row.
DEFAULT_HEADINGS = ("id", "name", "group", "optimistic", "most likely", "pessimistic", "duration",
                    "predecessors", "distribution", "start no earlier", "finish no later", "notes")
PRED_HEADINGS = ("predecessors", "predecessor", "preds")


def _is_heading(cells: list[str]) -> bool:
    """A heading row names the id column and at least one other known column."""
    try:
        from workbench.io.table_columns import LOOKUP, normalise
    except ImportError:  # pragma: no cover
        return any(c.strip().casefold() == "id" for c in cells)
    fields = [LOOKUP.get(normalise(c)) for c in cells]
    return "id" in fields and len({f for f in fields if f}) >= 2


def split_rows(text: str) -> tuple[list[str], list[list[str]]]:
    """Headings and cell rows from tab-separated text; a first line with an 'id'
    cell is the heading row, otherwise the columns follow the table's order."""
    lines = [line for line in text.replace("\r\n", "\n").replace("\r", "\n").split("\n") if line.strip()]
    cells = [line.split("\t") for line in lines]
    if cells and _is_heading(cells[0]):
        return [c.strip() for c in cells[0]], cells[1:]
    return list(DEFAULT_HEADINGS), cells


def _rows(headings: list[str], cells: list[list[str]]) -> tuple[list[dict[str, str]], list[str]]:
    rows, preds = [], []
    pred_col = next((i for i, h in enumerate(headings) if h.casefold() in PRED_HEADINGS), None)
    for line in cells:
        line = line + [""] * (len(headings) - len(line))
        preds.append(line[pred_col] if pred_col is not None else "")
        rows.append({h: v for i, (h, v) in enumerate(zip(headings, line)) if i != pred_col and h})
    return rows, preds


def paste_command(text: str, plan: Plan, row: int) -> AddActivities | str:
    """One command adding the pasted activities at ``row``, or a message saying why not."""
    if not text.strip():
        return "The clipboard holds no rows to paste."
    headings, cells = split_rows(text)
    if not cells:
        return "The clipboard holds only a heading row."
    rows, pred_cells = _rows(headings, cells)
    try:
        from workbench.io.tabular import rows_to_plan
        pasted = rows_to_plan(rows, settings=plan.settings)
    except ImportError:
        return "Pasting rows needs the table import, which is not installed."
    except PlanError as exc:
        return f"Nothing pasted: {exc}"
    return _command(plan, pasted, pred_cells, row)


def _command(plan: Plan, pasted: Plan, pred_cells: list[str], row: int) -> AddActivities | str:
    clash = [a.id for a in pasted.activities if a.id in plan]
    if clash:
        return f"Nothing pasted: the plan already has activities {', '.join(clash)}"
    known = set(plan.ids()) | set(pasted.ids())
    links = list(pasted.links)
    try:
        for act, cell in zip(pasted.activities, pred_cells):
            for link in parse_predecessors(cell, act.id):
                if link.pred not in known:
                    raise PlanError(f"activity {act.id}: predecessor {link.pred!r} is not an activity of this plan", act.id)
                links.append(link)
    except PlanError as exc:
        return f"Nothing pasted: {exc}"
    n = len(pasted)
    return AddActivities(pasted.activities, row, links, text=f"Paste {n} activit{'y' if n == 1 else 'ies'}")
