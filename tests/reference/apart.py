#!/usr/bin/python3
"""Reference values for the decision limits of the apart family (which groups
stand apart from the whole), from libraries outside the project.

    /usr/bin/python3 tests/reference/apart.py > tests/reference/apart.csv

Quantity: apart|method|family|target|spread|level|i|end, end "low" or "high"
(the limit as a rate), target "none" for the tally's own rate.

Sources:
  normal limits: scipy norm.isf for h (Sidak's tail (1 - level^(1/k))/2 for
      family "all"), sigma from the formulas of Nelson (1982) and of the
      p-chart, Laney's (2002) sigma_z recomputed in numpy;
  exact limits of one group (family "each", or any family with a target):
      scipy binom.cdf / binom.sf searched over every count;
  exact limits of every group at once without a target: the marginals from
      scipy hypergeom, and the probability that every group stays inside its
      limits by brute-force enumeration of every table with the tally's margins
      (small tallies only), the largest tail that holds them at the level.
"""
import itertools
import math
import sys

import numpy as np
import scipy
import scipy.stats

sys.path.insert(0, __file__.rsplit("/", 1)[0])
from reference_common import SCIPY, row, write_sections  # noqa: E402

# Invented tallies: the sample sheet's ovens; twelve supplier lots of mixed
# sizes; twenty days of one line; two small tallies for the enumeration.
CASES = [
    ("a_ovens", [286, 271, 233, 14], [300, 290, 260, 14]),
    ("a_lots", [96, 188, 47, 290, 141, 95, 480, 12, 230, 77, 143, 190],
     [100, 200, 50, 300, 150, 100, 500, 15, 240, 80, 150, 200]),
    ("a_days", [238, 245, 229, 251, 240, 236, 249, 231, 244, 226, 250, 239, 247, 233, 242, 222, 246, 241, 235, 248],
     [250, 255, 246, 260, 252, 249, 258, 247, 255, 245, 259, 251, 257, 248, 254, 246, 256, 252, 249, 258]),
    ("a_small", [3, 9, 5, 12], [8, 10, 9, 12]),
    ("a_three", [1, 6, 9], [5, 8, 10]),
]
LEVELS = ["0.95", "0.9973"]


def sidak_tail(level, k):
    return -math.expm1(math.log(level) / k) / 2


def normal_limits(x, n, level, family, target, spread):
    k, big_n = len(x), sum(n)
    c = target if target is not None else sum(x) / big_n
    tail = (1 - level) / 2 if family == "each" else sidak_tail(level, k)
    h = scipy.stats.norm.isf(tail)
    standard = target is not None or family == "each"
    sigma = np.array([math.sqrt(c * (1 - c) / ni) if standard else math.sqrt(c * (1 - c) * (big_n - ni) / (big_n * ni))
                      for ni in n])
    factor = 1.0
    if spread == "time":
        z = (np.array(x) / np.array(n) - c) / sigma
        factor = float(np.mean(np.abs(np.diff(z)))) / 1.128
    return [(max(0.0, c - h * factor * s), min(1.0, c + h * factor * s)) for s in sigma]


def binomial_counts(ni, c, tail):
    xs = np.arange(ni + 1)
    cdf = scipy.stats.binom.cdf(xs, ni, c)
    at_least = scipy.stats.binom.sf(xs - 1, ni, c)
    return int(xs[np.argmax(cdf >= tail)]), int(xs[np.nonzero(at_least >= tail)[0][-1]])


def exact_standard_limits(x, n, level, family, target):
    k = len(x)
    c = target if target is not None else sum(x) / sum(n)
    tail = (1 - level) / 2 if family == "each" else sidak_tail(level, k)
    return [tuple(v / ni for v in binomial_counts(ni, c, tail)) for ni in n]


