#!/usr/bin/python3
"""Hostile cells against every family inside a real LibreOffice: a matrix
per family (omnibus, pairs, Bayesian, planning, and the apart family with the
margin and one-sided bounds of pairs), each case stating the cell it expects
(a value in range, Err:502 or Err:523) and, for Err:502 from the counts, the
RATES.CHECK sentence; after each matrix the same LibreOffice process is alive
and answers a normal formula, and the slowest case is printed and bounded
(2 s).

Expected sentences are the engine's own rules (counts.hpp, arguments.hpp),
common practice, no source.
"""
import time

import harness
from harness import SheetCase

OK = "value"
FINE = [286, 271, 233, 14], [300, 290, 260, 14]

# Problems in the counts, the same for every family: (what, successes,
# attempts, RATES.CHECK words).
COUNT_PROBLEMS = [
    ("text in a count", [286, "many", 233], [300, 290, 260], "holds text, not a count"),
    ("TRUE in a count", [286, True, 233], [300, 290, 260], "holds a logical value (TRUE/FALSE)"),
    ("an error value in a count", [286, "#DIV", 233], [300, 290, 260], "shows an error value"),
    ("half-filled row", [286, 271, 233], [300, None, 260], "attempts is blank but successes is filled"),
    ("negative count", [286, -1, 233], [300, 290, 260], "successes is negative (-1)"),
    ("fractional count", [286, 2.5, 233], [300, 290, 260], "not a whole number (2.5)"),
    ("successes above attempts", [286, 291, 233], [300, 290, 260], "successes (291) exceed attempts (290)"),
    ("1e300 attempts", [286, 271, 233], [300, 1e300, 260], "above the largest count accepted (1e15)"),
    ("attempts adding up past 1e15", [286, 271], [300, 1e15], "largest total accepted"),
    ("negative attempts", [0, 271], [-5, 290], "attempts is negative (-5)"),
    ("text in attempts", [286, 271], [300, "lots"], "holds text, not a count"),
]


def count_cases(formula):
    """The count problems with one family's formula: Err:502 and the sentence."""
    return [(what, x, n, formula, "Err:502", words) for what, x, n, words in COUNT_PROBLEMS]

