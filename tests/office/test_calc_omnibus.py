#!/usr/bin/python3
"""The worksheet functions inside a real LibreOffice with the installed .oxt.

Values are compared with tests/reference/omnibus.csv (scipy 1.10.1,
statsmodels 0.13.5 and the independent rational enumerator of
tests/reference/omnibus.py); each comparison names the row's source.
"""
import math
import os
import subprocess
import unittest

import harness
from harness import SheetCase


class ReferenceValues(SheetCase):
    def test_issue_example_matches_scipy(self):
        # Source: scipy 1.10.1 stats.chi2_contingency(correction=False) (omnibus.csv, issue_example).
        r = self.put_counts([45, 171, 12], [50, 190, 12])
        self.formula("D1", '=RATES.SAME.P(%s;"pearson")' % r)
        self.formula("D2", "=RATES.SAME.STAT(%s)" % r)
        self.formula("D3", '=RATES.SAME.P(%s;"lr")' % r)
        self.formula("D4", '=RATES.SAME.STAT(%s;"lr")' % r)
        want = {row["quantity"]: row["value"] for row in harness.reference_rows() if row["case"] == "issue_example"}
        self.assertRelative(self.value_of("D1"), want["pearson_p"], 1e-12, "pearson_p")
        self.assertRelative(self.value_of("D2"), want["pearson_stat"], 1e-12, "pearson_stat")
        self.assertRelative(self.value_of("D3"), want["lr_p"], 1e-12, "lr_p")
        self.assertRelative(self.value_of("D4"), want["lr_stat"], 1e-12, "lr_stat")

    def test_every_reference_row(self):
        method = {"pearson_p": '"pearson"', "lr_p": '"lr"', "exact_p": '"exact"', "exact_lr_p": '"exact-lr"',
                  "exact_prob_p": '"exact-prob"', "fisher_p": '"exact"', "tarone_p": '"tarone"'}
        checked = 0
        for row in harness.reference_rows():
            q = row["quantity"]
            if not (q in method or q in ("pearson_stat", "lr_stat") or (q.startswith("trend_") and q.endswith("_p"))):
                continue
            r = self.put_counts(row["successes"], row["attempts"], first_row=1)
            if q in method:
                text = "=RATES.SAME.P(%s;%s)" % (r, method[q])
            elif q in ("pearson_stat", "lr_stat"):
                text = '=RATES.SAME.STAT(%s;"%s")' % (r, q.split("_")[0])
            elif q.startswith("trend_") and q.endswith("_p"):
                scores = ""
                if row["case"] == "t_uneven_scores":
                    for k, s in enumerate([0, 1, 2, 5]):
                        self.sheet.getCellRangeByName("C%d" % (k + 1)).setValue(s)
                    scores = "C1:C4"
                text = '=RATES.TREND.P(%s;%s;"%s")' % (r, scores, q.split("_")[1])
            else:
                continue
            self.formula("E1", text)
            tol = 1e-12 if (row["value"] > 1e-30 or "stat" in q) else 1e-9
            if q.startswith("trend"):
                tol = 1e-10
            self.assertRelative(self.value_of("E1"), row["value"], tol, "%s %s (%s)" % (row["case"], q, row["source"]))
            checked += 1
            # Clear for the next case (cases differ in size).
            self.sheet.getCellRangeByName("A1:C20").clearContents(1 | 4 | 16)
        self.assertEqual(checked, 40 + 41 + 6 + 3)  # chi-square, exact (incl. near ties and N = 300-480), trend, Tarone

    def test_diff(self):
        # Arithmetic of the definition rate_i - rate_j (common practice, no source).
        r = self.put_counts([45, None, 12], [50, None, 16])
        self.formula("D1", "=RATES.DIFF(%s;1;3)" % r)
        self.assertAlmostEqual(self.value_of("D1"), 45 / 50 - 12 / 16, places=15)

    def test_trend_z_is_signed_like_statsmodels(self):
        # Source: statsmodels 0.13.5 Table.test_ordinal_association, the
        # linear-by-linear z (omnibus.csv rows trend_conditional_z): a rising
        # rate gives +3.755, a falling one over uneven scores -0.810.
        want = {(row["case"]): row for row in harness.reference_rows() if row["quantity"] == "trend_conditional_z"}
        r = self.put_counts([2, 5, 9, 14], [30, 30, 30, 30])
        self.formula("D1", '=RATES.TREND.Z(%s;;"conditional")' % r)
        self.assertRelative(self.value_of("D1"), want["t_rising"]["value"], 1e-10, want["t_rising"]["source"])
        r = self.put_counts([10, 12, 8, 3], [40, 50, 30, 20])
        for k, s in enumerate([0, 1, 2, 5]):
            self.sheet.getCellRangeByName("C%d" % (k + 1)).setValue(s)
        self.formula("D2", '=RATES.TREND.Z(%s;C1:C4;"conditional")' % r)
        self.assertRelative(self.value_of("D2"), want["t_uneven_scores"]["value"], 1e-10,
                            want["t_uneven_scores"]["source"])
        self.assertLess(self.value_of("D2"), 0)

    def test_labels_name_the_group(self):
        # functions.md: CHECK and SAME.REPORT take the group names as their last argument.
        r = self.put_counts([45, 171, 12], [50, 190, 12])
        for k, name in enumerate(["Oven A", "Oven B", "Pilot oven"]):
            self.sheet.getCellRangeByName("C%d" % (k + 1)).setString(name)
        self.formula("D1", "=RATES.CHECK(%s;;C1:C3)" % r)
        self.assertIn("failures at position 3, Pilot oven", self.shown("D1"))
        self.sheet.getCellRangeByName("F1:G11").setArrayFormula("RATES.SAME.REPORT(%s;;;;C1:C3)" % r)
        self.assertEqual(self.shown("F7"), "smallest expected count: failures at position 3, Pilot oven")
        # 12 x 24 / 252 expected failures (arithmetic).
        self.assertAlmostEqual(self.value_of("G7"), 12 * 24 / 252, places=12)
        self.sheet.getCellRangeByName("A3").setValue(13)
        self.assertEqual(self.shown("D1"),
                         "problem: Position 3 of the range, Pilot oven: successes (13) exceed attempts (12).")

    def test_huge_scores_give_the_scale_free_answer(self):
        # Scores of 1e306 once overflowed the sums of squares: z
        # does not depend on the scale of the scores, and with two groups the
        # binomial-variance trend statistic z^2 is Pearson's X^2 (common
        # practice, no source): 300 of 1,000 against 700 of 1,000 give
        # X^2 = 2000 (300 * 300 - 700 * 700)^2 / 1000^4 = 320, p from scipy.
        import scipy.stats
        r = self.put_counts([300, 700], [1000, 1000])
        self.sheet.getCellRangeByName("C1").setValue(1e306)
        self.sheet.getCellRangeByName("C2").setValue(2e306)
        self.formula("D1", "=RATES.TREND.P(%s;C1:C2)" % r)
        self.assertRelative(self.value_of("D1"), scipy.stats.chi2.sf(320, 1), 1e-9, "scipy chi2.sf(320, 1)")
        self.assertTrue(harness.OFFICE.alive())


