// bayes.cpp - posterior answers for one group; methods and sources in bayes.hpp.
#include "tallyrates/bayes.hpp"

#include <algorithm>
#include <boost/math/distributions/beta.hpp>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/special_functions/beta.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <boost/math/quadrature/tanh_sinh.hpp>
#include <boost/math/tools/minima.hpp>
#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <complex>
#include <limits>

#include "tallyrates/arguments.hpp"
#include "tallyrates/errors.hpp"
#include "tallyrates/text.hpp"
#include "bayes_across.hpp"

namespace tallyrates::bayes {

namespace {

// log B(a, b) by log-gamma: its absolute error grows like eps * a log a (about
// 3e-9 at a = 10^6), which is what SAME can promise there.
double log_beta(double a, double b) {
    return boost::math::lgamma(a) + boost::math::lgamma(b) - boost::math::lgamma(a + b);
}

double quantile(const beta_law& law, double q) {
    return boost::math::ibeta_inv(law.a, law.b, q);
}

// Steps of a root search before it is called a failure (Err:523).
constexpr std::uintmax_t max_root_steps = 200;

// log density up to its constant, for comparing two points.
double log_kernel(const beta_law& law, double x) {
    return (law.a - 1) * std::log(x) + (law.b - 1) * std::log1p(-x);
}

// Highest-density interval of a unimodal law (a > 1 and b > 1): the lower
// end l in (0, q(1 - level)) where the density at l equals the density at
// u(l) = q(F(l) + level); the difference changes sign once on that range.
interval hpd_unimodal(const beta_law& law, double level) {
    auto upper_of = [&](double l) { return quantile(law, std::min(1.0, boost::math::ibeta(law.a, law.b, l) + level)); };
    // Searched on log l: with a first parameter just above 1 the density
    // rises like l^(a - 1) and the lower end can lie at 1e-30 or below, which
    // a search on l itself approaches by halving (Beta(1.05, 9.05) did not
    // converge in 200 steps); on log l every decade costs about one step.
    auto f = [&](double log_l) {
        const double l = std::exp(log_l);
        return log_kernel(law, l) - log_kernel(law, upper_of(l));
    };
    const double hi = quantile(law, 1 - level);
    // At l -> 0 the density vanishes (a > 1): f < 0 there; as l -> q(1 - level),
    // u -> 1 where the density vanishes (b > 1): f > 0. The bracket stops just
    // short of that end, where u is still below 1 and f finite.
    double a = std::log(std::numeric_limits<double>::min());
    double b = std::log(quantile(law, (1 - level) * (1 - 1e-9)));
    double fa = f(a), fb = f(b);
    if (!(fa < 0)) return {0.0, quantile(law, level)};  // the lower end is 0 in double precision
    if (!(fb > 0)) return {hi, 1.0};  // the upper end is 1 in double precision
    std::uintmax_t iterations = max_root_steps;
    const auto r = boost::math::tools::toms748_solve(f, a, b, fa, fb, boost::math::tools::eps_tolerance<double>(50),
                                                     iterations);
    if (iterations >= max_root_steps)
        throw no_convergence("The highest-density interval's root search did not converge in " +
                             std::to_string(max_root_steps) + " steps.");
    const double l = std::exp((r.first + r.second) / 2);
    return {l, upper_of(l)};
}

}  // namespace

prior checked(prior p) {
    for (auto [v, name] : {std::pair{p.a, "prior_a"}, std::pair{p.b, "prior_b"}})
        if (!(v >= min_prior && v <= max_prior))
            throw invalid_input(std::string("The argument ") + name + " (" + format_number(v) + ") must be a number from " +
                                format_number(min_prior) + " to " + format_number(max_prior) +
                                "; 1 and 1 make the flat prior, 0.5 and 0.5 Jeffreys' prior.");
    return p;
}

beta_law posterior(const counts& c, double i, prior p) {
    p = checked(p);
    const group& g = c.at_position(i, "i");
    return {p.a + static_cast<double>(g.successes), p.b + static_cast<double>(g.attempts - g.successes)};
}

double mean(const beta_law& law) { return law.a / (law.a + law.b); }

interval credible(const beta_law& law, double level, kind how) {
    level = arguments::level(level, "level");
    if (how == kind::central) return {quantile(law, (1 - level) / 2), quantile(law, (1 + level) / 2)};
    // The density falls from 0 (a <= 1) or rises to 1 (b <= 1): the shortest
    // interval starts at that end.
    if (law.a <= 1 && law.b > 1) return {0.0, quantile(law, level)};
    if (law.b <= 1 && law.a > 1) return {quantile(law, 1 - level), 1.0};
    if (law.a <= 1 && law.b <= 1) {
        if (law.a == 1 && law.b == 1) return {(1 - level) / 2, (1 + level) / 2};  // flat: every interval is shortest
        throw invalid_input("The posterior has its highest density at both ends (no data yet and a prior below 1), so "
                            "no single interval is the highest-density one; use kind \"central\".");
    }
    return hpd_unimodal(law, level);
}

double above(const beta_law& law, double rate, goal g) {
    arguments::rate(rate, "rate");
    return g == goal::high ? boost::math::ibetac(law.a, law.b, rate) : boost::math::ibeta(law.a, law.b, rate);
}

double next_at_least(const beta_law& law, std::int64_t m, std::int64_t k) {
    if (m < 0 || k < 0 || k > m)
        throw invalid_input("The arguments m (" + std::to_string(m) + ") and k (" + std::to_string(k) +
                            ") must satisfy 0 <= k <= m: at least k successes in the next m attempts.");
    if (k == 0) return 1.0;
    // Given the rate p, P(at least k of m) = I_p(k, m - k + 1), the CDF at p
    // of Y ~ Beta(k, m - k + 1) (the binomial tail as an incomplete beta,
    // DLMF 8.17.5); averaged over the posterior that is P(rate > Y), the
    // comparison of two laws that `ahead` computes (a finite sum of Cook 2005
    // or one integral, never a sum over the m further attempts).
    return ahead(law, {static_cast<double>(k), static_cast<double>(m - k + 1)});
}


namespace {

// Quantile used to bound the integration windows: what lies beyond is below
// 1e-100 of the mass (Boost's inverse incomplete beta gives up near 1e-300).
// Probabilities below about 1e-90 therefore keep only their absolute accuracy.
constexpr double window_tail = 1e-100;
// The credible bounds of a difference integrate a CDF unscaled and need it
// to 1e-11 absolute, so they keep the tighter relative tolerance.
constexpr double cdf_tolerance = 1e-11;
// Depth 8 (256 pieces a side): a smooth integrand converges in a few; past
// that the estimate only chases rounding noise.
constexpr unsigned quad_depth = 8;


// Boost's beta density is accurate for large parameters (no log-gamma
// differences); it underflows only far in the tails, where it does not count.
double log_density(const beta_law& law, double x) {
    try {
        const double d = boost::math::ibeta_derivative(law.a, law.b, x);
        return d > 0 ? std::log(d) : -HUGE_VAL;
    } catch (const std::overflow_error&) {
        // Next to an end where the density is infinite (a or b below 1): in
        // logs, where the parameters are small and log-gamma is exact enough.
        return (law.a - 1) * std::log(x) + (law.b - 1) * std::log1p(-x) -
               log_beta(law.a, law.b);
    }
}



// The point below which (or, upper, above which) the law holds `tail` of its
// mass (bayes_across.cpp: Boost's inverse, a bisection where it gives up).
double tail_point(const beta_law& law, double tail, bool upper) {
    return upper ? 1 - detail::lower_tail_point(law.b, law.a, tail) : detail::lower_tail_point(law.a, law.b, tail);
}

bool singular_ends(const beta_law& law) { return law.a < 1 || law.b < 1; }

double sd(const beta_law& law) {
    const double n = law.a + law.b;
    return std::sqrt(law.a * law.b / (n * n * (n + 1)));
}

// The window where law's mass lies.
std::pair<double, double> window(const beta_law& law, double tail = window_tail) {
    // Next to an end where the density is infinite (a or b below 1) the tail
    // holds about d^a (or d^b) within d of it: the quantile is that end in
    // double precision, and Boost's inverse gives up there (tail_point's
    // bisection fallback took about 1 ms; measured).
    return {law.a < 1 ? 0.0 : tail_point(law, tail, false), law.b < 1 ? 1.0 : tail_point(law, tail, true)};
}

// P(X > Y) as an integral: the shared pass over the rate axis of
// bayes_across.cpp for two groups (pieces cut at both laws' scales).
double ahead_direct(const beta_law& x, const beta_law& y, const detail::reach& how) {
    const beta_law both[] = {x, y};
    return detail::compare_all(both, goal::high, how, detail::answers::first_best).best[0];
}

// Largest number of terms the finite sum may take (about 2 ms; 10^6 terms
// measured at 1.06 ms).
constexpr double max_sum_terms = 2000000;

// log B(a, c) - log B(a, d), for c > d, or nothing where it cannot be had
// to about 1e-12. Log-gamma differences lose about eps * c log c (3e-10 at
// c = 10^6, which the prediction of RATES.POST.NEXT missed its 1e-10 target
// by). Instead, from two Beta densities at one point x, each computed by
// Boost.Math to full relative accuracy:
//   f(a, d; x) / f(a, c; x) = (1 - x)^(c - d) B(a, c) / B(a, d),
// with x between the two laws' means. Where the laws lie so far apart that
// a density underflows there, log-gamma serves only while its values stay
// small (a + c below 10^4: an error of about 1e-12); otherwise nothing, and
// the caller integrates. (Bridging far laws by halving c - d was tried: the
// steps' rounding added up to 3.5e-9 on Beta(851597, 432376).)
std::optional<double> log_beta_ratio(double a, double c, double d) {
    const double x = a / (a + (c + d) / 2);
    const double f_d = boost::math::ibeta_derivative(a, d, x), f_c = boost::math::ibeta_derivative(a, c, x);
    if (f_d > std::numeric_limits<double>::min() && f_c > std::numeric_limits<double>::min() &&
        std::isfinite(f_d) && std::isfinite(f_c))
        return std::log(f_d) - std::log(f_c) + (c - d) * std::log1p(-x);
    if (a + c < 1e4) return log_beta(a, c) - log_beta(a, d);
    return std::nullopt;
}

bool whole_and_small(double a) { return a == std::floor(a) && a <= max_sum_terms; }

// P(X > Y) as the finite sum of Cook (2005, "Exact calculation of beta
// inequalities", UT MD Anderson Cancer Center technical report), valid when
// X's first parameter a1 is a whole number:
//   sum_{i < a1} B(a2 + i, b1 + b2) / ((b1 + i) B(1 + i, b1) B(a2, b2)),
// every term positive (a small answer keeps its relative accuracy), each from
// the one before by t_{i+1} / t_i = (a2 + i)(b1 + i) / ((a2 + b1 + b2 + i)(1 + i)).
// The first term B(a2, b1 + b2) / B(a2, b2) is taken in logs and the sum kept
// to scale. Past their peak the terms fall for good: the sum stops when they
// no longer count. Nothing where that first term cannot be had accurately.
std::optional<double> ahead_sum(const beta_law& x, const beta_law& y) {
    const double a1 = x.a, b1 = x.b, a2 = y.a, b2 = y.b;
    const auto first = log_beta_ratio(a2, b1 + b2, b2);
    if (!first) return std::nullopt;
    double log_scale = *first;
    double term = 1.0, sum = 0.0;
    for (double i = 0; i < a1; ++i) {
        sum += term;
        const double ratio = (a2 + i) * (b1 + i) / ((a2 + b1 + b2 + i) * (1 + i));
        term *= ratio;
        if (ratio < 1 && term < sum * 1e-17) break;
        if (sum > 1e250) {
            sum *= 1e-250;
            term *= 1e-250;
            log_scale += 250 * std::log(10.0);
        }
    }
    return sum * std::exp(log_scale);
}

// P(X > Y) on the side that is the smaller probability (the law with the
// lower mean is the one less likely to be ahead), so small answers keep their
// relative accuracy: the finite sum where a parameter is a whole number of
// modest size (and its first term to be had accurately), else the integral. The sum runs over X's first parameter, or,
// mirrored (X > Y exactly when 1 - Y > 1 - X, and 1 - Y ~ Beta(b2, a2)), over
// Y's second one: the fewer terms wins, so a line with 10^6 attempts and few
// failures costs as many terms as it has failures.
double ahead_small_side(const beta_law& x, const beta_law& y, const detail::reach& how) {
    const bool direct = whole_and_small(x.a), mirrored = whole_and_small(y.b);
    std::optional<double> sum;
    if (mirrored && (!direct || y.b < x.a)) sum = ahead_sum({y.b, y.a}, {x.b, x.a});
    else if (direct) sum = ahead_sum(x, y);
    return sum ? *sum : ahead_direct(x, y, how);
}

double ahead_to(const beta_law& x, const beta_law& y, const detail::reach& how) {
    const double p = mean(x) <= mean(y) ? ahead_small_side(x, y, how) : 1.0 - ahead_small_side(y, x, how);
    return std::clamp(p, 0.0, 1.0);
}

}  // namespace

double ahead(const beta_law& x, const beta_law& y) { return ahead_to(x, y, detail::for_probability); }

double ahead_absolute(const beta_law& x, const beta_law& y) { return ahead_to(x, y, detail::for_comparison); }


namespace {

// P(X - Y <= d).
double difference_cdf(const beta_law& x, const beta_law& y, double d) {
    if (d <= -1) return 0.0;
    if (d >= 1) return 1.0;
    const auto [lo, hi] = window(y);
    auto f = [&](double t) {
        const double s = t + d;
        const double fx = s <= 0 ? 0.0 : s >= 1 ? 1.0 : boost::math::ibeta(x.a, x.b, s);
        return fx > 0 ? std::exp(log_density(y, t)) * fx : 0.0;
    };
    // Pieces: where t + d crosses 0 or 1 the integrand has a corner; Y's mean
    // is where its mass is.
    std::vector<double> cuts{lo, hi, mean(y)};
    for (double c : {-d, 1 - d})
        if (c > lo && c < hi) cuts.push_back(c);
    std::sort(cuts.begin(), cuts.end());
    double total = 0.0, error = 0.0;
    for (std::size_t k = 0; k + 1 < cuts.size(); ++k) {
        if (!(cuts[k + 1] > cuts[k])) continue;
        double piece_error = 0.0;
        total += singular_ends(y)
                     ? boost::math::quadrature::tanh_sinh<double>(12).integrate(f, cuts[k], cuts[k + 1], 1e-12,
                                                                                &piece_error)
                     : boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, cuts[k], cuts[k + 1],
                                                                                       quad_depth, cdf_tolerance,
                                                                                       &piece_error);
        error += piece_error;
    }
    if (error > 1e-11)
        throw no_convergence("A credible bound's integral did not reach its accuracy (error estimate " +
                             format_short(error) + ").");
    return std::clamp(total, 0.0, 1.0);
}

// P(X - Y <= d) and, scaled by `scale`, its density, in one adaptive
// Gauss-Kronrod pass over Y's window with a complex integrand (real part
// f_Y(t) F_X(t + d), imaginary part f_Y(t) f_X(t + d) scale). For laws
// without an infinite end; `w` is Y's window.
std::pair<double, double> difference_cdf_density(const beta_law& x, const beta_law& y, double d,
                                                 std::pair<double, double> w, double scale) {
    auto f = [&](double t) {
        const double s = t + d;
        if (s <= 0) return std::complex<double>(0.0, 0.0);
        const double fy = std::exp(log_density(y, t));
        if (s >= 1) return std::complex<double>(fy, 0.0);
        return std::complex<double>(fy * boost::math::ibeta(x.a, x.b, s),
                                    fy * boost::math::ibeta_derivative(x.a, x.b, s) * scale);
    };
    std::vector<double> cuts{w.first, w.second, mean(y)};
    for (double c : {-d, 1 - d})
        if (c > w.first && c < w.second) cuts.push_back(c);
    std::sort(cuts.begin(), cuts.end());
    std::complex<double> total = 0.0;
    double error = 0.0;
    for (std::size_t k = 0; k + 1 < cuts.size(); ++k) {
        if (!(cuts[k + 1] > cuts[k])) continue;
        double piece_error = 0.0;
        total += boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, cuts[k], cuts[k + 1], quad_depth,
                                                                              cdf_tolerance, &piece_error);
        error += piece_error;
    }
    if (error > 1e-11)
        throw no_convergence("A credible bound's integral did not reach its accuracy (error estimate " +
                             format_short(error) + ").");
    return {std::clamp(total.real(), 0.0, 1.0), total.imag() / scale};
}

