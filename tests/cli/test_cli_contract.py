"""The `analyze --json` contract holds on random networks with all four link types."""

from __future__ import annotations

import json

from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.cli import main

EPS = 1e-7


@st.composite
def networks(draw):
    n = draw(st.integers(2, 14))
    rows, links = [], []
    for j in range(n):
        a = draw(st.integers(0, 6))
        m = a + draw(st.integers(0, 6))
        b = m + draw(st.integers(0, 6))
        preds = draw(st.lists(st.integers(0, j - 1), max_size=3, unique=True)) if j else []
        items = []
        for i in preds:
            kind = draw(st.sampled_from(["FS", "SS", "FF", "SF"]))
            lag = draw(st.integers(-3, 5))
            items.append(f"T{i} {kind} {lag}")
            links.append((f"T{i}", f"T{j}", kind, lag))
        rows.append(f"T{j},{a},{m},{b},{'; '.join(items)}")
    return "id,optimistic,most_likely,pessimistic,predecessors\n" + "\n".join(rows) + "\n", links


def link_holds(kind, lag, p, s):
    """Forward and backward inequalities of one link (design.md conventions)."""
    ends = {"FS": ("ef", "es"), "SS": ("es", "es"), "FF": ("ef", "ef"), "SF": ("es", "ef")}
    src, dst = ends[kind]
    late = {"es": "ls", "ef": "lf"}
    return (s[dst] >= p[src] + lag - EPS) and (s[late[dst]] >= p[late[src]] + lag - EPS)


@settings(max_examples=40, deadline=None)
@given(networks())
def test_json_contract_on_random_networks(tmp_path_factory, net):
    text, links = net
    path = tmp_path_factory.mktemp("net") / "plan.csv"
    path.write_text(text, encoding="utf-8")
    import contextlib
    import io

    buffer = io.StringIO()
    with contextlib.redirect_stdout(buffer):
        assert main(["analyze", str(path), "--json"]) == 0
    data = json.loads(buffer.getvalue())
    acts = data["activities"]
    for p, s, kind, lag in links:
        assert link_holds(kind, lag, acts[p], acts[s]), (p, s, kind, lag)
    assert max(a["ef"] for a in acts.values()) == data["duration"]
    for a in acts.values():
        assert a["es"] >= -EPS and a["lf"] <= data["duration"] + EPS
        assert abs((a["ls"] - a["es"]) - a["total_float"]) < EPS and a["total_float"] >= -EPS
    path_ids = data["critical_path"]
    assert path_ids and all(acts[i]["critical"] for i in path_ids)
    linked = {(p, s) for p, s, _, _ in links}
    assert all((a, b) in linked for a, b in zip(path_ids, path_ids[1:]))
    # JSON numbers are rounded to 9 decimals per activity, hence the tolerance.
    assert abs(data["pert"]["variance"] - sum(acts[i]["variance"] for i in path_ids)) < 1e-6
