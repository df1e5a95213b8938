#!/usr/bin/python3
"""The pairs family inside a real LibreOffice with the installed .oxt:
difference intervals, pairwise p-values with adjustment, the RATES.PAIRS
table with labels, one-rate intervals and RATES.SAME.RESID beside a tally
with blank rows.

Values are compared with tests/reference/pairs.csv (statsmodels 0.13.5,
scipy 1.10.1 and the independent Miettinen-Nurminen search of pairs.py);
each comparison names the row's source.
"""
import harness
from harness import SheetCase


def rows_of(case):
    return {r["quantity"]: r for r in harness.reference_rows() if r["case"] == case}


class DifferenceIntervals(SheetCase):
    def test_every_method_matches_the_reference(self):
        for case in ("p_mid", "p_zero_vs_all", "p_single", "p_pilot"):
            want = rows_of(case)
            any_row = next(iter(want.values()))
            r = self.put_counts(any_row["successes"], any_row["attempts"])
            for method in ("newcombe", "miettinen_nurminen", "agresti_caffo", "wald"):
                word = method.replace("_", "-")
                self.formula("D1", '=RATES.DIFF.LOW(%s;1;2;;"%s")' % (r, word))
                self.formula("D2", '=RATES.DIFF.HIGH(%s;1;2;0.95;"%s")' % (r, word))
                tol = 1e-9 if method == "miettinen_nurminen" else 1e-10
                for address, end in (("D1", "low"), ("D2", "high")):
                    row = want["diff_%s_%s" % (method, end)]
                    self.assertAlmostEqual(self.value_of(address), row["value"], delta=tol,
                                           msg="%s %s (%s)" % (case, row["quantity"], row["source"]))

    def test_default_is_miettinen_nurminen_over_every_pair(self):
        r = self.put_counts([45, 171, 12, 30], [50, 190, 12, 40])
        self.formula("D1", "=RATES.DIFF.LOW(%s;1;2)" % r)
        self.formula("D2", '=RATES.DIFF.LOW(%s;1;2;0.95;"miettinen-nurminen";"bonferroni";"all";"two")' % r)
        self.formula("D3", '=RATES.DIFF.LOW(%s;1;2;;;"none")' % r)
        self.formula("D4", '=RATES.DIFF.LOW(%s;1;2;;;"bonferroni";"against")' % r)
        self.assertEqual(self.value_of("D1"), self.value_of("D2"))
        # Common practice, no source: joint intervals over 6 pairs are wider
        # than over the 3 comparisons against one group, wider than one alone.
        self.assertLess(self.value_of("D1"), self.value_of("D4"))
        self.assertLess(self.value_of("D4"), self.value_of("D3"))

    def test_one_sided_bounds_match_the_reference(self):
        # diffsided_*: the ends of the 90 % interval, one-sided 95 % bounds
        # (mn_interval of pairs.py; statsmodels for Newcombe).
        for case in ("p_mid", "p_pilot", "p_zero_vs_all"):
            want = rows_of(case)
            any_row = next(iter(want.values()))
            r = self.put_counts(any_row["successes"], any_row["attempts"])
            for method in ("newcombe", "miettinen_nurminen"):
                word = method.replace("_", "-")
                self.formula("D1", '=RATES.DIFF.LOW(%s;1;2;0.95;"%s";"none";;"one")' % (r, word))
                self.formula("D2", '=RATES.DIFF.HIGH(%s;1;2;0.95;"%s";;;"one")' % (r, word))
                for address, end in (("D1", "low"), ("D2", "high")):
                    row = want["diffsided_%s_%s" % (method, end)]
                    self.assertAlmostEqual(self.value_of(address), row["value"], delta=1e-9,
                                           msg="%s %s (%s)" % (case, row["quantity"], row["source"]))


