"""The hostile-input probe as a table (issue 20): one row per input — how it is built,
the exit code expected, a fragment of the expected message — each run as a separate
``slackline`` process under fixed limits on CPU time and memory (``support.hostile``), so
a hang or a runaway allocation fails the suite instead of the user's machine.

``OTHER_ROWS`` cover the pack and engine half of issue 20 (pack and engine limits,
Unicode fonts). A row may carry ``xfail`` (strict) while its fix is not in yet."""

from __future__ import annotations

import os
import re
import socket
from dataclasses import dataclass
from pathlib import Path
from typing import Callable

import pytest

from support.hostile import (activity_book, chain_data, changed_demo, demo_data, rewrite_zip, run_slackline,
                             write_json, xlsx_bytes)

HUGE = 10 ** 400


@dataclass
class Row:
    name: str
    make: Callable[[Path], list]  # builds the input in a folder, returns the arguments
    code: int | tuple[int, ...]
    fragment: str = ""  # in stdout+stderr; "" for none
    check: Callable[[Path], bool] | None = None  # output checks (correct output, nothing lost)
    xfail: str = ""


def slw(change, verb="analyze", *extra):
    return lambda d: [verb, changed_demo(d, change), *extra]


def plan_file(data_of, verb="analyze", *extra, name="plan.slw"):
    return lambda d: [verb, write_json(d, name, data_of()), *extra]


def raw_file(name, content: bytes, verb="analyze", *extra):
    def make(d):
        (d / name).write_bytes(content)
        return [verb, d / name, *extra]
    return make


def set_(section, **values):
    return lambda data: data[section].update(values) if isinstance(data[section], dict) else None


def first(section, **values):
    return lambda data: data[section][0].update(values)


def changed_demo_bytes() -> bytes:
    import json
    return json.dumps(demo_data()).encode()


def sparse(path: Path, size: int) -> Path:
    with open(path, "wb") as handle:
        handle.truncate(size)
    return path


# --- plan files ------------------------------------------------------------------
PLAN_ROWS = [
    Row("empty .slw", raw_file("e.slw", b""), 2, "the file is empty"),
    Row("binary .slw", raw_file("b.slw", bytes(range(256)) * 4), 2, "binary file"),
    Row("UTF-16 .slw", raw_file("u.slw", '{"format": 1}'.encode("utf-16")), 2, "UTF-16"),
    Row("not JSON", raw_file("j.slw", b"{activities: [}"), 2, "not valid JSON"),
    Row("deep nesting", raw_file("n.slw", b"[" * 100_000 + b"]" * 100_000), 2, "not valid plan JSON"),
    Row("NaN number", raw_file("nan.slw", b'{"format": "slackline-workbook", "version": 3, "x": NaN}'), 2,
        "NaN is not allowed"),
    Row("newer version", plan_file(lambda: {**demo_data(), "version": 99}), 2, "newer Slackline"),
    Row("wrong format", plan_file(lambda: {"format": "other", "version": 1}), 2, "not a Slackline plan file"),
    Row("duplicate key", raw_file("k.slw", b'{"format": "slackline-workbook", "format": "x"}'), 2, "appears twice"),
    Row("huge int duration", slw(first("activities", duration=HUGE)), 2, "field 'duration' is too large"),
    Row("huge int optimistic", slw(first("activities", optimistic=-HUGE)), 2, "field 'optimistic' is too large"),
    Row("huge int lag", slw(first("links", lag=HUGE)), 2, "field 'lag' is too large"),
    Row("huge int deadline", slw(set_("settings", deadline={"offset": HUGE})), 2, "field 'offset' is too large"),
    Row("huge int confidence", slw(set_("settings", target_confidence=HUGE)), 2, "'target_confidence' is too large"),
    Row("huge int correlation", slw(first("correlations", coefficient=HUGE)), 2, "'coefficient' is too large"),
    Row("huge int v1 duration", plan_file(lambda: {"format": "slackline-workbook", "version": 1, "start": "2027-01-04",
                                                   "activities": [{"id": "A", "duration": HUGE}]}), 2,
        "activity A: field 'duration' is too large"),
    Row("huge int v2 lag", plan_file(lambda: {**demo_data(), "version": 2,
                                              "links": [{"pred": "M0", "succ": "A1", "type": "FS", "lag": HUGE}]}),
        2, "field 'lag' is too large"),
    Row("float overflow 1e400", raw_file("f.slw", re.sub(rb'"duration": null', b'"duration": 1e400',
                                                         changed_demo_bytes(), count=1)), 2, "finite"),
    Row("duplicate link", slw(lambda d: d["links"].append(dict(d["links"][0]))), 2, "appears twice"),
    Row("duplicate link, export", slw(lambda d: d["links"].append(dict(d["links"][0])), "export", "-o", "t.csv"), 2,
        "appears twice"),
    Row("risk delay 1e300", slw(first("risks", pessimistic=1e300), "simulate", "--iterations", "200"), 2,
        "risk R1: field 'pessimistic'"),
    Row("negative probability", slw(first("risks", probability=-0.5)), 2, "must lie between 0 and 1"),
    Row("lone surrogate title (analyze)", slw(set_("settings", title="Kiosk \ud800")), 2,
        "settings: field 'title' holds a broken character"),
    Row("lone surrogate title (report)", slw(set_("settings", title="Kiosk \udc00"), "report", "-o", "p.pdf"), 2,
        "settings: field 'title'"),
    Row("lone surrogate name (export)", slw(first("activities", name="\ud83d"), "export", "-o", "t.csv"), 2,
        "activity M0: field 'name'"),
    Row("loop in links", slw(lambda d: d["links"].append({"pred": "H2", "succ": "M0", "type": "FS", "lag": 0})), 2,
        "\u2192"),
    Row("unknown activity in link", slw(first("links", succ="NOPE")), 2, "NOPE"),
    Row("over the size limit (sparse)", lambda d: ["analyze", sparse(d / "big.slw", 2 * 1024 ** 3 + 1)], 2,
        "Slackline never writes a plan file this large"),
    Row("emoji and scripts load", slw(first("activities", name="Handover \U0001F389 \u05d0\u05d1")), 0,
        "Handover"),
]


