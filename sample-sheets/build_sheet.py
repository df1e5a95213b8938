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
    ("Oven A minus pilot, pass rate (first minus second, as in the pairs table)", "=RATES.DIFF(%s;1;4)" % COUNTS,
     "+0.0%;-0.0%"),
    ("P(pilot's rate above oven A's), Bayesian", "=RATES.POST.AHEAD(%s;4;1)" % COUNTS, "0.00"),
]


# Which ovens differ: every pair, 95 % Miettinen-Nurminen intervals holding
# for all pairs together, p adjusted by Bonferroni, and the verdict. Seven
# rows of counts make 21 pairs: 22 rows with the header.
PAIRS_TOP, PAIRS_ROWS = 41, 22

# How many more runs: below the pairs. G68 is an input (the improvement worth
# detecting); the best air oven is found from the rates in D5:D7.
PLAN_TOP = 64
BEST_AIR = "MATCH(MAX($D$5:$D$7);$D$5:$D$7;0)"
PLAN = [  # label, formula, number format
    ("Zero-failure demonstration of the plant target at 95 % confidence: boards in a row",
     "=RATES.PLAN.DEMO($B$3;0.95)", "0"),
    ("The same demonstration allowing 1 failing board", "=RATES.PLAN.DEMO($B$3;0.95;1)", "0"),
    ("Further boards, all passing, before the pilot is ahead of the best air oven with probability 0.95",
     "=RATES.PLAN.AHEAD(%s;4;%s;0.95)" % (COUNTS, BEST_AIR), "0"),
    ("Smallest improvement over the best air oven worth detecting (type your own)", None, "0.0%"),
    ("Boards per oven to detect that improvement (power 0.8, 5 % false alarms)",
     "=RATES.PLAN.POWER(INDEX($D$5:$D$7;%s);MIN(1;INDEX($D$5:$D$7;%s)+G%d))" % (BEST_AIR, BEST_AIR, PLAN_TOP + 4),
     "0"),
    ("Boards for the best air oven's pass rate to within ±1 point (95 % Wilson interval), in all",
     "=RATES.PLAN.WIDTH(INDEX($D$5:$D$7;%s);0.01)" % BEST_AIR, "0"),
    ("Further pilot boards, all passing, before the pilot's own record shows the plant target at 95 % confidence",
     "=RATES.PLAN.MORE($B$3;0.95;C8;C8-B8)", "0"),
    ("The pilot's record as a demonstration judges it: one-sided 95 % lower confidence bound (Clopper-Pearson)",
     '=RATES.ONE.LOW(%s;4;0.95;"clopper-pearson";"one")' % COUNTS, "0.0%"),
]


def heading(cell, text):
    cell.setString(text)
    cell.CharWeight = 150
    cell.IsTextWrapped = True


def number_format(doc, code):
    """The key of a number format in a spreadsheet or a chart (a chart has
    formats of its own and no locale: the default one)."""
    import uno
    formats = doc.NumberFormats
    locale = getattr(doc, "CharLocale", None) or uno.createUnoStruct("com.sun.star.lang.Locale")
    key = formats.queryKey(code, locale, False)
    return key if key != -1 else formats.addNew(code, locale)


def add_interval_bars(office, chart, sheet_name, last_row):
    """Error bars from the interval columns (rows 5 to last_row): a rate of
    14 of 14 without its interval would mislead (the chart2 API: an ErrorBar
    fed from cells)."""
    series = chart.getFirstDiagram().getCoordinateSystems()[0].getChartTypes()[0].getDataSeries()[0]
    provider = chart.getDataProvider()
    bars = office.smgr.createInstanceWithContext("com.sun.star.chart2.ErrorBar", office.ctx)
    bars.ErrorBarStyle = 7  # com.sun.star.chart.ErrorBarStyle.FROM_DATA
    bars.ShowPositiveError = True
    bars.ShowNegativeError = True
    sequences = []
    for column, role in (("I", "error-bars-y-positive"), ("J", "error-bars-y-negative")):
        values = provider.createDataSequenceByRangeRepresentation(
            "$'%s'.$%s$5:$%s$%d" % (sheet_name, column, column, last_row))
        values.Role = role
        labeled = office.smgr.createInstanceWithContext("com.sun.star.chart2.data.LabeledDataSequence", office.ctx)
        labeled.setValues(values)
        sequences.append(labeled)
    bars.setData(tuple(sequences))
    series.ErrorBarY = bars


