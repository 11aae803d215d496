"""A Trade-off view on the demo plan, shown and with its curve computed (shared fixture body)."""

from workbench.core.demo import demo_plan
from workbench.ui.session import Session
from workbench.ui.tradeoff.view import TradeoffView


def shown_tradeoff_view(qtbot, size: tuple[int, int]):
    """Yields the view once its curve has arrived; stops and waits for its worker after."""
    v = TradeoffView(Session(demo_plan()))
    qtbot.addWidget(v)
    v.resize(*size)
    v.show()
    qtbot.waitExposed(v)
    qtbot.waitUntil(lambda: v.result is not None, timeout=30000)
    yield v
    v.runner.stop()
    v.runner.wait()
