#!/usr/bin/python3
"""The Bayesian family inside a real LibreOffice with the installed .oxt.

Values are compared with the 50-digit mpmath rows of
tests/reference/bayes.csv (bayes.py); each comparison names its source.
"""
import os

import harness
from harness import SheetCase


def post_rows():
    for row in harness.reference_rows():
        if row["quantity"].startswith("post_"):
            f = row["quantity"].split("|")
            row["what"], row["a"], row["b"], row["rest"] = f[0], f[1], f[2], f[3:]
            yield row


FORMULA = {
    "post_mean": "=RATES.POST.MEAN({r};1;{a};{b})",
    "post_central_low": '=RATES.POST.LOW({r};1;0.95;"central";{a};{b})',
    "post_central_high": "=RATES.POST.HIGH({r};1;;;{a};{b})",
    "post_hpd_low": '=RATES.POST.LOW({r};1;;"hpd";{a};{b})',
    "post_hpd_high": '=RATES.POST.HIGH({r};1;0.95;"HPD";{a};{b})',
    "post_above": '=RATES.POST.ABOVE({r};1;{rest[0]};"high";{a};{b})',
    "post_next": "=RATES.POST.NEXT({r};1;{rest[0]};{rest[1]};{a};{b})",
    "post_onesided_low": '=RATES.POST.LOW({r};1;0.95;"one-sided";{a};{b})',
    "post_onesided_high": '=RATES.POST.HIGH({r};1;;"one-sided";{a};{b})',
}


COMPARE = {
    "post_ahead": "=RATES.POST.AHEAD({r};{rest[0]};{rest[1]};;{a};{b})",
    "post_aheadlow": '=RATES.POST.AHEAD({r};{rest[0]};{rest[1]};"low";{a};{b})',
    "post_best": "=RATES.POST.BEST({r};{rest[0]};;{a};{b})",
    "post_loss": '=RATES.POST.LOSS({r};{rest[0]};"high";{a};{b})',
    "post_same": "=RATES.POST.SAME({r};{rest[0]};{a};{b})",
    "post_diff_low": "=RATES.POST.DIFF.LOW({r};{rest[0]};{rest[1]};;{a};{b})",
    "post_diff_high": "=RATES.POST.DIFF.HIGH({r};{rest[0]};{rest[1]};0.95;{a};{b})",
}


