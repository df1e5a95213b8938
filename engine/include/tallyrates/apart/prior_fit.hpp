// prior_fit.hpp - a Beta prior fitted to the groups themselves (partial
// pooling): the (a, b) that maximise the marginal likelihood of the counts
// under the beta-binomial law, prod_i B(a + x_i, b + n_i - x_i) / B(a, b)
// (Williams 1975, Biometrics 31:949; the binomial coefficients do not depend
// on a and b). Ready for the prior_a, prior_b arguments of the POST
// functions: a pilot of 10 of 10 is then pulled toward the other lines.
//
// Search: the mean mu = a / (a + b) and the weight m = a + b; for each m the
// best mu by Brent's method on the logit (Boost.Math brent_find_minima), and
// the best m by Brent's method on log m. When the groups vary no more than
// counting explains, the likelihood keeps growing with m: the search stops at
// a + b = max_total, the largest prior the POST functions take, and says so.
// a and b stay within the POST functions' range [bayes::min_prior, max_total].
#pragma once

#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/counts.hpp"

namespace tallyrates::apart {

inline constexpr double max_total = bayes::max_prior;

struct fitted_prior {
    bayes::prior prior;
    bool at_cap = false;  // no spread beyond counting: a + b stopped at max_total
    double log_likelihood = 0;
};

// Over the groups with attempts; invalid_input with fewer than two.
fitted_prior fit_prior(const counts& c);

// The marginal log-likelihood sum_i log B(a + x_i, b + n_i - x_i) - log B(a, b)
// (for tests and the search).
double beta_binomial_log_likelihood(const counts& c, double a, double b);

}  // namespace tallyrates::apart
