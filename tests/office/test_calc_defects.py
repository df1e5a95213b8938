#!/usr/bin/python3
"""The defects once found by the sweeps, through a real LibreOffice: every row of
tests/reference/defects.csv (exact fractions, 50-digit mpmath, the rate-axis
quadrature of sweep.py; each row names its source) typed into a cell, and
the process still alive and answering after the formulas that used to hang
it (RATES.PLAN.WIDTH at a half-width of 1e-9, a prior of 1e300)."""
import csv
import os
import time

import harness
from harness import SheetCase

DEFECTS = os.path.join(harness.HERE, "..", "reference", "defects.csv")


def defect_rows():
    with open(DEFECTS) as f:
        yield from csv.DictReader(f)


class Defects(SheetCase):
    def test_every_defect_row(self):
        checked, slowest = 0, (0.0, "")
        for row in defect_rows():
            x = [int(v) for v in row["successes"].split()]
            n = [int(v) for v in row["attempts"].split()]
            for k in range(10):  # a fresh range each time: no count of an earlier row stays behind
                for col in "AB":
                    self.sheet.getCellRangeByName("%s%d" % (col, k + 1)).setString("")
            r = self.put_counts(x, n) if x else ""
            text = row["formula"].replace("{r}", r)
            self.formula("D1", text)
            what = "defect %s: %s (%s)" % (row["defect"], text, row["source"])
            start = time.monotonic()
            if row["expected"].startswith("Err:"):
                self.assertEqual(self.shown("D1"), row["expected"], what)
            else:
                want = float(row["expected"])
                got = self.value_of("D1")
                # Whole numbers of attempts exactly; other values within the
                # engine's promise for probabilities: 1e-10 absolute, 1e-8 relative.
                tolerance = 0 if want >= 1 and want.is_integer() else max(1e-10, 1e-8 * abs(want))
                self.assertLessEqual(abs(got - want), tolerance, what)
            slowest = max(slowest, (time.monotonic() - start, text))
            checked += 1
        print("defect rows: %d, slowest %.3f s (%s)" % (checked, slowest[0], slowest[1]))
        self.assertEqual(checked, 24)
        # The office still answers an ordinary formula.
        self.formula("E1", "=SUM(1;2)")
        self.assertEqual(self.value_of("E1"), 3)


if __name__ == "__main__":
    harness.main()
