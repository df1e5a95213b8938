#!/usr/bin/python3
"""Reference values for the pairs (two groups, one group, families of pairs) tests, from libraries outside the project.

Writes pairs.csv (one row per case and quantity); every row names the library, the
function and its version, so a failing engine test points at an outside source:

    /usr/bin/python3 tests/reference/pairs.py > tests/reference/pairs.csv

Sources:
  proportion_confint (wilson, beta, jeffreys, agresti_coull): one-rate
      intervals (statsmodels); Jeffreys with Brown, Cai & DasGupta's (2001)
      ends, lower 0 at x = 0 and upper 1 at x = n, as the engine documents.
      One-sided bounds at 95 %: Wilson and Agresti-Coull as the ends of
      proportion_confint at alpha 0.10 (each tail 0.05); Clopper-Pearson and
      Jeffreys as scipy beta.ppf quantiles at 0.05 and 0.95.
  confint_proportions_2indep (newcomb, agresti-caffo, wald, compare="diff"):
      difference intervals (statsmodels), clipped to [-1, 1] as the engine
      documents. Its "score" method is wrong in 0.13.5 (checks.md), so the
      Miettinen-Nurminen rows come from mn_interval below: an independent
      implementation (restricted maximum likelihood by bisection of the
      likelihood's derivative, bounds by bisection), sharing no code or
      closed form with the engine.
  chi2_contingency(correction=False) times (N - 1)/N, and fisher_exact on
      2 x 2 tables: pairwise p-values (scipy; the "N - 1" chi-square is the
      Miettinen-Nurminen score statistic at difference 0, checked here against
      mn_score); multipletests (holm, simes-hochberg, fdr_bh, bonferroni,
      sidak): adjusted p-values over the family (statsmodels).
  fm_p (this file): Farrington & Manning (1990) margin tests in 50-digit
      mpmath, the restricted estimate as the root of their cubic found by
      mpmath.polyroots and checked at generation against restricted_mle
      (bisection of the likelihood's derivative); equivalence as
      Schuirmann's (1987) two one-sided tests.
"""
import math
import sys

import mpmath
import numpy as np
import scipy
import scipy.stats
from scipy.stats import chi2_contingency, fisher_exact
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

sys.path.insert(0, __file__.rsplit("/", 1)[0])
from reference_common import SCIPY, STATSMODELS, row, write_sections  # noqa: E402

# One-rate cases: (name, successes, attempts). Invented; the ends 0 of n and
# n of n, n = 1, a rare defect and n = 10^6.
ONE_CASES = [
    ("one_zero", 0, 12), ("one_all", 14, 14), ("one_single_pass", 1, 1), ("one_single_fail", 0, 1),
    ("one_mid", 37, 52), ("one_rare", 3, 40000), ("one_million", 999123, 1000000),
]
ONE_METHODS = {"wilson": "wilson", "clopper_pearson": "beta", "jeffreys": "jeffreys", "agresti_coull": "agresti_coull"}


def one_rate_rows(w):
    for name, x, n in ONE_CASES:
        for ours, theirs in ONE_METHODS.items():
            low, high = proportion_confint(x, n, alpha=0.05, method=theirs)
            source = STATSMODELS + ' proportion_confint(method="%s", alpha=0.05)' % theirs
            if ours == "jeffreys":
                low, high = (0.0 if x == 0 else low), (1.0 if x == n else high)
                source += "; 0 at x = 0, 1 at x = n (Brown, Cai & DasGupta 2001)"
            row(w, name, [x], [n], "one_%s_low" % ours, low, source)
            row(w, name, [x], [n], "one_%s_high" % ours, high, source)


def one_sided_rows(w):
    """Each bound alone at 95 % (sides "one")."""
    for name, x, n in ONE_CASES:
        for ours, theirs in (("wilson", "wilson"), ("agresti_coull", "agresti_coull")):
            low, high = proportion_confint(x, n, alpha=0.10, method=theirs)
            source = STATSMODELS + ' proportion_confint(method="%s", alpha=0.10): each end a one-sided 95 %% bound' % theirs
            row(w, name, [x], [n], "sided_%s_low" % ours, low, source)
            row(w, name, [x], [n], "sided_%s_high" % ours, high, source)
        # Clopper-Pearson: Beta(x, n - x + 1) and Beta(x + 1, n - x) quantiles;
        # Jeffreys: Beta(x + 1/2, n - x + 1/2), 0 at x = 0 and 1 at x = n.
        for ours, shift in (("clopper_pearson", None), ("jeffreys", 0.5)):
            if shift is None:
                low = 0.0 if x == 0 else scipy.stats.beta.ppf(0.05, x, n - x + 1)
                high = 1.0 if x == n else scipy.stats.beta.ppf(0.95, x + 1, n - x)
            else:
                low = 0.0 if x == 0 else scipy.stats.beta.ppf(0.05, x + shift, n - x + shift)
                high = 1.0 if x == n else scipy.stats.beta.ppf(0.95, x + shift, n - x + shift)
            source = SCIPY + " beta.ppf at 0.05 and 0.95 (%s)" % ours.replace("_", "-")
            row(w, name, [x], [n], "sided_%s_low" % ours, low, source)
            row(w, name, [x], [n], "sided_%s_high" % ours, high, source)