def pass_rate_chart(office, sheet, at):
    """Each oven's pass rate as a point with its 95 % interval as a bar, and
    the plant target as a line: points, not bars from a cut axis (a bar's
    length would exaggerate a difference of a few points); the rate axis
    starts where the data and intervals do and ends at 100 %. It covers the
    filled rows only, so no empty category slots stand for the spare rows;
    the sheet says how to take a new oven in."""
    last = 4 + len(OVENS)  # the last filled row (1-based)
    rows = (CellRangeAddress(0, 0, 3, 0, last - 1),    # A4:A<last>: oven names, header above
            CellRangeAddress(0, 3, 3, 3, last - 1),    # D: pass rate
            CellRangeAddress(0, 13, 3, 13, last - 1),  # N: the plant target beside each oven
            CellRangeAddress(0, 5, 3, 6, last - 1))    # F, G: the interval's ends, as marks
    chart = titled_chart(sheet, "PassRates", Rectangle(at.X, at.Y, 17000, 10000), rows, True, None,
                         ("Pass rate of each oven, with its 95 % confidence interval", "Oven",
                          "Pass rate (boards passing inspection)"))
    chart.Diagram = chart.createInstance("com.sun.star.chart.LineDiagram")
    chart.Diagram.Lines = True
    import uno
    rate = chart.Diagram.getDataRowProperties(0)
    rate.SymbolType = 8  # com.sun.star.chart.ChartSymbolType: a circle
    rate.LineStyle = uno.Enum("com.sun.star.drawing.LineStyle", "NONE")
    # Series in column order: D (rate), F and G (the interval's ends), N (target).
    target = chart.Diagram.getDataRowProperties(3)
    target.SymbolType = -3  # none: the target is a line
    target.LineWidth = 50
    # The interval's ends as short marks, joined by the error bar: as series
    # they also make the automatic rate axis reach the lowest end (Calc's
    # automatic axis then starts at 0 % unless the lowest value is within a
    # sixth of the highest, so a poor oven never falls off the chart).
    for k in (1, 2):
        end = chart.Diagram.getDataRowProperties(k)
        end.SymbolType = 13  # a horizontal bar
        end.LineStyle = uno.Enum("com.sun.star.drawing.LineStyle", "NONE")
        end.FillColor = end.LineColor = 0xC00000  # both ends alike, apart from the point's colour
    legend_below(chart)
    add_interval_bars(office, chart, sheet.Name, last)
    y_axis = chart.Diagram.YAxis
    y_axis.AutoMin, y_axis.AutoMax = True, False
    y_axis.Max = 1.0
    shift_categories(chart)
    # Oven names level and wrapped, not turned on their side.
    chart.Diagram.XAxis.TextRotation = 0
    chart.Diagram.XAxis.TextBreak = True


def shift_categories(chart):
    """Each category in the middle of its slot, so that the first and last
    groups' points and bars do not sit on the plot's edges (chart2 API)."""
    axis = chart.getFirstDiagram().getCoordinateSystems()[0].getAxisByDimension(0, 0)
    scale = axis.getScaleData()
    scale.ShiftedCategoryPosition = True
    axis.setScaleData(scale)


CURVE_TOP, CURVE_POINTS = 34, 401  # the curve block: a header row, then 401 rates over the likely span


def titled_chart(sheet, name, rect, ranges, row_headers, diagram, titles):
    """A chart over `ranges` with a title and axis titles; the legend only
    when the series carry names (no row headers); `diagram` another kind than
    bars (e.g. "XYDiagram")."""
    sheet.Charts.addNewByName(name, rect, ranges, True, row_headers)
    chart = sheet.Charts.getByName(name).EmbeddedObject
    if diagram:
        chart.Diagram = chart.createInstance("com.sun.star.chart." + diagram)
    chart.HasMainTitle = True
    chart.HasLegend = not row_headers
    chart.Diagram.HasXAxisTitle = True
    chart.Diagram.HasYAxisTitle = True
    chart.Title.String, chart.Diagram.XAxisTitle.String, chart.Diagram.YAxisTitle.String = titles
    return chart


