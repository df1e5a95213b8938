#!/usr/bin/python3
"""Reference values for the Bayesian tests, from libraries outside the project.

Writes bayes.csv (one row per case and quantity); every row names the library, the
function and its version, so a failing engine test points at an outside source:

    /usr/bin/python3 tests/reference/bayes.py > tests/reference/bayes.csv

Sources:
  Bayesian rows (post_*), 50-digit mpmath: the posterior mean as a ratio,
      central bounds and P(rate > r) from the incomplete beta function's
      continued fraction (DLMF 8.17.22, modified Lentz) and bisection, highest-density bounds by findroot on the equal-density
      condition, and the beta-binomial predictive tail as an exact sum; each
      NEXT row is also checked against scipy stats.betabinom.sf here. The
      prior and the other inputs ride in the quantity: name|a|b|... .
"""
import sys

import mpmath
import scipy
import scipy.stats

sys.path.insert(0, __file__.rsplit("/", 1)[0])
from reference_common import SCIPY, fmt, row, write_sections  # noqa: E402

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


def comparison_rows_large(w):
    comparison_rows(w, large=True)


def claim_rows(w):
    """One-sided credible bounds (kind "one-sided": each bound alone at 95 %,
    the 5 % and 95 % quantiles) and P(rate_1 < rate_2), the better one for
    defect counts (goal "low"), as a reference of its own: the finite sum of
    Cook (2005) with the groups in the other order, or for c_million the
    quadrature of f_1 (1 - F_2)."""
    mpmath.mp.dps = 50
    source = "mpmath " + mpmath.__version__ + " (50 digits; this file)"
    for name, x, n, pa, pb in POST_CASES:
        a, b = mpmath.mpf(pa) + x, mpmath.mpf(pb) + n - x
        tag = "|%s|%s" % (fmt(pa), fmt(pb))
        row(w, name, [x], [n], "post_onesided_low" + tag, float(mp_quantile(a, b, mpmath.mpf("0.05"))),
            source + ": quantile at 0.05")
        row(w, name, [x], [n], "post_onesided_high" + tag, float(mp_quantile(a, b, mpmath.mpf("0.95"))),
            source + ": quantile at 0.95")
    for name, x, n in COMPARE_CASES:
        if len(x) >= 12:
            continue
        (a1, b1), (a2, b2) = [(mpmath.mpf(1) + xi, mpmath.mpf(1) + ni - xi) for xi, ni in zip(x[:2], n[:2])]
        if name == "c_million":
            lo, hi = mp_window(a1, b1, 20)
            p = mpmath.quad(lambda t: mp_density(a1, b1, t) * (1 - mp_cdf(a2, b2, t)), [lo, a1 / (a1 + b1), hi])
            how = source + ": quad of f_1 (1 - F_2), incomplete beta by continued fraction"
        else:
            p = mp_ahead_sum(a2, b2, a1, b1)
            how = source + ": the finite sum of Cook (2005), P(rate_2 > rate_1)"
        row(w, name, x, n, "post_aheadlow|1|1|1|2", float(p), how)


SECTIONS = ['posterior_rows', 'comparison_rows', 'comparison_rows_large', 'claim_rows']


if __name__ == "__main__":
    write_sections(SECTIONS)
