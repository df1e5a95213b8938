#!/usr/bin/python3
"""Reference values for the omnibus (do the groups share one rate) tests, from libraries outside the project.

Writes omnibus.csv (one row per case and quantity); every row names the library, the
function and its version, so a failing engine test points at an outside source:

    /usr/bin/python3 tests/reference/omnibus.py > tests/reference/omnibus.csv

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
  Table(shift_zeros=False).standardized_resids: adjusted standardized
      residuals of the successes (statsmodels).
"""
import itertools
import math
import sys
from fractions import Fraction

import mpmath
import numpy as np
import scipy
import scipy.stats
from scipy.stats import chi2_contingency, fisher_exact
from statsmodels.stats.contingency_tables import Table

sys.path.insert(0, __file__.rsplit("/", 1)[0])
from reference_common import SCIPY, STATSMODELS, fmt, row, write_sections  # noqa: E402

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
    # Near ties (found by a search over random margins): another table with
    # these margins has a statistic 2.4e-7 (X^2) or 3.2e-7 (G^2) relative
    # below the observed one, between the tie tolerance (1e-7) and 1e-6, so
    # a wider tolerance or a merge width above it changes the p-value.
    ("e_near_tie_x2", [11, 14, 7, 8], [37, 48, 58, 59]),
    ("e_near_tie_g2", [11, 19, 2, 11], [27, 56, 24, 47]),
]

# Larger tables (N = 300 to 480) for vector_exact: every table, in double
# precision with numpy. Invented counts.
VECTOR_EXACT_CASES = [
    ("v_n300_g4", [31, 40, 36, 49], [75, 75, 75, 75]),
    ("v_n480_g3", [70, 88, 61], [160, 160, 160]),
    ("v_n420_g4_uneven", [9, 30, 41, 22], [40, 100, 180, 100]),
]

TREND_CASES = [
    ("t_rising", [2, 5, 9, 14], [30, 30, 30, 30], [1, 2, 3, 4]),
    ("t_uneven_scores", [10, 12, 8, 3], [40, 50, 30, 20], [0, 1, 2, 5]),
    # Armitage 1955 (Biometrics 11:375) Table 1, the published example; the
    # paper gives 7.19, P = 0.007 in the binomial-variance form [S].
    ("t_armitage1955_table1", [19, 29, 24], [516, 589, 293], [1, 2, 3]),
]


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


def vector_exact(x, n):
    """Exact conditional p-values by listing every table with these margins
    as numpy arrays: log-probabilities from scipy.special.gammaln, X^2 and
    G^2 per table, the same tie rule as brute_force_exact, sums by math.fsum.
    Written for these tests, sharing no code with the engine."""
    from scipy.special import gammaln, xlogy
    S, N = sum(x), sum(n)
    F = N - S
    grids = np.meshgrid(*[np.arange(max(0, a - F), min(a, S) + 1) for a in n[:-1]], indexing="ij")
    T = np.stack([g.ravel() for g in grids], axis=1)
    last = S - T.sum(axis=1)
    ok = (last >= max(0, n[-1] - F)) & (last <= min(n[-1], S))
    T = np.column_stack([T[ok], last[ok]]).astype(float)
    na = np.array(n, float)
    lchoose = lambda a, b: gammaln(a + 1) - gammaln(b + 1) - gammaln(a - b + 1)
    logp = lchoose(na, T).sum(axis=1) - lchoose(float(N), float(S))
    e1, e2 = na * S / N, na * F / N
    x2 = (((T - e1) ** 2) / e1 + (((na - T) - e2) ** 2) / e2).sum(axis=1)
    g2 = 2 * (xlogy(T, T / e1) + xlogy(na - T, (na - T) / e2)).sum(axis=1)
    obs = np.flatnonzero((T == np.array(x, float)).all(axis=1))[0]
    prob = np.exp(logp)
    return {"exact": math.fsum(prob[x2 >= x2[obs] * (1 - 1e-7)]),
            "exact_lr": math.fsum(prob[g2 >= g2[obs] * (1 - 1e-7) - 1e-12]),
            "exact_prob": math.fsum(prob[logp <= logp[obs] + math.log1p(1e-7)])}