# --- paths that are not plain files ---------------------------------------------------
def fifo(d: Path):
    os.mkfifo(d / "pipe.slw")
    return ["analyze", d / "pipe.slw"]


def dev_zero(d: Path):
    (d / "zero.slw").symlink_to("/dev/zero")
    return ["analyze", d / "zero.slw"]


def fifo_import(d: Path):
    os.mkfifo(d / "pipe.csv")
    return ["import", d / "pipe.csv", "-o", d / "out.slw"]


PATH_ROWS = [
    Row("missing file", lambda d: ["analyze", d / "nowhere.slw"], 2, "no such file"),
    Row("a folder", lambda d: [(d / "dir.slw").mkdir(), "analyze", d / "dir.slw"][1:], 2, "folder"),
    Row("named pipe as plan", fifo, 2, "not a regular file"),
    Row("link to /dev/zero", dev_zero, 2, "not a regular file"),
    Row("named pipe as import", fifo_import, 2, "not a regular file"),
]


# --- spreadsheets -------------------------------------------------------------------
def xlsx_row(name, make_bytes, fragment):
    def make(d):
        (d / "in.xlsx").write_bytes(make_bytes())
        return ["import", d / "in.xlsx", "-o", d / "out.slw"]
    return Row(name, make, 2, fragment, check=lambda d: not (d / "out.slw").exists())


def no_sheets():
    return rewrite_zip(xlsx_bytes(activity_book()), lambda n, c: re.sub(rb"<sheets>.*</sheets>", b"<sheets/>", c, flags=re.S)
                       if n == "xl/workbook.xml" else (None if n.startswith("xl/worksheets/") else c))


def chart_only():
    import openpyxl
    book = openpyxl.Workbook()
    book.create_chartsheet("Chart").add_chart(openpyxl.chart.BarChart())
    book.remove(book.active)
    return xlsx_bytes(book)


def far_column(rows=70_000, declared=True):
    body = "".join(f'<row r="{r}"><c r="XFD{r}" t="inlineStr"><is><t>x</t></is></c></row>' for r in range(1, rows + 1))

    def sheet(name, content):
        if name != "xl/worksheets/sheet1.xml":
            return content
        content = re.sub(rb'<dimension ref="[^"]*" ?/>', b'<dimension ref="A1:XFD%d"/>' % rows if declared else b"", content)
        return re.sub(rb"<sheetData>.*</sheetData>", f"<sheetData>{body}</sheetData>".encode(), content, flags=re.S)
    return rewrite_zip(xlsx_bytes(activity_book()), sheet)


