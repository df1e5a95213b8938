// law.hpp - Bayesian answers about one group's rate, computed, not sampled.
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
//   attempts (Gelman et al. 2013, 2.4): P(at least k) = P(rate > Y) with
//   Y ~ Beta(k, m - k + 1) (the binomial tail as an incomplete beta, DLMF
//   8.17.5), computed as `ahead` (comparison.hpp), so its cost does not grow
//   with m.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/interval.hpp"
#include "tallyrates/core/rules.hpp"

namespace tallyrates::bayes {

struct prior {
    double a = 1.0;
    double b = 1.0;
};
using tallyrates::default_goal;
using tallyrates::goal;  // rules.hpp: successes are good, or the counts are defects
// Equal tails, the shortest interval, or each bound alone holding at the level.
enum class kind { central, hpd, one_sided };
inline constexpr kind default_kind = kind::central;

struct beta_law {
    double a = 1.0, b = 1.0;
};

// The prior parameters accepted. Above 10^6 a prior outweighs any tally a
// sheet holds and, near 10^16, swallows the counts in rounding (a prior of
// 1e300 made 13 of 14 and 10 of 14 the same law); below 0.01 a group with no
// successes puts nearly all its mass within 1e-100 of 0, which no
// double-precision answer resolves. Common priors (1, 0.5, 1/3) lie well inside.
inline constexpr double min_prior = 0.01, max_prior = 1e6;
// Checks the prior (both within [min_prior, max_prior]; invalid_input otherwise).
prior checked(prior p);
// The posterior of a group of a tally (counts::at_position; a group without
// attempts has the prior as its posterior).
beta_law posterior(const group& g, prior p);

double mean(const beta_law& law);
// The law of 1 - rate: what goal low turns a tally of defects into (units
// without the defect counted as successes).
inline beta_law mirrored(const beta_law& law) { return {law.b, law.a}; }
interval credible(const beta_law& law, double level, kind how);
// P(rate > r), or P(rate < r) for goal low; r in [0, 1].
double above(const beta_law& law, double rate, goal g);
// P(at least k successes in the next m attempts); 0 <= k <= m (any m the
// arguments allow, up to 10^15: the answer is one comparison of two laws).
double next_at_least(const beta_law& law, std::int64_t m, std::int64_t k);

// The posteriors of every non-blank group of the tally, in range order.
std::vector<beta_law> posteriors(const counts& c, prior p);

// Posterior density at x in [0, 1]; none where it is infinite (x = 0 with
// a < 1, x = 1 with b < 1).
std::optional<double> density(const beta_law& law, double x);

// Cap on the densities of one CURVE call, points x G (Err:523 beyond it).
inline constexpr double max_curve_values = 2e6;
// Which rates RATES.POST.CURVE draws: every rate from 0 to 1, or the rates
// some group is likely to have, from the lowest group's curve_tail quantile
// to the highest group's 1 - curve_tail quantile, widened to whole percents
// (a chart with automatic axes then follows the counts as they change).
enum class curve_span { whole, likely };
inline constexpr curve_span default_curve_span = curve_span::whole;
inline constexpr double curve_tail = 1e-4;
// RATES.POST.CURVE: `points` rates evenly over the span (2 to 10,001), and at
// each the density of every non-blank group: rows of {rate, d_1, ..., d_G}.
std::vector<std::vector<std::optional<double>>> curves(const counts& c, std::int64_t points, prior p,
                                                       curve_span span = default_curve_span);
// Its header: "rate", then each non-blank group's label ("position 4" when
// it has none), which a chart takes as its legend.
std::vector<std::string> curves_header(const counts& c);
// Points drawn when none are given: steps of 1 %.
inline constexpr std::int64_t default_curve_points = 101;
// The limits of `points`.
inline constexpr std::int64_t min_curve_points = 2, max_curve_points = 10001;

}  // namespace tallyrates::bayes