def exact_joint_limits(x, n, level):
    """Every group at once, no target: brute force over the tables."""
    k, big_n, s = len(x), sum(n), sum(x)
    laws = [scipy.stats.hypergeom(big_n, s, ni) for ni in n]
    supports = [np.arange(max(0, ni - (big_n - s)), min(ni, s) + 1) for ni in n]
    cdfs = [law.cdf(sup) for law, sup in zip(laws, supports)]
    sfs = [law.sf(sup - 1) for law, sup in zip(laws, supports)]
    widest, narrowest = sidak_tail(level, k), (1 - level) / 2
    candidates = sorted({widest, narrowest} | {float(v) for arr in cdfs + sfs for v in arr if widest < v < narrowest})

    def regions(t):
        out = []
        for sup, cdf, sf in zip(supports, cdfs, sfs):
            out.append((int(sup[np.argmax(cdf >= t)]), int(sup[np.nonzero(sf >= t)[0][-1]])))
        return out

    # Every table with these margins and its probability prod C(n_i, x_i) / C(N, S).
    tables = [t for t in itertools.product(*[range(len(sup)) for sup in supports[:-1]])]
    log_total = math.lgamma(big_n + 1) - math.lgamma(s + 1) - math.lgamma(big_n - s + 1)
    joint = []
    for idx in tables:
        xs = [int(supports[g][i]) for g, i in enumerate(idx)]
        last = s - sum(xs)
        if not (supports[-1][0] <= last <= supports[-1][-1]):
            continue
        xs.append(last)
        logp = sum(math.lgamma(ni + 1) - math.lgamma(xi + 1) - math.lgamma(ni - xi + 1) for ni, xi in zip(n, xs))
        joint.append((xs, math.exp(logp - log_total)))
    assert abs(sum(p for _, p in joint) - 1) < 1e-9

    def inside(t):
        reg = regions(t)
        return sum(p for xs, p in joint if all(a <= xi <= b for xi, (a, b) in zip(xs, reg)))

    chosen = widest
    if inside(widest) >= level:
        chosen = max(t for t in candidates if inside(t) >= level)
    return [(a / ni, b / ni) for (a, b), ni in zip(regions(chosen), n)]


def limit_rows(w):
    for name, x, n in CASES:
        for lv in LEVELS:
            level = float(lv)
            combos = [("normal", "all", None, "none"), ("normal", "each", None, "none"),
                      ("normal", "each", 0.95, "none"), ("normal", "all", 0.95, "none"),
                      ("normal", "each", None, "time"), ("exact", "each", None, "none"),
                      ("exact", "each", 0.95, "none"), ("exact", "all", 0.95, "none")]
            if name in ("a_small", "a_three", "a_ovens"):
                combos.append(("exact", "all", None, "none"))
            for how, family, target, spread in combos:
                if how == "normal":
                    lims = normal_limits(x, n, level, family, target, spread)
                    source = SCIPY + " norm.isf; Nelson (1982) / p-chart sigma" + (
                        "; Laney (2002) sigma_z in numpy" if spread == "time" else "")
                elif target is not None or family == "each":
                    lims = exact_standard_limits(x, n, level, family, target)
                    source = SCIPY + " binom.cdf / binom.sf over every count"
                else:
                    lims = exact_joint_limits(x, n, level)
                    source = SCIPY + " hypergeom marginals; every table with the margins enumerated"
                for i, (low, high) in enumerate(lims):
                    tag = "apart|%s|%s|%s|%s|%s|%d" % (how, family, "none" if target is None else repr(target),
                                                       spread, lv, i + 1)
                    row(w, name, x, n, tag + "|low", low, source)
                    row(w, name, x, n, tag + "|high", high, source)


# Prior fits (beta-binomial, Williams 1975): invented tallies that vary
# beyond counting (twelve lots of 8, twenty suppliers of mixed sizes), and
# the twenty days of a_days, and eight lots more alike than counting allows
# (the fit runs off: the engine stops at a + b = 10^6).
FIT_CASES = [
    ("f_spread_lots", [8, 2, 7, 8, 1, 6, 8, 3, 7, 8, 2, 8], [8] * 12),
    ("f_suppliers", [95, 88, 190, 45, 99, 260, 70, 140, 48, 97, 188, 91, 290, 60, 75, 148, 39, 99, 181, 120],
     [100, 100, 200, 50, 100, 300, 80, 150, 50, 100, 200, 100, 300, 70, 80, 150, 40, 100, 200, 130]),
    ("f_days", CASES[2][1], CASES[2][2]),
    ("f_even", [47, 48, 47, 48, 47, 48, 47, 48], [50] * 8),
]


