#!/usr/bin/python3
"""Reference values for the planning tests, from libraries outside the project.

Writes planning.csv (one row per case and quantity); every row names the library, the
function and its version, so a failing engine test points at an outside source:

    /usr/bin/python3 tests/reference/planning.py > tests/reference/planning.csv

Sources:
  Planning rows (plan_*): the answer is a whole number, found by direct search
      with the reference libraries (scipy, mpmath), never by the engine's shortcuts.
"""
import sys

import mpmath
import numpy as np
import scipy
import scipy.stats
from statsmodels.stats.proportion import proportion_confint

sys.path.insert(0, __file__.rsplit("/", 1)[0])
from bayes import mp_ahead_sum  # noqa: E402  (Cook 2005 in 50-digit mpmath)
from pairs import ONE_METHODS  # noqa: E402  (statsmodels names of the one-rate methods)
from reference_common import SCIPY, STATSMODELS, row, write_sections  # noqa: E402

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


# Further units after a record of `run` with `failed` failures. Invented; a
# fresh start, records short of the target, one already showing it, failures
# on record, and a rate close to 1.
MORE_CASES = [  # (rate, confidence, run, failed)
    ("0.99", "0.95", 120, 0), ("0.99", "0.95", 0, 0), ("0.99", "0.95", 400, 0), ("0.99", "0.95", 299, 0),
    ("0.99", "0.95", 298, 0), ("0.95", "0.9", 60, 2), ("0.999", "0.95", 1000, 1), ("0.9", "0.99", 45, 3),
    ("0.9999", "0.9", 5000, 0), ("0.98", "0.8", 250, 4), ("0.9", "0.95", 200, 12),
]


def mp_tail(n, failed, rate):
    """P(at most `failed` failures in n units | rate), summed exactly in 50-digit mpmath."""
    with mpmath.workdps(50):
        q = 1 - mpmath.mpf(rate)
        return mpmath.fsum(mpmath.binomial(n, k) * q ** k * (1 - q) ** (n - k) for k in range(failed + 1))


def more_rows(w):
    source = ("mpmath " + mpmath.__version__ + " (50 digits): exact binomial tail, the smallest m by doubling and "
              "bisection; " + SCIPY + " stats.beta.ppf one-sided Clopper-Pearson bound agrees")
    for r, c, run, failed in MORE_CASES:
        shows = lambda m: mp_tail(run + m, failed, r) <= 1 - mpmath.mpf(c)  # noqa: E731
        m = 0
        if not shows(0):
            high = 1
            while not shows(high):
                high *= 2
            low = high // 2 + 1 if high > 1 else 1
            while low < high:
                mid = (low + high) // 2
                low, high = (low, mid) if shows(mid) else (mid + 1, high)
            m = low
        assert shows(m) and (m == 0 or not shows(m - 1))
        # The same claim by the one-sided Clopper-Pearson lower bound of the whole record.
        n = run + m
        bound = scipy.stats.beta.ppf(1 - float(c), n - failed, failed + 1)
        assert bound >= float(r) - 1e-12, (r, c, run, failed, m, bound)
        if m > 0:
            before = scipy.stats.beta.ppf(1 - float(c), n - 1 - failed, failed + 1)
            assert before < float(r) + 1e-12, (r, c, run, failed, m, before)
        row(w, "more", [], [], "plan_more|%s|%s|%d|%d" % (r, c, run, failed), m, source)


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


# Unequal groups: group 2 gets r times the attempts of group 1. Invented;
# a pilot beside a running line of ten times its output, the reverse, and
# r = 1, which must repeat the equal-groups rows.
POWER_RATIO_CASES = [  # (rate_1, rate_2, power, alpha, r)
    ("0.1", "0.15", "0.8", "0.05", "10"), ("0.9", "0.95", "0.9", "0.05", "0.5"), ("0.98", "0.995", "0.8", "0.05", "3"),
    ("0.2", "0.05", "0.95", "0.1", "0.25"), ("0.5", "0.6", "0.8", "0.01", "2"), ("0.1", "0.15", "0.8", "0.05", "1"),
]