def add_curves_sheet(doc):
    """A second sheet: each oven's posterior density (RATES.POST.CURVE) as an
    XY line chart, how far the counts pin each pass rate down. Only the chart
    prints; the data block sits below it."""
    doc.Sheets.insertNewByName("Posterior curves", 1)
    sheet = doc.Sheets.getByName("Posterior curves")
    cell = sheet.getCellRangeByName
    sheet.Columns.getByName("A").Width = 5200
    cell("A1").setString("What each oven's pass rate may be, given its counts (Bayesian, flat prior)")
    cell("A1").CharWeight = 150
    cell("A2").setString("The taller and narrower a curve, the better the counts pin the rate down: the pilot's "
                         "14 of 14 still leaves a wide spread, down to about 80 %.")
    bottom = CURVE_TOP + CURVE_POINTS
    block = "A%d:E%d" % (CURVE_TOP, bottom)
    # Span "likely": the rates where some oven's rate probably lies, so the
    # chart's automatic x axis follows the counts (a poor oven never falls off).
    cell(block).setArrayFormula(
        "RATES.POST.CURVE($'Oven trial'.B5:B8;$'Oven trial'.C5:C8;%d;;;$'Oven trial'.A5:A8;\"likely\")"
        % CURVE_POINTS)
    cell("A%d" % (CURVE_TOP - 1)).setString("Data for the chart (array formula; its header row names the ovens):")
    at = cell("A4").Position
    rect = Rectangle(at.X, at.Y, 24000, 8000)
    # Below the chart: the posterior table, one row per oven.
    cell("A25").setString("Posterior table (array formula): expected pass rate, 95 % credible interval (Bayesian: "
                          "the rate lies inside with probability 95 %), chance of being the best oven, expected "
                          "shortfall of choosing it")
    cell("A25").CharWeight = 150
    cell("A26:F30").setArrayFormula("RATES.POST.TABLE($'Oven trial'.B5:B8;$'Oven trial'.C5:C8;;;;;$'Oven trial'.A5:A8)")
    cell("B27:D30").NumberFormat = number_format(doc, "0.0%")
    cell("E27:E30").NumberFormat = number_format(doc, "0.00")
    cell("F27:F30").NumberFormat = number_format(doc, "0.00%")
    cell("A26:F26").CharWeight = 150
    cell("A26:F26").IsTextWrapped = True
    cell("B26:F26").HoriJustify = 3  # RIGHT, over the numbers
    for col in "BCDEF":
        sheet.Columns.getByName(col).Width = 2900
    data = CellRangeAddress(1, 0, CURVE_TOP - 1, 4, bottom - 1)  # A..E, header row (legend) to the last rate
    chart = titled_chart(sheet, "PosteriorCurves", rect, (data,), False, "XYDiagram",
                         ("Where each oven's pass rate probably lies", "Pass rate",
                          "More likely (higher curve)"))
    # A density's scale means nothing on the shop floor: the height compares
    # rates, so the axis keeps its title and drops its numbers.
    chart.Diagram.HasYAxisDescription = False
    x_axis = chart.Diagram.XAxis
    x_axis.LinkNumberFormatToSource = False
    x_axis.NumberFormat = number_format(chart, "0%")
    # The start follows the curves; the end is 100 %, never a padded 110 %.
    x_axis.AutoMin, x_axis.AutoMax = True, False
    x_axis.Max = 1.0
    for k in range(5):  # the x column counts as a data row in an XY diagram
        series = chart.Diagram.getDataRowProperties(k)
        series.SymbolType = -3  # com.sun.star.chart.ChartSymbolType.NONE: lines only
    landscape_pages(doc, sheet, "Posterior curves", 1)
    # Print the chart, not the 400 rows of data.
    from com.sun.star.table import CellRangeAddress as Area
    sheet.setPrintAreas((Area(1, 0, 0, 12, 30),))


DAYS = [  # oven A, boards passing and run per day over three weeks (invented)
    (212, 220), (195, 204), (229, 238), (201, 210), (188, 197), (224, 232), (207, 219), (216, 224), (178, 201),
    (219, 228), (203, 211), (226, 236), (199, 207), (214, 222), (208, 218),
]
LIMITS_TOP, DAYS_TOP = 5, 18


def symbols_only(chart, styles):
    """No connecting lines: each oven or day has limits of its own, so a line
    between two of them would draw limits that hold for neither. `styles`:
    the com.sun.star.chart.ChartSymbolType of each series (8 circle, 13
    horizontal bar)."""
    chart.Diagram.Lines = False
    for k, style in enumerate(styles):
        series = chart.Diagram.getDataRowProperties(k)
        series.SymbolType = style


def legend_below(chart):
    """The series' names under the plot, where long limit titles fit."""
    import uno
    chart.HasLegend = True
    chart.Legend.Alignment = uno.Enum("com.sun.star.chart.ChartLegendPosition", "BOTTOM")


