// law_math.cpp - shared pieces of a Beta law (law_math.hpp): Boost.Math's
// incomplete beta function, its inverse and derivative.
#include "bayes/law_math.hpp"

#include <boost/math/special_functions/beta.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>
#include <stdexcept>
#include <string>

#include "bayes/rate_axis.hpp"
#include "tallyrates/core/errors.hpp"

namespace tallyrates::bayes::detail {

double log_beta(double a, double b) {
    return boost::math::lgamma(a) + boost::math::lgamma(b) - boost::math::lgamma(a + b);
}

double quantile(const beta_law& law, double q) { return boost::math::ibeta_inv(law.a, law.b, q); }

double log_kernel(const beta_law& law, double x) {
    return (law.a - 1) * std::log(x) + (law.b - 1) * std::log1p(-x);
}

// Boost's beta density is accurate for large parameters (no log-gamma
// differences); it underflows only far in the tails, where it does not count.
double log_density(const beta_law& law, double x) {
    try {
        const double d = boost::math::ibeta_derivative(law.a, law.b, x);
        return d > 0 ? std::log(d) : -HUGE_VAL;
    } catch (const std::overflow_error&) {
        // Next to an end where the density is infinite (a or b below 1): in
        // logs, where the parameters are small and log-gamma is exact enough.
        return log_kernel(law, x) - log_beta(law.a, law.b);
    }
}

double tail_point(const beta_law& law, double tail, bool upper) {
    return upper ? 1 - detail::lower_tail_point(law.b, law.a, tail) : detail::lower_tail_point(law.a, law.b, tail);
}

bool singular_ends(const beta_law& law) { return law.a < 1 || law.b < 1; }

double sd(const beta_law& law) {
    const double n = law.a + law.b;
    return std::sqrt(law.a * law.b / (n * n * (n + 1)));
}

std::pair<double, double> window(const beta_law& law, double tail) {
    // Next to an end where the density is infinite (a or b below 1) the tail
    // holds about d^a (or d^b) within d of it: the quantile is that end in
    // double precision, and Boost's inverse gives up there (tail_point's
    // bisection fallback took about 1 ms; measured).
    return {law.a < 1 ? 0.0 : tail_point(law, tail, false), law.b < 1 ? 1.0 : tail_point(law, tail, true)};
}

void check_groups(std::size_t groups, std::size_t cap, const char* what) {
    if (groups > cap)
        throw budget_exceeded(std::string(what) + " over " + std::to_string(groups) + " groups is beyond the cap of " +
                              std::to_string(cap) + " groups; compare fewer groups (a range of the rows in question).");
}

}  // namespace tallyrates::bayes::detail
