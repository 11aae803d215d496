"""Rows of cells → a checked Plan, all or nothing.

Every problem is collected (row number as a spreadsheet shows it, the activity, the
column and what is wrong) and raised together as one :class:`TableImportError`.
"""

from __future__ import annotations

import math
import re
from dataclasses import replace

from workbench.core.errors import CycleError, PlanError
from workbench.core.model import DISTRIBUTIONS, Activity, Link, Plan, Settings, check_activity_text
from workbench.core.progress_fields import Progress
from workbench.core.cpm import Analyzer
from workbench.core.network import compile_plan

from .errors import TableImportError
from .fields import parse_iso_date
from .predecessors import parse_predecessors
from .paused_gc import paused_gc
from .table_bulk import bulk_plan
from .table_columns import Columns, map_header

NUMBER_FIELDS = ("optimistic", "most_likely", "pessimistic", "duration",
                 "cost", "crash_cost", "crash_optimistic", "crash_most_likely", "crash_pessimistic", "crash_duration")
TEXT_FIELDS = ("name", "group", "notes")
PROGRESS_NUMBERS = ("remaining_optimistic", "remaining_most_likely", "remaining_pessimistic", "remaining",
                    "percent_complete")
GUARDED = ("=", "+", "-", "@", "\t", "\r")
DISTRIBUTION_ALIASES = {"pert": "beta-pert", "beta": "beta-pert", "betapert": "beta-pert", "tri": "triangular"}
_DECIMAL_COMMA = re.compile(r"^[+-]?\d+,\d+$")
_LOOKS_LIKE_DATE = re.compile(r"^\d{4}-\d")

Row = tuple[int, list[str]]  # (row number as the spreadsheet shows it, cells)


def unguard(text: str) -> str:
    """Undo the CSV export's formula guard: ``'=x`` → ``=x``, ``''x`` → ``'x`` (a quote is
    removed only before = + - @ tab CR or another quote)."""
    if len(text) > 1 and text[0] == "'" and (text[1] in GUARDED or text[1] == "'"):
        return text[1:]
    return text