class Routes(SheetCase):
    def test_auto_takes_exact_for_small_counts_and_says_so(self):
        # e_g6_pilot: brute-force exact p (omnibus.py).
        want = [row["value"] for row in harness.reference_rows()
                if row["case"] == "e_g6_pilot" and row["quantity"] == "exact_p"][0]
        r = self.put_counts([2, 3, 1, 4, 0, 5], [5, 5, 4, 6, 3, 6])
        self.formula("D1", "=RATES.SAME.P(%s)" % r)
        self.assertRelative(self.value_of("D1"), want, 1e-12, "auto = exact")
        self.formula("D2", "=RATES.CHECK(%s)" % r)
        self.assertIn('method "auto" uses the exact conditional test', self.shown("D2"))

    def test_monte_carlo_near_exact_and_reproducible(self):
        want = [row["value"] for row in harness.reference_rows()
                if row["case"] == "e_g6_pilot" and row["quantity"] == "exact_p"][0]
        r = self.put_counts([2, 3, 1, 4, 0, 5], [5, 5, 4, 6, 3, 6])
        self.formula("D1", '=RATES.SAME.P(%s;"montecarlo";200000)' % r)
        first = self.value_of("D1")
        se = math.sqrt(want * (1 - want) / 200000)
        self.assertLessEqual(abs(first - want), 4 * se + 1e-5)
        self.doc.calculateAll()
        self.assertEqual(self.value_of("D1"), first)  # same seed, same answer
        self.formula("D2", '=RATES.SAME.P(%s;"montecarlo";200000;7)' % r)
        self.assertNotEqual(self.value_of("D2"), first)

    def test_report_array(self):
        r = self.put_counts([2, 3, 1, 4, 0, 5], [5, 5, 4, 6, 3, 6])
        self.sheet.getCellRangeByName("D1:E11").setArrayFormula('RATES.SAME.REPORT(%s;"montecarlo";50000)' % r)
        self.formula("G1", '=RATES.SAME.P(%s;"montecarlo";50000)' % r)
        self.doc.calculateAll()
        label = lambda k: self.sheet.getCellRangeByName("D%d" % k).getString()
        val = lambda k: self.sheet.getCellRangeByName("E%d" % k)
        self.assertEqual(label(3), "p-value")
        self.assertEqual(val(3).getValue(), self.value_of("G1"))
        self.assertEqual(val(4).getString(), "Monte Carlo")
        self.assertEqual(val(2).getValue(), 5)  # degrees of freedom
        self.assertEqual(label(9), "random tables drawn")
        self.assertEqual(val(9).getValue(), 50000)
        self.assertEqual(label(10), "95 % range for the exact p: from")
        self.assertLess(val(10).getValue(), val(3).getValue())
        self.assertLess(val(3).getValue(), val(11).getValue())
        # The exact route in the same report layout.
        self.sheet.getCellRangeByName("D1:E11").setArrayFormula('RATES.SAME.REPORT(%s;"exact")' % r)
        self.doc.calculateAll()
        self.assertEqual(val(4).getString(), "exact conditional")
        # An exact answer has no sampling error and, at the default merge
        # width, certified bounds equal to p: those rows stay empty.
        for k in (9, 10, 11):
            self.assertEqual(val(k).getString(), "", label(k))

    def test_refused_exact_route_is_explained(self):
        # A group of 5 beside three of 80,000: the exact enumeration's set-up
        # alone would pass half its cap, so "exact" asked by name gives
        # Err:523 at once and the report says why (the certified bounds of a
        # coarse pass, when one fits, are checked in tests/engine/test_cache.cpp).
        # Since the k-way merge network a 2 x 12 table of 3,000 attempts no longer serves:
        # it is answered, in 2.8 s.
        r = self.put_counts([3, 40000, 41000, 39000], [5, 80000, 80000, 80000])
        self.formula("G1", '=RATES.SAME.P(%s;"exact")' % r)
        self.assertEqual(self.shown("G1"), "Err:523")
        self.sheet.getCellRangeByName("D1:E11").setArrayFormula('RATES.SAME.REPORT(%s;"exact")' % r)
        self.doc.calculateAll()
        val = lambda k: self.sheet.getCellRangeByName("E%d" % k)
        self.assertEqual(val(4).getString(), "none: the exact route does not fit the budget")
        self.assertIn("Exact route refused", val(5).getString())
        self.assertIn('Use method "montecarlo" or "auto"', val(5).getString())
        self.formula("G2", "=RATES.SAME.P(%s)" % r)  # the automatic route still answers
        self.assertGreater(self.value_of("G2"), 0)

    def test_report_explains_errors(self):
        r = self.put_counts([2, 3, "many"], [5, 5, 4])
        self.sheet.getCellRangeByName("D1:E11").setArrayFormula("RATES.SAME.REPORT(%s)" % r)
        self.doc.calculateAll()
        self.assertIn("Position 3 of the range: the successes cell holds text",
                      self.sheet.getCellRangeByName("E5").getString())
        self.sheet.getCellRangeByName("A3").setValue(1)
        self.sheet.getCellRangeByName("D1:E11").setArrayFormula('RATES.SAME.REPORT(%s;"fisher")' % r)
        self.doc.calculateAll()
        self.assertIn('The argument method must be one of "auto"', self.sheet.getCellRangeByName("E5").getString())