# Two-group cases: (name, x1, n1, x2, n2). Invented; 0 % against 100 %, both
# at 0 % or 100 %, n = 1, 12 against 40,000, n = 10^6, a perfect pilot.
PAIR_CASES = [
    ("p_mid", 45, 50, 171, 190), ("p_zero_vs_all", 0, 10, 10, 10), ("p_both_zero", 0, 12, 0, 30),
    ("p_both_all", 14, 14, 40, 40), ("p_single", 1, 1, 0, 1), ("p_unequal", 11, 12, 36000, 40000),
    ("p_million", 999123, 1000000, 998800, 1000000), ("p_pilot", 14, 14, 286, 300),
]
DIFF_METHODS = {"newcombe": "newcomb", "agresti_caffo": "agresti-caffo", "wald": "wald"}


def restricted_mle(x1, n1, x2, n2, delta):
    """Maximises the binomial likelihood under p1 - p2 = delta by bisection of
    its derivative in p2 (the log-likelihood is concave)."""
    lo, hi = max(0.0, -delta), min(1.0, 1.0 - delta)

    def slope(q2):
        q1 = q2 + delta
        terms = [(x1, q1), (-(n1 - x1), 1 - q1), (x2, q2), (-(n2 - x2), 1 - q2)]
        return sum(c / q for c, q in terms if c != 0)

    for _ in range(200):
        mid = (lo + hi) / 2
        if mid in (lo, hi):
            break
        lo, hi = (mid, hi) if slope(mid) > 0 else (lo, mid)
    q2 = (lo + hi) / 2
    return q2 + delta, q2


def mn_score(x1, n1, x2, n2, delta):
    q1, q2 = restricted_mle(x1, n1, x2, n2, delta)
    big_n = n1 + n2
    v = (q1 * (1 - q1) / n1 + q2 * (1 - q2) / n2) * big_n / (big_n - 1)
    num = x1 / n1 - x2 / n2 - delta
    return num / math.sqrt(v) if v > 0 else math.copysign(math.inf, num) if num else 0.0


def mn_interval(x1, n1, x2, n2, level=0.95):
    """Miettinen & Nurminen (1985) by bisection on delta."""
    z = scipy.stats.norm.isf((1 - level) / 2)
    d = x1 / n1 - x2 / n2

    def cross(lo, hi, target):  # score decreases in delta
        for _ in range(200):
            mid = (lo + hi) / 2
            if mid in (lo, hi):
                break
            lo, hi = (mid, hi) if mn_score(x1, n1, x2, n2, mid) > target else (lo, mid)
        return (lo + hi) / 2

    return (-1.0 if d <= -1 else cross(-1.0, d, z)), (1.0 if d >= 1 else cross(d, 1.0, -z))


def pair_p_values(x1, n1, x2, n2):
    """Score p (Pearson's chi-square times (N - 1)/N), or None where scipy
    refuses (an expected count of 0), and Fisher's p."""
    table = [[x1, n1 - x1], [x2, n2 - x2]]
    big_n = n1 + n2
    try:
        statistic = chi2_contingency(table, correction=False)[0] * (big_n - 1) / big_n
        score = scipy.stats.chi2.sf(statistic, 1)
        # The same statistic as the Miettinen-Nurminen score at difference 0.
        assert abs(statistic - mn_score(x1, n1, x2, n2, 0.0) ** 2) <= 1e-9 * max(1.0, statistic), (x1, n1, x2, n2)
    except ValueError:
        score = None
    return score, fisher_exact(table, alternative="two-sided")[1]

SCORE_SOURCE = SCIPY + " chi2_contingency(correction=False) statistic times (N - 1)/N, chi2.sf"


