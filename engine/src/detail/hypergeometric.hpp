// hypergeometric.hpp (detail) - the conditional law of one group's successes when the
// margins of the 2 x G table are fixed: drawing `draws` items from a
// population of `population` of which `marked` are successes.
//
// Probabilities come from the ratio recurrence
//   P(x+1) / P(x) = (K - x)(n - x) / ((x + 1)(M - K - n + x + 1))
// run outwards from the mode and normalised by their sum (only + - * /: the
// values are the same on every IEEE machine, which the Monte Carlo route
// relies on for reproducibility). Relative error grows like (steps) * eps,
// about 1e-13 at n = 500.
#pragma once

#include <algorithm>
#include <cstdint>
#include <vector>

namespace tallyrates::detail {

struct hypergeometric_support {
    std::int64_t first = 0;  // smallest x with a stored probability
    std::int64_t last = 0;   // largest
};

// The successes that `draws` of `population` items can hold when `marked` of
// them are successes: [max(0, draws - (population - marked)), min(draws,
// marked)]. The same range is the feasible successes after `draws` attempts
// of a table with `population` attempts and `marked` successes in all, which
// is how the exact network and the Monte Carlo sampler use it.
inline hypergeometric_support feasible_successes(std::int64_t population, std::int64_t marked, std::int64_t draws) {
    return {std::max<std::int64_t>(0, draws - (population - marked)), std::min(draws, marked)};
}

// Fills `pmf` with P(first), ..., P(last) normalised to sum 1. With trim > 0,
// values below trim * P(mode) are left out at both ends (their total is below
// trim * (n + 1) relative to the mode). Returns the range actually stored.
// The Monte Carlo sampler's cumulative tables leave out values below this
// share of the mode: the mass left out stays below the 2^-53 resolution of
// its uniforms (tested), so no draw that matters changes.
inline constexpr double sampler_trim = 1e-20;

hypergeometric_support hypergeometric_pmf(std::int64_t population, std::int64_t marked, std::int64_t draws,
                                          std::vector<double>& pmf, double trim = 0.0);

}  // namespace tallyrates::detail