def landscape_pages(doc, sheet, name, pages_tall):
    """A page style of the sheet's own (sheets sharing the default style
    would share its scaling): A4 landscape, one page wide, `pages_tall`
    pages tall (0: as many as the rows need)."""
    styles = doc.StyleFamilies.getByName("PageStyles")
    style = doc.createInstance("com.sun.star.style.PageStyle")
    styles.insertByName(name, style)
    style = styles.getByName(name)
    style.IsLandscape = True
    style.Width, style.Height = 29700, 21000
    style.LeftMargin = style.RightMargin = 1200
    style.ScaleToPagesX = 1
    style.ScaleToPagesY = pages_tall
    sheet.PageStyle = name


def fixed_axis(axis, low, high):
    axis.AutoMin, axis.AutoMax = False, False
    axis.Min, axis.Max = low, high


def limits_chart(sheet, name, at, first, last, titles, y_min):
    """Rows first..last (0-based, the header first) of a RATES.APART table on
    the third sheet: names in A as categories, rate and limits (C to E) as
    dots and limit bars."""
    names = CellRangeAddress(2, 0, first, 0, last)
    values = CellRangeAddress(2, 2, first, 4, last)
    chart = titled_chart(sheet, name, Rectangle(at.X, at.Y, 16000, 10500), (names, values), True, None, titles)
    chart.Diagram = chart.createInstance("com.sun.star.chart.LineDiagram")
    symbols_only(chart, [8, 13, 13])
    legend_below(chart)
    fixed_axis(chart.Diagram.YAxis, y_min, 1.0)


