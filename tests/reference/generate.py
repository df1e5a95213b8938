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
  proportion_confint (wilson, beta, jeffreys, agresti_coull): one-rate
      intervals (statsmodels); Jeffreys with Brown, Cai & DasGupta's (2001)
      ends, lower 0 at x = 0 and upper 1 at x = n, as the engine documents.
  confint_proportions_2indep (newcomb, agresti-caffo, wald, compare="diff"):
      difference intervals (statsmodels), clipped to [-1, 1] as the engine
      documents. Its "score" method is wrong in 0.13.5 (checks.md), so the
      Miettinen-Nurminen rows come from mn_interval below: an independent
      implementation (restricted maximum likelihood by bisection of the
      likelihood's derivative, bounds by bisection), sharing no code or
      closed form with the engine.
  chi2_contingency(correction=False) and fisher_exact on 2 x 2 tables:
      pairwise p-values (scipy); multipletests (holm, simes-hochberg, fdr_bh,
      bonferroni, sidak): adjusted p-values over the family (statsmodels).
  Table(shift_zeros=False).standardized_resids: adjusted standardized
      residuals of the successes (statsmodels).
  Bayesian rows (post_*), 50-digit mpmath: the posterior mean as a ratio,
      central bounds and P(rate > r) from the incomplete beta function's
      continued fraction (DLMF 8.17.22, modified Lentz) and bisection, highest-density bounds by findroot on the equal-density
      condition, and the beta-binomial predictive tail as an exact sum; each
      NEXT row is also checked against scipy stats.betabinom.sf here. The
      prior and the other inputs ride in the quantity: name|a|b|... .
"""
import csv
import io
import itertools
import multiprocessing
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
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

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


# One-rate cases: (name, successes, attempts). Invented; the ends 0 of n and
# n of n, n = 1, a rare defect and n = 10^6.
ONE_CASES = [
    ("one_zero", 0, 12), ("one_all", 14, 14), ("one_single_pass", 1, 1), ("one_single_fail", 0, 1),
    ("one_mid", 37, 52), ("one_rare", 3, 40000), ("one_million", 999123, 1000000),
]
ONE_METHODS = {"wilson": "wilson", "exact": "beta", "jeffreys": "jeffreys", "agresti_coull": "agresti_coull"}


def row(w, name, x, n, quantity, value, source):
    w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), quantity, fmt(value), source])


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
    """Score (Pearson) p, or None where scipy refuses (an expected count of 0), and Fisher's p."""
    table = [[x1, n1 - x1], [x2, n2 - x2]]
    try:
        score = chi2_contingency(table, correction=False)[1]
    except ValueError:
        score = None
    return score, fisher_exact(table, alternative="two-sided")[1]


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
        row(w, name, x, n, "diff_score_low", low, source)
        row(w, name, x, n, "diff_score_high", high, source)
        score, fisher = pair_p_values(x1, n1, x2, n2)
        if score is not None:
            row(w, name, x, n, "pair_score_p", score, SCIPY + " chi2_contingency(correction=False)")
        row(w, name, x, n, "pair_exact_p", fisher, SCIPY + ' fisher_exact(alternative="two-sided")')


# A tally of five lines for the families of comparisons, and one of twenty
# lots (invented).
FAMILY = ("f_five_lines", [45, 171, 12, 30, 88], [50, 190, 12, 40, 100])
TWENTY = ("f_twenty_lots", [40 + (7 * g) % 11 for g in range(20)], [50 + (3 * g) % 5 for g in range(20)])
ADJUST = {"holm": "holm", "hochberg": "simes-hochberg", "bh": "fdr_bh", "bonferroni": "bonferroni",
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
                        (theirs, SCIPY + (" chi2_contingency(correction=False)" if test == "score"
                                          else " fisher_exact")))


def twenty_rows(w):
    """Holm over all 190 pairs of twenty lots (score test)."""
    name, x, n = TWENTY
    pairs = [(a, b) for a in range(len(x)) for b in range(a + 1, len(x))]
    raw = [pair_p_values(x[a], n[a], x[b], n[b])[0] for a, b in pairs]
    for (a, b), v in zip(pairs, multipletests(raw, method="holm")[1]):
        row(w, name, x, n, "family_score_holm_all_%d_%d" % (a + 1, b + 1), v,
            STATSMODELS + ' multipletests(method="holm") of ' + SCIPY + " chi2_contingency(correction=False)")


RESID_CASES = [
    ("r_four_ovens", [286, 271, 233, 14], [300, 290, 260, 14]),
    ("r_zero_group", [0, 14, 22], [15, 30, 31]),
]


def residual_rows(w):
    for name, x, n in RESID_CASES:
        t = Table(np.array([x, [b - a for a, b in zip(x, n)]]).T, shift_zeros=False)
        for g, v in enumerate(t.standardized_resids[:, 0]):
            row(w, name, x, n, "resid_%d" % (g + 1), v, STATSMODELS + " Table(shift_zeros=False).standardized_resids")


# Posterior cases: (name, successes, attempts, prior_a, prior_b). Invented; no
# successes, all successes, Jeffreys' prior at 0 of n, n = 10^6, a rare
# defect, and a group with no attempts yet (the prior alone).
POST_CASES = [
    ("b_mid", 37, 52, 1.0, 1.0), ("b_zero", 0, 40, 1.0, 1.0), ("b_all", 500, 500, 1.0, 1.0),
    ("b_jeffreys_zero", 0, 20, 0.5, 0.5), ("b_million", 999123, 1000000, 1.0, 1.0),
    ("b_rare", 3, 40000, 1.0, 1.0), ("b_prior_only", 0, 0, 2.0, 3.0),
]
ABOVE_RATES = {"b_mid": [0.5, 0.9], "b_zero": [0.05], "b_all": [0.99, 0.999], "b_jeffreys_zero": [0.01],
               "b_million": [0.999, 0.9992], "b_rare": [0.0001, 0.001], "b_prior_only": [0.4]}
NEXT_CASES = {"b_mid": [(20, 10), (20, 20)], "b_all": [(20, 20), (1000, 1000)], "b_zero": [(10, 1)],
              "b_rare": [(5000, 5)], "b_jeffreys_zero": [(100, 1)], "b_prior_only": [(5, 3)]}


def beta_fraction(a, b, x):
    """The continued fraction of the incomplete beta function (DLMF 8.17.22),
    evaluated by the modified Lentz method; converges for x < (a+1)/(a+b+2).
    mpmath's own betainc does not converge at n = 10^6 (checks.md)."""
    tiny = mpmath.mpf(10) ** -200
    c, d = mpmath.mpf(1), 1 - (a + b) * x / (a + 1)
    d = 1 / (d if abs(d) > tiny else tiny)
    h = d
    for m in range(1, 200000):
        for numerator in (m * (b - m) * x / ((a + 2 * m - 1) * (a + 2 * m)),
                          -(a + m) * (a + b + m) * x / ((a + 2 * m) * (a + 2 * m + 1))):
            d = 1 + numerator * d
            d = 1 / (d if abs(d) > tiny else tiny)
            c = 1 + numerator / c
            c = c if abs(c) > tiny else tiny
            h *= d * c
        if abs(d * c - 1) < mpmath.mpf(10) ** -(mpmath.mp.dps + 2):
            return h
    raise RuntimeError("beta_fraction did not converge")


def mp_cdf(a, b, x):
    """Regularized incomplete beta I_x(a, b) by the continued fraction."""
    if x <= 0:
        return mpmath.mpf(0)
    if x >= 1:
        return mpmath.mpf(1)
    if x > (a + 1) / (a + b + 2):
        return 1 - mp_cdf(b, a, 1 - x)
    front = mpmath.exp(a * mpmath.log(x) + b * mpmath.log1p(-x) - mpmath.log(mpmath.beta(a, b)))
    return front * beta_fraction(a, b, x) / a


def mp_cdf_counts(a, b, x):
    """I_x(a, b) for whole a and b as the binomial tail P(at least a successes
    in a + b - 1 attempts at rate x) (Abramowitz & Stegun 1964, 26.5.24): a
    finite sum of b terms, far quicker than the continued fraction when the
    failures are few; the continued fraction otherwise."""
    if not (a == int(a) and b == int(b) and b <= 200) or x <= 0 or x >= 1:
        return mp_cdf(a, b, x)
    m, a = int(a + b - 1), int(a)
    return mpmath.fsum(mpmath.binomial(m, k) * x ** k * (1 - x) ** (m - k) for k in range(a, m + 1))


def mp_sf(a, b, x):
    """1 - I_x(a, b), computed without cancellation."""
    return mp_cdf(b, a, 1 - x)


def mp_quantile(a, b, q):
    """Bisection on the regularized incomplete beta (slow, certain)."""
    lo, hi = mpmath.mpf(0), mpmath.mpf(1)
    for _ in range(110):
        mid = (lo + hi) / 2
        lo, hi = (mid, hi) if mp_cdf(a, b, mid) < q else (lo, mid)
    return (lo + hi) / 2


def mp_hpd(a, b, level):
    """Highest-density interval: one-sided where the density is monotone, else
    the l where density(l) = density(u(l)), F(u) - F(l) = level."""
    if a <= 1 < b:
        return mpmath.mpf(0), mp_quantile(a, b, level)
    if b <= 1 < a:
        return mp_quantile(a, b, 1 - level), mpmath.mpf(1)

    def log_density(x):
        return (a - 1) * mpmath.log(x) + (b - 1) * mpmath.log1p(-x)

    def gap(l):
        u = mpmath.findroot(lambda t: mp_cdf(a, b, t) - (mp_cdf(a, b, l) + level),
                            mp_quantile(a, b, min(mpmath.mpf(1) - mpmath.mpf(10) ** -25, mp_cdf(a, b, l) + level)))
        return log_density(l) - log_density(u), u

    lo, hi = mpmath.mpf(0), mp_quantile(a, b, 1 - level)
    for _ in range(110):
        mid = (lo + hi) / 2
        lo, hi = (mid, hi) if gap(mid)[0] < 0 else (lo, mid)
    l = (lo + hi) / 2
    return l, gap(l)[1]


def mp_next(a, b, m, k):
    """P(at least k successes in m further attempts), the beta-binomial sum."""
    log_norm = mpmath.log(mpmath.beta(a, b))
    return mpmath.fsum(mpmath.binomial(m, x) * mpmath.exp(mpmath.log(mpmath.beta(x + a, m - x + b)) - log_norm)
                       for x in range(k, m + 1))


def posterior_rows(w):
    mpmath.mp.dps = 50
    source = "mpmath " + mpmath.__version__ + " (50 digits; this file)"
    for name, x, n, pa, pb in POST_CASES:
        a, b = mpmath.mpf(pa) + x, mpmath.mpf(pb) + n - x
        tag = "|%s|%s" % (fmt(pa), fmt(pb))
        row(w, name, [x], [n], "post_mean" + tag, float(a / (a + b)), source)
        row(w, name, [x], [n], "post_central_low" + tag, float(mp_quantile(a, b, mpmath.mpf("0.025"))), source)
        row(w, name, [x], [n], "post_central_high" + tag, float(mp_quantile(a, b, mpmath.mpf("0.975"))), source)
        if not (a < 1 and b < 1):
            low, high = mp_hpd(a, b, mpmath.mpf("0.95"))
            row(w, name, [x], [n], "post_hpd_low" + tag, float(low), source)
            row(w, name, [x], [n], "post_hpd_high" + tag, float(high), source)
        for r in ABOVE_RATES[name]:
            p = mp_sf(a, b, mpmath.mpf(r))
            row(w, name, [x], [n], "post_above" + tag + "|" + fmt(r), float(p), source)
        for t in ("0", "0.01", "0.5", "0.9", "0.999", "1"):
            x_t = mpmath.mpf(t)
            if (x_t == 0 and a < 1) or (x_t == 1 and b < 1):
                continue  # infinite there
            d = mpmath.mpf(0) if (x_t == 0 and a > 1) or (x_t == 1 and b > 1) else (
                x_t ** (a - 1) * (1 - x_t) ** (b - 1) / mpmath.beta(a, b))
            row(w, name, [x], [n], "post_density" + tag + "|" + t, float(d), source)
        for m, k in NEXT_CASES.get(name, []):
            p = mp_next(a, b, m, k)
            sp = scipy.stats.betabinom.sf(k - 1, m, float(a), float(b))
            # scipy's sum is good to about 1e-8 relative here (measured: 1.2e-8 at b_rare).
            assert abs(float(p) - sp) <= 1e-7 * max(float(p), 1e-300) + 1e-13, (name, m, k, float(p), sp)
            row(w, name, [x], [n], "post_next" + tag + "|%d|%d" % (m, k), float(p),
                source + "; agrees with " + SCIPY + " stats.betabinom.sf")


# Comparisons of groups (flat prior unless named): (name, successes, attempts).
COMPARE_CASES = [
    ("c_pilot_vs_oven", [14, 286], [14, 300]), ("c_mid", [37, 45], [52, 50]), ("c_far", [3, 95], [100, 100]),
    ("c_ovens", [286, 271, 233, 14], [300, 290, 260, 14]), ("c_six", [9, 12, 7, 15, 11, 10], [20, 20, 20, 20, 20, 20]),
    ("c_million", [999123, 998800], [1000000, 1000000]),
    # Twelve lines and twenty lots (G = 12 and 20): BEST and LOSS for the
    # first group and the one with the highest rate.
    ("c_twelve", [101, 108, 96, 112, 105, 99, 110, 103, 107, 94, 111, 100],
     [120, 118, 125, 122, 119, 121, 124, 117, 123, 120, 126, 118]),
    ("c_twenty", [478, 485, 490, 481, 488, 493, 476, 484, 489, 491, 480, 487, 494, 483, 486, 479, 492, 482, 490, 488],
     [500] * 20),
]


def mp_ahead_sum(a1, b1, a2, b2):
    """P(X > Y), X ~ Beta(a1, b1), Y ~ Beta(a2, b2), a1 a whole number: the
    finite sum of Cook (2005, "Exact calculation of beta inequalities", UT MD
    Anderson Cancer Center technical report), in mpmath at the working precision."""
    lb = lambda a, b: mpmath.log(mpmath.beta(a, b))
    return mpmath.fsum(mpmath.exp(lb(a2 + i, b1 + b2) - lb(1 + i, b1) - lb(a2, b2)) / (b1 + i)
                       for i in range(int(a1)))


def mp_ahead_quad(x, y):
    """P(X > Y) by mpmath.quad of f_X F_Y over [0, 1] with breakpoints around
    the integrand's peak, found on a grid: its mass can sit far in X's tail.
    mpmath's error estimate (the change between its last two degrees, far
    above the true error) must stay below 1e-3 of the value."""
    f = lambda t: mp_density(*x, t) * mp_cdf(*y, t)
    grid = [mpmath.mpf(k) / 200 for k in range(1, 200)]
    peak = max(grid, key=f)
    points = sorted({mpmath.mpf(0), mpmath.mpf(1)} |
                    {peak + d for d in (-0.2, -0.1, -0.05, -0.02, 0, 0.02, 0.05, 0.1, 0.2) if 0 < peak + d < 1})
    value, error = mpmath.quad(f, points, error=True, maxdegree=10)
    assert error < 1e-3 * value, (x, y, value, error)
    return value


def mp_window(a, b, sds=14):
    m = a / (a + b)
    sd = mpmath.sqrt(a * b / ((a + b) ** 2 * (a + b + 1)))
    return max(mpmath.mpf(0), m - sds * sd), min(mpmath.mpf(1), m + sds * sd)


def mp_density(a, b, x):
    return mpmath.exp((a - 1) * mpmath.log(x) + (b - 1) * mpmath.log1p(-x) - mpmath.log(mpmath.beta(a, b)))


def mp_best(laws, i):
    """P(law i is the highest), mpmath.quad of f_i prod F_j over law i's window."""
    a, b = laws[i]
    lo, hi = mp_window(a, b, 20)
    mode = (a - 1) / (a + b - 2) if a > 1 and b > 1 else (lo + hi) / 2
    f = lambda x: mp_density(a, b, x) * mpmath.fprod(mp_cdf_counts(c, d, x) for k, (c, d) in enumerate(laws) if k != i)
    return mpmath.quad(f, [lo, max(lo, min(hi, mode)), hi])


def mp_expected_max(laws):
    lo = min(mp_window(a, b, 20)[0] for a, b in laws)
    hi = max(mp_window(a, b, 20)[1] for a, b in laws)
    means = sorted(a / (a + b) for a, b in laws)
    f = lambda x: 1 - mpmath.fprod(mp_cdf_counts(a, b, x) for a, b in laws)
    return lo + mpmath.quad(f, [lo] + [m for m in means if lo < m < hi] + [hi])


def mp_same(x, n, pa, pb, prior_same):
    lb = lambda a, b: mpmath.loggamma(a) + mpmath.loggamma(b) - mpmath.loggamma(a + b)
    together = lb(pa + sum(x), pb + sum(n) - sum(x)) - lb(pa, pb)
    apart = mpmath.fsum(lb(pa + xi, pb + ni - xi) - lb(pa, pb) for xi, ni in zip(x, n))
    log_odds = mpmath.log(prior_same) - mpmath.log(1 - prior_same) + together - apart
    return 1 / (1 + mpmath.exp(-log_odds))


def mp_difference_quantile(x, y, q):
    """The d with P(X - Y <= d) = q: mpmath.quad of f_Y(t) F_X(t + d), split
    where t + d meets 0 or 1, and a bracketing findroot around a normal guess."""
    (a1, b1), (a2, b2) = x, y

    def cdf(d):
        lo, hi = mp_window(a2, b2, 20)
        pts = sorted({lo, hi, a2 / (a2 + b2)} | {c for c in (-d, 1 - d) if lo < c < hi})
        return mpmath.quad(lambda t: mp_density(a2, b2, t) * mp_cdf(a1, b1, t + d), pts)

    m = a1 / (a1 + b1) - a2 / (a2 + b2)
    sd = mpmath.sqrt(a1 * b1 / ((a1 + b1) ** 2 * (a1 + b1 + 1)) + a2 * b2 / ((a2 + b2) ** 2 * (a2 + b2 + 1)))
    guess = m + sd * mpmath.sqrt(2) * mpmath.erfinv(2 * q - 1)
    # A bracket around the normal guess, kept inside (-1, 1); the Anderson-
    # Bjoerck method stays inside its bracket.
    a, b = max(guess - 4 * sd, mpmath.mpf(-1) + mpmath.mpf(10) ** -20), min(guess + 4 * sd, mpmath.mpf(1))
    assert cdf(a) < q < cdf(b), (x, y, q)
    return mpmath.findroot(lambda d: cdf(d) - q, (a, b), solver="anderson", tol=1e-28, maxsteps=60, verify=False)


def comparison_rows(w, large=False):
    """The cases of up to 6 groups, or (large) those of 12 and 20."""
    mpmath.mp.dps = 50
    source = "mpmath " + mpmath.__version__ + " (50 digits; this file)"
    for name, x, n in COMPARE_CASES:
        if (len(x) >= 12) != large:
            continue
        laws = [(mpmath.mpf(1) + xi, mpmath.mpf(1) + ni - xi) for xi, ni in zip(x, n)]
        (a1, b1), (a2, b2) = laws[0], laws[1]
        if name == "c_million":
            lo, hi = mp_window(a1, b1, 20)
            p = mpmath.quad(lambda t: mp_density(a1, b1, t) * mp_cdf(a2, b2, t), [lo, a1 / (a1 + b1), hi])
            how = source + ": quad of f_1 F_2, incomplete beta by continued fraction"
        else:
            p = mp_ahead_sum(a1, b1, a2, b2)
            how = source + ": the finite sum of Cook (2005)"
        row(w, name, x, n, "post_ahead|1|1|1|2", float(p), how)
        if name in ("c_mid", "c_pilot_vs_oven"):
            for q, end in (("0.025", "low"), ("0.975", "high")):
                d = mp_difference_quantile(laws[0], laws[1], mpmath.mpf(q))
                row(w, name, x, n, "post_diff_%s|1|1|1|2" % end, float(d),
                    source + ": quad of f_2 F_1(t + d) and a bracketing root search")
        if name in ("c_mid", "c_far"):
            # Jeffreys' prior: parameters not whole, so the engine integrates.
            j1, j2 = [(mpmath.mpf("0.5") + xi, mpmath.mpf("0.5") + ni - xi) for xi, ni in zip(x, n)]
            pj = mp_ahead_quad(j1, j2)
            row(w, name, x, n, "post_ahead|0.5|0.5|1|2", float(pj),
                source + ": quad of f_1 F_2, incomplete beta by continued fraction")
        if len(laws) > 2 or name == "c_mid":
            chosen = range(len(laws))
            if len(laws) >= 12:
                # Two groups only: each integral multiplies 11 or 19 CDFs and
                # takes seconds in mpmath.
                chosen = [0, max(range(len(laws)), key=lambda k: x[k] / n[k])]
            for i in chosen:
                row(w, name, x, n, "post_best|1|1|%d" % (i + 1), float(mp_best(laws, i)),
                    source + ": quad of f_i prod F_j")
            e_max = mp_expected_max(laws)
            for i in chosen:
                a, b = laws[i]
                row(w, name, x, n, "post_loss|1|1|%d" % (i + 1), float(e_max - a / (a + b)),
                    source + ": quad of 1 - prod F_j")
        if name == "c_ovens":
            # Jeffreys' prior with a fifth oven not yet run: its posterior is the
            # U-shaped prior itself, infinite at 0 and 1.
            jx, jn = x[:2] + [0], n[:2] + [0]
            jl = [(mpmath.mpf("0.5") + xi, mpmath.mpf("0.5") + ni - xi) for xi, ni in zip(jx, jn)]
            e_max = mp_expected_max(jl)
            for i in range(3):
                row(w, "c_new_oven", jx, jn, "post_best|0.5|0.5|%d" % (i + 1), float(mp_best(jl, i)),
                    source + ": quad of f_i prod F_j")
                row(w, "c_new_oven", jx, jn, "post_loss|0.5|0.5|%d" % (i + 1),
                    float(e_max - jl[i][0] / (jl[i][0] + jl[i][1])), source + ": quad of 1 - prod F_j")
        for prior_same in ("0.5", "0.9"):
            row(w, name, x, n, "post_same|1|1|" + prior_same, float(mp_same(x, n, 1, 1, mpmath.mpf(prior_same))),
                source + ": marginal likelihoods by loggamma")


# ---- planning (plan_*): the answer is a whole number, found here by direct
# search with the reference libraries, never by the engine's own shortcuts.
# Targets invented; the two published values are pinned in test_planning.cpp.
DEMO_CASES = [  # (rate, confidence, failures allowed)
    ("0.99", "0.95", 0), ("0.9", "0.9", 0), ("0.999", "0.95", 0), ("0.95", "0.8", 0), ("0.5", "0.75", 0),
    ("0.99", "0.95", 1), ("0.99", "0.95", 3), ("0.999", "0.9", 2), ("0.9", "0.99", 10), ("0.9999", "0.95", 1),
]


def demo_rows(w):
    for r, c, f in DEMO_CASES:
        rate, conf = float(r), float(c)
        if f == 0:
            # Success-run formula in 50-digit mpmath: the smallest n with n ln R <= ln(1 - C).
            mpmath.mp.dps = 50
            n = int(mpmath.ceil(mpmath.log(1 - mpmath.mpf(c)) / mpmath.log(mpmath.mpf(r))))
            assert rate ** n <= 1 - conf < rate ** (n - 1)
            source = "success-run formula ln(1 - C) / ln(R) in mpmath " + mpmath.__version__ + " (50 digits)"
        else:
            # Every n from f + 1 up: the first whose binomial tail P(at most f failures) is at most 1 - C.
            ns = np.arange(f + 1, 10 ** 6)
            tails = scipy.stats.binom.cdf(f, ns, 1 - rate)
            n = int(ns[np.argmax(tails <= 1 - conf)])
            assert tails[n - f - 1] <= 1 - conf < tails[n - f - 2]
            source = SCIPY + " stats.binom.cdf, every n from f + 1 up"
        row(w, "demo", [], [], "plan_demo|%s|%s|%d" % (r, c, f), n, source)


WIDTH_CASES = [  # (expected rate, half-width, level)
    ("0.5", "0.03", "0.95"), ("0.9", "0.02", "0.95"), ("0.97", "0.01", "0.95"), ("0.02", "0.01", "0.9"),
    ("0", "0.05", "0.95"), ("1", "0.01", "0.99"), ("0.3", "0.1", "0.8"), ("0.999", "0.002", "0.95"),
    ("0.003", "0.002", "0.95"),
]


def width_rows(w):
    for r, e, lv in WIDTH_CASES:
        rate, half, level = float(r), float(e), float(lv)
        ns = np.arange(1, 10001)
        xs = np.floor(rate * ns + 0.5)
        for ours, theirs in ONE_METHODS.items():
            low, high = proportion_confint(xs, ns, alpha=1 - level, method=theirs)
            low, high = np.clip(low, 0, 1), np.clip(high, 0, 1)
            if ours == "jeffreys":
                low, high = np.where(xs == 0, 0.0, low), np.where(xs == ns, 1.0, high)
            widths = (high - low) / 2
            n = int(ns[np.argmax(widths <= half)])
            assert widths[n - 1] <= half and np.all(widths[: n - 1] > half)
            row(w, "width", [], [], "plan_width|%s|%s|%s|%s" % (r, e, lv, ours), n,
                STATSMODELS + ' proportion_confint(method="%s") at round(rate n), every n from 1 up' % theirs)


POWER_CASES = [  # (rate_1, rate_2, power, alpha)
    ("0.1", "0.15", "0.8", "0.05"), ("0.9", "0.95", "0.9", "0.05"), ("0.5", "0.6", "0.8", "0.01"),
    ("0.98", "0.995", "0.8", "0.05"), ("0.2", "0.05", "0.95", "0.1"), ("0", "1", "0.8", "0.05"),
]


def power_rows(w):
    """Fleiss, Levin & Paik (2003) and the continuity correction of Fleiss,
    Tytun & Ury (1980), in 50-digit mpmath with the normal quantile by
    mpmath.erfinv; each answer is then checked by its power at n and n - 1."""
    from statsmodels.stats.power import NormalIndPower
    mpmath.mp.dps = 50
    z = lambda q: mpmath.sqrt(2) * mpmath.erfinv(2 * q - 1)
    phi = lambda x: (1 + mpmath.erf(x / mpmath.sqrt(2))) / 2
    for a, b, pw, al in POWER_CASES:
        p1, p2, power, alpha = (mpmath.mpf(v) for v in (a, b, pw, al))
        d, pbar = abs(p1 - p2), (p1 + p2) / 2
        s0, s1 = mpmath.sqrt(2 * pbar * (1 - pbar)), mpmath.sqrt(p1 * (1 - p1) + p2 * (1 - p2))
        za, zb = z(1 - alpha / 2), z(power)
        n0 = ((za * s0 + zb * s1) / d) ** 2
        nc = n0 / 4 * (1 + mpmath.sqrt(1 + 4 / (n0 * d))) ** 2
        for corr, n_real, c in (("none", n0, 0), ("continuity", nc, 1)):
            n = max(1, int(mpmath.ceil(n_real)))
            power_at = lambda m: phi((mpmath.sqrt(m) * d - c / mpmath.sqrt(m) - za * s0) / s1) if s1 else (
                1 if mpmath.sqrt(m) * d - c / mpmath.sqrt(m) - za * s0 > 0 else 0)
            assert power_at(n) >= power and (n == 1 or power_at(n - 1) < power), (a, b, corr)
            row(w, "power", [], [], "plan_power|%s|%s|%s|%s|%s" % (a, b, pw, al, corr), n,
                "Fleiss, Levin & Paik (2003) / Fleiss, Tytun & Ury (1980) formula in mpmath " + mpmath.__version__ +
                " (50 digits), power checked at n and n - 1")
        if s1:
            # For comparison only: statsmodels' NormalIndPower takes one
            # standardized effect and one variance for both hypotheses. With
            # the pooled effect |p1 - p2| / sqrt(pbar qbar) it uses 2 pbar qbar
            # where Fleiss uses p1 q1 + p2 q2 under the alternative.
            es = float(d / mpmath.sqrt(pbar * (1 - pbar)))
            n_sm = NormalIndPower().solve_power(effect_size=es, alpha=float(alpha), power=float(power), ratio=1.0)
            row(w, "power", [], [], "plan_power_pooled|%s|%s|%s|%s" % (a, b, pw, al), float(n_sm),
                STATSMODELS + " NormalIndPower.solve_power, effect |p1 - p2| / sqrt(pbar qbar) (pooled variance)")


AHEAD_PLAN_CASES = [  # (pilot successes, pilot attempts, other successes, other attempts, confidence, prior)
    (14, 14, 286, 300, "0.95", 1), (14, 14, 286, 300, "0.8", 1), (0, 0, 95, 100, "0.9", 1),
    (20, 21, 970, 1000, "0.95", 1), (30, 30, 990000, 1000000, "0.95", 1), (5, 5, 9, 10, "0.99", 1),
    (50, 50, 48, 50, "0.6", 1),
]


def mp_ahead_mirrored(x, y):
    """P(X > Y) = 1 - P(1 - X > 1 - Y), the second by the finite sum of Cook
    (2005) over 1 - X's first parameter (X's failures + prior_b)."""
    (a1, b1), (a2, b2) = x, y
    return 1 - mp_ahead_sum(b1, a1, b2, a2)


def ahead_plan_rows(w):
    mpmath.mp.dps = 50
    source = "mpmath " + mpmath.__version__ + " (50 digits): the finite sum of Cook (2005); P checked at m and m - 1"
    for s1, n1, s2, n2, c, prior in AHEAD_PLAN_CASES:
        conf = mpmath.mpf(c)
        other = (mpmath.mpf(prior) + s2, mpmath.mpf(prior) + n2 - s2)
        p = lambda m: mp_ahead_mirrored((mpmath.mpf(prior) + s1 + m, mpmath.mpf(prior) + n1 - s1), other)
        m = 0
        if p(0) < conf:  # doubling, then bisection on the smallest m with p(m) >= conf
            high = 1
            while p(high) < conf:
                high *= 2
            low = high // 2 + 1 if high > 1 else 1
            while low < high:
                mid = (low + high) // 2
                low, high = (low, mid) if p(mid) >= conf else (mid + 1, high)
            m = low
        assert p(m) >= conf and (m == 0 or p(m - 1) < conf)
        row(w, "plan_ahead", [s1, s2], [n1, n2], "plan_ahead|%d|%d|%s" % (prior, prior, c), m, source)


SECTIONS = ["chi_rows", "exact_rows", "trend_rows", "one_rate_rows", "pair_rows", "family_rows", "twenty_rows",
            "residual_rows", "posterior_rows", "comparison_rows", "comparison_rows_large", "demo_rows", "width_rows",
            "power_rows", "ahead_plan_rows"]


def comparison_rows_large(w):
    comparison_rows(w, large=True)


def section_text(name):
    """One section's rows as text. Every section that uses mpmath sets its
    own precision, so the sections can run in any order, in parallel."""
    buf = io.StringIO()
    globals()[name](csv.writer(buf, lineterminator="\n"))
    return buf.getvalue()


def main():
    sys.stdout.write("case,successes,attempts,quantity,value,source\n")
    # Two processes (the machine's two cores): the file is the same as in
    # one, the sections joined in their fixed order.
    with multiprocessing.get_context("fork").Pool(2) as pool:
        for text in pool.map(section_text, SECTIONS, chunksize=1):
            sys.stdout.write(text)


if __name__ == "__main__":
    main()
