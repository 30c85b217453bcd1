"""Render the Results sheet of a demo workbook to PNG (for the README).

    python tools/render_results.py workbooks_demo/tender_chp.xlsx docs/tender_summary.png

Needs Debian's libreoffice-calc-nogui and poppler-utils.  The sheet is copied with its
cached values only (no formulas), so LibreOffice shows exactly the numbers cellfuncs
computed; then LibreOffice writes a PDF and pdftoppm turns its first page into a PNG.
"""

import os
import re
import shutil
import subprocess
import sys
import tempfile

import openpyxl
from openpyxl.utils import get_column_letter


def _text_box(pdf, dpi, margin):
    """Pixel box (x, y, width, height) at ``dpi`` around the words of the PDF's first page."""
    out = subprocess.run(["pdftotext", "-bbox", "-f", "1", "-l", "1", pdf, "-"], check=True,
                         capture_output=True, text=True, timeout=60).stdout
    boxes = [tuple(float(v) for v in m) for m in
             re.findall(r'<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)"', out)]
    scale = dpi / 72
    x0, y0 = min(b[0] for b in boxes) * scale - margin, min(b[1] for b in boxes) * scale - margin
    x1, y1 = max(b[2] for b in boxes) * scale + margin, max(b[3] for b in boxes) * scale + margin
    x0, y0 = max(int(x0), 0), max(int(y0), 0)
    return x0, y0, int(x1) - x0, int(y1) - y0


def main(book, png, sheet="Results"):
    tmp = tempfile.mkdtemp()
    try:
        wb = openpyxl.load_workbook(book, data_only=True)
        for ws in list(wb.worksheets):
            if ws.title != sheet:
                wb.remove(ws)
        ws = wb[sheet]
        ws.page_setup.orientation = "landscape"
        ws.page_setup.fitToWidth = 1
        ws.page_setup.fitToHeight = 1  # the whole sheet on one page
        # two spare columns in the print area, so that text running over from column D is not clipped
        ws.print_area = f"A1:{get_column_letter(ws.max_column + 2)}{ws.max_row}"
        ws.sheet_properties.pageSetUpPr.fitToPage = True
        ws.print_options.gridLines = False
        for dn in list(wb.defined_names):
            del wb.defined_names[dn]
        xlsx = os.path.join(tmp, "results.xlsx")
        wb.save(xlsx)
        subprocess.run(["soffice", "--headless", "--convert-to", "pdf", "--outdir", tmp, xlsx], check=True,
                       capture_output=True, timeout=180)
        pdf = os.path.join(tmp, "results.pdf")
        # crop to the printed words of the first page (their bounding boxes, in points), with a margin
        x, y, w, h = _text_box(pdf, dpi=110, margin=12)
        subprocess.run(["pdftoppm", "-png", "-r", "110", "-f", "1", "-l", "1", "-singlefile",
                        "-x", str(x), "-y", str(y), "-W", str(w), "-H", str(h), pdf,
                        os.path.join(tmp, "page")], check=True, timeout=120)
        shutil.move(os.path.join(tmp, "page.png"), png)
        print(f"wrote {png}")
    finally:
        shutil.rmtree(tmp, ignore_errors=True)


if __name__ == "__main__":
    main(*sys.argv[1:])