class RowReader:
    """Reads activity rows against one header; collects problems instead of stopping."""

    def __init__(self, cols: Columns, decimal_comma: bool = False, guarded: bool = True, resources=()):
        self.cols, self.decimal_comma, self.guarded = cols, decimal_comma, guarded
        self.resources = {r.id: r for r in resources}
        self.problems: list[str] = []
        self.rows: dict[str, int] = {}  # id → row number
        self.activities: list[Activity] = []
        self.links: list[tuple[int, Link]] = []

    def cell(self, cells: list[str], name: str) -> str:
        i = self.cols.index.get(name)
        if i is None or i >= len(cells):
            return ""
        text = str(cells[i])
        return (unguard(text) if self.guarded else text).strip()

    def problem(self, number: int, act_id: str, name: str | None, what: str) -> None:
        where = f", {self.cols.where(name)}" if name else ""
        shown = act_id if len(act_id) <= 40 else act_id[:40] + "\u2026"
        who = f", activity {shown}" if act_id else ""
        self.problems.append(f"row {number}{who}{where}: {what}")

    def number(self, number: int, act_id: str, cells: list[str], name: str):
        text = self.cell(cells, name)
        if not text:
            return None
        if self.decimal_comma and _DECIMAL_COMMA.match(text):
            text = text.replace(",", ".")
        try:
            value = float(text) if "_" not in text else float("x")
        except ValueError:
            self.problem(number, act_id, name, f"{text!r} is not a number")
            return None
        if not math.isfinite(value):
            self.problem(number, act_id, name, f"must be a finite number, not {text!r}")
            return None
        return value

    def point(self, number: int, act_id: str, cells: list[str], name: str):
        """A constraint: a date (YYYY-MM-DD) or a number of plan units from the start."""
        text = self.cell(cells, name)
        if not _LOOKS_LIKE_DATE.match(text):
            return self.number(number, act_id, cells, name)
        day = parse_iso_date(text[:10]) if len(text) == 10 or text[10:] in ("T00:00:00", " 00:00:00") else None
        if day is None:
            self.problem(number, act_id, name, f"{text!r} is not a valid date (write YYYY-MM-DD)")
        return day

    def progress(self, number: int, act_id: str, cells: list[str]) -> Progress | None:
        """The progress columns of a row (None when they are all empty); "45%" reads as 45."""
        at = cells
        pc_col = self.cols.index.get("percent_complete")
        if pc_col is not None and pc_col < len(cells) and str(cells[pc_col]).strip().endswith("%"):
            at = list(cells)
            at[pc_col] = str(cells[pc_col]).strip()[:-1]
        p = Progress(self.point(number, act_id, cells, "actual_start"), self.point(number, act_id, cells, "actual_finish"),
                     *(self.number(number, act_id, at, k) for k in PROGRESS_NUMBERS))
        return None if p.is_empty else p

    def distribution(self, number: int, act_id: str, cells: list[str]):
        text = self.cell(cells, "distribution").lower()
        if not text:
            return None
        text = DISTRIBUTION_ALIASES.get(text.replace(" ", ""), text)
        if text not in DISTRIBUTIONS:
            self.problem(number, act_id, "distribution", f"unknown distribution {text!r} (use {', '.join(DISTRIBUTIONS)})")
            return None
        return text

    def read(self, number: int, cells: list[str]) -> None:
        if not any(str(c).strip() for c in cells):
            return  # a blank row: skipped
        act_id = self.cell(cells, "id")
        self._overflow(number, act_id, cells)
        if not act_id:
            self.problem(number, "", "id", "the id is empty")
            return
        before = len(self.problems)
        values = {n: self.number(number, act_id, cells, n) for n in NUMBER_FIELDS}
        texts = {n: self.cell(cells, n) for n in TEXT_FIELDS}
        act = Activity(act_id, **texts, **values, distribution=self.distribution(number, act_id, cells),
                       start_no_earlier=self.point(number, act_id, cells, "start_no_earlier"),
                       finish_no_later=self.point(number, act_id, cells, "finish_no_later"),
                       resources=self.needs(number, act_id, cells),
                       progress=self.progress(number, act_id, cells))
        self._predecessors(number, act_id, cells)
        if len(self.problems) == before:
            self._accept(number, act)

    def needs(self, number: int, act_id: str, cells: list[str]) -> tuple:
        """The ``resources`` cell, each resource known and never asked for more than exists."""
        from .resource_table import parse_needs

        try:
            needs = parse_needs(self.cell(cells, "resources"), act_id)
        except PlanError as exc:
            self.problem(number, act_id, "resources", _strip_activity(str(exc), act_id))
            return ()
        for res, units in needs:
            known = self.resources.get(res)
            if known is None:
                where = (f"resources: {', '.join(sorted(self.resources))}" if self.resources else
                         "give the resources in a sheet named Resources, or with --resources FILE")
                self.problem(number, act_id, "resources", f"unknown resource {res!r} ({where})")
            elif units > known.most_units:
                self.problem(number, act_id, "resources", f"needs {units:g} units of {res} but at most "
                             f"{known.most_units:g} ever exist; it could never be scheduled")
        return needs

    def _overflow(self, number: int, act_id: str, cells: list[str]) -> None:
        """Text beyond the last header cell is refused, never silently dropped (often a
        cell holding the delimiter without quotes)."""
        extra = [str(c).strip() for c in cells[self.cols.width:] if str(c).strip()]
        if extra:
            self.problem(number, act_id, None, f"{len(extra)} cell{'s' if len(extra) > 1 else ''} beyond the last "
                         f"header column ({extra[0]!r}); give it a header, or quote a cell that holds the delimiter")

    def _predecessors(self, number: int, act_id: str, cells: list[str]) -> None:
        try:
            for link in parse_predecessors(self.cell(cells, "predecessors"), act_id, self.decimal_comma):
                self.links.append((number, link))
        except PlanError as exc:
            self.problem(number, act_id, "predecessors", _strip_activity(str(exc), act_id))

    def _accept(self, number: int, act: Activity) -> None:
        if any(c.isspace() for c in act.id):
            self.problem(number, act.id, "id", "an id cannot contain spaces (a predecessor cell could not name it)")
            return
        try:
            check_activity_text(act.validated())
        except PlanError as exc:
            self.problem(number, act.id, None, _strip_activity(str(exc), act.id))
            return
        if act.id in self.rows:
            self.problem(number, act.id, "id", f"duplicate id, first used on row {self.rows[act.id]}")
            return
        self.rows[act.id] = number
        self.activities.append(act)

    def check_links(self, all_ids: set[str]) -> list[Link]:
        folded = {i.casefold(): i for i in all_ids}
        for number, link in self.links:
            if link.pred not in all_ids:
                near = folded.get(link.pred.casefold())
                hint = f"; ids are case-sensitive: did you mean {near!r}?" if near else ""
                self.problem(number, link.succ, "predecessors", f"unknown predecessor {link.pred!r} (no row has that id{hint})")
        return [link for _, link in self.links]


