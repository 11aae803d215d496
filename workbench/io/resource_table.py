"""Resources in spreadsheets: an activity's ``resources`` cell (``crew 2; crane 1``) and the
table of resources (columns ``id``, ``name``, ``units``, optionally ``cost``), read from an
XLSX workbook's sheet named ``Resources`` or from a CSV file of its own. Other columns are
not read; they are named back (like the activity table's) so a misspelt heading is noticed.

Every problem names its row and column; a table is read all or nothing.
"""

from __future__ import annotations

import re
from workbench.core.errors import PlanError
from workbench.core.model import Resource

from .errors import TableImportError
from .predecessors import format_number

SHEET = "resources"
_ITEMS = re.compile(r";|,(?!\d)|(?<!\d),")   # as predecessors: ; or , but not the comma of "1,5"
_NUMBER = re.compile(r"^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$")
COLUMNS = {"id": ("id", "resource", "resource id", "code"), "name": ("name", "description", "resource name"),
           "units": ("units", "available", "availability", "capacity", "quantity"),
           "cost": ("cost", "rate", "cost per unit")}


def parse_needs(text: str, act_id: str) -> tuple[tuple[str, float], ...]:
    """``crew 2; crane 1`` → (("crew", 2.0), ("crane", 1.0)); a bare id needs one unit. Items
    are separated as predecessors are, by ``;`` or ``,`` (a comma between two digits is a
    decimal mark: ``crew 1,5``)."""
    needs = []
    for item in (t.strip() for t in _ITEMS.split(str(text))):
        if not item:
            continue
        parts = item.split()
        if len(parts) > 2:
            raise PlanError(f"activity {act_id}: resource need {item!r} must be an id and its units, like 'crew 2'", act_id)
        units = 1.0
        if len(parts) == 2:
            if not _NUMBER.match(parts[1]):
                raise PlanError(f"activity {act_id}: units {parts[1]!r} of resource {parts[0]} must be a number", act_id)
            units = float(parts[1].replace(",", "."))
            if units < 0:
                raise PlanError(f"activity {act_id}: units of resource {parts[0]} must not be negative ({units:g})", act_id)
        needs.append((parts[0], units))
    return tuple(needs)


def format_needs(needs) -> str:
    return "; ".join(f"{res} {format_number(units)}" for res, units in needs)


def _column_map(header: list[str], header_row: int, source: str, ignored: list | None = None) -> dict[str, int]:
    """Column of each field; a heading that names none (or repeats one) goes to ``ignored``."""
    found: dict[str, int] = {}
    for i, cell in enumerate(header):
        key = " ".join(str(cell).strip().lower().replace("_", " ").split())
        name = next((n for n, aliases in COLUMNS.items() if key in aliases), None)
        if name is not None and name not in found:
            found[name] = i
        elif key and ignored is not None:
            ignored.append(str(cell).strip())
    missing = [n for n in ("id", "units") if n not in found]
    if missing:
        raise TableImportError([f"row {header_row}: the resources table needs columns 'id' and 'units' "
                                f"(missing {', '.join(repr(m) for m in missing)})"], source)
    return found


def _number(cell: str, row: int, column: str, problems: list[str], default=None):
    text = str(cell).strip()
    if not text:
        return default
    if not _NUMBER.match(text):
        problems.append(f"row {row}, column '{column}': {text!r} is not a number")
        return default
    return float(text.replace(",", "."))


def resources_from_rows(rows: list[tuple[int, list[str]]], source: str, ignored: list | None = None) -> list[Resource]:
    """The resources of a table whose first non-blank row is the header. Headings it does not
    read (none of id, name, units, cost or their aliases) are added to ``ignored`` so the
    caller can name them, as the activity table's ignored columns are named."""
    rows = [(n, cells) for n, cells in rows if any(str(c).strip() for c in cells)]
    if not rows:
        raise TableImportError(["the resources table is empty"], source)
    (header_row, header), body = rows[0], rows[1:]
    cols = _column_map(header, header_row, source, ignored)
    cell = lambda cells, name: str(cells[cols[name]]).strip() if name in cols and cols[name] < len(cells) else ""
    problems, out, seen = [], [], {}
    for n, cells in body:
        res_id = cell(cells, "id")
        units = _number(cell(cells, "units"), n, "units", problems)
        cost = _number(cell(cells, "cost"), n, "cost", problems)
        if not res_id:
            problems.append(f"row {n}, column 'id': the resource id is empty")
        elif res_id in seen:
            problems.append(f"row {n}, resource {res_id}: duplicate id, first on row {seen[res_id]}")
        elif units is None and not cell(cells, "units"):
            problems.append(f"row {n}, resource {res_id}, column 'units': how many units are available is missing")
        elif units is not None:
            try:
                out.append(Resource(res_id, cell(cells, "name"), units, cost).validated())
                seen[res_id] = n
            except PlanError as exc:
                problems.append(f"row {n}: {exc}")
    if problems:
        raise TableImportError(problems, source)
    return out
