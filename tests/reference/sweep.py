#!/usr/bin/python3
"""Property sweeps: seeded random tallies from the whole plausible input space,
each answer computed here by a method that shares no code with the engine.

Writes sweep.csv (family, case, successes, attempts, quantity, value, source).
tests/engine/test_sweep.cpp feeds every row to the engine. Run with Debian's
/usr/bin/python3:

    /usr/bin/python3 tests/reference/sweep.py > tests/reference/sweep.csv

The space: 2 to 30 groups (the Bayesian references 2 to 12, the
invariants of test_sweep.cpp up to 30); 1 to 10^7 attempts per group, mixed
within one tally (log-uniform); rates anywhere, near 0 and 1, x = 0 and x = n;
priors 0.05 to 100 besides the flat and Jeffreys' ones; levels 0.5 to 0.9999;
both goals. The seed is fixed, so the file is the same at every run.

References (each row names its own):
  Bayesian comparisons: P(best) of every group by its definition, the
      integral of f_i prod_{j != i} C_j over the rate axis, and E[best] by the
      order-statistic sum over i of the integral of t f_i prod_{j != i} C_j
      (the engine integrates 1 - prod C_j instead); a fixed composite
      Gauss-Legendre rule (numpy nodes, 20 a piece) on each half of the axis
      in the distance to its end, pieces cut at every law's mean +- 0.25 to 40
      sd and, for a law with a parameter below 1, at every decade next to
      that end, a power substitution on the end piece where the smallest
      parameter there is not a whole number; scipy.stats.beta's
      pdf, cdf and sf (Boost.Math inside scipy; 50-digit mpmath for a
      density's constant where Boost overflows). Each tally is recomputed
      with 40 nodes a piece and left out if the two differ by more than 1e-11
      (about one tally in ten). P(ahead) and the prediction are P(best) of
      two laws, settled the same way; the prediction is P(rate > Y) with
      Y ~ Beta(k, m - k + 1), the binomial tail as an incomplete beta.
      Spot check: Beta(5.384, 0.076) against Beta(645.384, 0.076) gives
      0.3481669364523, mpmath's tanh-sinh quadrature at 30 digits
      0.348166936452285.
      Not scipy.special.betainc / betaincinv: those Cephes routines are wrong
      for large parameters in scipy 1.10 (betainc gives 0.7317 instead of
      0.5000 for Beta(70041586, 210124759) at 0.25, where an exact 30-digit
      binomial sum in mpmath gives 0.500022934549111, as does Boost.Math),
      and scipy.stats.beta.ppf aborts the process for some extreme laws.
  The prediction for m <= 2000 also from scipy.stats.betabinom.sf (checked
      against the quadrature here).
  Credible bounds: Brent's root (scipy.optimize.brentq, rtol 1e-15) of
      scipy.stats.beta.cdf.
  One-rate and difference intervals, pair p-values, family adjustments,
      chi-square and likelihood-ratio tests, residuals: scipy and statsmodels
      as in pairs.py (the Miettinen-Nurminen interval from pairs.py's
      independent bisection).
  Planning: the smallest n by direct search over every n with scipy's
      binomial law (demonstration) and statsmodels' intervals (width), the
      power formula at 50 digits with mpmath.
"""
import csv
import math
from fractions import Fraction
import sys
import warnings

import mpmath
import numpy as np
import scipy
import scipy.optimize
import scipy.stats
import statsmodels
from scipy.stats import chi2_contingency
from statsmodels.stats.contingency_tables import Table
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

sys.path.insert(0, __file__.rsplit("/", 1)[0])
from pairs import SCORE_SOURCE, fm_p, mn_interval, pair_p_values  # noqa: E402
from apart import exact_joint_limits as apart_joint, normal_limits as apart_normal  # noqa: E402  (independent implementations)

SCIPY = "scipy " + scipy.__version__
STATSMODELS = "statsmodels " + statsmodels.__version__
QUAD = "rate-axis Gauss-Legendre (sweep.py) with " + SCIPY + " stats.beta pdf/cdf/sf"
RNG = np.random.default_rng(20261205)
CASES = 300  # per family


def fmt(v):
    return repr(float(v))


def out(w, family, case, x, n, quantity, value, source):
    w.writerow([family, case, " ".join(map(str, x)), " ".join(map(str, n)), quantity, fmt(value), source])


# ---- the space of tallies ----

def attempts(g):
    """Mixed sizes within one tally: log-uniform from 1 to 10^7, some equal."""
    if RNG.random() < 0.2:
        return [int(10 ** RNG.uniform(0, 5))] * g
    return [int(10 ** RNG.uniform(0, 7)) for _ in range(g)]


def successes(n):
    kind = RNG.random()
    if kind < 0.1:
        return 0
    if kind < 0.2:
        return n
    if kind < 0.35:
        p = 10 ** RNG.uniform(-4, -1)  # near 0
    elif kind < 0.5:
        p = 1 - 10 ** RNG.uniform(-4, -1)  # near 1
    else:
        p = RNG.uniform(0.02, 0.98)
    return int(RNG.binomial(n, p))


