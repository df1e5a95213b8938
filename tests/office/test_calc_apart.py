#!/usr/bin/python3
"""The apart family inside a real LibreOffice with the installed .oxt:
decision limits for every group around the whole, the RATES.APART table
with labels and blank rows, and Err:502 / Err:523 for what it refuses.

Values are compared with tests/reference/apart.csv (scipy norm, binom and
hypergeom; brute-force enumeration of the tables with the tally's margins);
each comparison names the row's source.
"""
import harness
from harness import SheetCase


def apart_rows(case):
    return [r for r in harness.reference_rows() if r["case"] == case and r["quantity"].startswith("apart|")]


def formula(r, quantity):
    _, how, family, target, spread, level, i, end = quantity.split("|")
    name = "RATES.APART.LOW" if end == "low" else "RATES.APART.HIGH"
    target = "" if target == "none" else target
    return '=%s(%s;%s;%s;"%s";%s;"%s";"%s")' % (name, r, i, level, family, target, how, spread)


class Limits(SheetCase):
    def test_every_reference_row_of_two_tallies(self):
        checked = 0
        for case in ("a_ovens", "a_small"):
            rows = apart_rows(case)
            r = self.put_counts(rows[0]["successes"], rows[0]["attempts"])
            for row in rows:
                self.formula("H1", formula(r, row["quantity"]))
                tol = 0.0 if "|exact|" in row["quantity"] else 1e-12
                self.assertAlmostEqual(self.value_of("H1"), row["value"], delta=tol,
                                       msg="%s %s (%s)" % (case, row["quantity"], row["source"]))
                checked += 1
        self.assertEqual(checked, 2 * 2 * 9 * 4 * 2)

    def test_defaults_are_exact_all_around_the_whole(self):
        r = self.put_counts([286, 271, 233, 14], [300, 290, 260, 14])
        self.formula("H1", "=RATES.APART.LOW(%s;3)" % r)
        self.formula("H2", '=RATES.APART.LOW(%s;3;0.95;"all";;"exact";"none")' % r)
        self.assertEqual(self.value_of("H1"), self.value_of("H2"))
        # apart.csv: 90.0 % for oven C, every table with the margins enumerated.
        self.assertEqual(self.value_of("H1"), 0.9)


class Table(SheetCase):
    def test_table_with_labels_and_blank_rows(self):
        # Ovens in rows 1, 2, 4 and 5, row 3 blank, row 6 an oven not yet run.
        r = self.put_counts([286, 271, None, 233, 14, 0], [300, 290, None, 260, 14, 0])
        for k, name in enumerate(["Oven A", "Oven B", "", "Oven C", "Pilot", "Oven D"]):
            self.sheet.getCellRangeByName("C%d" % (k + 1)).setString(name)
        self.sheet.getCellRangeByName("E1:J9").setArrayFormula("RATES.APART(%s;;;;;;C1:C6)" % r)
        self.doc.calculateAll()
        cell = lambda c, k: self.sheet.getCellRangeByName("%s%d" % (c, k))
        self.assertTrue(cell("H", 1).getString().startswith("lower limit (95 %, all 4 groups at once, around the whole"),
                        cell("H", 1).getString())
        self.assertEqual(cell("E", 2).getString(), "Oven A")
        self.assertEqual(cell("J", 2).getString(), "within")
        self.assertEqual(cell("E", 4).getString(), "")  # the blank row
        self.assertEqual(cell("J", 5).getString(), "below")  # oven C
        self.assertEqual(cell("H", 5).getValue(), 0.9)
        self.assertEqual(cell("J", 7).getString(), "no attempts")
        # The table and the single cells agree to the last bit.
        for k, position in ((2, 1), (3, 2), (5, 4), (6, 5)):
            self.formula("L1", "=RATES.APART.LOW(%s;%d)" % (r, position))
            self.formula("L2", "=RATES.APART.HIGH(%s;%d)" % (r, position))
            self.doc.calculateAll()
            self.assertEqual(cell("H", k).getValue(), self.value_of("L1"))
            self.assertEqual(cell("I", k).getValue(), self.value_of("L2"))
        # Surplus rows blank, not #N/A.
        for k in range(8, 10):
            self.assertEqual(cell("E", k).getError(), 0)
            self.assertEqual(cell("E", k).getString(), "")

    def test_caution_when_groups_vary_beyond_counting(self):
        # Twelve invented lots whose rates scatter far more than counts of
        # 200 explain: Tarone's test flags it and the table says so.
        x = [150, 196, 170, 190, 140, 198, 160, 185, 175, 199, 145, 180]
        r = self.put_counts(x, [200] * 12)
        self.sheet.getCellRangeByName("E1:J16").setArrayFormula("RATES.APART(%s;;;;\"normal\")" % r)
        self.doc.calculateAll()
        self.assertTrue(self.sheet.getCellRangeByName("E14").getString().startswith("caution: "))
        self.assertIn("Tarone", self.sheet.getCellRangeByName("E14").getString())

    def test_problems_show_in_the_first_cell(self):
        r = self.put_counts([10, 10], [10, 10])
        self.sheet.getCellRangeByName("E1:J4").setArrayFormula("RATES.APART(%s)" % r)
        self.doc.calculateAll()
        self.assertIn("passed", self.sheet.getCellRangeByName("E1").getString())


