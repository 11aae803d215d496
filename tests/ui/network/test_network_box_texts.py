"""What a Network box says at a zoom: names as soon as a line of them can be read (the
demo in the window's dock shows names, not ids only), dates in the table's format once
zoomed in, the larger figures on paper."""

from PySide6.QtCore import QBuffer, QIODevice, QPointF, QRectF, QSize
from PySide6.QtGui import QPainter
from PySide6.QtSvg import QSvgGenerator

from workbench.core.demo import demo_plan
from workbench.core.formatting import format_date
from workbench.ui.network import detail
from workbench.ui.network.view import NetworkView
from workbench.ui.session import Session
from support.ui import shown


def screen_scale(view) -> float:
    return 1.0 / view.viewbox.viewPixelSize()[0]


def test_the_demo_in_the_docked_network_shows_names(window, qtbot):
    window.session.load(demo_plan())
    window.show()
    window.resize(1920, 1080)
    window.docks["Network"].raise_()
    view = window.view("Network")
    qtbot.waitUntil(lambda: view.layout_result is not None and view.isVisible())
    qtbot.wait(50)
    painter, scale = view.item.painter, screen_scale(view)
    assert painter.level(scale) == "compact"
    small = detail.compact(float(view.layout_result.boxes[0, 3]), scale, painter.weights)
    assert small.lines >= 1 and small.name_size * scale >= detail.NAME_MIN_PX - 0.5
    for row, act in enumerate(window.session.plan.activities):
        lines = detail.name_lines(painter, row, small)
        assert lines, act.id
        assert act.name.startswith(lines[0].rstrip("\u2026").rstrip())     # the name, elided
    image = view.graphics.grab().toImage()
    row = view.layout_result.index_of("D1")
    x, y, w, h = map(float, view.layout_result.boxes[row])
    top = view.graphics.mapFromScene(view.viewbox.mapViewToScene(QPointF(x + 0.1 * w, y + small.header + 2 / scale)))
    foot = view.graphics.mapFromScene(view.viewbox.mapViewToScene(QPointF(x + 0.9 * w, y + 0.9 * h)))
    dark = sum(image.pixelColor(px, py).lightness() < 110
               for px in range(top.x(), foot.x()) for py in range(top.y(), foot.y()))
    assert dark >= 8                      # ink of the name in the white part of the box


def zoomed(qtbot, node_px: float):
    view = shown(qtbot, NetworkView(Session(demo_plan())), (900, 420))
    i = view.layout_result.index_of("B4")
    x, y, w, h = map(float, view.layout_result.boxes[i])
    span = w * view.viewbox.width() / node_px
    view.viewbox.setRange(QRectF(x + w / 2 - span / 2, y + h / 2 - span / 4, span, span / 2), padding=0)
    qtbot.wait(20)
    return view, i


def svg_text(view, row: int, scale: float) -> str:
    """The SVG the painter writes for the box ``row`` at ``scale`` (texts are plain in it)."""
    x, y, w, h = map(float, view.layout_result.boxes[row])
    gen, buffer = QSvgGenerator(), QBuffer()
    buffer.open(QIODevice.OpenModeFlag.WriteOnly)
    gen.setOutputDevice(buffer)
    gen.setSize(QSize(int(w * scale) + 1, int(h * scale) + 1))
    p = QPainter(gen)
    p.scale(scale, scale)
    p.translate(-x, -y)
    view.item.painter.paint(p, QRectF(x, y, w, h), scale)
    p.end()
    return bytes(buffer.data()).decode("utf-8", "replace")


def test_zoomed_in_the_boxes_show_dates_as_the_table_does(qtbot):
    view, row = zoomed(qtbot, 400)
    painter, scale = view.item.painter, screen_scale(view)
    assert painter.level(scale) == "dated"
    dates = view.session.analysis.dates()
    wanted = tuple(format_date(dates[k][row]) for k in ("early_start", "early_finish", "late_start", "late_finish"))
    assert painter.date_texts(row) == wanted
    assert wanted[0].count(" ") == 3                  # "Mon 28 Jun 2027": weekday, day, month, year
    drawn = svg_text(view, row, scale)
    assert all(text in drawn for text in wanted)
    # the widest date fits its cell at the size it is drawn
    size = detail.date_size(float(view.layout_result.boxes[row, 2]), painter.weights.cell_font)
    assert size * scale >= detail.DATE_MIN_PX


def test_at_a_middle_zoom_the_grid_keeps_its_figures(qtbot):
    view, row = zoomed(qtbot, 200)
    painter, scale = view.item.painter, screen_scale(view)
    assert painter.level(scale) == "full"
    drawn = svg_text(view, row, scale)
    assert format_date(view.session.analysis.dates()["early_start"][row]) not in drawn
    assert view.item.painter.texts[row].es in drawn


def test_too_small_for_a_name_the_coloured_box_keeps_its_id(qtbot):
    """A 20 px box (the demo docked at 1024×768) has no room for a name; its id still reads."""
    view, row = zoomed(qtbot, 20)
    scale = screen_scale(view)
    assert view.item.painter.level(scale) == "tiny"
    drawn = svg_text(view, row, scale)
    assert "B4" in drawn and "Partitions" not in drawn
    view2, _ = zoomed(qtbot, 8)                      # further out: no id either
    assert "B4" not in svg_text(view2, row, screen_scale(view2))


def test_paper_keeps_the_larger_figures():
    """A 24 mm box on a 1200 dpi printer is over 1,000 device pixels wide, yet dates at
    the size the grid allows would be under a millimetre: paper keeps the figures."""
    from workbench.figures.network_layout import layout_plan
    from workbench.ui.network.paint import NetworkPainter
    from workbench.figures.network_labels import node_texts
    from workbench.core.analysis import analyze
    plan = demo_plan()
    analysis = analyze(plan)
    painter = NetworkPainter()
    painter.set_content(layout_plan(plan, analysis), node_texts(plan, analysis), analysis)
    scale = 24.0 / 25.4 * 1200 / 216.0
    assert painter.level(scale) == "dated"                 # were it a screen
    assert painter.level(scale, 96.0 / 1200) == "full"
