// pairwise.hpp - comparisons of two groups: the difference of their rates,
// intervals for it, tests of "same rate", and the family of all such
// comparisons with multiplicity control (adjust.hpp).
//
// Intervals for rate_i - rate_j (Newcombe 1998, Stat Med 17:873, compares
// them; Fagerland, Lydersen & Laake 2015, SMMR 24:224, recommend the first
// two):
// - newcombe: the hybrid score interval, Newcombe's method 10, built from the
//   two Wilson intervals;
// - score: Miettinen & Nurminen (1985, Stat Med 4:213), inverting the score
//   statistic with the restricted maximum likelihood estimate in the closed
//   form of Farrington & Manning (1990, Stat Med 9:1447) and the variance
//   factor N/(N - 1); the bounds are found by a bracketing root search
//   (Boost.Math TOMS 748);
// - agresti_caffo: one success and one failure added to each group (Agresti &
//   Caffo 2000, Am Stat 54:280), clipped to [-1, 1];
// - wald: the textbook normal approximation, for comparison only (it collapses
//   to zero width at 0 % and 100 %), clipped to [-1, 1].
// Tests of rate_i = rate_j, two-sided:
// - score: Pearson's chi-square on the 2 x 2 table (no continuity correction);
// - exact: Fisher's conditional test, summing the tables no more probable than
//   the observed one (relative tie tolerance 1e-7, methods.md).
#pragma once

#include <cstdint>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/cache.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/pairs/adjust.hpp"
#include "tallyrates/pairs/one_rate.hpp"

namespace tallyrates::pairwise {

enum class interval_method { newcombe, score, agresti_caffo, wald };
enum class test_method { score, exact };
// Which comparisons share the error rate: every pair of groups with attempts,
// or each group against the reference group j.
enum class family { all, against };

struct interval_options {
    double level = arguments::default_level;
    interval_method how = interval_method::newcombe;
    adjust::simultaneous adjust = adjust::simultaneous::none;
    family comparisons = family::all;
};

struct test_options {
    test_method how = test_method::score;
    adjust::p_values adjust = adjust::p_values::none;
    family comparisons = family::all;
};

// The functions of a pair take the groups as counts::with_attempts_at hands
// them back: positions checked once, by the caller.

// invalid_input when a and b are the same group (i = j).
void distinct(const group& a, const group& b);

// The groups at positions i and j of the tally, both with attempts and
// distinct: the checks of every frequentist function of a pair, made once.
struct two_groups {
    const group& a;
    const group& b;
};
two_groups pair_at(const counts& c, double i, double j);

// Observed rate_a - rate_b (a and b distinct).
double difference(const group& a, const group& b);

// ---- two groups, no family ----
interval difference_interval(const group& a, const group& b, double level, interval_method how);
double same_rate_p(const group& a, const group& b, test_method how);

// ---- within the family of comparisons of the tally ----
// How many comparisons the family holds (at least 1).
std::size_t family_size(const counts& c, family f);
// Interval for rate_a - rate_b, simultaneous over the family of the tally c
// when asked.
interval difference_interval(const counts& c, const group& a, const group& b, const interval_options& o);

// Raw p of every pair of groups with attempts, in the order (1,2), (1,3), ...,
// (2,3), ... of their positions; cached by exact inputs.
using p_cache = lru_cache<std::pair<std::vector<std::pair<std::int64_t, std::int64_t>>, test_method>,
                          std::vector<double>>;
std::vector<double> all_pairs_p(const counts& c, test_method how, p_cache* cache = nullptr);
// p for rate_a = rate_b, adjusted over the family of the tally c when asked.
double same_rate_p(const counts& c, const group& a, const group& b, const test_options& o, p_cache* cache = nullptr);

// ---- RATES.PAIRS: every pair at once ----
struct table_options {
    double level = arguments::default_level;
    interval_method how = interval_method::newcombe;
    adjust::simultaneous intervals = adjust::simultaneous::none;  // over all pairs
    adjust::p_values p = adjust::p_values::holm;                   // score-test p, over all pairs
};
struct pair_row {
    std::size_t i = 0, j = 0;  // positions, i < j
    double difference = 0;     // rate_i - rate_j
    interval bounds;
    double p = 1, p_adjusted = 1;
};
// One row per pair of groups with attempts, in the order of all_pairs_p;
// every number is what the single-cell functions give for that pair (the
// same calls), so a table and the cells beside it agree to the last bit.
std::vector<pair_row> pairs_table(const counts& c, const table_options& o, p_cache* cache = nullptr);
// The table's header: seven column titles for a table of `pairs` rows, the
// interval columns saying their level ("95 % each" or "95 % jointly,
// Bonferroni"), the last the adjustment asked for.
std::vector<std::string> pairs_header(const table_options& o, std::size_t pairs, std::string_view adjust_word);

}  // namespace tallyrates::pairwise