// The quantile by Newton's method from the normal approximation, each step
// one pass giving the CDF and the density together; a step that would leave
// the bracket known so far is replaced by bisection. Two or three passes
// where the bracketing search took seven to eleven integrals (measured).
double difference_quantile_newton(const beta_law& x, const beta_law& y, double q) {
    const double spread = std::hypot(sd(x), sd(y));
    // A CDF needs no tails beyond its own accuracy: Y's quantiles at 1e-16
    // (what is cut is below 2e-16, absolute), a window about 3 times
    // narrower than the 1e-100 one of the probabilities that may be tiny.
    const std::pair<double, double> w{tail_point(y, 1e-16, false), tail_point(y, 1e-16, true)};
    double lo = -1.0, hi = 1.0;
    double d = std::clamp(mean(x) - mean(y) + spread * boost::math::quantile(boost::math::normal(), q), -1.0, 1.0);
    for (int step = 0; step < 60; ++step) {
        const auto [cdf, density] = difference_cdf_density(x, y, d, w, spread);
        const double g = cdf - q;
        (g < 0 ? lo : hi) = d;
        double next = d - g / density;
        if (!(density > 0) || !(next > lo && next < hi)) next = (lo + hi) / 2;
        // Converged: what remains after a Newton step of size e is about
        // e^2 f''/(2 f'), below 1e-11 for e < 3e-7 at these spreads.
        if (std::fabs(next - d) < 3e-7 * std::min(1.0, spread / 0.01) || hi - lo < 1e-12) return next;
        d = next;
    }
    throw no_convergence("A credible bound's root search did not converge.");
}

