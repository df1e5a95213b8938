#!/usr/bin/python3
"""Hostile cells against the apart family (RATES.APART.LOW / .HIGH,
RATES.APART, RATES.APART.CURVE, RATES.PRIOR.FIT) and the margin and
one-sided bounds of the pairs family, inside a real LibreOffice: every case
states the cell it expects (a value in range, Err:502 or Err:523) and, for
Err:502 from the counts, the RATES.CHECK sentence; after the whole matrix
the same LibreOffice process is alive and answers a normal formula, and the
slowest case is printed and bounded (2 s).

Expected sentences are the engine's own rules (counts.hpp, arguments.hpp),
common practice, no source.
"""
import time

import harness
from harness import SheetCase

OK = "value"
FINE = [286, 271, 233, 14], [300, 290, 260, 14]

# (what, successes, attempts, formula with {r}, expected cell, RATES.CHECK words or None)
CASES = [
    ("text in a count", [286, "many", 233], [300, 290, 260], "=RATES.APART.LOW({r};1)", "Err:502", "holds text, not a count"),
    ("TRUE in a count", [286, True, 233], [300, 290, 260], "=RATES.APART.HIGH({r};1)", "Err:502", "holds a logical value (TRUE/FALSE)"),
    ("an error value in a count", [286, "#DIV", 233], [300, 290, 260], "=RATES.APART.LOW({r};1)", "Err:502",
     "shows an error value"),
    ("half-filled row", [286, 271, 233], [300, None, 260], "=RATES.APART.LOW({r};1)", "Err:502", "attempts is blank but successes is filled"),
    ("negative count", [286, -1, 233], [300, 290, 260], "=RATES.APART.LOW({r};1)", "Err:502", "successes is negative (-1)"),
    ("fractional count", [286, 2.5, 233], [300, 290, 260], "=RATES.APART.LOW({r};1)", "Err:502", "not a whole number (2.5)"),
    ("successes above attempts", [286, 291, 233], [300, 290, 260], "=RATES.APART.LOW({r};1)", "Err:502",
     "successes (291) exceed attempts (290)"),
    ("1e300 attempts", [286, 271, 233], [300, 1e300, 260], "=RATES.APART.LOW({r};1)", "Err:502",
     "above the largest count accepted (1e15)"),
    ("three groups of 1e13: too many values to store", [5e12, 4e12, 4.5e12], [1e13, 1e13, 1e13],
     "=RATES.APART.LOW({r};1)", "Err:523", None),
    ("three groups of 1e13, normal", [5e12, 4e12, 4.5e12], [1e13, 1e13, 1e13],
     '=RATES.APART.LOW({r};1;;;;"normal")', OK, None),
    ("a group of 1e13 beside one of 300 (its count follows the other's)", [286, 5e12], [300, 1e13],
     "=RATES.APART.LOW({r};1)", OK, None),
    ("attempts adding up past 1e15", [286, 271], [300, 1e15], "=RATES.APART.LOW({r};1)", "Err:502",
     "largest total accepted"),
    ("one group, no target", [286], [300], "=RATES.APART.LOW({r};1)", "Err:502", None),
    ("one group, a target", [286], [300], "=RATES.APART.LOW({r};1;;;0.95)", OK, None),
    ("all groups without attempts", [0, 0], [0, 0], "=RATES.APART.LOW({r};1)", "Err:502", "no attempts"),
    ("every unit passed", [300, 290], [300, 290], "=RATES.APART.LOW({r};1)", "Err:502", None),
    ("every unit passed, a target", [300, 290], [300, 290], "=RATES.APART.LOW({r};1;;;0.95)", OK, None),
    ("no unit passed", [0, 0], [300, 290], "=RATES.APART.HIGH({r};2)", "Err:502", None),
    ("position 0", *FINE, "=RATES.APART.LOW({r};0)", "Err:502", None),
    ("position outside", *FINE, "=RATES.APART.LOW({r};9)", "Err:502", None),
    ("position fractional", *FINE, "=RATES.APART.LOW({r};1.5)", "Err:502", None),
    ("position on a blank row", [286, None, 233], [300, None, 260], "=RATES.APART.LOW({r};2)", "Err:502", None),
    ("group without attempts", [286, 0, 233], [300, 0, 260], "=RATES.APART.LOW({r};2)", "Err:502", None),
    ("level 0", *FINE, "=RATES.APART.LOW({r};1;0)", "Err:502", None),
    ("level 1", *FINE, "=RATES.APART.LOW({r};1;1)", "Err:502", None),
    ("level 1.5", *FINE, "=RATES.APART.LOW({r};1;1.5)", "Err:502", None),
    ("level as text", *FINE, '=RATES.APART.LOW({r};1;"high")', "Err:502", None),
    ("level 1 - 1e-12", *FINE, "=RATES.APART.LOW({r};1;0.999999999999)", OK, None),
    ("target -0.1", *FINE, "=RATES.APART.LOW({r};1;;;-0.1)", "Err:502", None),
    ("target 1.5", *FINE, "=RATES.APART.LOW({r};1;;;1.5)", "Err:502", None),
    ("target 0", *FINE, "=RATES.APART.LOW({r};1;;;0)", OK, None),
    ("target 1", *FINE, "=RATES.APART.HIGH({r};1;;;1)", OK, None),
    ("unknown family", *FINE, '=RATES.APART.LOW({r};1;;"some")', "Err:502", None),
    ("unknown method", *FINE, '=RATES.APART.LOW({r};1;;;;"poisson")', "Err:502", None),
    ("unknown spread", *FINE, '=RATES.APART.LOW({r};1;;;;"normal";"season")', "Err:502", None),
    ("exact with time", *FINE, '=RATES.APART.LOW({r};1;;;;"exact";"time")', "Err:502", None),
    ("curve of 1 size", *FINE, "=RATES.APART.CURVE({r};;;1)", "Err:502", None),
    ("curve of 1e6 sizes", *FINE, "=RATES.APART.CURVE({r};;;1000000)", "Err:523", None),
    ("prior fit, part c", *FINE, '=RATES.PRIOR.FIT({r};"c")', "Err:502", None),
    ("prior fit, no part", *FINE, "=RATES.PRIOR.FIT({r};)", "Err:502", None),
    ("prior fit, one group", [286], [300], '=RATES.PRIOR.FIT({r};"a")', "Err:502", None),
    ("prior fit, all passed", [300, 290], [300, 290], '=RATES.PRIOR.FIT({r};"a")', OK, None),
    ("prior fit, single units", [1, 0, 1], [1, 1, 1], '=RATES.PRIOR.FIT({r};"b")', OK, None),
    ("margin -0.01", *FINE, "=RATES.MARGIN.P({r};1;2;-0.01)", "Err:502", None),
    ("margin 1", *FINE, "=RATES.MARGIN.P({r};1;2;1)", "Err:502", None),
    ("margin 0 for equivalence", *FINE, '=RATES.MARGIN.P({r};1;2;0;"equivalent")', "Err:502", None),
    ("margin, i = j", *FINE, "=RATES.MARGIN.P({r};2;2;0.01)", "Err:502", None),
    ("margin, unknown claim", *FINE, '=RATES.MARGIN.P({r};1;2;0.01;"same")', "Err:502", None),
    ("margin, 1e15 units in all", [5e14, 6e14], [1e15 - 1, 1e15 - 1], "=RATES.MARGIN.P({r};1;2;0.01)", "Err:502",
     "largest total accepted"),
    ("margin, 4e14 units each", [2e14, 3e14], [4e14, 4e14], "=RATES.MARGIN.P({r};1;2;0.01)", OK, None),
    ("one-sided at 0.3", *FINE, '=RATES.ONE.LOW({r};1;0.3;;"one")', "Err:502", None),
    ("retired word exact", *FINE, '=RATES.ONE.LOW({r};1;;"exact")', "Err:502", None),
    ("retired word score", *FINE, '=RATES.DIFF.LOW({r};1;2;;"score")', "Err:502", None),
    ("retired word bh", *FINE, '=RATES.PAIR.P({r};1;2;"bh")', "Err:502", None),
    ("sides as a number", *FINE, "=RATES.DIFF.HIGH({r};1;2;;;;;1)", "Err:502", None),
]