def tally(g_low, g_high):
    g = int(RNG.integers(g_low, g_high + 1))
    n = attempts(g)
    return [successes(k) for k in n], n


def prior():
    kind = RNG.random()
    if kind < 0.3:
        return 1.0, 1.0
    if kind < 0.5:
        return 0.5, 0.5
    return float(round(10 ** RNG.uniform(math.log10(0.05), 2), 3)), float(round(10 ** RNG.uniform(math.log10(0.05), 2), 3))


def level():
    return float(round(RNG.choice([0.5, 0.8, 0.9, 0.95, 0.99, 0.999, 0.9999, RNG.uniform(0.5, 0.9999)]), 4))


# ---- Bayesian references ----

GL_NODES, GL_WEIGHTS = np.polynomial.legendre.leggauss(20)
GL2_NODES, GL2_WEIGHTS = np.polynomial.legendre.leggauss(40)
SDS = np.concatenate([-np.geomspace(40, 0.25, 16), [0.0], np.geomspace(0.25, 40, 16)])
DECADES = 10.0 ** -np.arange(1.0, 300.0, 1.0)
HALF = np.linspace(0, 0.5, 21)


def betainc(a, b, x):
    return scipy.stats.beta.cdf(x, a, b)


def betaincc(a, b, x):
    return scipy.stats.beta.sf(x, a, b)


def half_cuts(laws, side):
    """Cut points of one half of the rate axis as distances from its end:
    side 0 is t in [0, 1/2], side 1 is u = 1 - t in [0, 1/2], so that a law
    living within 1e-6 of 1 keeps every digit. Each law's mean +- up to 40 sd;
    a law with a parameter below 1 adds every decade next to its end."""
    pts = [HALF]
    for a, b in laws:
        near, far = (a, b) if side == 0 else (b, a)
        s = math.sqrt(a * b / ((a + b) ** 2 * (a + b + 1)))
        pts.append(near / (a + b) + s * SDS)
        if near < 1:
            pts.append(DECADES)
    c = np.concatenate(pts)
    return np.unique(c[(c >= 0) & (c <= 0.5)])


def density(near, far, v):
    """Beta(near, far) density at v; where Boost overflows (next to an end
    where it is infinite), in logs with the constant from 50-digit mpmath."""
    try:
        return scipy.stats.beta.pdf(v, near, far)
    except OverflowError:
        with mpmath.workdps(50):
            log_b = float(mpmath.log(mpmath.beta(near, far)))
        return np.exp((near - 1) * np.log(v) + (far - 1) * np.log1p(-v) - log_b)


def law_values(c, d, v, side):
    """Density, CDF and upper tail of Beta(c, d) at t = v (side 0) or t = 1 - v (side 1)."""
    if side == 0:
        return density(c, d, v), scipy.stats.beta.cdf(v, c, d), scipy.stats.beta.sf(v, c, d)
    return density(d, c, v), scipy.stats.beta.sf(v, d, c), scipy.stats.beta.cdf(v, d, c)


def best_and_expected(laws, goal_high, nodes=GL_NODES, weights=GL_WEIGHTS):
    """P(best) of every law, P(best)_i = int f_i prod_{j != i} C_j dt, and
    E[best rate] = sum_i int t f_i prod_{j != i} C_j dt, by a fixed composite
    Gauss-Legendre rule on each half of the rate axis (scipy.stats.beta: pdf,
    cdf, sf). Next to an end where some density is infinite (parameter p < 1
    there) the first piece [0, c] takes v = c w^(1 / p_min), under which every
    integrand is bounded."""
    g = len(laws)
    best, expected = np.zeros(g), 0.0
    for side in (0, 1):
        cuts = half_cuts(laws, side)
        p_min = min(a if side == 0 else b for a, b in laws)
        lo, hi = cuts[:-1], cuts[1:]
        mid, half = (lo + hi) / 2, (hi - lo) / 2
        v = (mid[:, None] + half[:, None] * nodes[None, :])
        wts = (half[:, None] * weights[None, :])
        if p_min != math.floor(p_min):  # the end piece [0, c] by the power substitution
            c, power = hi[0], math.ceil(p_min) / p_min
            w01 = (nodes + 1) / 2
            v[0] = c * w01 ** power
            wts[0] = weights / 2 * c * power * w01 ** (power - 1)
        v, wts = v.ravel(), wts.ravel()
        keep = v > 0  # nodes below the smallest double hold no mass worth a digit
        v, wts = v[keep], wts[keep]
        values = [law_values(c, d, v, side) for c, d in laws]
        t = v if side == 0 else 1 - v
        for i in range(g):
            others = np.ones_like(v)
            for j in range(g):
                if j != i:
                    others = others * (values[j][1] if goal_high else values[j][2])
            integrand = values[i][0] * others
            best[i] += float(np.sum(wts * integrand))
            expected += float(np.sum(wts * t * integrand))
    return list(best), expected


