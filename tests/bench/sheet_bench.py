#!/usr/bin/python3
"""Sheet-level benchmark: recalculates a sheet of BLOCKS 2 x 3 tables, once
with RATES.SAME.P (Pearson route) and once with the built-in CHISQ.TEST on
the same counts, in a real headless LibreOffice with the installed .oxt, and
prints the time of each and their ratio. A figure for the README, not a test.

    /usr/bin/python3 tests/bench/sheet_bench.py build/tallyrates.oxt [BLOCKS]
"""
import os
import sys
import time

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "office"))
import lo_session as lo  # noqa: E402


def fill(sheet, blocks):
    # Columns: A successes, B failures, C attempts, D..E expected counts, F formula.
    data = []
    for k in range(blocks):
        for g in range(3):
            n = 40 + (k * 7 + g * 13) % 60
            x = (n * (30 + (k * 11 + g * 5) % 50)) // 100
            data.append([x, n - x, n])
    for k in range(blocks):
        rows = data[3 * k:3 * k + 3]
        S = sum(r[0] for r in rows)
        N = sum(r[2] for r in rows)
        for r in rows:
            r += [r[2] * S / N, r[2] * (N - S) / N]
    sheet.getCellRangeByName("A1:E%d" % (3 * blocks)).setDataArray(tuple(tuple(float(v) for v in r) for r in data))


def timed_recalc(doc, repeats=3):
    best = float("inf")
    for _ in range(repeats):
        t = time.perf_counter()
        doc.calculateAll()
        best = min(best, time.perf_counter() - t)
    return best


def main():
    blocks = int(sys.argv[2]) if len(sys.argv) > 2 else 3000
    office = lo.Office(sys.argv[1]).install().start()
    try:
        results = {}
        for name, formula in (("RATES.SAME.P", '=RATES.SAME.P(A{a}:A{b};C{a}:C{b};"pearson")'),
                              ("CHISQ.TEST", "=CHISQ.TEST(A{a}:B{b};D{a}:E{b})")):
            doc = office.new_sheet()
            sheet = doc.Sheets.getByIndex(0)
            fill(sheet, blocks)
            cells = [(formula.format(a=3 * k + 1, b=3 * k + 3),) for k in range(blocks)]
            sheet.getCellRangeByName("F1:F%d" % blocks).setFormulaArray(tuple(cells))
            results[name] = timed_recalc(doc)
            doc.close(True)
        for name, secs in results.items():
            print("%-13s %6d cells: %.1f ms per recalculation, %.2f us per cell"
                  % (name, blocks, secs * 1e3, secs * 1e6 / blocks))
        print("ratio RATES.SAME.P / CHISQ.TEST: %.2f" % (results["RATES.SAME.P"] / results["CHISQ.TEST"]))
    finally:
        office.stop()
    sys.stdout.flush()  # os._exit skips the flush of piped output
    os._exit(0)


if __name__ == "__main__":
    main()
