// one_rate.cpp - intervals for one rate; methods and sources in one_rate.hpp.
#include "tallyrates/pairs/one_rate.hpp"

#include <algorithm>
#include <boost/math/distributions/binomial.hpp>
#include <boost/math/distributions/normal.hpp>
#include <cmath>

#include "tallyrates/core/arguments.hpp"

namespace tallyrates::one_rate {

namespace {

using binomial = boost::math::binomial_distribution<double>;

// Wilson (1927): centre (x + z^2/2) / (n + z^2), half-width
// z sqrt(x (n - x) / n + z^2 / 4) / (n + z^2). Exactly 0 and 1 at the ends
// (the formula gives them only up to rounding).
interval wilson(double x, double n, double z) {
    const double z2 = z * z;
    const double centre = (x + z2 / 2) / (n + z2);
    const double half = z * std::sqrt(x * (n - x) / n + z2 / 4) / (n + z2);
    return {x == 0 ? 0.0 : std::max(0.0, centre - half), x == n ? 1.0 : std::min(1.0, centre + half)};
}

interval agresti_coull(double x, double n, double z) {
    const double z2 = z * z;
    const double n_tilde = n + z2;
    const double p_tilde = (x + z2 / 2) / n_tilde;
    const double half = z * std::sqrt(p_tilde * (1 - p_tilde) / n_tilde);
    return {std::max(0.0, p_tilde - half), std::min(1.0, p_tilde + half)};
}

interval boost_bounds(double x, double n, double level, binomial::interval_type type) {
    const double tail = (1 - level) / 2;
    return {binomial::find_lower_bound_on_p(n, x, tail, type), binomial::find_upper_bound_on_p(n, x, tail, type)};
}

}  // namespace

double two_sided_z(double level) {
    return boost::math::quantile(boost::math::complement(boost::math::normal(), (1 - level) / 2));
}

interval bounds(std::int64_t x, std::int64_t n, double level, method how) {
    return bounds_at(static_cast<double>(x), static_cast<double>(n), level, how);
}

interval bounds_at(double xd, double nd, double level, method how) {
    switch (how) {
        case method::wilson: return wilson(xd, nd, two_sided_z(level));
        case method::agresti_coull: return agresti_coull(xd, nd, two_sided_z(level));
        case method::clopper_pearson: return boost_bounds(xd, nd, level, binomial::clopper_pearson_exact_interval);
        case method::jeffreys: return boost_bounds(xd, nd, level, binomial::jeffreys_prior_interval);
    }
    return {};
}

interval bounds(const group& g, double level, method how, sides s) {
    return bounds(g.successes, g.attempts, arguments::interval_level(level, s, "level"), how);
}

}  // namespace tallyrates::one_rate
