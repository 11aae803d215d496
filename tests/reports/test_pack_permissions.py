"""The pack is written with the usual permissions (the umask decides), like plan and CSV files."""

import datetime as dt
import os
import stat
import sys

import pytest

from workbench.core.model import Activity, Link, Plan, Settings
from workbench.reports.pack import build_pack

pytestmark = pytest.mark.skipif(sys.platform.startswith("win"), reason="POSIX permissions")


@pytest.fixture
def umask_022():
    old = os.umask(0o022)
    yield
    os.umask(old)


def test_pack_pdf_is_readable_by_colleagues(tmp_path, umask_022):
    plan = Plan(Settings(title="Perms", start=dt.date(2027, 3, 1)),
                [Activity("A", duration=2), Activity("B", duration=3)], [Link("A", "B")])
    out = tmp_path / "pack.pdf"
    build_pack(plan, out, iterations=0)
    assert stat.S_IMODE(out.stat().st_mode) == 0o644
    csv = tmp_path / "plain.csv"
    csv.write_text("x")   # what any other file gets under the same umask
    assert stat.S_IMODE(out.stat().st_mode) == stat.S_IMODE(csv.stat().st_mode)
    assert not [p for p in tmp_path.iterdir() if p.name.endswith(".part")]
