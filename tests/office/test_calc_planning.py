#!/usr/bin/python3
"""The planning family inside a real LibreOffice with the installed .oxt.

Every plan_* row of tests/reference/planning.csv (planning.py: success-run
formula and Fleiss formulas in 50-digit mpmath, scipy binomial tails and
statsmodels intervals searched over every n, Cook's sum in mpmath) goes
through a cell; each comparison names its source.
"""
import harness
from harness import SheetCase

METHOD_WORD = {"wilson": "wilson", "clopper_pearson": "clopper-pearson", "jeffreys": "jeffreys", "agresti_coull": "agresti-coull"}


def plan_rows():
    for row in harness.reference_rows():
        f = row["quantity"].split("|")
        if f[0].startswith("plan_") and f[0] != "plan_power_pooled":
            row["what"], row["args"] = f[0], f[1:]
            yield row


def formula_of(row, r):
    a = row["args"]
    if row["what"] == "plan_demo":
        return "=RATES.PLAN.DEMO(%s;%s;%s)" % (a[0], a[1], a[2])
    if row["what"] == "plan_more":
        return "=RATES.PLAN.MORE(%s;%s;%s;%s)" % (a[0], a[1], a[2], a[3])
    if row["what"] == "plan_width":
        return '=RATES.PLAN.WIDTH(%s;%s;%s;"%s")' % (a[0], a[1], a[2], METHOD_WORD[a[3]])
    if row["what"] == "plan_power_ratio":
        switch = {"none": "FALSE()", "continuity": '"continuity"'}[a[4]]
        return "=RATES.PLAN.POWER(%s;%s;%s;%s;%s;%s)" % (a[0], a[1], a[2], a[3], switch, a[5])
    if row["what"] == "plan_power":
        # The correction both ways Calc passes it: TRUE/FALSE and the words.
        switch = {"none": "FALSE()", "continuity": '"continuity"'}[a[4]]
        return "=RATES.PLAN.POWER(%s;%s;%s;%s;%s)" % (a[0], a[1], a[2], a[3], switch)
    if row["what"] == "plan_aheadlow":
        return '=RATES.PLAN.AHEAD(%s;1;2;%s;"low";%s;%s)' % (r, a[2], a[0], a[1])
    return "=RATES.PLAN.AHEAD(%s;1;2;%s;;%s;%s)" % (r, a[2], a[0], a[1])


