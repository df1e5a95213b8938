// table.hpp - the 2 x G table of the groups with attempts, its expected
// counts and the observed statistics: Pearson X^2 and likelihood-ratio G^2
// with G - 1 degrees of freedom (Agresti 2002, Categorical Data Analysis,
// sections 1.5 and 3.2), or the table's probability under one shared rate
// (Freeman & Halton 1951).
//
// Groups with no attempts carry no information about a shared rate and are
// left out; at least two groups with attempts are needed.
#pragma once

#include <cstdint>
#include <vector>

#include "tallyrates/core/counts.hpp"

namespace tallyrates::omnibus {

// The statistic that orders tables from least to most extreme.
enum class ordering { pearson, lr, probability };
// RATES.SAME.STAT gives Pearson's X^2 unless asked for G^2.
inline constexpr ordering default_statistic = ordering::pearson;

// The groups with attempts, as the table the tests work on.
struct table {
    std::vector<std::int64_t> x;  // successes per group
    std::vector<std::int64_t> n;  // attempts per group
    std::vector<std::size_t> position;  // each group's 1-based position in the range
    std::int64_t successes = 0;
    std::int64_t attempts = 0;
    std::size_t groups() const { return n.size(); }
    // No attempt or every attempt succeeded: every group shows the same rate,
    // only one table has these margins, and p = 1 by every route.
    bool all_alike() const { return successes == 0 || successes == attempts; }
};
// invalid_input unless at least two groups have attempts.
table table_of(const counts& c);

// The chi-square approximation is trusted when every expected count is at
// least this (Cochran 1954, Biometrics 10:417; common practice).
inline constexpr double min_expected_count = 5;

struct expected_summary {
    double smallest = 0;           // smallest expected count over the 2 x G cells
    std::size_t smallest_position = 0;  // the group it belongs to (position in the range)
    bool smallest_is_failures = false;  // expected failures rather than successes
    std::size_t below_five = 0;    // cells with expected count < min_expected_count
    std::size_t cells = 0;         // 2 x G
};
expected_summary expected_counts(const table& t);

// The observed statistic: X^2, G^2, or for ordering::probability the
// probability of the observed table under the hypothesis of one shared rate.
double statistic(const table& t, ordering o);

}  // namespace tallyrates::omnibus
