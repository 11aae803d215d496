"""Render the Network view to PNG for people to look at:
``python -m workbench.ui.network.shot OUT.png [PLAN] [--bands] [--time]``.

Uses the demo plan when no plan file is given (``workbench.core.demo`` when present,
otherwise the small invented plan below).
"""

from __future__ import annotations

import datetime as dt
import sys

# An invented 40-activity scenario: refitting a town workshop into a repair café.
_ROWS = """\
K1|Kick-off and brief|Set-up|2|3|5|
K2|Survey the building|Set-up|3|4|8|K1
K3|Agree the budget|Set-up|2|3|6|K1
D1|Sketch floor plan|Design|3|5|9|K2
D2|Services layout|Design|4|6|10|D1
D3|Fit-out drawings|Design|5|7|12|D1
D4|Planning consent|Design|10|15|30|D1;K3
D5|Final design sign-off|Design|0|0|0|D2;D3;D4
P1|Choose contractors|Buying|4|6|9|K3;D1 SS 2
P2|Order benches and racks|Buying|2|3|5|D3
P3|Order tools|Buying|1|2|4|P1
P4|Order electrics kit|Buying|1|2|3|D2
W1|Strip out old fittings|Works|3|4|6|P1
W2|Repair roof|Works|5|8|14|W1;K2
W3|First-fix electrics|Works|4|5|8|W1;P4;D5
W4|First-fix plumbing|Works|3|4|7|W1;D5
W5|Plaster walls|Works|4|6|9|W3;W4
W6|Lay floor|Works|3|4|6|W5 FF 1
W7|Second-fix electrics|Works|2|3|5|W5
W8|Second-fix plumbing|Works|2|2|4|W5
W9|Paint and decorate|Works|4|5|8|W6;W7;W8
W10|Fit benches and racks|Works|2|3|5|W9;P2
W11|Accessible ramp|Works|3|5|9|W2
W12|Works complete|Works|0|0|0|W10;W11
S1|Write safety rules|People|2|3|5|K3
S2|Recruit volunteer fixers|People|5|8|14|K3
S3|Train fixers|People|3|4|6|S2;S1
S4|Tool induction|People|1|2|3|S3;P3;W12
S5|Rota for opening month|People|1|1|2|S3
C1|Name and logo|Outreach|2|3|6|K1
C2|Web page|Outreach|2|3|5|C1
C3|Posters and flyers|Outreach|1|2|4|C1
C4|Invite local press|Outreach|1|1|2|C3
C5|Partner schools|Outreach|3|5|8|C2
O1|Insurance in place|Opening|2|3|5|K3;S1
O2|Trial repair day|Opening|1|1|2|S4;O1;W12
O3|Fix snags|Opening|1|2|4|O2
O4|Opening event|Opening|1|1|1|O3;C4;C5;S5
O5|Handover to committee|Opening|1|2|3|O4
O6|Project closed|Opening|0|0|0|O5"""


def sample_plan():
    """The invented repair-café plan (40 activities, a few SS/FF links with lags)."""
    from workbench.core.model import Activity, Link, Plan, Settings

    acts, links = [], []
    for line in _ROWS.splitlines():
        act_id, name, group, a, m, b, preds = line.split("|")
        acts.append(Activity(id=act_id, name=name, group=group, optimistic=float(a),
                             most_likely=float(m), pessimistic=float(b)))
        if preds:
            for item in preds.split(";"):
                parts = item.split()
                kind = parts[1] if len(parts) > 1 else "FS"
                links.append(Link(parts[0], act_id, kind, float(parts[2]) if len(parts) > 2 else 0.0))
    return Plan(Settings(title="Repair caf\u00e9 refit", start=dt.date(2027, 3, 1)), acts, links)


def demo_or_sample():
    try:
        from workbench.core.demo import demo_plan
    except ImportError:
        return sample_plan()
    return demo_plan()


def render(out: str, plan=None, bands: bool = False, time_scaled: bool = False,
           size=(1920, 1080)) -> None:
    from PySide6.QtWidgets import QApplication

    from workbench.ui.network.view import NetworkView
    from workbench.ui.session import Session

    app = QApplication.instance() or QApplication(sys.argv[:1])
    view = NetworkView(Session(plan if plan is not None else demo_or_sample()))
    view.resize(*size)
    view.show()
    view.band_box.setChecked(bands)
    view.time_box.setChecked(time_scaled)
    app.processEvents()
    view.fit()
    app.processEvents()
    view.grab().save(out)
    view.close()


def main(argv=None) -> int:
    args = list(sys.argv[1:] if argv is None else argv)
    flags = {a for a in args if a.startswith("--")}
    rest = [a for a in args if not a.startswith("--")]
    if not rest:
        print("usage: python -m workbench.ui.network.shot OUT.png [PLAN] [--bands] [--time]")
        return 2
    plan = None
    if len(rest) > 1:
        try:
            from workbench.io.tabular import load_any
        except ImportError:
            from workbench.io.planfile import load_plan as load_any
        plan = load_any(rest[1])
    render(rest[0], plan, "--bands" in flags, "--time" in flags)
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
