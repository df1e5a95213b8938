// cells.hpp - the engine's functions of one or two groups called the way a
// worksheet cell calls them: the position as typed, checked by the tally
// first (as the extension does), then the engine's function of the groups.
// Shared by the tests and the benchmarks (no GoogleTest here).
#pragma once

#include "tallyrates/bayes/law.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/pairs/one_rate.hpp"
#include "tallyrates/pairs/pairwise.hpp"

namespace tallyrates::testing::cell {

inline double difference(const counts& c, double i, double j) {
    const auto [a, b] = pairwise::pair_at(c, i, j);
    return pairwise::difference(a, b);
}

inline interval difference_interval(const counts& c, double i, double j, const pairwise::interval_options& o) {
    const auto [a, b] = pairwise::pair_at(c, i, j);
    return pairwise::difference_interval(c, a, b, o);
}

inline double same_rate_p(const counts& c, double i, double j, const pairwise::test_options& o,
                          pairwise::p_cache* cache = nullptr) {
    const auto [a, b] = pairwise::pair_at(c, i, j);
    return pairwise::same_rate_p(c, a, b, o, cache);
}

inline interval one_bounds(const counts& c, double i, double level, one_rate::method how) {
    return one_rate::bounds(c.with_attempts_at(i, "i"), level, how);
}

inline bayes::beta_law posterior(const counts& c, double i, bayes::prior p) {
    return bayes::posterior(c.at_position(i, "i"), p);
}

}  // namespace tallyrates::testing::cell
