#!/usr/bin/python3
"""Sheet-level benchmarks in a real headless LibreOffice with the installed
.oxt; figures for the README, not tests.

    /usr/bin/python3 tests/bench/sheet_bench.py build/tallyrates.oxt [BLOCKS]
recalculates a sheet of BLOCKS 2 x 3 tables, once with RATES.SAME.P (Pearson
route) and once with the built-in CHISQ.TEST on the same counts, and prints
the time of each and their ratio.

    /usr/bin/python3 tests/bench/sheet_bench.py build/tallyrates.oxt pairs
recalculates twelve lines with a RATES.PAIRS block and a DIFF.LOW/HIGH pair
per comparison (133 formulas) after a count changes, beside as many
CHISQ.TEST cells on the same counts; and the first against the later cells
of Holm-adjusted exact RATES.PAIR.P on the same ranges (the later ones find
the pairwise analysis in the cache).

    /usr/bin/python3 tests/bench/sheet_bench.py build/tallyrates.oxt ranges
prints what one formula cell costs per recalculation when its count ranges
are whole columns (A:A) against the same formula on the exact used rows,
beside CHISQ.TEST on the same counts, for a short tally (4 groups) and a long
one (3,000 groups); also an optional range argument (labels) given as a
whole column. CELLS formula cells read the same ranges.
    /usr/bin/python3 tests/bench/sheet_bench.py build/tallyrates.oxt bayes
recalculates, after one count changes, a RATES.POST.TABLE of 30 suppliers
(300 units each) with the flat and with Jeffreys' prior, and a column of 200
RATES.POST.BEST cells (and one of 200 RATES.POST.LOSS cells) beside 200
lots; each beside the same number of built-in BETA.DIST / BETA.INV cells on
the same counts (what a sheet without the add-in would show: each group's
own law, nothing across groups).
"""
import os
import sys
import time

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "office"))
import lo_session as lo  # noqa: E402


def with_expected(rows):
    """[successes, failures, attempts] rows plus the expected successes and
    failures under one shared rate (what CHISQ.TEST needs)."""
    S = sum(r[0] for r in rows)
    N = sum(r[2] for r in rows)
    return [r + [r[2] * S / N, r[2] * (N - S) / N] for r in rows]


def fill_blocks(sheet, blocks):
    # Columns: A successes, B failures, C attempts, D..E expected counts, F formula.
    data = []
    for k in range(blocks):
        rows = []
        for g in range(3):
            n = 40 + (k * 7 + g * 13) % 60
            x = (n * (30 + (k * 11 + g * 5) % 50)) // 100
            rows.append([x, n - x, n])
        data += with_expected(rows)
    sheet.getCellRangeByName("A1:E%d" % (3 * blocks)).setDataArray(tuple(tuple(float(v) for v in r) for r in data))


def fill_tally(sheet, groups):
    # Row 1 headings; then as fill_blocks, one tally of `groups` rows, F a label.
    rows = []
    for g in range(groups):
        n = 40 + (g * 13) % 60
        x = (n * (30 + (g * 11) % 50)) // 100
        rows.append([x, n - x, n])
    data = tuple(tuple(float(v) for v in r) for r in with_expected(rows))
    sheet.getCellRangeByName("A1:F1").setDataArray((("Passed", "Failed", "Made", "E pass", "E fail", "Line"),))
    sheet.getCellRangeByName("A2:E%d" % (groups + 1)).setDataArray(data)
    sheet.getCellRangeByName("F2:F%d" % (groups + 1)).setDataArray(tuple(("L%d" % g,) for g in range(groups)))


def timed_recalc(doc, repeats=3):
    best = float("inf")
    for _ in range(repeats):
        t = time.perf_counter()
        doc.calculateAll()
        best = min(best, time.perf_counter() - t)
    return best


def blocks_against_chisq_test(office, blocks):
    results = {}
    for name, formula in (("RATES.SAME.P", '=RATES.SAME.P(A{a}:A{b};C{a}:C{b};"pearson")'),
                          ("CHISQ.TEST", "=CHISQ.TEST(A{a}:B{b};D{a}:E{b})")):
        doc = office.new_sheet()
        sheet = doc.Sheets.getByIndex(0)
        fill_blocks(sheet, blocks)
        cells = [(formula.format(a=3 * k + 1, b=3 * k + 3),) for k in range(blocks)]
        sheet.getCellRangeByName("F1:F%d" % blocks).setFormulaArray(tuple(cells))
        results[name] = timed_recalc(doc)
        doc.close(True)
    for name, secs in results.items():
        print("%-13s %6d cells: %.1f ms per recalculation, %.2f us per cell"
              % (name, blocks, secs * 1e3, secs * 1e6 / blocks))
    print("ratio RATES.SAME.P / CHISQ.TEST: %.2f" % (results["RATES.SAME.P"] / results["CHISQ.TEST"]))


