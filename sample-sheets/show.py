#!/usr/bin/python3
"""README command 1, after the build: installs the .oxt into a private
profile, opens the sample tally workbook in a headless LibreOffice,
recalculates it with the extension, prints its key cells and writes a PDF.

    /usr/bin/python3 sample-sheets/show.py build/tallyrates.oxt OUTDIR
"""
import os
import shutil
import sys

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, os.path.join(HERE, "..", "tests", "office"))
import lo_session as lo  # noqa: E402

SHEET = os.path.join(HERE, "reflow-oven-trial.fods")


def main():
    oxt, outdir = sys.argv[1], os.path.abspath(sys.argv[2])
    os.makedirs(outdir, exist_ok=True)
    office = lo.Office(oxt).install().start()
    try:
        work_copy = os.path.join(office.workdir, os.path.basename(SHEET))
        shutil.copy(SHEET, work_copy)
        os.chmod(work_copy, 0o644)
        doc = office.load(work_copy)
        doc.calculateAll()
        sheet = doc.Sheets.getByIndex(0)
        cell = sheet.getCellRangeByName
        print(cell("A1").getString())
        print()
        print("  %s %s" % (cell("A3").getString(), cell("B3").getString()))
        for r in range(4, 12):
            row = [lo.cell_text(cell("%s%d" % (c, r))) for c in "ABCDEFGHKLM"]
            if any(row):
                print("  %-22s %15s %11s %10s %20s %9s %9s %23s %26s %13s %28s" % tuple(row))
        print()
        errors = []
        for r in list(range(14, 25)) + list(range(26, 37)):
            label = cell("A%d" % r).getString()
            shown = lo.cell_text(cell("B%d" % r))
            if label:
                print("  %-46s %s" % (label, shown))
            if shown.startswith("Err:"):
                errors.append("B%d" % r)
        print()
        print("  " + cell("A40").getString())
        for r in range(41, 63):
            row = [lo.cell_text(cell("%s%d" % (c, r))) for c in "ABCDEFGH"]
            if any(row):
                print("  %-22s %-22s %15s %14s %14s %14s %16s  %s" % tuple(row))
            errors += ["%s%d" % (c, r) for c, shown in zip("ABCDEFGH", row) if shown.startswith("Err:")]
        errors += ["%s%d" % (c, r) for c in "FGHKLM" for r in range(5, 12) if lo.cell_text(cell("%s%d" % (c, r))).startswith("Err:")]
        print()
        print("  " + cell("A64").getString())
        for r in range(65, 73):
            shown = lo.cell_text(cell("G%d" % r))
            print("  %-100s %s" % (cell("A%d" % r).getString(), shown))
            if shown.startswith("Err:") or not shown:
                errors.append("G%d" % r)
        curves = doc.Sheets.getByName("Posterior curves")
        print()
        print("  " + curves.getCellRangeByName("A25").getString())
        for r in range(26, 31):
            row = [lo.cell_text(curves.getCellByPosition(c, r - 1)) for c in range(6)]
            print("  %-22s %14s %11s %11s %9s %15s" % tuple(row))
            errors += ["Posterior curves row %d" % r for shown in row if shown.startswith("Err:")]
        limits = doc.Sheets.getByName("Decision limits")
        print()
        print("  " + limits.getCellRangeByName("A1").getString())
        for r in range(5, 10):
            row = [lo.cell_text(limits.getCellByPosition(c, r - 1)) for c in range(6)]
            print("  %-22s %9s %8s %12s %12s %8s" % tuple(v[:22] for v in row))
            errors += ["Decision limits row %d" % r for shown in row if shown.startswith("Err:")]
        below = [lo.cell_text(limits.getCellByPosition(0, r - 1)) for r in range(19, 34)
                 if lo.cell_text(limits.getCellByPosition(5, r - 1)) != "within"]
        print("  p-chart of oven A: days outside the limits:", ", ".join(below) or "none")
        pdf = os.path.join(office.workdir, "reflow-oven-trial.pdf")
        lo.save_as(doc, pdf, "calc_pdf_Export")
        doc.close(True)
    finally:
        office.stop()
    shutil.copy(pdf, os.path.join(outdir, "reflow-oven-trial.pdf"))
    print()
    print("PDF written to", os.path.join(outdir, "reflow-oven-trial.pdf"))
    if errors:  # the extension did not compute these: say so and fail
        print("ERROR: cells", ", ".join(errors), "show an error instead of a result")
    sys.stdout.flush()  # os._exit skips the flush of piped output
    os._exit(1 if errors else 0)


if __name__ == "__main__":
    main()