def add_limits_sheet(doc):
    """A third sheet: which ovens stand apart from the whole (RATES.APART,
    exact limits for all four ovens at once) and a p-chart of oven A's days
    (RATES.APART with family "each", level 0.9973, normal limits), each with
    a chart of points against their own limits."""
    doc.Sheets.insertNewByName("Decision limits", 2)
    sheet = doc.Sheets.getByName("Decision limits")
    cell = sheet.getCellRangeByName
    cell("A1").setString("Which ovens stand apart from the whole? Decision limits (exact, 95 % for all four ovens "
                         "at once, around the overall pass rate)")
    cell("A1").CharWeight = 150
    cell("A2").setString("An oven outside its limits is unlikely to share the others' pass rate: a signal to "
                         "investigate, not a verdict on the oven. Limits assume independent boards.")
    # The range's 7 rows plus 3: the header, the rows, room for a note and a caution.
    cell("A%d:F%d" % (LIMITS_TOP, LIMITS_TOP + 9)).setArrayFormula(
        "RATES.APART($'Oven trial'.B5:B11;$'Oven trial'.C5:C11;;;;;;$'Oven trial'.A5:A11)")
    cell("C%d:E%d" % (LIMITS_TOP + 1, LIMITS_TOP + 9)).NumberFormat = number_format(doc, "0.0%")
    cell("A%d:A%d" % (LIMITS_TOP + 8, LIMITS_TOP + 9)).IsTextWrapped = True  # a note or caution, when there is one
    cell("A%d:F%d" % (LIMITS_TOP, LIMITS_TOP)).CharWeight = 150
    cell("A%d:F%d" % (LIMITS_TOP, LIMITS_TOP)).IsTextWrapped = True
    cell("A%d" % (DAYS_TOP - 2)).setString("Oven A day by day: p-chart (three-sigma limits, level 0.9973, each day "
                                           "against the three weeks' pass rate)")
    cell("A%d" % (DAYS_TOP - 2)).CharWeight = 150
    for col, text in zip("HI", ["Boards passing", "Boards run"]):
        heading(cell("%s%d" % (col, DAYS_TOP)), text)
    for k, (x, n) in enumerate(DAYS):
        cell("H%d" % (DAYS_TOP + 1 + k)).setValue(x)
        cell("I%d" % (DAYS_TOP + 1 + k)).setValue(n)
    last = DAYS_TOP + len(DAYS)
    days = "H%d:H%d;I%d:I%d" % (DAYS_TOP + 1, last, DAYS_TOP + 1, last)
    cell("A%d:F%d" % (DAYS_TOP, last + 2)).setArrayFormula('RATES.APART(%s;0.9973;"each";;"normal")' % days)
    cell("A%d:A%d" % (last + 1, last + 2)).IsTextWrapped = True
    cell("C%d:E%d" % (DAYS_TOP + 1, last)).NumberFormat = number_format(doc, "0.0%")
    cell("A%d:F%d" % (DAYS_TOP, DAYS_TOP)).CharWeight = 150
    cell("A%d:F%d" % (DAYS_TOP, DAYS_TOP)).IsTextWrapped = True
    for col, width in zip("ABCDEFGHI", [7000, 2000, 2000, 3600, 3600, 2000, 600, 2400, 2400]):
        sheet.Columns.getByName(col).Width = width
    # Charts: rates as dots, limits as short bars, no lines between groups.
    # The header row (its titles name the series), then the seven rows of the
    # tally, so an oven typed in a spare row appears.
    limits_chart(sheet, "OvenLimits", cell("K1").Position, LIMITS_TOP - 1, LIMITS_TOP + 6,
                 ("Pass rate of each oven against its decision limits", "Oven", "Pass rate"), 0.5)
    limits_chart(sheet, "DailyPChart", cell("K%d" % DAYS_TOP).Position, DAYS_TOP - 1, last - 1,
                 ("p-chart of oven A, day by day", "Day", "Pass rate"), 0.8)
    landscape_pages(doc, sheet, "Decision limits", 1)


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
                             "The pass-rate chart (below the planning block) shows the filled rows: after adding "
                             "an oven, widen its data ranges (right-click the chart, Data Ranges). Needs the "
                             "tallyrates extension.")
        for col, text in zip("ABCDE", ["Oven", "Boards passing", "Boards run", "Pass rate", "Belt speed (cm/min)"]):
            heading(cell(col + "4"), text)
        for k, (name, x, n, speed) in enumerate(OVENS):
            r = 5 + k
            cell("A%d" % r).setString(name)
            cell("B%d" % r).setValue(x)
            cell("C%d" % r).setValue(n)
            cell("E%d" % r).setValue(speed)
        percent = number_format(doc, "0.0%")
        # How sure each oven meets the plant's target (Bayesian, flat prior).
        cell("A3").setString("Plant target pass rate")
        cell("B3").setValue(0.95)
        cell("B3").NumberFormat = percent
        # Per oven, beside its counts, blank until counts are typed ({i}: its position).
        for col, text, fn, fmt in (
                ("F", "95 % confidence low (Wilson)", "RATES.ONE.LOW(%s;{i})" % COUNTS, percent),
                ("G", "95 % confidence high", "RATES.ONE.HIGH(%s;{i})" % COUNTS, percent),
                ("K", "P(pass rate above target)", "RATES.POST.ABOVE(%s;{i};$B$3)" % COUNTS, "0.00"),
                ("L", "P(best oven)", "RATES.POST.BEST(%s;{i})" % COUNTS, "0.00"),
                ("M", "P(pilot ahead of this oven)", "IF({i}=4;\"\";RATES.POST.AHEAD(%s;4;{i}))" % COUNTS, "0.00")):
            heading(cell(col + "4"), text)
            for r in range(5, 12):
                cell("%s%d" % (col, r)).setFormula('=IF(C%d>0;%s;"")' % (r, fn.format(i=r - 4)))
                cell("%s%d" % (col, r)).NumberFormat = fmt if isinstance(fmt, int) else number_format(doc, fmt)
        heading(cell("H4"), "Stands out? (residual)")
        for r in range(5, 12):
            cell("D%d" % r).setFormula('=IF(C%d>0;B%d/C%d;"")' % (r, r, r))
            cell("D%d" % r).NumberFormat = percent
            # Distances of the interval ends from the rate: the chart's error bars.
            cell("I%d" % r).setFormula('=IF(C%d>0;G%d-D%d;"")' % (r, r, r))
            cell("J%d" % r).setFormula('=IF(C%d>0;D%d-F%d;"")' % (r, r, r))
        cell("H5:H11").setArrayFormula("RATES.SAME.RESID(%s)" % COUNTS)
        cell("H5:H11").NumberFormat = number_format(doc, "+0.00;-0.00")
        cell("I4").setString("error bar up")
        cell("J4").setString("error bar down")
        # The plant target beside each filled row: the chart's target line.
        cell("N4").setString("Plant target")
        for r in range(5, 12):
            cell("N%d" % r).setFormula('=IF(C%d>0;$B$3;"")' % r)
        cell("A13").setString("Results")
        cell("A13").CharWeight = 150
        for k, (label, formula, fmt) in enumerate(RESULTS):
            r = 14 + k
            cell("A%d" % r).setString(label)
            cell("B%d" % r).setFormula(formula)
            if fmt:
                cell("B%d" % r).NumberFormat = number_format(doc, fmt)
        cell("A25").setString("Report of the automatic test (array formula)")
        cell("A25").CharWeight = 150
        cell("A26:B36").setArrayFormula("RATES.SAME.REPORT(%s;;;;%s)" % (COUNTS, LABELS))
        # Four significant decimals at most: no 15-digit values in the report.
        cell("B26:B36").NumberFormat = number_format(doc, "#,##0.####")
        cell("A26:A36").IsTextWrapped = True  # labels that name an oven are long
        cell("A38").setString("Caution: a small p-value says the ovens' rates differ beyond chance; it is not "
                              "engineering acceptance. Follow the standards that apply and have decisions reviewed.")
        cell("A40").setString("Which ovens differ? Every pair: first oven's pass rate minus the second's, its 95 % "
                              "confidence interval (Miettinen-Nurminen) holding for all pairs together, p-value, p "
                              "adjusted by Bonferroni over all pairs, and the verdict (array formula)")
        cell("A40").CharWeight = 150
        bottom = PAIRS_TOP + PAIRS_ROWS - 1
        cell("A%d:H%d" % (PAIRS_TOP, bottom)).setArrayFormula("RATES.PAIRS(%s;;;;;%s)" % (COUNTS, LABELS))
        cell("C%d:E%d" % (PAIRS_TOP + 1, bottom)).NumberFormat = number_format(doc, "+0.0%;-0.0%")
        cell("F%d:G%d" % (PAIRS_TOP + 1, bottom)).NumberFormat = number_format(doc, "0.0000")
        cell("A%d:H%d" % (PAIRS_TOP, PAIRS_TOP)).CharWeight = 150
        cell("C%d:G%d" % (PAIRS_TOP, PAIRS_TOP)).HoriJustify = 3  # RIGHT, over the numbers
        cell("A%d:H%d" % (PAIRS_TOP, bottom)).IsTextWrapped = True
        heading(cell("A%d" % PLAN_TOP), "How many more boards? Planning the next runs")
        cell("A%d" % PLAN_TOP).IsTextWrapped = False
        # One line per answer: the label runs over the empty cells B to F,
        # the answer stands in G.
        for k, (label, formula, fmt) in enumerate(PLAN):
            r = PLAN_TOP + 1 + k
            cell("A%d" % r).setString(label)
            if formula:
                cell("G%d" % r).setFormula(formula)
            else:
                cell("G%d" % r).setValue(0.02)
                cell("G%d" % r).CellBackColor = 0xFFF2CC  # an input: shaded
            cell("G%d" % r).NumberFormat = number_format(doc, fmt)
        cell("A%d" % (PLAN_TOP + len(PLAN) + 1)).setString(
            "Planning sizes assume the process stays as it was during these runs; a size met is not acceptance of "
            "the process. Follow the standards that apply and have test plans reviewed.")
        # The check sentence wraps in a merged cell across the page; the
        # report's "why" overflows into the empty cells to its right.
        check = cell("B14:E14")
        check.merge(True)
        check.IsTextWrapped = True
        check.VertJustify = 1  # top
        cell("A14").VertJustify = 1
        sheet.Rows.getByIndex(13).OptimalHeight = True
        columns = sheet.Columns
        # Narrow enough for A4 landscape at 80 % or more (no type below 8 pt);
        # long labels wrap, headers stand right over their numbers.
        for col, width in zip("ABCDEFGHIJKLM", [6800, 3000, 2400, 2300, 2600, 2500, 2500, 2600, 0, 0, 3000, 2400, 3000]):
            columns.getByName(col).Width = width
        cell("B4:M4").HoriJustify = 3  # RIGHT
        cell("A4:M4").VertJustify = 3  # BOTTOM
        cell("A14:A24").IsTextWrapped = True
        # The error-bar and target helper columns are for the chart only.
        for col in "IJN":
            columns.getByName(col).IsVisible = False
        # Landscape pages, as wide as the tally.
        # As many pages as the rows need: the type stays readable. Columns A
        # to M (the chart below the planning block included) and nothing that
        # only overflows past them.
        landscape_pages(doc, sheet, "Oven trial", 0)
        from com.sun.star.table import CellRangeAddress as Area
        sheet.setPrintAreas((Area(0, 0, 0, 12, PLAN_TOP + len(PLAN) + 28),))
        # Pass rate by oven with its interval and the plant target, for the
        # eye: below the planning block, where it prints at a readable size.
        pass_rate_chart(office, sheet, cell("A%d" % (PLAN_TOP + len(PLAN) + 3)).Position)
        add_curves_sheet(doc)
        add_limits_sheet(doc)
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