class BadInput(SheetCase):
    def expect_502(self, successes, attempts, words):
        r = self.put_counts(successes, attempts)
        self.formula("D1", "=RATES.SAME.P(%s)" % r)
        self.formula("D2", "=RATES.CHECK(%s)" % r)
        self.assertEqual(self.shown("D1"), "Err:502")
        self.assertIn(words, self.shown("D2"))

    def test_half_filled_row(self):
        self.expect_502([4, 9, 3], [10, None, 8], "Position 2 of the range: attempts is blank but successes is filled")

    def test_text_in_a_count_cell(self):
        self.expect_502([4, "nine", 3], [10, 12, 8], "Position 2 of the range: the successes cell holds text")

    def test_successes_above_attempts(self):
        self.expect_502([4, 9, 3], [10, 12, 2], "Position 3 of the range: successes (3) exceed attempts (2)")

    def test_bad_words_and_positions(self):
        r = self.put_counts([4, 9, 3], [10, 12, 8])
        self.formula("D1", '=RATES.SAME.P(%s;"chisq")' % r)
        self.formula("D2", "=RATES.DIFF(%s;1;9)" % r)
        self.formula("D3", '=RATES.TREND.P(%s;;"sideways")' % r)
        self.formula("D4", '=RATES.CHECK(%s;"chisq")' % r)
        self.assertEqual(self.shown("D1"), "Err:502")
        self.assertEqual(self.shown("D2"), "Err:502")
        self.assertEqual(self.shown("D3"), "Err:502")
        self.assertIn('The argument method must be one of "auto"', self.shown("D4"))

    def test_hostile_work_is_refused_and_office_survives(self):
        r = self.put_counts([3, 40000, 41000, 39000], [5, 80000, 80000, 80000])
        self.formula("D1", '=RATES.SAME.P(%s;"montecarlo";1E+15)' % r)
        self.formula("D2", '=RATES.SAME.P(%s;"exact")' % r)
        self.assertEqual(self.shown("D1"), "Err:523")
        self.assertEqual(self.shown("D2"), "Err:523")
        self.formula("D3", "=RATES.SAME.P(%s)" % r)  # auto still answers
        self.assertGreater(self.value_of("D3"), 0)
        self.assertTrue(harness.OFFICE.alive())


