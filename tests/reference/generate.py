#!/usr/bin/python3
"""Reference values for the omnibus tests, from libraries outside the project.

Writes omnibus.csv (one row per case and quantity). Every row names the
library, the function and its version, so a failing engine test points at an
outside source. Run with Debian's /usr/bin/python3 (python3-scipy,
python3-statsmodels, python3-mpmath):

    /usr/bin/python3 tests/reference/generate.py > tests/reference/omnibus.csv

The ctest "reference_tables_current" regenerates the file and compares it
with the committed one when those packages are present.

Sources:
  chi2_contingency(correction=False) and its lambda_="log-likelihood" form:
      Pearson X^2 and G^2 with their chi-square p-values (scipy).
  fisher_exact(alternative="two-sided"): 2 x 2 exact p (scipy; it sums tables
      no more probable than the observed one, relative tolerance 1e-14).
  brute_force_exact below: an independent enumeration of every 2 x G table
      with the observed margins in exact rational arithmetic (Python fractions),
      for the three orderings; written for these tests, sharing no code with
      the engine.
  Table.test_ordinal_association: linear-by-linear association, the
      conditional (N - 1) form of the Cochran-Armitage trend test (statsmodels).
"""
import csv
import itertools
import math
import sys
from fractions import Fraction

import mpmath
import numpy as np
import scipy
import scipy.stats
import statsmodels
from scipy.stats import chi2_contingency, fisher_exact
from statsmodels.stats.contingency_tables import Table

SCIPY = "scipy " + scipy.__version__
STATSMODELS = "statsmodels " + statsmodels.__version__
BRUTE = "brute_force_exact (fractions, this file) with mpmath " + mpmath.__version__

# Omnibus cases: (name, successes, attempts). Invented counts, covering the
# shapes the issue names: a group of all successes, one of none, very unequal
# attempts, G = 2, 3, 6, 12, and counts of 1e6.
CHI_CASES = [
    ("issue_example", [45, 171, 12], [50, 190, 12]),
    ("g2_even", [18, 27], [40, 40]),
    ("g2_unequal", [3, 350], [12, 400]),
    ("g3_zero_group", [0, 14, 22], [15, 30, 31]),
    ("g3_all_success", [20, 17, 9], [20, 25, 16]),
    ("g6_mixed", [12, 30, 7, 44, 19, 3], [25, 41, 20, 60, 33, 9]),
    ("g12_shift", [50, 52, 47, 55, 60, 41, 49, 51, 58, 62, 45, 53],
                  [80, 80, 78, 81, 85, 79, 80, 77, 82, 84, 80, 79]),
    ("g3_million", [912345, 913020, 911876], [1000000, 1000000, 1000000]),
    ("g2_million_unequal", [999000, 4], [1000000, 12]),
    ("g4_tiny_p", [5, 40, 75, 98], [100, 100, 100, 100]),
]

# Small tables for exact enumeration (all orderings).
EXACT_CASES = [
    ("e_tea", [3, 1], [4, 4]),
    ("e_g3_small", [1, 4, 6], [6, 7, 8]),
    ("e_g4_mixed", [0, 2, 5, 3], [4, 5, 6, 3]),
    ("e_g5_sparse", [0, 1, 0, 3, 1], [3, 4, 2, 5, 6]),
    ("e_g3_allone", [5, 5, 0], [5, 5, 5]),
    ("e_g6_pilot", [2, 3, 1, 4, 0, 5], [5, 5, 4, 6, 3, 6]),
    ("e_g2_unequal", [1, 9], [3, 30]),
    ("e_g4_ties", [1, 1, 2, 2], [4, 4, 4, 4]),
]

TREND_CASES = [
    ("t_rising", [2, 5, 9, 14], [30, 30, 30, 30], [1, 2, 3, 4]),
    ("t_uneven_scores", [10, 12, 8, 3], [40, 50, 30, 20], [0, 1, 2, 5]),
    # Armitage 1955 (Biometrics 11:375) Table 1, the published example; the
    # paper gives 7.19, P = 0.007 in the binomial-variance form [S].
    ("t_armitage1955_table1", [19, 29, 24], [516, 589, 293], [1, 2, 3]),
]


def fmt(v):
    return repr(float(v))


