"""Reading a clean activity table a column at a time.

The row reader (``row_reader``) reads each row cell by cell and collects every problem
with its row and column. Most tables are clean, and for a big one that care costs most
of the import. Here the table is first read as columns: numbers converted and checked
with numpy, ids and predecessor cells checked in bulk. Only a table in which everything
is plain goes this way (ids without spaces, plain numbers, predecessor cells that list
ids only, no constraints, distributions, formula guards or decimal commas); anything
else returns None and the row reader reads the table as before, naming every problem.
"""

from __future__ import annotations

import re
from dataclasses import replace
from functools import partial
from itertools import compress, repeat
from typing import Callable

import numpy as np

from workbench.core.model import _BAD_ID, MAX_ID_LENGTH, Activity, Link, Plan, Settings
from workbench.core.network import compile_network

from .plan_bulk import plain_numbers
from .table_columns import FIELDS

NUMBERS = ("optimistic", "most_likely", "pessimistic", "duration")
TEXTS = ("name", "group", "notes")
# Every other import column (constraints, resources, progress, costs, ...): a table using any
# of them is read by the row reader, so a column added there can never be dropped here.
_SPACE = re.compile(r"\s")
_INNER_EDGE = re.compile(r"\s\x00|\x00\s")   # with the ends: a cell strip() would change
RARE = tuple(f for f in FIELDS if f not in ("id", "predecessors") + NUMBERS + TEXTS)


def _columns(cols, rows) -> dict[str, list[str]] | None:
    """Each known column's stripped cells, when every row is as wide as the header."""
    widths = set(map(len, (cells for _, cells in rows)))
    if len(widths) != 1 or min(widths) < cols.width:
        return None
    table = list(zip(*(cells for _, cells in rows)))
    try:
        joined = ["\x00".join(col) for col in table]
    except TypeError:
        return None                          # cells that are not text (a spreadsheet's numbers)
    if any("".join(col).strip() for col in table[cols.width:]):
        return None                          # text beyond the header: the row reader says where
    out = {}
    for name, i in cols.index.items():
        if joined[i].startswith("'") or "\x00'" in joined[i]:
            return None                      # a formula guard to undo
        out[name] = list(map(str.strip, table[i])) if _edge_space(joined[i]) else list(table[i])
    return out


def _edge_space(joined: str) -> bool:
    """Does a cell of this column (cells joined by NUL) begin or end with white space?"""
    return joined[:1].isspace() or joined[-1:].isspace() or bool(_INNER_EDGE.search(joined))


def _numbers(col: list[str] | None, n: int) -> np.ndarray | None:
    if col is None:
        return np.full(n, np.nan)
    if "_" in "".join(col):
        return None
    try:
        values = (np.array([float(t) if t else np.nan for t in col]) if "" in col
                  else np.fromiter(map(float, col), float, n))
    except ValueError:
        return None
    if np.count_nonzero(np.isnan(values)) != col.count("") or np.isinf(values).any():
        return None
    return values


def _ids_plain(ids: list[str]) -> bool:
    lengths = np.fromiter(map(len, ids), np.int64, len(ids))
    return (bool(ids) and bool((lengths > 0).all()) and bool((lengths <= MAX_ID_LENGTH).all())
            and not _BAD_ID.search("\x00".join(ids)) and len(set(ids)) == len(ids))


def _links(ids: list[str], cells: list[str] | None) -> tuple[list[Link], np.ndarray, np.ndarray] | None:
    """Plain finish-to-start links from cells that list ids only (``A; B``), each once,
    with their ends as row indices."""
    n = len(ids)
    if cells is None or not any(cells):
        return [], np.zeros(0, np.int64), np.zeros(0, np.int64)
    joined = ";".join(cells)
    if "," in joined:
        return None                          # the row reader tells a separator from a decimal comma
    if _SPACE.search(joined):
        return _spaced_links(ids, cells)
    counts = np.fromiter(map(str.count, cells, repeat(";")), np.int64, n) + 1
    preds = joined.split(";")
    dst = np.repeat(np.arange(n), counts)
    if "" in preds:                          # empty cells and stray separators name nothing
        keep = np.array([bool(p) for p in preds])
        preds, dst = list(compress(preds, keep)), dst[keep]
    index = dict(zip(ids, range(n)))
    try:
        src = np.fromiter(map(index.__getitem__, preds), np.int64, len(preds))
    except KeyError:
        return None                          # an unknown predecessor: the row reader names it
    pairs = np.sort(src * n + dst)
    if (src == dst).any() or (pairs[1:] == pairs[:-1]).any():
        return None                          # a self link or a repeat: the row reader names it
    succs = np.array(ids, dtype=object)[dst].tolist()
    return list(map(Link, preds, succs)), src, dst


def _spaced_links(ids: list[str], cells: list[str]):
    """As :func:`_links`, for cells with spaces around the ids (``A; B``); None when an
    id holds a space (the row reader names it)."""
    cells = [";".join(map(str.strip, cell.split(";"))) for cell in cells]
    return None if _SPACE.search(";".join(cells)) else _links(ids, cells)


def _storable(column: list[str]) -> bool:
    try:
        "\x00".join(column).encode("utf-8")
    except UnicodeEncodeError:
        return False
    return True


def bulk_plan(cols, rows, settings: Settings | None, decimal_comma: bool) -> tuple[Plan, dict, Callable] | None:
    """The plan, each id's row number and a function compiling its network (from the link
    ends found here), or None when the row reader should read it."""
    if decimal_comma or not rows or "id" not in cols.index:
        return None
    table = _columns(cols, rows)
    if table is None or any(any(table[k]) for k in RARE if k in table):
        return None
    ids, n = table["id"], len(rows)
    numbers = [_numbers(table.get(k), n) for k in NUMBERS]
    if not _ids_plain(ids) or any(v is None for v in numbers) or not plain_numbers(*numbers).all():
        return None
    found = _links(ids, table.get("predecessors"))
    if found is None:
        return None
    links, src, dst = found
    texts = [table.get(k, [""] * n) for k in TEXTS]
    if not all(_storable(col) for col in texts + [ids]):
        return None                          # a lone surrogate: the row reader names its row and column
    values = [[None if x != x else x for x in v.tolist()] for v in numbers]
    acts = list(map(Activity, ids, *texts, *values))
    settings = replace(settings) if settings is not None else Settings()
    plan = Plan(settings, acts, links, validated=True, ends_known=True)
    compile_links = partial(compile_network, ids, src, dst, np.zeros(src.size), np.zeros(src.size, np.int64))
    return plan, dict(zip(ids, (number for number, _ in rows))), compile_links
