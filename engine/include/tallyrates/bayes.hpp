// bayes.hpp - Bayesian answers about one group's rate, computed, not sampled.
//
// Each group's rate has an independent Beta(prior_a, prior_b) prior; after x
// successes in n attempts its posterior is Beta(prior_a + x, prior_b + n - x)
// (conjugacy; Gelman et al. 2013, Bayesian Data Analysis, 3rd ed., 2.4). A
// group with no attempts yet keeps the prior. Everything below is a closed
// form in Boost.Math's incomplete beta function and its inverses, or a root
// search (Boost.Math TOMS 748) on them; nothing is sampled, so a cell gives the
// same value at every recalculation.
// - credible bounds: "central" (equal tails) or "hpd", the highest posterior
//   density interval, the shortest one: density equal at both ends (Chen &
//   Shao 1999, J Comput Graph Stat 8:69, for its properties); one-sided at 0
//   or 1 when the density is monotone there;
// - ABOVE: P(rate > r) = 1 - I_r(a, b), from the regularized incomplete beta;
// - NEXT: the beta-binomial predictive law of the successes in m further
//   attempts (Gelman et al. 2013, 2.4): its upper tail summed by the ratio of
//   successive terms, starting from a term computed in logs.
#pragma once

#include <cstdint>

#include "tallyrates/counts.hpp"
#include "tallyrates/one_rate.hpp"

namespace tallyrates::bayes {

struct prior {
    double a = 1.0;
    double b = 1.0;
};
enum class goal { high, low };        // successes are good, or the counts are defects
enum class kind { central, hpd };

struct beta_law {
    double a = 1.0, b = 1.0;
};

// Checks the prior (both > 0 and finite; invalid_input otherwise).
prior checked(prior p);
// The posterior of the group at position i (blank rows refused; a group
// without attempts has the prior as its posterior).
beta_law posterior(const counts& c, double i, prior p);

double mean(const beta_law& law);
interval credible(const beta_law& law, double level, kind how);
// P(rate > r), or P(rate < r) for goal low; r in [0, 1].
double above(const beta_law& law, double rate, goal g);
// P(at least k successes in the next m attempts); 0 <= k <= m, m up to 10^7.
double next_at_least(const beta_law& law, std::int64_t m, std::int64_t k);

}  // namespace tallyrates::bayes