def _strip_activity(message: str, act_id: str) -> str:
    prefix = f"activity {act_id}: "
    return message[len(prefix):] if message.startswith(prefix) else message


def _row_number(problem: str) -> int:
    match = re.match(r"row (\d+)", problem)
    return int(match.group(1)) if match else 0


def _all_ids(rows: list[Row], reader: RowReader) -> set[str]:
    return {reader.cell(cells, "id") for _, cells in rows} - {""}


def build_plan(header: list[str], rows: list[Row], settings: Settings | None = None, *,
               header_row: int = 1, decimal_comma: bool = False, guarded: bool = True,
               source: str = "", resources=()) -> Plan:
    """A checked plan from a header and numbered rows, or TableImportError with every problem.
    ``guarded``: text may carry the CSV export's formula guard (not so in XLSX cells)."""
    cols = map_header(header, header_row)
    if cols.problems:
        raise TableImportError(cols.problems, source)
    if not resources:            # a plan with resources goes through the row reader
        with paused_gc():
            fast = bulk_plan(cols, rows, settings, decimal_comma)     # a clean table, read by columns
            if fast is not None:
                plan, numbers, compile_links = fast
                _check_loops(plan, numbers, source, compile_links)
                return plan
    reader = RowReader(cols, decimal_comma, guarded, resources or ())
    for number, cells in rows:
        reader.read(number, cells)
    links = reader.check_links(_all_ids(rows, reader))
    if not reader.activities and not reader.problems:
        reader.problems.append(f"no activity rows under the header (row {header_row})")
    if reader.problems:
        numbers = {reader.cell(cells, "id"): number for number, cells in rows}
        loop = _loop_among(_all_ids(rows, reader), links, numbers)
        raise TableImportError(sorted(reader.problems, key=_row_number) + ([loop] if loop else []), source)
    settings = replace(settings) if settings is not None else Settings()
    plan = Plan(settings, reader.activities, links, resources=list(resources or ()))
    _check_loops(plan, reader.rows, source)
    return plan


def _loop_among(ids: set[str], links, rows: dict[str, int]) -> str | None:
    """A loop in the links of every row (those with bad cells too), reported beside the
    other problems so one pass names them all; None when there is none."""
    order = sorted(ids, key=lambda a: rows.get(a, 0))
    kept = [link for link in links if link.pred in ids and link.succ in ids]
    try:
        compile_plan(Plan(Settings(), [Activity(a, duration=0.0) for a in order], kept))
    except CycleError as exc:
        where = ", ".join(str(rows[a]) for a in exc.loop[:-1] if a in rows)
        return f"{exc} (rows {where}, column 'predecessors')"
    except PlanError:
        return None
    return None


def _check_loops(plan: Plan, rows: dict[str, int], source: str, compile_links=None) -> None:
    """Refuse a loop, naming its rows; the network compiled here is kept for the first
    analysis (as a loaded plan file's is)."""
    try:
        analyzer = Analyzer(compile_links() if compile_links else compile_plan(plan))
        analyzer.links = list(plan.links)
        plan._analyzer = analyzer
    except CycleError as exc:
        where = ", ".join(str(rows[a]) for a in exc.loop[:-1])
        raise TableImportError([f"{exc} (rows {where}, column 'predecessors')"], source) from exc
    except PlanError as exc:
        raise TableImportError([str(exc)], source) from exc


def rows_to_plan(rows: list[dict[str, str]], settings: Settings | None = None) -> Plan:
    """Rows as dicts (header → cell text; the first is spreadsheet row 2) → a checked Plan."""
    header: list[str] = []
    for row in rows:
        header.extend(k for k in row if k not in header)
    numbered = [(i, [str(row.get(h, "") or "") for h in header]) for i, row in enumerate(rows, 2)]
    return build_plan(header, numbered, settings)

