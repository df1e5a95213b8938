// one_rate.hpp - confidence bounds for one success rate: the two ends of an
// interval, or each end alone as a one-sided bound (sides "one": the end of
// the two-sided interval at 2 level - 1, so its one tail is 1 - level; for
// Clopper-Pearson the Beta(x, n - x + 1) quantile at 1 - level, the claim of
// a zero-failure demonstration, methods.md).
//
// Methods (Brown, Cai & DasGupta 2001, Stat Sci 16:101, compare them):
// - wilson: the score interval (Wilson 1927, JASA 22:209);
// - clopper_pearson: Clopper & Pearson (1934, Biometrika 26:404), Boost.Math's
//   binomial bounds;
// - jeffreys: equal-tailed Beta(x + 1/2, n - x + 1/2) quantiles, Boost.Math's
//   bounds, with the lower bound 0 at x = 0 and the upper bound 1 at x = n
//   (Brown, Cai & DasGupta 2001, section 4.1.2; Boost does the same);
// - agresti_coull: the Wilson centre with a Wald-type width (Agresti & Coull
//   1998, Am Stat 52:119), the z^2 form, clipped to [0, 1].
#pragma once

#include <cstdint>

#include "tallyrates/core/counts.hpp"
#include "tallyrates/core/interval.hpp"
#include "tallyrates/core/rules.hpp"

namespace tallyrates::one_rate {

enum class method { wilson, clopper_pearson, jeffreys, agresti_coull };
// Wilson's interval holds its level well at every count (Brown, Cai &
// DasGupta 2001), so it is the default.
inline constexpr method default_method = method::wilson;

// The z of a two-sided interval at `level` (1.96 at 0.95).
double two_sided_z(double level);

// Interval for x successes in n >= 1 attempts at `level` in (0, 1).
interval bounds(std::int64_t x, std::int64_t n, double level, method how);
// The same formulas at a real count 0 <= x <= n (planning searches between
// whole counts).
interval bounds_at(double x, double n, double level, method how);

// Bounds for a group of a tally (counts::with_attempts_at); `level` is
// checked (arguments::interval_level).
interval bounds(const group& g, double level, method how, sides s = default_sides);

}  // namespace tallyrates::one_rate