double difference_quantile(const beta_law& x, const beta_law& y, double q) {
    if (!singular_ends(x) && !singular_ends(y)) return difference_quantile_newton(x, y, q);
    auto f = [&](double d) { return d <= -1 ? -q : d >= 1 ? 1 - q : difference_cdf(x, y, d) - q; };
    // Start at the normal approximation's quantile and step away from it,
    // doubling the step, until the root is bracketed: two or three integrals
    // where a wide symmetric bracket took four to eight (measured).
    const double spread = std::hypot(sd(x), sd(y));
    const double guess = std::clamp(mean(x) - mean(y) + spread * boost::math::quantile(boost::math::normal(), q),
                                    -1.0, 1.0);
    double a = guess, fa = f(a), b = a, fb = fa;
    const double direction = fa < 0 ? 1.0 : -1.0;
    for (double step = 0.25 * spread; (fb < 0) == (fa < 0); step *= 2) {
        a = b;
        fa = fb;
        b = std::clamp(a + direction * step, -1.0, 1.0);
        fb = f(b);
        if (b == -1.0 || b == 1.0) break;
    }
    if (a > b) {
        std::swap(a, b);
        std::swap(fa, fb);
    }
    std::uintmax_t iterations = 100;
    // An absolute tolerance: a bound near 0 needs no relative digits.
    const auto r = boost::math::tools::toms748_solve(
        f, a, b, fa, fb, [](double u, double v) { return std::fabs(u - v) < 1e-12; }, iterations);
    if (iterations >= 100) throw no_convergence("A credible bound's root search did not converge.");
    return (r.first + r.second) / 2;
}

}  // namespace