def chi_rows(w):
    for name, x, n in CHI_CASES:
        tab = np.array([x, [a - b for a, b in zip(n, x)]])
        x2, p, df, _ = chi2_contingency(tab, correction=False)
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "pearson_stat", fmt(x2),
                    SCIPY + " stats.chi2_contingency(correction=False)"])
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "pearson_p", fmt(p),
                    SCIPY + " stats.chi2_contingency(correction=False)"])
        g2, pg, _, _ = chi2_contingency(tab, correction=False, lambda_="log-likelihood")
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "lr_stat", fmt(g2),
                    SCIPY + " stats.chi2_contingency(correction=False, lambda_='log-likelihood')"])
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "lr_p", fmt(pg),
                    SCIPY + " stats.chi2_contingency(correction=False, lambda_='log-likelihood')"])


def brute_force_exact(x, n):
    """Exact conditional p-values by listing every table with these margins."""
    S, N = sum(x), sum(n)
    G = len(n)
    total = math.comb(N, S)

    def prob(t):
        return Fraction(math.prod(math.comb(a, b) for a, b in zip(n, t)), total)

    def x2(t):  # Pearson X^2 over the 2 x G cells, in exact fractions
        s = Fraction(0)
        for a, b in zip(n, t):
            e1 = Fraction(a * S, N)
            e2 = Fraction(a * (N - S), N)
            s += (b - e1) ** 2 / e1 + ((a - b) - e2) ** 2 / e2
        return s

    def g2(t):  # G^2 in 50-digit floating point (logs are not rational)
        mpmath.mp.dps = 50
        s = mpmath.mpf(0)
        for a, b in zip(n, t):
            for o, e in ((b, mpmath.mpf(a) * S / N), (a - b, mpmath.mpf(a) * (N - S) / N)):
                if o:
                    s += o * mpmath.log(o / e)
        return 2 * s

    tables = [t for t in itertools.product(*[range(a + 1) for a in n]) if sum(t) == S]
    obs = tuple(x)
    px2, pg2, pprob = x2(obs), g2(obs), prob(obs)
    r = {"exact": Fraction(0), "exact_lr": mpmath.mpf(0), "exact_prob": Fraction(0)}
    for t in tables:
        pt = prob(t)
        if x2(t) >= px2 * (1 - Fraction(1, 10**7)):
            r["exact"] += pt
        if g2(t) >= pg2 * (1 - mpmath.mpf(10) ** -7) - mpmath.mpf(10) ** -12:
            r["exact_lr"] += mpmath.mpf(pt.numerator) / pt.denominator
        if pt <= pprob * (1 + Fraction(1, 10**7)):
            r["exact_prob"] += pt
    return {k: float(v) for k, v in r.items()}


def exact_rows(w):
    for name, x, n in EXACT_CASES:
        r = brute_force_exact(x, n)
        for k in ("exact", "exact_lr", "exact_prob"):
            w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), k + "_p", fmt(r[k]), BRUTE])
        if len(n) == 2:
            _, p = fisher_exact([[x[0], n[0] - x[0]], [x[1], n[1] - x[1]]], alternative="two-sided")
            w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "fisher_p", fmt(p),
                        SCIPY + " stats.fisher_exact(alternative='two-sided')"])


def trend_rows(w):
    for name, x, n, s in TREND_CASES:
        tab = np.array([[a - b, b] for a, b in zip(n, x)], dtype=float)  # rows: groups; cols: failure, success
        r = Table(tab, shift_zeros=False).test_ordinal_association(row_scores=np.array(s, float),
                                                                    col_scores=np.array([0.0, 1.0]))
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "trend_conditional_p", fmt(r.pvalue),
                    STATSMODELS + " contingency_tables.Table.test_ordinal_association; scores "
                    + " ".join(map(str, s))])
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "trend_conditional_z", fmt(r.zscore),
                    STATSMODELS + " contingency_tables.Table.test_ordinal_association; scores "
                    + " ".join(map(str, s))])
        # Armitage's binomial-variance form differs by the factor N/(N-1) in
        # the variance: z_binomial = z_conditional * sqrt(N / (N - 1)).
        N = sum(n)
        zb = r.zscore * math.sqrt(N / (N - 1))
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "trend_binomial_p",
                    fmt(scipy.stats.chi2.sf(zb * zb, 1)),
                    STATSMODELS + " test_ordinal_association z rescaled by sqrt(N/(N-1)); " + SCIPY
                    + " stats.chi2.sf; scores " + " ".join(map(str, s))])


def main():
    w = csv.writer(sys.stdout, lineterminator="\n")
    w.writerow(["case", "successes", "attempts", "quantity", "value", "source"])
    chi_rows(w)
    exact_rows(w)
    trend_rows(w)


if __name__ == "__main__":
    main()