# (what, successes, attempts, formula with {r}, expected cell, RATES.CHECK words or None)
APART = [
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


OMNIBUS = count_cases("=RATES.SAME.P({r})") + [
    ("one group", [286], [300], "=RATES.SAME.P({r})", "Err:502", "at least two groups with attempts"),
    ("no attempts anywhere", [0, 0], [0, 0], "=RATES.SAME.P({r})", "Err:502", "no attempts"),
    ("every unit passed", [300, 290], [300, 290], "=RATES.SAME.P({r})", OK, None),
    ("no unit passed", [0, 0], [300, 290], '=RATES.SAME.P({r};"exact")', OK, None),
    ("unknown method", *FINE, '=RATES.SAME.P({r};"chisq")', "Err:502", None),
    ("method as a number", *FINE, "=RATES.SAME.P({r};3)", "Err:502", None),
    ("draws of 1e15", *FINE, '=RATES.SAME.P({r};"montecarlo";1E+15)', "Err:523", None),
    ("draws of 0", *FINE, '=RATES.SAME.P({r};"montecarlo";0)', "Err:502", None),
    ("draws fractional", *FINE, '=RATES.SAME.P({r};"montecarlo";1000.5)', "Err:502", None),
    ("draws negative", *FINE, '=RATES.SAME.P({r};"montecarlo";-5)', "Err:502", None),
    ("seed negative", *FINE, '=RATES.SAME.P({r};"montecarlo";1000;-1)', "Err:502", None),
    ("seed of 1e300 (above the largest, 2^53: the cap rule)", *FINE,
     '=RATES.SAME.P({r};"montecarlo";1000;1E+300)', "Err:523", None),
    ("exact on three groups of 1e7", [5e6, 4e6, 4.5e6], [1e7, 1e7, 1e7], '=RATES.SAME.P({r};"exact")', "Err:523",
     None),
    ("auto on three groups of 1e7", [5e6, 4e6, 4.5e6], [1e7, 1e7, 1e7], "=RATES.SAME.P({r})", OK, None),
    ("statistic word unknown", *FINE, '=RATES.SAME.STAT({r};"wald")', "Err:502", None),
    ("trend without scores", *FINE, "=RATES.TREND.P({r})", OK, None),
    ("trend scores of another size", *FINE, "=RATES.TREND.P({r};E10:E11)", "Err:502", None),
    ("trend, unknown variance", *FINE, '=RATES.TREND.P({r};;"sideways")', "Err:502", None),
    ("residuals of one group", [286], [300], "=RATES.SAME.RESID({r})", "Err:502", None),
    ("Tarone, single units", [1, 0, 1], [1, 1, 1], '=RATES.SAME.P({r};"tarone")', "Err:502", None),
    ("Tarone, every unit passed", [300, 290], [300, 290], '=RATES.SAME.P({r};"tarone")', "Err:502", None),
    ("labels of another size", *FINE, "=RATES.CHECK({r};;E1:E2)", OK, None),
    ("report with an unknown method", *FINE, '=RATES.SAME.REPORT({r};"chisq")', OK, None),
    ("2-D blocks", *FINE, "=RATES.SAME.P(A1:B2;A3:B4)", "Err:502", None),
    ("ranges of different shapes", *FINE, "=RATES.SAME.P(A1:A4;B1:B3)", "Err:502", None),
    ("a typed array", *FINE, "=RATES.SAME.P({{1;2}};{{3;4}})", "Err:504", None),
    ("the same column twice", *FINE, "=RATES.SAME.P(A1:A4;A1:A4)", OK, None),
    ("a whole column", *FINE, "=RATES.SAME.P(A:A;B:B)", OK, None),
    ("positions for CHECK outside", *FINE, "=RATES.CHECK({r};;;9;1)", OK, None),
]

PAIRS = count_cases("=RATES.DIFF.LOW({r};1;3)") + [
    ("i = j", *FINE, "=RATES.DIFF({r};2;2)", "Err:502", None),
    ("position 0", *FINE, "=RATES.DIFF.LOW({r};0;1)", "Err:502", None),
    ("position outside", *FINE, "=RATES.PAIR.P({r};1;9)", "Err:502", None),
    ("position fractional", *FINE, "=RATES.DIFF.HIGH({r};1.5;2)", "Err:502", None),
    ("position on a blank row", [286, None, 233], [300, None, 260], "=RATES.DIFF({r};1;2)", "Err:502", None),
    ("group without attempts", [286, 0, 233], [300, 0, 260], "=RATES.PAIR.P({r};1;2)", "Err:502", None),
    ("level 0", *FINE, "=RATES.DIFF.LOW({r};1;2;0)", "Err:502", None),
    ("level 1", *FINE, "=RATES.ONE.LOW({r};1;1)", "Err:502", None),
    ("level 1.5", *FINE, "=RATES.DIFF.HIGH({r};1;2;1.5)", "Err:502", None),
    ("level as text", *FINE, '=RATES.DIFF.LOW({r};1;2;"high")', "Err:502", None),
    ("unknown interval method", *FINE, '=RATES.DIFF.LOW({r};1;2;;"exact")', "Err:502", None),
    ("unknown adjustment", *FINE, '=RATES.PAIR.P({r};1;2;"tukey")', "Err:502", None),
    ("unknown family", *FINE, '=RATES.DIFF.LOW({r};1;2;;;"bonferroni";"some")', "Err:502", None),
    ("unknown test", *FINE, '=RATES.PAIR.P({r};1;2;;"fisher")', "Err:502", None),
    ("exact test of two groups of 1e14", [4e13, 5e13], [1e14, 1e14], '=RATES.PAIR.P({r};1;2;;"exact")', "Err:523",
     None),
    ("score test of two groups of 1e14", [4e13, 5e13], [1e14, 1e14], "=RATES.PAIR.P({r};1;2)", OK, None),
    ("all passed both", [300, 290], [300, 290], "=RATES.PAIR.P({r};1;2)", OK, None),
    ("one rate of 0 of 1", [0, 1], [1, 1], "=RATES.ONE.HIGH({r};1)", OK, None),
    ("pairs table of one group", [286], [300], "=RATES.PAIRS({r})", OK, None),
    ("pairs table, unknown goal", *FINE, '=RATES.PAIRS({r};;;;"lower")', OK, None),
    ("one rate, unknown sides", *FINE, '=RATES.ONE.LOW({r};1;;;"three")', "Err:502", None),
    ("difference of 1e15 units", [4e14, 5e14], [4.9e14, 5e14], "=RATES.DIFF({r};1;2)", OK, None),
    ("a margin", *FINE, "=RATES.MARGIN.P({r};1;2;0.02)", OK, None),
    ("retired word exact", *FINE, '=RATES.ONE.LOW({r};1;;"exact")', "Err:502", None),
    ("retired word score", *FINE, '=RATES.DIFF.LOW({r};1;2;;"score")', "Err:502", None),
    ("retired word bh", *FINE, '=RATES.PAIR.P({r};1;2;"bh")', "Err:502", None),
    ("sides as a number", *FINE, "=RATES.DIFF.HIGH({r};1;2;;;;;1)", "Err:502", None),
    ("one-sided at 0.3", *FINE, '=RATES.ONE.LOW({r};1;0.3;;"one")', "Err:502", None),
    ("no adjustment", *FINE, '=RATES.PAIR.P({r};1;2;"none")', OK, None),
]

BAYES = count_cases("=RATES.POST.MEAN({r};1)") + [
    ("prior 0", *FINE, "=RATES.POST.MEAN({r};1;0;1)", "Err:502", None),
    ("prior -1", *FINE, "=RATES.POST.LOW({r};1;;;-1;1)", "Err:502", None),
    ("prior 1e300", *FINE, "=RATES.POST.AHEAD({r};1;2;;1E+300;1E+300)", "Err:502", None),
    ("prior as text", *FINE, '=RATES.POST.MEAN({r};1;"flat")', "Err:502", None),
    ("group without attempts keeps the prior", [286, 0], [300, 0], "=RATES.POST.MEAN({r};2)", OK, None),
    ("position on a blank row", [286, None, 233], [300, None, 260], "=RATES.POST.MEAN({r};2)", "Err:502", None),
    ("position outside", *FINE, "=RATES.POST.BEST({r};9)", "Err:502", None),
    ("i = j", *FINE, "=RATES.POST.AHEAD({r};1;1)", "Err:502", None),
    ("level 0", *FINE, "=RATES.POST.LOW({r};1;0)", "Err:502", None),
    ("level 1", *FINE, "=RATES.POST.HIGH({r};1;1)", "Err:502", None),
    ("level 1.5", *FINE, "=RATES.POST.DIFF.LOW({r};1;2;1.5)", "Err:502", None),
    ("unknown kind", *FINE, '=RATES.POST.LOW({r};1;;"narrow")', "Err:502", None),
    ("hpd with no data and a prior below 1", [0, 286], [0, 300], '=RATES.POST.LOW({r};1;;"hpd";0.5;0.5)',
     "Err:502", None),
    ("one-sided at 0.3", *FINE, '=RATES.POST.LOW({r};1;0.3;"one-sided")', "Err:502", None),
    ("rate above 1", *FINE, "=RATES.POST.ABOVE({r};1;1.5)", "Err:502", None),
    ("rate negative", *FINE, "=RATES.POST.ABOVE({r};1;-0.5)", "Err:502", None),
    ("unknown goal", *FINE, '=RATES.POST.BEST({r};1;"lower")', "Err:502", None),
    ("next m negative", *FINE, "=RATES.POST.NEXT({r};1;-1)", "Err:502", None),
    ("next k above m", *FINE, "=RATES.POST.NEXT({r};1;10;11)", "Err:502", None),
    ("next m of 1e16", *FINE, "=RATES.POST.NEXT({r};1;1E+16)", "Err:523", None),
    ("next m of 1e15", *FINE, "=RATES.POST.NEXT({r};1;1E+15)", OK, None),
    ("prior same 0", *FINE, "=RATES.POST.SAME({r};0)", "Err:502", None),
    ("prior same 1", *FINE, "=RATES.POST.SAME({r};1)", "Err:502", None),
    ("curve of 1 point", *FINE, "=RATES.POST.CURVE({r};1)", "Err:502", None),
    ("curve over an unknown span", *FINE, '=RATES.POST.CURVE({r};11;;;;"narrow")', "Err:502", None),
    ("groups of 1e12", [5e11, 4e11], [5e11, 5e11], "=RATES.POST.BEST({r};1)", OK, None),
    ("groups of 1e15 far apart", [5e14, 4e14], [5e14, 5e14], "=RATES.POST.BEST({r};1)", OK, None),
    ("two laws far apart", [1, 9e11], [1e11, 9e11], "=RATES.POST.AHEAD({r};1;2)", OK, None),
    ("all groups without attempts", [0, 0], [0, 0], "=RATES.POST.BEST({r};1)", OK, None),
    ("difference bounds of 1e6 beside a perfect group", [1e6, 8e5], [1e6, 1e6], "=RATES.POST.DIFF.LOW({r};1;2)",
     OK, None),
    ("difference bounds, 5e8 of 5e8 against 80 %", [5e8, 4e8], [5e8, 5e8], "=RATES.POST.DIFF.LOW({r};1;2)",
     OK, None),
    ("order, unknown goal", *FINE, '=RATES.POST.ORDER({r};"lower")', "Err:502", None),
    ("best of 501 groups, one above the cap", [250] * 501, [300] * 501, "=RATES.POST.BEST({r};1)", "Err:523", None),
    ("table of 101 groups", [200 + g for g in range(101)], [300] * 101, "=RATES.POST.TABLE({r})", OK, None),
    ("order of 101 groups, one above the cap", [250] * 101, [300] * 101, "=RATES.POST.ORDER({r})", "Err:523", None),
    ("order of 40 lines of 1e12, Jeffreys' prior: the work cap of the whole table",
     [5e11 + 1e5 * g for g in range(40)], [1e12] * 40, "=RATES.POST.ORDER({r};;0.5;0.5)", "Err:523", None),
]

PLANNING = count_cases("=RATES.PLAN.AHEAD({r};4;1;0.95)") + [
    ("demo rate 1", *FINE, "=RATES.PLAN.DEMO(1;0.95)", "Err:523", None),
    ("demo rate 0", *FINE, "=RATES.PLAN.DEMO(0;0.95)", "Err:502", None),
    ("demo rate 1.5", *FINE, "=RATES.PLAN.DEMO(1.5;0.95)", "Err:502", None),
    ("demo confidence 0", *FINE, "=RATES.PLAN.DEMO(0.99;0)", "Err:502", None),
    ("demo confidence 1", *FINE, "=RATES.PLAN.DEMO(0.99;1)", "Err:502", None),
    ("demo failures negative", *FINE, "=RATES.PLAN.DEMO(0.99;0.95;-1)", "Err:502", None),
    ("demo failures fractional", *FINE, "=RATES.PLAN.DEMO(0.99;0.95;1.5)", "Err:502", None),
    ("demo failures 1e15", *FINE, "=RATES.PLAN.DEMO(0.99;0.95;1E+15)", "Err:523", None),
    ("demo rate 1 - 1e-12", *FINE, "=RATES.PLAN.DEMO(0.999999999999;0.95)", "Err:523", None),
    ("more, failed above run", *FINE, "=RATES.PLAN.MORE(0.99;0.95;10;11)", "Err:502", None),
    ("more, run of 1e15", *FINE, "=RATES.PLAN.MORE(0.99;0.95;1E+15;0)", OK, None),
    ("more, run negative", *FINE, "=RATES.PLAN.MORE(0.99;0.95;-1;0)", "Err:502", None),
    ("width 0", *FINE, "=RATES.PLAN.WIDTH(0.5;0)", "Err:523", None),
    ("width negative", *FINE, "=RATES.PLAN.WIDTH(0.5;-0.1)", "Err:502", None),
    ("width 1e-9", *FINE, "=RATES.PLAN.WIDTH(0.5;1E-9)", "Err:523", None),
    ("width, unknown method", *FINE, '=RATES.PLAN.WIDTH(0.5;0.05;0.95;"normal")', "Err:502", None),
    ("width, retired word exact", *FINE, '=RATES.PLAN.WIDTH(0.5;0.05;0.95;"exact")', "Err:502", None),
    ("power, equal rates", *FINE, "=RATES.PLAN.POWER(0.1;0.1)", "Err:523", None),
    ("power 1", *FINE, "=RATES.PLAN.POWER(0.1;0.15;1)", "Err:523", None),
    ("power 0", *FINE, "=RATES.PLAN.POWER(0.1;0.15;0)", "Err:502", None),
    ("alpha 1", *FINE, "=RATES.PLAN.POWER(0.1;0.15;0.8;1)", "Err:502", None),
    ("correction 2", *FINE, "=RATES.PLAN.POWER(0.1;0.2;;;2)", "Err:502", None),
    ("ratio 0", *FINE, "=RATES.PLAN.POWER(0.1;0.15;;;;0)", "Err:502", None),
    ("ratio 5000", *FINE, "=RATES.PLAN.POWER(0.1;0.15;;;;5000)", "Err:502", None),
    ("ahead, i = j", *FINE, "=RATES.PLAN.AHEAD({r};1;1;0.95)", "Err:502", None),
    ("ahead, confidence 1", *FINE, "=RATES.PLAN.AHEAD({r};4;1;1)", "Err:523", None),
    ("ahead, unknown goal", *FINE, '=RATES.PLAN.AHEAD({r};4;1;0.95;"lower")', "Err:502", None),
    ("ahead, prior 0", *FINE, "=RATES.PLAN.AHEAD({r};4;1;0.95;;0)", "Err:502", None),
    ("ahead against a perfect line of 1e14", [14, 1e14], [14, 1e14], "=RATES.PLAN.AHEAD({r};1;2;0.95)", "Err:523",
     None),
]

MATRICES = {"omnibus": OMNIBUS, "pairs": PAIRS, "bayes": BAYES, "planning": PLANNING,
            "apart and claims": APART}


class Hostile(SheetCase):
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

    def run_matrix(self, family):
        cases = MATRICES[family]
        self.assertGreaterEqual(len(cases), 40)
        slowest = (0.0, "")
        wrong = []
        filled = 4
        for what, x, n, text, expected, words in cases:
            # Values, text, formulas and the formats they left (=TRUE() leaves
            # a logical format, under which 0 and 1 read as FALSE and TRUE).
            self.sheet.getCellRangeByName("A1:B%d" % filled).clearContents(1 | 2 | 4 | 16 | 32 | 64)
            rows = max(len(x), len(n))
            filled = max(4, rows)
            self.put(x, "A", filled)
            self.put(n, "B", filled)
            r = "A1:A%d;B1:B%d" % (rows, rows)
            self.formula("D1", text.format(r=r))
            start = time.monotonic()
            shown = self.shown("D1")
            seconds = time.monotonic() - start
            slowest = max(slowest, (seconds, what))
            if expected == OK:
                if shown.startswith("Err:") or shown.startswith("#"):
                    wrong.append("%s: %s shows %s" % (family, what, shown))
            elif shown != expected:
                wrong.append("%s: %s shows %s, not %s" % (family, what, shown, expected))
            if words:
                self.formula("D2", "=RATES.CHECK(%s)" % r)
                if words not in self.shown("D2"):
                    wrong.append("%s: %s: RATES.CHECK says %s" % (family, what, self.shown("D2")))
        print("\nhostile %s: %d cases, slowest %.3f s (%s)" % (family, len(cases), slowest[0], slowest[1]))
        self.assertEqual(wrong, [])
        self.assertLess(slowest[0], 2.0, slowest[1])
        # The same process is alive and answers a normal formula.
        self.assertTrue(harness.OFFICE.alive())
        self.sheet.getCellRangeByName("A1:B4").clearContents(1 | 2 | 4 | 16 | 32 | 64)
        r = self.put_counts(*FINE)
        self.formula("D3", "=RATES.APART.LOW(%s;3)" % r)
        self.assertEqual(self.value_of("D3"), 0.9)

    def test_omnibus(self):
        self.run_matrix("omnibus")

    def test_pairs(self):
        self.run_matrix("pairs")

    def test_bayes(self):
        self.run_matrix("bayes")

    def test_planning(self):
        self.run_matrix("planning")

    def test_apart_and_claims(self):
        self.run_matrix("apart and claims")


if __name__ == "__main__":
    harness.main()
