"""``slackline --self-test``: a small analysis, simulation and approval pack, headless.

Used after installing (and on a frozen build) to prove that everything the app needs is
present. Prints one line per check; exits 0 when all pass, 1 otherwise.
"""

from __future__ import annotations

import tempfile
import time
from pathlib import Path


def _demo_plan():
    from .core.demo import demo_plan
    from .resources import demo_path

    path = demo_path()
    if path.exists():
        from .io.planfile import load_plan
        return load_plan(path)
    return demo_plan()


def _check_analysis(state):
    from .core.analysis import analyze

    state["plan"] = plan = _demo_plan()
    result = analyze(plan)
    assert result.schedule.finish > 0 and result.pert.path, "the demo plan has no critical path"
    return f"{len(plan)} activities, finish {result.finish_date}, critical path of {len(result.pert.path)}"


def _check_simulation(state):
    from .core.montecarlo import simulate

    result = simulate(state["plan"], 2000, seed=7)
    assert result.mean >= result.pert_mean - 1e-9 or result.merge_bias < 0.5, "implausible simulation"
    return f"2000 iterations, mean {result.mean:.2f}, merge bias {result.merge_bias:+.2f}"


def _check_pack(state):
    from .reports.pack import build_pack

    with tempfile.TemporaryDirectory() as folder:
        out = Path(folder) / "self-test.pdf"
        build_pack(state["plan"], out, iterations=500, seed=7)
        size = out.stat().st_size
        assert out.read_bytes()[:5] == b"%PDF-", "the pack is not a PDF"
    return f"approval pack {size // 1024} KiB"


def _check_qt(state):
    from .ui.self_check import check_qt

    return check_qt()


CHECKS = [("analysis", _check_analysis), ("simulation", _check_simulation),
          ("approval pack", _check_pack), ("Qt", _check_qt)]


def run_self_test() -> int:
    state: dict = {}
    failures = 0
    for name, check in CHECKS:
        t0 = time.perf_counter()
        try:
            detail = check(state)
            print(f"ok    {name:<14} {detail} ({(time.perf_counter() - t0) * 1000:.0f} ms)")
        except Exception as exc:  # report every missing piece, not just the first
            failures += 1
            print(f"FAIL  {name:<14} {type(exc).__name__}: {exc}")
            if name == "analysis":
                break
    print("self-test passed" if not failures else f"self-test failed: {failures} check(s)")
    return 0 if failures == 0 else 1
