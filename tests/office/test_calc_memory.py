#!/usr/bin/python3
"""No leaks a user would notice: the sample workbook recalculated 1,000 times
in one LibreOffice process, a count typed anew at every tenth (ten values in
turn, so the component's bounded caches fill and recycle), must grow the
office process's resident memory by less than 5 MB after a warm-up. The
growth is printed for the README.
"""
import time

import harness
from harness import SheetCase


class Memory(SheetCase):
    def test_thousand_recalculations_of_the_sample_workbook(self):
        self.open_sample_workbook("memory.fods")
        trial = self.doc.Sheets.getByName("Oven trial")
        pilot = trial.getCellRangeByName("B8")

        def round_of(k):
            if k % 10 == 0:
                pilot.setValue(10 + (k // 10) % 5)  # the pilot's passing boards: 10 to 14 of 14
            self.doc.calculateAll()

        for k in range(100):  # warm-up: every cache filled once
            round_of(k)
        before = harness.OFFICE.resident_kb()
        self.assertIsNotNone(before)
        start = time.monotonic()
        for k in range(1000):
            round_of(k)
        seconds = time.monotonic() - start
        growth = harness.OFFICE.resident_kb() - before
        print("\n1,000 recalculations of the sample workbook: %.1f s, resident memory %d kB before, growth %d kB"
              % (seconds, before, growth))
        self.assertLess(growth, 5 * 1024)
        self.assertEqual(trial.getCellRangeByName("B14").getError(), 0)


if __name__ == "__main__":
    harness.main()
