// limits.hpp - decision limits for every group's rate around the whole:
// which groups stand apart from the rest.
//
// Centre: the target rate when one is given (a standard such as the plant
// target), else the tally's overall rate pbar = S / N over the groups with
// attempts.
// - family "each": one group at a time (funnel limits, Spiegelhalter 2005,
//   Stat Med 24:1185; with level 0.9973 and rows read as days, the p-chart);
//   "all": the limits hold for all k groups with attempts at once with
//   probability at least level (analysis of means for proportions: Ott 1967,
//   Industrial Quality Control 24:101; Nelson 1982, Commun Stat A 11:699, for
//   unequal sizes).
// - method "normal": centre +- h sigma_i clipped to [0, 1], sigma_i =
//   sqrt(c (1 - c) / n_i), and for "all" without a target
//   sqrt(pbar qbar (N - n_i) / (N n_i)), the spread of a group's rate about an
//   overall rate that includes it (Nelson 1982); h = z at (1 + level) / 2 for
//   "each", Sidak's z at 1 - (1 - level^(1/k)) / 2 for "all".
// - method "exact": whole counts. With "each" or a target every group's count
//   is binomial(n_i, c); with "all" and no target it follows the hypergeometric
//   law given the margins. A count x is below when P(X <= x) < tail, above when
//   P(X >= x) < tail; the limits are the smallest and largest counts not
//   flagged, divided by n_i. tail = (1 - level) / 2 for "each"; for "all" with
//   a target (independent groups) (1 - level^(1/k)) / 2; for "all" without a
//   target the groups are tied by the margins, and the tail is the largest for
//   which the probability under the multivariate hypergeometric law that any
//   group is flagged is at most 1 - level: a recursion over the groups and
//   their running total (limits.cpp). The tail is never below the Sidak tail
//   of the same marginals, so the limits are never wider than those (a rule
//   of ours: where the margins would ask for more, the Sidak limits are kept).
//   Past a cap on its work, judged before it runs, the Sidak limits of the
//   marginals, and the table says so.
// - spread "time" (method "normal" only): Laney's (2002, Quality Engineering
//   14:531) p'-limits for rows in time order: sigma_i times sigma_z, the mean
//   moving range of z_r = (p_r - c) / sigma_r over consecutive rows divided by
//   1.128 (d2 for ranges of two).
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "tallyrates/core/arguments.hpp"
#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/interval.hpp"

namespace tallyrates::apart {

enum class family { all, each };
enum class method { exact, normal };
enum class spread { none, time };

struct options {
    double level = arguments::default_level;
    family together = family::all;
    std::optional<double> target;  // a standard rate; none: the tally's own
    method how = method::exact;
    spread variation = spread::none;
};

// Work of the exact simultaneous recursion (running totals x counts per
// group, summed over the search) beyond which the Sidak limits of the
// marginals are used instead: about 0.2 s.
inline constexpr double max_exact_work = 4e8;

struct group_limits {
    std::size_t position = 0;
    std::int64_t successes = 0, attempts = 0;
    double rate = 0;
    interval limits;
    int verdict = 0;  // -1 below, 0 within, +1 above
};

struct result {
    double centre = 0;
    double tail = 0;          // exact: the tail each group is judged at; normal: 0
    double multiplier = 0;    // normal: h (with the spread factor); exact: 0
    double spread_factor = 1; // Laney's sigma_z, 1 without "time"
    bool fell_back = false;   // exact "all" past its cap: Sidak limits of the marginals
    std::vector<group_limits> rows;  // one per group with attempts, in range order
};

// The limits of every group with attempts; invalid_input for a tally the
// limits do not apply to (fewer than two groups with attempts and no target,
// every unit a success or none, a target outside [0, 1], "exact" with
// "time").
result limits(const counts& c, const options& o);

// The verdict in words: "above", "below" or "within".
std::string verdict_word(int verdict);

// RATES.APART: a header row, one row per position of the range (blank rows
// blank; a group without attempts named, with "no attempts"), then notes: the
// fallback to Sidak limits, and a caution when the groups vary more than
// counting explains (Tarone's test, omnibus/tarone.hpp, p below 0.05 with 10 or more
// groups). Every row has table_columns cells; "" is a blank cell.
using table_cell = std::variant<double, std::string>;
inline constexpr std::size_t table_columns = 6;
// Groups from which the caution about extra variation is given.
inline constexpr std::size_t min_groups_caution = 10;
std::vector<std::vector<table_cell>> table(const counts& c, const options& o);

// RATES.APART.CURVE: the one-group limits (family "each") around the target,
// or the tally's overall rate, as smooth curves over group size, for a funnel
// chart with the groups as points: `points` sizes n from the smallest to the
// largest group's attempts, evenly in log n and rounded to whole units, each
// with {n, lower, upper}. Exact binomial limits with Spiegelhalter's (2005,
// Stat Med 24:1185, appendix) interpolation between whole counts: with r the
// smallest count whose P(X <= r) reaches p, the limit is (r - alpha) / n,
// alpha = (P(X <= r) - p) / P(X = r), at p = tail and p = 1 - tail.
inline constexpr std::int64_t default_curve_points = 50, min_curve_points = 2, max_curve_points = 1000;
std::vector<std::array<double, 3>> funnel(const counts& c, double level, std::optional<double> target,
                                          std::int64_t points);
std::vector<std::string> funnel_header(double level, std::optional<double> target);

}  // namespace tallyrates::apart
