"""On a 1024×768 projector the summary strip keeps each figure to its lines: the other
method's line drops "(single path)", a caption says "(sim.)", and the critical path shows
as many ids as fit one line (the whole path stays in its tooltip), so the table below keeps
its rows. Wide, every wording is whole."""

from PySide6.QtGui import QFontMetrics

from support.ui import sample_plan, shown
from workbench.core.montecarlo import simulate
from workbench.core.demo import demo_plan
from workbench.ui.session import Session
from workbench.ui.workspace.summary_strip import SummaryStrip


def one_line(label) -> bool:
    return QFontMetrics(label.font()).horizontalAdvance(label.text()) <= label.contentsRect().width()


def strip_at(qtbot, plan, width):
    session = Session(plan)
    session.set_simulation(simulate(plan, 1000, seed=2))
    strip = shown(qtbot, SummaryStrip(session), (width, 200))
    strip.resize(width, 200)
    qtbot.wait(20)
    return strip


def test_narrow_every_line_fits_and_the_words_shorten(qtbot):
    strip = strip_at(qtbot, demo_plan(), 1000)
    full = strip.texts()
    for key in strip.FIELDS:
        assert one_line(strip.besides[key]), strip.besides[key].text()
        assert one_line(strip.captions[key]), strip.captions[key].text()
    assert strip.besides["finish"].text().startswith("PERT: ") and "(single path)" in full["finish_beside"]
    path = strip.values["path"]
    assert one_line(path) and path.text() != full["path"] and path.text().startswith("M0 → D1 → D2")
    assert path.toolTip().count("→") == len(strip.session.analysis.pert.path) - 1


def test_the_whole_wording_wherever_it_fits(qtbot):
    for width in (1024, 1800):
        strip = strip_at(qtbot, sample_plan(), width)
        full = strip.texts()
        pairs = [(strip.captions[k], full[f"{k}_caption"]) for k in strip.FIELDS]
        pairs += [(strip.besides[k], full[f"{k}_beside"]) for k in strip.FIELDS] + [(strip.values["path"], full["path"])]
        for label, whole in pairs:
            fits = QFontMetrics(label.font()).horizontalAdvance(whole) <= label.contentsRect().width()
            assert label.text() == whole or not fits, (label.text(), whole)     # shortened only when it must
            assert one_line(label) or label.text() == whole


def test_an_unshown_strip_says_everything_whole(qtbot):
    session = Session(sample_plan())
    strip = SummaryStrip(session)
    qtbot.addWidget(strip)
    full = strip.texts()
    assert [strip.besides[k].text() for k in strip.FIELDS] == [full[f"{k}_beside"] for k in strip.FIELDS]