def settled_ahead(x, y):
    """P(X > Y) as P(best) of two laws, or None where 20 and 40 nodes a piece
    differ by more than 1e-11 (or 1e-10 relative, for a probability below 1e-3)."""
    one = best_and_expected([x, y], True)[0][0]
    two = best_and_expected([x, y], True, GL2_NODES, GL2_WEIGHTS)[0][0]
    if abs(one - two) > 1e-11 or (1e-80 <= two < 1e-3 and abs(one - two) > 1e-10 * two):
        return None
    return two


def bayes_rows(w):
    for case in range(CASES):
        g_high = 12 if case % 10 == 0 else 6
        x, n = tally(2, g_high)
        pa, pb = prior()
        laws = [(pa + xi, pb + ni - xi) for xi, ni in zip(x, n)]
        name = "sweep_bayes_%d" % case
        goal = "high" if RNG.random() < 0.5 else "low"
        b1, e1 = best_and_expected(laws, goal == "high")
        b2, e2 = best_and_expected(laws, goal == "high", GL2_NODES, GL2_WEIGHTS)
        if max(abs(p - q) for p, q in zip(b1, b2)) > 1e-11 or abs(e1 - e2) > 1e-11:
            continue  # the reference did not settle: no row rather than a doubtful one
        for i in range(len(laws)):
            # A small probability is checked to 1e-8 relative: its row is
            # written only where 20 and 40 nodes agree to 1e-10 relative.
            if 1e-80 <= b2[i] < 1e-3 and abs(b1[i] - b2[i]) > 1e-10 * b2[i]:
                continue
            out(w, "bayes", name, x, n, "best|%s|%r|%r|%d" % (goal, pa, pb, i + 1), b2[i], QUAD)
            mean = laws[i][0] / sum(laws[i])
            loss = max(0.0, e2 - mean) if goal == "high" else max(0.0, mean - e2)
            out(w, "bayes", name, x, n, "loss|%s|%r|%r|%d" % (goal, pa, pb, i + 1), loss, QUAD)
        i, j = (int(v) for v in RNG.choice(len(laws), 2, replace=False))
        ahead = settled_ahead(laws[i], laws[j])
        if ahead is not None:
            out(w, "bayes", name, x, n, "ahead|%r|%r|%d|%d" % (pa, pb, i + 1, j + 1), ahead, QUAD)
        lv = level()
        a, b = laws[i]
        for q, what in (((1 - lv) / 2, "low"), ((1 + lv) / 2, "high")):
            root = scipy.optimize.brentq(lambda t: betainc(a, b, t) - q, 0, 1, xtol=1e-300, rtol=1e-15, maxiter=500)
            out(w, "bayes", name, x, n, "central_%s|%r|%r|%d|%r" % (what, pa, pb, i + 1, lv), root,
                SCIPY + " optimize.brentq on stats.beta.cdf")
        rate = float(RNG.choice([RNG.uniform(0, 1), 10 ** RNG.uniform(-12, -1), 1 - 10 ** RNG.uniform(-12, -1)]))
        above = betaincc(a, b, rate) if goal == "high" else betainc(a, b, rate)
        out(w, "bayes", name, x, n, "above|%s|%r|%r|%d|%r" % (goal, pa, pb, i + 1, rate), above,
            SCIPY + " stats.beta.cdf/sf")
        m = int(10 ** RNG.uniform(0, 9))
        k = int(RNG.integers(0, m + 1)) if RNG.random() < 0.5 else int(min(m, max(0, round(m * a / (a + b)))))
        if k == 0:
            nxt = 1.0
        else:
            nxt = settled_ahead((a, b), (float(k), float(m - k + 1)))
            if nxt is None:
                continue
            if m <= 2000:
                direct = scipy.stats.betabinom.sf(k - 1, m, a, b)
                if abs(direct - nxt) > 1e-10:
                    continue
        out(w, "bayes", name, x, n, "next|%r|%r|%d|%d|%d" % (pa, pb, i + 1, m, k), nxt,
            QUAD + ", P(rate > Beta(k, m - k + 1)); " + SCIPY + " stats.betabinom.sf where m <= 2000")


# ---- pairs ----

ONE = {"wilson": "wilson", "clopper-pearson": "beta", "jeffreys": "jeffreys", "agresti-coull": "agresti_coull"}
DIFF = {"newcombe": "newcomb", "agresti-caffo": "agresti-caffo", "wald": "wald"}
ADJUST = {"holm": "holm", "hochberg": "simes-hochberg", "benjamini-hochberg": "fdr_bh", "bonferroni": "bonferroni",
          "sidak": "sidak"}