def zip_bomb():
    import zipfile, io
    out = io.BytesIO()
    with zipfile.ZipFile(out, "w", zipfile.ZIP_DEFLATED) as z:
        z.writestr("[Content_Types].xml", "<Types/>")
        z.writestr("xl/worksheets/sheet1.xml", b"<a>" + b" " * (20 * 2 ** 20) + b"</a>")
    return out.getvalue()


def entity_expansion():
    laughs = (b'<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol">'
              + b"".join(b'<!ENTITY lol%d "%s">' % (i, (b"&lol%d;" % (i - 1) if i > 1 else b"&lol;") * 10)
                         for i in range(1, 10)) + b"]>")
    return rewrite_zip(xlsx_bytes(activity_book()), lambda n, c: c.replace(b"<?xml version=\"1.0\"?>", b"")
                       .replace(b"<sheetData>", b"<sheetData>") if n != "xl/worksheets/sheet1.xml"
                       else laughs + re.sub(rb"^<\?xml[^>]*\?>", b"", c).replace(b"<t>Dig</t>", b"<t>&lol9;</t>"))


def csv_import(text: str):
    def make(d):
        (d / "t.csv").write_text(text, encoding="utf-8")
        return ["import", d / "t.csv", "-o", d / "o.slw"]
    return make


def load_name(path: Path) -> str:
    from workbench.io.planfile import load_plan
    return load_plan(path).activities[0].name


SHEET_ROWS = [
    xlsx_row("xlsx without sheets", no_sheets, "no worksheet with cells to read"),
    xlsx_row("xlsx with only a chart sheet", chart_only, "sheets: 'Chart'"),
    xlsx_row("xlsx 70,000 rows to XFD", far_column, "more than the 12,000,000 cells"),
    xlsx_row("xlsx hiding its size", lambda: far_column(3_000, declared=False), "holds more than"),
    xlsx_row("xlsx zip bomb", zip_bomb, "zip bomb"),
    xlsx_row("xlsx entity expansion", entity_expansion, "cannot read the workbook"),
    xlsx_row("not a zip, .xlsx", lambda: b"id,name\nA,B\n", "not a valid XLSX workbook"),
    Row("csv: lag 1e400", csv_import("id,duration,predecessors\nA,1,\nB,2,A FS 1e400\n"), 2, "row 3"),
    Row("csv: formula text stays text", csv_import('id,name,duration\nA,"=HYPERLINK(""x"")",1\n'), 0, "imported 1",
        check=lambda d: load_name(d / "o.slw") == '=HYPERLINK("x")'),
]


# --- arguments and locks --------------------------------------------------------------
def locked_target(d: Path):
    (d / "new.csv").write_text("id,duration\nA,1\n")
    target = changed_demo(d, lambda data: None, "team.slw")
    (d / ".team.slw.lock").write_text(f"{os.getppid()}\nslackline\n{socket.gethostname()}\n")
    return ["import", d / "new.csv", "-o", target]


def planted_link(d: Path):
    (d / "private.txt").write_text("keep me")
    for name in (".out.csv.tmp", f".out.csv.{os.getpid()}.tmp"):
        (d / name).symlink_to(d / "private.txt")
    return ["export", changed_demo(d, lambda data: None), "-o", d / "out.csv"]


ARGUMENT_ROWS = [
    Row("--deadline ''", slw(lambda d: None, "analyze", "--deadline", ""), 2, "--deadline: empty"),
    Row("--deadline ' ' simulate", slw(lambda d: None, "simulate", "--deadline", " "), 2, "--deadline: empty"),
    Row("--deadline 1e400", slw(lambda d: None, "analyze", "--deadline", "1e400"), 2, "--deadline"),
    Row("--deadline 3000-01-01", slw(lambda d: None, "analyze", "--deadline", "3000-01-01"), 2, "outside"),
    Row("--iterations -5", slw(lambda d: None, "simulate", "--iterations", "-5"), 2, "--iterations"),
    Row("unknown verb", lambda d: ["analyse-this"], 2, "unknown verb"),
    Row("import over a locked plan", locked_target, 2, "open for editing in a Slackline window",
        check=lambda d: "Kiosk" in (d / "team.slw").read_text() or "M0" in (d / "team.slw").read_text()),
    Row("export past a planted link", planted_link, 0, "exported",
        check=lambda d: (d / "private.txt").read_text() == "keep me" and (d / "out.csv").stat().st_size > 0),
    Row("report -o .txt", slw(lambda d: None, "report", "-o", "p.txt"), 2, ".pdf"),
]


