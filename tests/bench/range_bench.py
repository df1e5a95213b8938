#!/usr/bin/python3
"""Range-argument benchmark: what one formula cell costs per recalculation
when its count ranges are whole columns (A:A) against the same formula on the
exact used rows, beside the built-in CHISQ.TEST on the same counts, for a
short tally (4 groups) and a long one (3,000 groups), in a real headless
LibreOffice with the installed .oxt. Also the cost of an optional range
argument (labels) given as a whole column. A figure for the README, not a
test.

    /usr/bin/python3 tests/bench/range_bench.py build/tallyrates.oxt
"""
import os
import sys
import time

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "office"))
import lo_session as lo  # noqa: E402

CELLS = 20  # formula cells per measurement, all reading the same ranges


def fill(sheet, groups):
    # Row 1 headings; then A successes, B failures, C attempts, D..E expected
    # counts under one shared rate (for CHISQ.TEST), F a label.
    rows = []
    for g in range(groups):
        n = 40 + (g * 13) % 60
        x = (n * (30 + (g * 11) % 50)) // 100
        rows.append([x, n - x, n])
    S = sum(r[0] for r in rows)
    N = sum(r[2] for r in rows)
    data = [tuple(float(v) for v in r + [r[2] * S / N, r[2] * (N - S) / N]) for r in rows]
    sheet.getCellRangeByName("A1:F1").setDataArray((("Passed", "Failed", "Made", "E pass", "E fail", "Line"),))
    sheet.getCellRangeByName("A2:E%d" % (groups + 1)).setDataArray(tuple(data))
    sheet.getCellRangeByName("F2:F%d" % (groups + 1)).setDataArray(tuple(("L%d" % g,) for g in range(groups)))


def per_cell_us(doc, sheet, formula, repeats=5):
    sheet.getCellRangeByName("H1:H%d" % CELLS).setFormulaArray(tuple((formula,) for _ in range(CELLS)))
    best = float("inf")
    for _ in range(repeats):
        t = time.perf_counter()
        doc.calculateAll()
        best = min(best, time.perf_counter() - t)
    errors = sheet.getCellRangeByName("H1").getError()
    sheet.getCellRangeByName("H1:H%d" % CELLS).clearContents(1 | 2 | 4 | 16)
    return best * 1e6 / CELLS, errors


def main():
    office = lo.Office(sys.argv[1]).install().start()
    try:
        for groups in (4, 3000):
            doc = office.new_sheet()
            sheet = doc.Sheets.getByIndex(0)
            fill(sheet, groups)
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
    finally:
        office.stop()
    sys.stdout.flush()  # os._exit skips the flush of piped output
    os._exit(0)


if __name__ == "__main__":
    main()
