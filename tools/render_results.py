"""Render the Results sheet of a demo workbook to PNG (for the README).

    python tools/render_results.py workbooks_demo/tender_chp.xlsx docs/tender_summary.png

Needs Debian's libreoffice-calc-nogui and poppler-utils.  The sheet is copied with its
cached values only (no formulas), so LibreOffice shows exactly the numbers cellfuncs
computed; then LibreOffice writes a PDF and pdftoppm turns its first page into a PNG.
"""

import os
import shutil
import subprocess
import sys
import tempfile

import openpyxl


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
        ws.sheet_properties.pageSetUpPr.fitToPage = True
        ws.print_options.gridLines = False
        for dn in list(wb.defined_names):
            del wb.defined_names[dn]
        xlsx = os.path.join(tmp, "results.xlsx")
        wb.save(xlsx)
        subprocess.run(["soffice", "--headless", "--convert-to", "pdf", "--outdir", tmp, xlsx], check=True,
                       capture_output=True, timeout=180)
        pdf = os.path.join(tmp, "results.pdf")
        # crop to the top-left part of the landscape page where the sheet is printed
        subprocess.run(["pdftoppm", "-png", "-r", "110", "-f", "1", "-l", "1", "-singlefile",
                        "-x", "70", "-y", "90", "-W", "880", "-H", "450", pdf,
                        os.path.join(tmp, "page")], check=True, timeout=120)
        shutil.move(os.path.join(tmp, "page.png"), png)
        print(f"wrote {png}")
    finally:
        shutil.rmtree(tmp, ignore_errors=True)


if __name__ == "__main__":
    main(*sys.argv[1:])