interval difference(const beta_law& x, const beta_law& y, double level) {
    level = arguments::level(level, "level");
    return {difference_quantile(x, y, (1 - level) / 2), difference_quantile(x, y, (1 + level) / 2)};
}

namespace {

// Cross-group answers cost about G integrand terms per point and cell
// (BEST, LOSS), G^2 cells (ORDER) or G cells of G terms (TABLE): caps on
// the groups keep every call within seconds (README, Caps).
void check_groups(std::size_t groups, std::size_t cap, const char* what) {
    if (groups > cap)
        throw budget_exceeded(std::string(what) + " over " + std::to_string(groups) + " groups is beyond the cap of " +
                              std::to_string(cap) + " groups; compare fewer groups (a range of the rows in question).");
}

}  // namespace

namespace {

// One of the two passes, through the cache when there is one.
across_groups pass(std::span<const beta_law> laws, goal g, detail::answers what, across_cache* cache) {
    across_key key{{}, g, what == detail::answers::expected ? 1 : 0};
    if (cache) {
        for (const auto& l : laws) std::get<0>(key).insert(std::get<0>(key).end(), {l.a, l.b});
        if (auto hit = cache->find(key)) return *hit;
    }
    auto result = detail::compare_all(laws, g, detail::for_probability, what);
    if (cache) cache->put(key, result);
    return result;
}

}  // namespace