class PairTests(SheetCase):
    def test_single_pairs_match_scipy(self):
        for case in ("p_mid", "p_unequal", "p_million"):
            want = rows_of(case)
            any_row = next(iter(want.values()))
            r = self.put_counts(any_row["successes"], any_row["attempts"])
            self.formula("D1", "=RATES.PAIR.P(%s;1;2)" % r)
            self.formula("D2", '=RATES.PAIR.P(%s;1;2;;"exact")' % r)
            for address, q, tol in (("D1", "pair_score_p", 1e-10), ("D2", "pair_exact_p", 1e-9)):
                self.assertLessEqual(abs(self.value_of(address) - want[q]["value"]), tol * want[q]["value"] + 1e-300,
                                     "%s %s (%s)" % (case, q, want[q]["source"]))

    def test_family_adjustment_matches_statsmodels(self):
        want = rows_of("f_five_lines")
        any_row = next(iter(want.values()))
        r = self.put_counts(any_row["successes"], any_row["attempts"])
        cases = [("D1", '=RATES.PAIR.P(%s;2;4;"holm")' % r, "family_score_holm_all_2_4"),
                 ("D2", '=RATES.PAIR.P(%s;3;5;"benjamini-hochberg")' % r,
                  "family_score_benjamini-hochberg_all_3_5"),
                 ("D3", '=RATES.PAIR.P(%s;4;1;"hochberg";;"against")' % r, "family_score_hochberg_against1_1_4"),
                 ("D4", '=RATES.PAIR.P(%s;1;5;"bonferroni";"exact")' % r, "family_exact_bonferroni_all_1_5")]
        for address, text, q in cases:
            self.formula(address, text)
            self.assertLessEqual(abs(self.value_of(address) - want[q]["value"]), 1e-10 * want[q]["value"],
                                 "%s (%s)" % (q, want[q]["source"]))


