// terms.cpp (detail) - the per-group terms of X^2, G^2 and the table
// probability (see terms.hpp), the observed totals and the tie threshold.
#include "terms.hpp"

#include <algorithm>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>

#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/rules.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::detail {

using omnibus::ordering;
using omnibus::table;


namespace {
// log C(n, k) as lgamma differences under a Boost policy.
template <class Policy>
double log_choose_with(std::int64_t n, std::int64_t k, const Policy& policy) {
    const auto lg = [&](std::int64_t m) { return boost::math::lgamma(static_cast<double>(m) + 1, policy); };
    return lg(n) - lg(k) - lg(n - k);
}

// The term tables take lgamma in double precision. Boost promotes to long
// double by default, which made the tables of the probability ordering 90 %
// of an exact call on small tables (2 x 12, N = 60: 60 of 67 us); the terms
// only order tables (1e-7 tie tolerance), never enter a p-value.
double log_choose_fast(std::int64_t n, std::int64_t k) {
    return log_choose_with(n, k, boost::math::policies::policy<boost::math::policies::promote_double<false>>());
}
}  // namespace

// The probability a report shows keeps Boost's default (long double inside).
double log_choose(std::int64_t n, std::int64_t k) { return log_choose_with(n, k, boost::math::policies::policy<>()); }

namespace {
// x ln(x / e) with 0 ln 0 = 0.
double xlogx_over(double x, double e) { return x == 0.0 ? 0.0 : x * std::log(x / e); }
}  // namespace

term_function::term_function(const table& t, ordering o) : t_(t), o_(o) {
    N_ = static_cast<double>(t.attempts);
    S_ = static_cast<double>(t.successes);
    F_ = N_ - S_;
}

double term_function::operator()(std::size_t g, std::int64_t x) const {
    const double nd = static_cast<double>(t_.n[g]);
    const double xd = static_cast<double>(x);
    switch (o_) {
        case ordering::pearson: {
            const double d = xd - nd * S_ / N_;
            return d * d * (N_ * N_ / (nd * S_ * F_));
        }
        case ordering::lr:
            return 2.0 * (xlogx_over(xd, nd * S_ / N_) + xlogx_over(nd - xd, nd * F_ / N_));
        case ordering::probability:
            return log_choose_fast(t_.n[g], t_.x[g]) - log_choose_fast(t_.n[g], x);
    }
    return 0.0;
}

double term_values(const table& t) {
    const std::int64_t S = t.successes, F = t.attempts - t.successes;
    double cells = 0;
    for (auto n : t.n) cells += static_cast<double>(std::min({n, S, F})) + 1;
    return cells;
}

std::vector<term_row> term_tables(const table& t, ordering o) {
    const term_function term(t, o);
    const std::int64_t S = t.successes, F = t.attempts - t.successes;
    const double cells = term_values(t);
    if (cells > max_term_values)
        throw budget_exceeded("The tables of this route would hold " + format_number(cells) +
                              " values, more than memory allows; counts this large suit the chi-square route.");
    std::vector<term_row> rows(t.groups());
    for (std::size_t g = 0; g < t.groups(); ++g) {
        const std::int64_t n = t.n[g];
        rows[g].first = std::max<std::int64_t>(0, n - F);
        const std::int64_t last = std::min(n, S);
        rows[g].values.reserve(static_cast<std::size_t>(last - rows[g].first + 1));
        for (std::int64_t x = rows[g].first; x <= last; ++x) rows[g].values.push_back(term(g, x));
    }
    return rows;
}

double observed_total(const table& t, ordering o) {
    const term_function term(t, o);
    double total = 0.0;
    for (std::size_t g = 0; g < t.groups(); ++g) total += term(g, t.x[g]);
    return total;
}

double extreme_threshold(double observed, ordering o) {
    if (o == ordering::probability) return observed - tie_tolerance;
    // The 1e-12 floor keeps tied tables whose G^2 rounds a hair below 0.
    return observed * (1.0 - tie_tolerance) - 1e-12;
}

}  // namespace tallyrates::detail