CELLS = 20


def per_cell_us(doc, sheet, formula):
    sheet.getCellRangeByName("H1:H%d" % CELLS).setFormulaArray(tuple((formula,) for _ in range(CELLS)))
    secs = timed_recalc(doc, repeats=5)
    error = sheet.getCellRangeByName("H1").getError()
    sheet.getCellRangeByName("H1:H%d" % CELLS).clearContents(1 | 2 | 4 | 16)
    return secs * 1e6 / CELLS, error


def ranges(office):
    """Whole columns against the used rows, beside CHISQ.TEST."""
    for groups in (4, 3000):
        doc = office.new_sheet()
        sheet = doc.Sheets.getByIndex(0)
        fill_tally(sheet, groups)
        end = groups + 1
        cases = (
            ("RATES.SAME.P, used rows", '=RATES.SAME.P(A2:A%d;C2:C%d;"pearson")' % (end, end)),
            ("RATES.SAME.P, whole columns", '=RATES.SAME.P(A:A;C:C;"pearson")'),
            ("CHISQ.TEST, used rows", "=CHISQ.TEST(A2:B%d;D2:E%d)" % (end, end)),
            ("RATES.CHECK, labels on used rows", "=RATES.CHECK(A2:A%d;C2:C%d;;F2:F%d)" % (end, end, end)),
            ("RATES.CHECK, labels as whole column", "=RATES.CHECK(A:A;C:C;;F:F)"),
        )
        for name, formula in cases:
            us, err = per_cell_us(doc, sheet, formula)
            print("%5d groups  %-38s %10.1f us per cell%s" % (groups, name, us, "  (Err:%d)" % err if err else ""))
        doc.close(True)


def fill_twelve(sheet):
    # The twelve lines of tests/bench/bench_pairs.cpp: a perfect pilot of 12
    # beside runs of 140 to 1,140; A passed, B failed, C made, D..E expected.
    rows = []
    for g in range(12):
        n = 12 if g == 0 else 40 + 100 * g
        x = 12 if g == 0 else int(n * (0.80 + 0.015 * g))
        rows.append([x, n - x, n])
    data = tuple(tuple(float(v) for v in r) for r in with_expected(rows))
    sheet.getCellRangeByName("A1:E12").setDataArray(data)
    sheet.getCellRangeByName("F1:F12").setDataArray(tuple(("Line %d" % (g + 1),) for g in range(12)))


def recalc_after_change(doc, sheet, repeats=5):
    """Best time of a recalculation after a count changes (a new analysis each
    time: the caches cannot answer)."""
    best = float("inf")
    for k in range(repeats):
        sheet.getCellRangeByName("A12").setValue(900 - k)
        t = time.perf_counter()
        doc.calculateAll()
        best = min(best, time.perf_counter() - t)
    return best


def pairs(office):
    pairs_list = [(a, b) for a in range(1, 13) for b in range(a + 1, 13)]
    results = {}
    for name in ("PAIRS block", "CHISQ.TEST", "no formula", "PAIR.P first", "PAIR.P all 66"):
        doc = office.new_sheet()
        sheet = doc.Sheets.getByIndex(0)
        fill_twelve(sheet)
        if name == "PAIRS block":
            sheet.getCellRangeByName("H1:O67").setArrayFormula("RATES.PAIRS(A1:A12;C1:C12;;;;;F1:F12)")
            cells = [("=RATES.DIFF.LOW(A1:A12;C1:C12;%d;%d)" % ab, "=RATES.DIFF.HIGH(A1:A12;C1:C12;%d;%d)" % ab)
                     for ab in pairs_list]
            sheet.getCellRangeByName("P1:Q66").setFormulaArray(tuple(cells))
        elif name == "CHISQ.TEST":
            sheet.getCellRangeByName("P1:P133").setFormulaArray(tuple(("=CHISQ.TEST(A1:B12;D1:E12)",)
                                                                      for _ in range(133)))
        elif name != "no formula":
            chosen = pairs_list[:1] if name == "PAIR.P first" else pairs_list
            sheet.getCellRangeByName("P1:P%d" % len(chosen)).setFormulaArray(tuple(
                ('=RATES.PAIR.P(A1:A12;C1:C12;%d;%d;"holm";"exact")' % ab,) for ab in chosen))
        results[name] = recalc_after_change(doc, sheet)
        errors = sheet.getCellRangeByName("P1").getError()
        doc.close(True)
        print("%-14s %8.2f ms per recalculation%s" % (name, results[name] * 1e3, "  (Err:%d)" % errors if errors else ""))
    print("PAIRS block / CHISQ.TEST (133 formulas each): %.1f" % (results["PAIRS block"] / results["CHISQ.TEST"]))
    later = (results["PAIR.P all 66"] - results["PAIR.P first"]) / 65
    first = results["PAIR.P first"] - results["no formula"]  # Calc's own cost of a recalculation taken out
    print("PAIR.P exact, Holm: first cell %.1f us, each later cell %.1f us, ratio %.1f"
          % (first * 1e6, later * 1e6, first / later))


