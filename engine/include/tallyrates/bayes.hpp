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
//   attempts (Gelman et al. 2013, 2.4): P(at least k) = P(rate > Y) with
//   Y ~ Beta(k, m - k + 1) (the binomial tail as an incomplete beta, DLMF
//   8.17.5), computed as AHEAD below, so its cost does not grow with m;
// Comparisons of groups are one-dimensional integrals over a rate x:
// - AHEAD: P(rate_1 > rate_2), on the side that is the smaller probability so
//   that small answers keep their relative accuracy: the finite sum of Cook
//   (2005, technical report, UT MD Anderson Cancer Center) over the first
//   Beta parameter of the group behind, or over the second of the group ahead
//   (by symmetry), whichever is the smaller whole number up to 2,000,000
//   (whole counts and a whole prior), else the integral of f_1(x) F_2(x) dx;
//   BEST: P(group i is best) = integral of f_i(x) prod_{j != i} F_j(x) dx
//   (1 - F_j for goal "low"); LOSS: E[max_j rate_j] - E[rate_i] with
//   E[max] = integral of (1 - prod_j F_j(x)) dx. The integrals come from one
//   pass over the rate axis for all groups at once (src/bayes_across.hpp:
//   pieces cut at every law's scale, within the laws' 1e-100 windows, so what
//   is cut is below 1e-90; adaptive Gauss-Kronrod to a relative error
//   estimate of 1e-10 per answer); a pass that does not reach it within its
//   caps is a failure (Err:523), never a silent answer.
// - SAME: the posterior probability that all groups share one rate against
//   all rates different, from the two marginal likelihoods in closed form
//   (beta functions, in logs; Kass & Raftery 1995, JASA 90:773, for Bayes
//   factors).
#pragma once

#include <cstdint>
#include <optional>
#include <span>
#include <tuple>
#include <vector>

#include "tallyrates/cache.hpp"
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

// The prior parameters accepted. Above 10^6 a prior outweighs any tally a
// sheet holds and, near 10^16, swallows the counts in rounding (a prior of
// 1e300 made 13 of 14 and 10 of 14 the same law); below 0.01 a group with no
// successes puts nearly all its mass within 1e-100 of 0, which no
// double-precision answer resolves. Common priors (1, 0.5, 1/3) lie well inside.
inline constexpr double min_prior = 0.01, max_prior = 1e6;
// Checks the prior (both within [min_prior, max_prior]; invalid_input otherwise).
prior checked(prior p);
// The posterior of the group at position i (blank rows refused; a group
// without attempts has the prior as its posterior).
beta_law posterior(const counts& c, double i, prior p);

double mean(const beta_law& law);
interval credible(const beta_law& law, double level, kind how);
// P(rate > r), or P(rate < r) for goal low; r in [0, 1].
double above(const beta_law& law, double rate, goal g);
// P(at least k successes in the next m attempts); 0 <= k <= m (any m the
// arguments allow, up to 10^15: the answer is one comparison of two laws).
double next_at_least(const beta_law& law, std::int64_t m, std::int64_t k);

// P(rate of law x > rate of law y).
double ahead(const beta_law& x, const beta_law& y);
// The same to an absolute accuracy of about 1e-9 only (a tiny probability
// loses its relative digits), where it is compared with a confidence
// (RATES.PLAN.AHEAD): an integral, when one is needed, runs over the law's
// 1e-16 quantiles instead of its 1e-100 ones, to a relative tolerance of
// 1e-9. Finite sums are as in `ahead`.
double ahead_absolute(const beta_law& x, const beta_law& y);
// Central credible bounds at `level` for rate_x - rate_y: the d where
// P(rate_x - rate_y <= d) = (1 -+ level) / 2, that probability being the
// integral of f_y(t) F_x(t + d) dt (split where t + d meets 0 or 1), found by
// a bracketing root search (TOMS 748).
interval difference(const beta_law& x, const beta_law& y, double level);
// Caps on the groups of one call (budget_exceeded, Err:523, beyond them),
// measured to keep each call within about 2 s: BEST and LOSS integrate
// products over every group (one pass for all of them; README, Speed, for
// the figures); ORDER fills G x G cells (100 groups with whole priors; 40
// otherwise, where each cell may be an integral); TABLE is the same pass
// plus G credible intervals; CURVE draws points x G densities.
inline constexpr std::size_t max_groups_best = 200, max_groups_order = 100, max_groups_order_integrals = 40,
                             max_groups_table = 30;
inline constexpr double max_curve_values = 2e6;

// Every group's chance of being the best and expected loss, each from one
// pass over the rate axis for all groups (src/bayes_across.hpp).
struct across_groups {
    std::vector<double> best;  // P(group k has the best rate)
    std::vector<double> loss;  // E[best rate] - E[rate_k] (mirrored for goal low), >= 0
    double expected_best = 0;  // E[max] for goal high, E[min] for goal low
};
// Memo of those passes keyed by the laws' parameters, the goal and which
// pass (0: P(best), 1: expected best), so that a column of RATES.POST.BEST
// or .LOSS cells beside a RATES.POST.TABLE costs one pass each, and every
// cell shows the table's value to the last bit.
using across_key = std::tuple<std::vector<double>, goal, int>;
using across_cache = lru_cache<across_key, across_groups>;
across_groups across(std::span<const beta_law> laws, goal g, across_cache* cache = nullptr);

// P(law i has the best rate among `laws`) (the highest, or the lowest for goal low).
double best(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache = nullptr);
// Expected shortfall of choosing law i: E[best rate] - E[rate_i] (mirrored for goal low).
double loss(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache = nullptr);
// RATES.POST.ORDER: cell (r, c) holds P(rate_r > rate_c), the diagonal 0.
std::vector<std::vector<double>> order(std::span<const beta_law> laws);
// Posterior probability that every group shares one rate (prior probability
// prior_same of that against all rates independent), for the groups' counts.
double same(std::span<const group> groups, prior p, double prior_same);

// The posteriors of every non-blank group of the tally, in range order.
std::vector<beta_law> posteriors(const counts& c, prior p);

// Posterior density at x in [0, 1]; none where it is infinite (x = 0 with
// a < 1, x = 1 with b < 1).
std::optional<double> density(const beta_law& law, double x);

// RATES.POST.CURVE: `points` rates evenly from 0 to 1 (2 to 10,001), and at
// each the density of every non-blank group: rows of {rate, d_1, ..., d_G}.
std::vector<std::vector<std::optional<double>>> curves(const counts& c, std::int64_t points, prior p);

// RATES.POST.TABLE: per non-blank group, what the single-cell functions give.
struct summary_row {
    std::size_t position = 0;
    double mean = 0;
    interval bounds;  // central, at `level`
    double best = 0, loss = 0;
};
std::vector<summary_row> summary(const counts& c, double level, goal g, prior p, across_cache* cache = nullptr);

}  // namespace tallyrates::bayes