across_groups across(std::span<const beta_law> laws, goal g, across_cache* cache) {
    auto out = pass(laws, g, detail::answers::expected, cache);
    out.best = pass(laws, g, detail::answers::every_best, cache).best;
    return out;
}

double best(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache) {
    check_groups(laws.size(), max_groups_best, "The probability of being the best");
    return pass(laws, g, detail::answers::every_best, cache).best.at(i);
}

double loss(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache) {
    check_groups(laws.size(), max_groups_best, "The expected loss");
    return pass(laws, g, detail::answers::expected, cache).loss.at(i);
}

std::vector<std::vector<double>> order(std::span<const beta_law> laws) {
    const bool sums = std::all_of(laws.begin(), laws.end(), [](const beta_law& l) {
        return whole_and_small(l.a) && whole_and_small(l.b);
    });
    check_groups(laws.size(), sums ? max_groups_order : max_groups_order_integrals,
                 sums ? "The table of every pair's P(ahead)"
                      : "The table of every pair's P(ahead) with a prior that is not a whole number");
    std::vector<std::vector<double>> out(laws.size(), std::vector<double>(laws.size(), 0.0));
    // Each direction on its own (not 1 - the other): a small probability keeps
    // its relative accuracy.
    for (std::size_t r = 0; r < laws.size(); ++r)
        for (std::size_t col = 0; col < laws.size(); ++col)
            if (r != col) out[r][col] = ahead(laws[r], laws[col]);
    return out;
}

