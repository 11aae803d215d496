"""Network view: an edit that keeps the drawing's structure reuses the layout, and the
reused layout is exactly what a fresh layout would be."""

import pytest

from workbench.core.commands import EditActivity, SetLinks
from workbench.core.model import Link
from workbench.figures.network_layout import layout_plan
from workbench.ui.network import view as network_view
from workbench.ui.network.view import NetworkView
from workbench.ui.session import Session

from support.plans import small_plan


@pytest.fixture
def counted(qtbot, monkeypatch):
    calls, real = [], network_view.layout_plan

    def layout(*args, **kwargs):
        calls.append(args)
        return real(*args, **kwargs)
    monkeypatch.setattr(network_view, "layout_plan", layout)
    view = NetworkView(Session(small_plan()))
    qtbot.addWidget(view)
    return view, calls


def fresh(view):
    s = view.session
    return layout_plan(s.plan, s.analysis, view.options)


def test_duration_edit_reuses_the_layout_and_moves_the_critical_path(counted):
    view, calls = counted
    assert len(calls) == 1
    assert [n.id for n in view.layout_result.nodes if n.critical] == ["A", "B", "D"]
    view.session.push(EditActivity("C", duration=9.0))      # A → C (11) now outlasts A → B → D (8)
    assert len(calls) == 1                                   # no new layout
    want = fresh(view)
    assert view.layout_result.nodes == want.nodes and view.layout_result.links == want.links
    assert [n.id for n in view.layout_result.nodes if n.critical] == ["A", "C"]
    assert view.layout_result.geometry is want.geometry


def test_a_new_link_or_a_new_lag_lays_out_again(counted):
    view, calls = counted
    plan = view.session.plan
    base = [Link("A", "B"), Link("A", "C"), Link("B", "D")]
    view.session.push(SetLinks(base + [Link("C", "D", "SS", 4.0)]))
    assert len(calls) == 2                                   # lag label changed
    assert view.layout_result.links == fresh(view).links
    view.session.push(SetLinks(base + [Link("C", "D", "SS", 4.0), Link("B", "C")]))
    assert len(calls) == 3
    assert {(l.pred, l.succ) for l in view.layout_result.links} == {(l.pred, l.succ) for l in plan.links}


def test_a_rename_lays_out_again_with_the_new_id(counted):
    view, calls = counted
    view.session.push(EditActivity("B", id="B2"))
    assert len(calls) == 2
    assert [n.id for n in view.layout_result.nodes] == ["A", "B2", "C", "D"]
