"""The recovery copy the autosave's worker writes: plain data in, the plan file's own bytes
out, checked against the disk before it takes the copy's name."""

import pytest

from support.ui import plan_state, sample_plan, ui_env  # noqa: F401 (fixtures)
from workbench.core.model import Activity, Plan
from workbench.io import atomic, plan_lines
from workbench.io.planfile import _layout, load_plan
from workbench.ui.workspace.recovery import write_copy


def big_plan(n: int) -> Plan:
    acts = [Activity(f"A{i}", f"step {i} \u00e9", duration=float(i % 7)) for i in range(n)]
    return Plan(sample_plan().settings, acts, [])


def test_copy_loads_back_as_the_plan(tmp_path):
    plan = sample_plan()
    path = write_copy(tmp_path, "k1", None, plan.snapshot())
    assert plan_state(load_plan(path)) == plan_state(plan)
    assert (tmp_path / "k1.json").is_file()


def test_a_large_plan_is_written_in_bounded_pieces(tmp_path):
    plan = big_plan(3 * plan_lines.SLICE + 5)
    parts = plan_lines.fast_parts(plan, _layout)
    assert max(p.count("\n") for p in parts) <= plan_lines.SLICE
    assert plan_state(load_plan(write_copy(tmp_path, "k2", None, plan))) == plan_state(plan)


def test_a_copy_that_reads_back_different_never_takes_the_name(tmp_path, monkeypatch):
    before = write_copy(tmp_path, "k3", None, sample_plan()).read_bytes()
    monkeypatch.setattr(atomic, "file_digest", lambda path, digest: "not the same")
    with pytest.raises(OSError, match="differs"):
        write_copy(tmp_path, "k3", None, big_plan(10))
    assert (tmp_path / "k3.slw").read_bytes() == before            # the previous copy stays
    assert sorted(p.name for p in tmp_path.iterdir()) == ["k3.json", "k3.slw"]   # no temporary file left


def test_text_the_file_cannot_hold_is_kept_cleaned(tmp_path):
    plan = sample_plan()
    object.__setattr__(plan.activities[1], "name", "Survey \ud800 rooms")   # as if it got past the edit
    copy = load_plan(write_copy(tmp_path, "k4", None, plan))
    assert copy.activities[1].name == "Survey \ufffd rooms"
