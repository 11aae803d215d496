"""Network view: model → view → change model → check view, plus pixel facts."""

import pytest
from PySide6.QtCore import QPoint, QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QImage
from PySide6.QtTest import QTest

from workbench.core.commands import EditActivity
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.figures import style
from workbench.ui.network.view import NetworkView
from workbench.ui.session import Session

from support.plans import small_plan
from support.ui import shown


@pytest.fixture
def view(qtbot):
    session = Session(small_plan())
    v = shown(qtbot, NetworkView(session), (900, 600))
    return v


def node_point(view, act_id, fx=0.5, fy=0.5) -> QPoint:
    """Widget-of-the-graphics-view coordinates of a point given as fractions of a node box."""
    x, y, w, h = view.layout_result.boxes[view.layout_result.index_of(act_id)]
    scene = view.viewbox.mapViewToScene(QPointF(x + fx * w, y + fy * h))
    return view.graphics.mapFromScene(scene)


def zoom_to(view, act_id):
    x, y, w, h = view.layout_result.boxes[view.layout_result.index_of(act_id)]
    view.viewbox.setRange(QRectF(x - w, y - h, 3 * w, 3 * h), padding=0)
    view.graphics.repaint()


def pixel(view, point: QPoint) -> QColor:
    image: QImage = view.graphics.grab().toImage()
    return QColor(image.pixel(point))


def close_to(c: QColor, hex_text: str, tol=30) -> bool:
    want = QColor(hex_text)
    return max(abs(c.red() - want.red()), abs(c.green() - want.green()), abs(c.blue() - want.blue())) <= tol


def test_click_selects_through_the_session(view, qtbot):
    zoom_to(view, "C")
    with qtbot.waitSignal(view.session.selection_changed):
        QTest.mouseClick(view.graphics.viewport(), Qt.LeftButton, pos=node_point(view, "C"))
    assert view.session.selected() == ["C"]
    assert view.item.painter.selected == {view.layout_result.index_of("C")}


def test_view_follows_session_selection(view):
    view.session.select(["B", "D"])
    rows = view.layout_result
    assert view.item.painter.selected == {rows.index_of("B"), rows.index_of("D")}
    view.session.select([])
    assert view.item.painter.selected == set()


def test_critical_node_shows_critical_colour_inside_its_border(view):
    for act_id, hexc in (("B", style.CRITICAL), ("C", style.WORK)):
        zoom_to(view, act_id)
        header = pixel(view, node_point(view, act_id, 0.55, 0.1))
        assert close_to(header, hexc), (act_id, header.name())
        inside = pixel(view, node_point(view, act_id, 0.5, 0.9))
        assert close_to(inside, "#FFFFFF", 10)


def test_redraws_when_the_schedule_changes(view):
    zoom_to(view, "C")
    assert close_to(pixel(view, node_point(view, "C", 0.55, 0.1)), style.WORK)
    view.session.push(EditActivity("C", duration=9.0))       # C now drives D: C becomes critical
    before = [n.x for n in view.layout_result.nodes]
    assert view.layout_result.nodes[view.layout_result.index_of("C")].critical
    view.graphics.repaint()
    assert close_to(pixel(view, node_point(view, "C", 0.55, 0.1)), style.CRITICAL)
    assert before == [n.x for n in view.layout_result.nodes]


def test_hover_marks_predecessors_and_successors(view, qtbot):
    zoom_to(view, "B")
    view.fit()
    view.graphics.repaint()
    QTest.mouseMove(view.graphics.viewport(), node_point(view, "B"))
    qtbot.waitUntil(lambda: view.item.painter.hover >= 0, timeout=2000)
    rows = view.layout_result
    assert view.item.painter.hover == rows.index_of("B")
    assert view.item.painter.related == {rows.index_of("A"), rows.index_of("D")}


def test_find_by_name_then_by_id(view):
    view.find_field.setText("cable")
    view.find_next()
    assert view.session.selected() == ["B"]
    view.find_field.setText("d")        # id D first, then names containing "d"
    view.find_next()
    assert view.session.selected() == ["D"]
    view.find_next()
    assert view.session.selected() == ["A"]   # "Dig trench"


