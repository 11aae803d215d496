"""The Network dock shows a small plan fitted the first time it is shown at its size, and
keeps it fitted through resizes until the user zooms or pans."""

from PySide6.QtCore import QPointF

from support.plans import small_plan
from workbench.ui.network.view import NetworkView
from workbench.ui.session import Session
from support.ui import shown


def _share_of_width(view) -> float:
    b = view.layout_result.boxes
    vb = view.viewbox
    left = vb.mapViewToScene(QPointF(b[:, 0].min(), 0)).x()
    right = vb.mapViewToScene(QPointF((b[:, 0] + b[:, 2]).max(), 0)).x()
    top = vb.mapViewToScene(QPointF(0, b[:, 1].min())).y()
    foot = vb.mapViewToScene(QPointF(0, (b[:, 1] + b[:, 3]).max())).y()
    rect = vb.sceneBoundingRect()
    return max((right - left) / rect.width(), (foot - top) / rect.height())


def test_a_small_plan_fills_the_dock_when_first_shown(qtbot):
    view = NetworkView(Session(small_plan()))
    qtbot.addWidget(view)
    view.resize(900, 90)                  # first laid out squeezed (a dock before the window settles)
    view.show()
    qtbot.waitExposed(view)
    qtbot.wait(50)
    view.resize(300, 600)                 # then at its real size
    qtbot.wait(50)
    assert _share_of_width(view) > 0.8


def test_after_the_user_zooms_a_resize_keeps_the_view(qtbot):
    view = shown(qtbot, NetworkView(Session(small_plan())), (900, 600))
    qtbot.wait(50)
    view.viewbox.scaleBy((0.5, 0.5))            # zoom in
    view.viewbox.sigRangeChangedManually.emit(view.viewbox.state["mouseEnabled"])
    view.resize(700, 600)
    qtbot.wait(50)
    assert not view._auto_fit and _share_of_width(view) > 1.2      # still zoomed in, not refitted


def test_a_newly_opened_small_plan_is_fitted_not_drawn_at_the_old_plans_scale(qtbot):
    from workbench.core.demo import demo_plan
    session = Session(demo_plan())
    view = shown(qtbot, NetworkView(session), (900, 600))
    qtbot.wait(50)
    session.load(small_plan())            # File → Open of a small plan
    qtbot.wait(50)
    assert _share_of_width(view) > 0.8