class Recalculation(SheetCase):
    def test_changing_a_count_updates_dependent_cells(self):
        r = self.put_counts([18, 27], [40, 40])
        self.formula("D1", '=RATES.SAME.P(%s;"pearson")' % r)
        self.formula("D2", "=RATES.DIFF(%s;2;1)" % r)
        before = self.value_of("D1")
        # g2_even: scipy chi2_contingency(correction=False) p = 0.04252247799805163.
        self.assertRelative(before, 0.04252247799805163, 1e-12)
        self.sheet.getCellRangeByName("A2").setValue(20)  # typed as a user would; no calculateAll
        self.assertNotEqual(self.sheet.getCellRangeByName("D1").getValue(), before)
        self.assertAlmostEqual(self.sheet.getCellRangeByName("D2").getValue(), 20 / 40 - 18 / 40, places=15)

    def test_blank_rows_are_skipped_as_counts_are_typed(self):
        r = self.put_counts([18, 27, None, None], [40, 40, None, None])
        self.formula("D1", '=RATES.SAME.P(%s;"pearson")' % r)
        self.assertRelative(self.value_of("D1"), 0.04252247799805163, 1e-12)
        self.sheet.getCellRangeByName("A3").setValue(30)
        self.assertEqual(self.shown("D1"), "Err:502")  # half-filled while typing
        self.sheet.getCellRangeByName("B3").setValue(40)
        self.assertGreater(self.value_of("D1"), 0)


class Wizard(SheetCase):
    def test_every_function_and_argument_has_a_description(self):
        dump = subprocess.run([os.environ["TALLYRATES_CATALOG_DUMP"], "--tsv"], capture_output=True, text=True,
                              check=True).stdout
        descriptions = harness.OFFICE.smgr.createInstanceWithContext("com.sun.star.sheet.FunctionDescriptions",
                                                                   harness.OFFICE.ctx)
        shown = {}
        for k in range(descriptions.getCount()):
            props = {p.Name: p.Value for p in descriptions.getByIndex(k)}
            shown[props["Name"]] = props
        lines = [l.split("\t") for l in dump.strip().split("\n")]
        self.assertGreaterEqual(len(lines), 6)
        for f in lines:
            display, description, args = f[1], f[2], f[3:]
            self.assertIn(display, shown, "function wizard lacks " + display)
            p = shown[display]
            self.assertEqual(p["Description"], description)
            self.assertEqual(len(p["Arguments"]), len(args) // 2)
            for a, (name, text) in zip(p["Arguments"], zip(args[0::2], args[1::2])):
                self.assertEqual(a.Name, name)
                self.assertEqual(a.Description, text)
                self.assertTrue(text)



class ExtraVariation(SheetCase):
    def test_tarone_in_the_report_and_its_refusal(self):
        # omnibus.csv t_spread_lots: Tarone (1979) recomputed in exact fractions and mpmath.
        want = {r["quantity"]: r["value"] for r in harness.reference_rows() if r["case"] == "t_spread_lots"}
        x = [8, 2, 7, 8, 1, 6, 8, 3, 7, 8, 2, 8]
        r = self.put_counts(x, [8] * 12)
        self.sheet.getCellRangeByName("D1:E11").setArrayFormula('RATES.SAME.REPORT(%s;"tarone")' % r)
        self.doc.calculateAll()
        cell = self.sheet.getCellRangeByName
        self.assertEqual(cell("D1").getString(), "statistic: Tarone's z")
        self.assertRelative(cell("E1").getValue(), want["tarone_z"], 1e-12, "tarone_z")
        self.assertEqual(cell("E2").getString(), "")  # no degrees of freedom
        self.assertRelative(cell("E3").getValue(), want["tarone_p"], 1e-12, "tarone_p")
        self.assertIn("Tarone", cell("E4").getString())
        # Every lot of one unit: not defined; RATES.CHECK with the method says why.
        r = self.put_counts([1, 0, 1, 1], [1, 1, 1, 1], "G", "H")
        self.formula("J1", '=RATES.SAME.P(%s;"tarone")' % r)
        self.formula("J2", '=RATES.CHECK(%s;"tarone")' % r)
        self.assertEqual(self.shown("J1"), "Err:502")
        self.assertIn("single attempt", self.shown("J2"))

if __name__ == "__main__":
    harness.main()