def pairs_rows(w):
    for case in range(CASES):
        x, n = tally(2, 8)
        name = "sweep_pairs_%d" % case
        lv = level()
        i, j = (int(v) for v in RNG.choice(len(x), 2, replace=False))
        if n[i] == 0 or n[j] == 0:
            continue
        for ours, theirs in ONE.items():
            lo, hi = proportion_confint(x[i], n[i], alpha=1 - lv, method=theirs)
            src = STATSMODELS + ' proportion_confint(method="%s")' % theirs
            if ours == "jeffreys":
                lo, hi = (0.0 if x[i] == 0 else lo), (1.0 if x[i] == n[i] else hi)
                src += "; 0 at x = 0, 1 at x = n (Brown, Cai & DasGupta 2001)"
            if ours in ("wilson", "agresti-coull"):
                lo, hi = max(0.0, lo), min(1.0, hi)
            out(w, "pairs", name, x, n, "one_low|%s|%d|%r" % (ours, i + 1, lv), lo, src)
            out(w, "pairs", name, x, n, "one_high|%s|%d|%r" % (ours, i + 1, lv), hi, src)
        for ours, theirs in DIFF.items():
            lo, hi = confint_proportions_2indep(x[i], n[i], x[j], n[j], method=theirs, compare="diff", alpha=1 - lv)
            src = STATSMODELS + ' confint_proportions_2indep(method="%s", compare="diff")' % theirs
            if ours != "newcombe":
                lo, hi = max(-1.0, lo), min(1.0, hi)
            out(w, "pairs", name, x, n, "diff_low|%s|%d|%d|%r" % (ours, i + 1, j + 1, lv), lo, src)
            out(w, "pairs", name, x, n, "diff_high|%s|%d|%d|%r" % (ours, i + 1, j + 1, lv), hi, src)
        if case % 3 == 0 and max(n[i], n[j]) <= 10 ** 5:
            lo, hi = mn_interval(x[i], n[i], x[j], n[j], lv)
            src = "pairs.py mn_interval (bisection, Miettinen & Nurminen 1985 with N/(N-1))"
            out(w, "pairs", name, x, n, "diff_low|miettinen-nurminen|%d|%d|%r" % (i + 1, j + 1, lv), lo, src)
            out(w, "pairs", name, x, n, "diff_high|miettinen-nurminen|%d|%d|%r" % (i + 1, j + 1, lv), hi, src)
        # every pair's score p, adjusted over all pairs
        pairs = [(a, b) for a in range(len(x)) for b in range(a + 1, len(x)) if n[a] > 0 and n[b] > 0]
        raw = [pair_p_values(x[a], n[a], x[b], n[b])[0] for a, b in pairs]
        if any(p is None for p in raw):
            continue
        adjust = list(ADJUST)[case % len(ADJUST)]
        with np.errstate(divide="ignore"):
            adjusted = multipletests(raw, method=ADJUST[adjust])[1]
        a, b = pairs[case % len(pairs)]
        k = pairs.index((a, b))
        out(w, "pairs", name, x, n, "pair_p|none|%d|%d" % (a + 1, b + 1), raw[k], SCORE_SOURCE)
        out(w, "pairs", name, x, n, "pair_p|%s|%d|%d" % (adjust, a + 1, b + 1), adjusted[k],
            STATSMODELS + ' multipletests(method="%s") over all pairs' % ADJUST[adjust])


# ---- omnibus ----

def omnibus_rows(w):
    for case in range(CASES):
        x, n = tally(2, 30)
        name = "sweep_omnibus_%d" % case
        tab = np.array([x, [b - a for a, b in zip(x, n)]])
        if tab.sum(axis=1).min() == 0:
            continue  # one shared rate of 0 or 1: every test gives p = 1 by definition, scipy refuses
        x2, p, _, _ = chi2_contingency(tab, correction=False)
        out(w, "omnibus", name, x, n, "pearson_stat", x2, SCIPY + " chi2_contingency(correction=False)")
        out(w, "omnibus", name, x, n, "pearson_p", p, SCIPY + " chi2_contingency(correction=False)")
        g2, pg, _, _ = chi2_contingency(tab, correction=False, lambda_="log-likelihood")
        out(w, "omnibus", name, x, n, "lr_stat", g2, SCIPY + ' chi2_contingency(lambda_="log-likelihood")')
        t = Table(tab.T, shift_zeros=False)
        resid = t.standardized_resids[:, 0]
        g = case % len(x)
        out(w, "omnibus", name, x, n, "resid|%d" % (g + 1), resid[g], STATSMODELS + " Table.standardized_resids")
        scores = np.arange(1, len(x) + 1)
        z = t.test_ordinal_association(row_scores=scores, col_scores=np.array([1, 0])).zscore
        out(w, "omnibus", name, x, n, "trend_z_conditional", z,
            STATSMODELS + " Table.test_ordinal_association (conditional variance)")


# ---- planning ----

def demo_reference(rate, conf, failures):
    if failures == 0:
        with mpmath.workdps(50):
            v = mpmath.log(1 - mpmath.mpf(conf)) / mpmath.log(mpmath.mpf(rate))
            return int(mpmath.ceil(v - mpmath.mpf(10) ** -30))
    lo, hi = failures + 1, failures + 1
    while scipy.stats.binom.cdf(failures, hi, 1 - rate) > 1 - conf:
        lo, hi = hi, hi * 2
    while lo < hi:
        mid = (lo + hi) // 2
        if scipy.stats.binom.cdf(failures, mid, 1 - rate) <= 1 - conf:
            hi = mid
        else:
            lo = mid + 1
    return lo