def fill_lots(sheet, groups):
    # A passed, C made (B failed, for symmetry with the other scenarios);
    # rates from 85 % to 95 %, 300 units each.
    rows = []
    for g in range(groups):
        x = int(300 * (0.85 + 0.10 * g / groups))
        rows.append((float(x), float(300 - x), 300.0))
    sheet.getCellRangeByName("A1:C%d" % groups).setDataArray(tuple(rows))


def bayes(office):
    """POST.TABLE of 30 and columns of 200 POST.BEST / POST.LOSS cells,
    recalculated after a count changes, beside built-in cells."""
    def after_change(doc, sheet, last_row, first_value, repeats=5):
        # Counts no earlier case typed: the component's cache, shared by every
        # document of the process, must not answer from another case's passes.
        best = float("inf")
        for k in range(repeats):
            sheet.getCellRangeByName("A%d" % last_row).setValue(first_value - k)
            t = time.perf_counter()
            doc.calculateAll()
            best = min(best, time.perf_counter() - t)
        return best

    cases = []
    for prior in ("1", "0.5"):
        cases.append(("POST.TABLE, 30 groups, prior %s" % prior, 30, "H1:M31",
                      'RATES.POST.TABLE(A1:A30;C1:C30;0.95;"high";%s;%s)' % (prior, prior), None))
        for what in ("BEST", "LOSS"):
            cases.append(("column of 200 POST.%s, prior %s" % (what, prior), 200, None, None,
                          '=RATES.POST.%s(A$1:A$200;C$1:C$200;ROW();"high";%s;%s)' % (what, prior, prior)))
    cases.append(("built-in: 30 x (mean, BETA.INV x 2)", 30, None, None, None))
    cases.append(("built-in: 200 BETA.DIST", 200, None, None, "=BETA.DIST(0.9;A1+1;C1-A1+1;1)"))
    for index, (name, groups, area, array, column) in enumerate(cases):
        doc = office.new_sheet()
        sheet = doc.Sheets.getByIndex(0)
        fill_lots(sheet, groups)
        if array:
            sheet.getCellRangeByName(area).setArrayFormula(array)
        elif column and column.startswith("=RATES"):
            sheet.getCellRangeByName("H1:H%d" % groups).setFormulaArray(tuple((column,) for _ in range(groups)))
        elif column:
            cells = [(column.replace("A1", "A%d" % r).replace("C1", "C%d" % r),) for r in range(1, groups + 1)]
            sheet.getCellRangeByName("H1:H%d" % groups).setFormulaArray(tuple(cells))
        else:
            cells = [("=(A{r}+1)/(C{r}+2)".format(r=r), "=BETA.INV(0.025;A{r}+1;C{r}-A{r}+1)".format(r=r),
                      "=BETA.INV(0.975;A{r}+1;C{r}-A{r}+1)".format(r=r)) for r in range(1, groups + 1)]
            sheet.getCellRangeByName("H1:J%d" % groups).setFormulaArray(tuple(cells))
        secs = after_change(doc, sheet, groups, 260 - 5 * index)
        error = sheet.getCellRangeByName("H2" if array else "H1").getError()
        doc.close(True)
        print("%-40s %9.1f ms per recalculation%s" % (name, secs * 1e3, "  (Err:%d)" % error if error else ""))


def main():
    office = lo.Office(sys.argv[1]).install().start()
    try:
        if len(sys.argv) > 2 and sys.argv[2] == "ranges":
            ranges(office)
        elif len(sys.argv) > 2 and sys.argv[2] == "pairs":
            pairs(office)
        elif len(sys.argv) > 2 and sys.argv[2] == "bayes":
            bayes(office)
        else:
            blocks_against_chisq_test(office, int(sys.argv[2]) if len(sys.argv) > 2 else 3000)
    finally:
        office.stop()
    sys.stdout.flush()  # os._exit skips the flush of piped output
    os._exit(0)


if __name__ == "__main__":
    main()
