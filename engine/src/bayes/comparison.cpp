// comparison.cpp - P(one group's rate above another's): Cook's (2005) finite
// sum where a parameter is a modest whole number, else one pass over the rate
// axis (rate_axis.hpp); and the table of every pair. Sources in
// tallyrates/bayes/comparison.hpp.
#include "tallyrates/bayes/comparison.hpp"

#include <algorithm>
#include <boost/math/special_functions/beta.hpp>
#include <cmath>
#include <limits>
#include <optional>

#include "bayes/law_math.hpp"
#include "bayes/rate_axis.hpp"

namespace tallyrates::bayes {

using namespace detail;

namespace {

// P(X > Y) as an integral: the shared pass over the rate axis of
// rate_axis.cpp for two groups (pieces cut at both laws' scales).
double ahead_direct(const beta_law& x, const beta_law& y, const detail::reach& how, detail::work_meter* meter) {
    const beta_law both[] = {x, y};
    return detail::compare_all(both, goal::high, how, detail::answers::first_best, meter).best[0];
}

// Largest number of terms the finite sum may take (about 2 ms; 10^6 terms
// measured at 1.06 ms), and a term's cost in the units of work_meter (about
// 1 us each).
constexpr double max_sum_terms = 2000000, sum_term_units = 1.0 / 1000;

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
std::optional<double> ahead_sum(const beta_law& x, const beta_law& y, detail::work_meter* meter) {
    const double a1 = x.a, b1 = x.b, a2 = y.a, b2 = y.b;
    const auto first = log_beta_ratio(a2, b1 + b2, b2);
    if (!first) return std::nullopt;
    double log_scale = *first;
    double term = 1.0, sum = 0.0, i = 0;
    for (; i < a1; ++i) {
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
    if (meter) meter->add(i * sum_term_units);
    return sum * std::exp(log_scale);
}

// P(X > Y) on the side that is the smaller probability (the law with the
// lower mean is the one less likely to be ahead), so small answers keep their
// relative accuracy: the finite sum where a parameter is a whole number of
// modest size (and its first term to be had accurately), else the integral. The sum runs over X's first parameter, or,
// mirrored (X > Y exactly when 1 - Y > 1 - X, and 1 - Y ~ Beta(b2, a2)), over
// Y's second one: the fewer terms wins, so a line with 10^6 attempts and few
// failures costs as many terms as it has failures.
// `meter`, where given, counts the work of a call of many comparisons.
double ahead_small_side(const beta_law& x, const beta_law& y, const detail::reach& how,
                        detail::work_meter* meter = nullptr) {
    const bool direct = whole_and_small(x.a), mirrored = whole_and_small(y.b);
    std::optional<double> sum;
    if (mirrored && (!direct || y.b < x.a)) sum = ahead_sum({y.b, y.a}, {x.b, x.a}, meter);
    else if (direct) sum = ahead_sum(x, y, meter);
    return sum ? *sum : ahead_direct(x, y, how, meter);
}

double ahead_to(const beta_law& x, const beta_law& y, const detail::reach& how, detail::work_meter* meter = nullptr) {
    const double p =
        mean(x) <= mean(y) ? ahead_small_side(x, y, how, meter) : 1.0 - ahead_small_side(y, x, how, meter);
    return std::clamp(p, 0.0, 1.0);
}

// {ahead_to(x, y), ahead_to(y, x)}, each the value it gives alone, from one
// small-side computation where the means differ (both sides are then the
// same integral or sum).
std::pair<double, double> ahead_both(const beta_law& x, const beta_law& y, const detail::reach& how,
                                     detail::work_meter& meter) {
    if (mean(x) == mean(y)) return {ahead_to(x, y, how, &meter), ahead_to(y, x, how, &meter)};
    const bool x_behind = mean(x) < mean(y);
    const double small = x_behind ? ahead_small_side(x, y, how, &meter) : ahead_small_side(y, x, how, &meter);
    const double behind = std::clamp(small, 0.0, 1.0), front = std::clamp(1.0 - small, 0.0, 1.0);
    return x_behind ? std::pair{behind, front} : std::pair{front, behind};
}

}  // namespace

double ahead(const beta_law& x, const beta_law& y) { return ahead_to(x, y, detail::for_probability); }

double ahead_absolute(const beta_law& x, const beta_law& y) { return ahead_to(x, y, detail::for_comparison); }

std::vector<std::vector<double>> order(std::span<const beta_law> laws, goal g) {
    check_groups(laws.size(), max_groups_order, "The table of every pair's P(ahead)");
    std::vector<std::vector<double>> out(laws.size(), std::vector<double>(laws.size(), 0.0));
    // One computation per pair, on its small side (so a small probability
    // keeps its relative accuracy); every cell is what RATES.POST.AHEAD gives.
    // One meter for all the pairs: the cap bounds the whole table.
    detail::work_meter meter{"The table of every pair's P(ahead)"};
    for (std::size_t r = 0; r < laws.size(); ++r)
        for (std::size_t col = r + 1; col < laws.size(); ++col) {
            const auto [r_ahead, col_ahead] = ahead_both(laws[r], laws[col], detail::for_probability, meter);
            out[r][col] = g == goal::high ? r_ahead : col_ahead;
            out[col][r] = g == goal::high ? col_ahead : r_ahead;
        }
    return out;
}

}  // namespace tallyrates::bayes
