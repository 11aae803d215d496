"""Only regular files are read as plans or tables (issue 20, item 13): a named pipe would
block the reader forever and a link to /dev/zero never ends. Each read runs in a child
process so that a reader that blocks fails the test instead of hanging the suite."""

import os
import subprocess
import sys
import textwrap

import pytest

pytestmark = pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="needs named pipes")

READ = textwrap.dedent("""
    import sys
    from workbench.core.errors import PlanError
    from workbench.io.tabular import load_any
    try:
        load_any(sys.argv[1])
    except PlanError as exc:
        print(exc)
""")


def read_in_child(path) -> str:
    proc = subprocess.run([sys.executable, "-c", READ, str(path)], capture_output=True, text=True, timeout=60)
    assert proc.returncode == 0, proc.stderr
    return proc.stdout


@pytest.mark.parametrize("name", ["plan.slw", "table.csv", "table.xlsx"])
def test_a_named_pipe_is_refused_not_waited_on(tmp_path, name):
    os.mkfifo(tmp_path / name)
    out = read_in_child(tmp_path / name)
    assert f"cannot read {name}: it is a pipe (FIFO), not a regular file" in out


@pytest.mark.skipif(not os.path.exists("/dev/zero"), reason="needs /dev/zero")
@pytest.mark.parametrize("name", ["plan.slw", "table.csv"])
def test_a_link_to_a_device_is_refused(tmp_path, name):
    (tmp_path / name).symlink_to("/dev/zero")
    out = read_in_child(tmp_path / name)
    assert f"cannot read {name}: it is a device, not a regular file" in out


def test_a_link_to_a_regular_plan_still_opens(tmp_path):
    from workbench.core.demo import demo_plan
    from workbench.io.planfile import load_plan, save_plan

    save_plan(demo_plan(), tmp_path / "real.slw")
    (tmp_path / "alias.slw").symlink_to(tmp_path / "real.slw")
    assert len(load_plan(tmp_path / "alias.slw")) == len(demo_plan())
