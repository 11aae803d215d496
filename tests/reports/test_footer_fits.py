"""The pack's trace line never runs into the page number, however long the file name."""

import datetime as dt
import io

from reportlab.lib.pagesizes import A4
from reportlab.pdfgen.canvas import Canvas

from workbench.reports import styles
from workbench.reports.footer import PAGE_LABEL_W, TOTAL_FORM, FooterInfo, footer_drawer


class Recording(Canvas):
    def __init__(self, *a, **k):
        super().__init__(*a, **k)
        self.drawn = []

    def drawString(self, x, y, text, *a, **k):  # noqa: N802 (reportlab's name)
        self.drawn.append((x, text, self._fontname, self._fontsize))
        return super().drawString(x, y, text, *a, **k)


def test_a_long_trace_line_is_set_smaller_to_end_before_the_page_number():
    info = FooterInfo("a very long plan file name for the harbour kiosk renewal, revision 14.slw",
                      "8c705b2d0472", dt.datetime(2027, 2, 26, 9, 0, tzinfo=dt.timezone.utc), "0.1.0", 999_999)
    c = Recording(io.BytesIO(), pagesize=A4)
    c.beginForm(TOTAL_FORM)
    c.endForm()
    footer_drawer(info)(c, None)
    x, text, font, size = c.drawn[0]
    assert text == info.line() and "Fri 26 Feb 2027 09:00" in text
    page_x = A4[0] - styles.MARGIN - PAGE_LABEL_W
    assert x + c.stringWidth(text, font, size) <= page_x - 4