def test_export_png_and_svg(view, tmp_path):
    png, svg = tmp_path / "net.png", tmp_path / "net.svg"
    view.export_picture(str(png))
    view.export_picture(str(svg))
    image = QImage(str(png))
    assert not image.isNull() and image.width() > image.height() > 0
    assert "<svg" in svg.read_text(encoding="utf-8")[:2000]
    with pytest.raises(ValueError, match=r"\.pdf"):
        view.export_picture(str(tmp_path / "net.pdf"))


def test_a_loop_shows_a_message_instead_of_a_drawing(qtbot):
    plan = small_plan()
    plan.links.append(Link("D", "A"))
    v = NetworkView(Session(plan))
    qtbot.addWidget(v)
    assert not v.message.isHidden()
    assert "loop" in v.message.text()


def test_print_routine_writes_a_page(view, tmp_path):
    from PySide6.QtPrintSupport import QPrinter

    from workbench.ui.network.export import print_pages

    printer = QPrinter(QPrinter.HighResolution)
    printer.setOutputFormat(QPrinter.PdfFormat)
    out = tmp_path / "net.pdf"
    printer.setOutputFileName(str(out))
    assert print_pages(view.item.painter, printer) == 1     # four nodes fit one page
    data = out.read_bytes()
    assert data.startswith(b"%PDF") and b"/Type /Page" in data


def test_selected_node_is_framed(view):
    zoom_to(view, "C")
    spot = node_point(view, "C", 0.5, -0.05)            # just above the box: the selection halo
    assert close_to(pixel(view, spot), "#FFFFFF", 10)
    view.session.select(["C"])
    view.graphics.repaint()
    assert close_to(pixel(view, spot), style.SELECTION, 12)


def test_arrow_keys_walk_the_logic(view, qtbot):
    view.session.select(["A"])
    view.graphics.setFocus()
    QTest.keyClick(view.graphics, Qt.Key_Right)
    assert view.session.selected() in (["B"], ["C"])
    first = view.session.selected()[0]
    QTest.keyClick(view.graphics, Qt.Key_Down if first == "B" else Qt.Key_Up)
    assert view.session.selected() == ["C" if first == "B" else "B"]
    QTest.keyClick(view.graphics, Qt.Key_Right)
    assert view.session.selected() == ["D"]
    QTest.keyClick(view.graphics, Qt.Key_Right)            # D has no successor: stays
    assert view.session.selected() == ["D"]
    QTest.keyClick(view.graphics, Qt.Key_Left)
    assert view.session.selected() in (["B"], ["C"])


def test_selection_made_elsewhere_is_brought_into_view(view):
    zoom_to(view, "A")
    box = QRectF(*map(float, view.layout_result.boxes[view.layout_result.index_of("D")]))
    assert not view.viewbox.viewRect().contains(box)
    view.session.select(["D"])
    assert view.viewbox.viewRect().contains(box)


def test_present_mode_hides_controls_and_thickens_lines(view):
    normal = view.item.painter.weights
    view.set_present(True)
    assert view.toolbar.isHidden()
    assert view.item.painter.weights.critical_link > normal.critical_link
    view.set_present(False)
    assert not view.toolbar.isHidden() and view.item.painter.weights == normal


def test_a_large_network_prints_on_several_pages(qtbot, tmp_path):
    from pypdf import PdfReader
    from PySide6.QtPrintSupport import QPrinter

    from workbench.ui.network.export import print_pages

    acts = [Activity(id=f"K{i}", name=f"step {i}", duration=1.0) for i in range(60)]
    links = [Link(f"K{i}", f"K{i + 1}") for i in range(59)]
    v = NetworkView(Session(Plan(Settings(title="long chain"), acts, links)))
    qtbot.addWidget(v)
    printer = QPrinter(QPrinter.HighResolution)
    printer.setOutputFormat(QPrinter.PdfFormat)
    out = tmp_path / "chain.pdf"
    printer.setOutputFileName(str(out))
    pages = print_pages(v.item.painter, printer)
    assert pages > 1
    assert len(PdfReader(str(out)).pages) == pages