class Planning(SheetCase):
    def test_every_reference_row(self):
        checked = 0
        for row in plan_rows():
            r = self.put_counts(row["successes"], row["attempts"]) if row["what"].startswith("plan_ahead") else ""
            text = formula_of(row, r)
            self.formula("H1", text)
            self.assertEqual(self.value_of("H1"), row["value"],
                             "%s %s (%s)" % (text, row["quantity"], row["source"]))
            checked += 1
        self.assertEqual(checked, 10 + 11 + 36 + 12 + 12 + 7 + 4)

    def test_defaults_and_switches(self):
        # Published: Fleiss, Levin & Paik (2003), 686 per group; 726 with the
        # correction of Fleiss, Tytun & Ury (1980).
        for text, want in (("=RATES.PLAN.POWER(0.1;0.15)", 686), ("=RATES.PLAN.POWER(0.1;0.15;;;TRUE())", 726),
                           ("=RATES.PLAN.POWER(0.1;0.15;0.8;0.05;1)", 726),
                           ('=RATES.PLAN.POWER(0.1;0.15;;;"None")', 686),
                           # Success-run: ln(0.05) / ln(0.99) -> 299 (common practice, no single source).
                           ("=RATES.PLAN.DEMO(0.99;0.95)", 299), ("=RATES.PLAN.DEMO(0.9;0.9;0)", 22)):
            self.formula("D1", text)
            self.assertEqual(self.value_of("D1"), want, text)
        # A cell holding TRUE as the switch.
        self.sheet.getCellRangeByName("E1").setFormula("=TRUE()")
        self.formula("D2", "=RATES.PLAN.POWER(0.1;0.15;;;E1)")
        self.assertEqual(self.value_of("D2"), 726)
        # Wilson is the default method of RATES.PLAN.WIDTH, as of RATES.ONE.LOW.
        # A record that already shows the target needs nothing more, however long.
        self.formula("D5", "=RATES.PLAN.MORE(0.999999999999;0.95;1E15;0)")
        self.assertEqual(self.value_of("D5"), 0)
        self.formula("D3", "=RATES.PLAN.WIDTH(0.9;0.02)")
        self.formula("D4", '=RATES.PLAN.WIDTH(0.9;0.02;0.95;"wilson")')
        self.assertEqual(self.value_of("D3"), self.value_of("D4"))

    def test_pilot_beside_a_tally(self):
        # A perfect pilot of 14 beside an oven at 286 of 300, a blank row between.
        r = self.put_counts([14, None, 286], [14, None, 300])
        self.formula("D1", "=RATES.PLAN.AHEAD(%s;1;3;0.95)" % r)
        self.assertEqual(self.value_of("D1"), 50)  # plan_ahead row 14/14 vs 286/300 (mpmath, planning.csv)
        # After those 50 further successes the pilot is ahead with at least 0.95.
        self.sheet.getCellRangeByName("A1").setValue(64)
        self.sheet.getCellRangeByName("B1").setValue(64)
        self.formula("D2", "=RATES.POST.AHEAD(%s;1;3)" % r)
        self.assertGreaterEqual(self.value_of("D2"), 0.95)
        self.formula("D3", "=RATES.PLAN.AHEAD(%s;1;3;0.95)" % r)
        self.assertEqual(self.value_of("D3"), 0)

    def test_bad_and_unreachable_targets(self):
        r = self.put_counts([14, 286], [14, 300])
        for text in ("=RATES.PLAN.DEMO(1.2;0.95)", "=RATES.PLAN.DEMO(0.99;0.95;1.5)", "=RATES.PLAN.DEMO(0.99;0)",
                     "=RATES.PLAN.WIDTH(0.5;-0.1)", '=RATES.PLAN.WIDTH(0.5;0.05;0.95;"normal")',
                     "=RATES.PLAN.POWER(0.1;0.2;;;2)", '=RATES.PLAN.POWER(0.1;0.2;;;"yes")',
                     "=RATES.PLAN.POWER(0.1;0.2;0.8;1)", "=RATES.PLAN.AHEAD(%s;1;1;0.95)" % r,
                     "=RATES.PLAN.AHEAD(%s;1;2;0.95;;0)" % r, '=RATES.PLAN.AHEAD(%s;1;2;0.95;"lower")' % r,
                     # More failures than units, a fractional or negative record.
                     "=RATES.PLAN.MORE(0.99;0.95;10;11)", "=RATES.PLAN.MORE(0.99;0.95;10.5;0)",
                     "=RATES.PLAN.MORE(0.99;0.95;-1;0)",
                     # Group 2's size as a multiple of group 1's: above 0, at most 1000.
                     "=RATES.PLAN.POWER(0.1;0.15;;;;0)", "=RATES.PLAN.POWER(0.1;0.15;;;;5000)"):
            self.formula("D1", text)
            self.assertEqual(self.shown("D1"), "Err:502", text)
        for text in ("=RATES.PLAN.DEMO(1;0.95)", "=RATES.PLAN.WIDTH(0.5;0)", "=RATES.PLAN.POWER(0.1;0.1)",
                     "=RATES.PLAN.POWER(0.1;0.15;1)", "=RATES.PLAN.AHEAD(%s;1;2;1)" % r,
                     "=RATES.PLAN.DEMO(0.999999999999;0.95)", "=RATES.PLAN.MORE(1;0.95;100;0)",
                     "=RATES.PLAN.MORE(0.999999999999;0.95;100;0)"):
            self.formula("D2", text)
            self.assertEqual(self.shown("D2"), "Err:523", text)


if __name__ == "__main__":
    harness.main()
