// alike.cpp - SAME: the posterior probability that every group shares one
// rate, from the two marginal likelihoods in closed form (Kass & Raftery 1995).
#include "tallyrates/bayes/alike.hpp"

#include <cmath>

#include "bayes/law_math.hpp"
#include "tallyrates/core/errors.hpp"
#include "tallyrates/core/text.hpp"

namespace tallyrates::bayes {

using namespace detail;

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

}  // namespace tallyrates::bayes
