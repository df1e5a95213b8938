#!/usr/bin/python3
"""Writes reflow-oven-trial.fods, the sample tally workbook (an invented
scenario with invented counts), through a real LibreOffice with the
extension installed, so the file stores our functions' permanent names.

    /usr/bin/python3 sample-sheets/build_sheet.py build/tallyrates.oxt

Edit the layout here, not in the .fods.
"""
import os
import sys

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, os.path.join(HERE, "..", "tests", "office"))
import lo_session as lo  # noqa: E402
from com.sun.star.awt import Rectangle  # noqa: E402
from com.sun.star.table import CellRangeAddress  # noqa: E402

OVENS = [  # name, boards passing, boards run, belt speed (cm/min): invented
    ("Oven A (line 1)", 286, 300, 80),
    ("Oven B (line 2)", 271, 290, 85),
    ("Oven C (line 3)", 233, 260, 90),
    ("Pilot oven, nitrogen", 14, 14, 75),
]
COUNTS = "B5:B11;C5:C11"
LABELS = "A5:A11"
# The trend rows use the three air ovens only: the pilot oven also differs in
# atmosphere, so a trend over all four would mix belt speed with nitrogen.
AIR = "B5:B7;C5:C7;E5:E7"
RESULTS = [
    ("Input check", "=RATES.CHECK(%s;;%s)" % (COUNTS, LABELS), None),
    ("All ovens alike? p-value, automatic route", "=RATES.SAME.P(%s)" % COUNTS, "0.0000"),
    ("p-value, chi-square approximation", '=RATES.SAME.P(%s;"pearson")' % COUNTS, "0.0000"),
    ("p-value, exact conditional", '=RATES.SAME.P(%s;"exact")' % COUNTS, "0.0000"),
    ("p-value, Monte Carlo (100,000 tables)", '=RATES.SAME.P(%s;"montecarlo")' % COUNTS, "0.0000"),
    ("Pearson X²", "=RATES.SAME.STAT(%s)" % COUNTS, "0.000"),
    ("Likelihood ratio G²", '=RATES.SAME.STAT(%s;"lr")' % COUNTS, "0.000"),
    ("Trend with belt speed, air ovens: p-value", "=RATES.TREND.P(%s)" % AIR, "0.0000"),
    ("Trend z, below 0: falls as belt speeds up", "=RATES.TREND.Z(%s)" % AIR, "0.00"),
    ("Pilot minus oven A, pass rate", "=RATES.DIFF(%s;4;1)" % COUNTS, "+0.0%;-0.0%"),
]


def number_format(doc, code):
    formats = doc.NumberFormats
    locale = doc.CharLocale
    key = formats.queryKey(code, locale, False)
    return key if key != -1 else formats.addNew(code, locale)


def main():
    office = lo.Office(sys.argv[1]).install().start()
    try:
        doc = office.new_sheet()
        sheet = doc.Sheets.getByIndex(0)
        sheet.Name = "Oven trial"
        cell = sheet.getCellRangeByName
        cell("A1").setString("Reflow oven trial, week 48: boards passing solder-joint inspection")
        cell("A1").CharHeight = 14
        cell("A1").CharWeight = 150
        cell("A2").setString("Invented example data. Type new counts in rows 5 to 11; rows left blank are skipped. "
                             "Needs the tallyrates extension.")
        for col, text in zip("ABCDE", ["Oven", "Boards passing", "Boards run", "Pass rate", "Belt speed (cm/min)"]):
            cell(col + "4").setString(text)
            cell(col + "4").CharWeight = 150
            cell(col + "4").IsTextWrapped = True
        for k, (name, x, n, speed) in enumerate(OVENS):
            r = 5 + k
            cell("A%d" % r).setString(name)
            cell("B%d" % r).setValue(x)
            cell("C%d" % r).setValue(n)
            cell("E%d" % r).setValue(speed)
        for r in range(5, 12):
            cell("D%d" % r).setFormula('=IF(C%d>0;B%d/C%d;"")' % (r, r, r))
            cell("D%d" % r).NumberFormat = number_format(doc, "0.0%")
        cell("A13").setString("Results")
        cell("A13").CharWeight = 150
        for k, (label, formula, fmt) in enumerate(RESULTS):
            r = 14 + k
            cell("A%d" % r).setString(label)
            cell("B%d" % r).setFormula(formula)
            if fmt:
                cell("B%d" % r).NumberFormat = number_format(doc, fmt)
        cell("A24").setString("Report of the automatic test (array formula)")
        cell("A24").CharWeight = 150
        cell("A25:B35").setArrayFormula("RATES.SAME.REPORT(%s;;;;%s)" % (COUNTS, LABELS))
        # Four significant decimals at most: no 15-digit values in the report.
        cell("B25:B35").NumberFormat = number_format(doc, "#,##0.####")
        cell("A25:A35").IsTextWrapped = True  # labels that name an oven are long
        cell("A37").setString("Caution: a small p-value says the ovens' rates differ beyond chance; it is not "
                              "engineering acceptance. Follow the standards that apply and have decisions reviewed.")
        # The check sentence wraps in a merged cell across the page; the
        # report's "why" overflows into the empty cells to its right.
        check = cell("B14:E14")
        check.merge(True)
        check.IsTextWrapped = True
        check.VertJustify = 1  # top
        cell("A14").VertJustify = 1
        sheet.Rows.getByIndex(13).OptimalHeight = True
        columns = sheet.Columns
        for col, width in zip("ABCDEFGH", [7800, 3000, 2600, 2400, 3800, 2400, 2400, 2400]):
            columns.getByName(col).Width = width
        # One landscape page: what colleagues print and file.
        style = doc.StyleFamilies.getByName("PageStyles").getByName(sheet.PageStyle)
        width, height = style.Width, style.Height
        style.IsLandscape = True
        style.Width, style.Height = max(width, height), min(width, height)
        style.ScaleToPagesX = 1
        style.ScaleToPagesY = 1
        # Pass rate by oven, for the eye: to the right of the tallies.
        rect = Rectangle(20500, 1500, 10500, 6800)
        # Every row that invites counts (5 to 11), so a new oven appears as it is typed.
        label_area = CellRangeAddress(0, 0, 3, 0, 10)  # A4:A11
        sheet.Charts.addNewByName("PassRates", rect, (label_area, CellRangeAddress(0, 3, 3, 3, 10)), True, True)
        chart = sheet.Charts.getByName("PassRates").EmbeddedObject
        chart.HasMainTitle = True
        chart.Title.String = "Pass rate by oven"
        chart.HasLegend = False
        chart.Diagram.HasXAxisTitle = True
        chart.Diagram.XAxisTitle.String = "Oven"
        chart.Diagram.HasYAxisTitle = True
        chart.Diagram.YAxisTitle.String = "Boards passing inspection"
        doc.calculateAll()
        out = os.path.join(office.workdir, "reflow-oven-trial.fods")
        lo.save_as(doc, out, "OpenDocument Spreadsheet Flat XML")
        doc.close(True)
    finally:
        office.stop()
    with open(out) as f, open(os.path.join(HERE, "reflow-oven-trial.fods"), "w") as g:
        g.write(f.read())
    print("wrote sample-sheets/reflow-oven-trial.fods")
    sys.stdout.flush()  # os._exit skips the flush of piped output
    os._exit(0)


if __name__ == "__main__":
    main()
