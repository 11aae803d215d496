"""Shared test set-up: Qt offscreen, temporary settings and data folders, hypothesis profiles."""

import os
import sys

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

import pytest  # noqa: E402
from hypothesis import HealthCheck, settings  # noqa: E402

# CI draws the same examples every run (seeded from each test), so a gate is repeatable and
# what passed here passes there; the dev profile draws afresh each run to keep finding cases.
settings.register_profile("ci", max_examples=60, deadline=None, derandomize=True,
                          suppress_health_check=[HealthCheck.too_slow])
settings.register_profile("dev", max_examples=100, deadline=None)
settings.load_profile(os.environ.get("HYPOTHESIS_PROFILE", "dev"))


@pytest.fixture(autouse=True)
def _no_worker_outlives_its_test():
    """Work a test started (a simulation, an autosave, ...) ends with the test: after it,
    every job is abandoned and waited for, within a bound; one still running fails the
    test by name instead of leaking into the next test or hanging the run."""
    yield
    workers = sys.modules.get("workbench.ui.workers")   # only where the window was used
    if workers is not None:
        left = workers.settle(20.0)
        assert not left, f"worker threads still running 20 s after the test: {left}"