def power_ratio_rows(w):
    """Fleiss, Levin & Paik (2003, 4.4) for n2 = r n1 and the continuity
    correction of Fleiss, Tytun & Ury (1980) in that form, in 50-digit mpmath;
    each n1 checked by the power of the test at (n1, r n1) and (n1 - 1, r (n1 - 1))."""
    mpmath.mp.dps = 50
    z = lambda q: mpmath.sqrt(2) * mpmath.erfinv(2 * q - 1)  # noqa: E731
    phi = lambda x: (1 + mpmath.erf(x / mpmath.sqrt(2))) / 2  # noqa: E731
    for a, b, pw, al, rr in POWER_RATIO_CASES:
        p1, p2, power, alpha, r = (mpmath.mpf(v) for v in (a, b, pw, al, rr))
        d, pbar = abs(p1 - p2), (p1 + r * p2) / (r + 1)
        s0, s1 = mpmath.sqrt((r + 1) * pbar * (1 - pbar)), mpmath.sqrt(r * p1 * (1 - p1) + p2 * (1 - p2))
        za, zb = z(1 - alpha / 2), z(power)
        n0 = (za * s0 + zb * s1) ** 2 / (r * d ** 2)
        nc = n0 / 4 * (1 + mpmath.sqrt(1 + 2 * (r + 1) / (r * n0 * d))) ** 2
        for corr, n_real, c in (("none", n0, 0), ("continuity", nc, 1)):
            n = max(1, int(mpmath.ceil(n_real)))
            # sqrt(r m) (|d| - c (1/m + 1/(r m)) / 2) against the null spread.
            power_at = lambda m: phi((mpmath.sqrt(r * m) * d - c * (r + 1) / (2 * mpmath.sqrt(r * m))  # noqa: E731
                                      - za * s0) / s1)
            assert power_at(n) >= power and (n == 1 or power_at(n - 1) < power), (a, b, rr, corr)
            row(w, "power", [], [], "plan_power_ratio|%s|%s|%s|%s|%s|%s" % (a, b, pw, al, corr, rr), n,
                "Fleiss, Levin & Paik (2003) unequal-groups formula / Fleiss, Tytun & Ury (1980) in mpmath " +
                mpmath.__version__ + " (50 digits), power checked at n1 and n1 - 1 with n2 = r n1")


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


# Goal "low": the counts are defects; further attempts are all free of the
# defect, and the pilot must reach P(its defect rate < the other's).
AHEAD_LOW_CASES = [  # (pilot defects, pilot attempts, other defects, other attempts, confidence, prior)
    (0, 14, 14, 300, "0.95", 1), (1, 40, 30, 1000, "0.9", 1), (0, 0, 5, 100, "0.9", 1), (2, 50, 2, 50, "0.8", 1),
]


def ahead_low_rows(w):
    mpmath.mp.dps = 50
    source = ("mpmath " + mpmath.__version__ + " (50 digits): P(rate_1 < rate_2) by the finite sum of Cook (2005); "
              "P checked at m and m - 1")
    for d1, n1, d2, n2, c, prior in AHEAD_LOW_CASES:
        conf = mpmath.mpf(c)
        other = (mpmath.mpf(prior) + d2, mpmath.mpf(prior) + n2 - d2)
        p = lambda m: mp_ahead_sum(other[0], other[1], mpmath.mpf(prior) + d1, mpmath.mpf(prior) + n1 - d1 + m)
        m = 0
        while p(m) < conf:  # the answers here are small: a direct walk
            m += 1
        assert p(m) >= conf and (m == 0 or p(m - 1) < conf)
        row(w, "plan_ahead_low", [d1, d2], [n1, n2], "plan_aheadlow|%d|%d|%s" % (prior, prior, c), m, source)


SECTIONS = ['demo_rows', 'more_rows', 'width_rows', 'power_rows', 'power_ratio_rows', 'ahead_plan_rows',
            'ahead_low_rows']


if __name__ == "__main__":
    write_sections(SECTIONS)