class Errors(SheetCase):
    def test_refusals(self):
        r = self.put_counts([286, 271, 233], [300, 290, 260])
        for text in ("=RATES.APART.LOW(%s;1;;;1.5)" % r, '=RATES.APART.LOW(%s;1;;"some")' % r,
                     '=RATES.APART.HIGH(%s;1;;;;"exact";"time")' % r, "=RATES.APART.LOW(%s;9)" % r,
                     '=RATES.APART.LOW(%s;1;;;;"poisson")' % r, "=RATES.APART.HIGH(%s;1;1)" % r):
            self.formula("H1", text)
            self.assertEqual(self.shown("H1"), "Err:502", text)
        big = self.put_counts([4e12, 5e12], [1e13, 1e13], "D", "E")
        self.formula("H2", "=RATES.APART.LOW(%s;1)" % big)
        self.assertEqual(self.shown("H2"), "Err:523")
        self.formula("H3", '=RATES.APART.LOW(%s;1;;;;"normal")' % big)
        self.assertGreater(self.value_of("H3"), 0.39)



class FunnelAndPrior(SheetCase):
    def test_funnel_curve_matches_the_reference(self):
        # curve|...: Spiegelhalter (2005) interpolation recomputed with scipy binom.
        rows = [r for r in harness.reference_rows() if r["case"] == "a_lots" and r["quantity"].startswith("curve|0.998|")]
        r = self.put_counts(rows[0]["successes"], rows[0]["attempts"])
        self.sheet.getCellRangeByName("E1:G13").setArrayFormula("RATES.APART.CURVE(%s;0.998;0.95;12)" % r)
        self.doc.calculateAll()
        self.assertEqual(self.sheet.getCellRangeByName("E1").getString(), "attempts")
        for row in rows:
            _, _, _, _, k, end = row["quantity"].split("|")
            col = {"n": "E", "low": "F", "high": "G"}[end]
            got = self.sheet.getCellRangeByName("%s%d" % (col, int(k) + 1)).getValue()
            self.assertAlmostEqual(got, row["value"], delta=1e-9, msg="%s (%s)" % (row["quantity"], row["source"]))

    def test_prior_fit_matches_scipy(self):
        want = {r["quantity"]: r["value"] for r in harness.reference_rows() if r["case"] == "f_suppliers"}
        x = [95, 88, 190, 45, 99, 260, 70, 140, 48, 97, 188, 91, 290, 60, 75, 148, 39, 99, 181, 120]
        n = [100, 100, 200, 50, 100, 300, 80, 150, 50, 100, 200, 100, 300, 70, 80, 150, 40, 100, 200, 130]
        r = self.put_counts(x, n)
        self.formula("H1", '=RATES.PRIOR.FIT(%s;"a")' % r)
        self.formula("H2", '=RATES.PRIOR.FIT(%s;"B")' % r)
        # scipy betabinom maximised numerically (apart.py): a flat optimum, 1e-3.
        self.assertAlmostEqual(self.value_of("H1"), want["prior_fit_a"], delta=1e-3 * want["prior_fit_a"])
        self.assertAlmostEqual(self.value_of("H2"), want["prior_fit_b"], delta=1e-3 * want["prior_fit_b"])
        # Fed to a POST function: the fitted prior is accepted as it stands.
        self.formula("H3", "=RATES.POST.MEAN(%s;1;H1;H2)" % r)
        self.assertGreater(self.value_of("H3"), 0.9)
        for text in ('=RATES.PRIOR.FIT(%s;"c")' % r, "=RATES.PRIOR.FIT(%s;1)" % r,
                     '=RATES.APART.CURVE(%s;;;1)' % r):
            self.formula("H4", text)
            self.assertEqual(self.shown("H4"), "Err:502", text)

if __name__ == "__main__":
    harness.main()