class Posterior(SheetCase):
    def check_rows(self, formulas, relative):
        """Every reference row whose quantity has a formula here, through a cell."""
        checked = 0
        for row in post_rows():
            if row["what"] not in formulas:
                continue
            r = self.put_counts(row["successes"], row["attempts"])
            self.formula("H1", formulas[row["what"]].format(r=r, a=row["a"], b=row["b"], rest=row["rest"]))
            want = row["value"]
            tol = max(relative * abs(want), 1e-300) if abs(want) < 1e-3 else 1e-10
            self.assertLessEqual(abs(self.value_of("H1") - want), tol,
                                 "%s %s (%s)" % (row["case"], row["quantity"], row["source"]))
            checked += 1
            self.sheet.getCellRangeByName("A1:B40").clearContents(1 | 4 | 16)
        return checked

    def test_every_reference_row(self):
        self.assertEqual(self.check_rows(FORMULA, 1e-8), 54 + 14)

    def test_comparisons_of_groups(self):
        self.assertEqual(self.check_rows(COMPARE, 1e-7), 68 + 6)

    def test_order_array_beside_a_tally_with_a_blank_row(self):
        # Four ovens with a blank row between: the array is 4 x 4 over the filled rows.
        r = self.put_counts([286, 271, None, 233, 14], [300, 290, None, 260, 14])
        self.sheet.getCellRangeByName("D1:G4").setArrayFormula("RATES.POST.ORDER(%s)" % r)
        self.formula("I1", "=RATES.POST.AHEAD(%s;1;2)" % r)
        self.formula("I2", "=RATES.POST.AHEAD(%s;5;4)" % r)
        self.doc.calculateAll()
        cell = lambda a: self.sheet.getCellRangeByName(a)
        self.assertEqual(cell("D1").getString(), "")  # the diagonal
        self.assertEqual(cell("E1").getValue(), self.value_of("I1"))
        self.assertEqual(cell("F4").getValue(), self.value_of("I2"))
        # c_ovens, post_ahead 1 over 2: Cook (2005)'s sum in 50-digit mpmath (bayes.csv).
        self.assertAlmostEqual(cell("E1").getValue(), 0.8376146424373224, delta=1e-10)
        # Goal "low" (defect counts): row better than column means a lower
        # rate, the transpose.
        self.sheet.getCellRangeByName("D6:G9").setArrayFormula('RATES.POST.ORDER(%s;"low")' % r)
        self.doc.calculateAll()
        self.assertEqual(cell("E6").getValue(), cell("D2").getValue())
        self.assertEqual(cell("F9").getValue(), cell("G3").getValue())
        self.assertAlmostEqual(cell("E1").getValue() + cell("D2").getValue(), 1.0, delta=1e-12)

    def test_table_and_curves_beside_a_tally(self):
        # Three ovens and a spare row; the table names them from the labels.
        r = self.put_counts([286, 271, 233, None], [300, 290, 260, None])
        for k, name in enumerate(["Oven A", "Oven B", "Oven C"]):
            self.sheet.getCellRangeByName("C%d" % (k + 1)).setString(name)
        self.sheet.getCellRangeByName("E1:J4").setArrayFormula("RATES.POST.TABLE(%s;0.9;;;;C1:C4)" % r)
        self.doc.calculateAll()
        cell = lambda a: self.sheet.getCellRangeByName(a)
        self.assertEqual([cell(c + "1").getString() for c in "EFGHIJ"],
                         ["group", "expected rate", "credible low (90 %)", "credible high (90 %)", "P(best)", "expected loss"])
        self.assertEqual(cell("E3").getString(), "Oven B")
        for col, text in (("F", "=RATES.POST.MEAN(%s;2)"), ("G", '=RATES.POST.LOW(%s;2;0.9)'),
                          ("H", "=RATES.POST.HIGH(%s;2;0.9)"), ("I", "=RATES.POST.BEST(%s;2)"),
                          ("J", "=RATES.POST.LOSS(%s;2)")):
            self.formula("L1", text % r)
            self.assertEqual(cell(col + "3").getValue(), self.value_of("L1"), col)
        # The curves: a header row, 11 rates from 0 to 1, a density column per oven.
        self.sheet.getCellRangeByName("N1:Q12").setArrayFormula("RATES.POST.CURVE(%s;11)" % r)
        self.doc.calculateAll()
        self.assertEqual(cell("O1").getString(), "position 1")
        self.assertAlmostEqual(cell("N11").getValue(), 0.9, places=15)
        # Beta(287, 15) density at 0.9 (50-digit mpmath would agree; here the
        # definition through scipy-free arithmetic: lgamma).
        import math
        want = math.exp(286 * math.log(0.9) + 14 * math.log(0.1) - (math.lgamma(287) + math.lgamma(15) - math.lgamma(302)))
        self.assertAlmostEqual(cell("O11").getValue() / want, 1.0, places=9)
        # Span "likely": the rates from the lowest oven's 0.01 % quantile to the
        # highest's 99.99 %, out to whole percents. scipy 1.10.1 beta.ppf(1e-4)
        # of oven C (234, 28) is 0.81004, beta.isf(1e-4) of oven A (287, 15)
        # 0.98438: 81 % to 99 %.
        self.sheet.getCellRangeByName("S1:V12").setArrayFormula('RATES.POST.CURVE(%s;11;;;;"likely")' % r)
        self.doc.calculateAll()
        self.assertAlmostEqual(cell("S2").getValue(), 0.81, places=15)
        self.assertEqual(cell("S12").getValue(), 0.99)
        self.assertEqual(cell("T1").getString(), "position 1")

    def test_tables_of_30_and_200_groups_of_mixed_sizes(self):
        # RATES.POST.TABLE of the reference tallies of tests/reference/across.py
        # (30 and 200 groups of 5 to 10^6 attempts; 50-digit mpmath), each
        # prior and goal: its P(best) and loss columns against the reference
        # rows, and a column of POST.BEST cells beside it showing the table's
        # values (one pass for both, through the component's cache).
        import csv
        checked = 0
        for name in ("across.csv", "across_large.csv"):
            with open(os.path.join(harness.HERE, "..", "reference", name)) as f:
                rows = list(csv.DictReader(f))
            for case in sorted({(r["case"], r["quantity"].split("|")[1], r["quantity"].split("|")[2]) for r in rows}):
                chosen = [r for r in rows if (r["case"], r["quantity"].split("|")[1], r["quantity"].split("|")[2]) == case]
                x = [int(v) for v in chosen[0]["successes"].split()]
                n = [int(v) for v in chosen[0]["attempts"].split()]
                G = len(x)
                self.sheet.getCellRangeByName("A1:K%d" % (G + 1)).clearContents(1 | 2 | 4 | 16)
                r = self.put_counts(x, n)
                prior, goal = case[1], case[2]
                self.sheet.getCellRangeByName("D1:I%d" % (G + 1)).setArrayFormula(
                    'RATES.POST.TABLE(%s;0.95;"%s";%s;%s)' % (r, goal, prior, prior))
                self.sheet.getCellRangeByName("K1:K%d" % G).setFormulaArray(tuple(
                    ('=RATES.POST.BEST(%s;ROW();"%s";%s;%s)' % (r, goal, prior, prior),) for _ in range(G)))
                self.doc.calculateAll()
                for row in chosen:
                    i = int(row["quantity"].split("|")[3])
                    column = "H" if row["quantity"].startswith("best") else "I"
                    got = self.sheet.getCellRangeByName("%s%d" % (column, i + 1)).getValue()
                    want = float(row["value"])
                    tol = max(1e-8 * abs(want), 1e-300) if abs(want) < 1e-3 else 1e-10
                    self.assertLessEqual(abs(got - want), tol, "%s %s (%s)" % (row["case"], row["quantity"], row["source"]))
                    if column == "H":
                        self.assertEqual(self.sheet.getCellRangeByName("K%d" % i).getValue(), got)
                    checked += 1
        self.assertGreaterEqual(checked, 2 * 2 * 2 * 2 * 3)

    def test_defaults_goal_low_and_a_group_without_attempts(self):
        r = self.put_counts([14, 0, None], [14, 0, None])
        self.formula("D1", "=RATES.POST.MEAN(%s;1)" % r)
        self.assertAlmostEqual(self.value_of("D1"), 15 / 16, places=15)  # (x + 1) / (n + 2), the flat prior
        self.formula("D2", "=RATES.POST.MEAN(%s;2;2;3)" % r)
        self.assertAlmostEqual(self.value_of("D2"), 2 / 5, places=15)  # no attempts: the prior's mean
        self.formula("D3", '=RATES.POST.ABOVE(%s;1;0.9;"low")+RATES.POST.ABOVE(%s;1;0.9)' % (r, r))
        self.assertAlmostEqual(self.value_of("D3"), 1.0, places=14)
        self.formula("D4", "=RATES.POST.NEXT(%s;1;20)" % r)  # k defaults to m
        self.formula("D5", "=RATES.POST.NEXT(%s;1;20;20)" % r)
        self.assertEqual(self.value_of("D4"), self.value_of("D5"))

    def test_bad_arguments_give_err502(self):
        r = self.put_counts([14, None], [14, None])
        for text in ("=RATES.POST.MEAN(%s;1;0)" % r, "=RATES.POST.MEAN(%s;2)" % r,
                     '=RATES.POST.LOW(%s;1;1.2)' % r, '=RATES.POST.LOW(%s;1;;"widest")' % r,
                     "=RATES.POST.ABOVE(%s;1;1.5)" % r, '=RATES.POST.ABOVE(%s;1;0.9;"up")' % r,
                     "=RATES.POST.NEXT(%s;1;5;6)" % r, "=RATES.POST.NEXT(%s;1;2.5)" % r,
                     "=RATES.POST.DIFF.LOW(%s;1;1)" % r):
            self.formula("D1", text)
            self.assertEqual(self.shown("D1"), "Err:502", text)
        # No cap below the count cap any more: 14 of 14 with the flat
        # prior is Beta(15, 1), and P(the next m all pass) = B(15 + m, 1) / B(15, 1)
        # = 15 / (15 + m) (beta-binomial closed form, Gelman et al. 2013, 2.4).
        self.formula("D2", "=RATES.POST.NEXT(%s;1;1E+9)" % r)
        self.assertAlmostEqual(self.value_of("D2") / (15 / (15 + 1e9)), 1.0, places=9)
        self.formula("D3", "=RATES.POST.NEXT(%s;1;1E+16)" % r)  # beyond the count cap of 1e15
        self.assertEqual(self.shown("D3"), "Err:523")


if __name__ == "__main__":
    harness.main()
