#!/usr/bin/python3
"""Range arguments as users select them, in a real LibreOffice: whole
columns, another sheet, a named range, rows added below, TRUE/FALSE and error
cells in a count range, ranges along a row, and what Calc refuses (arrays
given for count ranges). DEVELOPERS.md, "How range arguments reach us", says
why count ranges are Calc range objects.

The expected values are those of the same formula on the exact used rows:
the rule checked is functions.md's (a range is read as the rows it holds),
and the numbers themselves are checked against scipy in
test_calc_omnibus.py.
"""
import harness
from harness import SheetCase

# Four production lines with a heading row, as a tally sheet starts.
HEAD = ["Passed", "Made", "Line", "Belt speed"]
ROWS = [[45, 50, "Line 1", 1.0], [171, 190, "Line 2", 1.5], [12, 12, "Line 3", 2.0], [30, 40, "Line 4", 3.0]]
FORMULAS = [
    '=RATES.SAME.P({s};{n};"pearson")',
    "=RATES.SAME.P({s};{n})",
    '=RATES.SAME.STAT({s};{n};"lr")',
    "=RATES.TREND.Z({s};{n};{scores})",
    "=RATES.DIFF({s};{n};{i};{j})",
    "=RATES.CHECK({s};{n};;{labels})",
]


