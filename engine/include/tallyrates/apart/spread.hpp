// spread.hpp - do the groups vary more than counting alone explains?
//
// Tarone's (1979, Biometrika 66:585) score test for variation between groups
// beyond the binomial: Z = [sum (x_i - n_i phat)^2 / (phat qhat) - sum n_i] /
// sqrt(2 sum n_i (n_i - 1)), one-sided p = 1 - Phi(Z); more powerful than the
// chi-square test of one shared rate when there are many small groups.
#pragma once

#include "tallyrates/core/counts.hpp"

namespace tallyrates::apart {

struct extra_variation {
    double z = 0;
    double p = 1;
};

// Over the groups with attempts; invalid_input when it is not defined (every
// group of one attempt, every unit a success or none, fewer than two groups).
extra_variation tarone(const counts& c);

}  // namespace tallyrates::apart