double same(std::span<const group> groups, prior p, double prior_same) {
    p = checked(p);
    if (!(prior_same > 0 && prior_same < 1))
        throw invalid_input("The argument prior_same (" + format_number(prior_same) +
                            ") must lie strictly between 0 and 1, for example 0.5.");
    // log marginal likelihoods without the binomial coefficients, common to both:
    // one rate: B(a + S, b + N - S) / B(a, b); independent rates: prod_g B(a + x_g, b + n_g - x_g) / B(a, b).
    double s = 0, n = 0, log_apart = 0;
    const double log_prior_norm = log_beta(p.a, p.b);
    for (const auto& g : groups) {
        const double x = static_cast<double>(g.successes), m = static_cast<double>(g.attempts);
        s += x;
        n += m;
        log_apart += log_beta(p.a + x, p.b + m - x) - log_prior_norm;
    }
    const double log_together = log_beta(p.a + s, p.b + n - s) - log_prior_norm;
    // posterior odds = prior odds x Bayes factor, then a probability, in logs.
    const double log_odds = std::log(prior_same) - std::log1p(-prior_same) + log_together - log_apart;
    return log_odds > 0 ? 1.0 / (1.0 + std::exp(-log_odds)) : std::exp(log_odds) / (1.0 + std::exp(log_odds));
}

std::vector<beta_law> posteriors(const counts& c, prior p) {
    p = checked(p);
    std::vector<beta_law> out;
    for (const auto& g : c.groups())
        out.push_back({p.a + static_cast<double>(g.successes), p.b + static_cast<double>(g.attempts - g.successes)});
    return out;
}

std::optional<double> density(const beta_law& law, double x) {
    if ((x <= 0 && law.a < 1) || (x >= 1 && law.b < 1)) return std::nullopt;
    return boost::math::ibeta_derivative(law.a, law.b, x);
}

std::vector<std::vector<std::optional<double>>> curves(const counts& c, std::int64_t points, prior p) {
    if (points < 2 || points > 10001)
        throw invalid_input("The argument points (" + std::to_string(points) +
                            ") must be a whole number from 2 to 10001: the rates drawn from 0 to 1.");
    const auto laws = posteriors(c, p);
    if (static_cast<double>(points) * static_cast<double>(laws.size()) > max_curve_values)
        throw budget_exceeded("The curves of " + std::to_string(laws.size()) + " groups at " + std::to_string(points) +
                              " points are beyond the cap of " + format_number(max_curve_values) +
                              " values; draw fewer points or fewer groups.");
    std::vector<std::vector<std::optional<double>>> rows;
    for (std::int64_t k = 0; k < points; ++k) {
        const double x = static_cast<double>(k) / static_cast<double>(points - 1);
        std::vector<std::optional<double>> row{x};
        for (const auto& law : laws) row.push_back(density(law, x));
        rows.push_back(std::move(row));
    }
    return rows;
}

std::vector<summary_row> summary(const counts& c, double level, goal g, prior p, across_cache* cache) {
    const auto laws = posteriors(c, p);
    check_groups(laws.size(), max_groups_table, "The posterior table");
    const auto answers = across(laws, g, cache);  // every row's P(best) and loss: the cells' own pass
    std::vector<summary_row> rows;
    for (std::size_t k = 0; k < laws.size(); ++k)
        rows.push_back({c.groups()[k].position, mean(laws[k]), credible(laws[k], level, kind::central),
                        answers.best[k], answers.loss[k]});
    return rows;
}

}  // namespace tallyrates::bayes