class RangeArguments(SheetCase):
    def fill(self, sheet, first_row=1):
        for c, text in enumerate(HEAD):
            sheet.getCellByPosition(c, first_row - 1).setString(text)
        for r, row in enumerate(ROWS):
            for c, v in enumerate(row):
                cell = sheet.getCellByPosition(c, first_row + r)
                cell.setString(v) if isinstance(v, str) else cell.setValue(v)

    def results(self, s, n, scores, labels, i, j, column="F"):
        for k, f in enumerate(FORMULAS):
            self.formula("%s%d" % (column, k + 1), f.format(s=s, n=n, scores=scores, labels=labels, i=i, j=j))
        self.doc.calculateAll()
        return [self.shown("%s%d" % (column, k + 1)) for k in range(len(FORMULAS))]

    def used_rows(self):
        return self.results("A2:A5", "B2:B5", "D2:D5", "C2:C5", 1, 3, column="G")

    def test_whole_columns_give_the_results_of_the_used_rows(self):
        self.fill(self.sheet)
        want = self.used_rows()
        self.assertNotIn("Err", " ".join(want))
        # Positions count from the first row of the range: row 2 is position 2 of A:A.
        got = self.results("A:A", "B:B", "D:D", "C:C", 2, 4)
        self.assertEqual(got[:5], want[:5])
        self.assertIn("4 groups", got[5])
        self.assertIn("position 4, Line 3", got[5])
        self.assertIn("position 3, Line 3", want[5])

    def test_another_sheet_and_a_named_range(self):
        self.doc.Sheets.insertNewByName("Tally", 1)
        self.fill(self.doc.Sheets.getByName("Tally"))
        self.fill(self.sheet)
        want = self.used_rows()
        got = self.results("$Tally.A2:A5", "$Tally.B2:B5", "$Tally.D2:D5", "$Tally.C2:C5", 1, 3)
        self.assertEqual(got, want)
        from com.sun.star.table import CellAddress
        origin = CellAddress()
        for name, where in (("passed", "$Tally.$A$2:$A$5"), ("made", "$Tally.$B$2:$B$5")):
            self.doc.NamedRanges.addNewByName(name, where, origin, 0)
        got = self.results("passed", "made", "$Tally.D2:D5", "$Tally.C2:C5", 1, 3)
        self.assertEqual(got, want)

    def test_rows_typed_below_the_used_area_are_taken_in(self):
        self.fill(self.sheet)
        self.formula("F1", '=RATES.SAME.P(A2:A200;B2:B200;"pearson")')
        self.formula("F2", '=RATES.SAME.P(A:A;B:B;"pearson")')
        before = self.value_of("F1")
        self.assertEqual(self.value_of("F2"), before)
        # A fifth line is typed in row 6, and one far below in row 5000 of the column.
        self.sheet.getCellRangeByName("A6").setValue(20)
        self.sheet.getCellRangeByName("B6").setValue(40)
        self.formula("G1", '=RATES.SAME.P(A2:A6;B2:B6;"pearson")')
        self.assertEqual(self.value_of("F1"), self.value_of("G1"))
        self.assertNotEqual(self.value_of("F1"), before)
        self.assertEqual(self.value_of("F2"), self.value_of("G1"))
        self.sheet.getCellRangeByName("A5000").setValue(1)
        self.sheet.getCellRangeByName("B5000").setValue(9)
        self.formula("G2", '=RATES.SAME.P(A2:A5000;B2:B5000;"pearson")')
        self.assertEqual(self.value_of("F2"), self.value_of("G2"))
        self.assertNotEqual(self.value_of("F2"), self.value_of("G1"))
        # Half a row far down the column is found as well.
        self.sheet.getCellRangeByName("A9000").setValue(1)
        self.assertEqual(self.shown("F2"), "Err:502")
        self.formula("F3", "=RATES.CHECK(A:A;B:B)")
        self.assertIn("Position 9000 of the range: attempts is blank", self.shown("F3"))

    def test_a_cell_showing_true_is_not_a_count(self):
        # Calc keeps TRUE as 1 with a logical number format (addin-recipe.md);
        # functions.md: boolean cells are not counts where the add-in can see them.
        self.fill(self.sheet)
        from com.sun.star.lang import Locale
        from com.sun.star.util.NumberFormat import LOGICAL
        cell = self.sheet.getCellRangeByName("A3")
        cell.setValue(1)
        cell.NumberFormat = self.doc.NumberFormats.getStandardFormat(LOGICAL, Locale())
        self.formula("F1", "=RATES.SAME.P(A2:A5;B2:B5)")
        self.formula("F2", "=RATES.CHECK(A:A;B:B)")
        self.assertEqual(self.shown("A3"), "TRUE")
        self.assertEqual(self.shown("F1"), "Err:502")
        self.assertIn("Position 3 of the range: the successes cell holds a logical value (TRUE/FALSE)",
                      self.shown("F2"))
        # A formula whose result is logical, the other way a TRUE appears.
        self.formula("A3", "=B3>0")
        self.assertEqual(self.shown("A3"), "TRUE")
        self.assertIn("holds a logical value", self.shown("F2"))
        # A plain 1 typed in its place is a count again.
        self.sheet.getCellRangeByName("A3").setValue(171)
        cell.NumberFormat = 0
        self.assertGreater(self.value_of("F1"), 0)

    def test_a_cell_showing_an_error_is_named(self):
        self.fill(self.sheet)
        self.formula("B4", "=1/0")
        self.formula("F1", "=RATES.SAME.P(A2:A5;B2:B5)")
        self.formula("F2", "=RATES.CHECK(A2:A5;B2:B5;;C2:C5)")
        self.assertEqual(self.shown("F1"), "Err:502")
        self.assertIn("Position 3 of the range, Line 3: the attempts cell shows an error value", self.shown("F2"))

    def test_ranges_along_a_row(self):
        for k, (x, n) in enumerate([(45, 50), (171, 190), (12, 12), (30, 40)]):
            self.sheet.getCellByPosition(k, 0).setValue(x)
            self.sheet.getCellByPosition(k, 1).setValue(n)
        self.put_counts([45, 171, 12, 30], [50, 190, 12, 40], col_s="A", col_n="B", first_row=5)
        # Formulas below row 2, out of the whole rows they read.
        self.formula("F10", '=RATES.SAME.P(A1:D1;A2:D2;"exact")')
        self.formula("F11", '=RATES.SAME.P(A5:A8;B5:B8;"exact")')
        self.assertEqual(self.value_of("F10"), self.value_of("F11"))
        self.formula("F12", '=RATES.SAME.P(1:1;2:2;"exact")')  # whole rows
        self.assertEqual(self.value_of("F12"), self.value_of("F11"))

    def test_arrays_for_count_ranges_are_refused_by_calc(self):
        # Count ranges are Calc range objects: an inline or computed array is
        # refused by Calc itself (Err:504) before the add-in is called; the
        # wizard text says to put such values in cells (DEVELOPERS.md).
        self.fill(self.sheet)
        self.formula("F1", "=RATES.SAME.P({45;171};{50;190})")
        self.formula("F2", "=RATES.SAME.P(A2:A5+0;B2:B5)")
        self.formula("F3", "=RATES.CHECK(A2:A5*1;B2:B5)")
        for a in ("F1", "F2", "F3"):
            self.assertEqual(self.shown(a), "Err:504", a)
        # Optional ranges (scores) still take arrays.
        self.formula("F4", "=RATES.TREND.Z(A2:A5;B2:B5;{1;1.5;2;3})")
        self.formula("F5", "=RATES.TREND.Z(A2:A5;B2:B5;D2:D5)")
        self.assertEqual(self.value_of("F4"), self.value_of("F5"))
        self.assertTrue(harness.OFFICE.alive())

    def test_a_block_of_several_columns_is_refused_with_a_reason(self):
        self.fill(self.sheet)
        self.formula("F1", "=RATES.SAME.P(A2:B5;B2:B5)")
        self.formula("F2", "=RATES.CHECK(A2:B5;B2:B5)")
        self.assertEqual(self.shown("F1"), "Err:502")
        self.assertIn("successes", self.shown("F2"))


if __name__ == "__main__":
    harness.main()