def test_empty_plan_says_so_then_draws_when_a_plan_arrives(qtbot):
    session = Session(Plan(Settings(title="empty")))
    v = NetworkView(session)
    qtbot.addWidget(v)
    assert "No activities" in v.message.text() and not v.message.isHidden()
    session.load(small_plan())
    assert v.message.isHidden()
    assert [n.id for n in v.layout_result.nodes] == ["A", "B", "C", "D"]


def test_ctrl_click_adds_and_removes(view, qtbot):
    zoom_to(view, "B")
    port = view.graphics.viewport()
    QTest.mouseClick(port, Qt.LeftButton, pos=node_point(view, "B"))
    QTest.mouseClick(port, Qt.LeftButton, Qt.ControlModifier, pos=node_point(view, "C"))
    assert view.session.selected() == ["B", "C"]
    QTest.mouseClick(port, Qt.LeftButton, Qt.ControlModifier, pos=node_point(view, "B"))
    assert view.session.selected() == ["C"]


def test_hover_tip_names_dates_and_float(view, qtbot):
    zoom_to(view, "C")
    QTest.mouseMove(view.graphics.viewport(), node_point(view, "C"))
    qtbot.waitUntil(lambda: view.graphics.toolTip() != "", timeout=2000)
    tip = view.graphics.toolTip()
    assert tip.startswith("C  Order lamps")
    assert "total float 3" in tip and "critical" not in tip


def test_print_preview_is_landscape_and_paints(view, qtbot, tmp_path):
    from PySide6.QtGui import QPageLayout
    from PySide6.QtPrintSupport import QPrinter

    dialog = view.make_print_preview()
    qtbot.addWidget(dialog)
    assert dialog.printer().pageLayout().orientation() == QPageLayout.Landscape
    printer = QPrinter(QPrinter.HighResolution)
    printer.setOutputFormat(QPrinter.PdfFormat)
    printer.setOutputFileName(str(tmp_path / "preview.pdf"))
    printer.setPageOrientation(QPageLayout.Landscape)
    dialog.paintRequested.emit(printer)
    assert (tmp_path / "preview.pdf").read_bytes().startswith(b"%PDF")


def test_far_out_picture_follows_edits_and_pans(qtbot):
    acts = [Activity(id=f"K{i}", duration=1.0) for i in range(40)] + [Activity(id="S", duration=5.0)]
    links = [Link(f"K{i}", f"K{i + 1}") for i in range(39)] + [Link("K0", "S"), Link("S", "K39")]
    v = shown(qtbot, NetworkView(Session(Plan(Settings(title="far"), acts, links))), (900, 500))
    v.fit()
    v.graphics.repaint()
    assert v.item.painter.node_px(v.viewbox.viewPixelSize()[0] ** -1) < 40     # far out
    assert close_to(pixel(v, node_point(v, "S")), style.WORK)
    assert close_to(pixel(v, node_point(v, "K5")), style.CRITICAL)
    v.session.push(EditActivity("S", duration=60.0))                         # S now drives the finish
    v.graphics.repaint()
    assert close_to(pixel(v, node_point(v, "S")), style.CRITICAL)
    v.viewbox.translateBy(t=(300.0, 0.0))
    v.graphics.repaint()
    assert close_to(pixel(v, node_point(v, "S")), style.CRITICAL)
    v.session.select(["K5"])
    v.graphics.repaint()
    x, y, w, h = v.layout_result.boxes[v.layout_result.index_of("K5")]
    frame = v.graphics.mapFromScene(v.viewbox.mapViewToScene(QPointF(x + w / 2, y - 4.0 * v.viewbox.viewPixelSize()[1])))
    assert close_to(pixel(v, frame), style.TEXT, 60)                           # selection frame drawn on top