class PairsTable(SheetCase):
    def test_table_with_labels_matches_single_cells_bit_for_bit(self):
        want = rows_of("f_five_lines")
        any_row = next(iter(want.values()))
        x, n = any_row["successes"], any_row["attempts"]
        # Five lines in rows 1-5 and two spare rows: 7 rows, 21 pairs of rows.
        r = self.put_counts(x + [None, None], n + [None, None])
        for k, name in enumerate(["Line 1", "Line 2", "Line 3", "Line 4", "Line 5"]):
            self.sheet.getCellRangeByName("C%d" % (k + 1)).setString(name)
        self.sheet.getCellRangeByName("E1:L22").setArrayFormula('RATES.PAIRS(%s;;;"holm";;C1:C7)' % r)
        self.doc.calculateAll()
        cell = lambda c, k: self.sheet.getCellRangeByName("%s%d" % (c, k))
        self.assertEqual(cell("E", 1).getString(), "group i (10 pairs, 11 rows)")
        self.assertEqual(cell("H", 1).getString(), "confidence low (95 % each)")
        self.assertEqual(cell("K", 1).getString(), "p adjusted (holm)")
        self.assertEqual(cell("L", 1).getString(), "verdict (holm p below 0.05, interval clear of 0)")
        pairs = [(a, b) for a in range(1, 6) for b in range(a + 1, 6)]
        for k, (a, b) in enumerate(pairs):
            row = k + 2
            self.assertEqual(cell("E", row).getString(), "Line %d" % a)
            self.assertEqual(cell("F", row).getString(), "Line %d" % b)
            self.formula("M1", "=RATES.DIFF(%s;%d;%d)" % (r, a, b))
            self.formula("M2", '=RATES.DIFF.LOW(%s;%d;%d;;;"none")' % (r, a, b))
            self.formula("M3", '=RATES.DIFF.HIGH(%s;%d;%d;;;"none")' % (r, a, b))
            self.formula("M4", '=RATES.PAIR.P(%s;%d;%d;"none")' % (r, a, b))
            self.formula("M5", '=RATES.PAIR.P(%s;%d;%d;"holm")' % (r, a, b))
            self.doc.calculateAll()
            for col, address in zip("GHIJK", ("M1", "M2", "M3", "M4", "M5")):
                self.assertEqual(cell(col, row).getValue(), self.value_of(address), "%s%d" % (col, row))
            # statsmodels multipletests(holm) over scipy's p-values.
            q = "family_score_holm_all_%d_%d" % (a, b)
            self.assertLessEqual(abs(cell("K", row).getValue() - want[q]["value"]), 1e-10 * want[q]["value"],
                                 want[q]["source"])
            verdict = cell("L", row).getString()
            called = cell("K", row).getValue() < 0.05 and (cell("H", row).getValue() > 0 or cell("I", row).getValue() < 0)
            self.assertEqual(verdict != "no clear difference", called, verdict)
        # Surplus rows of the selection are blank, not #N/A.
        for k in range(12, 23):
            self.assertEqual(cell("E", k).getError(), 0)
            self.assertEqual(cell("E", k).getString(), "")

    def test_defaults_agree_with_the_single_cells_and_say_so(self):
        # Five invented supplier lots counted as defects (goal "low").
        x, n = [3, 4, 41, 2, 5], [500, 520, 480, 510, 495]
        r = self.put_counts(x, n)
        for k, name in enumerate(["Lot A", "Lot B", "Lot C", "Lot D", "Lot E"]):
            self.sheet.getCellRangeByName("C%d" % (k + 1)).setString(name)
        self.sheet.getCellRangeByName("E1:L11").setArrayFormula('RATES.PAIRS(%s;;;;"low";C1:C5)' % r)
        self.doc.calculateAll()
        cell = lambda c, k: self.sheet.getCellRangeByName("%s%d" % (c, k))
        self.assertEqual(cell("H", 1).getString(), "confidence low (95 % jointly, Bonferroni)")
        self.assertEqual(cell("K", 1).getString(), "p adjusted (bonferroni)")
        self.assertEqual(cell("L", 1).getString(), "verdict (all pairs together, 95 %)")
        table = [[cell(c, k).getString() if c in "EFL" or k == 1 else cell(c, k).getValue() for c in "EFGHIJKL"]
                 for k in range(1, 12)]
        print("\nRATES.PAIRS, five supplier lots, goal low:")
        for line in table:
            print("  " + " | ".join(v if isinstance(v, str) else "%.4g" % v for v in line))
        pairs = [(a, b) for a in range(1, 6) for b in range(a + 1, 6)]
        for k, (a, b) in enumerate(pairs):
            row = k + 2
            self.formula("M1", "=RATES.DIFF.LOW(%s;%d;%d)" % (r, a, b))
            self.formula("M2", "=RATES.DIFF.HIGH(%s;%d;%d)" % (r, a, b))
            self.formula("M3", "=RATES.PAIR.P(%s;%d;%d)" % (r, a, b))
            self.doc.calculateAll()
            self.assertEqual(cell("H", row).getValue(), self.value_of("M1"))
            self.assertEqual(cell("I", row).getValue(), self.value_of("M2"))
            self.assertEqual(cell("K", row).getValue(), self.value_of("M3"))
            # With the defaults an interval clear of 0 and a small adjusted p go together.
            clear = self.value_of("M1") > 0 or self.value_of("M2") < 0
            self.assertEqual(clear, self.value_of("M3") < 0.05, (a, b))
            expected = "no clear difference"
            if clear:
                fewer = a if cell("G", row).getValue() < 0 else b
                expected = "Lot %s fewer defects" % "ABCDE"[fewer - 1]
            self.assertEqual(cell("L", row).getString(), expected, (a, b))
        self.assertEqual(cell("L", 3).getString(), "Lot A fewer defects")  # A against C

    def test_problems_show_in_the_first_cell(self):
        r = self.put_counts([4, 9], [10, 8])
        self.sheet.getCellRangeByName("E1:L2").setArrayFormula("RATES.PAIRS(%s)" % r)
        self.doc.calculateAll()
        self.assertIn("problem: Position 2 of the range: successes (9) exceed attempts (8)",
                      self.sheet.getCellRangeByName("E1").getString())
        for word in ('"tukey"', '"bh"'):  # "bh" is retired: the full name only
            self.sheet.getCellRangeByName("E1:L2").setArrayFormula('RATES.PAIRS(%s;;;%s)' % (r, word))
            self.doc.calculateAll()
            self.assertIn('"benjamini-hochberg"', self.sheet.getCellRangeByName("E1").getString())
        self.sheet.getCellRangeByName("E1:L2").setArrayFormula('RATES.PAIRS(%s;;;;"lower")' % r)
        self.doc.calculateAll()
        self.assertIn('"high"', self.sheet.getCellRangeByName("E1").getString())