def bb_loglik(params, x, n):
    a, b = math.exp(params[0]), math.exp(params[1])
    return float(np.sum(scipy.stats.betabinom.logpmf(x, n, a, b)))


def fit_rows(w):
    from scipy.optimize import minimize
    for name, x, n in FIT_CASES:
        x, n = np.array(x), np.array(n)
        p = x.sum() / n.sum()
        starts = [(math.log(p * m), math.log((1 - p) * m)) for m in (1.0, 10.0, 100.0, 1000.0)]
        best = None
        for start in starts:
            res = minimize(lambda v: -bb_loglik(v, x, n), start, method="Nelder-Mead",
                           options={"xatol": 1e-10, "fatol": 1e-12, "maxiter": 20000, "maxfev": 40000})
            if best is None or res.fun < best.fun:
                best = res
        a, b = math.exp(best.x[0]), math.exp(best.x[1])
        source = SCIPY + " betabinom.logpmf maximised by optimize.minimize (Nelder-Mead, four starts)"
        if a + b > 1e6:  # no spread beyond counting: the fit runs off; the engine stops at a + b = 10^6
            row(w, name, list(x), list(n), "prior_fit_capped", 1.0, source + ": a + b beyond 10^6")
            row(w, name, list(x), list(n), "prior_fit_mean", p, "the pooled rate (the mean of a fit that runs off)")
            continue
        row(w, name, list(x), list(n), "prior_fit_a", a, source)
        row(w, name, list(x), list(n), "prior_fit_b", b, source)
        row(w, name, list(x), list(n), "prior_fit_loglik", -best.fun, source + ": the log-likelihood at the best")


def spiegelhalter(ni, c, p):
    """Spiegelhalter (2005), appendix (from memory [M]): r the smallest count
    with F(r) >= p, alpha = (F(r) - p) / P(r), the limit (r - alpha) / n."""
    xs = np.arange(ni + 1)
    cdf = scipy.stats.binom.cdf(xs, ni, c)
    r = int(xs[np.argmax(cdf >= p)])
    alpha = (cdf[r] - p) / scipy.stats.binom.pmf(r, ni, c)
    return min(1.0, max(0.0, (r - alpha) / ni))


def funnel_rows(w):
    """RATES.APART.CURVE: the ovens around their own rate and the lots
    around a target of 0.95, 12 sizes each, levels 0.95 and 0.998."""
    for name, x, n, target in (("a_ovens", CASES[0][1], CASES[0][2], None), ("a_lots", CASES[1][1], CASES[1][2], 0.95)):
        c = target if target is not None else sum(x) / sum(n)
        for lv in ("0.95", "0.998"):
            tail = (1 - float(lv)) / 2
            lo, hi = math.log(min(n)), math.log(max(n))
            for k in range(12):
                ni = int(round(math.exp(lo + k / 11 * (hi - lo))))
                for end, p in (("low", tail), ("high", 1 - tail)):
                    row(w, name, x, n, "curve|%s|%s|12|%d|%s" % (lv, "none" if target is None else repr(target), k + 1,
                                                                end),
                        spiegelhalter(ni, c, p), SCIPY + " binom.cdf / binom.pmf, Spiegelhalter (2005) interpolation")
                row(w, name, x, n, "curve|%s|%s|12|%d|n" % (lv, "none" if target is None else repr(target), k + 1), ni,
                    "the k-th of 12 sizes evenly in log n, rounded")


SECTIONS = ['limit_rows', 'fit_rows', 'funnel_rows']


if __name__ == "__main__":
    write_sections(SECTIONS)
