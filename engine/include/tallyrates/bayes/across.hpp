// across.hpp - answers that weigh every group at once: BEST, P(group i is
// best) = integral of f_i(x) prod_{j != i} F_j(x) dx (1 - F_j for goal "low");
// LOSS, E[max_j rate_j] - E[rate_i] with E[max] = integral of
// (1 - prod_j F_j(x)) dx; and TABLE, every group's mean, bounds, BEST and
// LOSS. The integrals come from one pass over the rate axis for all groups at
// once (src/bayes/rate_axis.hpp: pieces cut at every law's scale, within the
// laws' 1e-100 windows, so what is cut is below 1e-90; adaptive Gauss-Kronrod
// to a relative error estimate of 1e-10 per answer); a pass that does not
// reach it within its caps is a failure (Err:523), never a silent answer.
#pragma once

#include <span>
#include <string>
#include <utility>
#include <vector>

#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/cache.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/interval.hpp"

namespace tallyrates::bayes {

// Caps on the groups of one call (budget_exceeded, Err:523, beyond them):
// BEST and LOSS integrate products over every group (one pass for all of
// them), TABLE is the same pass plus G credible intervals. 500 groups of 300
// take 70 ms (flat prior) and 0.1 s (Jeffreys') a pass (README, Speed):
// their laws are evaluated in double while groups x attempts stay below 3e5
// (rate_axis.cpp); beyond, in long double, 10 times slower, and the work cap
// of a pass (about 2 s) refuses what larger groups would cost.
inline constexpr std::size_t max_groups_best = 500, max_groups_table = max_groups_best;

// Every group's chance of being the best and expected loss, all from one
// pass over the rate axis for all groups (src/bayes/rate_axis.hpp).
struct across_groups {
    std::vector<double> best;  // P(group k has the best rate)
    std::vector<double> loss;  // E[best rate] - E[rate_k] (mirrored for goal low), >= 0
    double expected_best = 0;  // E[max] for goal high, E[min] for goal low
};
// Memo of the pass keyed by the laws' parameters and the goal, so that
// columns of RATES.POST.BEST and .LOSS cells beside a RATES.POST.TABLE cost
// one pass in all, and every cell shows the table's value to the last bit.
using across_key = std::pair<std::vector<double>, goal>;
using across_cache = lru_cache<across_key, across_groups>;
across_groups across(std::span<const beta_law> laws, goal g, across_cache* cache = nullptr);

// P(law i has the best rate among `laws`) (the highest, or the lowest for goal low).
double best(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache = nullptr);
// Expected shortfall of choosing law i: E[best rate] - E[rate_i] (mirrored for goal low).
double loss(std::span<const beta_law> laws, std::size_t i, goal g, across_cache* cache = nullptr);
// RATES.POST.TABLE: per non-blank group, what the single-cell functions give.
struct summary_row {
    std::size_t position = 0;
    double mean = 0;
    interval bounds;  // central, at `level`
    double best = 0, loss = 0;
};
// Its header: six column titles, the bounds saying their level.
std::vector<std::string> summary_header(double level);
std::vector<summary_row> summary(const counts& c, double level, goal g, prior p, across_cache* cache = nullptr);

}  // namespace tallyrates::bayes