class Margins(SheetCase):
    def test_every_claim_matches_the_reference(self):
        # margin_*: Farrington & Manning (1990) in 50-digit mpmath (pairs.py).
        rows = [r for r in harness.reference_rows() if r["quantity"].startswith("margin_")]
        self.assertEqual(len(rows), 14)
        for row in rows:
            _, claim, goal, margin = row["quantity"].split("_")
            r = self.put_counts(row["successes"], row["attempts"])
            self.formula("D1", '=RATES.MARGIN.P(%s;1;2;%s;"%s";"%s")' % (r, margin, claim, goal))
            self.assertAlmostEqual(self.value_of("D1"), row["value"], delta=1e-10 * row["value"] + 1e-13,
                                   msg="%s %s (%s)" % (row["case"], row["quantity"], row["source"]))

    def test_defaults_and_refusals(self):
        r = self.put_counts([482, 1431], [500, 1500])
        self.formula("D1", "=RATES.MARGIN.P(%s;1;2;0.01)" % r)
        self.formula("D2", '=RATES.MARGIN.P(%s;1;2;0.01;"not-worse";"high")' % r)
        self.assertEqual(self.value_of("D1"), self.value_of("D2"))
        for text in ("=RATES.MARGIN.P(%s;1;2;-0.01)" % r, '=RATES.MARGIN.P(%s;1;2;0;"equivalent")' % r,
                     '=RATES.MARGIN.P(%s;1;2;0.01;"similar")' % r, "=RATES.MARGIN.P(%s;1;1;0.01)" % r,
                     '=RATES.MARGIN.P(%s;1;2;0.01;;"lower")' % r):
            self.formula("D3", text)
            self.assertEqual(self.shown("D3"), "Err:502", text)


class OneRate(SheetCase):
    def test_every_method_matches_statsmodels(self):
        for case in ("one_zero", "one_all", "one_mid", "one_rare"):
            want = rows_of(case)
            any_row = next(iter(want.values()))
            r = self.put_counts(any_row["successes"], any_row["attempts"])
            for method in ("wilson", "clopper_pearson", "jeffreys", "agresti_coull"):
                self.formula("D1", '=RATES.ONE.LOW(%s;1;;"%s")' % (r, method.replace("_", "-")))
                self.formula("D2", '=RATES.ONE.HIGH(%s;1;0.95;"%s")' % (r, method.replace("_", "-")))
                for address, end in (("D1", "low"), ("D2", "high")):
                    row = want["one_%s_%s" % (method, end)]
                    self.assertAlmostEqual(self.value_of(address), row["value"], delta=1e-12 + 1e-10 * row["value"],
                                           msg="%s %s (%s)" % (case, row["quantity"], row["source"]))

    def test_one_sided_bounds_match_scipy_and_statsmodels(self):
        for case in ("one_zero", "one_all", "one_mid"):
            want = rows_of(case)
            any_row = next(iter(want.values()))
            r = self.put_counts(any_row["successes"], any_row["attempts"])
            for method in ("wilson", "clopper_pearson", "jeffreys", "agresti_coull"):
                word = method.replace("_", "-")
                self.formula("D1", '=RATES.ONE.LOW(%s;1;0.95;"%s";"one")' % (r, word))
                self.formula("D2", '=RATES.ONE.HIGH(%s;1;;"%s";"one")' % (r, word))
                for address, end in (("D1", "low"), ("D2", "high")):
                    row = want["sided_%s_%s" % (method, end)]
                    self.assertAlmostEqual(self.value_of(address), row["value"], delta=1e-12 + 1e-10 * row["value"],
                                           msg="%s %s (%s)" % (case, row["quantity"], row["source"]))

    def test_a_demonstration_passes_its_own_check(self):
        # 59 of 59 meets RATES.PLAN.DEMO(0.95; 0.95); the one-sided
        # Clopper-Pearson bound reaches 95 % (0.05^(1/59), the zero-failure
        # formula, common practice), the two-sided one does not.
        r = self.put_counts([59], [59])
        self.formula("D1", "=RATES.PLAN.DEMO(0.95;0.95)")
        self.formula("D2", '=RATES.ONE.LOW(%s;1;0.95;"clopper-pearson";"one")' % r)
        self.formula("D3", '=RATES.ONE.LOW(%s;1;0.95;"clopper-pearson")' % r)
        self.assertEqual(self.value_of("D1"), 59)
        self.assertAlmostEqual(self.value_of("D2"), 0.05 ** (1 / 59), delta=1e-13)
        self.assertGreaterEqual(self.value_of("D2"), 0.95)
        self.assertLess(self.value_of("D3"), 0.95)