def width_reference(rate, half, lv, method):
    ns = np.arange(1, 200001)
    x = np.floor(rate * ns + 0.5)
    lo, hi = proportion_confint(x, ns, alpha=1 - lv, method=ONE[method])
    if method == "jeffreys":
        lo = np.where(x == 0, 0.0, lo)
        hi = np.where(x == ns, 1.0, hi)
    if method in ("wilson", "agresti-coull"):
        lo, hi = np.maximum(lo, 0.0), np.minimum(hi, 1.0)
    ok = np.nonzero((hi - lo) / 2 <= half)[0]
    return int(ns[ok[0]]) if len(ok) else None


def power_reference(p1, p2, power, alpha, corrected=False, r=1):
    """Fleiss, Levin & Paik (2003), group 2 with r times group 1's attempts:
    n' = (z_(alpha/2) sqrt((r + 1) pbar qbar) + z_power sqrt(r p1 q1 + p2 q2))^2 / (r (p1 - p2)^2),
    pbar = (p1 + r p2) / (r + 1); corrected (Fleiss, Tytun & Ury 1980):
    n = n'/4 (1 + sqrt(1 + 2 (r + 1) / (r n' |p1 - p2|)))^2; the ceiling, 50 digits."""
    with mpmath.workdps(50):
        p1, p2, power, alpha, r = (mpmath.mpf(v) for v in (p1, p2, power, alpha, r))
        za = -mpmath.sqrt(2) * mpmath.erfinv(2 * (alpha / 2) - 1)
        zb = mpmath.sqrt(2) * mpmath.erfinv(2 * power - 1)
        pbar = (p1 + r * p2) / (r + 1)
        k = za * mpmath.sqrt((r + 1) * pbar * (1 - pbar)) + zb * mpmath.sqrt(r * p1 * (1 - p1) + p2 * (1 - p2))
        n = k * k / (r * (p1 - p2) ** 2)
        if corrected:
            n = n / 4 * (1 + mpmath.sqrt(1 + 2 * (r + 1) / (r * n * abs(p1 - p2)))) ** 2
        return int(mpmath.ceil(n - mpmath.mpf(10) ** -30))


def planning_rows(w):
    for case in range(CASES):
        name = "sweep_plan_%d" % case
        kind = case % 3
        if kind == 0:
            rate = float(round(1 - 10 ** RNG.uniform(-4, -0.3), 6))
            conf = level()
            failures = int(RNG.choice([0, 0, 1, 2, 5]))
            n = demo_reference(rate, conf, failures)
            if n <= 10 ** 9:
                out(w, "planning", name, [], [], "demo|%r|%r|%d" % (rate, conf, failures), n,
                    "mpmath %s (50 digits) success-run formula" % mpmath.__version__ if failures == 0 else
                    SCIPY + " stats.binom.cdf, bisection over n")
        elif kind == 1:
            rate = float(round(RNG.choice([RNG.uniform(0.01, 0.99), 10 ** RNG.uniform(-3, -1)]), 4))
            half = float(round(10 ** RNG.uniform(-2.3, -0.8), 4))
            lv = float(RNG.choice([0.8, 0.9, 0.95, 0.99]))
            method = list(ONE)[case % 4]
            n = width_reference(rate, half, lv, method)
            if n is not None:
                out(w, "planning", name, [], [], "width|%r|%r|%r|%s" % (rate, half, lv, method), n,
                    STATSMODELS + ' proportion_confint(method="%s") at every n up to 200,000' % ONE[method])
        else:
            p1 = float(round(RNG.uniform(0.001, 0.999), 4))
            p2 = float(round(min(0.9999, max(0.0001, p1 + RNG.choice([-1, 1]) * 10 ** RNG.uniform(-2.5, -0.3))), 4))
            if p1 == p2:
                continue
            power, alpha = float(RNG.choice([0.5, 0.8, 0.9, 0.95, 0.99])), float(RNG.choice([0.01, 0.05, 0.1]))
            out(w, "planning", name, [], [], "power|%r|%r|%r|%r" % (p1, p2, power, alpha),
                power_reference(p1, p2, power, alpha),
                "mpmath %s (50 digits), Fleiss, Levin & Paik (2003) formula" % mpmath.__version__)


# ---- gaps a mutation check of the tests found (the checklist asks for one per new function) ----

SIMULTANEOUS = ("bonferroni", "sidak")