def pair_rows(w):
    for name, x1, n1, x2, n2 in PAIR_CASES:
        x, n = [x1, x2], [n1, n2]
        for ours, theirs in DIFF_METHODS.items():
            low, high = confint_proportions_2indep(x1, n1, x2, n2, method=theirs, compare="diff", alpha=0.05)
            source = STATSMODELS + ' confint_proportions_2indep(method="%s", compare="diff")' % theirs
            if ours != "newcombe":
                low, high = max(-1.0, low), min(1.0, high)
                source += ", clipped to [-1, 1]"
            row(w, name, x, n, "diff_%s_low" % ours, low, source)
            row(w, name, x, n, "diff_%s_high" % ours, high, source)
        low, high = mn_interval(x1, n1, x2, n2)
        source = "mn_interval (this file: bisection, Miettinen & Nurminen 1985 with N/(N-1)); " + SCIPY + " norm.isf"
        row(w, name, x, n, "diff_miettinen_nurminen_low", low, source)
        row(w, name, x, n, "diff_miettinen_nurminen_high", high, source)
        # One-sided 95 %: the ends of the two-sided 90 % interval.
        low, high = mn_interval(x1, n1, x2, n2, level=0.90)
        row(w, name, x, n, "diffsided_miettinen_nurminen_low", low, source + ", level 0.90: one-sided 95 % ends")
        row(w, name, x, n, "diffsided_miettinen_nurminen_high", high, source + ", level 0.90: one-sided 95 % ends")
        low, high = confint_proportions_2indep(x1, n1, x2, n2, method="newcomb", compare="diff", alpha=0.10)
        source = STATSMODELS + ' confint_proportions_2indep(method="newcomb", compare="diff", alpha=0.10)'
        row(w, name, x, n, "diffsided_newcombe_low", low, source + ": one-sided 95 % ends")
        row(w, name, x, n, "diffsided_newcombe_high", high, source + ": one-sided 95 % ends")
        score, fisher = pair_p_values(x1, n1, x2, n2)
        if score is not None:
            row(w, name, x, n, "pair_score_p", score, SCORE_SOURCE)
        row(w, name, x, n, "pair_exact_p", fisher, SCIPY + ' fisher_exact(alternative="two-sided")')


# A tally of five lines for the families of comparisons, and one of twenty
# lots (invented).
FAMILY = ("f_five_lines", [45, 171, 12, 30, 88], [50, 190, 12, 40, 100])
TWENTY = ("f_twenty_lots", [40 + (7 * g) % 11 for g in range(20)], [50 + (3 * g) % 5 for g in range(20)])
ADJUST = {"holm": "holm", "hochberg": "simes-hochberg", "benjamini-hochberg": "fdr_bh", "bonferroni": "bonferroni",
          "sidak": "sidak"}


def family_rows(w):
    name, x, n = FAMILY
    pairs = [(a, b) for a in range(len(x)) for b in range(a + 1, len(x))]
    for test in ("score", "exact"):
        raw = [pair_p_values(x[a], n[a], x[b], n[b])[0 if test == "score" else 1] for a, b in pairs]
        for ours, theirs in ADJUST.items():
            for fam, members in (("all", pairs), ("against1", [pq for pq in pairs if 0 in pq])):
                with np.errstate(divide="ignore"):  # sidak at p = 1: log1p(-1), harmless
                    adjusted = multipletests([raw[pairs.index(pq)] for pq in members], method=theirs)[1]
                for (a, b), v in zip(members, adjusted):
                    row(w, name, x, n, "family_%s_%s_%s_%d_%d" % (test, ours, fam, a + 1, b + 1), v,
                        STATSMODELS + ' multipletests(method="%s") of %s' %
                        (theirs, SCORE_SOURCE if test == "score" else SCIPY + " fisher_exact"))


def twenty_rows(w):
    """Holm over all 190 pairs of twenty lots (score test)."""
    name, x, n = TWENTY
    pairs = [(a, b) for a in range(len(x)) for b in range(a + 1, len(x))]
    raw = [pair_p_values(x[a], n[a], x[b], n[b])[0] for a, b in pairs]
    for (a, b), v in zip(pairs, multipletests(raw, method="holm")[1]):
        row(w, name, x, n, "family_score_holm_all_%d_%d" % (a + 1, b + 1), v,
            STATSMODELS + ' multipletests(method="holm") of ' + SCORE_SOURCE)


# Margin cases: (name, x1, n1, x2, n2, margin, claim, goal). Invented: a new
# supplier's lots against the old one's, two lines judged for equivalence,
# defect counts (goal low), a perfect record, unequal sizes, margins of 0.
MARGIN_CASES = [
    ("m_supplier", 482, 500, 1431, 1500, 0.01, "not-worse", "high"),
    ("m_supplier", 482, 500, 1431, 1500, 0.03, "not-worse", "high"),
    ("m_supplier", 482, 500, 1431, 1500, 0.0, "better", "high"),
    ("m_supplier_better", 497, 500, 1431, 1500, 0.005, "better", "high"),
    ("m_lines", 930, 1000, 941, 1000, 0.02, "equivalent", "high"),
    ("m_lines", 930, 1000, 941, 1000, 0.005, "equivalent", "high"),
    ("m_defects", 7, 800, 12, 900, 0.01, "not-worse", "low"),
    ("m_defects", 7, 800, 12, 900, 0.0, "better", "low"),
    ("m_defects", 7, 800, 12, 900, 0.01, "equivalent", "low"),
    ("m_perfect", 60, 60, 285, 300, 0.05, "not-worse", "high"),
    ("m_none_failed", 0, 40, 3, 120, 0.02, "not-worse", "low"),
    ("m_unequal", 11, 12, 36000, 40000, 0.10, "not-worse", "high"),
    ("m_large", 99120, 100000, 99200, 100000, 0.002, "equivalent", "high"),
    ("m_small", 3, 4, 2, 5, 0.2, "better", "high"),
]


