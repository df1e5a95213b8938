// tarone.hpp - do the groups vary more than counting alone explains?
//
// Tarone's (1979, Biometrika 66:585) score test for variation between groups
// beyond the binomial: Z = [sum (x_i - n_i phat)^2 / (phat qhat) - sum n_i] /
// sqrt(2 sum n_i (n_i - 1)), one-sided p = 1 - Phi(Z); more powerful than the
// chi-square test of one shared rate when there are many small groups.
// RATES.SAME.P(...; "tarone") gives its p; RATES.APART cautions with it.
#pragma once

#include <cstdint>
#include <span>

#include "tallyrates/core/counts.hpp"

namespace tallyrates::omnibus {

struct extra_variation {
    double z = 0;
    double p = 1;
};

// Over groups with attempts (x_i of n_i); invalid_input when it is not
// defined (every group of one attempt, every unit a success or none, fewer
// than two groups).
extra_variation tarone(std::span<const std::int64_t> x, std::span<const std::int64_t> n);
extra_variation tarone(const counts& c);

}  // namespace tallyrates::omnibus
