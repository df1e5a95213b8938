// pairwise.hpp - comparisons of two groups: the difference of their rates,
// intervals for it, tests of "same rate", and the family of all such
// comparisons with multiplicity control (adjust.hpp).
//
// Intervals for rate_i - rate_j (Newcombe 1998, Stat Med 17:873, compares
// them; Fagerland, Lydersen & Laake 2015, SMMR 24:224, recommend the first
// two):
// - miettinen_nurminen (the default): Miettinen & Nurminen (1985, Stat Med
//   4:213), inverting the score statistic with the restricted maximum
//   likelihood estimate in the closed form of Farrington & Manning (1990,
//   Stat Med 9:1447) and the variance factor N/(N - 1); the bounds are found
//   by bisection (Boost.Math);
// - newcombe: the hybrid score interval, Newcombe's method 10, built from the
//   two Wilson intervals;
// - agresti_caffo: one success and one failure added to each group (Agresti &
//   Caffo 2000, Am Stat 54:280), clipped to [-1, 1];
// - wald: the textbook normal approximation, for comparison only (it collapses
//   to zero width at 0 % and 100 %), clipped to [-1, 1].
// Tests of rate_i = rate_j, two-sided:
// - score: the Miettinen-Nurminen score statistic at difference 0, which is
//   Pearson's chi-square on the 2 x 2 table times (N - 1)/N (the "N - 1"
//   chi-square; Campbell 2007, Stat Med 26:3661, recommends it for 2 x 2
//   tables). It is the test the default interval inverts, so the interval at
//   level excludes 0 exactly when p < 1 - level;
// - exact: Fisher's conditional test, summing the tables no more probable than
//   the observed one (relative tie tolerance 1e-7, methods.md).
//
// One error control for the whole pairs family: Bonferroni over every pair of
// groups with attempts, for the intervals (each at 1 - (1 - level)/m) and the
// p-values (m p) alike. With the default interval and test, an interval
// clear of 0 and an adjusted p below 1 - level are then the same statement
// (Bonferroni 1936; Miller 1981, Simultaneous Statistical Inference, for
// intervals and tests that agree), so no two default cells of a sheet
// contradict each other; Holm's p-values are smaller, but no interval goes
// with them.
#pragma once

#include <cstdint>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/cache.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/rules.hpp"
#include "tallyrates/pairs/adjust.hpp"
#include "tallyrates/pairs/one_rate.hpp"

namespace tallyrates::pairwise {

enum class interval_method { newcombe, miettinen_nurminen, agresti_caffo, wald };
enum class test_method { score, exact };
inline constexpr interval_method default_interval_method = interval_method::miettinen_nurminen;
inline constexpr test_method default_test_method = test_method::score;
inline constexpr adjust::simultaneous default_simultaneous = adjust::simultaneous::bonferroni;
inline constexpr adjust::p_values default_p_adjust = adjust::p_values::bonferroni;
// Which comparisons share the error rate: every pair of groups with attempts,
// or each group against the reference group j.
enum class family { all, against };

struct interval_options {
    double level = arguments::default_level;
    interval_method how = default_interval_method;
    adjust::simultaneous adjust = default_simultaneous;
    family comparisons = family::all;
    sides side = default_sides;
};

struct test_options {
    test_method how = default_test_method;
    adjust::p_values adjust = default_p_adjust;
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
    interval_method how = default_interval_method;
    adjust::simultaneous intervals = default_simultaneous;  // over all pairs
    adjust::p_values p = default_p_adjust;                  // score-test p, over all pairs
    goal better = default_goal;                             // the verdict's words
};
struct pair_row {
    std::size_t i = 0, j = 0;  // positions, i < j
    double difference = 0;     // rate_i - rate_j
    interval bounds;
    double p = 1, p_adjusted = 1;
    // +1 when rate_i is called higher, -1 when rate_j is, 0 for no clear
    // difference: called only when the interval is clear of 0 on that side
    // and the adjusted p is below 1 - level, so the words never go beyond
    // either column.
    int called = 0;
};
// One row per pair of groups with attempts, in the order of all_pairs_p;
// every number is what the single-cell functions give for that pair (the
// same calls), so a table and the cells beside it agree to the last bit.
std::vector<pair_row> pairs_table(const counts& c, const table_options& o, p_cache* cache = nullptr);
// The verdict of a row in words: "Oven A higher" (goal high), "Lot 3 fewer
// defects" (goal low), or "no clear difference"; groups without a label are
// "group 4".
std::string verdict(const counts& c, const pair_row& row, goal better);
// The table's header: eight column titles for a table of `pairs` rows, the
// interval columns saying their level ("95 % each" or "95 % jointly,
// Bonferroni"), the p column the adjustment asked for, the verdict column
// the rule it follows.
inline constexpr std::size_t pairs_columns = 8;
std::vector<std::string> pairs_header(const table_options& o, std::size_t pairs, std::string_view adjust_word);

}  // namespace tallyrates::pairwise