def fm_restricted(x1, n1, x2, n2, delta):
    """Farrington & Manning (1990) restricted estimate under p1 - p2 = delta:
    the root of their cubic in [max(0, delta), min(1, 1 + delta)], by
    mpmath.polyroots at 50 digits."""
    mpmath.mp.dps = 50
    x1, n1, x2, n2, delta = map(mpmath.mpf, (x1, n1, x2, n2, delta))
    theta = n2 / n1
    p1, p2 = x1 / n1, x2 / n2
    a = 1 + theta
    b = -(1 + theta + p1 + theta * p2 + delta * (theta + 2))
    c = delta ** 2 + delta * (2 * p1 + theta + 1) + p1 + theta * p2
    d = -p1 * delta * (1 + delta)
    lo, hi = max(mpmath.mpf(0), delta), min(mpmath.mpf(1), 1 + delta)
    roots = [r.real for r in mpmath.polyroots([a, b, c, d], maxsteps=200, extraprec=200)
             if abs(r.imag) < mpmath.mpf(10) ** -30 and lo - mpmath.mpf(10) ** -30 <= r.real <= hi + mpmath.mpf(10) ** -30]

    def loglik(q1):
        q2 = q1 - delta
        return sum(k * mpmath.log(q) for k, q in ((x1, q1), (n1 - x1, 1 - q1), (x2, q2), (n2 - x2, 1 - q2))
                   if k != 0)
    q1 = max(roots, key=lambda r: loglik(min(max(r, lo), hi)))
    q1 = min(max(q1, lo), hi)
    # Checked against a direct maximisation of the restricted likelihood.
    b1, b2 = restricted_mle(int(x1), int(n1), int(x2), int(n2), float(delta))
    assert abs(float(q1) - b1) < 1e-9 and abs(float(q1 - delta) - b2) < 1e-9, (x1, n1, x2, n2, delta, q1, b1)
    return q1, q1 - delta


def fm_upper_p(x1, n1, x2, n2, delta):
    """P(Z >= z), z = (p1 - p2 - delta) / sqrt(restricted variance), no N/(N-1)."""
    q1, q2 = fm_restricted(x1, n1, x2, n2, delta)
    v = q1 * (1 - q1) / n1 + q2 * (1 - q2) / n2
    num = mpmath.mpf(x1) / n1 - mpmath.mpf(x2) / n2 - delta
    if v == 0:
        return mpmath.mpf(0) if num > 0 else (mpmath.mpf(1) if num < 0 else mpmath.mpf("0.5"))
    return mpmath.ncdf(-num / mpmath.sqrt(v))


def fm_p(x1, n1, x2, n2, margin, claim, goal):
    if goal == "low":  # defects: test the units without one
        x1, x2 = n1 - x1, n2 - x2
    if claim == "not-worse":
        return fm_upper_p(x1, n1, x2, n2, -margin)
    if claim == "better":
        return fm_upper_p(x1, n1, x2, n2, margin)
    # Schuirmann (1987): both one-sided tests; the upper one with the groups swapped.
    return max(fm_upper_p(x1, n1, x2, n2, -margin), fm_upper_p(x2, n2, x1, n1, -margin))


def margin_rows(w):
    for name, x1, n1, x2, n2, margin, claim, goal in MARGIN_CASES:
        value = fm_p(x1, n1, x2, n2, margin, claim, goal)
        row(w, name, [x1, x2], [n1, n2], "margin_%s_%s_%s" % (claim, goal, repr(margin)), value,
            "fm_p (this file: Farrington & Manning 1990 in mpmath %s at 50 digits, polyroots, checked against "
            "restricted_mle)" % mpmath.__version__ + ("; Schuirmann 1987 two one-sided tests" if claim == "equivalent"
                                                      else ""))


SECTIONS = ['one_rate_rows', 'pair_rows', 'family_rows', 'twenty_rows', 'one_sided_rows', 'margin_rows']


if __name__ == "__main__":
    write_sections(SECTIONS)