# --- the other half of issue 20: expected behaviour -----------------------------------
def long_chain(n, verb="report", *extra, **settings):
    return plan_file(lambda: chain_data(n, **settings), verb, *extra)


def far_dates(d: Path):
    data = demo_data()
    data["settings"]["deadline"] = {"offset": -1_000_000}
    return ["analyze", write_json(d, "far.slw", data)]


def far_simulate(d: Path):
    return ["simulate", far_dates(d)[1], "--iterations", "200"]


def pdf_text(path: Path) -> str:
    from pypdf import PdfReader
    return "\n".join(page.extract_text() or "" for page in PdfReader(str(path)).pages)


SCRIPTS = ["\u05d1\u05d3\u05d9\u05e7\u05d4", "\u0641\u062d\u0635", "\u0388\u03bb\u03b5\u03b3\u03c7\u03bf\u03c2",
           "\u041f\u0440\u043e\u0432\u0435\u0440\u043a\u0430", "Odbi\u00f3r \u0142\u0105cz", "\u691c\u67fb"]


OTHER_ROWS = [
    Row("pack: 2,000-activity critical path", long_chain(2000, "report", "-o", "p.pdf", "--iterations", "100"), 0,
        "wrote", check=lambda d: (d / "p.pdf").stat().st_size > 0),
    Row("deadline offset -1,000,000 (analyze)", far_dates, (0, 2), ""),
    Row("deadline offset -1,000,000 (simulate)", far_simulate, (0, 2), ""),
    Row("activity of 1,000,000 days (report)", slw(first("activities", duration=1_000_000.0, optimistic=None,
                                                         most_likely=None, pessimistic=None),
                                                   "report", "-o", "p.pdf", "--iterations", "100"), (0, 2), ""),
    Row("long prepared-by (report)", slw(set_("settings", prepared_by="Planning office " * 400),
                                         "report", "-o", "p.pdf", "--iterations", "100"), (0, 2), ""),
    Row("10 MB activity name (report)", slw(first("activities", name="N" * 10_000_000), "report", "-o", "p.pdf",
                                            "--iterations", "100"), (0, 2), ""),
    Row("correlation group of 20,000", plan_file(lambda: {**chain_data(20_000), "correlations": [
        {"name": "all", "activities": [f"C{i}" for i in range(20_000)], "coefficient": 0.5}]},
        "simulate", "--iterations", "200"), 0, "P80"),
    Row("pack: one name per script", plan_file(lambda: chain_data(len(SCRIPTS), name_of=lambda i: SCRIPTS[i]),
                                              "report", "-o", "p.pdf", "--iterations", "100"), 0, "wrote",
        check=lambda d: all(s in pdf_text(d / "p.pdf") for s in SCRIPTS[2:])),
]

ROWS = PLAN_ROWS + PATH_ROWS + SHEET_ROWS + ARGUMENT_ROWS + OTHER_ROWS
POSIX_ONLY = {"named pipe as plan", "link to /dev/zero", "named pipe as import", "export past a planted link"}


def params():
    for row in ROWS:
        marks = []
        if row.xfail:
            marks.append(pytest.mark.xfail(reason=row.xfail, strict=True))
        if row.name in POSIX_ONLY and os.name != "posix":
            marks.append(pytest.mark.skip(reason="POSIX only"))
        yield pytest.param(row, id=row.name, marks=marks)


@pytest.mark.parametrize("row", list(params()))
def test_hostile_input(row: Row, tmp_path):
    argv = row.make(tmp_path)
    outcome = run_slackline(argv, cwd=tmp_path)
    assert outcome.kind == "exit", f"{outcome.kind}: {outcome.err[-500:]}"
    codes = row.code if isinstance(row.code, tuple) else (row.code,)
    assert outcome.code in codes, outcome.err[-500:]
    assert row.fragment in outcome.text, outcome.text[-500:]
    if row.check is not None:
        assert row.check(tmp_path)