class Residuals(SheetCase):
    def test_beside_a_tally_with_blank_rows(self):
        want = rows_of("r_four_ovens")
        any_row = next(iter(want.values()))
        x, n = any_row["successes"], any_row["attempts"]
        # Ovens in rows 1, 2, 4 and 6; rows 3, 5 and 7 blank.
        layout = [0, 1, None, 2, None, 3, None]
        r = self.put_counts([None if g is None else x[g] for g in layout],
                            [None if g is None else n[g] for g in layout])
        self.sheet.getCellRangeByName("D1:D7").setArrayFormula("RATES.SAME.RESID(%s)" % r)
        self.doc.calculateAll()
        for k, g in enumerate(layout):
            cell = self.sheet.getCellRangeByName("D%d" % (k + 1))
            self.assertEqual(cell.getError(), 0)
            if g is None:
                self.assertEqual(cell.getString(), "")
            else:
                row = want["resid_%d" % (g + 1)]
                self.assertAlmostEqual(cell.getValue(), row["value"], delta=1e-10 * abs(row["value"]) + 1e-12,
                                       msg=row["source"])


class Errors(SheetCase):
    def test_err502_and_check_says_why(self):
        r = self.put_counts([4, 0, None, 3], [10, 0, None, 8])
        cases = [("=RATES.DIFF.LOW(%s;1;1)" % r, ";1;1", "both name position 1"),
                 ("=RATES.DIFF.HIGH(%s;1;2)" % r, ";1;2", "names position 2, which has no attempts yet"),
                 ("=RATES.PAIR.P(%s;1;3)" % r, ";1;3", "a blank row"),
                 ("=RATES.ONE.LOW(%s;9)" % r, ";9", "must be a whole position from 1 to 4")]
        for text, positions, words in cases:
            self.formula("F1", text)
            self.formula("F2", "=RATES.CHECK(%s;;%s)" % (r, positions))
            self.assertEqual(self.shown("F1"), "Err:502", text)
            self.assertIn(words, self.shown("F2"), text)
        # Out of range, unknown, and the retired short words ("exact" and
        # "score" as interval methods, "bh").
        for text in ('=RATES.ONE.LOW(%s;1;1.5)' % r, '=RATES.DIFF.LOW(%s;1;4;;"exact")' % r,
                     '=RATES.PAIR.P(%s;1;4;"tukey")' % r, '=RATES.DIFF.LOW(%s;1;4;;;;"some")' % r,
                     '=RATES.ONE.LOW(%s;1;;"exact")' % r, '=RATES.ONE.HIGH(%s;1;;"exact")' % r,
                     '=RATES.DIFF.LOW(%s;1;4;;"score")' % r, '=RATES.DIFF.HIGH(%s;1;4;;"score")' % r,
                     '=RATES.PAIR.P(%s;1;4;"bh")' % r, '=RATES.ONE.LOW(%s;1;0.3;;"one")' % r,
                     '=RATES.ONE.LOW(%s;1;;;"three")' % r, '=RATES.DIFF.LOW(%s;1;4;;;;;"both")' % r):
            self.formula("F1", text)
            self.assertEqual(self.shown("F1"), "Err:502", text)
        self.formula("F3", "=RATES.CHECK(%s;;;1;4)" % r)
        self.assertTrue(self.shown("F3").startswith("ok:"), self.shown("F3"))


if __name__ == "__main__":
    harness.main()