def family_rows(w):
    """Simultaneous intervals and adjusted p-values over the family "all" and
    the family "against" j (the G - 1 comparisons with group j): statsmodels
    at the per-comparison level, Bonferroni (1 - level) / m or Sidak
    level^(1 / m), and multipletests over the family's raw p-values."""
    for case in range(100):
        x, n = tally(3, 8)
        name = "sweep_family_%d" % case
        lv = level()
        i, j = (int(v) for v in RNG.choice(len(x), 2, replace=False))
        k = len(x)
        for fam, m in (("all", k * (k - 1) // 2), ("against", k - 1)):
            how = SIMULTANEOUS[case % 2]
            each = 1 - (1 - lv) / m if how == "bonferroni" else lv ** (1 / m)
            lo, hi = confint_proportions_2indep(x[i], n[i], x[j], n[j], method="newcomb", compare="diff", alpha=1 - each)
            src = STATSMODELS + ' confint_proportions_2indep(method="newcomb") at the %s level over %d comparisons' % (how, m)
            out(w, "pairs", name, x, n, "diff_low_family|%s|%s|%d|%d|%r" % (how, fam, i + 1, j + 1, lv), lo, src)
            out(w, "pairs", name, x, n, "diff_high_family|%s|%s|%d|%d|%r" % (how, fam, i + 1, j + 1, lv), hi, src)
        members = [(a, j) if a < j else (j, a) for a in range(k) if a != j]
        raw = [pair_p_values(x[a], n[a], x[b], n[b])[0] for a, b in members]
        if any(p is None for p in raw):
            continue
        adjust = list(ADJUST)[case % len(ADJUST)]
        with np.errstate(divide="ignore"):
            adjusted = multipletests(raw, method=ADJUST[adjust])[1]
        at = members.index((min(i, j), max(i, j)))
        out(w, "pairs", name, x, n, "pair_p_against|%s|%d|%d" % (adjust, i + 1, j + 1), adjusted[at],
            STATSMODELS + ' multipletests(method="%s") over the %d comparisons with group j' % (ADJUST[adjust], k - 1))


def hpd_reference(a, b, lv):
    """Highest-density interval of Beta(a, b), a, b > 1: Brent's root on log l of
    log f(l) - log f(u(l)), u(l) = F^-1(F(l) + level) (scipy.stats.beta)."""
    law = scipy.stats.beta(a, b)

    def upper(l):
        return law.ppf(min(1.0, law.cdf(l) + lv))

    def gap(log_l):
        l = math.exp(log_l)
        return law.logpdf(l) - law.logpdf(upper(l))

    lo, hi = math.log(1e-300), math.log(law.ppf((1 - lv) * (1 - 1e-9)))
    if not (gap(lo) < 0 < gap(hi)):
        return None
    log_l = scipy.optimize.brentq(gap, lo, hi, xtol=1e-14, rtol=1e-15, maxiter=500)
    return math.exp(log_l), upper(math.exp(log_l))


def hpd_rows(w):
    for case in range(100):
        n = int(10 ** RNG.uniform(0, 4))
        x = successes(n)
        pa, pb = prior()
        a, b = pa + x, pb + n - x
        if a <= 1 or b <= 1:
            continue  # one-sided there: the central and one-sided rows cover it
        lv = level()
        bounds = hpd_reference(a, b, lv)
        if bounds is None:
            continue
        src = SCIPY + " optimize.brentq on the equal-density condition with stats.beta"
        out(w, "bayes", "sweep_hpd_%d" % case, [x], [n], "hpd_low|%r|%r|1|%r" % (pa, pb, lv), bounds[0], src)
        out(w, "bayes", "sweep_hpd_%d" % case, [x], [n], "hpd_high|%r|%r|1|%r" % (pa, pb, lv), bounds[1], src)


def ahead_plan_reference(pilot, other, conf):
    """The fewest further successes m with P(Beta(a + m, b) > other) >= conf,
    by doubling and bisection on the quadrature; None past 10^9 or where
    the answer sits within 1e-9 of the confidence (the engine promises
    1e-9 there)."""
    def p(m):
        return settled_ahead((pilot[0] + m, pilot[1]), other)

    if p(0) is None or p(0) >= conf:
        return None
    lo, hi = 0, 1
    while True:
        v = p(hi)
        if v is None:
            return None
        if v >= conf:
            break
        lo, hi = hi, hi * 2
        if hi > 10 ** 9:
            return None
    while hi - lo > 1:
        mid = (lo + hi) // 2
        v = p(mid)
        if v is None:
            return None
        lo, hi = (lo, mid) if v >= conf else (mid, hi)
    if abs(p(hi) - conf) < 1e-9 or abs(p(hi - 1) - conf) < 1e-9:
        return None
    return hi


def extra_planning_rows(w):
    for case in range(60):
        p1 = float(round(RNG.uniform(0.001, 0.999), 4))
        p2 = float(round(min(0.9999, max(0.0001, p1 + RNG.choice([-1, 1]) * 10 ** RNG.uniform(-2.5, -0.3))), 4))
        if p1 == p2:
            continue
        power, alpha = float(RNG.choice([0.5, 0.8, 0.9, 0.95])), float(RNG.choice([0.01, 0.05, 0.1]))
        out(w, "planning", "sweep_power_cc_%d" % case, [], [], "power_cc|%r|%r|%r|%r" % (p1, p2, power, alpha),
            power_reference(p1, p2, power, alpha, corrected=True),
            "mpmath %s (50 digits), Fleiss, Tytun & Ury (1980) correction" % mpmath.__version__)
    for case in range(10):
        pa, pb = (0.5, 0.5) if case % 2 == 0 else (float(round(RNG.uniform(0.1, 3), 2)), float(round(RNG.uniform(0.1, 3), 2)))
        n1 = int(RNG.integers(3, 30))
        x1 = n1 - int(RNG.integers(0, 2))
        n2 = int(10 ** RNG.uniform(2, 5))
        x2 = int(RNG.binomial(n2, RNG.uniform(0.8, 0.99)))
        conf = float(RNG.choice([0.8, 0.9, 0.95]))
        m = ahead_plan_reference((pa + x1, pb + n1 - x1), (pa + x2, pb + n2 - x2), conf)
        if m is not None:
            out(w, "planning", "sweep_plan_ahead_%d" % case, [x1, x2], [n1, n2],
                "ahead|%r|%r|%r" % (pa, pb, conf), m, QUAD + ": P at m - 1 below the confidence, at m above")


def more_and_ratio_rows(w):
    """RATES.PLAN.MORE: the smallest m with P(at most `failed` failures in run + m | rate) <= 1 - C,
    searched directly on scipy's binomial CDF (not through the demonstration size), records of
    1 to 10^7 units; RATES.PLAN.POWER with group 2 of r = 10^-2 .. 10^2 times group 1."""
    for case in range(80):
        rate = float(round(1 - 10 ** RNG.uniform(-4, -0.3), 6))
        conf = level()
        run = int(RNG.choice([0, 1, int(10 ** RNG.uniform(0, 7))]))
        failed = min(run, int(RNG.choice([0, 0, 1, 2, 5, 20])))
        tail = lambda m: scipy.stats.binom.cdf(failed, run + m, 1 - rate)  # noqa: E731
        if tail(0) <= 1 - conf:
            m = 0
        else:
            lo, hi = 0, 1
            while tail(hi) > 1 - conf:
                lo, hi = hi, hi * 2
            while hi - lo > 1:
                mid = (lo + hi) // 2
                lo, hi = (lo, mid) if tail(mid) <= 1 - conf else (mid, hi)
            m = hi
        # Leave out targets within rounding of the boundary, and beyond the planning cap.
        near = [abs(tail(k) - (1 - conf)) <= 1e-9 * (1 - conf) for k in {m, max(m - 1, 0)}]
        if any(near) or run + m > 10 ** 9:
            continue
        out(w, "planning", "sweep_more_%d" % case, [], [], "more|%r|%r|%d|%d" % (rate, conf, run, failed), m,
            SCIPY + " stats.binom.cdf, smallest m by doubling and bisection on the whole record")
    for case in range(60):
        p1 = float(round(RNG.uniform(0.001, 0.999), 4))
        p2 = float(round(min(0.9999, max(0.0001, p1 + RNG.choice([-1, 1]) * 10 ** RNG.uniform(-2.5, -0.3))), 4))
        if p1 == p2:
            continue
        r = float(round(10 ** RNG.uniform(-2, 2), 3))
        power, alpha = float(RNG.choice([0.5, 0.8, 0.9, 0.95])), float(RNG.choice([0.01, 0.05, 0.1]))
        corrected = case % 2 == 1
        n = power_reference(p1, p2, power, alpha, corrected, r)
        if n <= 10 ** 9:
            out(w, "planning", "sweep_power_ratio_%d" % case, [], [],
                "%s|%r|%r|%r|%r|%r" % ("power_ratio_cc" if corrected else "power_ratio", p1, p2, power, alpha, r), n,
                "mpmath %s (50 digits), Fleiss, Levin & Paik (2003) unequal groups%s" %
                (mpmath.__version__, ", Fleiss, Tytun & Ury (1980) correction" if corrected else ""))


def claims_rows(w):
    """Margins (RATES.MARGIN.P: pairs.py fm_p, Farrington & Manning 1990 in
    50-digit mpmath, checked there against a direct maximisation), one-sided
    Clopper-Pearson bounds (scipy beta.ppf) and one-sided Miettinen-Nurminen
    bounds (pairs.py mn_interval at 2 level - 1) on random tallies of mixed
    sizes, levels from 0.5 up."""
    claims = ["not-worse", "better", "equivalent"]
    for case in range(150):
        x, n = tally(2, 8)
        i, j = (int(v) for v in RNG.choice(len(x), 2, replace=False))
        if n[i] == 0 or n[j] == 0:
            continue
        name = "sweep_claims_%d" % case
        claim, goal = claims[case % 3], ("high", "low")[(case // 3) % 2]
        margin = float(RNG.choice([0.0, 0.001, 0.01, 0.05, 0.2])) if claim != "equivalent" else \
            float(RNG.choice([0.001, 0.01, 0.05, 0.2]))
        p = fm_p(x[i], n[i], x[j], n[j], margin, claim, goal)
        out(w, "claims", name, x, n, "margin|%s|%s|%r|%d|%d" % (claim, goal, margin, i + 1, j + 1), float(p),
            "pairs.py fm_p (Farrington & Manning 1990, mpmath %s at 50 digits)" % mpmath.__version__)
        lv = max(0.5, level())
        low = 0.0 if x[i] == 0 else scipy.stats.beta.ppf(1 - lv, x[i], n[i] - x[i] + 1)
        high = 1.0 if x[i] == n[i] else scipy.stats.beta.ppf(lv, x[i] + 1, n[i] - x[i])
        src = SCIPY + " beta.ppf: one-sided Clopper-Pearson at level"
        out(w, "claims", name, x, n, "sided_low|%d|%r" % (i + 1, lv), low, src)
        out(w, "claims", name, x, n, "sided_high|%d|%r" % (i + 1, lv), high, src)
        if case % 3 == 0 and max(n[i], n[j]) <= 10 ** 5:
            lo, hi = mn_interval(x[i], n[i], x[j], n[j], 2 * lv - 1)
            src = "pairs.py mn_interval at 2 level - 1: one-sided Miettinen-Nurminen bounds"
            out(w, "claims", name, x, n, "diffsided_low|%d|%d|%r" % (i + 1, j + 1, lv), lo, src)
            out(w, "claims", name, x, n, "diffsided_high|%d|%d|%r" % (i + 1, j + 1, lv), hi, src)


def apart_rows(w):
    """Decision limits on random tallies of mixed sizes (apart.py's
    formulas: scipy norm for the normal limits, Laney's sigma_z in numpy,
    scipy binom.ppf / isf checked against cdf and sf for the exact limits
    against a standard, every table enumerated for the exact limits of small
    tallies without one) and Tarone's z in exact fractions."""
    for case in range(120):
        x, n = tally(2, 12)
        keep = [k for k in range(len(n)) if n[k] > 0]
        x, n = [x[k] for k in keep], [n[k] for k in keep]
        if len(x) < 2 or sum(x) in (0, sum(n)):
            continue
        name = "sweep_apart_%d" % case
        lv = float(RNG.choice([0.9, 0.95, 0.99, 0.9973, 0.999]))
        target = None if case % 3 else float(round(RNG.uniform(0.5, 0.999), 3))
        family = ("all", "each")[case % 2]
        spread = "time" if case % 5 == 0 else "none"
        tag = "|%s|%s|%s|%r" % (family, "none" if target is None else repr(target), spread, lv)
        lims = apart_normal(x, n, lv, family, target, spread)
        i = int(RNG.integers(len(x)))
        src = SCIPY + " norm.isf; Nelson (1982) / p-chart sigma" + ("; Laney (2002) in numpy" if spread == "time" else "")
        out(w, "apart", name, x, n, "normal" + tag + "|%d|low" % (i + 1), lims[i][0], src)
        out(w, "apart", name, x, n, "normal" + tag + "|%d|high" % (i + 1), lims[i][1], src)
        if target is not None or family == "each":
            c = target if target is not None else sum(x) / sum(n)
            tail = (1 - lv) / 2 if family == "each" else -math.expm1(math.log(lv) / len(x)) / 2
            law = scipy.stats.binom(n[i], c)
            a = int(law.ppf(tail))
            while a > 0 and law.cdf(a - 1) >= tail:
                a -= 1
            while law.cdf(a) < tail:
                a += 1
            b = int(law.isf(tail)) + 1
            while b > 0 and law.sf(b - 1) < tail:
                b -= 1
            while b < n[i] and law.sf(b) >= tail:
                b += 1
            src = SCIPY + " binom.ppf / isf, checked with cdf and sf"
            out(w, "apart", name, x, n, "exact|%s|%s|none|%r|%d|low" % (family, "none" if target is None else repr(target),
                                                                      lv, i + 1), a / n[i], src)
            out(w, "apart", name, x, n, "exact|%s|%s|none|%r|%d|high" % (family, "none" if target is None else repr(target),
                                                                       lv, i + 1), b / n[i], src)
        elif len(x) <= 3 and max(n) <= 40:
            lims = apart_joint(x, n, lv)
            src = SCIPY + " hypergeom marginals; every table with the margins enumerated (apart.py)"
            for g in range(len(x)):
                out(w, "apart", name, x, n, "exact|all|none|none|%r|%d|low" % (lv, g + 1), lims[g][0], src)
                out(w, "apart", name, x, n, "exact|all|none|none|%r|%d|high" % (lv, g + 1), lims[g][1], src)
        if sum(k * (k - 1) for k in n) > 0:
            p = Fraction(sum(x), sum(n))
            num = sum((xi - ni * p) ** 2 for xi, ni in zip(x, n)) / (p * (1 - p)) - sum(n)
            z = float(num) / math.sqrt(2 * sum(k * (k - 1) for k in n))
            out(w, "apart", name, x, n, "tarone_z", z, "Tarone (1979) formula in exact fractions")


def main():
    # Laws far apart underflow to 0 in scipy's Boost calls: the warning is noise.
    np.seterr(all="ignore")
    warnings.filterwarnings("ignore", category=RuntimeWarning)
    w = csv.writer(sys.stdout, lineterminator="\n")
    w.writerow(["family", "case", "successes", "attempts", "quantity", "value", "source"])
    for section in (bayes_rows, pairs_rows, omnibus_rows, planning_rows, family_rows, hpd_rows, extra_planning_rows,
                    more_and_ratio_rows, claims_rows, apart_rows):
        section(w)


if __name__ == "__main__":
    main()