class HostileApart(SheetCase):
    def put(self, values, column, rows):
        for k in range(rows):
            cell = self.sheet.getCellRangeByName("%s%d" % (column, k + 1))
            v = values[k] if k < len(values) else None
            if v is None:
                cell.setString("")
            elif v is True or v is False:
                cell.setFormula("=TRUE()" if v else "=FALSE()")
            elif v == "#DIV":
                cell.setFormula("=1/0")
            elif isinstance(v, str):
                cell.setString(v)
            else:
                cell.setValue(float(v))

    def test_matrix(self):
        self.assertGreaterEqual(len(CASES), 40)
        slowest = (0.0, "")
        for what, x, n, text, expected, words in CASES:
            # Values, text, formulas and the formats they left (=TRUE() leaves
            # a logical format, under which 0 and 1 read as FALSE and TRUE).
            self.sheet.getCellRangeByName("A1:B4").clearContents(1 | 2 | 4 | 16 | 32 | 64)
            rows = max(len(x), len(n))
            self.put(x, "A", 4)
            self.put(n, "B", 4)
            r = "A1:A%d;B1:B%d" % (rows, rows)
            self.formula("D1", text.format(r=r))
            start = time.monotonic()
            shown = self.shown("D1")
            seconds = time.monotonic() - start
            slowest = max(slowest, (seconds, what))
            if expected == OK:
                self.assertFalse(shown.startswith("Err:") or shown.startswith("#"), "%s: %s" % (what, shown))
            else:
                self.assertEqual(shown, expected, what)
            if words:
                self.formula("D2", "=RATES.CHECK(%s)" % r)
                self.assertIn(words, self.shown("D2"), what)
        print("\nhostile apart and claims: %d cases, slowest %.3f s (%s)" % (len(CASES), slowest[0], slowest[1]))
        self.assertLess(slowest[0], 2.0, slowest[1])
        # The same process is alive and answers a normal formula.
        self.assertTrue(harness.OFFICE.alive())
        r = self.put_counts(*FINE)
        self.formula("D3", "=RATES.APART.LOW(%s;3)" % r)
        self.assertEqual(self.value_of("D3"), 0.9)


if __name__ == "__main__":
    harness.main()