def exact_rows(w):
    for name, x, n in VECTOR_EXACT_CASES:
        r = vector_exact(x, n)
        for k in ("exact", "exact_lr", "exact_prob"):
            w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), k + "_p", fmt(r[k]),
                        "vector_exact (numpy " + np.__version__ + ", scipy.special.gammaln; this file)"])
    for name, x, n in EXACT_CASES:
        r = brute_force_exact(x, n)
        # The two enumerators, rational and numpy, must agree.
        v = vector_exact(x, n)
        assert all(abs(v[k] - r[k]) <= 1e-12 * r[k] for k in r), (name, r, v)
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
        if name.startswith("t_armitage"):
            # The paper's chi^2 (binomial variance) by its formula in exact
            # fractions: T^2 / (p q (sum n s^2 - (sum n s)^2 / N)). It is
            # 7.1927; the conditional form gives 7.1876; both print as 7.19.
            X = sum(x)
            T = sum(Fraction(si * xi) for si, xi in zip(s, x)) - Fraction(X, N) * sum(si * ni for si, ni in zip(s, n))
            V = Fraction(X, N) * Fraction(N - X, N) * (sum(ni * si * si for si, ni in zip(s, n))
                                                       - Fraction(sum(si * ni for si, ni in zip(s, n)) ** 2, N))
            w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "trend_binomial_chi2", fmt(T * T / V),
                        "Armitage (1955) chi^2 formula in exact fractions (this file); scores "
                        + " ".join(map(str, s))])
        zb = r.zscore * math.sqrt(N / (N - 1))
        w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), "trend_binomial_p",
                    fmt(scipy.stats.chi2.sf(zb * zb, 1)),
                    STATSMODELS + " test_ordinal_association z rescaled by sqrt(N/(N-1)); " + SCIPY
                    + " stats.chi2.sf; scores " + " ".join(map(str, s))])


RESID_CASES = [
    ("r_four_ovens", [286, 271, 233, 14], [300, 290, 260, 14]),
    ("r_zero_group", [0, 14, 22], [15, 30, 31]),
]


def residual_rows(w):
    for name, x, n in RESID_CASES:
        t = Table(np.array([x, [b - a for a, b in zip(x, n)]]).T, shift_zeros=False)
        for g, v in enumerate(t.standardized_resids[:, 0]):
            row(w, name, x, n, "resid_%d" % (g + 1), v, STATSMODELS + " Table(shift_zeros=False).standardized_resids")


# Tarone (1979): invented tallies of many small groups (lots of 8 to 30
# units), one that varies beyond counting and one that does not, and the
# sample sheet's ovens.
TARONE_CASES = [
    ("t_spread_lots", [8, 2, 7, 8, 1, 6, 8, 3, 7, 8, 2, 8], [8, 8, 8, 8, 8, 8, 8, 8, 8, 8, 8, 8]),
    ("t_even_lots", [27, 25, 28, 26, 29, 24, 27, 28, 26, 27], [30, 28, 30, 29, 31, 27, 30, 30, 29, 30]),
    ("t_ovens", [286, 271, 233, 14], [300, 290, 260, 14]),
]


def tarone_rows(w):
    """Z = [sum (x_i - n_i p)^2 / (p q) - N] / sqrt(2 sum n_i (n_i - 1)), the
    numerator in exact fractions, the root and the normal tail in 50-digit
    mpmath."""
    mpmath.mp.dps = 50
    for name, x, n in TARONE_CASES:
        big_n, s = sum(n), sum(x)
        p = Fraction(s, big_n)
        num = sum((xi - ni * p) ** 2 for xi, ni in zip(x, n)) / (p * (1 - p)) - big_n
        z = mpmath.mpf(num.numerator) / num.denominator / mpmath.sqrt(2 * sum(ni * (ni - 1) for ni in n))
        source = "Tarone (1979) formula: exact fractions, mpmath %s sqrt and ncdf (50 digits)" % mpmath.__version__
        row(w, name, x, n, "tarone_z", float(z), source)
        row(w, name, x, n, "tarone_p", float(mpmath.ncdf(-z)), source)


SECTIONS = ['chi_rows', 'exact_rows', 'trend_rows', 'residual_rows', 'tarone_rows']


if __name__ == "__main__":
    write_sections(SECTIONS)
