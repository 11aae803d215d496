"""Building hostile inputs and running one ``slackline`` command under a fixed budget.

Each command runs in a child process with ``resource`` limits on CPU time and memory and a
wall-clock timeout, so a hang or a runaway allocation fails a test instead of the machine.
"""

from __future__ import annotations

import io
import json
import os
import subprocess
import sys
import zipfile
from dataclasses import dataclass
from pathlib import Path

CPU_SECONDS = 60
MEMORY_BYTES = 2 * 1024 ** 3
WALL_SECONDS = 120


@dataclass
class Outcome:
    code: int | None  # None: stopped at the wall-clock budget (a hang)
    out: str
    err: str

    @property
    def text(self) -> str:
        return self.out + self.err

    @property
    def kind(self) -> str:
        if self.code is None:
            return "hang"
        if self.code < 0 or "internal error" in self.err or "Traceback" in self.err:
            return "crash"
        return "exit"


def _limits():  # runs in the child before exec
    import resource
    resource.setrlimit(resource.RLIMIT_CPU, (CPU_SECONDS, CPU_SECONDS + 5))
    resource.setrlimit(resource.RLIMIT_AS, (MEMORY_BYTES, MEMORY_BYTES))


def run_slackline(argv, cwd) -> Outcome:
    env = dict(os.environ, OPENBLAS_NUM_THREADS="1", OMP_NUM_THREADS="1", MKL_NUM_THREADS="1",
               QT_QPA_PLATFORM="offscreen")
    env.pop("SLACKLINE_DEBUG", None)
    try:
        proc = subprocess.run([sys.executable, "-m", "workbench.cli", *map(str, argv)], cwd=cwd, env=env,
                              capture_output=True, text=True, errors="replace", timeout=WALL_SECONDS,
                              preexec_fn=_limits if os.name == "posix" else None)
    except subprocess.TimeoutExpired as exc:
        return Outcome(None, str(exc.stdout or ""), str(exc.stderr or ""))
    return Outcome(proc.returncode, proc.stdout, proc.stderr)


# --- inputs --------------------------------------------------------------------
def demo_data() -> dict:
    from workbench.core.demo import demo_plan
    from workbench.io.planfile import plan_to_dict
    return plan_to_dict(demo_plan())


def write_json(folder: Path, name: str, data, ensure_ascii: bool = True) -> Path:
    path = folder / name
    path.write_text(json.dumps(data, ensure_ascii=ensure_ascii), encoding="utf-8")
    return path


def changed_demo(folder: Path, change, name: str = "plan.slw") -> Path:
    data = demo_data()
    change(data)
    return write_json(folder, name, data)


def chain_data(n: int, name_of=lambda i: f"Step {i}", **settings) -> dict:
    data = demo_data()
    data["settings"].update(deadline=None, **settings)
    data["activities"] = [{"id": f"C{i}", "name": name_of(i), "group": "", "notes": "", "optimistic": 1.0,
                           "most_likely": 2.0, "pessimistic": 4.0, "duration": None, "distribution": None,
                           "start_no_earlier": None, "finish_no_later": None} for i in range(n)]
    data["links"] = [{"pred": f"C{i}", "succ": f"C{i + 1}", "type": "FS", "lag": 0.0} for i in range(n - 1)]
    data["risks"], data["correlations"] = [], []
    data.get("costs", {}).pop("activities", None)       # the demo's per-activity costs name its own ids
    return data


def xlsx_bytes(book) -> bytes:
    out = io.BytesIO()
    book.save(out)
    return out.getvalue()


def rewrite_zip(data: bytes, change) -> bytes:
    """A copy of the zip with ``change(name, bytes) -> bytes | None`` applied (None drops it)."""
    src, out = zipfile.ZipFile(io.BytesIO(data)), io.BytesIO()
    with zipfile.ZipFile(out, "w", zipfile.ZIP_DEFLATED) as dst:
        for info in src.infolist():
            content = change(info.filename, src.read(info.filename))
            if content is not None:
                dst.writestr(info.filename, content)
    return out.getvalue()


def activity_book():
    import openpyxl
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "Activities"
    sheet.append(["id", "name", "duration", "predecessors"])
    sheet.append(["A", "Dig", 3, ""])
    return book
